"""Charts of `forced`: amplification and phase against the frequency ratio."""

from __future__ import annotations

from helpers.charts import draw_panels


def test_amplification_and_phase_panels() -> None:
    amplification, phase = draw_panels("forced")
    assert "Amplification R_d" in amplification and "+/-20 %" in amplification
    assert "Phase lag, deg" in phase
    for tick in ("0", "90", "180"):
        assert any(line.strip().startswith(tick) for line in phase.splitlines())
