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

# The demo archive has a revision that fails on purpose, so `check` exiting 1 is expected here.
demo: $(STAMP)
	$(BIN)/dossier check demo/archive > /dev/null; status=$$?; [ $$status -le 1 ] || exit $$status
	$(BIN)/dossier build demo/archive -o demo/site
	@echo "Open demo/site/index.html in a browser (works from a folder, no network needed)."

# The project's own docs with the demo archive inside them, rendered strictly.
docs: $(STAMP)
	rm -rf docs/archive
	$(BIN)/dossier build demo/archive --pages-only -o docs/archive
	$(BIN)/mkdocs build --strict -d site

# Says first which system tools (PDF, browser) are missing and what to install; their tests then skip,
# or fail under CI (CI=true), whose .ci/run installs them.
test: $(STAMP)
	$(BIN)/python -m tests.fixtures.prerequisites
	$(BIN)/python -m pytest

bench: $(STAMP)
	$(BIN)/python bench/bench_check.py
	$(BIN)/python bench/bench_drawing.py
	$(BIN)/python bench/bench_site.py
	$(BIN)/python bench/bench_incremental.py

clean:
	rm -rf $(VENV) site .cache
