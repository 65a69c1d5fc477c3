"""The fall zone of each wall (design.md §7): the reach out from its braced face and back
behind it, with its basis."""

from __future__ import annotations

from bracing import plan
from bracing.model import Site
from bracing.results import PanelResult


def fall_zones(site: Site, panels: list[PanelResult], places=None
               ) -> dict[str, tuple[float, float, str]]:
    """Zone of each wall (design.md §7): reach (ft) out from the braced face, reach back from the
    braced face on the other side (through the wall), and its basis. Walls placed on a wall line
    take the plan's own (`bracing.plan.zone_reach`; `places`: the site's `plan.place`, worked
    here when not given); the others the same rule: masonry height + the zone rule's extra on
    the braced side (OSHA 29 CFR 1926.706(a)), never less than the brace footprint; other walls
    height + brace footprint in front and their height behind (common practice).
    """
    places = plan.place(site) if places is None else places
    out = dict(plan.zone_reach(site, places, None, {p.mark for p in panels}))
    extra = site.rule_value("masonry_zone_extra_ft")
    for p in panels:
        if p.mark in out:
            continue
        h, footprint = p.height_ft, (p.braces or {}).get("anchor_distance_ft") or 0.0
        if p.material == "masonry" and extra is not None:
            reach = max(h + extra, h + footprint)  # OSHA 29 CFR 1926.706(a): h + 4 ft
            out[p.mark] = (reach, 0.0, f"{reach:.1f} ft on the braced (unscaffolded) side: wall "
                                       f"height + {extra:g} ft "
                                       f"({site.rule('masonry_zone_extra_ft').source})")
        else:
            out[p.mark] = (h + footprint, h + p.thickness_in / 12.0,
                           f"{h + footprint:.1f} ft on the braced side (height + brace "
                           f"footprint), {h:.1f} ft behind (height) (common practice)")
    return out
