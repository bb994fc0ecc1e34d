"""Models: Species.model, with_model, model_names, spin_conversion and
from_constants with diatomic states.

The species described here are INVENTED test data (constants in the range
of light diatomics); reference values from outside molq are named where
they are used."""

import json
import math
import unittest

import molq
from _support import C2, R

try:
    import numpy
except ImportError:   # the binding needs only the standard library
    numpy = None

TEMPS = [12.0, 40.0, 150.0, 298.15, 1000.0, 3500.0, 7000.0]
PRESSURES = [1e5, 3.7e6]

# Invented diatomics, once as species-file text and once as keyword
# arguments of Species.from_constants.  The entries use every key of a
# diatomic state: named constants, a Dunham matrix, weights, labels.
HOMO_STATES = [
    {"label": "X (invented)", "Te": 0, "degeneracy": 1,
     "we": 2100.0, "wexe": 40.0, "weye": 0.15, "weze": -0.002,
     "Be": 8.2, "alpha_e": 0.35, "gamma_e": 0.004, "De": 0.0006,
     "beta_e": 1.5e-5, "He": 2e-8, "rotational_weights": [0.25, 0.75]},
    {"label": "a (invented)", "Te": 9000.0, "degeneracy": 2,
     "we": 1500.0, "wexe": 30.0, "Be": 6.5, "alpha_e": 0.3, "De": 0.0005,
     "rotational_weights": [0.75, 0.25]},
]
HETERO_STATES = [
    {"Te": 0, "degeneracy": 2,
     "dunham": [[0.3, 1.9, -6.0e-6], [2150.0, -0.017], [-13.1, 0.0001],
                [0.02]]},
    {"Te": 15000.5, "degeneracy": 4,
     "dunham": [[0.0, 1.6], [1700.0, -0.02], [-11.0]]},
]
PI_STATES = [
    {"label": "X 2Pi (invented)", "Te": 0, "degeneracy": 4,
     "spin_orbit": -95.0, "we": 2900.0, "wexe": 60.0, "Be": 12.0,
     "alpha_e": 0.5, "De": 0.001},
    {"Te": 21000.0, "degeneracy": 2, "we": 2500.0, "Be": 11.0},
]

SPECIES = [
    # (file entry, from_constants keyword arguments)
    ({"name": "demo-homo", "formula": "Qx2", "molar_mass": 9.5,
      "structure": "linear", "symmetry_number": 2, "model": "levels",
      "dissociation_energy": 22000, "diatomic_states": HOMO_STATES,
      "formation_enthalpy_298": 1250.0, "source": "invented"},
     dict(structure="linear", molar_mass=9.5, formula="Qx2",
          symmetry_number=2, model="levels", dissociation_energy=22000,
          diatomic_states=HOMO_STATES, formation_enthalpy=1250.0,
          source="invented")),
    ({"name": "demo-frozen", "molar_mass": 9.5, "structure": "linear",
      "symmetry_number": 2, "dissociation_energy": 22000,
      "spin_isomers": "frozen", "odd_fraction": 0.6,
      "diatomic_states": HOMO_STATES[:1]},
     dict(structure="linear", molar_mass=9.5, symmetry_number=2,
          dissociation_energy=22000, spin_isomers="frozen",
          odd_fraction=0.6, diatomic_states=HOMO_STATES[:1])),
    ({"name": "demo-hetero", "formula": "QxY", "molar_mass": 31.5,
      "structure": "linear", "rotor": "classical",
      "dissociation_energy": 60000, "diatomic_states": HETERO_STATES},
     dict(structure="linear", molar_mass=31.5, formula="QxY",
          rotor="classical", dissociation_energy=60000,
          diatomic_states=HETERO_STATES)),
    # Rigid-rotor constants and states together, rrho chosen in the file.
    ({"name": "demo-both", "molar_mass": 20.25, "structure": "linear",
      "rotational_constants": [1.85], "vibrations": [{"wavenumber": 2010.0}],
      "model": "rrho", "dissociation_energy": 50000,
      "diatomic_states": HETERO_STATES[:1]},
     dict(structure="linear", molar_mass=20.25, rotational_constants=[1.85],
          vibrations=[2010.0], model="rrho", dissociation_energy=50000,
          diatomic_states=HETERO_STATES[:1])),
    # A 2Pi ground state (spin-orbit constant) above a Sigma state.
    ({"name": "demo-pi", "molar_mass": 30.5, "structure": "linear",
      "dissociation_energy": 50000, "diatomic_states": PI_STATES},
     dict(structure="linear", molar_mass=30.5, dissociation_energy=50000,
          diatomic_states=PI_STATES)),
]


def bits(x):
    return float(x).hex()


class ModelNames(unittest.TestCase):
    def test_names(self):
        names = molq.model_names()
        self.assertEqual(names[:2], ["rrho", "levels"])
        self.assertEqual(len(set(names)), len(names))

    def test_builtin_models(self):
        db = molq.Database.builtin()
        # Atoms have only rigid-rotor data; the diatomics default to the
        # level sum.
        want = {"Ar": "rrho", "O": "rrho", "H2": "levels", "N2": "levels",
                "O2": "levels", "CO": "levels"}
        self.assertEqual({n: db[n].model for n in want}, want)
        for sp in db:
            self.assertIn(sp.model, molq.model_names())
        self.assertIn("model=levels", repr(db["N2"]))
        own = molq.Species.from_constants("Qa", structure="atom",
                                          molar_mass=4.0)
        self.assertEqual(own.model, "rrho")


class WithModel(unittest.TestCase):
    @classmethod
    def setUpClass(cls):
        cls.db = molq.Database.builtin()

    def assert_same(self, a, b, temps=TEMPS):
        """Every property at every (T, p) equal to the last bit."""
        for prop in molq.property_names():
            for p in PRESSURES:
                for T in temps:
                    self.assertEqual(bits(a.eval(prop, T, p)),
                                     bits(b.eval(prop, T, p)),
                                     "%s %s at %g K, %g Pa"
                                     % (a.name, prop, T, p))

    def test_round_trip_equals_builtin(self):
        for name in ("N2", "O2", "CO", "H2"):
            with self.subTest(name=name):
                sp = self.db[name]
                rrho = sp.with_model("rrho")
                back = rrho.with_model("levels")
                self.assertEqual((rrho.model, back.model),
                                 ("rrho", "levels"))
                self.assertEqual(back.mode_kinds, sp.mode_kinds)
                self.assert_same(back, sp)
                self.assertEqual(back.spin_conversion(20.0),
                                 sp.spin_conversion(20.0))
                self.assertEqual((back.name, back.formula, back.molar_mass,
                                  back.source),
                                 (sp.name, sp.formula, sp.molar_mass,
                                  sp.source))
                # The two models do differ for a diatomic at 3000 K.
                self.assertNotEqual(rrho.cp(3000.0), sp.cp(3000.0))

    def test_same_model_is_a_copy(self):
        for name in ("CO2", "Ar", "N2", "H2O"):
            sp = self.db[name]
            self.assert_same(sp.with_model(sp.model), sp,
                             temps=[50.0, 298.15, 2000.0])

    def test_independent_of_database(self):
        db = molq.Database.builtin()
        rrho = db["N2"].with_model("rrho")
        want = rrho.cp(1234.5)
        db.close()
        self.assertEqual(rrho.cp(1234.5), want)

    def test_rrho_closer_to_janaf_for_levels(self):
        # NIST-JANAF Thermochemical Tables, 4th ed. (1998), N2 at 2000 K:
        # cp = 35.971 J/(mol K) (from memory).  The level sum includes
        # anharmonicity and vibration-rotation coupling.
        n2 = self.db["N2"]
        self.assertLess(abs(n2.cp(2000.0) - 35.971),
                        abs(n2.with_model("rrho").cp(2000.0) - 35.971))

    def test_errors(self):
        with self.assertRaises(ValueError) as cm:
            self.db["N2"].with_model("harmonic")
        self.assertIn("rrho", str(cm.exception))
        self.assertIn("levels", str(cm.exception))
        for bad in (None, 1, b"rrho", "RRHO"):
            with self.assertRaises(ValueError):
                self.db["N2"].with_model(bad)
        for name in ("Ar", "O"):
            with self.assertRaises(molq.MolqError) as cm:
                self.db[name].with_model("levels")
            self.assertEqual(cm.exception.status, molq.EVALUE)
            self.assertIn("diatomic_states", cm.exception.message)
            self.assertIn(name, cm.exception.message)


class FromConstantsDiatomic(unittest.TestCase):
    """from_constants with diatomic states equals the same species read
    from species-file text, to the last bit."""

    @classmethod
    def setUpClass(cls):
        text = json.dumps({"schema_version": 1,
                           "species": [e for e, _ in SPECIES]})
        cls.db = molq.Database.from_string(text)

    def pairs(self):
        for entry, kwargs in SPECIES:
            yield (self.db[entry["name"]],
                   molq.Species.from_constants(entry["name"], **kwargs))

    def assert_same(self, a, b):
        self.assertEqual(a.model, b.model)
        self.assertEqual(a.mode_kinds, b.mode_kinds)
        self.assertEqual(bits(a.molar_mass), bits(b.molar_mass))
        self.assertEqual(a.t_min, b.t_min)
        for prop in molq.property_names():
            for p in PRESSURES:
                for T in TEMPS:
                    self.assertEqual(bits(a.eval(prop, T, p)),
                                     bits(b.eval(prop, T, p)),
                                     "%s (%s) %s at %g K"
                                     % (a.name, a.model, prop, T))
        for i, mode in enumerate(a.modes(800.0)):
            self.assertEqual(mode, b.modes(800.0)[i])

    def test_equal_to_file_text(self):
        for from_file, built in self.pairs():
            with self.subTest(name=built.name):
                self.assertEqual(built.model, from_file.model)
                self.assert_same(from_file, built)
                for model in molq.model_names()[:2]:
                    self.assert_same(from_file.with_model(model),
                                     built.with_model(model))
                lv_file = from_file.with_model("levels")
                lv_built = built.with_model("levels")
                for T in (5.0, 20.0, 80.0, 3000.0):
                    self.assertEqual(bits(lv_file.spin_conversion(T)),
                                     bits(lv_built.spin_conversion(T)))

    def test_default_model(self):
        # molq.h: levels when diatomic states are given, else rrho.
        models = {b.name: b.model for _, b in self.pairs()}
        self.assertEqual(models, {"demo-homo": "levels",
                                  "demo-frozen": "levels",
                                  "demo-hetero": "levels",
                                  "demo-both": "rrho",
                                  "demo-pi": "levels"})

    def test_level_sum_against_hand_sum(self):
        # One electronic state with only Be and we: the level sum is the
        # textbook product of a rigid-rotor sum over J and a harmonic sum
        # over v (truncated at D0; far above kT here), heteronuclear so
        # every J has weight 1 (McQuarrie, Statistical Mechanics, 1976,
        # ch. 6, from memory).
        B, w, T = 1.9, 2150.0, 600.0
        sp = molq.Species.from_constants(
            "Qh", structure="linear", molar_mass=30.0,
            dissociation_energy=80000.0,
            diatomic_states=[{"Te": 0, "we": w, "Be": B}])
        q_rot = math.fsum((2 * J + 1) * math.exp(-C2 * B * J * (J + 1) / T)
                          for J in range(400))
        x = C2 * w / T
        q_vib = 1.0 / (1.0 - math.exp(-x))
        modes = sp.modes(T)
        self.assertEqual([m["kind"] for m in modes],
                         ["translation", "rovibronic"])
        self.assertAlmostEqual(modes[1]["lnq"], math.log(q_rot * q_vib),
                               delta=1e-12)

    def test_argument_errors(self):
        base = dict(structure="linear", molar_mass=10.0,
                    dissociation_energy=20000.0)
        state = {"Te": 0, "we": 1800.0, "Be": 5.0}
        bad = [
            (ValueError, dict(diatomic_states=[dict(state, colour=1)]),
             "colour"),
            (ValueError, dict(diatomic_states=[{"we": 1800.0, "Be": 5.0}]),
             "Te"),
            (ValueError, dict(diatomic_states=[dict(state,
                                                    dunham=[[0, 5.0]])]),
             "not both"),
            (ValueError, dict(diatomic_states=[
                {"Te": 0, "dunham": [[0.0]] * 7}]), "dunham"),
            (ValueError, dict(diatomic_states=[
                {"Te": 0, "dunham": [[0.0, 1.0, 0.0, 0.0, 0.0]]}]),
             "dunham[0]"),
            (ValueError, dict(diatomic_states=[
                dict(state, rotational_weights=[0.5])]),
             "rotational_weights"),
            (TypeError, dict(diatomic_states=state), "list of dicts"),
            (TypeError, dict(diatomic_states=[5.0]), "dict"),
            (TypeError, dict(diatomic_states=[dict(state, label=3)]),
             "label"),
            (ValueError, dict(diatomic_states=[state],
                              spin_isomers="frozen"), "odd_fraction"),
            (ValueError, dict(diatomic_states=[state], odd_fraction=0.75),
             "frozen"),
            (ValueError, dict(diatomic_states=[state],
                              spin_isomers="normal"), "spin_isomers"),
            (ValueError, dict(diatomic_states=[state], model="anharmonic"),
             "unknown model"),
        ]
        for exc, extra, needle in bad:
            with self.subTest(extra=extra):
                with self.assertRaises(exc) as cm:
                    molq.Species.from_constants("Qb", **dict(base, **extra))
                self.assertIn(needle, str(cm.exception))
        # Values the library judges come back as MolqError naming the field.
        library = [
            (dict(diatomic_states=[state], dissociation_energy=None),
             "dissociation_energy"),
            (dict(diatomic_states=[state], spin_isomers="frozen",
                  odd_fraction=1.5), "odd_fraction"),
            (dict(diatomic_states=[dict(state, degeneracy=0)]),
             "degeneracy"),
            (dict(structure="nonlinear", diatomic_states=[state]),
             "linear"),
            (dict(model="levels"), "diatomic_states"),
        ]
        for extra, needle in library:
            with self.subTest(extra=extra):
                with self.assertRaises(molq.MolqError) as cm:
                    molq.Species.from_constants("Qb", **dict(base, **extra))
                self.assertIn(needle, cm.exception.message)
                self.assertIn("Qb", cm.exception.message)


class SpinConversion(unittest.TestCase):
    @classmethod
    def setUpClass(cls):
        cls.h2 = molq.Database.builtin()["H2"]

    def test_normal_hydrogen_20K(self):
        # Conversion of normal to equilibrium hydrogen at 20 K releases
        # about 527 kJ/kg (cryogenic practice, from memory):
        # 527 kJ/kg x 2.01588 g/mol = 1062 J/mol.
        self.assertAlmostEqual(self.h2.spin_conversion(20.0), 1062.0,
                               delta=10.0)

    def test_low_T_limit(self):
        # T -> 0: equilibrium hydrogen is para (J = 0); normal hydrogen
        # keeps 3/4 in J = 1, 118.49 cm^-1 up (H2 term values, from
        # memory): the difference tends to (3/4) R hc E(J=1)/k.
        self.assertAlmostEqual(self.h2.spin_conversion(4.0),
                               0.75 * R * C2 * 118.49, delta=1.0)

    def test_shapes(self):
        temps = [15.0, 20.0, 77.0, 300.0]
        want = [self.h2.spin_conversion(T) for T in temps]
        self.assertIsInstance(want[0], float)
        self.assertEqual(self.h2.spin_conversion(temps), want)
        self.assertEqual(self.h2.spin_conversion(tuple(temps)), want)
        self.assertEqual(self.h2.spin_conversion(iter(temps)), want)
        self.assertEqual(self.h2.spin_conversion([]), [])
        self.assertEqual(self.h2.spin_conversion(20), want[1])
        # Warmer normal hydrogen gives off less on conversion.
        self.assertTrue(all(a > b for a, b in zip(want, want[1:])), want)
        with self.assertRaises(TypeError):
            self.h2.spin_conversion("20")

    @unittest.skipIf(numpy is None, "numpy not installed")
    def test_numpy(self):
        temps = numpy.array([[15.0, 20.0], [77.0, 300.0]])
        got = self.h2.spin_conversion(temps)
        self.assertEqual(got.shape, (2, 2))
        self.assertEqual(got[1, 0], self.h2.spin_conversion(77.0))

    def test_errors(self):
        db = molq.Database.builtin()
        for sp in (db["Ar"], db["N2"].with_model("rrho"),
                   db["CO2"].with_model("rrho")):
            with self.assertRaises(molq.MolqError) as cm:
                sp.spin_conversion(20.0)
            self.assertEqual(cm.exception.status, molq.EARG)
            self.assertIn("model 'levels'", cm.exception.message)
            self.assertIn(sp.name, cm.exception.message)
        # Level-based species with a single nuclear-spin modification
        # (polyatomics here, heteronuclear or spin-0 diatomics) convert
        # nothing: exactly 0 (molq.h).
        for name in ("C2H6", "CO2", "CO", "O2"):
            self.assertEqual(db[name].spin_conversion(20.0), 0.0)
        for T in (0.0, -5.0, math.nan, math.inf):
            with self.assertRaises(molq.MolqError) as cm:
                self.h2.spin_conversion(T)
            self.assertEqual(cm.exception.status, molq.EDOMAIN)
        with self.assertRaises(molq.MolqError):
            self.h2.spin_conversion([20.0, -1.0])


if __name__ == "__main__":
    unittest.main()
