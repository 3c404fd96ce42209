"""Reading files: YAML with node positions and limits, then one path from any file to a model or located problems."""
