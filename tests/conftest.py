"""Shared fixtures: a small valid site file, builders of one-panel sites, the command line."""

from __future__ import annotations

import subprocess
import sys
from pathlib import Path

import pytest
from hypothesis import settings

from bracing.evaluate import evaluate
from bracing.model import Site

REPO = Path(__file__).resolve().parents[1]

# No test asserts on time: hypothesis's per-example deadline is off for every property test
# (a busy machine would otherwise fail them at random).
settings.register_profile("no-deadline", deadline=None)
settings.load_profile("no-deadline")

# A small valid site file with comments, blank lines and units, as a user writes one.
SITE_TOML = """\
# Test site: one tilt-up panel and one masonry wall. Comments must survive a save.
version = 1

[site]
name = "Test yard"
basic_wind_speed = "115 mph"   # ASCE 7-16 basic wind speed
exposure = "C"                 # open terrain
construction_period = "5 weeks"

[materials.tilt]
kind = "concrete"
unit_weight = "150 pcf"        # normal-weight concrete

[materials.cmu8]
kind = "masonry"
face_weight = "36 psf"         # 8 in hollow CMU
grouting = "hollow"

# ---- panels ----
[[panels]]
mark = "P-1"
material = "tilt"
width = "24 ft"
height = "30 ft"               # top of the panel above grade
thickness = "7.25 in"

[[panels]]
mark = "M-1"
material = "cmu8"
width = "40 ft"
height = "6 ft"
thickness = "7.625 in"
mortar_age = "2 days"
"""

# Wall materials of the one-panel sites (the `bracing panel` defaults, design.md §8).
MATERIALS = {
    "concrete": {"kind": "concrete", "unit_weight": 150.0},  # ASCE 7 Table C3.1-2, from memory
    "masonry": {"kind": "masonry", "face_weight": 36.0},  # 8 in hollow CMU, HUD RSDG, secondary
    "framed": {"kind": "framed", "face_weight": 6.0},  # 2x4 sheathed, HUD RSDG, secondary
}


def line_of(text: str, fragment: str) -> int:
    """1-based number of the only line of `text` that contains `fragment`."""
    hits = [n for n, line in enumerate(text.splitlines(), 1) if fragment in line]
    assert len(hits) == 1, f"{fragment!r} is on lines {hits}"
    return hits[0]


def build_site(panels: list[dict], *, materials: dict | None = None, rules: dict | None = None,
               wind=115.0, exposure="C", **site) -> dict:
    """Raw site data (as a site file holds it) with the given panels and site fields."""
    data = {
        "version": 1,
        "site": {"name": "test", "basic_wind_speed": wind, "exposure": exposure, **site},
        "materials": materials or {kind: dict(m) for kind, m in MATERIALS.items()},
        "panels": panels,
    }
    if rules:
        data["rules"] = rules
    return data


def panel(mark="P-1", material="concrete", height=30.0, width=24.0, thickness=7.25,
          **fields) -> dict:
    """One panel's raw data; its material names a key of MATERIALS unless given otherwise."""
    return {"mark": mark, "material": material, "height": height, "width": width,
            "thickness": thickness, **fields}


def one_panel_site(*, site: dict | None = None, **fields) -> dict:
    """Raw data of a site with one panel (panel fields as keywords, site fields in `site`)."""
    return build_site([panel(**fields)], **(site or {}))


def evaluate_data(data: dict):
    """Validate raw site data and evaluate it."""
    return evaluate(Site.model_validate(data))


def run_bracing(*args: str) -> subprocess.CompletedProcess:
    """Run `python -m bracing.cli ARGS` end to end, as a user does."""
    return subprocess.run([sys.executable, "-m", "bracing.cli", *map(str, args)],
                          check=False, capture_output=True, text=True, cwd=REPO, timeout=120)


@pytest.fixture
def write_site(tmp_path):
    """Write site-file text under tmp_path and return its path."""

    def write(text: str, name: str = "site.toml") -> Path:
        path = tmp_path / name
        path.write_text(text, encoding="utf-8")
        return path

    return write


@pytest.fixture(scope="session")
def helpers():
    """The builders above, for tests (conftest is not imported directly)."""

    class Helpers:
        line_of = staticmethod(line_of)
        build_site = staticmethod(build_site)
        panel = staticmethod(panel)
        one_panel_site = staticmethod(one_panel_site)
        evaluate_data = staticmethod(evaluate_data)
        run_bracing = staticmethod(run_bracing)
        site_toml = SITE_TOML

    return Helpers
