#!/usr/bin/env python3
"""The shared library exports exactly the symbols listed in lib/molq.map,
every one of them carries the molq_ prefix, and every exported function is
declared in the public header.  Usage: check_exports.py LIB MAP HEADER"""
import re
import subprocess
import sys

lib, mapfile, header = sys.argv[1:4]
text = open(mapfile).read()
text = re.sub(r"/\*.*?\*/", "", text, flags=re.S)
listed = set()
for body in re.findall(r"\{(.*?)\}", text, flags=re.S):
    body = body.split("local:")[0].replace("global:", "")
    listed.update(s.strip() for s in body.split(";") if s.strip())

out = subprocess.run(["nm", "-D", "--defined-only", lib], check=True,
                     capture_output=True, text=True).stdout
exported = set()
for line in out.splitlines():
    parts = line.split()
    if len(parts) == 3 and parts[1] in "TDBRW":
        exported.add(parts[2].split("@")[0])

declared = set(re.findall(r"MOLQ_API\s+[^;(]*?\b(molq_\w+)\s*\(",
                          open(header).read()))

problems = []
if exported != listed:
    problems.append("exported but not listed: %s" % sorted(exported - listed))
    problems.append("listed but not exported: %s" % sorted(listed - exported))
bad = [s for s in exported if not s.startswith("molq_")]
if bad:
    problems.append("exported without the molq_ prefix: %s" % sorted(bad))
if declared != listed:
    problems.append("declared MOLQ_API but not listed: %s"
                    % sorted(declared - listed))
    problems.append("listed but not declared MOLQ_API: %s"
                    % sorted(listed - declared))
if problems:
    print("\n".join(problems))
    sys.exit(1)
print("%d symbols: exported == listed == declared" % len(listed))
