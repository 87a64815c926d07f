"""Space-group symbols and numbers read as point groups, checked against spglib's database.

spglib (a test extra) gives, for each of its 530 Hall numbers, the space-group number, the
short and full international symbols, the point-group symbol and the rotation parts of the
operations in the lattice basis; converted to Cartesian axes (R_cart = A R A^-1, A's columns
the lattice vectors) they are an outside check of the setting tensym claims.
"""

import os

import numpy as np
import pytest
import sympy as sp

import tensym
from tensym.errors import InvalidGroupError, UnknownGroupError
from tensym.groups import as_group, point_group
from tensym.groups.spacegroups import space_group_point_group, space_group_symbol, space_group_symbols

os.environ.setdefault("SPGLIB_OLD_ERROR_HANDLING", "0")
spglib = pytest.importorskip("spglib")

HALLS = range(1, 531)
_HEX = np.array([[1.0, -0.5, 0.0], [0.0, np.sqrt(3) / 2, 0.0], [0.0, 0.0, 1.0]])
# rhombohedral (obverse) lattice vectors in the hexagonal axes: a_r = (2a + b + c)/3,
# b_r = (-a + b + c)/3, c_r = (-a - 2b + c)/3 (ITA Vol. A, Table 5.1.3.1; from memory)
_RHOMB = _HEX @ np.array([[2, -1, -1], [1, 1, -2], [1, 1, 1]], dtype=float) / 3


def _cartesian_keys(hall):
    """Keys (rounded to 1e-8, as tensym's) of the Cartesian rotation parts of a Hall setting."""
    t = spglib.get_spacegroup_type(hall)
    rots = spglib.get_symmetry_from_database(hall)["rotations"]
    if t.choice == "R":
        a = _RHOMB
    elif 143 <= t.number <= 194:
        a = _HEX
    else:
        a = np.eye(3)  # a, b, c along x, y, z; a monoclinic angle does not change the point operations
    ai = np.linalg.inv(a)
    return {tuple(int(v) for v in np.rint((a @ r @ ai).ravel() * 1e8)) + (0,) for r in rots}


def _keys(group):
    return set(group.operation_keys())


def _class(pointgroup_international):
    # spglib writes the class symbols as ITA does; tensym's class symbol is the same text
    return pointgroup_international


@pytest.mark.parametrize("hall", HALLS)
def test_spglib_symbols_give_the_class_and_the_setting(hall):
    t = spglib.get_spacegroup_type(hall)
    cart = _cartesian_keys(hall)
    full = as_group(t.international_full)
    assert full.symbol == _class(t.pointgroup_international)
    assert _keys(full) == cart, (t.international_full, full.setting_symbol)  # full symbols fix the setting
    assert full.names.space_group.startswith(" ".join(t.international_full.split()) + f" (no. {t.number}")
    short = as_group(t.international_short)
    assert short.symbol == _class(t.pointgroup_international)
    if not 3 <= t.number <= 15:  # a short monoclinic symbol does not say which axis is unique
        assert _keys(short) == cart, (t.international_short, short.setting_symbol)
    assert space_group_symbol(t.international_short) == (space_group_symbols()[t.number - 1], t.number)


@pytest.mark.parametrize("number", range(1, 231))
def test_numbers_name_the_standard_setting(number):
    hall = next(h for h in HALLS if spglib.get_spacegroup_type(h).number == number)  # the default setting
    t = spglib.get_spacegroup_type(hall)
    assert space_group_symbols()[number - 1] == t.international_short
    g = as_group(number)
    assert g.symbol == _class(t.pointgroup_international)
    assert g.names.space_group == f"{t.international_short} (no. {number})"
    assert _keys(g) == _cartesian_keys(hall)
    if str(number) in _DIGIT_POINT_GROUPS:
        assert as_group(str(number)).names.space_group == ""  # a point-group symbol stays one
    elif str(number) in ("5", "7", "8", "9"):
        with pytest.raises(UnknownGroupError, match=f"ambiguous.*pass the int {number}"):
            as_group(str(number))
    else:
        assert as_group(str(number)) is g


# point-group symbols made of digits (tensym's catalog: class and setting symbols, and '235' for 532)
_DIGIT_POINT_GROUPS = {s for s in tensym.point_groups(which="all") + tensym.point_groups() if s.isdigit()} | {"235"}


# (symbol as a user types it, setting symbol of its point group, number): ITA Vol. A, space-group
# tables (symbols, numbers and the setting each symbol fixes; from memory); all also checked above
EXAMPLES = [
    ("P6_3mc", "6mm", 186), ("P 6_3 m c", "6mm", 186), ("P63mc", "6mm", 186), ("P6\u2083mc", "6mm", 186),
    ("R-3c", "-3m1", 167), ("R3\u0305c", "-3m1", 167), ("Fd-3m", "m-3m", 227), ("Fd3m", "m-3m", 227),
    ("F 4_1/d -3 2/m", "m-3m", 227), ("P4_2/mnm", "4/mmm", 136), ("P42/mnm", "4/mmm", 136),
    ("Pnma", "mmm", 62), ("Pbnm", "mmm", 62), ("P 2_1/n 2_1/m 2_1/a", "mmm", 62), ("Ia-3d", "m-3m", 230),
    ("C2/c", "12/m1", 15), ("P12_1/c1", "12/m1", 14), ("P 1 2_1/c 1", "12/m1", 14), ("P2_1/n", "12/m1", 14),
    ("P21/c", "12/m1", 14), ("P 1 1 2_1/b", "112/m", 14), ("P2_1/b", "112/m", 14),
    ("P321", "321", 150), ("P312", "312", 149), ("P3121", "321", 152), ("P3_112", "312", 151),
    ("P-6m2", "-6m2", 187), ("P-62m", "-62m", 189), ("P3m1", "3m1", 156), ("P31m", "31m", 157),
    ("P212121", "222", 19), ("Pmc2_1", "mm2", 26), ("P2_1ab", "2mm", 29), ("Pm2m", "m2m", 25),
    ("P-42_1m", "-42m", 113), ("P-4b2", "-4m2", 117), ("I4_1/amd", "4/mmm", 141), ("P4132", "432", 213),
    ("Cmca", "mmm", 64), ("Cmce", "mmm", 64), ("Abm2", "mm2", 39), ("R3", "3", 146), ("P1", "1", 1),
]


@pytest.mark.parametrize("symbol,setting,number", EXAMPLES)
def test_space_group_examples(symbol, setting, number):
    g = as_group(symbol)
    assert (g.setting_symbol, g.rotation) == (setting, None)
    assert f" (no. {number}" in g.names.space_group
    assert f"the point group of space group {g.names.space_group}" in g.setting
    assert g.operation_keys() == point_group(setting).operation_keys()
    assert as_group(symbol) is g  # one object per spelling, so results are cached once


def test_the_names_spell_the_symbol_with_underscores():
    assert as_group("P63mc").names.space_group == "P6_3mc (no. 186)"
    assert as_group("P6₃mc").names.space_group == "P6_3mc (no. 186)"
    assert as_group("P 21/n 21/m 21/a").names.space_group == "P 2_1/n 2_1/m 2_1/a (no. 62)"
    assert as_group("Pbnm").names.space_group == "Pbnm (no. 62, setting cab)"  # ITA Table 4.3.2.1 (from memory)
    assert as_group("P 1 2_1/n 1").names.space_group == "P 1 2_1/n 1 (no. 14, unique axis b)"


def test_numbers_as_int_and_string():
    assert as_group(186) is as_group("186") and as_group(np.int64(186)) is as_group(186)
    assert as_group(186).operation_keys() == as_group("P6_3mc").operation_keys()
    assert point_group(225).names.space_group == "Fm-3m (no. 225)"
    # a digit string that is a point-group symbol stays a point group (module rule)
    for text in ("1", "2", "3", "4", "6", "23", "32", "222", "321"):
        assert as_group(text).names.space_group == "" and as_group(text) is point_group(text)


def test_schoenflies_symbols_that_are_also_space_group_symbols():
    # 'C2' is the Schoenflies symbol of class 2 and the space group C2 (no. 5, class 2, unique axis b):
    # the same point group either way (ITA Vol. A; from memory); tensym reads it as the point group
    assert as_group("C2") is point_group("121") and as_group("C2").names.space_group == ""
    assert as_group("Cm").names.space_group == "Cm (no. 8)" and as_group("Cm").setting_symbol == "1m1"


def test_forms_through_space_groups():
    # Nye 1985: class 6mm has d15, d31, d33 and five elastic constants; m-3m three
    assert tensym.tensor_form("piezoelectric_d", "P6_3mc").n_independent == 3
    assert tensym.tensor_form("elastic_stiffness", 186).n_independent == 5
    assert tensym.tensor_form("elastic_stiffness", "Fd-3m").n_independent == 3
    assert str(tensym.decompose("elastic_stiffness", "Fm-3m")) == str(tensym.decompose("elastic_stiffness", "m-3m"))


def test_every_symbol_reads_one_way_without_underscores():
    # root cause of the implicit-subscript reading: no known symbol has a second reading
    from tensym.groups.spacegroups import _lookup, _table

    for key, (number, setting, _) in _table().items():
        found = _lookup(key.replace("_", ""))
        assert found is not None and found[:2] == (number, setting), key


@pytest.mark.parametrize("bad,match", [
    ("P6_3mcc", "unknown space-group or point-group symbol 'P6_3mcc'; nearest valid symbols: 'P6_3mc'"),
    ("Fd-3n", "nearest valid symbols: .*'Fd-3m'"),
    ("P4_7mm", "nearest valid symbols: 'P4mm'"),
    ("Pnmaa", "nearest valid symbols: 'Pnma'"),
    ("231", "space-group number 231 is outside 1..230"),
    ("0", "space-group number 0 is outside 1..230"),
    ("7", "'7' is ambiguous: .*pass the int 7 or the symbol 'Pc'"),
    ("5", "'5' is ambiguous: .*'C2'"),
])
def test_unknown_space_groups(bad, match):
    with pytest.raises(UnknownGroupError, match=match):
        as_group(bad)


def test_bad_numbers_and_types():
    with pytest.raises(UnknownGroupError, match="space-group number 231 is outside 1..230"):
        as_group(231)
    with pytest.raises(UnknownGroupError, match="space-group number -4 is outside"):
        point_group(-4)
    with pytest.raises(InvalidGroupError, match="got bool"):
        as_group(True)
    with pytest.raises(InvalidGroupError, match="got float 186.0"):
        point_group(186.0)
    with pytest.raises(InvalidGroupError, match="got bool"):
        space_group_point_group(True)
    with pytest.raises(UnknownGroupError, match="unknown space-group symbol 'P6_3mmc'; nearest .*'P6_3/mmc'"):
        space_group_point_group("P6_3mmc")
    with pytest.raises(UnknownGroupError, match="'6mm' is not a space-group symbol"):
        space_group_symbol("6mm")
