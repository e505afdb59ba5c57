"""A floor's response to walking: AISC DG11 criterion, resonant build-up, footfall impulse, targets.

The time-domain oracle (tests/helpers/moving_load.py) integrates the modes of a simply supported beam
under a harmonic force with scipy.integrate.solve_ivp; it is written independently of the code.
"""

from __future__ import annotations

import math

import numpy as np
import pytest
from helpers.moving_load import beam_acceleration
from hypothesis import given, settings
from hypothesis import strategies as st

from fieldmode.calc.physics import floor_impulse as fi
from fieldmode.calc.physics import floor_walking as fw
from fieldmode.calc.physics import footfall

G0 = 9.80665
LBF = 4.4482216152605


# --- AISC Design Guide 11 walking criterion ------------------------------------------------------------

def test_dg11_forces_are_the_guide_values_in_si() -> None:
    # Source: AISC Design Guide 11 (2nd ed.) ch. 4: P0 = 65 lb floors, 92 lb pedestrian bridges;
    # NIST SP 811: 1 lbf = 4.4482216152605 N
    assert fw.DG11_FORCE["floor"] == pytest.approx(65 * LBF, rel=0.005)
    assert fw.DG11_FORCE["footbridge"] == pytest.approx(92 * LBF, rel=0.005)


@pytest.mark.parametrize(("frequency", "damping", "weight", "structure", "ratio_of_g"), [
    (5.0, 0.03, 500e3, "floor", 0.0033596),      # 290 e^-1.75 / (0.03 x 500 kN), e^-1.75 = 0.173774
    (3.0, 0.02, 200e3, "floor", 0.0253705),      # 290 e^-1.05 / (0.02 x 200 kN), e^-1.05 = 0.349938
    (2.0, 0.01, 300e3, "footbridge", 0.0678667),  # 410 e^-0.7 / (0.01 x 300 kN), e^-0.7 = 0.496585
])
def test_dg11_formula_at_hand_worked_points(frequency: float, damping: float, weight: float, structure: str,
                                            ratio_of_g: float) -> None:
    # From memory: AISC Design Guide 11, a_p/g = P0 exp(-0.35 fn) / (beta W), worked by hand
    a = fw.dg11_acceleration(frequency, damping, weight, structure)
    assert a / G0 == pytest.approx(ratio_of_g, rel=2e-5)


def test_dg11_criterion_is_the_steady_resonance_of_its_own_load_model() -> None:
    # From memory: AISC Design Guide 11 derives P0 = R alpha Q with R = 0.5, Q = 0.7 kN and
    # alpha = 0.83 exp(-0.35 fn); R = 0.5 on a_p = R alpha Q / (beta M) is alpha Q / (2 beta M),
    # the resonant amplitude of the mode (Chopra ch. 3)
    for frequency in (3.0, 5.0, 8.0):
        weight, damping = 400e3, 0.03
        alpha = 0.83 * math.exp(-0.35 * frequency)
        steady = fw.steady_acceleration(alpha * 700.0, frequency, damping, weight / G0)
        assert fw.dg11_acceleration(frequency, damping, weight) == pytest.approx(steady, rel=0.002)


def test_dg11_limits_by_occupancy() -> None:
    # From memory: AISC Design Guide 11 tolerance limits, 0.5 % g offices and residences, 1.5 % g malls and
    # dining, 1.5 % g indoor and 5 % g outdoor footbridges
    assert fw.dg11_limit("office") == pytest.approx(0.005 * G0)
    assert fw.dg11_limit("residence") == pytest.approx(0.005 * G0)
    assert fw.dg11_limit("mall") == pytest.approx(0.015 * G0)
    assert fw.dg11_limit("dining") == pytest.approx(0.015 * G0)
    assert fw.dg11_limit("indoor footbridge") == pytest.approx(0.015 * G0)
    assert fw.dg11_limit("outdoor footbridge") == pytest.approx(0.05 * G0)
    with pytest.raises(ValueError, match="occupancy"):
        fw.dg11_limit("ballroom")


def test_dg11_response_inversely_proportional_to_damping_and_weight() -> None:
    # From memory: AISC Design Guide 11, a_p/g = P0 exp(-0.35 fn) / (beta W)
    base = fw.dg11_acceleration(4.0, 0.02, 300e3)
    assert fw.dg11_acceleration(4.0, 0.04, 300e3) == pytest.approx(base / 2, rel=1e-12)
    assert fw.dg11_acceleration(4.0, 0.02, 900e3) == pytest.approx(base / 3, rel=1e-12)


def test_dg11_inverses_round_trip() -> None:
    limit = fw.dg11_limit("office")
    damping = fw.dg11_damping_for_limit(5.0, 400e3, limit)
    assert damping is not None
    # Common practice (no source): the damping found gives exactly the limit
    assert fw.dg11_acceleration(5.0, damping, 400e3) == pytest.approx(limit, rel=1e-12)
    weight = fw.dg11_weight_for_limit(5.0, 0.03, limit)
    assert fw.dg11_acceleration(5.0, 0.03, weight) == pytest.approx(limit, rel=1e-12)
    frequency = fw.dg11_frequency_for_limit(0.03, 250e3, limit)
    assert frequency is not None and 0 < frequency <= 9.0
    assert fw.dg11_acceleration(frequency, 0.03, 250e3) == pytest.approx(limit, rel=1e-12)


def test_dg11_targets_out_of_reach() -> None:
    # From memory: AISC Design Guide 11 criterion, solved for beta, W and fn
    assert fw.dg11_damping_for_limit(2.0, 20e3, fw.dg11_limit("office")) is None  # would need > 20 %
    assert fw.dg11_frequency_for_limit(0.01, 20e3, fw.dg11_limit("office")) is None  # only above 9 Hz
    assert fw.dg11_frequency_for_limit(0.05, 5e6, fw.dg11_limit("mall")) == 0.0  # every frequency complies


def test_dg11_refuses_high_frequency_floors_naming_the_method_that_applies() -> None:
    # Source: AISC Design Guide 11 (2nd ed.) 4.1: the walking criterion applies to fn <= 9 Hz
    assert fw.dg11_acceleration(9.0, 0.03, 300e3) > 0
    with pytest.raises(ValueError, match=r"Design Guide 11.*9 Hz.*high-frequency.*impulse"):
        fw.dg11_acceleration(9.5, 0.03, 300e3)


@pytest.mark.parametrize("damping", [0.0, -0.01, 1.0, math.nan])
def test_dg11_refuses_damping_outside_zero_to_one_with_usual_values(damping: float) -> None:
    # Source: Allen & Murray 1993 typical floor damping, quoted in the message
    with pytest.raises(ValueError, match=r"damping ratio.*3 % fitted out.*5 % full-height partitions"):
        fw.dg11_acceleration(5.0, damping, 300e3)


def test_zero_damping_message_says_the_resonance_is_unbounded() -> None:
    # Source: Chopra ch. 3, the undamped resonant amplitude grows without bound
    with pytest.raises(ValueError, match="unbounded"):
        fw.resonant_response(2.0, 0.0, 10e3)
    with pytest.raises(ValueError, match="unbounded"):
        fw.steady_acceleration(100.0, 2.0, 0.0, 10e3)


def test_typical_floor_damping() -> None:
    # Source: Allen & Murray 1993 (basis of AISC Design Guide 11 1st ed.): 3 % offices, residences,
    # churches; 5 % full-height partitions; 2 % few non-structural components and malls; 1 % footbridges
    assert {name: zeta for name, (zeta, _) in fw.FLOOR_DAMPING.items()} == {
        "bare": 0.02, "fitted out": 0.03, "full-height partitions": 0.05, "mall": 0.02, "footbridge": 0.01}


# --- walking force and resonant response ------------------------------------------------------------------

def test_dynamic_load_factors() -> None:
    # From memory: SCI P354 Fourier coefficients at fp = 2 Hz: 0.436 (2 - 0.95), 0.006 (4 + 12.3),
    # 0.007 (6 + 5.2), 0.007 (8 + 2.0)
    assert [fw.dynamic_load_factor(h, 2.0) for h in (1, 2, 3, 4)] == pytest.approx([0.4578, 0.0978, 0.0784, 0.07])
    # From memory: Allen & Murray / AISC Design Guide 11 1st ed. dynamic coefficients 0.5, 0.2, 0.1, 0.05
    assert [fw.dynamic_load_factor(h, 2.0, fw.AISC_DG11) for h in (1, 2, 3, 4)] == [0.5, 0.2, 0.1, 0.05]
    with pytest.raises(ValueError, match="harmonic"):
        fw.dynamic_load_factor(5, 2.0)


@pytest.mark.parametrize(("frequency", "harmonic"), [(1.8, 1), (2.4, 1), (3.6, 2), (5.4, 3), (8.0, 4)])
def test_a_harmonic_inside_its_band_drives_the_floor_at_resonance(frequency: float, harmonic: int) -> None:
    # Common practice (no source): harmonic h of walking covers h times the pacing rate band; Source: Eurocode
    # footbridge teaching material (confirmed in one copy): pacing rate 1.7-2.4 Hz, so h3 is 5.1-7.2 Hz
    h, pacing = fw.driving_harmonic(frequency, 0.03)
    assert (h, h * pacing) == (harmonic, pytest.approx(frequency))
    assert footfall.WALKING[0] <= pacing <= footfall.WALKING[1]


def test_between_harmonic_bands_the_nearest_pacing_rate_is_used() -> None:
    # Source: Eurocode teaching material (confirmed in one copy), walking 1.7-2.4 Hz: no walking harmonic reaches
    # 2.8 Hz (first up to 2.4 Hz, second from 3.4 Hz); the first harmonic at the fastest pace is nearest
    h, pacing = fw.driving_harmonic(2.8, 0.03)
    assert (h, pacing) == (1, footfall.WALKING[1])


@pytest.mark.parametrize("ratio", [0.5, 0.9, 1.0, 1.1, 2.0])
def test_steady_acceleration_against_the_transfer_function(ratio: float) -> None:
    from scipy import signal

    mass, damping, omega = 15e3, 0.02, 2 * math.pi * 4.0
    system = signal.lti([1.0 / mass, 0.0, 0.0], [1.0, 2 * damping * omega, omega**2])
    _, response = signal.freqresp(system, w=[ratio * omega])
    # Oracle: scipy.signal.freqresp of a(s)/F(s) = s^2 / (M (s^2 + 2 zeta wn s + wn^2))
    assert fw.steady_acceleration(300.0, 4.0, damping, mass, ratio * 4.0) == pytest.approx(
        300.0 * abs(response[0]), rel=1e-10)


def test_steady_state_limit_equals_the_closed_form_resonant_response() -> None:
    frequency, damping, mass, force = 5.0, 0.03, 20e3, 60.0
    cycles = 90  # exp(-2 pi 0.03 90) = 4e-8: the start-up has died away
    times, acceleration = beam_acceleration(first_frequency=frequency, damping=damping, modal_mass=mass,
                                            force=force, forcing_frequency=frequency, span=12.0,
                                            duration=cycles / frequency, position=6.0)
    last = acceleration[times > (cycles - 5) / frequency]
    # Oracle: scipy.integrate.solve_ivp; Source: Chopra ch. 3, resonant amplitude u_st / (2 zeta)
    assert np.abs(last).max() == pytest.approx(force / (2 * damping * mass), rel=5e-4)
    assert fw.steady_acceleration(force, frequency, damping, mass) == pytest.approx(np.abs(last).max(), rel=5e-4)


@pytest.mark.parametrize("damping", [0.01, 0.03])
@pytest.mark.parametrize("cycles", [5, 20, 60])
def test_resonant_build_up_at_the_antinode(damping: float, cycles: int) -> None:
    frequency, mass, force = 4.0, 10e3, 100.0
    _, acceleration = beam_acceleration(first_frequency=frequency, damping=damping, modal_mass=mass, force=force,
                                        forcing_frequency=frequency, span=10.0, duration=cycles / frequency,
                                        position=5.0)
    expected = fw.buildup_factor(damping, cycles)
    # Oracle: scipy.integrate.solve_ivp; the closed form 1 - exp(-2 pi zeta N) is the envelope (terms of
    # order zeta^2 and the sampling of the peak are left)
    assert np.abs(acceleration).max() / (force / (2 * damping * mass)) == pytest.approx(expected, rel=2e-3)


@pytest.mark.parametrize(("damping", "cycles", "modes"), [(0.01, 10, 3), (0.01, 30, 3), (0.03, 10, 1),
                                                          (0.03, 30, 1), (0.01, 100, 1)])
def test_walker_crossing_a_simply_supported_span(damping: float, cycles: int, modes: int) -> None:
    frequency, mass, force, span = 2.0, 20e3, 280.0, 30.0
    speed = span * frequency / cycles
    _, acceleration = beam_acceleration(first_frequency=frequency, damping=damping, modal_mass=mass, force=force,
                                        forcing_frequency=frequency, span=span, duration=span / speed + 1.0,
                                        speed=speed, modes=modes)
    # Oracle: scipy.integrate.solve_ivp, modal superposition of the first `modes` modes at midspan
    assert np.abs(acceleration).max() / (force / (2 * damping * mass)) == pytest.approx(
        fw.crossing_factor(damping, cycles), rel=2e-3)


def test_a_longer_crossing_builds_up_towards_the_steady_state() -> None:
    frequency, damping, mass, force, span = 2.0, 0.02, 20e3, 280.0, 30.0
    shares = []
    for cycles in (5, 15, 45, 135):
        speed = span * frequency / cycles
        _, acceleration = beam_acceleration(first_frequency=frequency, damping=damping, modal_mass=mass,
                                            force=force, forcing_frequency=frequency, span=span,
                                            duration=span / speed + 0.5, speed=speed, samples_per_cycle=100)
        shares.append(np.abs(acceleration).max() / (force / (2 * damping * mass)))
    # Oracle: scipy.integrate.solve_ivp: the peak rises with the crossing time towards the steady amplitude
    assert shares == sorted(shares)
    assert 0.97 < shares[-1] < 1.0
    # Oracle: scipy.integrate.solve_ivp; a crossing builds up less than a walker staying at the antinode
    assert all(share < fw.buildup_factor(damping, n) for share, n in zip(shares, (5, 15, 45, 135), strict=True))


def test_resonant_response_of_a_floor_crossed_by_a_walker_against_the_oracle() -> None:
    frequency, damping, mass, path = 2.0, 0.03, 20e3, 15.0
    result = fw.resonant_response(frequency, damping, mass, path_length=path, crossing=True)
    assert (result.harmonic, result.pacing_rate) == (1, pytest.approx(2.0))
    speed = fw.STRIDE * result.pacing_rate
    _, acceleration = beam_acceleration(first_frequency=frequency, damping=damping, modal_mass=mass,
                                        force=result.force, forcing_frequency=2.0, span=path,
                                        duration=path / speed + 1.0, speed=speed, modes=3)
    # Oracle: scipy.integrate.solve_ivp, walker at 0.75 m per step and 2 Hz crossing 15 m (20 steps)
    assert result.peak == pytest.approx(np.abs(acceleration).max(), rel=2e-3)
    # From memory: SCI P354 alpha_1 = 0.436 (fp - 0.95); walker 0.7 kN
    assert result.force == pytest.approx(0.436 * 1.05 * 700.0)


def test_resonant_peak_rms_and_response_factor() -> None:
    result = fw.resonant_response(6.0, 0.03, 30e3)
    # From memory: SCI P354 alpha_3 = 0.007 (3 fp + 5.2) at fp = 2 Hz; Chopra ch. 3 resonance F / (2 zeta M)
    assert result.peak == pytest.approx(0.007 * 11.2 * 700.0 / (2 * 0.03 * 30e3), rel=1e-12)
    # Common practice (no source): r.m.s. of a sinusoid is its amplitude / sqrt 2
    assert result.rms == pytest.approx(result.peak / math.sqrt(2), rel=1e-12)
    # From memory: ISO 10137 Annex C vertical base curve 5e-3 m/s^2 r.m.s. from 4 to 8 Hz
    assert result.response_factor == pytest.approx(result.rms / 5e-3, rel=1e-12)


def test_resonant_acceleration_inversely_proportional_to_damping_and_mass() -> None:
    # Source: Chopra ch. 3, resonant amplitude F / (2 zeta M) (2 Hz is reached by the first harmonic)
    base = fw.resonant_response(2.0, 0.02, 20e3).peak
    assert fw.resonant_response(2.0, 0.04, 20e3).peak == pytest.approx(base / 2, rel=1e-12)
    assert fw.resonant_response(2.0, 0.02, 60e3).peak == pytest.approx(base / 3, rel=1e-12)


def test_mode_factor_scales_the_response() -> None:
    # Common practice (no source): the modal force is the force times the mode's amplitude where it acts
    assert fw.resonant_response(5.0, 0.03, 20e3, mode_factor=0.5).peak == pytest.approx(
        0.5 * fw.resonant_response(5.0, 0.03, 20e3).peak, rel=1e-12)


def test_cutoff_differs_by_guide() -> None:
    # Source: AISC Design Guide 11 (2nd ed.) 4.1 applies its walking criterion up to 9 Hz; SCI P354 puts the
    # low/high-frequency cutoff at 10 Hz (both confirmed in quotations)
    assert fw.CUTOFF_HZ == {fw.AISC_DG11: 9.0, fw.SCI_P354: 10.0}
    assert fw.resonant_response(9.5, 0.03, 20e3, guide=fw.SCI_P354).peak > 0
    with pytest.raises(ValueError, match=r"9 Hz.*transient footfall-impulse"):
        fw.resonant_response(9.5, 0.03, 20e3, guide=fw.AISC_DG11)
    with pytest.raises(ValueError, match=r"10 Hz.*transient footfall-impulse"):
        fw.resonant_response(10.0, 0.03, 20e3)
    assert fw.resonant_response(11.0, 0.03, 20e3, cutoff=12.0).peak > 0


def test_resonant_inverses_round_trip() -> None:
    options = {"path_length": 12.0, "crossing": True}
    damping = fw.resonant_damping_for_limit(8.0, 4.0, 15e3, **options)
    assert damping is not None and 0 < damping < fw.MAX_DAMPING
    # Common practice (no source): the damping found gives exactly the limit
    assert fw.resonant_response(4.0, damping, 15e3, **options).response_factor == pytest.approx(8.0, rel=1e-9)
    mass = fw.resonant_mass_for_limit(8.0, 4.0, 0.03, **options)
    assert fw.resonant_response(4.0, 0.03, mass, **options).response_factor == pytest.approx(8.0, rel=1e-12)
    frequency = fw.resonant_frequency_for_limit(8.0, 0.03, 20e3)
    assert frequency is not None
    assert fw.resonant_response(frequency, 0.03, 20e3).response_factor == pytest.approx(8.0, rel=1e-8)
    grid = np.linspace(frequency + 1e-6, 9.99, 400)
    assert max(fw.resonant_response(f, 0.03, 20e3).response_factor for f in grid) <= 8.0 * (1 + 1e-9)


def test_resonant_targets_out_of_reach() -> None:
    # Common practice (no source): the resonant response solved for zeta and fn, out of reach either way
    assert fw.resonant_damping_for_limit(1.0, 2.0, 2e3) is None  # would need more than 20 %
    assert fw.resonant_damping_for_limit(8.0, 4.0, 15e3, path_length=0.3) == 0.0  # one step: nothing builds
    assert fw.resonant_frequency_for_limit(0.5, 0.02, 5e3) is None  # fails just below the cutoff too
    assert fw.resonant_frequency_for_limit(1e3, 0.03, 50e3) == fw.LOWEST_FLOOR_HZ  # complies everywhere


@settings(max_examples=60, deadline=None)
@given(frequency=st.floats(1.2, 9.8), damping=st.floats(0.005, 0.1), mass=st.floats(1e3, 1e6),
       path=st.one_of(st.none(), st.floats(2.0, 60.0)), crossing=st.booleans(), more=st.floats(1.01, 3.0))
def test_resonant_response_falls_as_mass_and_damping_rise(frequency: float, damping: float, mass: float,
                                                          path: float | None, crossing: bool, more: float) -> None:
    # Common practice (no source): more modal mass or damping never increases the resonant response
    options = {"path_length": path, "crossing": crossing}
    base = fw.resonant_response(frequency, damping, mass, **options).peak
    assert fw.resonant_response(frequency, damping, mass * more, **options).peak < base
    assert fw.resonant_response(frequency, min(damping * more, 0.5), mass, **options).peak <= base * (1 + 1e-12)


def test_bad_inputs_are_refused() -> None:
    # Common practice (no source): inputs outside their physical range are refused with the field named
    with pytest.raises(ValueError, match="modal mass"):
        fw.resonant_response(3.0, 0.03, 0.0)
    with pytest.raises(ValueError, match="natural frequency"):
        fw.resonant_response(-3.0, 0.03, 1e4)
    with pytest.raises(ValueError, match="path length"):
        fw.resonant_response(3.0, 0.03, 1e4, path_length=-1.0)
    with pytest.raises(ValueError, match="guide"):
        fw.resonant_response(3.0, 0.03, 1e4, guide="elsewhere")
    with pytest.raises(ValueError, match="structure"):
        fw.dg11_acceleration(3.0, 0.03, 1e5, structure="tower")
    with pytest.raises(ValueError, match="effective weight"):
        fw.dg11_acceleration(3.0, 0.03, math.inf)


def test_a_band_of_one_pacing_rate_gives_the_response_to_walking_at_that_rate() -> None:
    from scipy import signal

    frequency, damping, mass, pace = 2.0, 0.03, 20e3, 1.8
    result = fw.resonant_response(frequency, damping, mass, band=(pace, pace))
    omega = 2 * math.pi * frequency
    _, response = signal.freqresp(signal.lti([1.0 / mass, 0.0, 0.0], [1.0, 2 * damping * omega, omega**2]),
                                  w=[2 * math.pi * pace])
    # Oracle: scipy.signal.freqresp of a(s)/F(s) at the pacing rate; From memory: SCI P354 alpha_1 = 0.436 (fp - 0.95)
    assert (result.harmonic, result.pacing_rate) == (1, pace)
    assert result.peak == pytest.approx(0.436 * (pace - 0.95) * 700.0 * abs(response[0]), rel=1e-10)
    # Common practice (no source): a band that leaves out the resonant pace lowers the response
    assert result.peak < fw.resonant_response(frequency, damping, mass).peak


def test_a_pacing_band_upside_down_is_refused() -> None:
    # Common practice (no source): the fastest pacing rate cannot be below the slowest
    with pytest.raises(ValueError, match="fastest pacing rate 1.5 Hz is below the slowest 2 Hz"):
        fw.resonant_response(3.0, 0.03, 1e4, band=(2.0, 1.5))
    with pytest.raises(ValueError, match="slowest pacing rate"):
        fw.resonant_response(3.0, 0.03, 1e4, band=(0.0, 1.5))


@settings(max_examples=40, deadline=None)
@given(damping=st.floats(0.005, 0.1), mass=st.floats(1e3, 1e6), path=st.one_of(st.none(), st.floats(2.0, 60.0)),
       crossing=st.booleans(), guide=st.sampled_from(fw.GUIDES), low=st.floats(1.0, 2.0), width=st.floats(0.0, 1.0))
def test_response_factors_on_arrays_equal_the_single_mode_response(damping: float, mass: float, path: float | None,
                                                                   crossing: bool, guide: str, low: float,
                                                                   width: float) -> None:
    options = {"path_length": path, "crossing": crossing, "guide": guide, "band": (low, low + width)}
    frequencies = np.linspace(1.0, 8.9, 37)
    # Common practice (no source): the array form is the same computation as resonant_response, mode by mode
    assert fw.resonant_response_factors(frequencies, damping, mass, **options) == pytest.approx(
        [fw.resonant_response(float(f), damping, mass, **options).response_factor for f in frequencies], rel=1e-12)


# --- high-frequency floors: footfall impulse ----------------------------------------------------------------

def test_effective_impulse_at_hand_worked_points() -> None:
    # From memory: SCI P354 I = 54 fp^1.43 / fn^1.3 (Q / 700 N) N s; 2^1.43 = 2.69447, 15^1.3 = 33.8002
    assert fi.effective_impulse(2.0, 15.0) == pytest.approx(54 * 2.69447 / 33.8002, rel=1e-5)
    assert fi.effective_impulse(2.0, 15.0, weight=1400.0) == pytest.approx(2 * 54 * 2.69447 / 33.8002, rel=1e-5)
    # From memory: AISC Design Guide 11 (2nd ed.) I = (fp^1.43 / fn^1.3) (Q / 17.8) lb s, Q = 168 lb;
    # NIST SP 811 for lbf
    assert fi.effective_impulse(1.0, 1.0, 168 * LBF, fi.AISC_DG11) == pytest.approx(168 / 17.8 * LBF, rel=1e-12)


@pytest.mark.parametrize(("frequency", "damping"), [(12.0, 0.0), (12.0, 0.01), (20.0, 0.03), (40.0, 0.05)])
def test_rms_velocity_of_the_decaying_mode(frequency: float, damping: float) -> None:
    from scipy.integrate import quad, solve_ivp

    omega, v0, window = 2 * math.pi * frequency, 1e-3, 1.0
    solution = solve_ivp(lambda t, y: [y[1], -2 * damping * omega * y[1] - omega**2 * y[0]], (0.0, window),
                         [0.0, v0], dense_output=True, rtol=1e-11, atol=1e-15, method="DOP853")
    breaks = np.linspace(0.0, window, int(4 * frequency * window) + 1)
    square = sum(quad(lambda t: solution.sol(t)[1] ** 2, a, b, epsabs=0, epsrel=1e-10)[0]
                 for a, b in zip(breaks[:-1], breaks[1:], strict=True))
    # Oracle: scipy.integrate.solve_ivp (free vibration from v0 = I / M) and scipy.integrate.quad
    assert fi.impulse_velocity_rms(v0, frequency, damping, window) == pytest.approx(math.sqrt(square / window),
                                                                                    rel=1e-7)


def test_undamped_rms_over_whole_cycles() -> None:
    # Common practice (no source): over whole cycles a sinusoid's r.m.s. is its amplitude / sqrt 2
    assert fi.impulse_velocity_rms(2e-3, 12.0, 0.0, 1.0) == pytest.approx(2e-3 / math.sqrt(2), rel=1e-12)


def test_transient_response_and_factor() -> None:
    result = fi.transient_response(15.0, 0.03, 12e3, pacing_rate=2.0)
    # Source: impulse-momentum, peak velocity I / M of a mode at rest
    assert result.peak_velocity == pytest.approx(result.impulse / 12e3, rel=1e-12)
    # From memory: ISO 10137 vertical base curve above 8 Hz, 6.25e-4 f m/s^2 = 0.0995 mm/s r.m.s. velocity
    base_velocity = fi.BASE_VELOCITY
    assert base_velocity == pytest.approx(6.25e-4 / (2 * math.pi), rel=1e-12)
    assert result.response_factor == pytest.approx(result.rms_velocity / 9.94718e-5, rel=1e-5)
    # Common practice (no source): the fastest walking pace gives the largest impulse
    default = fi.transient_response(15.0, 0.03, 12e3)
    assert default.impulse == pytest.approx(fi.effective_impulse(footfall.WALKING[1], 15.0))


def test_transient_cutoff_names_the_resonant_method() -> None:
    # Source: AISC Design Guide 11 (2nd ed.) 4.1 (9 Hz) and SCI P354 (10 Hz) low/high-frequency cutoffs
    assert fi.transient_response(9.5, 0.03, 12e3, guide=fi.AISC_DG11).peak_velocity > 0
    with pytest.raises(ValueError, match=r"below the 10 Hz.*resonant walking method.*Design Guide 11"):
        fi.transient_response(9.5, 0.03, 12e3)
    with pytest.raises(ValueError, match="80 Hz"):
        fi.transient_response(90.0, 0.03, 12e3)


def test_transient_inverses_round_trip() -> None:
    damping = fi.transient_damping_for_limit(2.0, 14.0, 8e3)
    assert damping is not None and damping > 0
    # Common practice (no source): the damping found gives exactly the limit
    assert fi.transient_response(14.0, damping, 8e3).response_factor == pytest.approx(2.0, rel=1e-9)
    mass = fi.transient_mass_for_limit(2.0, 14.0, 0.03)
    assert fi.transient_response(14.0, 0.03, mass).response_factor == pytest.approx(2.0, rel=1e-12)
    frequency = fi.transient_frequency_for_limit(2.0, 0.02, 8e3)
    assert frequency is not None and 10.0 < frequency < 80.0
    assert fi.transient_response(frequency, 0.02, 8e3).response_factor == pytest.approx(2.0, rel=1e-8)
    assert fi.transient_damping_for_limit(100.0, 14.0, 8e3) == 0.0  # complies undamped
    assert fi.transient_damping_for_limit(0.01, 14.0, 8e3) is None  # would need more than 20 %
    assert fi.transient_frequency_for_limit(100.0, 0.02, 8e3) == 10.0  # every high-frequency floor complies
    assert fi.transient_frequency_for_limit(0.01, 0.02, 8e3) is None


@settings(max_examples=60, deadline=None)
@given(frequency=st.floats(10.0, 80.0), damping=st.floats(0.0, 0.1), mass=st.floats(1e3, 1e6),
       more=st.floats(1.01, 3.0))
def test_transient_response_falls_as_mass_and_damping_rise(frequency: float, damping: float, mass: float,
                                                           more: float) -> None:
    # Common practice (no source): more modal mass or damping never increases the r.m.s. velocity
    base = fi.transient_response(frequency, damping, mass).rms_velocity
    assert fi.transient_response(frequency, damping, mass * more).rms_velocity < base
    assert fi.transient_response(frequency, min(damping * more + 1e-3, 0.5), mass).rms_velocity < base
