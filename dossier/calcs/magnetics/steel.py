"""Core loss of silicon steel from a loss per kilogram: the maker's figure, the grade's, or a harsher default.

P = p_rated (B / B_rated)^beta (f / f_rated)^alpha m, with beta = 2 at mains frequency (common practice) and the
iron's mass from the core's geometry and the steel's density (or declared).
"""

from __future__ import annotations

from dataclasses import dataclass, replace

from dossier.calcs.magnetics import words
from dossier.calcs.magnetics.context import make
from dossier.calcs.magnetics.saturation import family_of
from dossier.citations import IEC_60404_2, IEC_60404_8_4
from dossier.findings import Measure, Verdict, common_practice
from dossier.standards import electrical_steel as steel

STEEL_GRADES = replace(IEC_60404_8_4, clause=(
    "grade names carry the guaranteed maximum specific total loss at 1.5 T, 50 Hz (e.g. M400-50A: 4.00 W/kg, 0.50 mm); "
    "IEC 60404-8-7 names grain-oriented grades by their loss at 1.7 T (designation scheme from memory)"))
STEEL_DENSITY = replace(IEC_60404_2, clause="conventional density of electrical steel, 7.60-7.80 kg/dm^3 by grade (from memory)")
STEEL_LOSS_SCALING = common_practice("silicon steel's loss at mains frequency scales about as B^2, and as f^1 (hysteresis) to f^2 (eddy currents)")


@dataclass(frozen=True)
class SteelLoss:
    loss: object
    specific: object
    mass: object
    mass_basis: str
    flux: object
    frequency: object
    rated: steel.RatedLoss
    flux_exponent: float
    frequency_exponent: float
    frequency_basis: str
    orientation: str
    harsher: bool
    method: str = "specific-loss"


def uses_specific_loss(ctx) -> bool:
    """Silicon steel in a transformer, unless the material gives Steinmetz parameters and no loss per kilogram."""
    material = ctx.magnetic.core.material
    if ctx.magnetic.role == "choke" or family_of(material, ctx.frequency)[0] != "silicon-steel":
        return False
    return material.specific_loss is not None or material.grade is not None or material.steinmetz is None


def orientation_of(material) -> tuple[str, str]:
    if material.orientation is not None:
        return material.orientation, "declared"
    if material.grade is not None:
        return steel.grade_family(material.grade), f"from the grade {material.grade}"
    return steel.NON_ORIENTED, "not declared: non-oriented taken (harsher; declare core.material.orientation)"


def rated_of(material, orientation: str) -> tuple[steel.RatedLoss, bool]:
    """(the loss figure, whether it is the harsher default)."""
    declared = material.specific_loss
    if declared is not None:
        return steel.RatedLoss(declared.loss.to("W/kg"), declared.flux.to("T"), declared.frequency.to("Hz"), "declared"), False
    if material.grade is not None:
        return steel.grade_loss(material.grade), False
    return steel.DEFAULT_LOSS[orientation], True


def iron_mass(core, geometry, orientation: str) -> tuple:
    if core.mass is not None:
        return core.mass.to("kg"), "declared"
    density = steel.DENSITY[orientation]
    return (geometry.volume * density).to("kg"), f"iron volume x {density.magnitude:g} kg/m^3 ({orientation})"


def steel_loss(ctx, flux) -> SteelLoss:
    material = ctx.magnetic.core.material
    orientation, _ = orientation_of(material)
    rated, harsher = rated_of(material, orientation)
    beta = material.specific_loss.flux_exponent if material.specific_loss is not None else steel.FLUX_EXPONENT
    declared_alpha = material.specific_loss.frequency_exponent if material.specific_loss is not None else None
    alpha, alpha_basis = steel.frequency_exponent(ctx.frequency, rated.frequency, declared_alpha)
    specific = steel.specific_loss(rated, flux, ctx.frequency, beta, alpha)
    mass, mass_basis = iron_mass(ctx.magnetic.core, ctx.core, orientation)
    return SteelLoss(
        loss=(specific * mass).to("W"), specific=specific, mass=mass, mass_basis=mass_basis, flux=flux.to("T"),
        frequency=ctx.frequency, rated=rated, flux_exponent=beta, frequency_exponent=alpha, frequency_basis=alpha_basis,
        orientation=orientation, harsher=harsher,
    )


def steel_loss_finding(ctx, found: SteelLoss):
    rated = found.rated
    extra = (Measure("loss per kilogram at the working flux", found.specific), Measure("iron mass", found.mass),
             Measure("peak flux density used", found.flux), Measure("frequency", found.frequency),
             Measure("rated loss per kilogram", rated.loss), Measure("rated at flux density", rated.flux),
             Measure("rated at frequency", rated.frequency))
    material_key = ctx.key("core", "material")
    keys = (material_key + ("specific_loss",), material_key + ("grade",), material_key + ("orientation",), ctx.key("core"))
    return make("MAG-CORE-LOSS", ctx.ref, words.core_loss_title(ctx.ref), Verdict.INFO, values=(Measure("core loss", found.loss),),
                extra=extra, explanation=words.steel_loss_text(extra, rated.basis, found.harsher),
                method=words.steel_loss_method(found.flux_exponent, found.frequency_exponent, found.frequency_basis, found.mass_basis),
                keys=keys, sources=(STEEL_GRADES, STEEL_LOSS_SCALING, STEEL_DENSITY))
