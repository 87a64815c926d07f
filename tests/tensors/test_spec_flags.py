"""Issue 11: flags of TensorSpec are real booleans, never truthy strings or numbers.

Each case is named by what a user did.  ``bool("no")`` is True in Python, so a
spec built with ``axial="no"`` used to be an axial tensor; the form of an
axial vector in m-3m differs from a polar one (a polar vector vanishes in any
centrosymmetric class, an axial one is unchanged by the inversion: Nye 1957, ch. I and the table of
axial tensors; from memory), which is the check used below with the class -1.
"""

import numpy as np
import pytest

import tensym
from tensym.errors import InvalidArgumentError, InvalidSpecError, TensymError
from tensym.tensors.spec import TensorSpec


@pytest.mark.parametrize("value", ["no", "False", "false", "0", "", "yes", "True"])
def test_user_writes_axial_as_a_string(value):
    with pytest.raises(InvalidArgumentError, match=r"axial must be True or False .*got str"):
        TensorSpec(2, ["-ji"], axial=value)


@pytest.mark.parametrize("value", [0, 1, 0.0, None, [], np.int64(0), 1j])
def test_user_writes_axial_as_a_number_or_none(value):
    with pytest.raises(InvalidArgumentError, match="axial must be True or False"):
        TensorSpec(1, axial=value)


@pytest.mark.parametrize("value", ["no", 0, None, "1"])
def test_user_writes_time_odd_as_a_non_boolean(value):
    with pytest.raises(InvalidArgumentError, match="time_odd must be True or False"):
        TensorSpec(1, axial=True, time_odd=value)


def test_flag_errors_are_tensym_type_errors():
    with pytest.raises(TypeError):
        TensorSpec(1, axial="no")
    with pytest.raises(TensymError):
        TensorSpec(1, time_odd="no")


def test_user_passes_a_numpy_bool():
    # numpy.bool_ is a real boolean (e.g. from a mask or a table column)
    s = TensorSpec(1, axial=np.bool_(True), time_odd=np.bool_(False))
    assert s.axial is True and s.time_odd is False
    assert s == TensorSpec(1, axial=True)
    assert type(s.axial) is bool


def test_axial_false_gives_the_polar_form():
    # the inversion sends a polar vector to minus itself and leaves an axial one unchanged
    # (common practice), so in -1 a polar vector vanishes and an axial one keeps 3 components
    polar = tensym.tensor_form(TensorSpec(1, axial=False), "-1")
    axial = tensym.tensor_form(TensorSpec(1, axial=True), "-1")
    assert polar.n_independent == 0 and axial.n_independent == 3


def test_long_flag_value_is_cut_in_the_message():
    with pytest.raises(InvalidArgumentError) as info:
        TensorSpec(1, axial="x" * 10_000)
    assert len(str(info.value)) < 200


@pytest.mark.parametrize("syms, match", [
    (None, "symmetries must be a list or tuple"),
    (5, "symmetries must be a list or tuple"),
    ([12], "each symmetry must be a string"),
    ([("ji",)], "each symmetry must be a string"),
    ("ji", "not a bare string"),
])
def test_user_passes_symmetries_of_the_wrong_kind(syms, match):
    with pytest.raises(InvalidSpecError, match=match):
        TensorSpec(2, syms)
