/* Reading species input as new users write it: many modes with torsions
 * and anharmonic terms (the anharmonic input map), integer fields and their
 * bounds, molar-mass units, byte-order marks, integral floats, misspelt
 * keys, the warnings of a species and of a file, and the sample species
 * file of the README. */
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "testutil.h"

/* ------------------------------------------------------------------------ */
/* Many vibrations, torsions replacing some, one anharmonic term.           */
/* ------------------------------------------------------------------------ */

/* An invented nonlinear molecule: nvib vibrations, the first ntors of them
 * replaced by torsions (when `replace`; otherwise only the kept ones are
 * given and the torsions replace nothing), one x_ii term on the first kept
 * mode and a dissociation energy.  Kept modes are high (3000 cm^-1 and up)
 * so the level sum below D0 stays small. */
static molq_status many_modes(size_t nvib, size_t ntors, int replace,
                              molq_species **out, char *err, size_t errlen)
{
    molq_spec *s;
    double rot[3] = {3.0, 2.0, 1.0};
    size_t i, first = replace ? ntors : 0;
    molq_status st;
    ck_assert_int_eq(molq_spec_new("many-modes", &s), MOLQ_OK);
    molq_spec_set_molar_mass(s, 0.1);
    molq_spec_set_structure(s, MOLQ_NONLINEAR);
    molq_spec_set_rotational_constants(s, rot, 3);
    if (replace)
        for (i = 0; i < ntors; i++)
            ck_assert_int_eq(molq_spec_add_vibration(s, 200.0 + i, 1),
                             MOLQ_OK);
    for (i = 0; i < nvib - ntors; i++)
        ck_assert_int_eq(molq_spec_add_vibration(s, 3000.0 + 97.0 * i, 1),
                         MOLQ_OK);
    for (i = 0; i < ntors; i++) {
        size_t t;
        ck_assert_int_eq(molq_spec_add_torsion(s, 5.0 + i, 3,
                                               replace ? (int)i : -1, &t),
                         MOLQ_OK);
        ck_assert_int_eq(molq_spec_add_torsion_term(s, t, 3, 400.0), MOLQ_OK);
    }
    ck_assert_int_eq(molq_spec_add_anharmonicity(s, first, first, -20.0),
                     MOLQ_OK);
    molq_spec_set_dissociation_energy(s, 9000.0);
    st = molq_species_create(s, out, err, errlen);
    molq_spec_free(s);
    return st;
}

/* Up to 16 anharmonic modes are allowed and up to 8 torsions, so up to 24
 * vibrations in all when every torsion replaces one.  The vibrations a
 * torsion replaces play no part in the levels model: the species must
 * equal the one given only the kept vibrations (an exact identity of the
 * model).  Before the fix the input map had room for 17 vibrations:
 * 18 with 2 torsions wrote past it (ASan), 24 with 8 crashed. */
static const size_t shapes[][2] = {{17, 1}, {18, 2}, {20, 4}, {24, 8}};

START_TEST(many_modes_with_torsions)
{
    molq_species *a, *b;
    char err[512];
    size_t nvib = shapes[_i][0], ntors = shapes[_i][1];
    static const double T[] = {50.0, 298.15, 1000.0, 3000.0};
    size_t k;
    ck_assert_msg(many_modes(nvib, ntors, 1, &a, err, sizeof err) == MOLQ_OK,
                  "%zu vibrations, %zu torsions: %s", nvib, ntors, err);
    ck_assert_msg(many_modes(nvib, ntors, 0, &b, err, sizeof err) == MOLQ_OK,
                  "%s", err);
    for (k = 0; k < sizeof T / sizeof T[0]; k++) {
        ck_assert_double_eq(tu_eval(a, T[k], 1e5, MOLQ_S),
                            tu_eval(b, T[k], 1e5, MOLQ_S));
        ck_assert_double_eq(tu_eval(a, T[k], 1e5, MOLQ_CP),
                            tu_eval(b, T[k], 1e5, MOLQ_CP));
    }
    molq_species_free(a);
    molq_species_free(b);
}
END_TEST

/* 17 kept modes are one too many for the anharmonic model: refused with
 * the documented limit, also when torsions bring the count to 25. */
START_TEST(too_many_anharmonic_modes)
{
    molq_species *sp = (molq_species *)0x1;
    char err[512];
    ck_assert_int_eq(many_modes(25, 8, 1, &sp, err, sizeof err), MOLQ_ELIMIT);
    ck_assert_ptr_eq(sp, (molq_species *)0x1);
    ck_assert_ptr_nonnull(strstr(err, "'anharmonicity'"));
}
END_TEST

/* ------------------------------------------------------------------------ */
/* Molar mass units.                                                        */
/* ------------------------------------------------------------------------ */

static molq_status argon(int grams, double mass, molq_species **out,
                         char *err, size_t errlen)
{
    molq_spec *s;
    molq_status st;
    ck_assert_int_eq(molq_spec_new("Ar", &s), MOLQ_OK);
    if (grams)
        ck_assert_int_eq(molq_spec_set_molar_mass_g_per_mol(s, mass), MOLQ_OK);
    else
        ck_assert_int_eq(molq_spec_set_molar_mass(s, mass), MOLQ_OK);
    st = molq_species_create(s, out, err, errlen);
    molq_spec_free(s);
    return st;
}

/* Argon, S(298.15 K, 1 bar) = 154.845 J/(mol K): NIST-JANAF Thermochemical
 * Tables, 4th ed. (1998), Ar (ref) table (from memory; the extract in
 * tests/data/janaf agrees).  Before the fix the kg/mol setter took 39.948
 * without complaint and gave 241 J/(mol K). */
START_TEST(molar_mass_units)
{
    molq_species *sp = (molq_species *)0x1;
    char err[512];
    ck_assert_int_eq(argon(0, 39.948, &sp, err, sizeof err), MOLQ_EVALUE);
    ck_assert_ptr_eq(sp, (molq_species *)0x1);
    ck_assert_msg(strstr(err, "'molar_mass'") != NULL &&
                      strstr(err, "kg/mol; did you mean g/mol? use "
                                  "molq_spec_set_molar_mass_g_per_mol") != NULL,
                  "%s", err);
    ck_assert_int_eq(argon(1, 39.948, &sp, err, sizeof err), MOLQ_OK);
    ck_assert_close(tu_eval(sp, 298.15, 1e5, MOLQ_S), 154.845, 2e-5, 0);
    ck_assert_close(molq_species_molar_mass_g_per_mol(sp), 39.948, 1e-15, 0);
    ck_assert_close(molq_species_molar_mass(sp), 0.039948, 1e-15, 0);
    molq_species_free(sp);
    ck_assert_int_eq(argon(0, 0.039948, &sp, err, sizeof err), MOLQ_OK);
    ck_assert_close(tu_eval(sp, 298.15, 1e5, MOLQ_S), 154.845, 2e-5, 0);
    molq_species_free(sp);
    /* bounds: 1 kg/mol accepted, above refused; the electron's molar mass
     * 5.48579909065e-7 kg/mol (CODATA 2018) accepted, below refused */
    ck_assert_int_eq(argon(0, 1.0, &sp, err, sizeof err), MOLQ_OK);
    molq_species_free(sp);
    ck_assert_int_eq(argon(1, 1000.5, &sp, err, sizeof err), MOLQ_EVALUE);
    ck_assert_ptr_nonnull(strstr(err, "1000 g/mol"));
    ck_assert_int_eq(argon(0, 5.48579909065e-7, &sp, err, sizeof err),
                     MOLQ_OK);
    molq_species_free(sp);
    ck_assert_int_eq(argon(0, 5.4e-7, &sp, err, sizeof err), MOLQ_EVALUE);
    ck_assert_ptr_nonnull(strstr(err, "electron"));
    ck_assert_double_eq(molq_species_molar_mass_g_per_mol(NULL), 0.0);
    ck_assert_int_eq(molq_spec_set_molar_mass_g_per_mol(NULL, 1.0), MOLQ_EARG);
}
END_TEST

/* A species file gives g/mol: 1500 g/mol is refused in that unit. */
START_TEST(molar_mass_file_bound)
{
    static const char *js = "{\"species\": [{\"name\": \"X\", "
                            "\"molar_mass\": 1500, \"structure\": \"atom\"}]}";
    molq_db *db = NULL;
    char err[512];
    ck_assert_int_eq(molq_db_read_string(js, strlen(js), &db, err, sizeof err),
                     MOLQ_EVALUE);
    ck_assert_msg(strstr(err, "'molar_mass'") && strstr(err, "1000 g/mol") &&
                      !strstr(err, "molq_spec_set"), "%s", err);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("input");
    TCase *tc = tcase_create("input");
    tcase_set_timeout(tc, 120);
    tcase_add_loop_test(tc, many_modes_with_torsions, 0,
                        sizeof shapes / sizeof shapes[0]);
    tcase_add_test(tc, too_many_anharmonic_modes);
    tcase_add_test(tc, molar_mass_units);
    tcase_add_test(tc, molar_mass_file_bound);
    suite_add_tcase(s, tc);
    return tu_run(s);
}
