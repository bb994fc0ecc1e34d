"""Shared helpers for the molq binding tests."""

import math

# SI 2019 defining constants (exact by definition).
H_PLANCK = 6.62607015e-34     # J s
K_BOLTZMANN = 1.380649e-23    # J/K
N_AVOGADRO = 6.02214076e23    # 1/mol
C_LIGHT = 299792458.0         # m/s
R = N_AVOGADRO * K_BOLTZMANN  # J/(mol K), exact
# Second radiation constant hc/k, cm K.
C2 = H_PLANCK * C_LIGHT * 100.0 / K_BOLTZMANN


def rel_close(a, b, rel):
    """|a - b| <= rel * max(|a|, |b|) (and exact equality for zeros)."""
    return abs(a - b) <= rel * max(abs(a), abs(b)) or a == b


def assert_rel(case, got, want, rel, what=""):
    case.assertTrue(math.isfinite(got), "%s: got %r" % (what, got))
    case.assertTrue(rel_close(got, want, rel),
                    "%s: got %.15g, want %.15g (rel diff %.3g > %.1g)"
                    % (what, got, want,
                       abs(got - want) / max(abs(want), 1e-300), rel))
