"""Data files as a user meets them: failed writes, odd encodings, overflowing or nested JSON, decimal
commas, conflicting metadata, partial data.  Each test is named by what the user did."""

import json
import os
import stat
import subprocess
import sys
import textwrap

import numpy as np
import pytest

import tensym
import tensym.data.io as tio
from tensym.errors import DataError, InvalidOptionError

EPS = "# property: dielectric_permittivity\n2, 0, 0\n0, 2, 0\n0, 0, 3\n"


def _stiffness():
    c = np.zeros((6, 6))
    c[:3, :3] = 60.0
    c[[0, 1, 2], [0, 1, 2]] = 170.0
    c[[3, 4, 5], [3, 4, 5]] = 75.0
    return tensym.tensor_data(c, "elastic_stiffness", sigma=np.full((6, 6), 0.5), units="GPa")


class _DiskFull:
    """A binary or text file object that writes the first half of what it is given, then fails (ENOSPC)."""

    def __init__(self, fh):
        self._fh = fh

    def write(self, data):
        self._fh.write(data[: len(data) // 2])
        self._fh.flush()
        raise OSError(28, "No space left on device")

    def __getattr__(self, name):
        return getattr(self._fh, name)

    def __enter__(self):
        return self

    def __exit__(self, *exc):
        self._fh.close()


def _leftovers(folder, keep):
    return sorted(set(os.listdir(folder)) - set(keep))


# --- writing -----------------------------------------------------------------------------------
@pytest.mark.parametrize("name", ["eps.csv", "eps.json"])
def test_disk_fills_up_while_overwriting_a_data_file(tmp_path, monkeypatch, name):
    path = tmp_path / name
    tensym.write_tensor(tensym.tensor_data(np.diag([2.0, 2.0, 3.0]), "dielectric_permittivity"), path)
    before = path.read_bytes()
    real_open, real_fdopen = open, os.fdopen
    # both ways a file can be opened for writing fail half-way through the data
    monkeypatch.setattr(tio, "open", lambda *a, **k: _DiskFull(real_open(*a, **k)), raising=False)
    monkeypatch.setattr(tio.os, "fdopen", lambda *a, **k: _DiskFull(real_fdopen(*a, **k)))
    with pytest.raises(OSError, match="No space left on device") as info:
        tensym.write_tensor(_stiffness(), path)
    monkeypatch.undo()
    assert path.read_bytes() == before
    assert _leftovers(tmp_path, [name]) == []
    assert info.value.filename == str(path)  # the message names the user's file, not a temporary one
    assert tensym.read_tensor(path).property.name == "dielectric_permittivity"


@pytest.mark.skipif(not sys.platform.startswith("linux"), reason="RLIMIT_FSIZE behaviour checked on Linux")
def test_file_size_limit_hit_while_overwriting_a_data_file(tmp_path):
    # a real failed write, not a patched one: the kernel refuses bytes past RLIMIT_FSIZE (EFBIG)
    path = tmp_path / "c.json"
    path.write_text(EPS)
    script = textwrap.dedent(f"""
        import resource, signal, sys
        import numpy as np
        import tensym
        signal.signal(signal.SIGXFSZ, signal.SIG_IGN)
        c = np.eye(6) * 100.0
        d = tensym.tensor_data(c, "elastic_stiffness", covariance=np.eye(21) + 0.001)
        resource.setrlimit(resource.RLIMIT_FSIZE, (1024, 1024))
        try:
            tensym.write_tensor(d, {str(path)!r})
        except OSError as exc:
            print("refused", exc.errno)
            sys.exit(0)
        print("written")
    """)
    out = subprocess.run([sys.executable, "-c", script], capture_output=True, text=True, timeout=120)
    assert out.returncode == 0, out.stderr
    assert out.stdout.split()[0] == "refused"
    assert path.read_text() == EPS
    assert _leftovers(tmp_path, ["c.json"]) == []


def test_write_into_a_missing_folder_names_the_file(tmp_path):
    target = tmp_path / "no" / "such" / "eps.csv"
    d = tensym.tensor_data(np.eye(3), "dielectric_permittivity")
    with pytest.raises(FileNotFoundError) as info:
        tensym.write_tensor(d, target)
    assert info.value.filename == str(target)
    assert not (tmp_path / "no").exists()


def test_overwrite_keeps_the_permission_bits_and_leaves_no_temporary_file(tmp_path):
    path = tmp_path / "eps.csv"
    path.write_text(EPS)
    os.chmod(path, 0o640)
    tensym.write_tensor(tensym.tensor_data(np.eye(3) * 4.0, "dielectric_permittivity"), path)
    assert stat.S_IMODE(os.stat(path).st_mode) == 0o640
    assert tensym.read_tensor(path).voigt[0, 0] == 4.0
    assert os.listdir(tmp_path) == ["eps.csv"]


def test_write_without_overwrite_refuses_an_existing_file(tmp_path):
    path = tmp_path / "eps.csv"
    path.write_text(EPS)
    d = tensym.tensor_data(np.eye(3), "dielectric_permittivity")
    with pytest.raises(DataError, match="eps.csv exists already; remove it, or allow overwriting"):
        tensym.write_tensor(d, path, overwrite=False)
    assert path.read_text() == EPS and os.listdir(tmp_path) == ["eps.csv"]
    tensym.write_tensor(d, tmp_path / "new.csv", overwrite=False)
    assert tensym.read_tensor(tmp_path / "new.csv").voigt[0, 0] == 1.0
    with pytest.raises(InvalidOptionError, match="overwrite must be True or False, got 'no'"):
        tensym.write_tensor(d, tmp_path / "x.csv", overwrite="no")
