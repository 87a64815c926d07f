"""Timing of the representation layer (run: python benchmarks/reps.py).

Times, in one run and on this machine:

1. exact character tables of the 32 crystallographic groups, cold (caches cleared);
2. the same for I and Ih;
3. the float floor of step 1: the numeric class-algebra eigenproblem alone
   (what any numeric character-table code must do at least);
4. explicit irrep matrices of every irrep of the 32 groups;
5. decompositions of the elastic tensor and of D^0 .. D^4 for the 32 groups;
6. the naive projection route on one group: the full character projector of
   the elastic space built as 48 explicit 21 x 21 sympy matrices, against the
   cached exact projector of tensym.project on polynomials.

Prints the totals, the ratio exact/float (measured about 60x on the 2-core
reference machine: the exact pinning, labelling and exact orthogonality
checks cost far more than the float eigenproblem, which only locates the
integers) and checks the target that matters: every table, icosahedral ones
included, in a few seconds on first call (measured about 2 s), never minutes.
"""

import time

import sympy as sp

import tensym
from tensym.groups import point_group, point_groups
from tensym.reps import characters, table as table_mod
from tensym.reps.spaces import harmonics


def _clock(f):
    t = time.perf_counter()
    out = f()
    return time.perf_counter() - t, out


def main():
    groups = [point_group(s) for s in point_groups()]
    ico = [point_group(s) for s in ("532", "-5-3m")]
    for g in groups + ico:
        g.multiplication_table  # Cayley tables are the group layer's cost, built once
        g.classes

    table_mod._CACHE.clear()
    t_tables, _ = _clock(lambda: [table_mod.finite_table(g) for g in groups])
    t_ico, _ = _clock(lambda: [table_mod.finite_table(g) for g in ico])
    data = [characters.class_data(g) for g in groups]
    t_float, _ = _clock(lambda: [characters._numeric_characters(d) for d in data])

    def all_matrices():
        for g in groups:
            t = table_mod.finite_table(g)
            for irr in t.irreps + t.real_irreps:
                t.matrices(irr.label)

    t_mats, _ = _clock(all_matrices)
    el = tensym.get_property("elastic_stiffness")

    def decompositions():
        for g in groups:
            tensym.decompose(el, g)
            for l in range(5):
                tensym.decompose(harmonics(l), g)

    t_dec, _ = _clock(decompositions)
    print(f"character tables, 32 groups (cold) : {t_tables:7.3f} s")
    print(f"character tables, I and Ih         : {t_ico:7.3f} s")
    print(f"float floor (eigenproblem only)    : {t_float:7.3f} s   exact/float = {t_tables / t_float:6.1f}")
    print(f"irrep matrices, 32 groups          : {t_mats:7.3f} s")
    print(f"decompositions (elastic, D0..D4)   : {t_dec:7.3f} s")

    oh = point_group("m-3m")
    space = el.spec.as_space()

    def naive():
        t = tensym.character_table(oh)
        chi = {m: c for cl, c in zip(t.classes, t.irrep("T2g").characters) for m in cl.indices}
        P = sp.zeros(space.dim)
        for i, op in enumerate(oh.operations):
            P += chi[i] * sp.Matrix(space.action(op))
        return P * sp.Rational(3, oh.order)

    t_naive, _ = _clock(naive)
    x, y, z = sp.symbols("x y z")
    tensym.project(x**2 * y * z, oh, "T2g")
    t_fast, _ = _clock(lambda: [tensym.project(x**2 * y * z + k * x**4, oh, "T2g") for k in range(20)])
    print(f"naive 21x21 projector over Oh      : {t_naive:7.3f} s")
    print(f"20 cached polynomial projections   : {t_fast:7.3f} s   naive/cached-one = {20 * t_naive / t_fast:8.1f}")
    ok = t_tables + t_ico < 10
    print("targets:", "all tables in seconds" if ok else "TABLES TOO SLOW")


if __name__ == "__main__":
    main()
