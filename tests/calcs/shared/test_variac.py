"""A variac's top of scale as the high line of what it feeds, in the isolation and stress calcs (the protection calc's
own use is in tests/calcs/protection/test_transformer_units.py)."""

from __future__ import annotations

import copy
import math

import pytest
import yaml

from dossier.calcs.isolation import CALC as ISOLATION
from dossier.calcs.stress import CALC as STRESS
from dossier.record.model import Record
from tests.fixtures.demo import RECORDS


def load(build: str, revision: str, change=None) -> Record:
    found = yaml.safe_load((RECORDS / build / f"rev-{revision}.yaml").read_text(encoding="utf-8"))
    found = copy.deepcopy(found)
    if change is not None:
        change(found)
    return Record.model_validate(found)


def with_variac(found):
    found["stages"][0]["parts"].append({"ref": "VR1", "kind": "variac", "value": "0-135 V 8 A", "role": "mains variac"})
    found["protection"]["variac"] = {"ref": "VR1", "top_voltage": "135 V", "current_rating": "8 A"}


def test_a_mains_barrier_is_judged_at_the_variacs_top_of_scale():
    # The repair station's variac gives 260 V at the top of its scale from 230 V mains: the working voltage of a
    # barrier from the mains is taken at 260 V, whose rationalised row is 320 V, not the 250 V row of a 230 V mains
    # (IEC 60664-1 edition 3, Table F.3 rationalised voltages: 220-230 V uses the 250 V row, a 300 V system the 320 V
    # row; confirmed).
    record = load("repair-station", "B")
    inputs = [f for f in ISOLATION.run(record) if f.code == "ISO-INPUTS" and f.subject == "mains to chassis"][0]
    assert inputs.values[0].quantity.to("V").magnitude == pytest.approx(320)
    assert inputs.values[1].quantity.to("V").magnitude == pytest.approx(260 * math.sqrt(2))
    assert "top of scale 260 V" in inputs.explanation
    assert ("protection", "variac", "top_voltage") in inputs.keys


def test_a_rectifier_behind_a_variac_is_judged_at_its_top_of_scale():
    # A 135 V variac ahead of the split-rail supply's transformers raises every winding by 135 / 120 (turns ratio):
    # BR2 blocks sqrt 2 x 135 V x 1.1 x 83 / 1000.
    record = load("split-rail-amp", "A", with_variac)
    found = [f for f in STRESS.run(record) if f.code == "STRESS-RECTIFIER" and f.subject == "BR2"][0]
    assert found.values[1].quantity.to("V").magnitude == pytest.approx(math.sqrt(2) * 135 * 1.1 * 83 / 1000, rel=1e-9)
    assert "variac" in found.explanation and ("protection", "variac", "top_voltage") in found.keys
