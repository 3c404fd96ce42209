"""Published sources the built-in calcs cite, named once so every page cites them the same way."""

from dossier.findings import Source

IEC_60664_1 = Source(
    title="IEC 60664-1, Insulation coordination for equipment within low-voltage supply systems - Part 1: Principles, requirements and tests",
    publisher="International Electrotechnical Commission",
    edition="edition 3.0, 2020",
)
IEC_60127_1 = Source(
    title="IEC 60127-1, Miniature fuses - Part 1: Definitions for miniature fuses and general requirements for miniature fuse-links",
    publisher="International Electrotechnical Commission",
)
IEC_60205 = Source(
    title="IEC 60205, Calculation of the effective parameters of magnetic piece parts",
    publisher="International Electrotechnical Commission",
    edition="edition 4.0, 2016",
    clause="clause 5.1, ring cores: C1 = sum l/A, C2 = sum l/A^2, l_e = C1^2/C2, A_e = C1/C2, V_e = C1^3/C2^2 (sub-clause from memory)",
)
IEC_60028 = Source(
    title="IEC 60028, International standard of resistance for copper",
    publisher="International Electrotechnical Commission",
    edition="edition 2, 1925",
    clause="annealed copper at 20 degC: resistivity 1/58 ohm mm^2/m, temperature coefficient 0.00393 /K",
)
ASTM_B258 = Source(
    title="ASTM B258, Standard Specification for Standard Nominal Diameters and Cross-Sectional Areas of AWG Sizes of Solid Round Wires Used as Electrical Conductors",
    publisher="ASTM International",
    edition="ASTM B258-18",
    clause="Table 1, nominal diameters of AWG sizes: d = 0.005 in x 92^((36 - n) / 39) (formula from memory; AWG 18 and 26 confirmed)",
)
IEC_60317 = Source(
    title="IEC 60317 series, Specifications for particular types of winding wires",
    publisher="International Electrotechnical Commission",
    edition="IEC 60317-0-1, edition 4.0, 2013 (edition from memory)",
    clause="table of dimensions of enamelled round copper wire: maximum overall diameter by grade 1, 2 and 3 (values from memory)",
)
IEC_60384_14 = Source(
    title="IEC 60384-14, Fixed capacitors for use in electronic equipment - Part 14: Sectional specification - Fixed capacitors for electromagnetic interference suppression and connection to the supply mains",
    publisher="International Electrotechnical Commission",
)
FUSEOLOGY = Source(
    title="Fuseology Selection Guide",
    publisher="Littelfuse",
    kind="application-note",
)
BU_403 = Source(
    title="BU-403: Charging Lead Acid",
    publisher="Battery University (Cadex Electronics)",
    kind="reference",
    clause="page 'BU-403: Charging Lead Acid' as published on batteryuniversity.com (page date not confirmed): absorption, float, compensation and charge-current figures",
)
IET_INSERVICE_COP = Source(
    title="Code of Practice for In-service Inspection and Testing of Electrical Equipment",
    publisher="The Institution of Engineering and Technology (IET)",
    kind="handbook",
)
DIN_EN_50678 = Source(
    title="DIN EN 50678 (VDE 0701), General procedure for verifying the effectiveness of the protective measures of electrical equipment after repair",
    publisher="DKE / VDE",
    edition="2021; earlier DIN VDE 0701-0702:2008",
)
ARRL_HANDBOOK = Source(
    title="The ARRL Handbook for Radio Communications",
    publisher="American Radio Relay League",
    clause="power supplies chapter: rectifier peak inverse voltage",
    kind="handbook",
)
MOHAN_POWER_ELECTRONICS = Source(
    title="Power Electronics: Converters, Applications, and Design (N. Mohan, T. M. Undeland, W. P. Robbins)",
    publisher="John Wiley & Sons",
    edition="3rd edition, 2003",
    kind="handbook",
)
IEC_62368_1 = Source(
    title="IEC 62368-1, Audio/video, information and communication technology equipment - Part 1: Safety requirements",
    publisher="International Electrotechnical Commission",
)
IEC_61140 = Source(
    title="IEC 61140, Protection against electric shock - Common aspects for installation and equipment",
    publisher="International Electrotechnical Commission",
)
LINDEN_BATTERIES = Source(
    title="Linden's Handbook of Batteries (T. B. Reddy, ed.)",
    publisher="McGraw-Hill",
    edition="4th edition, 2011",
    clause="lead-acid and valve-regulated lead-acid chapters: charging (figures recalled from memory)",
    kind="handbook",
)
TROJAN_USERS_GUIDE = Source(
    title="Trojan Battery User's Guide: charging flooded deep-cycle batteries",
    publisher="Trojan Battery Company",
    clause="charger voltage settings (figures recalled from memory)",
    kind="application-note",
)
YUASA_NP_MANUAL = Source(
    title="NP Valve Regulated Lead Acid Battery Manual",
    publisher="Yuasa Battery (Europe)",
    clause="charging: cyclic and float use (figures recalled from memory)",
    kind="application-note",
)
GEL_VRLA_HANDBOOK = Source(
    title="Handbook for Gel-VRLA-Batteries, Part 2: Installation, Commissioning and Operation",
    publisher="GNB Industrial Power (Exide Technologies)",
    clause="charging (figures recalled from memory)",
    kind="application-note",
)
IEC_60050_131 = Source(
    title="IEC 60050-131, International Electrotechnical Vocabulary - Part 131: Circuit theory",
    publisher="International Electrotechnical Commission",
    clause="power factor: active power divided by apparent power",
)
EDN_FUSE_CHECKLIST = Source(
    title="The fuse-selection checklist: a quick update (EDN, 26 September 1996)",
    publisher="EDN",
    clause="running at 75 % of rating and re-rating for ambient",
    kind="reference",
)
MCLYMAN = Source(
    title="Transformer and Inductor Design Handbook (Colonel Wm. T. McLyman)",
    publisher="CRC Press",
    kind="handbook",
)
IEC_60404_2 = Source(
    title="IEC 60404-2, Magnetic materials - Part 2: Methods of measurement of the magnetic properties of electrical steel strip and sheet by means of an Epstein frame",
    publisher="International Electrotechnical Commission",
    edition="edition 3.1, 2008",
)
IEC_60404_8_4 = Source(
    title="IEC 60404-8-4, Magnetic materials - Part 8-4: Specifications for individual materials - Cold-rolled non-oriented electrical steel strip and sheet delivered in the fully-processed state",
    publisher="International Electrotechnical Commission",
    edition="edition 3.0, 2013",
)
IEC_60740_1 = Source(
    title="IEC 60740-1, Laminations for transformers and inductors - Part 1: Mechanical and electrical characteristics",
    publisher="International Electrotechnical Commission",
    edition="edition 2.0, 2005 (edition from memory)",
)
IEC_61010_1 = Source(
    title=("IEC 61010-1, Safety requirements for electrical equipment for measurement, control, and laboratory use - "
           "Part 1: General requirements"),
    publisher="International Electrotechnical Commission",
    edition="edition 3.0, 2010, with amendment 1 (2016)",
)
IEC_61558_1 = Source(
    title="IEC 61558-1, Safety of transformers, reactors, power supply units and combinations thereof - Part 1: General requirements and tests",
    publisher="International Electrotechnical Commission",
    edition="edition 3.0, 2017",
)
IEC_60335_1 = Source(
    title="IEC 60335-1, Household and similar electrical appliances - Safety - Part 1: General requirements",
    publisher="International Electrotechnical Commission",
    edition="edition 5.0, 2010, with amendments 1 (2013) and 2 (2016)",
)
ABYC_E11 = Source(
    title="ABYC E-11, AC and DC Electrical Systems on Boats",
    publisher="American Boat and Yacht Council",
    edition="edition not confirmed (from memory)",
    clause="overcurrent protection within 7 in (178 mm) of the battery connection (from memory)",
)
EN_50106 = Source(
    title="EN 50106, Safety of household and similar electrical appliances - Particular rules for routine tests referring to appliances under the scope of EN 60335-1",
    publisher="CENELEC",
    edition="2008",
    clause="Annex A.1, earth continuity test: at least 10 A from a source of no more than 12 V; at most 0.1 ohm plus the supply cord's resistance, or 0.2 ohm with the cord",
)
IGSE = Source(
    title=("Accurate prediction of ferrite core loss with nonsinusoidal waveforms using only Steinmetz parameters "
           "(K. Venkatachalam, C. R. Sullivan, T. Abdallah, H. Tacca)"),
    publisher="IEEE Workshop on Computers in Power Electronics (COMPEL)",
    edition="2002",
    clause="improved generalised Steinmetz equation (iGSE): P_v = (1/T) integral k_i |dB/dt|^alpha (delta-B)^(beta - alpha) dt",
    kind="reference",
)
IEC_60085 = Source(
    title="IEC 60085, Electrical insulation - Thermal evaluation and designation",
    publisher="International Electrotechnical Commission",
    edition="edition 4.0, 2007",
    clause="Table 1, thermal classes: 105 (A), 120 (E), 130 (B), 155 (F), 180 (H), 200 (N), 220 (R) degC",
)
BU_410 = Source(
    title="BU-410: Charging at High and Low Temperatures",
    publisher="Battery University (Cadex Electronics)",
    clause="Table 1, permissible charge temperatures: lead-acid -20 to 50 degC (from memory; page date not confirmed)",
    kind="reference",
)
IEC_61558_1 = Source(
    title="IEC 61558-1, Safety of transformers, reactors, power supply units and combinations thereof - Part 1: General requirements and tests",
    publisher="International Electrotechnical Commission",
    edition="edition 3.0, 2017 (edition from memory)",
)
DOWELL = Source(
    title="Effects of eddy currents in transformer windings (P. L. Dowell)",
    publisher="Proceedings of the Institution of Electrical Engineers",
    edition="vol. 113, no. 8, 1966, pp. 1387-1394 (page numbers from memory)",
    clause="AC resistance factor of a winding of m layers: F_R = Delta [(sinh 2Delta + sin 2Delta)/(cosh 2Delta - cos 2Delta) + 2 (m^2 - 1)/3 (sinh Delta - sin Delta)/(cosh Delta + cos Delta)]",
    kind="reference",
)
IPC_2221 = Source(
    title="IPC-2221B, Generic Standard on Printed Board Design",
    publisher="IPC (Association Connecting Electronics Industries)",
    edition="revision B, 2012",
    clause="Table 6-1, electrical conductor spacing",
)
IEC_62368_1_ES1 = Source(
    title=IEC_62368_1.title,
    publisher=IEC_62368_1.publisher,
    edition="edition 3.0, 2018",
    clause=("5.2.2.2 and Table 4, electrical energy source ES1 limits for steady-state voltage: 60 V DC, 30 V RMS and "
            "42.4 V peak AC (figures from memory); above them a source is ES2 or ES3 and needs safeguards"),
)
IEC_61140_ELV = Source(
    title=IEC_61140.title,
    publisher=IEC_61140.publisher,
    edition="edition 4.0, 2016",
    clause="extra-low voltage: up to 50 V AC or 120 V ripple-free DC (the voltage bands of IEC 60449; figures from memory)",
)
IEC_60204_1_RESIDUAL = Source(
    title="IEC 60204-1, Safety of machinery - Electrical equipment of machines - Part 1: General requirements",
    publisher="International Electrotechnical Commission",
    edition="edition 6.0, 2016",
    clause=("6.2.4, protection against residual voltages: live parts above 60 V after the supply is removed are "
            "discharged to 60 V or less within 5 s; parts storing 60 uC or less are exempt (checked against a public "
            "summary of the clause)"),
)
IEC_60335_1_PLUG_DISCHARGE = Source(
    title=IEC_60335_1.title,
    publisher=IEC_60335_1.publisher,
    edition=IEC_60335_1.edition,
    clause=("22.5, charged capacitors at the plug pins: one second after disconnection at the peak of the supply the "
            "voltage between the pins does not exceed 34 V; capacitors of 0.1 uF or less need no test (checked against "
            "public test-report discussion of the clause)"),
)
IEC_60335_1_RESISTANCE_METHOD = Source(
    title=IEC_60335_1.title,
    publisher=IEC_60335_1.publisher,
    edition=IEC_60335_1.edition,
    clause=("11.3, temperature rise of windings by the resistance method: dT = (R2 - R1) / R1 x (k + t1) - (t2 - t1), "
            "k = 234.5 for copper (from memory); IEC 60076-2 (edition 3.0, 2011) uses the same relation with 235"),
)
IEC_60076_2 = Source(
    title="IEC 60076-2, Power transformers - Part 2: Temperature rise for liquid-immersed transformers",
    publisher="International Electrotechnical Commission",
    edition="edition 3.0, 2011",
    clause="winding temperature from the change of its resistance, copper constant 235 (from memory)",
)
ARRL_FILTERS = Source(
    title=ARRL_HANDBOOK.title,
    publisher=ARRL_HANDBOOK.publisher,
    clause=("power supplies chapter: rectifier circuits (output voltage, peak inverse voltage, ripple frequency), "
            "capacitor-input and choke-input filters (ripple V_r = I / (f_r C); choke-input output about 0.9 V_RMS "
            "above the critical inductance); bleeder resistors"),
    kind="handbook",
)
SCHADE_RECTIFIER = Source(
    title='O. H. Schade, "Analysis of rectifier operation"',
    publisher="Proceedings of the IRE, vol. 31, no. 7",
    edition="1943",
    clause=("capacitor-input rectifier with source resistance R_s feeding a large reservoir: half conduction angle from "
            "tan theta - theta = pi R_s / (n R_L), output V_pk cos theta (the limit of the published curves for large "
            "omega C R_L; relation and figures from memory, checked here against a numerical simulation)"),
    kind="reference",
)
TRANSFORMER_REGULATION = Source(
    title=ARRL_HANDBOOK.title,
    publisher=ARRL_HANDBOOK.publisher,
    clause=("power supplies chapter: transformer regulation from the winding resistances, the primary's referred to the "
            "secondary by the square of the turns ratio, R = R_p (N_s / N_p)^2 + R_s; a capacitor-input rectifier "
            "regulates worse than a resistive load (from memory)"),
    kind="handbook",
)
VALVE_RECTIFIER_RATINGS = Source(
    title="RCA Receiving Tube Manual",
    publisher="Radio Corporation of America",
    clause=("rectifier ratings: peak inverse plate voltage, peak plate current and the largest capacitor-input filter "
            "capacitance a rectifier valve takes, each a maximum not to be exceeded (section and wording from memory)"),
    kind="handbook",
)
ESP_PROJECT_39 = Source(
    title="Project 39, Soft-Start Circuit for Power Amps", publisher="Elliott Sound Products (Rod Elliott)", kind="application-note",
)
IEC_60364_4_41 = Source(
    title="IEC 60364-4-41, Low-voltage electrical installations - Part 4-41: Protection for safety - Protection against electric shock",
    publisher="International Electrotechnical Commission", edition="edition 5.0, 2005 (edition from memory)",
)
IEC_61008_1 = Source(
    title="IEC 61008-1, Residual current operated circuit-breakers without integral overcurrent protection (RCCBs)",
    publisher="International Electrotechnical Commission",
)
HSE_TEST_BENCHES = Source(
    title="Electrical safety for test benches: supplies to equipment under test (HSE guidance on safety in electrical testing at work)",
    publisher="Health and Safety Executive (UK)", kind="handbook",
)
LAMPTECH_STARTING = Source(
    title="Incandescent lamps: starting characteristics", publisher="Lamptech (lamptech.co.uk), reference pages", kind="reference",
)
