"""The root solver of the limit searches: many walls at once (method notes §5)."""

from __future__ import annotations

import numpy as np

SPEED_BRACKET_MPH = (0.0, 400.0)
HEIGHT_BRACKET_FT = (0.01, 300.0)
TYPICAL_LIMIT_MPH = 90.0  # first trial of a speed search: near most working limits
ROOT_TOLERANCE = 1e-7  # a search settles where |g| (a utilization less 1) is below this


def solve_increasing(g, lo: float, hi: float, size: int, start=None, iterations: int = 60,
                     tolerance: float = ROOT_TOLERANCE) -> np.ndarray:
    """Root of an increasing g(x, rows) on [lo, hi] for many walls at once; NaN where none.

    `g(x, rows)` gives g of the walls `rows` (an index array) at their trial values `x`; each
    step asks only for the walls not yet settled. `start` (a value or one per wall) is tried
    first; then, while a wall's trials all fall on one side of its root, the value where its
    utilization (g + 1) would reach 1 if it grew in proportion to x (exact for a wind moment
    against a weight, in V^2), and the secant through its two trials (exact for any linear
    utilization). The ends of [lo, hi] are asked only where all three fall on one side. Then
    Illinois regula falsi (a bracketing secant step that halves a stale end's weight), the
    secant taken through log x and log utilization where both are positive (exact for a
    utilization that grows as a power of x, as a wind moment does with height), falling back
    to bisection where the step leaves the bracket: robust like bisection, fast like secant.
    """
    br = _Bracket(g, lo, hi, size, tolerance)
    if start is not None:
        x0, g0 = br.trial(np.broadcast_to(np.asarray(start, dtype=float), size))
        with np.errstate(divide="ignore", invalid="ignore", over="ignore"):
            x1, g1 = br.trial(x0 / (1.0 + g0), x0)  # utilization in proportion to x
            br.trial(x1 - g1 * (x1 - x0) / (g1 - g0), x1)  # the secant through both
    br.close()
    a, b, fa, fb = br.a, br.b, br.fa, br.fb
    at_lo = (a == lo) & (fa >= 0.0)  # g(lo) >= 0: the root is at (or below) lo
    no_root = (b == hi) & (fb < 0.0)
    # walls without a root need no search, nor those where a trial already gave g = 0
    active = br.rows[(fa < 0.0) & (fb >= 0.0) & (np.minimum(-fa, fb) >= tolerance)]
    _illinois(g, br, active, iterations, tolerance)
    root = np.where(np.abs(fa) < np.abs(fb), a, b)
    root = np.where(at_lo, lo, root)
    return np.where(no_root, np.nan, root)


class _Bracket:
    """Each wall's bracket [a, b] of its root, with g at its ends where known."""

    def __init__(self, g, lo: float, hi: float, size: int, tolerance: float):
        self.g, self.lo, self.hi, self.tolerance = g, lo, hi, tolerance
        self.rows = np.arange(size)
        self.a, self.b = np.full(size, float(lo)), np.full(size, float(hi))
        self.fa, self.fb = np.full(size, np.nan), np.full(size, np.nan)
        self.known_a, self.known_b = np.zeros(size, bool), np.zeros(size, bool)

    def settled(self) -> np.ndarray:
        tol = self.tolerance
        return ((self.known_a & (np.abs(self.fa) < tol))
                | (self.known_b & (np.abs(self.fb) < tol)))

    def trial(self, x, before=None):
        """g at trial values x of the walls neither settled nor bracketed (NaN for others),
        each trial narrowing its wall's bracket."""
        a, b, fa, fb, known_a, known_b = (self.a, self.b, self.fa, self.fb, self.known_a,
                                          self.known_b)
        x = np.clip(x, self.lo, self.hi)
        open_ = ~self.settled() & ~(known_a & known_b) & ~np.isnan(x)
        which = self.rows[open_ if before is None else open_ & (x != before)]
        gx = np.full(len(self.rows), np.nan)
        if len(which):
            gx[which] = found = self.g(x[which], which)
            below, above = which[found < 0.0], which[found >= 0.0]  # NaN: neither
            move_a = below[~known_a[below] | (x[below] > a[below])]
            move_b = above[~known_b[above] | (x[above] < b[above])]
            a[move_a], fa[move_a], known_a[below] = x[move_a], gx[move_a], True
            b[move_b], fb[move_b], known_b[above] = x[move_b], gx[move_b], True
        return x, gx

    def close(self):
        """g at the ends not yet known, where a trial has not settled the wall already (a
        trial at g = 0 settles its wall: the other end is not asked)."""
        done = self.settled()
        self.fa[done & ~self.known_a], self.fb[done & ~self.known_b] = -np.inf, np.inf
        for x, f, known in ((self.a, self.fa, self.known_a | done),
                            (self.b, self.fb, self.known_b | done)):
            need = self.rows[~known]
            if len(need):
                f[need] = self.g(x[need], need)


def _illinois(g, br: _Bracket, active: np.ndarray, iterations: int, tolerance: float):
    """Illinois regula falsi on the brackets of the walls `active` (in place): the secant
    through log x and log utilization where both are positive, else the plain secant, else
    bisection; an end that stays twice in a row has its value halved."""
    a, b, fa, fb = br.a, br.b, br.fa, br.fb
    side = np.zeros(len(a))
    for _ in range(iterations):
        if len(active) == 0:
            break
        ai, bi, fai, fbi = a[active], b[active], fa[active], fb[active]
        with np.errstate(divide="ignore", invalid="ignore"):
            x = (ai * fbi - bi * fai) / (fbi - fai)
            la, lb, ua, ub = np.log(ai), np.log(bi), np.log1p(fai), np.log1p(fbi)
            x_log = np.exp(la - ua * (lb - la) / (ub - ua))
        x = np.where(np.isfinite(x_log) & (x_log > ai) & (x_log < bi), x_log, x)
        x = np.where(np.isfinite(x) & (x > ai) & (x < bi), x, 0.5 * (ai + bi))
        gx = g(x, active)
        below = gx < 0.0
        a[active] = np.where(below, x, ai)
        fa[active] = np.where(below, gx, fai)
        b[active] = np.where(below, bi, x)
        fb[active] = np.where(below, fbi, gx)
        stale_b = below & (side[active] == 1)
        stale_a = ~below & (side[active] == -1)
        fb[active[stale_b]] /= 2.0
        fa[active[stale_a]] /= 2.0
        side[active] = np.where(below, 1, -1)
        settled = (np.abs(gx) < tolerance) | (
            b[active] - a[active] < tolerance * (1.0 + np.abs(b[active])))
        active = active[~settled]


def solve_speed(g, size: int, start_mph=TYPICAL_LIMIT_MPH) -> np.ndarray:
    """Gust speed (mph) at which an increasing g of the squared speed crosses 0, many walls at
    once (NaN where none in the bracket).

    Wind loads grow with V^2 (ASCE 7-16 Eq. 26.10-1), so `g(v2, rows)` is given the squared
    speed: the utilizations are then nearly linear and the secant steps settle in a few passes.
    """
    lo, hi = SPEED_BRACKET_MPH
    return np.sqrt(solve_increasing(g, lo**2, hi**2, size, start=np.square(start_mph)))
