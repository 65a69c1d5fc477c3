"""Site rules as data: each one's default value, source and basis, and its plausible range."""

from __future__ import annotations

from pydantic import Field

from bracing.model.base import BRACE_LIMIT, DAY_LIMIT, KIND_LIMITS, Strict


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
