"""Check `footfall`: frequencies against the forcing bands, and bad input."""

from __future__ import annotations

import numpy as np
import pytest

from fieldmode.calc.checks import BY_ID
from fieldmode.calc.framework.units import InputError

SPEC = BY_ID["footfall"]


def evaluate(**texts: str):  # noqa: ANN201
    given_texts = SPEC.demo_texts()
    given_texts.update(texts)
    return SPEC.evaluate({k: v for k, v in given_texts.items() if v})


def test_demo_footbridge_is_in_the_walking_bands() -> None:
    result = evaluate()
    # From memory: Setra (2006) vertical range 1 is 1.7-2.1 Hz; lateral range 1 is 0.5-1.1 Hz
    assert "Setra 1 max risk" in result.values["bands"].si()
    assert "Setra lateral 1 max risk" in result.values["lateral_bands"].si()
    # From memory: EN 1990 A2.4.3.2: below 5 Hz vertical and 2.5 Hz lateral, comfort is to be verified
    assert "needed" in result.values["comfort_check"].si()
    assert "needed" in result.values["lateral_comfort_check"].si()
    assert any(flag.level == "warning" for flag in result.flags)
    assert any("EN 1990" in ref.source for ref in result.references)


def test_stiff_floor_is_clear_but_still_needs_a_transient_check() -> None:
    result = evaluate(frequency="12 Hz", lateral_frequency="", structure="floor")
    assert result.values["bands"].si() == "12 Hz: none"
    # From memory: Bachmann & Ammann (1987): jumping harmonic 3 ends at 3 x 3.4 = 10.2 Hz
    assert result.values["margin_run_jump"].si() == "clear by 1.8 Hz"
    # Source: Eurocode teaching material (confirmed in one copy): walking h4 ends at 4 x 2.4 = 9.6 Hz
    assert result.values["margin_walking"].si() == "clear by 2.4 Hz"
    assert not [flag for flag in result.flags if flag.level != "info"]
    assert "lateral_bands" not in result.values
    # Source: SCI P354 (10 Hz) and AISC Design Guide 11 (2nd ed.) 4.1 (9 Hz), both confirmed in quotations:
    # above the low-frequency limit the floor answers footfalls as impulses, so a transient check applies
    assert "not needed" not in result.values["comfort_check"].si()
    assert "transient" in result.values["comfort_check"].si()
    note = next(flag.text for flag in result.flags if "low-frequency limit" in flag.text)
    assert "transient" in note and "9 Hz AISC DG11" in note and "10 Hz SCI P354" in note


def test_floor_near_jumping_says_why() -> None:
    result = evaluate(frequency="11 Hz", lateral_frequency="", structure="floor")
    # From memory: Bachmann & Ammann (1987): jumping h3 is 5.4-10.2 Hz, 0.8 Hz below 11 Hz (within 10 %)
    near = next(flag for flag in result.flags if "jumping h3" in flag.text)
    assert near.level == "caution" and "0.8 Hz" in near.text and "walking cannot" in near.text
    assert "not needed" not in result.values["comfort_check"].si()


def test_floor_between_the_two_guides_limits_says_which() -> None:
    result = evaluate(frequency="9.5 Hz", lateral_frequency="", structure="floor")
    # Source: AISC DG11 (2nd ed.) 4.1 up to 9 Hz; SCI P354 below 10 Hz (both confirmed in quotations)
    assert "SCI P354" in result.values["comfort_check"].si()
    assert any("SCI P354" in flag.text and "AISC DG11" in flag.text for flag in result.flags)


def test_margins_are_per_source_not_of_all_bands_merged() -> None:
    result = evaluate(frequency="1.9 Hz", lateral_frequency="")
    # Source: Eurocode teaching material (confirmed in one copy): 1.9 Hz is 0.2 Hz inside walking 1.7-2.4 Hz
    assert result.values["margin_walking"].si() == "0.2 Hz to clear"
    # From memory: Setra (2006) ranges run 1.0-5.0 Hz without a gap: 0.9 Hz down to clear them
    assert result.values["margin_setra"].si() == "0.9 Hz to clear"
    # From memory: HiVoSS critical range 1.25-2.3 Hz: 0.4 Hz to its upper edge
    assert result.values["margin_hivoss"].si() == "0.4 Hz to clear"
    # 1.6 Hz would still be in the HiVoSS critical range: the walking margin alone does not clear it
    assert "HiVoSS critical" in result.values["bands"].si()


def test_no_warning_for_a_low_risk_range() -> None:
    result = evaluate(frequency="3.5 Hz", lateral_frequency="")
    # From memory: Setra (2006) range 3 (2.6-5 Hz) is low risk: a note, never a warning
    for flag in result.flags:
        if "Setra 3 low risk" in flag.text:
            assert flag.level == "info"
    assert not any(flag.level == "warning" and "low risk" in flag.text for flag in result.flags)
    evaluated = evaluate(frequency="4.7 Hz", lateral_frequency="")
    # 4.7 Hz lies in walking h2 (3.4-4.8) and Setra 3 only: no first harmonic, no maximum-risk range
    assert not any(flag.level == "warning" for flag in evaluated.flags)


def test_one_lateral_verdict_at_the_edge_of_two_risk_ranges() -> None:
    result = evaluate(lateral_frequency="1.1 Hz")
    # From memory: Setra (2006) lateral range 1 is 0.5-1.1 Hz, range 2 is 1.1-1.3 Hz: 1.1 Hz is listed once
    bands = result.values["lateral_bands"].si()
    assert "Setra lateral 1 max risk" in bands and "Setra lateral 2" not in bands
    assert not any("Setra lateral 2" in flag.text for flag in result.flags)


def test_several_frequencies_one_entry_each() -> None:
    result = evaluate(frequency="2.1 Hz", higher_frequencies="7.5 Hz, 12 Hz", structure="floor")
    assert result.values["margin_walking"].si().count("Hz:") == 3
    assert result.values["bands"].si().count("Hz:") == 3
    np.testing.assert_allclose(result.series["frequencies"], [2.1, 7.5, 12.0])


def test_rpm_and_angular_units() -> None:
    result = evaluate(frequency="126 rpm")
    # Source: 126 cycles per minute is 2.1 Hz (rpm is cycles per minute; NIST SP 811)
    np.testing.assert_allclose(result.series["frequencies"], [2.1])


@pytest.mark.parametrize(("texts", "field", "words"), [
    ({"frequency": ""}, "Vertical frequency", "required"),
    ({"frequency": "2.1 Hz, 4 Hz"}, "Vertical frequency", "comma"),
    ({"frequency": "0 Hz"}, "Vertical frequency", "greater than zero"),
    ({"higher_frequencies": "4.2 Hz,"}, "Higher vertical frequencies", "empty item"),
    ({"higher_frequencies": "4 Hz, -3 Hz"}, "Higher vertical frequencies", "greater than zero"),
    ({"lateral_frequency": "1 t"}, "Lateral frequencies #1", "not a unit of frequency"),
    ({"structure": "tower"}, "Structure", "not one of the choices"),
])
def test_bad_inputs_name_the_field(texts: dict[str, str], field: str, words: str) -> None:
    given_texts = SPEC.demo_texts()
    given_texts.update(texts)
    with pytest.raises(InputError) as caught:
        SPEC.evaluate(given_texts)
    assert str(caught.value).startswith(field)
    assert words in str(caught.value)
