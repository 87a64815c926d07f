"""Checking numeric tensors against a point group: :func:`check_tensor` and :func:`check_tensors`.

Method
------
Let x be the distinct components of the data (Voigt convention, the order of
``tensym.component_labels``) and x = A a the symmetric form of the group with
its independent constants a (``tensym.tensor_form``).  The constants are the
weighted least-squares estimate

    a = (A^T W A)^-1 A^T W x,   cov(a) = (A^T W A)^-1,

in one of two stated norms:

``'frobenius'`` (no uncertainties given)
    W = diag(number of index tuples * Voigt factor^2): the full-tensor
    Frobenius norm, so the symmetrized tensor A a is the orthogonal
    projection of the data onto the invariant subspace (the group average of
    the tensor).  No uncertainties are propagated.
``'inverse covariance'`` (standard uncertainties or a covariance given)
    W = C^-1 over the distinct components (c12 and c21 are one measurement,
    counted once): generalised least squares; cov(a) is the propagated
    uncertainty, chi2 = (x - A a)^T W (x - A a) with n - k degrees of freedom
    and its p-value P(chi2_{n-k} > chi2).

Whatever the norm, ``residual_fraction`` is ||t - t_sym||_F / ||t||_F in the
full-tensor Frobenius norm (every index tuple counted, not the Voigt matrix).

Partial data
    A component that is not given is NaN in the data (unknown, never zero;
    write 0 for a component known to be zero).  The fit above runs over the
    given components only (the rows of A, x and W of the given ones), the
    residual and the deviations are taken over them, dof = n_given - k, and
    forbidden components and relations are tested only where the data give
    them (a relation needs its tied component and the independent components
    it names).  When the given components do not determine the constants
    (A restricted to them has rank < k) the check is refused, naming the loose
    constants.  The report says how many components were given; the breakdown
    by irrep and the misorientation need the whole residual and are omitted.

Verdict
    ``'empty'`` when every given component is zero: an all-zero tensor fits
    every group, so there is nothing to check (``passes`` is False).
    Otherwise, with ``tol_kind='relative'``: residual_fraction <= tol *and*,
    per component, max over the given components of |x - x_sym| <=
    component_tol * max |x_sym| (Voigt units; component_tol defaults to
    tol / 2, so that a forbidden c15 of 1 % of c11 fails even though the
    whole-tensor fraction is below 1 %); with ``tol_kind='absolute'``:
    max |x - x_sym| <= tol in the data's units (a bound on every component).
    With uncertainties the chi-square test must pass as well.

Physical sanity
    For the properties in :data:`DEFINITE_PROPERTIES` (elastic stiffness and
    compliance, dielectric permittivity and impermeability, thermal and
    electrical conductivity) the report gives the eigenvalues of the
    symmetrized tensor as a symmetric map (the 6x6 elastic matrix in Mandel
    form, shear rows and columns times sqrt 2, so that its eigenvalues are
    those of c_ijkl on symmetric tensors) and warns when one is not positive:
    a stiffness that is not positive definite is mechanically unstable.  The
    warning does not change the verdict, which is about symmetry.  Thermal
    expansion, susceptibility and the Seebeck tensor may be negative and get
    no such test.

Magnitude
    The numbers are worked on in a copy scaled by a power of two (exact) so
    that the results do not depend on the magnitude of the units; values
    from 1e-300 to 1e300 give the same verdicts (tested).

Forbidden components are those the form sets to zero; broken relations are
the other tied components, each compared with its relation evaluated on the
*measured* values of the independent components (c66 against (c11 - c12)/2
with the measured c11 and c12), with the propagated uncertainty of the
difference.

The residual is broken down by the irreps of the group (for a magnetic
group, of its character table as an abstract group, the linear action
including the time-reversal sign): the Frobenius-orthogonal residual splits
into the isotypic components of every non-trivial irrep (``tensym.data.irreps``);
each is reported as a fraction of ||t||_F, and the squares of the fractions add
up to the square of the Frobenius residual fraction.  A small misorientation
of a symmetric tensor only feeds the rotation-like irreps; the report also
gives the first-order misorientation that best explains the residual.

Examples
--------
>>> import numpy as np
>>> import tensym
>>> c = np.zeros((6, 6))
>>> c[:3, :3] = 50.0; c[[0, 1, 2], [0, 1, 2]] = 160.0; c[[3, 4, 5], [3, 4, 5]] = 80.0
>>> r = tensym.check_tensor(c, "elastic_stiffness", "m-3m", units="GPa")
>>> r.passes, [(k.name, round(k.value, 6)) for k in r.constants]
(True, [('c11', 160.0), ('c12', 50.0), ('c44', 80.0)])
>>> c[0, 5] = c[5, 0] = 10.0
>>> r = tensym.check_tensor(c, "elastic_stiffness", "m-3m", units="GPa")
>>> r.verdict, [(f.label, f.value) for f in r.forbidden if f.value]
('inconsistent', [('c16', 10.0)])
"""

from dataclasses import dataclass, field
import math
import numbers

import numpy as np
import sympy as sp

from tensym.data.dataset import TensorData, _as_float_array, _check_finite, _exponent, _to_components, tensor_data
from tensym.data.irreps import isotypic_projectors
from tensym.data.model import lie_derivative, layout as _layout, numeric_form
from tensym.data.stats import chi2_sf
from tensym.errors import DataError, InvalidOptionError
from tensym.tensors.form import as_property

__all__ = [
    "FittedConstant",
    "ForbiddenComponent",
    "RelationCheck",
    "IrrepResidual",
    "CheckReport",
    "BatchCheck",
    "check_tensor",
    "check_tensors",
    "TOL_KINDS",
    "VERDICTS",
    "DEFINITE_PROPERTIES",
]

#: Accepted values of ``tol_kind``.
TOL_KINDS = ("relative", "absolute")
_LIE = np.array([[[0, 0, 0], [0, 0, -1], [0, 1, 0]], [[0, 0, 1], [0, 0, 0], [-1, 0, 0]],
                 [[0, -1, 0], [1, 0, 0], [0, 0, 0]]], dtype=np.float64)


def _ro(a):
    if a is None:
        return None
    a = np.array(a, dtype=np.float64, copy=True)
    a.setflags(write=False)
    return a


def _own(a):
    """Mark a freshly made array read-only without copying it."""
    if a is None:
        return None
    a = np.asarray(a)
    a.setflags(write=False)
    return a


def _ro_bool(a):
    a = np.array(a, dtype=bool, copy=True)
    a.setflags(write=False)
    return a


@dataclass(frozen=True)
class FittedConstant:
    """A fitted independent constant (see :class:`CheckReport`).

    Attributes
    ----------
    name : str
        As the symbolic form names it ('c11', 'd14').
    symbol : sympy.Symbol
        The form's symbol.
    value : float
        Best estimate (data units).
    sigma : float or None
        Propagated standard uncertainty (None without uncertainties).
    """

    name: str
    symbol: sp.Symbol
    value: float
    sigma: float = None


@dataclass(frozen=True)
class ForbiddenComponent:
    """A component the symmetry requires to vanish.

    Attributes
    ----------
    label : str
        Voigt label ('c14', 'd33').
    value : float
        Its value in the data.
    sigma : float or None
        Its standard uncertainty.
    significance : float or None
        |value| / sigma (its size in units of its uncertainty).
    """

    label: str
    value: float
    sigma: float = None
    significance: float = None


@dataclass(frozen=True)
class RelationCheck:
    """A component the symmetry ties to others, and how well the data keep the tie.

    Attributes
    ----------
    label : str
        Voigt label of the tied component ('c66').
    relation : sympy.Eq
        The relation of the form, e.g. ``Eq(c66, c11/2 - c12/2)``.
    value : float
        The tied component in the data.
    expected : float
        The right side evaluated with the measured independent components.
    discrepancy : float
        ``value - expected``.
    sigma : float or None
        Propagated standard uncertainty of the discrepancy.
    significance : float or None
        |discrepancy| / sigma.
    """

    label: str
    relation: object
    value: float
    expected: float
    discrepancy: float
    sigma: float = None
    significance: float = None


@dataclass(frozen=True)
class IrrepResidual:
    """The part of the data in one non-trivial isotypic component.

    Attributes
    ----------
    label : str
        Label of the real irrep (Mulliken; grey groups add the time parity,
        ``'B1g+'`` / ``'B1g-'``).
    dim : int
        Its dimension.
    multiplicity : int
        How often it occurs in the property's tensor space.
    fraction : float
        Frobenius norm of the component over the Frobenius norm of the tensor.
    rotation_like : bool
        The irrep occurs in the axial-vector representation, so a small
        misorientation of a symmetric tensor shows up here.
    """

    label: str
    dim: int
    multiplicity: int
    fraction: float
    rotation_like: bool


@dataclass(frozen=True, eq=False)
class CheckReport:
    """The result of :func:`check_tensor` (immutable; arrays are read-only).

    Attributes
    ----------
    property : str
        Property name.
    group : str
        Group symbol (setting symbol where the catalog has one).
    setting : str
        The group's setting in words.
    units : str or None
        The data's unit label (every value below except fractions is in it).
    norm : str
        'frobenius' or 'inverse covariance' (see the module notes).
    constants : tuple of FittedConstant
        Best estimates of the independent constants, in the form's order.
    constants_covariance : numpy.ndarray or None
        float64 (k, k) propagated covariance of the constants.
    forbidden : tuple of ForbiddenComponent
        Every *given* component the symmetry requires to vanish.
    relations : tuple of RelationCheck
        Every other tied component that can be checked: it is given, and so
        are the independent components of its relation.
    symmetrized : numpy.ndarray
        float64 Voigt array of the fitted symmetric tensor.
    symmetrized_sigma : numpy.ndarray or None
        float64 Voigt array of its propagated standard uncertainties.
    residual : numpy.ndarray
        float64 Voigt array, data minus symmetrized.
    residual_fraction : float
        ||t - t_sym||_F / ||t||_F, full-tensor Frobenius norms.
    max_deviation : float
        Largest |data - symmetrized| over the distinct components (data units).
    chi2, p_value : float or None
        With uncertainties: chi-square of the fit and P(chi2_dof > chi2).
    dof : int
        n_given - k (given distinct components minus constants).
    n_given : int
        Number of distinct components given (out of ``data.n``); the fit and
        the tests use only these (see the module notes on partial data).
    not_given : tuple of str
        Labels of the components that are not given (unknown, never taken as zero).
    irreps : tuple of IrrepResidual
        Residual by irrep: every irrep of the tensor space except the trivial
        one (dropped by its label, so the tuple is complete when the space has
        no invariant at all), in table order; empty for continuous groups.
        A magnetic group uses its own character table (the group as an
        abstract group, ``tensym.character_table``): parent labels for a
        black-and-white group, labels with the time parity for a grey one
        (``B1g-``).
    misorientation : float
        (NaN with unknown components, like the irrep breakdown, which is then
        empty: both need the whole residual tensor.)
        First-order angle in degrees of the rotation R_w that best explains the
        residual: data ~ R_w . t_sym (active; valid for a few degrees).
        ``tensym.orient`` would return about R_w^T.
    misorientation_axis : numpy.ndarray
        float64 (3,) unit axis of that rotation (z when the angle is 0).
    rotation_fraction : float
        Frobenius norm of the residual part that rotation explains, over ||t||_F.
    component_deviation : float
        Largest |data - symmetrized| over the given components divided by the
        largest allowed magnitude max |symmetrized| (Voigt units; inf when the
        group allows nothing but the data are not zero).
    tol : float
        Tolerance of the verdict.
    tol_kind : str
        'relative' (tol bounds residual_fraction, dimensionless, and
        component_tol bounds component_deviation) or 'absolute' (tol bounds
        max_deviation, in the data's units: a bound on every component).
    component_tol : float or None
        The per-component bound of the relative verdict (None with 'absolute').
    alpha : float
        Significance level of the chi-square test (used with uncertainties).
    passes : bool
        The verdict: within tolerance and (with uncertainties) p_value >= alpha;
        False when the verdict is 'empty'.
    verdict : str
        'consistent', 'inconsistent', or 'empty' when every given component is
        zero (an all-zero tensor fits every group: there is nothing to check).
    reasons : tuple of str
        The criteria and how each came out.
    eigenvalues : numpy.ndarray or None
        float64 (m,) ascending, in the data's units: for the properties of
        :data:`DEFINITE_PROPERTIES`, the eigenvalues of the symmetrized tensor
        as a symmetric map (the 6x6 elastic matrix in Mandel form, shear rows
        and columns times sqrt 2 for a stiffness and divided by sqrt 2 for a
        compliance; the 3x3 matrix of a rank-2 property); None otherwise.
    positive_definite : bool or None
        Every eigenvalue > 1e-10 times the largest |eigenvalue| (None when not
        applicable).
    warnings : tuple of str
        Physical-sanity warnings (a stiffness that is not positive definite is
        mechanically unstable); they do not change the verdict, which is about
        symmetry.
    data : TensorData
        The checked data.
    form : TensorForm
        The symbolic form used.

    Examples
    --------
    >>> import numpy as np
    >>> r = check_tensor(np.diag([2.0, 2.0, 3.0]), "dielectric_permittivity", "6/mmm")
    >>> r.verdict, r.norm, [c.name for c in r.constants], len(r.forbidden), r.residual_fraction
    ('consistent', 'frobenius', ['epsilon11', 'epsilon33'], 3, 0.0)
    """

    property: str
    group: str
    setting: str
    units: str
    norm: str
    constants: tuple
    constants_covariance: np.ndarray
    forbidden: tuple
    relations: tuple
    symmetrized: np.ndarray
    symmetrized_sigma: np.ndarray
    residual: np.ndarray
    residual_fraction: float
    max_deviation: float
    chi2: float
    dof: int
    p_value: float
    irreps: tuple
    misorientation: float
    misorientation_axis: np.ndarray
    rotation_fraction: float
    tol: float
    tol_kind: str
    alpha: float
    passes: bool
    verdict: str
    reasons: tuple
    n_given: int
    not_given: tuple
    component_deviation: float
    component_tol: float
    eigenvalues: np.ndarray
    positive_definite: bool
    warnings: tuple
    data: TensorData = field(repr=False)
    form: object = field(repr=False)

    def constant(self, name):
        """The FittedConstant called ``name`` ('c11')."""
        for c in self.constants:
            if c.name == name:
                return c
        raise KeyError(f"{name!r} is not an independent constant here; constants: "
                       f"{', '.join(c.name for c in self.constants)}")

    def text(self):
        """Plain-text report."""
        from tensym.data.render import check_text

        return check_text(self)

    __str__ = text

    def latex(self, *, standalone=False):
        """LaTeX report (amsmath); a complete document with ``standalone=True``."""
        from tensym.data.render import check_latex

        return check_latex(self, standalone=standalone)

    def markdown(self):
        """Markdown report."""
        from tensym.data.render import check_markdown

        return check_markdown(self)

    def record(self):
        """JSON-ready dict (kind 'tensor_check')."""
        from tensym.data.render import check_record

        return check_record(self)

    def to_json(self):
        """The report as a JSON document (str)."""
        import json

        return json.dumps(self.record(), indent=2, ensure_ascii=False)

    def _repr_latex_(self):
        return "$$" + self.latex() + "$$"

    def __repr__(self):
        return (f"<CheckReport {self.property} vs {self.group}: {self.verdict}, "
                f"residual {self.residual_fraction:.3g}>")


# --- shared validation ---------------------------------------------------------------
def _group(group):
    from tensym.groups import as_group

    if group is None:
        raise DataError("say which group to check against (group='6mm', 'C6v', a group object, ...)")
    return as_group(group)


def _options(tol, tol_kind, alpha, component_tol=None):
    if tol_kind not in TOL_KINDS:
        raise InvalidOptionError(f"tol_kind={tol_kind!r} is not one of {', '.join(TOL_KINDS)}")
    if isinstance(tol, bool) or not isinstance(tol, numbers.Real) or not math.isfinite(tol) or tol < 0:
        raise DataError(f"tol must be a finite number >= 0, got {tol!r}")
    if isinstance(alpha, bool) or not isinstance(alpha, numbers.Real) or not 0 < alpha < 1:
        raise DataError(f"alpha must be a significance level in (0, 1), got {alpha!r}")
    if component_tol is not None:
        if tol_kind == "absolute":
            raise DataError("component_tol belongs to tol_kind='relative'; with tol_kind='absolute' tol itself "
                            "bounds every component's deviation (in the data's units)")
        if isinstance(component_tol, bool) or not isinstance(component_tol, numbers.Real) or \
                not math.isfinite(component_tol) or component_tol < 0:
            raise DataError(f"component_tol must be a finite number >= 0 (relative to the largest allowed "
                            f"magnitude), got {component_tol!r}")
    ctol = None if tol_kind == "absolute" else float(tol) / 2 if component_tol is None else float(component_tol)
    return float(tol), tol_kind, float(alpha), ctol


def _group_name(g):
    return getattr(g, "setting_symbol", "") or getattr(g, "symbol", "") or "unnamed group"


def _trivial_label(g):
    """Label of the trivial irrep of a finite group: the one whose characters are all 1.

    For a magnetic group this is the irrep of the group as an abstract group
    (``A1g+`` of a grey group, the parent's ``A1g`` of a black-and-white one):
    the linear action on a tensor includes the time-reversal sign, so its
    invariants are the tensor form's components.
    """
    from tensym.reps import character_table

    table = character_table(g)
    return next(i.label for i in table.real_irreps if all(v == 1 for v in i.characters))


def _residual_projectors(prop, g):
    """Isotypic projectors of the residual: every irrep in the tensor space except the trivial one.

    The trivial irrep is dropped by its label, not by position: it is absent
    from a space with no invariant (a pyroelectric vector in mmm, a
    magnetization in a grey group), and then every projector is residual.
    Continuous groups: no breakdown (empty tuple).
    """
    if getattr(g, "is_continuous", False):
        return ()
    trivial = _trivial_label(g)
    return tuple(pr for pr in isotypic_projectors(prop, g) if pr.label != trivial)


# --- kernels ---------------------------------------------------------------------------
_LIE_CACHE = {}


def _lie_matrices(lay):
    """float64 (3, n, n): the infinitesimal rotations about x, y, z in y coordinates."""
    key = lay.prop
    if key not in _LIE_CACHE:
        t = lay.x_to_full(np.diag(1.0 / lay.scale))  # unit y vectors as tensors
        mats = []
        for L in _LIE:
            dt = lie_derivative(t, L, lay.rank)
            mats.append((lay.scale[:, None] * lay.full_to_x(dt).T))
        arr = np.array(mats)
        arr.setflags(write=False)  # process-wide cache
        _LIE_CACHE[key] = arr
    return _LIE_CACHE[key]


#: Properties whose tensor must be positive definite, and why (see ``CheckReport.eigenvalues``).
DEFINITE_PROPERTIES = {
    "elastic_stiffness": "mechanical stability: the strain energy c_ijkl e_ij e_kl / 2 is positive for every "
                         "strain (Mouhat & Coudert, Phys. Rev. B 90, 224104 (2014))",
    "elastic_compliance": "mechanical stability: the compliance is the inverse of a positive definite stiffness",
    "dielectric_permittivity": "dielectric stability of an insulating crystal: the electrostatic energy is "
                               "positive (static or low-frequency permittivity; near a resonance or in a metal "
                               "at optical frequencies a negative value is physical, then ignore this)",
    "dielectric_impermeability": "the impermeability is the inverse of a positive definite permittivity",
    "thermal_conductivity": "the second law: heat flows from hot to cold, so the entropy production "
                            "k_ij g_i g_j / T^2 is positive for every temperature gradient g",
    "electrical_conductivity": "Joule heating sigma_ij E_i E_j is positive for every field E",
}
_W6 = np.array([1.0, 1.0, 1.0, math.sqrt(2.0), math.sqrt(2.0), math.sqrt(2.0)])
_W66 = np.outer(_W6, _W6)
_PD_REL = 1e-10


def _eigenvalues(prop, lay, x):
    """Eigenvalues (..., m), ascending, of the tensors x (..., n) as symmetric maps, or None."""
    if prop.name not in DEFINITE_PROPERTIES:
        return None
    v = lay.x_to_voigt(x)
    if prop.name == "elastic_stiffness":
        m = v * _W66  # Mandel form: the eigenvalues are those of c_ijkl on symmetric tensors
    elif prop.name == "elastic_compliance":
        m = v / _W66  # s_44 = 4 s_2323 (Voigt factors): Mandel s_44 / 2 = 2 s_2323
    else:
        m = 0.5 * (v + np.swapaxes(v, -1, -2))
    return np.linalg.eigvalsh(m)


def _is_positive_definite(eig):
    big = np.max(np.abs(eig), axis=-1)
    return np.min(eig, axis=-1) > _PD_REL * big


def _definite_warning(prop, eig, units):
    u = f" {units}" if units else ""
    vals = ", ".join(f"{v:.4g}" for v in eig)
    if prop.name in ("elastic_stiffness", "elastic_compliance"):
        what = (f"the {prop.name.replace('_', ' ')} is not positive definite: the crystal would be mechanically "
                "unstable; eigenvalues of the 6x6 matrix in Mandel form (shear rows and columns "
                f"{'times' if prop.name == 'elastic_stiffness' else 'divided by'} sqrt 2): {vals}{u}")
    else:
        what = f"the {prop.name.replace('_', ' ')} is not positive definite; eigenvalues: {vals}{u}"
    return f"{what}; every eigenvalue must be > 0 for {DEFINITE_PROPERTIES[prop.name]}"


def _undetermined(nf, known):
    """Names of the constants the given components do not fix (empty when they fix them all)."""
    if nf.k == 0:
        return ()
    ak = nf.A[known]
    if ak.shape[0] == 0:
        return tuple(nf.names)
    _, sv, vt = np.linalg.svd(ak, full_matrices=True)
    rank = int(np.sum(sv > 1e-9 * max(1.0, float(sv[0]) if sv.size else 1.0)))
    if rank == nf.k:
        return ()
    null = vt[rank:]
    loose = np.max(np.abs(null), axis=0) > 1e-9
    return tuple(nm for nm, bad in zip(nf.names, loose) if bad)


def _undetermined_error(nf, known, loose, group_name, lay, where=""):
    missing = [lay.labels[c] for c in np.flatnonzero(~known)]
    return DataError(
        f"the given components{where} ({int(known.sum())} of the {lay.n} of {lay.prop.name}) do not determine the "
        f"constants of {group_name}: {', '.join(loose)} {'is' if len(loose) == 1 else 'are'} not fixed by any given "
        f"component (not given: {', '.join(missing[:8])}{', ...' if len(missing) > 8 else ''}); give the "
        "components that fix them, or write 0 explicitly for a component known to be zero (a component that is "
        "not given is unknown, never taken as zero)")


def _fit_single(nf, x, cov, known):
    """Constants, their covariance, fitted x and chi2 for one tensor, from its given components only.

    ``x`` and ``cov`` are the scaled copies (unknown entries set to 0, ignored).
    """
    lay = nf.layout
    complete = bool(known.all())
    kk = np.flatnonzero(known)
    ak = nf.A[kk]
    if cov is None:
        if complete:
            a = nf.fit @ x
        elif nf.k:
            wk = lay.weight[kk]
            a = np.linalg.solve(ak.T @ (wk[:, None] * ak), ak.T @ (wk * x[kk]))
        else:
            a = np.zeros(0)
        return a, None, nf.A @ a, None
    w = np.linalg.inv(cov[np.ix_(kk, kk)])
    w = 0.5 * (w + w.T)
    if nf.k:
        gram = ak.T @ w @ ak
        cov_a = np.linalg.inv(gram)
        cov_a = 0.5 * (cov_a + cov_a.T)
        a = cov_a @ (ak.T @ w @ x[kk])
    else:
        cov_a, a = np.zeros((0, 0)), np.zeros(0)
    xf = nf.A @ a
    r = (x - xf)[kk]
    chi2 = float(r @ w @ r)
    return a, cov_a, xf, chi2


def _constraint_matrix(nf, comps):
    """Rows g with g . x = component - (its relation on the measured constants)."""
    n = nf.layout.n
    g = np.zeros((len(comps), n))
    for r, c in enumerate(comps):
        g[r, c] = 1.0
        g[r, nf.free] -= nf.A[c]
    return g


def _misorientation(lay, nf, y, y_fit):
    lie = _lie_matrices(lay)
    j = np.einsum("aij,j->ia", lie, y_fit)
    j = j - nf.Q @ (nf.Q.T @ j)
    r = y - nf.Q @ (nf.Q.T @ y)
    if not np.any(j):
        return 0.0, np.array([0.0, 0.0, 1.0]), 0.0
    w, *_ = np.linalg.lstsq(j, r, rcond=1e-10)
    part = float(np.linalg.norm(j @ w))
    ang = float(np.linalg.norm(w))
    axis = w / ang if ang > 0 else np.array([0.0, 0.0, 1.0])
    return math.degrees(ang), axis, part


def _component_deviation(res, xf, known):
    """(largest |res| over given components / max |xf|, index of that component, index of the max |xf|)."""
    dev = np.where(known, np.abs(res), 0.0)
    i = int(np.argmax(dev)) if dev.size else 0
    ref = np.abs(xf)
    j = int(np.argmax(ref)) if ref.size else 0
    top = float(ref[j]) if ref.size else 0.0
    d = float(dev[i]) if dev.size else 0.0
    if top > 0:
        return d / top, i, j
    return (math.inf if d > 0 else 0.0), i, j


def check_tensor(values, what=None, group=None, *, sigma=None, covariance=None, units=None, tol=0.01,
                 tol_kind="relative", alpha=0.05, component_tol=None, layout="auto", symmetry_tol=1e-8):
    """Check a numeric tensor against a point group: forbidden components, relations, fit, verdict.

    Parameters
    ----------
    values : array_like or TensorData
        Voigt array (with the property's factor convention), full Cartesian
        array, or a TensorData (``tensym.tensor_data``, ``tensym.read_tensor``).
        NaN marks a component that is not given (unknown, never zero).
    what : str, Property or TensorSpec
        The property (not needed for a TensorData).
    group : group object or str
        The point group, in the setting the data are expressed in.
    sigma, covariance, units, layout, symmetry_tol
        As in :func:`tensym.tensor_data` (for array input).
    tol : float
        Tolerance of the verdict (see ``tol_kind``); default 0.01.
    tol_kind : {'relative', 'absolute'}
        'relative': ``residual_fraction <= tol`` (dimensionless, full-tensor
        Frobenius norm) *and* ``component_deviation <= component_tol``;
        'absolute': ``max_deviation <= tol`` in the data's units (a bound on
        every component).
    alpha : float
        With uncertainties the verdict also needs ``p_value >= alpha`` (default 0.05).
    component_tol : float, optional
        Per-component bound of the relative verdict: every given component's
        deviation from the symmetric fit (a forbidden component's value, a tied
        component's miss) must be at most ``component_tol`` times the largest
        allowed magnitude max |symmetrized| (Voigt units).  Default ``tol / 2``
        (0.005: a forbidden c15 of 1 % of c11 fails).  Only with
        ``tol_kind='relative'``.

    Returns
    -------
    CheckReport

    Raises
    ------
    DataError
        For invalid data (see ``tensym.tensor_data``), a missing group or
        property, a tolerance/alpha out of range, ``component_tol`` with
        ``tol_kind='absolute'``, or given components that do not determine
        the constants of the group (the message says how to mark a zero).
    InvalidOptionError
        For a ``tol_kind`` or ``layout`` outside its set.
    UnknownGroupError, UnknownPropertyError
        For unknown symbols or names.
    InvalidGroupError
        For a group argument that is neither a group nor a symbol.

    Examples
    --------
    >>> import numpy as np
    >>> import tensym
    >>> d = np.zeros((3, 6)); d[2, 2] = 20.0; d[2, 0] = d[2, 1] = -8.0; d[0, 4] = d[1, 3] = 30.0
    >>> rep = tensym.check_tensor(d, "piezoelectric_d", "6mm", sigma=np.full((3, 6), 0.5), units="pC/N")
    >>> [(k.name, k.value, round(k.sigma, 4)) for k in rep.constants]
    [('d15', 30.0, 0.3536), ('d31', -8.0, 0.3536), ('d33', 20.0, 0.5)]
    >>> rep.chi2, rep.dof, rep.passes
    (0.0, 15, True)
    >>> tensym.check_tensor(np.zeros((3, 6)), "piezoelectric_d", "6mm").verdict
    'empty'
    """
    tol, tol_kind, alpha, ctol = _options(tol, tol_kind, alpha, component_tol)
    if isinstance(values, TensorData):
        data = tensor_data(values, what, sigma=sigma, covariance=covariance, units=units)
    else:
        data = tensor_data(values, what, sigma=sigma, covariance=covariance, units=units, layout=layout,
                           symmetry_tol=symmetry_tol)
    g = _group(group)
    prop = data.property
    lay = _layout(prop)
    nf = numeric_form(prop, g)
    x = np.asarray(data.components)
    known = np.asarray(data.known)
    complete = bool(known.all())
    n_given = int(known.sum())
    not_given = tuple(lay.labels[c] for c in np.flatnonzero(~known))
    cov = None if data.covariance is None else np.asarray(data.covariance)
    norm = "frobenius" if cov is None else "inverse covariance"
    e = _exponent(x)
    if e is None:
        return _empty_report(data, g, nf, norm, tol, tol_kind, ctol, alpha, n_given, not_given)
    if not complete:
        loose = _undetermined(nf, known)
        if loose:
            raise _undetermined_error(nf, known, loose, _group_name(g), lay)
    xs = np.ldexp(np.where(known, x, 0.0), -e)  # the scaled copy (see _exponent)
    both = known[:, None] & known[None, :]
    covs = None if cov is None else np.ldexp(np.where(both, cov, 0.0), -2 * e)
    a_s, cov_as, xf_s, chi2 = _fit_single(nf, xs, covs, known)
    a = np.ldexp(a_s, e)
    cov_a = None if cov_as is None else np.ldexp(cov_as, 2 * e)
    sig_a = None if cov_a is None else np.sqrt(np.maximum(np.diag(cov_a), 0.0))
    constants = tuple(FittedConstant(nm, sym, float(a[i]), None if sig_a is None else float(sig_a[i]))
                      for i, (nm, sym) in enumerate(zip(nf.names, nf.form.symbols)))
    sig_x = None if cov is None else np.sqrt(np.diag(cov))
    forbidden = []
    for c in nf.zero:
        if not known[c]:
            continue
        v = float(x[c])
        s = None if sig_x is None else float(sig_x[c])
        forbidden.append(ForbiddenComponent(lay.labels[c], v, s, None if s is None else abs(v) / s))
    relations = []
    tied = [c for c in nf.tied if known[c] and all(known[nf.free[nf.A[c] != 0]])]
    gmat = _constraint_matrix(nf, tied)
    disc = np.ldexp(gmat @ xs, e)
    dsig = None if covs is None else np.ldexp(np.sqrt(np.maximum(np.einsum("ri,ij,rj->r", gmat, covs, gmat), 0.0)), e)
    for r, c in enumerate(tied):
        lab = lay.labels[c]
        d = float(disc[r])
        s = None if dsig is None else float(dsig[r])
        relations.append(RelationCheck(lab, nf.relations.get(lab), float(x[c]), float(x[c]) - d, d, s,
                                       None if not s else abs(d) / s))
    y = lay.scale * xs
    ynorm = float(np.linalg.norm(y))
    res_s = np.where(known, xs - xf_s, 0.0)
    frac = float(np.linalg.norm(lay.scale * res_s)) / ynorm
    maxdev = float(np.ldexp(np.max(np.abs(res_s)), e)) if res_s.size else 0.0
    dof = n_given - nf.k
    p = None
    if chi2 is not None and dof > 0:
        p = float(chi2_sf(chi2, dof))
    if complete:
        parts = []
        for pr in _residual_projectors(prop, g):
            f = float(np.linalg.norm(pr.basis.T @ y)) / ynorm
            parts.append(IrrepResidual(pr.label, pr.dim, pr.multiplicity, f, pr.rotation_like))
        irreps = tuple(parts)
        y_fro = nf.Q @ (nf.Q.T @ y)
        ang, axis, part = _misorientation(lay, nf, y, y_fro)
        rot_frac = part / ynorm
    else:  # the breakdown needs the whole residual tensor
        irreps, ang, axis, rot_frac = (), math.nan, np.full(3, math.nan), math.nan
    sym_sigma = None
    if cov_a is not None:
        cxf = nf.A @ cov_as @ nf.A.T
        sym_sigma = np.ldexp(np.abs(lay.x_to_voigt(np.sqrt(np.maximum(np.diag(cxf), 0.0)))), e)
    cdev, worst, top = _component_deviation(res_s, xf_s, known)
    comp = (cdev, lay.labels[worst], float(np.ldexp(abs(res_s[worst]), e)), lay.labels[top],
            float(np.ldexp(abs(xf_s[top]), e)))
    passes, reasons = _verdict(frac, maxdev, comp, p, chi2, dof, tol, tol_kind, ctol, alpha, data.units)
    if not complete:
        reasons = reasons + (f"components given: {n_given} of {lay.n}; the fit and the tests use only these; not "
                             f"given (unknown, not zero): {', '.join(not_given[:8])}"
                             f"{', ...' if len(not_given) > 8 else ''}",)
    eig = _eigenvalues(prop, lay, xf_s)
    pd, warns = None, ()
    if eig is not None:
        pd = bool(_is_positive_definite(eig))
        with np.errstate(over="ignore"):  # an eigenvalue past 1.8e308 is inf (the fit itself is scaled)
            eig = np.ldexp(eig, e)
        if not pd:
            warns = (_definite_warning(prop, eig, data.units),)
    res_v = lay.x_to_voigt(np.where(known, np.ldexp(res_s, e), np.nan))
    return CheckReport(
        property=prop.name,
        group=_group_name(g),
        setting=getattr(g, "setting", ""),
        units=data.units,
        norm=norm,
        constants=constants,
        constants_covariance=_ro(cov_a),
        forbidden=tuple(forbidden),
        relations=tuple(relations),
        symmetrized=_ro(np.ldexp(lay.x_to_voigt(xf_s), e)),
        symmetrized_sigma=_ro(sym_sigma),
        residual=_ro(res_v),
        residual_fraction=frac,
        max_deviation=maxdev,
        chi2=chi2,
        dof=dof,
        p_value=p,
        irreps=irreps,
        misorientation=ang,
        misorientation_axis=_ro(axis),
        rotation_fraction=rot_frac,
        tol=tol,
        tol_kind=tol_kind,
        alpha=alpha,
        passes=passes,
        verdict="consistent" if passes else "inconsistent",
        reasons=reasons,
        n_given=n_given,
        not_given=not_given,
        component_deviation=cdev,
        component_tol=ctol,
        eigenvalues=_ro(eig),
        positive_definite=pd,
        warnings=warns,
        data=data,
        form=nf.form,
    )


_EMPTY_REASON = ("every given component is zero: an all-zero tensor is consistent with every group, so there is "
                 "nothing to check (verdict 'empty')")


def _empty_report(data, g, nf, norm, tol, tol_kind, ctol, alpha, n_given, not_given):
    """The report of data whose given components are all zero (verdict 'empty', passes False)."""
    lay = nf.layout
    known = np.asarray(data.known)
    sig_x = None if data.covariance is None else np.sqrt(np.diag(np.asarray(data.covariance)))
    forbidden = tuple(ForbiddenComponent(lay.labels[c], 0.0, None if sig_x is None else float(sig_x[c]),
                                         None if sig_x is None else 0.0) for c in nf.zero if known[c])
    zeros = np.zeros(lay.n)
    return CheckReport(
        property=lay.prop.name, group=_group_name(g), setting=getattr(g, "setting", ""), units=data.units,
        norm=norm,
        constants=tuple(FittedConstant(nm, sym, 0.0, None) for nm, sym in zip(nf.names, nf.form.symbols)),
        constants_covariance=None, forbidden=forbidden, relations=(),
        symmetrized=_ro(lay.x_to_voigt(zeros)), symmetrized_sigma=None,
        residual=_ro(lay.x_to_voigt(np.where(known, 0.0, np.nan))), residual_fraction=0.0, max_deviation=0.0,
        chi2=None, dof=n_given - nf.k, p_value=None, irreps=(), misorientation=0.0,
        misorientation_axis=_ro([0.0, 0.0, 1.0]), rotation_fraction=0.0, tol=tol, tol_kind=tol_kind, alpha=alpha,
        passes=False, verdict="empty",
        reasons=(_EMPTY_REASON,) + (() if not not_given else (f"components given: {n_given} of {lay.n}",)),
        n_given=n_given, not_given=not_given,
        component_deviation=0.0, component_tol=ctol, eigenvalues=None, positive_definite=None, warnings=(),
        data=data, form=nf.form)


def _verdict(frac, maxdev, comp, p, chi2, dof, tol, tol_kind, ctol, alpha, units):
    reasons = []
    u = f" {units}" if units else ""
    if tol_kind == "relative":
        ok = frac <= tol
        reasons.append(f"residual fraction {frac:.3g} {'<=' if ok else '>'} tol {tol:g} "
                       "(relative, full-tensor Frobenius norm)")
        cdev, worst, dev, top, ref = comp
        ok_c = cdev <= ctol
        reasons.append(f"largest component deviation {dev:.4g}{u} ({worst}) is {cdev:.3g} of the largest allowed "
                       f"magnitude {ref:.4g}{u} ({top}), {'<=' if ok_c else '>'} component_tol {ctol:g} "
                       "(relative, per component, Voigt units)")
        ok = ok and ok_c
    else:
        ok = maxdev <= tol
        reasons.append(f"largest deviation {maxdev:.4g}{u} {'<=' if ok else '>'} tol {tol:g}{u} (absolute)")
    if p is not None:
        ok_p = p >= alpha
        reasons.append(f"chi2 = {chi2:.4g} with {dof} dof, p = {p:.3g} {'>=' if ok_p else '<'} alpha {alpha:g}")
        ok = ok and ok_p
    elif chi2 is not None:
        reasons.append("no degrees of freedom left for a chi-square test")
    return bool(ok), tuple(reasons)


# --- batch ---------------------------------------------------------------------------------
#: Verdicts of a batch row (and of a CheckReport).
VERDICTS = ("consistent", "inconsistent", "empty")


@dataclass(frozen=True, eq=False)
class BatchCheck:
    """The result of :func:`check_tensors`: N tensors against one group (arrays read-only).

    ``str()`` and :meth:`text` give a summary (counts per verdict, the worst
    cases); :meth:`table` gives the full table, one row per tensor.

    Attributes
    ----------
    property, group, units, norm : str
        As in CheckReport (``norm`` 'frobenius' or 'inverse covariance').
    names : tuple of str
        Names of the constants (columns of ``constants``).
    constants : numpy.ndarray
        float64 (N, k) best estimates.
    constants_sigma : numpy.ndarray or None
        float64 (N, k) propagated standard uncertainties.
    symmetrized_components : numpy.ndarray
        float64 (N, n) fitted symmetric tensors as distinct components (the
        order of ``tensym.component_labels``); :attr:`symmetrized` gives Voigt arrays.
    residual_fraction : numpy.ndarray
        float64 (N,), full-tensor Frobenius norms over the given components.
    max_deviation : numpy.ndarray
        float64 (N,) largest |data - symmetrized| per tensor over the given
        components (data units).
    component_deviation : numpy.ndarray
        float64 (N,) max_deviation over the largest allowed magnitude
        max |symmetrized| (as CheckReport.component_deviation).
    forbidden_labels : tuple of str
    forbidden : numpy.ndarray
        float64 (N, len(forbidden_labels)) values of the forbidden components
        (NaN where not given).
    relation_labels : tuple of str
    discrepancies : numpy.ndarray
        float64 (N, len(relation_labels)) tied component minus its relation on
        the measured constants (NaN where a component it needs is not given).
    chi2, p_value : numpy.ndarray or None
        float64 (N,) with uncertainties.
    dof : int
        n - k, the degrees of freedom of a complete tensor; tensor i has
        ``n_given[i] - k``.
    n_given : numpy.ndarray
        int64 (N,) number of distinct components given per tensor.
    irrep_labels : tuple of str
    irrep_fractions : numpy.ndarray
        float64 (N, len(irrep_labels)) residual fraction per non-trivial irrep
        (NaN for a tensor with unknown components).
    eigenvalues : numpy.ndarray or None
        float64 (N, m) ascending eigenvalues of each symmetrized tensor as a
        symmetric map (as CheckReport.eigenvalues; None for a property
        outside ``DEFINITE_PROPERTIES``).
    positive_definite : numpy.ndarray or None
        bool (N,) every eigenvalue > 1e-10 of the largest |eigenvalue|.
    verdicts : numpy.ndarray
        str (N,) 'consistent', 'inconsistent' or 'empty' (every given
        component zero: nothing to check).
    passes : numpy.ndarray
        bool (N,) verdicts == 'consistent'.
    tol, tol_kind, alpha, component_tol
        The verdict's criteria (as in CheckReport).

    Examples
    --------
    >>> import numpy as np
    >>> b = check_tensors(np.stack([np.eye(3), np.diag([1.0, 2.0, 3.0])]), "thermal_expansion", "m-3m")
    >>> b.passes.tolist(), b.names, b.constants[:, 0].tolist()
    ([True, False], ('alpha11',), [1.0, 2.0])
    >>> print(b.text().splitlines()[1])
      consistent: 1, inconsistent: 1, empty: 0
    """

    property: str
    group: str
    units: str
    norm: str
    names: tuple
    constants: np.ndarray
    constants_sigma: np.ndarray
    symmetrized_components: np.ndarray
    residual_fraction: np.ndarray
    max_deviation: np.ndarray
    component_deviation: np.ndarray
    forbidden_labels: tuple
    forbidden: np.ndarray
    relation_labels: tuple
    discrepancies: np.ndarray
    chi2: np.ndarray
    dof: int
    p_value: np.ndarray
    n_given: np.ndarray
    irrep_labels: tuple
    irrep_fractions: np.ndarray
    eigenvalues: np.ndarray
    positive_definite: np.ndarray
    verdicts: np.ndarray
    passes: np.ndarray
    tol: float
    tol_kind: str
    alpha: float
    component_tol: float
    _inputs: tuple = field(repr=False)

    def __len__(self):
        return int(self.passes.shape[0])

    @property
    def symmetrized(self):
        """float64 (N, *voigt_shape): the fitted symmetric tensors as Voigt arrays (a new array)."""
        return _layout(self._inputs[2]).x_to_voigt(self.symmetrized_components)

    def counts(self):
        """dict verdict -> number of tensors, for every verdict in :data:`VERDICTS` (int)."""
        return {v: int(np.count_nonzero(self.verdicts == v)) for v in VERDICTS}

    def worst(self, count=5):
        """Indices (int64 array) of the ``count`` tensors with the largest residual fraction, worst first."""
        if isinstance(count, bool) or not isinstance(count, numbers.Integral) or count < 0:
            raise DataError(f"count must be an integer >= 0, got {count!r}")
        key = np.where(self.verdicts == "empty", -np.inf, self.residual_fraction)
        order = np.argsort(-key, kind="stable")
        return order[: min(int(count), len(order))]

    def report(self, i):
        """The full :class:`CheckReport` of tensor ``i`` (recomputed by :func:`check_tensor`)."""
        values, sigma, what, group = self._inputs
        n = len(self)
        if isinstance(i, bool) or not isinstance(i, numbers.Integral) or not -n <= i < n:
            raise IndexError(f"tensor index {i!r} is outside 0..{n - 1}")
        opts = {} if self.tol_kind == "absolute" else {"component_tol": self.component_tol}
        return check_tensor(values[i], what, group, sigma=None if sigma is None else sigma[i], units=self.units,
                            tol=self.tol, tol_kind=self.tol_kind, alpha=self.alpha, layout="components", **opts)

    def text(self, worst=5):
        """Summary text: counts per verdict, the criteria, the ``worst`` largest residuals, sanity warnings.

        The full table, one row per tensor, is :meth:`table`.
        """
        from tensym.data.render import batch_summary_text

        return batch_summary_text(self, worst)

    def __str__(self):
        return self.text()

    def table(self):
        """The full text table, one row per tensor (rendered by tensym.output through :mod:`tensym.display`)."""
        from tensym.display import show

        return show(self, "text")

    def markdown(self):
        """Markdown table, one row per tensor."""
        from tensym.display import show

        return show(self, "markdown")

    def latex(self, *, standalone=False):
        """Math-mode LaTeX table, one row per tensor; a complete document with ``standalone=True``."""
        from tensym.display import show

        return show(self, "latex", standalone=standalone)

    def to_json(self):
        """JSON document of the table (str)."""
        from tensym.display import show

        return show(self, "json")

    def _repr_latex_(self):
        return "$$" + self.latex() + "$$"

    def __repr__(self):
        return (f"<BatchCheck {self.property} vs {self.group}: {int(self.passes.sum())} of {len(self)} "
                "consistent>")


def check_tensors(values, what, group, *, sigma=None, units=None, tol=0.01, tol_kind="relative", alpha=0.05,
                  component_tol=None, layout="auto", symmetry_tol=1e-8):
    """Check a stack of N tensors against one group in one vectorised pass.

    Parameters
    ----------
    values : array_like
        (N, *voigt_shape) Voigt arrays, (N, 3, ..., 3) full arrays, or (with
        ``layout='components'``) (N, n) distinct components.  NaN marks a
        component that is not given (unknown), as in :func:`check_tensor`.
    what : str, Property or TensorSpec
        The property.
    group : group object or str
        The point group (setting of the data).
    sigma : array_like, optional
        Standard uncertainties, the shape of ``values``.
    units, tol, tol_kind, alpha, component_tol, layout, symmetry_tol
        As in :func:`check_tensor`.

    Returns
    -------
    BatchCheck

    Raises
    ------
    DataError
        For a wrong shape, values that are not real numbers, inf, contradicted
        index symmetry (the message names the tensor of the stack),
        non-positive uncertainties, unknown units, a tolerance out of range,
        or tensors whose given components do not determine the constants
        (the message names them).
    InvalidOptionError
        For a ``tol_kind`` or ``layout`` outside its set.
    UnknownGroupError, UnknownPropertyError, InvalidGroupError
        As in :func:`check_tensor`.

    Examples
    --------
    >>> import numpy as np
    >>> import tensym
    >>> c = np.zeros((2, 6, 6)); c[:, :3, :3] = 1.0; c[:, [0, 1, 2], [0, 1, 2]] = 3.0
    >>> c[:, [3, 4, 5], [3, 4, 5]] = 1.0; c[1, 0, 1] = c[1, 1, 0] = 1.5
    >>> b = tensym.check_tensors(c, "elastic_stiffness", "m-3m")
    >>> b.passes.tolist(), b.names
    ([True, False], ('c11', 'c12', 'c44'))
    """
    from tensym.data.dataset import LAYOUTS
    from tensym.data.units import check_units

    tol, tol_kind, alpha, ctol = _options(tol, tol_kind, alpha, component_tol)
    prop = as_property(what)
    g = _group(group)
    lay = _layout(prop)
    nf = numeric_form(prop, g)
    u = check_units(units, prop)
    arr = _as_float_array(values, "values")
    if layout not in LAYOUTS:
        raise InvalidOptionError(f"layout={layout!r} is not one of {', '.join(LAYOUTS)}")
    shapes = {"voigt": lay.voigt_shape, "full": (3,) * lay.rank, "components": (lay.n,)}
    kind = None
    for k in (("voigt", "full") if layout == "auto" else (layout,)):
        sh = shapes[k]
        if arr.ndim == len(sh) + 1 and arr.shape[1:] == sh:
            kind = k
            break
    if kind is None:
        acc = " or ".join(f"(N, {', '.join(map(str, shapes[k]))})"
                          for k in (("voigt", "full") if layout == "auto" else (layout,)))
        raise DataError(f"values for {prop.name} must be a stack of shape {acc}, got {arr.shape}")
    s_arr = None
    if sigma is not None:
        s_arr = _as_float_array(sigma, "sigma")
        if s_arr.shape != arr.shape:
            raise DataError(f"sigma must have the shape of values {arr.shape}, got {s_arr.shape}")
    _check_finite(arr, "values", arr.shape, nan_ok=True)
    if s_arr is not None:
        _check_finite(s_arr, "sigma", s_arr.shape, nan_ok=True)
    nt = arr.shape[0]
    k, n = nf.k, lay.n
    parts = _residual_projectors(prop, g)
    labels_ir = tuple(pr.label for pr in parts)
    big = np.concatenate([pr.basis for pr in parts], axis=1) if parts else np.zeros((n, 0))
    bounds = np.cumsum([0] + [pr.basis.shape[1] for pr in parts])[:-1]
    gmat_t = _constraint_matrix(nf, nf.tied).T
    dof = n - k
    definite = prop.name in DEFINITE_PROPERTIES
    out_x = np.empty((nt, n))
    out_a = np.empty((nt, k))
    out_sa = None if s_arr is None else np.empty((nt, k))
    out_sx = None if s_arr is None else np.empty((nt, n))
    out_xf = np.empty((nt, n))
    out_frac = np.empty(nt)
    out_dev = np.empty(nt)
    out_cdev = np.empty(nt)
    out_chi = None if s_arr is None else np.empty(nt)
    out_disc = np.empty((nt, len(nf.tied)))
    out_ir = np.empty((nt, len(parts)))
    out_given = np.empty(nt, dtype=np.int64)
    out_empty = np.empty(nt, dtype=bool)
    out_eig = np.empty((nt, 6 if lay.rank == 4 else 3)) if definite else None
    out_pd = np.empty(nt, dtype=bool) if definite else None
    live = {"voigt": lay.voigt_comp, "full": lay.flat_comp, "components": np.zeros(n)}[kind] >= 0
    aa = np.einsum("ik,il->ikl", nf.A, nf.A).reshape(n, k * k)
    rank_ok = {}
    chunk = 1024  # small blocks: cache-resident, and below the size where BLAS starts threads
    for lo in range(0, nt, chunk):
        hi = min(nt, lo + chunk)
        m = hi - lo
        blk = arr[lo:hi]
        x = _to_components(blk, lay, kind, "values", float(symmetry_tol))
        if nt > 1 and np.isnan(x).all(axis=1).any():
            i = lo + int(np.flatnonzero(np.isnan(x).all(axis=1))[0])
            raise DataError(f"values: tensor {i} of the stack gives no component (every entry NaN, the marker "
                            "of an unknown component)")
        out_x[lo:hi] = x
        known = ~np.isnan(x)
        out_given[lo:hi] = known.sum(axis=1)
        # a scaled copy per tensor (exact powers of two): results do not depend on the units' magnitude
        top = np.fmax.reduce(np.abs(np.where(known, x, 0.0)), axis=1)
        empty = ~(top > 0)
        out_empty[lo:hi] = empty
        e = np.where(empty, 0, np.frexp(np.where(empty, 1.0, top))[1]).astype(np.int64)
        xs = np.ldexp(np.where(known, x, 0.0), -e[:, None])
        partial = ~known.all(axis=1) & ~empty
        if partial.any():
            pats, inv = np.unique(known[partial], axis=0, return_inverse=True)
            rows = np.flatnonzero(partial)
            for pi, pat in enumerate(pats):
                key = pat.tobytes()
                if key not in rank_ok:
                    rank_ok[key] = _undetermined(nf, pat)
                if rank_ok[key]:
                    bad = lo + rows[np.flatnonzero(inv.reshape(-1) == pi)]
                    where = (f" of tensor{'s' if len(bad) > 1 else ''} {', '.join(map(str, bad[:6]))}"
                             f"{', ...' if len(bad) > 6 else ''} of the stack")
                    raise _undetermined_error(nf, pat, rank_ok[key], _group_name(g), lay, where)
        if s_arr is None:
            w = np.where(known, lay.weight, 0.0)
            if known.all():
                a = xs @ nf.fit.T
            else:
                a = np.zeros((m, k))
                if k:
                    gram = (np.where(empty[:, None], lay.weight, w) @ aa).reshape(m, k, k)
                    a = np.linalg.solve(gram, ((w * xs) @ nf.A)[:, :, None])[:, :, 0]
        else:
            sb = s_arr[lo:hi]
            nonpos = (sb.reshape(m, -1) <= 0) & live
            if nonpos.any():
                pos = np.argwhere(nonpos)[0]
                raise DataError(f"sigma must be strictly positive standard uncertainties; tensor {lo + pos[0]} of "
                                f"the stack has {sb.reshape(m, -1)[pos[0], pos[1]]:g}")
            sx = _to_components(sb, lay, kind, "sigma", float(symmetry_tol), positive=True)
            lacking = known & np.isnan(sx)
            if lacking.any():
                pos = np.argwhere(lacking)[0]
                raise DataError(f"sigma is NaN (unknown) for {lay.labels[pos[1]]} of tensor {lo + pos[0]} of the "
                                "stack, whose value is given; give an uncertainty for every given component")
            sx = np.where(known, sx, np.nan)
            out_sx[lo:hi] = sx
            sxs = np.ldexp(np.where(known, sx, 1.0), -e[:, None])
            with np.errstate(divide="ignore", over="ignore"):
                w = np.where(known, 1.0 / sxs**2, 0.0)
            if not np.all(np.isfinite(w)):
                raise DataError("sigma: uncertainties far below the values (by more than a factor 1e150) have "
                                "squares outside the float64 range")
            if k:
                gram = (np.where(empty[:, None], 1.0, w) @ aa).reshape(m, k, k)  # A^T diag(w) A for every tensor
                cov_a = np.linalg.inv(gram)
                a = np.matmul(cov_a, ((w * xs) @ nf.A)[:, :, None])[:, :, 0]
                out_sa[lo:hi] = np.ldexp(np.sqrt(np.maximum(np.diagonal(cov_a, axis1=1, axis2=2), 0.0)),
                                         e[:, None])
            else:
                a = np.zeros((m, 0))
        out_a[lo:hi] = np.ldexp(a, e[:, None])
        xf = a @ nf.A.T
        out_xf[lo:hi] = np.ldexp(xf, e[:, None])
        res = np.where(known, xs - xf, 0.0)
        y = xs * lay.scale
        ynorm = np.sqrt(np.einsum("ni,ni->n", y, y))
        safe = np.where(ynorm > 0, ynorm, 1.0)
        rs = res * lay.scale
        out_frac[lo:hi] = np.where(ynorm > 0, np.sqrt(np.einsum("ni,ni->n", rs, rs)) / safe, 0.0)
        dev = np.max(np.abs(res), axis=1) if n else np.zeros(m)
        out_dev[lo:hi] = np.ldexp(dev, e)
        ref = np.max(np.abs(xf), axis=1) if n else np.zeros(m)
        with np.errstate(divide="ignore", invalid="ignore"):
            out_cdev[lo:hi] = np.where(ref > 0, dev / np.where(ref > 0, ref, 1.0), np.where(dev > 0, np.inf, 0.0))
        if s_arr is not None:
            out_chi[lo:hi] = np.einsum("ni,ni->n", res, res * w)
        out_disc[lo:hi] = np.ldexp(np.where(known, xs, np.nan) @ gmat_t, e[:, None]) if gmat_t.size else \
            np.zeros((m, 0))
        if parts:
            proj = y @ big
            fr = np.sqrt(np.add.reduceat(proj * proj, bounds, axis=1)) / safe[:, None]
            out_ir[lo:hi] = np.where(known.all(axis=1)[:, None], fr, np.nan)
        if definite:
            eig = _eigenvalues(prop, lay, xf)
            out_pd[lo:hi] = _is_positive_definite(eig) & ~empty
            with np.errstate(over="ignore"):
                out_eig[lo:hi] = np.ldexp(eig, e[:, None])
    x, a, sig_a, xf, frac, maxdev, chi2, disc, fr_ir = (out_x, out_a, out_sa, out_xf, out_frac, out_dev, out_chi,
                                                        out_disc, out_ir)
    sx = out_sx
    norm = "frobenius" if s_arr is None else "inverse covariance"
    p = None
    if chi2 is not None:
        p = np.full(nt, np.nan)
        dofs = out_given - k
        for d in np.unique(dofs):
            if d > 0:
                sel = dofs == d
                p[sel] = chi2_sf(chi2[sel], int(d))
        if np.isnan(p).all():
            p = None  # no degrees of freedom left for a chi-square test
    if tol_kind == "relative":
        ok = (frac <= tol) & (out_cdev <= ctol)
    else:
        ok = maxdev <= tol
    if p is not None:
        ok = ok & ~(np.asarray(p) < alpha)
    ok = ok & ~out_empty
    verdicts = np.where(out_empty, "empty", np.where(ok, "consistent", "inconsistent"))
    return BatchCheck(
        property=prop.name,
        group=_group_name(g),
        units=u,
        norm=norm,
        names=nf.names,
        constants=_own(a),
        constants_sigma=_own(sig_a),
        symmetrized_components=_own(xf),
        residual_fraction=_own(frac),
        max_deviation=_own(maxdev),
        component_deviation=_own(out_cdev),
        forbidden_labels=tuple(lay.labels[c] for c in nf.zero),
        forbidden=_own(x[:, nf.zero]),
        relation_labels=tuple(lay.labels[c] for c in nf.tied),
        discrepancies=_own(disc),
        chi2=_own(chi2),
        dof=dof,
        p_value=_own(p),
        n_given=_own(out_given),
        irrep_labels=labels_ir,
        irrep_fractions=_own(fr_ir),
        eigenvalues=_own(out_eig),
        positive_definite=None if out_pd is None else _ro_bool(out_pd),
        verdicts=_own(verdicts),
        passes=_ro_bool(ok),
        tol=tol,
        tol_kind=tol_kind,
        alpha=alpha,
        component_tol=ctol,
        _inputs=(_own(x), _own(sx), prop, g),
    )
