"""Executes tests/notebooks/engineer_units.ipynb with nbclient: every cell must run, the
views must render as HTML and the two plots as images."""

from __future__ import annotations

from pathlib import Path

import pytest

nbformat = pytest.importorskip("nbformat")
nbclient = pytest.importorskip("nbclient")

NOTEBOOK = Path(__file__).resolve().parents[1] / "notebooks" / "engineer_units.ipynb"


def test_the_engineer_notebook_runs_and_renders_views_and_plots(tmp_path):
    nb = nbformat.read(NOTEBOOK, as_version=4)
    client = nbclient.NotebookClient(nb, timeout=180, kernel_name="python3",
                                     resources={"metadata": {"path": str(tmp_path)}})
    client.execute()
    html_views = images = 0
    for cell in nb.cells:
        for out in cell.get("outputs", []):
            assert out.get("output_type") != "error", out
            data = out.get("data", {})
            html_views += "text/html" in data
            images += "image/png" in data
            text = data.get("text/html", "")
            assert "None" not in text.replace("NoneType", "")
    assert html_views >= 12
    assert images >= 2
