"""Charge profile calc (placeholder while it is written; emits nothing)."""

from dossier.plugins import Calc


def run(record):
    return []


CALC = Calc(name="charge", title="Charge profile", run=run, summary="To be written.", codes={"CHARGE-PENDING": "placeholder"}, order=60)
