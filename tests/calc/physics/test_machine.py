"""Machine severity zones and balance quality grades."""

from __future__ import annotations

import math

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from fieldmode.calc.physics import machine

MM_S = 1e-3


@pytest.mark.parametrize(("key", "mm_s", "zone"), [
    # From memory: ISO 10816-3:2009 Table A.1, group 2 rigid: A/B 1.4, B/C 2.8, C/D 4.5 mm/s r.m.s.
    ("group 2 rigid", 1.0, "A"), ("group 2 rigid", 1.4, "B"), ("group 2 rigid", 2.79, "B"),
    ("group 2 rigid", 2.8, "C"), ("group 2 rigid", 4.5, "D"),
    # From memory: ISO 10816-3:2009 Table A.1, group 1 flexible: 3.5 / 7.1 / 11 mm/s
    ("group 1 flexible", 3.4, "A"), ("group 1 flexible", 7.0, "B"), ("group 1 flexible", 10.0, "C"),
    ("group 1 flexible", 11.0, "D"),
    # From memory: ISO 10816-1:1995 Annex B, class I: 0.71 / 1.8 / 4.5 mm/s; class IV: 2.8 / 7.1 / 18 mm/s
    ("class I", 0.7, "A"), ("class I", 1.0, "B"), ("class I", 2.0, "C"), ("class I", 5.0, "D"),
    ("class IV", 2.0, "A"), ("class IV", 17.9, "C"), ("class IV", 18.0, "D"),
])
def test_severity_zones(key: str, mm_s: float, zone: str) -> None:
    result = machine.severity_zone(mm_s * MM_S, key)
    assert result.zone == zone
    assert result.meaning == machine.ZONES[zone]
    assert "from memory" in result.machine.source


def test_permissible_unbalance_against_the_rpm_form() -> None:
    # Source: ISO 21940-11:2016, U_per = 9549 G m / n (g mm, kg, r/min) (confirmed in two reproductions):
    # G 6.3, 100 kg, 1500 r/min: 9549 x 6.3 x 100 / 1500 = 4010.6 g mm = 4.0106e-3 kg m
    assert machine.permissible_unbalance(6.3, 100.0, 1500 / 60) == pytest.approx(4.0106e-3, rel=1e-4)


def test_permissible_unbalance_against_the_angular_form() -> None:
    # Source: ISO 21940-11:2016, U_per = 1000 G m / Omega (g mm, kg, rad/s) (confirmed in two reproductions):
    # G 2.5, 250 kg, 3000 r/min (Omega = 100 pi): 1000 x 2.5 x 250 / 314.159 = 1989.4 g mm
    assert machine.permissible_unbalance(2.5, 250.0, 50.0) == pytest.approx(1989.4e-6, rel=1e-4)


def test_permissible_eccentricity() -> None:
    # Source: ISO 21940-11:2016, G = e_per Omega (mm/s) (confirmed): G 1 at 6000 r/min (Omega = 628.32 rad/s):
    # e_per = 1 / 628.32 mm = 1.5915 um
    assert machine.permissible_eccentricity(1.0, 100.0) == pytest.approx(1.5915e-6, rel=1e-4)


def test_unbalance_force() -> None:
    # Source: rotating force of an unbalance U at Omega is U Omega^2 (any dynamics textbook): the G 6.3, 100 kg rotor
    # at 1500 r/min above, U = 4.0106e-3 kg m, Omega = 50 pi: 4.0106e-3 x 24674.0 = 98.96 N (= G m Omega)
    assert machine.unbalance_force(4.0106e-3, 25.0) == pytest.approx(98.96, rel=1e-4)


def test_balance_grades_and_typical_machines() -> None:
    # Source: ISO 21940-11:2016 Table 1 grades G 4000 ... G 0.4 (confirmed in two reproductions)
    assert machine.BALANCE_GRADES == (4000.0, 1600.0, 630.0, 250.0, 100.0, 40.0, 16.0, 6.3, 2.5, 1.0, 0.4)
    typical = {name: grade for name, grade, _ in machine.TYPICAL_GRADES}
    # Source: ISO 21940-11:2016 Table 1: fans and pumps G 6.3; compressors G 2.5 (confirmed in two reproductions)
    assert (typical["fans"], typical["pumps"], typical["compressors"]) == (6.3, 6.3, 2.5)
    assert machine.grade_velocity(6.3) == pytest.approx(6.3e-3)


@pytest.mark.parametrize(("call", "message"), [
    (lambda: machine.grade_velocity(5.0), "G 5.0 is not a balance quality grade"),
    (lambda: machine.permissible_unbalance(6.3, -1.0, 25.0), "rotor mass must be a positive"),
    (lambda: machine.permissible_unbalance(6.3, 10.0, 0.0), "rotational speed must be a positive"),
    (lambda: machine.unbalance_force(float("nan"), 25.0), "finite, non-negative number of kg m"),
    (lambda: machine.severity_zone(-1.0, "class I"), "finite, non-negative"),
    (lambda: machine.severity_zone(1.0, "class V"), "unknown machine class"),
])
def test_bad_input_is_refused_with_a_clear_message(call, message: str) -> None:  # noqa: ANN001
    with pytest.raises(ValueError, match=message):
        call()


@settings(max_examples=60, deadline=None)
@given(grade=st.sampled_from(machine.BALANCE_GRADES), mass=st.floats(min_value=0.01, max_value=1e5),
       speed=st.floats(min_value=0.1, max_value=2000.0))
def test_force_of_the_permissible_unbalance_is_g_m_omega(grade: float, mass: float, speed: float) -> None:
    # Source: ISO 21940-11:2016, G = e_per Omega, so the force m e_per Omega^2 equals G m Omega
    force = machine.unbalance_force(machine.permissible_unbalance(grade, mass, speed), speed)
    assert force == pytest.approx(grade * MM_S * mass * 2 * math.pi * speed, rel=1e-12)
