#!/usr/bin/env python3
"""Build step: merge the built-in species files into one species document
and embed it into a C source file as a byte array.

usage: embed_json.py OUT.c OUT.json IN.json [IN.json ...]

The species lists are concatenated in the order given (the built-in set's
order); the files must be schema version 1 and the names unique across
them.  OUT.json is the merged document (installed, and read by tests)."""
import json
import sys


def main(argv):
    if len(argv) < 4:
        sys.exit(__doc__)
    dst_c, dst_json, sources = argv[1], argv[2], argv[3:]
    species, seen = [], {}
    for src in sources:
        with open(src, encoding="utf-8") as f:
            doc = json.load(f)
        if doc.get("schema_version") != 1:
            sys.exit("%s: schema_version must be 1" % src)
        for entry in doc["species"]:
            name = entry["name"]
            if name in seen:
                sys.exit("%s: species %r is already in %s" % (src, name,
                                                              seen[name]))
            seen[name] = src
            species.append(entry)
    merged = {
        "schema_version": 1,
        "description": "molq built-in species set, merged at build time from "
                       + ", ".join(s.split("/")[-1] for s in sources)
                       + " (data/species/); each species names its sources.",
        "species": species,
    }
    text = json.dumps(merged, indent=1, ensure_ascii=False) + "\n"
    data = text.encode("utf-8")
    with open(dst_json, "w", encoding="utf-8") as out:
        out.write(text)
    with open(dst_c, "w") as out:
        out.write("/* generated from the files in data/species by "
                  "tools/embed_json.py; do not edit */\n")
        out.write("#include <stddef.h>\n")
        out.write("const char molq_builtin_json[] = {\n")
        for i in range(0, len(data), 16):
            out.write("  " + ", ".join(str(b) for b in data[i:i + 16])
                      + ",\n")
        out.write("  0};\n")
        out.write("const size_t molq_builtin_json_len = %d;\n" % len(data))


if __name__ == "__main__":
    main(sys.argv)
