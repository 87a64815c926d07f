"""Measured or computed tensor data: validated values, uncertainties and units.

:func:`tensor_data` reads a numeric tensor given as a Voigt array (with the
property's factor convention, see ``tensym.tensors.catalog``), as a full
Cartesian array, or as the list of its distinct components, together with
optional standard uncertainties (same layout) or a covariance matrix, and
returns an immutable :class:`TensorData`.

Validation (each failure raises :class:`tensym.errors.DataError` naming the
argument, what arrived and what is accepted):

* the shape must be the Voigt shape, the full shape or (with
  ``layout='components'``) the number of distinct components;
* the values must be real numbers: complex numbers (the imaginary part would
  be lost; tensym's data properties are real tensors), booleans, strings,
  symbolic expressions and numbers beyond the float64 range are refused, with
  the entry named (one numeric edge, ``_as_float_array``, used by every entry
  point of the data layer);
* inf is refused with its positions; **NaN marks a component that is not
  given** (unknown, never taken as zero: write 0 for a component known to be
  zero).  A component is given when any of its entries is (c12 or c21); one
  that no entry gives is unknown, and at least one component must be given;
* entries that the property's own index symmetry makes equal (c_12 and c_21,
  d_123 and d_132, ...) must agree within ``symmetry_tol`` (relative to the
  largest entry); they are *not* averaged when they disagree: the error names
  the disagreeing entries (also when some of them are NaN: the given ones must
  agree).  Components an antisymmetry forces to vanish must vanish;
* standard uncertainties must be finite and strictly positive for every given
  component (those of unknown components are ignored), follow the same index
  symmetry, and have squares inside the float64 range;
* a covariance must be (n, n) over the distinct components in the order of
  :attr:`TensorData.labels`, symmetric and positive definite over the given
  components (rows and columns of unknown components are ignored);
* units must be a label accepted for the property (:mod:`tensym.data.units`).

Examples
--------
>>> import numpy as np
>>> from tensym.data.dataset import tensor_data
>>> c = np.diag([10.0, 10.0, 10.0, 3.0, 3.0, 3.0]); c[0, 1] = c[1, 0] = 4.0
>>> d = tensor_data(c, "elastic_stiffness", units="GPa")
>>> d.labels[:3], float(d["c12"]), d.units
(('c11', 'c12', 'c13'), 4.0, 'GPa')
>>> c[1, 0] = 4.5
>>> tensor_data(c, "elastic_stiffness")
Traceback (most recent call last):
...
tensym.errors.DataError: values contradict the index symmetry of elastic_stiffness: c12 = 4 at Voigt entry (1, 2) but 4.5 at (2, 1); the entries are not averaged: correct them, or pass a larger symmetry_tol (now 1e-08, relative to the largest entry)
"""

from dataclasses import dataclass, field
import math
import numbers

import numpy as np

from tensym.data.model import layout as _layout
from tensym.data.units import check_units
from tensym.errors import DataError, InvalidOptionError
from tensym.tensors.catalog import Property
from tensym.tensors.form import as_property

__all__ = ["TensorData", "tensor_data", "component_labels", "LAYOUTS"]

#: Accepted values of the ``layout`` option.
LAYOUTS = ("auto", "voigt", "full", "components")


def component_labels(what):
    """Labels of the distinct components of a property, in the order tensym uses.

    The order is that of the Voigt labels (c11, c12, ..., c16, c22, ..., c66);
    covariance matrices and ``layout='components'`` arrays follow it.

    Examples
    --------
    >>> component_labels("piezoelectric_d")[:4]
    ('d11', 'd12', 'd13', 'd14')
    >>> len(component_labels("elastic_stiffness"))
    21
    """
    return _layout(what).labels


def _readonly(a):
    a = np.array(a, dtype=np.float64, copy=True)
    a.setflags(write=False)
    return a


@dataclass(frozen=True, eq=False)
class TensorData:
    """A numeric property tensor with optional uncertainties and a unit label.

    Build one with :func:`tensor_data` or read one with ``tensym.read_tensor``.

    Attributes
    ----------
    property : Property
        The property the numbers belong to.
    components : numpy.ndarray
        float64 (n,), read-only: the value of each distinct component in the
        Voigt convention of the property, in the order of :attr:`labels`; NaN
        for a component that is not given (unknown, never taken as zero).
    covariance : numpy.ndarray or None
        float64 (n, n), read-only: covariance of :attr:`components` (diagonal
        when standard uncertainties were given; NaN in the rows and columns of
        unknown components), or None.
    units : str or None
        Unit label, echoed in reports (never converted).
    source : str
        Where the numbers came from ('array', a file name, 'rotated ...').

    Examples
    --------
    >>> import numpy as np
    >>> d = tensor_data(np.diag([2.0, 2.0, 3.0]), "dielectric_permittivity", sigma=np.full((3, 3), 0.1))
    >>> d.labels, d["epsilon33"], float(d.sigma[0])
    (('epsilon11', 'epsilon12', 'epsilon13', 'epsilon22', 'epsilon23', 'epsilon33'), 3.0, 0.1)
    """

    property: Property
    components: np.ndarray
    covariance: np.ndarray = None
    units: str = None
    source: str = "array"
    _cache: dict = field(default_factory=dict, repr=False, compare=False)

    def __post_init__(self):
        # direct construction goes through the same numeric edge as tensor_data
        if not isinstance(self.property, Property):
            raise DataError(f"TensorData needs a Property (tensym.tensors.catalog), got "
                            f"{type(self.property).__name__}; build data with tensym.tensor_data")
        n = _layout(self.property).n
        x = _as_float_array(self.components, "components")
        if x.shape != (n,):
            raise DataError(f"components of {self.property.name} must have shape ({n},), got {x.shape}")
        _check_finite(x, "components", x.shape, nan_ok=True)
        if np.isnan(x).all():
            raise DataError(f"components of {self.property.name} are all NaN (unknown): nothing is given")
        if self.components is not x or self.components.flags.writeable:
            object.__setattr__(self, "components", _readonly(x))
        if self.covariance is not None:
            c = _as_float_array(self.covariance, "covariance")
            if c.shape != (n, n):
                raise DataError(f"covariance must be ({n}, {n}), got {c.shape}")
            known = ~np.isnan(x)
            _check_finite(c[np.ix_(known, known)], "covariance", (int(known.sum()),) * 2)
            object.__setattr__(self, "covariance", _readonly(c))
        if self.units is not None and not isinstance(self.units, str):
            raise DataError(f"units must be a string or None, got {type(self.units).__name__}")
        if not isinstance(self.source, str):
            raise DataError(f"source must be a string, got {type(self.source).__name__}")

    # --- views -----------------------------------------------------------------
    @property
    def layout(self):
        """The component layout (private kernel object)."""
        return _layout(self.property)

    @property
    def labels(self):
        """Labels of the distinct components ('c11', 'c12', ...), tuple of str."""
        return self.layout.labels

    @property
    def n(self):
        """Number of distinct components."""
        return self.layout.n

    @property
    def known(self):
        """bool (n,), read-only: which distinct components are given (False: unknown, NaN in :attr:`components`)."""
        hit = self._cache.get("known")
        if hit is None:
            hit = ~np.isnan(self.components)
            hit.setflags(write=False)
            self._cache["known"] = hit
        return hit

    @property
    def n_given(self):
        """Number of distinct components given (the others are unknown)."""
        return int(self.known.sum())

    @property
    def is_complete(self):
        """True when every distinct component is given."""
        return bool(self.known.all())

    def _need_complete(self, what):
        if not self.is_complete:
            missing = [lab for lab, k in zip(self.labels, self.known) if not k]
            raise DataError(f"{what} needs every component, but the data give {self.n_given} of the {self.n} "
                            f"distinct components of {self.property.name} (unknown: {', '.join(missing[:6])}"
                            f"{', ...' if len(missing) > 6 else ''}); give the others, or write 0 for a component "
                            "known to be zero")

    @property
    def voigt(self):
        """Voigt array (float64, new array): 6x6 for c and s, 3x6 for d, 3x3 for epsilon, ... (NaN: unknown)."""
        return self.layout.x_to_voigt(self.components)

    @property
    def tensor(self):
        """Full Cartesian tensor (float64, shape (3,)*rank, new array; NaN: unknown)."""
        return self.layout.x_to_full(self.components)

    @property
    def sigma(self):
        """Standard uncertainties of :attr:`components` (float64 (n,), new array) or None."""
        if self.covariance is None:
            return None
        return np.sqrt(np.diag(self.covariance))

    @property
    def sigma_voigt(self):
        """Standard uncertainties as a Voigt array (float64, new array) or None."""
        s = self.sigma
        return None if s is None else np.abs(self.layout.x_to_voigt(s))

    @property
    def has_uncertainties(self):
        """True when a covariance (or standard uncertainties) was given."""
        return self.covariance is not None

    def __getitem__(self, label):
        """The value of one component by label ('c44') or 1-based Voigt digits ('44')."""
        lab = str(label)
        labels = self.labels
        if lab not in labels:
            lab = self.property.symbol + lab
        if lab not in labels:
            raise KeyError(f"{label!r} is not a component of {self.property.name}; components: "
                           f"{', '.join(labels[:8])}{', ...' if len(labels) > 8 else ''}")
        return float(self.components[labels.index(lab)])

    def rotated(self, rotation):
        """The data in a rotated frame: t'_{ij..} = R_ia R_jb ... t_{ab..}, covariance propagated.

        Parameters
        ----------
        rotation : array_like
            Orthogonal 3x3 matrix (float).  Axial properties take the extra factor det(R).

        Returns
        -------
        TensorData

        Raises
        ------
        DataError
            If ``rotation`` is not an orthogonal 3x3 matrix (to 1e-6), some
            components are unknown (a rotation mixes them), or the rotated
            components leave the float64 range.
        """
        from tensym.data.rotation import as_rotation
        from tensym.data.model import rotation_action

        self._need_complete("a rotation (it mixes the components)")
        r = as_rotation(rotation, proper=False)
        m = rotation_action(self.layout, r)
        if self.property.spec.axial and np.linalg.det(r) < 0:
            m = -m
        e = _exponent(self.components) or 0  # a scaled copy: no overflow at any magnitude
        with np.errstate(over="ignore"):
            x = np.ldexp(m @ np.ldexp(self.components, -e), e)
            cov = None
            if self.covariance is not None:
                cs = m @ np.ldexp(self.covariance, -2 * e) @ m.T
                cov = np.ldexp(0.5 * (cs + cs.T), 2 * e)
        if not np.all(np.isfinite(x)) or (cov is not None and not np.all(np.isfinite(cov))):
            raise DataError(f"the rotated {self.property.name} has components beyond the float64 range (about "
                            "1.8e308): the data are too near that limit to be rotated; express them in other units")
        return TensorData(self.property, _readonly(x), None if cov is None else _readonly(cov), self.units,
                          f"rotated {self.source}")

    def record(self):
        """A JSON-ready dict in the tensym data format (see ``tensym.data.io``)."""
        from tensym.data.io import data_record

        return data_record(self)

    def to_json(self):
        """The data as a JSON document in the tensym data format (str)."""
        import json

        return json.dumps(self.record(), indent=2)

    def __repr__(self):
        u = f" [{self.units}]" if self.units else ""
        unc = ", with uncertainties" if self.covariance is not None else ""
        given = f"{self.n} components" if self.is_complete else f"{self.n_given} of {self.n} components given"
        return f"<TensorData {self.property.name}{u}: {given}{unc}, from {self.source}>"


def _first(arr, mask):
    i = int(np.flatnonzero(mask.reshape(-1))[0])
    return arr.reshape(-1)[i], _entry_text(np.unravel_index(i, arr.shape)) if arr.ndim else "()"


_COMPLEX_HINT = ("the data properties of tensym are real tensors; a complex quantity (a lossy "
                 "permittivity, a complex susceptibility) is not supported: check its real and imaginary "
                 "parts as two real tensors (values.real, values.imag)")


def _object_to_float(raw, name):
    """float64 copy of an object array whose entries must each be a real number."""
    import sympy as sp

    out = np.empty(raw.shape, dtype=np.float64)
    flat_in, flat_out = raw.reshape(-1), out.reshape(-1)
    for i, v in enumerate(flat_in):
        where = _entry_text(np.unravel_index(i, raw.shape)) if raw.ndim else "()"
        if isinstance(v, (bool, np.bool_)):
            raise DataError(f"{name} entry {where} is {v!r}, a boolean; give numbers")
        if isinstance(v, (str, bytes)):
            raise DataError(f"{name} entry {where} is the string {_cut(repr(v))}; give numbers "
                            "(convert text with float() first)")
        if isinstance(v, sp.Basic):
            if not (getattr(v, "is_number", False)):
                raise DataError(f"{name} entry {where} is the symbolic expression {_cut(str(v))}; give numbers "
                                "(substitute values for its symbols first)")
            if v.is_real is False or (v.is_real is None and sp.im(sp.N(v)) != 0):
                raise DataError(f"{name} entry {where} is the complex number {_cut(str(v))}: {_COMPLEX_HINT}")
        elif isinstance(v, numbers.Complex) and not isinstance(v, numbers.Real):
            raise DataError(f"{name} entry {where} is the complex number {_cut(repr(v))}: {_COMPLEX_HINT}")
        elif not isinstance(v, numbers.Real):
            raise DataError(f"{name} entry {where} is a {type(v).__name__} ({_cut(repr(v))}), not a number")
        try:
            flat_out[i] = float(v)
        except OverflowError as exc:
            raise DataError(f"{name} entry {where} is {_cut(str(v))}, beyond the float64 range "
                            "(about 1.8e308); express the data in other units") from exc
        except (TypeError, ValueError) as exc:
            raise DataError(f"{name} entry {where} ({_cut(repr(v))}) is not a real number") from exc
        if math.isinf(flat_out[i]) and not (isinstance(v, float) and math.isinf(v)):
            raise DataError(f"{name} entry {where} is {_cut(str(v))}, beyond the float64 range (about 1.8e308); "
                            "express the data in other units")
    return out


def _cut(text, n=40):
    text = str(text)
    return text if len(text) <= n else text[: n - 3] + "..."


def _as_float_array(values, name):
    """The one numeric edge of the data layer: a float64 copy of ``values``, or a DataError.

    Accepted: real numbers (Python, numpy, sympy numbers) in a numpy array or
    nested lists of equal lengths.  Refused, with the entry named: complex
    numbers (the imaginary part would be lost), booleans, strings, symbolic
    expressions, other objects, and numbers beyond the float64 range.  NaN
    and inf pass here; the callers decide (NaN marks an unknown component).
    """
    if isinstance(values, (str, bytes)):
        raise DataError(f"{name} must be numbers (a numpy array or nested lists), got a string")
    try:
        raw = np.asarray(values)
    except (TypeError, ValueError) as exc:
        raise DataError(f"{name} must be a rectangular array of numbers (numpy array or nested lists "
                        f"of equal lengths): {_cut(exc, 120)}") from exc
    kind = raw.dtype.kind
    if kind == "c":
        nonreal = np.imag(raw) != 0
        if nonreal.any():
            v, where = _first(raw, nonreal)
            raise DataError(f"{name} are complex (entry {where} is {v}): {_COMPLEX_HINT}")
        raise DataError(f"{name} have a complex dtype ({raw.dtype}); give a real array (values.real if "
                        "the imaginary parts are all zero)")
    if kind == "b":
        raise DataError(f"{name} are booleans (dtype bool), not numbers")
    if kind in "USa":
        v, where = _first(raw, np.ones(raw.shape, dtype=bool)) if raw.size else ("", "()")
        raise DataError(f"{name} contain strings (entry {where} is {_cut(repr(str(v)))}); give numbers "
                        "(convert text with float() first)")
    if kind == "O":
        return _object_to_float(raw, name)
    if kind not in "fiu":
        raise DataError(f"{name} must be real numbers, got an array of dtype {raw.dtype}")
    with np.errstate(over="ignore"):
        arr = np.array(raw, dtype=np.float64, copy=True)
    if kind == "f" and raw.dtype.itemsize > 8:
        lost = np.isinf(arr) & np.isfinite(raw)
        if lost.any():
            v, where = _first(raw, lost)
            raise DataError(f"{name} entry {where} is {v}, beyond the float64 range (about 1.8e308); "
                            "express the data in other units")
    return arr


def _exponent(x):
    """The binary exponent e of max |x| over the given (non-NaN) values (None when they are all zero).

    The numeric work of the data layer is done on the copy ldexp(x, -e),
    whose largest magnitude lies in [0.5, 1), and results are scaled back by
    2**e: a power of two is exact, so results do not depend on the magnitude
    of the units (1e-300 to 1e300) and nothing overflows or underflows inside.
    """
    a = np.abs(np.asarray(x, dtype=np.float64)).reshape(-1)
    m = float(np.fmax.reduce(a)) if a.size else 0.0
    if not m > 0:
        return None
    return int(np.frexp(m)[1])


def _entry_text(pos):
    return "(" + ", ".join(str(int(i) + 1) for i in pos) + ")"


def _check_finite(arr, name, shape, *, nan_ok=False):
    """Refuse inf (and NaN unless ``nan_ok``: NaN marks an unknown value) with the positions."""
    bad = np.isinf(arr) if nan_ok else ~np.isfinite(arr)
    if bad.any():
        where = [_entry_text(np.unravel_index(int(i), shape)) for i in np.flatnonzero(bad)[:4]]
        kind = "NaN" if np.isnan(arr[bad]).any() else "inf"
        hint = ("; NaN marks an unknown value, but an infinite one is not a measurement" if nan_ok
                else "; every value must be finite")
        raise DataError(f"{name} contains {kind} (not a finite number) at entr{'y' if len(where) == 1 else 'ies'} "
                        f"{', '.join(where)}{hint}")


def _detect_layout(arr, lay, layout, name):
    full = (3,) * lay.rank
    if layout not in LAYOUTS:
        raise InvalidOptionError(f"layout={layout!r} is not one of {', '.join(LAYOUTS)}")
    shapes = {"voigt": lay.voigt_shape, "full": full, "components": (lay.n,)}
    if layout == "auto":
        if arr.shape == lay.voigt_shape:
            return "voigt"
        if arr.shape == full:
            return "full"
    elif arr.shape == shapes[layout]:
        return layout
    acc = f"Voigt {lay.voigt_shape} or full {full}" if layout == "auto" else f"{layout} {shapes[layout]}"
    raise DataError(f"{name} for {lay.prop.name} must have shape {acc}, got {arr.shape}"
                    + ("" if layout != "auto" else f" (or pass layout='components' for the {lay.n} "
                       "distinct components in the order of tensym.component_labels)"))


_TABLES = {}


def _tables(lay, kind):
    """Index tables of a layout for reading components (cached per property and layout kind)."""
    key = (lay.prop, kind)
    hit = _TABLES.get(key)
    if hit is not None:
        return hit
    if kind == "voigt":
        comp, sign, factor, rep = lay.voigt_comp, lay.voigt_sign, None, lay._voigt_rep
        shape, where = lay.voigt_shape, "Voigt entry"
    else:
        comp, sign, factor, rep = lay.flat_comp, lay.flat_sign, lay.flat_factor, lay.rep_flat
        shape, where = (3,) * lay.rank, "tensor index"
    live = comp >= 0
    mult = np.where(live, np.where(sign == 0, 1, sign), 0.0).astype(np.float64)
    if factor is not None:
        mult = mult / np.where(factor == 0, 1.0, factor)
    is_rep = np.zeros(len(comp), dtype=bool)
    is_rep[rep] = True
    others = np.flatnonzero(live & ~is_rep)
    dead = np.flatnonzero(~live)
    counts = np.bincount(comp[live], minlength=lay.n).astype(np.float64)
    summ = np.zeros((len(others), lay.n))
    summ[np.arange(len(others)), comp[others]] = 1.0
    hit = dict(comp=comp, rep=rep, shape=shape, where=where, mult=mult, others=others, dead=dead,
               counts=counts, summ=summ, rep_mult=mult[rep], other_mult=mult[others], other_comp=comp[others])
    for v in hit.values():
        if isinstance(v, np.ndarray):
            v.setflags(write=False)  # a process-wide cache
    _TABLES[key] = hit
    return hit


def _to_components(arr, lay, kind, name, tol, positive=False):
    """Distinct components from arrays in the given layout, checking the index symmetry.

    ``arr`` has the layout's shape, possibly after leading (stack) axes; the
    tolerance is relative to the largest absolute entry of each array.
    Entries that agree within it are averaged (so that no entry is preferred).
    """
    if kind == "components":
        return arr.copy()
    if np.isnan(arr).any():
        return _to_components_partial(arr, lay, kind, name, tol, positive)
    tb = _tables(lay, kind)
    shape, where = tb["shape"], tb["where"]
    lead = arr.shape[: arr.ndim - len(shape)]
    flat = arr.reshape(lead + (-1,))
    x = flat[..., tb["rep"]] * tb["rep_mult"]
    if positive:
        x = np.abs(x)
    if not (tb["others"].size or tb["dead"].size):
        return x
    thr = tol * np.max(np.abs(flat), axis=-1, keepdims=True)
    if tb["dead"].size and not positive:
        zero_bad = np.abs(flat[..., tb["dead"]]) > thr
        if zero_bad.any():
            pos = np.argwhere(zero_bad)[0]
            i = int(tb["dead"][pos[-1]])
            row = flat[tuple(pos[:-1])]
            raise DataError(f"{name} of {lay.prop.name}{_stack_text(pos[:-1])}: {where} "
                            f"{_entry_text(np.unravel_index(i, shape))} is {row[i]:g} but the index symmetry "
                            "of the property makes it vanish")
    if not tb["others"].size:
        return x
    o = flat[..., tb["others"]] * tb["other_mult"]
    if positive:
        o = np.abs(o)
    bad = np.abs(o - x[..., tb["other_comp"]]) > thr
    if bad.any():
        pos = np.argwhere(bad)[0]
        i = int(tb["others"][pos[-1]])
        c = int(tb["comp"][i])
        j = int(tb["rep"][c])
        row = flat[tuple(pos[:-1])]
        raise DataError(
            f"{name} contradict the index symmetry of {lay.prop.name}{_stack_text(pos[:-1])}: {lay.labels[c]} = "
            f"{row[j]:g} at {where} {_entry_text(np.unravel_index(j, shape))} but {row[i]:g} at "
            f"{_entry_text(np.unravel_index(i, shape))}; the entries are not averaged: correct them, "
            f"or pass a larger symmetry_tol (now {tol:g}, relative to the largest entry)")
    if tol == 0:
        return x
    return (x + o @ tb["summ"]) / tb["counts"]


def _members(tb, n):
    """int64 (n, m): the entries of each component, the representative first (-1 pads)."""
    hit = tb.get("members")
    if hit is None:
        lists = [[int(tb["rep"][c])] for c in range(n)]
        for i in tb["others"]:
            lists[int(tb["comp"][i])].append(int(i))
        hit = np.full((n, max(len(m) for m in lists)), -1, dtype=np.int64)
        for c, m in enumerate(lists):
            hit[c, :len(m)] = m
        hit.setflags(write=False)
        tb["members"] = hit
    return hit


def _to_components_partial(arr, lay, kind, name, tol, positive):
    """As :func:`_to_components` for arrays with NaN entries (unknown values).

    A component is given when any of its entries is given (c12 or c21); the
    given entries of one component must agree within the tolerance (they are
    not averaged when they disagree: an error names them); a component none of
    whose entries is given is NaN.
    """
    tb = _tables(lay, kind)
    shape, where = tb["shape"], tb["where"]
    lead = arr.shape[: arr.ndim - len(shape)]
    flat = arr.reshape(lead + (-1,))
    mem = _members(tb, lay.n)
    pad = mem < 0
    safe = np.where(pad, 0, mem)
    vals = np.where(pad, np.nan, flat[..., safe] * tb["mult"][safe])  # (..., n, m)
    if positive:
        vals = np.abs(vals)
    known = ~np.isnan(vals)
    big = np.fmax.reduce(np.abs(flat), axis=-1)
    thr = tol * np.where(np.isnan(big), 0.0, big)
    if tb["dead"].size and not positive:
        dv = flat[..., tb["dead"]]
        zero_bad = np.abs(dv) > thr[..., None]
        if zero_bad.any():
            pos = np.argwhere(zero_bad)[0]
            i = int(tb["dead"][pos[-1]])
            row = flat[tuple(pos[:-1])]
            raise DataError(f"{name} of {lay.prop.name}{_stack_text(pos[:-1])}: {where} "
                            f"{_entry_text(np.unravel_index(i, shape))} is {row[i]:g} but the index symmetry "
                            "of the property makes it vanish")
    first = np.argmax(known, axis=-1)
    ref = np.take_along_axis(vals, first[..., None], axis=-1)
    with np.errstate(invalid="ignore"):
        bad = known & (np.abs(vals - ref) > thr[..., None, None])
    if bad.any():
        pos = np.argwhere(bad)[0]
        stack, c, jm = tuple(pos[:-2]), int(pos[-2]), int(pos[-1])
        i, j = int(mem[c, jm]), int(mem[c, int(first[stack + (c,)])])
        row = flat[stack]
        raise DataError(
            f"{name} contradict the index symmetry of {lay.prop.name}{_stack_text(pos[:-2])}: {lay.labels[c]} = "
            f"{row[j]:g} at {where} {_entry_text(np.unravel_index(j, shape))} but {row[i]:g} at "
            f"{_entry_text(np.unravel_index(i, shape))}; the entries are not averaged: correct them, "
            f"or pass a larger symmetry_tol (now {tol:g}, relative to the largest entry)")
    count = known.sum(axis=-1)
    total = np.where(known, vals, 0.0).sum(axis=-1)
    with np.errstate(invalid="ignore", divide="ignore"):
        return np.where(count > 0, total / np.maximum(count, 1), np.nan)


def _stack_text(pos):
    return "" if len(pos) == 0 else f" (tensor {', '.join(str(int(p)) for p in pos)} of the stack)"


def _check_variance_range(sx, name):
    """Standard uncertainties whose squares stay inside float64 (variances are stored)."""
    with np.errstate(over="ignore", under="ignore"):
        sq = sx**2
    if sx.size and (np.any(np.isinf(sq)) or np.any((sq < np.finfo(np.float64).tiny) & (sx > 0))):
        lo, hi = float(np.min(sx)), float(np.max(sx))
        raise DataError(f"{name}: uncertainties between {lo:.3g} and {hi:.3g} have squares (variances) outside "
                        "the float64 range (about 1e-308 to 1e308); express the data in units nearer their size "
                        "(GPa instead of Pa, pC/N instead of C/N)")


def tensor_data(values, what=None, *, sigma=None, covariance=None, units=None, layout="auto",
                symmetry_tol=1e-8, source="array"):
    """Validated numeric tensor data (see the module notes for every check).

    Parameters
    ----------
    values : array_like or TensorData
        Voigt array (6x6 stiffness, 3x6 d, ...), full Cartesian array
        (3x3x3x3, ...) or, with ``layout='components'``, the distinct
        components in the order of :func:`component_labels`.  A TensorData is
        returned unchanged (after checking ``what``).
    what : str, Property or TensorSpec
        The property (catalog name such as 'elastic_stiffness').
    sigma : array_like, optional
        Standard uncertainties in the same layout and shape as ``values``.
    covariance : array_like, optional
        (n, n) covariance of the distinct components (order of :func:`component_labels`).
    units : str, optional
        Unit label, e.g. 'GPa' (see :func:`tensym.data.units.accepted_units`).
    layout : {'auto', 'voigt', 'full', 'components'}
        How to read ``values``; 'auto' tells Voigt and full arrays by shape.
    symmetry_tol : float
        Relative tolerance (fraction of the largest absolute entry) within which
        entries that the index symmetry makes equal must agree.
    source : str
        A note on the origin, kept in reports.

    Returns
    -------
    TensorData

    Raises
    ------
    DataError
        For wrong shapes, non-finite values, contradicted index symmetry,
        non-positive uncertainties, a bad covariance, unknown units, or a
        missing property.
    InvalidOptionError
        For a ``layout`` outside the accepted set.
    UnknownPropertyError
        For an unknown property name.

    Examples
    --------
    >>> import numpy as np
    >>> d = tensor_data(np.zeros((3, 6)), "piezoelectric_d", sigma=np.full((3, 6), 0.1), units="pC/N")
    >>> d.sigma[:3]
    array([0.1, 0.1, 0.1])
    >>> tensor_data(np.zeros((3, 6)), "piezoelectric_d", sigma=np.zeros((3, 6)))
    Traceback (most recent call last):
    ...
    tensym.errors.DataError: sigma must be strictly positive standard uncertainties; entry (1, 1) is 0
    """
    if isinstance(values, TensorData):
        if what is not None and as_property(what) != values.property:
            raise DataError(f"the data are {values.property.name}, not {as_property(what).name}")
        if sigma is not None or covariance is not None or units is not None:
            raise DataError("sigma, covariance and units come with the TensorData; pass a plain array to set them")
        return values
    if what is None:
        raise DataError("say which property the numbers are (what='elastic_stiffness', 'piezoelectric_d', ...)")
    prop = as_property(what)
    lay = _layout(prop)
    if isinstance(symmetry_tol, bool) or not isinstance(symmetry_tol, numbers.Real) or not (
            0 <= symmetry_tol < 1):
        raise DataError(f"symmetry_tol must be a number in [0, 1), got {symmetry_tol!r}")
    arr = _as_float_array(values, "values")
    kind = _detect_layout(arr, lay, layout, "values")
    _check_finite(arr, "values", arr.shape, nan_ok=True)
    x = _to_components(arr, lay, kind, "values", float(symmetry_tol))
    known = ~np.isnan(x)
    if not known.any():
        raise DataError(f"values give no component of {prop.name}: every entry is NaN, the marker of an unknown "
                        "component; give the measured components (write 0 for a component known to be zero)")
    cov = None
    if sigma is not None and covariance is not None:
        raise DataError("give either sigma (standard uncertainties) or covariance, not both")
    if sigma is not None:
        s = _as_float_array(sigma, "sigma")
        if s.shape != arr.shape:
            raise DataError(f"sigma must have the shape of values {arr.shape}, got {s.shape}")
        _check_finite(s, "sigma", s.shape, nan_ok=True)
        nonpos = s <= 0
        if kind != "components":
            comp = lay.voigt_comp if kind == "voigt" else lay.flat_comp
            nonpos &= comp.reshape(s.shape) >= 0
        if nonpos.any():
            i = int(np.flatnonzero(nonpos)[0])
            raise DataError(f"sigma must be strictly positive standard uncertainties; entry "
                            f"{_entry_text(np.unravel_index(i, s.shape))} is {s.reshape(-1)[i]:g}")
        sx = _to_components(s, lay, kind, "sigma", float(symmetry_tol), positive=True)
        lacking = known & np.isnan(sx)
        if lacking.any():
            labs = [lay.labels[c] for c in np.flatnonzero(lacking)]
            raise DataError(f"sigma is NaN (unknown) for {', '.join(labs[:6])}{', ...' if len(labs) > 6 else ''}, "
                            "whose value is given; give an uncertainty for every given component, or no sigma")
        sx = np.where(known, sx, np.nan)  # uncertainties of unknown components are ignored
        _check_variance_range(sx[known], "sigma")
        cov = np.diag(sx**2)
        cov[~known, :] = np.nan
        cov[:, ~known] = np.nan
    if covariance is not None:
        c = _as_float_array(covariance, "covariance")
        if c.shape != (lay.n, lay.n):
            raise DataError(f"covariance must be ({lay.n}, {lay.n}) over the distinct components "
                            f"{', '.join(lay.labels[:4])}, ... (tensym.component_labels), got {c.shape}")
        c = c.copy()
        c[~known, :] = 0.0  # rows and columns of unknown components are ignored
        c[:, ~known] = 0.0
        _check_finite(c, "covariance", c.shape)
        if not np.allclose(c, c.T, rtol=1e-10, atol=1e-14 * max(1e-300, float(np.max(np.abs(c))))):
            raise DataError("covariance must be symmetric")
        kk = np.ix_(known, known)
        try:
            np.linalg.cholesky(c[kk])
        except np.linalg.LinAlgError as exc:
            raise DataError("covariance must be positive definite (every variance > 0, no exact "
                            "linear dependence)" + (" over the given components" if not known.all() else "")) from exc
        cov = 0.5 * (c + c.T)
        cov[~known, :] = np.nan
        cov[:, ~known] = np.nan
    u = check_units(units, prop)
    if not isinstance(source, str):
        raise DataError(f"source must be a string, got {type(source).__name__}")
    return TensorData(prop, _readonly(x), None if cov is None else _readonly(cov), u, source)
