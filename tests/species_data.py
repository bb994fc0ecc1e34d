"""Test helper shared by the command-line tests (tests/cli) and the Python
binding's tests (bindings/python/tests): the built-in species entries read
from the species files themselves (data/species/*.json), not through molq,
so a test can compare what molq reports with its own input.  Standard
library only; no molq import (it serves both layers)."""

import json
from pathlib import Path

SPECIES_DIR = Path(__file__).resolve().parents[1] / "data" / "species"


def species_files():
    """{name: entry} of every built-in species, from data/species/*.json."""
    out = {}
    for path in sorted(SPECIES_DIR.glob("*.json")):
        with open(path, encoding="utf-8") as f:
            for entry in json.load(f)["species"]:
                out[entry["name"]] = entry
    return out
