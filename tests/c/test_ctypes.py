"""Calls the shared library through ctypes with exactly the argument types of the VBA
module's Declare statements (as 64-bit Office passes them), and checks the results against
the Rust core bit for bit (reference file from capi/examples/core_reference.rs).

Environment: HG_LIB = path of libhydrograde.so, HG_REFERENCE = path of the reference file.
"""

from __future__ import annotations

import ctypes
import math
import os
import struct
import sys
from pathlib import Path

import pytest

sys.path.insert(0, str(Path(__file__).parent))
from vba_decl import parse_vba  # noqa: E402

# VBA type -> ctypes type, for ByVal arguments and return values on 64-bit Office.
BYVAL = {
    "Double": ctypes.c_double,
    "Long": ctypes.c_int32,
    "LongLong": ctypes.c_int64,
    "LongPtr": ctypes.c_ssize_t,  # VBA's LongPtr is a signed pointer-sized integer
    "String": ctypes.c_char_p,  # VBA converts a String argument to an ANSI char *
}
BYREF = {
    "Double": ctypes.POINTER(ctypes.c_double),
    "Long": ctypes.POINTER(ctypes.c_int32),
    "LongPtr": ctypes.POINTER(ctypes.c_ssize_t),
}


@pytest.fixture(scope="module")
def vba():
    lib = ctypes.CDLL(os.environ["HG_LIB"])
    funcs = {}
    for d in parse_vba():
        fn = getattr(lib, d.name)
        fn.argtypes = [BYVAL[t] if bv == "ByVal" else BYREF[t] for bv, _, t in d.params]
        fn.restype = BYVAL[d.ret] if d.ret else None
        funcs[d.name] = fn
    return funcs


def unhex(s: str) -> float:
    return struct.unpack(">d", bytes.fromhex(s))[0]


def bits(x: float) -> int:
    return struct.unpack(">Q", struct.pack(">d", x))[0]


@pytest.fixture(scope="module")
def reference():
    rows = {}
    for line in Path(os.environ["HG_REFERENCE"]).read_text().splitlines():
        parts = line.split()
        rows.setdefault(parts[0], []).append(parts[1:])
    return rows


def last_error(vba) -> str:
    n = vba["hg_last_error"](None, 0)
    buf = ctypes.create_string_buffer(n + 1)
    assert vba["hg_last_error"](buf, n + 1) == n
    return buf.value.decode()


def cstr(p: int) -> str | None:
    return None if p == 0 else ctypes.string_at(p).decode()


def test_every_declaration_resolves(vba):
    assert len(vba) == len(parse_vba()) >= 20


def test_version_and_names(vba):
    cargo = (Path(__file__).resolve().parents[2] / "Cargo.toml").read_text()
    version = next(l.split('"')[1] for l in cargo.splitlines() if l.startswith("version ="))
    assert cstr(vba["hg_version"]()) == version
    meta = (Path(__file__).resolve().parents[2] / "capi" / "src" / "meta.rs").read_text()
    abi = next(l for l in meta.splitlines() if l.startswith("pub const HG_ABI_VERSION"))
    assert vba["hg_abi_version"]() == int(abi.split("=")[1].strip(" ;"))
    assert cstr(vba["hg_status_name"](11)) == "HG_ERR_OUT_OF_RANGE"
    assert cstr(vba["hg_warning_name"](4)) == "transitional_flow"
    assert cstr(vba["hg_regime_name"](2)) == "turbulent"
    assert cstr(vba["hg_correlation_name"](2)) == "swamee_jain"
    c = ctypes.c_int32(-1)
    assert vba["hg_correlation_from_name"](b"churchill", ctypes.byref(c)) == 0
    assert c.value == 3


def test_friction_equals_the_core_bit_for_bit(vba, reference):
    f, d1, d2 = ctypes.c_double(), ctypes.c_double(), ctypes.c_double()
    rg, w = ctypes.c_int32(), ctypes.c_int32()
    n = 0
    for corr, re, rr, ff, dre, drr, regime, warn in reference["darcy"]:
        args = (unhex(re), unhex(rr), int(corr))
        assert vba["hg_darcy_factor"](*args, ctypes.byref(f)) == 0
        assert bits(f.value) == int(ff, 16)
        s = vba["hg_darcy_factor_full"](*args, *(ctypes.byref(x) for x in (f, d1, d2, rg, w)))
        assert s == 0
        assert (bits(f.value), bits(d1.value), bits(d2.value)) == (
            int(ff, 16), int(dre, 16), int(drr, 16))
        assert (rg.value, w.value) == (int(regime), int(warn))
        n += 1
    assert n > 5000


def test_errors_give_codes_and_messages(vba, reference):
    codes = {"not_finite": 10, "out_of_range": 11, "unknown_name": 12, "invalid": 13,
             "no_solution": 20}
    f = ctypes.c_double(7.0)
    for corr, re, rr, kind in reference["darcy_err"]:
        assert vba["hg_darcy_factor"](unhex(re), unhex(rr), int(corr), ctypes.byref(f)) == codes[kind]
        assert f.value == 7.0
        assert last_error(vba)
    for bad in (math.nan, math.inf, -math.inf, -1.0, 0.0):
        assert vba["hg_darcy_factor"](bad, 0.0, 0, ctypes.byref(f)) != 0
        assert last_error(vba).startswith("re = ")
    assert vba["hg_darcy_factor"](1e5, 0.0, 0, None) == 30
    c = ctypes.c_int32()
    assert vba["hg_correlation_from_name"](b"moody", ctypes.byref(c)) == 12
    assert "colebrook" in last_error(vba)
    # A short buffer gets a cut, NUL-terminated copy and the full length back.
    buf = ctypes.create_string_buffer(4)
    n = vba["hg_last_error"](buf, 4)
    assert n > 4 and buf.value == b"unk"


# Reference tag -> the VBA-declared function it checks.
TAGS = {
    "water": "hg_water",
    "air": "hg_air",
    "vapour": "hg_water_vapour_pressure",
    "convert": "hg_convert",
    "convert_head": "hg_convert_head",
    "fitting_k": "hg_fitting_k",
    "section": "hg_section_properties",
    "pipe_head_loss": "hg_pipe_head_loss",
    "reynolds": "hg_reynolds",
    "roughness": "hg_roughness",
    "roughness_aged": "hg_roughness_aged",
    "pipe_size": "hg_pipe_size",
    "validity": "hg_correlation_validity",
    "saturation": "hg_water_saturation_temperature",
    "transition_limits": "hg_transition_limits",
    "turbulent_diameter": "hg_turbulent_diameter",
}
CODES = {"not_finite": 10, "out_of_range": 11, "unknown_name": 12, "invalid": 13, "no_solution": 20}
OUT_TYPES = {"Double": ctypes.c_double, "Long": ctypes.c_int32, "LongPtr": ctypes.c_ssize_t}


def token(t: str):
    if t.startswith("s:"):
        return t[2:].replace("~", " ").encode()
    if t.startswith("i:"):
        return int(t[2:])
    return unhex(t)


def test_every_scalar_function_equals_the_core_bit_for_bit(vba):
    """Each ByVal argument takes the next input of the record, each ByRef argument is an
    output, exactly as a worksheet function passes them."""
    decls = {d.name: d for d in parse_vba()}
    counted = {}
    for line in Path(os.environ["HG_REFERENCE"]).read_text().splitlines():
        tag, _, rest = line.partition(" ")
        if tag not in TAGS:
            continue
        ins, outs = (part.split() for part in rest.split(" | "))
        d = decls[TAGS[tag]]
        args, refs, inputs = [], [], iter(ins)
        for byval, _, vtype in d.params:
            if byval == "ByVal":
                args.append(token(next(inputs)))
            else:
                r = OUT_TYPES[vtype]()
                refs.append(r)
                args.append(ctypes.byref(r))
        status = vba[d.name](*args)
        if outs[0].startswith("!"):
            assert status == CODES[outs[0][1:]], line
            assert last_error(vba), line
        else:
            assert status == 0, (line, last_error(vba))
            assert [bits(r.value) for r in refs] == [int(o, 16) for o in outs], line
        counted[tag] = counted.get(tag, 0) + 1
    assert set(counted) == set(TAGS), counted


def test_names_through_string_buffers(vba, reference):
    """A VBA String buffer (ByVal String) receives the name; the full length comes back."""
    for tag, fn in (
        ("unit_name", "hg_unit_name"),
        ("catalogue", "hg_fitting_catalogue_name"),
        ("material_name", "hg_roughness_material_name"),
    ):
        for i, _, want in reference[tag]:
            index, name = int(i[2:]), want.split(":", 1)[1]
            need = ctypes.c_ssize_t(-1)
            assert vba[fn](index, None, 0, ctypes.byref(need)) == 31  # buffer too small
            assert need.value == len(name)
            buf = ctypes.create_string_buffer(need.value + 1)
            assert vba[fn](index, buf, need.value + 1, ctypes.byref(need)) == 0
            assert buf.value.decode() == name
        assert vba[fn](10_000, None, 0, ctypes.byref(need)) == 11


def test_smallest_standard_size_through_a_string_buffer(vba):
    rows = [
        line.split()[1:]
        for line in Path(os.environ["HG_REFERENCE"]).read_text().splitlines()
        if line.startswith("pipe_size_at_least ")
    ]
    assert rows
    d, need = ctypes.c_double(), ctypes.c_ssize_t()
    for table, sched, dmin, _, *outs in rows:
        buf = ctypes.create_string_buffer(32)
        s = vba["hg_pipe_size_at_least"](token(table), token(sched), unhex(dmin), ctypes.byref(d), buf, 32,
                                         ctypes.byref(need))
        if outs[0].startswith("!"):
            assert s == CODES[outs[0][1:]]
        else:
            assert s == 0
            assert (bits(d.value), "s:" + buf.value.decode()) == (int(outs[0], 16), outs[1])


def test_pipe_table_lists_through_string_buffers(vba):
    """Schedules and nominal sizes by index, as a worksheet loop reads them."""
    rows = [
        line.split()
        for line in Path(os.environ["HG_REFERENCE"]).read_text().splitlines()
        if line.startswith(("table_schedule ", "table_nominal "))
    ]
    assert rows
    need = ctypes.c_ssize_t()
    for tag, table, index, _, *outs in rows:
        fn = "hg_pipe_table_schedule" if tag == "table_schedule" else "hg_pipe_table_nominal"
        buf = ctypes.create_string_buffer(32)
        s = vba[fn](token(table), token(index), buf, 32, ctypes.byref(need))
        if outs[0].startswith("!"):
            assert s == CODES[outs[0][1:]]
        else:
            assert s == 0
            assert "s:" + buf.value.decode() == outs[0]
            assert need.value == len(buf.value)
