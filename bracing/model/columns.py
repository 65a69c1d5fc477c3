"""The panels' fields the evaluation reads, as columns over all panels (`read_panels`)."""

from __future__ import annotations

from operator import attrgetter
from typing import TYPE_CHECKING

if TYPE_CHECKING:
    from bracing.model.site import Site


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
