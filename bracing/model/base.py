"""The base of the site model: the file format's version, the input limits, quantity fields with
their units, and `Strict`, the base class of every model class (method notes §9).

Each quantity field documents its unit; a bare number takes that unit, a text value may carry any
unit of the same kind ("31 ft", "9.5 m").
"""

from __future__ import annotations

from dataclasses import dataclass
from typing import Annotated

from pydantic import BaseModel, BeforeValidator, ConfigDict, Field

from bracing import units

SCHEMA_VERSION = 1  # the site file's `version`: a newer file is refused (references)


# Input limits (method notes §9). Every number that enters the engine is finite (pydantic's
# allow_inf_nan=False on every model) and in a plausible range for its field. A quantity's kind
# sets the outer bound of every field of that kind, in its engine unit, so a new field has one
# by default; a field narrows it with its own ge/gt/le/lt (a wall's height to 200 ft), which
# `bracing schema` states as minimum/maximum. The bounds are far beyond any real job: they
# refuse typing slips (1e308 ft) and numbers the engine cannot work with, never a real wall.
KIND_LIMITS: dict[str, float] = {
    "length": 30000.0,        # ft: plan coordinates and elevations (a site 5 miles across)
    "thickness": 1200.0,      # in (100 ft)
    "area": 1.0e6,            # ft^2
    "section_area": 1.0e4,    # in^2
    "force": 1.0e8,           # lbf
    "moment": 1.0e9,          # ft*lbf
    "pressure": 1.0e6,        # psf
    "stress": 1.0e6,          # psi
    "unit_weight": 1000.0,    # pcf (steel is 490)
    "line_load": 1.0e7,       # plf
    "speed": 300.0,           # mph
    "angle": 360.0,           # deg
    "duration": 3650.0 / 7,   # weeks: ten years
    "age": 3650.0,            # days: ten years
    "torque_factor": 100.0,   # 1/ft
}
DAY_LIMIT = 3650              # day numbers: ten years of days
COUNT_LIMIT = 100_000         # pieces on hand
BRACE_LIMIT = 50              # braces on one wall
COORDINATE_LIMIT = KIND_LIMITS["length"]


def within(value: float, kind: str) -> float:
    """`value` (engine unit of `kind`) if inside the kind's plausible range, else ValueError."""
    limit = KIND_LIMITS[kind]
    if not -limit <= value <= limit:
        unit, word = units.KINDS[kind]
        raise ValueError(f"{value:.6g} {unit} is outside the plausible range of {word} "
                         f"(at most {limit:,.6g} {unit} in size; method notes §9)")
    return value


# pydantic's error types of a number above its field's plausible range or not finite.
RANGE_ERRORS = {"less_than", "less_than_equal", "finite_number"}


def error_message(err: dict) -> str:
    """A validation error's words; a range error says where the ranges are stated."""
    message = err["msg"].removeprefix("Value error, ")
    if err["type"] in RANGE_ERRORS:
        message += " (each field's range: `bracing schema`, method notes §9)"
    return message


_BOUNDS = {"ge": "minimum", "gt": "exclusiveMinimum", "le": "maximum", "lt": "exclusiveMaximum"}


@dataclass(frozen=True)
class _QuantitySchema:
    """The JSON schema of a quantity field: a number or a text with a unit, its description
    and its range (the field's own bounds, else its kind's)."""

    kind: str
    text: str

    def __get_pydantic_json_schema__(self, core_schema, handler):
        number = handler(core_schema)  # {"type": "number"} with the field's own bounds
        bounds = {_BOUNDS.get(k, k): v for k, v in number.items() if k != "type"}
        limit = KIND_LIMITS[self.kind]
        if "minimum" not in bounds and "exclusiveMinimum" not in bounds:
            bounds["minimum"] = -limit
        if "maximum" not in bounds and "exclusiveMaximum" not in bounds:
            bounds["maximum"] = limit
        return {"anyOf": [{"type": "number"}, {"type": "string"}], "description": self.text,
                **bounds}


def _quantity(kind: str, description: str = ""):
    """A float field read through `units.parse` for `kind`, inside the kind's plausible range,
    with its unit and range in the JSON schema."""
    unit, word = units.KINDS[kind]
    text = f"{description} ({word}; a bare number is in {unit.replace('**', '^')})".strip()
    return Annotated[
        float,
        BeforeValidator(lambda v: within(units.parse(v, kind), kind)),
        _QuantitySchema(kind, text),
    ]


Length = _quantity("length")
Thickness = _quantity("thickness")
Area = _quantity("area")
SectionArea = _quantity("section_area")
Force = _quantity("force")
Moment = _quantity("moment")
LinearForce = _quantity("line_load")
Pressure = _quantity("pressure")
Stress = _quantity("stress")
UnitWeight = _quantity("unit_weight")
Speed = _quantity("speed")
Angle = _quantity("angle")
Duration = _quantity("duration")
Age = _quantity("age")

Positive = Field(gt=0)


def _schema_bounds(schema: dict) -> None:
    """Bounds of optional quantity fields, which pydantic writes as "gt", "le"..., in JSON
    schema words; the kind's bound dropped where the field's own is narrower."""
    for key, value in list(schema.items()):
        if key in _BOUNDS and isinstance(value, (int, float)):
            schema[_BOUNDS[key]] = schema.pop(key)
        elif isinstance(value, dict):
            _schema_bounds(value)
        elif isinstance(value, list):
            for item in value:
                if isinstance(item, dict):
                    _schema_bounds(item)
    low, high = schema.get("exclusiveMinimum"), schema.get("exclusiveMaximum")
    if low is not None and schema.get("minimum", low) < low:
        del schema["minimum"]
    if high is not None and schema.get("maximum", high) > high:
        del schema["maximum"]


class Strict(BaseModel):
    """Unknown keys are errors: a misspelt key must not be silently ignored; nan and inf are
    refused in every number (method notes §9)."""

    # defer_build: a nested model's own validator is built only if it is used alone (the
    # site model validates them inside its own)
    model_config = ConfigDict(extra="forbid", populate_by_name=True, allow_inf_nan=False,
                              defer_build=True,
                              json_schema_extra=lambda schema, _: _schema_bounds(schema))


# A plan coordinate (ft), inside the length kind's range.
Coordinate = Annotated[float, Field(ge=-COORDINATE_LIMIT, le=COORDINATE_LIMIT)]
Point = tuple[Coordinate, Coordinate]
