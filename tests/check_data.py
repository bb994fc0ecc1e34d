"""Physics plausibility of the built-in diatomic constants (data/species/*.json).

For every diatomic state that gives a centrifugal distortion constant De, the
Kratzer relation De = 4 Be^3 / we^2 (exact for a Morse-like potential, accurate to
a few per cent for real molecules: common practice, e.g. Herzberg, Spectra of
Diatomic Molecules, 1950) must hold within 5 %.  The check caught NO's De given
as 0.54e-6 instead of 0.54e-5 (ratio 0.099).

Every built-in molecule of three or more atoms must carry a "geometry", so
that the library checks its rotational constants against the principal moments
of inertia at load (lib/data/plausible.c; tests/test_plausible.c proves the
built-in set loads without a warning).

Usage: check_data.py DIR (the folder holding the species files)."""
import glob
import json
import os
import sys


def main(folder):
    bad = []
    n = 0
    for path in sorted(glob.glob(os.path.join(folder, "*.json"))):
        with open(path, encoding="utf-8") as f:
            doc = json.load(f)
        for sp in doc.get("species", []):
            if (sp.get("structure") != "atom" and "geometry" not in sp
                    and "diatomic_states" not in sp):
                bad.append("%s: no \"geometry\" (a polyatomic's "
                           "rotational constants go unchecked)" % sp["name"])
            for st in sp.get("diatomic_states", []):
                if "De" not in st or "we" not in st or "Be" not in st:
                    continue
                n += 1
                ratio = st["De"] / (4 * st["Be"] ** 3 / st["we"] ** 2)
                if abs(ratio - 1) > 0.05:
                    bad.append("%s %s: De / (4 Be^3/we^2) = %.3f"
                               % (sp["name"], st.get("label", "?"), ratio))
    for line in bad:
        print(line)
    print("%d states checked, %d off the Kratzer relation by more than 5 %%"
          % (n, len(bad)))
    return 1 if bad or n == 0 else 0


if __name__ == "__main__":
    sys.exit(main(sys.argv[1]))
