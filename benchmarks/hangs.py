"""Budgets of the requests that used to hang (issue 11).

Run: python benchmarks/hangs.py [bases] [continuous] [ranks] [--skip-old]
(all three parts by default; --skip-old leaves out the slow reference of part 1).

Every figure is printed with a ratio against a reference computed in the same
run on the same machine, so that a slower or busier machine scales both:

1. symmetry-adapted bases (``split ... --basis``): D6h on degree-8
   polynomials, Ih on l = 6, Oh on l = 10.  Reference: the whole-group
   projector path the library used before (kept as
   ``tensym.testing.brute_force_partners``), which also checks that both
   give the same partner coordinates.  Budget: each case in a few seconds,
   at least 10x faster than the old path (measured 20x to 70x).
2. continuous groups up to weight 1000 (``characters O(3) --up-to 1000``,
   ``correlate O(3) m-3m --up-to 1000``): the exact table against the same
   correlation rows from the float closed form sin((l + 1/2) t)/sin(t/2)
   (reference).  Budget: about a second each (they took about a minute).
3. high ranks without index symmetry (rank 8 to 10) in the triclinic class 1,
   the cubic class m-3m, the hexagonal class 6mm and the trigonal class 3, each in a fresh
   process with an address-space limit of 8 GiB: time, peak memory and the
   outcome (a form, or MemoryLimitError with the estimate).  Reference: the
   rank-8 triclinic form.  Budget: a result within 3-4 GiB, or a refusal in
   about a second; never a 26 GiB allocation.
"""

import json
import math
import subprocess
import sys
import time

import numpy as np
import sympy as sp

import tensym
from tensym.reps.table import finite_table
from tensym.testing import brute_force_partners


def _clock(f):
    t = time.perf_counter()
    out = f()
    return time.perf_counter() - t, out


def bases(skip_old):
    print("1. symmetry-adapted bases (split --basis)")
    cases = [("6/mmm", tensym.polynomials(8), "D6h, degree 8 (56 s in the issue)"),
             ("Ih", tensym.harmonics(6), "Ih, l = 6 (19 s in the issue)"),
             ("m-3m", tensym.harmonics(10), "Oh, l = 10 (6 s in the issue)")]
    for group, space, words in cases:
        finite_table(tensym.point_group(group))  # the character table is not part of the budget
        t_new, b = _clock(lambda: tensym.symmetry_adapted(space, group))
        line = f"   {words:36s} new {t_new:6.2f} s"
        if not skip_old:
            t_old, old = _clock(lambda: brute_force_partners(space, group))
            same = [(s.irrep, s.copy, tuple(s.coordinates)) for s in b.sets] == old
            line += f"   old path {t_old:6.1f} s   old/new {t_old / t_new:5.1f}x   identical: {same}"
        print(line)


def _float_rows(G, H, up_to):
    """The O(3) -> H correlation rows from the float closed form (reference work)."""
    th = finite_table(H)
    reps = [c.representative for c in th.classes]
    angles, dets = [], []
    for op in reps:
        R = np.array(op.numeric, dtype=float)
        d = round(float(np.linalg.det(R)))
        angles.append(math.acos(max(-1.0, min(1.0, (np.trace(d * R) - 1) / 2))))
        dets.append(d)
    chars = np.array([[complex(sp.N(x)) for x in h.characters] for h in th.real_irreps])
    sizes = np.array([c.size for c in th.classes])
    rows = []
    for par in (1, -1):
        for l in range(up_to + 1):
            chi = np.array([(2 * l + 1 if t < 1e-9 else math.sin((l + 0.5) * t) / math.sin(t / 2))
                            * (par if d < 0 else 1) for t, d in zip(angles, dets)])
            rows.append(np.rint(((chars.conj() * chi * sizes).sum(axis=1) / th.order).real))
    return rows


def continuous():
    print("2. continuous groups up to weight 1000")
    G = tensym.point_group("O(3)")
    t_ref, _ = _clock(lambda: _float_rows(G, tensym.point_group("m-3m"), 1000))
    t_tab, _ = _clock(lambda: str(tensym.character_table("O(3)", up_to=1000)))
    t_cor, _ = _clock(lambda: tensym.correlate("O(3)", "m-3m", up_to=1000))
    t_ico, _ = _clock(lambda: tensym.correlate("O(3)", "Ih", up_to=1000))
    t_ax, _ = _clock(lambda: tensym.correlate("Dinfh", "6/mmm", up_to=1000))
    print(f"   reference: float closed-form rows O(3) -> m-3m     {t_ref:6.2f} s")
    for words, t in (("characters O(3) --up-to 1000 (printed)", t_tab), ("correlate O(3) m-3m --up-to 1000", t_cor),
                     ("correlate O(3) Ih --up-to 1000", t_ico), ("correlate Dinfh 6/mmm --up-to 1000", t_ax)):
        print(f"   {words:40s} {t:6.2f} s   ratio to reference {t / t_ref:6.1f}")


_RANK_SCRIPT = r"""
import json, resource, sys, time
resource.setrlimit(resource.RLIMIT_AS, (8 * 2**30, 8 * 2**30))
import tensym
from tensym.tensors.spec import TensorSpec
rank, group = int(sys.argv[1]), sys.argv[2]
t = time.perf_counter()
try:
    f = tensym.tensor_form(TensorSpec(rank), group)
    f.tensor
    out = f"form with {f.n_independent} constants"
except MemoryError as e:
    out = f"{type(e).__name__}: {str(e)[:110]}"
peak = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 2**20
print(json.dumps({"time": time.perf_counter() - t, "peak": peak, "out": out}))
"""


def _rank_case(rank, group):
    p = subprocess.run([sys.executable, "-c", _RANK_SCRIPT, str(rank), group], capture_output=True, text=True,
                       timeout=900)
    if p.returncode != 0 or not p.stdout.strip():
        return {"time": float("nan"), "peak": float("nan"), "out": "crashed: " + p.stderr.strip()[-110:]}
    return json.loads(p.stdout.strip().splitlines()[-1])


def ranks():
    print("3. high ranks without index symmetry (fresh process each, 8 GiB address limit)")
    _rank_case(8, "1")  # warm the file cache
    ref = _rank_case(8, "1")
    print(f"   reference: rank 8 in 1: {ref['time']:.2f} s, {ref['peak']:.2f} GiB peak")
    for rank in (8, 9, 10):
        for group in ("1", "m-3m", "6mm", "3"):
            r = _rank_case(rank, group)
            print(f"   rank {rank:2d} {group:6s} {r['time']:7.2f} s ({r['time'] / ref['time']:6.1f}x)  "
                  f"peak {r['peak']:5.2f} GiB  {r['out']}")


def main():
    only = [a for a in sys.argv[1:] if not a.startswith("--")]
    if not only or "bases" in only:
        bases("--skip-old" in sys.argv)
    if not only or "continuous" in only:
        continuous()
    if not only or "ranks" in only:
        ranks()


if __name__ == "__main__":
    main()
