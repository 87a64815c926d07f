"""Standard-setting point groups built from generator triplets, for the reps tests.

The settings follow the handbook/IEEE convention (principal axis z; 2-fold of
32 along x; mirror of 3m normal to x; cubic 3-folds along the body diagonals);
common practice.  Used until the group catalog is available, and afterwards as
an independent construction to compare with it.
"""

import sympy as sp

from tensym.groups.finite import PointGroup, GroupNames
from tensym.groups.operations import Operation

__all__ = ["GENERATORS", "std_group", "ALL_SYMBOLS"]

_H = "hexagonal"
_T = sp.GoldenRatio
# 5-fold of I about (0, 1, tau) with 2-folds along x, y, z (common practice).
_FIVE = sp.Matrix([[sp.Rational(1, 2) * (_T - 1), -sp.Rational(1, 2) * _T, sp.Rational(1, 2)],
                   [sp.Rational(1, 2) * _T, sp.Rational(1, 2), sp.Rational(1, 2) * (_T - 1)],
                   [-sp.Rational(1, 2), sp.Rational(1, 2) * (_T - 1), sp.Rational(1, 2) * _T]])

GENERATORS = {
    # symbol: (schoenflies, [generators: triplet or (triplet, basis) or matrix])
    "1": ("C1", []),
    "-1": ("Ci", ["-x,-y,-z"]),
    "2": ("C2", ["-x,y,-z"]),
    "m": ("Cs", ["x,-y,z"]),
    "2/m": ("C2h", ["-x,y,-z", "-x,-y,-z"]),
    "222": ("D2", ["-x,-y,z", "-x,y,-z"]),
    "mm2": ("C2v", ["-x,-y,z", "x,-y,z"]),
    "mmm": ("D2h", ["-x,-y,z", "-x,y,-z", "-x,-y,-z"]),
    "4": ("C4", ["-y,x,z"]),
    "-4": ("S4", ["y,-x,-z"]),
    "4/m": ("C4h", ["-y,x,z", "-x,-y,-z"]),
    "422": ("D4", ["-y,x,z", "x,-y,-z"]),
    "4mm": ("C4v", ["-y,x,z", "x,-y,z"]),
    "-42m": ("D2d", ["y,-x,-z", "x,-y,-z"]),
    "4/mmm": ("D4h", ["-y,x,z", "x,-y,-z", "-x,-y,-z"]),
    "3": ("C3", [("-y,x-y,z", _H)]),
    "-3": ("C3i", [("-y,x-y,z", _H), "-x,-y,-z"]),
    "32": ("D3", [("-y,x-y,z", _H), "x,-y,-z"]),
    "3m": ("C3v", [("-y,x-y,z", _H), "-x,y,z"]),
    "-3m": ("D3d", [("-y,x-y,z", _H), "x,-y,-z", "-x,-y,-z"]),
    "6": ("C6", [("x-y,x,z", _H)]),
    "-6": ("C3h", [("-y,x-y,z", _H), "x,y,-z"]),
    "6/m": ("C6h", [("x-y,x,z", _H), "-x,-y,-z"]),
    "622": ("D6", [("x-y,x,z", _H), "x,-y,-z"]),
    "6mm": ("C6v", [("x-y,x,z", _H), "-x,y,z"]),
    "-6m2": ("D3h", [("-y,x-y,z", _H), "x,y,-z", "-x,y,z"]),
    "6/mmm": ("D6h", [("x-y,x,z", _H), "x,-y,-z", "-x,-y,-z"]),
    "23": ("T", ["z,x,y", "-x,-y,z"]),
    "m-3": ("Th", ["z,x,y", "-x,-y,z", "-x,-y,-z"]),
    "432": ("O", ["z,x,y", "-y,x,z"]),
    "-43m": ("Td", ["z,x,y", "y,-x,-z"]),
    "m-3m": ("Oh", ["z,x,y", "-y,x,z", "-x,-y,-z"]),
    "532": ("I", ["z,x,y", "-x,-y,z", _FIVE]),
    "-5-3m": ("Ih", ["z,x,y", "-x,-y,z", _FIVE, "-x,-y,-z"]),
}

ALL_SYMBOLS = tuple(GENERATORS)
_BY_SCHOENFLIES = {v[0]: k for k, v in GENERATORS.items()}
_CACHE = {}


def _op(spec):
    if isinstance(spec, tuple):
        return Operation.from_triplet(spec[0], basis=spec[1])
    if isinstance(spec, str):
        return Operation.from_triplet(spec)
    return Operation.from_matrix(spec)


def std_group(symbol):
    """The standard-setting group for a Hermann-Mauguin or Schoenflies symbol."""
    symbol = _BY_SCHOENFLIES.get(symbol, symbol)
    if symbol not in _CACHE:
        sch, gens = GENERATORS[symbol]
        names = GroupNames(hm=symbol, full_hm=symbol, schoenflies=sch)
        _CACHE[symbol] = PointGroup.from_generators([_op(g) for g in gens], names=names)
    return _CACHE[symbol]
