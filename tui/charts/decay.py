"""Charts of the `decay` check: the record with its fitted envelope and peaks, and its spectrum."""

from __future__ import annotations

from typing import Any

import numpy as np

from fieldmode.calc.framework.result import Result
from fieldmode.tui.charts.common import axis_scale


def _signal_scale(result: Result, system: str) -> tuple[float, str]:
    """Factor from SI to the display unit of the record's signal, and the unit's name ('' if unknown)."""
    return axis_scale(result.series_kinds["signal"], system, result.series["peak_amplitude"])


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
    plt.title("Record: envelope ., peaks x")
    plt.xlabel("time (s)")
    plt.ylabel(f"signal ({unit or 'as recorded'})")


def draw_spectrum(plt: Any, result: Result, system: str) -> None:
    """Amplitude spectrum of the decay (log scale) with the half-power band and the peak marked."""
    series = result.series
    if "frequency" not in series:
        return
    factor, unit = _signal_scale(result, system)
    frequency, amplitude = series["frequency"], series["amplitude_spectrum"] * factor
    floor = float(np.max(amplitude)) * 1e-4
    plt.plot(frequency, np.maximum(amplitude, floor), marker="braille")
    plt.yscale("log")
    edges = series.get("half_power_frequency", np.empty(0))
    for edge in edges:
        plt.vline(float(edge))
    f = result.number("spectral_frequency")
    if f is not None:
        plt.scatter([f], [float(np.interp(f, frequency, amplitude))], marker="o")
    band = f" {edges[0]:.2f}-{edges[1]:.2f} Hz" if len(edges) == 2 else ""
    plt.title(f"Spectrum: peak o, half-power |{band}")  # short: plotext drops a title wider than the chart
    plt.xlabel("frequency (Hz)")
    plt.ylabel(f"amplitude ({unit or 'as recorded'})")


PANELS = (draw_record, draw_spectrum)
"""The chart panels of the check, in the order they are shown."""
