"""Looking groups up by symbol: every spelling, and errors naming the nearest symbols."""

import pytest

import tensym
from tensym.errors import InvalidGroupError, TensymError, UnknownGroupError
from tensym.groups import as_group, point_group
from tensym.groups.symbols import normalise_symbol

# (spelling, setting symbol it names).  Hermann-Mauguin and Schoenflies symbols
# as in ITA Vol. A, Table 10.1.2.2 and Cotton 1990 (from memory); overbar
# characters are Unicode combining U+0304 / U+0305 (common practice).
SPELLINGS = [
    ("4/mmm", "4/mmm"), ("4/m 2/m 2/m", "4/mmm"), ("4/M M M", "4/mmm"), ("D4h", "4/mmm"), ("d4h", "4/mmm"),
    ("D₄h", "4/mmm"),
    ("-42m", "-42m"), ("-4 2 m", "-42m"), ("4\u03052m", "-42m"), ("4\u03042m", "-42m"), ("\u00af42m", "-42m"),
    ("\u221242m", "-42m"), ("D2d", "-42m"), ("Vd", "-42m"), ("-4m2", "-4m2"), ("-4 m 2", "-4m2"),
    ("-4", "-4"), ("4\u0305", "-4"), ("S4", "-4"), ("s4", "-4"),
    ("2", "121"), ("C2", "121"), ("1 2 1", "121"), ("121", "121"), ("112", "112"), ("1 1 2", "112"),
    ("m", "1m1"), ("Cs", "1m1"), ("C1h", "1m1"), ("11m", "11m"), ("2/m", "12/m1"), ("C2h", "12/m1"),
    ("12/m1", "12/m1"), ("1 1 2/m", "112/m"),
    ("mm2", "mm2"), ("C2v", "mm2"), ("2mm", "2mm"), ("m2m", "m2m"), ("mmm", "mmm"), ("2/m 2/m 2/m", "mmm"),
    ("222", "222"), ("D2", "222"), ("V", "222"),
    ("32", "321"), ("321", "321"), ("D3", "321"), ("312", "312"), ("3m", "3m1"), ("C3v", "3m1"),
    ("c3v", "3m1"), ("31m", "31m"), ("-3m", "-3m1"), ("-3 2/m 1", "-3m1"), ("-31m", "-31m"),
    ("D3d", "-3m1"), ("-3", "-3"), ("C3i", "-3"), ("S6", "-3"), ("3\u0305", "-3"),
    ("-6m2", "-6m2"), ("D3h", "-6m2"), ("-62m", "-62m"), ("6/mmm", "6/mmm"), ("6/m 2/m 2/m", "6/mmm"),
    ("C3h", "-6"), ("C6h", "6/m"),
    ("-1", "-1"), ("Ci", "-1"), ("ci", "-1"), ("S2", "-1"), ("1", "1"), ("C1", "1"),
    ("m-3m", "m-3m"), ("m3m", "m-3m"), ("m3\u0305m", "m-3m"), ("4/m -3 2/m", "m-3m"), ("Oh", "m-3m"),
    ("oh", "m-3m"), ("m-3", "m-3"), ("m3", "m-3"), ("Th", "m-3"), ("2/m -3", "m-3"), ("-43m", "-43m"),
    ("Td", "-43m"), ("td", "-43m"), ("TD", "-43m"), ("432", "432"), ("O", "432"), ("23", "23"), ("T", "23"),
    ("I", "532"), ("532", "532"), ("235", "532"), ("Ih", "-5-3m"), ("-5-3m", "-5-3m"), ("m-3-5", "-5-3m"),
    ("5\u03053\u0305m", "-5-3m"),
]


@pytest.mark.parametrize("spelling,setting", SPELLINGS)
def test_spellings(spelling, setting):
    assert point_group(spelling).setting_symbol == setting


@pytest.mark.parametrize("spelling,hm", [
    ("SO(3)", "SO(3)"), ("so(3)", "SO(3)"), ("O(3)", "O(3)"), ("Cinfv", "infm"), ("C∞v", "infm"),
    ("Dinfh", "inf/mm"), ("D∞h", "inf/mm"), ("inf/mm", "inf/mm"), ("∞/mm", "inf/mm"), ("Cinf", "inf"),
    ("Cinfh", "inf/m"), ("Dinf", "inf2"),
])
def test_continuous_spellings(spelling, hm):
    g = point_group(spelling)
    assert g.is_continuous and g.symbol == hm


@pytest.mark.parametrize("bad,nearest", [
    ("D4hh", "D4h"), ("4/mm", "4/mmm"), ("C3vv", "C3v"), ("-4m", "-4m2"), ("m3mm", "m-3m"),
    ("6/mm", "6/mmm"), ("Cinfw", "Cinfv"),
])
def test_unknown_symbol_names_nearest(bad, nearest):
    with pytest.raises(UnknownGroupError, match=f"nearest valid symbols: .*'{nearest}'"):
        point_group(bad)


def test_unknown_symbol_error_types():
    with pytest.raises(KeyError):
        point_group("C7v")
    with pytest.raises(TensymError):
        point_group("")
    # the message is readable (not KeyError's quoted repr)
    with pytest.raises(UnknownGroupError) as info:
        point_group("4/mm")
    assert str(info.value).startswith("unknown point-group symbol '4/mm'")


def test_as_group():
    g = point_group("6mm")
    assert as_group(g) is g
    assert as_group("C6v") is g
    c = point_group("SO(3)")
    assert as_group(c) is c
    with pytest.raises(InvalidGroupError, match="group_from_generators"):
        as_group(6.0)
    with pytest.raises(TypeError):
        as_group(["-x,-y,z"])
    with pytest.raises(InvalidGroupError, match="must be a string"):
        point_group(4.5)
    # an int is a space-group number (issue 9): 6 is Pm, class m (ITA Vol. A; from memory)
    assert as_group(6).names.space_group == "Pm (no. 6)" and point_group(4).symbol == "2"


def test_normalise_symbol():
    assert normalise_symbol(" 4\u0305 2 m ") == "-42m"
    assert normalise_symbol("C∞v") == "Cinfv"


def test_public_api_lists_group_names():
    for name in ("point_group", "as_group", "group_from_generators", "reorient", "rotation_from_axes",
                 "rotation_about", "recognise", "settings_table", "point_groups", "Operation", "PointGroup",
                 "ContinuousGroup", "GroupNames"):
        assert name in tensym.__all__ and hasattr(tensym, name)
    import tensym.groups as groups

    for name in groups.__all__:
        assert hasattr(groups, name)
    for mod in ("catalog", "finite", "operations", "continuous", "symbols", "recognition"):
        m = __import__(f"tensym.groups.{mod}", fromlist=["__all__"])
        assert all(hasattr(m, n) for n in m.__all__)


# --- issue 11: small input defects -------------------------------------------------------
def test_issue_11_lowercase_i_is_refused_as_ambiguous():
    # Schoenflies: i is the inversion, its group Ci; I is the icosahedral group (Cotton 1990, from memory)
    with pytest.raises(UnknownGroupError, match="'i' is ambiguous: .*'Ci' or '-1'.*'I' or '532'"):
        point_group("i")
    with pytest.raises(UnknownGroupError, match="ambiguous"):
        as_group(" i ")
    assert point_group("I").symbol == "532" and point_group("Ci").symbol == "-1"
    assert point_group("ih").symbol == "-5-3m"  # only the lone letter is ambiguous


@pytest.mark.parametrize("call", [
    lambda s: point_group("X" * 10000),
    lambda s: point_group("P" + "m" * 10000),
    lambda s: point_group("m'" * 5000),
    lambda s: tensym.group_from_generators(["x,y," + "z" * 10000]),
    lambda s: tensym.group_from_generators([[[1, 0, 0], [0, 1, 0], [0, 0, "1" * 10000]]]),
])
def test_issue_11_messages_cut_long_inputs(call):
    with pytest.raises(TensymError) as info:
        call(None)
    text = str(info.value)
    assert len(text) < 600 and "..." in text


def test_issue_11_p63mc_is_accepted():
    # it was suggested as '3m' by the nearest-symbol error; ITA Vol. A: P6_3mc is no. 186, class 6mm
    assert point_group("P6_3mc").symbol == "6mm"
