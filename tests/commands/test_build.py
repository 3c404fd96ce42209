"""`dossier build`: the rendered site of the demo archive, offline, safe, deterministic and atomic."""

from __future__ import annotations

import datetime
import hashlib
import json
import re
import shutil

import pytest
from click.testing import CliRunner

from tests.fixtures.demo import DEMO
from dossier.cli import main
from dossier.commands.build import build_site, default_output
from dossier.ledger import Target, publish, save_ledger
from dossier.problems import InputError
from dossier.output.atomic import MARKER, OutputRefused
from dossier.render.mkdocs_run import RenderError
from tests.fixtures.site_kit import TEST_CALC, copy_demo, html_findings, tree_digest, write_record


@pytest.fixture(scope="module")
def site(demo_site):
    return demo_site


def test_the_demo_site_is_built_with_every_page(site):
    for path in ("index.html", "about.html", "status/design.html", "builds/solar-bank-charger/index.html", "builds/solar-bank-charger/rev-A/calcs.html", "builds/solar-bank-charger/changes.html", "search/search_index.js"):
        assert (site / path).is_file(), path
    assert (site / MARKER).is_file()


def test_pages_link_as_files_so_the_site_opens_from_a_folder(site):
    index = (site / "index.html").read_text(encoding="utf-8")
    assert 'href="builds/solar-bank-charger/index.html"' in index
    assert not re.search(r'href="[^"#:]*/"', index), "a link to a folder does not open over file://"


def test_nothing_is_loaded_from_the_network_and_no_script_comes_from_records(site):
    assert html_findings(site) == []
    for stylesheet in site.rglob("*.css"):
        assert not re.search(r"@import\s+url\(\s*['\"]?https?:|url\(\s*['\"]?https?://", stylesheet.read_text(encoding="utf-8")), stylesheet


def test_the_search_shim_is_served_locally(site):
    overview = (site / "builds/solar-bank-charger/index.html").read_text(encoding="utf-8")
    assert '<script src="../../assets/dossier/vendor/iframe-worker/shim.js"></script>' in overview
    assert "unpkg" not in overview and "fonts.googleapis" not in overview


def test_search_index_finds_titles_designators_parts_and_notes(site):
    index = json.loads((site / "search/search_index.json").read_text(encoding="utf-8"))
    current = [doc for doc in index["docs"] if doc["location"].startswith("builds/solar-bank-charger/index.html")]
    text = " ".join(doc["title"] + " " + doc["text"] for doc in current)
    for needle in ("24 V charger for the solar-station", "RT1", "ultrafast 200 V 8 A", "small mill"):
        assert needle in text, needle
    assert not any(doc["location"].startswith("builds/solar-bank-charger/rev-D/") for doc in index["docs"])


def _index_docs(site) -> list[dict]:
    return json.loads((site / "search/search_index.json").read_text(encoding="utf-8"))["docs"]


def _indexed_text(docs, prefix: str) -> str:
    return " ".join(doc["title"] + " " + doc["text"] for doc in docs if doc["location"].startswith(prefix))


FINDING_DETAILS = ("Values: ", "Limit: ", "Formula: ", "From the record: ", "Sources: ")


def test_search_index_keeps_each_finding_by_heading_verdict_and_code_and_leaves_its_details_to_the_page(site):
    docs = _index_docs(site)
    # demo: bench-psu-13v8 rev B, the current revision, fails HS1's temperature (THERM-HEATSINK)
    heatsink = next(doc for doc in docs if doc["location"] == "builds/bench-psu-13v8/calcs.html#hs1-temperature-hs1")
    assert heatsink["title"] == "HS1 temperature (HS1)"
    assert "fail: " in heatsink["text"] and "Code: THERM-HEATSINK" in heatsink["text"]
    calcs = [doc for doc in docs if doc["location"].split("#")[0].endswith("calcs.html")]
    assert len(calcs) > 100
    for doc in calcs:
        assert not any(detail in doc["text"] for detail in FINDING_DETAILS), doc["location"]
    for build in ("bench-psu-13v8", "solar-bank-charger", "rotator-control"):
        html = (site / "builds" / build / "calcs.html").read_text(encoding="utf-8")
        assert all(f"<li data-search-exclude>{detail}" in html for detail in FINDING_DETAILS), "the details stay on the page"
        explanation = re.search(r'<p data-search-exclude>([^<]{40,})</p>', html)[1]
        indexed = _indexed_text(docs, f"builds/{build}/calcs.html")
        assert explanation not in indexed
        codes = re.findall(r"<li>Code: ([A-Z0-9-]+)</li>", html)
        assert codes and all(f"Code: {code}" in indexed for code in codes), "every finding of the current revision is found by its code"


def test_search_index_leaves_out_what_every_page_repeats(site):
    from dossier.caution import MAINS_CAUTION

    docs = _index_docs(site)
    with_caution = {doc["location"].split("#")[0] for doc in docs if MAINS_CAUTION in doc["text"]}
    assert with_caution == {"about.html"}, "the caution is searchable on the about page only"
    for doc in docs:
        assert "Overview · Calculations" not in doc["text"] and "Publication ledger head" not in doc["text"], doc["location"]
        assert "A newer revision exists" not in doc["text"], doc["location"]
    checklist = _indexed_text(docs, "builds/solar-bank-charger/checklist.html")
    assert "Protective-earth continuity" in checklist and "pe-continuity" in checklist, "checklist items are found by title and id"
    assert "Source: " not in checklist and "____" not in checklist


def test_an_earlier_revision_is_searched_for_what_did_not_pass(site):
    docs = _index_docs(site)
    # demo: doubler-ht-supply rev A fails its HT rail as a hazard (RAILS-HAZARD); rev B is current
    earlier = _indexed_text(docs, "builds/doubler-ht-supply/rev-A/calcs.html")
    assert "Code: RAILS-HAZARD" in earlier and "fail: " in earlier
    assert "pass: " not in earlier and "info: " not in earlier, "passing findings repeat the current revision's"
    assert "Code: RAILS-HAZARD" in _indexed_text(docs, "builds/doubler-ht-supply/calcs.html")
    assert "300 V supply for the valve tester" in _indexed_text(docs, "builds/doubler-ht-supply/rev-A/index.html")
    assert not any(doc["location"].startswith("builds/doubler-ht-supply/rev-A/checklist.html") for doc in docs)


def test_a_calcs_page_is_tagged_in_search_with_the_codes_that_did_not_pass(site):
    # demo: bench-psu-13v8 rev B fails MAG-BARRIER-INSULATION and THERM-HEATSINK and passes its clearance (ISO-CLEARANCE);
    # the theme's search ranks a tag far above text, so a search for a code finds the pages where it did not pass first
    docs = [doc for doc in _index_docs(site) if doc["location"].split("#")[0] == "builds/bench-psu-13v8/calcs.html"]
    tags = {tag for doc in docs for tag in doc.get("tags", [])}
    assert {"MAG-BARRIER-INSULATION", "THERM-HEATSINK"} <= tags and "ISO-CLEARANCE" not in tags
    assert all(doc.get("tags") for doc in docs)
    passing = [doc for doc in _index_docs(site) if doc["location"].startswith("builds/solar-bank-charger/calcs.html")]
    assert passing and not any(doc.get("tags") for doc in passing), "rev D passes every check: no tags"
    assert "md-tag" not in (site / "builds/bench-psu-13v8/calcs.html").read_text(encoding="utf-8"), "tags are for search only"


def test_every_build_page_with_mains_carries_the_caution(site):
    from dossier.caution import MAINS_CAUTION, POWER_UP_CAUTION

    pages = [p for p in (site / "builds").rglob("*.html") if not p.name.startswith("checklist-")]
    texts = {path: path.read_text(encoding="utf-8") for path in pages}
    with_content = [path for path, text in texts.items() if "is the current revision of this build" not in text]
    assert len(with_content) > 20
    for path in with_content:
        # the checklist page carries the power-up caution (it also defers to local codes and licensed practice), once
        caution = POWER_UP_CAUTION if path.name == "checklist.html" else MAINS_CAUTION
        assert caution in texts[path], path


def test_unchanged_inputs_give_a_byte_identical_site(site, tmp_path, drawing_cache):
    again = tmp_path / "site"
    build_site(DEMO, again, cache=drawing_cache)
    assert tree_digest(again) == tree_digest(site)


def test_a_failed_render_leaves_the_previous_site_untouched(site, tmp_path, monkeypatch, drawing_cache):
    output = tmp_path / "site"
    shutil.copytree(site, output)
    before = tree_digest(output)

    def broken(config, epoch):
        raise RenderError("MkDocs failed on purpose")

    monkeypatch.setattr("dossier.output.incremental.run_mkdocs", broken)
    with pytest.raises(RenderError):
        build_site(DEMO, output, cache=drawing_cache, reuse=False)
    assert tree_digest(output) == before
    assert [p.name for p in tmp_path.iterdir()] == ["site"], "no work folder may be left behind"


def test_an_invalid_record_refuses_the_build_before_writing(tmp_path):
    archive = copy_demo(tmp_path / "archive")
    path = archive / "rotator-control" / "rev-A.yaml"
    path.write_text(path.read_text(encoding="utf-8").replace("nominal: 230 V", "nominal: 230"), encoding="utf-8")
    result = CliRunner().invoke(main, ["build", str(archive), "-o", str(tmp_path / "site")])
    assert result.exit_code == 2
    assert "rotator-control/rev-A.yaml:" in result.stderr and "mains.nominal" in result.stderr
    assert not (tmp_path / "site").exists()


def test_an_edited_published_revision_refuses_the_build(tmp_path):
    archive = tmp_path / "archive"
    write_record(archive, "amp", "A")
    ledger, _ = publish(archive, [Target.parse("amp")], datetime.date(2026, 1, 5))
    save_ledger(archive, ledger)
    path = archive / "amp" / "rev-A.yaml"
    path.write_text(path.read_text(encoding="utf-8").replace("2.5 mm", "3 mm"), encoding="utf-8")
    with pytest.raises(InputError) as refused:
        build_site(archive, tmp_path / "site", pages_only=True, calcs=[TEST_CALC])
    assert refused.value.problems[0].code == "published_changed"
    assert "new revision" in refused.value.problems[0].hint


def test_a_folder_dossier_did_not_write_is_never_replaced(tmp_path):
    output = tmp_path / "mine"
    output.mkdir()
    (output / "notes.txt").write_text("my own file", encoding="utf-8")
    with pytest.raises(OutputRefused):
        build_site(DEMO, output, pages_only=True)
    assert (output / "notes.txt").read_text(encoding="utf-8") == "my own file"


@pytest.mark.parametrize("inside", ["archive", "archive/sub", "."])
def test_the_output_may_not_be_the_archive_or_hold_it(tmp_path, inside):
    archive = tmp_path / "archive"
    write_record(archive, "amp", "A")
    with pytest.raises(OutputRefused):
        build_site(archive, tmp_path / inside, pages_only=True, calcs=[TEST_CALC])


def test_the_default_output_is_beside_the_archive():
    assert default_output(DEMO) == DEMO.parent / "site"


def test_hostile_record_text_renders_as_text(tmp_path):
    archive = tmp_path / "archive"
    archive.mkdir()
    (archive / "archive.yaml").write_text('club: "<script>alert(1)</script>"\ntitle: "A </title><script>alert(2)</script>"\ndescription: "[x](javascript:alert(3))"\n', encoding="utf-8")
    write_record(
        archive, "evil", "A",
        title="Evil </title><script>alert(4)</script> & <b>bold</b>",
        authors=["<svg onload=alert(5)>"],
        summary="<script>alert(6)</script> [x](javascript:alert(7)) ![p](https://tracker.example/p.png)\n\n[r]: javascript:alert(8)\n\n{: onclick=\"alert(9)\" }",
        notes='<img src=x onerror=alert(10)> <a href="javascript:alert(11)">a</a>',
        stages=[{"kind": "mains-input", "name": "<iframe src=javascript:alert(12)>", "side": "mains", "parts": [{"ref": "F1", "kind": "fuse", "value": "<img src=x onerror=alert(13)>", "role": "| a | b |"}]}],
    )
    output = tmp_path / "site"
    build_site(archive, output, calcs=[TEST_CALC])
    assert html_findings(output) == []
    overview = (output / "builds/evil/index.html").read_text(encoding="utf-8")
    assert "<title>Evil &lt;/title&gt;&lt;script&gt;alert(4)&lt;/script&gt; &amp; &lt;b&gt;bold&lt;/b&gt; - A &lt;/title&gt;" in overview
    assert "&lt;img src=x onerror=alert(13)&gt;" in overview


def test_build_command_reports_what_it_wrote(tmp_path, monkeypatch):
    archive = tmp_path / "archive"
    write_record(archive, "amp", "A")
    monkeypatch.setattr("dossier.plugins.load_calcs", lambda points=None: [TEST_CALC])
    monkeypatch.setattr("dossier.collect.archive.load_plugins", lambda: [TEST_CALC])
    result = CliRunner().invoke(main, ["build", str(archive), "-o", str(tmp_path / "out"), "--pages-only", "--no-cache", "--no-pdf"])
    assert result.exit_code == 0, result.output
    assert "wrote the page tree of 1 build" in result.output
    assert (tmp_path / "out" / "builds" / "amp" / "index.md").is_file()


def test_the_only_date_in_the_site_is_the_newest_record_date(site):
    from dossier.reading.archive import expand, load_revision

    newest = max(load_revision(rev).record.date for rev in expand([DEMO]))
    midnight = datetime.datetime.combine(newest, datetime.time(), tzinfo=datetime.timezone.utc)
    gz = (site / "sitemap.xml.gz").read_bytes()
    assert int.from_bytes(gz[4:8], "little") == int(midnight.timestamp())  # gzip header MTIME field


def test_a_long_build_shows_progress_on_standard_error(tmp_path, monkeypatch):
    archive = tmp_path / "archive"
    for number in range(20):
        write_record(archive, f"unit-{number:02d}", "A")
    monkeypatch.setattr("dossier.collect.archive.load_plugins", lambda: [TEST_CALC])
    command = ["build", str(archive), "-o", str(tmp_path / "out"), "--pages-only", "--no-cache", "--no-pdf"]  # progress only: no PDFs
    result = CliRunner().invoke(main, command)
    assert result.exit_code == 0, result.output
    assert "reviewing builds" in result.stderr
    quiet = CliRunner().invoke(main, command + ["--quiet"])
    assert quiet.exit_code == 0 and "reviewing builds" not in quiet.stderr


def test_an_output_under_a_file_is_refused_with_its_reason(tmp_path):
    blocker = tmp_path / "notes.txt"
    blocker.write_text("mine", encoding="utf-8")
    result = CliRunner().invoke(main, ["build", str(DEMO), "-o", str(blocker / "site"), "--pages-only"])
    assert result.exit_code == 2 and f"{blocker} is a file, not a folder" in result.stderr
    assert "Traceback" not in result.output and blocker.read_text(encoding="utf-8") == "mine"


def test_a_failed_write_is_a_message_naming_the_path(tmp_path, monkeypatch):
    def disk_full(*args, **kwargs):
        raise OSError(28, "No space left on device", str(tmp_path / "site"))

    monkeypatch.setattr("dossier.commands.build.finish_tree", disk_full)
    result = CliRunner().invoke(main, ["build", str(DEMO), "-o", str(tmp_path / "site"), "--pages-only", "--no-cache"])
    assert result.exit_code == 2
    assert f"cannot write {tmp_path / 'site'}: No space left on device; nothing was replaced" in result.stderr
    assert "Traceback" not in result.output
