"""Plain-text kernels: aligned grids, readable expressions, group headings.

These functions take plain data (lists of strings, sympy expressions, group
objects) and return strings; the renderers of each result type use them.

Examples
--------
>>> from tensym.output.text import grid
>>> print(grid([["a", "0"], ["-b", "c + d"]], row_labels=["1", "2"], col_labels=["1", "2"]))
      1      2
  1   a      .
  2  -b  c + d
"""

import sympy as sp

__all__ = ["grid", "expr_text", "expr_latex", "group_heading", "group_heading_latex", "chunks"]


def expr_text(expr):
    """Short readable text of a sympy expression (common factors pulled out).

    Parameters
    ----------
    expr : sympy expression

    Returns
    -------
    str
        ``'(c11 - c12)/2'`` rather than ``'c11/2 - c12/2'``.

    Examples
    --------
    >>> import sympy as sp
    >>> c11, c12 = sp.symbols("c11 c12")
    >>> expr_text(c11/2 - c12/2), expr_text(sp.Integer(0))
    ('(c11 - c12)/2', '0')
    """
    return sp.sstr(sp.factor_terms(sp.sympify(expr)))


def expr_latex(expr):
    """Math-mode LaTeX of a sympy expression, common factors pulled out.

    Examples
    --------
    >>> import sympy as sp
    >>> c11, c12 = sp.symbols("c11 c12")
    >>> expr_latex(c11/2 - c12/2)
    '\\\\frac{c_{11} - c_{12}}{2}'
    """
    return sp.latex(sp.factor_terms(sp.sympify(expr)))


def _is_zero_cell(cell):
    return cell in ("0", "")


def grid(cells, *, row_labels=None, col_labels=None, zero="."):
    """Right-aligned text grid of string cells; cells equal to '0' are shown as ``zero``.

    Parameters
    ----------
    cells : sequence of sequences of str
        Row-major cells, all rows of the same length.
    row_labels, col_labels : sequence of str, optional
        Labels in a first column and a first line.
    zero : str
        Text shown for cells equal to ``'0'`` (default a dot).

    Returns
    -------
    str
        Lines indented by two spaces, columns separated by two spaces, no
        trailing blanks.

    Examples
    --------
    >>> print(grid([["1", "0"], ["0", "22"]], zero="0"))
      1   0
      0  22
    """
    rows = [[zero if _is_zero_cell(c) else c for c in r] for r in cells]
    ncol = max((len(r) for r in rows), default=0)
    table = []
    if col_labels is not None:
        table.append(([""] if row_labels is not None else []) + list(col_labels))
    for i, r in enumerate(rows):
        table.append(([row_labels[i]] if row_labels is not None else []) + list(r))
    width = [max(len(t[j]) for t in table if j < len(t)) for j in range(ncol + (row_labels is not None))]
    out = []
    for t in table:
        parts = []
        for j, c in enumerate(t):
            if row_labels is not None and j == 0:
                parts.append(c.ljust(width[0]))
            else:
                parts.append(c.rjust(width[j]))
        out.append(("  " + "  ".join(parts)).rstrip())
    return "\n".join(out)


def chunks(items, size):
    """Split a sequence into consecutive lists of at most ``size`` items.

    Examples
    --------
    >>> chunks([1, 2, 3, 4, 5], 2)
    [[1, 2], [3, 4], [5]]
    """
    items = list(items)
    return [items[i:i + size] for i in range(0, len(items), size)]


def _group_names(group):
    sym = getattr(group, "symbol", "") or ""
    sch = getattr(group, "schoenflies", "") or ""
    setting_symbol = getattr(group, "setting_symbol", "") or ""
    setting = getattr(group, "setting", "") or ""
    return sym, sch, setting_symbol, setting


def _kind(group):
    if getattr(group, "is_continuous", False):
        return "continuous group"
    return "magnetic point group" if getattr(group, "is_magnetic", False) else "point group"


def group_heading(group):
    """One line naming a group, its Schoenflies symbol and its setting.

    Parameters
    ----------
    group : PointGroup or ContinuousGroup (any object with ``symbol``,
        ``schoenflies``, ``setting`` and optionally ``setting_symbol``, ``order``)

    Returns
    -------
    str

    Examples
    --------
    >>> from tensym.groups.catalog import catalog_group
    >>> group_heading(catalog_group("-4m2"))
    'point group -42m (D2d), setting -4m2: -4 along z, mirror normals x and y, 2-folds along [110] and [1-10]'
    """
    sym, sch, setting_symbol, setting = _group_names(group)
    kind = _kind(group)
    if not sym:
        order = getattr(group, "order", None)
        head = f"unnamed {kind}" + (f" of order {order}" if order is not None and "continuous" not in kind else "")
    else:
        head = f"{kind} {sym}" + (f" ({sch})" if sch and sch != sym else "")
    where = ""
    if setting_symbol and setting_symbol != sym:
        where = f"setting {setting_symbol}"
    if setting:
        where = f"{where}: {setting}" if where else f"setting: {setting}"
    return head + (", " + where if where else "")


def group_heading_latex(group):
    """The heading of :func:`group_heading` in LaTeX text mode (symbols in math).

    Examples
    --------
    >>> from tensym.groups.catalog import catalog_group
    >>> group_heading_latex(catalog_group("6mm"))[:36]
    'point group $6mm$ ($C_{6v}$), settin'
    """
    from tensym.output.symbols import hm_latex, schoenflies_latex, text_latex

    sym, sch, setting_symbol, setting = _group_names(group)
    kind = _kind(group)
    if not sym:
        order = getattr(group, "order", None)
        head = f"unnamed {kind}" + (f" of order {order}" if order is not None and "continuous" not in kind else "")
    else:
        head = f"{kind} ${hm_latex(sym)}$" + (f" (${schoenflies_latex(sch)}$)" if sch and sch != sym else "")
    where = ""
    if setting_symbol and setting_symbol != sym:
        where = f"setting ${hm_latex(setting_symbol)}$"
    if setting:
        where = f"{where}: {text_latex(setting)}" if where else f"setting: {text_latex(setting)}"
    return head + (", " + where if where else "")
