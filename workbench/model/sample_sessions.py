"""Generated sessions for measuring large documents: ``workbench bench`` and the tests.

:func:`shared_bearing_session` is the shape the large-session figures are taken on: many load
cases on one bearing (a duty spectrum typed case by case), every case with loads, speed,
lubrication and cleanliness, so each derivation runs every step.  Invented values.
"""

from __future__ import annotations

from .session import Bearing, LoadCase, Session

SHARED_BEARING = "position A"


def shared_bearing_session(cases: int) -> Session:
    """A session of ``cases`` load cases all on one deep-groove bearing, loads rising by case."""
    bearing = Bearing(SHARED_BEARING, {"kind": "deep-groove", "c": "33 kN", "c0": "19 kN",
                                       "f0": "14", "dm": "47.5 mm"})
    return Session(
        title=f"{cases} cases on one bearing",
        bearings=[bearing],
        cases=[LoadCase(f"case {number}", SHARED_BEARING, {
            "fr": f"{2 + 0.004 * number:.3f} kN", "fa": f"{0.4 + 0.001 * number:.3f} kN",
            "speed": "1450 rpm", "reliability": "0.95", "vg": "68", "temp": "70 °C",
            "cleanliness": "normal"}) for number in range(1, cases + 1)],
    )
