"""The resistance method offered for a mains transformer's primary in place of a thermocouple."""

from __future__ import annotations

from tests.checklist.test_items import checklist_for, item
from tests.fixtures.demo import load_test_record

from dossier.units import Q_


def test_a_mains_transformers_primary_is_measured_by_its_resistance():
    # IEC 60335-1, edition 5.0, clause 11.3: dT = (R2 - R1) / R1 x (234.5 + t1) - (t2 - t1) for copper.
    rise = item("bench-psu-13v8", "B", "soak-t1")
    assert "resistance method" in rise.title and "Do not hold a thermocouple" in rise.steps
    assert "(R2 - R1) / R1 x (234.5 + t1) - (t2 - t1)" in rise.steps
    assert rise.unit == "K" and any(source.clause.startswith("11.3") for source in rise.sources)


def test_the_cold_resistance_estimate_and_limit_come_from_the_findings():
    checklist = checklist_for(load_test_record("linear-psu-ei"))
    rise = checklist.item("soak-t1")
    assert "R1 of the primary" in rise.steps and "at 20 degC" in rise.steps
    # The core's 130 degC less the record's 30 degC highest ambient.
    assert rise.expected.high == Q_(100, "K")


def test_a_converter_transformer_keeps_the_thermocouple():
    # Its primary of a few turns has too little resistance for a bench meter; it is not offered the method.
    assert "thermocouple held" in item("solar-bank-charger", "C", "soak-t1").steps
