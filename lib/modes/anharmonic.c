/* Anharmonic vibrations of a polyatomic molecule, by explicit level sum.
 *
 * Second-order vibrational term values (the standard expansion):
 *   G(v) = sum_i w_i (v_i + d_i/2) + sum_{i<=j} x_ij (v_i + d_i/2)(v_j + d_j/2)
 *          + sum_i g_ii l_i^2
 * for modes of degeneracy d_i (1, 2 or 3); a doubly degenerate mode with v
 * quanta has vibrational angular momentum l = v, v-2, ..., each |l| > 0
 * twice; a triply degenerate one is counted (v+1)(v+2)/2-fold without
 * splitting.  Harmonic w_i not given are derived from the observed
 * fundamentals: nu_i = w_i + (1 + d_i) x_ii + 1/2 sum_{j!=i} d_j x_ij
 * (+ g_ii for d_i = 2).  Rotation-vibration coupling, when alpha_i are
 * given, enters each level as the ratio of its classical rotational
 * partition function to the ground state's: prod_k (B_k / B_k(v))^(1/2)
 * (nonlinear, three constants) or B / B(v) (linear), with
 * B_k(v) = B_k - sum_i alpha_ik v_i.
 * Only bound levels count: 0 <= G(v) - G(0) < D0, and no step along any
 * mode may go down (the ladder has not turned over).  The list is summed
 * through modes/level_table.c like the other level sums. */
#include <math.h>
#include <stdlib.h>

#include "core/constants.h"
#include "modes/modes.h"

#define MAX_QUANTA 10000

typedef struct walker {
    const molq_anharm_input *in;
    double e0;
    int v[MOLQ_MAX_ANHARM_MODES];
    double *theta, *w;
    size_t count, limit;
    int overflow;
} walker;

static double energy(const molq_anharm_input *in, const int *v)
{
    double e = 0.0, h[MOLQ_MAX_ANHARM_MODES];
    size_t i, j;
    for (i = 0; i < in->n; i++) {
        h[i] = v[i] + 0.5 * in->d[i];
        e += in->w[i] * h[i];
    }
    for (i = 0; i < in->n; i++)
        for (j = i; j < in->n; j++)
            e += in->x[i][j] * h[i] * h[j];
    return e;
}

/* Rotational weight of a level (1 without coupling); 0 if unphysical. */
static double rot_factor(const molq_anharm_input *in, const int *v)
{
    double f = 1.0;
    size_t k, i;
    for (k = 0; k < in->nrot; k++) {
        double b = in->b0[k];
        for (i = 0; i < in->n; i++)
            b -= in->alpha[i][k] * v[i];
        if (!(b > 0.0))
            return 0.0;
        f *= in->nrot == 1 ? in->b0[k] / b : sqrt(in->b0[k] / b);
    }
    return f;
}

/* Store the levels of the current v (its l sublevels for d = 2 modes). */
static void emit(walker *wk, double e, double weight, size_t i)
{
    const molq_anharm_input *in = wk->in;
    if (i == in->n) {
        if (wk->count >= wk->limit) {
            wk->overflow = 1;
            return;
        }
        if (wk->theta != NULL) {
            wk->theta[wk->count] = MOLQ_C2_CM_K * (e - wk->e0);
            wk->w[wk->count] = weight;
        }
        wk->count++;
        return;
    }
    if (in->d[i] == 2) {
        int l;
        for (l = wk->v[i] % 2; l <= wk->v[i] && !wk->overflow; l += 2)
            emit(wk, e + in->g[i] * l * l, weight * (l > 0 ? 2.0 : 1.0),
                 i + 1);
    } else if (in->d[i] == 3) {
        double n = wk->v[i];
        emit(wk, e, weight * (n + 1) * (n + 2) / 2, i + 1);
    } else {
        emit(wk, e, weight, i + 1);
    }
}

/* Is v bound: below D0 and not past a turnover along any mode? */
static int bound(walker *wk, double *e_out)
{
    const molq_anharm_input *in = wk->in;
    double e = energy(in, wk->v);
    size_t i;
    if (!(e - wk->e0 < in->d0) || e - wk->e0 < 0.0)
        return 0;
    for (i = 0; i < in->n; i++)
        if (wk->v[i] > 0) {
            double lower;
            wk->v[i]--;
            lower = energy(in, wk->v);
            wk->v[i]++;
            if (!(e > lower))
                return 0;
        }
    *e_out = e;
    return 1;
}

static void walk(walker *wk, size_t i)
{
    const molq_anharm_input *in = wk->in;
    if (i == in->n) {
        double e, f;
        if (bound(wk, &e) && (f = rot_factor(in, wk->v)) > 0.0)
            emit(wk, e, f, 0);
        return;
    }
    for (wk->v[i] = 0; wk->v[i] < MAX_QUANTA && !wk->overflow; wk->v[i]++) {
        double e;
        size_t k;
        /* with the later modes at 0, stop once this mode leaves the bound
         * region: adding quanta of later modes cannot bring it back */
        for (k = i + 1; k < in->n; k++)
            wk->v[k] = 0;
        if (!bound(wk, &e))
            break;
        walk(wk, i + 1);
    }
    wk->v[i] = 0;
}

static void start(walker *wk, const molq_anharm_input *in, size_t limit)
{
    size_t i;
    wk->in = in;
    for (i = 0; i < MOLQ_MAX_ANHARM_MODES; i++)
        wk->v[i] = 0;
    wk->e0 = energy(in, wk->v);
    wk->theta = wk->w = NULL;
    wk->count = 0;
    wk->limit = limit;
    wk->overflow = 0;
}

size_t molq_anharm_count(const molq_anharm_input *in, size_t limit)
{
    walker wk;
    start(&wk, in, limit);
    walk(&wk, 0);
    return wk.overflow ? (size_t)-1 : wk.count;
}

int molq_mode_anharmonic_init(molq_mode *m, const molq_anharm_input *in)
{
    walker wk;
    size_t n = molq_anharm_count(in, (size_t)-2);
    double *block = malloc((2 * n + 1) * sizeof *block);
    if (block == NULL)
        return -1;
    start(&wk, in, n);
    wk.theta = block;
    wk.w = block + n;
    walk(&wk, 0);
    m->owned = block;
    m->u.lt.n = n;
    m->u.lt.theta = wk.theta;
    m->u.lt.w = wk.w;
    return molq_level_table_finish(m, MOLQ_MODE_VIBRATION, 1);
}
