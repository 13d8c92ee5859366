"""Notebook friendliness: HTML tables, dicts, pandas frames and plots."""

from __future__ import annotations

import html.parser

import numpy as np
import pytest

import hydrograde as hg


class _Checker(html.parser.HTMLParser):
    """Collects the text and checks the tags of rendered HTML are balanced."""

    VOID = {"br", "hr", "img", "meta"}

    def __init__(self) -> None:
        super().__init__()
        self.stack: list[str] = []
        self.text: list[str] = []

    def handle_starttag(self, tag, attrs):
        if tag not in self.VOID:
            self.stack.append(tag)

    def handle_endtag(self, tag):
        assert self.stack and self.stack[-1] == tag, (tag, self.stack)
        self.stack.pop()

    def handle_data(self, data):
        self.text.append(data)


def rendered_text(markup: str) -> str:
    c = _Checker()
    c.feed(markup)
    c.close()
    assert not c.stack, c.stack
    return " ".join(c.text)


def test_friction_renders_as_a_table_with_warnings_and_the_safety_note():
    fr = hg.friction(3000.0, 1e-4)
    text = rendered_text(fr._repr_html_())
    assert "Friction" in text and "transitional" in text
    assert "competent engineer" in text
    assert f"{fr.f:.4g}" in text  # four significant figures


def test_to_dict_round_trips_the_fields():
    fr = hg.friction(1e5, 1e-4)
    d = fr.to_dict()
    assert d == {
        "f": fr.f, "df_dre": fr.df_dre, "df_drel_roughness": fr.df_drel_roughness,
        "regime": "turbulent", "warnings": [],
    }


def test_to_dataframe():
    pd = pytest.importorskip("pandas")
    df = hg.friction(1e5, 1e-4).to_dataframe()
    assert isinstance(df, pd.DataFrame)
    assert df.loc[0, "f"] == hg.darcy_factor(1e5, 1e-4)


def test_friction_chart_plots_the_core_values():
    pytest.importorskip("matplotlib")
    import matplotlib

    matplotlib.use("Agg")
    from hydrograde import plotting

    ax = plotting.friction_chart(rel_roughness=[0.0, 1e-3, 1e-2], re=np.logspace(3, 7, 50))
    lines = ax.get_lines()
    assert len(lines) == 3
    x, y = lines[1].get_data()
    assert np.array_equal(y, hg.darcy_factor(x, 1e-3))
    assert ax.get_xscale() == "log" and ax.get_yscale() == "log"
    assert "Re" in ax.get_xlabel()
    import matplotlib.pyplot as plt

    plt.close(ax.figure)


def test_every_class_renders_and_has_a_readable_repr():
    water = hg.Fluid.water(288.15)
    line = hg.Line([hg.Pipe(0.1, 50.0, 4.5e-5), hg.Fitting.k(0.9), hg.Rise(3.0)])
    pump = hg.PumpCurve([0.0, 0.02, 0.04], [40.0, 35.0, 10.0])
    result = line.evaluate(water, 0.01)
    renderable = [
        hg.friction(1e5, 1e-4), water, hg.Section.rectangle(0.3, 0.1), hg.Fitting.k(0.9),
        hg.Pipe(0.1, 50.0, 4.5e-5), line, result, result.head_loss_band,
        line.flow_for_head(water, 10.0), line.operating_point(water, pump),
    ]
    for obj in renderable:
        text = rendered_text(obj._repr_html_())
        assert type(obj).__name__ in text and "competent engineer" in text
        assert obj.to_dict()
        assert repr(obj).startswith(type(obj).__name__)
    assert "band (95 %)" in result._repr_html_()
