"""Building lines from Python: labels, counted fittings, slicing, joining and shares."""

from __future__ import annotations

import math
import pickle

import pytest

import hydrograde as hg

G0 = 9.80665  # standard gravity, exact (3rd CGPM 1901; NIST SP 811)
D = 0.05


def flow_at(v: float, d: float = D) -> float:
    """The flow (m³/s) that runs at v m/s in a bore of d m."""
    return v * math.pi * d * d / 4.0


@pytest.fixture()
def water():
    return hg.Fluid(998.0, 1.0e-3)


def test_six_counted_elbows_lose_six_times_k(water):
    line = hg.Line([hg.Pipe(D, 10.0, 4.5e-5), hg.Fitting.k(0.3, count=6)])
    row = line.evaluate(water, flow_at(2.0)).elements[1]
    # 6 · 0.3 · (2 m/s)² / (2 g): exact from the definition of K.
    assert row.head_loss == pytest.approx(6 * 0.3 * 2.0**2 / (2 * G0), rel=1e-12)
    assert row.count == 6
    assert row.label == "6 × fitting 1"
    assert len(line) == 2


def test_a_counted_fitting_is_one_shared_error(water):
    q = flow_at(2.0)

    def width(n: int) -> float:
        line = hg.Line([hg.Pipe(D, 10.0, 4.5e-5), hg.Fitting.k(0.3, count=n)])
        b = line.evaluate(water, q).elements[1].head_loss_band
        return b.high - b.low

    # One error shared by N fittings: N times the band of one (first-order propagation
    # is linear, JCGM 100:2008 §5.1; exact).
    assert width(6) == pytest.approx(6 * width(1), rel=1e-12)


def test_labels_on_every_element_reach_the_rows(water):
    line = hg.Line([
        hg.Pipe(D, 10.0, 4.5e-5, label="suction"),
        hg.Fitting.named("gate_valve", label="isolation"),
        hg.Rise(3.0, label="up to the roof"),
        hg.Equipment.pressure_drop("strainer", 2000.0, 0.003, label="Y-strainer"),
        hg.Pipe.of_material(D, 20.0, "commercial_steel"),
        hg.Fitting.into_tank(),
    ])
    assert line.labels == [
        "suction", "isolation", "up to the roof", "Y-strainer", "pipe 4", "into_tank 5"
    ]
    rows = [e.label for e in line.evaluate(water, 0.003).elements]
    assert rows == line.labels
    assert [e.label for e in line][:3] == ["suction", "isolation", "up to the roof"]
    assert line[4].label is None
    assert "label=" in repr(line[0])


def test_bad_labels_and_counts_name_the_parameter():
    with pytest.raises(hg.OutOfRangeError, match=r"^count = 0"):
        hg.Fitting.k(0.3, count=0)
    with pytest.raises(hg.OutOfRangeError, match=r"^count = -2"):
        hg.Fitting.named("gate_valve", count=-2)
    for bad in ["", "  ", "two\nlines", "x" * 121]:
        with pytest.raises(hg.InvalidInputError, match=r"^label: "):
            hg.Pipe(D, 1.0, 0.0, label=bad)
    with pytest.raises(hg.InvalidInputError, match=r"^label: "):
        hg.Rise(1.0, label="")


def test_slicing_joining_and_iterating(water):
    line = hg.Line([
        hg.Pipe(D, 10.0, 4.5e-5),
        hg.Fitting.named("gate_valve", label="isolation"),
        hg.Pipe(D, 30.0, 4.5e-5),
        hg.Fitting.k(0.3, count=4),
        hg.Rise(6.0),
    ])
    head, tail = line[:2], line[2:]
    assert (len(head), len(tail)) == (2, 3)
    assert tail.labels == ["pipe 0", "4 × fitting 1", "rise 2"]
    assert head.labels[1] == "isolation"
    joined = head + tail
    assert joined == line
    q = 0.003
    parts = head.evaluate(water, q).required_head + tail.evaluate(water, q).required_head
    # The same rows summed in another grouping: equal to rounding.
    assert line.evaluate(water, q).required_head == pytest.approx(parts, rel=1e-12)
    assert [type(e).__name__ for e in line] == ["Pipe", "Fitting", "Pipe", "Fitting", "Rise"]
    assert line[-1].height == 6.0
    assert line[3].count == 4
    assert line[-3:][1].count == 4
    with pytest.raises(hg.InvalidInputError, match=r"^slice: "):
        line[2:2]
    with pytest.raises(hg.InvalidInputError, match=r"^slice: "):
        line[3:1]
    with pytest.raises(hg.OutOfRangeError, match=r"^step = 2"):
        line[::2]
    with pytest.raises(IndexError, match="index = 9"):
        line[9]
    other = hg.Line([hg.Pipe(D, 1.0, 0.0)], uncertainty="none")
    with pytest.raises(hg.InvalidInputError, match=r"^other: "):
        line + other
    with pytest.raises(TypeError):
        line + 1


def test_labels_and_counts_survive_pickling(water):
    f = hg.Fitting.k(0.3, label="bends", count=6)
    assert pickle.loads(pickle.dumps(f)) == f
    plain = hg.Fitting.k(0.3)
    assert pickle.loads(pickle.dumps(plain)) == plain != f
    line = hg.Line([hg.Pipe(D, 10.0, 4.5e-5, label="run"), f])
    back = pickle.loads(pickle.dumps(line))
    assert back == line and back.labels == ["run", "6 × bends"]


def test_shares_by_element_kind_and_source(water):
    # Two fixed-K fittings on one bore, K = 1 and 3, each its own ±30 % source and no
    # other source: loss shares 1/4, 3/4 (exact from the definition of K); variance
    # shares 1²/(1² + 3²) and 3²/(1² + 3²) (independent errors ∝ K, JCGM 100:2008 §5.1.2).
    line = hg.Line([
        hg.Fitting.k(1.0, D),
        hg.Rise(2.0),
        hg.Fitting.k(3.0, D, label="control valve"),
    ])
    r = line.evaluate(water, flow_at(2.0))
    rows = r.shares()
    if not isinstance(rows, list):  # a DataFrame when pandas is installed
        rows = rows.to_dict("records")
    assert [row["name"] for row in rows] == ["fitting 0", "rise 1", "control valve"]
    assert [row["loss_share"] for row in rows] == pytest.approx([0.25, 0.0, 0.75], abs=1e-12)
    assert [row["band_share"] for row in rows] == pytest.approx([0.1, 0.0, 0.9], abs=1e-12)
    kinds = r.shares("kind")
    if not isinstance(kinds, list):
        kinds = kinds.to_dict("records")
    assert [k["kind"] for k in kinds] == ["fitting", "rise"]
    assert kinds[0]["loss_share"] == pytest.approx(1.0, abs=1e-12)
    sources = r.shares(by="source")
    if not isinstance(sources, list):
        sources = sources.to_dict("records")
    assert [s["name"] for s in sources] == ["K of k (element 2)", "K of k (element 0)"]
    assert [s["band_share"] for s in sources] == pytest.approx([0.9, 0.1], abs=1e-12)
    assert r.elements[2].band_share == pytest.approx(0.9, abs=1e-12)
    with pytest.raises(hg.UnknownNameError, match="element, kind, source"):
        r.shares("pipe")
