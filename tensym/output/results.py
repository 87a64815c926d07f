"""Renderers for the result types of the reps and data layers.

Each block registers a result type only when its module exists in this
installation of tensym, so that output/ never depends on a layer that is not
there.  LaTeX follows the rule of the whole package: ``latex`` gives
math-mode content (an ``array`` for tables), ``standalone=True`` a document.

Examples
--------
>>> import tensym
>>> from tensym.output.results import character_table_text
>>> from tensym.reps.table import finite_table
>>> print(character_table_text(finite_table(tensym.groups.point_group("mm2"))).splitlines()[0])
character table of point group mm2 (C2v), setting: 2-fold along z, mirror normals x and y; order 4
"""

import numpy as np
import sympy as sp

from tensym.output.forms import group_record
from tensym.output.symbols import text_latex
from tensym.output.text import group_heading, group_heading_latex

__all__ = [
    "register_all",
    "character_table_text",
    "character_table_latex",
    "character_table_markdown",
    "character_table_record",
    "continuous_table_latex",
    "decomposition_text",
    "decomposition_record",
    "correlation_latex",
    "basis_record",
    "orientation_latex",
    "finding_latex",
    "batch_table",
]


# --- character tables -------------------------------------------------------------------------
def _ct_heading(t):
    return f"character table of {group_heading(t.group)}; order {t.order}"


def _ct_rows(t, real):
    return t.real_irreps if real else t.irreps


def character_table_text(t, *, real=False):
    """Text of a character table: a heading line with the group and setting, then the table.

    Parameters
    ----------
    t : CharacterTable
    real : bool
        Combine complex-conjugate pairs into their real two-dimensional forms.

    Returns
    -------
    str
    """
    return _ct_heading(t) + "\n" + t.text(real=real)


def _char_latex(v):
    return sp.latex(sp.nsimplify(v)) if v != 0 else "0"


def character_table_latex(t, *, standalone=False, real=False):
    """Math-mode LaTeX of a character table: an ``array`` with the classes as columns.

    Parameters
    ----------
    t : CharacterTable
    standalone : bool
        A complete document (amsmath) with the heading.
    real : bool
        Combine complex-conjugate pairs.

    Returns
    -------
    str

    Examples
    --------
    >>> import tensym
    >>> from tensym.reps.table import finite_table
    >>> print(character_table_latex(finite_table(tensym.groups.point_group("2"))))
    \\begin{array}{l|rr}
    C_{2} & E & C_{2} \\\\
    \\hline
    A & 1 & 1 \\\\
    B & 1 & -1
    \\end{array}
    """
    from tensym.output.symbols import schoenflies_latex

    if standalone:
        from tensym.output.document import latex_document

        return latex_document([t]) if not real else latex_document([_RealView(t)])
    cls = t.classes
    sch = getattr(t.group, "schoenflies", "") or ""
    corner = schoenflies_latex(sch) if sch else "G"
    lines = [" & ".join([corner] + [c.latex for c in cls]) + " \\\\", "\\hline"]
    rows = _ct_rows(t, real)
    for n, irr in enumerate(rows):
        end = " \\\\" if n < len(rows) - 1 else ""
        lines.append(" & ".join([irr.latex] + [_char_latex(v) for v in irr.characters]) + end)
    return "\\begin{array}{l|" + "r" * len(cls) + "}\n" + "\n".join(lines) + "\n\\end{array}"


class _RealView:
    """A character table shown with its complex pairs combined (for documents)."""

    def __init__(self, table):
        self.table = table

    def latex(self, *, standalone=False):
        return character_table_latex(self.table, real=True, standalone=standalone)


def character_table_markdown(t, *, real=False):
    """Markdown pipe table of a character table (characters as sympy strings).

    Examples
    --------
    >>> import tensym
    >>> from tensym.reps.table import finite_table
    >>> print(character_table_markdown(finite_table(tensym.groups.point_group("-1"))).splitlines()[2])
    | | E | i |
    """
    cls = t.classes
    lines = [f"**{_ct_heading(t)}**", ""]
    lines.append("| | " + " | ".join(c.name for c in cls) + " |")
    lines.append("|---|" + "---:|" * len(cls))
    for irr in _ct_rows(t, real):
        lines.append(f"| **{irr.label}** | " + " | ".join(sp.sstr(v) for v in irr.characters) + " |")
    return "\n".join(lines)


def character_table_record(t):
    """JSON-ready dict of a character table (characters as sympy strings).

    Examples
    --------
    >>> import tensym
    >>> from tensym.reps.table import finite_table
    >>> rec = character_table_record(finite_table(tensym.groups.point_group("3")))
    >>> [i["label"] for i in rec["irreps"]], [i["label"] for i in rec["real_irreps"]]
    (['A', '1E', '2E'], ['A', 'E'])
    """
    def irr(i):
        return {"label": i.label, "dim": int(i.dim), "is_real": bool(i.is_real),
                "characters": [sp.sstr(v) for v in i.characters]}

    return {
        "kind": "character_table",
        "group": group_record(t.group),
        "order": int(t.order),
        "classes": [{"name": c.name, "size": int(c.size)} for c in t.classes],
        "irreps": [irr(i) for i in t.irreps],
        "real_irreps": [irr(i) for i in t.real_irreps],
    }


def _register_character_tables(register):
    try:
        from tensym.reps.table import CharacterTable
    except ImportError:  # pragma: no cover - the reps layer is part of the package
        return
    register(CharacterTable, text=character_table_text, latex=character_table_latex,
             markdown=character_table_markdown, record=character_table_record,
             heading=lambda t: "character table of " + group_heading_latex(t.group) + f"; order {t.order}")
    register(_RealView, text=lambda v: character_table_text(v.table, real=True),
             latex=lambda v, standalone=False: character_table_latex(v.table, real=True, standalone=standalone),
             markdown=lambda v: character_table_markdown(v.table, real=True),
             record=lambda v: character_table_record(v.table),
             heading=lambda v: "character table (real forms) of " + group_heading_latex(v.table.group))


# --- continuous character tables ----------------------------------------------------------------------
def _family_latex(name):
    out = name.replace("φ", "\\varphi").replace("∞", "\\infty ")
    out = out.replace("σv", "\\sigma_{v}").replace("σh", "\\sigma_{h}").replace("σ", "\\sigma")
    return out.replace("C2'", "C_{2}'").replace("C(", "C(").replace("S(", "S(")


def _ct_text(t):
    return f"character table of {group_heading(t.group)} (irreps up to weight {t.up_to})\n" + t.text()


def continuous_table_latex(t, *, standalone=False, real=True):
    r"""Math-mode LaTeX ``array`` of a truncated continuous character table (characters in phi).

    Examples
    --------
    >>> import tensym
    >>> print(continuous_table_latex(tensym.character_table("Cinfv")).splitlines()[1])
    C_{\infty v} & E & 2C(\varphi) & \infty \sigma_{v} \\
    """
    from tensym.output.symbols import schoenflies_latex

    if standalone:
        from tensym.output.document import latex_document

        return latex_document([t])
    irreps = t.real_irreps if real else t.irreps
    names = t.class_names
    lines = [" & ".join([schoenflies_latex(t.group.schoenflies)] + [_family_latex(n) for n in names]) + " \\\\",
             "\\hline"]
    for k, irr in enumerate(irreps):
        end = " \\\\" if k < len(irreps) - 1 else ""
        lines.append(" & ".join([irr.latex] + [sp.latex(v) for v in t.character_row(irr)]) + end)
    return "\\begin{array}{l|" + "c" * len(names) + "}\n" + "\n".join(lines) + "\n\\end{array}"


def _ct_markdown(t):
    lines = [f"**character table of {group_heading(t.group)}** (irreps up to weight {t.up_to})", "",
             "| | " + " | ".join(t.class_names) + " |", "|---|" + "---:|" * len(t.class_names)]
    for irr in t.real_irreps:
        lines.append(f"| **{irr.label}** | " + " | ".join(sp.sstr(v) for v in t.character_row(irr)) + " |")
    return "\n".join(lines)


def _ct_record(t):
    return {
        "kind": "continuous_character_table",
        "group": group_record(t.group),
        "up_to": int(t.up_to),
        "families": list(t.class_names),
        "variable": "phi (rotation angle)",
        "irreps": [{"label": i.label, "dim": int(i.dim), "characters": [sp.sstr(v) for v in t.character_row(i)]}
                   for i in t.real_irreps],
    }


# --- decompositions -------------------------------------------------------------------------------------------
def decomposition_text(d):
    """Text of a Decomposition: the irreps and multiplicities, the group and the dimension.

    Examples
    --------
    >>> import tensym
    >>> print(decomposition_text(tensym.decompose(tensym.harmonics(2), "m-3m")))
    Eg + T2g  (group m-3m, dimension 5)
    """
    return f"{d}  (group {d.group}, dimension {d.dim})"


def _decomposition_markdown(d):
    lines = [f"**decomposition in {d.group}**: {d} (dimension {d.dim})", "",
             "| irrep | dimension | multiplicity |", "|---|---:|---:|"]
    lines += [f"| {lab} | {dim} | {m} |" for lab, dim, m in zip(d.labels, d.dims, d.multiplicities)]
    return "\n".join(lines)


def decomposition_record(d):
    """JSON-ready dict of a Decomposition.

    Examples
    --------
    >>> import tensym
    >>> decomposition_record(tensym.decompose("piezoelectric_d", "6mm"))["terms"][0]
    {'label': 'A1', 'dim': 1, 'multiplicity': 3}
    """
    return {
        "kind": "decomposition",
        "group": d.group,
        "real": bool(d.real),
        "dim": int(d.dim),
        "text": str(d),
        "terms": [{"label": lab, "dim": int(dim), "multiplicity": int(m)}
                  for lab, dim, m in zip(d.labels, d.dims, d.multiplicities)],
    }


def _decomposition_latex(d, *, standalone=False):
    if standalone:
        from tensym.output.document import latex_document

        return latex_document([d])
    return d.latex()


def _group_words_latex(name):
    """A group given by a string (symbol, possibly with words): math for a bare symbol."""
    from tensym.output.symbols import hm_latex

    name = str(name)
    if " " in name.strip() or "(" in name and name not in ("SO(3)", "O(3)"):
        return "\\text{" + text_latex(name) + "}"
    return hm_latex(name)


# --- correlation tables --------------------------------------------------------------------------------------------
def correlation_latex(t, *, standalone=False):
    r"""Math-mode LaTeX ``array`` of a CorrelationTable: each irrep and its splitting.

    Examples
    --------
    >>> import tensym
    >>> print(correlation_latex(tensym.correlate("4mm", "mm2")).splitlines()[1])
    4mm & mm2 \\
    """
    if standalone:
        from tensym.output.document import latex_document

        return latex_document([t])
    lines = [f"{_group_words_latex(t.group)} & {_group_words_latex(t.subgroup)} \\\\", "\\hline"]
    labels = t.latex_labels or t.labels
    for k, (tex, d) in enumerate(zip(labels, t.splittings)):
        end = " \\\\" if k < len(labels) - 1 else ""
        lines.append(f"{tex} & {d.latex()}{end}")
    return "\\begin{array}{l|l}\n" + "\n".join(lines) + "\n\\end{array}"


def _correlation_markdown(t):
    lines = [f"**correlation {t.group} -> {t.subgroup}**", "", f"| {t.group} | {t.subgroup} |", "|---|---|"]
    lines += [f"| {lab} | {d} |" for lab, d in zip(t.labels, t.splittings)]
    return "\n".join(lines)


def _correlation_record(t):
    return {"kind": "correlation", "group": t.group, "subgroup": t.subgroup,
            "rows": [{"irrep": lab, "splitting": decomposition_record(d)} for lab, d in zip(t.labels, t.splittings)]}


# --- symmetry-adapted bases ------------------------------------------------------------------------------------------
def _basis_latex(b, *, standalone=False):
    if standalone:
        from tensym.output.document import latex_document

        return latex_document([b])
    return b.latex()


def _basis_markdown(b):
    lines = [f"**symmetry-adapted basis of {b.space} in {b.group}**", "", "| irrep | copy | partners |",
             "|---|---:|---|"]
    for st in b.sets:
        lines.append(f"| {st.irrep} | {st.copy + 1} | " + ", ".join(f"`{sp.sstr(e)}`" for e in st.readable) + " |")
    return "\n".join(lines)


def basis_record(b):
    """JSON-ready dict of a SymmetryAdaptedBasis (partners as sympy strings).

    Examples
    --------
    >>> import tensym
    >>> rec = basis_record(tensym.symmetry_adapted(tensym.harmonics(1), "4mm"))
    >>> [(s["irrep"], s["partners"]) for s in rec["sets"]][0]
    ('A1', ['z'])
    """
    return {"kind": "symmetry_adapted_basis", "group": b.group, "space": b.space,
            "sets": [{"irrep": st.irrep, "copy": int(st.copy), "partners": [sp.sstr(e) for e in st.readable]}
                     for st in b.sets]}


# --- numbers --------------------------------------------------------------------------------------------------------------
def _num_latex(v, digits=6):
    if v is None:
        return "-"
    s = f"{float(v):.{digits}g}"
    if "e" in s:
        m, e = s.split("e")
        s = f"{m} \\times 10^{{{int(e)}}}"
    return s


def _num_text(v, digits=4):
    return "-" if v is None else f"{float(v):.{digits}g}"


# --- data: check reports ------------------------------------------------------------------------------------------------------
def _check_heading(r):
    return (f"{title_words(r.data.property.title)} checked against ${_group_words_latex(r.group)}$: "
            f"\\textbf{{{text_latex(r.verdict)}}}" + (f" (units: {text_latex(r.units)})" if r.units else ""))


def title_words(title):
    from tensym.output.forms import title_latex

    return title_latex(title)


def _check_after(r):
    return "\n\n".join("\\noindent " + text_latex(w) for w in r.reasons)


def _check_latex(r, *, standalone=False):
    if standalone:
        from tensym.output.document import latex_document

        return latex_document([r])
    return r.latex()


# --- data: batch checks ------------------------------------------------------------------------------------------------------------
def batch_table(b):
    """A Table of a BatchCheck: one row per tensor (verdict, residual, largest deviation, constants).

    Parameters
    ----------
    b : BatchCheck

    Returns
    -------
    Table
    """
    from tensym.output.table import Table

    cols = ("#", "verdict", "residual", "max deviation") + tuple(b.names)
    rows = []
    for i in range(len(b)):
        rows.append((str(i), str(b.verdicts[i]),
                     _num_text(b.residual_fraction[i], 3), _num_text(b.max_deviation[i], 3))
                    + tuple(_num_text(v, 5) for v in b.constants[i]))
    units = f" [{b.units}]" if b.units else ""
    title = (f"{len(b)} tensors of {b.property} checked against {b.group}: {int(b.passes.sum())} consistent "
             f"(tol {b.tol:g}, {b.tol_kind}; fit norm {b.norm}){units}")
    return Table(title=title, columns=cols, rows=tuple(rows),
                 notes=("residual: full-tensor Frobenius norm of data minus symmetrized, over that of the data",))


def _batch_latex(b, *, standalone=False):
    t = batch_table(b)
    if standalone:
        from tensym.output.document import latex_document

        return latex_document([t])
    return t.latex()


# --- data: orientations ---------------------------------------------------------------------------------------------------------------
def orientation_latex(o, *, standalone=False):
    r"""Math-mode LaTeX of an Orientation: the rotation matrix, its angle and axis, the residuals.

    Examples
    --------
    >>> import numpy as np
    >>> import tensym
    >>> o = tensym.orient(np.diag([1.0, 1.0, 2.0]), "dielectric_permittivity", "4/mmm")
    >>> orientation_latex(o).startswith("\\begin{gathered}")
    True
    """
    if standalone:
        from tensym.output.document import latex_document

        return latex_document([o])
    rows = " \\\\\n".join(" & ".join(_num_latex(v, 6) for v in row) for row in np.asarray(o.rotation))
    axis = ", ".join(_num_latex(v, 4) for v in o.axis)
    return ("\\begin{gathered}\n"
            "R = \\begin{pmatrix}\n" + rows + "\n\\end{pmatrix}, \\qquad "
            f"{_num_latex(o.angle, 5)}^\\circ \\text{{ about }} [{axis}] \\\\[1ex]\n"
            f"\\text{{residual fraction: }} {_num_latex(o.residual_fraction, 3)} "
            f"\\quad (\\text{{given frame: }} {_num_latex(o.initial_residual_fraction, 3)})\n"
            "\\end{gathered}")


def _orientation_heading(o):
    return (f"orientation of the {text_latex(o.property)} data to the standard setting of "
            f"${_group_words_latex(o.group)}$ ($R$ takes data-frame components to the setting)")


def _orientation_markdown(o):
    ax = ", ".join(f"{v:.4f}" for v in o.axis)
    lines = [f"**{o.property} oriented to {o.group}**", "",
             f"- rotation (data frame -> standard setting): {o.angle:.3f} deg about [{ax}]",
             f"- residual fraction: {o.residual_fraction:.3g} (given frame: {o.initial_residual_fraction:.3g})",
             f"- equivalent solutions: {o.n_equivalent}", "", "| | x | y | z |", "|---|---:|---:|---:|"]
    for name, row in zip("xyz", np.asarray(o.rotation)):
        lines.append(f"| {name}' | " + " | ".join(f"{v:.6f}" for v in row) + " |")
    return "\n".join(lines)


# --- data: symmetry findings ---------------------------------------------------------------------------------------------------------------
def _finding_rows(f):
    return [(c, True) for c in f.candidates] + [(c, False) for c in f.rejected]


def finding_latex(f, *, standalone=False):
    r"""Math-mode LaTeX ``array`` of a SymmetryFinding: every class tried, its residual and verdict.

    Examples
    --------
    >>> import numpy as np
    >>> import tensym
    >>> f = tensym.find_symmetry(np.diag([1.0, 1.0, 2.0]), "dielectric_permittivity")
    >>> finding_latex(f).startswith("\\begin{array}")
    True
    """
    if standalone:
        from tensym.output.document import latex_document

        return latex_document([f])
    lines = ["\\text{class} & \\text{groups} & \\text{constants} & \\text{residual} & \\text{fits} \\\\", "\\hline"]
    rows = _finding_rows(f)
    for k, (c, ok) in enumerate(rows):
        groups = ",\\ ".join(_group_words_latex(g) for g in c.groups[:6]) + (",\\ \\dots" if len(c.groups) > 6 else "")
        end = " \\\\" if k < len(rows) - 1 else ""
        lines.append(f"\\text{{{text_latex(c.name)}}} & {groups} & {c.n_independent} & "
                     f"{_num_latex(c.residual_fraction, 3)} & \\text{{{'yes' if ok else 'no'}}}{end}")
    return "\\begin{array}{llrrl}\n" + "\n".join(lines) + "\n\\end{array}"


def _finding_heading(f):
    best = f"{text_latex(f.best.name)}" if f.best else "none"
    return (f"symmetry of the {text_latex(f.property)} data: \\textbf{{{best}}} "
            f"(relative tolerance {f.tol:g} on the Frobenius residual)")


def _finding_markdown(f):
    lines = [f"**symmetry of the {f.property} data**: {f.best.name if f.best else 'none'} (tol {f.tol:g})", "",
             "| class | groups | constants | residual | fits |", "|---|---|---:|---:|---|"]
    for c, ok in _finding_rows(f):
        lines.append(f"| {c.name} | {', '.join(c.groups)} | {c.n_independent} | {c.residual_fraction:.3g} | "
                     f"{'yes' if ok else 'no'} |")
    if f.note:
        lines += ["", f.note]
    return "\n".join(lines)


# --- registration ---------------------------------------------------------------------------------------------------------------------------
def _register_reps(register):
    try:
        from tensym.reps.continuous import ContinuousTable
        from tensym.reps.correlation import CorrelationTable
        from tensym.reps.decompose import Decomposition
        from tensym.reps.projection import SymmetryAdaptedBasis
    except ImportError:  # pragma: no cover - the reps layer is part of the package
        return
    register(ContinuousTable, text=_ct_text, latex=continuous_table_latex, markdown=_ct_markdown, record=_ct_record,
             heading=lambda t: f"character table of {group_heading_latex(t.group)} (irreps up to weight {t.up_to}; "
                               "$\\varphi$ is the rotation angle)")
    register(Decomposition, text=decomposition_text, latex=_decomposition_latex, markdown=_decomposition_markdown,
             record=decomposition_record,
             heading=lambda d: f"decomposition in ${_group_words_latex(d.group)}$ (dimension {d.dim})")
    register(CorrelationTable, text=str, latex=correlation_latex, markdown=_correlation_markdown,
             record=_correlation_record,
             heading=lambda t: f"correlation of the irreps of ${_group_words_latex(t.group)}$ "
                               f"with those of ${_group_words_latex(t.subgroup)}$")
    register(SymmetryAdaptedBasis, text=str, latex=_basis_latex, markdown=_basis_markdown, record=basis_record,
             heading=lambda b: f"symmetry-adapted basis of {text_latex(b.space)} in ${_group_words_latex(b.group)}$")


def _register_data(register):
    try:
        from tensym.data.check import BatchCheck, CheckReport
        from tensym.data.find import SymmetryFinding
        from tensym.data.orient import Orientation
    except ImportError:  # pragma: no cover - the data layer is part of the package
        return
    register(CheckReport, text=lambda r: r.text(), latex=_check_latex, markdown=lambda r: r.markdown(),
             record=lambda r: r.record(), heading=_check_heading, after=_check_after)
    register(BatchCheck, text=lambda b: batch_table(b).text(), latex=_batch_latex,
             markdown=lambda b: batch_table(b).markdown(), record=lambda b: dict(batch_table(b).record(),
                                                                                 kind="batch_check"),
             heading=lambda b: text_latex(batch_table(b).title), block=lambda b: _batch_block(b))
    register(Orientation, text=lambda o: o.text(), latex=orientation_latex, markdown=_orientation_markdown,
             record=lambda o: o.record(), heading=_orientation_heading)
    register(SymmetryFinding, text=lambda f: f.text(), latex=finding_latex, markdown=_finding_markdown,
             record=lambda f: f.record(), heading=_finding_heading,
             after=lambda f: ("\\noindent " + text_latex(f.note)) if f.note else "")


def _batch_block(b):
    from tensym.output.dispatch import latex_block

    return latex_block(batch_table(b))


def register_all(register):
    """Register the renderers of every reps/data result type that exists.

    Parameters
    ----------
    register : callable
        ``register(cls, text=..., latex=..., markdown=..., record=..., heading=..., after=..., block=...)``
        (normally :func:`tensym.output.dispatch.register_renderer`).

    Returns
    -------
    None

    Examples
    --------
    >>> seen = []
    >>> register_all(lambda cls, **kw: seen.append(cls.__name__))
    >>> sorted(seen)[:4]
    ['BatchCheck', 'CharacterTable', 'CheckReport', 'ContinuousTable']
    """
    _register_character_tables(register)
    _register_reps(register)
    _register_data(register)
    return None
