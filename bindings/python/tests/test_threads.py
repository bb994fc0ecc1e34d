"""Four threads evaluating the same species at once get exactly the serial
results (the library documents species as immutable and thread-safe; the
binding allocates its buffers per call)."""

import threading
import unittest

import molq

PROPS = ["cp", "h", "s", "g", "dcp_dT", "lnq"]
TEMPS = [60.0 + 7.5 * i for i in range(400)]


def work(species):
    out = []
    for sp in species:
        for prop in PROPS:
            out.append([sp.eval(prop, T, 2e5) for T in TEMPS])   # scalar
            out.append(sp.eval(prop, TEMPS, 2e5))                # batch
        out.append([sp.modes(T) for T in TEMPS[::40]])
        out.append([sp.eval_per_mass("cp", T) for T in TEMPS[::10]])
    try:
        sp.cp(-1.0)
    except molq.MolqError as exc:
        out.append((exc.status, exc.message))
    return out


class ThreadSmoke(unittest.TestCase):
    def test_four_threads_match_serial(self):
        db = molq.Database.builtin()
        species = [db["H2O"], db["O2"], molq.Species.from_constants(
            "Qt", structure="nonlinear", molar_mass=50.0,
            symmetry_number=2, rotational_constants=[3.1, 0.9, 0.7],
            vibrations=[(650.0, 2), 1100.0, 2900.0],
            electronic_levels=[0.0, (900.0, 3)])]
        serial = work(species)
        results = [None] * 4
        errors = []
        barrier = threading.Barrier(4)

        def run(i):
            try:
                barrier.wait()
                results[i] = work(species)
            except BaseException as exc:   # reported below
                errors.append(exc)

        threads = [threading.Thread(target=run, args=(i,)) for i in range(4)]
        for t in threads:
            t.start()
        for t in threads:
            t.join(120)
        self.assertEqual(errors, [])
        for i, res in enumerate(results):
            self.assertEqual(res, serial, "thread %d differs" % i)


if __name__ == "__main__":
    unittest.main()
