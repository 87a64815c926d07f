"""Numeric models of property tensors: component layout, invariant subspace, group action.

Private kernels of the data layer (plain numpy on trusted input).  Three
coordinate systems are used, all over the *distinct components* of a
property (the orbits of its intrinsic index symmetry, 21 for elasticity):

``x`` (Voigt coordinates)
    The Voigt constant of each distinct component, in the property's factor
    convention (c_IJ, s_IJ with its factors 2 and 4, d_iJ with its factor 2):
    what tables print and what users measure.
``t`` (full Cartesian tensor)
    Component t_{i1..in} = sign * factor_c * x_c for every index tuple of
    component c (factor_c is 1, 1/2 or 1/4 for s and d shear pairs).
``y`` (orthonormal coordinates)
    y_c = sqrt(size_c) * factor_c * x_c, so that the Euclidean norm of y is the
    full-tensor Frobenius norm of t (size_c = number of index tuples of c).

Components are ordered by their Voigt label (c11, c12, ..., c16, c22, ...,
c66), the same label rule as :func:`tensym.tensor_form` (the smallest Voigt
label over the index tuples of a component).

Examples
--------
>>> from tensym.data.model import layout
>>> lay = layout("elastic_stiffness")
>>> lay.n, lay.labels[:7]
(21, ('c11', 'c12', 'c13', 'c14', 'c15', 'c16', 'c22'))
>>> float(lay.weight[lay.labels.index("c44")])  # c2323 appears 4 times in the tensor
4.0
"""

from functools import lru_cache
from itertools import product

import numpy as np

from tensym.tensors.catalog import VOIGT_PAIRS
from tensym.tensors.form import as_property, tensor_form
from tensym.tensors.voigt import VOIGT_TO_PAIR, voigt_shape

__all__ = ["Layout", "layout", "NumericForm", "numeric_form", "rotate_full", "lie_derivative",
           "rotation_action", "group_key_of", "GroupSpace", "group_space", "pair_rotation"]

_LETTERS = "abcdefghijklmnop"
#: Array attributes of a Layout, made read-only once built.
_LAYOUT_ARRAYS = ("size", "factor", "weight", "scale", "rep_flat", "flat_comp", "flat_sign", "flat_factor",
                  "voigt_comp", "voigt_sign", "_vrep", "_dead_flat", "_dead_voigt")


class Layout:
    """Distinct components of a property and the maps between x, t and Voigt arrays.

    Attributes
    ----------
    prop : Property
    rank : int
    n : int
        Number of distinct components.
    labels : tuple of str
        'c11', 'd14', ... (property letter and Voigt digits), in component order.
    label_tuples : tuple of tuple of int
        The 1-based Voigt digits of each label.
    factor, size, weight, scale : numpy.ndarray
        float64 (n,): tensor/Voigt factor, number of index tuples, Frobenius
        weight size * factor**2 and its square root.
    rep_flat : numpy.ndarray
        int64 (n,): flat full index of a representative tuple of each component.
    flat_comp, flat_sign : numpy.ndarray
        int64 (3**rank,): component of each full index tuple (-1: forced to
        vanish by an antisymmetry) and its sign.
    voigt_shape : tuple of int
    voigt_comp, voigt_sign : numpy.ndarray
        int64 over the flattened Voigt array: component of each entry and sign.
    """

    def __init__(self, prop):
        self.prop = prop
        spec = prop.spec
        self.rank = spec.rank
        orb = spec.orbits
        groups, halved = prop.voigt_groups, prop.halved
        nfull = 3**self.rank
        shape = (3,) * self.rank

        def label_of(idx):
            out = []
            for g in groups:
                out.append(idx[g[0]] + 1 if len(g) == 1 else VOIGT_PAIRS[(idx[g[0]], idx[g[1]])])
            return tuple(out)

        def factor_of(idx):
            f = 1.0
            for g, h in zip(groups, halved):
                if h and len(g) == 2 and idx[g[0]] != idx[g[1]]:
                    f /= 2.0
            return f

        entries = []
        for o, mem in enumerate(orb.members):
            idxs = [tuple(int(v) for v in np.unravel_index(int(f), shape)) if self.rank else () for f in mem]
            lab = min(label_of(i) for i in idxs)
            entries.append((lab, o, idxs))
        entries.sort()
        n = len(entries)
        self.n = n
        self.label_tuples = tuple(e[0] for e in entries)
        self.labels = tuple(prop.symbol + "".join(str(d) for d in e[0]) for e in entries)
        old_to_new = {e[1]: c for c, e in enumerate(entries)}
        self.size = np.array([len(e[2]) for e in entries], dtype=np.float64)
        self.factor = np.array([factor_of(e[2][0]) for e in entries], dtype=np.float64)
        self.weight = self.size * self.factor**2
        self.scale = np.sqrt(self.weight)
        self.rep_flat = np.array([int(orb.members[e[1]][0]) for e in entries], dtype=np.int64)
        self.flat_comp = np.full(nfull, -1, dtype=np.int64)
        self.flat_sign = np.zeros(nfull, dtype=np.int64)
        for flat in range(nfull):
            o = int(orb.orbit_of[flat])
            if o >= 0:
                self.flat_comp[flat] = old_to_new[o]
                self.flat_sign[flat] = int(orb.sign_of[flat])
        # signs relative to the representative (the representative has sign +1)
        self.voigt_shape = voigt_shape(prop)
        vcomp, vsign = [], []
        for v in product(*[range(d) for d in self.voigt_shape]):
            idx = [0] * self.rank
            for g, k in zip(groups, v):
                if len(g) == 1:
                    idx[g[0]] = k
                else:
                    idx[g[0]], idx[g[1]] = VOIGT_TO_PAIR[k + 1]
            flat = int(np.ravel_multi_index(tuple(idx), shape)) if self.rank else 0
            vcomp.append(self.flat_comp[flat])
            vsign.append(self.flat_sign[flat])
        self.voigt_comp = np.array(vcomp, dtype=np.int64)
        self.voigt_sign = np.array(vsign, dtype=np.int64)
        self.flat_factor = np.where(self.flat_comp >= 0, self.factor[np.maximum(self.flat_comp, 0)], 0.0)
        self._vrep = self._voigt_rep_table()
        self._dead_flat = self.flat_comp < 0
        self._dead_voigt = self.voigt_comp < 0
        # a layout is cached process-wide and reachable from every TensorData: its tables are read-only
        for name in _LAYOUT_ARRAYS:
            getattr(self, name).setflags(write=False)

    # --- conversions (stacked over leading axes) ---------------------------------
    def x_to_full(self, x):
        """Full tensors (..., 3, ..., 3) from Voigt coordinates (..., n); entries an antisymmetry kills are 0."""
        x = np.asarray(x, dtype=np.float64)
        c = np.maximum(self.flat_comp, 0)
        t = x[..., c] * (self.flat_sign * self.flat_factor)
        if self._dead_flat.any():
            t[..., self._dead_flat] = 0.0  # also when the component read there is NaN (unknown)
        return t.reshape(x.shape[:-1] + (3,) * self.rank)

    def x_to_voigt(self, x):
        """Voigt arrays (..., *voigt_shape) from Voigt coordinates (..., n); dead entries are 0."""
        x = np.asarray(x, dtype=np.float64)
        c = np.maximum(self.voigt_comp, 0)
        v = x[..., c] * self.voigt_sign
        if self._dead_voigt.any():
            v[..., self._dead_voigt] = 0.0
        return v.reshape(x.shape[:-1] + self.voigt_shape)

    def full_to_x(self, t):
        """Voigt coordinates from full tensors, read at the representatives (no check)."""
        t = np.asarray(t, dtype=np.float64)
        flat = t.reshape(t.shape[: t.ndim - self.rank] + (-1,))
        return flat[..., self.rep_flat] / self.factor

    def voigt_to_x(self, v):
        """Voigt coordinates from Voigt arrays, read at the canonical labels (no check)."""
        v = np.asarray(v, dtype=np.float64)
        k = len(self.voigt_shape)
        flat = v.reshape(v.shape[: v.ndim - k] + (-1,))
        return flat[..., self._voigt_rep]

    @property
    def _voigt_rep(self):
        return self._vrep

    def _voigt_rep_table(self):
        rep = np.zeros(self.n, dtype=np.int64)
        dims = self.voigt_shape
        for c, lab in enumerate(self.label_tuples):
            v = tuple(d - 1 for d in lab)
            rep[c] = int(np.ravel_multi_index(v, dims)) if dims else 0
        return rep

    def voigt_index(self, label):
        """0-based Voigt index tuple of a component label ('c44' -> (3, 3))."""
        c = self.labels.index(label)
        return tuple(d - 1 for d in self.label_tuples[c])


@lru_cache(maxsize=64)
def _layout_cached(prop):
    return Layout(prop)


def layout(what):
    """The :class:`Layout` of a property name, Property or TensorSpec (cached)."""
    return _layout_cached(as_property(what))


# --- rotation kernels --------------------------------------------------------------
def rotate_full(t, rotation, rank):
    """Apply ``rotation`` (..., 3, 3) to every index of full tensors t (..., 3, ..., 3).

    t'_{i..} = R_ia R_jb ... t_{ab..}; leading axes broadcast.
    """
    out = np.asarray(t, dtype=np.float64)
    r = np.asarray(rotation, dtype=np.float64)
    letters = _LETTERS[:rank]
    for p in range(rank):
        src = letters
        dst = letters[:p] + "z" + letters[p + 1:]
        out = np.einsum(f"...z{letters[p]},...{src}->...{dst}", r, out, optimize=False)
    return out


def lie_derivative(t, generator, rank):
    """The infinitesimal rotation (L . t)_{i..} = sum over positions p of L_{i_p a} t_{..a..}."""
    t = np.asarray(t, dtype=np.float64)
    g = np.asarray(generator, dtype=np.float64)
    letters = _LETTERS[:rank]
    total = np.zeros_like(t)
    for p in range(rank):
        dst = letters[:p] + "z" + letters[p + 1:]
        total = total + np.einsum(f"z{letters[p]},...{letters}->...{dst}", g, t)
    return total


def rotation_action(lay, rotation):
    """Matrix (n, n) of an orthogonal 3x3 matrix on Voigt coordinates x (polar action)."""
    eye = np.eye(lay.n)
    t = lay.x_to_full(eye)  # (n, 3, ..., 3): the tensor of each unit x
    rt = rotate_full(t, rotation, lay.rank)
    return lay.full_to_x(rt).T.copy()


def group_key_of(group):
    """A hashable key of a group (its generators and Lie generators)."""
    from tensym.tensors.form import group_key

    return group_key(group)


class NumericForm:
    """The invariant subspace of a property under a group, in float64.

    Attributes
    ----------
    layout : Layout
    form : TensorForm
    A : numpy.ndarray
        float64 (n, k): x = A a for the independent constants a (in the order
        of ``form.symbols``).
    names : tuple of str
        Names of the constants ('c11', ...).
    free : numpy.ndarray
        int64 (k,): component index of each constant.
    zero : numpy.ndarray
        int64: components forced to vanish.
    tied : numpy.ndarray
        int64: components fixed by the constants but not equal to one of them.
    Q : numpy.ndarray
        float64 (n, k): orthonormal basis of the subspace in y coordinates.
    fit : numpy.ndarray
        float64 (k, n): a = fit @ x is the Frobenius-norm least-squares fit.
    """

    def __init__(self, prop, group):
        lay = layout(prop)
        form = tensor_form(prop, group)
        self.layout = lay
        self.form = form
        self.group = form.group
        k = form.n_independent
        basis = form.numeric_basis().reshape(k, 3**lay.rank)
        self.A = (basis[:, lay.rep_flat] / lay.factor).T.copy() if k else np.zeros((lay.n, 0))
        self.names = tuple(str(s) for s in form.symbols)
        self.free = np.array([lay.labels.index(nm) for nm in self.names], dtype=np.int64)
        if k and not np.allclose(self.A[self.free], np.eye(k), atol=1e-12):  # pragma: no cover
            raise AssertionError("independent constants are not components of the form")
        rows_zero = np.all(np.abs(self.A) < 1e-13, axis=1)
        self.zero = np.nonzero(rows_zero)[0]
        is_free = np.zeros(lay.n, dtype=bool)
        is_free[self.free] = True
        self.tied = np.nonzero(~rows_zero & ~is_free)[0]
        self.k = k
        B = lay.scale[:, None] * self.A
        if k:
            q, _ = np.linalg.qr(B)
            self.Q = q
            gram = self.A.T @ (lay.weight[:, None] * self.A)
            self.fit = np.linalg.solve(gram, self.A.T * lay.weight)
        else:
            self.Q = np.zeros((lay.n, 0))
            self.fit = np.zeros((0, lay.n))
        rel = {}
        for r in form.relations:
            rel[str(r.lhs)] = r
        self.relations = rel
        for name in ("A", "free", "zero", "tied", "Q", "fit"):
            getattr(self, name).setflags(write=False)  # cached per (property, group)


@lru_cache(maxsize=256)
def _numeric_form_cached(prop, gkey, gref):
    return NumericForm(prop, gref[0])


class _Ref(tuple):
    def __hash__(self):
        return hash(group_key_of(self[0]))

    def __eq__(self, other):
        return isinstance(other, _Ref) and group_key_of(self[0]) == group_key_of(other[0])


def numeric_form(what, group):
    """The (cached) :class:`NumericForm` of a property under a group object."""
    prop = as_property(what)
    return _numeric_form_cached(prop, group_key_of(group), _Ref((group,)))


# --- rotation in the space of index groups (Voigt pairs as 6-vectors) ---------------------------
_R2 = np.sqrt(2.0)
#: Orthonormal basis of symmetric 3x3 matrices in Voigt pair order 11, 22, 33, 23, 13, 12 (Mandel).
_MANDEL = np.zeros((6, 3, 3))
for _v, (_i, _j) in VOIGT_TO_PAIR.items():
    if _i == _j:
        _MANDEL[_v - 1, _i, _i] = 1.0
    else:
        _MANDEL[_v - 1, _i, _j] = _MANDEL[_v - 1, _j, _i] = 1.0 / _R2


#: Mandel projection (6, 9): K = M (R kron R) M^T acts on symmetric pairs.
_M6 = _MANDEL.reshape(6, 9)
_MANDEL.setflags(write=False)


def pair_rotation(rotation):
    """float64 (..., 6, 6): a rotation acting on symmetric pairs in the orthonormal (Mandel) basis.

    K_IJ = <E_I, R E_J R^T>, i.e. K = M (R kron R) M^T with the rows of M the orthonormal
    symmetric basis matrices E_I in Voigt order (11, 22, 33, 23, 13, 12).
    """
    r = np.asarray(rotation, dtype=np.float64)
    lead = r.shape[:-2]
    rr = (r[..., :, None, :, None] * r[..., None, :, None, :]).reshape(lead + (9, 9))
    return np.matmul(np.matmul(_M6, rr), _M6.T)


class GroupSpace:
    """The tensor written over its index groups: z has shape (3 or 6, ...) per Voigt group.

    A symmetric pair is a 6-vector in the orthonormal Mandel basis, a single index a
    3-vector; ||z|| is the full-tensor Frobenius norm.  Rotations act with
    :func:`pair_rotation` on pairs and with R on singles, which is much cheaper than
    acting on every index of the full tensor.  Used for the orientation search.
    """

    def __init__(self, lay):
        self.lay = lay
        prop = lay.prop
        groups = prop.voigt_groups
        ok = True
        for g in groups:
            if len(g) == 2:
                # the pair must be symmetric: (.., i, .., j, ..) and (.., j, .., i, ..) are the same component
                for flat in range(3**lay.rank):
                    idx = list(np.unravel_index(flat, (3,) * lay.rank))
                    idx[g[0]], idx[g[1]] = idx[g[1]], idx[g[0]]
                    f2 = int(np.ravel_multi_index(tuple(idx), (3,) * lay.rank))
                    if lay.flat_comp[flat] != lay.flat_comp[f2] or lay.flat_sign[flat] != lay.flat_sign[f2]:
                        ok = False
                        break
        if not ok or not groups:
            groups = tuple((i,) for i in range(lay.rank))
        self.groups = groups
        self.pair = tuple(len(g) == 2 for g in groups)
        self.dims = tuple(6 if p else 3 for p in self.pair)
        # z entry -> (component, multiplier on x)
        comp, mult = [], []
        for zi in product(*[range(d) for d in self.dims]):
            idx = [0] * lay.rank
            w = 1.0
            for g, p, k in zip(groups, self.pair, zi):
                if p:
                    a, b = VOIGT_TO_PAIR[k + 1]
                    idx[g[0]], idx[g[1]] = a, b
                    if a != b:
                        w *= _R2
                else:
                    idx[g[0]] = k
            flat = int(np.ravel_multi_index(tuple(idx), (3,) * lay.rank)) if lay.rank else 0
            c = int(lay.flat_comp[flat])
            comp.append(max(c, 0))
            mult.append(0.0 if c < 0 else lay.flat_sign[flat] * lay.flat_factor[flat] * w)
        self.z_comp = np.array(comp, dtype=np.int64)
        self.z_mult = np.array(mult)
        # y from z: y_c = z[rep_c] * sqrt(size_c) / w_rep, with rep_c any z entry of component c
        rep = np.zeros(lay.n, dtype=np.int64)
        ratio = np.zeros(lay.n)
        seen = np.zeros(lay.n, dtype=bool)
        for e, (c, m) in enumerate(zip(comp, mult)):
            if m != 0 and not seen[c]:
                seen[c] = True
                rep[c] = e
                ratio[c] = lay.scale[c] / m
        self.y_rep, self.y_ratio = rep, ratio
        for a in (self.z_comp, self.z_mult, self.y_rep, self.y_ratio):
            a.setflags(write=False)  # cached per property

    def z_from_x(self, x):
        x = np.asarray(x, dtype=np.float64)
        return (x[..., self.z_comp] * self.z_mult).reshape(x.shape[:-1] + self.dims)

    def y_from_z(self, z):
        k = len(self.dims)
        flat = z.reshape(z.shape[: z.ndim - k] + (-1,))
        return flat[..., self.y_rep] * self.y_ratio

    def rotate(self, z, rotation, pair=None):
        """Rotate z (... broadcast with rotation (..., 3, 3)) on every index group.

        ``pair`` may pass ``pair_rotation(rotation)`` when it is already known.
        """
        r = np.asarray(rotation, dtype=np.float64)
        if any(self.pair) and pair is None:
            pair = pair_rotation(r)
        mats = [pair if p else r for p in self.pair]
        z = np.asarray(z, dtype=np.float64)
        k = len(self.dims)
        if k == 1:
            return np.matmul(mats[0], z[..., None])[..., 0]
        if k == 2:
            return np.matmul(np.matmul(mats[0], z), np.swapaxes(mats[1], -1, -2))
        out = z
        for p, m in enumerate(mats):
            ax = out.ndim - k + p
            x = np.moveaxis(out, ax, -1)
            shp = x.shape
            y = np.matmul(x.reshape(shp[:-k] + (-1, shp[-1])), np.swapaxes(m, -1, -2))
            y = y.reshape(y.shape[:-2] + shp[-k:])
            out = np.moveaxis(y, -1, y.ndim - k + p)
        return out


@lru_cache(maxsize=64)
def _group_space_cached(prop):
    return GroupSpace(_layout_cached(prop))


def group_space(what):
    """The (cached) :class:`GroupSpace` of a property."""
    return _group_space_cached(as_property(what))
