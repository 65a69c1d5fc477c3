"""Site-file keys of foundation walls backfilled before the floor (method notes §12).

`[backfill]` (the site's backfill), `[[foundation_walls]]` and `[[backfill_events]]` hang off the
Site (bracing.model.site) by three fields; this module holds their classes and the checks that need
more than one item (a wall, its line, its events and its day). The floor deck is an ordinary
`[[events]]` entry that a wall names in `release_after`, and the engineer's release of the wall
from the cantilever check is an ordinary `[[signoffs]]` entry with the wall's mark, as for braces.
"""

from __future__ import annotations

from typing import Literal

from pydantic import Field, field_validator, model_validator

from bracing import anchors, backfill, units
from bracing.model.base import (
    DAY_LIMIT,
    Age,
    Angle,
    Length,
    Pressure,
    SectionArea,
    Stress,
    Strict,
    Thickness,
    UnitWeight,
)


class BackfillSoil(Strict):
    """The backfill against foundation walls: its pressure, surcharge and water."""

    soil: str | None = Field(None, description="Soil class of IBC 2018 Table 1610.1, e.g. 'SM' "
                                               "(OL, OH, MH and CH are refused as backfill).")
    pressure: UnitWeight | None = Field(
        None, gt=0, le=500, description="The geotechnical report's equivalent fluid pressure "
                                        "(psf per ft of depth, written as pcf), instead of soil.")
    pressure_source: str = Field("the geotechnical report", description="Where `pressure` "
                                                                        "comes from.")
    pressure_state: Literal["at_rest", "active"] = Field(
        "at_rest", description="A site rule the engineer sets: at-rest (default; compaction "
                               "locks it in) or active, for a wall free to rotate.")
    unit_weight: UnitWeight = Field(backfill.SOIL_UNIT_WEIGHT_PCF, ge=30, le=200,
                                    description="Backfill unit weight (pcf).")
    surcharge: Pressure = Field(0.0, ge=0, le=5000, description="Standing uniform surcharge on "
                                                               "the backfill surface (psf).")
    water_level: Length | None = Field(None, ge=0, description="Water in the backfill, height "
                                                               "above the footing (ft).")
    drained: bool = Field(False, description="The drains are working (no water in the fill).")

    @field_validator("soil")
    @classmethod
    def _suitable(cls, soil: str | None) -> str | None:
        if soil is not None:
            backfill.equivalent_fluid_pressure(soil)  # refuses OL, OH, MH, CH and unknowns
            return soil.strip().upper()
        return soil

    @model_validator(mode="after")
    def _one_pressure(self):
        if (self.soil is None) == (self.pressure is None):
            raise ValueError("give soil (IBC Table 1610.1 class) or pressure (the report's "
                             "equivalent fluid pressure), one of them")
        if self.drained and self.water_level is not None:
            raise ValueError("give water_level or drained = true, not both")
        return self

    def efp(self) -> tuple[float, str]:
        """The equivalent fluid pressure (psf/ft) and its source."""
        if self.pressure is not None:
            return self.pressure, self.pressure_source
        words = self.pressure_state.replace("_", "-")
        return (backfill.equivalent_fluid_pressure(self.soil, self.pressure_state),
                f"{backfill.EFP_SOURCE}, {self.soil} {words}")


class WallBars(Strict):
    """Vertical bars of a reinforced wall (ASTM A615 sizes)."""

    bar: Literal[tuple(backfill.BARS)] | None = Field(None, description="Bar size, e.g. '#5'.")
    area: SectionArea | None = Field(None, gt=0, le=10, description="Area of one bar (in^2), "
                                                                    "instead of bar.")
    spacing: Thickness = Field(gt=0, le=120, description="Bar spacing along the wall (in).")
    cover: Thickness | None = Field(None, ge=0, description="From the backfill face to the bar "
                                                            "(in).")
    depth: Thickness | None = Field(None, gt=0, description="d from the backfill face to the bar's "
                                                            "center (in), instead of cover.")
    yield_strength: Stress = Field(60000.0, ge=20000, le=100000, description="fy (psi).")

    @model_validator(mode="after")
    def _given(self):
        if (self.bar is None) == (self.area is None):
            raise ValueError("give bar (a size) or area (in^2), one of them")
        if self.cover is not None and self.depth is not None:
            raise ValueError("give cover or depth, not both")
        return self

    def bar_area(self) -> float:
        return self.area if self.area is not None else backfill.BARS[self.bar][0]

    def depth_in(self, thickness: float, masonry: bool) -> float | None:
        """d from the backfill face: given, or from the cover and bar, or (masonry only, bars
        centered in the grouted cells) t / 2; None when a concrete wall gives neither."""
        if self.depth is not None:
            return self.depth
        if self.cover is not None:
            diameter = backfill.BARS[self.bar][1] if self.bar else 0.0
            return thickness - self.cover - diameter / 2.0
        return thickness / 2.0 if masonry else None


class WallFooting(Strict):
    """The footing under a foundation wall: overturning and sliding of the wall and footing."""

    width: Length = Field(gt=0, le=40, description="Across the wall (ft).")
    thickness: Length = Field(1.0, gt=0, le=10, description="Depth of the footing (ft).")
    toe: Length | None = Field(None, ge=0, description="Projection on the inside, the toe the "
                                                       "block tips about (ft); default: the wall "
                                                       "centered.")
    soil: Literal[tuple(anchors.FRICTION_IBC_1806_2)] = Field(
        "silty_sand", description="Soil under the footing: its friction, IBC Table 1806.2.")


class InsideBraces(Strict):
    """Braces or shores on the wall's inside face, the temporary support where the plan
    backfills higher than the wall takes as a cantilever."""

    height: Length = Field(gt=0, description="Where they bear on the wall, above the footing "
                                             "(ft).")
    spacing: Length = Field(gt=0, le=100, description="Along the wall (ft).")
    angle: Angle = Field(45.0, gt=0, lt=90, description="From horizontal (deg).")
    brace_type: str = Field(description="A key of [brace_types] (its compression capacity).")
    foot_anchor: str | None = Field(None, description="A key of [anchor_types] at the brace "
                                                      "foot; none: the foot is not checked.")


class FoundationWall(Strict):
    """A foundation or basement wall held at its top by the floor once the deck is on; until
    then a cantilever from its footing."""

    mark: str = Field(min_length=1)
    material: str = Field(description="A key of [materials] (concrete: compressive_strength is "
                                      "f'c on the day; masonry: grouting, mortar).")
    length: Length = Field(gt=0, le=5000, description="Along the wall (ft).")
    height: Length = Field(gt=0, le=40, description="Above the top of the footing (ft).")
    thickness: Thickness = Field(gt=0, le=48, description="in.")
    bars: WallBars | None = Field(None, description="Vertical bars: a reinforced wall (masonry: "
                                                    "grouted).")
    masonry_strength: Stress = Field(2000.0, ge=500, le=6000, description="Masonry f'm (psi).")
    mortar_age: Age | None = Field(None, ge=0, description="Masonry built before day 1: its "
                                                           "mortar's age on day 1 (days); "
                                                           "with neither this nor build_day: "
                                                           "taken as cured, with a warning.")
    footing: WallFooting | None = None
    backfill: BackfillSoil | None = Field(None, description="This wall's backfill, instead of "
                                                            "the site's [backfill].")
    inside_braces: InsideBraces | None = None
    line: str | None = Field(None, description="The wall line it stands on (a [[lines]] name); "
                                               "the backfill is on the side away from the "
                                               "line's braced_side.")
    offset: Length = Field(0.0, ge=0, description="From the line's start to the wall (ft).")
    build_day: int | None = Field(None, ge=1, le=DAY_LIMIT, description="Day the wall is cast or "
                                                                         "built: no backfill "
                                                                         "before it.")
    release_after: list[str] = Field(default_factory=list, description="Events that give it "
                                                                       "top support (the floor "
                                                                       "deck).")

    @model_validator(mode="after")
    def _fits(self):
        brace = self.inside_braces
        if brace is not None and brace.height > self.height:
            raise ValueError("inside_braces.height is above the wall's top")
        depth = None if self.bars is None else self.bars.depth_in(self.thickness, True)
        if depth is not None and not 0.0 < depth < self.thickness:
            raise ValueError("bars: the cover or depth leaves no depth to the bar in the wall")
        if self.footing is not None and self.footing.width <= self.thickness / 12.0:
            raise ValueError("footing.width is not wider than the wall")
        if self.footing is not None and self.footing.toe is not None and \
                self.footing.toe > self.footing.width - self.thickness / 12.0:
            raise ValueError("footing.toe leaves the wall off the footing")
        return self


class BackfillEvent(Strict):
    """Backfill placed against a wall, or every wall of a wall line, on a day."""

    day: int = Field(ge=1, le=DAY_LIMIT)
    wall: str | None = Field(None, description="A foundation wall's mark.")
    line: str | None = Field(None, description="A [[lines]] name: every foundation wall on it.")
    height: Length = Field(ge=0, le=40, description="Backfill height reached, above the footing "
                                                    "(ft).")
    surcharge: Pressure | None = Field(None, ge=0, le=5000, description="Compaction equipment on "
                                                                        "the day (psf); default "
                                                                        "the backfill's.")

    @model_validator(mode="after")
    def _one_target(self):
        if (self.wall is None) == (self.line is None):
            raise ValueError("give wall or line, one of them")
        return self


def _length(value) -> float | None:
    """A raw length as the model reads it, else None (the field reports the problem)."""
    try:
        return units.parse(value, "length")
    except (units.UnitError, TypeError, ValueError):
        return None


def marks(data: dict) -> set[str]:
    """The foundation walls' marks in raw site data."""
    walls = data.get("foundation_walls")
    return {w["mark"] for w in (walls if isinstance(walls, list) else [])
            if isinstance(w, dict) and isinstance(w.get("mark"), str)}


def reference_problems(data: dict, lines: set, events: set, panel_marks: set
                       ) -> list[tuple[tuple, str, object]]:
    """(location, message, value) of every cross-item problem of foundation walls and backfill
    events in raw site data: unknown names, repeated marks, a wall with no backfill, a backfill
    above its wall, an event before its wall exists (method notes §12)."""
    problems: list[tuple[tuple, str, object]] = []
    walls = data.get("foundation_walls")
    walls = walls if isinstance(walls, list) else []
    by_mark: dict[str, dict] = {}
    known = {s: set(data[s]) if isinstance(data.get(s), dict) else set()
             for s in ("materials", "brace_types", "anchor_types")}
    for i, w in enumerate(walls):
        if not isinstance(w, dict):
            continue
        mark = w.get("mark")
        if isinstance(mark, str) and (mark in by_mark or mark in panel_marks):
            problems.append((("foundation_walls", i, "mark"), "used twice (a wall or panel "
                             "has it already)", mark))
        elif isinstance(mark, str):
            by_mark[mark] = w
        problems += _wall_problems(i, w, data, known, lines, events)
    events_ = data.get("backfill_events")
    for i, e in enumerate(events_ if isinstance(events_, list) else []):
        if isinstance(e, dict):
            problems += _event_problems(i, e, by_mark, lines)
    return problems


def _wall_problems(i: int, w: dict, data: dict, known: dict, lines: set, events: set) -> list:
    """A foundation wall's names: material, line, events, brace and anchor types, backfill."""
    problems = []
    material = w.get("material")
    if isinstance(material, str):
        if material not in known["materials"]:
            problems.append((("foundation_walls", i, "material"),
                             f"{material!r} is not in [materials]", material))
        else:
            problems += _material_problems(i, w, data["materials"].get(material), material)
    line = w.get("line")
    if isinstance(line, str) and line not in lines:
        problems.append((("foundation_walls", i, "line"), f"{line!r} is not a [[lines]] name",
                         line))
    after = w.get("release_after")
    for j, event in enumerate(after if isinstance(after, list) else []):
        if isinstance(event, str) and event not in events:
            problems.append((("foundation_walls", i, "release_after", j),
                             f"{event!r} is not an [[events]] name", event))
    braces = w.get("inside_braces")
    if isinstance(braces, dict):
        for key, section in (("brace_type", "brace_types"), ("foot_anchor", "anchor_types")):
            name = braces.get(key)
            if isinstance(name, str) and name not in known[section]:
                problems.append((("foundation_walls", i, "inside_braces", key),
                                 f"{name!r} is not in [{section}]", name))
    if w.get("backfill") is None and data.get("backfill") is None:
        problems.append((("foundation_walls", i, "backfill"), "no backfill given: add the "
                         "site's [backfill] or this wall's own", None))
    return problems


def _material_problems(i: int, w: dict, mat, name: str) -> list:
    """A foundation wall's material: concrete (with its f'c on the day, and the bars' cover or
    depth) or masonry."""
    kind = mat.get("kind") if isinstance(mat, dict) else None
    if kind not in ("concrete", "masonry"):
        return [(("foundation_walls", i, "material"), "a foundation wall is concrete or masonry",
                 name)]
    if kind == "masonry":
        return []
    problems = []
    if mat.get("compressive_strength") is None:
        problems.append((("foundation_walls", i, "material"), f"concrete {name!r} gives no "
                         "compressive_strength (f'c on the backfill days)", name))
    bars = w.get("bars")
    if isinstance(bars, dict) and bars.get("cover") is None and bars.get("depth") is None:
        problems.append((("foundation_walls", i, "bars"), "a concrete wall's bars need their "
                         "cover or depth from the backfill face", None))
    return problems


def _event_problems(i: int, e: dict, by_mark: dict, lines: set) -> list:
    """A backfill event's wall or line, its height against each wall, its day against each
    wall's build day."""
    problems = []
    wall, line = e.get("wall"), e.get("line")
    if isinstance(wall, str) and wall not in by_mark:
        problems.append((("backfill_events", i, "wall"), f"{wall!r} is not a foundation wall "
                         "mark", wall))
    if isinstance(line, str) and line not in lines:
        problems.append((("backfill_events", i, "line"), f"{line!r} is not a [[lines]] name",
                         line))
    targets = [by_mark[wall]] if isinstance(wall, str) and wall in by_mark else [
        w for w in by_mark.values() if isinstance(line, str) and w.get("line") == line]
    if isinstance(line, str) and line in lines and not targets:
        problems.append((("backfill_events", i, "line"), f"no foundation wall stands on line "
                         f"{line!r}", line))
    height = _length(e.get("height"))
    for w in targets:
        top = _length(w.get("height"))
        if height is not None and top is not None and height > top + 1e-9:
            problems.append((("backfill_events", i, "height"), f"{height:g} ft of backfill is "
                             f"above wall {w['mark']} ({top:g} ft)", e.get("height")))
        built, day = w.get("build_day"), e.get("day")
        if isinstance(built, int) and isinstance(day, int) and day < built:
            problems.append((("backfill_events", i, "day"), f"day {day} is before wall "
                             f"{w['mark']} exists (built on day {built})", day))
    return problems
