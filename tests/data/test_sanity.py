"""Physical sanity: positive definiteness of stiffness, compliance, permittivity, conductivities (issue 11).

Oracles: the eigenvalues of a cubic stiffness in Mandel form are c11 + 2 c12 (once), c11 - c12 (twice) and
2 c44 (three times), and a hexagonal stiffness is stable if and only if c11 > |c12|, 2 c13^2 < c33 (c11 + c12)
and c44 > 0 (F. Mouhat and F.-X. Coudert, Phys. Rev. B 90, 224104 (2014), eqs. for the cubic and hexagonal
classes; from memory).
"""

import numpy as np
import pytest
from hypothesis import given, settings, strategies as st

import tensym
from tensym.testing import cubic_voigt as _cubic, hexagonal_voigt as _hexagonal


def test_user_checks_an_unstable_cubic_stiffness():
    # before issue 11: 'consistent' with no remark
    r = tensym.check_tensor(_cubic(100.0, 150.0, -5.0), "elastic_stiffness", "m-3m", units="GPa")
    assert r.verdict == "consistent"          # the symmetry is fine ...
    assert r.positive_definite is False       # ... the physics is not
    assert r.eigenvalues.tolist() == pytest.approx(sorted([400.0, -50.0, -50.0, -10.0, -10.0, -10.0]), abs=1e-9)
    assert len(r.warnings) == 1 and "mechanically unstable" in r.warnings[0]
    assert "WARNING" in r.text() and "-50" in r.text()
    assert r.record()["positive_definite"] is False


@settings(max_examples=100, deadline=None, derandomize=True)
@given(c11=st.floats(-50, 300), c12=st.floats(-200, 200), c44=st.floats(-50, 100))
def test_user_checks_cubic_stiffnesses_and_gets_the_mandel_eigenvalues(c11, c12, c44):
    r = tensym.check_tensor(_cubic(c11, c12, c44), "elastic_stiffness", "m-3m")
    expect = sorted([c11 + 2 * c12, c11 - c12, c11 - c12, 2 * c44, 2 * c44, 2 * c44])
    if all(v == 0 for v in expect):
        return
    assert r.eigenvalues.tolist() == pytest.approx(expect, abs=1e-9)
    stable = c11 - c12 > 0 and c11 + 2 * c12 > 0 and c44 > 0
    big = max(abs(v) for v in expect)
    if min(abs(v) for v in expect) > 1e-8 * big:   # away from the boundary
        assert r.positive_definite == stable


@settings(max_examples=100, deadline=None, derandomize=True)
@given(c11=st.floats(1, 300), c12=st.floats(-300, 300), c13=st.floats(-200, 200), c33=st.floats(-50, 300),
       c44=st.floats(-20, 100))
def test_user_checks_hexagonal_stiffnesses_against_the_stability_conditions(c11, c12, c13, c33, c44):
    conds = [c11 - abs(c12), c33 * (c11 + c12) - 2 * c13**2, c44]
    if min(abs(v) for v in conds) < 1e-3:
        return  # too near the boundary for a strict comparison
    r = tensym.check_tensor(_hexagonal(c11, c12, c13, c33, c44), "elastic_stiffness", "6/mmm")
    assert r.positive_definite == all(v > 0 for v in conds)


def test_user_checks_a_compliance_and_its_eigenvalues_are_the_inverse_of_the_stiffness_ones():
    c = _hexagonal(200.0, 80.0, 60.0, 180.0, 40.0)
    s = tensym.invert_elastic(c)
    rc = tensym.check_tensor(c, "elastic_stiffness", "6/mmm")
    rs = tensym.check_tensor(s, "elastic_compliance", "6/mmm")
    assert rs.positive_definite and rc.positive_definite
    assert sorted(1.0 / rs.eigenvalues) == pytest.approx(sorted(rc.eigenvalues), rel=1e-9)
    bad = tensym.check_tensor(-s, "elastic_compliance", "6/mmm")
    assert bad.positive_definite is False and "mechanically unstable" in bad.warnings[0]


@pytest.mark.parametrize("what", ["dielectric_permittivity", "dielectric_impermeability", "thermal_conductivity",
                                  "electrical_conductivity"])
def test_user_checks_a_rank_two_property_with_a_negative_principal_value(what):
    r = tensym.check_tensor(np.diag([2.0, 2.0, -3.0]), what, "4/mmm")
    assert r.eigenvalues.tolist() == pytest.approx([-3.0, 2.0, 2.0]) and r.positive_definite is False
    assert "not positive definite" in r.warnings[0]
    assert tensym.check_tensor(np.diag([2.0, 2.0, 3.0]), what, "4/mmm").warnings == ()


@pytest.mark.parametrize("what", ["thermal_expansion", "magnetic_susceptibility", "seebeck"])
def test_user_checks_a_property_that_may_be_negative(what):
    # negative thermal expansion, diamagnetism and a negative Seebeck coefficient are physical
    r = tensym.check_tensor(np.diag([2.0, 2.0, -3.0]), what, "4/mmm")
    assert r.eigenvalues is None and r.positive_definite is None and r.warnings == ()


def test_user_checks_a_batch_with_unstable_tensors():
    stack = np.stack([_cubic(200, 100, 80), _cubic(100, 150, -5), _cubic(200, 100, 80), np.zeros((6, 6))])
    b = tensym.check_tensors(stack, "elastic_stiffness", "m-3m")
    assert b.positive_definite.tolist() == [True, False, True, False]
    assert b.eigenvalues.shape == (4, 6)
    assert b.eigenvalues[1].tolist() == pytest.approx([-50.0, -50.0, -10.0, -10.0, -10.0, 400.0], abs=1e-9)
    assert "WARNING: 1 tensor(s) not positive definite" in str(b)
    for i in range(3):
        assert tensym.check_tensor(stack[i], "elastic_stiffness", "m-3m").positive_definite == \
            b.positive_definite[i]
    assert tensym.check_tensors(stack[:, :3, :3] * 0 + np.eye(3), "thermal_expansion", "m-3m").eigenvalues is None
