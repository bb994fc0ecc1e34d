"""H2's level-sum cp against NIST-JANAF 1998 table H-050 (M. W. Chase Jr.,
J. Phys. Chem. Ref. Data Monograph 9, 1998; tests/data/janaf/H2.tsv), row by
row.  A regression guard: each row's measured deviation molq - JANAF (J/(mol
K), measured with this build's data) may not grow by more than 0.01, and
inside the validated range (to 3000 K) cp stays within 0.5 % of the table.
Above it the deviation is the known high-J / bound-level-cut deficit (see
H2's source text in data/species/diatomics.json)."""

import unittest
from pathlib import Path

import molq

JANAF = Path(__file__).resolve().parents[3] / "tests" / "data" / "janaf" / "H2.tsv"

# T (K): measured molq - JANAF cp, J/(mol K) (levels model, 1 bar)
MEASURED = {100.0: -0.001, 298.15: 0.003, 1000.0: 0.007, 1500.0: 0.003,
            2000.0: -0.015, 2500.0: -0.063, 3000.0: -0.158, 3500.0: -0.325,
            4000.0: -0.589, 5000.0: -1.432, 6000.0: -2.500}


def janaf_cp():
    out = {}
    for line in JANAF.read_text(encoding="utf-8").splitlines():
        if line.startswith("#") or not line.strip():
            continue
        f = line.split("\t")
        try:
            out[float(f[0])] = float(f[1])
        except ValueError:
            continue
    return out


class H2Levels(unittest.TestCase):
    def test_rows(self):
        sp = molq.Database.builtin()["H2"]
        table = janaf_cp()
        lo, hi = sp.validated_range
        for t, want in MEASURED.items():
            with self.subTest(T=t):
                d = sp.cp(t, 1e5) - table[t]
                self.assertLessEqual(abs(d), abs(want) + 0.01)
                if lo <= t <= hi:
                    self.assertLess(abs(d) / table[t], 0.005)


if __name__ == "__main__":
    unittest.main()
