"""Fields that pick a record's columns or sampling, for every check that reads a record file."""

from __future__ import annotations

from typing import TYPE_CHECKING

from fieldmode.calc.framework.spec import Field

if TYPE_CHECKING:
    from fieldmode.calc.framework.reading import Inputs
    from fieldmode.calc.records.read import Record

RECORD_COLUMN_FIELDS = (
    Field("time_column", "Time column", "text", "", required=False,
          help="header name or number; default the first column (or one named time)"),
    Field("signal_column", "Signal column", "text", "", required=False,
          help="header name or number; default the first column after the time"),
    Field("sample_rate", "Sample rate", "frequency", "", "Hz", required=False,
          help="for a file without a time column"),
)


def record_from_fields(inputs: Inputs) -> Record:
    """The record named by a check's ``file`` field, read with its column, sample-rate and signal-unit fields
    (those left empty take the reader's defaults)."""
    from fieldmode.calc.records.read import MAX_SAMPLE_RATE, MIN_SAMPLE_RATE, read_record

    rate = inputs.optional("sample_rate", None, minimum=MIN_SAMPLE_RATE, maximum=MAX_SAMPLE_RATE)
    return read_record(inputs.text("file"), time_column=inputs.optional_text("time_column"),
                       signal_column=inputs.optional_text("signal_column"), sample_rate=rate,
                       signal_unit=inputs.optional_text("signal_unit"))
