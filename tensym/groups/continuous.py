"""Continuous point groups, described exactly by Lie-algebra generators.

A continuous group is the closure of a one-parameter family ``exp(t L)`` for
each Lie generator L (an exact antisymmetric 3x3 matrix) together with a few
discrete operations.  A tensor is invariant under the connected part exactly
when the infinitesimal action of every L annihilates it, so the same linear
solver serves finite and continuous groups.

Standard setting: the axis of C∞, C∞v, C∞h, D∞ and D∞h is z; the mirror of
C∞v contains z and has normal x; the 2-fold of D∞ and D∞h lies along x.

Examples
--------
>>> from tensym.groups.continuous import continuous_group
>>> g = continuous_group("Dinfh")
>>> g.symbol, g.schoenflies, g.is_centrosymmetric
('inf/mm', 'D∞h', True)
"""

import sympy as sp

from tensym.groups.finite import GroupNames
from tensym.groups.operations import Operation

__all__ = ["ContinuousGroup", "continuous_group", "CONTINUOUS_SYMBOLS", "LIE_X", "LIE_Y", "LIE_Z"]

#: Generators of rotations about x, y, z: d/dt R_axis(t) at t = 0.
LIE_X = sp.ImmutableMatrix([[0, 0, 0], [0, 0, -1], [0, 1, 0]])
LIE_Y = sp.ImmutableMatrix([[0, 0, 1], [0, 0, 0], [-1, 0, 0]])
LIE_Z = sp.ImmutableMatrix([[0, -1, 0], [1, 0, 0], [0, 0, 0]])

_INV = "-x,-y,-z"
_MX = "-x,y,z"
_MZ = "x,y,-z"
_2X = "x,-y,-z"


class ContinuousGroup:
    """A continuous point group: Lie generators plus discrete generators.

    Attributes
    ----------
    lie_generators : tuple of sympy.ImmutableMatrix
        Antisymmetric generators of the connected part.
    generators : tuple of Operation
        Discrete operations that complete the group (mirrors, 2-folds, inversion).
    order : sympy.oo
        Continuous groups have infinitely many elements.

    Examples
    --------
    >>> continuous_group("SO(3)").lie_generators[2]
    Matrix([
    [0, -1, 0],
    [1,  0, 0],
    [0,  0, 0]])
    """

    is_continuous = True
    order = sp.oo

    def __init__(self, lie_generators, generators, names, *, centro, polar, proper):
        self._lie = tuple(sp.ImmutableMatrix(m) for m in lie_generators)
        self._gens = tuple(generators)
        self._names = names
        self._centro = centro
        self._polar = polar
        self._proper = proper

    lie_generators = property(lambda self: self._lie, doc="Lie-algebra generators (tuple).")
    generators = property(lambda self: self._gens, doc="Discrete generators (tuple of Operation).")
    names = property(lambda self: self._names, doc="The GroupNames record.")
    symbol = property(lambda self: self._names.hm, doc="Hermann-Mauguin style symbol, e.g. 'inf/mm'.")
    schoenflies = property(lambda self: self._names.schoenflies, doc="Schoenflies symbol, e.g. 'D∞h'.")
    full_symbol = property(lambda self: self._names.full_hm, doc="Full symbol.")
    crystal_system = property(lambda self: self._names.crystal_system, doc="'continuous'.")
    laue_class = property(lambda self: self._names.laue_class, doc="Symbol of the Laue class.")
    setting = property(lambda self: self._names.setting, doc="Orientation in words.")
    setting_symbol = property(lambda self: self._names.setting_symbol, doc="Catalog key, e.g. 'inf/mm'.")
    rotation = property(lambda self: self._names.rotation,
                        doc="Q relating this orientation to the standard one (None for the standard setting).")
    is_crystallographic = False
    is_centrosymmetric = property(lambda self: self._centro, doc="Contains the inversion.")
    is_polar = property(lambda self: self._polar, doc="Leaves a direction fixed.")
    is_enantiomorphic = property(lambda self: self._proper, doc="Only proper operations.")
    is_magnetic = False

    @property
    def operations(self):
        """Not enumerable: raises TypeError with the reason."""
        raise TypeError(f"{self.symbol} is a continuous group; it has no finite list of operations")

    def conjugated(self, rotation, names=None):
        """The group ``Q G Q^T`` (Lie generators and discrete operations re-oriented)."""
        q = sp.Matrix(rotation)
        lie = [sp.ImmutableMatrix((q * L * q.T).applyfunc(sp.expand)) for L in self._lie]
        gens = [g.conjugated(q) for g in self._gens]
        return ContinuousGroup(lie, gens, names or self._names, centro=self._centro,
                               polar=self._polar, proper=self._proper)

    def __repr__(self):
        return f"<ContinuousGroup {self.symbol}>"


# name: (hm, schoenflies, lie, discrete, centro, polar, proper, laue, setting, aliases)
_TABLE = {
    "SO(3)": ("SO(3)", "K", (LIE_X, LIE_Y, LIE_Z), (), False, False, True, "O(3)",
              "all proper rotations", ("SO3", "K", "infinf", "∞∞")),
    "O(3)": ("O(3)", "Kh", (LIE_X, LIE_Y, LIE_Z), (_INV,), True, False, False, "O(3)",
             "all rotations and the inversion", ("O3", "Kh", "infinfm", "∞∞m")),
    "inf": ("inf", "C∞", (LIE_Z,), (), False, True, True, "inf/mm",
            "rotations about z", ("Cinf", "C∞", "∞")),
    "infm": ("infm", "C∞v", (LIE_Z,), (_MX,), False, True, False, "inf/mm",
             "rotations about z, mirrors containing z", ("Cinfv", "C∞v", "∞m", "infmm")),
    "inf/m": ("inf/m", "C∞h", (LIE_Z,), (_MZ,), True, False, False, "inf/mm",
              "rotations about z, mirror normal to z", ("Cinfh", "C∞h", "∞/m")),
    "inf2": ("inf2", "D∞", (LIE_Z,), (_2X,), False, False, True, "inf/mm",
             "rotations about z, 2-folds normal to z (one along x)", ("Dinf", "D∞", "∞2", "inf22")),
    "inf/mm": ("inf/mm", "D∞h", (LIE_Z,), (_2X, _INV), True, False, False, "inf/mm",
               "rotations about z, 2-folds normal to z, inversion (transverse isotropy)",
               ("Dinfh", "D∞h", "∞/mm", "inf/mmm", "∞/mmm")),
}

#: Accepted spellings (lower-cased) -> canonical key.
CONTINUOUS_SYMBOLS = {}
for _key, _row in _TABLE.items():
    for _alias in (_key, _row[0], _row[1]) + _row[9]:
        CONTINUOUS_SYMBOLS[_alias.lower().replace(" ", "")] = _key

_CACHE = {}


def continuous_group(symbol):
    """The continuous group named ``symbol`` (see CONTINUOUS_SYMBOLS); KeyError if unknown.

    Examples
    --------
    >>> continuous_group("Cinfv").symbol
    'infm'
    """
    key = CONTINUOUS_SYMBOLS[str(symbol).lower().replace(" ", "")]
    if key not in _CACHE:
        hm, sch, lie, disc, centro, polar, proper, laue, setting, _ = _TABLE[key]
        names = GroupNames(hm=hm, full_hm=hm, schoenflies=sch, setting=setting,
                           crystal_system="continuous", laue_class=laue, setting_symbol=key)
        gens = [Operation.from_triplet(t) for t in disc]
        _CACHE[key] = ContinuousGroup(lie, gens, names, centro=centro, polar=polar, proper=proper)
    return _CACHE[key]
