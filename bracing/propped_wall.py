"""A foundation wall propped by inside braces (method notes §12): the wall strip from its base to
its top as a beam, held at its base and by the braces at `h_b`, under the earth pressure of a
backfill `h_f` high and the wind on the part above the backfill.

Small pure formulas over floats or numpy arrays, per foot of wall: forces in lb, moments in
lb-ft, heights in ft. Moments are positive with the backfill (outside) face in tension (as the
cantilever's at its base), negative with the inside face in tension (the span between the base
and the braces, bowed in by the fill). The base is taken both pinned and fixed and the envelope
kept: its fixity is not relied on, and not ignored where it raises a moment (a fixed base takes
a moment of its own and, under load above the braces, a larger brace reaction).
"""

from __future__ import annotations

from dataclasses import replace

import numpy as np

from bracing.results import Check
from bracing.wall_sections import STRENGTH, Wall, section

# ASCE 7-16 Figure 29.3-1: the resultant of a freestanding wall's wind at 0.55 of its height.
# A uniform pressure of 1.1 p on the part above the backfill gives the same moment about its
# foot (1.1 p s^2 / 2 = p s x 0.55 s) and 10 % more shear: the load the beam is checked under.
WIND_RESULTANT_HEIGHT = 0.55
UNIFORM_WIND_FACTOR = 2.0 * WIND_RESULTANT_HEIGHT
LEVELS = 401  # levels the beam is worked at, base to top


def wind_above(level, fill, top, load_plf_per_ft):
    """Shear and moment at `level` from a uniform `load_plf_per_ft` (lb per ft of wall per ft of
    height) on the part between `fill` and `top`, above the level (statics: the free body above
    the level; the load's resultant at its middle).

    >>> [float(x) for x in wind_above(0.0, 6.0, 9.0, 10.0)]
    [30.0, 225.0]
    """
    lo = np.maximum(np.asarray(level, dtype=float), fill)
    shear = load_plf_per_ft * np.maximum(top - lo, 0.0)
    return shear, shear * ((top + lo) / 2.0 - np.asarray(level, dtype=float))


def pinned_reaction(base_moment, brace_height):
    """The brace reaction with the base pinned, R = M_0 / h_b, M_0 the loads' moment about the
    base (statics: moments about the base)."""
    return base_moment / brace_height


def fixed_reaction(level, moment, brace_height):
    """The brace reaction with the base fixed (a propped cantilever, prismatic): no deflection
    at the brace relative to the tangent at the base, so by the second moment-area theorem
    integral_0^h_b (M_L(z) - R (h_b - z)) (h_b - z) dz = 0, i.e.
    R = 3 / h_b^3 integral_0^h_b M_L(z) (h_b - z) dz, M_L the moment of the loads above z
    (Mohr's theorem; for a uniform load w on the span alone it gives the beam formula 3 w L / 8).

    >>> z = np.linspace(0.0, 10.0, 2001)
    >>> round(float(fixed_reaction(z, 100.0 * (10.0 - z) ** 2 / 2.0, 10.0)), 3)
    375.0
    """
    z = np.asarray(level, dtype=float)
    arm = np.clip(brace_height - z, 0.0, None)
    return 3.0 / brace_height ** 3 * np.trapezoid(moment * arm, z)


def effects(level, shear, moment, brace_height, reaction):
    """Shear and moment along the propped wall: the loads' less the brace reaction's below the
    brace (statics)."""
    below = np.asarray(level) < brace_height
    return (shear - np.where(below, reaction, 0.0),
            moment - reaction * np.clip(brace_height - np.asarray(level), 0.0, None))


def envelope(soil, fill: float, top: float, brace_height: float, earth_factor: float,
             wind_load: float = 0.0) -> dict:
    """The extreme factored effects of the propped wall, base pinned and fixed, the wind
    (`wind_load`, factored, lb per ft per ft on the part above the backfill) toward either
    face. Returns {region: (largest moment with the backfill face in tension, largest with the
    inside face in tension, largest |shear|)} for "span" (base to braces, the base included)
    and "above" (the braces to the top), each >= 0, and "reaction": the largest brace reaction
    per ft of wall."""
    z = np.union1d(np.linspace(0.0, top, LEVELS), [brace_height, min(fill, top)])
    earth_v, earth_m = soil.at(fill, z)
    at_brace = int(np.searchsorted(z, brace_height))
    out = {"span": [0.0, 0.0, 0.0], "above": [0.0, 0.0, 0.0], "reaction": 0.0}
    for sign in ((1.0, -1.0) if wind_load else (1.0,)):
        wind_v, wind_m = wind_above(z, fill, top, sign * wind_load)
        shear, moment = earth_factor * earth_v + wind_v, earth_factor * earth_m + wind_m
        for r in (pinned_reaction(moment[0], brace_height),
                  fixed_reaction(z, moment, brace_height)):
            v, m = effects(z, shear, moment, brace_height, r)
            out["reaction"] = max(out["reaction"], float(r))
            span = np.append(v[:at_brace], shear[at_brace] - r)  # to just below the brace
            for name, part, cut in (("span", z <= brace_height, span),
                                    ("above", z >= brace_height, v[at_brace:])):
                worst = out[name]
                worst[0] = max(worst[0], float(np.max(m[part])))
                worst[1] = max(worst[1], float(-np.min(m[part])))
                worst[2] = max(worst[2], float(np.max(np.abs(cut))))
    return {k: (tuple(v) if isinstance(v, list) else v) for k, v in out.items()}


def faces(wall: Wall) -> tuple:
    """The wall's sections (`wall_sections.section`, no weight credited) with its backfill face
    in tension and with its inside face in tension: bars at d from the inside face work at
    t - d from the backfill face when the inside face is in tension (ACI 318-19 §22.2, TMS
    402-16 §9.3: d to the tension bars); plain and unreinforced sections are the same both ways."""
    outside = section(wall, 0.0)
    if wall.material in ("reinforced", "reinforced_masonry"):
        return outside, section(replace(wall, depth=wall.thickness - wall.depth), 0.0)
    return outside, outside


def wind_load(wall: Wall, fill: float, wind, strength: bool) -> tuple[float, str]:
    """The factored uniform wind on the part above the backfill (lb per ft per ft) and its
    words in the combination: `wind` = (pressure on that part, psf; its factor beside the
    strength sections' 1.6H; beside the allowable 1.0H), None: no wind; 1.1 p
    (`UNIFORM_WIND_FACTOR`)."""
    if wind is None or wind[0] <= 0.0 or wall.height <= fill:
        return 0.0, ""
    factor = wind[1] if strength else wind[2]
    return UNIFORM_WIND_FACTOR * factor * wind[0], f" + {factor:g}W"


def brace_reaction(wall: Wall, soil, fill: float, brace_height: float, earth_factor: float,
                   wind=None) -> tuple[float, str]:
    """The braces' largest reaction per ft of wall, base pinned or fixed, the wind (`wind` as
    in `wind_load`, at its allowable factor) toward either face (`envelope`), and the wind's
    words in the combination."""
    load, words = wind_load(wall, fill, wind, strength=False)
    return envelope(soil, fill, wall.height, brace_height, earth_factor, load)["reaction"], words


def checks(wall: Wall, soil, fill: float, brace_height: float, wind=None) -> list[Check]:
    """Flexure and shear of the propped wall, base to braces and above the braces, under the
    backfill `fill` and the wind on the part above it (`wind` as in `wind_load`) toward
    either face; the base pinned and fixed (`envelope`), each moment against the capacity of
    the face it puts in tension, the shear against the lesser."""
    outside, inside = faces(wall)
    load, words = wind_load(wall, fill, wind, outside.combination == STRENGTH[1])
    found = envelope(soil, fill, wall.height, brace_height, outside.factor, load)
    how = "propped: base pinned and fixed, statics and moment-area (method notes §12)"
    out = []
    for name, region in (("span", "between base and brace"), ("above", "above the brace")):
        m_out, m_in, v = found[name]
        out += [max((Check(element="wall", region=f"flexure {region}", demand=m,
                           capacity=float(sec.moment), unit="lb·ft/ft",
                           combination=outside.combination + words,
                           source=f"{sec.moment_source}; {face}; {how}")
                     for m, sec, face in ((m_out, outside, "backfill face in tension"),
                                          (m_in, inside, "inside face in tension"))),
                    key=lambda c: c.utilization),
                Check(element="wall", region=f"shear {region}", demand=v,
                      capacity=float(min(outside.shear, inside.shear)), unit="lb/ft",
                      combination=outside.combination + words,
                      source=f"{outside.shear_source}; the lesser of the two faces; {how}")]
    return out

