"""Magnetic point groups: the 122 ordinary, grey and black-and-white groups.

Definitions
-----------
A magnetic point group M is a finite group of operations, each an orthogonal
matrix with a time-reversal flag (a primed operation g' is g followed by time
reversal 1'; flags multiply as signs: ``(g @ h)' `` is primed when exactly one
of g, h is).  Its spatial parts form the *parent* group G, one of the 32
crystallographic classes; its unprimed operations form the *unitary subgroup* H.

* ordinary (type I): no primed operation, M = G = H;
* grey (type II): M = G + G1' contains time reversal 1' itself, H = G;
* black-and-white (type III): M = H + (G - H)1' with H of index 2 in G.  The
  map G -> {+1, -1} that is -1 on the primed operations is a homomorphism with
  kernel H, so the primes of a few generating elements fix the group.

Two magnetic groups are the same magnetic point group (one of the 122
magnetic crystal classes) when an orthogonal Q turns one into the other,
``Q M1 Q^T = M2`` with the flags kept: the three 2/m subgroups of mmm give one
group m'm'm.  Here Q runs over the orthogonal matrices that normalise the parent
(m-3m, 6/mmm and their turns by 45 and 30 degrees about z contain all those
that matter); counting the classes gives 32 + 32 + 58 = 122.

Symbols
-------
A primed Hermann-Mauguin symbol in the setting of a catalog group: each
symbol position names the elements along one family of symmetry directions
(ITA Vol. A, Table 2.1.3.1):

==============  ==========================================================
system          positions
==============  ==========================================================
triclinic       the single element (1 or -1)
monoclinic      short symbol: the unique axis; setting symbols '121': x, y, z
orthorhombic    x, y, z
tetragonal      z; x and y; [110] and [1-10]
trigonal,       z; [100], [010], [-1-10] (hexagonal axes); [1-10], [120],
hexagonal       [-2-10]  (32, 3m, -3m: z and the [100] family)
cubic           x, y, z; the body diagonals <111>; the face diagonals <110>
==============  ==========================================================

A prime after an element (``4'``, ``m'``, ``-3'``; in ``4'/m`` the 4-fold, in
``2/m'`` the mirror) primes the operations of that element along every
direction of its position (4' primes 4+ and 4-; 2 = 4^2 stays unprimed).  The
primes must extend to a homomorphism G -> Z2, otherwise the symbol names no
magnetic group.  A trailing ``1'`` makes the grey group (``mmm1'``), which
carries no other prime.  Schoenflies-style names are accepted too: ``G(H)``
for black-and-white groups (``D2h(C2h)`` is m'm'm) and ``G1'`` for grey ones.

The class symbol of each magnetic point group (``m'mm``, ``4'/m'm'm``, ...)
is the one the tables use (International Tables for Crystallography Vol. D,
2013, ch. 1.5; R. R. Birss, Symmetry and Magnetism, 1964; written from
memory).  A group in another orientation of the same parent keeps that class
symbol as ``symbol`` and records its own spelling in ``setting_symbol``
(``point_group("mm'm'")`` is ``m'm'm`` with setting ``mm'm'``).

Examples
--------
>>> from tensym.groups.magnetic import magnetic_point_group, magnetic_point_groups
>>> g = magnetic_point_group("4'/m")
>>> g.symbol, g.order, g.is_magnetic
("4'/m", 8, True)
>>> magnetic_point_group("mm'm'").symbol
"m'm'm"
>>> len(magnetic_point_groups())
122
"""

from dataclasses import dataclass
import difflib
import math
import re

import numpy as np
import sympy as sp

from tensym.errors import GroupClosureError, InvalidGroupError, InvalidOptionError, UnknownGroupError
from tensym.exact.matrices import float_key
from tensym.groups.catalog import SETTINGS, catalog_group, default_setting, point_groups
from tensym.groups.finite import MAX_GROUP_ORDER, GroupNames, PointGroup
from tensym.groups.messages import echo
from tensym.groups.operations import HEXAGONAL_BASIS, Operation, proper_order
from tensym.groups.symbols import _point_group, as_group, normalise_symbol

__all__ = [
    "MagneticPointGroup",
    "MAGNETIC_KINDS",
    "magnetic_point_group",
    "magnetic_point_groups",
    "magnetic_class",
    "magnetic_group_from_generators",
    "magnetic_names",
    "unitary_subgroup",
    "parent_group",
    "is_magnetic_symbol",
]

#: The three kinds of magnetic point group, in the order of the types I, II, III.
MAGNETIC_KINDS = ("ordinary", "grey", "black-and-white")

# Class symbols of the 58 black-and-white groups per parent class (International
# Tables Vol. D, 2013, ch. 1.5; Birss 1964; from memory).  Each is checked against
# the enumeration of index-2 subgroups when the catalog is built.
_BLACK_WHITE = {
    "-1": ("-1'",), "2": ("2'",), "m": ("m'",), "2/m": ("2'/m", "2/m'", "2'/m'"),
    "222": ("2'2'2",), "mm2": ("m'm2'", "m'm'2"), "mmm": ("m'mm", "m'm'm", "m'm'm'"),
    "4": ("4'",), "-4": ("-4'",), "4/m": ("4'/m", "4/m'", "4'/m'"),
    "422": ("4'22'", "42'2'"), "4mm": ("4'mm'", "4m'm'"), "-42m": ("-4'2'm", "-4'2m'", "-42'm'"),
    "4/mmm": ("4/m'mm", "4'/mmm'", "4'/m'm'm", "4/mm'm'", "4/m'm'm'"),
    "-3": ("-3'",), "32": ("32'",), "3m": ("3m'",), "-3m": ("-3'm", "-3m'", "-3'm'"),
    "6": ("6'",), "-6": ("-6'",), "6/m": ("6'/m", "6/m'", "6'/m'"),
    "622": ("6'22'", "62'2'"), "6mm": ("6'mm'", "6m'm'"), "-6m2": ("-6'm'2", "-6'm2'", "-6m'2'"),
    "6/mmm": ("6/m'mm", "6'/mmm'", "6'/m'm'm", "6/mm'm'", "6/m'm'm'"),
    "m-3": ("m'-3'",), "432": ("4'32'",), "-43m": ("-4'3m'",), "m-3m": ("m'-3'm", "m-3m'", "m'-3'm'"),
}

_PRIME_VARIANTS = {"\u2032": "'", "\u2019": "'", "\u02b9": "'", "\u2033": "''", '"': "''"}
_TOKEN = re.compile(r"(-?[1-6])('*)(?:/m('*))?|m('*)")
_SCHOENFLIES_PAIR = re.compile(r"^([A-Za-z][A-Za-z0-9]*)\(([A-Za-z][A-Za-z0-9]*)\)$")


@dataclass(frozen=True)
class MagneticPointGroup:
    """One of the 122 magnetic point groups (a magnetic crystal class).

    Attributes
    ----------
    number : int
        Position 1..122 in the listing (parents in the order 1, -1, 2, ..., m-3m;
        for each parent the ordinary, the grey and then the black-and-white groups).
    symbol : str
        Class symbol, primed Hermann-Mauguin (``"m'm'm"``, ``"mmm1'"``, ``'mmm'``).
    schoenflies : str
        ``'D2h(C2h)'`` (parent(unitary subgroup)) for a black-and-white group,
        ``"D2h1'"`` for a grey one, the parent's symbol for an ordinary one.
    kind : str
        'ordinary', 'grey' or 'black-and-white' (types I, II, III).
    parent : str
        Short symbol of the parent class G (the spatial parts).
    unitary : str
        Short symbol of the class of the unitary subgroup H (the unprimed operations).
    order : int
        Number of operations of the magnetic group: |G| (ordinary,
        black-and-white) or 2|G| (grey).

    Examples
    --------
    >>> from tensym.groups.magnetic import magnetic_class
    >>> r = magnetic_class("m'm'm")
    >>> r.kind, r.parent, r.unitary, r.schoenflies
    ('black-and-white', 'mmm', '2/m', 'D2h(C2h)')
    """

    number: int
    symbol: str
    schoenflies: str
    kind: str
    parent: str
    unitary: str
    order: int

    @property
    def type_number(self):
        """1, 2 or 3: the type I (ordinary), II (grey), III (black-and-white)."""
        return MAGNETIC_KINDS.index(self.kind) + 1


# --- small kernels on operations ---------------------------------------------------
def _with_flag(op, flag):
    """A copy of ``op`` with the time-reversal flag ``flag`` (no checks, float image reused)."""
    new = object.__new__(Operation)
    object.__setattr__(new, "matrix", op.matrix)
    object.__setattr__(new, "time_reversal", bool(flag))
    object.__setattr__(new, "_num", op.numeric)
    return new


def _spatial_key(op):
    return op.key[:-1]


def _unit_axis(num):
    """Unit axis of the proper part of a float orthogonal matrix (None for +-1)."""
    det = 1.0 if np.linalg.det(num) > 0 else -1.0
    p = det * num
    if np.allclose(p, np.eye(3), atol=1e-9):
        return None
    if np.trace(p) > -1 + 1e-7:
        v = np.array([p[2, 1] - p[1, 2], p[0, 2] - p[2, 0], p[1, 0] - p[0, 1]])
    else:
        q = p + np.eye(3)
        v = q[:, int(np.argmax(np.linalg.norm(q, axis=0)))]
    return v / np.linalg.norm(v)


def _is_element(op, element):
    """True when ``op`` is an operation of the symbol element ('2', '-3', 'm', '-1', ...)."""
    if element == "m":
        return op.kind == "mirror"
    if element == "-1":
        return op.kind == "inversion"
    n = int(element.lstrip("-"))
    if element.startswith("-"):
        return op.kind == "rotoinversion" and proper_order(-op.numeric) == n
    return op.det == 1 and op.kind == "rotation" and op.order == n


# --- symmetry directions of the symbol positions -----------------------------------
_R3 = math.sqrt(3.0)
_X, _Y, _Z = (1.0, 0.0, 0.0), (0.0, 1.0, 0.0), (0.0, 0.0, 1.0)
_HEX_100 = ((1.0, 0.0, 0.0), (-0.5, _R3 / 2, 0.0), (0.5, _R3 / 2, 0.0))
_HEX_1M10 = ((_R3, -1.0, 0.0), (0.0, 1.0, 0.0), (_R3, 1.0, 0.0))
_C100 = (_X, _Y, _Z)
_C111 = ((1.0, 1.0, 1.0), (1.0, 1.0, -1.0), (1.0, -1.0, 1.0), (-1.0, 1.0, 1.0))
_C110 = ((1.0, 1.0, 0.0), (1.0, -1.0, 0.0), (1.0, 0.0, 1.0), (1.0, 0.0, -1.0), (0.0, 1.0, 1.0), (0.0, 1.0, -1.0))
_DIRECTIONS = {
    ("monoclinic", 3): ((_X,), (_Y,), (_Z,)),
    ("orthorhombic", 3): ((_X,), (_Y,), (_Z,)),
    ("tetragonal", 3): ((_Z,), (_X, _Y), ((1.0, 1.0, 0.0), (1.0, -1.0, 0.0))),
    ("trigonal", 2): ((_Z,), _HEX_100),
    ("trigonal", 3): ((_Z,), _HEX_100, _HEX_1M10),
    ("hexagonal", 3): ((_Z,), _HEX_100, _HEX_1M10),
    ("cubic", 2): (_C100, _C111),
    ("cubic", 3): (_C100, _C111, _C110),
}
_DIRECTION_WORDS = {
    ("monoclinic", 3): ("x", "y", "z"), ("orthorhombic", 3): ("x", "y", "z"),
    ("tetragonal", 3): ("z", "x and y", "[110] and [1-10]"),
    ("trigonal", 2): ("z", "[100] (hexagonal)"),
    ("trigonal", 3): ("z", "[100] (hexagonal)", "[1-10] (hexagonal)"),
    ("hexagonal", 3): ("z", "[100] (hexagonal)", "[1-10] (hexagonal)"),
    ("cubic", 2): ("<100>", "<111>"), ("cubic", 3): ("<100>", "<111>", "<110>"),
}


def _directions(system, n_positions):
    if n_positions == 1:
        return (None,), ("the principal element",)
    key = (system, n_positions)
    if key not in _DIRECTIONS:
        return None, None
    dirs = tuple(tuple(np.array(d) / np.linalg.norm(d) for d in fam) for fam in _DIRECTIONS[key])
    return dirs, _DIRECTION_WORDS[key]


def _ops_of(group, element, dirs):
    """Indices of the (unprimed) operations of ``group`` that the element names along ``dirs``."""
    out = []
    for i, op in enumerate(group.operations):
        if not _is_element(op, element):
            continue
        if dirs is not None and element != "-1":
            ax = _unit_axis(op.numeric)
            if not any(abs(abs(float(ax @ d)) - 1.0) < 1e-9 for d in dirs):
                continue
        out.append(i)
    return tuple(out)


# --- reading symbols ---------------------------------------------------------------
def _clean(text):
    s = str(text)
    for a, b in _PRIME_VARIANTS.items():
        s = s.replace(a, b)
    return normalise_symbol(s)


def _tokenize(s):
    """Positions of a Hermann-Mauguin symbol: lists of [element, number of primes]; None if unreadable."""
    pos, out = 0, []
    for m in _TOKEN.finditer(s):
        if m.start() != pos:
            return None
        digit, p1, p2, pm = m.groups()
        if digit is not None:
            item = [[digit, len(p1)]]
            if p2 is not None:
                item.append(["m", len(p2)])
        else:
            item = [["m", len(pm)]]
        out.append(item)
        pos = m.end()
    if pos != len(s) or not out:
        return None
    return out


def _unprimed(positions):
    return "".join("/".join(e for e, _ in p) for p in positions)


@dataclass(frozen=True)
class _Template:
    """Positions of a symbol in one catalog setting: per element (position, element, op indices)."""

    parent: PointGroup
    layout: tuple  # tuple of positions, each a tuple of (element, op indices)
    words: tuple

    def spell(self, phi, *, sep=""):
        parts = []
        for position in self.layout:
            elems = []
            for element, idx in position:
                flags = {phi[i] for i in idx}
                if len(flags) != 1 and element != "1":  # pragma: no cover - a homomorphism is a class function
                    raise ArithmeticError(f"element {element} carries mixed primes")
                prime = "'" if (element != "1" and flags.pop()) else ""
                elems.append(element + prime)
            parts.append("/".join(elems))
        return sep.join(parts)


_TEMPLATES = {}


def _template(symbol, group):
    """The _Template of an unprimed symbol spelled for the catalog ``group`` (cached)."""
    key = (symbol, group.setting_symbol)
    hit = _TEMPLATES.get(key)
    if hit is not None:
        return hit
    positions = _tokenize(_clean(symbol))
    if positions is None:  # pragma: no cover - catalog symbols are readable
        raise ValueError(f"cannot read the symbol {echo(symbol)}")
    dirs, words = _directions(group.crystal_system, len(positions))
    if dirs is None:
        raise UnknownGroupError(
            f"the symbol {echo(symbol)} has {len(positions)} positions, which does not fit a "
            f"{group.crystal_system} group; write the parent as in tensym.point_groups()"
        )
    layout = []
    for k, position in enumerate(positions):
        elems = []
        for element, _ in position:
            if element == "1":
                elems.append(("1", ()))
                continue
            idx = _ops_of(group, element, dirs[k])
            if not idx:
                raise UnknownGroupError(
                    f"the symbol {echo(symbol)} names an element {element} along {words[k]}, which the "
                    f"group {group.setting_symbol} does not have"
                )
            elems.append((element, idx))
        layout.append(tuple(elems))
    t = _Template(group, tuple(layout), tuple(words))
    _TEMPLATES[key] = t
    return t


def _propagate(group, named):
    """The homomorphism G -> Z2 with the values ``named`` {op index: 0/1}, or a conflict.

    Returns (phi, None) with phi a tuple of 0/1 per operation, or (None, i) where
    operation i is reached both primed and unprimed.
    """
    table = group.multiplication_table
    n = group.order
    phi = [None] * n
    phi[0] = 0
    frontier = [0]
    gens = sorted(named.items())
    while frontier:
        nxt = []
        for i in frontier:
            for j, f in gens:
                k = int(table[j, i])
                v = phi[i] ^ f
                if phi[k] is None:
                    phi[k] = v
                    nxt.append(k)
                elif phi[k] != v:
                    return None, k
        frontier = nxt
    if any(v is None for v in phi):  # pragma: no cover - symbol elements generate the parent
        raise ArithmeticError("the named elements do not generate the parent group")
    arr = np.array(phi, dtype=np.int64)
    if np.any(arr[table] != (arr[:, None] ^ arr[None, :])):  # pragma: no cover - BFS from generators
        raise ArithmeticError("the primes do not define a homomorphism")
    return tuple(int(v) for v in phi), None


def _homomorphisms(group):
    """Every homomorphism G -> Z2 as a tuple of 0/1 per operation, trivial first."""
    gens = [group.index(g) for g in group.generators]
    out = []
    for bits in range(2 ** len(gens)):
        named = {}
        for b, j in enumerate(gens):
            named[j] = named.get(j, 0) | ((bits >> b) & 1)
        phi, _ = _propagate(group, named)
        if phi is not None and phi not in out:
            out.append(phi)
    return out


# --- building groups -----------------------------------------------------------------
_GROUPS = {}


def _build(parent, phi, grey, names):
    ops = parent.operations
    if grey:
        mops = tuple(ops) + tuple(_with_flag(op, True) for op in ops)
        gens = tuple(parent.generators) + (Operation(sp.ImmutableMatrix(sp.eye(3)), True),)
    else:
        mops = tuple(op if not phi[i] else _with_flag(op, True) for i, op in enumerate(ops))
        gens = tuple(_with_flag(g, phi[parent.index(g)]) for g in parent.generators)
    return PointGroup(mops, gens, names)


def _unitary_symbol(parent, phi):
    from tensym.groups.recognition import _family

    return _family([op for i, op in enumerate(parent.operations) if not phi[i]])[0]


def _names(parent, phi, grey, *, rotation=None):
    """GroupNames of the magnetic group (parent in a catalog setting, phi, grey)."""
    cat = _catalog()
    pn = parent.names
    if grey:
        rec = cat.by_key[("grey", pn.hm, pn.hm)]
        setting = pn.setting_symbol + "1'"
        full = pn.full_hm + " 1'"
        words = f"{pn.setting}; every operation also with time reversal (grey group)"
    else:
        h = _unitary_symbol(parent, phi)
        rec = cat.by_key[("black-and-white", pn.hm, h)]
        setting = _template(pn.setting_symbol, parent).spell(phi)
        full = _template(pn.full_hm, parent).spell(phi, sep=" ")
        words = f"{pn.setting}; primed (with time reversal): the operations outside the unitary subgroup {h}"
    if rotation is not None:
        words += f"; re-oriented: g = Q g_std Q^T with Q = {sp.sstr(sp.Matrix(rotation).tolist())}"
    return GroupNames(hm=rec.symbol, full_hm=full, schoenflies=rec.schoenflies, setting=words,
                      crystal_system=pn.crystal_system, laue_class=pn.laue_class, rotation=rotation,
                      setting_symbol=setting)


def _group(parent, phi, grey):
    key = (parent.setting_symbol, "grey" if grey else phi)
    g = _GROUPS.get(key)
    if g is None:
        g = _build(parent, phi, grey, _names(parent, phi, grey))
        _GROUPS[key] = g
    return g


# --- the catalog of 122 ----------------------------------------------------------------
@dataclass(frozen=True)
class _Catalog:
    records: tuple
    by_key: dict  # (kind, parent, unitary) -> record
    by_symbol: dict  # normalised spelling -> record
    reps: dict  # number -> (parent setting symbol, phi or None, grey)


_CAT = None
_NORMALISER_CANDIDATES = None


def _candidates():
    """Float orthogonal matrices containing the normaliser (mod the parent) of every standard parent."""
    global _NORMALISER_CANDIDATES
    if _NORMALISER_CANDIDATES is None:
        out = []
        for sym, turn in (("m-3m", math.pi / 4), ("6/mmm", math.pi / 6)):
            c, s = math.cos(turn), math.sin(turn)
            rz = np.array([[c, -s, 0.0], [s, c, 0.0], [0.0, 0.0, 1.0]])
            for op in catalog_group(default_setting(sym)).operations:
                out.append(op.numeric)
                out.append(rz @ op.numeric)
        _NORMALISER_CANDIDATES = out
    return _NORMALISER_CANDIDATES


def _equivalent(parent, phi1, phi2, normalisers):
    ops = parent.operations
    primed1 = [ops[i].numeric for i, v in enumerate(phi1) if v]
    target = frozenset(float_key(ops[i].numeric) for i, v in enumerate(phi2) if v)
    for q in normalisers:
        if frozenset(float_key(q @ m @ q.T) for m in primed1) == target:
            return True
    return False


def _classes_of(parent):
    """Equivalence classes of the non-trivial homomorphisms of a standard parent (lists of phi)."""
    keys = parent.operation_keys()
    normalisers = []
    for q in _candidates():
        if all(float_key(q @ g.numeric @ q.T) + (0,) in keys for g in parent.generators):
            normalisers.append(q)
    classes = []
    for phi in _homomorphisms(parent)[1:]:
        for cls in classes:
            if _equivalent(parent, cls[0], phi, normalisers):
                cls.append(phi)
                break
        else:
            classes.append([phi])
    return classes


def _catalog():
    global _CAT
    if _CAT is not None:
        return _CAT
    from tensym.groups.recognition import _family

    records, by_key, by_symbol, reps = [], {}, {}, {}

    def add(rec, rep):
        records.append(rec)
        by_key[(rec.kind, rec.parent, rec.unitary)] = rec
        for spelling in (rec.symbol, rec.schoenflies):
            by_symbol[_clean(spelling).lower()] = rec
        reps[rec.number] = rep

    for hm in point_groups():
        parent = catalog_group(default_setting(hm))
        sch, n = parent.schoenflies, parent.order
        add(MagneticPointGroup(len(records) + 1, hm, sch, "ordinary", hm, hm, n), (parent.setting_symbol, None, False))
        add(MagneticPointGroup(len(records) + 1, hm + "1'", sch + "1'", "grey", hm, hm, 2 * n),
            (parent.setting_symbol, None, True))
        classes = _classes_of(parent)
        labels = []
        for cls in classes:
            hs = {_family([op for i, op in enumerate(parent.operations) if not phi[i]])[:2] for phi in cls}
            if len(hs) != 1:  # pragma: no cover - checked by the test-suite through the count
                raise ArithmeticError(f"one magnetic class of {hm} has unitary subgroups of several classes {hs}")
            labels.append(hs.pop())
        if len(set(labels)) != len(labels):  # pragma: no cover
            raise ArithmeticError(f"two magnetic classes of {hm} share the unitary subgroup class")
        names = _BLACK_WHITE.get(hm, ())
        if len(names) != len(classes):  # pragma: no cover - the symbol table is checked here
            raise ArithmeticError(f"{hm}: {len(classes)} black-and-white classes but symbols {names}")
        tpl = _template(parent.setting_symbol, parent)
        used = set()
        for sym in names:
            phi = _phi_of_symbol(sym, parent)
            k = next(i for i, cls in enumerate(classes) if phi in cls)
            if k in used:  # pragma: no cover - the symbol table is checked here
                raise ArithmeticError(f"{hm}: two symbols name the same magnetic class ({sym})")
            used.add(k)
            h_hm, h_sch = labels[k]
            add(MagneticPointGroup(len(records) + 1, sym, f"{sch}({h_sch})", "black-and-white", hm, h_hm, n),
                (parent.setting_symbol, phi, False))
            if tpl.spell(phi).replace("1", "") != _clean(sym).replace("1", ""):  # pragma: no cover
                raise ArithmeticError(f"the symbol {sym} does not spell back ({tpl.spell(phi)})")
    _CAT = _Catalog(tuple(records), by_key, by_symbol, reps)
    return _CAT


def _phi_of_symbol(sym, parent):
    """phi of a black-and-white class symbol spelled in the parent's own setting (table check)."""
    positions = _tokenize(_clean(sym))
    tpl = _template(_unprimed(positions), parent)
    named = {}
    for position, tpos in zip(positions, tpl.layout):
        for (element, primes), (_, idx) in zip(position, tpos):
            for i in idx:
                named[i] = 1 if primes else 0
    phi, _ = _propagate(parent, named)
    if phi is None:  # pragma: no cover - the table holds valid symbols
        raise ArithmeticError(f"the table symbol {sym} is inconsistent")
    return phi


# --- public lookup ---------------------------------------------------------------------
def is_magnetic_symbol(text):
    """True when ``text`` is written as a magnetic group symbol (a prime, or Schoenflies ``G(H)``).

    Examples
    --------
    >>> is_magnetic_symbol("m'm'm"), is_magnetic_symbol("D2h(C2h)"), is_magnetic_symbol("SO(3)")
    (True, True, False)
    """
    if not isinstance(text, str):
        return False
    s = _clean(text)
    if "'" in s:
        return True
    m = _SCHOENFLIES_PAIR.match(s)
    return bool(m) and s.lower() in _catalog().by_symbol


def _all_spellings():
    cat = _catalog()
    return [r.symbol for r in cat.records] + [r.schoenflies for r in cat.records]


def _unknown(symbol, reason):
    key = _clean(symbol[:200])  # the suggestions compare at most 200 characters
    pool = _all_spellings()
    near = difflib.get_close_matches(key, pool, n=5, cutoff=0.5) or difflib.get_close_matches(key, pool, n=5,
                                                                                                cutoff=0.0)
    return UnknownGroupError(
        f"{echo(symbol)} names no magnetic point group: {reason}; nearest valid symbols: "
        f"{', '.join(near)} (tensym.magnetic_point_groups() lists all 122)"
    )


def _parent_of(stripped, symbol):
    try:
        g = _point_group(stripped, False)
    except UnknownGroupError:
        raise _unknown(symbol, f"{echo(stripped)} without its primes is not a point-group symbol") from None
    if not isinstance(g, PointGroup) or not g.setting_symbol or g.crystal_system == "icosahedral":
        raise _unknown(symbol, f"magnetic symbols are read for the 32 crystallographic classes, not {echo(stripped)}")
    return g


def magnetic_point_group(symbol):
    """The magnetic point group of a primed symbol (cached: one object per group and setting).

    Parameters
    ----------
    symbol : str
        Primed Hermann-Mauguin symbol in the setting of a catalog group
        (``"m'm'm"``, ``"4'/m"``, ``"-3'm'"``, ``"mm'm'"``, ``"-4'm2'"``), a grey
        symbol with the suffix ``1'`` (``"mmm1'"``, ``"11'"``), or a
        Schoenflies-style name (``'D2h(C2h)'``, ``"D2h1'"``).  An unprimed
        symbol gives the ordinary group.  See the module docstring for the
        positions; primes may also be typed as U+2032.

    Returns
    -------
    PointGroup
        Its operations carry the time-reversal flags; ``symbol`` is the class
        symbol, ``setting_symbol`` the spelling in this orientation.

    Raises
    ------
    UnknownGroupError
        When the symbol names no magnetic group: an unknown parent, an element
        primed twice, a prime on a position '1', primes together with the grey
        suffix, or primes that no homomorphism G -> Z2 has (``"2'2'2'"``:
        2x' 2y' = 2z is unprimed); the message lists the nearest valid symbols.
    InvalidGroupError
        If ``symbol`` is not a string.

    Examples
    --------
    >>> g = magnetic_point_group("-3'm'")
    >>> g.symbol, g.schoenflies, g.setting_symbol
    ("-3'm'", 'D3d(D3)', "-3'm'1")
    >>> magnetic_point_group("mmm1'").order
    16
    """
    if not isinstance(symbol, str):
        raise InvalidGroupError(f"a magnetic group symbol must be a string such as \"m'm'm\", got {echo(symbol)}")
    s = _clean(symbol)
    if not s:
        raise _unknown(symbol, "the symbol is empty")
    if "''" in s:
        raise _unknown(symbol, "an element carries two primes (an element is primed or not)")
    m = _SCHOENFLIES_PAIR.match(s)
    if m and "'" not in s:
        rec = _catalog().by_symbol.get(s.lower())
        if rec is None or rec.kind != "black-and-white":
            raise _unknown(symbol, "G(H) needs a parent G and an index-2 subgroup H among the Schoenflies symbols")
        return _group_of_record(rec)
    if s.endswith("1'") and not s.endswith("-1'"):
        prefix = s[:-2] or "1"
        stripped = prefix.replace("'", "")
        try:
            parent = _point_group(stripped, False) if stripped else None
        except UnknownGroupError:
            parent = None
        if isinstance(parent, PointGroup) and parent.setting_symbol:
            if "'" in prefix:
                raise _unknown(symbol, f"a grey group ({stripped}1') carries no other prime; write "
                                       f"{stripped}1' or the primed symbol without 1'")
            return _group(_parent_of(stripped, symbol), None, True)
    positions = _tokenize(s)
    if positions is None:
        rec = _catalog().by_symbol.get(s.lower())
        if rec is not None:
            return _group_of_record(rec)
        raise _unknown(symbol, "it is not read as a primed Hermann-Mauguin or Schoenflies symbol")
    parent = _parent_of(_unprimed(positions), symbol)
    tpl = _template(_unprimed(positions), parent)
    named = {}
    for position, tpos in zip(positions, tpl.layout):
        for (element, primes), (_, idx) in zip(position, tpos):
            if element == "1":
                if primes:
                    raise _unknown(symbol, "a position 1 cannot be primed (time reversal alone is the grey "
                                           "suffix 1')")
                continue
            for i in idx:
                named[i] = 1 if primes else 0
    phi, clash = _propagate(parent, named)
    if phi is None:
        op = parent.operations[clash]
        valid = _suggestions(tpl, positions)
        raise UnknownGroupError(
            f"{echo(symbol)} names no magnetic point group: its primes contradict each other (the named elements "
            f"make {op.describe()} both primed and unprimed, so no index-2 subgroup of {parent.setting_symbol} is "
            f"left unprimed); valid primings of {parent.setting_symbol}: {', '.join(valid)}"
        )
    if not any(phi):
        return parent
    return _group(parent, phi, False)


def _suggestions(tpl, positions, n=6):
    """Consistent primed spellings of the same positions, nearest (fewest prime changes) first."""
    wanted = [primes > 0 for position in positions for _, primes in position]
    out = []
    for phi in _homomorphisms(tpl.parent):
        spelled = tpl.spell(phi)
        marks = [bool(phi[idx[0]]) if idx else False for position in tpl.layout for _, idx in position]
        dist = sum(a != b for a, b in zip(marks, wanted))
        out.append((dist, len(out), spelled))
    out.sort()
    return [s for _, _, s in out[:n]]


def _group_of_record(rec):
    setting, phi, grey = _catalog().reps[rec.number]
    parent = catalog_group(setting)
    if rec.kind == "ordinary":
        return parent
    return _group(parent, phi, grey)


def magnetic_point_groups(*, kind="all"):
    """The 122 magnetic point groups (magnetic crystal classes), as frozen records.

    Parameters
    ----------
    kind : {'all', 'ordinary', 'grey', 'black-and-white'}
        Keep only one kind (32, 32 and 58 groups).

    Returns
    -------
    tuple of MagneticPointGroup
        In the order of :attr:`MagneticPointGroup.number`; the group itself is
        ``tensym.point_group(record.symbol)``.

    Raises
    ------
    InvalidOptionError
        If ``kind`` is not one of the names above.

    Examples
    --------
    >>> [r.symbol for r in magnetic_point_groups() if r.parent == "mmm"]
    ['mmm', "mmm1'", "m'mm", "m'm'm", "m'm'm'"]
    >>> len(magnetic_point_groups(kind="black-and-white"))
    58
    """
    allowed = ("all",) + MAGNETIC_KINDS
    if kind not in allowed:
        raise InvalidOptionError(f"kind={echo(kind)} is not one of {allowed}")
    recs = _catalog().records
    return recs if kind == "all" else tuple(r for r in recs if r.kind == kind)


# --- recognising magnetic groups ----------------------------------------------------------
def _split(group):
    """(spatial ops in first-seen order, {spatial key: set of flags})."""
    spatial, flags = [], {}
    for op in group.operations:
        k = _spatial_key(op)
        if k not in flags:
            flags[k] = set()
            spatial.append(_with_flag(op, False))
        flags[k].add(op.time_reversal)
    return spatial, flags


def _generating_set(ops):
    """A few of ``ops`` (unprimed or not) that generate all of them (greedy, largest order first)."""
    from tensym.groups.finite import _close

    keys = {op.key for op in ops}
    chosen, have = [], {Operation.identity().key}
    for op in sorted(ops, key=lambda o: (-(o.order or 0), o.key)):
        if op.key in have:
            continue
        chosen.append(op)
        closed, _ = _close(chosen, max(len(ops), 1) + 1)
        have = {o.key for o in closed}
        if have == keys:
            break
    return chosen


def _parent_and_phi(group):
    """(catalog parent, phi on its operations, grey, rotation Q or None) of a magnetic group, or None."""
    from tensym.groups.recognition import recognise

    spatial, flags = _split(group)
    grey = Operation(sp.ImmutableMatrix(sp.eye(3)), True) in group
    p = PointGroup(spatial, _generating_set(spatial) or [Operation.identity()])
    n0 = recognise(p)
    if not n0.setting_symbol or n0.crystal_system in ("icosahedral", ""):
        return None, n0, grey
    parent = catalog_group(n0.setting_symbol)
    q = n0.rotation
    qn = None if q is None else np.array([[float(x) for x in row] for row in sp.Matrix(q).tolist()])
    phi = []
    for op in parent.operations:
        m = op.numeric if qn is None else qn @ op.numeric @ qn.T
        f = flags[float_key(m)]
        phi.append(0 if grey else int(True in f))
    return (parent, tuple(phi), grey, q), n0, grey


def magnetic_names(group):
    """The names of a magnetic group: its class symbol, Schoenflies name and setting spelling.

    Parameters
    ----------
    group : PointGroup
        A group with some primed operation (an ordinary group gets its
        ordinary names through ``tensym.recognise``).

    Returns
    -------
    GroupNames
        ``hm`` is the class symbol (``"m'm'm"``), ``schoenflies`` ``'D2h(C2h)'``
        or ``"D2h1'"``, ``setting_symbol`` the primed spelling in the catalog
        setting of the parent (``"mm'm'"``), ``rotation`` the exact Q relating
        the parent to that setting (None when it is that setting), ``full_hm``
        the primed full symbol.  For a non-crystallographic parent (icosahedral,
        5-fold axes) only ``schoenflies`` is set, as ``G(H)`` or ``G1'``.

    Examples
    --------
    >>> from tensym.groups.recognition import group_from_generators
    >>> n = magnetic_names(group_from_generators(["-x,-y,z", "-x,y,-z,-1", "-x,-y,-z"]))
    >>> n.hm, n.setting_symbol, n.full_hm
    ("m'm'm", "m'm'm", "2'/m' 2'/m' 2/m")
    """
    group = as_group(group)
    if not group.is_magnetic:
        from tensym.groups.recognition import recognise

        return recognise(group)
    found, n0, grey = _parent_and_phi(group)
    if found is None:
        if grey:
            return GroupNames(schoenflies=n0.schoenflies + "1'" if n0.schoenflies else "")
        from tensym.groups.recognition import _family

        h = [op for op in group.operations if not op.time_reversal]
        return GroupNames(schoenflies=f"{n0.schoenflies}({_family(h)[1]})" if n0.schoenflies else "")
    parent, phi, grey, q = found
    return _names(parent, phi, grey, rotation=q)


def magnetic_class(group):
    """The record of the magnetic point group (one of the 122) that a group or symbol belongs to.

    Parameters
    ----------
    group : PointGroup or str
        Any finite crystallographic group, magnetic or not, in any orientation,
        or its symbol.

    Returns
    -------
    MagneticPointGroup

    Raises
    ------
    UnknownGroupError
        For an unknown symbol.
    InvalidGroupError
        For a continuous or non-crystallographic group, or a non-group.

    Examples
    --------
    >>> magnetic_class("mm'm'").symbol, magnetic_class("6/mmm").kind
    ("m'm'm", 'ordinary')
    """
    g = as_group(group)
    cat = _catalog()
    if not isinstance(g, PointGroup):
        raise InvalidGroupError(f"{g.symbol} is a continuous group, not one of the 122 magnetic point groups")
    names = g.names if (g.names.hm and g.is_magnetic) else magnetic_names(g)
    for rec in cat.records:
        if rec.symbol == names.hm and (rec.kind == "ordinary") != g.is_magnetic:
            return rec
    raise InvalidGroupError(
        f"the group {names.schoenflies or names.hm or g!r} is not crystallographic, so it is not one of the "
        "122 magnetic point groups"
    )


def unitary_subgroup(group):
    """The unitary subgroup H: the operations without time reversal, as a recognised PointGroup.

    Examples
    --------
    >>> unitary_subgroup("m'm'm").setting_symbol
    '112/m'
    >>> unitary_subgroup("mmm1'").symbol
    'mmm'
    """
    from tensym.groups.recognition import recognise

    g = as_group(group)
    ops = [op for op in g.operations if not op.time_reversal]
    h = PointGroup(ops, _generating_set(ops) or [Operation.identity()])
    return PointGroup(h.operations, h.generators, recognise(h))


def parent_group(group):
    """The parent group G: the spatial parts of all operations, as a recognised PointGroup.

    Examples
    --------
    >>> parent_group("4'/m").symbol, parent_group("4'/m").order
    ('4/m', 8)
    """
    from tensym.groups.recognition import recognise

    g = as_group(group)
    spatial, _ = _split(g)
    p = PointGroup(spatial, _generating_set(spatial) or [Operation.identity()])
    return PointGroup(p.operations, p.generators, recognise(p))


# --- user generators with time-reversal marks --------------------------------------------
def _mark_words(gens):
    """Closure of marked generators with shortest words: {(spatial key, flag): word (tuple of indices)}."""
    start = (float_key(np.eye(3)), False)
    words = {start: ()}
    mats = {start: np.eye(3)}
    frontier = [start]
    limit = 2 * MAX_GROUP_ORDER
    while frontier:
        nxt = []
        for s in frontier:
            for j, g in enumerate(gens):
                m = g.numeric @ mats[s]
                t = (float_key(m), s[1] != g.time_reversal)
                if t in words:
                    continue
                words[t] = (j,) + words[s]
                mats[t] = m
                nxt.append(t)
                if len(words) > limit:  # pragma: no cover - the closure was checked before
                    return words, mats
        frontier = nxt
    return words, mats


def _word_text(word):
    return " @ ".join(f"g{j + 1}" for j in word) if word else "1"


def magnetic_group_from_generators(generators):
    """The magnetic group generated by Operations with time-reversal flags, recognised and named.

    Parameters
    ----------
    generators : sequence of Operation
        Operations, some primed (``Operation.from_triplet("-y,x,z,-1")`` or
        ``time_reversal=True``).  Time reversal 1' itself (``'x,y,z,-1'``) among
        them asks for a grey group.

    Returns
    -------
    PointGroup
        With :func:`magnetic_names` (class symbol, setting spelling).

    Raises
    ------
    GroupClosureError
        When the closure is infinite or too large, or when the marks contradict
        each other: some operation comes out both primed and unprimed (so the
        closure holds 1' alone) although 1' is not among the generators; the
        message shows the two products and the consistent markings.

    Examples
    --------
    >>> g = magnetic_group_from_generators([Operation.from_triplet("-y,x,z,-1")])
    >>> g.symbol, g.order
    ("4'", 4)
    """
    gens = list(generators)
    g = PointGroup.from_generators(gens, limit=2 * MAX_GROUP_ORDER)
    theta = Operation(sp.ImmutableMatrix(sp.eye(3)), True)
    if theta in g and not any(x.key == theta.key for x in gens):
        words, _ = _mark_words(gens)
        clash = None
        for (k, f), w in sorted(words.items(), key=lambda kv: (len(kv[1]), kv[0])):
            if f and (k, False) in words:
                clash = (k, words[(k, False)], w)
                break
        op = _with_flag(next(o for o in g.operations if _spatial_key(o) == clash[0]), False)
        listing = ", ".join(f"g{j + 1} = {x.triplet()}" for j, x in enumerate(gens))
        good = _consistent_marks(gens)
        raise GroupClosureError(
            f"the time-reversal marks of the generators contradict each other: {op.describe()} comes out "
            f"unprimed as {_word_text(clash[1])} and primed as {_word_text(clash[2])} ({listing}), so the group "
            "would contain time reversal 1' on its own. Add 'x,y,z,-1' to the generators if the grey group is "
            f"meant; marks that make a black-and-white group: {good}"
        )
    if not g.is_magnetic:
        from tensym.groups.recognition import recognise

        return PointGroup(g.operations, gens, recognise(g))
    return PointGroup(g.operations, gens, magnetic_names(g))


def _consistent_marks(gens):
    spatial = [_with_flag(x, False) for x in gens]
    out = []
    for bits in range(1, 2 ** len(spatial)):
        trial = [_with_flag(x, (bits >> j) & 1) for j, x in enumerate(spatial)]
        words, _ = _mark_words(trial)
        if not any(f and (k, False) in words for (k, f) in words):
            out.append("(" + ", ".join(f"g{j + 1}{chr(39) if (bits >> j) & 1 else ''}" for j in range(len(trial)))
                       + ")")
    return "; ".join(out[:6]) if out else "none (every marking gives the grey group)"
