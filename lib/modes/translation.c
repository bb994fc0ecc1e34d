/* Translation: q/N = (2 pi m k T / h^2)^{3/2} kT/p (Sackur-Tetrode). */
#include <math.h>

#include "core/constants.h"
#include "modes/modes.h"

static void eval_translation(const molq_mode *m, double T, double p,
                             unsigned need, molq_cumulants *out)
{
    molq_cumulants_power(1.5, out); /* q ~ T^{3/2} at fixed volume */
    out->lnq = (need & MOLQ_NEED_LNQ)
                   ? m->u.tr.lnq_const + 2.5 * log(T) - log(p)
                   : 0.0;
}

/* ln(q/N) = lnq_const(M) + 5/2 ln T - ln p; a sum of logarithms, so no
 * product over- or underflows for any mass. */
static double lnq_const(double molar_mass)
{
    return 1.5 * (log(2.0 * MOLQ_PI * MOLQ_K_BOLTZMANN) + log(molar_mass) -
                  log(MOLQ_N_AVOGADRO) - 2.0 * log(MOLQ_H_PLANCK)) +
           log(MOLQ_K_BOLTZMANN);
}

void molq_mode_translation_init(molq_mode *m, double molar_mass)
{
    m->kind = MOLQ_MODE_TRANSLATION;
    m->eval = eval_translation;
    m->u.tr.lnq_const = lnq_const(molar_mass);
}

double molq_translation_boltzmann_t(double molar_mass, double g0, double p)
{
    /* g0 q/N = 1: 5/2 ln T = ln p - lnq_const - ln g0 */
    return exp((log(p) - lnq_const(molar_mass) - log(g0)) / 2.5);
}
