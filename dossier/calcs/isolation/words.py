"""Every sentence the isolation calc writes; the calc itself stays numbers and rules."""

from __future__ import annotations

import math

from dossier.standards import iec60664 as std
from dossier.standards.ipc2221 import CONDITION_WORDS
from dossier.units import Q_, fmt

BLOCKS = "A safety barrier that cannot be assessed blocks power-up like a fail"
READING_KEY = "archive.yaml table_interpolation"

# --- inputs -------------------------------------------------------------------------------------

MAINS_PEAK_NOTE = "the mains nominal x sqrt 2"
DECLARED_PEAK_NOTE = "the recurring peak declared on the barrier (working_peak)"


def inputs_title(grade: str) -> str:
    return f"Derived inputs for {grade} insulation"


def declared_working_note(ac, dc) -> str:
    parts = [f"{fmt(ac)} AC r.m.s. (working_voltage)" if ac is not None else "",
             f"{fmt(dc)} DC (working_dc)" if dc is not None else ""]
    return "working voltage declared on the barrier: " + " plus ".join(p for p in parts if p)


def creepage_declared_note(ac, dc) -> str:
    if ac is not None and dc is not None:
        return (f"Table F.5 entered with their sum, {fmt(ac + dc)}, an upper bound for the r.m.s. of the two together "
                f"(the harsher reading; the r.m.s. is sqrt({fmt(ac)}^2 + {fmt(dc)}^2) only when the AC rides on the DC)")
    kind = "the d.c. value" if dc is not None else "the r.m.s. value"
    return f"Table F.5 entered with {kind}, {fmt(dc if dc is not None else ac)}, as the table asks (working voltage r.m.s. or d.c.)"


def steady_peak_note(ac, dc) -> str:
    if ac is not None and dc is not None:
        return "the DC plus the AC r.m.s. x sqrt 2"
    return "the DC voltage itself" if dc is not None else "the AC r.m.s. x sqrt 2"


def peak_note(peak, how: str, smaller_declared) -> str:
    note = f"peak working voltage {fmt(peak)} ({how})"
    if smaller_declared is not None:
        note += f"; the declared recurring peak, {fmt(smaller_declared)}, is below it and does not govern"
    return note


def variac_working_note(ref: str, top, nominal) -> str:
    return (f"no working voltage declared: the barrier is between mains and another circuit, and variac {ref}'s top of "
            f"scale {fmt(top)} is above the mains nominal {fmt(nominal)}, so {fmt(top)} r.m.s. is taken (the harsher "
            f"reading; declare working_voltage to make it exact)")


def mains_working_note(nominal) -> str:
    return (f"no working voltage declared: the barrier is between mains and another circuit, so the mains nominal "
            f"{fmt(nominal)} r.m.s. is taken (declare working_voltage, working_dc or working_peak where the barrier "
            f"sees more, e.g. a rectified rail or a converter's reset peak)")


def rationalised_note(volts: float, row: float, listed: bool) -> str:
    if listed:
        return f"Table F.3: a {volts:g} V supply uses the {row:g} V row of Table F.5"
    return f"{volts:g} V is not among the Table F.3 systems held here: the next Table F.5 row up, {row:g} V, is used"


def peak_only_note(peak) -> str:
    return (f"only a recurring peak is declared: Table F.5 is entered with it, {fmt(peak)}, an upper bound for the "
            f"r.m.s. or d.c. working voltage (the harsher reading; declare working_voltage or working_dc to make it exact)")


def supply_note(mains) -> str:
    return f"supply {fmt(mains.nominal)} line to neutral, overvoltage category {mains.overvoltage_category}"


def no_mains_supply_note(category: str) -> str:
    return f"no mains record: Table F.1 entered with the working voltage and overvoltage category {category} (assumed)"


def impulse_not_found(problem) -> str:
    return f"impulse voltage not found: {problem}"


def group_from_cti(group: str, cti: int) -> str:
    return f"material group {group} from CTI {cti}"


def group_declared(group: str) -> str:
    return f"material group {group} (declared)"


def group_contradiction(declared: str, cti: int, from_cti: str, worse: str) -> str:
    return (f"material group {declared} is declared but CTI {cti} gives group {from_cti}: the worse of the two, "
            f"group {worse}, is used (correct material_group or cti, whichever is wrong, to make it exact)")


# --- clearance ----------------------------------------------------------------------------------

CLEARANCE_METHOD = ("required = max(Table F.2 case A (impulse voltage, pollution degree), Table F.8 case A (peak "
                    "working voltage)) x Table A.2 altitude factor; impulse voltage from Table F.1; for reinforced and "
                    "double insulation both voltages x 1.6; between rows the next row up unless interpolation is allowed")


def clearance_title(grade: str) -> str:
    return f"Clearance for {grade} insulation"


def clearance_text(site, inputs, need) -> str:
    parts = [f"Rated impulse voltage {need.basic_impulse:g} V (Table F.1, {inputs.supply_note})"]
    if site.doubled:
        parts.append(f"{site.grade} insulation is dimensioned for 160 % of it, {need.impulse:g} V (edition 3, 2020)")
    parts.append(_table_f2_text(inputs, need))
    parts.append(_table_f8_text(site, inputs, need))
    parts.append(_altitude_text(inputs, need))
    if site.doubled:
        parts.append(_edition2_text(need))
    parts.append(grade_note(site))
    return sentences(parts)


def reading_text(reading_used: str, reading) -> str:
    """How a table was read between rows, and what would change it."""
    if reading_used == "on a row":
        return ""
    if reading_used == "interpolated":
        return f", interpolated linearly between rows, as the archive allows on the authority of: {reading.clause}"
    return (", from the next row up (the harsher reading between rows; an archive that relies on a clause "
            f"permitting interpolation says so in {READING_KEY})")


def _table_f2_text(inputs, need) -> str:
    return (f"Table F.2, case A, pollution degree {inputs.pollution_degree}, {need.impulse:g} V: "
            f"{need.transient_mm:.3g} mm{reading_text(need.transient_reading, inputs.reading)}")


def _table_f8_text(site, inputs, need) -> str:
    peak = f"{need.steady_peak:g} V peak"
    if site.doubled:
        peak += " (160 % of the peak working voltage, for reinforced insulation; from memory)"
    governs = "this governs" if need.steady_governs else "the transient clearance governs"
    return (f"Table F.8, case A, for the steady-state and recurring peak voltage, {peak}: {need.steady_mm:.3g} mm"
            f"{reading_text(need.steady_reading, inputs.reading)}; {governs}")


def _altitude_text(inputs, need) -> str:
    altitude = fmt(inputs.altitude.to("m"))
    if need.factor == 1:
        return f"Altitude {altitude}: no correction up to 2000 m (Table A.2)"
    how = reading_text(need.altitude_reading, inputs.reading)
    return f"Altitude {altitude}: factor {need.factor:.3g} (Table A.2){how}, so {need.required_mm:.3g} mm"


def _edition2_text(need) -> str:
    if need.edition2_mm is None:
        return "Edition 2 (2007) took the next step of the impulse series instead; that step lies beyond the table here"
    edition3 = need.transient_required_mm
    if math.isclose(need.edition2_mm, edition3):
        return (f"Edition 2 (2007) took the next step of the impulse series instead, which gives the same "
                f"{need.edition2_mm:.3g} mm here")
    return (f"Edition 2 (2007) took the next step of the impulse series instead, which gives {need.edition2_mm:.3g} mm "
            f"here where edition 3 gives {edition3:.3g} mm for transients")


GRADE_NOTES = {
    "functional": "Functional insulation is no safety barrier: the basic-insulation values are shown as guidance, without a verdict",
    "supplementary": "Supplementary insulation is dimensioned as basic insulation",
    "double": ("Double insulation is judged here as one reinforced gap; each of its basic and supplementary layers "
               "must also meet the basic values on its own, which one declared pair cannot show"),
}


def grade_note(site) -> str:
    return GRADE_NOTES.get(site.grade, "")


# --- creepage -----------------------------------------------------------------------------------

CREEPAGE_METHOD = ("required = max(Table F.5 value x 2 for reinforced and double insulation, required clearance); "
                   "between rows the next row up unless interpolation is allowed")
NO_CLEARANCE_FLOOR = ("the required clearance could not be worked out, and creepage is never less than the clearance, "
                      "so no creepage requirement can be given")
UNSUITABLE_TITLE = "Creepage: insulating material unsuitable"


def creepage_title(grade: str, bridged: bool) -> str:
    return f"Creepage for {grade} insulation" + (": not credited, a slot counts as bridged" if bridged else "")


def creepage_text(site, inputs, need) -> str:
    parts = [_table_f5_text(inputs, need)]
    if site.doubled:
        parts.append(f"{site.grade} insulation needs twice that, {need.graded_mm:.3g} mm")
    if need.raised_to_clearance:
        parts.append(f"raised to the required clearance, {need.clearance_mm:.3g} mm: creepage is never less than the clearance")
    parts.append(_board_note(site, inputs, need))
    parts.append(_off_board_note(need))
    parts.append(grade_note(site))
    return sentences(parts)


def _table_f5_text(inputs, need) -> str:
    volts = inputs.creepage_voltage.to("V").magnitude
    return (f"Table F.5 at {volts:g} V, {column_text(need.column)}, material group {need.group}: {need.basic_mm:.3g} mm "
            f"for basic insulation{reading_text(need.reading, inputs.reading)}")


def column_text(column: str) -> str:
    if column.startswith("board-"):
        return f"printed-board column for pollution degree {column[-1]}"
    pd, _, family = column.partition("-")
    return f"pollution degree {pd[-1]} column" + (f" for material group {family}" if family else "")


def _board_note(site, inputs, need) -> str:
    pd = inputs.pollution_degree
    if not site.barrier.printed_board or need.column.startswith("board-"):
        return ""
    if pd in std.BOARD_COLUMNS:
        return f"the printed-board column does not apply to material group {need.group} at pollution degree {pd}"
    return f"Table F.5 has no printed-board column at pollution degree {pd}"


def _off_board_note(need) -> str:
    if need.off_board_required_mm is None:
        return ""
    return (f"without the printed-board column it would be {need.off_board_required_mm:.3g} mm: product standards "
            f"such as IEC 62368-1 (Table 17) give no printed-board column (from memory), so check which standard the unit "
            f"must meet")


def unsuitable_text(reason: str) -> str:
    return f"{reason}. Use a material of CTI 100 or more and declare its group or CTI."


# --- slots --------------------------------------------------------------------------------------

SLOT_METHOD = ("minimum width by pollution degree (1: 0.25 mm, 2: 1.0 mm, 3: 1.5 mm); "
               "one third of the declared clearance where that is below 3 mm, if smaller")


def bridged_text(site, bridged: list[int]) -> str:
    if not bridged:
        return ""
    named = ", ".join(f"{fmt(site.barrier.slots[j].width)}" for j in bridged)
    return (f" A slot the declared creepage counts on ({named}) is too narrow and counts as bridged (clause 6.8), so the "
            f"declared {fmt(site.barrier.creepage)} cannot be credited. Measure the creepage straight across the slot and "
            f"declare that value with 'credited: false' on the slot, or widen the slot.")


def slot_title(slot, minimum) -> str:
    if slot.width < minimum:
        return "Slot too narrow: counts as bridged"
    return "Slot wide enough to interrupt the creepage path"


def slot_text(site, inputs, slot, minimum) -> str:
    clearance = site.barrier.clearance.to("mm")
    reduced = "; as the declared clearance is below 3 mm, one third of it is enough" if clearance.magnitude < std.GROOVE_REDUCTION_BELOW_MM else ""
    base = fmt(Q_(std.GROOVE_MINIMUM_MM[inputs.pollution_degree], "mm"))
    text = f"Clause 6.8: at pollution degree {inputs.pollution_degree} a groove interrupts a creepage path only if it is at least {base} wide{reduced}."
    if slot.width < minimum:
        text += " A narrower one is measured straight across, as if bridged by dirt and moisture."
    if not slot.credited:
        text += " The declared creepage does not count on this slot ('credited: false'), so its width is for information."
    return text + ("" if not site.guidance_only else " " + grade_note(site) + ".")


# --- not assessed -------------------------------------------------------------------------------


def not_assessed_title(what: str, site) -> str:
    return f"{what} not assessed" + ("" if site.guidance_only else ": blocks power-up")


def not_assessed_text(reason: str, site) -> str:
    why = f"Not assessed: {reason}; check this barrier against IEC 60664-1 directly."
    return why if site.guidance_only else f"{why} {BLOCKS}."


def table_not_held_text(reason: str, site, standard_name: str, basic_figure) -> str:
    guidance = (f" IEC 60664-1 alone would ask {fmt(basic_figure)}, shown for guidance only: the product standard can ask more."
                if basic_figure is not None else "")
    fix = (f" Check this barrier against {standard_name} itself and record the result, or name a standard dossier holds the "
           f"tables of in {STANDARD_KEY}.")
    text = f"Not assessed: {reason}.{guidance}{fix}"
    return text if site.guidance_only else f"{text} {BLOCKS}."


def no_voltage_text(site, has_mains: bool) -> str:
    sides = " and ".join(site.barrier.between)
    if site.touches_mains and not has_mains:
        cause = "the record has no mains section and the barrier declares no working voltage"
        fix = "Add a mains section (nominal, frequency, overvoltage_category) or give working_voltage on this barrier"
    else:
        cause = (f"the barrier is between {sides}, not between mains and something, so the mains nominal is no "
                 f"default for its working voltage, and it declares none")
        fix = ("Declare what it sees: working_dc for a DC rail (e.g. a high-voltage DC rail to chassis), "
               "working_voltage for an AC r.m.s. voltage, working_peak for a recurring peak")
    text = f"Not assessed: {cause}. {fix}."
    return text if site.guidance_only else f"{text} {BLOCKS}."


# --- shared -------------------------------------------------------------------------------------


def sentences(parts) -> str:
    return ". ".join(_capitalised(part) for part in parts if part) + "."


def _capitalised(text: str) -> str:
    return text[:1].upper() + text[1:]


# --- product standard ---------------------------------------------------------------------------

STANDARD_KEY = "standard (in the record, e.g. {name: iec-62368-1, edition: 3}) or archive.yaml standard"
ORIGIN_WORDS = {
    "record": "named in the record (standard)",
    "archive": "the archive's default (archive.yaml standard); the record names none",
    "default": "no product standard is named in the record or in archive.yaml, so IEC 60664-1, the basic standard, applies",
}
STANDARD_TITLE = "Product standard"
HIPOT_CAUTION = ("An electric-strength (hi-pot) test is for trained people with a proper tester, its current trip set and "
                 "its leads checked, the unit unplugged and the area kept clear; follow local codes and licensed practice")


def standard_text(chosen, from_memory: list[str], confirmed: list[str], missing: list[str] = ()) -> str:
    parts = [f"{chosen.name}: {ORIGIN_WORDS[chosen.origin]}"]
    if chosen.standard is not None and not missing:
        parts.append("clearance, creepage and the electric-strength test voltage of each barrier come from its tables, "
                     "and where they differ from IEC 60664-1 the product standard's figure is taken")
    elif chosen.standard is not None:
        parts.append("the electric-strength test voltage and the earth limit come from it; what it holds no table for is "
                     "not assessed, with IEC 60664-1's figure shown as guidance only")
    if confirmed:
        parts.append("confirmed in public material: " + "; ".join(confirmed))
    if from_memory:
        parts.append("from memory, not confirmed: " + "; ".join(from_memory))
    if missing:
        parts.append("not held: " + "; ".join(missing))
    parts.append(f"Name the standard in {STANDARD_KEY}")
    return sentences(parts)


def provenance(requirement) -> str:
    return "confirmed in public material" if requirement.confirmed else "from memory"


PRODUCT_CLEARANCE_METHOD = ("required = max(the product standard's clearance table entered with the rated impulse voltage "
                            "(IEC 60664-1 Table F.1), IEC 60664-1 Table F.8 for the peak working voltage) x the altitude factor "
                            "(IEC 60664-1 Table A.2); between rows the next row up")
PRODUCT_CREEPAGE_METHOD = ("required = max(the product standard's creepage table for the grade of insulation, the required "
                           "clearance); between rows the next row up")


def product_clearance_text(site, inputs, standard, need, clearance) -> str:
    table = clearance.table
    parts = [f"Rated impulse voltage {need.basic_impulse:g} V (IEC 60664-1 Table F.1, {inputs.supply_note})",
             f"{standard.title} {table.table}: {table.value:.3g} mm ({provenance(table)})", *table.notes]
    steady = f"IEC 60664-1 Table F.8 for the peak working voltage, {need.steady_peak:g} V: {need.steady_mm:.3g} mm"
    parts.append(steady + ("; this governs, as the product standard's table is held for transients only" if clearance.steady_governs
                           else "; the product standard's figure governs"))
    if clearance.factor != 1:
        parts.append(f"altitude factor {clearance.factor:.3g} (IEC 60664-1 Table A.2), so {clearance.required_mm:.3g} mm")
    parts.append(_basic_comparison(clearance.basic_standard_mm, clearance.required_mm))
    parts.append(grade_note(site))
    return sentences(parts)


def product_creepage_text(site, inputs, standard, creepage) -> str:
    table = creepage.table
    volts = inputs.creepage_voltage.to("V").magnitude
    parts = [f"{standard.title} {table.table}, entered at {volts:g} V: {table.value:.3g} mm ({provenance(table)})", *table.notes]
    if creepage.raised_to_clearance:
        parts.append(f"raised to the required clearance, {creepage.clearance_mm:.3g} mm: creepage is never less than the "
                     f"clearance (the IEC 60664-1 rule, kept as the harsher reading)")
    if creepage.basic_standard_mm is not None:
        parts.append(_basic_comparison(creepage.basic_standard_mm, creepage.required_mm))
    parts.append(grade_note(site))
    return sentences(parts)


def _basic_comparison(basic_mm: float, product_mm: float) -> str:
    if math.isclose(basic_mm, product_mm):
        return f"IEC 60664-1 alone asks the same, {basic_mm:.3g} mm"
    return f"IEC 60664-1 alone would ask {basic_mm:.3g} mm; the product standard's {product_mm:.3g} mm is taken"


def hipot_title(grade: str) -> str:
    return f"Electric-strength test for {grade} insulation"


def hipot_text(site, standard_name: str, test, table_provenance: str) -> str:
    sides = " and ".join(site.barrier.between)
    parts = [f"{standard_name}, {test.table} ({table_provenance}): {test.volts:g} V {test.waveform} for {test.seconds:g} s "
             f"between {sides}",
             "pass: no breakdown (no flashover and no current rising without limit); a tester whose trip operates has "
             "found a breakdown", *test.notes,
             "for an a.c. tester, a figure given as peak or d.c. is the peak: the r.m.s. setting is that over sqrt 2",
             HIPOT_CAUTION]
    return sentences(parts)


BASIC_HIPOT_TABLE = "clause 5.3.3.2.3, temporary overvoltage U_n + 1 200 V for basic insulation, twice for reinforced"


EARTH_TITLE = "Protective-earth continuity limit"


def earth_text(standard_name: str, rule) -> str:
    proven = "confirmed in public material" if rule.confirmed else "from memory"
    return sentences([f"{standard_name}, {rule.clause}: at most {rule.limit_ohm:g} ohm ({proven})",
                      f"test with {rule.test}", "the checklist's earth-continuity item is where it is measured"])


BOARD_TITLE = "Board spacing (functional, not a safety figure)"
BOARD_METHOD = "minimum spacing = IPC-2221B Table 6-1 for the voltage between the conductors and the board condition"


def board_text(spacing, column: str, row: str) -> str:
    sides = " and ".join(spacing.between)
    return sentences([
        f"IPC-2221B Table 6-1, column {CONDITION_WORDS[column]}, {row}, for {fmt(spacing.voltage)} between {sides}",
        "functional spacing against arcing and breakdown over the board: it is no safety figure and never replaces the "
        "clearance and creepage of a safety barrier, which are checked on the barriers",
        "" if spacing.condition != "external-uncoated" else
        "board condition external-uncoated (the default, the widest of the three; declare condition to make it exact)",
    ])


def board_not_assessed(spacing, problem) -> str:
    return sentences([f"Not assessed: {problem}", "functional spacing only; it blocks nothing"])
