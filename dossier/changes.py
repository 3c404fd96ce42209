"""What changed from one revision to the next: record values (old -> new, with units) and findings.

Used by the changes page of every build and by `dossier diff`. Items in lists are matched by their
designator, name or path, not their position, so inserting a part does not show every later part
as changed.
"""

from __future__ import annotations

import difflib
from dataclasses import dataclass

from pydantic import BaseModel

from dossier.calcs.isolation.standard import STANDARD_LABEL
from dossier.findings import Finding, Verdict
from dossier.units import fmt
from dossier.wording import finding_change_text, finding_label, quantity_text

# The revision's own bookkeeping: always differs, or is the author's account of the change itself.
NOT_COMPARED = frozenset({"revision", "date", "changes"})
ITEM_KEYS = ("ref", "name", "path")
SHORT_TEXT = 80
SUMMARY_LENGTH = 160


@dataclass(frozen=True)
class ValueChange:
    """One record value that differs: kind is 'changed', 'added', 'removed' or 'text'."""

    key: str
    kind: str
    before: str = ""
    after: str = ""
    lines: tuple[str, ...] = ()  # for 'text': a unified diff of the two texts


@dataclass(frozen=True)
class FindingChange:
    label: str
    before: Finding | None
    after: Finding | None
    text: str
    cause: str = ""  # e.g. 'the product standard changed: IEC 60664-1 ... -> IEC 62368-1 ...'


def record_changes(old, new) -> list[ValueChange]:
    """Every value that differs between two records, in the record's own order."""
    found: list[ValueChange] = []
    _compare(old, new, (), found)
    return found


def finding_changes(old: list[Finding], new: list[Finding]) -> list[FindingChange]:
    """Findings whose verdict or value changed, that appeared, or that are no longer reported."""
    before = {finding.identity: finding for finding in old}
    after = {finding.identity: finding for finding in new}
    order = dict.fromkeys([f.identity for f in new] + [f.identity for f in old])
    changes = [_finding_change(before.get(i), after.get(i)) for i in order if _differs(before.get(i), after.get(i))]
    return sorted(changes, key=_failing_first)


def _failing_first(change: FindingChange) -> int:
    """Worst new verdict first; findings no longer reported last."""
    return change.after.verdict.rank if change.after is not None else len(Verdict)


def _finding_change(old: Finding | None, new: Finding | None) -> FindingChange:
    cause = standard_cause(old, new)
    text = finding_change_text(old, new) + (f"; {cause}" if cause else "")
    return FindingChange(finding_label(new or old), old, new, text, cause)


def standard_cause(old: Finding | None, new: Finding | None) -> str:
    """'the product standard changed: A -> B' when the two findings were judged against different standards."""
    if any(m.label == STANDARD_LABEL for m in (new or old).values):
        return ""  # the finding that names the standard shows the change as its own value
    before, after = _standard_of(old), _standard_of(new)
    if not before or not after or before == after:
        return ""
    return f"the product standard changed: {before} -> {after}"


def _standard_of(finding: Finding | None) -> str:
    if finding is None:
        return ""
    return next((str(m.quantity) for m in (*finding.values, *finding.extra) if m.label == STANDARD_LABEL), "")


def _differs(old: Finding | None, new: Finding | None) -> bool:
    if old is None or new is None:
        return True
    return old.verdict != new.verdict or _value_text(old) != _value_text(new)


def _value_text(finding: Finding) -> str:
    return quantity_text(finding.value.quantity) if finding.value is not None else ""


def _compare(old, new, path: tuple, found: list[ValueChange]) -> None:
    if isinstance(old, BaseModel) and type(old) is type(new):
        for name in type(new).model_fields:
            if not (not path and name in NOT_COMPARED):
                _compare(getattr(old, name), getattr(new, name), path + (name,), found)
    elif _is_item_list(old) and _is_item_list(new):
        _compare_lists(old, new, path, found)
    elif not _same(old, new):
        found.append(_leaf_change(old, new, key_text(path)))


def _is_item_list(value) -> bool:
    return isinstance(value, list) and all(isinstance(item, BaseModel) for item in value)


def _compare_lists(old: list, new: list, path: tuple, found: list[ValueChange]) -> None:
    before, after = _keyed(old), _keyed(new)
    for key in dict.fromkeys(list(before) + list(after)):
        _compare(before.get(key), after.get(key), path + (Item(key),), found)


@dataclass(frozen=True)
class Item:
    """A list item in a key path, named by its designator, name or path (or its position)."""

    key: object


def _keyed(items: list) -> dict:
    keys = [_item_key(item) for item in items]
    if any(key in ("", None) for key in keys) or len(set(keys)) != len(keys):
        keys = list(range(len(items)))
    return dict(zip(keys, items))


def _item_key(item) -> str | None:
    for name in ITEM_KEYS:
        value = getattr(item, name, None)
        if isinstance(value, str) and value:
            return value
    return None


def key_text(path: tuple) -> str:
    """('stages', Item('Mains input'), 'parts', Item('F1'), 'value') -> 'stages[Mains input].parts[F1].value'."""
    text = ""
    for part in path:
        text += f"[{part.key}]" if isinstance(part, Item) else (f".{part}" if text else str(part))
    return text


def _same(old, new) -> bool:
    if hasattr(old, "units") or hasattr(new, "units"):
        return _same_quantity(old, new)
    return old == new


def _same_quantity(old, new) -> bool:
    try:
        return bool(old.dimensionality == new.dimensionality and old.to(new.units).magnitude == new.magnitude)
    except Exception:  # pint raises several kinds on unrelated units or non-quantities
        return False


def _leaf_change(old, new, key: str) -> ValueChange:
    if old is None or old == [] or old == "":
        return ValueChange(key, "added", after=summary(new))
    if new is None or new == [] or new == "":
        return ValueChange(key, "removed", before=summary(old))
    if isinstance(old, str) and isinstance(new, str) and _is_long(old, new):
        return ValueChange(key, "text", lines=tuple(_text_diff(old, new)))
    before, after = _distinct(old, new)
    return ValueChange(key, "changed", before=before, after=after)


def _is_long(*texts: str) -> bool:
    return any("\n" in text.strip() or len(text) > SHORT_TEXT for text in texts)


def _text_diff(old: str, new: str) -> list[str]:
    lines = difflib.unified_diff(old.strip().splitlines(), new.strip().splitlines(), lineterm="", n=1)
    return [line for line in lines if not line.startswith(("---", "+++", "@@"))]


def _distinct(old, new) -> tuple[str, str]:
    """Both values as text, with enough digits that two different quantities never read the same."""
    if hasattr(old, "units") and hasattr(new, "units"):
        for digits in range(3, 10):
            before, after = quantity_value(old, digits), quantity_value(new, digits)
            if before != after:
                return before, after
    return summary(old), summary(new)


def summary(value) -> str:
    """A value as one short line of text: quantities with units, items as their non-default fields."""
    if hasattr(value, "units"):
        return quantity_value(value)
    if isinstance(value, BaseModel):
        return _model_summary(value)
    if isinstance(value, bool):
        return "yes" if value else "no"
    if isinstance(value, (list, tuple)):
        return ", ".join(summary(item) for item in value)
    if hasattr(value, "isoformat"):
        return value.isoformat()
    return " ".join(str(value).split())


def quantity_value(quantity, digits: int = 3) -> str:
    """Like units.fmt, but whole numbers stay whole: 1500 A, not 1.5e+03 A."""
    magnitude = quantity.magnitude
    if isinstance(magnitude, float) and magnitude.is_integer() and abs(magnitude) < 1e9:
        return fmt(quantity.__class__(int(magnitude), quantity.units), digits)
    return fmt(quantity, digits)


def _model_summary(model: BaseModel) -> str:
    dumped = model.model_dump(mode="json", exclude_defaults=True)
    parts = [f"{name} {_dumped_text(value)}" for name, value in dumped.items()]
    text = ", ".join(parts)
    return text if len(text) <= SUMMARY_LENGTH else text[: SUMMARY_LENGTH - 1] + "…"


def _dumped_text(value) -> str:
    if isinstance(value, dict):
        return "{" + ", ".join(f"{k} {_dumped_text(v)}" for k, v in value.items()) + "}"
    if isinstance(value, list):
        return "[" + ", ".join(_dumped_text(v) for v in value) + "]"
    return " ".join(str(value).split())
