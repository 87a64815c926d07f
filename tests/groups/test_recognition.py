"""Recognition of user groups, re-orientation and exact rotations."""

import numpy as np
import pytest
import sympy as sp
from hypothesis import assume, given, settings, strategies as st

from tensym.errors import InvalidOperationError
from tensym.exact import is_orthogonal
from tensym.groups import (
    group_from_generators,
    point_group,
    point_groups,
    recognise,
    reorient,
    rotation_about,
    rotation_from_axes,
)
from tensym.groups.catalog import catalog_group

SETTINGS = point_groups(which="all")
vectors = st.lists(st.integers(-3, 3), min_size=3, max_size=3)


def _check_rotation(names, user):
    """{user ops} = {Q g Q^T : g in the named catalog setting}, Q exact proper orthogonal."""
    std = catalog_group(names.setting_symbol)
    q = names.rotation
    if q is None:
        assert std.operation_keys() == user.operation_keys()
        return
    assert is_orthogonal(q) and sp.simplify(q.det()) == 1
    qf = np.array(q.evalf(20).tolist(), dtype=float)
    mapped = {tuple(np.rint((qf @ op.numeric @ qf.T).ravel() * 1e8).astype(int)) for op in std.operations}
    ours = {tuple(np.rint(op.numeric.ravel() * 1e8).astype(int)) for op in user.operations}
    assert mapped == ours


@settings(max_examples=40, deadline=None)
@given(st.sampled_from(SETTINGS), vectors, vectors)
def test_recognises_randomly_reoriented_groups(setting, a, b):
    a, b = sp.Matrix(a), sp.Matrix(b)
    c = a.cross(b)
    assume(a.norm() != 0 and c.norm() != 0)
    q = rotation_from_axes(new_z=a, new_x=c)
    base = catalog_group(setting)
    turned = reorient(base, q)
    user = group_from_generators(turned.generators)  # names found afresh
    assert user.symbol == base.symbol and user.schoenflies == base.schoenflies
    assert user.crystal_system == base.crystal_system and user.laue_class == base.laue_class
    _check_rotation(user.names, user)
    # the re-oriented group records the rotation it was given
    _check_rotation(turned.names, turned)


@pytest.mark.parametrize("setting", SETTINGS)
def test_identical_operation_set_is_named_without_rotation(setting):
    g = catalog_group(setting)
    user = group_from_generators([op.triplet() for op in g.operations[1:]])
    assert user.setting_symbol == setting and user.rotation is None


def test_other_settings_are_matched_exactly():
    # -4m2 vs -42m, 312 vs 321, 31m vs 3m1, -62m vs -6m2: same class, own rows
    assert group_from_generators(["y,-x,-z", "-x,y,z"]).setting_symbol == "-4m2"
    assert group_from_generators(["-y,x-y,z", "-x+y,y,-z"], basis="hexagonal").setting_symbol == "312"
    assert group_from_generators(["-y,x-y,z", "x-y,-y,z"], basis="hexagonal").setting_symbol == "31m"
    assert group_from_generators(["-y,x-y,-z", "x-y,-y,-z"], basis="hexagonal").setting_symbol == "-62m"
    assert group_from_generators(["-x,-y,z"]).setting_symbol == "112"
    assert group_from_generators(["x,-y,-z", "x,y,-z"]).setting_symbol == "2mm"


def test_reorient_turns_321_into_312():
    g = reorient("321", rotation_about([0, 0, 1], sp.pi / 2))
    assert g.setting_symbol == "312" and g.rotation is None


def test_3m_along_body_diagonal_is_a_subgroup_of_m3m():
    q = rotation_from_axes(new_x=[1, -1, 0], new_z=[1, 1, 1])
    g = reorient("3m", q)
    cube = point_group("m-3m")
    assert g.operation_keys() < cube.operation_keys()
    assert g.symbol == "3m" and g.setting_symbol == "3m1" and g.rotation == q
    # the 3-fold now lies along [111] and a mirror normal along [1,-1,0]
    axes = {(op.kind, op.axis) for op in g.operations}
    assert ("rotation", (1, 1, 1)) in axes and ("mirror", (1, -1, 0)) in axes
    # entries are exact integers after the turn
    assert all(e.is_Integer for op in g.operations for e in op.matrix)


def test_reorient_composes_rotations():
    q1 = rotation_about([1, 0, 0], sp.pi / 3)
    q2 = rotation_about([0, 1, 1], sp.pi / 2)
    g = reorient(reorient("4mm", q1), q2)
    assert sp.simplify(g.rotation - q2 * q1) == sp.zeros(3, 3)
    _check_rotation(g.names, g)


def test_reorient_continuous_group():
    q = rotation_from_axes(new_x=[0, 1, 0], new_z=[1, 0, 0])
    g = reorient("Dinfh", q)
    assert g.is_continuous and g.rotation == q
    assert g.lie_generators[0] == sp.ImmutableMatrix([[0, 0, 0], [0, 0, -1], [0, 1, 0]])


def test_reorient_rejects_bad_rotations():
    with pytest.raises(InvalidOperationError, match="improper"):
        reorient("mm2", sp.diag(1, 1, -1))
    with pytest.raises(InvalidOperationError, match="not orthogonal"):
        reorient("mm2", [[1, 1, 0], [0, 1, 0], [0, 0, 1]])
    with pytest.raises(InvalidOperationError, match="not orthogonal within tol=0.0001"):
        reorient("mm2", np.eye(3) * 0.5)  # a float rotation is snapped (issue 9), but this one is no rotation


def test_rotation_from_axes():
    q = rotation_from_axes(new_y=[0, 0, 1], new_z=[1, 0, 0])
    assert q == sp.ImmutableMatrix([[0, 0, 1], [1, 0, 0], [0, 1, 0]])
    q = rotation_from_axes(new_x=[1, 1, 0], new_y=[-1, 1, 0], new_z=[0, 0, 5])
    assert q[0, 0] == sp.sqrt(2) / 2
    with pytest.raises(InvalidOperationError, match="at least two"):
        rotation_from_axes(new_z=[0, 0, 1])
    with pytest.raises(InvalidOperationError, match="not perpendicular"):
        rotation_from_axes(new_x=[1, 1, 0], new_z=[0, 1, 1])
    with pytest.raises(InvalidOperationError, match="left-handed"):
        rotation_from_axes(new_x=[1, 0, 0], new_y=[0, 1, 0], new_z=[0, 0, -1])
    with pytest.raises(InvalidOperationError, match="float"):
        rotation_from_axes(new_x=[0.5, 0, 0], new_z=[0, 0, 1])
    with pytest.raises(InvalidOperationError, match="zero vector"):
        rotation_from_axes(new_x=[0, 0, 0], new_z=[0, 0, 1])


def test_rotation_about():
    # cos 72 deg = (sqrt(5) - 1)/4 (common practice)
    r = rotation_about([0, 0, 1], 2 * sp.pi / 5)
    assert sp.simplify(r[0, 0] - (sp.sqrt(5) - 1) / 4) == 0
    with pytest.raises(InvalidOperationError, match="float"):
        rotation_about([0, 0, 1], 1.2)


# Names of non-crystallographic groups from the family and n: ITA Vol. A,
# section 10.1.4 (symbols -5, -10, 5m, -10m2 ...), from memory.
@pytest.mark.parametrize("gens,hm,sch,laue,order", [
    (["C5"], "5", "C5", "-5", 5),
    (["C5", "-x,-y,-z"], "-5", "S10", "-5", 10),
    (["C5", "x,y,-z"], "-10", "C5h", "10/m", 10),
    (["C5", "-x,y,z"], "5m", "C5v", "-5m", 10),
    (["C7", "x,-y,-z"], "72", "D7", "-7m", 14),
    (["C7", "x,-y,-z", "x,y,-z"], "-14m2", "D7h", "14/mmm", 28),
    (["C8", "x,-y,-z"], "822", "D8", "8/mmm", 16),
    (["S8"], "-8", "S8", "8/m", 8),
])
def test_non_crystallographic_names(gens, hm, sch, laue, order):
    def make(t):
        if t.startswith("C"):
            return rotation_about([0, 0, 1], 2 * sp.pi / int(t[1:]))
        if t.startswith("S"):
            return -rotation_about([0, 0, 1], 2 * sp.pi / int(t[1:]) + sp.pi)
        return t
    g = group_from_generators([make(t) for t in gens])
    assert (g.symbol, g.schoenflies, g.laue_class, g.order) == (hm, sch, laue, order)
    assert g.crystal_system == "" and g.setting_symbol == "" and not g.is_crystallographic


def test_recognise_accepts_symbols_and_continuous_groups():
    assert recognise("D4h").setting_symbol == "4/mmm"
    assert recognise("SO(3)").hm == "SO(3)"


def test_magnetic_groups_are_named_by_the_magnetic_module():
    # issue 5: group_from_generators and recognise hand primed groups to tensym.groups.magnetic
    g = group_from_generators(["-x,-y,z,-1"])
    assert g.symbol == "2'" and g.order == 2 and g.is_magnetic
    assert recognise(g).schoenflies == "C2(C1)"


def test_reorient_keeps_names_outside_the_catalog():
    from tensym.groups import GroupNames, PointGroup

    base = point_group("mm2")
    g = PointGroup(None, base.generators, GroupNames(hm="x", setting_symbol="own", setting="own words"))
    q = rotation_about([0, 0, 1], sp.pi / 2)
    r = reorient(g, q)
    assert r.setting_symbol == "own" and r.rotation == q and r.setting.startswith("own words")
    assert r.operation_keys() == base.operation_keys()  # a quarter turn maps mm2 onto itself


# --- issue 11: symbolic and boolean entries give one-line tensym errors ----------------------
_T = sp.Symbol("t")
_RT = [[sp.cos(_T), -sp.sin(_T), 0], [sp.sin(_T), sp.cos(_T), 0], [0, 0, 1]]


def test_issue_11_symbolic_generator():
    with pytest.raises(InvalidOperationError, match=r"matrix entry cos\(t\) is symbolic \(free symbol t\)"):
        group_from_generators([_RT])


def test_issue_11_numpy_bool_generator():
    with pytest.raises(InvalidOperationError, match=r"matrix entry True is a boolean.*astype\(int\)"):
        group_from_generators([np.eye(3, dtype=bool)])


@pytest.mark.parametrize("rotation", [_RT, sp.Matrix(_RT), sp.ImmutableMatrix(_RT)])
def test_issue_11_reorient_by_a_symbolic_rotation_points_to_rotated_forms(rotation):
    with pytest.raises(InvalidOperationError, match=r"rotation: .*symbolic.*TensorForm\.rotated\(R\)"):
        reorient("6mm", rotation)


@pytest.mark.parametrize("entry,match", [(sp.I, "is not real"), (sp.oo, "is not finite"), (sp.nan, "not finite"),
                                         ("[1]", "cannot read matrix entry")])
def test_non_numbers_as_entries(entry, match):
    with pytest.raises(InvalidOperationError, match=match):
        group_from_generators([[[entry, 0, 0], [0, 1, 0], [0, 0, 1]]])
