"""Pure physics of each check on SI floats and numpy arrays; no units, no user interface."""
