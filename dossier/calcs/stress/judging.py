"""The rating check every part shares: fail below the stress, marginal inside the spike margin, pass above it."""

from __future__ import annotations

from dossier.calcs.shared.finding_kit import banded, maker
from dossier.calcs.stress import words
from dossier.calcs.stress.voltages import Rail
from dossier.findings import Finding, Measure, Verdict
from dossier.units import fmt

NAME = "stress"
MARGINS_KEY = ("devices", "margins")
finding = maker(NAME)
# Sentences for the notes a rail carries (voltages.Rail.notes).
RAIL_NOTES = {"no-load-rise": words.NO_LOAD_RISE, "rail-rise": words.RAIL_RISE, "role-assumed": words.ROLE_ASSUMED,
              "highest-winding": words.HIGHEST_WINDING, "series-assumed": words.SERIES_ASSUMED,
              "split-unknown": words.SPLIT_UNKNOWN,
              "variac-top": words.VARIAC_TOP}


def rating_finding(code, subject, title, rating, rail: Rail, chosen, stressed: str, key, sources, *,
                   doubts=(), extra=(), keys=()) -> Finding:
    """doubts: sentences saying why the rating or the stress is not known exactly; each holds a pass at marginal."""
    required = rail.voltage * chosen.value.to("").magnitude
    verdict = banded(rating, required, rail.voltage, ">=")
    notes = tuple(RAIL_NOTES[note] for note in rail.notes) + tuple(doubts)
    if doubts and verdict is Verdict.PASS:
        verdict = Verdict.MARGINAL
    return finding(
        code=code, subject=subject, title=title, verdict=verdict,
        values=(Measure("voltage rating", rating), Measure(stressed, rail.voltage)),
        limit=Measure(f"rating needed with x{fmt(chosen.value)} margin", required),
        method=f"rating >= margin x stress; {rail.formula}",
        explanation=words.rating(verdict, subject, rating, rail, stressed, chosen, notes),
        keys=(key, rail.key) + tuple(keys) + ((MARGINS_KEY,) if chosen.from_record else ()),
        sources=tuple(sources) + rail.sources + (chosen.source,),
        extra=(Measure("margin", chosen.value),) + tuple(extra),
    )
