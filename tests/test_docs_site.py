"""The project's own mkdocs.yml builds the docs together with the demo archive, with no warnings."""

from __future__ import annotations

import os
import shutil
import subprocess
import sys

import yaml

from tests.fixtures.demo import DEMO, ROOT
from dossier.commands.build import build_site


def test_project_docs_and_demo_archive_build_strict_without_warnings(tmp_path, drawing_cache):
    shutil.copy(ROOT / "mkdocs.yml", tmp_path / "mkdocs.yml")
    shutil.copytree(ROOT / "docs", tmp_path / "docs", ignore=shutil.ignore_patterns("archive"))
    build_site(DEMO, tmp_path / "docs" / "archive", pages_only=True, cache=drawing_cache)
    environment = dict(os.environ, NO_MKDOCS_2_WARNING="1")
    result = subprocess.run([sys.executable, "-m", "mkdocs", "build", "--strict", "-f", str(tmp_path / "mkdocs.yml")], capture_output=True, text=True, env=environment)
    log = result.stdout + result.stderr
    assert result.returncode == 0, log
    assert "WARNING" not in log, log
    assert (tmp_path / "site" / "archive" / "builds" / "solar-bank-charger" / "changes.html").is_file()


def test_project_config_is_offline_and_uses_no_plugin_of_ours():
    config = yaml.safe_load((ROOT / "mkdocs.yml").read_text(encoding="utf-8"))
    assert config["theme"]["font"] is False
    assert config["use_directory_urls"] is False
    assert config["plugins"] == ["search", "offline"]
    assert "hooks" not in config
    assert all(not str(src).startswith(("http:", "https:", "//")) for src in config["extra"]["polyfills"])
    assert {"Demo archive": "archive/index.md"} in config["nav"]
