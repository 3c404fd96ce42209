"""Where each stage goes on the block diagram: a grid of rows and columns laid out from the stage graph.

A chain stays on one row: a stage's first child (in record order) goes on its right. Each further child
starts a row of its own below, one column right of its parent, so the line down from the parent meets
no other block: branches are placed parent by parent from the right-most one back, which keeps every
row a line passes down through to columns right of that line.
"""

from __future__ import annotations

from dataclasses import dataclass


@dataclass(frozen=True)
class Place:
    row: int
    column: int
    parent: str | None  # the stage it is drawn from: its left neighbour on the row, or above for a branch
    branch: bool  # starts a row of its own under its parent


def layout(ids: list[str], fed_from: dict[str, tuple[str, ...]]) -> dict[str, Place]:
    """A Place for every id; ids in record order, fed_from naming each stage's sources (unknown ids ignored)."""
    known = set(ids)
    children = {node: [child for child in ids if node in fed_from.get(child, ())] for node in ids}
    places: dict[str, Place] = {}
    rows = [0]

    def new_row() -> int:
        rows[0] += 1
        return rows[0] - 1

    def chain(start: str, row: int, column: int, parent: str | None, branch: bool) -> None:
        line, node = [], start
        while node is not None and node not in places:
            places[node] = Place(row, column, parent, branch)
            line.append(node)
            parent, branch, column = node, False, column + 1
            node = next((child for child in children[node] if child not in places), None)
        for source in reversed(line):
            for child in children[source]:
                if child not in places:
                    chain(child, new_row(), places[source].column + 1, source, True)

    for node in ids:
        if node not in places and not any(source in known for source in fed_from.get(node, ())):
            chain(node, new_row(), 0, None, False)
    for node in ids:  # only stages in a loop are left; validation refuses those, but draw them anyway
        if node not in places:
            chain(node, new_row(), 0, None, False)
    return places
