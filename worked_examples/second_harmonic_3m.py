"""Second-harmonic generation in a 3m crystal, with and without Kleinman symmetry.

Scenario (invented material): a laser lab grows the 3m crystal "NX-3" and wants
to double a beam by type-I (ooe) phase matching.  The second-order
coefficients d_iJ (P_i(2w) = eps0 sum d_iJ (EE)_J) have the index symmetry
d_ijk = d_ikj; far from absorption Kleinman's conjecture makes d_ijk fully
symmetric, which ties one more pair of constants in class 3m.  sympy then
derives the effective coefficient d_eff = e(2w) . d : o(w) o(w) for an
ordinary pump and an extraordinary second harmonic.

Run:  python worked_examples/second_harmonic_3m.py
"""

import math

import sympy as sp

import tensym

GROUP = "3m"          # setting 3m1: a mirror normal to x
general = tensym.tensor_form("second_harmonic", GROUP)
kleinman = tensym.tensor_form("second_harmonic_kleinman", GROUP)
print(general)
print()
print(kleinman)
print()

# --- 1. what Kleinman symmetry adds --------------------------------------------------------------
# The Kleinman form is the general one with extra ties: the differences of the two
# Voigt matrices (same symbol names) are exactly those ties.
ties = sorted({sp.factor(x) for x in general.voigt - kleinman.voigt if x != 0}, key=sp.default_sort_key)
print(f"independent constants: {general.n_independent} in general, {kleinman.n_independent} with Kleinman symmetry")
# Boyd, Nonlinear Optics, sec. 1.5 (from memory): class 3m has 4 constants, 3 under Kleinman symmetry,
# the extra tie being d31 = d15
assert (general.n_independent, kleinman.n_independent) == (4, 3)
V = general.voigt
d15, d22, d31, d33 = V[0, 4], V[1, 1], V[2, 0], V[2, 2]       # handbook labels, read off by position
assert len(ties) == 1 and sp.simplify(ties[0] ** 2 - (d31 - d15) ** 2) == 0
print("Kleinman symmetry adds the tie:", " ; ".join(f"{sp.sstr(t)} = 0" for t in ties))
print()

# --- 2. effective coefficient for type-I (ooe) phase matching ---------------------------------------
theta, phi = sp.symbols("theta phi", real=True)
o = sp.Matrix([sp.sin(phi), -sp.cos(phi), 0])                                        # ordinary, at w
e = sp.Matrix([-sp.cos(theta) * sp.cos(phi), -sp.cos(theta) * sp.sin(phi), sp.sin(theta)])  # extraordinary, at 2w
T = general.tensor
d_eff = sp.expand(sum(e[i] * T[i, j, k] * o[j] * o[k] for i in range(3) for j in range(3) for k in range(3)))
handbook = d31 * sp.sin(theta) - d22 * sp.cos(theta) * sp.sin(3 * phi)
# the textbook formula for 3m (from memory; e.g. Boyd, Nonlinear Optics, and crystal-optics handbooks)
assert sp.simplify(sp.expand_trig(d_eff - handbook)) == 0
D22, D31 = sp.symbols("d22 d31", real=True)
print("d_eff(ooe) =", sp.sstr(D31 * sp.sin(theta) - D22 * sp.cos(theta) * sp.sin(3 * phi)))
print("  where, in the constants of the form above, d22 =", sp.sstr(d22), "and d31 =", sp.sstr(d31))
print()

# --- 3. numbers for the invented crystal NX-3 (pm/V) ----------------------------------------------------
NX3 = {"d15": -4.1, "d31": -3.9, "d33": -21.0, "d22": 1.7}
values = {}
for name, entry in (("d15", d15), ("d31", d31), ("d33", d33), ("d22", d22)):
    sym = sorted(entry.free_symbols, key=str)[0]
    values[sym] = NX3[name] / float(entry.coeff(sym))
assert len(values) == general.n_independent
kleinman_gap = abs(NX3["d15"] - NX3["d31"]) / abs(NX3["d33"])
theta_pm = math.radians(47.0)              # phase-matching angle of the invented crystal at its pump line
phi_best = -math.pi / 6                    # |sin 3 phi| = 1
d_eff_num = float(d_eff.subs(values).subs({theta: theta_pm, phi: phi_best}))
print(f"NX-3 (invented): Kleinman symmetry holds to {100 * kleinman_gap:.0f}% of d33 (|d15 - d31| / |d33|)")
print(f"RESULT: type-I SHG in NX-3 at theta = 47 deg, phi = -30 deg: d_eff = {d_eff_num:.2f} pm/V")
