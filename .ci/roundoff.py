#!/usr/bin/env python3
"""Compare two text outputs of Stave up to round-off.

The files must have the same lines with the same words; numbers may differ
by one part in RELATIVE (default 1e-8), and numbers smaller than 1e-9 of the
largest number in their file (residuals, round-off) count as 0. In SVG
files (named .svg) a path may instead draw the same curve to within two
pixels. Exit 0 when
the files agree that way, 1 when they do not (the first differing lines are
printed).

    .ci/roundoff.py A B [RELATIVE]
"""
import bisect
import re
import sys

NUMBER = re.compile(r"[-+]?(?:\d+\.\d*|\.\d+|\d+)(?:[eE][-+]?\d+)?")
RELATIVE = 1e-8
NEGLIGIBLE = 1e-9


def parse(text):
    lines = text.splitlines()
    values = [abs(float(m)) for m in NUMBER.findall(text)]
    scale = max(values, default=0.0)
    return [(NUMBER.sub("#", line), [float(m) for m in NUMBER.findall(line)]) for line in lines], scale


def same(a, b, scale_a, scale_b):
    if abs(a) <= NEGLIGIBLE * scale_a and abs(b) <= NEGLIGIBLE * scale_b:
        return True
    return abs(a - b) <= RELATIVE * max(abs(a), abs(b))


def path_points(line):
    """The points of an SVG path line, or None when the line has no path."""
    if "<path" not in line:
        return None
    nums = [float(m) for m in NUMBER.findall(line.split(' d="', 1)[-1].split('"', 1)[0])]
    return sorted(zip(nums[0::2], nums[1::2]))


def near(points, others, reach=2.0):
    """Every point of points lies within reach (pixels) of a point of others."""
    xs = [p[0] for p in others]
    for x, y in points:
        lo = bisect.bisect_left(xs, x - reach)
        hi = bisect.bisect_right(xs, x + reach)
        if not any(abs(others[k][1] - y) <= reach for k in range(lo, hi)):
            return False
    return True


def same_path(la, lb):
    """Two SVG path lines draw the same curve to within two pixels: a curve
    reduced to pixel columns may keep other samples of a column when
    round-off reorders them."""
    a, b = path_points(la), path_points(lb)
    if a is None or b is None or NUMBER.sub("#", la.split(' d="')[0]) != NUMBER.sub("#", lb.split(' d="')[0]):
        return False
    return near(a, b) and near(b, a)


def main():
    global RELATIVE
    if len(sys.argv) > 3:
        RELATIVE = float(sys.argv[3])
    (a, sa), (b, sb) = (parse(open(p, encoding="utf-8", errors="replace").read()) for p in sys.argv[1:3])
    bad = []
    for i, ((wa, na), (wb, nb)) in enumerate(zip(a, b)):
        if wa != wb or len(na) != len(nb) or not all(same(x, y, sa, sb) for x, y in zip(na, nb)):
            bad.append(i)
    if bad and sys.argv[1].endswith(".svg"):
        lines_a = open(sys.argv[1], encoding="utf-8", errors="replace").read().splitlines()
        lines_b = open(sys.argv[2], encoding="utf-8", errors="replace").read().splitlines()
        bad = [i for i in bad if not same_path(lines_a[i], lines_b[i])]
    if not bad and len(a) == len(b):
        return 0
    lines_a = open(sys.argv[1], encoding="utf-8", errors="replace").read().splitlines()
    lines_b = open(sys.argv[2], encoding="utf-8", errors="replace").read().splitlines()
    for i in bad[:10]:
        print("line %d:\n  < %s\n  > %s" % (i + 1, lines_a[i][:300], lines_b[i][:300]))
    if len(a) != len(b):
        print("%d lines against %d" % (len(a), len(b)))
    return 1


if __name__ == "__main__":
    sys.exit(main())
