/* Element composition and charge from formulas, validated ranges, lookup
 * by formula.  Standard atomic weights: IUPAC 2021 conventional values C
 * 12.011, O 15.999, N 14.007, H 1.008, Ca 40.078 (from memory; they match
 * lib/data/formula.c, which cites them); electron molar mass
 * 5.48579909065e-7 kg/mol (CODATA 2018). */
#include <stdio.h>
#include <string.h>

#include "testutil.h"

#define M_E_MOLAR 5.48579909065e-7
/* molar mass constant M_u = 0.99999999965e-3 kg/mol (CODATA 2018, m_u N_A),
 * in g/mol: molar mass = standard atomic weight x M_u */
#define MU_G 0.99999999965

static molq_species *from_formula(const char *formula, char *err,
                                  size_t errlen, molq_status *st)
{
    molq_spec *s;
    molq_species *sp = NULL;
    ck_assert_int_eq(molq_spec_new("x", &s), MOLQ_OK);
    ck_assert_int_eq(molq_spec_set_formula(s, formula), MOLQ_OK);
    ck_assert_int_eq(molq_spec_set_structure(s, MOLQ_ATOM), MOLQ_OK);
    *st = molq_species_create(s, &sp, err, errlen);
    molq_spec_free(s);
    return sp;
}

/* atoms_ar: the sum of the atoms' standard atomic weights */
static void expect(const char *formula, int charge, const char *elements,
                   double atoms_ar)
{
    double mass_g = atoms_ar * MU_G - charge * 1e3 * M_E_MOLAR;
    char err[512], got[256] = "";
    molq_status st;
    molq_species *sp = from_formula(formula, err, sizeof err, &st);
    size_t i;
    ck_assert_msg(st == MOLQ_OK, "%s: %s", formula, err);
    ck_assert_int_eq(molq_species_charge(sp), charge);
    for (i = 0; i < molq_species_element_count(sp); i++) {
        const char *sym;
        long n;
        char one[32];
        ck_assert_int_eq(molq_species_element(sp, i, &sym, &n), MOLQ_OK);
        snprintf(one, sizeof one, "%s%s%ld", i ? " " : "", sym, n);
        strcat(got, one);
    }
    ck_assert_msg(strcmp(got, elements) == 0, "%s: elements '%s', want '%s'",
                  formula, got, elements);
    ck_assert_close(molq_species_molar_mass_g_per_mol(sp), mass_g, 1e-11, 0);
    molq_species_free(sp);
}

START_TEST(formulas)
{
    expect("CO2", 0, "C1 O2", 12.011 + 2 * 15.999);
    expect("Ca(OH)2", 0, "Ca1 O2 H2", 40.078 + 2 * (15.999 + 1.008));
    expect("CH3OH", 0, "C1 H4 O1", 12.011 + 4 * 1.008 + 15.999);
    /* an ion's mass is its atoms' less its charge in electron masses
     * (expect() subtracts them) */
    expect("N2+", 1, "N2", 2 * 14.007);
    expect("O-", -1, "O1", 15.999);
    expect("H3O+", 1, "H3 O1", 3 * 1.008 + 15.999);
    expect("Ca+2", 2, "Ca1", 40.078);
    expect("Ca++", 2, "Ca1", 40.078);
    expect("e-", -1, "", 0.0);
}
END_TEST

START_TEST(bad_formulas)
{
    static const char *const bad[] = {"+", "N2+x", "N2+-", "Xx", "C)", "(C",
                                      "N2+0", "e", "e+", "2H", "H-2-", ""};
    size_t i;
    for (i = 0; i < sizeof bad / sizeof bad[0]; i++) {
        char err[512];
        molq_status st;
        molq_species *sp = from_formula(bad[i], err, sizeof err, &st);
        ck_assert_msg(st == MOLQ_EVALUE, "'%s' accepted", bad[i]);
        ck_assert_ptr_null(sp);
        ck_assert_msg(strstr(err, "field 'formula'") != NULL, "%s", err);
    }
    ck_assert_int_eq(molq_species_charge(NULL), 0);
    ck_assert_uint_eq(molq_species_element_count(NULL), 0);
}
END_TEST

/* With a molar mass given, an unreadable formula is a warning, and the
 * species has no composition. */
START_TEST(unreadable_formula_with_mass)
{
    molq_spec *s;
    molq_species *sp;
    char err[512];
    const char *sym = "untouched";
    long n = -7;
    ck_assert_int_eq(molq_spec_new("x", &s), MOLQ_OK);
    molq_spec_set_formula(s, "Uuo2");
    molq_spec_set_molar_mass_g_per_mol(s, 300.0);
    ck_assert_int_eq(molq_species_create(s, &sp, err, sizeof err), MOLQ_OK);
    ck_assert_uint_eq(molq_species_element_count(sp), 0);
    ck_assert_uint_eq(molq_species_warning_count(sp), 1);
    ck_assert_ptr_nonnull(strstr(molq_species_warning(sp, 0),
                                 "field 'formula'"));
    ck_assert_int_eq(molq_species_element(sp, 0, &sym, &n), MOLQ_EARG);
    ck_assert_str_eq(sym, "untouched");
    ck_assert_int_eq(n, -7);
    molq_species_free(sp);
    molq_spec_free(s);
}
END_TEST

START_TEST(validated_range)
{
    static const char js[] =
        "{\"schema_version\": 1, \"species\": ["
        "{\"name\": \"A\", \"formula\": \"Ar\", \"structure\": \"atom\", "
        "\"validated_range\": [100, 6000]}, "
        "{\"name\": \"B\", \"formula\": \"Ar\", \"structure\": \"atom\"}]}";
    molq_db *db;
    const molq_species *a, *b;
    double lo = -1, hi = -1;
    char err[512];
    static const char *const bad[] = {"[0, 6000]", "[300, 200]", "[1, 2e6]",
                                      "[100]", "\"wide\""};
    size_t i;
    tu_from_json(js, &db);
    ck_assert_int_eq(molq_db_find(db, "A", &a), MOLQ_OK);
    ck_assert_int_eq(molq_db_find(db, "B", &b), MOLQ_OK);
    ck_assert_int_eq(molq_species_validated_range(a, &lo, &hi), MOLQ_OK);
    ck_assert_double_eq(lo, 100.0);
    ck_assert_double_eq(hi, 6000.0);
    lo = hi = -1;
    ck_assert_int_eq(molq_species_validated_range(b, &lo, &hi),
                     MOLQ_ENOTFOUND);
    ck_assert_double_eq(lo, -1);
    ck_assert_int_eq(molq_species_validated_range(NULL, &lo, &hi), MOLQ_EARG);
    /* evaluation is not limited to the range */
    ck_assert(tu_eval(a, 8000.0, 1e5, MOLQ_CP) > 20.0);
    /* lookup by formula: the first in file order */
    ck_assert_int_eq(molq_db_find_formula(db, "Ar", &b), MOLQ_OK);
    ck_assert_ptr_eq(b, a);
    ck_assert_int_eq(molq_db_find_formula(db, "Kr", &b), MOLQ_ENOTFOUND);
    ck_assert_int_eq(molq_db_find_formula(NULL, "Ar", &b), MOLQ_EARG);
    molq_db_free(db);
    for (i = 0; i < sizeof bad / sizeof bad[0]; i++) {
        char t[256];
        molq_db *d = NULL;
        snprintf(t, sizeof t, "{\"schema_version\": 1, \"species\": [{\"name\""
                 ": \"A\", \"formula\": \"Ar\", \"structure\": \"atom\", "
                 "\"validated_range\": %s}]}", bad[i]);
        ck_assert_int_ne(molq_db_read_string(t, strlen(t), &d, err,
                                             sizeof err), MOLQ_OK);
        ck_assert_ptr_null(d);
        ck_assert_msg(strstr(err, "'validated_range'") != NULL, "%s", err);
    }
}
END_TEST

/* Lookup in a database: by name and by formula, every built-in species.
 * Expected: each species is found under its own name (the very same
 * handle), and by its formula the first species in file order with that
 * formula (molq.h, molq_db_find_formula); the formulas of the electron and
 * of nitrogen are "e-" and "N2" (data/species/ions.json, diatomics.json). */
START_TEST(builtin_lookup)
{
    molq_db *db;
    char err[256];
    size_t i, j, n;
    const molq_species *sp, *got;
    ck_assert_int_eq(molq_db_builtin(&db, err, sizeof err), MOLQ_OK);
    n = molq_db_count(db);
    ck_assert_uint_gt(n, 0);
    ck_assert_ptr_null(molq_db_species(db, n));
    for (i = 0; i < n; i++) {
        const char *name, *formula;
        sp = molq_db_species(db, i);
        ck_assert_ptr_nonnull(sp);
        name = molq_species_name(sp);
        formula = molq_species_formula(sp);
        ck_assert_int_eq(molq_db_find(db, name, &got), MOLQ_OK);
        ck_assert_ptr_eq(got, sp);
        /* every built-in species has a formula (data/species rules) */
        ck_assert_msg(formula[0] != '\0', "%s has no formula", name);
        ck_assert_int_eq(molq_db_find_formula(db, formula, &got), MOLQ_OK);
        for (j = 0; j < n; j++)
            if (strcmp(molq_species_formula(molq_db_species(db, j)),
                       formula) == 0)
                break;
        ck_assert_ptr_eq(got, molq_db_species(db, j));
    }
    ck_assert_int_eq(molq_db_find_formula(db, "e-", &got), MOLQ_OK);
    ck_assert_str_eq(molq_species_name(got), "e-");
    ck_assert_int_eq(molq_species_charge(got), -1);
    ck_assert_int_eq(molq_db_find_formula(db, "N2", &got), MOLQ_OK);
    ck_assert_str_eq(molq_species_name(got), "N2");
    /* exact text, no normalisation: "n2" and "N 2" are not N2 */
    got = NULL;
    ck_assert_int_eq(molq_db_find_formula(db, "n2", &got), MOLQ_ENOTFOUND);
    ck_assert_int_eq(molq_db_find_formula(db, "N 2", &got), MOLQ_ENOTFOUND);
    ck_assert_int_eq(molq_db_find(db, "n2", &got), MOLQ_ENOTFOUND);
    ck_assert_ptr_null(got); /* untouched on failure */
    ck_assert_int_eq(molq_db_find_formula(db, NULL, &got), MOLQ_EARG);
    ck_assert_int_eq(molq_db_find_formula(db, "N2", NULL), MOLQ_EARG);
    ck_assert_int_eq(molq_db_find(db, NULL, &got), MOLQ_EARG);
    ck_assert_int_eq(molq_db_find(NULL, "N2", &got), MOLQ_EARG);
    molq_db_free(db);
}
END_TEST

/* Regression: "" is no formula.  A species given without a formula
 * reports "" (molq_species_formula), and molq_db_find_formula(db, "")
 * used to return the first such species, so the CLI's lookup of an empty
 * word fell through to it ('molq show "" --data FILE' printed a species
 * with no formula). */
START_TEST(empty_formula_finds_nothing)
{
    static const char js[] =
        "{\"schema_version\": 1, \"species\": ["
        "{\"name\": \"no-formula\", \"molar_mass\": 39.948, "
        "\"structure\": \"atom\"}, "
        "{\"name\": \"argon\", \"formula\": \"Ar\", \"structure\": "
        "\"atom\"}]}";
    molq_db *db;
    const molq_species *got = NULL;
    tu_from_json(js, &db);
    ck_assert_str_eq(molq_species_formula(molq_db_species(db, 0)), "");
    ck_assert_int_eq(molq_db_find_formula(db, "", &got), MOLQ_ENOTFOUND);
    ck_assert_ptr_null(got);
    ck_assert_int_eq(molq_db_find(db, "", &got), MOLQ_ENOTFOUND);
    ck_assert_int_eq(molq_db_find_formula(db, "Ar", &got), MOLQ_OK);
    ck_assert_str_eq(molq_species_name(got), "argon");
    molq_db_free(db);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("composition");
    TCase *tc = tcase_create("composition");
    tcase_add_test(tc, formulas);
    tcase_add_test(tc, bad_formulas);
    tcase_add_test(tc, unreadable_formula_with_mass);
    tcase_add_test(tc, validated_range);
    tcase_add_test(tc, builtin_lookup);
    tcase_add_test(tc, empty_formula_finds_nothing);
    suite_add_tcase(s, tc);
    return tu_run(s);
}
