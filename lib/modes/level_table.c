/* Modes that are a fixed, sorted list of levels (hindered rotor,
 * anharmonic vibrations): sorting, the exact sum, and its table. */
#include <math.h>
#include <stdlib.h>

#include "modes/modes.h"

#define TABLE_T_LO 1.0
#define TABLE_T_HI 50000.0
#define TABLE_STEP 0.03 /* in ln T; see tests/test_table.c */

static int cmp_pair(const void *a, const void *b)
{
    const double *x = a, *y = b;
    return (x[0] > y[0]) - (x[0] < y[0]);
}

/* Moment-preserving compression of a dense sorted level list: above
 * COMPRESS_FROM, the levels of each geometric energy bin [E, E(1 + eps))
 * with three or more members become two levels that keep the bin's total
 * weight and its first three energy moments (a two-point Gauss rule), so
 * every Boltzmann sum is exact to third order in the bin width; the error
 * is about (30 eps)^4 / 24 = 5e-7 of the merged levels' share.  Returns
 * the new count (in place). */
#define COMPRESS_FROM 300.0 /* K, about 200 cm^-1 */
#define COMPRESS_EPS 2e-3

size_t molq_levels_compress(double *theta, double *w, size_t n)
{
    size_t i = 0, out = 0;
    while (i < n) {
        size_t j = i + 1, k;
        if (theta[i] > COMPRESS_FROM) {
            double edge = theta[i] * (1.0 + COMPRESS_EPS);
            while (j < n && theta[j] < edge)
                j++;
        }
        if (j - i < 3) {
            for (k = i; k < j; k++, out++) {
                theta[out] = theta[k];
                w[out] = w[k];
            }
        } else {
            double W = 0, mu = 0, m2 = 0, m3 = 0, sd, g, t1, t2;
            for (k = i; k < j; k++) {
                W += w[k];
                mu += w[k] * theta[k];
            }
            mu /= W;
            for (k = i; k < j; k++) {
                double d = theta[k] - mu;
                m2 += w[k] * d * d;
                m3 += w[k] * d * d * d;
            }
            m2 /= W;
            m3 /= W;
            if (m2 <= 0.0) { /* all at one energy */
                theta[out] = mu;
                w[out++] = W;
            } else {
                sd = sqrt(m2);
                g = m3 / (m2 * sd);
                t1 = 0.5 * (g - sqrt(g * g + 4.0));
                t2 = 0.5 * (g + sqrt(g * g + 4.0));
                theta[out] = mu + sd * t1;
                w[out++] = W * t2 / (t2 - t1);
                theta[out] = mu + sd * t2;
                w[out++] = W * -t1 / (t2 - t1);
            }
        }
        i = j;
    }
    return out;
}

static void exact_sum(const void *ctx, double T, molq_cumulants *out)
{
    const molq_level_table *t = ctx;
    molq_moments m = {0.0, 0.0, 0.0, 0.0};
    molq_moments_add_sorted(t->theta, t->w, t->n, 0.0, T, &m);
    molq_moments_finish(&m, 0.0, T, out);
}

void molq_level_table_cumulants(const molq_level_table *t, double T,
                                molq_cumulants *out)
{
    if (molq_lnq_table_eval(&t->table, T, out) != 0)
        exact_sum(t, T, out);
}

static void eval_level_table(const molq_mode *m, double T, double p,
                             unsigned need, molq_cumulants *out)
{
    (void)p;
    (void)need;
    molq_level_table_cumulants(&m->u.lt, T, out);
}

int molq_level_table_finish(molq_mode *m, molq_mode_kind kind, int dense)
{
    if (molq_level_table_finish_at(m, &m->u.lt, kind, dense, 1, TABLE_T_HI) !=
        0)
        return -1;
    m->eval = eval_level_table;
    return 0;
}

int molq_level_table_finish_at(molq_mode *m, molq_level_table *t,
                               molq_mode_kind kind, int dense, int shift,
                               double t_hi)
{
    double *pairs = malloc(2 * t->n * sizeof *pairs + 1), zero;
    size_t i;
    if (pairs == NULL)
        goto fail;
    for (i = 0; i < t->n; i++) {
        pairs[2 * i] = t->theta[i];
        pairs[2 * i + 1] = t->w[i];
    }
    qsort(pairs, t->n, 2 * sizeof *pairs, cmp_pair);
    zero = (shift && t->n > 0) ? pairs[0] : 0.0;
    for (i = 0; i < t->n; i++) {
        t->theta[i] = pairs[2 * i] - zero;
        t->w[i] = pairs[2 * i + 1];
    }
    free(pairs);
    m->raw_levels = t->n;
    if (dense)
        t->n = molq_levels_compress(t->theta, t->w, t->n);
    m->kind = kind;
    if (molq_lnq_table_build(&t->table, TABLE_T_LO, t_hi, TABLE_STEP,
                             exact_sum, t) != 0)
        goto fail;
    m->owned2 = t->table.node;
    return 0;
fail:
    free(m->owned);
    m->owned = NULL;
    return -1;
}
