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
full-tensor Frobenius norm (every index tuple counted, not the Voigt matrix),
0 for an all-zero tensor.

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

from tensym.data.dataset import TensorData, _as_float_array, _check_finite, _to_components, tensor_data
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
        Every component the symmetry requires to vanish.
    relations : tuple of RelationCheck
        Every other tied component.
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
        n - k (distinct components minus constants).
    irreps : tuple of IrrepResidual
        Residual by irrep: every irrep of the tensor space except the trivial
        one (dropped by its label, so the tuple is complete when the space has
        no invariant at all), in table order; empty for continuous groups.
        A magnetic group uses its own character table (the group as an
        abstract group, ``tensym.character_table``): parent labels for a
        black-and-white group, labels with the time parity for a grey one
        (``B1g-``).
    misorientation : float
        First-order angle in degrees of the rotation R_w that best explains the
        residual: data ~ R_w . t_sym (active; valid for a few degrees).
        ``tensym.orient`` would return about R_w^T.
    misorientation_axis : numpy.ndarray
        float64 (3,) unit axis of that rotation (z when the angle is 0).
    rotation_fraction : float
        Frobenius norm of the residual part that rotation explains, over ||t||_F.
    tol : float
        Tolerance of the verdict.
    tol_kind : str
        'relative' (tol bounds residual_fraction, dimensionless) or 'absolute'
        (tol bounds max_deviation, in the data's units).
    alpha : float
        Significance level of the chi-square test (used with uncertainties).
    passes : bool
        The verdict: within tolerance and (with uncertainties) p_value >= alpha.
    verdict : str
        'consistent' or 'inconsistent'.
    reasons : tuple of str
        The criteria and how each came out.
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


def _options(tol, tol_kind, alpha):
    if tol_kind not in TOL_KINDS:
        raise InvalidOptionError(f"tol_kind={tol_kind!r} is not one of {', '.join(TOL_KINDS)}")
    if isinstance(tol, bool) or not isinstance(tol, numbers.Real) or not math.isfinite(tol) or tol < 0:
        raise DataError(f"tol must be a finite number >= 0, got {tol!r}")
    if isinstance(alpha, bool) or not isinstance(alpha, numbers.Real) or not 0 < alpha < 1:
        raise DataError(f"alpha must be a significance level in (0, 1), got {alpha!r}")
    return float(tol), tol_kind, float(alpha)


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
        _LIE_CACHE[key] = np.array(mats)
    return _LIE_CACHE[key]


def _fit_single(nf, x, cov):
    """Constants, their covariance, fitted x and chi2 for one tensor."""
    lay = nf.layout
    if cov is None:
        a = nf.fit @ x
        return a, None, nf.A @ a, None
    w = np.linalg.inv(cov)
    w = 0.5 * (w + w.T)
    if nf.k:
        gram = nf.A.T @ w @ nf.A
        cov_a = np.linalg.inv(gram)
        cov_a = 0.5 * (cov_a + cov_a.T)
        a = cov_a @ (nf.A.T @ w @ x)
    else:
        cov_a, a = np.zeros((0, 0)), np.zeros(0)
    xf = nf.A @ a
    r = x - xf
    chi2 = float(r @ w @ r)
    del lay
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


def check_tensor(values, what=None, group=None, *, sigma=None, covariance=None, units=None, tol=0.01,
                 tol_kind="relative", alpha=0.05, layout="auto", symmetry_tol=1e-8):
    """Check a numeric tensor against a point group: forbidden components, relations, fit, verdict.

    Parameters
    ----------
    values : array_like or TensorData
        Voigt array (with the property's factor convention), full Cartesian
        array, or a TensorData (``tensym.tensor_data``, ``tensym.read_tensor``).
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
        Frobenius norm); 'absolute': ``max_deviation <= tol`` in the data's units.
    alpha : float
        With uncertainties the verdict also needs ``p_value >= alpha`` (default 0.05).

    Returns
    -------
    CheckReport

    Raises
    ------
    DataError
        For invalid data (see ``tensym.tensor_data``), a missing group or
        property, or a tolerance/alpha out of range.
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
    """
    tol, tol_kind, alpha = _options(tol, tol_kind, alpha)
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
    cov = None if data.covariance is None else np.asarray(data.covariance)
    a, cov_a, xf, chi2 = _fit_single(nf, x, cov)
    norm = "frobenius" if cov is None else "inverse covariance"
    sig_a = None if cov_a is None else np.sqrt(np.maximum(np.diag(cov_a), 0.0))
    constants = tuple(FittedConstant(nm, sym, float(a[i]), None if sig_a is None else float(sig_a[i]))
                      for i, (nm, sym) in enumerate(zip(nf.names, nf.form.symbols)))
    sig_x = None if cov is None else np.sqrt(np.diag(cov))
    forbidden = []
    for c in nf.zero:
        v = float(x[c])
        s = None if sig_x is None else float(sig_x[c])
        forbidden.append(ForbiddenComponent(lay.labels[c], v, s, None if s is None else abs(v) / s))
    relations = []
    gmat = _constraint_matrix(nf, nf.tied)
    disc = gmat @ x
    dvar = None if cov is None else np.einsum("ri,ij,rj->r", gmat, cov, gmat)
    for r, c in enumerate(nf.tied):
        lab = lay.labels[c]
        d = float(disc[r])
        s = None if dvar is None else float(math.sqrt(max(dvar[r], 0.0)))
        relations.append(RelationCheck(lab, nf.relations.get(lab), float(x[c]), float(x[c]) - d, d, s,
                                       None if not s else abs(d) / s))
    y = lay.scale * x
    ynorm = float(np.linalg.norm(y))
    res = x - xf
    frac = float(np.linalg.norm(lay.scale * res)) / ynorm if ynorm > 0 else 0.0
    maxdev = float(np.max(np.abs(res))) if res.size else 0.0
    dof = lay.n - nf.k
    p = None
    if chi2 is not None and dof > 0:
        p = float(chi2_sf(chi2, dof))
    parts = []
    for pr in _residual_projectors(prop, g):
        f = float(np.linalg.norm(pr.basis.T @ y)) / ynorm if ynorm > 0 else 0.0
        parts.append(IrrepResidual(pr.label, pr.dim, pr.multiplicity, f, pr.rotation_like))
    irreps = tuple(parts)
    y_fro = nf.Q @ (nf.Q.T @ y)
    ang, axis, part = _misorientation(lay, nf, y, y_fro)
    sym_sigma = None
    if cov_a is not None:
        cxf = nf.A @ cov_a @ nf.A.T
        sym_sigma = np.abs(lay.x_to_voigt(np.sqrt(np.maximum(np.diag(cxf), 0.0))))
    passes, reasons = _verdict(frac, maxdev, p, chi2, dof, tol, tol_kind, alpha, data.units)
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
        symmetrized=_ro(lay.x_to_voigt(xf)),
        symmetrized_sigma=_ro(sym_sigma),
        residual=_ro(lay.x_to_voigt(res)),
        residual_fraction=frac,
        max_deviation=maxdev,
        chi2=chi2,
        dof=dof,
        p_value=p,
        irreps=irreps,
        misorientation=ang,
        misorientation_axis=_ro(axis),
        rotation_fraction=part / ynorm if ynorm > 0 else 0.0,
        tol=tol,
        tol_kind=tol_kind,
        alpha=alpha,
        passes=passes,
        verdict="consistent" if passes else "inconsistent",
        reasons=reasons,
        data=data,
        form=nf.form,
    )


def _verdict(frac, maxdev, p, chi2, dof, tol, tol_kind, alpha, units):
    reasons = []
    if tol_kind == "relative":
        ok = frac <= tol
        reasons.append(f"residual fraction {frac:.3g} {'<=' if ok else '>'} tol {tol:g} "
                       "(relative, full-tensor Frobenius norm)")
    else:
        ok = maxdev <= tol
        u = f" {units}" if units else ""
        reasons.append(f"largest deviation {maxdev:.4g}{u} {'<=' if ok else '>'} tol {tol:g}{u} (absolute)")
    if p is not None:
        ok_p = p >= alpha
        reasons.append(f"chi2 = {chi2:.4g} with {dof} dof, p = {p:.3g} {'>=' if ok_p else '<'} alpha {alpha:g}")
        ok = ok and ok_p
    elif chi2 is not None:
        reasons.append("no degrees of freedom left for a chi-square test")
    return bool(ok), tuple(reasons)


# --- batch ---------------------------------------------------------------------------------
@dataclass(frozen=True, eq=False)
class BatchCheck:
    """The result of :func:`check_tensors`: N tensors against one group (arrays read-only).

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
        float64 (N,), full-tensor Frobenius norms.
    max_deviation : numpy.ndarray
        float64 (N,) largest |data - symmetrized| per tensor (data units).
    forbidden_labels : tuple of str
    forbidden : numpy.ndarray
        float64 (N, len(forbidden_labels)) values of the forbidden components.
    relation_labels : tuple of str
    discrepancies : numpy.ndarray
        float64 (N, len(relation_labels)) tied component minus its relation on
        the measured constants.
    chi2, p_value : numpy.ndarray or None
        float64 (N,) with uncertainties.
    dof : int
    irrep_labels : tuple of str
    irrep_fractions : numpy.ndarray
        float64 (N, len(irrep_labels)) residual fraction per non-trivial irrep.
    passes : numpy.ndarray
        bool (N,) verdicts.
    tol, tol_kind, alpha
        The verdict's criteria (as in CheckReport).

    Examples
    --------
    >>> import numpy as np
    >>> b = check_tensors(np.stack([np.eye(3), np.diag([1.0, 2.0, 3.0])]), "thermal_expansion", "m-3m")
    >>> b.passes.tolist(), b.names, b.constants[:, 0].tolist()
    ([True, False], ('alpha11',), [1.0, 2.0])
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
    forbidden_labels: tuple
    forbidden: np.ndarray
    relation_labels: tuple
    discrepancies: np.ndarray
    chi2: np.ndarray
    dof: int
    p_value: np.ndarray
    irrep_labels: tuple
    irrep_fractions: np.ndarray
    passes: np.ndarray
    tol: float
    tol_kind: str
    alpha: float
    _inputs: tuple = field(repr=False)

    def __len__(self):
        return int(self.passes.shape[0])

    @property
    def symmetrized(self):
        """float64 (N, *voigt_shape): the fitted symmetric tensors as Voigt arrays (a new array)."""
        return _layout(self._inputs[2]).x_to_voigt(self.symmetrized_components)

    def report(self, i):
        """The full :class:`CheckReport` of tensor ``i`` (recomputed by :func:`check_tensor`)."""
        values, sigma, what, group = self._inputs
        n = len(self)
        if isinstance(i, bool) or not isinstance(i, numbers.Integral) or not -n <= i < n:
            raise IndexError(f"tensor index {i!r} is outside 0..{n - 1}")
        return check_tensor(values[i], what, group, sigma=None if sigma is None else sigma[i], units=self.units,
                            tol=self.tol, tol_kind=self.tol_kind, alpha=self.alpha, layout="components")

    def text(self):
        """Text table, one row per tensor (rendered by tensym.output through :mod:`tensym.display`)."""
        from tensym.display import show

        return show(self, "text")

    __str__ = text

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
                  layout="auto", symmetry_tol=1e-8):
    """Check a stack of N tensors against one group in one vectorised pass.

    Parameters
    ----------
    values : array_like
        (N, *voigt_shape) Voigt arrays, (N, 3, ..., 3) full arrays, or (with
        ``layout='components'``) (N, n) distinct components.
    what : str, Property or TensorSpec
        The property.
    group : group object or str
        The point group (setting of the data).
    sigma : array_like, optional
        Standard uncertainties, the shape of ``values``.
    units, tol, tol_kind, alpha, layout, symmetry_tol
        As in :func:`check_tensor`.

    Returns
    -------
    BatchCheck

    Raises
    ------
    DataError
        For a wrong shape, non-finite values, contradicted index symmetry (the
        message names the tensor of the stack), non-positive uncertainties,
        unknown units, or a tolerance out of range.
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

    tol, tol_kind, alpha = _options(tol, tol_kind, alpha)
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
    nt = arr.shape[0]
    k, n = nf.k, lay.n
    parts = _residual_projectors(prop, g)
    labels_ir = tuple(pr.label for pr in parts)
    big = np.concatenate([pr.basis for pr in parts], axis=1) if parts else np.zeros((n, 0))
    bounds = np.cumsum([0] + [pr.basis.shape[1] for pr in parts])[:-1]
    gmat_t = _constraint_matrix(nf, nf.tied).T
    dof = n - k
    out_x = np.empty((nt, n))
    out_a = np.empty((nt, k))
    out_sa = None if s_arr is None else np.empty((nt, k))
    out_sx = None if s_arr is None else np.empty((nt, n))
    out_xf = np.empty((nt, n))
    out_frac = np.empty(nt)
    out_dev = np.empty(nt)
    out_chi = None if s_arr is None else np.empty(nt)
    out_disc = np.empty((nt, len(nf.tied)))
    out_ir = np.empty((nt, len(parts)))
    live = {"voigt": lay.voigt_comp, "full": lay.flat_comp, "components": np.zeros(n)}[kind] >= 0
    aa = np.einsum("ik,il->ikl", nf.A, nf.A).reshape(n, k * k)
    chunk = 1024  # small blocks: cache-resident, and below the size where BLAS starts threads
    for lo in range(0, nt, chunk):
        hi = min(nt, lo + chunk)
        blk = arr[lo:hi]
        bad = ~np.isfinite(blk)
        if bad.any():
            _check_finite(arr, "values", arr.shape)
        x = _to_components(blk, lay, kind, "values", float(symmetry_tol))
        out_x[lo:hi] = x
        if s_arr is None:
            a = x @ nf.fit.T
        else:
            sb = s_arr[lo:hi]
            if not np.all(np.isfinite(sb)):
                _check_finite(s_arr, "sigma", s_arr.shape)
            nonpos = (sb.reshape(hi - lo, -1) <= 0) & live
            if nonpos.any():
                pos = np.argwhere(nonpos)[0]
                raise DataError(f"sigma must be strictly positive standard uncertainties; tensor {lo + pos[0]} of "
                                f"the stack has {sb.reshape(hi - lo, -1)[pos[0], pos[1]]:g}")
            sx = _to_components(sb, lay, kind, "sigma", float(symmetry_tol), positive=True)
            out_sx[lo:hi] = sx
            w = 1.0 / sx**2
            if k:
                gram = (w @ aa).reshape(hi - lo, k, k)  # A^T diag(w) A for every tensor at once
                cov_a = np.linalg.inv(gram)
                a = np.matmul(cov_a, ((w * x) @ nf.A)[:, :, None])[:, :, 0]
                out_sa[lo:hi] = np.sqrt(np.maximum(np.diagonal(cov_a, axis1=1, axis2=2), 0.0))
            else:
                a = np.zeros((hi - lo, 0))
        out_a[lo:hi] = a
        xf = a @ nf.A.T
        out_xf[lo:hi] = xf
        res = x - xf
        y = x * lay.scale
        ynorm = np.sqrt(np.einsum("ni,ni->n", y, y))
        safe = np.where(ynorm > 0, ynorm, 1.0)
        rs = res * lay.scale
        out_frac[lo:hi] = np.where(ynorm > 0, np.sqrt(np.einsum("ni,ni->n", rs, rs)) / safe, 0.0)
        out_dev[lo:hi] = np.max(np.abs(res), axis=1) if n else 0.0
        if s_arr is not None:
            out_chi[lo:hi] = np.einsum("ni,ni->n", res, res * w)
        out_disc[lo:hi] = x @ gmat_t
        if parts:
            proj = y @ big
            out_ir[lo:hi] = np.sqrt(np.add.reduceat(proj * proj, bounds, axis=1)) / safe[:, None]
    x, a, sig_a, xf, frac, maxdev, chi2, disc, fr_ir = (out_x, out_a, out_sa, out_xf, out_frac, out_dev, out_chi,
                                                        out_disc, out_ir)
    sx = out_sx
    norm = "frobenius" if s_arr is None else "inverse covariance"
    p = None
    if chi2 is not None and dof > 0:
        p = chi2_sf(chi2, dof)
    ok = frac <= tol if tol_kind == "relative" else maxdev <= tol
    if p is not None:
        ok = ok & (np.asarray(p) >= alpha)
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
        forbidden_labels=tuple(lay.labels[c] for c in nf.zero),
        forbidden=_own(x[:, nf.zero]),
        relation_labels=tuple(lay.labels[c] for c in nf.tied),
        discrepancies=_own(disc),
        chi2=_own(chi2),
        dof=dof,
        p_value=_own(p),
        irrep_labels=labels_ir,
        irrep_fractions=_own(fr_ir),
        passes=_ro_bool(ok),
        tol=tol,
        tol_kind=tol_kind,
        alpha=alpha,
        _inputs=(_own(x), _own(sx), prop, g),
    )
