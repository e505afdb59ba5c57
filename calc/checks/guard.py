"""A guard for compute functions: inputs so extreme that the arithmetic overflows become an InputError."""

from __future__ import annotations

import functools
import math
from collections.abc import Callable

import numpy as np

from calc.result import Result
from calc.spec import Inputs

Compute = Callable[[Inputs], Result]


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
    numbers = [value.si() for value in result.values.values()]
    if not all(math.isfinite(n) for n in numbers if isinstance(n, float)):
        return False
    return all(bool(np.all(np.isfinite(array))) for array in result.series.values())
