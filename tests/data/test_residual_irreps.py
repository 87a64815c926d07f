"""The residual broken down by irreps: the trivial irrep is dropped by identity, magnetic groups included.

Regression: check_tensor and check_tensors dropped the first isotypic projector (``[1:]``), assuming it was the
trivial irrep.  When the tensor space has no invariant (a pyroelectric vector in mmm, a magnetization in -1'),
the first projector is a real residual irrep, and it vanished from the breakdown.
"""

import math

import numpy as np
import pytest

import tensym


def _fractions(report):
    return {p.label: p.fraction for p in report.irreps}


def test_trivial_irrep_dropped_by_label_not_position_pyroelectric_mmm():
    # D2h: z transforms as B1u, y as B2u, x as B3u (Cotton 1990, Appendix IIA; from memory); mmm forbids p
    p = np.array([0.3, -0.4, 1.2])
    r = tensym.check_tensor(p, "pyroelectric", "mmm")
    assert [(q.label, q.multiplicity) for q in r.irreps] == [("B1u", 1), ("B2u", 1), ("B3u", 1)]
    norm = np.linalg.norm(p)
    f = _fractions(r)
    assert f["B1u"] == pytest.approx(1.2 / norm, abs=1e-12)
    assert f["B2u"] == pytest.approx(0.4 / norm, abs=1e-12)
    assert f["B3u"] == pytest.approx(0.3 / norm, abs=1e-12)
    assert r.residual_fraction == pytest.approx(1.0, abs=1e-12)
    assert math.fsum(q.fraction**2 for q in r.irreps) == pytest.approx(1.0, abs=1e-12)


def test_trivial_irrep_dropped_by_label_not_position_in_batch():
    p = np.array([[0.3, -0.4, 1.2], [0.0, 0.0, 2.0]])
    b = tensym.check_tensors(p, "pyroelectric", "mmm")
    assert b.irrep_labels == ("B1u", "B2u", "B3u")
    assert np.allclose(b.irrep_fractions[1], [1.0, 0.0, 0.0], atol=1e-12)
    single = tensym.check_tensor(p[0], "pyroelectric", "mmm")
    assert np.allclose(b.irrep_fractions[0], [q.fraction for q in single.irreps], atol=1e-12)


def test_trivial_irrep_still_dropped_when_present():
    # a space with invariants: the trivial irrep (all characters 1) is the one left out, wherever it stands
    rng = np.random.default_rng(5)
    d = tensym.tensor_data(rng.normal(size=21), "elastic_stiffness", layout="components")
    for g in ("mmm", "m-3m", "4'/m", "mmm1'"):
        r = tensym.check_tensor(d, group=g)
        trivial = tensym.character_table(g).real_irreps[0]
        assert set(trivial.characters) == {1}
        assert trivial.label not in _fractions(r)
        total = math.sqrt(math.fsum(q.fraction**2 for q in r.irreps))
        assert total == pytest.approx(r.residual_fraction, rel=1e-10), g


@pytest.mark.parametrize("black_white, parent", [("4'/m", "4/m"), ("m'm'm", "mmm"), ("-3'm'", "-3m"),
                                                 ("6'/mmm'", "6/mmm")])
def test_elastic_in_black_and_white_group_matches_its_parent(black_white, parent):
    # elastic stiffness is time-even: primed operations act through their spatial part, so a
    # black-and-white group imposes its parent's constraints (Birss 1964; from memory) and the
    # breakdown, labelled by the parent's irreps, is the parent's
    rng = np.random.default_rng(7)
    d = tensym.tensor_data(rng.normal(size=21), "elastic_stiffness", layout="components")
    a = tensym.check_tensor(d, group=black_white)
    b = tensym.check_tensor(d, group=parent)
    assert [(q.label, q.multiplicity) for q in a.irreps] == [(q.label, q.multiplicity) for q in b.irreps]
    assert np.allclose([q.fraction for q in a.irreps], [q.fraction for q in b.irreps], atol=1e-12)
    assert a.residual_fraction == pytest.approx(b.residual_fraction, abs=1e-12)


def test_time_odd_vector_in_black_and_white_group_keeps_its_only_irrep():
    # -1': the inversion carries time reversal, so an axial time-odd vector (magnetization) is odd under
    # -1' and transforms as Au; the space has no invariant (common practice: -1' forbids ferromagnetism)
    m = np.array([0.5, -1.0, 2.0])
    r = tensym.check_tensor(m, "magnetization", "-1'")
    assert [(q.label, q.dim, q.multiplicity) for q in r.irreps] == [("Au", 1, 3)]
    assert r.irreps[0].fraction == pytest.approx(1.0, abs=1e-12)
    b = tensym.check_tensors(m[None], "magnetization", "-1'")
    assert b.irrep_labels == ("Au",) and b.irrep_fractions[0, 0] == pytest.approx(1.0, abs=1e-12)


def test_magnetoelectric_check_in_minus3primem_prime():
    # Cr2O3-type group -3'm': alpha = diag(a11, a11, a33) (Dzyaloshinskii 1959)
    alpha = np.diag([2.0, 2.0, 5.0])
    r = tensym.check_tensor(alpha, "magnetoelectric", "-3'm'")
    assert r.passes and r.residual_fraction == pytest.approx(0.0, abs=1e-14)
    assert [(c.name, round(c.value, 12)) for c in r.constants] == [("alpha11", 2.0), ("alpha33", 5.0)]
    # an antisymmetric part about z (alpha12 = -alpha21) lies in A2g; a11 != a22 in Eg
    bad = alpha.copy()
    bad[0, 1], bad[1, 0] = 0.3, -0.3
    r = tensym.check_tensor(bad, "magnetoelectric", "-3'm'")
    assert [(q.label, q.multiplicity) for q in r.irreps] == [("A2g", 1), ("Eg", 3)]
    f = _fractions(r)
    assert f["A2g"] == pytest.approx(math.sqrt(0.18) / np.linalg.norm(bad), abs=1e-12)
    assert f["Eg"] == pytest.approx(0.0, abs=1e-12)
    assert not r.passes and {x.label for x in r.forbidden if x.value} == {"alpha12", "alpha21"}
    bad = np.diag([2.0, 2.2, 5.0])
    f = _fractions(tensym.check_tensor(bad, "magnetoelectric", "-3'm'"))
    assert f["A2g"] == pytest.approx(0.0, abs=1e-12) and f["Eg"] > 0.01


def test_elastic_check_in_grey_group():
    # a grey group forbids nothing more for a time-even tensor: mmm1' gives mmm's 9 constants
    # (Nye 1985, orthorhombic elasticity; from memory), and the breakdown carries the time parity '+'
    f = tensym.tensor_form("elastic_stiffness", "mmm")
    c = np.array(f.evaluate([float(v) for v in range(10, 19)]), dtype=float)
    r = tensym.check_tensor(c, "elastic_stiffness", "mmm1'")
    assert r.passes and len(r.constants) == 9
    rng = np.random.default_rng(9)
    d = tensym.tensor_data(rng.normal(size=21), "elastic_stiffness", layout="components")
    grey = tensym.check_tensor(d, group="mmm1'")
    plain = tensym.check_tensor(d, group="mmm")
    assert [(q.label, q.multiplicity) for q in grey.irreps] == [("B1g+", 4), ("B2g+", 4), ("B3g+", 4)]
    assert np.allclose([q.fraction for q in grey.irreps], [q.fraction for q in plain.irreps], atol=1e-12)
    b = tensym.check_tensors(np.stack([d.components]), "elastic_stiffness", "mmm1'", layout="components")
    assert b.irrep_labels == ("B1g+", "B2g+", "B3g+")
    assert np.allclose(b.irrep_fractions[0], [q.fraction for q in grey.irreps], atol=1e-12)


def test_time_odd_vector_in_grey_group_is_wholly_residual():
    # every grey group forbids every time-odd tensor (Birss 1964); in mmm1' the magnetization components
    # Mz, My, Mx (rotations Rz, Ry, Rx: B1g, B2g, B3g of D2h, Cotton 1990; from memory) are time-odd
    m = np.array([0.1, 0.2, 0.7])
    r = tensym.check_tensor(m, "magnetization", "mmm1'")
    assert not r.constants and r.residual_fraction == pytest.approx(1.0, abs=1e-12)
    assert [q.label for q in r.irreps] == ["B1g-", "B2g-", "B3g-"]
    f = _fractions(r)
    norm = np.linalg.norm(m)
    assert (f["B1g-"], f["B2g-"], f["B3g-"]) == pytest.approx((0.7 / norm, 0.2 / norm, 0.1 / norm), abs=1e-12)
