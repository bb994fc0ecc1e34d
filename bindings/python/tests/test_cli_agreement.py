"""The binding and the command-line tool give the same numbers.

Both call the same library, so any difference beyond 1e-10 relative (or the
CLI's printed precision, >= 10 significant digits, where that is coarser)
means the binding passes arguments, units or property ids wrongly.
Skipped when MOLQ_CLI is not set (meson sets it once the CLI target
exists)."""

import csv
import decimal
import io
import math
import os
import subprocess
import unittest

import molq


CLI = os.environ.get("MOLQ_CLI")
HEADER = ["species", "T", "cp", "cv", "h", "s", "g", "h_minus_h298", "gef",
          "dcp_dT"]
SPECIES = ["N2", "H2O", "CO2"]
TEMPS = [300.0, 1000.0, 2500.0]


def tolerance(text, value):
    """Allowed |binding - CLI|: 1e-10 relative, widened to half a unit in
    the 10th significant digit of the printed number (the CLI promises at
    least 10 significant digits; %g-style printing drops trailing zeros, so
    the printed length alone may understate the precision)."""
    cli = float(text)
    big = max(abs(cli), abs(value))
    if big == 0.0:
        return 0.0
    lead = math.floor(math.log10(big))
    unit_10 = 10.0 ** (lead - 9)
    printed = 10.0 ** decimal.Decimal(text.strip()).as_tuple().exponent
    return max(1e-10 * big, 0.5 * min(unit_10, printed) * (1 + 1e-9))


def significant_digits(text):
    digits = decimal.Decimal(text.strip()).as_tuple().digits
    return len("".join(map(str, digits)).lstrip("0"))


@unittest.skipUnless(CLI, "MOLQ_CLI not set (command-line tool not built)")
class CliAgreement(unittest.TestCase):
    #: Species compared.
    SPECIES = SPECIES
    #: --model given to the CLI and Species.with_model in the binding
    #: (None: each species' own model).
    MODEL = None

    @classmethod
    def setUpClass(cls):
        cmd = [CLI, "table"] + cls.SPECIES + [
            "--format", "csv", "--T", ",".join("%g" % t for t in TEMPS)]
        if cls.MODEL is not None:
            cmd += ["--model", cls.MODEL]
        proc = subprocess.run(cmd, stdout=subprocess.PIPE,
                              stderr=subprocess.PIPE, timeout=120,
                              universal_newlines=True)
        if proc.returncode != 0:
            raise AssertionError("%s failed (%d): %s"
                                 % (" ".join(cmd), proc.returncode,
                                    proc.stderr))
        cls.rows = list(csv.reader(io.StringIO(proc.stdout)))
        if cls.MODEL is not None:
            # With --model the CLI adds the columns model (asked for) and
            # model_used (evaluated); every species here has the model.
            assert cls.rows[0][1:3] == ["model", "model_used"], cls.rows[0]
            for r in cls.rows[1:]:
                assert r[1:3] == [cls.MODEL, cls.MODEL], r
            cls.rows = [r[:1] + r[3:] for r in cls.rows]
        cls.db = molq.Database.builtin()

    def species(self, name):
        sp = self.db[name]
        return sp if self.MODEL is None else sp.with_model(self.MODEL)

    def test_header_and_rows(self):
        self.assertEqual(self.rows[0], HEADER)
        body = [r for r in self.rows[1:] if r]
        got = [(r[0], float(r[1])) for r in body]
        want = [(s, t) for s in self.SPECIES for t in TEMPS]
        self.assertEqual(sorted(got), sorted(want))

    def test_printed_precision(self):
        # A CLI number with trailing zeros dropped may show fewer digits;
        # most must show the promised 10 or more.
        numbers = [x for r in self.rows[1:] if r for x in r[2:]]
        full = [x for x in numbers if significant_digits(x) >= 10]
        self.assertGreaterEqual(len(full), 0.9 * len(numbers), numbers)

    def test_values_match_binding(self):
        body = [r for r in self.rows[1:] if r]
        self.assertEqual(len(body), len(self.SPECIES) * len(TEMPS))
        checked = 0
        for row in body:
            sp = self.species(row[0])
            self.assertEqual(sp.model, self.MODEL or self.db[row[0]].model)
            T = float(row[1])
            for prop, text in zip(HEADER[2:], row[2:]):
                cli_value = float(text)
                value = sp.eval(prop, T)
                self.assertLessEqual(
                    abs(value - cli_value), tolerance(text, value),
                    "%s %s at %g K: binding %.17g, CLI %s"
                    % (row[0], prop, T, value, text))
                checked += 1
        self.assertEqual(checked, len(body) * (len(HEADER) - 2))


class CliAgreementRrho(CliAgreement):
    """Every species as rigid rotor / harmonic oscillator (--model rrho;
    N2 switches model, H2O and CO2 already use it)."""
    MODEL = "rrho"


class CliAgreementLevels(CliAgreement):
    """The built-in diatomics with the level sum, asked for explicitly."""
    SPECIES = ["N2", "O2", "H2", "CO"]
    MODEL = "levels"


@unittest.skipUnless(CLI, "MOLQ_CLI not set (command-line tool not built)")
class CliSpinAgreement(unittest.TestCase):
    def test_spin_matches_binding(self):
        temps = [15.0, 20.0, 77.0, 150.0]
        cmd = [CLI, "spin", "H2", "N2", "--format", "csv", "--T",
               ",".join("%g" % t for t in temps)]
        proc = subprocess.run(cmd, stdout=subprocess.PIPE,
                              stderr=subprocess.PIPE, timeout=120,
                              universal_newlines=True)
        self.assertEqual(proc.returncode, 0, proc.stderr)
        rows = list(csv.reader(io.StringIO(proc.stdout)))
        self.assertEqual(rows[0], ["species", "T", "h_frozen_minus_h_eq"])
        db = molq.Database.builtin()
        self.assertEqual(len(rows) - 1, 2 * len(temps))
        for name, T, text in rows[1:]:
            value = db[name].spin_conversion(float(T))
            self.assertLessEqual(abs(value - float(text)),
                                 tolerance(text, value) + 1e-12,
                                 "%s at %s K" % (name, T))


if __name__ == "__main__":
    unittest.main()
