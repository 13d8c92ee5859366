"""Parsers for hydrograde.h prototypes and the VBA module's Declare statements, shared by
check_vba.py (declarations against the header) and test_ctypes.py (calls with the VBA
types)."""

from __future__ import annotations

import re
from dataclasses import dataclass
from pathlib import Path

ROOT = Path(__file__).resolve().parents[2]
HEADER = ROOT / "capi" / "include" / "hydrograde.h"
VBA = ROOT / "capi" / "excel" / "hydrograde.bas"


@dataclass
class CFunc:
    name: str
    ret: str
    params: list[tuple[str, str]]  # (C type, name)


@dataclass
class VbaDecl:
    name: str
    ret: str | None  # None for a Sub
    params: list[tuple[str, str, str]]  # (ByVal/ByRef, name, VBA type)
    ptrsafe: bool
    line: int


def _norm(t: str) -> str:
    return re.sub(r"\s*\*\s*", " *", " ".join(t.split())).strip()


def parse_header(path: Path = HEADER) -> dict[str, CFunc]:
    text = re.sub(r"/\*.*?\*/", "", path.read_text(), flags=re.S)
    text = re.sub(r"//[^\n]*", "", text)
    out = {}
    for m in re.finditer(r"([A-Za-z_][\w \*]*?)\b(hg_\w+)\s*\(([^;{]*?)\)\s*;", text):
        ret, name, args = _norm(m.group(1)), m.group(2), " ".join(m.group(3).split())
        params = []
        if args not in ("", "void"):
            for a in args.split(","):
                a = a.strip()
                pm = re.match(r"(.*?)(\w+)$", a)
                assert pm, a
                params.append((_norm(pm.group(1)), pm.group(2)))
        out[name] = CFunc(name, ret, params)
    return out


DECL = re.compile(
    r'^\s*(?:Public |Private )?Declare (PtrSafe )?(Function|Sub) (\w+) Lib "([^"]+)"'
    r'(?: Alias "(\w+)")? \((.*)\)(?: As (\w+))?\s*$'
)


def parse_vba(path: Path = VBA) -> list[VbaDecl]:
    decls = []
    for i, line in enumerate(path.read_text().splitlines(), 1):
        if "Declare" not in line or line.lstrip().startswith("'"):
            continue
        m = DECL.match(line)
        if not m:
            raise ValueError(f"{path.name}:{i}: cannot parse declaration: {line}")
        ptrsafe, kind, name, lib, alias, args, ret = m.groups()
        if not lib.startswith("hydrograde"):
            continue
        params = []
        for a in filter(None, (x.strip() for x in args.split(","))):
            pm = re.match(r"(ByVal|ByRef) (\w+) As (\w+)$", a)
            if not pm:
                raise ValueError(f"{path.name}:{i}: parameter needs ByVal/ByRef and a type: {a}")
            params.append(pm.groups())
        decls.append(
            VbaDecl(alias or name, ret if kind == "Function" else None, params, bool(ptrsafe), i)
        )
    return decls


# Which C types each VBA parameter form may stand for on 64-bit Windows.
PARAM_OK = {
    ("ByVal", "Double"): {"double"},
    ("ByVal", "Long"): {"int32_t", "uint32_t"},
    ("ByVal", "LongLong"): {"int64_t", "uint64_t"},
    ("ByVal", "String"): {"const char *", "char *"},
    ("ByRef", "Double"): {"double *"},
    ("ByRef", "Long"): {"int32_t *", "uint32_t *"},
    ("ByRef", "LongPtr"): {"size_t *"},
}
RETURN_OK = {
    "Long": {"int32_t", "uint32_t"},
    "Double": {"double"},
    "LongLong": {"int64_t", "uint64_t"},
}


def param_compatible(byval: str, vtype: str, ctype: str) -> bool:
    if (byval, vtype) == ("ByVal", "LongPtr"):
        # A pointer-sized integer: size_t or any pointer passed as an address.
        return ctype == "size_t" or ctype.endswith("*")
    return ctype in PARAM_OK.get((byval, vtype), set())


def return_compatible(vtype: str | None, ctype: str) -> bool:
    if vtype is None:
        return ctype == "void"
    if vtype == "LongPtr":
        return ctype == "size_t" or ctype.endswith("*")
    return ctype in RETURN_OK.get(vtype, set())


def is_scalar(f: CFunc) -> bool:
    """A function a spreadsheet can call with plain values: no handle, struct or array."""
    allowed = {
        "double", "int32_t", "uint32_t", "size_t", "const char *", "char *",
        "double *", "int32_t *", "uint32_t *", "size_t *",
    }
    return all(t in allowed for t, _ in f.params) and f.ret in {
        "int32_t", "uint32_t", "size_t", "double", "const char *",
    }
