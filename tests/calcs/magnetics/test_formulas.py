"""The magnetics formulas, each against its published form or a published value."""

from __future__ import annotations

import math

import pytest

from dossier.calcs.magnetics import formulas as m
from dossier.calcs.shared.core_geometry import al_from_permeability, effective_from_constants, section_perimeter, toroid_constants
from dossier.units import Q_


def toroid(outer, inner, height):
    return effective_from_constants(*toroid_constants(Q_(outer, "mm"), Q_(inner, "mm"), Q_(height, "mm")))


def test_toroid_by_iec_60205_closed_form():
    # IEC 60205, toroid of rectangular section: l_e = 2 pi ln(r2/r1) / (1/r1 - 1/r2), A_e = h ln^2(r2/r1) / (1/r1 - 1/r2).
    path, area, volume = toroid(38, 21, 12)
    r1, r2, log = 10.5, 19.0, math.log(19 / 10.5)
    assert path.magnitude == pytest.approx(2 * math.pi * log / (1 / r1 - 1 / r2))
    assert area.magnitude == pytest.approx(12 * log**2 / (1 / r1 - 1 / r2))
    assert volume.magnitude == pytest.approx(path.magnitude * area.magnitude)


def test_toroid_10_6_4_matches_a_makers_datasheet():
    # TDK (EPCOS) ferrite toroid R 10.0 x 6.00 x 4.00 data sheet: sum l/A 3.07 mm^-1, l_e 24.07 mm, A_e 7.83 mm^2,
    # V_e 188 mm^3 -- values computed by IEC 60205 (from memory).
    path, area, volume = toroid(10, 6, 4)
    assert path.magnitude == pytest.approx(24.07, abs=0.01)
    assert area.magnitude == pytest.approx(7.83, abs=0.01)
    assert volume.magnitude == pytest.approx(188, abs=0.5)
    assert (path / area).magnitude == pytest.approx(3.07, abs=0.01)


def test_thin_toroid_tends_to_the_mean_circle():
    # IEC 60205 reduces to l_e = pi D_mean and A_e = h (r2 - r1) as the ring gets thin (geometry).
    path, area, _ = toroid(100.2, 99.8, 5)
    assert path.magnitude == pytest.approx(math.pi * 100, rel=1e-5)
    assert area.magnitude == pytest.approx(5 * 0.2, rel=1e-5)


def test_naive_mean_diameter_overstates_a_thick_toroid():
    # IEC 60205 l_e is shorter than pi x mean diameter for a thick ring (2-8 % for usual toroids).
    path, _, _ = toroid(38, 21, 12)
    naive = math.pi * (38 + 21) / 2
    assert 0.01 < 1 - path.magnitude / naive < 0.08


def test_section_perimeter():
    # one turn round a 15 mm high, (36 - 23) / 2 = 6.5 mm wide section: 2 x (15 + 6.5) = 43 mm (geometry)
    assert section_perimeter(Q_(36, "mm"), Q_(23, "mm"), Q_(15, "mm")).magnitude == pytest.approx(43)


def test_flux_square_wave():
    # Faraday's law, square wave: B_pk = V / (4 f N A_e) (McLyman, Transformer and Inductor Design Handbook,
    # CRC Press, waveform factor K_f = 4.0; from memory). 100 V, 50 kHz, 20 turns, 100 mm^2: 100/(4*5e4*20*1e-4) = 0.25 T.
    assert m.flux_square(Q_(100, "V"), Q_(50, "kHz"), 20, Q_(100, "mm**2")).magnitude == pytest.approx(0.25)


def test_flux_square_wave_with_dead_time():
    # B = V D / (4 f N A_e) = 100 x 0.5 / (4 x 5e4 x 20 x 1e-4) = 0.125 T (Faraday's law: half the volt-seconds)
    half = m.flux_square(Q_(100, "V"), Q_(50, "kHz"), 20, Q_(100, "mm**2"), duty=0.5)
    assert half.magnitude == pytest.approx(0.125)


def test_flux_sine_wave():
    # Faraday's law, sine: B_pk = V_rms / (4.44 f N A_e), 4.44 = pi sqrt 2 (McLyman, K_f = 4.44; from memory).
    # 230 V, 50 Hz, 1000 turns, 10 cm^2: 230 / (4.44 * 50 * 1000 * 1e-3) = 1.036 T.
    flux = m.flux_sine(Q_(230, "V"), Q_(50, "Hz"), 1000, Q_(10, "cm**2"))
    assert flux.magnitude == pytest.approx(230 / (4.44 * 50 * 1000 * 1e-3), rel=1e-3)
    assert m.SINE_FORM == pytest.approx(4.44, abs=0.005)


def test_steinmetz_density():
    # Steinmetz: P_v = k f^alpha B^beta. k = 1, alpha = 1.5, beta = 2.5 at 10 kHz and 0.1 T: 1e6 * 10^-2.5 = 3162 W/m^3.
    found = m.steinmetz_density(1.0, 1.5, 2.5, Q_(10, "kHz"), Q_(100, "mT"))
    assert found.to("W/m**3").magnitude == pytest.approx(10_000**1.5 * 0.1**2.5)
    doubled = m.steinmetz_density(1.0, 1.5, 2.5, Q_(10, "kHz"), Q_(200, "mT"))
    assert (doubled / found).to("").magnitude == pytest.approx(2**2.5)


def test_temperature_rise_relation():
    # McLyman, Transformer and Inductor Design Handbook (CRC Press): T_r = 450 psi^0.826, psi in W/cm^2 (from memory).
    # 1 W over 100 cm^2 is 0.01 W/cm^2: 450 * 0.01^0.826 = 10.0 K.
    assert m.temperature_rise(Q_(1, "W"), Q_(100, "cm**2")).magnitude == pytest.approx(450 * 0.01**0.826)
    assert m.temperature_rise(Q_(1, "W"), Q_(100, "cm**2")).magnitude == pytest.approx(10.0, abs=0.1)


def test_inductance_from_al():
    # L = A_L N^2: 85 nH x 21^2 = 37.485 uH.
    assert m.inductance(Q_(85, "nH"), 21).to("uH").magnitude == pytest.approx(37.485)


def test_al_from_permeability():
    # A_L = mu_0 mu_i A_e / l_e: mu_i 2000, A_e 100 mm^2, l_e 100 mm -> 4 pi e-7 * 2000 * 1e-3 = 2513 nH.
    found = al_from_permeability(2000, Q_(100, "mm**2"), Q_(100, "mm"))
    assert found.to("nH").magnitude == pytest.approx(4 * math.pi * 1e-7 * 2000 * 1e-3 * 1e9)


def test_stored_energy_field_and_flux_of_a_choke():
    inductance = Q_(50, "uH")
    # E = L I^2 / 2 = 50 uH x 4^2 / 2 = 0.4 mJ; H = N I / l_e = 25 x 8 A / 80 mm = 2500 A/m
    assert m.stored_energy(inductance, Q_(4, "A")).to("mJ").magnitude == pytest.approx(0.4)
    assert m.field_strength(25, Q_(8, "A"), Q_(80, "mm")).to("A/m").magnitude == pytest.approx(2500)
    # N Phi = L I: 50 uH x 8 A / (25 x 90 mm^2) = 0.178 T.
    assert m.choke_flux(inductance, Q_(8, "A"), 25, Q_(90, "mm**2")).magnitude == pytest.approx(50e-6 * 8 / (25 * 90e-6))


def test_ripple_current_from_volt_seconds():
    # V = L di/dt: 15 V for 40 % of a 100 kHz period across 50 uH gives 15 x 4 us / 50 uH = 1.2 A peak to peak.
    assert m.ripple_current(Q_(15, "V"), Q_(100, "kHz"), 0.4, Q_(50, "uH")).magnitude == pytest.approx(1.2)


def test_current_density_and_copper_loss():
    # 3.1 A / 0.7854 mm^2 = 3.947 A/mm^2; 2^2 A^2 x 0.5 ohm = 2 W (arithmetic)
    assert m.current_density(Q_(3.1, "A"), Q_(0.7854, "mm**2")).magnitude == pytest.approx(3.947, abs=0.001)
    assert m.copper_loss(Q_(2, "A"), Q_(0.5, "ohm")).magnitude == pytest.approx(2.0)
