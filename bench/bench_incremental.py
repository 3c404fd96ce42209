"""Publishing at the speed of an edit: `dossier build` after one edit, with nothing changed, and cold; the preview.

Run: python bench/bench_incremental.py            (the whole table of docs/benchmarks.md, about 15 minutes on 2 cores)
     python bench/bench_incremental.py --sizes 50 --cold-only "" --no-serve   (a quick look)

For each size N it writes a synthetic archive of N builds (bench_site.synthetic_archive: the demo charger,
every build different), and runs `dossier build --no-pdf` as a user does, in a fresh process each time,
with a user cache of its own (XDG_CACHE_HOME in a scratch folder):

  cold       the first build: every build reviewed and drawn, every page rendered (in parts on every core)
  1 edit     one record's notes changed: that build reviewed again, its pages and the front pages rendered
  nothing    nothing changed: every build from the build cache, the site kept

The preview row times `dossier serve` on a copy of the demo archive: from saving a record to the changed page being
served (polled every 50 ms), median of 3 saves, with the CPU seconds the server and its MkDocs runs spent.

Every figure comes with its wall seconds, the CPU seconds of the process and its children (other load on the
machine does not count in them), the largest resident set of any process, and the load average (uptime) just
before it. Results are also written to bench/results/incremental.json.
"""

from __future__ import annotations

import argparse
import json
import os
import re
import resource
import shutil
import socket
import statistics
import subprocess
import sys
import tempfile
import time
import urllib.request
from pathlib import Path

import yaml

sys.path.insert(0, str(Path(__file__).resolve().parent))
from bench_site import ENVIRONMENT, ROOT, synthetic_archive  # noqa: E402

RESULTS = ROOT / "bench" / "results" / "incremental.json"
DOSSIER = [sys.executable, "-m", "dossier"]


def timed(command: list[str], environment: dict) -> dict:
    """Wall and CPU seconds (this command's processes only) and the load before it started."""
    before_load = os.getloadavg()[0]
    before = resource.getrusage(resource.RUSAGE_CHILDREN)
    started = time.perf_counter()
    result = subprocess.run(command, capture_output=True, text=True, env=environment)
    wall = time.perf_counter() - started
    after = resource.getrusage(resource.RUSAGE_CHILDREN)
    if result.returncode != 0:
        raise SystemExit(f"{' '.join(command)} failed:\n{result.stdout}{result.stderr}")
    cpu = (after.ru_utime - before.ru_utime) + (after.ru_stime - before.ru_stime)
    return {"wall_s": round(wall, 2), "cpu_s": round(cpu, 2), "load": round(before_load, 2), "said": result.stdout.strip()}


def edit(archive: Path, number: int) -> None:
    """Change one record's notes (a build in the middle of the archive, its newest revision)."""
    folder = sorted(p for p in archive.iterdir() if p.is_dir())[number]
    record = sorted(folder.glob("rev-*.yaml"))[-1]
    data = yaml.safe_load(record.read_text(encoding="utf-8"))
    data["notes"] = f"{data['notes']} Edited at {time.time():.0f}."
    record.write_text(yaml.safe_dump(data, sort_keys=False, allow_unicode=True), encoding="utf-8")


def one_size(builds: int, revisions: int, cold_only: bool) -> dict:
    with tempfile.TemporaryDirectory(prefix="dossier-bench-") as scratch:
        work = Path(scratch)
        archive = synthetic_archive(work / "archive", builds, revisions)
        environment = dict(ENVIRONMENT, XDG_CACHE_HOME=str(work / "cache"))
        command = [*DOSSIER, "build", str(archive), "-o", str(work / "site"), "--no-pdf", "-q"]
        measured = {"builds": builds, "revisions": revisions, "cold": timed(command, environment)}
        if not cold_only:
            edits = []
            for attempt in range(3):
                edit(archive, builds // 2 + attempt)
                edits.append(timed(command, environment))
            measured["edit"] = edits
            measured["nothing"] = [timed(command, environment) for _ in range(3)]
        measured["peak_mb"] = round(resource.getrusage(resource.RUSAGE_CHILDREN).ru_maxrss / 1024)
        return measured


def serve_refresh(saves: int = 3) -> dict:
    """Seconds from saving a demo record to `dossier serve` serving the changed page."""
    with tempfile.TemporaryDirectory(prefix="dossier-bench-serve-") as scratch:
        work = Path(scratch)
        archive = work / "archive"
        shutil.copytree(ROOT / "demo" / "archive", archive, ignore=shutil.ignore_patterns("published.yaml"))
        port = _free_port()
        environment = dict(ENVIRONMENT, XDG_CACHE_HOME=str(work / "cache"))
        server = subprocess.Popen([*DOSSIER, "serve", str(archive), "--port", str(port)], stderr=subprocess.PIPE, text=True, env=environment)
        try:
            page = f"http://127.0.0.1:{port}/builds/rotator-control/index.html"
            _until(lambda: "Antenna rotator" in _get(page), 120)
            times, loads, cpus = [], [], []
            record = archive / "rotator-control" / "rev-A.yaml"
            for number in range(saves):
                time.sleep(1.0)
                loads.append(os.getloadavg()[0])
                marker = f"Rotator box {number}"
                text = re.sub(r"^title: .*$", f"title: {marker}", record.read_text(encoding="utf-8"), count=1, flags=re.M)
                started, cpu = time.perf_counter(), _cpu_of(server.pid)
                record.write_text(text, encoding="utf-8")
                _until(lambda: marker in _get(page), 60)
                times.append(time.perf_counter() - started)
                cpus.append(_cpu_of(server.pid) - cpu)
        finally:
            server.terminate()
            said = server.communicate(timeout=30)[1]
    return {"save_to_page_s": [round(t, 2) for t in times], "median_s": round(statistics.median(times), 2), "cpu_s": [round(c, 2) for c in cpus], "load": [round(x, 2) for x in loads], "said": said.strip().splitlines()[-saves:]}


def _cpu_of(pid: int) -> float:
    """CPU seconds of a process and its finished children (MkDocs runs), from /proc (Linux)."""
    try:
        fields = Path(f"/proc/{pid}/stat").read_text().rsplit(")", 1)[1].split()
    except OSError:
        return float("nan")
    return sum(int(value) for value in fields[11:15]) / os.sysconf("SC_CLK_TCK")


def _free_port() -> int:
    with socket.socket() as probe:
        probe.bind(("127.0.0.1", 0))
        return probe.getsockname()[1]


def _get(url: str) -> str:
    try:
        with urllib.request.urlopen(url, timeout=5) as response:
            return response.read().decode("utf-8")
    except OSError:
        return ""


def _until(condition, limit: float) -> None:
    deadline = time.monotonic() + limit
    while not condition():
        if time.monotonic() > deadline:
            raise SystemExit("timed out waiting for the preview")
        time.sleep(0.05)


def _row(result: dict) -> str:
    def figure(run: dict) -> str:
        return f"{run['wall_s']:.1f} s wall, {run['cpu_s']:.1f} s CPU (load {run['load']:.1f})"

    lines = [f"{result['builds']} x {result['revisions']}: cold {figure(result['cold'])}; peak {result['peak_mb']} MB"]
    for name in ("edit", "nothing"):
        for run in result.get(name, []):
            lines.append(f"    {name:8} {figure(run)}")
    return "\n".join(lines)


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--sizes", default="50,200", help="comma-separated numbers of builds: cold, edits and nothing changed")
    parser.add_argument("--revisions", type=int, default=3)
    parser.add_argument("--no-serve", action="store_true", help="leave out the preview's save-to-page on the demo archive")
    parser.add_argument("--cold-only", default="800", help="sizes (comma-separated) to time only cold; \"\" for none (800: about 8 minutes)")
    args = parser.parse_args()
    print(f"machine: {os.cpu_count()} cores; python {sys.version.split()[0]}")
    results = []
    if not args.no_serve:
        results.append({"serve": serve_refresh()})
        print(f"serve: save to page {results[-1]['serve']}", flush=True)
    for size in (int(s) for s in args.sizes.split(",") if s):
        results.append(one_size(size, args.revisions, False))
        print(_row(results[-1]), flush=True)
    for size in (int(s) for s in args.cold_only.split(",") if s):
        results.append(one_size(size, args.revisions, True))
        print(_row(results[-1]), flush=True)
    RESULTS.parent.mkdir(parents=True, exist_ok=True)
    RESULTS.write_text(json.dumps(results, indent=2), encoding="utf-8")


if __name__ == "__main__":
    main()
