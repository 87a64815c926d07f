"""The one representation abstraction: a point group acting on a vector space.

Every space tensym works with (tensor spaces with intrinsic index symmetry,
angular-momentum spaces D^l, homogeneous polynomials, products of irreps)
implements :class:`Space`.  The features of tensym are thin functions over it:
a tensor form is the projection onto the trivial irrep, a symmetry-adapted
basis the projection onto another irrep, a decomposition the reduction formula
on :meth:`Space.character`.

Conventions
-----------
* ``action(op)`` is the exact matrix D(op) of the operation on the space's
  coordinate vectors: coordinates ``v`` of an element become ``D(op) v`` after
  the operation is applied (active), and ``D(g @ h) == D(g) * D(h)``.
* Time reversal, axial sign and any other parity are included by the space.
* ``lie_action(L)`` is the derivative at t = 0 of ``action(exp(t L))`` for an
  antisymmetric generator L; continuous groups use it.

Examples
--------
>>> from tensym.reps.space import Space
>>> Space.__abstractmethods__ >= {"action", "dim"}
True
"""

from abc import ABC, abstractmethod

import sympy as sp

__all__ = ["Space"]


class Space(ABC):
    """Abstract space with a linear action of point-group operations."""

    @property
    @abstractmethod
    def dim(self):
        """Dimension of the space (int)."""

    @abstractmethod
    def action(self, op):
        """Exact matrix (sympy.ImmutableMatrix, dim x dim) of ``op`` on coordinates."""

    def lie_action(self, generator):
        """Exact matrix of an infinitesimal rotation generator on coordinates."""
        raise NotImplementedError(f"{type(self).__name__} has no infinitesimal action")

    def character(self, op):
        """Exact character: the trace of :meth:`action`."""
        return sp.nsimplify(sp.expand(self.action(op).trace()))

    def element(self, coords):
        """The object (polynomial, sympy Array, ...) with the given coordinates."""
        raise NotImplementedError(f"{type(self).__name__} does not build elements")

    def coordinates(self, obj):
        """Coordinates of ``obj`` in this space's basis (inverse of :meth:`element`)."""
        raise NotImplementedError(f"{type(self).__name__} does not read elements")

    def gram(self):
        """Gram matrix of the natural inner product in these coordinates (default: identity)."""
        return sp.ImmutableMatrix(sp.eye(self.dim))
