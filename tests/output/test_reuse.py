"""A site already rendered from the same page tree is kept, not rendered again; any change renders it."""

from __future__ import annotations

import shutil

import pytest
from click.testing import CliRunner

from tests.fixtures.demo import DEMO
from dossier.cli import main
from dossier.commands.build import build_site
from dossier.output import fingerprint
from dossier.output.atomic import MARKER
from tests.fixtures.site_kit import TEST_CALC, tree_digest, write_record


class CountingRenderer:
    """Stands in for MkDocs: writes a one-page site from the tree and counts the renders."""

    def __init__(self):
        self.calls = 0

    def __call__(self, config, epoch):
        self.calls += 1
        site = config.parent / "site"
        site.mkdir()
        (site / "index.html").write_text(f"render {self.calls}", encoding="utf-8")


@pytest.fixture
def renderer(monkeypatch):
    counting = CountingRenderer()
    monkeypatch.setattr("dossier.output.incremental.run_mkdocs", counting)
    return counting


@pytest.fixture
def archive(tmp_path):
    root = tmp_path / "archive"
    write_record(root, "amp")
    return root


def test_the_demo_site_rebuilt_with_nothing_changed_is_kept_without_rendering(demo_site, tmp_path, drawing_cache, renderer):
    output = tmp_path / "site"
    shutil.copytree(demo_site, output)
    before = tree_digest(output)
    built = build_site(DEMO, output, cache=drawing_cache)
    assert not built.replaced and renderer.calls == 0
    assert tree_digest(output) == before


def test_a_changed_record_renders_the_site_again(archive, tmp_path, renderer):
    output = tmp_path / "site"
    build_site(archive, output, calcs=[TEST_CALC])
    write_record(archive, "amp", summary="A unit for the tests, rewired.")
    built = build_site(archive, output, calcs=[TEST_CALC])
    assert built.replaced and renderer.calls == 2
    assert (output / "index.html").read_text(encoding="utf-8") == "render 2"


def test_an_unchanged_archive_is_not_rendered_twice(archive, tmp_path, renderer):
    output = tmp_path / "site"
    first = build_site(archive, output, calcs=[TEST_CALC])
    second = build_site(archive, output, calcs=[TEST_CALC])
    assert first.replaced and not second.replaced and renderer.calls == 1


@pytest.mark.parametrize("tamper", ["edit", "remove", "add"])
def test_a_site_changed_by_hand_is_rendered_again(archive, tmp_path, renderer, tamper):
    output = tmp_path / "site"
    build_site(archive, output, calcs=[TEST_CALC])
    page = output / "index.html"
    {"edit": lambda: page.write_text("edited by hand", encoding="utf-8"), "remove": page.unlink, "add": lambda: (output / "extra.html").write_text("x", encoding="utf-8")}[tamper]()
    built = build_site(archive, output, calcs=[TEST_CALC])
    assert built.replaced and renderer.calls == 2
    assert page.read_text(encoding="utf-8") == "render 2" and not (output / "extra.html").exists()


def test_a_new_renderer_version_renders_the_site_again(archive, tmp_path, renderer, monkeypatch):
    output = tmp_path / "site"
    build_site(archive, output, calcs=[TEST_CALC])
    monkeypatch.setattr(fingerprint, "_version", lambda distribution: f"{distribution} 99.0")
    assert build_site(archive, output, calcs=[TEST_CALC]).replaced and renderer.calls == 2


def test_without_reuse_the_site_is_always_rendered(archive, tmp_path, renderer):
    output = tmp_path / "site"
    build_site(archive, output, calcs=[TEST_CALC])
    assert build_site(archive, output, calcs=[TEST_CALC], reuse=False).replaced and renderer.calls == 2


def test_a_marker_without_fingerprints_renders_the_site_again(archive, tmp_path, renderer):
    output = tmp_path / "site"
    build_site(archive, output, calcs=[TEST_CALC])
    (output / MARKER).write_text("Written by dossier.\n", encoding="utf-8")
    assert build_site(archive, output, calcs=[TEST_CALC]).replaced and renderer.calls == 2


def test_the_marker_holds_both_fingerprints(archive, tmp_path, renderer):
    output = tmp_path / "site"
    build_site(archive, output, calcs=[TEST_CALC])
    stamped = fingerprint.read_stamp(output / MARKER)
    assert set(stamped) == {"pages", "site"} and all(len(value) == 64 for value in stamped.values())
    assert stamped["site"] == fingerprint.folder_digest(output, frozenset({MARKER}))


def test_the_command_says_the_site_was_kept_and_no_cache_renders_it(tmp_path, monkeypatch, renderer):
    from dossier.collect.caches import Caches

    monkeypatch.setattr("dossier.commands.build.user_caches", lambda use_cache=True, pdfs=True: Caches(Caches.in_folder(tmp_path / "caches").drawings) if use_cache else Caches())
    archive = tmp_path / "archive"
    write_record(archive, "amp")
    command = ["build", str(archive), "-o", str(tmp_path / "site"), "--no-pdf"]
    assert CliRunner().invoke(main, command).exit_code == 0
    kept = CliRunner().invoke(main, command)
    assert kept.exit_code == 0 and "kept it as it is" in kept.stdout and renderer.calls == 1
    again = CliRunner().invoke(main, [*command, "--no-cache"])
    assert again.exit_code == 0 and "wrote the site of 1 build" in again.stdout and renderer.calls == 2


def test_the_preview_says_when_no_page_changed(tmp_path, monkeypatch, renderer, capsys):
    from dossier.commands.serve import preview_build
    from dossier.collect.caches import Caches

    monkeypatch.setattr("dossier.collect.caches.user_caches", lambda use_cache=True, pdfs=True: Caches(Caches.in_folder(tmp_path / "caches").drawings))
    archive = tmp_path / "archive"
    write_record(archive, "amp")
    assert preview_build(archive, tmp_path / "preview") and preview_build(archive, tmp_path / "preview")
    said = capsys.readouterr().err.splitlines()
    assert said[0].startswith("built ") and said[1].startswith("no page changed; the preview stays as it was")
    assert renderer.calls == 1


def test_the_preview_reports_a_failed_write_and_keeps_serving(tmp_path, monkeypatch, capsys):
    from dossier.commands.serve import preview_build

    def denied(source, output, **options):
        raise OSError(13, "Permission denied", str(output))

    monkeypatch.setattr("dossier.commands.build.build_site", denied)
    assert preview_build(tmp_path / "archive", tmp_path / "preview") is False
    assert f"cannot write {tmp_path / 'preview'}: Permission denied; the preview stays as it was" in capsys.readouterr().err


def _cached(tmp_path):
    from dossier.collect.caches import Caches

    caches = Caches.in_folder(tmp_path / "caches")
    return Caches(caches.drawings, None, caches.builds, caches.renders)


def test_with_the_build_cache_an_unchanged_archive_is_kept_without_writing_its_tree(archive, tmp_path, renderer):
    output, caches = tmp_path / "site", _cached(tmp_path)
    first = build_site(archive, output, calcs=[TEST_CALC], cache=caches)
    assert caches.builds.link  # a site's tree is thrown away once rendered: the store may be linked into it
    caches = _cached(tmp_path)  # counts afresh
    kept = build_site(archive, output, calcs=[TEST_CALC], cache=caches)
    assert not kept.replaced and renderer.calls == 1
    assert (caches.builds.hits, caches.builds.misses) == (0, 0)  # no build was even looked up
    assert (kept.builds, kept.pages) == (first.builds, first.pages)


def test_the_quick_keep_follows_a_changed_file_a_touched_site_and_an_edited_site(archive, tmp_path, renderer):
    import os

    output = tmp_path / "site"
    build_site(archive, output, calcs=[TEST_CALC], cache=_cached(tmp_path))
    page = output / "index.html"
    os.utime(page, ns=(1, 1))  # touched, same bytes: looked at again, and kept
    assert not build_site(archive, output, calcs=[TEST_CALC], cache=_cached(tmp_path)).replaced and renderer.calls == 1
    page.write_text(page.read_text(encoding="utf-8").replace("render", "rendxr"), encoding="utf-8")  # same size, other bytes
    assert build_site(archive, output, calcs=[TEST_CALC], cache=_cached(tmp_path)).replaced and renderer.calls == 2
    (archive / "amp" / "photo.txt").write_text("a file beside the record", encoding="utf-8")
    caches = _cached(tmp_path)
    assert not build_site(archive, output, calcs=[TEST_CALC], cache=caches).replaced  # same pages, so the same site
    assert caches.builds.misses == 1 and renderer.calls == 2  # but the build was reviewed again to know it
    write_record(archive, "amp", summary="A unit for the tests, rewired.")
    assert build_site(archive, output, calcs=[TEST_CALC], cache=_cached(tmp_path)).replaced and renderer.calls == 3


def test_a_kept_site_says_its_warnings_again(archive, tmp_path, renderer, monkeypatch):
    output = tmp_path / "site"
    monkeypatch.setattr("dossier.pages.tree._failures", lambda build: [f"{build.id}: a drawing could not be made"])
    first = build_site(archive, output, calcs=[TEST_CALC], cache=_cached(tmp_path))
    kept = build_site(archive, output, calcs=[TEST_CALC], cache=_cached(tmp_path))
    assert not kept.replaced and kept.warnings == first.warnings == ["amp: a drawing could not be made"]


def test_the_tree_lists_every_file_it_holds_with_its_hash(tmp_path, calcs):
    """The renderer's fingerprint is made from this list, not from reading the tree again: it must be the tree."""
    from dossier.collect.archive import open_archive
    from dossier.pages.reuse import each_build_pages
    from dossier.pages.tree import finish_tree
    from tests.fixtures.site_kit import copy_demo

    archive = copy_demo(tmp_path / "archive")
    for attempt in ("written", "from the cache"):
        opened, problems = open_archive(archive, calcs)
        root = tmp_path / attempt
        tree = finish_tree(opened, root, each_build_pages(opened, problems, root, _cached(tmp_path)))
        assert {path: facts.sha256 for path, facts in tree.files.items()} == fingerprint.file_hashes(root), attempt


@pytest.mark.parametrize("change", ["renderer version", "setting"])
def test_the_quick_keep_misses_on_a_new_renderer_or_a_setting(archive, tmp_path, renderer, monkeypatch, change):
    """What the archive's fingerprint holds besides the build folders: each change means looking again."""
    output = tmp_path / "site"
    build_site(archive, output, calcs=[TEST_CALC], cache=_cached(tmp_path))
    if change == "renderer version":
        monkeypatch.setattr(fingerprint, "_version", lambda distribution: f"{distribution} 99.0")
    else:
        (archive / "archive.yaml").write_text("title: Another club's archive\n", encoding="utf-8")
    caches = _cached(tmp_path)
    built = build_site(archive, output, calcs=[TEST_CALC], cache=caches)
    assert caches.builds.hits + caches.builds.misses == 1  # the build was looked up: no quick keep
    assert built.replaced and renderer.calls == 2


def test_an_archive_kept_at_once_shows_no_progress_bar(tmp_path, monkeypatch, renderer):
    from dossier.collect.caches import Caches

    archive = tmp_path / "archive"
    for number in range(20):  # enough builds for the progress bar
        write_record(archive, f"unit-{number:02d}", "A")
    monkeypatch.setattr("dossier.collect.archive.load_plugins", lambda: [TEST_CALC])
    monkeypatch.setattr("dossier.commands.build.user_caches", lambda use_cache=True, pdfs=True: Caches.in_folder(tmp_path / "caches"))
    command = ["build", str(archive), "-o", str(tmp_path / "site"), "--no-pdf"]
    first = CliRunner().invoke(main, command)
    assert first.exit_code == 0 and "reviewing builds" in first.stderr
    kept = CliRunner().invoke(main, command)
    assert kept.exit_code == 0 and "kept it as it is" in kept.stdout and "reviewing builds" not in kept.stderr


@pytest.mark.parametrize("damage", ["not json", "a file missing from its hashes", "no stats"])
def test_a_damaged_render_record_only_means_reading_the_site_again(archive, tmp_path, renderer, damage):
    import json

    output = tmp_path / "site"
    build_site(archive, output, calcs=[TEST_CALC], cache=_cached(tmp_path))
    (record,) = (tmp_path / "caches" / "renders").glob("*.json")
    data = json.loads(record.read_text(encoding="utf-8"))
    if damage == "not json":
        record.write_text("{", encoding="utf-8")
    elif damage == "no stats":
        del data["stats"]
        record.write_text(json.dumps(data), encoding="utf-8")
    else:
        data["site"] = {}
        record.write_text(json.dumps(data), encoding="utf-8")
    kept = build_site(archive, output, calcs=[TEST_CALC], cache=_cached(tmp_path))
    assert not kept.replaced and renderer.calls == 1  # the site was read, found unchanged and kept
