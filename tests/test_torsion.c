/* Hindered internal rotation (torsion mode of MOLQ_MODEL_LEVELS): its two
 * limits and a published value.
 *  - Free rotor (no barrier): q = (1/sigma) sum_m exp(-F m^2 hc/kT), the
 *    textbook free internal rotor, summed directly here.
 *  - High barrier: V(phi) = (V/2)(1 - cos n phi) turns the Schroedinger
 *    equation into Mathieu's equation, E = V/2 + (F n^2/4) a(Q) with
 *    Q = V/(F n^2); the asymptotic characteristic values (Abramowitz &
 *    Stegun, Handbook of Mathematical Functions, 20.2.30; from memory)
 *      a = -2Q + 2s sqrt(Q) - (s^2+1)/8 - (s^3+3s)/(128 sqrt(Q))
 *          - (5s^4+34s^2+9)/(4096 Q),  s = 2v + 1,
 *    give E_v = w (v + 1/2) - (F n^2/16)(2v^2 + 2v + 1) - ..., w = n
 *    sqrt(F V): a harmonic oscillator and its anharmonic corrections; each
 *    level is n-fold (one per well), so q = sum_v exp(-E_v/kT) after
 *    division by sigma = n.
 *  - Ethane: S(298.15) = 229.16 +/- 0.10 and Cp(298.15) = 52.49 J/(mol K),
 *    Gurvich et al., Thermodynamic Properties of Individual Substances (as
 *    quoted by NIST CCCBDB; verified).  The rigid-rotor/harmonic model with
 *    the 289 cm^-1 torsion as a vibration gives 228.42 and 51.21. */
#include <stdlib.h>
#include <string.h>

#include "testutil.h"

/* Invented test rotors on an invented carrier molecule. */
static const char *const js =
    "{\"species\": ["
    "{\"name\": \"free\", \"molar_mass\": 30, \"structure\": \"nonlinear\","
    " \"rotational_constants\": [3, 2, 1],"
    " \"torsions\": [{\"rotational_constant\": 5, \"symmetry_number\": 3}]},"
    "{\"name\": \"stiff\", \"molar_mass\": 30, \"structure\": \"nonlinear\","
    " \"rotational_constants\": [3, 2, 1],"
    " \"torsions\": [{\"rotational_constant\": 5, \"symmetry_number\": 3,"
    " \"barrier\": [{\"n\": 3, \"V\": 20000}]}]}]}";

/* ln q, u/RT and cv/R of a level list (cm^-1), lowest level as zero. */
static void level_sum(const double *e, size_t n, double T, double sigma,
                      double out[3])
{
    double q = 0, m1 = 0, m2 = 0;
    size_t i;
    for (i = 0; i < n; i++) {
        double y = T_C2 * (e[i] - e[0]) / T, w = exp(-y);
        q += w;
        m1 += w * y;
        m2 += w * y * y;
    }
    out[0] = log(q / sigma);
    out[1] = m1 / q;
    out[2] = m2 / q - (m1 / q) * (m1 / q);
}

static void check_mode(const molq_species *sp, double T, const double ref[3],
                       double tol)
{
    size_t it = tu_mode_index(sp, MOLQ_MODE_TORSION);
    double lnq, u, cv;
    ck_assert_int_eq(molq_eval_mode(sp, it, T, 1e5, MOLQ_LNQ, &lnq), MOLQ_OK);
    ck_assert_int_eq(molq_eval_mode(sp, it, T, 1e5, MOLQ_U, &u), MOLQ_OK);
    ck_assert_int_eq(molq_eval_mode(sp, it, T, 1e5, MOLQ_CV, &cv), MOLQ_OK);
    ck_assert_msg(fabs(lnq - ref[0]) <= tol * fmax(1, fabs(ref[0])),
                  "lnq at %g K: %.12g vs %.12g", T, lnq, ref[0]);
    ck_assert_msg(fabs(u / (T_R * T) - ref[1]) <= tol * fmax(1e-3, ref[1]),
                  "u/RT at %g K: %.12g vs %.12g", T, u / (T_R * T), ref[1]);
    ck_assert_msg(fabs(cv / T_R - ref[2]) <= tol * fmax(1e-3, ref[2]),
                  "cv/R at %g K: %.12g vs %.12g", T, cv / T_R, ref[2]);
}

START_TEST(free_rotor_limit)
{
    molq_db *db;
    const molq_species *sp;
    static double e[8001];
    static const double temps[] = {5.0, 20.0, 100.0, 500.0, 3000.0};
    size_t i, k = 0;
    tu_from_json(js, &db);
    ck_assert_int_eq(molq_db_find(db, "free", &sp), MOLQ_OK);
    e[k++] = 0.0;
    for (i = 1; i <= 4000; i++) {
        e[k++] = 5.0 * i * i;
        e[k++] = 5.0 * i * i;
    }
    for (i = 0; i < 5; i++) {
        double ref[3];
        level_sum(e, k, temps[i], 3.0, ref);
        check_mode(sp, temps[i], ref, 1e-9);
    }
    molq_db_free(db);
}
END_TEST

START_TEST(high_barrier_limit)
{
    molq_db *db;
    const molq_species *sp;
    const double F = 5.0, V = 20000.0, n = 3.0, w = n * sqrt(F * V);
    static const double temps[] = {150.0, 300.0, 600.0};
    double e[12];
    size_t i, v;
    tu_from_json(js, &db);
    ck_assert_int_eq(molq_db_find(db, "stiff", &sp), MOLQ_OK);
    const double Q = V / (F * n * n);
    (void)w;
    for (v = 0; v < 12; v++) {
        double s = 2.0 * v + 1.0;
        double a = -2 * Q + 2 * s * sqrt(Q) - (s * s + 1) / 8 -
                   (s * s * s + 3 * s) / (128 * sqrt(Q)) -
                   (5 * pow(s, 4) + 34 * s * s + 9) / (4096 * Q);
        e[v] = V / 2 + F * n * n / 4 * a;
    }
    for (i = 0; i < 3; i++) {
        double ref[3];
        level_sum(e, 12, temps[i], 1.0, ref);
        /* the series' next term is below 0.01 cm^-1 for the populated v */
        check_mode(sp, temps[i], ref, 1e-4);
    }
    molq_db_free(db);
}
END_TEST

START_TEST(ethane_published)
{
    const molq_species *lv = tu_species("C2H6");
    const molq_species *rr = tu_species_model("C2H6", MOLQ_MODEL_RRHO);
    double s = tu_eval(lv, 298.15, 1e5, MOLQ_S);
    double cp = tu_eval(lv, 298.15, 1e5, MOLQ_CP);
    ck_assert_int_eq(molq_species_model(lv), MOLQ_MODEL_LEVELS);
    ck_assert_msg(fabs(s - 229.16) <= 0.10, "s %.4f vs Gurvich 229.16", s);
    ck_assert_msg(fabs(cp - 52.49) <= 0.10, "cp %.4f vs Gurvich 52.49", cp);
    /* the hindered rotor is what closes the gap */
    ck_assert(fabs(tu_eval(rr, 298.15, 1e5, MOLQ_S) - 229.16) > 0.5);
    ck_assert(fabs(tu_eval(rr, 298.15, 1e5, MOLQ_CP) - 52.49) > 1.0);
    /* [Gurvich] H(298.15) - H(0) = 11.88 kJ/mol (verified) */
    ck_assert_msg(fabs(tu_eval(lv, 298.15, 1e5, MOLQ_H_MINUS_H0) - 11880) <=
                      30,
                  "h - h0 = %g", tu_eval(lv, 298.15, 1e5, MOLQ_H_MINUS_H0));
}
END_TEST

int main(void)
{
    Suite *s = suite_create("torsion");
    TCase *tc = tcase_create("torsion");
    tcase_set_timeout(tc, 120);
    tcase_add_test(tc, free_rotor_limit);
    tcase_add_test(tc, high_barrier_limit);
    tcase_add_test(tc, ethane_published);
    suite_add_tcase(s, tc);
    return tu_run(s);
}
