"""Finite point groups: closure of generators, Cayley table and conjugacy classes.

A :class:`PointGroup` is immutable.  Its operations are found by closing the
generators under composition (``g @ h``: first h, then g); elements are
identified by their float images (rounded at 1e-8, absolute) and their exact
matrices are built along the closure tree, one exact product per element
(with the multi-quadratic kernel of :mod:`tensym.groups.quadratic` when the
entries are sums of rational multiples of square roots, else with sympy).
Catalog groups close lazily: the generators are enough for invariant-tensor
solvers, and the operation list is made on first use.

Cost: the closure is O(|G| * n_generators) float products plus |G| exact ones;
the 47 catalog settings close in about 0.1 s together on the reference
2-core machine (see benchmarks/groups.py).

Examples
--------
>>> from tensym.groups.finite import PointGroup
>>> from tensym.groups.operations import Operation
>>> g = PointGroup.from_generators([Operation.from_triplet("-y,x,z"), Operation.from_triplet("x,-y,z")])
>>> g.order, len(g.classes)
(8, 5)
"""

from dataclasses import dataclass
import math

import numpy as np
import sympy as sp

from tensym.errors import GroupClosureError, InvalidOperationError
from tensym.groups.messages import echo
from tensym.groups.operations import ORDER_SEARCH_LIMIT, Operation
from tensym.groups.quadratic import mq_matmul as _mq_matmul, mq_matrix as _mq_matrix, mq_sympy as _mq_sympy

__all__ = ["PointGroup", "MAX_GROUP_ORDER", "GroupNames"]

#: Largest group order accepted from user generators (Ih has 120; cyclic groups
#: C_n up to n = 240 fit).
MAX_GROUP_ORDER = 240


@dataclass(frozen=True)
class GroupNames:
    """Names and classification of a group, as the catalog or recognition sets them.

    Attributes
    ----------
    hm : str
        Short Hermann-Mauguin symbol of the standard group, e.g. ``'4/mmm'`` (ASCII, overbar as '-').
    full_hm : str
        Full Hermann-Mauguin symbol, e.g. ``'4/m 2/m 2/m'``.
    schoenflies : str
        Schoenflies symbol, e.g. ``'D4h'``.
    setting : str
        Words describing the orientation, e.g. ``'4-fold along z, 2-folds along x and [110]'``.
    crystal_system : str
        'triclinic', 'monoclinic', 'orthorhombic', 'tetragonal', 'trigonal', 'hexagonal',
        'cubic', 'icosahedral' or 'continuous'.
    laue_class : str
        Short symbol of the Laue class (the group with inversion added), e.g. ``'4/mmm'``.
    rotation : sympy.ImmutableMatrix or None
        Q (exact, proper orthogonal) with ``{g_this} = {Q g_std Q^T}``, where g_std runs
        over the operations of the catalog setting ``setting_symbol``; None when the
        group is that catalog setting itself (identical operations).
    setting_symbol : str
        Symbol of the catalog setting the names refer to, e.g. ``'-4m2'``, ``'312'``,
        ``'112'`` (for the default setting of a class it is the class's own row,
        e.g. ``'321'`` for 32); empty when the group is not in the catalog.
    space_group : str
        The space group the group was named by, e.g. ``'P6_3mc (no. 186)'`` or
        ``'Pbnm (no. 62, setting cab)'`` (see :mod:`tensym.groups.spacegroups`);
        empty otherwise.
    """

    hm: str = ""
    full_hm: str = ""
    schoenflies: str = ""
    setting: str = ""
    crystal_system: str = ""
    laue_class: str = ""
    rotation: object = None
    setting_symbol: str = ""
    space_group: str = ""


def _trusted(matrix, flag, num):
    """An Operation from an exact matrix and its known float image (no checks)."""
    op = object.__new__(Operation)
    object.__setattr__(op, "matrix", matrix)
    object.__setattr__(op, "time_reversal", bool(flag))
    object.__setattr__(op, "_num", np.array(num, dtype=np.float64))
    return op


def _conjugate_all(ops, rotation):
    """``[Q g Q^T for g in ops]`` with the multi-quadratic kernel where the entries allow."""
    q = sp.ImmutableMatrix(rotation)
    qm = _mq_matrix(q)
    qt = _mq_matrix(q.T) if qm is not None else None
    qn = np.array([[float(x) for x in row] for row in q.tolist()], dtype=np.float64)
    out = []
    for op in ops:
        m = _mq_matrix(op.matrix) if qm is not None else None
        if m is None:
            out.append(op.conjugated(q))
            continue
        num = qn @ op._num @ qn.T
        out.append(_trusted(_mq_sympy(_mq_matmul(_mq_matmul(qm, m), qt)), op.time_reversal, num))
    return out


def _close(generators, limit):
    ident = Operation.identity()
    ops = [ident]
    index = {ident.key: 0}
    frontier = [0]
    nums = [ident._num]
    flags = [False]
    gen_num = [(g._num, g.time_reversal) for g in generators]
    gen_mq = [_mq_matrix(g.matrix) for g in generators]
    fast = all(m is not None for m in gen_mq)
    mqs = [_mq_matrix(ident.matrix)] if fast else None
    while frontier:
        new_frontier = []
        for i in frontier:
            for gi, (gn, gt) in enumerate(gen_num):
                prod = gn @ nums[i]
                flag = gt != flags[i]
                key = tuple(int(v) for v in np.rint(prod.ravel() * 1e8)) + (int(flag),)
                if key in index:
                    continue
                if len(ops) >= limit:
                    raise GroupClosureError(
                        f"the generators do not close to a finite group of order <= {limit}; "
                        "check that every rotation angle is 360/n degrees and the axes are compatible"
                    )
                if fast:
                    rows = _mq_matmul(gen_mq[gi], mqs[i])
                    mqs.append(rows)
                    op = _trusted(_mq_sympy(rows), flag, prod)
                else:
                    op = generators[gi] @ ops[i]
                index[key] = len(ops)
                ops.append(op)
                nums.append(prod)
                flags.append(flag)
                new_frontier.append(len(ops) - 1)
        frontier = new_frontier
    return ops, index


class PointGroup:
    """A finite point group (possibly magnetic) in a definite Cartesian setting.

    Build one with :meth:`from_generators`, ``tensym.group_from_generators`` or
    take a named one from ``tensym.point_group``.  All attributes are read-only.
    The full list of operations is made on first use (closure of the generators);
    the generators alone are enough for invariant-tensor solvers.

    Attributes
    ----------
    operations : tuple of Operation
        Every element, identity first.
    generators : tuple of Operation
        The generators the group was built from.
    lie_generators : tuple
        Always empty (finite group); present so that solvers treat finite and
        continuous groups alike.
    names : GroupNames
        Symbols and classification (empty strings for an unrecognised group).

    Examples
    --------
    >>> from tensym.groups.operations import Operation
    >>> g = PointGroup.from_generators([Operation.from_triplet("-x,-y,-z")])
    >>> g.order, g.is_centrosymmetric
    (2, True)
    """

    is_continuous = False
    lie_generators = ()

    def __init__(self, operations, generators, names=None, *, limit=MAX_GROUP_ORDER):
        # operations=None: closed lazily from the generators on first use
        # (then limited to ``limit`` elements); otherwise trusted to be the whole group.
        self._gens = tuple(generators)
        self._names = names if names is not None else GroupNames()
        self._limit = limit
        self._ops = None
        self._index = None
        if operations is not None:
            self._set_operations(tuple(operations))
        self._table = None
        self._classes = None

    def _set_operations(self, ops):
        self._ops = ops
        self._index = {op.key: i for i, op in enumerate(ops)}

    def _closed(self):
        if self._ops is None:
            ops, _ = _close(list(self._gens), self._limit)
            self._set_operations(tuple(ops))
        return self._ops

    @classmethod
    def from_generators(cls, generators, *, names=None, limit=MAX_GROUP_ORDER):
        """Close ``generators`` (Operations) to a finite group.

        The closure is done at once, so that an infinite group is reported here.

        Raises
        ------
        InvalidOperationError
            If a generator is not an :class:`Operation`.
        GroupClosureError
            If the closure exceeds ``limit`` elements or a generator has infinite order.

        Examples
        --------
        >>> from tensym.groups.operations import Operation
        >>> PointGroup.from_generators([Operation.from_triplet("-y,x-y,z", basis="hexagonal")]).order
        3
        """
        gens = []
        for g in generators:
            if not isinstance(g, Operation):
                raise InvalidOperationError(f"generator {echo(g)} is not an Operation")
            if g.order == 0:
                raise GroupClosureError(
                    f"generator {g.triplet()} has infinite order: its rotation angle is not 360/n degrees "
                    f"for an integer n <= {ORDER_SEARCH_LIMIT}"
                )
            gens.append(g)
        ops, _ = _close(gens, limit)
        return cls(ops, gens, names, limit=limit)

    # --- basic facts ---------------------------------------------------------
    @property
    def operations(self):
        """All operations, identity first (a tuple)."""
        return self._closed()

    @property
    def generators(self):
        """The generators (a tuple of Operation)."""
        return self._gens

    @property
    def order(self):
        """Number of elements."""
        return len(self._closed())

    @property
    def names(self):
        """The :class:`GroupNames` record."""
        return self._names

    @property
    def symbol(self):
        """Short Hermann-Mauguin symbol of the geometric class (empty when unrecognised)."""
        return self._names.hm

    @property
    def setting_symbol(self):
        """Symbol of the catalog setting the names refer to, e.g. '-4m2' or '112'."""
        return self._names.setting_symbol

    @property
    def schoenflies(self):
        """Schoenflies symbol (empty when unrecognised)."""
        return self._names.schoenflies

    @property
    def full_symbol(self):
        """Full Hermann-Mauguin symbol."""
        return self._names.full_hm

    @property
    def crystal_system(self):
        """Crystal system name."""
        return self._names.crystal_system

    @property
    def laue_class(self):
        """Short symbol of the Laue class."""
        return self._names.laue_class

    @property
    def setting(self):
        """Words describing the orientation of the symmetry elements."""
        return self._names.setting

    @property
    def rotation(self):
        """Q with {g} = {Q g_std Q^T} relative to the catalog setting, or None (see GroupNames)."""
        return self._names.rotation

    def index(self, op):
        """Position of ``op`` in :attr:`operations` (KeyError if absent)."""
        self._closed()
        return self._index[op.key]

    def __contains__(self, op):
        self._closed()
        return isinstance(op, Operation) and op.key in self._index

    def operation_keys(self):
        """frozenset of the identity keys of all operations (for set comparisons)."""
        self._closed()
        return frozenset(self._index)

    # --- structure -------------------------------------------------------------
    @property
    def multiplication_table(self):
        """Cayley table as an int numpy array: ``table[i, j]`` is the index of ops[i] @ ops[j]."""
        if self._table is None:
            ops = self._closed()
            n = len(ops)
            mats = np.array([op._num for op in ops])
            flags = np.array([op.time_reversal for op in ops])
            prods = np.einsum("aij,bjk->abik", mats, mats)
            keys = np.rint(prods.reshape(n, n, 9) * 1e8).astype(np.int64)
            table = np.empty((n, n), dtype=np.int64)
            index = self._index
            for a in range(n):
                for b in range(n):
                    key = tuple(int(v) for v in keys[a, b]) + (int(flags[a] != flags[b]),)
                    table[a, b] = index[key]
            self._table = table
        return self._table.copy()

    @property
    def classes(self):
        """Conjugacy classes as a tuple of tuples of operation indices (sorted, identity class first)."""
        if self._classes is None:
            t = self.multiplication_table
            n = len(self._ops)
            inv = [int(np.nonzero(t[i] == 0)[0][0]) for i in range(n)]
            seen = set()
            classes = []
            for a in range(n):
                if a in seen:
                    continue
                cls_ = sorted({int(t[t[g, a], inv[g]]) for g in range(n)})
                seen.update(cls_)
                classes.append(tuple(cls_))
            self._classes = tuple(classes)
        return self._classes

    @property
    def is_centrosymmetric(self):
        """True when the inversion -1 (unprimed) is an element."""
        return Operation(sp.ImmutableMatrix(-sp.eye(3))) in self

    @property
    def is_polar(self):
        """True when some direction is left fixed by every operation (a pyroelectric class).

        Time reversal does not act on a polar vector, so primed operations count by
        their spatial part: -1' is not polar, m' is.
        """
        ops = self._closed()
        m = sum(op._num for op in ops) / len(ops)
        return bool(np.linalg.matrix_rank(m, tol=1e-9) > 0)

    @property
    def is_enantiomorphic(self):
        """True when every operation is proper (no inversion, mirror or rotoinversion).

        These are the 11 chiral classes 1, 2, 222, 4, 422, 3, 32, 6, 622, 23, 432
        (and I among the icosahedral groups).
        """
        return all(op.det == 1 for op in self._closed())

    @property
    def is_magnetic(self):
        """True when some operation carries time reversal."""
        return any(op.time_reversal for op in self._closed())

    @property
    def is_crystallographic(self):
        """True when every rotation order is 1, 2, 3, 4 or 6."""
        return all(op.order in (1, 2, 3, 4, 6) for op in self._closed())

    def conjugated(self, rotation, names=None):
        """The group ``Q G Q^T`` for an exact rotation Q (operations re-oriented).

        Q is trusted to be exact and orthogonal (``tensym.reorient`` checks it).
        """
        gens = _conjugate_all(self._gens, rotation)
        ops = None if self._ops is None else _conjugate_all(self._ops, rotation)
        return PointGroup(ops, gens, names, limit=self._limit)

    def __repr__(self):
        label = self._names.setting_symbol or self._names.hm or "unnamed"
        return f"<PointGroup {label} order {self.order}>"
