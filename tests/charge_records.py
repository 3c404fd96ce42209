"""Chargers for the charge tests: the demo charger with some of its output or battery keys changed."""

from __future__ import annotations

from conftest import load_demo

from dossier.calcs.charge import CALC
from dossier.record.model import Record

DROP = object()  # pass as a value to remove the key


def _apply(section: dict, changes: dict) -> None:
    for key, value in changes.items():
        if value is DROP:
            section.pop(key, None)
        else:
            section[key] = value


# The demo charger as a fixed-setpoint charger: its battery kept at 25 degC, no compensation.
FIXED_SETPOINT = {"temperature": "25 degC", "compensation": DROP, "lowest_temperature": DROP, "highest_temperature": DROP}


def charger(output: dict | None = None, **battery) -> Record:
    """Demo charger rev C (12-cell AGM 65 Ah, 29.0 V / 27.3 V, 7 A, 0.5 % tolerance) as a fixed-setpoint
    charger at 25 degC (no compensation, no temperature range), with changes."""
    data = load_demo("solar-bank-charger", "C").model_dump(mode="json", exclude_none=True)
    _apply(data["output"], output or {})
    _apply(data["output"]["battery"], FIXED_SETPOINT)
    _apply(data["output"]["battery"], battery)
    return Record.model_validate(data)


def findings_by_code(record) -> dict:
    found = list(CALC.run(record))
    codes = [f.code for f in found]
    assert len(codes) == len(set(codes)), f"one finding per code expected, got {codes}"
    return {f.code: f for f in found}
