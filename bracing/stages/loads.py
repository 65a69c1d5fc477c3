"""Load combinations and the lateral loads on walls (ASCE 7-16 §2.3, §2.4).

A lateral load pushes a wall's face out of plane: a pressure profile over the wall's height,
over a length along it, with its load combination. Wind is one kind (`bracing.stages.wind`
works out its pressures, cases and zones); other kinds (earth pressure from backfill, seismic)
are entries of `KINDS`, each with a function that gives its load on the walls. Every check and
the brace forces take them all; only the limit-speed searches are the wind's, and they hold the
loads that do not grow with the wind as they are.

To add a kind: write `on(site, walls) -> LateralLoad | None` (`pressure_load` turns a pressure
profile into one) and `register(LoadKind(...))`; see DEVELOPERS.md, "A new kind of load".
"""

from __future__ import annotations

from collections.abc import Callable
from dataclasses import dataclass

import numpy as np

from bracing.stages.arrays import Walls


@dataclass(frozen=True)
class Factors:
    """Load factors of one combination (ASCE 7-16 §2.3.1 / §2.4.1) and their names;
    `allowable`: the factors that allowable capacities take, where they differ (LRFD: ASD's,
    method notes §1); `basis`: which of a load kind's factors it takes ("ASD",
    "LRFD" or "service", the observed gust)."""

    basis: str
    dead_resists: float
    dead_adds: float
    wind: float
    resisting: str
    adding: str
    wind_only: str
    allowable: Factors | None = None


_ASD = Factors(basis="ASD", dead_resists=0.6, dead_adds=1.0, wind=0.6,  # ASCE 7-16 §2.4.1
               resisting="0.6D + 0.6W", adding="D + 0.6W", wind_only="0.6W")
COMBINATIONS = {
    "ASD": _ASD,
    "LRFD": Factors(basis="LRFD", dead_resists=0.9, dead_adds=1.2, wind=1.0,  # ASCE 7-16 §2.3.1
                    resisting="0.9D + 1.0W", adding="1.2D + 1.0W", wind_only="1.0W",
                    allowable=_ASD),
}
# Capacities the working limit reads: allowable ones (ASD) whatever the basis, so that the
# service speeds are the same under either (method notes §1).
SERVICE_BASIS = "ASD"
# The observed wind as a service load (method notes §1): 1.0W, 0.6D where dead load resists.
SERVICE = Factors(basis="service", dead_resists=0.6, dead_adds=1.0, wind=1.0,
                  resisting="0.6D + 1.0W (observed gust)", adding="D + 1.0W (observed gust)",
                  wind_only="1.0W (observed gust)")


@dataclass(frozen=True)
class LateralLoad:
    """One kind's unfactored load on every wall (arrays, one entry per wall of `walls`; zero
    where a wall has none). Statics of a pressure p(z, x) on the face, z above the wall's base,
    x from its first edge (left end)."""

    kind: str               # its entry in KINDS
    force: np.ndarray       # the resultant on the whole wall, lb
    height: np.ndarray      # its height above the wall's base, ft
    at: np.ndarray          # its distance from the wall's first edge, ft
    line: np.ndarray        # per foot of loaded length, plf
    start: np.ndarray       # the loaded length, ft from the first edge (uniform along it)
    end: np.ndarray


@dataclass(frozen=True)
class LoadKind:
    """A kind of lateral load: its factor in each combination, whether it grows with the wind,
    where it comes from, and `on(site, walls)`, its load on the walls (None: none on this site;
    `walls.panel` gives each wall's panel). Wind's `on` is None: its own stage works it out."""

    name: str
    symbol: str                 # its letter in the combinations: W, H, E
    factors: dict[str, float]   # by Factors.basis: "ASD", "LRFD", "service"
    scales_with_wind: bool      # the limit-speed searches scale it; the others are held
    source: str
    on: Callable[..., LateralLoad | None] | None = None

    def factor(self, f: Factors) -> float:
        """Its load factor in the combination `f`."""
        return self.factors[f.basis]


KINDS: dict[str, LoadKind] = {}


def register(kind: LoadKind) -> LoadKind:
    """Adds a kind of lateral load (one entry per kind; a name is registered once)."""
    if kind.name in KINDS:
        raise ValueError(f"load kind {kind.name!r} is already registered")
    KINDS[kind.name] = kind
    return kind


register(LoadKind(name="wind", symbol="W", factors={"ASD": 0.6, "LRFD": 1.0, "service": 1.0},
                  scales_with_wind=True, source="ASCE 7-16 §29.3 with ASCE 37-14 §6.2"))


def fixed_loads(site, walls: Walls) -> tuple[LateralLoad, ...]:
    """The loads on `walls` of every registered kind that does not grow with the wind."""
    made = (kind.on(site, walls) for kind in KINDS.values()
            if not kind.scales_with_wind and kind.on is not None)
    return tuple(load for load in made if load is not None)


def pressure_load(kind: str, walls: Walls, bottom_psf, top_psf, top_ft=np.inf, start_ft=0.0,
                  end_ft=np.inf) -> LateralLoad:
    """A pressure varying linearly over the height, `bottom_psf` at the wall's base to
    `top_psf` at `top_ft` above it (no higher than the wall; none above), uniform from
    `start_ft` to `end_ft` along the wall (within its length); arrays broadcast over walls.

    Statics of a trapezoid of height h: resultant (a + b) h / 2 per ft, at
    (a h^2 / 2 + (b - a) h^2 / 3) / resultant above the base. A uniform 10 psf on a wall
    12 ft tall and 20 ft long: 10 x 12 = 120 plf, 2,400 lb at 6 ft and 10 ft (by hand).
    """
    n = len(walls.height)
    a, b = (np.broadcast_to(np.asarray(v, dtype=float), n) for v in (bottom_psf, top_psf))
    h = np.minimum(np.broadcast_to(top_ft, n), walls.height)
    b = a + (b - a) * np.divide(h, np.broadcast_to(top_ft, n))  # the pressure at the clip
    start = np.clip(np.broadcast_to(start_ft, n), 0.0, walls.width)
    end = np.clip(np.broadcast_to(end_ft, n), start, walls.width)
    line = (a + b) * h / 2.0
    moment = a * h**2 / 2.0 + (b - a) * h**2 / 3.0
    with np.errstate(divide="ignore", invalid="ignore"):
        height = np.where(line != 0.0, moment / line, 0.0)
    return LateralLoad(kind=kind, force=line * (end - start), height=height,
                       at=(start + end) / 2.0, line=line, start=start, end=end)


@dataclass(frozen=True)
class FixedActions:
    """The factored sums of the held loads on each wall for one combination: push (lb) and
    moment about the wall's base (lb-ft) of the whole wall and per ft of its loaded length."""

    push: np.ndarray
    moment: np.ndarray
    line: np.ndarray
    line_moment: np.ndarray


def fixed_actions(loads: tuple[LateralLoad, ...], f: Factors) -> FixedActions | None:
    """The held loads' factored push and moment on each wall (None: no such load)."""
    if not loads:
        return None
    factor = [KINDS[load.kind].factor(f) for load in loads]
    return FixedActions(
        push=sum(k * load.force for k, load in zip(factor, loads, strict=True)),
        moment=sum(k * load.force * load.height for k, load in zip(factor, loads, strict=True)),
        line=sum(k * load.line for k, load in zip(factor, loads, strict=True)),
        line_moment=sum(k * load.line * load.height
                        for k, load in zip(factor, loads, strict=True)))
