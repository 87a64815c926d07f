"""Splitting of d levels at a site of trigonal symmetry, and the symmetry-adapted orbitals.

Scenario (invented material): an optical-materials group dopes the trigonal host
"TR-5" with a transition-metal ion.  The ion sits on a site of symmetry -3m (D3d),
an octahedron squeezed along one of its 3-fold axes, which is the z axis here.
The five d orbitals (l = 2) split into irreps of the site group; projection
operators sort the real d orbitals into those irreps; Schur's lemma, derived here
with sympy from the group's own matrices, gives the most general crystal-field
Hamiltonian, and with it the levels.

Run:  python worked_examples/d_levels_trigonal_site.py
"""

import sympy as sp

import tensym

SITE = "-3m"
x, y, z = sp.symbols("x y z")
d = tensym.harmonics(2)                       # the real d orbitals (l = 2, parity g)

# --- 1. splitting: from the cube to the trigonal site ------------------------------------------------
cubic = tensym.decompose(d, "m-3m")
site = tensym.decompose(d, SITE)
print("d orbitals in an octahedral site (m-3m):", cubic)
print("d orbitals in the trigonal site (-3m):  ", site)
# Bethe 1929: D2 -> Eg + T2g in Oh; in D3d, A1g + 2Eg
assert str(cubic) == "Eg + T2g" and str(site) == "A1g + 2Eg"
table = tensym.correlate("m-3m", SITE)
print("on lowering the symmetry (3-fold along [111] of the cube):  T2g ->", table["T2g"], "; Eg ->", table["Eg"])
assert str(table["T2g"]) == "A1g + Eg" and str(table["Eg"]) == "Eg"
print()

# --- 2. projection: which irrep each real d orbital belongs to ---------------------------------------------
orbitals = {"d(z2)": 2 * z**2 - x**2 - y**2, "d(xz)": x * z, "d(yz)": y * z, "d(x2-y2)": x**2 - y**2, "d(xy)": x * y}
labels = site.labels
print("projection P_G f = (d_G/|G|) sum_g chi_G(g)* g.f of each real d orbital:")
for name, f in orbitals.items():
    parts = {lab: tensym.project(f, SITE, lab) for lab in labels}
    inside = [lab for lab, p in parts.items() if p != 0]
    assert len(inside) == 1 and sp.expand(parts[inside[0]] - f) == 0   # each one lies in one irrep
    print(f"  {name:9s} -> {inside[0]}")
mixed = x * z + (x**2 - y**2) + (2 * z**2 - x**2 - y**2)
pieces = {lab: tensym.project(mixed, SITE, lab) for lab in labels}
print("  a mixed function", mixed, "splits into", {k: v for k, v in pieces.items() if v != 0})
assert sp.expand(sum(pieces.values()) - mixed) == 0                   # the projectors add up to 1
print()

# --- 3. the most general crystal-field Hamiltonian, by Schur's lemma ------------------------------------------
basis = tensym.symmetry_adapted(d, SITE)
print(basis)
M = sp.Matrix(basis.matrix)                    # columns: the adapted orbitals in d's coordinates
G = sp.Matrix(d.gram())
assert sp.simplify(M.T * G * M) == sp.eye(5)   # orthonormal
group = tensym.point_group(SITE)
reps = [sp.simplify(M.T * G * sp.Matrix(d.action(g)) * M) for g in group.generators]
h = sp.symbols("h0:15", real=True)
H = sp.Matrix(5, 5, lambda i, j: h[min(i, j) * 5 - min(i, j) * (min(i, j) - 1) // 2 + abs(i - j)])
eqs = [e for D in reps for e in (H * D - D * H)]
free = sp.solve(eqs, h, dict=True)[0]
H = H.subs(free)
params = sorted(H.free_symbols, key=lambda s: int(str(s)[1:]))
print(f"\nthe crystal-field Hamiltonian commuting with -3m has {len(params)} free parameters:")
sp.pprint(H, use_unicode=False)
# Schur: one number on A1g, a 2x2 symmetric block on the two copies of Eg -> 1 + 3 = 4
assert len(params) == 4
e_a1g, e1, v, e2 = sp.symbols("epsilon_a1g epsilon_1 v epsilon_2", real=True)
# name the parameters by where they sit: the A1g entry, the two Eg copies and their coupling
rename = {H[0, 0]: e_a1g, H[1, 1]: e1, H[1, 3]: v, H[3, 3]: e2}
assert all(k.is_Symbol for k in rename) and set(rename) == set(params)
H = H.subs(rename)
levels = H.eigenvals()
print("\nlevels (multiplicity):")
for lev, mult in sorted(levels.items(), key=lambda t: sp.default_sort_key(t[0])):
    print(f"  {sp.sstr(sp.simplify(lev))}   (x{mult})")
assert sorted(levels.values()) == [1, 2, 2]                              # a1g + two eg doublets
print()

# --- 4. numbers for the invented ion in TR-5 (cm^-1) --------------------------------------------------------------
TR5 = {e_a1g: -4300.0, e1: -3600.0, e2: 6100.0, v: 1150.0}
numeric = sorted(float(sp.re(sp.N(lev.subs(TR5)))) for lev, m in levels.items() for _ in range(m))
gaps = sorted({round(a - numeric[0], 1) for a in numeric})
print("TR-5 (invented) levels, cm^-1:", ", ".join(f"{e:.0f}" for e in numeric))
print(f"RESULT: d levels at the -3m site: a1g + 2 eg; excitations from the lowest level at "
      + ", ".join(f"{g:.0f}" for g in gaps[1:]) + " cm^-1")
