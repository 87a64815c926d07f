"""User groups from generators, recognition of their class, and re-orientation.

Recognition
-----------
Every finite subgroup of O(3) is one of C_n, C_nv, C_nh, S_2n, D_n, D_nh,
D_nd, T, Td, Th, O, Oh, I, Ih.  :func:`recognise` finds the family from the
proper part H = {g : det g = +1} and the rotation group K = {det(g) g}:
H cyclic or dihedral of order n (or T, O, I), and whether the inversion is an
element or K is twice as large as H.  The orders of the rotations give n.

For the 32 crystallographic classes and the icosahedral groups the result
names a catalog setting: the setting whose operations are exactly the
group's, when one is; otherwise the default setting of the class and an exact
proper rotation Q with ``{g} = {Q g_std Q^T}``.  For other finite groups (a
5-fold axis, D7, ...) the names are built from the family and n ('5'/'C5',
'-14m2'/'D7h' ...), ``crystal_system`` is empty and ``setting_symbol`` is empty.
Magnetic groups (some primed operation) are named by :func:`tensym.groups.magnetic.magnetic_names`.
Float matrices (as structure files print them) are snapped to the exact group
within a tolerance by :mod:`tensym.groups.snapping`, in
:func:`group_from_generators` and :func:`reorient`.

Examples
--------
>>> from tensym.groups.recognition import group_from_generators, reorient, rotation_from_axes
>>> g = group_from_generators(["-y,x,z", "x,-y,-z"])
>>> g.symbol, g.schoenflies, g.rotation is None
('422', 'D4', True)
>>> q = rotation_from_axes(new_x=[1, -1, 0], new_z=[1, 1, 1])
>>> h = reorient("3m", q)
>>> h.operation_keys() <= reorient("m-3m", sp.eye(3)).operation_keys()
True
"""


import dataclasses

import numpy as np
import sympy as sp

from tensym.errors import GroupClosureError, InvalidOperationError, InvalidOptionError
from tensym.exact.matrices import matmul
from tensym.groups.catalog import SETTINGS, catalog_group, default_setting, setting_names
from tensym.groups.continuous import ContinuousGroup
from tensym.groups.finite import MAX_GROUP_ORDER, GroupNames, PointGroup
from tensym.groups.messages import echo
from tensym.groups.operations import HEXAGONAL_BASIS, Operation, proper_order
from tensym.groups.snapping import DEFAULT_TOL, check_tol, float_matrix, snap_float_group, snap_rotation
from tensym.groups.symbols import as_group

__all__ = [
    "group_from_generators",
    "recognise",
    "reorient",
    "rotation_from_axes",
    "rotation_about",
]

_BASES = ("cartesian", "hexagonal")
_SETTING_SYMBOLS = frozenset(s.symbol for s in SETTINGS)
_TOL = 1e-9


# --- family of a finite subgroup of O(3) --------------------------------------------
def _proper_type(orders, size):
    """('C', n), ('D', n), ('T',), ('O',) or ('I',) for a proper group."""
    m = max(orders) if orders else 1
    if m == size:
        return ("C", size)
    if size == 2 * m:
        return ("D", m)
    return {12: ("T",), 24: ("O",), 60: ("I",)}[size]


def _family(ops):
    """(hm, schoenflies, laue_hm) of a finite point group from its element orders."""
    proper = [op for op in ops if op.det == 1]
    h = _proper_type([proper_order(op._num) for op in proper], len(proper))
    centro = any(op.kind == "inversion" for op in ops)
    if len(proper) == len(ops) or centro:
        k = h
    else:
        k = _proper_type([proper_order(op.det * op._num) for op in ops], 2 * len(proper))
    laue = _name(k, k, True)[0]
    hm, sch = _name(h, k, centro)
    return hm, sch, laue


def _name(h, k, centro):
    if h == k and not centro:
        if h[0] == "C":
            return str(h[1]), f"C{h[1]}"
        if h[0] == "D":
            n = h[1]
            return (f"{n}2" if n % 2 else f"{n}22"), f"D{n}"
        return {"T": ("23", "T"), "O": ("432", "O"), "I": ("532", "I")}[h[0]]
    if centro:
        if h[0] == "C":
            n = h[1]
            if n == 1:
                return "-1", "Ci"
            if n % 2:
                return f"-{n}", ("C3i" if n == 3 else f"S{2 * n}")
            return (f"{n}/m", f"C{n}h")
        if h[0] == "D":
            n = h[1]
            if n % 2:
                return f"-{n}m", f"D{n}d"
            return ("mmm" if n == 2 else f"{n}/mmm"), f"D{n}h"
        return {"T": ("m-3", "Th"), "O": ("m-3m", "Oh"), "I": ("-5-3m", "Ih")}[h[0]]
    # no inversion, improper elements: K is twice H
    if k[0] == "C":
        n = h[1]
        if n == 1:
            return "m", "Cs"
        return f"-{2 * n}", (f"C{n}h" if n % 2 else f"S{2 * n}")
    if k[0] == "D" and h[0] == "C":
        n = h[1]
        if n == 2:
            return "mm2", "C2v"
        return (f"{n}m" if n % 2 else f"{n}mm"), f"C{n}v"
    if k[0] == "D":
        n = h[1]
        if n % 2:
            return f"-{2 * n}m2", f"D{n}h"
        return f"-{2 * n}2m", f"D{n}d"
    return "-43m", "Td"


# --- axes and frames ----------------------------------------------------------------
def _num_axis(m, det):
    p = det * m
    if np.allclose(p, np.eye(3), atol=_TOL):
        return None
    if np.trace(p) > -1 + 1e-7:
        v = np.array([p[2, 1] - p[1, 2], p[0, 2] - p[2, 0], p[1, 0] - p[0, 1]])
    else:
        q = p + np.eye(3)
        v = q[:, int(np.argmax(np.linalg.norm(q, axis=0)))]
    return v / np.linalg.norm(v)


def _axis_list(ops):
    out = []
    for op in ops:
        v = _num_axis(op._num, op.det)
        if v is not None:
            out.append(((op.det, proper_order(op.det * op._num)), v, op))
    out.sort(key=lambda t: (-t[0][1], -t[0][0]))
    return out


def _unit(v):
    return (v / sp.sqrt(_clean((v.T * v)[0]))).applyfunc(_clean)


def _frame(a, b):
    e1 = a / np.linalg.norm(a)
    b = b - np.dot(b, e1) * e1
    e2 = b / np.linalg.norm(b)
    return np.column_stack([e1, e2, np.cross(e1, e2)])


def _second(a):
    """A coordinate axis far from ``a`` (for uniaxial frames)."""
    c = np.zeros(3)
    c[int(np.argmin(np.abs(a)))] = 1.0
    return c


def _matches(q, std_nums, user_nums):
    for s in std_nums:
        t = q @ s @ q.T
        if not np.any(np.all(np.abs(user_nums - t) < 1e-8, axis=(1, 2))):
            return False
    return True


def _find_rotation(std_ops, user_ops):
    """Numeric Q and the chosen (std, user) axis pairs, or None."""
    sa = _axis_list(std_ops)
    ua = _axis_list(user_ops)
    std_nums = [op._num for op in std_ops]
    user_nums = np.array([op._num for op in user_ops])
    if not sa:
        return np.eye(3), ()
    tag1, u1, op1 = sa[0]
    second = next(((t, v, o) for t, v, o in sa if abs(abs(np.dot(v, u1)) - 1) > 1e-7), None)
    for t, v1, w1 in ua:
        if t != tag1:
            continue
        for s1 in (1.0, -1.0):
            if second is None:
                q = _frame(s1 * v1, _second(s1 * v1)) @ _frame(u1, _second(u1)).T
                if _matches(q, std_nums, user_nums):
                    return q, ((op1, u1, w1, s1 * v1),)
                continue
            tag2, u2, op2 = second
            c = np.dot(u1, u2)
            for t2, v2, w2 in ua:
                if t2 != tag2:
                    continue
                for s2 in (1.0, -1.0):
                    if abs(np.dot(s1 * v1, s2 * v2) - c) > 1e-7:
                        continue
                    q = _frame(s1 * v1, s2 * v2) @ _frame(u1, u2).T
                    if _matches(q, std_nums, user_nums):
                        return q, ((op1, u1, w1, s1 * v1), (op2, u2, w2, s2 * v2))
    return None


def _nested(x):
    return any(not p.base.is_Rational for p in x.atoms(sp.Pow) if p.exp == sp.S.Half)


def _clean(x):
    """Canonical exact entry: expanded, radicals out of denominators, nested roots undone where possible."""
    x = sp.expand(sp.sympify(x))
    if x.is_Rational:
        return x
    x = sp.expand(sp.radsimp(x))
    if _nested(x):
        x = sp.expand(sp.radsimp(sp.sqrtdenest(x)))
    return x


def _unit_axis_exact(op, sign_ref):
    """Exact unit vector along the axis of ``op``'s proper part, signed like ``sign_ref``.

    Uses R + R^T = 2 cos(t) 1 + 2 (1 - cos(t)) u u^T, so only one square root is taken.
    """
    r = sp.Matrix(op.matrix) * op.det
    c = _clean((r.trace() - 1) / 2)
    m = ((r + r.T - 2 * c * sp.eye(3)) / (2 * (1 - c))).applyfunc(_clean)
    diag = [float(m[i, i]) for i in range(3)]
    j = int(np.argmax(diag))
    root = sp.sqrt(m[j, j])
    v = sp.Matrix([_clean(m[i, j] / root) for i in range(3)])
    if float(sum(float(v[i]) * sign_ref[i] for i in range(3))) < 0:
        v = -v
    return v


def _exact_rotation(qn, std_ops, user_ops):
    """Exact Q close to the numeric ``qn`` that maps the standard operations onto the user's.

    The columns of Q are the images of x, y, z.  A coordinate axis that is an
    axis of a standard operation s is sent to the axis of the user operation
    Q s Q^T, taken exactly from that operation's matrix; a missing column comes
    from a cross product, or (for groups with a single axis, where any turn
    about it is allowed) from the nearest coordinate direction made perpendicular.
    """
    user_nums = np.array([op._num for op in user_ops])
    cols = {}
    for s in std_ops:
        ax = _num_axis(s._num, s.det)
        if ax is None:
            continue
        for i in range(3):
            if i in cols or abs(abs(ax[i]) - 1) > 1e-9:
                continue
            t = qn @ s._num @ qn.T
            hit = np.nonzero(np.all(np.abs(user_nums - t) < 1e-8, axis=(1, 2)))[0]
            cols[i] = _unit_axis_exact(user_ops[int(hit[0])], qn[:, i])
    if not cols:
        return sp.ImmutableMatrix(sp.eye(3))
    if len(cols) == 1:
        (i, v), = cols.items()
        fv = np.array([float(x) for x in v])
        c = int(np.argmin(np.abs(fv)))
        e = sp.Matrix([1 if k == c else 0 for k in range(3)])
        w = e - v[c] * v
        w = (w / sp.sqrt(_clean(1 - v[c] ** 2))).applyfunc(_clean)
        cols[(i + 1) % 3] = w
    for i in range(3):
        if i not in cols:
            cols[i] = cols[(i + 1) % 3].cross(cols[(i + 2) % 3]).applyfunc(_clean)
    return sp.ImmutableMatrix(sp.Matrix.hstack(cols[0], cols[1], cols[2]))


def _q_text(q):
    return "[" + ", ".join("[" + ", ".join(sp.sstr(x) for x in row) + "]" for row in q.tolist()) + "]"


def recognise(group):
    """The names of a group: its class, a catalog setting and the rotation relating them.

    Parameters
    ----------
    group : PointGroup, ContinuousGroup or str

    Returns
    -------
    GroupNames
        For a crystallographic or icosahedral group: the symbols, crystal system
        and Laue class of its class; ``setting_symbol`` is the catalog setting
        with exactly the same operations when there is one (``rotation`` None),
        else the class's default setting with ``rotation`` the exact proper Q such
        that ``{g} = {Q g_std Q^T}``.  For other finite groups the symbols come
        from the family (e.g. '5'/'C5'), other fields empty.  A continuous group
        keeps its own names; a magnetic group gets its magnetic names
        (``tensym.groups.magnetic.magnetic_names``).

    Examples
    --------
    >>> from tensym.groups.finite import PointGroup
    >>> g = PointGroup.from_generators([Operation.from_triplet("y,x,z"), Operation.from_triplet("-x,-y,z")])
    >>> n = recognise(g)
    >>> n.hm, n.setting_symbol, n.rotation
    ('mm2', 'mm2', Matrix([
    [ sqrt(2)/2, sqrt(2)/2, 0],
    [-sqrt(2)/2, sqrt(2)/2, 0],
    [         0,         0, 1]]))
    """
    group = as_group(group)
    if isinstance(group, ContinuousGroup):
        return group.names
    ops = group.operations
    if any(op.time_reversal for op in ops):
        from tensym.groups.magnetic import magnetic_names  # magnetic groups are named there

        return magnetic_names(group)
    hm, sch, laue = _family(ops)
    rows = [s for s in SETTINGS if s.hm == hm]
    if not rows:
        return GroupNames(hm=hm, full_hm=hm, schoenflies=sch, laue_class=laue,
                          setting=_generic_setting(ops))
    keys = group.operation_keys()
    for row in rows:
        if catalog_group(row.symbol).operation_keys() == keys:
            return catalog_group(row.symbol).names
    std = catalog_group(default_setting(hm))
    found = _find_rotation(std.operations, ops)
    if found is None:  # pragma: no cover - every group of a class is conjugate to its standard
        raise GroupClosureError(f"no rotation relates this group to the standard {hm} setting")
    qn, _ = found
    q = _exact_rotation(qn, std.operations, ops)
    qf = np.array([[float(x) for x in row] for row in q.tolist()], dtype=np.float64)
    if not (np.allclose(qf @ qf.T, np.eye(3), atol=1e-12)
            and _matches(qf, [o._num for o in std.operations], np.array([o._num for o in ops]))):
        raise GroupClosureError(  # pragma: no cover - a failure here is a bug
            f"internal error: the exact rotation relating this group to {hm} does not check"
        )
    words = f"{std.names.setting}; re-oriented: g = Q g_std Q^T with Q = {_q_text(q)}"
    return setting_names(next(s for s in SETTINGS if s.symbol == std.setting_symbol), rotation=q, words=words)


def _generic_setting(ops):
    ax = _axis_list(ops)
    if not ax:
        return ""
    op = ax[0][2]
    return f"principal axis along [{', '.join(sp.sstr(x) for x in op.axis)}]"


# --- building groups ----------------------------------------------------------------
def _to_operation(item, basis):
    if isinstance(item, Operation):
        return item
    if isinstance(item, str):
        return Operation.from_triplet(item, basis=basis)
    if basis != "cartesian":
        arr = np.asarray(item, dtype=object)
        if arr.shape == (3, 3):
            w = sp.Matrix(arr.tolist())
            item = HEXAGONAL_BASIS * w * HEXAGONAL_BASIS.inv()
    return Operation.from_matrix(item)


def group_from_generators(generators, *, basis="cartesian", tol=DEFAULT_TOL):
    """The finite group generated by operations, triplets or 3x3 matrices, recognised and named.

    Parameters
    ----------
    generators : sequence of (Operation, str or 3x3 matrix), or one str
        Triplets such as ``'-y,x-y,z'``; matrices with exact entries (integers,
        sympy numbers such as ``sqrt(3)/2``, strings like ``'1/2'``) or float
        matrices (rotation parts as a structure file prints them, e.g. ``0.8660254``),
        which are snapped to the exact group they approximate within ``tol``
        (see :mod:`tensym.groups.snapping`).  A single string is read as one triplet.
    basis : {'cartesian', 'hexagonal'}
        Basis of the triplets and matrices (hexagonal: a = (1, 0, 0),
        b = (-1/2, sqrt(3)/2, 0), c = z); Operations are always Cartesian.
    tol : float
        For float matrices only: the largest difference allowed between a given
        entry and the exact one, absolute, on matrix entries of the Cartesian
        matrices (default 1e-4: entries printed with 4 or more digits).

    Returns
    -------
    PointGroup
        With names from :func:`recognise`.

    Raises
    ------
    InvalidOptionError
        If ``basis`` is not one of the names above.
        If ``tol`` is not a real number from 1e-12 to 1e-2.
    InvalidOperationError
        For a malformed triplet, a non-3x3 matrix, a non-orthogonal one (float
        matrices: farther than ``tol`` from orthogonal), symbolic or boolean entries,
        or float matrices mixed with primed operations.
    GroupClosureError
        When the generators give an infinite group or one of order above
        MAX_GROUP_ORDER (240): a rotation angle that is not 360/n degrees, or
        axes that do not fit together; or time-reversal marks (a trailing ``,-1``)
        that contradict each other (see ``tensym.groups.magnetic``); for float
        matrices, when no finite group of the catalog lies within ``tol`` (the
        message gives the largest deviation found).

    Examples
    --------
    >>> g = group_from_generators(["-y,x-y,z", "x-y,-y,-z"], basis="hexagonal")
    >>> g.setting_symbol, g.order
    ('321', 6)
    >>> h = group_from_generators([[[0.6, -0.8, 0], [0.8, 0.6, 0], [0, 0, 1]]])
    Traceback (most recent call last):
    ...
    tensym.errors.GroupClosureError: the float operations are not within tol=0.0001 ...
    >>> group_from_generators([[[-0.5, -0.866025, 0], [0.866025, -0.5, 0], [0, 0, -1]]]).symbol
    '-6'
    """
    if basis not in _BASES:
        raise InvalidOptionError(f"basis={echo(basis)} is not one of {_BASES}")
    if isinstance(generators, (str, Operation)):
        generators = [generators]
    try:
        items = list(generators)
    except TypeError as exc:
        raise InvalidOperationError(
            f"generators must be a sequence of Operations, triplets or 3x3 matrices, got {echo(generators)}"
        ) from exc
    tol = check_tol(tol)
    floats = [None if isinstance(g, (str, Operation)) else float_matrix(g) for g in items]
    if any(f is not None for f in floats):
        return _float_group(items, floats, basis, tol)
    gens = [_to_operation(g, basis) for g in items]
    if any(g.time_reversal for g in gens):
        from tensym.groups.magnetic import magnetic_group_from_generators  # checks the marks, names the group

        return magnetic_group_from_generators(gens)
    g = PointGroup.from_generators(gens, limit=MAX_GROUP_ORDER)
    return PointGroup(g.operations, gens, recognise(g))


def _float_group(items, floats, basis, tol):
    """group_from_generators for float matrices: every generator as a float matrix, snapped together."""
    a = np.array(HEXAGONAL_BASIS.evalf(20).tolist(), dtype=np.float64)
    mats = []
    for item, f in zip(items, floats):
        if f is None:
            op = _to_operation(item, basis)
            if op.time_reversal:
                raise InvalidOperationError(
                    "float matrices cannot be combined with primed operations (time reversal); give every "
                    "generator exactly (triplets with a trailing ,-1 or Operations) for a magnetic group"
                )
            mats.append(op._num)
        else:
            mats.append(a @ f @ np.linalg.inv(a) if basis == "hexagonal" else f)
    return snap_float_group(mats, tol=tol)


def _exact_rotation_arg(rotation, what="rotation"):
    if isinstance(rotation, Operation):
        rotation = rotation.matrix
    try:
        op = Operation.from_matrix(rotation)
    except InvalidOperationError as exc:
        hint = ""
        if "symbolic" in str(exc):
            hint = ("; a group is turned by a numeric rotation only - to turn a tensor form by a symbolic "
                    "rotation use TensorForm.rotated(R)")
        raise InvalidOperationError(f"{what}: {exc}{hint}") from exc
    if op.det != 1:
        raise InvalidOperationError(
            f"{what} {op.matrix.tolist()} is improper (det = -1); give a proper rotation (det = +1)"
        )
    return op.matrix


def reorient(group, rotation, *, tol=DEFAULT_TOL):
    """The group ``Q G Q^T``: every symmetry element turned by the exact rotation Q.

    Parameters
    ----------
    group : PointGroup, ContinuousGroup or str
    rotation : 3x3 matrix or Operation
        Exact proper rotation Q (columns: the images of x, y, z); see
        :func:`rotation_from_axes` and :func:`rotation_about`.  A float matrix
        (e.g. ``0.8660254``) is snapped to an exact rotation within ``tol``
        (rational entries, unit columns along integer directions, or entries
        (p + q sqrt(m))/r; see :mod:`tensym.groups.snapping`); when none is that
        close, the turned operations are snapped as a group (within ``3 tol``),
        which only needs the symmetry elements, not the whole frame, to be exact.
    tol : float
        For a float rotation only: the largest difference allowed between its
        entries and the exact ones (absolute, on matrix entries; default 1e-4).

    Returns
    -------
    PointGroup or ContinuousGroup
        Names record the rotation: when the turned group is exactly a catalog
        setting it carries that setting's names; otherwise the names of the
        original setting with ``rotation`` = Q times the original rotation.

    Raises
    ------
    InvalidOperationError
        If Q is not a 3x3 orthogonal matrix (a float one: within ``tol``), is improper,
        or has symbolic entries (turn a tensor form instead: ``TensorForm.rotated``).
    GroupClosureError
        For a float Q near no exact rotation and a turned group near no exact group.
    InvalidOptionError
        For a bad ``tol``.
    UnknownGroupError, InvalidGroupError
        For a bad ``group`` argument.

    Examples
    --------
    >>> q = rotation_about([0, 0, 1], sp.pi / 2)
    >>> reorient("321", q).setting_symbol
    '312'
    >>> reorient("321", [[0.0, -1.0, 0.0], [1.0, 0.0, 0.0], [0.0, 0.0, 1.0]]).setting_symbol
    '312'
    >>> reorient("m-3m", [[0.6, -0.8, 0], [0.8, 0.6, 0], [0, 0, 1]]).rotation
    Matrix([
    [3/5, -4/5, 0],
    [4/5,  3/5, 0],
    [  0,    0, 1]])
    """
    g = as_group(group)
    tol = check_tol(tol)
    fq = None if isinstance(rotation, Operation) else float_matrix(rotation)
    if fq is not None:
        return _reorient_float(g, fq, tol)
    q = _exact_rotation_arg(rotation)
    old = g.names
    total = q if old.rotation is None else sp.ImmutableMatrix(matmul(q, old.rotation))
    if isinstance(g, ContinuousGroup):
        words = f"{old.setting}; re-oriented by Q = {_q_text(total)}"
        return g.conjugated(q, names=dataclasses.replace(old, rotation=total, setting=words))
    turned = g.conjugated(q)
    if not old.setting_symbol:
        return PointGroup(turned.operations, turned.generators, recognise(turned))
    if old.setting_symbol not in _SETTING_SYMBOLS:  # e.g. a magnetic group's own names
        words = f"{old.setting}; re-oriented by Q = {_q_text(total)}"
        return PointGroup(turned.operations, turned.generators,
                          dataclasses.replace(old, rotation=total, setting=words))
    keys = turned.operation_keys()
    for row in SETTINGS:
        if row.hm == old.hm and catalog_group(row.symbol).operation_keys() == keys:
            return PointGroup(turned.operations, turned.generators, catalog_group(row.symbol).names)
    base = next(s for s in SETTINGS if s.symbol == old.setting_symbol)
    words = f"{base.setting}; re-oriented: g = Q g_std Q^T with Q = {_q_text(total)}"
    return PointGroup(turned.operations, turned.generators, setting_names(base, rotation=total, words=words))


def _reorient_float(g, fq, tol):
    """reorient by a float rotation: snap Q itself, else snap the turned group."""
    u, _, vt = np.linalg.svd(fq)
    polar = u @ vt
    dev = float(np.max(np.abs(fq - polar)))
    if dev > tol:
        raise InvalidOperationError(
            f"rotation is not orthogonal within tol={tol:g} (absolute, on matrix entries): its entries are "
            f"{dev:.2e} from the nearest orthogonal matrix"
        )
    if np.linalg.det(polar) < 0:
        raise InvalidOperationError("rotation is improper (det = -1); give a proper rotation (det = +1)")
    q = snap_rotation(polar, tol)
    if q is not None:
        qdev = float(np.max(np.abs(np.array(q.evalf(20).tolist(), dtype=np.float64) - fq)))
        if qdev <= tol:
            out = reorient(g, q)
            words = f"{out.names.setting}; rotation snapped from floats (largest deviation {qdev:.1e}, tol {tol:g})"
            names = dataclasses.replace(out.names, setting=words)
            if isinstance(out, ContinuousGroup):
                return out.conjugated(sp.eye(3), names=names)
            return PointGroup(out.operations, out.generators, names)
    if isinstance(g, ContinuousGroup) or g.is_magnetic:
        raise GroupClosureError(
            f"no exact rotation lies within tol={tol:g} of the float rotation (rational entries, unit columns "
            "along integer directions or (p + q sqrt(m))/r); give it exactly (tensym.rotation_about, "
            "tensym.rotation_from_axes)"
            + (" - a continuous group needs the exact frame" if isinstance(g, ContinuousGroup)
               else " - a magnetic group is snapped through its rotation only")
        )
    turned = [polar @ op._num @ polar.T for op in g.operations]
    return snap_float_group(turned, tol=min(1e-2, 3 * tol))


# --- exact rotations ------------------------------------------------------------------
def _exact_vector(v, name):
    try:
        arr = list(v)
    except TypeError as exc:
        raise InvalidOperationError(f"{name} must be a 3-vector, got {echo(v)}") from exc
    if len(arr) != 3:
        raise InvalidOperationError(f"{name} must have 3 components, got {len(arr)}")
    out = []
    for x in arr:
        if isinstance(x, (float, np.floating)):
            if not float(x).is_integer():
                raise InvalidOperationError(
                    f"{name} has the float component {echo(x)}; give exact numbers (integers, '1/2', sqrt(3))"
                )
            x = int(x)
        try:
            out.append(sp.sympify(x))
        except (sp.SympifyError, TypeError) as exc:
            raise InvalidOperationError(f"cannot read component {echo(x)} of {name}") from exc
    m = sp.Matrix(out)
    if all(sp.simplify(x) == 0 for x in m):
        raise InvalidOperationError(f"{name} is the zero vector")
    return m


def rotation_from_axes(*, new_x=None, new_y=None, new_z=None):
    """An exact rotation from the directions the x, y, z axes are turned to.

    Give two (perpendicular) directions, or all three; they are normalised
    exactly (with sqrt) and the missing one completes a right-handed frame.

    Parameters
    ----------
    new_x, new_y, new_z : sequence of 3 exact numbers, optional
        Images of the x, y and z axes (any length; integers, rationals, sympy numbers).

    Returns
    -------
    sympy.ImmutableMatrix
        Q with columns the unit images of x, y, z (so ``Q e_x`` is along ``new_x``).

    Raises
    ------
    InvalidOperationError
        Fewer than two directions, float or zero vectors, directions that are
        not perpendicular, or three that form a left-handed frame.

    Examples
    --------
    >>> rotation_from_axes(new_x=[1, 1, 0], new_z=[0, 0, 1])
    Matrix([
    [sqrt(2)/2, -sqrt(2)/2, 0],
    [sqrt(2)/2,  sqrt(2)/2, 0],
    [        0,          0, 1]])
    """
    given = {k: _exact_vector(v, k) for k, v in (("new_x", new_x), ("new_y", new_y), ("new_z", new_z))
             if v is not None}
    if len(given) < 2:
        raise InvalidOperationError(
            "rotation_from_axes needs at least two of new_x, new_y, new_z (perpendicular directions)"
        )
    names = list(given)
    for i in range(len(names)):
        for j in range(i + 1, len(names)):
            d = sp.simplify((given[names[i]].T * given[names[j]])[0])
            if d != 0:
                raise InvalidOperationError(f"{names[i]} and {names[j]} are not perpendicular (dot product {d})")
    u = {k: _unit(v) for k, v in given.items()}
    if "new_x" not in u:
        u["new_x"] = u["new_y"].cross(u["new_z"]).applyfunc(_clean)
    elif "new_y" not in u:
        u["new_y"] = u["new_z"].cross(u["new_x"]).applyfunc(_clean)
    elif "new_z" not in u:
        u["new_z"] = u["new_x"].cross(u["new_y"]).applyfunc(_clean)
    q = sp.Matrix.hstack(u["new_x"], u["new_y"], u["new_z"])
    if sp.simplify(q.det()) != 1:
        raise InvalidOperationError("new_x, new_y, new_z form a left-handed frame; reverse one of them")
    return sp.ImmutableMatrix(q)


def rotation_about(axis, angle):
    """The exact rotation by ``angle`` (radians, counter-clockwise) about ``axis``.

    Parameters
    ----------
    axis : sequence of 3 exact numbers
    angle : sympy expression
        Exact angle in radians, e.g. ``sympy.pi / 3`` (floats are refused).

    Returns
    -------
    sympy.ImmutableMatrix
        ``cos(t) 1 + sin(t) [u]_x + (1 - cos(t)) u u^T`` with u the unit axis.

    Raises
    ------
    InvalidOperationError
        For a float angle, or a float or zero axis.

    Examples
    --------
    >>> rotation_about([0, 0, 1], sp.pi / 2)
    Matrix([
    [0, -1, 0],
    [1,  0, 0],
    [0,  0, 1]])
    """
    if isinstance(angle, (float, np.floating)) or (isinstance(angle, sp.Basic) and angle.has(sp.Float)):
        raise InvalidOperationError(f"angle {echo(angle)} is a float; give an exact angle such as sympy.pi/3")
    try:
        t = sp.sympify(angle)
    except (sp.SympifyError, TypeError) as exc:
        raise InvalidOperationError(f"cannot read angle {echo(angle)}") from exc
    u = _unit(_exact_vector(axis, "axis"))
    c, s = sp.cos(t), sp.sin(t)
    ux = sp.Matrix([[0, -u[2], u[1]], [u[2], 0, -u[0]], [-u[1], u[0], 0]])
    r = c * sp.eye(3) + s * ux + (1 - c) * (u * u.T)
    return sp.ImmutableMatrix(r.applyfunc(_clean))
