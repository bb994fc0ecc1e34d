/* testutil.h -- small helpers shared by the C tests. */
#ifndef MOLQ_TESTUTIL_H
#define MOLQ_TESTUTIL_H

#include <check.h>
#include <math.h>
#include <stddef.h>

#include "molq/molq.h"

/* SI 2019 exact constants, written out again here so the tests do not
 * borrow the library's own definitions. */
#define T_H 6.62607015e-34
#define T_K 1.380649e-23
#define T_NA 6.02214076e23
#define T_C 299792458.0
#define T_R (T_NA * T_K)
#define T_C2 (100.0 * T_H * T_C / T_K) /* cm K */
#define T_PI 3.14159265358979323846

/* The built-in starter set, opened once per test process. */
const molq_db *tu_builtin(void);
const molq_species *tu_species(const char *name);

/* Run a suite (normal output) and return the process exit status. */
int tu_run(Suite *s);

/* A built-in species rebuilt with another model (cached per process). */
const molq_species *tu_species_model(const char *name, molq_model model);

/* Evaluate or fail the test. */
double tu_eval(const molq_species *sp, double T, double p, molq_property prop);

/* Build a species from JSON text holding exactly one species; the db is
 * returned so the caller frees it. */
const molq_species *tu_from_json(const char *json, molq_db **db);

/* Index of the species' first mode of this kind (fails the test if none). */
size_t tu_mode_index(const molq_species *sp, molq_mode_kind kind);

/* Property of that mode at T and 1e5 Pa (fails the test on an error). */
double tu_eval_kind(const molq_species *sp, molq_mode_kind kind, double T,
                    molq_property prop);

/* |a - b| <= tol * max(|a|, |b|, floor) */
int tu_close(double a, double b, double rel, double floor);

/* A NIST-JANAF extract (tests/data/janaf/NAME.tsv). */
typedef struct {
    size_t n;
    double T[128], cp[128], s[128], gef[128], dh[128];
} tu_table;
void tu_read_janaf(const char *name, tu_table *t);

#define ck_assert_close(a, b, rel, floor)                                      \
    ck_assert_msg(tu_close((a), (b), (rel), (floor)),                          \
                  "%s = %.15g, %s = %.15g, rel tol %g", #a, (double)(a), #b,  \
                  (double)(b), (double)(rel))

#endif
