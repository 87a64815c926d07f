"""CSV and JSON tensor files: reading, writing, round trips, and every refusal."""

import json

import numpy as np
import pytest

import tensym
from tensym.errors import DataError, InvalidOptionError

CUBIC = """# an invented cubic crystal
# property: elastic_stiffness
# units: GPa
160, 50, 50, 0, 0, 0
50, 160, 50, 0, 0, 0
50, 50, 160, 0, 0, 0
0, 0, 0, 80, 0, 0
0, 0, 0, 0, 80, 0
0, 0, 0, 0, 0, 80
"""


def _write(tmp_path, name, text):
    p = tmp_path / name
    p.write_text(text)
    return p


def test_csv_matrix_with_metadata_and_uncertainty_block(tmp_path):
    text = CUBIC + "# uncertainty\n" + "\n".join(", ".join(["0.5"] * 6) for _ in range(6)) + "\n"
    d = tensym.read_tensor(_write(tmp_path, "c.csv", text))
    assert d.property.name == "elastic_stiffness" and d.units == "GPa" and d.source == "c.csv"
    assert d["c11"] == 160.0 and np.allclose(d.sigma, 0.5)
    r = tensym.check_tensor(d, group="m-3m")
    assert r.passes and r.units == "GPa"


def test_csv_whitespace_and_semicolons(tmp_path):
    text = "# property: dielectric_permittivity\n2 0 0\n0;2;0\n0\t0\t3\n"
    assert tensym.read_tensor(_write(tmp_path, "e.txt", text)).voigt[2, 2] == 3.0


def test_csv_vector_property(tmp_path):
    d = tensym.read_tensor(_write(tmp_path, "p.csv", "0, 0, -4.5\n"), "pyroelectric", units="uC/(m^2 K)")
    assert d.components.tolist() == [0.0, 0.0, -4.5]


def test_csv_long_form_voigt_and_cartesian_labels(tmp_path):
    zeros = "".join(f"{lb},0\n" for lb in ("d11", "d12", "d13", "d14", "d23", "d25", "d26", "d34", "d35", "d36"))
    text = ("# property: piezoelectric_d\n# units: pC/N\ncomponent,value\n"
            "d15,68\n24,68\nd16,-42\nd21,-21\nd22,21\n311,-1\n322,-1\nd33,6\n" + zeros)
    d = tensym.read_tensor(_write(tmp_path, "d.csv", text))
    # '311' is Cartesian d_311 = d31; '24' the Voigt label d24
    assert d["d31"] == -1.0 and d["d24"] == 68.0 and d["d16"] == -42.0
    assert tensym.check_tensor(d, group="3m").passes


def test_csv_long_form_cartesian_factor_and_uncertainties(tmp_path):
    lab = tensym.component_labels("piezoelectric_d")
    rows = [f"{lb},0,0.1" for lb in lab if lb != "d14"] + ["123,2.5,0.05"]
    text = "component,value,uncertainty\n" + "\n".join(rows) + "\n"
    d = tensym.read_tensor(_write(tmp_path, "d.csv", text), "piezoelectric_d")
    # d_123 = d14 / 2 (IEEE Std 176-1987, from memory): the file's 2.5 is d14 = 5
    assert d["d14"] == 5.0 and d.sigma[lab.index("d14")] == pytest.approx(0.1)


def test_csv_long_form_third_order(tmp_path):
    zeros = "".join(f"{lb},0\n" for lb in tensym.component_labels("third_order_elastic")
                    if lb not in ("C111", "C123"))
    text = "component,value\nC111,-2000\nC123,100\nC213,100\n" + zeros
    d = tensym.read_tensor(_write(tmp_path, "t.csv", text), "third_order_elastic")
    assert d["C111"] == -2000.0 and d["C123"] == 100.0


def test_round_trips(tmp_path):
    c = np.array(tensym.tensor_form("elastic_stiffness", "-3m").evaluate([87., 7., 12., -18., 107., 58.]))
    d = tensym.tensor_data(c, "elastic_stiffness", sigma=np.full((6, 6), 0.2), units="GPa")
    for name in ("x.json", "x.csv"):
        tensym.write_tensor(d, tmp_path / name)
        back = tensym.read_tensor(tmp_path / name)
        assert np.allclose(back.components, d.components) and np.allclose(back.covariance, d.covariance)
        assert back.units == "GPa"
    cov = np.eye(21) * 0.04
    cov[0, 1] = cov[1, 0] = 0.01
    dc = tensym.tensor_data(c, "elastic_stiffness", covariance=cov)
    tensym.write_tensor(dc, tmp_path / "cov.json")
    assert np.allclose(tensym.read_tensor(tmp_path / "cov.json").covariance, cov)
    with pytest.raises(DataError, match="full covariance cannot be written to CSV"):
        tensym.write_tensor(dc, tmp_path / "cov.csv")
    t = tensym.tensor_data(np.zeros((6, 6, 6)), "third_order_elastic")
    tensym.write_tensor(t, tmp_path / "t.csv")
    assert "component,value" in (tmp_path / "t.csv").read_text()


def test_json_components_dict(tmp_path):
    obj = {"format": "tensym-data/1", "property": "piezoelectric_d", "units": "pC/N",
           "values": {"d11": 2.31, "d12": -2.31, "d14": -0.727, "d25": 0.727, "d26": -4.62}}
    obj["values"].update({lb: 0 for lb in tensym.component_labels("piezoelectric_d") if lb not in obj["values"]})
    d = tensym.read_tensor(_write(tmp_path, "q.json", json.dumps(obj)))
    assert d["d26"] == -4.62 and tensym.check_tensor(d, group="32").passes


@pytest.mark.parametrize("text, match", [
    ("# property: elastic_stiffness\n1, 2, x\n", r"line 2: 'x' is not a number"),
    ("# property: dielectric_permittivity\n1, 0, 0\n0, 1\n0, 0, 1\n", "line 3: rows of the values"),
    ("# property: dielectric_permittivity\n1,0,0\n0,1,0\n0,0,1\n# sigma\n1,1,1\n1,1,1\n1,1,1\n# sigma\n1,1,1\n",
     "more than one '# uncertainty' block"),
    ("# property: dielectric_permittivity\n# only comments\n", "no values found"),
    ("1, 0, 0\n", "does not say which property"),
    ("# property: third_order_elastic\n1, 2\n", r"Voigt shape \(6, 6, 6\); write it in long form"),
    ("# property: piezoelectric_d\ncomponent,number\nd11,1\n", "long-form header must be"),
    ("# property: piezoelectric_d\ncomponent,value\nd11,1,2\n", r"line 3: expected 2 fields"),
    ("# property: piezoelectric_d\ncomponent,value\nd71,1\n", r"line 3: 'd71' is not a component"),
    ("# property: piezoelectric_d\ncomponent,value\nd11,1\n11,2\n", "d11 is 1 on line 3 but 2 on line 4"),
    ("# property: piezoelectric_d\ncomponent,value,uncertainty\nd11,1,0\n", "uncertainty must be strictly"),
])
def test_csv_refusals(tmp_path, text, match):
    with pytest.raises(DataError, match=match):
        tensym.read_tensor(_write(tmp_path, "bad.csv", text))


def test_csv_long_form_vanishing_component_and_disagreeing_uncertainties(tmp_path):
    spec = tensym.TensorSpec(2, ["-ji"])
    with pytest.raises(DataError, match="vanishes by the index symmetry"):
        tensym.read_tensor(_write(tmp_path, "a.csv", "component,value\n11,1\n"), spec)
    lab = tensym.component_labels("dielectric_permittivity")
    rows = [f"{lb},1,0.1" for lb in lab] + ["21,1,0.2"]
    with pytest.raises(DataError, match="uncertainties given for epsilon12 disagree"):
        tensym.read_tensor(_write(tmp_path, "e.csv", "component,value,uncertainty\n" + "\n".join(rows)),
                           "dielectric_permittivity")


def test_file_level_refusals(tmp_path):
    with pytest.raises(DataError, match="cannot read"):
        tensym.read_tensor(tmp_path / "missing.csv", "elastic_stiffness")
    with pytest.raises(InvalidOptionError, match="format='xml' is not one of auto, csv, json"):
        tensym.read_tensor(tmp_path / "x.csv", format="xml")
    p = _write(tmp_path, "c.csv", CUBIC)
    with pytest.raises(DataError, match="gives property 'elastic_stiffness' but 'elastic_compliance'"):
        tensym.read_tensor(p, "elastic_compliance")
    with pytest.raises(DataError, match="gives units 'GPa' but 'MPa'"):
        tensym.read_tensor(p, units="MPa")
    with pytest.raises(DataError, match="needs a TensorData"):
        tensym.write_tensor(np.eye(3), tmp_path / "x.json")


@pytest.mark.parametrize("obj, match", [
    ("[1, 2", "not valid JSON"),
    ([1, 2], "holds one JSON object"),
    ({"property": "pyroelectric", "values": [0, 0, 1], "colour": "red"}, "unknown keys 'colour'"),
    ({"format": "other/2", "property": "pyroelectric", "values": [0, 0, 1]}, "is not 'tensym-data/1'"),
    ({"values": [0, 0, 1]}, "does not say which property"),
    ({"property": "pyroelectric"}, 'no "values"'),
    ({"property": "pyroelectric", "values": [0, 0, 1], "layout": "rows"}, "layout 'rows' is not one of"),
    ({"property": "pyroelectric", "values": [0, 0, 1], "uncertainty": {"p1": 1}}, "must have the form"),
    ({"property": "pyroelectric", "values": [0, 0, 1], "uncertainty": [1, 1, 1],
      "covariance": {"labels": ["p1", "p2", "p3"], "matrix": np.eye(3).tolist()}}, "not both"),
    ({"property": "pyroelectric", "values": [0, 0, 1], "covariance": [[1]]}, "must be {"),
    ({"property": "pyroelectric", "values": [0, 0, 1],
      "covariance": {"labels": ["p1", "p2"], "matrix": np.eye(2).tolist()}}, "missing: p3"),
    ({"property": "pyroelectric", "values": [0, 0, 1],
      "covariance": {"labels": ["p1", "p2", "p3"], "matrix": np.eye(2).tolist()}}, "must be 3 x 3"),
    ({"property": "pyroelectric", "values": {"p4": 1.0}}, "'p4' in values is not a component"),
    ({"property": "pyroelectric", "values": {"p3": "big"}}, r"values\['p3'\] is the string 'big', not a number"),
    ({"property": "dielectric_permittivity", "values": {"12": 1.0, "21": 2.0}}, "given twice"),
])
def test_json_refusals(tmp_path, obj, match):
    text = obj if isinstance(obj, str) else json.dumps(obj)
    with pytest.raises(DataError, match=match):
        tensym.read_tensor(_write(tmp_path, "bad.json", text))


def test_json_covariance_in_any_label_order(tmp_path):
    obj = {"property": "pyroelectric", "values": [0, 0, 1],
           "covariance": {"labels": ["p3", "p1", "p2"], "matrix": np.diag([9.0, 1.0, 4.0]).tolist()}}
    d = tensym.read_tensor(_write(tmp_path, "p.json", json.dumps(obj)))
    assert d.sigma.tolist() == [1.0, 2.0, 3.0]
