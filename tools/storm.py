"""Long storms of random keys, pastes and resizes against the screen, from chosen seeds.

    python -m tools.storm                         # seeds 1-5, 5,000 keys each
    python -m tools.storm --seeds 7 1200 --keys 20000

Runs ``tests/tui/test_storm.py`` (one app per seed: the app must stay up, every screen closes,
and the session round-trips through save and read) with the seeds and length given, one seed a
worker.  Not part of the suite: 5,000 keys take a minute or more a seed on a busy machine.  A
failing seed repeats: the storm is made only from the seed (``tests/tui/storm.py``).
"""

from __future__ import annotations

import argparse
import os
import subprocess
import sys
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]


def main(argv: list[str] | None = None) -> int:
    """Run the storm test with the seeds and key count given; pytest's exit code."""
    parser = argparse.ArgumentParser(prog="python -m tools.storm", description=__doc__.split("\n")[0])
    parser.add_argument("--seeds", type=int, nargs="+", default=[1, 2, 3, 4, 5])
    parser.add_argument("--keys", type=int, default=5000, help="keys per seed (about)")
    parser.add_argument("--workers", type=int, default=2)
    args = parser.parse_args(argv)
    environment = dict(os.environ, WORKBENCH_STORM_SEEDS=" ".join(map(str, args.seeds)),
                       WORKBENCH_STORM_KEYS=str(args.keys))
    command = [sys.executable, "-m", "pytest", "-q", "-n", str(args.workers), "-p", "no:cacheprovider",
               str(ROOT / "tests" / "tui" / "test_storm.py")]
    return subprocess.call(command, cwd=ROOT, env=environment)


if __name__ == "__main__":
    sys.exit(main())
