"""The zone kept around a standing wall (method notes §6): its reach in front and behind, its rule
in words and its outline in plan."""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np
import shapely
from shapely.geometry import Polygon

from bracing.model import Site
from bracing.plan.placement import Places, WallBracing, standing_bracing


@dataclass(frozen=True)
class ZoneReach:
    """The zones of some walls (one row each, in the order of their `WallBracing.walls`)."""

    height_ft: np.ndarray
    masonry: np.ndarray   # whether the masonry zone rule holds for the wall
    front_ft: np.ndarray  # reach out from the braced face
    back_ft: np.ndarray   # reach back from the face, behind the wall


def zone_reach_ft(site: Site, places: Places, bracing: WallBracing,
                  heights: dict[str, float] | None) -> ZoneReach:
    """Heights, which are masonry under the zone rule, and the reach out in front and back
    behind (ft) of the walls of `bracing` (the rules are in `zone_reach`)."""
    extra = site.rule_value("masonry_zone_extra_ft")
    panel = places.fields_of(site)
    rows = places.index[bracing.walls]
    h = np.array(panel["height"], dtype=float)[rows]
    if heights:
        h = np.array([heights.get(m, x) for m, x in zip(places.mark[bracing.walls].tolist(),
                                                         h.tolist(), strict=True)], dtype=float)
    footprint = np.zeros(len(rows))
    footprint[bracing.braced] = bracing.anchor_ft
    masonry_kind = {name: m.kind == "masonry" and extra is not None
                    for name, m in site.materials.items()}
    masonry = np.fromiter(map(masonry_kind.__getitem__, panel["material"]), bool,
                          len(panel["material"]))[rows]
    front = h + footprint
    if extra is not None:  # OSHA 29 CFR 1926.706(a): h + 4 ft
        front = np.where(masonry, np.maximum(h + extra, front), front)
    back = np.where(masonry, 0.0, places.thickness_ft[bracing.walls] + h)
    return ZoneReach(height_ft=h, masonry=masonry, front_ft=front, back_ft=back)


def zone_reach(site: Site, places: Places, heights: dict[str, float] | None = None,
               standing: set[str] | None = None) -> dict[str, tuple[float, float, str]]:
    """Reach of each standing wall's zone (ft): out from the face on the braced side, back from
    the face on the other side, and its basis (method notes §6).

    Masonry: height + `masonry_zone_extra_ft` (OSHA 29 CFR 1926.706(a)) on the unscaffolded
    side, taken as the braced side, never less than the brace footprint. Other walls (common
    practice: a wall can fall either way): height + brace footprint on the braced side, the
    height behind its back face. Both run the wall's whole length, no farther.
    """
    bracing = standing_bracing(site, places, standing)
    return reach_words(site, places, bracing, zone_reach_ft(site, places, bracing, heights))


def reach_words(site: Site, places: Places, bracing: WallBracing,
                reach: ZoneReach) -> dict[str, tuple[float, float, str]]:
    """`zone_reach` from the reaches of `zone_reach_ft`."""
    rows = bracing.walls
    extra = site.rule_value("masonry_zone_extra_ft")
    source = site.rule("masonry_zone_extra_ft").source
    out = {}
    for mark, m, hh, f, b in zip(places.mark[rows].tolist(), reach.masonry.tolist(),
                                 reach.height_ft.tolist(), reach.front_ft.tolist(),
                                 reach.back_ft.tolist(), strict=True):
        if m:
            out[mark] = (f, 0.0, f"{f:.1f} ft on the braced (unscaffolded) side: "
                                 f"wall height + {extra:g} ft ({source})")
        else:
            out[mark] = (f, b, f"{f:.1f} ft on the braced side (height + brace footprint), "
                               f"{hh:.1f} ft behind (height) (common practice)")
    return out


def zone_rule(site: Site, masonry: bool) -> str:
    """The zone rule of a masonry wall or of another wall in words, without one wall's numbers
    (a legend's summary; `zone_reach` gives each wall's)."""
    if masonry:
        return (f"wall height + {site.rule_value('masonry_zone_extra_ft'):g} ft on the braced "
                f"(unscaffolded) side ({site.rule('masonry_zone_extra_ft').source})")
    return ("height + brace footprint on the braced side, the height behind the wall "
            "(common practice)")


def zone_corners(places: Places, bracing: WallBracing, reach: ZoneReach) -> np.ndarray:
    """Corners of the zones (`reach`) of the walls of `bracing`, rectangles along their length,
    (n, 4, 2)."""
    rows = bracing.walls
    along = places.width_ft[rows][:, None] * [0.0, 1.0, 1.0, 0.0]
    front, back = reach.front_ft, reach.back_ft
    out = np.stack([-back, -back, front, front], axis=1)
    return places.at(rows[:, None], along, out).reshape(-1, 4, 2)


def zones(site: Site, places: Places, heights: dict[str, float] | None = None,
          standing: set[str] | None = None) -> dict[str, Polygon]:
    """Restricted zone of each standing wall (method notes §6), a rectangle along its length.

    The evacuated zone (nobody inside, at the stand-down speed and during lifts) is given the
    same footprint: OSHA 29 CFR 1926.706(a) and the common practice name one zone, and no
    published reason was found to make it larger; what changes is who may be inside.
    """
    bracing = standing_bracing(site, places, standing)
    corners = zone_corners(places, bracing, zone_reach_ft(site, places, bracing, heights))
    return dict(zip(places.mark[bracing.walls].tolist(), shapely.polygons(corners), strict=True))
