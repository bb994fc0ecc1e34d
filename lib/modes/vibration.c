/* Harmonic vibrations: each mode q = 1/(1 - exp(-Theta/T)) (energy zero at
 * the zero-point level), raised to its degeneracy. */
#include "modes/modes.h"

static void eval_vibration(const molq_mode *m, double T, double p,
                           unsigned need, molq_cumulants *out)
{
    const molq_levels_params *v = &m->u.lev;
    size_t i;
    (void)p;
    out->lnq = out->k1 = out->k2 = out->k3 = 0.0;
    for (i = 0; i < v->n; i++)
        molq_cumulants_add_harmonic(v->theta[i] / T, v->g[i], need, out);
}

void molq_mode_vibration_init(molq_mode *m, size_t n, const double *theta,
                              const double *g)
{
    m->kind = MOLQ_MODE_VIBRATION;
    m->eval = eval_vibration;
    m->u.lev.n = n;
    m->u.lev.theta = theta;
    m->u.lev.g = g;
}
