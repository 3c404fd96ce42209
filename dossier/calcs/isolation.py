"""Isolation calc (placeholder while it is written; emits nothing)."""

from dossier.plugins import Calc


def run(record):
    return []


CALC = Calc(name="isolation", title="Isolation", run=run, summary="To be written.", codes={"ISOLATION-PENDING": "placeholder"}, order=10)
