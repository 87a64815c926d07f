"""Magnetic properties in the catalog: time-odd and magnetically induced tensors.

Importing this module registers the entries below with
:func:`tensym.tensors.catalog.register_property` (``tensym.tensors`` does it).

Parity conventions (DESIGN.md): a polar tensor transforms with R in every
index, an axial one with det(R) R; a time-odd one changes sign under a primed
operation (g combined with time reversal 1').  The magnetic field H and the
magnetization M are axial and time-odd; the electric field E and the
polarization P are polar and time-even; stress and strain are polar,
time-even and symmetric.  A property that links two quantities has the
product of their parities (R. R. Birss, Symmetry and Magnetism, 1964, ch. 4;
International Tables for Crystallography Vol. D, 2013, ch. 1.5).

==========================  ======  ==============================  ======  ========  ====================
name                        symbol  definition                      axial   time-odd  Voigt
==========================  ======  ==============================  ======  ========  ====================
magnetization               M       spontaneous M_i                 yes     yes       --
toroidal_moment             T       spontaneous toroidal moment     no      yes       --
magnetic_susceptibility     chi     M_i = chi_ij H_j (symmetric)    no      no        --
magnetoelectric             alpha   P_i = alpha_ij H_j              yes     yes       --
piezomagnetic               Lambda  M_i = Lambda_ijk sigma_jk       yes     yes       as piezoelectric d
magnetostriction            N       eps_ij = N_ijkl M_k M_l         no      no        as electrostriction
magnetoelectric_beta        beta    P_i = beta_ijk H_j H_k / 2      no      no        no factors
magnetoelectric_gamma       gamma   M_i = gamma_ijk E_j E_k / 2     yes     yes       no factors
faraday                     f       eps^a_ij = i f_ijk H_k          yes     no        --
==========================  ======  ==============================  ======  ========  ====================

Notes on the entries:

* ``magnetic_susceptibility`` is the symmetric, time-even part; it is allowed
  in every group (the antisymmetric, time-odd part of a susceptibility or a
  conductivity is an axial time-odd vector, of the form of ``magnetization``).
* ``magnetoelectric``: the same alpha gives mu0 M_j = alpha_ij E_i (Maxwell
  relation); the first index is the polar one.
* ``piezomagnetic``: Lambda_ijk = Lambda_iJ for J = 1, 2, 3 and Lambda_iJ / 2
  for J = 4, 5, 6, so that M_i = Lambda_iJ sigma_J with the Voigt stresses
  (the convention of the piezoelectric d).
* ``magnetostriction``: N_ijkl = N_IJ / 2^a with a the number of I, J in 4..6
  (engineering shear strain; as electrostriction Q).
* ``magnetoelectric_beta`` and ``magnetoelectric_gamma`` are the second-order
  magnetoelectric coefficients of the free energy -beta_ijk E_i H_j H_k / 2 -
  gamma_ijk H_i E_j E_k / 2; beta_ijk = beta_iJ without factors, so
  P_i = (1/2) sum_J beta_iJ w_J with w = (H1^2, H2^2, H3^2, 2 H2 H3, 2 H1 H3, 2 H1 H2).
* ``faraday``: the antisymmetric (gyrotropic) part of the optical permittivity
  induced by a field, linear Faraday effect; it is time-even, allowed in
  every group (isotropic media: f_ijk = f e_ijk), and the ordinary Hall tensor
  rho^a_ij = R_ijk H_k has the same form.

Examples
--------
>>> from tensym.tensors import get_property
>>> get_property("magnetoelectric").spec
TensorSpec(rank=2, symmetries=(), axial=True, time_odd=True)
"""

from tensym.tensors.catalog import Property, register_property
from tensym.tensors.spec import TensorSpec

__all__ = ["MAGNETIC_PROPERTIES"]

_V1 = ((0,),)
_V2 = ((0,), (1,))
_VP = ((0,), (1, 2))
_V4 = ((0, 1), (2, 3))
_V3 = ((0,), (1,), (2,))

#: The magnetic catalog entries, in catalog order.
MAGNETIC_PROPERTIES = (
    Property("magnetization", TensorSpec(1, axial=True, time_odd=True), "M", _V1, (False,),
             "spontaneous magnetization M_i (axial, time-odd)"),
    Property("toroidal_moment", TensorSpec(1, time_odd=True), "T", _V1, (False,),
             "spontaneous toroidal moment T_i (polar, time-odd)"),
    Property("magnetic_susceptibility", TensorSpec(2, ["ji"]), "chi", _V2, (False, False),
             "magnetic susceptibility chi_ij, M_i = chi_ij H_j (symmetric part, time-even)"),
    Property("magnetoelectric", TensorSpec(2, axial=True, time_odd=True), "alpha", _V2, (False, False),
             "linear magnetoelectric tensor alpha_ij, P_i = alpha_ij H_j (axial, time-odd)"),
    Property("piezomagnetic", TensorSpec(3, ["ikj"], axial=True, time_odd=True), "Lambda", _VP, (False, True),
             "piezomagnetic coefficients Lambda_iJ, M_i = Lambda_ijk sigma_jk (axial, time-odd)",
             "Lambda_ijk = Lambda_iJ for J = 1, 2, 3 and Lambda_iJ / 2 for J = 4, 5, 6 (as piezoelectric d)"),
    Property("magnetostriction", TensorSpec(4, ["jikl", "ijlk"]), "N", _V4, (True, True),
             "magnetostriction N_IJ, strain_ij = N_ijkl M_k M_l (time-even)",
             "N_ijkl = N_IJ / 2^a, a = number of I, J in 4..6 (engineering strain; as electrostriction)"),
    Property("magnetoelectric_beta", TensorSpec(3, ["ikj"]), "beta", _VP, (False, False),
             "second-order magnetoelectric beta_iJ, P_i = beta_ijk H_j H_k / 2 (polar, time-even)",
             "beta_ijk = beta_iJ (no factors)"),
    Property("magnetoelectric_gamma", TensorSpec(3, ["ikj"], axial=True, time_odd=True), "gamma", _VP,
             (False, False),
             "second-order magnetoelectric gamma_iJ, M_i = gamma_ijk E_j E_k / 2 (axial, time-odd)",
             "gamma_ijk = gamma_iJ (no factors)"),
    Property("faraday", TensorSpec(3, ["-jik"], axial=True), "f", _V3, (False, False, False),
             "linear Faraday tensor f_ijk, antisymmetric permittivity eps_ij - eps_ji = 2 i f_ijk H_k "
             "(axial, time-even)"),
)

for _p in MAGNETIC_PROPERTIES:
    register_property(_p)
