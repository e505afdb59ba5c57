"""Check `ppv-distance`: BS 5228-2 Annex E predictions worked by hand, the inverse, the method's fields,
ranges, the command line and bad input."""

from __future__ import annotations

import json

import pytest

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.framework.units import InputError
from fieldmode.tui.cli import main

SPEC = BY_ID["ppv-distance"]
MM = 1e-3

# Invented scenario: sheet piles vibrated in beside a terrace, a roller on the new access road, a drop hammer
# for the bearing piles.
VIBRATORY = {"method": "vibratory piling", "distance": "12 m", "limit": "5 mm/s", "probability": "5 %"}
COMPACTION = {"method": "vibratory compaction", "distance": "10 m", "limit": "3 mm/s", "probability": "5 %",
              "amplitude": "0.8 mm", "drum_width": "1.7 m"}
PERCUSSIVE = {"method": "percussive piling", "distance": "10 m", "limit": "10 mm/s", "energy": "30 kJ",
              "ground": "stiff or medium dense"}


def _run(texts: dict[str, str]) -> dict[str, object]:
    return SPEC.evaluate(texts).values  # type: ignore[return-value]


def _si(texts: dict[str, str], name: str) -> float:
    result = SPEC.evaluate(texts)
    number = result.number(name)
    assert number is not None, name
    return number


@pytest.mark.parametrize(("probability", "k"), [("50 %", 60.0), ("33.3 %", 126.0), ("5 %", 266.0)])
def test_vibratory_piling_by_hand(probability: str, k: float) -> None:
    # From memory: BS 5228-2:2009+A1:2014 Annex E, Table E.1: v = k_v / x^1.3 (mm/s), k_v 60 / 126 / 266
    # for 50 % / 33.3 % / 5 % chance of exceedance
    texts = VIBRATORY | {"probability": probability}
    assert _si(texts, "ppv") == pytest.approx(k / 12**1.3 * MM, rel=1e-12)
    # the inverse by hand: x = (k_v / v)^(1/1.3)
    assert _si(texts, "limit_distance") == pytest.approx((k / 5.0) ** (1 / 1.3), rel=1e-12)
    assert _si(texts, "factor") == k


def test_vibratory_piling_worked_figures() -> None:
    # From memory: BS 5228-2:2009+A1:2014 Annex E: 266 / 12^1.3 = 266 / 25.29 = 10.52 mm/s at 12 m, and
    # 5 mm/s is reached at (266 / 5)^(1/1.3) = 53.2^0.769 = 21.26 m
    assert _si(VIBRATORY, "ppv") == pytest.approx(10.52 * MM, rel=1e-3)
    assert _si(VIBRATORY, "limit_distance") == pytest.approx(21.26, rel=1e-3)
    assert _si(VIBRATORY, "ratio") == pytest.approx(10.52 / 5, rel=1e-3)
    flags = [flag.text for flag in SPEC.evaluate(VIBRATORY).flags]
    assert any("exceeds the limit" in text for text in flags)


def test_percussive_piling_by_hand() -> None:
    # From memory: BS 5228-2:2009+A1:2014 Annex E: v = k_p sqrt(W) / r^1.3, k_p = 1.5 for stiff cohesive or
    # medium dense ground: 1.5 x sqrt(30000) / 10^1.3 = 1.5 x 173.2 / 19.95 = 13.02 mm/s
    assert _si(PERCUSSIVE, "ppv") == pytest.approx(1.5 * 30000**0.5 / 10**1.3 * MM, rel=1e-12)
    assert _si(PERCUSSIVE, "ppv") == pytest.approx(13.02 * MM, rel=1e-3)
    # inverse: r = (k_p sqrt(W) / v)^(1/1.3) = 25.98^0.769 = exp(0.769 x 3.257) = 12.25 m
    assert _si(PERCUSSIVE, "limit_distance") == pytest.approx((1.5 * 30000**0.5 / 10) ** (1 / 1.3), rel=1e-12)
    assert _si(PERCUSSIVE, "limit_distance") == pytest.approx(12.25, rel=1e-3)


def test_vibratory_compaction_by_hand() -> None:
    # From memory: BS 5228-2:2009+A1:2014 Annex E: steady v = k_s sqrt(n_d) (A / (x + L_d))^1.5, k_s = 276 at 5 %:
    # 276 x (0.8 / 11.7)^1.5 = 276 x 0.01788 = 4.935 mm/s
    assert _si(COMPACTION, "ppv") == pytest.approx(276 * (0.8 / 11.7) ** 1.5 * MM, rel=1e-12)
    assert _si(COMPACTION, "ppv") == pytest.approx(4.935 * MM, rel=1e-3)
    # inverse: x = A (k_s sqrt(n_d) / v)^(1/1.5) - L_d = 0.8 x 92^0.667 - 1.7 = 14.63 m
    assert _si(COMPACTION, "limit_distance") == pytest.approx(0.8 * (276 / 3) ** (1 / 1.5) - 1.7, rel=1e-12)


def test_vibratory_compaction_start_up_with_two_drums_by_hand() -> None:
    # From memory: BS 5228-2:2009+A1:2014 Annex E: start-up and run-down v = k_t sqrt(n_d) A^1.5 / (x + L_d)^1.3,
    # k_t = 177 at 5 %: 177 x 1.414 x 0.7155 / 11.7^1.3 = 179.1 / 24.47 = 7.320 mm/s
    texts = COMPACTION | {"drums": "2", "phase": "start-up and run-down"}
    assert _si(texts, "ppv") == pytest.approx(177 * 2**0.5 * 0.8**1.5 / 11.7**1.3 * MM, rel=1e-12)
    assert _si(texts, "ppv") == pytest.approx(7.320 * MM, rel=1e-3)


@pytest.mark.parametrize("texts", [VIBRATORY, COMPACTION, PERCUSSIVE,
                                   COMPACTION | {"drums": "2", "phase": "start-up and run-down"}])
@pytest.mark.parametrize("distance", ["3 m", "17.5 m", "60 m"])
def test_the_inverse_gives_back_the_distance(texts: dict[str, str], distance: str) -> None:
    # Common practice (no source): the distance at which the predicted PPV equals a limit, fed back, gives
    # that PPV
    ppv = _si(texts | {"distance": distance}, "ppv")
    back = _si(texts | {"distance": distance, "limit": f"{ppv} m/s"}, "limit_distance")
    assert back == pytest.approx(float(distance.split()[0]), rel=1e-9)


def test_series_fall_with_distance_over_the_formula_range_with_the_limit_line() -> None:
    result = SPEC.evaluate(VIBRATORY)
    distance, ppv, limit = (result.series[name] for name in ("distance", "ppv", "limit"))
    # From memory: BS 5228-2 Annex E, vibratory piling fitted from 1 to 100 m
    assert distance[0] == pytest.approx(1.0) and distance[-1] == pytest.approx(100.0)
    assert (ppv[1:] < ppv[:-1]).all()
    assert ppv[0] == pytest.approx(266 * MM)  # Source: k_v / 1^1.3 = k_v
    assert (limit == 5 * MM).all()


def test_a_distance_outside_the_range_is_not_extrapolated() -> None:
    result = SPEC.evaluate(VIBRATORY | {"distance": "150 m"})
    assert result.values["ppv"].magnitude == "outside the range"
    assert any(flag.level == "warning" and "not extrapolated" in flag.text for flag in result.flags)
    # the inverse still answers
    assert result.number("limit_distance") == pytest.approx((266 / 5) ** (1 / 1.3))


def test_a_limit_past_or_within_the_range_is_said() -> None:
    far = SPEC.evaluate(VIBRATORY | {"limit": "0.1 mm/s"})
    assert far.values["limit_distance"].magnitude == "past the range"
    assert any(flag.level == "warning" and "beyond the formula's range" in flag.text for flag in far.flags)
    near = SPEC.evaluate(VIBRATORY | {"limit": "300 mm/s"})  # above k_v at 1 m: met everywhere
    assert near.values["limit_distance"].magnitude == "all of the range"


def test_fields_the_method_does_not_use_are_ignored_and_said() -> None:
    texts = VIBRATORY | {"energy": "30 kJ", "amplitude": "0.8 mm"}
    result = SPEC.evaluate(texts)
    assert result.number("ppv") == _si(VIBRATORY, "ppv")
    # the framework notes each field the chosen method does not use
    assert [flag.text for flag in result.flags if "ignored" in flag.text] == [
        "Hammer energy per blow ignored: used only when method is percussive piling (here vibratory piling)",
        "Drum amplitude, nominal ignored: used only when method is vibratory compaction (here vibratory piling)"]


def test_constants_are_said_to_be_from_memory() -> None:
    result = SPEC.evaluate(VIBRATORY)
    assert any(flag.level == "caution" and "from memory" in flag.text for flag in result.flags)
    assert all("from memory" in reference.source for reference in result.references)
    assert "licensed engineer" in result.caution and "screening references" in result.caution


@pytest.mark.parametrize(("texts", "field", "words"), [
    (VIBRATORY | {"probability": "10 %"}, "Chance of exceedance", "50 %, 33.3 % or 5 %"),
    ({"method": "vibratory piling", "probability": "5 %"}, "Distance from the source", "give a distance"),
    (PERCUSSIVE | {"energy": ""}, "Hammer energy per blow", "needed for percussive piling"),
    (PERCUSSIVE | {"energy": "100 MJ"}, "Hammer energy per blow", "outside the range of the formula"),
    (PERCUSSIVE | {"ground": ""}, "Ground at the pile toe", "needed"),
    (COMPACTION | {"amplitude": "3 mm"}, "Drum amplitude, nominal", "outside the range"),
    (COMPACTION | {"drums": "3"}, "Vibrating drums", "1 or 2"),
    (VIBRATORY | {"distance": "0 m"}, "Distance from the source", "greater than zero"),
])
def test_bad_input_names_the_field(texts: dict[str, str], field: str, words: str) -> None:
    with pytest.raises(InputError) as caught:
        SPEC.evaluate(texts)
    assert caught.value.field == field and words in str(caught.value)


def test_command_line_text_and_json(capsys: pytest.CaptureFixture[str]) -> None:
    assert main(["ppv-distance", "--method", "vibratory piling", "--distance", "12 m", "--limit", "5 mm/s",
                 "--probability", "5 %"]) == 0
    lines = [" ".join(line.split()) for line in capsys.readouterr().out.splitlines()]
    assert "Predicted PPV 10.52 mm/s" in lines and "Limit met beyond 21.26 m" in lines
    assert main(["ppv-distance", "--method", "percussive piling", "--distance", "10 m", "--energy", "30 kJ",
                 "--ground", "stiff or medium dense", "--json"]) == 0
    data = json.loads(capsys.readouterr().out)
    assert data["results"]["ppv"]["value"] == pytest.approx(13.02e-3, rel=1e-3)  # From memory: Annex E, as above
    assert data["results"]["ppv"]["unit"] == "m/s"


@pytest.mark.parametrize("argv", [
    ["ppv-distance", "--method", "vibratory piling", "--distance", "12 m", "--probability", "10 %"],
    ["ppv-distance", "--method", "hammering", "--distance", "12 m"],
    ["ppv-distance", "--method", "percussive piling", "--distance", "12 m", "--ground", "refusal"],
])
def test_bad_input_on_the_command_line_exits_2_with_one_line(capsys: pytest.CaptureFixture[str],
                                                             argv: list[str]) -> None:
    assert main(argv) == 2
    captured = capsys.readouterr()
    assert captured.out == "" and len(captured.err.strip().splitlines()) == 1
