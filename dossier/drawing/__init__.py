"""Schematics drawn from the record with schemdraw, always to an explicit SVG canvas."""
