"""Tensor data input: layouts, Voigt factors, uncertainties, units, and every refusal."""

import numpy as np
import pytest

import tensym
from tensym.data.dataset import tensor_data
from tensym.data.units import accepted_units, check_units, inverse_units
from tensym.errors import DataError, InvalidOptionError, UnknownPropertyError


def _cubic(c11=160.0, c12=50.0, c44=80.0):
    c = np.zeros((6, 6))
    c[:3, :3] = c12
    c[[0, 1, 2], [0, 1, 2]] = c11
    c[[3, 4, 5], [3, 4, 5]] = c44
    return c


def test_voigt_and_full_layouts_agree_with_factor_conventions():
    # Nye 1985 ch. VIII (from memory): s_2323 = s44 / 4, s_1123 = s14 / 2; c_2323 = c44 (no factor).
    s = np.zeros((6, 6))
    s[3, 3], s[0, 3], s[3, 0] = 8.0, 2.0, 2.0
    d = tensor_data(s, "elastic_compliance")
    assert d["s44"] == 8.0 and d["s14"] == 2.0
    t = d.tensor
    assert t[1, 2, 1, 2] == 2.0 and t[0, 0, 1, 2] == 1.0
    again = tensor_data(t, "elastic_compliance")
    assert np.array_equal(again.components, d.components)
    # piezoelectric d: d_123 = d14 / 2 (IEEE Std 176-1987, from memory)
    dv = np.zeros((3, 6))
    dv[0, 3] = 4.0
    assert tensor_data(dv, "piezoelectric_d").tensor[0, 1, 2] == 2.0


def test_components_layout_follows_labels():
    labels = tensym.component_labels("elastic_stiffness")
    x = np.arange(1.0, 22.0)
    d = tensor_data(x, "elastic_stiffness", layout="components")
    assert d[labels[5]] == 6.0 and d["66"] == 21.0
    assert d.voigt[5, 0] == d.voigt[0, 5] == 6.0


def test_entries_within_symmetry_tol_are_averaged_not_preferred():
    c = _cubic()
    c[0, 1] = 50.0 + 1e-9
    d = tensor_data(c, "elastic_stiffness")
    assert d["c12"] == pytest.approx(50.0 + 5e-10, abs=1e-12)


def test_uncertainties_and_covariance():
    c = _cubic()
    sig = np.full((6, 6), 0.5)
    d = tensor_data(c, "elastic_stiffness", sigma=sig, units="GPa")
    assert d.has_uncertainties and np.allclose(d.sigma, 0.5) and np.allclose(d.sigma_voigt, 0.5)
    cov = np.eye(21) * 0.04
    cov[0, 1] = cov[1, 0] = 0.01
    d2 = tensor_data(c, "elastic_stiffness", covariance=cov)
    assert d2.covariance[0, 1] == 0.01 and d2.sigma[0] == pytest.approx(0.2)


def test_results_are_immutable():
    d = tensor_data(_cubic(), "elastic_stiffness")
    with pytest.raises(ValueError):
        d.components[0] = 1.0
    v = d.voigt
    v[0, 0] = -1.0  # a new array each time
    assert d.voigt[0, 0] == 160.0


def test_rotated_data_propagate_covariance():
    c = _cubic()
    d = tensor_data(c, "elastic_stiffness", sigma=np.full((6, 6), 0.1))
    r = tensym.rotation_from_axis_angle([0, 0, 1], 90.0)
    rd = d.rotated(r)
    # a quarter turn about z maps the cubic tensor to itself (common practice)
    assert np.allclose(rd.components, d.components)
    back = rd.rotated(r.T)
    assert np.allclose(back.covariance, d.covariance)


@pytest.mark.parametrize("values, match", [
    ("abc", "must be numbers"),
    ([[1, 2], [3]], "rectangular array"),
    (np.zeros((5, 5)), r"must have shape Voigt \(6, 6\) or full \(3, 3, 3, 3\), got \(5, 5\)"),
])
def test_bad_values(values, match):
    with pytest.raises(DataError, match=match):
        tensor_data(values, "elastic_stiffness")


def test_nan_marks_an_unknown_component_and_inf_is_refused_with_position():
    # issue 11: a component that is not given is NaN (unknown), never zero
    c = _cubic()
    c[2, 3] = np.nan             # c34 still given by its twin c43
    d = tensor_data(c, "elastic_stiffness")
    assert d.is_complete and d["c34"] == 0.0
    c[3, 2] = np.nan             # now neither entry gives it
    d = tensor_data(c, "elastic_stiffness")
    assert not d.is_complete and d.n_given == 20 and np.isnan(d["c34"])
    assert np.isnan(d.voigt[2, 3]) and np.isnan(d.voigt[3, 2])
    c[2, 3] = np.inf
    with pytest.raises(DataError, match=r"contains inf .* at entry \(3, 4\)"):
        tensor_data(c, "elastic_stiffness")


def test_non_symmetric_stiffness_is_reported_not_averaged():
    c = _cubic()
    c[1, 0] = 51.0
    with pytest.raises(DataError, match=r"c12 = 50 at Voigt entry \(1, 2\) but 51 at \(2, 1\); the entries are not"):
        tensor_data(c, "elastic_stiffness")
    t = tensor_data(_cubic(), "elastic_stiffness").tensor
    t[1, 0, 0, 0] += 1.0
    with pytest.raises(DataError, match="tensor index"):
        tensor_data(t, "elastic_stiffness")


def test_antisymmetric_spec_needs_vanishing_diagonal():
    spec = tensym.TensorSpec(2, ["-ji"])
    a = np.array([[0.0, 1.0, 0.0], [-1.0, 0.0, 0.0], [0.0, 0.0, 0.0]])
    assert tensor_data(a, spec).components.tolist() == [1.0, 0.0, 0.0]
    a[2, 2] = 3.0
    with pytest.raises(DataError, match="makes it vanish"):
        tensor_data(a, spec)


def test_bad_sigma_and_covariance():
    c = _cubic()
    with pytest.raises(DataError, match="sigma must have the shape of values"):
        tensor_data(c, "elastic_stiffness", sigma=np.ones((3, 6)))
    s = np.ones((6, 6))
    s[4, 4] = 0.0
    with pytest.raises(DataError, match=r"strictly positive .* entry \(5, 5\) is 0"):
        tensor_data(c, "elastic_stiffness", sigma=s)
    s[4, 4] = -1.0
    with pytest.raises(DataError, match="strictly positive"):
        tensor_data(c, "elastic_stiffness", sigma=s)
    s[4, 4] = np.nan
    with pytest.raises(DataError, match=r"sigma is NaN \(unknown\) for c55, whose value is given"):
        tensor_data(c, "elastic_stiffness", sigma=s)
    with pytest.raises(DataError, match="either sigma .* or covariance"):
        tensor_data(c, "elastic_stiffness", sigma=np.ones((6, 6)), covariance=np.eye(21))
    with pytest.raises(DataError, match=r"covariance must be \(21, 21\)"):
        tensor_data(c, "elastic_stiffness", covariance=np.eye(6))
    cov = np.eye(21)
    cov[0, 1] = 0.5
    with pytest.raises(DataError, match="covariance must be symmetric"):
        tensor_data(c, "elastic_stiffness", covariance=cov)
    cov[1, 0] = 0.5
    cov[0, 0] = -1.0
    with pytest.raises(DataError, match="positive definite"):
        tensor_data(c, "elastic_stiffness", covariance=cov)


def test_units():
    assert tensor_data(_cubic(), "elastic_stiffness", units="GPa").units == "GPa"
    assert check_units("uC/(m^2 K)", "pyroelectric") == "uC/(m^2 K)"
    assert check_units("\u00b5C/(m^2 K)", "pyroelectric") == "\u00b5C/(m^2 K)"  # micro sign accepted
    assert "1/GPa" in accepted_units("elastic_compliance")
    assert inverse_units("GPa") == "1/GPa" and inverse_units("furlong") is None
    with pytest.raises(DataError, match="unknown units 'pC/N' for elastic_stiffness; nearest"):
        tensor_data(_cubic(), "elastic_stiffness", units="pC/N")
    with pytest.raises(DataError, match="units must be a label"):
        tensor_data(_cubic(), "elastic_stiffness", units=3)


def test_other_refusals():
    c = _cubic()
    with pytest.raises(DataError, match="say which property"):
        tensor_data(c)
    with pytest.raises(UnknownPropertyError, match="nearest: elastic_stiffness"):
        tensor_data(c, "elastic_stifness")
    with pytest.raises(InvalidOptionError, match="layout='rows' is not one of auto, voigt, full, components"):
        tensor_data(c, "elastic_stiffness", layout="rows")
    with pytest.raises(DataError, match=r"must have shape full \(3, 3, 3, 3\)"):
        tensor_data(c, "elastic_stiffness", layout="full")
    with pytest.raises(DataError, match="symmetry_tol must be a number"):
        tensor_data(c, "elastic_stiffness", symmetry_tol=2.0)
    with pytest.raises(DataError, match="source must be a string"):
        tensor_data(c, "elastic_stiffness", source=5)
    d = tensor_data(c, "elastic_stiffness")
    assert tensor_data(d) is d
    with pytest.raises(DataError, match="the data are elastic_stiffness, not elastic_compliance"):
        tensor_data(d, "elastic_compliance")
    with pytest.raises(DataError, match="come with the TensorData"):
        tensor_data(d, sigma=np.ones((6, 6)))
    with pytest.raises(KeyError, match="is not a component of elastic_stiffness"):
        d["c77"]


def test_every_catalog_property_has_its_own_unit_labels():
    from tensym.data.units import UNITS

    assert set(tensym.property_names()) <= set(UNITS)
    with pytest.raises(DataError, match="unknown units 'GPa' for magnetization"):
        check_units("GPa", "magnetization")
    # a bare TensorSpec accepts any label tensym knows
    assert check_units("GPa", tensym.TensorSpec(2)) == "GPa"
