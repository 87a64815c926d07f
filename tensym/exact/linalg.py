"""Exact sparse row reduction over Q, Q(sqrt(d)) or sympy expressions.

Rows are dicts {column: value}.  Columns are ordered by a priority: the
reduction picks as pivot of each row its column of highest priority, so the
columns left free (the independent unknowns) are those of lowest priority.
The result is the reduced row echelon form for that column order, which is
unique, so the choice of free unknowns is deterministic.

Examples
--------
>>> from fractions import Fraction
>>> from tensym.exact.linalg import rref_sparse
>>> # unknowns 0, 1, 2 with priority = column number; x2 = x0 - x1
>>> piv = rref_sparse([{0: Fraction(1), 1: Fraction(-1), 2: Fraction(-1)}], priority=lambda c: c)
>>> piv
{2: {0: Fraction(1, 1), 1: Fraction(-1, 1)}}
"""

from fractions import Fraction

import sympy as sp

__all__ = ["QuadNumber", "rref_sparse", "rref_integer"]


class QuadNumber:
    """An element a + b*sqrt(d) of Q(sqrt(d)) with Fraction parts (d square-free > 1).

    Examples
    --------
    >>> phi = QuadNumber(Fraction(1, 2), Fraction(1, 2), 5)   # the golden ratio
    >>> (phi * phi - phi - 1).is_zero()
    True
    >>> y = QuadNumber(Fraction(1), Fraction(1), 3)
    >>> (y / y).to_sympy()
    1
    """

    __slots__ = ("a", "b", "d")

    def __init__(self, a, b, d):
        self.a = Fraction(a)
        self.b = Fraction(b)
        self.d = d

    def _coerce(self, o):
        if isinstance(o, QuadNumber):
            return o
        return QuadNumber(o, 0, self.d)

    def __add__(self, o):
        o = self._coerce(o)
        return QuadNumber(self.a + o.a, self.b + o.b, self.d)

    __radd__ = __add__

    def __sub__(self, o):
        o = self._coerce(o)
        return QuadNumber(self.a - o.a, self.b - o.b, self.d)

    def __rsub__(self, o):
        return self._coerce(o) - self

    def __neg__(self):
        return QuadNumber(-self.a, -self.b, self.d)

    def __mul__(self, o):
        o = self._coerce(o)
        return QuadNumber(self.a * o.a + self.d * self.b * o.b, self.a * o.b + self.b * o.a, self.d)

    __rmul__ = __mul__

    def __truediv__(self, o):
        o = self._coerce(o)
        n = o.a * o.a - self.d * o.b * o.b
        if n == 0:
            raise ZeroDivisionError("division by zero in Q(sqrt(d))")
        inv = QuadNumber(o.a / n, -o.b / n, self.d)
        return self * inv

    def is_zero(self):
        return self.a == 0 and self.b == 0

    def __bool__(self):
        return not self.is_zero()

    def __eq__(self, o):
        o = self._coerce(o)
        return self.a == o.a and self.b == o.b

    def __hash__(self):
        return hash((self.a, self.b, self.d))

    def to_sympy(self):
        return sp.Rational(self.a.numerator, self.a.denominator) + sp.Rational(
            self.b.numerator, self.b.denominator
        ) * sp.sqrt(self.d)

    def __repr__(self):
        return f"QuadNumber({self.a}, {self.b}, {self.d})"


def _is_zero(v):
    if isinstance(v, (Fraction, int, QuadNumber)):
        return not v
    return sp.simplify(v) == 0


def rref_sparse(rows, priority):
    """Reduced row echelon form of sparse rows; returns {pivot: {free column: coeff}}.

    Each returned entry means ``x_pivot = sum(coeff * x_free)``.  ``priority(c)``
    orders columns: the pivot of a row is its column of highest priority.
    Values may be Fractions, QuadNumbers or sympy expressions.
    """
    pivots = {}  # pivot column -> row dict with row[pivot] == 1 and no other pivot columns
    for row in rows:
        r = {c: v for c, v in row.items() if not _is_zero(v)}
        # eliminate existing pivots
        for p in [c for c in r if c in pivots]:
            if p not in r:
                continue
            f = r.pop(p)
            for c, v in pivots[p].items():
                if c == p:
                    continue
                nv = r.get(c, 0) - f * v
                if _is_zero(nv):
                    r.pop(c, None)
                else:
                    r[c] = nv
        if not r:
            continue
        p = max(r, key=priority)
        f = r[p]
        r = {c: (v / f if c != p else 1) for c, v in r.items()}
        if not isinstance(f, (Fraction, int, QuadNumber)):
            r = {c: sp.simplify(v) for c, v in r.items()}
        # back-substitute into existing rows
        for q, qrow in pivots.items():
            if p in qrow:
                g = qrow.pop(p)
                for c, v in r.items():
                    if c == p:
                        continue
                    nv = qrow.get(c, 0) - g * v
                    if _is_zero(nv):
                        qrow.pop(c, None)
                    else:
                        qrow[c] = nv
        pivots[p] = r
    out = {}
    for p, r in pivots.items():
        out[p] = {c: -v for c, v in r.items() if c != p}
    return out


def rref_integer(rows, priority):
    """``rref_sparse`` for rows of Python ints, fraction-free (faster); same result.

    Each stored pivot row keeps integer entries with its pivot coefficient, and
    is divided by the gcd of its entries after every update.  Returns
    ``{pivot: {free column: Fraction}}`` like :func:`rref_sparse`.

    Examples
    --------
    >>> rref_integer([{0: 2, 1: -2, 2: -4}], priority=lambda c: c)
    {2: {0: Fraction(1, 2), 1: Fraction(-1, 2)}}
    """
    from math import gcd

    def _norm(r):
        g = 0
        for v in r.values():
            g = gcd(g, v)
        if g > 1:
            for c in r:
                r[c] //= g
        return r

    def _cancel(r, a, prow, p):
        """r := prow[p] * r - a * prow, where a was r's entry in the pivot column p (popped)."""
        b = prow[p]
        for c in r:
            r[c] *= b
        for c, v in prow.items():
            if c == p:
                continue
            nv = r.get(c, 0) - a * v
            if nv:
                r[c] = nv
            else:
                r.pop(c, None)
        return r

    pivots = {}
    for row in rows:
        r = {c: int(v) for c, v in row.items() if v}
        for p in [c for c in r if c in pivots]:
            a = r.pop(p, 0)
            if not a:
                continue
            _cancel(r, a, pivots[p], p)
        r = {c: v for c, v in r.items() if v}
        if not r:
            continue
        p = max(r, key=priority)
        if r[p] < 0:
            r = {c: -v for c, v in r.items()}
        r = _norm(r)
        for qrow in pivots.values():
            a = qrow.pop(p, 0)
            if a:
                _norm(_cancel(qrow, a, r, p))
        pivots[p] = r
    out = {}
    for p, r in pivots.items():
        b = r[p]
        out[p] = {c: Fraction(-v, b) for c, v in r.items() if c != p}
    return out
