"""The site in plan: the slab, its holes and joints, open ground, named areas, and wall lines."""

from __future__ import annotations

from typing import Annotated, Literal

from pydantic import BeforeValidator, Field, field_validator, model_validator

from bracing.model.base import Length, Point, Strict


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
