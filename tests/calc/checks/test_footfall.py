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


def test_stiff_floor_is_clear() -> None:
    result = evaluate(frequency="12 Hz", lateral_frequency="", structure="floor")
    assert result.values["bands"].si() == "12 Hz: none"
    # From memory: Bachmann & Ammann (1987): jumping harmonic 3 ends at 3 x 3.4 = 10.2 Hz
    assert result.values["margin"].si() == pytest.approx([1.8])
    assert "not needed" in result.values["comfort_check"].si()
    assert not [flag for flag in result.flags if flag.level != "info"]
    assert "lateral_bands" not in result.values


def test_several_frequencies_one_entry_each() -> None:
    result = evaluate(frequency="2.1 Hz", higher_frequencies="7.5 Hz, 12 Hz", structure="floor")
    assert len(result.values["margin"].si()) == 3
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
    ({"higher_frequencies": "4.2 Hz,"}, "Higher vertical modes", "empty item"),
    ({"higher_frequencies": "4 Hz, -3 Hz"}, "Higher vertical modes", "greater than zero"),
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
