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
#include "core/lnq_table.h"
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

/* Dunham coefficients Y_kl: E(v, J) = sum Y_kl (v + 1/2)^k [J(J+1)]^l. */
#define MOLQ_DUNHAM_K 6 /* powers of (v + 1/2): 0 .. 5 */
#define MOLQ_DUNHAM_L 4 /* powers of J(J+1): 0 .. 3 */

/* One electronic state of a diatomic, as the level generator needs it
 * (cm^-1; weights on the conventional scale).  pi = 1 makes it a 2Pi state
 * with spin-orbit constant a (Hill-Van Vleck term values, half-integer J;
 * see rovibronic.c); g is then the total electronic degeneracy (4 for a
 * 2Pi state: two spin components x Lambda doubling), of which each
 * rotational level carries g / 2. */
typedef struct molq_rovib_state {
    double te, g, w_even, w_odd;
    double y[MOLQ_DUNHAM_K][MOLQ_DUNHAM_L];
    int pi;
    double a;
} molq_rovib_state;

/* Energy (cm^-1, Te included) of the lowest v = 0 level of each of the
 * two rotational ladders of a 2Pi state: lo[0] of the lower ladder, lo[1]
 * of the upper one (for a regular state the Omega = 1/2 and 3/2 ladders,
 * for an inverted one the other way round).  For a Sigma-like state both
 * receive the v = 0, J = 0 term. */
void molq_rovib_ladder_minima(const molq_rovib_state *s, double lo[2]);

/* Column l of a Dunham matrix at v + 1/2 = vh (cm^-1): l = 0 gives G(v)
 * with Te left out, l = 1 gives B_v. */
double molq_dunham_column(const double (*y)[MOLQ_DUNHAM_L], int l, double vh);

/* Does the ground state (st[0]) have two nuclear-spin modifications
 * (both parity weights > 0 and different, as for H2 or 14N2)?  Otherwise
 * (heteronuclear, or I = 0 like 16O2) there are no spin isomers. */
int molq_rovib_has_isomers(const molq_rovib_state *st);

/* Bound levels of a diatomic, sorted by energy, split by nuclear-spin
 * modification: [0] that of the ground state's even J, [1] the other. */
typedef struct molq_rovib_params {
    size_t n[2];          /* [0] even-J modification, [1] odd-J one */
    const double *theta[2]; /* energies above the lowest level, K */
    const double *w[2];     /* g * weight * (2J + 1) */
    int frozen;             /* frozen even/odd mixture */
    double x_odd;           /* odd mole fraction of the frozen mixture */
    double x_odd_normal;    /* high-temperature odd fraction */
    int isomers;            /* 1 if there are two modifications */
    molq_lnq_table table;   /* interpolation of the exact sum */
} molq_rovib_params;

/* One term (V_n / 2)(1 - cos n phi) of a torsional potential, V in cm^-1. */
typedef struct molq_torsion_term {
    int n;
    double v;
} molq_torsion_term;

/* A sorted level list evaluated through a table (torsion, anharmonic
 * vibrations): modes/level_table.c. */
typedef struct molq_level_table {
    size_t n;
    double *theta, *w;    /* levels above the lowest (K), weights */
    molq_lnq_table table;
} molq_level_table;

/* Anharmonic vibrations (modes/anharmonic.c), all in cm^-1. */
#define MOLQ_MAX_ANHARM_MODES 16
typedef struct molq_anharm_input {
    size_t n;                             /* modes */
    int d[MOLQ_MAX_ANHARM_MODES];         /* degeneracies 1, 2, 3 */
    double w[MOLQ_MAX_ANHARM_MODES];      /* harmonic wavenumbers */
    double x[MOLQ_MAX_ANHARM_MODES][MOLQ_MAX_ANHARM_MODES]; /* i <= j */
    double g[MOLQ_MAX_ANHARM_MODES];      /* l constants (d = 2) */
    double alpha[MOLQ_MAX_ANHARM_MODES][3];
    size_t nrot;                          /* 0 (no coupling), 1 or 3 */
    double b0[3];                         /* ground-state constants */
    double d0;                            /* dissociation energy */
} molq_anharm_input;

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
        molq_rovib_params rv;
        molq_level_table lt;
        struct molq_asymtop_params {
            molq_level_table lt;       /* exact levels, T <= t2 */
            molq_rotation_params high; /* corrected rotor, T >= t1 */
            double u1, du;             /* hand-over in ln T */
        } top;
    } u;
    void *owned, *owned2; /* memory the mode allocated at init, freed
                             with it */
    size_t raw_levels;    /* levels generated at init (work done) */
};

/* Translation of a particle of molar mass M (kg/mol), Sackur-Tetrode. */
void molq_mode_translation_init(molq_mode *m, double molar_mass);

/* Lowest temperature (K) at which a gas of molar mass M (kg/mol) whose
 * lowest level has degeneracy g0 is a Boltzmann gas at pressure p (Pa):
 * where the mean occupation of its lowest states, N/(g0 q_tr), reaches 1
 * (n lambda^3 = g0).  Below it Fermi or Bose statistics matter and the
 * Sackur-Tetrode entropy falls towards and below zero. */
double molq_translation_boltzmann_t(double molar_mass, double g0, double p);

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

/* Walk the bound ro-vibrational levels of n states below d0 (cm^-1 above
 * the ground state's lowest level: v = 0, J = 0 of a Sigma-like state, the
 * lowest v = 0 level of a 2Pi one): each vibrational ladder stops at
 * d0 or where it turns over, each rotational ladder likewise.  Returns the
 * number of levels with non-zero weight, or (size_t)-1 as soon as it
 * exceeds `limit`.  *empty receives the index of a state with no bound
 * level, or n if every state has one. */
size_t molq_rovib_count(const molq_rovib_state *st, size_t n, double d0,
                        size_t limit, size_t *empty);

/* Diatomic ro-vibrational level sum over all states (the counts must have
 * been checked with molq_rovib_count).  frozen/x_odd select a frozen
 * even/odd mixture.  Returns 0, or -1 on allocation failure. */
int molq_mode_rovibronic_init(molq_mode *m, const molq_rovib_state *st,
                              size_t n, double d0, int frozen, double x_odd);

/* Cumulants of the (corrected or classical) rigid rotor at T. */
void molq_rotation_cumulants(const molq_rotation_params *r, double T,
                             unsigned need, molq_cumulants *out);

/* Nuclear-spin statistics of an exact top's rotational levels. */
enum {
    MOLQ_TOP_SPIN_PARITY, /* weights by (Ka, Kc) parity class */
    MOLQ_TOP_SPIN_C3,     /* symmetric top, 3 nuclei round a C3 axis */
    MOLQ_TOP_SPIN_TETRA   /* spherical top, 4 nuclei at tetrahedron corners */
};
typedef struct molq_top_spin {
    int kind;    /* MOLQ_TOP_SPIN_* */
    double w[4]; /* PARITY: weights of ee, eo, oe, oo (conventional) */
    double n;    /* C3, TETRA: 2I + 1 of the equivalent nuclei */
} molq_top_spin;

/* Exact rigid top (A >= B >= C, cm^-1) with nuclear-spin statistics
 * (conventional scale), handing over to the corrected rotor between 30 and
 * 60 theta_A.  Returns 0, or -1 on allocation failure. */
int molq_mode_asymtop_init(molq_mode *m, const double *abc, int sigma,
                           const molq_top_spin *spin);

/* Does the exact top of these constants fit the level budget (J <= 150 up
 * to the hand-over)?  Very prolate or heavy tops do not; they keep the
 * corrected rotor. */
int molq_asymtop_fits(const double *abc);

/* Hindered internal rotor with constant F (cm^-1), potential terms and
 * internal symmetry number.  Returns 0, or -1 on allocation failure. */
int molq_mode_torsion_init(molq_mode *m, double F,
                           const molq_torsion_term *terms, size_t nt,
                           int sigma);

/* Finish a level-table mode whose m->u.lt.theta/w (n levels, in the block
 * m->owned) are filled: sort them, shift to the lowest, compress a `dense`
 * list (moment-preserving, see level_table.c), build the table, set kind
 * and eval.  Returns 0, or -1 on allocation failure (the block is then
 * freed and m->owned cleared). */
int molq_level_table_finish(molq_mode *m, molq_mode_kind kind, int dense);

/* Cumulants of a finished level table at T (table, or exact sum). */
void molq_level_table_cumulants(const molq_level_table *t, double T,
                                molq_cumulants *out);

/* The same for a level table held elsewhere in the mode (t), tabulated up
 * to t_hi only, energies shifted to the lowest level only if `shift` (the
 * caller sets m->eval). */
int molq_level_table_finish_at(molq_mode *m, molq_level_table *t,
                               molq_mode_kind kind, int dense, int shift,
                               double t_hi);

/* Moment-preserving compression of a sorted level list (K), in place;
 * returns the new count.  See modes/level_table.c. */
size_t molq_levels_compress(double *theta, double *w, size_t n);

/* Number of bound anharmonic vibrational levels (l sublevels counted), or
 * (size_t)-1 once above `limit`. */
size_t molq_anharm_count(const molq_anharm_input *in, size_t limit);

/* Anharmonic vibration level sum (kind MOLQ_MODE_VIBRATION; the level
 * count must have been checked).  Returns 0, or -1 on allocation failure. */
int molq_mode_anharmonic_init(molq_mode *m, const molq_anharm_input *in);

/* k1(frozen) - k1(equilibrium) at T: the spin-isomer conversion energy in
 * units of kT (frozen mixture: the mode's own, or the high-T one). */
double molq_rovibronic_conversion(const molq_mode *m, double T);

#endif
