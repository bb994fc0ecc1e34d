"""Database and Species surface: names, units at the boundary, version,
and the usage example in the package docstring."""

import math
import contextlib
import io
import re
import textwrap
import unittest

import molq

# Species file values (data/species/*.json; JANAF 1998 molar masses).
FILE_MOLAR_MASS = {"Ar": 39.948, "N2": 28.0134, "CO2": 44.0095,
                   "H2O": 18.0153}


class DatabaseSurface(unittest.TestCase):
    def test_builtin(self):
        db = molq.Database.builtin()
        names = db.names()
        self.assertEqual(len(db), len(names))
        self.assertEqual([sp.name for sp in db], names)
        for n in ("Ar", "O", "H2", "N2", "O2", "CO", "CO2", "H2O"):
            self.assertIn(n, db)
            self.assertEqual(db[n].name, n)

    def test_molar_mass_in_grams(self):
        db = molq.Database.builtin()
        for n, M in FILE_MOLAR_MASS.items():
            self.assertAlmostEqual(db[n].molar_mass, M, delta=1e-9)

    def test_formula_molar_mass(self):
        # IUPAC standard atomic weights (conventional): C 12.011, O 15.999,
        # so CO2 = 44.009 g/mol (from memory).
        sp = molq.Species.from_constants(
            "carbon dioxide", structure="linear", molar_mass=None,
            formula="CO2", symmetry_number=2, rotational_constants=[0.39],
            vibrations=[1333.0, (667.0, 2), 2349.0])
        self.assertAlmostEqual(sp.molar_mass, 44.009, delta=0.002)
        self.assertEqual(sp.formula, "CO2")

    def test_species_attributes(self):
        db = molq.Database.builtin()
        co = db["CO"]
        self.assertTrue(co.has_formation_enthalpy)
        self.assertIn("JANAF", co.source)
        # h at 298.15 K is the formation enthalpy (enthalpy scale in
        # molq.h); JANAF 1998: dfH(CO, 298.15 K) = -110.527 kJ/mol.
        self.assertAlmostEqual(co.h(298.15), -110527.0, delta=0.01)
        own = molq.Species.from_constants("Qa", structure="atom",
                                          molar_mass=4.0, source="invented")
        self.assertFalse(own.has_formation_enthalpy)
        self.assertEqual(own.source, "invented")
        self.assertEqual(own.formula, "")
        # An atom has no model limit: t_min is the Boltzmann-gas limit at
        # 1 bar, n lambda^3 = g0 (common practice, no source), computed
        # here independently: 1.87 K for mass 4 g/mol.
        h, k, na = 6.62607015e-34, 1.380649e-23, 6.02214076e23
        m = 4.0e-3 / na
        tb = (1e5 * h**3 / (k**2.5 * (2 * math.pi * m) ** 1.5)) ** 0.4
        self.assertAlmostEqual(own.t_min, tb, delta=1e-9 * tb)
        # An atom translates but neither rotates nor vibrates; a diatomic
        # does all three, as separate modes under the rigid rotor /
        # harmonic model and as one rovibronic level sum under "levels".
        self.assertIn("translation", own.mode_kinds)
        self.assertNotIn("rotation", own.mode_kinds)
        self.assertNotIn("vibration", own.mode_kinds)
        for kind in ("translation", "rotation", "vibration"):
            self.assertIn(kind, db["N2"].with_model("rrho").mode_kinds)
        self.assertEqual(db["N2"].mode_kinds, ["translation", "rovibronic"])
        self.assertIn("Qa", repr(own))

    def test_properties_and_units(self):
        names = molq.property_names()
        for n in ("lnq", "cp", "cv", "h", "u", "s", "g", "a",
                  "h_minus_h298", "gef", "h_minus_h0", "dcp_dT"):
            self.assertIn(n, names)
        self.assertEqual(molq.property_unit("cp"), "J/(mol K)")
        self.assertEqual(molq.property_unit("h"), "J/mol")
        self.assertEqual(molq.P_STANDARD, 1e5)

    def test_version(self):
        self.assertRegex(molq.version(), r"^0\.\d+\.\d+")
        self.assertTrue(re.search(r"libmolq", molq.library_path()))


class DocstringExample(unittest.TestCase):
    def test_example_runs(self):
        doc = molq.__doc__
        code = doc.split("constants::\n", 1)[1].split("\nCAUTION", 1)[0]
        env = {}
        out = io.StringIO()
        with contextlib.redirect_stdout(out):
            exec(textwrap.dedent(code), env)
        self.assertIn("coil duty", out.getvalue())
        self.assertIn("rejected: MOLQ_EDOMAIN", out.getvalue())
        # Cooling releases heat, and the mean cp lies between the
        # mixture's cp at the two ends (cp rises with T for these gases).
        self.assertGreater(env["duty_kW"], 0.0)
        db, mix = env["db"], env["exhaust"]
        cp_end = [sum(x * db[n].cp(T) for n, x in mix.items())
                  for T in (env["T_out"], env["T_in"])]
        self.assertLess(cp_end[0], env["cp_mean"])
        self.assertLess(env["cp_mean"], cp_end[1])


if __name__ == "__main__":
    unittest.main()
