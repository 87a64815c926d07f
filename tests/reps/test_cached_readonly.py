"""Issue 11: objects the representation layer caches cannot be changed by a caller.

``character_table(G).matrices(label)``, ``polynomials(n)`` and ``harmonics(l)``
return objects shared through process-wide caches; a caller that wrote into
them changed every later result.  Each test tries the write, expects the
error, and checks that a fresh computation is unaffected.  Check values:
l = 2 splits as Eg + T2g in m-3m (Bethe 1929), the quadratic polynomials of
4mm split as 2A1 + B1 + B2 + E (common practice: x^2 + y^2 and z^2 are
invariant, x^2 - y^2 is B1, xy is B2, (xz, yz) is E).
"""

import pytest
import sympy as sp

import tensym
from tensym.reps.linalg import group_actions
from tensym.reps.table import finite_table


def test_user_writes_into_irrep_matrices():
    t = finite_table(tensym.point_group("m-3m"))
    mats = t.matrices("Eg")
    assert isinstance(mats, tuple) and all(isinstance(m, sp.ImmutableMatrix) for m in mats)
    with pytest.raises(TypeError):
        mats[1][0, 0] = 5
    with pytest.raises(TypeError):
        mats[1] = sp.eye(2)
    fresh = finite_table(tensym.point_group("m-3m")).matrices("Eg")
    assert [m.trace() for m in fresh[:1]] == [2]
    b = tensym.symmetry_adapted(tensym.harmonics(2), "m-3m")
    assert b.labels == ("Eg", "T2g")


def test_user_rebinds_the_degree_of_a_cached_polynomial_space():
    p = tensym.polynomials(2)
    with pytest.raises(AttributeError):
        p.degree = 5
    with pytest.raises(AttributeError):
        p.basis = ()
    assert tensym.polynomials(2).dim == 6
    assert str(tensym.decompose(tensym.polynomials(2), "4mm")) == "2A1 + B1 + B2 + E"


def test_user_rebinds_l_or_parity_of_a_cached_harmonic_space():
    h = tensym.harmonics(2)
    for name, value in (("l", 3), ("parity", "u"), ("basis", ())):
        with pytest.raises(AttributeError):
            setattr(h, name, value)
    assert tensym.harmonics(2).l == 2 and tensym.harmonics(2).parity == "g"
    assert str(tensym.decompose(tensym.harmonics(2), "m-3m")) == "Eg + T2g"


def test_group_actions_cache_is_a_tuple():
    mats = group_actions(tensym.polynomials(1), tensym.point_group("4mm"))
    assert isinstance(mats, tuple) and len(mats) == 8
    with pytest.raises(TypeError):
        mats[0] = None
