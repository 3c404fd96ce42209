"""Calc plugins, found through the 'dossier.calcs' entry-point group, built-in ones included."""

from __future__ import annotations

import inspect
from dataclasses import dataclass, field
from importlib.metadata import entry_points
from typing import Callable, Iterable, Mapping

from dossier.findings import Finding

GROUP = "dossier.calcs"


@dataclass(frozen=True)
class Calc:
    """A calc: a pure function from a validated record to findings.

    name    short stable name, also the entry-point name
    title   heading for reports and pages
    run      record -> iterable of Finding, or a CalcResult (findings plus products); no file access, no global state
    summary  one paragraph for the docs
    codes    every finding code it may emit, with a one-line meaning (documented automatically)
    products every product it may hand on to later stages (charts, the checklist), with a one-line meaning
    """

    name: str
    title: str
    run: Callable[..., Iterable[Finding] | "CalcResult"]
    summary: str
    codes: dict[str, str] = field(default_factory=dict)
    order: int = 100
    products: dict[str, str] = field(default_factory=dict)


class CalcResult(list):
    """What a calc's run may return instead of bare findings: the findings (it is the list of them, so code that
    reads a calc's findings works either way), with the products computed on the way that later stages use as
    they are (a curve to draw, a part to fit) instead of computing them again."""

    def __init__(self, findings: Iterable[Finding] = (), products: Mapping[str, object] | None = None):
        super().__init__(findings)
        self.products = dict(products or {})


class PluginError(Exception):
    """A calc plugin that cannot be used, named with why."""

    def __init__(self, plugin: str, reason: str):
        super().__init__(f"calc plugin '{plugin}': {reason}")
        self.plugin = plugin
        self.reason = reason


def validate(name: str, obj) -> Calc:
    """Check a plugin when it is registered, not when it is first called."""
    if not isinstance(obj, Calc):
        raise PluginError(name, f"entry point must name a dossier.plugins.Calc, found {type(obj).__name__}")
    if obj.name != name:
        raise PluginError(name, f"its Calc is named '{obj.name}'; the entry point and the Calc must share one name")
    if not callable(obj.run):
        raise PluginError(name, "its run is not callable")
    _check_signature(name, obj.run)
    if not obj.codes:
        raise PluginError(name, "declares no finding codes")
    _check_products(name, obj.products)
    return obj


def _check_products(name: str, products) -> None:
    if not isinstance(products, Mapping):
        raise PluginError(name, f"its products must map each product's name to its meaning, found {type(products).__name__}")
    for key, meaning in products.items():
        if not (isinstance(key, str) and key and isinstance(meaning, str) and meaning):
            raise PluginError(name, f"product {key!r} needs a non-empty name and a one-line meaning")


def _check_signature(name: str, run) -> None:
    try:
        parameters = [p for p in inspect.signature(run).parameters.values() if p.default is p.empty]
    except (TypeError, ValueError):
        return
    if len(parameters) != 1:
        raise PluginError(name, f"run must take exactly one argument (the record), takes {len(parameters)}")


def load_calcs(points=None) -> list[Calc]:
    """Load and validate every calc; a broken plugin raises PluginError naming it."""
    points = entry_points(group=GROUP) if points is None else points
    calcs = [validate(point.name, _load(point)) for point in points]
    return sorted(calcs, key=lambda calc: (calc.order, calc.name))


def _load(point):
    try:
        return point.load()
    except Exception as error:  # a third party's import can fail in any way
        raise PluginError(point.name, f"could not be loaded: {type(error).__name__}: {error}") from None
