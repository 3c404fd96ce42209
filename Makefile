# The two commands the README promises: `make demo` and `make test`.
PYTHON ?= python3
VENV := .venv
BIN := $(VENV)/bin
STAMP := $(VENV)/.installed

.PHONY: demo test bench docs clean

$(STAMP): pyproject.toml
	$(PYTHON) -m venv $(VENV)
	$(BIN)/pip install --quiet --upgrade pip
	$(BIN)/pip install --quiet -e '.[test]'
	touch $(STAMP)

demo: $(STAMP)
	$(BIN)/dossier check demo/archive; status=$$?; [ $$status -le 1 ] || exit $$status

test: $(STAMP)
	$(BIN)/python -m pytest

bench: $(STAMP)
	$(BIN)/python bench/bench_check.py

clean:
	rm -rf $(VENV) site .cache
