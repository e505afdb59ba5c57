"""Helpers shared by the tests (imported as helpers.<module>; tests/ is on the test path)."""
