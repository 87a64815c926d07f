"""The linear magnetoelectric effect of a trigonal antiferromagnet.

Scenario (invented material): a sensor group studies "AF-2", a corundum-like
oxide that orders antiferromagnetically below its Neel temperature.  Above it
the crystal is paramagnetic, magnetic point group -3m1' (time reversal is a
symmetry); below it the spins break time reversal and leave -3'm', in which
the inversion and the mirrors appear only combined with time reversal.  The
linear magnetoelectric tensor (P_i = alpha_ij H_j; axial and time-odd) is
forbidden above the ordering and allowed below it; its form, the induced
polarization and the list of magnetic classes that allow the effect follow.

Run:  python worked_examples/magnetoelectric_antiferromagnet.py
"""

import sympy as sp

import tensym
from tensym.groups.magnetic import magnetic_point_groups

ORDERED, PARAMAGNETIC = "-3'm'", "-3m1'"

# --- 1. the tensor in the two phases ------------------------------------------------------------------------------
alpha = tensym.tensor_form("magnetoelectric", ORDERED)
print(alpha)
print()
para = tensym.tensor_form("magnetoelectric", PARAMAGNETIC)
print(f"above the Neel temperature ({PARAMAGNETIC}): {para.n_independent} independent components "
      "(time reversal forbids every time-odd tensor)")
# Dzyaloshinskii 1959: in -3'm' the tensor is diagonal with alpha11 = alpha22 and alpha33
a11, a33 = alpha.symbols
assert alpha.voigt == sp.diag(a11, a11, a33) and para.n_independent == 0
print()

# --- 2. which of the -3m magnetic classes allow the effect ----------------------------------------------------------
print("magnetic classes with parent -3m and their magnetoelectric constants:")
for rec in magnetic_point_groups():
    if rec.parent == "-3m":
        f = tensym.tensor_form("magnetoelectric", rec.symbol)
        print(f"  {rec.symbol:8s} ({rec.kind:15s}) {f.n_independent}  {', '.join(map(str, f.symbols)) or '-'}")
allowed = [rec.symbol for rec in magnetic_point_groups()
           if tensym.tensor_form("magnetoelectric", rec.symbol).n_independent > 0]
# Birss, Symmetry and Magnetism (1964): 58 of the 122 magnetic point groups allow the linear effect
assert len(allowed) == 58
print(f"of all 122 magnetic point groups, {len(allowed)} allow a linear magnetoelectric effect")
print()

# --- 3. the induced polarization -----------------------------------------------------------------------------------------
H = sp.Matrix(sp.symbols("H1 H2 H3", real=True))
P = alpha.voigt * H
print("P = alpha H:", list(P))
theta = sp.Symbol("theta", real=True)
Hdir = sp.Matrix([sp.sin(theta), 0, sp.cos(theta)])
P_dir = sp.simplify(Hdir.dot(alpha.voigt * Hdir))
print("polarization along a field at angle theta to the 3-fold axis (per unit field):", P_dir)
assert sp.simplify(P_dir - (a11 * sp.sin(theta) ** 2 + a33 * sp.cos(theta) ** 2)) == 0

# --- 4. numbers for the invented AF-2 ---------------------------------------------------------------------------------------
AF2 = {"alpha11": 0.7e-12, "alpha33": 3.1e-12}       # s/m (ps/m), at 80 K
A = alpha.evaluate(AF2)
mu0 = 4e-7 * 3.141592653589793
H_field = 1.0 / mu0                                   # A/m for mu0 H = 1 T along z
P_z = A[2, 2] * H_field
print()
print(f"AF-2 (invented): alpha11 = {AF2['alpha11'] * 1e12:.1f} ps/m, alpha33 = {AF2['alpha33'] * 1e12:.1f} ps/m")
print(f"RESULT: in AF-2 (magnetic point group {ORDERED}) a field mu0 H = 1 T along the 3-fold axis induces "
      f"P3 = {P_z * 1e6:.2f} uC/m^2; none above the Neel temperature ({PARAMAGNETIC})")
