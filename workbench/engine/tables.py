"""Every standard table the load and life calculation reads, each with its source beside it.

Provenance tags follow the project's reference notes: ``handbook`` (seen in a published handbook),
``from memory`` (recalled without the document at hand; the closed-form and continuity tests do not
depend on these digits), ``common practice`` (a trade rule of thumb).  Where a licensed copy of the
standard disagrees, the standard wins.
"""

from __future__ import annotations

# --- ISO 281:2007 Table 3, single-row radial deep-groove ball bearings -------------------------
# Index f0·Fa/C0r; e; Y for Fa/Fr > e (X = 0.56). Handbook: Rules of Thumb for Mechanical
# Engineers, Table 7a (inch form Fa/(i·Z·Dw²) converts exactly to this column).
DEEP_GROOVE_INDEX_F0: tuple[float, ...] = (0.172, 0.345, 0.689, 1.03, 1.38, 2.07, 3.45, 5.17, 6.89)
DEEP_GROOVE_E: tuple[float, ...] = (0.19, 0.22, 0.26, 0.28, 0.30, 0.34, 0.38, 0.42, 0.44)
DEEP_GROOVE_Y: tuple[float, ...] = (2.30, 1.99, 1.71, 1.55, 1.45, 1.31, 1.15, 1.04, 1.00)
DEEP_GROOVE_X = 0.56
# The same block's printed Fa/C0r column, read when f0 is not known (handbook, partly; rest from
# memory).  It is the f0·Fa/C0r column divided by f0 ≈ 12.3 and rounded as printed; the workbench
# reads this column as printed rather than dividing by 12.3, so a table point gives its printed e, Y.
DEEP_GROOVE_INDEX_PLAIN: tuple[float, ...] = (0.014, 0.028, 0.056, 0.084, 0.11, 0.17, 0.28, 0.42, 0.56)

# --- ISO 281:2007 Table 3, single-row angular-contact ball, 15° contact angle (from memory) ----
# Index i·f0·Fa/C0r; e; Y for Fa/Fr > e with X = 0.44 (single row and tandem).
ANGULAR_15_INDEX: tuple[float, ...] = (0.178, 0.357, 0.714, 1.07, 1.43, 2.14, 3.57, 5.35, 7.14)
ANGULAR_15_E: tuple[float, ...] = (0.38, 0.40, 0.43, 0.46, 0.47, 0.50, 0.55, 0.56, 0.56)
ANGULAR_15_Y: tuple[float, ...] = (1.47, 1.40, 1.30, 1.23, 1.19, 1.12, 1.02, 1.00, 1.00)
ANGULAR_15_X = 0.44
# The printed i·Fa/C0r column of the same block, read when f0 is not known (from memory; maker
# data print the same digits): the i·f0·Fa/C0r column over f0 ≈ 12.3, rounded as printed.
ANGULAR_15_INDEX_PLAIN: tuple[float, ...] = (0.015, 0.029, 0.058, 0.087, 0.12, 0.17, 0.29, 0.44, 0.58)
# 15° pairs (back-to-back, face-to-face), from memory — treat with care: ≤ e X = 1, Y = 1.65…1.12;
# > e X = 0.72, Y = 2.39…1.63, on the same index.
ANGULAR_15_PAIR_Y_LOW: tuple[float, ...] = (1.65, 1.57, 1.46, 1.38, 1.34, 1.26, 1.14, 1.12, 1.12)
ANGULAR_15_PAIR_Y_HIGH: tuple[float, ...] = (2.39, 2.28, 2.11, 2.00, 1.93, 1.82, 1.66, 1.63, 1.63)
ANGULAR_15_PAIR_X_HIGH = 0.72

# --- ISO 281:2007 Table 3, angular-contact ball at fixed contact angles (from memory; 40° row
# handbook).  α → (e, single X, single Y, pair ≤e X, pair ≤e Y, pair >e X, pair >e Y).
ANGULAR_FIXED: dict[int, tuple[float, float, float, float, float, float, float]] = {
    20: (0.57, 0.43, 1.00, 1.0, 1.09, 0.70, 1.63),
    25: (0.68, 0.41, 0.87, 1.0, 0.92, 0.67, 1.41),
    30: (0.80, 0.39, 0.76, 1.0, 0.78, 0.63, 1.24),
    35: (0.95, 0.37, 0.66, 1.0, 0.66, 0.60, 1.07),
    40: (1.14, 0.35, 0.57, 1.0, 0.55, 0.57, 0.93),
    45: (1.34, 0.33, 0.50, 1.0, 0.47, 0.54, 0.81),
}
ANGULAR_ANGLES: tuple[int, ...] = (15, *ANGULAR_FIXED)

# --- ISO 281:2007 Table 3, single-direction thrust ball bearings with α < 90° (from memory) ------
# e = 1.25·tan α; Fa/Fr > e only: X by contact angle, Y = 1.
THRUST_BALL_X: dict[int, float] = {45: 0.66, 50: 0.73, 55: 0.81, 60: 0.92, 65: 1.06, 70: 1.28,
                                   75: 1.66, 80: 2.25, 85: 4.49}

# --- ISO 76:2006 static factors (from memory; deep-groove form consistent with maker data) -----
DEEP_GROOVE_X0, DEEP_GROOVE_Y0 = 0.6, 0.5
ANGULAR_Y0_SINGLE: dict[int, float] = {15: 0.46, 20: 0.42, 25: 0.38, 30: 0.33, 35: 0.29,
                                       40: 0.26, 45: 0.22}
ANGULAR_X0_SINGLE = 0.5

# --- ISO 281:2007 Table 12, life modification factor for reliability a1 (from memory) ---------
# The closed form a1 = 0.95·(ln(100/R)/ln(100/90))^(2/3) + 0.05 reproduces every digit.
A1_TABLE: tuple[tuple[float, float], ...] = (
    (90, 1.0), (95, 0.64), (96, 0.55), (97, 0.47), (98, 0.37), (99, 0.25), (99.2, 0.22),
    (99.4, 0.19), (99.6, 0.16), (99.8, 0.12), (99.9, 0.093), (99.92, 0.087), (99.94, 0.080),
    (99.95, 0.077),
)
RELIABILITY_MIN, RELIABILITY_MAX = 0.90, 0.9995

# --- Three-parameter Weibull for ball bearings (handbook: machine-design texts) --------------
WEIBULL_X0, WEIBULL_THETA, WEIBULL_B = 0.02, 4.459, 1.483

# --- ISO 281:2007 §9.3 contamination factor eC (from memory) ---------------------------------
# level → ((low, high) for dpw < 100 mm, (low, high) for dpw ≥ 100 mm).  The workbench takes the
# midpoint of the range and says so; a number may be given instead.
CONTAMINATION_LEVELS: dict[str, tuple[tuple[float, float], tuple[float, float]]] = {
    "extreme": ((1.0, 1.0), (1.0, 1.0)),
    "high": ((0.6, 0.8), (0.8, 0.9)),
    "normal": ((0.5, 0.6), (0.6, 0.8)),
    "slight": ((0.3, 0.5), (0.4, 0.6)),
    "typical": ((0.1, 0.3), (0.2, 0.4)),
    "severe": ((0.0, 0.1), (0.0, 0.1)),
    "very-severe": ((0.0, 0.0), (0.0, 0.0)),
}
CONTAMINATION_WORDS: dict[str, str] = {
    "extreme": "extreme cleanliness",
    "high": "high cleanliness",
    "normal": "normal cleanliness",
    "slight": "slight contamination",
    "typical": "typical contamination",
    "severe": "severe contamination",
    "very-severe": "very severe contamination",
}

# --- Static safety minimums s0 (common practice; roller bearings somewhat higher) -------------
# duty → (ball, roller, description)
STATIC_SAFETY_MINIMUMS: dict[str, tuple[float, float, str]] = {
    "quiet": (2.0, 3.0, "quiet, smooth running where low noise matters"),
    "normal": (1.0, 1.5, "normal running"),
    "shock": (1.5, 3.0, "rough running, vibration or shock loads"),
}

# --- Application factor hints (common practice) ----------------------------------------------
APPLICATION_FACTOR_HINT = (
    "about 1.0–1.1 smooth running, 1.1–1.3 commercial gearing, 1.2–1.5 moderate shock, "
    "1.5–3 heavy impact (common practice)"
)

# --- Rotation factor V (common practice: older practice, ISO 281:1962 and the rating standards of
# that time; ISO 281:2007 no longer carries it) ------------------------------------------------
# V = 1.2 multiplies Fr of a radial bearing whose outer ring rotates relative to the load
# (P = X·V·Fr + Y·Fa; P = V·Fr for a cylindrical roller bearing); the older tables kept V = 1 for
# self-aligning ball bearings (from memory), and thrust bearings have no V.
ROTATION_FACTOR_OUTER_RING = 1.2

# --- Axial load a ribbed cylindrical roller bearing takes alongside Fr (common practice) ------
CYLINDRICAL_AXIAL_RATIO_LIMIT = 0.4
