# Two entry points for a fresh machine with Python 3.11+:
#   make demo   — create .venv, install, solve every demo job and build its report into out/
#   make test   — create .venv, install with test extras, run the test suite
#   make lint   — ruff (lint + format check) and mypy, as CI runs them before the tests
#   make schema — regenerate the shipped job-file JSON Schema after adding a key
PYTHON ?= python3
VENV   := .venv
BIN    := $(VENV)/bin
STAMP  := $(VENV)/.installed

.PHONY: demo test lint schema bench clean

$(STAMP): pyproject.toml
	$(PYTHON) -m venv $(VENV)
	$(BIN)/python -m pip install -q --upgrade pip
	$(BIN)/python -m pip install -q -e '.[test,lint]'
	touch $(STAMP)

demo: $(STAMP)
	$(BIN)/calcreport check jobs/*.toml
	@if $(BIN)/calcreport build --help >/dev/null 2>&1; then \
	  $(BIN)/calcreport build jobs/*.toml -o out/ && echo "reports written to out/"; fi

test: $(STAMP)
	$(BIN)/python -m pytest

lint: $(STAMP)
	$(BIN)/ruff check calcreport tests benchmarks tools
	$(BIN)/ruff format --check calcreport tests benchmarks tools
	$(BIN)/mypy

schema: $(STAMP)
	$(BIN)/python -m calcreport schema > calcreport/data/job.schema.json

bench: $(STAMP)
	@for f in benchmarks/*.py; do echo "== $$f"; $(BIN)/python $$f || exit 1; done

clean:
	rm -rf $(VENV) out .pytest_cache .hypothesis
