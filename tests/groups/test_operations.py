"""Symmetry operations: ITA geometric symbols, triplet round trips, bad input."""

import numpy as np
import pytest
import sympy as sp

from tensym.errors import InvalidOperationError
from tensym.groups import HEXAGONAL_BASIS, Operation, point_groups
from tensym.groups.catalog import catalog_group

# (triplet, ITA symbol, direction of the axis or mirror normal): the symmetry
# operation tables of the general positions in ITA Vol. A (P m -3 m, P 4/m m m,
# P 6/m m m and their subgroups), from memory.  ITA writes a mirror by its plane;
# the normal is given here (plane x,x,z has normal [1,-1,0]).
CARTESIAN = [
    ("x,y,z", "1", None), ("-x,-y,-z", "-1", None),
    ("-x,-y,z", "2", (0, 0, 1)), ("-x,y,-z", "2", (0, 1, 0)), ("x,-y,-z", "2", (1, 0, 0)),
    ("y,x,-z", "2", (1, 1, 0)), ("-y,-x,-z", "2", (1, -1, 0)), ("-x,z,y", "2", (0, 1, 1)),
    ("-y,x,z", "4+", (0, 0, 1)), ("y,-x,z", "4-", (0, 0, 1)), ("x,-z,y", "4+", (1, 0, 0)),
    ("z,y,-x", "4+", (0, 1, 0)),
    ("z,x,y", "3+", (1, 1, 1)), ("y,z,x", "3-", (1, 1, 1)), ("z,-x,-y", "3+", (-1, 1, -1)),
    ("-z,-x,y", "3+", (1, -1, -1)), ("-z,x,-y", "3+", (-1, -1, 1)),
    ("y,-x,-z", "-4+", (0, 0, 1)), ("-y,x,-z", "-4-", (0, 0, 1)), ("-z,-x,-y", "-3+", (1, 1, 1)),
    ("x,y,-z", "m", (0, 0, 1)), ("-x,y,z", "m", (1, 0, 0)), ("-y,-x,z", "m", (1, 1, 0)),
    ("y,x,z", "m", (1, -1, 0)),
]
# Hexagonal basis (directions also in the hexagonal basis).  ITA mirror planes
# m x,-x,z etc. contain the listed lattice direction and c.
HEXAGONAL = [
    ("-y,x-y,z", "3+", (0, 0, 1)), ("-x+y,-x,z", "3-", (0, 0, 1)), ("x-y,x,z", "6+", (0, 0, 1)),
    ("y,-x+y,z", "6-", (0, 0, 1)), ("y,-x+y,-z", "-3+", (0, 0, 1)), ("x-y,x,-z", "-3-", (0, 0, 1)),
    ("-x+y,-x,-z", "-6+", (0, 0, 1)), ("-y,x-y,-z", "-6-", (0, 0, 1)),
    ("x-y,-y,-z", "2", (1, 0, 0)), ("y,x,-z", "2", (1, 1, 0)), ("-x,-x+y,-z", "2", (0, 1, 0)),
    ("-y,-x,-z", "2", (1, -1, 0)), ("-x+y,y,-z", "2", (1, 2, 0)), ("x,x-y,-z", "2", (2, 1, 0)),
]
HEX_MIRRORS = [  # (triplet, a lattice direction in the mirror plane besides c)
    ("-y,-x,z", (1, -1, 0)), ("-x+y,y,z", (1, 2, 0)), ("x,x-y,z", (2, 1, 0)),
    ("y,x,z", (1, 1, 0)), ("x-y,-y,z", (1, 0, 0)), ("-x,-x+y,z", (0, 1, 0)),
]


def _same_symbol(op, ita_symbol, direction):
    """Compare with ITA, allowing for our axis orientation (first non-zero component positive)."""
    ours = op.symbol
    if direction is None or op.axis is None:
        return ours == ita_symbol
    ax = np.array([float(x) for x in op.axis])
    d = np.array(direction, dtype=float)
    assert np.allclose(np.cross(ax, d), 0, atol=1e-12), (op.triplet(), op.axis, direction)
    if np.dot(ax, d) < 0 and ita_symbol[-1] in "+-":
        ita_symbol = ita_symbol[:-1] + ("-" if ita_symbol[-1] == "+" else "+")
    return ours == ita_symbol


@pytest.mark.parametrize("triplet,symbol,direction", CARTESIAN)
def test_cartesian_symbols_match_ita(triplet, symbol, direction):
    op = Operation.from_triplet(triplet)
    assert _same_symbol(op, symbol, direction)


@pytest.mark.parametrize("triplet,symbol,direction", HEXAGONAL)
def test_hexagonal_symbols_match_ita(triplet, symbol, direction):
    op = Operation.from_triplet(triplet, basis="hexagonal")
    cart = tuple(float(x) for x in HEXAGONAL_BASIS * sp.Matrix(direction))
    assert _same_symbol(op, symbol, cart)


@pytest.mark.parametrize("triplet,in_plane", HEX_MIRRORS)
def test_hexagonal_mirrors_match_ita(triplet, in_plane):
    op = Operation.from_triplet(triplet, basis="hexagonal")
    assert op.symbol == "m" and op.kind == "mirror"
    normal = np.array([float(x) for x in op.axis])
    v = np.array([float(x) for x in HEXAGONAL_BASIS * sp.Matrix(in_plane)])
    assert abs(np.dot(normal, v)) < 1e-12 and abs(normal[2]) < 1e-12


def test_describe_words():
    # ITA Vol. A: -4+ 0,0,z is y,-x,-z (from memory)
    assert Operation.from_triplet("y,-x,-z").describe() == "-4+: 4-fold rotoinversion, counter-clockwise, axis [0, 0, 1]"
    assert Operation.from_triplet("-x,-y,-z").describe() == "-1: inversion"
    assert Operation.from_triplet("-y,-x,z").describe() == "m: mirror, normal [1, 1, 0]"
    assert Operation.from_triplet("x-y,-y,-z", basis="hexagonal").describe() == "2: 2-fold rotation, axis [1, 0, 0]"


@pytest.mark.parametrize("setting", point_groups(which="all"))
def test_triplet_round_trip(setting):
    g = catalog_group(setting)
    for op in g.operations:
        assert Operation.from_triplet(op.triplet()) == op
        if g.crystal_system in ("trigonal", "hexagonal"):
            t = op.triplet(basis="hexagonal")
            assert "sqrt" not in t
            assert Operation.from_triplet(t, basis="hexagonal") == op
        assert Operation.from_matrix(op.matrix) == op
        assert op.order >= 1 and (g.order % op.order == 0)


def test_algebraic_triplet():
    op = Operation.from_triplet("x/2-sqrt(3)*y/2,sqrt(3)/2*x+y/2,z")
    assert op.symbol == "6+" and op.axis == (0, 0, 1)


@pytest.mark.parametrize("bad,match", [
    ("x,y", "three comma-separated"),
    ("x+1/2,y,z", "translations are not accepted"),
    ("x,y,z,2", "must be \\+1 or -1"),
    ("x,y,", "empty component"),
    ("x,x,z", "not an orthogonal"),
    ("x-y,x,z", "basis='hexagonal'"),
])
def test_bad_triplets(bad, match):
    with pytest.raises(InvalidOperationError, match=match):
        Operation.from_triplet(bad)


def test_bad_basis_and_matrices():
    with pytest.raises(InvalidOperationError, match="basis"):
        Operation.from_triplet("x,y,z", basis="rhombohedral")
    with pytest.raises(InvalidOperationError, match="float"):
        Operation.from_matrix([[0.5, 0, 0], [0, 1, 0], [0, 0, 1]])
    with pytest.raises(InvalidOperationError, match="3x3"):
        Operation.from_matrix([[1, 0], [0, 1]])
    with pytest.raises(InvalidOperationError, match="not orthogonal"):
        Operation.from_matrix([[1, 1, 0], [0, 1, 0], [0, 0, 1]])
    with pytest.raises(ValueError):
        Operation.from_matrix([[1, 1, 0], [0, 1, 0], [0, 0, 1]])


def test_time_reversal_flag_in_triplets():
    op = Operation.from_triplet("-x,-y,z,-1")
    assert op.time_reversal and op.symbol == "2'" and op.triplet() == "-x,-y,z,-1"
    assert (op @ op).is_identity and not (op @ op).time_reversal


# --- issue 9: the 2-fold about z of the hexagonal family was labelled R(pi) ------------
def _all_catalog_operations():
    for setting in point_groups(which="all"):
        for op in catalog_group(setting).operations:
            yield setting, op


def test_issue_9_no_catalog_operation_is_labelled_by_its_angle():
    # every operation of every catalog group has a rotation order n (1, 2, 3, 4, 6 or 5 for the
    # icosahedral groups), so its symbol is n, n+/n- or a power n^k+/- (common practice)
    bad = [(s, op.triplet(), op.symbol) for s, op in _all_catalog_operations() if "R(" in op.symbol]
    assert bad == []


@pytest.mark.parametrize("setting", ["6", "6/m", "622", "6mm", "6/mmm"])
def test_issue_9_hexagonal_two_fold_about_z(setting):
    g = catalog_group(setting)
    two = next(op for op in g.operations if op.triplet() == "-x,-y,z")
    assert two.symbol == "2"  # ITA Vol. A, P6 general position (4) 2 0,0,z (from memory)
    assert two.describe() == "2: 2-fold rotation, axis [0, 0, 1]"


def test_issue_9_root_cause_angle_of_a_half_turn_with_rounding_noise():
    # the angle was acos((tr - 1)/2), which turns a trace error of 1e-16 at a half turn
    # into an angle error of 1e-8; the symbol must not depend on noise of that size
    op = Operation.from_triplet("-x,-y,z")
    noisy = op.numeric + np.diag([-2.2e-16, -2.2e-16, 0.0])
    object.__setattr__(op, "_num", noisy)
    assert op.symbol == "2" and op.order == 2


def test_icosahedral_five_fold_powers():
    # Cotton 1990, I table: classes 12 C5 and 12 C5^2 (rotations by 72 and 144 degrees)
    g = catalog_group("532")
    symbols = {op.symbol for op in g.operations if op.order == 5}
    assert symbols == {"5+", "5-", "5^2+", "5^2-"}
    op = next(op for op in g.operations if op.symbol == "5^2+")
    assert op.describe().startswith("5^2+: 5-fold rotation by 144 degrees, counter-clockwise, axis [")
    ih = catalog_group("-5-3m")
    assert {op.symbol for op in ih.operations if op.kind == "rotoinversion" and op.order == 10} == {
        "-5+", "-5-", "-5^2+", "-5^2-"}
