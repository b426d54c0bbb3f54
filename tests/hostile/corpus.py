"""The hostile corpus: small generated files that once crashed, hung or flooded the workbench.

Nothing is stored: :func:`write_refused_sessions` and friends write each file into a folder the
test gives (``tmp_path``), so the repository holds this script and no blobs.  Each entry names
the trap it sets; the tests check each one through the command line.
"""

from __future__ import annotations

import os
from pathlib import Path

GOOD = """schema = 1

[session]
title = "Hostile corpus base"

[targets]
life = "20000 h"
reliability = "0.95"

[[bearings]]
name = "B1"
kind = "deep-groove"
c = "33 kN"
c0 = "19 kN"

[[cases]]
name = "C1"
bearing = "B1"
fr = "5 kN"
fa = "1 kN"
speed = "1450 rpm"
"""


def _with_case_fields(fields: str) -> str:
    """The base session with ``fields`` (TOML lines) added to its one case."""
    return GOOD + fields


def _nested(opening: str, closing: str, depth: int, middle: str = "") -> str:
    return "schema = 1\nx = " + opening * depth + middle + closing * depth + "\n"


# name → what it holds; every one must be refused with exit 2 and one line on standard error
REFUSED_SESSIONS: dict[str, bytes] = {
    "huge-integer.toml": ("schema = 1\n[targets]\nlife = " + "9" * 5000 + "\n").encode(),
    "deep-arrays.toml": _nested("[", "]", 5000).encode(),
    "deep-inline-tables.toml": _nested("{a=", "}", 5000, "1").encode(),
    "unclosed-deep-arrays.toml": ("schema = 1\nx = " + "[" * 200_000).encode(),
    "megabyte-key.toml": ("schema = 1\n[session]\n" + "k" * 1_000_000 + " = 1\n").encode(),
    "solver-target-overflow.toml":
        (GOOD + '[solver]\nunknown = "c"\ntarget = "Lnm=1 kN**99"\ncase = "C1"\n').encode(),
    "field-unit-overflow.toml": GOOD.replace('fr = "5 kN"', 'fr = "1 kN**99"').encode(),
    "field-value-overflow.toml": GOOD.replace('c = "33 kN"', 'c = "1e300 TN"').encode(),
    "not-utf8.toml": GOOD.encode().replace(b"Hostile", b"Hostil\xe9"),
    "nul-byte.toml": GOOD.encode().replace(b"Hostile", b"Host\x00ile"),
    "long-string-key.toml": ('schema = 1\n"' + "q" * 300 + '" = 1\n').encode(),
    "escape-in-key.toml": ('schema = 1\n"\x1b]0;owned\x07" = 1\n').encode(),
    "newer-schema.toml": b"schema = 99\n",
    "schema-as-text.toml": b'schema = "1"\n',
    "huge-float-schema.toml": b"schema = 1e999\n",
    "date-out-of-range.toml": b"schema = 1\nwhen = 9999-99-99\n",
    "only-a-bom.toml": b"\xef\xbb\xbf",
    "many-tables.toml": ("schema = 1\n" + "[[cases]]\n" * 20_000).encode(),
}

# Cases the engine refuses: the file opens, and the report shows the case's error (exit 0)
REFUSED_CASES: dict[str, bytes] = {
    "weibull-overflow.toml": _with_case_fields(
        'reliability_model = "weibull"\nreliability = "0.01"\nweibull_b = "0.001"\n').encode(),
    "bare-c-1e308.toml": GOOD.replace('c = "33 kN"', 'c = "1e308"').encode(),
    "smallest-af.toml": _with_case_fields('af = "5e-324"\n').encode(),
}

# Opened and reported normally, fast
ACCEPTED_SESSIONS: dict[str, bytes] = {
    "byte-order-mark.toml": b"\xef\xbb\xbf" + GOOD.encode(),
    "many-comments.toml": ("# a comment line\n" * 100_000 + GOOD).encode(),
    "escape-codes-in-names.toml": GOOD.replace(
        'title = "Hostile corpus base"', 'title = "\\u001b]0;retitled\\u0007title\\u001b[2J"')
    .replace('name = "C1"', 'name = "C1\\u009b31m"').replace('"C1"', '"C1\\u009b31m"').encode(),
    "markup-in-names.toml": GOOD.replace(
        'title = "Hostile corpus base"', 'title = "<script>alert(1)</script>"').replace(
        '"C1"', '"<img src=x onerror=alert(1)>\\n# injected"').encode(),
    "load-scale-solve-tiny-af.toml": _with_case_fields('af = "5e-324"\n').encode()
    + b'[solver]\nunknown = "load_scale"\ntarget = "Lnm=20000 h"\ncase = "C1"\n',
}

REFUSED_CATALOGS: dict[str, bytes] = {
    "header-100k-columns.csv": ("designation" + ",x" * 100_000 + "\n").encode(),
    "header-field-200k.csv": ("designation," + "y" * 200_000 + "\n").encode(),
    "deep.toml": ("title = " + "[" * 5000 + "]" * 5000 + "\n").encode(),
    "huge-integer.toml": ("title = 1\n[[bearing]]\nd_mm = " + "7" * 5000 + "\n").encode(),
}

HEADER = "designation,kind,d_mm,D_mm,B_mm,C_kN,C0_kN\n"
ROW = "D-{n},deep-groove,40,80,18,31.5,20.2\n"
# Catalogs whose bad rows are rejected one by one while the good rows load (exit 0)
ROW_PROBLEM_CATALOGS: dict[str, bytes] = {
    "field-over-128k.csv": (HEADER + ROW.format(n=1) + "D-2," + "z" * 140_000 + "\n").encode(),
    "thousands-of-bad-rows.csv": (HEADER + ROW.format(n=1) + "x,y\n" * 5000).encode(),
}


def write_files(folder: Path, files: dict[str, bytes]) -> list[Path]:
    """Write each file of ``files`` into ``folder``; their paths."""
    folder.mkdir(parents=True, exist_ok=True)
    paths = []
    for name, data in files.items():
        path = folder / name
        path.write_bytes(data)
        paths.append(path)
    return paths


def write_special_files(folder: Path) -> dict[str, Path]:
    """Files that are not regular files, or cannot be: a FIFO, a link to /dev/zero, a folder,
    an over-long name, a sparse 30 MB file (no disk space used)."""
    folder.mkdir(parents=True, exist_ok=True)
    special = {"folder": folder / "folder.toml", "long-name": folder / ("n" * 300 + ".toml"),
               "sparse-30MB": folder / "sparse.toml"}
    special["folder"].mkdir()
    with special["sparse-30MB"].open("wb") as handle:
        handle.truncate(30 * 1024 * 1024)
    if hasattr(os, "mkfifo"):
        special["fifo"] = folder / "fifo.toml"
        os.mkfifo(special["fifo"])
    if Path("/dev/zero").exists():
        special["dev-zero-link"] = folder / "zero.toml"
        special["dev-zero-link"].symlink_to("/dev/zero")
    return special
