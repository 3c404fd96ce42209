"""dossier: checked, versioned build records for hand-built mains equipment."""

__version__ = "0.1.0"
