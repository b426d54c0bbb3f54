"""Constant-mutation check of the engine: does some engine test fail when one number changes?

Each numeric constant of the engine's physics modules is changed, one at a time, by a
transcription-sized amount (``--delta``, 3 % by default: 0.56 becomes 0.5768), and the engine
tests run with ``-x`` against the changed copy: the module's own test files first, then the other
engine test files that import it (directly or through other modules; a file that never imports
it cannot notice).  A change that no test notices is a *survivor*: that constant is not guarded
by any check against an outside source.

    python -m tools.mutate                      # every module, two workers
    python -m tools.mutate --modules life kinds # some modules
    python -m tools.mutate --modules internal.hertz   # a sub-package's module by dotted name
    python -m tools.mutate --limit 20 --json out.json
    python -m tools.mutate --json full.json --resume   # go on with a stopped run
    python -m tools.mutate --survivors full.json       # after new tests: the survivors again

Not a pytest test (a full run takes tens of minutes).  It never edits the working tree: each
worker copies ``workbench/``, ``tests/`` and ``pyproject.toml`` to a temporary folder, changes the
copy, and runs pytest there in a forked child (the parent has imported numpy, scipy and
hypothesis already, so a mutant costs the engine's own imports and its tests).

Constants that are not physics are left alone, by rule (see :func:`_skipped`): zero (a few per
cent of nothing is nothing), tolerances below 1e-6, subscripts, the arguments of ``range``,
``round`` and ``lru_cache``, the mutants listed in ``KNOWN_EQUIVALENT`` (with the reason the
answer cannot change), the equilibrium solver's starting point and continuation
(``_NUMERICAL_METHOD_FUNCTIONS``), numbers inside f-strings (text), integer bounds on ``len(…)`` by
``>`` or ``<=`` (a count is whole: ``len(rows) > 1.03`` is ``len(rows) > 1``), functions that make synthetic data or time things (``random_*``,
``benchmark*``), and the modules of numerical method and display (``SKIPPED_MODULES``):
a solver grid of 64 points or a difference step of 1e-4 may change without changing an answer.
"""

from __future__ import annotations

import argparse
import ast
import json
import multiprocessing
import os
import random
import shutil
import signal
import sys
import tempfile
import time
from collections.abc import Sequence
from dataclasses import asdict, dataclass
from pathlib import Path

ROOT = Path(__file__).resolve().parent.parent
ENGINE = ROOT / "workbench" / "engine"
TESTS = ROOT / "tests" / "engine"

# Numerical method and display, not physics (see the module docstring). ``curves`` samples
# ``derive`` and ``life.aiso`` (mutated themselves) for the plots: its own numbers are the plot's
# extent (0.25× to 4× the load) and its grid.
SKIPPED_MODULES = frozenset({"__init__", "num", "record", "explain", "solve", "sensitivity",
                             "curves"})
# Functions that make synthetic data or time things (select.random_catalog, benchmark_select):
# their numbers are sizes and seeds, not physics.
_SKIPPED_FUNCTION_PREFIXES = ("benchmark", "random_")
# Numerical method and display inside physics modules: the equilibrium solver's starting point,
# its growth until an element touches, and the continuation in steps of a moment (the answer does
# not depend on them: a start that loses the root fails the equilibrium tests instead); the
# clearances the life-against-clearance plot spans (analysis.default_clearances).
_NUMERICAL_METHOD_FUNCTIONS = frozenset({"_first_guess", "_in_contact", "_moment_in_steps",
                                         "default_clearances"})
# Mutants no test can kill because the answer cannot change, each with the reason; matched by
# module and the line's text (so they survive edits elsewhere in the file).
KNOWN_EQUIVALENT: dict[tuple[str, str], str] = {
    ("internal.analysis", "probe = 1000.0"):
        "pmax ∝ Q^(1/3): C0 is scaled from a probe load, and any probe load gives the same C0",
    ("internal.distribution", "if high > APPROACH_LIMIT_RATIO * inputs.dw * 10.0:"):
        "the bracket doubles from 1e-3·Dw, and no doubling lands between 0.1·Dw and 0.103·Dw",
    ("select", "governing=governing if rated.any() else np.full(ng, -1),"):
        "select() copies it into its integer array of case indices, where −1.03 is −1",
}
# Calls whose numeric arguments are counts, digits or cache sizes.
_SKIPPED_CALLS = frozenset({"range", "round", "lru_cache", "fmt"})
# Which engine test file checks a module first (the rest follow): a killed mutant stops early.
_OWN_TESTS: dict[str, tuple[str, ...]] = {
    "tables": ("test_factors.py", "test_life.py", "test_derive.py"),
    "kinds": ("test_factors.py", "test_derive.py"),
    "rating_tables": ("test_ratings.py",),
    "ratings": ("test_ratings.py",),
    "gears": ("test_gears.py",),
    "shaft": ("test_shaft.py",),
    "pairs": ("test_pairs.py",),
    "duty": ("test_duty.py",),
    "select": ("test_select.py",),
    "curves": ("test_curves.py",),
    "viscosity": ("test_viscosity.py",),
    "life": ("test_life.py",),
    "derive": ("test_derive.py",),
    "internal.hertz": ("test_internal_hertz.py",),
    "internal.distribution": ("test_internal_distribution.py",),
    "internal.reference_life": ("test_internal_life.py",),
    "internal.analysis": ("test_internal_life.py", "test_internal_distribution.py"),
}
TIMEOUT_S = 300.0


@dataclass(frozen=True)
class Mutant:
    """One constant of one module, and the text it becomes."""

    module: str
    line: int
    col: int         # byte offsets within the line (as ast gives them)
    end_col: int
    original: str
    mutated: str


@dataclass
class Outcome:
    mutant: Mutant
    killed: bool
    how: str          # "failed", "error", "timeout", "survived"
    seconds: float


def _parents(tree: ast.AST) -> dict[ast.AST, ast.AST]:
    return {child: node for node in ast.walk(tree) for child in ast.iter_child_nodes(node)}


def _call_name(node: ast.Call) -> str:
    func = node.func
    if isinstance(func, ast.Name):
        return func.id
    if isinstance(func, ast.Attribute):
        return func.attr
    return ""


def _count_bound(node: ast.Constant, parent: ast.AST | None) -> bool:
    """An integer bound on ``len(…)`` by ``>`` or ``<=`` (``len(rows) > 1``): a count is an
    integer, so n·(1 + δ) below n + 1 gives the same answer, a mutant no test can kill."""
    if not (isinstance(parent, ast.Compare) and len(parent.ops) == 1 and type(node.value) is int):
        return False
    left, right, op = parent.left, parent.comparators[0], parent.ops[0]
    if right is node and isinstance(op, ast.Gt | ast.LtE):
        other = left
    elif left is node and isinstance(op, ast.Lt | ast.GtE):
        other = right
    else:
        return False
    return isinstance(other, ast.Call) and _call_name(other) == "len"


def _skipped(node: ast.Constant, parents: dict[ast.AST, ast.AST]) -> bool:
    """True for constants that are not physics (see the module docstring)."""
    value = node.value
    if value == 0 or abs(value) < 1e-6:
        return True
    if _count_bound(node, parents.get(node)):
        return True
    child: ast.AST = node
    parent = parents.get(node)
    while parent is not None:
        if isinstance(parent, ast.JoinedStr):  # a number inside an f-string only makes text
            return True
        if isinstance(parent, ast.Subscript) and child is parent.slice:
            return True
        if isinstance(parent, ast.keyword) and parent.arg in ("maxsize", "digits"):
            return True
        if isinstance(parent, ast.Call) and _call_name(parent) in _SKIPPED_CALLS and child is not parent.func:
            return True
        if isinstance(parent, ast.FunctionDef) and (
                parent.name.startswith(_SKIPPED_FUNCTION_PREFIXES)
                or parent.name in _NUMERICAL_METHOD_FUNCTIONS):
            return True
        if isinstance(parent, ast.Module):
            return False
        child, parent = parent, parents.get(parent)
    return False


def _mutated_text(value: float, delta: float) -> str:
    return repr(float(value) * (1.0 + delta))


def module_path(root: Path, module: str) -> Path:
    """The file of engine module ``module`` (``internal.hertz`` is ``internal/hertz.py``) under
    the engine folder ``root``."""
    return root.joinpath(*module.split(".")).with_suffix(".py")


def mutants_of(module: str, delta: float, path: Path | None = None) -> list[Mutant]:
    """Every mutable numeric constant of engine module ``module``, in source order."""
    source = (path or module_path(ENGINE, module)).read_text(encoding="utf-8")
    tree = ast.parse(source)
    parents = _parents(tree)
    lines = source.encode("utf-8").splitlines()
    found = []
    for node in ast.walk(tree):
        if not isinstance(node, ast.Constant) or type(node.value) not in (int, float):
            continue
        if node.lineno != node.end_lineno or _skipped(node, parents):
            continue
        if (module, lines[node.lineno - 1].decode("utf-8").strip()) in KNOWN_EQUIVALENT:
            continue
        text = lines[node.lineno - 1][node.col_offset:node.end_col_offset].decode("utf-8")
        found.append(Mutant(module, node.lineno, node.col_offset, node.end_col_offset, text,
                            _mutated_text(node.value, delta)))
    return sorted(found, key=lambda m: (m.line, m.col))


def _apply(source: bytes, mutant: Mutant) -> bytes:
    lines = source.split(b"\n")
    line = lines[mutant.line - 1]
    lines[mutant.line - 1] = line[:mutant.col] + mutant.mutated.encode() + line[mutant.end_col:]
    return b"\n".join(lines)


# ---- workers ---------------------------------------------------------------------------------
_WORK: Path | None = None
_CHILD: int | None = None  # the worker's running pytest child, killed with the worker


def _stop_worker(*_: object) -> None:
    if _CHILD is not None:
        os.kill(_CHILD, signal.SIGKILL)
    os._exit(1)


def _prepare_worker(base: str) -> None:
    """Copy the tree to a private folder under ``base`` and import the heavy dependencies once."""
    global _WORK
    signal.signal(signal.SIGTERM, _stop_worker)
    signal.signal(signal.SIGINT, signal.SIG_IGN)  # the parent stops the pool
    _WORK = Path(tempfile.mkdtemp(dir=base))
    for name in ("workbench", "tests"):
        shutil.copytree(ROOT / name, _WORK / name,
                        ignore=shutil.ignore_patterns("__pycache__", "*.pyc", ".hypothesis"))
    shutil.copy2(ROOT / "pyproject.toml", _WORK / "pyproject.toml")
    sys.dont_write_bytecode = True  # a changed module must never be read back from a stale .pyc
    import hypothesis  # noqa: F401
    import numpy  # noqa: F401
    import pytest  # noqa: F401
    import scipy.integrate  # noqa: F401
    import scipy.optimize  # noqa: F401
    import scipy.special  # noqa: F401
    import scipy.stats  # noqa: F401
    try:  # the ASTM D2270 reference of test_viscosity (about a second to import, once per worker)
        import chemicals.viscosity  # noqa: F401
    except ImportError:
        pass


def _imported(path: Path, package: str, known: set[str]) -> set[str]:
    """The names in ``known`` (engine modules by dotted name, and the test folder's own helper
    modules) that the file at ``path`` imports anywhere in it. ``package`` is the file's dotted
    package inside the engine, for relative imports ("" for the engine's top level and tests)."""
    found: set[str] = set()
    prefix = "workbench.engine."
    for node in ast.walk(ast.parse(path.read_text(encoding="utf-8"))):
        if isinstance(node, ast.Import):
            bases = [alias.name for alias in node.names]
            names: list[str] = []
        elif isinstance(node, ast.ImportFrom):
            if node.level:
                parts = package.split(".") if package else []
                parts = parts[:len(parts) - (node.level - 1)] if node.level > 1 else parts
                base = ".".join([*parts, *([node.module] if node.module else [])])
            else:
                base = node.module or ""
                base = base[len(prefix):] if base.startswith(prefix) else (
                    "" if base == "workbench.engine" else base)
            bases, names = [base], [alias.name for alias in node.names]
        else:
            continue
        for base in bases:
            base = base[len(prefix):] if base.startswith(prefix) else base
            if base in known:
                found.add(base)
            found.update(f"{base}.{name}".lstrip(".") for name in names
                         if f"{base}.{name}".lstrip(".") in known)
    return found


def relevant_tests(module: str, root: Path = ROOT) -> list[str]:
    """The engine test files that import ``module``, directly or through other engine modules or
    the tests' helper modules: only those can see its constants (a file that never imports it
    cannot fail because a number in it changed)."""
    engine, tests = root / "workbench" / "engine", root / "tests" / "engine"
    graph: dict[str, set[str]] = {}
    engine_files = {".".join(p.relative_to(engine).with_suffix("").parts): p
                    for p in engine.rglob("*.py")}
    helpers = {p.stem: p for p in tests.glob("*.py") if not p.stem.startswith("test_")}
    known = set(engine_files) | set(helpers)
    for name, path in engine_files.items():
        graph[name] = _imported(path, name.rpartition(".")[0], known)
    for name, path in helpers.items():
        graph[name] = _imported(path, "", known)

    def reaches(start: set[str]) -> bool:
        seen, todo = set(), list(start)
        while todo:
            name = todo.pop()
            if name == module:
                return True
            if name not in seen:
                seen.add(name)
                todo.extend(graph.get(name, ()))
        return False

    return sorted(f"tests/engine/{p.name}" for p in tests.glob("test_*.py")
                  if reaches(_imported(p, "", known)))


def _test_files(module: str) -> tuple[list[str], list[str]]:
    """The module's own engine test files, then the other engine test files that import it."""
    assert _WORK is not None
    own = [f"tests/engine/{name}" for name in _OWN_TESTS.get(module, ())]
    rest = [name for name in relevant_tests(module, _WORK) if name not in own]
    return own, rest


# "-n 0": in this process, not pytest-xdist's (pyproject's addopts asks for two workers, each a
# fresh interpreter importing numpy and scipy again: four test processes on two cores per mutant).
_PYTEST_OPTIONS = ["-x", "-q", "-n", "0", "-p", "no:cacheprovider", "--no-header", "-W", "ignore"]


def _pytest_in_child(files: list[str], deadline: float) -> str:
    """Run pytest on ``files`` in a forked child: "failed", "error", "survived" or "timeout"."""
    global _CHILD
    assert _WORK is not None
    pid = os.fork()
    if pid == 0:  # the child: a fresh import of the changed engine, then the tests
        code = 3
        try:
            os.chdir(_WORK)
            sys.path.insert(0, str(_WORK))
            devnull = os.open(os.devnull, os.O_WRONLY)
            os.dup2(devnull, 1)
            os.dup2(devnull, 2)
            import pytest

            code = int(pytest.main([*files, *_PYTEST_OPTIONS]))
        finally:
            os._exit(code)
    _CHILD = pid
    while time.monotonic() < deadline:
        done, status = os.waitpid(pid, os.WNOHANG)
        if done:
            _CHILD = None
            return {0: "survived", 1: "failed"}.get(os.waitstatus_to_exitcode(status), "error")
        time.sleep(0.02)
    os.kill(pid, signal.SIGKILL)
    os.waitpid(pid, 0)
    _CHILD = None
    return "timeout"


def _run_one(task: tuple[Mutant, bool]) -> Outcome:
    """Change one constant in the worker's copy, run the own tests, then (unless ``quick``) the
    rest, stopping at the first failure; put the constant back."""
    mutant, quick = task
    assert _WORK is not None
    target = module_path(_WORK / "workbench" / "engine", mutant.module)
    original = target.read_bytes()
    target.write_bytes(_apply(original, mutant))
    start = time.monotonic()
    how = "survived"
    try:
        own, rest = _test_files(mutant.module)
        for files in (own, [] if quick else rest):
            if files:
                how = _pytest_in_child(files, start + TIMEOUT_S)
                if how != "survived":
                    break
    finally:
        target.write_bytes(original)
    return Outcome(mutant, how != "survived", how, time.monotonic() - start)


def read_outcomes(path: Path) -> list[Outcome]:
    """The outcomes an earlier ``--json`` file holds."""
    rows = json.loads(path.read_text(encoding="utf-8"))
    return [Outcome(Mutant(r["module"], r["line"], r["col"], r["end_col"], r["original"],
                           r["mutated"]), r["killed"], r["how"], r["seconds"]) for r in rows]


def write_outcomes(path: Path, outcomes: list[Outcome]) -> None:
    """Every outcome as JSON, replacing ``path`` whole (a stopped run keeps what it did)."""
    temporary = path.with_name(path.name + ".part")
    temporary.write_text(json.dumps([{**asdict(o.mutant), "killed": o.killed, "how": o.how,
                                      "seconds": round(o.seconds, 2)} for o in outcomes],
                                    indent=1, ensure_ascii=False), encoding="utf-8")
    temporary.replace(path)


def run(modules: list[str], delta: float, workers: int, limit: int | None,
        quick: bool = False, sample: int | None = None, seed: int = 15,
        done: Sequence[Outcome] = (), only: set[Mutant] | None = None,
        json_path: Path | None = None) -> list[Outcome]:
    """Mutate, test and collect the outcomes (printing one line per survivor as it is found).

    ``sample`` draws that many mutants at random (seeded) from all of them: an estimate of the
    kill rate when a full run would take too long. ``done`` are outcomes of an earlier run kept
    as they are (``--resume``): their mutants are not tested again; ``only`` tests just those
    mutants (``--survivors``). With ``json_path`` every outcome so far is written after each one.
    """
    mutants = [m for module in modules for m in mutants_of(module, delta)]
    total = len(mutants)
    if sample is not None and sample < total:
        mutants = sorted(random.Random(seed).sample(mutants, sample),
                         key=lambda m: (m.module, m.line, m.col))
    if only is not None:
        mutants = [m for m in mutants if m in only]
    if limit is not None:
        mutants = mutants[:limit]
    wanted = set(mutants)
    outcomes: list[Outcome] = [o for o in done if o.mutant in wanted]
    kept = {o.mutant for o in outcomes}
    mutants = [m for m in mutants if m not in kept]
    drawn = f" (a seeded sample of {total})" if sample is not None and sample < total else ""
    resumed = f", {len(outcomes)} kept from the earlier run" if outcomes else ""
    print(f"{len(mutants)} mutants{drawn} in {', '.join(modules)} (×{1 + delta:g}){resumed}, "
          f"{workers} workers", flush=True)
    context = multiprocessing.get_context("fork")
    base = tempfile.mkdtemp(prefix="workbench-mutate-")
    try:
        with context.Pool(workers, initializer=_prepare_worker, initargs=(base,)) as pool:
            for outcome in pool.imap_unordered(_run_one, [(m, quick) for m in mutants]):
                outcomes.append(outcome)
                if json_path is not None:
                    write_outcomes(json_path, outcomes)
                if len(outcomes) % 50 == 0:
                    killed = sum(o.killed for o in outcomes)
                    print(f"… {len(outcomes)} of {len(mutants) + len(kept)}, {killed} killed",
                          flush=True)
                if not outcome.killed:
                    m = outcome.mutant
                    print(f"survived {m.module}.py:{m.line}: {m.original} → {m.mutated}", flush=True)
    finally:
        shutil.rmtree(base, ignore_errors=True)
    return outcomes


def engine_modules() -> list[str]:
    """The engine modules the check covers (all but ``SKIPPED_MODULES``), those of its
    sub-packages by dotted name (``internal.hertz``)."""
    names = (".".join(p.relative_to(ENGINE).with_suffix("").parts) for p in ENGINE.rglob("*.py"))
    return sorted(name for name in names if name.rsplit(".", 1)[-1] not in SKIPPED_MODULES)


def main(argv: list[str] | None = None) -> int:
    parser = argparse.ArgumentParser(prog="python -m tools.mutate", description=__doc__.split("\n")[0])
    parser.add_argument("--modules", nargs="*", help="engine module names (default: all covered)")
    parser.add_argument("--delta", type=float, default=0.03, help="relative change (default 0.03)")
    parser.add_argument("--workers", type=int, default=2)
    parser.add_argument("--limit", type=int, help="only the first N mutants")
    parser.add_argument("--quick", action="store_true",
                        help="run only the module's own test files (faster, may kill fewer)")
    parser.add_argument("--sample", type=int, help="test only N mutants drawn at random (seeded)")
    parser.add_argument("--seed", type=int, default=15, help="seed of --sample (default 15)")
    parser.add_argument("--json", type=Path,
                        help="write every outcome to this file (rewritten after each one)")
    parser.add_argument("--resume", action="store_true",
                        help="keep the outcomes already in --json FILE and test only the rest "
                             "(a full run in several sittings)")
    parser.add_argument("--survivors", type=Path, metavar="FILE",
                        help="test again only the mutants that survived in this earlier --json file")
    args = parser.parse_args(argv)
    if args.resume and args.json is None:
        parser.error("--resume needs --json FILE")
    done = read_outcomes(args.json) if args.resume and args.json.exists() else []
    only = ({o.mutant for o in read_outcomes(args.survivors) if not o.killed}
            if args.survivors else None)
    modules = args.modules or engine_modules()
    unknown = [m for m in modules if not module_path(ENGINE, m).exists()]
    if unknown:
        parser.error(f"no engine module {', '.join(unknown)}")
    signal.signal(signal.SIGTERM, lambda *_: sys.exit(1))  # so the pool and its folder go too
    started = time.monotonic()
    outcomes = run(modules, args.delta, args.workers, args.limit, args.quick, args.sample, args.seed,
                   done=done, only=only, json_path=args.json)
    killed = sum(o.killed for o in outcomes)
    total = len(outcomes)
    print(f"\nkilled {killed} of {total} ({100.0 * killed / max(total, 1):.1f} %) "
          f"in {time.monotonic() - started:.0f} s")
    by_module: dict[str, list[int]] = {}
    for o in outcomes:
        counts = by_module.setdefault(o.mutant.module, [0, 0])
        counts[0] += o.killed
        counts[1] += 1
    for module, (k, n) in sorted(by_module.items()):
        print(f"  {module:14} {k:4} / {n:4}")
    if args.json:
        write_outcomes(args.json, outcomes)
    return 0


if __name__ == "__main__":
    raise SystemExit(main())
