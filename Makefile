# Every target bootstraps its own virtual environment in .venv.
VENV := .venv
PY := $(VENV)/bin/python
STAMP := $(VENV)/.installed

.PHONY: run test lint bench clean

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
	$(VENV)/bin/ruff check calc tui tests
	$(VENV)/bin/mypy calc

bench: $(STAMP)
	$(PY) tests/bench/run.py

clean:
	rm -rf $(VENV) build *.egg-info
