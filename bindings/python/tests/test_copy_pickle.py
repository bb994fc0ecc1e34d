"""Copying and pickling species and databases (regressions: deepcopy shared
the C pointer, so deleting the original left the copy on freed memory;
pickle.dumps succeeded and loading in another process crashed; a species
sent to a spawn-context multiprocessing pool hung the pool).

Crashes are run in a child process so that a segmentation fault is a test
failure rather than the end of the test runner; the pool has a timeout."""

import multiprocessing
import os
import pickle
import subprocess
import sys
import tempfile
import textwrap
import unittest

import molq

TIMEOUT = 120   # s, for child processes and the pool

# An invented species (demo data) given through the polyatomic level keys.
DEMO = dict(structure="nonlinear", molar_mass=34.5, symmetry_number=2,
            rotational_constants=[9.1, 4.3, 2.9],
            vibrations=[(1600.0, 1), (3650.0, 1), (3750.0, 1)],
            dissociation_energy=40000.0,
            anharmonicity={"x": [[0, 0, -16.0], [1, 2, -150.0]]},
            rotational_weights={"ee": 0.25, "eo": 0.75, "oe": 0.75,
                                "oo": 0.25},
            source="invented")


def bits(x):
    return float(x).hex()


def _values_of(sp):
    """Every property at a few states (run in pool workers too)."""
    return [bits(sp.eval(prop, T, p)) for prop in molq.property_names()
            for T in (150.0, 298.15, 1700.0) for p in (1e5, 3e6)]


def _child_env():
    env = dict(os.environ)
    here = os.path.dirname(os.path.abspath(__file__))
    env["PYTHONPATH"] = os.pathsep.join(
        [os.path.dirname(here)] + [p for p in sys.path if p])
    return env


def run_child(code):
    return subprocess.run([sys.executable, "-c", textwrap.dedent(code)],
                          env=_child_env(), capture_output=True, text=True,
                          timeout=TIMEOUT)


def species_set():
    db = molq.Database.builtin()
    text_db = molq.Database.from_string(
        '{"schema_version": 1, "species": [{"name": "Qt", "molar_mass": 30.0,'
        ' "structure": "linear", "rotational_constants": [1.5], '
        '"vibrations": [{"wavenumber": 1800}]}, {"name": "Qa", '
        '"molar_mass": 12.5, "structure": "atom"}]}')
    return [db["N2"], db["H2O"], db["C2H6"], db["N2"].with_model("rrho"),
            db["CO"].with_model("rrho").with_model("levels"),
            text_db["Qa"], molq.Species.from_constants("Qdemo", **DEMO)]


class DeepcopyThenDelete(unittest.TestCase):
    def test_in_child_process(self):
        # Before the fix the copy pointed at the freed database: SIGSEGV
        # (or garbage) in the child.
        res = run_child("""
            import copy, gc, molq
            db = molq.Database.builtin()
            want = db["N2"].cp(300.0)
            db2 = copy.deepcopy(db)
            db3 = copy.copy(db)
            del db
            gc.collect()
            junk = [molq.Database.builtin() for _ in range(5)]  # reuse heap
            del junk
            gc.collect()
            assert db2["N2"].cp(300.0) == want
            assert db3["N2"].cp(300.0) == want
            sp = molq.Species.from_constants(
                "Qc", structure="linear", molar_mass=28.0,
                rotational_constants=[1.9], vibrations=[2300.0])
            want = sp.cp(700.0)
            sp2 = copy.deepcopy(sp)
            n2 = molq.Database.builtin()["N2"]
            n2c = copy.deepcopy([n2])[0]
            del sp, n2
            gc.collect()
            junk = [molq.Species.from_constants(
                "Qj", structure="atom", molar_mass=4.0) for _ in range(50)]
            del junk
            gc.collect()
            assert sp2.cp(700.0) == want
            print(repr(n2c.cp(300.0)))
            """)
        self.assertEqual(res.returncode, 0,
                         "child died (rc %d): %s" % (res.returncode,
                                                     res.stderr))
        self.assertEqual(float(res.stdout),
                         molq.Database.builtin()["N2"].cp(300.0))

    def test_copies_are_usable(self):
        import copy
        for sp in species_set():
            self.assertEqual(_values_of(copy.deepcopy(sp)), _values_of(sp))
            self.assertEqual(_values_of(copy.copy(sp)), _values_of(sp))


class PickleAcrossProcesses(unittest.TestCase):
    def test_loaded_in_child_process(self):
        # Before the fix the pickle held a raw pointer: the child crashed.
        species = species_set()
        with tempfile.TemporaryDirectory() as d:
            path = os.path.join(d, "species.pickle")
            with open(path, "wb") as f:
                pickle.dump(species, f)
            res = run_child("""
                import json, pickle, sys, molq
                sys.path.insert(0, %r)
                from test_copy_pickle import _values_of
                with open(%r, "rb") as f:
                    species = pickle.load(f)
                print(json.dumps([[sp.name, sp.model, _values_of(sp)]
                                  for sp in species]))
                """ % (os.path.dirname(os.path.abspath(__file__)), path))
        self.assertEqual(res.returncode, 0,
                         "child died (rc %d): %s" % (res.returncode,
                                                     res.stderr))
        import json
        got = json.loads(res.stdout)
        self.assertEqual(got, [[sp.name, sp.model, _values_of(sp)]
                               for sp in species])

    def test_round_trip_in_process(self):
        for sp in species_set():
            back = pickle.loads(pickle.dumps(sp))
            self.assertEqual((back.name, back.model, back.formula,
                              back.source, bits(back.molar_mass)),
                             (sp.name, sp.model, sp.formula, sp.source,
                              bits(sp.molar_mass)))
            self.assertEqual(_values_of(back), _values_of(sp))
            # a rebuilt species pickles again
            self.assertEqual(_values_of(pickle.loads(pickle.dumps(back))),
                             _values_of(sp))
        db = molq.Database.builtin()
        self.assertEqual(pickle.loads(pickle.dumps(db)).names(), db.names())
        # the pickle of a file species holds its own entry only
        small = len(pickle.dumps(species_set()[5]))
        self.assertLess(small, 600)

    def test_closed_refuses(self):
        sp = molq.Species.from_constants("Qz", structure="atom",
                                         molar_mass=4.0)
        sp.close()
        with self.assertRaises(ValueError):
            pickle.dumps(sp)


def _cp_at(args):
    sp, T = args
    return bits(sp.cp(T)), _values_of(sp)


class SpawnPool(unittest.TestCase):
    def test_spawn_pool(self):
        # Before the fix the workers crashed unpickling and the pool waited
        # forever; the timeout turns a hang into a failure.
        species = species_set()
        jobs = [(sp, 300.0 + 100.0 * i) for i, sp in enumerate(species)]
        ctx = multiprocessing.get_context("spawn")
        pool = ctx.Pool(2)
        try:
            got = pool.map_async(_cp_at, jobs).get(timeout=TIMEOUT)
        except multiprocessing.TimeoutError:
            self.fail("spawn pool did not return within %d s" % TIMEOUT)
        finally:
            pool.terminate()
            pool.join()
        self.assertEqual(got, [(bits(sp.cp(T)), _values_of(sp))
                               for sp, T in jobs])


if __name__ == "__main__":
    unittest.main()
