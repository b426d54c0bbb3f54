"""Sessions built in code for the screen tests (an invented scenario: a test-rig gearbox)."""

from __future__ import annotations

from workbench.model.session import Bearing, LoadCase, Session, SolverSetup, Targets

DRIVE_BEARING = {"kind": "deep-groove", "c": "30 kN", "c0": "16 kN", "dm": "45 mm"}
IDLER_BEARING = {"kind": "angular-contact", "arrangement": "single", "c": "42 kN",
                 "c0": "28 kN", "contact_angle": "40 deg", "dm": "60 mm"}


def rig_session(cases: int = 3) -> Session:
    """A small session: two bearings, ``cases`` load cases, life and s0 targets."""
    base = [
        LoadCase("Steady run", "Drive", {"fr": "3 kN", "fa": "1 kN", "speed": "1500 rpm",
                                         "vg": "68", "temp": "60 degC", "cleanliness": "normal"}),
        LoadCase("Peak torque", "Drive", {"fr": "6.5 kN", "fa": "0.4 kN", "speed": "600 rpm"}),
        LoadCase("Idler end", "Idler", {"fr": "2 kN", "fa": "2.5 kN", "speed": "900 rpm"}),
    ]
    made = list(base[:cases])
    index = len(made)
    while len(made) < cases:
        index += 1
        made.append(LoadCase(f"Sweep {index}", "Drive",
                             {"fr": f"{2 + 0.25 * index:g} kN", "fa": "0.8 kN",
                              "speed": "1200 rpm"}))
    return Session(
        title="Test-rig gearbox",
        engineer="test",
        targets=Targets(life="20000 h", reliability="0.90", s0="2"),
        bearings=[Bearing("Drive", dict(DRIVE_BEARING)), Bearing("Idler", dict(IDLER_BEARING))],
        cases=made,
        solver=SolverSetup(unknown="c", target="Lnm=20000 h", case="Steady run"),
    )
