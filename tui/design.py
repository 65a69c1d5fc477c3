"""The layout designer asked from the interface: the engine designs, the interface shows.

The wall's own bracing is taken out of a scratch copy of the site file and the engine's
`evaluate(..., design=True)` lays out braces for it with the site's [design] options, or, when
the file has none, with every brace type and anchor type the site defines. The proposal is the
engine's result; accepting it writes its layout into the wall's [bracing] table.
"""

from __future__ import annotations

from dataclasses import dataclass
from pathlib import Path

from bracing.evaluate import evaluate
from bracing.results import PanelResult
from bracing.scenario import REMOVE, SiteFile, SiteFileError


@dataclass(frozen=True)
class Proposal:
    """The designer's answer for one wall: its result and the [bracing] table to write, or
    None and why."""

    result: PanelResult | None
    table: dict | None
    message: str


def scratch_site(site_file: SiteFile, i: int) -> SiteFile:
    """The site file without wall `i`'s bracing, with design options (the site's own, or
    every type it defines)."""
    scratch = site_file.with_value(("panels", i, "bracing"), REMOVE) \
        if site_file.site.panels[i].bracing is not None else site_file
    if scratch.site.design is not None:
        return scratch
    site = scratch.site
    inserts = [n for n, a in site.anchor_types.items() if a.kind == "insert"]
    options = {"brace_types": sorted(site.brace_types),
               "foot_anchors": sorted(n for n, a in site.anchor_types.items()
                                      if a.kind != "insert")}
    if inserts:
        options["wall_anchor"] = min(inserts)
    return scratch.with_value(("design",), options)


def bracing_table(braces: dict) -> dict:
    """The [bracing] table of a designed layout, as the site file writes it."""
    table = {"brace_type": braces["brace_type"], "count": braces["count"],
             "insert_height": f"{braces['insert_height_ft']:.2f} ft",
             "angle": f"{braces['angle_deg']:g} deg",
             "positions": [f"{x:.2f} ft" for x in braces["positions_ft"]]}
    for key in ("wall_anchor", "foot_anchor"):
        if braces.get(key):
            table[key] = braces[key]
    return table


def propose(site_file: SiteFile, i: int) -> Proposal:
    """The engine's layout for wall `i` (its own braces set aside)."""
    try:
        scratch = scratch_site(site_file, i)
    except SiteFileError as exc:
        return Proposal(None, None, "; ".join(exc.problems))
    result = evaluate(scratch.site, design=True, base_dir=Path(site_file.path).parent)
    p = result.panel(site_file.site.panels[i].mark)
    if p.braces and p.braces.get("designed"):
        return Proposal(p, bracing_table(p.braces), "a layout that passes every check")
    why = next((f.message for f in p.flags if f.code == "no-layout"), None)
    return Proposal(p, None, why or "the wall stands without braces: no layout is needed")
