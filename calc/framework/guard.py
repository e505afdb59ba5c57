"""A guard for compute functions: inputs so extreme that the arithmetic overflows become an InputError."""

from __future__ import annotations

import functools
from collections.abc import Callable
from typing import TYPE_CHECKING

import numpy as np

from fieldmode.calc.framework.result import Result

if TYPE_CHECKING:
    from fieldmode.calc.framework.reading import Inputs

Compute = Callable[["Inputs"], Result]


def overflow_guard(field: str) -> Callable[[Compute], Compute]:
    """Turn overflow, division by an underflowed zero or a non-finite result into an error on ``field``."""

    def decorate(compute: Compute) -> Compute:
        @functools.wraps(compute)
        def guarded(inputs: Inputs) -> Result:
            try:
                with np.errstate(all="ignore"):  # non-finite values are caught below, with a clear message
                    result = compute(inputs)
            except (OverflowError, ZeroDivisionError) as error:
                raise inputs.error(field, "the values given are too extreme to compute") from error
            if not _all_finite(result):
                raise inputs.error(field, "the values given are too extreme to compute")
            return result

        return guarded

    return decorate


def _all_finite(result: Result) -> bool:
    for value in result.values.values():
        if not value.is_word and not np.all(np.isfinite(value.magnitude)):
            return False
    return all(bool(np.all(np.isfinite(array))) for array in result.series.values())
