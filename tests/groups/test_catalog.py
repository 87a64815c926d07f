"""The catalog of named groups against published tables and spglib's database."""

import os

import numpy as np
import pytest

import tensym
from tensym.errors import InvalidOptionError, UnknownGroupError
from tensym.exact import quadratic_field
from tensym.groups import point_group, point_groups, settings_table
from tensym.groups.catalog import catalog_group

# Group order and number of conjugacy classes of the 32 classes: the character
# tables of Koster, Dimmock, Wheeler & Statz 1963 (one row per class) and
# Cotton 1990, Appendix IIA (from memory).
ORDER_AND_CLASSES = {
    "1": (1, 1), "-1": (2, 2), "2": (2, 2), "m": (2, 2), "2/m": (4, 4),
    "222": (4, 4), "mm2": (4, 4), "mmm": (8, 8),
    "4": (4, 4), "-4": (4, 4), "4/m": (8, 8), "422": (8, 5), "4mm": (8, 5), "-42m": (8, 5),
    "4/mmm": (16, 10),
    "3": (3, 3), "-3": (6, 6), "32": (6, 3), "3m": (6, 3), "-3m": (12, 6),
    "6": (6, 6), "-6": (6, 6), "6/m": (12, 12), "622": (12, 6), "6mm": (12, 6), "-6m2": (12, 6),
    "6/mmm": (24, 12),
    "23": (12, 4), "m-3": (24, 8), "432": (24, 5), "-43m": (24, 5), "m-3m": (48, 10),
    # icosahedral groups: Cotton 1990, Appendix IIA, tables I and Ih (from memory)
    "532": (60, 5), "-5-3m": (120, 10),
}

# Schoenflies symbol, crystal system and Laue class of each class:
# International Tables Vol. A, Table 10.1.2.2 (from memory).
CLASS_FACTS = {
    "1": ("C1", "triclinic", "-1"), "-1": ("Ci", "triclinic", "-1"),
    "2": ("C2", "monoclinic", "2/m"), "m": ("Cs", "monoclinic", "2/m"), "2/m": ("C2h", "monoclinic", "2/m"),
    "222": ("D2", "orthorhombic", "mmm"), "mm2": ("C2v", "orthorhombic", "mmm"),
    "mmm": ("D2h", "orthorhombic", "mmm"),
    "4": ("C4", "tetragonal", "4/m"), "-4": ("S4", "tetragonal", "4/m"), "4/m": ("C4h", "tetragonal", "4/m"),
    "422": ("D4", "tetragonal", "4/mmm"), "4mm": ("C4v", "tetragonal", "4/mmm"),
    "-42m": ("D2d", "tetragonal", "4/mmm"), "4/mmm": ("D4h", "tetragonal", "4/mmm"),
    "3": ("C3", "trigonal", "-3"), "-3": ("C3i", "trigonal", "-3"), "32": ("D3", "trigonal", "-3m"),
    "3m": ("C3v", "trigonal", "-3m"), "-3m": ("D3d", "trigonal", "-3m"),
    "6": ("C6", "hexagonal", "6/m"), "-6": ("C3h", "hexagonal", "6/m"), "6/m": ("C6h", "hexagonal", "6/m"),
    "622": ("D6", "hexagonal", "6/mmm"), "6mm": ("C6v", "hexagonal", "6/mmm"),
    "-6m2": ("D3h", "hexagonal", "6/mmm"), "6/mmm": ("D6h", "hexagonal", "6/mmm"),
    "23": ("T", "cubic", "m-3"), "m-3": ("Th", "cubic", "m-3"), "432": ("O", "cubic", "m-3m"),
    "-43m": ("Td", "cubic", "m-3m"), "m-3m": ("Oh", "cubic", "m-3m"),
}

# Nye 1985, ch. I and Table 9 (from memory): the 10 polar (pyroelectric) classes,
# the 11 enantiomorphic classes (proper rotations only) and the 11 Laue classes.
POLAR = {"1", "2", "m", "mm2", "4", "4mm", "3", "3m", "6", "6mm"}
ENANTIOMORPHIC = {"1", "2", "222", "4", "422", "3", "32", "6", "622", "23", "432"}
CENTROSYMMETRIC = {"-1", "2/m", "mmm", "4/m", "4/mmm", "-3", "-3m", "6/m", "6/mmm", "m-3", "m-3m"}

# Hall numbers of spglib's database for a symmorphic space group in each of our
# settings (the spglib symbol is checked below, so a wrong number fails).
HALL = {
    "1": 1, "-1": 2, "121": 3, "112": 4, "211": 5, "1m1": 18, "11m": 19, "m11": 20,
    "12/m1": 57, "112/m": 58, "2/m11": 59, "222": 108, "mm2": 125, "2mm": 126, "m2m": 127, "mmm": 227,
    "4": 349, "-4": 355, "4/m": 357, "422": 366, "4mm": 376, "-42m": 388, "-4m2": 392, "4/mmm": 400,
    "3": 430, "-3": 435, "321": 439, "312": 438, "3m1": 446, "31m": 447, "-3m1": 456, "-31m": 454,
    "6": 462, "-6": 468, "6/m": 469, "622": 471, "6mm": 477, "-6m2": 481, "-62m": 483, "6/mmm": 485,
    "23": 489, "m-3": 494, "432": 503, "-43m": 511, "m-3m": 517,
}


def test_listing_is_the_32_classes_in_order():
    # the usual order of the 32 classes, ITA Vol. A Table 10.1.2.2 (from memory)
    assert point_groups() == tuple(ORDER_AND_CLASSES)[:32]
    assert point_groups(which="icosahedral") == ("532", "-5-3m")
    assert set(point_groups(which="settings")) == set(HALL)
    assert point_groups(which="all") == tuple(s.symbol for s in settings_table())


def test_listing_rejects_unknown_option():
    with pytest.raises(InvalidOptionError, match="crystallographic"):
        point_groups(which="cubic")


@pytest.mark.parametrize("symbol", list(ORDER_AND_CLASSES))
def test_order_and_class_count(symbol):
    g = point_group(symbol)
    order, n_classes = ORDER_AND_CLASSES[symbol]
    assert g.order == order
    assert len(g.classes) == n_classes
    assert sum(len(c) for c in g.classes) == order


@pytest.mark.parametrize("setting", point_groups(which="settings"))
def test_every_setting_has_the_order_of_its_class(setting):
    g = catalog_group(setting)
    assert (g.order, len(g.classes)) == ORDER_AND_CLASSES[g.symbol]


@pytest.mark.parametrize("symbol", list(CLASS_FACTS))
def test_symbols_system_and_laue_class(symbol):
    g = point_group(symbol)
    assert (g.schoenflies, g.crystal_system, g.laue_class) == CLASS_FACTS[symbol]
    # the Laue class is the class with the inversion added
    laue = point_group(g.laue_class)
    with_inversion = tensym.group_from_generators(list(g.generators) + ["-x,-y,-z"])
    assert with_inversion.symbol == laue.symbol


@pytest.mark.parametrize("symbol", point_groups())
def test_polar_enantiomorphic_centrosymmetric(symbol):
    g = point_group(symbol)
    assert g.is_polar == (symbol in POLAR)
    assert g.is_enantiomorphic == (symbol in ENANTIOMORPHIC)
    assert g.is_centrosymmetric == (symbol in CENTROSYMMETRIC)


def test_icosahedral_facts():
    i, ih = point_group("I"), point_group("Ih")
    assert i.is_enantiomorphic and not i.is_polar and not i.is_centrosymmetric
    assert ih.is_centrosymmetric and ih.laue_class == "-5-3m" and ih.crystal_system == "icosahedral"
    # every entry lies in Q(sqrt(5)) (the setting with 2-folds along x, y, z)
    for op in ih.operations:
        assert quadratic_field(list(op.matrix)) in (1, 5)
    assert any(quadratic_field(list(op.matrix)) == 5 for op in i.operations)
    # rotation orders of I: 1 + 15 two-folds + 20 three-folds + 24 five-folds (Cotton 1990, from memory)
    orders = sorted(op.order for op in i.operations)
    assert [orders.count(n) for n in (1, 2, 3, 5)] == [1, 15, 20, 24]
    # the 2-folds of I include those along x, y, z
    axes = {op.axis for op in i.operations if op.order == 2}
    assert {(1, 0, 0), (0, 1, 0), (0, 0, 1)} <= axes


def test_every_row_is_consistent():
    rows = settings_table()
    assert len({r.symbol for r in rows}) == len(rows)
    for r in rows:
        g = catalog_group(r.symbol)
        assert g.setting_symbol == r.symbol and g.symbol == r.hm and g.full_symbol == r.full_hm
        assert g.rotation is None
        defaults = [s for s in rows if s.hm == r.hm and s.default]
        assert len(defaults) == 1
        # hexagonal-basis triplets give integer matrices in that basis
        if r.basis == "hexagonal":
            for op in g.operations:
                w = tensym.Operation.from_triplet(op.triplet(basis="hexagonal"), basis="hexagonal")
                assert w == op


def test_settings_of_one_class_are_distinct_orientations():
    by_class = {}
    for r in settings_table():
        by_class.setdefault(r.hm, []).append(catalog_group(r.symbol).operation_keys())
    for hm, key_sets in by_class.items():
        assert len(set(key_sets)) == len(key_sets), hm


def test_setting_words_match_the_brief_conventions():
    # common practice (IEEE Std 176-1987 axis conventions, from memory)
    g = point_group("32")
    assert tensym.Operation.from_triplet("x,-y,-z") in g  # 2-fold along x
    assert tensym.Operation.from_triplet("-x,y,z") in point_group("3m")  # mirror normal to x
    assert tensym.Operation.from_triplet("-x,y,z") in point_group("-6m2")
    assert tensym.Operation.from_triplet("x,-y,-z") in point_group("-62m")
    assert tensym.Operation.from_triplet("x,-y,-z") in point_group("-42m")
    assert tensym.Operation.from_triplet("-y,-x,z") in point_group("-42m")  # mirror normal [110]
    assert tensym.Operation.from_triplet("-x,y,z") in point_group("-4m2")
    assert tensym.Operation.from_triplet("y,x,-z") in point_group("-4m2")  # 2-fold along [110]
    assert tensym.Operation.from_triplet("-x,y,-z") in point_group("2")  # unique axis y
    assert tensym.Operation.from_triplet("-x,-y,z") in point_group("112")
    assert tensym.Operation.from_triplet("z,x,y") in point_group("m-3m")  # 3-fold along [111]


def test_catalog_groups_are_cached_and_immutable():
    g = point_group("4mm")
    assert point_group("C4v") is g
    with pytest.raises(AttributeError):
        g.operations[0].time_reversal = True
    with pytest.raises(TypeError):
        g.operations[0] = g.operations[1]
    with pytest.raises(AttributeError):
        g.names.hm = "4"
    t = g.multiplication_table
    t[0, 0] = 99
    assert g.multiplication_table[0, 0] == 0


def test_unknown_setting_symbol():
    with pytest.raises(UnknownGroupError, match="not a setting symbol"):
        catalog_group("4/mm")


def _spglib():
    os.environ.setdefault("SPGLIB_OLD_ERROR_HANDLING", "0")
    return pytest.importorskip("spglib", reason="spglib is not installed")


_HEX = np.array([[1.0, -0.5, 0.0], [0.0, np.sqrt(3) / 2, 0.0], [0.0, 0.0, 1.0]])


@pytest.mark.parametrize("setting", sorted(HALL))
def test_operations_equal_spglib_rotations(setting):
    spglib = _spglib()
    g = catalog_group(setting)
    hall = HALL[setting]
    t = spglib.get_spacegroup_type(hall)
    # the Hall number names a space group of this point group in this setting
    assert t.pointgroup_international == g.symbol
    assert t.international_full == "P " + g.full_symbol
    rots = spglib.get_symmetry_from_database(hall)["rotations"]
    a = _HEX if g.crystal_system in ("trigonal", "hexagonal") else np.eye(3)
    ainv = np.linalg.inv(a)
    theirs = {tuple(np.rint((a @ r @ ainv).ravel() * 1e8).astype(int)) for r in rots}
    ours = {tuple(np.rint(op.numeric.ravel() * 1e8).astype(int)) for op in g.operations}
    assert len(rots) == g.order
    assert ours == theirs


def test_settings_table_as_markdown():
    text = settings_table(format="markdown")
    lines = text.splitlines()
    assert len(lines) == 2 + len(settings_table())
    for row, line in zip(settings_table(), lines[2:]):
        assert line.startswith(f"| `{row.symbol}` | {row.hm} |") and row.setting in line
    with pytest.raises(InvalidOptionError, match="markdown"):
        settings_table(format="latex")
