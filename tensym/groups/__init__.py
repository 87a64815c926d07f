"""Symmetry operations and point groups.

* :class:`Operation`: an exact orthogonal 3x3 matrix and a time-reversal flag,
  built from a coordinate triplet or a matrix; ``g @ h`` means first h, then g.
* :func:`point_group`: every named group by symbol (32 crystallographic classes
  in their settings, the icosahedral groups, the continuous groups).
* :func:`group_from_generators`, :func:`recognise`, :func:`reorient`,
  :func:`rotation_from_axes`, :func:`rotation_about`: user groups, their names,
  re-oriented copies and exact rotations; float matrices (as structure files
  print them) are snapped to the exact group within ``tol``
  (:mod:`tensym.groups.snapping`).
* :func:`settings_table`, :func:`point_groups`: the catalog.
* :func:`space_group_point_group`, :func:`space_group_symbol`, :func:`space_group_symbols`:
  space-group symbols and numbers (``'P6_3mc'``, ``186``) read as their point groups
  (every function taking a group accepts them through :func:`as_group`).
* :func:`magnetic_point_groups`, :func:`magnetic_class`, :func:`unitary_subgroup`,
  :func:`parent_group`: the 122 magnetic point groups (primed symbols such as
  ``"m'm'm"`` also go through :func:`point_group`).

Examples
--------
>>> from tensym.groups import point_group
>>> g = point_group("6/mmm")
>>> g.order, g.crystal_system, g.laue_class
(24, 'hexagonal', '6/mmm')
"""

from tensym.groups.catalog import Setting, point_groups, settings_table
from tensym.groups.continuous import ContinuousGroup
from tensym.groups.finite import MAX_GROUP_ORDER, GroupNames, PointGroup
from tensym.groups.magnetic import (
    MAGNETIC_KINDS,
    MagneticPointGroup,
    magnetic_class,
    magnetic_point_group,
    magnetic_point_groups,
    parent_group,
    unitary_subgroup,
)
from tensym.groups.operations import HEXAGONAL_BASIS, Operation
from tensym.groups.recognition import (
    group_from_generators,
    recognise,
    reorient,
    rotation_about,
    rotation_from_axes,
)
from tensym.groups.spacegroups import space_group_point_group, space_group_symbol, space_group_symbols
from tensym.groups.symbols import as_group, point_group

__all__ = [
    "Operation",
    "HEXAGONAL_BASIS",
    "PointGroup",
    "ContinuousGroup",
    "GroupNames",
    "MAX_GROUP_ORDER",
    "Setting",
    "settings_table",
    "point_groups",
    "point_group",
    "as_group",
    "group_from_generators",
    "recognise",
    "reorient",
    "rotation_from_axes",
    "rotation_about",
    "MAGNETIC_KINDS",
    "MagneticPointGroup",
    "magnetic_class",
    "magnetic_point_group",
    "magnetic_point_groups",
    "parent_group",
    "unitary_subgroup",
    "space_group_point_group",
    "space_group_symbol",
    "space_group_symbols",
]
