"""Validate a JSON document against a JSON Schema, after checking the schema's SHA-256.

Usage: python3 check_json_schema.py SCHEMA SHA256 INSTANCE

Used by tests/lint_cli.rs to check `lexdelta lint --format sarif` against the published
SARIF 2.1.0 schema. Needs the general-purpose validator `jsonschema` (PyPI); exits 3 with
the install command when it is missing, so the test fails loudly instead of skipping.
"""

import hashlib
import json
import sys


def main() -> int:
    schema_path, expected, instance_path = sys.argv[1:4]
    with open(schema_path, "rb") as f:
        raw = f.read()
    actual = hashlib.sha256(raw).hexdigest()
    if actual != expected:
        print(f"{schema_path}: sha256 {actual}, expected {expected}", file=sys.stderr)
        return 4
    try:
        import jsonschema
    except ImportError:
        print("the Python package jsonschema is missing: pip install jsonschema==4.26.0", file=sys.stderr)
        return 3
    schema = json.loads(raw)
    with open(instance_path, encoding="utf-8") as f:
        instance = json.load(f)
    validator_class = jsonschema.validators.validator_for(schema)
    validator_class.check_schema(schema)
    errors = sorted(validator_class(schema).iter_errors(instance), key=lambda e: list(e.path))
    for error in errors:
        where = "/".join(str(p) for p in error.absolute_path)
        print(f"{instance_path}: at /{where}: {error.message}", file=sys.stderr)
    if errors:
        return 1
    print(f"{instance_path}: valid against {schema.get('id') or schema.get('$id')}")
    return 0


if __name__ == "__main__":
    sys.exit(main())
