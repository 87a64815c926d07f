"""Exact arithmetic in multi-quadratic fields: private kernels for 3x3 matrices.

An entry a_1 sqrt(s_1) + ... + a_k sqrt(s_k) (rational a_i, distinct square-free
s_i, s = 1 for the rational part) is held as a dict {s_i: a_i}.  Products stay
in this form (sqrt(s) sqrt(t) = g sqrt(st/g^2), g = gcd(s, t)), which covers
every catalog setting (sqrt(3), sqrt(5)) and their re-orientations by rotations
with entries such as sqrt(2)/2 or sqrt(6)/3.  Rationals are sympy's ground
type (python-flint or gmpy2 when installed, else a pure-Python class).
Kernels trust their input; callers fall back to sympy when :func:`mq_matrix`
returns None.

Examples
--------
>>> import sympy as sp
>>> m = mq_matrix(sp.ImmutableMatrix([[sp.Rational(1, 2), -sp.sqrt(3) / 2, 0], [sp.sqrt(3) / 2, sp.Rational(1, 2), 0], [0, 0, 1]]))
>>> mq_sympy(mq_matmul(m, m))[0, 1]
-sqrt(3)/2
>>> is_orthogonal_mq(m)
True
"""

import math

import sympy as sp
from sympy.external.gmpy import MPQ

__all__ = ["mq_entry", "mq_matrix", "mq_mul", "mq_matmul", "mq_sympy", "is_orthogonal_mq"]


def mq_entry(x):
    """Dict form of one sympy number, or None when it is not a sum of rational multiples of square roots."""
    out = {}
    for term in sp.Add.make_args(x):
        if term.is_Rational:
            out[1] = out.get(1, 0) + MPQ(int(term.p), int(term.q))
            continue
        coeff, rest = term.as_coeff_Mul()
        if not (coeff.is_Rational and rest.is_Pow and rest.exp == sp.S.Half and rest.base.is_Integer
                and rest.base > 1):
            return None
        b = int(rest.base)
        out[b] = out.get(b, 0) + MPQ(int(coeff.p), int(coeff.q))
    return {k: v for k, v in out.items() if v}


def mq_matrix(m):
    """Dict form (nested lists) of a 3x3 sympy matrix, or None."""
    rows = []
    for i in range(3):
        row = []
        for j in range(3):
            e = mq_entry(m[i, j])
            if e is None:
                return None
            row.append(e)
        rows.append(row)
    return rows


def mq_mul(a, b):
    """Product of two entries."""
    out = {}
    for s, x in a.items():
        for t, y in b.items():
            g = math.gcd(s, t)
            r = (s // g) * (t // g)
            out[r] = out.get(r, 0) + x * y * g
    return out


def mq_matmul(a, b):
    """Product of two 3x3 matrices in dict form."""
    res = []
    for i in range(3):
        row = []
        for j in range(3):
            acc = {}
            for k in range(3):
                for r, v in mq_mul(a[i][k], b[k][j]).items():
                    acc[r] = acc.get(r, 0) + v
            row.append({r: v for r, v in acc.items() if v})
        res.append(row)
    return res


_SQRT = {}
_ENTRY = {}  # dict form (as a sorted tuple) -> sympy number; bounded by _ENTRY_LIMIT
_ENTRY_LIMIT = 100000


def _entry_sympy(e):
    key = tuple(sorted((r, int(c.numerator), int(c.denominator)) for r, c in e.items()))
    v = _ENTRY.get(key)
    if v is None:
        terms = []
        for r, p, q in key:
            c = sp.Rational(p, q)
            if r == 1:
                terms.append(c)
            else:
                root = _SQRT.get(r)
                if root is None:
                    root = _SQRT[r] = sp.sqrt(r)
                terms.append(c * root)
        v = sp.Add(*terms) if terms else sp.Integer(0)
        if len(_ENTRY) < _ENTRY_LIMIT:
            _ENTRY[key] = v
    return v


def mq_sympy(rows):
    """The sympy ImmutableMatrix of a 3x3 matrix in dict form (canonical entries)."""
    return sp.ImmutableMatrix(3, 3, [_entry_sympy(e) for row in rows for e in row])


def is_orthogonal_mq(m):
    """Exact ``m m^T == 1`` for a matrix in dict form."""
    t = [[m[j][i] for j in range(3)] for i in range(3)]
    p = mq_matmul(m, t)
    return all(p[i][j] == ({1: 1} if i == j else {}) for i in range(3) for j in range(3))
