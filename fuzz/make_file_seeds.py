#!/usr/bin/env python3
"""Write the generated seeds of the species_file fuzz target
(fuzz/corpus/species_file/gen_*.json): the shapes real data have, which
hand-written seeds missed (a stack overflow hid behind 18+ vibrations with
torsions and an anharmonic term): nonlinear molecules with many vibrations,
torsions replacing some of them, full and sparse anharmonicity matrices,
dissociation energies, several electronic levels and diatomic states,
2Pi states, spin weights, charges, and values at and just past each
documented limit (README "Species files").  All molecules are invented;
the numbers are only shaped like real ones.  Run after a format change:

    python3 fuzz/make_file_seeds.py
"""
import glob
import json
import os

OUT = os.path.join(os.path.dirname(os.path.abspath(__file__)), "corpus",
                   "species_file")


def poly(name, nvib, ntors, anharm="sparse", d0=True, levels=1, extra=None):
    vib = [{"wavenumber": 3000.0 + 97.0 * i,
            "degeneracy": 2 if i % 5 == 4 else 1} for i in range(nvib)]
    for i in range(ntors):
        vib[i] = {"wavenumber": 150.0 + 11.0 * i}
    e = {"name": name, "formula": "C%dH%d" % (nvib // 3, nvib // 2 + 2),
         "structure": "nonlinear", "symmetry_number": 2,
         "rotational_constants": [3.1, 0.9, 0.7], "vibrations": vib,
         "torsions": [{"rotational_constant": 5.0 + i, "symmetry_number": 3,
                       "barrier": [{"n": 3, "V": 400.0 + 10 * i}],
                       "replaces_vibration": i} for i in range(ntors)]}
    kept = [i for i in range(nvib) if i >= ntors]
    if anharm == "sparse" and kept:
        e["anharmonicity"] = {"x": [[kept[0], kept[0], -20.0]]}
    elif anharm == "full" and kept:
        k = kept[:16]
        e["anharmonicity"] = {
            "x": [[a, b, -1.0 - 0.1 * (a + b)] for a in k for b in k if a <= b],
            "g": [[a, 1.5] for a in k if vib[a].get("degeneracy", 1) == 2],
            "alpha": [[a, 0.01, 0.002, 0.001] for a in k[:4]]}
    if d0:
        # few enough levels below D0 for the level-sum budget
        e["dissociation_energy"] = 30000.0 if nvib - ntors < 10 else 9000.0
    if levels > 1:
        e["electronic_levels"] = [{"energy": 0.0, "degeneracy": 2}] + [
            {"energy": 1000.0 * i, "degeneracy": 1 + i % 4}
            for i in range(1, levels)]
    if extra:
        e.update(extra)
    if not e["torsions"]:
        del e["torsions"]
    return e


def diatomic(name, nstates, pi=False, weights=None, formula="NO"):
    states = []
    for k in range(nstates):
        s = {"label": "S%d" % k, "Te": 0.0 if k == 0 else 1400.0 * k,
             "degeneracy": 4 if (pi and k == 0) else 1 + k % 3,
             "we": 1900.0 - 50 * k, "wexe": 14.0, "Be": 1.7 - 0.02 * k,
             "alpha_e": 0.017, "De": 5.4e-6}
        if pi and k == 0:
            s["spin_orbit"] = 123.0
        if weights:
            s["rotational_weights"] = weights
        states.append(s)
    return {"name": name, "formula": formula, "structure": "linear",
            "dissociation_energy": 52000.0, "diatomic_states": states}


def grid(formula_counts):
    """Atoms on a 1.5 Angstrom grid, in order of the formula's elements."""
    atoms = []
    for el, n in formula_counts:
        for _ in range(n):
            k = len(atoms)
            atoms.append({"element": el,
                          "xyz": [1.5 * (k % 4), 1.5 * (k // 4 % 4),
                                  1.5 * (k // 16)]})
    return atoms


WATER_GEOMETRY = [{"element": "O", "xyz": [0.0, 0.0, 0.0]},
                  {"element": "H", "xyz": [0.75695, 0.58588, 0.0]},
                  {"element": "H", "xyz": [-0.75695, 0.58588, 0.0]}]

SEEDS = {
    # many modes, torsions replacing some (the overflow's shape and beyond)
    "gen_poly_12_vib_2_tors": [poly("p12", 12, 2)],
    "gen_poly_18_vib_2_tors": [poly("p18", 18, 2)],
    "gen_poly_24_vib_8_tors": [poly("p24", 24, 8)],
    "gen_poly_30_vib_8_tors": [poly("p30", 30, 8)],
    "gen_poly_16_full_anharm": [poly("pfull", 16, 0, anharm="full")],
    "gen_poly_17_full_anharm": [poly("pfull17", 17, 0, anharm="full")],
    "gen_poly_9_torsions": [poly("p9t", 12, 9)],
    "gen_poly_levels_states": [poly("pel", 9, 1, levels=6)],
    "gen_poly_spin_c3v": [poly("pc3v", 6, 0, extra={
        "symmetry_number": 3, "rotational_constants": [9.4, 9.4, 6.2],
        "rotational_spin": {"group": "C3v", "nuclear_spin": 0.5}})],
    "gen_poly_weights": [poly("pw", 3, 0, extra={
        "rotational_weights": {"ee": 0.25, "eo": 0.75, "oe": 0.75,
                               "oo": 0.25}})],
    # diatomics with several states, 2Pi, spin weights, ions
    "gen_diatomic_6_states": [diatomic("d6", 6)],
    "gen_diatomic_32_states": [diatomic("d32", 32)],
    "gen_diatomic_33_states": [diatomic("d33", 33)],
    "gen_diatomic_pi": [diatomic("dpi", 3, pi=True)],
    "gen_diatomic_homonuclear": [diatomic("dhomo", 2, weights=[0.25, 0.75],
                                          formula="N2")],
    "gen_ion_and_electron": [diatomic("NO+", 2, formula="NO+"),
                             {"name": "e-", "formula": "e-",
                              "structure": "atom",
                              "electronic_levels": [{"energy": 0,
                                                     "degeneracy": 2}]}],
    # integer bounds and ranges: at and just past each limit
    "gen_bound_degeneracy_max": [{"name": "a", "formula": "Ar",
                                  "structure": "atom", "electronic_levels": [
                                      {"energy": 0, "degeneracy": 1000000}]}],
    "gen_bound_degeneracy_past": [{"name": "a", "formula": "Ar",
                                   "structure": "atom", "electronic_levels": [
                                       {"energy": 0, "degeneracy": 1000001}]}],
    "gen_bound_sigma_past": [{"name": "l", "formula": "CO2",
                              "structure": "linear", "symmetry_number":
                              100001, "rotational_constants": [0.39]}],
    "gen_bound_integral_float": [{"name": "l", "formula": "CO2",
                                  "structure": "linear", "symmetry_number":
                                  2.0, "rotational_constants": [0.39]}],
    # geometries: a good one, one 10 % too large (warned), a linear one,
    # and the 64-atom limit and one past it
    "gen_geometry_water": [dict(poly("gw", 3, 0), formula="H2O",
                                rotational_constants=[27.877, 14.512, 9.285],
                                geometry=WATER_GEOMETRY),
                           dict(poly("gw10", 3, 0), formula="H2O",
                                rotational_constants=[27.877, 14.512, 9.285],
                                geometry=[dict(a, xyz=[1.1 * x for x in
                                                       a["xyz"]])
                                          for a in WATER_GEOMETRY])],
    "gen_geometry_linear": [{"name": "l", "formula": "CO2",
                             "structure": "linear", "symmetry_number": 2,
                             "rotational_constants": [0.39],
                             "geometry": [
                                 {"element": "O", "xyz": [0, 0, -1.16]},
                                 {"element": "C", "xyz": [0, 0, 0]},
                                 {"element": "O", "xyz": [0, 0, 1.16]}]}],
    "gen_geometry_64_atoms": [dict(poly("g64", 6, 0), formula="C20H44",
                                   geometry=grid([("C", 20), ("H", 44)]))],
    "gen_geometry_65_atoms": [dict(poly("g65", 6, 0), formula="C20H45",
                                   geometry=grid([("C", 20), ("H", 45)]))],
    "gen_validated_range": [{"name": "a", "formula": "Ar",
                             "structure": "atom",
                             "validated_range": [100, 6000]}],
}


DATA = os.path.join(os.path.dirname(os.path.dirname(os.path.abspath(
    __file__))), "data", "species")


def seed_name(name):
    """A file-name-safe form of a species name (NO+ -> NO_plus)."""
    return name.replace("+", "_plus").replace("-", "_minus")


def write_data_seeds():
    """One seed per built-in species, data_<name>.json, copied from
    data/species/*.json as it is now, so the corpus carries the real shapes
    (many modes, torsions, several electronic states, the levels model) and
    current values.  One species a file keeps each seed below run.sh's
    -max_len 8192 for species files.  Stale data_*.json are removed first."""
    for old in glob.glob(os.path.join(OUT, "data_*.json")):
        os.remove(old)
    n = 0
    for path in sorted(glob.glob(os.path.join(DATA, "*.json"))):
        with open(path) as f:
            doc = json.load(f)
        for sp in doc["species"]:
            text = json.dumps({"schema_version": doc.get("schema_version", 1),
                               "species": [sp]}, separators=(",", ":"))
            with open(os.path.join(OUT, "data_%s.json" % seed_name(
                    sp["name"])), "w") as f:
                f.write(text + "\n")
            n += 1
    return n


def main():
    os.makedirs(OUT, exist_ok=True)
    for name, species in SEEDS.items():
        with open(os.path.join(OUT, name + ".json"), "w") as f:
            json.dump({"schema_version": 1, "species": species}, f,
                      indent=1)
            f.write("\n")
    # one without schema_version and with a byte-order mark (warned, read)
    with open(os.path.join(OUT, "gen_bom_no_version.json"), "wb") as f:
        f.write(b"\xef\xbb\xbf" + json.dumps(
            {"species": [poly("pbom", 6, 1)]}).encode())
    n = len(SEEDS) + 1 + write_data_seeds()
    print("wrote %d seeds to %s" % (n, OUT))


if __name__ == "__main__":
    main()
