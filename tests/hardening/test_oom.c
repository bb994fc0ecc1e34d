/* Hardening: allocation failure.
 *
 * This program links the static library and has the linker route every
 * malloc/calloc/realloc/free call of the library's objects through the
 * wrappers below (-Wl,--wrap=...; see meson.build), and jansson's through
 * json_set_alloc_funcs.  Nothing in lib/ is changed and nothing is
 * preloaded.  Each operation (reading the built-in set, the species file, a
 * JSON string, building species through molq_spec_*, rebuilding with
 * another model) is first run once to count its allocations N; then it is
 * run again with allocation k failing, for k = 1 .. N (every k for small
 * operations, an even sample of at least 400 values plus both ends for the
 * large ones).  Each run must
 *   - return MOLQ_ENOMEM whenever an allocation failed (the documented
 *     status; a failed allocation must not be reported as bad input),
 *     leaving the output pointer untouched,
 *   - free everything it allocated (counted block by block here; valgrind
 *     and ASan builds see the same),
 *   - not crash (Check runs each test in its own process; ASan builds
 *     also catch use of freed or NULL memory).
 * Allocations in the C library itself (fopen's buffer) and in GSL are not
 * wrapped; the library gives GSL caller-owned workspaces.  jansson's are
 * counted but failed only with MOLQ_HARDENING_STRICT=1 (see json_alloc). */
#include <check.h>
#include <jansson.h>
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "molq/molq.h"

void *__real_malloc(size_t n);
void *__real_calloc(size_t n, size_t m);
void *__real_realloc(void *p, size_t n);
void __real_free(void *p);
void *__wrap_malloc(size_t n);
void *__wrap_calloc(size_t n, size_t m);
void *__wrap_realloc(void *p, size_t n);
void __wrap_free(void *p);

/* ------------------------------------------------------------------------ */
/* Counting allocator                                                       */
/* ------------------------------------------------------------------------ */

static int armed;        /* count and fail only inside an operation */
static long countdown;   /* fail the allocation that brings this to 0 */
static long n_allocs;    /* allocations seen while armed */
static int failed;       /* an allocation was failed in this run */
static long live;        /* blocks allocated while armed, not yet freed */

/* Open-addressing set of the blocks allocated while armed. */
#define SET_BITS 21
#define SET_SIZE (1u << SET_BITS)
static void **set;
static size_t set_used; /* slots ever filled since the last clearing */

static size_t slot_of(const void *p)
{
    uintptr_t h = (uintptr_t)p;
    h ^= h >> 17;
    h *= (uintptr_t)0x9E3779B97F4A7C15u;
    return (size_t)(h >> 7) & (SET_SIZE - 1);
}

static void set_add(void *p)
{
    size_t i = slot_of(p);
    while (set[i] != NULL && set[i] != (void *)1)
        i = (i + 1) & (SET_SIZE - 1);
    if (set[i] == NULL)
        set_used++;
    set[i] = p;
    live++;
}

static int set_remove(void *p)
{
    size_t i = slot_of(p);
    while (set[i] != NULL) {
        if (set[i] == p) {
            set[i] = (void *)1; /* tombstone */
            live--;
            return 1;
        }
        i = (i + 1) & (SET_SIZE - 1);
    }
    return 0;
}

static int fail_now(void)
{
    if (!armed)
        return 0;
    n_allocs++;
    if (countdown > 0 && --countdown == 0) {
        failed = 1;
        return 1;
    }
    return 0;
}

void *__wrap_malloc(size_t n)
{
    void *p;
    if (fail_now())
        return NULL;
    p = __real_malloc(n);
    if (p != NULL && armed)
        set_add(p);
    return p;
}

void *__wrap_calloc(size_t n, size_t m)
{
    void *p;
    if (fail_now())
        return NULL;
    p = __real_calloc(n, m);
    if (p != NULL && armed)
        set_add(p);
    return p;
}

void *__wrap_realloc(void *p, size_t n)
{
    void *q;
    if (fail_now())
        return NULL; /* p stays valid and owned */
    q = __real_realloc(p, n);
    if (q != NULL && armed) {
        if (p != NULL)
            set_remove(p);
        set_add(q);
    } else if (q != NULL && p != NULL) {
        set_remove(p);
    }
    return q;
}

void __wrap_free(void *p)
{
    if (p != NULL)
        set_remove(p);
    __real_free(p);
}

/* jansson's allocations are counted for leaks but failed only in strict
 * mode: jansson 2.14 (Debian 12) aborts on an assertion in its string
 * scanner (load.c, lex_scan_string) when an allocation fails, so a failure
 * there cannot be survived by any caller (see the hardening report). */
static int fail_jansson;

static void *json_alloc(size_t n)
{
    void *p;
    if (fail_jansson)
        return __wrap_malloc(n);
    p = __real_malloc(n);
    if (p != NULL && armed)
        set_add(p);
    return p;
}

static void json_release(void *p)
{
    __wrap_free(p);
}

/* ------------------------------------------------------------------------ */
/* Operations                                                               */
/* ------------------------------------------------------------------------ */

typedef struct {
    molq_status st;
    int untouched; /* output pointer left alone on failure */
    char err[512];
} outcome;

typedef void (*operation)(outcome *o);

static void op_builtin(outcome *o)
{
    molq_db *db = (molq_db *)&db;
    o->st = molq_db_builtin(&db, o->err, sizeof o->err);
    o->untouched = db == (molq_db *)&db;
    if (o->st == MOLQ_OK)
        molq_db_free(db);
}

static void op_file(outcome *o)
{
    const char *path = getenv("MOLQ_SPECIES_JSON");
    molq_db *db = (molq_db *)&db;
    o->st = molq_db_read_file(path, &db, o->err, sizeof o->err);
    o->untouched = db == (molq_db *)&db;
    if (o->st == MOLQ_OK)
        molq_db_free(db);
}

/* Invented species using the file keys of every model (test input only). */
static const char small_json[] =
    "{\"schema_version\": 1, \"description\": \"oom\", \"species\": ["
    "{\"name\": \"a\", \"formula\": \"Ar\", \"structure\": \"atom\", "
    "\"electronic_levels\": [{\"energy\": 0, \"degeneracy\": 2}, "
    "{\"energy\": 800}], \"source\": \"s\"},"
    "{\"name\": \"b\", \"molar_mass\": 30, \"structure\": \"nonlinear\", "
    "\"symmetry_number\": 2, \"rotational_constants\": [9, 1.3, 1.1], "
    "\"vibrations\": [{\"wavenumber\": 2800}, {\"wavenumber\": 1200, "
    "\"degeneracy\": 2}], \"formation_enthalpy_298\": -1e5},"
    "{\"name\": \"c\", \"molar_mass\": 28, \"structure\": \"linear\", "
    "\"symmetry_number\": 2, \"dissociation_energy\": 9000, "
    "\"diatomic_states\": [{\"label\": \"X\", \"Te\": 0, \"we\": 2000, "
    "\"wexe\": 14, \"Be\": 2, \"alpha_e\": 0.02, \"rotational_weights\": "
    "[0.6, 0.4]}, {\"Te\": 5000, \"degeneracy\": 2, \"dunham\": [[0, 1.8], "
    "[1800, -0.02], [-15]]}]}]}";

static void op_string(outcome *o)
{
    molq_db *db = (molq_db *)&db;
    o->st = molq_db_read_string(small_json, sizeof small_json - 1, &db,
                                o->err, sizeof o->err);
    o->untouched = db == (molq_db *)&db;
    if (o->st == MOLQ_OK) {
        double v;
        if (molq_eval(molq_db_species(db, 2), 700, 1e5, MOLQ_CP, &v) !=
            MOLQ_OK)
            o->st = (molq_status)-1;
        molq_db_free(db);
    }
}

/* A bad file: the failure (or the allocation failure) comes after two good
 * species were built. */
static const char bad_json[] =
    "{\"species\": [{\"name\": \"a\", \"molar_mass\": 4, \"structure\": "
    "\"atom\"}, {\"name\": \"b\", \"molar_mass\": 28, \"structure\": "
    "\"linear\", \"rotational_constants\": [2], \"vibrations\": "
    "[{\"wavenumber\": 2000}]}, {\"name\": \"c\", \"molar_mass\": 4, "
    "\"structure\": \"linear\", \"rotational_constants\": [-1]}]}";

static void op_bad_string(outcome *o)
{
    molq_db *db = (molq_db *)&db;
    o->st = molq_db_read_string(bad_json, sizeof bad_json - 1, &db, o->err,
                                sizeof o->err);
    o->untouched = db == (molq_db *)&db;
    if (o->st == MOLQ_OK)
        molq_db_free(db);
    else if (o->st == MOLQ_EVALUE)
        o->st = MOLQ_OK; /* the expected outcome without a failure */
}

#define TRY(call)                                                              \
    do {                                                                       \
        molq_status st_ = (call);                                              \
        if (st_ != MOLQ_OK) {                                                  \
            o->st = st_;                                                       \
            goto out;                                                          \
        }                                                                      \
    } while (0)

static void op_spec(outcome *o)
{
    molq_spec *s = NULL;
    molq_species *sp = (molq_species *)&sp, *alt = (molq_species *)&alt;
    static const double B[3] = {9.0, 1.3, 1.1};
    size_t i, k;
    o->untouched = 1;
    o->st = MOLQ_OK;
    TRY(molq_spec_new("spec-oom", &s));
    TRY(molq_spec_set_formula(s, "CH2O"));
    TRY(molq_spec_set_formula(s, "C2H4O")); /* replace */
    TRY(molq_spec_set_source(s, "invented"));
    TRY(molq_spec_set_structure(s, MOLQ_NONLINEAR));
    TRY(molq_spec_set_rotational_constants(s, B, 3));
    for (k = 0; k < 20; k++) /* grows the arrays several times */
        TRY(molq_spec_add_vibration(s, 300.0 + 100.0 * (double)k, 1));
    for (k = 0; k < 12; k++)
        TRY(molq_spec_add_electronic_level(s, 500.0 * (double)k, 1));
    TRY(molq_species_create(s, &sp, o->err, sizeof o->err));
    molq_species_free(sp);
    sp = (molq_species *)&sp;
    molq_spec_free(s);
    s = NULL;
    /* a diatomic for the level sums, and its rigid-rotor variant */
    TRY(molq_spec_new("dia-oom", &s));
    TRY(molq_spec_set_molar_mass(s, 0.028));
    TRY(molq_spec_set_structure(s, MOLQ_LINEAR));
    TRY(molq_spec_set_symmetry_number(s, 2));
    TRY(molq_spec_set_dissociation_energy(s, 9000.0));
    TRY(molq_spec_add_diatomic_state(s, 0.0, 1, &i));
    TRY(molq_spec_set_dunham(s, i, 1, 0, 2000.0));
    TRY(molq_spec_set_dunham(s, i, 2, 0, -14.0));
    TRY(molq_spec_set_dunham(s, i, 0, 1, 2.0));
    TRY(molq_spec_set_rotational_weights(s, i, 0.6, 0.4));
    TRY(molq_spec_add_diatomic_state(s, 4000.0, 2, &i));
    TRY(molq_spec_set_dunham(s, i, 1, 0, 1500.0));
    TRY(molq_spec_set_dunham(s, i, 0, 1, 1.5));
    TRY(molq_species_create(s, &sp, o->err, sizeof o->err));
    o->st = molq_species_with_model(sp, MOLQ_MODEL_RRHO, &alt, o->err,
                                    sizeof o->err);
    if (o->st == MOLQ_OK)
        molq_species_free(alt);
    else if (alt != (molq_species *)&alt)
        o->untouched = 0;
    molq_species_free(sp);
    sp = (molq_species *)&sp;
out:
    if (sp != (molq_species *)&sp && o->st != MOLQ_OK)
        o->untouched = 0;
    molq_spec_free(s);
}

static const molq_db *model_db; /* opened before arming */

static void op_with_model(outcome *o)
{
    size_t i;
    o->st = MOLQ_OK;
    o->untouched = 1;
    for (i = 0; i < molq_db_count(model_db); i++) {
        const molq_species *sp = molq_db_species(model_db, i);
        int m;
        for (m = 0; m < 2; m++) {
            molq_species *alt = (molq_species *)&alt;
            molq_status st = molq_species_with_model(sp, (molq_model)m, &alt,
                                                     o->err, sizeof o->err);
            if (st == MOLQ_OK) {
                molq_species_free(alt);
                continue;
            }
            if (alt != (molq_species *)&alt)
                o->untouched = 0;
            if (st == MOLQ_ENOMEM) {
                o->st = st;
                return;
            }
            /* EVALUE/EKEY: the data do not support that model */
        }
    }
}

/* ------------------------------------------------------------------------ */
/* The driver                                                               */
/* ------------------------------------------------------------------------ */

static long run(operation op, long fail_at, outcome *o)
{
    memset(o, 0, sizeof *o);
    /* every run ends with nothing live (else the test has failed), so the
     * set can be cleared of tombstones now and then */
    if (set_used > SET_SIZE / 4) {
        memset(set, 0, SET_SIZE * sizeof *set);
        set_used = 0;
    }
    countdown = fail_at;
    n_allocs = 0;
    failed = 0;
    live = 0;
    armed = 1;
    op(o);
    armed = 0;
    return n_allocs;
}

static void exercise(const char *name, operation op, long exhaustive_max)
{
    outcome o;
    long n, k, step, tried = 0, wrong_status = 0;
    n = run(op, 0, &o);
    ck_assert_msg(o.st == MOLQ_OK, "%s without failures: %s (%s)", name,
                  molq_status_string(o.st), o.err);
    ck_assert_msg(live == 0, "%s without failures leaks %ld blocks", name,
                  live);
    ck_assert_msg(n > 0, "%s: no allocation seen; is the wrapping active?",
                  name);
    step = n <= exhaustive_max ? 1 : n / 400;
    for (k = 1; k <= n; k += (k <= 32 || k >= n - 32) ? 1 : step) {
        run(op, k, &o);
        tried++;
        ck_assert_msg(failed, "%s: allocation %ld of %ld never came", name,
                      k, n);
        ck_assert_msg(live == 0, "%s, allocation %ld of %ld failed: %ld "
                      "blocks leaked (status %s)", name, k, n, live,
                      molq_status_string(o.st));
        ck_assert_msg(o.untouched, "%s, allocation %ld failed: output "
                      "written", name, k);
        if (o.st != MOLQ_ENOMEM) {
            if (wrong_status++ == 0)
                printf("oom: %s, allocation %ld of %ld failed: status %s, "
                       "message '%s'\n", name, k, n,
                       molq_status_string(o.st), o.err);
            fflush(stdout);
        }
    }
    printf("oom: %-34s %6ld allocations, %5ld failure points tried, %ld "
           "reported as something other than MOLQ_ENOMEM\n", name, n, tried,
           wrong_status);
    ck_assert_msg(wrong_status == 0, "%s: %ld allocation failures reported "
                  "with a status other than MOLQ_ENOMEM (first one printed)",
                  name, wrong_status);
}

START_TEST(oom_spec_api)
{
    exercise("spec API and species_create", op_spec, 100000);
}
END_TEST

START_TEST(oom_small_string)
{
    exercise("read_string, every model", op_string, 100000);
}
END_TEST

START_TEST(oom_bad_string)
{
    exercise("read_string failing at species 3", op_bad_string, 100000);
}
END_TEST

START_TEST(oom_builtin)
{
    exercise("molq_db_builtin", op_builtin, 2000);
}
END_TEST

START_TEST(oom_file)
{
    if (getenv("MOLQ_SPECIES_JSON") == NULL)
        return;
    exercise("molq_db_read_file", op_file, 2000);
}
END_TEST

START_TEST(oom_with_model)
{
    molq_db *db = NULL;
    char err[256];
    ck_assert_int_eq(molq_db_builtin(&db, err, sizeof err), MOLQ_OK);
    model_db = db;
    exercise("molq_species_with_model", op_with_model, 2000);
    molq_db_free(db);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("hardening-oom");
    TCase *tc = tcase_create("oom");
    SRunner *sr;
    int failed_tests;
    set = __real_calloc(SET_SIZE, sizeof *set);
    if (set == NULL)
        return EXIT_FAILURE;
    {
        const char *strict = getenv("MOLQ_HARDENING_STRICT");
        fail_jansson = strict != NULL && *strict != '\0' &&
                       strcmp(strict, "0") != 0;
    }
    json_set_alloc_funcs(json_alloc, json_release);
    tcase_set_timeout(tc, 1200);
    tcase_add_test(tc, oom_spec_api);
    tcase_add_test(tc, oom_small_string);
    tcase_add_test(tc, oom_bad_string);
    tcase_add_test(tc, oom_builtin);
    tcase_add_test(tc, oom_file);
    tcase_add_test(tc, oom_with_model);
    suite_add_tcase(s, tc);
    sr = srunner_create(s);
    srunner_run_all(sr, CK_NORMAL);
    failed_tests = srunner_ntests_failed(sr);
    srunner_free(sr);
    __real_free(set);
    return failed_tests == 0 ? EXIT_SUCCESS : EXIT_FAILURE;
}
