"""The terminal interface: views over the engine's result object (design.md §2).

It formats a `SiteResult` and edits a site file; every engineering value comes from the engine.
"""
