"""Notes for implausible inputs: each threshold on both sides, and no note on any demo."""

from __future__ import annotations

import math

import pytest

from fieldmode.calc.checks import BY_ID, SPECS
from fieldmode.calc.framework import plausible

G0 = 9.80665  # Source: 3rd CGPM (1901), standard gravity


def test_the_static_deflection_limit_is_a_mass_on_a_spring_at_1_58_hz() -> None:
    # Common practice (no source): f = 15.76 / sqrt(delta in mm) for a mass on a spring
    assert 15.76 / math.sqrt(plausible.STATIC_DEFLECTION_LIMIT * 1000) == pytest.approx(1.576, rel=1e-3)
    assert math.sqrt(G0 / plausible.STATIC_DEFLECTION_LIMIT) / (2 * math.pi) == pytest.approx(1.576, rel=1e-3)


@pytest.mark.parametrize(("deflection", "noted"), [(0.0999, False), (0.100, False), (0.1001, True), (2.0, True)])
def test_static_deflection(deflection: float, noted: bool) -> None:
    # Common practice (no source): more than 100 mm under a mass's own weight is most often a unit slip
    note = plausible.static_deflection(deflection, "the stiffness unit")
    assert (note is not None) == noted
    if note:
        assert note.level == "caution" and note.text.endswith("check the stiffness unit")


@pytest.mark.parametrize(("frequency", "noted"), [(60.0, False), (100.0, False), (100.1, True), (740.0, True)])
def test_operating_frequency(frequency: float, noted: bool) -> None:
    # Common practice (no source): 100 Hz is 6000 rpm, above most machines set on floors and mounts
    note = plausible.operating_frequency(frequency)
    assert (note is not None) == noted
    if note:
        assert f"{60 * frequency:.5g} rpm" in note.text


@pytest.mark.parametrize(("period", "storeys", "noted"), [
    (0.57, 3, False), (1.5, 3, False), (1.51, 3, True), (0.0601, 3, False), (0.0599, 3, True), (18.0, 3, True),
])
def test_storey_period(period: float, storeys: int, noted: bool) -> None:
    # From memory: ASCE 7-16 eq. 12.8-8, T = 0.1 N; a factor of 5 either side is our choice
    note = plausible.storey_period(period, storeys)
    assert (note is not None) == noted
    if note:
        assert "0.1 N = 0.3 s" in note.text


@pytest.mark.parametrize(("modulus", "noted"), [(1e9, False), (0.99e9, True), (250e9, False), (251e9, True)])
def test_modulus(modulus: float, noted: bool) -> None:
    # Common practice (no source): structural materials span about 7 GPa (timber) to 210 GPa (steel)
    assert (plausible.modulus(modulus) is not None) == noted


def test_storey_heights_name_the_storeys() -> None:
    # Common practice (no source): storeys are 2.5-6 m high, tall ground storeys up to about 10 m
    assert plausible.storey_heights([4.5, 3.5, 3.5]) is None
    assert plausible.storey_heights([2.0, 10.0]) is None
    note = plausible.storey_heights([4500.0, 3.5, 1.9])
    assert note is not None and "storeys 1, 3:" in note.text
    single = plausible.storey_heights([3.5, 12.0])
    assert single is not None and "storey 2:" in single.text


@pytest.mark.parametrize("system", ["si", "us"])
@pytest.mark.parametrize("spec", SPECS, ids=lambda spec: spec.id)
def test_no_demo_gets_a_note(spec, system: str) -> None:  # noqa: ANN001
    result = spec.evaluate(spec.demo_texts(), system)
    notes = ("check the stiffness", "check the deflection", "check the unit", "check the height", "mounts this soft")
    assert not [flag.text for flag in result.flags if any(note in flag.text for note in notes)]


def test_storeys_notes_through_the_check() -> None:
    spec = BY_ID["storeys"]
    texts = spec.demo_texts() | {"stiffnesses": "180, 160, 120 N/mm", "heights": "4500, 3500, 3500"}
    result = spec.evaluate(texts)
    texts_of_flags = " ".join(flag.text for flag in result.flags)
    assert "more than 5 times the rule of thumb 0.1 N = 0.3 s" in texts_of_flags
    assert "storeys 1, 2, 3: check the height unit" in texts_of_flags
