"""Check `period`: approximate fundamental period of a building, EN 1998-1 and ASCE 7 side by side."""

from __future__ import annotations

from typing import TYPE_CHECKING

import numpy as np

from fieldmode.calc.framework.guard import overflow_guard
from fieldmode.calc.framework.meaning import BUILDING, Meaning
from fieldmode.calc.framework.result import SEISMIC_CAUTION, Flag, Reference, Result, quantity
from fieldmode.calc.framework.spec import CheckSpec, Field, Series
from fieldmode.calc.physics import period

if TYPE_CHECKING:
    from fieldmode.calc.framework.reading import Inputs

MAX_HEIGHT = 1000.0
"""Tallest building accepted (m)."""

FIELDS = (
    Field("height", "Building height", "length", "11.5 m", "m", shared=True, meaning=Meaning("height", BUILDING)),
    Field("system", "Structural system", "choice", "steel-moment-frame", choices=period.SYSTEMS,
          help="steel-eccentric-braced includes buckling-restrained braced frames in ASCE 7",
    meaning=Meaning("structural system", BUILDING)),
)

REFERENCES = (
    Reference("T1 = Ct H^(3/4)", "EN 1998-1:2004 4.3.3.2.2(3)"),
    Reference("Ta = Ct hn^x (SI coefficients)", "ASCE 7-16 12.8.2.1, eq. 12.8-7, Table 12.8-2"),
)


@overflow_guard("height")
def compute(inputs: Inputs) -> Result:
    height = inputs.value("height", positive=True, maximum=MAX_HEIGHT)
    system = inputs.text("system")
    ct_asce, exponent = period.ASCE_CT[system]
    values = {
        "period": quantity("T1, EN 1998-1 4.3.3.2.2", "time", period.en1998(height, system),
                           meaning=Meaning("fundamental period", BUILDING)),
        "period_asce": quantity("Ta, ASCE 7-16 12.8.2.1", "time", period.asce7(height, system)),
        "ct_en": quantity("Ct, EN 1998-1 (H in m)", "number", period.EN_CT[system]),
        "ct_asce": quantity("Ct, ASCE 7 12.8-2 (SI)", "number", ct_asce),
        "exponent_asce": quantity("x, ASCE 7 Table 12.8-2", "number", exponent),
    }
    flags = [Flag("info", "ASCE 7 12.8.2: the period used may not exceed Cu Ta (Table 12.8-1)")]
    if height > period.EN_HEIGHT_LIMIT:
        flags.insert(0, Flag("caution", f"height above {period.EN_HEIGHT_LIMIT:g} m: the EN 1998-1 "
                                        "4.3.3.2.2(3) formula applies up to 40 m"))
    heights = np.linspace(0.0, max(period.EN_HEIGHT_LIMIT, 1.25 * height), 121)
    series = {
        "height": heights,
        "period_en": period.EN_CT[system] * heights**0.75,
        "period_asce": ct_asce * heights**exponent,
    }
    return inputs.result(values, series=series, flags=tuple(flags), references=REFERENCES)


SPEC = CheckSpec(
    id="period",
    title="Building period",
    summary="approximate fundamental period from height and structural system, EN 1998-1 and ASCE 7",
    fields=FIELDS,
    compute=compute,
    caution=SEISMIC_CAUTION,
    series=(
        Series("height", "Building height", "length"),
        Series("period_en", "T1, EN 1998-1", "time", "height"),
        Series("period_asce", "Ta, ASCE 7-16", "time", "height"),
    ),
)
