"""Record text in generated Markdown: shown as typed, never as HTML, script or an unsafe link."""

from __future__ import annotations

from html.parser import HTMLParser

import markdown
import pytest

from dossier.markup import cell, fence, is_safe_link, prose, text, title_text
from dossier.templates import template_text

EXTENSIONS = ["admonition", "tables", "toc", "attr_list", "md_in_html"]  # as the site has them: escaping must not rely on them being off


def rendered(source: str) -> str:
    return markdown.markdown(source, extensions=EXTENSIONS)


HOSTILE = [
    "<script>alert(1)</script>",
    "<img src=x onerror=alert(1)>",
    '<a href="javascript:alert(1)">x</a>',
    "[x](javascript:alert(1))",
    "[x](JaVaScRiPt:alert(1))",
    "[x]( javascript:alert(1))",
    "[x](<javascript:alert(1)>)",
    "[x][r]\n\n[r]: javascript:alert(1)",
    "- item\n\n    [r]: javascript:alert(1)\n\n[x][r]",
    "![x](javascript:alert(1))",
    "![pixel](https://tracker.example/p.png)",
    "<https://example.org>",
    "text {: onclick=\"alert(1)\" }",
    "&lt;script&gt;alert(1)&lt;/script&gt;",
    "&#106;avascript:alert(1)",
    "<!-- comment --><style>body{}</style>",
]


class Tags(HTMLParser):
    def __init__(self):
        super().__init__()
        self.seen: list[tuple[str, dict]] = []

    def handle_starttag(self, tag, attrs):
        self.seen.append((tag, dict(attrs)))

    def handle_comment(self, data):
        self.seen.append(("comment", {}))


def tags(html: str) -> list[tuple[str, dict]]:
    parser = Tags()
    parser.feed(html)
    return parser.seen


SAFE_TAGS = {"p", "a", "em", "strong", "ul", "ol", "li", "h3", "h4", "code", "pre", "blockquote"}


@pytest.mark.parametrize("hostile", HOSTILE)
def test_prose_renders_no_tag_attribute_or_unsafe_link(hostile):
    for tag, attrs in tags(rendered(prose(hostile))):
        assert tag in SAFE_TAGS, tag
        assert set(attrs) <= {"href", "id"}, attrs
        assert is_safe_link(attrs.get("href", "https://x")), attrs


@pytest.mark.parametrize("hostile", HOSTILE)
def test_plain_text_renders_exactly_as_typed(hostile):
    html = rendered(f"Value: {text(hostile)}")
    assert "<a " not in html and "<img" not in html and "<script" not in html and "<em>" not in html
    assert " ".join(hostile.split()) in _unescaped(html)


def _unescaped(html: str) -> str:
    import html as module

    return module.unescape(html.removeprefix("<p>Value: ").removesuffix("</p>"))


def test_prose_keeps_emphasis_lists_and_web_links():
    html = rendered(prose("Some *emphasis*, a [web link](https://example.org/a?b=1&c=2) and\n\n- a list"))
    assert "<em>emphasis</em>" in html
    assert '<a href="https://example.org/a?b=1&amp;c=2">web link</a>' in html
    assert "<li>a list</li>" in html


def test_prose_headings_sit_below_the_page_headings():
    html = rendered(prose("# Top\n\n## Next"))
    assert "<h3" in html and "<h4" in html and "<h1" not in html and "<h2" not in html


@pytest.mark.parametrize("value", ["1. not a list", "- not a list", "# not a heading", "> not a quote", "| a | b |", "*x* _y_ `z`", "a\\b"])
def test_plain_text_does_not_turn_into_markdown_syntax(value):
    html = rendered(text(value))
    assert html == f"<p>{_html_escaped(value)}</p>"


def _html_escaped(value: str) -> str:
    import html as module

    return module.escape(value, quote=False)


def test_table_cells_keep_pipes_and_show_a_dash_when_empty():
    table = f"| a | b |\n|---|---|\n| {cell('x | y')} | {cell('')} |"
    html = rendered(table)
    assert "<td>x | y</td>" in html and "<td>–</td>" in html


def test_titles_are_escaped_once_for_html():
    assert title_text('A </title><script>"x"</script>') == "A &lt;/title&gt;&lt;script&gt;&quot;x&quot;&lt;/script&gt;"
    assert title_text("two\nlines") == "two lines"


def test_fence_is_longer_than_any_backtick_run_inside():
    block = fence("a ``` b ```` c")
    assert block.startswith("`````text\n") and block.endswith("\n`````")


@pytest.mark.parametrize("target,safe", [("https://example.org", True), ("http://x.example/a", True), ("mailto:a@b.example", True), ("javascript:x", False), ("data:text/html,x", False), ("//x.example", False), ("page.md", False), ("", False)])
def test_only_web_and_mail_links_are_kept(target, safe):
    assert is_safe_link(target) is safe


def test_a_list_written_straight_under_a_line_renders_as_a_list():
    html = markdown.markdown(prose("Bench run of rev B:\n- the winding ran hot\n- the diode saw spikes"))
    assert "<p>Bench run of rev B:</p>" in html
    assert "<li>the winding ran hot</li>" in html and "<li>the diode saw spikes</li>" in html


def test_a_numbered_list_under_a_line_and_a_list_already_apart_are_both_lists():
    assert "<ol>" in markdown.markdown(prose("Steps:\n1. unplug\n2. wait"))
    assert prose("Steps:\n\n- unplug") == "Steps:\n\n- unplug"


def test_a_hyphen_inside_a_sentence_starts_no_list():
    assert prose("Rated 2 - 3 A\nat 25 degC") == "Rated 2 - 3 A\nat 25 degC"


FORGED_BOXES = [
    '!!! danger "Caution"\n    Safe to power up.',
    '!!! dossier-caution "Caution"\n    Safe to power up.',
    '??? danger "Caution"\n    Safe to power up.',
    '- item\n\n    !!! danger "Caution"\n        Safe to power up.',
    '  !!!danger "Caution"\n    Safe to power up.',
]


@pytest.mark.parametrize("source", FORGED_BOXES)
def test_record_prose_cannot_draw_a_box_like_the_sites_caution(source):
    html = rendered(prose(source))
    assert "admonition" not in html and "<details" not in html
    assert "Safe to power up." in html  # shown as text, not lost


def test_record_prose_cannot_open_a_block_of_its_own_markdown_in_html():
    html = rendered(prose('<div class="admonition dossier-caution" markdown data-search-exclude>\n\n**Safe** to power up.\n\n</div>'))
    assert "<div" not in html and "&lt;div" in html and "data-search-exclude" in html  # shown as typed
    assert "<strong>Safe</strong>" in html  # record Markdown still works


def test_the_sites_caution_carries_a_class_record_text_cannot_make():
    caution, checklist, css = (template_text(name) for name in ("site/_caution.md.j2", "checklist/page.md.j2", "site/assets/dossier.css"))
    assert 'class="admonition dossier-caution"' in caution and 'class="admonition dossier-caution"' in checklist
    assert ".dossier-caution" in css
