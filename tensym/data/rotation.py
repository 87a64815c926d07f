"""Numeric rotations: tensors in a rotated frame, axis-angle, Euler angles, grids over SO(3).

Conventions
-----------
* Rotations are active and act on every index of a tensor:
  ``t'_{ij..} = R_ia R_jb ... t_{ab..}``; an axial property takes an extra
  factor det(R).  When ``R`` takes lab components to crystal components, the
  rows of ``R`` are the crystal axes written in the lab frame.
* Axis-angle: ``R = cos(w) 1 + sin(w) [u]x + (1 - cos(w)) u u^T``, angle w in
  degrees in [0, 180], counter-clockwise about the unit axis u.
* Euler angles (alpha, beta, gamma), in degrees, in the z-y-z convention:
  ``R = Rz(alpha) @ Ry(beta) @ Rz(gamma)`` with active right-handed rotations
  about the fixed axes; beta in [0, 180], alpha and gamma in (-180, 180].
  When beta is 0 or 180 only alpha + gamma (or alpha - gamma) is defined and
  gamma is set to 0.
* The misorientation of two rotations is the angle of ``R1 @ R2.T``.

Examples
--------
>>> import numpy as np
>>> from tensym.data.rotation import rotation_from_euler, euler_angles, axis_angle
>>> r = rotation_from_euler(30.0, 40.0, 50.0)
>>> [round(float(a), 6) for a in euler_angles(r)]
[30.0, 40.0, 50.0]
>>> axis, angle = axis_angle(rotation_from_euler(90.0, 0.0, 0.0))
>>> axis.round(6).tolist(), round(angle, 6)
([0.0, 0.0, 1.0], 90.0)
"""

from functools import lru_cache
import math
import numbers

import numpy as np

from tensym.errors import DataError

__all__ = [
    "as_rotation",
    "rotation_from_axis_angle",
    "axis_angle",
    "rotation_from_euler",
    "euler_angles",
    "misorientation",
    "random_rotations",
    "rotation_grid",
    "rotate_values",
]


def _real_array(values, name):
    """float64 copy through the data layer's one numeric edge (complex, bool, strings refused)."""
    from tensym.data.dataset import _as_float_array

    return _as_float_array(values, name)


def as_rotation(rotation, *, proper=True, name="rotation"):
    """A validated float64 3x3 orthogonal matrix (determinant +1 when ``proper``).

    Raises
    ------
    DataError
        If the matrix is not 3x3, not finite, not orthogonal to 1e-6 or (when
        ``proper``) has determinant -1.

    Examples
    --------
    >>> as_rotation(-np.eye(3), proper=False)[0].tolist()
    [-1.0, -0.0, -0.0]
    """
    r = _real_array(rotation, name)
    if r.shape[-2:] != (3, 3):
        raise DataError(f"{name} must be a 3x3 matrix (or a stack of them), got shape {r.shape}")
    if not np.all(np.isfinite(r)):
        raise DataError(f"{name} contains NaN or inf")
    err = np.max(np.abs(np.einsum("...ij,...kj->...ik", r, r) - np.eye(3))) if r.size else 0.0
    if err > 1e-6:
        raise DataError(f"{name} is not orthogonal: |R R^T - 1| = {err:.3g} (accepted up to 1e-6)")
    if proper and np.any(np.linalg.det(r) < 0):
        raise DataError(f"{name} has determinant -1 (an improper rotation); a proper rotation is needed here")
    return r


def rotation_from_axis_angle(axis, angle):
    """The rotation by ``angle`` degrees counter-clockwise about ``axis`` (float64 (3, 3)).

    Raises
    ------
    DataError
        For a zero or non-finite axis or angle.

    Examples
    --------
    >>> rotation_from_axis_angle([0, 0, 1], 90).round(12).tolist()
    [[0.0, -1.0, 0.0], [1.0, 0.0, 0.0], [0.0, 0.0, 1.0]]
    """
    u = _real_array(axis, "axis").reshape(-1)
    if u.shape != (3,) or not np.all(np.isfinite(u)) or np.linalg.norm(u) == 0:
        raise DataError(f"axis must be a non-zero finite 3-vector, got {axis!r}")
    if isinstance(angle, bool) or not isinstance(angle, numbers.Real) or not math.isfinite(angle):
        raise DataError(f"angle must be a finite number of degrees, got {angle!r}")
    u = u / np.linalg.norm(u)
    w = math.radians(float(angle))
    k = np.array([[0.0, -u[2], u[1]], [u[2], 0.0, -u[0]], [-u[1], u[0], 0.0]])
    return math.cos(w) * np.eye(3) + math.sin(w) * k + (1.0 - math.cos(w)) * np.outer(u, u)


def _angles(r):
    """Rotation angles (radians) of a stack of proper rotations (accurate near 0 and 180 degrees)."""
    tr = np.trace(r, axis1=-2, axis2=-1)
    w = np.stack([r[..., 2, 1] - r[..., 1, 2], r[..., 0, 2] - r[..., 2, 0], r[..., 1, 0] - r[..., 0, 1]], -1)
    return np.arctan2(np.linalg.norm(w, axis=-1) / 2.0, (tr - 1.0) / 2.0)


def axis_angle(rotation):
    """(unit axis (float64 (3,)), angle in degrees in [0, 180]) of a proper rotation.

    The axis of the identity is reported as z.  For a half turn the axis sign is
    chosen with its first non-zero component positive.

    Raises
    ------
    DataError
        If ``rotation`` is not a proper rotation matrix.

    Examples
    --------
    >>> axis, angle = axis_angle(rotation_from_axis_angle([1, 1, 1], 120))
    >>> (axis * np.sqrt(3)).round(9).tolist(), round(angle, 9)
    ([1.0, 1.0, 1.0], 120.0)
    """
    r = as_rotation(rotation)
    ang = float(_angles(r))
    w = np.array([r[2, 1] - r[1, 2], r[0, 2] - r[2, 0], r[1, 0] - r[0, 1]])
    if ang < 1e-12:
        return np.array([0.0, 0.0, 1.0]), 0.0
    if np.pi - ang > 1e-6:
        axis = w / np.linalg.norm(w)
    else:
        m = (r + np.eye(3)) / 2.0
        j = int(np.argmax(np.diag(m)))
        axis = m[:, j] / np.linalg.norm(m[:, j])
        k = int(np.flatnonzero(np.abs(axis) > 1e-9)[0])
        axis = axis if axis[k] > 0 else -axis
        if np.linalg.norm(w) > 1e-12 and np.dot(w, axis) < 0:  # near (not at) a half turn
            axis = -axis
    return axis, math.degrees(ang)


def _rz(a):
    c, s = np.cos(a), np.sin(a)
    z, o = np.zeros_like(a), np.ones_like(a)
    return np.stack([np.stack([c, -s, z], -1), np.stack([s, c, z], -1), np.stack([z, z, o], -1)], -2)


def _ry(b):
    c, s = np.cos(b), np.sin(b)
    z, o = np.zeros_like(b), np.ones_like(b)
    return np.stack([np.stack([c, z, s], -1), np.stack([z, o, z], -1), np.stack([-s, z, c], -1)], -2)


def rotation_from_euler(alpha, beta, gamma):
    """``Rz(alpha) @ Ry(beta) @ Rz(gamma)`` for angles in degrees (float64 (3, 3); arrays stack).

    Examples
    --------
    >>> rotation_from_euler(0, 90, 0).round(12).tolist()
    [[0.0, 0.0, 1.0], [0.0, 1.0, 0.0], [-1.0, 0.0, 0.0]]
    """
    a, b, g = (np.radians(_real_array(v, n)) for v, n in ((alpha, "alpha"), (beta, "beta"), (gamma, "gamma")))
    if not all(np.all(np.isfinite(v)) for v in (a, b, g)):
        raise DataError("Euler angles must be finite numbers of degrees")
    return _rz(a) @ _ry(b) @ _rz(g)


def euler_angles(rotation):
    """(alpha, beta, gamma) in degrees, z-y-z convention (see the module notes).

    Raises
    ------
    DataError
        If ``rotation`` is not a proper rotation matrix.

    Examples
    --------
    >>> [round(v, 9) for v in euler_angles(rotation_from_axis_angle([0, 1, 0], 30))]
    [0.0, 30.0, 0.0]
    """
    r = as_rotation(rotation)
    beta = math.acos(max(-1.0, min(1.0, float(r[2, 2]))))
    if math.sin(beta) > 1e-9:
        alpha = math.atan2(r[1, 2], r[0, 2])
        gamma = math.atan2(r[2, 1], -r[2, 0])
    else:
        gamma = 0.0
        alpha = math.atan2(r[1, 0], r[0, 0]) if r[2, 2] > 0 else math.atan2(-r[1, 0], -r[0, 0])
    out = []
    for v in (alpha, beta, gamma):
        d = math.degrees(v)
        out.append(180.0 if abs(d + 180.0) < 1e-12 else d + 0.0)
    return tuple(out)


def misorientation(r1, r2):
    """Angle in degrees of ``r1 @ r2.T`` (stacks broadcast; float64 array or float).

    Examples
    --------
    >>> round(float(misorientation(rotation_from_euler(10, 0, 0), np.eye(3))), 9)
    10.0
    """
    a = as_rotation(r1, proper=False, name="r1")
    b = as_rotation(r2, proper=False, name="r2")
    m = np.einsum("...ij,...kj->...ik", a, b)
    return np.degrees(_angles(m))


def _quat_to_matrix(q):
    q = q / np.linalg.norm(q, axis=-1, keepdims=True)
    w, x, y, z = q[..., 0], q[..., 1], q[..., 2], q[..., 3]
    return np.stack([
        np.stack([1 - 2 * (y * y + z * z), 2 * (x * y - w * z), 2 * (x * z + w * y)], -1),
        np.stack([2 * (x * y + w * z), 1 - 2 * (x * x + z * z), 2 * (y * z - w * x)], -1),
        np.stack([2 * (x * z - w * y), 2 * (y * z + w * x), 1 - 2 * (x * x + y * y)], -1),
    ], -2)


def random_rotations(n, *, seed=None):
    """``n`` rotations drawn uniformly (Haar measure) from SO(3): float64 (n, 3, 3).

    Uniform unit quaternions are normalised 4-d Gaussian vectors (common practice).

    Examples
    --------
    >>> random_rotations(2, seed=1).shape
    (2, 3, 3)
    """
    if isinstance(n, bool) or not isinstance(n, numbers.Integral) or n < 0:
        raise DataError(f"n must be a non-negative integer, got {n!r}")
    rng = np.random.default_rng(seed)
    return _quat_to_matrix(rng.standard_normal((int(n), 4)))


def _fibonacci_sphere(m):
    """m nearly uniform unit vectors (the golden-angle spiral)."""
    i = np.arange(m, dtype=np.float64) + 0.5
    z = 1.0 - 2.0 * i / m
    rho = np.sqrt(np.maximum(0.0, 1.0 - z * z))
    phi = np.pi * (3.0 - np.sqrt(5.0)) * i
    return np.stack([rho * np.cos(phi), rho * np.sin(phi), z], -1)


def _z_to(n):
    """Rotations taking z to each unit vector of n (m, 3): about the axis z x n."""
    c = n[:, 2]
    k = np.stack([-n[:, 1], n[:, 0], np.zeros_like(c)], -1)  # z x n, |k| = sin
    s = np.linalg.norm(k, axis=-1)
    u = np.where(s[:, None] > 1e-12, k / np.where(s > 1e-12, s, 1.0)[:, None], np.array([1.0, 0.0, 0.0]))
    ang = np.arctan2(s, c)
    ux = np.zeros((len(n), 3, 3))
    ux[:, 0, 1], ux[:, 0, 2] = -u[:, 2], u[:, 1]
    ux[:, 1, 0], ux[:, 1, 2] = u[:, 2], -u[:, 0]
    ux[:, 2, 0], ux[:, 2, 1] = -u[:, 1], u[:, 0]
    cw, sw = np.cos(ang)[:, None, None], np.sin(ang)[:, None, None]
    return cw * np.eye(3) + sw * ux + (1 - cw) * np.einsum("ni,nj->nij", u, u)


def rotation_grid(resolution):
    """A deterministic grid over SO(3) with spacing about ``resolution`` degrees.

    The grid is the product of ``ceil(4 pi / d^2)`` directions on a Fibonacci
    (golden-angle) sphere, d = resolution in radians, each reached from z by the
    shortest rotation, and ``ceil(360 / resolution)`` turns about z before it:
    ``G = A(n) @ Rz(gamma)``.  Measured on 40 000 random rotations, every one
    lies within 1.05 x resolution of a grid point (1.01 x at 10 degrees) and
    99.9 % within 0.9 x (see the tests).

    Parameters
    ----------
    resolution : float
        Spacing in degrees, between 1 and 90.

    Returns
    -------
    numpy.ndarray
        float64 (m, 3, 3), m about 8 pi^2 / d^3 (15 000 at 10 degrees).

    Raises
    ------
    DataError
        For a resolution outside [1, 90].

    Examples
    --------
    >>> rotation_grid(30).shape
    (552, 3, 3)
    """
    return shared_grid(resolution).copy()


def shared_grid(resolution):
    """The grid of :func:`rotation_grid`, validated, as a cached read-only array (private use)."""
    if isinstance(resolution, bool) or not isinstance(resolution, numbers.Real) or not 1 <= resolution <= 90:
        raise DataError(f"resolution must be a number of degrees in [1, 90], got {resolution!r}")
    return _grid(float(resolution))


@lru_cache(maxsize=8)
def _grid(resolution):
    """The cached (read-only) grid of :func:`rotation_grid`."""
    d = math.radians(float(resolution))
    m_dir = max(2, math.ceil(4 * math.pi / (d * d)))
    m_ang = max(1, math.ceil(360.0 / float(resolution)))
    a = _z_to(_fibonacci_sphere(m_dir))
    g = _rz(np.arange(m_ang) * (2 * np.pi / m_ang))
    out = np.einsum("aij,bjk->abik", a, g).reshape(-1, 3, 3)
    out.setflags(write=False)
    return out


def rotate_values(values, rotation, what, *, layout="auto"):
    """Numeric tensors in a rotated frame: t'_{ij..} = R_ia R_jb ... t_{ab..} (stacks broadcast).

    Parameters
    ----------
    values : array_like
        Voigt arrays (..., 6, 6), full arrays (..., 3, 3, 3, 3) etc. of the
        property (the layout is kept), or a TensorData (a TensorData is returned,
        covariance propagated).  Plain arrays are read at the entries of the
        component labels without checking their index symmetry (use
        ``tensym.tensor_data`` for that).
    rotation : array_like
        Orthogonal 3x3 matrix or a stack (..., 3, 3) broadcasting with values.
    what : str, Property or TensorSpec
        The property (for its Voigt factors and axial parity).
    layout : {'auto', 'voigt', 'full'}
        How to read ``values``; 'auto' tells them apart by their trailing shape.

    Returns
    -------
    numpy.ndarray
        float64, the rotated values in the layout they came in.

    Raises
    ------
    DataError
        For a shape that fits neither layout, or a non-orthogonal rotation.
    InvalidOptionError
        For a layout outside the set.

    Examples
    --------
    >>> import numpy as np
    >>> d = np.zeros((3, 6)); d[2, 2] = 5.0          # d33 along z
    >>> r = rotation_from_axis_angle([1, 0, 0], 90)  # z goes to -y
    >>> float(rotate_values(d, r, "piezoelectric_d")[1, 1])   # d22 = -5
    -5.0
    """
    from tensym.data.dataset import TensorData
    from tensym.data.model import layout as _layout, rotate_full
    from tensym.errors import InvalidOptionError
    from tensym.tensors.form import as_property

    prop = as_property(what)
    r = as_rotation(rotation, proper=False)
    if isinstance(values, TensorData):
        return values.rotated(r)
    lay = _layout(prop)
    if layout not in ("auto", "voigt", "full"):
        raise InvalidOptionError(f"layout={layout!r} is not one of auto, voigt, full")
    arr = _real_array(values, "values")
    if not np.all(np.isfinite(arr)):
        raise DataError("values contain NaN or inf: a rotation mixes the components, so every one must be a "
                        "finite number (NaN marks an unknown component)")
    vs, fs = lay.voigt_shape, (3,) * lay.rank
    k = len(vs)
    is_voigt = arr.ndim >= k and arr.shape[arr.ndim - k:] == vs
    is_full = arr.ndim >= lay.rank and arr.shape[arr.ndim - lay.rank:] == fs
    if layout == "voigt" and not is_voigt or layout == "full" and not is_full or not (is_voigt or is_full):
        raise DataError(f"values for {prop.name} must end in the Voigt shape {vs} or the full shape {fs}, "
                        f"got {arr.shape}")
    use_voigt = is_voigt if layout == "auto" else layout == "voigt"
    if use_voigt and vs != fs:
        lead = arr.shape[: arr.ndim - k]
        x = arr.reshape(lead + (-1,))[..., lay._voigt_rep]
        t = lay.x_to_full(x)
    else:
        t = arr
    out = rotate_full(t, r, lay.rank)
    if prop.spec.axial:
        out = out * np.sign(np.linalg.det(r))[(...,) + (None,) * lay.rank]
    if use_voigt and vs != fs:
        return lay.x_to_voigt(lay.full_to_x(out))
    return out
