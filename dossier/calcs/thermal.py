"""Thermal calc (placeholder while it is written; emits nothing)."""

from dossier.plugins import Calc


def run(record):
    return []


CALC = Calc(name="thermal", title="Thermal", run=run, summary="To be written.", codes={"THERMAL-PENDING": "placeholder"}, order=50)
