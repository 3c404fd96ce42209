"""After a list of problems, each kind met points once at the docs section that explains it; the sections exist."""

from __future__ import annotations

import re

from click.testing import CliRunner

from dossier.cli import main
from dossier.wording import HELP_SECTIONS
from tests.fixtures.demo import ROOT


def anchors(markdown: str) -> set[str]:
    """The anchors MkDocs' toc extension makes from headings: lower case, punctuation dropped, spaces to '-'."""
    headings = re.findall(r"^#{1,6} (.+)$", markdown, flags=re.M)
    return {re.sub(r"[\s]+", "-", re.sub(r"[^\w\s-]", "", heading.strip().lower())) for heading in headings}


def test_every_help_pointer_names_a_section_that_exists():
    for kind, (where, _) in HELP_SECTIONS.items():
        page, anchor = where.split("#")
        assert anchor in anchors((ROOT / page).read_text(encoding="utf-8")), f"{kind}: {where}"


def test_check_ends_its_problems_with_one_pointer_per_kind(tmp_path):
    folder = tmp_path / "unit"
    folder.mkdir()
    (folder / "rev-A.yaml").write_text("id: unit\ntitle: t\nrevision: A\ndate: 2026-01-01\nauthors: [x]\nstatus: design\n"
                                       "summary: s\nmains: {nominal: 230, frequency: 50}\nfoo: 1\n", encoding="utf-8")
    output = CliRunner().invoke(main, ["check", str(folder / "rev-A.yaml")]).output
    assert output.count("help with units and values: docs/writing-records.md#units-and-values") == 1
    assert output.count("help with keys: docs/writing-records.md#keys") == 1
    assert "help with attachments" not in output
