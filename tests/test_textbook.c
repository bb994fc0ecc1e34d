/* Textbook formulas of ideal-gas statistical mechanics, written out
 * independently here and compared with molq.  Sources: the standard results
 * of statistical thermodynamics (Sackur-Tetrode equation; rigid-rotor and
 * harmonic-oscillator partition functions; Einstein heat-capacity function;
 * equipartition limits) -- common practice, no single source. */
#include <stdio.h>
#include <stdlib.h>

#include "testutil.h"

static const double temps[] = {10.0, 50.0, 100.0, 298.15, 1000.0, 3000.0,
                               1e4, 5e4};
#define NT (sizeof temps / sizeof temps[0])

/* Sackur-Tetrode: S = R [ ln((2 pi m k T / h^2)^{3/2} kT/p) + 5/2 ]. */
START_TEST(sackur_tetrode_argon)
{
    const molq_species *ar = tu_species("Ar");
    const double M = 39.948e-3; /* kg/mol, JANAF 1998 molar mass of Ar */
    const double m = M / T_NA;
    const double ps[] = {1e3, 1e5, 1e7};
    size_t i, j;
    for (i = 0; i < NT; i++)
        for (j = 0; j < 3; j++) {
            double T = temps[i], p = ps[j];
            double lam = 2.0 * T_PI * m * T_K * T / (T_H * T_H);
            double s = T_R * (1.5 * log(lam) + log(T_K * T / p) + 2.5);
            ck_assert_close(tu_eval(ar, T, p, MOLQ_S), s, 1e-13, 0.0);
            ck_assert_close(tu_eval(ar, T, p, MOLQ_CP), 2.5 * T_R, 1e-14, 0.0);
            ck_assert_close(tu_eval(ar, T, p, MOLQ_CV), 1.5 * T_R, 1e-14, 0.0);
        }
}
END_TEST

/* Invented test molecules (not real species): constants chosen so that the
 * limits are reached at the temperatures used. */
static const char *const demo_json =
    "{\"species\": ["
    "{\"name\": \"lin\", \"molar_mass\": 30, \"structure\": \"linear\","
    " \"symmetry_number\": 1, \"rotational_constants\": [1.5]},"
    "{\"name\": \"top\", \"molar_mass\": 30, \"structure\": \"nonlinear\","
    " \"symmetry_number\": 2, \"rotational_constants\": [10, 5, 3]},"
    "{\"name\": \"vib\", \"molar_mass\": 40, \"structure\": \"nonlinear\","
    " \"symmetry_number\": 1, \"rotational_constants\": [3, 2, 1],"
    " \"vibrations\": [{\"wavenumber\": 50, \"degeneracy\": 2},"
    "                  {\"wavenumber\": 120}]},"
    "{\"name\": \"linc\", \"molar_mass\": 30, \"structure\": \"linear\","
    " \"symmetry_number\": 2, \"rotational_constants\": [1.5],"
    " \"rotor\": \"classical\"}"
    "]}";

static molq_db *demo;

static void demo_setup(void)
{
    char err[512];
    ck_assert_msg(molq_db_read_string(demo_json, strlen(demo_json), &demo,
                                      err, sizeof err) == MOLQ_OK, "%s", err);
}

static void demo_teardown(void)
{
    molq_db_free(demo);
    demo = NULL;
}

static const molq_species *demo_sp(const char *name)
{
    const molq_species *sp;
    ck_assert_int_eq(molq_db_find(demo, name, &sp), MOLQ_OK);
    return sp;
}

/* Equipartition: cv -> 3/2 R (atom), 5/2 R (linear), 3 R (nonlinear), plus R
 * per fully excited vibrational mode (counting degeneracy). */
START_TEST(high_temperature_limits)
{
    double T = 1e6; /* theta/T <= 2e-4 for every mode here */
    ck_assert_close(tu_eval(tu_species("Ar"), T, 1e5, MOLQ_CV), 1.5 * T_R,
                    1e-14, 0.0);
    ck_assert_close(tu_eval(demo_sp("lin"), T, 1e5, MOLQ_CV), 2.5 * T_R,
                    1e-8, 0.0);
    ck_assert_close(tu_eval(demo_sp("linc"), T, 1e5, MOLQ_CV), 2.5 * T_R,
                    1e-14, 0.0);
    ck_assert_close(tu_eval(demo_sp("top"), T, 1e5, MOLQ_CV), 3.0 * T_R,
                    1e-8, 0.0);
    /* 3 vibrational modes (one doubly degenerate): x^2/12 correction ~ 1e-9 */
    ck_assert_close(tu_eval(demo_sp("vib"), T, 1e5, MOLQ_CV), 6.0 * T_R,
                    1e-8, 0.0);
    /* cp - cv = R for an ideal gas */
    ck_assert_close(tu_eval(demo_sp("vib"), 500.0, 1e5, MOLQ_CP) -
                        tu_eval(demo_sp("vib"), 500.0, 1e5, MOLQ_CV),
                    T_R, 1e-12, 0.0);
}
END_TEST

/* Einstein function: a harmonic mode of temperature Theta has
 * cv/R = x^2 e^x / (e^x - 1)^2, u/RT = x/(e^x - 1),
 * s/R = x/(e^x - 1) - ln(1 - e^-x). */
START_TEST(harmonic_mode_curves)
{
    const molq_species *sp = tu_species_model("N2", MOLQ_MODEL_RRHO);
    size_t iv = tu_mode_index(sp, MOLQ_MODE_VIBRATION);
    double theta = T_C2 * 2329.915; /* N2 fundamental in data/species */
    double T;
    for (T = 20.0; T < 2e5; T *= 1.3) {
        double x = theta / T, cv, u, s;
        double ex = exp(x);
        ck_assert_int_eq(molq_eval_mode(sp, iv, T, 1e5, MOLQ_CV, &cv),
                         MOLQ_OK);
        ck_assert_int_eq(molq_eval_mode(sp, iv, T, 1e5, MOLQ_U, &u), MOLQ_OK);
        ck_assert_int_eq(molq_eval_mode(sp, iv, T, 1e5, MOLQ_S, &s), MOLQ_OK);
        if (x < 700) {
            ck_assert_close(cv, T_R * x * x * ex / ((ex - 1) * (ex - 1)),
                            1e-12, 1e-300);
            ck_assert_close(u, T_R * T * x / (ex - 1), 1e-12, 1e-300);
            ck_assert_close(s, T_R * (x / (ex - 1) - log1p(-1 / ex)), 1e-11,
                            1e-300);
        }
    }
}
END_TEST

/* The corrected linear rotor against the exact rigid-rotor sum
 * q = sum (2J+1) exp(-J(J+1) theta/T), heteronuclear (sigma = 1). */
START_TEST(linear_rotor_exact_sum)
{
    const molq_species *sp = demo_sp("lin");
    size_t ir = tu_mode_index(sp, MOLQ_MODE_ROTATION);
    double theta = T_C2 * 1.5, T;
    for (T = 0.3; T < 3000.0; T *= 1.17) {
        double q = 0, e1 = 0, lnq, u;
        int J;
        for (J = 0; J < 20000; J++) {
            double w = (2 * J + 1) * exp(-J * (J + 1.0) * theta / T);
            q += w;
            e1 += w * J * (J + 1.0) * theta;
        }
        ck_assert_int_eq(molq_eval_mode(sp, ir, T, 1e5, MOLQ_LNQ, &lnq),
                         MOLQ_OK);
        ck_assert_int_eq(molq_eval_mode(sp, ir, T, 1e5, MOLQ_U, &u), MOLQ_OK);
        /* Expansion truncation above 20 theta: < 1e-11 relative in q. */
        ck_assert_close(lnq, log(q), 1e-11, 1.0);
        ck_assert_close(u, T_R * e1 / q, 1e-10, T_R * T * 1e-3);
    }
}
END_TEST

/* Exact symmetric-top levels E = B J(J+1) + (A - B) K^2 (prolate, A > B = C)
 * against the corrected asymmetric-top formula, where it is documented to
 * hold: error in q below 0.3 % at T = theta_A, falling as (theta_A/T)^2. */
START_TEST(symmetric_top_correction)
{
    static const char *js =
        "{\"species\": [{\"name\": \"prolate\", \"molar_mass\": 20,"
        " \"structure\": \"nonlinear\", \"rotational_constants\": [5, 1, 1]}]}";
    molq_db *db;
    const molq_species *sp = tu_from_json(js, &db);
    size_t ir = tu_mode_index(sp, MOLQ_MODE_ROTATION);
    double tA = 5 * T_C2, tB = T_C2, T;
    double mult[] = {1.0, 2.0, 5.0, 20.0};
    size_t i;
    for (i = 0; i < 4; i++) {
        double q = 0.0, lnq;
        int J, K;
        T = tA * mult[i];
        for (J = 0; J < 400; J++)
            for (K = 0; K <= J; K++) {
                double E = tB * J * (J + 1.0) + (tA - tB) * K * K;
                q += (2 * J + 1) * (K ? 2 : 1) * exp(-E / T);
            }
        ck_assert_int_eq(molq_eval_mode(sp, ir, T, 1e5, MOLQ_LNQ, &lnq),
                         MOLQ_OK);
        ck_assert_msg(fabs(lnq - log(q)) < 0.003 / (mult[i] * mult[i]),
                      "T = %g theta_A: ln q %g vs exact %g", mult[i], lnq,
                      log(q));
    }
    /* Below theta_A the model reports its range instead of a number. */
    ck_assert_double_eq_tol(molq_species_t_min(sp), tA, 1e-12 * tA);
    {
        double v = 42.0;
        ck_assert_int_eq(molq_eval(sp, 0.5 * tA, 1e5, MOLQ_CP, &v),
                         MOLQ_ERANGE);
        ck_assert_double_eq(v, 42.0);
    }
    molq_db_free(db);
}
END_TEST

/* Classical rotor exactly as textbook formulas write it:
 * linear q = T/(sigma theta), so s_rot = R (ln q + 1), cv_rot = R. */
START_TEST(classical_rotor_formula)
{
    const molq_species *sp = demo_sp("linc");
    size_t ir = tu_mode_index(sp, MOLQ_MODE_ROTATION);
    double theta = T_C2 * 1.5, T;
    for (T = 1.0; T < 1e5; T *= 3.7) {
        double s, cv;
        ck_assert_int_eq(molq_eval_mode(sp, ir, T, 1e5, MOLQ_S, &s), MOLQ_OK);
        ck_assert_int_eq(molq_eval_mode(sp, ir, T, 1e5, MOLQ_CV, &cv), MOLQ_OK);
        ck_assert_close(s, T_R * (log(T / (2 * theta)) + 1.0), 1e-13, T_R);
        ck_assert_close(cv, T_R, 1e-15, 0.0);
    }
}
END_TEST

/* Mode contributions add up to the species' values. */
START_TEST(modes_add_up)
{
    const molq_species *sp = tu_species("O2");
    double T = 1234.5, p = 2.5e5;
    const molq_property props[] = {MOLQ_LNQ, MOLQ_CV, MOLQ_S, MOLQ_DCV_DT};
    size_t k, i;
    for (k = 0; k < 4; k++) {
        double sum = 0.0, v;
        for (i = 0; i < molq_species_mode_count(sp); i++) {
            ck_assert_int_eq(molq_eval_mode(sp, i, T, p, props[k], &v),
                             MOLQ_OK);
            sum += v;
        }
        ck_assert_close(sum, tu_eval(sp, T, p, props[k]), 1e-13, 1e-9);
    }
    {
        double sum = 0.0, v;
        for (i = 0; i < molq_species_mode_count(sp); i++) {
            ck_assert_int_eq(molq_eval_mode(sp, i, T, p, MOLQ_U, &v), MOLQ_OK);
            sum += v;
        }
        ck_assert_close(sum + T_R * T, tu_eval(sp, T, p, MOLQ_H_MINUS_H0),
                        1e-13, 0.0);
    }
}
END_TEST

int main(void)
{
    Suite *s = suite_create("textbook");
    TCase *tc = tcase_create("formulas");
    tcase_add_checked_fixture(tc, demo_setup, demo_teardown);
    tcase_add_test(tc, sackur_tetrode_argon);
    tcase_add_test(tc, high_temperature_limits);
    tcase_add_test(tc, harmonic_mode_curves);
    tcase_add_test(tc, linear_rotor_exact_sum);
    tcase_add_test(tc, symmetric_top_correction);
    tcase_add_test(tc, classical_rotor_formula);
    tcase_add_test(tc, modes_add_up);
    suite_add_tcase(s, tc);
    return tu_run(s);
}
