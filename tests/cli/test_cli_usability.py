"""Regression tests of the molq command-line tool: model fallback for
atoms, per-subcommand help, `molq spin` for species without a spin-isomer
model, shortest round-trip numbers in json/csv, a missing file named once.

The tool is found through MOLQ_CLI (tests/cli/meson.build).  Sources of the
expected values are named beside each check:

* an atom has only translation and electronic levels, so a level-sum model
  and the rigid-rotor/harmonic model describe it the same way (textbook
  statistical mechanics, common practice);
* "shortest decimal that reads back as the same double": Python's repr of a
  float is that shortest string (Python language reference, float repr
  since Python 3.1; common practice), used here as the yardstick;
* the molar mass of N2, 2 x 14.0067 = 28.0134 g/mol, is the value the
  built-in set gives (`molq list`; IUPAC atomic weight of N, from memory);
* tests/cli/data files are INVENTED test data.
"""

import contextlib
import csv
import io
import json
import os
import re
import tempfile
import subprocess
import unittest
from pathlib import Path

CLI = os.environ.get("MOLQ_CLI")
DATA = Path(__file__).resolve().parent / "data"
LEVELS = DATA / "demo_levels.json"
BAD = DATA / "bad"
COLUMNS = ["cp", "cv", "h", "s", "g", "h_minus_h298", "gef", "dcp_dT"]
SUBCOMMANDS = ["table", "modes", "spin", "list", "show"]
# Options each subcommand accepts (molq.c opt_table).
OPTIONS = {
    "table": ["--data", "--T", "--p", "--format", "--per-mass", "--model",
              "--compare"],
    "modes": ["--data", "--T", "--p", "--format", "--model"],
    "spin": ["--data", "--T", "--format", "--per-mass", "--model"],
    "list": ["--data", "--format"],
    "show": ["--data", "--format"],
}
ALL_OPTIONS = OPTIONS["table"]
NUMBER = re.compile(r"(?<![\w.\"])-?\d+(?:\.\d+)?(?:[eE][-+]?\d+)?(?![\w\"])")


def run(*args):
    p = subprocess.run([CLI] + [str(a) for a in args], capture_output=True,
                       text=True, timeout=60)
    return p.returncode, p.stdout, p.stderr


def run_ok(tc, *args):
    rc, out, err = run(*args)
    tc.assertEqual(rc, 0, "molq %s failed: %s" % (args, err))
    return out, err


@contextlib.contextmanager
def species_file(text):
    """The path of a temporary species file holding `text`."""
    with tempfile.TemporaryDirectory() as d:
        path = os.path.join(d, "species.json")
        with open(path, "w") as f:
            f.write(text)
        yield path


def digits(token):
    """Significant digits of a decimal number token."""
    mant = token.lower().split("e")[0].lstrip("-").replace(".", "")
    mant = mant.lstrip("0").rstrip("0")
    return len(mant) if mant else 1


def assert_shortest(tc, token):
    """token reads back as a double whose shortest repr has as many
    significant digits as token (Python repr is the shortest)."""
    x = float(token)
    tc.assertEqual(digits(token), digits(repr(x)),
                   "%s is not the shortest form of %r" % (token, x))


@unittest.skipIf(not CLI, "MOLQ_CLI is not set")
class AtomModelFallback(unittest.TestCase):
    """An atom asked for a model it has no data for uses its own model and
    says so (model_used in json/csv, a note in text and on stderr)."""

    NOTE = "molq: note: Ar has no levels model; using rrho"

    def test_model_levels_json(self):
        out, err = run_ok(self, "table", "Ar", "--model", "levels", "--T",
                          "300,1000", "--format", "json")
        self.assertIn(self.NOTE, err)
        self.assertEqual(err.count("molq: note:"), 1, err)
        sp = json.loads(out)["species"][0]
        self.assertEqual(sp["model"], "levels")
        self.assertEqual(sp["model_used"], "rrho")
        own = json.loads(run_ok(self, "table", "Ar", "--T", "300,1000",
                                "--format", "json")[0])["species"][0]
        self.assertEqual(own["model"], "rrho")
        self.assertEqual(own["model_used"], "rrho")
        # Same species, same model: the very same numbers.
        self.assertEqual(sp["rows"], own["rows"])

    def test_model_levels_csv_and_mixed_list(self):
        out, err = run_ok(self, "table", "N2", "Ar", "--model", "levels",
                          "--T", "500", "--format", "csv")
        rows = list(csv.reader(io.StringIO(out)))
        self.assertEqual(rows[0], ["species", "model", "model_used", "T"]
                         + COLUMNS)
        self.assertEqual(rows[1][:3], ["N2", "levels", "levels"])
        self.assertEqual(rows[2][:3], ["Ar", "levels", "rrho"])
        self.assertIn(self.NOTE, err)
        self.assertNotIn("N2 has no", err)

    def test_compare(self):
        out, err = run_ok(self, "table", "Ar", "--compare", "rrho,levels",
                          "--T", "300", "--format", "csv")
        rows = list(csv.reader(io.StringIO(out)))
        self.assertEqual(rows[0], ["species", "model", "model_used", "T"]
                         + COLUMNS)
        self.assertEqual([r[:3] for r in rows[1:]],
                         [["Ar", "rrho", "rrho"], ["Ar", "levels", "rrho"]])
        self.assertEqual(rows[1][3:], rows[2][3:])
        self.assertIn(self.NOTE, err)
        doc = json.loads(run_ok(self, "table", "Ar", "--compare",
                                "rrho,levels", "--T", "300", "--format",
                                "json")[0])
        self.assertEqual([(m["model"], m["model_used"])
                          for m in doc["species"][0]["models"]],
                         [("rrho", "rrho"), ("levels", "rrho")])
        text, _ = run_ok(self, "table", "Ar", "--compare", "rrho,levels",
                         "--T", "300")
        self.assertIn("levels*", text)
        self.assertIn("Ar has no levels model", text)

    def test_text_and_modes(self):
        text, err = run_ok(self, "table", "Ar", "--model", "levels", "--T",
                           "300")
        self.assertIn("model rrho", text)
        self.assertIn("Ar has no levels model", text)
        out, err = run_ok(self, "modes", "Ar", "--model", "levels", "--T",
                          "300", "--format", "json")
        self.assertIn(self.NOTE, err)
        sp = json.loads(out)["species"][0]
        self.assertEqual((sp["model"], sp["model_used"]), ("levels", "rrho"))
        self.assertEqual(sp["modes"], ["translation", "electronic"])

    def test_molecule_without_data_still_an_error(self):
        # A molecule's level sum is different physics from its rigid rotor:
        # no silent substitution.  demo-linear (invented) has no level data.
        rc, out, err = run("table", "demo-linear", "--data",
                           DATA / "demo_species.json", "--model", "levels")
        self.assertEqual(rc, 1, err)
        self.assertEqual(out, "")
        self.assertIn("cannot use model 'levels'", err)


@unittest.skipIf(not CLI, "MOLQ_CLI is not set")
class SubcommandHelp(unittest.TestCase):
    """Each subcommand has its own help; `molq help` / --help the full
    overview; an unknown `molq help foo` names foo and the nearest."""

    def test_full_help(self):
        full, _ = run_ok(self, "--help")
        self.assertEqual(run_ok(self, "help")[0], full)
        self.assertEqual(run_ok(self, "-h")[0], full)
        for sub in SUBCOMMANDS:
            self.assertRegex(full, r"(?m)^  %s\s" % sub)

    def test_each_subcommand(self):
        full, _ = run_ok(self, "--help")
        seen = set()
        for sub in SUBCOMMANDS:
            with self.subTest(sub=sub):
                a, _ = run_ok(self, "help", sub)
                b, _ = run_ok(self, sub, "--help")
                c, _ = run_ok(self, sub, "-h")
                self.assertEqual(a, b)
                self.assertEqual(a, c)
                self.assertNotEqual(a, full)
                self.assertTrue(a.startswith("Usage: molq %s" % sub), a)
                self.assertIn("Example", a)
                self.assertRegex(a, r"(?m)^  molq %s " % sub)
                for opt in ALL_OPTIONS:
                    if opt in OPTIONS[sub]:
                        self.assertRegex(a, r"(?m)^  %s\b" % re.escape(opt))
                    else:
                        self.assertNotIn(opt + " ", a)
                flat = " ".join(a.split())
                if sub in ("table", "spin"):
                    for w in ("ideal-gas estimates", "applicable codes",
                              "licensed engineer"):
                        self.assertIn(w, flat)
                self.assertTrue(all(len(l) <= 80 for l in a.splitlines()))
                seen.add(a)
        self.assertEqual(len(seen), len(SUBCOMMANDS))

    def test_help_with_options_still_help(self):
        # --help anywhere after the subcommand wins over other options.
        a, _ = run_ok(self, "table", "N2", "--T", "300", "--help")
        self.assertEqual(a, run_ok(self, "help", "table")[0])

    def test_unknown(self):
        rc, out, err = run("help", "tabel")
        self.assertEqual(rc, 2)
        self.assertEqual(out, "")
        self.assertIn("'tabel'", err)
        self.assertIn("'table'", err)
        rc, out, err = run("help", "spni")
        self.assertEqual(rc, 2)
        self.assertIn("'spin'", err)


@unittest.skipIf(not CLI, "MOLQ_CLI is not set")
class SpinWithoutIsomerModel(unittest.TestCase):
    """`molq spin` for a species with no spin-isomer model fails with a
    message instead of printing 0."""

    def test_water(self):
        for fmt in ("text", "csv", "json"):
            rc, out, err = run("spin", "H2O", "--format", fmt)
            self.assertEqual(rc, 1, err)
            self.assertEqual(out, "")
            self.assertIn("H2O has no spin-isomer model in molq", err)

    def test_others(self):
        for name in ("CO2", "CH4", "C2H6", "Ar"):
            rc, out, err = run("spin", name)
            self.assertEqual(rc, 1, err)
            self.assertIn("%s has no spin-isomer model in molq" % name, err)
        # Diatomic level sums still work, 0 included for a heteronuclear one.
        out, _ = run_ok(self, "spin", "H2", "CO", "--T", "20",
                        "--format", "csv")
        self.assertEqual(len(out.splitlines()), 3)


@unittest.skipIf(not CLI, "MOLQ_CLI is not set")
class ShortestNumbers(unittest.TestCase):
    """json and csv numbers: the shortest decimal that reads back as the
    same double."""

    def test_molar_mass_json(self):
        for args in (["table", "N2", "--T", "300"],
                     ["spin", "N2", "--T", "300"], ["list"]):
            out, _ = run_ok(self, *args, "--format", "json")
            self.assertNotIn("28.013400000000001", out)
            self.assertRegex(out, r'"molar_mass": 28\.0134\b')

    def test_every_number(self):
        for args in (["table", "N2", "CO2", "H2O", "--T", "298.15:1500:301"],
                     ["modes", "N2", "C2H6", "--T", "300,700"],
                     ["spin", "H2", "--T", "20,77.3"],
                     ["table", "H2", "--compare", "rrho,levels", "--T",
                      "1234.5", "--per-mass"],
                     ["list"]):
            with self.subTest(args=args):
                js, _ = run_ok(self, *args, "--format", "json")
                toks = NUMBER.findall(js)
                self.assertGreaterEqual(len(toks), 5)
                for t in toks:
                    assert_shortest(self, t)
                cs, _ = run_ok(self, *args, "--format", "csv")
                n = 0
                for row in list(csv.reader(io.StringIO(cs)))[1:]:
                    for f in row:
                        if NUMBER.fullmatch(f):
                            assert_shortest(self, f)
                            n += 1
                self.assertGreaterEqual(n, 4)

    def test_csv_equals_json_exactly(self):
        args = ["table", "N2", "CO2", "--T", "200,298.15,1000,2500"]
        rows = list(csv.DictReader(io.StringIO(
            run_ok(self, *args, "--format", "csv")[0])))
        doc = json.loads(run_ok(self, *args, "--format", "json")[0])
        i = 0
        for sp in doc["species"]:
            for r in sp["rows"]:
                for c in ["T"] + COLUMNS:
                    self.assertEqual(float(rows[i][c]), r[c],
                                     "%s %s" % (sp["name"], c))
                i += 1
        self.assertEqual(i, len(rows))

    def test_text_unchanged(self):
        # Text output keeps its 7-8 significant digits.
        out, _ = run_ok(self, "table", "N2", "--T", "300")
        self.assertIn("28.0134 g/mol", out)
        row = [l for l in out.splitlines() if l.split()[:1] == ["300"]][0]
        self.assertTrue(all(digits(f) <= 8 for f in row.split()), row)


@unittest.skipIf(not CLI, "MOLQ_CLI is not set")
class FileNamedOnce(unittest.TestCase):
    """An unreadable species file is named once in the message."""

    def test_missing_file(self):
        path = str(DATA / "no-such-file.json")
        for args in (["table", "N2", "--data", path], ["list", "--data", path]):
            rc, out, err = run(*args)
            self.assertEqual(rc, 1)
            self.assertEqual(out, "")
            self.assertEqual(err.count(path), 1, err)
            self.assertIn("cannot open", err)

    def test_bad_files_named_once(self):
        for f in sorted(BAD.glob("*.json")):
            with self.subTest(file=f.name):
                rc, _, err = run("list", "--data", f)
                self.assertEqual(rc, 1)
                first = err.splitlines()[0]
                self.assertEqual(first.count(str(f)), 1, first)
                self.assertEqual(first.count("species file"), 1, first)


@unittest.skipIf(not CLI, "MOLQ_CLI is not set")
class WarningsAndOverrides(unittest.TestCase):
    """A file that loads with warnings gets them on stderr, once each and
    naming the file; a file species that shadows a built-in one is noted;
    the results still follow on stdout."""

    def test_warnings_on_stderr(self):
        # N2 with 30 g/mol against its formula's 28.014 (standard atomic
        # weight of N 14.007, IUPAC, from memory) and no schema_version
        text = ('{"species": [{"name": "N2", "formula": "N2", "molar_mass": '
                '30, "structure": "linear", "rotational_constants": [2.0], '
                '"vibrations": [{"wavenumber": 2300}]}]}')
        with species_file(text) as path:
            out, err = run_ok(self, "table", "N2", "--data", path, "--T",
                              "300", "--format", "csv")
        self.assertTrue(out.startswith("species,T,"), out)
        lines = err.splitlines()
        self.assertIn("molq: warning: %s: field 'schema_version': missing"
                      % path, err)
        self.assertIn("species 'N2': field 'molar_mass': 30 g/mol", err)
        self.assertIn("molq: note: species 'N2' from %s overrides the "
                      "built-in one" % path, err)
        self.assertEqual(len(lines), 3, err)
        self.assertNotIn("species file: field", err)

    def test_clean_file_is_quiet(self):
        # the README's sample file (no formula, schema_version given)
        sample = DATA.parent.parent.parent / "examples" / "my_species.json"
        _, err = run_ok(self, "list", "--data", sample)
        self.assertEqual(err, "")


@unittest.skipIf(not CLI, "MOLQ_CLI is not set")
class ShowAndFormulaLookup(unittest.TestCase):
    """molq show reports composition, charge, ranges, modes, source and the
    data checks; species are found by formula as well as by name."""

    def test_show_json(self):
        out, _ = run_ok(self, "show", "CO2", "--format", "json")
        doc = json.loads(out)["species"][0]
        self.assertEqual(doc["name"], "CO2")
        self.assertEqual(doc["elements"], {"C": 1, "O": 2})
        self.assertEqual(doc["charge"], 0)
        # dfH(CO2, 298.15 K) = -393.522 kJ/mol, NIST-JANAF 1998 (the
        # built-in value; h(298.15 K) is dfH by molq's enthalpy scale)
        self.assertAlmostEqual(doc["formation_enthalpy_298"], -393522.0,
                               delta=0.5)
        self.assertIn("translation", doc["modes"])
        self.assertEqual(doc["warnings"], [])
        self.assertIn("source", doc)

    def test_show_text_and_warnings(self):
        text = ('{"schema_version": 1, "species": [{"name": "odd", '
                '"formula": "Ar", "molar_mass": 20, "structure": "atom"}]}')
        with species_file(text) as path:
            out, _ = run_ok(self, "show", "odd", "--data", path)
        self.assertIn("elements          Ar 1", out)
        self.assertRegex(out, r"\n  warning +species 'odd': field "
                              r"'molar_mass'")

    def test_formula_lookup(self):
        # a name that is not a formula, found through its formula
        text = ('{"schema_version": 1, "species": [{"name": "calcium '
                'vapour", "formula": "Ca", "structure": "atom"}]}')
        with species_file(text) as path:
            out, _ = run_ok(self, "show", "Ca", "--data", path)
            self.assertTrue(out.startswith("calcium vapour\n"), out)
            a, _ = run_ok(self, "table", "Ca", "--data", path, "--T", "500",
                          "--format", "csv")
            b, _ = run_ok(self, "table", "calcium vapour", "--data", path,
                          "--T", "500", "--format", "csv")
            self.assertEqual(a, b)
        self.assertEqual(run("show", "NoSuchThing")[0], 1)

    def test_show_help(self):
        out, _ = run_ok(self, "help", "show")
        self.assertTrue(out.startswith("Usage: molq show"), out)


SPECIES_DIR = DATA.parent.parent.parent / "data" / "species"
SHOW_CHECKS = DATA / "show_checks.json"


def species_entry(name):
    """The entry of built-in species `name`, read from data/species/*.json
    directly (not through molq)."""
    for path in sorted(SPECIES_DIR.glob("*.json")):
        with open(path, encoding="utf-8") as f:
            for entry in json.load(f)["species"]:
                if entry["name"] == name:
                    return entry
    raise KeyError(name)


@unittest.skipIf(not CLI, "MOLQ_CLI is not set")
class ShowRangeAndChecks(unittest.TestCase):
    """molq show prints the validated range and the results of the data
    checks (molar mass against the formula, plausibility of diatomic
    constants) in text and json.  Expected ranges come from the species
    files (N2: data/species/diatomics.json, e-: ions.json); the Kratzer
    estimate De = 4 Be^3/we^2 (common practice, any text on diatomic
    spectra) is computed here from the invented file's constants."""

    def test_validated_range_from_species_files(self):
        for name in ("N2", "e-"):
            with self.subTest(name=name):
                lo, hi = species_entry(name)["validated_range"]
                text, _ = run_ok(self, "show", name)
                self.assertIn("\n  validated range   %g K to %g K\n"
                              % (lo, hi), text)
                doc = json.loads(run_ok(self, "show", name, "--format",
                                        "json")[0])["species"][0]
                self.assertEqual(doc["validated_range"],
                                 [float(lo), float(hi)])
        text, _ = run_ok(self, "show", "N2")
        self.assertIn("validated range   100 K to 6000 K", text)

    def test_no_range(self):
        text, _ = run_ok(self, "show", "no-range", "--data", SHOW_CHECKS)
        self.assertIn("\n  validated range   (not stated by the data)\n",
                      text)
        doc = json.loads(run_ok(self, "show", "no-range", "--data",
                                SHOW_CHECKS, "--format", "json")[0])
        self.assertNotIn("validated_range", doc["species"][0])

    def test_clean_species_says_what_was_checked(self):
        text, _ = run_ok(self, "show", "N2")
        flat = " ".join(text.split())
        self.assertIn("data checks no warnings from the checks that apply "
                      "(molar mass against the formula; for diatomic states "
                      "the plausibility of De, alpha_e, we^2/(4 wexe), Be "
                      "against re, D0 against the atoms' formation "
                      "enthalpies)", flat)
        self.assertNotIn("\n  warning ", text)
        doc = json.loads(run_ok(self, "show", "N2", "--format", "json")[0])
        self.assertEqual(doc["species"][0]["warnings"], [])

    def test_plausibility_finding(self):
        we, be, de = 2358.57, 1.99824, 5.7e-7  # show_checks.json, slip-N2
        ratio = de / (4.0 * be ** 3 / we ** 2)
        self.assertAlmostEqual(ratio, 0.099, delta=0.001)
        text, err = run_ok(self, "show", "slip-N2", "--data", SHOW_CHECKS)
        self.assertIn("\n  validated range   300 K to 2500 K\n", text)
        self.assertRegex(text, r"\n  warning +species 'slip-N2': field "
                               r"'diatomic_states\[0\]\.De': 5\.7e-07 cm\^-1 "
                               r"is %s x the Kratzer estimate"
                               % re.escape("%.2g" % ratio))
        self.assertNotIn("no warnings", text)
        # The same finding on stderr, as for every file species.
        self.assertIn("molq: warning: %s: species 'slip-N2': field "
                      "'diatomic_states[0].De'" % SHOW_CHECKS, err)
        doc = json.loads(run_ok(self, "show", "slip-N2", "--data",
                                SHOW_CHECKS, "--format", "json")[0])
        sp = doc["species"][0]
        self.assertEqual(sp["validated_range"], [300.0, 2500.0])
        self.assertEqual(len(sp["warnings"]), 1, sp["warnings"])
        self.assertIn("'diatomic_states[0].De'", sp["warnings"][0])
        self.assertIn("Kratzer", sp["warnings"][0])


if __name__ == "__main__":
    unittest.main()
