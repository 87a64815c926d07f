"""Benchmark of batch evaluation of a reduced form (run: python benchmarks/session.py).

Evaluates the hexagonal stiffness form for N = 100,000 sets of constants at
once (one (N, 5) array) against a per-set loop of ``form.evaluate`` timed on
2,000 sets and scaled to N, in the same run.  Target: batch at least 50x
faster than the loop.
"""

import time

import numpy as np

import tensym


def main():
    f = tensym.tensor_form("elastic_stiffness", "6mm")
    n = 100_000
    X = np.random.default_rng(1).uniform(50.0, 300.0, size=(n, f.n_independent))
    f.evaluate(X[:2])  # warm the basis caches
    best = np.inf
    for _ in range(3):
        t = time.perf_counter()
        f.evaluate(X)
        best = min(best, time.perf_counter() - t)
    m = 2000
    t = time.perf_counter()
    for x in X[:m]:
        f.evaluate(x)
    loop = (time.perf_counter() - t) * n / m
    print(f"batch evaluate, N = {n}: {best:.3f} s; per-set loop (scaled from {m}): {loop:.2f} s; "
          f"loop/batch = {loop / best:.0f} (target >= 50)")


if __name__ == "__main__":
    main()
