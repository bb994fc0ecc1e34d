/* Exact rigid-top rotation (the levels model of nonlinear molecules).
 * Closed forms used (textbook results for the rigid rotor, e.g. Townes &
 * Schawlow, Microwave Spectroscopy, ch. 4; from memory):
 *  - symmetric prolate top: E(J, K) = B J(J+1) + (A - B) K^2, each K > 0
 *    twice;
 *  - asymmetric top, J <= 2: 0_00 = 0; 1_01 = B + C, 1_11 = A + C,
 *    1_10 = A + B; 2_12 = A + B + 4C, 2_11 = A + 4B + C, 2_21 = 4A + B + C,
 *    2_02 / 2_20 = 2(A + B + C) -/+ 2 sqrt((B - C)^2 + (A - C)(A - B)).
 * Nuclear-spin weights by (Ka, Kc) parity class (water: Ka + Kc odd is
 * ortho, weight 3/4 on the conventional scale; even is para, 1/4): common
 * practice. */
#include <stdlib.h>
#include <string.h>

#include "testutil.h"

static double rot_lnq(const molq_species *sp, double T)
{
    return tu_eval_kind(sp, MOLQ_MODE_ROTATION, T, MOLQ_LNQ);
}

/* Invented test molecules; "model": "levels" selects the exact top. */
static const char *const js =
    "{\"species\": ["
    "{\"name\": \"prolate\", \"molar_mass\": 20, \"structure\": \"nonlinear\","
    " \"rotational_constants\": [5, 1, 1], \"model\": \"levels\"},"
    "{\"name\": \"water-like\", \"molar_mass\": 18, \"structure\": \"nonlinear\","
    " \"symmetry_number\": 2, \"rotational_constants\": [27.9, 14.5, 9.3],"
    " \"model\": \"levels\","
    " \"rotational_weights\": {\"ee\": 0.25, \"eo\": 0.75, \"oe\": 0.75,"
    " \"oo\": 0.25}}]}";

START_TEST(symmetric_top_exact)
{
    molq_db *db;
    const molq_species *sp;
    const double A = 5 * T_C2, B = 1 * T_C2;
    const double temps[] = {0.5, 2.0, 10.0, 40.0, 80.0};
    size_t i;
    tu_from_json(js, &db);
    ck_assert_int_eq(molq_db_find(db, "prolate", &sp), MOLQ_OK);
    /* the exact top has no lower limit of its own: the species' t_min is
     * the gas's Boltzmann limit (below 1 K here), the rotation mode is
     * evaluated below it (molq_eval_mode) */
    ck_assert(molq_species_t_min(sp) > 0.0 && molq_species_t_min(sp) < 1.0);
    for (i = 0; i < 5; i++) {
        double q = 0.0, T = temps[i];
        int J, K;
        for (J = 0; J < 600; J++)
            for (K = 0; K <= J; K++) {
                double E = B * J * (J + 1.0) + (A - B) * K * K;
                if (E / T < 700)
                    q += (2 * J + 1) * (K ? 2 : 1) * exp(-E / T);
            }
        /* below the hand-over (15 theta_A = 108 K): exact levels */
        ck_assert_close(rot_lnq(sp, T), log(q), 1e-11, 1.0);
    }
    molq_db_free(db);
}
END_TEST

START_TEST(asymmetric_top_low_levels)
{
    molq_db *db;
    const molq_species *sp;
    const double A = 27.9, B = 14.5, C = 9.3, T = 6.0;
    double r = 2 * sqrt((B - C) * (B - C) + (A - C) * (A - B));
    /* energy, parity class weight */
    const double lev[][2] = {
        {0, 0.25},                          /* 0_00 ee */
        {B + C, 0.75}, {A + C, 0.25}, {A + B, 0.75}, /* 1_01 eo, 1_11 oo, 1_10 oe */
        {A + B + 4 * C, 0.75},              /* 2_12 oe */
        {A + 4 * B + C, 0.25},              /* 2_11 oo */
        {4 * A + B + C, 0.75},              /* 2_21 oe */
        {2 * (A + B + C) - r, 0.25},        /* 2_02 ee */
        {2 * (A + B + C) + r, 0.25},        /* 2_20 ee */
    };
    const int J[] = {0, 1, 1, 1, 2, 2, 2, 2, 2};
    double q = 0.0;
    size_t i;
    tu_from_json(js, &db);
    ck_assert_int_eq(molq_db_find(db, "water-like", &sp), MOLQ_OK);
    for (i = 0; i < 9; i++)
        q += (2 * J[i] + 1) * lev[i][1] * exp(-T_C2 * lev[i][0] / T);
    /* J = 3 starts near 140 cm^-1: below 3e-15 of q at 6 K */
    ck_assert_close(rot_lnq(sp, T), log(q), 1e-12, 1.0);
    /* At high T the spin weights average to 1/sigma, so the exact top
     * approaches the corrected rotor; what remains is that formula's
     * truncation, which must fall as (theta_A/T)^2 (a wrong weight would
     * leave a constant offset instead).  Both temperatures lie below the
     * hand-over (30 theta_A), where the exact levels are used. */
    {
        molq_species *rr;
        char err[128];
        double d1, d2;
        ck_assert_int_eq(molq_species_with_model(sp, MOLQ_MODEL_RRHO, &rr, err,
                                                 sizeof err),
                         MOLQ_OK);
        d1 = rot_lnq(sp, 300.0) - rot_lnq(rr, 300.0);
        d2 = rot_lnq(sp, 600.0) - rot_lnq(rr, 600.0);
        ck_assert_msg(fabs(d1) < 1e-3, "difference at 300 K: %g", d1);
        ck_assert_msg(fabs(d1 / d2 - 4.0) < 0.4,
                      "differences %g (300 K) and %g (600 K) do not fall "
                      "as 1/T^2",
                      d1, d2);
        molq_species_free(rr);
    }
    molq_db_free(db);
}
END_TEST

/* Below theta_A the corrected rotor refuses (MOLQ_ERANGE); the exact top
 * of the levels model answers, finite, down to 1e-3 K. */
START_TEST(low_temperature_water)
{
    const molq_species *h2o = tu_species("H2O");
    const molq_species *rr = tu_species_model("H2O", MOLQ_MODEL_RRHO);
    double v;
    ck_assert_int_eq(molq_eval(rr, 20.0, 1e5, MOLQ_CP, &v), MOLQ_ERANGE);
    /* no model limit of its own; the gas's Boltzmann limit, 0.76 K at
     * 1 bar, bounds the species (see test_input.c below_boltzmann_limit) */
    ck_assert(molq_species_t_min(h2o) > 0.5 && molq_species_t_min(h2o) < 1.0);
    ck_assert(isfinite(tu_eval(h2o, 20.0, 1e5, MOLQ_CP)));
    ck_assert_int_eq(molq_eval(h2o, 1e-3, 1e5, MOLQ_S, &v), MOLQ_ERANGE);
    ck_assert(isfinite(tu_eval_kind(h2o, MOLQ_MODE_ROTATION, 1e-3, MOLQ_S)));
    /* at 1 K only 0_00 (para) is populated: the rotational entropy on the
     * conventional scale is R ln(1/4) */
    ck_assert_close(tu_eval_kind(h2o, MOLQ_MODE_ROTATION, 1.0, MOLQ_S),
                    T_R * log(0.25), 1e-9, 0.0);
}
END_TEST

/* Class weights that do not average to 1/sigma cannot meet the corrected
 * rotor at high T (each class holds a quarter of the levels there): refused,
 * naming the field (found by fuzzing as a negative cp in the hand-over). */
START_TEST(weights_must_average_to_inverse_sigma)
{
    static const char *const bad =
        "{\"species\": [{\"name\": \"t\", \"molar_mass\": 20,"
        " \"structure\": \"nonlinear\", \"rotational_constants\": [12, 8, 5],"
        " \"rotational_weights\": {\"ee\": 1e-30, \"eo\": 1, \"oe\": 0.03,"
        " \"oo\": 9.285}}]}";
    char err[256];
    molq_db *db = NULL;
    ck_assert_int_eq(molq_db_read_string(bad, strlen(bad), &db, err,
                                         sizeof err),
                     MOLQ_EVALUE);
    ck_assert_ptr_null(db);
    ck_assert_ptr_nonnull(strstr(err, "'rotational_weights'"));
    ck_assert_ptr_nonnull(strstr(err, "1/symmetry_number"));
}
END_TEST

int main(void)
{
    Suite *s = suite_create("top");
    TCase *tc = tcase_create("top");
    tcase_set_timeout(tc, 120);
    tcase_add_test(tc, symmetric_top_exact);
    tcase_add_test(tc, asymmetric_top_low_levels);
    tcase_add_test(tc, low_temperature_water);
    tcase_add_test(tc, weights_must_average_to_inverse_sigma);
    suite_add_tcase(s, tc);
    return tu_run(s);
}
