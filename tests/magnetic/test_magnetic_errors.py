"""Bad magnetic input: symbols that name no magnetic group, contradictory time-reversal marks, options."""

import pytest

from tensym.errors import (
    GroupClosureError,
    InvalidGroupError,
    InvalidOptionError,
    RepresentationError,
    TensymError,
    UnknownGroupError,
)
from tensym.groups.magnetic import (
    magnetic_class,
    magnetic_group_from_generators,
    magnetic_point_group,
    magnetic_point_groups,
)
from tensym.groups.operations import Operation
from tensym.reps.magnetic import corepresentations, magnetic_decompose

T = Operation.from_triplet


def test_contradictory_primes_list_the_valid_primings():
    # 2x' 2y' = 2z, so 2z cannot be primed as well (common practice)
    with pytest.raises(UnknownGroupError, match=r"contradict.*valid primings of 222: 2'22', 2'2'2, 22'2'"):
        magnetic_point_group("2'2'2'")
    # 4' 2x = 2[110]: with 4' primed the [110] 2-folds must be primed
    with pytest.raises(UnknownGroupError, match=r"valid primings of 422: 422, 4'22', 4'2'2, 42'2'"):
        magnetic_point_group("4'22")
    with pytest.raises(UnknownGroupError, match="contradict"):
        magnetic_point_group("4/m'2/m2/m")  # 2x mx = -1 unprimed, 2z mz = -1 primed


@pytest.mark.parametrize("symbol, words", [
    ("4/m'm'm''", "two primes"),
    ("m'm'm1'", r"grey group \(mmm1'\) carries no other prime"),
    ("121'", "position 1 cannot be primed"),
    ("q'", "not read as a primed"),
    ("5'", "not a point-group symbol"),
    ("D2h(C4)", "index-2 subgroup"),
    ("", "empty"),
])
def test_symbols_that_name_no_magnetic_group(symbol, words):
    with pytest.raises(UnknownGroupError, match=words) as info:
        magnetic_point_group(symbol)
    assert "nearest valid" in str(info.value) or "valid primings" in str(info.value)
    assert isinstance(info.value, KeyError) and isinstance(info.value, TensymError)


def test_nearest_symbols_are_suggested():
    with pytest.raises(UnknownGroupError, match=r"nearest valid symbols: 4/m'm'm'"):
        magnetic_point_group("4/m'm'm''")


def test_non_string_symbol():
    with pytest.raises(InvalidGroupError, match="must be a string"):
        magnetic_point_group(42)


def test_contradictory_generator_marks():
    # 2z' = (4z')^2 is unprimed: the marks give 2z both ways
    with pytest.raises(GroupClosureError, match=r"contradict.*unprimed as g1 @ g1 and primed as g2.*\(g1', g2\)"):
        magnetic_group_from_generators([T("-y,x,z,-1"), T("-x,-y,z,-1")])
    with pytest.raises(GroupClosureError, match="Add 'x,y,z,-1'"):
        magnetic_group_from_generators([T("-x,-y,z,-1"), T("-x,y,-z,-1"), T("x,-y,-z,-1")])


def test_options_and_group_kinds():
    with pytest.raises(InvalidOptionError, match="kind='gray' is not one of"):
        magnetic_point_groups(kind="gray")
    with pytest.raises(RepresentationError, match="no primed"):
        corepresentations("mmm")
    with pytest.raises(RepresentationError, match="no primed"):
        magnetic_decompose("magnetization", "4/m")
    with pytest.raises(InvalidGroupError, match="continuous"):
        magnetic_class("SO(3)")


def test_decompose_options_and_spaces():
    from tensym.errors import InvalidArgumentError

    with pytest.raises(InvalidArgumentError, match="real must be True or False"):
        magnetic_decompose("magnetization", "4'", real="yes")
    with pytest.raises(InvalidArgumentError, match="expected a representation space"):
        magnetic_decompose(3.5, "4'")


def test_magnetic_class_of_unknown_or_non_crystallographic_groups():
    import tensym

    with pytest.raises(UnknownGroupError, match="nearest valid symbols"):
        magnetic_class("qq")
    # the icosahedral group Ih with its inversion primed: a magnetic group outside the 122
    ih = tensym.point_group("-5-3m")
    primed = tensym.group_from_generators(
        [g if g.det == 1 else Operation(g.matrix, True) for g in ih.generators])
    assert primed.schoenflies == "Ih(I)" and primed.symbol == ""
    with pytest.raises(InvalidGroupError, match="not crystallographic"):
        magnetic_class(primed)


def test_typographic_primes_through_point_group():
    import tensym

    assert tensym.point_group("m\u2032m\u2032m") is tensym.point_group("m'm'm")
