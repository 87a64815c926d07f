"""Issue 11: the orbit tables reachable from a TensorSpec are read-only.

``spec.orbits`` is shared by every spec of the same rank and index symmetry in
the process; writing into ``sign_of`` once changed every later tensor form.
Now the arrays refuse writes (numpy raises ValueError) and the object refuses
new attributes, and a fresh computation is unaffected by the attempts.
The check value: hexagonal elasticity has 5 independent constants (Nye 1957,
ch. VIII, table 9).
"""

import numpy as np
import pytest

import tensym
from tensym.tensors.spec import TensorSpec

ELASTIC = ["jikl", "ijlk", "klij"]


def _arrays(orb):
    yield "orbit_of", orb.orbit_of
    yield "sign_of", orb.sign_of
    yield "weights", orb.weights
    yield "members[0]", orb.members[0]
    yield "_reparr", orb._reparr
    for k, a in enumerate(orb._agg):
        yield f"_agg[{k}]", a


def test_user_writes_into_the_orbit_arrays():
    orb = TensorSpec(4, ELASTIC).orbits
    for name, arr in _arrays(orb):
        assert isinstance(arr, np.ndarray) and not arr.flags.writeable, name
        with pytest.raises(ValueError, match="read-only"):
            arr[0] = 0
        with pytest.raises(ValueError):
            arr.flags.writeable = True  # a view of a read-only base cannot be made writable either


def test_user_rebinds_an_orbit_attribute():
    orb = TensorSpec(4, ELASTIC).orbits
    with pytest.raises(AttributeError, match="read-only"):
        orb.sign_of = np.ones(81, dtype=np.int64)
    with pytest.raises(AttributeError, match="read-only"):
        orb.reps = ()
    with pytest.raises(AttributeError, match="read-only"):
        del orb.members
    with pytest.raises(TypeError):
        orb.members[0] = np.arange(3)  # a tuple


def test_a_fresh_form_is_unaffected_by_the_attempts():
    spec = TensorSpec(4, ELASTIC)
    orb = spec.orbits
    for _name, arr in _arrays(orb):
        try:
            arr[...] = 0
        except ValueError:
            pass
    fresh = tensym.tensor_form(TensorSpec(4, ELASTIC), "6/mmm")
    assert fresh.n_independent == 5
    assert spec.dim == 21 and int(np.count_nonzero(orb.sign_of)) == 81


def test_kernel_tables_are_computed_once():
    orb = TensorSpec(3, ["ikj"]).orbits
    assert orb._reparr is orb._reparr and orb._agg is orb._agg
    assert orb._reparr.shape == (18, 3)
    order, signs, starts = orb._agg
    assert len(order) == 27 and len(starts) == 18 and set(signs.tolist()) == {1}
