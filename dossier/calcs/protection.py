"""Protection calc (placeholder while it is written; emits nothing)."""

from dossier.plugins import Calc


def run(record):
    return []


CALC = Calc(name="protection", title="Protection", run=run, summary="To be written.", codes={"PROTECTION-PENDING": "placeholder"}, order=20)
