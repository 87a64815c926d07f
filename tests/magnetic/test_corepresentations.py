"""Wigner types of corepresentations (Dimmock test) and decompositions over magnetic groups."""

import pytest

from tensym.groups.magnetic import magnetic_point_group, magnetic_point_groups, parent_group, unitary_subgroup
from tensym.reps.magnetic import corepresentations, magnetic_decompose
from tensym.reps.table import finite_table
from tensym.tensors import tensor_form


@pytest.mark.parametrize("rec", magnetic_point_groups(kind="grey"), ids=lambda r: r.symbol)
def test_grey_groups_follow_the_frobenius_schur_indicator(rec):
    # with A = H 1' the Dimmock sum is the Frobenius-Schur sum: real irreps of type a, complex pairs of
    # type c (Bradley & Cracknell 1972, ch. 7; from memory). Point-group irreps are never pseudo-real.
    g = magnetic_point_group(rec.symbol)
    table = finite_table(unitary_subgroup(g))
    for c in corepresentations(g):
        irr = table.irrep(c.label)
        assert c.wigner_type == ("a" if irr.is_real else "c"), c
        assert c.partner == (c.label if irr.is_real else irr.conjugate)


def test_type_b_in_4prime():
    # 4' = 2 + (4+, 4-)1': a^2 = 2z for both primed elements, chi_B(2z) = -1, so S(B) = -2 = -|H|
    # (Dimmock & Wheeler 1962 test, worked by hand)
    cs = {c.label: c for c in corepresentations("4'")}
    assert (cs["A"].wigner_type, cs["A"].dimmock_sum) == ("a", 2)
    assert (cs["B"].wigner_type, cs["B"].dimmock_sum, cs["B"].corep_dim) == ("b", -2, 2)


def test_type_c_pair_swapped_by_the_primed_fourfold():
    # 4'22': H = 222; the primed 4-fold exchanges x and y, so B2 and B3 pair up (type c, worked by hand)
    cs = {c.label: c for c in corepresentations("4'22'")}
    assert cs["B2"].wigner_type == cs["B3"].wigner_type == "c"
    assert (cs["B2"].partner, cs["B3"].partner) == ("B3", "B2")
    assert cs["A"].wigner_type == cs["B1"].wigner_type == "a"


@pytest.mark.parametrize("rec", magnetic_point_groups(kind="black-and-white"), ids=lambda r: r.symbol)
def test_dimmock_sums_and_partners(rec):
    g = magnetic_point_group(rec.symbol)
    h_order = g.order // 2
    cs = corepresentations(g)
    by = {c.label: c for c in cs}
    for c in cs:
        assert c.dimmock_sum in (h_order, -h_order, 0)
        assert by[c.partner].partner == c.label  # the partner map is an involution
        assert (c.partner == c.label) == (c.wigner_type != "c")


PROPS = ("magnetization", "magnetoelectric", "piezomagnetic", "toroidal_moment")


@pytest.mark.parametrize("rec", [r for r in magnetic_point_groups() if r.kind != "ordinary"],
                         ids=lambda r: r.symbol)
def test_linear_trivial_multiplicity_is_the_number_of_constants(rec):
    # two independent routes: characters of the linear action vs the exact solver
    g = magnetic_point_group(rec.symbol)
    trivial_h = finite_table(unitary_subgroup(g)).real_irreps[0].label
    trivial_g = finite_table(parent_group(g)).real_irreps[0].label
    for name in PROPS:
        d = magnetic_decompose(name, g)
        n = tensor_form(name, g).n_independent
        trivial = trivial_g + ("+" if rec.kind == "grey" else "")  # grey: the time-even part
        assert d.linear[trivial] == n, name
        assert d.dim == d.linear.dim
        assert d[trivial_h] >= n  # the H-invariants include the time-odd ones that the primes forbid


def test_decomposition_record():
    d = magnetic_decompose("magnetization", "4'")
    assert (str(d), d.unitary, d.wigner_types, d.corep_multiplicities) == ("A + 2B", "2", ("a", "b"), (1, 1))
    assert str(d.linear) == "B + E"
    d = magnetic_decompose("magnetization", "mmm1'")
    assert str(d.linear) == "B1g- + B2g- + B3g-"
