"""Independent reference values from mpmath (Debian's python3-mpmath, gmpy
backend), for the engine's fixtures and live tests.

Run with /usr/bin/python3. Reads a JSON list of cases on stdin,
  [{"id": "hermite", "params": {"n": "5", "x": "0.3"}, "digits": 40}, ...]
and prints a JSON list of value strings (a list of two for hermite-series,
[node, weight] for gauss-hermite), each with digits + 15 significant digits.
A case with "kappa": true gets |x f'(x)/f(x)| instead (f' by mpmath.diff).

Methods are mpmath's own where it has them (hermite, hyp1f1, pcfd, diff);
the Hermite-equation series is summed directly from its coefficient
recurrence; Gauss-Hermite nodes come from mpmath.hermite,
started from a float scan, by Newton's iteration, and weights from 2^(n-1) n! sqrt(pi)/(n^2 H_{n-1}^2).
"""
import json
import math
import sys

import mpmath
from mpmath import mp, mpf


def hermite_series(lam, x, parity):
    # a_{k+2} = 2(k - lam) a_k / ((k+1)(k+2)), a0 = 1 (even) or a1 = 1 (odd)
    k = 0 if parity == 'even' else 1
    a = mpf(1)
    term = a * x ** k
    total = term
    x2 = x * x
    eps = mpf(2) ** (-mp.prec - 20)
    small = 0
    while True:
        a = a * 2 * (k - lam) / ((k + 1) * (k + 2))
        k += 2
        term = a * x ** k if a != 0 else mpf(0)
        total += term
        if a == 0:
            return total
        if abs(term) <= eps * abs(total) and k > 2 * abs(lam) + 2 * x2:
            small += 1
            if small > 3:
                return total
        else:
            small = 0


def float_zeros(n):
    """Positive zeros of H_n to float accuracy: sign scan of the normalised
    recurrence, then bisection."""
    def f(x):
        pp, p = 1.0, math.sqrt(2) * x
        for k in range(1, n):
            pp, p = p, math.sqrt(2 / (k + 1)) * x * p - math.sqrt(k / (k + 1)) * pp
            if abs(p) > 1e200:
                p /= 1e200
                pp /= 1e200
        return p
    h = math.pi / math.sqrt(2 * n + 1) / 16
    out = []
    a = h / 2 if n % 2 else 0.0
    fa = f(a)
    while len(out) < n // 2:
        b = a + h
        fb = f(b)
        if (fa < 0) != (fb < 0):
            lo, hi = a, b
            for _ in range(60):
                mid = (lo + hi) / 2
                if (f(mid) < 0) == (fa < 0):
                    lo = mid
                else:
                    hi = mid
            out.append((lo + hi) / 2)
        a, fa = b, fb
    return out


def mp_zero(n, x0):
    """Newton's iteration x <- x - H_n(x) / (2n H_{n-1}(x)) on mpmath.hermite,
    from a float start, to the working precision."""
    x = mpf(x0)
    for _ in range(200):
        dx = mpmath.hermite(n, x) / (2 * n * mpmath.hermite(n - 1, x))
        x -= dx
        if abs(dx) <= abs(x) * mpf(2) ** (-mp.prec + 4):
            break
    return x


_RULES = {}


def gauss_hermite(n, weight, i):
    key = (n, weight, mp.dps)
    if key not in _RULES:
        pos = []
        for x0 in float_zeros(n):
            pos.append(mp_zero(n, x0))
        nodes = [-x for x in reversed(pos)] + ([mpf(0)] if n % 2 else []) + pos
        c = mpf(2) ** (n - 1) * mpmath.factorial(n) * mp.sqrt(mp.pi) / (n * n)
        weights = [c / mpmath.hermite(n - 1, x) ** 2 for x in nodes]
        if weight == 'probabilists':
            nodes = [x * mp.sqrt(2) for x in nodes]
            weights = [w * mp.sqrt(2) for w in weights]
        _RULES[key] = (nodes, weights)
    nodes, weights = _RULES[key]
    return [nodes[i - 1], weights[i - 1]]


def scalar_function(fid, p):
    """The case's function of its argument (x, or z), other parameters fixed."""
    if fid == 'hermite':
        n = int(p['n'])
        return lambda t: mpmath.hermite(n, t), 'x'
    if fid == 'hermite-prob':
        n = int(p['n'])
        return lambda t: mpf(2) ** (mpf(-n) / 2) * mpmath.hermite(n, t / mp.sqrt(2)), 'x'
    if fid == 'hermite-function':
        n = int(p['n'])
        c = 1 / mp.sqrt(mpf(2) ** n * mpmath.factorial(n) * mp.sqrt(mp.pi))
        return lambda t: c * mpmath.hermite(n, t) * mp.exp(-t * t / 2), 'x'
    if fid == 'hermite-derivative':
        n, k = int(p['n']), int(p['k'])
        return lambda t: mp.diff(lambda u: mpmath.hermite(n, u), t, k), 'x'
    if fid == 'kummer':
        a, b = mpf(p['a']), mpf(p['b'])
        return lambda t: mpmath.hyp1f1(a, b, t), 'z'
    if fid == 'parabolic-cylinder':
        nu = mpf(p['nu'])
        return lambda t: mpmath.pcfd(nu, t), 'z'
    raise ValueError('no scalar function for ' + fid)


def kappa(case):
    """kappa = |x f'(x) / f(x)| with f' from mpmath.diff."""
    p = case['params']
    mp.dps = 40
    f, arg = scalar_function(case['id'], p)
    x = mpf(p[arg])
    return mpmath.nstr(abs(x * mp.diff(f, x) / f(x)), 12)


def evaluate(case):
    if case.get('kappa'):
        return kappa(case)
    p = case['params']
    d = int(case['digits'])
    mp.dps = d + 30
    fid = case['id']
    if fid == 'hermite':
        v = mpmath.hermite(int(p['n']), mpf(p['x']))
    elif fid == 'hermite-prob':
        n = int(p['n'])
        v = mpf(2) ** (mpf(-n) / 2) * mpmath.hermite(n, mpf(p['x']) / mp.sqrt(2))
    elif fid == 'hermite-function':
        n, x = int(p['n']), mpf(p['x'])
        v = mpmath.hermite(n, x) * mp.exp(-x * x / 2) / mp.sqrt(mpf(2) ** n * mpmath.factorial(n) * mp.sqrt(mp.pi))
    elif fid == 'hermite-derivative':
        n, k, x = int(p['n']), int(p['k']), mpf(p['x'])
        v = mp.diff(lambda t: mpmath.hermite(n, t), x, k) if k > 0 else mpmath.hermite(n, x)
    elif fid == 'hermite-series':
        lam, x = mpf(p['lambda']), mpf(p['x'])
        mp.dps = d + 30 + int(float(x) ** 2)  # the series cancels at large |x|
        return [fmt(hermite_series(lam, x, 'even'), d), fmt(hermite_series(lam, x, 'odd'), d)]
    elif fid == 'kummer':
        v = mpmath.hyp1f1(mpf(p['a']), mpf(p['b']), mpf(p['z']))
    elif fid == 'parabolic-cylinder':
        v = mpmath.pcfd(mpf(p['nu']), mpf(p['z']))
    elif fid == 'gauss-hermite':
        return [fmt(v, d) for v in gauss_hermite(int(p['n']), p.get('weight', 'physicists'), int(p['i']))]
    else:
        raise ValueError('unknown id ' + fid)
    return fmt(v, d)


def fmt(v, d):
    if v == 0:
        return '0'
    return mpmath.nstr(v, d + 15, min_fixed=1, max_fixed=0)


if __name__ == '__main__':
    cases = json.load(sys.stdin)
    json.dump([evaluate(c) for c in cases], sys.stdout)
