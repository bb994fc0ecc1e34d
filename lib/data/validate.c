/* Validation of a species description.  Every message has the form
 *   species 'NAME': field 'KEY': what is wrong (got VALUE)
 * using the key names of the species file, so a user can find the line. */
#include <math.h>
#include <string.h>

#include "core/errbuf.h"
#include "data/spec.h"

#define FAIL(code, ...)                                                        \
    do {                                                                       \
        molq_errf(err, errlen, __VA_ARGS__);                                   \
        return (code);                                                         \
    } while (0)

static const size_t rot_count[3] = {0, 1, 3};
static const char *const structure_name[3] = {"atom", "linear", "nonlinear"};

molq_status molq_spec_validate(const molq_spec *s, double *molar_mass,
                               char *err, size_t errlen)
{
    const char *nm = s->name;
    size_t i, len = strlen(nm);
    int have_ground = 0;

    if (len == 0 || len > MOLQ_MAX_NAME)
        FAIL(MOLQ_EVALUE, "species '%.40s': field 'name': must be 1 to %d bytes "
             "long (got %zu)", nm, MOLQ_MAX_NAME, len);

    if (s->has_molar_mass) {
        if (!isfinite(s->molar_mass) || s->molar_mass <= 0.0)
            FAIL(MOLQ_EVALUE, "species '%s': field 'molar_mass': must be a "
                 "finite number > 0 (got %g g/mol)", nm, s->molar_mass * 1e3);
        *molar_mass = s->molar_mass;
    } else if (s->formula != NULL) {
        char sub[200];
        if (molq_formula_molar_mass(s->formula, molar_mass, sub, sizeof sub)
            != MOLQ_OK)
            FAIL(MOLQ_EVALUE, "species '%s': field 'formula': %s", nm, sub);
    } else {
        FAIL(MOLQ_EKEY, "species '%s': field 'molar_mass': missing, and no "
             "'formula' to compute it from", nm);
    }

    if (s->structure < MOLQ_ATOM || s->structure > MOLQ_NONLINEAR)
        FAIL(MOLQ_EVALUE, "species '%s': field 'structure': must be atom, "
             "linear or nonlinear (got code %d)", nm, s->structure);
    if (s->rotor != MOLQ_ROTOR_CORRECTED && s->rotor != MOLQ_ROTOR_CLASSICAL)
        FAIL(MOLQ_EVALUE, "species '%s': field 'rotor': must be corrected or "
             "classical (got code %d)", nm, s->rotor);
    if (s->sigma < 1)
        FAIL(MOLQ_EVALUE, "species '%s': field 'symmetry_number': must be an "
             "integer >= 1 (got %d)", nm, s->sigma);
    if (s->structure == MOLQ_ATOM && s->sigma != 1)
        FAIL(MOLQ_EVALUE, "species '%s': field 'symmetry_number': an atom has "
             "no rotation, so it must be 1 (got %d)", nm, s->sigma);

    if (s->nrot != rot_count[s->structure])
        FAIL(MOLQ_EVALUE, "species '%s': field 'rotational_constants': a %s "
             "species needs %zu (got %zu)", nm, structure_name[s->structure],
             rot_count[s->structure], s->nrot);
    for (i = 0; i < s->nrot; i++)
        if (!isfinite(s->rot[i]) || s->rot[i] <= 0.0)
            FAIL(MOLQ_EVALUE, "species '%s': field 'rotational_constants[%zu]'"
                 ": must be a finite number > 0 cm^-1 (got %g)", nm, i,
                 s->rot[i]);
    if (s->nrot == 3 && !(s->rot[0] >= s->rot[1] && s->rot[1] >= s->rot[2]))
        FAIL(MOLQ_EVALUE, "species '%s': field 'rotational_constants': must be "
             "ordered A >= B >= C (got %g, %g, %g)", nm, s->rot[0], s->rot[1],
             s->rot[2]);

    if (s->structure == MOLQ_ATOM && s->nvib > 0)
        FAIL(MOLQ_EVALUE, "species '%s': field 'vibrations': an atom has no "
             "vibrational modes (got %zu)", nm, s->nvib);
    for (i = 0; i < s->nvib; i++) {
        if (!isfinite(s->vib_wn[i]) || s->vib_wn[i] <= 0.0)
            FAIL(MOLQ_EVALUE, "species '%s': field 'vibrations[%zu].wavenumber'"
                 ": must be a finite number > 0 cm^-1; a zero or imaginary "
                 "(negative) mode is not a vibration (got %g)", nm, i,
                 s->vib_wn[i]);
        if (s->vib_deg[i] < 1)
            FAIL(MOLQ_EVALUE, "species '%s': field 'vibrations[%zu].degeneracy'"
                 ": must be an integer >= 1 (got %d)", nm, i, s->vib_deg[i]);
    }

    for (i = 0; i < s->nel; i++) {
        if (!isfinite(s->el_e[i]) || s->el_e[i] < 0.0)
            FAIL(MOLQ_EVALUE, "species '%s': field 'electronic_levels[%zu]."
                 "energy': must be a finite number >= 0 cm^-1 above the ground "
                 "level (got %g)", nm, i, s->el_e[i]);
        if (s->el_g[i] < 1)
            FAIL(MOLQ_EVALUE, "species '%s': field 'electronic_levels[%zu]."
                 "degeneracy': must be an integer >= 1 (got %d)", nm, i,
                 s->el_g[i]);
        if (s->el_e[i] == 0.0)
            have_ground = 1;
    }
    if (s->nel > 0 && !have_ground)
        FAIL(MOLQ_EVALUE, "species '%s': field 'electronic_levels': one level "
             "must be the ground level, at energy 0", nm);

    if (s->has_formation_enthalpy && !isfinite(s->formation_enthalpy))
        FAIL(MOLQ_EVALUE, "species '%s': field 'formation_enthalpy_298': must "
             "be a finite number (J/mol)", nm);
    return MOLQ_OK;
}
