"""A TensorSpec as a representation space (the :class:`tensym.reps.space.Space` interface).

Coordinates are the tensor components at the orbit representatives
(``TensorSpec.basis_indices``); basis vector o is the signed sum of the unit
tensors of orbit o.  The natural inner product is the full-tensor (Frobenius)
one, so the Gram matrix is diagonal with the orbit sizes.

Examples
--------
>>> from tensym.tensors.spec import TensorSpec
>>> from tensym.groups.operations import Operation
>>> sp_ = TensorSpec(2, ["ji"]).as_space()
>>> sp_.dim, sp_.character(Operation.from_triplet("-y,x,z"))
(6, 0)
"""

import numpy as np
import sympy as sp

from tensym.reps.space import Space
from tensym.tensors.kernels import (
    lie_action_exact,
    monomial_action,
    monomial_form,
    quadratic_action,
    quadratic_form,
    sympy_action,
)

__all__ = ["TensorSpace"]


class TensorSpace(Space):
    """The reduced tensor space of a TensorSpec with its exact group action."""

    def __init__(self, spec):
        self.spec = spec

    @property
    def dim(self):
        return self.spec.dim

    def action(self, op):
        orb = self.spec.orbits
        n = len(orb.reps)
        par = self.spec.parity(op)
        mono = monomial_form(op)
        if mono is not None:
            M = sp.zeros(n, n)
            for o, (o2, s) in enumerate(monomial_action(orb, *mono)):
                M[o2, o] = s * par
            return sp.ImmutableMatrix(M)
        q = quadratic_form(op)
        if q is not None:
            d, den, _, _ = q
            A, B = quadratic_action(orb, q)
            scale = sp.Integer(den) ** self.spec.rank
            root = sp.sqrt(d)
            M = sp.Matrix(n, n, lambda i, j: (int(A[i, j]) + int(B[i, j]) * root) * par / scale)
            return sp.ImmutableMatrix(M)
        return sp.ImmutableMatrix(sympy_action(orb, op.matrix) * par)

    def lie_action(self, generator):
        return sp.ImmutableMatrix(lie_action_exact(self.spec.orbits, generator))

    def character(self, op):
        return self.spec.character(op)

    def element(self, coords):
        """The full tensor (sympy Array) with the given coordinates."""
        orb = self.spec.orbits
        comp = [sp.Integer(0)] * (3**self.spec.rank)
        for flat in range(3**self.spec.rank):
            o = int(orb.orbit_of[flat])
            if o >= 0:
                comp[flat] = sp.sympify(coords[o]) * int(orb.sign_of[flat])
        return sp.ImmutableDenseNDimArray(comp, (3,) * self.spec.rank)

    def coordinates(self, obj):
        """Coordinates of a full tensor: its components at the representatives."""
        arr = sp.Array(obj)
        return [arr[rep] for rep in self.spec.orbits.reps]

    def gram(self):
        sizes = [len(m) for m in self.spec.orbits.members]
        return sp.ImmutableMatrix(sp.diag(*sizes))
