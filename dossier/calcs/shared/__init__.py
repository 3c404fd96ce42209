"""Pieces more than one calc uses: finding helpers, the mains line conditions, margins, the unit's safety class."""
