"""What symmetry do the numbers show: :func:`find_symmetry` and the symmetry classes of a property.

Symmetry classes
----------------
A property cannot tell apart two groups whose forms coincide, or whose forms
coincide after a rotation.  :func:`symmetry_classes` groups the 32
crystallographic classes, the icosahedral groups and the continuous groups
(each in its standard setting) accordingly:

1. groups with the same invariant subspace (the same orthogonal projector)
   are indistinguishable (for elasticity: every group of a Laue class, and
   6/mmm with D-infinity-h);
2. a set of groups whose generic tensor (random, seeded, constants of order 1)
   can be rotated into the form of a higher-symmetry set, with a residual
   below 1e-7, belongs to that set's class (for elasticity 4/m into 4/mmm by
   a turn about z that removes c16, -3 into -3m).  Only sets with at most
   3 - d more constants are tried, d the dimension of the rotations that map
   the higher form to itself (a rotation has 3 parameters), and only against a
   set whose highest group is continuous or has an order that is a multiple
   of this set's (Lagrange), with the catalog's highest group standing for
   the stabiliser of a generic tensor of the set.

Each class is named by its highest group; for the elastic tensors these are
the 8 symmetry classes of elasticity, isotropic, cubic, transversely
isotropic, tetragonal, trigonal, orthotropic, monoclinic and triclinic
(S. Forte and M. Vianello, J. Elasticity 43, 81 (1996)); the tests check the
count.

Finding
-------
:func:`find_symmetry` orients the data to the highest group of every class
(``tensym.orient``, one shared grid) and keeps the classes whose residual
after rotation is within ``tol`` (relative to the full-tensor Frobenius norm),
ordered from the highest symmetry (fewest independent constants, then the
largest group).

Examples
--------
>>> import numpy as np
>>> import tensym
>>> f = tensym.tensor_form("elastic_stiffness", "6/mmm")
>>> c = f.evaluate([200.0, 80.0, 60.0, 180.0, 40.0])
>>> lab = tensym.rotate_values(c, tensym.rotation_from_euler(10.0, 50.0, 0.0), "elastic_stiffness")
>>> found = tensym.find_symmetry(lab, "elastic_stiffness")
>>> found.best.name, found.best.residual_fraction < 1e-8
('transversely isotropic', True)
>>> [c.name for c in found.candidates][:3]
['transversely isotropic', 'tetragonal', 'trigonal']
"""

from dataclasses import dataclass, field
from functools import lru_cache
import math
import numbers

import numpy as np

from tensym.display import Displayed
from tensym.data.check import _group_name
from tensym.data.dataset import TensorData, tensor_data
from tensym.data.model import layout as _layout, numeric_form
from tensym.data.orient import Orientation, _equivalent_rotations, _orient_core, _require_orientable, default_resolution
from tensym.data.rotation import random_rotations, shared_grid
from tensym.errors import DataError
from tensym.tensors.form import as_property

__all__ = ["SymmetryClass", "SymmetryCandidate", "SymmetryFinding", "symmetry_classes", "find_symmetry"]

_ELASTIC_NAMES = (("O(3)", "isotropic"), ("m-3m", "cubic"), ("6/mmm", "transversely isotropic"),
                  ("4/mmm", "tetragonal"), ("-3m", "trigonal"), ("mmm", "orthotropic"),
                  ("2/m", "monoclinic"), ("-1", "triclinic"))
_ABSORB_TOL = 1e-7


@dataclass(frozen=True)
class SymmetryClass:
    """Groups a property cannot tell apart.

    Attributes
    ----------
    name : str
        The class name (the Forte-Vianello names for elastic tensors; otherwise
        'class of <highest group>').
    groups : tuple of str
        Symbols of the member groups (crystallographic first, highest first).
    representative : str
        Symbol of the highest group, the one the data are oriented to.
    n_independent : int
        Independent constants of the class's form.

    Examples
    --------
    >>> symmetry_classes("thermal_expansion")[1].groups[:3]
    ('6/mmm', '4/mmm', '-3m')
    """

    name: str
    groups: tuple
    representative: str
    n_independent: int
    _group: object = field(repr=False, compare=False, default=None)


@dataclass(frozen=True, eq=False)
class SymmetryCandidate:
    """One class tried by :func:`find_symmetry`.

    Attributes
    ----------
    name, groups, representative, n_independent
        As in :class:`SymmetryClass`.
    residual_fraction : float
        Frobenius residual fraction after the best rotation.
    consistent : bool
        ``residual_fraction <= tol``.
    orientation : Orientation
        The rotation into the representative's standard setting.
    """

    name: str
    groups: tuple
    representative: str
    n_independent: int
    residual_fraction: float
    consistent: bool
    orientation: Orientation = field(repr=False)


@dataclass(frozen=True, eq=False)
class SymmetryFinding(Displayed):
    """The result of :func:`find_symmetry`.

    Attributes
    ----------
    property : str
    tol : float
        Relative tolerance on the Frobenius residual fraction.
    candidates : tuple of SymmetryCandidate
        The consistent classes, highest symmetry first.
    rejected : tuple of SymmetryCandidate
        The others, highest symmetry first.
    best : SymmetryCandidate or None
        ``candidates[0]`` (None when not even the lowest class fits, e.g. for
        a property that vanishes in every group tried but not in the data).
    note : str
        What the property can and cannot tell apart.
    n_classes : int
        Number of symmetry classes of the property.

    Examples
    --------
    >>> import numpy as np
    >>> f = find_symmetry(np.eye(3) * 4.0, "thermal_conductivity")
    >>> f.best.name, f.n_classes, len(f.candidates)
    ('isotropic', 3, 3)
    """

    property: str
    tol: float
    candidates: tuple
    rejected: tuple
    best: SymmetryCandidate
    note: str
    n_classes: int

    def text(self):
        """Plain-text summary."""
        from tensym.data.render import finding_text

        return finding_text(self)

    __str__ = text

    def record(self):
        """JSON-ready dict (kind 'symmetry_finding')."""
        from tensym.data.render import finding_record

        return finding_record(self)

    def to_json(self):
        """JSON document (str)."""
        import json

        return json.dumps(self.record(), indent=2, ensure_ascii=False)

    def __repr__(self):
        b = self.best.name if self.best else "none"
        return f"<SymmetryFinding {self.property}: {b} (tol {self.tol:g})>"


def _candidate_groups():
    from tensym.groups import point_group, point_groups

    syms = list(point_groups()) + list(point_groups(which="icosahedral"))
    out = [(s, point_group(s)) for s in syms]
    for s in ("SO(3)", "O(3)", "Cinf", "Cinfv", "Cinfh", "Dinf", "Dinfh"):
        g = point_group(s)
        out.append((g.symbol, g))
    return out


def _order(g):
    return math.inf if getattr(g, "is_continuous", False) else g.order


def _rank_key(g):
    """Sort key of 'higher symmetry': Lie dimension, then the order of the discrete part."""
    if getattr(g, "is_continuous", False):
        return (len(g.lie_generators), len(g.generators))
    return (0, g.order)


def _is_elastic(prop):
    return prop.spec == as_property("elastic_stiffness").spec


@lru_cache(maxsize=32)
def _classes(prop):
    lay = _layout(prop)
    buckets = {}
    for sym, g in _candidate_groups():
        nf = numeric_form(prop, g)
        p = nf.Q @ nf.Q.T
        key = (nf.k, np.round(p, 7).tobytes())
        buckets.setdefault(key, []).append((sym, g, nf))
    blist = []
    for (k, _), members in buckets.items():
        members.sort(key=lambda m: _rank_key(m[1]), reverse=True)
        blist.append([k, members])
    blist.sort(key=lambda b: (b[0], tuple(-v for v in _rank_key(b[1][0][1]))))
    parent = list(range(len(blist)))
    rng = np.random.default_rng(19960101)
    res = min(15.0, default_resolution(lay.rank) * 1.5)  # exact generic tensors: a coarser grid will do
    grid = shared_grid(res)
    for i, (k_b, mem_b) in enumerate(blist):
        nf_b = mem_b[0][2]
        if k_b == 0:
            continue
        x = nf_b.A @ rng.normal(size=k_b)
        # a generic tensor of the set, put into a general frame first
        rot = random_rotations(1, seed=int(rng.integers(1 << 30)))[0]
        data = TensorData(prop, x, None, None, "generic")
        data = data.rotated(rot)
        for j in range(i):
            k_c, mem_c = blist[j]
            if parent[j] != j or k_c == 0:
                continue
            # the rotated copies of V_C fill at most k_C + (3 - Lie dimension of its stabiliser) dimensions
            lie_c = len(_equivalent_rotations(mem_c[0][2], mem_c[0][1])[1])
            if not 0 < k_b - k_c <= 3 - lie_c:
                continue
            o_c, o_b = _order(mem_c[0][1]), _order(mem_b[0][1])
            if o_c <= o_b or (o_c != math.inf and o_c % o_b):
                continue  # Lagrange: the class's group must contain a copy of this set's group
            o = _orient_core(data, mem_c[0][1], mem_c[0][2], grid, res, 2)
            if o.residual_fraction < _ABSORB_TOL:
                parent[i] = j
                break
    classes = []
    for j, (k, mem) in enumerate(blist):
        if parent[j] != j:
            continue
        members = [m for i, b in enumerate(blist) if _root(parent, i) == j for m in b[1]]
        # crystallographic groups first (highest first), then icosahedral, then continuous
        members.sort(key=lambda m: (getattr(m[1], "is_continuous", False),
                                    getattr(m[1], "crystal_system", "") == "icosahedral", -_order(m[1])))
        rep_sym, rep_g, _ = max(mem, key=lambda m: _rank_key(m[1]))
        syms = tuple(m[0] for m in members)
        name = None
        if _is_elastic(prop):
            for s, nm in _ELASTIC_NAMES:
                if s in syms:
                    name = nm
                    break
        if name is None:
            if not k:
                name = "no allowed components"
            elif "SO(3)" in syms or "O(3)" in syms:
                name = "isotropic"
            else:
                name = f"class of {syms[0]}"
        classes.append(SymmetryClass(name, syms, rep_sym, k, rep_g))
    classes.sort(key=lambda c: (c.n_independent, tuple(-v for v in _rank_key(c._group))))
    return tuple(classes)


def _root(parent, i):
    while parent[i] != i:
        i = parent[i]
    return i


def symmetry_classes(what):
    """The symmetry classes of a property: groups it cannot tell apart (see the module notes).

    Parameters
    ----------
    what : str, Property or TensorSpec

    Returns
    -------
    tuple of SymmetryClass
        Highest symmetry first.

    Examples
    --------
    >>> [c.name for c in symmetry_classes("elastic_stiffness")]  # Forte & Vianello 1996: 8 classes
    ['isotropic', 'cubic', 'transversely isotropic', 'tetragonal', 'trigonal', 'orthotropic', 'monoclinic', 'triclinic']
    """
    return _classes(as_property(what))


def find_symmetry(values, what=None, *, tol=0.01, resolution=None, refine=4, sigma=None, covariance=None,
                  units=None, layout="auto", symmetry_tol=1e-8):
    """The highest-symmetry classes consistent with the data, each with its orientation and residual.

    Parameters
    ----------
    values : array_like or TensorData
        The data in any frame.
    what : str, Property or TensorSpec
        The property (not needed for a TensorData).
    tol : float
        Relative tolerance: a class is consistent when the Frobenius residual
        fraction after the best rotation is at most ``tol`` (default 0.01).
    resolution : float, optional
        Grid spacing in degrees (default from the rank, see ``tensym.orient``).
    refine : int
        Distinct grid minima refined per class (default 4).
    sigma, covariance, units, layout, symmetry_tol
        As in :func:`tensym.tensor_data`.

    Returns
    -------
    SymmetryFinding

    Raises
    ------
    DataError
        For invalid data, data with unknown (NaN) components or all zero
        (an all-zero tensor has every symmetry: there is nothing to find), or a
        ``tol`` that is not a finite number >= 0.

    Examples
    --------
    >>> import numpy as np
    >>> import tensym
    >>> f = tensym.find_symmetry(np.diag([1.0, 2.0, 3.0]), "dielectric_permittivity")
    >>> f.best.name, f.best.groups[:3]
    ('class of mmm', ('mmm', '222', 'mm2'))
    """
    data = tensor_data(values, what, sigma=sigma, covariance=covariance, units=units,
                       **({} if isinstance(values, TensorData) else {"layout": layout,
                                                                      "symmetry_tol": symmetry_tol}))
    if isinstance(tol, bool) or not isinstance(tol, numbers.Real) or not math.isfinite(tol) or tol < 0:
        raise DataError(f"tol must be a finite number >= 0 (relative residual), got {tol!r}")
    if isinstance(refine, bool) or not isinstance(refine, numbers.Integral) or refine < 1:
        raise DataError(f"refine must be a positive integer, got {refine!r}")
    _require_orientable(data, "find_symmetry")
    prop = data.property
    lay = _layout(prop)
    res = default_resolution(lay.rank) if resolution is None else resolution
    grid = shared_grid(res)
    classes = _classes(prop)
    cache = {}
    found = []
    for c in classes:
        nf = numeric_form(prop, c._group)
        o = _orient_core(data, c._group, nf, grid, float(res), int(refine), grid_cache=cache)
        found.append(SymmetryCandidate(c.name, c.groups, c.representative, c.n_independent, o.residual_fraction,
                                       o.residual_fraction <= tol, o))
    good = tuple(f for f in found if f.consistent)
    bad = tuple(f for f in found if not f.consistent)
    if _is_elastic(prop):
        note = (f"{prop.name} sees only the symmetry class of the crystal: groups listed together give the "
                f"same form up to a rotation and cannot be told apart; there are exactly {len(classes)} "
                "classes of elasticity tensors (Forte & Vianello 1996)")
    else:
        note = (f"{prop.name} cannot tell apart the groups listed together (same form, up to a rotation); "
                f"it has {len(classes)} symmetry classes among the groups tried")
    return SymmetryFinding(prop.name, float(tol), good, bad, good[0] if good else None, note, len(classes))
