"""Exact numbers in a cyclotomic field Q(zeta_N), for character values.

Every character value of a finite group whose element orders divide N is a
sum of N-th roots of unity, so it lies in Q(zeta_N) with zeta_N = exp(2 pi i / N).
:class:`Cyclotomic` stores such a number as rational coefficients of
1, zeta, ..., zeta^(phi(N)-1) (reduced modulo the cyclotomic polynomial), which
makes equality, sums, products and complex conjugation exact and fast; the
sympy form (radicals where sympy has them, e.g. ``-1/2 + sqrt(3)*I/2``) is made
only for display and for the public results.

This is a private kernel: callers pass consistent N.

Examples
--------
>>> from tensym.reps.cyclotomic import Cyclotomic
>>> w = Cyclotomic.root(3, 1)
>>> (w * w * w) == Cyclotomic.rational(1, 3)
True
>>> (w + w.conjugate()).to_sympy()
-1
"""

from fractions import Fraction
from functools import lru_cache
import cmath
import math

import sympy as sp

__all__ = ["Cyclotomic", "root_of_unity_sympy"]


@lru_cache(maxsize=None)
def _phi_poly(n):
    """Coefficients (low to high, ints) of the n-th cyclotomic polynomial."""
    x = sp.Symbol("x")
    p = sp.Poly(sp.cyclotomic_poly(n, x), x)
    return tuple(int(c) for c in reversed(p.all_coeffs()))


def _reduce(coeffs, n):
    """Reduce a coefficient list (in powers of zeta_n) modulo Phi_n."""
    phi = _phi_poly(n)
    deg = len(phi) - 1
    c = list(coeffs)
    for k in range(len(c) - 1, deg - 1, -1):
        a = c[k]
        if a:
            # phi is monic: zeta^k = -sum_{j<deg} phi_j zeta^(k-deg+j)
            for j in range(deg):
                if phi[j]:
                    c[k - deg + j] -= a * phi[j]
            c[k] = 0
    c = c[:deg] + [0] * max(0, deg - len(c))
    return tuple(Fraction(v) for v in c)


@lru_cache(maxsize=None)
def root_of_unity_sympy(n, k):
    """exp(2 pi i k / n) in sympy's radical form where sympy knows it.

    Examples
    --------
    >>> root_of_unity_sympy(4, 1)
    I
    """
    k %= n
    ang = sp.Rational(2 * k, n) * sp.pi
    return sp.nsimplify(sp.expand(sp.cos(ang) + sp.I * sp.sin(ang))) if n in (1, 2, 4) else sp.expand(
        sp.cos(ang) + sp.I * sp.sin(ang)
    )


class Cyclotomic:
    """An element of Q(zeta_N), immutable.

    Parameters
    ----------
    n : int
        The conductor N (numbers with different N are not mixed).
    coeffs : tuple of Fraction
        Reduced coefficients of zeta^0 ... zeta^(phi(N)-1).
    """

    __slots__ = ("n", "coeffs", "_hash")

    def __init__(self, n, coeffs):
        self.n = n
        self.coeffs = coeffs
        self._hash = None

    # --- constructors ---------------------------------------------------
    @classmethod
    def from_powers(cls, n, coeffs):
        """sum_k coeffs[k] zeta_n^k for any list of rational coefficients."""
        c = [Fraction(0)] * n
        for k, a in enumerate(coeffs):
            c[k % n] += Fraction(a)
        return cls(n, _reduce(c, n))

    @classmethod
    def root(cls, n, k):
        """zeta_n^k."""
        c = [0] * n
        c[k % n] = 1
        return cls.from_powers(n, c)

    @classmethod
    def rational(cls, q, n):
        """The rational q as an element of Q(zeta_n)."""
        return cls.from_powers(n, [Fraction(q)])

    # --- arithmetic -----------------------------------------------------
    def _full(self):
        c = [Fraction(0)] * self.n
        for k, a in enumerate(self.coeffs):
            c[k] = a
        return c

    def __add__(self, other):
        if not isinstance(other, Cyclotomic):
            other = Cyclotomic.rational(other, self.n)
        return Cyclotomic(self.n, tuple(a + b for a, b in zip(self.coeffs, other.coeffs)))

    __radd__ = __add__

    def __neg__(self):
        return Cyclotomic(self.n, tuple(-a for a in self.coeffs))

    def __sub__(self, other):
        return self + (-other)

    def __mul__(self, other):
        if not isinstance(other, Cyclotomic):
            q = Fraction(other)
            return Cyclotomic(self.n, tuple(a * q for a in self.coeffs))
        n = self.n
        prod = [Fraction(0)] * (2 * len(self.coeffs))
        for i, a in enumerate(self.coeffs):
            if a:
                for j, b in enumerate(other.coeffs):
                    if b:
                        prod[i + j] += a * b
        return Cyclotomic(n, _reduce(prod, n))

    __rmul__ = __mul__

    def __truediv__(self, q):
        q = Fraction(q)
        return Cyclotomic(self.n, tuple(a / q for a in self.coeffs))

    def conjugate(self):
        """Complex conjugate (zeta -> zeta^-1)."""
        c = [Fraction(0)] * self.n
        for k, a in enumerate(self.coeffs):
            c[(-k) % self.n] += a
        return Cyclotomic(self.n, _reduce(c, self.n))

    def __eq__(self, other):
        if isinstance(other, Cyclotomic):
            return self.n == other.n and self.coeffs == other.coeffs
        try:
            return self == Cyclotomic.rational(other, self.n)
        except (TypeError, ValueError):
            return NotImplemented

    def __hash__(self):
        if self._hash is None:
            self._hash = hash((self.n, self.coeffs))
        return self._hash

    # --- views ------------------------------------------------------------
    @property
    def is_rational(self):
        """True when the number is rational."""
        return all(a == 0 for a in self.coeffs[1:])

    @property
    def is_real(self):
        """True when the number equals its conjugate."""
        return self == self.conjugate()

    def rational_value(self):
        """The rational value (Fraction); ValueError if irrational."""
        if not self.is_rational:
            raise ValueError(f"{self.to_sympy()} is not rational")
        return self.coeffs[0]

    def __complex__(self):
        return sum(complex(a) * cmath.exp(2j * math.pi * k / self.n) for k, a in enumerate(self.coeffs))

    def to_sympy(self):
        """The sympy number (radicals where sympy evaluates the roots of unity)."""
        if self.is_rational:
            q = self.coeffs[0]
            return sp.Rational(q.numerator, q.denominator)
        total = sp.Integer(0)
        for k, a in enumerate(self.coeffs):
            if a:
                total += sp.Rational(a.numerator, a.denominator) * root_of_unity_sympy(self.n, k)
        total = sp.expand(total)
        re, im = total.as_real_imag()
        re = sp.radsimp(sp.nsimplify(sp.expand(re))) if re.free_symbols == set() else re
        im = sp.radsimp(sp.expand(im))
        re = sp.expand(re)
        im = sp.expand(sp.sqrtdenest(im))
        return sp.expand(re + sp.I * im)

    def __repr__(self):
        return f"Cyclotomic({self.n}, {self.to_sympy()})"
