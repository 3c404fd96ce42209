"""Wound-component insulation across a double or reinforced barrier.

Enamel on winding wire counts for nothing across a barrier. Between two windings on opposite sides the barrier
is made by triple-insulated wire on one of them, by at least three layers of tape between them (the thin-sheet
rule: any two of three layers pass the electric strength test; two layers pass only if each one alone does,
which a record cannot show), or, on a bobbin, by a split (sectioned) bobbin. Windings are taken in the order
listed, from the core out; the tape between two windings is the tape over each winding from the inner one up to
the outer one. The core is conductive (MnZn ferrite, steel) and counts as part of the winding nearest it (the
first) unless declared isolated; on a bobbin the core's outer limbs also face the outermost winding across only
its own tape wrap. Where tape makes the barrier on a bobbin, the creepage along the bobbin from one winding's end
to the other's is the sum of their end margins, which must reach the barrier's declared shortest creepage.
"""

from __future__ import annotations

from dataclasses import dataclass, replace

from dossier.calcs.magnetics import words
from dossier.calcs.magnetics.context import make
from dossier.citations import IEC_61558_1, IEC_62368_1
from dossier.findings import Measure, Verdict, common_practice
from dossier.units import Q_

CODE = "MAG-BARRIER-INSULATION"
DOUBLED = ("reinforced", "double")
TAPE_LAYERS_NEEDED = 3
THIN_SHEET = replace(IEC_62368_1, edition="edition 3.0, 2018", clause=(
    "5.4.4.6, insulation in thin sheet material: reinforced insulation of separable layers is at least two layers each "
    "passing the electric strength test for reinforced insulation, or three layers of which any two pass it (the rule "
    "confirmed in public quotations of the same rule in IEC 60950-1 clause 2.10.5.7; the 62368-1 clause number from memory); "
    "Annex J, insulated winding wires (from memory)"))
WOUND_PARTS = replace(IEC_61558_1, clause=(
    "clause 26 and Annex on insulation between windings: enamel not counted as insulation; thin-sheet layers; "
    "sectioned (split) bobbins (from memory)"))
CONDUCTIVE_CORE = common_practice("MnZn ferrite conducts (resistivity of the order of 1 ohm m) and laminations are steel: a core is "
                                  "treated as conductive, part of the winding nearest it (makers' data; from memory)")
MARGINS = common_practice("creepage along a bobbin between windings across a barrier is the sum of the end margins of the two "
                          "windings (margin-tape practice; from memory)")
SOURCES = (THIN_SHEET, WOUND_PARTS, CONDUCTIVE_CORE)


@dataclass(frozen=True)
class Pair:
    """Two conductors on opposite sides of the barrier: windings by position, or the core (None) and a winding."""

    inner: int | None
    outer: int
    layers: int
    triple: bool

    @property
    def separated(self) -> bool:
        return self.triple or self.layers >= TAPE_LAYERS_NEEDED


def barrier_findings(ctx) -> list:
    found = barrier_of(ctx.record, ctx.magnetic)
    if found is None:
        return []
    index, barrier, how = found
    sides = [side_of(w, barrier) for w in ctx.magnetic.windings]
    pairs = crossing_pairs(ctx.magnetic, sides)
    if not pairs:
        return []
    return [_finding(ctx, index, barrier, how, sides, pairs)]


def barrier_of(record, magnetic):
    """(index, barrier, how found) of the double or reinforced barrier the windings cross; None when none does."""
    listing = [(i, b) for i, b in enumerate(record.barriers) if magnetic.ref in b.parts]
    if listing:
        i, b = max(listing, key=lambda pair: pair[1].grade in DOUBLED)
        return (i, b, f"'{b.name}' ({b.grade}) lists {magnetic.ref}") if b.grade in DOUBLED else None
    if magnetic.role != "mains-transformer":
        return None
    from_mains = [(i, b) for i, b in enumerate(record.barriers) if _mains_name(b) is not None and b.grade in DOUBLED]
    if from_mains:
        i, b = from_mains[0]
        return i, b, f"'{b.name}' ({b.grade}) is the barrier from the mains that {magnetic.ref}'s windings cross"
    return None if any(_mains_name(b) for b in record.barriers) else (None, None, "assumed")


def _mains_name(barrier) -> str | None:
    return next((side for side in barrier.between if side.strip().lower() == "mains"), None)


def side_of(winding, barrier) -> str:
    """'mains' or 'far': a declared side by name, else a primary on the mains side and any other winding on the far side."""
    near = (_mains_name(barrier) or barrier.between[0]) if barrier is not None else "mains"
    if winding.side:
        return "mains" if winding.side.strip().lower() == near.strip().lower() else "far"
    return "mains" if winding.role == "primary" else "far"


def crossing_pairs(magnetic, sides) -> list[Pair]:
    windings = magnetic.windings
    pairs = [Pair(i, j, sum(w.tape_layers for w in windings[i:j]), windings[i].triple_insulated or windings[j].triple_insulated)
             for i in range(len(windings)) for j in range(i + 1, len(windings)) if sides[i] != sides[j]]
    last = len(windings) - 1
    if not magnetic.core.isolated and magnetic.core.shape != "toroid" and last > 0 and sides[last] != sides[0]:
        outer = windings[last]
        pairs.append(Pair(None, last, outer.tape_layers, outer.triple_insulated))
    return pairs


def _finding(ctx, index, barrier, how, sides, pairs):
    magnetic = ctx.magnetic
    split = magnetic.construction == "split-bobbin"
    short = [p for p in pairs if not p.separated]
    margins = None if split or short else _margins(ctx, barrier, pairs)
    verdict, outcome = _verdict(magnetic, split, short, margins)
    taped = [p.layers for p in pairs if not p.triple]
    keys = (ctx.key("windings"), ctx.key("construction"), ctx.key("core", "isolated")) + ((("barriers", index),) if index is not None else (("barriers",),))
    keys += tuple(ctx.winding_key(i, "side") for i, w in enumerate(magnetic.windings) if not w.side)
    values = (Measure("construction", "split bobbin"),) if split else (
        Measure("fewest tape layers between the sides", Q_(min(taped))) if taped else Measure("between the sides", "triple-insulated wire"),)
    extra = (Measure("barrier grade", barrier.grade if barrier is not None else "reinforced (assumed)"),)
    if margins is not None and margins.total is not None:
        extra += (Measure("end margins along the bobbin", margins.total), Measure("barrier's declared creepage", barrier.creepage))
    return make(
        CODE, magnetic.ref, words.barrier_title(magnetic.ref, barrier.name if barrier is not None else None), verdict,
        values=values, limit=None if split or not taped else Measure("layers of tape needed without triple-insulated wire", Q_(TAPE_LAYERS_NEEDED)),
        relation=">=", extra=extra, method=words.BARRIER_METHOD,
        explanation=words.barrier_text(magnetic, sides, pairs, how, outcome, margins),
        keys=keys, sources=SOURCES + ((MARGINS,) if margins is not None else ()), guards_hazard=True,
    )


@dataclass(frozen=True)
class Margins:
    total: object | None  # None: some winding that needs one declares no end margin
    missing: tuple[str, ...]
    creepage: object


def _margins(ctx, barrier, pairs) -> Margins | None:
    """End margins on a bobbin where tape (not triple-insulated wire) makes the barrier; None on a toroid."""
    if ctx.magnetic.core.shape == "toroid" or barrier is None:
        return None
    taped = [p for p in pairs if not p.triple and p.inner is not None]
    if not taped:
        return None
    windings = ctx.magnetic.windings
    needing = sorted({i for p in taped for i in (p.inner, p.outer)})
    missing = tuple(windings[i].name for i in needing if windings[i].end_margin is None)
    if missing:
        return Margins(None, missing, barrier.creepage)
    shortest = min((windings[p.inner].end_margin + windings[p.outer].end_margin).to("mm") for p in taped)
    return Margins(shortest, (), barrier.creepage)


def _verdict(magnetic, split: bool, short, margins) -> tuple[Verdict, str]:
    """(verdict, outcome) with outcome a key into words.BARRIER_OUTCOME."""
    if split:
        return Verdict.PASS, "split"
    if short:
        unsettled = magnetic.construction is None and magnetic.role == "mains-transformer" and magnetic.core.shape != "toroid"
        return (Verdict.NOT_ASSESSED, "construction-unknown") if unsettled else (Verdict.FAIL, "too-few-layers")
    if margins is None:
        return Verdict.PASS, "separated"
    if margins.total is None:
        return Verdict.NOT_ASSESSED, "margins-unknown"
    if margins.total.to("mm") < margins.creepage.to("mm"):
        return Verdict.FAIL, "margins-short"
    return Verdict.PASS, "separated"
