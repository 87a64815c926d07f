"""Property-based checks of the solver against independent brute-force oracles.

For random groups, orientations and specs: every returned tensor is invariant
under every operation (exactly), and n_independent equals the rank of the
whole-group Reynolds average (tensym.testing, numeric) and the average of the
character (1/|G|) sum chi(g) computed by the cycle-index formula.
"""

import numpy as np
import sympy as sp
from hypothesis import given, settings, HealthCheck, strategies as st

import tensym
from tensym.groups import point_groups, reorient, rotation_from_axes
from tensym.testing import brute_force_dimension, is_invariant_numeric

GROUPS = list(point_groups())
SYMS = {
    2: [[], ["ji"], ["-ji"]],
    3: [[], ["ikj"], ["jik", "ikj"], ["-jik"], ["-jik", "-ikj"], ["jik"]],
    4: [["jikl", "ijlk", "klij"], ["jikl", "ijlk"], ["jikl"], ["jkli"], ["-jikl", "-ijlk"]],
}
# integer axis pairs (orthogonal) giving rotations with entries in Q, Q(sqrt 2), Q(sqrt 3), ...
FRAMES = [None, ((1, -1, 0), (1, 1, 1)), ((1, 0, 0), (0, 1, 1)), ((2, 1, 0), (0, 0, 1)), ((0, 1, 0), (1, 0, 0))]


def _spec(rank, syms, axial):
    return tensym.TensorSpec(rank, syms, axial=axial)


@settings(max_examples=30, deadline=None, suppress_health_check=[HealthCheck.too_slow])
@given(st.sampled_from(GROUPS), st.sampled_from([2, 3, 4]), st.data(), st.booleans(), st.sampled_from(FRAMES))
def test_invariant_and_dimension(symbol, rank, data, axial, frame):
    syms = data.draw(st.sampled_from(SYMS[rank]))
    spec = _spec(rank, syms, axial)
    group = tensym.point_group(symbol)
    if frame is not None:
        x, z = frame
        group = reorient(group, rotation_from_axes(new_x=x, new_z=z))
    form = tensym.tensor_form(spec, group)
    # dimension: brute-force Reynolds average (numeric, whole group)
    assert form.n_independent == brute_force_dimension(spec, group)
    # dimension: average character by the cycle-index formula (exact)
    chi = sum(spec.character(op) for op in group.operations) / group.order
    assert sp.nsimplify(sp.simplify(chi)) == form.n_independent
    # every basis tensor is invariant under every operation
    for t in form.numeric_basis():
        for op in group.operations:
            assert is_invariant_numeric(t, op, spec)


def test_exact_invariance_of_symbolic_tensor():
    # exact check for a hexagonal group: R.T == T with sympy arithmetic
    form = tensym.tensor_form("elastic_stiffness", "6/mmm")
    T = sp.Array(form.tensor)
    for op in tensym.point_group("6/mmm").generators:
        R = sp.Matrix(op.matrix)
        out = sp.tensorcontraction(sp.tensorproduct(R, R, R, R, T), (1, 8), (3, 9), (5, 10), (7, 11))
        assert sp.simplify(sp.Array(out) - T) == sp.Array(np.zeros((3, 3, 3, 3), dtype=int).tolist())
