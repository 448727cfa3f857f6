#!/usr/bin/env python3
"""Compare two text outputs of Stave up to round-off.

Every number is rounded to 9 significant digits, and numbers smaller than
1e-9 of the largest number in the file (residuals, round-off) count as 0.
Exit 0 when the files agree that way, 1 when they do not (the first
differing lines are printed).

    .ci/roundoff.py A B
"""
import re
import sys

NUMBER = re.compile(r"[-+]?(?:\d+\.\d*|\.\d+|\d+)(?:[eE][-+]?\d+)?")


def normalise(text):
    values = [abs(float(m)) for m in NUMBER.findall(text)]
    scale = max(values, default=0.0)

    def fix(m):
        v = float(m.group(0))
        if abs(v) <= 1e-9 * scale:
            return "0"
        return "%.9g" % v

    return [NUMBER.sub(fix, line) for line in text.splitlines()]


def main():
    a, b = (normalise(open(p, encoding="utf-8", errors="replace").read()) for p in sys.argv[1:3])
    if a == b:
        return 0
    shown = 0
    for i, (x, y) in enumerate(zip(a, b)):
        if x != y and shown < 10:
            print("line %d:\n  < %s\n  > %s" % (i + 1, x, y))
            shown += 1
    if len(a) != len(b):
        print("%d lines against %d" % (len(a), len(b)))
    return 1


if __name__ == "__main__":
    sys.exit(main())
