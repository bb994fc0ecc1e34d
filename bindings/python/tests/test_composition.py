"""Composition, charge, validated range and lookup by formula through the
binding.  Standard atomic weights IUPAC 2021 (from memory, as in
lib/data/formula.c); electron molar mass 5.48579909065e-4 g/mol (CODATA
2018)."""

import sys
import unittest
from pathlib import Path

import molq

# the helper shared with the command-line tests (tests/species_data.py)
sys.path.insert(0, str(Path(__file__).resolve().parents[3] / "tests"))
from species_data import species_files  # noqa: E402
DEMO = Path(__file__).resolve().parents[3] / "tests" / "cli" / "data" / \
    "demo_species.json"


class Composition(unittest.TestCase):
    def test_elements_and_charge(self):
        co2 = molq.Species.from_constants("x", structure="atom",
                                          molar_mass=None, formula="CO2")
        self.assertEqual(co2.elements, {"C": 1, "O": 2})
        self.assertEqual(co2.charge, 0)
        ion = molq.Species.from_constants("y", structure="atom",
                                          molar_mass=None, formula="N2+")
        self.assertEqual(ion.elements, {"N": 2})
        self.assertEqual(ion.charge, 1)
        # M_u = 0.99999999965 g/mol (CODATA 2018); less one electron
        self.assertAlmostEqual(ion.molar_mass,
                               2 * 14.007 * 0.99999999965 - 5.48579909065e-4,
                               delta=1e-9)
        e = molq.Species.from_constants(
            "e-", structure="atom", molar_mass=None, formula="e-",
            electronic_levels=[(0.0, 2)])
        self.assertEqual(e.elements, {})
        self.assertEqual(e.charge, -1)
        self.assertAlmostEqual(e.molar_mass, 5.48579909065e-4, delta=1e-16)

    def test_validated_range(self):
        a = molq.Species.from_constants("a", structure="atom",
                                        molar_mass=None, formula="Ar",
                                        validated_range=(100, 6000))
        self.assertEqual(a.validated_range, (100.0, 6000.0))
        b = molq.Species.from_constants("b", structure="atom",
                                        molar_mass=None, formula="Ar")
        self.assertIsNone(b.validated_range)
        with self.assertRaises(molq.MolqError) as cm:
            molq.Species.from_constants("c", structure="atom",
                                        molar_mass=None, formula="Ar",
                                        validated_range=(300, 200))
        self.assertIn("validated_range", cm.exception.message)

    def test_by_formula(self):
        db = molq.Database.builtin()
        self.assertEqual(db.by_formula("CO2").name, "CO2")
        self.assertIsNone(db.by_formula("Uuo"))


class Lookup(unittest.TestCase):
    """Enumerating the built-in database and finding species by name and by
    formula.  Expected values: the species files data/species/*.json
    (names, formulas, "validated_range"; e.g. e- is the electron, formula
    'e-', charge -1; N2's range is [100, 6000] in diatomics.json)."""

    def test_enumerate_against_species_files(self):
        db = molq.Database.builtin()
        files = species_files()
        self.assertEqual(sorted(db.names()), sorted(files))
        self.assertEqual(len(db), len(files))
        self.assertEqual([sp.name for sp in db], db.names())
        for sp in db:
            with self.subTest(name=sp.name):
                entry = files[sp.name]
                self.assertEqual(sp.formula, entry["formula"])
                want = entry.get("validated_range")
                self.assertEqual(sp.validated_range,
                                 None if want is None
                                 else tuple(float(x) for x in want))

    def test_by_name_and_by_formula(self):
        db = molq.Database.builtin()
        order = db.names()
        for sp in db:
            with self.subTest(name=sp.name):
                self.assertEqual(db[sp.name].name, sp.name)
                self.assertIn(sp.name, db)
                self.assertEqual(db.get(sp.name).name, sp.name)
                # by formula: the first species in file order with it
                first = next(n for n in order
                             if db[n].formula == sp.formula)
                self.assertEqual(db.by_formula(sp.formula).name, first)
        e = db.by_formula("e-")
        self.assertEqual((e.name, e.charge), ("e-", -1))
        n2 = db.by_formula("N2")
        self.assertEqual(n2.name, "N2")
        self.assertEqual(n2.validated_range, (100.0, 6000.0))
        self.assertEqual(db.by_formula(b"CO2").name, "CO2")
        # exact text, case-sensitive, no normalisation
        for word in ("n2", "N 2", "OC"):
            self.assertIsNone(db.by_formula(word))
        sentinel = object()
        self.assertIs(db.by_formula("Uuo", sentinel), sentinel)
        with self.assertRaises(molq.UnknownSpeciesError):
            db["n2"]
        with self.assertRaises(TypeError):
            db.by_formula(None)

    def test_empty_formula_finds_nothing(self):
        # Regression: a species without a formula reports "", and
        # by_formula("") used to return the first such species of a file
        # (demo-bent in the invented tests/cli/data/demo_species.json).
        db = molq.Database.from_file(str(DEMO))
        self.assertEqual(db["demo-bent"].formula, "")
        self.assertIsNone(db.by_formula(""))
        self.assertIsNone(molq.Database.builtin().by_formula(""))

    def test_nul_in_key_finds_nothing(self):
        # Regression: ctypes passed "C\0O2" as "C", so a key that no species
        # has found another species (C for "C\0O2", N2 for "N2\0x").
        db = molq.Database.builtin()
        self.assertIsNone(db.by_formula("C\x00O2"))
        self.assertIsNone(db.by_formula(b"C\x00O2"))
        self.assertIsNone(db.get("N2\x00x"))
        self.assertNotIn("N2\x00", db)
        with self.assertRaises(molq.UnknownSpeciesError):
            db["C\x00O2"]
        # A str no UTF-8 name can equal (lone surrogate) is not found
        # either (it used to raise UnicodeEncodeError from the lookup).
        self.assertIsNone(db.by_formula("\ud800"))
        self.assertNotIn("\ud800", db)


if __name__ == "__main__":
    unittest.main()
