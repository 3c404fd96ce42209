"""Placing a label on a chart where no plotted line runs through it."""

from __future__ import annotations

Point = tuple[float, float]


def _y_span_within(segment: tuple[Point, Point], left: float, right: float) -> tuple[float, float] | None:
    """The y range a straight segment covers between x = left and x = right, or None if it lies outside."""
    (x1, y1), (x2, y2) = sorted(segment)
    if x2 < left or x1 > right:
        return None
    if x2 == x1:
        return min(y1, y2), max(y1, y2)
    at = lambda x: y1 + (y2 - y1) * (x - x1) / (x2 - x1)  # noqa: E731 - linear interpolation
    ends = (at(max(x1, left)), at(min(x2, right)))
    return min(ends), max(ends)


def crosses(paths: list[list[Point]], box: tuple[float, float, float, float], clearance: float = 4.0) -> bool:
    """Whether any path runs through the box (left, top, right, bottom), widened by the clearance."""
    left, top, right, bottom = box
    for path in paths:
        for segment in zip(path, path[1:]):
            span = _y_span_within(segment, left - clearance, right + clearance)
            if span and span[1] >= top - clearance and span[0] <= bottom + clearance:
                return True
    return False


def free_row(paths: list[list[Point]], left: float, right: float, rows: list[float], height: float) -> float:
    """The first row (a box's top edge) whose box no path crosses; the first row if every one is crossed."""
    for top in rows:
        if not crosses(paths, (left, top, right, top + height)):
            return top
    return rows[0]
