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
3. Solutions that fit equally: if R is a solution, so is h R for every
   rotation h that maps the invariant subspace V to itself (its stabiliser in
   SO(3)).  These split in two kinds:

   * *equivalent* solutions: h leaves every tensor of V unchanged (the
     proper operations of G, det(g) g for the improper ones when the
     inversion acts trivially on the property, rotations about the axis of a
     transversely isotropic form): they give the same constants.  They are in
     :attr:`Orientation.equivalents`; the reported rotation is the one with the
     smallest angle among them.
   * *inequivalent families*: h maps V to itself but changes its tensors (a
     turn of 45 degrees about z takes a tetragonal tensor with x along [100]
     to the one with x along [110]; a turn of 180 degrees about x reverses a
     polar axis).  Each family fits the data exactly as well, with other
     constants: the data cannot tell them apart, a structure (or the user's
     convention) must decide.  :attr:`Orientation.families` lists every one
     with its constants.  The primary solution (``rotation``, ``rotated``)
     is, by tensym's convention: the family with a solution within 5 degrees
     of the given frame, when there is one (the data were given in a standard
     setting: the user's axes decide); otherwise the family whose constants,
     read in the form's order (c11, c12, ...), are lexicographically smallest
     (compared to 1e-9 of the largest constant), a rule on the numbers, not
     on the crystal, stated so that programs get a reproducible answer
     whatever the frame of the data.

   When the stabiliser is continuous and changes the tensors (a monoclinic
   form about its 2-fold axis, a form with nothing forbidden) the family is
   continuous (:attr:`Orientation.free_rotation`); the primary solution is
   then the one closest to the given frame.  For continuous groups the
   rotations about the standard z axis (or all rotations, for SO(3) and O(3))
   that keep every tensor are equivalent and :attr:`Orientation.continuous`
   is True.

The data are worked on in a copy scaled by a power of two (exact), so the
result does not depend on the magnitude of the units.  All-zero data and data
with unknown (NaN) components are refused: the first has no orientation, and
a rotation mixes the components.

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
from tensym.data.dataset import TensorData, _exponent, tensor_data
from tensym.data.model import group_space, layout as _layout, numeric_form, pair_rotation, rotate_full
from tensym.data.rotation import axis_angle, euler_angles, shared_grid
from tensym.errors import DataError

__all__ = ["Orientation", "SolutionFamily", "orient", "default_resolution"]


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
class SolutionFamily:
    """One family of rotations that fit the data equally well, with its constants.

    Attributes
    ----------
    rotation : numpy.ndarray
        float64 (3, 3), read-only: the family's rotation with the smallest angle
        (data frame -> standard setting, as :attr:`Orientation.rotation`).
    angle : float
        Its rotation angle in degrees.
    names : tuple of str
        Names of the constants ('c11', ...), the form's order.
    constants : numpy.ndarray
        float64 (k,), read-only: the constants of the data rotated by ``rotation``
        (Frobenius-norm fit, the data's units).
    n_equivalent : int
        Number of rotations in the family that give these same constants.
    primary : bool
        True for the family :attr:`Orientation.rotation` belongs to.

    Examples
    --------
    >>> import numpy as np, tensym
    >>> d = np.zeros((3, 6)); d[2, 2] = 20.0; d[2, 0] = d[2, 1] = -8.0; d[0, 4] = d[1, 3] = 30.0
    >>> fams = tensym.orient(d, "piezoelectric_d", "6mm").families   # polar axis up or down
    >>> [f.constants.round(6).tolist() for f in fams]        # given in the standard setting: primary first
    [[30.0, -8.0, 20.0], [-30.0, 8.0, -20.0]]
    """

    rotation: np.ndarray
    angle: float
    names: tuple
    constants: np.ndarray
    n_equivalent: int
    primary: bool

    def constant(self, name):
        """The value of the constant called ``name`` in this family."""
        if name not in self.names:
            raise KeyError(f"{name!r} is not a constant here; constants: {', '.join(self.names)}")
        return float(self.constants[self.names.index(name)])


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
        float64 (m, 3, 3): every h R with h a rotation that leaves every tensor
        of the group's form unchanged (the same constants; see the module
        notes); ``rotation`` is among them.
    continuous : bool
        True when a continuous set of rotations is equivalent as well.
    families : tuple of SolutionFamily
        Every inequivalent family of solutions (other constants, the same
        residual), the primary one first; one entry when the data fix the
        frame up to equivalent rotations.
    free_rotation : int
        Dimension of a continuous family of inequivalent solutions (1: a free
        turn about an axis, as for a monoclinic form; 3: nothing is forbidden,
        every rotation fits); 0 when the families are discrete.
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
    families: tuple = ()
    free_rotation: int = 0
    _group_obj: object = field(default=None, repr=False)
    _lie: np.ndarray = field(default=None, repr=False)
    _solutions: np.ndarray = field(default=None, repr=False)

    @property
    def n_equivalent(self):
        """Number of discrete equivalent rotations (the same constants)."""
        return int(self.equivalents.shape[0])

    @property
    def n_families(self):
        """Number of inequivalent families of solutions (see :attr:`families`)."""
        return len(self.families)

    @property
    def solutions(self):
        """float64 (m, 3, 3), a new array: every discrete rotation that fits as well, over every family."""
        return np.array(self._solutions if self._solutions is not None else self.equivalents)

    def misorientation_to(self, rotation):
        """Smallest angle in degrees between ``rotation`` and any solution that fits as well.

        Every family counts (:attr:`solutions`): the data cannot tell them
        apart.  For a continuous group the free rotations (about the standard
        z axis, or all of them) are minimised over as well.
        """
        from tensym.data.rotation import as_rotation

        r = as_rotation(rotation)
        if self.free_rotation >= 3:
            return 0.0
        m = np.einsum("aij,kj->aik", self.solutions, r)  # h R r^T
        if self._lie is not None and len(self._lie):
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


def _frozen(arrays):
    """The arrays of a cache entry, read-only (the cache is process-wide)."""
    out = tuple(np.array(a, dtype=np.float64) for a in arrays)
    for a in out:
        a.setflags(write=False)
    return out


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
        _STAB_CACHE[ck] = _frozen(res)
        return _STAB_CACHE[ck]
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
        _STAB_CACHE[ck] = _frozen(res)
        return _STAB_CACHE[ck]
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
    _STAB_CACHE[ck] = _frozen(res)
    return _STAB_CACHE[ck]


_STRUCT_CACHE = {}
#: A family with a solution within this angle (degrees) of the given frame is primary: the data were given
#: in a standard setting of the group (inequivalent families lie tens of degrees apart).
_GIVEN_FRAME_DEG = 5.0


class _Structure:
    """How the rotations that keep the invariant subspace V act on it (cached per property and group).

    same : (p, 3, 3) discrete rotations acting as the identity on V (equivalent solutions)
    reps : (f, 3, 3) one rotation per coset of ``same`` (one per inequivalent family), identity first
    lie_same : (d, 3, 3) Lie generators acting as zero on V
    free : dimension of the Lie generators that move V's tensors (0, 1 or 3)
    """

    def __init__(self, same, reps, lie_same, free):
        self.same, self.reps, self.lie_same, self.free = same, reps, lie_same, free
        for a in (same, reps, lie_same):
            a.setflags(write=False)


def _solution_structure(nf, group):
    from tensym.data.model import group_key_of, rotation_action

    ck = (nf.layout.prop, group_key_of(group))
    hit = _STRUCT_CACHE.get(ck)
    if hit is not None:
        return hit
    equiv, lie = _equivalent_rotations(nf, group)
    lay, q = nf.layout, nf.Q
    eye3 = np.eye(3)[None]
    if nf.k == 0:
        hit = _Structure(np.array(equiv), eye3.copy(), np.array(lie), 0)
        _STRUCT_CACHE[ck] = hit
        return hit
    lie_all = _lie_matrices(lay)
    lie_same, free = np.zeros((0, 3, 3)), 0
    if len(lie):
        coef = np.array([[L[2, 1], L[0, 2], L[1, 0]] for L in lie])
        on_v = np.stack([(q.T @ np.tensordot(c, lie_all, axes=1) @ q).reshape(-1) for c in coef], axis=1)
        _, sv, vt = np.linalg.svd(on_v, full_matrices=True)
        rank = int(np.sum(sv > 1e-9))
        null = vt[rank:]
        lie_same = np.einsum("md,dij->mij", null, lie) if len(null) else np.zeros((0, 3, 3))
        free = 3 if len(lie) >= 3 and rank else rank
    scale = lay.scale
    same, reps, mats = [], [], []
    for h in equiv:
        m = q.T @ ((scale[:, None] * rotation_action(lay, h) / scale[None, :]) @ q)
        if np.allclose(m, np.eye(nf.k), atol=1e-8):
            same.append(h)
        if not any(np.allclose(m, m2, atol=1e-8) for m2 in mats):
            mats.append(m)
            reps.append(h)
    # the identity's family first
    order = sorted(range(len(reps)), key=lambda i: not np.allclose(mats[i], np.eye(nf.k), atol=1e-8))
    reps = [reps[i] for i in order]
    hit = _Structure(np.array(same), np.array(reps), np.array(lie_same), int(free))
    _STRUCT_CACHE[ck] = hit
    return hit


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
        For invalid data, data with unknown (NaN) components or all zero, a
        missing group, a resolution outside [1, 90] or ``refine`` < 1.
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
    _require_orientable(data, "orient")
    g = _group(group)
    prop = data.property
    lay = _layout(prop)
    res = default_resolution(lay.rank) if resolution is None else resolution
    grid = shared_grid(res)
    nf = numeric_form(prop, g)
    return _orient_core(data, g, nf, grid, float(res), int(refine))


def _require_orientable(data, what):
    """Refuse data that have no orientation: unknown components, or every component zero."""
    data._need_complete(what)
    if not np.any(np.asarray(data.components)):
        raise DataError(f"the data are all zero: an all-zero tensor fits every group in every frame, so "
                        f"{what} has nothing to find")


def _orient_core(data, g, nf, grid, res, refine, grid_cache=None):
    lay = nf.layout
    x = np.asarray(data.components)
    e = _exponent(x) or 0
    xs = np.ldexp(x, -e)  # a scaled copy: the result does not depend on the magnitude of the units
    obj = _Objective(lay, nf.Q, xs)
    equiv, lie = _equivalent_rotations(nf, g)
    st = _solution_structure(nf, g)
    best, minima = _search(obj, nf, equiv, lie, grid, res, refine, grid_cache)
    if st.free or nf.k == 0 or obj.norm2 == 0:
        best = _canonical(best, equiv, lie)  # a continuous family: the solution closest to the given frame
        fams = [(best, len(st.same))]
    else:
        fams = [(_canonical(h @ best, st.same, st.lie_same), len(st.same)) for h in st.reps]
    consts = []
    for r, _ in fams:
        y = obj.y(r)
        consts.append(nf.fit @ (y / lay.scale))
    if len(fams) > 1:
        top = max(float(np.max(np.abs(c))) if c.size else 0.0 for c in consts) or 1.0
        keys = [tuple(np.round(c / top * 1e9).tolist()) for c in consts]
        near = [i for i, (r, _) in enumerate(fams) if axis_angle(r)[1] < _GIVEN_FRAME_DEG]
        # the data were given in a standard setting of the group: the user's axes decide; else the numbers
        order = sorted(range(len(fams)), key=lambda i: (i not in near, keys[i]))
        fams = [fams[i] for i in order]
        consts = [consts[i] for i in order]
    best = fams[0][0]
    rotated = data.rotated(best)
    if obj.norm2 > 0:
        ev = obj.residual(obj.y(best))
        frac = float(np.linalg.norm(ev)) / math.sqrt(obj.norm2)
        e0 = obj.residual(obj.y(np.eye(3)))
        frac0 = float(np.linalg.norm(e0)) / math.sqrt(obj.norm2)
    else:
        frac = frac0 = 0.0
    axis, angle = axis_angle(best)
    eqs = np.einsum("aij,jk->aik", st.same if not st.free else equiv, best)
    with np.errstate(over="ignore"):  # a constant past 1.8e308 is inf (rotated already said the data fit)
        families = tuple(SolutionFamily(rotation=_ro(r), angle=float(axis_angle(r)[1]), names=nf.names,
                                        constants=_ro(np.ldexp(c, e)), n_equivalent=int(m), primary=(i == 0))
                         for i, ((r, m), c) in enumerate(zip(fams, consts)))
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
        rotated=rotated,
        equivalents=_ro(eqs),
        continuous=bool(len(st.lie_same)),
        local_minima=minima,
        resolution=res,
        search=search,
        families=families,
        free_rotation=int(st.free) if nf.k else 0,
        _group_obj=g,
        _lie=lie,
        _solutions=_ro(np.einsum("aij,jk->aik", equiv, best)),
    )
