"""Rendering the plain Markdown tree into a site with MkDocs, in its own process (no MkDocs plugin API)."""
