"""Exact 3x3 matrices of sympy numbers and their float images.

Private kernels: callers validate their input first.
"""

from fractions import Fraction

import numpy as np
import sympy as sp

__all__ = ["exact_matrix", "float_key", "is_orthogonal", "matmul", "to_float", "quadratic_field"]

_KEY_SCALE = 1e8


def _canon(x):
    """Canonical exact form of one entry (expanded; floats are refused upstream)."""
    x = sp.sympify(x)
    if x.is_Rational:
        return x
    return sp.expand(sp.radsimp(x))


def exact_matrix(rows):
    """An ImmutableMatrix with canonical exact entries.

    Examples
    --------
    >>> exact_matrix([[1, 0], [0, '1/2']])
    Matrix([
    [1,   0],
    [0, 1/2]])
    """
    m = sp.Matrix(rows)
    return sp.ImmutableMatrix(m.shape[0], m.shape[1], [_canon(v) for v in m])


def matmul(a, b):
    """Exact product ``a * b`` with entries expanded to canonical form.

    Examples
    --------
    >>> h = exact_matrix([['-1/2', '-sqrt(3)/2', 0], ['sqrt(3)/2', '-1/2', 0], [0, 0, 1]])
    >>> matmul(h, matmul(h, h)) == sp.eye(3)
    True
    """
    p = sp.Matrix(a) * sp.Matrix(b)
    return sp.ImmutableMatrix(p.shape[0], p.shape[1], [_canon(v) for v in p])


def to_float(m):
    """float64 image of an exact matrix, as a new numpy array.

    Examples
    --------
    >>> to_float(exact_matrix([[0, 1], [1, 0]])).dtype
    dtype('float64')
    """
    return np.array([[float(v) for v in row] for row in sp.Matrix(m).tolist()], dtype=np.float64)


def float_key(a):
    """Hashable key of a float matrix: entries rounded at 1e-8 (absolute)."""
    return tuple(int(v) for v in np.rint(np.asarray(a, dtype=np.float64).ravel() * _KEY_SCALE))


def is_orthogonal(m):
    """Exact test of ``m * m.T == 1`` for a 3x3 matrix.

    Examples
    --------
    >>> is_orthogonal(exact_matrix([[0, 1, 0], [1, 0, 0], [0, 0, -1]]))
    True
    >>> is_orthogonal(exact_matrix([[1, 1, 0], [0, 1, 0], [0, 0, 1]]))
    False
    """
    p = matmul(m, sp.Matrix(m).T)
    return all(sp.simplify(p[i, j] - (1 if i == j else 0)) == 0 for i in range(3) for j in range(3))


def quadratic_field(entries):
    """The integer d such that all entries lie in Q(sqrt(d)), or None.

    Returns 1 when every entry is rational, d > 1 (square-free) when the
    irrational entries are rational multiples of one sqrt(d) plus rationals,
    and None when the entries need a larger field.

    Examples
    --------
    >>> quadratic_field([sp.Rational(1, 2), sp.sqrt(3) / 2])
    3
    >>> quadratic_field([1, 0]) == 1
    True
    >>> quadratic_field([sp.sqrt(2), sp.sqrt(3)]) is None
    True
    """
    d = 1
    for e in entries:
        e = sp.expand(sp.sympify(e))
        if e.is_Rational:
            continue
        for term in sp.Add.make_args(e):
            if term.is_Rational:
                continue
            coeff, rest = term.as_coeff_Mul()
            if not (rest.is_Pow and rest.exp == sp.S.Half and rest.base.is_Integer):
                return None
            base = int(rest.base)
            if d == 1:
                d = base
            elif base != d:
                return None
    return d


def split_quadratic(e, d):
    """Rational parts (a, b) of ``e = a + b*sqrt(d)`` as Fractions."""
    e = sp.expand(sp.sympify(e))
    a = Fraction(0)
    b = Fraction(0)
    for term in sp.Add.make_args(e):
        if term.is_Rational:
            a += Fraction(int(term.p), int(term.q))
        else:
            coeff, rest = term.as_coeff_Mul()
            if d == 1 or not (rest.is_Pow and rest.base == d):
                raise ValueError(f"{e} is not in Q(sqrt({d}))")
            b += Fraction(int(coeff.p), int(coeff.q))
    return a, b
