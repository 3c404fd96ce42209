"""The mains fuse to fit, as the protection calc recommends it, beside what the record declares."""

from __future__ import annotations

from dossier.calcs.protection import FUSE, FUSE_RECOMMENDED, NAME as PROTECTION
from dossier.checklist.items import Item, Origin, Phase
from dossier.findings import common_practice
from dossier.standards.fuses import marking
from dossier.units import fmt

MARKING_PRACTICE = common_practice("reading the fuse's own marking before fitting it")


def declared_text(fuse) -> str:
    """'T2A 250 V ceramic, breaking capacity 1500 A'."""
    text = f"{marking(fuse.rating, fuse.speed)} {fmt(fuse.voltage_rating)} {fuse.body}"
    if fuse.breaking_capacity is not None:
        text += f", breaking capacity {fmt(fuse.breaking_capacity, digits=6)}"
    return text


def fuse_item(record, review) -> list[Item]:
    """The fuse the protection calc recommends (its product, never computed again here), beside the declared one."""
    if record.mains is None:
        return []
    declared = record.protection.fuse
    choice = review.product(PROTECTION, FUSE)
    if choice is None or choice.rating is None:
        return [_declared_only(declared)] if declared is not None else [_no_fuse()]
    if declared is not None and choice.declared_fits:
        return [_declared_passes(declared, choice, _sources(review.findings))]
    return [_recommended(declared, choice, _sources(review.findings))]


def _declared_passes(declared, choice, sources) -> Item:
    """The declared fuse passes every check: fit that one, so the unit matches its record."""
    fit = marking(declared.rating, declared.speed)
    smallest = marking(choice.rating, choice.speed)
    steps = f"Fit {declared.ref}: {declared_text(declared)}, as the record declares; it passes the protection checks. "
    if smallest != fit:
        steps += f"The smallest preferred rating that would also do is {smallest}; fit that instead only with a new revision. "
    return Item(
        key="mains-fuse", phase=Phase.UNPOWERED, origin=Origin.BUILD,
        title=f"Mains fuse {declared.ref}: fit {fit}",
        steps=steps + _reading_text(), sources=sources + (MARKING_PRACTICE,),
    )


def _sources(findings) -> tuple:
    finding = next((f for f in findings if f.code == FUSE_RECOMMENDED), None)
    return finding.sources if finding is not None else ()


def _recommended(declared, choice, sources) -> Item:
    fit = marking(choice.rating, choice.speed)
    ref = declared.ref if declared is not None else "the mains fuse"
    steps = f"Fit {ref}: {fit} ({choice.speed}, {fmt(choice.rating)})"
    if choice.minimum_melting_i2t is not None:
        steps += f", of a type whose melting I^2 t is at least {fmt(choice.minimum_melting_i2t)}"
    steps += f". This is the smallest preferred rating that carries the running current at {fmt(choice.ambient)}. "
    steps += _against_declared(declared, fit, choice) + _reading_text()
    title = f"fit {fit}" + (f" with melting I^2 t at least {fmt(choice.minimum_melting_i2t)}" if choice.transformer_i2t is not None else "")
    return Item(
        key="mains-fuse", phase=Phase.UNPOWERED, origin=Origin.BUILD,
        title=f"Mains fuse {declared.ref}: {title}" if declared is not None else f"Mains fuse: {title}",
        steps=steps, sources=sources + (MARKING_PRACTICE,),
    )


def _against_declared(declared, fit: str, choice) -> str:
    if declared is None:
        return "The record declares no fuse: record the one fitted. "
    if choice.surge_blows_declared:
        return (f"Do not fit the declared {declared_text(declared)}: the upper bound of the transformer's switch-on surge is more than its "
                "melting I^2 t allows. Fit a type with the melting I^2 t above, or a soft-start first (see the switch-on surge finding), "
                "and record the one fitted. ")
    if marking(declared.rating, declared.speed) == fit:
        return f"The record declares the same: {declared_text(declared)}. "
    return (f"The record declares {declared_text(declared)}: fit the recommended one, or note on this sheet "
            "which was fitted and why. ")


def _reading_text() -> str:
    return "Read the marking on the fuse itself, not the packet; check that the holder's cap is seated and the holder is in the line conductor."


def _declared_only(declared) -> Item:
    return Item(
        key="mains-fuse", phase=Phase.UNPOWERED, origin=Origin.BUILD,
        title=f"Mains fuse {declared.ref}: {marking(declared.rating, declared.speed)}",
        steps=f"Fit {declared.ref}: {declared_text(declared)}, as the record declares (no recommendation could be computed). " + _reading_text(),
        sources=(MARKING_PRACTICE,),
    )


def _no_fuse() -> Item:
    return Item(
        key="mains-fuse", phase=Phase.UNPOWERED, origin=Origin.BUILD,
        title="Mains fuse: none recorded",
        steps="The record declares no mains fuse and none could be computed. Do not power up until one is chosen, recorded and fitted.",
        sources=(common_practice("a fuse in the line conductor of every mains-powered unit"),),
    )
