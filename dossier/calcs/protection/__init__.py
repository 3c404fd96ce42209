"""Protection calc: what blows, and whether it blows at the right time.

Mains side: input current by load kind, the mains fuse (rating, speed, voltage, breaking capacity, and what it must
protect and clear), the capacitor and transformer switch-on surges against the fuse's melting I^2 t, the inrush limiter
and soft-start, the rectifier's surge rating, the earth bond, and a test station's RCD, series lamp, variac and isolated
output. Battery side of a charger: the
battery-lead fuse and reverse polarity. The checks live in the protection_* modules beside this one.
"""

from __future__ import annotations

from dossier.calcs.protection.bench import bench_findings
from dossier.calcs.protection.bounds import bound_findings
from dossier.calcs.protection.earth import earth_findings
from dossier.calcs.protection.fuse import FuseChoice, fuse_findings, recommended_fuse
from dossier.calcs.protection.inrush import inrush_findings
from dossier.calcs.protection.limiter import limiter_findings
from dossier.calcs.protection.output import output_findings
from dossier.calcs.protection.touch import touch_findings
from dossier.calcs.protection.softstart import softstart_findings
from dossier.calcs.protection.surge import surge_findings
from dossier.plugins import Calc, CalcResult

__all__ = ["CALC", "FUSE", "FUSE_RECOMMENDED", "FuseChoice", "recommended_fuse", "run"]

NAME = "protection"
FUSE_RECOMMENDED = "PROT-FUSE-RECOMMENDED"
FUSE = "fuse"  # product: the FuseChoice, for the checklist's mains-fuse item

CHECKS = (inrush_findings, surge_findings, limiter_findings, softstart_findings, bound_findings, earth_findings, touch_findings, output_findings, bench_findings)

CODES = {
    "PROT-INPUT-CURRENT": "RMS and peak mains input current at low line, from output power, efficiency and power factor",
    "PROT-FUSE-RATING": "mains fuse rating against the running current (75 % rule, re-rated for ambient); no fuse is a fail",
    "PROT-FUSE-OVERSIZE": "mains fuse no larger than the inlet, cord, switch and wiring it protects, nor than 3 times what the running current needs",
    "PROT-FUSE-RECOMMENDED": "the smallest IEC 60127 preferred rating and the speed to fit, with the melting I^2 t it needs",
    "PROT-FUSE-SPEED": "fast-acting fuse on a unit that draws a switch-on surge",
    "PROT-FUSE-VOLTAGE": "fuse voltage rating against the mains voltage",
    "PROT-FUSE-BREAKING": "breaking capacity of the mains fuse; a low-breaking (glass) fuse on the mains is marginal",
    "PROT-INRUSH": "switch-on pulse I^2 t against the fuse's melting I^2 t with the pulse-cycle derating",
    "PROT-INRUSH-PEAK": "peak switch-on current at high line; with no limiter, why it matters",
    "PROT-NTC-ENERGY": "switch-on energy 1/2 C V^2 against the limiter's rated energy, or its maximum capacitance scaled as 1/V^2 to high line",
    "PROT-NTC-DISSIPATION": "running current and dissipation of the inrush limiter",
    "PROT-NTC-COOLDOWN": "switching on again before the NTC has cooled; a hot restart that melts the fuse is marginal",
    "PROT-SURGE-TRANSFORMER": "upper bound on a mains transformer's switch-on (magnetising) surge, peak and I^2 t, against the fuse's melting I^2 t",
    "PROT-SOFTSTART-ENERGY": "a relay-bypassed soft-start resistor's pulse energy at switch-on against its rating",
    "PROT-SOFTSTART-BYPASS": "a soft-start resistor's dissipation if the relay never closes, against its power rating; over it, a thermal cut-off must protect it",
    "PROT-SOFTSTART-DELAY": "the soft-start's bypass delay against the time the switch-on surge takes to settle",
    "PROT-FUSE-PRIMARY": "the mains fuse no more than twice the mains transformer's rated primary current",
    "PROT-FUSE-SHORT": "the mains fuse clears a short across a transformer secondary quickly, or a thermal fuse is declared",
    "PROT-BRIDGE-SURGE": "the rectifier's surge rating (I_FSM, I^2 t) against the capacitor-charging pulse it carries",
    "PROT-RCD": "a residual-current device: 30 mA or less, a test button, on the supply side of any isolating transformer",
    "PROT-SERIES-LAMP": "a series lamp's current limit once hot and at the first switch-on, and its voltage rating",
    "PROT-VARIAC": "a variac's top-of-scale voltage, the nominal for all it feeds, against their voltage ratings",
    "PROT-ISOLATED-SOCKET-EARTH": "a socket behind an isolating transformer: its earth contact not wired to the case or protective earth",
    "PROT-ISOLATED-FUSE": "a fuse on the isolated output, no larger than the isolating transformer and the variac it protects",
    "PROT-EARTH-BOND": "how protective earth is bonded to a metal enclosure or earth terminal; a described bond is a claim to verify, never a pass",
    "PROT-TOUCH-CURRENT": "touch current 2 pi f C V through the Y capacitors at high line against the limit for the protective class",
    "PROT-OUTPUT-FUSE": "a charger's battery-lead fuse: present, and large enough for the charge current",
    "PROT-OUTPUT-FUSE-DC": "battery-lead fuse rated for DC at the battery voltage, breaking the battery's short-circuit current; a glass fuse fails",
    "PROT-OUTPUT-LEAD": "battery-lead fuse no larger than the lead can carry",
    "PROT-OUTPUT-DISTANCE": "battery-lead fuse near the battery",
    "PROT-REVERSE-POLARITY": "whether reversed battery leads are caught",
}


def run(record) -> CalcResult:
    choice = recommended_fuse(record) if record.mains is not None else None
    findings = fuse_findings(record, choice)
    for check in CHECKS:
        findings.extend(check(record))
    return CalcResult(findings, {FUSE: choice} if record.mains is not None else {})


CALC = Calc(
    name=NAME,
    title="Protection",
    run=run,
    summary=(
        "What blows, and whether it blows at the right time: mains input current by load kind, the mains fuse's rating, "
        "speed, voltage rating, breaking capacity and what it must protect and clear, the capacitor and transformer switch-on "
        "surges against the fuse's melting I^2 t, the inrush limiter's and soft-start's energy and dissipation, the rectifier's "
        "surge rating, the earth bond, the touch current through the Y capacitors, a test station's RCD, series lamp, variac and isolated output, and for a charger the "
        "battery-lead fuse and reverse polarity."
    ),
    codes=CODES,
    order=20,
    products={FUSE: "the mains fuse to fit (rating, speed, melting I^2 t) and whether the declared one does"},
)
