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
           "orientation_record", "finding_text", "finding_record", "fmt"]


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
    lines.append(f"constants{_units(r)}:")
    for c in r.constants:
        lines.append(f"  {c.name} = {fmt(c.value, c.sigma)}")
    nz = [f for f in r.forbidden if f.value != 0.0]
    lines.append(f"forbidden components: {len(r.forbidden)}, non-zero in the data: {len(nz)}")
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
    if r.residual_fraction > 0:
        ax = ", ".join(f"{v:.3f}" for v in r.misorientation_axis)
        lines.append(f"  a rotation of {r.misorientation:.3g} deg about [{ax}] explains "
                     f"{r.rotation_fraction:.3g} of it (first order)")
    return "\n".join(lines)


def check_markdown(r):
    """Markdown report of a CheckReport."""
    out = [f"**{r.data.property.title}** against **{r.group}**: *{r.verdict}*", ""]
    out += [f"- {why}" for why in r.reasons]
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
        "symmetrized": _arr(r.symmetrized),
        "symmetrized_sigma": _arr(r.symmetrized_sigma),
        "residual_fraction": r.residual_fraction,
        "residual_norm": "full-tensor Frobenius",
        "max_deviation": r.max_deviation,
        "chi2": _num(r.chi2),
        "dof": r.dof,
        "p_value": _num(r.p_value),
        "irreps": [{"label": p.label, "dim": p.dim, "multiplicity": p.multiplicity, "fraction": p.fraction,
                    "rotation_like": p.rotation_like} for p in r.irreps],
        "misorientation_deg": r.misorientation,
        "misorientation_axis": _arr(r.misorientation_axis),
        "rotation_fraction": r.rotation_fraction,
        "source": r.data.source,
    }


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
    lines.append(f"  equivalent solutions: {o.n_equivalent}{' (continuous)' if o.continuous else ''}; "
                 f"search: {o.search}")
    return "\n".join(lines)


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
