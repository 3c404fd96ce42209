"""`dossier schema`: the record's JSON Schema, for editors with a YAML language server."""

from __future__ import annotations

import json

SCHEMA_ID = "https://dossier.invalid/schema/record-1.json"
SIGNOFF_SCHEMA_ID = "https://dossier.invalid/schema/signoff-1.json"


def record_schema() -> dict:
    from dossier.record.model import Record

    schema = Record.model_json_schema(mode="validation")
    schema["$schema"] = "https://json-schema.org/draft/2020-12/schema"
    schema["$id"] = SCHEMA_ID
    schema["title"] = "dossier build record (one revision)"
    return schema


def signoff_schema() -> dict:
    from dossier.signoff.model import SignoffFile

    schema = SignoffFile.model_json_schema(mode="validation")
    schema["$schema"] = "https://json-schema.org/draft/2020-12/schema"
    schema["$id"] = SIGNOFF_SCHEMA_ID
    schema["title"] = "dossier sign-off (the human review of one revision)"
    return schema


SCHEMAS = {"record": record_schema, "signoff": signoff_schema}


def schema_text(kind: str = "record") -> str:
    return json.dumps(SCHEMAS[kind](), indent=2, sort_keys=True, ensure_ascii=False) + "\n"
