"""The site model: pydantic classes that validate a site file (design.md §2).

Each quantity field documents its unit; a bare number takes that unit, a text value may carry any
unit of the same kind ("31 ft", "9.5 m"). Validation lives here, at the edge: the engine trusts a
`Site` once it exists.
"""

from __future__ import annotations

import math
from dataclasses import dataclass
from datetime import date
from operator import attrgetter
from typing import Annotated, Literal

from pydantic import (
    BaseModel,
    BeforeValidator,
    ConfigDict,
    Field,
    ValidationError,
    field_validator,
    model_validator,
)
from pydantic_core import InitErrorDetails, PydanticCustomError

from bracing import anchors, units
from bracing.anchor_kinds import KINDS as ANCHOR_KINDS
from bracing.data_members import DRESSED_SIZES_IN, LUMBER_GRADES, PIPES

SCHEMA_VERSION = 1


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

    model_config = ConfigDict(extra="forbid", populate_by_name=True, allow_inf_nan=False,
                              json_schema_extra=lambda schema, _: _schema_bounds(schema))


class Rule(Strict):
    """A site rule as data: its value, where it comes from and on what basis it applies."""

    value: float | None = Field(description="The rule's value in its documented unit.")
    source: str = Field(description="Standard, regulation or practice the value comes from.")
    basis: str = Field("", description="Averaging time, height, load level or factor to apply.")
    enabled: bool = True


def _rule(value, source, basis="", enabled=True) -> Rule:
    return Rule(value=value, source=source, basis=basis, enabled=enabled)


# the masonry speeds' source: the masonry industry's published bracing standard
MASONRY_STANDARD = ("Standard Practice for Bracing Masonry Walls Under Construction (the masonry "
                    "industry's published bracing standard, 2012)")

DEFAULT_RULES: dict[str, Rule] = {
    "minimum_design_pressure_psf": _rule(
        16.0, "ASCE 7-16 §29.7 (unconfirmed value: confirm in ASCE 7-16 §29.7)",
        "strength level on the gross wall area; design wind only, never observed gusts"),
    "stand_down_ratio": _rule(
        0.8, "team judgment for forecast error and time to clear (not a published value)",
        "stand-down speed = ratio x working-limit speed; reference 3-s gust at 33 ft, exposure C"),
    "masonry_unbraced_height_ft": _rule(
        8.0, "OSHA 29 CFR 1926.706(b)", "masonry walls over this height are braced"),
    "masonry_zone_extra_ft": _rule(
        4.0, "OSHA 29 CFR 1926.706(a)",
        "limited access zone = wall height + this, on the unscaffolded side, whole length"),
    "masonry_cure_days": _rule(
        28.0, "ASTM C270 design strength age; team default, conservative",
        "mortar age before flexural tension of TMS 402 is credited"),
    "minimum_braces_per_panel": _rule(2, "common practice", "per panel or wall segment"),
    "brace_angle_min_deg": _rule(
        45.0, "Washington WAC 296-155-691(4) (text: 45 to 60 degrees where possible)",
        "angle from horizontal"),
    "brace_angle_max_deg": _rule(
        60.0, "Washington WAC 296-155-691(4) (text: 45 to 60 degrees where possible)",
        "angle from horizontal"),
    "insert_min_height_ratio": _rule(
        2.0 / 3.0, "common practice (secondary)", "lowest insert height / wall height"),
    "minimum_design_wind_mph": _rule(
        70.0, "California Title 8 §1715 (text)", "basis unverified; design speed floor",
        enabled=False),
    "masonry_initial_speed_mph": _rule(
        20.0, MASONRY_STANDARD + ", initial period rule (secondary)",
        "initial period (fresh mortar, at most one working day): clear the limited access zone "
        "above this job-site gust, 1.0W, Kd 1.0"),
    "masonry_intermediate_speed_mph": _rule(
        35.0, MASONRY_STANDARD + ", intermediate period rule (secondary)",
        "intermediate period: clear the limited access zone above this job-site gust, 1.0W, "
        "Kd 1.0"),
    "masonry_bracing_design_speed_mph": _rule(
        40.0, MASONRY_STANDARD + ", intermediate period design rule (secondary)",
        "intermediate period bracing design gust, 1.0W, Kd 1.0", enabled=False),
}


# Every rule's value must lie in (low, high] in its unit to make sense (method notes §9).
RULE_RANGES = {
    "minimum_design_pressure_psf": (0.0, 200.0),
    "stand_down_ratio": (0.0, 1.0),
    "masonry_unbraced_height_ft": (0.0, 100.0),
    "masonry_zone_extra_ft": (0.0, 100.0),
    "masonry_cure_days": (0.0, float(DAY_LIMIT)),
    "minimum_braces_per_panel": (0.0, float(BRACE_LIMIT)),
    "brace_angle_min_deg": (0.0, 90.0),
    "brace_angle_max_deg": (0.0, 90.0),
    "insert_min_height_ratio": (0.0, 1.0),
    "minimum_design_wind_mph": (0.0, KIND_LIMITS["speed"]),
    "masonry_initial_speed_mph": (0.0, KIND_LIMITS["speed"]),
    "masonry_intermediate_speed_mph": (0.0, KIND_LIMITS["speed"]),
    "masonry_bracing_design_speed_mph": (0.0, KIND_LIMITS["speed"]),
}


class SiteInfo(Strict):
    """Where the walls stand and the wind they must resist."""

    name: str = Field(min_length=1)
    start_date: date | None = Field(None, ge=date(1900, 1, 1), le=date(2199, 12, 31),
                                    description="Calendar date of day 1 (for forecasts).")
    basic_wind_speed: Speed = Field(gt=0, description="ASCE 7-16 basic wind speed V (mph).")
    exposure: Literal["B", "C", "D"] = Field("C", description="ASCE 7-16 §26.7 exposure.")
    topographic_factor: float = Field(1.0, ge=1.0, le=3.0, description="Kzt, ASCE 7-16 §26.8.")
    ground_elevation: Length = Field(0.0, ge=-1000, le=20000, description="For Ke (ft).")
    design_basis: Literal["ASD", "LRFD"] = "ASD"
    units: Literal["us", "si"] = Field("us", description="Units of every output of the site "
                                       "(JSON stays US); the command line's --units wins.")
    risk_category: Literal["I", "II", "III", "IV"] = Field(
        "II", description="ASCE 37-14 treats a structure under construction as II (secondary).")
    period_factor: float | None = Field(
        None, gt=0, le=1.0,
        description="ASCE 37-14 factor set directly; otherwise from each wall's standing time.")
    construction_period: Duration = Field(
        5.0, gt=0, description="Default standing time of a wall before release (weeks).")
    limit_speed: Speed | None = Field(
        None, gt=0, description="An observed gust limit (mph), say 20 mph while fresh masonry is "
                                "laid: the tallest each wall may stand unbraced at it is reported.")
    friction_coefficient: float = Field(
        0.6, gt=0, le=1.0,
        description="Wall base on slab or footing (ACI 318-19 §22.9.4.2, concrete on hardened "
                    "concrete not roughened, 0.6).")


class Material(Strict):
    """A wall material: its kind, weight and strengths."""

    kind: Literal["concrete", "masonry", "framed"]
    unit_weight: UnitWeight | None = Field(None, gt=0, description="pcf; concrete and masonry.")
    face_weight: Pressure | None = Field(
        None, gt=0, description="Weight per face area (psf); overrides the unit weight.")
    compressive_strength: Stress | None = Field(
        None, gt=0, description="f'c of concrete on the day (psi).")
    grouting: Literal["hollow", "partly", "grouted", "solid"] = Field(
        "hollow", description="Masonry: hollow units ungrouted, partly grouted (checked as "
                              "hollow), fully grouted, or solid units (TMS 402-16 Table 8.2.4.2).")
    mortar: Literal["M/S", "N"] = Field("M/S", description="Masonry mortar type (TMS 402).")
    flexural_tension: Stress | None = Field(
        None, ge=0, description="Masonry allowable flexural tension normal to bed joints (psi); "
                                "default from TMS 402-16 Table 8.2.4.2 (unconfirmed value: "
                                "confirm in TMS 402-16 Table 8.2.4.2).")
    sheathed: bool = Field(True, description="Framed walls: sheathed (solid) or open studs.")
    sill_fastening: LinearForce | None = Field(
        None, gt=0, description="Framed walls: allowable uplift the sill's fastening to its base "
                                "holds, per ft of sill (plf); the braces in compression lift "
                                "the wall (method notes §4).")

    @model_validator(mode="after")
    def _weight_given(self):
        if self.unit_weight is None and self.face_weight is None:
            raise ValueError("give unit_weight or face_weight")
        if self.sill_fastening is not None and self.kind != "framed":
            raise ValueError("sill_fastening is for framed walls only")
        return self


class Opening(Strict):
    """A rectangular opening in the panel's elevation, from its bottom-left corner."""

    x: Length = Field(ge=0, description="From the panel's left edge (ft).")
    y: Length = Field(ge=0, description="From the panel's base (ft).")
    width: Length = Positive
    height: Length = Positive


class Footing(Strict):
    """A footing under a free-standing wall (overturning, sliding and bearing use it)."""

    width: Length = Field(gt=0, le=100, description="Across the wall (ft), centered under it.")
    thickness: Length = Field(gt=0, le=100, description="Depth of the footing (ft).")
    unit_weight: UnitWeight = Field(150.0, gt=0, description="pcf.")
    soil_depth: Length = Field(0.0, ge=0, description="Soil over the footing (ft).")
    soil_unit_weight: UnitWeight = Field(110.0, gt=0, description="pcf.")
    allowable_bearing: Pressure = Field(
        1500.0, gt=0, description="psf; IBC Table 1806.2 class 5 presumptive value.")
    friction_coefficient: float = Field(
        0.25, gt=0, le=1.0, description="Footing on soil (IBC Table 1806.2).")


class ReturnWall(Strict):
    """A wall at right angles at one end: it cuts the end-zone wind (Figure 29.3-1)."""

    end: Literal["left", "right"]
    length: Length = Positive


class BraceType(Strict):
    """A brace as supplied: rated by its maker, a steel pipe (AISC 360-16), sawn lumber (NDS), or
    unrated (its forces are computed, its capacity is not known)."""

    kind: Literal["rated", "pipe", "lumber", "unrated"]
    # rated (adjustable / telescoping): the maker's table of allowable load by length
    lengths: list[Length] = Field(default_factory=list, description="Rated table lengths (ft).")
    loads: list[Force] = Field(default_factory=list, description="Allowable loads (lb).")
    # pipe
    section: str | None = Field(None, description="Pipe size, e.g. 'Pipe 3 STD'.")
    yield_strength: Stress = Field(35000.0, gt=0, description="Fy (psi); A53 Gr. B 35 ksi.")
    knee_brace: bool = Field(False, description="Knee brace at mid-length in the brace's plane.")
    lateral_struts: int = Field(0, ge=0, le=BRACE_LIMIT, description="Out-of-plane struts along the brace.")
    # lumber
    size: str | None = Field(None, description="Nominal size, e.g. '4x4'.")
    species: str = Field("DF-L", description="NDS species group, e.g. 'DF-L', 'SPF'.")
    grade: str = Field("No.2", description="NDS grade, e.g. 'No.2', 'No.1/No.2'.")
    # every kind
    tension_capacity: Force | None = Field(
        None, gt=0, description="Allowable tension of the brace with its end connections (lb); "
                                "rated and lumber braces give it or compression_only.")
    compression_only: bool = Field(
        False, description="The brace works in compression only: wind away from its face is "
                           "held by the wall alone (method notes §4).")
    end_connection: Force | None = Field(
        None, gt=0, description="Rated allowable load of the end fittings (lb).")
    on_hand: int | None = Field(None, ge=0, le=COUNT_LIMIT, description="How many the site has.")

    @model_validator(mode="after")
    def _complete(self):
        if self.compression_only and self.tension_capacity is not None:
            raise ValueError("compression_only = true and a tension_capacity: give one or the "
                             "other")
        # Tension that cannot be computed must be stated (method notes §4): a rated or lumber
        # brace's tension_capacity; a pipe's end connection (end_connection or
        # tension_capacity). An unrated brace has no capacity either way (flagged as such).
        if not self.compression_only:
            if self.kind in ("rated", "lumber") and self.tension_capacity is None:
                raise ValueError(f"field tension_capacity: a {self.kind} brace states its "
                                 "allowable tension (tension_capacity, lb) or compression_only "
                                 "= true")
            if self.kind == "pipe" and self.tension_capacity is None \
                    and self.end_connection is None:
                raise ValueError("field end_connection: a pipe brace states the allowable load "
                                 "of its end connections (end_connection or tension_capacity, "
                                 "lb) or compression_only = true")
        if self.kind == "rated":
            if len(self.lengths) < 2 or len(self.lengths) != len(self.loads):
                raise ValueError("a rated brace needs `lengths` and `loads` of equal length (2+)")
            if any(b <= a for a, b in zip(self.lengths, self.lengths[1:])):
                raise ValueError("rated table `lengths` must increase")
            if self.lengths[0] <= 0:
                raise ValueError("rated table `lengths` must be positive")
            if any(x <= 0 for x in self.loads):
                raise ValueError("rated table `loads` must be positive")
        if self.kind == "pipe" and self.section not in PIPES:
            raise ValueError(f"pipe `section` must be one of {', '.join(PIPES)}")
        if self.kind == "lumber":
            if self.size not in DRESSED_SIZES_IN:
                raise ValueError(f"lumber `size` must be one of {', '.join(DRESSED_SIZES_IN)}")
            if not any(k[0] == self.species and k[1] == self.grade for k in LUMBER_GRADES):
                known = sorted({f"{k[0]} {k[1]}" for k in LUMBER_GRADES})
                raise ValueError(f"unknown lumber species/grade; known: {', '.join(known)}")
        return self


class AnchorType(Strict):
    """An anchor at either end of a brace: panel insert, slab anchor, helical, deadman, stake,
    or a fastening to an upper-floor deck."""

    kind: Literal[tuple(ANCHOR_KINDS)]  # one entry each in bracing.anchor_kinds
    # insert, stake and deck: the maker's (or the engineer's) allowable ratings at the angle used
    rated_tension: Force | None = Field(None, gt=0, description="Allowable tension (lb).")
    rated_shear: Force | None = Field(None, gt=0, description="Allowable shear (lb).")
    # slab anchor (ACI 318-19 Ch. 17)
    embedment: Thickness | None = Field(None, gt=0, description="h_ef (in).")
    diameter: Thickness | None = Field(None, gt=0, description="d_a (in).")
    cast_in: bool = Field(False, description="Cast-in (headed) or post-installed.")
    category: int = Field(1, ge=1, le=3, description="Post-installed anchor category (ACI 355.2).")
    steel_area: SectionArea | None = Field(None, gt=0, description="A_se,N (in^2).")
    steel_strength: Stress = Field(75000.0, gt=0, description="f_uta (psi).")
    pullout: Force | None = Field(None, gt=0, description="Nominal pullout N_p from the product "
                                                            "report (lb); headed: from bearing area.")
    bearing_area: SectionArea | None = Field(None, gt=0, description="Headed anchor A_brg (in^2).")
    slab_thickness: Thickness | None = Field(None, gt=0, description="h_a (in).")
    concrete_strength: Stress | None = Field(None, gt=0, description="Slab f'c on the day (psi).")
    cracked: bool = Field(True, description="Cracked concrete (the default, conservative).")
    edge_distance: Thickness | None = Field(
        None, gt=0, description="Least edge distance the type needs (in); the plan gives the "
                                "real one.")
    # helical (ICC-ES AC358)
    shaft: Literal[tuple(anchors.KT_AC358_PER_FT)] = Field(
        "1.5in_square", description="Helical shaft: gives K_t (ICC-ES AC358) unless "
                                    "torque_factor is set.")
    torque_factor: float | None = Field(None, gt=0, le=100, description="K_t (1/ft); default by "
                                        "the shaft (ICC-ES AC358).")
    factor_of_safety: float = Field(anchors.HELICAL_FACTOR_OF_SAFETY, gt=0, le=10,
                                    description="On K_t T (ICC-ES AC358).")
    installation_torque: Moment | None = Field(
        None, gt=0, description="Final installation torque the crew reaches (ft-lb).")
    # deadman block
    weight: Force | None = Field(None, gt=0, description="Block weight (lb).")
    soil: str | None = Field(
        None, description="Soil under the block: its friction from soil_table (e.g. "
                          "'silty_sand'); without it, friction_coefficient is used.")
    soil_table: Literal[tuple(anchors.FRICTION_TABLES)] = Field(
        "IBC", description="'IBC' Table 1806.2 (allowable) or 'NAVFAC' DM-7.02 Table 1 "
                           "(ultimate).")
    friction_coefficient: float = Field(
        anchors.FRICTION_CONCRETE_ON_CONCRETE, gt=0, le=1.0,
        description="Block on slab 0.6 (ACI 318-19 §22.9.4.2); on soil give `soil`.")
    friction_basis: Literal["allowable", "ultimate"] = Field(
        "ultimate", description="'allowable' for IBC Table 1806.2 values (used as they are); "
                                "'ultimate' for NAVFAC DM-7.02 or concrete on concrete (a "
                                "factor of safety of 1.5 applies).")
    length: Length | None = Field(None, gt=0, description="Block length along the brace (ft); "
                                                          "with pin_height, its overturning is "
                                                          "checked.")
    pin_height: Length | None = Field(None, ge=0, description="Brace foot pin above the block's "
                                                              "base (ft).")
    pin_from_toe: Length | None = Field(None, ge=0, description="Brace foot pin from the block's "
                                                                "toe, its edge nearer the wall, "
                                                                "in plan (ft); default mid-length.")
    width: Length | None = Field(None, gt=0, description="Block width across the brace (ft); "
                                                         "with allowable_bearing, the pressure "
                                                         "under it is checked.")
    allowable_bearing: Pressure | None = Field(None, gt=0, description="Allowable bearing under "
                                                                       "the block (psf), e.g. IBC "
                                                                       "Table 1806.2.")
    on_hand: int | None = Field(None, ge=0, le=COUNT_LIMIT, description="How many the site has.")

    @model_validator(mode="after")
    def _complete(self):
        missing = [k for k in ANCHOR_KINDS[self.kind].needs if getattr(self, k) is None]
        if missing:
            raise ValueError(f"a {self.kind} anchor needs {', '.join(missing)}")
        if self.torque_factor is None:
            self.torque_factor = anchors.KT_AC358_PER_FT[self.shaft]
        if self.soil is not None:
            if {"friction_coefficient", "friction_basis"} & self.model_fields_set:
                raise ValueError("give soil or friction_coefficient, not both")
            values = anchors.FRICTION_TABLES[self.soil_table][0]
            if self.soil not in values:
                raise ValueError(f"soil {self.soil!r} is not in the {self.soil_table} table; "
                                 f"known: {', '.join(values)}")
            self.friction_coefficient, self.friction_basis = anchors.soil_friction(
                self.soil, self.soil_table)
        if (self.length is None) != (self.pin_height is None):
            raise ValueError("a deadman's overturning needs both length and pin_height")
        if self.pin_from_toe is not None and (self.length is None
                                              or self.pin_from_toe > self.length):
            raise ValueError("pin_from_toe must lie within the block's length")
        if (self.width is None) != (self.allowable_bearing is None) or (
                self.width is not None and self.length is None):
            raise ValueError("the bearing under a deadman needs width and allowable_bearing, "
                             "with length and pin_height")
        return self


class Bracing(Strict):
    """How one wall is braced: count, positions, insert height, foot distance, hardware."""

    brace_type: str = Field(description="A key of [brace_types].")
    wall_anchor: str | None = Field(None, description="Anchor on the wall: a key of "
                                                       "[anchor_types] (an insert).")
    foot_anchor: str | None = Field(None, description="Anchor at the brace foot: a key of "
                                                       "[anchor_types].")
    count: int = Field(ge=1, le=BRACE_LIMIT)
    insert_height: Length = Field(gt=0, le=200, description="Above the wall's base (ft).")
    anchor_distance: Length | None = Field(None, gt=0, le=1000,
                                           description="Foot from the wall face (ft).")
    angle: Angle | None = Field(None, gt=0, lt=90, description="From horizontal (deg).")
    positions: list[Length] = Field(
        default_factory=list, description="From the wall's left edge (ft); default: the "
                                          "centers of equal strips.")
    insert_offset: Thickness = Field(0.0, ge=0, description="Brace pin out from the face (in).")
    foot_offset: Thickness = Field(0.0, ge=0, description="Foot pin above the slab (in).")
    base_below_slab: Length = Field(0.0, ge=0, description="Wall base below the slab the "
                                                           "braces stand on (ft).")
    lean: Thickness = Field(0.25, ge=0, description="Erection out-of-plumb at the top (in).")
    slop: Thickness = Field(0.125, ge=0, description="Brace slop at the insert (in).")
    pretensioned: bool = Field(False, description="Braces pre-tensioned to share evenly.")
    stiff_member: bool = Field(
        False, description="A continuous stiff member (strongback or waler) ties the braces "
                           "of a masonry or framed wall together: they then share the wind "
                           "as on a rigid panel, with the twist. Without one each brace "
                           "carries its own strip of wall.")

    @model_validator(mode="after")
    def _geometry(self):
        if (self.anchor_distance is None) == (self.angle is None):
            raise ValueError("give exactly one of anchor_distance or angle")
        if self.positions and len(self.positions) != self.count:
            raise ValueError(f"{len(self.positions)} positions for {self.count} braces")
        if len(set(self.positions)) < len(self.positions):
            raise ValueError("two braces at the same position")
        rise = self.insert_height - self.base_below_slab - self.foot_offset / 12.0
        if rise <= 0:
            raise ValueError("insert_height is not above the brace foot (base_below_slab and "
                             "foot_offset leave no rise)")
        if self.anchor_distance is not None and self.anchor_distance <= self.insert_offset / 12.0:
            raise ValueError("anchor_distance is not beyond the insert_offset: the brace has no "
                             "run")
        return self


class DesignOptions(Strict):
    """What the layout designer may use for walls that have no bracing yet."""

    brace_types: list[str] = Field(min_length=1, description="Keys of [brace_types] to try.")
    wall_anchor: str | None = Field(None, description="Insert on the wall: a key of "
                                                       "[anchor_types].")
    foot_anchors: list[str] = Field(default_factory=list,
                                    description="Keys of [anchor_types] to try at the foot.")
    most_braces: int = Field(6, ge=1, le=BRACE_LIMIT, description="Most braces allowed per wall.")
    room: Length | None = Field(None, gt=0, description="Most distance from the wall face to "
                                                        "a brace foot (ft).")
    insert_offset: Thickness = Field(0.0, ge=0, description="Brace pin out from the face (in).")
    foot_offset: Thickness = Field(0.0, ge=0, description="Foot pin above the slab (in).")


# A plan coordinate (ft), inside the length kind's range.
Coordinate = Annotated[float, Field(ge=-COORDINATE_LIMIT, le=COORDINATE_LIMIT)]
Point = tuple[Coordinate, Coordinate]


def _us_spelling(value):
    """An area kind in US spelling ('neighbour' is read as 'neighbor')."""
    return "neighbor" if value == "neighbour" else value


class Area_(Strict):
    """A named area of the plan: kept clear, a public way, a neighbor, an office, a work area."""

    name: str = Field(min_length=1)
    kind: Annotated[Literal["keep_clear", "crane_path", "public_way", "neighbor", "office",
                            "work"], BeforeValidator(_us_spelling)] = Field(
        description="US spelling; the older 'neighbour' is read as 'neighbor'.")
    polygon: list[Point] = Field(min_length=3, description="Corners in plan (ft).")


class Plan(Strict):
    """Site geometry in plan (ft): the slab, its holes and joints, open ground, named areas."""

    slab: list[Point] = Field(default_factory=list, description="Slab outline corners (ft).")
    slab_holes: list[list[Point]] = Field(default_factory=list,
                                          description="Pits and openings in the slab.")
    slab_joints: list[list[Point]] = Field(
        default_factory=list, description="Pour-strip edges and saw-cut joints as polylines; "
                                          "slab anchors keep their edge distance from them.")
    ground: list[list[Point]] = Field(default_factory=list,
                                      description="Open ground where ground anchors may go.")
    areas: list[Area_] = Field(default_factory=list)
    joint_gap: Length = Field(1.0, ge=0, description="Largest gap (ft) between panels that "
                                                     "still act as one wall to the wind.")

    @field_validator("slab")
    @classmethod
    def _slab_outline(cls, corners: list[Point]) -> list[Point]:
        if corners:
            _simple_polygon(corners, "the slab outline")
        return corners

    @field_validator("slab_holes", "ground")
    @classmethod
    def _outlines(cls, polygons: list[list[Point]]) -> list[list[Point]]:
        for k, corners in enumerate(polygons, start=1):
            _simple_polygon(corners, f"outline {k}")
        return polygons


def _simple_polygon(corners: list[Point], what: str) -> None:
    """Refuse an outline that crosses, touches or doubles back on itself: it has no clear inside
    and edge, so anchors on it could not be placed nor their edge distances measured."""
    import shapely  # only sites with a plan need it
    from shapely.geometry import Polygon

    if len(corners) < 3:
        raise ValueError(f"{what} needs at least 3 corners, got {len(corners)}")
    reason = shapely.is_valid_reason(Polygon(corners))
    if reason != "Valid Geometry":
        where = reason.partition("[")[2].rstrip("]").split()
        near = f" near ({float(where[0]):g}, {float(where[1]):g})" if len(where) == 2 else ""
        raise ValueError(f"{what} crosses, touches or doubles back on itself{near}: draw it as "
                         "one simple loop of corners")


class WallLine(Strict):
    """A straight line of wall in plan; its panels stand along it, braced on one side."""

    name: str = Field(min_length=1)
    start: Point
    end: Point
    braced_side: Literal["left", "right"] = Field(
        description="Side of the line, looking from start to end, where the braces stand.")

    @model_validator(mode="after")
    def _length(self):
        if self.start == self.end:
            raise ValueError("start and end are the same point")
        return self


class Event(Strict):
    """A step of the permanent work that makes walls eligible for release."""

    name: str = Field(min_length=1)
    day: int = Field(ge=1, le=DAY_LIMIT)
    kind: Literal["diaphragm", "connections", "pour_strip", "other"] = "diaphragm"


class SignOff(Strict):
    """The engineer of record's release of one wall's braces (OSHA 1926.704(a))."""

    panel: str
    day: int = Field(ge=1, le=DAY_LIMIT)
    by: str = Field(min_length=1, description="Who released the wall.")


class Forecast(Strict):
    """A forecast file: CSV of date (or day) and forecast gust, an optional storm column."""

    file: str


class Panel(Strict):
    """A wall panel or wall segment standing on its own or on braces."""

    mark: str = Field(min_length=1)
    material: str = Field(description="A key of [materials].")
    width: Length = Field(gt=0, le=5000, description="Length along the wall, B (ft).")
    height: Length = Field(gt=0, le=200, description="Height of the panel, s (ft).")
    thickness: Thickness = Field(gt=0, le=120, description="in.")
    unit_weight: UnitWeight | None = Field(None, gt=0, description="Overrides the material (pcf).")
    face_weight: Pressure | None = Field(None, gt=0, description="Overrides the material (psf).")
    base_elevation: Length = Field(
        0.0, ge=0, le=3000, description="Base above grade (ft): a dock, podium or upper floor.")
    openings: list[Opening] = Field(default_factory=list)
    opening_area: Area | None = Field(
        None, ge=0, description="Openings by total area only (ft^2), positions unknown.")
    footing: Footing | None = None
    return_walls: list[ReturnWall] = Field(
        default_factory=list, max_length=2, description="At most one at each end.")
    standing_time: Duration | None = Field(
        None, gt=0, description="Weeks the wall stands before release; default the site's.")
    mortar_age: Age | None = Field(None, ge=0, description="Masonry: age of the mortar (days).")
    bracing: Bracing | None = None
    line: str | None = Field(None, description="The wall line it stands on (a [[lines]] name).")
    offset: Length = Field(0.0, ge=0, description="From the line's start to the panel's first "
                                                  "edge (ft); positions count from that edge.")
    lift_day: int | None = Field(None, ge=1, le=DAY_LIMIT, description="Day the wall is stood.")
    release_after: list[str] = Field(default_factory=list,
                                     description="Events that make it eligible for release.")

    @model_validator(mode="after")
    def _openings_fit(self):
        b = self.bracing
        if b is not None:
            if b.insert_height > self.height:
                raise ValueError("bracing.insert_height is above the wall's top")
            if any(x < 0 or x > self.width for x in b.positions):
                raise ValueError("a bracing position lies outside the wall's width")
        for i, o in enumerate(self.openings):
            if o.x + o.width > self.width + 1e-9 or o.y + o.height > self.height + 1e-9:
                raise ValueError(f"opening {i + 1} does not fit inside the panel")
        open_area = sum(o.width * o.height for o in self.openings) + (self.opening_area or 0.0)
        if open_area >= self.width * self.height:
            raise ValueError("the openings take the whole panel")
        if len({r.end for r in self.return_walls}) < len(self.return_walls):
            raise ValueError("two return walls at the same end")
        return self


class Site(Strict):
    """A whole site file, validated. Keys and values use US spelling (an older British
    spelling of a value, such as area kind 'neighbour', is read as its US alias)."""

    version: int = Field(SCHEMA_VERSION, ge=1, description="Site file format version.")
    site: SiteInfo
    rules: dict[str, Rule] = Field(default_factory=dict)
    materials: dict[str, Material]
    brace_types: dict[str, BraceType] = Field(default_factory=dict)
    anchor_types: dict[str, AnchorType] = Field(default_factory=dict)
    plan: Plan | None = None
    lines: list[WallLine] = Field(default_factory=list)
    events: list[Event] = Field(default_factory=list)
    signoffs: list[SignOff] = Field(default_factory=list)
    forecast: Forecast | None = None
    design: DesignOptions | None = Field(
        None, description="Options of `bracing check --design` for walls with no bracing.")
    panels: list[Panel] = Field(min_length=1)
    # foundation walls and their backfill (bracing.foundation_model, method notes §12)
    backfill: foundation_model.BackfillSoil | None = None
    foundation_walls: list[foundation_model.FoundationWall] = Field(default_factory=list)
    backfill_events: list[foundation_model.BackfillEvent] = Field(default_factory=list)

    @model_validator(mode="wrap")
    @classmethod
    def _references(cls, data, handler):
        """Cross-references are checked on the raw data, so that every one is reported at its
        own key together with every field error (a file's problems all at once)."""
        found = [InitErrorDetails(type=PydanticCustomError("reference", "{message}",
                                                           {"message": message}),
                                  loc=loc, input=value)
                 for loc, message, value in reference_problems(data)]
        try:
            site = handler(data)
        except ValidationError as exc:
            if not found:
                raise
            found = [InitErrorDetails(type=e["type"], loc=e["loc"], input=e["input"],
                                      ctx=e.get("ctx", {})) for e in exc.errors()] + found
        if found:
            raise ValidationError.from_exception_data(cls.__name__, found)
        return site

    def rule(self, name: str) -> Rule:
        """The site's rule, or the default one."""
        return self.rules.get(name, DEFAULT_RULES[name])

    def rule_value(self, name: str) -> float | None:
        """The rule's value, or None when it is switched off."""
        r = self.rule(name)
        return r.value if r.enabled else None


def _names_of(data: dict, section: str, problems: list) -> set:
    """The `name`s of an array of tables such as [[lines]]; a repeated name is a problem."""
    items = data.get(section)
    seen: set = set()
    for i, item in enumerate(items if isinstance(items, list) else []):
        name = item.get("name") if isinstance(item, dict) else None
        if isinstance(name, str) and name in seen:
            problems.append(((section, i, "name"), "used twice", name))
        elif isinstance(name, str):
            seen.add(name)
    return seen


def _number(value) -> float | None:
    """A rule's raw value as the model reads it (a number, or text of one), else None."""
    if isinstance(value, bool) or not isinstance(value, (int, float, str)):
        return None
    try:
        number = float(value)
    except (ValueError, OverflowError):
        return None
    return number if math.isfinite(number) else None  # the field itself refuses nan and inf


def reference_problems(data) -> list[tuple[tuple, str, object]]:
    """(location, message, value) of every unknown rule, material, brace or anchor type, wall
    line, event or signed-off panel, repeated mark or name and too-new version in raw site data;
    other shapes are left to the fields."""
    if not isinstance(data, dict):
        return []

    def names(section: str) -> set:
        value = data.get(section)
        return set(value) if isinstance(value, dict) else set()

    problems: list[tuple[tuple, str, object]] = []
    rules = data.get("rules") if isinstance(data.get("rules"), dict) else {}
    for rule, (low, high) in RULE_RANGES.items():
        value = rules.get(rule, {}).get("value") if isinstance(rules.get(rule), dict) else None
        number = _number(value)
        if number is not None and not low < number <= high:  # nan is in no range
            problems.append((("rules", rule, "value"), f"must be above {low:g} and at most "
                             f"{high:g} (method notes §9)", value))
    for rule in names("rules") - set(DEFAULT_RULES):
        problems.append((("rules", rule), f"unknown rule; known: {', '.join(DEFAULT_RULES)}", rule))
    lines = _names_of(data, "lines", problems)
    events = _names_of(data, "events", problems)
    panels = data.get("panels")
    first_of: dict[str, int] = {}
    known = {section: names(section) for section in ("materials", "brace_types", "anchor_types")}
    for i, p in enumerate(panels if isinstance(panels, list) else []):
        if not isinstance(p, dict):
            continue
        material = p.get("material")
        if isinstance(data.get("materials"), dict) and isinstance(material, str) \
                and material not in known["materials"]:
            problems.append((("panels", i, "material"), f"{material!r} is not in [materials] "
                             f"({', '.join(sorted(known['materials'])) or 'none given'})",
                             material))
        bracing = p.get("bracing")
        if isinstance(bracing, dict):
            refs = [("brace_type", "brace_types"), ("wall_anchor", "anchor_types"),
                    ("foot_anchor", "anchor_types")]
            for key, section in refs:
                name = bracing.get(key)
                if isinstance(name, str) and name not in known[section]:
                    problems.append((("panels", i, "bracing", key),
                                     f"{name!r} is not in [{section}]", name))
        mark = p.get("mark")
        if isinstance(mark, str) and mark in first_of:
            problems.append((("panels", i, "mark"),
                             f"used twice (also panel #{first_of[mark] + 1})",
                             mark))
        elif isinstance(mark, str):
            first_of[mark] = i
        line = p.get("line")
        if isinstance(line, str) and line not in lines:
            problems.append((("panels", i, "line"), f"{line!r} is not a [[lines]] name", line))
        after = p.get("release_after")
        for j, event in enumerate(after if isinstance(after, list) else []):
            if isinstance(event, str) and event not in events:
                problems.append((("panels", i, "release_after", j),
                                 f"{event!r} is not an [[events]] name", event))
    signoffs = data.get("signoffs")
    for i, s in enumerate(signoffs if isinstance(signoffs, list) else []):
        mark = s.get("panel") if isinstance(s, dict) else None
        if isinstance(mark, str) and mark not in first_of.keys() | foundation_model.marks(data):
            problems.append((("signoffs", i, "panel"), f"{mark!r} is not a panel mark", mark))
    problems += foundation_model.reference_problems(data, lines, events, set(first_of))
    version = data.get("version")
    if isinstance(version, int) and not isinstance(version, bool) and version > SCHEMA_VERSION:
        problems.append((("version",), f"version {version} is newer than this program "
                                       f"({SCHEMA_VERSION})", version))
    return problems


# Every panel field the evaluation reads (`read_panels`).
PANEL_FIELDS = ("mark", "material", "thickness", "face_weight", "unit_weight", "openings",
                "width", "height", "opening_area", "mortar_age", "footing", "return_walls",
                "standing_time", "base_elevation", "bracing", "lift_day", "line", "offset",
                "release_after")


# Every field of a wall's bracing the evaluation reads.
BRACING_FIELDS = ("count", "positions", "insert_height", "insert_offset", "foot_offset",
                  "base_below_slab", "lean", "slop", "pretensioned", "stiff_member", "brace_type",
                  "wall_anchor", "foot_anchor", "anchor_distance", "angle")


def read_panels(site: Site) -> dict[str, tuple]:
    """Each field of PANEL_FIELDS over all panels (a tuple in site order), and under "braced"
    the rows of the braced panels with each field of BRACING_FIELDS over them, in one pass
    each: a large site's objects lie far apart in memory, so every pass over them costs."""
    columns = (dict(zip(PANEL_FIELDS, zip(*map(attrgetter(*PANEL_FIELDS), site.panels))))
               if site.panels else dict.fromkeys(PANEL_FIELDS, ()))
    layouts = columns["bracing"]
    columns["braced"] = tuple(k for k, b in enumerate(layouts) if b is not None)
    read = attrgetter(*BRACING_FIELDS)
    fields = zip(*(read(layouts[k]) for k in columns["braced"]))
    columns.update(zip(BRACING_FIELDS, fields) if columns["braced"]
                   else dict.fromkeys(BRACING_FIELDS, ()))
    return columns


from bracing import foundation_model
