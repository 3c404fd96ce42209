"""Helpers shared by the site, diff and lock tests: small archives written on the fly, an HTML scanner."""

from __future__ import annotations

import shutil
from html.parser import HTMLParser
from pathlib import Path

import pytest
import yaml

from conftest import DEMO
from dossier.findings import Finding, Measure, common_practice, judge
from dossier.plugins import Calc
from dossier.units import Q_


def record_data(build_id: str, letter: str = "A", **changes) -> dict:
    """A small valid record with mains, one barrier and one stage; keyword arguments replace keys."""
    data = {
        "id": build_id,
        "title": f"Test build {build_id}",
        "revision": letter,
        "date": "2026-01-0" + str(min(9, "ABCDEFGHI".index(letter[-1]) + 1)),
        "authors": ["Test Author"],
        "status": "design",
        "summary": "A unit for the tests.",
        "mains": {"nominal": "230 V", "frequency": "50 Hz"},
        "stages": [{"kind": "mains-input", "name": "Mains input", "side": "mains", "parts": [{"ref": "F1", "kind": "fuse", "value": "T1A", "role": "mains fuse"}]}],
        "barriers": [{"name": "primary to output", "between": ["mains", "output"], "grade": "reinforced", "material_group": "II", "creepage": "6 mm", "clearance": "2.5 mm"}],
        "notes": "Wound on the club's winder.",
    }
    data.update(changes)
    return data


def write_record(archive: Path, build_id: str, letter: str = "A", **changes) -> Path:
    folder = archive / build_id
    folder.mkdir(parents=True, exist_ok=True)
    path = folder / f"rev-{letter}.yaml"
    path.write_text(yaml.safe_dump(record_data(build_id, letter, **changes), sort_keys=False, allow_unicode=True), encoding="utf-8")
    return path


def copy_demo(target: Path) -> Path:
    shutil.copytree(DEMO, target, ignore=shutil.ignore_patterns("published.yaml"))
    return target


def _clearance_run(record):
    """A stand-in calc: declared clearance against a fixed 4 mm, so tests do not depend on the real calcs."""
    for index, barrier in enumerate(record.barriers):
        required = Q_(4, "mm")
        yield Finding(
            code="TEST-CLEARANCE",
            calc="testcalc",
            subject=barrier.name,
            title="Clearance",
            verdict=judge(barrier.clearance, required, ">=", 0.1),
            values=(Measure("declared clearance", barrier.clearance),),
            limit=Measure("required clearance", required),
            method="declared >= 4 mm",
            keys=(("barriers", index, "clearance"),),
            sources=(common_practice("a fixed figure for the tests"),),
        )


TEST_CALC = Calc(name="testcalc", title="Test clearance", run=_clearance_run, summary="A calc for the tests.", codes={"TEST-CLEARANCE": "clearance against 4 mm"})


class HtmlScan(HTMLParser):
    """Anything in rendered HTML that could run script or load from the network."""

    THEME_SCRIPTS = ("__md_scope", "__config", "palette", "target=document", "__md_get", "__md_hash")

    def __init__(self):
        super().__init__(convert_charrefs=True)
        self.findings: list[str] = []
        self._script: list[str] | None = None

    def handle_starttag(self, tag, attrs):
        values = dict(attrs)
        for name, value in attrs:
            if name.startswith("on"):
                self.findings.append(f"<{tag} {name}=...>")
            if value and value.strip().lower().startswith(("javascript:", "vbscript:", "data:text")):
                self.findings.append(f"<{tag} {name}={value}>")
        if tag in ("iframe", "object", "embed", "base", "style") or (tag == "form" and "md-search__form" not in values.get("class", "")):
            self.findings.append(f"<{tag}>")
        for name in ("src", "srcset", "data"):
            if values.get(name, "").startswith(("http:", "https:", "//")):
                self.findings.append(f"<{tag} {name}={values[name]}> loads from the network")
        if tag == "link" and values.get("href", "").startswith(("http:", "https:", "//")) and values.get("rel") in ("stylesheet", "preconnect", "preload", "modulepreload"):
            self.findings.append(f"<link href={values['href']}> loads from the network")
        if tag == "script" and values.get("type") != "application/json":  # JSON data is never run
            self._script = []

    def handle_data(self, data):
        if self._script is not None:
            self._script.append(data)

    def handle_endtag(self, tag):
        if tag == "script" and self._script is not None:
            body = "".join(self._script).strip()
            if body and not any(marker in body for marker in self.THEME_SCRIPTS):
                self.findings.append(f"unexpected inline script: {body[:60]!r}")
            self._script = None


def html_findings(site: Path, skip=("checklist-a4.html", "checklist-letter.html")) -> list[str]:
    found = []
    for path in sorted(site.rglob("*.html")):
        if path.name in skip:
            continue
        scan = HtmlScan()
        scan.feed(path.read_text(encoding="utf-8"))
        found.extend(f"{path.relative_to(site)}: {item}" for item in scan.findings)
    return found


# Fixtures imported into several test modules get one definition per module; these module-level
# stores make each of them built once per test run all the same.
_ONCE: dict[str, object] = {}


@pytest.fixture(scope="session")
def drawing_cache(tmp_path_factory):
    """One drawing and PDF cache for every site test, so each schematic and sheet is made once per test run."""
    from dossier.collect.caches import Caches

    if "cache" not in _ONCE:
        _ONCE["cache"] = Caches.in_folder(tmp_path_factory.mktemp("caches"))
    return _ONCE["cache"]


@pytest.fixture(scope="session")
def demo_site(tmp_path_factory, drawing_cache):
    """The demo archive's rendered site, built once per test run."""
    from dossier.commands.build import build_site

    if "site" not in _ONCE:
        output = tmp_path_factory.mktemp("demo") / "site"
        build_site(DEMO, output, cache=drawing_cache)
        _ONCE["site"] = output
    return _ONCE["site"]


def test_scanner_flags_script_and_network_loads():
    scan = HtmlScan()
    scan.feed('<img src="https://x.example/p.png"><a href="javascript:alert(1)">x</a><p onclick="x">y</p><script>alert(1)</script>')
    assert len(scan.findings) == 4


def test_scanner_passes_plain_markup():
    scan = HtmlScan()
    scan.feed('<p>&lt;script&gt;alert(1)&lt;/script&gt; <a href="https://example.org/">ok</a> <img src="figures/a.svg"></p>')
    assert scan.findings == []
