/*
 * molq.h -- ideal-gas thermodynamic properties from molecular constants.
 *
 * This is molq's one public header and its reference manual.  molq computes
 * partition functions and the thermodynamic functions that follow from them
 * (cp, cv, h, u, s, g, a and their temperature derivatives) for ideal-gas
 * species described by molecular constants, by statistical mechanics.
 *
 * Conventions used throughout
 * ---------------------------
 * Units:      SI molar at the boundary.  T in K, p in Pa, energies in J/mol,
 *             entropies and heat capacities in J/(mol K), derivatives of
 *             heat capacity in J/(mol K^2), molar mass in kg/mol.
 *             Spectroscopic inputs (rotational constants, vibrational
 *             wavenumbers, electronic level energies) are in cm^-1, the unit
 *             of the trade.
 * Errors:     every fallible call returns a molq_status; results come back
 *             through out-pointers, which are left untouched on failure
 *             unless the function says otherwise.  Calls that can fail for a
 *             reason worth explaining take a caller-owned buffer
 *             (char *err, size_t errlen) that receives a NUL-terminated
 *             message naming the species and field; err may be NULL or
 *             errlen 0.  The library never prints, exits or aborts, and
 *             keeps no global or thread-local error state.
 * Ownership:  objects the library allocates are freed by the library's own
 *             *_free function; every *_free accepts NULL.  Borrowed pointers
 *             are marked "borrowed" with the lifetime they have.
 * Threads:    molq has no global mutable state.  molq_species and molq_db
 *             handles are immutable once created: any number of threads may
 *             evaluate the same handle at once without locks.  A molq_spec
 *             (a mutable description) must not be modified by two threads at
 *             once.
 * ABI:        handles are opaque; enumerations only grow and never renumber;
 *             no struct crosses the boundary.  Declarations after the
 *             MOLQ_EXPERIMENTAL guard are outside the stability promise.
 *
 * CAUTION: molq computes ideal-gas estimates.  They are not a basis for the
 * design of pressure equipment, burners or safety systems without
 * verification under the applicable codes and licensed engineering review.
 */
#ifndef MOLQ_MOLQ_H
#define MOLQ_MOLQ_H

#include <stddef.h>

#ifdef __cplusplus
extern "C" {
#endif

/* Export macro: symbols are hidden by default and only MOLQ_API ones are
 * exported (see lib/molq.map for the versioned list). */
#if defined(_WIN32) && defined(MOLQ_BUILDING_LIBRARY)
#define MOLQ_API __declspec(dllexport)
#elif defined(_WIN32) && !defined(MOLQ_STATIC)
#define MOLQ_API __declspec(dllimport)
#elif defined(__GNUC__) && defined(MOLQ_BUILDING_LIBRARY)
#define MOLQ_API __attribute__((visibility("default")))
#else
#define MOLQ_API
#endif

/* ------------------------------------------------------------------------ */
/* Version                                                                  */
/* ------------------------------------------------------------------------ */

/* Compile-time version of this header.  MOLQ_VERSION_NUMBER is
 * major*10000 + minor*100 + patch.  Added in 0.1.0. */
#define MOLQ_VERSION_MAJOR 0
#define MOLQ_VERSION_MINOR 1
#define MOLQ_VERSION_PATCH 0
#define MOLQ_VERSION_NUMBER \
    (MOLQ_VERSION_MAJOR * 10000 + MOLQ_VERSION_MINOR * 100 + MOLQ_VERSION_PATCH)
#define MOLQ_VERSION_STRING "0.1.0"

/* @return the version number of the library actually linked, in the
 *         MOLQ_VERSION_NUMBER encoding.  Compare with the macro to detect a
 *         header/library mismatch.  Thread-safe.  Added in 0.1.0. */
MOLQ_API unsigned molq_version_number(void);

/* @return the version of the linked library as a static string such as
 *         "0.1.0" (never NULL, never freed).  Thread-safe.  Added in 0.1.0. */
MOLQ_API const char *molq_version_string(void);

/* ------------------------------------------------------------------------ */
/* Status codes                                                             */
/* ------------------------------------------------------------------------ */

/* Status returned by every fallible call.  Values never change; new codes
 * are appended.  Added in 0.1.0. */
typedef enum molq_status {
    MOLQ_OK = 0,
    MOLQ_EARG = 1,       /* invalid argument: NULL pointer, unknown enum value,
                            index out of range */
    MOLQ_ENOMEM = 2,     /* memory allocation failed */
    MOLQ_EIO = 3,        /* a file could not be opened or read */
    MOLQ_ESYNTAX = 4,    /* malformed JSON (message gives line and column) */
    MOLQ_EKEY = 5,       /* unknown key, or a required key is missing */
    MOLQ_ETYPE = 6,      /* a key holds a value of the wrong JSON type */
    MOLQ_EVALUE = 7,     /* a value is outside its allowed range (mass <= 0,
                            non-finite number, wrong count, bad ordering...) */
    MOLQ_EDUPLICATE = 8, /* two species share a name */
    MOLQ_ENOTFOUND = 9,  /* no species of that name */
    MOLQ_EDOMAIN = 10,   /* T or p is not finite and positive */
    MOLQ_ERANGE = 11,    /* T is below the lowest temperature at which the
                            species' results mean something (a model's
                            limit or the Boltzmann-gas limit, see
                            molq_species_t_min), or so extreme that a
                            result would overflow a double; for
                            molq_mixture_temperature, a value beyond what
                            the temperature bounds attain.  MOLQ_OK always
                            comes with finite numbers. */
    MOLQ_ELIMIT = 12,    /* input exceeds a documented size limit */
    MOLQ_ENOCONV = 13    /* an iteration did not converge within its
                            limit (molq_mixture_temperature) */
} molq_status;

/* @return a static English description of a status code (never NULL; an
 *         unknown code gives "unknown status").  Thread-safe.  Added in 0.1.0. */
MOLQ_API const char *molq_status_string(molq_status status);

/* ------------------------------------------------------------------------ */
/* Properties                                                               */
/* ------------------------------------------------------------------------ */

/* Thermodynamic properties, per mole of ideal gas at temperature T and
 * pressure p.  Values never change; new properties are appended.
 *
 * Enthalpy scale: h(T) = dfH(298.15 K) + [H(T) - H(298.15 K)] where dfH is
 * the species' standard enthalpy of formation at 298.15 K.  A species
 * without a formation enthalpy is reported with dfH = 0, i.e. h is then the
 * sensible enthalpy h(T) - h(298.15 K) (the usual convention for elements in
 * their reference state).  u = h - RT, g = h - T s, a = u - T s.
 *
 * Entropy is the conventional ("practical") entropy: nuclear-spin and
 * isotope-mixing entropy excluded, at pressure p (s depends on p; cp, h, u
 * do not).  Added in 0.1.0. */
typedef enum molq_property {
    MOLQ_LNQ = 0,          /* ln(q/N): molecular partition function per
                              molecule at (T, p), energy zero at the ground
                              level; dimensionless                        */
    MOLQ_CP = 1,           /* isobaric heat capacity, J/(mol K)           */
    MOLQ_CV = 2,           /* isochoric heat capacity, J/(mol K)          */
    MOLQ_H = 3,            /* enthalpy on the scale above, J/mol          */
    MOLQ_U = 4,            /* internal energy u = h - RT, J/mol           */
    MOLQ_S = 5,            /* entropy at p, J/(mol K)                     */
    MOLQ_G = 6,            /* Gibbs energy g = h - T s, J/mol             */
    MOLQ_A = 7,            /* Helmholtz energy a = u - T s, J/mol         */
    MOLQ_H_MINUS_H298 = 8, /* h(T) - h(298.15 K), J/mol                   */
    MOLQ_GEF = 9,          /* Gibbs energy function -(g - h(298.15))/T,
                              J/(mol K)                                   */
    MOLQ_H_MINUS_H0 = 10,  /* h(T) - h(0 K), J/mol                        */
    MOLQ_DCP_DT = 11,      /* dcp/dT, J/(mol K^2)                         */
    MOLQ_DCV_DT = 12,      /* dcv/dT, J/(mol K^2)                         */
    MOLQ_DS_DT = 13,       /* ds/dT at constant p, J/(mol K^2)            */
    MOLQ_DH_DT = 14,       /* dh/dT at constant p (= cp), J/(mol K)       */
    MOLQ_DGRT_DT = 15      /* d(g/RT)/dT at constant p (= -h/(R T^2)), 1/K */
} molq_property;

/* @return the number of properties this library knows (properties are
 *         0 .. count-1).  Grows with new versions.  Added in 0.1.0. */
MOLQ_API size_t molq_property_count(void);

/* @return the short name of a property ("cp", "h_minus_h298", ...), a static
 *         string, or NULL for an unknown value.  Added in 0.1.0. */
MOLQ_API const char *molq_property_name(molq_property prop);

/* @return the SI unit of a property per mole ("J/(mol K)", "1" for
 *         dimensionless), static, or NULL for an unknown value.  Added 0.1.0. */
MOLQ_API const char *molq_property_unit(molq_property prop);

/* Look a property up by its short name (as returned by molq_property_name).
 * @return MOLQ_OK, MOLQ_EARG if an argument is NULL, MOLQ_ENOTFOUND if the
 *         name is unknown.  Thread-safe.  Added in 0.1.0. */
MOLQ_API molq_status molq_property_from_name(const char *name,
                                             molq_property *out);

/* Standard-state pressure used by the published tables, 1e5 Pa. */
#define MOLQ_P_STANDARD 1.0e5

/* Reference temperature of the enthalpy scale, K. */
#define MOLQ_T_REF 298.15

/* ------------------------------------------------------------------------ */
/* Species descriptions (mutable) and species (immutable)                   */
/* ------------------------------------------------------------------------ */

/* Molecular structure.  Added in 0.1.0. */
typedef enum molq_structure {
    MOLQ_ATOM = 0,      /* no rotation, no vibration                     */
    MOLQ_LINEAR = 1,    /* one rotational constant B                      */
    MOLQ_NONLINEAR = 2  /* three rotational constants A >= B >= C         */
} molq_structure;

/* Rotation model of a linear or nonlinear molecule.  Added in 0.1.0.
 * MOLQ_ROTOR_CORRECTED (default): the rigid rotor with its quantum
 *   corrections.  Linear: the Mulholland expansion, y = theta/T,
 *   q = T/(sigma theta) [1 + y/3 + y^2/15 + 4y^3/315 + y^4/315 + 4y^5/3465]
 *   for T >= 20 theta (truncation below 1e-11 relative) and the exact sum
 *   (2J+1) exp(-J(J+1) theta/T) / sigma below, so it is valid at every T
 *   (as a spin-averaged rigid rotor: no ortho/para statistics).
 *   Nonlinear: the classical top times [1 + c/T] with the first quantum
 *   correction c = (2(tA+tB+tC) - tA tB/tC - tB tC/tA - tA tC/tB)/12 (t =
 *   rotational temperatures); relative error in q below 0.3 % at
 *   T = theta_A and falling as (theta_A/T)^2; for T < theta_A the
 *   evaluation returns MOLQ_ERANGE.
 * MOLQ_ROTOR_CLASSICAL: the classical rotor, q = T/(sigma theta) or
 *   sqrt(pi T^3/(tA tB tC))/sigma, as textbook formulas use; no T limit. */
typedef enum molq_rotor {
    MOLQ_ROTOR_CORRECTED = 0,
    MOLQ_ROTOR_CLASSICAL = 1
} molq_rotor;

/* Model of the internal degrees of freedom.  Added in 0.1.0.
 * MOLQ_MODEL_RRHO: rigid rotor (see molq_rotor), harmonic vibrations and
 *   an electronic level list: fast, good near room temperature.
 * MOLQ_MODEL_LEVELS: level-based models.  Polyatomics: anharmonic
 *   vibrational level sums (molq_spec_add_anharmonicity and friends) and
 *   hindered internal rotors (molq_spec_add_torsion, replacing the harmonic
 *   modes they name); the rest as in RRHO.  Diatomics: explicit sum over the bound
 *   ro-vibrational levels of every electronic state, term values from
 *   Dunham coefficients Y_kl (or the spectroscopic constants they stand
 *   for), each vibrational ladder stopped at the dissociation energy and
 *   each rotational ladder where the centrifugal term turns it over or it
 *   crosses the dissociation limit; rotational levels weighted by nuclear
 *   spin statistics (molq_spec_set_rotational_weights), in equilibrium or
 *   as a frozen even/odd mixture.  The method of the published reference
 *   tables for diatomics; costs one exp per populated level. */
/* (models continued) Level-based sums are evaluated through a table in ln T
 * built with the species (exact at its nodes, consistent derivatives, about
 * 1e-11 relative in cp and 5e-9 in dcp/dT) so they cost about as much as
 * RRHO. */
typedef enum molq_model {
    MOLQ_MODEL_RRHO = 0,
    MOLQ_MODEL_LEVELS = 1
} molq_model;

/* @return the number of models (molq_model values 0 .. count-1).  Grows
 *         with new versions.  Added in 0.1.0. */
MOLQ_API size_t molq_model_count(void);

/* @return the short name of a model ("rrho", "levels"), static, or NULL for
 *         an unknown value.  Added in 0.1.0. */
MOLQ_API const char *molq_model_name(molq_model model);

/* Look a model up by its short name.  @return MOLQ_OK, MOLQ_EARG (NULL),
 *         MOLQ_ENOTFOUND.  Added in 0.1.0. */
MOLQ_API molq_status molq_model_from_name(const char *name, molq_model *out);

/* A mutable description of one species, filled field by field and turned
 * into an immutable molq_species by molq_species_create.  Setters store
 * values without judging them; all validation happens in
 * molq_species_create, which names the offending field.  Not thread-safe
 * for concurrent modification. */
typedef struct molq_spec_s molq_spec;

/* An immutable species built from a description.  Thread-safe to share. */
typedef struct molq_species_s molq_species;

/* Create an empty description named `name` (copied; 1..255 bytes, UTF-8).
 * Defaults: structure atom, symmetry number 1, no rotational constants, no
 * vibrations, a single non-degenerate electronic ground level at 0 unless
 * levels are added, no formation enthalpy, rotor MOLQ_ROTOR_CORRECTED,
 * molar mass unset (required).
 * @return MOLQ_OK, MOLQ_EARG (NULL argument), MOLQ_ENOMEM.
 * Ownership: *out is the caller's; free with molq_spec_free.  Added 0.1.0. */
MOLQ_API molq_status molq_spec_new(const char *name, molq_spec **out);

/* Free a description.  Accepts NULL.  Added in 0.1.0. */
MOLQ_API void molq_spec_free(molq_spec *spec);

/* Set the chemical formula (copied): element symbols with counts and
 * brackets, and an optional trailing charge: "CO2", "Ca(OH)2", "N2+",
 * "O-", "Ca+2" (one sign and a count, or the sign repeated), or "e-" for
 * the electron.  It gives the species' element composition and charge
 * (molq_species_element, molq_species_charge) and, when no molar mass is
 * set, its molar mass (IUPAC standard atomic weights; an ion's is its
 * atoms' less charge x the electron's molar mass).  A formula that cannot
 * be read is an error at molq_species_create when the molar mass depends
 * on it, otherwise a warning (the species then has no composition).
 * @return MOLQ_OK, MOLQ_EARG, MOLQ_ENOMEM.  Added in 0.1.0. */
MOLQ_API molq_status molq_spec_set_formula(molq_spec *spec,
                                           const char *formula);

/* Set the free-text source of the data (citation; copied).
 * @return MOLQ_OK, MOLQ_EARG, MOLQ_ENOMEM.  Added in 0.1.0. */
MOLQ_API molq_status molq_spec_set_source(molq_spec *spec, const char *source);

/* Set the molar mass in KILOGRAMS per mole (kg/mol, e.g. 0.0280134 for
 * N2) -- NOT g/mol, the unit of species files and of the Python binding;
 * for g/mol use molq_spec_set_molar_mass_g_per_mol.  molq_species_create
 * accepts masses from the electron's (5.48579909065e-7 kg/mol, CODATA
 * 2018) to 1 kg/mol (no ideal-gas molecule is heavier) and refuses others
 * with MOLQ_EVALUE naming 'molar_mass' (above 1 kg/mol the message asks
 * whether g/mol was meant).  The value is copied.  Not thread-safe for
 * concurrent modification of the same spec.
 * @return MOLQ_OK or MOLQ_EARG (spec NULL).  Added in 0.1.0. */
MOLQ_API molq_status molq_spec_set_molar_mass(molq_spec *spec,
                                              double kg_per_mol);

/* As molq_spec_set_molar_mass, in grams per mole (g/mol, the unit of the
 * trade and of species files: 28.0134 for N2); accepted from the
 * electron's 5.48579909065e-4 g/mol to 1000 g/mol.
 * @return MOLQ_OK or MOLQ_EARG (spec NULL).  Added in 0.1.0. */
MOLQ_API molq_status molq_spec_set_molar_mass_g_per_mol(molq_spec *spec,
                                                        double g_per_mol);

/* Set the structure.  @return MOLQ_OK or MOLQ_EARG.  Added in 0.1.0. */
MOLQ_API molq_status molq_spec_set_structure(molq_spec *spec,
                                             molq_structure structure);

/* Set the rotational symmetry number (integer >= 1).
 * @return MOLQ_OK or MOLQ_EARG.  Added in 0.1.0. */
MOLQ_API molq_status molq_spec_set_symmetry_number(molq_spec *spec,
                                                   int sigma);

/* Set the rotational constants in cm^-1: one (B) for a linear molecule,
 * three (A >= B >= C) for a nonlinear one.  The n values are copied
 * (n <= 3).  @return MOLQ_OK, MOLQ_EARG (NULL, or n > 3).  Added in 0.1.0. */
MOLQ_API molq_status molq_spec_set_rotational_constants(molq_spec *spec,
                                                        const double *cm1,
                                                        size_t n);

/* Set the rotation model.  @return MOLQ_OK or MOLQ_EARG.  Added in 0.1.0. */
MOLQ_API molq_status molq_spec_set_rotor(molq_spec *spec, molq_rotor rotor);

/* Append a harmonic vibrational mode: wavenumber in cm^-1 (> 0), integer
 * degeneracy (>= 1).  @return MOLQ_OK, MOLQ_EARG, MOLQ_ENOMEM,
 * MOLQ_ELIMIT.  Added in 0.1.0. */
MOLQ_API molq_status molq_spec_add_vibration(molq_spec *spec,
                                             double wavenumber_cm1,
                                             int degeneracy);

/* Append an electronic level: energy above the ground level in cm^-1
 * (>= 0), integer degeneracy (>= 1).  Once any level is added the default
 * ground level is replaced by the list given.  @return MOLQ_OK, MOLQ_EARG,
 * MOLQ_ENOMEM, MOLQ_ELIMIT.  Added in 0.1.0. */
MOLQ_API molq_status molq_spec_add_electronic_level(molq_spec *spec,
                                                    double energy_cm1,
                                                    int degeneracy);

/* Set the temperature range, in K, over which the species' data have been
 * checked against published tables (0 < t_low < t_high <= 1e6, judged at
 * molq_species_create; the species-file key is "validated_range").
 * Informational: evaluation is not limited to it (see
 * molq_species_validated_range).  @return MOLQ_OK or MOLQ_EARG.
 * Added in 0.1.0. */
MOLQ_API molq_status molq_spec_set_validated_range(molq_spec *spec,
                                                   double t_low,
                                                   double t_high);

/* Append one atom of the molecule's equilibrium geometry: its element
 * symbol ("O", "H", "D", ...; copied) and Cartesian position in Angstrom,
 * in any frame (the species-file key is "geometry").  Used only to check
 * the rotational constants: at molq_species_create the atoms must match
 * the formula's composition (a formula is then required), lie within
 * 1000 Angstrom of the origin and at least 0.1 Angstrom apart, else
 * MOLQ_EVALUE naming "geometry[i]...".  The principal moments of inertia
 * with the most abundant isotopes' masses give A >= B >= C (B for a
 * linear molecule); a constant more than 4 % from its geometric value,
 * a geometry that is not collinear for a linear structure (or collinear
 * for a nonlinear one), or a linear molecule's symmetry number that does
 * not match its geometry (2 when centrosymmetric, else 1) is reported as
 * a warning, never an error.  At most 64 atoms.  Not thread-safe on one
 * spec.  @return MOLQ_OK, MOLQ_EARG (NULL spec or element), MOLQ_ELIMIT
 * (a 65th atom), MOLQ_ENOMEM.  Added in 0.1.0. */
MOLQ_API molq_status molq_spec_add_geometry_atom(molq_spec *spec,
                                                 const char *element,
                                                 double x_angstrom,
                                                 double y_angstrom,
                                                 double z_angstrom);

/* Set the standard enthalpy of formation at 298.15 K in J/mol.
 * @return MOLQ_OK or MOLQ_EARG.  Added in 0.1.0. */
MOLQ_API molq_status molq_spec_set_formation_enthalpy(molq_spec *spec,
                                                      double j_per_mol);

/* Choose the model (default: MOLQ_MODEL_LEVELS when level data are given --
 * diatomic states, torsions, anharmonic constants or top weights -- and
 * MOLQ_MODEL_RRHO otherwise).  @return MOLQ_OK or MOLQ_EARG.
 * Added in 0.1.0. */
MOLQ_API molq_status molq_spec_set_model(molq_spec *spec, molq_model model);

/* Append an electronic state of a diatomic for MOLQ_MODEL_LEVELS: term
 * energy Te of its potential minimum above that of the ground state, cm^-1
 * (the ground state has Te = 0), and its electronic degeneracy (spin and
 * Lambda doubling, e.g. 3 for a 3Sigma state, 2 for a 1Delta state).  Its
 * term values are set with molq_spec_set_dunham.  *index (may be NULL)
 * receives the state's index.  @return MOLQ_OK, MOLQ_EARG, MOLQ_ENOMEM,
 * MOLQ_ELIMIT (more than 32 states).  Added in 0.1.0. */
MOLQ_API molq_status molq_spec_add_diatomic_state(molq_spec *spec,
                                                  double te_cm1,
                                                  int degeneracy,
                                                  size_t *index);

/* Set the Dunham coefficient Y_kl (cm^-1) of a state:
 * E(v, J) = Te + sum_kl Y_kl (v + 1/2)^k [J(J+1)]^l, k < 6, l < 4.
 * In the usual notation Y10 = we, Y20 = -wexe, Y30 = weye, Y40 = weze,
 * Y01 = Be, Y11 = -alpha_e, Y21 = gamma_e, Y02 = -De, Y12 = -beta_e,
 * Y03 = He.  @return MOLQ_OK or MOLQ_EARG (bad index or power).
 * Added in 0.1.0. */
MOLQ_API molq_status molq_spec_set_dunham(molq_spec *spec, size_t state,
                                          unsigned k, unsigned l,
                                          double y_cm1);

/* Weights of the even- and odd-J rotational levels of a state on the
 * conventional scale (nuclear-spin entropy excluded): the nuclear-spin
 * degeneracy of the level divided by (2I+1)^2.  H2: 1/4 and 3/4; 14N2:
 * 2/3 and 1/3; 16O2 ground state: 0 and 1 (only odd N exist).  Default:
 * 1/sigma for both, which is exact for heteronuclear molecules.
 * @return MOLQ_OK or MOLQ_EARG.  Added in 0.1.0. */
MOLQ_API molq_status molq_spec_set_rotational_weights(molq_spec *spec,
                                                      size_t state,
                                                      double even,
                                                      double odd);

/* Dissociation energy D0 of the ground state from its lowest level, cm^-1;
 * required by MOLQ_MODEL_LEVELS (every state's levels stop at this energy
 * above the ground level).  @return MOLQ_OK or MOLQ_EARG.  Added 0.1.0. */
MOLQ_API molq_status molq_spec_set_dissociation_energy(molq_spec *spec,
                                                       double d0_cm1);

/* Treat the two nuclear-spin modifications (ground state: even- and odd-J
 * molecules) as a frozen mixture (no conversion on the time scale of
 * interest, e.g. normal hydrogen, odd_fraction = 0.75) instead of the
 * default equilibrium.  odd_fraction in (0, 1) is the mole fraction of the
 * ground state's odd-J modification; molq_species_create refuses it for a
 * species with a single modification.  @return MOLQ_OK or MOLQ_EARG.
 * Added in 0.1.0. */
MOLQ_API molq_status molq_spec_set_spin_isomers_frozen(molq_spec *spec,
                                                       double odd_fraction);

/* Make diatomic state `state` a 2Pi state (Lambda = 1, S = 1/2) with
 * spin-orbit constant A in cm^-1 (> 0 regular, < 0 inverted; finite, |A| <=
 * 1e5 cm^-1; 0 gives the pure Hund's case (b) limit).  Its rotational
 * levels then have half-integer J and the Hill-Van Vleck term values
 *   F(J) = B_v [(J+1/2)^2 - 1 -/+ (1/2) sqrt(4 (J+1/2)^2 + Y (Y - 4))],
 * Y = A / B_v, both signs for J >= 3/2 and one level, B_v (1 - Y/2), at
 * J = 1/2; B_v is the l = 1 Dunham column at v, and G(v) and the l >= 2
 * terms (centrifugal distortion) are added with x = (J+1/2)^2 - 1 in place
 * of J(J+1).  The state's degeneracy keeps its meaning, spin times Lambda
 * doubling: 4 for a 2Pi state (must be even); each level carries half of
 * it (its Lambda doublet) times 2J + 1, so the two Omega components
 * together weigh 4 at high T.  Heteronuclear weights only: unequal
 * rotational weights, or a species with two nuclear-spin modifications,
 * are refused.  MOLQ_MODEL_RRHO (molq_species_with_model) represents such
 * a state by two electronic levels of half its degeneracy each, at the
 * lowest v = 0 level of each of its two ladders.  The value is validated
 * by molq_species_create (MOLQ_EVALUE naming
 * 'diatomic_states[i].spin_orbit').  The number is stored in the spec;
 * nothing is borrowed.  Not thread-safe for concurrent modification of the
 * same spec.
 * @return MOLQ_OK or MOLQ_EARG (spec NULL or no such state).
 * Added in 0.1.0. */
MOLQ_API molq_status molq_spec_set_spin_orbit(molq_spec *spec, size_t state,
                                              double a_cm1);

/* Append a hindered internal rotor (torsion) for MOLQ_MODEL_LEVELS:
 * internal-rotation constant F = h/(8 pi^2 c I_red) in cm^-1 (>= 1e-3),
 * internal symmetry number (>= 1, e.g. 3 for a methyl top), and the index
 * of the harmonic vibration it replaces (-1 for none; the RRHO variant keeps
 * that vibration).  Its potential V(phi) = sum (V_n/2)(1 - cos n phi) is set
 * with molq_spec_add_torsion_term (no term: a free rotor).  *index (may be
 * NULL) receives the torsion's index.  @return MOLQ_OK, MOLQ_EARG,
 * MOLQ_ENOMEM, MOLQ_ELIMIT (more than 8).  Added in 0.1.0. */
MOLQ_API molq_status molq_spec_add_torsion(molq_spec *spec, double f_cm1,
                                           int sigma, int replaces_vibration,
                                           size_t *index);

/* Add a term (V_n/2)(1 - cos n phi), n = 1..12, V_n in cm^-1, to the
 * potential of a torsion.  @return MOLQ_OK, MOLQ_EARG, MOLQ_ELIMIT (more
 * than 8 terms).  Added in 0.1.0. */
MOLQ_API molq_status molq_spec_add_torsion_term(molq_spec *spec,
                                                size_t torsion, int n,
                                                double v_cm1);

/* Anharmonic vibrations for MOLQ_MODEL_LEVELS (polyatomics): explicit sum
 * over the bound levels of the second-order term values
 *   G(v) = sum w_i (v_i + d_i/2) + sum_{i<=j} x_ij (v_i + d_i/2)(v_j + d_j/2)
 *          + sum g_ii l_i^2,
 * below the dissociation energy (molq_spec_set_dissociation_energy,
 * required) and before any ladder turns over.  Modes are the vibrations in
 * the order added (index from 0); their wavenumbers are read as observed
 * fundamentals, from which the harmonic w_i follow, unless a harmonic
 * wavenumber is set.  All values in cm^-1.  Each returns MOLQ_OK, MOLQ_EARG,
 * MOLQ_ENOMEM or MOLQ_ELIMIT; indices are checked by molq_species_create.
 * Added in 0.1.0. */
MOLQ_API molq_status molq_spec_set_harmonic_wavenumber(molq_spec *spec,
                                                       size_t vibration,
                                                       double w_cm1);
MOLQ_API molq_status molq_spec_add_anharmonicity(molq_spec *spec, size_t i,
                                                 size_t j, double x_cm1);
/* g_ii of a doubly degenerate mode (vibrational angular momentum l). */
MOLQ_API molq_status molq_spec_add_l_constant(molq_spec *spec, size_t i,
                                              double g_cm1);
/* Rotation-vibration constants alpha_i of mode i: one per rotational
 * constant (1 linear, 3 nonlinear: A, B, C); B_k(v) = B_k - sum alpha_ik
 * v_i enters each level's rotational partition function. */
MOLQ_API molq_status molq_spec_add_rotation_vibration(molq_spec *spec,
                                                      size_t i,
                                                      const double *alpha_cm1,
                                                      size_t n);

/* Nuclear-spin weights of a nonlinear molecule's rotational levels by the
 * parity class of (Ka, Kc): ee, eo, oe, oo, on the conventional scale
 * (water: 1/4, 3/4, 3/4, 1/4; the default 1/sigma for each class is the
 * high-temperature limit).  The four must average to 1/sigma (each class
 * holds a quarter of the levels at high T), else molq_species_create
 * refuses them (MOLQ_EVALUE).  Used by the exact rigid-top levels of
 * MOLQ_MODEL_LEVELS, which replace the corrected rotor (and its lower
 * temperature limit) for nonlinear molecules in that model.
 * @return MOLQ_OK or MOLQ_EARG.  Added in 0.1.0. */
MOLQ_API molq_status molq_spec_set_top_weights(molq_spec *spec, double ee,
                                               double eo, double oe,
                                               double oo);

/* Nuclear-spin statistics of tops whose identical nuclei are exchanged by
 * a threefold axis (used by the exact rigid-top levels of
 * MOLQ_MODEL_LEVELS, like molq_spec_set_top_weights).  Added in 0.1.0. */
typedef enum molq_spin_group {
    /* symmetric top, point group C3v: three identical nuclei round the
     * figure axis (NH3, PH3, CH3F); symmetry number 3 */
    MOLQ_SPIN_GROUP_C3V = 1,
    /* spherical top, point group Td: four identical nuclei at the corners
     * of a tetrahedron (CH4, SiH4, CF4); symmetry number 12 */
    MOLQ_SPIN_GROUP_TD = 2
} molq_spin_group;

/* Weigh each rotational level of a nonlinear molecule by the nuclear-spin
 * states its symmetry admits, for the identical nuclei of spin
 * nuclear_spin (I = 0, 1/2, 1, ...; 1/2 for protons) and the given group:
 * C3v, K = 0 mod 3 states n^2 + 2 against n^2 - 1 otherwise (n = 2I + 1;
 * protons 2 : 1); Td, the J level's A, E, F species (protons 5 : 2 : 3).
 * Conventional scale (the nuclear-spin entropy R ln n^N excluded), so the
 * weights average to 1/sigma at high T.  molq_species_create checks that
 * the rotational constants make the right top (two equal for C3v, three
 * for Td, to 1e-6 relative), that the symmetry number is 3 or 12, and that
 * molq_spec_set_top_weights is not also used.  @return MOLQ_OK or
 * MOLQ_EARG (NULL spec).  Added in 0.1.0. */
MOLQ_API molq_status molq_spec_set_top_spin_group(molq_spec *spec,
                                                  molq_spin_group group,
                                                  double nuclear_spin);

/* Validate a description and build an immutable species from it.
 * On failure nothing is allocated, *out is untouched and err names the
 * species and field ("species 'X': field 'symmetry_number': ...").
 * @return MOLQ_OK, MOLQ_EARG (NULL spec/out), MOLQ_EKEY (a required input
 *         missing: molar mass neither set nor computable from the formula,
 *         or the dissociation energy or states a level sum needs),
 *         MOLQ_EVALUE (a value out of range), MOLQ_ELIMIT (a level sum with
 *         more than 400000 bound levels), MOLQ_ENOMEM.
 * Ownership: *out is the caller's; free with molq_species_free.  The
 * description may be freed or reused afterwards.  Thread-safe for distinct
 * descriptions.  Added in 0.1.0. */
MOLQ_API molq_status molq_species_create(const molq_spec *spec,
                                         molq_species **out, char *err,
                                         size_t errlen);

/* Free a species created by molq_species_create.  Accepts NULL.  Never pass
 * a species borrowed from a molq_db.  Added in 0.1.0. */
MOLQ_API void molq_species_free(molq_species *species);

/* @return the species name (borrowed, valid while the species lives), or
 *         NULL if species is NULL.  Added in 0.1.0. */
MOLQ_API const char *molq_species_name(const molq_species *species);

/* @return the formula as given ("" when none; borrowed), NULL if species
 *         is NULL.  Added in 0.1.0. */
MOLQ_API const char *molq_species_formula(const molq_species *species);

/* @return the free-text source of a species' data as given in its file
 *         ("" when none), borrowed; NULL if species is NULL.  Added 0.1.0. */
MOLQ_API const char *molq_species_source(const molq_species *species);

/* @return the charge in elementary charges from the formula (+1 for "N2+",
 *         -1 for "e-"), 0 when neutral, without a readable formula, or for
 *         a NULL species.  Thread-safe.  Added in 0.1.0. */
MOLQ_API int molq_species_charge(const molq_species *species);

/* @return the number of distinct elements of the formula (2 for "CO2", 0
 *         for "e-", without a readable formula or for NULL).  Thread-safe.
 *         Added in 0.1.0. */
MOLQ_API size_t molq_species_element_count(const molq_species *species);

/* Element `index` (0 .. count-1, in order of first appearance in the
 * formula): its symbol (a static string such as "C") and the number of its
 * atoms in one molecule.
 * @return MOLQ_OK, or MOLQ_EARG (NULL pointer, index out of range; outputs
 *         untouched).  Thread-safe.  Added in 0.1.0. */
MOLQ_API molq_status molq_species_element(const molq_species *species,
                                          size_t index, const char **symbol,
                                          long *count);

/* The temperature range, K, over which the species' data were checked
 * against published tables (for the built-in set: the tables' range, see
 * docs/validation.md).  Evaluation is not limited to it: between
 * molq_species_t_min and t_low, and above t_high, the calls return the
 * model's values with MOLQ_OK, without a published check; above t_high a
 * model can miss physics that matters there (ionisation, further
 * electronic states, dissociation of the molecules).
 * @return MOLQ_OK, MOLQ_ENOTFOUND (the data state no range; outputs
 *         untouched), MOLQ_EARG.  Thread-safe.  Added in 0.1.0. */
MOLQ_API molq_status molq_species_validated_range(const molq_species *species,
                                                  double *t_low,
                                                  double *t_high);

/* @return the molar mass in kg/mol, or 0 if species is NULL.  Added 0.1.0. */
MOLQ_API double molq_species_molar_mass(const molq_species *species);

/* @return the molar mass in g/mol, or 0 if species is NULL.  Thread-safe.
 *         Added in 0.1.0. */
MOLQ_API double molq_species_molar_mass_g_per_mol(const molq_species *species);

/* @return 1 if the species carries a standard enthalpy of formation, 0 if
 *         not (h is then the sensible enthalpy, see molq_property) or if
 *         species is NULL.  Added in 0.1.0. */
MOLQ_API int molq_species_has_formation_enthalpy(const molq_species *species);

/* @return the structure of the species (MOLQ_ATOM if species is NULL).
 *         Added in 0.1.0. */
MOLQ_API molq_structure molq_species_structure(const molq_species *species);

/* @return the rotation model of the species (MOLQ_ROTOR_CORRECTED for an
 *         atom or a NULL species).  Added in 0.1.0. */
MOLQ_API molq_rotor molq_species_rotor(const molq_species *species);

/* @return the model the species was built with (MOLQ_MODEL_RRHO for a
 *         NULL species).  Added in 0.1.0. */
MOLQ_API molq_model molq_species_model(const molq_species *species);

/* Build a new species from the same description with another model, e.g.
 * to compare rigid-rotor/harmonic and level-sum results side by side.  For
 * MOLQ_MODEL_RRHO a diatomic given only by its states gets B0 and the
 * fundamental G(1) - G(0) of the ground state and the states' v = 0 levels
 * as electronic levels.  @return as molq_species_create (MOLQ_EVALUE
 * naming the missing field when the data do not support the model).
 * Ownership: *out is the caller's; free with molq_species_free.
 * Thread-safe.  Added in 0.1.0. */
MOLQ_API molq_status molq_species_with_model(const molq_species *species,
                                             molq_model model,
                                             molq_species **out, char *err,
                                             size_t errlen);

/* @return the lowest temperature in K at which the species' results mean
 *         something; every evaluation below it returns MOLQ_ERANGE.  It is
 *         the larger of two limits:
 *         - the lower limit of a model the species uses (the corrected
 *           nonlinear rotor needs T >= theta_A, see molq_rotor), and
 *         - the Boltzmann-gas limit at the standard pressure 1e5 Pa: the
 *           temperature at which the mean occupation of the molecule's
 *           lowest quantum states, N/(g0 q_tr) = n lambda^3 / g0 (lambda the
 *           thermal de Broglie wavelength, g0 the degeneracy of the lowest
 *           electronic level), reaches 1.  Below it the gas is quantum
 *           degenerate: Bose or Fermi statistics, not the Boltzmann
 *           statistics molq uses, decide its properties, and the
 *           Sackur-Tetrode entropy heads for negative values.  At 1e5 Pa
 *           this is 1.9 K for He, 0.58 K for N2, 295 K for the electron gas
 *           (the published tables start the electron at 298.15 K).
 *         The limit scales as (p/1e5 Pa)^(2/5) with pressure; molq applies
 *         the standard-pressure value at every pressure, so at pressures
 *         far above 1e5 Pa results just above t_min can belong to a
 *         degenerate gas without a warning (in practice every real gas has
 *         condensed long before).  Molecular data are validated against
 *         published tables from about 100 K or 298.15 K upward; between
 *         t_min and there the results are the model's, without a
 *         published check.  0 only for a NULL species.  Thread-safe.
 *         Added in 0.1.0. */
MOLQ_API double molq_species_t_min(const molq_species *species);

/* Warnings: findings that do not stop a species from being built but that
 * a user should see, such as a molar mass that differs by more than 1 %
 * from the one its formula gives, or a mass lighter than any atom (a kg/mol
 * value passed where g/mol is meant).  Each is one English line naming the
 * species and the field, e.g. "species 'Ar': field 'molar_mass': ...".
 * Diatomic constants are also checked for plausibility, each finding naming
 * the field and the expected size: De against the Kratzer estimate
 * 4 Be^3/we^2 (ratio 0.8-1.25), alpha_e against the Pekeris estimate
 * 6 sqrt(wexe Be^3)/we - 6 Be^2/we (0.6-1.7), the ground state's
 * we^2/(4 wexe) against dissociation_energy + G(0) (0.7-1.8), Be against
 * h/(8 pi^2 c mu re^2) when the state gives re (2 %), and, for a species
 * read from a file that holds its two atoms with formation enthalpies (for
 * a singly charged ion the atoms of its lower limit, A+ + B or A + B+), the
 * dissociation energy against the formation enthalpies (1 % or 1 kJ/mol;
 * this one is added when the database is read, so a species made alone
 * with molq_species_create does not get it).  A species with a geometry
 * (molq_spec_add_geometry_atom) has its rotational constants checked
 * against the geometry's principal moments of inertia (4 %), its shape
 * against its structure and a linear molecule's symmetry number against
 * the geometry's centre of symmetry.
 * They are fixed when the species is made (molq_species_with_model keeps
 * the original's) and never change afterwards.
 * @return the number of warnings (0 for a NULL species).  Thread-safe.
 * Added in 0.1.0. */
MOLQ_API size_t molq_species_warning_count(const molq_species *species);

/* @return warning `index` (0-based) as a NUL-terminated string borrowed
 *         from the species (valid until it is freed), or NULL when index
 *         is out of range or species is NULL.  At most 1000 are kept; the
 *         last then says how many more there were.  Thread-safe.
 *         Added in 0.1.0. */
MOLQ_API const char *molq_species_warning(const molq_species *species,
                                          size_t index);

/* ------------------------------------------------------------------------ */
/* Evaluation.  All evaluation calls are thread-safe on a shared species,   */
/* allocate nothing and touch no global state.                              */
/* ------------------------------------------------------------------------ */

/* Evaluate one property per mole at temperature T (K) and pressure p (Pa).
 * @return MOLQ_OK, MOLQ_EARG (NULL pointer, unknown property), MOLQ_EDOMAIN
 *         (T or p not finite and > 0), MOLQ_ERANGE (T below
 *         molq_species_t_min).  *out untouched on failure.  Added 0.1.0. */
MOLQ_API molq_status molq_eval(const molq_species *species, double T,
                               double p, molq_property prop, double *out);

/* Evaluate several properties at one state: out[i] receives props[i].
 * Cheaper than separate molq_eval calls (the partition function is summed
 * once).  @return as molq_eval; after MOLQ_EARG, MOLQ_EDOMAIN or a T below
 * t_min out is untouched, after an overflow (MOLQ_ERANGE) its contents are
 * unspecified.  Added in 0.1.0. */
MOLQ_API molq_status molq_eval_many(const molq_species *species, double T,
                                    double p, const molq_property *props,
                                    size_t nprops, double *out);

/* Evaluate one property over n temperatures at one pressure:
 * out[i*out_stride] = prop(T[i*T_stride], p).  Strides count doubles and
 * must be >= 1.  If any T is invalid the call returns its status and the
 * contents of out are unspecified (the call stops at the first bad T).
 * @return MOLQ_OK, MOLQ_EARG, MOLQ_EDOMAIN, MOLQ_ERANGE.  Added in 0.1.0. */
MOLQ_API molq_status molq_eval_batch(const molq_species *species,
                                     molq_property prop, double p,
                                     const double *T, size_t T_stride,
                                     double *out, size_t out_stride,
                                     size_t n);

/* As molq_eval, per unit mass: extensive properties (cp, cv, h, u, s, g, a,
 * h_minus_h298, gef, h_minus_h0 and the derivatives) divided by the molar
 * mass, giving J/(kg K), J/kg, J/(kg K^2); MOLQ_LNQ and MOLQ_DGRT_DT are
 * returned unchanged.  @return as molq_eval (MOLQ_EARG for a NULL out).
 * Added in 0.1.0. */
MOLQ_API molq_status molq_eval_per_mass(const molq_species *species,
                                        double T, double p,
                                        molq_property prop, double *out);

/* Ortho-para conversion enthalpy at T, J/mol: h of the frozen mixture of
 * the two nuclear-spin modifications minus h in spin equilibrium, i.e. the
 * heat released per mole when the mixture relaxes to equilibrium at T
 * (positive where conversion is exothermic, e.g. normal hydrogen at 20 K).
 * The frozen mixture is the species' own (molq_spec_set_spin_isomers_frozen)
 * or, for an equilibrium species, the high-temperature one (odd fraction
 * w_odd/(w_even + w_odd) of the ground state).  Exactly 0 for a species
 * with a single modification (heteronuclear, nuclei of spin 0 such as 16O2,
 * or no diatomic level sum).
 * A property of the molecules' internal states: evaluated down to the
 * models' own limit, as an internal mode of molq_eval_mode.
 * @return MOLQ_OK, MOLQ_EARG (NULL, or a species not using
 * MOLQ_MODEL_LEVELS), MOLQ_EDOMAIN, MOLQ_ERANGE.  Added in 0.1.0. */
MOLQ_API molq_status molq_eval_spin_conversion(const molq_species *species,
                                               double T, double *out);

/* ------------------------------------------------------------------------ */
/* Per-mode breakdown                                                       */
/* ------------------------------------------------------------------------ */

/* Kinds of modes (groups of degrees of freedom).  Values never change; new
 * kinds are appended.  Added in 0.1.0. */
typedef enum molq_mode_kind {
    MOLQ_MODE_TRANSLATION = 0,
    MOLQ_MODE_ROTATION = 1,
    MOLQ_MODE_VIBRATION = 2,   /* all harmonic vibrational modes together */
    MOLQ_MODE_ELECTRONIC = 3,
    MOLQ_MODE_ROVIBRONIC = 4,  /* diatomic level sum over all electronic
                                  states (MOLQ_MODEL_LEVELS) */
    MOLQ_MODE_TORSION = 5      /* one hindered internal rotor
                                  (MOLQ_MODEL_LEVELS) */
} molq_mode_kind;

/* @return the number of modes of a species (0 if species is NULL). */
MOLQ_API size_t molq_species_mode_count(const molq_species *species);

/* Kind of mode `index` (0 .. count-1).
 * @return MOLQ_OK or MOLQ_EARG.  Added in 0.1.0. */
MOLQ_API molq_status molq_species_mode_kind(const molq_species *species,
                                            size_t index,
                                            molq_mode_kind *out);

/* @return the short name of a mode kind ("translation", ...), static, or
 *         NULL for an unknown value.  Added in 0.1.0. */
MOLQ_API const char *molq_mode_kind_name(molq_mode_kind kind);

/* Contribution of mode `index` to a property at (T, p).  Supported:
 * MOLQ_LNQ (its ln q; translation includes the kT/p volume), MOLQ_U (its
 * thermal energy above its ground level, RT<E>/kT, J/mol), MOLQ_CV, MOLQ_S
 * (translation carries the +R of the ideal-gas entropy and the pressure),
 * MOLQ_DCV_DT.  The contributions add up to the species' value for lnq,
 * cv, s, dcv_dT and to h - h(0) - RT for u.
 * An internal mode (rotation, vibration, electronic, ...) describes one
 * molecule and is evaluated down to its model's own limit, which can lie
 * below molq_species_t_min (that one includes the gas's Boltzmann limit);
 * the translation mode keeps molq_species_t_min.
 * @return MOLQ_OK, MOLQ_EARG (bad index or unsupported property),
 *         MOLQ_EDOMAIN, MOLQ_ERANGE (below the limit just described).
 *         Added in 0.1.0. */
MOLQ_API molq_status molq_eval_mode(const molq_species *species, size_t index,
                                    double T, double p, molq_property prop,
                                    double *out);

/* ------------------------------------------------------------------------ */
/* Species databases (sets of species read from JSON)                       */
/* ------------------------------------------------------------------------ */

/* An immutable set of species.  Thread-safe to share. */
typedef struct molq_db_s molq_db;

/* Read a species file (JSON, schema version 1; see the README for keys).
 * On failure nothing is allocated and err says what and where: the line
 * and column of a syntax error, or the species and field of a bad value.
 * @return MOLQ_OK, MOLQ_EARG, MOLQ_EIO, MOLQ_ESYNTAX, MOLQ_EKEY,
 *         MOLQ_ETYPE, MOLQ_EVALUE, MOLQ_EDUPLICATE, MOLQ_ELIMIT (file over
 *         64 MiB, over 100000 species), MOLQ_ENOMEM.
 * Ownership: *out is the caller's; free with molq_db_free.  Added 0.1.0. */
MOLQ_API molq_status molq_db_read_file(const char *path, molq_db **out,
                                       char *err, size_t errlen);

/* As molq_db_read_file, from `len` bytes of JSON text in memory (need not
 * be NUL-terminated).  Added in 0.1.0. */
MOLQ_API molq_status molq_db_read_string(const char *json, size_t len,
                                         molq_db **out, char *err,
                                         size_t errlen);

/* Open the starter species set compiled into the library (Ar, N2, O2, CO,
 * CO2, H2O, ... each with its published source).  Added in 0.1.0. */
MOLQ_API molq_status molq_db_builtin(molq_db **out, char *err,
                                     size_t errlen);

/* Free a database and every species borrowed from it.  Accepts NULL.  Not
 * while another thread still uses the database or one of its species.
 * Added in 0.1.0. */
MOLQ_API void molq_db_free(molq_db *db);

/* @return the number of species (0 if db is NULL).  Thread-safe.
 *         Added in 0.1.0. */
MOLQ_API size_t molq_db_count(const molq_db *db);

/* Enumerate with index 0 .. molq_db_count(db) - 1.
 * @return species `index` in file order, borrowed (valid until
 *         molq_db_free), or NULL if the index is out of range or db is
 *         NULL.  Thread-safe.  Added in 0.1.0. */
MOLQ_API const molq_species *molq_db_species(const molq_db *db, size_t index);

/* Find a species by exact name (case-sensitive).  *out is borrowed (valid
 * until molq_db_free) and untouched on failure.
 * @return MOLQ_OK, MOLQ_EARG (a NULL argument), MOLQ_ENOTFOUND.
 * Thread-safe.  Added in 0.1.0. */
MOLQ_API molq_status molq_db_find(const molq_db *db, const char *name,
                                  const molq_species **out);

/* Find the first species (in file order) whose formula is exactly
 * `formula` (as given, e.g. "CO2", "N2+", "e-"; case-sensitive, no
 * normalisation: "OC" is not "CO").  "" finds nothing (a species without
 * a formula is never found by formula).  *out is borrowed (valid until
 * molq_db_free) and untouched on failure.
 * @return MOLQ_OK, MOLQ_EARG (a NULL argument), MOLQ_ENOTFOUND.
 * Thread-safe.  Added in 0.1.0. */
MOLQ_API molq_status molq_db_find_formula(const molq_db *db,
                                          const char *formula,
                                          const molq_species **out);

/* Warnings of a database: first those about the file itself (a missing
 * schema_version), then every species' warnings in file order (the same
 * text molq_species_warning gives).  A database that loaded with warnings
 * is complete and usable; the warnings say what to check.
 * @return the number of warnings (0 for a NULL db).  Thread-safe.
 * Added in 0.1.0. */
MOLQ_API size_t molq_db_warning_count(const molq_db *db);

/* @return warning `index` (0-based), borrowed from the database (valid
 *         until molq_db_free), or NULL when out of range or db is NULL.
 *         Thread-safe.  Added in 0.1.0. */
MOLQ_API const char *molq_db_warning(const molq_db *db, size_t index);

/* ------------------------------------------------------------------------ */
/* Mixtures: many species per cell, batch properties, T from h, u or s      */
/* ------------------------------------------------------------------------ */

/* An immutable ordered list of species (the caller's order) with what it
 * precomputes (molar masses, temperature bounds, the evaluation method).
 * Built once, shareable across threads without locks; every evaluation
 * call is thread-safe on a shared mixture, allocates nothing and touches
 * no global state.  The mixture BORROWS its species: they (and the
 * database they came from) must outlive it.  Added in 0.1.0. */
typedef struct molq_mixture_s molq_mixture;

/* Creation options (a mutable builder, not thread-safe while being set;
 * a NULL config everywhere means the defaults given below).  The mixture
 * copies what it needs: the config may be freed right after creation.
 * Added in 0.1.0. */
typedef struct molq_mix_config_s molq_mix_config;

/* How a mixture evaluates its species.  Values never change; new methods
 * (the tabulated fast path) are appended, and every evaluation call works
 * with any method.  Added in 0.1.0. */
typedef enum molq_mix_method {
    MOLQ_MIX_EXACT = 0 /* the species' own model at every call (default) */
} molq_mix_method;

/* What a composition array holds.  Added in 0.1.0. */
typedef enum molq_basis {
    MOLQ_MOLE_FRACTIONS = 0,
    MOLQ_MASS_FRACTIONS = 1
} molq_basis;

/* Per mole of mixture (J/mol, J/(mol K)) or per kilogram (J/kg,
 * J/(kg K)).  Added in 0.1.0. */
typedef enum molq_per {
    MOLQ_PER_MOLE = 0,
    MOLQ_PER_MASS = 1
} molq_per;

/* Mixture properties.  Values never change; new ones are appended.
 * Extensive ones follow molq_per; the others ignore it.  h is on the
 * species' formation-enthalpy scale (see molq_spec_set_formation_enthalpy:
 * elements in their reference states at 298.15 K are zero), so reacting
 * mixtures balance energy.  s includes the ideal mixing term
 * -R sum x_k ln x_k (a species with x_k = 0 contributes nothing), each
 * species at the mixture pressure p.  Added in 0.1.0. */
typedef enum molq_mix_property {
    MOLQ_MIX_MOLAR_MASS = 0,   /* mean molar mass, kg/mol (ignores per)   */
    MOLQ_MIX_GAS_CONSTANT = 1, /* specific gas constant R/M, J/(kg K)
                                  (ignores per)                           */
    MOLQ_MIX_CP = 2,           /* frozen cp                               */
    MOLQ_MIX_CV = 3,           /* frozen cv                               */
    MOLQ_MIX_H = 4,
    MOLQ_MIX_U = 5,            /* h - RT per mole                         */
    MOLQ_MIX_S = 6,            /* with the mixing term                    */
    MOLQ_MIX_G = 7,            /* h - T s                                 */
    MOLQ_MIX_GAMMA = 8,        /* cp / cv, 1                              */
    MOLQ_MIX_SOUND_SPEED = 9,  /* frozen sqrt(gamma R T / M), m/s         */
    MOLQ_MIX_DCP_DT = 10,      /* d(cp)/dT at fixed composition and p     */
    MOLQ_MIX_DCV_DT = 11       /* d(cv)/dT (= d(cp)/dT for ideal gases)   */
} molq_mix_property;

/* @return the number of mixture properties (grows with the library). */
MOLQ_API size_t molq_mix_property_count(void);

/* @return the name of a mixture property ("cp", "sound_speed", ...),
 *         static, or NULL for an unknown value.  Added in 0.1.0. */
MOLQ_API const char *molq_mix_property_name(molq_mix_property prop);

/* Look a mixture property up by its name.
 * @return MOLQ_OK, MOLQ_EARG (NULL), MOLQ_ENOTFOUND.  Added in 0.1.0. */
MOLQ_API molq_status molq_mix_property_from_name(const char *name,
                                                 molq_mix_property *out);

/* A new config holding the defaults: method MOLQ_MIX_EXACT; composition
 * tolerance 1e-6; no normalisation; temperature tolerance 1e-10
 * (relative); 100 iterations at most; temperature bounds from the species
 * (see molq_mixture_temperature_bounds).
 * @return MOLQ_OK, MOLQ_EARG, MOLQ_ENOMEM.  *out is the caller's; free it
 * with molq_mix_config_free.  Added in 0.1.0. */
MOLQ_API molq_status molq_mix_config_new(molq_mix_config **out);

/* Accepts NULL.  Added in 0.1.0. */
MOLQ_API void molq_mix_config_free(molq_mix_config *cfg);

/* @return MOLQ_OK, MOLQ_EARG (NULL or unknown method).  Added in 0.1.0. */
MOLQ_API molq_status molq_mix_config_set_method(molq_mix_config *cfg,
                                                molq_mix_method method);

/* Composition checks applied to every cell (tol finite, 0 <= tol < 0.1):
 * a fraction below -tol, a NaN or infinite fraction, or (without
 * normalisation) a sum farther than tol from 1 is refused; fractions in
 * [-tol, 0) count as 0.  With normalise != 0 any finite positive sum is
 * accepted and the fractions are divided by it (never written back).
 * @return MOLQ_OK, MOLQ_EARG (NULL), MOLQ_EVALUE (tol).  Added in 0.1.0. */
MOLQ_API molq_status molq_mix_config_set_composition(molq_mix_config *cfg,
                                                     double tol,
                                                     int normalise);

/* Temperature inversion: relative tolerance in T (1e-15 <= rtol <= 1e-3)
 * and the largest number of forward evaluations per cell (1 .. 10000).
 * @return MOLQ_OK, MOLQ_EARG (NULL), MOLQ_EVALUE.  Added in 0.1.0. */
MOLQ_API molq_status molq_mix_config_set_inversion(molq_mix_config *cfg,
                                                   double rtol,
                                                   unsigned max_evaluations);

/* Bracket searched by molq_mixture_temperature, K.  Must satisfy
 * 0 < t_lo < t_hi, finite; t_lo must not lie below the mixture's lowest
 * evaluable temperature (checked at creation).
 * @return MOLQ_OK, MOLQ_EARG (NULL), MOLQ_EVALUE.  Added in 0.1.0. */
MOLQ_API molq_status molq_mix_config_set_temperature_bounds(
    molq_mix_config *cfg, double t_lo, double t_hi);

/* Make a mixture of n >= 1 species (distinct handles, distinct names), in
 * that order.  cfg may be NULL.  On failure nothing is allocated and err
 * names the offending entry.
 * @return MOLQ_OK, MOLQ_EARG (NULL species entry, n = 0), MOLQ_EDUPLICATE,
 *         MOLQ_EVALUE (bounds below a species' t_min), MOLQ_ELIMIT (over
 *         100000 species), MOLQ_ENOMEM.
 * Ownership: *out is the caller's (molq_mixture_free); the species are
 * borrowed.  Added in 0.1.0. */
MOLQ_API molq_status molq_mixture_create(const molq_species *const *species,
                                         size_t n, const molq_mix_config *cfg,
                                         molq_mixture **out, char *err,
                                         size_t errlen);

/* As molq_mixture_create, looking each name up in db (by name, then by
 * formula).  @return as molq_mixture_create, and MOLQ_ENOTFOUND naming the
 * name.  The mixture borrows db's species: free it before db.
 * Added in 0.1.0. */
MOLQ_API molq_status molq_mixture_from_names(const molq_db *db,
                                             const char *const *names,
                                             size_t n,
                                             const molq_mix_config *cfg,
                                             molq_mixture **out, char *err,
                                             size_t errlen);

/* Accepts NULL.  Not while another thread uses the mixture.  Added 0.1.0. */
MOLQ_API void molq_mixture_free(molq_mixture *mix);

/* @return the number of species (0 for NULL).  Added in 0.1.0. */
MOLQ_API size_t molq_mixture_species_count(const molq_mixture *mix);

/* @return species k (borrowed), or NULL when out of range.  Added 0.1.0. */
MOLQ_API const molq_species *molq_mixture_species(const molq_mixture *mix,
                                                  size_t k);

/* Index of the species named `name` (exact, case-sensitive).
 * @return MOLQ_OK, MOLQ_EARG, MOLQ_ENOTFOUND.  Added in 0.1.0. */
MOLQ_API molq_status molq_mixture_index(const molq_mixture *mix,
                                        const char *name, size_t *out);

/* @return the evaluation method chosen at creation.  Added in 0.1.0. */
MOLQ_API molq_mix_method molq_mixture_method(const molq_mixture *mix);

/* Bracket of molq_mixture_temperature, K: the config's, or else the
 * intersection of the species' validated ranges (a species without one
 * contributes [molq_species_t_min, 6000 K]).  Forward evaluation is not
 * limited to it: it refuses only T below the largest species t_min.
 * @return MOLQ_OK, MOLQ_EARG.  Added in 0.1.0. */
MOLQ_API molq_status molq_mixture_temperature_bounds(const molq_mixture *mix,
                                                     double *t_lo,
                                                     double *t_hi);

/* Batch layout used by every mixture call.  Cell c (0 .. ncells-1) reads
 *   T[c * T_stride], p[c * p_stride]                (stride 0: one value)
 *   X[c * X_cell + k * X_species]  for species k    (fractions)
 * so cell-major Y[cell][k] is (X_cell = K, X_species = 1), species-major
 * Y[k][cell] is (X_cell = 1, X_species = ncells or the row pitch), and
 * X_cell = 0 gives every cell the same composition.  Strides count
 * doubles.  Inputs are never written.
 *
 * All-or-nothing: every input of every cell is checked before anything is
 * written.  On failure *bad_cell (when not NULL) receives the failing
 * cell's index, err names the cell, the species and the field, and out is
 * untouched.  On success *bad_cell receives ncells. */

/* Mixture properties: out[c * out_cell + j * out_prop] = props[j] of cell
 * c at (T, p, composition).  Units per `per` (see molq_mix_property).
 * @return MOLQ_OK; MOLQ_EARG (NULL pointer, unknown enum, a zero stride
 *         where one is needed: X_species, and out_prop when nprops > 1);
 *         MOLQ_EDOMAIN (T or p not finite and > 0); MOLQ_ERANGE (T below
 *         the largest species t_min); MOLQ_EVALUE (composition, see
 *         molq_mix_config_set_composition).  Added in 0.1.0. */
MOLQ_API molq_status molq_mixture_eval(
    const molq_mixture *mix, size_t ncells, const double *T, size_t T_stride,
    const double *p, size_t p_stride, const double *X, size_t X_cell,
    size_t X_species, molq_basis basis, const molq_mix_property *props,
    size_t nprops, molq_per per, double *out, size_t out_cell,
    size_t out_prop, size_t *bad_cell, char *err, size_t errlen);

/* Per-species vectors for kinetics, diffusion and Jacobians:
 * out[c * out_cell + k * out_species + j * out_prop] = props[j] of pure
 * species k at (T, p) of cell c (any molq_property; pass p = 1e5 Pa for
 * standard-state s_k and g_k).  With MOLQ_PER_MASS extensive properties
 * are divided by the species' molar mass: h_k/W_k is the partial
 * derivative of the mixture's h per mass with respect to Y_k (u_k/W_k
 * likewise for u), and cp_k is d(h_k)/dT.  For g_k/RT use MOLQ_G divided
 * by RT, or MOLQ_DGRT_DT for its T derivative.
 * @return as molq_mixture_eval (no composition).  Added in 0.1.0. */
MOLQ_API molq_status molq_mixture_eval_species(
    const molq_mixture *mix, size_t ncells, const double *T, size_t T_stride,
    const double *p, size_t p_stride, const molq_property *props,
    size_t nprops, molq_per per, double *out, size_t out_cell,
    size_t out_species, size_t out_prop, size_t *bad_cell, char *err,
    size_t errlen);

/* Convert compositions: from `from` fractions X to the other basis in
 * out[c * out_cell + k * out_species] (normalised to sum 1; clipped
 * negatives written as 0).  out must not overlap X.
 * @return MOLQ_OK, MOLQ_EARG, MOLQ_EVALUE.  Added in 0.1.0. */
MOLQ_API molq_status molq_mixture_convert(
    const molq_mixture *mix, size_t ncells, molq_basis from, const double *X,
    size_t X_cell, size_t X_species, double *out, size_t out_cell,
    size_t out_species, size_t *bad_cell, char *err, size_t errlen);

/* Temperature from energy or entropy: for each cell the T in the bracket
 * (molq_mixture_temperature_bounds) at which property `given` (MOLQ_MIX_H,
 * MOLQ_MIX_U or MOLQ_MIX_S, per `per`) of the cell's composition (and p,
 * for s; p is ignored for h and u, which do not depend on it) equals
 * value[c * value_stride].  Safeguarded Newton with the analytic cp, cv or
 * cp/T inside a bracket that shrinks with every evaluation; converged when
 * the step is below rtol * T (molq_mix_config_set_inversion).  T_guess
 * (NULL for none, stride 0 for one value) warm-starts the search (the
 * previous time step's T); a guess outside the bracket is clamped.
 * iterations (NULL for none) receives, contiguously, the forward
 * evaluations each cell used.  T_out[c * T_out_stride].
 * @return MOLQ_OK; MOLQ_EARG; MOLQ_EDOMAIN (value, p or guess not finite;
 *         p <= 0 for s); MOLQ_EVALUE (composition); MOLQ_ERANGE (the
 *         value lies outside what the bracket's ends give: err gives the
 *         cell, the value and the attainable interval); MOLQ_ENOCONV (the
 *         evaluation limit was reached).  Inputs of every cell are
 *         checked before anything is written (EARG, EDOMAIN, EVALUE leave
 *         T_out untouched); a range or convergence failure is found while
 *         solving: then cells 0 .. *bad_cell - 1 hold their solved T (and
 *         iterations), the rest of T_out is untouched.
 * Added in 0.1.0. */
MOLQ_API molq_status molq_mixture_temperature(
    const molq_mixture *mix, molq_mix_property given, molq_per per,
    size_t ncells, const double *value, size_t value_stride, const double *p,
    size_t p_stride, const double *X, size_t X_cell, size_t X_species,
    molq_basis basis, const double *T_guess, size_t guess_stride,
    double *T_out, size_t T_out_stride, unsigned *iterations,
    size_t *bad_cell, char *err, size_t errlen);

#ifdef MOLQ_EXPERIMENTAL
/* ------------------------------------------------------------------------ */
/* Experimental API: may change or disappear in any release; not covered  */
/* by the ABI promise.  Opt in by defining MOLQ_EXPERIMENTAL.               */
/* ------------------------------------------------------------------------ */
#endif

#ifdef __cplusplus
}
#endif

#endif /* MOLQ_MOLQ_H */
