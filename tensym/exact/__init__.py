"""Small exact-arithmetic helpers shared by the exact core.

Entries of symmetry matrices are sympy numbers: rationals, or algebraic numbers
such as ``sqrt(3)/2`` (hexagonal axes) and ``(1 + sqrt(5))/4`` (icosahedral
groups).  These helpers keep such matrices canonical (expanded) and give each a
float image for fast identification.

Examples
--------
>>> from tensym.exact import exact_matrix, matmul
>>> r = exact_matrix([[0, -1, 0], [1, 0, 0], [0, 0, 1]])
>>> matmul(r, r)
Matrix([
[-1,  0, 0],
[ 0, -1, 0],
[ 0,  0, 1]])
"""

from tensym.exact.matrices import (
    exact_matrix,
    float_key,
    is_orthogonal,
    matmul,
    to_float,
    quadratic_field,
)

__all__ = ["exact_matrix", "float_key", "is_orthogonal", "matmul", "to_float", "quadratic_field"]
