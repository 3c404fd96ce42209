"""`dossier schema`: the record's JSON Schema, for editors with a YAML language server."""

from __future__ import annotations

import json

SCHEMA_ID = "https://dossier.invalid/schema/record-1.json"


def record_schema() -> dict:
    from dossier.record.model import Record

    schema = Record.model_json_schema(mode="validation")
    schema["$schema"] = "https://json-schema.org/draft/2020-12/schema"
    schema["$id"] = SCHEMA_ID
    schema["title"] = "dossier build record (one revision)"
    return schema


def schema_text() -> str:
    return json.dumps(record_schema(), indent=2, sort_keys=True, ensure_ascii=False) + "\n"
