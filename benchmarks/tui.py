"""Time the terminal interface as a user meets it, driven by Textual's pilot (headless).

    python benchmarks/tui.py [SITE.toml]     (default: scenarios/tilt-up-warehouse.toml, 42 walls)

For each step it prints two times, each as CPU time of the process (all its threads) and as
wall-clock time, in ms:

- "on screen": from the start (of the process, or of the key pressed) to the last frame the
  step drew: what the user waits for. The frames are caught where the app hands them to the
  terminal (`App._display`; headless, the frame is made and then dropped).
- "pilot done": until the pilot's own waiting ends as well. A pause sends a call to every
  widget and waits for them all; a user does not pay it.

The steps: the first view (imports, the site read and checked, the app built, the Walls table
drawn); a second's pause, as a user reads the first screen (the Wall view is built meanwhile,
off screen); each view's first visit; a switch back to a view; an edit (a wall's height typed and
Enter: that wall's result on screen, then the whole site's), and the same edit typed back.
Targets (design.md §9 / issue 13): first view 1 s, an edit 150 ms, a switch 200 ms.
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


class Frames:
    """The times of the frames the app drew, and of the results it was given (CPU, wall
    clock)."""

    def __init__(self, app) -> None:
        self.drawn: list[tuple[float, float]] = []
        self.results: list[tuple[float, float]] = []
        display = app._display

        def caught(screen, renderable) -> None:
            display(screen, renderable)
            if renderable is not None:
                self.drawn.append(now())

        app._display = caught

    def watch_results(self, app) -> None:
        app.watch(app, "result", lambda: self.results.append(now()), init=False)

    @property
    def last(self) -> tuple[float, float]:
        return self.drawn[-1] if self.drawn else (0.0, 0.0)

    def first_after(self, t: tuple[float, float]) -> tuple[float, float]:
        """The first frame drawn after `t`: the one that shows what was given at `t`."""
        return next((f for f in self.drawn if f[1] >= t[1]), self.last)


def row(label: str, start: tuple[float, float], shown: tuple[float, float]) -> None:
    """A step's times: until `shown` (a frame), and until now (the pilot done)."""
    (cpu, wall), (cpu_f, wall_f), (cpu_d, wall_d) = start, shown, now()
    if wall_f < wall:  # the step drew nothing: it was on screen when the key was read
        cpu_f, wall_f = cpu, wall
    print(f"{label:<28}{(cpu_f - cpu) * 1000:7.0f} {(wall_f - wall) * 1000:7.0f}"
          f"   {(cpu_d - cpu) * 1000:7.0f} {(wall_d - wall) * 1000:7.0f}")


async def drive(path: Path, started: tuple[float, float]) -> None:
    from textual.widgets import Input

    from tui.app import BracingApp

    app = BracingApp(path)
    frames = Frames(app)
    async with app.run_test(size=(120, 40)) as pilot:
        frames.watch_results(app)
        await pilot.pause()
        print(f"{'':<28}{'on screen':>15}   {'pilot done':>15}")
        print(f"{'step':<28}{'cpu':>7} {'wall':>7}   {'cpu':>7} {'wall':>7}")
        row("first view", started, frames.last)
        table = app.query_one("#walls-table")
        assert table.row_count, "the Walls table is empty: the figures would not be a user's"
        # a second on the first screen, as a user reads it (the Wall view is built meanwhile;
        # a key pressed within half a second builds it then, about 0.4 s)
        await asyncio.sleep(1.0)
        await pilot.pause()
        for key, name in (("2", "Wall"), ("3", "Day"), ("4", "Plan"), ("5", "Settings")):
            t = now()
            await pilot.press(key)
            await pilot.pause()
            row(f"first visit, {name}", t, frames.last)
        for key, name in (("1", "Walls"), ("2", "Wall"), ("3", "Day"), ("4", "Plan")):
            t = now()
            await pilot.press(key)
            await pilot.pause()
            row(f"switch to {name}", t, frames.last)
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
            frames.results.clear()
            await pilot.press("enter")
            await pilot.pause()
            await app.workers.wait_for_complete()
            await pilot.pause()
            # the wall's own result comes first, the whole site's last
            row(f"{label}: that wall", t, frames.first_after(frames.results[0]))
            row(f"{label}: whole site", t, frames.first_after(frames.results[-1]))


def main() -> None:
    started = now()
    site = Path(sys.argv[1]) if len(sys.argv) > 1 else \
        ROOT / "scenarios" / "tilt-up-warehouse.toml"
    with tempfile.TemporaryDirectory() as folder:
        for f in site.parent.glob(f"{site.stem}*"):
            shutil.copy(f, Path(folder) / f.name)
        print(f"{site.name}, 120 x 40, headless; ms")
        if sys.dont_write_bytecode:  # (a user's Python keeps the compiled modules)
            print("note: PYTHONDONTWRITEBYTECODE is set: a module with no compiled copy is "
                  "compiled at each start (up to 0.3 s more on the first view)")
        asyncio.run(drive(Path(folder) / site.name, started))


if __name__ == "__main__":
    main()
