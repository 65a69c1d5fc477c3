"""Result records of foundation walls backfilled before the floor (method notes §12): what the
engine found for each wall, day by day. Every view reads these; none recomputes. Units in the
field names (ft, in, psf, plf, lb, mph); heights above the top of the footing.
"""

from __future__ import annotations

from dataclasses import asdict, dataclass, field

from bracing.results import Check, Flag


@dataclass(slots=True)
class BackfillSoilResult:
    """The backfill as the wall takes it."""

    equivalent_fluid_pressure_psf_per_ft: float
    pressure_source: str
    pressure_state: str              # "at_rest" | "active"
    coefficient: float               # K = EFP / unit weight
    unit_weight_pcf: float
    surcharge_psf: float             # standing surcharge (events may add more on their day)
    water_level_ft: float            # above the footing; 0: dry
    drainage: str                    # "drained" | "water level given" | "not stated"


@dataclass(slots=True)
class BackfillWind:
    """The wind on the part of the wall above the backfill at the planned height (ASCE 7-16
    §29.3 with ASCE 37-14), and the speeds it gives the wall."""

    design_speed_mph: float
    velocity_pressure_psf: float     # design q (Kd 0.85) at the wall's top (at least 15 ft)
    force_coefficient: float         # Cases A and B, s/h = 1
    pressure_psf: float              # q G Cf, at least the 16 psf minimum
    exposed_height_ft: float         # the wall above the planned backfill
    working_limit_speed_mph: float | None   # None: the wind does not govern (no part exposed)
    stand_down_speed_mph: float | None


@dataclass(slots=True)
class InsideBraceResult:
    """The temporary inside braces at the planned height, the wall pinned at its base."""

    height_ft: float
    spacing_ft: float
    angle_deg: float
    length_ft: float
    foot_distance_ft: float          # of the brace foot from the wall's inside face
    brace_type: str
    foot_anchor: str | None
    reaction_plf: float              # R = M_base / h_b, earth only, unfactored
    force_lb: float                  # axial per brace, 1.0H + 0.6W
    capacity_lb: float               # allowable compression at its length
    max_height_ft: float             # the highest backfill the braced wall takes
    utilization: float
    checks: list[Check]
    count: int = 0                   # along the wall: one per strip of at most spacing_ft
    # the days they are counted in use against on_hand (method notes §12): from the first day
    # the backfill needs them to the wall's release (None: never needed / to the schedule's end)
    in_use_from_day: int | None = None
    in_use_to_day: int | None = None
    # each brace's place along the wall, ft from the wall's start (its offset on its line's
    # start side): the centres of `count` equal strips
    positions_ft: list[float] = field(default_factory=list)


@dataclass(slots=True)
class BackfillDay:
    """One day of a foundation wall."""

    day: int
    planned_height_ft: float         # the backfill in place that day
    allowed_height_ft: float         # the most it may take that day
    surcharge_psf: float
    support: str                     # "cantilever" | "inside braces" | "top support"
    over: bool                       # planned above allowed: a danger
    # the wind on the part above that day's backfill, standing as a cantilever (None: braced,
    # top support, over its limit, or nothing exposed); a forecast gust at or above it makes
    # the day NO-GO
    stand_down_speed_mph: float | None = None
    working_limit_speed_mph: float | None = None  # that gust / the stand-down ratio
    # the mean speeds over 1 min, 2 min, 10 min and 1 hour that match that gust (None: as above)
    sustained_equivalents_mph: dict[str, float] | None = None


@dataclass(slots=True)
class PressurePoint:
    """The earth pressure at a level of the wall (the section sketch's diagram)."""

    level_ft: float
    pressure_psf: float


@dataclass(slots=True)
class FoundationWallResult:
    """Everything the engine found for one foundation wall."""

    mark: str
    material: str                    # plain | reinforced | masonry | reinforced_masonry
    height_ft: float
    length_ft: float
    thickness_in: float
    line: str | None
    offset_ft: float
    backfill_side: str | None        # "left" | "right" of its line (away from braced_side)
    build_day: int | None
    top_support_day: int | None      # day of the last event it waits for (the floor deck)
    released_day: int | None         # the valid sign-off's day: cantilever check released
    soil: BackfillSoilResult
    planned_height_ft: float         # the highest backfill planned before its release
    planned_day: int | None
    max_height_ft: float             # as a cantilever, at the standing surcharge (solved)
    needs_support: bool              # planned above max_height_ft
    utilization: float               # as checked at the planned height (the verdict)
    checks: list[Check]              # as checked: the cantilever, or with the inside braces
    cantilever_utilization: float
    cantilever_checks: list[Check]
    inside_brace: InsideBraceResult | None
    wind: BackfillWind
    pressure: list[PressurePoint]    # at the planned height, standing surcharge
    days: list[BackfillDay] = field(default_factory=list)
    flags: list[Flag] = field(default_factory=list)
    # each day's section sketch, by day (bracing.backfill_profile.BackfillSketch): the sheets
    # draw them; not in the JSON record (its numbers are the days' and the soil's)
    sketches: dict = field(default_factory=dict)

    @property
    def fails(self) -> bool:
        """A check over capacity or a danger finding (method notes §8)."""
        return self.utilization > 1.0 or any(f.severity == "danger" for f in self.flags)

    def as_dict(self) -> dict:
        """The record as plain values (`bracing check --json`, key `foundation_walls`): every
        field, each check with its utilization and whether it passes, and `fails`."""
        out = {f: getattr(self, f) for f in self.__slots__ if f not in _NOT_AS_IS}
        out = {k: (asdict(v) if hasattr(v, "__dataclass_fields__") else v)
               for k, v in out.items()}
        out["days"] = [asdict(d) for d in self.days]
        out["pressure"] = [asdict(p) for p in self.pressure]
        out["flags"] = [f.as_dict() for f in self.flags]
        out["checks"] = [c.as_dict() for c in self.checks]
        out["cantilever_checks"] = [c.as_dict() for c in self.cantilever_checks]
        if self.inside_brace is not None:
            out["inside_brace"]["checks"] = [c.as_dict() for c in self.inside_brace.checks]
        out["fails"] = self.fails
        return out


_NOT_AS_IS = ("checks", "cantilever_checks", "sketches")  # written their own way, or not
