"""The check framework: physical kinds, units, check specs, results, and the compute guard."""
