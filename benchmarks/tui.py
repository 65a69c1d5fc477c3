"""Time the terminal interface as a user meets it, driven by Textual's pilot (headless).

    python benchmarks/tui.py [SITE.toml]     (default: scenarios/tilt-up-warehouse.toml, 42 walls)

Prints, in ms: the first view on screen after start (the site read and checked, the app built,
the Walls table drawn); an edit shown (a wall's height typed and Enter, until that wall's
result is on screen, then until the whole site's is); each view's first visit, then a switch
back to it. Targets (design.md §9 / issue 13): first view 1 s, edit 150 ms, switch 200 ms.
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


def ms(start: float) -> str:
    return f"{(time.perf_counter() - start) * 1000:7.0f} ms"


async def drive(path: Path, started: float) -> None:
    from textual.widgets import Input

    from tui.app import BracingApp

    app = BracingApp(path)
    async with app.run_test(size=(120, 40)) as pilot:
        await pilot.pause()
        print(f"first view on screen        {ms(started)}")
        for key, name in (("2", "Wall"), ("3", "Day"), ("4", "Plan"), ("5", "Settings")):
            t = time.perf_counter()
            await pilot.press(key)
            await pilot.pause()
            print(f"first visit, {name:<9}       {ms(t)}")
        for key, name in (("1", "Walls"), ("2", "Wall"), ("3", "Day"), ("4", "Plan")):
            t = time.perf_counter()
            await pilot.press(key)
            await pilot.pause()
            print(f"switch to {name:<9}          {ms(t)}")
        await pilot.press("2")
        await pilot.pause()
        box = app.query_one("#field-height Input", Input)
        box.focus()
        height = box.value
        box.value = height.replace(" ft", "").strip() + ".5" if " ft" in height else "20.5"
        t = time.perf_counter()
        await pilot.press("enter")
        await pilot.pause()
        print(f"edit: that wall shown       {ms(t)}")
        await app.workers.wait_for_complete()
        await pilot.pause()
        print(f"edit: whole site shown      {ms(t)}")


def main() -> None:
    started = time.perf_counter()
    site = Path(sys.argv[1]) if len(sys.argv) > 1 else ROOT / "scenarios" / "tilt-up-warehouse.toml"
    with tempfile.TemporaryDirectory() as folder:
        for f in site.parent.glob(f"{site.stem}*"):
            shutil.copy(f, Path(folder) / f.name)
        print(f"{site.name}, 120 x 40, headless")
        asyncio.run(drive(Path(folder) / site.name, started))


if __name__ == "__main__":
    main()
