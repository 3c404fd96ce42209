"""What a drawing is drawn from: plain, hashable text taken from the record and the findings.

A drawer sees only these views, never the record, so a hash of a view covers everything
that can change the picture (see dossier.drawing.cache).
"""

from __future__ import annotations

from dataclasses import dataclass

from dossier.units import fmt


@dataclass(frozen=True)
class PartView:
    ref: str
    kind: str
    value: str
    role: str

    @property
    def label(self) -> str:
        return f"{self.ref}\n{self.value}" if self.value else self.ref

    def is_kind(self, *kinds: str) -> bool:
        return self.kind.lower() in kinds

    def has_role(self, *words: str) -> bool:
        role = self.role.lower()
        return any(word in role for word in words)


@dataclass(frozen=True)
class WindingView:
    name: str
    role: str
    turns: str
    wire: str
    centre_tap: bool

    @property
    def label(self) -> str:
        tap = ", centre tap" if self.centre_tap else ""
        return f"{self.name}: {self.turns} t{tap}\n{self.wire}"

    @property
    def on_primary_side(self) -> bool:
        return self.role in ("primary", "feedback")


@dataclass(frozen=True)
class MagneticView:
    ref: str
    title: str
    windings: tuple[WindingView, ...]

    def side(self, primary: bool) -> tuple[WindingView, ...]:
        return tuple(w for w in self.windings if w.on_primary_side == primary)


@dataclass(frozen=True)
class BarrierView:
    """A barrier with its declared and required distances and the isolation verdict, as text."""

    name: str
    grade: str
    between: tuple[str, str]
    parts: tuple[str, ...]
    creepage: str
    clearance: str
    creepage_required: str
    clearance_required: str
    verdict: str

    @property
    def lines(self) -> tuple[str, ...]:
        return (
            f"{self.grade} barrier: {self.name}",
            _distance_line("creepage", self.creepage, self.creepage_required),
            _distance_line("clearance", self.clearance, self.clearance_required),
            f"isolation verdict: {self.verdict}",
        )

    @property
    def label(self) -> str:
        return "\n".join(self.lines)


def _distance_line(what: str, declared: str, required: str) -> str:
    return f"{what} {declared} declared, {required} required" if required else f"{what} {declared} declared (required: not checked)"


@dataclass(frozen=True)
class OutputView:
    setpoint: str
    battery: str


@dataclass(frozen=True)
class RailView:
    """An output of the unit as drawings label it, e.g. 'B+ 350 V DC', and whether it is above the
    extra-low-voltage limits."""

    name: str
    voltage: str  # '350 V DC', '6.3 V AC'
    bleeder: str = ""  # the resistance declared across it, '' when none is
    hazardous: bool = False
    direct: bool = True  # DC; False for an AC rail such as a heater winding

    @property
    def label(self) -> str:
        return f"{self.name} {self.voltage}".strip()

    @property
    def negative(self) -> bool:
        return self.voltage.lstrip().startswith(("-", "\u2212"))


@dataclass(frozen=True)
class StageView:
    index: int
    kind: str
    name: str
    side: str
    topology: str
    parts: tuple[PartView, ...]
    magnetics: tuple[MagneticView, ...]
    barriers: tuple[BarrierView, ...]
    earthed: bool
    output: OutputView | None
    came_from: str
    goes_to: str
    load: str = ""  # what the stage drives in the next stage, e.g. 'T1 primary (stage 3)'
    supply: str = ""  # what feeds it from an earlier stage, e.g. 'T1 secondary (stage 3)'
    direct_current: bool = True  # an earlier stage rectifies; else the stage is fed AC
    rails: tuple[RailView, ...] = ()  # the rails this stage delivers
    heater: str = ""  # for a valve rectifier: the winding that heats it, e.g. 'T1 rectifier heater: 9 t'
    hazard: tuple[str, ...] = ()  # on the isolated side: the hazardous rails this stage carries or feeds

    @property
    def hazardous_dc(self) -> bool:
        """Above the extra-low-voltage limits though not connected to the mains."""
        return bool(self.hazard) and not self.on_mains

    def pole(self, positive: bool) -> str:
        """'+' or '-' for a DC stage, '~' for an AC one."""
        if not self.direct_current:
            return "~"
        return "+" if positive else "\u2212"

    @property
    def key(self) -> str:
        return f"stage-{self.index}-{self.kind}"

    @property
    def title(self) -> str:
        return f"Stage {self.index}: {self.name}"

    @property
    def on_mains(self) -> bool:
        return self.side == "mains"

    def magnetic(self, ref: str) -> MagneticView | None:
        return next((m for m in self.magnetics if m.ref == ref), None)

    def barrier_through(self, ref: str) -> BarrierView | None:
        return next((b for b in self.barriers if ref in b.parts), None)


@dataclass(frozen=True)
class BlockView:
    """The whole build as blocks, with the barriers that cross it and those that do not."""

    index: int
    name: str
    kind: str
    side: str
    refs: tuple[str, ...]
    bridging: bool  # holds a part that forms or bridges a barrier
    id: str = ""
    fed_from: tuple[str, ...] = ()
    rails: tuple[RailView, ...] = ()
    hazard: tuple[str, ...] = ()

    @property
    def hazardous_dc(self) -> bool:
        return bool(self.hazard) and not self.on_mains

    @property
    def on_mains(self) -> bool:
        return self.side == "mains"


@dataclass(frozen=True)
class DiagramView:
    title: str
    blocks: tuple[BlockView, ...]
    crossing: tuple[BarrierView, ...]
    others: tuple[BarrierView, ...]

    key = "block-diagram"


def quantity_text(quantity, digits: int = 3) -> str:
    return fmt(quantity, digits) if quantity is not None else ""


def turns_text(turns: float) -> str:
    return f"{turns:g}"
