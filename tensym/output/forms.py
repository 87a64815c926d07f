"""Renderings of a TensorForm: text, LaTeX, Markdown and a JSON-ready record.

* Text: a heading (property, group, setting, independent constants), the Voigt
  matrix aligned with its Voigt indices, zeros shown as dots, then the
  relations (every tied component; the vanishing ones are the dots).
  Forms whose Voigt array has three indices (third-order elastic constants)
  are printed as slices; higher ones as the list of relations.
* LaTeX: math-mode content, ``[c_{IJ}] = (pmatrix)`` over the relations, in a
  ``gathered`` block (amsmath); with ``standalone=True`` a whole document.
* Markdown: a heading line, a pipe table (zeros as 0) and a list of relations.
* Record: plain dict of strings, lists and ints (``sympy.sstr`` of every entry,
  so that ``sympy.sympify`` reads each back).

Examples
--------
>>> import tensym
>>> from tensym.output.forms import form_text
>>> from tensym.groups.catalog import catalog_group
>>> from tensym.tensors.form import tensor_form
>>> print(form_text(tensor_form("pyroelectric", catalog_group("4mm"))))
pyroelectric coefficients p_i
point group 4mm (C4v), setting: 4-fold along z, mirror normals x, y and [110], [1-10]
1 independent: p3
<BLANKLINE>
      1
  1   .
  2   .
  3  p3
"""

import sympy as sp

from tensym.output.symbols import text_latex
from tensym.output.text import chunks, expr_latex, expr_text, grid, group_heading, group_heading_latex

__all__ = ["form_text", "form_latex", "form_markdown", "form_record", "index_letters", "title_latex", "spec_words"]


def index_letters(prop):
    """Index names of a property's Voigt array: capitals for contracted pairs.

    Examples
    --------
    >>> from tensym.tensors.catalog import get_property
    >>> index_letters(get_property("piezoelectric_d")), index_letters(get_property("electro_optic"))
    ('iJ', 'Ij')
    """
    letters = "ijklmnpq"
    return "".join(letters[n].upper() if len(g) == 2 else letters[n] for n, g in enumerate(prop.voigt_groups))


def _symbol_latex(prop):
    head = sp.latex(sp.Symbol(prop.symbol))
    return f"{head}_{{{index_letters(prop)}}}"


def title_latex(title):
    """A property title in LaTeX text mode, its ``x_ab`` words set in math.

    Examples
    --------
    >>> title_latex("dielectric permittivity epsilon_ij")
    'dielectric permittivity $\\\\epsilon_{ij}$'
    """
    out = []
    for word in str(title).split(" "):
        core = word.strip("(),;")
        if "_" in core and core.replace("_", "").isalnum():
            head, sub = core.split("_", 1)
            math = f"${sp.latex(sp.Symbol(head))}_{{{sub}}}$"
            out.append(word.replace(core, math))
        else:
            out.append(text_latex(word))
    return " ".join(out)


def _ties(form):
    return [r for r in form.relations if r.rhs != 0]


def _labels(n, pair):
    return [str(k + 1) for k in range(n)]


def _matrix_cells(m):
    return [[expr_text(m[i, j]) for j in range(m.cols)] for i in range(m.rows)]


def spec_words(spec, letter="T"):
    """Words describing a TensorSpec: rank, parity, index symmetry.

    Examples
    --------
    >>> from tensym.tensors import TensorSpec
    >>> spec_words(TensorSpec(2, ["-ji"], axial=True))
    'rank-2 tensor, axial, T_ij = -T_ji'
    """
    from tensym.tensors.spec import INDEX_LETTERS

    ident = INDEX_LETTERS[:spec.rank]
    words = [f"rank-{spec.rank} tensor"]
    if spec.axial:
        words.append("axial")
    if spec.time_odd:
        words.append("time-odd")
    for sym in spec.symmetries:
        sign = "-" if sym.startswith("-") else ""
        words.append(f"{letter}_{ident} = {sign}{letter}_{sym.lstrip('+-')}")
    return ", ".join(words)


def _title(form):
    if form.property.name == "tensor":
        return spec_words(form.spec, form.property.symbol)
    return form.property.title


def _heading_lines(form, *, convention=True):
    syms = ", ".join(map(str, form.symbols)) or "none (every component vanishes)"
    lines = [_title(form), group_heading(form.group)]
    conv = form.property.convention
    if convention and any(form.property.halved) and conv:
        lines.append("Voigt: " + conv)
    lines.append(f"{form.n_independent} independent: {syms}")
    return lines


def form_text(form):
    """Plain text of a TensorForm: heading, aligned matrix (zeros as dots), relations.

    Parameters
    ----------
    form : TensorForm

    Returns
    -------
    str

    Examples
    --------
    >>> from tensym.groups.catalog import catalog_group
    >>> from tensym.tensors.form import tensor_form
    >>> text = form_text(tensor_form("elastic_stiffness", catalog_group("6/mmm")))
    >>> print(text.splitlines()[-1])
      c66 = (c11 - c12)/2
    """
    lines = _heading_lines(form)
    v = form.voigt
    lines.append("")
    if isinstance(v, sp.MatrixBase):
        lines.append(grid(_matrix_cells(v), row_labels=_labels(v.rows, True), col_labels=_labels(v.cols, True)))
    elif len(v.shape) == 3:
        letters = index_letters(form.property)
        for k in range(v.shape[0]):
            m = sp.Matrix(v.shape[1], v.shape[2], lambda i, j: v[k, i, j])
            lines.append(f"  {letters[0]} = {k + 1}:")
            lines.append(grid(_matrix_cells(m), row_labels=_labels(m.rows, True), col_labels=_labels(m.cols, True)))
    else:
        lines.append(f"  Voigt labels: {len(form.zero_components)} vanish, {len(_ties(form))} are tied to the "
                     f"{form.n_independent} independent ones")
    ties = _ties(form)
    if ties:
        lines.append("")
        lines.append("relations:")
        lines.extend(f"  {r.lhs} = {expr_text(r.rhs)}" for r in ties)
    return "\n".join(lines)


def _pmatrix(m):
    body = " \\\\\n".join(" & ".join(expr_latex(x) for x in m.row(i)) for i in range(m.rows))
    return "\\begin{pmatrix}\n" + body + "\n\\end{pmatrix}"


def _relations_latex(rels, per_line=3):
    lines = []
    for chunk in chunks(rels, per_line):
        lines.append(", \\quad ".join(f"{sp.latex(r.lhs)} = {expr_latex(r.rhs)}" for r in chunk))
    return lines


def form_latex(form, *, standalone=False):
    """Math-mode LaTeX (amsmath) of a TensorForm; a whole document if ``standalone``.

    The fragment is a ``gathered`` block: ``[c_{IJ}] = (matrix)`` and, below,
    the relations, three per line.  Put it inside ``\\[ ... \\]`` or an
    ``equation`` environment.  Forms with a Voigt array of three or more
    indices give the independent constants and the relations instead of a matrix.

    Parameters
    ----------
    form : TensorForm
    standalone : bool
        Return a complete ``article`` document (amsmath) with a heading.

    Returns
    -------
    str

    Examples
    --------
    >>> from tensym.groups.catalog import catalog_group
    >>> from tensym.tensors.form import tensor_form
    >>> print(form_latex(tensor_form("dielectric_permittivity", catalog_group("4/m"))))
    \\begin{gathered}
    \\bigl[\\epsilon_{ij}\\bigr] = \\begin{pmatrix}
    \\epsilon_{11} & 0 & 0 \\\\
    0 & \\epsilon_{11} & 0 \\\\
    0 & 0 & \\epsilon_{33}
    \\end{pmatrix} \\\\[1ex]
    \\epsilon_{22} = \\epsilon_{11}
    \\end{gathered}
    """
    v = form.voigt
    rows = []
    if isinstance(v, sp.MatrixBase):
        rows.append("\\bigl[" + _symbol_latex(form.property) + "\\bigr] = " + _pmatrix(v))
    else:
        syms = [sp.latex(s) for s in form.symbols]
        if syms:
            first = chunks(syms, 8)
            rows.append("\\text{independent: } " + ", ".join(first[0]))
            rows.extend(", ".join(c) for c in first[1:])
        else:
            rows.append("\\text{every component vanishes}")
    rows.extend(_relations_latex(_ties(form)))
    frag = "\\begin{gathered}\n" + " \\\\[1ex]\n".join(rows[:1]) + (
        " \\\\[1ex]\n" + " \\\\\n".join(rows[1:]) if len(rows) > 1 else "") + "\n\\end{gathered}"
    if not standalone:
        return frag
    from tensym.output.document import latex_document

    return latex_document([form])


def form_heading_latex(form):
    """Text-mode LaTeX heading of a form (property, group and setting)."""
    syms = ", ".join(f"${sp.latex(s)}$" for s in form.symbols) or "none"
    return (title_latex(_title(form)) + " in " + group_heading_latex(form.group)
            + f"; {form.n_independent} independent: " + syms + ".")


def form_markdown(form):
    """Markdown of a TensorForm: heading, pipe table with zeros as 0, relations as a list.

    Examples
    --------
    >>> from tensym.groups.catalog import catalog_group
    >>> from tensym.tensors.form import tensor_form
    >>> print(form_markdown(tensor_form("pyroelectric", catalog_group("6mm"))).splitlines()[2])
    | | 1 |
    """
    head = _heading_lines(form, convention=False)
    lines = [f"**{head[0]}**, {head[1]}; {head[2]}", ""]
    v = form.voigt
    if isinstance(v, sp.MatrixBase):
        lines.append("| | " + " | ".join(_labels(v.cols, True)) + " |")
        lines.append("|---|" + "---:|" * v.cols)
        for i in range(v.rows):
            lines.append(f"| **{i + 1}** | " + " | ".join(expr_text(v[i, j]) for j in range(v.cols)) + " |")
    ties = _ties(form)
    if ties:
        lines.append("")
        lines.extend(f"- `{r.lhs} = {expr_text(r.rhs)}`" for r in ties)
    return "\n".join(lines)


def _nested(v):
    def walk(x):
        return [walk(y) for y in x] if isinstance(x, list) else sp.sstr(x)

    return walk(v.tolist())


def group_record(group):
    """Plain dict naming a group (symbol, Schoenflies, setting symbol and words, order)."""
    order = getattr(group, "order", None)
    return {
        "symbol": getattr(group, "symbol", "") or "",
        "schoenflies": getattr(group, "schoenflies", "") or "",
        "setting_symbol": getattr(group, "setting_symbol", "") or "",
        "setting": getattr(group, "setting", "") or "",
        "order": int(order) if order is not None and order != sp.oo else None,
    }


def form_record(form):
    """JSON-ready dict of a TensorForm (every expression as a sympy string).

    Examples
    --------
    >>> from tensym.groups.catalog import catalog_group
    >>> from tensym.tensors.form import tensor_form
    >>> rec = form_record(tensor_form("piezoelectric_d", catalog_group("6mm")))
    >>> rec["symbols"], rec["voigt"][0][4], rec["relations"][0]
    (['d15', 'd31', 'd33'], 'd15', {'component': 'd24', 'value': 'd15'})
    """
    v = form.voigt
    if isinstance(v, sp.MatrixBase):
        nested = _nested(v)
        shape = [v.rows, v.cols]
    else:
        shape = [int(n) for n in v.shape]
        nested = None if len(shape) > 3 else _nested(v)
    return {
        "kind": "tensor_form",
        "property": form.property.name,
        "title": _title(form),
        "convention": form.property.convention,
        "rank": form.spec.rank,
        "axial": bool(getattr(form.spec, "axial", False)),
        "time_odd": bool(getattr(form.spec, "time_odd", False)),
        "group": group_record(form.group),
        "n_independent": form.n_independent,
        "symbols": [str(s) for s in form.symbols],
        "voigt_shape": shape,
        "voigt": nested,
        "relations": [{"component": str(r.lhs), "value": sp.sstr(r.rhs)} for r in _ties(form)],
        "zero_components": list(form.zero_components),
    }
