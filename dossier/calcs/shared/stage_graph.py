"""Walking the stage graph up from a stage: the stages that feed it, and the rectifier nearest it."""

from __future__ import annotations

from dossier.record.stages import RECTIFIER_TOPOLOGIES


def upstream(record, stage_id: str):
    """The stage with this id and every stage it is fed from, nearest first, as (index, stage)."""
    seen, waiting = [], [stage_id]
    while waiting:
        current = waiting.pop(0)
        found = record.stage_by_id(current)
        if found is None or current in seen:
            continue
        seen.append(current)
        yield found
        waiting.extend(found[1].feeds_from)


def stage_of(record, ref: str):
    """(index, stage) of the stage whose parts list ref, or None."""
    for index, stage in enumerate(record.stages):
        if any(part.ref == ref for part in stage.parts):
            return index, stage
    return None


def rectifies(stage) -> bool:
    return stage.kind == "rectifier" or (stage.kind == "mains-input" and stage.topology_name in RECTIFIER_TOPOLOGIES)


def rectifier_of(record, stage_id: str):
    """(index, stage) of the nearest rectifying stage feeding stage_id, or None."""
    return next(((index, stage) for index, stage in upstream(record, stage_id) if rectifies(stage)), None)


def between(record, stage_id: str, stop_id: str) -> list:
    """The stages from stage_id up to (not including) stop_id along the graph: a rail's filters after its rectifier."""
    found = []
    for index, stage in upstream(record, stage_id):
        if stage.id == stop_id:
            break
        found.append((index, stage))
    return found
