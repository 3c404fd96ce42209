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
)
IEC_60028 = Source(
    title="IEC 60028, International standard of resistance for copper",
    publisher="International Electrotechnical Commission",
)
ASTM_B258 = Source(
    title="ASTM B258, Standard Specification for Standard Nominal Diameters and Cross-Sectional Areas of AWG Sizes of Solid Round Wires Used as Electrical Conductors",
    publisher="ASTM International",
)
IEC_60317 = Source(
    title="IEC 60317 series, Specifications for particular types of winding wires",
    publisher="International Electrotechnical Commission",
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
)
IET_INSERVICE_COP = Source(
    title="Code of Practice for In-service Inspection and Testing of Electrical Equipment",
    publisher="The Institution of Engineering and Technology (IET)",
    kind="handbook",
)
DIN_EN_50678 = Source(
    title="DIN EN 50678 (VDE 0701), General procedure for verifying the effectiveness of the protective measures of electrical equipment after repair; earlier DIN VDE 0701-0702:2008",
    publisher="DKE / VDE",
    edition="2021",
)
