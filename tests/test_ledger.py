"""Published revisions are frozen: hashes recorded, edits refused with a way forward, typo fixes recorded."""

from __future__ import annotations

import datetime

import pytest
import yaml
from click.testing import CliRunner

from dossier.cli import main
from dossier.ledger import LOCK_FILE, Target, amend, canonical_hash, frozen_problems, load_ledger, next_letter, publish, record_digest, save_ledger
from dossier.problems import InputError
from dossier.wording import problem_line
from tests.fixtures.site_kit import write_record

DAY = datetime.date(2026, 3, 1)
LATER = datetime.date(2026, 4, 2)


@pytest.fixture
def archive(tmp_path):
    root = tmp_path / "archive"
    write_record(root, "amp", "A")
    write_record(root, "amp", "B")
    write_record(root, "psu", "A")
    return root


def published(root, targets=()):
    ledger, chosen = publish(root, [Target.parse(t) for t in targets], DAY)
    save_ledger(root, ledger)
    return chosen


def test_publish_records_every_unpublished_revision(archive):
    chosen = published(archive)
    assert [(rev.build_id, rev.letter) for rev in chosen] == [("amp", "A"), ("amp", "B"), ("psu", "A")]
    ledger = load_ledger(archive)
    assert ledger.entry("amp", "B").sha256 == record_digest(archive / "amp" / "rev-B.yaml")
    assert ledger.entry("amp", "B").published == DAY


def test_publishing_again_adds_only_new_revisions(archive):
    published(archive)
    write_record(archive, "amp", "C")
    assert [(rev.build_id, rev.letter) for rev in published(archive)] == [("amp", "C")]


def test_publish_can_name_one_build_or_revision(archive):
    assert [(r.build_id, r.letter) for r in published(archive, ["amp:A"])] == [("amp", "A")]
    assert [(r.build_id, r.letter) for r in published(archive, ["psu"])] == [("psu", "A")]


def test_an_unknown_target_is_refused(archive):
    with pytest.raises(InputError) as refused:
        publish(archive, [Target.parse("nope:A")], DAY)
    assert refused.value.problems[0].code == "unknown_revision"


def test_an_invalid_record_is_not_published(archive):
    (archive / "psu" / "rev-A.yaml").write_text("id: psu\ntitle: x\n", encoding="utf-8")
    with pytest.raises(InputError):
        publish(archive, [], DAY)
    assert not (archive / LOCK_FILE).exists()


def test_editing_a_published_revision_is_refused_and_says_to_add_a_revision(archive):
    published(archive)
    path = archive / "amp" / "rev-A.yaml"
    path.write_text(path.read_text(encoding="utf-8").replace("2.5 mm", "4 mm"), encoding="utf-8")
    problems = frozen_problems(archive, load_ledger(archive))
    assert [p.code for p in problems] == ["published_changed"]
    line = problem_line(problems[0])
    assert "rev-A.yaml" in line and "new revision, rev-C.yaml" in line and "--amend amp:A" in line


def test_line_endings_alone_are_not_an_edit(archive):
    published(archive)
    path = archive / "amp" / "rev-A.yaml"
    path.write_bytes(path.read_bytes().replace(b"\n", b"\r\n"))
    assert frozen_problems(archive, load_ledger(archive)) == []


def test_a_deleted_published_revision_is_reported(archive):
    published(archive)
    (archive / "amp" / "rev-B.yaml").unlink()
    assert [p.code for p in frozen_problems(archive, load_ledger(archive))] == ["published_missing"]


def test_a_changed_attachment_of_a_published_revision_is_reported(archive):
    (archive / "amp" / "photo.svg").write_text("<svg xmlns='http://www.w3.org/2000/svg'/>", encoding="utf-8")
    write_record(archive, "amp", "A", attachments=[{"path": "photo.svg", "kind": "photo", "caption": "The board"}])
    published(archive)
    (archive / "amp" / "photo.svg").write_text("<svg xmlns='http://www.w3.org/2000/svg'><rect/></svg>", encoding="utf-8")
    assert [p.code for p in frozen_problems(archive, load_ledger(archive))] == ["published_file_changed"]


def test_publish_is_refused_while_a_published_revision_is_edited(archive):
    published(archive, ["amp:A"])
    path = archive / "amp" / "rev-A.yaml"
    path.write_text(path.read_text(encoding="utf-8") + "\n# edited\n", encoding="utf-8")
    with pytest.raises(InputError):
        publish(archive, [], DAY)


def test_an_amendment_is_recorded_with_reason_dates_and_both_hashes(archive):
    published(archive)
    path = archive / "amp" / "rev-A.yaml"
    before = record_digest(path)
    path.write_text(path.read_text(encoding="utf-8").replace("club's winder", "club's coil winder"), encoding="utf-8")
    save_ledger(archive, amend(archive, Target.parse("amp:A"), "typo in the notes", LATER))
    entry = load_ledger(archive).entry("amp", "A")
    assert entry.published == DAY
    assert entry.sha256 == record_digest(path)
    assert [(a.date, a.reason, a.before, a.after) for a in entry.amendments] == [(LATER, "typo in the notes", before, record_digest(path))]
    assert frozen_problems(archive, load_ledger(archive)) == []


def test_amending_an_unchanged_or_unpublished_revision_is_refused(archive):
    published(archive, ["amp:A"])
    with pytest.raises(InputError) as unchanged:
        amend(archive, Target.parse("amp:A"), "nothing", LATER)
    assert unchanged.value.problems[0].code == "nothing_to_amend"
    with pytest.raises(InputError) as unpublished:
        amend(archive, Target.parse("amp:B"), "typo", LATER)
    assert unpublished.value.problems[0].code == "not_published"


def test_the_lock_file_is_readable_yaml_with_a_header(archive):
    published(archive)
    text = (archive / LOCK_FILE).read_text(encoding="utf-8")
    assert text.startswith("# Published revisions")
    chain = yaml.safe_load(text)["chain"]
    assert [(link["build"], link["revision"], link["event"]) for link in chain] == [("amp", "A", "published"), ("amp", "B", "published"), ("psu", "A", "published")]


def test_a_broken_lock_file_is_a_located_error(archive):
    (archive / LOCK_FILE).write_text("format: 1\nbuilds:\n  amp:\n    A:\n      published: 2026-01-01\n      sha256: nothex\n", encoding="utf-8")
    with pytest.raises(InputError) as broken:
        load_ledger(archive)
    problem = broken.value.problems[0]
    assert problem.location.line == 6 and problem.key == "builds.amp.A.sha256"


@pytest.mark.parametrize("letter,following", [("A", "B"), ("Y", "Z"), ("Z", "AA"), ("AZ", "BA"), ("ZZ", "AAA")])
def test_next_letter(letter, following):
    assert next_letter(letter) == following


def test_the_publish_command_freezes_and_checks(archive):
    runner = CliRunner()
    first = runner.invoke(main, ["publish", str(archive), "--even-if-blocked"])
    assert first.exit_code == 0 and "published amp rev B" in first.output
    assert runner.invoke(main, ["publish", str(archive), "--check"]).exit_code == 0
    path = archive / "psu" / "rev-A.yaml"
    path.write_text(path.read_text(encoding="utf-8").replace("T1A", "T2A"), encoding="utf-8")
    checked = runner.invoke(main, ["publish", str(archive), "--check"])
    assert checked.exit_code == 1
    assert "psu/rev-A.yaml" in checked.stderr and "has changed since" in checked.stderr


def test_the_amend_option_needs_a_reason(archive):
    runner = CliRunner()
    runner.invoke(main, ["publish", str(archive), "--even-if-blocked"])
    result = runner.invoke(main, ["publish", str(archive), "--amend", "amp:A"])
    assert result.exit_code == 2 and "--reason" in result.output


def test_a_failed_write_of_the_ledger_keeps_the_old_file_and_leaves_no_temporary(tmp_path, monkeypatch):
    archive = tmp_path / "archive"
    path = write_record(archive, "amp", "A")
    save_ledger(archive, publish(archive, [Target.parse("amp:A")], DAY)[0])
    before = (archive / LOCK_FILE).read_bytes()
    path.write_text(path.read_text(encoding="utf-8").replace("club's winder", "club's coil winder"), encoding="utf-8")

    def disk_full(*args):
        raise OSError(28, "No space left on device")

    monkeypatch.setattr("dossier.files.os.fsync", disk_full)
    with pytest.raises(OSError):
        save_ledger(archive, amend(archive, Target.parse("amp:A"), "typo in the notes", LATER))
    assert (archive / LOCK_FILE).read_bytes() == before
    assert sorted(p.name for p in archive.iterdir()) == ["amp", LOCK_FILE]


def test_publishing_a_revision_that_blocks_power_up_is_refused_without_a_word_for_it(archive):
    # the test record's 2.5 mm reinforced clearance fails (IEC 60664-1:2020 Table F.2 asks 3.0 mm at 230 V, OVC II)
    result = CliRunner().invoke(main, ["publish", str(archive)])
    assert result.exit_code == 2
    line = next(line for line in result.stderr.splitlines() if line.startswith("amp rev A: "))
    assert "block power-up" in line and "ISO-CLEARANCE (primary to output)" in line
    assert "--even-if-blocked" in result.stderr
    assert not (archive / LOCK_FILE).exists()


def test_a_revision_that_blocks_nothing_is_published_without_the_flag(tmp_path, monkeypatch):
    from dossier.calcs.isolation import CALC

    monkeypatch.setattr("dossier.plugins.load_calcs", lambda: [CALC])  # only the check this record is written to pass
    root = tmp_path / "archive"
    write_record(root, "amp", "A", barriers=[{"name": "primary to output", "between": ["mains", "output"], "grade": "reinforced",
                                              "material_group": "II", "creepage": "6 mm", "clearance": "4 mm"}])
    result = CliRunner().invoke(main, ["publish", str(root)])
    assert result.exit_code == 0, result.output
    assert load_ledger(root).entry("amp", "A") is not None


# The ledger as a hash chain: each entry names the hash of the one before and hashes its own content.


def chain_of(archive) -> list[dict]:
    return yaml.safe_load((archive / LOCK_FILE).read_text(encoding="utf-8"))["chain"]


def write_chain(archive, chain: list[dict]) -> None:
    (archive / LOCK_FILE).write_text(yaml.safe_dump({"format": 2, "chain": chain}, sort_keys=False), encoding="utf-8")


def codes_found(archive) -> list[str]:
    return [p.code for p in frozen_problems(archive, load_ledger(archive))]


def rehash(link: dict) -> dict:
    """What someone who knows the format does after editing an entry: recompute its own hash."""
    return dict(link, hash=canonical_hash({key: value for key, value in link.items() if key != "hash"}))


def test_each_entry_names_the_hash_of_the_one_before(archive):
    published(archive)
    chain = chain_of(archive)
    assert chain[0]["previous"] == "0" * 64
    assert [link["previous"] for link in chain[1:]] == [link["hash"] for link in chain[:-1]]
    assert load_ledger(archive).head == chain[-1]["hash"] and codes_found(archive) == []


def test_an_edited_entry_is_found_even_with_its_hash_rewritten(archive):
    published(archive)
    path = archive / "amp" / "rev-A.yaml"
    path.write_text(path.read_text(encoding="utf-8").replace("2.5 mm", "4 mm"), encoding="utf-8")
    chain = chain_of(archive)
    chain[0] = rehash(dict(chain[0], sha256=record_digest(path)))  # the entry now matches the edited file
    write_chain(archive, chain)
    assert codes_found(archive) == ["ledger_chain_broken"]  # the next entry still names the old hash


def test_an_edited_entry_is_found_by_its_own_hash(archive):
    published(archive)
    chain = chain_of(archive)
    chain[1]["date"] = "2026-01-01"
    write_chain(archive, chain)
    assert codes_found(archive) == ["ledger_entry_edited"]


def test_a_deleted_entry_breaks_the_chain(archive):
    published(archive)
    chain = chain_of(archive)
    write_chain(archive, [chain[0], chain[2]])
    problems = frozen_problems(archive, load_ledger(archive))
    assert [p.code for p in problems] == ["ledger_chain_broken"]
    assert problems[0].location.line > 1 and problems[0].key == "chain[1].previous"


def test_a_hand_written_amendment_covering_a_value_change_is_found(archive):
    published(archive)
    path = archive / "amp" / "rev-A.yaml"
    path.write_text(path.read_text(encoding="utf-8").replace("2.5 mm", "4 mm"), encoding="utf-8")
    chain = chain_of(archive)
    forged = {"build": "amp", "revision": "A", "event": "amended", "date": "2026-04-02", "sha256": record_digest(path),
              "values": chain[0]["values"], "files": {}, "reason": "typo", "previous": chain[-1]["hash"], "hash": ""}
    write_chain(archive, [*chain, rehash(forged)])  # a well-formed entry: only the file's values give it away
    assert codes_found(archive) == ["published_values_changed"]


def test_amend_refuses_a_change_of_values(archive):
    published(archive)
    path = archive / "amp" / "rev-A.yaml"
    path.write_text(path.read_text(encoding="utf-8").replace("2.5 mm", "4 mm"), encoding="utf-8")
    with pytest.raises(InputError) as refused:
        amend(archive, Target.parse("amp:A"), "typo", LATER)
    assert [p.code for p in refused.value.problems] == ["published_values_changed"]


def test_a_second_spelling_beside_a_published_revision_is_found(archive):
    published(archive)
    path = archive / "amp" / "rev-A.yaml"
    (archive / "amp" / "rev-A.yml").write_text(path.read_text(encoding="utf-8").replace("2.5 mm", "4 mm"), encoding="utf-8")
    assert codes_found(archive) == ["revision_spelt_twice"]


def test_a_format_one_ledger_is_chained_when_next_published(archive):
    (archive / LOCK_FILE).write_text(yaml.safe_dump({"format": 1, "builds": {"amp": {"A": {
        "published": "2026-01-01", "sha256": record_digest(archive / "amp" / "rev-A.yaml"), "files": {}, "amendments": []}}}}), encoding="utf-8")
    assert codes_found(archive) == []
    published(archive)
    chain = chain_of(archive)
    assert [(link["build"], link["revision"], link["date"]) for link in chain][:1] == [("amp", "A", "2026-01-01")] and len(chain) == 3
    assert codes_found(archive) == []


def test_publish_check_since_a_head_shown_before_finds_a_deleted_last_entry_or_ledger(archive):
    published(archive)
    head = load_ledger(archive).head
    runner = CliRunner()
    whole = runner.invoke(main, ["publish", str(archive), "--check", "--since", head])
    assert whole.exit_code == 0 and f"ledger head: {head}" in whole.output
    write_chain(archive, chain_of(archive)[:-1])  # the last entry deleted: the chain alone cannot tell
    assert codes_found(archive) == []
    cut = runner.invoke(main, ["publish", str(archive), "--check", "--since", head[:16]])
    assert cut.exit_code == 1 and "the ledger no longer holds a head shown before" in cut.stderr
    (archive / LOCK_FILE).unlink()
    assert runner.invoke(main, ["publish", str(archive), "--check", "--since", head]).exit_code == 1


def test_the_site_shows_the_ledger_head(archive, tmp_path):
    published(archive)
    head = load_ledger(archive).head
    result = CliRunner().invoke(main, ["build", str(archive), "-o", str(tmp_path / "site"), "--no-pdf"])
    assert result.exit_code in (0, 1), result.output
    assert head in (tmp_path / "site" / "index.html").read_text(encoding="utf-8")
    assert head in (tmp_path / "site" / "builds" / "amp" / "checklist.html").read_text(encoding="utf-8")


def test_check_says_when_a_published_revision_was_edited(archive):
    published(archive)
    path = archive / "psu" / "rev-A.yaml"
    assert "has changed since" not in CliRunner().invoke(main, ["check", str(path)]).output
    path.write_text(path.read_text(encoding="utf-8").replace("club's winder", "club's coil winder"), encoding="utf-8")
    result = CliRunner().invoke(main, ["check", str(path)])
    assert result.exit_code == 2
    assert any(line.startswith(str(path)) and "has changed since" in line for line in result.output.splitlines()), result.output
