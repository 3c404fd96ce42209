"""The build record: its model and loading it from YAML with located errors."""
