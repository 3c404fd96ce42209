"""Field types for the record: quantities with units, parsed once at validation."""

from __future__ import annotations

import datetime
import math
import re
from dataclasses import dataclass
from typing import Annotated, Any

from pydantic import AfterValidator, BaseModel, ConfigDict, Field, PlainSerializer, PlainValidator, WithJsonSchema, field_validator
from pydantic_core import PydanticCustomError

from dossier.units import Q_, UnitProblem, describe_dimension, parse_quantity, parse_wire

_QUANTITY_PATTERN = r"^\s*[-+]?(\d+(\.\d*)?|\.\d+)([eE][-+]?\d+)?\s*\S.*$"


class Section(BaseModel):
    """Base of every part of the record: unknown keys are errors, values are frozen, text is plain."""

    model_config = ConfigDict(extra="forbid", frozen=True, arbitrary_types_allowed=True)

    @field_validator("*", mode="after")
    @classmethod
    def _plain_text(cls, value):
        for text in _texts(value):
            _refuse_hidden_characters(text)
        return value


def _texts(value):
    if isinstance(value, str):
        yield value
    elif isinstance(value, (list, tuple)):
        for item in value:
            yield from _texts(item)


# Characters record text may not hold, however the YAML wrote them ("\e", "\u202e"): control characters
# (they retitle or clear a terminal), bidirectional overrides and isolates (they make text read other than
# it is stored), and lone surrogates (no character at all). Line feeds and tabs are plain text.
_HIDDEN = re.compile("[\x00-\x08\x0b-\x1f\x7f-\x9f\u202a-\u202e\u2066-\u2069\ud800-\udfff]")


def _refuse_hidden_characters(text: str) -> None:
    found = _HIDDEN.search(text)
    if found:
        raise PydanticCustomError(
            "hidden_character", "expected {expected}, found {found}",
            {"expected": "printable text", "found": f"character U+{ord(found.group()):04X} at position {found.start() + 1}"},
        )


def _not_blank(text: str) -> str:
    if not text.strip():
        raise PydanticCustomError("blank_text", "expected {expected}, found {found}", {"expected": "some text", "found": repr(text)})
    return text


Name = Annotated[str, Field(min_length=1), AfterValidator(_not_blank)]

FIRST_DATE, LAST_DATE = datetime.date(1980, 1, 1), datetime.date(2099, 12, 31)


def _plausible_date(date: datetime.date) -> datetime.date:
    """From 1980 (nothing older is a revision of a unit documented here; zip and many file systems start there)
    to 2099 (a far-future date is a typing slip, and dates past 2106 overflow 32-bit file times)."""
    if not FIRST_DATE <= date <= LAST_DATE:
        raise out_of_range(f"a date from {FIRST_DATE} to {LAST_DATE}", date.isoformat())
    return date


Date = Annotated[datetime.date, AfterValidator(_plausible_date)]


@dataclass(frozen=True)
class Span:
    """The physical range of a quantity, bounds in one unit; an open end refuses the bound itself.

    The ranges are wide: they refuse what no hand-built mains unit can have (a negative resistance, a
    tolerance of 100 %, a 1e308 V supply) and keep every calc's arithmetic finite, nothing more.
    """

    unit: str
    low: float | None = None
    high: float | None = None
    low_open: bool = False
    high_open: bool = False

    def holds(self, quantity) -> bool:
        magnitude = quantity.to(self.unit).magnitude
        if not math.isfinite(magnitude):
            return False
        if self.low is not None and (magnitude < self.low or (self.low_open and magnitude == self.low)):
            return False
        return self.high is None or (magnitude < self.high or (not self.high_open and magnitude == self.high))

    def text(self) -> str:
        ends = []
        if self.low is not None:
            ends.append(("more than " if self.low_open else "at least ") + self._bound(self.low))
        if self.high is not None:
            ends.append(("below " if self.high_open else "at most ") + self._bound(self.high))
        return " and ".join(ends)

    def _bound(self, value: float) -> str:
        number = re.sub(r"e\+?(-?)0*(\d)", r"e\1\2", f"{value:g}")  # 1e12, 1e-9
        return f"{number} {Q_(1, self.unit).units:~P}".strip()


def positive(unit: str, high: float, low: float = 0, *, low_open: bool | None = None) -> Span:
    """More than zero (or at least a small floor) and at most a ceiling no hand-built unit reaches."""
    return Span(unit, low, high, low_open=low == 0 if low_open is None else low_open)


def _as_pydantic_error(problem: UnitProblem) -> PydanticCustomError:
    return PydanticCustomError(problem.kind, "expected {expected}, found {found}", {"expected": problem.expected, "found": problem.found})


def problem(kind: str, expected: str, found: str) -> PydanticCustomError:
    """A validation problem of this kind, worded as 'expected ..., found ...'."""
    return PydanticCustomError(kind, "expected {expected}, found {found}", {"expected": expected, "found": found})


def out_of_range(expected: str, found: str) -> PydanticCustomError:
    """The one wording for a value outside its range."""
    return problem("value_out_of_range", expected, found)


def _validator(dimension: str, span: Span | None):
    def validate(raw: Any):
        _refuse_other_digits(raw)
        try:
            value = parse_quantity(raw, dimension)
        except UnitProblem as problem:
            raise _as_pydantic_error(problem) from None
        if dimension == "[temperature]" and any(name.startswith("delta_") for name, _ in value.unit_items()):
            raise PydanticCustomError("temperature_difference", "expected {expected}, found {found}", {"expected": "a temperature (e.g. 40 degC)", "found": f"{_serialise(value)}, a difference"})
        return _within(value, span)

    return validate


def _refuse_other_digits(raw: Any) -> None:
    """Digits other than 0-9 (full-width, Arabic-Indic, ...) would be read as numbers by Python: refuse them."""
    other = next((ch for ch in raw if ch.isdecimal() and not ch.isascii()), None) if isinstance(raw, str) else None
    if other is not None:
        raise PydanticCustomError("not_a_quantity", "expected {expected}, found {found}", {"expected": "digits 0-9", "found": f"{raw!r} (character U+{ord(other):04X})"})


def _within(value, span: Span | None):
    if span is not None and not span.holds(value):
        raise out_of_range(span.text(), _serialise(value))
    return value


_RISE = re.compile(r"^\s*(?P<number>[-+]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][-+]?\d+)?)\s*(?P<unit>K|kelvin|delta_degC)\s*$")


def _kelvin_validator(span: Span, example: str):
    def validate(raw: Any):
        """A figure in K or delta_degC; an offset unit such as degC would be a reading, not a difference."""
        match = _RISE.match(raw) if isinstance(raw, str) else None
        if match is None:
            raise PydanticCustomError("temperature_not_rise", "expected {expected}, found {found}", {"expected": example, "found": repr(raw)})
        return _within(Q_(float(match["number"]), match["unit"]), span)

    return validate


def in_kelvin(span: Span, example: str):
    """An annotated type for a figure in kelvin that is not a temperature reading: a rise, a B constant."""
    schema = {"type": "string", "pattern": _QUANTITY_PATTERN, "description": example, "x-quantity": example, "x-range": span.text()}
    return Annotated[Any, PlainValidator(_kelvin_validator(span, example)), PlainSerializer(_serialise, return_type=str), WithJsonSchema(schema)]


def _serialise(quantity) -> str:
    return f"{quantity.magnitude:g} {quantity.units:~P}".strip()


def quantity(dimension: str, span: Span | None = None):
    """An annotated type: text such as '0.71 mm' becomes a pint Quantity of this dimension, within its span."""
    kind = describe_dimension(dimension)
    schema = {"type": "string", "pattern": _QUANTITY_PATTERN, "description": kind, "x-quantity": kind}
    if dimension == "[dimensionless]":
        schema = {"anyOf": [{"type": "string", "pattern": _QUANTITY_PATTERN}, {"type": "number"}], "description": kind, "x-quantity": kind}
    if span is not None:
        schema["x-range"] = span.text()
    return Annotated[Any, PlainValidator(_validator(dimension, span)), PlainSerializer(_serialise, return_type=str), WithJsonSchema(schema)]


def _validate_wire(raw: Any):
    try:
        value = parse_wire(raw)
    except UnitProblem as problem:
        raise _as_pydantic_error(problem) from None
    if not WIRE_SPAN.holds(value):
        raise out_of_range(WIRE_SPAN.text(), _serialise(value))
    return value


_WIRE = "wire size: AWG 26, or a bare-copper diameter such as 0.71 mm"
WIRE_SPAN = Span("mm", 0.01, 20)

# Each quantity's range: from a floor below any real part to a ceiling above any hand-built mains unit.
Length = quantity("[length]", Span("mm", 0.001, 100_000))
Altitude = quantity("[length]", Span("m", 0, 10_000))
Area = quantity("[length] ** 2", Span("mm ** 2", 1e-6, 1e6))
Voltage = quantity("[electric_potential]", positive("V", 100_000))
MainsVoltage = quantity("[electric_potential]", Span("V", 1, 1000))  # IEC 60664-1 covers supplies up to 1000 V
Current = quantity("[current]", positive("A", 10_000))
Frequency = quantity("[frequency]", Span("Hz", 0.001, 100e6))
MainsFrequency = quantity("[frequency]", Span("Hz", 10, 1000))
Temperature = quantity("[temperature]", Span("degC", None, 1000))  # absolute zero is refused when parsed
RISE_SPAN = Span("K", 0, 1000, low_open=True)
TemperatureRise = in_kelvin(RISE_SPAN, "a temperature difference in K (e.g. 25 K)")
NtcBConstant = in_kelvin(Span("K", 500, 10_000), "an NTC's B constant in K (e.g. 3950 K)")
Duration = quantity("[time]", Span("s", 1e-12, 1e9))
Power = quantity("[power]", positive("W", 1e6))
Resistance = quantity("[resistance]", Span("ohm", 1e-6, 1e12))
NonNegativeResistance = quantity("[resistance]", Span("ohm", 0, 1e12))
Capacitance = quantity("[capacitance]", Span("F", 1e-15, 1000))
Inductance = quantity("[inductance]", Span("H", 1e-12, 1e6))
FluxDensity = quantity("[magnetic_flux_density]", Span("T", 0.001, 10))
Energy = quantity("[energy]", Span("J", 1e-12, 1e9))
ThermalResistance = quantity("[thermal_resistance]", Span("K/W", 0.001, 10_000))
MeltingIntegral = quantity("[i2t]", Span("A ** 2 * s", 1e-9, 1e12))
Charge = quantity("[charge]", Span("A * h", 0.001, 1e6))
InductanceFactor = quantity("[inductance_factor]", Span("nH", 0.01, 1e6))
VoltagePerKelvin = quantity("[voltage_per_temperature]", Span("V/K", -10, 10))
FieldStrength = quantity("[current] / [length]", Span("A/m", 0.001, 1e9))
Ratio = quantity("[dimensionless]", Span("", 0, 1e6))
Fraction = quantity("[dimensionless]", Span("percent", 0, 100, high_open=True))  # a tolerance, a state of charge
Share = quantity("[dimensionless]", Span("percent", 1, 100))  # an efficiency, a power factor, a duty cycle
MarginRatio = quantity("[dimensionless]", Span("", 1, 10))
WireSize = Annotated[
    Any,
    PlainValidator(_validate_wire),
    PlainSerializer(_serialise, return_type=str),
    WithJsonSchema({"type": "string", "description": _WIRE, "x-quantity": _WIRE, "x-range": WIRE_SPAN.text()}),
]

DESIGNATOR_PATTERN = r"^[A-Z]{1,4}[0-9]{1,4}[A-Za-z]?$"
Designator = Annotated[str, Field(pattern=DESIGNATOR_PATTERN, description="Designator as on the drawing, e.g. F1, Q2, T1, HS1.")]
