"""Field types for the record: quantities with units, parsed once at validation."""

from __future__ import annotations

from typing import Annotated, Any

from pydantic import BaseModel, ConfigDict, Field, PlainSerializer, PlainValidator, WithJsonSchema
from pydantic_core import PydanticCustomError

from dossier.units import UnitProblem, describe_dimension, parse_quantity, parse_wire

_QUANTITY_PATTERN = r"^\s*[-+]?(\d+(\.\d*)?|\.\d+)([eE][-+]?\d+)?\s*\S.*$"


class Section(BaseModel):
    """Base of every part of the record: unknown keys are errors, values are frozen."""

    model_config = ConfigDict(extra="forbid", frozen=True, arbitrary_types_allowed=True)


def _as_pydantic_error(problem: UnitProblem) -> PydanticCustomError:
    return PydanticCustomError(problem.kind, "expected {expected}, found {found}", {"expected": problem.expected, "found": problem.found})


def _validator(dimension: str):
    def validate(raw: Any):
        try:
            return parse_quantity(raw, dimension)
        except UnitProblem as problem:
            raise _as_pydantic_error(problem) from None

    return validate


def _serialise(quantity) -> str:
    return f"{quantity.magnitude:g} {quantity.units:~P}".strip()


def quantity(dimension: str):
    """An annotated type: text such as '0.71 mm' becomes a pint Quantity of this dimension."""
    kind = describe_dimension(dimension)
    schema = {"type": "string", "pattern": _QUANTITY_PATTERN, "description": kind, "x-quantity": kind}
    if dimension == "[dimensionless]":
        schema = {"anyOf": [{"type": "string", "pattern": _QUANTITY_PATTERN}, {"type": "number"}], "description": kind, "x-quantity": kind}
    return Annotated[Any, PlainValidator(_validator(dimension)), PlainSerializer(_serialise, return_type=str), WithJsonSchema(schema)]


def _validate_wire(raw: Any):
    try:
        return parse_wire(raw)
    except UnitProblem as problem:
        raise _as_pydantic_error(problem) from None


_WIRE = "wire size: AWG 26, or a bare-copper diameter such as 0.71 mm"

Length = quantity("[length]")
Area = quantity("[length] ** 2")
Voltage = quantity("[electric_potential]")
Current = quantity("[current]")
Frequency = quantity("[frequency]")
Temperature = quantity("[temperature]")
Duration = quantity("[time]")
Power = quantity("[power]")
Resistance = quantity("[resistance]")
Capacitance = quantity("[capacitance]")
Inductance = quantity("[inductance]")
FluxDensity = quantity("[magnetic_flux_density]")
Energy = quantity("[energy]")
ThermalResistance = quantity("[thermal_resistance]")
MeltingIntegral = quantity("[i2t]")
Charge = quantity("[charge]")
InductanceFactor = quantity("[inductance_factor]")
VoltagePerKelvin = quantity("[voltage_per_temperature]")
Ratio = quantity("[dimensionless]")
WireSize = Annotated[
    Any,
    PlainValidator(_validate_wire),
    PlainSerializer(_serialise, return_type=str),
    WithJsonSchema({"type": "string", "description": _WIRE, "x-quantity": _WIRE}),
]

DESIGNATOR_PATTERN = r"^[A-Z]{1,4}[0-9]{1,4}[A-Za-z]?$"
Designator = Annotated[str, Field(pattern=DESIGNATOR_PATTERN, description="Designator as on the drawing, e.g. F1, Q2, T1, HS1.")]
