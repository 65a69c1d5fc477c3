"""JSON views of the result object: the keys of design.md §8 (stable; add, never rename)."""

from __future__ import annotations

import json
import math
from dataclasses import asdict

from bracing.results import PanelResult, SiteResult


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


def site_record(result: SiteResult) -> dict:
    """The whole site, walls worst first."""
    return _clean({
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
