"""Partial data: components that are not given are unknown (NaN), never zero (issue 11).

The oracle of the fit is a weighted least-squares solve written here from the definition (numpy lstsq on
the rows of the given components, weights = number of index tuples x Voigt factor^2 for the Frobenius
norm, 1/sigma^2 with uncertainties), with the form's matrix A from tensym.tensor_form.
"""

import json

import numpy as np
import pytest
from hypothesis import given, settings, strategies as st

import tensym
from tensym.testing import hexagonal_voigt as _hexagonal
from tensym.data.model import layout, numeric_form
from tensym.errors import DataError
from tensym.groups import as_group

NAN = np.nan


HEX = (200.0, 80.0, 60.0, 180.0, 40.0)  # invented


def _only(c, labels):
    """The Voigt matrix with every entry NaN except those of the listed components (both twins)."""
    out = np.full((6, 6), NAN)
    for lab in labels:
        i, j = int(lab[1]) - 1, int(lab[2]) - 1
        out[i, j] = out[j, i] = c[i, j]
    return out


def test_user_checks_a_hexagonal_crystal_from_its_five_handbook_constants_only():
    # before issue 11 the 16 components not listed were taken as 0: c22 = 0 against c11 = 200, 'inconsistent'
    c = _only(_hexagonal(*HEX), ["c11", "c12", "c13", "c33", "c44"])
    r = tensym.check_tensor(c, "elastic_stiffness", "6/mmm", units="GPa")
    assert r.verdict == "consistent" and r.n_given == 5 and len(r.not_given) == 16
    assert [k.value for k in r.constants] == pytest.approx(list(HEX), abs=1e-12)
    assert r.symmetrized[5, 5] == pytest.approx((HEX[0] - HEX[1]) / 2, abs=1e-12)   # c66 predicted
    assert np.isnan(r.residual[5, 5]) and r.residual[0, 0] == pytest.approx(0.0, abs=1e-12)
    assert r.dof == 0 and r.forbidden == () and r.irreps == ()
    assert "components given: 5 of 21" in r.text()
    assert "unknown, not zero" in r.text()
    rec = json.loads(json.dumps(r.record(), allow_nan=False))        # strict JSON: unknowns as "nan" strings
    assert rec["n_given"] == 5 and rec["residual"][5][5] == "nan" and rec["misorientation_deg"] == "nan"


def test_user_checks_partial_data_with_a_forbidden_component_given():
    c = _only(_hexagonal(*HEX), ["c11", "c12", "c13", "c33", "c44", "c15"])
    c[0, 4] = c[4, 0] = 6.0          # a forbidden component, given: 3 % of c11
    r = tensym.check_tensor(c, "elastic_stiffness", "6/mmm")
    assert r.verdict == "inconsistent"
    assert [(f.label, f.value) for f in r.forbidden] == [("c15", 6.0)]   # only the given forbidden components
    assert "(c15)" in r.reasons[1]


def test_user_checks_partial_data_with_a_relation_that_can_be_tested():
    # c66 given as well as c11 and c12: the relation c66 = (c11 - c12)/2 is checked on the given values
    c = _only(_hexagonal(*HEX), ["c11", "c12", "c13", "c33", "c44", "c66"])
    c[5, 5] = 70.0                    # (200 - 80)/2 = 60
    r = tensym.check_tensor(c, "elastic_stiffness", "6/mmm")
    rel = {t.label: t for t in r.relations}
    assert set(rel) == {"c66"} and rel["c66"].discrepancy == pytest.approx(10.0, abs=1e-12)
    assert r.verdict == "inconsistent" and r.dof == 1


def test_user_gives_too_few_components_to_fix_the_constants():
    c = _only(_hexagonal(*HEX), ["c11", "c12", "c33"])
    with pytest.raises(DataError, match=r"\(3 of the 21 of elastic_stiffness\) do not determine the constants of "
                                        r"6/mmm: c13, c44 are not fixed .* write 0 explicitly"):
        tensym.check_tensor(c, "elastic_stiffness", "6/mmm")


def test_user_marks_a_component_as_zero_by_writing_0():
    c = _only(_hexagonal(*HEX), ["c11", "c12", "c33", "c13"])
    c[3, 3] = 0.0                    # c44 = 0 written explicitly: now it is given
    r = tensym.check_tensor(c, "elastic_stiffness", "6/mmm")
    assert r.n_given == 5 and r.constant("c44").value == 0.0


def test_user_gives_c12_but_not_c21():
    # twins tied by index symmetry count as one given value if any member is given
    c = _hexagonal(*HEX)
    c[1, 0] = NAN
    d = tensym.tensor_data(c, "elastic_stiffness")
    assert d.is_complete and d["c12"] == HEX[1]


def test_user_gives_c12_and_c21_with_different_values_and_some_entries_unknown():
    # conflicting twins are an error (not averaged), also in partial data
    c = _only(_hexagonal(*HEX), ["c11", "c12", "c13", "c33", "c44"])
    c[1, 0] = 81.0
    with pytest.raises(DataError, match=r"c12 = 80 at Voigt entry \(1, 2\) but 81 at \(2, 1\)"):
        tensym.check_tensor(c, "elastic_stiffness", "6/mmm")


def test_user_gives_a_full_tensor_with_some_index_tuples_unknown():
    t = tensym.from_voigt(_hexagonal(*HEX), "elastic_stiffness")
    t[0, 1, 0, 1] = NAN               # c66 is still given by c_1210, c_2101, ...
    t[2, 2, 2, 2] = NAN               # c33 has no other tuple: unknown
    d = tensym.tensor_data(t, "elastic_stiffness")
    assert d.n_given == 20 and np.isnan(d["c33"]) and d["c66"] == pytest.approx(60.0)


def _oracle(x, known, prop, group, sigma=None):
    lay = layout(prop)
    nf = numeric_form(prop, as_group(group))
    a_mat = nf.A[known]
    w = lay.weight[known] if sigma is None else 1.0 / sigma[known] ** 2
    sw = np.sqrt(w)
    a, *_ = np.linalg.lstsq(a_mat * sw[:, None], x[known] * sw, rcond=None)
    return a


@settings(max_examples=60, deadline=None, derandomize=True)
@given(mask_seed=st.integers(0, 2**31 - 1), with_sigma=st.booleans())
def test_user_checks_random_partial_data_and_gets_the_least_squares_fit_of_the_given_components(mask_seed,
                                                                                                 with_sigma):
    rng = np.random.default_rng(mask_seed)
    prop = "elastic_stiffness"
    lay = layout(prop)
    x = rng.normal(size=lay.n) * 10.0
    known = rng.random(lay.n) < 0.7
    nf = numeric_form(prop, as_group("4/mmm"))
    if np.linalg.matrix_rank(nf.A[known]) < nf.k:
        with pytest.raises(DataError, match="do not determine the constants"):
            tensym.check_tensor(np.where(known, x, NAN), prop, "4/mmm", layout="components")
        return
    sigma = rng.uniform(0.5, 2.0, lay.n) if with_sigma else None
    r = tensym.check_tensor(np.where(known, x, NAN), prop, "4/mmm", layout="components",
                            sigma=None if sigma is None else np.where(known, sigma, NAN))
    a = _oracle(x, known, prop, "4/mmm", sigma)
    assert [k.value for k in r.constants] == pytest.approx(a.tolist(), rel=1e-9, abs=1e-9)
    assert r.n_given == int(known.sum()) and r.dof == int(known.sum()) - nf.k
    b = tensym.check_tensors(np.where(known, x, NAN)[None], prop, "4/mmm", layout="components",
                             sigma=None if sigma is None else np.where(known, sigma, NAN)[None])
    assert np.allclose(b.constants[0], a, rtol=1e-9, atol=1e-9)
    assert b.verdicts[0] == r.verdict and b.n_given[0] == r.n_given


def test_user_checks_a_stack_where_some_tensors_lack_components():
    full = _hexagonal(*HEX)
    part = _only(full, ["c11", "c12", "c13", "c33", "c44"])
    b = tensym.check_tensors(np.stack([full, part, full]), "elastic_stiffness", "6/mmm")
    assert b.n_given.tolist() == [21, 5, 21] and b.verdicts.tolist() == ["consistent"] * 3
    assert np.allclose(b.constants, np.array(HEX)[None], atol=1e-12)
    assert np.isnan(b.irrep_fractions[1]).all() and not np.isnan(b.irrep_fractions[0]).any()
    assert "1 tensor(s) with components not given" in str(b)
    bad = _only(full, ["c11", "c12"])
    with pytest.raises(DataError, match=r"of tensor 1 of the stack .* do not determine"):
        tensym.check_tensors(np.stack([full, bad]), "elastic_stiffness", "6/mmm")


@pytest.mark.parametrize("call, match", [
    (lambda d: tensym.orient(d, group="6/mmm"), "orient needs every component"),
    (lambda d: tensym.find_symmetry(d), "find_symmetry needs every component"),
    (lambda d: d.rotated(np.eye(3)), "a rotation .* needs every component"),
    (lambda d: tensym.invert_data(d), "the inverse needs every component"),
    (lambda d: tensym.invert_elastic(d.voigt), "contains NaN"),
])
def test_user_orients_or_inverts_partial_data(call, match):
    d = tensym.tensor_data(_only(_hexagonal(*HEX), ["c11", "c12", "c13", "c33", "c44"]), "elastic_stiffness")
    with pytest.raises(DataError, match=match):
        call(d)


def test_user_gives_uncertainties_for_only_some_given_components():
    c = _hexagonal(*HEX)
    s = np.ones((6, 6))
    s[0, 0] = NAN
    with pytest.raises(DataError, match=r"sigma is NaN \(unknown\) for c11, whose value is given"):
        tensym.check_tensor(c, "elastic_stiffness", "6/mmm", sigma=s)


def test_user_reads_a_long_form_file_listing_only_the_measured_components(tmp_path):
    # the file lists the five handbook constants and no zeros (the reader gives NaN for the rest)
    f = tmp_path / "hex.csv"
    f.write_text("# property: elastic_stiffness\n# units: GPa\ncomponent,value\n"
                 "c11,200\nc12,80\nc13,60\nc33,180\nc44,40\n")
    d = tensym.read_tensor(f)
    assert d.n_given == 5
    r = tensym.check_tensor(d, group="6/mmm")
    assert r.verdict == "consistent" and r.constant("c33").value == 180.0
