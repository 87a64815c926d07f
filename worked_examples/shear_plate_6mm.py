"""A thickness-shear plate cut from a poled 6mm piezoceramic.

Scenario (invented material): a transducer maker poles the ceramic "KN-7"
along x3 and cuts a plate whose electrodes are normal to x1.  A field E1 across
the plate drives the shear T5 (x1-x3 plane), so the mode is governed by d15,
s55 and epsilon11.  The reduced forms of 6mm tell which constants exist; sympy
then derives the shear coupling factor k15 from the constitutive equations,
and the same factor again from the stress-charge constants (e, c, epsilon^S).

Run:  python worked_examples/shear_plate_6mm.py
"""

import numpy as np
import sympy as sp

import tensym

GROUP = "6mm"

# --- 1. the reduced forms -------------------------------------------------------------------
d = tensym.tensor_form("piezoelectric_d", GROUP)
e = tensym.tensor_form("piezoelectric_e", GROUP)
c = tensym.tensor_form("elastic_stiffness", GROUP)
eps = tensym.tensor_form("dielectric_permittivity", GROUP)
for form in (d, e, c):
    print(form)
    print()

# --- 2. compliance and d from the stress-charge constants -------------------------------------
# In Voigt notation with the handbook factors, s = c^-1 and d = e s (IEEE Std 176).
s_from_c = c.voigt.inv().applyfunc(sp.factor)
d_from_e = (e.voigt * s_from_c).applyfunc(sp.simplify)
s_form = tensym.tensor_form("elastic_compliance", GROUP)
sym = {str(x): x for x in c.symbols + e.symbols + d.symbols + s_form.symbols}
c44, e15, d15 = sym["c44"], sym["e15"], sym["d15"]

# the inverse has the zero pattern and the tie s66 = 2 (s11 - s12) of the compliance form
assert all((s_from_c[i, j] == 0) == (s_form.voigt[i, j] == 0) for i in range(6) for j in range(6))
assert sp.simplify(s_from_c[5, 5] - 2 * (s_from_c[0, 0] - s_from_c[0, 1])) == 0
# and d = e s has the zero pattern of the d form
assert all((d_from_e[i, j] == 0) == (d.voigt[i, j] == 0) for i in range(3) for j in range(6))
print("d15 in terms of the stress-charge constants:  d15 =", d_from_e[0, 4])
assert sp.simplify(d_from_e[0, 4] - e15 / c44) == 0

# --- 3. the shear mode: coupling factor from the strain-charge equations ------------------------
# Only T5 and E1 act:  S5 = s55^E T5 + d15 E1,   D1 = d15 T5 + eps11^T E1.
T5, E1 = sp.symbols("T5 E1", real=True)
s55E, eps11T = sp.symbols("s55^E epsilon11^T", positive=True)
S5 = s55E * T5 + d15 * E1
D1 = d15 * T5 + eps11T * E1
# open circuit (D1 = 0): the plate is stiffer; the compliance drops to s55^D
E1_open = sp.solve(sp.Eq(D1, 0), E1)[0]
s55D = sp.simplify(S5.subs(E1, E1_open) / T5)
k15_sq = sp.simplify(1 - s55D / s55E)
print("open-circuit shear compliance:  s55^D =", sp.expand(s55D))
print("coupling factor:  k15^2 = 1 - s55^D/s55^E =", k15_sq)
assert sp.simplify(k15_sq - d15**2 / (s55E * eps11T)) == 0

# --- 4. the same factor from e15, c44 and eps11^S -------------------------------------------------
# eps^T = eps^S + d e^T (IEEE Std 176); for 6mm the (1,1) entry of d e^T is d15 e15.
eps11S = sp.Symbol("epsilon11^S", positive=True)
de = (d_from_e * e.voigt.T).applyfunc(sp.simplify)
assert sp.simplify(de[0, 0] - e15**2 / c44) == 0
in_e_terms = sp.simplify(k15_sq.subs({d15: e15 / c44, s55E: 1 / c44, eps11T: eps11S + e15**2 / c44}))
print("in stress-charge terms:  k15^2 =", in_e_terms)
assert sp.simplify(in_e_terms - e15**2 / (e15**2 + c44 * eps11S)) == 0

# --- 5. numbers for the invented ceramic KN-7 ---------------------------------------------------------
KN7_c = {"c11": 140e9, "c12": 80e9, "c13": 75e9, "c33": 115e9, "c44": 22e9}   # Pa
KN7_e = {"e15": 11.0, "e31": -4.0, "e33": 15.0}                                # C/m^2
KN7_epsS = {"epsilon11": 8.0e-9, "epsilon33": 6.5e-9}                           # F/m
C = c.evaluate(KN7_c)
E = e.evaluate(KN7_e)
epsS = eps.evaluate(KN7_epsS)
D = E @ np.linalg.inv(C)                 # d = e s, in C/N
epsT = epsS + D @ E.T                    # eps^T = eps^S + d e^T
S = np.linalg.inv(C)
k15_num = abs(D[0, 4]) / np.sqrt(S[4, 4] * epsT[0, 0])
k15_sym = float(sp.sqrt(in_e_terms).subs({e15: KN7_e["e15"], c44: KN7_c["c44"],
                                         eps11S: KN7_epsS["epsilon11"]}))
assert abs(k15_num - k15_sym) < 1e-12
print()
print(f"KN-7 (invented): d15 = {D[0, 4] * 1e12:.0f} pC/N, eps11^T/eps0 = {epsT[0, 0] / 8.8541878128e-12:.0f}")
print(f"RESULT: thickness-shear coupling factor of the KN-7 plate  k15 = {k15_num:.3f}")
