"""The forecast file (the edge that reads it): its rows by day number (method notes §6).

CSV with a header row; columns `date` (ISO, needs start_date) or `day`, `gust_mph` or `gust`
(a unit allowed, "40 km/h"; bare numbers are mph), and optionally `storm`
(yes/no/true/false/1/0, blank = no). Gusts are forecast peak gusts, read as the reference 3-s
gust at 33 ft (design.md §3). Several rows for one day (hourly forecasts) give that day the
largest gust and any storm. Rows before day 1 are ignored. Blank lines and lines starting with
'#' are skipped. The path is relative to the site file's folder.
"""

from __future__ import annotations

import csv
from dataclasses import dataclass
from datetime import date
from pathlib import Path

from bracing import units
from bracing.model import DAY_LIMIT, Site, within
from bracing.scenario import SiteFileError, read_text

STORM_WORDS = {"yes": True, "true": True, "1": True, "no": False, "false": False, "0": False,
               "": False}


@dataclass(frozen=True)
class ForecastDay:
    """The forecast of one day: its largest gust (mph) and whether a thunderstorm is forecast."""

    gust_mph: float
    storm: bool


def site_forecast(site: Site, base_dir: str | Path | None = None) -> dict[int, ForecastDay]:
    """The site's forecast by day number, read from its `[forecast] file` in `base_dir` (the
    site file's folder; default the working folder); empty when the site names none or
    schedules no wall (no lift day: no day to forecast, the file is not read)."""
    if site.forecast is None or all(p.lift_day is None for p in site.panels):
        return {}
    return read_forecast(Path(base_dir or ".") / site.forecast.file, site.site.start_date)


def read_forecast(path: str | Path, start_date: date | None) -> dict[int, ForecastDay]:
    """The forecast by day number; raise SiteFileError naming the file and line of each problem."""
    path = Path(path)
    text = read_text(path, "forecast file")  # a regular file only: a pipe would hang the run
    rows = _rows(path, text)
    when, gust, columns = _columns(path, rows[0], start_date)
    out: dict[int, ForecastDay] = {}
    problems = []
    for n, cells in rows[1:]:
        cell = {name: cells[k].strip() if k < len(cells) else "" for name, k in columns.items()}
        try:
            day, speed, storm = _row(cell, when, gust, start_date)
        except ValueError as exc:
            problems.append(f"{path}:{n}: {exc}")
            continue
        if day < 1:
            continue
        if day > DAY_LIMIT:
            problems.append(f"{path}:{n}: day {day:,} is beyond the last day a job can have "
                            f"({DAY_LIMIT:,}, method notes §9)")
            continue
        seen = out.get(day)
        out[day] = ForecastDay(gust_mph=max(speed, seen.gust_mph) if seen else speed,
                               storm=storm or (seen.storm if seen else False))
    if problems:
        raise SiteFileError(str(path), problems)
    return out


def _rows(path: Path, text: str) -> list[tuple[int, list[str]]]:
    """(line number, cells) of the lines that are not blank or comments; at least one."""
    rows, problems = [], []
    for n, line in enumerate(text.splitlines(), 1):
        if not line.strip() or line.lstrip().startswith("#"):
            continue
        try:
            rows.extend((n, cells) for cells in csv.reader([line]))
        except csv.Error as exc:  # a field past the csv module's size limit, a NUL byte
            problems.append(f"{path}:{n}: cannot read the line as CSV ({exc})")
    if problems:
        raise SiteFileError(str(path), problems)
    if not rows:
        raise SiteFileError(str(path), [f"{path}: empty forecast file (a header row and one row "
                                        "per day are expected)"])
    return rows


def _columns(path: Path, header: tuple[int, list[str]], start_date: date | None
             ) -> tuple[str, str, dict[str, int]]:
    """The day column (`day` or `date`), the gust column and every column's index."""
    head_line, head = header
    columns = {name.strip().lower(): k for k, name in enumerate(head)}
    when = next((c for c in ("day", "date") if c in columns), None)
    gust = next((c for c in ("gust_mph", "gust") if c in columns), None)
    if when is None or gust is None:
        raise SiteFileError(str(path), [
            f"{path}:{head_line}: header needs a `date` or `day` column and a `gust_mph` or "
            f"`gust` column (found: {', '.join(head)})"])
    if when == "date" and start_date is None:
        raise SiteFileError(str(path), [
            f"{path}:{head_line}: the forecast gives dates: set [site] start_date (the date of "
            "day 1) in the site file"])
    return when, gust, columns


def _row(cell: dict[str, str], when: str, gust: str, start_date: date | None
         ) -> tuple[int, float, bool]:
    """A row's day, gust (mph) and storm; ValueError says what is wrong."""
    day = _day_of(cell[when], when, start_date)
    speed = within(units.parse(cell[gust], "speed"), "speed")
    if speed < 0:
        raise ValueError(f"negative gust {cell[gust]!r}")
    storm = STORM_WORDS.get(cell.get("storm", "").lower())
    if storm is None:
        raise ValueError(f"storm must be yes/no/true/false/1/0, got "
                         f"{units.shown(cell['storm'])}")
    return day, speed, storm


def _day_of(text: str, column: str, start_date: date | None) -> int:
    """Day number of a forecast row from its `day` or ISO `date` cell."""
    if column == "date":
        try:
            return (date.fromisoformat(text) - start_date).days + 1
        except ValueError:
            raise ValueError(f"date must be ISO (YYYY-MM-DD), got {units.shown(text)}") from None
    try:
        day = int(text)
    except ValueError:
        raise ValueError(f"day must be a whole number, got {units.shown(text)}") from None
    if day < 1:
        raise ValueError(f"day numbers start at 1, got {day}")
    return day
