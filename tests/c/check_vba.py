"""Checks a spreadsheet module (capi/excel/hydrograde.bas by default, or the file given)
against the one specification capi/excel/spec.json, without Office:

- Option Explicit is on; blocks (Function, Sub, If, For, #If) close; every statement has
  balanced parentheses and quotes;
- each export of the spec has exactly one Declare, PtrSafe, Lib "hydrograde.dll", with the
  parameters (name, ByVal/ByRef, VBA type) the spec's types stand for, returning Long;
- each Hydro* worksheet function takes the spec's arguments in order, converts each one
  under its own name, calls its export with every argument in the Declare's order,
  passes each text buffer with the length it was allocated with, and returns the output
  the spec names; a function mapped over ranges calls itself with each cell in its place.

The DLL side of the same spec is checked under Wine by tests/windows/test_dll.py. Prints
the failures and 'N passed, N failed'; exits non-zero on any failure."""

from __future__ import annotations

import re
import sys
from pathlib import Path

ROOT = Path(__file__).resolve().parents[2]
sys.path.insert(0, str(ROOT / "scripts" / "windows"))
import gen_vba  # noqa: E402


def logical_lines(text: str) -> list[tuple[int, str]]:
    """Statements with their first line number: continuations joined, comments dropped."""
    out, buf, start = [], "", 0
    for i, raw in enumerate(text.splitlines(), 1):
        code = strip_comment(raw)
        if not buf:
            start = i
        if code.rstrip().endswith(" _"):
            buf += code.rstrip()[:-2] + " "
            continue
        buf += code
        if buf.strip():
            out.append((start, buf.strip()))
        buf = ""
    if buf.strip():
        out.append((start, buf.strip() + " _"))
    return out


def strip_comment(line: str) -> str:
    in_str = False
    for j, ch in enumerate(line):
        if ch == '"':
            in_str = not in_str
        elif ch == "'" and not in_str:
            return line[:j]
    return line


def outside_strings(s: str) -> str:
    return re.sub(r'"[^"]*"', '""', s)


def split_args(s: str) -> list[str]:
    args, depth, cur = [], 0, ""
    for ch in outside_strings(s):
        if ch == "," and depth == 0:
            args.append(cur.strip())
            cur = ""
            continue
        depth += ch == "("
        depth -= ch == ")"
        cur += ch
    if cur.strip():
        args.append(cur.strip())
    return args


def check(path: Path) -> list[str]:
    text = path.read_bytes().decode("cp1252")
    spec = gen_vba.load()
    fails: list[str] = []
    stmts = logical_lines(text)

    # ---- syntax ----
    if not any(s == "Option Explicit" for _, s in stmts):
        fails.append("Option Explicit is missing")
    stack: list[tuple[str, int]] = []
    openers = {"Function": r"^(Public |Private )?Function \w+\(", "Sub": r"^(Public |Private )?Sub \w+\(",
               "For": r"^For ", "#If": r"^#If ", "If": r"^If .* Then$", "Select": r"^Select Case "}
    closers = {"Function": "End Function", "Sub": "End Sub", "For": "Next", "#If": "#End If",
               "If": "End If", "Select": "End Select"}
    for n, s in stmts:
        bare = outside_strings(s)
        if bare.count("(") != bare.count(")"):
            fails.append(f"line {n}: unbalanced parentheses: {s}")
        if s.count('"') % 2:
            fails.append(f"line {n}: unterminated string: {s}")
        if s.endswith(" _"):
            fails.append(f"line {n}: a continuation that continues nothing")
        for kind, pat in openers.items():
            if re.match(pat, s) and "Declare" not in s:
                stack.append((kind, n))
        for kind, close in closers.items():
            if s == close or (kind == "For" and s.startswith("Next")):
                if not stack or stack[-1][0] != kind:
                    fails.append(f"line {n}: {s} closes nothing open (open: {stack[-1] if stack else None})")
                else:
                    stack.pop()
    for kind, n in stack:
        fails.append(f"line {n}: {kind} is never closed")

    # ---- Declare lines ----
    decl_re = re.compile(r'^(Public |Private )?Declare (PtrSafe )?Function (hydro_\w+) Lib "([^"]*)" \((.*)\) As (\w+)$')
    declared: dict[str, list[tuple[int, str]]] = {}
    for n, s in stmts:
        if "Declare" in s and "hydro_" in s:
            m = decl_re.match(s)
            if not m:
                fails.append(f"line {n}: cannot read the declaration: {s}")
                continue
            declared.setdefault(m.group(3), []).append((n, s))
    for fn in spec["functions"]:
        ex = fn["export"]
        found = declared.pop(ex, [])
        if len(found) != 1:
            fails.append(f"{ex}: declared {len(found)} times")
            continue
        n, s = found[0]
        m = decl_re.match(s)
        if not m.group(2):
            fails.append(f"line {n}: {ex} is not PtrSafe")
        if m.group(4) != "hydrograde.dll":
            fails.append(f'line {n}: {ex} names Lib "{m.group(4)}", not "hydrograde.dll"')
        if m.group(6) != "Long":
            fails.append(f"line {n}: {ex} returns {m.group(6)}, the DLL returns a Long status")
        want = [p for a, t in gen_vba.all_args(fn) for p in gen_vba.VBA_PARAMS[t](a)]
        got = [p.strip() for p in m.group(5).split(",")]
        if got != want:
            diff = [f"{g!r} where the DLL takes {w!r}" for g, w in zip(got, want) if g != w]
            fails.append(f"line {n}: {ex} parameters differ from the DLL: {'; '.join(diff) or (len(got), len(want))}")
    for ex, found in declared.items():
        fails.append(f"line {found[0][0]}: {ex} is not an export of the DLL")

    # ---- worksheet functions ----
    bodies: dict[str, tuple[int, str, list[tuple[int, str]]]] = {}
    current = None
    for n, s in stmts:
        m = re.match(r"^Public Function (Hydro\w+)\((.*)\) As Variant$", s)
        if m:
            current = m.group(1)
            bodies[current] = (n, m.group(2), [])
        elif s == "End Function":
            current = None
        elif current:
            bodies[current][2].append((n, s))
    for fn in spec["functions"]:
        types = dict(fn["args"])
        for ws in fn["worksheet"]:
            name = ws["name"]
            if name not in bodies:
                fails.append(f"{name}: worksheet function missing")
                continue
            n, params, body = bodies.pop(name)
            got = [re.sub(r"^(Optional )?ByVal (\w+) As Variant$", r"\2", p.strip()) for p in split_args(params)]
            want = [a for a, _ in ws["args"]]
            if got != want:
                fails.append(f"line {n}: {name} takes ({', '.join(got)}); the spec says ({', '.join(want)})")
            code = [s for _, s in body]
            for a in want:
                t = types[a]
                conv = {"double": f'HydroNumber({a}, "{a}", {a}_v)', "string": f'HydroText({a}, "{a}", ',
                        "cells": f'HydroPack({a}, "{a}", {a}_rows, {a}_cols, {a}_types, {a}_numbers, {a}_texts)'}[t]
                if not any(conv in s for s in code):
                    fails.append(f"{name}: argument {a} is not converted as a {t} under its own name")
            over = ws.get("over_ranges", [])
            if over:
                inner = ", ".join(f"HydroAt({a}, i, j)" if a in over else a for a in want)
                if f"grid(i, j) = {name}({inner})" not in code:
                    fails.append(f"{name}: over ranges, each cell is not passed in its own place ({inner})")
                grid = f'e = HydroGrid(Array({", ".join(over)}), Array({", ".join(chr(34) + a + chr(34) for a in over)}), rr, cc)'
                if grid not in code:
                    fails.append(f"{name}: the shape of the ranges {over} is not checked")
            calls = [s for s in code if s.startswith(f"s = {fn['export']}(")]
            if len(calls) != 1:
                fails.append(f"{name}: {len(calls)} calls of {fn['export']}")
                continue
            args = split_args(calls[0][len(f"s = {fn['export']}("):-1])
            want_args = []
            for a, t in gen_vba.all_args(fn):
                if t in ("double", "string"):
                    want_args.append(f"{a}_v")
                elif t == "out_double":
                    want_args.append(a)
                elif t == "out_text":
                    want_args += [a, None]
                else:
                    want_args += [f"{a}_rows", f"{a}_cols", f"{a}_types(0)", f"{a}_numbers(0)", f"{a}_texts"]
            if len(args) != len(want_args):
                fails.append(f"{name}: calls {fn['export']} with {len(args)} arguments, it takes {len(want_args)}")
                continue
            allocs = dict(re.findall(r"^(\w+) = String\$\((\w+), vbNullChar\)$", "\n".join(code), re.M))
            for i, (g, w) in enumerate(zip(args, want_args)):
                if w is None:
                    buf = args[i - 1]
                    if allocs.get(buf) != g:
                        fails.append(f"{name}: passes {buf} with length {g}, allocated with {allocs.get(buf)}")
                elif g != w:
                    fails.append(f"{name}: argument {i + 1} of {fn['export']} is {g}, expected {w}")
            ret = ws["returns"]
            value = f"HydroTrim({ret})" if types[ret] == "out_text" else ret
            if f"{name} = {value}" not in code:
                fails.append(f"{name}: does not return {value}")
    for name, (n, _, _) in bodies.items():
        fails.append(f"line {n}: {name} is not in the spec")
    return fails


def main() -> int:
    path = Path(sys.argv[1]) if len(sys.argv) > 1 else gen_vba.BAS
    fails = check(path)
    for f in fails:
        print("FAIL", f)
    print(f"check_vba {path.name}: {'ok' if not fails else f'{len(fails)} failures'}")
    return 1 if fails else 0


if __name__ == "__main__":
    sys.exit(main())
