"""Inequivalent families of orientations that fit equally well (issue 11).

Oracles (common practice, from memory): a turn of 45 degrees about z takes a tetragonal stiffness with x
along [100] to the one with x along [110]: c11' = (c11 + c12)/2 + c66, c12' = (c11 + c12)/2 - c66,
c66' = (c11 - c12)/2, c13, c33, c44 unchanged; a turn of 180 degrees about z reverses the sign of c14 of a
trigonal (-3m, 2-fold along x) stiffness; the axes of an orthorhombic crystal can be exchanged in 3! = 6
ways.
"""

import numpy as np
import pytest

import tensym

TET = dict(c11=268.0, c12=155.0, c13=120.0, c33=250.0, c44=60.0, c66=200.0)   # invented
TET_110 = dict(c11=(268.0 + 155.0) / 2 + 200.0, c12=(268.0 + 155.0) / 2 - 200.0, c13=120.0, c33=250.0, c44=60.0,
               c66=(268.0 - 155.0) / 2)                                          # 411.5, 11.5, ..., 56.5


def _tetragonal(c11, c12, c13, c33, c44, c66):
    # the 4/mmm Voigt pattern (Nye 1985, ch. VIII, from memory)
    c = np.zeros((6, 6))
    c[0, 0] = c[1, 1] = c11
    c[0, 1] = c[1, 0] = c12
    c[0, 2] = c[2, 0] = c[1, 2] = c[2, 1] = c13
    c[2, 2] = c33
    c[3, 3] = c[4, 4] = c44
    c[5, 5] = c66
    return c


def _frames(n, seed):
    return tensym.random_rotations(n, seed=seed)


def test_user_orients_a_tetragonal_stiffness_given_in_a_tilted_frame():
    # before issue 11: one answer (x along [100] or [110], by chance of the frame) and "equivalent solutions: 16"
    lab = tensym.rotate_values(_tetragonal(**TET), tensym.rotation_from_euler(10.0, 50.0, 20.0), "elastic_stiffness")
    o = tensym.orient(lab, "elastic_stiffness", "4/mmm")
    assert o.n_families == 2 and o.n_equivalent == 8 and len(o.solutions) == 16
    found = sorted(tuple(round(f.constant(k), 6) for k in TET) for f in o.families)
    assert found == sorted([tuple(TET.values()), tuple(round(v, 6) for v in TET_110.values())])
    text = o.text()
    assert "2 inequivalent families of solutions fit equally well" in text
    assert "a structure (or your convention) must decide" in text
    assert "c11 = 411.5" in text and "c11 = 268" in text
    assert o.record()["families"][0]["primary"] is True


def test_user_orients_the_same_crystal_given_in_many_frames_and_gets_one_primary_answer():
    # the primary family follows a rule on the numbers (lexicographically smallest constants), not the frame
    primaries = set()
    for r in _frames(12, seed=404):
        lab = tensym.rotate_values(_tetragonal(**TET), r, "elastic_stiffness")
        o = tensym.orient(lab, "elastic_stiffness", "4/mmm")
        assert o.residual_fraction < 1e-8
        primaries.add(tuple(np.round(o.families[0].constants, 6)))
        assert o.rotated["c11"] == pytest.approx(o.families[0].constant("c11"), abs=1e-9)
    assert primaries == {tuple(round(v, 6) for v in TET.values())}   # 268 < 411.5


def test_user_orients_a_tetragonal_stiffness_already_given_in_a_standard_setting():
    # the user's axes decide when the data already fit: no rotation, whichever family is smaller
    for consts in (TET, TET_110):
        o = tensym.orient(_tetragonal(**consts), "elastic_stiffness", "4/mmm")
        assert o.angle < 1e-6 and o.families[0].constant("c11") == pytest.approx(consts["c11"], abs=1e-9)


def test_user_identifies_a_tetragonal_stiffness_and_is_told_of_both_families():
    lab = tensym.rotate_values(_tetragonal(**TET), tensym.rotation_from_euler(10.0, 50.0, 20.0), "elastic_stiffness")
    f = tensym.find_symmetry(lab, "elastic_stiffness")
    assert f.best.name == "tetragonal" and f.best.orientation.n_families == 2
    assert "inequivalent families" in f.text()


def test_user_orients_a_trigonal_stiffness_and_sees_both_signs_of_c14():
    # -3m with its 2-fold along x (Nye 1985, from memory): c24 = -c14, c56 = c14, c66 = (c11 - c12)/2
    c11, c12, c13, c14, c33, c44 = 203.0, 53.0, 75.0, 9.0, 245.0, 60.0
    c = np.array([[c11, c12, c13, c14, 0, 0], [c12, c11, c13, -c14, 0, 0], [c13, c13, c33, 0, 0, 0],
                  [c14, -c14, 0, c44, 0, 0], [0, 0, 0, 0, c44, c14], [0, 0, 0, 0, c14, (c11 - c12) / 2]])
    lab = tensym.rotate_values(c, tensym.rotation_from_euler(30.0, 40.0, 50.0), "elastic_stiffness")
    o = tensym.orient(lab, "elastic_stiffness", "-3m")
    assert o.n_families == 2
    assert sorted(round(f.constant("c14"), 6) for f in o.families) == [-9.0, 9.0]
    assert o.families[0].constant("c14") == pytest.approx(-9.0)    # lexicographic: c11..c13 equal, c14 < 0


def test_user_orients_an_orthorhombic_stiffness_in_a_tilted_frame():
    c = np.array(tensym.tensor_form("elastic_stiffness", "mmm").evaluate(
        [230.0, 70.0, 50.0, 180.0, 60.0, 150.0, 40.0, 55.0, 70.0]))
    lab = tensym.rotate_values(c, tensym.rotation_from_euler(15.0, 65.0, 40.0), "elastic_stiffness")
    o = tensym.orient(lab, "elastic_stiffness", "mmm")
    assert o.n_families == 6
    assert sorted(round(f.constant("c11"), 6) for f in o.families) == [150.0, 150.0, 180.0, 180.0, 230.0, 230.0]
    assert o.families[0].constant("c11") == pytest.approx(150.0)


@pytest.mark.parametrize("group, consts", [("m-3m", [166.0, 64.0, 80.0]), ("6/mmm", [200.0, 80.0, 60.0, 180.0, 40.0])])
def test_user_orients_data_whose_frame_is_fixed_up_to_equivalent_rotations(group, consts):
    c = tensym.tensor_form("elastic_stiffness", group).evaluate(consts)
    lab = tensym.rotate_values(c, tensym.rotation_from_euler(20.0, 35.0, -50.0), "elastic_stiffness")
    o = tensym.orient(lab, "elastic_stiffness", group)
    assert o.n_families == 1 and o.free_rotation == 0
    assert "inequivalent" not in o.text()


def test_user_orients_a_monoclinic_stiffness_whose_angle_about_the_axis_is_free():
    f = tensym.tensor_form("elastic_stiffness", "2/m")
    rng = np.random.default_rng(2)
    c = f.evaluate(rng.uniform(10, 50, f.n_independent).tolist()) + np.diag([200.0] * 3 + [80.0] * 3)
    o = tensym.orient(c, "elastic_stiffness", "2/m")
    assert o.free_rotation == 1 and "continuous family of solutions" in o.text()


def test_misorientation_counts_every_family():
    r_true = tensym.rotation_from_euler(10.0, 50.0, 20.0)
    lab = tensym.rotate_values(_tetragonal(**TET), r_true.T, "elastic_stiffness")
    o = tensym.orient(lab, "elastic_stiffness", "4/mmm")
    assert o.misorientation_to(r_true) < 1e-6
    turn = tensym.rotation_from_axis_angle([0, 0, 1], 45.0) @ r_true
    assert o.misorientation_to(turn) < 1e-6           # the other family fits just as well
