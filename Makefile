# Every target bootstraps its own virtual environment in .venv.
VENV := .venv
PY := $(VENV)/bin/python
STAMP := $(VENV)/.installed
# mypy resolves the installed names (fieldmode.calc, fieldmode.tui) through this tree of links.
TYPECHECK := build/typecheck

.PHONY: run test lint bench docs clean

$(STAMP): pyproject.toml
	python3 -m venv $(VENV)
	$(PY) -m pip install --quiet --upgrade pip
	$(PY) -m pip install --quiet -e '.[test]'
	touch $(STAMP)

run: $(STAMP)
	$(VENV)/bin/fieldmode

test: $(STAMP)
	$(PY) -m pytest -q

lint: $(STAMP)
	$(VENV)/bin/ruff check calc tui tests docs
	mkdir -p $(TYPECHECK)/fieldmode
	ln -sfn ../../../calc $(TYPECHECK)/fieldmode/calc
	ln -sfn ../../../tui $(TYPECHECK)/fieldmode/tui
	MYPYPATH=$(TYPECHECK) $(VENV)/bin/mypy -p fieldmode.calc -p fieldmode.tui

bench: $(STAMP)
	$(PY) tests/bench/run.py

docs: $(STAMP)
	$(PY) docs/screenshots.py docs

clean:
	rm -rf $(VENV) build *.egg-info
