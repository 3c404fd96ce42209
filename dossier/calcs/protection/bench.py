"""The parts of a test station: a residual-current device, a series lamp, a variac and an isolated output with its sockets.

    RCD          rated residual current <= 30 mA; a test button; on the supply side of any isolating transformer
    series lamp  R_hot = V_lamp^2 / P, R_cold = R_hot / 15; first switch-on peak sqrt 2 V_feed / R_cold, steady limit V_feed / R_hot
    variac       its top-of-scale voltage is the nominal (and x (1 + tolerance) the high line) of all it feeds
    isolated     socket earth contacts not wired to the case or protective earth (only bonded to each other); a fuse on the output
"""

from __future__ import annotations

import dataclasses
import math

from dossier.calcs.protection import words
from dossier.calcs.protection.common import CALC_NAME, finding, measure
from dossier.calcs.shared.variac import VARIAC_PRACTICE, fed_voltage
from dossier.calcs.shared.finding_kit import not_assessed
from dossier.citations import HSE_TEST_BENCHES, IEC_60364_4_41, IEC_61008_1, LAMPTECH_STARTING
from dossier.findings import Verdict, common_practice
from dossier.units import Q_

ADDITIONAL_RCD = dataclasses.replace(IEC_60364_4_41, clause="415.1, additional protection: RCDs of rated residual operating current not exceeding 30 mA (clause number from memory)")
SEPARATION = dataclasses.replace(
    IEC_60364_4_41, clause="413, electrical separation: the separated circuit's exposed-conductive-parts are not connected to the protective "
                           "conductor or to earth; several items only through non-earthed equipotential bonding (clause numbers from memory)",
)
HSE_TEST_BENCH = dataclasses.replace(
    HSE_TEST_BENCHES, clause="the supply from an isolating transformer from a single socket outlet; no fixed wiring connected to the earth terminal of the "
           "outlet socket; suitable protection against overload and overcurrent, e.g. fuses (confirmed in a public quotation)",
)
RCD_TRIP_TIMES = dataclasses.replace(
    IEC_61008_1, clause="general-type tripping time at most 300 ms at I_dn and 40 ms at 5 I_dn (confirmed as quoted in RCD testers' instruction manuals)",
)
LAMP_COLD = dataclasses.replace(
    LAMPTECH_STARTING, clause="hot resistance V^2 / P; at switch-on the cold filament draws typically about 14 times the normal current (confirmed)",
)
OVERRUN_LAMP = common_practice("a series lamp runs at no more than its rated voltage; overrun it fails open sooner")
PERSONAL_LIMIT = Q_(30, "mA")
DEFAULT_COLD_RATIO = 15.0


def bench_findings(record) -> list:
    if record.mains is None:
        return []
    protection = record.protection
    found = []
    if protection.rcd is not None:
        found.append(_rcd(protection.rcd))
    if protection.series_lamp is not None:
        found.append(_lamp(record, protection.series_lamp))
    if protection.variac is not None:
        found.append(_variac(record, protection.variac))
    if protection.isolating_output is not None:
        found += _isolated(record, protection.isolating_output)
    return found


def _rcd(rcd):
    problems = []
    if rcd.residual_current > PERSONAL_LIMIT:
        problems.append(("fail", words.RCD_TOO_LARGE))
    if not rcd.test_button:
        problems.append(("marginal", words.RCD_NO_BUTTON))
    if rcd.position == "isolated-output":
        problems.append(("marginal", words.RCD_BEHIND_ISOLATION))
    verdict = Verdict.FAIL if any(p == "fail" for p, _ in problems) else Verdict.MARGINAL if problems else Verdict.PASS
    return finding(code="PROT-RCD", subject=rcd.ref, title="Residual-current device", verdict=verdict, guards_hazard=True,
                   values=(measure("rated residual current", rcd.residual_current.to("mA")), measure("test button", "yes" if rcd.test_button else "not declared"),
                           measure("position", rcd.position)),
                   limit=measure("for protecting people", PERSONAL_LIMIT), relation="<=",
                   method="I_dn <= 30 mA; a test button; on the supply side of any isolating transformer",
                   explanation=" ".join(text for _, text in problems) + words.RCD_CHECKLIST,
                   keys=(("protection", "rcd"),), sources=(ADDITIONAL_RCD, RCD_TRIP_TIMES))


def lamp_resistances(lamp):
    hot = (lamp.voltage**2 / lamp.power).to("ohm")
    ratio = float(lamp.cold_ratio.to("").magnitude) if lamp.cold_ratio is not None else DEFAULT_COLD_RATIO
    return hot, (hot / ratio).to("ohm"), ratio


def _lamp(record, lamp):
    hot, cold, ratio = lamp_resistances(lamp)
    _, high = fed_voltage(record)
    first_peak = (math.sqrt(2) * high / cold).to("A")
    steady = (high / hot).to("A")
    overrun = lamp.voltage < high
    text = words.lamp_text(lamp.ref, first_peak, steady, lamp.bypass, lamp.cold_ratio is None) + (words.lamp_overrun(lamp.ref) if overrun else "")
    return finding(code="PROT-SERIES-LAMP", subject=lamp.ref, title="Series lamp: what it limits", verdict=Verdict.MARGINAL if overrun else Verdict.INFO,
                   values=(measure("voltage fed to it (high line)", high), measure("current limit once hot", steady),
                           measure("peak at first switch-on (cold filament)", first_peak),
                           measure("hot resistance", hot), measure("cold resistance", cold), measure("hot over cold", Q_(ratio))),
                   limit=measure("lamp's rated voltage", lamp.voltage), relation="<=",
                   method="R_hot = V_lamp^2 / P; R_cold = R_hot / 15; I_first = sqrt 2 V_high / R_cold; I_steady <= V_high / R_hot",
                   explanation=text, keys=(("protection", "series_lamp"),), sources=(LAMP_COLD,) + ((OVERRUN_LAMP,) if overrun else ()))


def _variac(record, variac):
    nominal, high = fed_voltage(record)
    lower = _downstream_ratings(record, nominal)
    verdict = Verdict.MARGINAL if lower else Verdict.INFO
    return finding(code="PROT-VARIAC", subject=variac.ref, title="Variac top of scale", verdict=verdict,
                   values=(measure("top of scale at nominal mains", nominal), measure("top of scale at high line", high))
                   + tuple(measure(f"{name} rating", rating) for name, rating in lower),
                   method="V_top,high = V_top (1 + tolerance); each rating downstream >= V_top",
                   explanation=words.variac_text(variac.ref, nominal, record.mains.nominal, [name for name, _ in lower]),
                   keys=(("protection", "variac", "top_voltage"),), sources=(VARIAC_PRACTICE,))


def _downstream_ratings(record, nominal) -> list:
    """(name, rating) of every voltage rating downstream that is below the variac's top of scale."""
    output = record.protection.isolating_output
    rated = []
    if output is not None:
        rated += [(f"socket {s.ref}", s.voltage_rating) for s in output.sockets if s.voltage_rating is not None]
        if output.fuse is not None and output.fuse.voltage_rating is not None:
            rated.append((f"fuse {output.fuse.ref}", output.fuse.voltage_rating))
    return [(name, rating) for name, rating in rated if rating < nominal]


def _isolated(record, output) -> list:
    found = [_socket(index, socket) for index, socket in enumerate(output.sockets)]
    return found + [_output_fuse(record, output)]


def _socket(index: int, socket):
    key = ("protection", "isolating_output", "sockets", index, "earth_contact")
    title = "Isolated socket's earth contact"
    if socket.earth_contact is None:
        return not_assessed(CALC_NAME, "PROT-ISOLATED-SOCKET-EARTH", socket.ref, title, words.SOCKET_EARTH_UNKNOWN, (key,),
                            (SEPARATION, HSE_TEST_BENCH), guards_hazard=True)
    earthed = socket.earth_contact == "protective-earth"
    return finding(code="PROT-ISOLATED-SOCKET-EARTH", subject=socket.ref, title=title, verdict=Verdict.FAIL if earthed else Verdict.PASS,
                   guards_hazard=True, values=(measure("earth contact", socket.earth_contact),),
                   method="behind an isolating transformer a socket's earth contact is unconnected or bonded only to the other isolated sockets",
                   explanation=words.socket_earth_text(socket.ref, socket.earth_contact), keys=(key,), sources=(SEPARATION, HSE_TEST_BENCH))


def _output_fuse(record, output):
    title = "Fuse on the isolated output"
    fuse = output.fuse
    if fuse is None:
        return finding(code="PROT-ISOLATED-FUSE", subject="isolated output", title="No fuse on the isolated output", verdict=Verdict.FAIL,
                       guards_hazard=True, explanation=words.NO_ISOLATED_FUSE + words.add_text(["protection.isolating_output.fuse"]),
                       keys=(("protection", "isolating_output"),), sources=(HSE_TEST_BENCH,))
    limits = _output_limits(record, output)
    nominal, _ = fed_voltage(record)
    too_big = [name for name, rating in limits if fuse.rating > rating]
    low_voltage = fuse.voltage_rating is not None and fuse.voltage_rating < nominal
    verdict = Verdict.FAIL if too_big or low_voltage else Verdict.PASS
    return finding(code="PROT-ISOLATED-FUSE", subject=fuse.ref, title=title, verdict=verdict, guards_hazard=True,
                   values=(measure("fuse rating", fuse.rating.to("A")),) + tuple(measure(name, rating) for name, rating in limits)
                   + ((measure("fuse voltage rating", fuse.voltage_rating),) if fuse.voltage_rating is not None else ()),
                   method="present; I_fuse <= the isolating transformer's rated current (VA / V) and the variac's; V_rating >= V_top",
                   explanation=words.isolated_fuse_text(fuse.ref, too_big, low_voltage, nominal),
                   keys=(("protection", "isolating_output", "fuse"),), sources=(HSE_TEST_BENCH,))


def _output_limits(record, output) -> list:
    limits = []
    if output.rated_power is not None and output.voltage is not None:
        limits.append(("isolating transformer's rated current", (output.rated_power / output.voltage).to("A")))
    variac = record.protection.variac
    if variac is not None and variac.current_rating is not None:
        limits.append((f"{variac.ref}'s rated current", variac.current_rating.to("A")))
    return limits

