#!/usr/bin/env python3
"""tools/validation.py -- compare molq's built-in species with published tables.

    tools/validation.py check     compare, then fail (exit 1) when any species/model is
                                  worse than its recorded figure, a compared species has no
                                  record, a recorded species/model is gone, a built-in species
                                  has neither a table nor a 298.15 K line, docs/validation.md
                                  or the README summary no longer match the record, or a link
                                  in docs/validation.md misses its species' anchor
    tools/validation.py record    compare and write the figures to
                                  tests/data/validation_record.json
    tools/validation.py report    write docs/validation.md and the README summary from the
                                  record, and docs/validation/<species>.png from the live
                                  comparison (plots need matplotlib and numpy: run with
                                  /usr/bin/python3 on Debian, python3-matplotlib; --no-plots
                                  writes the Markdown only)
    tools/validation.py show      print the figures without comparing to the record

What is compared (every built-in species, molq.Database.builtin()):

- a species with a NIST-JANAF extract tests/data/janaf/<name>.tsv: cp, s, h - h(298.15)
  and gef = -(g - h(298.15))/T at every table row inside the species' validated_range
  (none given: the table's own range up to 6000 K), for every model the species has (its
  own, then the others molq.Species.with_model accepts: 'rrho', 'levels'); the figure is
  the largest |molq - table| per quantity and model;
- a species without an extract but with a line in tests/data/reference_298.tsv: s and cp
  (when given) at 298.15 K;
- the reaction checks (REACTIONS below): reaction enthalpy and log10 K at 298.15 K and
  2000 K from molq's h and g against the same quantities derived from the tables' dfH and
  gef columns.

The checking part uses the standard library and the Python binding only.  The binding
is found through PYTHONPATH / MOLQ_LIBRARY (as the meson python tests set them) or, when
they are unset, in bindings/python and the checkout's build*/lib.
"""

import argparse
import json
import math
import os
import sys

ROOT = os.path.normpath(os.path.join(os.path.dirname(os.path.abspath(__file__)),
                                     os.pardir))
DATA = os.path.join(ROOT, "tests", "data")
RECORD = os.path.join(DATA, "validation_record.json")
T_REF = 298.15
T_CAP = 6000.0          # upper end of the compared range when a species states none
# SI 2019: R = N_A k exactly.
R = 6.02214076e23 * 1.380649e-23
QUANTITIES = ("cp", "s", "dh", "gef")
UNITS = {"cp": "J/(mol K)", "s": "J/(mol K)", "dh": "J/mol", "gef": "J/(mol K)"}
# Regression margin of `check`: a figure may exceed its record by
# max(REL_MARGIN * record, ABS_MARGIN) (floating-point and platform differences only).
REL_MARGIN = 1e-6
ABS_MARGIN = 1e-5
RECORD_FORMAT = 1

# Reaction checks.  Reference: NIST-JANAF Thermochemical Tables, 4th ed. (Chase 1998), the
# extracts in tests/data/janaf/ (or tests/data/formation_rows.tsv for a species without an
# extract; its table id is named in the output): dH_r(T) = sum nu dfH(T) (the tables' dfH
# column at T), dG_r(T) = sum nu [dfH(298.15) - T gef(T)] (the tables' dfH at 298.15 K and
# gef column at T), log10 K = -dG_r / (R T ln 10).  The extracts carry no log Kf or dfG
# column; where formation_rows.tsv has a published log Kf the derivation is checked
# against it too.  molq: dH_r = sum nu h(T), dG_r = sum nu g(T) (h and g on the dfH scale,
# molq.h), each species with its own model.
#
# Acceptance bounds (|molq - tables|), besides the recorded figures that guard against
# any regression: at 298.15 K the reaction enthalpy rests only on the species'
# formation_enthalpy_298, copied from the same tables but in some sources quoted to
# 0.01 kJ/mol (N: 472.68 against the table's 472.683): 10 J/mol.  log10 K at 298.15 K:
# S298 of each species within 0.1 J/(mol K) gives up to 0.01 in log10 K.  At 2000 K the
# sensible enthalpies and entropies add the models' deviations (tests/data/janaf
# comparisons: up to about 0.3 kJ/mol in h - h(298.15) and 0.3 J/(mol K) in s per
# species at 2000 K): 500 J/mol and 0.02 in log10 K (0.77 kJ/mol in dG_r at 2000 K).
REACTIONS = (
    ("H2 + 1/2 O2 -> H2O", (("H2", -1.0), ("O2", -0.5), ("H2O", 1.0))),
    ("1/2 N2 + 1/2 O2 -> NO", (("N2", -0.5), ("O2", -0.5), ("NO", 1.0))),
    ("CO + 1/2 O2 -> CO2", (("CO", -1.0), ("O2", -0.5), ("CO2", 1.0))),
    ("N2 -> 2 N", (("N2", -1.0), ("N", 2.0))),
)
REACTION_TEMPERATURES = (298.15, 2000.0)
REACTION_TOL = {298.15: {"dh": 10.0, "logk": 0.01}, 2000.0: {"dh": 500.0, "logk": 0.02}}
# Agreement of the two derivations of the reference dH_r (dfH(T) column against
# dfH(298.15) + the dH columns) and of the derived log10 K with a published log Kf:
# rounding of the tables (three decimals in kJ/mol and J/(mol K)).
REFERENCE_SELF_TOL = {"dh": 10.0, "logk": 0.002}


def _import_molq():
    try:
        import molq  # noqa: F401
    except ImportError:
        sys.path.insert(0, os.path.join(ROOT, "bindings", "python"))
        import molq  # noqa: F401
    return sys.modules["molq"]


# ---------------------------------------------------------------------------
# Reading the reference data
# ---------------------------------------------------------------------------

class Table:
    """A NIST-JANAF extract: rows of (T, cp, s, gef, dh J/mol, dfh J/mol or None)."""

    def __init__(self, path):
        self.path = path
        self.header = []
        self.rows = []
        with open(path, encoding="utf-8") as f:
            for lineno, line in enumerate(f, 1):
                text = line.rstrip("\n")
                if text.startswith("#"):
                    self.header.append(text[1:].strip())
                    continue
                fields = text.split()
                if not fields or fields[0] == "T":
                    continue
                if len(fields) < 5:
                    raise ValueError("%s:%d: expected at least 5 columns (T Cp S gef "
                                     "dH), got %d" % (path, lineno, len(fields)))
                try:
                    vals = [float(x) for x in fields[:5]]
                    dfh = float(fields[5]) * 1e3 if len(fields) > 5 else None
                except ValueError:
                    raise ValueError("%s:%d: not a number in %r" % (path, lineno, text)) \
                        from None
                t, cp, s, gef, dh = vals
                self.rows.append((t, cp, s, gef, dh * 1e3, dfh))
        if not self.rows:
            raise ValueError("%s: no data rows" % path)
        self.rows.sort()

    @property
    def table_id(self):
        for h in self.header:
            if h.lower().startswith("janaf table id:"):
                return h.split(":", 1)[1].strip()
        return "?"

    @property
    def title(self):
        return self.header[0] if self.header else os.path.basename(self.path)

    def row(self, t):
        for r in self.rows:
            if abs(r[0] - t) < 1e-6:
                return r
        return None


def read_tables(data=DATA):
    """{stem: Table} of tests/data/janaf/*.tsv."""
    d = os.path.join(data, "janaf")
    out = {}
    if os.path.isdir(d):
        for fn in sorted(os.listdir(d)):
            if fn.endswith(".tsv"):
                out[fn[:-4]] = Table(os.path.join(d, fn))
    return out


REFERENCE_298_HEADER = """\
# Reference values at 298.15 K and 1 bar for species without a NIST-JANAF extract in
# tests/data/janaf/. tools/validation.py compares every built-in species listed here.
# Format: '#' comment lines, then one tab-separated line per species:
#   name	S298 J/(mol K)	cp298 J/(mol K) or '-' when unknown	source (e.g. "CODATA 1989 (from memory)")
"""


def read_reference_298(data=DATA):
    """{name: (S298, cp298 or None, source)} of tests/data/reference_298.tsv."""
    path = os.path.join(data, "reference_298.tsv")
    out = {}
    if not os.path.exists(path):
        return out
    with open(path, encoding="utf-8") as f:
        for lineno, line in enumerate(f, 1):
            text = line.rstrip("\n")
            if not text.strip() or text.lstrip().startswith("#"):
                continue
            fields = text.split("\t")
            if len(fields) < 4:
                raise ValueError("%s:%d: expected 4 tab-separated fields (name, S298, "
                                 "cp298 or '-', source), got %d"
                                 % (path, lineno, len(fields)))
            name = fields[0].strip()
            try:
                s298 = float(fields[1])
                cp = None if fields[2].strip() == "-" else float(fields[2])
            except ValueError:
                raise ValueError("%s:%d: S298 and cp298 must be numbers (cp298 may be "
                                 "'-')" % (path, lineno)) from None
            if name in out:
                raise ValueError("%s:%d: species %r listed twice" % (path, lineno, name))
            out[name] = (s298, cp, "\t".join(fields[3:]).strip())
    return out


def read_formation_rows(data=DATA):
    """{(name, T): dict(row=(T, cp, s, gef, dh, dfh), logkf, table)}."""
    path = os.path.join(data, "formation_rows.tsv")
    out = {}
    if not os.path.exists(path):
        return out
    with open(path, encoding="utf-8") as f:
        for line in f:
            fields = line.rstrip("\n").split("\t")
            if line.startswith("#") or fields[0] in ("species", ""):
                continue
            name = fields[0]
            t, cp, s, gef, dh, dfh = (float(x) for x in fields[1:7])
            logkf = None if fields[7] == "-" else float(fields[7])
            out[(name, t)] = {"row": (t, cp, s, gef, dh * 1e3, dfh * 1e3),
                              "logkf": logkf, "table": fields[8]}
    return out


# ---------------------------------------------------------------------------
# Comparison
# ---------------------------------------------------------------------------

def species_models(sp):
    """[(model name, Species)]: the species' own model first, then each other model
    molq knows that its data support."""
    molq = sys.modules["molq"]
    out = [(sp.model, sp)]
    for m in molq.model_names():
        if m == sp.model:
            continue
        try:
            other = sp.with_model(m)
        except molq.MolqError:
            continue        # the data do not support this model (e.g. 'levels' of an atom)
        probe = [max(sp.t_min, 300.0), 1000.0, 3000.0]
        if other.eval("cp", probe) == sp.eval("cp", probe) and \
                other.eval("s", probe) == sp.eval("s", probe):
            continue        # the same modes (no level data for this species): not a model of its own
        out.append((m, other))
    return out


def compared_range(sp, table):
    """(T_low, T_high, how): the species' validated_range, else the table's own range up
    to 6000 K."""
    vr = sp.validated_range
    if vr is not None:
        return vr[0], vr[1], "validated_range"
    return table.rows[0][0], min(table.rows[-1][0], T_CAP), "table range"


def compare_table(sp, table):
    """Per model: signed deviations at every compared row and the largest |deviation|."""
    lo, hi, how = compared_range(sp, table)
    rows = [r for r in table.rows if lo - 1e-9 <= r[0] <= hi + 1e-9]
    notes = []
    tmin = sp.t_min
    below = [r for r in rows if r[0] < tmin]
    if below:
        notes.append("%d table rows below molq's lower limit t_min = %.4g K skipped"
                     % (len(below), tmin))
        rows = [r for r in rows if r[0] >= tmin]
    result = {"kind": "table", "table": table.table_id, "title": table.title,
              "range": [lo, hi], "range_from": how, "rows": len(rows),
              "T": [r[0] for r in rows], "notes": notes, "models": {}}
    if not rows:
        return result
    temps = [r[0] for r in rows]
    for model, msp in species_models(sp):
        got = {"cp": msp.eval("cp", temps), "s": msp.eval("s", temps),
               "dh": msp.eval("h_minus_h298", temps), "gef": msp.eval("gef", temps)}
        col = {"cp": 1, "s": 2, "gef": 3, "dh": 4}
        dev = {q: [got[q][i] - rows[i][col[q]] for i in range(len(rows))]
               for q in QUANTITIES}
        figures = {}
        where = {}
        for q in QUANTITIES:
            i = max(range(len(rows)), key=lambda k: abs(dev[q][k]))
            figures[q] = abs(dev[q][i])
            where[q] = rows[i][0]
        result["models"][model] = {"max": figures, "at": where, "dev": dev,
                                   "molq": got}
    return result


def compare_298(sp, ref):
    s298, cp298, source = ref
    result = {"kind": "reference_298", "table": source, "title": source,
              "range": list(sp.validated_range) if sp.validated_range else None,
              "range_from": "validated_range" if sp.validated_range else "none",
              "rows": 1, "T": [T_REF], "notes": [], "models": {},
              "ref_values": (s298, cp298)}
    for model, msp in species_models(sp):
        figures = {"cp": None if cp298 is None else abs(msp.cp(T_REF) - cp298),
                   "s": abs(msp.s(T_REF) - s298), "dh": None, "gef": None}
        result["models"][model] = {"max": figures, "at": {q: T_REF for q in QUANTITIES}}
    return result


def compare_all(data=DATA):
    """{species: result} for every built-in species with a table or a 298.15 K line,
    plus the names of tables and reference lines that match no built-in species."""
    molq = _import_molq()
    db = molq.Database.builtin()
    tables = read_tables(data)
    ref298 = read_reference_298(data)
    results = {}
    for sp in db:
        if sp.name in tables:
            results[sp.name] = compare_table(sp, tables[sp.name])
        elif sp.name in ref298:
            results[sp.name] = compare_298(sp, ref298[sp.name])
        if sp.name in results:
            results[sp.name]["model"] = sp.model
            results[sp.name]["source"] = sp.source
    names = set(db.names())
    orphans = sorted(set(tables) - names) + sorted(set(ref298) - names)
    uncovered = [n for n in db.names() if n not in results]
    return results, orphans, uncovered


def reaction_reference(name_nu, t, tables, rows):
    """Reference dH_r (J/mol), log10 K, the derivation's self-check and the tables used;
    None (and the missing species) when a species has neither an extract nor a row."""
    dh_col = dh_sum = dg = 0.0
    used, missing, errors = [], [], []
    logk_pub = 0.0
    have_pub = True
    for name, nu in name_nu:
        extra = rows.get((name, t))
        extra298 = rows.get((name, T_REF))
        if name in tables:
            tab = tables[name]
            r, r298 = tab.row(t), tab.row(T_REF)
            if r is None or r298 is None or r[5] is None or r298[5] is None:
                missing.append(name)
                continue
            for ex, rr in ((extra, r), (extra298, r298)):
                if ex is not None and any(abs(a - b) > 1e-9 for a, b in zip(ex["row"], rr)):
                    errors.append("%s at %g K: tests/data/formation_rows.tsv differs "
                                  "from tests/data/janaf/%s.tsv" % (name, rr[0], name))
            used.append("%s (%s)" % (name, tab.table_id))
        elif extra is not None and extra298 is not None:
            r, r298 = extra["row"], extra298["row"]
            used.append("%s (%s, formation_rows.tsv)" % (name, extra["table"]))
        else:
            missing.append(name)
            continue
        dh_col += nu * r[5]
        dh_sum += nu * (r298[5] + r[4])
        dg += nu * (r298[5] - t * r[3])
        if extra is not None and extra["logkf"] is not None:
            logk_pub += nu * extra["logkf"]
        elif r[5] == 0.0 and r298[5] == 0.0:
            pass            # an element in its reference state: log Kf = 0
        else:
            have_pub = False
    if missing:
        return None, missing
    logk = -dg / (R * t * math.log(10.0))
    return {"dh": dh_col, "dh_from_increments": dh_sum, "logk": logk,
            "logk_published": logk_pub if have_pub else None, "tables": used,
            "errors": errors}, []


def compare_reactions(data=DATA):
    molq = _import_molq()
    db = molq.Database.builtin()
    tables = read_tables(data)
    rows = read_formation_rows(data)
    out = []
    for label, name_nu in REACTIONS:
        for t in REACTION_TEMPERATURES:
            key = "%s @ %g K" % (label, t)
            item = {"key": key, "reaction": label, "T": t}
            absent = [n for n, _ in name_nu if n not in db]
            ref, missing = reaction_reference(name_nu, t, tables, rows)
            if absent or ref is None:
                item["skipped"] = "no built-in species %s" % ", ".join(absent) if absent \
                    else "no table row for %s" % ", ".join(missing)
                out.append(item)
                continue
            h = sum(nu * db[n].h(t) for n, nu in name_nu)
            g = sum(nu * db[n].g(t) for n, nu in name_nu)
            logk = -g / (R * t * math.log(10.0))
            item.update({"ref": ref, "dh": h, "logk": logk,
                         "dev_dh": abs(h - ref["dh"]), "dev_logk": abs(logk - ref["logk"]),
                         "tol": REACTION_TOL[t]})
            out.append(item)
    return out


# ---------------------------------------------------------------------------
# Record and check
# ---------------------------------------------------------------------------

def _round(x):
    return None if x is None else float("%.10g" % x)


def make_record(results, reactions):
    species = {}
    for name, r in sorted(results.items()):
        species[name] = {
            "kind": r["kind"], "reference": r["table"], "model": r["model"],
            "range": r["range"],
            "rows": r["rows"],
            "models": {m: {q: _round(v["max"][q]) for q in QUANTITIES}
                       for m, v in r["models"].items()}}
    rx = {}
    for item in reactions:
        if "skipped" not in item:
            rx[item["key"]] = {"dh": _round(item["dev_dh"]), "logk": _round(item["dev_logk"])}
    return {"format": RECORD_FORMAT,
            "about": "Largest |molq - reference| per built-in species and model (cp, s, gef "
                     "in J/(mol K), dh = h - h(298.15) in J/mol) and per reaction check (dh "
                     "in J/mol, log10 K), written by `tools/validation.py record`; "
                     "`tools/validation.py check` (meson test 'validation') fails when a "
                     "figure grows by more than max(%g relative, %g absolute)."
                     % (REL_MARGIN, ABS_MARGIN),
            "species": species, "reactions": rx}


def _worse(now, rec):
    if now is None or rec is None:
        return (now is None) != (rec is None)
    return now > rec + max(REL_MARGIN * abs(rec), ABS_MARGIN)


def _better(now, rec):
    if now is None or rec is None:
        return False
    return now < rec - max(REL_MARGIN * abs(rec), ABS_MARGIN)


def _fmt(x, q="cp"):
    if x is None:
        return "-"
    return "%.3g" % x if q != "dh" else "%.1f" % x


def check(results, orphans, uncovered, reactions, record, out=sys.stdout):
    """Compare with the record; return the list of failures (printed as they come)."""
    failures = []
    improved = []
    rec_species = record.get("species", {})
    print("%-8s %-8s %-14s %5s %10s %10s %10s %10s  %s"
          % ("species", "model", "range K", "rows", "max|dcp|", "max|ds|", "max|ddh|",
             "max|dgef|", "status"), file=out)
    for name in sorted(set(results) | set(rec_species)):
        r = results.get(name)
        rec = rec_species.get(name)
        if r is None:
            failures.append("%s: recorded but no longer compared (species gone from the "
                            "built-in set, or its table / reference line removed)" % name)
            print("%-8s %-8s %s" % (name, "-", "MISSING (recorded, not compared)"),
                  file=out)
            continue
        if r["rows"] == 0:
            failures.append("%s: no table row inside the compared range %s"
                            % (name, r["range"]))
        rng = "%g-%g" % tuple(r["range"]) if r["range"] else "298.15"
        models = list(r["models"])
        if rec is not None:
            models += [m for m in rec["models"] if m not in r["models"]]
        for m in models:
            now = r["models"].get(m)
            was = rec["models"].get(m) if rec is not None else None
            status = []
            if rec is None:
                status.append("NO RECORD")
                if m == models[0]:
                        failures.append("%s: no recorded figures (run tools/validation.py "
                                    "record and commit tests/data/validation_record.json)"
                                    % name)
            elif was is None:
                status.append("NO RECORD")
                failures.append("%s/%s: model not recorded" % (name, m))
            elif now is None:
                status.append("MODEL GONE")
                failures.append("%s/%s: recorded model no longer available" % (name, m))
            if now is not None and was is not None:
                for q in QUANTITIES:
                    if _worse(now["max"][q], was.get(q)):
                        status.append("%s worse" % q)
                        failures.append("%s/%s: max|d%s| = %s %s, recorded %s"
                                        % (name, m, q, _fmt(now["max"][q], q), UNITS[q],
                                           _fmt(was.get(q), q)))
                    elif _better(now["max"][q], was.get(q)):
                        improved.append("%s/%s %s" % (name, m, q))
            fig = now["max"] if now is not None else {q: None for q in QUANTITIES}
            print("%-8s %-8s %-14s %5d %10s %10s %10s %10s  %s"
                  % (name, m, rng, r["rows"], _fmt(fig["cp"]), _fmt(fig["s"]),
                     _fmt(fig["dh"], "dh"), _fmt(fig["gef"]),
                     ", ".join(status) or "ok"), file=out)
    rec_rx = record.get("reactions", {})
    print("\nreaction checks (reference: NIST-JANAF 1998 dfH and gef columns)", file=out)
    seen = set()
    for item in reactions:
        key = item["key"]
        seen.add(key)
        if "skipped" in item:
            if key in rec_rx:
                failures.append("%s: recorded but skipped now (%s)" % (key, item["skipped"]))
            print("  %-34s skipped: %s" % (key, item["skipped"]), file=out)
            continue
        st = []
        ref = item["ref"]
        for e in ref["errors"]:
            failures.append("%s: %s" % (key, e))
            st.append("reference rows differ")
        if abs(ref["dh"] - ref["dh_from_increments"]) > REFERENCE_SELF_TOL["dh"]:
            failures.append("%s: reference dH_r from dfH(T) %.0f J/mol, from dfH(298.15) "
                            "+ dH(T) %.0f J/mol" % (key, ref["dh"], ref["dh_from_increments"]))
            st.append("reference inconsistent")
        if ref["logk_published"] is not None and \
                abs(ref["logk"] - ref["logk_published"]) > REFERENCE_SELF_TOL["logk"]:
            failures.append("%s: derived log10 K %.4f, published log Kf gives %.4f"
                            % (key, ref["logk"], ref["logk_published"]))
            st.append("derivation off")
        for q, dev in (("dh", item["dev_dh"]), ("logk", item["dev_logk"])):
            if dev > item["tol"][q]:
                failures.append("%s: |d %s| = %.4g above the tolerance %g"
                                % (key, q, dev, item["tol"][q]))
                st.append("%s beyond tolerance" % q)
            was = rec_rx.get(key, {}).get(q)
            if key not in rec_rx:
                pass
            elif _worse(dev, was):
                failures.append("%s: |d %s| = %.4g, recorded %.4g" % (key, q, dev, was))
                st.append("%s worse" % q)
        if key not in rec_rx:
            failures.append("%s: no recorded figures" % key)
            st.append("NO RECORD")
        print("  %-34s dH_r %10.0f J/mol (tables %10.0f, |d| %6.1f, tol %g)  "
              "log10 K %8.4f (tables %8.4f, |d| %.4f, tol %g)  %s"
              % (key, item["dh"], ref["dh"], item["dev_dh"], item["tol"]["dh"], item["logk"],
                 ref["logk"], item["dev_logk"], item["tol"]["logk"], ", ".join(st) or "ok"),
              file=out)
    for key in sorted(set(rec_rx) - seen):
        failures.append("%s: recorded reaction check no longer defined" % key)
    if orphans:
        print("\nreference data without a built-in species (not compared): %s"
              % ", ".join(orphans), file=out)
    for name in uncovered:
        failures.append("%s: built-in species without a NIST-JANAF table in tests/data/janaf/ "
                        "or a line in tests/data/reference_298.tsv" % name)
    if improved:
        print("\nimproved beyond the margin (run `tools/validation.py record` to tighten "
              "the guard): %s" % ", ".join(improved), file=out)
    return failures


def load_record(path=RECORD):
    with open(path, encoding="utf-8") as f:
        rec = json.load(f)
    if rec.get("format") != RECORD_FORMAT:
        raise ValueError("%s: record format %r, this tool writes %d"
                         % (path, rec.get("format"), RECORD_FORMAT))
    return rec


def write_record(rec, path=RECORD):
    with open(path, "w", encoding="utf-8") as f:
        json.dump(rec, f, indent=1, sort_keys=True)
        f.write("\n")


def ensure_reference_298(data=DATA):
    path = os.path.join(data, "reference_298.tsv")
    if not os.path.exists(path):
        with open(path, "w", encoding="utf-8") as f:
            f.write(REFERENCE_298_HEADER)


# ---------------------------------------------------------------------------
# Main
# ---------------------------------------------------------------------------

def main(argv=None):
    ap = argparse.ArgumentParser(description="Compare molq's built-in species with "
                                 "published tables (see the module docstring).")
    ap.add_argument("command", choices=("check", "record", "report", "show"))
    ap.add_argument("--data", default=DATA, help="test data folder (default tests/data)")
    ap.add_argument("--record", default=None, help="record file (default "
                    "<data>/validation_record.json)")
    ap.add_argument("--no-plots", action="store_true", help="report: write the Markdown "
                    "only (no matplotlib needed)")
    args = ap.parse_args(argv)
    record_path = args.record or os.path.join(args.data, "validation_record.json")
    if args.command == "record":
        ensure_reference_298(args.data)
    results, orphans, uncovered = compare_all(args.data)
    reactions = compare_reactions(args.data)
    if args.command == "record":
        rec = make_record(results, reactions)
        write_record(rec, record_path)
        check(results, orphans, uncovered, reactions, rec)
        print("\nwrote %s (%d species, %d reaction checks)"
              % (os.path.relpath(record_path), len(rec["species"]), len(rec["reactions"])))
        return 0
    if args.command == "show":
        check(results, orphans, uncovered, reactions, {"species": {}, "reactions": {}})
        return 0
    if args.command == "report":
        sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
        import validation_report
        try:
            rec = load_record(record_path)
        except (OSError, ValueError) as exc:
            print("validation: cannot read the record: %s" % exc, file=sys.stderr)
            return 1
        validation_report.write(results, rec, ROOT, plots=not args.no_plots)
        return 0
    try:
        rec = load_record(record_path)
    except (OSError, ValueError) as exc:
        print("validation: cannot read the record: %s" % exc, file=sys.stderr)
        return 1
    failures = check(results, orphans, uncovered, reactions, rec)
    sys.path.insert(0, os.path.dirname(os.path.abspath(__file__)))
    import validation_report
    for problem in validation_report.link_problems(
            validation_report.validation_markdown(rec)):
        failures.append("docs/validation.md: %s" % problem)
    for path in validation_report.stale_markdown(rec, ROOT):
        failures.append("%s does not match the record: run tools/validation.py report "
                        "(docs/validation.md says how)" % path)
    if failures:
        print("\nFAIL: %d finding(s):" % len(failures))
        for f in failures:
            print("  " + f)
        return 1
    print("\nPASS: every species and reaction check within its recorded figure "
          "(margin max(%g relative, %g absolute))" % (REL_MARGIN, ABS_MARGIN))
    return 0


if __name__ == "__main__":
    sys.exit(main())
