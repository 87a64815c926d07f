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

Examples
--------
>>> from tensym.groups import point_group
>>> from tensym.reps.table import finite_table
>>> t = finite_table(point_group("m-3m"))
>>> m = t.matrices("Eg")
>>> [d.trace() for d in m] == [t.character("Eg", op) for op in t.group.operations]
True
"""

import sympy as sp
from sympy.polys.matrices import DomainMatrix

from tensym.reps.linalg import generator_data, orbit, to_dm, unify
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
    for j in order:
        e = DomainMatrix([[dom.one if i == j else dom.zero] for i in range(dim)], (dim, 1), dom)
        orb = orbit(e, gmats, walk, n)
        v = orb[0] * crow[0]
        for c, w in zip(crow[1:], orb[1:]):
            if c != dom.zero:
                v = v + w * c
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
    small = [None] * n
    small[0] = DomainMatrix.eye(d, dom)
    for p, k, e in walk:
        small[p] = gen_small[k] * small[e]
    for M, c in zip(small, crow):
        ml = M.to_list()
        tr = dom.zero
        for i in range(d):
            tr += ml[i][i]
        if tr != c:  # c = conj(chi) = chi for real irreps
            raise ArithmeticError(f"irrep matrices of {irr.label} do not reproduce its characters")
    # orthonormal basis: D_Gamma(g)_ij = M(g)_ij sqrt(n_i / n_j)
    factor = [[_clean(sp.sqrt(sp.radsimp(dom.to_sympy(norms[i]) / dom.to_sympy(norms[j]))))
               for j in range(d)] for i in range(d)]
    simple = all(f.is_Rational or (f.is_Pow and f.base.is_Rational) or (f.is_Mul and all(
        a.is_Rational or (a.is_Pow and a.base.is_Rational) for a in f.args)) for row in factor for f in row)
    zero = dom.zero
    out = []
    for M in small:
        rows = M.to_list()
        entries = []
        for i in range(d):
            for j in range(d):
                a = rows[i][j]
                if a == zero:
                    entries.append(sp.Integer(0))
                    continue
                v = sp.expand(dom.to_sympy(a) * factor[i][j])
                entries.append(v if simple else _clean(v))
        out.append(sp.ImmutableMatrix(d, d, entries))
    return tuple(out)
