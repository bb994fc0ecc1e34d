/* Electronic levels: q = sum g_i exp(-E_i/kT) over the levels given. */
#include "modes/modes.h"

static void eval_electronic(const molq_mode *m, double T, double p,
                            unsigned need, molq_cumulants *out)
{
    (void)p;
    (void)need;
    molq_cumulants_levels(m->u.lev.theta, m->u.lev.g, m->u.lev.n, T, out);
}

void molq_mode_electronic_init(molq_mode *m, size_t n, const double *theta,
                               const double *g)
{
    m->kind = MOLQ_MODE_ELECTRONIC;
    m->eval = eval_electronic;
    m->u.lev.n = n;
    m->u.lev.theta = theta;
    m->u.lev.g = g;
}
