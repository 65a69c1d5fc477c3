"""The whole site file (`Site`): its sections, listed in one place, and where the walls stand."""

from __future__ import annotations

from datetime import date
from typing import Literal

from pydantic import Field, ValidationError, model_validator
from pydantic_core import InitErrorDetails, PydanticCustomError

from bracing.model.base import SCHEMA_VERSION, Duration, Length, Speed, Strict
from bracing.model.days import Event, Forecast, SignOff
from bracing.model.foundation import BackfillEvent, BackfillSoil, FoundationWall
from bracing.model.gear import AnchorType, BraceType, DesignOptions
from bracing.model.references import reference_problems
from bracing.model.rules import DEFAULT_RULES, Rule
from bracing.model.site_plan import Plan, WallLine
from bracing.model.walls import Material, Panel


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


class Site(Strict):
    """A whole site file, validated. Keys and values use US spelling (an older British
    spelling of a value, such as area kind 'neighbour', is read as its US alias)."""

    # The site file's sections, one field each. A new section: its class in the module of its
    # topic (or a new module of bracing/model), imported above, one line here; a name it refers
    # to is checked by a small function in references.CHECKS.
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
    # foundation walls and their backfill (bracing.model.foundation, method notes §12)
    backfill: BackfillSoil | None = None
    foundation_walls: list[FoundationWall] = Field(default_factory=list)
    backfill_events: list[BackfillEvent] = Field(default_factory=list)

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
