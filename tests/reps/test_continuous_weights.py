"""Issue 11: characters and correlations of continuous groups at high weights are fast and exact.

``characters O(3) --up-to 1000`` and ``correlate O(3) m-3m --up-to 1000`` took a
minute; the library now builds rows in O(classes) (characters are periodic in
the weight at operations of finite order) and refuses weights past
``MAX_UP_TO``.  Oracles computed another way:

* the character of D^l at a rotation by t is sin((l + 1/2) t)/sin(t/2), 2l + 1
  at t = 0 (Tinkham 1964, ch. 5; the formula of REFERENCES.md), and an axial
  irrep of weight m has 2 cos(m t) (common practice); multiplicities follow
  from the reduction formula (Cotton 1990) evaluated in floating point;
* the restriction of D^l to an axial group is compared with the weight
  decomposition of the harmonic space itself (``continuous_decompose``).
Timings are in benchmarks/hangs.py.
"""

import cmath
import math

import numpy as np
import pytest
import sympy as sp

import tensym
from tensym.errors import InvalidOptionError
from tensym.reps.continuous import MAX_UP_TO, PHI, _kind, axial_restriction, continuous_decompose
from tensym.reps.table import finite_table


def _numeric_character(G, irr, op):
    """Character of a continuous irrep from the closed forms, in floating point (standard settings)."""
    core, ext = _kind(G)
    R = np.array(op.numeric, dtype=float)
    det = round(float(np.linalg.det(R)))
    P = det * R
    factor = 1.0
    if det == -1 and ext == "i":
        factor = 1.0 if irr.parity == "g" else -1.0
    if core == "SO3":
        t = math.acos(max(-1.0, min(1.0, (np.trace(P) - 1) / 2)))
        chi = 2 * irr.m + 1 if abs(t) < 1e-9 else math.sin((irr.m + 0.5) * t) / math.sin(t / 2)
        return factor * chi
    if abs(P[2, 2] - 1) < 1e-9:  # a rotation about z
        t = math.atan2(P[1, 0], P[0, 0])
        if irr.m == 0:
            return factor
        if irr.is_real:
            return factor * 2 * math.cos(irr.m * t)
        return factor * cmath.exp(1j * irr.sign * irr.m * t)
    if irr.m != 0:  # a 2-fold normal to z (times i or not)
        return 0.0
    if ext == "det" and det == -1:
        return float(irr.sign)
    if ext == "i":
        par = 1 if irr.parity == "g" else -1
        return float(irr.sign * par) * factor
    return float(irr.sign)


def _numeric_row(G, th, irr, real):
    pool = th.real_irreps if real else th.irreps
    reps = [c.representative for c in th.classes]
    chars = [_numeric_character(G, irr, op) for op in reps]
    out = {}
    for h in pool:
        total = sum(c.size * x * complex(sp.N(y)).conjugate() for c, x, y in zip(th.classes, chars, h.characters))
        m = total / th.order
        if h.label not in th.labels:  # the real form of a complex pair: <chi, chi_1 + chi_2> counts both members
            m /= 2
        k = round(m.real)
        assert abs(m - k) < 1e-6, (irr.label, h.label, m)
        if k:
            out[h.label] = k
    return out


CASES = [("O(3)", "m-3m", 40, True), ("O(3)", "Ih", 75, True), ("SO(3)", "432", 30, True),
         ("O(3)", "6/mmm", 30, True), ("O(3)", "-3m", 20, True), ("SO(3)", "23", 30, False),
         ("O(3)", "4/m", 20, False), ("Dinfh", "6/mmm", 30, True), ("Dinfh", "4/mmm", 20, True),
         ("Cinfv", "3m", 20, True), ("Cinf", "6", 20, False), ("Cinfh", "6/m", 20, True), ("Dinf", "622", 20, True)]


@pytest.mark.parametrize("group, sub, up_to, real", CASES)
def test_correlation_rows_match_the_closed_form_characters(group, sub, up_to, real):
    G = tensym.point_group(group)
    t = tensym.correlate(G, sub, up_to=up_to, real=real)
    th = finite_table(tensym.point_group(sub))
    ct = tensym.character_table(G, up_to=up_to)
    pool = ct.real_irreps if real else ct.irreps
    assert list(t.labels) == [i.label for i in pool]
    for irr, d in zip(pool, t.splittings):
        want = _numeric_row(G, th, irr, real)
        got = dict(zip(d.labels, d.multiplicities))
        assert got == want, irr.label
        assert d.dim == irr.dim


def test_user_correlates_o3_to_m3m_up_to_1000():
    # Bethe 1929 branching: the dimensions add up to 2l + 1 in every row (check of the extrapolated rows)
    t = tensym.correlate("O(3)", "m-3m", up_to=1000)
    assert len(t.labels) == 2002
    for lab, d in zip(t.labels, t.splittings):
        assert d.dim == 2 * int(lab[1:-1]) + 1
    assert str(t["D2g"]) == "Eg + T2g"


@pytest.mark.parametrize("group", ["SO(3)", "O(3)"])
@pytest.mark.parametrize("sub", ["Cinf", "Cinfh", "Dinf", "Cinfv", "Dinfh"])
@pytest.mark.parametrize("real", [True, False])
def test_restriction_to_axial_groups_matches_the_weight_decomposition(group, sub, real):
    G, H = tensym.point_group(group), tensym.point_group(sub)
    try:
        t = tensym.correlate(G, H, up_to=7, real=real)
    except tensym.errors.RepresentationError:
        assert group == "SO(3)" and sub in ("Cinfh", "Cinfv", "Dinfh")  # improper subgroups of SO(3)
        return
    for irr, d in zip(tensym.character_table(G, up_to=7).real_irreps, t.splittings):
        par = irr.parity or ("g" if irr.m % 2 == 0 else "u")
        want = continuous_decompose(tensym.harmonics(irr.m, par), H, real=real)
        assert (d.labels, d.multiplicities) == (want.labels, want.multiplicities), irr.label


def test_user_correlates_o3_to_dinfh_past_the_harmonic_degree_limit():
    # weights m = 0 .. l once each; z-like parity (Herzberg species, common practice)
    t = tensym.correlate("O(3)", "Dinfh", up_to=30)
    row = t["D30g"]
    assert row.labels[:2] == ("Σg+", "Πg") and row.dim == 61 and len(row.labels) == 31
    assert str(t["D1u"]) == "Σu+ + Πu"
    assert str(axial_restriction(tensym.point_group("Dinf"), 3, -1)).startswith("Σ- + ")


def test_character_rows_past_l4_are_the_closed_form():
    t = tensym.character_table("O(3)", up_to=12)
    assert t.character_row("D4g")[1] == 1 + sum(2 * sp.cos(k * PHI) for k in range(1, 5))
    for l in (5, 8, 12):
        rot = t.character_row(f"D{l}u")[1]
        assert sp.sstr(rot) == f"sin({2 * l + 1}*phi/2)/sin(phi/2)"
        for phi in (0.3, 1.1, 2.9):
            want = 1 + 2 * sum(math.cos(k * phi) for k in range(1, l + 1))
            assert float(rot.subs(PHI, phi)) == pytest.approx(want, abs=1e-9)
    assert "sin(25*phi/2)/sin(phi/2)" in str(t)


def test_user_asks_for_more_than_the_weight_cap():
    with pytest.raises(InvalidOptionError, match=f"up_to must be at most {MAX_UP_TO}.*got 1001"):
        tensym.character_table("O(3)", up_to=MAX_UP_TO + 1)
    with pytest.raises(InvalidOptionError, match=f"at most {MAX_UP_TO}"):
        tensym.correlate("O(3)", "m-3m", up_to=MAX_UP_TO + 1)
    with pytest.raises(InvalidOptionError) as info:
        tensym.correlate("Dinfh", "6/mmm", up_to=10**40)
    assert len(str(info.value)) < 160


def test_up_to_accepts_numpy_integers():
    t = tensym.character_table("Dinfh", up_to=np.int64(2))
    assert t.up_to == 2 and type(t.up_to) is int
