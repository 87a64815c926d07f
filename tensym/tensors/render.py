"""Plain-text and LaTeX renderings of a TensorForm (used by its methods).

Examples
--------
>>> import tensym
>>> print(tensym.tensor_form("pyroelectric", "4mm"))
pyroelectric coefficients p_i in 4mm (C4v); 1 independent: p3
  .
  .
  p3
vanishing: p1, p2
"""

import sympy as sp

__all__ = ["form_text", "form_latex", "matrix_text", "LATEX_PREAMBLE"]

LATEX_PREAMBLE = "\\documentclass{article}\n\\usepackage{amsmath}\n\\usepackage{amssymb}\n\\begin{document}\n"
LATEX_END = "\n\\end{document}\n"


def _heading(form):
    g = form.group
    name = getattr(g, "symbol", "") or "unnamed group"
    sch = getattr(g, "schoenflies", "")
    gname = f"{name} ({sch})" if sch and sch != name else name
    syms = ", ".join(map(str, form.symbols)) or "none"
    return f"{form.property.title} in {gname}; {form.n_independent} independent: {syms}"


def matrix_text(m, zero="."):
    """Aligned text of a sympy Matrix, zeros shown as ``zero``."""
    rows = [[(zero if v == 0 else sp.sstr(v)) for v in m.row(i)] for i in range(m.rows)]
    widths = [max(len(r[j]) for r in rows) for j in range(m.cols)]
    return "\n".join("  " + "  ".join(c.rjust(w) for c, w in zip(r, widths)).rstrip() for r in rows)


def _ties(form):
    return [r for r in form.relations if r.rhs != 0]


def form_text(form):
    """Readable text: heading, matrix with zeros as dots, relations, vanishing components."""
    lines = [_heading(form)]
    v = form.voigt
    if isinstance(v, sp.MatrixBase):
        lines.append(matrix_text(v))
    else:
        lines.append("  independent: " + (", ".join(map(str, form.symbols)) or "none"))
    ties = _ties(form)
    if ties:
        lines.append("relations:")
        lines.extend(f"  {sp.sstr(r.lhs)} = {sp.sstr(r.rhs)}" for r in ties)
    zeros = form.zero_components
    if zeros and not isinstance(v, sp.MatrixBase):
        lines.append(f"vanishing: {len(zeros)} components")
    elif zeros:
        lines.append("vanishing: " + ", ".join(zeros))
    return "\n".join(lines)


def form_latex(form, *, standalone=False):
    """LaTeX (amsmath) of the Voigt matrix and the relations; a full document if standalone."""
    v = form.voigt
    parts = []
    if isinstance(v, sp.MatrixBase):
        body = " \\\\\n".join(" & ".join(sp.latex(x) for x in v.row(i)) for i in range(v.rows))
        parts.append("\\begin{pmatrix}\n" + body + "\n\\end{pmatrix}")
    ties = _ties(form)
    if ties:
        rel = ", \\quad ".join(f"{sp.latex(r.lhs)} = {sp.latex(r.rhs)}" for r in ties)
        parts.append("\\text{with } " + rel if parts else rel)
    if not parts:
        parts.append("\\text{independent: } " + ", ".join(sp.latex(s) for s in form.symbols))
    frag = ",\\qquad ".join(parts) if len(parts) == 2 and len(ties) <= 3 else " \\\\\n".join(parts)
    if len(parts) == 2 and len(ties) > 3:
        frag = "\\begin{gathered}\n" + frag + "\n\\end{gathered}"
    if standalone:
        gname = getattr(form.group, "symbol", "")
        title = form.property.title.replace("_", "\\_")
        return (LATEX_PREAMBLE + f"\\noindent {title} in ${gname}$:\n\\[\n" + frag + "\n\\]" + LATEX_END)
    return frag
