"""The LaTeX of every result type compiles with pdflatex.

Two documents are compiled: one made by hand with only amsmath, holding each
math-mode fragment in a display (the promise of ``latex()``), and one made by
``latex_document`` (the promise of ``standalone=True``).  Skipped, with the
reason shown, where pdflatex is not installed.
"""

import shutil
import subprocess

import pytest

import tensym
from tensym.output import latex_document, render
from tensym.output.listings import group_table, operations_table, property_table

PDFLATEX = shutil.which("pdflatex")
pytestmark = pytest.mark.skipif(
    PDFLATEX is None,
    reason="pdflatex not installed (Debian: apt-get install texlive-latex-base texlive-latex-recommended)",
)

FORMS = [
    ("elastic_stiffness", "6mm"),
    ("elastic_compliance", "321"),
    ("piezoelectric_d", "-4m2"),
    ("electro_optic", "3m"),
    ("second_harmonic_kleinman", "3m"),
    ("dielectric_permittivity", "121"),
    ("optical_activity", "inf2"),
    ("pyroelectric", "m-3m"),
    ("third_order_elastic", "6/mmm"),
    ("magnetoelectric", "-3'm'"),
]


def _results():
    out = [tensym.tensor_form(p, g) for p, g in FORMS]
    out.append(tensym.tensor_form(tensym.TensorSpec(3, ["-jik"], axial=True), "4mm"))
    out += [group_table(which="continuous"), group_table(which="magnetic"), property_table(),
            operations_table("3m"), operations_table("4'/m'm'm")]
    out += _layer_results()
    return out


def _layer_results():
    """One result of every type of the reps and data layers."""
    import numpy as np

    c = np.zeros((6, 6))
    c[:3, :3] = 50.0
    c[[0, 1, 2], [0, 1, 2]] = 160.0
    c[[3, 4, 5], [3, 4, 5]] = 80.0
    c[0, 5] = c[5, 0] = 2.0
    turned = tensym.rotate_values(c, tensym.rotation_from_axis_angle([1, 2, 3], 17.0), "elastic_stiffness")
    return [
        tensym.character_table("4mm"), tensym.character_table("3"), tensym.character_table("Dinfh"),
        tensym.decompose("elastic_stiffness", "m-3m"), tensym.correlate("m-3m", "-3m"),
        tensym.symmetry_adapted(tensym.harmonics(2), "-3m"),
        tensym.check_tensor(c, "elastic_stiffness", "m-3m", units="GPa"),
        tensym.check_tensors(np.stack([c, 1.01 * c]), "elastic_stiffness", "m-3m", units="GPa"),
        tensym.orient(turned, "elastic_stiffness", "m-3m"),
        tensym.find_symmetry(tensym.rotate_values(np.diag([1.0, 1.0, 2.0]), tensym.rotation_from_axis_angle(
            [1, 0, 0], 30.0), "dielectric_permittivity"), "dielectric_permittivity"),
    ]


def _compile(tmp_path, name, source):
    tex = tmp_path / f"{name}.tex"
    tex.write_text(source, encoding="utf-8")
    for _ in range(2):  # longtable settles its column widths on the second run
        run = subprocess.run(
            [PDFLATEX, "-interaction=nonstopmode", "-halt-on-error", tex.name],
            cwd=tmp_path, capture_output=True, text=True, timeout=120,
        )
        assert run.returncode == 0, run.stdout[-3000:]
    log = (tmp_path / f"{name}.log").read_text(encoding="latin-1")
    assert "Undefined control sequence" not in log
    assert (tmp_path / f"{name}.pdf").stat().st_size > 1000
    return log


def test_fragments_compile_with_amsmath_only(tmp_path):
    body = "\n\n".join("\\[\n" + render(r, format="latex") + "\n\\]" for r in _results())
    source = "\\documentclass{article}\n\\usepackage{amsmath}\n\\begin{document}\n" + body + "\n\\end{document}\n"
    _compile(tmp_path, "fragments", source)


def test_standalone_documents_compile(tmp_path):
    results = _results()
    log = _compile(tmp_path, "document", latex_document(results + ["Closing words with 100% & <111>."],
                                                       title="All result types"))
    assert "Output written" in log
    _compile(tmp_path, "single", results[0].latex(standalone=True))
