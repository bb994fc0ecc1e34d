/* species/species.h -- the immutable species object: validated constants
 * turned into mode parameters (characteristic temperatures in K), plus the
 * cached enthalpy reference.  Built once, never modified after creation. */
#ifndef MOLQ_SPECIES_H
#define MOLQ_SPECIES_H

#include "data/spec.h"
#include "modes/modes.h"

#define MOLQ_MAX_MODES (4 + MOLQ_MAX_TORSIONS)

struct molq_species_s {
    char *name;
    char *formula;
    char *source;
    double molar_mass; /* kg/mol */
    molq_structure structure;
    molq_rotor rotor;
    molq_model model;
    molq_spec *spec; /* validated copy of the description (for variants) */
    int has_formation_enthalpy;
    double formation_enthalpy; /* J/mol at 298.15 K (0 when absent) */
    double h298_minus_h0;      /* J/mol, filled by molq_thermo_prepare */
    double t_min;              /* K, lowest valid temperature */
    size_t nmodes;
    molq_mode modes[MOLQ_MAX_MODES];
    double *arrays; /* one block: vib theta, vib g, el theta, el g */
};

/* Build a species with `model` from a spec that molq_spec_validate
 * accepted, with the molar mass it returned.  MOLQ_ENOMEM, or MOLQ_EVALUE
 * when the data cannot support the model (message names the field);
 * nothing is leaked. */
molq_status molq_species_build(const molq_spec *spec, double molar_mass,
                               molq_model model, molq_species **out,
                               char *err, size_t errlen);

void molq_species_destroy(molq_species *sp);

#endif
