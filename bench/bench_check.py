"""How long `dossier check` takes on one record, as a user feels it: a fresh process each time.

Run: python bench/bench_check.py [RECORD] [--runs N]
Prints the median and worst wall time of `dossier check RECORD` over N runs, and the import time alone;
then how long hostile files take to be refused in-process: a 'billion laughs' alias bomb (10^9 values if
expanded), a file of nearly 1 MB of deep but allowed YAML, and a file over the size limit.
"""

from __future__ import annotations

import argparse
import statistics
import subprocess
import sys
import tempfile
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
DEFAULT = ROOT / "demo" / "archive" / "solar-bank-charger" / "rev-C.yaml"


def wall_time(command: list[str]) -> float:
    start = time.perf_counter()
    subprocess.run(command, stdout=subprocess.DEVNULL, stderr=subprocess.DEVNULL, check=False)
    return time.perf_counter() - start


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__)
    parser.add_argument("record", nargs="?", type=Path, default=DEFAULT)
    parser.add_argument("--runs", type=int, default=10)
    args = parser.parse_args()
    check = [sys.executable, "-m", "dossier", "check", str(args.record)]
    imports = [sys.executable, "-c", "import dossier.cli"]
    wall_time(check)  # the first run fills the units registry's disk cache
    times = [wall_time(check) for _ in range(args.runs)]
    bare = [wall_time(imports) for _ in range(args.runs)]
    print(f"dossier check {args.record.name}: median {statistics.median(times) * 1000:.0f} ms, worst {max(times) * 1000:.0f} ms over {args.runs} runs")
    print(f"python -c 'import dossier.cli': median {statistics.median(bare) * 1000:.0f} ms")
    hostile_files(args.runs)


def hostile_files(runs: int) -> None:
    from dossier.problems import InputError
    from dossier.reading.yaml_source import MAX_BYTES, read_document

    laughs = [f"a0: &a0 [{', '.join(['x'] * 10)}]"] + [f"a{i}: &a{i} [" + ", ".join([f"*a{i - 1}"] * 10) + "]" for i in range(1, 10)]
    rows = "\n".join(f"k{i}: {{a: [1, 2, 3], b: 'text {i}'}}" for i in range(MAX_BYTES // 40))
    cases = {"billion laughs": "\n".join(laughs), "nearly 1 MB of values": rows[: MAX_BYTES - 100].rsplit("\n", 1)[0], "over the size limit": "x: " + "y" * MAX_BYTES}
    with tempfile.TemporaryDirectory() as folder:
        for name, text in cases.items():
            path = Path(folder) / "hostile.yaml"
            path.write_text(text + "\n", encoding="utf-8")
            times, outcome = [], "read"
            for _ in range(runs):
                started = time.perf_counter()
                try:
                    read_document(path, shown_as=name)
                except InputError as error:
                    outcome = "refused: " + error.problems[0].code
                times.append(time.perf_counter() - started)
            print(f"{name} ({path.stat().st_size:,} bytes): {outcome} in {statistics.median(times) * 1000:.0f} ms (median of {runs})")


if __name__ == "__main__":
    main()
