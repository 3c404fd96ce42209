"""Charts drawn as SVG by a small writer of dossier's own (no plotting library)."""
