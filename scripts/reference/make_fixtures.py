"""Write the engine's outside-check fixtures, fixtures/reference/<id>.json,
from Debian's python3-mpmath (run with /usr/bin/python3, not another Python).

    /usr/bin/python3 scripts/reference/make_fixtures.py

Cases are chosen here (fixed seeds, inputs kept as decimal strings); values
come from mp_reference.py. The tests compare the engine with these to its
certified digits, and also draw fresh random cases live on every run.
"""
import json
import os
import random
import sys

import mpmath
from mpmath import mp, mpf

sys.path.insert(0, os.path.dirname(__file__))
from mp_reference import evaluate, float_zeros, mp_zero  # noqa: E402

OUT = os.path.join(os.path.dirname(__file__), '..', '..', 'fixtures', 'reference')
DIGITS = 40


def dec(r, lo, hi, places=6):
    return ('%.' + str(places) + 'f') % r.uniform(lo, hi)


def near_zeros(n, offsets):
    """Decimal points within 1e-6 of a zero of H_n (zero found by mpmath)."""
    mp.dps = 60
    zs = float_zeros(n)
    z = mp_zero(n, zs[len(zs) // 2])
    return [mpmath.nstr(z + mpf(o), 35, min_fixed=-1, max_fixed=0) for o in offsets]


def cases_for(fid):
    r = random.Random(fid)
    c = []
    if fid == 'hermite':
        for n in [0, 1, 2, 3, 7, 20, 50, 100, 250, 400]:
            for x in ['0', '1e-20', '-0.1', '0.5', '1.7', '-3.3', '7.25', '12', '25', '40', '100', '-1000']:
                c.append({'n': str(n), 'x': x})
        for n in [5, 30, 101, 400]:
            for x in near_zeros(n, ['1e-7', '-1e-7', '3e-7', '-9e-7']):
                c.append({'n': str(n), 'x': x})
        for _ in range(20):
            c.append({'n': str(r.randint(0, 300)), 'x': dec(r, -30, 30, 8)})
    elif fid == 'hermite-prob':
        for n in [0, 1, 4, 15, 60, 200]:
            for x in ['0', '-0.25', '1.5', '-4.75', '9.1', '30', '123.5']:
                c.append({'n': str(n), 'x': x})
        for _ in range(20):
            c.append({'n': str(r.randint(0, 200)), 'x': dec(r, -25, 25, 7)})
    elif fid == 'hermite-function':
        for n in [0, 1, 2, 10, 50, 400]:
            for x in ['0', '0.3', '-2.2', '5', '14.5', '30', '45']:
                c.append({'n': str(n), 'x': x})
        for _ in range(20):
            c.append({'n': str(r.randint(0, 500)), 'x': dec(r, -35, 35, 6)})
    elif fid == 'hermite-derivative':
        for n, k in [(0, 1), (3, 1), (3, 3), (3, 4), (10, 2), (25, 3), (40, 1)]:
            for x in ['0', '0.35', '-1.8', '4.2']:
                c.append({'n': str(n), 'k': str(k), 'x': x})
    elif fid == 'hermite-series':
        for lam in ['0', '1', '2', '5', '10']:
            for x in ['0', '0.5', '-1.25', '3']:
                c.append({'lambda': lam, 'x': x})
        for _ in range(40):
            c.append({'lambda': dec(r, -5, 30, 5), 'x': dec(r, -8, 8, 4)})
    elif fid == 'kummer':
        for a, b, z in [('-3', '2', '5'), ('1', '1', '-7'), ('0.5', '1.5', '0'), ('2.5', '0.5', '-200'),
                        ('1.3', '2.7', '300'), ('-0.5', '0.5', '-500'), ('-12.5', '3.25', '40')]:
            c.append({'a': a, 'b': b, 'z': z})
        for _ in range(60):
            b = dec(r, -10, 10, 3)
            if float(b) <= 0 and float(b) == int(float(b)):
                b = '0.5'
            c.append({'a': dec(r, -10, 10, 3), 'b': b, 'z': dec(r, -60, 60, 3)})
    elif fid == 'parabolic-cylinder':
        for nu, z in [('0', '1'), ('3', '2.5'), ('3', '50'), ('12', '-7.5'), ('-3', '0'), ('0.5', '0'), ('-0.5', '25')]:
            c.append({'nu': nu, 'z': z})
        for _ in range(40):
            c.append({'nu': dec(r, -10, 10, 3), 'z': dec(r, -10, 15, 3)})
    elif fid == 'gauss-hermite':
        for n in [1, 2, 3, 5, 10, 40, 100]:
            for w in ['physicists', 'probabilists']:
                for i in range(1, n + 1):
                    c.append({'n': str(n), 'weight': w, 'i': str(i)})
        for i in [1, 2, 150, 151, 299, 300]:
            c.append({'n': '300', 'weight': 'physicists', 'i': str(i)})
    return c


def main():
    only = sys.argv[1:]
    os.makedirs(OUT, exist_ok=True)
    for fid in ['hermite', 'hermite-prob', 'hermite-function', 'hermite-derivative', 'hermite-series',
                'kummer', 'parabolic-cylinder', 'gauss-hermite']:
        if only and fid not in only:
            continue
        cases = cases_for(fid)
        rows = [{'params': p, 'expected': evaluate({'id': fid, 'params': p, 'digits': DIGITS})} for p in cases]
        doc = {
            'source': 'mpmath %s (Debian python3-mpmath, backend %s), via scripts/reference/mp_reference.py'
                      % (mpmath.__version__, mpmath.libmp.BACKEND),
            'generator': 'scripts/reference/make_fixtures.py',
            'id': fid,
            'digits': DIGITS,
            'cases': rows,
        }
        with open(os.path.join(OUT, fid + '.json'), 'w') as f:
            json.dump(doc, f, indent=1)
            f.write('\n')
        print(fid, len(rows), 'cases', file=sys.stderr)


if __name__ == '__main__':
    main()
