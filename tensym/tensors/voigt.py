"""Voigt notation: conversion between full Cartesian tensors and Voigt arrays.

Pairs 11->1, 22->2, 33->3, 23->4, 13->5, 12->6.  Each property's factor
convention (see ``tensym.tensors.catalog``) is applied: for a property with
``halved`` groups the Voigt constant is 2 (or 4, ...) times the tensor
component for each shear pair (compliance s, piezoelectric d).

Examples
--------
>>> import numpy as np
>>> from tensym.tensors.voigt import to_voigt, from_voigt
>>> s = np.zeros((6, 6)); s[3, 3] = 4.0
>>> t = from_voigt(s, "elastic_compliance")
>>> float(t[1, 2, 1, 2]), float(to_voigt(t, "elastic_compliance")[3, 3])
(1.0, 4.0)
"""

from itertools import product

import numpy as np

from tensym.errors import DataError

__all__ = ["to_voigt", "from_voigt", "voigt_shape", "voigt_index", "VOIGT_TO_PAIR"]

VOIGT_TO_PAIR = {1: (0, 0), 2: (1, 1), 3: (2, 2), 4: (1, 2), 5: (0, 2), 6: (0, 1)}
_PAIR_TO_VOIGT = {(0, 0): 0, (1, 1): 1, (2, 2): 2, (1, 2): 3, (2, 1): 3, (0, 2): 4, (2, 0): 4, (0, 1): 5, (1, 0): 5}


def _prop(what):
    from tensym.tensors.form import as_property

    return as_property(what)


def voigt_index(i, j):
    """0-based Voigt index of the 0-based Cartesian pair (i, j).

    Examples
    --------
    >>> voigt_index(1, 2)
    3
    """
    return _PAIR_TO_VOIGT[(i, j)]


def voigt_shape(what):
    """Shape of the Voigt array of a property, e.g. (6, 6) for elasticity, (3, 6) for d.

    Examples
    --------
    >>> voigt_shape("piezoelectric_d")
    (3, 6)
    """
    p = _prop(what)
    return tuple(3 if len(g) == 1 else 6 for g in p.voigt_groups)


def _maps(p):
    """For each full index: (voigt index tuple, factor tensor->voigt)."""
    rank = p.spec.rank
    out = []
    for idx in product(range(3), repeat=rank):
        v, fac = [], 1.0
        for g, h in zip(p.voigt_groups, p.halved):
            if len(g) == 1:
                v.append(idx[g[0]])
            else:
                a, b = idx[g[0]], idx[g[1]]
                v.append(_PAIR_TO_VOIGT[(a, b)])
                if h and a != b:
                    fac *= 2.0
        out.append((idx, tuple(v), fac))
    return out


def _is_symbolic(tensor):
    import sympy as sp

    if isinstance(tensor, (sp.NDimArray, sp.MatrixBase)):
        return True
    arr = np.asarray(tensor, dtype=object) if not isinstance(tensor, np.ndarray) else tensor
    return arr.dtype == object and any(isinstance(v, sp.Basic) and not v.is_number for v in arr.ravel())


def _to_voigt_exact(tensor, p):
    """sympy ImmutableMatrix (one or two Voigt groups) or ImmutableDenseNDimArray of an exact tensor."""
    import sympy as sp

    arr = sp.Array(tensor)
    rank = p.spec.rank
    if arr.shape != (3,) * rank:
        raise DataError(f"{p.name} needs a tensor of shape {(3,) * rank}, got {arr.shape}")
    shape = voigt_shape(p)
    out = {}
    for idx, v, fac in _maps(p):
        if v not in out:
            out[v] = sp.expand(arr[idx] * int(fac)) if rank else arr[()]
    entries = [out[v] for v in product(*[range(d) for d in shape])]
    if len(shape) == 1:
        return sp.ImmutableMatrix(shape[0], 1, entries)
    if len(shape) == 2:
        return sp.ImmutableMatrix(shape[0], shape[1], entries)
    return sp.ImmutableDenseNDimArray(entries, shape)


def to_voigt(tensor, what):
    """Voigt array of a full Cartesian tensor, with the property's factors.

    Accepts a stack (..., 3, ..., 3) of numbers (float64 result; the leading
    axes are kept), or one exact tensor with sympy entries (a sympy Array or
    Matrix, or entries with symbols), which gives a sympy ImmutableMatrix
    (an ImmutableDenseNDimArray for three or more Voigt groups).

    Raises
    ------
    DataError
        For a wrong shape.
    """
    p = _prop(what)
    if _is_symbolic(tensor):
        return _to_voigt_exact(tensor, p)
    t = np.asarray(tensor, dtype=np.float64)
    rank = p.spec.rank
    if t.ndim < rank or t.shape[t.ndim - rank:] != (3,) * rank:
        raise DataError(f"{p.name} needs a tensor of shape {(3,) * rank}, got {t.shape}")
    lead = t.shape[: t.ndim - rank]
    out = np.zeros(lead + voigt_shape(p), dtype=np.float64)
    for idx, v, fac in _maps(p):
        out[(...,) + v] = t[(...,) + idx] * fac
    return out


def from_voigt(array, what):
    """Full Cartesian tensor (float64) from a Voigt array, with the property's factors.

    Accepts a stack (..., 6, 6) etc.; the leading axes are kept.  The Voigt array
    must respect the property's own symmetry where Voigt keeps it (a stiffness
    matrix must be symmetric): the check is left to the caller (tensym.data).

    Raises
    ------
    DataError
        For a wrong shape.
    """
    p = _prop(what)
    a = np.asarray(array, dtype=np.float64)
    vs = voigt_shape(p)
    k = len(vs)
    if a.ndim < k or a.shape[a.ndim - k:] != vs:
        raise DataError(f"{p.name} in Voigt notation has shape {vs}, got {a.shape}")
    lead = a.shape[: a.ndim - k]
    out = np.zeros(lead + (3,) * p.spec.rank, dtype=np.float64)
    for idx, v, fac in _maps(p):
        out[(...,) + idx] = a[(...,) + v] / fac
    return out
