"""Bad inputs raise tensym errors with clear messages; the public name lists."""

import pytest
import sympy as sp

import tensym
import tensym.reps
from tensym.errors import (
    InvalidArgumentError,
    InvalidOptionError,
    RepresentationError,
    TensymError,
    UnknownGroupError,
    UnknownIrrepError,
)
from tensym.reps.spaces import X


def test_unknown_irrep_lists_nearest():
    t = tensym.character_table("m-3m")
    with pytest.raises(UnknownIrrepError, match=r"no irrep 'T3g'.*nearest: .*T[12]g"):
        t.irrep("T3g")
    with pytest.raises(UnknownIrrepError, match="nearest"):
        tensym.project(X, "3m", "A3")
    with pytest.raises(UnknownIrrepError, match="Σ|Sigma|nearest"):
        tensym.character_table("Dinfh").irrep("Sigma_q")
    assert issubclass(UnknownIrrepError, KeyError) and issubclass(UnknownIrrepError, TensymError)


def test_label_spellings_are_tolerated():
    t = tensym.character_table("-6m2")
    assert t.irrep("A1''").label == t.irrep("A_1''").label == t.irrep("a1''").label == "A1''"
    assert t.irrep("E'").label == "E'"
    assert tensym.character_table("O(3)").irrep("D_2g").label == "D2g"


def test_decomposition_unknown_label():
    d = tensym.decompose(tensym.harmonics(2), "4/mmm")
    with pytest.raises(UnknownIrrepError, match="4/mmm has no irrep 'Xg'"):
        d["Xg"]


def test_wrong_object_types():
    with pytest.raises(InvalidArgumentError, match="expected a representation space"):
        tensym.decompose([1, 2, 3], "m-3m")
    with pytest.raises(InvalidArgumentError, match="sympy expression"):
        tensym.project(object(), "m-3m", "A1g")
    with pytest.raises(InvalidArgumentError, match="real must be True or False"):
        tensym.decompose(tensym.harmonics(1), "m-3m", real="yes")
    with pytest.raises(InvalidArgumentError, match="continuous"):
        tensym.irrep_product("O(3)", "D1u", "D1u")
    with pytest.raises(InvalidArgumentError, match="finite groups"):
        tensym.symmetry_adapted(tensym.harmonics(1), "O(3)")
    assert issubclass(InvalidArgumentError, TypeError)


def test_bad_groups():
    with pytest.raises(UnknownGroupError, match="nearest"):
        tensym.character_table("m3mm")
    with pytest.raises(UnknownGroupError):
        tensym.decompose(tensym.harmonics(1), "D7q")


def test_bad_options():
    with pytest.raises(InvalidOptionError, match="l must be between 0 and"):
        tensym.harmonics(-1)
    with pytest.raises(InvalidOptionError, match="parity must be 'g' or 'u'"):
        tensym.harmonics(2, parity="even")
    with pytest.raises(InvalidOptionError, match="degree must be a non-negative integer"):
        tensym.polynomials(1.5)
    with pytest.raises(InvalidOptionError, match="up_to"):
        tensym.character_table("O(3)", up_to=-1)
    with pytest.raises(InvalidOptionError, match="up_to"):
        tensym.correlate("O(3)", "m-3m", up_to="all")


def test_elements_outside_the_space():
    h = tensym.harmonics(2)
    with pytest.raises(RepresentationError, match="not harmonic"):
        h.coordinates(X**2)
    with pytest.raises(RepresentationError, match="homogeneous"):
        tensym.polynomials(2).coordinates(X)
    p = tensym.irrep_product("4mm", "E", "E")
    with pytest.raises(RepresentationError, match="not an operation of 4mm"):
        p.action(tensym.Operation.from_triplet("z,x,y"))
    with pytest.raises(RepresentationError, match="not a space of|is a space of group"):
        tensym.decompose(p, "m-3m")


def test_all_lists():
    for name in tensym.reps.__all__:
        assert hasattr(tensym.reps, name), name
    for name in ["character_table", "decompose", "correlate", "project", "symmetry_adapted", "harmonics",
                 "polynomials", "irrep_product", "symmetric_square", "antisymmetric_square", "Decomposition",
                 "CharacterTable", "CorrelationTable", "SymmetryAdaptedBasis", "Irrep", "Space", "irrep_space"]:
        assert name in tensym.__all__ and hasattr(tensym, name), name
    import importlib

    for mod in ["space", "spaces", "table", "characters", "labels", "cyclotomic", "reduction", "irreps",
                "linalg", "decompose", "continuous", "projection", "correlation", "inputs"]:
        m = importlib.import_module(f"tensym.reps.{mod}")
        assert isinstance(m.__all__, list)
        for name in m.__all__:
            assert hasattr(m, name), (mod, name)
