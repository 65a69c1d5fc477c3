"""The smallest parts of the result object (`bracing.results`): one limit check, one finding;
named in `bracing.results`.

Views format these values; none recomputes.
"""

from __future__ import annotations

import math
from dataclasses import asdict, dataclass

SEVERITIES = ("danger", "warning", "notice")  # ANSI Z535 signal words, most severe first


@dataclass(slots=True)
class Check:
    """One limit check: demand against capacity on a named load combination, with its source.

    A check is made only where its capacity is known: a check whose capacity is not known is
    left out (its element named by a finding or in `SiteResult.not_checked`), so neither value
    is ever NaN here.

    Attributes
    ----------
    element : str
        What is checked: "brace compression", "foot anchor", "overturning", ...
    region : str
        Where: "whole panel", "worst brace", "end zone, per ft", "interior, per ft", ...
    demand : float
        The factored load effect, in `unit`, on `combination`.
    capacity : float
        The available strength in `unit`: allowable (ASD) or design (LRFD) by the site's basis,
        or an allowable value under LRFD where only that exists (the combination says so). 0 where
        there is none (a rated brace outside its table), which fails visibly.
    unit : str
        "lb", "lb·ft", "lb/ft", "lb·ft/ft", "psf", or "ratio" (an interaction check: demand is
        the ratio, capacity 1.0).
    combination : str
        The load combination, e.g. "0.6D + 0.6W (ASCE 7-16 §2.4.1)".
    source : str
        The published clause or method note the capacity comes from.

    Notes
    -----
    `utilization` is demand / capacity, dimensionless; inf (unbounded) where there is demand and
    no capacity, which JSON writes as null. It passes at <= 1.0.
    """

    element: str
    region: str
    demand: float
    capacity: float
    unit: str
    combination: str
    source: str

    @property
    def utilization(self) -> float:
        """Demand / capacity; infinite when there is demand and no capacity."""
        if self.capacity > 0:
            return self.demand / self.capacity
        return 0.0 if self.demand <= 0 else math.inf

    @property
    def passes(self) -> bool:
        return self.utilization <= 1.0

    def as_dict(self) -> dict:
        return {"element": self.element, "region": self.region, "demand": self.demand,
                "capacity": self.capacity, "unit": self.unit, "combination": self.combination,
                "source": self.source, "utilization": _finite(self.utilization),
                "passes": self.passes}


@dataclass(slots=True)
class Flag:
    """Something the user must see, with its severity and where the rule comes from.

    Attributes
    ----------
    code : str
        A short stable name, e.g. "outside-rated-range", "no-margin".
    severity : str
        One of `SEVERITIES`: "danger", "warning" or "notice" (ANSI Z535 signal words).
    message : str
        What it means for the crew, in plain words.
    source : str
        The published clause or method note of the rule; "" where there is none.
    """

    code: str
    severity: str
    message: str
    source: str = ""

    def as_dict(self) -> dict:
        return asdict(self)


def _finite(x: float) -> float | None:
    """JSON has no infinity: an unbounded value becomes null."""
    return None if x is None or not math.isfinite(x) else x
