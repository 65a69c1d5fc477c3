"""What the check leaves out for a site: the limits a reviewer must see beside its results.

The engine puts the list on `SiteResult.not_checked`; the views only print it. Each item names
the walls it concerns (none: the whole site) and the method note or clause behind it
(method notes §11).
"""

from __future__ import annotations

from bracing.model import Site
from bracing.results import NotChecked

SEISMIC = NotChecked(
    item="seismic during construction",
    reason="not checked: ASCE 37-14 leaves it out unless the authority having jurisdiction "
           "requires it (unconfirmed reading: confirm in ASCE 37-14 and with that authority); "
           "earthquakes give no warning, so only strength and zones help",
    source="ASCE 37-14; method notes §11")
CORNERS = NotChecked(
    item="connected corners",
    reason="a wall bracing its neighbour through a connected corner is not credited: each wall "
           "is checked on its own braces",
    source="method notes §11")


def not_checked(site: Site, columns: dict[str, tuple]) -> list[NotChecked]:
    """The limits of the check for this site (`columns`: its panels' fields,
    model.read_panels), site-wide items first, then by element."""
    marks, materials, bracings = columns["mark"], columns["material"], columns["bracing"]
    kinds = {name: m.kind for name, m in site.materials.items()}

    def walls_where(test) -> list[str]:
        return [m for m, mat, b in zip(marks, materials, bracings) if test(mat, b)]

    def using(anchor_test) -> list[str]:
        def test(_, b):
            return b is not None and any(
                name is not None and anchor_test(site.anchor_types[name])
                for name in (b.wall_anchor, b.foot_anchor))
        return walls_where(test)

    def braced_with(brace_test) -> list[str]:
        return walls_where(lambda _, b: b is not None and brace_test(site.brace_types[b.brace_type]))

    items = [SEISMIC, CORNERS]
    entries = [
        ("framed sill fastenings",
         "no capacity given: the sill's nailing or bolting is the framer's; base uplift, "
         "sliding and kick-out of framed walls are not checked (braces that lift the wall are "
         "flagged)", "method notes §3, §11",
         walls_where(lambda mat, _: kinds[mat] == "framed")),
        ("reinforced masonry as a cantilever",
         "grouted masonry standing on its own is checked as unreinforced (weight and TMS 402-16 "
         "flexural tension only)", "method notes §3, §11",
         walls_where(lambda mat, _: kinds[mat] == "masonry"
                     and site.materials[mat].grouting in ("grouted", "solid"))),
        ("insert ratings",
         "taken from the file as given (the maker's allowable at the angle used); the panel's "
         "concrete strength at the insert on the lift day is not checked", "method notes §4, §11",
         using(lambda a: a.kind == "insert")),
        ("wall insert",
         "no insert type given: the brace's attachment to the wall is not checked",
         "method notes §11", walls_where(lambda _, b: b is not None and b.wall_anchor is None)),
        ("foot anchor",
         "no anchor type given: the brace's foot is not checked", "method notes §11",
         walls_where(lambda _, b: b is not None and b.foot_anchor is None)),
        ("stake and deck fastening ratings",
         "taken from the file as given (the maker's or engineer's allowable values)",
         "method notes §4, §11", using(lambda a: a.kind in ("stake", "deck"))),
        ("post-installed slab anchors",
         "the product report's values are not checked: pullout only where the file gives it, "
         "no adhesive bond strength, no minimum slab age", "ACI 318-19 §17.6.3, §17.6.5; "
         "method notes §11", using(lambda a: a.kind == "slab" and not a.cast_in)),
        ("deadman tipping",
         "no block length and pin height: its tipping about the toe is not checked",
         "method notes §4", using(lambda a: a.kind == "deadman" and a.length is None)),
        ("deadman toe bearing",
         "no block size (width and allowable bearing): the soil pressure under it is not "
         "checked", "method notes §4",
         using(lambda a: a.kind == "deadman" and a.allowable_bearing is None)),
        ("helical anchors",
         "capacity by the installation torque the crew reaches (ICC-ES AC358 K_t T); the soil "
         "and the shaft are not checked", "ICC-ES AC358; method notes §11",
         using(lambda a: a.kind == "helical")),
        ("brace ratings",
         "rated braces are taken from the maker's table as given, by length only",
         "method notes §11", braced_with(lambda t: t.kind == "rated")),
        ("brace capacity",
         "unrated brace: its forces are computed, its capacity is not checked",
         "method notes §11", braced_with(lambda t: t.kind == "unrated")),
        ("concrete wall bending",
         "a cracking check only (serviceability: shown, not counted in the status or speeds)",
         "ACI 318-19 Eq. 19.2.3.1; method notes §4",
         walls_where(lambda mat, b: b is not None and kinds[mat] == "concrete")),
    ]
    items += [NotChecked(item=item, reason=reason, source=source, walls=walls)
              for item, reason, source, walls in entries if walls]
    return items
