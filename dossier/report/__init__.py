"""Turning findings into terminal text or JSON."""
