"""Decomposition of a representation into irreps, and products of irreps.

``decompose(space, group)`` applies the reduction formula to the space's exact
characters (finite groups) or counts the weights of the infinitesimal rotation
about the axis (continuous groups, see :mod:`tensym.reps.continuous`).

Examples
--------
>>> from tensym.reps.spaces import harmonics
>>> print(decompose(harmonics(2), "m-3m"))
Eg + T2g
>>> print(decompose(symmetric_square("3m", "E"), "3m"))
A1 + E
"""

from collections.abc import Mapping
from dataclasses import dataclass

import sympy as sp

from tensym.errors import InvalidArgumentError, RepresentationError, UnknownIrrepError
from tensym.reps.inputs import as_group_arg, as_space_arg
from tensym.reps.reduction import multiplicities, space_characters
from tensym.reps.space import Space

__all__ = ["Decomposition", "decompose", "IrrepSpace", "irrep_space", "irrep_product", "symmetric_square",
           "antisymmetric_square"]


def _group_label(group):
    n = getattr(group, "names", None)
    if n is None:
        return repr(group)
    return n.hm or n.schoenflies or repr(group)


@dataclass(frozen=True)
class Decomposition(Mapping):
    """How a representation splits into irreps: a read-only mapping label -> multiplicity.

    Attributes
    ----------
    group : str
        Symbol of the group.
    labels : tuple of str
        Labels of the irreps that occur, in the group's table order.
    multiplicities : tuple of int
        Their multiplicities (positive).
    dims : tuple of int
        Their dimensions.
    latex_labels : tuple of str
        The labels in LaTeX.
    real : bool
        True when complex-conjugate pairs are counted as their real forms.

    Notes
    -----
    Like :class:`collections.Counter`, ``d[label]`` is 0 for an irrep of the
    group that does not occur, while iteration, ``len`` and ``in`` run over the
    irreps that do.  A label the group does not have raises UnknownIrrepError.

    Examples
    --------
    >>> from tensym.reps.spaces import harmonics
    >>> d = decompose(harmonics(2), "4/mmm")
    >>> str(d), d["Eg"], d["A2g"], d.dim
    ('A1g + B1g + B2g + Eg', 1, 0, 5)
    >>> d.latex()
    'A_{1g} \\\\oplus B_{1g} \\\\oplus B_{2g} \\\\oplus E_{g}'
    """

    group: str
    labels: tuple
    multiplicities: tuple
    dims: tuple
    latex_labels: tuple
    real: bool = True
    _valid: tuple = ()

    def __getitem__(self, label):
        if label in self.labels:
            return self.multiplicities[self.labels.index(label)]
        key = _norm(label)
        for lab, m in zip(self.labels, self.multiplicities):
            if _norm(lab) == key:
                return m
        if any(_norm(v) == key for v in self._valid) or _continuous_label_ok(self._valid, key):
            return 0
        import difflib

        near = difflib.get_close_matches(str(label), list(self._valid), n=3, cutoff=0.3)
        raise UnknownIrrepError(
            f"group {self.group} has no irrep {label!r}" + (f"; nearest: {', '.join(near)}" if near else "")
        )

    def __iter__(self):
        return iter(self.labels)

    def __len__(self):
        return len(self.labels)

    def __contains__(self, label):
        return label in self.labels

    @property
    def dim(self):
        """Total dimension sum(multiplicity * dim)."""
        return sum(m * d for m, d in zip(self.multiplicities, self.dims))

    def __str__(self):
        if not self.labels:
            return "0"
        parts = []
        for lab, m in zip(self.labels, self.multiplicities):
            if m == 1:
                parts.append(lab)
            else:
                sep = " " if (lab[0].isdigit() or lab.startswith("D")) else ""
                parts.append(f"{m}{sep}{lab}")
        return " + ".join(parts)

    def latex(self):
        """The decomposition in LaTeX, e.g. ``2A_{1g} \\oplus E_{g}``."""
        if not self.labels:
            return "0"
        return " \\oplus ".join((f"{m}" if m != 1 else "") + t for t, m in zip(self.latex_labels, self.multiplicities))

    def _repr_latex_(self):
        return "$" + self.latex() + "$"

    def __repr__(self):
        return f"Decomposition({str(self)!r}, group={self.group!r})"

    def __eq__(self, other):
        if isinstance(other, Decomposition):
            return (self.group, self.labels, self.multiplicities) == (other.group, other.labels, other.multiplicities)
        if isinstance(other, Mapping):
            return dict(self) == dict(other)
        return NotImplemented

    def __hash__(self):
        return hash((self.group, self.labels, self.multiplicities))


def _norm(label):
    from tensym.reps.table import _normalise_label

    return _normalise_label(str(label))


def _continuous_label_ok(valid, key):
    return bool(valid) and valid[0] == "*continuous*"


def decompose(space, group, *, real=True):
    """Split a representation space into irreps of a point group.

    Parameters
    ----------
    space : Space or object with ``as_space()``
        e.g. :func:`tensym.harmonics`, :func:`tensym.polynomials`, a product of
        irreps, a TensorSpec or a catalog property.
    group : PointGroup, ContinuousGroup or str
        The group or its symbol (``'m-3m'``, ``'Oh'``, ``'O(3)'``, ``'Dinfh'``).
        A magnetic group (``"-3'm'"``) gives a
        :class:`~tensym.reps.magnetic.MagneticDecomposition`: over the irreps of
        its unitary subgroup, with their Wigner types.
    real : bool, keyword-only
        Count complex-conjugate pairs of irreps as their real two-dimensional
        form (default, right for real spaces such as tensors and real
        polynomials); ``False`` lists the complex members separately.

    Returns
    -------
    Decomposition

    Raises
    ------
    InvalidArgumentError
        If ``space`` is not a representation space.
    UnknownGroupError, InvalidGroupError
        For a bad group argument.
    RepresentationError
        If the characters are not those of a representation of the group
        (e.g. a product space of another group).

    Examples
    --------
    >>> from tensym.reps.spaces import harmonics, polynomials
    >>> print(decompose(harmonics(1), "3m"))
    A1 + E
    >>> print(decompose(polynomials(1), "4", real=False))
    A + 1E + 2E
    >>> print(decompose(harmonics(4), "O(3)"))
    D4g
    """
    G = as_group_arg(group)
    V = as_space_arg(space)
    if not isinstance(real, bool):
        raise InvalidArgumentError(f"real must be True or False, got {real!r}")
    if getattr(G, "is_magnetic", False):  # over the unitary subgroup, with Wigner types
        from tensym.reps.magnetic import magnetic_decompose

        return magnetic_decompose(V, G, real=real)
    if getattr(G, "is_continuous", False):
        from tensym.reps.continuous import continuous_decompose

        return continuous_decompose(V, G, real=real)
    from tensym.reps.table import finite_table

    if isinstance(V, IrrepSpace) and V.table.group is not G:
        from tensym.reps.table import group_key

        if group_key(V.table.group) != group_key(G):
            raise RepresentationError(
                f"{V!r} is a space of group {_group_label(V.table.group)}, not of {_group_label(G)}")
    t = finite_table(G)
    mult = multiplicities(t, space_characters(V, t), real=real)
    return decomposition_from(t, mult, real)


def decomposition_from(table, mult, real):
    """Private: a Decomposition from a table and a label -> multiplicity dict."""
    pool = table.real_irreps if real else table.irreps
    labels, ms, dims, tex = [], [], [], []
    for irr in pool:
        m = mult.get(irr.label, 0)
        if m:
            labels.append(irr.label)
            ms.append(m)
            dims.append(irr.dim)
            tex.append(irr.latex)
    return Decomposition(_group_label(table.group), tuple(labels), tuple(ms), tuple(dims), tuple(tex), real,
                         table.all_labels())


# ---------------------------------------------------------------------------
# irreps as spaces, and their products
# ---------------------------------------------------------------------------
class IrrepSpace(Space):
    """A representation space built from irreps of one finite group.

    ``kind`` is 'irrep' (one irrep), 'product' (a x b), 'symmetric' or
    'antisymmetric' (the symmetric / antisymmetric square of a).  Coordinates
    are those of the irreps' orthonormal bases (products: e_i x e_j in
    row-major order; squares: (e_i e_j + e_j e_i)/sqrt 2 for i < j with e_i e_i,
    resp. (e_i e_j - e_j e_i)/sqrt 2 for i < j), so the Gram matrix is the identity.
    The action is defined for the group's operations only.

    Examples
    --------
    >>> s = antisymmetric_square("m-3m", "T1u")
    >>> s.dim, str(decompose(s, "m-3m"))
    (3, 'T1g')
    """

    def __init__(self, table, kind, a, b=None):
        self.table = table
        self.kind = kind
        self.a = table.irrep(a)
        self.b = table.irrep(b) if b is not None else None
        da = self.a.dim
        if kind == "irrep":
            self._dim = da
        elif kind == "product":
            self._dim = da * self.b.dim
        elif kind == "symmetric":
            self._dim = da * (da + 1) // 2
        else:
            self._dim = da * (da - 1) // 2

    @property
    def dim(self):
        return self._dim

    def _index(self, op):
        try:
            return self.table.group.index(op)
        except KeyError:
            raise RepresentationError(
                f"{op!r} is not an operation of {_group_label(self.table.group)}, the group of {self!r}") from None

    def character(self, op):
        i = self._index(op)
        ca = self.table.character(self.a.label, op)
        if self.kind == "irrep":
            return ca
        if self.kind == "product":
            return sp.expand(ca * self.table.character(self.b.label, op))
        op2 = self.table.group.operations[int(self.table.group.multiplication_table[i, i])]
        c2 = self.table.character(self.a.label, op2)
        sign = 1 if self.kind == "symmetric" else -1
        return sp.expand((ca**2 + sign * c2) / 2)

    def action(self, op):
        i = self._index(op)
        A = sp.Matrix(self.table.matrices(self.a.label)[i])
        if self.kind == "irrep":
            return sp.ImmutableMatrix(A)
        if self.kind == "product":
            B = sp.Matrix(self.table.matrices(self.b.label)[i])
            return sp.ImmutableMatrix(sp.kronecker_product(A, B).applyfunc(sp.expand))
        K = sp.kronecker_product(A, A)
        S = self._square_basis()
        return sp.ImmutableMatrix((S.T * K * S).applyfunc(lambda v: sp.expand(sp.radsimp(v))))

    def _square_basis(self):
        d = self.a.dim
        cols = []
        r = 1 / sp.sqrt(2)
        for i in range(d):
            for j in range(i, d):
                v = sp.zeros(d * d, 1)
                if i == j:
                    if self.kind != "symmetric":
                        continue
                    v[i * d + i] = 1
                else:
                    v[i * d + j] = r
                    v[j * d + i] = r if self.kind == "symmetric" else -r
                cols.append(v)
        return sp.Matrix.hstack(*cols)

    def __repr__(self):
        g = _group_label(self.table.group)
        if self.kind == "irrep":
            return f"irrep_space({g!r}, {self.a.label!r})"
        if self.kind == "product":
            return f"irrep_product({g!r}, {self.a.label!r}, {self.b.label!r})"
        return f"{self.kind}_square({g!r}, {self.a.label!r})"


def _finite_table_arg(group):
    G = as_group_arg(group)
    if getattr(G, "is_continuous", False):
        raise InvalidArgumentError(
            f"products of irreps are built for finite groups; {_group_label(G)} is continuous "
            "(use harmonics(l) spaces and decompose their characters instead)"
        )
    from tensym.reps.table import finite_table

    return finite_table(G)


def irrep_space(group, label):
    """One irrep of a finite group as a representation space.

    Examples
    --------
    >>> irrep_space("m-3m", "T2g").dim
    3
    """
    return IrrepSpace(_finite_table_arg(group), "irrep", label)


def irrep_product(group, a, b):
    """The direct product a x b of two irreps of a finite group (selection rules).

    Raises
    ------
    UnknownIrrepError
        If a label is not an irrep of the group.

    Examples
    --------
    >>> print(decompose(irrep_product("m-3m", "T1u", "T1u"), "m-3m"))
    A1g + Eg + T1g + T2g
    """
    return IrrepSpace(_finite_table_arg(group), "product", a, b)


def symmetric_square(group, a):
    """The symmetric square [a x a] of an irrep of a finite group.

    Examples
    --------
    >>> print(decompose(symmetric_square("m-3m", "T1u"), "m-3m"))
    A1g + Eg + T2g
    """
    return IrrepSpace(_finite_table_arg(group), "symmetric", a)


def antisymmetric_square(group, a):
    """The antisymmetric square {a x a} of an irrep of a finite group.

    Examples
    --------
    >>> print(decompose(antisymmetric_square("4mm", "E"), "4mm"))
    A2
    """
    return IrrepSpace(_finite_table_arg(group), "antisymmetric", a)
