"""Shared fixtures of the Python suites.

pytest.ini beside this file turns every warning into an error (``filterwarnings = error``).
"""

from __future__ import annotations

import os
from pathlib import Path

import pytest
from hypothesis import HealthCheck, settings

REPO = Path(__file__).resolve().parents[2]

# Deterministic by default so a failure reproduces; CI may raise the example count.
settings.register_profile(
    "hydrograde",
    derandomize=True,
    max_examples=int(os.environ.get("HYPOTHESIS_EXAMPLES", "150")),
    deadline=None,
    suppress_health_check=[HealthCheck.too_slow],
)
settings.load_profile("hydrograde")


@pytest.fixture(scope="session")
def repo() -> Path:
    """The repository root."""
    return REPO
