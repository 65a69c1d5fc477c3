"""The site model: pydantic classes that validate a site file (design.md §2).

Each quantity field documents its unit; a bare number takes that unit, a text value may carry any
unit of the same kind ("31 ft", "9.5 m"). Validation lives here, at the edge: the engine trusts a
`Site` once it exists.
"""

from __future__ import annotations

from typing import Annotated, Literal

from pydantic import (
    BaseModel,
    BeforeValidator,
    ConfigDict,
    Field,
    WithJsonSchema,
    model_validator,
)

from bracing import units

SCHEMA_VERSION = 1


def _quantity(kind: str, description: str = ""):
    """A float field read through `units.parse` for `kind`, with its unit in the JSON schema."""
    unit, word = units.KINDS[kind]
    text = f"{description} ({word}; a bare number is in {unit.replace('**', '^')})".strip()
    return Annotated[
        float,
        BeforeValidator(lambda v: units.parse(v, kind)),
        WithJsonSchema({"anyOf": [{"type": "number"}, {"type": "string"}], "description": text}),
    ]


Length = _quantity("length")
Thickness = _quantity("thickness")
Area = _quantity("area")
Force = _quantity("force")
Moment = _quantity("moment")
Pressure = _quantity("pressure")
Stress = _quantity("stress")
UnitWeight = _quantity("unit_weight")
Speed = _quantity("speed")
Angle = _quantity("angle")
Duration = _quantity("duration")
Age = _quantity("age")

Positive = Field(gt=0)
NonNegative = Field(ge=0)


class Strict(BaseModel):
    """Unknown keys are errors: a misspelt key must not be silently ignored."""

    model_config = ConfigDict(extra="forbid", populate_by_name=True)


class Rule(Strict):
    """A site rule as data: its value, where it comes from and on what basis it applies."""

    value: float | None = Field(description="The rule's value in its documented unit.")
    source: str = Field(description="Standard, regulation or practice the value comes from.")
    basis: str = Field("", description="Averaging time, height, load level or factor to apply.")
    enabled: bool = True


def _rule(value, source, basis="", enabled=True) -> Rule:
    return Rule(value=value, source=source, basis=basis, enabled=enabled)


DEFAULT_RULES: dict[str, Rule] = {
    "minimum_design_pressure_psf": _rule(
        16.0, "ASCE 7-16 §29.7 (from memory)",
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
        20.0, "masonry industry standard practice (secondary)",
        "initial period (fresh mortar): clear the restricted zone above this job-site gust, "
        "1.0W, Kd 1.0"),
    "masonry_intermediate_speed_mph": _rule(
        35.0, "masonry industry standard practice (secondary)",
        "intermediate period: clear the restricted zone above this job-site gust, 1.0W, Kd 1.0"),
    "masonry_bracing_design_speed_mph": _rule(
        40.0, "masonry industry standard practice (secondary)",
        "intermediate period bracing design gust, 1.0W, Kd 1.0", enabled=False),
}


class SiteInfo(Strict):
    """Where the walls stand and the wind they must resist."""

    name: str = Field(min_length=1)
    basic_wind_speed: Speed = Field(gt=0, description="ASCE 7-16 basic wind speed V (mph).")
    exposure: Literal["B", "C", "D"] = Field("C", description="ASCE 7-16 §26.7 exposure.")
    topographic_factor: float = Field(1.0, ge=1.0, le=3.0, description="Kzt, ASCE 7-16 §26.8.")
    ground_elevation: Length = Field(0.0, ge=-1000, le=20000, description="For Ke (ft).")
    design_basis: Literal["ASD", "LRFD"] = "ASD"
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
    grouting: Literal["hollow", "partly", "solid"] = Field(
        "hollow", description="Masonry: hollow (ungrouted), partly or fully grouted/solid units.")
    mortar: Literal["M/S", "N"] = Field("M/S", description="Masonry mortar type (TMS 402).")
    flexural_tension: Stress | None = Field(
        None, ge=0, description="Masonry allowable flexural tension normal to bed joints (psi); "
                                "default from TMS 402-16 Table 8.2.4.2 (from memory).")
    sheathed: bool = Field(True, description="Framed walls: sheathed (solid) or open studs.")

    @model_validator(mode="after")
    def _weight_given(self):
        if self.unit_weight is None and self.face_weight is None:
            raise ValueError("give unit_weight or face_weight")
        return self


class Opening(Strict):
    """A rectangular opening in the panel's elevation, from its bottom-left corner."""

    x: Length = Field(ge=0, description="From the panel's left edge (ft).")
    y: Length = Field(ge=0, description="From the panel's base (ft).")
    width: Length = Positive
    height: Length = Positive


class Footing(Strict):
    """A footing under a free-standing wall (overturning, sliding and bearing use it)."""

    width: Length = Field(gt=0, description="Across the wall (ft), centred under it.")
    thickness: Length = Field(gt=0, description="Depth of the footing (ft).")
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


class Panel(Strict):
    """A wall panel or wall segment standing on its own or on braces."""

    mark: str = Field(min_length=1)
    material: str = Field(description="A key of [materials].")
    width: Length = Field(gt=0, description="Length along the wall, B (ft).")
    height: Length = Field(gt=0, description="Height of the panel, s (ft).")
    thickness: Thickness = Field(gt=0, description="in.")
    unit_weight: UnitWeight | None = Field(None, gt=0, description="Overrides the material (pcf).")
    face_weight: Pressure | None = Field(None, gt=0, description="Overrides the material (psf).")
    base_elevation: Length = Field(
        0.0, ge=0, description="Base above grade (ft): a dock, podium or upper floor.")
    openings: list[Opening] = Field(default_factory=list)
    opening_area: Area | None = Field(
        None, ge=0, description="Openings by total area only (ft^2), positions unknown.")
    footing: Footing | None = None
    return_walls: list[ReturnWall] = Field(
        default_factory=list, max_length=2, description="At most one at each end.")
    standing_time: Duration | None = Field(
        None, gt=0, description="Weeks the wall stands before release; default the site's.")
    mortar_age: Age | None = Field(None, ge=0, description="Masonry: age of the mortar (days).")

    @model_validator(mode="after")
    def _openings_fit(self):
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
    """A whole site file, validated."""

    version: int = Field(SCHEMA_VERSION, description="Site file format version.")
    site: SiteInfo
    rules: dict[str, Rule] = Field(default_factory=dict)
    materials: dict[str, Material]
    panels: list[Panel] = Field(min_length=1)

    @model_validator(mode="after")
    def _references(self):
        unknown = [r for r in self.rules if r not in DEFAULT_RULES]
        if unknown:
            raise ValueError(f"unknown rule(s) {', '.join(unknown)}; known: "
                             f"{', '.join(DEFAULT_RULES)}")
        marks: set[str] = set()
        for p in self.panels:
            if p.material not in self.materials:
                raise ValueError(f"panel {p.mark}: material {p.material!r} is not in [materials]")
            if p.mark in marks:
                raise ValueError(f"panel mark {p.mark!r} is used twice")
            marks.add(p.mark)
        if self.version > SCHEMA_VERSION:
            raise ValueError(f"version {self.version} is newer than this program ({SCHEMA_VERSION})")
        return self

    def rule(self, name: str) -> Rule:
        """The site's rule, or the default one."""
        return self.rules.get(name, DEFAULT_RULES[name])

    def rule_value(self, name: str) -> float | None:
        """The rule's value, or None when it is switched off."""
        r = self.rule(name)
        return r.value if r.enabled else None
