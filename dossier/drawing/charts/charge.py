"""The charge profile as a standalone SVG chart: voltage and current against time, CC then CV.

Drawn with the small writer in svg_writer (no plotting library, no display). Voltage reads on the
left axis, current on the right; both axes share their grid lines. The chart marks the estimated
time to full and, where the charger floats the battery, the float voltage after it.
"""

from __future__ import annotations

from dataclasses import dataclass

from dossier.calcs.charge.curve import ChargeCurve
from dossier.drawing.charts.labels import free_row
from dossier.drawing.charts.scale import Scale, at_most, fixed_intervals
from dossier.drawing.figure import Figure
from dossier.drawing.svg_writer import SvgWriter
from dossier.standards.chemistries import chemistry

WIDTH, HEIGHT = 720, 450
LEFT, RIGHT, TOP, BOTTOM = 72, 648, 60, 340
VOLTAGE_COLOUR, CURRENT_COLOUR = "#1f5f99", "#c2571a"
INK, MUTED, GRID = "#222222", "#5f6368", "#e1e4e8"
FONT = "DejaVu Sans, Verdana, Arial, sans-serif"
BOLD_CHAR_WIDTH, CHAR_WIDTH = 0.6, 0.55  # average advance of (bold) DejaVu Sans in font sizes; long lines shrink to fit
FLOAT_TAIL = 0.18  # the float stage is drawn for this fraction of the time to full
GRID_INTERVALS = 5
MARKER_ROWS = (0.66, 0.46, 0.8, 0.26, 0.12)  # where the time-to-full label may sit, tried in turn (fraction of plot height)


@dataclass(frozen=True)
class Axes:
    time: Scale
    volts: Scale
    amps: Scale

    def x(self, hours: float) -> float:
        return LEFT + (RIGHT - LEFT) * self.time.fraction(hours)

    def y_volts(self, volts: float) -> float:
        return BOTTOM - (BOTTOM - TOP) * self.volts.fraction(volts)

    def y_amps(self, amps: float) -> float:
        return BOTTOM - (BOTTOM - TOP) * self.amps.fraction(amps)


def axes_for(curve: ChargeCurve) -> Axes:
    volts = [p.volts for p in curve.points] + ([curve.plan.float_v] if curve.plan.float_v else [])
    low, high = min(volts), max(volts)
    span = max(high - low, 0.5)
    return Axes(
        time=at_most(curve.estimate.full_hours * (1 + FLOAT_TAIL), 10),
        volts=fixed_intervals(low - 0.08 * span, high + 0.3 * span, GRID_INTERVALS),
        amps=fixed_intervals(0.0, max(p.amps for p in curve.points) * 1.12, GRID_INTERVALS, from_zero=True),
    )


def charge_chart_svg(record, curve: ChargeCurve | None) -> str | None:
    """The chart of the charge calc's curve as a complete SVG document, or None when there is no curve."""
    return None if curve is None else draw(record, curve)


def figures(record, curve: ChargeCurve | None) -> list[Figure]:
    """The charge-curve figure for the site's charge section, drawn from the curve the charge calc handed on;
    none when the output is not a charger or the calc could not make one."""
    if curve is None:
        return []
    return [Figure(key="charge-curve", title=_title(record, curve), svg=draw(record, curve), section="charge")]


def draw(record, curve: ChargeCurve) -> str:
    axes = axes_for(curve)
    svg = SvgWriter(WIDTH, HEIGHT, f"charge-{record.id}-rev-{record.revision}")
    svg.rect(0, 0, WIDTH, HEIGHT, fill="#ffffff")
    _heading(svg, record, curve)
    _phases(svg, axes, curve)
    _grid(svg, axes)
    _curves(svg, axes, curve)
    _full_marker(svg, axes, curve)
    _axis_labels(svg, axes)
    _legend(svg, curve)
    return svg.document(_title(record, curve), _description(curve))


def _battery_text(record) -> str:
    battery = record.output.battery
    return f"{chemistry(battery.chemistry).label} {battery.capacity.to('A*h').magnitude:g} Ah"


def _title(record, curve: ChargeCurve) -> str:
    temperature = record.output.battery.expected_temperature.to("degC").magnitude
    return (f"Charge profile: {_battery_text(record)} battery, {curve.plan.current_a:g} A limit, "
            f"{curve.plan.setpoint_v:.4g} V absorption at {temperature:g} °C")


def _description(curve: ChargeCurve) -> str:
    return (f"Estimated charge from {curve.plan.start_soc * 100:g} % to full in about "
            f"{curve.estimate.full_hours:.1f} hours: constant current, then constant voltage with the current tapering.")


def _text(svg: SvgWriter, x: float, y: float, content: str, size: float = 12, fill: str = INK, **style) -> None:
    svg.text(x, y, content, font_family=FONT, font_size=size, fill=fill, **style)


def _heading(svg: SvgWriter, record, curve: ChargeCurve) -> None:
    title = _title(record, curve)
    _text(svg, LEFT, 26, title, size=_fitting(title, 15.0, BOLD_CHAR_WIDTH), font_weight="bold")
    _text(svg, LEFT, 45, "An estimate from a CC-then-CV model, not a measurement", size=11.5, fill=MUTED)


def _phases(svg: SvgWriter, axes: Axes, curve: ChargeCurve) -> None:
    edges = [0.0, curve.estimate.cc_hours, curve.estimate.full_hours, axes.time.high]
    fills = ["#eef3f8", "#ffffff", "#f4f4ee"]
    after = ("float", "current not drawn") if curve.plan.float_v else ("charge ended", "")
    names = [("constant current", ""), ("constant voltage", ""), after]
    for start, end, fill, (name, note) in zip(edges, edges[1:], fills, names):
        if end - start <= 0:
            continue
        svg.rect(axes.x(start), TOP, axes.x(end) - axes.x(start), BOTTOM - TOP, fill=fill)
        _phase_label(svg, axes.x(start), axes.x(end), name, note)


def _phase_label(svg: SvgWriter, left: float, right: float, name: str, note: str) -> None:
    if right - left < 6.5 * max(len(name), len(note)) + 8:
        return
    middle = (left + right) / 2
    _text(svg, middle, TOP + 17, name, size=11, fill=MUTED, text_anchor="middle")
    if note:
        _text(svg, middle, TOP + 31, note, size=10, fill=MUTED, text_anchor="middle", font_style="italic")


def _grid(svg: SvgWriter, axes: Axes) -> None:
    for volts in axes.volts.ticks[1:-1]:
        svg.line(LEFT, axes.y_volts(volts), RIGHT, axes.y_volts(volts), stroke=GRID, stroke_width=1)
    for hours in axes.time.ticks[1:-1]:
        svg.line(axes.x(hours), TOP, axes.x(hours), BOTTOM, stroke=GRID, stroke_width=1)
    svg.rect(LEFT, TOP, RIGHT - LEFT, BOTTOM - TOP, fill="none", stroke="#9aa0a6", stroke_width=1)


def _paths(axes: Axes, curve: ChargeCurve) -> tuple[list, list]:
    """Screen points of the voltage (with its float tail) and the current."""
    volts = [(axes.x(p.hours), axes.y_volts(p.volts)) for p in curve.points]
    if curve.plan.float_v:
        end, y = axes.x(curve.estimate.full_hours), axes.y_volts(curve.plan.float_v)
        volts += [(end, y), (axes.x(axes.time.high), y)]
    amps = [(axes.x(p.hours), axes.y_amps(p.amps)) for p in curve.points]
    return volts, amps


def _curves(svg: SvgWriter, axes: Axes, curve: ChargeCurve) -> None:
    volts, amps = _paths(axes, curve)
    svg.polyline(amps, stroke=CURRENT_COLOUR, stroke_width=2.4, stroke_dasharray="7 4", stroke_linejoin="round")
    svg.polyline(volts, stroke=VOLTAGE_COLOUR, stroke_width=2.4, stroke_linejoin="round")


def _full_marker(svg: SvgWriter, axes: Axes, curve: ChargeCurve) -> None:
    x = axes.x(curve.estimate.full_hours)
    svg.line(x, TOP, x, BOTTOM, stroke=INK, stroke_width=1.3, stroke_dasharray="2 3")
    label = f"full in about {curve.estimate.full_hours:.1f} h"
    width, height = 6.6 * len(label) + 12, 21
    left = x - width - 6 if x + width + 6 > RIGHT else x + 6
    rows = [TOP + fraction * (BOTTOM - TOP) for fraction in MARKER_ROWS]
    top = free_row(list(_paths(axes, curve)), left, left + width, rows, height)
    svg.rect(left, top, width, height, fill="#ffffff", stroke=INK, stroke_width=0.8, rx=3)
    _text(svg, left + width / 2, top + 15, label, size=11.5, text_anchor="middle", font_weight="bold")


def _axis_labels(svg: SvgWriter, axes: Axes) -> None:
    for volts in axes.volts.ticks:
        _text(svg, LEFT - 8, axes.y_volts(volts) + 4, axes.volts.label(volts), size=11, fill=VOLTAGE_COLOUR, text_anchor="end")
    for amps in axes.amps.ticks:
        _text(svg, RIGHT + 8, axes.y_amps(amps) + 4, axes.amps.label(amps), size=11, fill=CURRENT_COLOUR)
    for hours in axes.time.ticks:
        _text(svg, axes.x(hours), BOTTOM + 18, axes.time.label(hours), size=11, text_anchor="middle")
    middle = (TOP + BOTTOM) / 2
    _text(svg, 20, middle, "Voltage (V)", size=12.5, fill=VOLTAGE_COLOUR, text_anchor="middle",
          transform=f"rotate(-90 20 {middle:g})")
    _text(svg, WIDTH - 20, middle, "Current (A)", size=12.5, fill=CURRENT_COLOUR, text_anchor="middle",
          transform=f"rotate(90 {WIDTH - 20} {middle:g})")
    _text(svg, (LEFT + RIGHT) / 2, BOTTOM + 40, "Time (h)", size=12.5, text_anchor="middle")


def _legend(svg: SvgWriter, curve: ChargeCurve) -> None:
    y = BOTTOM + 70
    items = [("Voltage (left axis)", VOLTAGE_COLOUR, None),
             ("Current (right axis)", CURRENT_COLOUR, "7 4"),
             ("Estimated time to full", INK, "2 3")]
    x = LEFT
    for label, colour, dashes in items:
        svg.line(x, y - 4, x + 28, y - 4, stroke=colour, stroke_width=2.4 if dashes != "2 3" else 1.3, stroke_dasharray=dashes)
        _text(svg, x + 36, y, label, size=11.5)
        x += 36 + 7 * len(label) + 28
    note = _model_note(curve)
    _text(svg, LEFT, y + 24, note, size=_fitting(note, 10.5, CHAR_WIDTH), fill=MUTED)


def _fitting(line: str, size: float, char_width: float) -> float:
    """The font size, shrunk if needed so that the line fits between the left margin and the edge."""
    return round(min(size, (WIDTH - LEFT - 12) / (char_width * len(line))), 1)


def _model_note(curve: ChargeCurve) -> str:
    plan = curve.plan
    if not plan.tapers:
        return (f"Model: {plan.current_a:g} A throughout (no taper: below the {plan.termination_a:.2g} A end current); "
                f"charge efficiency {plan.efficiency * 100:g} %; from {plan.start_soc * 100:g} % charge.")
    return (f"Model: {plan.current_a:g} A until {plan.cv_onset * 100:g} % charge, then {plan.setpoint_v:g} V while the current "
            f"tapers to {plan.termination_a:.2g} A; charge efficiency {plan.efficiency * 100:g} %; from {plan.start_soc * 100:g} % charge.")
