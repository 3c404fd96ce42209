"""Hostile text in any record field is shown as text in the built site, never run."""

from __future__ import annotations

import shutil
from pathlib import Path

import pytest
import yaml

from tests.browser.conftest import ROOT, build_site, html_pages

MARK = "window.__dossier_pwned = 1"
HOSTILE = [
    f"<script>{MARK}</script>",
    f'<img src="x" onerror="{MARK}">',
    f"[click me](javascript:{MARK})",
    f'<a href="javascript:{MARK}">link</a>',
    f'<svg onload="{MARK}"></svg>',
    f'<iframe src="javascript:{MARK}"></iframe>',
    f"{{{{ {MARK} }}}} {{% raw %}}",
    f'"><script>{MARK}</script>',
    f"<details open ontoggle=\"{MARK}\">x</details>",
]


def hostile_record(source: dict, text: str) -> dict:
    record = dict(source)
    record["title"] = f"Hostile {HOSTILE[0]} {HOSTILE[1]}"
    record["summary"] = f"Summary {text}"
    record["changes"] = f"Changes {text}"
    record["notes"] = f"Notes {text}\n\n{text}"
    record["authors"] = [f"Author {text}"]
    stages = [dict(stage) for stage in record["stages"]]
    stages[0] = dict(stages[0], name=f"Stage {text}", notes=text)
    stages[0]["parts"] = [dict(part, value=f"{part.get('value', '')} {text}", note=text) for part in stages[0]["parts"]]
    record["stages"] = stages
    record["barriers"] = [dict(b, name=f"barrier {text}") for b in record["barriers"]]
    record["attachments"] = [dict(a, caption=f"Caption {text}") for a in record.get("attachments", [])]
    return record


@pytest.fixture(scope="module")
def hostile_site(tmp_path_factory) -> Path:
    archive = tmp_path_factory.mktemp("hostile") / "archive"
    build = archive / "solar-bank-charger"
    build.mkdir(parents=True)
    shutil.copy(ROOT / "demo" / "archive" / "archive.yaml", archive / "archive.yaml")
    demo_build = ROOT / "demo" / "archive" / "solar-bank-charger"
    for folder in ("photos", "sheets"):  # the files rev C attaches
        shutil.copytree(demo_build / folder, build / folder)
    source = yaml.safe_load((demo_build / "rev-C.yaml").read_text(encoding="utf-8"))
    text = " | ".join(HOSTILE)
    (build / "rev-C.yaml").write_text(yaml.safe_dump(hostile_record(source, text), sort_keys=False, allow_unicode=True), encoding="utf-8")
    return build_site(archive, archive.parent / "site")


def test_no_script_from_a_record_runs_on_any_page(hostile_site, watched_page):
    watch = watched_page(("file://", "data:", "blob:"))
    pages = html_pages(hostile_site)
    assert len(pages) > 5
    for page in pages:
        watch.page.goto(page.as_uri(), wait_until="load")
        for link in watch.page.locator("a[href^='javascript:']").all():
            pytest.fail(f"{page.name} has a javascript: link: {link.get_attribute('href')}")
        watch.page.wait_for_timeout(50)
        assert watch.page.evaluate("typeof window.__dossier_pwned") == "undefined", page


def test_hostile_text_is_shown_as_text(hostile_site, watched_page):
    watch = watched_page(("file://", "data:", "blob:"))
    watch.page.goto((hostile_site / "builds" / "solar-bank-charger" / "index.html").as_uri(), wait_until="load")
    body = watch.page.locator("article").inner_text()
    assert "<script>window.__dossier_pwned = 1</script>" in body
    assert watch.page.locator("article script, article iframe, article img[onerror], article svg[onload]").count() == 0
