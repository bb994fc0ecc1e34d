/* The public API as a contract: versions, names, argument checks, status
 * codes and messages for bad input, batch and per-mass paths, and shared
 * species under threads. */
#include <pthread.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "testutil.h"

START_TEST(version_and_names)
{
    size_t i, j, n = molq_property_count();
    ck_assert_uint_eq(molq_version_number(), MOLQ_VERSION_NUMBER);
    ck_assert_str_eq(molq_version_string(), MOLQ_VERSION_STRING);
    ck_assert_uint_ge(n, 16);
    for (i = 0; i < n; i++) {
        molq_property p;
        const char *nm = molq_property_name((molq_property)i);
        ck_assert_ptr_nonnull(nm);
        ck_assert_ptr_nonnull(molq_property_unit((molq_property)i));
        ck_assert_int_eq(molq_property_from_name(nm, &p), MOLQ_OK);
        ck_assert_int_eq(p, (int)i);
        for (j = 0; j < i; j++)
            ck_assert_str_ne(nm, molq_property_name((molq_property)j));
    }
    ck_assert_ptr_null(molq_property_name((molq_property)n));
    ck_assert_ptr_null(molq_property_name((molq_property)-1));
    {
        molq_property p;
        ck_assert_int_eq(molq_property_from_name("enthalpy", &p),
                         MOLQ_ENOTFOUND);
        ck_assert_int_eq(molq_property_from_name(NULL, &p), MOLQ_EARG);
    }
    for (i = 0; i <= MOLQ_ELIMIT; i++)
        ck_assert_str_ne(molq_status_string((molq_status)i), "unknown status");
    ck_assert_str_eq(molq_status_string((molq_status)999), "unknown status");
    ck_assert_str_eq(molq_mode_kind_name(MOLQ_MODE_VIBRATION), "vibration");
    ck_assert_ptr_null(molq_mode_kind_name((molq_mode_kind)99));
}
END_TEST

START_TEST(argument_checks)
{
    const molq_species *n2 = tu_species("N2");
    double v = 7.0, T[3] = {300, 400, 500}, out[3];
    molq_property bad = (molq_property)molq_property_count();
    ck_assert_int_eq(molq_eval(NULL, 300, 1e5, MOLQ_CP, &v), MOLQ_EARG);
    ck_assert_int_eq(molq_eval(n2, 300, 1e5, MOLQ_CP, NULL), MOLQ_EARG);
    ck_assert_int_eq(molq_eval(n2, 300, 1e5, bad, &v), MOLQ_EARG);
    ck_assert_int_eq(molq_eval(n2, 0.0, 1e5, MOLQ_CP, &v), MOLQ_EDOMAIN);
    ck_assert_int_eq(molq_eval(n2, -1.0, 1e5, MOLQ_CP, &v), MOLQ_EDOMAIN);
    ck_assert_int_eq(molq_eval(n2, NAN, 1e5, MOLQ_CP, &v), MOLQ_EDOMAIN);
    ck_assert_int_eq(molq_eval(n2, INFINITY, 1e5, MOLQ_CP, &v), MOLQ_EDOMAIN);
    ck_assert_int_eq(molq_eval(n2, 300, 0.0, MOLQ_CP, &v), MOLQ_EDOMAIN);
    ck_assert_int_eq(molq_eval(n2, 300, -5.0, MOLQ_CP, &v), MOLQ_EDOMAIN);
    ck_assert_int_eq(molq_eval(n2, 300, NAN, MOLQ_CP, &v), MOLQ_EDOMAIN);
    ck_assert_double_eq(v, 7.0); /* untouched on failure */
    ck_assert_int_eq(molq_eval_batch(n2, MOLQ_CP, 1e5, T, 0, out, 1, 3),
                     MOLQ_EARG);
    ck_assert_int_eq(molq_eval_batch(n2, MOLQ_CP, 1e5, NULL, 1, out, 1, 3),
                     MOLQ_EARG);
    ck_assert_int_eq(molq_eval_mode(n2, 99, 300, 1e5, MOLQ_CV, &v), MOLQ_EARG);
    ck_assert_int_eq(molq_eval_mode(n2, 0, 300, 1e5, MOLQ_H, &v), MOLQ_EARG);
    ck_assert_int_eq(molq_db_find(tu_builtin(), "unobtainium", &n2),
                     MOLQ_ENOTFOUND);
    ck_assert_ptr_null(molq_db_species(tu_builtin(), 1000));
    ck_assert_ptr_null(molq_species_name(NULL));
    molq_species_free(NULL);
    molq_db_free(NULL);
    molq_spec_free(NULL);
}
END_TEST

/* Extreme but valid temperatures give finite numbers (or the documented
 * range status for models with a lower limit). */
START_TEST(extreme_temperatures)
{
    const molq_db *db = tu_builtin();
    static const double T[] = {1e-300, 1e-3, 1.0, 1e5, 1e6, 1e12};
    size_t i, k, p;
    for (i = 0; i < molq_db_count(db); i++) {
        const molq_species *sp = molq_db_species(db, i);
        for (k = 0; k < sizeof T / sizeof T[0]; k++)
            for (p = 0; p < molq_property_count(); p++) {
                double v = NAN;
                molq_status st = molq_eval(sp, T[k], 1e5, (molq_property)p,
                                           &v);
                if (T[k] < molq_species_t_min(sp) ||
                    (T[k] < 1e-3 && st == MOLQ_ERANGE)) {
                    /* below a model's range, or a result beyond a double */
                    ck_assert_int_eq(st, MOLQ_ERANGE);
                    ck_assert(isnan(v));
                    continue;
                }
                ck_assert_int_eq(st, MOLQ_OK);
                ck_assert_msg(isfinite(v), "%s %s at %g K is %g",
                              molq_species_name(sp),
                              molq_property_name((molq_property)p), T[k], v);
            }
    }
}
END_TEST

START_TEST(batch_and_per_mass)
{
    const molq_species *sp = tu_species("H2O");
    double T[8], out[16], v;
    size_t i;
    for (i = 0; i < 8; i++)
        T[i] = 300.0 + 417.0 * i;
    ck_assert_int_eq(molq_eval_batch(sp, MOLQ_H, 2e5, T, 1, out, 2, 8),
                     MOLQ_OK);
    for (i = 0; i < 8; i++) {
        ck_assert_double_eq(out[2 * i], tu_eval(sp, T[i], 2e5, MOLQ_H));
    }
    ck_assert_int_eq(molq_eval_batch(sp, MOLQ_H, 2e5, T, 2, out, 1, 4),
                     MOLQ_OK);
    for (i = 0; i < 4; i++)
        ck_assert_double_eq(out[i], tu_eval(sp, T[2 * i], 2e5, MOLQ_H));
    T[3] = -1.0;
    ck_assert_int_eq(molq_eval_batch(sp, MOLQ_H, 2e5, T, 1, out, 1, 8),
                     MOLQ_EDOMAIN);
    ck_assert_int_eq(molq_eval_per_mass(sp, 500, 1e5, MOLQ_CP, &v), MOLQ_OK);
    ck_assert_close(v, tu_eval(sp, 500, 1e5, MOLQ_CP) / 18.0153e-3, 1e-15, 0);
    ck_assert_int_eq(molq_eval_per_mass(sp, 500, 1e5, MOLQ_LNQ, &v), MOLQ_OK);
    /* regression: a NULL out-pointer is MOLQ_EARG, as for molq_eval (it was
     * written through and crashed) */
    ck_assert_int_eq(molq_eval_per_mass(sp, 500, 1e5, MOLQ_CP, NULL),
                     MOLQ_EARG);
    ck_assert_double_eq(v, tu_eval(sp, 500, 1e5, MOLQ_LNQ));
    {
        molq_property props[3] = {MOLQ_S, MOLQ_CP, MOLQ_G};
        double many[3];
        ck_assert_int_eq(molq_eval_many(sp, 777, 1e5, props, 3, many), MOLQ_OK);
        for (i = 0; i < 3; i++)
            ck_assert_double_eq(many[i], tu_eval(sp, 777, 1e5, props[i]));
    }
}
END_TEST

/* Building from constants through the spec API equals reading the file. */
START_TEST(spec_api_matches_file)
{
    molq_spec *s;
    molq_species *sp;
    char err[256];
    double B = 1.922528;
    ck_assert_int_eq(molq_spec_new("CO", &s), MOLQ_OK);
    molq_spec_set_molar_mass(s, 28.0101e-3);
    molq_spec_set_structure(s, MOLQ_LINEAR);
    molq_spec_set_rotational_constants(s, &B, 1);
    molq_spec_add_vibration(s, 2143.271, 1);
    molq_spec_set_formation_enthalpy(s, -110527);
    ck_assert_int_eq(molq_species_create(s, &sp, err, sizeof err), MOLQ_OK);
    molq_spec_free(s);
    ck_assert_double_eq(
        tu_eval(sp, 1500, 1e5, MOLQ_G),
        tu_eval(tu_species_model("CO", MOLQ_MODEL_RRHO), 1500, 1e5, MOLQ_G));
    ck_assert_str_eq(molq_species_name(sp), "CO");
    ck_assert_str_eq(molq_species_formula(sp), "");
    molq_species_free(sp);
}
END_TEST

/* Molar mass from the formula when none is given: IUPAC standard atomic
 * weights (C 12.011, O 15.999, H 1.008; from memory). */
START_TEST(formula_molar_mass)
{
    static const char *js =
        "{\"species\": [{\"name\": \"m\", \"formula\": \"Ca(OH)2\","
        " \"structure\": \"atom\"}, {\"name\": \"e\", \"formula\": \"CH3OH\","
        " \"structure\": \"atom\"}]}";
    molq_db *db;
    char err[256];
    ck_assert_int_eq(molq_db_read_string(js, strlen(js), &db, err, sizeof err),
                     MOLQ_OK);
    ck_assert_close(molq_species_molar_mass(molq_db_species(db, 0)),
                    (40.078 + 2 * (15.999 + 1.008)) * 1e-3, 1e-9, 0);
    ck_assert_close(molq_species_molar_mass(molq_db_species(db, 1)),
                    (12.011 + 4 * 1.008 + 15.999) * 1e-3, 1e-9, 0);
    molq_db_free(db);
}
END_TEST

/* Bad input: status code, and a message naming the species and field. */
static const struct bad {
    const char *json;
    molq_status status;
    const char *must_mention[2];
} bad_inputs[] = {
    {"{\"species\": [ {\"name\": \"A\",, } ]}", MOLQ_ESYNTAX,
     {"line 1", "column"}},
    {"{\"species\": [\n {\"name\": \"A\"\n \"structure\": \"atom\"}]}",
     MOLQ_ESYNTAX, {"line 3", "column"}},
    {"{\"species\": [{\"name\": \"A\", \"molar_mass\": 1e999,"
     " \"structure\": \"atom\"}]}", MOLQ_ESYNTAX, {"line 1", "column"}},
    {"[1, 2]", MOLQ_ETYPE, {"top level", "species"}},
    {"{\"molecules\": []}", MOLQ_EKEY, {"molecules", "unknown"}},
    {"{\"species\": [{\"molar_mass\": 4, \"structure\": \"atom\"}]}",
     MOLQ_EKEY, {"species #1", "'name'"}},
    {"{\"species\": [{\"name\": \"A\", \"molar_mass\": 4}]}", MOLQ_EKEY,
     {"'A'", "'structure'"}},
    {"{\"species\": [{\"name\": \"A\", \"structure\": \"atom\"}]}", MOLQ_EKEY,
     {"'A'", "'molar_mass'"}},
    {"{\"species\": [{\"name\": \"A\", \"molar_mass\": 4, \"structure\":"
     " \"atom\", \"colour\": \"red\"}]}", MOLQ_EKEY, {"'A'", "'colour'"}},
    {"{\"species\": [{\"name\": \"A\", \"molar_mass\": \"4\", \"structure\":"
     " \"atom\"}]}", MOLQ_ETYPE, {"'A'", "'molar_mass'"}},
    {"{\"species\": [{\"name\": \"A\", \"molar_mass\": -4, \"structure\":"
     " \"atom\"}]}", MOLQ_EVALUE, {"'A'", "'molar_mass'"}},
    {"{\"species\": [{\"name\": \"A\", \"molar_mass\": 0, \"structure\":"
     " \"atom\"}]}", MOLQ_EVALUE, {"'A'", "'molar_mass'"}},
    {"{\"species\": [{\"name\": \"B\", \"molar_mass\": 4, \"structure\":"
     " \"linear\", \"symmetry_number\": 0, \"rotational_constants\": [1]}]}",
     MOLQ_EVALUE, {"'B'", "'symmetry_number'"}},
    {"{\"species\": [{\"name\": \"B\", \"molar_mass\": 4, \"structure\":"
     " \"linear\", \"symmetry_number\": 1.5, \"rotational_constants\": [1]}]}",
     MOLQ_ETYPE, {"'B'", "'symmetry_number'"}},
    {"{\"species\": [{\"name\": \"B\", \"molar_mass\": 4, \"structure\":"
     " \"linear\", \"rotational_constants\": [1, 2]}]}", MOLQ_EVALUE,
     {"'B'", "'rotational_constants'"}},
    {"{\"species\": [{\"name\": \"C\", \"molar_mass\": 4, \"structure\":"
     " \"nonlinear\", \"rotational_constants\": [1, 2, 3]}]}", MOLQ_EVALUE,
     {"'C'", "A >= B >= C"}},
    {"{\"species\": [{\"name\": \"C\", \"molar_mass\": 4, \"structure\":"
     " \"nonlinear\", \"rotational_constants\": [3, 2, 0]}]}", MOLQ_EVALUE,
     {"'C'", "rotational_constants[2]"}},
    {"{\"species\": [{\"name\": \"D\", \"molar_mass\": 4, \"structure\":"
     " \"linear\", \"rotational_constants\": [1], \"vibrations\":"
     " [{\"wavenumber\": -300}]}]}", MOLQ_EVALUE,
     {"'D'", "vibrations[0].wavenumber"}},
    {"{\"species\": [{\"name\": \"D\", \"molar_mass\": 4, \"structure\":"
     " \"linear\", \"rotational_constants\": [1], \"vibrations\":"
     " [{\"wavenumber\": 100}, {\"wavenumber\": 0}]}]}", MOLQ_EVALUE,
     {"'D'", "vibrations[1].wavenumber"}},
    {"{\"species\": [{\"name\": \"D\", \"molar_mass\": 4, \"structure\":"
     " \"linear\", \"rotational_constants\": [1], \"vibrations\":"
     " [{\"wavenumber\": 100, \"degeneracy\": 0}]}]}", MOLQ_EVALUE,
     {"'D'", "vibrations[0].degeneracy"}},
    {"{\"species\": [{\"name\": \"E\", \"molar_mass\": 4, \"structure\":"
     " \"atom\", \"electronic_levels\": [{\"energy\": 10}]}]}", MOLQ_EVALUE,
     {"'E'", "electronic_levels"}},
    {"{\"species\": [{\"name\": \"E\", \"molar_mass\": 4, \"structure\":"
     " \"atom\", \"electronic_levels\": [{\"energy\": 0, \"degeneracy\":"
     " -2}]}]}", MOLQ_EVALUE, {"'E'", "electronic_levels[0].degeneracy"}},
    {"{\"species\": [{\"name\": \"F\", \"molar_mass\": 4, \"structure\":"
     " \"atom\"}, {\"name\": \"F\", \"molar_mass\": 5, \"structure\":"
     " \"atom\"}]}", MOLQ_EDUPLICATE, {"'F'", "duplicate"}},
    {"{\"species\": [{\"name\": \"G\", \"molar_mass\": 4, \"structure\":"
     " \"bent\"}]}", MOLQ_EVALUE, {"'G'", "'structure'"}},
    {"{\"species\": [{\"name\": \"H\", \"formula\": \"Xq2\", \"structure\":"
     " \"atom\"}]}", MOLQ_EVALUE, {"'H'", "Xq"}},
    {"{\"species\": [{\"name\": \"I\", \"molar_mass\": 4, \"structure\":"
     " \"atom\", \"vibrations\": [{\"wavenumber\": 100}]}]}", MOLQ_EVALUE,
     {"'I'", "'vibrations'"}},
    {"{\"schema_version\": 2, \"species\": []}", MOLQ_EVALUE,
     {"schema_version", "1"}},
    {"{\"species\": [{\"name\": \"J\", \"molar_mass\": 4, \"structure\":"
     " \"linear\", \"rotational_constants\": [1], \"rotor\": \"wobbly\"}]}",
     MOLQ_EVALUE, {"'J'", "'rotor'"}},
    /* level-sum models: unphysical constants */
    {"{\"species\": [{\"name\": \"K\", \"molar_mass\": 4, \"structure\":"
     " \"linear\", \"dissociation_energy\": -5, \"diatomic_states\":"
     " [{\"Te\": 0, \"we\": 2000, \"Be\": 2}]}]}",
     MOLQ_EVALUE, {"'K'", "'dissociation_energy'"}},
    {"{\"species\": [{\"name\": \"K\", \"molar_mass\": 4, \"structure\":"
     " \"linear\", \"diatomic_states\": [{\"Te\": 0, \"we\": 2000,"
     " \"Be\": 2}]}]}",
     MOLQ_EKEY, {"'K'", "'dissociation_energy'"}},
    {"{\"species\": [{\"name\": \"K\", \"molar_mass\": 4, \"structure\":"
     " \"linear\", \"dissociation_energy\": 1e7, \"diatomic_states\":"
     " [{\"Te\": 0, \"we\": 20, \"Be\": 0.001}]}]}",
     MOLQ_ELIMIT, {"'K'", "turn over"}},
    {"{\"species\": [{\"name\": \"K\", \"molar_mass\": 4, \"structure\":"
     " \"linear\", \"dissociation_energy\": 40000, \"diatomic_states\":"
     " [{\"Te\": 0, \"we\": -2000, \"Be\": 2}]}]}",
     MOLQ_EVALUE, {"'K'", "diatomic_states[0].we"}},
    {"{\"species\": [{\"name\": \"K\", \"molar_mass\": 4, \"structure\":"
     " \"linear\", \"dissociation_energy\": 40000, \"diatomic_states\":"
     " [{\"Te\": 0, \"we\": 2000, \"Be\": 2, \"dunham\": [[0, 2]]}]}]}",
     MOLQ_EKEY, {"'K'", "diatomic_states[0].dunham"}},
    {"{\"species\": [{\"name\": \"K\", \"molar_mass\": 4, \"structure\":"
     " \"linear\", \"dissociation_energy\": 40000, \"spin_isomers\":"
     " \"frozen\", \"odd_fraction\": 0.5, \"diatomic_states\":"
     " [{\"Te\": 0, \"we\": 2000, \"Be\": 2}]}]}",
     MOLQ_EVALUE, {"'K'", "'spin_isomers'"}},
    {"{\"species\": [{\"name\": \"L\", \"molar_mass\": 30, \"structure\":"
     " \"nonlinear\", \"rotational_constants\": [3, 2, 1], \"torsions\":"
     " [{\"barrier\": [{\"n\": 3, \"V\": 1000}]}]}]}",
     MOLQ_EKEY, {"'L'", "torsions[0].rotational_constant"}},
    {"{\"species\": [{\"name\": \"L\", \"molar_mass\": 30, \"structure\":"
     " \"nonlinear\", \"rotational_constants\": [3, 2, 1], \"vibrations\":"
     " [{\"wavenumber\": 300}], \"dissociation_energy\": 30000,"
     " \"anharmonicity\": {\"x\": [[0, 4, -3]]}}]}",
     MOLQ_EVALUE, {"'L'", "anharmonicity.x"}},
    {"{\"species\": [{\"name\": \"L\", \"molar_mass\": 30, \"structure\":"
     " \"nonlinear\", \"rotational_constants\": [3, 2, 1], \"vibrations\":"
     " [{\"wavenumber\": 300}], \"dissociation_energy\": 30000,"
     " \"anharmonicity\": {\"g\": [[0, -1]]}}]}",
     MOLQ_EVALUE, {"'L'", "doubly degenerate"}},
};

START_TEST(bad_input_messages)
{
    const struct bad *b = &bad_inputs[_i];
    molq_db *db = (molq_db *)0x1;
    char err[512] = "";
    molq_status st = molq_db_read_string(b->json, strlen(b->json), &db, err,
                                         sizeof err);
    ck_assert_msg(st == b->status, "case %d: status %d (%s), want %d: %s", _i,
                  st, molq_status_string(st), b->status, err);
    ck_assert_ptr_eq(db, (molq_db *)0x1); /* untouched */
    ck_assert_msg(strstr(err, b->must_mention[0]) != NULL &&
                      strstr(err, b->must_mention[1]) != NULL,
                  "case %d: message '%s' should mention '%s' and '%s'", _i,
                  err, b->must_mention[0], b->must_mention[1]);
    /* A tiny buffer truncates but stays a C string; NULL buffer is fine. */
    {
        char small[8];
        memset(small, 'x', sizeof small);
        molq_db_read_string(b->json, strlen(b->json), &db, small,
                            sizeof small);
        ck_assert(memchr(small, '\0', sizeof small) != NULL);
        ck_assert_int_eq(molq_db_read_string(b->json, strlen(b->json), &db,
                                             NULL, 0),
                         b->status);
    }
}
END_TEST

START_TEST(io_errors)
{
    molq_db *db;
    char err[512];
    ck_assert_int_eq(molq_db_read_file("/nonexistent/species.json", &db, err,
                                       sizeof err),
                     MOLQ_EIO);
    ck_assert_ptr_nonnull(strstr(err, "/nonexistent/species.json"));
    ck_assert_int_eq(molq_db_read_file(NULL, &db, err, sizeof err), MOLQ_EARG);
}
END_TEST

/* Threads: shared species evaluated concurrently while other threads build
 * and free their own; every result equals the serial one. */
#define NTHREADS 8
#define NPOINTS 2000

static double serial[NPOINTS];

static void *evaluator(void *arg)
{
    const molq_species *sp = arg;
    size_t i;
    for (i = 0; i < NPOINTS; i++) {
        double v;
        if (molq_eval(sp, 100.0 + i, 1e5, MOLQ_G, &v) != MOLQ_OK ||
            v != serial[i])
            return (void *)1;
    }
    return NULL;
}

static void *builder(void *arg)
{
    size_t i;
    (void)arg;
    for (i = 0; i < 50; i++) {
        molq_db *db;
        char err[128];
        if (molq_db_builtin(&db, err, sizeof err) != MOLQ_OK)
            return (void *)1;
        molq_db_free(db);
    }
    return NULL;
}

START_TEST(threads_share_species)
{
    const molq_species *sp = tu_species("CO2");
    pthread_t th[NTHREADS];
    size_t i;
    for (i = 0; i < NPOINTS; i++)
        serial[i] = tu_eval(sp, 100.0 + i, 1e5, MOLQ_G);
    for (i = 0; i < NTHREADS; i++)
        ck_assert_int_eq(pthread_create(&th[i], NULL,
                                        i % 4 == 3 ? builder : evaluator,
                                        (void *)sp),
                         0);
    for (i = 0; i < NTHREADS; i++) {
        void *ret;
        pthread_join(th[i], &ret);
        ck_assert_ptr_null(ret);
    }
}
END_TEST

int main(void)
{
    Suite *s = suite_create("api");
    TCase *tc = tcase_create("api");
    tcase_set_timeout(tc, 120);
    tcase_add_test(tc, version_and_names);
    tcase_add_test(tc, argument_checks);
    tcase_add_test(tc, extreme_temperatures);
    tcase_add_test(tc, batch_and_per_mass);
    tcase_add_test(tc, spec_api_matches_file);
    tcase_add_test(tc, formula_molar_mass);
    tcase_add_loop_test(tc, bad_input_messages, 0,
                        sizeof bad_inputs / sizeof bad_inputs[0]);
    tcase_add_test(tc, io_errors);
    tcase_add_test(tc, threads_share_species);
    suite_add_tcase(s, tc);
    return tu_run(s);
}
