"""Numeric work on measured and computed tensors (numpy): check, fit, orient, find symmetry, batch.

* :func:`tensor_data`, :func:`read_tensor`, :func:`write_tensor`: validated
  data (Voigt or full arrays, uncertainties or a covariance, a unit label) and
  the CSV / JSON file formats of :mod:`tensym.data.io`.
* :func:`check_tensor`, :func:`check_tensors`: forbidden components, broken
  relations, fitted constants with propagated uncertainties, chi-square,
  verdict, residual by irrep; one tensor or a vectorised stack.
* :func:`orient`, :func:`find_symmetry`, :func:`symmetry_classes`: the frame of
  the crystal (a global search over SO(3)) and the highest symmetry the numbers show.
* :func:`rotate_values`, :func:`invert_elastic`, :func:`invert_data` and the
  rotation helpers (axis-angle, z-y-z Euler angles, misorientation, grids).

Examples
--------
>>> import numpy as np
>>> from tensym.data import check_tensor
>>> check_tensor(np.eye(3), "thermal_expansion", "m-3m").passes
True
"""

from tensym.data.check import (
    BatchCheck,
    CheckReport,
    FittedConstant,
    ForbiddenComponent,
    IrrepResidual,
    RelationCheck,
    check_tensor,
    check_tensors,
)
from tensym.data.dataset import TensorData, component_labels, tensor_data
from tensym.data.elastic import invert_data, invert_elastic
from tensym.data.find import SymmetryCandidate, SymmetryClass, SymmetryFinding, find_symmetry, symmetry_classes
from tensym.data.io import read_tensor, write_tensor
from tensym.data.orient import Orientation, SolutionFamily, orient
from tensym.data.rotation import (
    axis_angle,
    euler_angles,
    misorientation,
    random_rotations,
    rotate_values,
    rotation_from_axis_angle,
    rotation_from_euler,
    rotation_grid,
)
from tensym.data.stats import chi2_sf
from tensym.data.units import accepted_units

__all__ = [
    "TensorData",
    "tensor_data",
    "component_labels",
    "accepted_units",
    "read_tensor",
    "write_tensor",
    "check_tensor",
    "check_tensors",
    "CheckReport",
    "BatchCheck",
    "FittedConstant",
    "ForbiddenComponent",
    "RelationCheck",
    "IrrepResidual",
    "orient",
    "Orientation",
    "SolutionFamily",
    "find_symmetry",
    "symmetry_classes",
    "SymmetryFinding",
    "SymmetryCandidate",
    "SymmetryClass",
    "rotate_values",
    "invert_elastic",
    "invert_data",
    "rotation_from_axis_angle",
    "axis_angle",
    "rotation_from_euler",
    "euler_angles",
    "misorientation",
    "random_rotations",
    "rotation_grid",
    "chi2_sf",
]
