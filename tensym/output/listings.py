"""Listings of the catalogs as :class:`~tensym.output.table.Table` results.

Examples
--------
>>> from tensym.output.listings import group_table, property_table
>>> t = group_table()
>>> len(t.rows), t.columns[:4]
(32, ('symbol', 'Schoenflies', 'full symbol', 'order'))
>>> property_table().rows[0][:3]
('pyroelectric', 'p_i', '1')
"""

from tensym.errors import InvalidOptionError
from tensym.output.symbols import hm_latex, schoenflies_latex, text_latex
from tensym.output.table import Table

__all__ = ["group_table", "property_table", "operations_table", "GROUP_LISTS"]

#: Accepted values of ``which`` in :func:`group_table`.
GROUP_LISTS = ("crystallographic", "settings", "icosahedral", "continuous", "magnetic", "all")


def _continuous_symbols():
    from tensym.groups.continuous import CONTINUOUS_SYMBOLS

    return tuple(dict.fromkeys(CONTINUOUS_SYMBOLS.values()))


def group_table(*, which="crystallographic"):
    """A table of named groups: symbols, order, crystal system and setting.

    Parameters
    ----------
    which : {'crystallographic', 'settings', 'icosahedral', 'continuous', 'all'}
        'crystallographic': the 32 classes in their default settings;
        'settings': every orientation in the catalog (121, 112, -4m2, 312, ...);
        'icosahedral': 532 and -5-3m; 'continuous': SO(3), O(3) and the axial
        groups; 'magnetic': the 122 magnetic point groups (a table of its own,
        see below); 'all': every row of the catalog and the continuous groups.

    Returns
    -------
    Table
        Columns: symbol (the setting symbol), Schoenflies, full symbol, order,
        crystal system, setting (orientation in words).  For 'magnetic': number,
        symbol, Schoenflies (G(H) for black-and-white groups, G1' for grey ones),
        kind, parent group, unitary subgroup, order.

    Raises
    ------
    InvalidOptionError
        If ``which`` is not one of :data:`GROUP_LISTS`.

    Examples
    --------
    >>> row = group_table(which="settings").rows[3]
    >>> row[0], row[3], row[5]
    ('112', '2', '2-fold along z (unique axis z)')
    >>> group_table(which="continuous").rows[-1][:2]
    ('inf/mm', 'D∞h')
    """
    from tensym.groups import point_group, point_groups

    if which not in GROUP_LISTS:
        raise InvalidOptionError(f"which={which!r} is not one of {', '.join(GROUP_LISTS)}")
    if which == "magnetic":
        return _magnetic_table()
    symbols = []
    if which in ("crystallographic",):
        symbols = [point_group(s).setting_symbol for s in point_groups()]
    elif which == "settings":
        symbols = list(point_groups(which="settings"))
    elif which == "icosahedral":
        symbols = list(point_groups(which="icosahedral"))
    elif which == "all":
        symbols = list(point_groups(which="all"))
    if which in ("continuous", "all"):
        symbols += list(_continuous_symbols())
    rows, lrows = [], []
    for s in symbols:
        g = point_group(s)
        cont = bool(getattr(g, "is_continuous", False))
        order = "inf" if cont else str(g.order)
        shown = (g.setting_symbol or g.symbol) if not cont else g.symbol
        rows.append((shown, g.schoenflies, g.full_symbol, order, g.crystal_system, g.setting))
        lrows.append((hm_latex(shown), schoenflies_latex(g.schoenflies), hm_latex(g.full_symbol),
                      "\\infty" if cont else order, f"\\text{{{g.crystal_system}}}",
                      f"\\text{{{text_latex(g.setting)}}}"))
    titles = {
        "crystallographic": "the 32 crystallographic point groups (default settings)",
        "settings": "crystallographic point groups in every catalog setting",
        "icosahedral": "icosahedral groups",
        "continuous": "continuous point groups",
        "all": "every named group",
    }
    notes = ("axes: right-handed Cartesian; trigonal and hexagonal triplets refer to a = (1, 0, 0), "
             "b = (-1/2, sqrt(3)/2, 0), c = z",)
    return Table(
        title=titles[which],
        columns=("symbol", "Schoenflies", "full symbol", "order", "system", "setting"),
        rows=tuple(rows),
        latex_rows=tuple(lrows),
        latex_columns=tuple(f"\\text{{{c}}}" for c in ("symbol", "Schoenflies", "full symbol", "order",
                                                        "system", "setting")),
        latex_spec="lllrlp{6.5cm}",
        notes=notes,
    )


def _magnetic_table():
    from tensym.groups.magnetic import magnetic_point_groups

    rows, lrows = [], []
    for r in magnetic_point_groups():
        rows.append((str(r.number), r.symbol, r.schoenflies, r.kind, r.parent, r.unitary, str(r.order)))
        lrows.append((str(r.number), hm_latex(r.symbol), schoenflies_latex(r.schoenflies), f"\\text{{{r.kind}}}",
                      hm_latex(r.parent), hm_latex(r.unitary), str(r.order)))
    cols = ("#", "symbol", "Schoenflies", "kind", "parent", "unitary subgroup", "order")
    return Table(
        title="the 122 magnetic point groups",
        columns=cols,
        rows=tuple(rows),
        latex_rows=tuple(lrows),
        latex_columns=tuple(f"\\text{{{text_latex(c)}}}" for c in cols),
        notes=("primed operations carry time reversal; grey groups contain 1' itself; black-and-white groups "
               "G(H) have the unitary subgroup H of index 2 in the parent G",),
    )


def _parity(spec):
    words = ["axial" if spec.axial else "polar"]
    words.append("time-odd" if spec.time_odd else "time-even")
    return ", ".join(words)


def property_table():
    """A table of the property catalog: name, symbol, rank, index symmetry, parity, size.

    Returns
    -------
    Table
        Columns: name, symbol (with its Voigt indices, e.g. ``d_iJ``), rank,
        index symmetry (the permuted index strings), parity, triclinic (number
        of independent components with no symmetry).  The Voigt factor
        convention of each property is printed with its forms.

    Examples
    --------
    >>> rows = {r[0]: r for r in property_table().rows}
    >>> rows["elastic_stiffness"][1:6]
    ('c_IJ', '4', 'jikl ijlk klij', 'polar, time-even', '21')
    """
    from tensym.output.forms import index_letters
    from tensym.tensors import get_property, property_names

    rows, lrows = [], []
    import sympy as sp

    for name in property_names():
        p = get_property(name)
        spec = p.spec
        sym = f"{p.symbol}_{index_letters(p)}"
        rows.append((name, sym, str(spec.rank), " ".join(spec.symmetries) or "none", _parity(spec),
                     str(spec.dim)))
        lrows.append((f"\\text{{{text_latex(name)}}}", f"{sp.latex(sp.Symbol(p.symbol))}_{{{index_letters(p)}}}",
                      str(spec.rank), f"\\text{{{text_latex(' '.join(spec.symmetries) or 'none')}}}",
                      f"\\text{{{_parity(spec)}}}", str(spec.dim)))
    return Table(
        title="the property catalog",
        columns=("name", "symbol", "rank", "index symmetry", "parity", "triclinic"),
        rows=tuple(rows),
        latex_rows=tuple(lrows),
        latex_columns=tuple(f"\\text{{{c}}}" for c in ("name", "symbol", "rank", "index symmetry", "parity",
                                                        "triclinic")),
        latex_spec="llrp{5cm}lr",
        notes=("triclinic: independent components without any symmetry (group 1)",),
    )


def _uses_hexagonal_axes(group):
    from tensym.groups.catalog import SETTINGS

    row = [s for s in SETTINGS if s.symbol == getattr(group, "setting_symbol", None)]
    return bool(row) and row[0].basis == "hexagonal"


def operations_table(group):
    """A table of a finite group's operations: symbol, coordinate triplet, meaning.

    Parameters
    ----------
    group : PointGroup or str
        A finite group or its symbol.  Trigonal and hexagonal catalog groups get
        a second triplet column in the hexagonal basis.

    Returns
    -------
    Table

    Raises
    ------
    UnknownGroupError
        For an unknown symbol.
    InvalidOptionError
        For a continuous group (its operations cannot be listed).

    Examples
    --------
    >>> t = operations_table("mm2")
    >>> t.columns
    ('#', 'operation', 'triplet', 'meaning')
    >>> t.rows[1][2]
    '-x,y,z'
    """
    from tensym.groups import as_group
    from tensym.output.text import group_heading, group_heading_latex

    g = as_group(group)
    if getattr(g, "is_continuous", False):
        raise InvalidOptionError(
            f"{g.symbol} is a continuous group: its operations cannot be listed; "
            "its Lie generators and discrete generators define it"
        )
    hexa = _uses_hexagonal_axes(g)
    rows, lrows = [], []
    for n, op in enumerate(g.operations, start=1):
        meaning = op.describe()
        head = f"{op.symbol}: "
        if meaning.startswith(head):
            meaning = meaning[len(head):]
        cells = [str(n), op.symbol, op.triplet()]
        if hexa:
            cells.append(op.triplet(basis="hexagonal"))
        cells.append(meaning)
        rows.append(tuple(cells))
        lrows.append(tuple(f"\\text{{{text_latex(c)}}}" for c in cells))
    cols = ["#", "operation", "triplet"] + (["hexagonal triplet"] if hexa else []) + ["meaning"]
    notes = ("triplets: images of x, y, z (rows of the matrix), Cartesian axes"
             + ("; hexagonal triplets in the basis a = (1, 0, 0), b = (-1/2, sqrt(3)/2, 0), c = z" if hexa else ""),)
    return Table(
        title=group_heading(g) + f"; order {g.order}",
        columns=tuple(cols),
        rows=tuple(rows),
        latex_rows=tuple(lrows),
        latex_columns=tuple(f"\\text{{{text_latex(c)}}}" for c in cols),
        latex_spec="rll" + ("lp{6.5cm}" if hexa else "p{9cm}"),
        latex_title=group_heading_latex(g) + f"; order {g.order}",
        notes=notes,
    )
