"""Correlation (subduction) tables: how the irreps of a group split in a subgroup.

The subgroup is given in the group's own frame: its operations must be
operations of the group (e.g. ``reorient("3m", Q)`` with Q taking z to [111]
inside m-3m).  When a symbol is given whose standard setting is not a subset
of the group, the subgroups of that type inside the group are searched; if
they fall into several inequivalent embeddings (not conjugate inside the
group) the call asks for an explicit orientation.

Examples
--------
>>> print(correlate("m-3m", "4/mmm")["Eg"])
A1g + B1g
"""

from dataclasses import dataclass
import math

import sympy as sp

from tensym.errors import InvalidArgumentError, RepresentationError, UnknownIrrepError
from tensym.reps.inputs import as_group_arg

__all__ = ["CorrelationTable", "correlate"]


@dataclass(frozen=True)
class CorrelationTable:
    """The splitting of each irrep of a group into irreps of a subgroup.

    Attributes
    ----------
    group : str
        Symbol of the group.
    subgroup : str
        Symbol of the subgroup (with its orientation in words when re-oriented).
    labels : tuple of str
        Irreps of the group (rows), real forms unless ``real=False`` was asked.
    splittings : tuple of Decomposition
        The decomposition of each row into subgroup irreps.

    Examples
    --------
    >>> t = correlate("O(3)", "m-3m", up_to=2)
    >>> t.labels[:3], str(t["D2g"])
    (('D0g', 'D1g', 'D2g'), 'Eg + T2g')
    """

    group: str
    subgroup: str
    labels: tuple
    splittings: tuple
    latex_labels: tuple = ()

    def __getitem__(self, label):
        for lab, d in zip(self.labels, self.splittings):
            if lab == label:
                return d
        from tensym.reps.table import _normalise_label

        key = _normalise_label(str(label))
        for lab, d in zip(self.labels, self.splittings):
            if _normalise_label(lab) == key:
                return d
        import difflib

        near = difflib.get_close_matches(str(label), list(self.labels), n=3, cutoff=0.3)
        raise UnknownIrrepError(f"{self.group} has no row {label!r} in this table"
                                + (f"; nearest: {', '.join(near)}" if near else ""))

    def as_dict(self):
        """{label: str(splitting)}."""
        return {lab: str(d) for lab, d in zip(self.labels, self.splittings)}

    def __str__(self):
        w = max(len(l) for l in self.labels) if self.labels else 0
        head = f"{self.group} -> {self.subgroup}"
        lines = [head, "-" * len(head)]
        for lab, d in zip(self.labels, self.splittings):
            lines.append(f"{lab.ljust(w)}  {d}")
        return "\n".join(lines)

    def latex(self):
        """LaTeX tabular: group irreps and their splitting."""
        lines = ["\\begin{tabular}{ll}", "\\hline", f"{self.group} & {self.subgroup} \\\\", "\\hline"]
        for lab, tex, d in zip(self.labels, self.latex_labels or self.labels, self.splittings):
            lines.append(f"${tex}$ & ${d.latex()}$ \\\\")
        lines += ["\\hline", "\\end{tabular}"]
        return "\n".join(lines)

    def _repr_latex_(self):
        from tensym.display import show  # notebook display: the math-mode array that tensym.output installs

        return "$$" + show(self, "latex") + "$$"

    def __repr__(self):
        return f"<CorrelationTable {self.group} -> {self.subgroup}: {len(self.labels)} rows>"


def _name(g):
    n = g.names
    base = n.hm or n.schoenflies or repr(g)
    if n.rotation is not None:
        return f"{base} (re-oriented)"
    return base


def correlate(group, subgroup, *, up_to=4, real=True):
    """The correlation table from a group to a subgroup.

    Parameters
    ----------
    group : PointGroup, ContinuousGroup or str
        Finite group, or a continuous group (SO(3), O(3), C∞v, D∞h, ...).
    subgroup : PointGroup, ContinuousGroup or str
        A subgroup in the same frame (see the module docstring).
    up_to : int, keyword-only
        For a continuous ``group``: rows up to this l (SO(3), O(3)) or |m|,
        at most ``tensym.reps.continuous.MAX_UP_TO`` (1000).  Each row costs
        O(classes) exact operations (characters are periodic in the weight
        at operations of finite order).
    real : bool, keyword-only
        Real forms of complex pairs (default) or their members.

    Returns
    -------
    CorrelationTable

    Raises
    ------
    RepresentationError
        If ``subgroup`` is not a subgroup of ``group`` in this frame, or a
        symbol fits several inequivalent embeddings.
    InvalidArgumentError
        For a continuous subgroup of a group other than SO(3), O(3).
    InvalidOptionError
        For ``up_to`` that is not a whole number from 0 to MAX_UP_TO.

    Examples
    --------
    >>> from tensym.groups import reorient, rotation_from_axes
    >>> c3v = reorient("3m", rotation_from_axes(new_z=[1, 1, 1], new_x=[1, -1, 0]))
    >>> print(correlate("m-3m", c3v)["T2g"])
    A1 + E
    >>> print(correlate("Dinfh", "6/mmm", up_to=3)["Φu"])
    B1u + B2u
    """
    G = as_group_arg(group, "group")
    from tensym.reps.continuous import check_up_to

    up_to = check_up_to(up_to)
    H = _subgroup_in(G, subgroup)
    from tensym.reps.decompose import decomposition_from
    from tensym.reps.reduction import multiplicities

    if getattr(H, "is_continuous", False):
        return _continuous_sub(G, H, up_to, real)
    from tensym.reps.table import finite_table

    th = finite_table(H)
    reps = [c.representative for c in th.classes]
    rows, labels, tex = [], [], []
    if getattr(G, "is_continuous", False):
        from tensym.reps.continuous import continuous_table

        ct = continuous_table(G, up_to)
        pool = ct.real_irreps if real else ct.irreps
        for irr, mult in zip(pool, _continuous_rows(G, th, pool, real)):
            rows.append(decomposition_from(th, mult, real))
            labels.append(irr.label)
            tex.append(irr.latex)
    else:
        tg = finite_table(G)
        pool = tg.real_irreps if real else tg.irreps
        for irr in pool:
            pos = {}
            for c, ch in zip(tg.classes, irr.characters):
                for m in c.indices:
                    pos[m] = ch
            chars = tuple(pos[G.index(op)] for op in reps)
            rows.append(decomposition_from(th, multiplicities(th, chars, real=real and irr.is_real), real))
            labels.append(irr.label)
            tex.append(irr.latex)
    return CorrelationTable(_name(G), _name(H), tuple(labels), tuple(rows), tuple(tex))


def _realify(v):
    return sp.nsimplify(sp.expand(v)) if not v.is_Rational else v


def _continuous_rows(G, th, pool, real):
    """Multiplicities (label -> int) of each continuous irrep of ``pool`` restricted to the finite group of ``th``.

    The characters at an operation whose proper part has finite order n are
    periodic in the weight w (l or |m|) with period n, except at operations
    whose proper part is the identity (E, i), where D^l has 2l + 1 and an
    axial irrep its fixed dimension.  With N the least common multiple of the
    periods, chi_(w + N) - chi_w is therefore the same vector for every
    w >= 1 of one family (same parity and sign), and by linearity of the
    reduction formula so is mult_(w + N) - mult_w.  The rows up to weight 2N
    are reduced exactly; a higher weight w = r + k N with N < r <= 2N is
    mult_r + k (mult_r - mult_(r - N)), checked against the dimension.  When
    a period cannot be proven (an operation of unknown or infinite order), every
    row is reduced directly.
    """
    from tensym.groups.operations import Operation
    from tensym.reps.continuous import _period, _std, continuous_character
    from tensym.reps.reduction import multiplicities

    reps = [c.representative for c in th.classes]
    periods = []
    for op in reps:
        g = _std(G, op)
        proper = g if g.det == 1 else Operation(sp.ImmutableMatrix(-g.matrix))
        periods.append(_period(proper))
    N = math.lcm(*[n for n in periods if n > 1]) if all(periods) else 0

    def direct(irr):
        chars = tuple(_realify(continuous_character(G, irr, op)) for op in reps)
        return multiplicities(th, chars, real=real)

    known = {}  # (family, weight) -> multiplicities
    out = []
    dims = {i.label: i.dim for i in (th.real_irreps if real else th.irreps)}
    for irr in pool:
        family = (irr.parity, irr.sign, irr.is_real)
        w = irr.m
        if not N or w <= 2 * N:
            mult = direct(irr)
        else:
            r = N + 1 + (w - N - 1) % N
            k = (w - r) // N
            base, prev = known[(family, r)], known[(family, r - N)]
            mult = {lab: base[lab] + k * (base[lab] - prev[lab]) for lab in base}
            if any(v < 0 for v in mult.values()) or sum(v * dims[lab] for lab, v in mult.items()) != irr.dim:
                mult = direct(irr)  # pragma: no cover - the extrapolation is exact
        if w <= 2 * N:
            known[(family, w)] = mult
        out.append(mult)
    return out


def _continuous_sub(G, H, up_to, real):
    from tensym.reps.continuous import _kind, axial_restriction, continuous_table

    core, ext = _kind(G)
    if core != "SO3":
        raise InvalidArgumentError(
            f"correlation from {G.names.hm} to the continuous group {H.names.hm} is supported only from SO(3) and O(3)")
    ct = continuous_table(G, up_to)
    labels, rows, tex = [], [], []
    for irr in ct.real_irreps:
        par = irr.parity or ("g" if irr.m % 2 == 0 else "u")
        rows.append(axial_restriction(H, irr.m, 1 if par == "g" else -1, real=real))
        labels.append(irr.label)
        tex.append(irr.latex)
    return CorrelationTable(_name(G), _name(H), tuple(labels), tuple(rows), tuple(tex))


def _is_subset(G, H):
    if getattr(G, "is_continuous", False):
        if getattr(H, "is_continuous", False):
            return _continuous_in(G, H)
        from tensym.reps.continuous import continuous_character, _make_irrep, _kind

        core, ext = _kind(G)
        probe = _make_irrep(core, ext, 1, "g" if ext == "i" else "", 0)
        try:
            for op in H.operations:
                continuous_character(G, probe, op)
        except RepresentationError:
            return False
        return True
    if getattr(H, "is_continuous", False):
        return False
    return all(op in G for op in H.operations)


def _continuous_in(G, H):
    from tensym.reps.continuous import _kind

    core, _ = _kind(G)
    if core != "SO3":
        return False
    if G.names.hm == "SO(3)":
        return H.is_enantiomorphic
    return True


def _subgroup_in(G, sub):
    H = as_group_arg(sub, "subgroup")
    if _is_subset(G, H):
        return H
    if isinstance(sub, str) and not getattr(G, "is_continuous", False) and not getattr(H, "is_continuous", False):
        found = _find_embeddings(G, H)
        if len(found) == 1:
            return found[0]
        if not found:
            raise RepresentationError(f"{_name(G)} has no subgroup of type {H.names.hm or sub}")
        descr = "; ".join(_describe(e) for e in found)
        raise RepresentationError(
            f"{_name(G)} contains {len(found)} inequivalent subgroups of type {H.names.hm}: {descr}. "
            "Pass the subgroup re-oriented into the group's frame (tensym.reorient)."
        )
    raise RepresentationError(
        f"{_name(H)} is not a subgroup of {_name(G)} in this frame; re-orient it first (tensym.reorient)")


def _describe(g):
    ax = []
    for op in g.operations:
        if op.kind in ("rotation", "rotoinversion") and op.order == max(o.order for o in g.operations):
            ax.append(op.axis)
            break
    n = g.names
    return f"{n.hm} with {'axis ' + str(list(ax[0])) if ax and ax[0] is not None else 'elements'} ({n.setting})"


def _signature(ops):
    sig = {}
    for op in ops:
        key = (op.det, round(float(op._num.trace()), 6))
        sig[key] = sig.get(key, 0) + 1
    return tuple(sorted(sig.items()))


def _find_embeddings(G, H):
    """Subgroups of G of the same type as H, one per G-conjugacy class, recognised."""
    from tensym.groups import recognise
    from tensym.groups.finite import PointGroup

    table = G.multiplication_table
    n = G.order
    target = _signature(H.operations)
    size = H.order
    elems = list(range(n))

    def close(gens):
        seen = {0}
        frontier = [0]
        while frontier:
            nxt = []
            for e in frontier:
                for g in gens:
                    p = int(table[g, e])
                    if p not in seen:
                        seen.add(p)
                        nxt.append(p)
                        if len(seen) > size:
                            return None
            frontier = nxt
        return frozenset(seen)

    subs = set()
    singles = {}
    for a in elems:
        s = close([a])
        if s is not None:
            singles[a] = s
    level = {s for s in singles.values()}
    found = set(level)
    for _round in range(2):
        nxt = set()
        for s in level:
            if len(s) >= size:
                continue
            for a in elems:
                if a in s:
                    continue
                t = close(list(s) + [a])
                if t is not None and t not in found:
                    nxt.add(t)
        found |= nxt
        level = nxt
    ops = G.operations
    for s in found:
        if len(s) == size and _signature([ops[i] for i in s]) == target:
            subs.add(s)
    # one per conjugacy class inside G
    inv = [int(next(j for j in range(n) if table[i, j] == 0)) for i in range(n)]
    classes = []
    for s in sorted(subs, key=lambda s: sorted(s)):
        if any(_conjugate(s, c, table, inv, n) for c in classes):
            continue
        classes.append(s)
    out = []
    for s in classes:
        idx = sorted(s)
        sub_ops = [ops[i] for i in idx]
        gens = sub_ops[1:]
        grp = PointGroup(sub_ops, gens)
        names = recognise(grp)
        if names.hm != H.names.hm:
            continue
        out.append(PointGroup(sub_ops, gens, names))
    return out


def _conjugate(s, t, table, inv, n):
    for g in range(n):
        img = frozenset(int(table[table[g, h], inv[g]]) for h in s)
        if img == t:
            return True
    return False
