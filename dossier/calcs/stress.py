"""Voltage stress calc (placeholder while it is written; emits nothing)."""

from dossier.plugins import Calc


def run(record):
    return []


CALC = Calc(name="stress", title="Voltage stress", run=run, summary="To be written.", codes={"STRESS-PENDING": "placeholder"}, order=40)
