"""Irreps, characters and decompositions for the continuous point groups.

Groups and labels (standard setting: axis z, sigma_v normal to x, C2' along x)
------------------------------------------------------------------------------
* SO(3): D0, D1, D2, ... (dimension 2l + 1).  O(3): D0g, D0u, D1g, ...
* C∞: Σ and, for |m| = 1, 2, 3, ..., the complex pair 1Π, 2Π (1Π has
  character exp(+i m phi) at the counter-clockwise rotation by phi about +z),
  whose real form is Π; then Δ, Φ, Γ, H, I, K, L, ... (beyond these, E<m>).
* C∞h = C∞ x Ci: the same with g / u.
* D∞ and C∞v: Σ+, Σ- (character +1 / -1 at C2', resp. sigma_v) and the real
  two-dimensional Π, Δ, ...;  D∞h: Σg+, Σg-, Σu+, Σu-, Πg, Πu, ... where the
  sign is the character at sigma_v (so z transforms as Σu+).

Characters are functions of the rotation angle phi: D^l has
sin((l + 1/2) phi) / sin(phi / 2) = 1 + 2 sum_m cos(m phi) (tables print the
sum up to l = 4 and the closed form above), a two-dimensional |m| irrep
2 cos(m phi).  At an operation of finite order n the exact characters are
periodic in l and m with period n, which makes any weight cost O(n).
Truncated tables go up to ``MAX_UP_TO``.

Decomposition (exact): a space's infinitesimal action A = lie_action(L_axis)
has eigenvalues i m with integer m; the number of weights m is
nullity(A^2 + m^2) / 2 (nullity(A) for m = 0), computed by exact ranks.  For
SO(3) the multiplicity of D^l is w(l) - w(l + 1).  Parities come from the
+1 / -1 eigenspaces of the inversion, and Σ+ / Σ- from the action of sigma_v
(or C2') on the kernel of A.

Examples
--------
>>> from tensym.reps.spaces import harmonics
>>> from tensym.groups import point_group
>>> print(continuous_decompose(harmonics(2), point_group("Dinfh"), real=True))
Σg+ + Πg + Δg
"""

from dataclasses import dataclass
import difflib
import numbers

import sympy as sp

from tensym.errors import RepresentationError, UnknownIrrepError
from tensym.groups.operations import Operation

__all__ = ["ContinuousIrrep", "ContinuousTable", "continuous_table", "continuous_decompose", "PHI",
           "continuous_character", "MAX_UP_TO", "check_up_to", "axial_restriction"]

#: The rotation angle symbol used in continuous character tables.
PHI = sp.Symbol("phi", real=True)
#: Highest weight (l for SO(3) and O(3), |m| for the axial groups) of a truncated
#: table or correlation table: 2 * 1001 rows for O(3), about a second to build and
#: print (a correlation to an axial group has l + 1 entries in row l, so its size
#: grows as the square of the weight).
MAX_UP_TO = 1000
#: Rows of D^l up to this l are written as the sum 1 + 2 cos(phi) + ... + 2 cos(l phi);
#: higher ones in the closed form sin((l + 1/2) phi) / sin(phi / 2).
_SUM_FORM_UP_TO = 4
_SIN_HALF = sp.sin(PHI / 2)

_GREEK = ["Σ", "Π", "Δ", "Φ", "Γ", "H", "I", "K", "L"]
_GREEK_ASCII = {"sigma": "Σ", "pi": "Π", "delta": "Δ", "phi": "Φ", "gamma": "Γ"}
_GREEK_TEX = {"Σ": "\\Sigma", "Π": "\\Pi", "Δ": "\\Delta", "Φ": "\\Phi", "Γ": "\\Gamma"}

# kind of each continuous group: (core, extension)
_KIND = {
    "SO(3)": ("SO3", None), "O(3)": ("SO3", "i"),
    "inf": ("Cinf", None), "inf/m": ("Cinf", "i"), "infm": ("Dinf", "det"),
    "inf2": ("Dinf", None), "inf/mm": ("Dinf", "i"),
}


def _kind(group):
    return _KIND[group.names.hm]


def _greek(m):
    return _GREEK[m] if m < len(_GREEK) else f"E{m}"


@dataclass(frozen=True)
class ContinuousIrrep:
    """An irrep of a continuous point group.

    Attributes
    ----------
    label : str
        e.g. ``'D2g'``, ``'Σu+'``, ``'Πg'``, ``'1Π'``.
    latex : str
        LaTeX form (``'D^{(2)}_{g}'``, ``'\\\\Sigma_{u}^{+}'``).
    dim : int
        Dimension.
    m : int
        l for SO(3)/O(3); |m| (the weight about the axis) for axial groups.
    parity : str
        'g', 'u' or '' (no inversion in the group).
    sign : int
        +1 / -1 for Σ+ / Σ-; for a complex member +1 (1Π) or -1 (2Π); else 0.
    is_real : bool
        False for the members of a complex pair.
    """

    label: str
    latex: str
    dim: int
    m: int
    parity: str = ""
    sign: int = 0
    is_real: bool = True


def _make_irrep(core, ext, m, parity="", sign=0, member=0):
    par = parity
    if core == "SO3":
        label = f"D{m}{par}"
        tex = f"D^{{({m})}}" + (f"_{{{par}}}" if par else "")
        return ContinuousIrrep(label, tex, 2 * m + 1, m, par, 0, True)
    g = _greek(m)
    gt = _GREEK_TEX.get(g, g)
    if m == 0:
        s = {1: "+", -1: "-", 0: ""}[sign]
        label = f"Σ{par}{s}"
        tex = "\\Sigma" + (f"_{{{par}}}" if par else "") + (f"^{{{s}}}" if s else "")
        return ContinuousIrrep(label, tex, 1, 0, par, sign, True)
    if member:
        label = f"{1 if member > 0 else 2}{g}{par}"
        tex = f"{{}}^{{{1 if member > 0 else 2}}}{gt}" + (f"_{{{par}}}" if par else "")
        return ContinuousIrrep(label, tex, 1, m, par, member, False)
    label = f"{g}{par}"
    tex = gt + (f"_{{{par}}}" if par else "")
    return ContinuousIrrep(label, tex, 2, m, par, 0, True)


def _parse_label(group, label):
    """ContinuousIrrep for a label of this group, or UnknownIrrepError."""
    core, ext = _kind(group)
    raw = str(label)
    s = raw.strip().replace("_", "").replace("^", "").replace("{", "").replace("}", "").replace(" ", "")
    low = s.lower()
    for word, ch in _GREEK_ASCII.items():
        if low.startswith(word) or low[1:].startswith(word) and low[0] in "12":
            i = low.index(word)
            s = s[:i] + ch + s[i + len(word):]
            low = s.lower()
            break
    cand = None
    try:
        if core == "SO3":
            if s[0] in "Dd" and s[1:].rstrip("gu").isdigit():
                l = int(s[1:].rstrip("gu"))
                par = s[len(str(l)) + 1:]
                if (ext == "i") == (par in ("g", "u")) and par in ("", "g", "u"):
                    cand = _make_irrep(core, ext, l, par)
        else:
            member = 0
            if s[0] in "12" and core == "Cinf":
                member = 1 if s[0] == "1" else -1
                s = s[1:]
            letter = s[0]
            rest = s[1:]
            m = _GREEK.index(letter) if letter in _GREEK else None
            if letter == "E" and rest[:1].isdigit():
                digits = "".join(ch for ch in rest if ch.isdigit())
                m = int(digits)
                rest = rest[len(digits):]
            par = ""
            if rest[:1] in ("g", "u"):
                par, rest = rest[0], rest[1:]
            if m is not None and (ext == "i") == (par != ""):
                if m == 0:
                    if core == "Dinf" and rest in ("+", "-"):
                        cand = _make_irrep(core, ext, 0, par, 1 if rest == "+" else -1)
                    elif core == "Cinf" and rest == "" and not member:
                        cand = _make_irrep(core, ext, 0, par)
                elif rest == "":
                    cand = _make_irrep(core, ext, m, par, 0, member)
    except (IndexError, ValueError):
        cand = None
    if cand is None:
        sample = [i.label for i in _listing(group, 3)]
        near = difflib.get_close_matches(raw, sample, n=3, cutoff=0.3)
        raise UnknownIrrepError(
            f"group {group.names.hm} has no irrep {raw!r}" + (f"; nearest: {', '.join(near)}" if near else "")
            + f" (its irreps: {', '.join(sample)}, ...)"
        )
    return cand


def _listing(group, up_to, *, real=True):
    core, ext = _kind(group)
    pars = ("g", "u") if ext == "i" else ("",)
    out = []
    for par in pars:
        for m in range(0, up_to + 1):
            if core == "SO3":
                out.append(_make_irrep(core, ext, m, par))
            elif m == 0:
                if core == "Dinf":
                    out += [_make_irrep(core, ext, 0, par, 1), _make_irrep(core, ext, 0, par, -1)]
                else:
                    out.append(_make_irrep(core, ext, 0, par))
            elif core == "Cinf" and not real:
                out += [_make_irrep(core, ext, m, par, 0, 1), _make_irrep(core, ext, m, par, 0, -1)]
            else:
                out.append(_make_irrep(core, ext, m, par))
    return out


def _std(group, op):
    q = group.names.rotation
    if q is None:
        return op
    return op.conjugated(sp.Matrix(q).T)


_PERIODS = {}


def _period(proper):
    """n >= 1 with R**n = 1 for a proper rotation R, proven exactly; 0 when none is found.

    The candidate is the numeric order (:func:`tensym.groups.operations.proper_order`,
    up to 240); it is accepted only when cos(n t) = T_n(cos t) equals 1
    exactly (Chebyshev recurrence on cos t = (tr R - 1)/2).  Then the
    characters of D^l (sin((l + 1/2) t)/sin(t/2)) and of the weights m
    (cos m t, sin m t) are periodic in l and m with period n, so an irrep of
    any weight costs O(n) exact operations instead of O(l).  Cached per
    operation.
    """
    key = proper.key
    hit = _PERIODS.get(key)
    if hit is not None:
        return hit
    from tensym.groups.operations import proper_order

    c = sp.expand((proper.matrix.trace() - 1) / 2)
    n = proper_order(proper.numeric) if c != 1 else 1
    if n > 1:
        t_prev, t_cur = sp.Integer(1), c
        for _ in range(1, n):
            t_prev, t_cur = t_cur, sp.expand(2 * c * t_cur - t_prev)
        if sp.radsimp(t_cur) != 1:
            n = 0
    if len(_PERIODS) > 4096:
        _PERIODS.clear()
    _PERIODS[key] = n
    return n


def continuous_character(group, irrep, op):
    """Exact character of a continuous-group irrep at an operation of the group.

    Raises
    ------
    RepresentationError
        If ``op`` is not an element of the group.
    """
    core, ext = _kind(group)
    g = _std(group, op)
    det = g.det
    if det == -1 and ext is None:
        raise RepresentationError(f"{op!r} is improper; {group.names.hm} has only rotations")
    proper = g if det == 1 else Operation(sp.ImmutableMatrix(-g.matrix))
    factor = 1
    if det == -1 and ext == "i":
        factor = 1 if irrep.parity == "g" else -1
    period = _period(proper)
    if core == "SO3":
        from tensym.reps.spaces import _chi_l

        if period == 1:  # the identity: the dimension
            return sp.Integer(factor * (2 * irrep.m + 1))
        l = irrep.m % period if period else irrep.m
        return factor * _chi_l(l, sp.expand(proper.matrix.trace()))
    M = proper.matrix
    # proper part: a rotation about z, or (Dinf) a 2-fold normal to z
    if M[2, 2] == 1 and M[0, 2] == 0 and M[1, 2] == 0:
        c, s = M[0, 0], M[1, 0]
        if irrep.m == 0:
            return sp.Integer(factor)
        # cos(m phi), sin(m phi) from Chebyshev recurrences on (c, s); m modulo the rotation's period
        cm, sm = sp.Integer(1), sp.Integer(0)
        for _ in range(irrep.m % period if period else irrep.m):
            cm, sm = sp.expand(cm * c - sm * s), sp.expand(sm * c + cm * s)
        if not irrep.is_real:
            return factor * sp.expand(cm + sp.I * sp.sign(irrep.sign) * sm)
        return factor * sp.radsimp(2 * cm)
    if core == "Dinf" and M[2, 2] == -1:
        if irrep.m != 0:
            return sp.Integer(0)
        sign = irrep.sign
        if ext == "det" and det == -1:
            return sp.Integer(sign)  # sigma_v of C∞v: the Σ sign
        if ext == "i":
            # the sign labels sigma_v = i C2'; chi(C2') = sign * chi(i)
            par = 1 if irrep.parity == "g" else -1
            chi_c2 = sign * par
            return sp.Integer(chi_c2 * factor)
        return sp.Integer(sign)
    raise RepresentationError(f"{op!r} is not an element of {group.names.hm}")


class ContinuousTable:
    """Character table of a continuous point group, truncated at a weight (immutable).

    Attributes
    ----------
    group : ContinuousGroup
    class_names : tuple of str
        Families of elements: ``'E'``, ``'C(φ)'``, ``"∞C2'"``, ``'i'``, ``'S(φ)'``, ``'∞σv'``, ...
    irreps : tuple of ContinuousIrrep
        The irreps up to ``up_to`` (l for SO(3)/O(3), |m| otherwise); complex
        pairs of C∞ and C∞h as their members.
    real_irreps : tuple of ContinuousIrrep
        The same with complex pairs combined into their real forms.
    characters : dict
        Not stored: use :meth:`character_row` (sympy expressions in :data:`PHI`).

    Examples
    --------
    >>> from tensym.groups import point_group
    >>> t = continuous_table(point_group("Cinfv"), up_to=2)
    >>> [i.label for i in t.irreps]
    ['Σ+', 'Σ-', 'Π', 'Δ']
    >>> t.character_row("Δ")
    (2, 2*cos(2*phi), 0)
    """

    def __init__(self, group, up_to):
        self._group = group
        self._up_to = up_to
        core, ext = _kind(group)
        self._core, self._ext = core, ext
        if core == "SO3":
            names = ["E", "C(φ)"] + (["i", "S(φ)"] if ext else [])
        elif core == "Cinf":
            names = ["E", "C(φ)"] + (["i", "S(φ)"] if ext else [])
        else:
            names = ["E", "2C(φ)"] + (["∞C2'"] if ext != "det" else []) + (
                ["∞σv"] if ext == "det" else []) + (["i", "2S(φ)", "∞σv"] if ext == "i" else [])
        self._names = tuple(names)
        self._irreps = tuple(_listing(group, up_to, real=False))
        self._real = tuple(_listing(group, up_to, real=True))

    group = property(lambda self: self._group, doc="The group.")
    class_names = property(lambda self: self._names, doc="Names of the element families.")
    irreps = property(lambda self: self._irreps, doc="Irreps up to the cut-off (complex members).")
    real_irreps = property(lambda self: self._real, doc="Irreps up to the cut-off (real forms).")
    up_to = property(lambda self: self._up_to, doc="The cut-off weight.")

    @property
    def labels(self):
        """Labels of :attr:`irreps`."""
        return tuple(i.label for i in self._irreps)

    def irrep(self, label):
        """The irrep with this label (any weight, not only up to the cut-off).

        Raises
        ------
        UnknownIrrepError
            If the group has no such irrep (the message lists the nearest).
        """
        if isinstance(label, ContinuousIrrep):
            return label
        return _parse_label(self._group, label)

    def character(self, label, op):
        """Exact character of irrep ``label`` at operation ``op``."""
        return continuous_character(self._group, self.irrep(label), op)

    def character_row(self, label):
        """Characters on the element families (sympy expressions in PHI)."""
        irr = self.irrep(label)
        core, ext = self._core, self._ext
        m = irr.m
        if core == "SO3":
            if m <= _SUM_FORM_UP_TO:
                rot = 1 + 2 * sum(sp.cos(k * PHI) for k in range(1, m + 1))
                rot = sp.Integer(1) if m == 0 else rot
            else:  # the closed form: O(1) to build and to print
                rot = sp.sin(sp.Rational(2 * m + 1, 2) * PHI, evaluate=False) / _SIN_HALF
            row = [sp.Integer(irr.dim), rot]
            if ext:
                p = 1 if irr.parity == "g" else -1
                row += [sp.Integer(p * irr.dim), p * rot]
            return tuple(row)
        if m == 0:
            rot = sp.Integer(1)
        elif irr.is_real:
            rot = 2 * sp.cos(m * PHI)
        else:
            rot = sp.exp(sp.I * irr.sign * m * PHI)
        if core == "Cinf":
            row = [sp.Integer(irr.dim), rot]
            if ext:
                p = 1 if irr.parity == "g" else -1
                row += [sp.Integer(p * irr.dim), p * rot]
            return tuple(row)
        sgn = sp.Integer(irr.sign) if m == 0 else sp.Integer(0)
        if ext is None:
            return (sp.Integer(irr.dim), rot, sgn)
        if ext == "det":
            return (sp.Integer(irr.dim), rot, sgn)
        p = 1 if irr.parity == "g" else -1
        c2 = sgn * p
        return (sp.Integer(irr.dim), rot, c2, sp.Integer(p * irr.dim), p * rot, sgn)

    def text(self, *, real=True):
        """Text table (rows: irreps up to the cut-off)."""
        irreps = self._real if real else self._irreps
        head = [self._group.names.schoenflies] + list(self._names)
        rows = [head] + [[i.label] + [sp.sstr(v) for v in self.character_row(i)] for i in irreps]
        widths = [max(len(r[j]) for r in rows) for j in range(len(head))]
        lines = []
        for n, r in enumerate(rows):
            lines.append("  ".join(c.rjust(w) if j else c.ljust(w) for j, (c, w) in enumerate(zip(r, widths))))
            if n == 0:
                lines.append("-" * len(lines[0]))
        lines.append(f"(φ: rotation angle; irreps shown up to weight {self._up_to})")
        return "\n".join(lines)

    def __str__(self):
        return self.text()

    def latex(self, *, real=True):
        """LaTeX tabular of the truncated table."""
        irreps = self._real if real else self._irreps
        tex_names = [n.replace("φ", "\\varphi").replace("∞", "\\infty ").replace("σ", "\\sigma_") for n in self._names]
        lines = ["\\begin{tabular}{l" + "c" * len(self._names) + "}", "\\hline",
                 " & ".join([""] + [f"${n}$" for n in tex_names]) + " \\\\", "\\hline"]
        for i in irreps:
            lines.append(" & ".join([f"${i.latex}$"] + [f"${sp.latex(v)}$" for v in self.character_row(i)]) + " \\\\")
        lines += ["\\hline", "\\end{tabular}"]
        return "\n".join(lines)

    def _repr_latex_(self):
        from tensym.display import show  # notebook display: the math-mode array that tensym.output installs

        return "$$" + show(self, "latex") + "$$"

    def __repr__(self):
        return f"<ContinuousTable {self._group.names.hm} up to {self._up_to}: {' '.join(i.label for i in self._real)} ...>"


def continuous_table(group, up_to=4):
    """The (truncated) character table of a continuous group.

    Raises
    ------
    InvalidOptionError
        For ``up_to`` that is not a whole number from 0 to :data:`MAX_UP_TO`.
    """
    return ContinuousTable(group, check_up_to(up_to))


def check_up_to(up_to):
    """``up_to`` as an int from 0 to MAX_UP_TO, else InvalidOptionError (shared by the table and correlate)."""
    from tensym.errors import InvalidOptionError

    if isinstance(up_to, bool) or not isinstance(up_to, numbers.Integral) or up_to < 0:
        raise InvalidOptionError(f"up_to must be a non-negative integer, got {str(up_to)[:40]!r}")
    up_to = int(up_to)
    if up_to > MAX_UP_TO:
        raise InvalidOptionError(f"up_to must be at most {MAX_UP_TO} (the weight of the last row of a truncated "
                                 f"table), got {up_to if up_to < 10**12 else str(up_to)[:12] + '...'}")
    return up_to


# ---------------------------------------------------------------------------
# decomposition by weights
# ---------------------------------------------------------------------------
def _dm(m):
    from tensym.reps.linalg import to_dm

    return to_dm(m)


def continuous_decompose(space, group, *, real=True):
    """Decomposition of a space over a continuous group (see the module docstring)."""
    from tensym.reps.decompose import Decomposition
    from tensym.reps.linalg import unify

    core, ext = _kind(group)
    L = group.lie_generators[-1]  # the axis generator (z in the standard setting)
    try:
        A = space.lie_action(L)
    except NotImplementedError as exc:
        raise RepresentationError(
            f"{space!r} has no infinitesimal action, needed to decompose over {group.names.hm}") from exc
    dim = space.dim
    A = _dm(sp.Matrix(A))
    blocks = []  # (parity, projector DomainMatrix onto the parity subspace)
    if ext == "i":
        inv = Operation(sp.ImmutableMatrix(-sp.eye(3)))
        Di = _dm(sp.Matrix(space.action(inv)))
        A, Di = unify([A, Di])
        I = A.eye(dim, A.domain)
        half = A.domain.convert(sp.Rational(1, 2))
        blocks = [("g", (I + Di) * half), ("u", (I - Di) * half)]
    else:
        I = A.eye(dim, A.domain)
        blocks = [("", I)]
    sigma = None
    if core == "Dinf":
        # the reflection (or 2-fold) that fixes the Σ sign: sigma_v for C∞v and D∞h, C2' for D∞
        if ext == "i" or ext == "det":
            ref = Operation.from_triplet("-x,y,z")
        else:
            ref = Operation.from_triplet("x,-y,-z")
        q = group.names.rotation
        if q is not None:
            ref = ref.conjugated(q)
        sigma = _dm(sp.Matrix(space.action(ref)))
    counts = {}
    A2 = A * A
    for par, P in blocks:
        A_, P_ = unify([A, P])
        r = P_.rank()
        if r == 0:
            continue
        covered = 0
        m = 0
        weights = {}
        while covered < r:
            if m > 4 * dim + 8:
                raise RepresentationError(f"{space!r}: the weights of the axis rotation are not integers")
            Mm = (A2 + I * A2.domain.convert(m * m)) if m else A_
            nul = r - (Mm.convert_to(P_.domain) * P_).rank()
            w = nul if m == 0 else nul // 2
            if w:
                weights[m] = w
                covered += w if m == 0 else 2 * w
            m += 1
        if core == "SO3":
            top = max(weights)
            for l in range(0, top + 1):
                n = weights.get(l, 0) - weights.get(l + 1, 0)
                if n:
                    counts[_make_irrep(core, ext, l, par).label] = (n, _make_irrep(core, ext, l, par))
            continue
        for mm, w in sorted(weights.items()):
            if mm == 0:
                if core == "Dinf":
                    # split the kernel of A by the sign of sigma
                    ker = (A_.convert_to(P_.domain) * P_)
                    basis = _kernel_in(ker, P_)
                    S = sigma.convert_to(basis.domain) if sigma is not None else None
                    plus = _plus_count(S, basis)
                    if plus:
                        irr = _make_irrep(core, ext, 0, par, 1)
                        counts[irr.label] = (plus, irr)
                    if w - plus:
                        irr = _make_irrep(core, ext, 0, par, -1)
                        counts[irr.label] = (w - plus, irr)
                else:
                    irr = _make_irrep(core, ext, 0, par)
                    counts[irr.label] = (w, irr)
            elif core == "Cinf" and not real:
                for member in (1, -1):
                    irr = _make_irrep(core, ext, mm, par, 0, member)
                    counts[irr.label] = (w, irr)
            else:
                irr = _make_irrep(core, ext, mm, par)
                counts[irr.label] = (w, irr)
    order = {lab: k for k, lab in enumerate(i.label for i in _listing(group, 4 * dim + 8, real=real))}
    labs = sorted(counts, key=lambda k: order.get(k, 10**6))
    return Decomposition(group.names.hm, tuple(labs), tuple(counts[k][0] for k in labs),
                         tuple(counts[k][1].dim for k in labs), tuple(counts[k][1].latex for k in labs), real,
                         ("*continuous*",))


def axial_restriction(group, l, parity_sign, *, real=True):
    """The decomposition of D^l (inversion acting as ``parity_sign``) over an axial group, in closed form.

    D^l has one weight m for each m = -l .. l about the axis.  The weight-0
    function is the zonal harmonic P_l(z/r): the 2-fold C2' (along x) acts
    on it as (-1)^l and the reflection sigma_v = i C2' as parity_sign * (-1)^l,
    which fixes the Σ sign; the weights +-m (m >= 1) form the two-dimensional
    irrep of weight m (or its two complex members), and the inversion acts on
    everything as ``parity_sign``.  The result equals
    ``continuous_decompose(harmonics(l, parity), group)`` (tested) at O(l) cost.

    Examples
    --------
    >>> from tensym.groups import point_group
    >>> print(axial_restriction(point_group("Dinfh"), 1, -1))
    Σu+ + Πu
    """
    from tensym.reps.decompose import Decomposition

    core, ext = _kind(group)
    if core == "SO3":
        raise RepresentationError(f"{group.names.hm} is not an axial group")
    par = ("g" if parity_sign == 1 else "u") if ext == "i" else ""
    zonal_c2 = (-1) ** l  # C2' on P_l(z/r)
    if core == "Dinf":
        sign = parity_sign * zonal_c2 if ext in ("i", "det") else zonal_c2
        irreps = [_make_irrep(core, ext, 0, par, sign)]
    else:
        irreps = [_make_irrep(core, ext, 0, par)]
    for m in range(1, l + 1):
        if core == "Cinf" and not real:
            irreps += [_make_irrep(core, ext, m, par, 0, 1), _make_irrep(core, ext, m, par, 0, -1)]
        else:
            irreps.append(_make_irrep(core, ext, m, par))
    return Decomposition(group.names.hm, tuple(i.label for i in irreps), (1,) * len(irreps),
                         tuple(i.dim for i in irreps), tuple(i.latex for i in irreps), real, ("*continuous*",))


def _kernel_in(M, P):
    """Basis (columns) of {P v : M P v = 0} = kernel of M restricted to the image of P."""
    from sympy.polys.matrices import DomainMatrix

    # image of P: its pivot columns
    _, piv = P.rref()
    cols = P.extract(list(range(P.shape[0])), list(piv))
    K = (M.convert_to(cols.domain) * cols).nullspace()
    if K.shape[0] == 0:
        return DomainMatrix.zeros((P.shape[0], 0), cols.domain)
    return cols * K.transpose()


def _plus_count(S, basis):
    """Number of +1 eigenvalues of the involution S on the invariant subspace spanned by ``basis``."""
    k = basis.shape[1]
    if k == 0:
        return 0
    if S is None:
        return k
    img = S * basis
    # coordinates C with basis C = img (basis has full column rank)
    BtB = basis.transpose() * basis
    C = BtB.inv() * basis.transpose() * img
    tr = C.domain.zero
    cl = C.to_list()
    for i in range(k):
        tr += cl[i][i]
    t = int(sp.Integer(C.domain.to_sympy(tr)))
    return (k + t) // 2
