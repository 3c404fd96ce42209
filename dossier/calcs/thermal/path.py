"""Losses of power devices and the heat path from junction to air, heatsinks shared.

T_sink = T_a + R_sa x (sum of the losses on that sink); T_j = T_sink + P (R_jc + R_cs);
a device in free air: T_j = T_a + P R_ja. Temperatures are worked in kelvin and shown in degC.
"""

from __future__ import annotations

from dataclasses import dataclass, replace

from dossier.units import Q_

# When the record gives no case-to-sink figure, the top of the makers' usual range is assumed.
ASSUMED_PAD = Q_(4.0, "K/W")  # insulating silicone pads under TO-220/TO-247: about 1-4 K/W
ASSUMED_GREASE = Q_(0.5, "K/W")  # bare mount with thermal grease: about 0.1-0.5 K/W
# A silicon MOSFET's on-resistance at its maximum junction temperature over its 25 degC value, when the record
# gives no curve: about 1.5-2.5 x at 150 degC, high-voltage parts at the top (common practice, from memory).
ASSUMED_RDS_RISE = Q_(2.5)


@dataclass(frozen=True)
class Loss:
    total: object
    conduction: object | None
    switching: object | None
    formula: str
    on_resistance: object | None = None  # a MOSFET's hot R_DS(on), when the loss was worked from it
    rds_assumed: bool = False  # the hot rise of R_DS(on) is the assumed common-practice figure


@dataclass(frozen=True)
class CaseToSink:
    resistance: object
    assumed: bool
    words: str


def loss_of(device) -> Loss | None:
    """The record's loss, else conduction plus switching where the record gives switching data.

    Conduction: a MOSFET's channel is a resistance, I_rms^2 x R_DS(on) at the hot junction; a diode's or a
    bipolar switch's drop is roughly constant, V_F x I_avg (Mohan et al., on-state losses).
    """
    if device.loss is not None:
        return Loss(device.loss.to("W"), None, None, "P as given in the record")
    conduction = _mosfet_conduction(device) if device.kind == "mosfet" else _drop_conduction(device)
    if conduction is None:
        return None
    switching = switching_loss(device.switching)
    if switching is None:
        return replace(conduction, formula=f"{conduction.formula} (conduction only)")
    return replace(conduction, total=conduction.total + switching, switching=switching,
                   formula=f"{conduction.formula} + {_switching_formula(device.switching)}")


def _drop_conduction(device) -> Loss | None:
    if device.forward_voltage is None or device.current is None:
        return None
    conduction = (device.forward_voltage * device.current).to("W")
    return Loss(conduction, conduction, None, "P = V_F x I_avg")


def _mosfet_conduction(device) -> Loss | None:
    hot, formula, assumed = hot_on_resistance(device)
    if hot is None or device.current_rms is None:
        return None
    conduction = (device.current_rms ** 2 * hot).to("W")
    return Loss(conduction, conduction, None, f"P = I_rms^2 x {formula}", on_resistance=hot, rds_assumed=assumed)


def hot_on_resistance(device):
    """(R_DS(on) at the hot junction, its formula, whether the rise was assumed); (None, '', False) when not given."""
    if device.rds_on_hot is not None:
        return device.rds_on_hot.to("ohm"), "R_DS(on),hot", False
    if device.rds_on is None:
        return None, "", False
    rise = device.rds_on_rise if device.rds_on_rise is not None else ASSUMED_RDS_RISE
    return (device.rds_on * rise).to("ohm"), "R_DS(on),25 x k_hot", device.rds_on_rise is None


def switching_loss(switching):
    """E_sw x f from the maker's switching energy, else the linear-crossover estimate 1/2 V I t_x f."""
    if switching is None:
        return None
    if switching.energy is not None:
        return (switching.energy * switching.frequency).to("W")
    return (0.5 * switching.voltage * switching.current * switching.crossover_time * switching.frequency).to("W")


def _switching_formula(switching) -> str:
    return "E_sw x f" if switching.energy is not None else "1/2 x V x I x t_x x f"


def case_to_sink(device) -> CaseToSink:
    if device.pad is not None:
        return CaseToSink(device.pad.to("K/W"), False, "as given")
    if device.insulated:
        return CaseToSink(ASSUMED_PAD, True, "no pad figure given: 4 K/W, the top of the 1-4 K/W range of insulating pads, is assumed")
    return CaseToSink(ASSUMED_GREASE, True, "no figure given: 0.5 K/W, the top of the 0.1-0.5 K/W range of a greased bare mount, is assumed")


def sink_losses(record, heatsink) -> list[tuple[int, object, Loss | None]]:
    """(index, device, loss) of every semiconductor on this heatsink."""
    devices = record.devices.semiconductors
    return [(i, d, loss_of(d)) for i, d in enumerate(devices) if d.heatsink == heatsink.ref]


def total_loss(losses) -> object:
    return sum((loss.total for _, _, loss in losses if loss is not None), Q_(0.0, "W"))


def temperature_at(base, power, resistance):
    """base temperature plus the rise P x R, in degC."""
    return (base.to("K") + (power * resistance).to("K")).to("degC")


def sink_temperature(ambient, heatsink, losses):
    return temperature_at(ambient, total_loss(losses), heatsink.rth_sa)


def heatsink_named(record, ref: str):
    return next((sink for sink in record.devices.heatsinks if sink.ref == ref), None)


@dataclass(frozen=True)
class Junction:
    temperature: object
    loss: Loss
    path: object
    formula: str
    case_to_sink: CaseToSink | None


def junction_of(record, device, ambient) -> Junction | None:
    """The junction temperature at this ambient, or None when the record lacks the data."""
    loss = loss_of(device)
    if loss is None:
        return None
    heatsink = heatsink_named(record, device.heatsink)
    if heatsink is None:
        return _free_air(device, loss, ambient)
    if device.rth_jc is None:
        return None
    pad = case_to_sink(device)
    sink = sink_temperature(ambient, heatsink, sink_losses(record, heatsink))
    inner = device.rth_jc + pad.resistance
    formula = "T_j = T_a + R_sa x sum(P on the sink) + P (R_jc + R_cs)"
    return Junction(temperature_at(sink, loss.total, inner), loss, inner + heatsink.rth_sa, formula, pad)


def _free_air(device, loss: Loss, ambient) -> Junction | None:
    if device.rth_ja is None:
        return None
    return Junction(temperature_at(ambient, loss.total, device.rth_ja), loss, device.rth_ja, "T_j = T_a + P R_ja", None)


def case_temperature(record, device, ambient):
    """Estimated case (tab) temperature at this ambient, or None."""
    loss = loss_of(device)
    heatsink = heatsink_named(record, device.heatsink)
    if loss is None:
        return None
    if heatsink is not None:
        sink = sink_temperature(ambient, heatsink, sink_losses(record, heatsink))
        return temperature_at(sink, loss.total, case_to_sink(device).resistance)
    if device.rth_ja is None or device.rth_jc is None:
        return None
    return temperature_at(ambient, loss.total, device.rth_ja - device.rth_jc)
