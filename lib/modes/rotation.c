/* Rigid rotation of linear and nonlinear molecules.
 *
 * Classical rotor:   linear    q = T / (sigma theta)
 *                    nonlinear q = sqrt(pi T^3 / (tA tB tC)) / sigma
 * Corrected rotor:   linear: the Euler-Maclaurin (Mulholland) expansion of
 *                      the rigid-rotor sum, y = theta/T,
 *                      q = T/(sigma theta) [1 + y/3 + y^2/15 + 4 y^3/315
 *                                           + y^4/315 + 4 y^5/3465],
 *                      used for y <= LINEAR_SERIES_MAX, where the omitted
 *                      term (about 5.7e-4 y^6) is below 1e-11 relative;
 *                      at lower T the exact sum
 *                      sum (2J+1) exp(-J(J+1) y) / sigma.  The y^4 and y^5
 *                      coefficients were checked against a 60-digit exact
 *                      sum when this file was written; tests/ checks the
 *                      whole expression against the exact sum.
 *                    nonlinear: classical top times (1 + c/T), the first
 *                      quantum correction of the rigid asymmetric top,
 *                      c = [2(tA+tB+tC) - tA tB/tC - tB tC/tA - tA tC/tB]/12,
 *                      valid for T >= tA (error in q below 0.3 % there,
 *                      falling as (tA/T)^2).
 */
#include <math.h>

#include "core/constants.h"
#include "modes/modes.h"

#define LINEAR_SERIES_MAX 0.05
#define LINEAR_SUM_CUTOFF 60.0 /* stop at J(J+1) y > 60: terms < 1e-24 */

static const double linear_series[5] = {1.0 / 3.0, 1.0 / 15.0, 4.0 / 315.0,
                                        1.0 / 315.0, 4.0 / 3465.0};

/* Exact spin-averaged rigid-rotor sum, raw moments of u = J(J+1) y.  The
 * Boltzmann factors follow from one exp by the recurrence
 * exp(-(J+1)(J+2) y) = exp(-J(J+1) y) r^(J+1), r = exp(-2y). */
static void linear_exact_sum(double y, double sigma, molq_cumulants *out)
{
    double q = 0.0, m1 = 0.0, m2 = 0.0, m3 = 0.0, mean;
    double r = exp(-2.0 * y), rj = r, e = 1.0;
    unsigned J;
    for (J = 0;; J++) {
        double u = J ? (double)J * (double)(J + 1) * y : 0.0;
        double w;
        if (u > LINEAR_SUM_CUTOFF && J > 0)
            break;
        w = (2.0 * J + 1.0) * e;
        q += w;
        m1 += w * u;
        m2 += w * u * u;
        m3 += w * u * u * u;
        e *= rj; /* now exp(-(J+1)(J+2) y) */
        rj *= r;
    }
    mean = m1 / q;
    out->lnq = log(q / sigma);
    out->k1 = mean;
    out->k2 = m2 / q - mean * mean;
    out->k3 = m3 / q - 3.0 * mean * (m2 / q) + 2.0 * mean * mean * mean;
}

void molq_rotation_cumulants(const molq_rotation_params *r, double T,
                             unsigned need, molq_cumulants *out)
{
    double a = r->linear ? 1.0 : 1.5;
    if (r->linear && !r->classical && r->theta / T > LINEAR_SERIES_MAX) {
        linear_exact_sum(r->theta / T, r->sigma, out);
        return;
    }
    molq_cumulants_power(a, out);
    out->lnq = (need & MOLQ_NEED_LNQ) ? r->lnq_const + a * log(T) : 0.0;
    if (!r->classical) {
        molq_cumulants c;
        if (r->linear)
            molq_cumulants_series(linear_series, 5, r->theta / T, need, &c);
        else
            molq_cumulants_series(&r->corr, 1, 1.0 / T, need, &c);
        out->lnq += c.lnq;
        out->k1 += c.k1;
        out->k2 += c.k2;
        out->k3 += c.k3;
    }
}

static void eval_rotation(const molq_mode *m, double T, double p,
                          unsigned need, molq_cumulants *out)
{
    (void)p;
    molq_rotation_cumulants(&m->u.rot, T, need, out);
}

void molq_mode_rotation_init(molq_mode *m, int linear, int classical,
                             int sigma, const double *B, double *t_min)
{
    molq_rotation_params *r = &m->u.rot;
    m->kind = MOLQ_MODE_ROTATION;
    m->eval = eval_rotation;
    r->linear = linear;
    r->classical = classical;
    r->sigma = (double)sigma;
    *t_min = 0.0;
    if (linear) {
        r->theta = MOLQ_C2_CM_K * B[0];
        r->lnq_const = -log(r->sigma) - log(r->theta);
        r->corr = 0.0;
    } else {
        double tA = MOLQ_C2_CM_K * B[0], tB = MOLQ_C2_CM_K * B[1],
               tC = MOLQ_C2_CM_K * B[2];
        r->theta = tA;
        r->lnq_const =
            0.5 * (log(MOLQ_PI) - log(tA) - log(tB) - log(tC)) - log(r->sigma);
        r->corr = (2.0 * (tA + tB + tC) - tA * tB / tC - tB * tC / tA -
                   tA * tC / tB) /
                  12.0;
        /* Valid from tA up; also keep the factor 1 + c/T above 1/2 for
         * unusual tops with c < 0. */
        if (!classical)
            *t_min = fmax(tA, -2.0 * r->corr);
    }
}
