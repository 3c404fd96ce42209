"""The readable report `dossier check` prints, made from the same result as the JSON one."""

from __future__ import annotations

from dossier.caution import MAINS_CAUTION
from dossier.findings import Finding, Verdict, counts
from dossier.report.result import CheckResult, RecordCheck
from dossier.wording import comparison_text, help_lines, margin_text, problem_line, signoff_line, sources_text, verdict_word

# The verdict's own word, as the summary line and the JSON say it; capitals so a line's verdict stands out.
MARKS = {verdict: verdict.value.upper().ljust(max(len(v.value) for v in Verdict)) for verdict in Verdict}


def check_text(result: CheckResult, verbose: bool) -> str:
    lines: list[str] = []
    for record in result.records:
        lines.extend(record_lines(record, verbose))
    helps = help_lines([problem for record in result.records for problem in record.problems])
    return "\n".join(lines + ([""] + helps if helps else []) + ["", f"Caution: {MAINS_CAUTION}"])


def record_lines(record: RecordCheck, verbose: bool) -> list[str]:
    lines = record_block(record.title, record.findings, record.locate, verbose) if record.findings is not None else []
    lines.extend(problem_block(record.problems))
    if record.commissioning is not None and record.commissioning.commissioning is not None:
        lines.append("  commissioning: " + record.commissioning.overview_text())
    if record.signoff is not None:
        lines.append("  sign-off: " + signoff_line(record.signoff))
    return lines


def finding_lines(finding: Finding, locate) -> list[str]:
    head = f"  {MARKS[finding.verdict]}  {finding.code:<22} {finding.subject}: {finding.title}"
    lines = [head]
    comparison = comparison_text(finding)
    if comparison:
        margin = margin_text(finding)
        lines.append(f"        {comparison}" + (f"; {margin}" if margin else ""))
    if finding.explanation and finding.verdict is not Verdict.PASS:
        lines.append(f"        {finding.explanation}")
    if finding.keys and finding.verdict is not Verdict.PASS:
        lines.append(f"        at {locate(finding.keys[0])}")
    if finding.sources:
        lines.append(f"        source: {sources_text(finding)}")
    return lines


def record_block(title: str, findings: list[Finding], locate, verbose: bool) -> list[str]:
    lines = [title]
    shown = findings if verbose else [f for f in findings if f.verdict is not Verdict.PASS]
    for finding in sorted(shown, key=lambda f: f.verdict.rank):
        lines.extend(finding_lines(finding, locate))
    lines.append("  " + summary_text(findings))
    return lines


def summary_text(findings: list[Finding]) -> str:
    tally = counts(findings)
    return ", ".join(f"{n} {verdict_word(verdict)}" for verdict, n in tally.items())


def problem_block(problems) -> list[str]:
    return [problem_line(p) for p in problems]
