"""The tensym command line: subcommands, formats, and one-line errors with exit status 2."""

import json
import os
import subprocess
import sys

import pytest
import sympy as sp

from tensym.cli import TOUR_GROUPS, TOUR_PROPERTIES, main


def run(capsys, *argv):
    code = main(list(argv))
    out, err = capsys.readouterr()
    return code, out, err


def assert_one_line_error(code, out, err, *needles):
    assert code == 2
    assert out == ""
    lines = err.strip().splitlines()
    assert len(lines) == 1, err
    assert "Traceback" not in err
    for n in needles:
        assert n in lines[0], lines[0]


# --- no arguments and help ---------------------------------------------------------------
def test_no_arguments_prints_the_overview(capsys):
    code, out, err = run(capsys)
    assert code == 0 and err == ""
    for name in ("tour", "groups", "properties", "form", "characters", "split", "correlate", "check", "frame",
                 "identify"):
        assert f"\n  {name} " in out
    assert "examples:" in out


@pytest.mark.parametrize("command", ["tour", "groups", "properties", "form", "characters", "split", "correlate",
                                     "check", "frame", "identify"])
def test_every_command_has_help_with_examples(capsys, command):
    code, out, _ = run(capsys, command, "--help")
    assert code == 0
    assert "examples:" in out and f"tensym {command}" in out


# --- form ---------------------------------------------------------------------------------------
def test_form_prints_the_reduced_matrix(capsys):
    code, out, err = run(capsys, "form", "6mm", "piezoelectric_d")
    assert code == 0 and err == ""
    # Nye 1985, Table 7 (class 6mm): d15 = d24, d31 = d32, d33
    assert "3 independent: d15, d31, d33" in out
    assert "  d24 = d15" in out and "  d32 = d31" in out


def test_form_several_properties_and_schoenflies_symbol(capsys):
    code, out, _ = run(capsys, "form", "C6v", "elastic_stiffness", "piezoelectric_e")
    assert code == 0
    assert out.count("point group 6mm (C6v)") == 2
    # Nye 1985, Table 9 (hexagonal): five constants
    assert "5 independent: c11, c12, c13, c33, c44" in out


def test_form_group_symbols_that_begin_with_a_minus(capsys):
    code, out, _ = run(capsys, "form", "-42m", "piezoelectric_d")
    assert code == 0
    # Nye 1985, Table 7 (class -42m): d14 = d25, d36
    assert "2 independent: d14, d36" in out


def test_form_spec_with_antisymmetry_written_either_way(capsys):
    a = run(capsys, "form", "4/m", "--rank", "2", "--sym", "-ji", "--axial")
    b = run(capsys, "form", "4/m", "--rank", "2", "--sym=-ji", "--axial")
    assert a == b and a[0] == 0
    assert "rank-2 tensor, axial, T_ij = -T_ji" in a[1]


def test_form_spec_counts_like_the_catalog(capsys):
    code, out, _ = run(capsys, "form", "m-3m", "--rank", "4", "--sym", "jikl,ijlk,klij", "--format", "json")
    assert code == 0
    rec = json.loads(out)[0]
    # Nye 1985, Table 9 (cubic): three elastic constants
    assert rec["n_independent"] == 3


def test_form_json_reads_back(capsys):
    code, out, _ = run(capsys, "form", "32", "piezoelectric_d", "--format", "json")
    assert code == 0
    rec = json.loads(out)
    assert isinstance(rec, list) and len(rec) == 1
    names = {s: sp.Symbol(s, real=True) for s in rec[0]["symbols"]}
    row = [sp.sympify(x, locals=names) for x in rec[0]["voigt"][1]]
    # IEEE Std 176-1987 / Nye (class 32): d25 = -d14, d26 = -2 d11
    assert row[4] == -names["d14"] and row[5] == -2 * names["d11"]


def test_form_latex_and_standalone(capsys):
    code, frag, _ = run(capsys, "form", "6mm", "elastic_stiffness", "--format", "latex")
    assert code == 0 and frag.startswith("\\begin{gathered}")
    code, doc, _ = run(capsys, "form", "6mm", "elastic_stiffness", "--format", "latex", "--standalone")
    assert code == 0 and doc.startswith("\\documentclass") and "\\end{document}" in doc


def test_form_markdown(capsys):
    code, out, _ = run(capsys, "form", "4mm", "pyroelectric", "--format", "markdown")
    assert code == 0 and "| **3** | p3 |" in out


# --- listings ---------------------------------------------------------------------------------------------
def test_groups_lists_the_32_classes(capsys):
    code, out, _ = run(capsys, "groups", "--format", "json")
    assert code == 0
    rows = json.loads(out)["rows"]
    assert len(rows) == 32
    # ITA Vol. A, Table 10.1.2.2 (from memory): order of each class
    orders = {r["symbol"]: int(r["order"]) for r in rows}
    assert orders["m-3m"] == 48 and orders["6/mmm"] == 24 and orders["-42m"] == 8 and orders["321"] == 6


def test_groups_settings_and_continuous(capsys):
    code, out, _ = run(capsys, "groups", "--which", "settings")
    assert code == 0 and "-4m2" in out and "312" in out and "112" in out
    code, out, _ = run(capsys, "groups", "--which", "continuous")
    assert code == 0 and "inf/mm" in out and "SO(3)" in out


def test_groups_operations_of_named_groups(capsys):
    code, out, _ = run(capsys, "groups", "-3m", "D2d", "--format", "json")
    assert code == 0
    recs = json.loads(out)
    # ITA Vol. A: orders 12 and 8
    assert [len(r["rows"]) for r in recs] == [12, 8]
    assert "hexagonal triplet" in recs[0]["columns"]


def test_properties_listing(capsys):
    code, out, _ = run(capsys, "properties")
    assert code == 0
    line = [ln for ln in out.splitlines() if ln.strip().startswith("elastic_stiffness ")][0]
    # common practice: 21 independent elastic constants without symmetry
    assert line.split()[-1] == "21"


# --- tour -------------------------------------------------------------------------------------------------
def test_tour_shows_elastic_and_piezoelectric_forms_of_each_group(capsys):
    code, out, _ = run(capsys, "tour")
    assert code == 0
    assert out.count("elastic stiffness c_IJ") == len(TOUR_GROUPS)
    assert out.count("piezoelectric strain coefficients d_iJ") == len(TOUR_GROUPS)
    assert len(TOUR_PROPERTIES) == 2
    # Nye 1985, Table 7 (class -43m): d14 = d25 = d36
    assert "  d36 = d14" in out


def test_tour_other_groups(capsys):
    code, out, _ = run(capsys, "tour", "--groups", "622", "-6m2", "--format", "json")
    assert code == 0
    recs = json.loads(out)
    assert [r["group"]["symbol"] for r in recs] == ["622", "622", "-6m2", "-6m2"]


def test_entry_point_runs_as_a_module():
    run_ = subprocess.run([sys.executable, "-m", "tensym", "form", "m-3m", "elastic_stiffness"],
                          capture_output=True, text=True, timeout=120)
    assert run_.returncode == 0, run_.stderr
    assert "3 independent: c11, c12, c44" in run_.stdout


def test_entry_point_bad_input_has_no_traceback():
    run_ = subprocess.run([sys.executable, "-m", "tensym", "form", "6mmm", "pyroelectric"],
                          capture_output=True, text=True, timeout=120)
    assert run_.returncode == 2
    assert run_.stderr.count("\n") == 1 and "Traceback" not in run_.stderr


# --- bad input ---------------------------------------------------------------------------------------------
def test_unknown_group_names_the_nearest(capsys):
    assert_one_line_error(*run(capsys, "form", "6mmm", "pyroelectric"), "tensym form:", "'6/mmm'", "'6mm'")


def test_unknown_property_names_the_nearest(capsys):
    assert_one_line_error(*run(capsys, "form", "6mm", "elastic_stifness"), "elastic_stiffness")


def test_unknown_command(capsys):
    assert_one_line_error(*run(capsys, "frobnicate"), "invalid choice", "tour")


def test_bad_format_lists_the_accepted_ones(capsys):
    assert_one_line_error(*run(capsys, "form", "6mm", "pyroelectric", "--format", "html"),
                          "text", "latex", "markdown", "json")


def test_standalone_needs_latex(capsys):
    assert_one_line_error(*run(capsys, "form", "6mm", "pyroelectric", "--standalone"), "--format latex")


def test_form_needs_a_property_or_a_rank(capsys):
    assert_one_line_error(*run(capsys, "form", "6mm"), "tensym properties")


def test_spec_options_need_a_rank(capsys):
    assert_one_line_error(*run(capsys, "form", "6mm", "pyroelectric", "--axial"), "--rank")


def test_bad_spec_and_rank(capsys):
    assert_one_line_error(*run(capsys, "form", "6mm", "--rank", "2", "--sym", "jik"), "not a permutation")
    assert_one_line_error(*run(capsys, "form", "6mm", "--rank", "11"), "outside the supported range")
    assert_one_line_error(*run(capsys, "form", "6mm", "--rank", "two"), "invalid int value")


def test_operations_of_a_continuous_group_are_refused(capsys):
    assert_one_line_error(*run(capsys, "groups", "SO(3)"), "continuous group")


# --- representations ---------------------------------------------------------------------------------------
def test_characters_of_c4v(capsys):
    code, out, _ = run(capsys, "characters", "C4v", "--format", "json")
    assert code == 0
    rec = json.loads(out)
    # Cotton 1990, Appendix (C4v): five classes, irreps A1 A2 B1 B2 E
    assert [c["name"] for c in rec["classes"]][0] == "E" and len(rec["classes"]) == 5
    assert [i["label"] for i in rec["irreps"]] == ["A1", "A2", "B1", "B2", "E"]


def test_characters_real_forms_of_c3(capsys):
    code, out, _ = run(capsys, "characters", "3", "--real")
    assert code == 0
    # Cotton 1990 (C3): the real form of the E pair has characters 2, -1, -1
    row = [ln.split() for ln in out.splitlines() if ln.startswith("E ")][0]
    assert row[1:] == ["2", "-1", "-1"]


def test_characters_of_a_continuous_group(capsys):
    code, out, _ = run(capsys, "characters", "Dinfh", "--up-to", "1")
    assert code == 0 and "Πu" in out and "Δg" not in out


def test_split_properties_and_d_orbitals(capsys):
    code, out, _ = run(capsys, "split", "m-3m", "--harmonic", "2", "pyroelectric")
    assert code == 0
    lines = out.splitlines()
    # Bethe 1929: l = 2 in Oh gives Eg + T2g; a polar vector in Oh is T1u (Cotton 1990)
    assert "pyroelectric coefficients p_i: T1u  (group m-3m, dimension 3)" in lines
    assert "harmonics of degree l = 2: Eg + T2g  (group m-3m, dimension 5)" in lines


def test_split_basis_in_json(capsys):
    code, out, _ = run(capsys, "split", "4mm", "--degree", "2", "--basis", "--format", "json")
    assert code == 0
    recs = json.loads(out)
    assert [r["kind"] for r in recs] == ["decomposition", "symmetry_adapted_basis"]
    # Cotton 1990 (C4v): quadratic functions x^2+y^2, z^2 (A1), x^2-y^2 (B1), xy (B2), (xz, yz) (E)
    assert recs[0]["text"] == "2A1 + B1 + B2 + E"


def test_split_spec_and_bad_combinations(capsys):
    code, out, _ = run(capsys, "split", "6mm", "--rank", "2", "--sym=-ji", "--axial")
    assert code == 0 and "rank-2 tensor, axial, T_ij = -T_ji:" in out
    assert_one_line_error(*run(capsys, "split", "6mm"), "--harmonic")
    assert_one_line_error(*run(capsys, "split", "6mm", "pyroelectric", "--basis"), "--basis needs")
    assert_one_line_error(*run(capsys, "split", "6mm", "--parity", "g"), "--parity goes with --harmonic")


def test_correlate(capsys):
    code, out, _ = run(capsys, "correlate", "m-3m", "4/mmm")
    assert code == 0
    # Koster et al. 1963, compatibility Oh -> D4h: Eg -> A1g + B1g
    assert any(ln.split()[:1] == ["Eg"] and ln.split()[1:] == ["A1g", "+", "B1g"] for ln in out.splitlines())


# --- data files ---------------------------------------------------------------------------------------------
def _cubic(tmp_path, *, turned):
    import numpy as np

    import tensym

    c = np.zeros((6, 6))
    c[:3, :3] = 60.0
    c[[0, 1, 2], [0, 1, 2]] = 170.0
    c[[3, 4, 5], [3, 4, 5]] = 75.0
    if turned:
        c = tensym.rotate_values(c, tensym.rotation_from_axis_angle([1, 2, 2], 25.0), "elastic_stiffness")
    path = tmp_path / ("turned.csv" if turned else "cubic.json")
    tensym.write_tensor(tensym.tensor_data(c, "elastic_stiffness", units="GPa"), str(path))
    return str(path)


def test_check_a_data_file(capsys, tmp_path):
    code, out, _ = run(capsys, "check", _cubic(tmp_path, turned=False), "m-3m", "--format", "json")
    assert code == 0
    rec = json.loads(out)
    assert rec["verdict"] == "consistent"
    assert {c["name"]: c["value"] for c in rec["constants"]} == pytest.approx({"c11": 170.0, "c12": 60.0,
                                                                              "c44": 75.0})


def test_check_a_turned_tensor_fails_and_frame_finds_the_rotation(capsys, tmp_path):
    path = _cubic(tmp_path, turned=True)
    code, out, _ = run(capsys, "check", path, "m-3m")
    assert code == 3 and out.splitlines()[0].endswith("inconsistent")  # EXIT_INCONSISTENT
    code, out, _ = run(capsys, "frame", path, "m-3m", "--format", "json")
    assert code == 0
    rec = json.loads(out)
    assert rec["residual_fraction"] < 1e-8 and rec["angle_deg"] == pytest.approx(25.0, abs=1e-5)


def test_identify_a_data_file(capsys, tmp_path):
    code, out, _ = run(capsys, "identify", _cubic(tmp_path, turned=True), "--format", "json")
    assert code == 0
    # Forte & Vianello 1996: the cubic class is the highest one of a cubic stiffness (not isotropic)
    assert json.loads(out)["best"] == "cubic"


def test_data_file_errors(capsys, tmp_path):
    assert_one_line_error(*run(capsys, "check", str(tmp_path / "missing.csv"), "m-3m"), "missing.csv")
    bad = tmp_path / "bad.csv"
    bad.write_text("# property: elastic_stiffness\n1, 2, x\n")
    code, out, err = run(capsys, "check", str(bad), "m-3m")
    assert code == 2 and len(err.strip().splitlines()) == 1 and "Traceback" not in err
    path = _cubic(tmp_path, turned=False)
    assert_one_line_error(*run(capsys, "check", path, "m-3m", "--property", "piezoelectric_d"), "piezoelectric_d")


def test_groups_magnetic_listing(capsys):
    code, out, _ = run(capsys, "groups", "--which", "magnetic", "--format", "json")
    assert code == 0
    rows = json.loads(out)["rows"]
    kinds = [r["kind"] for r in rows]
    # Birss 1964: 122 magnetic point groups, 32 ordinary, 32 grey, 58 black-and-white
    assert len(rows) == 122
    assert (kinds.count("ordinary"), kinds.count("grey"), kinds.count("black-and-white")) == (32, 32, 58)


def test_form_in_a_magnetic_group(capsys):
    code, out, _ = run(capsys, "form", "-3'm'", "magnetoelectric")
    assert code == 0
    assert out.splitlines()[1].startswith("magnetic point group -3'm'")
    # Dzyaloshinskii 1959: diagonal, alpha11 = alpha22, alpha33
    assert "2 independent: alpha11, alpha33" in out and "  alpha22 = alpha11" in out


# --- output files -------------------------------------------------------------------------------
def test_output_option_writes_the_file_and_prints_nothing(capsys, tmp_path):
    target = tmp_path / "d.md"
    code, out, err = run(capsys, "form", "6mm", "piezoelectric_d", "--format", "markdown", "-o", str(target))
    assert code == 0 and out == "" and err == ""
    # Nye 1985, Table 7 (class 6mm): d15, d31, d33
    assert "d_{15}" in target.read_text() or "d15" in target.read_text()
    assert sorted(os.listdir(tmp_path)) == ["d.md"]


def test_output_to_an_existing_file_is_refused_without_force(capsys, tmp_path):
    target = tmp_path / "s32.tex"
    target.write_text("my notes\n")
    code, out, err = run(capsys, "form", "32", "elastic_compliance", "--format", "latex", "-o", str(target))
    assert_one_line_error(code, out, err, "s32.tex exists already; add --force to replace it")
    assert target.read_text() == "my notes\n"
    code, out, err = run(capsys, "form", "32", "elastic_compliance", "--format", "latex", "-o", str(target),
                         "--force")
    assert code == 0 and out == "" and target.read_text() != "my notes\n"
    assert sorted(os.listdir(tmp_path)) == ["s32.tex"]


@pytest.mark.parametrize("command", ["tour", "groups", "properties", "form", "characters", "split", "correlate",
                                     "check", "frame", "identify"])
def test_every_command_refuses_to_overwrite_its_output(capsys, tmp_path, command):
    target = tmp_path / "kept.txt"
    target.write_text("kept\n")
    data = _cubic(tmp_path, turned=False)
    argv = {"tour": [], "groups": [], "properties": [], "form": ["6mm", "pyroelectric"],
            "characters": ["4mm"], "split": ["m-3m", "elastic_stiffness"], "correlate": ["m-3m", "4/mmm"],
            "check": [data, "m-3m"], "frame": [data, "m-3m"], "identify": [data]}[command]
    code, out, err = run(capsys, command, *argv, "--output", str(target))
    assert_one_line_error(code, out, err, "kept.txt exists already")
    assert target.read_text() == "kept\n"


def test_force_without_output_and_an_unwritable_output(capsys, tmp_path):
    assert_one_line_error(*run(capsys, "form", "6mm", "pyroelectric", "--force"), "--force goes with --output")
    missing = tmp_path / "no" / "x.txt"
    assert_one_line_error(*run(capsys, "form", "6mm", "pyroelectric", "-o", str(missing)),
                          "cannot write", "No such file or directory")


def test_output_dash_is_standard_output(capsys):
    code, out, _ = run(capsys, "form", "6mm", "pyroelectric", "-o", "-")
    assert code == 0 and "1 independent: p3" in out
