"""Standard tables for basic load ratings from internal geometry (ISO 281:2007 and ISO 76:2006).

Each table carries its own source and provenance.  The digits come from the project's reference
sheet (``/work/shared/REFERENCE.md`` §6), which tags them:

* ``handbook`` — seen in a published handbook (named in the source text);
* ``memory`` — recalled without the standard at hand; the tests that touch these are marked
  ``from memory``.

Clause and table numbers of ISO 281:2007 and ISO 76:2006 are given from memory as well; where a
licensed copy of a standard disagrees, the standard wins.

Not tabulated here (so the engine refuses them rather than guess): the thrust-ball fc columns for
α = 45°, 60° and 75°, the thrust-roller fc column for α ≠ 90°, the double-row deep-groove and the
self-aligning-ball fc columns of ISO 281, and the ISO 76 f0 columns for angular-contact,
self-aligning and thrust ball bearings.
"""

from __future__ import annotations

from dataclasses import dataclass


@dataclass(frozen=True, slots=True)
class RatingTable:
    """A factor tabulated against a geometry ratio; read by linear interpolation between rows.

    Linear interpolation is the standards' own instruction for intermediate values (ISO 281:2007,
    notes to the fc tables; ISO 76:2006, note to the f0 table — from memory).
    """

    name: str
    symbol: str
    argument: str
    xs: tuple[float, ...]
    ys: tuple[float, ...]
    source: str
    provenance: str

    @property
    def lowest(self) -> float:
        """The smallest tabulated argument."""
        return self.xs[0]

    @property
    def highest(self) -> float:
        """The largest tabulated argument."""
        return self.xs[-1]


# ISO 281:2007 §5.1.1, Table 2, first column: single-row deep-groove ball bearings and single- and
# double-row angular-contact ball bearings.  Provenance: REFERENCE.md §6 [memory].
FC_RADIAL_BALL = RatingTable(
    name="fc, radial ball (single-row deep groove, angular contact)",
    symbol="fc",
    argument="Dw·cos α/Dpw",
    xs=(0.01, 0.02, 0.03, 0.04, 0.05, 0.06, 0.07, 0.08, 0.09, 0.10, 0.12, 0.14, 0.16, 0.18,
        0.20, 0.22, 0.24, 0.26, 0.28, 0.30, 0.32, 0.34, 0.36, 0.38, 0.40),
    ys=(29.1, 35.8, 40.3, 43.8, 46.7, 49.1, 51.1, 52.8, 54.3, 55.5, 57.5, 58.8, 59.6, 59.9,
        59.9, 59.6, 59.0, 58.2, 57.1, 56.0, 54.6, 53.2, 51.7, 50.0, 48.4),
    source="ISO 281:2007 §5.1.1, Table 2",
    provenance="memory",
)

# ISO 281:2007 §7.1.1, Table 6: radial roller bearings.  Provenance: REFERENCE.md §6 [memory].
FC_RADIAL_ROLLER = RatingTable(
    name="fc, radial roller",
    symbol="fc",
    argument="Dwe·cos α/Dpw",
    xs=(0.01, 0.02, 0.03, 0.04, 0.05, 0.06, 0.07, 0.08, 0.09, 0.10, 0.12, 0.14, 0.16, 0.18,
        0.20, 0.22, 0.24, 0.26, 0.28, 0.30),
    ys=(52.1, 60.8, 66.5, 70.7, 74.1, 76.9, 79.2, 81.2, 82.8, 84.2, 86.4, 87.7, 88.5, 88.8,
        88.7, 88.2, 87.5, 86.4, 85.2, 83.8),
    source="ISO 281:2007 §7.1.1, Table 6",
    provenance="memory",
)

# ISO 281:2007 §6.1.1, Table 4, column α = 90° (argument Dw/Dpw).  Provenance: REFERENCE.md §6,
# Machinery's Handbook 31st ed., Table 29 [handbook].  Only the 90° column is carried: the 45°, 60°
# and 75° columns are not known reliably here.
FC_THRUST_BALL_90 = RatingTable(
    name="fc, thrust ball, α = 90°",
    symbol="fc",
    argument="Dw/Dpw",
    xs=(0.01, 0.02, 0.03, 0.04, 0.05, 0.06, 0.07, 0.08, 0.09, 0.10, 0.12, 0.14, 0.16, 0.18, 0.20),
    ys=(36.7, 45.2, 51.1, 55.7, 59.5, 62.9, 65.8, 68.5, 71.0, 73.3, 77.4, 81.1, 84.4, 87.4, 90.2),
    source="ISO 281:2007 §6.1.1, Table 4 (α = 90°)",
    provenance="handbook",
)

# ISO 281:2007 §8.1.1, Table 8, column α = 90° (argument Dwe/Dpw).  Provenance: from memory — not
# in REFERENCE.md.  The digits follow fc ∝ (Dwe/Dpw)^(2/9) to the last place, the α = 90° form of
# the Lundberg–Palmgren expression (ISO/TR 1281-1), which the tests use as a cross-check.
FC_THRUST_ROLLER_90 = RatingTable(
    name="fc, thrust roller, α = 90°",
    symbol="fc",
    argument="Dwe/Dpw",
    xs=(0.01, 0.02, 0.03, 0.04, 0.05, 0.06, 0.07, 0.08, 0.09, 0.10, 0.12, 0.14, 0.16, 0.18,
        0.20, 0.22, 0.24, 0.26, 0.28, 0.30),
    ys=(105.4, 122.9, 134.5, 143.4, 150.7, 156.9, 162.4, 167.2, 171.7, 175.7, 183.0, 189.4,
        195.1, 200.3, 205.0, 209.4, 213.5, 217.3, 220.9, 224.3),
    source="ISO 281:2007 §8.1.1, Table 8 (α = 90°; from memory)",
    provenance="memory",
)

# ISO 76:2006 §5.1, Table 1, deep-groove column.  Provenance: REFERENCE.md §6 [memory].  The
# standard steps the argument by 0.01; the reference sheet keeps every second row, so values
# between rows (notably the peak near 0.09–0.10) are linear interpolations of this coarser table.
F0_DEEP_GROOVE = RatingTable(
    name="f0, deep-groove ball",
    symbol="f0",
    argument="Dw·cos α/Dpw",
    xs=(0.00, 0.02, 0.04, 0.06, 0.08, 0.10, 0.12, 0.14, 0.16, 0.18, 0.20, 0.22, 0.24, 0.26,
        0.28, 0.30, 0.32, 0.34, 0.36, 0.38, 0.40),
    ys=(14.7, 15.1, 15.5, 15.9, 16.3, 16.4, 15.9, 15.4, 14.9, 14.4, 14.0, 13.5, 13.0, 12.5,
        12.1, 11.6, 11.2, 10.7, 10.3, 9.8, 9.4),
    source="ISO 76:2006 §5.1, Table 1 (deep groove)",
    provenance="memory",
)

# ISO 281:2007 Table 1: bm, the rating factor for contemporary material and manufacturing quality,
# by bearing kind.  Provenance: REFERENCE.md §6 (deep groove, angular contact 1.3; cylindrical,
# tapered 1.1; spherical 1.15) [memory]; thrust ball 1.3 and thrust cylindrical roller 1.0 from memory.
BM_SOURCE = "ISO 281:2007 Table 1"
BM_BY_KIND: dict[str, float] = {
    "deep-groove": 1.3,
    "angular-contact": 1.3,
    "cylindrical": 1.1,
    "tapered": 1.1,
    "spherical": 1.15,
    "thrust-ball": 1.3,
    "thrust-roller": 1.0,
}

# ISO 281:2007 §5.1.1: the ball formula switches exponent at Dw = 25.4 mm; 3.647 ≈ 25.4^0.4 makes
# the two branches meet there.  Provenance: REFERENCE.md §6 [handbook: Machinery's Handbook 31st ed.].
BALL_DIAMETER_SWITCH_MM = 25.4
LARGE_BALL_FACTOR = 3.647

# ISO 76:2006 §5.1–§8.1: the static-rating clauses; §6.1 and §8.1 carry the constants of the
# roller static ratings, 44 (radial) and 220 (thrust), in N/mm².  Provenance: REFERENCE.md §6 [memory].
STATIC_RADIAL_ROLLER_FACTOR = 44.0
STATIC_THRUST_ROLLER_FACTOR = 220.0
STATIC_RADIAL_BALL_SOURCE = "ISO 76:2006 §5.1"
STATIC_RADIAL_ROLLER_SOURCE = "ISO 76:2006 §6.1"
STATIC_THRUST_BALL_SOURCE = "ISO 76:2006 §7.1"
STATIC_THRUST_ROLLER_SOURCE = "ISO 76:2006 §8.1"
