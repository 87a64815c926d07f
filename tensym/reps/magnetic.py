"""Representations of magnetic point groups: corepresentation types and decompositions.

A magnetic group M = H + A (A = the primed operations, each a = g 1') acts on
a quantum state space by unitary H and antiunitary A.  Its irreducible
corepresentations come from the irreps Delta of the unitary subgroup H in one
of Wigner's three ways, told apart by the Dimmock test

    S(Delta) = sum over a in A of chi_Delta(a^2) = +|H|, -|H| or 0,

(J. O. Dimmock, R. G. Wheeler, J. Phys. Chem. Solids 23, 729 (1962); C. J.
Bradley, A. P. Cracknell, The Mathematical Theory of Symmetry in Solids,
1972, ch. 7; from memory):

* type a (S = +|H|): one corep of the same dimension as Delta;
* type b (S = -|H|): Delta is doubled, the corep has dimension 2 dim(Delta);
* type c (S = 0): Delta pairs with the inequivalent partner
  Delta'(h) = conj(Delta(a0^-1 h a0)) (a0 any element of A) into one corep of
  dimension 2 dim(Delta).

Here a^2 = (g 1')^2 = g^2 for single-valued representations (time reversal
squares to +1).  For a grey group, A = H 1' and the test reduces to the
Frobenius-Schur indicator: real irreps are of type a, complex-conjugate pairs
of type c.

Decomposing a space V over a magnetic group (:func:`magnetic_decompose`)
gives two readings:

* over the unitary subgroup H (the mapping part): the multiplicity of each H
  irrep, its Wigner type, and the number of coreps it makes in V (m for a
  and c, m/2 for b; the two members of a type-c pair name the same corep);
* ``linear``: the real action of M on a real space such as a property tensor
  (primed operations act with their time-reversal sign), over the irreps of M
  as an abstract group, i.e. over ``tensym.character_table(M)``.  A
  black-and-white M is isomorphic to its parent G through the spatial parts,
  so these are labelled by G's irreps; a grey M = G x {1, 1'} has irreps
  Gamma+ (1' acts as +1) and Gamma- (as -1), written with the suffix ``+`` or
  ``-`` (see :mod:`tensym.reps.table`).  The multiplicity of the trivial
  irrep here is the number of independent components of the tensor form.

Examples
--------
>>> from tensym.reps.magnetic import corepresentations, magnetic_decompose
>>> [(c.label, c.wigner_type) for c in corepresentations("4'")]
[('A', 'a'), ('B', 'b')]
>>> d = magnetic_decompose("magnetoelectric", "-3'm'")
>>> d.unitary, str(d), str(d.linear)
('32', '2A1 + A2 + 3E', '2A1g + A2g + 3Eg')
"""

from dataclasses import dataclass, field

import sympy as sp

from tensym.errors import InvalidArgumentError, RepresentationError
from tensym.groups.magnetic import unitary_subgroup
from tensym.reps.decompose import Decomposition, decomposition_from
from tensym.reps.inputs import as_group_arg, as_space_arg
from tensym.reps.reduction import multiplicities, space_characters, to_int

__all__ = ["Corepresentation", "MagneticDecomposition", "corepresentations", "magnetic_decompose"]

_TYPES = ("a", "b", "c")


@dataclass(frozen=True)
class Corepresentation:
    """How one irrep of the unitary subgroup H becomes a corepresentation of a magnetic group.

    Attributes
    ----------
    label : str
        Label of the irrep Delta of H (complex members as ``'1E'``, ``'2E'``).
    dim : int
        Dimension of Delta.
    wigner_type : str
        'a', 'b' or 'c' (see the module docstring).
    dimmock_sum : int
        S = sum over the primed operations a of chi_Delta(a^2): |H|, -|H| or 0.
    partner : str
        Label of Delta'(h) = conj(Delta(a0^-1 h a0)); equal to ``label`` for
        types a and b (equivalent), another irrep for type c.
    corep_dim : int
        Dimension of the corepresentation: dim for type a, 2 dim for b and c.
    """

    label: str
    dim: int
    wigner_type: str
    dimmock_sum: int
    partner: str
    corep_dim: int


@dataclass(frozen=True, eq=False)
class MagneticDecomposition(Decomposition):
    """A decomposition over a magnetic group (a :class:`Decomposition` over its unitary subgroup).

    The mapping part (``labels``, ``multiplicities``, ``dims``, ``d[label]``)
    is over the irreps of the unitary subgroup H; ``group`` is the magnetic
    group's symbol.

    Attributes
    ----------
    unitary : str
        Symbol of H.
    wigner_types : tuple of str
        Wigner type ('a', 'b', 'c') of each label, in ``labels`` order (the
        type of the members for a real form of a complex pair).
    corep_multiplicities : tuple of int
        Number of corepresentations each label makes in the space: m (a),
        m/2 (b), m (c; both members of a pair name that corep).
    linear : Decomposition
        The real linear action over the irreps of M as an abstract group
        (parent labels; grey groups with the suffix '+' or '-').

    Examples
    --------
    >>> d = magnetic_decompose("magnetization", "mmm1'")
    >>> str(d), d.wigner_types, str(d.linear)
    ('B1g + B2g + B3g', ('a', 'a', 'a'), 'B1g- + B2g- + B3g-')
    """

    unitary: str = ""
    wigner_types: tuple = ()
    corep_multiplicities: tuple = ()
    linear: object = field(default=None, repr=False)

    def __repr__(self):
        return f"MagneticDecomposition({str(self)!r}, group={self.group!r}, unitary={self.unitary!r})"

    def __eq__(self, other):
        return Decomposition.__eq__(self, other)

    def __hash__(self):
        return Decomposition.__hash__(self)


def _magnetic(group, name="group"):
    g = as_group_arg(group, name)
    if getattr(g, "is_continuous", False) or not g.is_magnetic:
        sym = getattr(g, "symbol", "") or repr(g)
        raise RepresentationError(
            f"{name}: {sym} has no primed (time-reversed) operation, so its irreps are its corepresentations; "
            "give a magnetic group such as \"4'/m\" or \"mmm1'\""
        )
    return g


def _as_int(v, what):
    return to_int(sp.nsimplify(sp.expand(v)), what)


def _types(g, h, table):
    """Corepresentation records of every complex irrep of H (exact Dimmock sums, class counts)."""
    ops = g.operations
    mt = g.multiplication_table
    index = {op.key: i for i, op in enumerate(ops)}
    class_at = {}
    for ci, c in enumerate(table.classes):
        for m in c.indices:
            class_at[h.operations[m].key] = ci
    primed = [i for i, op in enumerate(ops) if op.time_reversal]
    counts = [0] * len(table.classes)
    for i in primed:
        counts[class_at[ops[int(mt[i, i])].key]] += 1
    a0 = primed[0]
    a0_inv = index[ops[a0].inverse().key]
    perm = []  # class of a0^-1 h a0 for h in each class
    for c in table.classes:
        k = index[c.representative.key]
        perm.append(class_at[ops[int(mt[int(mt[a0_inv, k]), a0])].key])
    rows = {irr.label: table._cyclo(irr.label) for irr in table.irreps}
    out = []
    for irr in table.irreps:
        s = _as_int(sum((n * x for n, x in zip(counts, irr.characters) if n), sp.Integer(0)),
                    f"Dimmock sum of {irr.label}")
        if s == h.order:
            kind = "a"
        elif s == -h.order:
            kind = "b"
        elif s == 0:
            kind = "c"
        else:  # pragma: no cover - the sum is +-|H| or 0 for every irrep
            raise ArithmeticError(f"Dimmock sum {s} of {irr.label} is not +-{h.order} or 0")
        row = rows[irr.label]
        conj = tuple(row[perm[ci]].conjugate() for ci in range(len(table.classes)))
        partner = next(lab for lab, r in rows.items() if tuple(r) == conj)
        out.append(Corepresentation(irr.label, irr.dim, kind, s, partner, irr.dim * (1 if kind == "a" else 2)))
    return tuple(out)


_TYPES_CACHE = {}


def _types_cached(g, h, table):
    from tensym.reps.table import group_key

    key = (group_key(g), group_key(h))
    if key not in _TYPES_CACHE:
        _TYPES_CACHE[key] = _types(g, h, table)
    return _TYPES_CACHE[key]


def corepresentations(group):
    """Wigner types of the corepresentations of a magnetic group, one per irrep of its unitary subgroup.

    Parameters
    ----------
    group : PointGroup or str
        A grey or black-and-white group (``"4'"``, ``"mmm1'"``, ``'D4h(C4h)'``).

    Returns
    -------
    tuple of Corepresentation
        In the order of the complex irreps of H (``tensym.character_table(H).irreps``).

    Raises
    ------
    RepresentationError
        For a group without primed operations.
    UnknownGroupError, InvalidGroupError
        For a bad group argument.

    Examples
    --------
    >>> [(c.label, c.wigner_type, c.partner) for c in corepresentations("41'")]
    [('A', 'a', 'A'), ('B', 'a', 'B'), ('1E', 'c', '2E'), ('2E', 'c', '1E')]
    """
    from tensym.reps.table import finite_table

    g = _magnetic(group)
    h = unitary_subgroup(g)
    return _types_cached(g, h, finite_table(h))


def _linear(space, g, real):
    """The linear decomposition over M as an abstract group (its character table; grey: +/- suffix)."""
    from tensym.reps.table import finite_table

    table = finite_table(g)
    d = decomposition_from(table, multiplicities(table, space_characters(space, table), real=real), real)
    return Decomposition(g.symbol, d.labels, d.multiplicities, d.dims, d.latex_labels, real, d._valid)


def magnetic_decompose(space, group, *, real=True):
    """Split a representation space over a magnetic group: unitary-subgroup irreps and their Wigner types.

    ``tensym.decompose`` calls this for a magnetic group.

    Parameters
    ----------
    space : Space, TensorSpec, catalog property or its name
        The space; its ``character`` must include the time-reversal sign
        (tensor specs with ``time_odd=True`` do).
    group : PointGroup or str
        A grey or black-and-white group.
    real : bool, keyword-only
        Count complex-conjugate pairs of irreps as their real forms (default).

    Returns
    -------
    MagneticDecomposition

    Raises
    ------
    RepresentationError
        For a group without primed operations, or characters that are not
        those of a representation.
    InvalidArgumentError
        If ``space`` is not a representation space or ``real`` is not a bool.

    Examples
    --------
    >>> d = magnetic_decompose("magnetization", "4'")
    >>> str(d), d.wigner_types, d.corep_multiplicities
    ('A + 2B', ('a', 'b'), (1, 1))
    >>> str(d.linear)
    'B + E'
    """
    from tensym.reps.table import finite_table

    g = _magnetic(group)
    V = as_space_arg(space)
    if not isinstance(real, bool):
        raise InvalidArgumentError(f"real must be True or False, got {real!r}")
    h = unitary_subgroup(g)
    table = finite_table(h)
    mult = multiplicities(table, space_characters(V, table), real=real)
    base = decomposition_from(table, mult, real)
    types = {c.label: c for c in _types_cached(g, h, table)}
    wt, cm = [], []
    for lab, m in zip(base.labels, base.multiplicities):
        c = types.get(lab) or next(c for c in types.values()
                                   if table.irrep(c.label).real_label == lab)
        wt.append(c.wigner_type)
        if c.wigner_type == "b":
            if m % 2:
                raise RepresentationError(
                    f"{lab} (type b) occurs {m} times, an odd number, so the space carries no "
                    f"corepresentation of {g.symbol}"
                )
            cm.append(m // 2)
        else:
            cm.append(m)
    return MagneticDecomposition(
        g.symbol, base.labels, base.multiplicities, base.dims, base.latex_labels, real, base._valid,
        unitary=h.symbol, wigner_types=tuple(wt), corep_multiplicities=tuple(cm), linear=_linear(V, g, real),
    )
