"""Exact rotation of symbolic tensors, numeric rotation against it, stiffness <-> compliance."""

import numpy as np
import pytest
import sympy as sp

import tensym
from tensym.errors import DataError, InvalidOperationError, InvalidSpecError
from tensym.tensors.rotate import rotate_tensor, rotation_matrix_of


@pytest.mark.parametrize("name", ["piezoelectric_d", "elastic_stiffness", "optical_activity", "pyroelectric"])
def test_forms_are_invariant_under_their_groups_exactly(name):
    # the defining property of a reduced form: the group's operations leave it unchanged (the
    # generators, hence every element); and a general rotation does not
    for g in ("32", "3m", "-6m2", "-42m", "4/m", "23", "6mm", "m"):
        f = tensym.tensor_form(name, g)
        for op in tensym.point_group(g).generators:
            assert rotate_tensor(f, op) == f.tensor, (name, g, op)
    f = tensym.tensor_form(name, "1")
    assert rotate_tensor(f, tensym.rotation_about([0, 0, 1], sp.pi / 2)) != f.tensor


def test_axial_parity_and_exact_entries():
    a, b, c = sp.symbols("a b c", real=True)
    g = sp.Array([[a, 0, 0], [0, b, 0], [0, 0, c]])
    inv = -sp.eye(3)
    assert rotate_tensor(g, inv) == g
    assert rotate_tensor(g, inv, axial=True) == -g
    r6 = tensym.rotation_about([0, 0, 1], sp.pi / 3)  # entries with sqrt(3)
    out = rotate_tensor(g, r6)
    assert out[0, 0] == sp.expand(a / 4 + 3 * b / 4) and out[2, 2] == c
    assert rotate_tensor(sp.Array(5), sp.eye(3)) == sp.Array(5)


def test_numeric_rotation_matches_exact_rotation():
    f = tensym.tensor_form("elastic_stiffness", "-3m")
    vals = [87.0, 7.0, 12.0, -18.0, 107.0, 58.0]
    r = tensym.rotation_about([1, 1, 1], 2 * sp.pi / 3)
    exact = rotate_tensor(f, r).subs(dict(zip(f.symbols, vals)))
    numeric = tensym.rotate_values(f.evaluate(vals, full=True), np.array(r.tolist(), dtype=float),
                                   "elastic_stiffness")
    assert np.allclose(np.array(exact.tolist(), dtype=float), numeric)


def test_rotation_refusals():
    with pytest.raises(InvalidOperationError, match="float entries"):
        rotation_matrix_of([[1.0, 0, 0], [0, 0.5, 0], [0, 0, 1]])
    with pytest.raises(InvalidOperationError, match="must be 3x3"):
        rotation_matrix_of(sp.eye(2))
    with pytest.raises(InvalidOperationError, match="not orthogonal"):
        rotation_matrix_of([[1, 1, 0], [0, 1, 0], [0, 0, 1]])
    with pytest.raises(InvalidOperationError, match="cannot read"):
        rotation_matrix_of(object())
    with pytest.raises(InvalidSpecError, match="every dimension 3"):
        rotate_tensor(sp.Array([[1, 2], [3, 4]]), sp.eye(3))
    with pytest.raises(InvalidSpecError, match="cannot read"):
        rotate_tensor(object(), sp.eye(3))


def _hexagonal_c():
    return np.array(tensym.tensor_form("elastic_stiffness", "6/mmm").evaluate([200.0, 80.0, 60.0, 180.0, 40.0]))


def test_stiffness_compliance_inversion():
    c = _hexagonal_c()
    s = tensym.invert_elastic(c, "elastic_stiffness")
    assert np.allclose(s @ c, np.eye(6))   # [s] = [c]^-1 with the handbook factors (Nye 1985, ch. VIII)
    # s66 = 2 (s11 - s12) for hexagonal compliances (Nye 1985, Table 9, from memory)
    assert s[5, 5] == pytest.approx(2 * (s[0, 0] - s[0, 1]))
    assert tensym.check_tensor(s, "elastic_compliance", "6/mmm").residual_fraction < 1e-12
    # full tensors: the compliance tensor is the inverse on symmetric strains, S_ijkl C_klmn = I_ijmn
    cf = tensym.from_voigt(c, "elastic_stiffness")
    sf = tensym.invert_elastic(cf, "elastic_stiffness")
    ident = np.einsum("ijkl,klmn->ijmn", sf, cf)
    sym = 0.5 * (np.einsum("im,jn->ijmn", np.eye(3), np.eye(3)) + np.einsum("in,jm->ijmn", np.eye(3), np.eye(3)))
    assert np.allclose(ident, sym)
    stack = tensym.invert_elastic(np.stack([c, 2 * c]), "elastic_stiffness")
    assert np.allclose(stack[1], s / 2)


def test_inversion_of_data_propagates_uncertainty():
    rng = np.random.default_rng(8)
    c = _hexagonal_c()
    sig = np.full((6, 6), 0.5)
    d = tensym.tensor_data(c, "elastic_stiffness", sigma=sig, units="GPa")
    s = tensym.invert_data(d)
    assert s.property.name == "elastic_compliance" and s.units == "1/GPa"
    assert np.allclose(s.voigt, tensym.invert_elastic(c, "elastic_stiffness"))
    # first-order propagation against a seeded Monte Carlo (noise small enough for linearity)
    lay = d.layout
    n = 1000
    samples = d.components + rng.standard_normal((n, 21)) * 0.5
    inv = tensym.invert_elastic(lay.x_to_voigt(samples), "elastic_stiffness")
    comps = tensym.check_tensors(inv, "elastic_compliance", "1").constants   # triclinic: all 21 components
    spread = comps.std(axis=0, ddof=1)
    assert np.allclose(spread, s.sigma, rtol=4 / np.sqrt(2 * (n - 1)) + 0.02)
    back = tensym.invert_data(s)
    assert np.allclose(back.components, d.components) and back.units == "GPa"


def test_inversion_refusals():
    c = _hexagonal_c()
    with pytest.raises(DataError, match="piezoelectric_d has no inverse here"):
        tensym.invert_elastic(np.zeros((3, 6)), "piezoelectric_d")
    with pytest.raises(DataError, match=r"must be Voigt matrices \(..., 6, 6\)"):
        tensym.invert_elastic(np.zeros((3, 6)))
    bad = c.copy()
    bad[0, 0] = np.nan
    with pytest.raises(DataError, match=r"contains NaN \(a component that is not given\): the inverse needs every"):
        tensym.invert_elastic(bad)
    bad = c.copy()
    bad[0, 1] += 1.0
    with pytest.raises(DataError, match="not symmetric"):
        tensym.invert_elastic(bad)
    with pytest.raises(DataError, match="singular"):
        tensym.invert_elastic(np.zeros((6, 6)))
    with pytest.raises(DataError, match="needs a TensorData"):
        tensym.invert_data(c)
    with pytest.raises(DataError, match="has no inverse here"):
        tensym.invert_data(tensym.tensor_data(np.zeros(3), "pyroelectric"))
