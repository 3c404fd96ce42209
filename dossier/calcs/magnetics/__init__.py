"""Magnetics calc: hand-wound transformers and chokes, from core geometry and windings to temperature rise."""

from __future__ import annotations

from dossier.calcs.magnetics.barrier import barrier_findings
from dossier.calcs.magnetics.context import context_of
from dossier.calcs.shared.winding_figures import winding_figures
from dossier.calcs.magnetics.flux import choke_findings, core_finding, core_loss_findings, flux_findings, ratio_findings
from dossier.calcs.magnetics.inputs import input_findings
from dossier.calcs.magnetics.windings import (
    density_findings, fill_findings, proximity_findings, resistance_findings, skin_findings, temperature_findings,
)
from dossier.plugins import Calc, CalcResult

TEMP_RISE = "MAG-TEMP-RISE"
RESISTANCE = "MAG-RESISTANCE"
WINDINGS = "windings"

CODES = {
    "MAG-CORE": "Effective area, path length, volume, window, mean turn and A_L of a core (IEC 60205 for a toroid; limb, stack and window for an E-I, U-I or C core).",
    "MAG-RATIO": "Turns ratio of a winding to the driven one, and its peak voltage (at low, nominal and high line where the drive follows the mains).",
    "MAG-FLUX": "Peak flux density (Faraday's law; a choke's from L I / N A_e) against saturation at the hot temperature.",
    "MAG-CORE-LOSS": "Core loss from the Steinmetz parameters: the Steinmetz equation for a sine flux, the improved generalised Steinmetz equation (iGSE) for square-wave, unipolar and triangular flux; a silicon-steel transformer's from its loss per kilogram (declared, from the grade, or a high-loss grade's) times the iron mass.",
    "MAG-CURRENT-DENSITY": "Current density in a winding against McLyman's J = K_j A_p^x for the core's size (natural cooling), or a flat figure with forced air.",
    "MAG-RESISTANCE": "DC resistance of a winding at 20 degC and hot, and its copper loss (IEC 60028 copper).",
    "MAG-SKIN": "Wire diameter against two skin depths at the operating frequency, with a hint to use more strands.",
    "MAG-PROXIMITY": "A transformer winding's AC resistance factor F_R from skin and proximity effect by Dowell's method (1 kHz and up); the copper loss and temperature rise use it.",
    "MAG-FILL": "Window fill by insulated wire and tape against what can be wound by hand; a winding that does not fit fails.",
    "MAG-TEMP-RISE": "Temperature rise from total loss per outside surface (empirical handbook relation).",
    "MAG-WINDING-TEMP": "Winding temperature (highest ambient plus rise) against the thermal class of its insulation (IEC 60085).",
    "MAG-CHOKE": "A choke's inductance, stored energy, ripple current and peak field N I / l_e against the material's limit.",
    "MAG-BARRIER-INSULATION": "Insulation between windings on opposite sides of a double or reinforced barrier: triple-insulated wire, at least 3 layers of tape or a split bobbin (enamel counts for nothing), end margins along a bobbin, the core taken as conductive.",
    "MAG-INPUT": "A check that could not be made for want of a value, naming the key to add.",
}

STEPS = (
    input_findings, lambda ctx: [core_finding(ctx)], ratio_findings, flux_findings, core_loss_findings, choke_findings,
    density_findings, resistance_findings, skin_findings, proximity_findings, fill_findings, temperature_findings, barrier_findings,
)


def run(record):
    findings = []
    for index, magnetic in enumerate(record.magnetics):
        ctx = context_of(record, index, magnetic)
        for step in STEPS:
            findings.extend(step(ctx))
    return CalcResult(findings, {WINDINGS: winding_figures(record)})


CALC = Calc(
    name="magnetics",
    title="Magnetics",
    run=run,
    summary=(
        "Checks hand-wound transformers and chokes: core parameters (IEC 60205 for toroids; E-I, U-I and C cores from their limb, stack and window), turns ratios and winding "
        "voltages at low, nominal and high line, peak flux density against saturation, core loss (Steinmetz; iGSE for non-sinusoidal flux; silicon steel from its loss per kilogram), current "
        "density (McLyman's K_j), winding temperature against the insulation class (IEC 60085), resistance and copper loss (IEC 60028 copper) with proximity loss in multilayer windings (Dowell), skin depth, window fill with enamel and tape build-up "
        "(IEC 60317, ASTM B258), temperature rise, a choke's inductance, energy and field, and the insulation between windings across a double or reinforced barrier (triple-insulated wire, "
        "tape layers by the thin-sheet rule, split bobbins, end margins; IEC 62368-1, IEC 61558-1)."
    ),
    codes=CODES,
    products={WINDINGS: "each winding's resistance at 20 degC and hot and its no-load peak at nominal line, for the rails' regulation and the checklist"},
    order=30,
)
