"""Character tables of finite point groups: the result types and their construction.

A :class:`CharacterTable` is computed from the group alone (see
:mod:`tensym.reps.characters` for the exact method and :mod:`tensym.reps.labels`
for the naming conventions) and cached per group setting.  Irrep matrices are
built on demand, exactly, inside spaces of harmonic polynomials (see
:func:`tensym.reps.irreps.build_matrices`).

Magnetic groups
---------------
The table of a magnetic group is the table of the group *as an abstract
group*: ordinary linear representations, with primed operations g' = g 1'
treated as group elements like any other.  These are the characters of the
real linear action on a property tensor (time-odd tensors change sign under
g').  The antiunitary theory (Wigner's corepresentations of a quantum state
space) is in :func:`tensym.reps.magnetic.corepresentations`.

* Grey group G1' = G x {1, 1'}: built exactly from the table of G.  Classes
  C (in G's order), then C 1', written ``C·θ`` (θ = 1', time reversal;
  E 1' is written ``θ``).  Irreps Gamma+ (chi(g 1') = chi(g), time-even)
  then Gamma- (chi(g 1') = -chi(g), time-odd), labelled with the suffix
  ``+`` / ``-`` after G's Mulliken label (``A1g+``, ``Eu-``; LaTeX
  ``A_{1g}^{+}``), as in the grey breakdowns of
  :func:`tensym.reps.magnetic.magnetic_decompose`.
* Black-and-white group M = H + (G - H)1': the spatial parts map M onto its
  parent G isomorphically, so the classes and irreps are G's, labelled by the
  spatial parts (G's Mulliken labels); a class of primed operations carries the
  ``·θ`` mark (``2C4·θ`` in 4'/m).

Examples
--------
>>> from tensym.groups.finite import PointGroup
>>> from tensym.groups.operations import Operation
>>> g = PointGroup.from_generators([Operation.from_triplet("-y,x,z"), Operation.from_triplet("x,-y,z")])
>>> t = finite_table(g)
>>> [i.label for i in t.irreps]
['A1', 'A2', 'B1', 'B2', 'E']
>>> [c.name for c in t.classes]
['E', '2C4', 'C2', '2σv', '2σd']
"""

from dataclasses import dataclass, field
import difflib
import re

import sympy as sp

from tensym.errors import UnknownIrrepError, RepresentationError
from tensym.groups.operations import Operation
from tensym.reps.characters import class_data, exact_characters
from tensym.reps.cyclotomic import Cyclotomic
from tensym.reps.labels import label_irreps, name_classes, time_parity_label, time_reversed_class_name

__all__ = ["ConjugacyClass", "Irrep", "CharacterTable", "character_table", "finite_table", "group_key"]


@dataclass(frozen=True)
class ConjugacyClass:
    """One conjugacy class of a finite group.

    Attributes
    ----------
    name : str
        Conventional name with the class size in front, e.g. ``'2C3'``, ``'3σv'``;
        a class of primed (time-reversed) operations ends in ``·θ``
        (``'2C4·θ'``; the time reversal 1' itself is ``'θ'``).
    latex : str
        The name in LaTeX (``'2C_{3}'``, ``'3\\\\sigma_{v}'``, ``'2C_{4}\\\\cdot\\\\theta'``).
    size : int
        Number of elements.
    representative : Operation
        One element of the class (the first in the group's operation order).
    indices : tuple of int
        Positions of the members in ``group.operations``.
    """

    name: str
    latex: str
    size: int
    representative: object = field(repr=False)
    indices: tuple = field(repr=False)


@dataclass(frozen=True)
class Irrep:
    """An irreducible representation of a point group.

    Attributes
    ----------
    label : str
        Mulliken label (ASCII, prime as ``'``): ``'A1g'``, ``'E'``, ``"A2''"``,
        ``'1E'`` / ``'2E'`` for the members of a complex-conjugate pair; in a
        grey group the time parity follows: ``'A1g+'`` (even under 1'),
        ``'A1g-'`` (odd).
    latex : str
        The label in LaTeX, e.g. ``'A_{1g}'``, ``'{}^{1}E'``, ``'A_{1g}^{+}'``.
    dim : int
        Dimension.
    characters : tuple
        Exact character (sympy number) at each class, in the table's class order.
    is_real : bool
        True when every character is real.  (Every real irrep of a point group
        has real orthogonal matrices.)
    conjugate : str or None
        For a complex irrep, the label of its complex conjugate.
    real_label : str
        Label of the real irrep that contains it: the label itself for a real
        irrep, the pair's label (``'E'``) for a member of a complex pair.
    """

    label: str
    latex: str
    dim: int
    characters: tuple
    is_real: bool
    conjugate: object = None
    real_label: str = ""


def group_key(group):
    """Hashable key of a finite group in its setting (operations and recorded re-orientation)."""
    rot = getattr(getattr(group, "names", None), "rotation", None)
    rkey = None if rot is None else tuple(round(float(v), 9) for v in sp.Matrix(rot))
    return (tuple(op.key for op in group.operations), rkey)


class CharacterTable:
    """The exact character table of a finite point group (immutable).

    Attributes
    ----------
    group : PointGroup
        The group, in its own setting.
    classes : tuple of ConjugacyClass
        Classes in conventional order.
    irreps : tuple of Irrep
        Irreducible representations over the complex numbers, in Mulliken order;
        complex-conjugate pairs appear as their two members (``1E``, ``2E``).
    real_irreps : tuple of Irrep
        The irreducible representations over the real numbers: each complex
        pair replaced by its real two-dimensional form (label ``E``,
        characters ``chi + conj(chi)``).

    Notes
    -----
    The values are sympy numbers (radicals such as ``-1/2 + sqrt(3)*I/2`` or
    ``1/2 + sqrt(5)/2``).  ``str(table)`` is a text table, :meth:`latex` a
    LaTeX tabular.  Tables are cached per group setting; build one with
    :func:`tensym.character_table`.

    Examples
    --------
    >>> from tensym.groups.finite import PointGroup
    >>> from tensym.groups.operations import Operation
    >>> c3 = PointGroup.from_generators([Operation.from_triplet("-y,x-y,z", basis="hexagonal")])
    >>> t = finite_table(c3)
    >>> [i.label for i in t.irreps], [i.label for i in t.real_irreps]
    (['A', '1E', '2E'], ['A', 'E'])
    >>> t.irrep("1E").characters
    (1, -1/2 + sqrt(3)*I/2, -1/2 - sqrt(3)*I/2)
    """

    def __init__(self, group, classes, irreps, rows, data, info, *, grey_of=None):
        self._group = group
        self._grey_of = grey_of  # grey group: the table of its unitary subgroup H (G1' = H x {1, 1'})
        self._classes = tuple(classes)
        self._irreps = tuple(irreps)
        self._rows = rows  # label -> tuple of Cyclotomic in class order
        self._data = data
        self._info = info
        self._by_label = {i.label: i for i in self._irreps}
        real = []
        seen = set()
        for i in self._irreps:
            if i.is_real:
                real.append(i)
            elif i.real_label not in seen:
                seen.add(i.real_label)
                partner = self._by_label[i.conjugate]
                chars = tuple(sp.expand(a + b) for a, b in zip(i.characters, partner.characters))
                tex = re.sub(r"^\{\}\^\{\d+\}", "", i.latex)  # '{}^{1}E_{g}' -> 'E_{g}'
                real.append(Irrep(i.real_label, tex, 2, chars, True, None, i.real_label))
        self._real = tuple(real)
        self._by_real = {i.label: i for i in self._real}
        self._matrices = {}
        self._class_pos = {}
        for ci, c in enumerate(self._classes):
            for m in c.indices:
                self._class_pos[m] = ci

    group = property(lambda self: self._group, doc="The group (PointGroup).")
    classes = property(lambda self: self._classes, doc="Conjugacy classes (tuple of ConjugacyClass).")
    irreps = property(lambda self: self._irreps, doc="Complex irreps (tuple of Irrep).")
    real_irreps = property(lambda self: self._real, doc="Real irreps, complex pairs combined (tuple of Irrep).")

    @property
    def order(self):
        """Group order."""
        return self._group.order

    @property
    def labels(self):
        """Labels of :attr:`irreps` (tuple of str)."""
        return tuple(i.label for i in self._irreps)

    @property
    def values(self):
        """Character matrix (sympy ImmutableMatrix, irreps x classes)."""
        return sp.ImmutableMatrix([list(i.characters) for i in self._irreps])

    def all_labels(self):
        """Every accepted label: complex members and real forms."""
        return tuple(dict.fromkeys([i.label for i in self._irreps] + [i.label for i in self._real]))

    def irrep(self, label):
        """The irrep with this label (complex member or real form).

        Spelling is tolerant: ``A1g``, ``A_1g``, ``a1g``, ``E'`` / ``E_prime``.

        Raises
        ------
        UnknownIrrepError
            If the group has no such irrep; the message lists the nearest labels.
        """
        if isinstance(label, Irrep):
            label = label.label
        if not isinstance(label, str):
            raise UnknownIrrepError(f"an irrep label must be a string such as 'A1', got {label!r}")
        key = _normalise_label(label)
        for pool in (self._by_label, self._by_real):
            for lab, irr in pool.items():
                if _normalise_label(lab) == key:
                    return irr
        options = list(self.all_labels())
        near = difflib.get_close_matches(label, options, n=3, cutoff=0.3)
        hint = f"; nearest: {', '.join(near)}" if near else ""
        raise UnknownIrrepError(
            f"group {self._group_name()} has no irrep {label!r}{hint} (its irreps: {', '.join(options)})"
        )

    def _group_name(self):
        n = getattr(self._group, "names", None)
        return (n.hm or n.schoenflies) if n is not None and (n.hm or n.schoenflies) else repr(self._group)

    def class_of(self, op):
        """The ConjugacyClass containing ``op`` (RepresentationError if not in the group)."""
        try:
            return self._classes[self._class_pos[self._group.index(op)]]
        except KeyError:
            raise RepresentationError(f"{op!r} is not an element of {self._group_name()}") from None

    def character(self, label, op):
        """Exact character of irrep ``label`` at operation ``op``."""
        irr = self.irrep(label)
        return irr.characters[self._classes.index(self.class_of(op))]

    def _cyclo(self, label):
        """Private: the character row as Cyclotomic numbers (class order)."""
        if label in self._rows:
            return self._rows[label]
        irr = self._by_real[label]
        member = next(i for i in self._irreps if i.real_label == label and not i.is_real)
        a = self._rows[member.label]
        b = self._rows[member.conjugate]
        return tuple(x + y for x, y in zip(a, b))

    def matrices(self, label):
        """Exact irrep matrices, one per operation (aligned with ``group.operations``): a tuple of ImmutableMatrix.

        The matrices are unitary, real orthogonal for a real irrep (including
        the real form of a complex pair, which uses the real and imaginary parts
        of the pair's basis function), and their traces are the characters.
        Built on first use and cached.

        Raises
        ------
        UnknownIrrepError
            For an unknown label.

        Examples
        --------
        >>> from tensym.groups.finite import PointGroup
        >>> from tensym.groups.operations import Operation
        >>> g = PointGroup.from_generators([Operation.from_triplet("-y,x-y,z", basis="hexagonal"),
        ...                                 Operation.from_triplet("-x,y,z")])
        >>> m = finite_table(g).matrices("E")
        >>> all((d * d.T) == sp.eye(2) for d in m)
        True
        """
        irr = self.irrep(label)
        if irr.label not in self._matrices:
            std = self._standard_copy()
            if self._grey_of is not None:
                self._matrices[irr.label] = self._grey_matrices(irr)
            elif std is not None:
                self._matrices[irr.label] = std.matrices(irr.label)
            else:
                from tensym.reps.irreps import build_matrices

                self._matrices[irr.label] = build_matrices(self, irr)
            # cached and shared: hand out immutable matrices in a tuple
            self._matrices[irr.label] = tuple(sp.ImmutableMatrix(m) for m in self._matrices[irr.label])
        return self._matrices[irr.label]

    def _grey_matrices(self, irr):
        """Grey group: D(g 1') = +-D_H(g), the sign being the irrep's time parity."""
        base = self._grey_of
        h = base.group
        sign = -1 if irr.label.endswith("-") else 1
        mats = base.matrices(irr.label[:-1])
        out = []
        for op in self._group.operations:
            m = mats[h.index(Operation(op.matrix, False))]
            out.append(-m if (op.time_reversal and sign < 0) else m)
        return tuple(out)

    def _standard_copy(self):
        """For a re-oriented group: the table of the same elements turned back to the standard frame.

        Irrep matrices are taken from it (g -> D(Q^T g Q)), so that a re-oriented
        group has the same, readable, matrices as its standard setting.
        """
        names = getattr(self._group, "names", None)
        q = getattr(names, "rotation", None)
        if q is None or self._grey_of is not None:
            return None
        from dataclasses import replace

        from tensym.groups.finite import PointGroup

        qt = sp.Matrix(q).T
        ops = [op.conjugated(qt) for op in self._group.operations]
        gens = [op.conjugated(qt) for op in self._group.generators]
        std = PointGroup(ops, gens, replace(names, rotation=None))
        return finite_table(std)

    # --- display ---------------------------------------------------------
    def _cells(self, irreps):
        rows = []
        for i in irreps:
            rows.append([i.label] + [_fmt(v) for v in i.characters])
        return rows

    def text(self, *, real=False):
        """The table as text (one row per irrep; ``real=True`` combines complex pairs)."""
        irreps = self._real if real else self._irreps
        head = [self._group_name()] + [c.name for c in self._classes]
        rows = [head] + self._cells(irreps)
        widths = [max(len(r[j]) for r in rows) for j in range(len(head))]
        lines = []
        for n, r in enumerate(rows):
            lines.append("  ".join(cell.rjust(w) if j else cell.ljust(w) for j, (cell, w) in enumerate(zip(r, widths))))
            if n == 0:
                lines.append("-" * len(lines[0]))
        pairs = [i for i in self._real if i.label not in self._by_label]
        if pairs and not real:
            plus = " + " if self._grey_of is not None else "+"  # grey labels end in + or - themselves
            lines.append("real forms: " + ", ".join(
                f"{p.label} = {plus.join(m.label for m in self._irreps if m.real_label == p.label)}" for p in pairs))
        return "\n".join(lines)

    def __str__(self):
        return self.text()

    def latex(self, *, real=False):
        """The table as a LaTeX tabular (``real=True`` combines complex pairs)."""
        irreps = self._real if real else self._irreps
        n = len(self._classes)
        head = " & ".join(["$" + _latex_group(self) + "$"] + [f"${c.latex}$" for c in self._classes])
        lines = ["\\begin{tabular}{l" + "r" * n + "}", "\\hline", head + " \\\\", "\\hline"]
        for i in irreps:
            cells = [f"${i.latex}$"] + [f"${sp.latex(v)}$" for v in i.characters]
            lines.append(" & ".join(cells) + " \\\\")
        lines += ["\\hline", "\\end{tabular}"]
        return "\n".join(lines)

    def _repr_latex_(self):
        from tensym.display import show  # notebook display: the math-mode array that tensym.output installs

        return "$$" + show(self, "latex") + "$$"

    def __repr__(self):
        return (f"<CharacterTable {self._group_name()}: {len(self._classes)} classes, "
                f"irreps {' '.join(self.labels)}>")

    def __eq__(self, other):
        return isinstance(other, CharacterTable) and group_key(other._group) == group_key(self._group)

    def __hash__(self):
        return hash(group_key(self._group))


def _latex_group(table):
    n = getattr(table._group, "names", None)
    s = n.schoenflies if n is not None and n.schoenflies else ""
    return _schoenflies_latex(s) if s else "G"


def _schoenflies_latex(s):
    """'D4h' -> 'D_{4h}'; magnetic names: "D2h1'" -> "D_{2h}1'", 'D4h(C4h)' -> 'D_{4h}(C_{4h})'."""
    if "(" in s and s.endswith(")"):
        outer, inner = s[:-1].split("(", 1)
        return _schoenflies_latex(outer) + "(" + _schoenflies_latex(inner) + ")"
    if s.endswith("1'"):
        return _schoenflies_latex(s[:-2]) + "1'"
    if len(s) > 1:
        return s[0] + "_{" + s[1:] + "}"
    return s


def _fmt(v):
    s = sp.sstr(v)
    return s.replace("sqrt", "√").replace("*I", "i").replace("*", "")


def _normalise_label(label):
    s = label.strip().replace("_", "").replace(" ", "").replace("′′", "''").replace("″", "''").replace("′", "'")
    s = s.replace("primeprime", "''").replace("doubleprime", "''").replace("prime", "'").replace('"', "''")
    for a, b in (("¹", "1"), ("²", "2"), ("^", ""), ("{", ""), ("}", "")):
        s = s.replace(a, b)
    return s.lower()


_CACHE = {}


def finite_table(group):
    """The (cached) character table of a finite group; private, see tensym.character_table."""
    names = getattr(group, "names", None)
    # the names are part of the key: the same operations, unnamed, must not lend their name-less table
    key = group_key(group) + (getattr(names, "hm", ""), getattr(names, "setting_symbol", ""))
    hit = _CACHE.get(key)
    if hit is not None:
        return hit
    if _THETA in group:
        table = _grey_table(group)
        _CACHE[key] = table
        return table
    data = class_data(group)
    rows = exact_characters(data)
    names, info = name_classes(group, data)
    labels = label_irreps(group, data, rows, info)
    corder = sorted(range(len(names)), key=lambda c: names[c].key)
    iorder = sorted(range(len(rows)), key=lambda i: labels[i][2])
    ops = group.operations
    classes = []
    for c in corder:
        rep = ops[data.classes[c][0]]
        text, tex = (names[c].text, names[c].latex) if not rep.time_reversal else \
            time_reversed_class_name(names[c].text, names[c].latex)
        classes.append(ConjugacyClass(text, tex, data.sizes[c], rep, data.classes[c]))
    irreps = []
    cyc = {}
    for i in iorder:
        label, tex, _key, conj, real_label = labels[i]
        vals = tuple(rows[i][c].to_sympy() for c in corder)
        is_real = conj is None
        irreps.append(Irrep(label, tex, int(rows[i][0].rational_value()), vals, is_real,
                            labels[conj][0] if conj is not None else None, real_label))
        cyc[label] = tuple(rows[i][c] for c in corder)
    if len({i.label for i in irreps}) != len(irreps):
        raise ArithmeticError(f"duplicate irrep labels {[i.label for i in irreps]} (labelling failed)")
    table = CharacterTable(group, classes, irreps, cyc, data, info)
    _CACHE[key] = table
    return table


_THETA = Operation(sp.ImmutableMatrix(sp.eye(3)), True)  # time reversal 1'


def _grey_table(group):
    """The table of a grey group G1' = H x {1, 1'} from the table of its unitary subgroup H.

    Classes C and C 1' for each class C of H; irreps Gamma+ (chi(g 1') = chi(g))
    and Gamma- (chi(g 1') = -chi(g)) for each irrep Gamma of H (all exact).
    """
    from tensym.groups.magnetic import unitary_subgroup

    base = finite_table(unitary_subgroup(group))
    h_ops = base.group.operations
    classes = []
    for timed in (False, True):
        for c in base.classes:
            idx = tuple(sorted(group.index(Operation(h_ops[m].matrix, timed)) for m in c.indices))
            text, tex = (c.name, c.latex) if not timed else time_reversed_class_name(c.name, c.latex)
            classes.append(ConjugacyClass(text, tex, c.size, group.operations[idx[0]], idx))
    irreps, rows = [], {}
    for sign in ("+", "-"):
        s = 1 if sign == "+" else -1
        for irr in base.irreps:
            label, tex = time_parity_label(irr.label, irr.latex, sign)
            conj = None if irr.conjugate is None else irr.conjugate + sign
            chars = irr.characters + tuple(s * v for v in irr.characters)
            irreps.append(Irrep(label, tex, irr.dim, chars, irr.is_real, conj, irr.real_label + sign))
            row = base._rows[irr.label]
            rows[label] = tuple(row) + tuple(x if s == 1 else -x for x in row)
    return CharacterTable(group, classes, irreps, rows, None, None, grey_of=base)


def character_table(group, *, up_to=4):
    """The exact character table of a point group.

    Parameters
    ----------
    group : PointGroup, ContinuousGroup or str
        A group or its symbol (``'3m'``, ``'C3v'``, ``'Oh'``, ``'Ih'``, ``'O(3)'``, ``'Dinfh'``,
        magnetic ``"4'/m"``, ``"mmm1'"``).
    up_to : int, keyword-only
        For a continuous group only: the largest l (SO(3), O(3)) or |m| (axial
        groups) shown; its irreps are infinitely many.

    Returns
    -------
    CharacterTable or ContinuousTable
        Computed from the group (see Notes) and cached per group setting.

    Raises
    ------
    UnknownGroupError, InvalidGroupError
        For a bad group argument.
    InvalidOptionError
        If ``up_to`` is not a whole number from 0 to
        ``tensym.reps.continuous.MAX_UP_TO`` (1000).

    Notes
    -----
    Finite groups: Burnside's class-algebra method with exact pinning of every
    value (module :mod:`tensym.reps.characters`), class names and Mulliken
    labels as described in :mod:`tensym.reps.labels`.  The 32 crystallographic
    tables together take a few seconds the first time.

    Magnetic groups get the table of the group as an abstract group (linear
    representations; the characters of the real action on property tensors):
    a grey group G1' the product of G's table with that of {1, 1'} (irreps
    ``Gamma+`` even and ``Gamma-`` odd under 1', classes ``C`` and ``C·θ``), a
    black-and-white group the table of its parent, labelled through the
    spatial parts, with ``·θ`` on the classes of primed operations (see the
    module docstring).  For the antiunitary theory of quantum states use
    :func:`tensym.reps.magnetic.corepresentations`.

    Examples
    --------
    >>> t = character_table("3m")
    >>> print(t)
    3m  E  2C3  3σv
    ---------------
    A1  1    1    1
    A2  1    1   -1
    E   2   -1    0
    >>> character_table("Oh").irrep("T2g").characters[:5]
    (3, 0, -1, -1, 1)
    >>> print(character_table("21'"))
    21'  E  C2   θ  C2·θ
    --------------------
    A+   1   1   1     1
    B+   1  -1   1    -1
    A-   1   1  -1    -1
    B-   1  -1  -1     1
    >>> [c.name for c in character_table("4'").classes]
    ['E', 'C4·θ', 'C2', 'C4³·θ']
    """
    from tensym.reps.inputs import as_group_arg

    G = as_group_arg(group)
    if getattr(G, "is_continuous", False):
        from tensym.reps.continuous import continuous_table

        return continuous_table(G, up_to)  # validates up_to (0 .. MAX_UP_TO)
    return finite_table(G)
