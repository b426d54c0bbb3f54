"""The html report's figures, drawn by matplotlib as inline SVG text.

matplotlib is imported only when a figure is drawn (the screen and the other formats never load
it), and only its object interface is used (``Figure``, no ``pyplot``): no global figure state,
so a figure can be drawn from the screen's worker thread. Every figure reads in monochrome: lines
differ by style and marker, bars by hatching, never by colour alone. User text on a figure
(case and state names) is passed as literal text, never as mathtext.

The SVG is made fit to sit inside an html page several times over: no XML prolog, no metadata,
no namespace URLs (html5 needs none inline), and every id prefixed so two figures never share one.
"""

from __future__ import annotations

import io
import math
import re
from typing import Any, Sequence

from ..engine.curves import Curve

FIGURE_SIZE = (6.4, 3.0)  # inches: about the width of an A4 text column
LABEL_LIMIT = 28  # characters of a name shown on an axis
_RC = {
    "svg.fonttype": "none",  # text stays text: smaller, selectable, in the page's own font
    "svg.hashsalt": "bearing-workbench",  # the same figure gives the same SVG on every run
    "font.size": 8.5,
    "axes.linewidth": 0.8,
    "hatch.linewidth": 0.6,
}
_PROLOG = re.compile(r"^.*?(?=<svg)", re.DOTALL)
_METADATA = re.compile(r"<metadata>.*?</metadata>\s*", re.DOTALL)
_NAMESPACE = re.compile(r'\s+xmlns(:\w+)?="[^"]*"')
_ID_REFERENCE = re.compile(r'(\bid="|url\(#|href="#)')


def _literal(text: str) -> str:
    """A name as matplotlib shows it literally: ``$`` would start mathtext; long names clipped."""
    one_line = " ".join(text.split())
    if len(one_line) > LABEL_LIMIT:
        one_line = one_line[: LABEL_LIMIT - 1] + "…"
    return one_line.replace("$", r"\$")


def _figure(bottom: float = 0.16) -> tuple[Any, Any]:
    """A figure with one axes in fixed margins (a layout engine would draw everything twice)."""
    from matplotlib.figure import Figure

    figure = Figure(figsize=FIGURE_SIZE)
    figure.subplots_adjust(left=0.11, right=0.98, bottom=bottom, top=0.96)
    return figure, figure.add_subplot()


_SUPERSCRIPTS = str.maketrans("-0123456789", "⁻⁰¹²³⁴⁵⁶⁷⁸⁹")


def _plain(value: float, _position: int) -> str:
    """A tick as 0.5, 20, 1000, or 10⁵ for a decade beyond four digits."""
    exponent = round(math.log10(value)) if value > 0 else 0
    if abs(exponent) > 3 and math.isclose(value, 10.0 ** exponent):
        return "10" + str(exponent).translate(_SUPERSCRIPTS)
    return f"{value:g}"


def _plain_minor(value: float, _position: int) -> str:
    """Minor ticks of a log axis labelled at 2 and 5 of each decade."""
    mantissa = value / 10.0 ** math.floor(math.log10(value))
    return f"{value:g}" if any(math.isclose(mantissa, m) for m in (2.0, 5.0)) else ""


def _log_axes(axes: Any) -> None:
    """Log ticks as plain numbers (1000, 0.5), not as mathtext powers, which cost most of the
    drawing time; the x axis spans about a decade, so its 2 and 5 are labelled too."""
    from matplotlib.ticker import FuncFormatter, NullFormatter

    axes.xaxis.set_major_formatter(FuncFormatter(_plain))
    axes.xaxis.set_minor_formatter(FuncFormatter(_plain_minor))
    axes.yaxis.set_major_formatter(FuncFormatter(_plain))
    axes.yaxis.set_minor_formatter(NullFormatter())


def _svg(figure: Any, prefix: str) -> str:
    """The figure as an SVG element for inline use, its ids starting with ``prefix``."""
    import matplotlib

    buffer = io.StringIO()
    with matplotlib.rc_context(_RC):
        figure.savefig(buffer, format="svg", metadata={"Date": None, "Creator": None,
                                                        "Format": None, "Type": None})
    text = _METADATA.sub("", _PROLOG.sub("", buffer.getvalue(), count=1))
    text = _NAMESPACE.sub("", text)
    return _ID_REFERENCE.sub(lambda match: match.group(1) + prefix, text)


def _style(axes: Any, curve: Curve) -> None:
    _log_axes(axes)
    axes.set_xlabel(curve.x_label)
    axes.set_ylabel(curve.y_label)
    axes.grid(True, which="both", color="0.85", linewidth=0.5)


def _operating_point(axes: Any, curve: Curve, label: str) -> None:
    if curve.point is not None:
        axes.plot(*curve.point, linestyle="none", marker="o", markersize=6, markerfacecolor="white",
                  markeredgecolor="black", markeredgewidth=1.2, label=label)


def life_svg(curve: Curve, prefix: str) -> str:
    """Lnm against the load scale on log–log axes, the case itself marked (ISO 281:2007 §9.1),
    the Fa/Fr e switch as dashed verticals and the life target as a dotted level."""
    figure, axes = _figure()
    axes.loglog(curve.x, curve.y, color="black", linewidth=1.4, label="Lnm")
    for number, (_, x) in enumerate(curve.marks):
        axes.axvline(x, color="black", linestyle="--", linewidth=0.9,
                     label="e switch (Fa/Fr = e)" if number == 0 else None)
    for label, y in curve.levels:
        axes.axhline(y, color="0.35", linestyle=":", linewidth=1.2, label=label)
    _operating_point(axes, curve, "this case (scale 1)")
    _style(axes, curve)
    axes.legend(loc="upper right", frameon=False)
    return _svg(figure, prefix)


def aiso_svg(curve: Curve, prefix: str) -> str:
    """aISO against κ on log–log axes at the case's eC·Cu/P (ISO 281:2007 §9.3.2), the case
    marked."""
    figure, axes = _figure()
    axes.loglog(curve.x, curve.y, color="black", linewidth=1.4, label="aISO")
    axes.axvline(1.0, color="0.35", linestyle=":", linewidth=1.0, label="κ = 1")
    _operating_point(axes, curve, "this case")
    _style(axes, curve)
    axes.legend(loc="lower right", frameon=False)
    return _svg(figure, prefix)


def _bars(axes: Any, names: Sequence[str], series: Sequence[tuple[str, Sequence[float], dict]],
          ) -> None:
    """Grouped bars, one group per name, one bar per series (its label, values and style)."""
    width = 0.8 / len(series)
    for index, (label, values, style) in enumerate(series):
        offsets = [i + (index - (len(series) - 1) / 2) * width for i in range(len(names))]
        axes.bar(offsets, values, width, label=label, edgecolor="black", linewidth=0.7, **style)
    slanted = _slanted(names)
    axes.set_xticks(range(len(names)), [_literal(name) for name in names],
                    rotation=20 if slanted else 0, ha="right" if slanted else "center")
    axes.grid(True, axis="y", color="0.85", linewidth=0.5)
    axes.set_axisbelow(True)
    axes.legend(frameon=False)


def _slanted(names: Sequence[str]) -> bool:
    """Names under bars are slanted when they would not fit side by side."""
    return sum(len(_literal(name)) + 2 for name in names) > 60


def _bar_bottom(names: Sequence[str]) -> float:
    """Room under the bars for their names."""
    return 0.36 if _slanted(names) else 0.12


def shares_svg(names: Sequence[str], time_shares: Sequence[float],
               damage_shares: Sequence[float], prefix: str) -> str:
    """Each state's share of the time and of the damage (Palmgren–Miner), in %."""
    figure, axes = _figure(bottom=_bar_bottom(names))
    _bars(axes, names, (
        ("time share", [100.0 * s for s in time_shares], {"color": "white", "hatch": "///"}),
        ("damage share", [100.0 * s for s in damage_shares], {"color": "0.35"}),
    ))
    axes.set_ylabel("share (%)")
    return _svg(figure, prefix)


def shaft_loads_svg(states: Sequence[str], loads: dict[str, Sequence[float]], prefix: str) -> str:
    """The bearing loads of a shaft in each state, in kN: one bar per load (``Fr A``, ``Fa A``,
    …), told apart by fill and hatching."""
    styles = ({"color": "black"}, {"color": "white", "hatch": "///"},
              {"color": "0.6"}, {"color": "white", "hatch": "..."})
    figure, axes = _figure(bottom=_bar_bottom(states))
    _bars(axes, states, tuple((label, [value / 1000.0 for value in values], style)
                              for (label, values), style in zip(loads.items(), styles)))
    axes.set_ylabel("load (kN)")
    return _svg(figure, prefix)
