"""Arrays reachable from public objects of the data layer are read-only (issue 11).

Writing into them used to poison process-wide caches (the layout of a property is shared by every
TensorData of it); each case writes and expects numpy's ValueError, then checks that results are unchanged.
"""

import numpy as np
import pytest

import tensym
from tensym.data.check import _lie_matrices
from tensym.data.model import group_space, numeric_form
from tensym.groups import as_group

C = tensym.tensor_form("elastic_stiffness", "4/mmm").evaluate([268.0, 155.0, 120.0, 250.0, 60.0, 200.0])


def _arrays(obj, names):
    return [(n, getattr(obj, n)) for n in names]


def _assert_frozen(arr, name):
    assert isinstance(arr, np.ndarray), name
    with pytest.raises(ValueError, match="read-only"):
        arr.reshape(-1)[0] = 7
    assert not arr.flags.writeable, name


def test_user_writes_into_the_layout_of_their_data():
    d = tensym.tensor_data(C, "elastic_stiffness")
    lay = d.layout
    names = ["voigt_sign", "voigt_comp", "flat_comp", "flat_sign", "flat_factor", "size", "factor", "weight",
             "scale", "rep_flat", "_vrep"]
    for n, a in _arrays(lay, names):
        _assert_frozen(a, n)
    # the cache is intact: another tensor reads back unchanged
    assert np.array_equal(tensym.tensor_data(C, "elastic_stiffness").voigt, C)


def test_user_writes_into_tensor_data_and_check_results():
    d = tensym.tensor_data(C, "elastic_stiffness", sigma=np.full((6, 6), 0.5))
    for n, a in _arrays(d, ["components", "covariance", "known"]):
        _assert_frozen(a, n)
    r = tensym.check_tensor(d, group="4/mmm")
    for n in ["symmetrized", "residual", "constants_covariance", "symmetrized_sigma", "misorientation_axis",
              "eigenvalues"]:
        _assert_frozen(getattr(r, n), n)
    b = tensym.check_tensors(C[None], "elastic_stiffness", "4/mmm")
    for n in ["constants", "symmetrized_components", "residual_fraction", "max_deviation", "component_deviation",
              "forbidden", "discrepancies", "n_given", "irrep_fractions", "eigenvalues", "positive_definite",
              "verdicts", "passes"]:
        _assert_frozen(getattr(b, n), n)


def test_user_writes_into_an_orientation():
    lab = tensym.rotate_values(C, tensym.rotation_from_euler(10.0, 50.0, 20.0), "elastic_stiffness")
    o = tensym.orient(lab, "elastic_stiffness", "4/mmm")
    for n in ["rotation", "axis", "equivalents", "_lie", "_solutions"]:
        _assert_frozen(getattr(o, n), n)
    for f in o.families:
        _assert_frozen(f.rotation, "family.rotation")
        _assert_frozen(f.constants, "family.constants")
    sol = o.solutions
    sol[0] = 0.0                     # a new array: writing it changes nothing
    assert np.abs(o.solutions[0]).sum() > 0
    again = tensym.orient(lab, "elastic_stiffness", "4/mmm")
    assert np.allclose(again.rotation, o.rotation)


def test_internal_caches_reached_from_public_objects_are_read_only():
    g = as_group("4/mmm")
    nf = numeric_form("elastic_stiffness", g)
    for n in ["A", "Q", "fit", "free", "zero", "tied"]:
        _assert_frozen(getattr(nf, n), n)
    gs = group_space("elastic_stiffness")
    for n in ["z_comp", "z_mult", "y_rep", "y_ratio"]:
        _assert_frozen(getattr(gs, n), n)
    _assert_frozen(_lie_matrices(nf.layout), "lie matrices")
    from tensym.data.dataset import _tables
    for kind in ("voigt", "full"):
        for n, a in _tables(nf.layout, kind).items():
            if isinstance(a, np.ndarray):
                _assert_frozen(a, f"{kind} table {n}")
