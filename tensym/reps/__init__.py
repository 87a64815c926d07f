"""Representation theory of point groups, exact.

* :func:`character_table`: character tables computed from the group (finite
  groups: class algebra, exact; continuous groups: D^l, Σ/Π/Δ ... families).
* :func:`decompose`: a representation space split into irreps
  (:class:`Decomposition`); spaces: :func:`harmonics`, :func:`polynomials`,
  :func:`irrep_product`, :func:`symmetric_square`, :func:`antisymmetric_square`,
  :func:`irrep_space`, tensor specs (their ``as_space()``).
* :func:`correlate`: subduction to a subgroup (:class:`CorrelationTable`).
* :func:`project`, :func:`symmetry_adapted`: projection operators and partner
  sets (:class:`SymmetryAdaptedBasis`).
* :class:`Space`: the abstract representation space every feature works on.

Examples
--------
>>> from tensym.reps import decompose, harmonics
>>> print(decompose(harmonics(2), "C3v"))
A1 + 2E
"""

from tensym.reps.continuous import ContinuousIrrep, ContinuousTable
from tensym.reps.correlation import CorrelationTable, correlate
from tensym.reps.decompose import (
    Decomposition,
    IrrepSpace,
    antisymmetric_square,
    decompose,
    irrep_product,
    irrep_space,
    symmetric_square,
)
from tensym.reps.projection import PartnerSet, SymmetryAdaptedBasis, project, symmetry_adapted
from tensym.reps.space import Space
from tensym.reps.spaces import HarmonicSpace, PolynomialSpace, harmonics, polynomials
from tensym.reps.table import CharacterTable, ConjugacyClass, Irrep, character_table

__all__ = [
    "Space",
    "character_table",
    "CharacterTable",
    "ConjugacyClass",
    "Irrep",
    "ContinuousTable",
    "ContinuousIrrep",
    "decompose",
    "Decomposition",
    "harmonics",
    "polynomials",
    "HarmonicSpace",
    "PolynomialSpace",
    "IrrepSpace",
    "irrep_space",
    "irrep_product",
    "symmetric_square",
    "antisymmetric_square",
    "correlate",
    "CorrelationTable",
    "project",
    "symmetry_adapted",
    "SymmetryAdaptedBasis",
    "PartnerSet",
]
