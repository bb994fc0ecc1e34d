/* Public species lifetime and queries. */
#include "core/errbuf.h"
#include "species/species.h"
#include "thermo/thermo.h"

molq_status molq_species_create(const molq_spec *spec, molq_species **out,
                                char *err, size_t errlen)
{
    double mass;
    molq_status st;
    molq_species *sp;
    molq_warnlist warn = {0};
    if (spec == NULL || out == NULL) {
        molq_errf(err, errlen, "molq_species_create: NULL argument");
        return MOLQ_EARG;
    }
    if ((st = molq_spec_validate(spec, &mass, &warn, err, errlen)) !=
            MOLQ_OK ||
        (st = molq_species_build(spec, mass, molq_spec_default_model(spec),
                                 &sp, err, errlen)) != MOLQ_OK) {
        molq_warn_free(&warn);
        return st;
    }
    sp->warnings = warn; /* the species owns the list from here */
    molq_thermo_prepare(sp);
    *out = sp;
    return MOLQ_OK;
}

molq_status molq_species_with_model(const molq_species *species,
                                    molq_model model, molq_species **out,
                                    char *err, size_t errlen)
{
    molq_species *sp;
    molq_status st;
    if (species == NULL || out == NULL ||
        (model != MOLQ_MODEL_RRHO && model != MOLQ_MODEL_LEVELS)) {
        molq_errf(err, errlen, "molq_species_with_model: bad argument");
        return MOLQ_EARG;
    }
    st = molq_species_build(species->spec, species->molar_mass, model, &sp,
                            err, errlen);
    if (st != MOLQ_OK)
        return st;
    if (molq_warn_append(&sp->warnings, &species->warnings) != MOLQ_OK) {
        molq_species_destroy(sp);
        molq_errf(err, errlen, "species '%s': out of memory",
                  species->name);
        return MOLQ_ENOMEM;
    }
    molq_thermo_prepare(sp);
    *out = sp;
    return MOLQ_OK;
}

molq_model molq_species_model(const molq_species *sp)
{
    return sp ? sp->model : MOLQ_MODEL_RRHO;
}

void molq_species_free(molq_species *species)
{
    molq_species_destroy(species);
}

const char *molq_species_name(const molq_species *sp)
{
    return sp ? sp->name : NULL;
}

const char *molq_species_formula(const molq_species *sp)
{
    return sp ? sp->formula : NULL;
}

const char *molq_species_source(const molq_species *sp)
{
    return sp ? sp->source : NULL;
}

double molq_species_molar_mass(const molq_species *sp)
{
    return sp ? sp->molar_mass : 0.0;
}

double molq_species_molar_mass_g_per_mol(const molq_species *sp)
{
    return sp ? sp->molar_mass_g : 0.0;
}

int molq_species_has_formation_enthalpy(const molq_species *sp)
{
    return sp ? sp->has_formation_enthalpy : 0;
}

molq_structure molq_species_structure(const molq_species *sp)
{
    return sp ? sp->structure : MOLQ_ATOM;
}

molq_rotor molq_species_rotor(const molq_species *sp)
{
    return sp ? sp->rotor : MOLQ_ROTOR_CORRECTED;
}

double molq_species_t_min(const molq_species *sp)
{
    return sp ? sp->t_min : 0.0;
}

size_t molq_species_mode_count(const molq_species *sp)
{
    return sp ? sp->nmodes : 0;
}

molq_status molq_species_mode_kind(const molq_species *sp, size_t index,
                                   molq_mode_kind *out)
{
    if (sp == NULL || out == NULL || index >= sp->nmodes)
        return MOLQ_EARG;
    *out = sp->modes[index].kind;
    return MOLQ_OK;
}

size_t molq_species_warning_count(const molq_species *sp)
{
    return sp ? sp->warnings.n : 0;
}

const char *molq_species_warning(const molq_species *sp, size_t index)
{
    return sp ? molq_warn_get(&sp->warnings, index) : NULL;
}

int molq_species_charge(const molq_species *sp)
{
    return sp ? sp->comp.charge : 0;
}

size_t molq_species_element_count(const molq_species *sp)
{
    return sp ? sp->comp.n : 0;
}

molq_status molq_species_element(const molq_species *sp, size_t index,
                                 const char **symbol, long *count)
{
    if (sp == NULL || symbol == NULL || count == NULL || index >= sp->comp.n)
        return MOLQ_EARG;
    *symbol = sp->comp.el[index].symbol;
    *count = sp->comp.el[index].count;
    return MOLQ_OK;
}

molq_status molq_species_validated_range(const molq_species *sp,
                                         double *t_low, double *t_high)
{
    if (sp == NULL || t_low == NULL || t_high == NULL)
        return MOLQ_EARG;
    if (!sp->has_range)
        return MOLQ_ENOTFOUND;
    *t_low = sp->range_lo;
    *t_high = sp->range_hi;
    return MOLQ_OK;
}
