"""Tensor specifications, the property catalog, the exact invariant solver and reduced forms.

Examples
--------
>>> from tensym.tensors import tensor_form, TensorSpec
>>> tensor_form(TensorSpec(2, ["-ji"]), "4/m").n_independent
1
"""

from tensym.tensors.catalog import Property, get_property, property_names, register_property
from tensym.tensors import magnetic_catalog  # noqa: F401  (registers the magnetic properties)
from tensym.tensors.form import RotatedForm, TensorForm, as_property, tensor_form
from tensym.tensors.spec import MAX_RANK, TensorSpec
from tensym.tensors.rotate import rotate_tensor
from tensym.tensors.voigt import from_voigt, to_voigt, voigt_shape

__all__ = [
    "MAX_RANK",
    "Property",
    "TensorForm",
    "RotatedForm",
    "TensorSpec",
    "as_property",
    "from_voigt",
    "get_property",
    "property_names",
    "register_property",
    "rotate_tensor",
    "tensor_form",
    "to_voigt",
    "voigt_shape",
]
