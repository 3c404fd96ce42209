"""Tables and rules from published standards, as data and small pure functions."""
