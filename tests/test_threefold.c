/* Nuclear-spin statistics of tops with a threefold axis (exact rigid-top
 * levels of the levels model).
 *
 * References used below:
 *  - Rigid symmetric and spherical top term values, E = B J(J+1) +
 *    (A_fig - B) K^2 and E = B J(J+1): textbook closed forms (e.g. Townes &
 *    Schawlow, Microwave Spectroscopy, ch. 3-4; from memory).
 *  - Spherical tops (Td): the (2J+1) K states of J split into the species
 *    of the rotation group T as J = 0: A; 1: F; 2: E + F; 3: A + 2F;
 *    4: A + E + 2F; 5: E + 3F; 6: 2A + E + 3F (Herzberg, Infrared and Raman
 *    Spectra of Polyatomic Molecules, 1945; from memory -- the dimensions
 *    add up to 2J + 1 in every row).  Nuclear-spin weights of A, E, F
 *    levels: 5, 2, 3 for four protons (CH4), 15, 12, 18 for four deuterons
 *    (CD4) (same source; from memory).
 *  - Symmetric tops (C3v): levels with K = 0 mod 3 weigh twice those with
 *    other K for three protons (NH3), 11 : 8 for three deuterons (ND3)
 *    (Herzberg; from memory).
 *  - Conventional scale: weights divided by the (2I+1)^N nuclear-spin
 *    states, so they average to 1/sigma at high T (common practice).
 *  - NH3 S(298.15 K) 192.77 +/- 0.05 J/(mol K) (CODATA Key Values, via NIST
 *    CCCBDB; verified) and Cp 35.63 (Gurvich, via CCCBDB; verified).  CH4
 *    S(298.15 K) 186.25 (NIST-JANAF 1998; from memory). */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "testutil.h"

static double rot_prop(const molq_species *sp, double T, molq_property p)
{
    return tu_eval_kind(sp, MOLQ_MODE_ROTATION, T, p);
}

/* Invented test molecules. */
static const char *const js =
    "{\"species\": ["
    "{\"name\": \"tetra-H\", \"molar_mass\": 16, \"structure\": \"nonlinear\","
    " \"symmetry_number\": 12, \"rotational_constants\": [5, 5, 5],"
    " \"rotational_spin\": {\"group\": \"Td\", \"nuclear_spin\": 0.5}},"
    "{\"name\": \"tetra-D\", \"molar_mass\": 20, \"structure\": \"nonlinear\","
    " \"symmetry_number\": 12, \"rotational_constants\": [2.6, 2.6, 2.6],"
    " \"rotational_spin\": {\"group\": \"Td\", \"nuclear_spin\": 1}},"
    "{\"name\": \"oblate-H\", \"molar_mass\": 17, \"structure\": \"nonlinear\","
    " \"symmetry_number\": 3, \"rotational_constants\": [10, 10, 6],"
    " \"rotational_spin\": {\"group\": \"C3v\", \"nuclear_spin\": 0.5}},"
    "{\"name\": \"prolate-D\", \"molar_mass\": 34, \"structure\": \"nonlinear\","
    " \"symmetry_number\": 3, \"rotational_constants\": [4, 0.7, 0.7],"
    " \"rotational_spin\": {\"group\": \"C3v\", \"nuclear_spin\": 1}}]}";

/* Species of T in each J (counts of A, E, F), J = 0..6. */
static const int td_species[7][3] = {{1, 0, 0}, {0, 0, 1}, {0, 1, 1},
                                     {1, 0, 2}, {1, 1, 2}, {0, 1, 3},
                                     {2, 1, 3}};

static double td_sum(double B, const double g[3], double nspin, double T)
{
    double q = 0.0;
    int J;
    for (J = 0; J <= 6; J++) {
        double w = td_species[J][0] * g[0] + td_species[J][1] * g[1] +
                   td_species[J][2] * g[2];
        ck_assert_int_eq(td_species[J][0] + 2 * td_species[J][1] +
                             3 * td_species[J][2],
                         2 * J + 1);
        q += (2 * J + 1) * w / nspin * exp(-T_C2 * B * J * (J + 1.0) / T);
    }
    return q;
}

START_TEST(spherical_top_weights)
{
    static const struct {
        const char *name;
        double B, g[3], nspin;
    } c[] = {{"tetra-H", 5.0, {5, 2, 3}, 16.0},
             {"tetra-D", 2.6, {15, 12, 18}, 81.0}};
    const double temps[] = {0.5, 2.0, 5.0, 8.0};
    molq_db *db;
    size_t k, i;
    tu_from_json(js, &db);
    for (k = 0; k < 2; k++) {
        const molq_species *sp;
        ck_assert_int_eq(molq_db_find(db, c[k].name, &sp), MOLQ_OK);
        /* J = 7 lies at 56 B: below 1e-16 of q at the highest T here */
        for (i = 0; i < 4; i++)
            ck_assert_close(rot_prop(sp, temps[i], MOLQ_LNQ),
                            log(td_sum(c[k].B, c[k].g, c[k].nspin, temps[i])),
                            1e-9, 1.0);
        /* T -> 0: only J = 0 (species A) remains, entropy R ln(g_A/n^4) */
        ck_assert_close(rot_prop(sp, 0.2, MOLQ_S),
                        T_R * log(c[k].g[0] / c[k].nspin), 1e-9, 0.0);
    }
    molq_db_free(db);
}
END_TEST

START_TEST(symmetric_top_weights)
{
    /* g(K = 0 mod 3), g(other K), per |J K> state, out of (2I+1)^3 */
    static const struct {
        const char *name;
        double bbar, fig, g0, g1, nspin;
    } c[] = {{"oblate-H", 10.0, 6.0, 4.0, 2.0, 8.0},
             {"prolate-D", 0.7, 4.0, 11.0, 8.0, 27.0}};
    const double temps[] = {1.0, 5.0, 20.0, 60.0};
    molq_db *db;
    size_t k, i;
    tu_from_json(js, &db);
    for (k = 0; k < 2; k++) {
        const molq_species *sp;
        /* published ratios 2:1 and 11:8, normalised so that the weights
         * average to 1/3 */
        ck_assert_double_eq_tol((c[k].g0 + 2 * c[k].g1) / 3 / c[k].nspin,
                                1.0 / 3.0, 1e-15);
        ck_assert_int_eq(molq_db_find(db, c[k].name, &sp), MOLQ_OK);
        for (i = 0; i < 4; i++) {
            double q = 0.0, T = temps[i];
            int J, K;
            for (J = 0; J < 400; J++)
                for (K = 0; K <= J; K++) {
                    double E = T_C2 * (c[k].bbar * J * (J + 1.0) +
                                       (c[k].fig - c[k].bbar) * K * K);
                    double g = (K % 3 ? c[k].g1 : c[k].g0) / c[k].nspin;
                    if (E / T < 700)
                        q += (2 * J + 1) * (K ? 2 : 1) * g * exp(-E / T);
                }
            ck_assert_close(rot_prop(sp, T, MOLQ_LNQ), log(q), 1e-9, 1.0);
        }
        ck_assert_close(rot_prop(sp, 0.05, MOLQ_S),
                        T_R * log(c[k].g0 / c[k].nspin), 1e-9, 0.0);
    }
    molq_db_free(db);
}
END_TEST

/* At high T the spin weights average to 1/sigma: the exact top meets the
 * corrected rotor (the rrho variant), with a residual of that formula's
 * truncation that falls as (theta/T)^2 or faster (between the second and
 * third power here) -- a wrong weight would leave a constant offset.  Both temperatures lie below the hand-over (30 theta_A),
 * where the exact levels are used. */
START_TEST(high_temperature_limit)
{
    static const char *const names[] = {"tetra-H", "tetra-D", "oblate-H",
                                        "prolate-D"};
    static const double a[] = {5.0, 2.6, 10.0, 4.0};
    molq_db *db;
    size_t k;
    tu_from_json(js, &db);
    for (k = 0; k < 4; k++) {
        const molq_species *sp;
        molq_species *rr;
        char err[160];
        double t1 = 8.0 * T_C2 * a[k], d1, d2;
        ck_assert_int_eq(molq_db_find(db, names[k], &sp), MOLQ_OK);
        ck_assert_int_eq(molq_species_with_model(sp, MOLQ_MODEL_RRHO, &rr, err,
                                                 sizeof err),
                         MOLQ_OK);
        d1 = rot_prop(sp, t1, MOLQ_LNQ) - rot_prop(rr, t1, MOLQ_LNQ);
        d2 = rot_prop(sp, 2 * t1, MOLQ_LNQ) - rot_prop(rr, 2 * t1, MOLQ_LNQ);
        ck_assert_msg(fabs(d1) < 2e-3, "%s: difference %g", names[k], d1);
        ck_assert_msg(fabs(d1) < 1e-9 || d1 / d2 > 3.4,
                      "%s: differences %g and %g do not fall as 1/T^2",
                      names[k], d1, d2);
        molq_species_free(rr);
    }
    molq_db_free(db);
}
END_TEST

/* Built-in NH3 and CH4 at 298.15 K.  At this temperature the spin
 * statistics have reached their 1/sigma limit; what remains is the rigid
 * C3v model of NH3 (the inversion doubling of nu2 is not treated) and the
 * harmonic vibrations: the tolerances state the reach of that model. */
START_TEST(standard_values_298)
{
    const molq_species *nh3 = tu_species("NH3"), *ch4 = tu_species("CH4");
    double s = tu_eval(nh3, 298.15, 1e5, MOLQ_S);
    double cp = tu_eval(nh3, 298.15, 1e5, MOLQ_CP);
    ck_assert_msg(fabs(s - 192.77) < 0.10, "NH3 s %.4f vs CODATA 192.77", s);
    ck_assert_msg(fabs(cp - 35.63) < 0.2, "NH3 cp %.4f vs Gurvich 35.63", cp);
    s = tu_eval(ch4, 298.15, 1e5, MOLQ_S);
    ck_assert_msg(fabs(s - 186.25) < 0.10, "CH4 s %.4f vs JANAF 186.25", s);
    /* the spin group belongs to the levels model; rrho gives the same
     * entropy at 298.15 K (1/sigma limit) to the corrected rotor's
     * residual */
    ck_assert_close(tu_eval(tu_species_model("CH4", MOLQ_MODEL_RRHO), 298.15,
                            1e5, MOLQ_S),
                    s, 1e-5, 0.0);
}
END_TEST

/* Bad input: errors name the field. */
START_TEST(bad_input)
{
    static const struct {
        const char *body, *field;
        molq_status st;
    } c[] = {
        {"\"symmetry_number\": 2, \"rotational_constants\": [5, 5, 5],"
         " \"rotational_spin\": {\"group\": \"Td\", \"nuclear_spin\": 0.5}",
         "symmetry_number", MOLQ_EVALUE},
        {"\"symmetry_number\": 12, \"rotational_constants\": [5, 5, 4],"
         " \"rotational_spin\": {\"group\": \"Td\", \"nuclear_spin\": 0.5}",
         "rotational_constants", MOLQ_EVALUE},
        {"\"symmetry_number\": 3, \"rotational_constants\": [6, 5, 4],"
         " \"rotational_spin\": {\"group\": \"C3v\", \"nuclear_spin\": 0.5}",
         "rotational_constants", MOLQ_EVALUE},
        {"\"symmetry_number\": 3, \"rotational_constants\": [5, 5, 4],"
         " \"rotational_spin\": {\"group\": \"C3v\", \"nuclear_spin\": 0.3}",
         "rotational_spin.nuclear_spin", MOLQ_EVALUE},
        {"\"symmetry_number\": 3, \"rotational_constants\": [5, 5, 4],"
         " \"rotational_spin\": {\"group\": \"C3v\", \"nuclear_spin\": -1}",
         "rotational_spin.nuclear_spin", MOLQ_EVALUE},
        {"\"symmetry_number\": 3, \"rotational_constants\": [5, 5, 4],"
         " \"rotational_spin\": {\"group\": \"D3h\", \"nuclear_spin\": 0.5}",
         "rotational_spin.group", MOLQ_EVALUE},
        {"\"symmetry_number\": 3, \"rotational_constants\": [5, 5, 4],"
         " \"rotational_spin\": {\"group\": \"C3v\"}",
         "rotational_spin.nuclear_spin", MOLQ_EKEY},
        {"\"symmetry_number\": 3, \"rotational_constants\": [5, 5, 4],"
         " \"rotational_spin\": {\"group\": \"C3v\", \"nuclear_spin\": 0.5,"
         " \"spin\": 1}",
         "rotational_spin.spin", MOLQ_EKEY},
        {"\"symmetry_number\": 3, \"rotational_constants\": [5, 5, 4],"
         " \"rotational_spin\": {\"group\": \"C3v\", \"nuclear_spin\": 0.5},"
         " \"rotational_weights\": {\"ee\": 0.5, \"eo\": 0.25,"
         " \"oe\": 0.25, \"oo\": 0.3333333333333333}",
         "rotational_spin", MOLQ_EVALUE},
    };
    size_t i;
    for (i = 0; i < sizeof c / sizeof c[0]; i++) {
        char json[512], err[256];
        molq_db *db = NULL;
        molq_status st;
        snprintf(json, sizeof json,
                 "{\"species\": [{\"name\": \"bad\", \"molar_mass\": 17,"
                 " \"structure\": \"nonlinear\", %s}]}",
                 c[i].body);
        st = molq_db_read_string(json, strlen(json), &db, err, sizeof err);
        ck_assert_msg(st == c[i].st, "case %zu: status %d, '%s'", i, (int)st,
                      err);
        ck_assert_ptr_null(db);
        ck_assert_msg(strstr(err, c[i].field) != NULL,
                      "case %zu: '%s' does not name '%s'", i, err,
                      c[i].field);
    }
    /* and through the C API */
    {
        molq_spec *spec;
        molq_species *sp = NULL;
        char err[256];
        const double abc[3] = {5, 5, 5};
        ck_assert_int_eq(molq_spec_set_top_spin_group(NULL,
                                                      MOLQ_SPIN_GROUP_TD, 0.5),
                         MOLQ_EARG);
        ck_assert_int_eq(molq_spec_new("bad", &spec), MOLQ_OK);
        molq_spec_set_molar_mass(spec, 0.016);
        molq_spec_set_structure(spec, MOLQ_NONLINEAR);
        molq_spec_set_symmetry_number(spec, 12);
        molq_spec_set_rotational_constants(spec, abc, 3);
        molq_spec_set_top_spin_group(spec, MOLQ_SPIN_GROUP_TD, NAN);
        ck_assert_int_eq(molq_species_create(spec, &sp, err, sizeof err),
                         MOLQ_EVALUE);
        ck_assert_ptr_null(sp);
        ck_assert_ptr_nonnull(strstr(err, "nuclear_spin"));
        {
            /* 0 is no group, not "none given" (found by fuzzing) */
            const int bad_groups[] = {7, 0, -1};
            size_t k;
            for (k = 0; k < 3; k++) {
                molq_spec_set_top_spin_group(
                    spec, (molq_spin_group)bad_groups[k], 0.5);
                ck_assert_int_eq(
                    molq_species_create(spec, &sp, err, sizeof err),
                    MOLQ_EVALUE);
                ck_assert_ptr_nonnull(strstr(err, "rotational_spin.group"));
            }
        }
        molq_spec_set_top_spin_group(spec, MOLQ_SPIN_GROUP_TD, 0.5);
        ck_assert_int_eq(molq_species_create(spec, &sp, err, sizeof err),
                         MOLQ_OK);
        molq_species_free(sp);
        molq_spec_free(spec);
    }
}
END_TEST

int main(void)
{
    Suite *s = suite_create("threefold");
    TCase *tc = tcase_create("threefold");
    tcase_set_timeout(tc, 120);
    tcase_add_test(tc, spherical_top_weights);
    tcase_add_test(tc, symmetric_top_weights);
    tcase_add_test(tc, high_temperature_limit);
    tcase_add_test(tc, standard_values_298);
    tcase_add_test(tc, bad_input);
    suite_add_tcase(s, tc);
    return tu_run(s);
}
