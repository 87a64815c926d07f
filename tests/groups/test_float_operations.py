"""Float operations (rotation parts as structure files print them) snapped to exact groups (issue 9).

Oracles: the exact catalog groups turned by exact random frames (Cayley transforms of random
rational antisymmetric matrices, K -> (I - K)^-1 (I + K): common practice), rounded to 4..8 digits
the way a structure file prints them; spglib's database of rotation parts for the settings.
"""

import os

import mpmath
import numpy as np
import pytest
import sympy as sp
from hypothesis import given, settings, strategies as st

import tensym
from tensym.errors import GroupClosureError, InvalidOperationError, InvalidOptionError
from tensym.groups import group_from_generators, point_groups, reorient, rotation_about, rotation_from_axes
from tensym.groups.catalog import catalog_group

SETTINGS = point_groups(which="all")  # the 32 classes in every catalog setting, and 532, -5-3m


def _cayley(a, b, c, d):
    k = sp.Matrix([[0, -c, b], [c, 0, -a], [-b, a, 0]]) / d
    return sp.ImmutableMatrix((sp.eye(3) - k).inv() * (sp.eye(3) + k))


def _n30(m):
    """30-digit mpmath matrix of an exact matrix."""
    return mpmath.matrix(sp.Matrix(m).evalf(30).tolist())


def _close30(a, b):
    """Exact matrices equal: their 30-digit values agree to 1e-25 (distinct algebraic entries of this size differ far more)."""
    return max(abs(x) for x in (a - b)) < mpmath.mpf("1e-25")


def _check(snapped, original, given):
    with mpmath.workdps(40):
        _check40(snapped, original, given)


def _check40(snapped, original, given):
    assert snapped.symbol == original.symbol
    assert snapped.operation_keys() == original.operation_keys()
    mine = {op.key: _n30(op.matrix) for op in snapped.operations}
    for op in original.operations:
        assert _close30(mine[op.key], _n30(op.matrix))
    # the recognised rotation maps the standard setting exactly onto the snapped group
    std = catalog_group(snapped.setting_symbol)
    q = _n30(snapped.rotation if snapped.rotation is not None else sp.eye(3))
    assert _close30(q * q.T, mpmath.eye(3)) and abs(mpmath.det(q) - 1) < 1e-25
    by_rounded = {tuple(round(float(x), 6) for x in v): v for v in mine.values()}
    for s in std.operations:
        t = q * _n30(s.matrix) * q.T
        assert _close30(t, by_rounded[tuple(round(float(x), 6) for x in t)])
    if any(np.any(m != np.rint(m)) for m in given):  # all-integer matrices take the exact path
        assert "snapped from float operations (largest deviation" in snapped.setting


def _rounded(group, digits, every):
    src = group.operations if every else group.generators
    return [np.round(op.numeric, digits) for op in src]


def _frame_for(digits):
    """Cayley parameters with a^2 + b^2 + c^2 + d^2 <= sqrt(10**digits) / 2: the frames whose
    rational entries the snap is documented to resolve at tol = 10**-digits (tensym.groups.snapping)."""
    return int(0.5 * 10 ** (digits / 2))


@pytest.mark.parametrize("setting", SETTINGS)
@pytest.mark.parametrize("digits", [4, 8])  # 5..7 digits: the hypothesis test below
def test_every_class_in_a_random_rational_frame(setting, digits):
    rng = np.random.default_rng(SETTINGS.index(setting) * 10 + digits)  # seeded per case
    nmax = _frame_for(digits)
    while True:
        a, b, c = (int(x) for x in rng.integers(-20, 21, 3))
        d = int(rng.integers(1, 21))
        if a * a + b * b + c * c + d * d <= nmax:
            break
    original = reorient(setting, _cayley(a, b, c, d))
    given = _rounded(original, digits, True)
    _check(group_from_generators(given, tol=10.0 ** -digits), original, given)


@settings(max_examples=60, deadline=None)
@given(st.sampled_from(SETTINGS), st.integers(4, 8), st.booleans(),
       st.integers(-30, 30), st.integers(-30, 30), st.integers(-30, 30), st.integers(1, 30))
def test_random_frames_and_digits(setting, digits, every, a, b, c, d):
    if a * a + b * b + c * c + d * d > _frame_for(digits):
        a, b, c, d = a % 3, b % 3, c % 3, 1 + d % 3  # keep the draw, within the resolvable frames
    original = reorient(setting, _cayley(a, b, c, d))
    given = _rounded(original, digits, every)
    _check(group_from_generators(given, tol=10.0 ** -digits), original, given)


@pytest.mark.parametrize("frame", [
    rotation_from_axes(new_x=[1, -1, 0], new_z=[1, 1, 1]),  # entries with sqrt(2), sqrt(3), sqrt(6)
    rotation_from_axes(new_x=[3, 0, -1], new_z=[1, 2, 3]),  # columns along (1, 2, 3)/sqrt(14) ...
    rotation_about([0, 0, 1], sp.pi / 6),                  # sqrt(3)/2
    rotation_about([1, 0, 0], sp.pi / 4),                  # sqrt(2)/2
])
@pytest.mark.parametrize("setting", ["m-3m", "6mm", "321", "mmm", "-42m", "-4m2", "4/m", "12/m1", "-6m2", "532"])
def test_algebraic_frames(frame, setting):
    original = reorient(setting, frame)
    for digits in (4, 8):
        given = _rounded(original, digits, True)
        _check(group_from_generators(given, tol=10.0 ** -digits), original, given)


def test_standard_settings_snap_to_the_catalog_rows():
    # a structure file in the standard orientation: the catalog setting itself, no rotation
    for setting in SETTINGS:
        g = group_from_generators(_rounded(catalog_group(setting), 5, True), tol=1e-5)
        assert g.setting_symbol == setting and g.rotation is None
        assert g.operation_keys() == catalog_group(setting).operation_keys()


def test_doc_example_rounded_to_seven_digits():
    c = 0.8660254  # sqrt(3)/2 as a structure file prints it
    g = group_from_generators([[[0.5, -c, 0], [c, 0.5, 0], [0, 0, 1]], [[-1, 0, 0], [0, 1, 0], [0, 0, 1]]])
    assert (g.symbol, g.setting_symbol, g.rotation) == ("6mm", "6mm", None)
    assert tensym.tensor_form("elastic_stiffness", g).n_independent == 5  # Nye 1985: 6mm has 5


# --- spglib's database as the outside source of the operations -----------------------------------
os.environ.setdefault("SPGLIB_OLD_ERROR_HANDLING", "0")


@pytest.mark.parametrize("hall", range(1, 531, 11))
def test_spglib_rotations_in_cartesian_floats(hall):
    spglib = pytest.importorskip("spglib")
    t = spglib.get_spacegroup_type(hall)
    rots = spglib.get_symmetry_from_database(hall)["rotations"]
    hexa = np.array([[1.0, -0.5, 0.0], [0.0, np.sqrt(3) / 2, 0.0], [0.0, 0.0, 1.0]])
    if t.choice == "R":  # rhombohedral axes (obverse) in hexagonal ones (ITA Vol. A, Table 5.1.3.1; from memory)
        a = hexa @ np.array([[2, -1, -1], [1, 1, -2], [1, 1, 1]], dtype=float) / 3
    else:
        a = hexa if 143 <= t.number <= 194 else np.eye(3)
    cart = [np.round(a @ r @ np.linalg.inv(a), 6) for r in rots]
    g = group_from_generators(cart, tol=1e-6)
    assert g.symbol == t.pointgroup_international
    assert g.rotation is None  # spglib's settings are catalog settings (a along x, c along z)
    frame = _cayley(1, -2, 2, 3)  # and the same in a turned frame, rounded again
    qf = np.array(frame.evalf(20).tolist(), dtype=float)
    given = [np.round(qf @ m @ qf.T, 6) for m in cart]
    _check(group_from_generators(given, tol=1e-6), reorient(g, frame), given)


# --- tolerance and errors ---------------------------------------------------------------------
def _rot_z(t):
    return [[np.cos(t), -np.sin(t), 0.0], [np.sin(t), np.cos(t), 0.0], [0.0, 0.0, 1.0]]


def test_tolerance_is_absolute_on_entries():
    m = np.array(_rot_z(2 * np.pi / 3))
    m[0, 0] += 2e-4  # one entry 2e-4 off
    with pytest.raises(InvalidOperationError, match=r"not orthogonal within tol=0.0001 .*1\.\d+e-04 from the nearest"):
        group_from_generators([m])
    assert group_from_generators([m], tol=1e-3).symbol == "3"


def test_not_orthogonal():
    with pytest.raises(InvalidOperationError, match="float matrix 1 is not orthogonal within tol=0.0001"):
        group_from_generators([[[1.1, 0, 0], [0, 1, 0], [0, 0, 1]]])


def test_not_close_to_a_finite_group():
    with pytest.raises(GroupClosureError, match="not within tol=0.0001 .* of a finite point group"):
        group_from_generators([_rot_z(1.0)])  # 1 radian: no finite order


def test_class_outside_the_catalog():
    with pytest.raises(GroupClosureError, match=r"class 5 \(C5\), which is not in the catalog"):
        group_from_generators([np.round(_rot_z(2 * np.pi / 5), 6)])


def test_frame_with_no_exact_rotation_nearby():
    # rotation about [1, 1, 1] by pi/7 (cos(pi/7) is cubic over Q): no frame of the documented kinds
    frame = rotation_about([1, 1, 1], sp.pi / 7)
    with pytest.raises(GroupClosureError, match=r"class m-3m \(Oh\) in a frame with no exact rotation near Q = "):
        group_from_generators(_rounded(reorient("m-3m", frame), 6, False), tol=1e-6)


@pytest.mark.parametrize("tol,match", [(0, "outside"), (1.0, "outside"), ("1e-4", "must be a real number"),
                                       (True, "must be a real number"), (float("nan"), "outside")])
def test_bad_tolerance(tol, match):
    with pytest.raises(InvalidOptionError, match=match):
        group_from_generators([_rot_z(np.pi / 2)], tol=tol)
    with pytest.raises(InvalidOptionError, match=match):
        reorient("6mm", _rot_z(0.5), tol=tol)


def test_floats_with_primed_operations_and_non_finite_entries():
    with pytest.raises(InvalidOperationError, match="float matrices cannot be combined with primed operations"):
        group_from_generators(["-x,-y,z,-1", _rot_z(2 * np.pi / 3)])
    with pytest.raises(InvalidOperationError, match="non-finite entry"):
        group_from_generators([[[np.nan, 0.5, 0], [0, 1, 0], [0, 0, 1]]])


def test_mixed_exact_and_float_generators():
    g = group_from_generators(["x,-y,-z", np.round(_rot_z(2 * np.pi / 3), 7)])
    assert (g.setting_symbol, g.rotation) == ("321", None)


# --- reorient with a float rotation ------------------------------------------------------------
def test_reorient_by_a_float_rational_rotation():
    q = _cayley(1, 2, -1, 3)
    qf = np.round(np.array(q.evalf(20).tolist(), dtype=float), 6)
    g = reorient("m-3m", qf, tol=1e-6)
    assert g.rotation == q and g.operation_keys() == reorient("m-3m", q).operation_keys()
    assert "rotation snapped from floats (largest deviation" in g.setting
    m = reorient("m'm'm", qf, tol=1e-6)
    assert m.is_magnetic and m.operation_keys() == reorient("m'm'm", q).operation_keys()
    c = reorient("Cinfv", qf, tol=1e-6)
    assert c.rotation == q


def test_reorient_by_a_float_rotation_snaps_the_group_when_the_frame_is_not_exact():
    # a uniaxial group only needs its axis: rotation about z by 1 radian leaves 4/m unchanged
    g = reorient("4/m", _rot_z(1.0))
    assert g.operation_keys() == catalog_group("4/m").operation_keys() and g.setting_symbol == "4/m"


def test_reorient_float_errors():
    with pytest.raises(InvalidOperationError, match="rotation is not orthogonal within tol=0.0001"):
        reorient("6mm", [[1.01, 0, 0], [0, 1, 0], [0, 0, 1]])
    with pytest.raises(InvalidOperationError, match="improper"):
        reorient("6mm", [[-0.6, 0.8, 0], [0.8, 0.6, 0], [0, 0, 1]])
    with pytest.raises(GroupClosureError, match="no exact rotation lies within tol=0.0001 .*continuous group"):
        reorient("Cinfv", rotation_about_float([1, 1, 1], np.pi / 7))
    with pytest.raises(GroupClosureError, match="in a frame with no exact rotation near"):
        reorient("m-3m", rotation_about_float([1, 1, 1], np.pi / 7))


def rotation_about_float(axis, t):
    u = np.array(axis, dtype=float) / np.linalg.norm(axis)
    ux = np.array([[0, -u[2], u[1]], [u[2], 0, -u[0]], [-u[1], u[0], 0]])
    return np.cos(t) * np.eye(3) + np.sin(t) * ux + (1 - np.cos(t)) * np.outer(u, u)
