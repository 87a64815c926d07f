"""check_tensor / check_tensors: literature constants, injected components, propagated uncertainties."""

import json
import math

import mpmath
import numpy as np
import pytest
import sympy as sp

import tensym
from tensym.data.stats import chi2_sf
from tensym.errors import DataError, InvalidOptionError, UnknownGroupError

# --- literature constants (all from memory) -------------------------------------------------------
# alpha-quartz, class 32, 2-fold along x: elastic stiffness in GPa (R. Bechmann, Phys. Rev. 110, 1060
# (1958), as quoted in IEEE Std 176-1987; from memory; the sign of c14 depends on the axis convention).
Q_C11, Q_C12, Q_C13, Q_C14, Q_C33, Q_C44, Q_C66 = 86.74, 6.99, 11.91, -17.91, 107.2, 57.94, 39.88
# alpha-quartz piezoelectric strain coefficients in pC/N (Bechmann 1958; IEEE Std 176-1987; from memory).
Q_D11, Q_D14 = 2.31, -0.727
# lithium niobate, class 3m, mirror normal to x: stiffness in GPa and d in pC/N (A. W. Warner, M. Onoe,
# G. A. Coquin, J. Acoust. Soc. Am. 42, 1223 (1967); R. T. Smith, F. S. Welsh, J. Appl. Phys. 42, 2219
# (1971); from memory).
L_C11, L_C12, L_C13, L_C14, L_C33, L_C44, L_C66 = 203.0, 53.0, 75.0, 9.0, 245.0, 60.0, 75.0
L_D15, L_D22, L_D31, L_D33 = 68.0, 21.0, -1.0, 6.0


def _trigonal_c(c11, c12, c13, c14, c33, c44, c66):
    # the published Voigt matrix of the trigonal Laue class -3m with a 2-fold (or mirror normal) along x
    # (Nye 1985, ch. VIII, from memory): c22 = c11, c24 = -c14, c55 = c44, c56 = c14
    return np.array([[c11, c12, c13, c14, 0, 0], [c12, c11, c13, -c14, 0, 0], [c13, c13, c33, 0, 0, 0],
                     [c14, -c14, 0, c44, 0, 0], [0, 0, 0, 0, c44, c14], [0, 0, 0, 0, c14, c66]])


def test_quartz_elastic_passes_32_and_fails_hexagonal():
    c = _trigonal_c(Q_C11, Q_C12, Q_C13, Q_C14, Q_C33, Q_C44, Q_C66)
    r = tensym.check_tensor(c, "elastic_stiffness", "32", units="GPa")
    assert r.passes and r.residual_fraction < 1e-4
    assert [k.name for k in r.constants] == ["c11", "c12", "c13", "c14", "c33", "c44"]
    assert r.constant("c14").value == pytest.approx(Q_C14, abs=1e-9)
    # c66 = (c11 - c12)/2 is kept to the printed digits: 39.88 against 39.875
    rel = {t.label: t for t in r.relations}
    assert rel["c66"].discrepancy == pytest.approx(Q_C66 - (Q_C11 - Q_C12) / 2, abs=1e-12)
    h = tensym.check_tensor(c, "elastic_stiffness", "622", units="GPa")
    assert not h.passes
    assert {f.label: f.value for f in h.forbidden if f.value}["c14"] == Q_C14


def test_quartz_piezoelectric_passes_32_and_fails_622():
    d = np.array([[Q_D11, -Q_D11, 0, Q_D14, 0, 0], [0, 0, 0, 0, -Q_D14, -2 * Q_D11], [0, 0, 0, 0, 0, 0]])
    r = tensym.check_tensor(d, "piezoelectric_d", "32", units="pC/N")
    assert r.passes and r.residual_fraction < 1e-12
    assert [(k.name, k.value) for k in r.constants] == [("d11", Q_D11), ("d14", Q_D14)]
    h = tensym.check_tensor(d, "piezoelectric_d", "622", units="pC/N")
    assert not h.passes and {f.label for f in h.forbidden if f.value} >= {"d11", "d12", "d26"}


def test_lithium_niobate_passes_3m_and_fails_6mm():
    c = _trigonal_c(L_C11, L_C12, L_C13, L_C14, L_C33, L_C44, L_C66)
    assert tensym.check_tensor(c, "elastic_stiffness", "3m", units="GPa").passes
    assert not tensym.check_tensor(c, "elastic_stiffness", "6mm", units="GPa").passes
    # 3m with the mirror normal to x (IEEE Std 176-1987; Nye 1985): d16 = -2 d22, d21 = -d22, d24 = d15
    d = np.array([[0, 0, 0, 0, L_D15, -2 * L_D22], [-L_D22, L_D22, 0, L_D15, 0, 0], [L_D31, L_D31, L_D33, 0, 0, 0]])
    r = tensym.check_tensor(d, "piezoelectric_d", "3m", units="pC/N")
    assert r.passes and {k.name: k.value for k in r.constants} == {
        "d15": L_D15, "d22": L_D22, "d31": L_D31, "d33": L_D33}
    h = tensym.check_tensor(d, "piezoelectric_d", "6mm", units="pC/N")
    assert not h.passes and {f.label: f.value for f in h.forbidden if f.value}["d22"] == L_D22


# --- known truth by construction ---------------------------------------------------------------------
def _cubic(c11=160.0, c12=50.0, c44=80.0):
    return np.array(tensym.tensor_form("elastic_stiffness", "m-3m").evaluate([c11, c12, c44]))


def test_injected_forbidden_components_are_found_with_their_size():
    c = _cubic()
    c[0, 3] = c[3, 0] = 3.0
    c[2, 5] = c[5, 2] = -2.0
    r = tensym.check_tensor(c, "elastic_stiffness", "m-3m", sigma=np.full((6, 6), 0.5), units="GPa")
    found = {f.label: f for f in r.forbidden if f.value}
    assert set(found) == {"c14", "c36"}
    assert found["c14"].value == 3.0 and found["c14"].significance == pytest.approx(6.0)
    assert found["c36"].value == -2.0 and found["c36"].significance == pytest.approx(4.0)
    assert r.chi2 == pytest.approx(6.0**2 + 4.0**2) and r.dof == 18
    assert not r.passes and r.p_value == pytest.approx(float(chi2_sf(52.0, 18)))
    # the residual is the two components in every index tuple: 4 * 3^2 + 4 * 2^2 (Frobenius)
    t = r.data.tensor
    assert r.residual_fraction == pytest.approx(math.sqrt(4 * 9 + 4 * 4) / np.linalg.norm(t), rel=1e-12)


def test_broken_relation_with_propagated_uncertainty():
    f = tensym.tensor_form("elastic_stiffness", "6/mmm")
    c = np.array(f.evaluate([200.0, 80.0, 60.0, 180.0, 40.0]))
    c[5, 5] += 1.5
    sig = np.full((6, 6), 0.4)
    sig[0, 0], sig[0, 1], sig[1, 0], sig[5, 5] = 0.6, 0.2, 0.2, 0.3
    r = tensym.check_tensor(c, "elastic_stiffness", "6/mmm", sigma=sig)
    rel = {t.label: t for t in r.relations}["c66"]
    assert str(rel.relation) == "Eq(c66, c11/2 - c12/2)"
    assert rel.discrepancy == pytest.approx(1.5)
    assert rel.expected == pytest.approx(60.0)
    assert rel.sigma == pytest.approx(math.sqrt(0.3**2 + (0.6**2 + 0.2**2) / 4))


def test_propagated_uncertainties_agree_with_monte_carlo():
    # seeded Monte Carlo: the spread of the fitted constants over noisy copies of a -3m tensor matches
    # the propagated (A^T W A)^-1 within 4 standard errors of a sample standard deviation.
    rng = np.random.default_rng(20240601)
    f = tensym.tensor_form("elastic_stiffness", "-3m")
    c = np.array(f.evaluate([87.0, 7.0, 12.0, -18.0, 107.0, 58.0]))
    s = rng.uniform(0.1, 1.0, size=(6, 6))
    s = (s + s.T) / 2
    rep = tensym.check_tensor(c, "elastic_stiffness", "-3m", sigma=s)
    n = 4000
    noise = rng.standard_normal((n, 6, 6)) * s
    noise = np.triu(noise) + np.triu(noise, 1).transpose(0, 2, 1)
    b = tensym.check_tensors(c + noise, "elastic_stiffness", "-3m", sigma=np.broadcast_to(s, (n, 6, 6)))
    spread = b.constants.std(axis=0, ddof=1)
    prop = np.array([k.sigma for k in rep.constants])
    se = prop / math.sqrt(2 * (n - 1))
    assert np.all(np.abs(spread - prop) < 4 * se)
    assert np.allclose(b.constants_sigma, prop)
    # chi2 of a correct model has mean dof = 15 (standard error sqrt(2 dof / n))
    assert b.dof == 15 and abs(b.chi2.mean() - 15) < 4 * math.sqrt(30 / n)
    assert abs(b.p_value.mean() - 0.5) < 4 * math.sqrt(1 / 12 / n)  # p-values are uniform


def test_propagated_uncertainties_with_correlated_covariance():
    rng = np.random.default_rng(7)
    f = tensym.tensor_form("piezoelectric_d", "3m")
    d = np.array(f.evaluate([68.0, 21.0, -1.0, 6.0]))
    m = rng.normal(size=(18, 18)) * 0.2
    cov = m @ m.T + np.eye(18) * 0.05
    rep = tensym.check_tensor(d, "piezoelectric_d", "3m", covariance=cov)
    x0 = rep.data.components
    chol = np.linalg.cholesky(cov)
    n = 1000
    fits = np.array([[k.value for k in tensym.check_tensor(x0 + chol @ rng.standard_normal(18), "piezoelectric_d",
                                                            "3m", covariance=cov, layout="components").constants]
                     for _ in range(n)])
    spread = fits.std(axis=0, ddof=1)
    prop = np.sqrt(np.diag(rep.constants_covariance))
    assert np.all(np.abs(spread - prop) < 4 * prop / math.sqrt(2 * (n - 1)))


def test_frobenius_fit_is_the_group_average():
    # the Frobenius-norm projection equals the average of the tensor over the group (common practice)
    rng = np.random.default_rng(3)
    x = rng.normal(size=18)
    d = tensym.tensor_data(x, "piezoelectric_d", layout="components")
    g = tensym.point_group("-42m")
    avg = np.mean([tensym.rotate_values(d.tensor, op.numeric, "piezoelectric_d") for op in g.operations], axis=0)
    r = tensym.check_tensor(d, group=g)
    assert r.norm == "frobenius"
    assert np.allclose(tensym.to_voigt(avg, "piezoelectric_d"), r.symmetrized, atol=1e-12)
    assert r.residual_fraction == pytest.approx(np.linalg.norm(d.tensor - avg) / np.linalg.norm(d.tensor))


def test_residual_splits_by_irreps():
    rng = np.random.default_rng(11)
    d = tensym.tensor_data(rng.normal(size=21), "elastic_stiffness", layout="components")
    for g in ("m-3m", "6/mmm", "32", "4/m", "mm2"):
        r = tensym.check_tensor(d, group=g)
        total = math.sqrt(sum(p.fraction**2 for p in r.irreps))
        assert total == pytest.approx(r.residual_fraction, rel=1e-10), g
    labels = [p.label for p in tensym.check_tensor(d, group="m-3m").irreps]
    # l = 0, 2, 4 in Oh: the elastic tensor holds A1g 3 times, Eg 3, T1g 1, T2g 3 (Bethe 1929, from memory)
    assert labels == ["Eg", "T1g", "T2g"]
    assert [p.multiplicity for p in tensym.check_tensor(d, group="m-3m").irreps] == [3, 1, 3]


def test_misorientation_is_told_from_lower_symmetry():
    f = tensym.tensor_form("elastic_stiffness", "6/mmm")
    c = np.array(f.evaluate([200.0, 80.0, 60.0, 180.0, 40.0]))
    axis = np.array([1.0, 2.0, 0.0]) / math.sqrt(5)
    tilted = tensym.rotate_values(c, tensym.rotation_from_axis_angle(axis, 0.3), "elastic_stiffness")
    r = tensym.check_tensor(tilted, "elastic_stiffness", "6/mmm")
    assert r.misorientation == pytest.approx(0.3, rel=0.02)
    assert np.dot(r.misorientation_axis, axis) == pytest.approx(1.0, abs=1e-3)   # data = R_w . t_sym
    o = tensym.orient(tilted, "elastic_stiffness", "6/mmm")   # orient undoes it: R = R_w^T
    assert o.angle == pytest.approx(0.3, abs=1e-6) and np.dot(o.axis, axis) == pytest.approx(-1.0, abs=1e-9)
    assert r.rotation_fraction == pytest.approx(r.residual_fraction, rel=0.01)
    # first order in the angle: only the rotation-like irrep (E1g, the rotations about x and y)
    assert [p.label for p in r.irreps if p.fraction > 0.01 * r.residual_fraction] == ["E1g"]
    lower = c.copy()
    lower[0, 1] = lower[1, 0] = 82.0  # breaks c66 = (c11 - c12)/2: an E2g distortion, not a rotation
    r2 = tensym.check_tensor(lower, "elastic_stiffness", "6/mmm")
    assert r2.rotation_fraction < 1e-12 < r2.residual_fraction
    assert [p.label for p in r2.irreps if p.fraction > 1e-9] == ["E2g"]


def test_chi2_survival_against_mpmath():
    # mpmath.gammainc(k/2, x/2, inf, regularized=True) is P(chi2_k > x)
    for k in (1, 2, 3, 6, 15, 41, 500):
        for x in (0.0, 0.2, 1.0, 7.5, 30.0, 800.0):
            ref = float(mpmath.gammainc(k / 2, x / 2, mpmath.inf, regularized=True))
            assert float(chi2_sf(x, k)) == pytest.approx(ref, rel=1e-10, abs=1e-300)
    with pytest.raises(DataError, match="dof must be a positive integer"):
        chi2_sf(1.0, 0)


def test_batch_agrees_with_single_checks():
    rng = np.random.default_rng(5)
    base = np.array(tensym.tensor_form("elastic_stiffness", "4/mmm").evaluate([170., 120., 90., 190., 60., 70.]))
    noise = rng.normal(size=(6, 6, 6)) * 0.5
    stack = base + (noise + noise.transpose(0, 2, 1)) / 2
    sig = np.full((6, 6, 6), 0.3)
    b = tensym.check_tensors(stack, "elastic_stiffness", "4/mmm", sigma=sig, units="GPa", tol=0.003)
    assert len(b) == 6 and b.units == "GPa"
    for i in range(6):
        r = tensym.check_tensor(stack[i], "elastic_stiffness", "4/mmm", sigma=sig[i], tol=0.003)
        assert np.allclose([k.value for k in r.constants], b.constants[i])
        assert np.allclose([k.sigma for k in r.constants], b.constants_sigma[i])
        assert r.residual_fraction == pytest.approx(b.residual_fraction[i])
        assert r.p_value == pytest.approx(b.p_value[i])
        assert r.passes == bool(b.passes[i])
        assert np.allclose(r.symmetrized, b.symmetrized[i])
        assert np.allclose([p.fraction for p in r.irreps], b.irrep_fractions[i])
        assert np.allclose([t.discrepancy for t in r.relations], b.discrepancies[i])
        assert np.allclose([f.value for f in r.forbidden], b.forbidden[i])
        rr = b.report(i)
        assert rr.constants == r.constants and rr.p_value == pytest.approx(r.p_value)
    with pytest.raises(ValueError):
        b.constants[0, 0] = 0.0
    with pytest.raises(IndexError, match="outside 0..5"):
        b.report(6)
    full = tensym.check_tensors(np.array([tensym.from_voigt(v, "elastic_stiffness") for v in stack]),
                                "elastic_stiffness", "4/mmm")
    assert np.allclose(full.constants, tensym.check_tensors(stack, "elastic_stiffness", "4/mmm").constants)


def test_absolute_tolerance_and_alpha():
    c = _cubic()
    c[0, 3] = c[3, 0] = 0.4
    r = tensym.check_tensor(c, "elastic_stiffness", "m-3m", tol=0.5, tol_kind="absolute", units="GPa")
    assert r.passes and "largest deviation 0.4 GPa <= tol 0.5 GPa (absolute)" in r.reasons[0]
    assert not tensym.check_tensor(c, "elastic_stiffness", "m-3m", tol=0.3, tol_kind="absolute").passes
    r = tensym.check_tensor(c, "elastic_stiffness", "m-3m", sigma=np.full((6, 6), 0.05), tol=1.0)
    assert not r.passes and "alpha 0.05" in r.reasons[-1]   # chi2 = 64 with 18 dof
    assert tensym.check_tensor(c, "elastic_stiffness", "m-3m", sigma=np.full((6, 6), 0.05), tol=1.0,
                               alpha=1e-9).passes


def test_renderings():
    c = _cubic()
    c[0, 3] = c[3, 0] = 3.0
    r = tensym.check_tensor(c, "elastic_stiffness", "m-3m", sigma=np.full((6, 6), 0.5), units="GPa")
    text = r.text()
    assert "checked against m-3m: inconsistent" in text and "c14 = 3 +- 0.5 (6 sigma)" in text
    assert "units: GPa" in text and str(r) == text
    rec = json.loads(r.to_json())
    assert rec["kind"] == "tensor_check" and rec["units"] == "GPa" and rec["residual_norm"] == "full-tensor Frobenius"
    assert [k["name"] for k in rec["constants"]] == ["c11", "c12", "c44"]
    tex = r.latex()
    assert "c_{14} &= 3 \\pm 0.5" in tex and "\\begin{aligned}" in tex
    doc = r.latex(standalone=True)
    assert doc.startswith("\\documentclass") and doc.rstrip().endswith("\\end{document}")
    assert "| c44 |" in r.markdown()
    assert repr(r).startswith("<CheckReport elastic_stiffness vs m-3m: inconsistent")
    with pytest.raises(KeyError, match="not an independent constant here"):
        r.constant("c13")


def test_every_group_and_catalog_property_round_trips():
    # the symmetrized tensor of any data passes its own group exactly; the constants read it back
    rng = np.random.default_rng(2)
    for name in ("pyroelectric", "dielectric_permittivity", "piezoelectric_d", "elastic_compliance",
                 "electro_optic", "optical_activity", "photoelastic"):
        n = len(tensym.component_labels(name))
        d = tensym.tensor_data(rng.normal(size=n), name, layout="components")
        for g in ("1", "2/m", "mm2", "-42m", "3m", "-6m2", "432", "6/mmm", "Dinfh"):
            r = tensym.check_tensor(d, group=g)
            again = tensym.check_tensor(r.symmetrized, name, g)
            assert again.residual_fraction < 1e-12, (name, g)
            assert np.allclose([k.value for k in again.constants], [k.value for k in r.constants])


def test_refusals():
    c = _cubic()
    with pytest.raises(DataError, match="say which group"):
        tensym.check_tensor(c, "elastic_stiffness")
    with pytest.raises(UnknownGroupError, match="nearest valid symbols"):
        tensym.check_tensor(c, "elastic_stiffness", "m-3x")
    from tensym.errors import InvalidGroupError

    # a whole number is a space-group number (1..230, International Tables Vol. A)
    with pytest.raises(UnknownGroupError, match=r"outside 1\.\.230"):
        tensym.check_tensor(c, "elastic_stiffness", 432)
    with pytest.raises(UnknownGroupError, match=r"outside 1\.\.230"):
        tensym.orient(c, "elastic_stiffness", 432)
    with pytest.raises(InvalidGroupError, match="expected a point group or its symbol"):
        tensym.check_tensor(c, "elastic_stiffness", 4.32)
    with pytest.raises(InvalidOptionError, match="tol_kind='percent' is not one of relative, absolute"):
        tensym.check_tensor(c, "elastic_stiffness", "m-3m", tol_kind="percent")
    with pytest.raises(DataError, match="tol must be a finite number"):
        tensym.check_tensor(c, "elastic_stiffness", "m-3m", tol=-1)
    with pytest.raises(DataError, match="alpha must be a significance level"):
        tensym.check_tensor(c, "elastic_stiffness", "m-3m", alpha=1.5)
    with pytest.raises(DataError, match=r"must be a stack of shape \(N, 6, 6\) or \(N, 3, 3, 3, 3\)"):
        tensym.check_tensors(c, "elastic_stiffness", "m-3m")
    with pytest.raises(InvalidOptionError, match="layout='x' is not one of"):
        tensym.check_tensors(c[None], "elastic_stiffness", "m-3m", layout="x")
    stack = np.stack([c, c])
    bad = stack.copy()
    bad[1, 0, 1] = 7.0
    with pytest.raises(DataError, match=r"\(tensor 1 of the stack\)"):
        tensym.check_tensors(bad, "elastic_stiffness", "m-3m")
    bad = stack.copy()
    bad[1, 2, 2] = np.inf
    with pytest.raises(DataError, match="contains inf"):
        tensym.check_tensors(bad, "elastic_stiffness", "m-3m")
    bad[1, 2, 2] = np.nan  # NaN: c33 not given (issue 11); c11 still fixes the cubic constants
    assert tensym.check_tensors(bad, "elastic_stiffness", "m-3m").n_given.tolist() == [21, 20]
    with pytest.raises(DataError, match="sigma must have the shape"):
        tensym.check_tensors(stack, "elastic_stiffness", "m-3m", sigma=np.ones((2, 3, 6)))
    s = np.ones((2, 6, 6))
    s[1, 3, 3] = 0.0
    with pytest.raises(DataError, match="tensor 1 of the stack has 0"):
        tensym.check_tensors(stack, "elastic_stiffness", "m-3m", sigma=s)
    s[1, 3, 3] = np.inf
    with pytest.raises(DataError, match="sigma contains inf"):
        tensym.check_tensors(stack, "elastic_stiffness", "m-3m", sigma=s)
    with pytest.raises(DataError, match="unknown units"):
        tensym.check_tensors(stack, "elastic_stiffness", "m-3m", units="parsec")


def test_symbols_are_the_forms_symbols():
    r = tensym.check_tensor(_cubic(), "elastic_stiffness", "m-3m")
    assert tuple(k.symbol for k in r.constants) == tensym.tensor_form("elastic_stiffness", "m-3m").symbols
    assert all(isinstance(k.symbol, sp.Symbol) for k in r.constants)


def test_component_labels_follow_the_forms_naming_for_every_property():
    # the data layer labels components by the same rule as tensor_form (lowest Voigt label first)
    for name in tensym.property_names():
        labels = set(tensym.component_labels(name))
        for g in ("1", "6/mmm", "-43m"):
            f = tensym.tensor_form(name, g)
            assert {str(s) for s in f.symbols} <= labels, (name, g)
            # the form lists every distinct Voigt component (d31 beside d15 under Kleinman symmetry);
            # the data layer names each orbit once, by its lowest label
            listed = {str(s) for s in f.symbols} | {str(r.lhs) for r in f.relations}
            assert labels <= listed, (name, g)
            assert len(f.symbols) + len(f.relations) == len(listed), (name, g)
            assert len(labels) == len(f.spec.orbits.reps), (name, g)
