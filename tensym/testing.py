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

__all__ = ["brute_force_dimension", "symmetrizer", "full_matrix", "is_invariant_numeric"]


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
