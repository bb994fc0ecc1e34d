"""Checks against sources outside molq, computed through the binding."""

import math
import unittest

import molq
from _support import C2, H_PLANCK, K_BOLTZMANN, N_AVOGADRO, R, assert_rel


class ArgonStandardEntropy(unittest.TestCase):
    def test_codata_1989(self):
        # CODATA Key Values for Thermodynamics (Cox, Wagman, Medvedev, 1989):
        # S(Ar, g, 298.15 K, 1 bar) = 154.846 +/- 0.003 J/(mol K).
        ar = molq.Database.builtin()["Ar"]
        s = ar.s(298.15, 1e5)
        self.assertAlmostEqual(s, 154.846, delta=0.003)


class JanafNitrogen(unittest.TestCase):
    def test_janaf_1998(self):
        # NIST-JANAF Thermochemical Tables, 4th ed. (1998), N2:
        # S(298.15 K) = 191.609 J/(mol K), cp(298.15 K) = 29.124 J/(mol K)
        # (from memory).  Both models: the rigid-rotor/harmonic one misses
        # anharmonic and centrifugal terms, which are below 0.01 J/(mol K)
        # here; the built-in N2 uses the level sum by default.
        n2 = molq.Database.builtin()["N2"]
        for sp in (n2, n2.with_model("rrho")):
            self.assertAlmostEqual(sp.s(298.15), 191.609, delta=0.02)
            self.assertAlmostEqual(sp.cp(298.15), 29.124, delta=0.01)


class MonatomicHeatCapacity(unittest.TestCase):
    # Translation only: cv = 3/2 R, cp = 5/2 R exactly, with
    # R = N_A k = 8.314462618... J/(mol K) exact in the SI since 2019.
    def check(self, sp):
        for T in (10.0, 100.0, 298.15, 1000.0, 6000.0):
            assert_rel(self, sp.cp(T), 2.5 * R, 1e-13, "cp %g K" % T)
            assert_rel(self, sp.cv(T), 1.5 * R, 1e-13, "cv %g K" % T)
            self.assertLess(abs(sp.dcp_dT(T)), 1e-12)

    def test_argon(self):
        self.check(molq.Database.builtin()["Ar"])

    def test_invented_atom(self):
        self.check(molq.Species.from_constants(
            "Zx", structure="atom", molar_mass=83.8))

    def test_sackur_tetrode(self):
        # Sackur-Tetrode: S = R [ln((2 pi m k T/h^2)^1.5 kT/p) + 5/2].
        M = 83.8
        sp = molq.Species.from_constants("Zx", structure="atom",
                                         molar_mass=M)
        m = M * 1e-3 / N_AVOGADRO
        for T, p in ((298.15, 1e5), (1500.0, 3e6), (50.0, 10.0)):
            lam = (2 * math.pi * m * K_BOLTZMANN * T / H_PLANCK ** 2) ** 1.5
            s = R * (math.log(lam * K_BOLTZMANN * T / p) + 2.5)
            assert_rel(self, sp.s(T, p), s, 1e-11, "S %g K %g Pa" % (T, p))


class InventedDiatomic(unittest.TestCase):
    """Rigid rotor (classical rotor), harmonic oscillator and a two-level
    electronic term, written out by hand from the textbook partition
    functions (e.g. D. A. McQuarrie, Statistical Mechanics, 1976, ch. 5-6;
    from memory):

      q/N = (2 pi m k T/h^2)^(3/2) kT/p * T/(sigma theta_r)
            * 1/(1 - exp(-theta_v/T)) * sum g_i exp(-eps_i/kT)
      S = R [ln(q/N) + 1] + U/T,   h - h(0) = U + RT,   cp = cv + R.
    """

    M = 37.5          # g/mol (invented)
    B = 1.25          # cm^-1
    SIGMA = 2
    NU = 1400.0       # cm^-1
    LEVELS = [(0.0, 2), (640.0, 4)]   # cm^-1, degeneracy
    DFH = -52000.0    # J/mol

    @classmethod
    def setUpClass(cls):
        cls.sp = molq.Species.from_constants(
            "Qz2", structure="linear", molar_mass=cls.M,
            symmetry_number=cls.SIGMA, rotational_constants=[cls.B],
            vibrations=[(cls.NU, 1)], electronic_levels=cls.LEVELS,
            formation_enthalpy=cls.DFH, formula="Qz2", rotor="classical")

    def hand(self, T, p):
        m = self.M * 1e-3 / N_AVOGADRO
        lnq_tr = (1.5 * math.log(2 * math.pi * m * K_BOLTZMANN * T
                                 / H_PLANCK ** 2)
                  + math.log(K_BOLTZMANN * T / p))
        theta_r = C2 * self.B
        lnq_rot = math.log(T / (self.SIGMA * theta_r))
        x = C2 * self.NU / T
        lnq_vib = -math.log1p(-math.exp(-x))
        e = [(g, C2 * eps / T) for eps, g in self.LEVELS]
        q_el = sum(g * math.exp(-y) for g, y in e)
        m1 = sum(g * y * math.exp(-y) for g, y in e) / q_el
        m2 = sum(g * y * y * math.exp(-y) for g, y in e) / q_el
        u_rt = 1.5 + 1.0 + x / math.expm1(x) + m1          # U / RT
        cv_r = 1.5 + 1.0 + x * x * math.exp(x) / math.expm1(x) ** 2 \
            + (m2 - m1 * m1)
        lnq = lnq_tr + lnq_rot + lnq_vib + math.log(q_el)
        return {
            "lnq": lnq,
            "cv": cv_r * R,
            "cp": (cv_r + 1.0) * R,
            "s": R * (lnq + 1.0) + u_rt * R,
            "h_minus_h0": (u_rt + 1.0) * R * T,
        }

    def test_against_hand_formulas(self):
        ref = self.hand(298.15, 1e5)["h_minus_h0"]
        for T in (150.0, 298.15, 800.0, 2000.0, 5000.0):
            for p in (1e5, 2.5e6):
                want = self.hand(T, p)
                want["h"] = self.DFH + want["h_minus_h0"] - ref
                want["h_minus_h298"] = want["h_minus_h0"] - ref
                want["u"] = want["h"] - R * T
                want["g"] = want["h"] - T * want["s"]
                want["a"] = want["u"] - T * want["s"]
                want["gef"] = -(want["g"] - self.DFH) / T
                for prop, value in want.items():
                    assert_rel(self, self.sp.eval(prop, T, p), value, 1e-10,
                               "%s at %g K, %g Pa" % (prop, T, p))

    def test_modes_add_up(self):
        # Per-mode lnq, cv, s add up to the species' values (molq.h).
        for T in (300.0, 3000.0):
            modes = self.sp.modes(T, 2e5)
            self.assertEqual([m["kind"] for m in modes],
                             ["translation", "rotation", "vibration",
                              "electronic"])
            want = self.hand(T, 2e5)
            for key in ("lnq", "cv", "s"):
                assert_rel(self, sum(m[key] for m in modes), want[key],
                           1e-10, "sum of mode %s at %g K" % (key, T))
            # Classical rotor: U_rot = RT, cv_rot = R.
            rot = modes[1]
            assert_rel(self, rot["u"], R * T, 1e-12, "U_rot")
            assert_rel(self, rot["cv"], R, 1e-12, "cv_rot")

    def test_rotor_choice_reaches_library(self):
        # The corrected rotor is the rigid rotor itself,
        # q_rot = (1/sigma) sum_J (2J+1) exp(-J(J+1) theta/T)
        # (textbook definition; McQuarrie 1976, ch. 6, from memory), while
        # the classical rotor is T/(sigma theta).  Their ratio is summed
        # here by brute force, at temperatures from 1.7 theta to 170 theta.
        corrected = molq.Species.from_constants(
            "Qz2c", structure="linear", molar_mass=self.M,
            symmetry_number=self.SIGMA, rotational_constants=self.B,
            vibrations=[self.NU], electronic_levels=self.LEVELS)
        theta = C2 * self.B
        for T in (3.0, 10.0, 60.0, 300.0):
            t = theta / T
            total = math.fsum((2 * J + 1) * math.exp(-J * (J + 1) * t)
                              for J in range(0, 4000))
            diff = corrected.lnq(T) - self.sp.lnq(T)
            assert_rel(self, diff, math.log(t * total), 1e-8, "T %g" % T)

if __name__ == "__main__":
    unittest.main()
