"""The output folder: the atomic swap, one build per output, and keeping a site whose inputs have not changed."""
