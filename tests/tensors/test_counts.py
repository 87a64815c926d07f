"""Numbers of independent components for the 32 classes, against published tables.

Sources (counts read from the tables as remembered, i.e. from memory):
- Nye, Physical Properties of Crystals (1985): pyroelectric, dielectric,
  piezoelectric, elastic, photoelastic (elasto-optic) and optical activity.
- Brugger, J. Appl. Phys. 36, 759 (1965) and Fumi (1951-52): third-order
  elastic constants.
"""

import pytest

import tensym

CLASSES = ["1", "-1", "2", "m", "2/m", "222", "mm2", "mmm", "4", "-4", "4/m", "422", "4mm", "-42m",
           "4/mmm", "3", "-3", "32", "3m", "-3m", "6", "-6", "6/m", "622", "6mm", "-6m2", "6/mmm",
           "23", "m-3", "432", "-43m", "m-3m"]


def _row(values):
    return dict(zip(CLASSES, values))


# Nye 1985, tables of pyroelectric (ch. IV), dielectric (ch. IV), piezoelectric d (ch. VII),
# elastic (ch. VIII), photoelastic (ch. XIII) and optical activity (ch. XIV) forms; from memory.
COUNTS = {
    "pyroelectric": _row([3, 0, 1, 2, 0, 0, 1, 0, 1, 0, 0, 0, 1, 0, 0, 1, 0, 0, 1, 0,
                          1, 0, 0, 0, 1, 0, 0, 0, 0, 0, 0, 0]),
    "dielectric_permittivity": _row([6, 6, 4, 4, 4, 3, 3, 3] + [2] * 19 + [1] * 5),
    "piezoelectric_d": _row([18, 0, 8, 10, 0, 3, 5, 0, 4, 4, 0, 1, 3, 2, 0, 6, 0, 2, 4, 0,
                             4, 2, 0, 1, 3, 1, 0, 1, 0, 0, 1, 0]),
    "elastic_stiffness": _row([21, 21, 13, 13, 13, 9, 9, 9, 7, 7, 7, 6, 6, 6, 6, 7, 7, 6, 6, 6]
                              + [5] * 7 + [3] * 5),
    "photoelastic": _row([36, 36, 20, 20, 20, 12, 12, 12, 10, 10, 10, 7, 7, 7, 7, 12, 12, 8, 8, 8,
                          8, 8, 8, 6, 6, 6, 6, 4, 4, 3, 3, 3]),
    "optical_activity": _row([6, 0, 4, 2, 0, 3, 1, 0, 2, 2, 0, 2, 0, 1, 0, 2, 0, 2, 0, 0,
                              2, 0, 0, 2, 0, 0, 0, 1, 0, 1, 0, 0]),
    # Brugger 1965, Table I (number of independent third-order elastic constants); from memory.
    "third_order_elastic": _row([56, 56, 32, 32, 32, 20, 20, 20, 16, 16, 16, 12, 12, 12, 12, 20, 20,
                                 14, 14, 14, 12, 12, 12, 10, 10, 10, 10, 8, 8, 6, 6, 6]),
}


@pytest.mark.parametrize("prop", sorted(COUNTS))
def test_counts_all_32_classes(prop):
    got = {g: tensym.tensor_form(prop, g).n_independent for g in CLASSES}
    assert got == COUNTS[prop]


# Nye 1985 and IEEE Std 176-1987 use the same counts for e as for d (common practice),
# and the compliance s has the same pattern of zeros and ties as c.
@pytest.mark.parametrize("a,b", [("piezoelectric_e", "piezoelectric_d"), ("elastic_compliance", "elastic_stiffness"),
                                 ("piezo_optic", "photoelastic")])
def test_sibling_properties_have_same_counts(a, b):
    for g in CLASSES:
        assert tensym.tensor_form(a, g).n_independent == COUNTS[b][g]


# Isotropic and transversely isotropic media (Nye 1985, ch. VIII; Brugger 1965 for the TOEC): from memory.
@pytest.mark.parametrize("prop,group,n", [
    ("elastic_stiffness", "O(3)", 2), ("elastic_stiffness", "SO(3)", 2), ("elastic_stiffness", "Dinfh", 5),
    ("third_order_elastic", "O(3)", 3), ("piezoelectric_d", "Cinfv", 3), ("piezoelectric_d", "Dinf", 1),
    ("optical_activity", "SO(3)", 1), ("optical_activity", "O(3)", 0), ("dielectric_permittivity", "Dinfh", 2),
    ("photoelastic", "O(3)", 2),
])
def test_continuous_groups(prop, group, n):
    assert tensym.tensor_form(prop, group).n_independent == n


@pytest.mark.parametrize("z,x", [((0, 1, 1), (1, 0, 0)), ((1, 1, 1), (1, -1, 0)), ((1, 2, 2), (0, 1, -1))])
def test_reoriented_continuous_groups_keep_their_counts(z, x):
    # Regression: a re-oriented Lie generator Q L Q^T has irrational entries (here in Q(sqrt 2),
    # Q(sqrt 3)); it must be rescaled exactly, never truncated.  Transverse isotropy keeps 5
    # elastic constants and C∞v 3 piezoelectric ones in any orientation (Nye 1985; from memory).
    R = tensym.rotation_from_axes(new_z=z, new_x=x)
    assert tensym.tensor_form("elastic_stiffness", tensym.reorient("Dinfh", R)).n_independent == 5
    assert tensym.tensor_form("piezoelectric_d", tensym.reorient("Cinfv", R)).n_independent == 3
