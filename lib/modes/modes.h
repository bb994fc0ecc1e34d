/* modes/modes.h -- degrees of freedom.  One file per mode; each mode answers
 * one question: at temperature T (and pressure p, for translation), what are
 * ln q and the energy cumulants k1, k2, k3 (see core/cumulants.h)?
 *
 * A mode's parameters are plain numbers prepared once when the species is
 * built (characteristic temperatures in K, never cm^-1 or strings), so
 * evaluation does no unit conversion, no allocation and no branching on
 * text.  Adding a physical model means adding a file here and a kind in
 * molq.h; lib/thermo never changes. */
#ifndef MOLQ_MODES_H
#define MOLQ_MODES_H

#include <stddef.h>

#include "core/cumulants.h"
#include "molq/molq.h"

typedef struct molq_mode molq_mode;

typedef void (*molq_mode_eval_fn)(const molq_mode *m, double T, double p,
                                  unsigned need, molq_cumulants *out);

typedef struct molq_translation_params {
    double lnq_const; /* ln q/N = lnq_const + 2.5 ln T - ln p */
} molq_translation_params;

typedef struct molq_rotation_params {
    int linear;        /* 1: linear, 0: nonlinear */
    int classical;     /* 1: classical rotor, 0: with quantum corrections */
    double sigma;      /* rotational symmetry number */
    double theta;      /* linear: rotational temperature hcB/k, K */
    double lnq_const;  /* ln q = lnq_const + a ln T (+ correction) */
    double corr;       /* nonlinear first quantum correction c, K */
} molq_rotation_params;

typedef struct molq_levels_params {
    size_t n;
    const double *theta; /* level energies / k, K */
    const double *g;     /* weights (degeneracies) */
} molq_levels_params;

struct molq_mode {
    molq_mode_kind kind;
    molq_mode_eval_fn eval;
    union {
        molq_translation_params tr;
        molq_rotation_params rot;
        molq_levels_params lev; /* vibration (harmonic) and electronic */
    } u;
};

/* Translation of a particle of molar mass M (kg/mol), Sackur-Tetrode. */
void molq_mode_translation_init(molq_mode *m, double molar_mass);

/* Rigid rotation.  `linear` selects the rotor; B holds 1 (linear) or 3
 * (A >= B >= C, nonlinear) rotational constants in cm^-1.  *t_min receives
 * the lowest T at which the model is valid (0 if none). */
void molq_mode_rotation_init(molq_mode *m, int linear, int classical,
                             int sigma, const double *B, double *t_min);

/* Harmonic vibrations: n modes with characteristic temperatures theta (K)
 * and degeneracies g; the arrays must outlive the mode. */
void molq_mode_vibration_init(molq_mode *m, size_t n, const double *theta,
                              const double *g);

/* Electronic level sum: n levels with energies theta (K) and degeneracies
 * g; the arrays must outlive the mode. */
void molq_mode_electronic_init(molq_mode *m, size_t n, const double *theta,
                               const double *g);

#endif
