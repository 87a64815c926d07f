"""Correlation tables against published compatibility relations."""

import pytest

import tensym
from tensym.groups import point_group, point_groups


@pytest.fixture(scope="module")
def along_111():
    return tensym.rotation_from_axes(new_z=[1, 1, 1], new_x=[1, -1, 0])


def test_oh_to_d4h():
    # Oh -> D4h (tetragonal distortion), Koster et al. 1963 compatibility tables; Cotton 1990
    # correlation table (from memory)
    t = correlate_dict("m-3m", "4/mmm")
    assert t == {
        "A1g": "A1g", "A2g": "B1g", "Eg": "A1g + B1g", "T1g": "A2g + Eg", "T2g": "B2g + Eg",
        "A1u": "A1u", "A2u": "B1u", "Eu": "A1u + B1u", "T1u": "A2u + Eu", "T2u": "B2u + Eu",
    }


def test_oh_to_d3d_and_c3v_along_111(along_111):
    # trigonal distortion along [111] (Cotton 1990 correlation table; from memory)
    d3d = correlate_dict("m-3m", tensym.reorient("-3m", along_111))
    assert d3d["Eg"] == "Eg" and d3d["T1g"] == "A2g + Eg" and d3d["T2g"] == "A1g + Eg"
    assert d3d["T1u"] == "A2u + Eu" and d3d["T2u"] == "A1u + Eu"
    c3v = correlate_dict("m-3m", tensym.reorient("3m", along_111))
    assert c3v["T1u"] == "A1 + E" and c3v["T2g"] == "A1 + E" and c3v["A2u"] == "A1"
    # the symbol alone finds the (unique up to conjugacy) embedding
    assert correlate_dict("m-3m", "-3m") == d3d


def test_o3_to_point_groups():
    # Bethe 1929; Koster et al. 1963 (from memory)
    t = tensym.correlate("O(3)", "m-3m", up_to=4)
    assert str(t["D2g"]) == "Eg + T2g" and str(t["D3u"]) == "A2u + T1u + T2u"
    assert str(t["D4g"]) == "A1g + Eg + T1g + T2g"
    assert str(tensym.correlate("SO(3)", "432")["D2"]) == "E + T2"
    assert str(tensym.correlate("O(3)", "3m")["D1u"]) == "A1 + E"
    for symbol in point_groups():
        t = tensym.correlate("O(3)", symbol, up_to=2)
        for lab, d in zip(t.labels, t.splittings):
            l = int(lab[1])
            assert d.dim == 2 * l + 1


def test_dinfh_to_d6h():
    # Herzberg-style correlation of linear-molecule species (common practice): Πu -> E1u,
    # Δg -> E2g, Φu -> B1u + B2u, Σu+ (z) -> A2u
    t = correlate_dict("Dinfh", "6/mmm", up_to=3)
    assert t["Σg+"] == "A1g" and t["Σu+"] == "A2u" and t["Πu"] == "E1u" and t["Δg"] == "E2g"
    assert t["Φu"] == "B1u + B2u"
    o3 = correlate_dict("O(3)", "Dinfh", up_to=2)
    assert o3["D1u"] == "Σu+ + Πu" and o3["D2g"] == "Σg+ + Πg + Δg"


def test_table_forms():
    t = tensym.correlate("m-3m", "4/mmm")
    assert str(t).splitlines()[0] == "m-3m -> 4/mmm"
    assert "\\begin{tabular}" in t.latex() and "A_{1g}" in t.latex()
    with pytest.raises(Exception):
        t.labels = ()


def test_bad_subgroups():
    from tensym.errors import RepresentationError

    with pytest.raises(RepresentationError, match="not a subgroup"):
        tensym.correlate("4/mmm", tensym.reorient("3m", tensym.rotation_from_axes(new_z=[1, 1, 1], new_x=[1, -1, 0])))
    with pytest.raises(RepresentationError, match="no subgroup of type"):
        tensym.correlate("4/mmm", "3m")
    # a cube turned so that [111] is z contains no 2-fold along y: the symbol '2' then fits two
    # inequivalent 2-folds (a cube axis or a face diagonal), and the call asks for an orientation
    import sympy as sp

    q = tensym.rotation_from_axes(new_z=[1, 1, 1], new_x=[1, -1, 0])
    turned = tensym.reorient("m-3m", sp.Matrix(q).T)
    with pytest.raises(RepresentationError, match="2 inequivalent subgroups of type 2"):
        tensym.correlate(turned, "2")


def correlate_dict(g, h, **kw):
    return tensym.correlate(g, h, **kw).as_dict()
