"""Numeric isotypic projectors of a property's tensor space under a finite group.

For each irrep over the real numbers (complex-conjugate pairs combined, as
``CharacterTable.real_irreps`` gives them) the projector onto its isotypic
component is P = (d / |G|) * sum over g of chi(g) D(g), with chi the real
character, D(g) the (orthogonal) action on the orthonormal coordinates y of
:mod:`tensym.data.model` and d the dimension of one complex member (1 for a
pair ``E`` of ``1E`` + ``2E``).  The projectors are orthogonal, sum to the
identity, and the trivial one is the projector onto the invariant subspace
(tested).  The characters come from ``tensym.reps`` (exact tables).

An irrep is *rotation-like* when it occurs in the axial-vector representation
(character det(g) tr(g)): a small rotation of a symmetric tensor moves it only
within those isotypic components.

Examples
--------
>>> from tensym.groups import as_group
>>> from tensym.data.irreps import isotypic_projectors
>>> parts = isotypic_projectors("elastic_stiffness", as_group("6/mmm"))
>>> [(p.label, p.multiplicity, p.rotation_like) for p in parts]  # 5 + 1 + 1 + 3*2 + 4*2 = 21
[('A1g', 5, False), ('B1g', 1, False), ('B2g', 1, False), ('E1g', 3, True), ('E2g', 4, False)]
"""

from dataclasses import dataclass
from functools import lru_cache

import numpy as np

from tensym.data.model import _Ref, group_key_of, layout, rotation_action
from tensym.tensors.form import as_property

__all__ = ["IsotypicProjector", "isotypic_projectors", "action_matrices"]


@dataclass(frozen=True)
class IsotypicProjector:
    """One isotypic component of the tensor space (private kernel result).

    Attributes
    ----------
    label : str
        Mulliken label of the real irrep ('A1g', 'E', "E'", ...).
    dim : int
        Dimension of the real irrep.
    multiplicity : int
        How often it occurs in the tensor space.
    rotation_like : bool
        Occurs in the axial-vector representation.
    matrix : numpy.ndarray
        float64 (n, n) orthogonal projector in y coordinates (read-only).
    basis : numpy.ndarray
        float64 (n, r): orthonormal basis of its range (matrix = basis @ basis.T), read-only.
    """

    label: str
    dim: int
    multiplicity: int
    rotation_like: bool
    matrix: np.ndarray
    basis: np.ndarray


def _table(group):
    try:
        from tensym.reps import character_table
    except ImportError:
        from tensym.reps.table import finite_table as character_table
    return character_table(group)


def action_matrices(what, group):
    """float64 (|G|, n, n): each operation on the orthonormal coordinates y (parities included)."""
    return _actions(as_property(what), group_key_of(group), _Ref((group,))).copy()


@lru_cache(maxsize=128)
def _actions(prop, gkey, gref):
    lay = layout(prop)
    mats = []
    for op in gref[0].operations:
        d = rotation_action(lay, op.numeric) * prop.spec.parity(op)
        mats.append((lay.scale[:, None] * d) / lay.scale[None, :])
    out = np.array(mats)
    out.setflags(write=False)
    return out


@lru_cache(maxsize=128)
def _projectors(prop, gkey, gref):
    group = gref[0]
    table = _table(group)
    ops = group.operations
    d_y = _actions(prop, gkey, gref)
    order = len(ops)
    cls_of = np.zeros(order, dtype=np.int64)
    for ci, c in enumerate(table.classes):
        cls_of[list(c.indices)] = ci
    dets = np.array([np.linalg.det(op.numeric) for op in ops])
    traces = np.array([np.trace(op.numeric) for op in ops])
    chi_rot = dets * traces
    member_dim = {}
    for irr in table.irreps:
        if not irr.is_real:
            member_dim[irr.real_label] = irr.dim
    out = []
    for irr in table.real_irreps:
        chars = np.array([complex(v).real for v in irr.characters])[cls_of]
        dc = member_dim.get(irr.label, irr.dim)
        p = (dc / order) * np.einsum("g,gij->ij", chars, d_y)
        mult = int(round(np.trace(p) / irr.dim))
        if mult == 0:
            continue
        rot = float(np.dot(chi_rot, chars)) / order > 0.5
        p = 0.5 * (p + p.T)
        w, v = np.linalg.eigh(p)
        u = v[:, w > 0.5]
        p.setflags(write=False)
        u.setflags(write=False)
        out.append(IsotypicProjector(irr.label, int(irr.dim), mult, bool(rot), p, u))
    return tuple(out)


def isotypic_projectors(what, group):
    """The isotypic projectors (tuple of :class:`IsotypicProjector`, table order; absent irreps skipped).

    Raises
    ------
    TypeError
        For a continuous group (no finite character table).
    """
    if getattr(group, "is_continuous", False):
        raise TypeError(f"{group.symbol} is a continuous group: no finite character table")
    return _projectors(as_property(what), group_key_of(group), _Ref((group,)))
