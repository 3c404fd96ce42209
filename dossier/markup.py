"""Putting record text into generated Markdown so that it shows as text and can inject nothing.

Two kinds of record text:
  plain text (titles, part values, captions): every character shows as typed.
  prose (summary, changes, notes): Markdown emphasis, lists and web links keep working, but raw
  HTML, scripts, attribute blocks, images and links to anything but http(s) or mailto show as text.

Everything is escaped before Markdown sees it, so the safety does not depend on which Markdown
extensions a site enables. A page title goes through title_text: the theme prints titles into
<title> and the navigation without escaping them.
"""

from __future__ import annotations

import html
import json
import re

# Characters Python-Markdown treats as syntax inside a line (the tables extension adds '|').
_INLINE_SYNTAX = re.compile(r"([\\`*_\[\]{}|!])")
# Syntax that only counts at the start of a line: headings, quotes, list markers, numbered lists.
_LINE_START = re.compile(r"^(\s*)([#>+\-=](?=\s|$)|#|\d+(?=[.)](?:\s|$)))")
_SAFE_LINK = re.compile(r"^(https?://[^\s()]+|mailto:[^\s()]+)$", re.IGNORECASE)
_INLINE_TARGET = re.compile(r"\]\(\s*(?P<target>[^\s)]*)")
# Anywhere, not only at a line start: inside a list item the definition's indent is stripped first.
_REFERENCE_DEFINITION = re.compile(r"\[(?P<label>[^\]\n]*)\]:\s*(?P<target>\S*)")
# Admonition and collapsible-block markers: record text must not draw a box like the site's own caution.
_BLOCK_MARKER = re.compile(r"^(?P<indent>[ \t]*)(?P<mark>[!?])(?=(?P=mark){2})", re.MULTILINE)
_ATX_HEADING = re.compile(r"^(?P<indent> {0,3})(?P<marks>#{1,6})(?=\s|$)", re.MULTILINE)
_HEADING_SHIFT = 2


def text(value) -> str:
    """Plain text on one line: shows exactly as typed, whatever characters it holds."""
    escaped = _INLINE_SYNTAX.sub(r"\\\1", html.escape(_one_line(value), quote=False))
    return _LINE_START.sub(_escape_line_start, escaped)


def cell(value) -> str:
    """Plain text for a table cell; an empty value shows as a dash."""
    shown = text(value)
    return shown if shown.strip() else "–"


def prose(value, heading_floor: int = 3) -> str:
    """Record Markdown made safe: no HTML, no attribute blocks, only web and mail links, no images."""
    escaped = html.escape(str(value or ""), quote=False).replace("{", "\\{").replace("}", "\\}")
    escaped = _INLINE_TARGET.sub(_neutralise_inline, escaped)
    escaped = _REFERENCE_DEFINITION.sub(_neutralise_definition, escaped)
    escaped = escaped.replace("![", "\\![")
    escaped = _BLOCK_MARKER.sub(lambda m: f"{m['indent']}&#{ord(m['mark'])};", escaped)
    return _separate_lists(_demote_headings(escaped, heading_floor)).strip()


_LIST_ITEM = re.compile(r"^\s{0,3}(?:[-*+]|\d{1,9}[.)])\s+\S")


def _separate_lists(text: str) -> str:
    """A blank line before a list that follows a line of text, as people write lists in notes and changes;
    Markdown would otherwise run the list into the paragraph above it."""
    lines = text.split("\n")
    out: list[str] = []
    for line in lines:
        starts_list = bool(_LIST_ITEM.match(line))
        after_text = bool(out) and out[-1].strip() != "" and not _LIST_ITEM.match(out[-1]) and not out[-1].startswith((" ", "\t"))
        if starts_list and after_text:
            out.append("")
        out.append(line)
    return "\n".join(out)


def title_text(value) -> str:
    """A page or navigation title: HTML-escaped once, on one line (the theme prints it as is)."""
    return html.escape(_one_line(value), quote=True)


def yaml_string(value) -> str:
    """A quoted YAML scalar for generated front matter and config (JSON strings are valid YAML)."""
    return json.dumps(str(value), ensure_ascii=False)


def fence(value) -> str:
    """A fenced code block that no backtick run inside the text can close early."""
    body = str(value or "")
    longest = max((len(run) for run in re.findall(r"`+", body)), default=0)
    marks = "`" * max(3, longest + 1)
    return f"{marks}text\n{body.rstrip()}\n{marks}"


def is_safe_link(target: str) -> bool:
    return bool(_SAFE_LINK.match(target))


def _one_line(value) -> str:
    return " ".join(str(value if value is not None else "").split())


def _escape_line_start(match: re.Match) -> str:
    return f"{match[1]}\\{match[2]}" if not match[2][0].isdigit() else f"{match[1]}{match[2]}\\"


def _neutralise_inline(match: re.Match) -> str:
    if is_safe_link(match["target"]):
        return match[0]
    return "]\\(" + match[0][2:]


def _neutralise_definition(match: re.Match) -> str:
    if is_safe_link(match["target"]):
        return match[0]
    return "\\[" + match[0][1:]


def _demote_headings(body: str, floor: int) -> str:
    """Record headings sit under the page's own: '# x' becomes at least level `floor`."""

    def shift(match: re.Match) -> str:
        level = min(6, max(floor, len(match["marks"]) + _HEADING_SHIFT))
        return match["indent"] + "#" * level

    return _ATX_HEADING.sub(shift, body)
