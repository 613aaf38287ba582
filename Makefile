# calckit: the two Quickstart targets plus helpers. Needs only python3 (>= 3.10) and make.
PYTHON ?= python3
VENV   := .venv
PY     := $(VENV)/bin/python
STAMP  := $(VENV)/.installed
TSTAMP := $(VENV)/.installed-test

.PHONY: demo test bench clean-venv

$(PY):
	$(PYTHON) -m venv $(VENV)
	$(PY) -m pip install --quiet --upgrade pip

$(STAMP): pyproject.toml | $(PY)
	$(PY) -m pip install --quiet -e .
	$(PY) -m ipykernel install --sys-prefix --name python3 >/dev/null
	touch $@

$(TSTAMP): pyproject.toml | $(PY)
	$(PY) -m pip install --quiet -e ".[test]"
	$(PY) -m ipykernel install --sys-prefix --name python3 >/dev/null
	touch $(STAMP) $@

demo: $(STAMP)
	$(PY) -m calckit demo

test: $(TSTAMP)
	$(PY) -m pytest

bench: $(TSTAMP)
	$(PY) benchmarks/run_all.py

clean-venv:
	rm -rf $(VENV)
