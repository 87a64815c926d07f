"""The reduction formula: multiplicities of irreps in a representation (private kernel).

n(Gamma) = (1/|G|) sum over classes C of |C| chi_V(g_C) conj(chi_Gamma(g_C)).

Space characters are exact sympy numbers.  When they are all rational the sum
is done in exact cyclotomic arithmetic; otherwise in sympy, and the result,
which must be a non-negative integer, is simplified until it is one (a
50-digit evaluation confirms the integer when sympy cannot finish the
simplification, and a non-integer raises).

Examples
--------
>>> from tensym.groups import point_group
>>> from tensym.reps.table import finite_table
>>> from tensym.reps.spaces import harmonics
>>> t = finite_table(point_group("m-3m"))
>>> m = multiplicities(t, space_characters(harmonics(2), t))
>>> {k: v for k, v in m.items() if v}
{'Eg': 1, 'T2g': 1}
"""

from fractions import Fraction

import sympy as sp

from tensym.errors import RepresentationError
from tensym.reps.cyclotomic import Cyclotomic

__all__ = ["space_characters", "multiplicities", "to_int"]


_CHAR_CACHE = {}


def _space_key(space):
    """A value key for spaces that have one (harmonics, polynomials, tensor specs), else None."""
    from tensym.reps.spaces import HarmonicSpace, PolynomialSpace

    if isinstance(space, (HarmonicSpace, PolynomialSpace)):
        return ("fn", repr(space))
    spec = getattr(space, "spec", None)
    if spec is not None:
        try:
            hash(spec)
        except TypeError:
            return None
        return ("spec", type(space).__name__, spec)
    return None


def space_characters(space, table):
    """Exact characters of ``space`` at one representative of each class (table order).

    Cached per (space, group setting) for spaces with a value key (harmonics,
    polynomials, tensor specs).
    """
    skey = _space_key(space)
    key = None
    if skey is not None:
        from tensym.reps.table import group_key

        key = (skey, group_key(table.group))
        hit = _CHAR_CACHE.get(key)
        if hit is not None:
            return hit
    out = []
    for c in table.classes:
        v = sp.sympify(space.character(c.representative))
        out.append(v)
    out = tuple(out)
    if key is not None:
        if len(_CHAR_CACHE) > 4096:
            _CHAR_CACHE.clear()
        _CHAR_CACHE[key] = out
    return out


def to_int(value, what="multiplicity"):
    """An exact sympy number that must be an integer, as int (else ArithmeticError)."""
    v = sp.nsimplify(sp.expand(value)) if not isinstance(value, (int, sp.Integer)) else value
    if not (isinstance(v, int) or v.is_Integer):
        v2 = sp.simplify(v)
        if v2.is_Integer:
            v = v2
        else:
            num = sp.N(v, 50)
            re, im = num.as_real_imag()
            k = int(sp.Integer(round(float(re))))
            if abs(re - k) > sp.Float(10) ** -40 or abs(im) > sp.Float(10) ** -40:
                raise ArithmeticError(f"{what} {value} is not an integer")
            v = k
    return int(v)


def _weights(table, label):
    """conj(chi(C)) |C| / |G| per class as Cyclotomic numbers, cached on the table (private)."""
    cache = table.__dict__.setdefault("_reduction_weights", {})
    hit = cache.get(label)
    if hit is None:
        row = table._cyclo(label)
        order = table.order
        hit = tuple(x.conjugate() * Fraction(c.size, order) for x, c in zip(row, table.classes))
        cache[label] = hit
    return hit


def multiplicities(table, chars, *, real=True):
    """Mapping label -> multiplicity (int) of the table's irreps in characters ``chars``.

    ``real=True`` uses :attr:`CharacterTable.real_irreps` (complex pairs combined),
    ``real=False`` the complex irreps.
    """
    irreps = table.irreps
    sizes = [c.size for c in table.classes]
    order = table.order
    values = [sp.sympify(v) for v in chars]
    rational = all(v.is_Rational for v in values)
    if rational:
        qs = [Fraction(int(v.p), int(v.q)) for v in values]
    out = {}
    for irr in irreps:
        if rational:
            weights = _weights(table, irr.label)
            total = Cyclotomic.rational(0, weights[0].n)
            for w, q in zip(weights, qs):
                if q:
                    total = total + w * q
            val = total
            if not val.is_rational:
                raise ArithmeticError(f"multiplicity of {irr.label} is not rational: {val.to_sympy()}")
            q = val.rational_value()
            if q.denominator != 1:
                raise RepresentationError(
                    f"the characters are not those of a representation of the group "
                    f"(multiplicity of {irr.label} would be {q})"
                )
            m = int(q)
        else:
            total = sp.Integer(0)
            for s, v, x in zip(sizes, chars, irr.characters):
                total += s * v * sp.conjugate(x)
            m = to_int(sp.expand(total / order), f"multiplicity of {irr.label}")
        if m < 0:
            raise RepresentationError(f"negative multiplicity {m} of {irr.label}: not a representation")
        out[irr.label] = m
    if not real:
        return out
    combined = {}
    for irr in table.real_irreps:
        if irr.label in out:
            combined[irr.label] = out[irr.label]
            continue
        members = [i.label for i in table.irreps if i.real_label == irr.label]
        counts = {out[m] for m in members}
        if len(counts) != 1:
            raise RepresentationError(
                f"the space holds the complex irreps {members} unequally ({[out[m] for m in members]}), so it is "
                "not a real representation; decompose it with real=False"
            )
        combined[irr.label] = counts.pop()
    return combined
