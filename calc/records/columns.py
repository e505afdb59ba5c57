"""Fields that pick a record's columns or sampling, for every check that reads a record file."""

from __future__ import annotations

from fieldmode.calc.framework.spec import Field

RECORD_COLUMN_FIELDS = (
    Field("time_column", "Time column", "text", "", required=False,
          help="header name or number; default the first column (or one named time)"),
    Field("signal_column", "Signal column", "text", "", required=False,
          help="header name or number; default the first column after the time"),
    Field("sample_rate", "Sample rate", "frequency", "", "Hz", required=False,
          help="for a file without a time column"),
)
