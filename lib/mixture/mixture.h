/* mixture/mixture.h -- many species per cell.  Sits above lib/thermo and
 * calls it per species; knows nothing of JSON, strings of the user's or
 * status text (lib/api checks arguments and writes messages).
 *
 * Arguments are trusted: the api layer has checked pointers, enums, the
 * states (T >= t_min_max, p > 0) and the compositions of the batch. */
#ifndef MOLQ_MIXTURE_H
#define MOLQ_MIXTURE_H

#include <stddef.h>

#include "species/species.h"

struct molq_mix_config_s {
    molq_mix_method method;
    double comp_tol;
    int normalise;
    double rtol;
    unsigned max_eval;
    int has_bounds;
    double t_lo, t_hi;
};

struct molq_mixture_s {
    size_t n;
    const molq_species **sp; /* borrowed, caller's order */
    double *inv_w;           /* 1 / molar mass, mol/kg */
    double *w;               /* molar mass, kg/mol */
    double t_min;            /* largest species t_min, K */
    double t_lo, t_hi;       /* inversion bracket, K */
    molq_mix_config cfg;
};

/* The factor f that turns a checked cell's fractions X (strided) into mole
 * fractions: x_k = f X_k (mole basis) or f X_k / W_k (mass basis), with
 * fractions <= 0 counting as 0 and the sum normalised to 1. */
double molq_mix_mole_factor(const molq_mixture *mix, const double *X,
                            size_t X_species, molq_basis basis);

/* x_k of one species given the factor above. */
static inline double molq_mix_x(const molq_mixture *mix, const double *X,
                                size_t X_species, molq_basis basis, size_t k,
                                double f)
{
    double v = X[k * X_species];
    if (v <= 0.0)
        return 0.0;
    return basis == MOLQ_MASS_FRACTIONS ? f * v * mix->inv_w[k] : f * v;
}

/* Sums over the species of one cell at (T, p). */
typedef struct molq_mix_sums {
    double w;     /* mean molar mass, kg/mol */
    double h;     /* J/mol */
    double cp;    /* J/(mol K) */
    double s;     /* J/(mol K), with mixing */
    double dcp;   /* J/(mol K^2) */
} molq_mix_sums;

enum { MOLQ_MIX_NEED_S = 1u, MOLQ_MIX_NEED_DCP = 2u };

void molq_mix_cell(const molq_mixture *mix, double T, double p,
                   const double *X, size_t X_species, molq_basis basis,
                   unsigned need, molq_mix_sums *out);

/* Property j of a cell from its sums. */
double molq_mix_property_value(const molq_mix_sums *s, double T,
                               molq_mix_property prop, molq_per per);

/* Solve for T in [mix->t_lo, mix->t_hi] where `given` (H, U or S per mole)
 * equals target, starting at guess.  Returns 0 (solved, *T_out), 1 (target
 * below the value at the bracket's low end), 2 (above the value at its high
 * end), 3 (no convergence); *end_val receives that end's value for 1 and
 * 2; *evals the forward evaluations used. */
int molq_mix_solve_t(const molq_mixture *mix, molq_mix_property given,
                     double target, double p, const double *X,
                     size_t X_species, molq_basis basis, double guess,
                     double *T_out, unsigned *evals, double *end_val);

#endif
