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


# (item, reason, source, test): `test` reads a wall's material (a Material), its brace type (a
# BraceType or None) and its bracing's anchor types (AnchorType objects; a missing one: None)
ITEMS = (
    ("framed sill fastenings",
     "no capacity given: the sill's nailing or bolting is the framer's; base uplift, sliding and "
     "kick-out of framed walls are not checked (braces that lift the wall are flagged)",
     "method notes §3, §11", lambda mat, brace, anchors: mat.kind == "framed"),
    ("reinforced masonry as a cantilever",
     "grouted masonry standing on its own is checked as unreinforced (weight and TMS 402-16 "
     "flexural tension only)", "method notes §3, §11",
     lambda mat, brace, anchors: mat.kind == "masonry" and mat.grouting in ("grouted", "solid")),
    ("insert ratings",
     "taken from the file as given (the maker's allowable at the angle used); the panel's "
     "concrete strength at the insert on the lift day is not checked", "method notes §4, §11",
     lambda mat, brace, anchors: any(a is not None and a.kind == "insert" for a in anchors)),
    ("wall insert",
     "no insert type given: the brace's attachment to the wall is not checked",
     "method notes §11", lambda mat, brace, anchors: brace is not None and anchors[0] is None),
    ("foot anchor",
     "no anchor type given: the brace's foot is not checked", "method notes §11",
     lambda mat, brace, anchors: brace is not None and anchors[1] is None),
    ("stake and deck fastening ratings",
     "taken from the file as given (the maker's or engineer's allowable values)",
     "method notes §4, §11",
     lambda mat, brace, anchors: any(a is not None and a.kind in ("stake", "deck")
                                     for a in anchors)),
    ("post-installed slab anchors",
     "the product report's values are not checked: pullout only where the file gives it, no "
     "adhesive bond strength, no minimum slab age",
     "ACI 318-19 §17.6.3, §17.6.5; method notes §11",
     lambda mat, brace, anchors: any(a is not None and a.kind == "slab" and not a.cast_in
                                     for a in anchors)),
    ("deadman tipping",
     "no block length and pin height: its tipping about the toe is not checked",
     "method notes §4",
     lambda mat, brace, anchors: any(a is not None and a.kind == "deadman" and a.length is None
                                     for a in anchors)),
    ("deadman toe bearing",
     "no block size (width and allowable bearing): the soil pressure under it is not checked",
     "method notes §4",
     lambda mat, brace, anchors: any(a is not None and a.kind == "deadman"
                                     and a.allowable_bearing is None for a in anchors)),
    ("helical anchors",
     "capacity by the installation torque the crew reaches (ICC-ES AC358 K_t T); the soil and the "
     "shaft are not checked", "ICC-ES AC358; method notes §11",
     lambda mat, brace, anchors: any(a is not None and a.kind == "helical" for a in anchors)),
    ("brace ratings",
     "rated braces are taken from the maker's table as given, by length only",
     "method notes §11", lambda mat, brace, anchors: brace is not None and brace.kind == "rated"),
    ("brace capacity",
     "unrated brace: its forces are computed, its capacity is not checked",
     "method notes §11",
     lambda mat, brace, anchors: brace is not None and brace.kind == "unrated"),
    ("concrete wall bending",
     "a cracking check only (serviceability: shown, not counted in the status or speeds)",
     "ACI 318-19 Eq. 19.2.3.1; method notes §4",
     lambda mat, brace, anchors: brace is not None and mat.kind == "concrete"),
)


def not_checked(site: Site, columns: dict[str, tuple]) -> list[NotChecked]:
    """The limits of the check for this site (`columns`: its panels' fields,
    model.read_panels), site-wide items first, then by element.

    The items are worked out once per kind of wall (its material and its bracing's hardware),
    then each wall takes its kind's: a site has few kinds and many walls."""
    marks = columns["mark"]
    hardware: list[tuple | None] = [None] * len(marks)
    for row, brace, wall, foot in zip(columns["braced"], columns["brace_type"],
                                      columns["wall_anchor"], columns["foot_anchor"], strict=True):
        hardware[row] = (brace, wall, foot)
    rows_of: dict[tuple, list[int]] = {}
    for row, kind in enumerate(zip(columns["material"], hardware, strict=True)):
        rows_of.setdefault(kind, []).append(row)
    rows: list[list[int]] = [[] for _ in ITEMS]
    for (material, parts), kind_rows in rows_of.items():
        brace = None if parts is None else site.brace_types[parts[0]]
        anchors = (None, None) if parts is None else tuple(
            None if name is None else site.anchor_types[name] for name in parts[1:])
        mat = site.materials[material]
        for i, (*_, test) in enumerate(ITEMS):
            if test(mat, brace, anchors):
                rows[i] += kind_rows
    return [SEISMIC, CORNERS] + [
        NotChecked(item=item, reason=reason, source=source,
                   walls=[marks[r] for r in sorted(item_rows)])
        for (item, reason, source, _), item_rows in zip(ITEMS, rows, strict=True) if item_rows]
