"""Decompositions: splitting of D^l, tensor spaces, products, continuous groups."""

import pytest
import sympy as sp
from sympy.physics.quantum.spin import Rotation

import tensym
from tensym.groups import Operation, point_group, point_groups
from tensym.reps.spaces import harmonic_character, harmonics


# Splitting of D^l in crystal fields: Bethe 1929 (Ann. Phys. 3, 133), Koster et al. 1963
# compatibility tables (from memory).
BETHE = [
    (2, "m-3m", "Eg + T2g"),
    (2, "-43m", "E + T2"),
    (2, "4/mmm", "A1g + B1g + B2g + Eg"),
    (2, "3m", "A1 + 2E"),
    (1, "3m", "A1 + E"),
    (3, "m-3m", "A2u + T1u + T2u"),
    (4, "m-3m", "A1g + Eg + T1g + T2g"),
    (0, "m-3m", "A1g"),
    (1, "m-3m", "T1u"),
    (2, "432", "E + T2"),
    (3, "432", "A2 + T1 + T2"),
    (2, "532", "H"),  # Cotton 1990, I table: (2z^2 - x^2 - y^2, ...) in H (from memory)
    (3, "532", "T2 + G"),
]


@pytest.mark.parametrize("l, group, want", BETHE)
def test_splitting_of_Dl(l, group, want):
    assert str(tensym.decompose(tensym.harmonics(l), group)) == want


def test_dimensions_add_up():
    for symbol in point_groups():
        for l in range(5):
            d = tensym.decompose(harmonics(l), symbol)
            assert d.dim == 2 * l + 1


# sympy's Wigner D-matrices as an outside reference for chi_l at rotations about y
ANGLES = [sp.pi / 2, sp.pi / 3, 2 * sp.pi / 3, sp.pi / 4, sp.pi]


@pytest.mark.parametrize("beta", ANGLES)
@pytest.mark.parametrize("l", [1, 2, 3])
def test_Dl_character_against_sympy_wigner(l, beta):
    trace = sum(Rotation.D(l, m, m, 0, beta, 0).doit() for m in range(-l, l + 1))
    want = sp.simplify(sp.expand_complex(trace))
    c, s = sp.cos(beta), sp.sin(beta)
    op = Operation.from_matrix([[c, 0, s], [0, 1, 0], [-s, 0, c]])
    assert sp.simplify(harmonic_character(l, op, 1) - want) == 0
    # the textbook formula sin((l + 1/2) t) / sin(t / 2) (Tinkham 1964)
    assert sp.simplify(harmonic_character(l, op, 1) - sp.sin((l + sp.Rational(1, 2)) * beta) / sp.sin(beta / 2)) == 0
    # and the trace of the explicit action on the harmonic polynomials
    assert sp.simplify(harmonics(l).action(op).trace() - want) == 0


def test_improper_parity_of_harmonics():
    inv = Operation.from_triplet("-x,-y,-z")
    assert harmonics(3).character(inv) == -7
    assert harmonics(3, parity="g").character(inv) == 7
    assert harmonics(2, parity="u").action(inv) == -sp.eye(5)


def test_elastic_tensor_decompositions():
    # isotropic: 2 D0 + 2 D2 + D4 (common practice; e.g. the harmonic decomposition of elasticity);
    # cubic: 3 A1g + 3 Eg + T1g + 3 T2g, dimensions adding to 21 (issue reference values)
    spec = tensym.TensorSpec(4, ["jikl", "ijlk", "klij"])
    o3 = tensym.decompose(spec, "O(3)")
    assert str(o3) == "2 D0g + 2 D2g + D4g" and o3.dim == 21
    so3 = tensym.decompose(spec.as_space(), "SO(3)")
    assert dict(so3) == {"D0": 2, "D2": 2, "D4": 1}
    oh = tensym.decompose(spec, "m-3m")
    assert dict(oh) == {"A1g": 3, "Eg": 3, "T1g": 1, "T2g": 3} and oh.dim == 21


def test_transverse_isotropy():
    # five elastic constants for transverse isotropy (Nye 1985, hexagonal/inf-fold axis; from memory)
    d = tensym.decompose(tensym.get_property("elastic_stiffness"), "Dinfh")
    assert d["Σg+"] == 5 and d.dim == 21
    assert str(tensym.decompose(harmonics(2), "Dinfh")) == "Σg+ + Πg + Δg"
    assert str(tensym.decompose(harmonics(3), "Cinfv")) == "Σ+ + Π + Δ + Φ"


CATALOG = [n for n in tensym.property_names() if n != "fourth_order_elastic"]


@pytest.mark.parametrize("name", CATALOG)
def test_trivial_multiplicity_equals_independent_constants(name):
    # the number of invariants counted by characters equals the solver's count (issue requirement;
    # the solver is checked against Nye 1985 in tests/tensors)
    prop = tensym.get_property(name)
    for symbol in point_groups():
        g = point_group(symbol)
        trivial = tensym.character_table(g).real_irreps[0].label
        assert tensym.decompose(prop, g)[trivial] == tensym.tensor_form(name, g).n_independent, symbol


def test_trivial_multiplicity_rank8_sample():
    for symbol in ("1", "m-3m", "6/mmm", "-43m"):
        g = point_group(symbol)
        trivial = tensym.character_table(g).real_irreps[0].label
        n = tensym.decompose(tensym.get_property("fourth_order_elastic"), g)[trivial]
        assert n == tensym.tensor_form("fourth_order_elastic", g).n_independent


def test_continuous_trivial_multiplicities():
    # isotropic elasticity has 2 constants, transversely isotropic 5 (Nye 1985; from memory)
    for group, n in (("O(3)", 2), ("SO(3)", 2), ("Dinfh", 5), ("Cinf", 5)):
        d = tensym.decompose(tensym.get_property("elastic_stiffness"), group)
        trivial = {"O(3)": "D0g", "SO(3)": "D0", "Dinfh": "Σg+", "Cinf": "Σ"}[group]
        assert d[trivial] == n == tensym.tensor_form("elastic_stiffness", group).n_independent


def test_products_and_squares():
    # selection rules in Oh: T1u x T1u = A1g + Eg + T1g + T2g; [T1u^2] = A1g + Eg + T2g; {T1u^2} = T1g
    # (Koster et al. 1963 multiplication tables; from memory)
    assert str(tensym.decompose(tensym.irrep_product("m-3m", "T1u", "T1u"), "m-3m")) == "A1g + Eg + T1g + T2g"
    assert str(tensym.decompose(tensym.symmetric_square("m-3m", "T1u"), "m-3m")) == "A1g + Eg + T2g"
    assert str(tensym.decompose(tensym.antisymmetric_square("m-3m", "T1u"), "m-3m")) == "T1g"
    # E x E in C3v = A1 + A2 + E (Cotton 1990; from memory)
    assert str(tensym.decompose(tensym.irrep_product("3m", "E", "E"), "3m")) == "A1 + A2 + E"
    # the action of a product space is a representation with the right character
    p = tensym.irrep_product("4mm", "E", "B1")
    g = point_group("4mm")
    for op in g.operations:
        assert p.action(op).trace() == p.character(op)


def test_complex_pairs_real_and_separate():
    vec = tensym.polynomials(1)
    assert str(tensym.decompose(vec, "4")) == "A + E"
    d = tensym.decompose(vec, "4", real=False)
    assert dict(d) == {"A": 1, "1E": 1, "2E": 1}
    assert str(tensym.decompose(vec, "6/m")) == "Au + E1u"
    assert str(tensym.decompose(vec, "Cinf", real=False)) == "Σ + 1Π + 2Π"


def test_decomposition_is_a_read_only_mapping():
    d = tensym.decompose(harmonics(2), "4/mmm")
    assert d["A1g"] == 1 and d["A2g"] == 0 and "A2g" not in d and len(d) == 4
    assert d.latex() == "A_{1g} \\oplus B_{1g} \\oplus B_{2g} \\oplus E_{g}"
    assert "Decomposition('A1g + B1g + B2g + Eg'" in repr(d)
    with pytest.raises(TypeError):
        d["A1g"] = 2
    with pytest.raises(Exception):
        d.labels = ()
    assert d == {"A1g": 1, "B1g": 1, "B2g": 1, "Eg": 1}
