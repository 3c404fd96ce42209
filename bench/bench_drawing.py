"""How long the schematics of the demo archive take to draw: cold (empty drawing cache) and warm
(every drawing already cached, as when a site is rebuilt with no record changed).

Run: python bench/bench_drawing.py [ARCHIVE] [--runs N]
Prints, for the whole archive, the median and worst time of a cold and of a warm pass over N runs,
the number of figures, and the cold time per figure. Records are loaded once, before timing.
"""

from __future__ import annotations

import argparse
import statistics
import tempfile
import time
from pathlib import Path

from dossier.reading.archive import expand, load_revision
from dossier.drawing import schematics
from dossier.drawing.cache import DrawingCache

ROOT = Path(__file__).resolve().parents[1]
DEFAULT = ROOT / "demo" / "archive"


def draw_all(records, cache) -> int:
    return sum(len(schematics.figures(record, [], cache)) for record in records)


def timed(records, cache) -> tuple[float, int]:
    start = time.perf_counter()
    count = draw_all(records, cache)
    return time.perf_counter() - start, count


def one_run(records) -> tuple[float, float, int, DrawingCache]:
    with tempfile.TemporaryDirectory() as folder:
        cold, count = timed(records, DrawingCache(Path(folder)))
        cache = DrawingCache(Path(folder))
        warm, _ = timed(records, cache)
    return cold, warm, count, cache


def report(label: str, times: list[float]) -> str:
    return f"{label}: median {statistics.median(times) * 1000:.0f} ms, worst {max(times) * 1000:.0f} ms"


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__)
    parser.add_argument("archive", nargs="?", type=Path, default=DEFAULT)
    parser.add_argument("--runs", type=int, default=5)
    args = parser.parse_args()
    records = [load_revision(rev).record for rev in expand([args.archive])]
    draw_all(records, None)  # warm up imports and schemdraw's first use
    runs = [one_run(records) for _ in range(args.runs)]
    colds, warms = [r[0] for r in runs], [r[1] for r in runs]
    count, last_warm = runs[0][2], runs[-1][3]
    print(f"{len(records)} records, {count} figures, {args.runs} runs")
    print(report("cold (empty cache)", colds) + f", {statistics.median(colds) / count * 1000:.1f} ms a figure")
    print(report("warm (all cached)", warms) + f", {last_warm.hits} hits, {last_warm.misses} redrawn")


if __name__ == "__main__":
    main()
