"""Private kernels: the action of one operation on a reduced tensor space.

The reduced space has one coordinate per orbit of index tuples (see
``TensorSpec.orbits``); coordinate o is the tensor component at the orbit's
representative index, and basis vector E_o is the signed sum of the unit
tensors of the orbit.  ``M[o', o]`` is the E_o' coefficient of R.E_o, so that
the components t of a tensor become ``M t`` under the operation.

Three kernels, chosen by the operation (reasons in each docstring):

* signed permutation matrices (all of the cubic, tetragonal, orthorhombic,
  monoclinic and triclinic generators, and the 2-folds and mirrors of the
  hexagonal family): M is monomial, found in O(dim * rank) by mapping
  representatives;
* matrices with entries in one quadratic field Q(sqrt(d)) (the 3- and 6-folds,
  icosahedral operations): M = (A + sqrt(d) B) / D**rank with integer A, B,
  built by Kronecker products of integer rows in numpy int64 and summed over
  orbits; exact, and as fast as the same computation in float64;
* anything else (a group re-oriented by a rotation with entries in a larger
  field): exact sympy arithmetic, slower but general.

Examples
--------
>>> from tensym.tensors.spec import TensorSpec
>>> from tensym.tensors.kernels import monomial_form, monomial_action
>>> spec = TensorSpec(2, ["ji"])
>>> perm, signs = monomial_form([[0, 1, 0], [1, 0, 0], [0, 0, -1]])
>>> monomial_action(spec.orbits, perm, signs)[:3]
[(3, 1), (1, 1), (4, -1)]
"""

from fractions import Fraction
import math

import numpy as np
import sympy as sp

from tensym.exact.matrices import quadratic_field, split_quadratic

__all__ = [
    "monomial_form",
    "monomial_action",
    "quadratic_form",
    "quadratic_action",
    "fits_int64",
    "float_action",
    "lie_action",
    "lie_action_exact",
    "integer_generator",
    "sympy_action",
]


_FORM_CACHE = {}


def monomial_form(matrix):
    """(perm, signs) with R[perm[i], i] = signs[i] when R is a signed permutation, else None.

    R maps basis vector e_i to signs[i] * e_perm[i].  ``matrix`` is a 3x3 exact
    matrix or an Operation (then its key is the cache key).  Results are cached.
    """
    key = ("m", matrix.key if hasattr(matrix, "key") else tuple(sp.ImmutableMatrix(matrix)))
    if key not in _FORM_CACHE:
        _FORM_CACHE[key] = _monomial_form(matrix)
    return _FORM_CACHE[key]


def _monomial_form(matrix):
    m = sp.Matrix(getattr(matrix, "matrix", matrix))
    perm, signs = [None] * 3, [0] * 3
    for i in range(3):
        col = [m[r, i] for r in range(3)]
        nz = [r for r in range(3) if col[r] != 0]
        if len(nz) != 1 or col[nz[0]] not in (1, -1):
            return None
        perm[i] = nz[0]
        signs[i] = int(col[nz[0]])
    return tuple(perm), tuple(signs)


def monomial_action(orbits, perm, signs):
    """For each orbit o, (o', s) with R.E_o = s E_o' for a signed permutation R."""
    reps = _rep_array(orbits)
    if orbits.rank == 0:
        return [(0, 1)]
    p = np.asarray(perm, dtype=np.int64)
    sg = np.asarray(signs, dtype=np.int64)
    img = p[reps]
    s = np.prod(sg[reps], axis=1)
    flat = img @ orbits.weights
    o2 = orbits.orbit_of[flat]
    s2 = orbits.sign_of[flat] * s
    return list(zip(o2.tolist(), s2.tolist()))


def quadratic_form(matrix):
    """(d, D, A, B) with R = (A + sqrt(d) B) / D for integer arrays A, B, or None.

    d is 1 for a rational matrix (then B is zero).  Results are cached per matrix
    (the arrays handed out are read-only).
    """
    key = ("q", matrix.key if hasattr(matrix, "key") else tuple(sp.ImmutableMatrix(matrix)))
    if key not in _FORM_CACHE:
        _FORM_CACHE[key] = _quadratic_form(matrix)
    return _FORM_CACHE[key]


def _quadratic_form(matrix):
    entries = list(sp.Matrix(getattr(matrix, "matrix", matrix)))
    d = quadratic_field(entries)
    if d is None:
        return None
    parts = [split_quadratic(e, d) for e in entries]
    den = 1
    for a, b in parts:
        den = math.lcm(den, a.denominator, b.denominator)
    A = np.array([int(a * den) for a, _ in parts], dtype=np.int64).reshape(3, 3)
    B = np.array([int(b * den) for _, b in parts], dtype=np.int64).reshape(3, 3)
    A.flags.writeable = False
    B.flags.writeable = False
    return d, den, A, B


def _aggregate(orbits, K):
    """Sum the columns of K (over flat indices) into orbit columns with signs (tables from ``orbits._agg``)."""
    order, sgn, starts = orbits._agg
    return np.add.reduceat(K[:, order] * sgn, starts, axis=1)


def _rep_array(orbits):
    """The representatives as a read-only int64 array (n, rank) (``orbits._reparr``)."""
    return orbits._reparr


def quadratic_action(orbits, qform):
    """Integer arrays (A, B) with M = (A + sqrt(d) B) / D**rank, for qform = (d, D, A, B).

    The entries are numpy int64 when the a-priori bound
    ``3**rank * ((1 + d) * max|A1, B1|)**rank`` is below 2**62 (then no
    intermediate value can overflow: each Kronecker step multiplies the bound
    by (1 + d) max, and the orbit sum adds at most 3**rank terms), and numpy
    object arrays of Python integers otherwise.
    """
    d, _, A1, B1 = qform
    reps = _rep_array(orbits)
    n = orbits.rank
    # the last Kronecker step holds k0, k1, two einsum products and n0, n1: six (n_orbits x 3**rank) int64 arrays
    orbits.require(orbits.dense_bytes(copies=6), "the action of a 3- or 6-fold axis (exact Kronecker products)")
    if n == 0:
        one = np.ones((1, 1), dtype=np.int64)
        return one, np.zeros_like(one)
    amax = max(int(np.abs(A1).max()), int(np.abs(B1).max()), 1)
    if not fits_int64(n, d, amax):
        A1 = A1.astype(object)
        B1 = B1.astype(object)
    k0 = A1[reps[:, 0], :]
    k1 = B1[reps[:, 0], :]
    for k in range(1, n):
        r0 = A1[reps[:, k], :]
        r1 = B1[reps[:, k], :]
        n0 = k0[:, :, None] * r0[:, None, :] + d * (k1[:, :, None] * r1[:, None, :])
        n1 = k0[:, :, None] * r1[:, None, :] + k1[:, :, None] * r0[:, None, :]
        k0 = n0.reshape(len(reps), -1)
        k1 = n1.reshape(len(reps), -1)
    return _aggregate(orbits, k0), _aggregate(orbits, k1)


def fits_int64(rank, d, amax):
    """True when the Kronecker products of :func:`quadratic_action` provably stay below 2**62.

    Examples
    --------
    >>> fits_int64(4, 3, 2), fits_int64(4, 1, 1261**2)
    (True, False)
    """
    return 3**rank * ((1 + d) * amax) ** rank < 2**62


def float_action(orbits, matrix):
    """float64 M for a float 3x3 matrix (the numeric twin of quadratic_action)."""
    R = np.asarray(matrix, dtype=np.float64)
    reps = _rep_array(orbits)
    n = orbits.rank
    orbits.require(orbits.dense_bytes(copies=3), "the numeric action of an operation (Kronecker products)")
    if n == 0:
        return np.ones((1, 1))
    k = R[reps[:, 0], :]
    for j in range(1, n):
        k = np.einsum("da,db->dab", k, R[reps[:, j], :]).reshape(len(reps), -1)
    return _aggregate(orbits, k)


def integer_generator(generator):
    """An integer matrix proportional to a Lie generator L (same algebra), or None.

    A generator of rotations about a rational direction, such as the
    re-oriented ``Q L_z Q^T`` with entries in Q(sqrt 2), is a multiple of an
    integer matrix; a generator about an irrational direction is not.
    """
    m = sp.Matrix(generator).applyfunc(lambda x: sp.radsimp(sp.nsimplify(x)))
    nz = [x for x in m if x != 0]
    if not nz:
        return None
    ratios = [sp.nsimplify(sp.radsimp(x / nz[0])) for x in m]
    if not all(r.is_Rational for r in ratios):
        return None
    den = math.lcm(*[int(r.q) for r in ratios])
    ints = [int(r * den) for r in ratios]
    g = math.gcd(*ints)
    return [[ints[3 * i + j] // g for j in range(3)] for i in range(3)]


def lie_action(orbits, generator):
    """Exact integer matrix (numpy int64) of an integer antisymmetric generator L.

    (dL.T)_{i1..in} = sum over positions k and c of L[i_k, c] T_{i1..c..in}.

    Raises
    ------
    ValueError
        If L has non-integer entries (scale it with :func:`integer_generator`
        first, or use :func:`lie_action_exact`).
    """
    rows = generator.tolist() if hasattr(generator, "tolist") else generator
    L = []
    for row in rows:
        out = []
        for x in row:
            x = sp.sympify(x)
            if not x.is_Integer:
                raise ValueError(f"lie_action needs an integer generator, got entry {x}")
            out.append(int(x))
        L.append(out)
    dim = len(orbits.reps)
    orbits.require(orbits.dense_bytes("orbits"), "the action of a rotation generator")
    N = np.zeros((dim, dim), dtype=np.int64)
    for o2, rep in enumerate(orbits.reps):
        for k, ik in enumerate(rep):
            for c in range(3):
                lv = L[ik][c]
                if lv == 0:
                    continue
                idx = rep[:k] + (c,) + rep[k + 1:]
                o, s = orbits.locate(idx)
                if o >= 0:
                    N[o2, o] += lv * s
    return N


def lie_action_exact(orbits, generator):
    """The same as :func:`lie_action` with sympy entries, for any exact generator."""
    L = sp.Matrix(generator)
    dim = len(orbits.reps)
    N = sp.zeros(dim, dim)
    for o2, rep in enumerate(orbits.reps):
        for k, ik in enumerate(rep):
            for c in range(3):
                lv = L[ik, c]
                if lv == 0:
                    continue
                idx = rep[:k] + (c,) + rep[k + 1:]
                o, s = orbits.locate(idx)
                if o >= 0:
                    N[o2, o] += lv * s
    return N.applyfunc(sp.expand)


def sympy_action(orbits, matrix):
    """Exact M as a sympy Matrix for any exact matrix (general, slow path)."""
    R = sp.Matrix(matrix)
    dim = len(orbits.reps)
    M = sp.zeros(dim, dim)
    from itertools import product as _product

    members = [
        [(tuple(int(x) for x in np.unravel_index(f, (3,) * orbits.rank)), int(orbits.sign_of[f])) for f in mem]
        for mem in orbits.members
    ]
    for o2, rep in enumerate(orbits.reps):
        for o, mem in enumerate(members):
            acc = sp.Integer(0)
            for idx, s in mem:
                term = sp.Integer(s)
                for a, b in zip(rep, idx):
                    term *= R[a, b]
                    if term == 0:
                        break
                acc += term
            M[o2, o] = sp.expand(acc)
    return M
