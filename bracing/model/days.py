"""The site's days: steps of the permanent work, the engineer's sign-offs, the forecast file."""

from __future__ import annotations

from typing import Literal

from pydantic import Field

from bracing.model.base import DAY_LIMIT, Strict


class Event(Strict):
    """A step of the permanent work that makes walls eligible for release."""

    name: str = Field(min_length=1)
    day: int = Field(ge=1, le=DAY_LIMIT)
    kind: Literal["diaphragm", "connections", "pour_strip", "other"] = "diaphragm"


class SignOff(Strict):
    """The engineer of record's release of one wall's braces (OSHA 1926.704(a))."""

    panel: str
    day: int = Field(ge=1, le=DAY_LIMIT)
    by: str = Field(min_length=1, description="Who released the wall.")


class Forecast(Strict):
    """A forecast file: CSV of date (or day) and forecast gust, an optional storm column."""

    file: str
