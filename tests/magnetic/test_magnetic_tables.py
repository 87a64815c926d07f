"""Character tables of magnetic point groups: grey groups G1' = G x {1, 1'}, black-and-white groups as their parent.

Regressions: ``character_table("mmm1'")`` raised "could not separate the central characters" (Burnside's
random class-algebra combination tied eigenvalues for 16 one-dimensional irreps) and ``character_table("41'")``
gave duplicate labels (Mulliken labels read from the spatial parts alone cannot tell Gamma from Gamma x 1').
"""

import numpy as np
import pytest
import sympy as sp

import tensym
from tensym.errors import UnknownIrrepError
from tensym.groups.magnetic import magnetic_point_group, magnetic_point_groups, parent_group, unitary_subgroup
from tensym.groups.operations import Operation
from tensym.reps.characters import class_data, exact_characters
from tensym.reps.magnetic import magnetic_decompose
from tensym.reps.table import finite_table

ALL = magnetic_point_groups()
GREY = magnetic_point_groups(kind="grey")
BLACK_WHITE = magnetic_point_groups(kind="black-and-white")


def _spatial(op):
    return Operation(op.matrix, False)


def test_grey_tables_no_longer_fail():
    # the two reported failures
    t = tensym.character_table("mmm1'")
    assert len(t.irreps) == len(t.classes) == 16
    t = tensym.character_table("41'")
    assert t.labels == ("A+", "B+", "1E+", "2E+", "A-", "B-", "1E-", "2E-")
    assert [i.label for i in t.real_irreps] == ["A+", "B+", "E+", "A-", "B-", "E-"]


@pytest.mark.parametrize("rec", GREY, ids=lambda r: r.symbol)
def test_grey_table_is_the_product_with_time_reversal(rec):
    # G1' = G x {1, 1'} (Bradley & Cracknell 1972, ch. 7; from memory): classes C and C 1', irreps
    # Gamma+ with chi(g 1') = chi(g) and Gamma- with chi(g 1') = -chi(g)
    g = magnetic_point_group(rec.symbol)
    t = tensym.character_table(g)
    h = tensym.character_table(unitary_subgroup(g))
    n = len(h.classes)
    assert len(t.classes) == 2 * n and t.order == 2 * h.order
    assert [c.name for c in t.classes[:n]] == [c.name for c in h.classes]
    assert [c.name for c in t.classes[n:]] == ["θ"] + [c.name + "·θ" for c in h.classes[1:]]
    for c in t.classes:
        assert all(g.operations[m].time_reversal == c.representative.time_reversal for m in c.indices)
        assert c.representative.time_reversal == c.name.endswith("θ")
    assert t.labels == tuple(lab + s for s in "+-" for lab in h.labels)
    for irr in t.irreps:
        base = h.irrep(irr.label[:-1])
        sign = 1 if irr.label.endswith("+") else -1
        assert irr.characters == base.characters + tuple(sign * v for v in base.characters)
        assert irr.real_label == base.real_label + irr.label[-1]
        # the character at 1' itself states the time parity
        assert t.character(irr.label, Operation(sp.ImmutableMatrix(sp.eye(3)), True)) == sign * irr.dim


@pytest.mark.parametrize("symbol", ["mmm1'", "4/mmm1'", "6/mmm1'", "-3m1'"])
def test_burnside_separates_many_one_dimensional_irreps(symbol):
    # independent route: Burnside's method on the grey group's own Cayley table (no product construction)
    # must give the same rows; with small random weights it could not separate 16 one-dimensional irreps
    g = magnetic_point_group(symbol)
    t = tensym.character_table(g)
    data = class_data(g)
    rows = exact_characters(data)
    pos = [data.class_of[c.indices[0]] for c in t.classes]
    burnside = {tuple(sp.nsimplify(row[p].to_sympy()) for p in pos) for row in rows}
    ours = {tuple(sp.nsimplify(v) for v in i.characters) for i in t.irreps}
    assert burnside == ours


@pytest.mark.parametrize("rec", BLACK_WHITE, ids=lambda r: r.symbol)
def test_black_and_white_table_is_the_parent_table_through_spatial_parts(rec):
    # M = H + (G - H)1' is isomorphic to G by g' -> g, so its irreps are G's, labelled as in G
    g = magnetic_point_group(rec.symbol)
    t = tensym.character_table(g)
    p = parent_group(g)
    tp = tensym.character_table(p)
    assert t.labels == tp.labels
    for c in t.classes:
        spatial = _spatial(c.representative)
        cp = tp.class_of(spatial)
        primed = c.representative.time_reversal
        assert c.name == (cp.name + "·θ" if primed else cp.name)
        for irr in t.irreps:
            assert irr.characters[t.classes.index(c)] == tp.character(irr.label, spatial)


def test_black_and_white_class_names():
    # 4'/m = 2/m + (4+, 4-, -4+, -4-)1' (Birss 1964, from memory): the 4-folds and -4 carry time reversal
    t = tensym.character_table("4'/m")
    assert [c.name for c in t.classes] == ["E", "C4·θ", "C2", "C4³·θ", "i", "S4³·θ", "σh", "S4·θ"]
    # -3'm' = 32 + (-1, -3, m)1': every improper operation carries time reversal (Birss 1964; from memory)
    t = tensym.character_table("-3'm'")
    assert [c.name for c in t.classes] == ["E", "2C3", "3C2", "i·θ", "2S6·θ", "3σd·θ"]
    assert t.irrep("Eg").characters == (2, -1, 0, 2, -1, 0)  # Eg of D3d (Cotton 1990, Appendix IIA; from memory)


def test_time_reversal_mark_is_not_a_prime():
    # C2' already means the perpendicular 2-folds in Mulliken class names (common practice): the class of
    # the time-reversed C2' is C2'·θ, and the two never share a name
    names = [c.name for c in tensym.character_table("4221'").classes]
    assert "2C2'" in names and "2C2'·θ" in names and "2C2''·θ" in names
    names = [c.name for c in tensym.character_table("42'2'").classes]
    assert names == ["E", "2C4", "C2", "2C2'·θ", "2C2''·θ"]


@pytest.mark.parametrize("rec", ALL, ids=lambda r: r.symbol)
def test_orthogonality_relations_for_every_magnetic_group(rec):
    # row and column orthogonality (Tinkham 1964, ch. 3; common practice), in floating point on the exact
    # values (a wrong value is off by at least a root-of-unity difference, far above 1e-9)
    t = tensym.character_table(rec.symbol)
    assert t.order == rec.order
    x = np.array([[complex(v) for v in i.characters] for i in t.irreps])
    sizes = np.array([c.size for c in t.classes])
    assert sizes.sum() == rec.order and len(t.irreps) == len(t.classes)
    assert sum(i.dim**2 for i in t.irreps) == rec.order
    assert np.allclose((x * sizes) @ x.conj().T, rec.order * np.eye(len(x)), atol=1e-9)
    assert np.allclose(x.conj().T @ x, np.diag(rec.order / sizes), atol=1e-9)
    assert len(set(t.labels)) == len(t.labels) and len({c.name for c in t.classes}) == len(t.classes)
    assert sorted(m for c in t.classes for m in c.indices) == list(range(rec.order))


def test_grey_irrep_matrices_are_a_representation():
    g = magnetic_point_group("4mm1'")
    t = tensym.character_table(g)
    ops = g.operations
    for label in ("E-", "E+", "B2-"):
        mats = t.matrices(label)
        assert len(mats) == len(ops)
        for a in range(len(ops)):
            assert mats[a].trace() == t.character(label, ops[a])
            assert mats[a] * mats[a].T == sp.eye(mats[a].shape[0])  # real orthogonal
            for b in range(0, len(ops), 3):
                ab = g.index(ops[a] @ ops[b])
                assert mats[a] * mats[b] == mats[ab]


def test_grey_labels_text_and_latex():
    t = tensym.character_table("-6m21'")
    assert t.irrep("a1'-").label == "A1'-" and t.irrep("A_1''+").label == "A1''+"
    assert t.irrep("E''-").latex == "{E^{\\prime\\prime}}^{-}"  # braced: no double superscript
    assert tensym.character_table("m-3m1'").irrep("T1u-").latex == "T_{1u}^{-}"
    pair = tensym.character_table("31'")
    assert pair.irrep("1E-").latex == "{}^{1}E^{-}" and pair.irrep("E-").latex == "E^{-}"
    assert "real forms: E+ = 1E+ + 2E+, E- = 1E- + 2E-" in str(pair)
    assert "\\theta" in t.latex()
    with pytest.raises(UnknownIrrepError, match="nearest: .*A1'"):
        t.irrep("A1'")
    assert repr(tensym.character_table("11'")) == "<CharacterTable 11': 2 classes, irreps A+ A->"


def test_linear_decomposition_reads_the_magnetic_table():
    # the 'linear' breakdown of magnetic_decompose is over character_table(M): same labels, valid LaTeX
    for sym in ("-6m21'", "m1'", "-3'm'", "6/mmm1'"):
        t = tensym.character_table(sym)
        for name in ("magnetization", "piezomagnetic", "elastic_stiffness"):
            lin = magnetic_decompose(name, sym).linear
            assert set(lin.labels) <= set(t.all_labels())
            assert all("^{\\prime}^" not in tex and "}^{\\prime\\prime}^" not in tex for tex in lin.latex_labels)
            assert sum(m * t.irrep(lab).dim for lab, m in zip(lin.labels, lin.multiplicities)) == lin.dim


def test_reoriented_grey_group_keeps_its_labels():
    q = tensym.rotation_from_axes(new_z=[1, 1, 1], new_x=[1, -1, 0])
    g = tensym.reorient("-3m1'", q)
    t = finite_table(g)
    assert [i.label for i in t.real_irreps] == [lab + s for s in "+-"
                                                for lab in ("A1g", "A2g", "Eg", "A1u", "A2u", "Eu")]
    assert [c.name for c in t.classes][:7] == ["E", "2C3", "3C2", "i", "2S6", "3σd", "θ"]
