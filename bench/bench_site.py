"""How `dossier build` scales: synthetic archives of increasing size, time per build and peak memory.

Run: python bench/bench_site.py [--sizes 10,25,50,100] [--revisions 2] [--full-nav-up-to 100] [--kept-only]

For each size N it writes an archive of N builds (each with --revisions revisions, made from the demo
charger with its own id, title and part values so no drawing is shared), then, in a fresh process:

  collect    validate, review, draw and make the checklist of every revision (cold: no drawing cache)
  generate   write the Markdown tree
  render     MkDocs + mkdocs-material on that tree (the site dossier publishes)
  plain      MkDocs alone on the same number of plain pages of the same average size, same theme
  full nav   the same tree rendered with a sidebar listing every page of every build (the design dossier
             avoids), to show what such a sidebar costs as the archive grows

Then the rebuilds, in wall seconds of `dossier build` with a filled drawing cache:

  warm       nothing changed, the site rendered again anyway (what `--no-cache` forces, minus the drawing)
  kept       nothing changed: the page tree matches the one the site was rendered from, so the site is kept
  1 edit     one record changed: its drawings are drawn again and the whole site is rendered again
  tree 1p/Np the page tree alone (collect + generate, no cache), in one process and on every core

--kept-only times only the build that fills the cache and the rebuild that keeps the site.

It prints one row per size, in CPU seconds: seconds per build, milliseconds per rendered page, peak
memory (the largest resident set of the dossier process, and of the largest MkDocs run) and render / plain,
the ratio to MkDocs alone.
Results are also written to bench/results/site.json.
"""

from __future__ import annotations

import argparse
import json
import os
import resource
import subprocess
import sys
import tempfile
import time
from pathlib import Path

import yaml

ROOT = Path(__file__).resolve().parents[1]
TEMPLATE = ROOT / "demo" / "archive" / "solar-bank-charger" / "rev-C.yaml"
RESULTS = ROOT / "bench" / "results" / "site.json"
ENVIRONMENT = dict(os.environ, NO_MKDOCS_2_WARNING="1")


def synthetic_archive(root: Path, builds: int, revisions: int) -> Path:
    """N builds made from the demo charger, each one different in its id, title and a part value per revision."""
    base = yaml.safe_load(TEMPLATE.read_text(encoding="utf-8"))
    root.mkdir(parents=True, exist_ok=True)
    (root / "archive.yaml").write_text("club: Bench club\ntitle: Synthetic archive\n", encoding="utf-8")
    for number in range(builds):
        build_id = f"synthetic-{number:04d}"
        for index in range(revisions):
            letter = chr(ord("A") + index)
            data = _variant(base, build_id, number, index, letter)
            folder = root / build_id
            folder.mkdir(parents=True, exist_ok=True)
            (folder / f"rev-{letter}.yaml").write_text(yaml.safe_dump(data, sort_keys=False, allow_unicode=True), encoding="utf-8")
    return root


def _variant(base: dict, build_id: str, number: int, index: int, letter: str) -> dict:
    data = json.loads(json.dumps(base, default=str))
    data.update(id=build_id, revision=letter, title=f"Synthetic charger {number} for the benchmark", date=f"2026-0{1 + index % 9}-1{number % 10}")
    data.pop("attachments", None)  # the demo's attached files are not copied into the synthetic archive
    data["notes"] = f"Synthetic build {number}, revision {letter}: notes text to search for, word{number}x{index}."
    data["stages"][0]["parts"][0]["value"] = f"IEC inlet {number}-{index}"
    data["barriers"][0]["clearance"] = f"{3.0 + 0.1 * index + 0.001 * number:.3f} mm"
    return data


def plain_tree(root: Path, pages: int, average_bytes: int) -> None:
    """Plain Markdown pages: a heading and paragraphs, about the generated pages' average size."""
    paragraph = "Plain text for the benchmark, with nothing but words in it. " * 8
    body = (paragraph + "\n\n") * max(1, average_bytes // (len(paragraph) + 2))
    for number in range(pages):
        path = root / f"section-{number // 100:03d}" / f"page-{number:05d}.md"
        path.parent.mkdir(parents=True, exist_ok=True)
        path.write_text(f"# Page {number}\n\n## Part one\n\n{body}\n## Part two\n\n{body}", encoding="utf-8")
    (root / "index.md").write_text("# Plain pages\n", encoding="utf-8")


class Stopwatch:
    """CPU time spent inside an iterator (reviewing builds), apart from what the consumer does with them."""

    def __init__(self):
        self.spent = 0.0

    def timed(self, iterator):
        iterator = iter(iterator)
        while True:
            started = time.process_time()
            try:
                item = next(iterator)
            except StopIteration:
                self.spent += time.process_time() - started
                return
            self.spent += time.process_time() - started
            yield item


def children_cpu() -> float:
    usage = resource.getrusage(resource.RUSAGE_CHILDREN)
    return usage.ru_utime + usage.ru_stime


def mkdocs_build(config: Path) -> float:
    """CPU seconds MkDocs spent building (CPU time, so other load on the machine does not count)."""
    started = children_cpu()
    result = subprocess.run([sys.executable, "-m", "mkdocs", "build", "--quiet", "-f", str(config)], capture_output=True, text=True, env=ENVIRONMENT)
    if result.returncode != 0:
        raise SystemExit(f"mkdocs failed on {config}:\n{result.stdout}{result.stderr}")
    return children_cpu() - started


def plain_config(docs: Path, site: Path, shim: str) -> str:
    return (
        f"site_name: Plain pages\ndocs_dir: {json.dumps(str(docs))}\nsite_dir: {json.dumps(str(site))}\nuse_directory_urls: false\n"
        "theme:\n  name: material\n  font: false\nplugins:\n  - search\n  - offline\n"
        f"extra:\n  generator: false\n  polyfills:\n    - {json.dumps(shim)}\n"
        "markdown_extensions:\n  - admonition\n  - tables\n  - toc:\n      permalink: true\n"
        "nav:\n  - Home: index.md\nvalidation:\n  nav:\n    omitted_files: ignore\n"
    )


def full_nav(config_text: str, docs: Path) -> str:
    """The generated config with a sidebar entry for every page of every build."""
    config = yaml.safe_load(config_text)
    pages = sorted(str(p.relative_to(docs)) for p in docs.rglob("*.md") if p.parts[-3:-1] != ("status",))
    config["nav"] = [{"Archive": "index.md"}, {"Every page": [{p: p} for p in pages if p.startswith("builds/")]}]
    return yaml.safe_dump(config, sort_keys=False)


def one_size(builds: int, revisions: int, with_full_nav: bool) -> dict:
    """Run in a fresh process: every timing and the peak memory of one archive size."""
    from dossier.collect.archive import each_build, open_archive
    from dossier.pages.tree import write_tree
    from dossier.render.mkdocs_run import run_mkdocs, source_epoch, write_config

    with tempfile.TemporaryDirectory(prefix="dossier-bench-") as scratch:
        work = Path(scratch)
        archive = synthetic_archive(work / "archive", builds, revisions)
        wall = time.perf_counter()
        started = time.process_time()
        opened, problems = open_archive(archive)
        reviewing = Stopwatch()
        tree = write_tree(opened, work / "pages", reviewing.timed(each_build(opened, problems, jobs=1)))
        assert not problems, problems
        collect_s = reviewing.spent
        generate_s = time.process_time() - started - collect_s
        pages = tree.pages
        config = write_config(opened.settings, tree, work, "pages", "site")
        started = children_cpu()
        run_mkdocs(config, source_epoch(tree.newest))
        render_s = children_cpu() - started
        wall_s = time.perf_counter() - wall
        sizes = [p.stat().st_size for p in (work / "pages").rglob("*.md")]
        plain_tree(work / "plain", pages, sum(sizes) // len(sizes))
        plain = work / "plain.yml"
        plain.write_text(plain_config(work / "plain", work / "plain-site", "assets/dossier/vendor/iframe-worker/shim.js"), encoding="utf-8")
        plain_s = mkdocs_build(plain)
        full_s = None
        if with_full_nav:
            wide = work / "full-nav.yml"
            wide.write_text(full_nav(config.read_text(encoding="utf-8"), work / "pages").replace("site_dir: site", "site_dir: full-site"), encoding="utf-8")
            full_s = mkdocs_build(wide)
        serial_s, parallel_s = collect_walls(archive, work)
        rebuilds = rebuild_times(archive, work)
    own_kb = resource.getrusage(resource.RUSAGE_SELF).ru_maxrss
    mkdocs_kb = resource.getrusage(resource.RUSAGE_CHILDREN).ru_maxrss  # the largest MkDocs run
    return {
        "builds": builds, "revisions": revisions, "pages": pages, "collect_s": collect_s, "generate_s": generate_s,
        "render_s": render_s, "plain_s": plain_s, "full_nav_s": full_s, **rebuilds, "serial_s": serial_s, "parallel_s": parallel_s, "peak_mb": own_kb / 1024, "mkdocs_peak_mb": mkdocs_kb / 1024, "wall_s": wall_s,
    }


def collect_walls(archive: Path, work: Path) -> tuple[float, float]:
    """Wall seconds of writing the page tree (no drawing cache, no render): one process, then every core."""
    from dossier.commands.build import build_site

    serial = _timed(lambda: build_site(archive, work / "tree-1", pages_only=True, jobs=1))
    parallel = _timed(lambda: build_site(archive, work / "tree-n", pages_only=True))
    return serial, parallel


def rebuild_times(archive: Path, work: Path, kept_only: bool = False) -> dict:
    """Wall seconds of `dossier build` with a filled drawing cache: nothing changed (rendered again, and with
    the rendered site kept), then one record changed. kept_only: only the build that keeps the site."""
    from dossier.commands.build import build_site
    from dossier.collect.caches import Caches

    caches = Caches(Caches.in_folder(work / "caches").drawings, None)  # PDFs are timed on their own, see docs
    build = lambda reuse=True: build_site(archive, work / "out", cache=caches, reuse=reuse)  # noqa: E731
    times = {"fill_s": _timed(build)}
    kept = build_site(archive, work / "out", cache=caches)
    assert not kept.replaced, "an unchanged archive must keep its rendered site"
    times["kept_s"] = kept.seconds
    if kept_only:
        return times
    times["warm_s"] = _timed(lambda: build(reuse=False))
    record = sorted(archive.glob("*/rev-A.yaml"))[0]
    record.write_text(record.read_text(encoding="utf-8").replace("Synthetic charger", "Edited synthetic charger", 1), encoding="utf-8")
    times["changed_s"] = _timed(build)
    return times


def kept_size(builds: int, revisions: int) -> dict:
    """Run in a fresh process: only the rebuilds of one archive size (the fill, and the build that keeps the site)."""
    with tempfile.TemporaryDirectory(prefix="dossier-bench-") as scratch:
        work = Path(scratch)
        archive = synthetic_archive(work / "archive", builds, revisions)
        return {"builds": builds, "revisions": revisions, **rebuild_times(archive, work, kept_only=True)}


def _timed(step) -> float:
    started = time.perf_counter()
    step()
    return time.perf_counter() - started


def row(result: dict) -> str:
    total = result["collect_s"] + result["generate_s"] + result["render_s"]
    per_page = 1000 * result["render_s"] / result["pages"]
    full = result["full_nav_s"]
    full_text = f"{full:8.1f} {1000 * full / result['pages']:9.1f}" if full else f"{'-':>8} {'-':>9}"
    return (
        f"{result['builds']:6d} {result['pages']:6d} {result['collect_s']:8.1f} {result['generate_s']:8.1f} {result['render_s']:8.1f} "
        f"{total / result['builds']:8.2f} {per_page:9.1f} {result['plain_s']:8.1f} {result['render_s'] / result['plain_s']:6.2f} {full_text} {result['peak_mb']:8.0f} {result['mkdocs_peak_mb']:8.0f} {result['wall_s']:8.1f} {result['warm_s']:8.1f} {result['kept_s']:8.1f} {result['changed_s']:8.1f} {result['serial_s']:8.1f} {result['parallel_s']:8.1f}"
    )


HEADER = (
    f"{'builds':>6} {'pages':>6} {'collect':>8} {'generate':>8} {'render':>8} {'s/build':>8} {'ms/page':>9} {'plain':>8} {'ratio':>6} "
    f"{'fullnav':>8} {'ms/page':>9} {'peak MB':>8} {'MkDocs':>8} {'wall':>8} {'warm':>8} {'kept':>8} {'1 edit':>8} {'tree 1p':>8} {'tree Np':>8}"
)


def main() -> None:
    parser = argparse.ArgumentParser(description=__doc__, formatter_class=argparse.RawDescriptionHelpFormatter)
    parser.add_argument("--sizes", default="10,25,50,100", help="comma-separated numbers of builds")
    parser.add_argument("--revisions", type=int, default=2, help="revisions per build")
    parser.add_argument("--full-nav-up-to", type=int, default=100, help="also render with a full sidebar up to this many builds")
    parser.add_argument("--kept-only", action="store_true", help="time only the rebuild that keeps an unchanged site (and the build before it)")
    parser.add_argument("--one", type=int, help=argparse.SUPPRESS)
    args = parser.parse_args()
    if args.one is not None:
        measured = kept_size(args.one, args.revisions) if args.kept_only else one_size(args.one, args.revisions, args.one <= args.full_nav_up_to)
        print(json.dumps(measured))
        return
    if args.kept_only:
        return kept_rows(args)
    print("CPU seconds unless marked (so other load on the machine does not count); wall = elapsed build time;")
    print("ratio = render / plain, MkDocs on dossier's pages against MkDocs alone on as many plain pages")
    print(HEADER)
    results = []
    for size in (int(s) for s in args.sizes.split(",")):
        results.append(measure_in_child(size, args))
        print(row(results[-1]), flush=True)
    save(results, RESULTS)


def kept_rows(args) -> None:
    print("wall seconds of `dossier build` with a filled drawing cache: the build before, then nothing changed")
    print(f"{'builds':>6} {'build':>8} {'kept':>8}")
    results = []
    for size in (int(s) for s in args.sizes.split(",")):
        results.append(measure_in_child(size, args, "--kept-only"))
        print(f"{size:6d} {results[-1]['fill_s']:8.1f} {results[-1]['kept_s']:8.1f}", flush=True)
    save(results, RESULTS.with_name("site-kept.json"))


def measure_in_child(size: int, args, *extra: str) -> dict:
    command = [sys.executable, __file__, "--one", str(size), "--revisions", str(args.revisions), "--full-nav-up-to", str(args.full_nav_up_to), *extra]
    output = subprocess.run(command, capture_output=True, text=True, check=True, env=ENVIRONMENT).stdout
    return json.loads(output.strip().splitlines()[-1])


def save(results: list, path: Path) -> None:
    path.parent.mkdir(parents=True, exist_ok=True)
    path.write_text(json.dumps(results, indent=2), encoding="utf-8")


if __name__ == "__main__":
    main()
