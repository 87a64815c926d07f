"""Symmetry operations: exact orthogonal 3x3 matrices with a time-reversal flag.

Conventions
-----------
* Operations act actively on Cartesian column vectors: ``r' = R r``.
* Composition ``g @ h`` is the operation "first apply h, then g"; its matrix
  is ``g.matrix * h.matrix`` and its time-reversal flag is the exclusive or.
* A coordinate triplet such as ``-y,x-y,z`` lists the images of x, y, z: the
  i-th entry is row i of the matrix (in the basis the triplet is written in).
* In the hexagonal basis a = (1, 0, 0), b = (-1/2, sqrt(3)/2, 0), c = (0, 0, 1)
  a triplet W gives the Cartesian matrix ``R = A W A^-1`` (A has columns a, b, c).
* The rotation axis is the direction of the proper part ``det(R) R`` left fixed,
  oriented so that its first non-zero component is positive; ``sense`` is +1 when
  the rotation is counter-clockwise seen from the tip of that axis.

Examples
--------
>>> from tensym.groups.operations import Operation
>>> g = Operation.from_triplet("-y,x-y,z", basis="hexagonal")
>>> g.symbol, g.axis
('3+', (0, 0, 1))
>>> (g @ g @ g).is_identity
True
>>> Operation.from_triplet("-x,-y,-z").kind
'inversion'
"""

from dataclasses import dataclass, field
import math
import re

import numpy as np
import sympy as sp

from tensym.errors import InvalidOperationError
from tensym.exact.matrices import exact_matrix, float_key, is_orthogonal, matmul, to_float
from tensym.groups.messages import echo
from tensym.groups.quadratic import is_orthogonal_mq, mq_entry, mq_matrix

__all__ = ["Operation", "HEXAGONAL_BASIS", "ORDER_SEARCH_LIMIT"]

_S3 = sp.sqrt(3)
#: Columns are the hexagonal lattice vectors a, b, c in Cartesian axes.
HEXAGONAL_BASIS = sp.ImmutableMatrix([[1, -sp.Rational(1, 2), 0], [0, _S3 / 2, 0], [0, 0, 1]])
_HEX_INV = sp.ImmutableMatrix(HEXAGONAL_BASIS.inv())
#: Largest rotation order n recognised by :attr:`Operation.order`; a rotation whose
#: angle is not 360/n degrees for some n up to this limit counts as of infinite order.
ORDER_SEARCH_LIMIT = 240
_BASES = ("cartesian", "hexagonal")
_TERM = re.compile(r"([+-]?)\s*([0-9/.]*)\s*\*?\s*([xyz])")


def _parse_component(text, where):
    text = text.strip().replace(" ", "")
    if not text:
        raise InvalidOperationError(f"empty component in triplet {echo(where)}")
    row = [sp.Integer(0)] * 3
    pos = 0
    for m in _TERM.finditer(text):
        if m.start() != pos:
            break
        sign, num, var = m.groups()
        if pos > 0 and not sign:
            raise InvalidOperationError(f"missing + or - before {echo(var)} in triplet {echo(where)}")
        coeff = sp.Rational(num) if num else sp.Integer(1)
        if sign == "-":
            coeff = -coeff
        row["xyz".index(var)] += coeff
        pos = m.end()
    if pos != len(text):
        row = _parse_algebraic(text)
        if row is None:
            raise InvalidOperationError(
                f"cannot read {echo(text)} in triplet {echo(where)}: each component is a sum of "
                "+/- x, y, z with exact factors such as 1/2 or sqrt(3)/2 (translations are not accepted)"
            )
    return row


_ALGEBRAIC = re.compile(r"^(?:[0-9xyz+\-*/().]|sqrt)+$")
_XYZ = sp.symbols("x y z")


def _parse_algebraic(text):
    """Coefficients of a linear form with exact algebraic factors, e.g. ``sqrt(3)/2*x-y/2``; None if not one."""
    if not _ALGEBRAIC.match(text):
        return None
    try:
        expr = sp.expand(sp.sympify(text, locals={"x": _XYZ[0], "y": _XYZ[1], "z": _XYZ[2], "sqrt": sp.sqrt}))
    except (sp.SympifyError, TypeError, SyntaxError, ZeroDivisionError):
        return None
    row = [expr.coeff(v) for v in _XYZ]
    if any(c.free_symbols or c.has(sp.Float) for c in row):
        return None
    if sp.expand(expr - sum(c * v for c, v in zip(row, _XYZ))) != 0:
        return None
    return row


def _exact_entry(v):
    """One exact real number of an operation matrix, or InvalidOperationError saying what is wrong."""
    if isinstance(v, (bool, np.bool_, sp.logic.boolalg.BooleanAtom)):
        raise InvalidOperationError(
            f"matrix entry {echo(v)} is a boolean; give numbers (for a numpy bool array use .astype(int))"
        )
    try:
        e = sp.sympify(v)
    except (sp.SympifyError, TypeError, ValueError, SyntaxError) as exc:
        raise InvalidOperationError(f"cannot read matrix entry {echo(v)} as a number") from exc
    if isinstance(e, sp.logic.boolalg.Boolean):
        raise InvalidOperationError(f"matrix entry {echo(v)} is a boolean; give numbers")
    if not isinstance(e, sp.Expr):
        raise InvalidOperationError(f"cannot read matrix entry {echo(v)} as a number")
    if e.free_symbols:
        names = ", ".join(sorted(str(x) for x in e.free_symbols))
        raise InvalidOperationError(
            f"matrix entry {echo(e)} is symbolic (free symbol {names}); an operation needs exact numbers"
        )
    if e.is_finite is False or e.has(sp.nan, sp.zoo):
        raise InvalidOperationError(f"matrix entry {echo(e)} is not finite")
    if e.is_real is False:
        raise InvalidOperationError(f"matrix entry {echo(e)} is not real; operations are real orthogonal matrices")
    return e


def _orthogonal(m):
    """Exact orthogonality test, with the multi-quadratic kernel where the entries allow."""
    q = mq_matrix(m)
    if q is not None:
        return is_orthogonal_mq(q)
    return is_orthogonal(m)


def proper_angle(p):
    """Rotation angle in [0, pi] of a proper rotation given as a float (3, 3) array.

    ``atan2(|w| / 2, (tr p - 1) / 2)`` with w the axial vector of ``p - p^T``
    (``|w| = 2 sin t``).  Unlike ``acos((tr p - 1)/2)`` this is well conditioned
    at every angle: near a half turn acos turns a trace error of 1e-16 (the
    rounding of a few float products) into an angle error of 1e-8.
    """
    w = (p[2, 1] - p[1, 2], p[0, 2] - p[2, 0], p[1, 0] - p[0, 1])
    return math.atan2(math.sqrt(w[0] ** 2 + w[1] ** 2 + w[2] ** 2) / 2.0, (float(np.trace(p)) - 1.0) / 2.0)


def _order_and_power(p):
    """(n, k) with angle 2 pi k / n, k and n coprime, 1 <= k <= n/2; (1, 0) for 1, (0, 0) when n is too large."""
    if np.allclose(p, np.eye(3), atol=1e-9):
        return 1, 0
    ang = proper_angle(p)
    for k in range(1, ORDER_SEARCH_LIMIT + 1):
        n = 2 * math.pi * k / ang
        if n > ORDER_SEARCH_LIMIT + 0.5:
            break
        if abs(n - round(n)) < 1e-7:
            return int(round(n)), k
    return 0, 0


def proper_order(p):
    """Order of a proper rotation given as a float (3, 3) array; 0 when above ORDER_SEARCH_LIMIT.

    The angle t (see :func:`proper_angle`) is 2 pi k/n with k, n coprime; n is the order.
    """
    return _order_and_power(p)[0]


@dataclass(frozen=True, eq=False)
class Operation:
    """An exact point symmetry operation.

    Parameters
    ----------
    matrix : sympy.ImmutableMatrix
        Exact orthogonal 3x3 matrix in Cartesian axes (rational or algebraic entries).
    time_reversal : bool
        True for a primed operation (combined with time reversal 1').

    Examples
    --------
    >>> Operation.from_matrix([[1, 0, 0], [0, -1, 0], [0, 0, 1]]).describe()
    'm: mirror, normal [0, 1, 0]'
    >>> Operation.from_triplet("x,y,z", time_reversal=True).symbol
    "1'"
    """

    matrix: sp.ImmutableMatrix
    time_reversal: bool = False
    _num: np.ndarray = field(init=False, repr=False, compare=False)

    def __post_init__(self):
        object.__setattr__(self, "_num", to_float(self.matrix))

    # --- constructors -------------------------------------------------
    @classmethod
    def from_matrix(cls, matrix, *, time_reversal=False, check=True):
        """Build from a 3x3 matrix (lists, sympy or integer numpy); exact entries only.

        Raises
        ------
        InvalidOperationError
            If the matrix is not 3x3, has float entries or is not orthogonal.
        """
        if isinstance(matrix, Operation):
            return matrix
        try:
            arr = np.asarray(matrix, dtype=object)
        except Exception as exc:  # pragma: no cover - numpy accepts almost anything
            raise InvalidOperationError(f"cannot read {echo(matrix)} as a 3x3 matrix") from exc
        if arr.shape != (3, 3):
            raise InvalidOperationError(f"an operation matrix must be 3x3, got shape {arr.shape}")
        rows = []
        for row in arr.tolist():
            out = []
            for v in row:
                if isinstance(v, (float, np.floating)):
                    if float(v).is_integer():
                        v = int(v)
                    else:
                        raise InvalidOperationError(
                            f"matrix entry {echo(v)} is a float; give exact entries "
                            "(integers, fractions as strings like '1/2', or sympy numbers such as sqrt(3)/2)"
                        )
                out.append(_exact_entry(v))
            rows.append(out)
        m = exact_matrix(rows)
        if check and not _orthogonal(m):
            raise InvalidOperationError(f"matrix {echo(m.tolist())} is not orthogonal (R R^T != 1)")
        return cls(m, bool(time_reversal))

    @classmethod
    def from_triplet(cls, text, *, basis="cartesian", time_reversal=None):
        """Build from a coordinate triplet such as ``-y,x-y,z``.

        A trailing ``,-1`` or ``,+1`` marks time reversal (``-1`` primed), as
        magnetic groups write it; ``time_reversal`` may also be given directly.

        Raises
        ------
        InvalidOperationError
            For a malformed triplet, an unknown basis or a non-orthogonal result.
        """
        if basis not in _BASES:
            raise InvalidOperationError(f"basis {echo(basis)} is not one of {_BASES}")
        parts = [p for p in str(text).split(",")]
        flag = None
        if len(parts) == 4:
            last = parts[3].strip()
            if last not in ("-1", "+1", "1"):
                raise InvalidOperationError(
                    f"the fourth entry of triplet {echo(text)} must be +1 or -1 (time reversal), got {echo(last)}"
                )
            flag = last == "-1"
            parts = parts[:3]
        if len(parts) != 3:
            raise InvalidOperationError(
                f"a triplet has three comma-separated components (optionally a fourth +1/-1), got {echo(text)}"
            )
        if time_reversal is not None:
            if flag is not None and flag != bool(time_reversal):
                raise InvalidOperationError(f"triplet {echo(text)} contradicts time_reversal={time_reversal}")
            flag = bool(time_reversal)
        w = sp.Matrix([_parse_component(p, text) for p in parts])
        if basis == "hexagonal":
            w = HEXAGONAL_BASIS * w * _HEX_INV
        m = exact_matrix(w)
        if not _orthogonal(m):
            raise InvalidOperationError(
                f"triplet {echo(text)} ({basis} basis) is not an orthogonal operation in Cartesian axes"
                + ("" if basis == "hexagonal" else "; for a hexagonal-basis triplet pass basis='hexagonal'")
            )
        return cls(m, bool(flag))

    @classmethod
    def identity(cls):
        """The identity operation 1."""
        return cls(sp.ImmutableMatrix(sp.eye(3)))

    # --- algebra --------------------------------------------------------
    def __matmul__(self, other):
        if not isinstance(other, Operation):
            return NotImplemented
        return Operation(matmul(self.matrix, other.matrix), self.time_reversal != other.time_reversal)

    def inverse(self):
        """The inverse operation (the transpose matrix, same time-reversal flag)."""
        return Operation(sp.ImmutableMatrix(self.matrix.T), self.time_reversal)

    def conjugated(self, rotation):
        """``Q g Q^T`` for an exact orthogonal ``rotation`` Q (re-orientation)."""
        q = sp.Matrix(rotation)
        return Operation(matmul(matmul(q, self.matrix), q.T), self.time_reversal)

    @property
    def key(self):
        """Hashable identity key: float image rounded at 1e-8, plus the time flag (computed once)."""
        k = self.__dict__.get("_key")
        if k is None:
            k = float_key(self._num) + (int(self.time_reversal),)
            object.__setattr__(self, "_key", k)
        return k

    def __eq__(self, other):
        return isinstance(other, Operation) and self.key == other.key

    def __hash__(self):
        return hash(self.key)

    def __repr__(self):
        tr = ", time_reversal=True" if self.time_reversal else ""
        return f"Operation.from_triplet({self.triplet()!r}{tr})"

    # --- numeric view ---------------------------------------------------
    @property
    def numeric(self):
        """float64 copy of the matrix (3, 3)."""
        return self._num.copy()

    # --- geometry ---------------------------------------------------------
    @property
    def det(self):
        """Determinant, +1 (proper) or -1 (improper)."""
        return 1 if np.linalg.det(self._num) > 0 else -1

    @property
    def is_identity(self):
        """True for the identity (time reversal ignored)."""
        return bool(np.allclose(self._num, np.eye(3), atol=1e-9))

    @property
    def angle(self):
        """Rotation angle of the proper part ``det(R) R`` as a sympy number in [0, pi]."""
        tr = sp.nsimplify(sp.simplify(self.det * self.matrix.trace()))
        c = sp.simplify((tr - 1) / 2)
        return sp.simplify(sp.acos(c))

    @property
    def order(self):
        """Order n of the spatial part (g^n = 1), or 0 when it is infinite.

        "Infinite" means: no n <= ORDER_SEARCH_LIMIT (240) gives g^n = 1 to 1e-9
        (absolute, on the float image).
        """
        n_proper = proper_order(self.det * self._num)
        if n_proper == 0:
            return 0
        if self.det == 1:
            return n_proper
        # g = -P with P of order n: g^n = (-1)^n P^n, so the order is n for n even, 2n for n odd
        n = n_proper if n_proper % 2 == 0 else 2 * n_proper
        p = np.linalg.matrix_power(self._num, n)
        if not np.allclose(p, np.eye(3), atol=1e-9):  # pragma: no cover - defensive
            return 0
        return n

    @property
    def axis(self):
        """Axis of the proper part as a tuple of sympy numbers (None for 1 and -1).

        For a mirror this is the mirror normal; the direction is scaled so that its
        entries are integers where they can be and oriented with the first non-zero
        component positive.
        """
        if np.allclose(self.det * self._num, np.eye(3), atol=1e-9):
            return None
        p = self.det * sp.Matrix(self.matrix)
        pn = self.det * self._num
        if float(np.trace(pn)) > -1 + 1e-9:
            # not a half turn: the antisymmetric part is 2 sin(t) [axis]_x
            v = [p[2, 1] - p[1, 2], p[0, 2] - p[2, 0], p[1, 0] - p[0, 1]]
        else:
            # half turn: P + 1 = 2 u u^T, take its largest column
            m = pn + np.eye(3)
            j = int(np.argmax(np.linalg.norm(m, axis=0)))
            v = [p[i, j] + (1 if i == j else 0) for i in range(3)]
        v = [sp.radsimp(sp.expand(x)) for x in v]
        nums = [float(x) for x in v]
        k = next(i for i, x in enumerate(nums) if abs(x) > 1e-9)
        first = v[k]
        v = [sp.Integer(0) if abs(nums[i]) < 1e-12 else sp.expand(sp.radsimp(x / first)) for i, x in enumerate(v)]
        if all(x.is_Rational for x in v):
            scale = math.lcm(*[int(x.q) for x in v])
            ints = [int(x * scale) for x in v]
            g = math.gcd(*ints)
            v = [sp.Integer(x // g) for x in ints]
        return tuple(sp.nsimplify(x) if not x.is_Rational else x for x in v)

    @property
    def sense(self):
        """+1 or -1: the sense of the proper rotation about ``axis`` (0 if none or 2-fold)."""
        ax = self.axis
        if ax is None:
            return 0
        r = self.det * self._num
        w = np.array([r[2, 1] - r[1, 2], r[0, 2] - r[2, 0], r[1, 0] - r[0, 1]])
        s = float(np.dot(w, np.array([float(x) for x in ax], dtype=float)))
        if abs(s) < 1e-9:
            return 0
        return 1 if s > 0 else -1

    @property
    def kind(self):
        """One of 'identity', 'rotation', 'inversion', 'mirror', 'rotoinversion'."""
        if self.det == 1:
            return "identity" if self.is_identity else "rotation"
        if np.allclose(self._num, -np.eye(3), atol=1e-9):
            return "inversion"
        if abs(np.trace(self._num) - 1) < 1e-9:
            return "mirror"
        return "rotoinversion"

    @property
    def symbol(self):
        """Short symbol in the crystallographic style: 1, 2, 3+, 4-, -1, m, -3+, -6-; primed with '.

        A rotation by 2 pi k/n with k > 1 (k and n coprime, k <= n/2) is the power
        ``n^k+`` or ``n^k-`` (the icosahedral 5-folds by 144 degrees: ``5^2+``);
        a rotation of order above ORDER_SEARCH_LIMIT is named by its angle, ``R(t)``.

        Examples
        --------
        >>> Operation.from_triplet("x-y,x,z", basis="hexagonal").symbol
        '6+'
        """
        prime = "'" if self.time_reversal else ""
        kind = self.kind
        if kind == "identity":
            return "1" + prime
        if kind == "inversion":
            return "-1" + prime
        if kind == "mirror":
            return "m" + prime
        n, k = _order_and_power(self.det * self._num)
        if n == 0:  # no order up to ORDER_SEARCH_LIMIT: name it by its angle
            base = f"R({sp.nsimplify(self.angle)})"
        else:
            base = str(n) if k == 1 else f"{n}^{k}"  # n^k: the k-th power of n+, angle 2 pi k/n
        s = "" if n == 2 else ("+" if self.sense > 0 else "-")
        if kind == "rotoinversion":
            # -n+ is inversion after the rotation n+ (ITA convention): order and sense
            # are those of the proper part det(R) R.
            return "-" + base + s + prime
        return base + s + prime

    def describe(self):
        """One-line geometric description (kind, order, axis or normal, sense).

        Examples
        --------
        >>> Operation.from_triplet("z,x,y").describe()
        '3+: 3-fold rotation, counter-clockwise, axis [1, 1, 1]'
        """
        kind = self.kind
        tail = " (with time reversal)" if self.time_reversal else ""
        ax = self.axis
        axs = "[" + ", ".join(str(x) for x in ax) + "]" if ax is not None else ""
        sym = self.symbol
        if kind == "identity":
            return f"{sym}: identity{tail}"
        if kind == "inversion":
            return f"{sym}: inversion{tail}"
        if kind == "mirror":
            return f"{sym}: mirror, normal {axs}{tail}"
        sense = {1: ", counter-clockwise", -1: ", clockwise", 0: ""}[self.sense]
        num = sym.lstrip("-").rstrip("+-'")
        if num.startswith("R("):  # no finite order: the angle is in the symbol
            return f"{sym}: rotation{'oinversion' if kind != 'rotation' else ''}{sense}, axis {axs}{tail}"
        if "^" in num:  # a power n^k: say the angle
            n, k = (int(x) for x in num.split("^"))
            num = f"{n}-fold"
            by = f" by {sp.sstr(sp.Rational(360 * k, n))} degrees"
        else:
            num, by = f"{num}-fold", ""
        if kind == "rotation":
            return f"{sym}: {num} rotation{by}{sense}, axis {axs}{tail}"
        return f"{sym}: {num} rotoinversion{by}{sense}, axis {axs}{tail}"

    def triplet(self, basis="cartesian"):
        """The coordinate triplet, e.g. ``-y,x-y,z`` (basis 'cartesian' or 'hexagonal').

        Raises
        ------
        InvalidOperationError
            If the basis is unknown or the matrix is not rational in that basis.
        """
        if basis not in _BASES:
            raise InvalidOperationError(f"basis {echo(basis)} is not one of {_BASES}")
        m = sp.Matrix(self.matrix)
        if basis == "hexagonal":
            m = (_HEX_INV * m * HEXAGONAL_BASIS).applyfunc(lambda e: sp.expand(sp.radsimp(e)))
        parts = []
        for i in range(3):
            terms = []
            for j, var in enumerate("xyz"):
                c = m[i, j]
                if not c.is_Rational:
                    c = sp.expand(sp.radsimp(c))
                    if not c.is_Rational and mq_entry(c) is None:
                        c = sp.nsimplify(sp.simplify(c))
                if c == 0:
                    continue
                if c == 1:
                    terms.append(("+", var))
                elif c == -1:
                    terms.append(("-", var))
                elif c.is_Add:
                    # a sum such as 1/4 + sqrt(5)/4 needs brackets to stay a factor
                    terms.append(("+", f"({sp.sstr(c).replace(' ', '')})*{var}"))
                elif c.is_negative:
                    terms.append(("-", f"{sp.sstr(-c).replace(' ', '')}*{var}"))
                else:
                    terms.append(("+", f"{sp.sstr(c).replace(' ', '')}*{var}"))
            if not terms:
                parts.append("0")
                continue
            s = "".join(sg + t for sg, t in terms)
            parts.append(s[1:] if s.startswith("+") else s)
        out = ",".join(parts)
        return out + (",-1" if self.time_reversal else "")
