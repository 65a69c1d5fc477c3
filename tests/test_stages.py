"""The stages' own parts: one function per formula with its fast path, flags as rule objects."""

from __future__ import annotations

from types import SimpleNamespace

import numpy as np
import pytest

from bracing import braces
from bracing.stages.findings import FlagRule
from bracing.stages.search import solve_increasing


def test_a_brace_force_splits_into_its_components_either_way():
    """Statics (text): P = 1,000 lb at 60 deg: 1,000 cos 60 = 500 lb across, 1,000 sin 60 =
    866.03 lb up; with the cosine and sine given beforehand (a search's fast path) the same."""
    theta = np.radians(60.0)
    slow = braces.components(np.array([1000.0]), np.array([60.0]))
    fast = braces.components(np.array([1000.0]), cos_sin=(np.cos(theta), np.sin(theta)))
    assert np.concatenate(slow) == pytest.approx([500.0, 866.0254], rel=1e-6)
    assert np.concatenate(fast) == pytest.approx([500.0, 866.0254], rel=1e-6)


def test_each_brace_takes_the_even_share_plus_the_twist_on_its_arm():
    """Statics (text), design.md §6: R_i = sum(R)/n + M_t (x_i - x_c) / sum((x_j - x_c)^2). Two
    braces 6 ft either side of their centroid sharing 200 lb under a twist of 1,200 lb-ft:
    100 + 1,200 x (-6) / 72 = 0 lb and 100 + 1,200 x 6 / 72 = 200 lb."""
    shares = braces.brace_shares(np.array([200.0]), np.array([200.0]), np.array([18.0]),
                                 np.array([12.0]), np.array([[6.0, 18.0]]),
                                 np.array([[True, True]]))
    # the force of 200 lb acts 6 ft off the braces' centroid at 12 ft: M_t = 200 x 6 = 1,200
    assert shares[0] == pytest.approx([0.0, 200.0])
    assert braces.each_share(np.array([100.0]), np.array([1200.0 / 72.0]),
                             np.array([[-6.0, 6.0]]))[0] == pytest.approx([0.0, 200.0])


def test_a_flag_rule_holds_its_condition_words_and_source_together():
    """A rule with fixed words gives the walls where it stands one shared flag; one with words
    per wall gives each its own, from the rows it stands on."""
    ctx = SimpleNamespace(value=np.array([0.5, 2.0, 3.0]), source={"limit": "a site rule"})
    flags = [[], [], []]
    FlagRule("high", "warning", lambda c: c.value > 1.0, "over one", "statics").raise_on(
        ctx, np.array([10, 11, 12]) - 10, flags)
    FlagRule("very-high", "danger", lambda c: c.value > 2.5,
             lambda c, rows: [f"at {v:g}" for v in c.value[rows].tolist()],
             rule="limit").raise_on(ctx, np.arange(3), flags)
    assert flags[0] == []
    assert flags[1][0] is flags[2][0] and flags[1][0].message == "over one"
    assert (flags[2][1].code, flags[2][1].message, flags[2][1].source) == (
        "very-high", "at 3", "a site rule")


def _falls_then_rises(x, rows):
    """u(x) = max(1.2 - x, (x/4)^2) less 1: fails below 0.2, passes from 0.2 to 4, then fails."""
    return np.maximum(1.2 - x, (x / 4.0) ** 2) - 1.0


@pytest.mark.parametrize("start", [0.5, 3.0, 0.05, 100.0])
def test_the_height_search_finds_the_highest_height_that_passes(start):
    """Method notes §3 (common practice: the highest root of u - 1). By hand: (x/4)^2 = 1 at
    x = 4, the highest crossing; the lower one, 1.2 - x = 1 at x = 0.2, is not the answer. From
    a start that passes where u falls (0.5) or rises (3), one that fails below (0.05: scanned)
    and one that fails above (100)."""
    (h,) = solve_increasing(_falls_then_rises, 0.01, 300.0, 1, start=start, highest=True)
    assert h == pytest.approx(4.0, rel=1e-6)
    assert _falls_then_rises(h, None) <= 0.0  # the wall passes there: never a failing height
