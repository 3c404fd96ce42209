"""Magnetics calc (placeholder while it is written; emits nothing)."""

from dossier.plugins import Calc


def run(record):
    return []


CALC = Calc(name="magnetics", title="Magnetics", run=run, summary="To be written.", codes={"MAGNETICS-PENDING": "placeholder"}, order=30)
