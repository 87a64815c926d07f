"""The catalog of named physical properties.

Each entry is a :class:`Property`: a TensorSpec, the trade's symbol, and a Voigt
convention.  The Voigt convention groups the indices: a group of two indices is
contracted by the pairs 11->1, 22->2, 33->3, 23->4, 13->5, 12->6; a group of one
index stays 1, 2, 3.  ``halved[g]`` is True when a shear pair (4, 5, 6) in group
g carries a factor 2 in the Voigt constant, i.e. the tensor component is the
Voigt constant divided by 2 for each such shear group.  These are the handbook
conventions (Nye, Physical Properties of Crystals, 1985, ch. VII-X; IEEE Std
176-1987):

================================  =========================================
compliance s, electrostriction Q  s_ijkl = s_mn / (2^a), a = number of m, n in 4..6
piezoelectric d and g, piezo-     d_ijk = d_in for n = 1..3, d_in / 2 for n = 4..6
optic pi
stiffness c, e, h, photoelastic   no factors: c_ijkl = c_mn, e_ijk = e_in
p, electro-optic r, SHG d,
third- and fourth-order elastic
================================  =========================================

Examples
--------
>>> from tensym.tensors.catalog import get_property
>>> p = get_property("elastic_compliance")
>>> p.symbol, p.voigt_groups, p.halved
('s', ((0, 1), (2, 3)), (True, True))
"""

from dataclasses import dataclass
import difflib

from tensym.errors import UnknownPropertyError
from tensym.tensors.spec import TensorSpec

__all__ = ["Property", "get_property", "property_names", "register_property", "VOIGT_PAIRS"]

#: Voigt number of each index pair (0-based Cartesian indices).
VOIGT_PAIRS = {(0, 0): 1, (1, 1): 2, (2, 2): 3, (1, 2): 4, (2, 1): 4, (0, 2): 5, (2, 0): 5, (0, 1): 6, (1, 0): 6}


@dataclass(frozen=True)
class Property:
    """A named physical property tensor.

    Attributes
    ----------
    name : str
        Catalog key, e.g. ``'piezoelectric_d'``.
    spec : TensorSpec
        Rank, index symmetry and parity.
    symbol : str
        Letter of the trade (sympy name), e.g. ``'d'``, ``'epsilon'``.
    voigt_groups : tuple of tuple of int
        Index positions grouped for Voigt labels, e.g. ``((0,), (1, 2))`` for d_iJ.
    halved : tuple of bool
        Per group: shear pairs carry a factor 2 in the Voigt constant.
    title : str
        Words for headings, e.g. ``'piezoelectric strain coefficients d_iJ'``.
    convention : str
        The Voigt factor convention in words.
    label_order : tuple of int or None
        Order in which the label positions are compared when handbooks pick the
        independent constants (None: left to right).  The electro-optic r_Ij is
        read column-first, (j, I), as the transpose of d_jI: 3m has r13, r22,
        r33, r51 (r42 = r51), like d31, d22, d33, d15.
    """

    name: str
    spec: TensorSpec
    symbol: str
    voigt_groups: tuple
    halved: tuple
    title: str
    convention: str = "no Voigt factors"
    label_order: tuple = None

    @property
    def has_voigt_pairs(self):
        """True when some index group is a Voigt pair."""
        return any(len(g) == 2 for g in self.voigt_groups)


_CATALOG = {}


def register_property(prop):
    """Add a Property to the catalog (used by the catalog modules themselves)."""
    _CATALOG[prop.name] = prop
    return prop


def property_names():
    """Names of all catalog properties, in catalog order.

    Examples
    --------
    >>> "elastic_stiffness" in property_names()
    True
    """
    return tuple(_CATALOG)


def get_property(name):
    """The catalog Property called ``name``.

    Raises
    ------
    UnknownPropertyError
        When ``name`` is not in the catalog; the message lists the nearest names.

    Examples
    --------
    >>> get_property("elastic_stifness")
    Traceback (most recent call last):
    ...
    tensym.errors.UnknownPropertyError: unknown property 'elastic_stifness'; nearest: elastic_stiffness, ...
    """
    if isinstance(name, Property):
        return name
    key = str(name).strip().lower().replace(" ", "_").replace("-", "_")
    if key in _CATALOG:
        return _CATALOG[key]
    near = difflib.get_close_matches(key, list(_CATALOG), n=3, cutoff=0.5)
    hint = ", ".join(near) if near else "see tensym.property_names()"
    raise UnknownPropertyError(f"unknown property {name!r}; nearest: {hint}")


_SYM2 = ["ji"]
_PIEZO = ["ikj"]
_ELASTIC = ["jikl", "ijlk", "klij"]
_PAIRS4 = ["jikl", "ijlk"]
_TOEC = ["jiklmn", "ijlkmn", "ijklnm", "klijmn", "ijmnkl"]
_FOEC = ["jiklmnpq", "ijlkmnpq", "ijklnmpq", "ijklmnqp", "klijmnpq", "ijmnklpq", "ijklpqmn"]
_V1 = ((0,),)
_V2 = ((0,), (1,))
_VP = ((0,), (1, 2))
_VR = ((0, 1), (2,))
_V4 = ((0, 1), (2, 3))
_V6 = ((0, 1), (2, 3), (4, 5))
_V8 = ((0, 1), (2, 3), (4, 5), (6, 7))
_HALF_D = "d_ijk = d_iJ for J = 1, 2, 3 and d_iJ / 2 for J = 4, 5, 6 (Nye; IEEE Std 176)"
_HALF_S = "s_ijkl = s_IJ, s_IJ / 2 or s_IJ / 4 when none, one or both of I, J are 4, 5, 6 (Nye)"

for _p in (
    Property("pyroelectric", TensorSpec(1), "p", _V1, (False,), "pyroelectric coefficients p_i"),
    Property("dielectric_permittivity", TensorSpec(2, _SYM2), "epsilon", _V2, (False, False),
             "dielectric permittivity epsilon_ij"),
    Property("dielectric_impermeability", TensorSpec(2, _SYM2), "beta", _V2, (False, False),
             "optical impermeability beta_ij"),
    Property("thermal_expansion", TensorSpec(2, _SYM2), "alpha", _V2, (False, False),
             "thermal expansion alpha_ij"),
    Property("thermal_conductivity", TensorSpec(2, _SYM2), "k", _V2, (False, False),
             "thermal conductivity k_ij"),
    Property("electrical_conductivity", TensorSpec(2, _SYM2), "sigma", _V2, (False, False),
             "electrical conductivity sigma_ij"),
    Property("seebeck", TensorSpec(2), "S", _V2, (False, False), "Seebeck coefficients S_ij (no index symmetry)"),
    Property("piezoelectric_d", TensorSpec(3, _PIEZO), "d", _VP, (False, True),
             "piezoelectric strain coefficients d_iJ", _HALF_D),
    Property("piezoelectric_e", TensorSpec(3, _PIEZO), "e", _VP, (False, False),
             "piezoelectric stress coefficients e_iJ", "e_ijk = e_iJ (no factors)"),
    Property("piezoelectric_g", TensorSpec(3, _PIEZO), "g", _VP, (False, True),
             "piezoelectric voltage coefficients g_iJ", "g_ijk = g_iJ, g_iJ / 2 for J = 4, 5, 6 (as d)"),
    Property("piezoelectric_h", TensorSpec(3, _PIEZO), "h", _VP, (False, False),
             "piezoelectric h_iJ", "h_ijk = h_iJ (as e)"),
    Property("elastic_stiffness", TensorSpec(4, _ELASTIC), "c", _V4, (False, False),
             "elastic stiffness c_IJ", "c_ijkl = c_IJ (no factors)"),
    Property("elastic_compliance", TensorSpec(4, _ELASTIC), "s", _V4, (True, True),
             "elastic compliance s_IJ", _HALF_S),
    Property("electro_optic", TensorSpec(3, ["jik"]), "r", _VR, (False, False),
             "linear electro-optic coefficients r_Ij", "r_ijk = r_Ik (no factors)", (1, 0)),
    Property("photoelastic", TensorSpec(4, _PAIRS4), "p", _V4, (False, False),
             "elasto-optic (photoelastic) coefficients p_IJ", "p_ijkl = p_IJ (no factors; Nye)"),
    Property("piezo_optic", TensorSpec(4, _PAIRS4), "pi", _V4, (False, True),
             "piezo-optic coefficients pi_IJ", "pi_ijkl = pi_IJ, pi_IJ / 2 for J = 4, 5, 6 (Nye)"),
    Property("electrostriction", TensorSpec(4, _PAIRS4), "Q", _V4, (True, True),
             "electrostrictive coefficients Q_IJ (strain = Q P P)",
             "Q_ijkl = Q_IJ / 2^a, a = number of I, J in 4..6 (engineering strain; as compliance)"),
    Property("second_harmonic", TensorSpec(3, _PIEZO), "d", _VP, (False, False),
             "second-harmonic coefficients d_iJ", "d_ijk = d_iJ (no factors; Boyd, Nonlinear Optics)"),
    Property("second_harmonic_kleinman", TensorSpec(3, ["jik", "ikj"]), "d", _VP, (False, False),
             "second-harmonic coefficients d_iJ with Kleinman symmetry",
             "d_ijk = d_iJ, fully symmetric in ijk (Boyd, Nonlinear Optics)"),
    Property("optical_activity", TensorSpec(2, _SYM2, axial=True), "g", _V2, (False, False),
             "gyration tensor g_ij (axial)"),
    Property("third_order_elastic", TensorSpec(6, _TOEC), "C", _V6, (False, False, False),
             "third-order elastic constants C_IJK", "C_ijklmn = C_IJK (no factors; Brugger 1964)"),
    Property("fourth_order_elastic", TensorSpec(8, _FOEC), "C", _V8, (False,) * 4,
             "fourth-order elastic constants C_IJKL", "C_ijklmnpq = C_IJKL (no factors)"),
):
    register_property(_p)


def _space_for_name(name):
    """Resolver for the representation functions: a catalog name -> its tensor space."""
    return get_property(name).spec.as_space()


from tensym.reps.inputs import register_space_names  # noqa: E402  (reps is the layer below)

register_space_names(_space_for_name)
