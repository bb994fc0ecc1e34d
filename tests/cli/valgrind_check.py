"""Run the molq CLI under valgrind on a normal table and on bad inputs.

valgrind exits with 99 when it finds memory errors or definite/indirect
leaks; any other exit code is the tool's own (0, 1 or 2) and is checked
too.  Environment: MOLQ_CLI (the tool), VALGRIND (the valgrind program)."""

import os
import subprocess
import sys
from pathlib import Path

CLI = os.environ["MOLQ_CLI"]
VALGRIND = os.environ.get("VALGRIND", "valgrind")
DATA = Path(__file__).resolve().parent / "data"

CASES = [
    # (arguments, expected exit code of the tool)
    (["table", "N2", "CO2", "H2O", "O", "--T", "300:3000:100",
      "--format", "csv"], 0),
    (["table", "demo-linear", "demo-bent", "demo-atom", "Ar", "--data",
      str(DATA / "demo_species.json"), "--format", "json", "--per-mass"], 0),
    (["modes", "O2", "H2O", "--format", "text"], 0),
    (["list", "--data", str(DATA / "demo_species.json")], 0),
    # Source summaries (cut at a word, UTF-8) in every format.
    (["species", "--data", str(DATA / "list_sources.json")], 0),
    (["list", "--data", str(DATA / "list_sources.json"), "--format", "csv"],
     0),
    (["list", "--data", str(DATA / "list_sources.json"), "--format",
      "json"], 0),
    (["table", "x", "--data", str(DATA / "bad" / "malformed.json")], 1),
    (["table", "x", "--data", str(DATA / "bad" / "rot_order.json")], 1),
    (["table", "Qq", "--data", str(DATA / "demo_species.json")], 1),
    (["table", "H2O", "--T", "300,30", "--format", "json", "--model",
      "rrho"], 1),
    (["table", "N2", "--T", "300:200:10"], 2),
    (["table", "N2", "--T", "1,2,nan"], 2),
    # Models: variants made with molq_species_with_model are freed.
    (["table", "N2", "H2", "demo-homo", "--data",
      str(DATA / "demo_levels.json"), "--compare", "rrho,levels",
      "--format", "json"], 0),
    (["table", "N2", "O2", "CO2", "--model", "rrho", "--format", "csv"], 0),
    (["modes", "demo-hetero", "--data", str(DATA / "demo_levels.json"),
      "--model", "rrho"], 0),
    (["spin", "H2", "demo-homo-frozen", "--data",
      str(DATA / "demo_levels.json"), "--per-mass"], 0),
    # Ar has no levels model: it keeps rrho, with a note.
    (["table", "N2", "Ar", "--compare", "rrho,levels"], 0),
    (["table", "N2", "Ar", "--compare", "rrho,levels", "--format", "json"],
     0),
    (["modes", "Ar", "--model", "levels", "--format", "csv"], 0),
    (["table", "demo-linear", "--data", str(DATA / "demo_species.json"),
      "--model", "levels"], 1),
    (["spin", "H2O"], 1),  # no spin-isomer model
    (["help", "table"], 0),
    (["list", "--help"], 0),
    (["help", "tabel"], 2),
    (["list", "--data", str(DATA / "no-such-file.json")], 1),
    (["table", "N2", "H2O", "CO2", "--compare", "rrho,levels", "--format",
      "csv"], 0),
    (["spin", "H2", "Ar"], 1),  # Ar has no spin-isomer model
    (["table", "N2", "--compare", "rrho,rrho"], 2),
    (["table", "N2", "--model", "harmonic"], 2),
]

failed = 0
for args, want in CASES:
    cmd = [VALGRIND, "-q", "--leak-check=full",
           "--errors-for-leak-kinds=definite,indirect",
           "--error-exitcode=99", CLI] + args
    p = subprocess.run(cmd, capture_output=True, text=True, timeout=600)
    ok = p.returncode == want
    print("%s: exit %d (want %d): %s" % ("ok" if ok else "FAIL",
                                         p.returncode, want, " ".join(args)))
    if not ok:
        failed += 1
        sys.stdout.write(p.stderr[-4000:])
sys.exit(1 if failed else 0)
