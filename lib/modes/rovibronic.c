/* Diatomic ro-vibrational level sums over electronic states.
 *
 * Term values E(v, J) = Te + sum_kl Y_kl (v + 1/2)^k [J(J+1)]^l (Dunham),
 * measured from the ground state's v = 0, J = 0 term.  Only bound levels
 * count: a vibrational ladder stops at the dissociation energy or where
 * G(v) turns over, a rotational ladder at the dissociation energy or where
 * the centrifugal terms turn it over.  Each rotational level carries
 * g_el * w_parity * (2J + 1), with w the nuclear-spin weight of its J parity
 * on the conventional scale.  The levels are generated once, sorted, and
 * summed at each T until exp(-E/kT) falls below exp(-CUTOFF).
 *
 * 2Pi states (a spin-orbit constant A given; Lambda = 1, S = 1/2): J is
 * half-integer and the rotational term is that of Hill and Van Vleck,
 *   F(J) = B_v [(J+1/2)^2 - 1 -/+ (1/2) sqrt(4 (J+1/2)^2 + Y (Y - 4))],
 * Y = A / B_v, B_v = sum_k Y_k1 (v + 1/2)^k; both signs for J >= 3/2 and a
 * single level B_v (1 - Y/2) at J = 1/2, which belongs to the minus branch
 * when A > 2 B_v (regular: the lower, Omega = 1/2 ladder; A -> +inf) and
 * to the plus branch otherwise (inverted: the upper Omega = 1/2 ladder;
 * A -> -inf).  Large |A| gives the two Hund's case (a) ladders
 * B[J(J+1) - Omega^2] offset by A; A = 0 gives case (b), B[N(N+1) - 1]
 * with J = N -/+ 1/2.  G(v) and the l >= 2 Dunham terms (centrifugal
 * distortion) are added with x = (J+1/2)^2 - 1 in place of J(J+1) (our
 * choice: the mean of the two case (a) diagonal rotational terms over B;
 * in case (b) it differs from N(N+1) by about N, i.e. by a relative 1/N
 * of the small distortion term).
 * Each level carries (g/2) w (2J + 1): g is the state's degeneracy, spin
 * times Lambda doubling (4), of which the explicit ladders resolve the
 * spin, leaving the Lambda doublet, so the two Omega components weigh 4
 * at high T.  Half-integer J has no even/odd nuclear-spin classes: the
 * weights must be equal (heteronuclear; validate.c).  Energies are
 * measured, and D0 counted, from the ground state's lowest level.
 *
 * Spin isomers: in equilibrium one sum over all levels; frozen, the two
 * nuclear-spin modifications (for the ground state, even and odd J; an
 * excited state whose weights are the ground state's swapped belongs the
 * other way round) are a mixture of fixed mole fractions x_p, each with
 * its own sum Q_p (energies from the common zero), combined as
 *   ln q = sum x_p (ln Q_p - ln x_p),  k_n = sum x_p k_n,p  (n = 1, 2, 3)
 * which gives the mixture's U, Cv and S including its ideal mixing term.
 *
 * Speed: an exact sum costs one exp per populated level (thousands for N2
 * at combustion temperatures).  The dense upper part of each list is
 * compressed with moment-preserving two-point rules (modes/level_table.c,
 * below 1e-10 relative in cp), and at build time the sum is sampled on a
 * ln T grid (core/lnq_table.h) from TABLE_T_LO to TABLE_T_HI and evaluated
 * by interpolation with exact-derivative consistency; outside that range
 * the exact sum is used.
 */
#include <math.h>
#include <stdlib.h>

#include "core/constants.h"
#include "modes/modes.h"

#define TABLE_T_LO 10.0  /* K; below, the exact sum is cheap */
#define TABLE_T_HI 50000.0
#define TABLE_STEP 0.03  /* in ln T; see tests/test_table.c */
#define MAX_J 1000000u   /* guard against ladders that never turn over */
#define MAX_V 100000u

int molq_rovib_has_isomers(const molq_rovib_state *st)
{
    return st[0].w_even > 0.0 && st[0].w_odd > 0.0 &&
           st[0].w_even != st[0].w_odd;
}

/* 1 if this state's even J belong to the ground state's odd-J
 * modification (its weights are the ground state's swapped). */
static int flipped(const molq_rovib_state *st, size_t i)
{
    return i > 0 && molq_rovib_has_isomers(st) &&
           st[i].w_even == st[0].w_odd && st[i].w_odd == st[0].w_even;
}

static double term(const molq_rovib_state *s, double vh, double x)
{
    double e = s->te, vk = 1.0;
    int k, l;
    for (k = 0; k < MOLQ_DUNHAM_K; k++) {
        double xl = 1.0;
        for (l = 0; l < MOLQ_DUNHAM_L; l++) {
            e += s->y[k][l] * vk * xl;
            xl *= x;
        }
        vk *= vh;
    }
    return e;
}

double molq_dunham_column(const double (*y)[MOLQ_DUNHAM_L], int l, double vh)
{
    double e = 0.0, vk = 1.0;
    int k;
    for (k = 0; k < MOLQ_DUNHAM_K; k++) {
        e += y[k][l] * vk;
        vk *= vh;
    }
    return e;
}

static double column(const molq_rovib_state *s, int l, double vh)
{
    return molq_dunham_column(s->y, l, vh);
}

/* Term value of a 2Pi level at x = (J + 1/2)^2 - 1 on the branch of sign
 * sgn (-1 or +1) of the Hill-Van Vleck formula, Te and G(v) included.
 * B_v [x -/+ (1/2) sqrt(4 (J + 1/2)^2 + Y (Y - 4))] with Y = A / B_v is
 * written as B_v x -/+ (1/2) sqrt(4 B_v^2 x + (A - 2 B_v)^2) (the same
 * number: 4 (x + 1) + Y^2 - 4Y = 4x + (Y - 2)^2), which needs no division
 * by B_v and has a radicand >= 0 for every x >= 0. */
static double pi_term(const molq_rovib_state *s, double vh, double x, int sgn)
{
    double b = column(s, 1, vh), xl = x, d = s->a - 2.0 * b;
    double e = s->te + column(s, 0, vh) + b * x +
               sgn * 0.5 * sqrt(4.0 * b * b * x + d * d);
    int l;
    for (l = 2; l < MOLQ_DUNHAM_L; l++) {
        xl *= x;
        e += column(s, l, vh) * xl;
    }
    return e;
}

/* The branch (-1 or +1) that holds the single J = 1/2 level at v + 1/2 =
 * vh: there the formula gives B_v - A/2 = -/+ (1/2)|A - 2 B_v|, i.e. the
 * minus branch when A > 2 B_v (regular, the lower Omega = 1/2 ladder),
 * else the plus branch (inverted: the upper Omega = 1/2 ladder). */
static int half_branch(const molq_rovib_state *s, double vh)
{
    return s->a > 2.0 * column(s, 1, vh) ? -1 : 1;
}

void molq_rovib_ladder_minima(const molq_rovib_state *s, double lo[2])
{
    int br;
    if (!s->pi) {
        lo[0] = lo[1] = term(s, 0.5, 0.0);
        return;
    }
    for (br = 0; br < 2; br++) {
        int sgn = br ? 1 : -1;
        /* J = 3/2 (x = 3), and J = 1/2 (x = 0) where it belongs */
        double e = pi_term(s, 0.5, 3.0, sgn);
        if (half_branch(s, 0.5) == sgn) {
            double e1 = pi_term(s, 0.5, 0.0, sgn);
            if (e1 < e)
                e = e1;
        }
        lo[br] = e;
    }
}

typedef struct sink {
    double *theta[2], *w[2];
    size_t n[2], count, limit;
} sink;

/* Store one level (when the sink has arrays) into list par. */
static int put(sink *out, int par, double e, double weight)
{
    if (out->count >= out->limit)
        return -1;
    if (out->theta[0] != NULL) {
        out->theta[par][out->n[par]] = MOLQ_C2_CM_K * e;
        out->w[par][out->n[par]] = weight;
    }
    out->n[par]++;
    out->count++;
    return 0;
}

/* The rotational levels of one vibrational level v of a 2Pi state: both
 * branches, J = 1/2 only on the branch that holds it, each branch up to
 * d0 or its turning point.  Half-integer J has no even/odd parity in the
 * sense of the nuclear-spin weights (validation requires w_even = w_odd),
 * so every level goes to list 0 with weight (g/2) w (2J + 1). */
static int walk_pi(const molq_rovib_state *s, unsigned v, double e0,
                   double d0, sink *out)
{
    double vh = v + 0.5;
    int half = half_branch(s, vh), br;
    for (br = 0; br < 2; br++) {
        int sgn = br ? 1 : -1;
        double eprev = -HUGE_VAL;
        unsigned j; /* J = j + 1/2 */
        for (j = (sgn == half) ? 0u : 1u; j < MAX_J; j++) {
            double jh = j + 1.0; /* J + 1/2 */
            double e = pi_term(s, vh, jh * jh - 1.0, sgn) - e0;
            if (!(e < d0) || e <= eprev)
                break;
            eprev = e;
            if (s->w_even <= 0.0)
                continue;
            if (put(out, 0, e, 0.5 * s->g * s->w_even * 2.0 * jh) != 0)
                return -1;
        }
    }
    return 0;
}

/* Walk all bound levels; store them when the sink has arrays. */
static int walk(const molq_rovib_state *st, size_t n, double d0, sink *out,
                size_t *empty)
{
    double lo[2], e0;
    size_t i;
    molq_rovib_ladder_minima(&st[0], lo);
    e0 = (lo[0] < lo[1] ? lo[0] : lo[1]) - st[0].te;
    *empty = n;
    for (i = 0; i < n; i++) {
        const molq_rovib_state *s = &st[i];
        double gprev = -HUGE_VAL;
        size_t before = out->count;
        unsigned flip = (unsigned)flipped(st, i);
        unsigned v;
        for (v = 0; v < MAX_V; v++) {
            double g = term(s, v + 0.5, 0.0) - e0, eprev = -HUGE_VAL;
            unsigned J;
            if (!(g < d0) || g <= gprev)
                break;
            gprev = g;
            if (s->pi) {
                if (walk_pi(s, v, e0, d0, out) != 0)
                    return -1;
                continue;
            }
            for (J = 0; J < MAX_J; J++) {
                double x = (double)J * (J + 1.0);
                double e = term(s, v + 0.5, x) - e0;
                double w = (J & 1u) ? s->w_odd : s->w_even;
                int par = (int)((J & 1u) ^ flip);
                if (!(e < d0) || e <= eprev)
                    break;
                eprev = e;
                if (w <= 0.0)
                    continue;
                if (put(out, par, e, s->g * w * (2.0 * J + 1.0)) != 0)
                    return -1;
            }
        }
        if (out->count == before && *empty == n)
            *empty = i;
    }
    return 0;
}

size_t molq_rovib_count(const molq_rovib_state *st, size_t n, double d0,
                        size_t limit, size_t *empty)
{
    sink s = {{NULL, NULL}, {NULL, NULL}, {0, 0}, 0, limit};
    if (walk(st, n, d0, &s, empty) != 0)
        return (size_t)-1;
    return s.count;
}

static int cmp_pair(const void *a, const void *b)
{
    const double *x = a, *y = b;
    return (x[0] > y[0]) - (x[0] < y[0]);
}

/* Sort theta ascending, carrying w along (via an interleaved scratch). */
static int sort_list(double *theta, double *w, size_t n)
{
    double *pairs = malloc(2 * n * sizeof *pairs + 1);
    size_t i;
    if (pairs == NULL)
        return -1;
    for (i = 0; i < n; i++) {
        pairs[2 * i] = theta[i];
        pairs[2 * i + 1] = w[i];
    }
    qsort(pairs, n, 2 * sizeof *pairs, cmp_pair);
    for (i = 0; i < n; i++) {
        theta[i] = pairs[2 * i];
        w[i] = pairs[2 * i + 1];
    }
    free(pairs);
    return 0;
}

static void frozen_sum(const molq_rovib_params *r, double x_odd, double T,
                       molq_cumulants *out)
{
    double x[2];
    int p;
    x[0] = 1.0 - x_odd;
    x[1] = x_odd;
    out->lnq = out->k1 = out->k2 = out->k3 = 0.0;
    for (p = 0; p < 2; p++) {
        molq_moments m = {0.0, 0.0, 0.0, 0.0};
        molq_cumulants c;
        if (r->n[p] == 0 || x[p] == 0.0)
            continue;
        molq_moments_add_sorted(r->theta[p], r->w[p], r->n[p], r->theta[p][0],
                                T, &m);
        molq_moments_finish(&m, r->theta[p][0], T, &c);
        out->lnq += x[p] * (c.lnq - log(x[p]));
        out->k1 += x[p] * c.k1;
        out->k2 += x[p] * c.k2;
        out->k3 += x[p] * c.k3;
    }
}

static void equilibrium_sum(const molq_rovib_params *r, double T,
                            molq_cumulants *out)
{
    molq_moments m = {0.0, 0.0, 0.0, 0.0};
    molq_moments_add_sorted(r->theta[0], r->w[0], r->n[0], 0.0, T, &m);
    molq_moments_add_sorted(r->theta[1], r->w[1], r->n[1], 0.0, T, &m);
    molq_moments_finish(&m, 0.0, T, out);
}

static void exact_sum(const void *ctx, double T, molq_cumulants *out)
{
    const molq_rovib_params *r = ctx;
    if (r->frozen)
        frozen_sum(r, r->x_odd, T, out);
    else
        equilibrium_sum(r, T, out);
}

static void eval_rovibronic(const molq_mode *m, double T, double p,
                            unsigned need, molq_cumulants *out)
{
    (void)p;
    (void)need;
    if (molq_lnq_table_eval(&m->u.rv.table, T, out) != 0)
        exact_sum(&m->u.rv, T, out);
}

double molq_rovibronic_conversion(const molq_mode *m, double T)
{
    const molq_rovib_params *r = &m->u.rv;
    molq_cumulants fz, eq;
    if (!r->isomers)
        return 0.0; /* one modification: nothing to convert */
    frozen_sum(r, r->frozen ? r->x_odd : r->x_odd_normal, T, &fz);
    equilibrium_sum(r, T, &eq);
    return fz.k1 - eq.k1;
}

int molq_mode_rovibronic_init(molq_mode *m, const molq_rovib_state *st,
                              size_t n, double d0, int frozen, double x_odd)
{
    size_t empty, count = molq_rovib_count(st, n, d0, (size_t)-2, &empty);
    double *block = malloc(2 * (count + 1) * sizeof *block);
    sink s;
    double zero;
    size_t i;
    int p;
    if (block == NULL)
        return -1;
    s.theta[0] = block;
    s.w[0] = block + count;
    s.n[0] = s.n[1] = 0;
    s.count = 0;
    s.limit = count;
    /* count the even levels first so both lists fit in one block */
    {
        sink c = {{NULL, NULL}, {NULL, NULL}, {0, 0}, 0, count};
        walk(st, n, d0, &c, &empty);
        s.theta[1] = block + c.n[0];
        s.w[1] = block + count + c.n[0];
    }
    walk(st, n, d0, &s, &empty);
    for (p = 0; p < 2; p++)
        if (sort_list(s.theta[p], s.w[p], s.n[p]) != 0) {
            free(block);
            return -1;
        }
    /* energy zero at the lowest level that exists */
    zero = HUGE_VAL;
    for (p = 0; p < 2; p++)
        if (s.n[p] > 0 && s.theta[p][0] < zero)
            zero = s.theta[p][0];
    for (p = 0; p < 2; p++) {
        for (i = 0; i < s.n[p]; i++)
            s.theta[p][i] -= zero;
        s.n[p] = molq_levels_compress(s.theta[p], s.w[p], s.n[p]);
    }

    m->kind = MOLQ_MODE_ROVIBRONIC;
    m->eval = eval_rovibronic;
    m->owned = block;
    m->raw_levels = count;
    for (p = 0; p < 2; p++) {
        m->u.rv.n[p] = s.n[p];
        m->u.rv.theta[p] = s.theta[p];
        m->u.rv.w[p] = s.w[p];
    }
    m->u.rv.frozen = frozen;
    m->u.rv.x_odd = x_odd;
    m->u.rv.x_odd_normal = st[0].w_odd / (st[0].w_even + st[0].w_odd);
    m->u.rv.isomers = molq_rovib_has_isomers(st);
    if (molq_lnq_table_build(&m->u.rv.table, TABLE_T_LO, TABLE_T_HI,
                             TABLE_STEP, exact_sum, &m->u.rv) != 0) {
        free(block);
        m->owned = NULL;
        return -1;
    }
    m->owned2 = m->u.rv.table.node;
    return 0;
}
