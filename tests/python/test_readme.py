"""Every ```python block of README.md runs as a test (in order, one namespace per block)."""

from __future__ import annotations

import re
from pathlib import Path

import pytest

README = Path(__file__).resolve().parents[2] / "README.md"
BLOCK = re.compile(r"^```python[ \t]*\n(.*?)^```[ \t]*$", re.S | re.M)


def python_blocks() -> list[str]:
    return BLOCK.findall(README.read_text(encoding="utf-8")) if README.exists() else []


def test_readme_has_python_examples():
    assert python_blocks(), f"no ```python blocks in {README}"


@pytest.mark.parametrize("index", range(len(python_blocks())))
def test_readme_python_example_runs(index):
    code = python_blocks()[index]
    exec(compile(code, f"README.md[python block {index + 1}]", "exec"), {"__name__": "__readme__"})
