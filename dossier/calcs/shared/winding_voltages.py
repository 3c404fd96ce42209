"""What voltage each winding of a wound component sees, at low, nominal and high line.

The drive is taken from the record where it can be:
- a mains transformer's primary sees the mains sine;
- a converter transformer's primary sees the bus (the rectified mains peak) switched by the converter
  stage: a half-bridge gives plus and minus half the bus, a full bridge the whole bus, both as a square wave;
- otherwise the magnetic declares its excitation (waveform, voltage, frequency, winding).
A declared excitation wins over a derived one. It is read as the voltage at nominal line; when it comes from the
bus rectified from the mains (`excitation.supply: mains`, or not said and the record has mains: the harsher
reading) it is scaled by the mains tolerance to low and high line. The rectified peak is taken without diode
drops or ripple, which is the worst case for flux density and reverse voltage at high line.
"""

from __future__ import annotations

import math
from dataclasses import dataclass

from dossier.calcs.shared.mains_lines import LINES, line_peaks, line_rms

# Fraction of the bus voltage across a converter transformer's primary, by stage topology.
BUS_FRACTION = {
    "half-bridge": 0.5,
    "self-oscillating-half-bridge": 0.5,
    "full-bridge": 1.0,
}


@dataclass(frozen=True)
class Drive:
    """The voltage across one reference winding.

    amplitude  peak volts across the reference winding, by line condition ('low', 'nominal', 'high')
    rms        RMS volts across it, by line condition
    frequency  operating frequency, or None when the record does not give one
    duty       fraction of the period the voltage is applied (square wave), 1.0 for a full square wave
    basis      how the drive was found, in words for the explanation
    key        record key path the drive came from, for locating it
    polarity   'bipolar' (plus and minus) or 'unipolar' (one direction, reset between pulses)
    follows_mains  whether the drive scales with the mains (so low and high line differ when the tolerance is not 0)
    """

    winding: str
    waveform: str
    amplitude: dict
    rms: dict
    frequency: object
    duty: float
    basis: str
    key: tuple
    polarity: str = "bipolar"
    follows_mains: bool = True

    @property
    def varies_with_line(self) -> bool:
        return self.amplitude["low"] != self.amplitude["high"]


def winding_voltages(record, magnetic) -> dict:
    """Peak volts across each whole winding at low, nominal and high line; '<name>/half' for a centre-tapped one.

    Returns {} when the record gives no way to know the drive (declare an excitation then).
    """
    drive = drive_of(record, magnetic)
    if drive is None:
        return {}
    reference = _turns_of(magnetic, drive.winding)
    voltages = {}
    for winding in magnetic.windings:
        ratio = winding.turns / reference
        voltages[winding.name] = {line: drive.amplitude[line] * ratio for line in LINES}
        if winding.centre_tap:
            voltages[f"{winding.name}/half"] = {line: drive.amplitude[line] * ratio / 2 for line in LINES}
    return voltages


def drive_of(record, magnetic) -> Drive | None:
    """The drive of a magnetic: declared, or derived from the mains and the converter stage."""
    if magnetic.excitation is not None:
        return _declared(record, magnetic)
    if record.mains is None:
        return None
    if magnetic.role == "mains-transformer":
        return _from_mains(record, magnetic)
    if magnetic.role == "transformer":
        return _from_converter(record, magnetic)
    return None


def reference_winding(magnetic) -> str:
    """The first primary, or the first winding when none is called primary."""
    primaries = [w.name for w in magnetic.windings if w.role == "primary"]
    return primaries[0] if primaries else magnetic.windings[0].name


def _declared(record, magnetic) -> Drive:
    excitation = magnetic.excitation
    winding = excitation.winding or magnetic.windings[0].name
    duty = 1.0 if excitation.duty is None else float(excitation.duty.to("").magnitude)
    index = record.magnetics.index(magnetic) if magnetic in record.magnetics else 0
    polarity = excitation.polarity if excitation.waveform == "square" else "bipolar"
    follows, scale, supply_words = _supply(record, excitation)
    return Drive(
        winding=winding,
        waveform=excitation.waveform,
        amplitude=_scaled(_peak(excitation.waveform, excitation.voltage), scale),
        rms=_scaled(_rms(excitation.waveform, excitation.voltage, duty), scale),
        frequency=excitation.frequency,
        duty=duty,
        basis=f"declared excitation: {_shape_words(excitation.waveform, polarity)} across '{winding}'{supply_words}",
        key=("magnetics", index, "excitation"),
        polarity=polarity,
        follows_mains=follows,
    )


def _supply(record, excitation) -> tuple[bool, dict, str]:
    """Whether a declared excitation follows the mains, its scale by line condition, and words saying which reading."""
    if record.mains is None or excitation.supply == "fixed":
        return False, _same(1.0), ""
    nominal = record.mains.nominal
    scale = {line: float((value / nominal).to("").magnitude) for line, value in line_rms(record.mains).items()}
    if excitation.supply == "mains":
        return True, scale, "; taken from the mains-derived bus, scaled by the mains tolerance"
    return True, scale, ("; taken as following the mains and scaled by its tolerance (harsher reading: "
                         "set excitation.supply to fixed if it does not)")


def _shape_words(waveform: str, polarity: str) -> str:
    return f"{polarity} square wave" if waveform == "square" else "sine wave"


def _from_mains(record, magnetic) -> Drive:
    return Drive(
        winding=reference_winding(magnetic),
        waveform="sine",
        amplitude=line_peaks(record.mains),
        rms=line_rms(record.mains),
        frequency=record.mains.frequency,
        duty=1.0,
        basis="the mains sine across the primary",
        key=("mains",),
    )


def _from_converter(record, magnetic) -> Drive | None:
    found = _converter_stage(record, magnetic)
    if found is None:
        return None
    index, stage = found
    fraction = BUS_FRACTION[stage.topology]
    amplitude = {line: bus * fraction for line, bus in line_peaks(record.mains).items()}
    return Drive(
        winding=reference_winding(magnetic),
        waveform="square",
        amplitude=amplitude,
        rms=dict(amplitude),
        frequency=magnetic.frequency,
        duty=1.0,
        basis=f"{stage.topology} stage '{stage.name}': a square wave of {_fraction_words(fraction)} the rectified mains peak",
        key=("stages", index, "topology"),
    )


def _converter_stage(record, magnetic):
    """The converter stage that lists this magnetic, else the only converter stage with a known topology."""
    known = [(i, s) for i, s in enumerate(record.stages) if s.kind == "converter" and s.topology in BUS_FRACTION]
    listing = [(i, s) for i, s in known if any(part.ref == magnetic.ref for part in s.parts)]
    if listing:
        return listing[0]
    return known[0] if len(known) == 1 else None


def _fraction_words(fraction: float) -> str:
    return "plus and minus half" if fraction == 0.5 else "plus and minus"


def _peak(waveform: str, voltage):
    return voltage if waveform == "square" else voltage * math.sqrt(2)


def _rms(waveform: str, voltage, duty: float):
    return voltage * math.sqrt(duty) if waveform == "square" else voltage


def _same(value) -> dict:
    return {line: value for line in LINES}


def _scaled(value, scale: dict) -> dict:
    return {line: value * scale[line] for line in LINES}


def _turns_of(magnetic, name: str) -> float:
    return next(w.turns for w in magnetic.windings if w.name == name)

