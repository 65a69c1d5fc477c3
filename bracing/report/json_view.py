"""JSON views of the result object: the keys of design.md §8 (stable; add, never rename)."""

from __future__ import annotations

import json
import math
import re
from dataclasses import fields, is_dataclass
from functools import cache

from bracing.model import DEFAULT_RULES, Site
from bracing.results import PanelResult, SiteResult

METHOD = ("method notes (docs/method.md, shipped with the tool), which cite the published "
          "clauses")


def panel_record(p: PanelResult, basis: str, caution: str | None = None) -> dict:
    """One wall as the §8 record, with its checks worst first; `caution` for a record that
    stands alone (`bracing panel`: a site record holds the caution once, at its top)."""
    return _plain({
        "mark": p.mark,
        "material": p.material,
        "status": p.status,
        "basis": basis,
        "weight_lb": p.weight_lb,
        "wind": p.wind,
        "unbraced": p.unbraced,
        "braces": p.braces,
        "working_limit_speed_mph": p.working_limit_speed_mph,
        "stand_down_speed_mph": p.stand_down_speed_mph,
        "sustained_equivalents_of_stand_down_mph": p.sustained_equivalents_mph,
        "fresh_mortar_working_limit_speed_mph": p.fresh_working_limit_speed_mph,
        "fresh_mortar_stand_down_speed_mph": p.fresh_stand_down_speed_mph,
        "governing_element": p.governing_element,
        "governing_utilization": p.utilization,
        "checks": [c.as_dict() for c in p.worst_first()],
        "flags": p.flags_worst_first(),
        **({"caution": caution} if caution is not None else {}),
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
        "failing_walls": [p.mark for p in result.failing()]
        + [w.mark for w in result.foundation_walls if w.fails],
        "not_checked": [n.as_dict() for n in result.not_checked],
    }


def site_record(result: SiteResult, review: dict | None = None) -> dict:
    """The whole site, walls worst first; with `review`, the review record (review_record)."""
    return _plain({
        **({"review": review} if review is not None else {}),
        "site": result.name,
        "basis": result.basis,
        "basis_statement": result.basis_statement,
        "caution": result.caution,
        "panels": [panel_record(p, result.basis) for p in result.worst_first()],
        "days": result.days,
        "peak_inventory": result.peak_inventory,
        # foundation walls backfilled before the floor (method notes §12), when the site has any
        **({"foundation_walls": [_plain(w.as_dict()) for w in result.foundation_walls]}
           if result.foundation_walls else {}),
    })


def dumps(record: dict) -> str:
    """The record as JSON text: its top-level keys one per line, and each item of a top-level
    list (a wall, a day) on a line of its own, so that a large site's record stays readable
    line by line and is written by json's C encoder (an indented dump is ten times slower)."""
    def value(v) -> str:
        if isinstance(v, list) and v and isinstance(v[0], dict):
            return "[\n    " + ",\n    ".join(map(_compact, v)) + "\n  ]"
        return _compact(v)
    body = ",\n".join(f"  {_compact(k)}: {value(v)}" for k, v in record.items())
    return "{\n" + body + "\n}"


def _compact(v) -> str:
    return json.dumps(v, ensure_ascii=False, allow_nan=False)


def _plain(value):
    """Plain JSON values in one pass: result dataclasses become dicts of their fields, and NaN
    or infinity (which JSON lacks) becomes null."""
    kind = type(value)
    if kind is float:
        return value if math.isfinite(value) else None
    if kind in _AS_IS:
        return value
    if kind is dict:
        return {k: _plain(v) for k, v in value.items()}
    if kind is list or kind is tuple:
        return [_plain(v) for v in value]
    names = _field_names(kind)
    if names is None:
        return _plain(float(value)) if isinstance(value, float) else value  # numpy floats
    return {k: _plain(getattr(value, k)) for k in names}


_AS_IS = {str, int, bool, type(None)}


@cache
def _field_names(cls) -> tuple[str, ...] | None:
    """A dataclass's field names; None for any other type."""
    return tuple(f.name for f in fields(cls)) if is_dataclass(cls) else None
