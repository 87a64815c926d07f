"""The public API: one explicit list, every name importable and documented."""

import subprocess
import sys

import tensym


def test_all_names_exist_and_have_docstrings():
    assert len(tensym.__all__) == len(set(tensym.__all__))
    for name in tensym.__all__:
        obj = getattr(tensym, name)
        assert obj.__doc__, name


def test_import_is_warning_free():
    # common practice (networkx CI): importing the package raises no warning under -Werror
    subprocess.run([sys.executable, "-Werror", "-c", "import tensym"], check=True)


def test_subpackages_declare_all():
    import tensym.exact, tensym.groups, tensym.reps, tensym.tensors

    for mod in (tensym.exact, tensym.groups, tensym.tensors):
        assert isinstance(mod.__all__, list) and mod.__all__
