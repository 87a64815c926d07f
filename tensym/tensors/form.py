"""Reduced tensor forms: ``tensor_form(what, group)`` and the TensorForm result.

Examples
--------
>>> import tensym
>>> f = tensym.tensor_form("elastic_stiffness", "6/mmm")
>>> f.n_independent, f.symbols
(5, (c11, c12, c13, c33, c44))
>>> [r for r in f.relations if str(r.lhs) == "c66"]
[Eq(c66, c11/2 - c12/2)]
"""

from dataclasses import dataclass, field
from fractions import Fraction
from functools import lru_cache
import numbers

import numpy as np
import sympy as sp

from tensym.errors import DataError, InvalidOptionError, InvalidSpecError
from tensym.tensors.catalog import VOIGT_PAIRS, Property, get_property, property_names
from tensym.tensors.solver import Solution, solve_invariants
from tensym.tensors.spec import TensorSpec

__all__ = ["TensorForm", "RotatedForm", "tensor_form", "as_property", "group_key"]


def as_property(what, *, symbol=None):
    """A Property for a catalog name, a Property or a TensorSpec (generic labels 'T123').

    Raises
    ------
    UnknownPropertyError
        For a name not in the catalog.
    InvalidSpecError
        For any other type.
    """
    if isinstance(what, Property):
        prop = what
    elif isinstance(what, TensorSpec):
        groups = tuple((i,) for i in range(what.rank))
        prop = Property("tensor", what, "T", groups, (False,) * what.rank, f"rank-{what.rank} tensor")
    elif isinstance(what, str):
        prop = get_property(what)
    else:
        raise InvalidSpecError(
            f"expected a property name, a Property or a TensorSpec, got {type(what).__name__}"
        )
    if symbol is not None:
        if not isinstance(symbol, str) or not symbol.isidentifier():
            raise InvalidSpecError(f"symbol must be a name such as 'c' or 'chi', got {symbol!r}")
        prop = Property(prop.name, prop.spec, symbol, prop.voigt_groups, prop.halved, prop.title, prop.convention,
                        prop.label_order)
    return prop


def _resolve_group(group):
    try:
        from tensym.groups import as_group
    except ImportError:  # pragma: no cover - the catalog is part of the package
        as_group = None
    if as_group is not None:
        return as_group(group)
    if isinstance(group, str):
        raise InvalidSpecError("group symbols need tensym.groups.as_group")
    return group


def group_key(group):
    """Cache key of a group: its generators' keys and Lie generators."""
    return (
        tuple(g.key for g in group.generators),
        tuple(tuple(str(x) for x in L) for L in group.lie_generators),
    )


def _voigt_label(idx, groups):
    out = []
    for g in groups:
        if len(g) == 1:
            out.append(idx[g[0]] + 1)
        else:
            out.append(VOIGT_PAIRS[(idx[g[0]], idx[g[1]])])
    return tuple(out)


def _factor(idx, groups, halved):
    f = Fraction(1)
    for g, h in zip(groups, halved):
        if h and len(g) == 2 and idx[g[0]] != idx[g[1]]:
            f /= 2
    return f


@lru_cache(maxsize=128)
def _labelling(spec, groups, halved):
    """Per orbit: canonical Voigt label (smallest over members) and factor of the representative."""
    orb = spec.orbits
    labels, factors = [], []
    shape = (3,) * spec.rank
    for o, mem in enumerate(orb.members):
        best = None
        for flat in mem:
            idx = tuple(int(x) for x in np.unravel_index(int(flat), shape)) if spec.rank else ()
            lab = _voigt_label(idx, groups)
            if best is None or lab < best[0]:
                best = (lab, idx)
        labels.append(best[0])
        factors.append(_factor(orb.reps[o], groups, halved))
    return tuple(labels), tuple(factors)


@lru_cache(maxsize=512)
def _solve_cached(spec, groups, halved, order, prefer, group_ref):
    labels, factors = _labelling(spec, groups, halved)
    natural = labels if order is None else tuple(tuple(lab[i] for i in order) for lab in labels)
    rank = {lab: i for i, lab in enumerate(prefer)}
    priority = tuple((0, (rank[lab],)) if lab in rank else (1, key) for lab, key in zip(labels, natural))
    preferred = [o for o, lab in enumerate(labels) if lab in rank]
    purity = [len(set(lab)) for lab in labels]
    sol = solve_invariants(spec, group_ref.group, factors=factors, priority=priority, purity=purity,
                           preferred=preferred)
    # present the constants in natural label order (c11, c12, ...; r13, r22, r33, r51)
    order_ = sorted(range(len(sol.free)), key=lambda i: labels[sol.free[i]])
    pos = {old: new for new, old in enumerate(order_)}
    coeffs = tuple(tuple(sorted(((pos[i], c) for i, c in terms), key=lambda t: t[0])) for terms in sol.coeffs)
    return Solution(free=tuple(sol.free[i] for i in order_), coeffs=coeffs)


def _parse_prefer(prop, prefer):
    """Label tuples for the ``prefer`` option (names like 'C222' or '222')."""
    if prefer is None:
        return ()
    if isinstance(prefer, str):
        prefer = (prefer,)
    labels, _ = _labelling(prop.spec, prop.voigt_groups, prop.halved)
    known = {_label_text(lab): lab for lab in labels}
    out = []
    for name in prefer:
        text = str(name).strip()
        if text.startswith(prop.symbol):
            text = text[len(prop.symbol):]
        if text not in known:
            sample = ", ".join(prop.symbol + _label_text(lab) for lab in labels[:4])
            raise InvalidOptionError(
                f"prefer: {name!r} is not a component of {prop.name}; components are named like {sample}, ..."
            )
        out.append(known[text])
    return tuple(out)


class _GroupRef:
    """Holds a group for the solver cache; hashed and compared by the group's key."""

    __slots__ = ("group", "key", "_hash")

    def __init__(self, group, key):
        self.group = group
        self.key = key
        self._hash = hash(key)

    def __hash__(self):
        return self._hash

    def __eq__(self, other):
        return isinstance(other, _GroupRef) and self.key == other.key


def _label_text(lab):
    return "".join(str(x) for x in lab)


def _pretty_text(text, printer):
    """A prettyForm of plain text: left-aligned, long lines wrapped to the printer's width (80)."""
    import textwrap

    from sympy.printing.pretty.stringpict import prettyForm

    cols = printer._settings.get("num_columns") or 80
    lines = []
    for line in text.splitlines():
        lines.extend(textwrap.wrap(line, cols - 1, subsequent_indent="    ") if len(line) >= cols else [line])
    width = max((len(x) for x in lines), default=0)
    return prettyForm("\n".join(x.ljust(width) for x in lines))


class _SympyPrintable:
    """sympy printer hooks: ``sympy.latex(x)`` is ``x.latex()``, ``sympy.pprint(x)`` the text, left-aligned."""

    def _latex(self, printer):
        return self.latex()

    def _sympystr(self, printer):
        return str(self)

    def _pretty(self, printer):
        return _pretty_text(str(self), printer)


@dataclass(frozen=True, eq=False)
class TensorForm(_SympyPrintable):
    """The symmetry-reduced form of a property tensor in a point group.

    Attributes
    ----------
    property : Property
        The property (or a generic Property for a bare TensorSpec).
    group : PointGroup or ContinuousGroup
        The group, in its own setting (axes of the tensor components).
    symbols : tuple of sympy.Symbol
        The independent constants (real symbols), named as handbooks name them
        (c11, c12, d31, epsilon11, ...): the lowest Voigt labels are chosen.
    n_independent : int
        ``len(symbols)``.

    Notes
    -----
    ``tensor``, ``voigt`` and ``relations`` are built on first use and cached;
    every value handed out is an immutable sympy object or a new numpy array.
    """

    property: Property
    group: object
    symbols: tuple
    n_independent: int
    _coeffs: tuple = field(repr=False)
    _labels: tuple = field(repr=False)
    _factors: tuple = field(repr=False)
    _free: tuple = field(repr=False)
    _cache: dict = field(default_factory=dict, repr=False, compare=False)

    # --- symbolic views -------------------------------------------------------
    def _orbit_values(self):
        """Voigt-variable value of each orbit as a sympy expression."""
        if "values" not in self._cache:
            vals = []
            for terms in self._coeffs:
                vals.append(sp.Add(*[c * self.symbols[i] for i, c in terms]) if terms else sp.Integer(0))
            self._cache["values"] = tuple(vals)
        return self._cache["values"]

    @property
    def spec(self):
        """The TensorSpec."""
        return self.property.spec

    @property
    def tensor(self):
        """sympy ImmutableDenseNDimArray of shape (3,)*rank: the full Cartesian tensor."""
        if "tensor" not in self._cache:
            orb = self.spec.orbits
            vals = self._orbit_values()
            comp = [sp.Integer(0)] * (3**self.spec.rank)
            tvals = [vals[o] * sp.Rational(self._factors[o].numerator, self._factors[o].denominator)
                     for o in range(len(vals))]
            for flat in range(3**self.spec.rank):
                o = int(orb.orbit_of[flat])
                if o >= 0 and tvals[o] != 0:
                    comp[flat] = tvals[o] * int(orb.sign_of[flat])
            self._cache["tensor"] = sp.ImmutableDenseNDimArray(comp, (3,) * self.spec.rank)
        return self._cache["tensor"]

    def _voigt_entry(self, vidx):
        """Value of the Voigt entry with Voigt indices ``vidx`` (tuple)."""
        prop = self.property
        idx = [0] * self.spec.rank
        inv = {1: (0, 0), 2: (1, 1), 3: (2, 2), 4: (1, 2), 5: (0, 2), 6: (0, 1)}
        for g, v in zip(prop.voigt_groups, vidx):
            if len(g) == 1:
                idx[g[0]] = v - 1
            else:
                idx[g[0]], idx[g[1]] = inv[v]
        t = self.tensor[tuple(idx)] if self.spec.rank else self.tensor[()]
        f = _factor(tuple(idx), prop.voigt_groups, prop.halved)
        return sp.expand(t / sp.Rational(f.numerator, f.denominator))

    @property
    def voigt(self):
        """The form in Voigt notation with the property's factor convention.

        A sympy ImmutableMatrix for one or two index groups (3x6 for d, 6x6 for c,
        3x3 for epsilon, a 3x1 column for p); an ImmutableDenseNDimArray for more
        groups (6x6x6 for third-order elastic constants).
        """
        if "voigt" not in self._cache:
            groups = self.property.voigt_groups
            dims = [3 if len(g) == 1 else 6 for g in groups]
            if not dims:
                out = sp.ImmutableMatrix([[self.tensor[()]]])
            else:
                from itertools import product

                entries = [self._voigt_entry(tuple(v + 1 for v in vi)) for vi in product(*[range(d) for d in dims])]
                if len(dims) == 1:
                    out = sp.ImmutableMatrix(dims[0], 1, entries)
                elif len(dims) == 2:
                    out = sp.ImmutableMatrix(dims[0], dims[1], entries)
                else:
                    out = sp.ImmutableDenseNDimArray(entries, tuple(dims))
            self._cache["voigt"] = out
        return self._cache["voigt"]

    def label_symbol(self, label):
        """The real sympy Symbol named by property letter + label digits (e.g. 'c66')."""
        return sp.Symbol(self.property.symbol + _label_text(label), real=True)

    def _component_labels(self):
        """(orbit, label) for every distinct Voigt component, in label order.

        Two Voigt labels of one orbit are one component when one is a
        permutation of the other (c12 and c21 of a symmetric matrix, C123 and
        C132); otherwise both are listed (d15 and d31 under Kleinman symmetry).
        """
        if "components" not in self._cache:
            orb = self.spec.orbits
            shape = (3,) * self.spec.rank
            seen = {}
            for o, mem in enumerate(orb.members):
                for flat in mem:
                    idx = tuple(int(x) for x in np.unravel_index(int(flat), shape)) if self.spec.rank else ()
                    lab = _voigt_label(idx, self.property.voigt_groups)
                    key = (o, tuple(sorted(lab)))
                    if key not in seen or lab < seen[key]:
                        seen[key] = lab
            self._cache["components"] = tuple(sorted(((o, lab) for (o, _), lab in seen.items()),
                                                     key=lambda t: t[1]))
        return self._cache["components"]

    @property
    def relations(self):
        """tuple of sympy Eq, one for every component that is tied or vanishes.

        Each left side is the symbol of a Voigt component (e.g. c66), each right
        side its value in the independent constants.  Every distinct Voigt
        component appears, also the ones that share an orbit with an
        independent constant (d31 = d15 for Kleinman-symmetric d in 3m).

        Examples
        --------
        >>> import tensym
        >>> f = tensym.tensor_form("second_harmonic_kleinman", "3m")
        >>> [str(r) for r in f.relations if r.rhs != 0]
        ['Eq(d16, -d22)', 'Eq(d21, -d22)', 'Eq(d24, d15)', 'Eq(d31, d15)', 'Eq(d32, d15)']
        """
        if "relations" not in self._cache:
            vals = self._orbit_values()
            free = {self.symbols[i] for i in range(self.n_independent)}
            rels = []
            for o, lab in self._component_labels():
                sym = self.label_symbol(lab)
                if sym in free:
                    continue
                rels.append(sp.Eq(sym, self._voigt_entry(lab), evaluate=False))
            self._cache["relations"] = tuple(rels)
        return self._cache["relations"]

    @property
    def zero_components(self):
        """Labels (strings, e.g. 'c14') of the components the symmetry forces to vanish."""
        vals = self._orbit_values()
        return tuple(self.property.symbol + _label_text(lab) for o, lab in self._component_labels() if vals[o] == 0)

    def rotated(self, rotation):
        """The form in rotated axes, still in this crystal's own constants.

        Convention: ``rotation`` R holds the new axes as its rows, written in
        the crystal axes (R[i, j] = cos(new axis i, crystal axis j), the
        direction cosines a_ij of IEEE Std 176-1987), so that the components
        in the new axes are T'_{i..} = R_{ia} ... T_{a..} (times det R for an
        axial tensor).  R may hold symbols (a cut angle theta); it must be
        orthogonal.

        Parameters
        ----------
        rotation : 3x3 sympy Matrix, nested list or Operation

        Returns
        -------
        RotatedForm

        Raises
        ------
        InvalidOperationError
            If R is not an exact orthogonal 3x3 matrix.

        Examples
        --------
        >>> import sympy as sp, tensym
        >>> t = sp.Symbol("theta", real=True)
        >>> R = sp.Matrix([[1, 0, 0], [0, sp.cos(t), sp.sin(t)], [0, -sp.sin(t), sp.cos(t)]])
        >>> c = tensym.tensor_form("elastic_stiffness", "32").rotated(R)
        >>> sp.simplify(c.voigt[5, 5] - (c.form.voigt[5, 5] * sp.cos(t)**2 + c.form.voigt[3, 3] * sp.sin(t)**2
        ...             + 2 * c.form.voigt[0, 3] * sp.sin(t) * sp.cos(t)))
        0
        """
        from tensym.tensors.rotate import rotate_tensor, rotation_matrix_of
        from tensym.tensors.voigt import to_voigt

        R = rotation_matrix_of(rotation)
        tensor = rotate_tensor(self.tensor, R, axial=bool(self.spec.axial))
        return RotatedForm(form=self, rotation=R, tensor=tensor, voigt=to_voigt(tensor, self.property))

    # --- numeric views --------------------------------------------------------
    def _numeric_values(self, values):
        if not isinstance(values, dict):
            if len(values) != self.n_independent:
                raise DataError(
                    f"expected {self.n_independent} values for {', '.join(map(str, self.symbols))}, got {len(values)}"
                )
            values = dict(zip(self.symbols, values))
        names = {str(s): s for s in self.symbols}
        out = {}
        for k, v in values.items():
            key = str(k)
            if key not in names:
                raise DataError(f"{key!r} is not an independent constant here; expected: {', '.join(names)}")
            if isinstance(v, (bool, np.bool_, str, bytes)) or (
                    isinstance(v, numbers.Complex) and not isinstance(v, numbers.Real)) or (
                    isinstance(v, sp.Basic) and v.is_real is not True):
                what = ("a boolean" if isinstance(v, (bool, np.bool_)) else "complex" if isinstance(
                    v, numbers.Complex) or isinstance(v, sp.Basic) and v.is_number else type(v).__name__)
                raise DataError(f"value of {key} must be a real number, got {what} {str(v)[:40]!r}"
                                + ("; the imaginary part would be lost: tensor forms are evaluated with real "
                                   "constants" if what == "complex" else ""))
            try:
                v = float(v)
            except (TypeError, ValueError, OverflowError) as exc:
                raise DataError(f"value of {key} must be a real number, got {type(v).__name__}") from exc
            if not np.isfinite(v):
                raise DataError(f"value of {key} is not finite: {v}")
            out[key] = v
        missing = [n for n in names if n not in out]
        if missing:
            raise DataError(f"missing values for {', '.join(missing)}")
        return np.array([out[str(s)] for s in self.symbols], dtype=np.float64)

    def numeric_basis(self):
        """float64 array (n_independent, 3, ..., 3): the tensor for each constant set to 1.

        The rows span the invariant subspace (not orthonormal).
        """
        if "basis" not in self._cache:
            orb = self.spec.orbits
            k = self.n_independent
            B = np.zeros((k, 3**self.spec.rank), dtype=np.float64)
            for o, terms in enumerate(self._coeffs):
                mem = orb.members[o]
                f = float(self._factors[o])
                for i, c in terms:
                    B[i, mem] += float(c) * f * orb.sign_of[mem]
            self._cache["basis"] = B.reshape((k,) + (3,) * self.spec.rank)
        return self._cache["basis"].copy()

    def evaluate(self, values, *, full=False):
        """Numeric tensor for given constants, as a new float64 numpy array.

        Parameters
        ----------
        values : dict or sequence
            ``{symbol or name: value}`` for every independent constant, or the
            values in the order of :attr:`symbols`.
        full : bool
            Return the full Cartesian tensor (3,)*rank instead of the Voigt form.

        Raises
        ------
        DataError
            For a missing, unknown or non-finite value, or one that is not a
            real number (complex: the imaginary part would be lost; booleans,
            strings, symbols).
        """
        if isinstance(values, np.ndarray) and values.ndim == 2:
            return self._evaluate_batch(values, full)
        x = self._numeric_values(values)
        tensor = np.tensordot(x, self.numeric_basis(), axes=1) if self.n_independent else np.zeros((3,) * self.spec.rank)
        if full:
            return tensor
        from tensym.tensors.voigt import to_voigt

        return to_voigt(tensor, self.property)

    def _evaluate_batch(self, values, full):
        """Vectorised evaluate: values (N, n_independent) -> (N, Voigt shape) or (N, 3, ..., 3)."""
        if values.shape[1] != self.n_independent:
            raise DataError(f"a batch of constants has shape (N, {self.n_independent}) for "
                            f"{', '.join(map(str, self.symbols))}, got {values.shape}")
        if np.iscomplexobj(values):
            raise DataError("the constants are complex; give real values (the imaginary part would be lost)")
        x = np.asarray(values, dtype=np.float64)
        if not np.all(np.isfinite(x)):
            bad = np.argwhere(~np.isfinite(x))[0]
            raise DataError(f"value of {self.symbols[bad[1]]} in row {bad[0]} is not finite: {x[tuple(bad)]}")
        from tensym.tensors.voigt import to_voigt, voigt_shape

        if full:
            basis = self.numeric_basis()
            return np.tensordot(x, basis, axes=1) if self.n_independent else np.zeros((len(x),) + basis.shape[1:])
        if "voigt_basis" not in self._cache:
            self._cache["voigt_basis"] = to_voigt(self.numeric_basis(), self.property)
        vb = self._cache["voigt_basis"]
        if not self.n_independent:
            return np.zeros((len(x),) + voigt_shape(self.property))
        return (x @ vb.reshape(len(vb), -1)).reshape((len(x),) + vb.shape[1:])

    # --- equality that survives pickling ----------------------------------------
    def _identity(self):
        names = getattr(self.group, "names", None)
        rot = getattr(names, "rotation", None)
        return (self.property, group_key(self.group), getattr(names, "setting_symbol", ""),
                None if rot is None else tuple(sp.ImmutableMatrix(rot)), self.symbols, self._coeffs, self._labels)

    def __eq__(self, other):
        if not isinstance(other, TensorForm):
            return NotImplemented
        return self._identity() == other._identity()

    def __hash__(self):
        return hash(self._identity())

    def __getstate__(self):
        state = dict(self.__dict__)
        state["_cache"] = {}  # caches are rebuilt on use
        return state

    def __setstate__(self, state):
        self.__dict__.update(state)

    # --- display -------------------------------------------------------------
    def latex(self, *, standalone=False):
        """LaTeX fragment (amsmath): the Voigt matrix (or tensor) and the relations."""
        from tensym.tensors.render import form_latex

        return form_latex(self, standalone=standalone)

    def _repr_latex_(self):
        return "$$" + self.latex() + "$$"

    def __str__(self):
        from tensym.tensors.render import form_text

        return form_text(self)

    def __repr__(self):
        """Reads back as a ``tensor_form(...)`` call when the group is a named setting."""
        names = getattr(self.group, "names", None)
        setting = getattr(names, "setting_symbol", "") or getattr(self.group, "symbol", "")
        what = repr(self.spec) if self.property.name == "tensor" else repr(self.property.name)
        registered = self.property.name == "tensor" or self.property.name in property_names()
        if registered and setting and getattr(names, "rotation", None) is None \
                and not getattr(self.group, "is_magnetic", False):
            extra = f", symbol={self.property.symbol!r}" if self.property.name != "tensor" and \
                self.property.symbol != get_property(self.property.name).symbol else ""
            return f"tensor_form({what}, {setting!r}{extra})"
        gname = getattr(self.group, "symbol", "") or "unnamed group"
        return (f"<TensorForm {self.property.name} in {gname}: {self.n_independent} independent "
                f"({', '.join(map(str, self.symbols))})>")


@dataclass(frozen=True)
class RotatedForm(_SympyPrintable):
    """A reduced form written in rotated axes (``TensorForm.rotated``).

    Attributes
    ----------
    form : TensorForm
        The form in the crystal's own (standard or given) axes.
    rotation : sympy.ImmutableMatrix
        R: rows are the new axes in crystal coordinates; T' = R.T.R^T... on
        every index (times det R for axial tensors).
    tensor : sympy.ImmutableDenseNDimArray
        The full tensor in the new axes, in the crystal's constants.
    voigt : sympy.ImmutableMatrix or ImmutableDenseNDimArray
        The same in Voigt notation with the property's factor convention.

    Examples
    --------
    >>> import sympy as sp, tensym
    >>> r = tensym.tensor_form("dielectric_permittivity", "4mm").rotated(sp.Matrix([[0, 0, 1], [0, 1, 0], [-1, 0, 0]]))
    >>> r.voigt
    Matrix([
    [epsilon33,         0,         0],
    [        0, epsilon11,         0],
    [        0,         0, epsilon11]])
    """

    form: object
    rotation: object
    tensor: object
    voigt: object

    @property
    def symbols(self):
        """The crystal's independent constants (the same as ``form.symbols``)."""
        return self.form.symbols

    def evaluate(self, values, *, full=False, angles=None):
        """Numeric tensor (float64) for given constants (and values of any angle symbols).

        ``values`` as in :meth:`TensorForm.evaluate`; ``angles`` maps the
        rotation's symbols to numbers (radians for trigonometric arguments).
        """
        x = self.form._numeric_values(values)
        subs = {s: float(v) for s, v in zip(self.form.symbols, x)}
        for k, v in (angles or {}).items():
            subs[sp.Symbol(k, real=True) if isinstance(k, str) else k] = float(v)
        target = self.tensor if full else self.voigt
        arr = sp.Array(target).subs(subs) if not isinstance(target, sp.MatrixBase) else target.subs(subs)
        try:
            return np.array(sp.Array(arr).tolist(), dtype=np.float64)
        except TypeError as exc:
            free = sorted(str(s) for s in sp.Array(arr).free_symbols)
            raise DataError(f"no value given for {', '.join(free)}; pass angles={{name: value}}") from exc

    def latex(self, *, standalone=False):
        """LaTeX of the Voigt matrix in the new axes (amsmath)."""
        body = sp.latex(self.voigt) if isinstance(self.voigt, sp.MatrixBase) else sp.latex(sp.Array(self.voigt))
        if not standalone:
            return body
        return ("\\documentclass{article}\n\\usepackage{amsmath}\n\\begin{document}\n\\[\n" + body
                + "\n\\]\n\\end{document}\n")

    def __str__(self):
        head = (f"{self.form.property.name} in rotated axes (rows of R = new axes in crystal axes), "
                f"constants {', '.join(map(str, self.symbols))}")
        lines = [head]
        letter = self.form.property.symbol
        v = self.voigt
        shape = v.shape
        from itertools import product as _product

        for idx in _product(*[range(d) for d in shape]):
            if len(shape) == 2 and shape[0] == shape[1] and idx[1] < idx[0] and v[idx] == v[idx[::-1]]:
                continue  # symmetric matrix: the upper triangle says it
            val = v[idx]
            if val != 0:
                lines.append(f"  {letter}'{''.join(str(i + 1) for i in idx)} = {sp.sstr(val)}")
        return "\n".join(lines)

    def __repr__(self):
        return f"<RotatedForm {self.form.property.name}: {self.form.n_independent} constants, R = {self.rotation.tolist()}>"


def tensor_form(what, group, *, symbol=None, prefer=None):
    """The symmetry-reduced form of a property tensor in a point group.

    Parameters
    ----------
    what : str, Property or TensorSpec
        A catalog name (see ``tensym.property_names()``) or a TensorSpec.
    group : group object or str
        A point group, continuous or magnetic group, or its symbol.
    symbol : str, optional
        Replace the property's letter in the symbol names.
    prefer : sequence of str, optional
        Components to take as independent constants where the symmetry leaves
        a choice, for a handbook that picks differently (e.g. ``["C222"]`` for
        Brugger's hexagonal third-order constants).  By default the lowest
        Voigt labels are independent, and in a family of proportional
        components the one the others are whole multiples of (d22 in 3m).

    Returns
    -------
    TensorForm

    Raises
    ------
    UnknownPropertyError
        For an unknown property name.
    UnknownGroupError
        For an unknown group symbol.
    InvalidOptionError
        For a ``prefer`` entry that names no component of the property.

    Examples
    --------
    >>> import tensym
    >>> tensym.tensor_form("third_order_elastic", "6/mmm", prefer=["C222"]).symbols[:8]
    (C111, C112, C113, C123, C133, C144, C155, C222)
    >>> f = tensym.tensor_form("piezoelectric_d", "32")
    >>> f.symbols
    (d11, d14)
    >>> f.voigt.row(0)
    Matrix([[d11, -d11, 0, d14, 0, 0]])
    """
    prop = as_property(what, symbol=symbol)
    g = _resolve_group(group)
    prefer = _parse_prefer(prop, prefer)
    sol = _solve_cached(prop.spec, prop.voigt_groups, prop.halved, prop.label_order, prefer,
                        _GroupRef(g, group_key(g)))
    labels, factors = _labelling(prop.spec, prop.voigt_groups, prop.halved)
    syms = tuple(sp.Symbol(prop.symbol + _label_text(labels[o]), real=True) for o in sol.free)
    return TensorForm(
        property=prop,
        group=g,
        symbols=syms,
        n_independent=len(syms),
        _coeffs=sol.coeffs,
        _labels=labels,
        _factors=factors,
        _free=sol.free,
    )
