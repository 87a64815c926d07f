"""Magnetic groups through the public entry points: point_group, group_from_generators, decompose, tensor_form."""

import pytest

import tensym
from tensym.errors import GroupClosureError, UnknownGroupError


def test_public_names():
    for name in ("MagneticPointGroup", "magnetic_point_groups", "magnetic_class", "unitary_subgroup",
                 "parent_group"):
        assert name in tensym.__all__ and getattr(tensym, name).__doc__
    import tensym.groups.magnetic as m
    import tensym.reps.magnetic as rm
    import tensym.tensors.magnetic_catalog as mc

    for mod in (m, rm, mc):
        assert mod.__all__ and all(hasattr(mod, n) for n in mod.__all__)


def test_point_group_and_as_group_take_magnetic_symbols():
    g = tensym.point_group("m'm'm")
    assert g is tensym.as_group("m'm'm") and g.is_magnetic and g.symbol == "m'm'm"
    assert tensym.point_group("4'/m").schoenflies == "C4h(C2h)"
    assert tensym.point_group("mmm1'").order == 16
    assert tensym.point_group("D2h(C2h)") is g
    assert tensym.point_group("mmm") is not g and not tensym.point_group("mmm").is_magnetic
    with pytest.raises(UnknownGroupError, match="valid primings of 222"):
        tensym.point_group("2'2'2'")


def test_generators_with_trailing_time_reversal_marks():
    g = tensym.group_from_generators(["-y,x,z,-1", "-x,-y,-z"])
    assert (g.symbol, g.setting_symbol) == ("4'/m", "4'/m")
    assert tensym.recognise(g).hm == "4'/m"
    h = tensym.group_from_generators(["-y,x-y,z", "y,x,-z,-1"], basis="hexagonal")
    assert h.symbol == "32'"
    with pytest.raises(GroupClosureError, match="contradict"):
        tensym.group_from_generators(["-y,x,z,-1", "-x,-y,z,-1"])


def test_decompose_over_a_magnetic_group():
    d = tensym.decompose("magnetoelectric", "-3'm'")
    assert (d.unitary, str(d), str(d.linear)) == ("32", "2A1 + A2 + 3E", "2A1g + A2g + 3Eg")
    assert d.wigner_types == ("a", "a", "a")
    assert d.linear["A1g"] == tensym.tensor_form("magnetoelectric", "-3'm'").n_independent


def test_tensor_form_by_symbol():
    f = tensym.tensor_form("magnetization", "m'm'm")
    assert f.n_independent == 1 and str(f.symbols[0]) == "M3"
    assert tensym.tensor_form("piezomagnetic", "mmm1'").n_independent == 0


# --- issue 9: every function taking a group also takes a record of magnetic_point_groups() ----------
def _record(symbol):
    return next(r for r in tensym.magnetic_point_groups() if r.symbol == symbol)


@pytest.mark.parametrize("symbol", ["m'm'm", "-3'm'", "4'/m", "mmm1'", "6/mmm", "m'-3'm"])
def test_issue_9_records_are_groups(symbol):
    rec = _record(symbol)
    g = tensym.as_group(rec)
    assert g is tensym.point_group(symbol) and tensym.as_group(g) is g
    assert g.order == rec.order and g.symbol == rec.symbol  # the record's own facts (Birss 1964 counts)
    for prop in ("magnetoelectric", "elastic_stiffness"):
        assert tensym.tensor_form(prop, rec).n_independent == tensym.tensor_form(prop, symbol).n_independent
    assert str(tensym.decompose("magnetization", rec)) == str(tensym.decompose("magnetization", symbol))
    assert tensym.character_table(rec).labels == tensym.character_table(symbol).labels
    assert tensym.recognise(rec).hm == tensym.recognise(g).hm


def test_issue_9_dzyaloshinskii_form_from_a_record():
    # -3'm' (Cr2O3): alpha11 = alpha22 and alpha33 (Dzyaloshinskii 1959)
    assert tensym.tensor_form("magnetoelectric", _record("-3'm'")).n_independent == 2
