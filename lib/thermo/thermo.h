/* thermo/thermo.h -- thermodynamic functions from summed mode cumulants.
 *
 *   U - U0 = RT sum k1          H - H0 = U - U0 + RT
 *   Cv = R sum k2               Cp = Cv + R
 *   S = R (sum lnq + sum k1 + 1)          (lnq of translation holds kT/p)
 *   T dCv/dT = R sum (k3 - 2 k2)
 * No numerical differentiation anywhere.  Arguments are trusted: the api
 * layer has checked T, p, property values and T >= t_min. */
#ifndef MOLQ_THERMO_H
#define MOLQ_THERMO_H

#include "species/species.h"

/* Fill sp->h298_minus_h0 (once, right after the species is built). */
void molq_thermo_prepare(molq_species *sp);

/* out[i] = props[i] at (T, p). */
void molq_thermo_eval(const molq_species *sp, double T, double p,
                      const molq_property *props, size_t n, double *out);

/* Contribution of one mode; returns 0, or -1 if prop is not supported per
 * mode (see molq_eval_mode). */
int molq_thermo_mode(const molq_species *sp, size_t index, double T,
                     double p, molq_property prop, double *out);

/* Spin-isomer conversion enthalpy of a rovibronic mode at T, J/mol. */
double molq_thermo_spin_conversion(const molq_species *sp, size_t index,
                                   double T);

#endif
