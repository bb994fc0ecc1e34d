#!/usr/bin/env python3
"""Embed a JSON file into a C source file as a byte array (build step)."""
import sys

src, dst = sys.argv[1], sys.argv[2]
data = open(src, "rb").read()
with open(dst, "w") as out:
    out.write("/* generated from %s by tools/embed_json.py; do not edit */\n"
              % src.split("/")[-1])
    out.write("#include <stddef.h>\n")
    out.write("const char molq_builtin_json[] = {\n")
    for i in range(0, len(data), 16):
        out.write("  " + ", ".join(str(b) for b in data[i:i + 16]) + ",\n")
    out.write("  0};\n")
    out.write("const size_t molq_builtin_json_len = %d;\n" % len(data))
