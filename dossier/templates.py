"""Where dossier's templates live: the top-level templates/ folder, installed as package data."""

from __future__ import annotations

from importlib.resources import files
from pathlib import Path


def templates_dir() -> Path:
    return Path(str(files("dossier_templates")))


def template_text(name: str) -> str:
    return (templates_dir() / name).read_text(encoding="utf-8")
