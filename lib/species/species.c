#include "species/species.h"

#include <stdlib.h>

#include "core/constants.h"
#include "core/errbuf.h"

static char *dup_or_empty(const char *s)
{
    return molq_strdup(s != NULL ? s : "");
}

molq_status molq_species_build(const molq_spec *spec, double molar_mass,
                               molq_species **out)
{
    molq_species *sp = calloc(1, sizeof *sp);
    size_t nel = spec->nel > 0 ? spec->nel : 1;
    size_t i;
    double *vt, *vg, *et, *eg;
    if (sp == NULL)
        return MOLQ_ENOMEM;
    sp->name = molq_strdup(spec->name);
    sp->formula = dup_or_empty(spec->formula);
    sp->source = dup_or_empty(spec->source);
    sp->arrays = malloc(sizeof(double) * (2 * spec->nvib + 2 * nel));
    if (!sp->name || !sp->formula || !sp->source || !sp->arrays) {
        molq_species_destroy(sp);
        return MOLQ_ENOMEM;
    }
    vt = sp->arrays;
    vg = vt + spec->nvib;
    et = vg + spec->nvib;
    eg = et + nel;
    for (i = 0; i < spec->nvib; i++) {
        vt[i] = MOLQ_C2_CM_K * spec->vib_wn[i];
        vg[i] = (double)spec->vib_deg[i];
    }
    if (spec->nel == 0) {
        et[0] = 0.0;
        eg[0] = 1.0;
    }
    for (i = 0; i < spec->nel; i++) {
        et[i] = MOLQ_C2_CM_K * spec->el_e[i];
        eg[i] = (double)spec->el_g[i];
    }

    sp->molar_mass = molar_mass;
    sp->structure = (molq_structure)spec->structure;
    sp->rotor = (molq_rotor)spec->rotor;
    sp->has_formation_enthalpy = spec->has_formation_enthalpy;
    sp->formation_enthalpy =
        spec->has_formation_enthalpy ? spec->formation_enthalpy : 0.0;

    molq_mode_translation_init(&sp->modes[sp->nmodes++], molar_mass);
    if (spec->structure != MOLQ_ATOM)
        molq_mode_rotation_init(&sp->modes[sp->nmodes++],
                                spec->structure == MOLQ_LINEAR,
                                spec->rotor == MOLQ_ROTOR_CLASSICAL,
                                spec->sigma, spec->rot, &sp->t_min);
    if (spec->nvib > 0)
        molq_mode_vibration_init(&sp->modes[sp->nmodes++], spec->nvib, vt,
                                 vg);
    molq_mode_electronic_init(&sp->modes[sp->nmodes++], nel, et, eg);
    *out = sp;
    return MOLQ_OK;
}

void molq_species_destroy(molq_species *sp)
{
    if (sp == NULL)
        return;
    free(sp->name);
    free(sp->formula);
    free(sp->source);
    free(sp->arrays);
    free(sp);
}
