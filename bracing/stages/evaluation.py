"""The arrays of one evaluation pass (`passes.evaluate_arrays`), before they become result
objects."""

from __future__ import annotations

from dataclasses import dataclass

import numpy as np

from bracing.stages.arrays import Walls
from bracing.stages.brace_loads import BraceForces
from bracing.stages.brace_set import BraceSet
from bracing.stages.wind import Wind


@dataclass
class Evaluation:
    """Arrays of one evaluation pass, before they become per-wall result objects."""

    walls: Walls
    wind: Wind
    checks: dict
    utilization: np.ndarray
    limit: np.ndarray
    stand_down: np.ndarray
    max_height: np.ndarray
    max_at_limit: np.ndarray
    design_speed: np.ndarray
    braces: BraceSet | None = None
    service_braces: BraceSet | None = None  # the same with allowable capacities (ASD)
    braced_checks: dict | None = None
    brace_forces: BraceForces | None = None
    braced_limit: np.ndarray | None = None
    braced_stand_down: np.ndarray | None = None
    braced_limit_missing: np.ndarray | None = None
    fresh_limit: np.ndarray | None = None       # masonry with fresh mortar (NaN: other walls)
    fresh_stand_down: np.ndarray | None = None
    columns: dict[str, tuple] | None = None  # the panels' fields (model.read_panels)
    held: tuple = ()  # the lateral loads that do not grow with the wind (loads.LateralLoad)
