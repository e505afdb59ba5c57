"""Walking, running and jumping bands and the footbridge guides' ranges."""

from __future__ import annotations

import pytest

from fieldmode.calc.physics import footfall


def _band(name: str) -> footfall.Band:
    return next(b for b in footfall.BANDS if b.name == name)


@pytest.mark.parametrize(("frequency", "inside"), [(1.7, True), (2.4, True), (2.0, True), (1.699, False),
                                                   (2.401, False), (1.6, False)])
def test_walking_first_harmonic_edges(frequency: float, inside: bool) -> None:
    # Source: Eurocode footbridge serviceability teaching material (confirmed in one copy): pacing rate
    # 1.7-2.4 Hz, the one walking band of the product; edges included (Common practice (no source))
    assert _band("walking h1").contains(frequency) is inside


@pytest.mark.parametrize(("name", "low", "high"), [
    ("walking h2", 3.4, 4.8),    # Source: Eurocode teaching material (confirmed in one copy), 2 x 1.7-2.4 Hz
    ("walking h4", 6.8, 9.6),    # Source: Eurocode teaching material (confirmed in one copy), 4 x 1.7-2.4 Hz
    ("running h1", 2.0, 3.5),    # From memory: Bachmann & Ammann (1987), running 2.0-3.5 Hz
    ("running h2", 4.0, 7.0),    # From memory: Bachmann & Ammann (1987), 2 x 2.0-3.5 Hz
    ("jumping h1", 1.8, 3.4),    # From memory: Bachmann & Ammann (1987), jumping 1.8-3.4 Hz
    ("jumping h3", 5.4, 10.2),   # From memory: Bachmann & Ammann (1987), 3 x 1.8-3.4 Hz
    ("walking lateral", 0.85, 1.2),  # Source: Eurocode teaching material (confirmed in one copy), half of 1.7-2.4
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


@pytest.mark.parametrize(("frequency", "source", "margin"), [
    # From memory: Bachmann & Ammann (1987): running 2.0-3.5 and jumping 1.8-3.4 Hz, harmonics up to 3 x 3.4 =
    # 10.2 Hz; 12 Hz is clear of them by 1.8 Hz
    (12.0, footfall.BACHMANN, 1.8),
    # Source: Eurocode teaching material (confirmed in one copy): walking 1.7-2.4 Hz, h4 up to 9.6 Hz
    (12.0, footfall.WALKING_SOURCE, 2.4),
    (1.0, footfall.WALKING_SOURCE, 0.7),   # 0.7 Hz below walking 1.7 Hz
    # Walking h1 1.7-2.4 and h2 3.4-4.8 do not touch: 1.9 Hz is 0.2 Hz inside h1
    (1.9, footfall.WALKING_SOURCE, -0.2),
    (1.7, footfall.WALKING_SOURCE, 0.0),   # Common practice (no source): an edge counts as inside, no margin
])
def test_vertical_floor_margins_per_source(frequency: float, source: str, margin: float) -> None:
    bands = footfall.bands_for("vertical", "floor")
    assert footfall.source_margin(frequency, bands, source) == pytest.approx(margin, abs=1e-12)


def test_footbridge_margins_read_each_guide_on_its_own() -> None:
    bands = footfall.bands_for("vertical", "footbridge")
    # From memory: Setra (2006) vertical ranges 1.0-1.7 (2), 1.7-2.1 (1), 2.1-2.6 (2), 2.6-5 (3): at 1.9 Hz
    # the nearest way out of Setra's ranges is down to 1.0 Hz, 0.9 Hz away
    assert footfall.source_margin(1.9, bands, footfall.SETRA) == pytest.approx(-0.9)
    # From memory: HiVoSS critical 1.25-2.3 Hz, 2nd harmonic 2.5-4.6 Hz: 0.4 Hz to the 2.3 Hz edge
    assert footfall.source_margin(1.9, bands, footfall.HIVOSS) == pytest.approx(-0.4)
    # Source: Eurocode teaching material (confirmed in one copy): walking 1.7-2.4 Hz, 0.2 Hz to the 1.7 Hz edge
    assert footfall.source_margin(1.9, bands, footfall.WALKING_SOURCE) == pytest.approx(-0.2)


def test_one_verdict_per_guide_at_a_shared_edge() -> None:
    # From memory: Setra (2006) lateral range 1 is 0.5-1.1 Hz, range 2 is 1.1-1.3 Hz: 1.1 Hz is given the
    # higher risk only (Common practice (no source): the edge goes to the more severe range)
    chosen = footfall.verdicts(1.1, footfall.bands_for("lateral", "footbridge"))
    setra = [b.name for b in chosen if b.source == footfall.SETRA]
    assert setra == ["Setra lateral 1 max risk"]
    assert [b.name for b in footfall.verdicts(2.1, footfall.bands_for("vertical", "footbridge"))
            if b.source == footfall.SETRA] == ["Setra 1 max risk"]


@pytest.mark.parametrize(("name", "level"), [
    ("walking h1", "warning"), ("running h1", "warning"), ("jumping h1", "warning"), ("walking lateral", "warning"),
    ("Setra 1 max risk", "warning"), ("Setra lateral 1 max risk", "warning"), ("HiVoSS critical", "warning"),
    ("walking h2", "caution"), ("Setra 2 medium risk", "caution"), ("HiVoSS 2nd harmonic", "caution"),
    ("Setra 3 low risk", "info"), ("Setra lateral 3 low risk", "info"),
])
def test_warnings_only_for_first_harmonics_and_maximum_risk(name: str, level: str) -> None:
    # From memory: Setra (2006) names its ranges maximum, medium and low risk; HiVoSS's critical range is the
    # first harmonic of walking. Common practice (no source): a first harmonic carries the largest force.
    assert _band(name).level == level


@pytest.mark.parametrize(("frequency", "direction", "needed"), [
    # Source: EN 1990 A2.4.3.2 as quoted in two secondary sources: vertical below 5 Hz, lateral below 2.5 Hz
    (4.99, "vertical", True), (5.0, "vertical", False),
    (2.49, "lateral", True), (2.5, "lateral", False),
])
def test_footbridge_comfort_limits(frequency: float, direction: str, needed: bool) -> None:
    verdict, _, source = footfall.comfort_check_needed(frequency, direction, "footbridge")
    assert verdict is needed
    assert "EN 1990" in source


@pytest.mark.parametrize(("frequency", "needed"), [(9.9, True), (10.0, False)])
def test_low_frequency_floor(frequency: float, needed: bool) -> None:
    # Source: SCI P354 (confirmed in a quotation): floors below 10 Hz are low-frequency floors
    assert footfall.comfort_check_needed(frequency, "vertical", "floor")[0] is needed


@pytest.mark.parametrize(("frequency", "needed"), [(8.9, True), (9.0, True), (9.01, False), (9.5, False)])
def test_low_frequency_floor_by_design_guide_11(frequency: float, needed: bool) -> None:
    # Source: AISC Design Guide 11 (2nd ed.) 4.1 (confirmed in a quotation): walking criterion up to 9 Hz
    limit = dict((guide, limit) for guide, limit, _ in footfall.LOW_FREQUENCY_LIMITS)["AISC DG11"]
    assert limit == 9.0
    needed_now, _, source = footfall.comfort_check_needed(frequency, "vertical", "floor", floor_limit=limit)
    assert needed_now is needed and "Design Guide 11" in source


def test_every_band_names_its_source() -> None:
    for band in footfall.BANDS:
        assert band.source and band.low < band.high, band.name
