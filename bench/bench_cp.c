/*
 * bench_cp.c -- what one cp evaluation in molq costs, measured against what a
 * reacting-flow simulator would pay instead.
 *
 * For N2, H2O and CO2 from the built-in species set this program measures,
 * in one run and over one array of temperatures:
 *
 *   (a) molq_eval(sp, T, 1e5 Pa, MOLQ_CP, &v), one call per temperature;
 *   (b) molq_eval_batch over the same array;
 *   (c) a NASA 7-coefficient polynomial in the published form of McBride,
 *       Gordon & Reno, NASA TM-4513 (1993), for cp and for h, two ranges
 *       200-1000 K and 1000-6000 K chosen by a branch per temperature.  Its
 *       coefficients are fitted here to molq's own values by linear least
 *       squares (gsl_multifit_linear), so the polynomial is a stand-in of
 *       known quality for the same species: only its cost is compared;
 *   (d) the bare exp() floor: one exp(-theta_i/T) per vibration entry of the
 *       species, the calls the harmonic-oscillator model cannot avoid;
 *   (e) molq_eval_many for (cp, h, s) at once against three molq_eval calls.
 *
 * It prints nanoseconds per evaluation and the ratios between them.  Wall-
 * clock numbers depend on the machine; only ratios within one run mean much.
 *
 * It verifies its answers (batch == scalar bit for bit, eval_many == three
 * molq_eval calls bit for bit, the fitted polynomial within FIT_TOL_REL of
 * molq's cp, cp within the equipartition bounds, the hard-coded vibration
 * data equal to the built-in species) and exits 1 if any check fails, 2 if
 * it cannot set up.
 *
 * Only the public API (molq.h) and GSL are used.
 */
#define _POSIX_C_SOURCE 199309L

#include <float.h>
#include <math.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include <gsl/gsl_errno.h>
#include <gsl/gsl_matrix.h>
#include <gsl/gsl_multifit.h>
#include <gsl/gsl_vector.h>

#include "molq/molq.h"

/* ---- benchmark shape ---------------------------------------------------- */

/* Temperatures per pass.  65536 rather than a few thousand on purpose: a
 * modern branch predictor learns a repeating pattern of several thousand
 * random outcomes (on the AMD EPYC this was written on, a shuffled array of
 * 8192 temperatures made the NASA range branch free; 32768 and more did
 * not), which would flatter the polynomial's range branch. */
#define NT 65536
#define T_LO 300.0       /* K */
#define T_HI 3000.0      /* K */
#define P_BENCH MOLQ_P_STANDARD
#define ROUNDS 25        /* timed blocks per measurement; the best is kept */
#define MIN_BLOCK_NS 2e6 /* each timed block lasts at least ~2 ms */
#define SHUFFLE_SEED 20240611u

/* ---- NASA 7-coefficient polynomial ranges and fit ----------------------- */

#define NASA_T_LOW 200.0
#define NASA_T_MID 1000.0
#define NASA_T_HIGH 6000.0
#define FIT_POINTS 501      /* sample temperatures per range */
/* The stand-in must follow molq's cp to 1 %.  A plain quartic fit cannot do
 * much better on 1000-6000 K: the harmonic-oscillator cp bends sharply just
 * above 1000 K and approaches its classical limit as 1/T^2, which a
 * polynomial in T follows poorly (the later NASA 9-coefficient form adds
 * T^-2 and T^-1 terms; McBride, Zehe & Gordon, NASA/TP-2002-211556, from
 * memory).  Any real error in the fit (scaling, wrong range) misses by far
 * more than 1 %. */
#define FIT_TOL_REL 1.0e-2

/* Molar gas constant, J/(mol K): N_A k with both exact in the SI since
 * 2019 (CODATA 2018). */
#define R_GAS (6.02214076e23 * 1.380649e-23)
/* Second radiation constant hc/k in cm K (exact in the SI since 2019). */
#define C2_CM_K (100.0 * 6.62607015e-34 * 299792458.0 / 1.380649e-23)

/* Vibration entries of the species benchmarked, copied from
 * data/species (the source of the built-in set); check_vibrations()
 * confirms at run time that they still reproduce molq's vibrational cv. */
typedef struct {
    const char *name;      /* printed label */
    const char *species;   /* name in the built-in set */
    molq_model model;      /* model to benchmark */
    int linear;            /* structure in data/species */
    size_t nvib;           /* vibration entries = exp() calls per T */
    double wavenumber[4];  /* cm^-1 */
    int degeneracy[4];
} bench_species;

static const bench_species SPECIES[] = {
    /* N2 twice: rigid rotor / harmonic, and the level-sum model (the
     * built-in default), whose exp floor is that of the rrho variant */
    {"N2", "N2", MOLQ_MODEL_RRHO, 1, 1, {2329.915}, {1}},
    {"N2-lev", "N2", MOLQ_MODEL_LEVELS, 1, 1, {2329.915}, {1}},
    {"H2O", "H2O", MOLQ_MODEL_RRHO, 0, 3, {3657.0, 1595.0, 3756.0}, {1, 1, 1}},
    {"H2O-lev", "H2O", MOLQ_MODEL_LEVELS, 0, 3, {3657.0, 1595.0, 3756.0},
     {1, 1, 1}},
    {"CO2", "CO2", MOLQ_MODEL_RRHO, 1, 3, {1333.0, 667.0, 2349.0}, {1, 2, 1}},
    {"CO2-lev", "CO2", MOLQ_MODEL_LEVELS, 1, 3, {1333.0, 667.0, 2349.0},
     {1, 2, 1}},
    /* a 2Pi ground state: both Hill-Van Vleck ladders in one level table */
    {"NO-lev", "NO", MOLQ_MODEL_LEVELS, 1, 1, {1876.05}, {1}},
};
#define NSPECIES (sizeof SPECIES / sizeof SPECIES[0])

/* One range: a[0..6] as published (a1..a7), plus the cp coefficients
 * divided as the h form needs them, precomputed once as simulators do. */
typedef struct {
    double a[7];
    double hdiv[5]; /* a1, a2/2, a3/3, a4/4, a5/5 */
} nasa_range;

typedef struct {
    nasa_range lo, hi; /* 200-1000 K and 1000-6000 K */
} nasa7;

/* ---- timing -------------------------------------------------------------- */

static volatile double sink; /* keeps every result observable */

static double now_ns(void)
{
    struct timespec ts;
    clock_gettime(CLOCK_MONOTONIC, &ts);
    return (double)ts.tv_sec * 1e9 + (double)ts.tv_nsec;
}

typedef struct {
    const molq_species *sp;
    const double *T;
    size_t n;
    double *out;           /* n values, or 3n for the (cp, h, s) kernels */
    const nasa7 *poly;
    const double *theta;   /* K, one per vibration entry */
    size_t ntheta;
    int fail;              /* set by a kernel when a molq call fails */
} bench_ctx;

typedef void (*kernel_fn)(bench_ctx *);

static void k_molq_scalar_cp(bench_ctx *c)
{
    size_t i;
    for (i = 0; i < c->n; i++)
        if (molq_eval(c->sp, c->T[i], P_BENCH, MOLQ_CP, &c->out[i]) != MOLQ_OK)
            c->fail = 1;
}

static void k_molq_batch_cp(bench_ctx *c)
{
    if (molq_eval_batch(c->sp, MOLQ_CP, P_BENCH, c->T, 1, c->out, 1, c->n) !=
        MOLQ_OK)
        c->fail = 1;
}

static const molq_property CP_H_S[3] = {MOLQ_CP, MOLQ_H, MOLQ_S};

static void k_molq_many_cphs(bench_ctx *c)
{
    size_t i;
    for (i = 0; i < c->n; i++)
        if (molq_eval_many(c->sp, c->T[i], P_BENCH, CP_H_S, 3,
                           &c->out[3 * i]) != MOLQ_OK)
            c->fail = 1;
}

static void k_molq_three_cphs(bench_ctx *c)
{
    size_t i;
    for (i = 0; i < c->n; i++) {
        double *o = &c->out[3 * i];
        if (molq_eval(c->sp, c->T[i], P_BENCH, MOLQ_CP, &o[0]) != MOLQ_OK ||
            molq_eval(c->sp, c->T[i], P_BENCH, MOLQ_H, &o[1]) != MOLQ_OK ||
            molq_eval(c->sp, c->T[i], P_BENCH, MOLQ_S, &o[2]) != MOLQ_OK)
            c->fail = 1;
    }
}

/* cp/R = a1 + a2 T + a3 T^2 + a4 T^3 + a5 T^4 */
static inline double nasa_cp(const nasa7 *p, double T)
{
    const nasa_range *r = T < NASA_T_MID ? &p->lo : &p->hi;
    const double *a = r->a;
    return R_GAS * (a[0] + T * (a[1] + T * (a[2] + T * (a[3] + T * a[4]))));
}

/* h/RT = a1 + a2 T/2 + a3 T^2/3 + a4 T^3/4 + a5 T^4/5 + a6/T */
static inline double nasa_h(const nasa7 *p, double T)
{
    const nasa_range *r = T < NASA_T_MID ? &p->lo : &p->hi;
    const double *d = r->hdiv;
    return R_GAS * T *
           (d[0] + T * (d[1] + T * (d[2] + T * (d[3] + T * d[4]))) +
            r->a[5] / T);
}

/* s/R = a1 ln T + a2 T + a3 T^2/2 + a4 T^3/3 + a5 T^4/4 + a7 (at 1e5 Pa);
 * only used to fit a7, not timed. */
static double nasa_s_range(const nasa_range *r, double T)
{
    const double *a = r->a;
    return R_GAS * (a[0] * log(T) +
                    T * (a[1] + T * (a[2] / 2 + T * (a[3] / 3 + T * a[4] / 4))) +
                    a[6]);
}

static void k_nasa_cp(bench_ctx *c)
{
    size_t i;
    for (i = 0; i < c->n; i++)
        c->out[i] = nasa_cp(c->poly, c->T[i]);
}

/* The same cp with the range test written as an if/else around two copies
 * of the formula, as some codes do; gcc keeps this one as a real branch
 * (the form above becomes a conditional move), so with shuffled
 * temperatures it pays for mispredictions. */
static void k_nasa_cp_ifelse(bench_ctx *c)
{
    const double *lo = c->poly->lo.a, *hi = c->poly->hi.a;
    size_t i;
    for (i = 0; i < c->n; i++) {
        double T = c->T[i];
        if (T < NASA_T_MID)
            c->out[i] = R_GAS * (lo[0] + T * (lo[1] + T * (lo[2] + T * (lo[3] + T * lo[4]))));
        else
            c->out[i] = R_GAS * (hi[0] + T * (hi[1] + T * (hi[2] + T * (hi[3] + T * hi[4]))));
    }
}

static void k_nasa_h(bench_ctx *c)
{
    size_t i;
    for (i = 0; i < c->n; i++)
        c->out[i] = nasa_h(c->poly, c->T[i]);
}

static void k_exp_floor(bench_ctx *c)
{
    size_t i, j;
    for (i = 0; i < c->n; i++) {
        double t = c->T[i], s = 0.0;
        for (j = 0; j < c->ntheta; j++)
            s += exp(-c->theta[j] / t);
        c->out[i] = s;
    }
}

/* One measurement: a kernel over a temperature array into an output array. */
typedef struct {
    bench_ctx *ctx;
    kernel_fn kernel;
    const double *T;
    double *out;
    size_t passes; /* passes per timed block */
    double best;   /* best block, ns per evaluation */
} measurement;

static int rounds = ROUNDS;
static double min_block_ns = MIN_BLOCK_NS;

static double time_block(measurement *m)
{
    bench_ctx *c = m->ctx;
    double t0, t1;
    size_t p;
    c->T = m->T;
    c->out = m->out;
    t0 = now_ns();
    for (p = 0; p < m->passes; p++)
        m->kernel(c);
    t1 = now_ns();
    sink += c->out[(size_t)t1 % c->n];
    return (t1 - t0) / (double)m->passes / (double)c->n;
}

/* Time every measurement: first the passes per block are doubled until one
 * block lasts min_block_ns (this also warms caches and branch predictors),
 * then `rounds` rounds run one block of every measurement of every species
 * in turn, so that a slow phase of the machine (frequency changes, a
 * neighbour on a shared host) hits all of them alike; each measurement keeps
 * its best block. */
static void time_all(measurement *ms, size_t count)
{
    size_t i;
    int r;
    for (i = 0; i < count; i++) {
        ms[i].passes = 1;
        while (time_block(&ms[i]) * (double)ms[i].ctx->n *
                       (double)ms[i].passes < min_block_ns &&
               ms[i].passes < ((size_t)1 << 20))
            ms[i].passes *= 2;
        ms[i].best = DBL_MAX;
    }
    for (r = 0; r < rounds; r++)
        for (i = 0; i < count; i++) {
            double t = time_block(&ms[i]);
            if (t < ms[i].best)
                ms[i].best = t;
        }
}

/* ---- the fit --------------------------------------------------------------- */

/* Fit one range [t0, t1]: a1..a5 to molq's cp/R by gsl_multifit_linear on
 * the scaled variable tau = T/1000 (keeps the normal matrix well
 * conditioned; a_k = b_k / 1000^k is exact algebra), then a6 and a7 as the
 * least-squares constants (the mean residuals) of h/R and s/R. */
static int fit_range(const molq_species *sp, double t0, double t1,
                     nasa_range *r)
{
    const size_t m = FIT_POINTS, ncoef = 5;
    gsl_matrix *X = gsl_matrix_alloc(m, ncoef);
    gsl_vector *y = gsl_vector_alloc(m);
    gsl_vector *b = gsl_vector_alloc(ncoef);
    gsl_matrix *cov = gsl_matrix_alloc(ncoef, ncoef);
    gsl_multifit_linear_workspace *w = gsl_multifit_linear_alloc(m, ncoef);
    double chisq, scale = 1.0, sum6 = 0.0, sum7 = 0.0;
    size_t i, k;
    int ok = X && y && b && cov && w;

    for (i = 0; ok && i < m; i++) {
        double T = t0 + (t1 - t0) * (double)i / (double)(m - 1), cp, tau = T / 1000.0, tk = 1.0;
        if (molq_eval(sp, T, P_BENCH, MOLQ_CP, &cp) != MOLQ_OK) {
            ok = 0;
            break;
        }
        for (k = 0; k < ncoef; k++, tk *= tau)
            gsl_matrix_set(X, i, k, tk);
        gsl_vector_set(y, i, cp / R_GAS);
    }
    if (ok && gsl_multifit_linear(X, y, b, cov, &chisq, w) != GSL_SUCCESS)
        ok = 0;
    for (k = 0; ok && k < ncoef; k++, scale *= 1000.0) {
        r->a[k] = gsl_vector_get(b, k) / scale;
        r->hdiv[k] = r->a[k] / (double)(k + 1);
    }
    if (ok) {
        r->a[5] = r->a[6] = 0.0;
        for (i = 0; i < m; i++) {
            double T = t0 + (t1 - t0) * (double)i / (double)(m - 1), v[2];
            const molq_property hs[2] = {MOLQ_H, MOLQ_S};
            const double *d = r->hdiv;
            if (molq_eval_many(sp, T, MOLQ_P_STANDARD, hs, 2, v) != MOLQ_OK) {
                ok = 0;
                break;
            }
            /* h/R - T (a1 + a2 T/2 + ...) = a6 */
            sum6 += v[0] / R_GAS -
                    T * (d[0] + T * (d[1] + T * (d[2] + T * (d[3] + T * d[4]))));
            /* s/R - (s form with a7 = 0) = a7 */
            sum7 += v[1] / R_GAS - nasa_s_range(r, T) / R_GAS;
        }
        r->a[5] = sum6 / (double)m;
        r->a[6] = sum7 / (double)m;
    }
    gsl_multifit_linear_free(w);
    gsl_matrix_free(cov);
    gsl_vector_free(b);
    gsl_vector_free(y);
    gsl_matrix_free(X);
    return ok;
}

typedef struct {
    double cp_abs, cp_rel; /* max |cp_fit - cp_molq|, J/(mol K) and relative */
    double cp_T;           /* temperature of the largest relative cp miss */
    double h_abs;          /* max |h_fit - h_molq|, J/mol */
    double s_abs;          /* max |s_fit - s_molq|, J/(mol K) */
} fit_error;

static void fit_error_add(fit_error *e, const nasa7 *p, const molq_species *sp,
                          double T)
{
    const molq_property props[3] = {MOLQ_CP, MOLQ_H, MOLQ_S};
    double v[3], d;
    const nasa_range *r = T < NASA_T_MID ? &p->lo : &p->hi;
    if (molq_eval_many(sp, T, MOLQ_P_STANDARD, props, 3, v) != MOLQ_OK) {
        e->cp_abs = e->cp_rel = e->h_abs = e->s_abs = INFINITY;
        return;
    }
    d = fabs(nasa_cp(p, T) - v[0]);
    if (d > e->cp_abs)
        e->cp_abs = d;
    if (d / fabs(v[0]) > e->cp_rel) {
        e->cp_rel = d / fabs(v[0]);
        e->cp_T = T;
    }
    d = fabs(nasa_h(p, T) - v[1]);
    if (d > e->h_abs)
        e->h_abs = d;
    d = fabs(nasa_s_range(r, T) - v[2]);
    if (d > e->s_abs)
        e->s_abs = d;
}

/* ---- checks ------------------------------------------------------------- */

static int failures;

static void check(int ok, const char *species, const char *what)
{
    if (!ok) {
        failures++;
        printf("FAIL %s: %s\n", species, what);
    }
}

/* The hard-coded wavenumbers must give molq's own vibrational cv (harmonic
 * oscillator, Einstein function x^2 e^x/(e^x-1)^2 per degree of freedom). */
static int check_vibrations(const molq_species *sp, const bench_species *b)
{
    size_t i, nm = molq_species_mode_count(sp);
    const double T = 1000.0;
    for (i = 0; i < nm; i++) {
        molq_mode_kind kind;
        double cv_molq, cv = 0.0;
        size_t j;
        if (molq_species_mode_kind(sp, i, &kind) != MOLQ_OK)
            return 0;
        if (kind != MOLQ_MODE_VIBRATION)
            continue;
        if (molq_eval_mode(sp, i, T, P_BENCH, MOLQ_CV, &cv_molq) != MOLQ_OK)
            return 0;
        for (j = 0; j < b->nvib; j++) {
            double x = C2_CM_K * b->wavenumber[j] / T, em1 = expm1(x);
            cv += b->degeneracy[j] * R_GAS * x * x * (em1 + 1.0) / (em1 * em1);
        }
        return fabs(cv - cv_molq) <= 1e-9 * cv_molq;
    }
    return 0; /* no vibration mode */
}

/* ---- main ------------------------------------------------------------------ */

static uint64_t splitmix64(uint64_t *s)
{
    uint64_t z = (*s += 0x9E3779B97F4A7C15u);
    z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9u;
    z = (z ^ (z >> 27)) * 0x94D049BB133111EBu;
    return z ^ (z >> 31);
}

typedef struct {
    double scalar, batch, poly_cp, poly_h, expf, many, three;
    double scalar_sorted, poly_cp_sorted, ifelse, ifelse_sorted;
    fit_error fit_bench, fit_full;
    double cp_step; /* |cp_lo(1000) - cp_hi(1000)|, J/(mol K) */
} result;

/* Per-species state and outputs (static: about 19 MB in all). */
typedef struct {
    const molq_species *sp;
    nasa7 poly;
    double theta[4];
    bench_ctx ctx;
    double o_scalar[NT], o_batch[NT], o_pcp[NT], o_ph[NT], o_exp[NT],
        o_tmp[NT], o_ifelse[NT], o_many[3 * NT], o_three[3 * NT];
    result r;
    molq_species *own; /* the species rebuilt with the benchmarked model */
} species_run;

#define NKERNELS 11

static double T_sorted[NT], T_shuf[NT];
static species_run runs[NSPECIES];

static void usage(void)
{
    printf("usage: bench_cp [--quick]\n"
           "  Times cp evaluation in molq (scalar and batch) against a NASA\n"
           "  7-coefficient polynomial fitted to molq and against the bare exp()\n"
           "  calls of the vibrational model, for N2, H2O and CO2; prints ns per\n"
           "  evaluation and ratios; exits 1 if a verification fails.\n"
           "  --quick  3 rounds of short blocks (for valgrind --tool=callgrind;\n"
           "           the times it prints are then rough)\n");
}

int main(int argc, char **argv)
{
    measurement ms[NSPECIES * NKERNELS];
    char err[256];
    molq_db *db = NULL;
    uint64_t seed = SHUFFLE_SEED;
    size_t i, s;
    double t_start = now_ns();

    for (i = 1; i < (size_t)argc; i++) {
        if (strcmp(argv[i], "--quick") == 0) {
            rounds = 3;
            min_block_ns = 2e5;
        } else if (strcmp(argv[i], "--help") == 0 || strcmp(argv[i], "-h") == 0) {
            usage();
            return 0;
        } else {
            fprintf(stderr, "bench_cp: unknown argument '%s'\n", argv[i]);
            usage();
            return 2;
        }
    }

    gsl_set_error_handler_off();
    if (molq_db_builtin(&db, err, sizeof err) != MOLQ_OK) {
        fprintf(stderr, "bench_cp: cannot open the built-in species: %s\n", err);
        return 2;
    }

    for (i = 0; i < NT; i++)
        T_sorted[i] = T_shuf[i] = T_LO + (T_HI - T_LO) * (double)i / (NT - 1);
    for (i = NT - 1; i > 0; i--) { /* Fisher-Yates, fixed seed */
        size_t j = (size_t)(splitmix64(&seed) % (uint64_t)(i + 1));
        double t = T_shuf[i];
        T_shuf[i] = T_shuf[j];
        T_shuf[j] = t;
    }

    printf("molq %s cp benchmark: %d temperatures evenly spread over %.0f-%.0f K, "
           "shuffled (fixed seed), p = %.0f Pa\n",
           molq_version_string(), NT, T_LO, T_HI, P_BENCH);
    printf("time per evaluation (one temperature) in ns, best of %d blocks of >= %.1f ms,\n"
           "all measurements of all species interleaved round by round\n\n",
           rounds, min_block_ns / 1e6);

    /* Set up: find each species, check the hard-coded data, fit the
     * stand-in polynomial. */
    for (s = 0; s < NSPECIES; s++) {
        const bench_species *b = &SPECIES[s];
        species_run *u = &runs[s];
        result *r = &u->r;

        {
            const molq_species *base;
            char err[256];
            if (molq_db_find(db, b->species, &base) != MOLQ_OK ||
                molq_species_with_model(base, b->model, &u->own, err,
                                        sizeof err) != MOLQ_OK) {
                fprintf(stderr, "bench_cp: species %s with model %d not "
                        "available\n", b->species, (int)b->model);
                molq_db_free(db);
                return 2;
            }
            u->sp = u->own;
        }
        if (b->model == MOLQ_MODEL_RRHO)
            check(check_vibrations(u->sp, b), b->name,
                  "hard-coded wavenumbers do not reproduce molq's vibrational "
                  "cv (data/species changed?)");
        for (i = 0; i < b->nvib; i++)
            u->theta[i] = C2_CM_K * b->wavenumber[i];

        if (!fit_range(u->sp, NASA_T_LOW, NASA_T_MID, &u->poly.lo) ||
            !fit_range(u->sp, NASA_T_MID, NASA_T_HIGH, &u->poly.hi)) {
            fprintf(stderr, "bench_cp: %s: polynomial fit failed\n", b->name);
            molq_db_free(db);
            return 2;
        }
        for (i = 0; i < NT; i++)
            fit_error_add(&r->fit_bench, &u->poly, u->sp, T_sorted[i]);
        for (i = 0; i <= 5800; i++) /* 200-6000 K in 1 K steps */
            fit_error_add(&r->fit_full, &u->poly, u->sp, NASA_T_LOW + (double)i);
        {
            const double *lo = u->poly.lo.a, *hi = u->poly.hi.a, T = NASA_T_MID;
            double cl = lo[0] + T * (lo[1] + T * (lo[2] + T * (lo[3] + T * lo[4])));
            double ch = hi[0] + T * (hi[1] + T * (hi[2] + T * (hi[3] + T * hi[4])));
            r->cp_step = R_GAS * fabs(cl - ch);
        }

        u->ctx.sp = u->sp;
        u->ctx.n = NT;
        u->ctx.poly = &u->poly;
        u->ctx.theta = u->theta;
        u->ctx.ntheta = b->nvib;
        {
            measurement m[NKERNELS] = {
                {&u->ctx, k_molq_scalar_cp, T_shuf, u->o_scalar, 0, 0.0},
                {&u->ctx, k_molq_batch_cp, T_shuf, u->o_batch, 0, 0.0},
                {&u->ctx, k_nasa_cp, T_shuf, u->o_pcp, 0, 0.0},
                {&u->ctx, k_nasa_h, T_shuf, u->o_ph, 0, 0.0},
                {&u->ctx, k_exp_floor, T_shuf, u->o_exp, 0, 0.0},
                {&u->ctx, k_molq_many_cphs, T_shuf, u->o_many, 0, 0.0},
                {&u->ctx, k_molq_three_cphs, T_shuf, u->o_three, 0, 0.0},
                {&u->ctx, k_molq_scalar_cp, T_sorted, u->o_tmp, 0, 0.0},
                {&u->ctx, k_nasa_cp, T_sorted, u->o_tmp, 0, 0.0},
                {&u->ctx, k_nasa_cp_ifelse, T_shuf, u->o_ifelse, 0, 0.0},
                {&u->ctx, k_nasa_cp_ifelse, T_sorted, u->o_tmp, 0, 0.0},
            };
            memcpy(&ms[s * NKERNELS], m, sizeof m);
        }
    }

    time_all(ms, NSPECIES * NKERNELS);

    for (s = 0; s < NSPECIES; s++) {
        const bench_species *b = &SPECIES[s];
        species_run *u = &runs[s];
        result *r = &u->r;
        const measurement *m = &ms[s * NKERNELS];
        int cp_same = 1, bounds = 1, fit_ok = 1;
        /* Equipartition bounds (textbook): translation 3/2 R plus R for
         * p V, rotation R (linear) or 3/2 R (nonlinear), each vibrational
         * degree of freedom between 0 and R; a little slack for the rotor's
         * quantum corrections. */
        double lo = b->linear ? 3.5 : 4.0, hi = lo;

        r->scalar = m[0].best;
        r->batch = m[1].best;
        r->poly_cp = m[2].best;
        r->poly_h = m[3].best;
        r->expf = m[4].best;
        r->many = m[5].best;
        r->three = m[6].best;
        r->scalar_sorted = m[7].best;
        r->poly_cp_sorted = m[8].best;
        r->ifelse = m[9].best;
        r->ifelse_sorted = m[10].best;

        /* Verification of what was timed. */
        check(!u->ctx.fail, b->name, "a molq evaluation returned an error");
        check(memcmp(u->o_scalar, u->o_batch, sizeof u->o_scalar) == 0, b->name,
              "molq_eval_batch differs from molq_eval");
        check(memcmp(u->o_pcp, u->o_ifelse, sizeof u->o_pcp) == 0, b->name,
              "the two forms of the NASA cp polynomial differ");
        check(memcmp(u->o_many, u->o_three, sizeof u->o_many) == 0, b->name,
              "molq_eval_many(cp,h,s) differs from three molq_eval calls");
        for (i = 0; i < b->nvib; i++)
            hi += b->degeneracy[i];
        /* level sums carry anharmonicity, centrifugal stretching and
         * low electronic levels (NO's 2Pi3/2), which lift cp above the
         * harmonic limit: JANAF's NO has cp = 4.54 R at 3000 K (common
         * practice; NIST-JANAF 1998, from memory) */
        if (b->model == MOLQ_MODEL_LEVELS)
            hi += 0.25;
        for (i = 0; i < NT; i++) {
            double cpR = u->o_scalar[i] / R_GAS;
            if (u->o_many[3 * i] != u->o_scalar[i])
                cp_same = 0;
            if (!(cpR > lo - 0.01 && cpR < hi + 0.01))
                bounds = 0;
            if (!(fabs(u->o_pcp[i] - u->o_scalar[i]) <= FIT_TOL_REL * u->o_scalar[i]))
                fit_ok = 0;
            if (!isfinite(u->o_ph[i]) || !isfinite(u->o_exp[i]))
                fit_ok = 0;
        }
        check(cp_same, b->name, "cp from molq_eval_many differs from molq_eval");
        check(bounds, b->name, "cp outside the equipartition bounds");
        check(fit_ok && r->fit_full.cp_rel <= FIT_TOL_REL, b->name,
              "fitted polynomial misses molq's cp by more than FIT_TOL_REL");
    }
    for (s = 0; s < NSPECIES; s++)
        molq_species_free(runs[s].own);
    molq_db_free(db);

    /* Report. */
    printf("%-7s %12s %11s %9s %9s %10s | %10s %9s %9s %11s\n", "species",
           "molq scalar", "molq batch", "NASA cp", "NASA h", "exp floor",
           "scalar/cp", "batch/cp", "scalar/h", "scalar/exp");
    for (s = 0; s < NSPECIES; s++) {
        const result *r = &runs[s].r;
        printf("%-7s %12.1f %11.1f %9.2f %9.2f %10.2f | %10.1f %9.1f %9.1f %11.2f\n",
               SPECIES[s].name, r->scalar, r->batch, r->poly_cp, r->poly_h,
               r->expf, r->scalar / r->poly_cp, r->batch / r->poly_cp,
               r->scalar / r->poly_h, r->scalar / r->expf);
    }
    printf("(exp floor: one exp(-theta_i/T) per vibration entry: N2 1, H2O 3, CO2 3)\n\n");

    printf("(cp, h, s) at one state, ns per temperature:\n");
    printf("%-7s %16s %14s %8s\n", "species", "molq_eval_many", "3 x molq_eval", "saving");
    for (s = 0; s < NSPECIES; s++)
        printf("%-7s %16.1f %14.1f %7.2fx\n", SPECIES[s].name, runs[s].r.many,
               runs[s].r.three, runs[s].r.three / runs[s].r.many);

    printf("\ntemperature order and the polynomial's range test, ns per evaluation:\n");
    printf("%-7s %22s %22s %22s\n", "", "molq scalar", "NASA cp (select)",
           "NASA cp (if/else)");
    printf("%-7s %11s %10s %11s %10s %11s %10s\n", "species", "shuffled",
           "sorted", "shuffled", "sorted", "shuffled", "sorted");
    for (s = 0; s < NSPECIES; s++) {
        const result *r = &runs[s].r;
        printf("%-7s %11.1f %10.1f %11.2f %10.2f %11.2f %10.2f\n",
               SPECIES[s].name, r->scalar, r->scalar_sorted, r->poly_cp,
               r->poly_cp_sorted, r->ifelse, r->ifelse_sorted);
    }

    printf("\nfit of the NASA stand-in to molq (plain least squares per range, "
           "no continuity constraint at %.0f K):\n", NASA_T_MID);
    for (s = 0; s < NSPECIES; s++) {
        const result *r = &runs[s].r;
        printf("%-7s max |cp_fit - cp| %.4f J/(mol K) (%.3f %%) over %.0f-%.0f K,\n"
               "%-7s %.4f J/(mol K) (%.3f %%, at %.0f K) over %.0f-%.0f K;"
               " max |h_fit - h| %.1f J/mol; cp step at %.0f K %.4f J/(mol K)\n",
               SPECIES[s].name, r->fit_bench.cp_abs, 100 * r->fit_bench.cp_rel,
               T_LO, T_HI, "", r->fit_full.cp_abs, 100 * r->fit_full.cp_rel,
               r->fit_full.cp_T, NASA_T_LOW, NASA_T_HIGH, r->fit_full.h_abs,
               NASA_T_MID, r->cp_step);
    }

    printf("\n");
    for (s = 0; s < NSPECIES; s++) {
        const result *r = &runs[s].r;
        printf("ratio species=%s scalar_over_poly_cp=%.3f batch_over_poly_cp=%.3f "
               "scalar_over_poly_h=%.3f scalar_over_exp=%.3f many_over_three=%.3f "
               "scalar_over_poly_cp_ifelse=%.3f fit_max_cp_rel=%.3g\n",
               SPECIES[s].name, r->scalar / r->poly_cp, r->batch / r->poly_cp,
               r->scalar / r->poly_h, r->scalar / r->expf, r->many / r->three,
               r->scalar / r->ifelse, r->fit_bench.cp_rel);
    }
    for (s = 0; s < NSPECIES; s++) {
        const result *r = &runs[s].r;
        printf("ns species=%s molq_scalar=%.2f molq_batch=%.2f poly_cp=%.3f "
               "poly_h=%.3f exp_floor=%.3f molq_many_cphs=%.2f molq_three_cphs=%.2f "
               "poly_cp_ifelse=%.3f\n",
               SPECIES[s].name, r->scalar, r->batch, r->poly_cp, r->poly_h,
               r->expf, r->many, r->three, r->ifelse);
    }

    printf("\nverification: %s (batch == scalar, eval_many == 3 x eval, fit within "
           "%.1f %%, equipartition bounds, vibration data); run took %.1f s\n",
           failures ? "FAILED" : "passed", 100 * FIT_TOL_REL,
           (now_ns() - t_start) / 1e9);
    return failures ? 1 : 0;
}
