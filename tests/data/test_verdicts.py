"""Verdicts: all-zero data, the per-component criterion, batch summaries (issue 11)."""

import numpy as np
import pytest

import tensym
from tensym.testing import cubic_voigt as _cubic
from tensym.errors import DataError


C = _cubic(200.0, 100.0, 80.0)   # invented, c11 = 200 GPa


# --- an all-zero tensor: nothing to check ------------------------------------------------------------------
@pytest.mark.parametrize("what, group", [("elastic_stiffness", "m-3m"), ("piezoelectric_d", "6mm"),
                                         ("dielectric_permittivity", "1"), ("pyroelectric", "mmm")])
def test_user_checks_an_all_zero_tensor(what, group):
    # before issue 11: 'consistent' with every group
    shape = tensym.tensor_data(np.zeros(len(tensym.component_labels(what))), what, layout="components").voigt.shape
    r = tensym.check_tensor(np.zeros(shape), what, group)
    assert r.verdict == "empty" and not r.passes
    assert "nothing to check" in r.reasons[0] and "nothing to check" in r.text()
    assert r.record()["verdict"] == "empty"


def test_user_checks_partial_data_whose_given_components_are_all_zero():
    c = np.full((6, 6), np.nan)
    c[0, 4] = c[4, 0] = 0.0
    assert tensym.check_tensor(c, "elastic_stiffness", "m-3m").verdict == "empty"


def test_user_checks_a_stack_with_an_all_zero_tensor():
    b = tensym.check_tensors(np.stack([C, np.zeros((6, 6)), C]), "elastic_stiffness", "m-3m")
    assert b.verdicts.tolist() == ["consistent", "empty", "consistent"]
    assert b.passes.tolist() == [True, False, True]
    assert b.counts() == {"consistent": 2, "inconsistent": 0, "empty": 1}
    assert "empty (all zero, nothing to check): 1" in str(b)
    assert b.report(1).verdict == "empty"


@pytest.mark.parametrize("call", [
    lambda z: tensym.orient(z, "elastic_stiffness", "m-3m"),
    lambda z: tensym.find_symmetry(z, "elastic_stiffness"),
], ids=["orient", "find_symmetry"])
def test_user_orients_or_identifies_an_all_zero_tensor(call):
    # before issue 11 find_symmetry called it 'isotropic'
    with pytest.raises(DataError, match="the data are all zero: an all-zero tensor fits every group"):
        call(np.zeros((6, 6)))


# --- a forbidden component of 1 % of c11 -----------------------------------------------------------------
def test_user_checks_a_cubic_stiffness_with_a_forbidden_c15_of_one_percent_of_c11():
    # before issue 11: the residual fraction (~0.7 % of the Frobenius norm) was below tol = 0.01: 'consistent'
    c = C.copy()
    c[0, 4] = c[4, 0] = 2.0
    r = tensym.check_tensor(c, "elastic_stiffness", "m-3m", units="GPa")
    assert r.residual_fraction < 0.01
    assert r.verdict == "inconsistent"
    assert r.component_deviation == pytest.approx(2.0 / 200.0, rel=1e-12)
    assert "largest component deviation 2 GPa (c15) is 0.01 of the largest allowed magnitude 200 GPa (c11), > " \
           "component_tol 0.005" in r.reasons[1]
    assert r.component_tol == 0.005


def test_user_checks_a_stiffness_with_a_small_forbidden_component():
    c = C.copy()
    c[0, 4] = c[4, 0] = 0.2          # 0.1 % of c11: within the default component_tol
    r = tensym.check_tensor(c, "elastic_stiffness", "m-3m")
    assert r.verdict == "consistent"
    assert not tensym.check_tensor(c, "elastic_stiffness", "m-3m", component_tol=5e-4).passes


def test_user_checks_a_tied_component_that_misses_its_relation():
    c = C.copy()
    c[2, 2] = 206.0                  # c33 should equal c11 in m-3m: 3 % off, Frobenius fraction 1 %
    r = tensym.check_tensor(c, "elastic_stiffness", "m-3m")
    assert r.verdict == "inconsistent" and "(c33)" in r.reasons[1]


def test_user_loosens_tol_and_the_component_criterion_follows():
    c = C.copy()
    c[0, 4] = c[4, 0] = 2.0
    assert tensym.check_tensor(c, "elastic_stiffness", "m-3m", tol=0.05).passes   # component_tol = 0.025


def test_user_checks_against_a_group_that_allows_nothing():
    d = np.zeros((3, 6))
    d[2, 2] = 1.0
    r = tensym.check_tensor(d, "piezoelectric_d", "m-3m")
    assert r.component_deviation == np.inf and r.verdict == "inconsistent"


@pytest.mark.parametrize("kw, match", [
    ({"component_tol": -1.0}, "component_tol must be a finite number >= 0"),
    ({"component_tol": np.nan}, "component_tol must be a finite number >= 0"),
    ({"component_tol": True}, "component_tol must be a finite number >= 0"),
    ({"component_tol": "0.01"}, "component_tol must be a finite number >= 0"),
    ({"component_tol": 0.01, "tol_kind": "absolute"}, "component_tol belongs to tol_kind='relative'"),
])
def test_user_passes_a_bad_component_tol(kw, match):
    with pytest.raises(DataError, match=match):
        tensym.check_tensor(C, "elastic_stiffness", "m-3m", **kw)
    with pytest.raises(DataError, match=match):
        tensym.check_tensors(C[None], "elastic_stiffness", "m-3m", **kw)


def test_batch_and_single_checks_agree_on_the_per_component_criterion():
    rng = np.random.default_rng(5)
    stack = np.repeat(C[None], 50, axis=0)
    v = rng.uniform(0.0, 3.0, 50)
    stack[:, 0, 4] = stack[:, 4, 0] = v
    b = tensym.check_tensors(stack, "elastic_stiffness", "m-3m")
    for i in range(0, 50, 7):
        r = tensym.check_tensor(stack[i], "elastic_stiffness", "m-3m")
        assert r.verdict == b.verdicts[i]
        assert r.component_deviation == pytest.approx(b.component_deviation[i], rel=1e-12)
    assert (b.passes == (v / 200.0 <= 0.005)).all()


# --- batch summaries ------------------------------------------------------------------------------------------
def test_user_prints_a_batch_of_twenty_thousand_tensors():
    # before issue 11: str(BatchCheck) printed 20,000 rows
    rng = np.random.default_rng(20000)
    stack = np.repeat(C[None], 20000, axis=0) + rng.normal(scale=0.05, size=(20000, 6, 6))
    stack = 0.5 * (stack + np.swapaxes(stack, 1, 2))
    stack[123, 0, 5] = stack[123, 5, 0] = 30.0
    b = tensym.check_tensors(stack, "elastic_stiffness", "m-3m")
    text = str(b)
    assert len(text.splitlines()) < 20
    assert "20000 tensors" in text and "#123: inconsistent" in text
    assert f"consistent: {b.counts()['consistent']}" in text
    assert b.worst(1).tolist() == [123]
    assert "full table: .table()" in text


def test_user_asks_for_the_full_table_of_a_batch():
    b = tensym.check_tensors(np.stack([C] * 30), "elastic_stiffness", "m-3m")
    assert len(b.table().splitlines()) > 30
    with pytest.raises(DataError, match="count must be an integer >= 0"):
        b.worst(-1)
