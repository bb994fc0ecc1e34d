"""Sequences and numpy arrays give the same numbers as scalar calls."""

import unittest

import molq

try:
    import numpy
except ImportError:   # the binding needs only the standard library
    numpy = None

PROPS = ["cp", "h", "s", "g", "gef", "h_minus_h298", "dcp_dT", "lnq"]
TEMPS = [200.0, 298.15, 450.5, 1000.0, 2500.0, 6000.0]


class Sequences(unittest.TestCase):
    @classmethod
    def setUpClass(cls):
        cls.db = molq.Database.builtin()
        cls.species = [cls.db[n] for n in ("Ar", "O", "CO2", "H2O")]

    def test_list_tuple_iterators(self):
        for sp in self.species:
            for prop in PROPS:
                scalar = [sp.eval(prop, T, 3e5) for T in TEMPS]
                self.assertEqual(sp.eval(prop, TEMPS, 3e5), scalar)
                self.assertEqual(sp.eval(prop, tuple(TEMPS), 3e5), scalar)
                self.assertEqual(sp.eval(prop, (T for T in TEMPS), 3e5),
                                 scalar)
                self.assertEqual(getattr(sp, prop)(TEMPS, 3e5), scalar)

    def test_integers_and_range(self):
        sp = self.db["N2"]
        self.assertEqual(sp.cp(range(300, 3000, 300)),
                         [sp.cp(float(T)) for T in range(300, 3000, 300)])
        self.assertIsInstance(sp.cp(300), float)
        self.assertEqual(sp.cp(300), sp.cp(300.0))

    def test_empty(self):
        self.assertEqual(self.db["N2"].cp([]), [])

    def test_per_mass(self):
        sp = self.db["CO2"]
        M = sp.molar_mass * 1e-3   # kg/mol
        got = sp.eval_per_mass("cp", TEMPS)
        self.assertEqual(got, [sp.eval_per_mass("cp", T) for T in TEMPS])
        for T, v in zip(TEMPS, got):
            self.assertAlmostEqual(v, sp.cp(T) / M, delta=1e-9 * v)

    def test_eval_many(self):
        sp = self.db["H2O"]
        many = sp.eval_many(PROPS, 777.0, 2e4)
        self.assertEqual(list(many), PROPS)
        for prop in PROPS:
            self.assertAlmostEqual(many[prop], sp.eval(prop, 777.0, 2e4),
                                   delta=1e-12 * abs(many[prop]) + 1e-300)


@unittest.skipIf(numpy is None, "numpy not installed (optional)")
class NumpyArrays(unittest.TestCase):
    @classmethod
    def setUpClass(cls):
        cls.sp = molq.Database.builtin()["H2O"]

    def test_shapes_and_values(self):
        grid = numpy.linspace(100.0, 5000.0, 12).reshape(3, 4)
        for prop in PROPS:
            out = self.sp.eval(prop, grid, 2e5)
            self.assertIsInstance(out, numpy.ndarray)
            self.assertEqual(out.shape, grid.shape)
            self.assertEqual(out.dtype, numpy.float64)
            want = [[self.sp.eval(prop, float(T), 2e5) for T in row]
                    for row in grid]
            self.assertEqual(out.tolist(), want)

    def test_noncontiguous_and_other_dtypes(self):
        base = numpy.linspace(100.0, 3000.0, 40)
        strided = base[::3]
        self.assertFalse(strided.flags["C_CONTIGUOUS"])
        self.assertEqual(self.sp.cp(strided).tolist(),
                         [self.sp.cp(float(T)) for T in strided])
        ints = numpy.arange(300, 3000, 450)
        self.assertEqual(self.sp.h(ints).tolist(),
                         [self.sp.h(float(T)) for T in ints])
        f32 = numpy.array([300.5, 1200.25], dtype=numpy.float32)
        self.assertEqual(self.sp.s(f32).tolist(),
                         [self.sp.s(float(T)) for T in f32])
        self.assertEqual(self.sp.cp(numpy.float64(500.0)),
                         self.sp.cp(500.0))

    def test_per_mass_and_errors(self):
        T = numpy.array([400.0, 800.0])
        out = self.sp.eval_per_mass("h", T)
        self.assertEqual(out.tolist(),
                         [self.sp.eval_per_mass("h", float(t)) for t in T])
        with self.assertRaises(molq.MolqError) as cm:
            self.sp.cp(numpy.array([300.0, numpy.nan]))
        self.assertEqual(cm.exception.status, molq.EDOMAIN)


if __name__ == "__main__":
    unittest.main()
