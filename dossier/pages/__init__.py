"""Page generation: records and findings to a plain Markdown tree (no MkDocs API here)."""
