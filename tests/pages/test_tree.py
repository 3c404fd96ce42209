"""The generated Markdown tree of the demo archive: what each page says (no MkDocs here)."""

from __future__ import annotations

import re

import pytest

from tests.fixtures.demo import DEMO
from dossier.caution import MAINS_CAUTION
from dossier.findings import Verdict, counts
from dossier.collect.archive import collect
from dossier.pages.tree import write_tree
from dossier.changes import finding_changes
from dossier.wording import finding_label
from tests.fixtures.site_kit import TEST_CALC, tree_digest, write_record


@pytest.fixture(scope="module")
def demo(drawing_cache):
    return collect(DEMO, cache=drawing_cache)


@pytest.fixture(scope="module")
def tree(demo, tmp_path_factory):
    root = tmp_path_factory.mktemp("tree")
    write_tree(demo, root)
    return root


def page(tree, path: str) -> str:
    return (tree / path).read_text(encoding="utf-8")


def table_row(text: str, first_cell: str) -> list[str]:
    line = next(line for line in text.splitlines() if line.startswith(f"| {first_cell}"))
    return [cell.strip() for cell in line.strip("|").split("|")]


def test_index_lists_every_build_with_revision_status_date_and_counts(demo, tree):
    index = page(tree, "index.md")
    for build in demo.builds:
        record = build.current.record
        row = table_row(index, f"[{record.title}]")
        tally = counts(build.current.findings)
        assert row[0] == f"[{record.title}](builds/{build.id}/index.md)"
        signoff = f'<span class="dossier-signoff dossier-signoff-{build.current.signoff.state.value}">'
        assert row[1:3] == [build.current.letter, _status_title(build)] and row[3].startswith(signoff)
        assert row[4:] == [record.date.isoformat(), *(str(tally[v]) for v in (Verdict.FAIL, Verdict.NOT_ASSESSED, Verdict.MARGINAL, Verdict.PASS))]


def _status_title(build) -> str:
    """The record's status, or, after a passed commissioning, the status it advances to."""
    from dossier.record.identity import STATUS_TITLES

    state = build.current.extras.commissioning
    return state.status.title if state is not None else STATUS_TITLES[build.current.record.status]


def test_a_passed_commissioning_advances_the_status_shown(tree):
    # demo: solar-bank-charger rev D is 'in-enclosure' and its commissioning-D.yaml passed on 2026-07-18
    row = table_row(page(tree, "index.md"), "[24 V charger for the solar-station battery bank")
    assert row[2] == "In its enclosure, commissioned 2026-07-18"


def test_index_is_newest_first_and_carries_the_caution(tree):
    index = page(tree, "index.md")
    dates = re.findall(r"\| (\d{4}-\d\d-\d\d) \|", index)
    builds = len({path.parent for path in DEMO.glob("*/rev-*.yaml")})  # one row per demo build
    assert dates == sorted(dates, reverse=True) and len(dates) == builds == 6
    assert MAINS_CAUTION in index


def test_status_pages_filter_the_index(demo, tree):
    for build in demo.builds:
        status = build.current.record.status
        listed = page(tree, f"status/{status}.md")
        assert f"(../builds/{build.id}/index.md)" in listed
        others = [b for b in demo.builds if b.current.record.status != status]
        assert all(f"builds/{other.id}/" not in listed for other in others)
    assert "[Design (1)](status/design.md)" in page(tree, "index.md")


def test_overview_has_what_mains_hazards_and_caution(tree):
    overview = page(tree, "builds/solar-bank-charger/index.md")
    assert overview.startswith('---\ntitle: "24 V charger for the solar-station battery bank, controller-driven half-bridge"\n---')
    assert "# 24 V charger for the solar-station battery bank, controller-driven half-bridge" in overview
    assert "**Revision D** (current)" in overview
    assert "- **Nominal voltage:** 230 V" in overview and "- **Frequency:** 50 Hz" in overview
    hazards = overview.split("## Hazards")[1].split("## Verdicts")[0]
    assert "Mains voltage, 230 V at 50 Hz" in hazards and "Stored charge: 220 µF" in hazards
    assert MAINS_CAUTION in overview


def test_overview_lists_failing_findings_first_with_links_into_the_calcs_page(demo, tree):
    build = next(b for b in demo.builds if b.id == "solar-bank-charger")
    findings = build.revisions[0].findings
    counts = {verdict: sum(f.verdict is verdict for f in findings) for verdict in (Verdict.FAIL, Verdict.NOT_ASSESSED, Verdict.MARGINAL)}
    assert counts[Verdict.FAIL], "revision A of the demo charger is meant to fail"
    overview = page(tree, "builds/solar-bank-charger/rev-A/index.md")
    verdict_rows = [line for line in overview.split("## Verdicts")[1].split("| Calc |")[0].splitlines() if line.startswith('| <span class="dossier-verdict')]
    # every finding that needs attention, most severe first: fail, then not assessed, then marginal
    expected = [verdict.value for verdict, count in counts.items() for _ in range(count)]
    assert [row.split("dossier-verdict-")[1].split('"')[0] for row in verdict_rows] == expected
    assert all("](calcs.md#" in row for row in verdict_rows)


def test_calcs_page_has_a_section_per_calc_with_values_limits_formulas_and_sources(demo, tree):
    calcs_page = page(tree, "builds/solar-bank-charger/calcs.md")
    for calc in demo.calcs:
        assert f"\n## {calc.title}\n" in calcs_page
    finding = next(f for f in next(b for b in demo.builds if b.id == "solar-bank-charger").current.findings if f.limit is not None and f.sources and f.method)
    section = calcs_page.split(f"### {finding_label(finding)}")[1].split("\n### ")[0]
    assert f'class="dossier-verdict dossier-verdict-{finding.verdict.value}"' in section
    assert "- Limit: " in section and "- Formula: " in section and "- Sources: " in section
    assert "- From the record: " in section and "solar-bank-charger/rev-D.yaml, line " in section


def test_earlier_revisions_are_frozen_at_their_own_address_with_a_notice(tree):
    for letter in "ABC":
        for name in ("index", "calcs"):
            text = page(tree, f"builds/solar-bank-charger/rev-{letter}/{name}.md")
            assert '<div class="admonition warning" markdown data-search-exclude>\n<p class="admonition-title">A newer revision exists</p>' in text
            assert "The current revision is [revision D](../index.md)" in text
    assert "A newer revision exists" not in page(tree, "builds/solar-bank-charger/index.md")


def test_the_current_revision_also_has_its_permanent_address(tree):
    pointer = page(tree, "builds/solar-bank-charger/rev-D/index.md")
    assert "Revision D is the current revision" in pointer and "(../index.md)" in pointer
    assert "search:\n  exclude: true" in pointer


def test_every_build_page_links_its_revisions_and_pages(tree):
    head = page(tree, "builds/solar-bank-charger/rev-B/calcs.md")
    assert "Revisions: [A](../rev-A/index.md) · **B** · [C](../rev-C/index.md) · [D](../index.md) (current)" in head
    assert "[Overview](index.md) · **Calculations** · [Schematics](schematics.md)" in head


def test_changes_page_lists_values_and_findings_revision_by_revision(demo, tree):
    changes = page(tree, "builds/solar-bank-charger/changes.md")
    assert changes.index("## Revision D") < changes.index("## Revision C") < changes.index("## Revision B") < changes.index("## Revision A")
    step_b = changes.split("## Revision B")[1].split("## Revision A")[0]
    assert "| barriers\\[primary to output\\].creepage | 2.6 mm | 7.2 mm |" in step_b
    assert "| protection.fuse.rating | 2.5 A | 3.15 A |" in step_b
    build = next(b for b in demo.builds if b.id == "solar-bank-charger")
    clearance = [c for c in finding_changes(build.revisions[0].findings, build.revisions[1].findings) if c.before and c.after and c.before.code == "ISO-CLEARANCE"]
    assert clearance and f"| {clearance[0].label} | fail," in step_b
    assert "the first revision" in changes.split("## Revision A")[1]


def test_schematics_page_shows_the_drawn_figures(tree):
    schematics = page(tree, "builds/solar-bank-charger/schematics.md")
    figures = re.findall(r'<img alt="[^"]*" src="(figures/[a-z0-9-]+\.svg)">', schematics)
    assert figures and all((tree / "builds/solar-bank-charger" / f).read_text(encoding="utf-8").lstrip().startswith(("<svg", "<?xml")) for f in figures)


def test_checklist_page_per_revision_when_the_checklist_module_is_present(tree):
    pytest.importorskip("dossier.checklist.page")
    for path in ("builds/solar-bank-charger/checklist.md", "builds/solar-bank-charger/rev-A/checklist.md"):
        assert "checklist" in page(tree, path).lower()
    assert "[Checklist](checklist.md)" in page(tree, "builds/solar-bank-charger/index.md")


def test_generation_is_byte_identical_for_unchanged_inputs(demo, tree, tmp_path):
    write_tree(demo, tmp_path)
    assert tree_digest(tmp_path) == tree_digest(tree)


def test_attachments_photos_shown_datasheets_linked(tmp_path):
    archive = tmp_path / "archive"
    (archive / "amp").mkdir(parents=True)
    (archive / "amp" / "board.svg").write_text("<svg xmlns='http://www.w3.org/2000/svg'><rect width='4' height='4'/></svg>", encoding="utf-8")
    (archive / "amp" / "sheet.pdf").write_bytes(b"%PDF-1.4 invented\n")
    (archive / "amp" / "trap.svg").write_text("<svg xmlns='http://www.w3.org/2000/svg'><script>alert(1)</script></svg>", encoding="utf-8")
    attachments = [
        {"path": "board.svg", "kind": "photo", "caption": "The board, top side"},
        {"path": "sheet.pdf", "kind": "datasheet", "caption": "Regulator datasheet"},
        {"path": "trap.svg", "kind": "photo", "caption": "Trap"},
    ]
    write_record(archive, "amp", "A", attachments=attachments)
    root = tmp_path / "tree"
    write_tree(collect(archive, [TEST_CALC]), root)
    overview = page(root, "builds/amp/index.md")
    assert "![The board, top side](files/board.svg)" in overview
    assert "- [Regulator datasheet](files/sheet.pdf) (datasheet)" in overview
    assert "Trap: not published" in overview
    assert (root / "builds/amp/files/sheet.pdf").read_bytes() == b"%PDF-1.4 invented\n"
    assert not (root / "builds/amp/files/trap.svg").exists()


def test_a_build_without_mains_has_no_caution(tmp_path):
    archive = tmp_path / "archive"
    write_record(archive, "bench-meter", "A", mains=None, stages=[], barriers=[])
    root = tmp_path / "tree"
    write_tree(collect(archive, [TEST_CALC]), root)
    overview = page(root, "builds/bench-meter/index.md")
    assert MAINS_CAUTION not in overview and "This build has no mains connection." in overview


def test_an_amendment_after_publication_shows_on_the_changes_page(tmp_path):
    import datetime

    from dossier.ledger import Target, amend, publish, save_ledger

    archive = tmp_path / "archive"
    write_record(archive, "amp", "A")
    write_record(archive, "amp", "B", notes="Rewound.")
    save_ledger(archive, publish(archive, [], datetime.date(2026, 2, 1))[0])
    path = archive / "amp" / "rev-A.yaml"
    path.write_text(path.read_text(encoding="utf-8").replace("club's winder", "club's coil winder"), encoding="utf-8")
    save_ledger(archive, amend(archive, Target.parse("amp:A"), "typo in the notes", datetime.date(2026, 2, 9)))
    root = tmp_path / "tree"
    write_tree(collect(archive, [TEST_CALC]), root)
    step_a = page(root, "builds/amp/changes.md").split("## Revision A")[1]
    assert "### Edited after publication" in step_a and "- 2026-02-09: typo in the notes (content hash sha256 " in step_a
    assert "Published on 2026-02-01" in page(root, "builds/amp/rev-A/index.md")


def test_archive_settings_errors_are_located(tmp_path):
    from dossier.problems import InputError

    archive = tmp_path / "archive"
    write_record(archive, "amp", "A")
    (archive / "archive.yaml").write_text("club: Test club\ntitel: Misspelt\n", encoding="utf-8")
    with pytest.raises(InputError) as refused:
        collect(archive, [TEST_CALC])
    problem = refused.value.problems[0]
    assert (problem.code, problem.key, problem.location.line, problem.location.column) == ("extra_forbidden", "titel", 2, 1)


def test_an_empty_archive_gives_an_index_with_no_builds(tmp_path):
    (tmp_path / "archive").mkdir()
    root = tmp_path / "tree"
    write_tree(collect(tmp_path / "archive", [TEST_CALC]), root)
    assert "No builds." in page(root, "index.md")


def test_a_failing_drawing_is_shown_on_the_page_and_does_not_stop_the_site(tmp_path, monkeypatch):
    def broken(record, findings, cache=None, hazard_names=None):
        raise RuntimeError("no pencil")

    monkeypatch.setattr("dossier.collect.extras.draw", broken)
    archive = tmp_path / "archive"
    write_record(archive, "amp", "A")
    summary = write_tree(collect(archive, [TEST_CALC]), tmp_path / "tree")
    assert summary.warnings == ["amp rev A: the schematics could not be made: RuntimeError: no pencil"]
    overview = page(tmp_path / "tree", "builds/amp/index.md")
    assert '!!! bug "Parts of this page could not be made"' in overview and "RuntimeError: no pencil" in overview


def test_the_checklist_page_shows_one_caution_and_keeps_the_print_links_apart(tree):
    checklist = page(tree, "builds/solar-bank-charger/checklist.md")
    cautions = checklist.count('!!! danger "Caution"') + checklist.count('<p class="admonition-title">Caution</p>')
    assert cautions == 1
    line = next(line for line in checklist.splitlines() if line.startswith("Printable sheet:"))
    after = checklist.split(line, 1)[1]
    assert after.startswith("\n\n"), "the next paragraph must not run on from the print links"


def test_the_sign_off_filter_separates_its_links_like_the_status_filter(tree):
    index = page(tree, "index.md")
    line = next(text for text in index.splitlines() if text.startswith("By sign-off:"))
    assert "](signoff/not-reviewed.md) · [stale (1)](signoff/stale.md) · [" in line
    assert ")·" not in line


def test_a_finding_the_sign_off_sent_back_says_to_fix_beside_it(tree):
    # demo: solar-bank-charger rev B has a sign-off requesting changes, with 'fix' on its open findings; the
    # charger-safeguard and touch-current findings came after that review, so they are still open
    overview = page(tree, "builds/solar-bank-charger/rev-B/index.md")
    verdicts = overview.split("## Verdicts")[1].split("| Calc |")[0]
    assert "**to fix**: " in verdicts
    # the open rows are checks added after that sign-off was made
    new_checks = ("Touch current", "Absorption timer", "High-temperature cut-off", "X capacitors")
    open_rows = [row for row in verdicts.splitlines() if "| open |" in row]
    assert open_rows and all(any(title in row for title in new_checks) for row in open_rows)
def test_a_hazardous_rail_is_named_on_the_overview_and_in_its_caution(tree):
    # demo: the valve amplifier supply's 350 V HT rail reaches 427 V with no load at high line
    overview = page(tree, "builds/valve-amp-supply/index.md")
    hazards = overview.split("## Hazards")[1].split("## Verdicts")[0]
    assert "Hazardous voltage beyond the mains: rail B+ (up to 427 V DC)" in hazards
    caution = overview.split('<p class="admonition-title">Caution</p>')[1].split("</div>")[0]
    assert "hazardous voltages beyond the mains: B+ (up to 427 V DC)" in caution


def test_rev_c_s_overview_and_checklist_ask_for_a_re_review_after_the_new_checks(tree):
    # demo: solar-bank-charger rev C was cleared on 2026-06-20; checks added since find its battery cut-off,
    # absorption timer and C4's capacitance undeclared, so that review is outdated and rev C is not cleared
    checklist = page(tree, "builds/solar-bank-charger/rev-C/checklist.md")
    assert "Not cleared for first power-up" in checklist and "Signed off" not in checklist
    assert "review outdated: the checks changed after signoff-C.yaml" in checklist
    assert "CHG-HOT-CUTOFF (battery, fail), PROT-TOUCH-CURRENT (touch current, not assessed), RAILS-X-DISCHARGE (X capacitors, not assessed), CHG-TIMER (battery, marginal)" in checklist
    overview = page(tree, "builds/solar-bank-charger/rev-C/index.md")
    assert '<span class="dossier-signoff dossier-signoff-review-outdated">' in overview
    assert "| cleared for first power-up (**outdated**: the checks changed the findings after it) | `signoff-C.yaml` |" in overview
