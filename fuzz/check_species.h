/* check_species.h -- invariants every molq_species must satisfy, whatever
 * constants it was built from.  Shared by the species_file and spec_api
 * fuzz targets.  Each broken invariant aborts through CHECK.
 *
 * What is checked (molq.h is the reference):
 *  - queries: name 1..255 bytes, molar mass finite > 0, t_min >= 0 (not
 *    NaN), structure and rotor in range, every mode kind has a name;
 *  - the status of every evaluation call: EDOMAIN when T or p is not
 *    finite and > 0, ERANGE when T < t_min, otherwise OK or ERANGE (an
 *    overflow); nothing else;
 *  - MOLQ_OK results are finite (molq_eval, molq_eval_many,
 *    molq_eval_per_mass, molq_eval_mode) and *out is untouched on failure;
 *  - molq_eval and molq_eval_many agree (bit for bit);
 *  - cp >= 5/2 R (translation alone gives 5/2 R; no mode has negative heat
 *    capacity -- textbook ideal-gas result), cv = cp - R > 0, ds/dT > 0;
 *  - the per-mode cv and s add up to the species' values (molq.h: "the
 *    contributions add up");
 *  - between two temperatures at least 10 % apart, both MOLQ_OK:
 *    h - h(0) strictly increases, h and s do not decrease (dh = cp dT,
 *    ds = cp/T dT, cp > 0).
 *
 * MOLQ_FUZZ_STRICT=1 in the environment adds: at 10 K <= T <= 10000 K,
 * T >= t_min and 1 Pa <= p <= 1e10 Pa, for a molar mass between 1e-7
 * (about an electron's) and 1e3 kg/mol, the status must be MOLQ_OK (molq.h
 * reserves ERANGE for T below t_min or "so extreme" states). */
#ifndef MOLQ_FUZZ_CHECK_SPECIES_H
#define MOLQ_FUZZ_CHECK_SPECIES_H

#include "fuzz_util.h"
#include "molq/molq.h"

/* R = N_A k, SI 2019 exact definitions (CODATA). */
#define FZ_R (6.02214076e23 * 1.380649e-23)
#define FZ_MAXPROPS 64

static int fz_strict(void)
{
    static int v = -1;
    if (v < 0) {
        const char *e = getenv("MOLQ_FUZZ_STRICT");
        v = (e != NULL && e[0] == '1');
    }
    return v;
}

/* The status molq must return at (T, p), or -1 when OK and ERANGE are both
 * acceptable. */
static int fz_expected_status(const molq_species *sp, double T, double p)
{
    if (!(isfinite(T) && T > 0.0 && isfinite(p) && p > 0.0))
        return MOLQ_EDOMAIN;
    if (T < molq_species_t_min(sp))
        return MOLQ_ERANGE;
    if (fz_strict() && T >= 10.0 && T <= 1e4 && p >= 1.0 && p <= 1e10 &&
        molq_species_molar_mass(sp) >= 1e-7 &&
        molq_species_molar_mass(sp) <= 1e3)
        return MOLQ_OK;
    return -1;
}

static void fz_check_status(const molq_species *sp, double T, double p,
                            molq_status st, const char *call)
{
    int want = fz_expected_status(sp, T, p);
    if (want >= 0)
        CHECK((int)st == want, "%s('%s', T=%.17g, p=%.17g) returned %d (%s),"
              " expected %d (t_min %.17g)", call, molq_species_name(sp), T, p,
              (int)st, molq_status_string(st), want,
              molq_species_t_min(sp));
    else
        CHECK(st == MOLQ_OK || st == MOLQ_ERANGE,
              "%s('%s', T=%.17g, p=%.17g) returned %d (%s)", call,
              molq_species_name(sp), T, p, (int)st, molq_status_string(st));
}

/* An internal mode (molq_eval_mode of a mode other than translation) and
 * the spin conversion are evaluated down to the models' own limit, at or
 * below molq_species_t_min (molq.h): below t_min both OK and ERANGE are
 * acceptable there. */
static void fz_check_status_internal(const molq_species *sp, double T,
                                     double p, molq_status st,
                                     const char *call)
{
    if (isfinite(T) && T > 0.0 && isfinite(p) && p > 0.0 &&
        T < molq_species_t_min(sp)) {
        CHECK(st == MOLQ_OK || st == MOLQ_ERANGE,
              "%s('%s', T=%.17g, p=%.17g) returned %d (%s) below t_min", call,
              molq_species_name(sp), T, p, (int)st, molq_status_string(st));
        return;
    }
    fz_check_status(sp, T, p, st, call);
}

static int fz_near(double a, double b, double scale)
{
    return fabs(a - b) <= 1e-9 * scale + 1e-300;
}

/* Result of checking one state, kept for the comparisons between states. */
typedef struct fz_state {
    double T, p;
    int ok;
    double v[FZ_MAXPROPS];
} fz_state;

static void fz_check_state(const molq_species *sp, double T, double p,
                           fz_state *out)
{
    size_t np = molq_property_count(), i, m, nm;
    molq_property props[FZ_MAXPROPS];
    double v[FZ_MAXPROPS];
    const double poison = -7.25e77;
    molq_status st;
    const char *nm_ = molq_species_name(sp);

    if (np > FZ_MAXPROPS)
        np = FZ_MAXPROPS;
    for (i = 0; i < np; i++) {
        props[i] = (molq_property)i;
        v[i] = poison;
    }
    out->T = T;
    out->p = p;
    st = molq_eval_many(sp, T, p, props, np, v);
    fz_check_status(sp, T, p, st, "molq_eval_many");
    out->ok = (st == MOLQ_OK);
    if (st == MOLQ_EDOMAIN || (st == MOLQ_ERANGE && T < molq_species_t_min(sp)))
        for (i = 0; i < np; i++)
            CHECK(v[i] == poison, "molq_eval_many wrote out[%zu] on status %d",
                  i, (int)st);
    if (st == MOLQ_OK) {
        for (i = 0; i < np; i++)
            CHECK(isfinite(v[i]), "'%s' %s = %.17g at T=%.17g p=%.17g with "
                  "MOLQ_OK", nm_, molq_property_name((molq_property)i), v[i],
                  T, p);
        CHECK(v[MOLQ_CP] >= 2.5 * FZ_R * (1.0 - 1e-9),
              "'%s' cp = %.17g < 5/2 R at T=%.17g", nm_, v[MOLQ_CP], T);
        CHECK(v[MOLQ_CV] > 0.0, "'%s' cv = %.17g at T=%.17g", nm_,
              v[MOLQ_CV], T);
        CHECK(v[MOLQ_DS_DT] > 0.0 || v[MOLQ_CP] / T == 0.0,
              "'%s' ds/dT = %.17g at T=%.17g", nm_, v[MOLQ_DS_DT], T);
        memcpy(out->v, v, np * sizeof v[0]);
    }

    /* One property at a time: same status family, same numbers. */
    for (i = 0; i < np; i++) {
        double one = poison, pm = poison;
        molq_status s1 = molq_eval(sp, T, p, props[i], &one);
        molq_status s2;
        fz_check_status(sp, T, p, s1, "molq_eval");
        if (s1 != MOLQ_OK)
            CHECK(one == poison, "molq_eval wrote *out on status %d",
                  (int)s1);
        else
            CHECK(isfinite(one), "molq_eval %s = %.17g with MOLQ_OK",
                  molq_property_name(props[i]), one);
        if (s1 == MOLQ_OK && st == MOLQ_OK)
            CHECK(memcmp(&one, &v[i], sizeof one) == 0,
                  "'%s' %s: molq_eval %.17g != molq_eval_many %.17g at "
                  "T=%.17g", nm_, molq_property_name(props[i]), one, v[i], T);
        if (st == MOLQ_OK)
            CHECK(s1 == MOLQ_OK, "molq_eval_many OK but molq_eval(%s) %d",
                  molq_property_name(props[i]), (int)s1);
        s2 = molq_eval_per_mass(sp, T, p, props[i], &pm);
        if (s1 == MOLQ_OK)
            CHECK(s2 == MOLQ_OK || s2 == MOLQ_ERANGE,
                  "molq_eval_per_mass returned %d", (int)s2);
        else
            CHECK(s2 == s1, "molq_eval_per_mass %d vs molq_eval %d", (int)s2,
                  (int)s1);
        if (s2 == MOLQ_OK)
            CHECK_TAG("per_mass_finite", isfinite(pm),
                      "molq_eval_per_mass %s = %.17g with MOLQ_OK (molar "
                      "mass %.17g kg/mol)", molq_property_name(props[i]), pm,
                      molq_species_molar_mass(sp));
        else
            CHECK(pm == poison, "molq_eval_per_mass wrote *out on status %d",
                  (int)s2);
    }

    /* Ortho-para conversion enthalpy: diatomic level sums only. */
    {
        double x = poison;
        molq_status sc = molq_eval_spin_conversion(sp, T, &x);
        size_t k, nmodes = molq_species_mode_count(sp);
        int rovib = 0;
        for (k = 0; k < nmodes; k++) {
            molq_mode_kind kind;
            if (molq_species_mode_kind(sp, k, &kind) == MOLQ_OK &&
                kind == MOLQ_MODE_ROVIBRONIC)
                rovib = 1;
        }
        /* molq.h: MOLQ_EARG for a species not using MOLQ_MODEL_LEVELS, 0
         * for one without distinct even/odd weights.  A level-based
         * species without a diatomic level sum may answer either way
         * (MOLQ_EARG or 0): the library has done both. */
        if (molq_species_model(sp) == MOLQ_MODEL_LEVELS && !rovib &&
            sc == MOLQ_OK) {
            CHECK(x == 0.0, "spin conversion %.17g for '%s' without a "
                  "diatomic level sum", x, nm_);
        } else if (molq_species_model(sp) != MOLQ_MODEL_LEVELS || !rovib) {
            /* EARG; a bad T may be reported first (EDOMAIN, or ERANGE
             * below t_min) -- the library checks the state first. */
            int want = fz_expected_status(sp, T, 1e5);
            CHECK((sc == MOLQ_EARG || (want != -1 && want != MOLQ_OK &&
                                       (int)sc == want)) &&
                      x == poison,
                  "molq_eval_spin_conversion on a non-level-sum species at "
                  "T=%.17g: %d", T, (int)sc);
        } else {
            fz_check_status_internal(sp, T, 1e5, sc,
                                     "molq_eval_spin_conversion");
            if (sc == MOLQ_OK)
                CHECK(isfinite(x), "spin conversion %.17g at T=%.17g", x, T);
            else
                CHECK(x == poison, "spin conversion wrote *out on %d",
                      (int)sc);
        }
    }

    /* Per-mode breakdown. */
    nm = molq_species_mode_count(sp);
    {
        double cv_sum = 0.0, cv_abs = 0.0, s_sum = 0.0, s_abs = 0.0;
        int all_ok = 1;
        static const molq_property mp[] = {MOLQ_LNQ, MOLQ_U, MOLQ_CV, MOLQ_S,
                                           MOLQ_DCV_DT};
        for (m = 0; m < nm; m++) {
            size_t k;
            for (k = 0; k < sizeof mp / sizeof mp[0]; k++) {
                double x = poison;
                molq_status sm = molq_eval_mode(sp, m, T, p, mp[k], &x);
                molq_mode_kind kind = MOLQ_MODE_TRANSLATION;
                molq_species_mode_kind(sp, m, &kind);
                if (kind == MOLQ_MODE_TRANSLATION)
                    fz_check_status(sp, T, p, sm, "molq_eval_mode");
                else
                    fz_check_status_internal(sp, T, p, sm, "molq_eval_mode");
                if (sm != MOLQ_OK) {
                    CHECK(x == poison, "molq_eval_mode wrote *out on %d",
                          (int)sm);
                    all_ok = 0;
                    continue;
                }
                CHECK(isfinite(x), "molq_eval_mode(%zu, %s) = %.17g with OK",
                      m, molq_property_name(mp[k]), x);
                if (mp[k] == MOLQ_CV) {
                    cv_sum += x;
                    cv_abs += fabs(x);
                } else if (mp[k] == MOLQ_S) {
                    s_sum += x;
                    s_abs += fabs(x);
                }
            }
        }
        if (all_ok && st == MOLQ_OK && nm > 0) {
            CHECK(fz_near(cv_sum, v[MOLQ_CV], cv_abs + FZ_R),
                  "'%s' mode cv sum %.17g != cv %.17g at T=%.17g", nm_,
                  cv_sum, v[MOLQ_CV], T);
            CHECK(fz_near(s_sum, v[MOLQ_S], s_abs + FZ_R),
                  "'%s' mode s sum %.17g != s %.17g at T=%.17g", nm_, s_sum,
                  v[MOLQ_S], T);
        }
        {
            double x = poison;
            CHECK(molq_eval_mode(sp, nm, T, p, MOLQ_CV, &x) == MOLQ_EARG &&
                      x == poison,
                  "molq_eval_mode with index == count must be MOLQ_EARG");
        }
    }
}

/* Monotonic in T at one p: lo.T < hi.T, both OK. */
static void fz_check_pair(const molq_species *sp, const fz_state *lo,
                          const fz_state *hi)
{
    const char *nm = molq_species_name(sp);
    if (!lo->ok || !hi->ok || !(hi->T >= 1.1 * lo->T) || lo->p != hi->p)
        return;
    CHECK(hi->v[MOLQ_H_MINUS_H0] > lo->v[MOLQ_H_MINUS_H0] ||
              lo->T < 1e-250,
          "'%s' h-h0 does not increase: %.17g at T=%.17g, %.17g at T=%.17g",
          nm, lo->v[MOLQ_H_MINUS_H0], lo->T, hi->v[MOLQ_H_MINUS_H0], hi->T);
    CHECK(hi->v[MOLQ_H] >= lo->v[MOLQ_H],
          "'%s' h decreases: %.17g at T=%.17g, %.17g at T=%.17g", nm,
          lo->v[MOLQ_H], lo->T, hi->v[MOLQ_H], hi->T);
    CHECK(hi->v[MOLQ_S] >= lo->v[MOLQ_S],
          "'%s' s decreases: %.17g at T=%.17g, %.17g at T=%.17g (p=%.17g)",
          nm, lo->v[MOLQ_S], lo->T, hi->v[MOLQ_S], hi->T, lo->p);
}

static void fz_check_queries(const molq_species *sp)
{
    const char *name = molq_species_name(sp);
    size_t len, m, nm;
    double tmin = molq_species_t_min(sp), mass = molq_species_molar_mass(sp);
    CHECK(name != NULL, "species without a name");
    len = strlen(name);
    CHECK(len >= 1 && len <= 255, "name length %zu", len);
    CHECK(molq_species_formula(sp) != NULL, "formula NULL");
    CHECK(molq_species_source(sp) != NULL, "source NULL");
    CHECK(isfinite(mass) && mass > 0.0, "'%s' molar mass %.17g", name, mass);
    CHECK(tmin >= 0.0, "'%s' t_min %.17g", name, tmin);
    CHECK((int)molq_species_structure(sp) >= MOLQ_ATOM &&
              (int)molq_species_structure(sp) <= MOLQ_NONLINEAR,
          "structure %d", (int)molq_species_structure(sp));
    CHECK(molq_species_rotor(sp) == MOLQ_ROTOR_CORRECTED ||
              molq_species_rotor(sp) == MOLQ_ROTOR_CLASSICAL,
          "rotor %d", (int)molq_species_rotor(sp));
    nm = molq_species_mode_count(sp);
    CHECK(nm >= 1, "'%s' has no modes", name);
    for (m = 0; m < nm; m++) {
        molq_mode_kind k;
        CHECK(molq_species_mode_kind(sp, m, &k) == MOLQ_OK, "mode_kind %zu",
              m);
        CHECK(molq_mode_kind_name(k) != NULL, "mode %zu kind %d has no name",
              m, (int)k);
    }
}

#endif
