"""Compares two `name value` listings (the demos' --numbers output) value by value: the
same names in the same order, and every value parsing to the same double, bit for bit.
Rust prints the shortest string that reads back to its double and C prints %.17g, so
the strings differ while the doubles must not.

Usage: compare_numbers.py RUST_FILE C_FILE. Prints one line per value and exits non-zero
on any difference."""

import struct
import sys


def read(path: str) -> list[tuple[str, float]]:
    rows = []
    with open(path, encoding="utf-8") as f:
        for line in f:
            name, value = line.split()
            rows.append((name, float(value)))
    return rows


def bits(x: float) -> int:
    return struct.unpack("<Q", struct.pack("<d", x))[0]


def main() -> int:
    a, b = read(sys.argv[1]), read(sys.argv[2])
    bad = 0
    if [n for n, _ in a] != [n for n, _ in b]:
        print("the two listings name different values")
        return 1
    if not a:
        print("no values")
        return 1
    for (name, x), (_, y) in zip(a, b):
        same = bits(x) == bits(y)
        bad += not same
        print(f"{'same' if same else 'DIFFERENT'} {name} {x!r} {y!r}")
    print(f"{len(a)} values, {bad} differ")
    return 1 if bad else 0


if __name__ == "__main__":
    sys.exit(main())
