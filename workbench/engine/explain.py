"""The words of the derivation's longer steps, built from the engine's own tables and coefficients.

A table look-up shows the two rows that bracket the index and the interpolation with its numbers
(ISO 281:2007 Table 3 note: linear interpolation between rows), or says in words that the index
lies outside the table and the end row was taken; aISO shows its relation with the coefficients
of the κ piece used (ISO 281:2007 §9.3.2); the operating viscosity shows the ASTM D341 constants.
Nothing here computes a result: the numbers shown are the ones the engine used.
"""

from __future__ import annotations

from bisect import bisect_right
from typing import NamedTuple, Sequence

from .life import AISO_CAP, aiso_coefficients, kappa_piece


class Words(NamedTuple):
    """The formula, template, numbers and note of one step."""

    formula: str
    template: str
    args: tuple[float, ...]
    note: str | None


def bracketing_rows(index: float, xp: Sequence[float]) -> tuple[int, int]:
    """The rows (i, i + 1) of ``xp`` that bracket ``index``; (0, 0) below the table and
    (n − 1, n − 1) above it (the end row is taken, never extrapolated)."""
    if index <= xp[0]:
        return 0, 0
    if index >= xp[-1]:
        last = len(xp) - 1
        return last, last
    i = bisect_right(xp, index) - 1
    return i, i + 1


def table_lookup(symbol: str, index_name: str, index: float, xp: Sequence[float],
                 column: Sequence[float], table: str) -> Words:
    """``symbol`` read from ``column`` of ``table`` at ``index_name`` = ``index``: the bracketing
    rows and the linear interpolation between them, or the end row with the clamp in words."""
    i, j = bracketing_rows(index, xp)
    if i == j:
        edge = "first" if i == 0 else "last"
        side = "below" if i == 0 else "above"
        return Words(
            f"{table}, {edge} row", "{0}", (column[i],),
            f"{index_name} = {index:.4g} lies {side} the table ({xp[0]:g} … {xp[-1]:g}): "
            f"{symbol} taken at its {edge} row {index_name} = {xp[i]:g}, not extrapolated")
    return Words(
        f"{table}, linear between rows {index_name} = {xp[i]:g} and {xp[j]:g}",
        "{0} + ({1} − {2}) / ({3} − {2}) × ({4} − {0})",
        (column[i], index, xp[i], xp[j], column[j]),
        f"rows: {index_name} = {xp[i]:g} → {symbol} = {column[i]:g}; "
        f"{index_name} = {xp[j]:g} → {symbol} = {column[j]:g}")


_PIECES = ("0.1 ≤ κ < 0.4", "0.4 ≤ κ < 1", "1 ≤ κ ≤ 4")


def aiso_words(kappa: float, load_ratio: float, roller: bool, divisor: float, value: float) -> Words:
    """aISO's relation (ISO 281:2007 §9.3.2) with the coefficients of the κ piece used."""
    c1, c2s, ks, outer, load_power, final = aiso_coefficients(roller)
    piece = int(kappa_piece(kappa))
    c2, k = c2s[piece], ks[piece]
    outer_text = "" if outer == 1.0 else f"^{outer:g}"
    power_text = "1/3" if abs(load_power - 1.0 / 3.0) < 1e-12 else f"{load_power:g}"
    ratio = "eC·Cu/P" if divisor == 1.0 else f"eC·Cu/({divisor:g}·P)"
    final_text = f"{final:g}".replace("-", "−")
    formula = (f"0.1·[1 − ({c1:g} − {c2:g}/κ^{k:g}){outer_text}·({ratio})^({power_text})]"
               f"^({final_text})")
    template = (f"0.1 × [1 − ({c1:g} − {c2:g} / {{0}}^{k:g}){outer_text} × {{1}}^({power_text})]"
                f"^({final_text})")
    family = "roller" if roller else "ball"
    note = f"{family} relation, piece {_PIECES[piece]}"
    if value >= AISO_CAP:
        note += f"; the relation gives more than {AISO_CAP:g} here: aISO is capped at {AISO_CAP:g}"
    return Words(formula, template, (kappa, load_ratio), note)
