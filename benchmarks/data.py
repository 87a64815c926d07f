"""Benchmark of the numeric data layer (run: python benchmarks/data.py [--quick]).

Times, in one run and on this machine:

1. batch check: N elastic stiffness tensors (Voigt 6x6, invented trigonal
   crystals rotated slightly and with noise) against -3m in one vectorised
   ``tensym.check_tensors`` call, with and without standard uncertainties;
2. the references, in the same run: a plain per-tensor loop of
   ``tensym.check_tensor`` (the full report of one tensor at a time), and a
   bare per-tensor numpy loop doing only the projection (constants, residual);
3. ``tensym.find_symmetry`` on one elastic tensor: the first call in the
   process (it also derives the 8 symmetry classes of elasticity once, and
   builds the catalog groups and forms it needs) and the steady state.

Prints the rates and the ratios batch/loop, against the targets: at least
100 000 elastic tensors per second checked, find_symmetry on one elastic
tensor under 2 s.  ``--quick`` uses smaller sizes.
"""

import sys
import time

import numpy as np

import tensym
from tensym.data.model import numeric_form


def _stack(n, seed=1):
    rng = np.random.default_rng(seed)
    f = tensym.tensor_form("elastic_stiffness", "-3m")
    base = np.array(f.evaluate([87.0, 7.0, 12.0, -18.0, 107.0, 58.0]))
    rots = tensym.rotation_from_axis_angle([1, 0, 0], 0.2)
    base = tensym.rotate_values(base, rots, "elastic_stiffness")
    noise = rng.normal(size=(n, 6, 6)) * 0.05
    return base + (noise + noise.transpose(0, 2, 1)) / 2


def _best(fn, repeat):
    out = np.inf
    for _ in range(repeat):
        t = time.perf_counter()
        fn()
        out = min(out, time.perf_counter() - t)
    return out


def bench_batch(n, n_loop, repeat):
    stack = _stack(n)
    sigma = np.full(stack.shape, 0.05)
    tensym.check_tensors(stack[:10], "elastic_stiffness", "-3m")  # caches: group, form, projectors
    t_batch = _best(lambda: tensym.check_tensors(stack, "elastic_stiffness", "-3m"), repeat)
    t_sigma = _best(lambda: tensym.check_tensors(stack, "elastic_stiffness", "-3m", sigma=sigma), repeat)

    def loop_reports():
        for i in range(n_loop):
            tensym.check_tensor(stack[i], "elastic_stiffness", "-3m")

    t_loop = _best(loop_reports, 1)
    nf = numeric_form("elastic_stiffness", tensym.point_group("-3m"))
    lay = nf.layout
    rep = lay._voigt_rep

    def loop_numpy():
        for i in range(n_loop):
            x = stack[i].reshape(-1)[rep]
            a = nf.fit @ x
            r = (x - nf.A @ a) * lay.scale
            float(np.sqrt(r @ r)) / float(np.linalg.norm(x * lay.scale))

    t_np = _best(loop_numpy, repeat)
    rate = n / t_batch
    rate_sigma = n / t_sigma
    rate_loop = n_loop / t_loop
    rate_np = n_loop / t_np
    print(f"batch check, {n} elastic tensors vs -3m (Frobenius fit): {t_batch:.3f} s = {rate:,.0f} tensors/s "
          f"(target >= 100,000) {'PASS' if rate >= 1e5 else 'MISS'}")
    print(f"batch check with uncertainties (chi2, p-values):       {t_sigma:.3f} s = {rate_sigma:,.0f} tensors/s")
    print(f"reference, per-tensor loop of check_tensor ({n_loop}):        {rate_loop:,.0f} tensors/s; "
          f"batch/loop = {rate / rate_loop:,.0f}x")
    print(f"reference, bare per-tensor numpy projection loop ({n_loop}): {rate_np:,.0f} tensors/s; "
          f"batch/loop = {rate / rate_np:,.1f}x")
    return rate


def bench_find(repeat):
    rng = np.random.default_rng(3)
    f = tensym.tensor_form("elastic_stiffness", "4/mmm")
    c = np.array(f.evaluate([170.0, 120.0, 90.0, 190.0, 60.0, 40.0]))
    r = tensym.random_rotations(1, seed=5)[0]
    lab = tensym.rotate_values(c, r, "elastic_stiffness") + 0.01 * rng.normal(size=(6, 6))
    lab = (lab + lab.T) / 2
    t = time.perf_counter()
    found = tensym.find_symmetry(lab, "elastic_stiffness")
    cold = time.perf_counter() - t
    warm = _best(lambda: tensym.find_symmetry(lab, "elastic_stiffness"), repeat)
    print(f"find_symmetry, one elastic tensor: first call {cold:.2f} s (includes deriving the 8 classes), "
          f"then {warm:.2f} s per tensor (target < 2 s) {'PASS' if warm < 2.0 else 'MISS'}; "
          f"found: {found.best.name}")
    t = time.perf_counter()
    tensym.orient(lab, "elastic_stiffness", "4/mmm")
    print(f"orient to one group (14 868-point grid + refinement): {time.perf_counter() - t:.2f} s")
    return warm


def main(argv):
    quick = "--quick" in argv
    n = 50_000 if quick else 200_000
    bench_batch(n, 300 if quick else 1000, 2 if quick else 3)
    bench_find(1 if quick else 3)


if __name__ == "__main__":
    main(sys.argv[1:])
