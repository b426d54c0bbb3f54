"""Lubricant viscosity: ISO 3448 grades, ASTM D341 viscosity–temperature, ASTM D2270 VI.

Pure floats in mm²/s and °C.  Sources:

* ISO 3448 (industrial liquid lubricants — ISO viscosity classification): each grade ISO VG n is
  the midpoint kinematic viscosity at 40 °C, with limits ±10 % of the midpoint.  The four
  smallest grades have midpoints 2.2, 3.2, 4.6 and 6.8 mm²/s (not 2, 3, 5, 7).
* ASTM D341 (viscosity–temperature charts for liquid petroleum products), the Walther form
  log10(log10(ν + 0.7)) = A − B·log10(T/K), fitted through two points.  The standard adds small
  correction terms below about 2 mm²/s; they are not applied here.
* ASTM D2270 (calculating viscosity index from kinematic viscosity at 40 °C and 100 °C), its
  Table 1 of L and H for ν100 = 2 … 70 mm²/s (linear interpolation between rows, as the standard
  says) and its formulas for L and H above 70 mm²/s.
"""

from __future__ import annotations

from functools import lru_cache

import math

from workbench.engine.num import NumT, all_true, interp, isfinite, log10, power
from workbench.engine.record import InputError

ISO_3448 = "ISO 3448 (ISO viscosity classification)"
ASTM_D341 = "ASTM D341 (Walther equation)"
ASTM_D2270 = "ASTM D2270 (viscosity index)"

# ISO 3448: grade → midpoint kinematic viscosity at 40 °C, mm²/s.  Keyed by number, so a typed
# grade (68.0) finds its row.
ISO_VG_MIDPOINTS: dict[float, float] = {
    2: 2.2, 3: 3.2, 5: 4.6, 7: 6.8, 10: 10.0, 15: 15.0, 22: 22.0, 32: 32.0, 46: 46.0,
    68: 68.0, 100: 100.0, 150: 150.0, 220: 220.0, 320: 320.0, 460: 460.0, 680: 680.0,
    1000: 1000.0, 1500: 1500.0,
}
ISO_VG_TOLERANCE = 0.10  # ISO 3448: limits are ±10 % of the midpoint

WALTHER_SHIFT = 0.7  # ASTM D341: Z = ν + 0.7 (mm²/s)
KELVIN_OFFSET = 273.15
ABSOLUTE_ZERO_C = -KELVIN_OFFSET

# ASTM D2270 Table 1: basic values of L and H (mm²/s at 40 °C) against ν100 (mm²/s).
# Transcribed from the standard's table as reproduced in open lubricant-data code (the libvisc
# C++ library and the fluidpower.pro viscosity-chart script, whose two copies agree row for row).
# Rows: (ν100, L, H).  Steps: 0.1 up to 20, 0.2 up to 30, 0.5 up to 70 mm²/s.
D2270_TABLE: tuple[tuple[float, float, float], ...] = (
    (2.0, 7.994, 6.394), (2.1, 8.640, 6.894), (2.2, 9.309, 7.410), (2.3, 10.00, 7.944),
    (2.4, 10.71, 8.496), (2.5, 11.45, 9.063), (2.6, 12.21, 9.647), (2.7, 13.00, 10.25),
    (2.8, 13.80, 10.87), (2.9, 14.63, 11.50), (3.0, 15.49, 12.15), (3.1, 16.36, 12.82),
    (3.2, 17.26, 13.51), (3.3, 18.18, 14.21), (3.4, 19.12, 14.93), (3.5, 20.09, 15.66),
    (3.6, 21.08, 16.42), (3.7, 22.09, 17.19), (3.8, 23.13, 17.97), (3.9, 24.19, 18.77),
    (4.0, 25.32, 19.56), (4.1, 26.50, 20.37), (4.2, 27.75, 21.21), (4.3, 29.07, 22.05),
    (4.4, 30.48, 22.92), (4.5, 31.96, 23.81), (4.6, 33.52, 24.71), (4.7, 35.13, 25.63),
    (4.8, 36.79, 26.57), (4.9, 38.50, 27.53), (5.0, 40.23, 28.49), (5.1, 41.99, 29.46),
    (5.2, 43.76, 30.43), (5.3, 45.53, 31.40), (5.4, 47.31, 32.37), (5.5, 49.09, 33.34),
    (5.6, 50.87, 34.32), (5.7, 52.64, 35.29), (5.8, 54.42, 36.26), (5.9, 56.20, 37.23),
    (6.0, 57.97, 38.19), (6.1, 59.74, 39.17), (6.2, 61.52, 40.15), (6.3, 63.32, 41.13),
    (6.4, 65.18, 42.14), (6.5, 67.12, 43.18), (6.6, 69.16, 44.24), (6.7, 71.29, 45.33),
    (6.8, 73.48, 46.44), (6.9, 75.72, 47.51), (7.0, 78.00, 48.57), (7.1, 80.25, 49.61),
    (7.2, 82.39, 50.69), (7.3, 84.53, 51.78), (7.4, 86.66, 52.88), (7.5, 88.85, 53.98),
    (7.6, 91.04, 55.09), (7.7, 93.20, 56.20), (7.8, 95.43, 57.31), (7.9, 97.72, 58.45),
    (8.0, 100.0, 59.60), (8.1, 102.3, 60.74), (8.2, 104.6, 61.89), (8.3, 106.9, 63.05),
    (8.4, 109.2, 64.18), (8.5, 111.5, 65.32), (8.6, 113.9, 66.48), (8.7, 116.2, 67.64),
    (8.8, 118.5, 68.79), (8.9, 120.9, 69.94), (9.0, 123.3, 71.10), (9.1, 125.7, 72.27),
    (9.2, 128.0, 73.42), (9.3, 130.4, 74.57), (9.4, 132.8, 75.73), (9.5, 135.3, 76.91),
    (9.6, 137.7, 78.08), (9.7, 140.1, 79.27), (9.8, 142.7, 80.46), (9.9, 145.2, 81.67),
    (10.0, 147.7, 82.87), (10.1, 150.3, 84.08), (10.2, 152.9, 85.30), (10.3, 155.4, 86.51),
    (10.4, 158.0, 87.72), (10.5, 160.6, 88.95), (10.6, 163.2, 90.19), (10.7, 165.8, 91.40),
    (10.8, 168.5, 92.65), (10.9, 171.2, 93.92), (11.0, 173.9, 95.19), (11.1, 176.6, 96.45),
    (11.2, 179.4, 97.71), (11.3, 182.1, 98.97), (11.4, 184.9, 100.2), (11.5, 187.6, 101.5),
    (11.6, 190.4, 102.8), (11.7, 193.3, 104.1), (11.8, 196.2, 105.4), (11.9, 199.0, 106.7),
    (12.0, 201.9, 108.0), (12.1, 204.8, 109.4), (12.2, 207.8, 110.7), (12.3, 210.7, 112.0),
    (12.4, 213.6, 113.3), (12.5, 216.6, 114.7), (12.6, 219.6, 116.0), (12.7, 222.6, 117.4),
    (12.8, 225.7, 118.7), (12.9, 228.8, 120.1), (13.0, 231.9, 121.5), (13.1, 235.0, 122.9),
    (13.2, 238.1, 124.2), (13.3, 241.2, 125.6), (13.4, 244.3, 127.0), (13.5, 247.4, 128.4),
    (13.6, 250.6, 129.8), (13.7, 253.8, 131.2), (13.8, 257.0, 132.6), (13.9, 260.1, 134.0),
    (14.0, 263.3, 135.4), (14.1, 266.6, 136.8), (14.2, 269.8, 138.2), (14.3, 273.0, 139.6),
    (14.4, 276.3, 141.0), (14.5, 279.6, 142.4), (14.6, 283.0, 143.9), (14.7, 286.4, 145.3),
    (14.8, 289.7, 146.8), (14.9, 293.0, 148.2), (15.0, 296.5, 149.7), (15.1, 300.0, 151.2),
    (15.2, 303.4, 152.6), (15.3, 306.9, 154.1), (15.4, 310.3, 155.6), (15.5, 313.9, 157.0),
    (15.6, 317.5, 158.6), (15.7, 321.1, 160.1), (15.8, 324.6, 161.6), (15.9, 328.3, 163.1),
    (16.0, 331.9, 164.6), (16.1, 335.5, 166.1), (16.2, 339.2, 167.7), (16.3, 342.9, 169.2),
    (16.4, 346.6, 170.7), (16.5, 350.3, 172.3), (16.6, 354.1, 173.8), (16.7, 358.0, 175.4),
    (16.8, 361.7, 177.0), (16.9, 365.6, 178.6), (17.0, 369.4, 180.2), (17.1, 373.3, 181.7),
    (17.2, 377.1, 183.3), (17.3, 381.0, 184.9), (17.4, 384.9, 186.5), (17.5, 388.9, 188.1),
    (17.6, 392.7, 189.7), (17.7, 396.7, 191.3), (17.8, 400.7, 192.9), (17.9, 404.6, 194.6),
    (18.0, 408.6, 196.2), (18.1, 412.6, 197.8), (18.2, 416.7, 199.4), (18.3, 420.7, 201.0),
    (18.4, 424.9, 202.6), (18.5, 429.0, 204.3), (18.6, 433.2, 205.9), (18.7, 437.3, 207.6),
    (18.8, 441.5, 209.3), (18.9, 445.7, 211.0), (19.0, 449.9, 212.7), (19.1, 454.2, 214.4),
    (19.2, 458.4, 216.1), (19.3, 462.7, 217.7), (19.4, 467.0, 219.4), (19.5, 471.3, 221.1),
    (19.6, 475.7, 222.8), (19.7, 479.7, 224.5), (19.8, 483.9, 226.2), (19.9, 488.6, 227.7),
    (20.0, 493.2, 229.5), (20.2, 501.5, 233.0), (20.4, 510.8, 236.4), (20.6, 519.9, 240.1),
    (20.8, 528.8, 243.5), (21.0, 538.4, 247.1), (21.2, 547.5, 250.7), (21.4, 556.7, 254.2),
    (21.6, 566.4, 257.8), (21.8, 575.6, 261.5), (22.0, 585.2, 264.9), (22.2, 595.0, 268.6),
    (22.4, 604.3, 272.3), (22.6, 614.2, 275.8), (22.8, 624.1, 279.6), (23.0, 633.6, 283.3),
    (23.2, 643.4, 286.8), (23.4, 653.8, 290.5), (23.6, 663.3, 294.4), (23.8, 673.7, 297.9),
    (24.0, 683.9, 301.8), (24.2, 694.5, 305.6), (24.4, 704.2, 309.4), (24.6, 714.9, 313.0),
    (24.8, 725.7, 317.0), (25.0, 736.5, 320.9), (25.2, 747.2, 324.9), (25.4, 758.2, 328.8),
    (25.6, 769.3, 332.7), (25.8, 779.7, 336.7), (26.0, 790.4, 340.5), (26.2, 801.6, 344.4),
    (26.4, 812.8, 348.4), (26.6, 824.1, 352.3), (26.8, 835.5, 356.4), (27.0, 847.0, 360.5),
    (27.2, 857.5, 364.6), (27.4, 869.0, 368.3), (27.6, 880.6, 372.3), (27.8, 892.3, 376.4),
    (28.0, 904.1, 380.6), (28.2, 915.8, 384.6), (28.4, 927.6, 388.8), (28.6, 938.6, 393.0),
    (28.8, 951.2, 396.6), (29.0, 963.4, 401.1), (29.2, 975.4, 405.3), (29.4, 987.1, 409.5),
    (29.6, 998.9, 413.5), (29.8, 1011.0, 417.6), (30.0, 1023.0, 421.7), (30.5, 1055.0, 432.4),
    (31.0, 1086.0, 443.2), (31.5, 1119.0, 454.0), (32.0, 1151.0, 464.9), (32.5, 1184.0, 475.9),
    (33.0, 1217.0, 487.0), (33.5, 1251.0, 498.1), (34.0, 1286.0, 509.6), (34.5, 1321.0, 521.1),
    (35.0, 1356.0, 532.5), (35.5, 1391.0, 544.0), (36.0, 1427.0, 555.6), (36.5, 1464.0, 567.1),
    (37.0, 1501.0, 579.3), (37.5, 1538.0, 591.3), (38.0, 1575.0, 603.1), (38.5, 1613.0, 615.0),
    (39.0, 1651.0, 627.1), (39.5, 1691.0, 639.2), (40.0, 1730.0, 651.8), (40.5, 1770.0, 664.2),
    (41.0, 1810.0, 676.6), (41.5, 1851.0, 689.1), (42.0, 1892.0, 701.9), (42.5, 1935.0, 714.9),
    (43.0, 1978.0, 728.2), (43.5, 2021.0, 741.3), (44.0, 2064.0, 754.4), (44.5, 2108.0, 767.6),
    (45.0, 2152.0, 780.9), (45.5, 2197.0, 794.5), (46.0, 2243.0, 808.2), (46.5, 2288.0, 821.9),
    (47.0, 2333.0, 835.5), (47.5, 2380.0, 849.2), (48.0, 2426.0, 863.0), (48.5, 2473.0, 876.9),
    (49.0, 2521.0, 890.9), (49.5, 2570.0, 905.3), (50.0, 2618.0, 919.6), (50.5, 2667.0, 933.6),
    (51.0, 2717.0, 948.2), (51.5, 2767.0, 962.9), (52.0, 2817.0, 977.5), (52.5, 2867.0, 992.1),
    (53.0, 2918.0, 1007.0), (53.5, 2969.0, 1021.0), (54.0, 3020.0, 1036.0), (54.5, 3073.0, 1051.0),
    (55.0, 3126.0, 1066.0), (55.5, 3180.0, 1082.0), (56.0, 3233.0, 1097.0), (56.5, 3286.0, 1112.0),
    (57.0, 3340.0, 1127.0), (57.5, 3396.0, 1143.0), (58.0, 3452.0, 1159.0), (58.5, 3507.0, 1175.0),
    (59.0, 3563.0, 1190.0), (59.5, 3619.0, 1206.0), (60.0, 3676.0, 1222.0), (60.5, 3734.0, 1238.0),
    (61.0, 3792.0, 1254.0), (61.5, 3850.0, 1270.0), (62.0, 3908.0, 1286.0), (62.5, 3966.0, 1303.0),
    (63.0, 4026.0, 1319.0), (63.5, 4087.0, 1336.0), (64.0, 4147.0, 1352.0), (64.5, 4207.0, 1369.0),
    (65.0, 4268.0, 1386.0), (65.5, 4329.0, 1402.0), (66.0, 4392.0, 1419.0), (66.5, 4455.0, 1436.0),
    (67.0, 4517.0, 1454.0), (67.5, 4580.0, 1471.0), (68.0, 4645.0, 1488.0), (68.5, 4709.0, 1506.0),
    (69.0, 4773.0, 1523.0), (69.5, 4839.0, 1541.0), (70.0, 4905.0, 1558.0),
)
_TABLE_NU100 = tuple(row[0] for row in D2270_TABLE)
_TABLE_L = tuple(row[1] for row in D2270_TABLE)
_TABLE_H = tuple(row[2] for row in D2270_TABLE)
D2270_MIN_NU100 = _TABLE_NU100[0]  # VI is not defined below 2 mm²/s at 100 °C
D2270_TABLE_MAX_NU100 = _TABLE_NU100[-1]
D2270_HIGH_VI_DIVISOR = 0.00715  # ASTM D2270, VI above 100: VI = (10^N − 1)/0.00715 + 100


def _finite_positive(name: str, value: float, what: str) -> None:
    if not math.isfinite(value) or value <= 0.0:
        raise InputError(name, f"{what} must be a positive finite number of mm²/s, got {value!r}")


# ---- ISO 3448 -------------------------------------------------------------------------------
def iso_vg_grades() -> tuple[float, ...]:
    """The ISO 3448 viscosity grades, ISO VG 2 … ISO VG 1500, in ascending order."""
    return tuple(ISO_VG_MIDPOINTS)


def nu40_of_grade(vg: float) -> float:
    """Midpoint kinematic viscosity at 40 °C (mm²/s) of grade ISO VG ``vg`` (ISO 3448)."""
    try:
        return ISO_VG_MIDPOINTS[vg]
    except (KeyError, TypeError):
        grades = ", ".join(str(g) for g in ISO_VG_MIDPOINTS)
        raise InputError("vg", f"ISO VG {vg} is not an ISO 3448 grade ({grades})") from None


def nu40_limits_of_grade(vg: float) -> tuple[float, float]:
    """(minimum, maximum) kinematic viscosity at 40 °C (mm²/s) of ISO VG ``vg``: midpoint ±10 %
    (ISO 3448)."""
    midpoint = nu40_of_grade(vg)
    return midpoint * (1.0 - ISO_VG_TOLERANCE), midpoint * (1.0 + ISO_VG_TOLERANCE)


# ---- ASTM D341 ------------------------------------------------------------------------------
def _walther(nu: float) -> float:
    """log10(log10(ν + 0.7)), the ASTM D341 ordinate."""
    return math.log10(math.log10(nu + WALTHER_SHIFT))


def walther_constants(nu40: float, nu100: float) -> tuple[float, float]:
    """(A, B) of log10(log10(ν + 0.7)) = A − B·log10(T/K) through (40 °C, ν40) and (100 °C, ν100)
    (ASTM D341)."""
    _finite_positive("nu40", nu40, "ν40")
    _finite_positive("nu100", nu100, "ν100")
    if nu100 + WALTHER_SHIFT <= 1.0:
        raise InputError("nu100", f"ν100 = {nu100} mm²/s: ASTM D341 needs more than 0.3 mm²/s")
    if nu100 >= nu40:
        raise InputError("nu100", f"ν100 = {nu100} mm²/s must be less than ν40 = {nu40} mm²/s")
    log_t40 = math.log10(40.0 + KELVIN_OFFSET)
    log_t100 = math.log10(100.0 + KELVIN_OFFSET)
    b = (_walther(nu40) - _walther(nu100)) / (log_t100 - log_t40)
    a = _walther(nu40) + b * log_t40
    return a, b


_TOO_COLD = "too cold for the ASTM D341 line: the viscosity overflows"


def viscosity_at_temperature(nu40: float, nu100: float, temp_c: NumT) -> NumT:
    """Kinematic viscosity (mm²/s) at ``temp_c`` (°C, float or array) of an oil with ν40 and ν100,
    by the ASTM D341 Walther line through the two points: ν = 10^(10^(A − B·log10 T)) − 0.7."""
    a, b = walther_constants(nu40, nu100)
    if not all_true(isfinite(temp_c) & (temp_c > ABSOLUTE_ZERO_C)):
        raise InputError("temp", "a temperature must be finite and above −273.15 °C")
    nu = power(10.0, power(10.0, a - b * log10(temp_c + KELVIN_OFFSET))) - WALTHER_SHIFT
    if not all_true(isfinite(nu)):
        raise InputError("temp", _TOO_COLD)
    return nu


# ---- ASTM D2270 -----------------------------------------------------------------------------
def d2270_l_and_h(nu100: float) -> tuple[float, float]:
    """(L, H): ν40 (mm²/s) of the VI 0 and VI 100 reference oils with the same ν100 (ASTM D2270):
    Table 1 interpolated linearly for 2 ≤ ν100 ≤ 70, and L = 0.8353Y² + 14.67Y − 216,
    H = 0.1684Y² + 11.85Y − 97 (Y = ν100) above 70 mm²/s."""
    _finite_positive("nu100", nu100, "ν100")
    if nu100 < D2270_MIN_NU100:
        raise InputError("nu100", f"ν100 = {nu100} mm²/s: ASTM D2270 defines VI from 2 mm²/s up")
    if nu100 <= D2270_TABLE_MAX_NU100:
        return interp(nu100, _TABLE_NU100, _TABLE_L), interp(nu100, _TABLE_NU100, _TABLE_H)
    y = nu100
    return 0.8353 * y * y + 14.67 * y - 216.0, 0.1684 * y * y + 11.85 * y - 97.0


def viscosity_index(nu40: float, nu100: float) -> float:
    """Viscosity index from ν40 and ν100 (mm²/s), unrounded (ASTM D2270): VI = 100·(L − U)/(L − H)
    when U ≥ H, else VI = (10^N − 1)/0.00715 + 100 with N = (log H − log U)/log Y."""
    _finite_positive("nu40", nu40, "ν40")
    low, high = d2270_l_and_h(nu100)
    if nu40 >= high:
        return 100.0 * (low - nu40) / (low - high)
    n = (math.log10(high) - math.log10(nu40)) / math.log10(nu100)
    vi: float = (10.0**n - 1.0) / D2270_HIGH_VI_DIVISOR + 100.0  # float ** float is Any to typeshed
    return vi


@lru_cache(maxsize=512)  # a session re-derives the same oil on every keystroke
def nu100_from_viscosity_index(nu40: float, vi: float) -> float:
    """ν100 (mm²/s) of an oil with ν40 and viscosity index ``vi``: ASTM D2270 inverted by bisection
    on ν100 between 2 mm²/s and ν40 (VI rises with ν100 at fixed ν40)."""
    _finite_positive("nu40", nu40, "ν40")
    if not math.isfinite(vi):
        raise InputError("vi", f"VI must be a finite number, got {vi!r}")
    if nu40 <= D2270_MIN_NU100:
        raise InputError("nu40", f"ν40 = {nu40} mm²/s: ASTM D2270 needs ν100 ≥ 2 mm²/s, so ν40 > 2")
    low, high = D2270_MIN_NU100, nu40 * (1.0 - 1e-12)
    vi_low, vi_high = viscosity_index(nu40, low), viscosity_index(nu40, high)
    if not vi_low <= vi <= vi_high:
        raise InputError(
            "vi",
            f"VI {vi:g} is out of reach for ν40 = {nu40:g} mm²/s "
            f"(ASTM D2270 gives {vi_low:.0f} … {vi_high:.0f} for ν100 from 2 mm²/s to ν40)",
        )
    for _ in range(200):
        middle = 0.5 * (low + high)
        if viscosity_index(nu40, middle) < vi:
            low = middle
        else:
            high = middle
        if high - low <= 1e-13 * high:
            break
    return 0.5 * (low + high)
