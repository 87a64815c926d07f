"""The README: its two set-up commands, .ci/run, and the quickstart session (run as a doctest)."""

import doctest
import pathlib
import re

ROOT = pathlib.Path(__file__).resolve().parents[1]
README = (ROOT / "README.md").read_text(encoding="utf-8")


def test_two_setup_commands_and_ci_run_the_same_tests():
    block = re.search(r"```sh\n(.*?)```", README, re.S).group(1).strip().splitlines()
    assert len(block) == 2
    install_run, install_test = block
    assert "pip install" in install_run and "tensym tour" in install_run
    assert "pip install" in install_test and "pytest" in install_test
    ci = (ROOT / ".ci" / "run").read_text()
    assert install_test.replace('-e ".[test]"', "-q -e \".[test]\"") in ci or install_test in ci


def test_quickstart_session():
    code = re.search(r"## Quickstart.*?```python\n(.*?)```", README, re.S).group(1)
    test = doctest.DocTestParser().get_doctest(code, {}, "README quickstart", "README.md", 0)
    runner = doctest.DocTestRunner(optionflags=doctest.NORMALIZE_WHITESPACE | doctest.ELLIPSIS)
    runner.run(test)
    assert runner.failures == 0 and runner.tries > 10


def test_settings_table_matches_the_catalog():
    import tensym

    for row in tensym.settings_table():
        sym = row[0] if isinstance(row, tuple) else getattr(row, "symbol", None)
        if sym is None:
            continue
        assert f"| `{sym}` |" in README, sym
