"""Explicit exact matrices of point-group irreps (private kernel of CharacterTable.matrices).

Method
------
* One-dimensional irreps: the characters themselves.
* The real form of a complex pair chi, conj(chi): the 2x2 real matrices
  [[Re chi, Im chi], [-Im chi, Re chi]] of the member ``1E`` (the action on the
  real and imaginary parts of a function that transforms by conj(chi)).
* Higher dimensions: every irrep of a finite subgroup of O(3) occurs in a space
  of harmonic polynomials of some degree l with one of the two parities.  The
  smallest (l, parity) where the irrep occurs exactly once is searched by the
  reduction formula; there the character projector
  P = (d/|G|) sum_g conj(chi(g)) D(g) has rank d, its non-zero pivot columns
  (projections of basis harmonics) span the irrep, and Gram-Schmidt in the
  Fischer inner product makes that basis orthonormal.  The matrices
  D_Gamma(g) = B^T G D(g) B are then real orthogonal for real irreps, and their
  traces are checked exactly against the characters.
* The products over the group (the projections and the matrices of every
  element from the generators) run on integer coordinates over the number
  field of the entries (:class:`_FieldWalk`), exact and unbounded.

Examples
--------
>>> from tensym.groups import point_group
>>> from tensym.reps.table import finite_table
>>> t = finite_table(point_group("m-3m"))
>>> m = t.matrices("Eg")
>>> [d.trace() for d in m] == [t.character("Eg", op) for op in t.group.operations]
True
"""

import numpy as np
import sympy as sp
from sympy.polys.matrices import DomainMatrix

from tensym.reps.linalg import generator_data, to_dm, unify
from tensym.reps.reduction import multiplicities, space_characters
from tensym.reps.spaces import harmonics

__all__ = ["build_matrices", "irrep_carrier", "MAX_SEARCH_L"]

#: Largest harmonic degree searched for a space carrying an irrep once.
MAX_SEARCH_L = 16


def _clean(v):
    v = sp.expand(v)
    if v.is_Rational:
        return v
    v = sp.radsimp(v)
    v = sp.expand(sp.sqrtdenest(v))
    return sp.nsimplify(v) if v.is_Float else v


def _op_chars(table, label):
    irr = table.irrep(label)
    pos = [None] * table.group.order
    for ci, c in enumerate(table.classes):
        for m in c.indices:
            pos[m] = irr.characters[ci]
    return pos


def irrep_carrier(table, label):
    """(space, multiplicity 1) harmonic space that contains the irrep exactly once."""
    irr = table.irrep(label)
    for l in range(0, MAX_SEARCH_L + 1):
        natural = "g" if l % 2 == 0 else "u"
        for parity in (natural, "u" if natural == "g" else "g"):
            space = harmonics(l, parity)
            if space.dim < irr.dim:
                continue
            mult = multiplicities(table, space_characters(space, table), real=False)
            if mult.get(irr.label, 0) == 1:
                return space
    raise ArithmeticError(f"no harmonic space up to l = {MAX_SEARCH_L} carries {label} exactly once")


class _FieldWalk:
    """D(g) for every element from the generators, on integer coordinates over a number field (private).

    The generators (DomainMatrices over ``dom``) and the extra numbers
    ``weights`` are written as integer coordinate arrays over one number
    field with a common denominator den (:func:`tensym.exact.fields.field_of`;
    Python integers, no fixed width).  D(g) at depth t of the breadth-first
    ``walk`` (see :func:`tensym.reps.linalg.generator_data`) is kept as an
    integer array over den**t, so each element costs one object-array
    product instead of a sympy field product per entry.
    """

    def __init__(self, gmats, walk, weights, dom):
        from tensym.exact.fields import field_of

        size = gmats[0].shape[0] if gmats else 1
        entries = [dom.to_sympy(x) for m in gmats for row in m.to_list() for x in row] + list(weights)
        uniq = list(dict.fromkeys(entries)) or [sp.Integer(1)]
        K, den, ints_u = field_of(uniq)
        where = {x: k for k, x in enumerate(uniq)}
        N = K.degree
        pos = 0
        gens = []
        for _m in gmats:
            A = np.empty((N, size, size), dtype=object)
            for e in range(size * size):
                A[:, e // size, e % size] = ints_u[where[entries[pos + e]]]
            pos += size * size
            gens.append(A)
        self.weights = [ints_u[where[x]] for x in entries[pos:]]
        self.field, self.den, self.size = K, den, size
        n = len(walk) + 1
        mats = [None] * n
        eye = np.zeros((N, size, size), dtype=object)
        eye[0] = np.eye(size, dtype=object)
        mats[0] = (eye, 0)
        for p, k, e in walk:
            B, depth = mats[e]
            A = gens[k]
            out = np.zeros((N, size, size), dtype=object)
            for a, b, c, t in K.terms:
                if A[a].any() and B[b].any():
                    out[c] = out[c] + t * A[a].dot(B[b])
            mats[p] = (out, depth + 1)
        self.mats = mats  # (coordinates, depth): D(g) = coordinates / den**depth

    def weighted_sum(self):
        """(coordinates, denominator) of sum_g weights[g] D(g)."""
        K, den = self.field, self.den
        top = max(d for _, d in self.mats)
        total = np.zeros((K.degree, self.size, self.size), dtype=object)
        for (M, depth), wg in zip(self.mats, self.weights):
            if not any(wg):
                continue
            scale = den ** (top - depth)
            for a, b, c, t in K.terms:
                if wg[b] and M[a].any():
                    total[c] = total[c] + (t * wg[b] * scale) * M[a]
        return total, den ** (top + 1)  # the weights carry one more factor den

    def trace_equals_weights(self):
        """True when tr D(g) equals weights[g] for every element (exact, on the coordinates)."""
        den = self.den
        for (M, depth), wg in zip(self.mats, self.weights):
            tr = [sum(M[c, i, i] for i in range(self.size)) for c in range(self.field.degree)]
            if any(t * den != int(w) * den**depth for t, w in zip(tr, wg)):
                return False
        return True

    def entry(self, g, i, j):
        """The sympy number D(g)[i, j]."""
        M, depth = self.mats[g]
        v = M[:, i, j]
        if not any(v):
            return sp.Integer(0)
        return self.field.to_sympy(v, self.den**depth)


def build_matrices(table, irr):
    """Tuple of exact irrep matrices aligned with ``table.group.operations``."""
    if irr.dim == 1:
        chars = _op_chars(table, irr.label)
        return tuple(sp.ImmutableMatrix([[c]]) for c in chars)
    if irr.label not in table.labels:  # real form of a complex pair
        member = next(i for i in table.irreps if i.real_label == irr.label and i.label.startswith("1"))
        chars = _op_chars(table, member.label)
        out = []
        for c in chars:
            re, im = sp.expand(c).as_real_imag()
            out.append(sp.ImmutableMatrix([[re, im], [-im, re]]))
        return tuple(out)
    group = table.group
    n = group.order
    space = irrep_carrier(table, irr.label)
    chars = _op_chars(table, irr.label)
    gens, gmats, walk = generator_data(space, group)
    # characters into the field of the matrices (real irreps: conj(chi) = chi)
    both = unify([to_dm(sp.Matrix([[sp.conjugate(c) for c in chars]]))] + gmats[:1])
    dom = both[0].domain
    gmats = [m.convert_to(dom) for m in gmats]
    crow = both[0].to_list()[0]
    G = DomainMatrix.from_Matrix(sp.Matrix(space.gram())).convert_to(dom)
    dim = space.dim
    # projections P e_j = sum_g conj(chi(g)) D(g) e_j, for j until d independent ones
    cols = []
    # try basis harmonics in reading order: for l = 1 that is x, y, z (the basis stores z, x, y)
    order = [1, 2, 0] if getattr(space, "l", None) == 1 else list(range(dim))
    fw = _FieldWalk(gmats, walk, [dom.to_sympy(c) for c in crow], dom)
    total, denom = fw.weighted_sum()
    for j in order:
        v = DomainMatrix([[dom.from_sympy(fw.field.to_sympy(total[:, i, j], denom))] for i in range(dim)], (dim, 1),
                         dom)
        if v.is_zero_matrix:
            continue
        if DomainMatrix.hstack(*(cols + [v])).rank() == len(cols) + 1:
            cols.append(v)
        if len(cols) == irr.dim:
            break
    if len(cols) != irr.dim:
        raise ArithmeticError(f"the projector of {irr.label} has rank {len(cols)}, expected {irr.dim}")
    basis, norms = [], []
    for v in cols:
        w = v
        for b, nb in zip(basis, norms):
            coef = (b.transpose() * G * w).to_list()[0][0]
            w = w - b * dom.quo(coef, nb)
        basis.append(w)
        norms.append((w.transpose() * G * w).to_list()[0][0])
    B = DomainMatrix.hstack(*basis)
    BtG = B.transpose() * G
    d = irr.dim
    inv_n = DomainMatrix([[dom.quo(dom.one, norms[i]) if i == j else dom.zero for j in range(d)] for i in range(d)],
                         (d, d), dom)
    # M(g) = N^-1 B^T G D(g) B: coordinates in the orthogonal basis B, a homomorphism
    gen_small = [inv_n * BtG * m * B for m in gmats]
    small = _FieldWalk(gen_small, walk, [dom.to_sympy(c) for c in crow], dom)
    if not small.trace_equals_weights():  # the weights are conj(chi) = chi for real irreps
        raise ArithmeticError(f"irrep matrices of {irr.label} do not reproduce its characters")
    # orthonormal basis: D_Gamma(g)_ij = M(g)_ij sqrt(n_i / n_j)
    factor = [[_clean(sp.sqrt(sp.radsimp(dom.to_sympy(norms[i]) / dom.to_sympy(norms[j]))))
               for j in range(d)] for i in range(d)]
    simple = all(f.is_Rational or (f.is_Pow and f.base.is_Rational) or (f.is_Mul and all(
        a.is_Rational or (a.is_Pow and a.base.is_Rational) for a in f.args)) for row in factor for f in row)
    out = []
    done = {}
    for g in range(n):
        entries = []
        for i in range(d):
            for j in range(d):
                a = small.entry(g, i, j)
                if a == 0:
                    entries.append(sp.Integer(0))
                    continue
                key = (a, i, j)
                if key not in done:
                    v = sp.expand(a * factor[i][j])
                    done[key] = v if simple else _clean(v)
                entries.append(done[key])
        out.append(sp.ImmutableMatrix(d, d, entries))
    return tuple(out)
