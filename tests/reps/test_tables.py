"""Character tables against published tables, and their structural relations for every group."""

import pytest
import sympy as sp

import tensym
from tensym.groups import point_group, point_groups

S5 = sp.sqrt(5)
EPS = sp.Rational(-1, 2) + sp.sqrt(3) * sp.I / 2  # exp(2 pi i / 3)

# Published tables: class names in tensym's spelling (Cotton's 6C2 of O/Oh is 6C2' here and his
# 3C2(=C4^2) is 3C2), values keyed by class name so that the column order does not matter.
PUBLISHED = {
    # Cotton 1990, Appendix IIA, C3v (from memory); Koster et al. 1963, Table for C3v (from memory)
    "3m": (["E", "2C3", "3σv"], {
        "A1": [1, 1, 1],
        "A2": [1, 1, -1],
        "E": [2, -1, 0],
    }),
    # Cotton 1990, Appendix IIA, C4v (from memory)
    "4mm": (["E", "2C4", "C2", "2σv", "2σd"], {
        "A1": [1, 1, 1, 1, 1],
        "A2": [1, 1, 1, -1, -1],
        "B1": [1, -1, 1, 1, -1],
        "B2": [1, -1, 1, -1, 1],
        "E": [2, 0, -2, 0, 0],
    }),
    # Cotton 1990, Appendix IIA, D4h (from memory)
    "4/mmm": (["E", "2C4", "C2", "2C2'", "2C2''", "i", "2S4", "σh", "2σv", "2σd"], {
        "A1g": [1, 1, 1, 1, 1, 1, 1, 1, 1, 1],
        "A2g": [1, 1, 1, -1, -1, 1, 1, 1, -1, -1],
        "B1g": [1, -1, 1, 1, -1, 1, -1, 1, 1, -1],
        "B2g": [1, -1, 1, -1, 1, 1, -1, 1, -1, 1],
        "Eg": [2, 0, -2, 0, 0, 2, 0, -2, 0, 0],
        "A1u": [1, 1, 1, 1, 1, -1, -1, -1, -1, -1],
        "A2u": [1, 1, 1, -1, -1, -1, -1, -1, 1, 1],
        "B1u": [1, -1, 1, 1, -1, -1, 1, -1, -1, 1],
        "B2u": [1, -1, 1, -1, 1, -1, 1, -1, 1, -1],
        "Eu": [2, 0, -2, 0, 0, -2, 0, 2, 0, 0],
    }),
    # Cotton 1990, Appendix IIA, D3d (from memory)
    "-3m": (["E", "2C3", "3C2", "i", "2S6", "3σd"], {
        "A1g": [1, 1, 1, 1, 1, 1],
        "A2g": [1, 1, -1, 1, 1, -1],
        "Eg": [2, -1, 0, 2, -1, 0],
        "A1u": [1, 1, 1, -1, -1, -1],
        "A2u": [1, 1, -1, -1, -1, 1],
        "Eu": [2, -1, 0, -2, 1, 0],
    }),
    # Cotton 1990, Appendix IIA, C6v (from memory)
    "6mm": (["E", "2C6", "2C3", "C2", "3σv", "3σd"], {
        "A1": [1, 1, 1, 1, 1, 1],
        "A2": [1, 1, 1, 1, -1, -1],
        "B1": [1, -1, 1, -1, 1, -1],
        "B2": [1, -1, 1, -1, -1, 1],
        "E1": [2, 1, -1, -2, 0, 0],
        "E2": [2, -1, -1, 2, 0, 0],
    }),
    # Cotton 1990, Appendix IIA, Td (from memory); Koster et al. 1963, Td (from memory)
    "-43m": (["E", "8C3", "3C2", "6S4", "6σd"], {
        "A1": [1, 1, 1, 1, 1],
        "A2": [1, 1, 1, -1, -1],
        "E": [2, -1, 2, 0, 0],
        "T1": [3, 0, -1, 1, -1],
        "T2": [3, 0, -1, -1, 1],
    }),
    # Cotton 1990, Appendix IIA, Oh (from memory), columns E 8C3 6C2 6C4 3C2 i 6S4 8S6 3σh 6σd
    "m-3m": (["E", "8C3", "6C2'", "6C4", "3C2", "i", "6S4", "8S6", "3σh", "6σd"], {
        "A1g": [1, 1, 1, 1, 1, 1, 1, 1, 1, 1],
        "A2g": [1, 1, -1, -1, 1, 1, -1, 1, 1, -1],
        "Eg": [2, -1, 0, 0, 2, 2, 0, -1, 2, 0],
        "T1g": [3, 0, -1, 1, -1, 3, 1, 0, -1, -1],
        "T2g": [3, 0, 1, -1, -1, 3, -1, 0, -1, 1],
        "A1u": [1, 1, 1, 1, 1, -1, -1, -1, -1, -1],
        "A2u": [1, 1, -1, -1, 1, -1, 1, -1, -1, 1],
        "Eu": [2, -1, 0, 0, 2, -2, 0, 1, -2, 0],
        "T1u": [3, 0, -1, 1, -1, -3, -1, 0, 1, 1],
        "T2u": [3, 0, 1, -1, -1, -3, 1, 0, 1, -1],
    }),
    # Cotton 1990, Appendix IIA, I (from memory)
    "532": (["E", "12C5", "12C5²", "20C3", "15C2"], {
        "A": [1, 1, 1, 1, 1],
        "T1": [3, (1 + S5) / 2, (1 - S5) / 2, 0, -1],
        "T2": [3, (1 - S5) / 2, (1 + S5) / 2, 0, -1],
        "G": [4, -1, -1, 1, 0],
        "H": [5, 0, 0, -1, 1],
    }),
}


def _row(table, label, names):
    by_name = dict(zip([c.name for c in table.classes], table.irrep(label).characters))
    return [by_name[n] for n in names]


@pytest.mark.parametrize("symbol", sorted(PUBLISHED))
def test_published_tables(symbol):
    names, rows = PUBLISHED[symbol]
    t = tensym.character_table(symbol)
    assert sorted(c.name for c in t.classes) == sorted(names)
    assert set(t.labels) == set(rows)
    for label, want in rows.items():
        got = _row(t, label, names)
        assert [sp.simplify(a - sp.sympify(b)) for a, b in zip(got, want)] == [0] * len(want), label


def test_complex_pair_in_T():
    # Cotton 1990, Appendix IIA, T: E 4C3 4C3^2 3C2, the pair (1, eps, eps*, 1) and (1, eps*, eps, 1),
    # eps = exp(2 pi i / 3) (from memory)
    t = tensym.character_table("23")
    names = ["E", "4C3", "4C3²", "3C2"]
    assert _row(t, "A", names) == [1, 1, 1, 1]
    assert _row(t, "T", names) == [3, 0, 0, -1]
    one, two = (_row(t, lab, names) for lab in ("1E", "2E"))
    want1 = [1, EPS, sp.conjugate(EPS), 1]
    assert [sp.expand(a - b) for a, b in zip(one, want1)] == [0] * 4
    assert [sp.expand(a - sp.conjugate(b)) for a, b in zip(two, want1)] == [0] * 4
    # the real form combines them: characters 2, -1, -1, 2
    assert _row_real(t, "E", names) == [2, -1, -1, 2]
    assert t.irrep("1E").conjugate == "2E" and t.irrep("1E").real_label == "E"


def _row_real(t, label, names):
    irr = next(i for i in t.real_irreps if i.label == label)
    by_name = dict(zip([c.name for c in t.classes], irr.characters))
    return [sp.expand(by_name[n]) for n in names]


# Mulliken labels of every class (Cotton 1990 Appendix IIA, Mulliken 1955; from memory)
LABELS = {
    "1": "A", "-1": "Ag Au", "2": "A B", "m": "A' A''", "2/m": "Ag Bg Au Bu",
    "222": "A B1 B2 B3", "mm2": "A1 A2 B1 B2", "mmm": "Ag B1g B2g B3g Au B1u B2u B3u",
    "4": "A B E", "-4": "A B E", "4/m": "Ag Bg Eg Au Bu Eu", "422": "A1 A2 B1 B2 E",
    "4mm": "A1 A2 B1 B2 E", "-42m": "A1 A2 B1 B2 E", "4/mmm": "A1g A2g B1g B2g Eg A1u A2u B1u B2u Eu",
    "3": "A E", "-3": "Ag Eg Au Eu", "32": "A1 A2 E", "3m": "A1 A2 E", "-3m": "A1g A2g Eg A1u A2u Eu",
    "6": "A B E1 E2", "-6": "A' E' A'' E''", "6/m": "Ag Bg E1g E2g Au Bu E1u E2u",
    "622": "A1 A2 B1 B2 E1 E2", "6mm": "A1 A2 B1 B2 E1 E2", "-6m2": "A1' A2' E' A1'' A2'' E''",
    "6/mmm": "A1g A2g B1g B2g E1g E2g A1u A2u B1u B2u E1u E2u",
    "23": "A E T", "m-3": "Ag Eg Tg Au Eu Tu", "432": "A1 A2 E T1 T2", "-43m": "A1 A2 E T1 T2",
    "m-3m": "A1g A2g Eg T1g T2g A1u A2u Eu T1u T2u",
    "532": "A T1 T2 G H", "-5-3m": "Ag T1g T2g Gg Hg Au T1u T2u Gu Hu",
}


@pytest.mark.parametrize("symbol", sorted(LABELS))
def test_mulliken_labels(symbol):
    t = tensym.character_table(symbol)
    assert [i.label for i in t.real_irreps] == LABELS[symbol].split()


def test_label_choices():
    # handbook choices (Cotton 1990, Appendix IIA; from memory): x is B1 and y B2 in C2v with
    # sigma_v(xz); z is B2 in D2d; z, y, x are B1, B2, B3 in D2; (x, y) is E1 in C6v; z is Σu+ in D∞h.
    vec = tensym.polynomials(1)
    from tensym.reps.spaces import X, Y, Z

    def irrep_of(f, g):
        return [lab for lab in tensym.character_table(g).all_labels()
                if tensym.project(f, g, lab) == f]

    assert irrep_of(X, "mm2") == ["B1"] and irrep_of(Y, "mm2") == ["B2"]
    assert irrep_of(Z, "-42m") == ["B2"]
    assert (irrep_of(Z, "222"), irrep_of(Y, "222"), irrep_of(X, "222")) == (["B1"], ["B2"], ["B3"])
    assert str(tensym.decompose(vec, "6mm")) == "A1 + E1"
    assert str(tensym.decompose(vec, "Dinfh")) == "Σu+ + Πu"


def _exact_zero(v):
    return sp.expand(v) == 0 or sp.simplify(v) == 0


@pytest.mark.parametrize("symbol", point_groups(which="all"))
def test_orthogonality_relations(symbol):
    # row and column orthogonality: sum_C |C| chi_a conj(chi_b) = |G| delta_ab and
    # sum_a chi_a(C) conj(chi_a(C')) = |G|/|C| delta_CC' (Tinkham 1964, ch. 3; common practice)
    t = tensym.character_table(symbol)
    g = point_group(symbol)
    sizes = [c.size for c in t.classes]
    assert sum(sizes) == g.order
    assert len(t.irreps) == len(t.classes)
    assert sum(i.dim**2 for i in t.irreps) == g.order
    rows = [i.characters for i in t.irreps]
    for a, ra in enumerate(rows):
        for b, rb in enumerate(rows):
            s = sum(n * x * sp.conjugate(y) for n, x, y in zip(sizes, ra, rb))
            assert _exact_zero(s - (g.order if a == b else 0))
    for c in range(len(sizes)):
        for d in range(len(sizes)):
            s = sum(r[c] * sp.conjugate(r[d]) for r in rows)
            assert _exact_zero(s - (sp.Rational(g.order, sizes[c]) if c == d else 0))


def test_text_and_latex_forms():
    t = tensym.character_table("3m")
    text = str(t)
    assert text.splitlines()[0].split() == ["3m", "E", "2C3", "3σv"]
    assert "A2" in text
    tex = t.latex()
    assert tex.startswith("\\begin{tabular}") and "\\sigma_{v}" in tex and "A_{1}" in tex
    assert "real forms: E = 1E+2E" in str(tensym.character_table("3"))
    assert "CharacterTable" in repr(t)


def test_tables_are_cached_and_immutable():
    a = tensym.character_table("m-3m")
    assert tensym.character_table("Oh") is a
    with pytest.raises(AttributeError):
        a.irreps = ()
    irr = a.irreps[0]
    with pytest.raises(Exception):
        irr.label = "X"
    assert isinstance(a.irreps, tuple) and isinstance(irr.characters, tuple)


def test_reoriented_group_keeps_labels():
    q = tensym.rotation_from_axes(new_z=[1, 1, 1], new_x=[1, -1, 0])
    g = tensym.reorient("3m", q)
    t = tensym.character_table(g)
    assert [i.label for i in t.irreps] == ["A1", "A2", "E"]
    assert [c.name for c in t.classes] == ["E", "2C3", "3σv"]


def test_continuous_tables():
    # D^l characters and the Σ, Π, Δ families (Tinkham 1964, ch. 5; Herzberg's notation; from memory)
    t = tensym.character_table("O(3)", up_to=2)
    assert [i.label for i in t.real_irreps] == ["D0g", "D1g", "D2g", "D0u", "D1u", "D2u"]
    phi = sp.Symbol("phi", real=True)
    row = t.character_row("D2u")
    assert row[0] == 5 and row[2] == -5
    assert sp.simplify(row[1] - (1 + 2 * sp.cos(phi) + 2 * sp.cos(2 * phi))) == 0
    c = tensym.character_table("Dinfh", up_to=2)
    assert [i.label for i in c.real_irreps] == ["Σg+", "Σg-", "Πg", "Δg", "Σu+", "Σu-", "Πu", "Δu"]
    assert c.character_row("Πu")[:2] == (2, 2 * sp.cos(phi))
    assert c.irrep("Sigma_u^+").label == "Σu+"
    assert "Σg+" in str(c) and "\\Sigma" in c.latex()
    inf = tensym.character_table("Cinf", up_to=1)
    assert [i.label for i in inf.irreps] == ["Σ", "1Π", "2Π"]
