#include "core/cumulants.h"

#include <math.h>

void molq_cumulants_power(double a, molq_cumulants *out)
{
    out->k1 = a;
    out->k2 = a;
    out->k3 = 2.0 * a;
}

void molq_cumulants_levels(const double *theta, const double *g, size_t n,
                           double T, molq_cumulants *out)
{
    double tmin = theta[0], q = 0.0, m1 = 0.0, m2 = 0.0, m3 = 0.0;
    size_t i;
    if (n == 1) { /* one level: q = g exp(-x), no fluctuation */
        out->lnq = log(g[0]) - theta[0] / T;
        out->k1 = theta[0] / T;
        out->k2 = out->k3 = 0.0;
        return;
    }
    for (i = 1; i < n; i++)
        if (theta[i] < tmin)
            tmin = theta[i];
    for (i = 0; i < n; i++) {
        double y = (theta[i] - tmin) / T;
        double w = g[i] * exp(-y);
        if (w == 0.0)
            continue; /* underflowed level: skip, or 0 * inf would be NaN */
        q += w;
        m1 += w * y;
    }
    m1 /= q;
    for (i = 0; i < n; i++) {
        double y = (theta[i] - tmin) / T;
        double w = g[i] * exp(-y);
        double d = y - m1;
        if (w == 0.0)
            continue;
        m2 += w * d * d;
        m3 += w * d * d * d;
    }
    out->lnq = log(q) - tmin / T;
    out->k1 = m1 + tmin / T;
    out->k2 = m2 / q;
    out->k3 = m3 / q;
}

void molq_cumulants_series(const double *c, size_t n, double y,
                           unsigned need, molq_cumulants *out)
{
    /* P0 = f, P1 = D f, P2 = D^2 f, P3 = D^3 f with D = y d/dy: the term
     * c y^i contributes c y^i i^m to D^m f. */
    double p0 = 1.0, p1 = 0.0, p2 = 0.0, p3 = 0.0, yi = 1.0;
    double h1, h2, h3;
    size_t i;
    for (i = 1; i <= n; i++) {
        double t;
        double di = (double)i;
        yi *= y;
        t = c[i - 1] * yi;
        p0 += t;
        p1 += t * di;
        p2 += t * di * di;
        p3 += t * di * di * di;
    }
    /* Derivatives of h = ln f with respect to t = ln beta. */
    h1 = p1 / p0;
    h2 = p2 / p0 - h1 * h1;
    h3 = p3 / p0 - 3.0 * h1 * (p2 / p0) + 2.0 * h1 * h1 * h1;
    out->lnq = (need & MOLQ_NEED_LNQ) ? log(p0) : 0.0;
    out->k1 = -h1;
    out->k2 = h2 - h1;
    out->k3 = -(h3 - 3.0 * h2 + 2.0 * h1);
}

void molq_cumulants_add_harmonic(double x, double d, unsigned need,
                                 molq_cumulants *acc)
{
    double e, om, r;
    /* One exponential: 1 - e from expm1 where e is near 1, e from exp where
     * 1 - e >= 1/2; either way both are accurate to rounding. */
    if (x < 0.7) {
        om = -expm1(-x);
        e = 1.0 - om;
    } else {
        e = exp(-x);
        om = 1.0 - e;
    }
    if (e == 0.0)
        return; /* frozen mode: q = 1, no energy, no fluctuation */
    /* q = x/(1-e) stays near 1 when x is tiny, so no x^2 / (1-e)^2
     * underflows into 0/0 */
    {
        double qx = x / om;
        r = qx * e; /* k1 of the mode */
        acc->k1 += d * r;
        acc->k2 += d * r * qx;
        if (need & MOLQ_NEED_LNQ)
            acc->lnq -= d * (x > 1.0 ? log1p(-e) : log(om));
        if (need & MOLQ_NEED_K3)
            acc->k3 += d * r * qx * qx * (1.0 + e);
    }
}

#define SORTED_CUTOFF 60.0

void molq_moments_add_sorted(const double *theta, const double *w, size_t n,
                             double zero, double T, molq_moments *m)
{
    size_t i;
    for (i = 0; i < n; i++) {
        double y = (theta[i] - zero) / T, e;
        if (y > SORTED_CUTOFF)
            break;
        e = w[i] * exp(-y);
        m->q += e;
        m->m1 += e * y;
        m->m2 += e * y * y;
        m->m3 += e * y * y * y;
    }
}

void molq_moments_finish(const molq_moments *m, double zero, double T,
                         molq_cumulants *out)
{
    double mean = m->m1 / m->q, r2 = m->m2 / m->q;
    out->lnq = log(m->q) - zero / T;
    out->k1 = mean + zero / T;
    out->k2 = r2 - mean * mean;
    out->k3 = m->m3 / m->q - 3.0 * mean * r2 + 2.0 * mean * mean * mean;
}

void molq_cumulants_blend(const molq_cumulants *a, const molq_cumulants *b,
                          double x, double du, molq_cumulants *out)
{
    double om = 1.0 - x;
    double s0 = x * x * x * x * (35.0 - 84.0 * x + 70.0 * x * x - 20.0 * x * x * x);
    double s1 = 140.0 * x * x * x * om * om * om / du;
    double s2 = 420.0 * x * x * om * om * (1.0 - 2.0 * x) / (du * du);
    double s3 = 840.0 * x * om * (1.0 - 5.0 * x + 5.0 * x * x) / (du * du * du);
    /* u-derivatives of ln q of each side */
    double a1 = a->k1, a2 = a->k2 - a->k1, a3 = a->k3 - 3.0 * a->k2 + a->k1;
    double b1 = b->k1, b2 = b->k2 - b->k1, b3 = b->k3 - 3.0 * b->k2 + b->k1;
    double d0 = b->lnq - a->lnq, d1 = b1 - a1, d2 = b2 - a2;
    double f1 = (1 - s0) * a1 + s0 * b1 + s1 * d0;
    double f2 = (1 - s0) * a2 + s0 * b2 + 2.0 * s1 * d1 + s2 * d0;
    double f3 = (1 - s0) * a3 + s0 * b3 + 3.0 * s1 * d2 + 3.0 * s2 * d1 +
                s3 * d0;
    out->lnq = (1 - s0) * a->lnq + s0 * b->lnq;
    out->k1 = f1;
    out->k2 = f2 + f1;
    out->k3 = f3 + 3.0 * f2 + 2.0 * f1;
}
