"""Closure of generators: group axioms (hypothesis), composition order, errors."""

import numpy as np
import pytest
import sympy as sp
from hypothesis import given, settings, strategies as st

from tensym.errors import GroupClosureError, InvalidOperationError, InvalidOptionError
from tensym.groups import MAX_GROUP_ORDER, Operation, group_from_generators, point_groups, rotation_about
from tensym.groups.catalog import catalog_group

SETTINGS = point_groups(which="all")


@st.composite
def group_and_elements(draw, k=3):
    g = catalog_group(draw(st.sampled_from(SETTINGS)))
    ops = g.operations
    idx = [draw(st.integers(0, len(ops) - 1)) for _ in range(k)]
    return g, [ops[i] for i in idx]


def _exact_equal(a, b):
    return all(sp.expand(sp.radsimp(x - y)) == 0 for x, y in zip(a.matrix, b.matrix))


@settings(max_examples=60, deadline=None)
@given(group_and_elements())
def test_group_axioms(data):
    # common practice: closure, associativity, identity and inverses
    g, (a, b, c) = data
    assert a @ b in g
    assert _exact_equal((a @ b) @ c, a @ (b @ c))
    assert (a @ a.inverse()).is_identity and a.inverse() in g
    assert _exact_equal(Operation.identity() @ a, a)


@settings(max_examples=40, deadline=None)
@given(group_and_elements(k=2), st.lists(st.integers(-3, 3), min_size=3, max_size=3))
def test_composition_order(data, v):
    # g @ h means: first h, then g
    g, (a, b) = data
    x = sp.Matrix(v)
    assert sp.simplify((a @ b).matrix * x - a.matrix * (b.matrix * x)) == sp.zeros(3, 1)
    assert np.allclose((a @ b).numeric, a.numeric @ b.numeric, atol=1e-12)


@settings(max_examples=30, deadline=None)
@given(group_and_elements(k=1))
def test_classes_partition_and_are_closed_under_conjugation(data):
    g, (a,) = data
    classes = g.classes
    assert sorted(i for c in classes for i in c) == list(range(g.order))
    i = g.index(a)
    cls = next(c for c in classes if i in c)
    for h in g.operations:
        assert g.index(h @ a @ h.inverse()) in cls


def test_multiplication_table_is_a_latin_square():
    g = catalog_group("m-3m")
    t = g.multiplication_table
    for row in t:
        assert sorted(row) == list(range(g.order))
    for col in t.T:
        assert sorted(col) == list(range(g.order))


def test_generators_from_matrices_and_triplets_agree():
    a = group_from_generators([[[0, -1, 0], [1, 0, 0], [0, 0, 1]], "x,-y,-z"])
    b = group_from_generators(["-y,x,z", Operation.from_triplet("x,-y,-z")])
    assert a.operation_keys() == b.operation_keys() and a.symbol == "422"
    h = group_from_generators([np.array([[0, -1, 0], [1, -1, 0], [0, 0, 1]])], basis="hexagonal")
    assert h.symbol == "3" and h.setting_symbol == "3"
    assert group_from_generators([]).symbol == "1"
    assert group_from_generators("-x,-y,-z").symbol == "-1"


def test_non_orthogonal_generator():
    with pytest.raises(InvalidOperationError, match="not orthogonal"):
        group_from_generators([[[1, 1, 0], [0, 1, 0], [0, 0, 1]]])


def test_float_generator():
    # floats are snapped (issue 9); cos t = 0.6 is no rotation of finite order, so no group is near
    with pytest.raises(GroupClosureError, match="not within tol=0.0001 .* of a finite point group"):
        group_from_generators([[[0.6, -0.8, 0], [0.8, 0.6, 0], [0, 0, 1]]])
    # an exact Operation still refuses floats
    with pytest.raises(InvalidOperationError, match="float"):
        Operation.from_matrix([[0.6, -0.8, 0], [0.8, 0.6, 0], [0, 0, 1]])


def test_rotation_of_irrational_angle():
    # cos t = 3/5: an exact rotation whose angle is not 360/n degrees (common practice)
    with pytest.raises(GroupClosureError, match="infinite order"):
        group_from_generators([[["3/5", "-4/5", 0], ["4/5", "3/5", 0], [0, 0, 1]]])


def test_incompatible_axes_generate_an_infinite_group():
    # a 6-fold along z and a 4-fold along x generate no finite group (the finite
    # rotation groups are C_n, D_n, T, O, I only; common practice)
    six = rotation_about([0, 0, 1], sp.pi / 3)
    with pytest.raises(GroupClosureError, match=f"order <= {MAX_GROUP_ORDER}"):
        group_from_generators([six, "x,-z,y"])


def test_bad_arguments():
    with pytest.raises(InvalidOptionError, match="basis"):
        group_from_generators(["x,y,z"], basis="polar")
    with pytest.raises(InvalidOperationError, match="sequence"):
        group_from_generators(5)
    with pytest.raises(InvalidOperationError):
        group_from_generators(["x,y"])


def test_large_cyclic_group_within_limit():
    g = group_from_generators([rotation_about([0, 0, 1], 2 * sp.pi / 24)])
    assert g.order == 24 and g.symbol == "24" and g.schoenflies == "C24"
