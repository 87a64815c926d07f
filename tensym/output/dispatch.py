"""One entry point for every output format: :func:`render` and :func:`as_record`.

Each result type tensym knows has one renderer per format here.  The result
types of the layers below are looked up lazily, so that output/ imports
only what exists.

Formats (closed set, :data:`FORMATS`):

``text``
    What a person reads at a glance (the result's ``str``).
``latex``
    Math-mode LaTeX content (amsmath); ``standalone=True`` gives a document.
``markdown``
    Pipe tables and lists for reports and notebooks.
``json``
    A JSON document made from :func:`as_record` (indent 2, keys in order).

Examples
--------
>>> from tensym.output.dispatch import render
>>> from tensym.output.table import Table
>>> t = Table(title="", columns=("a",), rows=(("1",),))
>>> print(render(t, format="json"))
{
  "kind": "table",
  "title": "",
  "columns": [
    "a"
  ],
  "rows": [
    {
      "a": "1"
    }
  ],
  "notes": []
}
"""

from dataclasses import dataclass
import json

from tensym.errors import InvalidOptionError
from tensym.output.symbols import text_latex

__all__ = ["render", "as_record", "latex_block", "FORMATS", "register_renderer", "Captioned"]

#: The output formats accepted by :func:`render`.
FORMATS = ("text", "latex", "markdown", "json")


class _Renderer:
    """The per-format functions of one result type (plain functions of the result)."""

    def __init__(self, text, latex, markdown, record, heading, after=None, block=None):
        self.text = text
        self.latex = latex
        self.markdown = markdown
        self.record = record
        self.heading = heading
        self.after = after or (lambda r: "")
        self.block = block


_REGISTRY = []  # (class, _Renderer), searched in order


def register_renderer(cls, *, text, latex, markdown, record, heading, after=None, block=None):
    """Make :func:`render` know a result type.

    Parameters
    ----------
    cls : type
        The result class.
    text, markdown, record, heading, after : callable
        Functions of one result returning the text, Markdown, JSON-ready
        dict, the text-mode LaTeX heading, and text-mode LaTeX to follow the
        display (optional).
    latex : callable
        ``latex(result, standalone=False)`` returning math-mode content or a document.
    block : callable, optional
        Text-mode LaTeX of the whole result for :func:`latex_document`
        (default: the heading, the math-mode content in a display, ``after``).

    Returns
    -------
    type
        ``cls`` (so that it can decorate a class).

    Examples
    --------
    >>> class Note:
    ...     def latex(self):
    ...         return "x"
    >>> _ = register_renderer(Note, text=lambda r: "note", latex=lambda r, standalone=False: "x",
    ...                       markdown=lambda r: "*note*", record=lambda r: {"kind": "note"},
    ...                       heading=lambda r: "A note")
    >>> render(Note(), format="markdown")
    '*note*'
    """
    _REGISTRY.insert(0, (cls, _Renderer(text, latex, markdown, record, heading, after, block)))
    return cls


@dataclass(frozen=True)
class Captioned:
    """A result with a caption naming what it describes (e.g. the space a decomposition splits).

    Attributes
    ----------
    caption : str
        Plain words, e.g. ``'elastic stiffness c_IJ'``.
    result : object
        Any result :func:`render` knows.

    Examples
    --------
    >>> import tensym
    >>> c = Captioned("d orbitals", tensym.decompose(tensym.harmonics(2), "m-3m"))
    >>> render(c)
    'd orbitals: Eg + T2g  (group m-3m, dimension 5)'
    """

    caption: str
    result: object

    def latex(self, *, standalone=False):
        """Math-mode LaTeX of the captioned result (the caption goes in documents' headings)."""
        return render(self, format="latex", standalone=standalone)

    def _repr_latex_(self):
        return "$$" + self.latex() + "$$"

    def __str__(self):
        return render(self)


def _captioned_text(c):
    text = _renderer(c.result).text(c.result)
    return f"{c.caption}: {text}" if "\n" not in text else f"{c.caption}\n" + text


def _captioned_latex(c, *, standalone=False):
    if standalone:
        from tensym.output.document import latex_document

        return latex_document([c])
    return _renderer(c.result).latex(c.result)


def _captioned_markdown(c):
    return f"*{c.caption}*\n\n" + _renderer(c.result).markdown(c.result)


def _captioned_record(c):
    return dict(_renderer(c.result).record(c.result), caption=c.caption)


def _captioned_heading(c):
    inner = _renderer(c.result).heading(c.result)
    return text_latex(c.caption) + (": " + inner if inner else "")


def _load_builtin():
    if _load_builtin.done:
        return
    _load_builtin.done = True
    from tensym.output import forms
    from tensym.output.table import Table
    from tensym.tensors.form import TensorForm

    _REGISTRY.append((TensorForm, _Renderer(
        forms.form_text, forms.form_latex, forms.form_markdown, forms.form_record, forms.form_heading_latex)))
    _REGISTRY.append((Table, _Renderer(
        Table.text, Table.latex, Table.markdown, Table.record,
        _table_title, _table_notes, _table_block)))
    _REGISTRY.append((Captioned, _Renderer(_captioned_text, _captioned_latex, _captioned_markdown,
                                           _captioned_record, _captioned_heading,
                                           lambda c: _renderer(c.result).after(c.result))))
    from tensym.output import results  # renderers of the reps and data result types that exist

    results.register_all(register_renderer)


_load_builtin.done = False


def _table_notes(t):
    return "\n\n".join("\\noindent " + text_latex(n) for n in t.notes)


def _table_title(t):
    return t.latex_title if t.latex_title is not None else text_latex(t.title)


def _table_block(t):
    head = "\\noindent " + _table_title(t) + "\n" if t.title else ""
    notes = _table_notes(t)
    return head + "{\\small\n" + t.longtable() + "\n}" + ("\n" + notes if notes else "")


def _renderer(result):
    _load_builtin()
    for cls, r in _REGISTRY:
        if isinstance(result, cls):
            return r
    known = ", ".join(sorted({c.__name__ for c, _ in _REGISTRY}))
    raise InvalidOptionError(f"cannot render a {type(result).__name__}; tensym renders: {known}")


def _check_format(format):
    if format not in FORMATS:
        raise InvalidOptionError(f"format={format!r} is not one of {', '.join(FORMATS)}")


def render(result, *, format="text", standalone=False):
    """A tensym result as text, LaTeX, Markdown or JSON.

    Parameters
    ----------
    result : TensorForm, Table, CharacterTable, Decomposition, check report, ...
        Any result type tensym returns.
    format : {'text', 'latex', 'markdown', 'json'}
        Output format (see the module notes).
    standalone : bool
        With ``format='latex'``: a complete document instead of math-mode content.

    Returns
    -------
    str

    Raises
    ------
    InvalidOptionError
        For a format outside the set, ``standalone`` with another format, or
        an object tensym does not render.

    Examples
    --------
    >>> import tensym
    >>> from tensym.groups.catalog import catalog_group
    >>> from tensym.tensors.form import tensor_form
    >>> f = tensor_form("pyroelectric", catalog_group("mm2"))
    >>> print(render(f, format="markdown"))
    **pyroelectric coefficients p_i**, point group mm2 (C2v), setting: 2-fold along z, mirror normals x and y; 1 independent: p3
    <BLANKLINE>
    | | 1 |
    |---|---:|
    | **1** | 0 |
    | **2** | 0 |
    | **3** | p3 |
    >>> render(f, format="pdf")
    Traceback (most recent call last):
    ...
    tensym.errors.InvalidOptionError: format='pdf' is not one of text, latex, markdown, json
    """
    _check_format(format)
    if standalone and format != "latex":
        raise InvalidOptionError(f"standalone=True needs format='latex', got format={format!r}")
    r = _renderer(result)
    if format == "text":
        return r.text(result)
    if format == "latex":
        return r.latex(result, standalone=standalone)
    if format == "markdown":
        return r.markdown(result)
    return json.dumps(r.record(result), indent=2, ensure_ascii=False)


def as_record(result):
    """A JSON-ready dict of a tensym result (strings, numbers, lists, dicts).

    Exact values are written as ``sympy.sstr`` strings, which ``sympy.sympify``
    reads back; numbers from numeric checks as floats.

    Parameters
    ----------
    result : any tensym result type (see :func:`render`)

    Returns
    -------
    dict
        A new dict on every call, with a ``'kind'`` key naming the result type.

    Raises
    ------
    InvalidOptionError
        For an object tensym does not render.

    Examples
    --------
    >>> from tensym.groups.catalog import catalog_group
    >>> from tensym.tensors.form import tensor_form
    >>> rec = as_record(tensor_form("elastic_stiffness", catalog_group("6mm")))
    >>> rec["kind"], rec["n_independent"], rec["voigt"][5][5]
    ('tensor_form', 5, 'c11/2 - c12/2')
    """
    return _renderer(result).record(result)


def latex_block(result):
    """Text-mode LaTeX of one result for a document: heading, display, text after.

    Tables become a ``longtable`` (which breaks across pages); other results
    a heading paragraph and their math-mode content in a ``\\[ ... \\]`` display.

    Examples
    --------
    >>> from tensym.output.table import Table
    >>> latex_block(Table(title="t", columns=("a",), rows=(("1",),), notes=("n",))).splitlines()[-1]
    '\\\\noindent n'
    """
    r = _renderer(result)
    if r.block is not None:
        return r.block(result)
    head, frag, after = r.heading(result), r.latex(result), r.after(result)
    block = ("\\noindent " + head + "\n" if head else "") + "\\[\n" + frag + "\n\\]"
    return block + ("\n" + after if after else "")
