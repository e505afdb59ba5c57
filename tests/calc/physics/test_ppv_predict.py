"""BS 5228-2 Annex E predictions against hand-worked values, their inverses and their validity ranges."""

from __future__ import annotations

import pytest
from hypothesis import given, settings
from hypothesis import strategies as st

from fieldmode.calc.physics import ppv_predict as pp

MM = 1e-3


def test_percussive_piling_hand_worked() -> None:
    # From memory: BS 5228-2:2009+A1:2014 Table E.1, v = k_p sqrt(W) / r^1.3, k_p = 1.5 (stiff cohesive / medium
    # dense): W = 10 kJ, r = 10 m: 1.5 x 100 / 10^1.3 = 150 / 19.9526 = 7.5178 mm/s
    assert pp.percussive_piling(10_000.0, 10.0, "stiff or medium dense") == pytest.approx(7.5178 * MM, rel=1e-4)
    # From memory: k_p = 5 at refusal: W = 40 kJ, r = 20 m: 5 x 200 / 20^1.3 = 1000 / 49.1291 = 20.3545 mm/s
    assert pp.percussive_piling(40_000.0, 20.0, "refusal") == pytest.approx(20.3545 * MM, rel=1e-4)


@pytest.mark.parametrize(("probability", "mm_s"), [(0.5, 3.00713), (0.333, 6.31497), (0.05, 13.33160)])
def test_vibratory_piling_hand_worked(probability: float, mm_s: float) -> None:
    # From memory: BS 5228-2:2009+A1:2014 Table E.1, v = k_v / x^1.3, k_v = 60 / 126 / 266 at 50 / 33.3 / 5 %:
    # x = 10 m: 60 / 19.9526 = 3.00713, 126 / 19.9526 = 6.31497, 266 / 19.9526 = 13.3316 mm/s
    assert pp.vibratory_piling(10.0, probability) == pytest.approx(mm_s * MM, rel=1e-5)


def test_vibratory_compaction_hand_worked() -> None:
    # From memory: BS 5228-2:2009+A1:2014 Table E.1, steady: v = k_s sqrt(n_d) (A / (x + L_d))^1.5, k_s = 75 at 50 %:
    # one drum, A = 0.8 mm, L_d = 2 m, x = 8 m: 75 x (0.8 / 10)^1.5 = 75 x 0.0226274 = 1.69706 mm/s
    assert pp.vibratory_compaction(8.0, 0.8 * MM, 2.0) == pytest.approx(1.69706 * MM, rel=1e-5)
    # two drums, 5 %: 276 x sqrt(2) x 0.0226274 = 8.83200 mm/s
    assert pp.vibratory_compaction(8.0, 0.8 * MM, 2.0, drums=2, probability=0.05) == pytest.approx(8.83200 * MM,
                                                                                                   rel=1e-5)
    # From memory: transient: v = k_t sqrt(n_d) A^1.5 / (x + L_d)^1.3, k_t = 65 at 50 %:
    # 65 x 0.8^1.5 / 10^1.3 = 65 x 0.715542 / 19.9526 = 2.33104 mm/s
    assert pp.vibratory_compaction(8.0, 0.8 * MM, 2.0, phase="transient") == pytest.approx(2.33104 * MM, rel=1e-5)


def test_lower_probability_of_exceedance_predicts_more() -> None:
    # Common practice (no source): a value exceeded less often is a higher value
    values = [pp.vibratory_compaction(20.0, 1.0 * MM, 1.5, probability=p) for p in pp.PROBABILITIES]
    assert values == sorted(values)


def test_inverse_hand_worked() -> None:
    # From memory: BS 5228-2 Table E.1 vibratory piling at 50 %: 3.00713 mm/s is reached at 10 m (see above)
    assert pp.vibratory_piling_distance(3.00713 * MM) == pytest.approx(10.0, rel=1e-5)
    # steady compaction: (x + 2) = 0.8 x (75 / 1.69706)^(2/3) = 10 -> x = 8 m
    assert pp.vibratory_compaction_distance(1.69706 * MM, 0.8 * MM, 2.0) == pytest.approx(8.0, rel=1e-5)


@pytest.mark.parametrize(("call", "message"), [
    (lambda: pp.vibratory_piling(0.5), "distance 0.5 m is outside the range of the formula \\(1 to 100 m"),
    (lambda: pp.vibratory_compaction(150.0, 1e-3, 2.0), "distance 150 m is outside.*2 to 110 m"),
    (lambda: pp.vibratory_compaction(10.0, 2e-3, 2.0), "drum amplitude 2 mm is outside.*0.4 to 1.72 mm"),
    (lambda: pp.vibratory_compaction(10.0, 1e-3, 3.0), "drum width 3 m is outside"),
    (lambda: pp.vibratory_compaction(10.0, 1e-3, 2.0, drums=3), "1 or 2"),
    (lambda: pp.vibratory_compaction(10.0, 1e-3, 2.0, phase="rolling"), "'steady' or 'transient'"),
    (lambda: pp.vibratory_piling(10.0, probability=0.2), "one of 0.5, 0.333 or 0.05"),
    (lambda: pp.percussive_piling(50.0, 10.0, "refusal"), "hammer energy 50 J is outside"),
    (lambda: pp.percussive_piling(1000.0, 10.0, "rock"), "unknown ground at the pile toe"),
    (lambda: pp.vibratory_piling(float("nan")), "outside the range"),
    (lambda: pp.vibratory_piling_distance(0.0), "PPV must be a positive"),
    (lambda: pp.vibratory_piling_distance(100 * MM), "closer than the formula's range starts"),
    (lambda: pp.vibratory_piling_distance(0.001 * MM), "beyond the formula's range"),
])
def test_outside_the_formulas_is_refused_with_a_clear_message(call, message: str) -> None:  # noqa: ANN001
    with pytest.raises(ValueError, match=message):
        call()


@settings(max_examples=80, deadline=None)
@given(distance=st.floats(min_value=1.0, max_value=100.0), energy=st.floats(min_value=85.0, max_value=85_000.0),
       ground=st.sampled_from(list(pp.PERCUSSIVE_K)), probability=st.sampled_from(pp.PROBABILITIES))
def test_piling_inverses_round_trip(distance: float, energy: float, ground: str, probability: float) -> None:
    # Common practice (no source): the distance at which the predicted PPV is reached gives back that PPV
    v = pp.percussive_piling(energy, distance, ground)
    assert pp.percussive_piling_distance(v, energy, ground) == pytest.approx(distance, rel=1e-9)
    v = pp.vibratory_piling(distance, probability)
    assert pp.vibratory_piling_distance(v, probability) == pytest.approx(distance, rel=1e-9)


@settings(max_examples=80, deadline=None)
@given(distance=st.floats(min_value=2.0, max_value=110.0), amplitude=st.floats(min_value=0.4e-3, max_value=1.72e-3),
       width=st.floats(min_value=0.75, max_value=2.2), drums=st.sampled_from([1, 2]),
       probability=st.sampled_from(pp.PROBABILITIES), phase=st.sampled_from(pp.PHASES))
def test_compaction_inverse_round_trips(distance: float, amplitude: float, width: float, drums: int,
                                        probability: float, phase: str) -> None:
    # Common practice (no source): the distance at which the predicted PPV is reached gives back that PPV
    v = pp.vibratory_compaction(distance, amplitude, width, drums, probability, phase)
    back = pp.vibratory_compaction_distance(v, amplitude, width, drums, probability, phase)
    assert back == pytest.approx(distance, rel=1e-9)
