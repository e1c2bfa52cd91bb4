"""mpmath side of `npm run bench` (Debian python3-mpmath with the gmpy
backend; run with /usr/bin/python3). Reads the workloads as JSON on stdin and
prints the timings in milliseconds ([wall, process CPU]) as JSON. Each timed body is mpmath's own
work only; inputs are converted before the clock starts.
"""
import json
import os
import sys
import time

import mpmath
from mpmath import mp, mpf

sys.path.insert(0, os.path.join(os.path.dirname(os.path.abspath(__file__)), '..', 'scripts', 'reference'))
from mp_reference import float_zeros  # noqa: E402  (double-precision starts, shared with the fixture generator)


def best_of(fn, repeats):
    """Best wall and best process-CPU time in ms."""
    wall = cpu = float('inf')
    for _ in range(repeats):
        t, c = time.perf_counter(), time.process_time()
        fn()
        wall = min(wall, time.perf_counter() - t)
        cpu = min(cpu, time.process_time() - c)
    return [wall * 1000, cpu * 1000]


def main():
    w = json.load(sys.stdin)
    out = {}
    mp.dps = w['digits']
    xs = [mpf(x) for x in w['a_points']]
    nmax = w['a_nmax']

    def recurrence():
        for x in xs:
            h0, h1 = mpf(1), 2 * x
            for k in range(1, nmax):
                h0, h1 = h1, 2 * x * h1 - 2 * k * h0

    def per_point():
        for x in xs:
            for n in range(nmax + 1):
                mpmath.hermite(n, x)

    recurrence()
    out['a_recurrence'] = best_of(recurrence, 10)
    out['a_hermite'] = best_of(per_point, 1)

    n = w['b_n']
    starts = float_zeros(n)  # double-precision starts, not timed

    def newton():
        c = mpf(2) ** (n - 1) * mpmath.factorial(n) * mp.sqrt(mp.pi) / (n * n)
        nodes, weights = [], []
        for x0 in starts:
            x = mpf(x0)
            for _ in range(100):
                h0, h1 = mpf(1), 2 * x
                for k in range(1, n):
                    h0, h1 = h1, 2 * x * h1 - 2 * k * h0
                dx = h1 / (2 * n * h0)
                x -= dx
                if abs(dx) < abs(x) * mpf(2) ** (-mp.prec + 3):
                    break
            h0, h1 = mpf(1), 2 * x
            for k in range(1, n - 1):
                h0, h1 = h1, 2 * x * h1 - 2 * k * h0
            nodes.append(x)
            weights.append(c / (h1 if n > 1 else 1) ** 2)
        return nodes, weights

    newton()
    out['b_newton'] = best_of(newton, 10)

    pts = [(mpf(a), mpf(b), mpf(z)) for a, b, z in w['c_points']]

    def kummer():
        for a, b, z in pts:
            mpmath.hyp1f1(a, b, z)

    kummer()
    out['c_hyp1f1'] = best_of(kummer, 10)
    out['backend'] = mpmath.libmp.BACKEND
    out['version'] = mpmath.__version__
    json.dump(out, sys.stdout)


if __name__ == '__main__':
    main()
