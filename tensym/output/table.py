"""Table: a small immutable result type for listings (groups, properties, characters).

A Table holds its cells twice, as plain text and as math-mode LaTeX, so that
each renderer picks the spelling it needs; columns are named.

Examples
--------
>>> from tensym.output.table import Table
>>> t = Table(title="two groups", columns=("symbol", "order"),
...           rows=(("4mm", "8"), ("m-3m", "48")))
>>> print(t)
two groups
  symbol  order
  ------  -----
  4mm         8
  m-3m       48
>>> t.record()["rows"][1]
{'symbol': 'm-3m', 'order': '48'}
"""

from dataclasses import dataclass

from tensym.errors import InvalidOptionError
from tensym.output.symbols import text_latex

__all__ = ["Table"]


def _is_number(text):
    t = text.replace("-", "", 1).replace("/", "", 1).replace(".", "", 1).replace("·", "")
    return t.isdigit()


def _text_cell(cell):
    """A math-mode cell for a text-mode table: plain text for a lone \\text{...}, else $...$."""
    if cell.startswith("\\text{") and cell.endswith("}") and cell.count("\\text{") == 1:
        inner = cell[len("\\text{"):-1]
        if inner.count("{") == inner.count("}"):
            return inner
    return f"${cell}$" if cell else ""


def _paragraph_columns(spec):
    """Flags per column of an array spec: True for p{...} (paragraph, text-mode) columns."""
    flags, i = [], 0
    while i < len(spec):
        ch = spec[i]
        if ch in "lrc":
            flags.append(False)
        elif ch in "pmb" and i + 1 < len(spec) and spec[i + 1] == "{":
            depth, i = 0, i + 1
            while i < len(spec):
                depth += {"{": 1, "}": -1}.get(spec[i], 0)
                if depth == 0:
                    break
                i += 1
            flags.append(True)
        i += 1
    return flags


@dataclass(frozen=True)
class Table:
    """A titled table of text cells, with optional LaTeX cells and notes.

    Attributes
    ----------
    title : str
        One line shown above the table.
    columns : tuple of str
        Column names.
    rows : tuple of tuple of str
        Cells as plain text, one tuple per row, each as long as ``columns``.
    latex_rows : tuple of tuple of str or None
        The same cells as math-mode LaTeX; None means "the text cells, set
        upright with ``\\text{}``".
    latex_columns : tuple of str or None
        Column names as math-mode LaTeX (None: ``\\text{}`` of ``columns``).
    notes : tuple of str
        Lines printed under the table.
    rule_after : tuple of int
        Row indices after which a horizontal rule is drawn (LaTeX, text).
    latex_title : str or None
        The title as text-mode LaTeX for documents (None: the escaped title).
    latex_spec : str or None
        Column specification of the LaTeX ``array`` (None: ``l`` for text
        columns, ``r`` for numeric ones); e.g. ``'lllp{5cm}'`` to wrap words.

    Raises
    ------
    InvalidOptionError
        If a row's length differs from the number of columns.
    """

    title: str
    columns: tuple
    rows: tuple
    latex_rows: tuple = None
    latex_columns: tuple = None
    notes: tuple = ()
    rule_after: tuple = ()
    latex_spec: str = None
    latex_title: str = None

    def __post_init__(self):
        object.__setattr__(self, "columns", tuple(str(c) for c in self.columns))
        object.__setattr__(self, "rows", tuple(tuple(str(c) for c in r) for r in self.rows))
        for r in self.rows + (self.latex_rows or ()):
            if len(r) != len(self.columns):
                raise InvalidOptionError(
                    f"table row {r!r} has {len(r)} cells; the table has {len(self.columns)} columns"
                )
        if self.latex_rows is not None:
            object.__setattr__(self, "latex_rows", tuple(tuple(str(c) for c in r) for r in self.latex_rows))
            if len(self.latex_rows) != len(self.rows):
                raise InvalidOptionError("latex_rows must have as many rows as rows")
        object.__setattr__(self, "notes", tuple(self.notes))
        object.__setattr__(self, "rule_after", tuple(self.rule_after))

    # --- text ---------------------------------------------------------------
    def _numeric_columns(self):
        return [all(_is_number(r[j]) for r in self.rows) and bool(self.rows) for j in range(len(self.columns))]

    def text(self):
        """Aligned plain text: title, column names, a rule, the rows, the notes."""
        num = self._numeric_columns()
        cells = [list(self.columns)] + [list(r) for r in self.rows]
        width = [max(len(c[j]) for c in cells) for j in range(len(self.columns))]

        def line(r):
            parts = [c.rjust(w) if n else c.ljust(w) for c, w, n in zip(r, width, num)]
            return ("  " + "  ".join(parts)).rstrip()

        out = [self.title] if self.title else []
        out.append(line(self.columns))
        out.append(line(["-" * w for w in width]))
        for i, r in enumerate(self.rows):
            out.append(line(r))
            if i in self.rule_after and i != len(self.rows) - 1:
                out.append(line(["-" * w for w in width]))
        out.extend(self.notes)
        return "\n".join(out)

    def __str__(self):
        return self.text()

    def __repr__(self):
        return f"<Table {self.title!r}: {len(self.rows)} rows x {len(self.columns)} columns>"

    # --- LaTeX --------------------------------------------------------------
    def latex(self, *, standalone=False):
        """Math-mode LaTeX: an ``array`` with a rule under the header.

        Parameters
        ----------
        standalone : bool
            Return a complete document (title as a heading, notes under it).

        Examples
        --------
        >>> print(Table(title="", columns=("a",), rows=(("x_1",),)).latex())
        \\begin{array}{l}
        \\text{a} \\\\
        \\hline
        \\text{x\\_1}
        \\end{array}
        """
        num = self._numeric_columns()
        cols = self.latex_columns or tuple(f"\\text{{{text_latex(c)}}}" for c in self.columns)
        rows = self.latex_rows or tuple(tuple(f"\\text{{{text_latex(c)}}}" for c in r) for r in self.rows)
        spec = self.latex_spec or "".join("r" if n else "l" for n in num)
        para = _paragraph_columns(spec) + [False] * len(self.columns)

        def cells(r):  # paragraph columns of an array are in text mode
            return " & ".join(_text_cell(c) if para[j] else c for j, c in enumerate(r))

        lines = [" & ".join(cols) + " \\\\", "\\hline"]
        for i, r in enumerate(rows):
            end = " \\\\" if i < len(rows) - 1 else ""
            lines.append(cells(r) + end)
            if i in self.rule_after and i != len(rows) - 1:
                lines.append("\\hline")
        frag = "\\begin{array}{" + spec + "}\n" + "\n".join(lines) + "\n\\end{array}"
        if not standalone:
            return frag
        from tensym.output.document import latex_document

        return latex_document([self])

    def _repr_latex_(self):
        # notebook renderers (MathJax, KaTeX) know only l, c, r columns in an array
        plain = Table(title=self.title, columns=self.columns, rows=self.rows, latex_rows=self.latex_rows,
                      latex_columns=self.latex_columns, notes=self.notes, rule_after=self.rule_after)
        return "$$" + plain.latex() + "$$"

    def longtable(self):
        """Text-mode LaTeX: a ``longtable`` (breaks across pages), for documents.

        Cells written as ``\\text{...}`` are set as plain text (so that words
        wrap in ``p{}`` columns); other cells in math mode.  Needs
        ``\\usepackage{longtable}`` (part of every LaTeX installation).

        Examples
        --------
        >>> print(Table(title="", columns=("a", "n"), rows=(("x", "1"),)).longtable())
        \\begin{longtable}{lr}
        a & n \\\\
        \\hline
        \\endhead
        x & 1
        \\end{longtable}
        """
        num = self._numeric_columns()
        cols = self.latex_columns or tuple(f"\\text{{{text_latex(c)}}}" for c in self.columns)
        rows = self.latex_rows or tuple(tuple(f"\\text{{{text_latex(c)}}}" for c in r) for r in self.rows)
        spec = self.latex_spec or "".join("r" if n else "l" for n in num)
        lines = [" & ".join(_text_cell(c) for c in cols) + " \\\\", "\\hline", "\\endhead"]
        for i, r in enumerate(rows):
            end = " \\\\" if i < len(rows) - 1 else ""
            lines.append(" & ".join(_text_cell(c) for c in r) + end)
            if i in self.rule_after and i != len(rows) - 1:
                lines.append("\\hline")
        return "\\begin{longtable}{" + spec + "}\n" + "\n".join(lines) + "\n\\end{longtable}"

    # --- Markdown and records -------------------------------------------------
    def markdown(self):
        """Pipe table with a bold title line and the notes under it.

        Examples
        --------
        >>> print(Table(title="t", columns=("a", "n"), rows=(("x", "1"),)).markdown())
        **t**
        <BLANKLINE>
        | a | n |
        |---|---:|
        | x | 1 |
        """
        num = self._numeric_columns()
        out = [f"**{self.title}**", ""] if self.title else []
        out.append("| " + " | ".join(self.columns) + " |")
        out.append("|" + "|".join("---:" if n else "---" for n in num) + "|")
        for r in self.rows:
            out.append("| " + " | ".join(c.replace("|", "\\|") for c in r) + " |")
        if self.notes:
            out.append("")
            out.extend(self.notes)
        return "\n".join(out)

    def record(self):
        """JSON-ready dict: title, columns, rows as dicts keyed by column, notes."""
        return {
            "kind": "table",
            "title": self.title,
            "columns": list(self.columns),
            "rows": [dict(zip(self.columns, r)) for r in self.rows],
            "notes": list(self.notes),
        }
