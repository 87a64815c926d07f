"""Every script in worked_examples/ runs on its own and prints its result.

Each script checks its derivation with assertions (so a wrong form or a wrong
derivation makes it exit non-zero) and ends with a line starting 'RESULT:'.
"""

import os
import pathlib
import subprocess
import sys

import pytest

EXAMPLES = sorted((pathlib.Path(__file__).resolve().parent.parent / "worked_examples").glob("*.py"))


def test_there_are_worked_examples():
    assert len(EXAMPLES) >= 3


@pytest.mark.parametrize("script", EXAMPLES, ids=[p.stem for p in EXAMPLES])
def test_worked_example_runs_and_prints_its_result(script):
    env = dict(os.environ, PYTHONIOENCODING="utf-8")
    run = subprocess.run([sys.executable, str(script)], capture_output=True, text=True, timeout=300,
                         cwd=script.parent.parent, env=env)
    assert run.returncode == 0, run.stderr[-3000:]
    assert "Traceback" not in run.stderr
    results = [ln for ln in run.stdout.splitlines() if ln.startswith("RESULT:")]
    assert len(results) == 1, run.stdout[-2000:]
    assert len(results[0]) > len("RESULT: ") + 10
