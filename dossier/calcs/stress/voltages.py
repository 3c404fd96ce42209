"""The highest voltage each place in a build sees at high line: the bus, the rectified secondary, the rails."""

from __future__ import annotations

from dataclasses import dataclass

from dossier.calcs.magnetics.voltages import winding_voltages
from dossier.calcs.shared.mains_lines import HIGH_PEAK_FORMULA, high_line_peak

MAIN_TRANSFORMER_ROLES = ("transformer", "mains-transformer")
RECTIFIER_TOPOLOGIES = ("bridge", "centre-tapped")
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

    def mains_piv(self) -> Rail | None:
        """Each diode of a bridge on the mains blocks the line peak."""
        if self.record.mains is None:
            return None
        return Rail(high_line_peak(self.record.mains), f"PIV = {HIGH_PEAK_FORMULA} (bridge on the mains)", "mains peak at high line", ("mains", "nominal"))

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
        return Rail(peaks["high"], "V_pk = V_drive,pk x N_winding / N_drive", f"peak across {where} at high line", ("magnetics", index, "windings"))

    def piv(self, topology: str) -> Rail | None:
        """Peak inverse voltage across an output rectifier: bridge = V_pk; centre-tapped = 2 x V_pk of one half."""
        if topology == "bridge":
            peak = self.winding_peak(half=False)
            return None if peak is None else Rail(peak.voltage, "PIV = V_pk of the secondary (bridge)", peak.basis, peak.key)
        if topology == "centre-tapped":
            half = self.winding_peak(half=True)
            return None if half is None else Rail(2 * half.voltage, "PIV = 2 x V_pk of one half winding (centre-tapped full-wave)", f"twice the {half.basis}", half.key)
        return None

    def rectified(self, topology: str) -> Rail | None:
        """The rectified rail behind an output rectifier (no diode drop; the no-load peak)."""
        peak = self.winding_peak(half=topology == "centre-tapped") if topology in RECTIFIER_TOPOLOGIES else None
        if peak is None:
            return None
        return Rail(peak.voltage, "V_rail = V_pk of the winding each diode conducts from", peak.basis, peak.key)

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
