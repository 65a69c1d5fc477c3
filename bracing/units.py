"""Quantities with units at the edges: parse "31 ft", "9.5 m", "150 pcf" into the engine's unit.

The engine works in US customary units (design.md §3). Every input field has a documented unit;
a bare number takes it, a value with a unit is converted with pint. A value of the wrong kind
(a height in kg) is refused with a message naming what was expected.
"""

from __future__ import annotations

import math
import re
from functools import lru_cache
from pathlib import Path

from bracing.unit_factors import DISPLAY_FACTORS, FACTORS


@lru_cache(maxsize=1)
def registry():
    """pint's registry with the trade's names it lacks; imported and built on first use (a bare
    number never needs it, and it takes a few tenths of a second)."""
    import pint

    ureg = pint.UnitRegistry()
    ureg.define("pcf = force_pound / foot ** 3")  # weights per unit volume, area and length
    ureg.define("psf = force_pound / foot ** 2")
    ureg.define("plf = force_pound / foot")
    ureg.define("ksf = 1000 * psf")
    return ureg

# Engine unit and a plain-word name for each kind of value a field can hold.
KINDS: dict[str, tuple[str, str]] = {
    "length": ("ft", "a length"),
    "thickness": ("in", "a length"),
    "area": ("ft**2", "an area"),
    "section_area": ("in**2", "an area"),
    "force": ("lbf", "a force"),
    "moment": ("ft*lbf", "a moment or torque"),
    "pressure": ("psf", "a pressure"),
    "stress": ("psi", "a stress"),
    "unit_weight": ("pcf", "a unit weight"),
    "line_load": ("plf", "a load per length"),
    "speed": ("mph", "a speed"),
    "angle": ("deg", "an angle"),
    "duration": ("week", "a duration"),
    "age": ("day", "an age"),
    "torque_factor": ("1/ft", "a torque factor (per ft)"),
}

# Display units for reports: (US, SI) per engine unit.
DISPLAY = {
    "ft": ("ft", "m"),
    "in": ("in", "mm"),
    "ft**2": ("ft**2", "m**2"),
    "in**2": ("in**2", "mm**2"),
    "lbf": ("lbf", "kN"),
    "ft*lbf": ("ft*lbf", "kN*m"),
    "psf": ("psf", "kPa"),
    "psi": ("psi", "MPa"),
    "pcf": ("pcf", "kN/m**3"),
    "plf": ("plf", "kN/m"),
    "mph": ("mph", "m/s"),
}
SHORT = {"ft**2": "ft²", "m**2": "m²", "in**2": "in²", "mm**2": "mm²", "lbf": "lb",
         "ft*lbf": "lb·ft", "kN*m": "kN·m", "kN/m**3": "kN/m³", "m/s": "m/s"}


# The spellings read without pint, by engine unit: the trade's usual ones and their SI fellows.
# `python -m bracing.units` writes their factors, from pint, into bracing/unit_factors.py.
COMMON: dict[str, tuple[str, ...]] = {
    "ft": ("ft", "feet", "foot", "in", "inch", "inches", "m", "cm", "mm", "yd"),
    "in": ("in", "inch", "inches", "ft", "feet", "foot", "mm", "cm", "m"),
    "ft**2": ("ft^2", "ft**2", "in^2", "in**2", "m^2", "m**2"),
    "in**2": ("in^2", "in**2", "mm^2", "mm**2", "cm^2", "cm**2", "ft^2", "ft**2"),
    "lbf": ("lbf", "lb", "lbs", "kip", "kips", "N", "kN", "kg", "t"),
    "ft*lbf": ("ft*lbf", "lbf*ft", "ft*lb", "lb*ft", "kip*ft", "ft*kip", "N*m", "kN*m"),
    "psf": ("psf", "lbf/ft^2", "lbf/ft**2", "Pa", "kPa", "kg/m^2", "kg/m**2"),
    "psi": ("psi", "ksi", "lbf/in^2", "lbf/in**2", "MPa", "kPa", "Pa"),
    "pcf": ("pcf", "lb/ft^3", "lb/ft**3", "lbf/ft^3", "lbf/ft**3", "kN/m^3", "kN/m**3",
            "kg/m^3", "kg/m**3"),
    "plf": ("plf", "lbf/ft", "lb/ft", "kN/m", "N/m"),
    "mph": ("mph", "m/s", "km/h", "kph", "knot", "knots"),
    "deg": ("deg", "degree", "degrees", "rad", "radian", "radians"),
    "week": ("week", "weeks", "day", "days", "d"),
    "day": ("day", "days", "d", "week", "weeks", "h", "hr", "hour", "hours"),
}


class UnitError(ValueError):
    """A value that cannot be read as the field's kind of quantity."""


# The longest text read as a quantity: a value with its unit is short; a long one is a mistake,
# and pint evaluates what it is given (a long product of big numbers takes long).
LONGEST_TEXT = 100
# A unit raised to a one-digit power ("ft**2", "m^3", "ft**-1"), not followed by another power:
# the only powers read. "2**2000" or "9**9**9" would make pint compute a number of millions of
# digits (a hang), so every other power is refused before pint sees the text.
# A number after a number or a unit with only spaces between: pint multiplies them ("2 0 mph"
# is 0 mph, "20 mph 5" is 100 mph), a typing slip that must not pass as a value.
_SIDE_BY_SIDE = re.compile(r"[\w.]\s+[\d.]")
_UNIT_POWER = re.compile(r"(?<=[A-Za-z_])\s*(?:\*\*|\^)\s*[-+]?[0-9](?![0-9.]|\s*(?:\*\*|\^))")


def _is_weight(q) -> bool:
    """True for a mass unit the trade writes for a weight: a mass alone or over lengths (lb, kg,
    t, lb/ft^3, kg/m^2, lb*ft), never with time (3 s times g is a speed, not a weight)."""
    dims = q.dimensionality
    return dims.get("[mass]") == 1 and set(dims) <= {"[mass]", "[length]"}


def _weighed(q):
    """A mass unit read as its weight (standard gravity), where the trade writes it for forces."""
    return (q * registry().Quantity(1.0, "standard_gravity")).to_base_units()


# A plain decimal number and a unit written the common way ("31 ft", "7.25in", "150 pcf"): read
# with a factor from the shipped table (`unit_factors.FACTORS`, made from pint by `python -m
# bracing.units`); any other text goes to pint. Importing pint and building its registry takes
# longer than reading and checking a whole site.
_NUMBER_UNIT = re.compile(r"\s*(-?(?:[0-9]+(?:\.[0-9]+)?|\.[0-9]+)(?:[eE][-+]?[0-9]+)?)\s*(\S*)\s*",
                          re.ASCII)


@lru_cache(maxsize=4096)
def _parse_text(text: str, unit: str, kind_word: str) -> float:
    stripped = text.strip()
    bare = _UNIT_POWER.sub("", stripped)
    if len(stripped) > LONGEST_TEXT or "**" in bare or "^" in bare \
            or _SIDE_BY_SIDE.search(stripped) or not stripped.isprintable():
        raise UnitError(f"cannot read {shown(text)} as {kind_word} (for example '12 {unit}'; "
                        "a number and a unit, powers only on units)")
    common = _NUMBER_UNIT.fullmatch(stripped)
    if common:
        factor = FACTORS.get(unit, {}).get(common[2]) if common[2] else 1.0
        if factor is not None:
            return float(common[1]) * factor
    return _pint_value(stripped, text, unit, kind_word)


def _pint_value(stripped: str, text: str, unit: str, kind_word: str) -> float:
    """`stripped` read by pint in `unit`, refused when it is not of the unit's kind."""
    try:
        q = registry().Quantity(stripped)
    except Exception as exc:  # pint raises several types for unreadable text
        raise UnitError(f"cannot read {text!r} as {kind_word} (for example '12 {unit}')") from exc
    target = registry().Unit(unit)
    wrong = UnitError(f"{text!r} is not {kind_word} (expected a unit like {unit})")
    try:
        if isinstance(q, (int, float)):
            return float(q)
        if q.unitless:
            if str(q.units) not in ("dimensionless", ""):
                if not q.is_compatible_with(target):  # "10 %" for a length
                    raise wrong
                return float(q.to(target).magnitude)  # degrees and radians are unitless in pint
            return float(q.magnitude)
        if not q.is_compatible_with(target):
            weighed = _weighed(q) if _is_weight(q) else None
            if weighed is None or not weighed.is_compatible_with(target):
                raise wrong
            q = weighed
        return float(q.to(target).magnitude)
    except (OverflowError, ZeroDivisionError):  # a number too large for a float
        raise UnitError(f"{shown(text)} is too large a number for {kind_word}") from None


def shown(value: object) -> str:
    """The value as a message shows it: a long one cut short."""
    text = repr(value)
    return text if len(text) <= 60 else f"{text[:40]}... ({len(text)} characters)"


def parse(value: object, kind: str) -> float:
    """Return `value` in the engine unit of `kind`; a bare number is taken in that unit.

    The unit must be of the kind's own dimension; the one exception is a mass read as its weight
    for forces, weights per area or volume and moments (lb, kg, t, lb/ft^3...)."""
    unit, kind_word = KINDS[kind]
    if isinstance(value, bool):
        raise UnitError(f"expected {kind_word}, got {value!r}")
    if isinstance(value, (int, float)):
        try:
            number = float(value)
        except OverflowError:  # an integer of hundreds of digits
            raise UnitError(f"{shown(value)} is too large a number for {kind_word}") from None
    elif isinstance(value, str):
        number = _parse_text(value, unit, kind_word)
    else:
        raise UnitError(f"expected {kind_word} as a number or text like '12 {unit}', "
                        f"got {shown(value)}")
    if not math.isfinite(number):  # nan and inf: TOML and pint both read them
        raise UnitError(f"expected {kind_word} as a finite number, got {shown(value)}")
    return number


def convert(value: float, unit: str, system: str) -> tuple[float, str]:
    """Convert an engine value to the display unit of `system` ('us' or 'si')."""
    us, si = DISPLAY.get(unit, (unit, unit))
    target = si if system == "si" else us
    if target == unit:
        return value, SHORT.get(target, target)
    return float(value * DISPLAY_FACTORS[unit]), SHORT.get(target, target)


def pint_factors() -> tuple[dict[str, dict[str, float]], dict[str, float]]:
    """The factors of `COMMON` and of the SI display units, as pint reads them: one of each
    spelling in its engine unit, and one engine unit in its SI display unit."""
    factors = {target: {spelling: _pint_value(f"1 {spelling}", spelling, target, target)
                        for spelling in spellings}
               for target, spellings in COMMON.items()}
    display = {unit: float(registry().Quantity(1.0, unit).to(si).magnitude)
               for unit, (_, si) in DISPLAY.items() if si != unit}
    return factors, display


def write_factors() -> None:
    """Write `pint_factors()` as the shipped table (`python -m bracing.units`)."""
    import pprint

    factors, display = pint_factors()
    Path(__file__).with_name("unit_factors.py").write_text(
        '"""Unit factors made from pint by `python -m bracing.units` (do not edit; regenerate).\n\n'
        "tests/test_units.py checks that they equal pint's own conversions.\n"
        '"""\n\n'
        f"FACTORS = {pprint.pformat(factors, width=100, sort_dicts=False)}\n\n"
        f"DISPLAY_FACTORS = {pprint.pformat(display, width=100, sort_dicts=False)}\n",
        encoding="utf-8")


if __name__ == "__main__":
    write_factors()
