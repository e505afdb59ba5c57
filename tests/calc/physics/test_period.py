"""Approximate building periods, EN 1998-1 and ASCE 7-16."""

from __future__ import annotations

import pytest

from fieldmode.calc.physics import period


@pytest.mark.parametrize(("system", "ct"), [
    ("steel-moment-frame", 0.085),       # Source: EN 1998-1:2004 4.3.3.2.2(3)
    ("concrete-moment-frame", 0.075),    # Source: EN 1998-1:2004 4.3.3.2.2(3)
    ("steel-eccentric-braced", 0.075),   # Source: EN 1998-1:2004 4.3.3.2.2(3)
    ("other", 0.050),                    # Source: EN 1998-1:2004 4.3.3.2.2(3)
])
@pytest.mark.parametrize("height", [3.0, 11.5, 40.0])
def test_period_en1998(system: str, ct: float, height: float) -> None:
    assert period.en1998(height, system) == pytest.approx(ct * height ** 0.75, rel=1e-12)


def test_period_en1998_demo_annex() -> None:
    # Source: EN 1998-1:2004 4.3.3.2.2(3): 0.085 x 11.5^0.75 = 0.5308 s (hand calculation)
    assert period.en1998(11.5, "steel-moment-frame") == pytest.approx(0.5308, abs=1e-4)


@pytest.mark.parametrize(("system", "ct_us", "x"), [
    ("steel-moment-frame", 0.028, 0.8),      # Source: ASCE 7-16 12.8.2.1, Table 12.8-2 (hn in ft)
    ("concrete-moment-frame", 0.016, 0.9),   # Source: ASCE 7-16 12.8.2.1, Table 12.8-2 (hn in ft)
    ("steel-eccentric-braced", 0.03, 0.75),  # Source: ASCE 7-16 12.8.2.1, Table 12.8-2 (hn in ft)
    ("other", 0.02, 0.75),                   # Source: ASCE 7-16 12.8.2.1, Table 12.8-2 (hn in ft)
])
@pytest.mark.parametrize("height", [4.0, 11.5, 60.0])
def test_period_asce7_matches_customary_units(system: str, ct_us: float, x: float, height: float) -> None:
    feet = height / 0.3048  # Source: NIST SP 811 (2008), Appendix B: 1 ft = 0.3048 m
    # Source: ASCE 7-16 eq. 12.8-7; the SI Ct of Table 12.8-2 are rounded to 3 figures
    assert period.asce7(height, system) == pytest.approx(ct_us * feet**x, rel=2e-3)
