"""Exact linear algebra for representations: matrices over number fields (private kernels).

Matrices are sympy ``DomainMatrix`` objects over QQ or an algebraic field such
as QQ<sqrt(3)> or QQ<sqrt(5)> (found by sympy from the entries), which keeps
products, ranks and null spaces exact and fast.  The action of a whole finite
group is built from the generators alone: D(g h) = D(g) D(h) along a
breadth-first walk of the Cayley table, one matrix product per element.

Examples
--------
>>> from tensym.groups import point_group
>>> from tensym.reps.spaces import harmonics
>>> mats = group_actions(harmonics(1), point_group("m-3m"))
>>> len(mats), mats[0].domain
(48, QQ)
"""

from sympy.polys.matrices import DomainMatrix
import sympy as sp

__all__ = ["to_dm", "unify", "group_actions", "to_sympy_matrix", "element_to_sympy"]


def to_dm(matrix):
    """A sympy matrix as a DomainMatrix over the smallest field sympy finds (extension=True)."""
    if isinstance(matrix, DomainMatrix):
        return matrix
    dm = DomainMatrix.from_Matrix(sp.Matrix(matrix), extension=True)
    return dm if dm.domain.is_Field else dm.to_field()


def unify(mats):
    """Convert DomainMatrices to one common domain (list)."""
    dom = mats[0].domain
    for m in mats[1:]:
        if m.domain != dom:
            try:
                dom = dom.unify(m.domain)
            except Exception:  # pragma: no cover - incompatible algebraic fields
                dom = sp.EX
    return [m.convert_to(dom) if m.domain != dom else m for m in mats]


def element_to_sympy(dom, a):
    """One domain element as a sympy expression."""
    return dom.to_sympy(a)


def to_sympy_matrix(dm):
    """A DomainMatrix as a sympy ImmutableMatrix with expanded entries."""
    m = dm.to_Matrix()
    return sp.ImmutableMatrix(m.shape[0], m.shape[1], [sp.expand(v) for v in m])


_CACHE = {}


def _space_action_dm(space, op):
    f = getattr(space, "_action_dm", None)
    if f is not None:
        return f(op)
    return to_dm(space.action(op))


def group_actions(space, group):
    """DomainMatrices D(g) of every operation of a finite group (a tuple aligned with group.operations).

    Only the generators' actions are asked of the space; cached per (space, group).
    """
    from tensym.reps.table import group_key

    key = (id(space), group_key(group))
    hit = _CACHE.get(key)
    if hit is not None and hit[0] is space:
        return hit[1]
    ops = group.operations
    n = len(ops)
    table = group.multiplication_table
    gens = [group.index(g) for g in group.generators if not g.is_identity or g.time_reversal]
    gen_mats = [_space_action_dm(space, ops[i]) for i in gens]
    dim = space.dim
    if gen_mats:
        gen_mats = unify(gen_mats)
        dom = gen_mats[0].domain
    else:
        dom = sp.QQ
    ident = DomainMatrix.eye(dim, dom)
    mats = [None] * n
    mats[0] = ident
    frontier = [0]
    while frontier:
        nxt = []
        for e in frontier:
            for gi, gm in zip(gens, gen_mats):
                p = int(table[gi, e])
                if mats[p] is None:
                    mats[p] = gm * mats[e]
                    nxt.append(p)
        frontier = nxt
    if any(m is None for m in mats):
        # generators do not reach every element: fall back to the space's own action
        mats = unify([m if m is not None else _space_action_dm(space, ops[i]) for i, m in enumerate(mats)])
    mats = tuple(mats)  # cached and shared: a tuple, so a caller cannot replace an element
    if len(_CACHE) > 512:
        _CACHE.clear()
    _CACHE[key] = (space, mats)
    return mats


def generator_data(space, group):
    """(generator indices, their DomainMatrices in one field, BFS order of (element, generator, parent))."""
    ops = group.operations
    table = group.multiplication_table
    gens = [group.index(g) for g in group.generators if not g.is_identity or g.time_reversal]
    mats = unify([_space_action_dm(space, ops[i]) for i in gens]) if gens else []
    seen = [False] * len(ops)
    seen[0] = True
    walk = []
    frontier = [0]
    while frontier:
        nxt = []
        for e in frontier:
            for k, gi in enumerate(gens):
                p = int(table[gi, e])
                if not seen[p]:
                    seen[p] = True
                    walk.append((p, k, e))
                    nxt.append(p)
        frontier = nxt
    if not all(seen):
        raise ArithmeticError("the generators do not reach every element of the group")
    return gens, mats, walk


def orbit(vector, gen_mats, walk, n):
    """D(g) v for every element (list aligned with the operations), by the BFS walk."""
    out = [None] * n
    out[0] = vector
    for p, k, e in walk:
        out[p] = gen_mats[k] * out[e]
    return out
