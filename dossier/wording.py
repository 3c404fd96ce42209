"""Every sentence dossier says about problems and findings is made here, from structured data."""

from __future__ import annotations

import difflib
import re

from dossier.findings import Finding, Measure, Source, Verdict
from dossier.problems import Problem
from dossier.units import fmt, fmt_apart

PROBLEM_TEXT = {
    "missing": "required key is missing",
    "extra_forbidden": "unknown key",
    "missing_unit": "a unit is needed",
    "wrong_dimension": "wrong kind of unit",
    "unknown_unit": "unit not recognised",
    "below_absolute_zero": "impossible temperature",
    "not_a_quantity": "not a value with a unit",
    "duplicate_key": "key given twice",
    "yaml_syntax": "YAML syntax error",
    "yaml_value": "value cannot be read",
    "not_utf8": "file is not UTF-8 text",
    "file_too_large": "file too large",
    "file_unreadable": "file cannot be read",
    "too_many_nodes": "too many values",
    "too_deep": "nesting too deep",
    "control_character": "file holds a control character",
    "yaml_tag": "YAML tags are not allowed",
    "merge_key": "YAML merge keys are not supported",
    "bad_key": "key must be plain text",
    "not_a_mapping": "no keys at the top of the file",
    "revision_mismatch": "revision does not match the file name",
    "id_mismatch": "id does not match the build folder",
    "attachment_missing": "attachment not found",
    "unsafe_path": "path leaves the archive",
    "path_missing": "no such file or folder",
    "literal_error": "not one of the allowed values",
    "string_pattern_mismatch": "text is not in the expected form",
    "unknown_item": "no such item on this revision's checklist",
    "value_not_expected": "this item takes no measured value",
    "build_mismatch": "build does not match the folder",
    "same_person": "the witness must be a second person",
    "temperature_not_rise": "a temperature rise is needed, not a reading",
    "published_changed": "this revision was published and its file has changed since",
    "published_missing": "a published revision's record file is gone",
    "published_file_changed": "a file attached to a published revision has changed",
    "not_published": "this revision has not been published",
    "nothing_to_amend": "nothing to amend",
    "unknown_revision": "no such build or revision",
}


def counted(number: int, noun: str) -> str:
    """'1 build', '3 builds': a count with its noun in the right number."""
    return f"{number} {noun if number == 1 else noun + 's'}"


def problem_line(problem: Problem) -> str:
    """One line per problem: 'file:line:col: key: what; expected X, found Y (hint)'."""
    head = f"{problem.location}: "
    if problem.key:
        head += f"{problem.key}: "
    text = head + PROBLEM_TEXT.get(problem.code, problem.code.replace("_", " "))
    details = [part for part in (_expected(problem), _found(problem)) if part]
    if details:
        text += "; " + ", ".join(details)
    if problem.hint:
        text += f" ({problem.hint})"
    return text


def _expected(problem: Problem) -> str:
    return f"expected {problem.expected}" if problem.expected else ""


def _found(problem: Problem) -> str:
    return f"found {problem.found}" if problem.found else ""


def measure_text(measure: Measure | None, limit: Measure | None = None) -> str:
    """'declared 2.5 mm'; given the finding's limit, with the digits it takes to tell the two apart."""
    if measure is None:
        return ""
    if limit is not None:
        return f"{measure.label} {quantities_apart(measure.quantity, limit.quantity)[0]}"
    return f"{measure.label} {quantity_text(measure.quantity)}"


def quantity_text(quantity) -> str:
    if hasattr(quantity, "units"):
        return fmt(quantity)
    return str(quantity)


def comparison_text(finding: Finding) -> str:
    """'3.2 mm >= 2.5 mm required' or '' when the finding has no limit."""
    if finding.value is None:
        return ""
    if finding.limit is None:
        return quantity_text(finding.value.quantity)
    value, limit = quantities_apart(finding.value.quantity, finding.limit.quantity)
    return f"{value} {_relation(finding.relation)} {limit} ({finding.limit.label})"


def quantities_apart(value, limit) -> tuple[str, str]:
    """A value and its limit as text, with enough digits to show that they differ when they do."""
    if hasattr(value, "units") and hasattr(limit, "units"):
        return fmt_apart(value, limit)
    return quantity_text(value), quantity_text(limit)


def _relation(relation: str) -> str:
    return {">=": "vs at least", "<=": "vs at most"}.get(relation, relation)


def margin_text(finding: Finding) -> str:
    """By how much the value clears or misses its limit, in the value's units."""
    if finding.value is None or finding.limit is None or not hasattr(finding.value.quantity, "units"):
        return ""
    value, limit = finding.value.quantity, finding.limit.quantity.to(finding.value.quantity.units)
    gap = value - limit if finding.relation == ">=" else limit - value
    if gap.check("[temperature]"):
        gap = gap.to("kelvin")  # a difference of temperatures reads better in K than as a 'delta degC'
    word = "short by" if gap.magnitude < 0 else "margin"
    return f"{word} {fmt(abs(gap))}"


def source_text(source: Source) -> str:
    if source.is_common_practice:
        return f"common practice: {source.title}"
    parts = [source.title]
    if source.edition:
        parts.append(source.edition)
    if source.clause:
        parts.append(source.clause)
    text = ", ".join(parts)
    return f"{text} ({source.publisher})" if source.publisher else text


def sources_text(finding: Finding) -> str:
    return "; ".join(source_text(source) for source in finding.sources)


# Changes between revisions (the changes page and `dossier diff`).


def finding_label(finding: Finding) -> str:
    """'Clearance (primary to output)': what a finding is about, the same in every revision."""
    return f"{finding.title} ({finding.subject})" if finding.subject else finding.title


def finding_state_text(finding: Finding | None) -> str:
    """'fail, 2.5 mm' or 'not reported'."""
    if finding is None:
        return "not reported"
    value = quantity_text(finding.value.quantity) if finding.value is not None else ""
    return f"{finding.verdict.value}, {value}" if value else finding.verdict.value


def finding_change_text(old: Finding | None, new: Finding | None) -> str:
    """'clearance (primary to output): fail -> pass (2.5 mm -> 4 mm)'."""
    label = finding_label(new or old)
    if old is None:
        return f"{label}: new finding, {finding_state_text(new)}"
    if new is None:
        return f"{label}: no longer reported (was {finding_state_text(old)})"
    verdicts = f"{old.verdict.value} -> {new.verdict.value}" if old.verdict != new.verdict else f"still {new.verdict.value}"
    values = _value_change(old, new)
    return f"{label}: {verdicts}" + (f" ({values})" if values else "")


def _value_change(old: Finding, new: Finding) -> str:
    before = quantity_text(old.value.quantity) if old.value is not None else ""
    after = quantity_text(new.value.quantity) if new.value is not None else ""
    return f"{before or 'no value'} -> {after or 'no value'}" if before != after else ""


# A mark beside each verdict word, so a verdict reads without colour (and the colour only repeats it).
VERDICT_MARKS = {Verdict.FAIL: "\u2717", Verdict.NOT_ASSESSED: "?", Verdict.MARGINAL: "!", Verdict.PASS: "\u2713", Verdict.INFO: "i"}


def verdict_word(verdict: Verdict) -> str:
    """The verdict as a person reads it: 'not assessed', 'fail', ..."""
    return verdict.value.replace("-", " ")


def verdict_summary_text(tally: dict) -> str:
    """'2 fail, 1 marginal, 12 pass' from counts by verdict; 'not assessed' only when there are any."""
    shown = [f"{tally.get(verdict, 0)} {verdict_word(verdict)}" for verdict in (Verdict.FAIL, Verdict.MARGINAL, Verdict.PASS)]
    if tally.get(Verdict.NOT_ASSESSED):
        shown.insert(1, f"{tally[Verdict.NOT_ASSESSED]} not assessed")
    return ", ".join(shown)


def verdict_counts_text(tally: dict) -> str:
    """'2 fail, 1 marginal, 12 pass, and 5 for information'."""
    info = tally.get(Verdict.INFO, 0)
    return verdict_summary_text(tally) + (f", and {info} for information" if info else "")


def limit_text(finding: Finding) -> str:
    """'at least 3 mm (required clearance)', or '' when the finding has no limit."""
    if finding.limit is None:
        return ""
    bound = {">=": "at least", "<=": "at most"}.get(finding.relation, finding.relation)
    limit = quantities_apart(finding.value.quantity, finding.limit.quantity)[1] if finding.value is not None else quantity_text(finding.limit.quantity)
    return f"{bound} {limit} ({finding.limit.label})"


NO_FAILING_TEXT = "No check fails and none is marginal."
NOTHING_TO_CHECK_TEXT = "Nothing in this record for this calc to check."
NO_FINDING_CHANGED_TEXT = "No finding changed verdict or value."


# The sign-off state of a revision, as a person reads it (dossier.signoff.state.ReviewState values).
REVIEW_STATE_WORDS = {
    "not-reviewed": "not reviewed",
    "stale": "stale: every sign-off predates the record or an attachment as it is now",
    "review-outdated": "review outdated: the checks changed since the newest sign-off was made, so a re-review is needed",
    "changes-requested": "reviewed, changes requested",
    "cleared-for-enclosure": "cleared for the enclosure",
    "cleared-for-power-up": "cleared for first power-up",
}
REVIEW_STATE_SHORT = {
    "not-reviewed": "not reviewed",
    "stale": "stale",
    "review-outdated": "review outdated",
    "changes-requested": "changes requested",
    "cleared-for-enclosure": "cleared for enclosure",
    "cleared-for-power-up": "cleared for power-up",
}


def signoff_line(state) -> str:
    """'cleared for first power-up by A. Reviewer on 2026-05-10 (signoff-C.yaml)', or the state alone."""
    words = REVIEW_STATE_WORDS[state.state.value]
    if state.outdated is not None:
        return outdated_line(state.outdated)
    if state.deciding is None:
        return words
    entry = state.deciding.entry
    return f"{words}, by {entry.reviewer} on {entry.date.isoformat()} ({state.deciding.signoff.path.name})"

CLEARANCE_WORDS = {"not-cleared": "not cleared", "enclosure": "cleared for the enclosure", "first-power-up": "cleared for first power-up"}


def outdated_line(judged) -> str:
    """'review outdated: the checks changed after signoff-C.yaml (A. Reviewer, 2026-05-10: cleared for first
    power-up), so ...; new since that review, needing a decision: ...'."""
    entry = judged.entry
    made = f"{judged.signoff.path.name} ({entry.reviewer}, {entry.date.isoformat()}: {CLEARANCE_WORDS[entry.clearance.value]})"
    return (f"review outdated: the checks changed after {made}, so it no longer counts and the revision is not cleared "
            f"until a re-review; {since_review_text(judged.outdated)}")


def since_review_text(outdated) -> str:
    """Which findings are new or changed since the review, as far as the sign-off shows it."""
    if outdated.without_digest:
        return (f"it does not name {_finding_list(outdated.unnamed)}, which block power-up now "
                "(it has no reviewed_findings, so they are taken as new since it was made)")
    parts = []
    if outdated.unnamed:
        parts.append(f"new since that review, needing a decision: {_finding_list(outdated.unnamed)}")
    if outdated.settled:
        parts.append("named in it but no longer needing a decision: " + ", ".join(f"{d.code} ({d.subject})" for d in outdated.settled))
    return "; ".join(parts) or "the verdict or figures of a finding it names changed"


def _finding_list(findings) -> str:
    ordered = sorted(findings, key=lambda f: (f.verdict.rank, f.code, f.subject))
    return ", ".join(f"{f.code} ({f.subject}, {verdict_word(f.verdict)})" for f in ordered)


def decision_text(decision) -> str:
    """'ISO-CREEPAGE (primary to output): accepted: reason; responsibility: name' or '...: to fix: what'."""
    head = f"{decision.code} ({decision.subject})"
    if decision.decision.value == "fix":
        return f"{head}: to fix" + (f": {decision.reason}" if decision.reason else "")
    who = f"; responsibility: {decision.responsible}" if decision.responsible else ""
    return f"{head}: accepted: {decision.reason}{who}"


def accepted_text(decision, state) -> str:
    """Beside an accepted finding: who accepted it, why, and who answers for it; '' when not accepted."""
    if decision is None:
        return ""
    entry = state.deciding.entry
    who = f" Responsibility taken by {decision.responsible}." if decision.responsible else ""
    return f"Accepted by {entry.reviewer} on {entry.date.isoformat()}: {decision.reason}.{who}"


# Problems found while validating a file against its model (dossier.reading.model_file), the same words
# for every file kind: records, archive.yaml, published.yaml, commissioning files.

EMPTY_FILE_TEXT = "an empty file"

EXPECTED_BY_KIND = {
    "missing": "this key",
    "extra_forbidden": "a known key",
    "string_too_long": "at most {max_length} characters",
    "string_too_short": "at least {min_length} character(s)",
    "too_short": "at least {min_length} item(s)",
    "too_long": "at most {max_length} item(s)",
    "greater_than": "a number above {gt}",
    "greater_than_equal": "a number of at least {ge}",
    "less_than": "a number below {lt}",
    "less_than_equal": "a number of at most {le}",
    "string_pattern_mismatch": "text matching {pattern}",
    "string_type": "text",
    "int_type": "a whole number",
    "int_parsing": "a whole number",
    "int_from_float": "a whole number",
    "float_type": "a number",
    "float_parsing": "a number",
    "bool_type": "true or false",
    "bool_parsing": "true or false",
    "list_type": "a list",
    "dict_type": "a mapping",
    "model_type": "a mapping",
    "model_attributes_type": "a mapping",
    "date_type": "a date (YYYY-MM-DD)",
    "date_parsing": "a date (YYYY-MM-DD)",
    "date_from_datetime_parsing": "a date (YYYY-MM-DD)",
    "date_from_datetime_inexact": "a date (YYYY-MM-DD)",
}
LONGEST_FOUND = 60


def either(options: list[str]) -> str:
    """'a', 'a or b', 'a, b or c'."""
    return options[0] if len(options) == 1 else ", ".join(options[:-1]) + " or " + options[-1]


def validation_expected(kind: str, context: dict, message: str) -> str:
    """What a key should have held, from a validation error's kind and context."""
    if "expected" in context:
        return str(context["expected"])
    template = EXPECTED_BY_KIND.get(kind)
    if template:
        try:
            return template.format(**context)
        except KeyError:
            pass
    return message.removeprefix("Value error, ")


def validation_found(kind: str, context: dict, value: object, key_path: tuple) -> str:
    """What a key held instead: nothing for a missing key, the key's own name for an unknown key."""
    if "found" in context:
        return str(context["found"])
    if kind == "missing":
        return "nothing"
    if kind == "extra_forbidden":
        return repr(str(key_path[-1])) if key_path else "an unknown key"
    if isinstance(value, dict):
        return "a mapping"
    if isinstance(value, list):
        return "a list"
    text = repr(value)
    return text if len(text) <= LONGEST_FOUND else text[: LONGEST_FOUND - 3] + "..."


def did_you_mean(name: str, known: list[str]) -> str:
    close = difflib.get_close_matches(name, known, n=1, cutoff=0.6)
    return f"did you mean '{close[0]}'?" if close else ""


def unknown_key_hint(name: str, known: list[str], previous: tuple[str, object] | None) -> str:
    """A close known key, or, when the 'key' reads like a value (a number, or a number with a unit), the
    likely cause: a comma inside an unquoted value in a { } mapping, which YAML reads as a new key."""
    if _looks_like_a_value(name):
        example = f'{previous[0]}: "{previous[1]}, {name}"' if previous and isinstance(previous[1], str) else f'value: "6.3 V, {name}"'
        return f"this looks like part of a value, not a key: put a value holding a comma in quotes, e.g. {example}"
    return did_you_mean(name, known)


def _looks_like_a_value(name: str) -> bool:
    return re.match(r"^\s*[-+]?(\d+(\.\d*)?|\.\d+)", name) is not None


# One wording for each kind of validation problem, whichever of pydantic's codes names it.
WRONG_TYPE_KINDS = (
    "string_type", "int_type", "int_parsing", "int_from_float", "float_type", "float_parsing", "bool_type", "bool_parsing",
    "list_type", "dict_type", "model_type", "model_attributes_type", "date_type", "date_parsing",
    "date_from_datetime_parsing", "date_from_datetime_inexact",
)
OUT_OF_RANGE_KINDS = ("greater_than", "greater_than_equal", "less_than", "less_than_equal")
LENGTH_KINDS = ("string_too_long", "string_too_short", "too_short", "too_long")
PROBLEM_TEXT.update({kind: "wrong type of value" for kind in WRONG_TYPE_KINDS})
PROBLEM_TEXT.update({kind: "value out of range" for kind in OUT_OF_RANGE_KINDS})
PROBLEM_TEXT.update({kind: "wrong length" for kind in LENGTH_KINDS})
PROBLEM_TEXT["enum"] = PROBLEM_TEXT["literal_error"]


PROBLEM_TEXT.update({
    "temperature_difference": "a temperature is needed, not a difference",
    "hidden_character": "text holds a control or direction-changing character",
    "blank_text": "text is blank",
    "duplicate_designator": "designator given twice",
    "unknown_topology": "topology not known for this kind of stage",
    "duplicate_stage_id": "stage id given twice",
    "unknown_stage": "no stage has this id",
    "stage_loop": "stages feed each other round a circle",
    "duplicate_rail": "rail name given twice",
    "unknown_rail_winding": "no magnetic has this winding",
    "revision_spelt_twice": "one revision in two files",
    "attachment_type": "attachment of a type that is not published",
    "attachment_name": "attachment name would break its link",
    "ledger_chain_broken": "the ledger's chain is broken",
    "ledger_entry_edited": "a ledger entry does not match its hash",
    "ledger_event_invalid": "a ledger entry is out of order",
    "published_values_changed": "a published revision's values have changed",
    "ledger_history_rewritten": "the ledger no longer holds a head shown before",
})


# Where the docs explain each kind of problem: printed once per kind after a list of problems.
HELP_SECTIONS = {
    "units and values": ("docs/writing-records.md#units-and-values", (
        "missing_unit", "wrong_dimension", "unknown_unit", "not_a_quantity", "below_absolute_zero", "value_out_of_range",
        "temperature_not_rise", "temperature_difference")),
    "keys": ("docs/writing-records.md#keys", ("missing", "extra_forbidden", "duplicate_key", "literal_error", "string_pattern_mismatch")),
    "stages and rails": ("docs/writing-records.md#stages-and-rails", (
        "unknown_topology", "duplicate_stage_id", "unknown_stage", "stage_loop", "duplicate_rail", "unknown_rail_winding")),
    "YAML": ("docs/writing-records.md#yaml-itself", (
        "yaml_syntax", "yaml_value", "yaml_tag", "merge_key", "bad_key", "not_a_mapping", "not_utf8", "control_character",
        "too_many_nodes", "too_deep", "file_too_large")),
    "where a record sits": ("docs/writing-records.md#where-a-record-sits", ("id_mismatch", "revision_mismatch", "revision_spelt_twice", "build_mismatch")),
    "text": ("docs/writing-records.md#text", ("blank_text", "hidden_character")),
    "attachments": ("docs/writing-records.md#attachments", ("attachment_missing", "unsafe_path", "attachment_type", "attachment_name")),
    "published revisions": ("docs/writing-records.md#published-revisions", (
        "published_changed", "published_missing", "published_file_changed", "published_values_changed")),
}


def help_lines(problems) -> list[str]:
    """'help with units and values: docs/writing-records.md#units-and-values', once per kind met, in a stable order."""
    codes = {problem.code for problem in problems}
    return [f"help with {kind}: {where}" for kind, (where, kinds) in HELP_SECTIONS.items() if codes & set(kinds)]


def fix_text(decision) -> str:
    """Beside a finding the sign-off sent back: 'to fix' with what must change; '' for any other decision."""
    if decision is None or decision.decision.value != "fix":
        return ""
    return decision.reason or "to fix"
