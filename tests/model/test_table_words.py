"""Shaft and duty-cycle keys in a person's words (model.table_words), and state names."""

from __future__ import annotations

import pytest

from workbench.model.shafts import new_state_name, state_words
from workbench.model.table_words import TableWords, error_in_words, session_error_in_words

WORDS = TableWords("shaft", {"bearing_a": "Bearing at A", "position_b": "Position of B"},
                   {"states": ("Operating state", {"power": "Power"}),
                    "elements": ("Gear or pulley", {"helix_angle": "Helix angle"})})
TABLE = {"name": "Mill shaft", "states": [{"name": "full load"}, {"name": ""}],
         "elements": [{"name": "pinion"}]}


@pytest.mark.parametrize(("error", "said"), [
    ("shafts[1].states[1].power: xx: a unit with no number",
     "Shaft 'Mill shaft', operating state 1 'full load', Power: xx: a unit with no number"),
    ("shafts[1].states[2].power: give the power", "Shaft 'Mill shaft', operating state 2, Power: "
                                                  "give the power"),
    ("shafts[1].elements[1].helix_angle: below 45°",
     "Shaft 'Mill shaft', gear or pulley 1 'pinion', Helix angle: below 45°"),
    ("shafts[1].position_b: after A", "Shaft 'Mill shaft', Position of B: after A"),
    ("shafts[1].A: no bearing", "Shaft 'Mill shaft', Bearing at A: no bearing"),
    ("shafts[1].case_fields.temp: too cold",
     "Shaft 'Mill shaft', case inputs, Operating temperature: too cold"),
    ("bearings[2].c: a value is needed", "Bearing 'Idler', Dynamic rating C: a value is needed"),
    ("no key here: as it is", "no key here: as it is"),
])
def test_keys_are_said_with_names_and_labels(error: str, said: str) -> None:
    assert error_in_words(error, TABLE, WORDS, bearings=["Drive", "Idler"]) == said


def test_a_session_error_is_said_with_the_table_its_key_names() -> None:
    """shafts[2] is the second shaft table; a duty cycle's key takes the duty-cycle words."""
    duty_words = TableWords("duty cycle", {"basis": "Shares of"},
                            {"states": ("State", {"share": "Share"})})
    tables = {"shafts": [{"name": "First"}, TABLE],
              "duty_cycles": [{"name": "Week", "states": [{"case": "Peak"}]}]}
    words = {"shafts": WORDS, "duty_cycles": duty_words}
    said = session_error_in_words("shafts[2].position_b: after A", tables, words)
    assert said == "Shaft 'Mill shaft', Position of B: after A"
    said = session_error_in_words("duty_cycles[1].states[1].share: negative", tables, words)
    assert said == "Duty cycle 'Week', state 1 'Peak', Share: negative"
    assert session_error_in_words("shafts[3].name: x", tables, words) == "shafts[3].name: x"


def test_state_words_never_double_the_word_state() -> None:
    assert state_words("full load") == "state full load"
    assert state_words("state 4") == "state 4"
    assert state_words("Start-up state") == "Start-up state"


def test_a_new_state_is_numbered_after_the_others_and_unique() -> None:
    assert new_state_name([]) == "state 1"
    assert new_state_name([{"name": "full load"}, {"name": "part load"}]) == "state 3"
    assert new_state_name([{"name": "state 2"}]) == "state 3"  # 2 is taken: the next one
