"""The unit's rails: every supply it makes inside or brings out (B+, heater, bias, +12 V), each from the stage
that delivers it. Whether a rail is hazardous is worked out by the calcs from its voltage, never declared."""

from __future__ import annotations

from typing import Literal

from pydantic import Field, model_validator

from dossier.record.fields import Capacitance, Current, Fraction, Name, Power, Resistance, Section, Voltage, out_of_range, problem
from dossier.record.stages import StageId
from dossier.units import fmt


class Rail(Section):
    name: Name = Field(description="What the unit calls it, e.g. 'B+', 'heater', 'bias', '+15 V'; unique in the record.")
    stage: StageId = Field(description="Id of the stage that delivers it, e.g. ht-filter.")
    voltage: Voltage = Field(description="Nominal voltage at rated load and nominal mains: DC, or AC RMS for an AC rail (a heater winding), e.g. 350 V; a size, also for a negative rail.")
    kind: Literal["dc", "ac"] = Field("dc", description="dc or ac.")
    current: Current | None = Field(None, description="Rated load current, e.g. 120 mA.")
    no_load_voltage: Voltage | None = Field(None, description="Voltage with no load at nominal mains, measured or from the transformer's regulation, e.g. 395 V.")
    capacitance: Capacitance | None = Field(None, description="Total reservoir and filter capacitance across the rail (a series bank counts as its series value), e.g. 50 uF.")
    bleeder: Resistance | None = Field(None, description="Resistance across the rail that discharges it after switch-off (bleeder, balancing resistors in series), e.g. 220 kohm.")
    regulation: Fraction | None = Field(None, description="Rise of the rail from full load to no load over its full-load voltage, from the transformer maker's regulation figure, e.g. 12 %; gives the no-load voltage when no_load_voltage is not given.")
    bleeder_power_rating: Power | None = Field(None, description="Power rating of the bleeder resistor (of each resistor, where several in series make it up: give the total), e.g. 2 W.")
    bleeder_voltage_rating: Voltage | None = Field(None, description="Limiting element voltage of the bleeder (the sum over resistors in series), from the maker's data, e.g. 500 V.")
    winding: str | None = Field(None, description=(
        "The transformer winding that feeds it, as the magnetic's designator and the winding's name, e.g. 'T1 HT': its "
        "regulation is then worked out from the windings' resistances when neither no_load_voltage nor regulation is given. "
        "When not given, the winding is known only where the transformer in the stages above the rail has one secondary."))
    polarity: Literal["positive", "negative"] = Field("positive", description="positive or negative with respect to the unit's 0 V (a DC rail).")
    accessible: bool = Field(False, description="It is brought out to a terminal or socket someone can touch.")

    @model_validator(mode="after")
    def _no_load_not_below_load(self):
        if self.no_load_voltage is not None and self.no_load_voltage < self.voltage:
            raise out_of_range(f"no_load_voltage at least the loaded voltage ({fmt(self.voltage)})", fmt(self.no_load_voltage))
        return self


def rail_problems(rails: list[Rail], stage_ids: list[str]):
    """(key path, problem) for each rail named twice and each rail whose stage is not in the record."""
    first: dict[str, int] = {}
    for index, rail in enumerate(rails):
        if rail.name in first:
            yield ("rails", index, "name"), problem("duplicate_rail", "each rail name once", f"{rail.name!r} again (first at rails[{first[rail.name]}].name)")
        else:
            first[rail.name] = index
        if rail.stage not in stage_ids:
            known = ", ".join(dict.fromkeys(stage_ids)) or "none: the record lists no stages"
            yield ("rails", index, "stage"), problem("unknown_stage", f"the id of a stage in this record ({known})", repr(rail.stage))



def split_winding(text: str) -> tuple[str, str]:
    """'T1 HT' -> ('T1', 'HT'): the designator, then the winding's name (which may hold spaces)."""
    ref, _, name = text.strip().partition(" ")
    return ref, name.strip()


def winding_problems(rails: list[Rail], magnetics: list):
    """(key path, problem) for each rail whose winding names no winding of a magnetic in the record."""
    known = {(magnetic.ref, winding.name) for magnetic in magnetics for winding in magnetic.windings}
    for index, rail in enumerate(rails):
        if rail.winding is not None and split_winding(rail.winding) not in known:
            listed = ", ".join(f"{ref} {name}" for ref, name in sorted(known)) or "none: the record lists no magnetics"
            yield ("rails", index, "winding"), problem("unknown_rail_winding", f"a magnetic's designator and one of its windings ({listed})", repr(rail.winding))
