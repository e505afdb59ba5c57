"""Shared fields and values sent between checks, without the screen."""

from __future__ import annotations

import dataclasses

import pytest
from helpers.specs import TWIN

from fieldmode.calc.checks import SPECS, sdof
from fieldmode.tui.present import field_text
from fieldmode.tui.session import SessionData
from fieldmode.tui.workspace import Workspace

OTHER = dataclasses.replace(sdof.SPEC, id="sdof-c", title="Third mass",
                            fields=tuple(dataclasses.replace(f, default="18 t") if f.name == "mass" else f
                                         for f in sdof.SPEC.fields))


def test_typing_a_shared_field_moves_only_the_checks_showing_the_same_text():
    space = Workspace((sdof.SPEC, TWIN, OTHER))
    assert space.set_text("sdof", "mass", "10 t") == [("sdof-b", "mass")]
    assert space.texts["sdof-b"]["mass"] == "10 t" and space.texts["sdof-c"]["mass"] == "18 t"
    assert space.set_text("sdof", "stiffness", "9 kN/mm") == []  # not a shared field
    assert space.texts["sdof-b"]["stiffness"] == "42 kN/mm"


def test_own_value_stops_sharing_both_ways_until_shared_again():
    space = Workspace((sdof.SPEC, TWIN))
    assert space.toggle_own("sdof-b", "mass") is True
    assert space.set_text("sdof-b", "mass", "4 t") == []
    assert space.set_text("sdof", "mass", "4 t") == []  # sdof-b keeps its own even when texts agree
    assert space.linked_count("sdof-b", "mass") == 0
    assert space.toggle_own("sdof-b", "mass") is False
    assert space.linked_count("sdof-b", "mass") == 1
    assert space.set_text("sdof-b", "mass", "5 t") == [("sdof", "mass")]


def test_send_fills_the_field_and_empties_its_alternatives():
    space = Workspace((sdof.SPEC, TWIN))
    space.texts["sdof"].update(stiffness="", static_deflection="2 mm")
    result = TWIN.evaluate(space.texts["sdof-b"])
    sent = space.send("sdof-b", result)
    assert [(s.check, s.field) for s in sent] == [("sdof", "stiffness")]
    assert space.texts["sdof"]["stiffness"] == "42 kN/mm" and space.texts["sdof"]["static_deflection"] == ""
    assert sdof.SPEC.evaluate(space.texts["sdof"]).values["stiffness"].si() == pytest.approx(42e6)


@pytest.mark.parametrize("system", ["si", "us"])
def test_sent_text_reads_back_to_the_same_value(system):
    result = sdof.SPEC.evaluate(sdof.SPEC.demo_texts())
    for value in result.values.values():
        if value.is_word or value.kind not in ("stiffness", "frequency", "length", "mass"):
            continue
        text = field_text(value.magnitude, value.kind, system)
        from fieldmode.calc.framework.units import read

        assert read(text, value.kind).si == pytest.approx(value.si(), rel=1e-5)


def test_restore_keeps_known_checks_and_fields_only():
    data = SessionData({"sdof": {"mass": "3 t", "ghost": "1"}, "gone": {"mass": "1 t"}}, "us", "sdof",
                       {"sdof": ["damping", "ghost"]})
    space = Workspace(SPECS, data)
    assert space.texts["sdof"]["mass"] == "3 t" and "ghost" not in space.texts["sdof"]
    assert space.texts["sdof"]["stiffness"] == sdof.SPEC.field("stiffness").default
    assert space.system == "us" and space.own["sdof"] == {"damping"}
    assert "gone" not in space.texts
