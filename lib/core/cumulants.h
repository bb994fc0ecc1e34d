/* core/cumulants.h -- the currency between modes and thermo.
 *
 * Every mode reports, at temperature T, ln q and the first three cumulants
 * of its energy in units of kT:
 *   k1 = <E>/kT,  k2 = Var(E)/(kT)^2,  k3 = <(E - <E>)^3>/(kT)^3.
 * Independent modes multiply partition functions, so all four add.  The
 * helpers here turn the common shapes of partition function into these
 * numbers; they know nothing of any particular degree of freedom. */
#ifndef MOLQ_CORE_CUMULANTS_H
#define MOLQ_CORE_CUMULANTS_H

#include <stddef.h>

typedef struct molq_cumulants {
    double lnq, k1, k2, k3;
} molq_cumulants;

/* Flags telling a mode which outputs are needed: k1 and k2 are always
 * computed; ln q and k3 only on request (they cost a log or more work). */
enum { MOLQ_NEED_LNQ = 1u, MOLQ_NEED_K3 = 2u };

/* q proportional to T^a: k1 = a, k2 = a, k3 = 2a (lnq left to the caller). */
void molq_cumulants_power(double a, molq_cumulants *out);

/* A level sum q = sum g_i exp(-theta_i / T) (n >= 1; theta_i = E_i/k in K),
 * computed stably: weights are shifted by the lowest level and moments are
 * central (two passes).  Finite for any finite theta_i and T > 0. */
void molq_cumulants_levels(const double *theta, const double *g, size_t n,
                           double T, molq_cumulants *out);

/* A correction factor f = 1 + c[0] y + c[1] y^2 + ... + c[n-1] y^n where
 * y is proportional to 1/T (so y d/dy = d/d ln beta).  Requires f > 0.
 * Writes the cumulants of ln f, analytically (ln f itself only when
 * need has MOLQ_NEED_LNQ; 0 otherwise). */
void molq_cumulants_series(const double *c, size_t n, double y,
                           unsigned need, molq_cumulants *out);

/* Raw moments of y = (theta - zero)/T over a level list sorted by theta:
 * q = sum w e^-y, m_n = sum w y^n e^-y.  The sum stops once y exceeds 60
 * (terms below 1e-26 of the first), so a long sorted list costs only its
 * populated part. */
typedef struct molq_moments {
    double q, m1, m2, m3;
} molq_moments;

void molq_moments_add_sorted(const double *theta, const double *w, size_t n,
                             double zero, double T, molq_moments *m);

/* Cumulants of a sum whose energies were shifted down by `zero` (K). */
void molq_moments_finish(const molq_moments *m, double zero, double T,
                         molq_cumulants *out);

/* Smooth hand-over between two descriptions of the same partition
 * function: f = (1 - s) f_a + s f_b in u = ln T, s the C^3 septic smoothstep
 * of x = (u - u1)/du in [0, 1].  The cumulants of the blend follow from the
 * derivatives of f (f_u = k1, f_uu = k2 - k1, f_uuu = k3 - 3k2 + k1), so
 * thermodynamic consistency holds through the hand-over. */
void molq_cumulants_blend(const molq_cumulants *a, const molq_cumulants *b,
                          double x, double du, molq_cumulants *out);

/* One harmonic oscillator with x = Theta/T, times weight d (degeneracy),
 * added to acc.  Uses exp(-x) and expm1 only; finite for any x >= 0
 * including +inf (which contributes nothing). */
void molq_cumulants_add_harmonic(double x, double d, unsigned need,
                                 molq_cumulants *acc);

#endif
