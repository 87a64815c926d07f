"""The catalog of named point groups and their standard Cartesian settings.

Every named group is one row of :data:`SETTINGS`: its setting symbol, the
symbols of its geometric class, the generators written as coordinate triplets
(Cartesian, or in the hexagonal basis for the trigonal and hexagonal rows) and
the orientation in words.  The README table of settings is made from this one
table (:func:`settings_table`).

Conventions (handbook / IEEE Std 176 style, right-handed Cartesian axes):

* the principal axis is z;
* monoclinic groups have unique axis y by default ("121", "1m1", "12/m1");
  the z-unique ("112", "11m", "112/m") and x-unique ("211", "m11", "2/m11")
  settings are separate rows;
* trigonal and hexagonal groups use hexagonal axes a = (1, 0, 0),
  b = (-1/2, sqrt(3)/2, 0), c = z; "32" is "321" (a 2-fold along x), "3m" is
  "3m1" (a mirror normal to x), "-3m" is "-3m1", "-6m2" has a mirror normal to x;
* cubic groups have their 2-folds or 4-folds along x, y, z and the 3-folds
  along the body diagonals <111>;
* the icosahedral groups I ("532") and Ih ("-5-3m") have 2-folds along x, y, z,
  3-folds along <111> and 5-folds along (0, +-1, +-phi) and its cyclic
  permutations, phi = (1 + sqrt(5))/2.

Groups are built from their generators on first request and cached per
setting; their full operation list is closed lazily (see
:class:`~tensym.groups.finite.PointGroup`).

Examples
--------
>>> from tensym.groups.catalog import catalog_group, point_groups
>>> g = catalog_group("-4m2")
>>> g.symbol, g.setting_symbol, g.schoenflies, g.order
('-42m', '-4m2', 'D2d', 8)
>>> len(point_groups())
32
"""

from dataclasses import dataclass

import sympy as sp

from tensym.errors import InvalidOptionError, UnknownGroupError
from tensym.groups.finite import GroupNames, PointGroup
from tensym.groups.messages import echo
from tensym.groups.operations import Operation

__all__ = ["Setting", "SETTINGS", "settings_table", "point_groups", "catalog_group"]


@dataclass(frozen=True)
class Setting:
    """One row of the settings table: a named group in one orientation.

    Attributes
    ----------
    symbol : str
        Setting symbol, unique in the table (ITA style where the orientation
        matters: ``'121'``, ``'112'``, ``'-4m2'``, ``'312'``, ``'3m1'``).
    hm : str
        Short Hermann-Mauguin symbol of the geometric class (``'2'``, ``'-42m'``, ``'32'``).
    full_hm : str
        Full Hermann-Mauguin symbol in this orientation (``'1 2/m 1'``, ``'-4 m 2'``).
    schoenflies : str
        Schoenflies symbol of the class (``'D2d'``).
    crystal_system : str
        Crystal system of the class (``'icosahedral'`` for I and Ih).
    laue_class : str
        Short symbol of the Laue class (the class with the inversion added).
    generators : tuple of str
        Coordinate triplets of the generators (or, for the icosahedral rows,
        ``'rows:'`` followed by the exact matrix rows separated by ``;``).
    basis : str
        ``'cartesian'`` or ``'hexagonal'``: the basis the triplets are written in.
    setting : str
        Orientation of the symmetry elements, in words.
    default : bool
        True for the default setting of the class (the one the class symbol names).
    """

    symbol: str
    hm: str
    full_hm: str
    schoenflies: str
    crystal_system: str
    laue_class: str
    generators: tuple
    basis: str
    setting: str
    default: bool


_C, _H = "cartesian", "hexagonal"

# Triplets used below (Cartesian unless marked hex):
#   2z -x,-y,z  2y -x,y,-z  2x x,-y,-z  -1 -x,-y,-z  mz x,y,-z  my x,-y,z  mx -x,y,z
#   4z -y,x,z  -4z y,-x,-z  3[111] z,x,y  -3[111] -z,-x,-y
#   hex: 3z -y,x-y,z  -3z y,-x+y,-z  6z x-y,x,z  -6z -y,x-y,-z
#        2x x-y,-y,-z  2y -x+y,y,-z  mx -x+y,y,z  my x-y,-y,z
# Icosahedral extra generator: the 2-fold about (phi, 1, 1/phi)/2, matrix
#   (1/2) [[1/phi, phi, 1], [phi, -1, 1/phi], [1, 1/phi, -phi]].
_ICO2 = ("rows:(sqrt(5)-1)/4,(1+sqrt(5))/4,1/2;"
         "(1+sqrt(5))/4,-1/2,(sqrt(5)-1)/4;"
         "1/2,(sqrt(5)-1)/4,-(1+sqrt(5))/4")

_ROWS = (
    # symbol, hm, full_hm, schoenflies, system, laue, generators, basis, setting, default
    ("1", "1", "1", "C1", "triclinic", "-1", (), _C, "identity only", True),
    ("-1", "-1", "-1", "Ci", "triclinic", "-1", ("-x,-y,-z",), _C, "inversion centre at the origin", True),
    ("121", "2", "1 2 1", "C2", "monoclinic", "2/m", ("-x,y,-z",), _C, "2-fold along y (unique axis y)", True),
    ("112", "2", "1 1 2", "C2", "monoclinic", "2/m", ("-x,-y,z",), _C, "2-fold along z (unique axis z)", False),
    ("211", "2", "2 1 1", "C2", "monoclinic", "2/m", ("x,-y,-z",), _C, "2-fold along x (unique axis x)", False),
    ("1m1", "m", "1 m 1", "Cs", "monoclinic", "2/m", ("x,-y,z",), _C, "mirror normal to y (unique axis y)", True),
    ("11m", "m", "1 1 m", "Cs", "monoclinic", "2/m", ("x,y,-z",), _C, "mirror normal to z (unique axis z)", False),
    ("m11", "m", "m 1 1", "Cs", "monoclinic", "2/m", ("-x,y,z",), _C, "mirror normal to x (unique axis x)", False),
    ("12/m1", "2/m", "1 2/m 1", "C2h", "monoclinic", "2/m", ("-x,y,-z", "-x,-y,-z"), _C,
     "2-fold along y, mirror normal to y (unique axis y)", True),
    ("112/m", "2/m", "1 1 2/m", "C2h", "monoclinic", "2/m", ("-x,-y,z", "-x,-y,-z"), _C,
     "2-fold along z, mirror normal to z (unique axis z)", False),
    ("2/m11", "2/m", "2/m 1 1", "C2h", "monoclinic", "2/m", ("x,-y,-z", "-x,-y,-z"), _C,
     "2-fold along x, mirror normal to x (unique axis x)", False),
    ("222", "222", "2 2 2", "D2", "orthorhombic", "mmm", ("-x,-y,z", "-x,y,-z"), _C, "2-folds along x, y, z", True),
    ("mm2", "mm2", "m m 2", "C2v", "orthorhombic", "mmm", ("-x,y,z", "x,-y,z"), _C,
     "2-fold along z, mirror normals x and y", True),
    ("2mm", "mm2", "2 m m", "C2v", "orthorhombic", "mmm", ("x,-y,z", "x,y,-z"), _C,
     "2-fold along x, mirror normals y and z", False),
    ("m2m", "mm2", "m 2 m", "C2v", "orthorhombic", "mmm", ("-x,y,z", "x,y,-z"), _C,
     "2-fold along y, mirror normals x and z", False),
    ("mmm", "mmm", "2/m 2/m 2/m", "D2h", "orthorhombic", "mmm", ("-x,-y,z", "-x,y,-z", "-x,-y,-z"), _C,
     "2-folds along x, y, z, mirror normals x, y, z", True),
    ("4", "4", "4", "C4", "tetragonal", "4/m", ("-y,x,z",), _C, "4-fold along z", True),
    ("-4", "-4", "-4", "S4", "tetragonal", "4/m", ("y,-x,-z",), _C, "-4 along z", True),
    ("4/m", "4/m", "4/m", "C4h", "tetragonal", "4/m", ("-y,x,z", "-x,-y,-z"), _C,
     "4-fold along z, mirror normal to z", True),
    ("422", "422", "4 2 2", "D4", "tetragonal", "4/mmm", ("-y,x,z", "x,-y,-z"), _C,
     "4-fold along z, 2-folds along x, y and [110], [1-10]", True),
    ("4mm", "4mm", "4 m m", "C4v", "tetragonal", "4/mmm", ("-y,x,z", "-x,y,z"), _C,
     "4-fold along z, mirror normals x, y and [110], [1-10]", True),
    ("-42m", "-42m", "-4 2 m", "D2d", "tetragonal", "4/mmm", ("y,-x,-z", "x,-y,-z"), _C,
     "-4 along z, 2-folds along x and y, mirror normals [110] and [1-10]", True),
    ("-4m2", "-42m", "-4 m 2", "D2d", "tetragonal", "4/mmm", ("y,-x,-z", "-x,y,z"), _C,
     "-4 along z, mirror normals x and y, 2-folds along [110] and [1-10]", False),
    ("4/mmm", "4/mmm", "4/m 2/m 2/m", "D4h", "tetragonal", "4/mmm", ("-y,x,z", "x,-y,-z", "-x,-y,-z"), _C,
     "4-fold along z, 2-folds along x, y, [110], [1-10], inversion centre", True),
    ("3", "3", "3", "C3", "trigonal", "-3", ("-y,x-y,z",), _H, "3-fold along z", True),
    ("-3", "-3", "-3", "C3i", "trigonal", "-3", ("y,-x+y,-z",), _H, "-3 along z", True),
    ("321", "32", "3 2 1", "D3", "trigonal", "-3m", ("-y,x-y,z", "x-y,-y,-z"), _H,
     "3-fold along z, a 2-fold along x", True),
    ("312", "32", "3 1 2", "D3", "trigonal", "-3m", ("-y,x-y,z", "-x+y,y,-z"), _H,
     "3-fold along z, a 2-fold along y", False),
    ("3m1", "3m", "3 m 1", "C3v", "trigonal", "-3m", ("-y,x-y,z", "-x+y,y,z"), _H,
     "3-fold along z, a mirror normal to x", True),
    ("31m", "3m", "3 1 m", "C3v", "trigonal", "-3m", ("-y,x-y,z", "x-y,-y,z"), _H,
     "3-fold along z, a mirror normal to y", False),
    ("-3m1", "-3m", "-3 2/m 1", "D3d", "trigonal", "-3m", ("y,-x+y,-z", "x-y,-y,-z"), _H,
     "-3 along z, a 2-fold along x and the mirror normal to it", True),
    ("-31m", "-3m", "-3 1 2/m", "D3d", "trigonal", "-3m", ("y,-x+y,-z", "-x+y,y,-z"), _H,
     "-3 along z, a 2-fold along y and the mirror normal to it", False),
    ("6", "6", "6", "C6", "hexagonal", "6/m", ("x-y,x,z",), _H, "6-fold along z", True),
    ("-6", "-6", "-6", "C3h", "hexagonal", "6/m", ("-y,x-y,-z",), _H, "-6 along z (mirror normal to z)", True),
    ("6/m", "6/m", "6/m", "C6h", "hexagonal", "6/m", ("x-y,x,z", "-x,-y,-z"), _H,
     "6-fold along z, mirror normal to z", True),
    ("622", "622", "6 2 2", "D6", "hexagonal", "6/mmm", ("x-y,x,z", "x-y,-y,-z"), _H,
     "6-fold along z, 2-folds along x and y (and their 60-degree images)", True),
    ("6mm", "6mm", "6 m m", "C6v", "hexagonal", "6/mmm", ("x-y,x,z", "-x+y,y,z"), _H,
     "6-fold along z, mirror normals x and y (and their 60-degree images)", True),
    ("-6m2", "-6m2", "-6 m 2", "D3h", "hexagonal", "6/mmm", ("-y,x-y,-z", "-x+y,y,z"), _H,
     "-6 along z, a mirror normal to x, a 2-fold along y", True),
    ("-62m", "-6m2", "-6 2 m", "D3h", "hexagonal", "6/mmm", ("-y,x-y,-z", "x-y,-y,-z"), _H,
     "-6 along z, a 2-fold along x, a mirror normal to y", False),
    ("6/mmm", "6/mmm", "6/m 2/m 2/m", "D6h", "hexagonal", "6/mmm", ("x-y,x,z", "x-y,-y,-z", "-x,-y,-z"), _H,
     "6-fold along z, 2-folds along x and y (and their 60-degree images), inversion centre", True),
    ("23", "23", "2 3", "T", "cubic", "m-3", ("-x,-y,z", "z,x,y"), _C,
     "2-folds along x, y, z, 3-folds along <111>", True),
    ("m-3", "m-3", "2/m -3", "Th", "cubic", "m-3", ("-x,-y,z", "-z,-x,-y"), _C,
     "2-folds along x, y, z, -3 along <111>, mirror normals x, y, z", True),
    ("432", "432", "4 3 2", "O", "cubic", "m-3m", ("-y,x,z", "z,x,y"), _C,
     "4-folds along x, y, z, 3-folds along <111>, 2-folds along <110>", True),
    ("-43m", "-43m", "-4 3 m", "Td", "cubic", "m-3m", ("y,-x,-z", "z,x,y"), _C,
     "-4 along x, y, z, 3-folds along <111>, mirror normals <110>", True),
    ("m-3m", "m-3m", "4/m -3 2/m", "Oh", "cubic", "m-3m", ("-y,x,z", "-z,-x,-y"), _C,
     "4-folds along x, y, z, -3 along <111>, 2-folds along <110>, inversion centre", True),
    ("532", "532", "5 3 2", "I", "icosahedral", "-5-3m", ("z,x,y", _ICO2), _C,
     "2-folds along x, y, z, 3-folds along <111>, 5-folds along (0, 1, phi) and equivalents", True),
    ("-5-3m", "-5-3m", "-5 -3 2/m", "Ih", "icosahedral", "-5-3m", ("-z,-x,-y", _ICO2), _C,
     "2-folds along x, y, z, -3 along <111>, -5 along (0, 1, phi) and equivalents, inversion centre", True),
)

#: The settings table: one :class:`Setting` per named group, in catalog order.
SETTINGS = tuple(Setting(*row) for row in _ROWS)
_BY_SYMBOL = {s.symbol: s for s in SETTINGS}
_DEFAULT_OF_CLASS = {s.hm: s.symbol for s in SETTINGS if s.default}
_ICOSAHEDRAL = ("532", "-5-3m")
_WHICH = ("crystallographic", "settings", "icosahedral", "all")
_CACHE = {}


_FORMATS = ("rows", "markdown")


def settings_table(*, format="rows"):
    """The settings table: every named group with its orientation.

    Parameters
    ----------
    format : {'rows', 'markdown'}
        'rows': the tuple of frozen :class:`Setting` rows in catalog order (the
        order of :func:`point_groups` with ``which='all'``); 'markdown': the same
        table as Markdown text (setting symbol, class, full symbol, Schoenflies,
        crystal system, Laue class, generators, orientation), as in the README.

    Returns
    -------
    tuple of Setting, or str

    Raises
    ------
    InvalidOptionError
        If ``format`` is not one of the names above.

    Examples
    --------
    >>> row = [s for s in settings_table() if s.symbol == "3m1"][0]
    >>> row.hm, row.setting
    ('3m', '3-fold along z, a mirror normal to x')
    >>> settings_table(format="markdown").splitlines()[0]
    '| setting | class | full symbol | Schoenflies | system | Laue | generators | orientation |'
    """
    if format == "rows":
        return SETTINGS
    if format == "markdown":
        lines = ["| setting | class | full symbol | Schoenflies | system | Laue | generators | orientation |",
                 "| --- | --- | --- | --- | --- | --- | --- | --- |"]
        for r in SETTINGS:
            gens = "; ".join("2-fold about (phi, 1, 1/phi)/2" if g.startswith("rows:") else f"`{g}`"
                             for g in r.generators) or "-"
            if r.basis == "hexagonal":
                gens += " (hexagonal basis)"
            mark = "" if r.default else " (other setting)"
            lines.append(f"| `{r.symbol}` | {r.hm} | {r.full_hm} | {r.schoenflies} | {r.crystal_system} | "
                         f"{r.laue_class} | {gens} | {r.setting}{mark} |")
        return "\n".join(lines) + "\n"
    raise InvalidOptionError(f"format={echo(format)} is not one of {_FORMATS}")


def point_groups(*, which="crystallographic"):
    """Symbols of the catalog groups, in the usual order 1, -1, 2, ..., m-3m.

    Parameters
    ----------
    which : {'crystallographic', 'settings', 'icosahedral', 'all'}
        'crystallographic': the 32 class symbols (each names its default setting);
        'settings': the setting symbols of every crystallographic row, alternative
        orientations included ('121', '112', ..., '-4m2', '312', ...);
        'icosahedral': '532' and '-5-3m';
        'all': every setting symbol in the table.

    Returns
    -------
    tuple of str

    Raises
    ------
    InvalidOptionError
        If ``which`` is not one of the names above.

    Examples
    --------
    >>> point_groups()[:5]
    ('1', '-1', '2', 'm', '2/m')
    >>> point_groups(which="settings")[2:5]
    ('121', '112', '211')
    """
    if which == "crystallographic":
        return tuple(s.hm for s in SETTINGS if s.default and s.symbol not in _ICOSAHEDRAL)
    if which == "settings":
        return tuple(s.symbol for s in SETTINGS if s.symbol not in _ICOSAHEDRAL)
    if which == "icosahedral":
        return _ICOSAHEDRAL
    if which == "all":
        return tuple(s.symbol for s in SETTINGS)
    raise InvalidOptionError(f"which={echo(which)} is not one of {_WHICH}")


def default_setting(class_symbol):
    """Setting symbol of the default setting of a class symbol (e.g. '32' -> '321')."""
    return _DEFAULT_OF_CLASS[class_symbol]


def _generator(spec, basis):
    if spec.startswith("rows:"):
        rows = [[sp.sympify(v) for v in r.split(",")] for r in spec[5:].split(";")]
        return Operation.from_matrix(rows)
    return Operation.from_triplet(spec, basis=basis)


def setting_names(setting, *, rotation=None, words=None):
    """GroupNames of a table row (optionally re-oriented by ``rotation``)."""
    return GroupNames(
        hm=setting.hm,
        full_hm=setting.full_hm,
        schoenflies=setting.schoenflies,
        setting=words if words is not None else setting.setting,
        crystal_system=setting.crystal_system,
        laue_class=setting.laue_class,
        rotation=rotation,
        setting_symbol=setting.symbol,
    )


def catalog_group(setting_symbol):
    """The catalog group of one exact setting symbol (cached; no alias lookup).

    Use :func:`tensym.point_group` for user-facing lookup by any spelling.

    Raises
    ------
    UnknownGroupError
        If ``setting_symbol`` is not a row of the table.

    Examples
    --------
    >>> catalog_group("312").setting
    '3-fold along z, a 2-fold along y'
    """
    g = _CACHE.get(setting_symbol)
    if g is None:
        row = _BY_SYMBOL.get(setting_symbol)
        if row is None:
            raise UnknownGroupError(
                f"{echo(setting_symbol)} is not a setting symbol of the catalog; "
                f"valid ones: {', '.join(point_groups(which='all'))}"
            )
        gens = [_generator(t, row.basis) for t in row.generators]
        g = PointGroup(None, gens, setting_names(row))
        _CACHE[setting_symbol] = g
    return g
