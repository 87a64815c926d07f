r"""Conventional class names and Mulliken labels of point-group irreps.

Everything here works on the group in its *standard frame*: when the group
records a re-orientation ``names.rotation = Q`` (``g = Q g_std Q^T``), the
operations are first brought back with ``Q^T g Q``, so a re-oriented group gets
the labels of its standard setting.  Geometry is classified in floating point
(absolute tolerance 1e-9 on unit vectors and cosines); the labels are discrete.

Class names (Schoenflies style)
-------------------------------
E, i, C_n^k (rotation by 2 pi k/n, counter-clockwise about the principal axis
oriented along +z), S_n^k (= sigma_h C_n^k, rotoreflection), sigma_h (mirror
normal to the principal axis), sigma_v / sigma_d (mirrors containing it),
with the class size in front (``2C3``, ``3σv``).  Choices:

* perpendicular 2-folds: C2' is the class of the 2-fold closest to x, C2'' the
  other class (D4: C2' along x, y; D6: C2' along x, the hexagonal a axis);
* vertical mirrors: with perpendicular 2-folds, sigma_v contains a C2' axis and
  sigma_d does not; without them, sigma_v is the class of the mirror whose
  plane contains the direction closest to x (C2v: sigma_v(xz), sigma_v'(yz));
* cubic groups: 3C2 about the cube axes, 6C2' about the face diagonals,
  3σh the coordinate planes, 6σd the diagonal planes; T and Th split the
  3-folds into 4C3 (containing C3+ about [111]) and 4C3²;
* D2 and D2h: C2(z), C2(y), C2(x), σ(xy), σ(xz), σ(yz).

Class order: proper classes (identity, rotations about the principal axis by
increasing angle, perpendicular 2-folds), then, when the group has the
inversion (or else sigma_h), the improper classes in the order of
i x (resp. sigma_h x) the proper ones; otherwise rotoreflections about the
principal axis interleaved by angle and the vertical mirrors last.

Mulliken labels (Mulliken 1955) and the choices where the rules leave one
-------------------------------------------------------------------------
* dimension 1, 2, 3, 4, 5 -> A or B, E, T, G, H;  a pair of complex-conjugate
  one-dimensional irreps is an E (real form) whose members are ``1E`` and ``2E``
  (``1E`` has character exp(+2 pi i k/n) at the principal operation);
* A / B: character +1 / -1 at the principal rotation C_n (n maximal); in S4
  and D2d (and S_2n, D_nd with no inversion and no sigma_h) at the
  rotoreflection S_2n;
* subscript 1 / 2 on A, B: symmetric / antisymmetric under the C2' class; with
  no perpendicular 2-fold, under sigma_v.  Hence B1 in C2v is even under
  sigma_v(xz) (x transforms as B1, y as B2), B2 in D2d contains z;
* D2, D2h: B1, B2, B3 even under C2(z), C2(y), C2(x) (z, y, x transform as
  B1, B2, B3);
* E_k numbering (when there is more than one E of a kind): character
  2 cos(2 pi k/n) at the principal operation (D6: E1 contains (x, y));
* cubic: A1/A2 and T1/T2 by the sign at C4 (O, Oh) or S4 (Td); icosahedral:
  T1 has character (1 + sqrt 5)/2 at C5 (it contains (x, y, z) in I);
* g / u: character +d / -d at the inversion; ' / '': +d / -d at sigma_h when
  there is no inversion (Cs, C3h, D3h ...).

Magnetic groups (time reversal θ = 1')
--------------------------------------
* a class of primed operations g' = g 1' is named by its spatial part
  followed by ``·θ``: ``2C4·θ``, ``3σv·θ``; the class of 1' itself is ``θ``
  (LaTeX ``2C_{4}\cdot\theta``, ``\theta``).  A plain prime is never used for
  time reversal here, because C2' already names a class of perpendicular
  2-folds;
* the irreps of a grey group G1' carry their time parity after G's label:
  ``+`` when 1' acts as +1 (time-even), ``-`` when it acts as -1 (time-odd):
  ``A1g+``, ``Eu-``, ``1E+`` (LaTeX ``A_{1g}^{+}``, ``{A_{1}^{\prime}}^{-}``);
* a black-and-white group is isomorphic to its parent through the spatial
  parts, and its irreps keep the parent's labels.

Examples
--------
>>> superscript(2)
'²'
>>> time_reversed_class_name("2C4", "2C_{4}")
('2C4·θ', '2C_{4}\\cdot\\theta')
>>> time_parity_label("A1'", "A_{1}^{\\prime}", "-")
("A1'-", '{A_{1}^{\\prime}}^{-}')
"""

from fractions import Fraction
import math

import numpy as np

__all__ = ["ClassInfo", "name_classes", "label_irreps", "superscript", "std_frame", "time_reversed_class_name",
           "time_parity_label", "TIME_REVERSAL_MARK"]

#: The mark of time reversal 1' in class names (``2C4·θ``).
TIME_REVERSAL_MARK = "θ"

_TOL = 1e-9
_SUP = str.maketrans("0123456789", "⁰¹²³⁴⁵⁶⁷⁸⁹")


def superscript(k):
    """Unicode superscript digits of an integer."""
    return str(k).translate(_SUP)


def time_reversed_class_name(name, latex):
    """Name (text, LaTeX) of the class C 1' of primed operations, from the name of C.

    ``E`` becomes ``θ`` (the time reversal 1' itself), any other name gets the
    suffix ``·θ``: ``'2C4'`` -> ``'2C4·θ'``, ``"3C2'"`` -> ``"3C2'·θ"``.
    """
    if name == "E":
        return TIME_REVERSAL_MARK, "\\theta"
    return f"{name}·{TIME_REVERSAL_MARK}", f"{latex}\\cdot\\theta"


def time_parity_label(label, latex, sign):
    """Label (text, LaTeX) of an irrep of a grey group: the label of G with its time parity ``'+'``/``'-'``.

    In LaTeX the sign is a superscript; a label that has a superscript of its
    own (a prime) is braced first, and the member index of a complex pair
    (``{}^{1}E``) stays in front.
    """
    if sign not in ("+", "-"):
        raise ValueError(f"time parity must be '+' or '-', got {sign!r}")
    pre, body = "", latex
    if latex.startswith("{}^{"):
        cut = latex.index("}", 3) + 1
        pre, body = latex[:cut], latex[cut:]
    if "^" in body:
        body = "{" + body + "}"
    return label + sign, f"{pre}{body}^{{{sign}}}"


def std_frame(group):
    """Float matrices of the operations in the group's standard frame."""
    q = getattr(getattr(group, "names", None), "rotation", None)
    mats = [op.numeric for op in group.operations]
    if q is None:
        return mats
    qn = np.array([[float(v) for v in row] for row in np.array(q.tolist(), dtype=object)], dtype=float)
    return [qn.T @ m @ qn for m in mats]


class _Geo:
    """Geometry of one operation (float, standard frame)."""

    __slots__ = ("m", "det", "proper", "cos", "axis", "kind", "w")

    def __init__(self, m):
        self.m = m
        self.det = 1 if np.linalg.det(m) > 0 else -1
        p = self.det * m
        self.proper = p
        self.cos = max(-1.0, min(1.0, (np.trace(p) - 1) / 2))
        self.w = np.array([p[2, 1] - p[1, 2], p[0, 2] - p[2, 0], p[1, 0] - p[0, 1]]) / 2
        if abs(self.cos - 1) < _TOL:
            self.axis = None
        elif np.linalg.norm(self.w) > 1e-6:
            self.axis = self.w / np.linalg.norm(self.w)
        else:  # angle pi: axis from p + 1
            s = p + np.eye(3)
            j = int(np.argmax(np.linalg.norm(s, axis=0)))
            a = s[:, j] / np.linalg.norm(s[:, j])
            self.axis = a
        if self.det == 1:
            self.kind = "E" if self.axis is None else "C"
        elif self.axis is None:
            self.kind = "i"
        elif abs(self.cos + 1) < _TOL:
            self.kind = "σ"
        else:
            self.kind = "S"

    def angle_about(self, u):
        """Counter-clockwise rotation angle (fraction of a turn, [0, 1)) about unit u.

        For improper operations the angle phi' of g = sigma_h(u) C(u, phi')."""
        s = float(np.dot(self.w, u))
        ang = math.atan2(s, self.cos)
        if self.det == -1:
            ang += math.pi
        f = (ang / (2 * math.pi)) % 1.0
        return 0.0 if abs(f - 1) < 1e-9 else f

    def parallel(self, u):
        return self.axis is not None and abs(abs(float(np.dot(self.axis, u))) - 1) < 1e-7

    def perpendicular(self, u):
        return self.axis is not None and abs(float(np.dot(self.axis, u))) < 1e-7


def _frac(f, limit=240):
    fr = Fraction(f).limit_denominator(limit)
    return fr


class ClassInfo:
    """Name of a class: text, LaTeX and sort key (private helper record)."""

    __slots__ = ("text", "latex", "key")

    def __init__(self, text, latex, key):
        self.text, self.latex, self.key = text, latex, key


def _analyse(group, data):
    mats = std_frame(group)
    geos = [_Geo(m) for m in mats]
    axes3 = []
    has5 = False
    for g in geos:
        if g.det == 1 and g.axis is not None:
            if abs(g.cos + 0.5) < 1e-7:
                if not any(abs(abs(float(np.dot(a, g.axis))) - 1) < 1e-7 for a in axes3):
                    axes3.append(g.axis)
            if abs(g.cos - math.cos(2 * math.pi / 5)) < 1e-7 or abs(g.cos - math.cos(4 * math.pi / 5)) < 1e-7:
                has5 = True
    family = "icosahedral" if has5 and len(axes3) > 1 else ("cubic" if len(axes3) >= 4 else "axial")
    info = {"geos": geos, "family": family}
    z = np.array([0.0, 0.0, 1.0])
    xref = np.array([1.0, 0.0, 0.0])
    if family != "axial":
        info["principal"] = z
        return info
    # principal axis: the axis of the highest-order operation (proper preferred, then closest to z)
    best = None
    for i, g in enumerate(geos):
        if g.axis is None:
            continue
        order = _order_of(mats[i])
        key = (order, g.det == 1, abs(float(np.dot(g.axis, z))), abs(float(np.dot(g.axis, [0, 1, 0]))))
        if best is None or key > best[0]:
            best = (key, g.axis)
    if best is None:
        info["principal"] = None
        return info
    u = best[1].copy()
    for c in (2, 1, 0):  # orient: positive z (then y, x) component
        if abs(u[c]) > 1e-7:
            if u[c] < 0:
                u = -u
            break
    info["principal"] = u
    ref = xref - np.dot(xref, u) * u
    if np.linalg.norm(ref) < 1e-6:
        ref = np.array([0.0, 1.0, 0.0]) - u[1] * u
    info["ref"] = ref / np.linalg.norm(ref)
    return info


def _order_of(m):
    p = np.eye(3)
    for n in range(1, 241):
        p = m @ p
        if np.allclose(p, np.eye(3), atol=1e-8):
            return n
    return 0


def _classes_geometry(group, data, info):
    """Per class: (kind, n, k, subtype) with the conventions of the module docstring."""
    geos = info["geos"]
    fam = info["family"]
    u = info.get("principal")
    out = []
    # perpendicular C2 classes and their primes
    perp_c2 = []
    vert = []
    d2_like = False
    if fam == "axial" and u is not None:
        for c, members in enumerate(data.classes):
            g = geos[members[0]]
            if g.kind == "C" and abs(g.cos + 1) < _TOL and g.perpendicular(u):
                perp_c2.append(c)
            if g.kind == "σ" and g.perpendicular(u):
                vert.append(c)
        # D2-like: only 2-folds, three perpendicular directions
        proper_orders = {int(round(2 * math.pi / math.acos(geos[m[0]].cos))) for m in data.classes
                         if geos[m[0]].det == 1 and geos[m[0]].axis is not None}
        d2_like = proper_orders == {2} and len(perp_c2) == 2
    ref = info.get("ref")
    c2prime = None
    if len(perp_c2) >= 1 and ref is not None:
        c2prime = max(perp_c2, key=lambda c: max(abs(float(np.dot(geos[m].axis, ref))) for m in data.classes[c]))
    sigma_v = None
    if vert and ref is not None:
        if perp_c2:
            # sigma_v contains a C2' axis: its normal is perpendicular to one
            c2_axes = [geos[m].axis for m in data.classes[c2prime]]
            cands = [c for c in vert if any(abs(float(np.dot(geos[m].axis, a))) < 1e-7
                                            for m in data.classes[c] for a in c2_axes)]
            sigma_v = cands[0] if cands else None
        else:
            sigma_v = min(vert, key=lambda c: min(abs(float(np.dot(geos[m].axis, ref))) for m in data.classes[c]))
    principal_c2 = u is not None and any(
        geos[m[0]].kind == "C" and abs(geos[m[0]].cos + 1) < _TOL and geos[m[0]].parallel(u) for m in data.classes)
    info.update(perp_c2=perp_c2, c2prime=c2prime, vert=vert, sigma_v=sigma_v, d2_like=d2_like,
                principal_c2=principal_c2, vert_sizes=tuple(sorted(len(data.classes[c]) for c in vert)))
    return info


def _k_of(geos, members, ref_axis):
    """Smallest (n, k) of the class: rotation / rotoreflection angle 2 pi k / n."""
    best = None
    cand = [m for m in members if ref_axis is not None and geos[m].parallel(ref_axis)]
    for m in cand or members:
        g = geos[m]
        if cand:
            f = g.angle_about(ref_axis)
            fr = _frac(f)
        else:
            f = g.angle_about(g.axis)
            fr = _frac(f)
            fr = min(fr, 1 - fr) if fr != 0 else fr
        if best is None or fr < best:
            best = fr
    return best


def _axis_letter(a):
    for c, name in enumerate("xyz"):
        if abs(abs(a[c]) - 1) < 1e-7:
            return name
    return None


def name_classes(group, data):
    """Names and order of the classes: list of ClassInfo aligned with data.classes."""
    info = _analyse(group, data)
    _classes_geometry(group, data, info)
    geos = info["geos"]
    fam = info["family"]
    u = info.get("principal")
    names = []
    cube_axes = [np.array(v, dtype=float) for v in ((1, 0, 0), (0, 1, 0), (0, 0, 1))]
    body = np.array([1.0, 1.0, 1.0]) / math.sqrt(3)
    for c, members in enumerate(data.classes):
        g = geos[members[0]]
        size = len(members)
        pre = str(size) if size > 1 else ""
        if g.kind == "E":
            names.append(("E", "E", ()))
            continue
        if g.kind == "i":
            names.append(("i", "i", ()))
            continue
        if g.kind == "σ":
            txt, tex = _mirror_name(c, g, info, cube_axes)
            names.append((pre + txt, pre + tex, ("σ",)))
            continue
        # rotation or rotoreflection
        if fam == "cubic" and g.parallel(body) or (fam == "cubic" and abs(g.cos + 0.5) < 1e-7 and g.det == 1):
            ref_axis = body
        elif fam == "cubic" and g.det == -1 and abs(g.cos - 0.5) < 1e-7:  # S6 type about body diagonals
            ref_axis = body
        elif fam == "axial" and u is not None and g.parallel(u):
            ref_axis = u
        else:
            ref_axis = None
        if fam == "cubic" and ref_axis is body:
            cand = [m for m in members if geos[m].parallel(body)]
            if not cand:  # the class's 3-folds about [111] might be oriented -[111]
                ref_axis = None
        fr = _k_of(geos, members, ref_axis)
        n, k = fr.denominator, fr.numerator
        letter = "C" if g.det == 1 else "S"
        if letter == "S" and n % 2 == 1 and k % 2 == 0:
            k += n
        prime = ""
        if g.det == 1 and n == 2:
            if fam == "axial" and info["d2_like"]:
                a = _axis_letter(g.axis)
                prime = f"({a})" if a else ""
                if not a and u is not None and g.parallel(u):
                    prime = ""
                if not prime and c in info["perp_c2"]:
                    prime = "'" if c == info["c2prime"] else "''"
            elif fam == "axial" and c in info["perp_c2"] and (len(info["perp_c2"]) > 1 or info["principal_c2"]):
                prime = "'" if c == info["c2prime"] else "''"
            elif fam == "cubic" and not any(g.parallel(a) for a in cube_axes):
                prime = "'"
        sup = superscript(k) if k > 1 else ""
        txt = f"{pre}{letter}{n}{sup}{prime}"
        tex_prime = prime.replace("''", "^{\\prime\\prime}").replace("'", "^{\\prime}") if "(" not in prime else prime
        tex = f"{pre}{letter}_{{{n}}}" + (f"^{{{k}}}" if k > 1 else "") + tex_prime
        names.append((txt, tex, (letter, n, k, prime)))
    # uniqueness
    seen = {}
    final = []
    for txt, tex, _ in names:
        if txt in seen:
            seen[txt] += 1
            txt, tex = f"{txt}#{seen[txt]}", f"{tex}\\#{seen[txt]}"
        else:
            seen[txt] = 1
        final.append([txt, tex])
    keys = _class_keys(group, data, info)
    return [ClassInfo(t, x, k) for (t, x), k in zip(final, keys)], info


def _mirror_name(c, g, info, cube_axes):
    fam = info["family"]
    u = info.get("principal")
    if fam == "icosahedral":
        return "σ", "\\sigma"
    if fam == "cubic":
        if any(g.parallel(a) for a in cube_axes):
            return "σh", "\\sigma_{h}"
        return "σd", "\\sigma_{d}"
    if u is None or g.parallel(u):
        if info["d2_like"]:
            plane = _plane(g.axis)
            if plane:
                return f"σ({plane})", f"\\sigma({plane})"
        return "σh", "\\sigma_{h}"
    if info["d2_like"]:
        plane = _plane(g.axis)
        if plane:
            return f"σ({plane})", f"\\sigma({plane})"
    if info["perp_c2"]:
        return ("σv", "\\sigma_{v}") if c == info["sigma_v"] else ("σd", "\\sigma_{d}")
    if len(info["vert"]) == 1:
        return "σv", "\\sigma_{v}"
    if info["vert_sizes"] != (1, 1):
        return ("σv", "\\sigma_{v}") if c == info["sigma_v"] else ("σd", "\\sigma_{d}")
    # two single vertical mirror classes (C2v-like)
    plane = _plane(g.axis)
    tail = f"({plane})" if plane else ""
    if c == info["sigma_v"]:
        return f"σv{tail}", f"\\sigma_{{v}}{tail}"
    return f"σv'{tail}", f"\\sigma_{{v}}^{{\\prime}}{tail}"


def _plane(normal):
    a = _axis_letter(normal)
    return {"x": "yz", "y": "xz", "z": "xy"}.get(a)


def _proper_key(c, data, info):
    geos = info["geos"]
    g = geos[data.classes[c][0]]
    fam = info["family"]
    u = info.get("principal")
    members = data.classes[c]
    if g.kind == "E":
        return (0,)
    if fam == "icosahedral":
        return (1, round(1 - g.cos, 6))  # C5 (72), C5^2 (144), C3 (120)?  sort by order below
    if fam == "cubic":
        cube_axes = [np.array(v, dtype=float) for v in ((1, 0, 0), (0, 1, 0), (0, 0, 1))]
        if abs(g.cos + 0.5) < 1e-7:
            body = np.array([1.0, 1.0, 1.0]) / math.sqrt(3)
            cand = [m for m in members if geos[m].parallel(body)]
            f = min(geos[m].angle_about(body) for m in cand) if cand else 1
            return (1, f)
        if abs(g.cos + 1) < 1e-7:
            return (2,) if any(g.parallel(a) for a in cube_axes) else (4,)
        return (3,)
    if u is not None and g.parallel(u) and not (info["d2_like"]):
        fr = min(geos[m].angle_about(u) for m in members)
        return (1, fr)
    if info["d2_like"]:
        a = _axis_letter(g.axis) if g.axis is not None else None
        return (1, {"z": 0, "y": 1, "x": 2}.get(a, 3))
    if c == info.get("c2prime"):
        return (2, 0)
    return (2, 1)


def _class_keys(group, data, info):
    geos = info["geos"]
    fam = info["family"]
    table = group.multiplication_table
    ops_classes = data.class_of
    # find inversion / sigma_h elements
    inv = next((i for i, g in enumerate(geos) if g.kind == "i"), None)
    sigh = None
    u = info.get("principal")
    if inv is None and fam == "axial" and u is not None:
        sigh = next((i for i, g in enumerate(geos) if g.kind == "σ" and g.parallel(u)), None)
    mult = inv if inv is not None else sigh
    keys = []
    for c, members in enumerate(data.classes):
        g = geos[members[0]]
        if g.det == 1:
            keys.append((0,) + _proper_key(c, data, info))
        elif mult is not None:
            partner = ops_classes[int(table[mult, members[0]])]
            keys.append((1,) + _proper_key(partner, data, info))
        else:
            keys.append((0,) + _improper_key(c, data, info))
    if fam == "icosahedral":
        # E, C5, C5^2, C3, C2 by the angle fraction 1/5, 2/5, 1/3, 1/2
        def ico(c):
            g = geos[data.classes[c][0]]
            gp = g if g.det == 1 else geos[int(table[mult, data.classes[c][0]])] if mult is not None else g
            if gp.kind == "E":
                return (0,)
            ang = math.acos(gp.cos) / (2 * math.pi)
            order = {0.2: 1, 0.4: 2}.get(round(ang, 6), 3 if abs(ang - 1 / 3) < 1e-6 else 4)
            return (order,)
        keys = [(0 if geos[m[0]].det == 1 else 1,) + ico(c) for c, m in enumerate(data.classes)]
    return keys


def _improper_key(c, data, info):
    geos = info["geos"]
    g = geos[data.classes[c][0]]
    fam = info["family"]
    u = info.get("principal")
    members = data.classes[c]
    if fam == "cubic":
        if g.kind == "σ":
            return (4,)
        if abs(g.cos) < 1e-7:  # S4 type: proper part a 4-fold
            return (3,)
        return (1, 1)
    if g.kind == "σ":
        if u is not None and g.parallel(u):
            return (5, 0)
        return (6, 0 if c == info.get("sigma_v") else 1)
    if u is not None and g.parallel(u):
        return (1, min(geos[m].angle_about(u) for m in members))
    return (7,)


# ---------------------------------------------------------------------------
# Mulliken labels
# ---------------------------------------------------------------------------

_LETTER = {1: "A", 2: "E", 3: "T", 4: "G", 5: "H"}


def _find(geos, pred):
    return next((i for i, g in enumerate(geos) if pred(g)), None)


def label_irreps(group, data, rows, info):
    """Mulliken labels for the exact character rows.

    Returns a list of (label, latex, sort_key, pair_index or None, real_label).
    """
    geos = info["geos"]
    fam = info["family"]
    u = info.get("principal")
    class_of = data.class_of
    r = len(rows)
    deg = [int(rows[i][0].rational_value()) for i in range(r)]
    complex_row = [not all(v.is_real for v in row) for row in rows]
    conj = [None] * r
    for i in range(r):
        if complex_row[i]:
            cj = [v.conjugate() for v in rows[i]]
            conj[i] = next(j for j in range(r) if rows[j] == cj)

    def chi(i, op):
        return complex(rows[i][class_of[op]])

    inv = _find(geos, lambda g: g.kind == "i")
    sigh = None
    if inv is None and u is not None and fam == "axial":
        sigh = _find(geos, lambda g: g.kind == "σ" and g.parallel(u))
    # principal operation
    P = None
    if fam == "axial" and u is not None and not info["d2_like"]:
        best = None
        for i, g in enumerate(geos):
            if g.kind == "C" and g.parallel(u):
                f = g.angle_about(u)
                if f > 1e-9:
                    n = _frac(f).denominator
                    key = (n, -f)
                    if best is None or key > best[0]:
                        best = (key, i, n)
        n_rot = best[2] if best else 1
        P = best[1] if best else None
        if inv is None and sigh is None:
            for i, g in enumerate(geos):
                if g.kind == "S" and g.parallel(u):
                    fr = _frac(g.angle_about(u))
                    if fr.denominator == 2 * n_rot and fr.numerator == 1:
                        P = i
        if P is None and best is None:
            # no rotation about u at all (Cs, Ci): use rotoreflections if present
            P = None
    elif fam == "axial" and info["d2_like"]:
        P = _find(geos, lambda g: g.kind == "C" and g.parallel(np.array([0.0, 0.0, 1.0])))
        if P is None:
            P = _find(geos, lambda g: g.kind == "C" and u is not None and g.parallel(u))
    elif fam == "cubic":
        P = _find(geos, lambda g: g.kind == "C" and abs(g.cos) < 1e-7 and g.parallel(np.array([0, 0, 1.0])))
        if P is None:
            P = _find(geos, lambda g: g.kind == "S" and abs(g.cos) < 1e-7 and g.parallel(np.array([0, 0, 1.0])))
        if P is None:  # T, Th: C3+ about [111]
            body = np.array([1.0, 1.0, 1.0]) / math.sqrt(3)
            P = _find(geos, lambda g: g.kind == "C" and g.parallel(body) and abs(g.angle_about(body) - 1 / 3) < 1e-7)
    else:  # icosahedral: a C5 by 72 degrees
        P = _find(geos, lambda g: g.kind == "C" and abs(g.cos - math.cos(2 * math.pi / 5)) < 1e-7)
    Pn = None
    Pu = None
    if P is not None:
        gp = geos[P]
        Pu = u if (fam == "axial" and u is not None and gp.parallel(u)) else gp.axis
        if fam == "cubic" and gp.axis is not None and abs(gp.cos + 0.5) < 1e-7:
            Pu = np.array([1.0, 1.0, 1.0]) / math.sqrt(3)
        Pn = _frac(gp.angle_about(Pu)).denominator
    # subscript references
    sub_ref = None
    if fam == "axial" and not info["d2_like"]:
        if info.get("c2prime") is not None:
            sub_ref = data.classes[info["c2prime"]][0]
        elif info.get("sigma_v") is not None:
            sub_ref = data.classes[info["sigma_v"]][0]
    d2_axes = None
    if info.get("d2_like"):
        d2_axes = []
        for a in (np.array([0, 0, 1.0]), np.array([0, 1.0, 0]), np.array([1.0, 0, 0])):
            d2_axes.append(_find(geos, lambda g, a=a: g.kind == "C" and g.parallel(a)))
        if any(v is None for v in d2_axes):  # generic orientation: the three 2-folds, principal first
            c2s = [i for i, g in enumerate(geos) if g.kind == "C"]
            c2s.sort(key=lambda i: (not geos[i].parallel(u), -abs(geos[i].axis[1]), -abs(geos[i].axis[0])))
            d2_axes = c2s[:3]

    records = []
    for i in range(r):
        d = deg[i]
        is_pair = complex_row[i]
        letter = "E" if is_pair else _LETTER.get(d, f"Γ{d}")
        parity = ""
        block = 0
        if inv is not None:
            s = chi(i, inv).real / d
            parity = "g" if s > 0 else "u"
            block = 0 if s > 0 else 1
        elif sigh is not None:
            s = chi(i, sigh).real / d
            parity = "'" if s > 0 else "''"
            block = 0 if s > 0 else 1
        sub = ""
        k_num = 0
        if d == 1 and not is_pair:
            if P is not None and fam == "axial" and chi(i, P).real < 0:
                letter = "B"
            if info.get("d2_like"):
                if letter == "B" or (d2_axes and any(chi(i, a).real < 0 for a in d2_axes if a is not None)):
                    letter = "B"
                    for idx, a in enumerate(d2_axes):
                        if a is not None and chi(i, a).real > 0:
                            sub = str(idx + 1)
                            break
            elif fam == "cubic":
                if P is not None and abs(geos[P].cos) < 1e-7:
                    sub = "1" if chi(i, P).real > 0 else "2"
            elif sub_ref is not None:
                sub = "1" if chi(i, sub_ref).real > 0 else "2"
        elif d == 3 and fam == "cubic" and P is not None and abs(geos[P].cos) < 1e-7:
            sub = "1" if chi(i, P).real > 0 else "2"
        elif d == 3 and fam == "icosahedral" and P is not None:
            sub = "1" if chi(i, P).real > 0 else "2"
        elif (d == 2 or is_pair) and P is not None and Pn:
            val = chi(i, P)
            if is_pair:
                ang = math.atan2(val.imag, val.real) / (2 * math.pi)
                k_num = int(round(abs(ang) * Pn)) % Pn
            else:
                c = max(-1.0, min(1.0, val.real / 2))
                k_num = int(round(math.acos(c) / (2 * math.pi) * Pn))
        records.append(dict(letter=letter, sub=sub, parity=parity, block=block, k=k_num, pair=is_pair,
                            conj=conj[i], P=P, dim=d))
    # E numbering: only when several E's share the same parity
    for i, rec in enumerate(records):
        if rec["letter"] == "E":
            same = {records[j]["k"] for j in range(r) if records[j]["letter"] == "E" and
                    records[j]["parity"] == rec["parity"]}
            if len(same) > 1:
                rec["sub"] = str(rec["k"])
    # pair members: 1 has chi(P) = exp(+2 pi i k / n)
    for i, rec in enumerate(records):
        if rec["pair"]:
            val = chi(i, rec["P"]) if rec["P"] is not None else 1
            rec["member"] = 1 if (val.imag > 0) else 2
    out = []
    for i, rec in enumerate(records):
        base = rec["letter"] + rec["sub"]
        par = rec["parity"]
        real_label = base + par
        member = rec.get("member")
        label = (str(member) if member else "") + real_label
        tex_sub = rec["sub"] + (par if par in ("g", "u") else "")
        tex = rec["letter"] + (f"_{{{tex_sub}}}" if tex_sub else "")
        if par == "'":
            tex += "^{\\prime}"
        elif par == "''":
            tex += "^{\\prime\\prime}"
        if member:
            tex = f"{{}}^{{{member}}}" + tex
        order = {"A": 0, "B": 1, "E": 2, "T": 3, "G": 4, "H": 5}.get(rec["letter"], 6)
        key = (rec["block"], order, int(rec["sub"]) if rec["sub"].isdigit() else 0, member or 0)
        out.append((label, tex, key, rec["conj"], real_label))
    return out
