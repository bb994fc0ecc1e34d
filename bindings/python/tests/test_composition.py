"""Composition, charge, validated range and lookup by formula through the
binding.  Standard atomic weights IUPAC 2021 (from memory, as in
lib/data/formula.c); electron molar mass 5.48579909065e-4 g/mol (CODATA
2018)."""

import unittest

import molq


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


if __name__ == "__main__":
    unittest.main()
