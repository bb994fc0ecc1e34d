"""Errors reach Python as MolqError / ValueError / KeyError, with the
library's status and message; object lifetimes are safe."""

import gc
import math
import os
import pickle
import tempfile
import unittest
import weakref

import molq

GOOD_ENTRY = ('{"name": "Qx", "molar_mass": 30.0, "structure": "linear", '
              '"symmetry_number": %s, "rotational_constants": [1.5], '
              '"vibrations": [{"wavenumber": 1800}]}')


def species_text(*entries):
    return '{"schema_version": 1, "species": [%s]}' % ", ".join(entries)


class BadSpeciesText(unittest.TestCase):
    def assertMolqError(self, status, fields, text):
        with self.assertRaises(molq.MolqError) as cm:
            molq.Database.from_string(text)
        exc = cm.exception
        self.assertEqual(exc.status, status, exc.message)
        self.assertEqual(exc.status_name, molq.STATUS_NAMES[status])
        for word in fields:
            self.assertIn(word, exc.message)
        self.assertIn(exc.message, str(exc))
        return exc

    def test_symmetry_number_out_of_range(self):
        self.assertMolqError(molq.EVALUE, ["Qx", "symmetry_number"],
                             species_text(GOOD_ENTRY % "0"))

    def test_wrong_type(self):
        self.assertMolqError(molq.ETYPE, ["Qx", "symmetry_number"],
                             species_text(GOOD_ENTRY % '"two"'))

    def test_missing_structure(self):
        self.assertMolqError(
            molq.EKEY, ["Qy", "structure"],
            species_text('{"name": "Qy", "molar_mass": 12.0}'))

    def test_unknown_key(self):
        self.assertMolqError(
            molq.EKEY, ["Qy", "colour"],
            species_text('{"name": "Qy", "molar_mass": 12.0, '
                         '"structure": "atom", "colour": "blue"}'))

    def test_syntax_error_gives_line(self):
        exc = self.assertMolqError(molq.ESYNTAX, ["line"],
                                   '{"species": [\n  {"name": "Qx",,}]}')
        self.assertIn("line 2", exc.message)

    def test_duplicate(self):
        self.assertMolqError(molq.EDUPLICATE, ["Qx"],
                             species_text(GOOD_ENTRY % "1",
                                          GOOD_ENTRY % "2"))

    def test_integer_bounds_and_integral_floats(self):
        # Integers past a field's documented bound are refused naming the
        # field (they were clamped to 1e9 before); 2.0 reads as 2.
        exc = self.assertMolqError(molq.EVALUE, ["Qx", "symmetry_number",
                                                 "from 1 to 100000"],
                                   species_text(GOOD_ENTRY % "4294967298"))
        self.assertNotIn("1000000000", exc.message)
        a = molq.Database.from_string(species_text(GOOD_ENTRY % "1"))
        b = molq.Database.from_string(species_text(GOOD_ENTRY % "1.0"))
        self.assertEqual(a["Qx"].s(300.0), b["Qx"].s(300.0))

    def test_warnings(self):
        # A file without schema_version loads, with a warning naming the
        # field; a molar mass 20 % off its formula's (CO: 28.010 g/mol
        # from IUPAC standard atomic weights, from memory) is warned about
        # on the species and on the database.
        db = molq.Database.from_string(
            '{"species": [{"name": "Qc", "formula": "CO", "molar_mass": '
            '33.6, "structure": "linear", "rotational_constants": [1.9], '
            '"vibrations": [{"wavenumber": 2170}]}]}')
        self.assertEqual(len(db.warnings), 2)
        self.assertIn("'schema_version': missing", db.warnings[0])
        self.assertIn("species 'Qc': field 'molar_mass'", db.warnings[1])
        self.assertEqual(db["Qc"].warnings, (db.warnings[1],))
        # the built-in set loads without warnings (NO's De is fixed)
        self.assertEqual(molq.Database.builtin().warnings, ())
        self.assertEqual(molq.Database.builtin()["N2"].warnings, ())

    def test_geometry(self):
        # from_constants takes a geometry; CO2 with re(CO) 1.1600 A (from
        # memory) and B0 0.39022 cm^-1 (from memory) is quiet, both bonds
        # 10 % long (B 21 % above the geometric value) are warned naming
        # the field; an atom the formula lacks is an error naming it.
        def co2(r, atoms=None):
            return molq.Species.from_constants(
                "Gc", structure="linear", molar_mass=None, formula="CO2",
                symmetry_number=2, rotational_constants=[0.39022],
                vibrations=[(1333, 1), (667, 2), (2349, 1)],
                geometry=atoms or [("O", (0, 0, -r)), {"element": "C",
                                   "xyz": [0, 0, 0]}, ("O", (0, 0, r))])
        self.assertEqual(co2(1.16).warnings, ())
        w = co2(1.276).warnings
        self.assertEqual(len(w), 1)
        self.assertIn("species 'Gc': field 'rotational_constants[0]': B = "
                      "0.39022 cm^-1 differs by +21 %", w[0])
        with self.assertRaises(molq.MolqError) as cm:
            co2(0, [("O", (0, 0, -1.16)), ("S", (0, 0, 0)),
                    ("O", (0, 0, 1.16))])
        self.assertIn("field 'geometry[1].element': 'S' is not in formula",
                      cm.exception.message)
        with self.assertRaises(ValueError):
            co2(0, [("O", (0, 0)), ("C", (0, 0, 0)), ("O", (0, 0, 1.16))])
        # the built-in CO2 carries its geometry and stays quiet
        self.assertEqual(molq.Database.builtin()["CO2"].warnings, ())

    def test_good_text_reads(self):
        db = molq.Database.from_string(species_text(GOOD_ENTRY % "1"))
        self.assertEqual(db.names(), ["Qx"])
        self.assertEqual(db["Qx"].molar_mass, 30.0)

    def test_missing_file(self):
        with tempfile.TemporaryDirectory() as d:
            path = os.path.join(d, "no-such-file.json")
            with self.assertRaises(molq.MolqError) as cm:
                molq.Database.from_file(path)
            self.assertEqual(cm.exception.status, molq.EIO)

    def test_from_file_reports_field(self):
        with tempfile.TemporaryDirectory() as d:
            path = os.path.join(d, "bad.json")
            with open(path, "w") as f:
                f.write(species_text(GOOD_ENTRY % "-3"))
            with self.assertRaises(molq.MolqError) as cm:
                molq.Database.from_file(path)
            self.assertEqual(cm.exception.status, molq.EVALUE)
            self.assertIn("symmetry_number", cm.exception.message)

    def test_error_pickles(self):
        exc = molq.MolqError(molq.EVALUE, "species 'Q': field 'x': bad")
        back = pickle.loads(pickle.dumps(exc))
        self.assertEqual((back.status, back.message, back.status_name),
                         (exc.status, exc.message, "MOLQ_EVALUE"))


class BadConstants(unittest.TestCase):
    def test_negative_molar_mass(self):
        with self.assertRaises(molq.MolqError) as cm:
            molq.Species.from_constants("Qn", structure="atom",
                                        molar_mass=-4.0)
        self.assertEqual(cm.exception.status, molq.EVALUE)
        self.assertIn("molar_mass", cm.exception.message)
        self.assertIn("Qn", cm.exception.message)

    def test_missing_rotational_constant(self):
        with self.assertRaises(molq.MolqError) as cm:
            molq.Species.from_constants("Qr", structure="linear",
                                        molar_mass=20.0)
        self.assertIn("rotational_constants", cm.exception.message)

    def test_bad_vibration(self):
        with self.assertRaises(molq.MolqError) as cm:
            molq.Species.from_constants(
                "Qv", structure="linear", molar_mass=20.0,
                rotational_constants=[2.0], vibrations=[(-100.0, 1)])
        self.assertIn("vibrations", cm.exception.message)

    def test_python_side_errors(self):
        with self.assertRaises(ValueError):
            molq.Species.from_constants("Q", structure="bent",
                                        molar_mass=20.0)
        with self.assertRaises(ValueError):
            molq.Species.from_constants("Q", structure="atom",
                                        molar_mass=20.0, rotor="floppy")
        with self.assertRaises(TypeError):
            molq.Species.from_constants("Q", structure="linear",
                                        molar_mass=20.0,
                                        rotational_constants=[2.0],
                                        vibrations=[(900.0, 1.5)])
        with self.assertRaises(TypeError):
            molq.Species.from_constants("Q", structure="atom",
                                        molar_mass=20.0, symmetry_number=1.0)


class BadStates(unittest.TestCase):
    @classmethod
    def setUpClass(cls):
        cls.n2 = molq.Database.builtin()["N2"]

    def assertDomain(self, T, p=1e5):
        with self.assertRaises(molq.MolqError) as cm:
            self.n2.cp(T, p)
        self.assertEqual(cm.exception.status, molq.EDOMAIN)
        self.assertEqual(cm.exception.status_name, "MOLQ_EDOMAIN")
        self.assertIn("N2", cm.exception.message)

    def test_bad_temperatures(self):
        for T in (0.0, -1.0, -300, float("nan"), float("inf")):
            self.assertDomain(T)

    def test_bad_pressures(self):
        for p in (0.0, -1e5, float("nan")):
            self.assertDomain(300.0, p)

    def test_bad_temperature_in_sequence(self):
        with self.assertRaises(molq.MolqError) as cm:
            self.n2.eval("h", [300.0, 400.0, -5.0, 500.0])
        self.assertEqual(cm.exception.status, molq.EDOMAIN)
        self.assertIn("-5", cm.exception.message)
        with self.assertRaises(molq.MolqError):
            self.n2.eval_per_mass("h", [300.0, math.nan])

    def test_below_model_range(self):
        # The corrected asymmetric top of the rigid-rotor model is valid
        # from T = theta_A (molq.h).
        h2o = molq.Database.builtin()["H2O"].with_model("rrho")
        self.assertGreater(h2o.t_min, 0.0)
        with self.assertRaises(molq.MolqError) as cm:
            h2o.cp(0.5 * h2o.t_min)
        self.assertEqual(cm.exception.status, molq.ERANGE)
        h2o.cp(1.01 * h2o.t_min)   # just above is fine

    def test_unknown_property(self):
        for bad in ("Cp", "enthalpy", "", None, 1):
            with self.assertRaises(ValueError):
                self.n2.eval(bad, 300.0)
        with self.assertRaises(ValueError):
            self.n2.eval_many(["cp", "heat"], 300.0)
        with self.assertRaises(ValueError):
            molq.property_unit("heat")

    def test_unknown_species(self):
        db = molq.Database.builtin()
        with self.assertRaises(KeyError):
            db["Unobtainium"]
        self.assertIsNone(db.get("Unobtainium"))
        self.assertNotIn("Unobtainium", db)

    def test_non_numeric(self):
        with self.assertRaises(TypeError):
            self.n2.cp("300")
        with self.assertRaises(TypeError):
            self.n2.cp(300.0, "1e5")
        with self.assertRaises(TypeError):
            self.n2.cp(300.0, None)


class Lifetimes(unittest.TestCase):
    def test_species_outlives_del_db(self):
        db = molq.Database.builtin()
        ref = weakref.ref(db)
        co2 = db["CO2"]
        first = co2.s(1200.0)
        del db
        gc.collect()
        self.assertIsNotNone(ref(), "the species must keep its database")
        for _ in range(3):
            junk = [molq.Database.builtin() for _ in range(5)]  # reuse heap
            del junk
        self.assertEqual(co2.s(1200.0), first)
        self.assertEqual(co2.name, "CO2")
        del co2
        gc.collect()
        self.assertIsNone(ref(), "database leaked after its last species")

    def test_iteration_species_outlive_db(self):
        names = molq.Database.builtin().names()
        species = list(molq.Database.builtin())
        gc.collect()
        self.assertEqual([sp.name for sp in species], names)
        # The starter set holds these (more may follow).
        for n in ["Ar", "O", "H2", "N2", "O2", "CO", "CO2", "H2O"]:
            self.assertIn(n, names)

    def test_close(self):
        db = molq.Database.builtin()
        n2 = db["N2"]
        db.close()
        db.close()   # idempotent
        with self.assertRaises(ValueError):
            n2.cp(300.0)
        with self.assertRaises(ValueError):
            len(db)
        own = molq.Species.from_constants("Qc", structure="atom",
                                          molar_mass=10.0)
        with own:
            own.cp(300.0)
        with self.assertRaises(ValueError):
            own.cp(300.0)

    def test_owned_species_freed_repeatedly(self):
        # Many create/collect cycles: a double free or use-after-free in
        # the finalizer would crash or corrupt the values.
        want = None
        for i in range(2000):
            sp = molq.Species.from_constants(
                "Qloop", structure="linear", molar_mass=28.0,
                rotational_constants=[1.9], vibrations=[2300.0])
            value = sp.cp(700.0)
            want = value if want is None else want
            self.assertEqual(value, want)
            if i % 2:
                sp.close()
            del sp


if __name__ == "__main__":
    unittest.main()
