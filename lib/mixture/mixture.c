/* Mixture kernels: species sums per cell and the temperature inversion. */
#include "mixture/mixture.h"

#include <math.h>

#include "core/constants.h"
#include "thermo/thermo.h"

double molq_mix_mole_factor(const molq_mixture *mix, const double *X,
                            size_t X_species, molq_basis basis)
{
    double sum = 0.0;
    size_t k;
    for (k = 0; k < mix->n; k++) {
        double v = X[k * X_species];
        if (v > 0.0)
            sum += basis == MOLQ_MASS_FRACTIONS ? v * mix->inv_w[k] : v;
    }
    return 1.0 / sum; /* the api layer checked sum > 0 */
}

void molq_mix_cell(const molq_mixture *mix, double T, double p,
                   const double *X, size_t X_species, molq_basis basis,
                   unsigned need, molq_mix_sums *out)
{
    molq_property props[4] = {MOLQ_H, MOLQ_CP, MOLQ_S, MOLQ_DCP_DT};
    size_t np = 2, k;
    double f = molq_mix_mole_factor(mix, X, X_species, basis);
    double w = 0.0, h = 0.0, cp = 0.0, s = 0.0, dcp = 0.0;
    if (need & MOLQ_MIX_NEED_S)
        np = 3;
    if (need & MOLQ_MIX_NEED_DCP) {
        np = 4;
        if (!(need & MOLQ_MIX_NEED_S))
            props[2] = MOLQ_CP; /* cheap filler */
    }
    for (k = 0; k < mix->n; k++) {
        double v[4];
        double x = molq_mix_x(mix, X, X_species, basis, k, f);
        if (x == 0.0)
            continue; /* contributes nothing, and no log(0) */
        molq_thermo_eval(mix->sp[k], T, p, props, np, v);
        w += x * mix->w[k];
        h += x * v[0];
        cp += x * v[1];
        if (need & MOLQ_MIX_NEED_S)
            s += x * (v[2] - MOLQ_R * log(x));
        if (need & MOLQ_MIX_NEED_DCP)
            dcp += x * v[3];
    }
    out->w = w;
    out->h = h;
    out->cp = cp;
    out->s = s;
    out->dcp = dcp;
}

double molq_mix_property_value(const molq_mix_sums *s, double T,
                               molq_mix_property prop, molq_per per)
{
    double v, cv = s->cp - MOLQ_R;
    switch (prop) {
    case MOLQ_MIX_MOLAR_MASS:   return s->w;
    case MOLQ_MIX_GAS_CONSTANT: return MOLQ_R / s->w;
    case MOLQ_MIX_GAMMA:        return s->cp / cv;
    case MOLQ_MIX_SOUND_SPEED:  return sqrt(s->cp / cv * MOLQ_R * T / s->w);
    case MOLQ_MIX_CP:           v = s->cp; break;
    case MOLQ_MIX_CV:           v = cv; break;
    case MOLQ_MIX_H:            v = s->h; break;
    case MOLQ_MIX_U:            v = s->h - MOLQ_R * T; break;
    case MOLQ_MIX_S:            v = s->s; break;
    case MOLQ_MIX_G:            v = s->h - T * s->s; break;
    case MOLQ_MIX_DCP_DT:
    case MOLQ_MIX_DCV_DT:       v = s->dcp; break;
    default:                    v = 0.0; break;
    }
    return per == MOLQ_PER_MASS ? v / s->w : v;
}

/* f(T) = property - target and its T derivative, per mole. */
static void residual(const molq_mixture *mix, molq_mix_property given,
                     double target, double T, double p, const double *X,
                     size_t X_species, molq_basis basis, double *f,
                     double *df)
{
    molq_mix_sums s;
    molq_mix_cell(mix, T, p, X, X_species, basis,
                  given == MOLQ_MIX_S ? MOLQ_MIX_NEED_S : 0u, &s);
    switch (given) {
    case MOLQ_MIX_U:
        *f = s.h - MOLQ_R * T - target;
        *df = s.cp - MOLQ_R;
        break;
    case MOLQ_MIX_S:
        *f = s.s - target;
        *df = s.cp / T;
        break;
    default:
        *f = s.h - target;
        *df = s.cp;
        break;
    }
}

int molq_mix_solve_t(const molq_mixture *mix, molq_mix_property given,
                     double target, double p, const double *X,
                     size_t X_species, molq_basis basis, double guess,
                     double *T_out, unsigned *evals, double *end_val)
{
    /* The property rises with T (cp, cv > 0), so f < 0 proves the root
     * lies above T and f > 0 below it.  [a, b] is the bracket known so
     * far; an end is "proven" once f was evaluated there. */
    double a = mix->t_lo, b = mix->t_hi, T = guess, f, df;
    int a_proven = 0, b_proven = 0;
    unsigned n = 0;
    const double rtol = mix->cfg.rtol;
    if (!(T > a && T < b))
        T = T <= a ? a : b;
    for (;;) {
        double next;
        residual(mix, given, target, T, p, X, X_species, basis, &f, &df);
        n++;
        if (f == 0.0) {
            *T_out = T;
            *evals = n;
            return 0;
        }
        if (f < 0.0) {
            a = T;
            a_proven = 1;
            if (T >= mix->t_hi) {
                *evals = n;
                *end_val = f + target;
                return 2;
            }
        } else {
            b = T;
            b_proven = 1;
            if (T <= mix->t_lo) {
                *evals = n;
                *end_val = f + target;
                return 1;
            }
        }
        next = T - f / df;
        if (fabs(next - T) <= rtol * T) {
            /* converged; the step may round to T itself */
            *T_out = next < a ? a : next > b ? b : next;
            *evals = n;
            return 0;
        }
        if (!(next > a && next < b)) {
            /* Newton left the bracket: try an unproven end first (the
             * value may lie beyond it), else bisect the proven bracket. */
            if (next >= b && !b_proven)
                next = b;
            else if (next <= a && !a_proven)
                next = a;
            else
                next = 0.5 * (a + b);
        }
        if (a_proven && b_proven && b - a <= rtol * a) {
            *T_out = 0.5 * (a + b);
            *evals = n;
            return 0;
        }
        if (n >= mix->cfg.max_eval) {
            *evals = n;
            return 3;
        }
        T = next;
    }
}
