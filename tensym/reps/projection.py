"""Projection operators and symmetry-adapted bases.

Conventions
-----------
* Functions transform actively, ``(g f)(r) = f(g^-1 r)``; a tensor as
  ``(g T)_{i..} = R_{ia} ... T_{a..}`` (times det R when ``axial=True``).
* The character projector of an irrep Gamma of dimension d is
  ``P = (d/|G|) sum_g conj(chi(g)) g``; it is idempotent and the projectors of
  all irreps add up to the identity.
* Partner sets are those of the projectors with matrix elements,
  ``P_ij = (d/|G|) sum_g conj(D_ij(g)) g``: for u in the image of P_11 the
  functions f_i = P_i1 u transform as ``g f_j = sum_i D_ij(g) f_i`` with the
  irrep matrices of :meth:`CharacterTable.matrices`.  The image of P_11 is
  given an orthonormal basis (Gram-Schmidt, in order, of the pivot columns of
  P_11 in the space's inner product, :meth:`Space.gram`), so all partner
  functions together are orthonormal.
* Method: the sums over the group are never formed.  The intertwiners T
  (D(g) T = T D_Gamma(g) for the generators g) are solved exactly as a null
  space over the number field of the generators' entries; their first columns
  span the image of P_11, P_11 is the Gram-orthogonal projector onto that
  span, and P_i1 u is the i-th column of the intertwiner through u.  The
  results are identical to the whole-group sums (kept as the oracle
  ``tensym.testing.brute_force_partners``); D6h on degree-8 polynomials takes
  about a second instead of a minute (benchmarks/hangs.py).

Examples
--------
>>> import sympy as sp
>>> x, y, z = sp.symbols("x y z")
>>> project(x**2, "m-3m", "Eg")
2*x**2/3 - y**2/3 - z**2/3
"""

from dataclasses import dataclass, field
import math

import numpy as np
import sympy as sp

from tensym.errors import InvalidArgumentError
from tensym.reps.inputs import as_group_arg, as_space_arg
from tensym.reps.linalg import to_dm, unify
from tensym.reps.spaces import X, Y, Z, harmonics, monomials

__all__ = ["project", "symmetry_adapted", "SymmetryAdaptedBasis", "PartnerSet", "readable"]


def _transform_expr(expr, op):
    m = op.matrix
    sub = {v: sum(m[j, i] * w for j, w in enumerate((X, Y, Z))) for i, v in enumerate((X, Y, Z))}
    return expr.xreplace(sub)


def _transform_array(arr, op, axial):
    R = np.array(op.matrix.tolist(), dtype=object)
    T = np.array(arr.tolist(), dtype=object)
    for k in range(T.ndim):
        T = np.moveaxis(np.tensordot(R, T, axes=([1], [k])), 0, k)
    if axial and op.det == -1:
        T = -T
    return T


def project(obj, group, irrep, *, axial=False):
    """Apply the character projection operator of an irrep to a function or a tensor.

    Parameters
    ----------
    obj : sympy expression in x, y, z, or sympy Array / Matrix (a Cartesian tensor)
        Other symbols are treated as constants.
    group : PointGroup, ContinuousGroup or str
        Finite groups; for polynomials also the continuous groups: SO(3) / O(3)
        (the D^l part, by the harmonic decomposition f = sum r^(2k) h_(n-2k))
        and the axial groups (weights of the rotation about the axis).
    irrep : str
        An irrep label of the group: a real form (``'E'``) projects onto the sum
        of a complex pair, a member (``'1E'``) onto that member alone.
    axial : bool, keyword-only
        For tensors: transform with det(R) R (a pseudo-tensor).

    Returns
    -------
    sympy expression or sympy ImmutableDenseNDimArray
        The projection, expanded.

    Raises
    ------
    UnknownIrrepError
        For a label the group does not have (the message lists the nearest).
    InvalidArgumentError
        For an object that is neither an expression nor an array, or a tensor
        with a continuous group.

    Examples
    --------
    >>> import sympy as sp
    >>> x, y, z = sp.symbols("x y z")
    >>> project(x*y, "m-3m", "T2g")
    x*y
    >>> project(x**4, "O(3)", "D0g")
    x**4/5 + 2*x**2*y**2/5 + 2*x**2*z**2/5 + y**4/5 + 2*y**2*z**2/5 + z**4/5
    """
    G = as_group_arg(group)
    if not isinstance(axial, bool):
        raise InvalidArgumentError(f"axial must be True or False, got {axial!r}")
    is_array = isinstance(obj, (sp.NDimArray, sp.MatrixBase, list, tuple))
    if not is_array:
        try:
            expr = sp.sympify(obj)
        except (sp.SympifyError, TypeError) as exc:
            raise InvalidArgumentError(
                f"obj must be a sympy expression in x, y, z or a sympy Array, got {type(obj).__name__}") from exc
        if not isinstance(expr, sp.Expr):
            raise InvalidArgumentError(f"obj must be a sympy expression in x, y, z, got {expr!r}")
    if getattr(G, "is_continuous", False):
        if is_array:
            raise InvalidArgumentError("projection of tensors onto continuous-group irreps is not supported; "
                                       "decompose the TensorSpec instead")
        return _project_rotation_group(expr, G, irrep)
    from tensym.reps.table import finite_table

    t = finite_table(G)
    irr = t.irrep(irrep)
    chars = {}
    for c, ch in zip(t.classes, irr.characters):
        for m in c.indices:
            chars[m] = sp.conjugate(ch)
    ops = G.operations
    # a real form chi + conj(chi) projects with the members' dimension: P = P_chi + P_conj(chi)
    scale = sp.Rational(irr.dim if irr.label in t.labels else irr.dim // 2, G.order)
    if is_array:
        arr = sp.Array(obj)
        total = None
        for i, op in enumerate(ops):
            if chars[i] == 0:
                continue
            term = _transform_array(arr, op, axial) * chars[i]
            total = term if total is None else total + term
        flat = [sp.expand(v * scale) for v in np.asarray(total).ravel()]
        return sp.ImmutableDenseNDimArray(flat, arr.shape)
    if expr.is_polynomial(X, Y, Z):
        return _project_polynomial(expr, G, irr, [chars[i] for i in range(len(ops))], scale)
    total = sp.Integer(0)
    for i, op in enumerate(ops):
        if chars[i] != 0:
            total += chars[i] * _transform_expr(expr, op)
    return sp.expand(scale * total)


_PROJECTORS = {}


def _project_polynomial(expr, G, irr, conj_chars, scale):
    """Fast path: the projector as a cached exact matrix on each degree's monomials.

    The character projector P = (d/|G|) sum_g conj(chi(g)) D(g) is self-adjoint
    for the Fischer product (D(g) preserves it and the characters satisfy
    chi(g^-1) = conj(chi(g))), so it is the orthogonal projector onto the
    isotypic component: P = Q (Q^H F Q)^-1 Q^H F with Q the columns of the
    intertwiners solved on the generators (see :func:`_intertwiners`).  The
    sum over the group is never formed; ``conj_chars`` and ``scale`` are
    kept for the signature of the slow formula.
    """
    from tensym.reps.spaces import polynomials
    from tensym.reps.table import finite_table, group_key

    poly = sp.Poly(sp.expand(expr), X, Y, Z)
    parts = {}
    for mono, c in poly.terms():
        parts.setdefault(sum(mono), []).append((mono, c))
    total = sp.Integer(0)
    for n, terms in parts.items():
        key = (group_key(G), irr.label, n)
        P = _PROJECTORS.get(key)
        if P is None:
            space = polynomials(n)
            P = _isotypic_projector(space, G, finite_table(G), irr)
            if len(_PROJECTORS) > 2048:
                _PROJECTORS.clear()
            _PROJECTORS[key] = P
        idx = {m: i for i, m in enumerate(monomials(n))}
        v = sp.zeros(len(idx), 1)
        for mono, c in terms:
            v[idx[mono]] = c
        w = P * v
        total += sum(sp.expand(w[i]) * X ** a * Y ** b * Z ** cc for i, (a, b, cc) in enumerate(monomials(n)))
    return sp.expand(total)


def _isotypic_projector(V, G, t, irr):
    """Exact ImmutableMatrix of the orthogonal projector onto the Gamma-isotypic part of V (Gram inner product).

    A real form of a complex pair uses its real 2x2 matrices, whose
    intertwiners span the sum of the two members' isotypic parts (with
    dependent columns: a basis is kept).
    """
    Ts = _intertwiners(V, G, t, irr)
    dim = V.dim
    if not Ts:
        return sp.ImmutableMatrix(sp.zeros(dim, dim))
    Q_s = sp.Matrix.hstack(*Ts)
    # the columns span the isotypic part; for a real form of a complex pair they are dependent
    # (its intertwiner space is twice as large), so keep the pivot columns
    _, piv = to_dm(Q_s).rref()
    Q_s = Q_s.extract(list(range(dim)), list(piv))
    QH_s = Q_s.T if irr.is_real else Q_s.H.applyfunc(sp.expand)
    Gm, Q, QH = unify([to_dm(sp.Matrix(V.gram())), to_dm(Q_s), to_dm(QH_s)])
    P = Q * (QH * Gm * Q).inv() * QH * Gm
    return sp.ImmutableMatrix(dim, dim, [sp.expand(v) for v in P.to_Matrix()])


def _project_rotation_group(expr, G, irrep):
    from tensym.reps.continuous import _kind, _parse_label

    core, ext = _kind(G)
    irr = _parse_label(G, irrep)
    if core != "SO3":
        return _project_axial(expr, G, irr, core, ext)
    l = irr.m
    poly = sp.Poly(sp.expand(expr), X, Y, Z)
    total = sp.Integer(0)
    by_degree = {}
    for mono, c in poly.terms():
        by_degree.setdefault(sum(mono), sp.Integer(0))
        by_degree[sum(mono)] += c * X ** mono[0] * Y ** mono[1] * Z ** mono[2]
    for n, part in by_degree.items():
        if n < l or (n - l) % 2:
            continue
        if irr.parity and irr.parity != ("g" if n % 2 == 0 else "u"):
            continue  # polynomials of degree n have parity (-1)^n
        total += _harmonic_part(part, n, l)
    return sp.expand(total)


def _project_axial(expr, G, irr, core, ext):
    """Projection onto an irrep of C∞, C∞h, C∞v, D∞, D∞h for polynomials.

    With A the infinitesimal rotation about the axis on degree-n polynomials
    (eigenvalues i m, |m| <= n), the weight-|m| part is the Lagrange projector
    prod_{k != m} (A^2 + k^2) / (k^2 - m^2); the member with character
    exp(+i m phi) is (1 - i A / m)/2 of it; Σ+ / Σ- take (1 +- D(s))/2 with s the
    reflection sigma_v (C∞v, D∞h) or the 2-fold C2' (D∞); the parity of degree
    n is (-1)^n.
    """
    from tensym.groups.operations import Operation
    from tensym.reps.spaces import polynomials

    poly = sp.Poly(sp.expand(expr), X, Y, Z)
    parts = {}
    for mono, c in poly.terms():
        parts.setdefault(sum(mono), []).append((mono, c))
    total = sp.Integer(0)
    L = G.lie_generators[-1]
    for n, terms in parts.items():
        if irr.m > n:
            continue
        if irr.parity and irr.parity != ("g" if n % 2 == 0 else "u"):
            continue
        space = polynomials(n)
        A = sp.Matrix(space.lie_action(L))
        A2 = A * A
        I = sp.eye(space.dim)
        P = I
        for k in range(0, n + 1):
            if k != irr.m:
                P = P * (A2 + k * k * I) / (k * k - irr.m * irr.m)
        if irr.m == 0 and core == "Dinf":
            ref = Operation.from_triplet("-x,y,z" if ext in ("i", "det") else "x,-y,-z")
            if G.names.rotation is not None:
                ref = ref.conjugated(G.names.rotation)
            S = sp.Matrix(space.action(ref))
            P = P * (I + irr.sign * S) / 2
        elif not irr.is_real:
            P = P * (I - sp.I * irr.sign * A / irr.m) / 2
        idx = {m: i for i, m in enumerate(monomials(n))}
        v = sp.zeros(len(idx), 1)
        for mono, c in terms:
            v[idx[mono]] = c
        w = P * v
        total += sum(sp.expand(w[i]) * X ** a * Y ** b * Z ** cc for i, (a, b, cc) in enumerate(monomials(n)))
    return sp.expand(total)


def _harmonic_part(f, n, l):
    """The r^(n-l) h_l component of a homogeneous polynomial of degree n."""
    from tensym.reps.spaces import _poly_coords

    basis = []
    owner = []
    r2 = X**2 + Y**2 + Z**2
    for ll in range(n % 2, n + 1, 2):
        for h in harmonics(ll).basis:
            basis.append(sp.expand(r2 ** ((n - ll) // 2) * h))
            owner.append(ll)
    M = sp.Matrix([_poly_coords(b, n) for b in basis]).T
    v = sp.Matrix(_poly_coords(f, n))
    c = M.LUsolve(v)
    return sp.expand(sum(ci * b for ci, b, o in zip(c, basis, owner) if o == l))


# ---------------------------------------------------------------------------
# symmetry-adapted bases
# ---------------------------------------------------------------------------
def readable(expr):
    """Write an expression as (scalar) * (polynomial with coprime integer coefficients) when it is one.

    Examples
    --------
    >>> readable(sp.sqrt(6)/6*X - sp.sqrt(6)/12*Y)
    (sqrt(6)/12)*(2*x - y)
    """
    e = sp.expand(expr)
    if e == 0 or not e.free_symbols:
        return e
    try:
        p = sp.Poly(e, *sorted(e.free_symbols, key=str))
    except sp.PolynomialError:
        return e
    coeffs = p.coeffs()
    lead = coeffs[0]
    ratios = []
    for c in coeffs:
        r = c / lead
        if not r.is_Rational:
            r = sp.radsimp(r)
            if not r.is_Rational and _is_surd(r):
                return e  # a rational combination of square roots of distinct square-free integers: irrational
            r = sp.nsimplify(r)
            if not r.is_Rational:
                return e
        ratios.append(r)
    den = sp.ilcm(*[r.q for r in ratios]) if len(ratios) > 1 else ratios[0].q
    ints = [int(r * den) for r in ratios]
    g = sp.igcd(*ints) if len(ints) > 1 else abs(ints[0])
    scale = sp.radsimp(lead * g / den)
    prim = sp.expand(sp.Add(*[sp.Integer(k // g) * m for k, m in zip(ints, [sp.Mul(*[v**k for v, k in zip(p.gens, mono)])
                                                                             for mono in p.monoms()])]))
    if scale == 1:
        return prim
    return sp.Mul(scale, prim, evaluate=False)


def _is_surd(r):
    """True for a sum of rational multiples of square roots of integers, as sympy writes them."""
    for term in sp.Add.make_args(r):
        for f in sp.Mul.make_args(term):
            if not (f.is_Rational or (f.is_Pow and f.exp == sp.S.Half and f.base.is_Integer and f.base > 1)):
                return False
    return True


@dataclass(frozen=True)
class PartnerSet:
    """Partner functions of one copy of an irrep.

    Attributes
    ----------
    irrep : str
        The irrep label.
    copy : int
        Which copy (0-based) of the irrep in the space.
    coordinates : tuple of sympy.ImmutableMatrix
        Coordinates (column vectors) of the d partners in the space's basis;
        orthonormal under the space's Gram matrix.
    elements : tuple
        The partners as objects of the space (polynomials, sympy Arrays ...)
        when the space builds elements, else the coordinates.
    readable : tuple
        The same written as scalar times a primitive integer polynomial where
        possible, e.g. ``(sqrt(6)/6)*(2*x - y - z)``.
    irrep_latex : str
        The irrep label in LaTeX.
    """

    irrep: str
    copy: int
    coordinates: tuple = field(repr=False)
    elements: tuple = ()
    readable: tuple = ()
    irrep_latex: str = ""

    def latex(self):
        """The partners as a LaTeX list."""
        return ",\\quad ".join(sp.latex(e) for e in self.readable)


@dataclass(frozen=True)
class SymmetryAdaptedBasis:
    """An orthonormal basis of a space made of partner sets of the group's irreps.

    Attributes
    ----------
    group : str
        Symbol of the group.
    space : str
        Description of the space.
    sets : tuple of PartnerSet
        All partner sets, by irrep in table order, then by copy.
    matrix : sympy.ImmutableMatrix
        All partner coordinates as columns (dim x dim); with the Gram matrix G,
        ``matrix.T * G * matrix`` is the identity.

    Examples
    --------
    >>> from tensym.reps.spaces import polynomials
    >>> b = symmetry_adapted(polynomials(2), "4mm")
    >>> [s.irrep for s in b.sets]
    ['A1', 'A1', 'B1', 'B2', 'E']
    >>> b["B1"][0].readable
    ((x**2 - y**2)/2,)
    """

    group: str
    space: str
    sets: tuple
    matrix: object = field(repr=False)

    def __getitem__(self, label):
        out = tuple(s for s in self.sets if s.irrep == label)
        if not out:
            from tensym.errors import UnknownIrrepError

            raise UnknownIrrepError(
                f"no partner set of {label!r}; the space holds {', '.join(dict.fromkeys(s.irrep for s in self.sets))}")
        return out

    @property
    def labels(self):
        """Labels of the irreps present, in order (tuple of str)."""
        return tuple(dict.fromkeys(s.irrep for s in self.sets))

    def __str__(self):
        lines = [f"symmetry-adapted basis of {self.space} in {self.group}"]
        for s in self.sets:
            lines.append(f"  {s.irrep} ({s.copy + 1}): " + ", ".join(sp.sstr(e) for e in s.readable))
        return "\n".join(lines)

    def latex(self):
        """A LaTeX array: one row per partner set."""
        rows = [f"{s.irrep_latex or s.irrep} & {s.latex()} \\\\" for s in self.sets]
        return "\\begin{array}{ll}\n" + "\n".join(rows) + "\n\\end{array}"

    def _repr_latex_(self):
        return "$$" + self.latex() + "$$"


def symmetry_adapted(space, group, *, real=True):
    """A symmetry-adapted orthonormal basis of a space: partner sets of every irrep.

    Parameters
    ----------
    space : Space or object with ``as_space()``
        Polynomials, harmonics, irrep products, tensor specs ...
    group : PointGroup or str
        A finite group.
    real : bool, keyword-only
        Use the real forms of complex pairs (default) or the complex members.

    Returns
    -------
    SymmetryAdaptedBasis

    Raises
    ------
    InvalidArgumentError
        For a continuous group or a non-space argument.

    Examples
    --------
    >>> from tensym.reps.spaces import polynomials
    >>> b = symmetry_adapted(polynomials(1), "3m")
    >>> [(s.irrep, s.readable) for s in b.sets]
    [('A1', (z,)), ('E', (x, y))]
    """
    G = as_group_arg(group)
    V = as_space_arg(space)
    if getattr(G, "is_continuous", False):
        raise InvalidArgumentError(
            f"symmetry-adapted bases are built for finite groups; {G.names.hm} is continuous")
    from tensym.reps.table import finite_table
    from tensym.reps.reduction import multiplicities, space_characters
    from tensym.reps.decompose import _group_label

    t = finite_table(G)
    mult = multiplicities(t, space_characters(V, t), real=real)
    pool = t.real_irreps if real else t.irreps
    Gram = to_dm(sp.Matrix(V.gram()))
    n = G.order
    sets = []
    all_cols = []
    for irr in pool:
        m = mult.get(irr.label, 0)
        if not m:
            continue
        sets_i, cols = _partners(V, G, t, irr, m, Gram)
        sets += sets_i
        all_cols += cols
    matrix = sp.ImmutableMatrix(sp.Matrix.hstack(*all_cols)) if all_cols else sp.ImmutableMatrix(0, 0, [])
    return SymmetryAdaptedBasis(_group_label(G), repr(V), tuple(sets), matrix)


def _intertwiners(V, G, t, irr):
    """A basis of Hom_G(Gamma, V): matrices T (dim x d) with D_V(g) T = T D_Gamma(g) for the generators.

    The conditions are linear in the dim * d entries of T (row-major
    vec(T): kron(D_V(g), 1) - kron(1, D_Gamma(g)^T)), written with integer
    coordinates over the number field of the generators' entries
    (:func:`tensym.exact.fields.field_of`) and reduced fraction-free by
    :func:`tensym.exact.fields.rref_field`; one basis matrix per free
    column.  Generators suffice because the conditions for g and h imply the
    one for g h.  Returns a list of sympy Matrices.
    """
    from tensym.exact.fields import field_of, rref_field
    from tensym.reps.linalg import _space_action_dm

    ops = G.operations
    gens = [G.index(g) for g in G.generators if not g.is_identity or g.time_reversal]
    d, dim = irr.dim, V.dim
    irr_mats = t.matrices(irr.label)
    space_mats = [_space_action_dm(V, ops[i]).to_Matrix() for i in gens]
    entries = [x for M in space_mats for x in M] + [x for i in gens for x in irr_mats[i]]
    uniq = list(dict.fromkeys(entries)) or [sp.Integer(1)]  # few distinct numbers: convert each once
    K, _den, uniq_ints = field_of(uniq)
    where = {x: k for k, x in enumerate(uniq)}
    ints = [uniq_ints[where[x]] for x in entries]
    N = K.degree
    size = dim * d
    rows = []
    pos = 0
    blocks_v, blocks_g = [], []
    for _ in gens:
        A = np.empty((N, dim, dim), dtype=object)
        for e in range(dim * dim):
            A[:, e // dim, e % dim] = ints[pos + e]
        pos += dim * dim
        blocks_v.append(A)
    for _ in gens:
        B = np.empty((N, d, d), dtype=object)
        for e in range(d * d):
            B[:, e // d, e % d] = ints[pos + e]
        pos += d * d
        blocks_g.append(B)
    eye_v, eye_g = np.eye(dim, dtype=object), np.eye(d, dtype=object)
    for A, B in zip(blocks_v, blocks_g):
        M = np.stack([np.kron(A[c], eye_g) - np.kron(eye_v, B[c].T) for c in range(N)])
        for r in range(size):
            row = M[:, r, :]
            if any(row.ravel()):
                rows.append(row)
    reduced = rref_field(K, rows, list(range(size)))
    pivots = {col for col, _, _ in reduced}
    lcm = math.lcm(*[g for _, _, g in reduced]) if reduced else 1
    out = []
    for f in range(size):
        if f in pivots:
            continue
        v = np.zeros((N, size), dtype=object)
        v[0, f] = lcm
        for col, row, g in reduced:
            v[:, col] = -row[:, f] * (lcm // g)
        T = sp.Matrix(dim, d, [K.to_sympy(v[:, j], lcm) for j in range(size)])
        out.append(T)
    return out


def _partners(V, G, t, irr, m, Gram):
    """Partner sets of irrep ``irr`` (multiplicity m) in V, from intertwiners on the generators.

    With T_1 .. T_m a basis of Hom_G(Gamma, V) and B = (T_k e_1), the image W of
    the projector P_11 = (d/|G|) sum_g conj(D_11(g)) D(g) is the span of B, and
    P_11 is the orthogonal projector onto W in the Gram inner product (the
    irrep matrices are unitary and D(g) preserves the Gram form), so
    P_11 = B C with C = (B^H G B)^-1 B^H G.  Its pivot columns u, orthogonalised
    as before, and the partners P_i1 u = T_u e_i (T_u = sum_k (C u)_k T_k)
    are exactly those of the whole-group sum, which is never formed
    (``tensym.testing.brute_force_partners`` keeps it as the oracle).
    """
    if irr.label not in t.labels:
        return _real_pair_partners(V, G, t, irr, m, Gram)
    d = irr.dim
    dim = V.dim
    Ts = _intertwiners(V, G, t, irr)
    if len(Ts) != m:
        raise ArithmeticError(f"{irr.label} has {len(Ts)} intertwiners, expected the multiplicity {m}")
    B_s = sp.Matrix.hstack(*[T[:, 0] for T in Ts])
    cols_s = [sp.Matrix.hstack(*[T[:, i] for T in Ts]) for i in range(d)]
    BH = B_s.T if irr.is_real else B_s.H.applyfunc(sp.expand)
    all_m = unify([Gram, to_dm(B_s), to_dm(BH)] + [to_dm(c) for c in cols_s[1:]])
    Gm, B, BHd = all_m[0], all_m[1], all_m[2]
    cols = [B] + all_m[3:]
    dom = Gm.domain
    C = (BHd * Gm * B).inv() * BHd * Gm  # m x dim
    _, piv = C.rref()
    if len(piv) != m:
        raise ArithmeticError(f"P_11 of {irr.label} has rank {len(piv)}, expected the multiplicity {m}")
    # orthogonalise in the Gram inner product (real spaces; Hermitian for complex members)
    basis, norms = [], []
    for j in piv:
        w = B * C.extract(list(range(m)), [j])
        for b, nb in zip(basis, norms):
            coef = _inner(b, Gm, w, dom, irr.is_real)
            w = w - b * dom.quo(coef, nb)
        basis.append(w)
        norms.append(_inner(w, Gm, w, dom, irr.is_real))
    out_sets = []
    out_cols = []
    for copy, (u, nu) in enumerate(zip(basis, norms)):
        root = sp.sqrt(sp.radsimp(dom.to_sympy(nu)))
        a = C * u
        coords, elems, reads = [], [], []
        for i in range(d):
            f = u if i == 0 else cols[i] * a
            vec = sp.ImmutableMatrix([sp.radsimp(sp.expand(x / root)) for x in f.to_Matrix()])
            coords.append(vec)
            try:
                el = V.element(list(vec))
            except NotImplementedError:
                el = vec
            elems.append(el)
            reads.append(readable(el) if isinstance(el, sp.Expr) else el)
            out_cols.append(sp.Matrix(vec))
        out_sets.append(PartnerSet(irr.label, copy, tuple(coords), tuple(elems), tuple(reads), irr.latex))
    return out_sets, out_cols


def _inner(a, G, b, dom, real):
    if real:
        return (a.transpose() * G * b).to_list()[0][0]
    ah = a.to_Matrix().H
    val = sp.expand((ah * G.to_Matrix() * b.to_Matrix())[0, 0])
    return dom.from_sympy(val)


def _real_pair_partners(V, G, t, irr, m, Gram):
    """Partners of the real form of a complex pair: sqrt2 (Re u, Im u) for u in the image of P_1E.

    With g u = chi(g) u, u = a + i b, the pair (a, b) transforms by the real-form
    matrices [[Re chi, Im chi], [-Im chi, Re chi]]; u^T G u = 0 (u and conj(u)
    lie in different isotypic components), so a and b are orthogonal with
    equal norms |u|^2 / 2.
    """
    member = next(i for i in t.irreps if i.real_label == irr.label and i.label.startswith("1"))
    sets, _cols = _partners(V, G, t, member, m, Gram)
    out_sets, out_cols = [], []
    r2 = sp.sqrt(2)
    for s in sets:
        (u,) = s.coordinates
        parts = [sp.ImmutableMatrix([sp.radsimp(sp.expand(r2 * f(sp.expand_complex(v)))) for v in u])
                 for f in (sp.re, sp.im)]
        elems, reads = [], []
        for vec in parts:
            try:
                el = V.element(list(vec))
            except NotImplementedError:
                el = vec
            elems.append(el)
            reads.append(readable(el) if isinstance(el, sp.Expr) else el)
            out_cols.append(sp.Matrix(vec))
        out_sets.append(PartnerSet(irr.label, s.copy, tuple(parts), tuple(elems), tuple(reads), irr.latex))
    return out_sets, out_cols
