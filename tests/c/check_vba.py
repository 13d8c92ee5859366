"""Checks every Declare of capi/excel/hydrograde.bas against capi/include/hydrograde.h:
the function exists, is PtrSafe, has the same number of arguments, and each argument and
the return value have a VBA type that matches the C type on 64-bit Office. Also checks
that every scalar function of the header (no handle, struct or array argument) is
declared. Prints 'N passed, N failed' and exits non-zero on any failure."""

import sys

from vba_decl import is_scalar, param_compatible, parse_header, parse_vba, return_compatible


def main() -> int:
    header = parse_header()
    decls = parse_vba()
    passed, failures = 0, []

    def check(ok: bool, what: str) -> None:
        nonlocal passed
        if ok:
            passed += 1
        else:
            failures.append(what)

    seen = set()
    for d in decls:
        where = f"hydrograde.bas:{d.line} {d.name}"
        check(d.name not in seen, f"{where}: declared twice")
        seen.add(d.name)
        check(d.ptrsafe, f"{where}: not PtrSafe")
        c = header.get(d.name)
        check(c is not None, f"{where}: not in hydrograde.h")
        if c is None:
            continue
        check(len(d.params) == len(c.params),
              f"{where}: {len(d.params)} arguments, header has {len(c.params)}")
        for (byval, pname, vtype), (ctype, cname) in zip(d.params, c.params):
            check(param_compatible(byval, vtype, ctype),
                  f"{where}: argument {pname} is {byval} {vtype}, header has {ctype} {cname}")
        check(return_compatible(d.ret, c.ret), f"{where}: returns {d.ret}, header {c.ret}")
    for name, c in sorted(header.items()):
        if is_scalar(c):
            check(name in seen, f"scalar function {name} has no VBA declaration")
    for f in failures:
        print("FAIL", f)
    print(f"check_vba: {len(decls)} declarations, {len(header)} header functions")
    print(f"{passed} passed, {len(failures)} failed")
    return 1 if failures else 0


if __name__ == "__main__":
    sys.exit(main())
