"""The frame of the crystal: :func:`orient` finds the rotation into a group's standard setting.

Problem
-------
Given data t in some laboratory or calculation frame and a group G in its
standard setting (``tensym.point_group``), find the proper rotation R that
minimises the Frobenius residual of the rotated data R.t
(``t'_{ij..} = R_ia R_jb ... t_{ab..}``) against the invariant subspace of G:

    f(R) = ||(1 - P) R.t||_F / ||t||_F,   P the orthogonal projector onto the invariant subspace.

The rows of R are the crystal's standard axes written in the data frame.

Method
------
1. Global search: f is evaluated on a deterministic grid over SO(3)
   (:func:`tensym.data.rotation.rotation_grid`: Fibonacci-sphere directions
   times turns about z) with spacing ``resolution`` degrees, by default
   40 / rank clipped to [5, 15] (10 degrees for elasticity, 13.3 for
   piezoelectricity; every rotation then lies within about 1.05 x resolution
   of a grid point).  f is a trigonometric polynomial of degree 2 rank in R, so its basins
   are wider than this spacing, and the grid puts a point inside the basin of
   the global minimum.
2. The ``refine`` best grid points that are distinct modulo the group (more
   than 2 x resolution apart after every equivalent rotation is tried) are
   refined by Levenberg-Marquardt on the rotation (R <- exp([w]x) R, with the
   exact infinitesimal action of rotations on the tensor as the Jacobian);
   the best refined point wins.
3. Equivalent solutions: if R is a solution, so is h R for every rotation h
   that leaves every G-invariant tensor unchanged (the proper operations of G,
   and det(g) g for the improper ones when the inversion acts trivially on the
   property).  The reported R is the equivalent one with the smallest rotation
   angle; all of them are in :attr:`Orientation.equivalents`.  For continuous
   groups the rotations about the standard z axis (or all rotations, for
   SO(3) and O(3)) are equivalent too and :attr:`Orientation.continuous` is True.

Examples
--------
>>> import numpy as np
>>> import tensym
>>> from tensym.data.rotation import rotation_from_euler
>>> d = np.zeros((3, 6)); d[2, 2] = 20.0; d[2, 0] = d[2, 1] = -8.0; d[0, 4] = d[1, 3] = 30.0
>>> r_true = rotation_from_euler(20.0, 35.0, -50.0)
>>> lab = tensym.rotate_values(d, r_true.T, "piezoelectric_d")     # the crystal seen from a tilted frame
>>> o = tensym.orient(lab, "piezoelectric_d", "6mm")
>>> o.residual_fraction < 1e-8, round(float(o.misorientation_to(r_true)), 6)
(True, 0.0)
"""

from dataclasses import dataclass, field
import math
import numbers

import numpy as np

from tensym.display import Displayed
from tensym.data.check import _group, _group_name, _lie_matrices
from tensym.data.dataset import TensorData, tensor_data
from tensym.data.model import group_space, layout as _layout, numeric_form, pair_rotation, rotate_full
from tensym.data.rotation import axis_angle, euler_angles, shared_grid
from tensym.errors import DataError

__all__ = ["Orientation", "orient", "default_resolution"]


def _ro(a):
    a = np.array(a, dtype=np.float64, copy=True)
    a.setflags(write=False)
    return a


def default_resolution(rank):
    """Default grid spacing in degrees for a tensor of this rank: 40 / rank, clipped to [5, 15].

    Examples
    --------
    >>> default_resolution(4), default_resolution(2)
    (10.0, 15.0)
    """
    return float(min(15.0, max(5.0, 40.0 / max(int(rank), 1))))


@dataclass(frozen=True, eq=False)
class Orientation(Displayed):
    """The result of :func:`orient` (immutable; arrays read-only).

    Attributes
    ----------
    property : str
        Property name.
    group : str
        Group symbol (setting symbol where the catalog has one).
    rotation : numpy.ndarray
        float64 (3, 3) proper rotation R taking data-frame components to the
        standard setting, t_std = R.t (rows: the standard axes in the data frame).
    axis : numpy.ndarray
        float64 (3,) unit axis of R (counter-clockwise, angle below).
    angle : float
        Rotation angle of R in degrees, [0, 180].
    euler : tuple of float
        (alpha, beta, gamma) in degrees with R = Rz(alpha) Ry(beta) Rz(gamma).
    residual_fraction : float
        f(R): Frobenius residual of the rotated data against the group, over ||t||_F.
    initial_residual_fraction : float
        f(1): the same in the frame the data were given in.
    rotated : TensorData
        The data in the standard setting (covariance propagated).
    equivalents : numpy.ndarray
        float64 (m, 3, 3): every h R with h from the group's equivalent
        rotations (see the module notes); ``rotation`` is among them.
    continuous : bool
        True when a continuous set of rotations is equivalent as well.
    local_minima : tuple of float
        Residual fractions of the refined distinct candidates, best first.
    resolution : float
        Grid spacing in degrees.
    search : str
        The search in words (grid size, resolution, refined candidates).

    Examples
    --------
    >>> import numpy as np
    >>> o = orient(np.diag([2.0, 5.0, 2.0]), "dielectric_permittivity", "4/mmm")  # optic axis along y
    >>> np.abs(o.rotation[2]).round(9).tolist(), o.continuous    # the standard z is the data's y
    ([0.0, 1.0, 0.0], True)
    """

    property: str
    group: str
    rotation: np.ndarray
    axis: np.ndarray
    angle: float
    euler: tuple
    residual_fraction: float
    initial_residual_fraction: float
    rotated: TensorData = field(repr=False)
    equivalents: np.ndarray = field(repr=False)
    continuous: bool = False
    local_minima: tuple = ()
    resolution: float = 0.0
    search: str = ""
    _group_obj: object = field(default=None, repr=False)
    _lie: np.ndarray = field(default=None, repr=False)

    @property
    def n_equivalent(self):
        """Number of discrete equivalent rotations."""
        return int(self.equivalents.shape[0])

    def misorientation_to(self, rotation):
        """Smallest angle in degrees between ``rotation`` and any equivalent solution.

        For a continuous group the free rotations (about the standard z axis, or
        all of them) are minimised over as well.
        """
        from tensym.data.rotation import as_rotation

        r = as_rotation(rotation)
        m = np.einsum("aij,kj->aik", self.equivalents, r)  # h R r^T
        if self.continuous:
            if len(self._lie) >= 3:
                return 0.0
            tr = np.array([_best_trace(x, self._lie[0])[1] for x in m])
        else:
            tr = np.trace(m, axis1=1, axis2=2)
        return float(np.degrees(np.arccos(np.clip((tr - 1) / 2, -1, 1))).min())

    def check(self, **options):
        """:func:`tensym.check_tensor` of the rotated data against the group."""
        from tensym.data.check import check_tensor

        return check_tensor(self.rotated, group=self._group_obj, **options)

    def text(self):
        """Plain-text summary."""
        from tensym.data.render import orientation_text

        return orientation_text(self)

    __str__ = text

    def record(self):
        """JSON-ready dict (kind 'orientation')."""
        from tensym.data.render import orientation_record

        return orientation_record(self)

    def to_json(self):
        """JSON document (str)."""
        import json

        return json.dumps(self.record(), indent=2)

    def __repr__(self):
        return (f"<Orientation {self.property} to {self.group}: {self.angle:.3f} deg, "
                f"residual {self.residual_fraction:.3g}>")


# --- kernels ------------------------------------------------------------------------------
def _candidate_rotations(group):
    """Rotations that may map a group's form to itself: the group's own rotations and the
    usual normalisers (cube axes with 2-, 3-, 4-folds; 2-folds in the plane normal to z every
    7.5 degrees; turns about z by 360/m, m = 2, 3, 4, 6, 8, 12, 24), in the frame of the group."""
    from tensym.data.rotation import rotation_from_axis_angle

    axes = [np.array(v, dtype=np.float64) for v in
            ([1, 0, 0], [0, 1, 0], [0, 0, 1], [1, 1, 0], [1, -1, 0], [1, 0, 1], [1, 0, -1], [0, 1, 1],
             [0, 1, -1], [1, 1, 1], [1, 1, -1], [1, -1, 1], [-1, 1, 1])]
    out = []
    for a in axes:
        for ang in (90.0, 120.0, 180.0, 240.0, 270.0):
            out.append(rotation_from_axis_angle(a, ang))
    for k in range(24):
        t = math.radians(7.5 * k)
        out.append(rotation_from_axis_angle([math.cos(t), math.sin(t), 0.0], 180.0))
    for m in (2, 3, 4, 6, 8, 12, 24):
        for j in range(1, m):
            out.append(rotation_from_axis_angle([0, 0, 1], 360.0 * j / m))
    q = getattr(group, "rotation", None)
    if q is not None:
        qn = np.array(np.array(q.tolist(), dtype=object), dtype=np.float64)
        out = [qn @ r @ qn.T for r in out]
    return out


def _close(mats, limit=200):
    """Finite closure of a set of rotations (float keys at 1e-6)."""
    def key(m):
        return tuple(np.round(m.reshape(-1), 6) + 0.0)

    elems = {key(np.eye(3)): np.eye(3)}
    for m in mats:
        elems.setdefault(key(m), m)
    frontier = list(elems.values())
    while frontier and len(elems) <= limit:
        new = []
        gens = list(elems.values())
        for a in frontier:
            for b in gens:
                c = a @ b
                k = key(c)
                if k not in elems:
                    elems[k] = c
                    new.append(c)
        frontier = new
    return list(elems.values())


_STAB_CACHE = {}


def _equivalent_rotations(nf, group):
    """Rotations h with h.V = V for the invariant subspace V of the group (its stabiliser in SO(3)).

    Returns (discrete rotations (m, 3, 3), Lie generators (d, 3, 3), d in {0, 1, 3}): the
    discrete ones are the group's proper rotations (and det(g) g for improper g when that
    acts alike) and every candidate of :func:`_candidate_rotations` that maps V to itself.
    """
    from tensym.data.model import group_key_of

    ck = (nf.layout.prop, group_key_of(group))
    if ck in _STAB_CACHE:
        return _STAB_CACHE[ck]
    lay = nf.layout
    if nf.k == 0:
        res = (np.eye(3)[None], np.array([[[0, 0, 0], [0, 0, -1], [0, 1, 0]], [[0, 0, 1], [0, 0, 0], [-1, 0, 0]],
                                        [[0, -1, 0], [1, 0, 0], [0, 0, 0]]], dtype=np.float64))
        _STAB_CACHE[ck] = res
        return res
    q = nf.Q
    basis_t = lay.x_to_full((q / lay.scale[:, None]).T)  # (k, 3, ..., 3)

    def keeps(h):
        y = lay.full_to_x(rotate_full(basis_t, h, lay.rank)) * lay.scale  # (k, n)
        r = y.T - q @ (q.T @ y.T)
        return float(np.max(np.abs(r))) < 1e-8

    lie_all = _lie_matrices(lay)
    m = np.stack([((np.eye(lay.n) - q @ q.T) @ lie_all[a] @ q).reshape(-1) for a in range(3)], axis=1)
    _, sv, vt = np.linalg.svd(m, full_matrices=False)
    null = vt[sv < 1e-9 * max(1.0, float(sv.max()) if sv.size else 1.0)]
    gens3 = np.array([[[0, 0, 0], [0, 0, -1], [0, 1, 0]], [[0, 0, 1], [0, 0, 0], [-1, 0, 0]],
                      [[0, -1, 0], [1, 0, 0], [0, 0, 0]]], dtype=np.float64)
    lie = np.einsum("da,aij->dij", null, gens3) if len(null) else np.zeros((0, 3, 3))
    if len(lie) >= 2:
        res = (np.eye(3)[None], gens3)
        _STAB_CACHE[ck] = res
        return res
    if getattr(group, "is_continuous", False):
        from tensym.groups.finite import PointGroup

        ops = PointGroup.from_generators(list(group.generators)).operations if group.generators else ()
    else:
        ops = group.operations
    cands = [op.numeric * np.sign(np.linalg.det(op.numeric)) for op in ops] + _candidate_rotations(group)
    if len(lie):
        u = _lie_axis(lie[0])
        perp = np.cross(u, [1.0, 0.0, 0.0] if abs(u[0]) < 0.9 else [0.0, 1.0, 0.0])
        from tensym.data.rotation import rotation_from_axis_angle

        cands = [rotation_from_axis_angle(perp, 180.0)]
    kept = [h for h in cands if keeps(h)]
    res = (np.array(_close(kept)), lie)
    _STAB_CACHE[ck] = res
    return res


def _lie_axis(L):
    u = np.array([L[2, 1], L[0, 2], L[1, 0]], dtype=np.float64)
    return u / np.linalg.norm(u)


def _best_trace(x, L):
    """(phi, trace) maximising trace(Rot(u, phi) x) for the axis u of the generator L."""
    u = _lie_axis(L)
    k = np.array([[0.0, -u[2], u[1]], [u[2], 0.0, -u[0]], [-u[1], u[0], 0.0]])
    uxu = float(u @ x @ u)
    a = float(np.trace(x)) - uxu
    b = float(np.trace(k @ x))
    return math.atan2(b, a), uxu + math.hypot(a, b)


def _canonical(rot, equiv, lie):
    """The equivalent solution with the smallest rotation angle."""
    cands = np.einsum("aij,jk->aik", equiv, rot)
    if len(lie) >= 3:
        return np.eye(3)
    if len(lie):
        # rotations about the generator's axis are free: R -> Rot(u, phi) R, angle of the result minimal
        u = _lie_axis(lie[0])
        best, best_tr = None, -np.inf
        for x in cands:
            phi, tr = _best_trace(x, lie[0])
            if tr > best_tr + 1e-12:
                best, best_tr = _exp(phi * u) @ x, tr
        return best
    tr = np.trace(cands, axis1=1, axis2=2)
    return cands[int(np.argmax(tr - 1e-12 * np.arange(len(tr))))]


def _exp(w):
    """exp([w]x): the rotation by |w| radians about w (Rodrigues)."""
    a = math.sqrt(w[0] * w[0] + w[1] * w[1] + w[2] * w[2])
    if a < 1e-300:
        return np.eye(3)
    x, y, z = w[0] / a, w[1] / a, w[2] / a
    c, s = math.cos(a), math.sin(a)
    t = 1.0 - c
    return np.array([[c + t * x * x, t * x * y - s * z, t * x * z + s * y],
                     [t * x * y + s * z, c + t * y * y, t * y * z - s * x],
                     [t * x * z - s * y, t * y * z + s * x, c + t * z * z]])


class _Objective:
    """f(R) and its Gauss-Newton pieces for one tensor and one invariant subspace."""

    def __init__(self, lay, q, x0):
        self.lay, self.q = lay, q
        self.gs = group_space(lay.prop)
        self.z0 = self.gs.z_from_x(x0)
        self.lie = _lie_matrices(lay)
        self.norm2 = float(np.sum((lay.scale * x0) ** 2))

    def y(self, r):
        return self.gs.y_from_z(self.gs.rotate(self.z0, r))

    def residual(self, y):
        return y - self.q @ (self.q.T @ y)

    def refine(self, r, iters=40):
        y = self.y(r)
        e = self.residual(y)
        cost = float(e @ e)
        lam = 1e-3 * max(self.norm2, 1e-300)
        for _ in range(iters):
            j = np.einsum("aij,j->ia", self.lie, y)
            j = j - self.q @ (self.q.T @ j)
            jtj = j.T @ j
            g = j.T @ e
            improved = False
            eye = np.eye(3)
            for _ in range(12):
                step = -np.linalg.solve(jtj + lam * eye, g)
                r_new = _exp(step) @ r
                y_new = self.y(r_new)
                e_new = self.residual(y_new)
                c_new = float(e_new @ e_new)
                if c_new < cost:
                    improved = True
                    r, y, e = r_new, y_new, e_new
                    gain = cost - c_new
                    cost = c_new
                    lam = max(lam / 10.0, 1e-15 * max(self.norm2, 1e-300))
                    break
                lam *= 10.0
            if not improved or np.linalg.norm(step) < 1e-10 or gain <= 1e-13 * self.norm2 \
                    or gain <= 1e-9 * cost:
                break
        # re-orthonormalise
        u, _, vt = np.linalg.svd(r)
        r = u @ vt
        return r, cost


_PAIR_CACHE = {}


def _grid_pairs(grid):
    """pair_rotation of a grid, cached by the grid's identity (grids come from rotation_grid's cache)."""
    key = (id(grid), len(grid))
    hit = _PAIR_CACHE.get(key)
    if hit is None or hit[0] is not grid:
        if len(_PAIR_CACHE) > 8:
            _PAIR_CACHE.clear()
        hit = (grid, pair_rotation(grid))
        _PAIR_CACHE[key] = hit
    return hit[1]


def _grid_costs(obj, grid, nf, cache=None):
    """Residual squared (not normalised) of the data rotated by each grid rotation.

    With a ``cache`` dict the rotated data are kept (when small) for other groups.
    """
    if cache is not None and "y" in cache:
        return np.maximum(obj.norm2 - np.sum((cache["y"] @ nf.Q) ** 2, axis=1), 0.0)
    size = int(np.prod(obj.gs.dims))
    keep = cache is not None and len(grid) * obj.lay.n <= 4_000_000
    chunk = max(1, int(2_000_000 // size))
    out = np.empty(len(grid))
    ys = []
    pairs = _grid_pairs(grid) if any(obj.gs.pair) else None
    for s in range(0, len(grid), chunk):
        y = obj.gs.y_from_z(obj.gs.rotate(obj.z0, grid[s:s + chunk],
                                          None if pairs is None else pairs[s:s + chunk]))
        if keep:
            ys.append(y)
        out[s:s + chunk] = obj.norm2 - np.sum((y @ nf.Q) ** 2, axis=1)
    if keep:
        cache["y"] = np.concatenate(ys, axis=0)
    return np.maximum(out, 0.0)


def _distinct(order, grid, equiv, sep_deg, count, scan=4000):
    """Indices of up to ``count`` grid points, in cost order, pairwise > sep modulo ``equiv``."""
    thr = 1 + 2 * math.cos(math.radians(sep_deg))
    top = np.asarray(order[:scan])
    mats = grid[top]
    free = np.ones(len(top), dtype=bool)
    picked = []
    while len(picked) < count and free.any():
        i = int(np.flatnonzero(free)[0])
        picked.append(int(top[i]))
        m = np.einsum("sij,kj->sik", mats, mats[i])  # r p^T: r ~ h p when trace(h^T r p^T) is near 3
        tr = np.einsum("aij,sij->sa", equiv, m).max(axis=1)
        free &= tr < thr
    return picked


def _search(obj, nf, equiv, lie, grid, resolution, refine, cache=None):
    if nf.k == 0 or obj.norm2 == 0.0:
        return np.eye(3), (1.0 if obj.norm2 > 0 else 0.0,)
    if len(lie) >= 3 or nf.k == nf.layout.n:
        return np.eye(3), (0.0,)  # every frame is equivalent / nothing is forbidden
    costs = _grid_costs(obj, grid, nf, cache)
    order = np.argsort(costs, kind="stable")
    picks = _distinct(order, grid, equiv, 2 * resolution, refine)
    results = []
    for i in picks:
        r, c = obj.refine(grid[i])
        results.append((c, r))
    # the identity too: data given in (nearly) the standard setting refine from there
    r, c = obj.refine(np.eye(3))
    results.append((c, r))
    results.sort(key=lambda cr: cr[0])
    best = results[0][1]
    minima = tuple(math.sqrt(max(c, 0.0) / obj.norm2) for c, _ in results)
    return best, minima


def orient(values, what=None, group=None, *, resolution=None, refine=6, sigma=None, covariance=None,
           units=None, layout="auto", symmetry_tol=1e-8):
    """The rotation that best brings the data into a group's standard setting.

    Parameters
    ----------
    values : array_like or TensorData
        The data (Voigt or full array, or a TensorData).
    what : str, Property or TensorSpec
        The property (not needed for a TensorData).
    group : group object or str
        The target group, in its standard setting (or any setting: the result
        brings the data into the setting of this group object).
    resolution : float, optional
        Grid spacing in degrees (1 to 90); default :func:`default_resolution` of the rank.
    refine : int
        Number of distinct grid minima refined (default 6, at least 1).
    sigma, covariance, units, layout, symmetry_tol
        As in :func:`tensym.tensor_data`.

    Returns
    -------
    Orientation

    Raises
    ------
    DataError
        For invalid data, a missing group, a resolution outside [1, 90] or
        ``refine`` < 1.
    UnknownGroupError
        For an unknown group symbol.
    InvalidGroupError
        For a group argument that is neither a group nor a symbol.

    Examples
    --------
    >>> import numpy as np
    >>> import tensym
    >>> eps = np.diag([2.0, 2.0, 5.0])            # uniaxial, optic axis along z
    >>> r = tensym.rotation_from_axis_angle([1, 0, 0], 90)
    >>> o = tensym.orient(tensym.rotate_values(eps, r, "dielectric_permittivity"),
    ...                   "dielectric_permittivity", "4/mmm")
    >>> o.residual_fraction < 1e-9, np.abs(o.rotation @ [0, -1, 0]).round(6).tolist()
    (True, [0.0, 0.0, 1.0])
    """
    data = tensor_data(values, what, sigma=sigma, covariance=covariance, units=units,
                       **({} if isinstance(values, TensorData) else {"layout": layout,
                                                                      "symmetry_tol": symmetry_tol}))
    if isinstance(refine, bool) or not isinstance(refine, numbers.Integral) or refine < 1:
        raise DataError(f"refine must be a positive integer, got {refine!r}")
    g = _group(group)
    prop = data.property
    lay = _layout(prop)
    res = default_resolution(lay.rank) if resolution is None else resolution
    grid = shared_grid(res)
    nf = numeric_form(prop, g)
    return _orient_core(data, g, nf, grid, float(res), int(refine))


def _orient_core(data, g, nf, grid, res, refine, grid_cache=None):
    lay = nf.layout
    obj = _Objective(lay, nf.Q, np.asarray(data.components))
    equiv, lie = _equivalent_rotations(nf, g)
    best, minima = _search(obj, nf, equiv, lie, grid, res, refine, grid_cache)
    best = _canonical(best, equiv, lie)
    if obj.norm2 > 0:
        e = obj.residual(obj.y(best))
        frac = float(np.linalg.norm(e)) / math.sqrt(obj.norm2)
        e0 = obj.residual(obj.y(np.eye(3)))
        frac0 = float(np.linalg.norm(e0)) / math.sqrt(obj.norm2)
    else:
        frac = frac0 = 0.0
    axis, angle = axis_angle(best)
    eqs = np.einsum("aij,jk->aik", equiv, best)
    search = (f"{len(grid)}-point grid over SO(3) at {res:g} deg, {min(refine, len(grid))} distinct minima "
              "refined (Levenberg-Marquardt)")
    return Orientation(
        property=data.property.name,
        group=_group_name(g),
        rotation=_ro(best),
        axis=_ro(axis),
        angle=float(angle),
        euler=tuple(float(v) for v in euler_angles(best)),
        residual_fraction=frac,
        initial_residual_fraction=frac0,
        rotated=data.rotated(best),
        equivalents=_ro(eqs),
        continuous=bool(len(lie)),
        local_minima=minima,
        resolution=res,
        search=search,
        _group_obj=g,
        _lie=lie,
    )
