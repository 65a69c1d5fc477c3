"""JSON views of the result object: the keys of design.md §8 (stable; add, never rename)."""

from __future__ import annotations

import json
import math
import re
from dataclasses import asdict

from bracing.model import DEFAULT_RULES, Site
from bracing.results import PanelResult, SiteResult

METHOD = ("method notes (docs/method.md, shipped with the tool), which cite the published "
          "clauses")


def panel_record(p: PanelResult, basis: str, caution: str) -> dict:
    """One wall as the §8 record, with its checks worst first."""
    return _clean({
        "mark": p.mark,
        "material": p.material,
        "status": p.status,
        "basis": basis,
        "weight_lb": p.weight_lb,
        "wind": asdict(p.wind),
        "unbraced": asdict(p.unbraced),
        "braces": p.braces,
        "working_limit_speed_mph": p.working_limit_speed_mph,
        "stand_down_speed_mph": p.stand_down_speed_mph,
        "sustained_equivalents_of_stand_down_mph": p.sustained_equivalents_mph,
        "fresh_mortar_working_limit_speed_mph": p.fresh_working_limit_speed_mph,
        "fresh_mortar_stand_down_speed_mph": p.fresh_stand_down_speed_mph,
        "governing_element": p.governing_element,
        "governing_utilization": p.utilization,
        "checks": [c.as_dict() for c in p.worst_first()],
        "flags": [f.as_dict() for f in p.flags_worst_first()],
        "caution": caution,
    })


# The team's design sections some engine sources still name, and the method notes' sections
# (docs/method.md) that users have, which state the same readings.
NOTES_SECTION = {"§3": "§1", "§4": "§2", "§5": "§3", "§6": "§4", "§7": "§6", "§8": "§8",
                 "§8a": "§8"}


def as_output(source: str) -> str:
    """A source as reports print it: a value from memory is an unconfirmed value; the method
    is cited as the method notes users have, by section."""
    source = re.sub(r"design\.md( §\w+)?", lambda m: "method notes" + (
        f" {NOTES_SECTION.get(m.group(1).strip(), '')}".rstrip() if m.group(1) else ""), source)
    return source.replace("from memory", "unconfirmed value")


def review_record(site: Site, result: SiteResult, facts: dict) -> dict:
    """The review record: what was checked, with what, on what basis, when (`facts`: the site
    file's name and SHA-256, the tool's name and version, the date; read at the edge)."""
    rules = []
    for name in dict.fromkeys([*DEFAULT_RULES, *site.rules]):
        r = site.rule(name)
        rules.append({"name": name, "value": r.value, "in_force": r.enabled,
                      "source": as_output(r.source), "basis": r.basis})
    return {
        **facts,
        "design_basis": {"basis": result.basis, "risk_category": site.site.risk_category,
                         "statement": result.basis_statement},
        "rules": rules,
        "method": METHOD,
        "fails": result.fails,
        "failing_walls": [p.mark for p in result.failing()],
        "not_checked": [n.as_dict() for n in result.not_checked],
    }


def site_record(result: SiteResult, review: dict | None = None) -> dict:
    """The whole site, walls worst first; with `review`, the review record (review_record)."""
    return _clean({
        **({"review": review} if review is not None else {}),
        "site": result.name,
        "basis": result.basis,
        "basis_statement": result.basis_statement,
        "caution": result.caution,
        "panels": [panel_record(p, result.basis, result.caution) for p in result.worst_first()],
        "days": [asdict(d) for d in result.days],
        "peak_inventory": result.peak_inventory,
    })


def dumps(record: dict) -> str:
    return json.dumps(record, indent=2, ensure_ascii=False)


def _clean(value):
    """JSON has no NaN or infinity: those become null."""
    if isinstance(value, float) and not math.isfinite(value):
        return None
    if isinstance(value, dict):
        return {k: _clean(v) for k, v in value.items()}
    if isinstance(value, (list, tuple)):
        return [_clean(v) for v in value]
    return value
