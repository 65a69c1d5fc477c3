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


def _columns(fields: tuple[str, ...], rows) -> dict[str, tuple]:
    """Each of `fields` as a tuple over `rows` (one tuple of those fields per object)."""
    columns = tuple(zip(*rows, strict=True))
    return dict(zip(fields, columns, strict=True)) if columns else dict.fromkeys(fields, ())


def read_panels(site: Site) -> dict[str, tuple]:
    """Each field of PANEL_FIELDS over all panels (a tuple in site order), and under "braced"
    the rows of the braced panels with each field of BRACING_FIELDS over them, in one pass
    each: a large site's objects lie far apart in memory, so every pass over them costs."""
    columns = _columns(PANEL_FIELDS, map(attrgetter(*PANEL_FIELDS), site.panels))
    layouts = columns["bracing"]
    columns["braced"] = tuple(k for k, b in enumerate(layouts) if b is not None)
    read = attrgetter(*BRACING_FIELDS)
    columns.update(_columns(BRACING_FIELDS, (read(layouts[k]) for k in columns["braced"])))
    return columns
