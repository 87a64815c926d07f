"""Benchmark of the exact invariant solver (run: python benchmarks/forms.py).

Times, in one run and on this machine:

1. every catalog property for every one of the 32 crystallographic groups;
2. the rank-6 and rank-8 Voigt-symmetric elastic tensors (third- and
   fourth-order elastic constants) for all 32 groups;
3. the float floor: a float64 numpy null space (SVD) of the same invariant
   spaces, built on the same reduced coordinates from the same generators;
4. the naive textbook route on two groups: the Reynolds average of
   R x R x R x R over the whole group as a full 81 x 81 sympy matrix, then its
   exact row reduction.

5. frames: the catalog (ranks 1-4 and rank 6) for all 32 groups re-oriented by
   the exact rational rotation with denominators 97 and 1261 (a Cayley
   transform) and by an irrational one (axis (1, 2, 3)/sqrt(14), 60 degrees),
   against the same in the standard settings; target: within 2x of standard
   and under 5 s for the whole set.

Prints totals and the ratios exact/float and naive/exact, against targets:
catalog for all 32 groups < 2 s; rank 8 for all 32 groups < 5 s; exact within
3x of the float floor at ranks 6 and 8; naive/exact >= 1000 at rank 4.
Group construction and the per-spec orbit enumeration are done once before
timing (they are cached in normal use too); the solver cache is cleared
before each timed pass.  ``--quick`` skips the naive route.
"""

import sys
import time

import numpy as np
import sympy as sp

from tensym.groups.catalog import catalog_group, default_setting, point_groups
from tensym.tensors import form as form_mod
from tensym.tensors.catalog import get_property, property_names
from tensym.tensors.form import _labelling, tensor_form
from tensym.tensors.kernels import float_action


def _groups():
    return [catalog_group(default_setting(s)) for s in point_groups()]


def _clear():
    form_mod._solve_cached.cache_clear()


def time_exact(props, groups, repeat=3, clear=None):
    best = np.inf
    for _ in range(repeat):
        (clear or _clear)()
        t = time.perf_counter()
        for p in props:
            for g in groups:
                tensor_form(p, g)
        best = min(best, time.perf_counter() - t)
    return best


def _frames():
    from tensym.groups.recognition import rotation_about

    R = sp.Rational
    K = sp.Matrix([[0, -R(1, 3), R(1, 5)], [R(1, 3), 0, -R(1, 2)], [-R(1, 5), R(1, 2), 0]])
    rational = sp.ImmutableMatrix((sp.eye(3) - K).inv() * (sp.eye(3) + K))
    return (("rational, denominators 97 and 1261", rational),
            ("irrational, (1,2,3)/sqrt(14) by 60 degrees", rotation_about([1, 2, 3], sp.pi / 3)))


def time_frames(props, groups):
    """(standard, [(label, time)]) for the catalog in the standard and two re-oriented settings."""
    from tensym.groups.recognition import reorient
    from tensym.tensors import solver

    def clear():
        _clear()
        solver._ACTIONS.clear()
        solver._STANDARD.clear()
        solver._FRAMES.clear()

    def run(gs):
        return time_exact(props, gs, repeat=2, clear=clear)

    std = run(groups)
    out = []
    for label, q in _frames():
        turned = [reorient(g, q) for g in groups]
        out.append((label, run(turned)))
    return std, out


def float_nullity(prop, group):
    """float64 null space of the stacked invariance conditions on the reduced space."""
    spec = prop.spec
    orb = spec.orbits
    _, factors = _labelling(spec, prop.voigt_groups, prop.halved)
    F = np.diag([float(f) for f in factors])
    n = len(orb.reps)
    rows = []
    for g in group.generators:
        M = float_action(orb, g.numeric) * spec.parity(g)
        rows.append((M - np.eye(n)) @ F)
    A = np.vstack(rows) if rows else np.zeros((1, n))
    s = np.linalg.svd(A, compute_uv=False)
    return n - int(np.sum(s > 1e-9 * max(1.0, s[0] if len(s) else 1.0)))


def time_float(props, groups, repeat=3):
    best = np.inf
    for _ in range(repeat):
        t = time.perf_counter()
        for p in props:
            for g in groups:
                float_nullity(p, g)
        best = min(best, time.perf_counter() - t)
    return best


def naive(group):
    """Reynolds average of R^(x)4 over the whole group as an 81 x 81 sympy matrix, then rref."""
    t = time.perf_counter()
    P = sp.zeros(81, 81)
    for op in group.operations:
        R = sp.Matrix(op.matrix)
        K = sp.kronecker_product(R, R, R, R)
        P += K
    P = (P / group.order).applyfunc(sp.nsimplify)
    P.rref()
    return time.perf_counter() - t


def main(argv):
    quick = "--quick" in argv
    groups = _groups()
    props = [get_property(n) for n in property_names()]
    for p in props:  # warm the per-spec orbit and label caches
        _labelling(p.spec, p.voigt_groups, p.halved)
    catalog_props = [p for p in props if p.spec.rank <= 4]
    t_cat = time_exact(catalog_props + [get_property("third_order_elastic")], groups)
    t_all = time_exact(props, groups, repeat=1)
    print(f"catalog (ranks 1-4 and rank 6, {len(catalog_props) + 1} properties) x 32 groups: {t_cat:.3f} s (target < 2 s)")
    print(f"whole catalog incl. rank 8 ({len(props)} properties) x 32 groups: {t_all:.3f} s")
    for name, target in (("third_order_elastic", None), ("fourth_order_elastic", 5.0)):
        p = [get_property(name)]
        te = time_exact(p, groups)
        tf = time_float(p, groups)
        msg = f" (target < {target:.0f} s)" if target else ""
        print(f"rank {p[0].spec.rank} ({name}), 32 groups: exact {te:.3f} s{msg}, float floor {tf:.3f} s, "
              f"exact/float = {te / tf:.2f} (target <= 3)")
    p4 = [get_property("elastic_stiffness")]
    te4 = time_exact(p4, groups)
    print(f"rank 4 (elastic_stiffness), 32 groups: exact {te4:.4f} s")
    cat = catalog_props + [get_property("third_order_elastic")]
    std, turned = time_frames(cat, groups)
    total = sum(t for _, t in turned)
    for label, t in turned:
        print(f"frames: catalog x 32 groups re-oriented ({label}): {t:.3f} s; standard {std:.3f} s; "
              f"ratio {t / std:.1f} (target <= 2)")
    print(f"frames: both re-oriented sets {total:.3f} s (target < 5 s)")
    if not quick:
        for sym in ("m-3m", "6/mmm"):
            g = catalog_group(default_setting(sym))
            tn = naive(g)
            te = time_exact(p4, [g], repeat=5)
            print(f"naive Reynolds route, {sym}: {tn:.2f} s; exact solver {te * 1e3:.2f} ms; naive/exact = {tn / te:.0f} (target >= 1000)")


if __name__ == "__main__":
    main(sys.argv[1:])
