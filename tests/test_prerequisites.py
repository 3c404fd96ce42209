"""A missing PDF or browser tool skips the tests that need it locally, naming what to install; under CI it fails them."""

from __future__ import annotations

import pytest

from tests.fixtures import prerequisites


@pytest.fixture
def without_poppler(monkeypatch):
    monkeypatch.setitem(prerequisites.TOOLS, "poppler", prerequisites.Tool("poppler's tools", "poppler-utils", lambda: False))
    prerequisites.is_missing.cache_clear()
    yield
    prerequisites.is_missing.cache_clear()


def test_a_missing_tool_skips_locally_and_says_what_to_install(without_poppler, monkeypatch):
    monkeypatch.delenv("CI", raising=False)
    with pytest.raises(pytest.skip.Exception, match="needs poppler's tools: sudo apt-get install poppler-utils"):
        prerequisites.require("poppler")
    assert prerequisites.summary()[-1].startswith("install with: sudo apt-get install poppler-utils")


def test_a_missing_tool_fails_under_ci(without_poppler, monkeypatch):
    monkeypatch.setenv("CI", "true")
    with pytest.raises(pytest.fail.Exception, match="CI must install poppler's tools"):
        prerequisites.require("poppler")
