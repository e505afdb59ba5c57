"""Walking, running and jumping bands and the footbridge guides' ranges."""

from __future__ import annotations

import pytest

from fieldmode.calc.physics import footfall


def _band(name: str) -> footfall.Band:
    return next(b for b in footfall.BANDS if b.name == name)


@pytest.mark.parametrize(("frequency", "inside"), [(1.6, True), (2.4, True), (2.0, True), (1.599, False),
                                                   (2.401, False)])
def test_walking_first_harmonic_edges(frequency: float, inside: bool) -> None:
    # From memory: Bachmann & Ammann (1987): walking 1.6-2.4 Hz, edges included
    assert _band("walking h1").contains(frequency) is inside


@pytest.mark.parametrize(("name", "low", "high"), [
    ("walking h2", 3.2, 4.8),    # From memory: Bachmann & Ammann (1987), 2 x 1.6-2.4 Hz
    ("walking h4", 6.4, 9.6),    # From memory: Bachmann & Ammann (1987), 4 x 1.6-2.4 Hz
    ("running h1", 2.0, 3.5),    # From memory: Bachmann & Ammann (1987), running 2.0-3.5 Hz
    ("running h2", 4.0, 7.0),    # From memory: Bachmann & Ammann (1987), 2 x 2.0-3.5 Hz
    ("jumping h1", 1.8, 3.4),    # From memory: Bachmann & Ammann (1987), jumping 1.8-3.4 Hz
    ("jumping h3", 5.4, 10.2),   # From memory: Bachmann & Ammann (1987), 3 x 1.8-3.4 Hz
    ("walking lateral", 0.8, 1.2),  # From memory: Bachmann & Ammann (1987), half of 1.6-2.4
    ("Setra 1 max risk", 1.7, 2.1),          # From memory: Setra (2006) vertical range 1
    ("Setra lateral 1 max risk", 0.5, 1.1),  # From memory: Setra (2006) lateral range 1
    ("HiVoSS critical", 1.25, 2.3),                # From memory: HiVoSS vertical critical range
    ("HiVoSS lateral critical", 0.5, 1.2),         # From memory: HiVoSS lateral critical range
])
def test_band_edges(name: str, low: float, high: float) -> None:
    band = _band(name)
    assert (band.low, band.high) == pytest.approx((low, high), rel=1e-12)
    assert band.contains(low) and band.contains(high)
    assert not band.contains(low * 0.999) and not band.contains(high * 1.001)


def test_floors_leave_out_the_footbridge_guides() -> None:
    floor = footfall.bands_for("vertical", "floor")
    assert floor and all(not b.guide for b in floor)
    assert any(b.guide for b in footfall.bands_for("vertical", "footbridge"))
    assert all(b.direction == "lateral" for b in footfall.bands_for("lateral", "footbridge"))


@pytest.mark.parametrize(("frequency", "margin"), [
    (12.0, 1.8),    # From memory: Bachmann & Ammann (1987): clear of jumping harmonic 3 (top 10.2 Hz) by 1.8 Hz
    (1.0, 0.6),     # From memory: Bachmann & Ammann (1987): 0.6 Hz below walking 1.6 Hz
    (2.1, -0.5),    # From memory: Bachmann & Ammann (1987): bands merge 1.6-10.2 Hz; 0.5 Hz from the 1.6 Hz edge
    (1.6, 0.0),     # Common practice (no source): an edge counts as inside, with no margin
])
def test_vertical_floor_margins(frequency: float, margin: float) -> None:
    bands = footfall.bands_for("vertical", "floor")
    assert footfall.forcing_margin(frequency, bands) == pytest.approx(margin, abs=1e-12)


@pytest.mark.parametrize(("frequency", "direction", "needed"), [
    (4.99, "vertical", True), (5.0, "vertical", False),   # From memory: EN 1990 A2.4.3.2, vertical below 5 Hz
    (2.49, "lateral", True), (2.5, "lateral", False),     # From memory: EN 1990 A2.4.3.2, lateral below 2.5 Hz
])
def test_footbridge_comfort_limits(frequency: float, direction: str, needed: bool) -> None:
    verdict, _, source = footfall.comfort_check_needed(frequency, direction, "footbridge")
    assert verdict is needed
    assert "EN 1990" in source


@pytest.mark.parametrize(("frequency", "needed"), [(9.9, True), (10.0, False)])
def test_low_frequency_floor(frequency: float, needed: bool) -> None:
    # From memory: SCI P354: floors below 10 Hz are low-frequency floors (resonant response to walking)
    assert footfall.comfort_check_needed(frequency, "vertical", "floor")[0] is needed


def test_every_band_names_its_source() -> None:
    for band in footfall.BANDS:
        assert band.source and band.low < band.high, band.name
