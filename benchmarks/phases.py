"""The steps of `bracing check SITE --json` one after the other: CPU seconds and peak memory.

    python benchmarks/phases.py SITE.toml

A profile of the whole command says where the time goes; this says it in the command's own
steps, with the memory each leaves behind (the process's peak, `ru_maxrss`) and the part of
each step's time spent by Python's cycle collector (timed through `gc.callbacks`; a profile
puts that time on whichever function allocated when a collection began).
"""

from __future__ import annotations

import gc
import resource
import sys
import time
from pathlib import Path


def main(argv: list[str] | None = None) -> int:
    site = Path((argv or sys.argv[1:])[0])
    last = time.process_time()
    collecting = {"since": 0.0, "total": 0.0}

    def collector(phase: str, info: dict) -> None:
        if phase == "start":
            collecting["since"] = time.process_time()
        else:
            collecting["total"] += time.process_time() - collecting["since"]

    gc.callbacks.append(collector)

    def step(name: str) -> None:
        nonlocal last
        now = time.process_time()
        peak = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss / 1024.0
        print(f"{name:<42} {now - last:7.3f} s CPU   peak {peak:5.0f} MiB   "
              f"cycle collector {collecting['total']:.3f} s")
        last, collecting["total"] = now, 0.0

    import numpy  # noqa: F401 - the bare start-up's imports
    import pydantic  # noqa: F401
    import shapely  # noqa: F401
    step("import numpy, shapely, pydantic")
    from bracing import cli, scenario
    from bracing.evaluate import evaluate
    from bracing.report import json_view
    step("import the command")
    site_file = scenario.load(site)
    step("read and validate the file")
    result = evaluate(site_file.site, base_dir=site.parent)
    step("evaluate")
    review = json_view.review_record(site_file.site, result, cli.review_facts(str(site)))
    step("review facts")
    record = json_view.site_record(result, review)
    size = sum(len(piece) for piece in json_view.pieces(record))  # as the command writes it
    step(f"JSON record and text ({size / 1e6:.1f} MB)")
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
