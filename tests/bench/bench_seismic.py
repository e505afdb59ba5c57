"""Response spectrum speed: in process against a per-step Python loop, and the whole `fieldmode spectrum` process.

The in-process figures run in a child Python (so the core sets up its libraries as the command
line does) that times the spectrum of a 40 s record at 1 kHz (40,000 steps) on the default grid
of 200 periods (0.02-10 s; every period has at least 20 steps, so no sub-stepping: exactly
200 x 40,000 period-steps). The per-step Python loops run the same exact recurrence on the
first 2,000 steps for all 200 periods and are scaled linearly to 40,000 steps. Both sides are
the best of several runs (the median is printed too): the machine is shared, and the best run
is the one least disturbed by other work.
"""

from __future__ import annotations

import json
import subprocess
import tempfile
from pathlib import Path

from common import VENV_BIN, BenchRow, time_process

STEPS = 40_000
LOOP_STEPS = 2_000

CHILD = r"""
import json, math, statistics, time
from fieldmode.calc.physics import spectrum as core  # first: the core sets up the BLAS threads before numpy loads
import numpy as np

steps, loop_steps = {steps}, {loop_steps}
rng = np.random.default_rng(1)
acc = np.convolve(rng.standard_normal(steps), np.ones(4) / 4, mode="same")
periods = core.period_grid()

def fast(dt):
    core.response_spectrum(acc, dt, periods, 0.05)
    times = []
    for _ in range(9):
        start = time.perf_counter()
        core.response_spectrum(acc, dt, periods, 0.05)
        times.append(time.perf_counter() - start)
    return statistics.median(times), min(times)

a, g0, g1 = core.foh_coefficients(2 * math.pi / periods, 0.05, 0.001)
omega = 2 * math.pi / periods
p = acc[: loop_steps + 1].tolist()

def scalar_loop():
    for k in range(len(periods)):
        a00, a01, a10, a11 = (float(x) for x in a[k].ravel())
        b0u, b0v, b1u, b1v = float(g0[k, 0]), float(g0[k, 1]), float(g1[k, 0]), float(g1[k, 1])
        w2, c = float(omega[k] ** 2), float(2 * 0.05 * omega[k])
        u = v = peak_u = peak_v = peak_a = 0.0
        for i in range(loop_steps):
            u, v = (a00 * u + a01 * v + b0u * p[i] + b1u * p[i + 1],
                    a10 * u + a11 * v + b0v * p[i] + b1v * p[i + 1])
            peak_u = max(peak_u, abs(u))
            peak_v = max(peak_v, abs(v))
            peak_a = max(peak_a, abs(w2 * u + c * v))

def numpy_loop():
    u = np.zeros(len(periods)); v = np.zeros(len(periods))
    peaks = np.zeros((3, len(periods)))
    a00, a01, a10, a11 = a[:, 0, 0], a[:, 0, 1], a[:, 1, 0], a[:, 1, 1]
    for i in range(loop_steps):
        u, v = (a00 * u + a01 * v + g0[:, 0] * p[i] + g1[:, 0] * p[i + 1],
                a10 * u + a11 * v + g0[:, 1] * p[i] + g1[:, 1] * p[i + 1])
        np.maximum(peaks[0], np.abs(u), out=peaks[0])
        np.maximum(peaks[1], np.abs(v), out=peaks[1])
        np.maximum(peaks[2], np.abs(omega**2 * u + 2 * 0.05 * omega * v), out=peaks[2])

def timed(function):
    best = math.inf
    for _ in range(3):
        start = time.perf_counter()
        function()
        best = min(best, time.perf_counter() - start)
    return best * steps / loop_steps

median, best = fast(0.001)
substepped, _ = fast(0.01)
print(json.dumps({{"median": median, "best": best, "substepped": substepped,
                  "work_substepped": core.work(periods, 0.01, steps),
                  "scalar_loop": timed(scalar_loop), "numpy_loop": timed(numpy_loop)}}))
"""


def _in_process() -> dict[str, float]:
    script = CHILD.format(steps=STEPS, loop_steps=LOOP_STEPS)
    output = subprocess.run([str(VENV_BIN / "python"), "-c", script], check=True, capture_output=True, text=True)
    return json.loads(output.stdout)


def _record(folder: Path) -> Path:
    """A 40,000-step record (0.01 s steps) of invented filtered noise, in g."""
    import numpy as np

    from fieldmode.calc.demo.ground_motion import MotionParameters, synthetic_motion

    time, acc = synthetic_motion(MotionParameters(duration=(STEPS - 1) * 0.01))
    path = folder / "record_40000.csv"
    np.savetxt(path, np.column_stack([time, acc]), delimiter=",", fmt="%.6f", header="time [s],acc [g]",
               comments="")
    return path


def rows() -> list[BenchRow]:
    figures = _in_process()
    fast, loop = figures["best"], figures["scalar_loop"]
    extra = (f"median of 9 {figures['median'] * 1000:.1f} ms; numpy loop per step over all periods "
             f"{figures['numpy_loop']:.2f} s ({figures['numpy_loop'] / fast:.0f}x); record at 0.01 s with "
             f"sub-steps ({figures['work_substepped'] / 8e6:.2f}x the work) {figures['substepped'] * 1000:.0f} ms")
    result = [
        BenchRow("response spectrum 200 periods x 40,000 steps, best of 9", fast, None, 0.10, extra=extra),
        BenchRow("  same vs per-step Python loop (best of 3 on 2,000 steps, x20)", fast, loop, 1 / 50,
                 extra=f"{loop / fast:.0f}x faster than the scalar loop ({loop:.1f} s)"),
    ]
    with tempfile.TemporaryDirectory() as folder:
        path = _record(Path(folder))
        check = time_process([str(VENV_BIN / "fieldmode"), "spectrum", str(path), "--signal-unit", "g", "--json"],
                             repeats=5)
        baseline = time_process([str(VENV_BIN / "python"), "-c",
                                 "import numpy, scipy.signal, pint; "
                                 f"numpy.loadtxt({str(path)!r}, delimiter=',', skiprows=1)"], repeats=5)
    result.append(BenchRow("fieldmode spectrum 40,000-step record --json, whole process vs numpy, "
                           "scipy.signal, pint + loadtxt", check, baseline, 1.5))
    return result
