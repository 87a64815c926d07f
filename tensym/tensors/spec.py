"""Tensor specifications: rank, intrinsic index symmetry, axial and time parity.

Conventions
-----------
* Index letters: a rank-n tensor's indices are named by the first n letters of
  ``INDEX_LETTERS`` (``"ijklmnpqrstuvw"``; ``o`` is skipped), so the identity
  order of a rank-4 tensor is ``"ijkl"``.
* A symmetry string such as ``"jikl"`` states T_ijkl = T_jikl; a leading ``-``
  states antisymmetry, T_ij = -T_ji for ``"-ji"``.  The strings generate a group
  of signed index permutations; components fixed by a permutation of sign -1
  vanish.
* Polar tensors transform with R in every index; axial ones with det(R) R, that
  is with an extra factor det(R); time-odd ones change sign under primed
  (time-reversed) operations.

Examples
--------
>>> from tensym.tensors.spec import TensorSpec
>>> TensorSpec(4, ["jikl", "ijlk", "klij"]).dim
21
>>> TensorSpec(2, ["-ji"]).dim
3
"""

from dataclasses import dataclass, field
from functools import cached_property, lru_cache
from itertools import product

import numpy as np
import sympy as sp

from tensym.errors import InvalidArgumentError, InvalidSpecError, MemoryLimitError, RankLimitError

__all__ = ["TensorSpec", "INDEX_LETTERS", "MAX_RANK", "MEMORY_LIMIT", "require_memory", "orbit_table_bytes"]

INDEX_LETTERS = "ijklmnpqrstuvw"
#: Highest rank accepted (3**MAX_RANK components are enumerated once per spec).
MAX_RANK = 10
#: Memory budget in bytes for one table or dense array built on a tensor space
#: (3 GiB).  Allocations estimated above it raise :class:`MemoryLimitError`
#: before anything is allocated; set this module attribute to change it.
MEMORY_LIMIT = 3 * 2**30


def _flag(name, value):
    """``value`` as a Python bool when it is a real boolean (bool or numpy.bool_), else an error.

    Strings such as ``"no"`` or ``"False"`` and numbers such as 0 are refused:
    ``bool("no")`` is True, so accepting them would silently give the opposite
    of what was meant.
    """
    if isinstance(value, (bool, np.bool_)):
        return bool(value)
    raise InvalidArgumentError(
        f"{name} must be True or False (a bool or numpy.bool_), got {type(value).__name__} {_cut(repr(value))}"
    )


def _cut(text, limit=60):
    """A long input shortened for an error message."""
    return text if len(text) <= limit else text[: limit - 5] + "[...]"


def _parse_symmetry(text, rank):
    if isinstance(text, (tuple, list)):
        sign, perm = -1 if (len(text) == 2 and text[0] == -1) else 1, None
        raise InvalidSpecError(
            f"symmetry {text!r} must be a permuted index string such as 'jikl' or '-ji'"
        )
    if not isinstance(text, str):
        raise InvalidSpecError(f"symmetry {text!r} must be a string such as 'jikl' or '-ji'")
    s = text.strip()
    sign = 1
    if s.startswith("-"):
        sign, s = -1, s[1:]
    elif s.startswith("+"):
        s = s[1:]
    ident = INDEX_LETTERS[:rank]
    if len(s) != rank or sorted(s) != sorted(ident):
        raise InvalidSpecError(
            f"symmetry {text!r} is not a permutation of the index letters {ident!r} of a rank-{rank} tensor"
        )
    # position p of the permuted string holds the letter of original position perm[p]
    perm = tuple(ident.index(ch) for ch in s)
    if perm == tuple(range(rank)) and sign == -1:
        raise InvalidSpecError(f"symmetry {text!r} would make every component vanish (T = -T)")
    return sign, perm


def _close_perms(gens, rank):
    ident = (1, tuple(range(rank)))
    seen = {ident[1]: 1}
    frontier = [ident]
    while frontier:
        nxt = []
        for s, p in frontier:
            for gs, gp in gens:
                q = tuple(p[gp[k]] for k in range(rank))
                qs = s * gs
                if q in seen:
                    if seen[q] != qs:
                        return None
                    continue
                seen[q] = qs
                nxt.append((qs, q))
        frontier = nxt
    return seen


def _cycle_lengths(perm):
    n = len(perm)
    seen = [False] * n
    out = []
    for i in range(n):
        if seen[i]:
            continue
        k, j = 0, i
        while not seen[j]:
            seen[j] = True
            j = perm[j]
            k += 1
        out.append(k)
    return tuple(sorted(out))


class _Orbits:
    """Orbits of index tuples under the signed permutation group (private kernel data, read-only).

    Attributes: rank; reps (tuple of index tuples, one per non-vanishing orbit,
    in enumeration order); orbit_of (int64 array over flat indices: orbit
    number or -1); sign_of (int64 array: +1/-1, 0 for vanishing); members
    (tuple of int64 flat-index arrays, one per orbit); weights (int64 array
    3**(rank-1), ..., 1 turning an index tuple into its flat index).

    The object is shared by every spec with the same rank and index symmetry
    (a process-wide cache), so it is frozen: its attributes cannot be
    rebound and every array has ``flags.writeable = False``.  The kernels'
    derived tables ``_reparr`` (the representatives as an int64 array
    (n, rank)) and ``_agg`` (member order, signs and orbit starts for summing
    columns into orbits) are computed once on first use, read-only too.
    """

    def __init__(self, rank, gens):
        n = 3**rank
        orbit_of = np.full(n, -1, dtype=np.int64)
        sign_of = np.zeros(n, dtype=np.int64)
        visited = np.zeros(n, dtype=bool)
        weights = (3 ** np.arange(rank - 1, -1, -1)).astype(np.int64)
        reps, members = [], []
        for flat, idx in enumerate(product(range(3), repeat=rank)):
            if visited[flat]:
                continue
            signs = {idx: 1}
            stack = [idx]
            zero = False
            while stack:
                t = stack.pop()
                st = signs[t]
                for gs, gp in gens:
                    u = tuple(t[gp[k]] for k in range(rank))
                    su = st * gs
                    if u in signs:
                        if signs[u] != su:
                            zero = True
                        continue
                    signs[u] = su
                    stack.append(u)
            flats = np.array([int(np.dot(weights, t)) for t in signs], dtype=np.int64)
            visited[flats] = True
            if zero:
                continue
            o = len(reps)
            orbit_of[flats] = o
            sign_of[flats] = np.array(list(signs.values()), dtype=np.int64)
            reps.append(idx)
            members.append(_read_only(flats))
        d = self.__dict__
        d["rank"] = rank
        d["reps"] = tuple(reps)
        d["orbit_of"] = _read_only(orbit_of)
        d["sign_of"] = _read_only(sign_of)
        d["members"] = tuple(members)
        d["weights"] = _read_only(weights)

    def __setattr__(self, name, value):
        raise AttributeError(f"the orbit tables of a tensor space are shared and read-only (cannot set {name!r})")

    def __delattr__(self, name):
        raise AttributeError(f"the orbit tables of a tensor space are shared and read-only (cannot delete {name!r})")

    def locate(self, idx):
        """(orbit, sign) of an index tuple; orbit -1 for a vanishing component."""
        f = int(np.dot(self.weights, idx))
        return int(self.orbit_of[f]), int(self.sign_of[f])

    @cached_property
    def _reparr(self):
        """The representatives as a read-only int64 array of shape (n_orbits, rank)."""
        return _read_only(np.array(self.reps, dtype=np.int64).reshape(len(self.reps), self.rank))

    @cached_property
    def _agg(self):
        """(order, signs, starts): flat indices of the non-vanishing components sorted by orbit
        (stable), their signs, and where each orbit starts in ``order`` (read-only int64 arrays)."""
        flats = np.nonzero(self.orbit_of >= 0)[0]
        order = flats[np.argsort(self.orbit_of[flats], kind="stable")]
        starts = np.searchsorted(self.orbit_of[order], np.arange(len(self.reps)))
        return _read_only(order), _read_only(self.sign_of[order]), _read_only(starts)

    def dense_bytes(self, columns="components", *, itemsize=8, copies=1):
        """Bytes of ``copies`` dense arrays with one row per orbit.

        ``columns`` is ``"components"`` (3**rank columns: an operation's action
        on every component, as the Kronecker kernels build it) or ``"orbits"``
        (n_orbits columns: an action matrix on the reduced space).
        """
        width = {"components": 3**self.rank, "orbits": len(self.reps)}[columns]
        return len(self.reps) * width * itemsize * copies

    def require(self, nbytes, what):
        """Refuse an allocation of about ``nbytes`` bytes past :data:`MEMORY_LIMIT`.

        Raises
        ------
        MemoryLimitError
            With the estimate, the limit and what to change.
        """
        require_memory(nbytes, what, rank=self.rank, dim=len(self.reps))


def _read_only(arr):
    """A read-only view of ``arr`` over a read-only base, so that the flag cannot be switched back on."""
    if arr.base is not None:  # a view of a writable array: own the data first
        arr = arr.copy()
    arr.flags.writeable = False
    view = arr.view()
    view.flags.writeable = False
    return view


#: Bytes per tensor component of the orbit tables (flat int64 tables, the
#: member arrays and the representative tuples; about 260 measured at rank 10
#: without index symmetry, rounded up).
_TABLE_BYTES_PER_COMPONENT = 320


def _format_bytes(n):
    for unit, size in (("GiB", 2**30), ("MiB", 2**20), ("KiB", 2**10)):
        if n >= size:
            return f"{n / size:.1f} {unit}"
    return f"{int(n)} bytes"


def require_memory(nbytes, what, *, rank=None, dim=None):
    """Raise :class:`MemoryLimitError` when an allocation of ``nbytes`` would pass :data:`MEMORY_LIMIT`.

    Parameters
    ----------
    nbytes : int
        Estimated size in bytes.
    what : str
        What would be allocated, for the message (e.g. ``"the orbit tables"``).
    rank, dim : int, optional
        The tensor space, for the message.

    Examples
    --------
    >>> require_memory(2**20, "a small table")
    >>> require_memory(2**50, "a huge table")
    Traceback (most recent call last):
    ...
    tensym.errors.MemoryLimitError: a huge table would need about 1048576.0 GiB, over the memory limit of 3.0 GiB (tensym.tensors.spec.MEMORY_LIMIT); use a lower rank or more index symmetry
    """
    limit = MEMORY_LIMIT
    if nbytes <= limit:
        return
    space = ""
    if rank is not None:
        space = f" for the rank-{rank} tensor space" + (f" ({dim} components after index symmetry)" if dim else "")
    raise MemoryLimitError(
        f"{what}{space} would need about {_format_bytes(nbytes)}, over the memory limit of "
        f"{_format_bytes(limit)} (tensym.tensors.spec.MEMORY_LIMIT); use a lower rank or more index symmetry"
    )


def orbit_table_bytes(rank):
    """Upper estimate in bytes of the orbit tables of a rank-``rank`` tensor space.

    Examples
    --------
    >>> orbit_table_bytes(4) == 81 * _TABLE_BYTES_PER_COMPONENT
    True
    """
    return 3**rank * _TABLE_BYTES_PER_COMPONENT


@lru_cache(maxsize=256)
def _orbits(rank, gens):
    require_memory(orbit_table_bytes(rank), "the orbit tables", rank=rank)
    return _Orbits(rank, gens)


@dataclass(frozen=True)
class TensorSpec:
    """A tensor of given rank with intrinsic index symmetry and parity.

    Parameters
    ----------
    rank : int
        Number of indices, 0 <= rank <= MAX_RANK.
    symmetries : sequence of str
        Permuted index strings, each an equality with the identity order
        (``"jikl"`` means T_ijkl = T_jikl; ``"-ji"`` means T_ij = -T_ji).
    axial : bool
        Transforms with an extra factor det(R) (a pseudo-tensor).  Only
        ``True``/``False`` (or numpy.bool_) are accepted: a string such as
        ``"no"`` is an error, not a true value.
    time_odd : bool
        Changes sign under operations combined with time reversal (same
        rule as ``axial``).

    Raises
    ------
    InvalidSpecError
        For a malformed symmetry string, symmetries that are not a list of
        strings, or symmetries that contradict each other (``["ji", "-ji"]``).
    InvalidArgumentError
        For ``axial`` or ``time_odd`` other than a bool (``"no"``, ``0``, None).
    RankLimitError
        For a rank outside 0..MAX_RANK.

    Examples
    --------
    >>> s = TensorSpec(3, ["ikj"])
    >>> s.dim, s.symmetries
    (18, ('ikj',))
    >>> TensorSpec(2, ["ji", "-ji"])
    Traceback (most recent call last):
    ...
    tensym.errors.InvalidSpecError: symmetries ('ji', '-ji') contradict each other: some permutation would equal both +T and -T
    """

    rank: int
    symmetries: tuple = ()
    axial: bool = False
    time_odd: bool = False
    _gens: tuple = field(init=False, repr=False, compare=False)
    _group: dict = field(init=False, repr=False, compare=False)

    def __post_init__(self):
        if isinstance(self.rank, bool) or not isinstance(self.rank, (int, np.integer)):
            raise InvalidSpecError(f"rank must be an integer, got {self.rank!r}")
        if not 0 <= int(self.rank) <= MAX_RANK:
            raise RankLimitError(f"rank {self.rank} is outside the supported range 0..{MAX_RANK}")
        object.__setattr__(self, "rank", int(self.rank))
        if isinstance(self.symmetries, str):
            raise InvalidSpecError(
                f"symmetries must be a list of strings, e.g. [{_cut(repr(self.symmetries))}], not a bare string"
            )
        if not isinstance(self.symmetries, (list, tuple)):
            raise InvalidSpecError(
                f"symmetries must be a list or tuple of index strings such as ['jikl', 'ijlk'], "
                f"got {type(self.symmetries).__name__} {_cut(repr(self.symmetries))}"
            )
        bad = [s for s in self.symmetries if not isinstance(s, str)]
        if bad:
            raise InvalidSpecError(
                f"each symmetry must be a string such as 'jikl' or '-ji', got {type(bad[0]).__name__} "
                f"{_cut(repr(bad[0]))}"
            )
        syms = tuple(s.strip() for s in self.symmetries)
        object.__setattr__(self, "symmetries", syms)
        gens = tuple(sorted({_parse_symmetry(s, self.rank) for s in syms}))
        group = _close_perms(gens, self.rank)
        if group is None:
            raise InvalidSpecError(
                f"symmetries {syms!r} contradict each other: some permutation would equal both +T and -T"
            )
        object.__setattr__(self, "axial", _flag("axial", self.axial))
        object.__setattr__(self, "time_odd", _flag("time_odd", self.time_odd))
        object.__setattr__(self, "_gens", gens)
        object.__setattr__(self, "_group", group)

    @property
    def orbits(self):
        """Private kernel data: the orbit structure of index tuples (shared and read-only).

        Raises
        ------
        MemoryLimitError
            When the tables (about 320 bytes per component, 3**rank
            components) would pass :data:`MEMORY_LIMIT`.
        """
        return _orbits(self.rank, self._gens)

    @property
    def dim(self):
        """Dimension of the space the index symmetry leaves (e.g. 21 for elasticity)."""
        return len(self.orbits.reps)

    @property
    def basis_indices(self):
        """Representative index tuple (0-based) of each basis orbit, in basis order."""
        return self.orbits.reps

    def permutation_group(self):
        """The signed index permutations generated by ``symmetries``: tuple of (sign, perm)."""
        return tuple(sorted((s, p) for p, s in self._group.items()))

    @property
    def cycle_index(self):
        """Cycle structure of the permutation group: tuple of (sign, cycle lengths), one per element."""
        return tuple(sorted((s, _cycle_lengths(p)) for p, s in self._group.items()))

    def parity(self, op):
        """The scalar factor (+1/-1) of ``op`` from axial and time-odd parity."""
        f = 1
        if self.axial and op.det < 0:
            f = -f
        if self.time_odd and op.time_reversal:
            f = -f
        return f

    def character(self, op):
        """Exact character of ``op`` on this tensor space.

        chi(g) = parity(g) * (1/|S|) * sum over s in S of sign(s) * prod over cycles c of s
        of tr(R^len(c)), with S the signed permutation group of the index symmetry.

        Examples
        --------
        >>> from tensym.groups.operations import Operation
        >>> TensorSpec(4, ["jikl", "ijlk", "klij"]).character(Operation.identity())
        21
        """
        traces = _power_traces(op.matrix, self.rank)
        total = sp.Integer(0)
        for sign, cycles in self.cycle_index:
            term = sp.Integer(sign)
            for c in cycles:
                term *= traces[c]
            total += term
        return sp.nsimplify(sp.expand(total / len(self._group))) * self.parity(op)

    def as_space(self):
        """This tensor space as a :class:`tensym.reps.space.Space`."""
        from tensym.tensors.space import TensorSpace

        return TensorSpace(self)


def _power_traces(matrix, n):
    m = sp.Matrix(matrix)
    p = sp.eye(3)
    out = {}
    for k in range(1, n + 1):
        p = (p * m).applyfunc(sp.expand)
        out[k] = sp.expand(p.trace())
    return out
