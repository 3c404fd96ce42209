"""Calc plugins shipped with dossier; each is registered as a dossier.calcs entry point like any other."""
