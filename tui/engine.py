"""What the interface asks of the engine: the result of a site file, a wall's checks at once
after an edit, the sign-offs that come too early, and validation problems in words."""

from __future__ import annotations

import re
from dataclasses import replace
from pathlib import Path

from bracing.evaluate import evaluate, evaluate_walls
from bracing.results import SiteResult
from bracing.scenario import SiteFile, SiteFileError


def compute(site_file: SiteFile) -> SiteResult:
    """The engine's result for a site file (the interface computes nothing itself); the
    forecast file is read from the site file's folder."""
    return evaluate(site_file.site, base_dir=Path(site_file.path).parent)


def quick(result: SiteResult, site_file: SiteFile, keys: tuple) -> SiteResult | None:
    """After an edit to one wall: the engine's checks of that wall spliced into the last
    result at once (the days and the plan follow with the whole site's result)."""
    if result is None or len(keys) < 2 or keys[0] != "panels":
        return None
    mark = site_file.site.panels[keys[1]].mark
    fresh = {p.mark: p for p in evaluate_walls(site_file.site, {mark})}
    if mark not in {p.mark for p in result.panels}:
        return None
    return replace(result, panels=[fresh.get(p.mark, p) for p in result.panels])


def early_signoffs(result: SiteResult) -> list[str]:
    """The engine's findings of sign-offs that come before their wall's lift or an event its
    release waits for."""
    early = ("signoff-before-event", "signoff-before-lift")
    flags = [f for p in result.panels for f in p.flags] + [f for d in result.days
                                                           for f in d.flags]
    return list(dict.fromkeys(f.message for f in flags if f.code in early))


def problems_text(exc: SiteFileError) -> str:
    """The validation problems without the file name (the field is beside the message)."""
    prefix = re.compile(rf"^{re.escape(str(exc.path))}(:\d+)?: ")
    return "; ".join(prefix.sub("", p) for p in exc.problems)
