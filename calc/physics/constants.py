"""Physical constants the physics and the unit reader share."""

STANDARD_GRAVITY = 9.80665
"""Standard gravity g0 in m/s^2 (3rd CGPM, 1901; NIST SP 811)."""
