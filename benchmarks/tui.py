"""Time the terminal interface as a user meets it, driven by Textual's pilot (headless).

    python benchmarks/tui.py [SITE.toml]     (default: scenarios/tilt-up-warehouse.toml, 42 walls)

Prints, in ms of CPU time (the process's, all its threads) and of wall-clock time: the first
view on screen after start (imports, the site read and checked, the app built, the Walls table
drawn); each view's first visit, then a switch back to it; an edit shown (a wall's height typed
and Enter, until that wall's result is on screen, then until the whole site's is; then typed
back, the edit again without the first edit's one-off work); and the pilot's own pause, part of
each figure (a key pressed waits once, a pause once more). On a shared
machine the CPU time is the steadier figure. Targets (design.md §9 / issue 13): first view 1 s,
edit 150 ms, switch 200 ms.
"""

from __future__ import annotations

import asyncio
import shutil
import sys
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
sys.path.insert(0, str(ROOT))


def now() -> tuple[float, float]:
    return time.process_time(), time.perf_counter()


def ms(start: tuple[float, float]) -> str:
    """CPU and wall-clock time since `start`."""
    cpu, wall = (b - a for a, b in zip(start, now(), strict=True))
    return f"cpu {cpu * 1000:6.0f} ms   wall {wall * 1000:6.0f} ms"


async def drive(path: Path, started: tuple[float, float]) -> None:
    from textual.widgets import Input

    from tui.app import BracingApp

    app = BracingApp(path)
    async with app.run_test(size=(120, 40)) as pilot:
        await pilot.pause()
        print(f"{'first view on screen':<30}{ms(started)}")
        for key, name in (("2", "Wall"), ("3", "Day"), ("4", "Plan"), ("5", "Settings")):
            t = now()
            await pilot.press(key)
            await pilot.pause()
            print(f"{'first visit, ' + name:<30}{ms(t)}")
        for key, name in (("1", "Walls"), ("2", "Wall"), ("3", "Day"), ("4", "Plan")):
            t = now()
            await pilot.press(key)
            await pilot.pause()
            print(f"{'switch to ' + name:<30}{ms(t)}")
        await pilot.press("2")
        await pilot.pause()
        box = app.query_one("#field-height Input", Input)
        height = box.value
        for label, typed in (("edit", height.replace(" ft", "").strip() + ".5"
                              if " ft" in height else "20.5"), ("edit again", height)):
            box.focus()
            box.value = typed
            await pilot.pause()
            t = now()
            await pilot.press("enter")
            await pilot.pause()
            print(f"{label + ': that wall shown':<30}{ms(t)}")
            await app.workers.wait_for_complete()
            await pilot.pause()
            print(f"{label + ': whole site shown':<30}{ms(t)}")
        t = now()  # the pilot's own share of each figure above: a pause waits for every widget
        await pilot.pause()
        print(f"{'a pause with nothing to do':<30}{ms(t)}")


def main() -> None:
    started = now()
    site = Path(sys.argv[1]) if len(sys.argv) > 1 else \
        ROOT / "scenarios" / "tilt-up-warehouse.toml"
    with tempfile.TemporaryDirectory() as folder:
        for f in site.parent.glob(f"{site.stem}*"):
            shutil.copy(f, Path(folder) / f.name)
        print(f"{site.name}, 120 x 40, headless")
        asyncio.run(drive(Path(folder) / site.name, started))


if __name__ == "__main__":
    main()
