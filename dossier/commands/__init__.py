"""One module per CLI command; dossier.cli only wires them to click."""
