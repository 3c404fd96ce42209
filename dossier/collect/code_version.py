"""A fingerprint of the code that turns a record into pages: dossier's own, its templates, every calc plugin's
source and distribution version, and the versions of everything installed beside them.

Any change to any of them gives a different fingerprint, so a cached review or page is never served from
other code than the code running now. It is computed once per process (the code cannot change under a
running process: what is imported stays imported); forget() starts again, for tests.
"""

from __future__ import annotations

import functools
import hashlib
import sys
from importlib import metadata
from pathlib import Path

import dossier
from dossier.plugins import GROUP, Calc
from dossier.templates import templates_dir


def code_fingerprint(calcs: list[Calc]) -> str:
    """sha256 over dossier's code and templates, each calc's module sources and version, and the installed
    distributions; the same calcs in another order give another fingerprint (their findings come in that order)."""
    return _fingerprint(tuple(calc_identity(calc) for calc in calcs))


def forget() -> None:
    """Compute every fingerprint afresh (a test changes a plugin's file or version in the same process)."""
    _fingerprint.cache_clear()
    _package_digest.cache_clear()
    _installed.cache_clear()
    _calc_distributions.cache_clear()
    _all_distributions.cache_clear()


def calc_identity(calc: Calc) -> str:
    """A calc's name and where its code lives: the top-level module or package that holds its run function."""
    return f"{calc.name} {calc.order} {_top_module(calc.run)}"


@functools.lru_cache(maxsize=None)
def _fingerprint(identities: tuple[str, ...]) -> str:
    digest = hashlib.sha256()
    parts = [sys.version, _package_digest("dossier"), _folder_digest(templates_dir()), *_installed()]
    for identity in identities:
        top = identity.rsplit(" ", 1)[-1]
        parts += [identity, _package_digest(top), *_distribution_versions(top)]
    for part in parts:
        digest.update(part.encode("utf-8") + b"\0")
    return digest.hexdigest()


def _top_module(run) -> str:
    while isinstance(run, functools.partial):
        run = run.func
    module = getattr(run, "__module__", None) or type(run).__module__
    return module.split(".")[0]


@functools.lru_cache(maxsize=None)
def _package_digest(top: str) -> str:
    """sha256 of every .py file of a top-level package (or of a lone module), read from disk."""
    module = sys.modules.get(top) or (dossier if top == "dossier" else None)
    if module is None:
        return f"{top}: not imported"
    paths = list(getattr(module, "__path__", []) or [])
    if paths:
        return "".join(_folder_digest(Path(path), "*.py") for path in paths)
    source = getattr(module, "__file__", None)
    return _file_digest(Path(source)) if source else f"{top}: no source"


def _folder_digest(folder: Path, pattern: str = "*") -> str:
    digest = hashlib.sha256()
    for path in sorted(p for p in folder.rglob(pattern) if p.is_file() and "__pycache__" not in p.parts):
        digest.update(path.relative_to(folder).as_posix().encode("utf-8") + b"\0" + _file_digest(path).encode("ascii"))
    return digest.hexdigest()


def _file_digest(path: Path) -> str:
    try:
        return hashlib.sha256(path.read_bytes()).hexdigest()
    except OSError:
        return "unreadable"


def _distribution_versions(top: str) -> list[str]:
    names = _calc_distributions().get(top) or _all_distributions().get(top, [])
    return [f"{name} {_version(name)}" for name in sorted(set(names))] or [f"{top}: no distribution"]


@functools.lru_cache(maxsize=1)
def _calc_distributions() -> dict[str, list[str]]:
    """Top-level module -> the distributions whose calc entry points live in it (quick: entry points only)."""
    found: dict[str, list[str]] = {}
    for point in metadata.entry_points(group=GROUP):
        if point.dist is not None:
            found.setdefault(point.module.split(".")[0], []).append(point.dist.metadata["Name"])
    return found


@functools.lru_cache(maxsize=1)
def _all_distributions() -> dict[str, list[str]]:
    """Every top-level module's distributions (slow: reads every installed file list), for a calc not
    registered through an entry point."""
    return metadata.packages_distributions()


def _version(name: str) -> str:
    try:
        return metadata.version(name)
    except metadata.PackageNotFoundError:
        return "absent"


def installed_distributions() -> tuple[str, ...]:
    """Every installed distribution as 'name version', sorted; read once per process."""
    return _installed()


@functools.lru_cache(maxsize=1)
def _installed() -> tuple[str, ...]:
    """Every installed distribution with its version: schemdraw, pint, WeasyPrint and the rest shape pages too."""
    return tuple(sorted({f"{dist.metadata['Name']} {dist.version}" for dist in metadata.distributions()}))
