"""The stage graph and rails as drawings need them: each stage's id and sources, the rails each stage
delivers, and which stages carry a voltage above the extra-low-voltage limits.

Which rails are hazardous is the rails calc's judgement: its product, handed in as the names of the hazardous
rails (schematics.draw(hazard_names=...)); when there is none (the calc did not run, or a caller draws a
record alone), the same judgement is made here with the calc's own functions, never a second rule.
"""

from __future__ import annotations

from dossier.calcs.rails.hazards import hazardous
from dossier.calcs.shared.rail_voltage import rail_voltages
from dossier.drawing.views import RailView, quantity_text


def stage_ids(record) -> list[str]:
    """Each stage's id; a stage made in code without one (reading a file always gives one) is s1, s2, ... by position."""
    return [stage.id or f"s{number}" for number, stage in enumerate(record.stages, start=1)]


def sources(record) -> dict[str, tuple[str, ...]]:
    """Each stage's id -> the ids of the stages it is fed from; without fed_from, the one before it."""
    ids = stage_ids(record)
    return {key: stage.feeds_from if stage.fed_from is not None else tuple(ids[max(position - 1, 0):position])
            for position, (key, stage) in enumerate(zip(ids, record.stages))}


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


def rails_by_stage(record, hazard_names=None) -> dict[str, tuple[RailView, ...]]:
    """stage id -> the rails it delivers; hazard_names are the rails above the extra-low-voltage limits (None: judged here)."""
    named = set(hazard_names) if hazard_names is not None else judged_hazardous(record)
    found: dict[str, list[RailView]] = {}
    for rail in record.rails:
        found.setdefault(rail.stage, []).append(rail_view(rail, rail.name in named))
    return {key: tuple(rails) for key, rails in found.items()}


def judged_hazardous(record) -> set[str]:
    """The rails the rails calc would name as hazardous: worst case (no load, high line) above the ES1 limit."""
    return {found.name for found in rail_voltages(record) if hazardous(found)}


def rail_view(rail, danger: bool) -> RailView:
    direct = rail.kind != "ac"
    sign = "\u2212" if direct and rail.polarity == "negative" else ""
    voltage = f"{sign}{quantity_text(abs(rail.voltage))} {'DC' if direct else 'AC'}"
    bleeder = quantity_text(rail.bleeder) if rail.bleeder is not None else ""
    return RailView(rail.name, voltage, bleeder, danger, direct)


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
