"""fieldmode's calculation core: pure, unit-aware, free of any user interface."""

import os

# The core's matrix products are small and many: one BLAS thread avoids the hand-off cost of a
# thread pool (several times slower on a busy machine). A value set by the user is kept.
os.environ.setdefault("OPENBLAS_NUM_THREADS", "1")

__version__ = "0.1.0"
