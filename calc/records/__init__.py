"""Measured records (time series): reading text files, and identifying what they hold."""
