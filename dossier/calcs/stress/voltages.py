"""The highest voltage each place in a build sees at high line: the bus, the rectified secondary, the rails."""

from __future__ import annotations

from dataclasses import dataclass, field, replace

from dossier.calcs.shared.winding_voltages import winding_voltages
from dossier.calcs.shared.mains_lines import HIGH_PEAK_FORMULA, high_line_peak
from dossier.calcs.shared.rail_voltage import NO_LOAD_PRACTICE, NO_LOAD_RISE
from dossier.findings import Source

MAIN_TRANSFORMER_ROLES = ("transformer", "mains-transformer")
# Output rectifier topology -> (rail taken from one half of a centre-tapped winding, multiple of that peak, name)
RAIL_OF_TOPOLOGY = {
    "bridge": (False, 1, "bridge"),
    "centre-tapped": (True, 1, "centre-tapped"),
    "valve-centre-tapped": (True, 1, "centre-tapped"),
    "half-wave": (False, 1, "half-wave"),
    "valve-half-wave": (False, 1, "half-wave"),
    "doubler": (False, 2, "doubler"),
    "voltage-doubler": (False, 2, "doubler"),
}
RECTIFIER_KINDS = ("diode", "schottky", "bridge")
MAINS_RECTIFIER_PARTS = ("bridge", "diode", "rectifier")


@dataclass(frozen=True)
class Rail:
    """A voltage somewhere in the build, with how it was found.

    voltage  the peak (or, for an AC rail, the RMS) value at high line
    formula  the formula in symbols, e.g. 'V_bus = sqrt(2) x V_mains x (1 + tolerance)'
    basis    where the inputs came from, in words
    key      record key path of the main input, for locating it
    """

    voltage: object
    formula: str
    basis: str
    key: tuple
    notes: tuple[str, ...] = field(default=())  # sentences keys into words, e.g. an assumed no-load rise
    sources: tuple[Source, ...] = field(default=())  # sources of anything assumed on the way


class Voltages:
    """Voltages in one record; the winding voltages come from the magnetics calc's model of the drive."""

    def __init__(self, record, windings=winding_voltages):
        self.record = record
        self.windings = windings

    def line_rms(self) -> Rail | None:
        mains = self.record.mains
        if mains is None:
            return None
        return Rail(mains.high, "V_line = V_mains x (1 + tolerance)", "mains RMS at high line", ("mains", "nominal"))

    def bus(self) -> Rail | None:
        """The rectified mains peak at high line, when a rectifier sits on the mains side."""
        if self.record.mains is None or not self._mains_rectifier():
            return None
        return Rail(high_line_peak(self.record.mains), f"V_bus = {HIGH_PEAK_FORMULA}", "rectified mains peak at high line, no diode drop", ("mains", "nominal"))

    def _mains_rectifier(self) -> bool:
        mains_stages = [stage for stage in self.record.stages if stage.side == "mains"]
        return any(stage.kind == "rectifier" or _has_rectifier_part(stage) for stage in mains_stages)

    def secondary(self):
        """(index, magnetic, winding) of the main transformer's secondary the output rectifier sits on."""
        for index, magnetic in enumerate(self.record.magnetics):
            if magnetic.role in MAIN_TRANSFORMER_ROLES:
                winding = _rectified_winding(magnetic)
                return (index, magnetic, winding) if winding is not None else None
        return None

    def winding_peak(self, half: bool) -> Rail | None:
        """Peak across the whole secondary, or across one half of a centre-tapped one, at high line."""
        found = self.secondary()
        if found is None:
            return None
        index, magnetic, winding = found
        name = f"{winding.name}/half" if half else winding.name
        peaks = self.windings(self.record, magnetic).get(name)
        if peaks is None:
            return None
        where = f"{'one half of ' if half else ''}winding '{winding.name}' of {magnetic.ref}"
        rail = Rail(peaks["high"], "V_pk = V_drive,pk x N_winding / N_drive", f"no-load peak across {where} at high line", ("magnetics", index, "windings"))
        return self._loaded_declaration(rail, magnetic, index, peaks)

    def _loaded_declaration(self, rail: Rail, magnetic, index: int, peaks: dict) -> Rail:
        """A mains transformer declared by the voltage across a secondary: that is its rated, loaded voltage at
        nominal line, so it is carried to high line and raised by the no-load rise (the harsher reading)."""
        excitation = magnetic.excitation
        if magnetic.role != "mains-transformer" or excitation is None or not _is_secondary(magnetic, excitation.winding):
            return rail
        voltage, formula = rail.voltage, rail.formula
        if self.record.mains is not None and peaks.get("nominal") is not None and peaks["nominal"] == peaks["high"]:
            voltage = voltage * (self.record.mains.high / self.record.mains.nominal).to("").magnitude
            formula += " x V_high / V_nominal"
        voltage = voltage * (1 + NO_LOAD_RISE.magnitude)
        return Rail(voltage, f"{formula} x (1 + no-load rise)", rail.basis, ("magnetics", index, "excitation"),
                    notes=("no-load-rise",), sources=(NO_LOAD_PRACTICE,))

    def line_peak(self) -> Rail | None:
        """The mains crest at high line: what a diode rectifying the mains works from."""
        if self.record.mains is None:
            return None
        return Rail(high_line_peak(self.record.mains), f"V_pk = {HIGH_PEAK_FORMULA}", "mains peak at high line", ("mains", "nominal"))

    def rectified(self, topology: str) -> Rail | None:
        """The rectified rail behind an output rectifier, at no load (no diode drop): the peak of the winding each
        diode conducts from; a doubler twice the whole winding's peak. An unknown topology is read as a doubler."""
        shape = RAIL_OF_TOPOLOGY.get(topology, (False, 2, "unknown"))
        half, times, _ = shape
        peak = self.winding_peak(half=half)
        if peak is None:
            return None
        formula = "V_rail = V_pk of the winding each diode conducts from" if times == 1 else "V_rail = 2 x V_pk (doubler)"
        return replace(peak, voltage=times * peak.voltage, formula=f"{formula}; {peak.formula}",
                       notes=peak.notes + (("role-assumed",) if shape[2] == "unknown" else ()))

    def supply_of(self, index: int) -> Rail | None:
        """The voltage feeding stage index: the bus on the mains side, else the nearest rectified rail before it."""
        stage = self.record.stages[index]
        if stage.side == "mains":
            return self.bus()
        for earlier in reversed(self.record.stages[: index + 1]):
            if earlier.kind == "rectifier" and earlier.side == "isolated":
                return self.rectified(earlier.topology)
        return None

    def output_rail(self) -> Rail | None:
        output = self.record.output
        if output is None:
            return None
        tolerance = output.tolerance.to("").magnitude if output.tolerance is not None else 0.0
        return Rail(output.voltage * (1 + tolerance), "V_out,max = V_out x (1 + tolerance)", "the rated output at the top of its tolerance", ("output", "voltage"))


def _is_secondary(magnetic, name: str) -> bool:
    winding = next((w for w in magnetic.windings if w.name == (name or magnetic.windings[0].name)), None)
    return winding is not None and winding.role == "secondary"


def _has_rectifier_part(stage) -> bool:
    return any(part.kind in MAINS_RECTIFIER_PARTS for part in stage.parts)


def _rectified_winding(magnetic):
    secondaries = [w for w in magnetic.windings if w.role == "secondary"]
    tapped = [w for w in secondaries if w.centre_tap]
    return (tapped or secondaries or [None])[0]


def stage_of(record, ref: str):
    """(index, stage) of the stage whose parts list ref, or None."""
    for index, stage in enumerate(record.stages):
        if any(part.ref == ref for part in stage.parts):
            return index, stage
    return None
