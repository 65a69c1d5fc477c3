"""Braced walls: the names other modules import, from the stages that hold them (method notes §4).

The layouts and capacities are `bracing.stages.brace_set`, the loads and brace forces
`bracing.stages.brace_loads`, the checks and records `bracing.stages.braced`.
"""

from bracing.stages.arrays import rows_of, take  # noqa: F401
from bracing.stages.brace_loads import (  # noqa: F401
    BraceForces,
    BraceLoads,
    _case_loads,
    brace_forces,
    brace_loads,
)
from bracing.stages.brace_set import BraceSet, brace_set, gather_braces  # noqa: F401
from bracing.stages.braced import (  # noqa: F401
    CHECKS,
    SERVICEABILITY,
    Standing,
    braced_checks,
    braced_records,
    sill_uplift,
    sources,
    standing_of,
    strength_checks,
)
