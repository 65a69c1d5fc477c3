"""The site file saved (as), a day's schedule exported, and quitting with unsaved changes.

A mixin of `BracingApp`. Its dialogs load when first asked for (not waited for at start).
"""

from __future__ import annotations

from pathlib import Path
from typing import TYPE_CHECKING

from bracing import scenario
from tui.widgets import day_options

if TYPE_CHECKING:
    from tui.dialogs import ExportRequest


class Files:
    """Saving, exporting and quitting (a mixin of BracingApp)."""

    def action_save(self) -> None:
        if self.demo:
            self.action_save_as()
        elif self.save_to(None) and self.quit_after_save:
            self.exit(0)

    def action_save_as(self) -> None:
        default = "my-site.toml" if self.demo else str(self.site_file.path)
        forecast = scenario.inputs_of(self.site_file.path)[1:]  # never over the forecast
        from tui.dialogs import SaveAs
        self.push_screen(SaveAs(default, forecast), self._save_as_chosen)

    def _save_as_chosen(self, path: str | None) -> None:
        if path is None:
            self.quit_after_save = False
            return
        if self.save_to(Path(path)) and self.quit_after_save:
            self.exit(0)

    def save_to(self, path: Path | None) -> bool:
        """Save atomically (the old file kept as .bak); say so, or say why not. A failed save
        changes nothing: the file on disk stays whole and the edits stay unsaved here."""
        try:
            target = self.site_file.save(path)
        except Exception as exc:  # noqa: BLE001 - an edit must never be lost to a failed save
            self.notify(f"Not saved: {exc}", severity="error", timeout=10, markup=False)
            self.quit_after_save = False
            return False
        self.saved_text = self.site_file.text
        self.demo = False
        self.dirty = False
        self.file_name = self._file_label(self.site_file)
        self.notify(f"Saved {target}", markup=False)
        return True

    def action_export(self) -> None:
        if self.busy:
            self.notify("Wait for the recompute to finish, then export.", severity="warning")
            return
        days = day_options(self.result.days)
        stem = Path(self.site_file.path).stem
        from tui.dialogs import Export
        self.push_screen(Export(stem, days, self.day, Path(self.site_file.path).parent),
                         self.export)

    def export(self, request: ExportRequest | None) -> None:
        """Write the schedule the engine's report renders, atomically."""
        if request is None:
            return
        try:
            from bracing.report import schedule
        except ImportError:
            self.notify("The schedule export is not available in this version of the engine.",
                        severity="error", timeout=10)
            return
        try:
            scenario.check_output(request.path, scenario.inputs_of(self.site_file.path))
            text = schedule.render(self.site_file.site, self.result, request.day, request.fmt,
                                   self.units)
            scenario.atomic_write(Path(request.path), text)
        except (ValueError, OSError) as exc:  # WriteRefused says why (an input, a folder...)
            self.notify(f"Not exported: {exc}", severity="error", timeout=10, markup=False)
            return
        self.notify(f"Wrote {request.path}", markup=False)

    def action_quit(self) -> None:
        if not self.dirty:
            self.exit(0)
            return
        from tui.dialogs import UnsavedChanges
        self.push_screen(UnsavedChanges(), self._quit_answer)

    def _quit_answer(self, answer: str | None) -> None:
        if answer == "drop":
            self.exit(0)
        elif answer == "save":
            self.quit_after_save = True
            self.action_save()
