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


# --- insulation across a barrier --------------------------------------------------------------------

def barrier_title(ref: str, barrier: str | None) -> str:
    return f"{ref}: insulation between windings across '{barrier}'" if barrier else f"{ref}: insulation between windings across the mains barrier"


BARRIER_METHOD = ("enamel counts for nothing; each pair of windings on opposite sides needs triple-insulated wire on one, "
                  "at least 3 layers of tape between them, or a split bobbin; on a bobbin the end margins of a taped pair must "
                  "reach the barrier's declared creepage")
BARRIER_OUTCOME = {
    "split": "The windings sit in separate sections of a split bobbin, so the bobbin's partition, not the enamel, keeps them apart.",
    "separated": "Every pair of windings across the barrier is kept apart by triple-insulated wire or at least three layers of tape.",
    "too-few-layers": ("Enamel is not insulation across a barrier. Wind one side in triple-insulated wire, or put at least three "
                       "layers of tape between the windings (any two of three pass the electric strength test; two layers pass "
                       "only if each alone passes it for reinforced insulation, which the record cannot show)."),
    "construction-unknown": ("The tape between the windings is not enough for a layered winding, and the record does not say whether "
                             "the transformer is wound on a split bobbin, which would keep the windings apart: declare "
                             "magnetics[].construction (split-bobbin or layered). Until then it blocks power-up."),
    "margins-unknown": ("The creepage along the bobbin from one winding's end to the other's is not known: declare end_margin "
                        "for {missing}. On a mains barrier that blocks power-up."),
    "margins-short": ("The end margins give {total} of creepage along the bobbin, less than the {creepage} declared as the "
                      "barrier's shortest creepage: the transformer's own path is the shortest. Widen the margins, or declare "
                      "the barrier's creepage as measured along the bobbin."),
}


def _pair_text(windings, pair) -> str:
    inner = "the core" if pair.inner is None else windings[pair.inner].name
    how = "triple-insulated wire" if pair.triple else f"{pair.layers} layer{'s' if pair.layers != 1 else ''} of tape"
    return f"{inner} to {windings[pair.outer].name}: {how}"


def barrier_text(magnetic, sides, pairs, how: str, outcome: str, margins) -> str:
    windings = magnetic.windings
    if how == "assumed":
        text = "No barrier from the mains is declared, so a reinforced one is assumed between the windings (the harsher reading). "
    else:
        text = f"The barrier {how}. "
    undeclared = [w.name for w in windings if not w.side]
    if undeclared:
        text += (f"Sides taken where not declared ({', '.join(undeclared)}): a primary on the mains side, any other winding on "
                 "the far side (the harsher reading; declare windings[].side to make it exact). ")
    text += "Across the barrier: " + "; ".join(_pair_text(windings, p) for p in pairs) + ". "
    if magnetic.core.isolated:
        text += "The core is declared isolated from the windings. "
    else:
        text += (f"The core is taken as conductive (MnZn ferrite and steel are) and counts as part of {windings[0].name}, the "
                 "winding nearest it, unless core.isolated is declared. ")
    names = {"missing": ", ".join(margins.missing) if margins else "", "total": fmt(margins.total) if margins and margins.total is not None else "",
             "creepage": fmt(margins.creepage) if margins else ""}
    return text + BARRIER_OUTCOME[outcome].format(**names)


# --- proximity loss (Dowell) ------------------------------------------------------------------------

def proximity_title(subject: str) -> str:
    return f"Proximity loss in {subject} (Dowell)"


PROXIMITY_METHOD = ("F_R = Delta [(sinh 2Delta + sin 2Delta)/(cosh 2Delta - cos 2Delta) + 2 (m^2 - 1)/3 (sinh Delta - sin Delta)/"
                    "(cosh Delta + cos Delta)], Delta = (pi/4)^(3/4) (d / delta) sqrt(d / p) for round wire of pitch p, at the "
                    "drive's fundamental; the copper loss is I^2 R_hot F_R")
PROXIMITY_NO_LAYERS = ("Not assessed: the number of layers the winding is wound in is not known on a declared core, so its proximity "
                       "loss cannot be worked out and the copper loss leaves it out. Declare windings[].layers.")
PROXIMITY_LEFT_OUT = ("The proximity loss of a winding whose layer count is not known is left out, so the loss and the rise are "
                      "low by an unknown amount: held at marginal at best; declare windings[].layers.")


def proximity_text(found) -> str:
    basis = "as declared" if found.layers_declared else "as laid at the toroid's hole"
    return (f"{found.layers} layer{'s' if found.layers != 1 else ''} ({basis}): the winding's copper loss is {found.factor:.3g} times "
            "its hot DC loss at the fundamental; harmonics of a square-wave current add more.")
