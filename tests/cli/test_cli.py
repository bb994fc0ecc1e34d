"""Tests of the molq command-line tool (Python standard library only).

The tool is found through the environment variable MOLQ_CLI (set by
tests/cli/meson.build).  Sources of the expected values are named beside
each check:

* textbook statistical mechanics of the ideal gas (Sackur-Tetrode
  translation, classical rigid rotor, harmonic oscillator with the energy
  zero at the zero-point level, electronic level sum), written here from
  scratch with the SI 2019 exact constants h, k, N_A, c;
* textbook ro-vibrational level sums (Dunham term values, even/odd-J
  nuclear-spin weights, frozen or equilibrium spin isomers), written here
  from scratch, for the level-sum model;
* NIST-JANAF Thermochemical Tables, 4th ed. (Chase 1998) for a few
  standard entropies and heat capacities of the built-in species
  (values from memory, marked so);
* the ortho-para conversion heat of normal hydrogen at 20 K, about
  527 kJ/kg, a figure widely quoted in cryogenic practice (from memory);
* the species files in tests/cli/data are INVENTED test data.
"""

import csv
import io
import json
import math
import os
import re
import subprocess
import sys
import unittest
from pathlib import Path

CLI = os.environ.get("MOLQ_CLI")
DATA = Path(__file__).resolve().parent / "data"
DEMO = DATA / "demo_species.json"
LEVELS = DATA / "demo_levels.json"
BAD = DATA / "bad"

# SI 2019: exact by definition.
H_PLANCK = 6.62607015e-34  # J s
K_B = 1.380649e-23  # J/K
N_A = 6.02214076e23  # 1/mol
C_LIGHT = 299792458.0  # m/s
R = N_A * K_B  # J/(mol K)
C2 = 100.0 * H_PLANCK * C_LIGHT / K_B  # cm K: wavenumber (cm^-1) -> K
T_REF = 298.15

COLUMNS = ["cp", "cv", "h", "s", "g", "h_minus_h298", "gef", "dcp_dT"]
CSV_HEADER = "species,T,cp,cv,h,s,g,h_minus_h298,gef,dcp_dT"
# With --model or --compare: the model asked for and the one evaluated.
CSV_HEADER_COMPARE = ("species,model,model_used,T,cp,cv,h,s,g,h_minus_h298,"
                      "gef,dcp_dT")
CSV_HEADER_MODEL = CSV_HEADER_COMPARE
MODELS = ["rrho", "levels"]
DEFAULT_T = [298.15, 300, 400, 500, 600, 800, 1000, 1500, 2000, 2500, 3000]
BUILTIN = ["Ar", "O", "N", "Cl", "He", "Ne", "Kr", "Xe", "H", "C", "F", "S", "H2", "N2", "O2", "CO", "NO", "OH", "HF", "HCl",
           "Cl2", "F2", "SO", "CN", "CH", "NH", "e-", "N+", "O+", "N2+", "O2+", "NO+", "CO2", "H2O",
           "C2H6", "NH3", "CH4", "H2O2", "CH3", "CH2O", "C2H2", "C2H4",
           "N2O",
           "NO2",
           "SO2",
           "HCN",
           "O3",
           "COS",
           "CS2",
           "H2S",
           "HO2",
           "NH2",
           "HNO"]
CAUTION = ("molq gives ideal-gas estimates. They are not a basis for the "
           "design of pressure equipment, burners or safety systems without "
           "verification under the applicable codes and licensed engineering "
           "review.")


def run(*args):
    """Run the CLI; return (exit code, stdout, stderr)."""
    p = subprocess.run([CLI] + [str(a) for a in args], capture_output=True,
                       text=True, timeout=60)
    return p.returncode, p.stdout, p.stderr


def run_ok(testcase, *args):
    rc, out, err = run(*args)
    testcase.assertEqual(rc, 0, "molq %s failed: %s" % (args, err))
    return out


def drop_model_columns(text):
    """csv text of a --model run -> the same without model, model_used."""
    rows = list(csv.reader(io.StringIO(text)))
    assert rows[0][1:3] == ["model", "model_used"], rows[0]
    return "".join(",".join(r[:1] + r[3:]) + "\n" for r in rows)


def parse_csv(text):
    """csv text -> (header line, list of row dicts with floats)."""
    lines = text.splitlines()
    rows = []
    for r in csv.DictReader(io.StringIO(text)):
        rows.append({k: (v if k in ("species", "mode", "model", "model_used")
                         else float(v))
                     for k, v in r.items()})
    return lines[0], rows


# --------------------------------------------------------------------------
# Independent rigid-rotor / harmonic-oscillator model (textbook formulas)
# --------------------------------------------------------------------------

class Model:
    """One species of the JSON species file, classical rotor only.

    Per mode, ln q, U (thermal energy above the ground level, J/mol),
    cv and dcv/dT (J/(mol K), J/(mol K^2)) in closed form."""

    def __init__(self, entry):
        assert (entry["structure"] == "atom"
                or entry.get("rotor") == "classical"), entry["name"]
        self.name = entry["name"]
        self.M = entry["molar_mass"] * 1e-3  # kg/mol
        self.structure = entry["structure"]
        self.sigma = entry.get("symmetry_number", 1)
        self.theta_rot = [C2 * b for b in entry.get("rotational_constants",
                                                    [])]
        self.vib = [(C2 * v["wavenumber"], v.get("degeneracy", 1))
                    for v in entry.get("vibrations", [])]
        self.levels = [(C2 * e["energy"], e.get("degeneracy", 1))
                       for e in entry.get("electronic_levels",
                                          [{"energy": 0.0}])]
        self.dfH = entry.get("formation_enthalpy_298", 0.0)

    def parts(self, T, p):
        """Return (ln q, U, cv, dcv_dT) summed over all modes."""
        # Translation (Sackur-Tetrode): q/N = (2 pi m k T/h^2)^1.5 kT/p.
        m = self.M / N_A
        lnq = (1.5 * math.log(2 * math.pi * m * K_B * T / H_PLANCK ** 2)
               + math.log(K_B * T / p))
        U = 1.5 * R * T
        cv = 1.5 * R
        dcv = 0.0
        # Classical rigid rotor.
        if self.structure == "linear":
            lnq += math.log(T / (self.sigma * self.theta_rot[0]))
            U += R * T
            cv += R
        elif self.structure == "nonlinear":
            tA, tB, tC = self.theta_rot
            lnq += math.log(math.sqrt(math.pi * T ** 3 / (tA * tB * tC))
                            / self.sigma)
            U += 1.5 * R * T
            cv += 1.5 * R
        # Harmonic oscillators, energy zero at the zero-point level.
        for theta, g in self.vib:
            x = theta / T
            em1 = math.expm1(x)  # e^x - 1
            lnq += -g * math.log1p(-math.exp(-x))
            U += g * R * theta / em1
            f = x * x * math.exp(x) / em1 ** 2  # Einstein function
            cv += g * R * f
            # d/dT of f(x) with x = theta/T:
            # f'(x) = x e^x/(e^x-1)^2 [2 + x - 2 x e^x/(e^x-1)]
            fp = (x * math.exp(x) / em1 ** 2
                  * (2 + x - 2 * x * math.exp(x) / em1))
            dcv += g * R * fp * (-x / T)
        # Electronic levels (energies measured from the lowest level, 0).
        w = [g * math.exp(-e / T) for e, g in self.levels]
        q = sum(w)
        m1 = sum(wi * e for wi, (e, g) in zip(w, self.levels)) / q
        c2 = sum(wi * (e - m1) ** 2 for wi, (e, g) in zip(w, self.levels)) / q
        c3 = sum(wi * (e - m1) ** 3 for wi, (e, g) in zip(w, self.levels)) / q
        lnq += math.log(q)
        U += R * m1
        cv += R * c2 / T ** 2
        # cv_el = R var(E)/T^2, d var/dT = kappa3/T^2.
        dcv += R * (c3 / T ** 4 - 2 * c2 / T ** 3)
        return lnq, U, cv, dcv

    def row(self, T, p):
        lnq, U, cv, dcv = self.parts(T, p)
        _, U298, _, _ = self.parts(T_REF, p)
        H_H0 = U + R * T
        H298_H0 = U298 + R * T_REF
        h = self.dfH + (H_H0 - H298_H0)
        s = R * (lnq + 1.0) + U / T
        g = h - T * s
        return {
            "cp": cv + R,
            "cv": cv,
            "h": h,
            "s": s,
            "g": g,
            "h_minus_h298": H_H0 - H298_H0,
            "gef": -(g - self.dfH) / T,
            "dcp_dT": dcv,
        }


# --------------------------------------------------------------------------
# Independent ro-vibrational level sum (textbook statistical mechanics)
# --------------------------------------------------------------------------

# Named spectroscopic constants as Dunham coefficients Y_kl (Herzberg's
# notation): (k, l, sign).
NAMED = {"we": (1, 0, 1.0), "wexe": (2, 0, -1.0), "weye": (3, 0, 1.0),
         "weze": (4, 0, 1.0), "Be": (0, 1, 1.0), "alpha_e": (1, 1, -1.0),
         "gamma_e": (2, 1, 1.0), "De": (0, 2, -1.0), "beta_e": (1, 2, -1.0),
         "He": (0, 3, 1.0)}


def dunham(state):
    """6 x 4 Dunham matrix of a diatomic_states entry."""
    y = [[0.0] * 4 for _ in range(6)]
    for k, row in enumerate(state.get("dunham", [])):
        for l, v in enumerate(row):
            y[k][l] = v
    for key, (k, l, sign) in NAMED.items():
        if key in state:
            y[k][l] = sign * state[key]
    return y


def term(y, te, v, J):
    """Term value Te + sum Y_kl (v + 1/2)^k [J(J+1)]^l, cm^-1."""
    x = J * (J + 1.0)
    return te + sum(y[k][l] * (v + 0.5) ** k * x ** l
                    for k in range(6) for l in range(4))


def bound_levels(entry):
    """All bound levels of a species-file entry as (theta in K, weight,
    J parity), energies from the ground state's v = 0, J = 0 level.  A
    vibrational ladder stops at D0 or where G(v) stops rising, a rotational
    ladder at D0 or where E(J) stops rising.  Weight: electronic
    degeneracy x nuclear-spin weight of the J parity x (2J + 1)."""
    states = entry["diatomic_states"]
    d0 = entry["dissociation_energy"]
    e0 = term(dunham(states[0]), 0.0, 0, 0)
    sigma = entry.get("symmetry_number", 1)
    out = []
    for st in states:
        y, g = dunham(st), st.get("degeneracy", 1)
        w = st.get("rotational_weights", [1.0 / sigma, 1.0 / sigma])
        v, gprev = 0, -math.inf
        while True:
            G = term(y, st["Te"], v, 0) - e0
            if not G < d0 or G <= gprev:
                break
            gprev = G
            J, eprev = 0, -math.inf
            while True:
                e = term(y, st["Te"], v, J) - e0
                if not e < d0 or e <= eprev:
                    break
                eprev = e
                if w[J % 2] > 0:
                    out.append((C2 * e, g * w[J % 2] * (2 * J + 1), J % 2))
                J += 1
            v += 1
    return out


def level_cumulants(levels, T):
    """ln Q and the first three cumulants of theta (K) over the levels."""
    tmin = min(t for t, _, _ in levels)
    ws = [w * math.exp(-(t - tmin) / T) for t, w, _ in levels]
    q = sum(ws)
    m1 = sum(wi * t for wi, (t, _, _) in zip(ws, levels)) / q
    c2 = sum(wi * (t - m1) ** 2 for wi, (t, _, _) in zip(ws, levels)) / q
    c3 = sum(wi * (t - m1) ** 3 for wi, (t, _, _) in zip(ws, levels)) / q
    return math.log(q) - tmin / T, m1, c2, c3


class LevelSum(Model):
    """A diatomic of the species file by explicit level sums: translation
    as in Model, internal ln q, U, cv, dcv/dT from the bound levels.  A
    frozen even/odd-J mixture of mole fractions x_p is an ideal mixture of
    two gases: ln q = sum x_p (ln Q_p - ln x_p), energies and cumulants
    x-weighted."""

    def __init__(self, entry):
        self.name = entry["name"]
        self.M = entry["molar_mass"] * 1e-3
        self.dfH = entry.get("formation_enthalpy_298", 0.0)
        self.levels = bound_levels(entry)
        self.frozen = None
        if entry.get("spin_isomers") == "frozen":
            x_odd = entry["odd_fraction"]
            self.frozen = (1.0 - x_odd, x_odd)
        w = entry["diatomic_states"][0].get("rotational_weights")
        # High-temperature even/odd ratio of the ground state.
        self.x_high = (w[0] / sum(w), w[1] / sum(w)) if w else None

    def internal(self, T, x=None):
        if x is None:
            return level_cumulants(self.levels, T)
        out = [0.0, 0.0, 0.0, 0.0]
        for parity in (0, 1):
            c = level_cumulants([l for l in self.levels if l[2] == parity], T)
            out[0] += x[parity] * (c[0] - math.log(x[parity]))
            for i in (1, 2, 3):
                out[i] += x[parity] * c[i]
        return tuple(out)

    def parts(self, T, p):
        m = self.M / N_A
        lnq = (1.5 * math.log(2 * math.pi * m * K_B * T / H_PLANCK ** 2)
               + math.log(K_B * T / p))
        lq, m1, c2, c3 = self.internal(T, self.frozen)
        return (lnq + lq, 1.5 * R * T + R * m1, 1.5 * R + R * c2 / T ** 2,
                R * (c3 / T ** 4 - 2 * c2 / T ** 3))

    def spin_conversion(self, T):
        """h(frozen mixture) - h(equilibrium), J/mol: the species' own
        frozen mixture, else the ground state's high-temperature ratio."""
        x = self.frozen or self.x_high
        return R * (self.internal(T, x)[1] - self.internal(T)[1])


def rrho_entry(entry):
    """The rigid-rotor / harmonic description a level-sum diatomic stands
    for (molq.h, molq_species_with_model): B0 = Y01 + Y11/2 + Y21/4 and the
    fundamental G(1) - G(0) of the ground state, the v = 0 levels of all
    states as electronic levels; classical rotor as in the file."""
    states = entry["diatomic_states"]
    y = dunham(states[0])
    e0 = term(y, 0.0, 0, 0)
    return {
        "name": entry["name"], "molar_mass": entry["molar_mass"],
        "structure": "linear", "rotor": entry["rotor"],
        "symmetry_number": entry.get("symmetry_number", 1),
        "rotational_constants": [y[0][1] + y[1][1] / 2 + y[2][1] / 4],
        "vibrations": [{"wavenumber": term(y, 0.0, 1, 0) - e0}],
        "electronic_levels": [
            {"energy": term(dunham(s), s["Te"], 0, 0) - e0,
             "degeneracy": s.get("degeneracy", 1)} for s in states],
        "formation_enthalpy_298": entry.get("formation_enthalpy_298", 0.0),
    }


def abs_floor(col, T, model_row):
    """Absolute tolerance floor 1e-9 of the natural size of a column."""
    if col in ("cp", "cv", "s", "gef"):
        scale = model_row["cp"]
    elif col == "dcp_dT":
        scale = model_row["cp"] / T
    else:  # h, g, h_minus_h298
        scale = model_row["cp"] * T
    return 1e-9 * scale


# --------------------------------------------------------------------------


@unittest.skipIf(not CLI, "MOLQ_CLI is not set")
class CsvFormat(unittest.TestCase):
    """1. csv header and row count."""

    def test_header_and_rows_default_T(self):
        out = run_ok(self, "table", "N2", "CO2", "H2O", "--format", "csv")
        header, rows = parse_csv(out)
        self.assertEqual(header, CSV_HEADER)
        self.assertEqual(len(out.splitlines()), 1 + 3 * len(DEFAULT_T))
        self.assertEqual([r["T"] for r in rows[:len(DEFAULT_T)]], DEFAULT_T)
        self.assertEqual([r["species"] for r in rows],
                         ["N2"] * 11 + ["CO2"] * 11 + ["H2O"] * 11)

    def test_row_count_list_and_range(self):
        out = run_ok(self, "table", "Ar", "O", "--T", "250,300,7000",
                     "--format", "csv")
        self.assertEqual(len(out.splitlines()), 1 + 2 * 3)
        # Inclusive range: 300, 300.1, ..., 400 is 1001 points; the last
        # one is printed as the STOP given.
        out = run_ok(self, "table", "N2", "--T", "300:400:0.1",
                     "--format", "csv")
        header, rows = parse_csv(out)
        self.assertEqual(header, CSV_HEADER)
        self.assertEqual(len(rows), 1001)
        self.assertEqual(rows[-1]["T"], 400.0)
        self.assertAlmostEqual(rows[1]["T"], 300.1, places=9)
        # STOP not on the grid: 1, 1.3, 1.6, 1.9.
        out = run_ok(self, "table", "Ar", "--T", "1:2:0.3", "--format", "csv")
        _, rows = parse_csv(out)
        self.assertEqual(len(rows), 4)
        self.assertAlmostEqual(rows[-1]["T"], 1.9, places=12)
        # STEP larger than the whole range: START alone (not STOP).
        out = run_ok(self, "table", "Ar", "--T", "300:1000:1e13", "--format",
                     "csv")
        _, rows = parse_csv(out)
        self.assertEqual([r["T"] for r in rows], [300.0])
        # START == STOP: one point.
        out = run_ok(self, "table", "Ar", "--T", "500:500:10", "--format",
                     "csv")
        self.assertEqual(len(out.splitlines()), 2)
        # Option written with '='.
        out = run_ok(self, "table", "Ar", "--T=300,400", "--format=csv")
        self.assertEqual(len(out.splitlines()), 3)

    def test_at_least_10_significant_digits(self):
        out = run_ok(self, "table", "CO2", "--T", "1234.5", "--format", "csv")
        fields = out.splitlines()[1].split(",")[1:]
        self.assertEqual(fields[0], "1234.5")
        for f in fields[1:]:
            mantissa = f.lower().split("e")[0].lstrip("-").replace(".", "")
            # Shortest round-trip decimals: at least 10 digits here.
            self.assertGreaterEqual(len(mantissa.lstrip("0")), 10, f)


@unittest.skipIf(not CLI, "MOLQ_CLI is not set")
class IndependentModel(unittest.TestCase):
    """2. CLI csv against textbook RRHO formulas written from scratch here."""

    TEMPS = [50, 100, 298.15, 300, 451.3, 1000, 2000, 5000, 12000]

    def compare(self, p):
        doc = json.loads(DEMO.read_text())
        models = [Model(e) for e in doc["species"]]
        names = [m.name for m in models]
        out = run_ok(self, "table", *names, "--data", DEMO, "--T",
                     ",".join(str(t) for t in self.TEMPS), "--p", repr(p),
                     "--format", "csv")
        header, rows = parse_csv(out)
        self.assertEqual(header, CSV_HEADER)
        self.assertEqual(len(rows), len(models) * len(self.TEMPS))
        by_name = {m.name: m for m in models}
        checked = 0
        for r in rows:
            model = by_name[r["species"]]
            want = model.row(r["T"], p)
            for col in COLUMNS:
                tol = max(1e-9 * abs(want[col]),
                          abs_floor(col, r["T"], want))
                self.assertLessEqual(
                    abs(r[col] - want[col]), tol,
                    "%s at T=%g p=%g: %s cli %.12g, formula %.12g"
                    % (r["species"], r["T"], p, col, r[col], want[col]))
                checked += 1
        self.assertEqual(checked, len(models) * len(self.TEMPS) * 8)

    def test_standard_pressure(self):
        self.compare(1e5)

    def test_other_pressure(self):
        self.compare(2.5e6)

    def test_formula_sanity(self):
        # The from-scratch model itself against two facts of the trade:
        # a monatomic ideal gas has cp = 5/2 R, and the Sackur-Tetrode
        # entropy of argon at 298.15 K, 1 bar is 154.85 J/(mol K)
        # (NIST-JANAF 1998: 154.845, from memory).
        ar = Model({"name": "Ar", "molar_mass": 39.948, "structure": "atom",
                    "rotor": "classical"})
        row = ar.row(298.15, 1e5)
        self.assertAlmostEqual(row["cp"], 2.5 * R, places=12)
        self.assertAlmostEqual(row["s"], 154.845, delta=0.01)
        # High-T limit of a harmonic oscillator: cv -> R per mode.
        osc = Model({"name": "x", "molar_mass": 30, "structure": "linear",
                     "rotor": "classical", "rotational_constants": [1.0],
                     "vibrations": [{"wavenumber": 10.0}]})
        self.assertAlmostEqual(osc.parts(1e6, 1e5)[2], 3.5 * R, places=6)

    def test_modes_breakdown(self):
        # Per-mode ln q, u, cv, s of `molq modes` against the same
        # textbook formulas, mode by mode, and the totals against the sums.
        T, p = 750.0, 3e5
        out = run_ok(self, "modes", "demo-linear", "demo-atom", "--data",
                     DEMO, "--T", T, "--p", p, "--format", "csv")
        lines = out.splitlines()
        self.assertEqual(lines[0], "species,T,mode,lnq,u,cv,s")
        _, rows = parse_csv(out)
        got = {(r["species"], r["mode"]): r for r in rows}
        self.assertEqual([r["mode"] for r in rows
                          if r["species"] == "demo-atom"],
                         ["translation", "electronic", "total"])
        # Translation (Sackur-Tetrode) for demo-linear, M = 58.3 g/mol.
        m = 58.3e-3 / N_A
        lnq_tr = (1.5 * math.log(2 * math.pi * m * K_B * T / H_PLANCK ** 2)
                  + math.log(K_B * T / p))
        tr = got[("demo-linear", "translation")]
        self.assertAlmostEqual(tr["lnq"] / lnq_tr, 1.0, delta=1e-10)
        self.assertAlmostEqual(tr["u"] / (1.5 * R * T), 1.0, delta=1e-10)
        self.assertAlmostEqual(tr["cv"] / (1.5 * R), 1.0, delta=1e-10)
        self.assertAlmostEqual(tr["s"] / (R * (lnq_tr + 2.5)), 1.0,
                               delta=1e-10)
        # Classical linear rotor: q = T/(sigma theta).
        rot = got[("demo-linear", "rotation")]
        lnq_rot = math.log(T / (2 * C2 * 0.2871))
        self.assertAlmostEqual(rot["lnq"] / lnq_rot, 1.0, delta=1e-10)
        self.assertAlmostEqual(rot["cv"] / R, 1.0, delta=1e-10)
        self.assertAlmostEqual(rot["s"] / (R * (lnq_rot + 1)), 1.0,
                               delta=1e-10)
        for sp in ("demo-linear", "demo-atom"):
            parts = [r for r in rows if r["species"] == sp
                     and r["mode"] != "total"]
            total = got[(sp, "total")]
            for col in ("lnq", "u", "cv", "s"):
                self.assertAlmostEqual(sum(r[col] for r in parts),
                                       total[col],
                                       delta=1e-9 * abs(total[col]) + 1e-9)
            model = Model(next(e for e in json.loads(DEMO.read_text())
                               ["species"] if e["name"] == sp))
            lnq, U, cv, _ = model.parts(T, p)
            self.assertAlmostEqual(total["lnq"] / lnq, 1.0, delta=1e-10)
            self.assertAlmostEqual(total["u"] / U, 1.0, delta=1e-9)
            self.assertAlmostEqual(total["cv"] / cv, 1.0, delta=1e-10)


@unittest.skipIf(not CLI, "MOLQ_CLI is not set")
class FiniteDifference(unittest.TestCase):
    """3. dcp_dT against a central difference of the CLI's own cp.

    The json output reads back as the exact doubles, so a step of
    h = 1e-4 T keeps round-off (~1e-16 cp / h) and truncation
    (~(h/T)^2 x^2/6 for a mode with x = theta/T) well below the 1e-6
    relative tolerance."""

    def cp_json(self, args, temps):
        out = run_ok(self, "table", *args, "--T",
                     ",".join(repr(t) for t in temps), "--format", "json")
        doc = json.loads(out)
        return {sp["name"]: [r for r in sp["rows"]] for sp in doc["species"]}

    def check(self, args, temps):
        plus, minus = [t * (1 + 1e-4) for t in temps], \
                      [t * (1 - 1e-4) for t in temps]
        mid = self.cp_json(args, temps)
        up = self.cp_json(args, plus)
        dn = self.cp_json(args, minus)
        n = 0
        for name in mid:
            for i, t in enumerate(temps):
                fd = ((up[name][i]["cp"] - dn[name][i]["cp"])
                      / (plus[i] - minus[i]))
                d = mid[name][i]["dcp_dT"]
                tol = 1e-6 * max(abs(d), mid[name][i]["cp"] / t)
                self.assertLessEqual(
                    abs(fd - d), tol,
                    "%s T=%g: dcp_dT %.10g, finite difference %.10g"
                    % (name, t, d, fd))
                n += 1
        self.assertGreater(n, 0)

    def test_builtin(self):
        # Corrected rotors, electronic levels (O, O2), a nonlinear top.
        self.check(["N2", "O2", "CO2", "H2O", "O", "CO"],
                   [60, 150, 298.15, 700, 1500, 4000])

    def test_h2_low_T(self):
        # H2 below 20 theta_rot: the exact rotor sum.
        self.check(["H2"], [25, 40, 80, 200, 1000, 3000])

    def test_demo(self):
        self.check(["--data", DEMO, "demo-linear", "demo-bent", "demo-top",
                    "demo-diatomic", "demo-atom"],
                   [30, 120, 298.15, 900, 3000, 9000])

    def test_level_sums(self):
        # Level-sum model: equilibrium and frozen spin isomers, excited
        # state, Dunham matrix.
        self.check(["--data", LEVELS, "demo-homo", "demo-homo-frozen",
                    "demo-hetero", "O2"],
                   [15, 40, 120, 298.15, 900, 3000, 6000])

    def test_rrho_variants(self):
        # The built-in diatomics switched to rigid rotor / harmonic.
        self.check(["N2", "O2", "CO", "H2", "--model", "rrho"],
                   [30, 150, 298.15, 1500, 4000])


# Bad species files: file -> (substrings stderr must contain, species name
# or None).  Field names as in the species-file format.
BAD_FILES = {
    "malformed.json": (["line 7", "column"], None),
    "empty.json": (["line 1", "column"], None),
    "unknown_key.json": (["colour", "unknown key"], "demo-bad"),
    "unknown_key_nested.json": (["degenerasy", "unknown key"], "demo-bad"),
    "missing_name.json": (["'name'", "missing"], None),
    "missing_structure.json": (["'structure'", "missing"], "demo-bad"),
    "missing_molar_mass.json": (["'molar_mass'", "missing", "formula"],
                                "demo-bad"),
    "wrong_type_number.json": (["'molar_mass'", "expected a number"],
                               "demo-bad"),
    "wrong_type_integer.json": (["'symmetry_number'", "integer"],
                                "demo-bad"),
    # JSON itself cannot hold 1e999 or NaN: the parser reports them with
    # line and column, and molq quotes the line, which names the field.
    "overflow_number.json": (["formation_enthalpy_298", "line 36",
                              "overflow"], None),
    "nan_number.json": (["formation_enthalpy_298", "line 36", "NaN"], None),
    "molar_mass_zero.json": (["'molar_mass'", "> 0"], "demo-bad"),
    "molar_mass_negative.json": (["'molar_mass'", "> 0", "-4"], "demo-bad"),
    "symmetry_zero.json": (["'symmetry_number'", "from 1 to"], "demo-bad"),
    "rot_count.json": (["'rotational_constants'", "needs 3", "got 1"],
                       "demo-bad"),
    "rot_order.json": (["'rotational_constants'", "A >= B >= C"],
                       "demo-bad"),
    "rot_negative.json": (["rotational_constants[2]", "> 0"], "demo-bad"),
    "wavenumber_zero.json": (["vibrations[1].wavenumber", "> 0"],
                             "demo-bad"),
    "wavenumber_negative.json": (["vibrations[0].wavenumber", "-420"],
                                 "demo-bad"),
    "degeneracy_zero.json": (["vibrations[0].degeneracy", "from 1 to"],
                             "demo-bad"),
    "electronic_degeneracy_zero.json": (["electronic_levels[0].degeneracy",
                                         "from 1 to"], "demo-bad"),
    "electronic_no_ground.json": (["'electronic_levels'", "energy 0"],
                                  "demo-bad"),
    "duplicate_name.json": (["'name'", "duplicate"], "demo-bad"),
    "structure_unknown.json": (["'structure'", "nonlinear"], "demo-bad"),
    "schema_version.json": (["'schema_version'"], None),
    "model_unknown.json": (["'model'", "rrho", "levels"], "demo-bad"),
    "levels_no_dissociation.json": (["'dissociation_energy'", "missing"],
                                    "demo-bad"),
    "levels_dunham_and_named.json": (["diatomic_states[0].dunham",
                                      "not both"], "demo-bad"),
    "levels_odd_fraction_alone.json": (["'odd_fraction'", "frozen"],
                                       "demo-bad"),
    "levels_weights_count.json": (["diatomic_states[0].rotational_weights",
                                   "[even-J weight, odd-J weight]"],
                                  "demo-bad"),
    "levels_state_no_te.json": (["diatomic_states[0].Te", "missing"],
                                "demo-bad"),
    "levels_frozen_fraction_one.json": (["'odd_fraction'",
                                         "between 0 and 1"], "demo-bad"),
    "levels_on_atom.json": (["'diatomic_states'", "linear"], "demo-bad"),
}

# Bad command lines: args -> (exit code, substrings stderr must contain).
BAD_ARGS = [
    (["table", "N2", "--T", "0"], 2, ["--T", "'0'", "greater than 0"]),
    (["table", "N2", "--T", "-5"], 2, ["--T", "'-5'", "greater than 0"]),
    (["table", "N2", "--T", "300,-5"], 2, ["--T", "'-5'"]),
    (["table", "N2", "--T", "nan"], 2, ["--T", "'nan'", "not a finite"]),
    (["table", "N2", "--T", "inf"], 2, ["--T", "'inf'", "not a finite"]),
    (["table", "N2", "--T", "1e999"], 2, ["--T", "'1e999'", "too large"]),
    (["table", "N2", "--T", "abc"], 2, ["--T", "'abc'", "not a number"]),
    (["table", "N2", "--T", "300K"], 2, ["--T", "'300K'", "not a number"]),
    (["table", "N2", "--T", " 300"], 2, ["--T", "' 300'"]),
    (["table", "N2", "--T", "0x1p9"], 2, ["--T", "'0x1p9'"]),
    (["table", "N2", "--T", ""], 2, ["--T", "empty"]),
    (["table", "N2", "--T", "300,,400"], 2, ["--T", "empty entry"]),
    (["table", "N2", "--T", "300:200:10"], 2,
     ["--T", "300:200:10", "START 300 is above STOP 200"]),
    (["table", "N2", "--T", "300:400:0"], 2, ["--T", "STEP", "'0'"]),
    (["table", "N2", "--T", "300:400:-10"], 2, ["--T", "STEP", "'-10'"]),
    (["table", "N2", "--T", "0:400:10"], 2, ["--T", "START", "'0'"]),
    (["table", "N2", "--T", "300:400"], 2, ["--T", "START:STOP:STEP"]),
    (["table", "N2", "--T", "300:x:10"], 2, ["--T", "STOP", "'x'"]),
    (["table", "N2", "--T", "1:2000000:1"], 2, ["--T", "1000000 points"]),
    # A STEP below the spacing of doubles at START would repeat START.
    (["table", "N2", "--T", "1e16:1.0000000000000002e16:0.5"], 2,
     ["--T", "STEP", "too small"]),
    (["table", "N2", "--T"], 2, ["--T", "needs a value"]),
    (["table", "N2", "--T", "300", "--T", "400"], 2, ["--T", "more than once"]),
    (["table", "N2", "--p", "0"], 2, ["--p", "'0'", "greater than 0"]),
    (["table", "N2", "--p", "-1"], 2, ["--p", "'-1'", "greater than 0"]),
    (["table", "N2", "--p", "1bar"], 2, ["--p", "'1bar'", "not a number"]),
    (["table", "N2", "--p", "nan"], 2, ["--p", "'nan'"]),
    (["table", "N2", "--colour"], 2, ["unknown option", "--colour"]),
    (["table", "N2", "-x"], 2, ["unknown option", "-x"]),
    (["table", "N2", "--per-mass=yes"], 2, ["--per-mass", "takes no value"]),
    (["modes", "N2", "--per-mass"], 2, ["--per-mass", "modes"]),
    (["list", "N2"], 2, ["list", "N2"]),
    (["table"], 2, ["at least one species"]),
    (["tabel", "N2"], 2, ["unknown command", "tabel"]),
    (["table", "N2", "--format", "xml"], 2, ["--format", "'xml'",
                                            "unknown format"]),
    (["table", "Qq"], 1, ["unknown species", "'Qq'", "built-in"]),
    (["table", "N2", "n2"], 1, ["unknown species", "'n2'"]),
    # Regression: an empty word is no species and no formula (it used to
    # find the file's first species without a formula, demo-bent).
    (["show", "", "--data", DEMO], 1, ["unknown species", "''"]),
    (["table", "", "--data", DEMO], 1, ["unknown species", "''"]),
    (["table", "demo-nothing", "--data", str(DEMO)], 1,
     ["unknown species", "'demo-nothing'", str(DEMO), "built-in"]),
    (["table", "N2", "--data", str(DATA / "no_such_file.json")], 1,
     ["no_such_file.json", "cannot open"]),
    (["table", "N2", "--data", str(DATA)], 1, [str(DATA), "read"]),
    # Evaluation error: the corrected asymmetric top of H2O (rigid-rotor
    # model) is valid only from T = theta_A = hc A/k (about 40 K) up.
    (["table", "H2O", "--T", "30", "--model", "rrho"], 1,
     ["'H2O'", "T = 30", "temperature outside the validity range"]),
    (["modes", "N2", "H2O", "--T", "300,20", "--format", "json", "--model",
      "rrho"], 1, ["'H2O'", "T = 20", "validity range"]),
    # Models.
    (["table", "N2", "--model", "harmonic"], 2,
     ["--model", "unknown model 'harmonic'", "rrho or levels"]),
    (["table", "N2", "--model", "Levels"], 2, ["--model", "'Levels'"]),
    (["table", "N2", "--model", "rrho,levels"], 2,
     ["--model", "'rrho,levels'"]),
    (["table", "N2", "--model", ""], 2, ["--model", "empty"]),
    (["table", "N2", "--model"], 2, ["--model", "needs a value"]),
    (["table", "N2", "--model", "rrho", "--model", "rrho"], 2,
     ["--model", "more than once"]),
    (["table", "N2", "--compare", "rrho,anharmonic"], 2,
     ["--compare", "unknown model 'anharmonic'", "rrho or levels"]),
    (["table", "N2", "--compare", "rrho,rrho"], 2,
     ["--compare", "'rrho' given twice"]),
    (["table", "N2", "--compare", "rrho,"], 2, ["--compare", "empty entry"]),
    (["table", "N2", "--compare", ""], 2, ["--compare", "empty"]),
    (["table", "N2", "--model", "rrho", "--compare", "rrho,levels"], 2,
     ["--model", "--compare", "exclude"]),
    (["modes", "N2", "--compare", "rrho,levels"], 2,
     ["--compare", "modes"]),
    (["list", "--model", "rrho"], 2, ["--model", "list"]),
    (["spin", "H2", "--p", "2e5"], 2, ["--p", "spin"]),
    (["spin"], 2, ["at least one species"]),
    # A species whose data cannot support the model: the library's
    # message names the missing field.
    # A molecule without level data cannot use the levels model (an atom
    # keeps its own model instead: test_cli_usability.py).
    (["table", "demo-linear", "--data", DEMO, "--model", "levels"], 1,
     ["'demo-linear'", "model 'levels'", "diatomic_states"]),
    (["table", "N2", "demo-linear", "--data", DEMO, "--compare",
      "rrho,levels"], 1,
     ["'demo-linear'", "model 'levels'", "diatomic_states"]),
    (["modes", "demo-diatomic", "--data", DEMO, "--model", "levels"], 1,
     ["'demo-diatomic'", "diatomic_states"]),
    (["spin", "Ar"], 1, ["Ar has no spin-isomer model"]),
    (["spin", "N2", "--model", "rrho"], 1, ["'N2'", "model 'rrho'",
                                            "levels"]),
    (["spin", "demo-diatomic", "--data", str(DEMO)], 1,
     ["'demo-diatomic'", "model 'rrho'", "levels"]),
    # Levels model without a diatomic level sum (hindered rotor).
    (["spin", "H2", "--model", "rrho"], 1, ["'H2'", "model 'rrho'"]),
]


@unittest.skipIf(not CLI, "MOLQ_CLI is not set")
class BadInput(unittest.TestCase):
    """4. Every bad input: non-zero exit, a clear message, no output."""

    def test_corpus_complete(self):
        on_disk = sorted(p.name for p in BAD.glob("*.json"))
        self.assertEqual(on_disk, sorted(BAD_FILES))

    def test_bad_files(self):
        for fname, (needles, species) in sorted(BAD_FILES.items()):
            with self.subTest(file=fname):
                path = BAD / fname
                for args in (["table", "demo-bad", "--data", path],
                             ["list", "--data", path]):
                    rc, out, err = run(*args)
                    self.assertEqual(rc, 1, err)
                    self.assertEqual(out, "")
                    self.assertTrue(err.startswith("molq: "), err)
                    self.assertIn(str(path), err)
                    for n in needles:
                        self.assertIn(n, err)
                    if species is not None:
                        self.assertIn("species '%s'" % species, err)

    def test_syntax_error_position(self):
        rc, _, err = run("table", "x", "--data", BAD / "malformed.json")
        m = re.search(r"line (\d+), column (\d+)", err)
        self.assertIsNotNone(m, err)
        self.assertEqual(int(m.group(1)), 7)
        # The quoted line is the one the parser stopped at.
        self.assertIn('"source": "invented test data', err)

    def test_bad_command_lines(self):
        for args, code, needles in BAD_ARGS:
            with self.subTest(args=args):
                rc, out, err = run(*args)
                self.assertEqual(rc, code, err)
                self.assertEqual(out, "")
                self.assertTrue(err.startswith("molq: "), err)
                for n in needles:
                    self.assertIn(n, err)

    def test_no_arguments(self):
        rc, out, err = run()
        self.assertEqual(rc, 2)
        self.assertIn("Usage", err)


@unittest.skipIf(not CLI, "MOLQ_CLI is not set")
class BuiltinFormats(unittest.TestCase):
    """5. Built-in species in text and json; json equals csv."""

    def test_json_equals_csv(self):
        # the electron gas starts at 295 K (molq_species_t_min)
        args = (["table"] + [n for n in BUILTIN if n != "e-"] +
                ["--T", "200,298.15,1000,2500"])
        _, rows = parse_csv(run_ok(self, *args, "--format", "csv"))
        csv_lines = run_ok(self, *args, "--format", "csv").splitlines()[1:]
        doc = json.loads(run_ok(self, *args, "--format", "json"))
        self.assertEqual(doc["pressure"], 1e5)
        self.assertEqual(doc["basis"], "molar")
        self.assertEqual(doc["units"]["cp"], "J/(mol K)")
        self.assertEqual(doc["units"]["h"], "J/mol")
        self.assertEqual(doc["units"]["dcp_dT"], "J/(mol K^2)")
        self.assertEqual([s["name"] for s in doc["species"]], args[1:-2])
        i = 0
        for sp in doc["species"]:
            self.assertEqual(len(sp["rows"]), 4)
            for r in sp["rows"]:
                # The csv prints the very same double (both formats print
                # the shortest decimal that reads back exactly).
                fields = csv_lines[i].split(",")
                self.assertEqual(fields[0], sp["name"])
                self.assertEqual([float(f) for f in fields[1:]],
                                 [r["T"]] + [r[c] for c in COLUMNS])
                i += 1
        self.assertEqual(i, len(rows))

    def test_json_round_trip_digits(self):
        # Round-trip digits: the json numbers are the doubles the
        # library computed; recomputing a difference must agree exactly
        # with the same difference from a second run.
        a = json.loads(run_ok(self, "table", "CO2", "--T", "1000",
                              "--format", "json"))
        b = json.loads(run_ok(self, "table", "CO2", "--T", "1000",
                              "--format", "json"))
        self.assertEqual(a, b)
        r = a["species"][0]["rows"][0]
        # cp - cv = R exactly up to double round-off (ideal gas).
        self.assertAlmostEqual(r["cp"] - r["cv"], R, delta=1e-12)

    def test_text_table(self):
        out = run_ok(self, "table", "N2", "H2O", "--T", "300,1000,2000")
        self.assertIn("p = 100000 Pa", out)
        _, rows = parse_csv(run_ok(self, "table", "N2", "H2O", "--T",
                                   "300,1000,2000", "--format", "csv"))
        lines = out.splitlines()
        for name in ("N2", "H2O"):
            start = next(i for i, l in enumerate(lines)
                         if l.startswith(name + "  ("))
            head, units = lines[start + 1], lines[start + 2]
            self.assertEqual(head.split(), ["T"] + COLUMNS)
            self.assertEqual(units.split(),
                             ["K", "J/(mol", "K)", "J/(mol", "K)", "J/mol",
                              "J/(mol", "K)", "J/mol", "J/mol", "J/(mol",
                              "K)", "J/(mol", "K^2)"])
            # Columns are aligned: every header name ends where its
            # numbers end.
            ends = [m.end() for m in re.finditer(r"\S+", head)]
            body = lines[start + 3:start + 6]
            want = [r for r in rows if r["species"] == name]
            for line, r in zip(body, want):
                self.assertEqual([m.end() for m in
                                  re.finditer(r"\S+", line)], ends)
                vals = [float(v) for v in line.split()]
                self.assertEqual(vals[0], r["T"])
                for v, c in zip(vals[1:], COLUMNS):
                    self.assertAlmostEqual(v, r[c],
                                           delta=1e-6 * abs(r[c]) + 1e-9)

    def test_janaf_sanity(self):
        # Values of the built-in set at 298.15 K, 1 bar, with each
        # species' own model and with every species as rigid rotor /
        # harmonic oscillator, against NIST-JANAF 1998 (values from
        # memory).  Tolerances allow for the simpler model.
        janaf = {  # name: (cp, s) J/(mol K)
            "Ar": (20.786, 154.845),
            "N2": (29.124, 191.609),
            "O2": (29.376, 205.147),
            "CO": (29.142, 197.653),
            "CO2": (37.135, 213.795),
            "H2O": (33.590, 188.834),
        }
        out = run_ok(self, "table", *janaf, "--T", "298.15", "--format",
                     "json")
        rrho = run_ok(self, "table", *janaf, "--T", "298.15", "--format",
                      "json", "--model", "rrho")
        for sp in (json.loads(out)["species"]
                   + json.loads(rrho)["species"]):
            cp, s = janaf[sp["name"]]
            r = sp["rows"][0]
            self.assertAlmostEqual(r["cp"], cp, delta=0.01 * cp, msg=sp["name"])
            self.assertAlmostEqual(r["s"], s, delta=0.003 * s, msg=sp["name"])
            self.assertAlmostEqual(r["h_minus_h298"], 0.0, delta=1e-6)
        # Ar: cp = 5/2 R exactly for a structureless atom (textbook).
        ar = json.loads(out)["species"][0]["rows"][0]
        self.assertAlmostEqual(ar["cp"], 2.5 * R, places=10)

    def test_per_mass_and_pressure(self):
        molar = json.loads(run_ok(self, "table", "CO2", "H2", "--T",
                                  "500,1500", "--format", "json"))
        mass = json.loads(run_ok(self, "table", "CO2", "H2", "--T",
                                 "500,1500", "--format", "json",
                                 "--per-mass"))
        self.assertEqual(mass["basis"], "mass")
        self.assertEqual(mass["units"]["cp"], "J/(kg K)")
        self.assertEqual(mass["units"]["h"], "J/kg")
        self.assertEqual(mass["units"]["dcp_dT"], "J/(kg K^2)")
        for a, b in zip(molar["species"], mass["species"]):
            M = a["molar_mass"] * 1e-3  # g/mol -> kg/mol
            for ra, rb in zip(a["rows"], b["rows"]):
                for c in COLUMNS:
                    self.assertAlmostEqual(rb[c], ra[c] / M,
                                           delta=1e-12 * abs(ra[c] / M))
        # Ideal gas: s(p2) - s(p1) = -R ln(p2/p1); cp and h do not depend
        # on p (textbook).
        lo = json.loads(run_ok(self, "table", "N2", "--T", "800", "--p",
                               "1e4", "--format", "json"))
        hi = json.loads(run_ok(self, "table", "N2", "--T", "800", "--p",
                               "1e6", "--format", "json"))
        rlo, rhi = lo["species"][0]["rows"][0], hi["species"][0]["rows"][0]
        self.assertAlmostEqual(rhi["s"] - rlo["s"], -R * math.log(100),
                               delta=1e-9)
        self.assertEqual(rhi["cp"], rlo["cp"])
        self.assertEqual(rhi["h"], rlo["h"])

    def test_modes_json_and_text(self):
        # O2 by default uses the level sum (one rovibronic mode); with
        # --model rrho its rotation, vibration and electronic levels are
        # separate modes.  Either way the modes add up to the totals and
        # the totals equal `molq table` with the same model.
        want_modes = {
            None: ["translation", "rovibronic"],
            "rrho": ["translation", "rotation", "vibration", "electronic"],
            "levels": ["translation", "rovibronic"],
        }
        for model, kinds in want_modes.items():
            extra = ["--model", model] if model else []
            # H2O has no level-sum data.
            names = ["O2"] if model == "levels" else ["O2", "H2O"]
            doc = json.loads(run_ok(self, "modes", *names, "--T", "1000",
                                    "--format", "json", *extra))
            o2 = doc["species"][0]
            self.assertEqual(o2["modes"], kinds)
            self.assertEqual(o2["model"], model or "levels")
            row = o2["rows"][0]
            self.assertEqual(row["T"], 1000)
            for c in ("lnq", "cv", "s", "u"):
                self.assertAlmostEqual(sum(m[c] for m in row["modes"]),
                                       row["total"][c],
                                       delta=1e-9 * abs(row["total"][c]))
            tab = json.loads(run_ok(self, "table", "O2", "--T", "1000",
                                    "--format", "json", *extra))
            t = tab["species"][0]["rows"][0]
            self.assertAlmostEqual(row["total"]["cv"], t["cv"], delta=1e-9)
            self.assertAlmostEqual(row["total"]["s"], t["s"], delta=1e-9)
        text = run_ok(self, "modes", "O2", "--T", "1000", "--model", "rrho")
        self.assertIn("T = 1000 K", text)
        self.assertIn("model rrho", text)
        for word in ("translation", "rotation", "vibration", "electronic",
                     "total", "J/(mol K)"):
            self.assertIn(word, text)

    def test_list(self):
        out = run_ok(self, "list")
        for name in BUILTIN:
            self.assertRegex(out, r"(?m)^%s\s" % re.escape(name))
        doc = json.loads(run_ok(self, "list", "--data", DEMO, "--format",
                                "json"))
        info = {s["name"]: s for s in doc["species"]}
        self.assertEqual(info["demo-bent"]["structure"], "nonlinear")
        self.assertEqual(info["demo-linear"]["structure"], "linear")
        self.assertEqual(info["demo-atom"]["structure"], "atom")
        self.assertEqual(info["CO2"]["structure"], "linear")
        self.assertEqual(info["H2O"]["structure"], "nonlinear")
        self.assertFalse(info["demo-bent"]["has_formation_enthalpy"])
        self.assertTrue(info["demo-linear"]["has_formation_enthalpy"])
        self.assertEqual(info["demo-linear"]["molar_mass"], 58.3)
        self.assertEqual(info["demo-linear"]["set"], "file")
        self.assertEqual(info["N2"]["set"], "built-in")
        # Each species' model: the file's demo species have none (rrho);
        # atoms have only rigid-rotor data; the built-in diatomics default
        # to the level sum; every model shown is one the tool knows.
        self.assertEqual(info["demo-linear"]["model"], "rrho")
        self.assertEqual({n: info[n]["model"] for n in
                          ("Ar", "O", "H2", "N2", "O2", "CO")},
                         {"Ar": "rrho", "O": "rrho", "H2": "levels",
                          "N2": "levels", "O2": "levels", "CO": "levels"})
        for n in BUILTIN:
            self.assertIn(info[n]["model"], MODELS)
        text = run_ok(self, "list")
        self.assertEqual(text.splitlines()[0].split()[:5],
                         ["name", "formula", "charge", "structure", "model"])
        self.assertRegex(text, r"(?m)^N2\s+N2\s+0\s+linear\s+levels\s")
        self.assertRegex(text, r"(?m)^Ar\s+Ar\s+0\s+atom\s+rrho\s")
        self.assertIn("JANAF", info["CO2"]["source"])
        # csv: the quoted source with commas survives.
        rows = list(csv.DictReader(io.StringIO(
            run_ok(self, "list", "--format", "csv"))))
        self.assertEqual([r["name"] for r in rows], BUILTIN)
        self.assertEqual([r["model"] for r in rows],
                         [info[n]["model"] for n in BUILTIN])
        self.assertIn(",", rows[0]["source"] + rows[2]["source"])

    def test_data_file_searched_first(self):
        # shadow.json (invented) holds an 'N2' of molar mass 40 g/mol.
        shadow = DATA / "shadow.json"
        a = json.loads(run_ok(self, "table", "N2", "--T", "500",
                              "--format", "json"))
        b = json.loads(run_ok(self, "table", "N2", "--T", "500", "--data",
                              shadow, "--format", "json"))
        self.assertEqual(a["species"][0]["molar_mass"], 28.0134)
        self.assertEqual(b["species"][0]["molar_mass"], 40.0)
        out = run_ok(self, "list", "--data", shadow)
        self.assertIn("built-in (hidden by file)", out)
        # Built-in species stay reachable with --data.
        run_ok(self, "table", "CO", "--data", shadow)

    def test_help_and_version(self):
        # The full overview (each command's own help: test_cli_usability).
        for args in (["--help"], ["help"], ["-h"]):
            out = run_ok(self, *args)
            flat = " ".join(out.split())
            self.assertIn(CAUTION, flat)
            for word in ("table", "modes", "list", "spin", "--data", "--T",
                         "--p", "--format", "--per-mass", "--model",
                         "--compare", "J/(mol K)", "J/mol", "J/(mol K^2)",
                         "START:STOP:STEP", "h_frozen_minus_h_eq"):
                self.assertIn(word, out)
            # One line per model in the Models section.
            for name in MODELS:
                self.assertRegex(out, r"(?m)^  %s\s+\S" % name)
            self.assertTrue(all(len(l) <= 80 for l in out.splitlines()))
        for args in (["help", "spin"], ["spin", "--help"]):
            run_ok(self, *args)
        out = run_ok(self, "--version")
        self.assertRegex(out, r"^molq \d+\.\d+\.\d+")


def csv_rows(text):
    """csv text -> list of lists of the raw fields (no float conversion)."""
    return list(csv.reader(io.StringIO(text)))


@unittest.skipIf(not CLI, "MOLQ_CLI is not set")
class ModelChoice(unittest.TestCase):
    """6. --model: each species evaluated with the model asked for."""

    def test_n2_2000K_against_janaf(self):
        # NIST-JANAF Thermochemical Tables, 4th ed. (Chase 1998), nitrogen
        # (N2) table, 2000 K: cp = 35.971 J/(mol K), S = 252.074 J/(mol K)
        # (from memory).  The level sum includes the anharmonicity and
        # vibration-rotation coupling that the rigid rotor / harmonic
        # oscillator misses, so it must land closer.
        cp_janaf, s_janaf = 35.971, 252.074
        got = {}
        for model in MODELS:
            _, rows = parse_csv(run_ok(self, "table", "N2", "--T", "2000",
                                       "--model", model, "--format", "csv"))
            self.assertEqual(len(rows), 1)
            got[model] = rows[0]
        rrho, levels = got["rrho"], got["levels"]
        self.assertGreater(abs(levels["cp"] - rrho["cp"]), 0.1)
        self.assertLess(abs(levels["cp"] - cp_janaf),
                        abs(rrho["cp"] - cp_janaf))
        self.assertAlmostEqual(levels["cp"], cp_janaf, delta=0.02)
        self.assertLess(abs(levels["s"] - s_janaf), abs(rrho["s"] - s_janaf))
        self.assertAlmostEqual(levels["s"], s_janaf, delta=0.02)
        # Rigid rotor / harmonic misses about 0.26 J/(mol K) of cp here
        # (JANAF value above, from memory): it is not merely round-off.
        self.assertAlmostEqual(rrho["cp"], cp_janaf, delta=0.5)

    def test_default_is_own_model(self):
        # Asking for the model a species already has (as `molq list`
        # shows it) changes nothing, to the last printed digit.
        doc = json.loads(run_ok(self, "list", "--data", DEMO, "--format",
                                "json"))
        own_model = {s["name"]: s["model"] for s in doc["species"]}
        for name in BUILTIN + ["demo-bent"]:
            with self.subTest(name=name):
                a = run_ok(self, "table", name, "--data", DEMO, "--format",
                           "csv")
                b = run_ok(self, "table", name, "--data", DEMO, "--model",
                           own_model[name], "--format", "csv")
                self.assertEqual(a, drop_model_columns(b))
        # A mixed list: --model rrho switches N2 and leaves the atom (which
        # has only rigid-rotor data) as it was.
        mixed = run_ok(self, "table", "N2", "Ar", "--model", "rrho",
                       "--T", "1500", "--format", "csv")
        own = run_ok(self, "table", "N2", "Ar", "--T", "1500", "--format",
                     "csv")
        self.assertEqual(mixed.splitlines()[0], CSV_HEADER_MODEL)
        mixed = drop_model_columns(mixed)
        self.assertNotEqual(mixed.splitlines()[1], own.splitlines()[1])
        self.assertEqual(mixed.splitlines()[2], own.splitlines()[2])

    def test_json_and_text_name_the_model(self):
        doc = json.loads(run_ok(self, "table", "N2", "Ar", "--T", "500",
                                "--format", "json", "--model", "rrho"))
        self.assertEqual([s["model"] for s in doc["species"]],
                         ["rrho", "rrho"])
        doc = json.loads(run_ok(self, "table", "N2", "Ar", "--T", "500",
                                "--format", "json"))
        self.assertEqual([s["model"] for s in doc["species"]],
                         ["levels", "rrho"])
        text = run_ok(self, "table", "N2", "--T", "500", "--model", "rrho")
        self.assertIn("model rrho", text)


@unittest.skipIf(not CLI, "MOLQ_CLI is not set")
class Compare(unittest.TestCase):
    """7. --compare: one row per model for each species and T."""

    TEMPS = "300,1000,2500"

    def separate(self, names, model, fmt="csv", *extra):
        return run_ok(self, "table", *names, "--T", self.TEMPS, "--model",
                      model, "--format", fmt, *extra)

    def test_csv_structure_and_values(self):
        names = ["N2", "H2", "CO"]
        for order in (["rrho", "levels"], ["levels", "rrho"]):
            out = run_ok(self, "table", *names, "--T", self.TEMPS,
                         "--compare", ",".join(order), "--format", "csv")
            rows = csv_rows(out)
            self.assertEqual(",".join(rows[0]), CSV_HEADER_COMPARE)
            body = rows[1:]
            temps = [float(t) for t in self.TEMPS.split(",")]
            # species -> T -> model, in the order asked for.
            self.assertEqual([(r[0], float(r[3]), r[1], r[2])
                              for r in body],
                             [(n, t, m, m) for n in names for t in temps
                              for m in order])
            # Each row equals the same species/T/model from a --model run,
            # as printed (same double, same format).
            for model in order:
                single = csv_rows(self.separate(names, model))[1:]
                mine = [r for r in body if r[1] == model]
                self.assertEqual(mine, single)
        # Without --compare the header stays as it always was.
        out = run_ok(self, "table", "N2", "--format", "csv")
        self.assertEqual(out.splitlines()[0], CSV_HEADER)

    def test_json_structure(self):
        doc = json.loads(run_ok(self, "table", "N2", "H2", "--T", self.TEMPS,
                                "--compare", "rrho,levels", "--format",
                                "json", "--per-mass", "--p", "3e5"))
        self.assertEqual(doc["basis"], "mass")
        self.assertEqual(doc["pressure"], 3e5)
        self.assertEqual(doc["units"]["cp"], "J/(kg K)")
        for sp in doc["species"]:
            self.assertNotIn("rows", sp)
            self.assertNotIn("model", sp)
            self.assertEqual([m["model"] for m in sp["models"]],
                             ["rrho", "levels"])
            for m in sp["models"]:
                single = json.loads(self.separate(
                    [sp["name"]], m["model"], "json", "--per-mass", "--p",
                    "3e5"))
                self.assertEqual(m["rows"], single["species"][0]["rows"])
        # The two models differ for H2 at 2500 K in cp.
        h2 = doc["species"][1]["models"]
        self.assertNotEqual(h2[0]["rows"][2]["cp"], h2[1]["rows"][2]["cp"])

    def test_text(self):
        out = run_ok(self, "table", "N2", "--T", self.TEMPS, "--compare",
                     "rrho,levels")
        lines = out.splitlines()
        start = next(i for i, l in enumerate(lines) if l.startswith("N2  ("))
        self.assertEqual(lines[start + 1].split(), ["T", "model"] + COLUMNS)
        body = [l.split() for l in lines[start + 3:] if l.strip()]
        self.assertEqual([(float(b[0]), b[1]) for b in body],
                         [(t, m) for t in (300.0, 1000.0, 2500.0)
                          for m in ("rrho", "levels")])
        _, rows = parse_csv(run_ok(self, "table", "N2", "--T", self.TEMPS,
                                   "--compare", "rrho,levels", "--format",
                                   "csv"))
        for b, r in zip(body, rows):
            for v, c in zip(b[2:], COLUMNS):
                self.assertAlmostEqual(float(v), r[c],
                                       delta=1e-6 * abs(r[c]) + 1e-9)

    def test_single_model_and_user_file(self):
        out = run_ok(self, "table", "demo-hetero", "--data", LEVELS,
                     "--compare", "rrho", "--format", "csv", "--T", "700")
        self.assertEqual(out.splitlines()[0], CSV_HEADER_COMPARE)
        self.assertEqual(len(out.splitlines()), 2)
        self.assertTrue(out.splitlines()[1].startswith(
            "demo-hetero,rrho,rrho,700,"))


@unittest.skipIf(not CLI, "MOLQ_CLI is not set")
class SpinConversion(unittest.TestCase):
    """8. molq spin: ortho-para conversion enthalpy h_frozen - h_eq."""

    def rows(self, *args):
        doc = json.loads(run_ok(self, "spin", *args, "--format", "json"))
        return {s["name"]: s["rows"] for s in doc["species"]}

    def test_normal_hydrogen_20K(self):
        # Conversion of normal to equilibrium hydrogen at 20 K releases
        # about 527 kJ/kg (cryogenic practice, from memory), i.e.
        # 527 kJ/kg x 2.01588 g/mol = 1062 J/mol.
        r = self.rows("H2", "--T", "20")["H2"][0]
        self.assertEqual(r["T"], 20)
        self.assertAlmostEqual(r["h_frozen_minus_h_eq"], 1062.0, delta=10.0)
        doc = json.loads(run_ok(self, "spin", "H2", "--T", "20", "--format",
                                "json", "--per-mass"))
        self.assertEqual(doc["basis"], "mass")
        self.assertEqual(doc["units"]["h_frozen_minus_h_eq"], "J/kg")
        per_kg = doc["species"][0]["rows"][0]["h_frozen_minus_h_eq"]
        self.assertAlmostEqual(per_kg, 527e3, delta=5e3)
        self.assertAlmostEqual(per_kg * 2.01588e-3,
                               r["h_frozen_minus_h_eq"], delta=1e-6)

    def test_hydrogen_low_T_limit(self):
        # T -> 0: equilibrium hydrogen is all para (J = 0); normal hydrogen
        # keeps 3/4 of its molecules in J = 1, so the difference tends to
        # (3/4) N_A hc E(J=1) with E(J=1) = 118.49 cm^-1 above J = 0 in
        # v = 0 (H2 rotational term values, from memory).
        r = self.rows("H2", "--T", "5")["H2"][0]
        self.assertAlmostEqual(r["h_frozen_minus_h_eq"],
                               0.75 * R * C2 * 118.49, delta=1.0)

    def test_formats_and_defaults(self):
        out = run_ok(self, "spin", "H2", "CO", "--format", "csv")
        lines = out.splitlines()
        self.assertEqual(lines[0], "species,T,h_frozen_minus_h_eq")
        _, rows = parse_csv(out)
        default_T = [20, 30, 40, 50, 77, 100, 150, 200, 298.15]
        self.assertEqual([r["T"] for r in rows if r["species"] == "H2"],
                         default_T)
        h2 = [r["h_frozen_minus_h_eq"] for r in rows if r["species"] == "H2"]
        # Normal hydrogen gives off less on conversion the warmer it is
        # (the equilibrium mixture approaches 3:1 ortho:para).
        self.assertTrue(all(a > b for a, b in zip(h2, h2[1:])), h2)
        self.assertLess(h2[-1], 1.0)
        # CO is heteronuclear: even and odd J weigh the same, nothing to
        # convert.
        for r in rows:
            if r["species"] == "CO":
                self.assertLess(abs(r["h_frozen_minus_h_eq"]), 1e-6)
        text = run_ok(self, "spin", "H2", "--T", "20,77")
        self.assertIn("h_frozen_minus_h_eq", text)
        self.assertIn("model levels", text)
        vals = [l.split() for l in text.splitlines()
                if re.match(r"^\s+(20|77)\s", l)]
        self.assertEqual(len(vals), 2)
        self.assertAlmostEqual(float(vals[0][1]), h2[0],
                               delta=1e-6 * h2[0])

    def test_invented_species_against_level_sum(self):
        doc = json.loads(LEVELS.read_text())
        model = {e["name"]: LevelSum(e) for e in doc["species"]}
        temps = [10, 20, 45, 100, 300]
        got = self.rows("--data", LEVELS, "demo-homo", "demo-homo-frozen",
                        "demo-hetero", "--T", ",".join(map(str, temps)))
        for name in ("demo-homo", "demo-homo-frozen"):
            for r in got[name]:
                want = model[name].spin_conversion(r["T"])
                self.assertAlmostEqual(r["h_frozen_minus_h_eq"], want,
                                       delta=1e-9 * abs(want) + 1e-9,
                                       msg="%s T=%g" % (name, r["T"]))
        # The species' own frozen mixture (60 % odd) holds fewer odd-J
        # molecules than equilibrium at 20 K: conversion takes up heat.
        self.assertLess(got["demo-homo-frozen"][1]["h_frozen_minus_h_eq"],
                        -1.0)
        # A heteronuclear molecule has no spin isomers (molq.h: 0 for
        # species without distinct even/odd weights).
        for r in got["demo-hetero"][1:]:
            self.assertLess(abs(r["h_frozen_minus_h_eq"]), 1e-6)

    # A heteronuclear molecule has a single nuclear-spin modification:
    # exactly 0 at every T (molq.h), also far below the rotational
    # temperature.
    def test_heteronuclear_cold_is_zero(self):
        got = self.rows("--data", LEVELS, "CO", "demo-hetero", "--T",
                        "2,5,10")
        for name, rows in got.items():
            for r in rows:
                self.assertLess(abs(r["h_frozen_minus_h_eq"]), 1e-6,
                                "%s at %g K" % (name, r["T"]))


@unittest.skipIf(not CLI, "MOLQ_CLI is not set")
class LevelsFile(unittest.TestCase):
    """9. A species file with diatomic_states (invented data) against the
    level sums and rigid-rotor formulas written here."""

    TEMPS = [12, 50, 120, 298.15, 1000, 3000, 6000]

    def entries(self):
        return json.loads(LEVELS.read_text())["species"]

    def compare(self, models, extra, p):
        names = [m.name for m in models]
        out = run_ok(self, "table", *names, "--data", LEVELS, "--T",
                     ",".join(str(t) for t in self.TEMPS), "--p", repr(p),
                     "--format", "csv", *extra)
        header, rows = parse_csv(out)
        self.assertEqual(header, CSV_HEADER_MODEL if "--model" in extra
                         else CSV_HEADER)
        self.assertEqual(len(rows), len(models) * len(self.TEMPS))
        by_name = {m.name: m for m in models}
        for r in rows:
            if "--model" in extra:
                asked = extra[extra.index("--model") + 1]
                self.assertEqual((r["model"], r["model_used"]),
                                 (asked, asked))
            want = by_name[r["species"]].row(r["T"], p)
            for col in COLUMNS:
                tol = max(1e-9 * abs(want[col]),
                          abs_floor(col, r["T"], want))
                if col == "dcp_dT":
                    # The library interpolates level sums in ln T; its
                    # third cumulant carries about 5e-9 (lib/core/
                    # lnq_table.h), i.e. 5e-9 R/T in dcp_dT.
                    tol = max(tol, 5e-8 * R / r["T"])
                self.assertLessEqual(
                    abs(r[col] - want[col]), tol,
                    "%s at T=%g: %s cli %.12g, formula %.12g"
                    % (r["species"], r["T"], col, r[col], want[col]))

    def test_levels_model(self):
        # Every entry uses the level sum: two say "model": "levels", the
        # third gets it by default because it gives diatomic_states.
        info = {s["name"]: s for s in json.loads(run_ok(
            self, "list", "--data", LEVELS, "--format", "json"))["species"]}
        for e in self.entries():
            self.assertEqual(info[e["name"]]["model"], "levels")
        models = [LevelSum(e) for e in self.entries()]
        self.compare(models, [], 1e5)
        self.compare(models, ["--model", "levels"], 4.2e6)

    def test_rrho_variant(self):
        models = [Model(rrho_entry(e)) for e in self.entries()]
        self.compare(models, ["--model", "rrho"], 1e5)
        self.compare(models, ["--model", "rrho"], 2e3)

    def test_level_sum_sanity(self):
        # The from-scratch level sum against facts of the trade: at high T
        # the rotational levels of a homonuclear molecule with weights 1/4
        # and 3/4 sum to T/(2 theta) like a classical rotor of symmetry
        # number 2 (within theta/(3T)); a heteronuclear doublet gets
        # ln 2 from its degeneracy.
        e = {"name": "x", "molar_mass": 10.0, "dissociation_energy": 1e6,
             "symmetry_number": 2,
             "diatomic_states": [{"Te": 0, "Be": 2.0,
                                  "rotational_weights": [0.25, 0.75]}]}
        lq = level_cumulants(bound_levels(e), 3000.0)[0]
        theta = C2 * 2.0
        self.assertAlmostEqual(lq, math.log(3000.0 / (2 * theta)) +
                               theta / (3 * 3000.0), delta=1e-6)
        e["diatomic_states"][0]["degeneracy"] = 2
        e["symmetry_number"] = 1
        del e["diatomic_states"][0]["rotational_weights"]
        lq2 = level_cumulants(bound_levels(e), 3000.0)[0]
        self.assertAlmostEqual(lq2, math.log(2 * 3000.0 / theta) +
                               theta / (3 * 3000.0), delta=1e-6)

    def test_modes(self):
        T, p = 800.0, 1e5
        doc = json.loads(run_ok(self, "modes", "demo-homo", "--data", LEVELS,
                                "--T", T, "--format", "json"))
        sp = doc["species"][0]
        self.assertEqual(sp["model"], "levels")
        self.assertEqual(sp["modes"], ["translation", "rovibronic"])
        rv = sp["rows"][0]["modes"][1]
        model = LevelSum(self.entries()[0])
        lq, m1, c2, _ = model.internal(T)
        self.assertAlmostEqual(rv["lnq"], lq, delta=1e-10 * abs(lq))
        self.assertAlmostEqual(rv["u"], R * m1, delta=1e-9 * R * m1)
        self.assertAlmostEqual(rv["cv"], R * c2 / T ** 2, delta=1e-10)
        self.assertAlmostEqual(rv["s"], R * lq + R * m1 / T, delta=1e-9)
        doc = json.loads(run_ok(self, "modes", "demo-homo", "--data", LEVELS,
                                "--T", T, "--format", "json", "--model",
                                "rrho"))
        self.assertEqual(doc["species"][0]["modes"],
                         ["translation", "rotation", "vibration",
                          "electronic"])


sys.path.insert(0, str(Path(__file__).resolve().parents[1]))
from species_data import species_files  # noqa: E402 (tests/species_data.py)
LIST_SOURCES = DATA / "list_sources.json"
LIST_CSV_HEADER = ["name", "formula", "charge", "structure", "model",
                   "molar_mass", "formation_enthalpy", "t_low", "t_high",
                   "set", "source_summary", "source"]


def charge_of(formula):
    """Charge written at the end of a formula, one sign per elementary
    charge: 'N2+' +1, 'e-' -1, 'CO2' 0 (common practice for ion
    formulas, the one the species files use)."""
    tail = formula[len(formula.rstrip("+-")):]
    return tail.count("+") - tail.count("-")


@unittest.skipIf(not CLI, "MOLQ_CLI is not set")
class ListColumns(unittest.TestCase):
    """`molq list` (and `molq species`) show charge, validated range and
    a one-line source summary in text, csv and json.  Expected values come
    from the species files (data/species/*.json: the electron's formula
    'e-', N2's "validated_range" [100, 6000] in diatomics.json) and from
    the invented file tests/cli/data/list_sources.json, whose summaries
    are worked out by hand below from the documented rule (molq help list:
    first clause up to ';' outside parentheses, white space runs made one
    space, cut at a word to at most 60 characters with '...')."""

    # Hand-worked summaries of list_sources.json (INVENTED sources).
    SUMMARY = {
        "src-short": "short source",
        "src-paren": "Smith (1999; table 3) measured",
        "src-space": "two lines here",
        # 66-character clause: its first 57 characters end with the space
        # after 'kappa'; cut there.
        "src-long": "alpha beta gamma delta epsilon zeta eta theta iota "
                    "kappa...",
        # No space: cut after 57 characters.
        "src-nospace": "x" * 57 + "...",
        # The cut leaves 'eleven,': the comma goes.
        "src-comma": "one two three four five six seven eight nine ten "
                     "eleven...",
        # Exactly 60 characters stay whole; 61 are cut at a word.
        "src-60": "abcdefghi abcdefghi abcdefghi abcdefghi abcdefghi "
                  "abcdefghij",
        "src-61": "abcdefghi abcdefghi abcdefghi abcdefghi abcdefghi...",
        # Counted in characters, not bytes (each word is 8 characters,
        # 10 bytes): five words and a sixth before the cut at 57.
        "src-utf8": " ".join(["\u00c5ngstr\u00f6m"] * 6) + "...",
        "src-none": "",
        "cation": "invented singly charged cation",
        "anion": "invented singly charged anion",
    }

    def test_builtin_charge_and_range_against_species_files(self):
        files = species_files()
        doc = json.loads(run_ok(self, "list", "--format", "json"))
        self.assertEqual(doc["units"]["validated_range"], "K")
        self.assertEqual(doc["units"]["charge"], "e")
        got = {s["name"]: s for s in doc["species"]}
        self.assertEqual(sorted(got), sorted(files))
        for name, entry in files.items():
            with self.subTest(name=name):
                g = got[name]
                self.assertEqual(g["formula"], entry["formula"])
                self.assertEqual(g["charge"], charge_of(entry["formula"]))
                want = entry.get("validated_range")
                self.assertEqual(g["validated_range"],
                                 None if want is None
                                 else [float(x) for x in want])
                self.assertEqual(g["source"], entry.get("source", ""))
                self.assertLessEqual(len(g["source_summary"]), 60)
                self.assertNotIn("\n", g["source_summary"])
                # The summary is the start of the source (before any cut).
                head = g["source_summary"]
                if head.endswith("..."):
                    head = head[:-3]
                self.assertTrue(" ".join(entry["source"].split())
                                .startswith(head), head)
        # The named cases: the electron gas and nitrogen.
        self.assertEqual(got["e-"]["charge"], -1)
        self.assertEqual(got["N2"]["charge"], 0)
        self.assertEqual(got["N2"]["validated_range"], [100.0, 6000.0])
        self.assertEqual(files["N2"]["validated_range"], [100, 6000])

    def test_csv_equals_json(self):
        doc = json.loads(run_ok(self, "list", "--data", LIST_SOURCES,
                                "--format", "json"))["species"]
        rows = csv_rows(run_ok(self, "list", "--data", LIST_SOURCES,
                               "--format", "csv"))
        self.assertEqual(rows[0], LIST_CSV_HEADER)
        self.assertEqual(len(rows) - 1, len(doc))
        for row, js in zip(rows[1:], doc):
            r = dict(zip(LIST_CSV_HEADER, row))
            with self.subTest(name=js["name"]):
                self.assertEqual(r["name"], js["name"])
                self.assertEqual(int(r["charge"]), js["charge"])
                if js["validated_range"] is None:
                    self.assertEqual((r["t_low"], r["t_high"]), ("", ""))
                else:
                    self.assertEqual([float(r["t_low"]), float(r["t_high"])],
                                     js["validated_range"])
                self.assertEqual(r["source_summary"], js["source_summary"])
                self.assertEqual(r["source"], js["source"])
        by_name = {r[0]: dict(zip(LIST_CSV_HEADER, r)) for r in rows[1:]}
        self.assertEqual(by_name["e-"]["charge"], "-1")
        self.assertEqual((by_name["N2"]["t_low"], by_name["N2"]["t_high"]),
                         ("100", "6000"))

    def test_summary_rule(self):
        doc = json.loads(run_ok(self, "list", "--data", LIST_SOURCES,
                                "--format", "json"))["species"]
        got = {s["name"]: s for s in doc if s["set"] == "file"}
        self.assertEqual({n: got[n]["source_summary"] for n in self.SUMMARY},
                         self.SUMMARY)
        self.assertEqual(got["cation"]["charge"], 1)
        self.assertEqual(got["anion"]["charge"], -1)
        self.assertEqual(got["src-short"]["validated_range"], [200.0, 1500.5])
        self.assertIsNone(got["src-paren"]["validated_range"])

    def test_text_columns(self):
        text = run_ok(self, "list", "--data", LIST_SOURCES)
        lines = text.splitlines()
        self.assertEqual(lines[0].split()[:5],
                         ["name", "formula", "charge", "structure", "model"])
        self.assertIn("validated K", lines[0])
        self.assertIn("source (first clause)", lines[0])
        self.assertRegex(text, r"(?m)^e-\s+e-\s+-1\s+atom\s+rrho\s.*"
                               r"\s298\.15-6000\s+built-in\s+the electron "
                               r"gas: translation and spin \(degeneracy 2\) "
                               r"only$")
        self.assertRegex(text, r"(?m)^N2\s+N2\s+0\s+linear\s+levels\s.*"
                               r"\s100-6000\s+built-in\s+Huber")
        self.assertRegex(text, r"(?m)^cation\s+Ar\+\s+\+1\s.*\s300-3000\s")
        self.assertRegex(text, r"(?m)^src-paren\s.*\s-\s+file\s+"
                               r"Smith \(1999; table 3\) measured$")
        for name, summary in self.SUMMARY.items():
            if summary:
                self.assertRegex(text, r"(?m)^%s\s.*\s%s$"
                                 % (re.escape(name), re.escape(summary)))
        # A header and one line per species, then the note on the file.
        self.assertEqual(len(lines), 1 + len(species_files()) +
                         len(self.SUMMARY) + 2)  # blank + note on the file

    def test_species_is_list(self):
        for args in ([], ["--format", "csv"], ["--format", "json"],
                     ["--data", str(LIST_SOURCES)]):
            with self.subTest(args=args):
                self.assertEqual(run_ok(self, "species", *args),
                                 run_ok(self, "list", *args))
        self.assertEqual(run_ok(self, "help", "species"),
                         run_ok(self, "help", "list"))
        self.assertEqual(run_ok(self, "species", "--help"),
                         run_ok(self, "list", "--help"))
        self.assertIn("molq species", run_ok(self, "--help"))
        rc, out, err = run("species", "N2")
        self.assertEqual(rc, 2)
        self.assertIn("'molq species' takes no species names (got 'N2')",
                      err)
        rc, out, err = run("species", "--T", "300")
        self.assertEqual(rc, 2)
        self.assertIn("does not apply to 'molq species'", err)
        rc, out, err = run("specis")
        self.assertEqual(rc, 2)
        self.assertIn("nearest: 'species'", err)


if __name__ == "__main__":
    if not CLI:
        sys.exit("MOLQ_CLI is not set")
    unittest.main(verbosity=2)
