"""What a person reads about a case typed in the form: a blank speed, aISO's missing inputs.

The texts go the way the form's go (``fields.inputs_from_texts``, then ``derive``), so a blank
field is tested as a blank field, not as the engine's default.
"""

from __future__ import annotations

import math

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
