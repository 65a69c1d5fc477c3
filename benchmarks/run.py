"""Time the whole `bracing` command, as a user waits for it (design.md §9), and its peak memory.

    python benchmarks/run.py                 # bare start-up, 600 walls cold, 10,000 walls
    python benchmarks/run.py --repeat 9 --keep /tmp/bench

Every figure is a fresh process, measured from outside: start-up, reading and validating the
file, the evaluation and writing the output (to the null device). The CPU time and the peak
memory are the child's own (`os.wait4`: user + system time, `ru_maxrss`).

- bare start-up: `python -c "import numpy, shapely, pydantic"`;
- `bracing check SITE --json` on a 600-wall site, and its ratio to the bare start-up of the
  same run (design.md §9: within 2x). The two take turns, so a busy spell of a shared machine
  falls on both;
- `bracing check SITE --json` on a 10,000-wall site: CPU seconds and peak memory (design.md §9:
  under 3 s and 300 MiB).

The children write their compiled bytecode to a folder of the run (PYTHONPYCACHEPREFIX) and
one warm-up run of each command fills it: an installed package has its bytecode, and a cold
start here means a new process, not a first compile. The exit code is 0 whatever the figures.
"""

from __future__ import annotations

import argparse
import os
import statistics
import subprocess
import sys
import tempfile
import time
from dataclasses import dataclass
from pathlib import Path

HERE = Path(__file__).resolve().parent
sys.path.insert(0, str(HERE))

from make_site import write_site

BARE = [sys.executable, "-c", "import numpy, shapely, pydantic"]
START_UP_RATIO = 2.0  # design.md §9: 600 walls within 2x the bare start-up
LARGE_CPU_S = 3.0     # design.md §9: 10,000 walls in under 3 s of CPU
LARGE_MIB = 300.0     # ... and 300 MiB


@dataclass(frozen=True)
class Run:
    """One child process, measured from outside."""

    wall_s: float
    cpu_s: float     # user + system time of the child
    peak_mib: float  # its largest resident set (ru_maxrss, KiB on Linux)


def run(command: list[str], env: dict) -> Run:
    """Run `command` with its output to the null device; exit 0 or 1 (a failing wall) only."""
    with tempfile.TemporaryFile() as errors:
        start = time.perf_counter()
        child = subprocess.Popen(command, stdout=subprocess.DEVNULL, stderr=errors, env=env,
                                 cwd=HERE.parent)
        _, status, usage = os.wait4(child.pid, 0)
        wall = time.perf_counter() - start
        child.returncode = os.waitstatus_to_exitcode(status)
        if child.returncode not in (0, 1):
            errors.seek(0)
            raise SystemExit(f"{' '.join(command)} exited {child.returncode}:\n"
                             + errors.read().decode(errors="replace"))
    return Run(wall, usage.ru_utime + usage.ru_stime, usage.ru_maxrss / 1024.0)


def check(site: Path) -> list[str]:
    return [sys.executable, "-m", "bracing.cli", "check", str(site), "--json"]


def child_env(pycache: Path) -> dict:
    """The environment of the children: bytecode written to and read from `pycache`."""
    env = {k: v for k, v in os.environ.items() if k != "PYTHONDONTWRITEBYTECODE"}
    env["PYTHONPYCACHEPREFIX"] = str(pycache)
    return env


def summary(runs: list[Run]) -> str:
    cpu = [r.cpu_s for r in runs]
    wall = [r.wall_s for r in runs]
    return (f"CPU {min(cpu):.3f} s best, {statistics.median(cpu):.3f} s median; "
            f"wall-clock {min(wall):.3f} s best, {statistics.median(wall):.3f} s median; "
            f"peak {max(r.peak_mib for r in runs):.0f} MiB")


def load_average() -> str:
    try:
        return "load average " + " ".join(f"{x:.2f}" for x in os.getloadavg())
    except OSError:
        return "load average unknown"


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(description="Time the whole `bracing check --json` command.")
    parser.add_argument("--small", type=int, default=600, help="walls of the small site")
    parser.add_argument("--large", type=int, default=10_000, help="walls of the large site")
    parser.add_argument("--repeat", type=int, default=7,
                        help="runs of the bare start-up and of the small site, taking turns")
    parser.add_argument("--repeat-large", type=int, default=2, help="runs of the large site")
    parser.add_argument("--keep", help="write the sites to this folder and keep them")
    args = parser.parse_args(argv)

    with tempfile.TemporaryDirectory(prefix="bracing-bench-") as scratch:
        folder = Path(args.keep or scratch)
        small = write_site(args.small, folder / f"site-{args.small}.toml")
        large = write_site(args.large, folder / f"site-{args.large}.toml")
        env = child_env(Path(scratch) / "pycache")
        print(f"sites in {folder}: {small.name}, {large.name}; {os.cpu_count()} cores, "
              f"{load_average()}")
        for command in (BARE, check(small)):  # warm-up: the bytecode is written once
            run(command, env)

        bare, checked = [], []
        for _ in range(args.repeat):
            bare.append(run(BARE, env))
            checked.append(run(check(small), env))
        big = [run(check(large), env) for _ in range(args.repeat_large)]

    print(f"\nbare start-up (import numpy, shapely, pydantic), {args.repeat} runs: "
          f"{summary(bare)}")
    print(f"bracing check --json, {args.small} walls, {args.repeat} runs: {summary(checked)}")
    cpu_ratio = min(r.cpu_s for r in checked) / min(r.cpu_s for r in bare)
    wall_ratio = (statistics.median(r.wall_s for r in checked)
                  / statistics.median(r.wall_s for r in bare))
    print(f"  ratio to the bare start-up: {cpu_ratio:.2f}x CPU (best to best), "
          f"{wall_ratio:.2f}x wall-clock (median to median); target within "
          f"{START_UP_RATIO:g}x: " + ("met" if cpu_ratio <= START_UP_RATIO else "not met"))
    print(f"bracing check --json, {args.large} walls, {args.repeat_large} runs: {summary(big)}")
    cpu, peak = min(r.cpu_s for r in big), min(r.peak_mib for r in big)
    print(f"  target under {LARGE_CPU_S:g} s CPU: " + ("met" if cpu < LARGE_CPU_S else "not met")
          + f"; under {LARGE_MIB:g} MiB: " + ("met" if peak < LARGE_MIB else "not met"))
    print(f"\n{load_average()} (a shared machine's figures drift with its load)")
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
