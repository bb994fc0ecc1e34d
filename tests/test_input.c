/* Reading species input as new users write it: many modes with torsions
 * and anharmonic terms (the anharmonic input map), integer fields and their
 * bounds, molar-mass units, byte-order marks, integral floats, misspelt
 * keys, the warnings of a species and of a file, and the sample species
 * file of the README. */
#include <math.h>
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

/* ------------------------------------------------------------------------ */
/* Integer fields: bounds, integral floats.                                 */
/* ------------------------------------------------------------------------ */

/* An atom file with one excited level of degeneracy DEG (text) and the
 * given symmetry number (text). */
static molq_status atom_file(const char *deg, const char *sigma, molq_db **db,
                             char *err, size_t errlen)
{
    char js[512];
    snprintf(js, sizeof js,
             "{\"schema_version\": 1, \"species\": [{\"name\": \"X\", "
             "\"molar_mass\": 20, \"structure\": \"atom\", "
             "\"symmetry_number\": %s, \"electronic_levels\": "
             "[{\"energy\": 0, \"degeneracy\": 1}, {\"energy\": 100, "
             "\"degeneracy\": %s}]}]}", sigma, deg);
    *db = NULL;
    return molq_db_read_string(js, strlen(js), db, err, errlen);
}

/* Before the fix the reader clamped integers to 1e9: degeneracies 1e9,
 * 4294967297 and 99999999999 gave the same entropy and a symmetry number
 * of 4294967298 was accepted.  Each integer field now has a documented
 * bound (README "Species files"; degeneracies 1 to 1000000, symmetry
 * numbers 1 to 100000) and a value past it is refused naming the field. */
START_TEST(integer_bounds)
{
    static const char *const big[] = {"1000001", "1000000000", "4294967297",
                                      "99999999999", "1e300"};
    molq_db *db;
    char err[512];
    size_t i;
    for (i = 0; i < sizeof big / sizeof big[0]; i++) {
        ck_assert_int_eq(atom_file(big[i], "1", &db, err, sizeof err),
                         MOLQ_EVALUE);
        ck_assert_ptr_null(db);
        ck_assert_msg(strstr(err, "field 'electronic_levels[1].degeneracy'") &&
                          strstr(err, "from 1 to 1000000"), "%s", err);
    }
    ck_assert_int_eq(atom_file("2", "4294967298", &db, err, sizeof err),
                     MOLQ_EVALUE);
    ck_assert_msg(strstr(err, "field 'symmetry_number'") &&
                      strstr(err, "from 1 to 100000"), "%s", err);
    ck_assert_int_eq(atom_file("-3", "1", &db, err, sizeof err), MOLQ_EVALUE);
    /* the bound itself is accepted, and counts: S grows with g */
    ck_assert_int_eq(atom_file("1000000", "1", &db, err, sizeof err), MOLQ_OK);
    molq_db_free(db);
}
END_TEST

/* JSON written by many tools carries 2.0 for 2: an integral float is that
 * integer (same results), a fractional one is refused as not an integer. */
START_TEST(integral_floats)
{
    molq_db *a, *b;
    const molq_species *sa, *sb;
    char err[512];
    ck_assert_int_eq(atom_file("2", "1", &a, err, sizeof err), MOLQ_OK);
    ck_assert_int_eq(atom_file("2.0", "1.0", &b, err, sizeof err), MOLQ_OK);
    sa = molq_db_species(a, 0);
    sb = molq_db_species(b, 0);
    ck_assert_double_eq(tu_eval(sa, 300.0, 1e5, MOLQ_S),
                        tu_eval(sb, 300.0, 1e5, MOLQ_S));
    molq_db_free(a);
    molq_db_free(b);
    ck_assert_int_eq(atom_file("2.5", "1", &a, err, sizeof err), MOLQ_ETYPE);
    ck_assert_msg(strstr(err, "field 'electronic_levels[1].degeneracy'") &&
                      strstr(err, "expected an integer"), "%s", err);
}
END_TEST

/* ------------------------------------------------------------------------ */
/* Byte-order mark, misspelt keys, warnings.                                */
/* ------------------------------------------------------------------------ */

static const char argon_js[] =
    "{\"schema_version\": 1, \"species\": [{\"name\": \"Ar\", "
    "\"formula\": \"Ar\", \"structure\": \"atom\"}]}";

/* A UTF-8 byte-order mark (EF BB BF, written by some editors) was refused
 * with an error printing the invisible character; it is now skipped. */
START_TEST(byte_order_mark)
{
    char js[256];
    molq_db *db = NULL;
    char err[512];
    snprintf(js, sizeof js, "\xEF\xBB\xBF%s", argon_js);
    ck_assert_int_eq(molq_db_read_string(js, strlen(js), &db, err, sizeof err),
                     MOLQ_OK);
    ck_assert_uint_eq(molq_db_count(db), 1);
    molq_db_free(db);
    /* a BOM alone is still an empty, invalid document */
    ck_assert_int_eq(molq_db_read_string("\xEF\xBB\xBF", 3, &db, err,
                                         sizeof err), MOLQ_ESYNTAX);
}
END_TEST

static void expect_key_error(const char *js, const char *want)
{
    molq_db *db = NULL;
    char err[512];
    ck_assert_int_eq(molq_db_read_string(js, strlen(js), &db, err, sizeof err),
                     MOLQ_EKEY);
    ck_assert_ptr_null(db);
    ck_assert_msg(strstr(err, want) != NULL, "want \"%s\" in: %s", want, err);
}

/* A misspelt key got "unknown key" with no hint; now the nearest valid key
 * of that object is suggested when it is close, and only then. */
START_TEST(misspelt_keys)
{
    expect_key_error("{\"species\": [{\"name\": \"A\", \"structure\": "
                     "\"atom\", \"molar_mass\": 4, \"vibratons\": []}]}",
                     "field 'vibratons': unknown key; did you mean "
                     "'vibrations'?");
    expect_key_error("{\"species\": [{\"name\": \"A\", \"structure\": "
                     "\"atom\", \"molarmass\": 4}]}",
                     "did you mean 'molar_mass'?");
    expect_key_error("{\"species\": [{\"name\": \"A\", \"structure\": "
                     "\"linear\", \"molar_mass\": 4, \"diatomic_states\": "
                     "[{\"Te\": 0, \"we\": 1000, \"Be\": 1, \"alpah_e\": "
                     "0.01}]}]}",
                     "field 'diatomic_states[0].alpah_e': unknown key; did "
                     "you mean 'alpha_e'?");
    expect_key_error("{\"schema_verison\": 1, \"species\": []}",
                     "did you mean 'schema_version'?");
    /* nothing close: no suggestion */
    {
        const char *js = "{\"species\": [{\"name\": \"A\", \"structure\": "
                         "\"atom\", \"molar_mass\": 4, \"colour\": 1}]}";
        molq_db *db = NULL;
        char err[512];
        ck_assert_int_eq(molq_db_read_string(js, strlen(js), &db, err,
                                             sizeof err), MOLQ_EKEY);
        ck_assert_msg(strstr(err, "'colour': unknown key") &&
                          !strstr(err, "did you mean"), "%s", err);
    }
}
END_TEST

/* A file without schema_version was accepted silently: it now loads with a
 * warning naming the field; with the version there is none. */
START_TEST(schema_version_warning)
{
    static const char nover[] = "{\"species\": [{\"name\": \"Ar\", "
                                "\"formula\": \"Ar\", \"structure\": "
                                "\"atom\"}]}";
    molq_db *db = NULL;
    char err[512];
    ck_assert_int_eq(molq_db_read_string(nover, strlen(nover), &db, err,
                                         sizeof err), MOLQ_OK);
    ck_assert_uint_eq(molq_db_warning_count(db), 1);
    ck_assert_ptr_nonnull(strstr(molq_db_warning(db, 0),
                                 "field 'schema_version': missing"));
    ck_assert_ptr_null(molq_db_warning(db, 1));
    /* a file-level warning belongs to the file, not to its species */
    ck_assert_uint_eq(molq_species_warning_count(molq_db_species(db, 0)), 0);
    molq_db_free(db);
    ck_assert_int_eq(molq_db_read_string(argon_js, strlen(argon_js), &db, err,
                                         sizeof err), MOLQ_OK);
    ck_assert_uint_eq(molq_db_warning_count(db), 0);
    molq_db_free(db);
    ck_assert_uint_eq(molq_db_warning_count(NULL), 0);
    ck_assert_ptr_null(molq_db_warning(NULL, 0));
    /* the built-in set loads without warnings (molar masses, formulas and
     * the plausibility checks of tests/test_plausible.c) */
    ck_assert_uint_eq(molq_db_warning_count(tu_builtin()), 0);
}
END_TEST

/* Molar masses no molecule has.  Standard atomic weight of Ar 39.95
 * (IUPAC 2021 conventional value, from memory); electron molar mass
 * 5.48579909065e-7 kg/mol (CODATA 2018). */
START_TEST(molar_mass_warnings)
{
    molq_spec *s;
    molq_species *sp, *lev;
    molq_db *db = NULL;
    char err[512];
    static const char js[] = "{\"schema_version\": 1, \"species\": [{\"name\":"
                             " \"Ar\", \"formula\": \"Ar\", \"molar_mass\": "
                             "20.0, \"structure\": \"atom\"}]}";
    /* the file's g/mol disagree with the formula by 50 %: loaded, warned */
    ck_assert_int_eq(molq_db_read_string(js, strlen(js), &db, err, sizeof err),
                     MOLQ_OK);
    ck_assert_uint_eq(molq_db_warning_count(db), 1);
    ck_assert_msg(strstr(molq_db_warning(db, 0), "species 'Ar': field "
                                                 "'molar_mass': 20 g/mol") &&
                      strstr(molq_db_warning(db, 0), "formula 'Ar'"),
                  "%s", molq_db_warning(db, 0));
    ck_assert_uint_eq(molq_species_warning_count(molq_db_species(db, 0)), 1);
    ck_assert_str_eq(molq_species_warning(molq_db_species(db, 0), 0),
                     molq_db_warning(db, 0));
    /* a variant keeps its original's warnings */
    ck_assert_int_eq(molq_species_with_model(molq_db_species(db, 0),
                                             MOLQ_MODEL_RRHO, &lev, err,
                                             sizeof err), MOLQ_OK);
    ck_assert_uint_eq(molq_species_warning_count(lev), 1);
    molq_species_free(lev);
    molq_db_free(db);
    /* within 1 % of the formula (an isotopologue-sized change): quiet */
    ck_assert_int_eq(molq_spec_new("Ar", &s), MOLQ_OK);
    ck_assert_int_eq(molq_spec_set_formula(s, "Ar"), MOLQ_OK);
    ck_assert_int_eq(molq_spec_set_molar_mass_g_per_mol(s, 39.948), MOLQ_OK);
    ck_assert_int_eq(molq_species_create(s, &sp, err, sizeof err), MOLQ_OK);
    ck_assert_uint_eq(molq_species_warning_count(sp), 0);
    ck_assert_ptr_null(molq_species_warning(sp, 0));
    molq_species_free(sp);
    molq_spec_free(s);
    /* kg/mol typed into the g/mol setter, no formula: lighter than H */
    ck_assert_int_eq(molq_spec_new("Ar", &s), MOLQ_OK);
    ck_assert_int_eq(molq_spec_set_molar_mass_g_per_mol(s, 0.039948), MOLQ_OK);
    ck_assert_int_eq(molq_species_create(s, &sp, err, sizeof err), MOLQ_OK);
    ck_assert_uint_eq(molq_species_warning_count(sp), 1);
    ck_assert_ptr_nonnull(strstr(molq_species_warning(sp, 0),
                                 "lighter than any atom"));
    molq_species_free(sp);
    /* the electron's own mass: no warning */
    ck_assert_int_eq(molq_spec_set_molar_mass(s, 5.48579909065e-7), MOLQ_OK);
    ck_assert_int_eq(molq_species_create(s, &sp, err, sizeof err), MOLQ_OK);
    ck_assert_uint_eq(molq_species_warning_count(sp), 0);
    molq_species_free(sp);
    molq_spec_free(s);
    ck_assert_uint_eq(molq_species_warning_count(NULL), 0);
    ck_assert_ptr_null(molq_species_warning(NULL, 0));
}
END_TEST

/* The README's --data example file loads without errors or warnings and
 * gives finite properties over the tabulated range. */
START_TEST(readme_example_file)
{
    const char *dir = getenv("MOLQ_EXAMPLES");
    char path[1024], err[512];
    molq_db *db = NULL;
    const molq_species *sp;
    ck_assert_ptr_nonnull(dir);
    snprintf(path, sizeof path, "%s/my_species.json", dir);
    ck_assert_msg(molq_db_read_file(path, &db, err, sizeof err) == MOLQ_OK,
                  "%s", err);
    ck_assert_uint_eq(molq_db_warning_count(db), 0);
    ck_assert_int_eq(molq_db_find(db, "my-molecule", &sp), MOLQ_OK);
    ck_assert(tu_eval(sp, 298.15, 1e5, MOLQ_CP) > 4.0 * T_R);
    ck_assert(tu_eval(sp, 3000.0, 1e5, MOLQ_CP) < 7.0 * T_R);
    molq_db_free(db);
}
END_TEST

/* ------------------------------------------------------------------------ */
/* The lowest meaningful temperature.                                       */
/* ------------------------------------------------------------------------ */

/* Boltzmann-gas limit, computed here independently: n lambda^3 = g0 with
 * n = p/(kT) and lambda = h / sqrt(2 pi m k T) gives
 * T = [p h^3 / (g0 k^(5/2) (2 pi m)^(3/2))]^(2/5) (common practice: the
 * onset of quantum degeneracy of an ideal gas; no source). */
static double boltzmann_t(double molar_mass, double g0, double p)
{
    double m = molar_mass / T_NA;
    return pow(p * pow(T_H, 3) /
                   (g0 * pow(T_K, 2.5) * pow(2 * T_PI * m, 1.5)),
               0.4);
}

/* Before the fix T = 1e-100 K returned MOLQ_OK with s = -4750 J/(mol K). */
START_TEST(below_boltzmann_limit)
{
    const molq_species *n2 = tu_species("N2");
    molq_db *db;
    const molq_species *e;
    double v = 12345.0, tb;
    static const char js[] =
        "{\"schema_version\": 1, \"species\": [{\"name\": \"e-\", "
        "\"molar_mass\": 5.48579909065e-4, \"structure\": \"atom\", "
        "\"electronic_levels\": [{\"energy\": 0, \"degeneracy\": 2}]}]}";
    ck_assert_int_eq(molq_eval(n2, 1e-100, 1e5, MOLQ_S, &v), MOLQ_ERANGE);
    ck_assert_double_eq(v, 12345.0);
    tb = boltzmann_t(molq_species_molar_mass(n2), 1.0, 1e5);
    ck_assert_close(molq_species_t_min(n2), tb, 1e-9, 0);
    ck_assert(tb > 0.55 && tb < 0.62); /* 0.58 K */
    ck_assert_int_eq(molq_eval(n2, 0.99 * tb, 1e5, MOLQ_S, &v), MOLQ_ERANGE);
    ck_assert_int_eq(molq_eval(n2, 1.01 * tb, 1e5, MOLQ_S, &v), MOLQ_OK);
    /* the electron gas: degenerate below about 295 K at 1 bar; at 298.15 K
     * NIST-JANAF (1998) table D-020 gives Cp = 20.786, S = 20.979
     * J/(mol K) (tests/data/janaf/e-.tsv) and no rows below it */
    tu_from_json(js, &db);
    ck_assert_int_eq(molq_db_find(db, "e-", &e), MOLQ_OK);
    ck_assert_close(molq_species_t_min(e),
                    boltzmann_t(5.48579909065e-7, 2.0, 1e5), 1e-9, 0);
    ck_assert(molq_species_t_min(e) > 290.0 && molq_species_t_min(e) < 298.15);
    ck_assert_int_eq(molq_eval(e, 250.0, 1e5, MOLQ_S, &v), MOLQ_ERANGE);
    ck_assert_close(tu_eval(e, 298.15, 1e5, MOLQ_S), 20.979, 5e-5, 0);
    ck_assert_close(tu_eval(e, 298.15, 1e5, MOLQ_CP), 20.786, 5e-5, 0);
    molq_db_free(db);
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
    tcase_add_test(tc, integer_bounds);
    tcase_add_test(tc, integral_floats);
    tcase_add_test(tc, byte_order_mark);
    tcase_add_test(tc, misspelt_keys);
    tcase_add_test(tc, schema_version_warning);
    tcase_add_test(tc, molar_mass_warnings);
    tcase_add_test(tc, readme_example_file);
    tcase_add_test(tc, below_boltzmann_limit);
    suite_add_tcase(s, tc);
    return tu_run(s);
}
