"""Real-browser fixtures: Debian's headless Chromium driven by Playwright, the demo site built once."""

from __future__ import annotations

import functools
import http.server
import shutil
import subprocess
import sys
import threading
from pathlib import Path

import pytest

from tests.fixtures.prerequisites import require

CHROMIUM = "/usr/bin/chromium"
CHROMIUM_ARGS = ["--no-sandbox", "--disable-gpu", "--disable-background-networking", "--disable-component-update", "--disable-sync", "--no-first-run"]
ROOT = Path(__file__).resolve().parents[2]


def _need_chromium():
    require("chromium")


def build_site(archive: Path, out: Path) -> Path:
    result = subprocess.run([sys.executable, "-m", "dossier", "build", str(archive), "-o", str(out), "-q"], capture_output=True, text=True)
    assert result.returncode == 0, result.stdout + result.stderr
    return out


@pytest.fixture(scope="session")
def demo_site(tmp_path_factory) -> Path:
    return build_site(ROOT / "demo" / "archive", tmp_path_factory.mktemp("demo") / "site")


@pytest.fixture(scope="session")
def browser():
    _need_chromium()
    from playwright.sync_api import sync_playwright

    with sync_playwright() as playwright:
        chromium = playwright.chromium.launch(executable_path=CHROMIUM, args=CHROMIUM_ARGS)
        yield chromium
        chromium.close()


class _QuietHandler(http.server.SimpleHTTPRequestHandler):
    def log_message(self, *args):
        pass


@pytest.fixture(scope="session")
def served_site(demo_site):
    """The demo site over HTTP on the loopback address, on a free port."""
    handler = functools.partial(_QuietHandler, directory=str(demo_site))
    server = http.server.ThreadingHTTPServer(("127.0.0.1", 0), handler)
    thread = threading.Thread(target=server.serve_forever, daemon=True)
    thread.start()
    yield f"http://127.0.0.1:{server.server_address[1]}"
    server.shutdown()


class PageWatch:
    """Collects console errors, page errors and any request that would leave the machine."""

    def __init__(self, page, local_prefixes: tuple[str, ...]):
        self.page = page
        self.errors: list[str] = []
        self.outside: list[str] = []
        page.on("console", lambda message: self.errors.append(message.text) if message.type == "error" else None)
        page.on("pageerror", lambda error: self.errors.append(str(error)))
        page.route("**/*", self._route)
        self.local_prefixes = local_prefixes

    def _route(self, route):
        url = route.request.url
        if url.startswith(self.local_prefixes):
            route.continue_()
        else:
            self.outside.append(url)
            route.abort()


@pytest.fixture
def watched_page(browser):
    context = browser.new_context()
    page = context.new_page()
    yield lambda prefixes: PageWatch(page, prefixes)
    context.close()


def html_pages(site: Path) -> list[Path]:
    return sorted(p for p in site.rglob("*.html") if p.name != "404.html")


def copy_tree(src: Path, dst: Path) -> Path:
    shutil.copytree(src, dst)
    return dst
