"""The catalog selection screen: the engine's ranking, the CLI's filters, the worker, adopting.

The screen is shown by itself (``screen_host``) with the evaluated cases the main screen gives
it; the last test goes through the main screen to adopt and undo.  Keyboard only.
"""

from __future__ import annotations

import threading

import pytest
from textual.widgets import Checkbox, DataTable, Input, Select

from screen_host import ScreenHost, column_texts, cut_widgets, painted, settled, tab_to, users
from tui_helpers import selected_result
from tui_sessions import rig_session

from workbench.engine.select import REASON_NO_AXIAL, Candidate, Filters, select
from workbench.model.catalog import catalog_bearing_texts, demo_catalog_path, load_catalog
from workbench.model.selection import catalog_as_position
from workbench.model.session import Session, evaluate_case
from workbench.tui import selection_screen
from workbench.tui.app import WorkbenchApp
from workbench.tui.selection_screen import Adoption, SelectionScreen

LIFE_TARGET_H = 20000.0  # the rig session's [targets] life


def host(session: Session | None = None, bearing: str = "Drive") -> ScreenHost:
    chosen = session or rig_session()
    held = chosen.bearing(bearing)
    return ScreenHost(lambda: SelectionScreen(bearing, users(chosen, bearing),
                                              bearing_texts=held.texts if held else None))


def ranked(filters: Filters = Filters()) -> list[Candidate]:
    """The engine's ranking of the demo catalog for the rig's Drive cases, best first."""
    session = rig_session()
    inputs = [evaluate_case(session, case).inputs for case in session.cases
              if case.bearing == "Drive"]
    return select(load_catalog(demo_catalog_path()), inputs, LIFE_TARGET_H, None,
                  filters).candidates


def expected(filters: Filters = Filters()) -> list[int]:
    """The catalog rows the engine ranks, best first."""
    return [candidate.index for candidate in ranked(filters)]


def first_candidate() -> Candidate:
    return ranked()[0]


async def ranked_then_tab_to(pilot, widget_id: str) -> tuple[SelectionScreen, DataTable]:
    """Once the first ranking is shown, tab to ``widget_id``; the screen and its list."""
    await settled(pilot)
    screen = pilot.app.screen
    await tab_to(pilot, widget_id)
    return screen, screen.query_one("#candidates", DataTable)


def row_indices(table: DataTable) -> list[int]:
    return [int(table.coordinate_to_cell_key((k, 0)).row_key.value) for k in range(table.row_count)]


@pytest.mark.parametrize("size", [(80, 24), (120, 40)])
async def test_opens_on_the_ranking_with_the_focus_in_it(size) -> None:
    app = host()
    async with app.run_test(size=size) as pilot:
        await settled(pilot)
        screen = app.screen
        assert isinstance(screen, SelectionScreen)
        table = screen.query_one("#candidates", DataTable)
        assert app.focused is table
        assert row_indices(table) == expected() and table.row_count > 0
        catalog = load_catalog(demo_catalog_path())
        assert column_texts(table, 0) == [catalog.designations[i] for i in expected()]
        headings = [column.label.plain for column in table.columns.values()]
        # the governing case is a column only where it fits; the detail line always names it
        assert ("Governing case" in headings) == (size[0] >= 120)
        governing = ("Steady run", "Peak torque")[first_candidate().governing_case]
        detail = str(screen.query_one("#candidate-detail").render())
        assert detail.startswith(catalog.designations[expected()[0]]) and f"(case {governing})" in detail
        assert cut_widgets(screen) == []


async def test_filters_narrow_the_ranking_as_typed() -> None:
    app = host()
    async with app.run_test(size=(80, 24)) as pilot:
        screen, table = await ranked_then_tab_to(pilot, "filter-bore-min")
        await pilot.press(*"40")
        await settled(pilot)
        assert row_indices(table) == expected(Filters(bore_min_mm=40.0))
        await tab_to(pilot, "filter-width-max")
        await pilot.press(*"0.8 in")  # a length with its unit: 20.32 mm
        await settled(pilot)
        assert row_indices(table) == expected(Filters(bore_min_mm=40.0, width_max_mm=20.32))
        catalog = load_catalog(demo_catalog_path())
        assert all(catalog.d_mm[i] >= 40 and catalog.B_mm[i] <= 20.32 for i in row_indices(table))
        await tab_to(pilot, "filter-kind")
        await pilot.press("enter", *"deep", "enter")  # open the list, type to search, take it
        await settled(pilot)
        assert screen.query_one("#filter-kind", Select).value == "deep-groove"
        wanted = Filters("deep-groove", bore_min_mm=40.0, width_max_mm=20.32)
        assert row_indices(table) == expected(wanted)
        assert {catalog.kinds[i] for i in row_indices(table)} <= {"deep-groove"}
        await pilot.press("down")  # the filters move on with ↓ as the case form's fields do
        assert app.focused is not None and app.focused.id == "filter-flanged"
        assert not screen.query_one("#filter-kind", Select).expanded


async def test_an_unreadable_limit_is_marked_and_the_last_readable_one_holds() -> None:
    app = host()
    async with app.run_test(size=(80, 24)) as pilot:
        await settled(pilot)
        screen = app.screen
        await tab_to(pilot, "filter-outer-max")
        await pilot.press(*"90")
        await settled(pilot)
        await pilot.press(*"x")  # "90x"
        await settled(pilot)
        box = screen.query_one("#filter-outer-max", Input)
        assert box.has_class("-invalid")
        message = screen.query_one("#filter-message")
        assert message.display and "Outer D up to" in str(message.render())
        assert row_indices(screen.query_one("#candidates", DataTable)) == \
            expected(Filters(outer_max_mm=90.0))
        await pilot.press("backspace")
        await settled(pilot)
        assert not box.has_class("-invalid") and not message.display


async def test_typing_goes_on_while_ranking_and_an_older_ranking_is_dropped(monkeypatch) -> None:
    release = threading.Event()
    calls: list[Filters] = []

    def slow_first(catalog, cases, life, s0, filters):
        calls.append(filters)
        if len(calls) == 2:  # the ranking for the first limit typed waits
            release.wait(timeout=30)
        return select(catalog, cases, life, s0, filters)

    monkeypatch.setattr(selection_screen, "select", slow_first)
    app = host()
    async with app.run_test(size=(80, 24)) as pilot:
        screen, table = await ranked_then_tab_to(pilot, "filter-bore-min")
        await pilot.press("4")  # bore ≥ 4 mm: its ranking hangs
        await pilot.pause()
        assert table.has_class("-busy")
        assert "Ranking" in str(screen.query_one("#selection-summary").render())
        await pilot.press("5")  # bore ≥ 45 mm, typed while the first ranking still runs
        await pilot.pause()
        assert screen.query_one("#filter-bore-min", Input).value == "45"
        release.set()
        await settled(pilot)
        assert [f.bore_min_mm for f in calls[1:]] == [4.0, 45.0]
        assert row_indices(table) == expected(Filters(bore_min_mm=45.0))
        assert not table.has_class("-busy")


async def test_a_kind_that_cannot_carry_the_axial_load_does_not_qualify_and_the_list_says_why() -> None:
    # both Drive cases have Fa > 0: a cylindrical roller bearing carries it only on flanges
    # (ISO 281:2007 §7.2 rates it on P = Fr), so it qualifies only once flanges are said to be there
    catalog = load_catalog(demo_catalog_path())
    app = host()
    async with app.run_test(size=(80, 24)) as pilot:
        await settled(pilot)
        screen = app.screen
        table = screen.query_one("#candidates", DataTable)
        assert row_indices(table) == expected()
        assert "cylindrical" not in {catalog.kinds[i] for i in row_indices(table)}
        assert f"{catalog.kinds.count('cylindrical')} {REASON_NO_AXIAL}" in \
            str(screen.query_one("#selection-summary").render())
        detail = str(screen.query_one("#candidate-detail").render())
        assert f"Not qualifying, {REASON_NO_AXIAL}: a cylindrical roller bearing" in detail
        await tab_to(pilot, "filter-flanged")
        await pilot.press("space")
        await settled(pilot)
        assert screen.query_one("#filter-flanged", Checkbox).value
        flanged = expected(Filters(flanged_cylindrical=True))
        assert row_indices(table) == flanged
        assert "cylindrical" in {catalog.kinds[i] for i in flanged}
        await tab_to(pilot, "candidates")
        await pilot.press(*["down"] * [catalog.kinds[i] for i in flanged].index("cylindrical"))
        detail = str(screen.query_one("#candidate-detail").render())
        # the largest Fa of the Drive cases, 1 kN, is left to the flanges and the maker's data
        assert "flanges carry Fa up to 1000 N" in detail and "maker's data" in detail
        assert REASON_NO_AXIAL not in str(screen.query_one("#selection-summary").render())
        assert cut_widgets(screen) == []


async def test_enter_adopts_the_highlighted_row() -> None:
    app = host()
    async with app.run_test(size=(80, 24)) as pilot:
        await settled(pilot)
        await tab_to(pilot, "filter-flanged")  # more candidates: cylindrical ones too
        await pilot.press("space")
        await settled(pilot)
        await tab_to(pilot, "candidates")
        await pilot.press("down", "enter")
        await pilot.pause()
        catalog = load_catalog(demo_catalog_path())
        index = expected(Filters(flanged_cylindrical=True))[1]
        assert app.answers == [Adoption(catalog.designations[index],
                                        catalog_bearing_texts(catalog, index),
                                        f"{catalog.source}, row {catalog.rows[index]}")]
        assert not isinstance(app.screen, SelectionScreen)


async def test_escape_closes_once() -> None:
    app = host()
    async with app.run_test(size=(80, 24)) as pilot:
        await settled(pilot)
        await pilot.press("escape", "escape")
        await pilot.pause()
        assert app.answers == [None] and app.screen.query_one("#host")


async def test_a_catalog_path_that_cannot_be_read_is_reported(tmp_path) -> None:
    app = host()
    async with app.run_test(size=(80, 24)) as pilot:
        await settled(pilot)
        screen = app.screen
        await tab_to(pilot, "catalog-path")
        await pilot.press("end", "ctrl+u", *str(tmp_path / "missing.csv"), "enter")
        await settled(pilot)
        assert screen.catalog is None
        assert "✘" in str(screen.query_one("#selection-summary").render())
        assert "no such file" in str(screen.query_one("#selection-summary").render())
        assert screen.query_one("#candidates", DataTable).row_count == 0
        assert app.focused is screen.query_one("#candidates")


async def test_no_life_target_is_reported() -> None:
    session = rig_session()
    session.targets.life = ""
    app = host(session)
    async with app.run_test(size=(80, 24)) as pilot:
        await settled(pilot)
        assert "no life target" in str(app.screen.query_one("#selection-summary").render())


async def test_adopting_through_the_main_screen_sets_c_and_undo_restores_it(make_app) -> None:
    app: WorkbenchApp = make_app()
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        await pilot.press("alt+c")
        await settled(pilot)
        assert isinstance(app.screen, SelectionScreen)
        await pilot.press("enter")  # adopt the highlighted (first) row
        await pilot.pause()
        assert not isinstance(app.screen, SelectionScreen)
        catalog = load_catalog(demo_catalog_path())
        first = expected()[0]
        c_catalog = float(catalog.c_n[first])
        result = selected_result(app)
        assert result is not None and result.derivation is not None
        assert result.inputs.c == pytest.approx(c_catalog)
        # ISO 281:2007 §7.1 closed form: L10 = (C/P)^p, p = 10/3 for a roller bearing, 3 for a ball
        p = 3.0 if catalog.kind[first] in ("deep-groove", "angular-contact", "self-aligning") \
            else 10 / 3
        assert result.derivation.results["L10"] == pytest.approx(
            (c_catalog / result.derivation.results["P"]) ** p)
        await pilot.press("ctrl+z")
        await pilot.pause()
        assert app.document.session.bearing("Drive").texts["c"] == "30 kN"


PAIR_ROW = "WB-AC40 02-40"  # demo catalog: angular-contact, single, 40°, C 26.02 kN, C0 16.62 kN


def pair_session() -> Session:
    """The newcomer's position: an angular-contact back-to-back pair, one case."""
    from workbench.model.session import Bearing, LoadCase, Targets

    return Session(
        title="Pair position", engineer="test",
        targets=Targets(life="20000 h", reliability="0.90", s0="1"),
        bearings=[Bearing("DE angular pair", {
            "kind": "angular-contact", "arrangement": "back-to-back", "contact_angle": "40 deg",
            "c": "24 kN", "c0": "20 kN"})],
        cases=[LoadCase("Running", "DE angular pair",
                        {"fr": "3 kN", "fa": "1 kN", "speed": "1000 r/min"})],
    )


async def adopt_row(pilot, app: WorkbenchApp, designation: str) -> list[str]:
    """alt+c, move the list's cursor to ``designation`` with the arrow keys, enter; the
    notices shown."""
    shown: list[str] = []
    notify = app.notify

    def recorded(message: str, **options: object) -> None:
        shown.append(message)
        notify(message, **options)  # type: ignore[arg-type]

    app.notify = recorded  # type: ignore[method-assign]
    await pilot.pause()
    await pilot.press("alt+c")
    await settled(pilot)
    screen = app.screen
    assert isinstance(screen, SelectionScreen)
    table = screen.query_one("#candidates", DataTable)
    names = column_texts(table, 0)
    await pilot.press(*["down"] * names.index(designation))
    detail = str(screen.query_one("#candidate-detail").render())
    shown.append(detail)
    await pilot.press("enter")
    await pilot.pause()
    assert not isinstance(app.screen, SelectionScreen)
    return shown


async def test_adopting_a_single_row_into_a_pair_keeps_the_pair_and_says_how_it_was_rated() -> None:
    """ISO 281:2007 §5.1: the pair of two single-row bearings rates C = 2^0.7·C of one; ISO
    76:2006 §5.1: C0 = 2·C0. Table 3, 40° pair (REFERENCE §2, from memory): Fa/Fr = 1/3 ≤ e =
    1.14, X = 1, Y = 0.55, so P = 3 kN + 0.55 × 1 kN = 3550 N; L10 = (C/P)³."""
    app = WorkbenchApp(pair_session(), offer_recovery=False, autosave_delay=None)
    async with app.run_test(size=(80, 24)) as pilot:
        detail, notice = await adopt_row(pilot, app, PAIR_ROW)
        assert f"{PAIR_ROW}: angular-contact ball bearing, rated as a back-to-back pair of two" \
            in detail
        assert notice.startswith(f"Bearing DE angular pair now has the data of {PAIR_ROW}; "
                                 "rated and adopted as a back-to-back pair of two: "
                                 "C = 2^0.7 × 26.02 kN = 42.27 kN, C0 = 2 × 16.62 kN = 33.24 kN")
        bearing = app.document.session.bearing("DE angular pair")
        assert bearing.texts["arrangement"] == "back-to-back"
        assert "as a back-to-back pair of two" in bearing.source
        result = selected_result(app)
        assert result is not None and result.derivation is not None
        assert result.inputs.c == pytest.approx(26.02e3 * 2 ** 0.7, rel=1e-11)
        assert result.inputs.c0 == pytest.approx(2 * 16.62e3, rel=1e-11)
        results = result.derivation.results
        assert results["P"] == pytest.approx(3550.0)
        assert results["L10"] == pytest.approx((26.02e3 * 2 ** 0.7 / 3550.0) ** 3)
        await pilot.press("ctrl+z")
        await pilot.pause()
        texts = app.document.session.bearing("DE angular pair").texts
        assert (texts["arrangement"], texts["c"], texts["c0"]) == ("back-to-back", "24 kN", "20 kN")


async def test_the_ranking_of_a_pair_position_is_the_pairs_life() -> None:
    """The life margin listed for a single-row row is the pair's: L10h = 10⁶·(2^0.7·C/P)³/(60·n)
    with P = 3550 N (the closed forms above), no lubrication given (aISO = 1, a1 = 1 at 90 %)."""
    session = pair_session()
    app = ScreenHost(lambda: SelectionScreen("DE angular pair", users(session, "DE angular pair")))
    async with app.run_test(size=(80, 24)) as pilot:
        await settled(pilot)
        screen = app.screen
        table = screen.query_one("#candidates", DataTable)
        row = column_texts(table, 0).index(PAIR_ROW)
        margin = float(column_texts(table, 3)[row])
        hours = 1e6 * (26.02e3 * 2 ** 0.7 / 3550.0) ** 3 / (60 * 1000.0)
        assert margin == pytest.approx(hours / 20000.0, rel=5e-3)  # the list shows 4 figures


async def test_a_row_that_makes_no_such_pair_says_the_arrangement_is_now_single() -> None:
    app = WorkbenchApp(pair_session(), offer_recovery=False, autosave_delay=None)
    catalog = load_catalog(demo_catalog_path())
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        session = app.document.session
        ranked_rows = select(catalog_as_position(catalog, [r.inputs for r in users(
            session, "DE angular pair")]), [r.inputs for r in users(session, "DE angular pair")],
            20000.0).candidates
        deep = next(catalog.designations[c.index] for c in ranked_rows
                    if catalog.kinds[c.index] == "deep-groove")
        _, notice = await adopt_row(pilot, app, deep)
        assert notice.startswith(
            f"Bearing DE angular pair now has the data of {deep}; arrangement back-to-back → "
            "single: a deep-groove ball bearing does not come as a back-to-back pair")
        assert app.document.session.bearing("DE angular pair").texts["arrangement"] == "single"


async def test_the_help_line_and_the_steps_say_a_pairs_ratings_are_the_whole_pairs() -> None:
    """ISO 281:2007 §5.1, ISO 76:2006 §5.1: a pair's C and C0 as typed are the whole pair's;
    the C field's help line and the derivation's L10 and s0 steps say so, with the relation."""
    app = WorkbenchApp(pair_session(), offer_recovery=False, autosave_delay=None)
    async with app.run_test(size=(80, 24)) as pilot:
        await pilot.pause()
        screen = app.workbench_screen
        line = screen.query_one("#help-line")
        for name, words in (("c", "2^0.7 × one bearing's C"), ("c0", "2 × one bearing's C0")):
            screen.query_one(f"#field-{name}").focus()
            await pilot.pause()
            said = " ".join(" ".join(painted(app.screen, line.content_region)).split())
            assert "of the whole set for a pair or tandem" in said and words in said
        result = selected_result(app)
        notes = {step.key: step.note for step in app.document.with_steps(0).derivation.steps}
        assert result is not None
        assert "C is the whole back-to-back pair's rating: 2^0.7 × one bearing's C" in notes["L10"]
        assert "C0 is the whole back-to-back pair's rating: 2 × one bearing's C0" in notes["s0"]
