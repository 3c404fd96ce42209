"""Shared fixtures and the end-of-run count of bad inputs. Helpers live in tests/fixtures/."""

from __future__ import annotations

from pathlib import Path

import pytest

from dossier.plugins import load_calcs
from tests.fixtures.bad_input import BAD_INPUT_TRIED
from tests.fixtures.prerequisites import require, summary
from tests.fixtures.demo import DEMO
from tests.fixtures.site_kit import demo_site, drawing_cache  # noqa: F401  (fixtures for every site test)


def pytest_configure(config):
    config.addinivalue_line("markers", "needs(*tools): system tools the test needs (poppler, pango, chromium); see tests/fixtures/prerequisites.py")


def pytest_report_header(config):
    return summary()


@pytest.hookimpl(tryfirst=True)
def pytest_runtest_setup(item):
    for marker in item.iter_markers("needs"):
        require(*marker.args)


def pytest_terminal_summary(terminalreporter):
    if not BAD_INPUT_TRIED:
        return
    terminalreporter.write_sep("-", f"bad input tried: {sum(BAD_INPUT_TRIED.values())} cases")
    for kind, number in sorted(BAD_INPUT_TRIED.items()):
        terminalreporter.write_line(f"{number:7d}  {kind}")


@pytest.fixture(scope="session")
def demo_archive() -> Path:
    return DEMO


@pytest.fixture(scope="session")
def calcs():
    return load_calcs()
