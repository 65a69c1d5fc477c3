"""One braced wall on a given foot anchor, for the validation tests that pin what the engine
reads from a published table (IBC Table 1806.2, NAVFAC DM-7.02, ICC-ES AC358)."""

from __future__ import annotations

from bracing import braced
from bracing.model import Site


def foot_capacities(anchor: dict):
    """The engine's capacities of a brace foot on `anchor` (one braced wall)."""
    site = Site.model_validate({
        "site": {"name": "t", "basic_wind_speed": 115.0},
        "materials": {"tilt": {"kind": "concrete", "unit_weight": 150.0}},
        "brace_types": {"b": {"kind": "rated", "lengths": [1.0, 100.0],
                              "loads": [9000.0, 9000.0], "tension_capacity": 9000.0}},
        "anchor_types": {"a": anchor},
        "panels": [{"mark": "P", "material": "tilt", "width": 20.0, "height": 24.0,
                    "thickness": 7.25, "bracing": {"brace_type": "b", "foot_anchor": "a",
                                                   "count": 2, "insert_height": 16.0,
                                                   "angle": 55.0}}]})
    return braced.gather_braces(site, "ASD")
