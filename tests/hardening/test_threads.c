/* Hardening: shared handles under threads.
 *
 * molq.h promises that molq_species and molq_db handles are immutable once
 * created and may be evaluated by any number of threads at once without
 * locks, and that evaluation touches no global state.  This test holds the
 * library to that: evaluator threads run every evaluation entry point
 * (molq_eval, molq_eval_many, molq_eval_batch, molq_eval_mode,
 * molq_eval_spin_conversion, and the lookups molq_db_find, molq_db_species
 * and the species queries) over every species of the shared
 * built-in set while builder threads create and free their own databases
 * (built-in, from the species file, from a JSON string) and their own
 * species through molq_spec_* and molq_species_with_model (which reads the
 * shared handles), including failing inputs.  Every result,
 * status and value, must equal the one computed serially before the
 * threads started, bit for bit.
 *
 * Environment:
 *   MOLQ_TEST_THREADS  total number of threads (default 16, at least 2);
 *                      a quarter of them (at least one) are builders
 *   MOLQ_TEST_ROUNDS   passes of each evaluator over the work list
 *                      (default 3)
 *   MOLQ_SPECIES_JSON  path of data/species (set by meson); builders
 *                      read it with molq_db_read_file when it is given
 *
 * Run alone under ThreadSanitizer with tests/hardening/tsan.sh. */
#define _POSIX_C_SOURCE 200809L

#include <pthread.h>
#include <stdarg.h>
#include <stdatomic.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "testutil.h"

static size_t env_size(const char *name, size_t def, size_t min)
{
    const char *s = getenv(name);
    char *end;
    unsigned long v;
    if (s == NULL || *s == '\0')
        return def;
    v = strtoul(s, &end, 10);
    if (*end != '\0')
        return def;
    return v < min ? min : (size_t)v;
}

/* ------------------------------------------------------------------------ */
/* The work list: every call an evaluator makes, with its serial result.    */
/* ------------------------------------------------------------------------ */

enum kind { K_EVAL, K_MANY, K_BATCH, K_MODE, K_SPIN, K_FIND };

typedef struct {
    enum kind kind;
    const molq_species *sp;
    size_t index;       /* K_MODE: mode index; K_FIND: species index */
    molq_property prop; /* K_EVAL, K_BATCH, K_MODE */
    double T, p;        /* K_EVAL, K_MANY, K_MODE; K_BATCH uses p only */
    const double *Tv;   /* K_BATCH temperatures */
    size_t n;           /* number of output values */
    molq_status st;     /* serial status */
    double *ref;        /* serial output, n values */
} job;

/* Temperatures: ordinary ones, the reference point, some below the lower
 * limit of the nonlinear corrected rotor (MOLQ_ERANGE for nonlinear
 * species), an extreme one and invalid ones (MOLQ_EDOMAIN). */
static const double temps[] = {1e-3,   0.5,    5.0,    20.0,   50.0,  100.0,
                               200.0,  298.15, 500.0,  1000.0, 1500.0,
                               2500.0, 4000.0, 6000.0, 2e4,    1e-300,
                               -1.0,   0.0};
#define NTEMPS (sizeof temps / sizeof temps[0])
static const double pressures[] = {1e5, 3.3e6};
#define NPRESS (sizeof pressures / sizeof pressures[0])
static const molq_property mode_props[] = {MOLQ_LNQ, MOLQ_U, MOLQ_CV, MOLQ_S,
                                           MOLQ_DCV_DT};
#define NMODEPROPS (sizeof mode_props / sizeof mode_props[0])

static const molq_db *shared;
static job *jobs;
static size_t njobs;
static molq_property *all_props;
static size_t nprops;
/* Batch inputs: the valid temperatures (those at or above t_min), one list
 * per species. */
static double *batch_T;

static int run_job(const job *j, double *out)
{
    const molq_species *found = NULL;
    switch (j->kind) {
    case K_EVAL:
        return molq_eval(j->sp, j->T, j->p, j->prop, out);
    case K_MANY:
        return molq_eval_many(j->sp, j->T, j->p, all_props, nprops, out);
    case K_BATCH:
        return molq_eval_batch(j->sp, j->prop, j->p, j->Tv, 1, out, 1, j->n);
    case K_MODE:
        return molq_eval_mode(j->sp, j->index, j->T, j->p, j->prop, out);
    case K_SPIN:
        return molq_eval_spin_conversion(j->sp, j->T, out);
    case K_FIND:
        if (molq_db_species(shared, j->index) != j->sp)
            return -1;
        if (molq_db_find(shared, molq_species_name(j->sp), &found) !=
            MOLQ_OK)
            return -2;
        out[0] = found == j->sp ? 1.0 : 0.0;
        out[1] = (double)molq_species_model(j->sp);
        out[2] = (double)molq_species_structure(j->sp);
        out[3] = molq_species_t_min(j->sp);
        out[4] = molq_species_molar_mass(j->sp);
        return MOLQ_OK;
    }
    return -3;
}

static job *add_job(size_t *cap)
{
    if (njobs == *cap) {
        *cap = *cap ? 2 * *cap : 1024;
        jobs = realloc(jobs, *cap * sizeof *jobs);
        ck_assert_ptr_nonnull(jobs);
    }
    memset(&jobs[njobs], 0, sizeof jobs[0]);
    return &jobs[njobs++];
}

static void build_jobs(void)
{
    size_t cap = 0, i, k, q, m, ip;
    size_t nsp = molq_db_count(shared);
    nprops = molq_property_count();
    all_props = malloc(nprops * sizeof *all_props);
    ck_assert_ptr_nonnull(all_props);
    for (q = 0; q < nprops; q++)
        all_props[q] = (molq_property)q;
    batch_T = calloc(nsp * NTEMPS, sizeof *batch_T);
    ck_assert_ptr_nonnull(batch_T);
    for (i = 0; i < nsp; i++) {
        const molq_species *sp = molq_db_species(shared, i);
        size_t nb = 0;
        job *j;
        for (k = 0; k < NTEMPS; k++)
            if (temps[k] > 0.0 && temps[k] >= molq_species_t_min(sp) &&
                temps[k] >= 1e-3)
                batch_T[i * NTEMPS + nb++] = temps[k];
        j = add_job(&cap);
        j->kind = K_FIND;
        j->sp = sp;
        j->index = i;
        j->n = 5;
        for (ip = 0; ip < NPRESS; ip++) {
            double p = pressures[ip];
            for (q = 0; q < nprops; q++) {
                j = add_job(&cap);
                j->kind = K_BATCH;
                j->sp = sp;
                j->prop = (molq_property)q;
                j->p = p;
                j->Tv = &batch_T[i * NTEMPS];
                j->n = nb;
            }
            for (k = 0; k < NTEMPS; k++) {
                double T = temps[k];
                if (ip == 0) {
                    j = add_job(&cap);
                    j->kind = K_SPIN;
                    j->sp = sp;
                    j->T = T;
                    j->n = 1;
                }
                j = add_job(&cap);
                j->kind = K_MANY;
                j->sp = sp;
                j->T = T;
                j->p = p;
                j->n = nprops;
                for (q = 0; q < nprops; q++) {
                    j = add_job(&cap);
                    j->kind = K_EVAL;
                    j->sp = sp;
                    j->prop = (molq_property)q;
                    j->T = T;
                    j->p = p;
                    j->n = 1;
                }
                for (m = 0; m < molq_species_mode_count(sp); m++)
                    for (q = 0; q < NMODEPROPS; q++) {
                        j = add_job(&cap);
                        j->kind = K_MODE;
                        j->sp = sp;
                        j->index = m;
                        j->prop = mode_props[q];
                        j->T = T;
                        j->p = p;
                        j->n = 1;
                    }
            }
        }
    }
    /* Serial results; eval_many, eval_batch and the single calls must also
     * agree with each other bit for bit. */
    for (i = 0; i < njobs; i++) {
        job *j = &jobs[i];
        j->ref = malloc((j->n ? j->n : 1) * sizeof *j->ref);
        ck_assert_ptr_nonnull(j->ref);
        for (k = 0; k < j->n; k++)
            j->ref[k] = NAN;
        j->st = (molq_status)run_job(j, j->ref);
        ck_assert_msg((int)j->st >= 0, "serial lookup of %s failed",
                      molq_species_name(j->sp));
    }
    for (i = 0; i < njobs; i++) {
        const job *j = &jobs[i];
        if (j->kind == K_MANY && j->st == MOLQ_OK)
            for (q = 0; q < nprops; q++) {
                double v = NAN;
                ck_assert_int_eq(molq_eval(j->sp, j->T, j->p,
                                           (molq_property)q, &v),
                                 MOLQ_OK);
                ck_assert_msg(memcmp(&v, &j->ref[q], sizeof v) == 0,
                              "%s %s at %g K: eval %.17g, eval_many %.17g",
                              molq_species_name(j->sp),
                              molq_property_name((molq_property)q), j->T, v,
                              j->ref[q]);
            }
        if (j->kind == K_BATCH) {
            ck_assert_msg(j->st == MOLQ_OK, "batch %s %s: %s",
                          molq_species_name(j->sp),
                          molq_property_name(j->prop),
                          molq_status_string(j->st));
            for (k = 0; k < j->n; k++) {
                double v = NAN;
                ck_assert_int_eq(molq_eval(j->sp, j->Tv[k], j->p, j->prop,
                                           &v),
                                 MOLQ_OK);
                ck_assert_msg(memcmp(&v, &j->ref[k], sizeof v) == 0,
                              "%s %s at %g K: eval %.17g, batch %.17g",
                              molq_species_name(j->sp),
                              molq_property_name(j->prop), j->Tv[k], v,
                              j->ref[k]);
            }
        }
    }
}

static void free_jobs(void)
{
    size_t i;
    for (i = 0; i < njobs; i++)
        free(jobs[i].ref);
    free(jobs);
    free(all_props);
    free(batch_T);
    jobs = NULL;
    all_props = NULL;
    batch_T = NULL;
    njobs = 0;
}

/* ------------------------------------------------------------------------ */
/* Private species that builder threads make again and again.               */
/* ------------------------------------------------------------------------ */

/* An invented nonlinear molecule using every key of the file format (test
 * input only, not data about a real substance). */
static const char private_json[] =
    "{\"schema_version\": 1, \"description\": \"thread test\", \"species\": ["
    "{\"name\": \"tq-1\", \"formula\": \"CH2O\", \"structure\": "
    "\"nonlinear\", \"symmetry_number\": 2, \"rotational_constants\": "
    "[9.4, 1.3, 1.1], \"rotor\": \"corrected\", \"vibrations\": ["
    "{\"wavenumber\": 2780, \"degeneracy\": 1}, {\"wavenumber\": 1750},"
    "{\"wavenumber\": 1500}, {\"wavenumber\": 1170, \"degeneracy\": 2}],"
    "\"electronic_levels\": [{\"energy\": 0, \"degeneracy\": 1},"
    "{\"energy\": 25000, \"degeneracy\": 3}],"
    "\"formation_enthalpy_298\": -108000, \"source\": \"invented\"},"
    "{\"name\": \"tq-2\", \"molar_mass\": 20.0, \"structure\": \"linear\", "
    "\"rotor\": \"classical\", \"rotational_constants\": [20.9],"
    "\"vibrations\": [{\"wavenumber\": 4000}]}]}";

/* Bad inputs the builders also feed in (error paths under threads). */
static const char bad_json[] =
    "{\"species\": [{\"name\": \"bad\", \"molar_mass\": 4, \"structure\": "
    "\"linear\", \"rotational_constants\": [1], \"vibrations\": "
    "[{\"wavenumber\": -5}]}]}";
static const char broken_json[] = "{\"species\": [ {\"name\": \"A\",, } ]}";

static molq_status make_private_spec_species(molq_species **out, char *err,
                                             size_t errlen)
{
    molq_spec *s;
    molq_status st;
    static const double B[3] = {10.4, 1.6, 1.3};
    if ((st = molq_spec_new("tq-3", &s)) != MOLQ_OK)
        return st;
    molq_spec_set_formula(s, "C2H4O");
    molq_spec_set_source(s, "invented for the thread test");
    molq_spec_set_structure(s, MOLQ_NONLINEAR);
    molq_spec_set_symmetry_number(s, 1);
    molq_spec_set_rotational_constants(s, B, 3);
    molq_spec_add_vibration(s, 3000.0, 2);
    molq_spec_add_vibration(s, 1400.0, 3);
    molq_spec_add_vibration(s, 800.0, 1);
    molq_spec_add_electronic_level(s, 0.0, 2);
    molq_spec_add_electronic_level(s, 130.0, 2);
    molq_spec_set_formation_enthalpy(s, -52600.0);
    st = molq_species_create(s, out, err, errlen);
    molq_spec_free(s);
    return st;
}

static molq_status make_bad_spec_species(molq_species **out, char *err,
                                         size_t errlen)
{
    molq_spec *s;
    molq_status st;
    static const double B[3] = {1.0, 2.0, 3.0}; /* wrong order */
    if ((st = molq_spec_new("tq-bad", &s)) != MOLQ_OK)
        return st;
    molq_spec_set_molar_mass(s, 0.03);
    molq_spec_set_structure(s, MOLQ_NONLINEAR);
    molq_spec_set_rotational_constants(s, B, 3);
    st = molq_species_create(s, out, err, errlen);
    molq_spec_free(s);
    return st;
}

/* A short fingerprint of a species: a few properties at a few states. */
#define NFP 12
static void fingerprint(const molq_species *sp, double *fp, molq_status *st)
{
    static const molq_property pr[4] = {MOLQ_CP, MOLQ_S, MOLQ_G,
                                        MOLQ_DCP_DT};
    static const double T[3] = {350.0, 1234.5, 4000.0};
    size_t a, b;
    for (a = 0; a < 3; a++)
        for (b = 0; b < 4; b++) {
            fp[a * 4 + b] = NAN;
            st[a * 4 + b] = molq_eval(sp, T[a], 2e5, pr[b], &fp[a * 4 + b]);
        }
}

static int same_fingerprint(const molq_species *sp, const double *fp,
                            const molq_status *st)
{
    double f[NFP];
    molq_status s[NFP];
    size_t i;
    fingerprint(sp, f, s);
    for (i = 0; i < NFP; i++)
        if (s[i] != st[i] ||
            (s[i] == MOLQ_OK && memcmp(&f[i], &fp[i], sizeof f[i]) != 0))
            return 0;
    return 1;
}

static double *shared_fp;         /* NFP per shared species */
static molq_status *shared_fp_st;
/* Each shared species rebuilt with each model (molq_species_with_model,
 * which reads the shared handle): creation status and fingerprint. */
static molq_status *wm_st; /* 2 per shared species */
static double *wm_fp;      /* 2 * NFP per shared species */
static molq_status *wm_fp_st;
static double private_fp[3][NFP]; /* tq-1, tq-2, tq-3 */
static molq_status private_fp_st[3][NFP];

static void build_fingerprints(void)
{
    size_t i, nsp = molq_db_count(shared);
    molq_db *db;
    molq_species *sp;
    char err[256];
    shared_fp = malloc(nsp * NFP * sizeof *shared_fp);
    shared_fp_st = malloc(nsp * NFP * sizeof *shared_fp_st);
    ck_assert_ptr_nonnull(shared_fp);
    ck_assert_ptr_nonnull(shared_fp_st);
    for (i = 0; i < nsp; i++)
        fingerprint(molq_db_species(shared, i), &shared_fp[i * NFP],
                    &shared_fp_st[i * NFP]);
    wm_st = calloc(2 * nsp, sizeof *wm_st);
    wm_fp = calloc(2 * nsp * NFP, sizeof *wm_fp);
    wm_fp_st = calloc(2 * nsp * NFP, sizeof *wm_fp_st);
    ck_assert_ptr_nonnull(wm_st);
    ck_assert_ptr_nonnull(wm_fp);
    ck_assert_ptr_nonnull(wm_fp_st);
    for (i = 0; i < 2 * nsp; i++) {
        wm_st[i] = molq_species_with_model(molq_db_species(shared, i / 2),
                                           (molq_model)(i % 2), &sp, err,
                                           sizeof err);
        if (wm_st[i] == MOLQ_OK) {
            fingerprint(sp, &wm_fp[i * NFP], &wm_fp_st[i * NFP]);
            molq_species_free(sp);
        }
    }
    ck_assert_msg(molq_db_read_string(private_json, strlen(private_json), &db,
                                      err, sizeof err) == MOLQ_OK,
                  "private species: %s", err);
    fingerprint(molq_db_species(db, 0), private_fp[0], private_fp_st[0]);
    fingerprint(molq_db_species(db, 1), private_fp[1], private_fp_st[1]);
    molq_db_free(db);
    ck_assert_msg(make_private_spec_species(&sp, err, sizeof err) == MOLQ_OK,
                  "spec species: %s", err);
    fingerprint(sp, private_fp[2], private_fp_st[2]);
    molq_species_free(sp);
    for (i = 0; i < 3; i++)
        ck_assert_int_eq(private_fp_st[i][0], MOLQ_OK);
}

/* ------------------------------------------------------------------------ */
/* Threads                                                                  */
/* ------------------------------------------------------------------------ */

typedef struct {
    size_t id;
    size_t rounds;
    size_t calls;
    size_t failures;
    char first[256]; /* description of the first failure */
} worker;

static pthread_barrier_t start_line;
static atomic_int evaluators_left;

#if defined(__GNUC__)
__attribute__((format(printf, 2, 3)))
#endif
static void note(worker *w, const char *fmt, ...);
static void note(worker *w, const char *fmt, ...)
{
    va_list ap;
    if (w->failures++ > 0)
        return;
    va_start(ap, fmt);
    vsnprintf(w->first, sizeof w->first, fmt, ap);
    va_end(ap);
}

static void *evaluator(void *arg)
{
    worker *w = arg;
    size_t r, i, k;
    double out[64];
    double *buf = out;
    size_t cap = sizeof out / sizeof out[0];
    for (i = 0; i < njobs; i++)
        if (jobs[i].n > cap)
            cap = jobs[i].n;
    if (cap > sizeof out / sizeof out[0])
        buf = malloc(cap * sizeof *buf);
    pthread_barrier_wait(&start_line);
    for (r = 0; buf != NULL && r < w->rounds; r++) {
        /* Each thread walks the list from its own offset and in its own
         * direction, so different calls overlap. */
        size_t off = (w->id * 7919u + r * 104729u) % njobs;
        for (i = 0; i < njobs; i++) {
            size_t idx = (w->id & 1u) ? (off + i) % njobs
                                      : (off + njobs - i) % njobs;
            const job *j = &jobs[idx];
            int st;
            for (k = 0; k < j->n; k++)
                buf[k] = -12345.0;
            st = run_job(j, buf);
            w->calls++;
            if (st != (int)j->st) {
                note(w, "%s at T=%g (kind %d): status %d, serially %d",
                     molq_species_name(j->sp), j->T, (int)j->kind, st,
                     (int)j->st);
                continue;
            }
            if (st == MOLQ_OK) {
                if (memcmp(buf, j->ref, j->n * sizeof *buf) != 0)
                    note(w, "%s at T=%g (kind %d): value differs from the "
                         "serial one", molq_species_name(j->sp), j->T,
                         (int)j->kind);
            } else if ((j->kind == K_EVAL || j->kind == K_MODE ||
                        j->kind == K_SPIN) &&
                       buf[0] != -12345.0) {
                note(w, "%s at T=%g: output written on failure %d",
                     molq_species_name(j->sp), j->T, st);
            }
        }
    }
    if (buf != out)
        free(buf);
    if (buf == NULL)
        note(w, "out of memory");
    atomic_fetch_sub(&evaluators_left, 1);
    return NULL;
}

static void check_db_against_shared(worker *w, const molq_db *db,
                                    const char *what)
{
    size_t i, nsp = molq_db_count(shared);
    if (molq_db_count(db) != nsp) {
        note(w, "%s: %zu species, not the shared count (%zu)", what,
             molq_db_count(db), nsp);
        return;
    }
    for (i = 0; i < nsp; i++) {
        const molq_species *sp = molq_db_species(db, i);
        if (strcmp(molq_species_name(sp),
                   molq_species_name(molq_db_species(shared, i))) != 0 ||
            !same_fingerprint(sp, &shared_fp[i * NFP],
                              &shared_fp_st[i * NFP]))
            note(w, "%s: species #%zu differs from the shared one", what, i);
    }
}

static void *builder(void *arg)
{
    worker *w = arg;
    const char *path = getenv("MOLQ_SPECIES_JSON");
    size_t r;
    pthread_barrier_wait(&start_line);
    for (r = 0; r < w->rounds || atomic_load(&evaluators_left) > 0; r++) {
        molq_db *db = NULL;
        molq_species *sp = NULL;
        char err[256];
        molq_status st;
        w->calls++;
        /* 1. the built-in set, equal to the shared one */
        if ((st = molq_db_builtin(&db, err, sizeof err)) != MOLQ_OK)
            note(w, "builtin: %s (%d)", err, st);
        else
            check_db_against_shared(w, db, "builtin copy");
        molq_db_free(db);
        db = NULL;
        /* 2. the species file it is made from */
        if (path != NULL && *path != '\0') {
            if ((st = molq_db_read_file(path, &db, err, sizeof err)) !=
                MOLQ_OK)
                note(w, "species file: %s (%d)", err, st);
            else
                check_db_against_shared(w, db, "species file");
            molq_db_free(db);
            db = NULL;
        }
        /* 3. private species from a JSON string */
        if ((st = molq_db_read_string(private_json, strlen(private_json), &db,
                                      err, sizeof err)) != MOLQ_OK)
            note(w, "private json: %s (%d)", err, st);
        else if (!same_fingerprint(molq_db_species(db, 0), private_fp[0],
                                   private_fp_st[0]) ||
                 !same_fingerprint(molq_db_species(db, 1), private_fp[1],
                                   private_fp_st[1]))
            note(w, "private json: values differ");
        molq_db_free(db);
        db = NULL;
        /* 4. a private species through the spec API */
        if ((st = make_private_spec_species(&sp, err, sizeof err)) !=
            MOLQ_OK)
            note(w, "spec species: %s (%d)", err, st);
        else if (!same_fingerprint(sp, private_fp[2], private_fp_st[2]))
            note(w, "spec species: values differ");
        molq_species_free(sp);
        sp = NULL;
        /* 5. the shared species rebuilt with each model */
        {
            size_t i, nsp = molq_db_count(shared);
            for (i = 0; i < 2 * nsp; i++) {
                sp = NULL;
                st = molq_species_with_model(molq_db_species(shared, i / 2),
                                             (molq_model)(i % 2), &sp, err,
                                             sizeof err);
                if (st != wm_st[i])
                    note(w, "with_model #%zu: status %d, serially %d", i, st,
                         wm_st[i]);
                else if (st == MOLQ_OK &&
                         !same_fingerprint(sp, &wm_fp[i * NFP],
                                           &wm_fp_st[i * NFP]))
                    note(w, "with_model #%zu: values differ", i);
                molq_species_free(sp);
            }
            sp = NULL;
        }
        /* 6. error paths */
        if ((st = molq_db_read_string(bad_json, strlen(bad_json), &db, err,
                                      sizeof err)) != MOLQ_EVALUE ||
            strstr(err, "vibrations[0].wavenumber") == NULL)
            note(w, "bad json: %s (%d)", err, st);
        if ((st = molq_db_read_string(broken_json, strlen(broken_json), &db,
                                      err, sizeof err)) != MOLQ_ESYNTAX)
            note(w, "broken json: %s (%d)", err, st);
        if ((st = make_bad_spec_species(&sp, err, sizeof err)) !=
                MOLQ_EVALUE ||
            strstr(err, "A >= B >= C") == NULL)
            note(w, "bad spec: %s (%d)", err, st);
        if (db != NULL || sp != NULL)
            note(w, "a failed call wrote its output");
    }
    return NULL;
}

START_TEST(shared_handles_under_threads)
{
    size_t nthreads = env_size("MOLQ_TEST_THREADS", 16, 2);
    size_t rounds = env_size("MOLQ_TEST_ROUNDS", 3, 1);
    size_t nbuild = nthreads / 4 ? nthreads / 4 : 1;
    size_t neval = nthreads - nbuild;
    size_t i, total_fail = 0, eval_calls = 0, build_rounds = 0;
    pthread_t *th = calloc(nthreads, sizeof *th);
    worker *w = calloc(nthreads, sizeof *w);
    ck_assert_ptr_nonnull(th);
    ck_assert_ptr_nonnull(w);

    shared = tu_builtin();
    ck_assert_uint_ge(molq_db_count(shared), 1);
    build_jobs();
    build_fingerprints();
    atomic_store(&evaluators_left, (int)neval);
    ck_assert_int_eq(pthread_barrier_init(&start_line, NULL,
                                          (unsigned)nthreads),
                     0);
    for (i = 0; i < nthreads; i++) {
        w[i].id = i;
        w[i].rounds = i < neval ? rounds : 2;
        ck_assert_int_eq(pthread_create(&th[i], NULL,
                                        i < neval ? evaluator : builder,
                                        &w[i]),
                         0);
    }
    for (i = 0; i < nthreads; i++) {
        ck_assert_int_eq(pthread_join(th[i], NULL), 0);
        if (w[i].failures > 0)
            fprintf(stderr, "thread %zu (%s): %zu failures, first: %s\n", i,
                    i < neval ? "evaluator" : "builder", w[i].failures,
                    w[i].first);
        total_fail += w[i].failures;
        if (i < neval)
            eval_calls += w[i].calls;
        else
            build_rounds += w[i].calls;
    }
    pthread_barrier_destroy(&start_line);
    printf("threads: %zu evaluators made %zu calls over %zu species "
           "(%zu-entry work list, %zu rounds); %zu builders made %zu rounds\n",
           neval, eval_calls, molq_db_count(shared), njobs, rounds, nbuild,
           build_rounds);
    ck_assert_uint_eq(eval_calls, neval * rounds * njobs);
    ck_assert_uint_ge(build_rounds, nbuild * 2);
    ck_assert_msg(total_fail == 0, "%zu results differ from the serial ones "
                  "(see stderr)", total_fail);
    free(shared_fp);
    free(shared_fp_st);
    free(wm_st);
    free(wm_fp);
    free(wm_fp_st);
    free_jobs();
    free(th);
    free(w);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("hardening-threads");
    TCase *tc = tcase_create("threads");
    tcase_set_timeout(tc, 600);
    tcase_add_test(tc, shared_handles_under_threads);
    suite_add_tcase(s, tc);
    return tu_run(s);
}
