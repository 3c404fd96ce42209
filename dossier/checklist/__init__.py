"""The pre-power-up checklist and the commissioning record."""
