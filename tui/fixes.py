"""The fixes made from the views: the layout designer's braces, angle or foot distance, a brace
moved on the elevation, the events and the sign-offs. Each is one undoable edit through
`BracingApp.apply`; one the engine or the file's validation refuses is not made, and says why.

A mixin of `BracingApp` (its handlers go by name: a mixin's @on is not collected). The
dialogs and the designer load when first asked for (not waited for at start).
"""

from __future__ import annotations

from bracing.scenario import REMOVE, SiteFileError
from tui.engine import compute, early_signoffs, problems_text
from tui.fields import moved_brace, panel_index, with_values
from tui.wall_view import BraceElevation, openings_of


class Fixes:
    """Fixes to the site file asked from the views (a mixin of BracingApp)."""

    def _wall_index(self) -> int | None:
        return panel_index(self.site_file, self.mark) if self.view == "wall" else None

    def action_toggle_foot(self) -> None:
        """The wall's braces given by their foot distance instead of their angle, or back; the
        value carried over is the engine's for the present layout."""
        i = self._wall_index()
        table = self.site_file.data["panels"][i].get("bracing") if i is not None else None
        braces = self.result.panel(self.mark).braces if table else None
        if not braces:
            self.notify("Open a wall with braces (the Wall view) to switch angle and foot "
                        "distance.", severity="warning")
            return
        base = ("panels", i, "bracing")
        if "angle" in table:
            changes = [(base + ("angle",), REMOVE),
                       (base + ("anchor_distance",), f"{braces['anchor_distance_ft']:.2f} ft")]
        else:
            changes = [(base + ("anchor_distance",), REMOVE),
                       (base + ("angle",), f"{braces['angle_deg']:.1f} deg")]
        try:
            self.apply(with_values(self.site_file, changes), base)
        except SiteFileError as exc:
            self.notify(f"Not switched: {problems_text(exc)}", severity="error", markup=False)

    def action_design(self) -> None:
        """The layout designer's proposal for the wall on view, beside its present layout."""
        i = self._wall_index()
        if i is None:
            self.notify("Open a wall (the Wall view) to design its braces.", severity="warning")
            return
        from tui import design
        from tui.dialogs import DesignProposal
        proposal = design.propose(self.site_file, i)
        current = self.result.panel(self.mark)
        openings = openings_of(self.site_file.site.panels[i])
        self.push_screen(DesignProposal(self.mark, current, proposal, self.units, openings),
                         lambda accept: self._design_answer(i, proposal, accept))

    def _design_answer(self, i: int, proposal, accept: bool | None) -> None:
        if not accept or proposal.table is None:
            return
        try:
            changed = self.site_file.with_value(("panels", i, "bracing"), proposal.table)
        except SiteFileError as exc:
            self.notify(f"Not accepted: {problems_text(exc)}", severity="error", markup=False)
            return
        self.apply(changed, ("panels", i, "bracing"))

    def action_signoff(self) -> None:
        """The sign-offs (a wall's release: wall, day, who, license, date)."""
        from tui.days import signoff_fields
        marks = [p.mark for p in self.site_file.site.panels]
        defaults = {"panel": self.mark, "day": self.day}
        self._edit_list("signoffs", "Sign-offs: the release of a wall's braces (OSHA "
                        "1926.704(a))", signoff_fields(marks), defaults)

    def action_events(self) -> None:
        """The events: the permanent work that makes walls eligible for release."""
        from tui.days import EVENT_FIELDS
        self._edit_list("events", "Events: the permanent work that releases walls",
                        EVENT_FIELDS, {"day": self.day})

    def _edit_list(self, key: str, title: str, entries_fields, defaults: dict) -> None:
        from tui.days import ListDialog
        listed = list(self.site_file.data.get(key, []))

        def answer(entries: list[dict] | None) -> None:
            if entries is not None:
                self.apply(self.site_file.with_value((key,), entries), (key,))

        self.push_screen(ListDialog(title, entries_fields, listed,
                                    lambda entries: self._list_refused(key, entries),
                                    defaults), answer)

    def _list_refused(self, key: str, entries: list[dict]) -> str | None:
        """Why a new list of events or sign-offs cannot be recorded: the file's validation, or
        the engine's finding of a sign-off that would then come before its wall's lift or an
        event its release waits for (one not found before the change)."""
        try:
            changed = self.site_file.with_value((key,), entries)
        except SiteFileError as exc:
            return problems_text(exc)
        before = early_signoffs(compute(self.site_file) if self.busy else self.result)
        found = [m for m in early_signoffs(compute(changed)) if m not in before]
        return found[0] if found else None

    async def action_move_brace(self) -> None:
        """Focus the elevation of the wall on view: choose a brace and move it."""
        await self.action_show("wall")
        self.query_one(BraceElevation).focus(scroll_visible=True)

    def on_brace_elevation_brace_moved(self, event: BraceElevation.BraceMoved) -> None:
        i = panel_index(self.site_file, self.mark)
        p = self.result.panel(self.mark)
        if i is None or not p.braces:
            return
        listed = self.site_file.site.panels[i].bracing.positions or p.braces["positions_ft"]
        try:
            changed = moved_brace(self.site_file, i, listed, event.index, event.step_ft,
                                  self.units)
        except SiteFileError as exc:
            self.notify(f"Not moved: {problems_text(exc)}", severity="warning", markup=False)
            return
        self.apply(changed, ("panels", i, "bracing"),
                   gesture=("move", self.mark, event.index, event.gesture))
