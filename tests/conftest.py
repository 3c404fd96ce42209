"""Shared fixtures: the demo archive and loading its records."""

from __future__ import annotations

from collections import Counter
from dataclasses import dataclass
from pathlib import Path

import pytest

from dossier.archive import RevisionFile, load_revision
from dossier.plugins import load_calcs

ROOT = Path(__file__).resolve().parents[1]
DEMO = ROOT / "demo" / "archive"
# Test-only records for what the demo does not show (e.g. a self-oscillating half-bridge); made up for the tests.
RECORDS = ROOT / "tests" / "cases" / "records"

# Bad inputs tried in this run, by kind: the hostile-input tests count every case they feed to dossier,
# and the count is printed at the end of the run.
BAD_INPUT_TRIED: Counter = Counter()


def tried(kind: str) -> None:
    BAD_INPUT_TRIED[kind] += 1


def pytest_terminal_summary(terminalreporter):
    if not BAD_INPUT_TRIED:
        return
    terminalreporter.write_sep("-", f"bad input tried: {sum(BAD_INPUT_TRIED.values())} cases")
    for kind, number in sorted(BAD_INPUT_TRIED.items()):
        terminalreporter.write_line(f"{number:7d}  {kind}")


@pytest.fixture(scope="session")
def demo_archive() -> Path:
    return DEMO


def load_demo(build: str, revision: str = "A"):
    """The validated record of one demo revision."""
    path = DEMO / build / f"rev-{revision}.yaml"
    return load_revision(RevisionFile(build, revision, path)).record


def load_test_record(build: str, revision: str = "A"):
    """The validated record of one test-only record under tests/cases/records."""
    path = RECORDS / build / f"rev-{revision}.yaml"
    return load_revision(RevisionFile(build, revision, path)).record


@pytest.fixture(scope="session")
def calcs():
    return load_calcs()


@dataclass
class FakeEntryPoint:
    """Stands in for an importlib.metadata entry point: loads its target, or raises its error."""

    name: str
    target: object = None
    error: Exception | None = None

    def load(self):
        if self.error:
            raise self.error
        return self.target
