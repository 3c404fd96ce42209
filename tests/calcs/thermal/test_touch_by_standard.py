"""A touchable heatsink's limit under a product standard: that standard's figure for metal by how it is touched,
held when the record is silent (the harsher reading); the flat default without a product standard."""

from __future__ import annotations

import pytest

from dossier.calcs import thermal
from dossier.reading.settings import ArchiveSettings
from dossier.record.model import Record
from tests.calcs.thermal.test_calc import BASE, by, degc, device

IEC_62368 = {"name": "iec-62368-1", "edition": 3}


def unit(standard=None, contact=None, loss="6 W", ambient="25 degC", margins=None) -> Record:
    # One device on a 2 K/W sink outside in the room: T_sink = ambient + 2 K/W x loss
    sink = {"ref": "HS1", "rth_sa": "2.0 K/W", "touchable": True, "outside": True, **({"contact": contact} if contact else {})}
    devices = {"semiconductors": [device(loss=loss, heatsink="HS1", pad="0.5 K/W")], "heatsinks": [sink]}
    if margins:
        devices["margins"] = margins
    data = {**BASE, "environment": {"max_ambient": ambient}, "devices": devices}
    if standard:
        data["standard"] = standard
    return Record.model_validate(data)


def limit(record, run=thermal.run):
    finding = by(run(record), "THERM-HEATSINK", "HS1")
    return degc(finding.limit.quantity), finding


def test_without_a_product_standard_the_flat_default_applies():
    # 60 degC (IEC 62368-1 Table 38, metal touched briefly, from memory) whatever the contact
    assert limit(unit())[0] == pytest.approx(60)
    assert limit(unit(contact="held"))[0] == pytest.approx(60)


@pytest.mark.parametrize("standard, contact, expected", [
    (IEC_62368, "brief", 60), (IEC_62368, "held", 48), (IEC_62368, None, 48),  # IEC 62368-1:2018 Table 38, TS1 metal (from memory)
    ({"name": "iec-61010-1", "edition": 3}, "brief", 65), ({"name": "iec-61010-1", "edition": 3}, None, 55),  # IEC 61010-1:2010 Table 19 (from memory)
    ({"name": "iec-60335-1", "edition": 5}, "brief", 25 + 35), ({"name": "iec-60335-1", "edition": 5}, "held", 25 + 30),  # IEC 60335-1:2010 Table 3 rises over a 25 degC room (from memory)
    ({"name": "iec-61558-1", "edition": 3}, "held", 60),  # IEC 61558-1: no touch limit held, the default stays
])
def test_the_standard_sets_the_limit_by_contact(standard, contact, expected):
    assert limit(unit(standard, contact))[0] == pytest.approx(expected)


def test_the_verdict_changes_with_the_standard_and_says_why():
    # 12 W on 2 K/W in a 25 degC room: 49 degC; it passes the 60 degC default and fails IEC 62368-1 Table 38 held metal, 48 degC (from memory)
    passes, _ = limit(unit(loss="12 W"))
    _, under_standard = limit(unit(IEC_62368, loss="12 W"))
    assert passes == pytest.approx(60)
    assert under_standard.verdict.name == "FAIL"
    assert "Table 38" in under_standard.explanation and "contact: brief" in under_standard.explanation
    assert ("devices", "heatsinks", 0, "contact") in under_standard.keys and ("standard",) in under_standard.keys


def test_a_lower_limit_of_the_record_is_kept_and_a_higher_one_is_not():
    assert limit(unit(IEC_62368, "brief", margins={"touch_temperature": "50 degC"}))[0] == pytest.approx(50)
    assert limit(unit(IEC_62368, "brief", margins={"touch_temperature": "70 degC"}))[0] == pytest.approx(60)


def test_the_archive_default_standard_reaches_the_thermal_calc():
    configured = thermal.configured(ArchiveSettings(standard=IEC_62368))
    assert limit(unit(), run=configured.run)[0] == pytest.approx(48)
    assert thermal.configured(ArchiveSettings()) is thermal.CALC
