"""Acoustic waves in a trigonal crystal: Christoffel matrices and phase velocities.

Scenario (invented material): a delay-line designer has a class-32 crystal
"TQ-2" and wants to know which bulk waves travel along its axes.  For a plane
wave with unit normal n the phase velocities v solve the Christoffel problem

    Gamma_ik u_k = rho v^2 u_i,    Gamma_ik = c_ijkl n_j n_l.

The reduced stiffness of class 32 (six constants) gives Gamma in closed form;
sympy finds the velocities: along z (the optic axis) one longitudinal wave and
two degenerate shear waves; along x a pure longitudinal wave and two
quasi-shear waves coupled by c14.

Run:  python worked_examples/acoustic_waves_trigonal.py
"""

import numpy as np
import sympy as sp

import tensym

c = tensym.tensor_form("elastic_stiffness", "32")
print(c)
print()

C = c.tensor                                   # full c_ijkl, entries in c11 ... c44
rho = sp.Symbol("rho", positive=True)
names = {str(s): s for s in c.symbols}


def christoffel(n):
    """Gamma_ik = c_ijkl n_j n_l for a direction n (sympy Matrix of three entries)."""
    return sp.Matrix(3, 3, lambda i, k: sp.expand(sum(C[i, j, k, l] * n[j] * n[l]
                                                      for j in range(3) for l in range(3))))


def velocities(gamma):
    """Phase velocities sqrt(lambda / rho) for the eigenvalues lambda of Gamma, with multiplicities."""
    out = []
    for lam, mult in gamma.eigenvals().items():
        out += [sp.sqrt(sp.factor(lam) / rho)] * mult
    return out


# --- propagation along z ------------------------------------------------------------------------------
gz = christoffel(sp.Matrix([0, 0, 1]))
print("Christoffel matrix for n = [001]:")
sp.pprint(gz, use_unicode=False)
vz = velocities(gz)
print("phase velocities along z:", ", ".join(sp.sstr(v) for v in vz))
assert gz == sp.diag(names["c44"], names["c44"], names["c33"])
assert sorted(map(sp.sstr, vz)) == sorted(map(sp.sstr, [sp.sqrt(names["c44"] / rho)] * 2
                                               + [sp.sqrt(names["c33"] / rho)]))
print("  -> z is an acoustic axis: both shear waves travel at sqrt(c44/rho)")
print()

# --- propagation along x ----------------------------------------------------------------------------------
gx = christoffel(sp.Matrix([1, 0, 0]))
print("Christoffel matrix for n = [100]:")
sp.pprint(gx, use_unicode=False)
vx = velocities(gx)
# write Gamma_22 = (c11 - c12)/2 as c66 to read the quasi-shear pair
c66 = sp.Symbol("c66", real=True)
gx66 = gx.subs(names["c11"], 2 * c66 + names["c12"]).applyfunc(sp.expand)
gx66[0, 0] = names["c11"]
print("rho v^2 along x, with c66 = (c11 - c12)/2:")
for lam in sorted(gx66.eigenvals(), key=sp.default_sort_key):
    print("  ", sp.sstr(sp.simplify(lam)))
# the quasi-shear pair is split by c14; with c14 = 0 it would be c66 and c44
lam = sp.Symbol("lambda")
char = sp.expand((gx66 - lam * sp.eye(3)).det())
assert sp.expand(char - (names["c11"] - lam) * ((c66 - lam) * (names["c44"] - lam) - names["c14"] ** 2)) == 0
print()

# --- numbers for the invented crystal TQ-2 ------------------------------------------------------------------
TQ2 = {"c11": 88.0e9, "c12": 8.0e9, "c13": 13.0e9, "c14": 17.0e9, "c33": 107.0e9, "c44": 58.0e9}   # Pa
RHO = 2700.0                                                                                    # kg/m^3
subs = {names[k]: v for k, v in TQ2.items()}
subs[rho] = RHO
vz_num = sorted(float(v.subs(subs)) for v in vz)
vx_num = sorted(float(v.subs(subs)) for v in vx)

# cross-check: the numeric Christoffel matrix of the evaluated tensor, for the same directions
Cnum = c.evaluate(TQ2, full=True)
for n, expected in (([0, 0, 1], vz_num), ([1, 0, 0], vx_num)):
    g = np.einsum("ijkl,j,l->ik", Cnum, np.array(n, float), np.array(n, float))
    v = np.sqrt(np.linalg.eigvalsh(g) / RHO)
    assert np.allclose(np.sort(v), expected, rtol=1e-12)

print("TQ-2 (invented), rho = 2700 kg/m^3:")
print("  along z: " + ", ".join(f"{v:.0f}" for v in vz_num) + " m/s")
print("  along x: " + ", ".join(f"{v:.0f}" for v in vx_num) + " m/s")
print(f"RESULT: along z the longitudinal wave travels at {vz_num[-1]:.0f} m/s and both shear waves at "
      f"{vz_num[0]:.0f} m/s")
