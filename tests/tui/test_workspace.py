"""Shared values and values sent between checks, by meaning, without the screen."""

from __future__ import annotations

import dataclasses

import pytest
from helpers.specs import TWIN

from fieldmode.calc.checks import BY_ID, SPECS, sdof
from fieldmode.calc.framework.units import read
from fieldmode.tui.present import field_text
from fieldmode.tui.session import SessionData, parse_session
from fieldmode.tui.workspace import Workspace

OTHER = dataclasses.replace(sdof.SPEC, id="sdof-c", title="Third mass",
                            fields=tuple(dataclasses.replace(f, default="18 t") if f.name == "mass" else f
                                         for f in sdof.SPEC.fields))


def test_a_shared_value_is_kept_once_and_a_check_that_differed_keeps_its_own():
    space = Workspace((sdof.SPEC, TWIN, OTHER))
    assert space.own["sdof-c"] == {"mass"}  # its demo mass differed: kept as its own value, not lost
    assert space.set_text("sdof", "mass", "10 t") == [("sdof-b", "mass")]
    assert space.texts["sdof-b"]["mass"] == "10 t" and space.texts["sdof-c"]["mass"] == "18 t"
    assert space.set_text("sdof", "stiffness", "9 kN/mm") == []  # not a shared field
    assert space.texts["sdof-b"]["stiffness"] == "42 kN/mm"
    saved = space.snapshot()
    assert saved.shared["structure: mass"] == "10 t" and "mass" not in saved.texts["sdof"]
    assert saved.texts["sdof-c"]["mass"] == "18 t"


def test_fields_of_different_meanings_are_never_linked():
    space = Workspace(SPECS)
    # the structure's mass (sdof, forced) and the machine's mass on its mounts (isolate) are two values
    space.set_text("forced", "mass", "12 t")
    assert space.texts["sdof"]["mass"] == "12 t" and space.texts["isolate"]["mass"] == "9.6 t"
    space.set_text("isolate", "frequency", "980 rpm")  # the same machine: forced follows
    assert space.texts["forced"]["frequency"] == "980 rpm"
    assert space.texts["tmd"]["frequency"] == "2.1 Hz"  # a structure's frequency is not a machine's


def test_own_value_stops_sharing_both_ways_until_shared_again():
    space = Workspace((sdof.SPEC, TWIN))
    assert space.toggle_own("sdof-b", "mass") is True
    assert space.set_text("sdof-b", "mass", "4 t") == []
    assert space.set_text("sdof", "mass", "4 t") == []  # sdof-b keeps its own even when texts agree
    assert space.sharing("sdof-b", "mass") == []
    assert space.toggle_own("sdof-b", "mass") is False
    assert space.sharing("sdof-b", "mass") == [("sdof", "mass")]
    assert space.set_text("sdof-b", "mass", "5 t") == [("sdof", "mass")]


def test_a_version_1_session_loads_without_losing_what_was_typed():
    # Common practice (no source): a newer program reads the files an older one wrote
    old = parse_session('{"format": "fieldmode-session", "version": 1, "current": "isolate", "checks": '
                        '{"sdof": {"mass": "9.6 t"}, "forced": {"mass": "11 t"}, "isolate": {"mass": "2.4 t"}}}')
    space = Workspace(SPECS, old)
    assert space.texts["sdof"]["mass"] == "9.6 t" and space.texts["forced"]["mass"] == "11 t"
    assert space.texts["isolate"]["mass"] == "2.4 t"
    assert "mass" in space.own["forced"]  # it differed from sdof's: its own now
    again = Workspace(SPECS, parse_session(space.snapshot().to_json()))
    assert again.texts == space.texts and again.own == space.own


def test_send_offers_only_fields_of_the_same_meaning():
    space = Workspace(SPECS)
    decay = BY_ID["decay"].evaluate(space.texts["decay"])
    targets = space.send_targets("decay", decay)
    reached = {(check, name) for target in targets for check, name in target.fields}
    # the structure's damping and natural frequency: yes
    assert {("sdof", "damping"), ("forced", "damping"), ("tmd", "damping"), ("tmd", "frequency"),
            ("footfall", "frequency")} <= reached
    # a machine's operating frequency, the mounts' damping, the building's seismic damping: never
    assert not reached & {("forced", "frequency"), ("isolate", "frequency"), ("isolate", "damping"),
                          ("design-spectrum", "damping"), ("spectrum", "damping"), ("storeys", "damping")}
    notes = " | ".join(space.not_offered("decay", decay))
    assert "damping ratio of the building" in notes and "type it there yourself" in notes


def test_member_stiffness_never_reaches_the_mounts():
    space = Workspace(SPECS)
    member = BY_ID["member"].evaluate(space.texts["member"])
    reached = {(check, name) for target in space.send_targets("member", member) for check, name in target.fields}
    assert ("sdof", "stiffness") in reached and ("forced", "stiffness") in reached
    assert ("isolate", "stiffness") not in reached


def test_applying_fills_the_ticked_fields_and_empties_their_alternatives():
    space = Workspace((sdof.SPEC, TWIN))
    space.texts["sdof"].update(stiffness="", static_deflection="2 mm")
    result = TWIN.evaluate(space.texts["sdof-b"])
    targets = space.send_targets("sdof-b", result)
    stiffness = next(t for t in targets if t.label == "Stiffness")
    assert stiffness.fields == [("sdof", "stiffness")] and stiffness.clears == [("sdof", "static_deflection")]
    for target in targets:
        target.ticked = target is stiffness
    assert space.apply(targets) == [stiffness]
    assert space.texts["sdof"]["stiffness"] == "42 kN/mm" and space.texts["sdof"]["static_deflection"] == ""
    assert sdof.SPEC.evaluate(space.texts["sdof"]).values["stiffness"].si() == pytest.approx(42e6)


@pytest.mark.parametrize("system", ["si", "us"])
def test_sent_text_reads_back_to_the_same_value(system):
    result = sdof.SPEC.evaluate(sdof.SPEC.demo_texts())
    for value in result.values.values():
        if value.is_word or value.kind not in ("stiffness", "frequency", "length", "mass"):
            continue
        text = field_text(value.magnitude, value.kind, system)
        assert read(text, value.kind).si == pytest.approx(value.si(), rel=1e-5)


def test_restore_keeps_known_checks_and_fields_only():
    data = SessionData({"sdof": {"mass": "3 t", "ghost": "1"}, "gone": {"mass": "1 t"}}, "us", "sdof",
                       {"sdof": ["damping", "ghost"]})
    space = Workspace(SPECS, data)
    assert space.texts["sdof"]["mass"] == "3 t" and "ghost" not in space.texts["sdof"]
    assert space.texts["sdof"]["stiffness"] == sdof.SPEC.field("stiffness").default
    assert space.system == "us" and space.own["sdof"] == {"damping"}
    assert "gone" not in space.texts


def test_alternatives_shown_are_restored_and_a_shared_text_never_switches_them():
    data = SessionData({"sdof": {"damping_coefficient": "3 kN*s/m"}}, shared={"structure: damping ratio": ""},
                       alternatives={"sdof": {"stiffness": "static_deflection", "nonsense": "mass"},
                                     "gone": {"stiffness": "stiffness"}})
    space = Workspace((sdof.SPEC, BY_ID["forced"]), data)
    assert space.shown["sdof"] == {"stiffness": "static_deflection", "damping": "damping_coefficient"}
    assert space.hidden("sdof") == {"stiffness", "damping"}
    space.set_text("forced", "damping", "4 %")  # shared into sdof's damping, which is not shown
    assert space.texts["sdof"]["damping"] == "4 %" and space.hidden("sdof") == {"stiffness", "damping"}
    used = space.used_texts("sdof")
    assert used["damping"] == "" and used["damping_coefficient"] == "3 kN*s/m" and used["stiffness"] == ""
    assert space.switch_alternative("sdof", "static_deflection") == "stiffness"
    assert space.snapshot().alternatives["sdof"]["stiffness"] == "stiffness"
    assert space.switch_alternative("sdof", "mass") is None  # no alternative
