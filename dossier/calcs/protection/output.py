"""The battery side of a charger: a fuse near the battery, sized between the charge current and the lead, and reverse polarity."""

from __future__ import annotations

import dataclasses
import math

from dossier.calcs.protection import words
from dossier.calcs.shared.enclosure_air import internal_ambient
from dossier.calcs.protection.common import RUNNING_SOURCES, finding, measure
from dossier.citations import ABYC_E11, IEC_60335_1
from dossier.findings import Verdict, common_practice, judge
from dossier.standards.fuses import minimum_rating
from dossier.units import Q_

# IEC 60335-1 (ed. 5.0, 2010), clause 25.8, Table 11: minimum cross-section of a supply cord's conductors by the
# appliance's rated current, read the other way: the largest current a conductor of that section is allowed to carry.
# (mm^2, A). 0.5 mm^2 only for cords no longer than 2 m. A lead between two rows takes the smaller row's rating.
LEAD_AMPACITY = ((0.5, 3.0), (0.75, 6.0), (1.0, 10.0), (1.5, 16.0), (2.5, 25.0), (4.0, 32.0), (6.0, 40.0), (10.0, 63.0))
AMPACITY_TABLE = dataclasses.replace(
    IEC_60335_1,
    clause="clause 25.8, Table 11, minimum cross-sectional area of supply-cord conductors: 0.5 mm^2 up to 3 A (cords up to 2 m), "
           "0.75 mm^2 6 A, 1 mm^2 10 A, 1.5 mm^2 16 A, 2.5 mm^2 25 A, 4 mm^2 32 A, 6 mm^2 40 A, 10 mm^2 63 A "
           "(rows confirmed in a public reproduction; the table number from memory). A supply-cord table applied to a battery lead.",
)
MAKER_AMPACITY = common_practice("the lead's current rating as declared from its maker's data")
FUSE_NEAR_BATTERY = ABYC_E11
DC_FUSE = common_practice(
    "a fuse on a battery is rated for DC at the battery's highest voltage and breaks the battery's short-circuit current; "
    "glass miniature fuses are AC-rated, low-breaking parts (from memory)"
)
BATTERY_SHORT_CIRCUIT = common_practice("a lead-acid battery's short-circuit current up to about 30 A per Ah of capacity (from memory; makers' data give it)")
SHORT_CIRCUIT_PER_AH = 30.0
BATTERY_FAULT = common_practice("a charged lead-acid battery delivers hundreds of amperes into a short; the lead to it needs its own fuse near the battery")
REVERSED_LEADS = common_practice("a charger declares how reversed battery leads are caught (series diode, fuse with a reverse diode, or a relay or MOSFET)")
MAX_FUSE_DISTANCE = Q_(178, "mm")


def output_findings(record) -> list:
    output = record.output
    if output is None or output.battery is None:
        return []
    fuse = record.protection.output_fuse
    found = [_reverse_polarity(record)]
    if fuse is None:
        return [_no_fuse(output)] + found
    return [_fuse_rating(record, fuse), _dc_rating(record, fuse), _lead(fuse), _distance(fuse)] + found


def lead_ampacity(wire_diameter):
    """Common-practice rating of a copper lead of this bare diameter; None below the table's smallest row."""
    area = (math.pi * wire_diameter**2 / 4).to("mm**2").magnitude
    rated = [amps for size, amps in LEAD_AMPACITY if size <= area * (1 + 1e-9)]
    return Q_(rated[-1], "A") if rated else None


def _no_fuse(output):
    return finding(code="PROT-OUTPUT-FUSE", subject="battery lead", title="No battery-lead fuse", verdict=Verdict.FAIL,
                   extra=(measure("charger's current limit", output.current),),
                   explanation=words.no_lead_fuse_text(output.current) + words.add_text(["protection.output_fuse"]), keys=(("protection",),), sources=(BATTERY_FAULT,))


def battery_voltage(output):
    """The highest voltage the battery lead sees: the output's or the absorption setpoint, whichever is higher."""
    return max(output.voltage, output.battery.absorption_voltage)


def prospective_current(record, fuse):
    """(battery short-circuit current, assumed?)."""
    if fuse.prospective_current is not None:
        return fuse.prospective_current, False
    return (record.output.battery.capacity.to("A*h").magnitude * SHORT_CIRCUIT_PER_AH) * Q_(1, "A"), True


def _dc_rating(record, fuse):
    title = "Battery-lead fuse DC voltage rating and breaking capacity"
    keys = (("protection", "output_fuse", "dc_voltage_rating"), ("protection", "output_fuse", "breaking_capacity"))
    if fuse.body == "glass":
        return finding(code="PROT-OUTPUT-FUSE-DC", subject=fuse.ref, title=title, verdict=Verdict.FAIL,
                       values=(measure("fuse body", fuse.body),), explanation=words.lead_fuse_glass_text(fuse.ref),
                       keys=(("protection", "output_fuse", "body"),), sources=(DC_FUSE,))
    missing = [f"protection.output_fuse.{key}" for key in ("dc_voltage_rating", "breaking_capacity") if getattr(fuse, key) is None]
    if missing:
        return finding(code="PROT-OUTPUT-FUSE-DC", subject=fuse.ref, title=title, verdict=Verdict.MARGINAL,
                       explanation=words.lead_fuse_dc_unknown_text(missing), keys=keys, sources=(DC_FUSE,))
    voltage = battery_voltage(record.output)
    current, assumed = prospective_current(record, fuse)
    voltage_ok, breaking_ok = fuse.dc_voltage_rating >= voltage, fuse.breaking_capacity >= current
    values = (measure("breaking capacity", fuse.breaking_capacity), measure("DC voltage rating", fuse.dc_voltage_rating),
              measure("battery's highest voltage", voltage))
    return finding(code="PROT-OUTPUT-FUSE-DC", subject=fuse.ref, title=title, verdict=Verdict.PASS if voltage_ok and breaking_ok else Verdict.FAIL,
                   values=values, limit=measure("battery short-circuit current", current),
                   method="V_DC rating >= battery's highest voltage; breaking capacity >= battery short-circuit current",
                   explanation=words.lead_fuse_dc_text(fuse.ref, voltage_ok, breaking_ok, assumed),
                   keys=keys + (("protection", "output_fuse", "prospective_current"),),
                   sources=(DC_FUSE,) + ((BATTERY_SHORT_CIRCUIT,) if assumed else ()))


def _fuse_rating(record, fuse):
    charge = record.output.current
    minimum = minimum_rating(charge, internal_ambient(record)[0])
    return finding(code="PROT-OUTPUT-FUSE", subject=fuse.ref, title="Battery-lead fuse against the charge current", verdict=judge(fuse.rating, minimum, ">="),
                   values=(measure("fuse rating", fuse.rating), measure("maximum charge current", charge)),
                   limit=measure("charge current / (75 % x ambient re-rating)", minimum),
                   method="I_rating >= I_charge / (0.75 x re-rating(ambient))",
                   explanation=words.lead_fuse_rating_text(fuse.ref),
                   keys=(("protection", "output_fuse", "rating"), ("output", "current")), sources=(BATTERY_FAULT,) + RUNNING_SOURCES)


def _lead(fuse):
    if fuse.lead_ampacity is not None:
        return _lead_against(fuse, fuse.lead_ampacity, MAKER_AMPACITY)
    if fuse.lead_wire is None:
        return _lead_info(fuse, ["protection.output_fuse.lead_wire (or lead_ampacity)"])
    rated = lead_ampacity(fuse.lead_wire)
    if rated is None:
        return _lead_info(fuse, ["protection.output_fuse.lead_ampacity (the lead is thinner than the table's 0.5 mm^2)"])
    return _lead_against(fuse, rated, AMPACITY_TABLE)


def _lead_against(fuse, rated, source):
    verdict = judge(fuse.rating, rated, "<=")
    text = words.lead_survives_text(fuse.ref) if verdict is not Verdict.FAIL else words.lead_too_thin_text(fuse.ref)
    values = (measure("fuse rating", fuse.rating),) + ((measure("lead diameter", fuse.lead_wire),) if fuse.lead_wire is not None else ())
    return finding(code="PROT-OUTPUT-LEAD", subject=fuse.ref, title="Battery-lead fuse against the lead's rating", verdict=verdict,
                   values=values, limit=measure("lead current rating", rated), relation="<=",
                   method="I_fuse <= ampacity(lead cross-section)", explanation=text,
                   keys=(("protection", "output_fuse", "lead_wire"),), sources=(source,))


def _lead_info(fuse, missing: list[str]):
    return finding(code="PROT-OUTPUT-LEAD", subject=fuse.ref, title="Battery-lead fuse against the lead's rating", verdict=Verdict.INFO,
                   values=(measure("fuse rating", fuse.rating),), explanation=words.LEAD_NOT_COMPARED + words.add_text(missing),
                   keys=(("protection", "output_fuse"),), sources=(AMPACITY_TABLE,))


def _distance(fuse):
    if fuse.distance_to_battery is None:
        return finding(code="PROT-OUTPUT-DISTANCE", subject=fuse.ref, title="Battery-lead fuse position", verdict=Verdict.INFO,
                       explanation=words.UNFUSED_LEAD + words.add_text(["protection.output_fuse.distance_to_battery"]),
                       keys=(("protection", "output_fuse"),), sources=(FUSE_NEAR_BATTERY,))
    verdict = Verdict.PASS if fuse.distance_to_battery <= MAX_FUSE_DISTANCE else Verdict.MARGINAL
    return finding(code="PROT-OUTPUT-DISTANCE", subject=fuse.ref, title="Battery-lead fuse position", verdict=verdict,
                   values=(measure("lead between battery and fuse", fuse.distance_to_battery),), limit=measure("usual longest unfused lead", MAX_FUSE_DISTANCE), relation="<=",
                   method="unfused lead between battery terminal and fuse <= 178 mm (7 in)",
                   explanation="" if verdict is Verdict.PASS else words.MOVE_FUSE_NEARER,
                   keys=(("protection", "output_fuse", "distance_to_battery"),), sources=(FUSE_NEAR_BATTERY,))


def _reverse_polarity(record):
    declared = record.protection.reverse_polarity.strip()
    if declared:
        return finding(code="PROT-REVERSE-POLARITY", subject="battery output", title="Reverse-polarity protection declared", verdict=Verdict.PASS,
                       values=(measure("protection", declared),), keys=(("protection", "reverse_polarity"),), sources=(REVERSED_LEADS,))
    return finding(code="PROT-REVERSE-POLARITY", subject="battery output", title="No reverse-polarity protection", verdict=Verdict.FAIL,
                   explanation=words.NO_REVERSE_POLARITY + words.add_text(["protection.reverse_polarity"]), keys=(("protection",),), sources=(REVERSED_LEADS,))
