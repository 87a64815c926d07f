"""The exact invariant solver: the symmetry-allowed subspace of a tensor space.

A tensor is invariant under a group when it is invariant under the group's
generators (and annihilated by its Lie generators), so only generators are
used and the whole-group average is never formed.  The unknowns are the
coordinates of the reduced space left by the intrinsic index symmetry (21 for
elasticity), scaled by the property's Voigt factors, so that relations come out
between the Voigt constants a handbook lists.

Method, in order:

1. signed-permutation generators give two-term relations v_a = r v_b, merged by
   a union-find with ratios (no linear algebra);
2. the remaining generators (3- and 6-folds, any other matrix) and the Lie
   generators give dense rows, reduced exactly by ``rref_sparse`` on the
   union-find classes.  Rows with entries a + b sqrt(d) are split into their
   rational parts when the group is mapped to itself by sqrt(d) -> -sqrt(d)
   (then the invariant subspace has a rational basis); otherwise the reduction
   runs in Q(sqrt(d)), or with sympy numbers for larger fields.

The free unknowns are the lowest in the priority order (handbook choice:
lowest Voigt indices first), since every row's pivot is its highest unknown.

Examples
--------
>>> from tensym.tensors.spec import TensorSpec
>>> from tensym.tensors.solver import solve_invariants
>>> from tensym.groups.continuous import continuous_group
>>> sol = solve_invariants(TensorSpec(2, ["ji"]), continuous_group("Dinfh"))
>>> sol.free
(0, 5)
"""

from dataclasses import dataclass
from fractions import Fraction
import math

import numpy as np
import sympy as sp

from tensym.errors import TensymError
from tensym.exact.fields import ModularMatrix, field_of, kron_times, rref_field
from tensym.exact.linalg import QuadNumber, rref_integer, rref_sparse
from tensym.exact.matrices import float_key
from tensym.tensors.kernels import (
    integer_generator,
    _rep_array,
    lie_action,
    monomial_action,
    monomial_form,
    quadratic_action,
    quadratic_form,
    sympy_action,
)

__all__ = ["Solution", "solve_invariants"]


@dataclass(frozen=True)
class Solution:
    """Exact invariant subspace in reduced coordinates (private result of the kernel).

    Attributes
    ----------
    free : tuple of int
        Orbit numbers of the independent unknowns, in priority order (lowest first).
    coeffs : tuple of tuple of (int, sympy number)
        For each orbit o, the expansion v_o = sum(c * v_free) as pairs
        (position in ``free``, c); empty for a vanishing unknown.
    """

    free: tuple
    coeffs: tuple


class _UnionFind:
    def __init__(self, n, key):
        self.parent = list(range(n))
        self.ratio = [1.0] * n  # v_x = ratio[x] * v_parent[x]; signed powers of two, exact in float
        self.zero = [False] * n
        self.key = key

    def find(self, x):
        r = 1.0
        path = []
        while self.parent[x] != x:
            path.append(x)
            r *= self.ratio[x]
            x = self.parent[x]
        # path compression
        acc = r
        for y in path:
            ry = self.ratio[y]
            self.parent[y] = x
            self.ratio[y] = acc
            acc = acc / ry
        return x, r

    def relate(self, a, b, r):
        """Impose v_a = r * v_b."""
        ra, qa = self.find(a)
        rb, qb = self.find(b)
        if ra == rb:
            if qa != r * qb:
                self.zero[ra] = True
            return
        # v_ra = (r qb / qa) v_rb
        k = r * qb / qa
        if self.key(ra) <= self.key(rb):
            self.parent[rb], self.ratio[rb] = ra, 1 / k
            self.zero[ra] = self.zero[ra] or self.zero[rb]
        else:
            self.parent[ra], self.ratio[ra] = rb, k
            self.zero[rb] = self.zero[ra] or self.zero[rb]


_STABLE = {}


def _galois_stable(group, d):
    """True when conjugating sqrt(d) -> -sqrt(d) maps the group's operations onto themselves.

    Cached per (generators, d).
    """
    key = (tuple(g.key for g in group.generators), d)
    if key not in _STABLE:
        _STABLE[key] = _galois_stable_uncached(group, d)
    return _STABLE[key]


def _galois_stable_uncached(group, d):
    if getattr(group, "is_continuous", False):
        return False
    ops = group.operations
    keys = {op.key for op in ops}
    for op in ops:
        q = quadratic_form(op)
        if q is None:
            return False
        dd, den, A, B = q
        if dd not in (1, d):
            return False
        conj = (A - np.sqrt(d) * B) / den
        key = float_key(conj) + (int(op.time_reversal),)
        if key not in keys:
            return False
    return True


def _class_projection(n, roots, ratio, zero):
    """float64 (n, m) matrix mapping class unknowns to orbit unknowns, and the class list.

    Ratios are signed powers of two (Voigt factors), so float64 holds them exactly.
    """
    classes = sorted({r for r in roots if r not in zero})
    col = {r: i for i, r in enumerate(classes)}
    P = np.zeros((n, len(classes)))
    for o in range(n):
        if roots[o] not in zero:
            P[o, col[roots[o]]] = float(ratio[o])
    return P, classes


_DYADIC = 2.0**20


def _integer_lie(group):
    """Integer multiples of the group's Lie generators (each spans the same algebra)."""
    out = []
    for L in group.lie_generators:
        m = integer_generator(L)
        if m is None:
            raise ArithmeticError("Lie generator about an irrational direction")
        out.append(m)
    return out


def _rational_rows(spec, group, f, quads, roots, ratio, zero):
    """Integer constraint rows on the union-find classes (rational invariant subspace).

    float64 is used only when every product and partial sum is a dyadic
    rational below 2**52 in size, which the a-priori bound
    ``max|block| * max|P| * n * 2**20 < 2**52`` guarantees (checked first; past
    it the caller takes the exact field path).
    """
    orb = spec.orbits
    n = len(orb.reps)
    F = np.array([float(x) for x in f])
    if all(r in zero for r in roots):
        return []
    lies = _integer_lie(group)
    if not lies and not quads:  # signed permutations only: the union-find has done everything
        return []
    # float64 blocks (one or two per generator, n x n) and their stack, times the (n x classes) projection
    orb.require(orb.dense_bytes("orbits", copies=3 * (len(lies) + 2 * len(quads)) + 1),
                "the constraint rows of the invariant solver")
    P, classes = _class_projection(n, roots, ratio, zero)
    blocks = []
    for L in lies:
        blocks.append(lie_action(orb, L).astype(np.float64) * F)
    for q, par in quads:
        den = q[1]
        A, B = quadratic_action(orb, q)
        if A.dtype == object:
            raise ArithmeticError("Kronecker products past int64; use the field path")
        scale = float(den) ** spec.rank
        blocks.append((par * A.astype(np.float64) - scale * np.eye(n)) * F)
        if q[0] != 1:
            blocks.append(par * B.astype(np.float64) * F)
    if not blocks:
        return []
    big = max(float(np.abs(b).max(initial=0)) for b in blocks) * float(np.abs(P).max(initial=0)) * n * _DYADIC
    if not big < 2.0**52:
        raise ArithmeticError("constraint rows too large for exact float64; use the field path")
    C = np.vstack(blocks) @ P * _DYADIC
    R = np.rint(C)
    if not np.array_equal(R, C) or np.abs(R).max(initial=0) >= 2.0**52:
        raise ArithmeticError("constraint rows are not exact in float64; use the field path")
    R = R.astype(np.int64)
    R = R[np.any(R != 0, axis=1)]
    if len(R) == 0:
        return []
    g = np.gcd.reduce(R, axis=1)
    R = R // g[:, None]
    lead = R[np.arange(len(R)), np.argmax(R != 0, axis=1)]
    R = R * np.sign(lead)[:, None]
    R = np.unique(R, axis=0)
    rows = []
    for r in R:
        nz = np.nonzero(r)[0]
        rows.append({classes[j]: int(r[j]) for j in nz})
    return rows


def _lie_rows(orb, group, f, conv):
    """Rows N F of the (integer-scaled) Lie generators, entries converted by ``conv`` from Fractions."""
    rows = []
    for L in _integer_lie(group):
        N = lie_action(orb, L)
        for i in range(len(orb.reps)):
            rows.append({int(j): conv(int(N[i, j]) * f[j]) for j in np.nonzero(N[i])[0]})
    return rows


def _field_rows(spec, group, f, quads, d, roots, ratio, zero):
    """Constraint rows in Q(sqrt(d)) (QuadNumber entries) on the union-find classes."""
    orb = spec.orbits
    n = len(orb.reps)
    rows = _lie_rows(orb, group, f, lambda v: QuadNumber(v, 0, d))
    for q, par in quads:
        den = q[1]
        A, B = quadratic_action(orb, q)
        scale = den**spec.rank
        for i in range(n):
            nz = set(np.nonzero(A[i])[0]) | set(np.nonzero(B[i])[0]) | {i}
            rows.append({int(j): QuadNumber(Fraction(int(A[i, j]) * par - (scale if i == j else 0), scale) * f[j],
                                            Fraction(int(B[i, j]) * par, scale) * f[j], d) for j in nz})
    return [_to_classes(r, roots, ratio, zero) for r in rows]


def _q(x):
    return sp.Rational(x.numerator, x.denominator)


def _to_classes(row, roots, ratio, zero):
    out = {}
    for j, v in row.items():
        r = roots[j]
        if r in zero:
            continue
        rv = ratio[j]
        if isinstance(v, sp.Basic):
            rv = _q(rv)
        out[r] = out.get(r, 0) + v * rv
    return out


def _magnitude(c):
    """Sort key |c| for a coefficient: exact for rationals, 12 significant digits otherwise."""
    c = sp.sympify(c)
    if c.is_Rational:
        return abs(c)
    return sp.Rational(f"{abs(float(c)):.12g}")


def _rescale_proportional(live, coeffs, purity, keys, preferred):
    """Re-pick the constant of each proportional family as handbooks do.

    A family is the set of components that are multiples of one free constant
    alone (d16 = -2 d22, d21 = -d22 in 3m).  Its constant is the member with
    the smallest coefficient (so the others are whole multiples of it), then
    the fewest distinct Voigt digits (d22 before d16 and d21: the "pure"
    component), then the lowest label in priority order (c14 before c24 and
    c56 in 32).  A member named in ``preferred`` wins over all of these.
    """
    families = {}
    for o, terms in enumerate(coeffs):
        if len(terms) == 1:
            families.setdefault(terms[0][0], []).append((o, terms[0][1]))
    changes = {}
    for i, members in families.items():
        best = min(members, key=lambda oc: (oc[0] not in preferred, _magnitude(oc[1]), purity[oc[0]], keys[oc[0]]))
        if best[0] != live[i]:
            changes[i] = best
    if not changes:
        return live, coeffs
    live = list(live)
    for i, (o, c) in changes.items():
        live[i] = o
    new = []
    for terms in coeffs:
        out = []
        for i, c in terms:
            out.append((i, c / changes[i][1]) if i in changes else (i, c))
        new.append(tuple(out))
    # keep the free constants in priority order
    order = sorted(range(len(live)), key=lambda i: keys[live[i]])
    pos = {old: k for k, old in enumerate(order)}
    new = [tuple(sorted(((pos[i], c) for i, c in terms), key=lambda t: t[0])) for terms in new]
    return [live[i] for i in order], new


_FRAMES = {}


def _standard_frame(group):
    """Cached :func:`_standard_frame_uncached` per (generators, rotation)."""
    names = getattr(group, "names", None)
    Q = getattr(names, "rotation", None)
    if Q is None:
        return None
    key = (tuple(g.key for g in group.generators), tuple(tuple(str(x) for x in L) for L in group.lie_generators),
           getattr(names, "setting_symbol", ""), getattr(names, "hm", ""), tuple(sp.ImmutableMatrix(Q)))
    if key not in _FRAMES:
        if len(_FRAMES) > 4096:
            _FRAMES.clear()
        _FRAMES[key] = _standard_frame_uncached(group)
    return _FRAMES[key]


def _standard_frame_uncached(group):
    """(standard group, Q) when ``group`` is a recognised re-orientation Q G_std Q^T, else None.

    The standard group is the catalog setting named by the group's
    ``setting_symbol`` (ordinary or magnetic) or the continuous group of its
    symbol.  Q is verified on every standard generator: Q g Q^T (numerically, to
    1e-8 absolute) with the same time-reversal flag must be an operation of the
    group.
    """
    names = getattr(group, "names", None)
    Q = getattr(names, "rotation", None)
    if Q is None:
        return None
    if getattr(group, "is_continuous", False):
        from tensym.groups.continuous import continuous_group

        try:
            return continuous_group(names.hm), sp.ImmutableMatrix(Q)
        except TensymError:  # a continuous group without a catalog name: direct path
            return None
    sym = getattr(names, "setting_symbol", "")
    if not sym:
        return None
    from tensym.groups.symbols import point_group

    try:
        std = point_group(sym)
    except TensymError:  # a symbol outside the catalog: direct path
        return None
    q = np.array([[float(x) for x in row] for row in sp.Matrix(Q).tolist()])
    keys = set(group.operation_keys()) if hasattr(group, "operation_keys") else {op.key for op in group.operations}
    for g in std.generators:
        m = q @ g.numeric @ q.T
        key = float_key(m) + (int(g.time_reversal),)
        if key not in keys:
            return None
    return std, sp.ImmutableMatrix(Q)


def _needs_general(group):
    fields = set()
    for g in group.generators:
        if monomial_form(g) is not None:
            continue
        q = quadratic_form(g)
        if q is None:
            return True
        if q[0] != 1:
            fields.add(q[0])
    return len(fields) > 1 or any(integer_generator(L) is None for L in group.lie_generators)


def _aggregation(orb):
    """int64 (3**rank, n): column o holds the signs of orbit o's members (the orbit basis vector E_o)."""
    orb.require(orb.dense_bytes(copies=2), "the orbit aggregation matrix (int64 and its exact copy)")
    S = np.zeros((3**orb.rank, len(orb.reps)), dtype=np.int64)
    flats = np.nonzero(orb.orbit_of >= 0)[0]
    S[flats, orb.orbit_of[flats]] = orb.sign_of[flats]
    return S


def _integer_scale(values):
    """(ints, den) with values[i] = ints[i] / den for a list of Fractions."""
    den = 1
    for v in values:
        den = math.lcm(den, v.denominator)
    return [int(v * den) for v in values], den


_ACTIONS = {}
_ACTIONS_LIMIT = 256
_STANDARD = {}


def _standard_solution(spec, std, f, keys, purity):
    """The solution in the standard setting, cached per (spec, group, factors, priority, purity)."""
    key = (spec, tuple(g.key for g in std.generators), tuple(tuple(str(x) for x in L) for L in std.lie_generators),
           tuple(f), tuple(keys), tuple(purity))
    hit = _STANDARD.get(key)
    if hit is None:
        hit = solve_invariants(spec, std, factors=f, priority=keys, purity=purity)
        if len(_STANDARD) >= 2048:
            _STANDARD.pop(next(iter(_STANDARD)))
        _STANDARD[key] = hit
    return hit


def _rotation_action(spec, Q):
    """(field, ModularMatrix) of the action of Q on the reduced space, cached per (spec, Q).

    Column o of the action is Q applied to the orbit basis vector E_o, read at
    the representatives, over the number field of Q's entries (scaled by the
    common denominator of Q**rank, which does not change the spanned space).
    """
    key = (spec, tuple(sp.ImmutableMatrix(Q)))
    hit = _ACTIONS.get(key)
    if hit is None:
        orb = spec.orbits
        field, _, coords = field_of(list(sp.ImmutableMatrix(Q)))
        A = np.empty((field.degree, 3, 3), dtype=object)
        for idx, v in enumerate(coords):
            A[:, idx // 3, idx % 3] = v
        M = kron_times(_rep_array(orb), A, field, _aggregation(orb).astype(object))
        hit = (field, ModularMatrix(M))
        if len(_ACTIONS) >= _ACTIONS_LIMIT:
            _ACTIONS.pop(next(iter(_ACTIONS)))
        _ACTIONS[key] = hit
    return hit


def _solve_rotated(spec, std, Q, f, keys, purity, preferred):
    """Solve in the standard setting, rotate the exact basis by Q, and re-pick the constants.

    The invariant subspace in the given frame is Q applied to the standard one.
    The rotated basis is computed over the number field of Q's entries by
    modular Kronecker products (:func:`tensym.exact.fields.kron_times`), then
    reduced to row echelon form with the columns in priority order, so the
    pivots are the first independent components - the same rule as the direct
    reduction.  Exact for any exact Q; no fixed-width integer can overflow.
    """
    orb = spec.orbits
    n = len(orb.reps)
    base = _standard_solution(spec, std, f, keys, purity)
    k = len(base.free)
    if k == 0:
        return base
    flat_b = [sp.Integer(0)] * (n * k)
    for o, terms in enumerate(base.coeffs):
        for i, c in terms:
            flat_b[o * k + i] = sp.sympify(c) * _q(f[o])
    if not all(x.is_Rational for x in flat_b):  # standard solution over a field (not in the catalog)
        return _solve_rotated_sympy(spec, base, Q, f, keys, purity, preferred)
    field, action = _rotation_action(spec, Q)
    den = math.lcm(*[int(x.q) for x in flat_b])
    B = np.array([int(x.p) * (den // int(x.q)) for x in flat_b], dtype=object).reshape(n, k)
    rotated = action.times(B)  # (N, n, k): Q applied to the basis, at the representatives
    # Voigt variables v_o = t_o / f_o, scaled to integers
    scale, _ = _integer_scale([1 / x for x in f])
    scale = np.array(scale, dtype=object)
    rows = [rotated[:, :, i] * scale[None, :] for i in range(k)]
    order = sorted(range(n), key=lambda o: keys[o])
    reduced = rref_field(field, rows, order)
    if len(reduced) != k:  # pragma: no cover - Q is invertible, so the rank is kept
        raise ArithmeticError("rotated basis lost rank")
    reduced.sort(key=lambda t: keys[t[0]])
    free = [col for col, _, _ in reduced]
    coeffs = []
    for o in range(n):
        terms = []
        for i, (col, row, g) in enumerate(reduced):
            v = row[:, o]
            if any(v):
                terms.append((i, field.to_sympy(v, g)))
        coeffs.append(tuple(terms))
    live, coeffs = _rescale_proportional(free, coeffs, purity, keys, set(preferred))
    return Solution(free=tuple(live), coeffs=tuple(coeffs))


def _radical_zero(x):
    return sp.expand(sp.radsimp(sp.expand(x))) == 0


def _solve_rotated_sympy(spec, base, Q, f, keys, purity, preferred):
    """The rotated route with sympy arithmetic, for a standard basis that is not rational."""
    orb = spec.orbits
    n = len(orb.reps)
    k = len(base.free)
    B = sp.zeros(n, k)
    for o, terms in enumerate(base.coeffs):
        for i, c in terms:
            B[o, i] = c * _q(f[o])
    rotated = (sympy_action(orb, Q) * B).applyfunc(lambda x: sp.radsimp(sp.expand(x)))
    order = sorted(range(n), key=lambda o: keys[o])
    A = sp.Matrix(k, n, lambda i, j: rotated[order[j], i] / _q(f[order[j]]))
    R, piv = A.rref(iszerofunc=_radical_zero, simplify=lambda x: sp.radsimp(sp.expand(x)))
    pivots = [order[j] for j in piv]
    pos_in = {o: j for j, o in enumerate(order)}
    free = sorted(pivots, key=lambda o: keys[o])
    index = {o: i for i, o in enumerate(free)}
    row_of = {order[j]: r for r, j in enumerate(piv)}
    coeffs = []
    for o in range(n):
        terms = []
        for p in free:
            c = sp.radsimp(sp.expand(R[row_of[p], pos_in[o]]))
            if c != 0:
                terms.append((index[p], c))
        coeffs.append(tuple(terms))
    live, coeffs = _rescale_proportional(free, coeffs, purity, keys, set(preferred))
    return Solution(free=tuple(live), coeffs=tuple(coeffs))


def _general_rows(spec, group, f, dense, roots, ratio, zero):
    """Constraint rows over the number field of the dense generators' entries.

    Returns (field, rows, classes): rows are object arrays (N, m) over the
    union-find classes ``classes``.  The Kronecker products run modulo primes
    (exact, see :func:`tensym.exact.fields.kron_times`).
    """
    orb = spec.orbits
    n = len(orb.reps)
    classes = sorted({r for r in roots if r not in zero})
    col = {r: j for j, r in enumerate(classes)}
    mats = [sp.Matrix(g.matrix) for g, _ in dense]
    lies = [sp.Matrix(L) for L in group.lie_generators]
    entries = [sp.sympify(x) for m in mats + lies for x in m]
    field, den, coords = field_of(entries or [sp.Integer(1)])
    N = field.degree
    # t_o = f_o * ratio_o * v_class(o), scaled to integers
    w, _ = _integer_scale([f[o] * ratio[o] for o in range(n)])
    P = np.zeros((n, len(classes)), dtype=object)
    for o in range(n):
        if roots[o] not in zero:
            P[o, col[roots[o]]] = w[o]
    right = _aggregation(orb).astype(object).dot(P)
    reps = _rep_array(orb)
    rows = []
    for gi, (g, par) in enumerate(dense):
        A = np.empty((N, 3, 3), dtype=object)
        for idx in range(9):
            A[:, idx // 3, idx % 3] = coords[9 * gi + idx]
        image = kron_times(reps, A, field, right) * par  # (N, n, m), times den**rank
        image[0] = image[0] - den**spec.rank * P
        rows.extend(image[:, i, :] for i in range(n))
    base = 9 * len(dense)
    for li in range(len(lies)):
        L = [coords[base + 9 * li + idx] for idx in range(9)]
        rows.extend(_lie_field_rows(orb, L, N, P))
    return field, rows, classes


def _lie_field_rows(orb, L, N, P):
    """Rows of the Lie generator's action (dL.T = 0) over the field, on the classes."""
    n = len(orb.reps)
    out = np.zeros((N, n, n), dtype=object)
    for o2, rep in enumerate(orb.reps):
        for kpos, ik in enumerate(rep):
            for c in range(3):
                lv = L[3 * ik + c]
                if not any(lv):
                    continue
                idx = rep[:kpos] + (c,) + rep[kpos + 1:]
                o, s = orb.locate(idx)
                if o >= 0:
                    out[:, o2, o] = out[:, o2, o] + lv * s
    rows = [np.stack([out[c].dot(P)[i] for c in range(N)]) for i in range(n)]
    return rows


def _solve_field(spec, group, f, dense, roots, ratio, zero, keys, purity, preferred):
    """Direct reduction over the number field of the generators (groups not in the catalog)."""
    field, rows, classes = _general_rows(spec, group, f, dense, roots, ratio, zero)
    order = sorted(range(len(classes)), key=lambda j: keys[classes[j]], reverse=True)
    reduced = rref_field(field, rows, order)
    pivots = {classes[col]: (row, g) for col, row, g in reduced}
    live = sorted((r for r in classes if r not in pivots), key=lambda c: keys[c])
    pos = {r: i for i, r in enumerate(live)}
    col_of = {r: j for j, r in enumerate(classes)}
    coeffs = []
    for o in range(len(spec.orbits.reps)):
        r = roots[o]
        if r in zero:
            coeffs.append(())
            continue
        q = _q(ratio[o])
        if r in pivots:
            row, g = pivots[r]
            terms = []
            for c in live:
                v = row[:, col_of[c]]
                if any(v):
                    terms.append((pos[c], sp.expand(-q * field.to_sympy(v, g))))
            coeffs.append(tuple(terms))
        else:
            coeffs.append(((pos[r], q),))
    live, coeffs = _rescale_proportional(live, coeffs, purity, keys, set(preferred))
    return Solution(free=tuple(live), coeffs=tuple(coeffs))


def solve_invariants(spec, group, factors=None, priority=None, purity=None, preferred=()):
    """Solve for the invariant tensors of ``spec`` under ``group``.

    Parameters
    ----------
    spec : TensorSpec
    group : PointGroup or ContinuousGroup
    factors : sequence of Fraction, optional
        Voigt factor f_o per orbit: tensor component t_o = f_o * v_o (default 1).
    priority : sequence, optional
        Sort key per orbit; lower keys are preferred as independent unknowns
        (default: the representative index tuples).
    purity : sequence of int, optional
        Number of distinct Voigt digits per orbit (default: distinct entries of
        the priority key); fewer wins within a proportional family.
    preferred : collection of int
        Orbits to keep as constants of their proportional family when possible.

    Returns
    -------
    Solution
    """
    orb = spec.orbits
    n = len(orb.reps)
    f = [Fraction(1)] * n if factors is None else [Fraction(x) for x in factors]
    keys = list(orb.reps) if priority is None else list(priority)
    for x in f:
        if x == 0 or (abs(x.numerator) & (abs(x.numerator) - 1)) or (x.denominator & (x.denominator - 1)):
            raise ValueError(f"Voigt factors must be signed powers of two, got {x}")
    ff = [float(x) for x in f]
    if purity is None:
        purity = [len(set(k)) for k in keys]
    frame = _standard_frame(group)
    if frame is not None:
        return _solve_rotated(spec, frame[0], frame[1], f, keys, purity, preferred)
    uf = _UnionFind(n, lambda o: keys[o])
    dense = []
    for g in group.generators:
        par = spec.parity(g)
        mono = monomial_form(g)
        if mono is not None:
            for o, (o2, s) in enumerate(monomial_action(orb, *mono)):
                # t_{o2} = s * par * t_o  ->  v_{o2} = s * par * f_o / f_{o2} * v_o
                uf.relate(o2, o, s * par * ff[o] / ff[o2])
        else:
            dense.append((g, par))

    roots, ratio = [], []
    for o in range(n):
        r, q = uf.find(o)
        roots.append(r)
        ratio.append(Fraction(q))
    zero = {r for r in set(roots) if uf.zero[r]}

    field_d = 1
    quads, general = [], []
    for g, par in dense:
        q = quadratic_form(g)
        if q is None or (q[0] != 1 and field_d not in (1, q[0])):
            general.append((g, par))
            continue
        if q[0] != 1:
            field_d = q[0]
        quads.append((q, par))
    if general or any(integer_generator(L) is None for L in group.lie_generators):
        return _solve_field(spec, group, f, dense, roots, ratio, zero, keys, purity, preferred)
    if field_d != 1 and not _galois_stable(group, field_d):
        work = _field_rows(spec, group, f, quads, field_d, roots, ratio, zero)
    else:
        try:
            work = _rational_rows(spec, group, f, quads, roots, ratio, zero)
        except ArithmeticError:
            work = _field_rows(spec, group, f, quads, field_d if field_d != 1 else 2, roots, ratio, zero)

    if all(isinstance(v, int) for row in work for v in row.values()):
        piv = rref_integer(work, priority=lambda c: keys[c])
    else:
        piv = rref_sparse(work, priority=lambda c: keys[c])
    live = sorted({r for r in roots if r not in zero and r not in piv}, key=lambda c: keys[c])
    pos = {r: i for i, r in enumerate(live)}

    def num(v):
        if isinstance(v, Fraction):
            return sp.Rational(v.numerator, v.denominator)
        if isinstance(v, QuadNumber):
            return v.to_sympy()
        return sp.nsimplify(sp.simplify(v)) if not isinstance(v, int) else sp.Integer(v)

    coeffs = []
    for o in range(n):
        r = roots[o]
        if r in zero:
            coeffs.append(())
            continue
        q = num(ratio[o])
        if r in piv:
            terms = tuple((pos[c], sp.expand(q * num(v))) for c, v in sorted(piv[r].items(), key=lambda cv: keys[cv[0]]))
            coeffs.append(tuple(t for t in terms if t[1] != 0))
        else:
            coeffs.append(((pos[r], q),))
    live, coeffs = _rescale_proportional(live, coeffs, purity, keys, set(preferred))
    return Solution(free=tuple(live), coeffs=tuple(coeffs))
