"""Text, Markdown, LaTeX and JSON-ready renderings of the data layer's results.

Every rendering repeats the unit label of the data, the norm of the fit, the
tolerance with its kind, and the verdict.

Examples
--------
>>> import numpy as np
>>> import tensym
>>> r = tensym.check_tensor(np.diag([2.0, 2.0, 3.0]), "dielectric_permittivity", "4/mmm", units="1")
>>> print(r.text().splitlines()[0])
dielectric permittivity epsilon_ij checked against 4/mmm: consistent
"""

import math

import numpy as np
import sympy as sp

__all__ = ["check_text", "check_markdown", "check_latex", "check_record", "orientation_text",
           "orientation_record", "finding_text", "finding_record", "families_text", "batch_summary_text", "fmt"]


def fmt(v, sig=None, digits=6):
    """A number (and its uncertainty) as text: '86.74 +- 0.05'."""
    if v is None:
        return "-"
    if sig is None:
        return f"{v:.{digits}g}"
    return f"{v:.{digits}g} +- {sig:.2g}"


def _units(r):
    return f" [{r.units}]" if r.units else ""


def check_text(r):
    """Plain-text report of a CheckReport."""
    lines = [f"{r.data.property.title} checked against {r.group}: {r.verdict}"]
    if r.setting:
        lines.append(f"  setting: {r.setting}")
    lines.append(f"  units: {r.units or '(not given)'}; fit norm: {r.norm}; source: {r.data.source}")
    for why in r.reasons:
        lines.append(f"  {why}")
    for w in r.warnings:
        lines.append(f"  WARNING: {w}")
    if r.verdict == "empty":
        return "\n".join(lines)
    lines.append(f"constants{_units(r)}:")
    for c in r.constants:
        lines.append(f"  {c.name} = {fmt(c.value, c.sigma)}")
    nz = [f for f in r.forbidden if f.value != 0.0]
    given = "" if not r.not_given else " given"
    lines.append(f"forbidden components{given}: {len(r.forbidden)}, non-zero in the data: {len(nz)}")
    for f in sorted(nz, key=lambda f: -abs(f.value))[:12]:
        extra = "" if f.significance is None else f" ({f.significance:.2g} sigma)"
        lines.append(f"  {f.label} = {fmt(f.value, f.sigma)}{extra}")
    broken = [t for t in r.relations if t.discrepancy != 0.0]
    if r.relations:
        lines.append(f"relations: {len(r.relations)}, not kept exactly: {len(broken)}")
    for t in sorted(broken, key=lambda t: -abs(t.discrepancy))[:12]:
        extra = "" if t.significance is None else f" ({t.significance:.2g} sigma)"
        rel = sp.sstr(t.relation.rhs) if t.relation is not None else "?"
        lines.append(f"  {t.label} = {fmt(t.value)} vs {rel} = {fmt(t.expected)}: "
                     f"off by {fmt(t.discrepancy, t.sigma)}{extra}")
    lines.append(f"residual: {r.residual_fraction:.3g} of the tensor (Frobenius); largest deviation "
                 f"{fmt(r.max_deviation)}{_units(r)}")
    if r.irreps:
        parts = ", ".join(f"{p.label} {p.fraction:.2g}{'*' if p.rotation_like else ''}" for p in r.irreps)
        lines.append(f"  by irrep (* rotation-like): {parts}")
    if r.not_given:
        lines.append("  (no breakdown by irrep or misorientation: they need every component)")
    elif r.residual_fraction > 0:
        ax = ", ".join(f"{v:.3f}" for v in r.misorientation_axis)
        lines.append(f"  a rotation of {r.misorientation:.3g} deg about [{ax}] explains "
                     f"{r.rotation_fraction:.3g} of it (first order)")
    if r.eigenvalues is not None and r.positive_definite:
        lines.append(f"positive definite: yes (eigenvalues {_eig_text(r)}{_units(r)})")
    return "\n".join(lines)


def _eig_text(r):
    return ", ".join(f"{v:.4g}" for v in r.eigenvalues)


def check_markdown(r):
    """Markdown report of a CheckReport."""
    out = [f"**{r.data.property.title}** against **{r.group}**: *{r.verdict}*", ""]
    out += [f"- {why}" for why in r.reasons]
    out += [f"- **warning**: {w}" for w in r.warnings]
    out += [f"- units: {r.units or '(not given)'}; fit norm: {r.norm}", "", "| constant | value | sigma |",
            "|---|---:|---:|"]
    out += [f"| {c.name} | {fmt(c.value)} | {fmt(c.sigma)} |" for c in r.constants]
    nz = [f for f in r.forbidden if f.value != 0.0]
    if nz:
        out += ["", "| forbidden | value | sigma | size/sigma |", "|---|---:|---:|---:|"]
        out += [f"| {f.label} | {fmt(f.value)} | {fmt(f.sigma)} | {fmt(f.significance, digits=3)} |" for f in nz]
    broken = [t for t in r.relations if t.discrepancy != 0.0]
    if broken:
        out += ["", "| relation | value | expected | discrepancy | sigma |", "|---|---:|---:|---:|---:|"]
        out += [f"| {sp.sstr(t.relation)} | {fmt(t.value)} | {fmt(t.expected)} | {fmt(t.discrepancy)} | "
                f"{fmt(t.sigma)} |" for t in broken]
    out += ["", f"Residual fraction (full-tensor Frobenius norm): {r.residual_fraction:.3g}"]
    return "\n".join(out)


def _tex_num(v, sig=None):
    if v is None:
        return "-"
    s = f"{v:.6g}"
    if "e" in s:
        m, e = s.split("e")
        s = f"{m}\\times 10^{{{int(e)}}}"
    if sig is not None:
        s += f" \\pm {sig:.2g}"
    return s


def _tex_label(label, letter):
    sym = sp.latex(sp.Symbol(letter))
    return f"{sym}_{{{label[len(letter):]}}}"


def check_latex(r, *, standalone=False):
    """LaTeX (amsmath) report: constants, forbidden components, relations, verdict.

    Math-mode content; with ``standalone=True`` a complete document, made by
    the renderer that :mod:`tensym.output` installs in :mod:`tensym.display`
    (a heading with the verdict and units, this content in a display, the
    reasons), so that the data layer never imports the output layer.
    """
    if standalone:
        from tensym.display import show

        return show(r, "latex", standalone=True)
    letter = r.data.property.symbol
    rows = [f"{_tex_label(c.name, letter)} &= {_tex_num(c.value, c.sigma)}" for c in r.constants]
    nz = [f for f in r.forbidden if f.value != 0.0]
    rows += [f"{_tex_label(f.label, letter)} &= {_tex_num(f.value, f.sigma)} \\quad \\text{{(forbidden)}}"
             for f in nz]
    broken = [t for t in r.relations if t.discrepancy != 0.0]
    rows += [f"{_tex_label(t.label, letter)} - \\left({sp.latex(t.relation.rhs)}\\right) &= "
             f"{_tex_num(t.discrepancy, t.sigma)}" for t in broken if t.relation is not None]
    return "\\begin{aligned}\n" + " \\\\\n".join(rows) + "\n\\end{aligned}" if rows else "\\text{no constants}"


def _num(v):
    if v is None:
        return None
    v = float(v)
    return v if math.isfinite(v) else str(v)


def _arr(a):
    return None if a is None else np.asarray(a, dtype=float).tolist()


def check_record(r):
    """JSON-ready dict of a CheckReport (kind 'tensor_check')."""
    return {
        "kind": "tensor_check",
        "property": r.property,
        "group": r.group,
        "setting": r.setting,
        "units": r.units,
        "norm": r.norm,
        "verdict": r.verdict,
        "passes": r.passes,
        "reasons": list(r.reasons),
        "tol": r.tol,
        "tol_kind": r.tol_kind,
        "alpha": r.alpha,
        "constants": [{"name": c.name, "value": c.value, "sigma": _num(c.sigma)} for c in r.constants],
        "constants_covariance": _arr(r.constants_covariance),
        "forbidden": [{"label": f.label, "value": f.value, "sigma": _num(f.sigma),
                       "significance": _num(f.significance)} for f in r.forbidden],
        "relations": [{"label": t.label, "relation": None if t.relation is None else sp.sstr(t.relation.rhs),
                       "value": t.value, "expected": t.expected, "discrepancy": t.discrepancy,
                       "sigma": _num(t.sigma), "significance": _num(t.significance)} for t in r.relations],
        "symmetrized": _nums(r.symmetrized),
        "symmetrized_sigma": _nums(r.symmetrized_sigma),
        "residual": _nums(r.residual),
        "residual_fraction": r.residual_fraction,
        "residual_norm": "full-tensor Frobenius",
        "max_deviation": r.max_deviation,
        "chi2": _num(r.chi2),
        "dof": r.dof,
        "p_value": _num(r.p_value),
        "irreps": [{"label": p.label, "dim": p.dim, "multiplicity": p.multiplicity, "fraction": p.fraction,
                    "rotation_like": p.rotation_like} for p in r.irreps],
        "misorientation_deg": _num(r.misorientation),
        "misorientation_axis": _nums(r.misorientation_axis),
        "rotation_fraction": _num(r.rotation_fraction),
        "n_given": r.n_given,
        "n_components": r.data.n,
        "not_given": list(r.not_given),
        "component_deviation": _num(r.component_deviation),
        "component_tol": r.component_tol,
        "eigenvalues": _nums(r.eigenvalues),
        "positive_definite": r.positive_definite,
        "warnings": list(r.warnings),
        "source": r.data.source,
    }


def _nums(a):
    """A float array as a JSON-ready list, with NaN and inf as strings (JSON has no such numbers)."""
    return None if a is None else [_num(v) if np.ndim(v) == 0 else _nums(v) for v in np.asarray(a, dtype=float)]


def orientation_text(o):
    """Plain-text summary of an Orientation."""
    ax = ", ".join(f"{v:.4f}" for v in o.axis)
    e = ", ".join(f"{v:.3f}" for v in o.euler)
    lines = [f"{o.property} oriented to {o.group}: residual {o.residual_fraction:.3g} "
             f"(was {o.initial_residual_fraction:.3g} in the given frame)",
             f"  rotation (data frame -> standard setting): {o.angle:.3f} deg about [{ax}]",
             f"  Euler z-y-z (alpha, beta, gamma): ({e}) deg",
             "  matrix rows = standard axes in the data frame:"]
    lines += ["    [" + "  ".join(f"{v: .6f}" for v in row) + "]" for row in o.rotation]
    lines.append(f"  equivalent rotations (same constants): {o.n_equivalent}"
                 f"{' and a continuous set' if o.continuous else ''}")
    lines += ["  " + t for t in families_text(o)]
    lines.append(f"  search: {o.search}")
    return "\n".join(lines)


def families_text(o):
    """Lines on the inequivalent solutions of an Orientation (none when the frame is fixed)."""
    if o.free_rotation >= 3:
        return ["nothing is forbidden in this group: every rotation fits as well (the frame is not determined)"]
    if o.free_rotation:
        return ["a continuous family of solutions fits as well: a turn about the axis the form keeps changes the "
                "constants but not the residual, so the data do not fix that angle; a structure (or your "
                "convention) must decide; shown: the solution closest to the given frame"]
    if len(o.families) < 2:
        return []
    out = [f"{len(o.families)} inequivalent families of solutions fit equally well, with different constants: "
           "the data cannot tell them apart; a structure (or your convention) must decide.",
           "the primary one (marked *) is the family of the given frame when the data were given within 5 deg "
           "of a standard setting, else the one with the lexicographically smallest constants in the order "
           f"{', '.join(o.families[0].names)} (tensym's convention):"]
    for i, f in enumerate(o.families):
        consts = ", ".join(f"{nm} = {v:.6g}" for nm, v in zip(f.names, f.constants))
        out.append(f"  {'*' if f.primary else ' '} family {i + 1}: {consts}; {f.angle:.3f} deg")
    return out


def orientation_record(o):
    """JSON-ready dict of an Orientation (kind 'orientation')."""
    return {
        "kind": "orientation",
        "property": o.property,
        "group": o.group,
        "rotation": _arr(o.rotation),
        "axis": _arr(o.axis),
        "angle_deg": o.angle,
        "euler_zyz_deg": list(o.euler),
        "residual_fraction": o.residual_fraction,
        "initial_residual_fraction": o.initial_residual_fraction,
        "n_equivalent": o.n_equivalent,
        "continuous": o.continuous,
        "free_rotation": o.free_rotation,
        "families": [{"rotation": _arr(f.rotation), "angle_deg": f.angle, "primary": f.primary,
                      "constants": {nm: _num(v) for nm, v in zip(f.names, f.constants)},
                      "n_equivalent": f.n_equivalent} for f in o.families],
        "search": o.search,
    }


def finding_text(f):
    """Plain-text summary of a SymmetryFinding."""
    lines = [f"{f.property}: highest symmetry within tol {f.tol:g} (relative, Frobenius): "
             + (f"{f.best.name} ({', '.join(f.best.groups)})" if f.best else "none")]
    if f.note:
        lines.append(f"  {f.note}")
    for c in f.candidates + f.rejected:
        mark = "ok " if c.consistent else "no "
        lines.append(f"  {mark}{c.name:<28} residual {c.residual_fraction:.3g}  "
                     f"({c.n_independent} constants; groups {', '.join(c.groups)})")
    if f.best is not None:
        extra = families_text(f.best.orientation)
        if extra:
            lines.append(f"  frame of the best class ({f.best.representative}):")
            lines += ["    " + t for t in extra]
    return "\n".join(lines)


def finding_record(f):
    """JSON-ready dict of a SymmetryFinding (kind 'symmetry_finding')."""
    def cand(c):
        return {"name": c.name, "groups": list(c.groups), "representative": c.representative,
                "n_independent": c.n_independent, "residual_fraction": c.residual_fraction,
                "consistent": c.consistent, "orientation": orientation_record(c.orientation)}

    return {"kind": "symmetry_finding", "property": f.property, "tol": f.tol,
            "tol_kind": "relative", "best": None if f.best is None else f.best.name, "note": f.note,
            "candidates": [cand(c) for c in f.candidates], "rejected": [cand(c) for c in f.rejected]}


def batch_summary_text(b, worst=5):
    """Summary of a BatchCheck: counts per verdict, the criteria, the worst cases, sanity warnings.

    A stack of 20,000 tensors gives a dozen lines; ``BatchCheck.table()`` has every row.
    """
    n = len(b)
    cnt = b.counts()
    u = f" {b.units}" if b.units else ""
    lines = [f"{n} tensors of {b.property} checked against {b.group} (fit norm {b.norm}; units "
             f"{b.units or '(not given)'})",
             "  " + ", ".join(f"{v}: {c}" for v, c in cnt.items())]
    if b.tol_kind == "relative":
        lines.append(f"  criteria: residual fraction <= {b.tol:g} (relative, full-tensor Frobenius) and every component "
                     f"within {b.component_tol:g} of the largest allowed magnitude"
                     + (f"; p >= {b.alpha:g}" if b.p_value is not None else ""))
    else:
        lines.append(f"  criteria: every component within {b.tol:g}{u} (absolute)"
                     + (f"; p >= {b.alpha:g}" if b.p_value is not None else ""))
    partial = int(np.count_nonzero(b.n_given < b.symmetrized_components.shape[1])) if n else 0
    if partial:
        lines.append(f"  {partial} tensor(s) with components not given: fitted on the given ones only")
    if b.positive_definite is not None:
        bad = np.flatnonzero(~b.positive_definite & (b.verdicts != "empty"))
        if bad.size:
            idx = ", ".join(map(str, bad[:8])) + (", ..." if bad.size > 8 else "")
            lines.append(f"  WARNING: {bad.size} tensor(s) not positive definite (smallest eigenvalue <= 0): {idx}")
    if cnt["empty"]:
        idx = np.flatnonzero(b.verdicts == "empty")
        lines.append(f"  empty (all zero, nothing to check): {', '.join(map(str, idx[:8]))}"
                     f"{', ...' if idx.size > 8 else ''}")
    top = [i for i in b.worst(worst) if b.verdicts[i] != "empty"]
    if top:
        lines.append(f"  largest residuals (of {n}):")
        for i in top:
            cons = ", ".join(f"{nm} = {fmt(v, digits=5)}" for nm, v in zip(b.names[:4], b.constants[i]))
            lines.append(f"    #{i}: {b.verdicts[i]}, residual {b.residual_fraction[i]:.3g}, component deviation "
                         f"{b.component_deviation[i]:.3g}; {cons}{', ...' if len(b.names) > 4 else ''}")
    lines.append("  full table: .table(); one tensor in full: .report(i)")
    return "\n".join(lines)
