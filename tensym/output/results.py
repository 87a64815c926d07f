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


def register_all(register):
    """Register the renderers of every reps/data result type that exists.

    Parameters
    ----------
    register : callable
        ``register(cls, text=..., latex=..., markdown=..., record=..., heading=..., after=...)``
        (normally :func:`tensym.output.dispatch.register_renderer`).

    Returns
    -------
    None

    Examples
    --------
    >>> seen = []
    >>> register_all(lambda cls, **kw: seen.append(cls.__name__))
    >>> "CharacterTable" in seen
    True
    """
    _register_character_tables(register)
    return None


_ = text_latex  # used by the data renderers below as they land
