"""What changed between two revisions of a site file (`bracing diff OLD NEW`).

The validated models are compared, not the text: a value written in other units or a comment
moved is no change. Walls are matched by mark. For every wall whose inputs or results changed it
gives the governing utilization and the working-limit gust before and after, and says whether
the wall got worse:

- its governing utilization rose and is now above 1.0; or
- its working-limit gust fell below the stand-down gust it had before (a crew still reading the
  old stand-down gust would work in wind the revised wall cannot take).

Foundation walls (method notes §12) are compared the same way in `bracing.diff_foundation`.

`SiteDiff.fails` is true when a wall or a foundation wall got worse so, or when the new file
fails as `bracing check` would (SiteResult.fails): the exit code of the command.
"""

from __future__ import annotations

import math
from dataclasses import asdict, dataclass, field

from bracing.model import DEFAULT_RULES, Site
from bracing.results import CAUTION, PanelResult, SiteResult

SAME_SPEED_MPH = 0.05  # speeds closer than this are the same (they are printed to 1 mph)
SAME_UTILIZATION = 1e-6


@dataclass(slots=True)
class Change:
    """One input that changed: its kind, the item (a mark, a rule, a type), the field."""

    kind: str   # site, rule, material, brace type, anchor type, plan, line, event, sign-off,
    #             wall, braces, anchors, days
    item: str
    field: str
    old: object
    new: object


@dataclass(slots=True)
class WallChange:
    """A wall that stands in both files and whose inputs or results changed."""

    mark: str
    changes: list[Change]
    old_status: str
    new_status: str
    old_utilization: float
    new_utilization: float
    old_governing: str
    new_governing: str
    old_working_limit_mph: float
    new_working_limit_mph: float
    old_stand_down_mph: float
    new_stand_down_mph: float
    worse: list[str] = field(default_factory=list)  # why the wall got worse, if it did


@dataclass(slots=True)
class SiteDiff:
    changes: list[Change]
    walls: list[WallChange]
    added: list[str]
    removed: list[str]
    new_fails: bool
    new_failing: list[str]
    # foundation walls (bracing.diff_foundation.FoundationWallChange), added, removed, failing
    foundation_walls: list = field(default_factory=list)
    foundation_added: list[str] = field(default_factory=list)
    foundation_removed: list[str] = field(default_factory=list)
    new_failing_foundation: list[str] = field(default_factory=list)

    @property
    def fails(self) -> bool:
        return self.new_fails or any(w.worse for w in [*self.walls, *self.foundation_walls])

    def as_dict(self) -> dict:
        return {"changes": [asdict(c) for c in self.changes],
                "walls": [asdict(w) for w in self.walls],
                "walls_added": self.added, "walls_removed": self.removed,
                "foundation_walls": [asdict(w) for w in self.foundation_walls],
                "foundation_walls_added": self.foundation_added,
                "foundation_walls_removed": self.foundation_removed,
                "new_file_fails": self.new_fails, "new_failing_walls": self.new_failing,
                "new_failing_foundation_walls": self.new_failing_foundation,
                "fails": self.fails, "caution": CAUTION}


def _flat(value, prefix: str = ""):
    """(dotted path, value) of every leaf; lists of scalars are one leaf."""
    if isinstance(value, dict):
        for k, v in value.items():
            yield from _flat(v, f"{prefix}.{k}" if prefix else str(k))
    elif isinstance(value, list) and any(isinstance(x, dict) for x in value):
        for i, v in enumerate(value):
            yield from _flat(v, f"{prefix}[{i}]")
    else:
        yield prefix, value


def _same(a, b) -> bool:
    """Equal, floats within a part in 10^9 (a value read in other units is no change)."""
    if isinstance(a, float) and isinstance(b, float):
        return math.isclose(a, b, rel_tol=1e-9, abs_tol=1e-12)
    if isinstance(a, list) and isinstance(b, list):
        return len(a) == len(b) and all(_same(x, y) for x, y in zip(a, b, strict=True))
    return a == b


def _compare(kind: str, item: str, old, new) -> list[Change]:
    a, b = dict(_flat(old)), dict(_flat(new))
    return [Change(kind, item, path, a.get(path), b.get(path))
            for path in dict.fromkeys([*a, *b]) if not _same(a.get(path), b.get(path))]


def _named(kind: str, old: dict, new: dict) -> list[Change]:
    """Changes among named items (types, materials): added, removed or changed fields."""
    out = []
    for name in dict.fromkeys([*old, *new]):
        if name not in new:
            out.append(Change(kind, name, "", "present", "removed"))
        elif name not in old:
            out.append(Change(kind, name, "", "absent", "added"))
        else:
            out += _compare(kind, name, old[name], new[name])
    return out


# the kind of a wall's changed field: (the field paths it starts with, its kind), and its days
PANEL_KINDS = ((("bracing.wall_anchor", "bracing.foot_anchor"), "anchors"),
               (("bracing",), "braces"))
PANEL_DAYS = ("lift_day", "release_after")
FOUNDATION_KINDS = ((("inside_braces",), "inside braces"), (("backfill",), "backfill"))
FOUNDATION_DAYS = ("build_day", "release_after")


def _kind(path: str, kinds: tuple, days: tuple) -> str:
    if path in days:
        return "days"
    return next((kind for starts, kind in kinds if path.startswith(starts)), "wall")


def input_changes(old: Site, new: Site) -> tuple[list[Change], dict[str, list[Change]]]:
    """(changes of the site, rules, types, plan and days; changes of each wall by mark)."""
    o, n = old.model_dump(mode="json"), new.model_dump(mode="json")
    site = _compare("site", "site", o["site"], n["site"])
    for key in ("forecast", "design"):
        site += _compare("site", key, o[key], n[key])
    rules = [Change("rule", name, c.field, c.old, c.new)
             for name in dict.fromkeys([*DEFAULT_RULES, *old.rules, *new.rules])
             for c in _compare("rule", name, old.rule(name).model_dump(mode="json"),
                               new.rule(name).model_dump(mode="json"))]
    site += rules
    site += _named("material", o["materials"], n["materials"])
    site += _named("brace type", o["brace_types"], n["brace_types"])
    site += _named("anchor type", o["anchor_types"], n["anchor_types"])
    site += _compare("plan", "plan", o["plan"], n["plan"])
    site += _named("line", {x["name"]: x for x in o["lines"]}, {x["name"]: x for x in n["lines"]})
    site += _named("event", {x["name"]: x for x in o["events"]},
                   {x["name"]: x for x in n["events"]})
    site += _compare("backfill", "backfill", o["backfill"], n["backfill"])
    site += _named("backfill event", _backfill_events(o), _backfill_events(n))
    walls: dict[str, list[Change]] = _foundation_walls(o, n)
    old_panels = {p["mark"]: p for p in o["panels"]}
    for p in n["panels"]:
        if p["mark"] in old_panels:
            walls[p["mark"]] = [Change(_kind(c.field, PANEL_KINDS, PANEL_DAYS), c.item, c.field,
                                       c.old, c.new)
                                for c in _compare("wall", p["mark"], old_panels[p["mark"]], p)]
    for mark, (before, after) in _signoffs(o["signoffs"], n["signoffs"]).items():
        change = Change("days", mark, "sign-off", before, after)
        walls.get(mark, site).append(change)  # a wall standing in both, else the site
    return site, walls


def _foundation_walls(o: dict, n: dict) -> dict[str, list[Change]]:
    """The changed inputs of each foundation wall in both files, by mark."""
    old = {w["mark"]: w for w in o["foundation_walls"]}
    return {w["mark"]: [Change(_kind(c.field, FOUNDATION_KINDS, FOUNDATION_DAYS), c.item,
                               c.field, c.old, c.new)
                        for c in _compare("wall", w["mark"], old[w["mark"]], w)]
            for w in n["foundation_walls"] if w["mark"] in old}


def _backfill_events(o: dict) -> dict[str, dict]:
    """The backfill events by day and wall or line ("day 6 FW-W", a second one "... #2")."""
    out: dict[str, dict] = {}
    for e in o["backfill_events"]:
        key = f"day {e['day']} {e['wall'] or e['line']}"
        count = sum(k == key or k.startswith(f"{key} #") for k in out)
        out[key if not count else f"{key} #{count + 1}"] = e
    return out


def _signoffs(old: list[dict], new: list[dict]) -> dict[str, tuple]:
    """Each wall's sign-offs that changed: (before, after), each "day N by WHO; ..." or None."""
    def by_wall(items):
        out: dict[str, list[str]] = {}
        for s in items:
            out.setdefault(s["panel"], []).append(f"day {s['day']} by {s['by']}")
        return {mark: "; ".join(sorted(v)) for mark, v in out.items()}

    a, b = by_wall(old), by_wall(new)
    return {mark: (a.get(mark), b.get(mark)) for mark in dict.fromkeys([*a, *b])
            if a.get(mark) != b.get(mark)}


def _same_speed(a: float, b: float) -> bool:
    if not (math.isfinite(a) and math.isfinite(b)):
        return a == b or (math.isnan(a) and math.isnan(b))
    return abs(a - b) < SAME_SPEED_MPH


def _worse(a: PanelResult, b: PanelResult) -> list[str]:
    why = []
    if b.utilization > 1.0 and b.utilization > a.utilization + SAME_UTILIZATION:
        why.append(f"governing utilization rose to {_u(b.utilization)}, above 1.0")
    if (math.isfinite(b.working_limit_speed_mph) and math.isfinite(a.stand_down_speed_mph)
            and b.working_limit_speed_mph < a.stand_down_speed_mph - SAME_SPEED_MPH):
        why.append(f"working-limit gust {b.working_limit_speed_mph:.0f} mph is below the "
                   f"stand-down gust it had before, {a.stand_down_speed_mph:.0f} mph")
    return why


def compare(old_site: Site, old: SiteResult, new_site: Site, new: SiteResult) -> SiteDiff:
    """What changed from the old file to the new, and whether a wall got worse."""
    from bracing.diff_foundation import compare_walls  # it reads this module's Change

    site_changes, wall_changes = input_changes(old_site, new_site)
    foundation, foundation_added, foundation_removed = compare_walls(old, new, wall_changes)
    pairs, added, removed = matched(old.panels, new.panels)
    walls = []
    for a, b in pairs:
        changes = wall_changes.get(b.mark, [])
        moved = (a.status != b.status
                 or abs(a.utilization - b.utilization) > SAME_UTILIZATION
                 or not _same_speed(a.working_limit_speed_mph, b.working_limit_speed_mph))
        if not (changes or moved):
            continue
        walls.append(WallChange(
            mark=b.mark, changes=changes, old_status=a.status, new_status=b.status,
            old_utilization=a.utilization, new_utilization=b.utilization,
            old_governing=a.governing_element, new_governing=b.governing_element,
            old_working_limit_mph=a.working_limit_speed_mph,
            new_working_limit_mph=b.working_limit_speed_mph,
            old_stand_down_mph=a.stand_down_speed_mph, new_stand_down_mph=b.stand_down_speed_mph,
            worse=_worse(a, b)))
    return SiteDiff(
        changes=site_changes, walls=walls, added=added, removed=removed,
        new_fails=new.fails, new_failing=[p.mark for p in new.failing()],
        foundation_walls=foundation, foundation_added=foundation_added,
        foundation_removed=foundation_removed,
        new_failing_foundation=[w.mark for w in new.foundation_walls if w.fails])


def matched(old: list, new: list) -> tuple[list[tuple], list[str], list[str]]:
    """Records with a `mark` in two files: (old, new) of each mark in both, in the new file's
    order; the marks added; the marks removed."""
    before, marks = {x.mark: x for x in old}, {x.mark for x in new}
    return ([(before[x.mark], x) for x in new if x.mark in before],
            [x.mark for x in new if x.mark not in before],
            [x.mark for x in old if x.mark not in marks])


def _u(u: float) -> str:
    return "unbounded" if math.isinf(u) else f"{u:.2f}"


def _mph(v: float) -> str:
    return f"{v:.0f} mph" if math.isfinite(v) else "none"


def _show(value) -> str:
    return "(none)" if value is None else str(value)


def _change_text(c: Change) -> str:
    where = f"{c.field}: " if c.field else ""
    return f"{where}{_show(c.old)} -> {_show(c.new)}"


def render_text(d: SiteDiff, old_name: str, new_name: str) -> str:
    """The comparison in words: what changed in the inputs, each changed wall before and after,
    and the verdict, between two cautions."""
    lines = [CAUTION, "", f"What changed from {old_name} to {new_name}:"]
    by_kind: dict[str, list[Change]] = {}
    for c in d.changes:
        by_kind.setdefault(c.kind, []).append(c)
    for kind, changes in by_kind.items():
        for c in changes:
            lines.append(f"  {kind} {c.item}: {_change_text(c)}")
    for what, marks in (("walls added", d.added), ("walls removed", d.removed),
                        ("foundation walls added", d.foundation_added),
                        ("foundation walls removed", d.foundation_removed)):
        if marks:
            lines.append(f"  {what}: {', '.join(marks)}")
    if not (d.changes or d.added or d.removed or d.walls or d.foundation_added
            or d.foundation_removed or d.foundation_walls):
        lines.append("  nothing")
    if d.walls:
        lines += ["", "Changed walls (before -> after):"]
    for w in d.walls:
        lines += _wall_lines(w)
    if d.foundation_walls:
        lines += ["", "Changed foundation walls (before -> after):"]
    for w in d.foundation_walls:
        lines += w.lines()
    lines += ["", _verdict(d), "", CAUTION]
    return "\n".join(lines)


def _wall_lines(w: WallChange) -> list[str]:
    """One changed wall before and after: its status, its changed inputs, its governing
    utilization and its gusts, and why it is worse."""
    lines = [f"  {w.mark}: status {w.old_status} -> {w.new_status}"]
    for c in w.changes:
        lines.append(f"    {c.kind}: {_change_text(c)}")
    if not w.changes:
        lines.append("    its own inputs are unchanged: the loads, rules or walls around it "
                     "changed")
    lines.append(f"    governing utilization {_u(w.old_utilization)} ({w.old_governing}) -> "
                 f"{_u(w.new_utilization)} ({w.new_governing})")
    lines.append(f"    working-limit gust {_mph(w.old_working_limit_mph)} -> "
                 f"{_mph(w.new_working_limit_mph)}; stand-down gust "
                 f"{_mph(w.old_stand_down_mph)} -> {_mph(w.new_stand_down_mph)}")
    lines += [f"    WORSE x: {why}" for why in w.worse]
    return lines


def _verdict(d: SiteDiff) -> str:
    """The verdict line: not acceptable (and why) when a wall got worse or the new file fails."""
    if not d.fails:
        return "Verdict: no wall got worse, and the new file passes."
    reasons = []
    worse = [w.mark for w in [*d.walls, *d.foundation_walls] if w.worse]
    if worse:
        reasons.append(f"worse: {', '.join(worse)}")
    failing = [*d.new_failing, *d.new_failing_foundation]
    if d.new_fails:
        reasons.append("the new file fails a check or has a danger finding"
                       + (f" ({', '.join(failing)})" if failing else ""))
    return f"Verdict: NOT ACCEPTABLE x ({'; '.join(reasons)})."
