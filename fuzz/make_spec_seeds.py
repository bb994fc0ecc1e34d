#!/usr/bin/env python3
"""Write the seed inputs of the spec_api fuzz target (fuzz/corpus/spec_api).

The target reads its input as a little program (see fuzz/spec_api.c and
fuzz/fuzz_util.h); this script encodes readable descriptions into that
byte format so the seeds start from real molecules and from the edge cases
the setters must refuse.  Constants are those of data/species/*.json; the
"odd" seeds are invented.  Run it again after changing the input format:

    python3 fuzz/make_spec_seeds.py
"""
import os
import struct

OUT = os.path.join(os.path.dirname(os.path.abspath(__file__)), "corpus",
                   "spec_api")

# Operation codes (low nibble of the code byte in spec_api.c).
FORMULA, SOURCE, MASS, STRUCTURE, SIGMA, ROT, ROTOR = 0, 1, 2, 3, 4, 5, 6
VIB, LEVEL, RUN, DFH, STOP, LEVELS_OP, POLY_OP = 7, 9, 11, 12, 13, 14, 15
ATOM, LINEAR, NONLINEAR = 0, 1, 2


def d(x):
    """A double as 8 raw bytes (selector 0xE0, big-endian bit pattern)."""
    return bytes([0xE0]) + struct.pack(">d", x)


def i32(n):
    """An int as 4 raw bytes (selector 0xC0)."""
    return bytes([0xC0]) + struct.pack(">i", n)


def s(text):
    b = text.encode()
    assert len(b) <= 250
    return bytes([len(b)]) + b


class Seed:
    def __init__(self, name):
        self.b = bytearray(s(name))

    def op(self, code, *args):
        self.b.append(code)
        for a in args:
            self.b += a
        return self

    def formula(self, f):
        return self.op(FORMULA, s(f))

    def source(self, t):
        return self.op(SOURCE, s(t))

    def mass(self, kg):
        return self.op(MASS, d(kg))

    def structure(self, st):
        return self.op(STRUCTURE | (st << 4))

    def sigma(self, n):
        return self.op(SIGMA, i32(n))

    def rot(self, *b):
        return self.op(ROT | (len(b) << 4), *[d(x) for x in b])

    def rotor(self, r):
        return self.op(ROTOR | (r << 4))

    def vib(self, w, g=1):
        return self.op(VIB | 0x80, d(w), i32(g))

    def level(self, e, g=1):
        if e == 0:
            return self.op(LEVEL | 0x40 | 0x80, i32(g))
        return self.op(LEVEL | 0x80, d(e), i32(g))

    def run(self, vibrations, n, base):
        return self.op(RUN | (0x10 if vibrations else 0),
                       bytes([n >> 8, n & 0xFF]), d(base))

    # Level-sum setters (levels_op / polyatomic_op in spec_api.c).
    def model(self, levels):
        return self.op(LEVELS_OP | (0 << 4), bytes([1 if levels else 0]))

    def diatomic_linear_sigma2(self):
        return self.op(LEVELS_OP | (7 << 4))

    def plausible_state(self, g_minus_1, scale_byte, te_byte=None):
        extra = bytes([te_byte]) if te_byte is not None else b""
        return self.op(LEVELS_OP | (6 << 4), extra, bytes([g_minus_1, scale_byte]))

    def d0_product(self, a, b):
        """D0 = 100 (1 + a)(1 + b) cm^-1."""
        return self.op(LEVELS_OP | (4 << 4), bytes([a, b]))

    def frozen(self, x):
        return self.op(LEVELS_OP | (5 << 4), d(x))

    def plausible_torsion(self, scale_byte):
        return self.op(POLY_OP | (7 << 4), bytes([scale_byte]))

    def anharmonicity(self, i, j, x):
        return self.op(POLY_OP | (3 << 4), bytes([i, j]), d(x))

    def dfh(self, x):
        return self.op(DFH, d(x))

    def atom(self, element, x, y, z):
        """A geometry atom (DFH with the high bit): element H, O, C or N
        chosen by bits 4-5 of the code and a 0 byte after the position."""
        k = "HOCN".index(element)
        return self.op(DFH | 0x80 | (k << 4), d(x), d(y), d(z), bytes([0]))

    def states(self, errlen, *tp):
        self.b.append(STOP)
        if errlen == 0:
            self.b.append(0)
        else:
            self.b += bytes([1, errlen - 1])
        for T, p in tp:
            self.b += d(T) + d(p)
        return bytes(self.b)


def seeds():
    nan, inf = float("nan"), float("inf")
    yield "n2", (Seed("N2").formula("N2").mass(0.0280134).structure(LINEAR)
                 .sigma(2).rot(1.989581).vib(2329.915).dfh(0.0)
                 .states(200, (298.15, 1e5), (1000.0, 1e5), (20.0, 1.0)))
    yield "o2_levels", (Seed("O2").mass(0.0319988).structure(LINEAR).sigma(2)
                        .rot(1.43768).vib(1556.384).level(0, 3)
                        .level(7882.4, 2).level(13120.9, 1)
                        .states(120, (298.15, 1e5), (5000.0, 1e3)))
    yield "h2o", (Seed("H2O").mass(0.0180153).structure(NONLINEAR).sigma(2)
                  .rot(27.877, 14.512, 9.285).vib(3657).vib(1595).vib(3756)
                  .dfh(-241826.0)
                  .states(250, (298.15, 1e5), (40.0, 1e5), (30.0, 1e5)))
    yield "co2", (Seed("CO2").mass(0.0440095).structure(LINEAR).sigma(2)
                  .rot(0.39022).vib(1333).vib(667, 2).vib(2349)
                  .dfh(-393522.0).states(64, (300.0, 1e5), (3000.0, 1e7)))
    yield "o_atom", (Seed("O").mass(0.0159994).level(0, 5).level(158.265, 3)
                     .level(226.977, 1).level(15867.862, 5)
                     .level(33792.583, 1).dfh(249180.0)
                     .states(80, (298.15, 1e5), (1e-3, 1e5)))
    yield "h2_low_T", (Seed("H2").mass(0.00201588).structure(LINEAR).sigma(2)
                       .rot(59.322).vib(4158.55)
                       .states(80, (20.0, 1e5), (1.0, 1e5), (0.01, 1e5)))
    yield "classical", (Seed("demo-top").mass(0.030).structure(NONLINEAR)
                        .sigma(3).rot(12.0, 8.0, 5.0).rotor(1).vib(700.0, 2)
                        .states(80, (5.0, 1e5), (1e4, 1e5)))
    yield "formula_mass", (Seed("methanol-demo").formula("CH3OH")
                           .structure(NONLINEAR).rot(4.25, 0.82, 0.79)
                           .vib(3681).vib(1033)
                           .states(100, (500.0, 2e5)))
    yield "formula_nested", (Seed("nested").formula("Ca(OH)2")
                             .states(100, (500.0, 1e5)))
    yield "many_levels", (Seed("ladder").mass(0.05).run(False, 500, 37.5)
                          .states(100, (1000.0, 1e5), (1e5, 1e5)))
    yield "many_vibs", (Seed("big-demo").mass(0.5).structure(NONLINEAR)
                        .rot(0.5, 0.2, 0.1).sigma(1).run(True, 120, 150.0)
                        .states(100, (700.0, 1e5)))
    yield "vib_limit", (Seed("over").mass(0.5).structure(LINEAR).rot(0.1)
                        .run(True, 1001, 100.0).states(100, (300.0, 1e5)))
    yield "levels_diatomic", (Seed("N2-levels").mass(0.0280134)
                              .diatomic_linear_sigma2().plausible_state(0, 28)
                              .plausible_state(2, 20, 40).d0_product(9, 9)
                              .states(200, (298.15, 1e5), (5.0, 1e5),
                                      (3000.0, 1e5)))
    yield "levels_frozen", (Seed("H2-frozen").mass(0.00201588)
                            .diatomic_linear_sigma2().plausible_state(0, 60)
                            .d0_product(19, 19).frozen(0.75)
                            .states(200, (20.0, 1e5), (300.0, 1e5)))
    yield "torsion", (Seed("demo-top-rotor").mass(0.030).structure(NONLINEAR)
                      .sigma(6).rot(2.68, 0.66, 0.66).vib(2900, 3).vib(1400, 2)
                      .vib(990).model(True).plausible_torsion(16)
                      .d0_product(99, 99)
                      .states(200, (300.0, 1e5), (1500.0, 1e5)))
    yield "anharmonic", (Seed("demo-bent").mass(0.018).structure(NONLINEAR)
                         .sigma(2).rot(27.9, 14.5, 9.3).vib(3657).vib(1595)
                         .vib(3756).model(True).anharmonicity(0, 0, -43.0)
                         .anharmonicity(1, 1, -17.0).d0_product(199, 199)
                         .states(200, (300.0, 1e5), (2000.0, 1e5)))
    # H2O with its equilibrium geometry (re 0.958 A, 104.4776 deg, Hoy &
    # Bunker 1979 via CCCBDB), then with the bonds 10 % long (warned)
    for tag, f in (("", 1.0), ("_long", 1.1)):
        yield "h2o_geometry" + tag, (
            Seed("H2O").formula("H2O").mass(0.0180153).structure(NONLINEAR)
            .sigma(2).rot(27.877, 14.512, 9.285).vib(3657).vib(1595)
            .vib(3756).atom("O", 0.0, 0.0, 0.0)
            .atom("H", 0.75695 * f, 0.58588 * f, 0.0)
            .atom("H", -0.75695 * f, 0.58588 * f, 0.0)
            .states(250, (298.15, 1e5)))
    # Descriptions that must be refused or evaluations that must fail.
    yield "sigma_zero", (Seed("bad-sigma").mass(0.03).structure(LINEAR)
                         .sigma(0).rot(1.0).states(100, (300.0, 1e5)))
    yield "rot_order", (Seed("bad-order").mass(0.03).structure(NONLINEAR)
                        .rot(1.0, 2.0, 3.0).states(100, (300.0, 1e5)))
    yield "nan_mass", (Seed("bad-mass").mass(nan).states(1, (300.0, 1e5)))
    yield "no_mass", (Seed("no-mass").states(0, (300.0, 1e5)))
    yield "no_ground", (Seed("no-ground").mass(0.02).level(10.0, 1)
                        .states(100, (300.0, 1e5)))
    yield "bad_states", (Seed("Ar").mass(0.039948)
                         .states(100, (nan, 1e5), (-1.0, 1e5), (0.0, 1e5),
                                 (inf, 1e5), (300.0, 0.0), (300.0, -inf)))
    yield "extreme_T", (Seed("Ar").mass(0.039948)
                        .states(100, (5e-324, 1e5), (1e-300, 1e-300),
                                (1e300, 1e5), (1.7e308, 1e5)))
    yield "empty_name", (Seed("").mass(0.03).states(100, (300.0, 1e5)))
    yield "long_name", (Seed("x" * 250).mass(0.03).states(100, (300.0, 1e5)))


def main():
    os.makedirs(OUT, exist_ok=True)
    for name, data in seeds():
        with open(os.path.join(OUT, name), "wb") as f:
            f.write(data)


if __name__ == "__main__":
    main()
