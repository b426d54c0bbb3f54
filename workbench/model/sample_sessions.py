"""Generated sessions for measuring large documents: ``workbench bench`` and the tests.

:func:`shared_bearing_session` is the shape the large-session figures are taken on: many load
cases on one bearing (a duty spectrum typed case by case), every case with loads, speed,
lubrication and cleanliness, so each derivation runs every step; the last few cases sit on
bearings of their own, so an edit to the shared bearing reaches all but those.  Invented values.
"""

from __future__ import annotations

from .session import Bearing, LoadCase, Session

SHARED_BEARING = "position A"
OTHER_BEARINGS = ("position B", "position C")
SHARED_SPEED_RPM = 1450.0


def shared_fr_kn(number: int) -> float:
    """The radial load of case ``number`` (from 1), in kN: rising by 4 N a case."""
    return round(2 + 0.004 * number, 3)


def shared_bearing_session(cases: int, *, pure_radial: bool = False) -> Session:
    """A session of ``cases`` load cases: all but the last ``len(OTHER_BEARINGS)`` on one
    deep-groove bearing, loads rising by case; those on a cylindrical roller bearing each
    (with fewer cases than that, all on the shared bearing).

    ``pure_radial``: the shared cases carry no axial load and no lubrication data, so each
    one's life is ISO 281's closed form (P = Fr, L10 = (C/P)³, Lnm = L10h at 90 %), for tests.
    """
    shared = Bearing(SHARED_BEARING, {"kind": "deep-groove", "c": "33 kN", "c0": "19 kN",
                                      "f0": "14", "dm": "47.5 mm"})
    others = [Bearing(name, {"kind": "cylindrical", "c": f"{60 + 10 * number} kN",
                             "c0": f"{55 + 10 * number} kN"})
              for number, name in enumerate(OTHER_BEARINGS)]
    if cases <= len(others):
        others = []  # a session this small keeps every case on the shared bearing
    shared_cases = cases - len(others)
    made = []
    for number in range(1, shared_cases + 1):
        texts = {"fr": f"{shared_fr_kn(number):.3f} kN", "speed": f"{SHARED_SPEED_RPM:g} r/min"}
        if not pure_radial:
            texts.update({"fa": f"{0.4 + 0.001 * number:.3f} kN", "reliability": "0.95",
                          "vg": "68", "temp": "70 °C", "cleanliness": "normal"})
        made.append(LoadCase(f"case {number}", SHARED_BEARING, texts))
    made += [LoadCase(f"{bearing.name} run", bearing.name,
                      {"fr": "8 kN", "speed": "900 r/min", "vg": "46", "temp": "60 °C"})
             for bearing in others]
    return Session(title=f"{cases} cases on one bearing", bearings=[shared, *others],
                   cases=made)
