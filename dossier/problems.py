"""Problems found in input: structured data, put into words by dossier.wording."""

from __future__ import annotations

from dataclasses import dataclass


@dataclass(frozen=True, order=True)
class Location:
    """A place in a file, 1-based line and column as editors show them."""

    file: str
    line: int = 0
    column: int = 0

    def __str__(self) -> str:
        if not self.line:
            return self.file
        return f"{self.file}:{self.line}:{self.column}"


@dataclass(frozen=True)
class Problem:
    """One thing wrong with one input: a stable code, where, and what was expected and found."""

    code: str
    location: Location
    key: str = ""
    expected: str = ""
    found: str = ""
    hint: str = ""


class InputError(Exception):
    """Every problem found in one pass over one or more input files."""

    def __init__(self, problems: list[Problem]):
        super().__init__(f"{len(problems)} problem(s)")
        self.problems = sorted(problems, key=lambda p: p.location)
