"""Time-domain oracle: a harmonic force on a simply supported beam, by modal superposition with solve_ivp.

Mode k of a uniform simply supported span L has the shape sin(k pi x / L), the modal mass m L / 2 for
every k and the frequency k^2 f1. A force F sin(2 pi f_F t) standing at ``position`` or walking across
the span at ``speed`` (gone once it reaches the far support) drives each mode through the mode's
amplitude where the force is. Written independently of the code under test.
"""

from __future__ import annotations

import math

import numpy as np


def beam_acceleration(*, first_frequency: float, damping: float, modal_mass: float, force: float,
                      forcing_frequency: float, span: float, duration: float, speed: float | None = None,
                      position: float | None = None, modes: int = 1, at: float | None = None,
                      samples_per_cycle: int = 200) -> tuple[np.ndarray, np.ndarray]:
    """Times (s) and acceleration (m/s^2) at ``at`` (default midspan) of the first ``modes`` modes.

    Either ``speed`` (m/s, the force walks from x = 0) or ``position`` (m, the force stands there).
    """
    from scipy.integrate import solve_ivp

    omega = np.array([(k**2) * 2.0 * math.pi * first_frequency for k in range(1, modes + 1)])
    numbers = np.arange(1, modes + 1)
    forcing = 2.0 * math.pi * forcing_frequency
    where = span / 2.0 if at is None else at
    receiver = np.sin(numbers * math.pi * where / span)

    def load(t: float) -> np.ndarray:
        if speed is not None:
            x = speed * t
            if x > span:
                return np.zeros(modes)
        else:
            assert position is not None
            x = position
        return force * math.sin(forcing * t) * np.sin(numbers * math.pi * x / span) / modal_mass

    def rates(t: float, state: np.ndarray) -> np.ndarray:
        q, v = state[:modes], state[modes:]
        return np.concatenate([v, load(t) - 2.0 * damping * omega * v - omega**2 * q])

    period = 1.0 / max(forcing_frequency, first_frequency)
    steps = int(duration / period * samples_per_cycle) + 1
    times = np.linspace(0.0, duration, steps)
    solution = solve_ivp(rates, (0.0, duration), np.zeros(2 * modes), t_eval=times, rtol=1e-10, atol=1e-13,
                         method="DOP853")
    assert solution.success, solution.message
    q, v = solution.y[:modes], solution.y[modes:]
    x = np.full_like(times, np.nan if position is None else position) if speed is None else speed * times
    on_span = (x <= span)[None, :]
    forces = force * np.sin(forcing * times)[None, :] * np.sin(numbers[:, None] * math.pi * x[None, :] / span)
    loads = np.where(on_span, forces, 0.0) / modal_mass
    accelerations = loads - 2.0 * damping * omega[:, None] * v - omega[:, None] ** 2 * q
    return times, receiver @ accelerations
