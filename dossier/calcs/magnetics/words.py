"""Every sentence the magnetics calc writes: titles, methods and explanations. The logic stays numbers and rules."""

from __future__ import annotations

from dossier.units import fmt
from dossier.wording import measure_text

LINE_WORDS = {"low": "low line", "nominal": "nominal line", "high": "high line"}


def listing(measures) -> str:
    """The measures as one sentence, for findings whose numbers are the point."""
    return "; ".join(measure_text(m) for m in measures) + "."


# --- core and ratio -------------------------------------------------------------------------------------------

def core_title(ref: str) -> str:
    return f"Core of {ref}: effective parameters"


def core_text(measures, al_basis: str) -> str:
    return f"{listing(measures)} A_L: {al_basis}."


def ratio_title(subject: str) -> str:
    return f"Turns ratio and voltages of {subject}"


def ratio_label(reference: str, winding: str) -> str:
    return f"turns ratio {reference} : {winding}"


def peak_label(line: str | None) -> str:
    return "peak voltage" if line is None else f"peak voltage at {LINE_WORDS[line]}"


def half_label(line: str | None) -> str:
    return "each half, peak" if line is None else f"each half, peak at {LINE_WORDS[line]}"


def ratio_method(reference: str, basis: str) -> str:
    return f"voltage across '{reference}' scaled by turns; drive: {basis}"


# --- flux -----------------------------------------------------------------------------------------------------

def flux_title(ref: str, varies: bool) -> str:
    return f"Peak flux density in {ref}" + (" at high line" if varies else "")


def flux_formula(waveform: str, polarity: str) -> str:
    if waveform == "sine":
        return "B_pk = V_rms / (4.44 f N A_e)"
    if polarity == "unipolar":
        return "delta-B = V D / (f N A_e) (V t_on / (N A_e)), B_pk = B_r + delta-B"
    return "B_pk = V D / (4 f N A_e)"


def flux_method(waveform: str, polarity: str, drive, turns_of: str, remanence_basis: str | None) -> str:
    text = f"{flux_formula(waveform, polarity)} at {fmt(drive.frequency)}, {turns_of} turns; drive: {drive.basis}"
    if remanence_basis is not None:
        text += f"; remanence B_r {remanence_basis}"
        if remanence_basis != "declared":
            text += " (declare core.material.remanence to make it exact)"
    return text


def saturation_method(method: str, family: str, how: str, headroom: float) -> str:
    return f"{method}; {family} ({how}): marginal within {headroom:.0%} of saturation"


def saturation_label(at) -> str:
    return f"saturation at {fmt(at)}" if at is not None else "saturation (temperature not stated)"


def choke_flux_title(ref: str) -> str:
    return f"Peak flux density in {ref} at peak current"


# --- core loss ------------------------------------------------------------------------------------------------

def core_loss_title(ref: str) -> str:
    return f"Core loss of {ref}"


CORE_LOSS_METHODS = {
    "sine": "Steinmetz: P = k f^alpha B_pk^beta V_e (sine flux)",
    "bipolar": ("iGSE for a bipolar square drive on D of the period: P_v = k_i f^alpha (delta-B)^beta 2^alpha D^(1 - alpha), "
                "k_i = k / ((2 pi)^(alpha - 1) integral |cos|^alpha 2^(beta - alpha))"),
    "unipolar": ("iGSE for a unipolar drive on D of the period, reset in the same time: "
                 "P_v = k_i f^alpha (delta-B)^beta 2 D^(1 - alpha), k_i from k, alpha, beta"),
    "triangle": ("iGSE for a choke's triangular ripple flux, rising for D and falling for 1 - D: "
                 "P_v = k_i f^alpha (delta-B)^beta (D^(1 - alpha) + (1 - D)^(1 - alpha)), k_i from k, alpha, beta"),
}


def core_loss_method(shape: str, choke: bool) -> str:
    return CORE_LOSS_METHODS[shape] + (" at the ripple flux" if choke else " at nominal line")


def steel_loss_method(beta: float, alpha: float, alpha_basis: str, mass_basis: str) -> str:
    return (f"P = p_rated (B_pk / B_rated)^{beta:g} (f / f_rated)^{alpha:g} m at nominal line; frequency exponent: {alpha_basis}; "
            f"iron mass m: {mass_basis}")


def steel_loss_text(measures, rated_basis: str, harsher: bool) -> str:
    text = f"{listing(measures)} Loss figure: {rated_basis}."
    if harsher:
        text += (" The record gives no loss figure for this steel, so a high-loss grade's is taken (harsher reading): "
                 "declare core.material.specific_loss (the maker's W/kg at a flux density and frequency) or core.material.grade.")
    return text


# --- choke ----------------------------------------------------------------------------------------------------

def choke_title(ref: str) -> str:
    return f"Choke {ref}: inductance, energy and field"


CHOKE_METHOD = "L = A_L N^2; H = N I_pk / l_e; ripple dI = V D / (f L) from the declared excitation"
CHOKE_FIELD_HINT = "Declare core.material.max_field to check the field."


# --- windings -------------------------------------------------------------------------------------------------

def density_title(subject: str) -> str:
    return f"Current density in {subject}"


def density_method(basis: str, limit_basis: str) -> str:
    return f"J = I / A_copper; current: {basis}; limit: {limit_basis}"


def density_hint(strands: int) -> str:
    return f"Thicker wire or more strands in parallel: {strands} strands of this wire would bring it within the limit."


def kj_basis(configuration: str, how: str, rise: int, kj: float, exponent: float, product) -> str:
    return (f"J = K_j A_p^x with K_j {kj:g}, x {exponent:g} for a {configuration} core ({how}) at a {rise} K rise, "
            f"A_p = W_a A_e = {fmt(product)}")


def flat_limit_basis(what: str) -> str:
    return what


UNSIZED_CORE = ("The core's window area is not known, so the limit from its size (J = K_j A_p^x) cannot be worked out: "
                "the upper end of the usual band is used and the verdict is held at marginal. Declare core.window_area.")


def resistance_title(subject: str) -> str:
    return f"DC resistance of {subject}"


def resistance_method(hot_basis: str) -> str:
    return f"R = rho N l_turn / A, rho = 1/58 ohm mm^2/m at 20 degC rising 0.393 %/K; hot: {hot_basis}"


def skin_title(subject: str) -> str:
    return f"Skin depth against the wire of {subject}"


SKIN_METHOD = "delta = sqrt(rho / (pi f mu_0))"


def litz_hint() -> str:
    return "Use litz wire: even very thin strands are thicker than two skin depths."


def strand_hint(count: int, thinner: float) -> str:
    return f"Use more, thinner strands: for example {count} strands of {thinner:.2f} mm keep at least the copper area."


def fill_title(ref: str) -> str:
    return f"Window fill of {ref}"


def fill_method(bases) -> str:
    return "insulated wire (overall diameter) and tape over the window area; overall diameters: " + "; ".join(bases)


def overflow_text(over, first: str, hole_short) -> str:
    text = f"Does not fit: {fmt(over)} more than can be wound by hand; the window is full from winding '{first}' on."
    if hole_short is not None:
        text += f" The windings close the hole: they need {fmt(hole_short)} more diameter than it has."
    return text


# --- temperature ----------------------------------------------------------------------------------------------

def rise_title(ref: str) -> str:
    return f"Temperature rise of {ref}"


def rise_method(with_core: bool) -> str:
    return "copper loss at the hot temperature" + (" plus core loss" if with_core else ", no core loss known") + "; T_r = 450 (P / A)^0.826"


RISE_HINT = "Declare core.material.max_temperature to judge the rise."


def rise_limit_label(max_temperature) -> str:
    return f"{fmt(max_temperature)} less the ambient"


def winding_temperature_title(ref: str) -> str:
    return f"Winding temperature of {ref} against its insulation class"


def winding_temperature_method(declared: bool, letter: str) -> str:
    how = f"class {letter} declared" if declared else (
        f"no insulation class declared: class {letter} taken, the lowest in use (harsher reading; declare "
        "magnetics[].insulation_class to make it exact)")
    return ("highest ambient + temperature rise (a mean over the surface; the hot spot inside the winding is hotter, "
            f"so within 10 K of the class temperature is marginal) against the class temperature (IEC 60085); {how}")


CLASS_HINT = ("No insulation class is declared, so class A (105 degC), the lowest in use, is taken. "
              "Declare magnetics[].insulation_class (e.g. B for 130 degC) to judge against the winding's own class.")


def class_label(letter: str, temperature) -> str:
    return f"thermal class {letter} ({fmt(temperature)})"


# --- inputs ---------------------------------------------------------------------------------------------------

def not_checked_title(what: str, subject: str) -> str:
    return f"{what} of {subject} not checked"


DRIVE_HINT = ("The record does not say what drives it: declare an excitation (waveform, voltage, frequency, winding), "
              "or for a converter transformer give the converter stage's topology.")
FREQUENCY_HINT = "The operating frequency is not known: add 'frequency' (e.g. 40 kHz) to this magnetic."
CHOKE_HINT = "A choke needs core.al (or the material's initial_permeability) and its winding's current."
SURFACE_HINT = "Declare core.surface_area (outside surface of the wound part) to estimate the temperature rise."
CURRENT_HINT = "Declare the winding's RMS current ('current: 1.2 A'); it could not be derived from the output rating."
