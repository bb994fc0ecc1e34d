"""Finding the library, the version check, and a clean interpreter exit."""

import os
import subprocess
import sys
import tempfile
import textwrap
import time
import unittest

import molq
from molq import _lib

PKG_PARENT = os.path.dirname(os.path.dirname(os.path.abspath(molq.__file__)))


def run_python(code, env_extra=None, drop=()):
    env = dict(os.environ)
    for key in drop:
        env.pop(key, None)
    env["PYTHONPATH"] = PKG_PARENT
    env.update(env_extra or {})
    return subprocess.run([sys.executable, "-c", textwrap.dedent(code)],
                          stdout=subprocess.PIPE, stderr=subprocess.PIPE,
                          universal_newlines=True, env=env, timeout=120)


class Loading(unittest.TestCase):
    def test_env_variable_is_used(self):
        want = os.environ.get("MOLQ_LIBRARY")
        if not want:
            self.skipTest("MOLQ_LIBRARY not set")
        self.assertEqual(molq.library_path(), want)

    def test_bad_env_variable_fails_clearly(self):
        proc = run_python("import molq",
                          {"MOLQ_LIBRARY": "/nonexistent/libmolq.so"})
        self.assertNotEqual(proc.returncode, 0)
        self.assertIn("ImportError", proc.stderr)
        self.assertIn("MOLQ_LIBRARY", proc.stderr)

    def test_build_trees_newest_first(self):
        with tempfile.TemporaryDirectory() as root:
            paths = []
            for i, name in enumerate(("build-old", "build-new", "build")):
                d = os.path.join(root, name, "lib")
                os.makedirs(d)
                path = os.path.join(d, "libmolq.so")
                open(path, "w").close()
                stamp = time.time() - 1000 + 100 * [0, 2, 1][i]
                os.utime(path, (stamp, stamp))
                paths.append(path)
            os.makedirs(os.path.join(root, "notbuild", "lib"))
            found = list(_lib._candidates(root))
            self.assertEqual(found[:3], [paths[1], paths[2], paths[0]])
            self.assertEqual(found[-1], "libmolq.so.0")

    def test_installed_copy_prefers_recorded_library(self):
        # An installed copy (with _config.py) tries the library recorded at
        # install time first and never a build tree beside it.
        with tempfile.TemporaryDirectory() as root:
            d = os.path.join(root, "build", "lib")
            os.makedirs(d)
            tree_lib = os.path.join(d, "libmolq.so")
            open(tree_lib, "w").close()
            found = list(_lib._candidates(root,
                                          installed="/opt/q/libmolq.so.0"))
            self.assertEqual(found[0], "/opt/q/libmolq.so.0")
            self.assertNotIn(tree_lib, found)
            self.assertEqual(found[-1], "libmolq.so.0")

    def test_installed_copy_loads_without_environment(self):
        # A copy of the package laid out as `meson install` lays it out
        # (the sources plus a generated _config.py naming the library)
        # imports with neither MOLQ_LIBRARY nor a build tree beside it.
        lib_path = os.environ.get("MOLQ_LIBRARY")
        if not lib_path:
            self.skipTest("MOLQ_LIBRARY not set")
        src = os.path.dirname(os.path.abspath(molq.__file__))
        with tempfile.TemporaryDirectory() as root:
            pkg = os.path.join(root, "molq")
            os.makedirs(pkg)
            for name in ("__init__.py", "_core.py", "_lib.py"):
                with open(os.path.join(src, name)) as f_in, \
                        open(os.path.join(pkg, name), "w") as f_out:
                    f_out.write(f_in.read())
            with open(os.path.join(pkg, "_config.py"), "w") as f:
                f.write("INSTALLED_LIBRARY = %r\n" % lib_path)
            proc = run_python("""
                import molq
                print(molq.library_path())
                print(round(molq.Database.builtin()["N2"].cp(1000.0), 1))
                """, {"PYTHONPATH": root}, drop=("MOLQ_LIBRARY",))
        self.assertEqual(proc.returncode, 0, proc.stderr)
        # cp of N2 at 1000 K: 32.697 J/(mol K), NIST-JANAF (1998).
        self.assertEqual(proc.stdout.split(), [lib_path, "32.7"])

    def test_version_check(self):
        _lib.check_version(100, "0.1.0", "x")      # this binding's version
        _lib.check_version(215, "0.2.15", "x")     # same major, newer
        with self.assertRaises(ImportError) as cm:
            _lib.check_version(10000, "1.0.0", "/some/libmolq.so")
        self.assertIn("major", str(cm.exception))
        self.assertIn("1.0.0", str(cm.exception))
        with self.assertRaises(ImportError):
            _lib.check_version(5, "0.0.5", "x")
        # The loaded library passed the same check.
        self.assertEqual(_lib.VERSION_NUMBER // 10000, _lib.EXPECTED_MAJOR)


class Shutdown(unittest.TestCase):
    def test_exit_with_live_objects_and_busy_thread(self):
        # Objects alive at exit, a cycle through a species, and a daemon
        # thread still evaluating: the interpreter must exit cleanly (no
        # crash from freeing a database under the running thread).
        proc = run_python("""
            import threading, molq
            db = molq.Database.builtin()
            h2o = db["H2O"]
            own = molq.Species.from_constants(
                "Qs", structure="linear", molar_mass=30.0,
                rotational_constants=[1.7], vibrations=[1900.0])
            cycle = [own]
            cycle.append(cycle)
            started = threading.Event()
            def spin():
                while True:
                    h2o.cp([300.0, 900.0, 2700.0])
                    own.s(1000.0)
                    started.set()
            threading.Thread(target=spin, daemon=True).start()
            started.wait(30)
            del db
            print("bye", round(own.cp(1000.0), 1))
            """)
        self.assertEqual(proc.returncode, 0, proc.stderr)
        self.assertTrue(proc.stdout.startswith("bye"), proc.stdout)


if __name__ == "__main__":
    unittest.main()
