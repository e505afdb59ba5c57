"""Widgets and dialogs of the terminal app, one per module."""
