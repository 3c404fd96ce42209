"""Effective parameters of a core: a toroid's computed by IEC 60205, any other core's as declared."""

from __future__ import annotations

import math
from dataclasses import dataclass

from dossier.standards.copper import MU_0
from dossier.calcs.shared.lamination import SHAPE_WORDS, lamination_of
from dossier.units import Q_


@dataclass(frozen=True)
class CoreGeometry:
    """Effective area, path length and volume; window; bare mean turn; outside surface; A_L.

    Any of window_area, mean_turn_length, surface_area and al may be None for a declared core.
    """

    effective_area: object
    path_length: object
    volume: object
    window_area: object
    mean_turn_length: object
    surface_area: object
    al: object
    method: str
    al_basis: str


def toroid_constants(outer, inner, height):
    """IEC 60205 core constants of a rectangular-section toroid: C1 = sum l/A, C2 = sum l/A^2 (integrated)."""
    r1, r2 = inner / 2, outer / 2
    log = math.log((r2 / r1).to("").magnitude)
    c1 = 2 * math.pi / (height * log)
    c2 = 2 * math.pi * (1 / r1 - 1 / r2) / (height**2 * log**3)
    return c1, c2


def effective_from_constants(c1, c2):
    """IEC 60205: l_e = C1^2 / C2, A_e = C1 / C2, V_e = C1^3 / C2^2."""
    return (c1**2 / c2).to("mm"), (c1 / c2).to("mm**2"), (c1**3 / c2**2).to("mm**3")


def toroid(core) -> CoreGeometry:
    path, area, volume = effective_from_constants(*toroid_constants(core.outer_diameter, core.inner_diameter, core.height))
    al, al_basis = _al(core, area, path)
    return CoreGeometry(
        effective_area=area,
        path_length=path,
        volume=volume,
        window_area=hole_area(core.inner_diameter),
        mean_turn_length=section_perimeter(core.outer_diameter, core.inner_diameter, core.height),
        surface_area=toroid_surface(core.outer_diameter, core.inner_diameter, core.height),
        al=al,
        method="IEC 60205 core constants of a toroid of rectangular section",
        al_basis=al_basis,
    )


def declared(core) -> CoreGeometry:
    al, al_basis = _al(core, core.effective_area, core.path_length)
    return CoreGeometry(
        effective_area=core.effective_area.to("mm**2"),
        path_length=core.path_length.to("mm"),
        volume=(core.effective_area * core.path_length).to("mm**3"),
        window_area=core.window_area,
        mean_turn_length=core.mean_turn_length,
        surface_area=core.surface_area,
        al=al,
        method="effective parameters as declared",
        al_basis=al_basis,
    )


def laminated(core) -> CoreGeometry:
    """An E-I, U-I or C core from its limb, stack and window; a declared A_e, l_e, window, mean turn or surface wins."""
    lam = lamination_of(core)
    area = core.effective_area.to("mm**2") if core.effective_area is not None else lam.net_area
    path = core.path_length.to("mm") if core.path_length is not None else lam.path_length
    al, al_basis = _al(core, area, path)
    overridden = [name for name in ("effective_area", "path_length", "window_area", "mean_turn_length", "surface_area")
                  if getattr(core, name) is not None]
    return CoreGeometry(
        effective_area=area,
        path_length=path,
        volume=lam.iron_volume if core.effective_area is None and core.path_length is None else (area * path).to("mm**3"),
        window_area=core.window_area.to("mm**2") if core.window_area is not None else lam.window_area,
        mean_turn_length=core.mean_turn_length if core.mean_turn_length is not None else lam.mean_turn(Q_(0, "mm"), lam.winding_width),
        surface_area=core.surface_area,
        al=al,
        method=_laminated_method(lam, overridden),
        al_basis=al_basis,
    )


def _laminated_method(lam, overridden) -> str:
    path = "2 (w + h) + a/2 + c + 2 y" if lam.shell else "2 (w + h) + 4 a"
    text = (f"{SHAPE_WORDS[lam.shape]}: A_e = a s k, l_e = {path} through the centre lines of limbs and yokes, A_w = w h, "
            "iron volume = (outline - windows) s k, bare mean turn at half the window's width on a bobbin")
    notes = list(lam.basis) + ([f"declared: {', '.join(overridden)}"] if overridden else [])
    return text + ("; " + "; ".join(notes) if notes else "")


def geometry(core) -> CoreGeometry:
    if core.shape == "toroid":
        return toroid(core)
    return declared(core) if core.shape == "declared" else laminated(core)


def hole_area(inner):
    """A toroid's winding window: its hole, pi ID^2 / 4."""
    return (math.pi * inner**2 / 4).to("mm**2")


def section_perimeter(outer, inner, height):
    """One turn tight round the bare core's section: 2 h + (OD - ID)."""
    return (2 * height + (outer - inner)).to("mm")


def toroid_surface(outer, inner, height):
    """Outside surface of a toroid: two annular faces and the outer and inner cylinders."""
    faces = math.pi / 2 * (outer**2 - inner**2)
    return (faces + math.pi * (outer + inner) * height).to("cm**2")


def _al(core, area, path):
    if core.al is not None:
        return _readable(core.al.to("nH")), "declared"
    permeability = core.material.initial_permeability
    if permeability is None:
        return None, "not known"
    return _readable(al_from_permeability(permeability, area, path)), "mu_0 mu_i A_e / l_e from the initial permeability"


def _readable(al):
    return al.to("uH") if al >= Q_(1, "uH") else al


def al_from_permeability(permeability: float, area, path):
    """A_L = mu_0 mu_e A_e / l_e (an ungapped core: mu_e = mu_i)."""
    return (MU_0 * permeability * area / path).to("nH")
