"""Projection operators, irrep matrices and symmetry-adapted bases."""

import pytest
import sympy as sp
from hypothesis import given, settings, strategies as st

import tensym
from tensym.groups import point_group, point_groups
from tensym.reps.spaces import X as x, Y as y, Z as z, harmonics, polynomials

R2 = x**2 + y**2 + z**2


@pytest.fixture(scope="module")
def c3v_111():
    # C3v with the 3-fold along [111] and its mirrors containing it (the sigma_d of the cube)
    q = tensym.rotation_from_axes(new_z=[1, 1, 1], new_x=[1, -1, 0])
    return tensym.reorient("3m", q)


def _multiple(expr, ref):
    ratio = sp.cancel(sp.expand(expr) / sp.expand(ref))
    return ratio.is_number and ratio != 0


def test_projections_in_c3v_along_111(c3v_111):
    # common practice; the textbook projection-operator exercise
    g = c3v_111
    assert _multiple(tensym.project(x, g, "A1"), x + y + z)
    assert _multiple(tensym.project(x, g, "E"), 2 * x - y - z)
    assert tensym.project(x, g, "A2") == 0
    assert _multiple(tensym.project(x * y, g, "A1"), x * y + y * z + z * x)
    assert tensym.project(x**2 - y**2, g, "E") == sp.expand(x**2 - y**2)
    assert tensym.project(x**2 - y**2, g, "A1") == 0


def test_cubic_harmonic_l4():
    # the A1g function among the l = 4 harmonics in Oh is a multiple of x^4 + y^4 + z^4 - (3/5) r^4
    # (Von der Lage and Bethe 1947)
    want = x**4 + y**4 + z**4 - sp.Rational(3, 5) * R2**2
    basis = tensym.symmetry_adapted(harmonics(4), "m-3m")
    (a1,) = basis["A1g"]
    assert _multiple(a1.elements[0], want)
    for f in harmonics(4).basis:
        p = tensym.project(f, "m-3m", "A1g")
        assert p == 0 or _multiple(p, want)


def test_project_tensor():
    # the isotropic part of a rank-2 tensor is its trace/3 times the identity (common practice)
    a, b, c = sp.symbols("a b c")
    T = sp.Array([[a, 1, 0], [2, b, 0], [0, 0, c]])
    iso = tensym.project(T, "m-3m", "A1g")
    assert iso == sp.Array(sp.eye(3) * (a + b + c) / 3)
    # projections onto all irreps add up to the tensor
    t = tensym.character_table("m-3m")
    total = sum((sp.Matrix(tensym.project(T, "m-3m", i.label).tolist()) for i in t.real_irreps), sp.zeros(3))
    assert total == sp.Matrix(T.tolist())
    # an axial vector: Rz is not invariant under mirrors; in 4/m (with m normal to z) it is Ag
    v = sp.Array([0, 0, 1])
    assert tensym.project(v, "4/m", "Ag", axial=True) == v
    assert tensym.project(v, "4/m", "Ag") == sp.Array([0, 0, 0])


def test_project_onto_rotation_group_irreps():
    # x^2 = r^2/3 + (2x^2 - y^2 - z^2)/3 (common practice: harmonic decomposition)
    assert tensym.project(x**2, "O(3)", "D0g") == sp.expand(R2 / 3)
    assert tensym.project(x**2, "O(3)", "D2g") == sp.expand((2 * x**2 - y**2 - z**2) / 3)
    assert tensym.project(x**2, "O(3)", "D2u") == 0
    assert tensym.project(x**3 + x, "SO(3)", "D1") == sp.expand(x + 3 * x * R2 / 5)


def _zero(v):
    items = list(v) if isinstance(v, sp.MatrixBase) else [v]
    return all(sp.expand(a) == 0 or sp.simplify(a) == 0 for a in items)


@pytest.mark.parametrize("symbol", point_groups())
def test_irrep_matrices_are_unitary_representations(symbol):
    g = point_group(symbol)
    t = tensym.character_table(g)
    table = g.multiplication_table
    gens = [g.index(h) for h in g.generators]
    for irr in t.irreps + tuple(i for i in t.real_irreps if i.label not in t.labels):
        mats = t.matrices(irr.label)
        for i, op in enumerate(g.operations):
            m = sp.Matrix(mats[i])
            assert _zero(m.trace() - t.character(irr.label, op))
            assert _zero(m * m.H - sp.eye(irr.dim))
            if irr.is_real:
                assert all(v.is_real for v in m)
            for k in gens:
                assert _zero(sp.Matrix(mats[k]) * m - sp.Matrix(mats[int(table[k, i])]))


def test_matrices_are_cached_copies_of_immutables():
    t = tensym.character_table("m-3m")
    m = t.matrices("T2g")
    assert isinstance(m, tuple) and isinstance(m[0], sp.ImmutableMatrix)
    with pytest.raises(TypeError):
        m[0][0, 0] = 5


@pytest.mark.parametrize("symbol, space", [
    ("m-3m", polynomials(2)), ("3m", polynomials(3)), ("6/mmm", harmonics(3)), ("-43m", harmonics(2)),
    ("4", polynomials(2)), ("23", harmonics(2)),
])
def test_symmetry_adapted_partners(symbol, space):
    g = point_group(symbol)
    t = tensym.character_table(g)
    basis = tensym.symmetry_adapted(space, g)
    G = sp.Matrix(space.gram())
    M = sp.Matrix(basis.matrix)
    assert M.shape == (space.dim, space.dim)
    assert sp.simplify(M.T * G * M - sp.eye(space.dim)) == sp.zeros(space.dim)
    for s in basis.sets:
        mats = t.matrices(s.irrep)
        for i, op in enumerate(g.operations):
            D = sp.Matrix(space.action(op))
            for j, v in enumerate(s.coordinates):
                image = D * sp.Matrix(v)
                want = sum((mats[i][k, j] * sp.Matrix(s.coordinates[k]) for k in range(len(s.coordinates))),
                           sp.zeros(space.dim, 1))
                assert sp.simplify(image - want) == sp.zeros(space.dim, 1)
    assert dict(tensym.decompose(space, g)) == {lab: len(basis[lab]) for lab in basis.labels}


def test_symmetry_adapted_readable_and_latex(c3v_111):
    b = tensym.symmetry_adapted(polynomials(1), c3v_111)
    (e,) = b["E"]
    assert sp.srepr(e.readable[0]).count("Mul") >= 1
    # partners along the new x = [1, -1, 0] and new y = [1, 1, -2] directions
    assert str(e.readable[0]) == "(sqrt(2)/2)*(x - y)"
    assert str(e.readable[1]) == "(sqrt(6)/6)*(x + y - 2*z)"
    assert "\\begin{array}" in b.latex() and "E" in str(b)
    # tensor space: the bulk part of the cubic elastic tensor is an A1g partner
    elastic = tensym.symmetry_adapted(tensym.get_property("elastic_stiffness"), "m-3m")
    assert len(elastic["A1g"]) == 3 and len(elastic["T2g"]) == 3


# --- hypothesis: projector idempotence, orthogonality and completeness ---------------------------
GROUPS = ["3m", "4/mmm", "m-3m", "-6m2", "23", "4", "-3"]
coeff = st.integers(-3, 3)


@settings(max_examples=25, deadline=None)
@given(st.sampled_from(GROUPS), st.lists(coeff, min_size=6, max_size=6))
def test_projectors_idempotent_orthogonal_complete(symbol, cs):
    f = sum(c * m for c, m in zip(cs, polynomials(2).basis))
    t = tensym.character_table(symbol)
    parts = {}
    for irr in t.real_irreps:
        p = tensym.project(f, symbol, irr.label)
        assert tensym.project(p, symbol, irr.label) == p
        parts[irr.label] = p
    for a in parts:
        for b in parts:
            if a != b:
                assert tensym.project(parts[a], symbol, b) == 0
    assert sp.expand(sum(parts.values()) - f) == 0


def test_project_onto_axial_continuous_irreps():
    # functions of linear molecules (common practice): x^2 + y^2 in Σg+, x^2 - y^2 in Δg, (xz, yz) in Πg,
    # z in Σ+ of C∞v but Σ- of D∞ (the 2-fold along x reverses z)
    assert tensym.project(x**2, "Dinfh", "Σg+") == sp.expand((x**2 + y**2) / 2)
    assert tensym.project(x**2, "Dinfh", "Δg") == sp.expand((x**2 - y**2) / 2)
    assert tensym.project(x * z, "Dinfh", "Πg") == x * z
    assert tensym.project(z, "Cinfv", "Σ+") == z and tensym.project(z, "Dinf", "Σ-") == z
    assert tensym.project(x * y * z, "Cinfv", "Δ") == x * y * z
    # the member 1Π (character exp(+i phi)) matches 1E of the finite subgroups 4 and 6
    assert tensym.project(x, "Cinf", "1Π") == tensym.project(x, "4", "1E") == tensym.project(x, "6", "1E1")
    assert tensym.project(x, "Cinf", "1Π") == sp.expand((x - sp.I * y) / 2)
