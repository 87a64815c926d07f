"""Timing of the group layer: catalog build, exact closure against a float floor, recognition.

Run ``python benchmarks/groups.py``.  Prints the totals and the ratio of the exact
closure (exact matrices for every element) to a float64-only closure of the same
generators (the floor: what any numeric code must do at least).  Target on the
2-core reference machine: all 47 catalog settings built and closed in well
under 2 s the first time, exact closure within 20x of the float floor
(measured: about 0.1-0.5 s for all 47 settings, ratio about 15, depending on load).
"""

import time

import numpy as np

__all__ = []


def _float_closure(gens):
    mats = [np.eye(3)]
    keys = {tuple(np.rint(np.eye(3).ravel() * 1e8).astype(int))}
    frontier = [np.eye(3)]
    while frontier:
        nxt = []
        for m in frontier:
            for g in gens:
                p = g @ m
                k = tuple(np.rint(p.ravel() * 1e8).astype(int))
                if k not in keys:
                    keys.add(k)
                    mats.append(p)
                    nxt.append(p)
        frontier = nxt
    return mats


def main():
    t0 = time.perf_counter()
    from tensym.groups import point_groups, reorient, rotation_from_axes, group_from_generators
    from tensym.groups.catalog import catalog_group

    t1 = time.perf_counter()
    symbols = point_groups(which="all")
    groups = [catalog_group(s) for s in symbols]
    t2 = time.perf_counter()
    for g in groups:
        g.operations
    t3 = time.perf_counter()
    gens = [[op.numeric for op in g.generators] for g in groups]
    t4 = time.perf_counter()
    for _ in range(5):
        for gs in gens:
            _float_closure(gs)
    t5 = time.perf_counter()
    q = rotation_from_axes(new_x=[1, -1, 0], new_z=[1, 1, 1])
    for s in point_groups():
        group_from_generators(reorient(s, q).generators)
    t6 = time.perf_counter()
    exact = t3 - t2
    floor = (t5 - t4) / 5
    print(f"import tensym.groups        {t1 - t0:8.3f} s")
    print(f"build {len(symbols)} settings (gens)   {t2 - t1:8.3f} s")
    print(f"exact closure, all          {exact:8.3f} s")
    print(f"float64 closure floor       {floor:8.3f} s")
    print(f"ratio exact/float           {exact / floor:8.1f}")
    print(f"re-orient + recognise x32   {t6 - t5:8.3f} s")


if __name__ == "__main__":
    main()
