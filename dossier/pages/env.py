"""The Jinja2 environment for site pages: record text is escaped unless a filter has made it safe.

Templates write Markdown, so HTML autoescaping does not fit; instead every value printed with
{{ ... }} passes through `finalize`, which escapes it as plain text unless it is Markdown that a
filter in this module produced (the Md type). A template that forgets a filter shows text with a
stray backslash; it never injects anything.
"""

from __future__ import annotations

from functools import lru_cache

import jinja2

from dossier import markup
from dossier.templates import templates_dir
from dossier.findings import Verdict
from dossier.wording import REVIEW_STATE_SHORT, VERDICT_MARKS, quantity_text, verdict_word


class Md(str):
    """Markdown that is safe to print as it is."""


def _safe(function):
    def wrapped(*args, **kwargs) -> Md:
        return Md(function(*args, **kwargs))

    wrapped.__name__ = function.__name__
    return wrapped


def _finalize(value):
    if value is None:
        return ""
    if isinstance(value, Md):
        return value
    return markup.text(value)


def _verdict(value) -> Md:
    """A verdict as a coloured badge holding a mark and the word, e.g. '✗ fail'."""
    verdict = Verdict(value)
    return Md(f'<span class="dossier-verdict dossier-verdict-{verdict.value}">'
              f'<span aria-hidden="true">{VERDICT_MARKS[verdict]}</span> {verdict_word(verdict)}</span>')


def _review_state(value) -> Md:
    """A sign-off state as a badge, e.g. 'cleared for power-up'."""
    return Md(f'<span class="dossier-signoff dossier-signoff-{markup.text(value)}">{REVIEW_STATE_SHORT[value]}</span>')


def _quantity(value) -> Md:
    return Md(markup.text(quantity_text(value)) if value is not None else "")


@lru_cache(maxsize=1)
def environment() -> jinja2.Environment:
    env = jinja2.Environment(
        loader=jinja2.FileSystemLoader(str(templates_dir() / "site")),
        autoescape=False,
        finalize=_finalize,
        undefined=jinja2.StrictUndefined,
        trim_blocks=True,
        lstrip_blocks=True,
        keep_trailing_newline=True,
    )
    env.filters.update(
        text=_safe(markup.text),
        cell=_safe(markup.cell),
        prose=_safe(markup.prose),
        title=_safe(markup.title_text),
        yaml=_safe(markup.yaml_string),
        fence=_safe(markup.fence),
        quantity=_quantity,
        verdict=_verdict,
        review_state=_review_state,
    )
    env.globals["Md"] = Md
    return env


def render(template: str, **context) -> str:
    return environment().get_template(template).render(**context)
