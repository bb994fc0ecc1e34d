/* data/spec.h -- a species description as read from a file or filled
 * through the public molq_spec_* setters, before validation.  Units are
 * those of the public API (kg/mol, cm^-1, J/mol). */
#ifndef MOLQ_DATA_SPEC_H
#define MOLQ_DATA_SPEC_H

#include <stddef.h>

#include "core/warnlist.h"
#include "modes/modes.h" /* MOLQ_DUNHAM_K, MOLQ_DUNHAM_L */
#include "molq/molq.h"

/* Size limits (documented in the README, enforced with MOLQ_ELIMIT). */
#define MOLQ_MAX_NAME 255
#define MOLQ_MAX_VIBRATIONS 1000
#define MOLQ_MAX_LEVELS 10000
#define MOLQ_MAX_SPECIES 100000
#define MOLQ_MAX_FILE_BYTES (64u * 1024u * 1024u)
#define MOLQ_MAX_STATES 32
#define MOLQ_MAX_ROVIB_LEVELS 400000 /* bound levels of one diatomic */
#define MOLQ_MAX_TORSIONS 8
#define MOLQ_MAX_TORSION_TERMS 8
#define MOLQ_MAX_GEOMETRY_ATOMS 64 /* atoms of one "geometry" */

/* Bounds of the integer fields (documented in the README and molq.h,
 * refused with MOLQ_EVALUE naming the field). */
#define MOLQ_MAX_SYMMETRY_NUMBER 100000 /* rotational and internal */
#define MOLQ_MAX_DEGENERACY 1000000     /* vibrations, levels, states */
#define MOLQ_MAX_TORSION_N 12           /* V_n(1 - cos n phi) */
/* Molar mass: from the electron's (MOLQ_M_E_MOLAR) to 1 kg/mol. */
#define MOLQ_MAX_MOLAR_MASS 1.0 /* kg/mol */


/* One electronic state of a diatomic with its own term values. */
typedef struct molq_spec_state {
    double te;  /* term energy of the potential minimum, cm^-1 */
    int g;      /* electronic degeneracy */
    double y[MOLQ_DUNHAM_K][MOLQ_DUNHAM_L]; /* cm^-1 */
    double w_even, w_odd; /* weights of even / odd rotational levels */
    int has_weights;
    double spin_orbit; /* A, cm^-1: a 2Pi state when has_spin_orbit */
    int has_spin_orbit;
    double re; /* equilibrium internuclear distance, Angstrom (plausibility
                * check of Be only) */
    int has_re;
} molq_spec_state;

/* One atom of a species' equilibrium geometry (plausibility check of the
 * rotational constants only).  The element is stored as given (at most 7
 * bytes kept; validation refuses an unknown one). */
typedef struct molq_spec_atom {
    char element[8];
    double xyz[3]; /* Angstrom */
} molq_spec_atom;

/* One hindered internal rotor. */
typedef struct molq_spec_torsion {
    double f;   /* internal-rotation constant, cm^-1 */
    int sigma;  /* internal symmetry number */
    int replaces; /* index of the harmonic vibration it replaces, or -1 */
    molq_torsion_term terms[MOLQ_MAX_TORSION_TERMS];
    size_t nterms;
} molq_spec_torsion;

/* Anharmonic data of the vibrations: a harmonic wavenumber, an x_ij, an
 * l constant g_ii, or rotation-vibration constants alpha_i (cm^-1). */
enum { MOLQ_VT_HARMONIC, MOLQ_VT_X, MOLQ_VT_G, MOLQ_VT_ALPHA };
typedef struct molq_spec_vibterm {
    int kind;
    size_t i, j;
    double v[3];
    size_t n;
} molq_spec_vibterm;

struct molq_spec_s {
    char *name;
    char *formula; /* NULL when not given */
    char *source;  /* NULL when not given */
    double molar_mass; /* kg/mol */
    int has_molar_mass;
    int mass_in_g; /* set through the g/mol setter (messages use that unit) */
    double molar_mass_g; /* the g/mol value as given (mass_in_g) */
    int structure; /* molq_structure, stored as int to validate */
    int sigma;
    double rot[3];
    size_t nrot;
    int rotor; /* molq_rotor */
    double *vib_wn;
    int *vib_deg;
    size_t nvib, cap_vib;
    double *el_e;
    int *el_g;
    size_t nel, cap_el;
    double formation_enthalpy;
    int has_formation_enthalpy;
    int model; /* molq_model */
    int has_model;
    molq_spec_state *states; /* diatomic electronic states (level sums) */
    size_t nstates;
    double d0; /* dissociation energy from the ground level, cm^-1 */
    int has_d0;
    molq_spec_torsion *torsions;
    size_t ntorsions;
    molq_spec_vibterm *vterms;
    size_t nvterms;
    double top_w[4]; /* spin weights of (Ka, Kc) classes ee, eo, oe, oo */
    int has_top_w;
    int spin_group;      /* molq_spin_group */
    int has_spin_group;
    double nuclear_spin; /* of the nuclei the spin group exchanges */
    int spin_frozen;     /* 1: frozen even/odd mixture, 0: equilibrium */
    double odd_fraction; /* frozen: mole fraction in odd-J levels */
    double range_lo, range_hi; /* validated range, K */
    int has_range;
    molq_spec_atom *atoms; /* "geometry", NULL when not given */
    size_t natoms;
};

/* The states as the level generator takes them (default weights 1/sigma);
 * out has room for s->nstates entries. */
void molq_spec_rovib_states(const molq_spec *s, molq_rovib_state *out);

/* The anharmonic-vibration input of a spec with vibterms, leaving out
 * vibrations replaced by torsions.  MOLQ_ELIMIT when more than
 * MOLQ_MAX_ANHARM_MODES vibrations are kept or more than
 * MOLQ_MAX_ANHARM_MODES + MOLQ_MAX_TORSIONS are given (the sizes of its
 * tables), MOLQ_EVALUE on a mode index that is not a vibration; validation
 * refuses both first with a message. */
molq_status molq_spec_anharm_input(const molq_spec *s, molq_anharm_input *out);

/* Is vibration i replaced by a torsion? */
int molq_spec_replaced(const molq_spec *s, size_t i);

/* Deep copy (NULL on allocation failure). */
molq_spec *molq_spec_clone(const molq_spec *s);

/* The model a validated spec builds by default: its "model" if set, else
 * level sums when diatomic states are given, else RRHO. */
molq_model molq_spec_default_model(const molq_spec *s);

/* Plausibility of a validated spec's diatomic constants (Kratzer De,
 * Pekeris alpha_e, Birge-Sponer turnover against D0, Be against re and the
 * formula's reduced mass) and of its rotational constants against its
 * "geometry" (principal moments of inertia; data/plausible.c):
 * findings are appended to `warn` (may be NULL).  MOLQ_ENOMEM only. */
molq_status molq_spec_plausible(const molq_spec *s, molq_warnlist *warn);

/* Check every field; on success *molar_mass receives the molar mass to use
 * (set, or computed from the formula), kg/mol.  Messages name the species
 * and the field with the key names of the species file.  Plausibility
 * findings that do not stop the build (a molar mass no molecule has, or one
 * that disagrees with the formula) are appended to `warn` (may be NULL). */
molq_status molq_spec_validate(const molq_spec *s, double *molar_mass,
                               molq_warnlist *warn, char *err, size_t errlen);

/* A formula's composition: distinct elements in order of first appearance
 * (symbols are static strings), the charge in elementary charges and the
 * molar mass in kg/mol (IUPAC standard atomic weights; an ion's mass is its
 * atoms' less charge x the electron's). */
#define MOLQ_MAX_ELEMENTS 16
typedef struct molq_composition {
    size_t n;
    struct {
        const char *symbol;
        long count;
    } el[MOLQ_MAX_ELEMENTS];
    int charge;
    double molar_mass;
} molq_composition;

/* Parse "CO2", "Ca(OH)2", "N2+", "O-", "H3O+", "Ca+2" (trailing '+'/'-'
 * repeated, or one sign with a count) or "e-" (the electron: no elements,
 * charge -1).  MOLQ_EVALUE with a message otherwise. */
molq_status molq_formula_parse(const char *formula, molq_composition *out,
                               char *err, size_t errlen);

/* Molar mass in kg/mol from a formula such as "CO2", "CH3OH", "Ca(OH)2",
 * using IUPAC standard atomic weights.  MOLQ_EVALUE with a message on an
 * unknown element or malformed formula. */
molq_status molq_formula_molar_mass(const char *formula, double *out,
                                    char *err, size_t errlen);

/* Mass in u of the most abundant isotope of an element symbol of the
 * formula table ("H", "O", ...; "D" is deuterium), 0 for an unknown one
 * (AME 2020 from memory; data/formula.c). */
double molq_isotope_mass(const char *symbol);

#endif
