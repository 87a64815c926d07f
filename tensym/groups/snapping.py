"""Float operations snapped to an exact group: rotation parts as a DFT code or structure file prints them.

Operations read from a file are floats rounded to a few digits (``0.8660254``,
``-0.5``).  :func:`snap_float_group` finds the exact group they come from:

1. each matrix is checked to be orthogonal within ``tol`` (its distance to the
   nearest orthogonal matrix, the polar factor U V^T of its SVD);
2. the matrices are closed numerically into a finite group (elements equal
   when all entries agree within ``min(0.05, max(100 tol, 1e-6))``, far below the
   spacing of the elements of a catalog group) and the closure is refined to a
   consistent representation by the averaging map
   ``R_g <- polar((1/|G|) sum_h R_{gh} R_h^T)`` (it converges quadratically,
   D. Kazhdan, Israel J. Math. 43, 315 (1982); a few steps reach 1e-15);
3. the class is recognised from that representation; when the operations are
   those of a catalog setting within ``tol``, that setting is the answer;
4. otherwise, for each catalog setting of the class (the default first), a
   numeric rotation Q_num to it is found (as in :mod:`tensym.groups.recognition`)
   and refined by least squares over every given matrix; then exact rotations
   near Q_num are tried, simplest first.  A group with a single axis needs only
   that axis: a rational unit vector, one with entries (p + q sqrt(m))/r, or an
   integer direction.  Otherwise Q_num times each proper operation of the
   holohedry (432, 622 or 532: the turns that keep the standard group's
   elements as a set) is snapped to rational entries p/r, to entries
   (p + q sqrt(m))/r with m in 2, 3, 5, 6, 10, 15 and r <= 12, or to unit columns
   along integer directions (entries such as 1/sqrt(14)); the size of a
   candidate is its largest denominator (or direction entry);
5. the exact group ``Q G_std Q^T`` is accepted when every given matrix lies
   within ``tol`` of one of its operations, entry by entry.  When no candidate
   is found, the error says so and shows Q_num.

``tol`` is absolute, on matrix entries: each given entry may differ from the
exact one by at most ``tol`` (default 1e-4, enough for entries printed with 4
or more digits; rounding to d digits makes errors up to 0.5 * 10**-d).  The
denominators tried grow as the tolerance shrinks, so that a chance match
stays unlikely: rational entries p/r with r up to ``sqrt(1 / (4 tol))`` (50 for
tol = 1e-4, 5000 for 1e-8; rationals that close are 4 tol apart or more),
integer directions with entries up to ``(0.005 / (2 tol)**2)**(1/3)`` (50 for
1e-4), and up to ``sqrt(0.05 / (2 tol))`` (15 for 1e-4) for a direction in a
coordinate plane, where directions are denser; all at most 10**4.  Data
printed with d digits fit ``tol = 10**-d``; frames outside these families (a
turn by pi/7, or by pi/5 about x, whose sine is a nested radical) are refused
with a message, not snapped to a far-fetched neighbour.

Cost: the closure and refinement are O(|G|^2) float products (|G| <= 120);
the snap of an icosahedral group in an irrational frame takes about 0.6 s,
a crystallographic one a few tens of milliseconds.

Examples
--------
>>> import numpy as np
>>> g = snap_float_group([np.array([[0.5, -0.8660254, 0], [0.8660254, 0.5, 0], [0, 0, 1]])])
>>> g.setting_symbol, g.order
('6', 6)
"""

import dataclasses
import math

import numpy as np
import sympy as sp

from tensym.errors import GroupClosureError, InvalidOperationError, InvalidOptionError
from tensym.groups.catalog import SETTINGS, catalog_group
from tensym.groups.finite import MAX_GROUP_ORDER, PointGroup
from tensym.groups.messages import echo
from tensym.groups.quadratic import is_orthogonal_mq, mq_matrix

__all__ = ["DEFAULT_TOL", "snap_float_group", "snap_rotation", "float_matrix", "check_tol"]

#: Default tolerance of float operations: absolute, on matrix entries.
DEFAULT_TOL = 1e-4
_TOL_RANGE = (1e-12, 1e-2)
_RADICALS = (2, 3, 5, 6, 10, 15)
_QUADRATIC_DENOMINATORS = 12


def check_tol(tol):
    """``tol`` as a float, or InvalidOptionError (a real number from 1e-12 to 1e-2)."""
    if isinstance(tol, (bool, np.bool_)) or not isinstance(tol, (int, float, np.integer, np.floating)):
        raise InvalidOptionError(
            f"tol={echo(tol)} must be a real number from {_TOL_RANGE[0]:g} to {_TOL_RANGE[1]:g} "
            "(absolute, on matrix entries)"
        )
    t = float(tol)
    if not (_TOL_RANGE[0] <= t <= _TOL_RANGE[1]):
        raise InvalidOptionError(
            f"tol={t:g} is outside {_TOL_RANGE[0]:g}..{_TOL_RANGE[1]:g} (absolute, on matrix entries)"
        )
    return t


def float_matrix(item):
    """A float (3, 3) array when ``item`` is a matrix with some non-integer float entry, else None.

    Matrices of integers (also integer-valued floats) and exact entries take the exact path.
    """
    if isinstance(item, (str, bytes)) or hasattr(item, "time_reversal"):
        return None
    try:
        arr = np.asarray(item)
    except Exception:  # pragma: no cover - numpy reads almost anything
        return None
    if arr.shape != (3, 3):
        return None
    if arr.dtype.kind == "f":
        vals = arr.ravel().tolist()
    elif arr.dtype == object:
        vals = arr.ravel().tolist()
        if not any(isinstance(v, (float, np.floating)) or (isinstance(v, sp.Float)) for v in vals):
            return None
        if not all(isinstance(v, (int, float, np.integer, np.floating, sp.Integer, sp.Float, sp.Rational))
                   and not isinstance(v, (bool, np.bool_)) for v in vals):
            return None
    else:
        return None
    try:
        out = np.array([float(v) for v in vals], dtype=np.float64).reshape(3, 3)
    except (TypeError, ValueError):  # pragma: no cover - filtered above
        return None
    if not np.all(np.isfinite(out)):
        raise InvalidOperationError(f"matrix {echo(arr.tolist())} has a non-finite entry (nan or inf)")
    if np.all(out == np.rint(out)):
        return None
    return out


def _polar(m):
    u, _, vt = np.linalg.svd(m)
    return u @ vt


# --- numeric closure and refinement -------------------------------------------------------
class _NumOp:
    """A float operation with the attributes the recognition kernels read (``_num``, ``det``, ``kind``)."""

    time_reversal = False

    def __init__(self, num):
        self._num = num
        self.det = 1 if np.linalg.det(num) > 0 else -1

    @property
    def kind(self):
        if self.det == 1:
            return "identity" if np.allclose(self._num, np.eye(3), atol=1e-9) else "rotation"
        if np.allclose(self._num, -np.eye(3), atol=1e-9):
            return "inversion"
        return "mirror" if abs(np.trace(self._num) - 1) < 1e-9 else "rotoinversion"


def _find(ops, p, tol):
    d = np.max(np.abs(ops - p), axis=(1, 2))
    i = int(np.argmin(d))
    return i if d[i] < tol else None


def _close(gens, match):
    ops = np.empty((MAX_GROUP_ORDER, 3, 3))
    ops[0] = np.eye(3)
    n = 1
    frontier = [0]
    while frontier:
        new = []
        for i in frontier:
            for g in gens:
                p = g @ ops[i]
                if _find(ops[:n], p, match) is None:
                    if n >= MAX_GROUP_ORDER:
                        return None
                    ops[n] = p
                    new.append(n)
                    n += 1
        frontier = new
    return ops[:n].copy()


def _table(ops, match):
    """Cayley table of float matrices (``table[a, b]`` the index of ops[a] @ ops[b]), or None."""
    n = len(ops)
    table = np.empty((n, n), dtype=int)
    for a in range(n):
        prods = np.einsum("ij,bjk->bik", ops[a], ops)
        d = np.max(np.abs(prods[:, None] - ops[None]), axis=(2, 3))  # (b, candidate)
        k = np.argmin(d, axis=1)
        if np.any(d[np.arange(n), k] >= match):
            return None
        table[a] = k
    return table


def _refine(ops, match):
    """Kazhdan's averaging until the multiplication table holds to 1e-12; None if it is no group table."""
    n = len(ops)
    table = _table(ops, match)
    if table is None or any(len(set(row)) != n for row in table.tolist()):
        return None
    for _ in range(30):
        prods = np.einsum("aij,bjk->abik", ops, ops)
        err = float(np.max(np.abs(prods - ops[table])))
        if err < 1e-12:
            return ops
        new = np.einsum("ahij,hkj->aik", ops[table], ops) / n
        ops = np.array([_polar(m) for m in new])
    return None  # pragma: no cover - the averaging converges quadratically for a group table


# --- exact numbers near floats ---------------------------------------------------------------
def _max_denominator(tol):
    """Largest denominator of a rational entry: rationals p/r with r below it are 4 tol apart or more."""
    return int(min(10**4, max(4, math.sqrt(1 / (4 * tol)))))


def _max_direction(tol):
    """Largest entry of an integer direction: about 0.01 such directions fall within 2 tol of a given one."""
    return int(min(10**4, max(4, (0.005 / (2 * tol) ** 2) ** (1 / 3))))


def _max_plane_direction(tol):
    """Largest entry of an integer direction in a coordinate plane (at most about 0.1 chance matches, in 2D)."""
    return int(min(10**4, max(2, math.sqrt(0.05 / (2 * tol)))))


def _rational(x, tol, rmax):
    r = np.arange(1, rmax + 1)
    p = np.rint(x * r)
    ok = np.nonzero(np.abs(x - p / r) <= tol)[0]
    if not len(ok):
        return None
    k = int(ok[0])
    return sp.Rational(int(p[k]), int(r[k]))


def _quadratic_table():
    rows = [(r, m, q) for r in range(1, _QUADRATIC_DENOMINATORS + 1) for m in _RADICALS
            for q in sorted(range(-r, r + 1), key=abs) if q]
    a = np.array(rows, dtype=np.float64)
    return rows, a[:, 0], a[:, 2] * np.sqrt(a[:, 1])


_QTABLE = _quadratic_table()


def _quadratic(x, tol):
    """The entry (p + q sqrt(m))/r within ``tol`` of ``x`` with the smallest r (r <= 12), or None."""
    rows, r, qs = _QTABLE
    p = np.rint(x * r - qs)
    ok = np.nonzero(np.abs(x - (p + qs) / r) <= tol)[0]
    if not len(ok):
        return None
    k = int(ok[0])
    rr, m, q = rows[k]
    return rr, (sp.Integer(int(p[k])) + q * sp.sqrt(m)) / rr


def _entry(x, tol, rmax, quadratic):
    """(size, exact entry) within ``tol`` of ``x``: a rational p/r (size r) or, with ``quadratic``,
    the simpler of that and (p + q sqrt(m))/r (size r + 1/2); None when neither is close."""
    v = _rational(x, tol, rmax)
    best = None if v is None else (int(v.q), v)
    if quadratic:
        w = _quadratic(x, tol)
        if w is not None and (best is None or w[0] + 0.5 < best[0]):
            best = (w[0] + 0.5, w[1])
    return best


def _proper_orthogonal(q):
    qm = mq_matrix(q)
    if qm is None or not is_orthogonal_mq(qm):
        return False
    return float(np.linalg.det(np.array(q.evalf(20).tolist(), dtype=float))) > 0


def _by_entries(qn, tol, quadratic):
    """(size, Q) with each entry the simplest exact number near that of ``qn``, if Q is a rotation; else None."""
    rmax = _max_denominator(tol)
    entries = [_entry(float(x), tol, rmax, quadratic) for x in qn.ravel()]
    if any(e is None for e in entries):
        return None
    q = sp.ImmutableMatrix(3, 3, [e[1] for e in entries])
    return (max(e[0] for e in entries), q) if _proper_orthogonal(q) else None


def _integer_direction(u, tol, dmax):
    """The integer vector with the smallest largest entry whose direction is within ``tol`` of unit ``u``.

    A direction in a coordinate plane is a 2D problem, where directions of a given size are
    denser: its largest entry is held to ``sqrt(0.05 / (2 tol))`` (:func:`_max_plane_direction`).
    """
    k = int(np.argmax(np.abs(u)))
    d = np.arange(1, dmax + 1)[:, None]
    v = np.rint(u / abs(u[k]) * d)
    err = np.max(np.abs(v / np.linalg.norm(v, axis=1)[:, None] - u), axis=1)
    ok = np.nonzero(err <= tol)[0]
    if not len(ok):
        return None
    out = [int(x) for x in v[int(ok[0])]]
    if out.count(0) == 1 and max(abs(x) for x in out) > _max_plane_direction(tol):
        return None
    return out


def _unit(v):
    return sp.Matrix(v) / sp.sqrt(sum(x * x for x in v))


def _by_directions(qn, tol):
    """(size, Q) with columns x and z along integer directions near those of ``qn`` (exactly perpendicular)."""
    dmax = _max_direction(tol)
    vx = _integer_direction(qn[:, 0], tol, dmax)
    vz = _integer_direction(qn[:, 2], tol, dmax)
    if vx is None or vz is None or sum(a * b for a, b in zip(vx, vz)) != 0:
        return None
    ex, ez = _unit(vx), _unit(vz)
    ey = ez.cross(ex)
    q = sp.ImmutableMatrix(sp.Matrix.hstack(ex, ey, ez).applyfunc(lambda e: sp.expand(sp.radsimp(e))))
    return (max(abs(x) for x in vx + vz), q) if _proper_orthogonal(q) else None


def _candidates(qn, tol):
    """Every exact rotation near ``qn`` the three kinds of snap give, simplest (smallest size) first."""
    found = [c for c in (_by_entries(qn, tol, False), _by_entries(qn, tol, True), _by_directions(qn, tol))
             if c is not None]
    return sorted(found, key=lambda c: c[0])


def _exact_unit(u, tol):
    """The simplest exact unit vector within ``tol`` of ``u``: rational, quadratic entries or an integer direction."""
    found = []
    for quadratic in (False, True):
        entries = [_entry(float(x), tol, _max_denominator(tol), quadratic) for x in u]
        if all(e is not None for e in entries) and sp.expand(sum(e[1] ** 2 for e in entries)) == 1:
            found.append((max(e[0] for e in entries), sp.Matrix([e[1] for e in entries])))
    v = _integer_direction(u, tol, _max_direction(tol))
    if v is not None:
        found.append((max(abs(x) for x in v), _unit(v)))
    return min(found, key=lambda c: c[0])[1] if found else None


def _by_axis(u, column, tol):
    """An exact rotation whose ``column`` is an exact unit vector near ``u`` (for single-axis groups)."""
    a = _exact_unit(u, tol)
    if a is None:
        return None
    c = min(range(3), key=lambda i: abs(float(a[i])))
    e = sp.Matrix([1 if i == c else 0 for i in range(3)])
    b = e - a[c] * a
    b = (b / sp.sqrt(sp.expand(1 - a[c] ** 2))).applyfunc(lambda t: sp.expand(sp.radsimp(t)))
    third = a.cross(b).applyfunc(lambda t: sp.expand(sp.radsimp(t)))
    cols = {column: a, (column + 1) % 3: b, (column + 2) % 3: third}
    q = sp.ImmutableMatrix(sp.Matrix.hstack(cols[0], cols[1], cols[2]))
    return q if _proper_orthogonal(q) else None


def snap_rotation(qn, tol):
    """The simplest exact proper rotation within ``tol`` of the float rotation ``qn`` (entries), or None.

    Candidates: rational entries, entries (p + q sqrt(m))/r, and unit columns along integer
    directions; the one with the smallest denominators (or direction entries) wins.

    Examples
    --------
    >>> snap_rotation(np.array([[0.6, -0.8, 0], [0.8, 0.6, 0], [0, 0, 1.0]]), 1e-4)
    Matrix([
    [3/5, -4/5, 0],
    [4/5,  3/5, 0],
    [  0,    0, 1]])
    """
    for _, q in _candidates(qn, tol):
        if np.max(np.abs(np.array(q.evalf(20).tolist(), dtype=np.float64) - qn)) <= tol:
            return q
    return None


# --- the public edge ---------------------------------------------------------------------------
def _fit(qn, std_nums, given):
    """Q near ``qn`` that best fits ``Q S_g Q^T = M_g`` over every given matrix (least squares, Gauss-Newton).

    S_g is the standard operation that ``qn`` sends nearest to M_g.  With Q = exp([w]_x) Q0 the
    residual is linear in w to first order: M - A = W A - A W, A = Q0 S Q0^T.
    """
    q = qn.copy()
    for _ in range(4):
        rows, rhs = [], []
        turned = np.einsum("ij,ajk,lk->ail", q, std_nums, q)
        for m in given:
            a = turned[int(np.argmin(np.max(np.abs(turned - m), axis=(1, 2))))]
            for k in range(3):
                w = np.zeros(3)
                w[k] = 1.0
                wx = np.array([[0, -w[2], w[1]], [w[2], 0, -w[0]], [-w[1], w[0], 0]])
                rows.append((wx @ a - a @ wx).ravel())
            rhs.append((m - a).ravel())
        jac = np.array(rows).reshape(len(given), 3, 9).transpose(0, 2, 1).reshape(-1, 3)
        w = np.linalg.lstsq(jac, np.concatenate(rhs), rcond=None)[0]
        t = float(np.linalg.norm(w))
        if t < 1e-15:
            break
        k = w / t
        kx = np.array([[0, -k[2], k[1]], [k[2], 0, -k[0]], [-k[1], k[0], 0]])
        q = (np.eye(3) + math.sin(t) * kx + (1 - math.cos(t)) * kx @ kx) @ q
    return q


def _single_axis_column(std):
    """Index of the coordinate axis carrying every axis of ``std`` when it has one axis only, else None."""
    from tensym.groups.recognition import _num_axis

    axes = [a for a in (_num_axis(op._num, op.det) for op in std.operations) if a is not None]
    if not axes:
        return -1
    first = axes[0]
    if any(abs(abs(float(np.dot(first, a))) - 1) > 1e-9 for a in axes):
        return None
    return int(np.argmax(np.abs(first)))


def _holohedry(std):
    family = std.crystal_system
    symbol = {"trigonal": "622", "hexagonal": "622", "icosahedral": "532"}.get(family, "432")
    return [op._num for op in catalog_group(symbol).operations]


def _deviation(exact_nums, given):
    """Largest entry difference between a given matrix and the nearest exact operation (0 for none given)."""
    return max([0.0] + [float(np.min(np.max(np.abs(exact_nums - g), axis=(1, 2)))) for g in given])


def _not_a_group(tol, worst, what):
    return GroupClosureError(
        f"the float operations are not within tol={tol:g} (absolute, on matrix entries) of a finite point "
        f"group: {what}; give exact matrices, more digits, or a larger tol"
        + (f" (largest deviation found {worst:.2e})" if worst is not None else "")
    )


def snap_float_group(matrices, *, tol=DEFAULT_TOL):
    """The exact group whose operations the float matrices approximate within ``tol``.

    Parameters
    ----------
    matrices : sequence of (3, 3) float arrays
        Cartesian rotation parts (proper or improper), e.g. printed with 4-8 digits.
    tol : float
        Largest difference allowed between a given entry and the exact one
        (absolute, on matrix entries); from 1e-12 to 1e-2, default 1e-4.

    Returns
    -------
    PointGroup
        Exact operations with the names of :func:`tensym.recognise`; ``setting`` ends
        with a sentence giving the largest deviation found.

    Raises
    ------
    InvalidOperationError
        When a matrix is not orthogonal within ``tol`` (the message gives its distance).
    GroupClosureError
        When the matrices are not within ``tol`` of a finite group (the message gives
        the largest deviation found), or close a group of a class outside the catalog.
    InvalidOptionError
        For a bad ``tol``.

    Examples
    --------
    >>> c, s = 0.8660254, 0.5
    >>> g = snap_float_group([[[-s, -c, 0], [c, -s, 0], [0, 0, 1]], [[1, 0, 0], [0, -1, 0], [0, 0, -1]]])
    >>> g.setting_symbol
    '321'
    """
    from tensym.groups.recognition import _family, _find_rotation, reorient

    tol = check_tol(tol)
    given = []
    for k, m in enumerate(matrices):
        a = np.asarray(m, dtype=np.float64)
        u = _polar(a)
        dev = float(np.max(np.abs(a - u)))
        if dev > tol:
            raise InvalidOperationError(
                f"float matrix {k + 1} is not orthogonal within tol={tol:g} (absolute, on matrix entries): "
                f"its entries are {dev:.2e} from the nearest orthogonal matrix"
            )
        given.append(a)
    match = min(0.05, max(100 * tol, 1e-6))
    ops, gens = np.eye(3)[None], []
    for a in given:  # generators: only the matrices that the closure so far does not contain
        if _find(ops, a, match) is None:
            gens.append(_polar(a))
            ops = _close(gens, match)
            if ops is None:
                break
    if ops is None:
        raise _not_a_group(tol, None, f"they generate more than {MAX_GROUP_ORDER} distinct operations")
    ops = _refine(ops, match)
    if ops is None:
        raise _not_a_group(tol, None, "their products do not form a group table")
    numops = [_NumOp(m) for m in ops]
    hm, sch, _ = _family(numops)
    rows = [s for s in SETTINGS if s.hm == hm]
    if not rows:
        raise GroupClosureError(
            f"the float operations are close to a group of class {hm} ({sch}), which is not in the catalog "
            "(32 crystallographic classes, 532, -5-3m); give exact matrices for it"
        )
    worst = None
    for row in rows:  # the operations of a catalog setting themselves
        cat = catalog_group(row.symbol)
        nums = np.array([op._num for op in cat.operations])
        if len(nums) == len(ops):
            dev = _deviation(nums, given)
            if dev <= tol:
                return _finish(cat, given, dev, tol)
    qn = None
    for row in sorted(rows, key=lambda r: not r.default):  # every setting of the class: the default first
        std = catalog_group(row.symbol)
        found = _find_rotation(std.operations, numops)
        if found is None:  # pragma: no cover - a refined group of a class is conjugate to each setting
            continue
        std_nums = np.array([op._num for op in std.operations])
        fitted = _fit(found[0], std_nums, given)
        qn = fitted if qn is None else qn
        for q in _frames(std, fitted, tol):
            qf = np.array(q.evalf(20).tolist(), dtype=np.float64)
            dev = _deviation(np.einsum("ij,ajk,lk->ail", qf, std_nums, qf), given)
            worst = dev if worst is None else min(worst, dev)
            if dev <= tol:
                return _finish(reorient(std, q), given, dev, tol)
    if worst is None:
        raise GroupClosureError(
            f"the float operations form a group of class {hm} ({sch}) in a frame with no exact rotation near "
            f"Q = {echo(np.round(qn, 6).tolist())} (entries p/r with r up to {_max_denominator(tol)}, unit "
            f"vectors along integer directions with entries up to {_max_direction(tol)}, or (p + q sqrt(m))/r); "
            "give exact matrices, or more digits and a smaller tol"
        )
    raise _not_a_group(tol, worst, f"the nearest exact group of class {hm} found is farther than tol")


def _frames(std, qn, tol):
    """Exact rotations near ``qn`` (up to the symmetry of ``std``) that may map ``std`` onto the given group."""
    column = _single_axis_column(std)
    if column == -1:  # 1 or -1: every frame gives the same group
        yield sp.ImmutableMatrix(sp.eye(3))
        return
    if column is not None:  # one axis: only its direction matters
        q = _by_axis(qn[:, column], column, tol)
        if q is not None:
            yield q
        return
    found = [c for s in _holohedry(std) for c in _candidates(qn @ s, tol)]
    for _, q in sorted(found, key=lambda c: c[0]):
        yield q


def _finish(group, given, dev, tol):
    """The exact group, with the snap in its names.

    Its generators are those of the catalog setting (turned by Q): a few, however many
    matrices were given, so that solvers working on generators stay fast.
    """
    words = f"{group.names.setting}; snapped from float operations (largest deviation {dev:.1e}, tol {tol:g})"
    return PointGroup(group.operations, group.generators, dataclasses.replace(group.names, setting=words))
