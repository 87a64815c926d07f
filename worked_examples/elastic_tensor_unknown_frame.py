"""A computed elastic tensor in an unknown frame: check it, find its frame and its symmetry class.

Scenario (invented material): a first-principles run on the hexagonal phase
"HX-9" gives a 6x6 stiffness matrix, but in the axes of the simulation cell,
which are turned against the crystal axes, and with a little numerical noise.
Against 6/mmm in the given frame the tensor fails; the symmetry search finds its
class without knowing the frame; the orientation search finds the rotation to the
standard setting (6-fold along z); there the check passes and gives the five
hexagonal constants, with c66 = (c11 - c12)/2 kept to the noise level.

Run:  python worked_examples/elastic_tensor_unknown_frame.py
"""

import os
import tempfile

import numpy as np

import tensym

# --- the invented "computed" data --------------------------------------------------------------------------
HX9 = {"c11": 231.0, "c12": 97.0, "c13": 74.0, "c33": 262.0, "c44": 58.0}      # GPa, crystal axes
form = tensym.tensor_form("elastic_stiffness", "6/mmm")
c_crystal = form.evaluate(HX9)
cell = tensym.rotation_from_axis_angle([0.3, -0.5, 0.8], 37.0)                  # cell axes vs crystal axes
c_cell = tensym.rotate_values(c_crystal, cell, "elastic_stiffness")
rng = np.random.default_rng(20240601)
noise = rng.normal(scale=0.05, size=(6, 6))
c_cell = c_cell + (noise + noise.T) / 2                                            # symmetric numerical noise
path = os.path.join(tempfile.mkdtemp(), "hx9_stiffness.csv")
tensym.write_tensor(tensym.tensor_data(c_cell, "elastic_stiffness", units="GPa", source="HX-9 run (invented)"),
                    path)
data = tensym.read_tensor(path)
print(f"data file: {os.path.basename(path)}  (the same check from a shell: tensym check FILE 6/mmm)")
print()

# --- 1. check in the given frame -------------------------------------------------------------------------------
first = tensym.check_tensor(data, group="6/mmm")
print(first.text().splitlines()[0])
print("  " + first.reasons[0])
assert not first.passes
print()

# --- 2. the symmetry class, in any frame -----------------------------------------------------------------------
found = tensym.find_symmetry(data, tol=0.002)
print(found)
assert found.best is not None and found.best.name == "transversely isotropic"
assert "6/mmm" in found.best.groups
print()

# --- 3. the frame: rotation into the standard setting of 6/mmm --------------------------------------------------
frame = tensym.orient(data, group="6/mmm")
print(frame)
# the found rotation undoes the cell rotation up to the symmetry of the crystal
assert frame.misorientation_to(np.asarray(cell).T) < 0.5
print()

# --- 4. the check in the crystal frame --------------------------------------------------------------------------------
final = frame.check()
print(final)
assert final.passes
fitted = {k.name: k.value for k in final.constants}
worst = max(abs(fitted[k] - v) for k, v in HX9.items())
tie = [t for t in final.relations if t.label == "c66"][0]
print()
print("fitted vs the values the run was made from (GPa):",
      ", ".join(f"{k} {fitted[k]:.2f}/{v:.0f}" for k, v in HX9.items()))
assert worst < 0.2 and abs(tie.discrepancy) < 0.2
print(f"RESULT: HX-9 is transversely isotropic (6/mmm class); its cell is turned by {frame.angle:.2f} deg; "
      f"constants recovered to {worst:.2f} GPa, c66 - (c11 - c12)/2 = {tie.discrepancy:+.3f} GPa")
