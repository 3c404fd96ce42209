"""How long `dossier check` takes on one record, as a user feels it: a fresh process each time.

Run: python bench/bench_check.py [RECORD] [--runs N]
Prints the median and worst wall time of `dossier check RECORD` over N runs, and the import time alone.
"""

from __future__ import annotations

import argparse
import statistics
import subprocess
import sys
import time
from pathlib import Path

ROOT = Path(__file__).resolve().parents[1]
DEFAULT = ROOT / "demo" / "archive" / "sw-charger-12v" / "rev-C.yaml"


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


if __name__ == "__main__":
    main()
