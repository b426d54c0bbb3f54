"""What a person reads about a case typed in the form: a blank speed, aISO's missing inputs.

The texts go the way the form's go (``fields.inputs_from_texts``, then ``derive``), so a blank
field is tested as a blank field, not as the engine's default.
"""

from __future__ import annotations

import math

import pytest

from workbench.engine.derive import derive
from workbench.model.fields import inputs_from_texts

TYPED = {"kind": "deep-groove", "c": "33.5 kN", "c0": "21.2 kN", "fr": "3.6 kN", "fa": "0 N",
         "speed": "1480 r/min", "vg": "220", "temp": "70 °C", "dm": "65 mm",
         "cleanliness": "normal"}


def test_a_blank_speed_is_called_missing_not_zero() -> None:
    """A blank speed field: the hours steps and the warnings say there is no speed (blank),
    never "speed is 0", which reads as if 0 had been typed."""
    derivation = derive(inputs_from_texts({**TYPED, "speed": ""}))
    assert math.isnan(derivation.results["Lnm"])
    shown = [derivation.step("L10h").substituted, *derivation.warnings]
    assert all("speed is 0" not in line for line in shown)
    assert "no speed (n is blank or 0)" == derivation.step("L10h").substituted
    assert any(w.startswith("no speed (n is blank or 0): Lnm in hours is undefined")
               for w in derivation.warnings)


@pytest.mark.parametrize(("blank", "needs"), [
    ({"speed"}, "a speed above 0"),
    ({"dm"}, "the mean diameter dm"),
    ({"cleanliness"}, "the cleanliness or eC"),
    ({"vg"}, "the viscosity (ν, or ISO VG with the temperature)"),
    ({"speed", "cleanliness"}, "a speed above 0 and the cleanliness or eC"),
    ({"vg", "dm", "speed", "cleanliness"},
     "the viscosity (ν, or ISO VG with the temperature), the mean diameter dm, a speed above 0 "
     "and the cleanliness or eC"),
])
def test_aiso_says_what_it_needs_in_a_sentence(blank: set[str], needs: str) -> None:
    """aISO = 1 names every missing input in one sentence that reads right for each of them
    (it used to read "no a speed above 0")."""
    typed = {name: ("" if name in blank else text) for name, text in TYPED.items()}
    note = derive(inputs_from_texts(typed)).step("aISO").note
    assert note == f"aISO = 1: it needs {needs}"
