"""Reduced forms against published matrices (IEEE Std 176-1987; Nye 1985; Boyd, Nonlinear Optics)."""

import sympy as sp
import pytest

import tensym


def _rels(form):
    return {str(r.lhs): sp.expand(r.rhs) for r in form.relations}


def _S(name):
    return sp.Symbol(name, real=True)


def test_class_32_piezoelectric_d():
    # IEEE Std 176-1987 (quartz, class 32, 2-fold along x); Nye 1985 ch. VII: d12 = -d11,
    # d25 = -d14, d26 = -2 d11 (from memory).
    f = tensym.tensor_form("piezoelectric_d", "32")
    d11, d14 = _S("d11"), _S("d14")
    assert f.symbols == (d11, d14)
    r = _rels(f)
    assert r["d12"] == -d11 and r["d25"] == -d14 and r["d26"] == -2 * d11
    assert f.voigt == sp.Matrix([[d11, -d11, 0, d14, 0, 0], [0, 0, 0, 0, -d14, -2 * d11], [0] * 6])


def test_class_32_piezoelectric_e_has_no_factor_two():
    # e_iJ carries no Voigt factor (IEEE Std 176-1987): e26 = -e11 (from memory).
    r = _rels(tensym.tensor_form("piezoelectric_e", "32"))
    assert r["e26"] == -_S("e11")


def test_class_3m_mirror_normal_to_x():
    # Nye 1985 / IEEE Std 176 with the mirror perpendicular to x1 (from memory):
    # d16 = -2 d22, d21 = -d22, d24 = d15, d32 = d31.
    f = tensym.tensor_form("piezoelectric_d", "3m")
    d15, d22, d31, d33 = (_S(n) for n in ("d15", "d22", "d31", "d33"))
    assert f.symbols == (d15, d22, d31, d33)
    r = _rels(f)
    assert r["d16"] == -2 * d22 and r["d21"] == -d22 and r["d24"] == d15 and r["d32"] == d31
    assert r["d11"] == 0


def test_hexagonal_elasticity():
    # Nye 1985 ch. VIII: c66 = (c11 - c12)/2, five constants c11 c12 c13 c33 c44 (from memory).
    f = tensym.tensor_form("elastic_stiffness", "6/mmm")
    c11, c12 = _S("c11"), _S("c12")
    assert [str(s) for s in f.symbols] == ["c11", "c12", "c13", "c33", "c44"]
    assert _rels(f)["c66"] == (c11 - c12) / 2


def test_hexagonal_compliance_factor_two():
    # Nye 1985 ch. VIII: s66 = 2 (s11 - s12) for hexagonal compliances (from memory).
    r = _rels(tensym.tensor_form("elastic_compliance", "6mm"))
    assert r["s66"] == 2 * (_S("s11") - _S("s12"))


def test_class_23_piezoelectric():
    # Nye 1985 ch. VII, class 23: d14 = d25 = d36 (from memory).
    f = tensym.tensor_form("piezoelectric_d", "23")
    r = _rels(f)
    assert f.symbols == (_S("d14"),)
    assert r["d25"] == _S("d14") and r["d36"] == _S("d14")


def test_isotropic_elasticity_two_constants():
    # Isotropic: c11, c12 with c44 = (c11 - c12)/2 (Nye 1985 ch. VIII; from memory).
    f = tensym.tensor_form("elastic_stiffness", "O(3)")
    assert [str(s) for s in f.symbols] == ["c11", "c12"]
    assert _rels(f)["c44"] == (_S("c11") - _S("c12")) / 2


def test_shg_32_kleinman_and_not():
    # Boyd, Nonlinear Optics, Table of d_il forms (from memory): class 32 has d11, d12 = -d11,
    # d26 = -d11 and d14, d25 = -d14; Kleinman symmetry forces d14 = 0.
    f = tensym.tensor_form("second_harmonic", "32")
    r = _rels(f)
    assert r["d12"] == -_S("d11") and r["d26"] == -_S("d11") and r["d25"] == -_S("d14")
    k = tensym.tensor_form("second_harmonic_kleinman", "32")
    assert k.symbols == (_S("d11"),)


def test_deterministic_symbols():
    a = tensym.tensor_form("elastic_stiffness", "-3m")
    b = tensym.tensor_form("elastic_stiffness", "D3d")
    assert a.symbols == b.symbols and a.voigt == b.voigt


def test_result_is_immutable_and_numeric_is_a_copy():
    f = tensym.tensor_form("elastic_stiffness", "m-3m")
    with pytest.raises(Exception):
        f.n_independent = 4
    arr = f.evaluate({"c11": 1.0, "c12": 0.5, "c44": 0.25})
    arr[0, 0] = 99.0
    assert f.evaluate([1.0, 0.5, 0.25])[0, 0] == 1.0
    b = f.numeric_basis()
    b[:] = 0
    assert f.numeric_basis().any()


def test_evaluate_errors():
    f = tensym.tensor_form("elastic_stiffness", "m-3m")
    with pytest.raises(tensym.errors.DataError, match="missing values for c44"):
        f.evaluate({"c11": 1.0, "c12": 0.5})
    with pytest.raises(tensym.errors.DataError, match="not an independent constant"):
        f.evaluate({"c11": 1.0, "c12": 0.5, "c44": 0.1, "c13": 2})


def test_bad_inputs():
    with pytest.raises(tensym.errors.UnknownPropertyError, match="nearest: elastic_stiffness"):
        tensym.tensor_form("elastic_stifness", "m-3m")
    with pytest.raises(tensym.errors.UnknownGroupError):
        tensym.tensor_form("elastic_stiffness", "6/mmmm")
    with pytest.raises(tensym.errors.InvalidSpecError, match="permutation of the index letters"):
        tensym.TensorSpec(3, ["jk"])
    with pytest.raises(tensym.errors.InvalidSpecError, match="contradict"):
        tensym.TensorSpec(2, ["ji", "-ji"])
    with pytest.raises(tensym.errors.RankLimitError, match="outside the supported range"):
        tensym.TensorSpec(11)
    with pytest.raises(tensym.errors.InvalidSpecError, match="bare string"):
        tensym.TensorSpec(2, "ji")


def test_repr_reads_back():
    from tensym import TensorSpec, tensor_form  # noqa: F401  (names used by eval)

    for f in (tensym.tensor_form("elastic_stiffness", "3m"), tensym.tensor_form(tensym.TensorSpec(2, ["-ji"]), "D4h"),
              tensym.tensor_form("piezoelectric_d", "6mm", symbol="D")):
        g = eval(repr(f))
        assert g.symbols == f.symbols and g.voigt == f.voigt


def test_class_3m_electro_optic_handbook_constants():
    # Nye 1985 ch. XIII, class 3m with the mirror normal to x1 (LiNbO3 form; from memory):
    # r13, r22, r33, r51 with r12 = -r22, r61 = -r22, r23 = r13, r42 = r51.
    f = tensym.tensor_form("electro_optic", "3m")
    assert [str(s) for s in f.symbols] == ["r13", "r22", "r33", "r51"]
    r = _rels(f)
    assert r["r12"] == -_S("r22") and r["r61"] == -_S("r22") and r["r23"] == _S("r13") and r["r42"] == _S("r51")


def test_class_3m_shg_and_e_pick_the_pure_component():
    # Boyd, Nonlinear Optics, class 3m: d15, d22, d31, d33 with d16 = d21 = -d22 (from memory);
    # IEEE Std 176-1987: e15, e22, e31, e33 for 3m (from memory).
    assert [str(s) for s in tensym.tensor_form("second_harmonic", "3m").symbols] == ["d15", "d22", "d31", "d33"]
    assert [str(s) for s in tensym.tensor_form("piezoelectric_e", "3m").symbols] == ["e15", "e22", "e31", "e33"]


def test_prefer_option():
    # Brugger 1965 lists C222 (not C122) among the hexagonal third-order constants (from memory).
    f = tensym.tensor_form("third_order_elastic", "6/mmm", prefer=["C222"])
    assert _S("C222") in f.symbols and _S("C122") not in f.symbols
    assert f.n_independent == 10
    g = tensym.tensor_form("elastic_stiffness", "6/mmm", prefer="c66")
    assert [str(s) for s in g.symbols] == ["c11", "c13", "c33", "c44", "c66"]
    assert _rels(g)["c12"] == _S("c11") - 2 * _S("c66")
    with pytest.raises(tensym.errors.InvalidOptionError, match="not a component of elastic_stiffness"):
        tensym.tensor_form("elastic_stiffness", "6/mmm", prefer=["c77"])
