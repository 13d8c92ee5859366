"""The exception hierarchy mirrors the core's error kinds and carries its messages."""

from __future__ import annotations

import pickle

import numpy as np
import pytest

import hydrograde as hg
from hydrograde import _errors


def test_one_class_per_core_kind_and_no_more():
    # The core's list (ErrorKind::ALL, exported by the native module) against ours:
    # a kind added in Rust without a Python class fails here.
    assert list(_errors.BY_KIND) == hg.ERROR_KINDS
    for kind, cls in _errors.BY_KIND.items():
        assert cls.kind == kind
        assert issubclass(cls, hg.HydrogradeError)


def test_bad_values_are_value_errors():
    for cls in (hg.NotFiniteError, hg.OutOfRangeError, hg.UnknownNameError, hg.InvalidInputError):
        assert issubclass(cls, ValueError)
    assert not issubclass(hg.NoSolutionError, ValueError)
    assert not issubclass(hg.HydrogradeError, ValueError)


def test_messages_and_fields_come_from_the_core():
    with pytest.raises(hg.OutOfRangeError) as info:
        hg.darcy_factor(-3.0, 0.0)
    e = info.value
    # The message format is the core's (core/src/error.rs).
    assert str(e) == "re = -3: must be greater than 0"
    assert (e.kind, e.parameter, e.value, e.index) == ("out_of_range", "re", -3.0, None)
    with pytest.raises(hg.NotFiniteError, match=r"^rel_roughness = NaN: must be a finite number$"):
        hg.darcy_factor(1e5, float("nan"))
    with pytest.raises(hg.UnknownNameError, match="known: colebrook, haaland"):
        hg.darcy_factor(1e5, 0.0, "moody")
    with pytest.raises(hg.UnknownNameError, match="known: blend, turbulent, refuse"):
        hg.darcy_factor(1e5, 0.0, transition="jump")
    with pytest.raises(hg.NoSolutionError, match="transitional"):
        hg.darcy_factor(3000.0, 0.0, transition="refuse")
    with pytest.raises(hg.OutOfRangeError, match="turbulent_limit"):
        hg.darcy_factor(1e5, 0.0, laminar_limit=5000.0)


def test_array_errors_name_the_flat_index():
    re = np.full((2, 3), 1e5)
    re[1, 1] = np.nan
    re[1, 2] = -1.0
    with pytest.raises(hg.NotFiniteError) as info:
        hg.darcy_factor(re, 1e-4)
    assert info.value.index == 4
    assert str(info.value).startswith("element 4: re = NaN")


def test_large_arrays_report_the_first_failure_in_c_order():
    re = np.full(100_000, 1e5)
    re[70_000] = -1.0
    re[99_000] = np.nan
    with pytest.raises(hg.OutOfRangeError) as info:
        hg.darcy_factor(re, 1e-4)
    assert info.value.index == 70_000


def test_shapes_that_do_not_broadcast():
    with pytest.raises(hg.InvalidInputError, match=r"re \(3,\), rel_roughness \(2,\)"):
        hg.darcy_factor([1e4, 1e5, 1e6], [0.0, 1e-3])


@pytest.mark.parametrize(
    "bad",
    ["1e5", np.array(["a"]), np.array([1 + 2j]), True, np.array([True]), None, {"re": 1}, [[1e5], [1e5, 2e5]]],
)
def test_wrong_types_raise_type_error_naming_the_argument(bad):
    with pytest.raises(TypeError, match="^re: "):
        hg.darcy_factor(bad, 1e-4)


def test_exceptions_pickle_with_their_fields():
    with pytest.raises(hg.OutOfRangeError) as info:
        hg.darcy_factor([1e5, 0.0], 0.0)
    back = pickle.loads(pickle.dumps(info.value))
    assert type(back) is hg.OutOfRangeError
    assert (str(back), back.parameter, back.value, back.index) == (
        str(info.value), "re", 0.0, 1)
