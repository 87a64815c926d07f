"""Renderers of the reps and data results: every type in every format, records that read back."""

import json

import numpy as np
import pytest
import sympy as sp

import tensym
from tensym.output import as_record, latex_document, render
from tensym.output.dispatch import FORMATS


def _cubic_stiffness():
    c = np.zeros((6, 6))
    c[:3, :3] = 50.0
    c[[0, 1, 2], [0, 1, 2]] = 160.0
    c[[3, 4, 5], [3, 4, 5]] = 80.0
    return c


@pytest.fixture(scope="module")
def results():
    c = _cubic_stiffness()
    eps = tensym.rotate_values(np.diag([1.0, 1.0, 2.0]), tensym.rotation_from_axis_angle([1, 0, 0], 30.0),
                               "dielectric_permittivity")
    return {
        "table": tensym.character_table("4mm"),
        "complex_table": tensym.character_table("3"),
        "continuous_table": tensym.character_table("Cinfv"),
        "decomposition": tensym.decompose(tensym.harmonics(2), "m-3m"),
        "correlation": tensym.correlate("m-3m", "4mm"),
        "basis": tensym.symmetry_adapted(tensym.harmonics(2), "4mm"),
        "check": tensym.check_tensor(c, "elastic_stiffness", "m-3m", units="GPa"),
        "batch": tensym.check_tensors(np.stack([c, 1.02 * c]), "elastic_stiffness", "m-3m", units="GPa"),
        "orientation": tensym.orient(eps, "dielectric_permittivity", "4/mmm"),
        "finding": tensym.find_symmetry(eps, "dielectric_permittivity"),
    }


KINDS = ["table", "complex_table", "continuous_table", "decomposition", "correlation", "basis", "check", "batch",
         "orientation", "finding"]


@pytest.mark.parametrize("kind", KINDS)
@pytest.mark.parametrize("fmt", FORMATS)
def test_every_result_renders_in_every_format(results, kind, fmt):
    out = render(results[kind], format=fmt)
    assert isinstance(out, str) and out.strip()
    if fmt == "json":
        assert isinstance(json.loads(out), dict) and json.loads(out)["kind"]
    if fmt == "latex":
        assert out.count("\\begin{") == out.count("\\end{")
        assert "\\documentclass" not in out


@pytest.mark.parametrize("kind", KINDS)
def test_every_result_goes_into_a_document(results, kind):
    doc = render(results[kind], format="latex", standalone=True)
    assert doc.startswith("\\documentclass") and doc.rstrip().endswith("\\end{document}")


def test_character_table_record_reads_back(results):
    t = results["table"]
    rec = as_record(t)
    # Cotton 1990, Appendix (C4v): E row 2, 0, -2, 0, 0
    e = [r for r in rec["irreps"] if r["label"] == "E"][0]
    assert [sp.sympify(x) for x in e["characters"]] == [2, 0, -2, 0, 0]
    assert [c["size"] for c in rec["classes"]] == [1, 2, 1, 2, 2]
    for r, irr in zip(rec["irreps"], t.irreps):
        assert [sp.sympify(x) for x in r["characters"]] == list(irr.characters)


def test_complex_pair_characters_read_back(results):
    rec = as_record(results["complex_table"])
    w = sp.expand_complex(sp.exp(2 * sp.pi * sp.I / 3))
    one_e = [sp.sympify(x) for x in rec["irreps"][1]["characters"]]
    # common practice (Cotton, C3): the complex pair 1E has characters 1, w, w^2 (or the conjugates)
    assert {sp.simplify(one_e[1] - w) == 0, sp.simplify(one_e[1] - w.conjugate()) == 0} == {True, False}


def test_decomposition_text_and_record(results):
    d = results["decomposition"]
    # Bethe 1929: l = 2 in Oh splits into Eg + T2g
    assert render(d) == "Eg + T2g  (group m-3m, dimension 5)"
    assert render(d, format="latex") == "E_{g} \\oplus T_{2g}"
    rec = as_record(d)
    assert [(t["label"], t["multiplicity"]) for t in rec["terms"]] == [("Eg", 1), ("T2g", 1)]


def test_correlation_latex_lists_every_row(results):
    t = results["correlation"]
    tex = render(t, format="latex")
    assert tex.count("\\\\") == len(t.labels)          # header plus rows, the last without a break
    # Bethe 1929 / Koster et al. 1963: T2g of Oh goes to B2 + E of C4v (4-fold along z)
    assert "T_{2g} & B_{2} \\oplus E" in tex


def test_basis_record(results):
    rec = as_record(results["basis"])
    b1 = [s for s in rec["sets"] if s["irrep"] == "B1"][0]
    x, y = sp.symbols("x y")
    # Cotton 1990, C4v table: x^2 - y^2 belongs to B1
    assert sp.simplify(sp.sympify(b1["partners"][0]) / (x**2 - y**2)).is_number


def test_check_report_renderers_delegate(results):
    r = results["check"]
    assert render(r) == r.text()
    assert render(r, format="latex") == r.latex()
    assert json.loads(render(r, format="json")) == json.loads(json.dumps(r.record()))


def test_batch_table_has_a_row_per_tensor(results):
    b = results["batch"]
    text = render(b)
    assert text.splitlines()[0].startswith("2 tensors of elastic_stiffness checked against m-3m: 2 consistent")
    rec = as_record(b)
    assert rec["kind"] == "batch_check" and len(rec["rows"]) == 2
    assert float(rec["rows"][1]["c11"]) == pytest.approx(1.02 * 160.0, rel=1e-4)


def test_orientation_latex_shows_the_rotation(results):
    o = results["orientation"]
    tex = render(o, format="latex")
    assert "R = \\begin{pmatrix}" in tex and "^\\circ" in tex


def test_finding_lists_every_class(results):
    f = results["finding"]
    tex = render(f, format="latex")
    assert tex.count("\\text{yes}") == len(f.candidates)
    assert tex.count("\\text{no}") == len(f.rejected)
    md = render(f, format="markdown")
    assert md.count("\n| ") == len(f.candidates) + len(f.rejected) + 1


def test_one_document_of_everything(results):
    doc = latex_document(list(results.values()), title="all")
    assert doc.count("\\noindent") >= len(results)
