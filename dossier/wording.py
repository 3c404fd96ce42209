"""Every sentence dossier says about problems and findings is made here, from structured data."""

from __future__ import annotations

from dossier.findings import Finding, Measure, Source, Verdict
from dossier.problems import Problem
from dossier.units import fmt

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
    "not_a_mapping": "a record must be a mapping",
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


def measure_text(measure: Measure | None) -> str:
    if measure is None:
        return ""
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
    return f"{quantity_text(finding.value.quantity)} {_relation(finding.relation)} {quantity_text(finding.limit.quantity)} ({finding.limit.label})"


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


def verdict_summary_text(tally: dict) -> str:
    """'2 fail, 1 marginal, 12 pass' from counts by verdict."""
    shown = [f"{tally.get(verdict, 0)} {verdict.value}" for verdict in (Verdict.FAIL, Verdict.MARGINAL, Verdict.PASS)]
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
    return f"{bound} {quantity_text(finding.limit.quantity)} ({finding.limit.label})"


NO_FAILING_TEXT = "No check fails and none is marginal."
NOTHING_TO_CHECK_TEXT = "Nothing in this record for this calc to check."
NO_FINDING_CHANGED_TEXT = "No finding changed verdict or value."

PROBLEM_TEXT.update({
    "temperature_difference": "a temperature is needed, not a difference",
    "hidden_character": "text holds a control or direction-changing character",
    "blank_text": "text is blank",
    "duplicate_designator": "designator given twice",
    "revision_spelt_twice": "one revision in two files",
    "attachment_type": "attachment of a type that is not published",
    "attachment_name": "attachment name would break its link",
    "ledger_chain_broken": "the ledger's chain is broken",
    "ledger_entry_edited": "a ledger entry does not match its hash",
    "ledger_event_invalid": "a ledger entry is out of order",
    "published_values_changed": "a published revision's values have changed",
    "ledger_history_rewritten": "the ledger no longer holds a head shown before",
})
