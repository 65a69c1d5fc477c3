"""The checks of the walls as result objects, with what the views ask of them first."""

from __future__ import annotations

import re
from dataclasses import dataclass, fields
from itertools import pairwise, repeat

import numpy as np

from bracing.results import Check
from bracing.stages.alone import demand_ratio
from bracing.stages.braced import SERVICEABILITY
from bracing.stages.loads import Factors

UNBRACED_SOURCES = {
    "rigid": {},
    "masonry": {"overturning": "TMS 402-16 §8.2 flexural tension (unconfirmed value: confirm "
                               "in TMS 402-16), or W t/2 if larger",
                "sliding at base": "TMS 402-16 §8.2.6.2 bed-joint shear (unconfirmed value: "
                                   "confirm in TMS 402-16), or friction if larger"},
    "fresh": {"overturning": "statics, W t/2 about the bed joint (fresh mortar: weight only)",
              "sliding at base": "friction, mu 0.6 (fresh mortar: no bond)"},
    "strip": {"overturning": "statics, W t/2 about the sill"},
}


@dataclass(frozen=True)
class CheckSet:
    """The checks of the walls on their own, or of the braced walls, and per wall what the
    views ask of them first."""

    checks: list[list[Check]]             # each wall's checks that apply to it (demand known)
    governing: list[str]                  # the check of the largest strength utilization
    strength_ok: list[bool]               # every strength check passes
    failing: list[tuple[int, Check]]      # each check over 1.0 (serviceability too) and its
                                          # row, wall by wall
    brace_utilization: list[float | None]  # the largest of the brace's own checks


def check_set(arrays: dict, info: dict, combos: dict, ways: list[tuple[str, dict]],
               way: np.ndarray) -> CheckSet:
    """The checks of `arrays` (demand and capacity arrays by name, one entry per wall) with
    their summaries. Each wall is checked one of `ways` (`way` gives which): its kind as in
    UNBRACED_SOURCES or 'braced', which names the regions, the sources it has of its own and
    the combinations of its own (by element: allowable capacities under LRFD)."""
    names = [key.partition("|")[0] for key in arrays]
    demand = np.array([d for d, _ in arrays.values()]).reshape(len(arrays), len(way))
    capacity = np.array([c for _, c in arrays.values()]).reshape(demand.shape)
    ratios = np.where(np.isnan(demand), -np.inf, demand_ratio(demand, capacity))
    strength = np.where(np.array([n not in SERVICEABILITY for n in names])[:, None],
                        ratios, -np.inf)
    brace = np.where(np.array([n.startswith("brace") for n in names])[:, None], ratios, -np.inf)
    brace = brace.max(axis=0, initial=-np.inf)
    # each way's checks, named once: element, region, unit, combination, source
    named = [(element, regions[kind], unit, over.get(element, combination),
              sources.get(element, source))
             for kind, sources, over in ways
             for element, regions, unit, combination, source in _check_columns(arrays, info,
                                                                                combos)]
    # every check that applies, wall by wall, in the order of the arrays; each field a list
    applies = ~np.isnan(demand.T)
    wall, column = np.nonzero(applies)
    which = way[wall] * len(arrays) + column
    element, region, unit, combination, source = np.array(
        named, dtype=object).reshape(-1, 5)[which].T.tolist()
    made = each_of(Check, len(wall), element=element, region=region,
                   demand=demand.T[applies].tolist(), capacity=capacity.T[applies].tolist(),
                   unit=unit, combination=combination, source=source)
    ends = np.cumsum(applies.sum(axis=1)).tolist()
    # a wall with some check over 1.0: the checks that do not pass (Check.passes)
    fails = np.flatnonzero((ratios.max(axis=0, initial=-np.inf) > 1.0)[wall]
                           & ~(ratios.T[applies] <= 1.0))
    failing = list(zip(wall[fails].tolist(), map(made.__getitem__, fails.tolist()), strict=True))
    governing = [f"{element} ({region})" for element, region, *_ in named]
    return CheckSet(checks=[made[start:end] for start, end in pairwise([0, *ends])],
                    governing=[governing[k] for k in (way * len(arrays)
                                                      + strength.argmax(axis=0)).tolist()],
                    strength_ok=(strength.max(axis=0, initial=-np.inf) <= 1.0).tolist(),
                    failing=failing,
                    brace_utilization=np.where(brace == -np.inf, None, brace).tolist())


def _check_columns(arrays: dict, info: dict, combos: dict) -> list[tuple]:
    """Each check of a dict of demand/capacity arrays as (element, region by kind of wall, unit,
    combination, source).

    A key 'element|region' names its region; '*' is the whole panel, or the end zone of a wall
    built in place; no region is the worst brace. Walls built in place are checked per ft.
    """
    out = []
    for key in arrays:
        element, _, region = key.partition("|")
        unit, kind, source = info[element]
        regions = {"rigid": "whole panel" if region == "*" else region,
                   "braced": region or "worst brace"}
        strip = f"{'end zone' if region == '*' else region}, per ft"
        regions.update(masonry=strip, fresh=strip, strip=strip)
        out.append((element, regions, unit, combos[kind], source))
    return out


def flag_code(element: str) -> str:
    """A flag code from a check's name: its words joined by hyphens ('base kick-out' ->
    'base-kick-out'; 'overturning (wind away from the braces)' ->
    'overturning-wind-away-from-the-braces')."""
    return "-".join(re.findall(r"[a-z0-9]+(?:-[a-z0-9]+)*", element.lower()))


def on_allowable(f: Factors, kind: str) -> str:
    """The name of the combination of `kind` ('resisting', 'adding', 'wind') that an allowable
    capacity takes under the basis `f` (LRFD): ASD's, and says so."""
    a = f.allowable
    named = {"resisting": a.resisting, "adding": a.adding, "wind": a.wind_only}
    return f"{named[kind]} (allowable capacity: ASD combination under LRFD)"


def each_of(cls, n: int, **fields_of) -> list:
    """`n` objects of the dataclass `cls` from each field's values by name: a list holds one
    per object, anything else is every object's."""
    names = [f.name for f in fields(cls)]
    if set(fields_of) != set(names):
        raise TypeError(f"{cls.__name__} fields not given: {set(names) ^ set(fields_of)}")
    return list(map(cls, *(v if isinstance(v, list) else repeat(v, n)
                           for v in map(fields_of.get, names))))
