"""The build cache: an unchanged build's pages come from it; anything that can change a finding or a page misses it."""

from __future__ import annotations

import importlib
import json
import sys
import zipfile

import pytest
from click.testing import CliRunner

from dossier.cli import main
from dossier.collect import code_version
from dossier.collect.build_store import BuildStore
from dossier.files import FileFacts
from dossier.collect.caches import Caches
from dossier.commands.build import build_site
from tests.fixtures.site_kit import TEST_CALC, copy_demo

PLUGIN = "fakecalc_for_cache_tests"
PLUGIN_SOURCE = '''
from dossier.findings import Finding, Measure, Verdict, common_practice
from dossier.plugins import Calc
from dossier.units import Q_

LIMIT_MM = {limit}


def run(record):
    yield Finding(code="FAKE-GAP", calc="fakecalc", subject="the unit", title="Fake gap", verdict=Verdict.INFO,
                  values=(Measure("fake limit", Q_(LIMIT_MM, "mm")),), method="a figure for the tests",
                  sources=(common_practice("a figure for the tests"),))


CALC = Calc(name="fakecalc", title="Fake calc", run=run, summary="A calc for the cache tests.", codes={{"FAKE-GAP": "a fixed figure"}})
'''


@pytest.fixture
def plugin(tmp_path, monkeypatch):
    """A calc plugin installed in tmp_path: a package with a distribution's metadata, whose source and version a test may change."""
    site = tmp_path / "plugins"
    package = site / PLUGIN
    package.mkdir(parents=True)
    (package / "__init__.py").write_text(PLUGIN_SOURCE.format(limit=7), encoding="utf-8")
    _write_distribution(site, "1.0")
    monkeypatch.syspath_prepend(str(site))
    module = importlib.import_module(PLUGIN)
    code_version.forget()
    yield module
    sys.modules.pop(PLUGIN, None)
    code_version.forget()


def _write_distribution(site, version: str) -> None:
    for old in site.glob("fakecalc_for_cache_tests-*.dist-info"):
        for path in old.iterdir():
            path.unlink()
        old.rmdir()
    info = site / f"{PLUGIN}-{version}.dist-info"
    info.mkdir()
    (info / "METADATA").write_text(f"Metadata-Version: 2.1\nName: {PLUGIN}\nVersion: {version}\n", encoding="utf-8")
    (info / "top_level.txt").write_text(f"{PLUGIN}\n", encoding="utf-8")


@pytest.fixture
def archive(tmp_path):
    """The demo archive's builds, without its ledger."""
    return copy_demo(tmp_path / "archive")


def _count(archive) -> int:
    """The demo's builds: each one is a cache entry."""
    return len({path.parent for path in archive.glob("*/rev-*.yaml")})


def _pages(archive, tmp_path, calcs, caches: Caches, name: str = "pages"):
    output = tmp_path / name
    build_site(archive, output, pages_only=True, calcs=calcs, cache=caches)
    return output


def _caches(tmp_path) -> Caches:
    caches = Caches.in_folder(tmp_path / "caches")
    return Caches(caches.drawings, None, caches.builds)


def test_an_unchanged_build_comes_from_the_cache_byte_for_byte(archive, tmp_path, plugin, calcs):
    first = _pages(archive, tmp_path, [*calcs, plugin.CALC], _caches(tmp_path), "first")
    caches = _caches(tmp_path)
    second = _pages(archive, tmp_path, [*calcs, plugin.CALC], caches, "second")
    assert (caches.builds.hits, caches.builds.misses) == (_count(archive), 0)
    assert _files(first) == _files(second)


def test_a_changed_calc_source_misses_and_the_new_finding_shows(archive, tmp_path, plugin, calcs):
    _pages(archive, tmp_path, [*calcs, plugin.CALC], _caches(tmp_path))
    (tmp_path / "plugins" / PLUGIN / "__init__.py").write_text(PLUGIN_SOURCE.format(limit=9), encoding="utf-8")
    code_version.forget()  # a new process: the fingerprint is taken once per process
    changed = importlib.reload(plugin)
    caches = _caches(tmp_path)
    output = _pages(archive, tmp_path, [*calcs, changed.CALC], caches, "after")
    assert (caches.builds.hits, caches.builds.misses) == (0, _count(archive))
    assert "9 mm" in (output / "builds/rotator-control/calcs.md").read_text(encoding="utf-8")


def test_a_new_plugin_version_misses(archive, tmp_path, plugin, calcs):
    _pages(archive, tmp_path, [*calcs, plugin.CALC], _caches(tmp_path))
    _write_distribution(tmp_path / "plugins", "1.1")
    code_version.forget()
    caches = _caches(tmp_path)
    _pages(archive, tmp_path, [*calcs, plugin.CALC], caches, "after")
    assert (caches.builds.hits, caches.builds.misses) == (0, _count(archive))


def test_another_set_of_calcs_misses(archive, tmp_path, plugin, calcs):
    _pages(archive, tmp_path, [*calcs, plugin.CALC], _caches(tmp_path))
    caches = _caches(tmp_path)
    _pages(archive, tmp_path, [*calcs, plugin.CALC, TEST_CALC], caches, "after")
    assert (caches.builds.hits, caches.builds.misses) == (0, _count(archive))


def test_a_changed_setting_misses_every_build(archive, tmp_path, plugin, calcs):
    _pages(archive, tmp_path, [*calcs, plugin.CALC], _caches(tmp_path))
    (archive / "archive.yaml").write_text("club: Ferncombe Valley Radio and Makers Club\ntitle: Other title\n", encoding="utf-8")
    caches = _caches(tmp_path)
    _pages(archive, tmp_path, [*calcs, plugin.CALC], caches, "after")
    assert (caches.builds.hits, caches.builds.misses) == (0, _count(archive))


CHANGES = {
    "attachment": "solar-bank-charger/photos",
    "sign-off": "bench-psu-13v8/signoff-B.yaml",
    "commissioning": "bench-psu-13v8/commissioning-A.yaml",
    "record": "rotator-control/rev-A.yaml",
}


@pytest.mark.parametrize("change", sorted(CHANGES))
def test_a_changed_file_in_a_build_misses_that_build_only(archive, tmp_path, plugin, calcs, change):
    _pages(archive, tmp_path, [*calcs, plugin.CALC], _caches(tmp_path))
    path = archive / CHANGES[change]
    if path.is_dir():
        path = sorted(path.iterdir())[0]
        path.write_bytes(path.read_bytes() + b"\0")
    else:
        path.write_text(path.read_text(encoding="utf-8") + "# saved again\n", encoding="utf-8")
    caches = _caches(tmp_path)
    _pages(archive, tmp_path, [*calcs, plugin.CALC], caches, "after")
    assert (caches.builds.hits, caches.builds.misses) == (_count(archive) - 1, 1)


def test_the_key_follows_every_byte_of_the_build_folder(archive, tmp_path):
    store = BuildStore(tmp_path / "store")
    store.prepare(archive, "code", "options")
    folder = archive / "solar-bank-charger"
    before = store.key(folder)
    (folder / "unrelated.txt").write_text("a note left in the folder\n", encoding="utf-8")
    assert store.key(folder) != before
    other = BuildStore(tmp_path / "store")
    other.prepare(archive, "other code", "options")
    assert other.key(folder) != store.key(folder)


def test_a_build_folder_with_a_linked_folder_is_never_cached(archive, tmp_path):
    (tmp_path / "elsewhere").mkdir()
    (archive / "rotator-control" / "linked").symlink_to(tmp_path / "elsewhere")
    store = BuildStore(tmp_path / "store")
    store.prepare(archive, "code", "options")
    assert store.key(archive / "rotator-control") is None and store.key(archive / "bench-psu-13v8") is not None


def test_no_cache_bypasses_the_store(archive, tmp_path, monkeypatch):
    monkeypatch.setenv("XDG_CACHE_HOME", str(tmp_path / "user-cache"))
    output = tmp_path / "pages"
    command = ["build", str(archive), "-o", str(output), "--pages-only", "--no-pdf"]
    assert CliRunner().invoke(main, command).exit_code == 0
    entries = _entries(tmp_path / "user-cache" / "dossier" / "builds")
    assert len(entries) == _count(archive)
    for entry in entries:
        _tamper(entry)
    assert CliRunner().invoke(main, command).exit_code == 0
    assert "TAMPERED" in (output / "builds/rotator-control/index.md").read_text(encoding="utf-8")  # the cache was used
    assert CliRunner().invoke(main, [*command, "--no-cache"]).exit_code == 0
    assert "TAMPERED" not in (output / "builds/rotator-control/index.md").read_text(encoding="utf-8")


@pytest.mark.parametrize("damage", ["truncated page", "missing page", "truncated list", "truncated summary"])
def test_a_damaged_entry_is_a_miss(archive, tmp_path, plugin, calcs, damage):
    _pages(archive, tmp_path, [*calcs, plugin.CALC], _caches(tmp_path), "first")
    for entry in _entries(tmp_path / "caches" / "builds"):
        _damage(entry, damage)
    caches = _caches(tmp_path)
    second = _pages(archive, tmp_path, [*calcs, plugin.CALC], caches, "second")
    assert (caches.builds.hits, caches.builds.misses) == (0, _count(archive))
    assert _files(second) == _files(_pages(archive, tmp_path, [*calcs, plugin.CALC], Caches(), "uncached"))


def _damage(entry, how: str) -> None:
    page = entry / "pages" / "index.md"
    if how == "truncated page":
        page.write_bytes(page.read_bytes()[:100])
    elif how == "missing page":
        page.unlink()
    else:
        part = entry / ("files.json" if how == "truncated list" else "summary.pickle")
        part.write_bytes(part.read_bytes()[:20])


@pytest.mark.parametrize("link", [True, False])
def test_a_placed_entry_is_linked_only_when_asked(tmp_path, link):
    store = BuildStore(tmp_path / "store", link=link)
    (tmp_path / "tree").mkdir()
    (tmp_path / "tree" / "index.md").write_bytes(b"page")
    key = "aa" + "0" * 62
    store.save(key, tmp_path / "tree", {"index.md": FileFacts.of(b"page")}, {"n": 1})
    store.place(store.load(key), tmp_path / "placed")
    assert (tmp_path / "placed" / "index.md").stat().st_nlink == (3 if link else 1)  # tree, entry, placed: one file


def test_a_site_build_links_the_store_and_a_page_tree_copies_it(archive, tmp_path, calcs):
    """A tree written as the output (--pages-only) shares no file with the store, so editing it cannot reach the cache."""
    caches = _caches(tmp_path)
    pages = _pages(archive, tmp_path, calcs, caches)
    assert caches.builds.link is False
    stored = [path for entry in _entries(tmp_path / "caches" / "builds") for path in (entry / "pages").rglob("*") if path.is_file()]
    assert stored and all(path.stat().st_nlink == 1 for path in stored)
    assert all(path.stat().st_nlink == 1 for path in pages.rglob("*") if path.is_file())


def test_the_store_keeps_to_its_size_by_dropping_the_least_recently_used(tmp_path):
    import os

    store = BuildStore(tmp_path / "store", limit_bytes=2500)
    source = tmp_path / "tree"
    source.mkdir()
    (source / "index.md").write_bytes(b"x" * 1000)
    for number in range(4):
        key = f"{number:02d}" + "0" * 62
        store.save(key, source, {"index.md": FileFacts.of(b"x" * 1000)}, {"n": number})
        os.utime(store.path(key) / "files.json", ns=(number * 10**9, number * 10**9))
    store.load("00" + "0" * 62)  # used now: the newest
    assert store.trim() == 2
    assert sorted(entry.name[:2] for entry in _entries(tmp_path / "store")) == ["00", "03"]


def test_a_foreign_object_in_an_entry_is_refused(tmp_path):
    store = BuildStore(tmp_path / "store")
    key = "ab" + "0" * 62
    (tmp_path / "index.md").write_bytes(b"x")
    store.save(key, tmp_path, {"index.md": FileFacts.of(b"x")}, zipfile.ZipFile)  # a class from outside dossier
    assert store.path(key).is_dir() and store.load(key) is None


def test_an_entry_naming_a_file_outside_its_folder_is_refused(tmp_path):
    store = BuildStore(tmp_path / "store")
    key = "cd" + "0" * 62
    (tmp_path / "index.md").write_bytes(b"x")
    store.save(key, tmp_path, {"index.md": FileFacts.of(b"x")}, {"n": 1})
    (store.path(key) / "files.json").write_text('{"../../escape.md": [1, "00"]}', encoding="utf-8")
    assert store.load(key) is None


def _entries(store):
    return sorted(path for path in store.glob("*/*") if path.is_dir() and not path.name.startswith("."))


def _tamper(entry) -> None:
    """Change the overview page and its listed size: an entry that is whole but says something else."""
    page = entry / "pages" / "index.md"
    page.write_bytes(page.read_bytes() + b"\nTAMPERED\n")
    listed = json.loads((entry / "files.json").read_text(encoding="utf-8"))
    listed["index.md"][0] = page.stat().st_size
    (entry / "files.json").write_text(json.dumps(listed), encoding="utf-8")


def _files(root):
    return {path.relative_to(root).as_posix(): path.read_bytes() for path in sorted(root.rglob("*")) if path.is_file() and path.name != ".dossier-output"}


def test_the_fingerprint_covers_dossier_and_the_plugin_source(plugin, tmp_path):
    before = code_version.code_fingerprint([plugin.CALC])
    assert code_version.code_fingerprint([plugin.CALC]) == before  # once per process
    (tmp_path / "plugins" / PLUGIN / "__init__.py").write_text(PLUGIN_SOURCE.format(limit=7) + "\n# changed\n", encoding="utf-8")
    code_version.forget()
    assert code_version.code_fingerprint([plugin.CALC]) != before


def test_a_store_on_another_file_system_copies_and_stops_trying_to_link(tmp_path, monkeypatch):
    import errno
    import os

    store = BuildStore(tmp_path / "store", link=True)
    (tmp_path / "tree").mkdir()
    (tmp_path / "tree" / "index.md").write_bytes(b"page")
    tried = []

    def across_devices(source, destination):
        tried.append(destination)
        raise OSError(errno.EXDEV, "Invalid cross-device link")

    monkeypatch.setattr(os, "link", across_devices)
    key = "ef" + "0" * 62
    store.save(key, tmp_path / "tree", {"index.md": FileFacts.of(b"page")}, {"n": 1})
    assert store.place(store.load(key), tmp_path / "placed") and (tmp_path / "placed" / "index.md").read_bytes() == b"page"
    assert len(tried) == 1 and store.link is False  # copied, and linking was not tried again
