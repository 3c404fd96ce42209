"""The package's one units registry, and parsing of values as people write them."""

from __future__ import annotations

import math
import re
from functools import lru_cache

import pint

_NUMBER = r"[-+]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][-+]?\d+)?"
_VALUE = re.compile(rf"^\s*(?P<number>{_NUMBER})\s*(?P<unit>.*?)\s*$")
_AWG = re.compile(r"^\s*AWG\s*(?P<gauge>\d{1,2}|0{1,4}|[1-4]/0)\s*$", re.IGNORECASE)

DIMENSION_NAMES = {
    "[length]": "length (e.g. 1.5 mm)",
    "[length] ** 2": "area (e.g. 0.5 mm^2)",
    "[electric_potential]": "voltage (e.g. 230 V)",
    "[current]": "current (e.g. 1.6 A)",
    "[frequency]": "frequency (e.g. 50 Hz)",
    "[temperature]": "temperature (e.g. 40 degC)",
    "[time]": "time (e.g. 10 ms)",
    "[power]": "power (e.g. 60 W)",
    "[resistance]": "resistance (e.g. 10 ohm)",
    "[capacitance]": "capacitance (e.g. 330 uF)",
    "[inductance]": "inductance (e.g. 100 uH)",
    "[magnetic_flux_density]": "flux density (e.g. 0.39 T)",
    "[energy]": "energy (e.g. 2.5 J)",
    "[thermal_resistance]": "thermal resistance (e.g. 2.5 K/W)",
    "[i2t]": "melting integral (e.g. 3.2 A^2 s)",
    "[charge]": "charge (e.g. 7 Ah)",
    "[inductance_factor]": "inductance factor A_L (e.g. 2500 nH)",
    "[voltage_per_temperature]": "voltage per kelvin (e.g. -18 mV/K)",
    "[current] / [length]": "field strength (e.g. 3500 A/m)",
    "[mass]": "mass (e.g. 0.45 kg)",
    "[specific_loss]": "loss per mass (e.g. 1.3 W/kg)",
    "[dimensionless]": "ratio or percentage (e.g. 10 %)",
}

# Dimension names the record uses beyond pint's own.
_DERIVED = {
    "[thermal_resistance]": "kelvin / watt",
    "[i2t]": "ampere ** 2 * second",
    "[charge]": "ampere * hour",
    "[inductance_factor]": "henry",
    "[magnetic_flux_density]": "tesla",
    "[energy]": "joule",
    "[power]": "watt",
    "[resistance]": "ohm",
    "[capacitance]": "farad",
    "[inductance]": "henry",
    "[electric_potential]": "volt",
    "[voltage_per_temperature]": "volt / kelvin",
    "[specific_loss]": "watt / kilogram",
    "[dimensionless]": "dimensionless",
}


class _Registry(pint.UnitRegistry):
    """pint's registry, remembering each unit text it has parsed: pint parses a prefixed or compound unit's text
    again on every conversion (`.to("mm")`), which was a tenth of the time of reviewing a build."""

    def parse_units_as_container(self, input_string, as_delta=None, case_sensitive=None):
        key = (input_string, as_delta, case_sensitive)
        parsed = self._parsed_units.get(key)
        if parsed is None:
            parsed = self._parsed_units[key] = super().parse_units_as_container(input_string, as_delta, case_sensitive)
        return parsed

    @property
    def _parsed_units(self) -> dict:
        try:
            return self.__dict__["_dossier_parsed"]
        except KeyError:
            return self.__dict__.setdefault("_dossier_parsed", {})


@lru_cache(maxsize=1)
def registry() -> pint.UnitRegistry:
    """The registry; built once and cached on disk so start-up stays quick."""
    try:
        reg = _Registry(cache_folder=":auto:", autoconvert_offset_to_baseunit=True)
    except OSError:  # the cache folder cannot be made or written (read-only home, odd XDG_CACHE_HOME): go without
        reg = _Registry(cache_folder=None, autoconvert_offset_to_baseunit=True)
    reg.formatter.default_format = "~P"
    pint.set_application_registry(reg)  # quantities unpickled from a worker process land in this registry too
    return reg


def Q_(magnitude, unit="dimensionless"):
    return registry().Quantity(magnitude, _unit(unit) if isinstance(unit, str) else unit)


@lru_cache(maxsize=1024)
def _unit(text: str) -> pint.Unit:
    """A unit parsed once: pint parses a prefixed unit's text again for every quantity (some 60 us for 'mm')."""
    return registry().Unit(text)


class UnitProblem(ValueError):
    """A value that is not a quantity of the expected dimension."""

    def __init__(self, kind: str, expected: str, found: str):
        super().__init__(kind)
        self.kind = kind
        self.expected = expected
        self.found = found


def dimensionality_of(dimension: str):
    reference = _DERIVED.get(dimension)
    if reference is not None:
        return registry().parse_units(reference).dimensionality
    return registry().get_dimensionality(dimension)


def describe_dimension(dimension: str) -> str:
    return DIMENSION_NAMES.get(dimension, dimension)


def parse_quantity(raw, dimension: str):
    """Parse '0.71 mm' (or a pint Quantity) into a Quantity of the given dimension."""
    expected = describe_dimension(dimension)
    if isinstance(raw, bool) or raw is None:
        raise UnitProblem("not_a_quantity", expected, repr(raw))
    if isinstance(raw, (int, float)):
        if dimension == "[dimensionless]":
            return Q_(raw)
        raise UnitProblem("missing_unit", expected, f"bare number {raw!r}")
    if isinstance(raw, pint.Quantity):
        quantity = raw
    elif isinstance(raw, str):
        quantity = _parse_text(raw, expected)
    else:
        raise UnitProblem("not_a_quantity", expected, type(raw).__name__)
    return _checked(quantity, dimension, expected)


def _parse_text(text: str, expected: str):
    match = _VALUE.match(text)
    if not match:
        raise UnitProblem("not_a_quantity", expected, repr(text))
    number, unit = float(match["number"]), match["unit"] or "dimensionless"
    if not math.isfinite(number):
        raise UnitProblem("not_a_quantity", expected, repr(text))
    try:
        return Q_(number, unit.replace("Ω", "ohm"))
    except Exception:  # pint's parser raises many kinds (tokenize, syntax, key errors) on odd text
        raise UnitProblem("unknown_unit", expected, f"unknown unit {unit!r}") from None


def _checked(quantity, dimension: str, expected: str):
    if quantity.dimensionality != dimensionality_of(dimension):
        raise UnitProblem("wrong_dimension", expected, f"{quantity:~P} ({_dim_text(quantity)})")
    if dimension == "[temperature]" and quantity.to("kelvin").magnitude <= 0:
        raise UnitProblem("below_absolute_zero", "a temperature above absolute zero", f"{quantity:~P}")
    return quantity


def _dim_text(quantity) -> str:
    dims = str(quantity.dimensionality)
    for name, reference in _DERIVED.items():
        if registry().parse_units(reference).dimensionality == quantity.dimensionality:
            return describe_dimension(name).split(" (")[0]
    return describe_dimension(dims).split(" (")[0]


def awg_diameter(gauge: int):
    """Bare-copper diameter of an AWG size, ASTM B258: d = 0.005 in * 92 ** ((36 - n) / 39)."""
    return Q_(0.005 * 92 ** ((36 - gauge) / 39), "inch").to("mm")


def parse_wire(raw):
    """A wire size: 'AWG 26' or a diameter such as '0.71 mm'."""
    if isinstance(raw, str):
        match = _AWG.match(raw)
        if match:
            return awg_diameter(_gauge_number(match["gauge"]))
    try:
        return parse_quantity(raw, "[length]")
    except UnitProblem as problem:
        raise UnitProblem(problem.kind, "wire size (e.g. AWG 26 or 0.71 mm)", problem.found) from None


def _gauge_number(text: str) -> int:
    if "/" in text:
        return 1 - int(text.split("/")[0])
    if set(text) == {"0"}:
        return 1 - len(text)
    return int(text)


def fmt(quantity, digits: int = 3) -> str:
    """A quantity as a practitioner writes it: a few significant digits, never in exponent form, and in the
    unit the value came in unless that makes it read badly (0.035 kA is 35 A, 5000000 µH is 5 H)."""
    quantity = readable_unit(quantity)
    magnitude = quantity.magnitude
    text = number_text(magnitude, digits) if isinstance(magnitude, float) else str(magnitude)
    unit = _unit_text(quantity.units)
    if unit in ("", "dimensionless"):
        return text
    return f"{text} {unit}"


@lru_cache(maxsize=1024)
def _unit_text(units) -> str:
    """The unit's short printed form (pint formats it afresh each time, which shows in a large build)."""
    return f"{units:~P}"


def fmt_apart(first, second, digits: int = 3, most: int = 6) -> tuple[str, str]:
    """Two quantities (a value and its limit) with as many digits as it takes to show they differ:
    14.85 V against 14.8 V is not printed '14.8 V' twice."""
    for shown in range(digits, most + 1):
        if not _print_alike(first, second, shown):
            break
    return fmt(first, shown), fmt(second, shown)


def _print_alike(first, second, digits: int) -> bool:
    if not (hasattr(first, "units") and hasattr(second, "units")) or first == second:
        return False
    try:
        return fmt(first, digits) == fmt(second.to(first.units), digits)
    except pint.DimensionalityError:
        return False


def number_text(value: float, digits: int = 3) -> str:
    """A number rounded to significant digits and written out in full: 3000, 0.0021, 14.85; never 3e+03."""
    if value == 0 or not math.isfinite(value):
        return f"{value:g}".replace("-0", "0")
    exponent = math.floor(math.log10(abs(value)))
    decimals = digits - 1 - exponent
    rounded = round(value, decimals)
    text = f"{rounded:.{max(decimals, 0)}f}"
    if "." in text:
        text = text.rstrip("0").rstrip(".")
    return "0" if text in ("-0", "") else text


# Units that take an SI prefix in the trade; lengths, areas, temperatures, times in hours stay as written.
PREFIXED_UNITS = ("volt", "ampere", "watt", "ohm", "henry", "farad", "hertz", "volt_ampere", "joule", "coulomb", "siemens", "tesla")
ENGINEERING_PREFIXES = {-12: "pico", -9: "nano", -6: "micro", -3: "milli", 0: "", 3: "kilo", 6: "mega", 9: "giga"}


def readable_unit(quantity):
    """The quantity in a better prefix of its unit when its number would read badly in the one it has:
    below 0.01 or from 100000 up, or below 1 in an already prefixed unit (0.5 kV is 500 V)."""
    parts = _prefixed_unit(quantity)
    magnitude = abs(getattr(quantity, "magnitude", 0) or 0)
    if parts is None or not math.isfinite(magnitude) or magnitude == 0:
        return quantity
    prefix, base = parts
    if 0.01 <= magnitude < 100_000 and not (prefix and magnitude < 1):
        return quantity
    in_base = abs(quantity.to(base).magnitude)
    step = min(max(math.floor(math.log10(in_base) / 3) * 3, -12), 9)
    return quantity.to(ENGINEERING_PREFIXES[step] + base)


def _prefixed_unit(quantity) -> tuple[str, str] | None:
    """(prefix, unit) for a quantity in one trade unit to the first power, e.g. ('kilo', 'ampere'); else None."""
    units = getattr(quantity, "_units", None)
    if units is None or len(units) != 1:
        return None
    (name, power), = units.items()
    return _trade_prefix(name) if power == 1 else None


@lru_cache(maxsize=1024)
def _trade_prefix(name: str) -> tuple[str, str] | None:
    prefix, base, _suffix = registry().parse_unit_name(name)[0]
    return (prefix, base) if base in PREFIXED_UNITS and prefix in ENGINEERING_PREFIXES.values() else None
