"""Bad or missing magnetics values in a record give located problems, each with file, line, column and key."""

from __future__ import annotations

from pathlib import Path

import pytest

from dossier.problems import InputError
from dossier.reading.record import load_record
from dossier.wording import problem_line

DEMO = Path(__file__).resolve().parents[2] / "demo" / "archive" / "solar-bank-charger" / "rev-C.yaml"

CASES = {
    "inner-not-inside-outer": (
        "inner_diameter: 26 mm", "inner_diameter: 45 mm",
        "magnetics[0].core.inner_diameter: value out of range; expected less than the outer diameter (42 mm), found 45 mm",
    ),
    "excitation-names-no-winding": (
        "winding: primary", "winding: primery",
        "magnetics[1].excitation: unknown winding; expected the name of one of the windings "
        "(primary, upper gate, lower gate), found 'primery'",
    ),
    "winding-named-twice": (
        "{name: lower gate,", "{name: upper gate,",
        "magnetics[1].windings: duplicate name; expected a different name for each winding, found 'upper gate' given twice",
    ),
    "duty-over-100-percent": (
        "duty: 61 %", "duty: 120 %",
        "magnetics[2].excitation.duty: value out of range; expected at least 1 % and at most 100 %, found 120 %",
    ),
    "toroid-without-height": (
        "      height: 14 mm\n", "",
        "magnetics[0].core: incomplete core; expected height for a toroid core, found not given",
    ),
    "negative-wire": (
        "turns: 36, wire: 0.45 mm", "turns: 36, wire: -0.45 mm",
        "magnetics[0].windings[0].wire: value out of range; expected at least 0.01 mm and at most 20 mm, found -0.45 mm",
    ),
    "field-limit-in-amperes": (
        "max_field: 3800 A/m", "max_field: 3800 A",
        "magnetics[2].core.material.max_field: wrong kind of unit; expected field strength (e.g. 3500 A/m), found 3800.0 A (current)",
    ),
    "unknown-core-family": (
        "family: iron-powder", "family: powdered iron",
        "magnetics[2].core.material.family: not one of the allowed values; expected 'ferrite', 'iron-powder' or "
        "'silicon-steel', found 'powdered iron'",
    ),
    "zero-frequency": (
        "frequency: 65 kHz\n    core", "frequency: 0 kHz\n    core",
        "magnetics[0].frequency: value out of range; expected at least 0.001 Hz and at most 1e8 Hz, found 0 kHz",
    ),
}


def problems_of(tmp_path, old, new):
    text = DEMO.read_text(encoding="utf-8")
    assert text.count(old) >= 1, old
    path = tmp_path / "rev-C.yaml"
    path.write_text(text.replace(old, new, 1), encoding="utf-8")
    with pytest.raises(InputError) as raised:
        load_record(path, shown_as="CASE")
    return raised.value.problems


@pytest.mark.parametrize("case", sorted(CASES))
def test_bad_magnetics_value_is_located(tmp_path, case):
    old, new, expected = CASES[case]
    problems = problems_of(tmp_path, old, new)
    assert len(problems) == 1
    line = problem_line(problems[0])
    assert line.startswith("CASE:") and line.split(":")[1].isdigit() and line.split(":")[2].isdigit()
    assert line.split(": ", 1)[1] == expected


def test_the_location_points_at_the_bad_line(tmp_path):
    problems = problems_of(tmp_path, "inner_diameter: 26 mm", "inner_diameter: 45 mm")
    lines = DEMO.read_text(encoding="utf-8").splitlines()
    assert "inner_diameter" in lines[problems[0].location.line - 1]
