"""The wind on every wall at one speed (ASCE 7-16 §29.3): one kind of lateral load."""

from __future__ import annotations

from dataclasses import dataclass, replace

import numpy as np

from bracing import lines
from bracing.stages.arrays import Walls
from bracing.wind import asce7


@dataclass(frozen=True)
class Wind:
    """Wind on every wall at one speed: pressures, coefficients and forces (arrays)."""

    kz: np.ndarray
    q: np.ndarray
    cf_case_a: np.ndarray       # Case A/B coefficient with openings
    opening: np.ndarray
    cf_whole: np.ndarray        # governing whole-panel coefficient (A/B or Case C summed)
    area: np.ndarray            # the area the coefficient applies to
    force_a: np.ndarray         # Case A force, lb
    force: np.ndarray           # governing whole-panel force, lb
    cf_end: np.ndarray          # per-foot coefficients of a solid strip
    cf_interior: np.ndarray
    cf_left: np.ndarray         # Case C over the wall's width, wind from its group's start
    x_left: np.ndarray          # (the largest of its groups) and where it acts, ft from the
    cf_right: np.ndarray        # wall's first edge; and from the far end
    x_right: np.ndarray
    line_end: np.ndarray        # per-foot forces, plf
    line_interior: np.ndarray
    lever: np.ndarray           # resultant height above the wall's base, ft
    lever_strip: np.ndarray
    minimum_governs: np.ndarray

    def scaled(self, factor) -> Wind:
        """The same wind with pressures and forces times `factor` (no minimum: observed gusts)."""
        return replace(self, q=self.q * factor, force_a=self.force_a * factor,
                       force=self.force * factor, line_end=self.line_end * factor,
                       line_interior=self.line_interior * factor)


def wind_on(w: Walls, speed, kd: float, minimum_psf: float | None) -> Wind:
    """The wind on each wall at `speed` (ASCE 7-16 §29.3); `minimum_psf` for design wind only.

    Every coefficient that depends on the walls' height (Kz, s/h, B/s, the Case C regions,
    the return walls' Lr/s, the wall lines') is worked out here from `w`, so walls at trial
    heights (`Walls.at_height`) get their own."""
    s = w.height
    top = w.base + s
    s_over_h = s / top
    b_over_s = w.width / s
    kz = asce7.kz(top, w.exposure)
    q = asce7.velocity_pressure(speed, kz, w.kzt, kd, w.ke)  # ASCE 7-16 Eq. 26.10-1
    g = asce7.GUST_FACTOR
    solid = w.solidity >= 0.7  # Figure 29.3-1 note 3; below 0.7 the wall is open
    opening = np.where(solid, asce7.opening_factor(np.minimum(w.solidity, 1.0)), 1.0)
    cf_ab = asce7.cf_cases_ab(b_over_s, s_over_h)
    # The wall alone and on its line each day: Case C from either end, enveloped (§4).
    line = lines.coefficients(w.groups, w.width, s, w.base)
    case_c = np.maximum(line.left_mean, line.right_mean)
    cf_open = asce7.cf_open(w.solidity)
    cf_case_a = np.where(solid, cf_ab * opening, cf_open)
    cf_whole = np.where(solid, np.maximum(cf_ab, case_c) * opening, cf_open)
    gross = w.width * s
    area = np.where(solid, gross, gross * w.solidity)  # open walls: Cf on the solid area
    # ASCE 7-16 §29.7: the minimum on As, the gross area of a solid wall and the solid area of
    # an open one (method notes §1)
    floor = 0.0 if minimum_psf is None else minimum_psf * area
    force_a = np.maximum(q * g * cf_case_a * area, floor)  # ASCE 7-16 Eq. 29.3-1
    force = np.maximum(q * g * cf_whole * area, floor)
    cf_end = np.where(solid, line.end, cf_open)
    cf_interior = np.where(solid, line.interior, cf_open)
    share = np.where(solid, 1.0, w.solidity)  # of a foot of wall, the area Cf applies to
    strip_floor = 0.0 if minimum_psf is None else minimum_psf * s * share
    line_end = np.maximum(q * g * cf_end * s * share, strip_floor)
    line_interior = np.maximum(q * g * cf_interior * s * share, strip_floor)
    ratio = asce7.resultant_height_ratio(s_over_h)
    # Figure 29.3-1: the resultant 0.05 h above the geometric centre where s/h = 1.
    lever = s * (w.centroid_ratio + (ratio - 0.5))
    return Wind(kz=kz, q=q, cf_case_a=cf_case_a, opening=opening, cf_whole=cf_whole, area=area,
                force_a=force_a, force=force, cf_end=cf_end, cf_interior=cf_interior,
                cf_left=line.left_mean, x_left=line.left_x, cf_right=line.right_mean,
                x_right=line.right_x, line_end=line_end, line_interior=line_interior,
                lever=lever, lever_strip=s * ratio,
                minimum_governs=(q * g * cf_whole * area) < floor)
