"""The root solver of the limit searches: many walls at once (method notes §5)."""

from __future__ import annotations

import numpy as np

SPEED_BRACKET_MPH = (0.0, 400.0)
HEIGHT_BRACKET_FT = (0.01, 300.0)
TYPICAL_LIMIT_MPH = 90.0  # first trial of a speed search: near most working limits
ROOT_TOLERANCE = 1e-7  # a search settles where |g| (a utilization less 1) is below this
# values of x over the bracket, evenly in log x, where a height search saw no passing trial:
# 64 points over (0.01 ft, 300 ft) step 18% in height (team's choice)
SCAN_POINTS = 64


def solve_increasing(g, lo: float, hi: float, size: int, start=None, iterations: int = 60,
                     tolerance: float = ROOT_TOLERANCE, highest: bool = False) -> np.ndarray:
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

    A g that is not increasing everywhere (a wall's utilization may fall with height at very
    small heights, where the minimum design pressure meets the friction of a light wall) can
    cross 0 more than once: the bracket keeps its highest known x where g < 0 and a root above
    it (a trial with g >= 0 below that x says nothing of the highest root and is passed over).
    `highest=True` (the maximum unbraced height, method notes §3) asks for the highest x at
    which the wall passes: a wall that passes at no trial is scanned over [lo, hi] for its
    highest passing height, and the answer is the passing end of the bracket (g <= 0), never a
    height at which it fails; lo where it passes nowhere.
    """
    br = _Bracket(g, lo, hi, size, tolerance, highest)
    if start is not None:
        x0, g0 = br.trial(np.broadcast_to(np.asarray(start, dtype=float), size))
        with np.errstate(divide="ignore", invalid="ignore", over="ignore"):
            x1, g1 = br.trial(x0 / (1.0 + g0), x0)  # utilization in proportion to x
            br.trial(x1 - g1 * (x1 - x0) / (g1 - g0), x1)  # the secant through both
    br.close()
    if highest:
        br.scan(br.rows[(br.a == lo) & (br.fa >= 0.0)])  # no x seen where the wall passes
    a, b, fa, fb = br.a, br.b, br.fa, br.fb
    at_lo = (a == lo) & (fa >= 0.0)  # g(lo) >= 0: the root is at (or below) lo
    no_root = (b == hi) & (fb < 0.0)
    # walls without a root need no search, nor those where a trial already gave g = 0
    open_ = (fa < 0.0) & (fb >= 0.0)
    active = br.rows[open_ & ((-fa >= tolerance) & (fb != 0.0) if highest else
                              (np.minimum(-fa, fb) >= tolerance))]
    _illinois(g, br, active, iterations, tolerance)
    root = (np.where(fb == 0.0, b, a) if highest else
            np.where(np.abs(fa) < np.abs(fb), a, b))
    root = np.where(at_lo, lo, root)
    return np.where(no_root, np.nan, root)


class _Bracket:
    """Each wall's bracket [a, b] of its root, with g at its ends where known."""

    def __init__(self, g, lo: float, hi: float, size: int, tolerance: float,
                 highest: bool = False):
        self.g, self.lo, self.hi, self.tolerance, self.highest = g, lo, hi, tolerance, highest
        self.rows = np.arange(size)
        self.a, self.b = np.full(size, float(lo)), np.full(size, float(hi))
        self.fa, self.fb = np.full(size, np.nan), np.full(size, np.nan)
        self.known_a, self.known_b = np.zeros(size, bool), np.zeros(size, bool)

    def settled(self) -> np.ndarray:
        """Walls whose root is found: a trial within the tolerance of g = 0 (with `highest`,
        on the passing side, g <= 0)."""
        tol = self.tolerance
        if self.highest:
            return (self.known_a & (self.fa > -tol)) | (self.known_b & (self.fb == 0.0))
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
            # g >= 0 at or below a point where g < 0: a lower crossing, not the highest root
            move_b = above[(~known_b[above] | (x[above] < b[above]))
                           & (~known_a[above] | (x[above] > a[above]))]
            # g < 0 at or above a point where g >= 0: the highest root is higher still
            higher = move_a[known_b[move_a] & (x[move_a] >= b[move_a])]
            b[higher], fb[higher], known_b[higher] = self.hi, np.nan, False
            a[move_a], fa[move_a], known_a[move_a] = x[move_a], gx[move_a], True
            b[move_b], fb[move_b], known_b[move_b] = x[move_b], gx[move_b], True
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

    def scan(self, rows: np.ndarray, points: int = SCAN_POINTS):
        """For the walls `rows`, g at `points` values spaced evenly in log x over [lo, hi]:
        each wall's bracket becomes its highest x where g < 0 and the next value up (its
        bracket is left at lo where g < 0 nowhere; g's end values where it passes at hi)."""
        if not len(rows):
            return
        grid = np.geomspace(self.lo, self.hi, points)
        gx = self.g(np.tile(grid, len(rows)), np.repeat(rows, points)).reshape(len(rows), -1)
        passing = gx < 0.0
        top = points - 1 - np.argmax(passing[:, ::-1], axis=1)  # highest passing point
        found = passing.any(axis=1)
        walls, top = rows[found], top[found]
        above = np.minimum(top + 1, points - 1)
        gx = gx[found]
        self.a[walls], self.fa[walls] = grid[top], gx[np.arange(len(walls)), top]
        self.b[walls], self.fb[walls] = grid[above], gx[np.arange(len(walls)), above]
        self.known_a[walls] = self.known_b[walls] = True


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
        found = ((gx > -tolerance) & (gx <= 0.0) if br.highest  # on the passing side
                 else np.abs(gx) < tolerance)
        settled = found | (b[active] - a[active] < tolerance * (1.0 + np.abs(b[active])))
        active = active[~settled]


def solve_speed(g, size: int, start_mph=TYPICAL_LIMIT_MPH) -> np.ndarray:
    """Gust speed (mph) at which an increasing g of the squared speed crosses 0, many walls at
    once (NaN where none in the bracket).

    Wind loads grow with V^2 (ASCE 7-16 Eq. 26.10-1), so `g(v2, rows)` is given the squared
    speed: the utilizations are then nearly linear and the secant steps settle in a few passes.
    """
    lo, hi = SPEED_BRACKET_MPH
    return np.sqrt(solve_increasing(g, lo**2, hi**2, size, start=np.square(start_mph)))
