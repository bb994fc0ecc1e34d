#include "core/lnq_table.h"

#include <math.h>
#include <stdlib.h>

int molq_lnq_table_build(molq_lnq_table *t, double T_lo, double T_hi,
                         double h, molq_exact_fn exact, const void *ctx)
{
    size_t i;
    t->u0 = log(T_lo);
    t->h = h;
    t->inv_h = 1.0 / h;
    t->n = 0;
    t->node = NULL;
    if (!(T_hi > T_lo) || !(h > 0.0))
        return 0; /* empty table: evaluation falls back to the exact sum */
    t->n = (size_t)ceil((log(T_hi) - t->u0) / h) + 1;
    t->node = malloc(4 * t->n * sizeof *t->node);
    if (t->node == NULL) {
        t->n = 0;
        return -1;
    }
    for (i = 0; i < t->n; i++) {
        molq_cumulants c;
        double *f = &t->node[4 * i];
        exact(ctx, exp(t->u0 + h * (double)i), &c);
        f[0] = c.lnq;
        f[1] = h * c.k1;
        f[2] = h * h * (c.k2 - c.k1);
        f[3] = h * h * h * (c.k3 - 3.0 * c.k2 + c.k1);
    }
    return 0;
}

int molq_lnq_table_eval(const molq_lnq_table *t, double T,
                        molq_cumulants *out)
{
    double x = (log(T) - t->u0) * t->inv_h, s, r[4], a, b, c, d;
    double P, P1, P2, P3, f1, f2, f3;
    const double *p, *q;
    size_t i;
    if (t->n < 2 || !(x >= 0.0) || x >= (double)(t->n - 1))
        return -1;
    i = (size_t)x;
    s = x - (double)i;
    p = &t->node[4 * i];
    q = p + 4;
    /* P(s) = Taylor part at 0 (p0 + p1 s + p2 s^2/2 + p3 s^3/6) plus
     * s^4 (a + b s + c s^2 + d s^3) matching q0..q3 at s = 1. */
    r[0] = q[0] - (p[0] + p[1] + p[2] / 2 + p[3] / 6);
    r[1] = q[1] - (p[1] + p[2] + p[3] / 2);
    r[2] = q[2] - (p[2] + p[3]);
    r[3] = q[3] - p[3];
    a = 35 * r[0] - 15 * r[1] + 2.5 * r[2] - r[3] / 6;
    b = -84 * r[0] + 39 * r[1] - 7 * r[2] + r[3] / 2;
    c = 70 * r[0] - 34 * r[1] + 6.5 * r[2] - r[3] / 2;
    d = -20 * r[0] + 10 * r[1] - 2 * r[2] + r[3] / 6;
    {
        double s2 = s * s, s3 = s2 * s, s4 = s3 * s;
        P = p[0] + s * (p[1] + s * (p[2] / 2 + s * p[3] / 6)) +
            s4 * (a + s * (b + s * (c + s * d)));
        P1 = p[1] + s * (p[2] + s * p[3] / 2) +
             s3 * (4 * a + s * (5 * b + s * (6 * c + s * 7 * d)));
        P2 = p[2] + s * p[3] +
             s2 * (12 * a + s * (20 * b + s * (30 * c + s * 42 * d)));
        P3 = p[3] + s * (24 * a + s * (60 * b + s * (120 * c + s * 210 * d)));
    }
    f1 = P1 * t->inv_h;
    f2 = P2 * t->inv_h * t->inv_h;
    f3 = P3 * t->inv_h * t->inv_h * t->inv_h;
    out->lnq = P;
    out->k1 = f1;
    out->k2 = f2 + f1;
    out->k3 = f3 + 3.0 * f2 + 2.0 * f1;
    return 0;
}

void molq_lnq_table_free(molq_lnq_table *t)
{
    free(t->node);
    t->node = NULL;
    t->n = 0;
}
