"""Exact rotation of symbolic tensors (sympy): :func:`rotate_tensor`.

Convention: active rotation of every index,
``T'_{i1..in} = R_{i1 a1} ... R_{in an} T_{a1..an}``, times det(R) for an axial
tensor.  With R the matrix of a symmetry operation of a group, a tensor of the
group's reduced form is left unchanged (tested for every catalog group).
Entries stay exact: rationals, radicals such as sqrt(3)/2, symbols.

Examples
--------
>>> import sympy as sp
>>> from tensym.tensors.rotate import rotate_tensor
>>> a, b = sp.symbols("a b", real=True)
>>> t = sp.Array([[a, 0, 0], [0, a, 0], [0, 0, b]])
>>> r = sp.Matrix([[0, 0, 1], [0, 1, 0], [-1, 0, 0]])      # 90 degrees about y
>>> rotate_tensor(t, r)
[[b, 0, 0], [0, a, 0], [0, 0, a]]
"""

from itertools import product

import sympy as sp

from tensym.errors import InvalidOperationError, InvalidSpecError

__all__ = ["rotate_tensor", "rotation_matrix_of"]


def rotation_matrix_of(rotation):
    """An exact orthogonal 3x3 sympy ImmutableMatrix from a matrix, nested list or Operation.

    Raises
    ------
    InvalidOperationError
        If it is not 3x3, has float entries, or is not orthogonal (exactly).

    Examples
    --------
    >>> rotation_matrix_of([[0, -1, 0], [1, 0, 0], [0, 0, 1]]).det()
    1
    """
    m = getattr(rotation, "matrix", rotation)
    try:
        r = sp.Matrix(m)
    except (TypeError, ValueError, sp.SympifyError) as exc:
        raise InvalidOperationError(f"cannot read {rotation!r} as a 3x3 matrix") from exc
    if r.shape != (3, 3):
        raise InvalidOperationError(f"a rotation must be 3x3, got shape {r.shape}")
    if any(x.has(sp.Float) for x in r):
        raise InvalidOperationError("the rotation has float entries; give exact entries (integers, "
                                    "sympy.Rational, sympy.sqrt(3)/2, ...) or use tensym.rotate_values for floats")
    check = (r * r.T - sp.eye(3)).applyfunc(lambda v: sp.simplify(sp.expand(v)))
    if any(v != 0 for v in check):
        raise InvalidOperationError(f"the matrix {r.tolist()} is not orthogonal (R R^T != 1)")
    return sp.ImmutableMatrix(r)


def rotate_tensor(tensor, rotation, *, axial=False):
    """The exact tensor in a rotated frame (or an exact symmetry image of it).

    Parameters
    ----------
    tensor : sympy Array, Matrix, nested list, or TensorForm
        A Cartesian tensor of any rank (3 x 3 x ... x 3); a TensorForm gives
        its ``tensor`` and its axial parity.
    rotation : sympy Matrix, nested list or Operation
        Exact orthogonal 3x3 matrix (proper or improper).
    axial : bool
        Multiply by det(R) (pseudo-tensor); taken from the TensorForm when one is given.

    Returns
    -------
    sympy.ImmutableDenseNDimArray
        Same shape, entries expanded.

    Raises
    ------
    InvalidSpecError
        If ``tensor`` is not 3 x ... x 3.
    InvalidOperationError
        If ``rotation`` is not an exact orthogonal 3x3 matrix.

    Examples
    --------
    >>> import sympy as sp
    >>> import tensym
    >>> f = tensym.tensor_form("piezoelectric_d", "32")
    >>> r = tensym.point_group("32").operations[1].matrix
    >>> rotate_tensor(f, r) == f.tensor
    True
    """
    if hasattr(tensor, "tensor") and hasattr(tensor, "property"):
        axial = bool(tensor.property.spec.axial) or axial
        tensor = tensor.tensor
    try:
        arr = sp.Array(tensor)
    except (TypeError, ValueError) as exc:
        raise InvalidSpecError(f"cannot read {type(tensor).__name__} as a tensor") from exc
    shape = arr.shape
    if any(d != 3 for d in shape):
        raise InvalidSpecError(f"a Cartesian tensor has every dimension 3, got shape {shape}")
    r = rotation_matrix_of(rotation)
    rank = len(shape)
    if rank == 0:
        out = sp.ImmutableDenseNDimArray([arr[()] * (r.det() if axial else 1)], ())
        return out
    cur = {idx: arr[idx] for idx in product(range(3), repeat=rank)}
    for p in range(rank):
        nxt = {}
        for idx in product(range(3), repeat=rank):
            total = sp.Integer(0)
            for a in range(3):
                coef = r[idx[p], a]
                if coef != 0:
                    src = idx[:p] + (a,) + idx[p + 1:]
                    v = cur[src]
                    if v != 0:
                        total += coef * v
            nxt[idx] = total
        cur = nxt
    fac = sp.simplify(r.det()) if axial else sp.Integer(1)
    vals = [sp.expand(fac * cur[idx]) for idx in product(range(3), repeat=rank)]
    return sp.ImmutableDenseNDimArray(vals, shape)
