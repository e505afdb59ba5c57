"""Everything a person touches: the command line, the terminal app, charts and session files."""
