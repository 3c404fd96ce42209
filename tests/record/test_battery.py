"""The output.battery section: bad values are located errors naming file, line, column and key."""

from __future__ import annotations

from pathlib import Path

import pytest
from tests.fixtures.demo import DEMO

from dossier.problems import InputError
from dossier.reading.record import load_record
from dossier.units import Q_
from dossier.wording import problem_line

DEMO_TEXT = (DEMO / "solar-bank-charger" / "rev-C.yaml").read_text(encoding="utf-8")


def write_variant(tmp_path: Path, old: str, new: str) -> tuple[Path, int, int]:
    """The demo charger with one line changed; returns the file and the changed value's line and column."""
    assert old in DEMO_TEXT
    text = DEMO_TEXT.replace(old, new)
    (tmp_path / "solar-bank-charger").mkdir()
    path = tmp_path / "solar-bank-charger" / "rev-C.yaml"
    path.write_text(text, encoding="utf-8")
    changed = new.splitlines()[-1]
    line_index = text.splitlines().index(changed)
    value = changed.split(":", 1)[1].strip()
    return path, line_index + 1, text.splitlines()[line_index].index(value) + 1


def problems(path: Path) -> list[str]:
    with pytest.raises(InputError) as raised:
        load_record(path, shown_as="rec.yaml")
    return [problem_line(p) for p in raised.value.problems]


@pytest.mark.parametrize("old, new, key, words", [
    ("    chemistry: agm", "    chemistry: lithium", "output.battery.chemistry", "expected one of flooded, agm, gel, found 'lithium'"),
    ("    float_voltage: 27.3 V", "    float_voltage: 29.2 V", "output.battery.float_voltage", "expected below absorption_voltage (29 V)"),
    ("    capacity: 65 Ah", "    capacity: 0 Ah", "output.battery.capacity", "value out of range; expected at least 0.001 A·h and at most 1e6 A·h, found 0 Ah"),
    ("    capacity: 65 Ah", "    capacity: 65 V", "output.battery.capacity", "wrong kind of unit"),
    ("    temperature: 15 degC", "    start_state_of_charge: 120 %", "output.battery.start_state_of_charge", "at least 0 % and below 100 %"),
    ("    compensation: -36 mV/K", "    compensation: -36 mV", "output.battery.compensation", "voltage per kelvin"),
])
def test_bad_battery_values_are_located(tmp_path, old, new, key, words):
    path, line, column = write_variant(tmp_path, old, new)
    [found] = problems(path)
    assert found.startswith(f"rec.yaml:{line}:{column}: {key}: ")
    assert words in found


def test_temperatures_out_of_order_are_an_error(tmp_path):
    path, _, _ = write_variant(tmp_path, "    lowest_temperature: 0 degC", "    lowest_temperature: 20 degC")
    [found] = problems(path)
    assert "output.battery" in found and "lowest_temperature <= temperature <= highest_temperature" in found


def test_a_misspelt_battery_key_gets_a_suggestion(tmp_path):
    path, _, _ = write_variant(tmp_path, "    temperature: 15 degC", "    temprature: 15 degC")
    [found] = problems(path)
    assert "unknown key" in found and "did you mean 'temperature'?" in found


def test_the_demo_battery_reads_with_its_defaults():
    battery = load_record(DEMO / "solar-bank-charger" / "rev-C.yaml").record.output.battery
    assert battery.start_state_of_charge == Q_(20, "percent")
    assert battery.charge_current is None and battery.compensation == Q_(-36, "mV/K")
    assert battery.temperature_span == (Q_(0, "degC"), Q_(30, "degC"))
