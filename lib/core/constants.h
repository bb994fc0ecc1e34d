/* core/constants.h -- physical constants, SI 2019 exact values and CODATA 2018.
 *
 * The 2019 redefinition of the SI fixes h, k, N_A and c exactly; the atomic
 * mass constant is measured (CODATA 2018 recommended value). */
#ifndef MOLQ_CORE_CONSTANTS_H
#define MOLQ_CORE_CONSTANTS_H

#define MOLQ_H_PLANCK 6.62607015e-34      /* J s, exact */
#define MOLQ_K_BOLTZMANN 1.380649e-23     /* J/K, exact */
#define MOLQ_N_AVOGADRO 6.02214076e23     /* 1/mol, exact */
#define MOLQ_C_LIGHT 299792458.0          /* m/s, exact */
#define MOLQ_M_U 1.66053906660e-27        /* kg, CODATA 2018 */
#define MOLQ_M_E_MOLAR 5.48579909065e-7   /* electron molar mass, kg/mol,
                                             CODATA 2018 */

/* Molar gas constant R = N_A k, J/(mol K) (exact by the definitions). */
#define MOLQ_R (MOLQ_N_AVOGADRO * MOLQ_K_BOLTZMANN)

/* Second radiation constant hc/k expressed in cm K: multiplies a wavenumber
 * in cm^-1 to give a characteristic temperature in K. */
#define MOLQ_C2_CM_K (100.0 * MOLQ_H_PLANCK * MOLQ_C_LIGHT / MOLQ_K_BOLTZMANN)

#define MOLQ_PI 3.14159265358979323846

#endif
