"""Collecting an archive: every revision read, reviewed, drawn and its checklist made, before any page is written."""
