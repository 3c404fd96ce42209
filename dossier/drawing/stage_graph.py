"""The stage graph and rails as drawings need them: each stage's id and sources, the rails each stage
delivers, and which stages carry a voltage above the extra-low-voltage limits.

Which rails are hazardous comes from the review when a calc hands that on (schematics.draw(hazardous=...));
without it, a rail is taken as hazardous above the ES1 limits of IEC 62368-1 edition 3.0 (2018), Table 4 (60 V DC,
30 V RMS AC; table number from memory), the lower of the published extra-low-voltage limits and so the
harsher reading.
"""

from __future__ import annotations

from dossier.drawing.views import RailView, quantity_text
from dossier.units import Q_

DC_LIMIT = Q_(60, "V")
AC_LIMIT = Q_(30, "V")


def stage_ids(record) -> list[str]:
    return [getattr(stage, "id", None) or f"s{number}" for number, stage in enumerate(record.stages, start=1)]


def sources(record) -> dict[str, tuple[str, ...]]:
    """Each stage's id -> the ids of the stages it is fed from (the one before it when the record says nothing)."""
    ids = stage_ids(record)
    found = {}
    for position, (key, stage) in enumerate(zip(ids, record.stages)):
        declared = getattr(stage, "fed_from", None)
        found[key] = tuple(declared) if declared is not None else ((ids[position - 1],) if position else ())
    return found


def descendants(graph: dict[str, tuple[str, ...]], key: str) -> set[str]:
    """Every stage fed, directly or through others, from key."""
    found, todo = set(), [key]
    while todo:
        node = todo.pop()
        for child, parents in graph.items():
            if node in parents and child not in found:
                found.add(child)
                todo.append(child)
    return found


def ancestors(graph: dict[str, tuple[str, ...]], key: str) -> set[str]:
    found, todo = set(), [key]
    while todo:
        for parent in graph.get(todo.pop(), ()):
            if parent not in found and parent in graph:
                found.add(parent)
                todo.append(parent)
    return found


def rails_by_stage(record, hazardous=None) -> dict[str, tuple[RailView, ...]]:
    """stage id -> the rails it delivers; hazardous maps a rail's name to whether it is above ELV (None: judged here)."""
    found: dict[str, list[RailView]] = {}
    for rail in getattr(record, "rails", None) or ():
        danger = hazardous.get(rail.name) if hazardous is not None and rail.name in hazardous else above_elv(rail)
        found.setdefault(rail.stage, []).append(rail_view(rail, bool(danger)))
    return {key: tuple(rails) for key, rails in found.items()}


def rail_view(rail, hazardous: bool) -> RailView:
    direct = getattr(rail, "kind", "dc") != "ac"
    sign = "\u2212" if direct and getattr(rail, "polarity", "positive") == "negative" else ""
    voltage = f"{sign}{quantity_text(abs(rail.voltage))} {'DC' if direct else 'AC'}"
    bleeder = quantity_text(rail.bleeder) if getattr(rail, "bleeder", None) is not None else ""
    return RailView(rail.name, voltage, bleeder, hazardous, direct)


def above_elv(rail) -> bool:
    """The harsher reading: the higher of the nominal and no-load voltage against the ES1 limit for its kind."""
    highest = max(abs(rail.voltage), abs(getattr(rail, "no_load_voltage", None) or rail.voltage))
    limit = AC_LIMIT if getattr(rail, "kind", "dc") == "ac" else DC_LIMIT
    return highest.to("V").magnitude > limit.to("V").magnitude


def hazards(record, rails: dict[str, tuple[RailView, ...]]) -> dict[str, tuple[str, ...]]:
    """stage id -> the hazardous rails it carries: those it delivers, those of every stage it feeds, and,
    for a stage that names no rail of its own, those of the stages feeding it (the harsher reading)."""
    graph = sources(record)
    own = {key: tuple(r.label for r in rails.get(key, ()) if r.hazardous) for key in graph}
    found = {}
    for key in graph:
        labels = list(own[key])
        for child in sorted(descendants(graph, key), key=list(graph).index):
            labels += [label for label in own[child] if label not in labels]
        found[key] = labels
    for key in graph:  # in record order, so a chain of stages without rails inherits all the way down
        if not rails.get(key):
            for parent in graph[key]:
                found[key] += [label for label in found.get(parent, ()) if label not in found[key]]
    return {key: tuple(labels) for key, labels in found.items()}
