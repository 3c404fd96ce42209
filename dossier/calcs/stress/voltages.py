"""The highest voltage each place in a build sees at high line: the bus, the rectified secondary, the rails."""

from __future__ import annotations

from dataclasses import dataclass, field, replace

from dossier.calcs.shared import variac
from dossier.calcs.shared.stage_graph import rectifier_of, upstream
from dossier.calcs.shared.winding_voltages import winding_voltages
from dossier.record.rails import split_winding
from dossier.calcs.shared.mains_lines import HIGH_PEAK_FORMULA, high_line_peak
from dossier.calcs.shared.rail_voltage import NO_LOAD_PRACTICE, NO_LOAD_RISE
from dossier.findings import Source

MAIN_TRANSFORMER_ROLES = ("transformer", "mains-transformer")
# Topologies whose rail is taken from one half of a centre-tapped winding, or from one of two windings in series.
SPLIT_TOPOLOGIES = ("bridge",)
# Output rectifier topology -> (rail taken from one half of a centre-tapped winding, multiple of that peak, name)
RAIL_OF_TOPOLOGY = {
    "bridge": (False, 1, "bridge"),
    "centre-tapped": (True, 1, "centre-tapped"),
    "valve-centre-tapped": (True, 1, "centre-tapped"),
    "half-wave": (False, 1, "half-wave"),
    "valve-half-wave": (False, 1, "half-wave"),
    "doubler": (False, 2, "doubler"),
    "voltage-doubler": (False, 2, "doubler"),
}
RECTIFIER_KINDS = ("diode", "schottky", "bridge")
MAINS_RECTIFIER_PARTS = ("bridge", "diode", "rectifier")


@dataclass(frozen=True)
class Feed:
    """The windings a rectifier stage rectifies, as (magnetic index, magnetic, winding), and how they were found:
    'named' by its rails, the 'sole' secondary of the transformer above it, its equal secondaries taken in series
    ('series-assumed'), or the 'highest' of several."""

    windings: tuple
    how: str
    keys: tuple


@dataclass(frozen=True)
class Rail:
    """A voltage somewhere in the build, with how it was found.

    voltage  the peak (or, for an AC rail, the RMS) value at high line
    formula  the formula in symbols, e.g. 'V_bus = sqrt(2) x V_mains x (1 + tolerance)'
    basis    where the inputs came from, in words
    key      record key path of the main input, for locating it
    """

    voltage: object
    formula: str
    basis: str
    key: tuple
    notes: tuple[str, ...] = field(default=())  # sentences keys into words, e.g. an assumed no-load rise
    sources: tuple[Source, ...] = field(default=())  # sources of anything assumed on the way


class Voltages:
    """Voltages in one record; the winding voltages come from the magnetics calc's model of the drive."""

    def __init__(self, record, windings=winding_voltages):
        self.record = record
        self.windings = windings

    def line_rms(self) -> Rail | None:
        mains = self.record.mains
        if mains is None:
            return None
        return Rail(mains.high, "V_line = V_mains x (1 + tolerance)", "mains RMS at high line", ("mains", "nominal"))

    def bus(self) -> Rail | None:
        """The rectified mains peak at high line, when a rectifier sits on the mains side."""
        if self.record.mains is None or not self._mains_rectifier():
            return None
        return Rail(high_line_peak(self.record.mains), f"V_bus = {HIGH_PEAK_FORMULA}", "rectified mains peak at high line, no diode drop", ("mains", "nominal"))

    def _mains_rectifier(self) -> bool:
        mains_stages = [stage for stage in self.record.stages if stage.side == "mains"]
        return any(stage.kind == "rectifier" or _has_rectifier_part(stage) for stage in mains_stages)

    def secondary(self, stage_index: int | None = None):
        """(index, magnetic, winding) of the secondary a rectifier stage sits on: found from the stage graph (see
        feed), else the main transformer's (centre-tapped first) when the stage is not known."""
        feed = self.feed(stage_index) if stage_index is not None else None
        if feed is not None:
            return feed.windings[0]
        for index, magnetic in enumerate(self.record.magnetics):
            if magnetic.role in MAIN_TRANSFORMER_ROLES:
                winding = _rectified_winding(magnetic)
                return (index, magnetic, winding) if winding is not None else None
        return None

    def feed(self, stage_index: int) -> Feed | None:
        """The windings that feed rectifier stage stage_index: those the rails it delivers name (rails[].winding),
        else the secondary of the transformer above it in the stage graph (the highest when it has several, or when
        the stage above lists several transformers, and no rail names one: the harsher reading). None when no
        transformer is found above the stage."""
        stage = self.record.stages[stage_index]
        named = self._named_windings(stage)
        if named:
            return Feed(tuple(named), "named", tuple(("rails", i, "winding") for i in self._rail_indices(stage)))
        for _, above in upstream(self.record, stage.id):
            listed = [(index, magnetic) for index, magnetic in enumerate(self.record.magnetics)
                      if magnetic.role in MAIN_TRANSFORMER_ROLES and any(part.ref == magnetic.ref for part in above.parts)]
            feeds = [feed for feed in (self._highest_secondary(index, magnetic) for index, magnetic in listed) if feed is not None]
            if len(feeds) == 1:
                return feeds[0]
            if feeds:
                return replace(max(feeds, key=self._feed_peak), how="highest")
        return None

    def _feed_peak(self, feed: Feed):
        """The no-load peak across a feed's windings in series at high line (0 V when it cannot be worked out)."""
        rail = self._series_peak(feed, half=False) if len(feed.windings) > 1 else None
        if rail is None:
            index, magnetic, winding = feed.windings[0]
            peaks = self.windings(self.record, magnetic)
            return peaks[winding.name]["high"].to("V").magnitude if winding.name in peaks else 0.0
        return rail.voltage.to("V").magnitude

    def _rail_indices(self, stage) -> list[int]:
        """The declared rails whose nearest rectifier is this stage."""
        return [i for i, rail in enumerate(self.record.rails) if (rectifier_of(self.record, rail.stage) or (None, None))[1] is stage]

    def _named_windings(self, stage) -> list:
        found = []
        for index in self._rail_indices(stage):
            text = self.record.rails[index].winding
            if text is None:
                continue
            ref, name = split_winding(text)
            for position, magnetic in enumerate(self.record.magnetics):
                winding = next((w for w in magnetic.windings if magnetic.ref == ref and w.name == name), None)
                if winding is not None and (position, magnetic, winding) not in found:
                    found.append((position, magnetic, winding))
        return found

    def _highest_secondary(self, index: int, magnetic) -> Feed | None:
        """The one secondary; several of equal turns (the usual 2 x V split-rail pair) taken in series; else the
        highest. Both readings are the harsher ones when no rail names the winding."""
        secondaries = [w for w in magnetic.windings if w.role == "secondary"]
        if not secondaries:
            return None
        if len(secondaries) == 1:
            return Feed(((index, magnetic, secondaries[0]),), "sole", ("magnetics", index, "windings"))
        if len({w.turns for w in secondaries}) == 1:
            return Feed(tuple((index, magnetic, w) for w in secondaries), "series-assumed", (("magnetics", index, "windings"),))
        peaks = self.windings(self.record, magnetic)
        known = [w for w in secondaries if w.name in peaks]
        highest = max(known, key=lambda w: peaks[w.name]["high"]) if known else _rectified_winding(magnetic)
        return Feed(((index, magnetic, highest),), "highest", ("magnetics", index, "windings"))

    def winding_peak(self, half: bool, stage_index: int | None = None) -> Rail | None:
        return self.behind_variac(self._winding_peak(half, stage_index), stage_index)

    def behind_variac(self, rail: Rail | None, stage_index: int | None) -> Rail | None:
        """A voltage in a stage a variac feeds, raised to the variac's top of scale over the mains nominal."""
        if rail is None or stage_index is None or not variac.feeds(self.record, self.record.stages[stage_index].id):
            return rail
        factor = variac.scale(self.record)
        return replace(rail, voltage=rail.voltage * factor, formula=f"{rail.formula} x V_top / V_nominal (variac)",
                       key=variac.VARIAC_KEY, notes=rail.notes + ("variac-top",), sources=rail.sources + (variac.VARIAC_PRACTICE,))

    def _winding_peak(self, half: bool, stage_index: int | None = None) -> Rail | None:
        """Peak across the whole secondary, or across one half of a centre-tapped one, at high line; for a rectifier
        stage fed by two windings in series (named by its rails), across both (half: the higher of them)."""
        feed = self.feed(stage_index) if stage_index is not None else None
        if feed is not None and len(feed.windings) > 1:
            rail = self._series_peak(feed, half)
            notes = {"series-assumed": ("series-assumed",), "highest": ("highest-winding", "series-assumed")}.get(feed.how, ())
            return replace(rail, notes=rail.notes + notes) if rail is not None else None
        found = self.secondary(stage_index)
        if found is None:
            return None
        index, magnetic, winding = found
        peaks = self.windings(self.record, magnetic)
        if (f"{winding.name}/half" if half else winding.name) not in peaks:
            return None
        rail = self._winding_rail(index, magnetic, winding, peaks, half)
        if feed is not None and feed.how == "highest":
            rail = replace(rail, notes=rail.notes + ("highest-winding",))
        return rail

    def _winding_rail(self, index, magnetic, winding, peaks, half) -> Rail:
        name = f"{winding.name}/half" if half else winding.name
        where = f"{'one half of ' if half else ''}winding '{winding.name}' of {magnetic.ref}"
        rail = Rail(peaks[name]["high"], "V_pk = V_drive,pk x N_winding / N_drive", f"no-load peak across {where} at high line", ("magnetics", index, "windings"))
        return self._loaded_declaration(rail, magnetic, index, peaks[name])

    def _series_peak(self, feed: Feed, half: bool) -> Rail | None:
        """Windings in series across a rectifier: the sum of their peaks; half: the highest one."""
        rails = []
        for index, magnetic, winding in feed.windings:
            peaks = self.windings(self.record, magnetic)
            if winding.name not in peaks:
                return None
            rails.append(self._winding_rail(index, magnetic, winding, peaks, False))
        if half:
            return max(rails, key=lambda rail: rail.voltage)
        names = " + ".join(f"'{winding.name}'" for _, _, winding in feed.windings)
        total = sum((rail.voltage for rail in rails[1:]), rails[0].voltage)
        return replace(rails[0], voltage=total, formula=f"V_pk = the sum over the windings in series; {rails[0].formula}",
                       basis=f"no-load peak across windings {names} in series at high line", key=feed.keys[0])

    def _loaded_declaration(self, rail: Rail, magnetic, index: int, peaks: dict) -> Rail:
        """A mains transformer declared by the voltage across a secondary: that is its rated, loaded voltage at
        nominal line, so it is carried to high line and raised by the no-load rise (the harsher reading)."""
        excitation = magnetic.excitation
        if magnetic.role != "mains-transformer" or excitation is None or not _is_secondary(magnetic, excitation.winding):
            return rail
        voltage, formula = rail.voltage, rail.formula
        if self.record.mains is not None and peaks.get("nominal") is not None and peaks["nominal"] == peaks["high"]:
            voltage = voltage * (self.record.mains.high / self.record.mains.nominal).to("").magnitude
            formula += " x V_high / V_nominal"
        voltage = voltage * (1 + NO_LOAD_RISE.magnitude)
        return Rail(voltage, f"{formula} x (1 + no-load rise)", rail.basis, ("magnetics", index, "excitation"),
                    notes=("no-load-rise",), sources=(NO_LOAD_PRACTICE,))

    def line_peak(self, stage_index: int | None = None) -> Rail | None:
        """The mains crest at high line: what a diode rectifying the mains works from (a variac's top of scale for
        a stage it feeds)."""
        if self.record.mains is None:
            return None
        rail = Rail(high_line_peak(self.record.mains), f"V_pk = {HIGH_PEAK_FORMULA}", "mains peak at high line", ("mains", "nominal"))
        return self.behind_variac(rail, stage_index)

    def rectified(self, topology: str, stage_index: int | None = None) -> Rail | None:
        """The rectified rail behind an output rectifier, at no load (no diode drop): the peak of the winding each
        diode conducts from; a doubler twice the whole winding's peak. An unknown topology is read as a doubler.
        A bridge across a centre-tapped winding (or two windings in series) whose centre is the 0 V of a plus and
        a minus rail declared from it gives each rail the peak of one half."""
        shape = RAIL_OF_TOPOLOGY.get(topology, (False, 2, "unknown"))
        half, times, _ = shape
        split = topology in SPLIT_TOPOLOGIES and stage_index is not None and self.split_rails(stage_index)
        peak = self.winding_peak(half=half or split, stage_index=stage_index)
        if peak is None:
            return None
        formula = "V_rail = V_pk of the winding each diode conducts from" if times == 1 else "V_rail = 2 x V_pk (doubler)"
        if split:
            formula = "V_rail = V_pk of one half (a bridge across a tapped pair feeding + and - rails)"
        unsplit = topology in SPLIT_TOPOLOGIES and not split and stage_index is not None and self._tapped(stage_index)
        notes = (("role-assumed",) if shape[2] == "unknown" else ()) + (("split-unknown",) if unsplit else ())
        return replace(peak, voltage=times * peak.voltage, formula=f"{formula}; {peak.formula}", notes=peak.notes + notes)

    def _tapped(self, stage_index: int) -> bool:
        feed = self.feed(stage_index)
        return feed is not None and (len(feed.windings) > 1 or feed.windings[0][2].centre_tap)

    def split_rails(self, stage_index: int) -> bool:
        """The rectifier stage delivers declared DC rails of both polarities from a tapped winding or a series pair."""
        stage = self.record.stages[stage_index]
        polarities = {self.record.rails[i].polarity for i in self._rail_indices(stage) if self.record.rails[i].kind == "dc"}
        return self._tapped(stage_index) and polarities == {"positive", "negative"}

    def supply_of(self, index: int) -> Rail | None:
        """The voltage feeding stage index: the bus on the mains side, else the rectified rail of the nearest
        rectifier above it in the stage graph."""
        stage = self.record.stages[index]
        if stage.side == "mains":
            return self.behind_variac(self.bus(), index)
        found = rectifier_of(self.record, stage.id)
        if found is None or found[1].side != "isolated":
            return None
        return self.rectified(found[1].topology, found[0])

    def output_rail(self) -> Rail | None:
        output = self.record.output
        if output is None:
            return None
        tolerance = output.tolerance.to("").magnitude if output.tolerance is not None else 0.0
        return Rail(output.voltage * (1 + tolerance), "V_out,max = V_out x (1 + tolerance)", "the rated output at the top of its tolerance", ("output", "voltage"))


def _is_secondary(magnetic, name: str) -> bool:
    winding = next((w for w in magnetic.windings if w.name == (name or magnetic.windings[0].name)), None)
    return winding is not None and winding.role == "secondary"


def _has_rectifier_part(stage) -> bool:
    return any(part.kind in MAINS_RECTIFIER_PARTS for part in stage.parts)


def _rectified_winding(magnetic):
    secondaries = [w for w in magnetic.windings if w.role == "secondary"]
    tapped = [w for w in secondaries if w.centre_tap]
    return (tapped or secondaries or [None])[0]
