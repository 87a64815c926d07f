"""Forms in a sympy session: printer hooks, pickling, batch evaluation (issue 17, forms part)."""

import io
import pickle

import numpy as np
import pytest
import sympy as sp
from hypothesis import given, settings
from hypothesis import strategies as st

import tensym
from tensym.groups.catalog import point_groups


@pytest.mark.parametrize("sym", ["6mm", "32", "m-3m", "-1"])
def test_sympy_latex_of_a_form_is_its_latex(sym):
    f = tensym.tensor_form("elastic_stiffness", sym)
    assert sp.latex(f) == f.latex()


def test_sympy_latex_of_a_rotated_form_is_its_latex():
    t = sp.Symbol("t", real=True)
    r = tensym.tensor_form("piezoelectric_d", "32").rotated(
        sp.Matrix([[1, 0, 0], [0, sp.cos(t), sp.sin(t)], [0, -sp.sin(t), sp.cos(t)]]))
    assert sp.latex(r) == r.latex()
    assert "d_{11}" in sp.latex(r)


def test_pprint_fits_an_80_column_terminal_and_keeps_the_text():
    f = tensym.tensor_form("piezoelectric_d", "4mm")
    out = sp.pretty(f)
    assert all(len(x) <= 80 for x in out.splitlines())
    assert "".join(out.split()) == "".join(str(f).split())  # the same words, wrapped, not centred
    assert out.splitlines()[0].startswith("piezoelectric")
    assert sp.sstr(f) == str(f)


@settings(max_examples=25, deadline=None)
@given(sym=st.sampled_from(point_groups()), prop=st.sampled_from(tensym.property_names()))
def test_forms_survive_pickling_with_equality(sym, prop):
    f = tensym.tensor_form(prop, sym)
    g = pickle.loads(pickle.dumps(f))
    assert g == f and hash(g) == hash(f)
    assert g.voigt == f.voigt and g.relations == f.relations


def test_pickled_reoriented_form_is_equal_and_differs_from_the_standard_one():
    q = tensym.rotation_about([1, 0, 0], sp.pi / 2)
    f = tensym.tensor_form("elastic_stiffness", tensym.reorient("6mm", q))
    assert pickle.loads(pickle.dumps(f)) == f
    assert f != tensym.tensor_form("elastic_stiffness", "6mm")


@settings(max_examples=20, deadline=None)
@given(sym=st.sampled_from(point_groups()), prop=st.sampled_from(["elastic_stiffness", "piezoelectric_d",
                                                                   "dielectric_permittivity", "third_order_elastic"]),
       seed=st.integers(0, 2**31))
def test_batch_evaluation_matches_one_set_at_a_time(sym, prop, seed):
    f = tensym.tensor_form(prop, sym)
    X = np.random.default_rng(seed).normal(size=(7, f.n_independent)) * 10.0 ** np.random.default_rng(seed).integers(-3, 4)
    V = f.evaluate(X)
    assert V.shape[0] == 7
    for x, v in zip(X, V):
        assert np.allclose(f.evaluate(list(x)), v, rtol=1e-12, atol=0)
    T = f.evaluate(X, full=True)
    assert np.allclose(T[3], f.evaluate(list(X[3]), full=True), rtol=1e-12, atol=0)


def test_batch_evaluation_refuses_a_wrong_shape_complex_and_nan():
    f = tensym.tensor_form("elastic_stiffness", "m-3m")
    with pytest.raises(tensym.errors.DataError, match=r"shape \(N, 3\)"):
        f.evaluate(np.zeros((4, 5)))
    with pytest.raises(tensym.errors.DataError, match="complex"):
        f.evaluate(np.zeros((4, 3)) + 1j)
    bad = np.ones((4, 3))
    bad[2, 1] = np.nan
    with pytest.raises(tensym.errors.DataError, match="c12 in row 2"):
        f.evaluate(bad)
