"""The battery side of a charger: a fuse near the battery, sized between the charge current and the lead, and reverse polarity."""

from __future__ import annotations

import math

from dossier.calcs.protection.common import RUNNING_SOURCES, add_text, finding, measure
from dossier.findings import Verdict, common_practice, judge
from dossier.standards.fuses import minimum_rating
from dossier.units import Q_, fmt

# Usual current ratings of flexible PVC-insulated copper leads by cross-section (common practice, from memory):
# (mm^2, A). A lead between two rows takes the smaller row's rating.
LEAD_AMPACITY = ((0.5, 3.0), (0.75, 6.0), (1.0, 10.0), (1.25, 13.0), (1.5, 16.0), (2.5, 25.0), (4.0, 32.0))
AMPACITY_TABLE = common_practice("current ratings of flexible PVC copper leads: 0.5 mm^2 3 A, 0.75 mm^2 6 A, 1 mm^2 10 A, 1.25 mm^2 13 A, 1.5 mm^2 16 A, 2.5 mm^2 25 A, 4 mm^2 32 A (from memory)")
MAKER_AMPACITY = common_practice("the lead's current rating as declared from its maker's data")
FUSE_NEAR_BATTERY = common_practice("a battery-lead fuse sits in the positive lead within about 200 mm of the battery terminal (from memory)")
BATTERY_FAULT = common_practice("a charged lead-acid battery delivers hundreds of amperes into a short; the lead to it needs its own fuse near the battery")
REVERSED_LEADS = common_practice("a charger declares how reversed battery leads are caught (series diode, fuse with a reverse diode, or a relay or MOSFET)")
MAX_FUSE_DISTANCE = Q_(200, "mm")


def output_findings(record) -> list:
    output = record.output
    if output is None or output.battery is None:
        return []
    fuse = record.protection.output_fuse
    found = [_reverse_polarity(record)]
    if fuse is None:
        return [_no_fuse(output)] + found
    return [_fuse_rating(record, fuse), _lead(fuse), _distance(fuse)] + found


def lead_ampacity(wire_diameter):
    """Common-practice rating of a copper lead of this bare diameter; None below the table's smallest row."""
    area = (math.pi * wire_diameter**2 / 4).to("mm**2").magnitude
    rated = [amps for size, amps in LEAD_AMPACITY if size <= area * (1 + 1e-9)]
    return Q_(rated[-1], "A") if rated else None


def _no_fuse(output):
    text = (f"No fuse is declared in the battery lead. A charged battery can deliver hundreds of amperes into a short in the lead "
            f"or inside the charger; the charger's own {fmt(output.current)} limit does not stop that current, it comes from the battery. "
            "Without a fuse near the battery the lead itself becomes the fuse: it overheats, its insulation melts and it can start a fire. "
            "Fit a fuse in the positive lead close to the battery.")
    return finding(code="PROT-OUTPUT-FUSE", subject="battery lead", title="No battery-lead fuse", verdict=Verdict.FAIL,
                   explanation=text + add_text(["protection.output_fuse"]), keys=(("protection",),), sources=(BATTERY_FAULT,))


def _fuse_rating(record, fuse):
    charge = record.output.current
    minimum = minimum_rating(charge, record.environment.max_ambient)
    return finding(code="PROT-OUTPUT-FUSE", subject=fuse.ref, title="Battery-lead fuse against the charge current", verdict=judge(fuse.rating, minimum, ">="),
                   values=(measure("fuse rating", fuse.rating), measure("maximum charge current", charge)),
                   limit=measure("charge current / (75 % x ambient re-rating)", minimum),
                   method="I_rating >= I_charge / (0.75 x re-rating(ambient))",
                   explanation=f"{fuse.ref} must carry the full charge current without ageing, and blow on a fault from the battery.",
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
    text = (f"The lead must survive any current that {fuse.ref} lets through for long."
            if verdict is not Verdict.FAIL else
            f"{fuse.ref} is larger than the lead can carry: a fault could overheat the lead without blowing the fuse. Use a thicker lead or a smaller fuse.")
    values = (measure("fuse rating", fuse.rating),) + ((measure("lead diameter", fuse.lead_wire),) if fuse.lead_wire is not None else ())
    return finding(code="PROT-OUTPUT-LEAD", subject=fuse.ref, title="Battery-lead fuse against the lead's rating", verdict=verdict,
                   values=values, limit=measure("lead current rating", rated), relation="<=",
                   method="I_fuse <= ampacity(lead cross-section)", explanation=text,
                   keys=(("protection", "output_fuse", "lead_wire"),), sources=(source,))


def _lead_info(fuse, missing: list[str]):
    return finding(code="PROT-OUTPUT-LEAD", subject=fuse.ref, title="Battery-lead fuse against the lead's rating", verdict=Verdict.INFO,
                   values=(measure("fuse rating", fuse.rating),), explanation="The lead's rating is not compared." + add_text(missing),
                   keys=(("protection", "output_fuse"),), sources=(AMPACITY_TABLE,))


def _distance(fuse):
    if fuse.distance_to_battery is None:
        return finding(code="PROT-OUTPUT-DISTANCE", subject=fuse.ref, title="Battery-lead fuse position", verdict=Verdict.INFO,
                       explanation="Unfused lead between the battery and the fuse is unprotected." + add_text(["protection.output_fuse.distance_to_battery"]),
                       keys=(("protection", "output_fuse"),), sources=(FUSE_NEAR_BATTERY,))
    verdict = Verdict.PASS if fuse.distance_to_battery <= MAX_FUSE_DISTANCE else Verdict.MARGINAL
    return finding(code="PROT-OUTPUT-DISTANCE", subject=fuse.ref, title="Battery-lead fuse position", verdict=verdict,
                   values=(measure("lead between battery and fuse", fuse.distance_to_battery),), limit=measure("usual longest unfused lead", MAX_FUSE_DISTANCE), relation="<=",
                   method="unfused lead between battery terminal and fuse <= 200 mm",
                   explanation="" if verdict is Verdict.PASS else "The lead between the battery and the fuse is unprotected; move the fuse nearer the battery.",
                   keys=(("protection", "output_fuse", "distance_to_battery"),), sources=(FUSE_NEAR_BATTERY,))


def _reverse_polarity(record):
    declared = record.protection.reverse_polarity.strip()
    if declared:
        return finding(code="PROT-REVERSE-POLARITY", subject="battery output", title="Reverse-polarity protection declared", verdict=Verdict.PASS,
                       values=(measure("protection", declared),), keys=(("protection", "reverse_polarity"),), sources=(REVERSED_LEADS,))
    text = ("No reverse-polarity protection is declared. Battery leads get swapped; a reversed battery drives its full fault current "
            "backwards through the output rectifier and capacitors, which can burst or burn. Add a series diode, a fuse with a reverse diode "
            "across the output, or a relay or MOSFET that only closes with the right polarity.")
    return finding(code="PROT-REVERSE-POLARITY", subject="battery output", title="No reverse-polarity protection", verdict=Verdict.FAIL,
                   explanation=text + add_text(["protection.reverse_polarity"]), keys=(("protection",),), sources=(REVERSED_LEADS,))
