"""orient and find_symmetry: known truth by construction, rotation conventions, symmetry classes."""

import math

import numpy as np
import pytest

import tensym
from tensym.data.find import symmetry_classes
from tensym.data.rotation import rotation_grid
from tensym.errors import DataError

NOISE = 1e-3          # relative noise level of the synthetic data
ANGLE_TOL = 0.5       # degrees: stated recovery accuracy of orient at this noise level


def _noisy(values, what, rng, level=NOISE):
    d = tensym.tensor_data(values, what)
    x = d.components
    scale = np.linalg.norm(d.layout.scale * x) / math.sqrt(len(x))
    return tensym.tensor_data(x + rng.normal(size=x.shape) * level * scale / d.layout.scale, what,
                              layout="components")


CASES = [
    # property, group, constants (invented), expected elastic class
    ("elastic_stiffness", "m-3m", [160.0, 50.0, 80.0]),
    ("elastic_stiffness", "4/mmm", [170.0, 120.0, 90.0, 190.0, 60.0, 40.0]),
    ("elastic_stiffness", "-3m", [87.0, 7.0, 12.0, -18.0, 107.0, 58.0]),
    ("elastic_stiffness", "mmm", [230.0, 70.0, 50.0, 180.0, 60.0, 150.0, 40.0, 55.0, 70.0]),
    ("piezoelectric_d", "3m", [68.0, 21.0, -1.0, 6.0]),
    ("piezoelectric_d", "-42m", [3.0, 7.0]),
]


@pytest.mark.parametrize("what, group, consts", CASES)
def test_orient_recovers_a_random_rotation(what, group, consts):
    rng = np.random.default_rng(abs(hash((what, group))) % 2**32)
    truth = np.array(tensym.tensor_form(what, group).evaluate(consts))
    r_true = tensym.random_rotations(1, seed=int(rng.integers(1 << 30)))[0]
    lab = _noisy(tensym.rotate_values(truth, r_true.T, what), what, rng)   # t_lab = R^T . t_std
    o = tensym.orient(lab, group=group)
    assert o.residual_fraction < 5 * NOISE
    assert o.initial_residual_fraction > 0.05
    assert o.misorientation_to(r_true) < ANGLE_TOL
    # the report is one of the equivalent solutions, the one closest to the identity
    assert np.min(tensym.misorientation(o.equivalents, o.rotation)) < 1e-9
    assert o.angle <= np.min(tensym.misorientation(o.equivalents, np.eye(3))) + 1e-9
    # the rotated data are in the standard setting: they pass the group
    assert tensym.check_tensor(o.rotated, group=group, tol=5 * NOISE).passes
    assert o.check(tol=5 * NOISE).passes


def test_equivalent_solutions_of_orthotropic_data_include_axis_exchanges():
    # an orthorhombic tensor is orthorhombic again after any exchange of the axes: 24 proper rotations
    # (the rotations of the cube) give equally good answers; the 4 rotations of 222 keep the constants,
    # the 6 exchanges of the axes (3! = 6 families, issue 11) change them
    c = np.array(tensym.tensor_form("elastic_stiffness", "mmm").evaluate(
        [230.0, 70.0, 50.0, 180.0, 60.0, 150.0, 40.0, 55.0, 70.0]))
    o = tensym.orient(c, "elastic_stiffness", "mmm")
    assert len(o.solutions) == 24 and o.n_equivalent == 4 and o.n_families == 6
    assert not o.continuous and o.angle < 1e-9   # given in a standard setting: that family is primary
    swap = tensym.rotation_from_axis_angle([1, 1, 1], 120.0)
    assert o.misorientation_to(swap) < 1e-6


def test_transversely_isotropic_data_fix_only_the_axis():
    c = np.array(tensym.tensor_form("elastic_stiffness", "6/mmm").evaluate([200.0, 80.0, 60.0, 180.0, 40.0]))
    r = tensym.rotation_from_euler(40.0, 70.0, 10.0)
    o = tensym.orient(tensym.rotate_values(c, r.T, "elastic_stiffness"), "elastic_stiffness", "6/mmm")
    assert o.continuous and o.residual_fraction < 1e-9
    # the crystal's c axis (third row of R: z_std in the data frame) is found, up to its sign
    assert abs(np.dot(o.rotation[2], r[2])) == pytest.approx(1.0, abs=1e-9)
    assert o.misorientation_to(r) < 1e-6
    assert o.misorientation_to(tensym.rotation_from_axis_angle([0, 0, 1], 33.0) @ r) < 1e-6


def test_orient_renderings_and_conventions():
    d = np.zeros((3, 6))
    d[2, 2], d[2, 0], d[2, 1], d[0, 4], d[1, 3] = 20.0, -8.0, -8.0, 30.0, 30.0
    r = tensym.rotation_from_euler(20.0, 35.0, 0.0)
    o = tensym.orient(tensym.rotate_values(d, r.T, "piezoelectric_d"), "piezoelectric_d", "6mm")
    assert np.allclose(tensym.rotation_from_euler(*o.euler), o.rotation)
    axis, angle = tensym.axis_angle(o.rotation)
    assert np.allclose(axis, o.axis) and angle == pytest.approx(o.angle)
    assert np.allclose(tensym.rotation_from_axis_angle(o.axis, o.angle), o.rotation)
    assert "oriented to 6mm" in o.text() and '"kind": "orientation"' in o.to_json()
    assert o.record()["euler_zyz_deg"] == list(o.euler)
    with pytest.raises(ValueError):
        o.rotation[0, 0] = 2.0


def _quaternions(r):
    # unit quaternions of rotation matrices (common practice; the largest-component branch)
    w = np.sqrt(np.maximum(0.0, 1 + r[:, 0, 0] + r[:, 1, 1] + r[:, 2, 2])) / 2
    x = np.sqrt(np.maximum(0.0, 1 + r[:, 0, 0] - r[:, 1, 1] - r[:, 2, 2])) / 2
    y = np.sqrt(np.maximum(0.0, 1 - r[:, 0, 0] + r[:, 1, 1] - r[:, 2, 2])) / 2
    z = np.sqrt(np.maximum(0.0, 1 - r[:, 0, 0] - r[:, 1, 1] + r[:, 2, 2])) / 2
    x = np.copysign(x, r[:, 2, 1] - r[:, 1, 2])
    y = np.copysign(y, r[:, 0, 2] - r[:, 2, 0])
    z = np.copysign(z, r[:, 1, 0] - r[:, 0, 1])
    return np.stack([w, x, y, z], axis=1)


def test_rotation_grid_covers_so3_at_the_stated_radius():
    # every rotation lies within 1.05 x resolution of a grid point (rotation_grid docstring);
    # the angle between rotations is 2 arccos |q1 . q2|
    rots = _quaternions(tensym.random_rotations(1500, seed=99))
    for res in (30.0, 15.0, 10.0):
        grid = _quaternions(rotation_grid(res))
        best = np.degrees(2 * np.arccos(np.clip(np.abs(rots @ grid.T).max(axis=1), 0, 1)))
        assert best.max() < 1.05 * res and np.percentile(best, 99) < 0.9 * res


def test_rotation_helpers():
    r = tensym.rotation_from_euler(30.0, 40.0, 50.0)
    assert np.allclose(r, tensym.rotation_from_axis_angle([0, 0, 1], 30) @ tensym.rotation_from_axis_angle(
        [0, 1, 0], 40) @ tensym.rotation_from_axis_angle([0, 0, 1], 50))
    for e in [(30.0, 180.0, 0.0), (-120.0, 0.0, 0.0), (170.0, 90.0, -170.0)]:
        assert np.allclose(tensym.rotation_from_euler(*tensym.euler_angles(tensym.rotation_from_euler(*e))),
                           tensym.rotation_from_euler(*e))
    axis, ang = tensym.axis_angle(tensym.rotation_from_axis_angle([0, 1, 1], 180.0))
    assert ang == pytest.approx(180.0) and np.allclose(axis, np.array([0, 1, 1]) / math.sqrt(2))
    assert tensym.axis_angle(np.eye(3))[1] == 0.0
    q = tensym.random_rotations(50, seed=1)
    assert np.allclose(np.einsum("nij,nkj->nik", q, q), np.eye(3)) and np.all(np.linalg.det(q) > 0)
    with pytest.raises(DataError, match="not orthogonal"):
        tensym.axis_angle(np.ones((3, 3)))
    with pytest.raises(DataError, match="determinant -1"):
        tensym.euler_angles(-np.eye(3))
    with pytest.raises(DataError, match="must be a 3x3 matrix"):
        tensym.axis_angle(np.eye(2))
    with pytest.raises(DataError, match="NaN or inf"):
        tensym.axis_angle(np.full((3, 3), np.nan))
    with pytest.raises(DataError, match="rotation must be numbers"):
        tensym.axis_angle("x")
    with pytest.raises(DataError, match="non-zero finite 3-vector"):
        tensym.rotation_from_axis_angle([0, 0, 0], 10)
    with pytest.raises(DataError, match="finite number of degrees"):
        tensym.rotation_from_axis_angle([0, 0, 1], float("nan"))
    with pytest.raises(DataError, match="non-negative integer"):
        tensym.random_rotations(-1)
    with pytest.raises(DataError, match=r"resolution must be a number of degrees in \[1, 90\]"):
        rotation_grid(0.1)


def test_rotate_values_layouts_and_refusals():
    c = np.array(tensym.tensor_form("elastic_stiffness", "-3m").evaluate([87.0, 7.0, 12.0, -18.0, 107.0, 58.0]))
    r = tensym.random_rotations(4, seed=3)
    stack = tensym.rotate_values(c, r, "elastic_stiffness")
    assert stack.shape == (4, 6, 6)
    full = tensym.rotate_values(tensym.from_voigt(c, "elastic_stiffness"), r, "elastic_stiffness")
    assert np.allclose(tensym.to_voigt(full, "elastic_stiffness"), stack)
    # axial: the gyration tensor changes sign under the inversion
    g = np.diag([1.0, 1.0, 2.0])
    assert np.allclose(tensym.rotate_values(g, -np.eye(3), "optical_activity"), -g)
    assert np.allclose(tensym.rotate_values(g, -np.eye(3), "dielectric_permittivity"), g)
    d = tensym.tensor_data(c, "elastic_stiffness")
    assert isinstance(tensym.rotate_values(d, r[0], "elastic_stiffness"), tensym.TensorData)
    with pytest.raises(DataError, match=r"must end in the Voigt shape \(6, 6\) or the full shape"):
        tensym.rotate_values(np.zeros((3, 6)), r[0], "elastic_stiffness")
    with pytest.raises(DataError, match="not orthogonal"):
        tensym.rotate_values(c, np.ones((3, 3)), "elastic_stiffness")
    from tensym.errors import InvalidOptionError

    with pytest.raises(InvalidOptionError, match="layout='rows' is not one of auto, voigt, full"):
        tensym.rotate_values(c, r[0], "elastic_stiffness", layout="rows")


def test_elastic_tensors_have_exactly_eight_symmetry_classes():
    # S. Forte and M. Vianello, J. Elasticity 43, 81 (1996): 8 symmetry classes of elasticity tensors
    classes = symmetry_classes("elastic_stiffness")
    assert [c.name for c in classes] == ["isotropic", "cubic", "transversely isotropic", "tetragonal", "trigonal",
                                        "orthotropic", "monoclinic", "triclinic"]
    assert [c.n_independent for c in classes] == [2, 3, 5, 6, 6, 9, 13, 21]   # Nye 1985, Table 9
    by = {c.name: set(c.groups) for c in classes}
    assert {"4/m", "4", "-4", "4/mmm"} <= by["tetragonal"] and {"-3", "3", "32"} <= by["trigonal"]
    assert {"6", "6/mmm", "inf/mm"} <= by["transversely isotropic"] and {"23", "m-3m"} <= by["cubic"]
    assert len(symmetry_classes("elastic_compliance")) == 8


@pytest.mark.parametrize("group, expected", [
    ("m-3m", "cubic"), ("6/mmm", "transversely isotropic"), ("4/m", "tetragonal"), ("-3", "trigonal"),
    ("mmm", "orthotropic"), ("2/m", "monoclinic"),
])
def test_find_symmetry_recovers_the_class(group, expected):
    rng = np.random.default_rng(len(group) + 17 * len(expected))
    f = tensym.tensor_form("elastic_stiffness", group)
    base = np.array(f.evaluate(rng.uniform(20.0, 80.0, size=f.n_independent)))
    r = tensym.random_rotations(1, seed=int(rng.integers(1 << 30)))[0]
    lab = _noisy(tensym.rotate_values(base, r.T, "elastic_stiffness"), "elastic_stiffness", rng)
    found = tensym.find_symmetry(lab, tol=0.01)
    assert found.best.name == expected
    assert found.best.residual_fraction < 5 * NOISE
    assert "8 classes" in found.note and "Forte & Vianello 1996" in found.note
    # every higher class is rejected, every lower one consistent
    names = [c.name for c in symmetry_classes("elastic_stiffness")]
    assert [c.name for c in found.candidates] == [n for n in names if n in {c.name for c in found.candidates}]
    assert all(c.residual_fraction > 0.01 for c in found.rejected)


def test_find_symmetry_of_a_piezoelectric_tensor_names_the_groups_it_cannot_tell_apart():
    rng = np.random.default_rng(4)
    d = np.array(tensym.tensor_form("piezoelectric_d", "4mm").evaluate([30.0, -8.0, 20.0]))
    lab = tensym.rotate_values(d, tensym.random_rotations(1, seed=8)[0], "piezoelectric_d")
    found = tensym.find_symmetry(_noisy(lab, "piezoelectric_d", rng), tol=0.01)
    assert found.best.name == "class of 6mm" and {"4mm", "6mm", "infm"} <= set(found.best.groups)
    assert "cannot tell apart" in found.note
    text = found.text()
    assert "highest symmetry within tol 0.01" in text and "class of 6mm" in text
    assert found.record()["best"] == "class of 6mm"


def test_orient_and_find_refusals():
    c = np.eye(6)
    with pytest.raises(DataError, match="refine must be a positive integer"):
        tensym.orient(c, "elastic_stiffness", "m-3m", refine=0)
    with pytest.raises(DataError, match="say which group"):
        tensym.orient(c, "elastic_stiffness")
    with pytest.raises(DataError, match="resolution must be a number of degrees"):
        tensym.orient(c, "elastic_stiffness", "m-3m", resolution=200)
    with pytest.raises(DataError, match="tol must be a finite number >= 0"):
        tensym.find_symmetry(c, "elastic_stiffness", tol=float("inf"))
    with pytest.raises(DataError, match="refine must be a positive integer"):
        tensym.find_symmetry(c, "elastic_stiffness", refine=1.5)
