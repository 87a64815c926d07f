"""Renderers of tensor forms and tables: text, Markdown, JSON records, LaTeX strings.

The forms rendered here are checked elsewhere against the handbooks; these
tests check that every renderer shows exactly the form (no entry lost or
altered) in the layout it promises.
"""

import json

import pytest
import sympy as sp

import tensym
from tensym.errors import InvalidOptionError
from tensym.output import Table, as_record, latex_document, render
from tensym.output.symbols import hm_latex, mulliken_latex, schoenflies_latex, text_latex
from tensym.output.text import grid


def _form(prop, group):
    return tensym.tensor_form(prop, group)


# --- text -------------------------------------------------------------------------------
def test_text_heading_names_group_setting_and_constants():
    text = str(_form("piezoelectric_d", "32"))
    lines = text.splitlines()
    assert lines[0] == "piezoelectric strain coefficients d_iJ"
    # common practice (IEEE Std 176 / handbook setting): 32 with a 2-fold along x, setting symbol 321
    assert lines[1].startswith("point group 32 (D3), setting 321: ")
    assert "2-fold along x" in lines[1]
    assert "2 independent: d11, d14" in text


def test_text_matrix_shows_zeros_as_dots_and_every_entry():
    f = _form("piezoelectric_d", "32")
    text = str(f)
    rows = [ln.split() for ln in text.splitlines() if ln.startswith("  ") and ln.split()[0] in "123"
            and len(ln.split()) == 7]
    assert len(rows) == 3
    v = f.voigt
    for i, r in enumerate(rows):
        assert r[0] == str(i + 1)
        for j, cell in enumerate(r[1:]):
            if v[i, j] == 0:
                assert cell == "."
            else:
                assert sp.sympify(cell, locals={str(s): s for s in f.symbols}) == v[i, j]


def test_text_lists_every_tie_under_the_matrix():
    f = _form("elastic_stiffness", "6/mmm")
    text = str(f)
    head, rel = text.split("relations:\n")
    # Nye 1985, Table 9 (hexagonal): c66 = (c11 - c12)/2
    assert "  c66 = (c11 - c12)/2" in rel.splitlines()
    ties = [r for r in f.relations if r.rhs != 0]
    assert len(rel.strip().splitlines()) == len(ties)


def test_text_columns_are_aligned():
    text = str(_form("elastic_stiffness", "-3m"))
    block = [ln for ln in text.splitlines() if ln.startswith("  ") and ln.strip()[:1] in "123456"]
    block = block[:7] if block[0].strip().startswith("1  ") else block
    matrix = [ln for ln in text.splitlines()[4:11]]
    ends = {len(ln) for ln in matrix if ln.strip()}
    assert len(matrix) == 7 and len(ends) >= 1
    # right alignment: the last character of each column sits at the same place in every row
    header = matrix[0]
    col_ends = [i for i, ch in enumerate(header) if ch.isdigit() and (i + 1 == len(header) or header[i + 1] == " ")]
    for ln in matrix[1:]:
        for e in col_ends:
            assert e < len(ln) and ln[e] != " ", (ln, e)


def test_grid_kernel():
    assert grid([["0", "a"]], zero="0") == "  0  a"
    assert grid([["0", "a"]]) == "  .  a"


def test_third_order_elastic_text_shows_six_slices():
    text = str(_form("third_order_elastic", "m-3m"))
    assert sum(1 for ln in text.splitlines() if ln.strip().startswith("I = ")) == 6
    # Brugger 1965: 6 third-order constants for m-3m
    assert "6 independent: C111, C112, C123, C144, C155, C456" in text


def test_rank_eight_text_counts_instead_of_matrices():
    text = str(_form("fourth_order_elastic", "m-3m"))
    assert "Voigt labels:" in text and "relations:" in text


def test_spec_heading_describes_the_spec():
    f = tensym.tensor_form(tensym.TensorSpec(2, ["-ji"], axial=True), "4/m")
    assert str(f).splitlines()[0] == "rank-2 tensor, axial, T_ij = -T_ji"
    assert "every component vanishes" in str(f)


def test_continuous_group_heading():
    text = str(_form("elastic_stiffness", "Dinfh"))
    assert "continuous group inf/mm (D∞h)" in text.splitlines()[1]


# --- markdown and records ------------------------------------------------------------------
def test_markdown_table_has_a_row_per_voigt_row():
    f = _form("piezoelectric_e", "4mm")
    md = render(f, format="markdown")
    rows = [ln for ln in md.splitlines() if ln.startswith("| **")]
    assert len(rows) == 3 and all(ln.count("|") == 8 for ln in rows)
    assert "- `e24 = e15`" in md


@pytest.mark.parametrize("prop, group", [("elastic_compliance", "321"), ("piezoelectric_d", "-4m2"),
                                         ("electro_optic", "3m"), ("third_order_elastic", "6/mmm"),
                                         ("optical_activity", "SO(3)")])
def test_record_reads_back_to_the_same_form(prop, group):
    f = _form(prop, group)
    rec = json.loads(render(f, format="json"))
    names = {str(s): s for s in f.symbols}
    assert rec["symbols"] == list(names)
    assert rec["n_independent"] == f.n_independent
    back = sp.Array(sp.sympify(rec["voigt"], locals=names))
    assert back == sp.Array(f.voigt.tolist() if isinstance(f.voigt, sp.MatrixBase) else f.voigt)
    for r in rec["relations"]:
        assert sp.sympify(r["value"], locals=names) != 0


def test_record_is_a_new_object_each_time():
    f = _form("elastic_stiffness", "6mm")
    rec = as_record(f)
    rec["symbols"].append("junk")
    rec["voigt"][0][0] = "junk"
    again = as_record(f)
    assert "junk" not in again["symbols"] and again["voigt"][0][0] == "c11"


# --- LaTeX strings ---------------------------------------------------------------------------
def test_symbol_latex_spellings():
    # common practice (ITA Vol. A notation): overbars for rotoinversions, subscripts in Schoenflies
    assert hm_latex("-43m") == r"\bar{4}3m"
    assert hm_latex("6/m 2/m 2/m") == r"6/m\,2/m\,2/m"
    assert schoenflies_latex("C3h") == "C_{3h}"
    assert schoenflies_latex("D∞h") == r"D_{\infty h}"
    # common practice (Birss 1964 style): black-and-white groups G(H), grey groups G1'
    assert schoenflies_latex("D3d(D3)") == "D_{3d}(D_{3})" and schoenflies_latex("C4v1'") == "C_{4v}1'"
    assert hm_latex("-3'm'") == "\\bar{3}'m'"
    # Mulliken 1955: number and g/u as subscripts, primes kept
    assert mulliken_latex("T2g") == "T_{2g}"
    assert mulliken_latex("A1''") == "A_{1}''"
    assert text_latex("a_b & 5%") == r"a\_b \& 5\%"


def test_form_latex_fragment_has_matrix_and_relations():
    frag = _form("elastic_stiffness", "6mm").latex()
    assert frag.startswith("\\begin{gathered}") and frag.endswith("\\end{gathered}")
    assert "\\begin{pmatrix}" in frag
    assert r"c_{66} = \frac{c_{11} - c_{12}}{2}" in frag
    assert frag.count("\\begin{") == frag.count("\\end{")


def test_repr_latex_is_display_math():
    f = _form("pyroelectric", "mm2")
    assert f._repr_latex_() == "$$" + f.latex() + "$$"
    t = Table(title="t", columns=("a",), rows=(("1",),))
    assert t._repr_latex_().startswith("$$\\begin{array}")


def test_standalone_documents():
    f = _form("piezoelectric_d", "6mm")
    doc = f.latex(standalone=True)
    assert doc.startswith("\\documentclass") and doc.rstrip().endswith("\\end{document}")
    assert "\\usepackage{amsmath}" in doc and f.latex() in doc
    assert render(f, format="latex", standalone=True) == doc


def test_latex_document_of_several_results_and_text():
    doc = latex_document([_form("pyroelectric", "4mm"), "a note & more", tensym.tensor_form("thermal_expansion", "6")],
                         title="Two forms")
    assert doc.count("\\[\n") == 2 and "a note \\& more" in doc and "\\section*{Two forms}" in doc


# --- errors -------------------------------------------------------------------------------------
def test_render_rejects_unknown_format_listing_the_accepted_ones():
    with pytest.raises(InvalidOptionError, match="not one of text, latex, markdown, json"):
        render(_form("pyroelectric", "1"), format="html")


def test_render_rejects_standalone_outside_latex():
    with pytest.raises(InvalidOptionError, match="standalone=True needs format='latex'"):
        render(_form("pyroelectric", "1"), format="text", standalone=True)


def test_render_rejects_objects_it_does_not_know():
    with pytest.raises(InvalidOptionError, match="cannot render a int; tensym renders: .*TensorForm"):
        render(3)


def test_latex_document_errors():
    with pytest.raises(InvalidOptionError, match="at least one"):
        latex_document([])
    with pytest.raises(InvalidOptionError, match="cannot render a object"):
        latex_document([object()])


def test_table_checks_row_lengths():
    with pytest.raises(InvalidOptionError, match="has 1 cells; the table has 2 columns"):
        Table(title="", columns=("a", "b"), rows=(("x",),))
    with pytest.raises(InvalidOptionError, match="as many rows"):
        Table(title="", columns=("a",), rows=(("x",),), latex_rows=())


def test_table_is_frozen():
    t = Table(title="", columns=("a",), rows=(("x",),))
    with pytest.raises(AttributeError):
        t.title = "y"
