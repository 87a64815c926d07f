"""Exact linear algebra over the number field of a set of matrix entries.

Private kernels for the solver.  A number field K of degree N over Q is held
by a Q-basis e_0 = 1, e_1, ..., e_(N-1) and integer structure constants
``e_a e_b = sum_c t_abc e_c`` (the list ``terms`` of (a, b, c, t)).  An element
is an integer coefficient vector of length N over a common denominator; a
vector or matrix over K is a numpy object array of Python integers whose
*first* axis runs over the N coordinates.  Nothing here has a fixed width:
integers are Python's (unbounded), and the one place that uses numpy int64
(the modular Kronecker products) works modulo primes below 2**23, where every
intermediate value is proven to stay below 2**63 (see :func:`kron_times`).

Two kinds of field:

* :class:`SqrtField` - Q(sqrt s_1, ..., sqrt s_m), basis the square roots of
  the square-free products of the s_i (N <= 2**m).  It covers every
  catalog setting (sqrt 3, sqrt 5) and rotations such as the axis
  (1, 2, 3)/sqrt(14) turned by 60 degrees.  Elements print as
  ``a + b*sqrt(2) + c*sqrt(3) + d*sqrt(6)``.
* :class:`PrimitiveField` - any other algebraic field (nested radicals such as
  sin 36 degrees = sqrt(10 - 2 sqrt 5)/4), from sympy's primitive element
  theta, scaled so that its minimal polynomial is monic with integer
  coefficients; basis 1, theta, ..., theta**(N-1).

:func:`field_of` picks the smaller one for a list of sympy numbers.

Examples
--------
>>> import sympy as sp
>>> K, den, ints = field_of([sp.sqrt(3) / 2, sp.Rational(1, 2)])
>>> K.degree, den, [list(v) for v in ints]
(2, 2, [[0, 1], [1, 0]])
>>> K.to_sympy(K.mul([0, 1], [0, 1]), 1)
3
"""

from fractions import Fraction
from functools import cmp_to_key
import math

import numpy as np
import sympy as sp

__all__ = ["SqrtField", "PrimitiveField", "field_of", "kron_times", "ModularMatrix", "rref_field",
           "element_inverse"]


_ONE = sp.Integer(1)
_COMPARE_KEY = cmp_to_key(sp.Basic.compare)


class _Field:
    """Shared arithmetic of the fields: ``degree`` and structure constants ``terms``."""

    def mul(self, x, y):
        """Product of two coefficient vectors (lists of ints)."""
        out = [0] * self.degree
        for a, b, c, t in self.terms:
            if x[a] and y[b]:
                out[c] += t * x[a] * y[b]
        return out


class SqrtField(_Field):
    """Q(sqrt s for s in radicands): basis sqrt(r) for r in the group the radicands generate.

    The basis runs over the square-free numbers r reachable as products of the
    given square-free radicands modulo squares (sqrt(s) sqrt(t) = g sqrt(st/g**2)
    with g = gcd(s, t)), so Q(sqrt 42) has degree 2, not the 8 of
    Q(sqrt 2, sqrt 3, sqrt 7).
    """

    def __init__(self, radicands):
        basis = [1]
        for s in sorted(set(radicands)):
            if s in basis:
                continue
            basis = basis + [_sqfree_product(s, r)[0] for r in basis]
        self.radicands = basis
        self.degree = len(basis)
        index = {r: i for i, r in enumerate(basis)}
        terms = []
        for a, ra in enumerate(basis):
            for b, rb in enumerate(basis):
                r, g = _sqfree_product(ra, rb)
                terms.append((a, b, index[r], g))
        self.terms = tuple(terms)
        self.key = ("sqrt", tuple(basis))
        self._roots = [_ONE] + [sp.sqrt(s) for s in basis[1:]]

    def coordinates(self, x):
        """Rational coordinates (list of Fraction) of a sympy number, or None if x is not in the field."""
        out = [Fraction(0)] * self.degree
        index = {s: i for i, s in enumerate(self.radicands)}
        for term in sp.Add.make_args(sp.expand(x)):
            if term.is_Rational:
                out[0] += Fraction(int(term.p), int(term.q))
                continue
            coeff, rest = term.as_coeff_Mul()
            if not (coeff.is_Rational and rest.is_Pow and rest.exp == sp.S.Half and rest.base.is_Integer):
                return None
            i = index.get(int(rest.base))
            if i is None:
                return None
            out[i] += Fraction(int(coeff.p), int(coeff.q))
        return out

    def to_sympy(self, ints, den):
        """The sympy number sum(ints[a] sqrt(s_a)) / den, built in sympy's canonical form.

        The terms are assembled without re-running sympy's flattening (ten
        times faster); the result equals ``sympy.Add(*terms)`` (tested).
        """
        den = int(den)
        terms = []
        for c, r in zip(ints, self._roots):
            if not c:
                continue
            c = int(c)
            g = math.gcd(c, den)
            q = sp.Rational(c // g, den // g) if den // g != 1 else sp.Integer(c // g)
            if r is _ONE:
                terms.append(q)
            elif q is sp.S.One:
                terms.append(r)
            else:
                terms.append(sp.Mul._from_args((q, r)))
        if not terms:
            return sp.Integer(0)
        if len(terms) == 1:
            return terms[0]
        head = [t for t in terms if t.is_Rational]
        rest = sorted((t for t in terms if not t.is_Rational), key=_COMPARE_KEY)
        return sp.Add._from_args(tuple(head + rest))


class PrimitiveField(_Field):
    """Q(theta) with theta an algebraic integer (monic integer minimal polynomial).

    ``theta_expr`` is theta as a sympy expression; ``expressions`` gives each
    given number as coordinates in the basis 1, theta, ..., theta**(N-1).
    """

    def __init__(self, numbers):
        x = sp.Dummy("x")
        from sympy.polys.numberfields.subfield import primitive_element

        minpoly, coeffs, reps = primitive_element(list(numbers), x, ex=True)
        poly = sp.Poly(minpoly, x)
        c = [sp.Rational(v) for v in poly.all_coeffs()]
        lcm = math.lcm(*[int(v.q) for v in c])
        c = [int(v * lcm) for v in c]
        g = math.gcd(*c)
        c = [v // g for v in c]
        if c[0] < 0:
            c = [-v for v in c]
        n = len(c) - 1
        lead = c[0]
        # theta' = lead * theta has the monic integer minimal polynomial below
        monic = [1] + [c[i] * lead ** (i - 1) for i in range(1, n + 1)]
        self.degree = n
        self.monic = monic
        theta = sp.Add(*[int(k) * e for k, e in zip(coeffs, numbers)])
        self.theta_expr = sp.expand(lead * theta)
        self._powers = [sp.Integer(1)]
        for _ in range(1, n):
            self._powers.append(sp.expand(self._powers[-1] * self.theta_expr))
        self.terms = self._structure()
        self.key = ("prim", tuple(monic), sp.srepr(self.theta_expr))
        # coordinates of the given numbers in the theta' basis
        self.given = []
        for rep in reps:
            # rep: coefficients of theta**(len-1), ..., theta**0 (highest first)
            rep = [Fraction(int(v.numerator), int(v.denominator)) for v in rep]
            coords = [Fraction(0)] * n
            deg = len(rep) - 1
            for i, v in enumerate(rep):
                power = deg - i
                coords[power] += v / Fraction(lead) ** power
            self.given.append(coords)

    def _structure(self):
        n = self.degree
        # reduction of theta**k for k < 2n - 1 in the basis
        red = []
        for k in range(2 * n - 1):
            if k < n:
                v = [0] * n
                v[k] = 1
            else:
                prev = red[k - 1]
                v = [0] + prev[:-1]
                top = prev[-1]
                for i in range(n):
                    v[i] -= top * self.monic[n - i]
            red.append(v)
        terms = []
        for a in range(n):
            for b in range(n):
                for c, t in enumerate(red[a + b]):
                    if t:
                        terms.append((a, b, c, t))
        return tuple(terms)

    def to_sympy(self, ints, den):
        terms = [sp.Rational(int(c), int(den)) * p for c, p in zip(ints, self._powers) if c]
        return sp.expand(sp.Add(*terms)) if terms else sp.Integer(0)


def _sqfree_product(s, t):
    """(r, g) with sqrt(s) sqrt(t) = g sqrt(r), r square-free, for square-free s, t."""
    g = math.gcd(s, t)
    return (s // g) * (t // g), g


def _sqrt_radicands(numbers):
    """Square-free radicands when every number is a sum of rational multiples of sqrt(integer), else None."""
    primes = set()
    for x in numbers:
        for term in sp.Add.make_args(sp.expand(x)):
            if term.is_Rational:
                continue
            coeff, rest = term.as_coeff_Mul()
            if not (coeff.is_Rational and rest.is_Pow and rest.exp == sp.S.Half and rest.base.is_Integer
                    and rest.base > 1):
                return None
            primes.add(int(rest.base))  # sympy keeps sqrt arguments square-free
    return primes


_FIELDS = {}


def field_of(numbers):
    """(field, den, ints): a field holding the sympy numbers and their integer coordinates.

    ``ints[i] / den`` are the coordinates of ``numbers[i]`` (object arrays of
    Python ints).  Cached per tuple of numbers.
    """
    numbers = tuple(sp.sympify(x) for x in numbers)
    key = numbers
    hit = _FIELDS.get(key)
    if hit is not None:
        return hit
    radicands = _sqrt_radicands(numbers)
    if radicands is not None:
        field = SqrtField(radicands)
        coords = [field.coordinates(x) for x in numbers]
    else:
        irr = [x for x in numbers if not x.is_Rational]
        uniq = list(dict.fromkeys(irr))
        field = PrimitiveField(uniq)
        pos = {x: i for i, x in enumerate(uniq)}
        coords = []
        for x in numbers:
            if x.is_Rational:
                v = [Fraction(0)] * field.degree
                v[0] = Fraction(int(x.p), int(x.q))
                coords.append(v)
            else:
                coords.append(field.given[pos[x]])
    den = 1
    for v in coords:
        for c in v:
            den = math.lcm(den, c.denominator)
    ints = [np.array([int(c * den) for c in v], dtype=object) for v in coords]
    out = (field, den, ints)
    if len(_FIELDS) < 4096:
        _FIELDS[key] = out
    return out


# --- modular Kronecker products -------------------------------------------------
_PRIME_LIMIT = 2**23


def _primes_below(limit, count):
    out = []
    p = limit - 1
    while len(out) < count:
        if sp.isprime(p):
            out.append(p)
        p -= 2 if p % 2 else 1
    return out


_PRIMES = _primes_below(_PRIME_LIMIT, 64)


def _primes_for(bound):
    """The fewest primes of the table whose product exceeds 2 * bound + 1 (so CRT recovers |x| <= bound), or None."""
    need = int(2 * bound + 1).bit_length()
    primes, acc = [], 0.0
    for p in _PRIMES:
        primes.append(p)
        acc += math.log2(p)
        if acc > need + 1:
            return primes
    return None


def kron_times(reps, A, field, right):
    """Exact ``K @ right`` where K[o, flat] = prod_j A[reps[o, j], idx_j(flat)] over the field.

    Parameters
    ----------
    reps : int array (n, rank)
        Representative index tuples.
    A : object array (N, 3, 3) of Python ints
        Integer coordinates of a 3x3 matrix over the field.
    field : SqrtField or PrimitiveField
    right : object or int array (3**rank, m) of Python ints

    Returns
    -------
    object array (N, n, m) of Python ints.

    Notes
    -----
    Computed modulo primes p < 2**23 and recombined by the Chinese remainder
    theorem.  Bounds: every residue is below p, a field product adds at most
    len(terms) values t * x * y with x, y < p and |t| <= tmax, so one step stays
    below len(terms) * tmax * 2**46 (checked < 2**63 before use, else the
    exact object path is taken), and the final product sums 3**rank values
    below 2**46 (checked likewise).  The number of primes comes from the
    a-priori bound |K @ right| <= 3**rank (T tmax)**(rank-1) max|A|**rank max|right|,
    T the number of structure terms (a product's coordinate is a sum of at most T
    terms t x y).
    """
    n, rank = reps.shape
    N = field.degree
    right = np.asarray(right, dtype=object)
    terms = field.terms
    tmax = max(abs(t) for *_, t in terms)
    amax = max((abs(int(v)) for v in A.ravel()), default=0)
    rmax = max((abs(int(v)) for v in right.ravel()), default=0)
    m = right.shape[1]
    if n == 0 or m == 0 or amax == 0 or rmax == 0:
        return np.zeros((N, n, m), dtype=object)
    bound = 3**rank * (len(terms) * tmax) ** max(rank - 1, 0) * amax**rank * rmax
    step_ok = len(terms) * tmax * 2**46 < 2**62
    final_ok = 3**rank * 2**46 < 2**62
    if not (step_ok and final_ok):
        return _kron_times_exact(reps, A, field, right)
    primes = _primes_for(bound)
    if primes is None:  # pragma: no cover - a bound beyond 64 * 23 bits: exact path
        return _kron_times_exact(reps, A, field, right)
    residues = []
    for p in primes:
        Ap = np.array([[[int(v) % p for v in row] for row in comp] for comp in A], dtype=np.int64)
        Rp = np.array([[int(v) % p for v in row] for row in right], dtype=np.int64)
        residues.append(_kron_mod(reps, Ap, terms, N, Rp, p))
    return _crt(residues, primes)


def _kron_mod(reps, Ap, terms, N, Rp, p):
    n, rank = reps.shape
    k = Ap[:, reps[:, 0], :]  # (N, n, 3)
    for j in range(1, rank):
        r = Ap[:, reps[:, j], :]  # (N, n, 3)
        new = np.zeros((N, n, k.shape[2] * 3), dtype=np.int64)
        for a, b, c, t in terms:
            prod = (k[a][:, :, None] * r[b][:, None, :]).reshape(n, -1)
            new[c] += (t % p) * (prod % p) % p
            new[c] %= p
        k = new
    out = np.empty((N, n, Rp.shape[1]), dtype=np.int64)
    for c in range(N):
        out[c] = (k[c] @ Rp) % p
    return out


def _crt(residues, primes):
    M = 1
    for p in primes:
        M *= p
    total = np.zeros(residues[0].shape, dtype=object)
    for r, p in zip(residues, primes):
        Mi = M // p
        inv = pow(Mi, -1, p)
        total = total + r.astype(object) * (Mi * inv)
    total = total % M
    half = M // 2
    return np.where(total > half, total - M, total)


class ModularMatrix:
    """An exact integer array (N, n, n) with cached residues, for repeated exact products.

    ``times(B)`` is the exact product ``M[c] @ B`` for every coordinate c,
    computed modulo primes below 2**23 (int64 sums of n values below 2**46,
    exact while n < 2**16) and recombined by the Chinese remainder theorem.
    """

    def __init__(self, M):
        self.exact = M
        self.max = max((abs(int(v)) for v in M.ravel()), default=0)
        self._res = {}

    def _residue(self, p):
        r = self._res.get(p)
        if r is None:
            r = (self.exact % p).astype(np.int64)
            self._res[p] = r
        return r

    def times(self, B):
        B = np.asarray(B, dtype=object)
        N, n, _ = self.exact.shape
        bmax = max((abs(int(v)) for v in B.ravel()), default=0)
        if self.max == 0 or bmax == 0:
            return np.zeros((N, n, B.shape[1]), dtype=object)
        if n >= 2**16:  # pragma: no cover - far beyond any reduced space tensym builds
            return np.stack([self.exact[c].dot(B) for c in range(N)])
        primes = _primes_for(n * self.max * bmax)
        if primes is None:  # pragma: no cover - a bound beyond 64 * 23 bits
            return np.stack([self.exact[c].dot(B) for c in range(N)])
        residues = []
        for p in primes:
            Mp = self._residue(p)
            Bp = (B % p).astype(np.int64)
            residues.append(np.stack([(Mp[c] @ Bp) % p for c in range(N)]))
        return _crt(residues, primes)


def _kron_times_exact(reps, A, field, right):
    """The same product with Python integers throughout (slow, unbounded)."""
    n, rank = reps.shape
    N = field.degree
    k = A[:, reps[:, 0], :]
    for j in range(1, rank):
        r = A[:, reps[:, j], :]
        new = np.zeros((N, n, k.shape[2] * 3), dtype=object)
        for a, b, c, t in field.terms:
            new[c] = new[c] + t * (k[a][:, :, None] * r[b][:, None, :]).reshape(n, -1)
        k = new
    return np.stack([k[c].dot(right) for c in range(N)])


# --- elimination -----------------------------------------------------------------
def _mul_row(field, x, row):
    """Element x (length-N ints) times a row (N, n) object array."""
    out = np.zeros(row.shape, dtype=object)
    for a, b, c, t in field.terms:
        xa = x[a]
        if xa:
            out[c] = out[c] + (t * xa) * row[b]
    return out


def element_inverse(field, x):
    """(u, g): integer vector u and positive integer g with u * x = g (x nonzero)."""
    N = field.degree
    # matrix of multiplication by x: column b is x * e_b
    Mx = [[Fraction(0)] * N for _ in range(N)]
    for a, b, c, t in field.terms:
        if x[a]:
            Mx[c][b] += t * int(x[a])
    # solve Mx y = e_0 by Gauss-Jordan over Fractions
    aug = [row[:] + [Fraction(1 if i == 0 else 0)] for i, row in enumerate(Mx)]
    for col in range(N):
        piv = next(r for r in range(col, N) if aug[r][col] != 0)
        aug[col], aug[piv] = aug[piv], aug[col]
        pv = aug[col][col]
        aug[col] = [v / pv for v in aug[col]]
        for r in range(N):
            if r != col and aug[r][col] != 0:
                f = aug[r][col]
                aug[r] = [v - f * w for v, w in zip(aug[r], aug[col])]
    y = [aug[i][N] for i in range(N)]
    den = 1
    for v in y:
        den = math.lcm(den, v.denominator)
    u = [int(v * den) for v in y]
    g = math.gcd(*u) if any(u) else 1
    u = [v // g for v in u]
    return u, den // g


def _normalise(row):
    """The row divided by the gcd of its entries (numpy's gcd on Python ints)."""
    g = int(np.gcd.reduce(row.ravel()))
    if g > 1:
        return row // g
    return row


def rref_field(field, rows, column_order):
    """Reduced row echelon form over the field, pivots chosen in ``column_order``.

    Parameters
    ----------
    rows : list of object arrays (N, n) of Python ints
        The rows (each an n-vector over the field).
    column_order : sequence of int
        Columns in the order pivots are sought: the first column (in this
        order) where a remaining row is nonzero becomes the next pivot.

    Returns
    -------
    list of (pivot column, row, g)
        ``row / g`` has 1 at its pivot and 0 at the other pivots; ``g`` is a
        positive Python int (pivots are made rational by the element inverse).
    """
    rows = [np.array(r, dtype=object) for r in rows]
    rows = [r for r in rows if any(v for v in r.ravel())]
    done = []  # (col, row, g)
    for col in column_order:
        if not rows:
            break
        idx = next((i for i, r in enumerate(rows) if any(r[:, col])), None)
        if idx is None:
            continue
        pr = rows.pop(idx)
        b = [int(v) for v in pr[:, col]]
        if any(b[1:]):
            u, _ = element_inverse(field, b)
            pr = _mul_row(field, u, pr)
        pr = _normalise(pr)
        if pr[0, col] < 0:
            pr = -pr
        g = int(pr[0, col])
        new_rows = []
        for r in rows:
            a = [int(v) for v in r[:, col]]
            if any(a):
                r = _normalise(g * r - _mul_row(field, a, pr))
                if not any(v for v in r.ravel()):
                    continue
            new_rows.append(r)
        rows = new_rows
        new_done = []
        for c2, r, g2 in done:
            a = [int(v) for v in r[:, col]]
            if any(a):
                r = g * r - _mul_row(field, a, pr)
                # keep the pivot rational: r[:, c2] was (g2, 0, ...) and is now g * g2
                r = _normalise(r)
                g2 = int(r[0, c2])
            new_done.append((c2, r, g2))
        done = new_done
        done.append((col, pr, g))
    return done
