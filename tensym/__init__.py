"""tensym: exact symmetry algebra of crystal property tensors, on top of sympy.

The public API is the explicit list ``tensym.__all__``: plain functions and
immutable result types.  See README.md for conventions and settings.

Examples
--------
>>> import tensym
>>> isinstance(tensym.__all__, list)
True
"""

from tensym import errors

__all__ = ["errors"]

# --- groups (owned by the groups work) -------------------------------------
from tensym.groups import (
    ContinuousGroup,
    GroupNames,
    MagneticPointGroup,
    Operation,
    PointGroup,
    as_group,
    group_from_generators,
    magnetic_class,
    magnetic_point_groups,
    parent_group,
    point_group,
    point_groups,
    recognise,
    reorient,
    rotation_about,
    rotation_from_axes,
    settings_table,
    unitary_subgroup,
)

__all__ += ["ContinuousGroup", "GroupNames", "Operation", "PointGroup", "as_group", "group_from_generators",
            "point_group", "point_groups", "recognise", "reorient", "rotation_about", "rotation_from_axes",
            "settings_table"]
__all__ += ["MagneticPointGroup", "magnetic_class", "magnetic_point_groups", "parent_group", "unitary_subgroup"]
# --- representations --------------------------------------------------------
from tensym.reps import (
    CharacterTable,
    CorrelationTable,
    Decomposition,
    Irrep,
    Space,
    SymmetryAdaptedBasis,
    antisymmetric_square,
    character_table,
    correlate,
    decompose,
    harmonics,
    irrep_product,
    irrep_space,
    polynomials,
    project,
    symmetric_square,
    symmetry_adapted,
)

__all__ += ["CharacterTable", "CorrelationTable", "Decomposition", "Irrep", "Space", "SymmetryAdaptedBasis",
            "antisymmetric_square", "character_table", "correlate", "decompose", "harmonics", "irrep_product",
            "irrep_space", "polynomials", "project", "symmetric_square", "symmetry_adapted"]
# --- tensors ------------------------------------------------------------------
from tensym.tensors import (
    Property,
    RotatedForm,
    TensorForm,
    TensorSpec,
    from_voigt,
    get_property,
    property_names,
    tensor_form,
    to_voigt,
)

__all__ += ["Property", "RotatedForm", "TensorForm", "TensorSpec", "from_voigt", "get_property", "property_names",
            "tensor_form", "to_voigt"]
# --- data -----------------------------------------------------------------------
from tensym.data import (
    BatchCheck,
    CheckReport,
    Orientation,
    SymmetryFinding,
    TensorData,
    axis_angle,
    check_tensor,
    check_tensors,
    component_labels,
    euler_angles,
    find_symmetry,
    invert_data,
    invert_elastic,
    misorientation,
    orient,
    random_rotations,
    read_tensor,
    rotate_values,
    rotation_from_axis_angle,
    rotation_from_euler,
    symmetry_classes,
    tensor_data,
    write_tensor,
)
from tensym.tensors.rotate import rotate_tensor

__all__ += ["BatchCheck", "CheckReport", "Orientation", "SymmetryFinding", "TensorData", "axis_angle",
            "check_tensor", "check_tensors", "component_labels", "euler_angles", "find_symmetry", "invert_data",
            "invert_elastic", "misorientation", "orient", "random_rotations", "read_tensor", "rotate_tensor",
            "rotate_values", "rotation_from_axis_angle", "rotation_from_euler", "symmetry_classes",
            "tensor_data", "write_tensor"]
# --- output ---------------------------------------------------------------------
from tensym.output import as_record, latex_document, render

__all__ += ["as_record", "latex_document", "render"]
