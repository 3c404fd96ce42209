"""The docs cannot drift: generated references match, and every calc code, record key and command is documented."""

from __future__ import annotations

import json
from pathlib import Path

import pytest

from dossier.commands.schema import record_schema, schema_text
from dossier.plugins import load_calcs
from dossier.reference import cli_markdown, reference_markdown

DOCS = Path(__file__).resolve().parents[1] / "docs"
REGENERATE = "regenerate with `python -m dossier.reference > docs/reference/record.md`, `python -m dossier.reference cli > docs/reference/cli.md` and `dossier schema -o docs/record.schema.json`"


def test_record_reference_is_generated_from_the_model():
    assert (DOCS / "reference" / "record.md").read_text(encoding="utf-8") == reference_markdown(), REGENERATE


def test_cli_reference_is_generated_from_the_commands():
    assert (DOCS / "reference" / "cli.md").read_text(encoding="utf-8") == cli_markdown(), REGENERATE


def test_shipped_schema_matches_the_model():
    assert (DOCS / "record.schema.json").read_text(encoding="utf-8") == schema_text(), REGENERATE


def undocumented_keys(schema: dict) -> list[str]:
    sections = {"Record": schema, **schema.get("$defs", {})}
    return [
        f"{name}.{key}"
        for name, section in sections.items()
        for key, prop in section.get("properties", {}).items()
        if not prop.get("description") or prop.get("description") == prop.get("x-quantity")
    ]


def test_every_record_key_has_a_description():
    assert undocumented_keys(record_schema()) == []


def test_the_key_check_would_notice_a_missing_description():
    schema = json.loads(schema_text())
    del schema["$defs"]["Mains"]["properties"]["nominal"]["description"]
    assert undocumented_keys(schema) == ["Mains.nominal"]


@pytest.mark.parametrize("calc", load_calcs(), ids=lambda c: c.name)
def test_every_calc_code_is_documented(calc):
    page = DOCS / "calcs" / f"{calc.name}.md"
    assert page.exists(), f"{calc.name} has no page in docs/calcs/"
    text = page.read_text(encoding="utf-8")
    missing = [code for code in calc.codes if f"`{code}`" not in text]
    assert missing == [], f"{page.name} does not document {missing}"


@pytest.mark.parametrize("calc", load_calcs(), ids=lambda c: c.name)
def test_every_calc_has_a_summary(calc):
    assert len(calc.summary) > 40 and "To be written" not in calc.summary
