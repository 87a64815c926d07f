"""Issue 11: memory is estimated before the tables of a tensor space are allocated.

A rank-10 tensor without index symmetry has 3**10 = 59049 components; a dense
(n_orbits x 3**rank) or (n_orbits x n_orbits) int64 array on it is
59049**2 * 8 bytes = 26 GiB (arithmetic).  Such requests are refused with the
estimate and the limit (``tensym.tensors.spec.MEMORY_LIMIT``) instead of
running the machine out of memory.  Timings and the real limits per class are
measured in benchmarks/hangs.py.
"""

import pytest

import tensym.tensors.spec as spec_module
from tensym.errors import MemoryLimitError, RankLimitError, TensymError
from tensym.tensors.spec import MAX_RANK, MEMORY_LIMIT, TensorSpec, orbit_table_bytes, require_memory


def test_memory_error_is_a_rank_limit_and_a_memory_error():
    assert issubclass(MemoryLimitError, RankLimitError)
    assert issubclass(MemoryLimitError, MemoryError)
    assert issubclass(MemoryLimitError, ValueError)
    assert issubclass(MemoryLimitError, TensymError)


def test_default_limit_is_a_few_gib():
    assert 2 * 2**30 <= MEMORY_LIMIT <= 4 * 2**30


def test_user_asks_for_orbit_tables_past_a_low_limit(monkeypatch):
    # a spec with a symmetry nobody else uses, so the orbit cache cannot answer first
    monkeypatch.setattr(spec_module, "MEMORY_LIMIT", 2**20)
    s = TensorSpec(9, ["-jiklmnpqr", "ijlkmnpqr", "ijklmnprq"])
    with pytest.raises(MemoryLimitError, match=r"the orbit tables for the rank-9 tensor space would need about "
                                               r"6\.0 MiB, over the memory limit of 1\.0 MiB"):
        s.orbits
    with pytest.raises(MemoryError):
        s.dim


def test_orbit_tables_of_the_highest_rank_fit_the_default_limit():
    assert orbit_table_bytes(MAX_RANK) < MEMORY_LIMIT / 100


def test_dense_estimates_count_orbits_and_components():
    # elasticity: 21 orbits of the 81 components (Nye 1957, ch. VIII)
    orb = TensorSpec(4, ["jikl", "ijlk", "klij"]).orbits
    assert orb.dense_bytes() == 21 * 81 * 8
    assert orb.dense_bytes("orbits", itemsize=4, copies=3) == 21 * 21 * 4 * 3
    with pytest.raises(KeyError):
        orb.dense_bytes("rows")


def test_user_asks_for_a_dense_action_on_rank_10_without_index_symmetry():
    orb = TensorSpec(10).orbits
    need = orb.dense_bytes("orbits")
    assert need == 59049**2 * 8
    with pytest.raises(MemoryLimitError, match=r"the action matrix for the rank-10 tensor space \(59049 components "
                                               r"after index symmetry\) would need about 26\.0 GiB, over the memory "
                                               r"limit of 3\.0 GiB"):
        orb.require(need, "the action matrix")


def test_require_memory_passes_below_the_limit():
    require_memory(MEMORY_LIMIT, "exactly the limit")
    with pytest.raises(MemoryLimitError, match="lower rank or more index symmetry"):
        require_memory(MEMORY_LIMIT + 1, "one byte more")
