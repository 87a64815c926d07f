"""Unit labels accepted for each property (kept as labels and echoed; never converted).

A unit is a label: tensym does not convert between units, it checks that the
label is one a property is commonly given in (so that a typo such as ``'Gpa'``
or a compliance unit on a stiffness is caught) and repeats it in every report.
Comparison ignores spaces, ``^`` and the difference between ``u``, ``µ``
(U+00B5) and ``μ`` (U+03BC); everything else is case-sensitive (``MPa`` is not
``mPa``).

Examples
--------
>>> from tensym.data.units import check_units
>>> check_units("GPa", "elastic_stiffness")
'GPa'
>>> check_units("Gpa", "elastic_stiffness")
Traceback (most recent call last):
...
tensym.errors.DataError: unknown units 'Gpa' for elastic_stiffness; nearest: GPa, ...
"""

import difflib

from tensym.errors import DataError
from tensym.tensors.form import as_property

__all__ = ["UNITS", "check_units", "accepted_units", "inverse_units"]

_PRESSURE = ("GPa", "MPa", "kPa", "Pa", "TPa", "kbar", "Mbar", "bar", "N/m^2", "dyn/cm^2",
             "10^9 N/m^2", "10^10 N/m^2", "10^11 dyn/cm^2")
_INV_PRESSURE = ("1/GPa", "GPa^-1", "1/TPa", "TPa^-1", "1/MPa", "MPa^-1", "1/Pa", "Pa^-1", "m^2/N",
                 "10^-12 m^2/N", "1/Mbar", "1/kbar")
_NONE = ("1", "dimensionless")

#: Accepted unit labels per catalog property (a TensorSpec accepts every label listed).
UNITS = {
    "pyroelectric": ("C/(m^2 K)", "C m^-2 K^-1", "uC/(m^2 K)", "uC m^-2 K^-1", "C/m^2/K", "nC/(cm^2 K)"),
    "dielectric_permittivity": _NONE + ("relative", "F/m", "pF/m", "epsilon0"),
    "dielectric_impermeability": _NONE + ("relative", "m/F"),
    "thermal_expansion": ("1/K", "K^-1", "10^-6/K", "10^-6 K^-1", "1e-6/K", "ppm/K", "1/degC"),
    "thermal_conductivity": ("W/(m K)", "W m^-1 K^-1", "W/m/K", "mW/(m K)"),
    "electrical_conductivity": ("S/m", "S/cm", "MS/m", "1/(ohm m)", "(ohm m)^-1"),
    "seebeck": ("V/K", "mV/K", "uV/K"),
    "piezoelectric_d": ("pC/N", "C/N", "pm/V", "m/V", "10^-12 C/N"),
    "piezoelectric_e": ("C/m^2", "C m^-2"),
    "piezoelectric_g": ("V m/N", "Vm/N", "m^2/C", "10^-3 V m/N", "mV m/N"),
    "piezoelectric_h": ("V/m", "N/C", "GV/m", "10^9 V/m"),
    "elastic_stiffness": _PRESSURE,
    "elastic_compliance": _INV_PRESSURE,
    "electro_optic": ("pm/V", "m/V", "10^-12 m/V"),
    "photoelastic": _NONE,
    "piezo_optic": ("1/Pa", "Pa^-1", "10^-12/Pa", "10^-12 m^2/N", "m^2/N", "1/TPa", "Brewster"),
    "electrostriction": ("m^4/C^2", "m^4 C^-2"),
    "second_harmonic": ("pm/V", "m/V", "esu"),
    "second_harmonic_kleinman": ("pm/V", "m/V", "esu"),
    "optical_activity": _NONE,
    "third_order_elastic": _PRESSURE,
    "fourth_order_elastic": _PRESSURE,
    "magnetization": ("A/m", "kA/m", "emu/cm^3", "T", "mu_B", "mu_B/atom", "mu_B/f.u."),
    "toroidal_moment": ("A m^2", "mu_B A", "mu_B nm"),
    "magnetic_susceptibility": _NONE + ("SI", "emu/cm^3", "emu/(cm^3 Oe)", "emu/mol", "emu/(mol Oe)",
                                        "m^3/mol"),
    "magnetoelectric": ("s/m", "ps/m", "V/(cm Oe)", "mV/(cm Oe)", "V/(m T)"),
    "piezomagnetic": ("1/T", "T^-1", "m/A", "A/(m Pa)", "ppm/T", "G/bar"),
    "magnetostriction": ("m^2/A^2", "1/T^2", "T^-2", "ppm/T^2"),
    "magnetoelectric_beta": ("s/A", "ps/A", "C/(m^2 T^2)", "1/(A m)"),
    "magnetoelectric_gamma": ("s/V", "ps/V", "T m^2/V^2", "A/V^2"),
    "faraday": _NONE + ("1/T", "T^-1", "1/Oe"),
}
_GENERIC = tuple(dict.fromkeys(u for us in UNITS.values() for u in us)) + ("arb", "arbitrary")
_PAIRS = (("GPa", "1/GPa"), ("TPa", "1/TPa"), ("MPa", "1/MPa"), ("Pa", "1/Pa"), ("Mbar", "1/Mbar"),
          ("kbar", "1/kbar"), ("N/m^2", "m^2/N"), ("GPa", "GPa^-1"), ("TPa", "TPa^-1"), ("MPa", "MPa^-1"),
          ("Pa", "Pa^-1"), ("TPa", "10^-12 m^2/N"), ("10^9 N/m^2", "1/GPa"))
_INVERSE = {}
for _a, _b in _PAIRS:
    _INVERSE.setdefault(_a, _b)
    _INVERSE.setdefault(_b, _a)


def _norm(u):
    return "".join(u.replace("\u00b5", "u").replace("\u03bc", "u").replace("^", "").split())


def accepted_units(what):
    """The unit labels accepted for a property (tuple of str).

    Examples
    --------
    >>> accepted_units("piezoelectric_d")[:2]
    ('pC/N', 'C/N')
    """
    prop = as_property(what)
    return UNITS.get(prop.name, _GENERIC) if prop.name != "tensor" else _GENERIC


def check_units(units, what):
    """Validate a unit label for a property; returns the label as given (or None).

    Raises
    ------
    DataError
        For a label that is not a string, or not accepted for the property; the
        message names the nearest accepted labels and lists them all.

    Examples
    --------
    >>> check_units("pC/N", "piezoelectric_d"), check_units(None, "piezoelectric_d")
    ('pC/N', None)
    """
    if units is None:
        return None
    if not isinstance(units, str):
        raise DataError(f"units must be a label such as 'GPa', got {type(units).__name__} {units!r}")
    acc = accepted_units(what)
    key = _norm(units)
    if key in {_norm(u) for u in acc}:
        return units.strip()
    near = difflib.get_close_matches(units, acc, n=3, cutoff=0.0)
    prop = as_property(what)
    raise DataError(f"unknown units {units!r} for {prop.name}; nearest: {', '.join(near)} "
                    f"(accepted: {', '.join(acc)})")


def inverse_units(units):
    """The label of the inverse unit ('GPa' -> '1/GPa'), None when unknown or not given.

    Examples
    --------
    >>> inverse_units("GPa"), inverse_units("1/TPa")
    ('1/GPa', 'TPa')
    """
    if units is None:
        return None
    for k, v in _INVERSE.items():
        if _norm(k) == _norm(units):
            return v
    return None
