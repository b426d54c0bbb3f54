"""The one safety caution every report and the about screen carry, worded once."""

from __future__ import annotations

SAFETY_CAUTION = (
    "These results are estimates under the cited standards (ISO 281:2007 for dynamic rating and "
    "life, ISO 76:2006 for static rating and safety, with the viscosity and reliability methods "
    "named beside each step). Verify every rating and factor against the bearing maker's data, "
    "and defer to local codes and licensed engineering practice for anything safety-critical."
)
