"""Check `occupants`: human response to building vibration from a measured acceleration record.

Weighted r.m.s., MTVV, crest factor and VDV (of the record, and for a 16 h day or 8 h night) with the
BS 6472-1:2008 range the VDV falls in, and the response factor against the ISO 10137 base curve with the
multiplying factor of the floor's use. The physics is :mod:`fieldmode.calc.records.human_response`.
"""

from __future__ import annotations

import math
from typing import TYPE_CHECKING

import numpy as np

from fieldmode.calc.demo import LIVELY_FLOOR, demo_name
from fieldmode.calc.framework.guard import overflow_guard
from fieldmode.calc.framework.result import MEASURED_CAUTION, Flag, InputFile, Reference, Result, Value, quantity, word
from fieldmode.calc.framework.spec import CheckSpec, Field, Series
from fieldmode.calc.records.columns import RECORD_COLUMN_FIELDS, record_from_fields

if TYPE_CHECKING:
    from fieldmode.calc.framework.reading import Inputs
    from fieldmode.calc.records.human_response import EstimatedVdv, VdvBand
    from fieldmode.calc.records.read import Record


WEIGHTINGS = ("Wb", "Wk", "Wd", "Wm")
DIRECTIONS = ("vertical", "horizontal")
PERIODS = ("day", "night")
PERIOD_NAMES = {"day": "16 h day", "night": "8 h night"}
USES = ("residential", "office", "workshop", "critical")
DEFAULT_WEIGHTING = {"vertical": "Wb", "horizontal": "Wd"}
"""Weighting taken when none is chosen: BS 6472-1:2008 uses Wb for vertical and Wd for horizontal vibration."""
BASE_WEIGHTING = {"vertical": "Wb", "horizontal": "Wd"}
"""Weighting whose r.m.s. is compared with the flat part of the base curve (the MTVV response factor)."""
WEIGHTING_DIRECTIONS = {"Wb": ("vertical",), "Wk": ("vertical",), "Wd": ("horizontal",),
                        "Wm": ("vertical", "horizontal")}
"""Directions each weighting is meant for (Wm: any direction in buildings)."""
LOWEST_BAND_LIMIT = 4.0
"""The record must resolve the one-third-octave band at this centre (Hz) or lower: about 3.3 s or more."""
COMMENT = {
    "below the lowest range of the table": "below the lowest range",
    "low probability of adverse comment": "low probability",
    "adverse comment possible": "possible",
    "adverse comment probable": "probable",
    "above the highest range of the table": "above the highest range",
}
"""The BS 6472-1 range's meaning, short enough for the results column at 80x24."""
INTERMITTENT = 2.0
"""The vibration is said to come and go when the MTVV response factor exceeds the band one this many times."""
MAX_EVENTS = 100_000
"""Most events of the record accepted in one period."""
MAX_ACCELERATION = 1000.0
"""Largest acceleration accepted (m/s^2); more means a wrong signal unit."""
LOUD_ACCELERATION = 2.0
"""Peak acceleration (m/s^2) above which a caution asks to check the unit: far above building vibration."""
HIGHEST_BAND = 80.0
"""Nominal centre of the highest one-third-octave band (Hz), where the base curves end."""
RUNNING_POINTS = 1000
"""Most points of the running r.m.s. curve: the largest value of each stretch is kept."""
OTHER_USES_NOTE = ("BS 6472-1 Table 1 is for residential buildings; about twice its values for offices and "
                   "four times for workshops (from memory)")

FIELDS = (
    Field("file", "Record file", "path", demo_name(LIVELY_FLOOR), positional=True,
          help="CSV or text: a time column and an acceleration column, or the signal and --sample-rate"),
    *RECORD_COLUMN_FIELDS,
    Field("signal_unit", "Signal unit", "text", "", required=False,
          help="m/s^2, mm/s^2, g or mg; default from the header"),
    Field("direction", "Direction", "choice", "vertical", choices=DIRECTIONS, required=False,
          help="picks the base curve and the default weighting; default vertical"),
    Field("weighting", "Weighting", "choice", "", choices=WEIGHTINGS, required=False,
          help="default Wb for vertical, Wd for horizontal (BS 6472-1)"),
    Field("period", "Period", "choice", "day", choices=PERIODS, required=False,
          help="16 h day or 8 h night, for the VDV and the residential factor; default day"),
    Field("events", "Events in the period", "count", "", required=False,
          help="how many times the recorded event happens in the period; "
               "empty: the record goes on for the whole period"),
    Field("use", "Use of the floor", "choice", "office", choices=USES, required=False,
          help="sets the multiplying factor on the base curve; default office"),
)

REFERENCES = (
    Reference("Frequency weightings from the analog filter sections (bilinear transform, second-order sections)",
              "BS 6841:1987 Wb; ISO 2631-1:1997 Annex A Wk, Wd; ISO 2631-2:2003 Wm (Wk confirmed, others from "
              "memory)"),
    Reference("Weighted r.m.s., running r.m.s. over 1 s and its maximum (MTVV), crest factor, VDV = "
              "(int a_w^4 dt)^(1/4)", "ISO 2631-1:1997 clause 6 (clause numbers from memory)"),
    Reference("VDV of a period: N events (N VDV^4)^(1/4), or continuous VDV (T/T_m)^(1/4); estimated VDV "
              "1.4 a_rms t^0.25 for crest factors below 6; ranges of Table 1",
              "BS 6472-1:2008 (Table 1 confirmed in two summaries)"),
    Reference("One-third-octave band r.m.s. over the base curve (response factor), multiplying factors by use",
              "ISO 10137:2007 Annex C; BS 6472:1992 (from memory); bands IEC 61260"),
)


def _record(inputs: Inputs) -> Record:
    """The acceleration record named by the fields; refused unless its signal is an acceleration."""
    record = record_from_fields(inputs)
    if record.kind != "acceleration":
        found = f"is a {record.kind}" if record.kind else "has no unit in its header"
        raise inputs.error("signal_unit", f"signal column {record.channel_name!r} {found}: give the "
                                          "acceleration unit (m/s^2, mm/s^2, g or mg)")
    if float(np.max(np.abs(record.signal))) > MAX_ACCELERATION:
        raise inputs.error("signal_unit", f"accelerations above {MAX_ACCELERATION:g} m/s^2 are not building "
                                          "vibration: check the signal unit")
    return record


def _events(inputs: Inputs) -> int | None:
    value = inputs.optional("events", None, minimum=1, maximum=MAX_EVENTS)
    return None if value is None else int(value)


def _lowest_band(duration: float) -> float:
    """Nominal centre (Hz) of the lowest one-third-octave band from 1 Hz that a record of ``duration`` (s) resolves."""
    from fieldmode.calc.records.human_response import MIN_BAND_LINES

    width = 10**0.05 - 10**-0.05  # band width over its centre
    needed = MIN_BAND_LINES / (duration * width)
    return 10 ** (max(0, math.ceil(10 * math.log10(needed) - 1e-9)) / 10)


def _thinned(time: np.ndarray, values: np.ndarray, points: int = RUNNING_POINTS) -> tuple[np.ndarray, np.ndarray]:
    """At most ``points`` (time, value) pairs: the largest value of each equal stretch, so the maximum is kept."""
    if values.size <= points:
        return time, values
    edges = np.linspace(0, values.size, points + 1).astype(int)
    index = np.array([start + int(np.argmax(values[start:stop])) for start, stop in zip(edges[:-1], edges[1:],
                                                                                        strict=True)])
    return time[index], values[index]


@overflow_guard("file")
def compute(inputs: Inputs) -> Result:
    # The analysis modules are imported here, not at the top: every other command starts faster.
    from fieldmode.calc.physics import base_curves
    from fieldmode.calc.records import human_response as hr
    from fieldmode.calc.records.read import RecordError
    from fieldmode.calc.records.weighting import apply as apply_weighting

    path = inputs.text("file")
    direction = inputs.text("direction") if inputs.has("direction") else "vertical"
    chosen = inputs.optional_text("weighting")
    weighting = chosen or DEFAULT_WEIGHTING[direction]
    period = inputs.text("period") if inputs.has("period") else "day"
    use = inputs.text("use") if inputs.has("use") else "office"
    events = _events(inputs)
    record = _record(inputs)
    fs = record.sample_rate
    acceleration = record.signal
    duration = acceleration.size / fs
    try:
        weighted = apply_weighting(acceleration, fs, weighting)
        running = hr.running_rms(weighted, fs)
        level = hr.weighted_rms(weighted)
        if level == 0.0:
            raise ValueError("the weighted acceleration is zero throughout: no vibration to assess")
        crest = hr.crest_factor(weighted)
        vdv_record = hr.vdv(weighted, fs)
        del weighted
        lowest = _lowest_band(duration)
        if lowest > LOWEST_BAND_LIMIT:
            raise ValueError(f"the record lasts {duration:.3g} s: too short for the one-third-octave band at "
                             f"{LOWEST_BAND_LIMIT:g} Hz")
        bands, weighted_bands = hr.band_spectra(acceleration, fs, lowest, HIGHEST_BAND, (None, weighting))
    except ValueError as error:
        raise RecordError(path, f"signal column {record.channel_name!r}: {error}") from error
    top = int(np.argmax(running))

    factors = base_curves.response_factor(bands.rms, bands.centre, direction)
    worst = int(np.argmax(factors))
    day, night = base_curves.MULTIPLYING_FACTORS[use]
    limit = night if period == "night" else day
    seconds = hr.PERIODS[period]
    if events is None:
        vdv_period = hr.vdv_for_period(vdv_record, duration, period)
        exposed = seconds
    else:
        vdv_period = hr.vdv_of_events(vdv_record, events)
        exposed = events * duration
    estimate = hr.estimated_vdv(level, exposed, crest)
    band = hr.vdv_band(vdv_period, period)
    start = float(record.time[0])
    window = acceleration.size - running.size + 1
    running_time = start + (np.arange(running.size) + window - 1) / fs
    base_value = base_curves.VERTICAL_FLAT if direction == "vertical" else base_curves.HORIZONTAL_FLAT
    mtvv = float(running[top])
    mtvv_factor = mtvv / base_value if weighting == BASE_WEIGHTING[direction] else None
    governing = max(float(factors[worst]), mtvv_factor or 0.0)
    name = PERIOD_NAMES[period]

    values: dict[str, Value] = {
        "weighting": word("Weighting", weighting),
        "weighted_rms": quantity("Weighted RMS", "acceleration", level),
        "mtvv": quantity("MTVV (1 s running RMS)", "acceleration", mtvv),
        "mtvv_time": quantity("MTVV window ends at", "time", float(running_time[top])),
        "crest_factor": quantity("Crest factor", "number", crest),
        "vdv_record": quantity("VDV of the record", "vibration_dose", vdv_record),
        "vdv_period": quantity(f"VDV, {name}", "vibration_dose", vdv_period),
        "estimated_vdv": quantity(f"Estimated VDV, {name}", "vibration_dose", estimate.value),
        "vdv_range": word(f"BS 6472-1 range, {period}", _range_text(band)),
        "adverse_comment": word("Adverse comment", COMMENT[band.label]),
        "response_factor": quantity("Response factor (bands)", "number", float(factors[worst])),
        "response_band": quantity("at band", "frequency", float(bands.nominal[worst])),
    }
    if mtvv_factor is not None:
        values["response_factor_mtvv"] = quantity("Response factor (MTVV)", "number", mtvv_factor)
    values["use_factor"] = quantity(f"Factor for {use}", "number", limit)
    values["response_verdict"] = word("Response factor verdict", "met" if governing <= limit else "NOT MET")
    values["duration"] = quantity("Record duration", "time", duration)
    values["sample_rate"] = quantity("Sample rate", "frequency", fs)

    flags = [Flag("info", note) for note in record.notes]
    flags += _flags(direction, chosen, weighting, period, events, duration, vdv_record, estimate, use, limit,
                    float(factors[worst]), mtvv_factor, lowest, float(np.max(np.abs(acceleration))))
    thinned_time, thinned_rms = _thinned(running_time, running)
    series = {
        "band_frequency": bands.centre,
        "band_rms": bands.rms,
        "band_rms_weighted": weighted_bands.rms,
        "base_curve_limit": base_curves.base_acceleration(bands.centre, direction) * limit,
        "running_time": thinned_time,
        "running_rms": thinned_rms,
    }
    return inputs.result(values, series=series, flags=tuple(flags), references=REFERENCES,
                         files=(InputFile(path, record.source.size, record.source.sha256),))


def _range_text(band: VdvBand) -> str:
    """The BS 6472-1 range of a VDV, e.g. '0.4-0.8 m/s^1.75' or 'below 0.2 m/s^1.75'."""
    if band.low == 0.0:
        return f"below {band.high:g} m/s^1.75"
    if math.isinf(band.high):
        return f"above {band.low:g} m/s^1.75"
    return f"{band.low:g}-{band.high:g} m/s^1.75"


def _flags(direction: str, chosen: str | None, weighting: str, period: str, events: int | None, duration: float,
           vdv: float, estimate: EstimatedVdv, use: str, limit: float, band_factor: float,
           mtvv_factor: float | None, lowest: float, peak: float) -> list[Flag]:
    """Notes on the choices made and cautions on the values."""
    from fieldmode.calc.records.human_response import PERIODS

    flags = []
    if chosen is None:
        flags.append(Flag("info", f"weighting {weighting}: the BS 6472-1 weighting for {direction} vibration"))
    elif direction not in WEIGHTING_DIRECTIONS[chosen]:
        flags.append(Flag("caution", f"{chosen} is not a weighting for {direction} vibration"))
    seconds = PERIODS[period]
    if events is None:
        flags.append(Flag("info", f"the record ({duration:.4g} s) taken to go on for the whole {PERIOD_NAMES[period]}: "
                                  f"VDV x ({seconds:g} s / {duration:.4g} s)^(1/4); give the events if it does not"))
    else:
        flags.append(Flag("info", f"{events} events like the record in the {PERIOD_NAMES[period]}: "
                                  f"VDV = ({events} x {vdv:.4g}^4)^(1/4)"))
    if not estimate.valid:
        flags.append(Flag("caution", f"crest factor {estimate.crest_factor:.2f} is 6 or more: the estimated VDV is "
                                     "not valid; the measured VDV governs"))
    if use != "residential":
        flags.append(Flag("info", OTHER_USES_NOTE))
    governing = max(band_factor, mtvv_factor or 0.0)
    if governing > limit:
        flags.append(Flag("warning", f"response factor {governing:.4g} above {limit:g}, the factor for {use} "
                                     f"({period}): adverse comment is likely"))
    factors = "multiplying factors for continuous vibration (from memory)"
    if mtvv_factor is None:
        flags.append(Flag("info", f"{factors}; the response factor of the MTVV needs {BASE_WEIGHTING[direction]} "
                                  f"for {direction} vibration: bands only"))
    elif mtvv_factor > INTERMITTENT * band_factor:
        flags.append(Flag("info", f"{factors}; this vibration comes and goes: the band response factor averages "
                                  "the quiet spells of the record, the MTVV one is its worst second"))
    else:
        flags.append(Flag("info", factors))
    if lowest > 1.0:
        flags.append(Flag("info", f"bands from {lowest:.3g} Hz: a record of {duration:.3g} s resolves no lower"))
    if peak > LOUD_ACCELERATION:
        flags.append(Flag("caution", f"peak acceleration {peak:.3g} m/s^2 is far above building vibration: "
                                     "check the signal unit"))
    return flags


SPEC = CheckSpec(
    id="occupants",
    title="Occupants and vibration",
    summary="human response to building vibration from an acceleration record: weighted RMS, MTVV, VDV "
            "(BS 6472-1), response factor (ISO 10137)",
    fields=FIELDS,
    compute=compute,
    caution=MEASURED_CAUTION,
    key_results=("response_verdict", "vdv_period", "mtvv", "weighted_rms"),
    series=(
        Series("band_frequency", "One-third-octave band centre", "frequency"),
        Series("band_rms", "Band RMS, unweighted", "acceleration", "band_frequency"),
        Series("band_rms_weighted", "Band RMS, weighted", "acceleration", "band_frequency"),
        Series("base_curve_limit", "Base curve x factor for the use", "acceleration", "band_frequency"),
        Series("running_time", "Time at the end of the 1 s window", "time"),
        Series("running_rms", "Running RMS, weighted (1 s)", "acceleration", "running_time"),
    ),
)
