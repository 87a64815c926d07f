"""The 122 magnetic point groups: enumeration, equivalence, symbols, recognition."""

import dataclasses
from collections import Counter

import numpy as np
import pytest
import sympy as sp

from tensym.groups.catalog import catalog_group, default_setting, point_groups
from tensym.groups.magnetic import (
    MAGNETIC_KINDS,
    _classes_of,
    _homomorphisms,
    magnetic_class,
    magnetic_group_from_generators,
    magnetic_names,
    magnetic_point_group,
    magnetic_point_groups,
    parent_group,
    unitary_subgroup,
)
from tensym.groups.operations import Operation
from tensym.groups.recognition import group_from_generators, rotation_about, rotation_from_axes

T = Operation.from_triplet


def test_count_is_122_with_32_32_58():
    # 32 ordinary, 32 grey, 58 black-and-white: 122 (Birss, Symmetry and Magnetism, 1964;
    # International Tables Vol. D, 2013, ch. 1.5; from memory)
    recs = magnetic_point_groups()
    assert len(recs) == 122
    assert Counter(r.kind for r in recs) == {"ordinary": 32, "grey": 32, "black-and-white": 58}
    assert [r.number for r in recs] == list(range(1, 123))
    assert len({r.symbol for r in recs}) == 122 and len({r.schoenflies for r in recs}) == 122
    for kind in MAGNETIC_KINDS:
        assert magnetic_point_groups(kind=kind) == tuple(r for r in recs if r.kind == kind)


# black-and-white groups per parent class (Birss 1964, table of the 122; from memory)
BW_PER_PARENT = {
    "1": 0, "-1": 1, "2": 1, "m": 1, "2/m": 3, "222": 1, "mm2": 2, "mmm": 3, "4": 1, "-4": 1, "4/m": 3,
    "422": 2, "4mm": 2, "-42m": 3, "4/mmm": 5, "3": 0, "-3": 1, "32": 1, "3m": 1, "-3m": 3, "6": 1, "-6": 1,
    "6/m": 3, "622": 2, "6mm": 2, "-6m2": 3, "6/mmm": 5, "23": 0, "m-3": 1, "432": 1, "-43m": 1, "m-3m": 3,
}


def test_black_and_white_classes_per_parent():
    # the equivalence classes (conjugacy under the normaliser of the parent) of index-2 subgroups
    for hm in point_groups():
        assert len(_classes_of(catalog_group(default_setting(hm)))) == BW_PER_PARENT[hm], hm
        assert sum(r.parent == hm and r.kind == "black-and-white" for r in magnetic_point_groups()) \
            == BW_PER_PARENT[hm]


def test_three_2m_subgroups_of_mmm_are_one_group():
    # mmm has 7 index-2 subgroups (it is Z2^3; common practice) falling into 3 classes: 222, mm2 x3, 2/m x3
    mmm = catalog_group("mmm")
    assert len(_homomorphisms(mmm)) == 8
    sizes = sorted(len(c) for c in _classes_of(mmm))
    assert sizes == [1, 3, 3]
    spellings = ("m'm'm", "m'mm'", "mm'm'")
    groups = [magnetic_point_group(s) for s in spellings]
    assert len({g.operation_keys() for g in groups}) == 3  # three distinct orientations...
    assert {g.symbol for g in groups} == {"m'm'm"}  # ...of one magnetic point group
    assert [g.setting_symbol for g in groups] == list(spellings)
    assert {unitary_subgroup(g).symbol for g in groups} == {"2/m"}


@pytest.mark.parametrize("rec", magnetic_point_groups(), ids=lambda r: r.symbol)
def test_every_group_is_a_consistent_magnetic_group(rec):
    g = magnetic_point_group(rec.symbol)
    assert g.symbol == rec.symbol and g.order == rec.order and magnetic_class(g) == rec
    ops = g.operations
    # closed (the Cayley table finds every product), and the flags multiply: g @ h is primed
    # when exactly one of g, h is (a homomorphism to Z2)
    table = g.multiplication_table
    flags = np.array([op.time_reversal for op in ops])
    assert (flags[table] == (flags[:, None] ^ flags[None, :])).all()
    theta = Operation(sp.ImmutableMatrix(sp.eye(3)), True)
    h = unitary_subgroup(g)
    p = parent_group(g)
    assert p.symbol == rec.parent and h.symbol == rec.unitary
    if rec.kind == "ordinary":
        assert not g.is_magnetic and h.order == p.order == g.order
    elif rec.kind == "grey":
        assert theta in g and g.order == 2 * p.order and h.order == p.order
    else:
        assert theta not in g and g.order == p.order == 2 * h.order
        primed = {op.key[:-1] for op in ops if op.time_reversal}
        unprimed = {op.key[:-1] for op in ops if not op.time_reversal}
        assert not primed & unprimed and len(primed) == h.order


@pytest.mark.parametrize("rec", magnetic_point_groups(kind="black-and-white"), ids=lambda r: r.symbol)
def test_symbols_spell_back(rec):
    g = magnetic_point_group(rec.symbol)
    # the setting spelling reads back to the same group, and the full symbol too
    assert magnetic_point_group(g.setting_symbol) is g
    assert magnetic_point_group(g.full_symbol).operation_keys() == g.operation_keys()
    assert magnetic_point_group(rec.schoenflies) is g


@pytest.mark.parametrize("symbol, schoenflies, unitary", [
    # H of each symbol, by the rule that primes mark G - H (ITA Vol. D ch. 1.5; from memory)
    ("m'm'm", "D2h(C2h)", "2/m"), ("4'/m", "C4h(C2h)", "2/m"), ("-3'm'", "D3d(D3)", "32"),
    ("6'mm'", "C6v(C3v)", "3m"), ("4/m'm'm'", "D4h(D4)", "422"), ("-4'2m'", "D2d(D2)", "222"),
    ("m'-3'm", "Oh(Td)", "-43m"), ("4'22'", "D4(D2)", "222"), ("-6'm2'", "D3h(C3v)", "3m"),
])
def test_trade_symbols(symbol, schoenflies, unitary):
    g = magnetic_point_group(symbol)
    assert (g.schoenflies, unitary_subgroup(g).symbol) == (schoenflies, unitary)


def test_other_orientations_and_spellings():
    assert magnetic_point_group("6'm'm").symbol == "6'mm'"
    assert magnetic_point_group("4'2'2").symbol == "4'22'"
    assert magnetic_point_group("-4'm2'").symbol == "-4'2'm"  # -4m2 setting: H = mm2 with mirrors x, y
    assert magnetic_point_group("31m'").setting_symbol == "31m'"
    assert magnetic_point_group("2'/m'").setting_symbol == "12'/m'1"
    assert magnetic_point_group("-4\u20322m\u2032") is magnetic_point_group("-4'2m'")
    assert magnetic_point_group("4/m' 2/m' 2/m'") is magnetic_point_group("4/m'm'm'")
    assert magnetic_point_group("m m m 1'") is magnetic_point_group("mmm1'")
    assert magnetic_point_group("D2h1'") is magnetic_point_group("mmm1'")
    assert magnetic_point_group("1'") is magnetic_point_group("11'")
    assert magnetic_point_group("mmm") is catalog_group("mmm")


def test_grey_groups():
    for rec in magnetic_point_groups(kind="grey"):
        g = magnetic_point_group(rec.symbol)
        assert g.symbol == rec.parent + "1'" and g.schoenflies.endswith("1'")
        assert sum(op.time_reversal for op in g.operations) == g.order // 2


def test_records_are_frozen():
    rec = magnetic_point_groups()[26]
    with pytest.raises(dataclasses.FrozenInstanceError):
        rec.symbol = "x"
    assert isinstance(magnetic_point_groups(), tuple)
    assert rec.type_number == 3 and magnetic_point_groups()[1].type_number == 2


# --- groups from generators ------------------------------------------------------------
def test_generators_with_marks():
    g = magnetic_group_from_generators([T("-y,x,z,-1"), T("-x,-y,-z")])
    assert (g.symbol, g.setting_symbol, g.order) == ("4'/m", "4'/m", 8)
    g = magnetic_group_from_generators([T("-x,-y,z"), Operation.from_triplet("-x,y,-z", time_reversal=True),
                                        T("-x,-y,-z")])
    assert (g.symbol, g.setting_symbol) == ("m'm'm", "m'm'm")
    g = magnetic_group_from_generators([T("-y,x-y,z", basis="hexagonal"), T("-x+y,y,z,-1", basis="hexagonal")])
    assert g.symbol == "3m'"


def test_generators_with_time_reversal_make_a_grey_group():
    g = magnetic_group_from_generators([T("-y,x,z"), T("x,-y,-z"), T("x,y,z,-1")])
    assert (g.symbol, g.order) == ("4221'", 16)


def test_reoriented_groups_are_recognised():
    q = rotation_from_axes(new_x=[1, -1, 0], new_z=[1, 1, 1])
    g = magnetic_point_group("-3'm'")
    turned = g.conjugated(q)
    n = magnetic_names(turned)
    assert n.hm == "-3'm'" and n.setting_symbol == "-3'm'1"
    assert n.rotation is not None and sp.simplify(sp.Matrix(n.rotation) - q) == sp.zeros(3, 3)
    assert magnetic_class(turned).symbol == "-3'm'"
    # a 45-degree turn of m'm'm about z is still m'm'm
    t2 = magnetic_point_group("m'm'm").conjugated(rotation_about([0, 0, 1], sp.pi / 4))
    assert magnetic_class(t2).symbol == "m'm'm"


def test_ordinary_groups_have_ordinary_class():
    assert magnetic_class("6/mmm").kind == "ordinary"
    assert magnetic_class(group_from_generators(["-y,x,z"])).symbol == "4"


def test_is_polar_counts_spatial_parts():
    # common practice: time reversal does not act on the polarization, so a magnetic group is
    # polar exactly when its spatial parts leave a direction fixed (-1' is not, m' is).
    import tensym

    for sym in ["-1'", "m'", "4/m'", "m'm'2", "6'mm'"]:
        g = tensym.point_group(sym)
        assert g.is_polar == (tensym.tensor_form("pyroelectric", g).n_independent > 0)
