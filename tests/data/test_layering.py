"""The data layer renders through tensym.display and never imports tensym.output.

Regression: tensym/data/render.py took LATEX_PREAMBLE / LATEX_END through a lazy ``__getattr__`` of
tensym.tensors.render, which imported tensym.output, so the data layer reached into the output layer
(the layering of DESIGN.md: output/ sits above data/ and uses its results, never the other way).
"""

import ast
import json
from pathlib import Path

import numpy as np

import tensym
import tensym.tensors.render
from tensym.output import render

DATA = Path(tensym.__file__).parent / "data"


def _imported_modules(path):
    tree = ast.parse(path.read_text(encoding="utf-8"))
    for node in ast.walk(tree):
        if isinstance(node, ast.Import):
            yield from (a.name for a in node.names)
        elif isinstance(node, ast.ImportFrom) and node.module:
            yield node.module
            yield from (f"{node.module}.{a.name}" for a in node.names)


def test_data_modules_never_import_output():
    files = sorted(DATA.glob("*.py"))
    assert files
    for path in files:
        bad = [m for m in _imported_modules(path) if m == "tensym.output" or m.startswith("tensym.output.")]
        assert not bad, (path.name, bad)


def test_tensors_render_has_no_document_frame_shim():
    assert not hasattr(tensym.tensors.render, "LATEX_PREAMBLE")
    assert not hasattr(tensym.tensors.render, "LATEX_END")
    assert set(tensym.tensors.render.__all__) == {"form_text", "form_latex"}


def _report():
    c = np.zeros((6, 6))
    c[:3, :3] = 50.0
    c[[0, 1, 2], [0, 1, 2]] = 160.0
    c[[3, 4, 5], [3, 4, 5]] = 80.0
    c[0, 3] = c[3, 0] = 3.0
    return tensym.check_tensor(c, "elastic_stiffness", "m-3m", sigma=np.full((6, 6), 0.5), units="GPa")


def test_standalone_check_document_comes_from_the_installed_renderer():
    r = _report()
    doc = r.latex(standalone=True)
    assert doc == render(r, format="latex", standalone=True)
    assert doc.startswith("\\documentclass") and doc.rstrip().endswith("\\end{document}")
    # the report's content, its verdict, units and reasons are all in the document
    assert r.latex() in doc and "\\textbf{inconsistent}" in doc and "GPa" in doc
    assert all(w.split()[0] in doc for w in r.reasons)
    assert not r.latex().startswith("\\documentclass")


def test_other_data_results_render_documents_through_the_hook():
    # the Orientation and SymmetryFinding documents go the same way (tensym.display.show)
    o = tensym.orient(np.diag([2.0, 2.0, 3.0]), "dielectric_permittivity", "4/mmm")
    assert o.latex(standalone=True) == render(o, format="latex", standalone=True)
    f = tensym.find_symmetry(np.eye(3) * 4.0, "thermal_conductivity")
    assert f.latex(standalone=True).startswith("\\documentclass")
    assert json.loads(render(f, format="json"))["kind"] == "symmetry_finding"
