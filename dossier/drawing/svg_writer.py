"""A tiny SVG writer: elements as text, numbers rounded the same way every time, text escaped.

Enough for charts drawn from lines, rectangles and text; nothing here needs a display or a plotting
library. Attribute names are written as given (use 'stroke-width', not stroke_width), in the order
given, so the same drawing gives the same bytes.
"""

from __future__ import annotations

import re
from xml.sax.saxutils import escape, quoteattr

_ID_UNSAFE = re.compile(r"[^A-Za-z0-9_-]+")


def number(value: float) -> str:
    """A coordinate as short, stable text: two decimals at most, no '-0'."""
    text = f"{value:.2f}".rstrip("0").rstrip(".")
    return "0" if text in ("-0", "") else text


def _value(value) -> str:
    return number(value) if isinstance(value, float) else str(value)


def attributes(attrs: dict) -> str:
    return "".join(f" {name}={quoteattr(_value(value))}" for name, value in attrs.items() if value is not None)


def id_safe(text: str) -> str:
    """Text made fit for an XML id: letters, digits, '-' and '_' only, starting with a letter."""
    cleaned = _ID_UNSAFE.sub("-", text).strip("-") or "figure"
    return cleaned if cleaned[0].isalpha() else f"f-{cleaned}"


class SvgWriter:
    """Collects elements and writes one standalone SVG document."""

    def __init__(self, width: int, height: int, id_prefix: str):
        self.width, self.height = width, height
        self.prefix = id_safe(id_prefix)
        self._lines: list[str] = []
        self._depth = 1

    def ident(self, name: str) -> str:
        """An id unique to this drawing: the drawing's prefix and a local name."""
        return f"{self.prefix}-{name}"

    def element(self, tag: str, attrs: dict, text: str | None = None) -> None:
        body = "/>" if text is None else f">{escape(text)}</{tag}>"
        self._emit(f"<{tag}{attributes(attrs)}{body}")

    def open(self, tag: str, attrs: dict | None = None) -> None:
        self._emit(f"<{tag}{attributes(attrs or {})}>")
        self._depth += 1

    def close(self, tag: str) -> None:
        self._depth -= 1
        self._emit(f"</{tag}>")

    def _emit(self, text: str) -> None:
        self._lines.append("  " * self._depth + text)

    def line(self, x1: float, y1: float, x2: float, y2: float, **style) -> None:
        self.element("line", {"x1": float(x1), "y1": float(y1), "x2": float(x2), "y2": float(y2), **_style(style)})

    def rect(self, x: float, y: float, width: float, height: float, **style) -> None:
        self.element("rect", {"x": float(x), "y": float(y), "width": float(width), "height": float(height), **_style(style)})

    def polyline(self, points, **style) -> None:
        text = " ".join(f"{number(x)},{number(y)}" for x, y in points)
        self.element("polyline", {"points": text, "fill": "none", **_style(style)})

    def text(self, x: float, y: float, content: str, **style) -> None:
        self.element("text", {"x": float(x), "y": float(y), **_style(style)}, content)

    def document(self, title: str, description: str = "") -> str:
        """The finished document, with a title (and description) that screen readers announce."""
        head = [
            '<?xml version="1.0" encoding="UTF-8"?>',
            f'<svg xmlns="http://www.w3.org/2000/svg" width="{self.width}" height="{self.height}" '
            f'viewBox="0 0 {self.width} {self.height}" role="img" aria-labelledby="{self.ident("title")}" '
            f'id="{self.ident("svg")}">',
            f'  <title id="{self.ident("title")}">{escape(title)}</title>',
        ]
        if description:
            head.append(f"  <desc>{escape(description)}</desc>")
        return "\n".join(head + self._lines + ["</svg>", ""])


def _style(style: dict) -> dict:
    """Keyword styles to SVG attribute names: stroke_width -> stroke-width."""
    return {name.replace("_", "-"): value for name, value in style.items()}
