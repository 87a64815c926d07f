"""Time-odd and magnetic property tensors over the 122 magnetic point groups."""

import pytest
import sympy as sp

from tensym.groups.magnetic import magnetic_point_group, magnetic_point_groups
from tensym.tensors import get_property, property_names, tensor_form

GROUPS = {r.symbol: magnetic_point_group(r.symbol) for r in magnetic_point_groups()}


def allowing(name):
    return {s for s, g in GROUPS.items() if tensor_form(name, g).n_independent > 0}


def test_counts_of_groups_allowing_each_effect():
    # Birss, Symmetry and Magnetism (1964); International Tables Vol. D (2013) ch. 1.5; from memory:
    # 31 ferromagnetic groups, 31 pyroelectric, 58 linear magnetoelectric, 66 piezomagnetic
    assert len(allowing("magnetization")) == 31
    assert len(allowing("pyroelectric")) == 31
    assert len(allowing("magnetoelectric")) == 58
    assert len(allowing("piezomagnetic")) == 66


# the 31 groups that allow a spontaneous magnetization (Birss 1964, Table 4.4; from memory)
FERROMAGNETIC = {
    "1", "-1", "2", "2'", "m", "m'", "2/m", "2'/m'", "2'2'2", "m'm2'", "m'm'2", "m'm'm", "4", "-4", "4/m",
    "42'2'", "4m'm'", "-42'm'", "4/mm'm'", "3", "-3", "32'", "3m'", "-3m'", "6", "-6", "6/m", "62'2'",
    "6m'm'", "-6m'2'", "6/mm'm'",
}


def test_the_ferromagnetic_groups():
    assert allowing("magnetization") == FERROMAGNETIC


def test_grey_groups_forbid_every_time_odd_property():
    # time reversal 1' is an element: a time-odd tensor equals minus itself (Birss 1964, ch. 4)
    odd = [n for n in property_names() if get_property(n).spec.time_odd]
    assert {"magnetization", "toroidal_moment", "magnetoelectric", "piezomagnetic"} <= set(odd)
    for rec in magnetic_point_groups(kind="grey"):
        for name in odd:
            assert tensor_form(name, GROUPS[rec.symbol]).n_independent == 0, (rec.symbol, name)


def test_time_even_properties_depend_on_the_parent_only():
    # time-even tensors do not see the primes: the form is that of the parent class (Birss 1964)
    from tensym.groups.catalog import catalog_group, default_setting

    for rec in magnetic_point_groups():
        parent = catalog_group(default_setting(rec.parent))
        for name in ("magnetic_susceptibility", "magnetostriction", "pyroelectric", "faraday"):
            assert tensor_form(name, GROUPS[rec.symbol]).n_independent == tensor_form(name, parent).n_independent


def test_magnetoelectric_of_the_dzyaloshinskii_group():
    # -3'm' (Cr2O3): alpha diagonal with alpha11 = alpha22 and an independent alpha33 (Dzyaloshinskii 1959)
    f = tensor_form("magnetoelectric", "-3'm'")  # by symbol, through tensym.point_group
    a11, a33 = sp.symbols("alpha11 alpha33", real=True)
    assert f.n_independent == 2
    assert f.tensor.tolist() == [[a11, 0, 0], [0, a11, 0], [0, 0, a33]]


def test_piezomagnetic_form_of_the_rutile_antiferromagnets():
    # 4'/mmm' (CoF2, MnF2): Lambda14 = Lambda25 and Lambda36 (Dzyaloshinskii 1957; Borovik-Romanov 1960;
    # from memory)
    f = tensor_form("piezomagnetic", GROUPS["4'/mmm'"])
    l14, l36 = sp.symbols("Lambda14 Lambda36", real=True)
    expected = sp.Matrix([[0, 0, 0, l14, 0, 0], [0, 0, 0, 0, l14, 0], [0, 0, 0, 0, 0, l36]])
    assert f.voigt == expected


def test_magnetization_directions():
    # M along the axis the primes leave it (Birss 1964; from memory): m'm'm along z, 4/m along z,
    # 2'/m' perpendicular to the (unique y) axis
    m1, m2, m3 = sp.symbols("M1 M2 M3", real=True)
    assert list(tensor_form("magnetization", GROUPS["m'm'm"]).tensor) == [0, 0, m3]
    assert list(tensor_form("magnetization", GROUPS["4/m"]).tensor) == [0, 0, m3]
    assert list(tensor_form("magnetization", GROUPS["2'/m'"]).tensor) == [m1, 0, m3]


def test_faraday_tensor_is_allowed_in_isotropic_media():
    # linear Faraday effect in every medium: f_ijk = f e_ijk under O(3) (common practice)
    f = tensor_form("faraday", "O(3)")
    assert f.n_independent == 1
    s = f.symbols[0]
    assert f.tensor[0, 1, 2] == s and f.tensor[1, 0, 2] == -s and f.tensor[0, 0, 1] == 0


def test_catalog_entries():
    p = get_property("piezomagnetic")
    assert p.spec.axial and p.spec.time_odd and p.voigt_groups == ((0,), (1, 2)) and p.halved == (False, True)
    assert "Lambda_iJ / 2" in p.convention
    assert not get_property("magnetic_susceptibility").spec.time_odd
    a = get_property("magnetoelectric").spec
    assert (a.rank, a.symmetries, a.axial, a.time_odd) == (2, (), True, True)


@pytest.mark.parametrize("symbol", ["m'm'm", "4'/m", "-3'm'", "6'/m'm'm", "m'-3'm", "mmm1'"])
def test_forms_are_invariant_under_every_operation(symbol):
    # brute force: each operation (with its time-reversal sign) leaves the returned tensor unchanged
    import numpy as np

    from tensym.testing import full_matrix

    g = GROUPS[symbol]
    for name in ("magnetoelectric", "piezomagnetic", "magnetization", "toroidal_moment"):
        f = tensor_form(name, g)
        spec = f.property.spec
        basis = f.numeric_basis().reshape(f.n_independent, -1) if f.n_independent else np.zeros((0, 3 ** spec.rank))
        for op in g.operations:
            d = full_matrix(op.numeric, spec.rank) * spec.parity(op)
            assert np.allclose(basis @ d.T, basis, atol=1e-12), (symbol, name, op.symbol)
