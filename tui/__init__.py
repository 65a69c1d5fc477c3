"""The terminal interface: views over the engine's result object (design.md §2).

It formats a `SiteResult` and edits a site file; every engineering value comes from the engine.
"""

import gc

# The interface collects no garbage while it starts: the imports, the site read and the first
# screen make many objects and few cycles, and the full collections among them cost about a
# tenth of a second. `tui.app.BracingApp` turns collection back on once its first screen is
# drawn, with what start made frozen (never scanned again, so that a collection during an
# edit or a view switch scans what came since: a few ms, not 70 to 100).
gc.disable()
