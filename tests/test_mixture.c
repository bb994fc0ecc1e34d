/* Mixtures: batch properties against the species sums computed here
 * independently (molq_eval per species, the ideal mixing term written out
 * again), both layouts and strides, mole and mass fractions; temperature
 * inversion round trips; bad input; threads.
 * Sources: the ideal-gas mixture rules (x-weighted molar properties, the
 * mixing entropy -R sum x ln x) are textbook formulas; the sound speed of
 * dry air at 300 K, about 347 m/s, and its gamma near 1.40 are facts of the
 * trade (common practice, no source). */
#include <pthread.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "testutil.h"

static const char *air_names[] = {"N2", "O2", "Ar"};
static const double air_x[] = {0.78084, 0.20946, 0.00970};
/* hydrogen-air products, 9 species (invented composition) */
static const char *h2_names[] = {"H2",  "O2", "H2O", "OH", "H",
                                 "O",   "HO2", "N2", "Ar"};
static const double h2_x[] = {0.02, 0.05, 0.25, 0.01, 0.003,
                              0.002, 0.0005, 0.6595, 0.005};

static molq_mixture *make_mix(const char *const *names, size_t n,
                              const molq_mix_config *cfg)
{
    molq_mixture *m = NULL;
    char err[256];
    molq_status st =
        molq_mixture_from_names(tu_builtin(), names, n, cfg, &m, err,
                                sizeof err);
    ck_assert_msg(st == MOLQ_OK, "%s", err);
    return m;
}

/* Mixture property per mole from the species, written out here. */
static double expect_mix(const char *const *names, const double *x, size_t n,
                         double T, double p, molq_mix_property prop)
{
    double h = 0, cp = 0, s = 0, w = 0, dcp = 0, sum = 0;
    size_t k;
    for (k = 0; k < n; k++)
        sum += x[k];
    for (k = 0; k < n; k++) {
        const molq_species *sp = tu_species(names[k]);
        double xk = x[k] / sum;
        if (xk <= 0)
            continue;
        h += xk * tu_eval(sp, T, p, MOLQ_H);
        cp += xk * tu_eval(sp, T, p, MOLQ_CP);
        s += xk * (tu_eval(sp, T, p, MOLQ_S) - T_R * log(xk));
        dcp += xk * tu_eval(sp, T, p, MOLQ_DCP_DT);
        w += xk * molq_species_molar_mass(sp);
    }
    switch (prop) {
    case MOLQ_MIX_MOLAR_MASS: return w;
    case MOLQ_MIX_GAS_CONSTANT: return T_R / w;
    case MOLQ_MIX_CP: return cp;
    case MOLQ_MIX_CV: return cp - T_R;
    case MOLQ_MIX_H: return h;
    case MOLQ_MIX_U: return h - T_R * T;
    case MOLQ_MIX_S: return s;
    case MOLQ_MIX_G: return h - T * s;
    case MOLQ_MIX_GAMMA: return cp / (cp - T_R);
    case MOLQ_MIX_SOUND_SPEED: return sqrt(cp / (cp - T_R) * T_R * T / w);
    case MOLQ_MIX_DCP_DT:
    case MOLQ_MIX_DCV_DT: return dcp;
    }
    return NAN;
}

static const molq_mix_property all_props[] = {
    MOLQ_MIX_MOLAR_MASS, MOLQ_MIX_GAS_CONSTANT, MOLQ_MIX_CP, MOLQ_MIX_CV,
    MOLQ_MIX_H, MOLQ_MIX_U, MOLQ_MIX_S, MOLQ_MIX_G, MOLQ_MIX_GAMMA,
    MOLQ_MIX_SOUND_SPEED, MOLQ_MIX_DCP_DT, MOLQ_MIX_DCV_DT};
#define NP (sizeof all_props / sizeof all_props[0])

static int extensive(molq_mix_property p)
{
    return p != MOLQ_MIX_MOLAR_MASS && p != MOLQ_MIX_GAS_CONSTANT &&
           p != MOLQ_MIX_GAMMA && p != MOLQ_MIX_SOUND_SPEED;
}

START_TEST(sums_both_layouts)
{
    enum { NC = 5, K = 9 };
    molq_mixture *m = make_mix(h2_names, K, NULL);
    double T[NC] = {300, 800, 1500, 2500, 3000}, p[1] = {2e5};
    double cellmajor[NC * K], speciesmajor[K * 7]; /* pitch 7 > NC */
    double out[NC * NP], out2[NP * NC];
    size_t c, k, j, bad;
    char err[256];
    ck_assert_int_eq(molq_mixture_species_count(m), K);
    for (c = 0; c < NC; c++)
        for (k = 0; k < K; k++) {
            /* perturb the composition per cell, renormalise */
            double v = h2_x[k] * (1.0 + 0.1 * (double)((c + k) % 3));
            cellmajor[c * K + k] = v;
        }
    for (c = 0; c < NC; c++) {
        double sum = 0;
        for (k = 0; k < K; k++)
            sum += cellmajor[c * K + k];
        for (k = 0; k < K; k++) {
            cellmajor[c * K + k] /= sum;
            speciesmajor[k * 7 + c] = cellmajor[c * K + k];
        }
    }
    ck_assert_int_eq(molq_mixture_eval(m, NC, T, 1, p, 0, cellmajor, K, 1,
                                       MOLQ_MOLE_FRACTIONS, all_props, NP,
                                       MOLQ_PER_MOLE, out, NP, 1, &bad, err,
                                       sizeof err),
                     MOLQ_OK);
    ck_assert_uint_eq(bad, NC);
    /* species-major input, property-major output */
    ck_assert_int_eq(molq_mixture_eval(m, NC, T, 1, p, 0, speciesmajor, 1, 7,
                                       MOLQ_MOLE_FRACTIONS, all_props, NP,
                                       MOLQ_PER_MOLE, out2, 1, NC, NULL, err,
                                       sizeof err),
                     MOLQ_OK);
    for (c = 0; c < NC; c++)
        for (j = 0; j < NP; j++) {
            double want = expect_mix(h2_names, &cellmajor[c * K], K, T[c],
                                     p[0], all_props[j]);
            ck_assert_close(out[c * NP + j], want, 1e-12, 1e-9);
            ck_assert_msg(out2[j * NC + c] == out[c * NP + j],
                          "layouts differ: cell %zu prop %zu", c, j);
        }
    molq_mixture_free(m);
}
END_TEST

START_TEST(mass_fractions_and_per_mass)
{
    enum { K = 3 };
    molq_mixture *m = make_mix(air_names, K, NULL);
    double y[K], x2[K], T = 1200, p = 101325, wsum = 0, w, out[NP], ref[NP];
    size_t k, j;
    char err[256];
    for (k = 0; k < K; k++)
        wsum += air_x[k] * molq_species_molar_mass(tu_species(air_names[k]));
    for (k = 0; k < K; k++)
        y[k] = air_x[k] * molq_species_molar_mass(tu_species(air_names[k])) /
               wsum; /* textbook x -> y */
    w = wsum;
    ck_assert_int_eq(molq_mixture_convert(m, 1, MOLQ_MASS_FRACTIONS, y, 0, 1,
                                          x2, 0, 1, NULL, err, sizeof err),
                     MOLQ_OK);
    for (k = 0; k < K; k++)
        ck_assert_close(x2[k], air_x[k], 1e-13, 0);
    ck_assert_int_eq(molq_mixture_convert(m, 1, MOLQ_MOLE_FRACTIONS, air_x, 0,
                                          1, x2, 0, 1, NULL, err, sizeof err),
                     MOLQ_OK);
    for (k = 0; k < K; k++)
        ck_assert_close(x2[k], y[k], 1e-13, 0);
    ck_assert_int_eq(molq_mixture_eval(m, 1, &T, 0, &p, 0, y, 0, 1,
                                       MOLQ_MASS_FRACTIONS, all_props, NP,
                                       MOLQ_PER_MASS, out, 0, 1, NULL, err,
                                       sizeof err),
                     MOLQ_OK);
    for (j = 0; j < NP; j++) {
        ref[j] = expect_mix(air_names, air_x, K, T, p, all_props[j]);
        if (extensive(all_props[j]))
            ref[j] /= w;
        ck_assert_close(out[j], ref[j], 1e-12, 1e-9);
    }
    molq_mixture_free(m);
}
END_TEST

START_TEST(air_sound_speed)
{
    molq_mixture *m = make_mix(air_names, 3, NULL);
    molq_mix_property pr[2] = {MOLQ_MIX_SOUND_SPEED, MOLQ_MIX_GAMMA};
    double T = 300, p = 1e5, out[2];
    ck_assert_int_eq(molq_mixture_eval(m, 1, &T, 0, &p, 0, air_x, 0, 1,
                                       MOLQ_MOLE_FRACTIONS, pr, 2,
                                       MOLQ_PER_MOLE, out, 0, 1, NULL, NULL,
                                       0),
                     MOLQ_OK);
    /* 347 m/s and 1.40: facts of the trade (common practice) */
    ck_assert_msg(fabs(out[0] - 347.0) < 1.0, "sound speed %g", out[0]);
    ck_assert_msg(fabs(out[1] - 1.40) < 0.003, "gamma %g", out[1]);
    molq_mixture_free(m);
}
END_TEST

START_TEST(mixing_entropy_zero_fraction)
{
    /* a zero (and a tolerated tiny negative) fraction adds nothing */
    molq_mixture *m = make_mix(air_names, 3, NULL);
    double x[3] = {0.8, 0.2, 0.0}, xn[3] = {0.8, 0.2 + 5e-7, -5e-7};
    double T = 500, p = 1e5, s1, s2, ref;
    molq_mix_property pr = MOLQ_MIX_S;
    ck_assert_int_eq(molq_mixture_eval(m, 1, &T, 0, &p, 0, x, 0, 1,
                                       MOLQ_MOLE_FRACTIONS, &pr, 1,
                                       MOLQ_PER_MOLE, &s1, 0, 0, NULL, NULL,
                                       0),
                     MOLQ_OK);
    ref = 0.8 * (tu_eval(tu_species("N2"), T, p, MOLQ_S) - T_R * log(0.8)) +
          0.2 * (tu_eval(tu_species("O2"), T, p, MOLQ_S) - T_R * log(0.2));
    ck_assert_close(s1, ref, 1e-13, 0);
    ck_assert_msg(isfinite(s1), "s not finite");
    ck_assert_int_eq(molq_mixture_eval(m, 1, &T, 0, &p, 0, xn, 0, 1,
                                       MOLQ_MOLE_FRACTIONS, &pr, 1,
                                       MOLQ_PER_MOLE, &s2, 0, 0, NULL, NULL,
                                       0),
                     MOLQ_OK);
    ck_assert_msg(isfinite(s2), "s not finite");
    molq_mixture_free(m);
}
END_TEST

START_TEST(dcp_dt_finite_difference)
{
    molq_mixture *m = make_mix(h2_names, 9, NULL);
    molq_mix_property pr[2] = {MOLQ_MIX_CP, MOLQ_MIX_DCP_DT};
    double T[3] = {1500 - 0.01, 1500, 1500 + 0.01}, p = 1e5, out[6];
    ck_assert_int_eq(molq_mixture_eval(m, 3, T, 1, &p, 0, h2_x, 0, 1,
                                       MOLQ_MOLE_FRACTIONS, pr, 2,
                                       MOLQ_PER_MOLE, out, 2, 1, NULL, NULL,
                                       0),
                     MOLQ_OK);
    ck_assert_close(out[3], (out[4] - out[0]) / 0.02, 1e-5, 1e-9);
    molq_mixture_free(m);
}
END_TEST

START_TEST(species_vectors)
{
    enum { K = 9, NPR = 4 };
    molq_mixture *m = make_mix(h2_names, K, NULL);
    molq_property pr[NPR] = {MOLQ_H, MOLQ_CP, MOLQ_G, MOLQ_DGRT_DT};
    double T[2] = {700, 2100}, p = 1e5, out[2 * K * NPR];
    size_t c, k, j;
    ck_assert_int_eq(molq_mixture_eval_species(m, 2, T, 1, &p, 0, pr, NPR,
                                               MOLQ_PER_MASS, out, K * NPR,
                                               NPR, 1, NULL, NULL, 0),
                     MOLQ_OK);
    for (c = 0; c < 2; c++)
        for (k = 0; k < K; k++)
            for (j = 0; j < NPR; j++) {
                double want;
                ck_assert_int_eq(molq_eval_per_mass(tu_species(h2_names[k]),
                                                    T[c], p, pr[j], &want),
                                 MOLQ_OK);
                ck_assert_close(out[c * K * NPR + k * NPR + j], want, 1e-14,
                                0);
            }
    molq_mixture_free(m);
}
END_TEST

/* T -> h (or u, s) -> T across 200-6000 K, cold and warm. */
static void round_trip(const char *const *names, const double *x, size_t n,
                       molq_mix_property given, molq_per per)
{
    enum { NC = 58 }; /* 200.37 .. 5900.37 K */
    molq_mix_config *cfg;
    molq_mixture *m;
    double T[NC], v[NC], back[NC], guess[NC], p = 3e5;
    unsigned it[NC], total = 0, worst = 0;
    size_t c;
    char err[256];
    ck_assert_int_eq(molq_mix_config_new(&cfg), MOLQ_OK);
    ck_assert_int_eq(molq_mix_config_set_temperature_bounds(cfg, 200, 6000),
                     MOLQ_OK);
    m = make_mix(names, n, cfg);
    molq_mix_config_free(cfg);
    for (c = 0; c < NC; c++)
        T[c] = 200.0 + 100.0 * (double)c + 0.37;
    ck_assert_int_eq(molq_mixture_eval(m, NC, T, 1, &p, 0, x, 0, 1,
                                       MOLQ_MOLE_FRACTIONS, &given, 1, per, v,
                                       1, 0, NULL, err, sizeof err),
                     MOLQ_OK);
    ck_assert_int_eq(molq_mixture_temperature(m, given, per, NC, v, 1, &p, 0,
                                              x, 0, 1, MOLQ_MOLE_FRACTIONS,
                                              NULL, 0, back, 1, it, NULL, err,
                                              sizeof err),
                     MOLQ_OK);
    for (c = 0; c < NC; c++) {
        ck_assert_msg(fabs(back[c] - T[c]) <= 2e-10 * T[c],
                      "cold: T %g back %.15g", T[c], back[c]);
        ck_assert_msg(it[c] <= 30, "cold: %u evaluations at %g K", it[c],
                      T[c]);
        guess[c] = T[c] * (1.0 + 2e-3); /* last step's T */
    }
    ck_assert_int_eq(molq_mixture_temperature(m, given, per, NC, v, 1, &p, 0,
                                              x, 0, 1, MOLQ_MOLE_FRACTIONS,
                                              guess, 1, back, 1, it, NULL,
                                              err, sizeof err),
                     MOLQ_OK);
    for (c = 0; c < NC; c++) {
        ck_assert_msg(fabs(back[c] - T[c]) <= 2e-10 * T[c],
                      "warm: T %g back %.15g", T[c], back[c]);
        total += it[c];
        if (it[c] > worst)
            worst = it[c];
    }
    /* Newton from 0.2 % away: quadratic convergence needs 3 evaluations */
    ck_assert_msg(worst <= 4, "warm: worst %u evaluations", worst);
    ck_assert_msg(total <= 3 * NC, "warm: %u evaluations for %d cells", total,
                  NC);
    molq_mixture_free(m);
}

START_TEST(inversion_round_trips)
{
    round_trip(air_names, air_x, 3, MOLQ_MIX_H, MOLQ_PER_MOLE);
    round_trip(air_names, air_x, 3, MOLQ_MIX_U, MOLQ_PER_MASS);
    round_trip(air_names, air_x, 3, MOLQ_MIX_S, MOLQ_PER_MOLE);
    round_trip(h2_names, h2_x, 9, MOLQ_MIX_H, MOLQ_PER_MASS);
    round_trip(h2_names, h2_x, 9, MOLQ_MIX_U, MOLQ_PER_MOLE);
    round_trip(h2_names, h2_x, 9, MOLQ_MIX_S, MOLQ_PER_MASS);
}
END_TEST

START_TEST(inversion_out_of_range)
{
    molq_mixture *m = make_mix(air_names, 3, NULL);
    double lo, hi, v[3], T3[3], out[3] = {-1, -1, -1}, p = 1e5;
    molq_mix_property h = MOLQ_MIX_H;
    size_t bad;
    char err[256];
    ck_assert_int_eq(molq_mixture_temperature_bounds(m, &lo, &hi), MOLQ_OK);
    /* the intersection of N2 and O2's validated ranges (Ar has none:
     * its t_min to 6000 K) */
    ck_assert_double_eq(lo, 100.0);
    ck_assert_double_eq(hi, 6000.0);
    T3[0] = 1000;
    T3[1] = hi;
    T3[2] = 500;
    ck_assert_int_eq(molq_mixture_eval(m, 3, T3, 1, &p, 0, air_x, 0, 1,
                                       MOLQ_MOLE_FRACTIONS, &h, 1,
                                       MOLQ_PER_MOLE, v, 1, 0, NULL, NULL, 0),
                     MOLQ_OK);
    v[1] += 1000.0; /* just beyond the top */
    ck_assert_int_eq(molq_mixture_temperature(m, h, MOLQ_PER_MOLE, 3, v, 1,
                                              &p, 0, air_x, 0, 1,
                                              MOLQ_MOLE_FRACTIONS, NULL, 0,
                                              out, 1, NULL, &bad, err,
                                              sizeof err),
                     MOLQ_ERANGE);
    ck_assert_uint_eq(bad, 1);
    ck_assert_msg(strstr(err, "cell 1") && strstr(err, "above"), "%s", err);
    ck_assert_close(out[0], 1000.0, 1e-10, 0); /* written before */
    ck_assert_double_eq(out[1], -1);            /* untouched */
    ck_assert_double_eq(out[2], -1);
    v[1] = -1e9; /* far below 100 K */
    ck_assert_int_eq(molq_mixture_temperature(m, h, MOLQ_PER_MOLE, 3, v, 1,
                                              &p, 0, air_x, 0, 1,
                                              MOLQ_MOLE_FRACTIONS, NULL, 0,
                                              out, 1, NULL, &bad, err,
                                              sizeof err),
                     MOLQ_ERANGE);
    ck_assert_msg(strstr(err, "below"), "%s", err);
    molq_mixture_free(m);
}
END_TEST

START_TEST(bad_input)
{
    molq_mixture *m = make_mix(air_names, 3, NULL), *m2 = NULL;
    molq_mix_config *cfg;
    molq_mix_property cp = MOLQ_MIX_CP;
    double X[6] = {0.78, 0.21, 0.01, 0.78, 0.21, 0.01};
    double T[2] = {300, 400}, p = 1e5, out[2] = {-7, -7};
    const char *dup[2] = {"N2", "N2"}, *missing[2] = {"N2", "Unobtainium"};
    const molq_species *nul[2] = {NULL, NULL};
    size_t bad;
    char err[256];
#define EVAL(st)                                                               \
    ck_assert_int_eq(molq_mixture_eval(m, 2, T, 1, &p, 0, X, 3, 1,             \
                                       MOLQ_MOLE_FRACTIONS, &cp, 1,            \
                                       MOLQ_PER_MOLE, out, 1, 0, &bad, err,    \
                                       sizeof err),                            \
                     st);                                                      \
    ck_assert_double_eq(out[0], -7);                                           \
    ck_assert_double_eq(out[1], -7)
    X[4] = -0.01;
    EVAL(MOLQ_EVALUE);
    ck_assert_uint_eq(bad, 1);
    ck_assert_msg(strstr(err, "cell 1") && strstr(err, "O2"), "%s", err);
    X[4] = NAN;
    EVAL(MOLQ_EVALUE);
    ck_assert_msg(strstr(err, "not finite") && strstr(err, "O2"), "%s", err);
    X[4] = 0.25; /* sum 1.04 */
    EVAL(MOLQ_EVALUE);
    ck_assert_msg(strstr(err, "sum"), "%s", err);
    X[4] = 0.21;
    T[1] = NAN;
    EVAL(MOLQ_EDOMAIN);
    T[1] = 5.0; /* below the gases' limits? N2 levels go low: use 1e-3 */
    T[1] = 1e-3;
    EVAL(MOLQ_ERANGE);
    ck_assert_msg(strstr(err, "cell 1"), "%s", err);
    T[1] = 400;
    p = -1;
    EVAL(MOLQ_EDOMAIN);
    p = 1e5;
    ck_assert_int_eq(molq_mixture_eval(m, 2, T, 1, &p, 0, X, 3, 0,
                                       MOLQ_MOLE_FRACTIONS, &cp, 1,
                                       MOLQ_PER_MOLE, out, 1, 0, NULL, err,
                                       sizeof err),
                     MOLQ_EARG);
    ck_assert_int_eq(molq_mixture_eval(m, 2, T, 1, &p, 0, X, 3, 1,
                                       (molq_basis)7, &cp, 1, MOLQ_PER_MOLE,
                                       out, 1, 0, NULL, err, sizeof err),
                     MOLQ_EARG);
    ck_assert_int_eq(molq_mixture_eval(m, 2, T, 1, NULL, 0, X, 3, 1,
                                       MOLQ_MOLE_FRACTIONS, &cp, 1,
                                       MOLQ_PER_MOLE, out, 1, 0, NULL, err,
                                       sizeof err),
                     MOLQ_EARG);
    /* normalisation on: a sum of 2 is accepted and divided out */
    ck_assert_int_eq(molq_mix_config_new(&cfg), MOLQ_OK);
    ck_assert_int_eq(molq_mix_config_set_composition(cfg, 1e-6, 1), MOLQ_OK);
    ck_assert_int_eq(molq_mix_config_set_composition(cfg, -1, 1),
                     MOLQ_EVALUE);
    ck_assert_int_eq(molq_mix_config_set_inversion(cfg, 0, 10), MOLQ_EVALUE);
    ck_assert_int_eq(molq_mix_config_set_temperature_bounds(cfg, 500, 400),
                     MOLQ_EVALUE);
    ck_assert_int_eq(molq_mix_config_set_method(cfg, (molq_mix_method)5),
                     MOLQ_EARG);
    m2 = make_mix(air_names, 3, cfg);
    {
        double X2[3] = {1.56, 0.42, 0.02}, a, b;
        ck_assert_int_eq(molq_mixture_eval(m2, 1, T, 0, &p, 0, X2, 0, 1,
                                           MOLQ_MOLE_FRACTIONS, &cp, 1,
                                           MOLQ_PER_MOLE, &a, 0, 0, NULL,
                                           NULL, 0),
                         MOLQ_OK);
        ck_assert_int_eq(molq_mixture_eval(m, 1, T, 0, &p, 0, X, 0, 1,
                                           MOLQ_MOLE_FRACTIONS, &cp, 1,
                                           MOLQ_PER_MOLE, &b, 0, 0, NULL,
                                           NULL, 0),
                         MOLQ_OK);
        ck_assert_close(a, b, 1e-14, 0);
    }
    molq_mixture_free(m2);
    m2 = NULL;
    /* creation errors leave *out alone and name the entry */
    ck_assert_int_eq(molq_mixture_from_names(tu_builtin(), dup, 2, NULL, &m2,
                                             err, sizeof err),
                     MOLQ_EDUPLICATE);
    ck_assert_msg(strstr(err, "N2") != NULL, "%s", err);
    ck_assert_int_eq(molq_mixture_from_names(tu_builtin(), missing, 2, NULL,
                                             &m2, err, sizeof err),
                     MOLQ_ENOTFOUND);
    ck_assert_msg(strstr(err, "Unobtainium") != NULL, "%s", err);
    ck_assert_int_eq(molq_mixture_create(nul, 2, NULL, &m2, err, sizeof err),
                     MOLQ_EARG);
    ck_assert_int_eq(molq_mixture_create(nul, 0, NULL, &m2, err, sizeof err),
                     MOLQ_EARG);
    ck_assert_int_eq(molq_mix_config_set_temperature_bounds(cfg, 1e-6, 400),
                     MOLQ_OK);
    ck_assert_int_eq(molq_mixture_from_names(tu_builtin(), air_names, 3, cfg,
                                             &m2, err, sizeof err),
                     MOLQ_EVALUE);
    ck_assert_ptr_null(m2);
    molq_mix_config_free(cfg);
    /* inversion input errors */
    {
        double v = NAN, t = -1;
        molq_mix_property h = MOLQ_MIX_H, g = MOLQ_MIX_G;
        ck_assert_int_eq(molq_mixture_temperature(m, h, MOLQ_PER_MOLE, 1, &v,
                                                  0, NULL, 0, X, 0, 1,
                                                  MOLQ_MOLE_FRACTIONS, NULL,
                                                  0, &t, 0, NULL, NULL, err,
                                                  sizeof err),
                         MOLQ_EDOMAIN);
        ck_assert_double_eq(t, -1);
        v = 0;
        ck_assert_int_eq(molq_mixture_temperature(m, g, MOLQ_PER_MOLE, 1, &v,
                                                  0, NULL, 0, X, 0, 1,
                                                  MOLQ_MOLE_FRACTIONS, NULL,
                                                  0, &t, 0, NULL, NULL, err,
                                                  sizeof err),
                         MOLQ_EARG);
        ck_assert_int_eq(molq_mixture_temperature(m, MOLQ_MIX_S,
                                                  MOLQ_PER_MOLE, 1, &v, 0,
                                                  NULL, 0, X, 0, 1,
                                                  MOLQ_MOLE_FRACTIONS, NULL,
                                                  0, &t, 0, NULL, NULL, err,
                                                  sizeof err),
                         MOLQ_EARG);
    }
    molq_mixture_free(m);
    molq_mixture_free(NULL);
}
END_TEST

START_TEST(names_and_lookup)
{
    molq_mixture *m = make_mix(h2_names, 9, NULL);
    molq_mix_property pr;
    size_t k, i;
    for (k = 0; k < 9; k++) {
        ck_assert_str_eq(molq_species_name(molq_mixture_species(m, k)),
                         h2_names[k]);
        ck_assert_int_eq(molq_mixture_index(m, h2_names[k], &i), MOLQ_OK);
        ck_assert_uint_eq(i, k);
    }
    ck_assert_ptr_null(molq_mixture_species(m, 9));
    ck_assert_int_eq(molq_mixture_index(m, "CO2", &i), MOLQ_ENOTFOUND);
    ck_assert_int_eq(molq_mixture_method(m), MOLQ_MIX_EXACT);
    for (k = 0; k < molq_mix_property_count(); k++) {
        const char *nm = molq_mix_property_name((molq_mix_property)k);
        ck_assert_ptr_nonnull(nm);
        ck_assert_int_eq(molq_mix_property_from_name(nm, &pr), MOLQ_OK);
        ck_assert_int_eq((int)pr, (int)k);
    }
    ck_assert_ptr_null(molq_mix_property_name((molq_mix_property)99));
    ck_assert_int_eq(molq_mix_property_from_name("enthalpy", &pr),
                     MOLQ_ENOTFOUND);
    ck_assert_str_eq(molq_status_string(MOLQ_ENOCONV),
                     "iteration did not converge");
    molq_mixture_free(m);
}
END_TEST

/* Threads sharing one mixture give bit-identical results. */
enum { TCELLS = 400 };
typedef struct {
    const molq_mixture *m;
    double out[TCELLS * 3];
    double Tb[TCELLS];
    int ok;
} job;

static void *work(void *arg)
{
    job *j = arg;
    molq_mix_property pr[3] = {MOLQ_MIX_H, MOLQ_MIX_CP, MOLQ_MIX_S};
    double T[TCELLS], p = 1e5, h[TCELLS];
    size_t c;
    for (c = 0; c < TCELLS; c++)
        T[c] = 250.0 + 6.0 * (double)c; /* inside H2's range */
    j->ok = molq_mixture_eval(j->m, TCELLS, T, 1, &p, 0, h2_x, 0, 1,
                              MOLQ_MOLE_FRACTIONS, pr, 3, MOLQ_PER_MASS,
                              j->out, 3, 1, NULL, NULL, 0) == MOLQ_OK;
    for (c = 0; c < TCELLS; c++)
        h[c] = j->out[3 * c];
    j->ok &= molq_mixture_temperature(j->m, MOLQ_MIX_H, MOLQ_PER_MASS,
                                      TCELLS, h, 1, NULL, 0, h2_x, 0, 1,
                                      MOLQ_MOLE_FRACTIONS, NULL, 0, j->Tb, 1,
                                      NULL, NULL, NULL, 0) == MOLQ_OK;
    return NULL;
}

START_TEST(threads_identical)
{
    enum { NT = 4 };
    molq_mixture *m = make_mix(h2_names, 9, NULL);
    static job one, many[NT];
    pthread_t th[NT];
    int i;
    one.m = m;
    work(&one);
    ck_assert(one.ok);
    for (i = 0; i < NT; i++) {
        many[i].m = m;
        ck_assert_int_eq(pthread_create(&th[i], NULL, work, &many[i]), 0);
    }
    for (i = 0; i < NT; i++) {
        ck_assert_int_eq(pthread_join(th[i], NULL), 0);
        ck_assert(many[i].ok);
        ck_assert(memcmp(many[i].out, one.out, sizeof one.out) == 0);
        ck_assert(memcmp(many[i].Tb, one.Tb, sizeof one.Tb) == 0);
    }
    molq_mixture_free(m);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("mixture");
    TCase *tc = tcase_create("mixture");
    tcase_set_timeout(tc, 120);
    tcase_add_test(tc, sums_both_layouts);
    tcase_add_test(tc, mass_fractions_and_per_mass);
    tcase_add_test(tc, air_sound_speed);
    tcase_add_test(tc, mixing_entropy_zero_fraction);
    tcase_add_test(tc, dcp_dt_finite_difference);
    tcase_add_test(tc, species_vectors);
    tcase_add_test(tc, inversion_round_trips);
    tcase_add_test(tc, inversion_out_of_range);
    tcase_add_test(tc, bad_input);
    tcase_add_test(tc, names_and_lookup);
    tcase_add_test(tc, threads_identical);
    suite_add_tcase(s, tc);
    return tu_run(s);
}
