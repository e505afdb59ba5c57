"""Check `period`: approximate fundamental period of a building, EN 1998-1 and ASCE 7 side by side."""

from __future__ import annotations

import numpy as np

from calc import seismic
from calc.checks.guard import overflow_guard
from calc.result import SEISMIC_CAUTION, Flag, Reference, Result
from calc.spec import CheckSpec, Field, Inputs, quantity

MAX_HEIGHT = 1000.0
"""Tallest building accepted (m)."""

FIELDS = (
    Field("height", "Building height", "length", "11.5 m", "m", shared=True),
    Field("system", "Structural system", "choice", "steel-moment-frame", choices=seismic.SYSTEMS,
          help="steel-eccentric-braced includes buckling-restrained braced frames in ASCE 7"),
)

REFERENCES = (
    Reference("T1 = Ct H^(3/4)", "EN 1998-1:2004 4.3.3.2.2(3)"),
    Reference("Ta = Ct hn^x (SI coefficients)", "ASCE 7-16 12.8.2.1, eq. 12.8-7, Table 12.8-2"),
)


@overflow_guard("height")
def compute(inputs: Inputs) -> Result:
    height = inputs.value("height", positive=True, maximum=MAX_HEIGHT)
    system = inputs.text("system")
    ct_asce, exponent = seismic.ASCE_CT[system]
    values = {
        "period": quantity("T1, EN 1998-1 4.3.3.2.2", "time", seismic.period_en1998(height, system)),
        "period_asce": quantity("Ta, ASCE 7-16 12.8.2.1", "time", seismic.period_asce7(height, system)),
        "ct_en": quantity("Ct, EN 1998-1 (H in m)", "number", seismic.EN_CT[system]),
        "ct_asce": quantity("Ct, ASCE 7 Table 12.8-2 (SI)", "number", ct_asce),
        "exponent_asce": quantity("x, ASCE 7 Table 12.8-2", "number", exponent),
    }
    flags = [Flag("info", "ASCE 7 12.8.2: the period used may not exceed Cu Ta (Table 12.8-1)")]
    if height > seismic.EN_HEIGHT_LIMIT:
        flags.insert(0, Flag("caution", f"height above {seismic.EN_HEIGHT_LIMIT:g} m: the EN 1998-1 "
                                        "4.3.3.2.2(3) formula applies up to 40 m"))
    heights = np.linspace(0.0, max(seismic.EN_HEIGHT_LIMIT, 1.25 * height), 121)
    series = {
        "height": heights,
        "period_en": seismic.EN_CT[system] * heights**0.75,
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
    sends={"period": "period"},
)
