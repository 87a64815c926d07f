"""The trivial irrep's multiplicity equals the number of independent constants.

A tensor form is the projection onto the trivial irrep, so decompose() (the
reduction formula on characters) and tensor_form() (the exact solver on
generators) must agree for every catalog property and every group.
"""

import pytest

import tensym
from tensym.groups import point_groups

PROPS = [n for n in tensym.property_names() if tensym.get_property(n).spec.rank <= 6]


@pytest.mark.parametrize("group", list(point_groups()))
def test_trivial_multiplicity_equals_independent_constants(group):
    table = tensym.character_table(group)
    trivial = table.irreps[0].label
    for name in PROPS:
        spec = tensym.get_property(name).spec
        if spec.time_odd:
            continue  # ordinary groups: time-odd tensors are solved like time-even ones
        d = tensym.decompose(name, group)
        assert d[trivial] == tensym.tensor_form(name, group).n_independent, name


@pytest.mark.parametrize("group,trivial", [("O(3)", "D0g"), ("SO(3)", "D0")])
def test_continuous_trivial(group, trivial):
    for name in ("elastic_stiffness", "dielectric_permittivity", "piezoelectric_d", "photoelastic",
                 "optical_activity", "third_order_elastic"):
        assert tensym.decompose(name, group)[trivial] == tensym.tensor_form(name, group).n_independent
