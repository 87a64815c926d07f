"""Function spaces of point-group representations: polynomials and harmonics.

Conventions
-----------
* Functions of the Cartesian coordinates ``x, y, z`` (plain sympy Symbols,
  :data:`X`, :data:`Y`, :data:`Z`) transform actively: an operation g maps f to
  ``(g f)(r) = f(g^-1 r)``, so that ``D(g @ h) = D(g) D(h)`` and the coordinate
  function x transforms like the vector (1, 0, 0).
* The natural inner product is the Fischer (apolar) product
  ``<p, q> = p(d/dx, d/dy, d/dz) q``, which is invariant under O(3); on monomials it
  is ``<x^a y^b z^c, x^a y^b z^c> = a! b! c!`` and zero between distinct
  monomials.  On the harmonics of one degree it is proportional to the
  average over the unit sphere.
* ``harmonics(l)`` spans the harmonic polynomials of degree l (the real solid
  harmonics, the space of D^l); its parity says how the inversion acts ('g': +1,
  'u': -1), by default (-1)^l as for functions of r.  With the other parity the
  space is D^l times the pseudoscalar det(g) (an axial, or pseudo-, harmonic).
* Basis of ``harmonics(l)``: for m = 0, 1, ..., l the real and imaginary parts
  of (x + i y)^m times the z/r polynomial of the associated Legendre function,
  each scaled by a positive factor to coprime integer coefficients: ordered
  m = 0, then (cos, sin) pairs for m = 1 .. l.

Examples
--------
>>> h = harmonics(2)
>>> h.dim, h.parity
(5, 'g')
>>> h.basis[0]
-x**2 - y**2 + 2*z**2
>>> polynomials(2).dim
6
"""

from functools import lru_cache
from math import comb, factorial

import sympy as sp
from sympy.polys.matrices import DomainMatrix

from tensym.errors import InvalidOptionError, RepresentationError
from tensym.reps.space import Space

__all__ = ["X", "Y", "Z", "PolynomialSpace", "HarmonicSpace", "polynomials", "harmonics", "MAX_DEGREE"]

X, Y, Z = sp.symbols("x y z")
_XYZ = (X, Y, Z)
#: Largest polynomial degree / angular momentum accepted.
MAX_DEGREE = 24


@lru_cache(maxsize=None)
def monomials(n):
    """Exponent tuples (a, b, c) with a + b + c = n, x^n first (lexicographic, descending)."""
    return tuple((a, b, n - a - b) for a in range(n, -1, -1) for b in range(n - a, -1, -1))


@lru_cache(maxsize=None)
def _monomial_index(n):
    return {m: i for i, m in enumerate(monomials(n))}


def _mono_expr(e):
    return X ** e[0] * Y ** e[1] * Z ** e[2]


def _poly_coords(expr, n, what="polynomial"):
    """Coordinates of a homogeneous polynomial of degree n in the monomial basis."""
    try:
        p = sp.Poly(sp.expand(sp.sympify(expr)), *_XYZ)
    except (sp.PolynomialError, sp.SympifyError, TypeError) as exc:
        raise RepresentationError(f"{expr!r} is not a polynomial in x, y, z") from exc
    idx = _monomial_index(n)
    out = [sp.Integer(0)] * len(idx)
    for mono, c in p.terms():
        if sum(mono) != n:
            if c != 0:
                raise RepresentationError(f"{expr} is not a homogeneous {what} of degree {n} (term of degree {sum(mono)})")
            continue
        out[idx[mono]] = c
    return out


@lru_cache(maxsize=4096)
def _monomial_action_dm(matrix_key, matrix, n):
    """DomainMatrix of f -> f(g^-1 r) on degree-n monomials, over the field of the entries."""
    from tensym.reps.linalg import to_dm

    dm = to_dm(matrix)
    K = dm.domain
    m = dm.to_list()
    zero = K.zero
    # linear forms x_i o g^-1 = sum_j g_{ji} x_j, as dicts exponent -> coefficient
    units = ((1, 0, 0), (0, 1, 0), (0, 0, 1))
    lin = [{units[j]: m[j][i] for j in range(3) if m[j][i] != zero} for i in range(3)]

    def mul(p, q):
        out = {}
        for e1, c1 in p.items():
            for e2, c2 in q.items():
                e = (e1[0] + e2[0], e1[1] + e2[1], e1[2] + e2[2])
                out[e] = out.get(e, zero) + c1 * c2
        return out

    powers = [[{(0, 0, 0): K.one}] for _ in range(3)]
    for i in range(3):
        for _k in range(n):
            powers[i].append(mul(powers[i][-1], lin[i]))
    idx = _monomial_index(n)
    mons = monomials(n)
    N = len(mons)
    rows = [[zero] * N for _ in range(N)]
    for col, (a, b, c) in enumerate(mons):
        img = mul(mul(powers[0][a], powers[1][b]), powers[2][c])
        for e, v in img.items():
            if v != zero:
                rows[idx[e]][col] = v
    return DomainMatrix(rows, (N, N), K)


def _fischer(n):
    return [factorial(a) * factorial(b) * factorial(c) for a, b, c in monomials(n)]


@lru_cache(maxsize=8192)
def _chi_l(l, trace):
    """Character of D^l at a proper rotation with the given trace: 1 + 2 sum_m T_m(cos t) (cached)."""
    c = (sp.sympify(trace) - 1) / 2
    total = sp.Integer(1)
    t_prev, t_cur = sp.Integer(1), c
    for _m in range(1, l + 1):
        total += 2 * t_cur
        t_prev, t_cur = t_cur, sp.expand(2 * c * t_cur - t_prev)
    return sp.expand(total)


def harmonic_character(l, op, parity_sign):
    """chi of D^l (inversion acting as ``parity_sign``) at ``op``: exact, from the trace."""
    det = op.det
    proper = op.matrix if det == 1 else -op.matrix
    chi = _chi_l(l, sp.expand(proper.trace()))
    if det == -1:
        chi = parity_sign * chi
    return sp.radsimp(chi) if not chi.is_Rational else chi


def _check_degree(n, name):
    if isinstance(n, bool) or not isinstance(n, int):
        try:
            import numpy as np

            if isinstance(n, np.integer):
                n = int(n)
            else:
                raise TypeError
        except TypeError:
            raise InvalidOptionError(f"{name} must be a non-negative integer, got {n!r}") from None
    if not 0 <= n <= MAX_DEGREE:
        raise InvalidOptionError(f"{name} must be between 0 and {MAX_DEGREE}, got {n}")
    return n


class PolynomialSpace(Space):
    """Homogeneous polynomials of one degree in x, y, z, in the monomial basis.

    Parameters
    ----------
    degree : int
        The degree n (dimension (n + 1)(n + 2)/2).

    Examples
    --------
    >>> p = polynomials(1)
    >>> p.basis
    (x, y, z)
    >>> p.coordinates(2*X - Y)
    (2, -1, 0)
    """

    def __init__(self, degree):
        self._degree = _check_degree(degree, "degree")
        self._basis = tuple(_mono_expr(e) for e in monomials(self._degree))

    # read-only: the spaces are shared through a cache (polynomials(n) returns one object per n)
    degree = property(lambda self: self._degree, doc="The degree n (int, read-only).")
    basis = property(lambda self: self._basis, doc="The monomials, x**n first (tuple of sympy expressions).")

    @property
    def dim(self):
        return len(self.basis)

    def action(self, op):
        from tensym.reps.linalg import to_sympy_matrix

        return to_sympy_matrix(self._action_dm(op))

    def _action_dm(self, op):
        return _monomial_action_dm(op.key, op.matrix, self.degree)

    def lie_action(self, generator):
        return _monomial_lie(sp.ImmutableMatrix(generator), self.degree)

    def character(self, op):
        # Sym^n R = sum over harmonics l = n, n-2, ... with parity (-1)^l = (-1)^n
        total = sp.Integer(0)
        for l in range(self.degree % 2, self.degree + 1, 2):
            total += harmonic_character(l, op, (-1) ** l)
        return sp.radsimp(sp.expand(total))

    def element(self, coords):
        return sp.expand(sum(sp.sympify(c) * b for c, b in zip(coords, self.basis)))

    def coordinates(self, obj):
        return tuple(_poly_coords(obj, self.degree))

    def gram(self):
        return sp.ImmutableMatrix(sp.diag(*_fischer(self.degree)))

    def __repr__(self):
        return f"polynomials({self.degree})"

    def __eq__(self, other):
        return isinstance(other, PolynomialSpace) and other.degree == self.degree

    def __hash__(self):
        return hash(("polynomials", self.degree))


@lru_cache(maxsize=None)
def _monomial_lie(generator, n):
    """Matrix of f -> d/dt f(exp(-tL) r) at t=0, i.e. -grad f . (L r), on degree-n monomials."""
    L = sp.Matrix(generator)
    idx = _monomial_index(n)
    mons = monomials(n)
    out = sp.zeros(len(mons), len(mons))
    lr = [sum(L[i, j] * _XYZ[j] for j in range(3)) for i in range(3)]
    for col, e in enumerate(mons):
        f = _mono_expr(e)
        img = sp.expand(-sum(sp.diff(f, _XYZ[i]) * lr[i] for i in range(3)))
        if img == 0:
            continue
        for mono, c in sp.Poly(img, *_XYZ).terms():
            out[idx[mono], col] = c
    return sp.ImmutableMatrix(out)


@lru_cache(maxsize=None)
def harmonic_basis(l):
    """The real solid harmonics of degree l (tuple of sympy polynomials), integer coefficients."""
    r2 = X**2 + Y**2 + Z**2
    out = []
    for m in range(0, l + 1):
        # z-part: d^m/dt^m P_l(t) made homogeneous with r
        zpart = sp.Integer(0)
        for k in range(0, (l - m) // 2 + 1):
            coeff = sp.Rational((-1) ** k * comb(l, k) * comb(2 * l - 2 * k, l) * factorial(l - 2 * k),
                                factorial(l - 2 * k - m) * 2**l)
            zpart += coeff * Z ** (l - 2 * k - m) * r2**k
        re_part = sum(comb(m, k) * (-1) ** (k // 2) * X ** (m - k) * Y**k for k in range(0, m + 1, 2))
        im_part = sum(comb(m, k) * (-1) ** ((k - 1) // 2) * X ** (m - k) * Y**k for k in range(1, m + 1, 2))
        parts = [sp.sympify(re_part)] + ([sp.sympify(im_part)] if m > 0 else [])
        for part in parts:
            out.append(_primitive(sp.expand(zpart * part)))
    return tuple(out)


def _primitive(expr):
    """Scale a polynomial by a positive rational to coprime integer coefficients."""
    if expr == 0:
        return expr
    p = sp.Poly(expr, *_XYZ, domain="QQ")
    _den, p = p.clear_denoms(convert=True)
    _content, prim = p.primitive()
    return prim.as_expr()


class HarmonicSpace(Space):
    """The harmonic polynomials of degree l: the space of D^l, with a parity.

    Parameters
    ----------
    l : int
        Angular momentum (dimension 2l + 1).
    parity : {'g', 'u'}
        Action of the inversion (+1 for 'g', -1 for 'u').

    Examples
    --------
    >>> h = harmonics(1)
    >>> h.basis
    (z, x, y)
    >>> harmonics(1, parity="g").parity
    'g'
    """

    def __init__(self, l, parity):
        self._l = l
        self._parity = parity
        self._basis = harmonic_basis(l)
        self._H = sp.ImmutableMatrix(sp.Matrix([_poly_coords(b, l, "harmonic") for b in self._basis]).T)
        self._pinv = None
        self._dm = None

    # read-only: the spaces are shared through a cache (harmonics(l) returns one object per (l, parity))
    l = property(lambda self: self._l, doc="The angular momentum l (int, read-only).")
    parity = property(lambda self: self._parity, doc="'g' or 'u' (read-only).")
    basis = property(lambda self: self._basis, doc="The real solid harmonics (tuple of sympy polynomials).")

    @property
    def dim(self):
        return 2 * self.l + 1

    @property
    def parity_sign(self):
        """+1 for 'g', -1 for 'u'."""
        return 1 if self.parity == "g" else -1

    def _gram_dm(self):
        """(H^T F H, H^T F) as DomainMatrices over QQ, F the Fischer weights (exact, computed once)."""
        if getattr(self, "_gram_parts", None) is None:
            H = DomainMatrix.from_Matrix(sp.Matrix(self._H)).convert_to(sp.QQ)
            F = DomainMatrix.diag([sp.QQ(v) for v in _fischer(self.l)], sp.QQ)
            HtF = H.transpose() * F
            self._gram_parts = (HtF * H, HtF)
        return self._gram_parts

    def _left_inverse(self):
        if self._pinv is None:
            G, HtF = self._gram_dm()  # G is diagonal: the basis is orthogonal
            inv = DomainMatrix.diag([sp.QQ.one / G[i, i].element for i in range(self.dim)], sp.QQ)
            self._pinv = sp.ImmutableMatrix((inv * HtF).to_Matrix())
        return self._pinv

    def action(self, op):
        # the substitution f(g^-1 r) already gives (-1)^l for the inversion
        from tensym.reps.linalg import to_sympy_matrix

        return to_sympy_matrix(self._action_dm(op))

    def _action_dm(self, op):
        sign = self.parity_sign * (-1) ** self.l if op.det == -1 else 1
        return _harmonic_action_dm(self.l, op.key, op.matrix, sign)

    def lie_action(self, generator):
        M = _monomial_lie(sp.ImmutableMatrix(generator), self.l)
        return sp.ImmutableMatrix(self._left_inverse() * M * self._H)

    def character(self, op):
        return harmonic_character(self.l, op, self.parity_sign)

    def element(self, coords):
        return sp.expand(sum(sp.sympify(c) * b for c, b in zip(coords, self.basis)))

    def coordinates(self, obj):
        v = sp.Matrix(_poly_coords(obj, self.l, "harmonic polynomial"))
        c = self._left_inverse() * v
        if (self._H * c - v).applyfunc(sp.expand) != sp.zeros(v.shape[0], 1):
            raise RepresentationError(f"{obj} is not harmonic (its Laplacian is not zero)")
        return tuple(sp.expand(e) for e in c)

    def gram(self):
        return sp.ImmutableMatrix(self._gram_dm()[0].to_Matrix())

    def __repr__(self):
        return f"harmonics({self.l}, parity={self.parity!r})"

    def __eq__(self, other):
        return isinstance(other, HarmonicSpace) and (other.l, other.parity) == (self.l, self.parity)

    def __hash__(self):
        return hash(("harmonics", self.l, self.parity))


@lru_cache(maxsize=8192)
def _harmonic_action_dm(l, key, matrix, sign):
    from sympy.polys.matrices import DomainMatrix

    h = harmonics(l)
    M = _monomial_action_dm(key, matrix, l)
    K = M.domain
    if h._dm is None:
        h._dm = (DomainMatrix.from_Matrix(sp.Matrix(h._left_inverse())), DomainMatrix.from_Matrix(h._H))
    L, H = h._dm
    D = L.convert_to(K) * M * H.convert_to(K)
    if sign != 1:
        D = -D
    return D


@lru_cache(maxsize=None)
def _harmonics_cached(l, parity):
    return HarmonicSpace(l, parity)


def harmonics(l, parity=None):
    """The space of D^l: harmonic polynomials of degree l in x, y, z.

    Parameters
    ----------
    l : int
        Angular momentum, 0 <= l <= MAX_DEGREE.
    parity : {'g', 'u'}, optional
        Sign of the inversion: 'g' even, 'u' odd; default (-1)^l (ordinary
        functions of r).  The other choice gives the pseudo-harmonics D^l x det.

    Returns
    -------
    HarmonicSpace

    Raises
    ------
    InvalidOptionError
        For a negative or too large ``l`` or a parity other than 'g', 'u'.

    Examples
    --------
    >>> harmonics(3)
    harmonics(3, parity='u')
    >>> harmonics(1, parity="g").dim
    3
    """
    l = _check_degree(l, "l")
    if parity is None:
        parity = "g" if l % 2 == 0 else "u"
    if parity not in ("g", "u"):
        raise InvalidOptionError(f"parity must be 'g' or 'u' (or None for (-1)^l), got {parity!r}")
    return _harmonics_cached(l, parity)


@lru_cache(maxsize=None)
def _polynomials_cached(n):
    return PolynomialSpace(n)


def polynomials(degree):
    """The space of homogeneous polynomials of a given degree in x, y, z.

    Raises
    ------
    InvalidOptionError
        For a negative or too large degree.

    Examples
    --------
    >>> polynomials(3).dim
    10
    """
    return _polynomials_cached(_check_degree(degree, "degree"))
