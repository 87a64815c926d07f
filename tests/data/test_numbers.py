"""Numbers entering the data layer: any magnitude, complex and other non-real input, NaN and inf (issue 11).

Each case is named by what a user did.  The magnitude tests compare each result with the same
computation on the same tensor at magnitude 1 (the checks are linear or scale-free: constants scale with
the data, residual fractions, verdicts and frames do not), and with the constants the tensor was built from.
"""

import math

import numpy as np
import pytest
import sympy as sp
from hypothesis import given, settings, strategies as st

import tensym
from tensym.testing import cubic_voigt as _cubic, hexagonal_voigt as _hexagonal
from tensym.data.dataset import TensorData
from tensym.errors import DataError
from tensym.tensors.catalog import get_property


CUBIC = (166.0, 64.0, 80.0)          # invented constants (GPa-like)
HEX = (200.0, 80.0, 60.0, 180.0, 40.0)  # invented


def _with_c15(c, v):
    c = c.copy()
    c[0, 4] = c[4, 0] = v
    return c


# --- values of any magnitude ----------------------------------------------------------------------------
@settings(max_examples=80, deadline=None, derandomize=True)
@given(exponent=st.floats(-300.0, 300.0), c15=st.sampled_from([0.0, 0.4, 3.0]))
def test_user_checks_a_cubic_stiffness_in_units_of_any_magnitude(exponent, c15):
    # before issue 11: at 1e170 the residual was nan and the verdict 'inconsistent'; at 1e306 LinAlgError
    s = 10.0**exponent
    base = tensym.check_tensor(_with_c15(_cubic(*CUBIC), c15), "elastic_stiffness", "m-3m")
    r = tensym.check_tensor(_with_c15(_cubic(*CUBIC), c15) * s, "elastic_stiffness", "m-3m")
    assert r.verdict == base.verdict
    assert r.residual_fraction == pytest.approx(base.residual_fraction, rel=1e-9, abs=1e-15)
    assert r.component_deviation == pytest.approx(base.component_deviation, rel=1e-9, abs=1e-15)
    for k, k0 in zip(r.constants, base.constants):
        assert k.value / s == pytest.approx(k0.value, rel=1e-12)
    if c15 == 0.0:
        assert [k.value / s for k in r.constants] == pytest.approx(list(CUBIC), rel=1e-12)
    assert r.max_deviation / s == pytest.approx(base.max_deviation, rel=1e-9, abs=1e-12)
    assert np.allclose(r.symmetrized / s, base.symmetrized, rtol=1e-12, atol=0)
    assert r.positive_definite
    assert r.eigenvalues / s == pytest.approx(base.eigenvalues, rel=1e-12)


@settings(max_examples=40, deadline=None, derandomize=True)
@given(exponent=st.floats(-150.0, 150.0))
def test_user_checks_a_stiffness_with_uncertainties_in_units_of_any_magnitude(exponent):
    # variances are stored: sigma**2 must stay inside float64, so the range is 1e-150 .. 1e150
    s = 10.0**exponent
    c = _with_c15(_cubic(*CUBIC), 0.3)
    sig = np.full((6, 6), 0.1)
    base = tensym.check_tensor(c, "elastic_stiffness", "m-3m", sigma=sig)
    r = tensym.check_tensor(c * s, "elastic_stiffness", "m-3m", sigma=sig * s)
    assert r.chi2 == pytest.approx(base.chi2, rel=1e-9)
    assert r.p_value == pytest.approx(base.p_value, rel=1e-9, abs=1e-300)
    assert r.verdict == base.verdict
    assert [k.sigma / s for k in r.constants] == pytest.approx([k.sigma for k in base.constants], rel=1e-9)


def test_user_checks_a_stack_whose_tensors_have_magnitudes_from_1e_minus_300_to_1e300():
    rng = np.random.default_rng(11)
    exps = np.concatenate([[-300.0, 300.0, 0.0], rng.uniform(-300, 300, 40)])
    scale = 10.0**exps
    base_c = np.stack([_with_c15(_cubic(*CUBIC), v) for v in np.tile([0.0, 0.4, 3.0], 15)[: len(exps)]])
    b = tensym.check_tensors(base_c * scale[:, None, None], "elastic_stiffness", "m-3m")
    b0 = tensym.check_tensors(base_c, "elastic_stiffness", "m-3m")
    assert b.verdicts.tolist() == b0.verdicts.tolist()
    assert np.allclose(b.residual_fraction, b0.residual_fraction, rtol=1e-9, atol=1e-15)
    assert np.allclose(b.constants / scale[:, None], b0.constants, rtol=1e-12, atol=0)
    assert np.allclose(b.max_deviation / scale, b0.max_deviation, rtol=1e-9, atol=1e-12)
    assert b.positive_definite.all()


def test_user_orients_a_rotated_tensor_in_units_of_any_magnitude():
    rng = np.random.default_rng(1100)
    r_true = tensym.rotation_from_euler(20.0, 35.0, -50.0)
    lab = tensym.rotate_values(_hexagonal(*HEX), r_true.T, "elastic_stiffness")
    for e in [-300.0, 300.0] + list(rng.uniform(-300, 300, 3)):
        o = tensym.orient(lab * 10.0**e, "elastic_stiffness", "6/mmm")
        assert o.residual_fraction < 1e-8, e
        assert o.misorientation_to(r_true) < 1e-5, e
        assert o.rotated["c33"] / 10.0**e == pytest.approx(HEX[3], rel=1e-8)


def test_user_identifies_the_symmetry_of_a_tensor_in_units_of_any_magnitude():
    # before issue 11: a cubic stiffness at 1e-300 was 'isotropic', at 1e170 'orthotropic', near 1e306 'triclinic'
    lab = tensym.rotate_values(_cubic(*CUBIC), tensym.rotation_from_euler(10.0, 50.0, 30.0), "elastic_stiffness")
    for e in (-300.0, -123.4, 170.0, 300.0):
        f = tensym.find_symmetry(lab * 10.0**e, "elastic_stiffness")
        assert f.best.name == "cubic", e
        assert f.best.residual_fraction < 1e-8


def test_user_checks_a_stiffness_at_the_edge_of_the_float_range():
    c = _cubic(*CUBIC) * 1e306       # c11 = 1.66e308, near the largest float64 (1.8e308)
    r = tensym.check_tensor(c, "elastic_stiffness", "m-3m")
    assert r.verdict == "consistent" and r.constant("c11").value == pytest.approx(1.66e308, rel=1e-12)
    # a rotation would take components past 1.8e308: a clear error, not LinAlgError or a nan residual
    with pytest.raises(DataError, match="beyond the float64 range"):
        tensym.find_symmetry(c, "elastic_stiffness")


def test_user_checks_subnormal_numbers():
    c = _cubic(*CUBIC) * 1e-310      # below the smallest normal float64 (2.2e-308)
    r = tensym.check_tensor(c, "elastic_stiffness", "m-3m")
    assert r.verdict == "consistent" and r.residual_fraction < 1e-6


# --- complex and other non-real numbers ------------------------------------------------------------------
C = _cubic(*CUBIC)
_COMPLEX_CALLS = {
    "check_tensor(c + 1j)": lambda: tensym.check_tensor(C + 1j, "elastic_stiffness", "m-3m"),
    "check_tensor(complex, imaginary part 0)": lambda: tensym.check_tensor(C.astype(complex), "elastic_stiffness",
                                                                           "m-3m"),
    "check_tensor(lists of Python complex)": lambda: tensym.check_tensor((C + 0.5j).tolist(), "elastic_stiffness",
                                                                         "m-3m"),
    "check_tensor(sympy I in an entry)": lambda: tensym.check_tensor(
        np.where(np.eye(6) > 0, sp.I, 1).astype(object), "elastic_stiffness", "m-3m"),
    "tensor_data(sigma complex)": lambda: tensym.tensor_data(C, "elastic_stiffness", sigma=np.ones((6, 6)) + 1j),
    "tensor_data(covariance complex)": lambda: tensym.tensor_data(C, "elastic_stiffness",
                                                                  covariance=np.eye(21) * (1 + 1j)),
    "check_tensors(stack + 1j)": lambda: tensym.check_tensors(np.stack([C, C]) + 1j, "elastic_stiffness", "m-3m"),
    "check_tensors(sigma complex)": lambda: tensym.check_tensors(np.stack([C]), "elastic_stiffness", "m-3m",
                                                                 sigma=np.ones((1, 6, 6)) * 1j),
    "orient(c + 1j)": lambda: tensym.orient(C + 1j, "elastic_stiffness", "m-3m"),
    "find_symmetry(c + 1j)": lambda: tensym.find_symmetry(C + 1j, "elastic_stiffness"),
    "rotate_values(c + 1j)": lambda: tensym.rotate_values(C + 1j, np.eye(3), "elastic_stiffness"),
    "invert_elastic(c + 1j)": lambda: tensym.invert_elastic(C + 1j),
    "rotation_from_axis_angle(complex axis)": lambda: tensym.rotation_from_axis_angle([1j, 0, 1], 30.0),
    "orient(..., rotation complex) via misorientation": lambda: tensym.misorientation(np.eye(3) * (1 + 0j) + 1j,
                                                                                      np.eye(3)),
    "TensorData(complex components)": lambda: TensorData(get_property("elastic_stiffness"), np.ones(21) + 1j),
}


@pytest.mark.parametrize("call", list(_COMPLEX_CALLS), ids=list(_COMPLEX_CALLS))
def test_user_passes_complex_numbers_and_is_refused(call):
    # before issue 11 the imaginary part was dropped with a ComplexWarning and the check went on
    with pytest.raises(DataError, match="complex"):
        _COMPLEX_CALLS[call]()


@pytest.mark.parametrize("values", [[1 + 1j, 2.0, 3.0], [np.complex128(1 + 1j), 2.0, 3.0], [sp.I, 2.0, 3.0]],
                         ids=["python complex", "numpy complex128", "sympy I"])
def test_user_evaluates_a_tensor_form_with_complex_constants(values):
    # before: a bare TypeError, or the imaginary part silently dropped (numpy complex128)
    with pytest.raises(DataError, match=r"value of c11 must be a real number, got complex .*imaginary part"):
        tensym.tensor_form("elastic_stiffness", "m-3m").evaluate(values)


@pytest.mark.parametrize("values, match", [
    ([True, 2.0, 3.0], "got a boolean"),
    (["166", 2.0, 3.0], "got str"),
    ([sp.Symbol("t"), 2.0, 3.0], "got Symbol"),
])
def test_user_evaluates_a_tensor_form_with_values_that_are_not_real_numbers(values, match):
    with pytest.raises(DataError, match=match):
        tensym.tensor_form("elastic_stiffness", "m-3m").evaluate(values)


def test_user_evaluates_a_tensor_form_with_sympy_and_numpy_reals():
    f = tensym.tensor_form("elastic_stiffness", "m-3m")
    v = f.evaluate([sp.Rational(1, 2), np.float32(2.0), sp.sqrt(2)])
    assert v[0, 0] == 0.5 and v[0, 1] == 2.0 and v[3, 3] == pytest.approx(math.sqrt(2), abs=1e-15)


_NOT_NUMBERS = {
    "booleans": (C > 100, "booleans"),
    "strings": (C.astype(str), "strings"),
    "a mixed list with a string": ([[1.0] * 6] * 5 + [[1.0] * 5 + ["x"]], "strings"),
    "a sympy symbol in an entry": (np.where(np.eye(6) > 0, sp.Symbol("c"), 0).astype(object), "symbolic"),
    "None in an entry": (np.where(np.eye(6) > 0, None, 1.0).astype(object), "NoneType"),
    "an integer past the float range": ([[10**400] + [1] * 5] + [[1] * 6] * 5, "float64 range"),
    "ragged lists": ([[1.0, 2.0], [3.0]], "rectangular"),
    "a string": ("c11 = 166", "got a string"),
    "datetimes": (np.full((6, 6), np.datetime64("2024-01-01")), "real numbers"),
    "inf": (np.where(np.eye(6) > 0, np.inf, 1.0), "contains inf"),
    "-inf": (np.where(np.eye(6) > 0, -np.inf, 1.0), "contains inf"),
    "every entry NaN": (np.full((6, 6), np.nan), "no component"),
}


@pytest.mark.parametrize("case", list(_NOT_NUMBERS), ids=list(_NOT_NUMBERS))
def test_user_checks_values_that_are_not_real_numbers(case):
    values, match = _NOT_NUMBERS[case]
    with pytest.raises(DataError, match=match):
        tensym.check_tensor(values, "elastic_stiffness", "m-3m")


def test_user_checks_long_double_values_past_the_float64_range():
    big = np.longdouble(10) ** 400
    if not np.isfinite(big):  # pragma: no cover - platforms whose long double is float64
        pytest.skip("long double is float64 here")
    with pytest.raises(DataError, match="beyond the float64 range"):
        tensym.check_tensor(C.astype(np.longdouble) * big, "elastic_stiffness", "m-3m")


@pytest.mark.parametrize("factor, match", [(1e200, "outside the float64 range"), (1e-200, "outside the float64")])
def test_user_gives_uncertainties_whose_squares_leave_the_float_range(factor, match):
    with pytest.raises(DataError, match=match):
        tensym.tensor_data(C * factor, "elastic_stiffness", sigma=np.full((6, 6), factor))


def test_user_gives_an_infinite_uncertainty():
    with pytest.raises(DataError, match="sigma contains inf"):
        tensym.tensor_data(C, "elastic_stiffness", sigma=np.where(np.eye(6) > 0, np.inf, 1.0))


@pytest.mark.parametrize("make, match", [
    (lambda p: TensorData("elastic_stiffness", np.ones(21)), "needs a Property"),
    (lambda p: TensorData(p, np.ones(20)), r"shape \(21,\)"),
    (lambda p: TensorData(p, np.full(21, np.inf)), "contains inf"),
    (lambda p: TensorData(p, np.full(21, np.nan)), "all NaN"),
    (lambda p: TensorData(p, np.ones(21), np.eye(3)), r"covariance must be \(21, 21\)"),
    (lambda p: TensorData(p, np.ones(21), units=3), "units must be a string"),
])
def test_user_builds_tensor_data_directly_with_bad_fields(make, match):
    with pytest.raises(DataError, match=match):
        make(get_property("elastic_stiffness"))


def test_user_builds_tensor_data_directly_from_a_writable_list():
    comps = [1.0] * 21
    d = TensorData(get_property("elastic_stiffness"), comps)
    comps[0] = 99.0
    assert d.components[0] == 1.0 and not d.components.flags.writeable


def test_user_rotates_values_with_nan():
    with pytest.raises(DataError, match="a rotation mixes the components"):
        tensym.rotate_values(np.where(np.eye(6) > 0, np.nan, 1.0), np.eye(3), "elastic_stiffness")


_OBJECT_ENTRIES = {
    "a Python complex among sympy numbers": (1 + 2j, "complex number"),
    "a boolean among sympy numbers": (True, "a boolean"),
    "a string among sympy numbers": ("2.5", "the string"),
    "a dict": ({"c11": 1}, "a dict"),
    "a sympy integer past the float range": (sp.Integer(10) ** 400, "beyond the float64 range"),
    "a sympy number that is complex": (1 + sp.I, "complex number"),
}


@pytest.mark.parametrize("case", list(_OBJECT_ENTRIES), ids=list(_OBJECT_ENTRIES))
def test_user_checks_an_object_array_with_one_bad_entry(case):
    bad, match = _OBJECT_ENTRIES[case]
    arr = np.empty((6, 6), dtype=object)
    arr[:] = sp.Integer(0)
    arr[0, 0] = bad
    with pytest.raises(DataError, match=r"values entry \(1, 1\) .*" + match):
        tensym.check_tensor(arr, "elastic_stiffness", "m-3m")


def test_user_evaluates_a_tensor_form_with_an_object_that_is_not_a_number():
    with pytest.raises(DataError, match="value of c11 must be a real number, got dict"):
        tensym.tensor_form("elastic_stiffness", "m-3m").evaluate([{}, 1.0, 1.0])


def test_user_builds_tensor_data_with_a_source_that_is_not_text():
    with pytest.raises(DataError, match="source must be a string"):
        TensorData(get_property("elastic_stiffness"), np.ones(21), source=3)


def test_user_gives_infinite_euler_angles():
    with pytest.raises(DataError, match="Euler angles must be finite"):
        tensym.rotation_from_euler(np.inf, 0.0, 0.0)


def test_user_inverts_a_stiffness_with_inf():
    with pytest.raises(DataError, match="elastic_stiffness contains inf"):
        tensym.invert_elastic(np.where(np.eye(6) > 0, np.inf, 0.0))


def test_user_checks_a_stack_with_a_tensor_that_gives_nothing():
    stack = np.stack([C, np.full((6, 6), np.nan)])
    with pytest.raises(DataError, match="tensor 1 of the stack gives no component"):
        tensym.check_tensors(stack, "elastic_stiffness", "m-3m")


def test_user_checks_a_stack_with_an_unknown_uncertainty_of_a_given_component():
    s = np.ones((2, 6, 6))
    s[1, 0, 0] = np.nan
    with pytest.raises(DataError, match="sigma is NaN \\(unknown\\) for c11 of tensor 1 of the stack"):
        tensym.check_tensors(np.stack([C, C]), "elastic_stiffness", "m-3m", sigma=s)


def test_user_checks_a_stack_with_uncertainties_far_below_the_values():
    with pytest.raises(DataError, match="uncertainties far below the values"):
        tensym.check_tensors(C[None] * 1e150, "elastic_stiffness", "m-3m", sigma=np.full((1, 6, 6), 1e-160))
