"""Space-group symbols and numbers, read as their point groups in tensym's settings.

A property tensor of a crystal sees only the point group of its space group
(translations, screw and glide parts drop out).  So ``'P6_3mc'``, ``'Fd-3m'``,
``'R-3c'``, the number 186 or ``'186'`` name a point group: the one whose
symbol is the space-group symbol with the lattice letter removed, every glide
letter (a, b, c, d, e, n) read as m and every screw subscript dropped
(``P6_3mc`` -> 6mm, ``P4_2/mnm`` -> 4/mmm, ``Ia-3d`` -> m-3m), in the catalog
setting of that symbol (``P321`` -> 321, ``P312`` -> 312, ``P-62m`` -> -62m,
``Pmc2_1`` -> mm2, ``P2_1ab`` -> 2mm, ``P 1 1 2_1/b`` -> 112/m).

Accepted spellings
------------------
* the short symbols of ITA Vol. A (230 types, in their standard settings), with
  screw axes as ``6_3``, ``6₃`` or plain ``63`` (``P63mc``, ``P212121``,
  ``P4132``): a reading without underscores is taken only when exactly one way
  of splitting the digits gives a space-group symbol tensym knows (every
  symbol below reads one way only without its underscores);
* the older cubic spelling without the bar (``Fd3m``, ``Ia3d``, ``Pm3m``);
* the symbols of the non-standard settings of the orthorhombic and monoclinic
  types (axis permutations and cell choices: ``Pbnm``, ``Pmcn``, ``P2_1/n``,
  ``B22_12``, ``C 1 n 1``) and the pre-2002 symbols with ``b``/``a`` where ITA
  now writes ``e`` (``Abm2``, ``Aba2``, ``Cmca``, ``Cmma``, ``Ccca``);
* full symbols with spaces between positions (``'P 6_3 m c'``,
  ``'P 2_1/n 2_1/m 2_1/a'``, ``'F 4_1/d -3 2/m'``, ``'R -3 2/c'``,
  ``'P 1 2_1/c 1'``);
* numbers: an ``int`` from 1 to 230 is a space-group number; a string of
  digits is one only when it is not a point-group symbol (``'186'`` is space
  group 186, but ``'1'``, ``'2'``, ``'3'``, ``'4'``, ``'6'``, ``'23'``, ``'32'``,
  ``'222'``, ``'321'``, ``'312'``, ``'121'``, ``'112'``, ``'211'``, ``'422'``,
  ``'432'``, ``'622'``, ``'532'`` are point groups), and the single digits
  ``'5'``, ``'7'``, ``'8'``, ``'9'`` (which also read as n-fold axes) are refused.

Settings
--------
A short monoclinic symbol (``'P2_1/c'``, ``'C2'``) does not say which axis is
unique; it names the unique-axis-b setting (``121``, ``1m1``, ``12/m1``), as
ITA does by default, or the first of unique axis c, a that has such a symbol
(``'P2_1/b'`` -> unique axis c).  Full monoclinic symbols (``'P 1 1 2/m'``) and
every orthorhombic symbol fix the setting.  Rhombohedral groups (``R3m``,
``R-3c``) are in hexagonal axes: 3-fold along z, as the trigonal catalog rows.
Lattice vectors along the Cartesian axes: a along x, b along y (orthogonal
families) or b = (-1/2, sqrt(3)/2, 0) (hexagonal axes), c along z.

The group returned is the catalog group's own (same operations and
generators) with names that record the space group: ``names.space_group``
(e.g. ``'P6_3mc (no. 186)'``) and a sentence at the end of ``setting``.

Examples
--------
>>> g = space_group_point_group("P6_3mc")
>>> g.symbol, g.setting_symbol, g.names.space_group
('6mm', '6mm', 'P6_3mc (no. 186)')
>>> space_group_point_group(62).symbol, space_group_point_group("Pbnm").names.space_group
('mmm', 'Pbnm (no. 62, setting cab)')
"""

import dataclasses
import difflib
import re

from tensym.errors import InvalidGroupError, UnknownGroupError
from tensym.groups.catalog import catalog_group
from tensym.groups.messages import echo

__all__ = ["space_group_point_group", "space_group_symbol", "is_space_group_symbol", "space_group_symbols"]

# The 230 space-group types by number, short Hermann-Mauguin symbols in their
# standard settings: ITA Vol. A (2002 and later; 'e' for the double glides of
# nos. 39, 41, 64, 67, 68), from memory; checked against spglib's database in
# tests/groups/test_spacegroups.py.
_STANDARD = (
    "P1", "P-1",
    "P2", "P2_1", "C2", "Pm", "Pc", "Cm", "Cc", "P2/m", "P2_1/m", "C2/m", "P2/c", "P2_1/c", "C2/c",
    "P222", "P222_1", "P2_12_12", "P2_12_12_1", "C222_1", "C222", "F222", "I222", "I2_12_12_1",
    "Pmm2", "Pmc2_1", "Pcc2", "Pma2", "Pca2_1", "Pnc2", "Pmn2_1", "Pba2", "Pna2_1", "Pnn2", "Cmm2",
    "Cmc2_1", "Ccc2", "Amm2", "Aem2", "Ama2", "Aea2", "Fmm2", "Fdd2", "Imm2", "Iba2", "Ima2",
    "Pmmm", "Pnnn", "Pccm", "Pban", "Pmma", "Pnna", "Pmna", "Pcca", "Pbam", "Pccn", "Pbcm", "Pnnm",
    "Pmmn", "Pbcn", "Pbca", "Pnma", "Cmcm", "Cmce", "Cmmm", "Cccm", "Cmme", "Ccce", "Fmmm", "Fddd",
    "Immm", "Ibam", "Ibca", "Imma",
    "P4", "P4_1", "P4_2", "P4_3", "I4", "I4_1", "P-4", "I-4", "P4/m", "P4_2/m", "P4/n", "P4_2/n",
    "I4/m", "I4_1/a", "P422", "P42_12", "P4_122", "P4_12_12", "P4_222", "P4_22_12", "P4_322",
    "P4_32_12", "I422", "I4_122", "P4mm", "P4bm", "P4_2cm", "P4_2nm", "P4cc", "P4nc", "P4_2mc",
    "P4_2bc", "I4mm", "I4cm", "I4_1md", "I4_1cd", "P-42m", "P-42c", "P-42_1m", "P-42_1c", "P-4m2",
    "P-4c2", "P-4b2", "P-4n2", "I-4m2", "I-4c2", "I-42m", "I-42d", "P4/mmm", "P4/mcc", "P4/nbm",
    "P4/nnc", "P4/mbm", "P4/mnc", "P4/nmm", "P4/ncc", "P4_2/mmc", "P4_2/mcm", "P4_2/nbc", "P4_2/nnm",
    "P4_2/mbc", "P4_2/mnm", "P4_2/nmc", "P4_2/ncm", "I4/mmm", "I4/mcm", "I4_1/amd", "I4_1/acd",
    "P3", "P3_1", "P3_2", "R3", "P-3", "R-3", "P312", "P321", "P3_112", "P3_121", "P3_212", "P3_221",
    "R32", "P3m1", "P31m", "P3c1", "P31c", "R3m", "R3c", "P-31m", "P-31c", "P-3m1", "P-3c1", "R-3m",
    "R-3c",
    "P6", "P6_1", "P6_5", "P6_2", "P6_4", "P6_3", "P-6", "P6/m", "P6_3/m", "P622", "P6_122", "P6_522",
    "P6_222", "P6_422", "P6_322", "P6mm", "P6cc", "P6_3cm", "P6_3mc", "P-6m2", "P-6c2", "P-62m",
    "P-62c", "P6/mmm", "P6/mcc", "P6_3/mcm", "P6_3/mmc",
    "P23", "F23", "I23", "P2_13", "I2_13", "Pm-3", "Pn-3", "Fm-3", "Fd-3", "Im-3", "Pa-3", "Ia-3",
    "P432", "P4_232", "F432", "F4_132", "I432", "P4_332", "P4_132", "I4_132", "P-43m", "F-43m",
    "I-43m", "P-43n", "F-43c", "I-43d", "Pm-3m", "Pn-3n", "Pm-3n", "Pn-3m", "Fm-3m", "Fm-3c",
    "Fd-3m", "Fd-3c", "Im-3m", "Ia-3d",
)
assert len(_STANDARD) == 230

# Symbols used before ITA (2002) introduced 'e' (ITA Vol. A, 5th ed., ch. 1.3; from memory).
_OLD_SYMBOLS = {"Abm2": 39, "Aba2": 41, "Cmca": 64, "Cmma": 67, "Ccca": 68}

# The six settings of an orthorhombic (or monoclinic) cell, as the images of the
# standard axes (ITA Vol. A, Table 4.3.2.1; from memory): new axis i = sign * old axis perm[i].
_SETTINGS = (("abc", (0, 1, 2)), ("ba-c", (1, 0, 2)), ("cab", (2, 0, 1)), ("-cba", (2, 1, 0)),
             ("bca", (1, 2, 0)), ("a-cb", (0, 2, 1)))
# Monoclinic cell choices 1, 2, 3 for unique axis b (ITA Vol. A, ch. 2.2.16; from memory):
# lattice C -> A -> I and glide c -> n -> a.
_CELL_CHOICES = ({"C": "C", "c": "c"}, {"C": "A", "c": "n"}, {"C": "I", "c": "a"})

_LATTICES = "PABCFIR"
_GLIDES = "mabcden"
_SUBSCRIPT_DIGITS = str.maketrans("₀₁₂₃₄₅₆₇₈₉", "0123456789")
_COMBINING_BAR = re.compile(r"(\d)[\u0304\u0305]")
_SPACING_BAR = re.compile(r"[\u00af\u203e](\d)")
_AMBIGUOUS_DIGITS = ("5", "7", "8", "9")


# --- positions ----------------------------------------------------------------------
# A position is a tuple (bar, n, screw, glide) for an axis (n >= 1, bar '-' or '',
# screw 0 or the subscript, glide '' or the letter after '/'), or ('', 0, 0, letter)
# for a plane alone.
def _position_text(p, *, underscore=True):
    bar, n, screw, glide = p
    if n == 0:
        return glide
    s = f"{bar}{n}" + ((f"_{screw}" if underscore else str(screw)) if screw else "")
    return s + (f"/{glide}" if glide else "")


def _symbol_text(lattice, positions, sep=""):
    return lattice + sep + sep.join(_position_text(p) for p in positions)


def _point_position(p, *, short):
    """The point-group position: glides read as m, screws dropped; ``short`` keeps only the plane of 'n/m'."""
    bar, n, _, glide = p
    if n == 0:
        return "m"
    if glide:
        return "m" if short else f"{bar}{n}/m"
    return f"{bar}{n}"


def _readings(chunk, *, implicit=True):
    """Every way to read a space-free run of positions (a list of position lists).

    A screw subscript is written ``n_m``; with ``implicit`` a digit m < n right
    after n may also be one (``63`` as ``6_3``), so several readings can come out.
    """
    out = []

    def walk(i, acc):
        if len(acc) > 3:  # a space-group symbol has at most three positions after the lattice letter
            return
        if i == len(chunk):
            out.append(list(acc))
            return
        c = chunk[i]
        if c in _GLIDES:
            walk(i + 1, acc + [("", 0, 0, c)])
            return
        bar, j = ("-", i + 1) if c == "-" else ("", i)
        if j >= len(chunk) or chunk[j] not in "123456":
            return
        n = int(chunk[j])
        j += 1
        options = [(0, j)]
        if chunk[j:j + 1] == "_":
            if bar or not chunk[j + 1:j + 2].isdigit() or not 0 < int(chunk[j + 1]) < n:
                return  # a subscript needs a proper rotation n and 0 < m < n
            options = [(int(chunk[j + 1]), j + 2)]
        elif implicit and not bar and chunk[j:j + 1].isdigit() and 0 < int(chunk[j]) < n:
            options.append((int(chunk[j]), j + 1))
        for screw, k in options:
            if chunk[k:k + 1] == "/":
                if chunk[k + 1:k + 2] and chunk[k + 1] in _GLIDES:
                    walk(k + 2, acc + [(bar, n, screw, chunk[k + 1])])
                continue
            walk(k, acc + [(bar, n, screw, "")])

    walk(0, [])
    return out


# --- the table of known symbols ----------------------------------------------------------
def _parse_plain(symbol):
    """(lattice, positions) of a table symbol (every screw written with '_', no spaces)."""
    (positions,) = _readings(symbol[1:], implicit=False)
    return symbol[0], positions


def _permute(lattice, positions, perm):
    """Symbol of the same group in the axes (new axis i = old axis perm[i]) of a three-position symbol."""
    letter = {"a": 0, "b": 1, "c": 2}
    inv = {old: new for new, old in enumerate(perm)}
    glide_of = "abc"
    lat = lattice
    if lattice in "ABC":
        lat = "ABC"[inv["ABC".index(lattice)]]
    new = [None, None, None]
    for old_i, p in enumerate(positions):
        bar, n, screw, glide = p
        if glide in letter:
            glide = glide_of[inv[letter[glide]]]
        new[inv[old_i]] = (bar, n, screw, glide)
    return lat, new


def _full_monoclinic(lattice, position):
    """The three-position symbol of a short unique-axis-b monoclinic symbol."""
    one = ("", 1, 0, "")
    return lattice, [one, position, one]


def _build():
    table = {}  # key (no spaces) -> (number, setting symbol, label); the first entry of a key wins

    def add(key, number, setting, label):
        if setting is None:  # pragma: no cover - table consistency
            raise AssertionError(f"space-group symbol {key} gives no point group of the catalog")
        table.setdefault(key, (number, setting, label))

    def point_setting(positions):
        text = "".join(_point_position(p, short=False) for p in positions)
        from tensym.groups.symbols import _EXACT  # the point-group symbol table

        return _EXACT.get(text) or _EXACT.get("".join(_point_position(p, short=True) for p in positions))

    for number, symbol in enumerate(_STANDARD, start=1):
        lattice, positions = _parse_plain(symbol)
        add(symbol, number, point_setting(positions), "")
    for symbol, number in _OLD_SYMBOLS.items():
        lattice, positions = _parse_plain(symbol)
        add(symbol, number, point_setting(positions), "")
    for number in range(200, 231):  # the older cubic spelling without the bar: Fd3m, Ia3d, Pa3
        symbol = _STANDARD[number - 1]
        if "-3" in symbol and "-43" not in symbol:
            lattice, positions = _parse_plain(symbol.replace("-3", "3"))
            add(symbol.replace("-3", "3"), number, point_setting(positions), "")
    # orthorhombic settings: permute the three positions of the standard short symbol
    for number in range(16, 75):
        lattice, positions = _parse_plain(_STANDARD[number - 1])
        for name, perm in _SETTINGS[1:]:
            lat, pos = _permute(lattice, positions, perm)
            add(_symbol_text(lat, pos), number, point_setting(pos), f"setting {name}")
    for symbol, number in _OLD_SYMBOLS.items():
        lattice, positions = _parse_plain(symbol)
        for name, perm in _SETTINGS[1:]:
            lat, pos = _permute(lattice, positions, perm)
            add(_symbol_text(lat, pos), number, point_setting(pos), f"setting {name}")
    # monoclinic: cell choices of the unique-axis-b symbol (for a C lattice or a c glide),
    # each in the six axis settings; the full symbols keep the 1s
    mono = []
    for number in range(3, 16):
        lattice, (position,) = _parse_plain(_STANDARD[number - 1])
        choices = _CELL_CHOICES if (lattice == "C" or position[3] == "c") else _CELL_CHOICES[:1]
        for k, choice in enumerate(choices, start=1):
            pos = position[:3] + (choice.get(position[3], position[3]),)
            one = ("", 1, 0, "")
            for name, perm in _SETTINGS:
                lat, full = _permute(choice.get(lattice, lattice), [one, pos, one], perm)
                axis = next(i for i, p in enumerate(full) if p != one)
                mono.append(((1, 2, 0).index(axis), number, k, name, lat, full))
    mono.sort(key=lambda t: t[:3])  # unique axis b, then c, then a (the short symbols lose the axis)
    for axis, number, k, name, lat, full in mono:
        label = "" if (name == "abc" and k == 1) else f"unique axis {'bca'[axis]}"
        add(_symbol_text(lat, full), number, point_setting(full), label)
    for axis, number, k, name, lat, full in mono:
        label = "" if (name == "abc" and k == 1) else f"unique axis {'bca'[axis]}"
        unique = next(p for p in full if p != ("", 1, 0, ""))
        add(lat + _position_text(unique), number, point_setting(full), label)
    return table


_TABLE = None


def _table():
    global _TABLE
    if _TABLE is None:
        _TABLE = _build()
    return _TABLE


def space_group_symbols():
    """The short symbols of the 230 space-group types in their standard settings, by number.

    Returns
    -------
    tuple of str
        ``space_group_symbols()[n - 1]`` is the symbol of type n (ITA Vol. A).

    Examples
    --------
    >>> space_group_symbols()[185]
    'P6_3mc'
    """
    return _STANDARD


# --- reading a user's symbol ---------------------------------------------------------------
def _normalise(text):
    s = str(text).strip()
    s = s.translate(str.maketrans({"\u2212": "-", "\u2013": "-", "\u2014": "-"}))
    s = re.sub("[₀₁₂₃₄₅₆₇₈₉]", lambda m: "_" + m.group(0).translate(_SUBSCRIPT_DIGITS), s)
    s = _COMBINING_BAR.sub(r"-\1", s)
    s = _SPACING_BAR.sub(r"-\1", s)
    return s


def _candidates(text):
    """Readings (lattice, positions) of a symbol; [] when it is not shaped like a space-group symbol."""
    s = _normalise(text)
    if not s or s[0] not in _LATTICES:
        return []
    lattice, rest = s[0], s[1:]
    chunks = rest.split()
    if not chunks or any(not re.fullmatch(r"[0-9_/\-" + _GLIDES + "]+", c) for c in chunks):
        return []
    readings = [[]]
    for chunk in chunks:
        options = _readings(chunk)
        readings = [r + o for r in readings for o in options]
        if not readings:
            return []
    return [(lattice, r) for r in readings if len(r) <= 3]


def _short_key(lattice, positions):
    """Key of the short symbol for a reading (full symbols reduced as ITA reduces them)."""
    if len(positions) == 3 and sum(1 for p in positions if p[:3] == ("", 1, 0) and not p[3]) == 2:
        return _symbol_text(lattice, positions)  # a full monoclinic symbol keeps its 1s
    if len(positions) <= 1:
        return _symbol_text(lattice, positions)
    first = positions[0]
    second = positions[1]
    cubic = second[1] == 3 and first[1] in (2, 4) and len(positions) >= 2 and lattice != "R"
    keep_first = first[1] in (3, 4, 6) and not cubic
    out = []
    for i, p in enumerate(positions):
        bar, n, screw, glide = p
        if glide and not (i == 0 and keep_first):
            out.append(("", 0, 0, glide))
        else:
            out.append(p)
    return _symbol_text(lattice, out)


def _lookup(text):
    """(number, setting symbol, label, display) for a space-group symbol, or raise UnknownGroupError.

    Returns None when ``text`` is not shaped like a space-group symbol at all.
    """
    readings = _candidates(text)
    if not readings:
        return None
    table = _table()
    hits = {}
    spaced = len(_normalise(text).split()) > 1
    for lattice, positions in readings:
        for key in (_short_key(lattice, positions), _symbol_text(lattice, positions)):
            if key in table:
                hits.setdefault(table[key], _symbol_text(lattice, positions, " ") if spaced else key)
                break
    if len(hits) == 1:
        (number, setting, label), display = next(iter(hits.items()))
        return number, setting, label, display
    if len(hits) > 1:  # pragma: no cover - table consistency (tests read every symbol without '_')
        raise AssertionError(f"space-group symbol {echo(text)} reads as {sorted(hits.values())}")
    return None


def is_space_group_symbol(text):
    """True when ``text`` reads as exactly one space-group symbol tensym knows.

    Examples
    --------
    >>> is_space_group_symbol("P6_3mc"), is_space_group_symbol("P63mc"), is_space_group_symbol("6mm")
    (True, True, False)
    """
    return _lookup(text) is not None


def looks_like_space_group(text):
    """True when ``text`` is shaped like a space-group symbol: a lattice letter, then digits and glide letters."""
    s = _normalise(text)
    return len(s) > 1 and s[0] in _LATTICES and bool(re.fullmatch(r"[0-9_/\- " + _GLIDES + "]+", s[1:]))


_PLAIN = {s.replace("_", ""): s for s in _STANDARD}


def nearest_space_groups(text, n=5):
    """Standard short symbols nearest to ``text`` (compared without spaces and underscores)."""
    key = _normalise(text).replace(" ", "").replace("_", "")
    return [_PLAIN[h] for h in difflib.get_close_matches(key, list(_PLAIN), n=n, cutoff=0.6)]


def _number_arg(number):
    if not 1 <= number <= 230:
        raise UnknownGroupError(
            f"space-group number {number} is outside 1..230 (the 230 space-group types of ITA Vol. A)"
        )
    return _STANDARD[number - 1]


def space_group_symbol(group):
    """The standard short symbol of a space-group number or symbol, and its number.

    Parameters
    ----------
    group : int or str
        A number 1..230 or a space-group symbol (any spelling of the module docstring).

    Returns
    -------
    (str, int)

    Raises
    ------
    UnknownGroupError
        For a number outside 1..230 or a symbol that is no space group tensym knows.

    Examples
    --------
    >>> space_group_symbol("P63mc"), space_group_symbol(225)
    (('P6_3mc', 186), ('Fm-3m', 225))
    """
    if isinstance(group, int) and not isinstance(group, bool):
        return _number_arg(group), group
    found = _lookup(group)
    if found is None:
        raise UnknownGroupError(f"{echo(group)} is not a space-group symbol tensym knows")
    return _STANDARD[found[0] - 1], found[0]


_GROUPS = {}


def _group(number, setting, label, display):
    key = (setting, number, display)
    g = _GROUPS.get(key)
    if g is None:
        from tensym.groups.finite import PointGroup

        std = catalog_group(setting)
        where = f"no. {number}" + (f", {label}" if label else "")
        sg = f"{display} ({where})"
        words = f"{std.setting}; the point group of space group {sg}"
        names = dataclasses.replace(std.names, setting=words, space_group=sg)
        g = PointGroup(std._ops, std.generators, names)
        _GROUPS[key] = g
    return g


def space_group_point_group(group):
    """The point group of a space group (by number or symbol) in tensym's setting of that symbol.

    Parameters
    ----------
    group : int or str
        Number 1..230 or a space-group symbol; see the module docstring.

    Returns
    -------
    PointGroup
        The catalog group of the class (same operations and generators) whose
        ``names.space_group`` records the space group, e.g. ``'R-3c (no. 167)'``,
        and whose ``setting`` ends with the sentence "the point group of space group ...".

    Raises
    ------
    UnknownGroupError
        For a number outside 1..230, or a symbol that is no space group tensym knows
        (the message names the nearest symbols).
    InvalidGroupError
        For another type.

    Examples
    --------
    >>> space_group_point_group("R-3c").setting_symbol, space_group_point_group("P312").setting_symbol
    ('-3m1', '312')
    """
    if isinstance(group, bool) or not isinstance(group, (int, str)):
        raise InvalidGroupError(
            f"a space group is given by its number (int 1..230) or symbol (str), got {type(group).__name__}"
        )
    if isinstance(group, int):
        symbol = _number_arg(group)
        number, setting, label, display = _lookup(symbol)
        return _group(number, setting, label, display)
    text = str(group).strip()
    if text.isdigit():
        if text in _AMBIGUOUS_DIGITS:
            raise UnknownGroupError(
                f"{text!r} is ambiguous: it reads as an n-fold axis (not in the catalog) or as space group "
                f"no. {text}; pass the int {text} or the symbol {_STANDARD[int(text) - 1]!r} for the space group, "
                "or build an n-fold axis with tensym.group_from_generators"
            )
        return space_group_point_group(int(text)) if 1 <= int(text) <= 230 else _number_arg(int(text))
    found = _lookup(text)
    if found is None:
        near = nearest_space_groups(text)
        raise UnknownGroupError(
            f"unknown space-group symbol {echo(text)}"
            + (f"; nearest space-group symbols: {', '.join(repr(s) for s in near)}" if near else "")
        )
    return _group(*found)
