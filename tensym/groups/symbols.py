"""Looking up groups by symbol: one factory for every named group.

Accepted spellings (see :func:`point_group`):

* short and full Hermann-Mauguin symbols: ``'4/mmm'``, ``'4/m 2/m 2/m'``,
  ``'-42m'``, ``'-4 2 m'``; the overbar may be written as a leading ``-``
  (or the minus sign U+2212), a combining overline/macron after the digit
  (U+0305 / U+0304: ``'4̄2m'``) or a spacing macron before it (``'¯42m'``);
  spaces are ignored;
* setting symbols in the style of ITA: ``'121'``, ``'112'``, ``'12/m1'``,
  ``'2mm'``, ``'m2m'``, ``'-4m2'``, ``'312'``, ``'3m1'``, ``'31m'``, ``'-62m'``;
* older spellings without the bar for the cubic classes: ``'m3'``, ``'m3m'``;
* Schoenflies symbols: ``'C1'``, ``'Ci'`` (``'S2'``), ``'Cs'`` (``'C1h'``),
  ``'C2h'``, ``'D2'`` (``'V'``), ``'D2d'`` (``'Vd'``), ``'D2h'`` (``'Vh'``),
  ``'S4'``, ``'C3i'`` (``'S6'``), ..., ``'Td'``, ``'Oh'``, ``'I'``, ``'Ih'``,
  with subscript digits allowed (``'D₄h'``) and any letter case where this
  is unambiguous (``'d4h'``); a lone lowercase ``'i'`` is refused, since
  Schoenflies writes the inversion as i (the group Ci) while ``'I'`` is the
  icosahedral group;
* the continuous groups of :mod:`tensym.groups.continuous`: ``'SO(3)'``,
  ``'O(3)'``, ``'Cinf'``, ``'C∞v'``, ``'Dinfh'``, ``'inf/mm'``, ...;
* magnetic symbols (a prime, ``"m'm'm"``, or Schoenflies ``'D2h(C2h)'``) go to
  :mod:`tensym.groups.magnetic`;
* space-group symbols and numbers (``'P6_3mc'``, ``'Fd-3m'``, ``'P 2_1/n 2_1/m 2_1/a'``,
  the int 186 or the string ``'186'``) name their point group in the setting the symbol
  gives; see :mod:`tensym.groups.spacegroups` for the spellings and for the rule on
  digit strings (a string that is a point-group symbol, such as ``'32'``, stays one).
  A symbol that is both (``'C2'``, ``'C1'``) is read as the point-group symbol, which
  names the same class.

A class symbol names the default setting of its class (``'2'`` is ``'121'``,
``'32'`` is ``'321'``, ``'3m'`` is ``'3m1'``, ``'C2v'`` is ``'mm2'``).

Examples
--------
>>> from tensym.groups.symbols import point_group
>>> point_group("4/m 2/m 2/m") is point_group("D4h")
True
>>> point_group("4̄2m").setting_symbol
'-42m'
"""

import difflib
import numbers
import re

import numpy as np

from tensym.errors import InvalidGroupError, UnknownGroupError
from tensym.groups.catalog import SETTINGS, catalog_group
from tensym.groups.continuous import CONTINUOUS_SYMBOLS, ContinuousGroup, continuous_group
from tensym.groups.finite import PointGroup
from tensym.groups.messages import echo
from tensym.groups.spacegroups import (
    _lookup as _space_group_lookup,
    _group as _space_group_from_parts,
    looks_like_space_group,
    nearest_space_groups,
    space_group_point_group,
)

__all__ = ["point_group", "as_group", "normalise_symbol", "known_symbols"]

_SUBSCRIPTS = str.maketrans("₀₁₂₃₄₅₆₇₈₉", "0123456789")
_COMBINING_BAR = re.compile(r"(\d)[\u0304\u0305]")
_SPACING_BAR = re.compile(r"[\u00af\u203e](\d)")

# Schoenflies aliases beyond the table's own symbol, per class symbol.
_SCHOENFLIES_ALIASES = {
    "-1": ("S2",), "m": ("C1h", "C1v"), "222": ("V",), "-42m": ("Vd",), "mmm": ("Vh",),
    "-3": ("S6",), "532": ("Y",), "-5-3m": ("Yh",),
}
# Other HM spellings in use, per setting symbol.
_HM_ALIASES = {
    "m-3": ("m3", "2/m3"), "m-3m": ("m3m", "4/m32/m"), "-5-3m": ("m-3-5", "2/m-3-5", "m35"),
    "532": ("235",), "-3m1": ("-32/m1",), "-31m": ("-312/m",),
}


def normalise_symbol(text):
    """The canonical spelling used for lookup: overbars as '-', no spaces.

    Parameters
    ----------
    text : str

    Returns
    -------
    str

    Examples
    --------
    >>> normalise_symbol("4\u0305 2 m")
    '-42m'
    >>> normalise_symbol("D₃h")
    'D3h'
    """
    s = str(text).strip().translate(_SUBSCRIPTS)
    s = s.replace("\u2212", "-").replace("\u2013", "-").replace("\u2014", "-")
    s = _COMBINING_BAR.sub(r"-\1", s)
    s = _SPACING_BAR.sub(r"-\1", s)
    s = s.replace("∞", "inf")
    return "".join(s.split())


def _build_tables():
    exact = {}

    def add(alias, target):
        key = normalise_symbol(alias)
        old = exact.get(key)
        if old is not None and old != target:  # pragma: no cover - table consistency
            raise AssertionError(f"symbol {alias!r} names both {old} and {target}")
        exact[key] = target

    for s in SETTINGS:
        add(s.symbol, s.symbol)
        add(s.full_hm, s.symbol)
        for a in _HM_ALIASES.get(s.symbol, ()):
            add(a, s.symbol)
        if s.default:
            add(s.hm, s.symbol)
            add(s.schoenflies, s.symbol)
            for a in _SCHOENFLIES_ALIASES.get(s.hm, ()):
                add(a, s.symbol)
    folded = {}
    for key, target in exact.items():
        folded.setdefault(key.lower(), set()).add(target)
    lower = {k: next(iter(v)) for k, v in folded.items() if len(v) == 1}
    return exact, lower


_EXACT, _LOWER = _build_tables()
_MAX_COMPARE = 200  # characters of an unknown symbol compared for the suggestions
_CONT_NORMAL = {normalise_symbol(k).lower(): v for k, v in CONTINUOUS_SYMBOLS.items()}


def known_symbols():
    """The display spellings offered as suggestions (setting, class, full and Schoenflies symbols).

    Examples
    --------
    >>> "D4h" in known_symbols() and "SO(3)" in known_symbols()
    True
    """
    out = []
    for s in SETTINGS:
        for name in (s.symbol, s.hm, s.full_hm, s.schoenflies):
            if name not in out:
                out.append(name)
    for name in ("SO(3)", "O(3)", "Cinf", "Cinfv", "Cinfh", "Dinf", "Dinfh", "inf", "infm", "inf/m",
                 "inf2", "inf/mm"):
        if name not in out:
            out.append(name)
    return tuple(out)


def _nearest(text, n=5):
    """Nearest valid symbols: space-group symbols first when ``text`` is shaped like one."""
    text = str(text)[:_MAX_COMPARE]
    out = nearest_space_groups(text, n=n) if looks_like_space_group(text) else []
    cands = known_symbols()
    by_lower = {}
    for c in cands:
        by_lower.setdefault(normalise_symbol(c).lower(), c)
    key = normalise_symbol(text).lower()
    hits = difflib.get_close_matches(key, list(by_lower), n=n, cutoff=0.5)
    if not hits and not out:
        hits = difflib.get_close_matches(key, list(by_lower), n=n, cutoff=0.0)
    return (out + [by_lower[h] for h in hits])[:n]


def _magnetic_lookup():
    """The magnetic-symbol factory of :mod:`tensym.groups.magnetic`, when that module is present."""
    try:
        from tensym.groups.magnetic import magnetic_point_group
    except ImportError:  # pragma: no cover - the magnetic module is optional here
        return None
    return magnetic_point_group


def _magnetic_record_type():
    """The record class of :func:`tensym.groups.magnetic.magnetic_point_groups`, when present."""
    try:
        from tensym.groups.magnetic import MagneticPointGroup
    except ImportError:  # pragma: no cover - the magnetic module is optional here
        return None
    return MagneticPointGroup


def point_group(symbol):
    """The named group for a symbol (cached: the same object on every call).

    Parameters
    ----------
    symbol : str or int
        Hermann-Mauguin (short, full or setting symbol), Schoenflies, the
        name of a continuous group, or a space-group symbol or number (its
        point group, with ``names.space_group`` set); see the module docstring.

    Returns
    -------
    PointGroup or ContinuousGroup

    Raises
    ------
    UnknownGroupError
        If no group has that symbol (the message names the nearest valid ones, space-group
        symbols when the text is shaped like one), for a space-group number outside 1..230,
        or for the ambiguous digits '5', '7', '8', '9'.
    InvalidGroupError
        If ``symbol`` is neither a string nor an integer.

    Examples
    --------
    >>> point_group("C3v").setting_symbol, point_group("31m").symbol
    ('3m1', '3m')
    >>> point_group("Dinfh").schoenflies
    'D∞h'
    >>> point_group("P6_3mc").setting_symbol, point_group(186).names.space_group
    ('6mm', 'P6_3mc (no. 186)')
    """
    return _point_group(symbol, True)


def _point_group(symbol, space_groups):
    """:func:`point_group`; without ``space_groups`` only point-group symbols (for parents of magnetic symbols)."""
    if space_groups and isinstance(symbol, numbers.Integral) and not isinstance(symbol, (bool, np.bool_)):
        return space_group_point_group(int(symbol))
    if not isinstance(symbol, str):
        raise InvalidGroupError(
            f"a group symbol must be a string such as '4/mmm' or 'D4h' (or a space-group number 1..230), "
            f"got {type(symbol).__name__} {echo(symbol)}"
        )
    key = normalise_symbol(symbol)
    if key == "i":
        raise UnknownGroupError(
            "'i' is ambiguous: in Schoenflies notation i is the inversion (its group is 'Ci', '-1'), while "
            "'I' is the icosahedral group 532; write 'Ci' or '-1' for the inversion group, 'I' or '532' for "
            "the icosahedral one"
        )
    magnetic = _magnetic_lookup()
    if magnetic is not None and any(c in key for c in "'\u2032\u2019\u2033"):  # primes, also typographic
        return magnetic(symbol)
    target = _EXACT.get(key) or _LOWER.get(key.lower())
    if target is not None:
        return catalog_group(target)
    raw = "".join(str(symbol).split()).lower()
    cont = CONTINUOUS_SYMBOLS.get(raw) or _CONT_NORMAL.get(key.lower())
    if cont is not None:
        return continuous_group(cont)
    if space_groups and key.isdigit():
        return space_group_point_group(key)  # a number that is no point-group symbol: a space group
    found = _space_group_lookup(symbol) if space_groups else None
    if found is not None:
        return _space_group_from_parts(*found)
    if magnetic is not None and "(" in key and key.lower() not in ("so(3)", "o(3)"):
        return magnetic(symbol)
    near = ", ".join(repr(s) for s in _nearest(symbol))
    what = "space-group or point-group" if looks_like_space_group(symbol) else "point-group"
    raise UnknownGroupError(
        f"unknown {what} symbol {echo(symbol)}; nearest valid symbols: {near} "
        "(tensym.point_groups() lists the catalog; a space group is given by its symbol or number 1..230)"
    )


def as_group(group):
    """A group object from a group or its symbol (every tensym function taking a group calls this).

    Parameters
    ----------
    group : PointGroup, ContinuousGroup, MagneticPointGroup, str or int
        A group object is returned as it is; a string (any symbol, space groups
        included) or an int (a space-group number) goes through :func:`point_group`;
        a record of ``tensym.magnetic_point_groups()`` gives its group,
        ``point_group(record.symbol)``.

    Returns
    -------
    PointGroup or ContinuousGroup

    Raises
    ------
    UnknownGroupError
        For an unknown symbol (the message names the nearest valid ones) or a
        space-group number outside 1..230.
    InvalidGroupError
        For any other type (use ``tensym.group_from_generators`` for operations).

    Examples
    --------
    >>> as_group("mm2") is as_group(as_group("mm2"))
    True
    >>> from tensym.groups.magnetic import magnetic_class
    >>> as_group(magnetic_class("m'm'm")).order
    8
    """
    if isinstance(group, (PointGroup, ContinuousGroup)):
        return group
    if isinstance(group, str) or (isinstance(group, numbers.Integral) and not isinstance(group, (bool, np.bool_))):
        return point_group(group)
    record = _magnetic_record_type()
    if record is not None and isinstance(group, record):
        return point_group(group.symbol)
    raise InvalidGroupError(
        f"expected a point group or its symbol (e.g. '6mm', 'C6v'), got {type(group).__name__}; "
        "build a group from operations with tensym.group_from_generators"
    )
