"""Charts of the `decay` check: the record with its fitted envelope and peaks, and its spectrum."""

from __future__ import annotations

from typing import Any

import numpy as np

from calc.kinds import KINDS
from calc.result import Result
from calc.units import Q_, display_unit


def _signal_scale(result: Result, system: str) -> tuple[float, str]:
    """Factor from SI to the display unit of the record's signal, and the unit's name."""
    value = result.values.get("initial_amplitude")
    if value is None or isinstance(value.quantity, str) or value.kind not in ("acceleration", "velocity", "length"):
        return 1.0, ""
    unit = display_unit(value.quantity, value.kind, system)
    factor = float(Q_(1.0, KINDS[value.kind].si).to(unit).magnitude)
    return factor, KINDS[value.kind].names.get(unit, unit)


def draw_record(plt: Any, result: Result, system: str) -> None:
    """The analysed record (after offset, drift and any band-pass), +-envelope and picked peaks."""
    series = result.series
    if "time" not in series:
        return
    factor, unit = _signal_scale(result, system)
    plt.plot(series["time"], series["signal"] * factor, marker="braille")
    envelope_time = series["envelope_time"]
    for sign in (1.0, -1.0):
        plt.plot(envelope_time, sign * series["envelope"] * factor, marker="dot")
    peaks = series["peak_amplitude"]
    step = max(1, len(peaks) // 60)
    plt.scatter(series["peak_time"][::step], peaks[::step] * factor, marker="x")
    plt.title(f"Record{f' ({unit})' if unit else ''}: envelope ., peaks x")
    plt.xlabel("time (s)")


def draw_spectrum(plt: Any, result: Result, system: str) -> None:
    """Amplitude spectrum of the decay (log scale) with the half-power band and the peak marked."""
    series = result.series
    if "frequency" not in series:
        return
    factor, _ = _signal_scale(result, system)
    frequency, amplitude = series["frequency"], series["amplitude_spectrum"] * factor
    floor = float(np.max(amplitude)) * 1e-4
    plt.plot(frequency, np.maximum(amplitude, floor), marker="braille")
    plt.yscale("log")
    edges = series.get("half_power_frequency", np.empty(0))
    for edge in edges:
        plt.vline(float(edge))
    peak = result.values.get("spectral_frequency")
    if peak is not None and not isinstance(peak.quantity, str):
        f = float(peak.quantity.to("Hz").magnitude)
        plt.scatter([f], [float(np.interp(f, frequency, amplitude))], marker="o")
    band = f" {edges[0]:.2f}-{edges[1]:.2f} Hz" if len(edges) == 2 else ""
    plt.title(f"peak o, half-power |{band}")  # short: plotext drops a title wider than the chart at 80x24
    plt.xlabel("frequency (Hz)")
