"""fieldmode's calculation core: pure, unit-aware, free of any user interface."""

__version__ = "0.1.0"
