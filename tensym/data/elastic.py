"""Stiffness <-> compliance: :func:`invert_elastic` and :func:`invert_data`.

With the handbook Voigt conventions (c_IJ without factors, s_IJ with the
factors 2 and 4 for shear pairs; Nye 1985, ch. VIII) the 6x6 compliance matrix
is the matrix inverse of the 6x6 stiffness matrix, [s] = [c]^-1, and back.
Full tensors are converted through these matrices.

Uncertainties (:func:`invert_data`) are propagated to first order:
d[s] = -[s] d[c] [s], over the 21 distinct components with their covariance.

Examples
--------
>>> import numpy as np
>>> from tensym.data.elastic import invert_elastic
>>> c = np.diag([100.0, 100.0, 100.0, 40.0, 40.0, 40.0]); c[:3, :3] += 20.0 * (1 - np.eye(3))
>>> s = invert_elastic(c, "elastic_stiffness")
>>> np.allclose(invert_elastic(s, "elastic_compliance"), c), round(float(s[3, 3]), 6)
(True, 0.025)
"""

import numpy as np

from tensym.data.dataset import TensorData, _readonly
from tensym.data.model import layout as _layout
from tensym.data.units import inverse_units
from tensym.errors import DataError
from tensym.tensors.form import as_property

__all__ = ["invert_elastic", "invert_data", "INVERSE_PROPERTY"]

#: The property each invertible property is inverted into.
INVERSE_PROPERTY = {"elastic_stiffness": "elastic_compliance", "elastic_compliance": "elastic_stiffness"}
_COND_LIMIT = 1e12


def _inverse_prop(what):
    prop = as_property(what)
    if prop.name not in INVERSE_PROPERTY:
        raise DataError(f"{prop.name} has no inverse here; invert_elastic works on "
                        f"{' and '.join(INVERSE_PROPERTY)}")
    return prop, as_property(INVERSE_PROPERTY[prop.name])


def _inv(m):
    cond = np.linalg.cond(m)
    if not np.all(np.isfinite(cond)) or np.any(cond > _COND_LIMIT):
        raise DataError(f"the 6x6 matrix is singular or nearly so (condition number {np.max(cond):.3g} > "
                        f"{_COND_LIMIT:g}); it has no inverse")
    return np.linalg.inv(m)


def invert_elastic(values, what="elastic_stiffness"):
    """Compliance from stiffness or stiffness from compliance (float64; stacks and layouts kept).

    Parameters
    ----------
    values : array_like
        Voigt matrices (..., 6, 6) or full tensors (..., 3, 3, 3, 3).
    what : {'elastic_stiffness', 'elastic_compliance'}
        What ``values`` are; the result is the other one, in the same layout.

    Returns
    -------
    numpy.ndarray

    Raises
    ------
    DataError
        For another property, a wrong shape, values that are not real numbers,
        NaN (unknown components) or inf, a non-symmetric
        Voigt matrix (to 1e-8 relative) or a (nearly) singular matrix.

    Examples
    --------
    >>> import numpy as np
    >>> invert_elastic(np.eye(6), "elastic_compliance").diagonal().tolist()
    [1.0, 1.0, 1.0, 1.0, 1.0, 1.0]
    """
    from tensym.data.dataset import _as_float_array

    prop, inv = _inverse_prop(what)
    a = _as_float_array(values, "values")
    full = a.ndim >= 4 and a.shape[-4:] == (3, 3, 3, 3)
    if not full and (a.ndim < 2 or a.shape[-2:] != (6, 6)):
        raise DataError(f"{prop.name} must be Voigt matrices (..., 6, 6) or full tensors (..., 3, 3, 3, 3), "
                        f"got shape {a.shape}")
    if np.any(np.isinf(a)):
        raise DataError(f"{prop.name} contains inf")
    if np.any(np.isnan(a)):
        raise DataError(f"{prop.name} contains NaN (a component that is not given): the inverse needs every "
                        "component; give them all (write 0 for a component known to be zero)")
    lay, lay_inv = _layout(prop), _layout(inv)
    if full:
        m = lay.x_to_voigt(lay.full_to_x(a))
    else:
        m = a
        asym = np.max(np.abs(m - np.swapaxes(m, -1, -2))) if m.size else 0.0
        if asym > 1e-8 * max(float(np.max(np.abs(m))), 1e-300):
            raise DataError(f"the {prop.name} matrix is not symmetric (largest |M - M^T| = {asym:.3g}); "
                            "it is not symmetrised silently: correct it first")
    out = _inv(m)
    out = 0.5 * (out + np.swapaxes(out, -1, -2))
    if full:
        return lay_inv.x_to_full(lay_inv.voigt_to_x(out))
    return out


def invert_data(data):
    """The inverse property of a TensorData, covariance propagated to first order and units inverted.

    Parameters
    ----------
    data : TensorData
        Elastic stiffness or compliance.

    Returns
    -------
    TensorData
        Units are the inverse label ('GPa' -> '1/GPa') where tensym knows it, else None.

    Raises
    ------
    DataError
        For another property, unknown (NaN) components, or a (nearly) singular matrix.

    Examples
    --------
    >>> import numpy as np
    >>> from tensym.data.dataset import tensor_data
    >>> c = tensor_data(np.eye(6) * 50.0, "elastic_stiffness", sigma=np.full((6, 6), 0.5), units="GPa")
    >>> s = invert_data(c)
    >>> s.units, round(float(s["s11"]), 6), round(float(s.sigma[0]), 6)
    ('1/GPa', 0.02, 0.0002)
    """
    if not isinstance(data, TensorData):
        raise DataError(f"invert_data needs a TensorData, got {type(data).__name__}")
    prop, inv = _inverse_prop(data.property)
    data._need_complete("the inverse")
    lay, lay_inv = _layout(prop), _layout(inv)
    m = data.voigt
    out = _inv(m)
    out = 0.5 * (out + out.T)
    x_inv = lay_inv.voigt_to_x(out)
    cov = None
    if data.covariance is not None:
        # Jacobian d x_inv / d x: dS = -S dC S with dC the symmetric unit change of each component
        jac = np.zeros((lay_inv.n, lay.n))
        for c in range(lay.n):
            e = np.zeros(lay.n)
            e[c] = 1.0
            dm = lay.x_to_voigt(e)
            jac[:, c] = lay_inv.voigt_to_x(-out @ dm @ out)
        cov = jac @ np.asarray(data.covariance) @ jac.T
        cov = 0.5 * (cov + cov.T)
        # keep it positive definite against round-off
        w, v = np.linalg.eigh(cov)
        floor = 1e-14 * max(float(w.max()), 1e-300)
        cov = (v * np.maximum(w, floor)) @ v.T
    return TensorData(inv, _readonly(x_inv), None if cov is None else _readonly(cov), inverse_units(data.units),
                      f"inverse of {data.source}")
