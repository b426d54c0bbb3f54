"""tools/mutate.py finds the constants it should change and changes exactly those (no test run:
the mutation run itself is too slow for the suite; see DEVELOPERS.md)."""

from __future__ import annotations

import ast
from pathlib import Path

from tools.mutate import _apply, engine_modules, mutants_of


def test_only_physics_constants_are_mutated(tmp_path: Path) -> None:
    source = tmp_path / "sample.py"
    source.write_text(
        "X = 0.56  # a factor\n"
        "TOL = 1e-9\n"
        "def f(a, rows):\n"
        "    for _ in range(200):\n"
        "        a = round(a, 3) + rows[1] + 0 * a\n"
        "    return 2.3 * a ** -0.83  # ° · non-ASCII before: 2.3\n",
        encoding="utf-8")
    found = mutants_of("sample", 0.03, path=source)
    assert [(m.line, m.original) for m in found] == [(1, "0.56"), (6, "2.3"), (6, "0.83")]
    more = tmp_path / "more.py"
    more.write_text(
        "def g(rows, i):\n"
        "    label = f'term {i + 1}'\n"                        # text: left alone
        "    if len(rows) > 1 or 2 >= len(rows) or len(rows) == 3:\n"  # == 3 is mutated
        "        return 1.5\n"
        "def _first_guess(x):\n"
        "    return 0.5 * x\n",
        encoding="utf-8")
    assert [(m.line, m.original) for m in mutants_of("more", 0.03, path=more)] == [(3, "3"),
                                                                                     (4, "1.5")]
    changed = _apply(source.read_bytes(), found[1]).decode("utf-8")
    ast.parse(changed)
    assert changed.splitlines()[5].startswith(f"    return {2.3 * 1.03!r} * a ** -0.83  # ° ·")


def test_every_engine_module_but_numerics_and_display_is_covered() -> None:
    modules = engine_modules()
    assert {"tables", "kinds", "life", "viscosity", "derive", "ratings"} <= set(modules)
    assert not {"solve", "sensitivity", "record", "num", "explain", "curves"} & set(modules)
    # the internal analysis (Hertz, ISO/TS 16281) is physics too, named by its dotted path
    assert {"internal.hertz", "internal.distribution", "internal.reference_life"} <= set(modules)
    assert not {"__init__", "internal.__init__"} & set(modules)
    assert mutants_of("pairs", 0.03)  # a real module parses and yields its constants
    assert mutants_of("internal.hertz", 0.03)


def test_outcomes_round_trip_through_the_json_file(tmp_path: Path) -> None:
    """--resume and --survivors read back what --json wrote: the same mutants, compared equal."""
    from tools.mutate import Outcome, read_outcomes, write_outcomes

    found = mutants_of("pairs", 0.03)[:3]
    outcomes = [Outcome(m, killed, how, 1.25) for m, (killed, how) in
                zip(found, [(True, "failed"), (False, "survived"), (True, "timeout")])]
    path = tmp_path / "run.json"
    write_outcomes(path, outcomes)
    again = read_outcomes(path)
    assert again == outcomes
    assert {o.mutant for o in again if not o.killed} == {found[1]}


def test_only_the_test_files_that_import_a_module_run_for_it() -> None:
    """A mutant runs the engine test files that import its module, directly, through other engine
    modules (relative imports too) or through the tests' helper modules — and no others."""
    from tools.mutate import relevant_tests

    hertz = relevant_tests("internal.hertz")
    # test_internal_life reaches hertz through internal_examples → distribution → hertz
    assert {"tests/engine/test_internal_hertz.py", "tests/engine/test_internal_distribution.py",
            "tests/engine/test_internal_life.py"} <= set(hertz)
    assert "tests/engine/test_solve.py" not in hertz
    # derive is reached from the solver's tests, and from the internal analysis (life beside)
    assert {"tests/engine/test_solve.py", "tests/engine/test_internal_life.py"} <= set(
        relevant_tests("derive"))
    every = {name for module in engine_modules() for name in relevant_tests(module)}
    on_disk = {f"tests/engine/{p.name}" for p in Path("tests/engine").glob("test_*.py")}
    assert every == on_disk  # every engine test file guards some covered module


def test_known_equivalent_mutants_name_lines_that_exist() -> None:
    """Each listed equivalent mutant still matches a line of its module (else the list is stale)
    and is left out."""
    from tools.mutate import ENGINE, KNOWN_EQUIVALENT, module_path

    for (module, line), reason in KNOWN_EQUIVALENT.items():
        source = module_path(ENGINE, module).read_text(encoding="utf-8").splitlines()
        assert line in [text.strip() for text in source], (module, line)
        assert reason
        number = [text.strip() for text in source].index(line) + 1
        assert all(m.line != number for m in mutants_of(module, 0.03))
