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

import numpy as np
import sympy as sp

from tensym.exact.linalg import QuadNumber, rref_sparse
from tensym.tensors.kernels import (
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
        self.ratio = [Fraction(1)] * n  # v_x = ratio[x] * v_parent[x]
        self.zero = [False] * n
        self.key = key

    def find(self, x):
        r = Fraction(1)
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


def _galois_stable(group, d):
    """True when conjugating sqrt(d) -> -sqrt(d) maps the group's operations onto themselves."""
    if getattr(group, "is_continuous", False):
        return False
    ops = group.operations
    keys = {op.key for op in ops}
    for op in ops:
        q = quadratic_form(op.matrix)
        if q is None:
            return False
        dd, den, A, B = q
        if dd not in (1, d):
            return False
        conj = (A - np.sqrt(d) * B) / den
        key = tuple(int(v) for v in np.rint(conj.ravel() * 1e8)) + (int(op.time_reversal),)
        if key not in keys:
            return False
    return True


def solve_invariants(spec, group, factors=None, priority=None):
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

    Returns
    -------
    Solution
    """
    orb = spec.orbits
    n = len(orb.reps)
    f = [Fraction(1)] * n if factors is None else [Fraction(x) for x in factors]
    keys = list(orb.reps) if priority is None else list(priority)
    uf = _UnionFind(n, lambda o: keys[o])
    dense = []
    for g in group.generators:
        par = spec.parity(g)
        mono = monomial_form(g.matrix)
        if mono is not None:
            for o, (o2, s) in enumerate(monomial_action(orb, *mono)):
                # t_{o2} = s * par * t_o  ->  v_{o2} = s * par * f_o / f_{o2} * v_o
                uf.relate(o2, o, Fraction(s * par) * f[o] / f[o2])
        else:
            dense.append((g, par))

    rows = []  # list of (kind, data)
    for L in group.lie_generators:
        N = lie_action(orb, L)
        for i in range(n):
            nz = np.nonzero(N[i])[0]
            if len(nz):
                rows.append({int(j): Fraction(int(N[i, j])) * f[j] for j in nz})
    field_d = 1
    general = []
    for g, par in dense:
        q = quadratic_form(g.matrix)
        if q is None:
            general.append((g, par))
            continue
        d, den, _, _ = q
        A, B = quadratic_action(orb, q)
        scale = den**spec.rank
        if d != 1:
            if field_d not in (1, d):
                general.append((g, par))
                continue
            field_d = d
        for i in range(n):
            nz = set(np.nonzero(A[i])[0]) | set(np.nonzero(B[i])[0]) | {i}
            row = {}
            for j in nz:
                a = Fraction(int(A[i, j]) * par - (scale if i == j else 0), scale) * f[j]
                b = Fraction(int(B[i, j]) * par, scale) * f[j]
                row[int(j)] = (a, b)
            rows.append(row)

    # express rows in union-find classes
    roots, ratio = [], []
    for o in range(n):
        r, q = uf.find(o)
        roots.append(r)
        ratio.append(q)
    zero = {r for r in set(roots) if uf.zero[r]}

    def to_classes(row, conv):
        out = {}
        for j, v in row.items():
            r = roots[j]
            if r in zero:
                continue
            out[r] = out.get(r, 0) + conv(v) * ratio[j]
        return out

    work = []
    use_field = field_d != 1 and not _galois_stable(group, field_d)
    if general:
        use_field = False
    for row in rows:
        sample = next(iter(row.values()), None)
        if isinstance(sample, tuple):
            if general:
                work.append(to_classes(row, lambda v: sp.Rational(v[0].numerator, v[0].denominator)
                                       + sp.Rational(v[1].numerator, v[1].denominator) * sp.sqrt(field_d)))
            elif use_field:
                work.append(to_classes(row, lambda v: QuadNumber(v[0], v[1], field_d)))
            else:
                work.append(to_classes(row, lambda v: v[0]))
                if field_d != 1:
                    work.append(to_classes(row, lambda v: v[1]))
        else:
            if general:
                work.append(to_classes(row, lambda v: sp.Rational(v.numerator, v.denominator)))
            elif use_field:
                work.append(to_classes(row, lambda v: QuadNumber(v, 0, field_d)))
            else:
                work.append(to_classes(row, lambda v: v))
    for g, par in general:
        M = sympy_action(orb, g.matrix)
        for i in range(n):
            row = {}
            for j in range(n):
                v = M[i, j] * par - (1 if i == j else 0)
                if v != 0:
                    row[j] = sp.nsimplify(v) * sp.Rational(f[j].numerator, f[j].denominator)
            if row:
                work.append(to_classes(row, lambda v: v))

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
    return Solution(free=tuple(live), coeffs=tuple(coeffs))
