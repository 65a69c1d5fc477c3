"""The site model: pydantic classes that validate a site file (design.md §2).

Each quantity field documents its unit; a bare number takes that unit, a text value may carry any
unit of the same kind ("31 ft", "9.5 m"). Validation lives here, at the edge: the engine trusts a
`Site` once it exists.

One module per topic; every name is imported from here (`from bracing.model import Site`):

- `base`: the format's version, the input limits, quantity fields (`Length`...) and `Strict`;
- `rules`: the site rules' defaults (`DEFAULT_RULES`) and ranges (`RULE_RANGES`);
- `gear`: `BraceType`, `AnchorType`, one wall's `Bracing`, the designer's `DesignOptions`;
- `walls`: `Material`, `Opening`, `Footing`, `ReturnWall` and `Panel`;
- `site_plan`: the `Plan` (slab, holes, joints, ground, areas) and `WallLine`s;
- `days`: `Event`s of the permanent work, `SignOff`s, the `Forecast` file;
- `site`: `SiteInfo` and `Site`, whose fields list the site file's sections in one place;
- `references`: the cross-reference checks of raw data (`reference_problems`), one small
  check each;
- `columns`: the panels' fields the evaluation reads (`read_panels`).
"""

from bracing.model.base import (
    BRACE_LIMIT,
    COORDINATE_LIMIT,
    COUNT_LIMIT,
    DAY_LIMIT,
    KIND_LIMITS,
    RANGE_ERRORS,
    SCHEMA_VERSION,
    Age,
    Angle,
    Area,
    Coordinate,
    Duration,
    Force,
    Length,
    LinearForce,
    Moment,
    Point,
    Positive,
    Pressure,
    SectionArea,
    Speed,
    Stress,
    Strict,
    Thickness,
    UnitWeight,
    _quantity,
    _QuantitySchema,
    error_message,
    within,
)
from bracing.model.columns import BRACING_FIELDS, PANEL_FIELDS, read_panels
from bracing.model.days import Event, Forecast, SignOff
from bracing.model.gear import AnchorType, BraceType, Bracing, DesignOptions
from bracing.model.references import reference_problems
from bracing.model.rules import DEFAULT_RULES, MASONRY_STANDARD, RULE_RANGES, Rule
from bracing.model.site import Site, SiteInfo
from bracing.model.site_plan import Area_, Plan, WallLine
from bracing.model.walls import Footing, Material, Opening, Panel, ReturnWall

__all__ = [
    "BRACE_LIMIT", "BRACING_FIELDS", "COORDINATE_LIMIT", "COUNT_LIMIT", "DAY_LIMIT",
    "DEFAULT_RULES", "KIND_LIMITS", "MASONRY_STANDARD", "PANEL_FIELDS", "RANGE_ERRORS",
    "RULE_RANGES", "SCHEMA_VERSION", "Age", "AnchorType", "Angle", "Area", "Area_", "BraceType",
    "Bracing", "Coordinate", "DesignOptions", "Duration", "Event", "Footing", "Force", "Forecast",
    "Length", "LinearForce", "Material", "Moment", "Opening", "Panel", "Plan", "Point", "Positive",
    "Pressure", "ReturnWall", "Rule", "SectionArea", "SignOff", "Site", "SiteInfo", "Speed",
    "Stress", "Strict", "Thickness", "UnitWeight", "WallLine", "_QuantitySchema", "_quantity",
    "error_message", "read_panels", "reference_problems", "within",
]
