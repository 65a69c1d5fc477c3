"""The walls: their materials, openings, footings, return walls, and the panel itself."""

from __future__ import annotations

from typing import Literal

from pydantic import Field, model_validator

from bracing.model.base import (
    DAY_LIMIT,
    Age,
    Area,
    Duration,
    Length,
    LinearForce,
    Positive,
    Pressure,
    Stress,
    Strict,
    Thickness,
    UnitWeight,
)
from bracing.model.gear import Bracing


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
