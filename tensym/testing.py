"""Brute-force oracles for the fast exact paths (used by the test-suite).

These are slow, simple and independent of the solver: they build the whole
3**n x 3**n representation numerically and average it over every element of a
finite group.

Examples
--------
>>> from tensym.testing import brute_force_dimension
>>> from tensym.tensors.spec import TensorSpec
>>> from tensym.groups.finite import PointGroup
>>> from tensym.groups.operations import Operation
>>> g = PointGroup.from_generators([Operation.from_triplet("-x,-y,-z")])
>>> brute_force_dimension(TensorSpec(3), g)
0
"""

from functools import reduce

import numpy as np

__all__ = ["brute_force_dimension", "symmetrizer", "full_matrix", "is_invariant_numeric", "brute_force_partners",
           "cubic_voigt", "hexagonal_voigt"]


def full_matrix(R, rank):
    """The 3**rank x 3**rank matrix R x R x ... x R (float)."""
    return reduce(np.kron, [np.asarray(R, dtype=float)] * rank, np.ones((1, 1)))


def symmetrizer(spec):
    """Projector onto the tensors with the spec's index symmetry (float, 3**n square)."""
    n = spec.rank
    N = 3**n
    P = np.zeros((N, N))
    idx = np.array(np.unravel_index(np.arange(N), (3,) * n)).T
    w = 3 ** np.arange(n - 1, -1, -1)
    group = spec.permutation_group()
    for sign, perm in group:
        permuted = idx[:, list(perm)] @ w
        P[np.arange(N), permuted] += sign
    return P / len(group)


def brute_force_dimension(spec, group):
    """Rank of the group average of parity(g) R^(x)n restricted by the symmetrizer."""
    S = symmetrizer(spec)
    avg = np.zeros_like(S)
    for op in group.operations:
        avg += spec.parity(op) * full_matrix(op.numeric, spec.rank)
    avg /= group.order
    return int(np.linalg.matrix_rank(avg @ S, tol=1e-8))


def is_invariant_numeric(tensor, op, spec, atol=1e-10):
    """True when parity(op) * R.T.R...R equals the tensor (float arrays)."""
    T = np.asarray(tensor, dtype=float)
    R = op.numeric
    out = T
    for k in range(spec.rank):
        out = np.moveaxis(np.tensordot(R, out, axes=([1], [k])), 0, k)
    return bool(np.allclose(spec.parity(op) * out, T, atol=atol))


def brute_force_partners(space, group, *, real=True):
    """Partner coordinates of a symmetry-adapted basis from projectors summed over the whole group.

    The slow path of tensym before issue 11 (sympy ``DomainMatrix`` arithmetic):
    ``P_ij = (d/|G|) sum_g conj(D_ij(g)) D(g)`` over every element, the pivot
    columns of P_11 orthogonalised in the space's Gram matrix, partners
    ``P_i1 u``; real forms of complex pairs as sqrt(2) (Re u, Im u).  Used as
    the oracle of :func:`tensym.reps.projection.symmetry_adapted`, which
    solves linear conditions on the generators instead.

    Returns
    -------
    list of (label, copy, tuple of sympy.ImmutableMatrix)
        One entry per partner set, in the order of ``symmetry_adapted``.

    Examples
    --------
    >>> from tensym.reps.spaces import polynomials
    >>> [(lab, [list(v) for v in vs]) for lab, _, vs in brute_force_partners(polynomials(1), "4mm")]
    [('A1', [[0, 0, 1]]), ('E', [[1, 0, 0], [0, 1, 0]])]
    """
    import sympy as sp
    from sympy.polys.matrices import DomainMatrix

    from tensym.reps.inputs import as_group_arg, as_space_arg
    from tensym.reps.linalg import generator_data, to_dm, unify
    from tensym.reps.reduction import multiplicities, space_characters
    from tensym.reps.table import finite_table

    G = as_group_arg(group)
    V = as_space_arg(space)
    t = finite_table(G)
    mult = multiplicities(t, space_characters(V, t), real=real)
    Gram = to_dm(sp.Matrix(V.gram()))

    def inner(a, Gm, b, dom, is_real):
        if is_real:
            return (a.transpose() * Gm * b).to_list()[0][0]
        val = sp.expand((a.to_Matrix().H * Gm.to_Matrix() * b.to_Matrix())[0, 0])
        return dom.from_sympy(val)

    def partners(irr, m):
        d, n = irr.dim, G.order
        gens, gmats_space, walk = generator_data(V, G)
        irr_mats = t.matrices(irr.label)
        gen_irr = [to_dm(sp.Matrix(irr_mats[i])) for i in gens]
        all_m = unify(gmats_space + gen_irr + [Gram]) if gens else [Gram]
        k = len(gens)
        gm_space, gm_irr, Gm = all_m[:k], all_m[k:2 * k], all_m[-1]
        dom, dim = Gm.domain, V.dim
        Ds = [DomainMatrix.eye(dim, dom)] + [None] * (n - 1)
        Dg = [DomainMatrix.eye(d, dom)] + [None] * (n - 1)
        for p, kk, e in walk:
            Ds[p] = gm_space[kk] * Ds[e]
            Dg[p] = gm_irr[kk] * Dg[e]
        conj = (lambda a: dom.from_sympy(sp.conjugate(dom.to_sympy(a)))) if not irr.is_real else (lambda a: a)

        def P(i, j):
            acc = DomainMatrix.zeros((dim, dim), dom)
            for Dm, Gm_ in zip(Ds, Dg):
                c = Gm_.to_list()[i][j]
                if c != dom.zero:
                    acc = acc + Dm * conj(c)
            return acc * dom.convert(sp.Rational(d, n))

        P11 = P(0, 0)
        _, piv = P11.rref()
        assert len(piv) == m
        basis, norms = [], []
        for j in piv:
            w = P11.extract(list(range(dim)), [j])
            for b, nb in zip(basis, norms):
                w = w - b * dom.quo(inner(b, Gm, w, dom, irr.is_real), nb)
            basis.append(w)
            norms.append(inner(w, Gm, w, dom, irr.is_real))
        Ps = [P11] + [P(i, 0) for i in range(1, d)]
        out = []
        for copy, (u, nu) in enumerate(zip(basis, norms)):
            root = sp.sqrt(sp.radsimp(dom.to_sympy(nu)))
            vecs = tuple(sp.ImmutableMatrix([sp.radsimp(sp.expand(a / root)) for a in (Ps[i] * u).to_Matrix()])
                         for i in range(d))
            out.append((irr.label, copy, vecs))
        return out

    result = []
    for irr in (t.real_irreps if real else t.irreps):
        m = mult.get(irr.label, 0)
        if not m:
            continue
        if irr.label in t.labels:
            result += partners(irr, m)
            continue
        member = next(i for i in t.irreps if i.real_label == irr.label and i.label.startswith("1"))
        r2 = sp.sqrt(2)
        for _lab, copy, (u,) in partners(member, m):
            parts = tuple(sp.ImmutableMatrix([sp.radsimp(sp.expand(r2 * f(sp.expand_complex(v)))) for v in u])
                          for f in (sp.re, sp.im))
            result.append((irr.label, copy, parts))
    return result


def cubic_voigt(c11, c12, c44):
    """6x6 float64 stiffness of the cubic pattern (Nye 1985, ch. VIII, from memory).

    c11 = c22 = c33, c12 = c13 = c23, c44 = c55 = c66, the rest zero.

    Examples
    --------
    >>> float(cubic_voigt(3.0, 1.0, 2.0)[2, 1]), float(cubic_voigt(3.0, 1.0, 2.0)[5, 5])
    (1.0, 2.0)
    """
    c = np.zeros((6, 6))
    c[:3, :3] = c12
    c[[0, 1, 2], [0, 1, 2]] = c11
    c[[3, 4, 5], [3, 4, 5]] = c44
    return c


def hexagonal_voigt(c11, c12, c13, c33, c44):
    """6x6 float64 stiffness of the hexagonal pattern (Nye 1985, ch. VIII, from memory): c66 = (c11 - c12)/2.

    Examples
    --------
    >>> float(hexagonal_voigt(5.0, 1.0, 2.0, 6.0, 3.0)[5, 5])
    2.0
    """
    c = np.zeros((6, 6))
    c[0, 0] = c[1, 1] = c11
    c[0, 1] = c[1, 0] = c12
    c[0, 2] = c[2, 0] = c[1, 2] = c[2, 1] = c13
    c[2, 2] = c33
    c[3, 3] = c[4, 4] = c44
    c[5, 5] = (c11 - c12) / 2
    return c
