"""What a diode blocks, from its role in its stage's topology.

PIV with the peak V_pk of the AC it rectifies (the mains crest on the mains side, the winding's no-load crest on
the isolated side: the winding that feeds the diode's stage, found from the stage graph and the rails) and the input V_in of its stage (The ARRL Handbook, power supplies chapter; Mohan et al.,
switch-mode dc power supplies):
  mains-bridge, bridge  V_pk                        centre-tapped  2 x V_pk of one half = V_pk of the whole
  (a bridge across a centre-tapped winding feeding + and - rails blocks the whole winding's peak, 2 x V_pk of a half)
  half-wave, doubler    2 x V_pk (capacitor input)  reset          2 x V_in (forward converter, 1:1 reset winding)
  clamp                 what its stage's switch blocks (k x V_in), 2 x V_in for an unknown topology
  freewheel             V_in
A diode whose role the record does not give is read as the harshest its stage allows: 2 x V_pk, or 2 x V_in.
"""

from __future__ import annotations

from dataclasses import replace

from dossier.calcs.stress.voltages import RAIL_OF_TOPOLOGY, Rail, Voltages

ROLES = ("mains-bridge", "bridge", "centre-tapped", "half-wave", "doubler", "reset", "clamp", "freewheel")
# Highest voltage a switch blocks, as a multiple of the voltage feeding its stage (Mohan et al., from memory).
BLOCKING_FACTOR = {
    "half-bridge": 1,
    "self-oscillating-half-bridge": 1,
    "full-bridge": 1,
    "push-pull": 2,
    "forward": 2,
    "buck": 1,
    "linear": 1,
}
# Multiple of V_pk each rectifying role blocks; the others are worked from the stage's input.
PEAK_MULTIPLE = {"mains-bridge": 1, "bridge": 1, "centre-tapped": 1, "half-wave": 2, "doubler": 2}
INPUT_ROLES = ("reset", "clamp", "freewheel")


def role_of(device, stage) -> tuple[str | None, str]:
    """(role, how it was found); (None, why) when the record does not say."""
    if device.role is not None:
        return device.role, "declared"
    part = next((part for part in stage.parts if part.ref == device.ref), None)
    named = _named_in(part.role if part else "")
    if named is not None:
        return named, f"the stage part's role '{part.role}'"
    if device.kind == "bridge":
        return ("mains-bridge" if stage.side == "mains" else "bridge"), "a bridge package"
    if stage.kind in ("rectifier", "mains-input") and stage.topology in RAIL_OF_TOPOLOGY:
        role = RAIL_OF_TOPOLOGY[stage.topology][2]
        role = "mains-bridge" if role == "bridge" and stage.side == "mains" else role
        return role, f"the {stage.kind} stage's topology '{stage.topology}'"
    return None, "not given"


def _named_in(text: str) -> str | None:
    words = text.lower().replace("_", "-")
    aliases = {"catch": "freewheel", "free-wheel": "freewheel", "center-tapped": "centre-tapped", "snubber": "clamp"}
    for word, role in aliases.items():
        words = words.replace(word, role)
    return next((role for role in ROLES if role in words), None)


def inverse(voltages: Voltages, index: int, stage, role: str | None) -> Rail | None:
    """The peak inverse voltage of a diode in this role, or None when the voltage it works from is unknown."""
    if role in INPUT_ROLES:
        return _from_input(voltages, index, stage, role)
    if role is None:
        return _harshest(voltages, index, stage)
    peak = voltages.line_peak(index) if stage.side == "mains" else voltages.winding_peak(half=False, stage_index=index)
    if peak is None:
        return None
    times = PEAK_MULTIPLE[role]
    return replace(peak, voltage=times * peak.voltage, formula=f"PIV = {_times(times)}V_pk ({role}); {peak.formula}")


def _from_input(voltages: Voltages, index: int, stage, role: str) -> Rail | None:
    supply = voltages.supply_of(index)
    if supply is None:
        return None
    times = {"reset": 2, "freewheel": 1}.get(role) or BLOCKING_FACTOR.get(stage.topology, 2)
    return replace(supply, voltage=times * supply.voltage, formula=f"PIV = {_times(times)}V_in ({role}); {supply.formula}")


def _harshest(voltages: Voltages, index: int, stage) -> Rail | None:
    """Twice the peak of the AC it might rectify, or twice the stage's input, whichever is higher and known."""
    peak = voltages.line_peak(index) if stage.side == "mains" else voltages.winding_peak(half=False, stage_index=index)
    # a rectifier's own output is not what feeds it
    supply = None if stage.kind in ("rectifier", "mains-input") else voltages.supply_of(index)
    known = [rail for rail in (peak, supply) if rail is not None]
    if not known:
        return None
    worst = max(known, key=lambda rail: rail.voltage)
    return replace(worst, voltage=2 * worst.voltage, formula=f"PIV = 2 x V (role unknown: the harshest reading); {worst.formula}",
                   notes=worst.notes + ("role-assumed",))


def _times(times: int) -> str:
    return "" if times == 1 else f"{times} x "
