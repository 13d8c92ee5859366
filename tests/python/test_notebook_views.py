"""Every notebook view rendered in headless Chromium at a 1000 px wide window.

The test fails when a view needs horizontal scrolling at that width, shows "None" or
"nan", or lacks the safety caution; it writes one PNG per view to docs/img/views/ (README
shows some of them). The scenario is an invented hot-water line shown in L/s, kPa and mm.
"""

from __future__ import annotations

import html
import json
import re
import shutil
import subprocess
import tempfile
from pathlib import Path

import pytest

import hydrograde as hg

REPO = Path(__file__).resolve().parents[2]
OUT = REPO / "docs" / "img" / "views"
WIDTH = 1000
CHROMIUM = shutil.which("chromium") or shutil.which("chromium-browser")
FLAGS = [
    "--headless", "--no-sandbox", "--disable-gpu", "--disable-background-networking",
    "--disable-component-update", "--disable-sync", "--no-first-run", "--hide-scrollbars",
]


def scenario() -> dict:
    """An invented heating-water circuit: 60 °C water from a header tank through a
    DN50 steel run with elbows, a strainer, a globe valve and a 6 m rise."""
    water = hg.Fluid.water(333.15, 2.5e5)
    bore = hg.pipe_size("steel", "2", "40")["inside_diameter"]
    line = hg.Line([
        hg.Fitting.from_tank(),
        hg.Pipe.of_material(bore, 18.0, "commercial_steel"),
        hg.Fitting.named("elbow_90_long_radius"),
        hg.Fitting.named("y_strainer"),
        hg.Pipe.of_material(bore, 24.0, "commercial_steel"),
        hg.Fitting.named("elbow_90_long_radius"),
        hg.Fitting.named("globe_valve"),
        hg.Rise(6.0),
        hg.Pipe.of_material(bore, 12.5, "commercial_steel"),
        hg.Fitting.into_tank(),
    ], inlet_pressure=2.5e5)
    pump = hg.PumpCurve([0.0, 0.002, 0.004, 0.006, 0.008], [26.0, 25.2, 23.0, 19.0, 13.0])
    result = line.evaluate(water, 0.0045)
    # The heating circuit's header tank feeds a small loop of three radiator branches.
    network = hg.Network()
    network.fixed_head("header_tank", head=24.0, x=0.0, y=0.0)
    for name, z, q, x in [("riser_foot", 0.0, 0.0, 10.0), ("east_branch", 3.0, 0.0015, 30.0),
                          ("west_branch", 3.0, 0.0012, 30.0), ("far_end", 6.0, 0.001, 50.0)]:
        network.node(name, elevation=z, outflow=q, x=x, y=-10.0 if name == "west_branch" else 0.0)
    for name, u, v, d, length in [("riser", "header_tank", "riser_foot", bore, 12.0),
                                  ("east", "riser_foot", "east_branch", 0.0409, 20.0),
                                  ("west", "riser_foot", "west_branch", 0.0409, 22.0),
                                  ("east_far", "east_branch", "far_end", 0.0266, 20.0),
                                  ("west_far", "west_branch", "far_end", 0.0266, 24.0)]:
        network.link(name, u, v, hg.Line([hg.Pipe.of_material(d, length, "commercial_steel")]))
    branch_b = hg.Line([hg.Pipe.of_material(0.0409, 30.0, "commercial_steel"),
                        hg.Fitting.named("ball_valve"), hg.Rise(6.0)])
    return {
        "LineResult": result,
        "ElementResult": result.elements[1],
        "Band": result.required_head_band,
        "PumpCurve": pump,
        "Line": line,
        "Split": hg.split_flow([line, branch_b], water, 0.008),
        "Sizing": line.size(water, 0.0045, max_velocity=1.5, table="steel", schedule="40"),
        "OperatingPoint": line.operating_point(water, pump),
        "FlowSolution": line.flow_for_head(water, 12.0),
        "Fluid": water,
        "Pipe": line.elements[1],
        "Fitting": line.elements[2],
        "Section": hg.Section.rectangle(0.4, 0.25),
        "Friction": hg.friction(3000.0, 1e-4),
        "MonteCarlo": hg.monte_carlo(line, water, 0.0045, samples=2000, seed=7),
        "Uncertainty": line.uncertainty,
        "Network": network,
        "NetworkSolution": network.solve(water),
    }


@pytest.fixture(scope="module")
def views() -> dict:
    with hg.display(flow="L/s", pressure="kPa", length="mm", head="m"):
        return {name: obj._repr_html_() for name, obj in scenario().items()}


def visible_text(markup: str) -> str:
    markup = re.sub(r"<style>.*?</style>", " ", markup, flags=re.S).replace("<wbr>", "")
    return html.unescape(re.sub(r"<[^>]+>", " ", markup))


def test_views_show_no_none_or_nan_and_carry_the_caution(views):
    for name, markup in views.items():
        text = visible_text(markup)
        assert not re.search(r"\bNone\b|\bnan\b|\binf\b", text, re.I), (name, text)
        assert "licensed or registered where the law requires it" in text, name


def test_views_use_the_display_units(views):
    text = visible_text(views["LineResult"])
    assert "[L/s]" in text or "L/s" in text
    assert "kPa" in text
    # 0.0045 m³/s is 4.5 L/s (definition of the litre).
    assert re.search(r"\b4\.5\b", text)
    assert "mm" in visible_text(views["Line"])
    # The elbow's and the pipe's rows carry their index and label.
    assert "elbow_90_long_radius" in text and "globe_valve" in text


PAGE = """<!doctype html><html><head><meta charset="utf-8"><style>
body{{margin:8px;background:#fff}}</style></head><body>{views}
<pre id="measure"></pre><script>
const out = [];
document.querySelectorAll("section").forEach(s => {{
  const boxes = [...s.querySelectorAll(".hg-box")].map(b => [b.scrollWidth, b.clientWidth]);
  out.push({{name: s.id, width: s.scrollWidth, height: s.offsetHeight, boxes}});
}});
out.push({{name: "page", width: document.documentElement.scrollWidth, height: 0, boxes: []}});
document.getElementById("measure").textContent = JSON.stringify(out);
</script></body></html>"""


def chromium(args: list[str], profile: str) -> str:
    cmd = [CHROMIUM, *FLAGS, f"--user-data-dir={profile}", *args]
    done = subprocess.run(cmd, capture_output=True, text=True, timeout=120)
    assert done.returncode == 0, done.stderr[-2000:]
    return done.stdout


@pytest.mark.skipif(CHROMIUM is None, reason="Debian package chromium is not installed")
def test_views_fit_a_1000px_notebook_and_are_screenshotted(views, tmp_path):
    sections = "".join(f"<section id='{n}'>{m}</section><hr>" for n, m in views.items())
    page = tmp_path / "views.html"
    page.write_text(PAGE.format(views=sections), encoding="utf-8")
    with tempfile.TemporaryDirectory() as profile:
        dom = chromium([f"--window-size={WIDTH},900", "--dump-dom", page.as_uri()], profile)
        found = re.search(r'<pre id="measure">(.*?)</pre>', dom, re.S)
        assert found, dom[-2000:]
        measured = json.loads(html.unescape(found.group(1)))
        too_wide = [m for m in measured if m["width"] > WIDTH]
        scrolling = [m for m in measured for w, c in m["boxes"] if w > c + 1]
        assert not too_wide, too_wide
        assert not scrolling, scrolling
        OUT.mkdir(parents=True, exist_ok=True)
        for m in measured:
            if m["name"] == "page":
                continue
            single = tmp_path / f"{m['name']}.html"
            single.write_text(
                "<!doctype html><html><head><meta charset='utf-8'><style>body{margin:8px;"
                "background:#fff}</style></head><body>" + views[m["name"]] + "</body></html>",
                encoding="utf-8",
            )
            png = OUT / f"{m['name']}.png"
            chromium([f"--window-size={WIDTH},{m['height'] + 20}",
                      f"--screenshot={png}", single.as_uri()], profile)
            assert png.stat().st_size > 1000
