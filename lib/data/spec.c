/* The public molq_spec_* functions: a mutable species description.  Setters
 * store; molq_spec_validate judges. */
#include <stdlib.h>
#include <string.h>

#include "core/errbuf.h"
#include "data/spec.h"

molq_status molq_spec_new(const char *name, molq_spec **out)
{
    molq_spec *s;
    if (name == NULL || out == NULL)
        return MOLQ_EARG;
    s = calloc(1, sizeof *s);
    if (s == NULL)
        return MOLQ_ENOMEM;
    s->name = molq_strdup(name);
    if (s->name == NULL) {
        free(s);
        return MOLQ_ENOMEM;
    }
    s->structure = MOLQ_ATOM;
    s->sigma = 1;
    s->rotor = MOLQ_ROTOR_CORRECTED;
    *out = s;
    return MOLQ_OK;
}

void molq_spec_free(molq_spec *s)
{
    if (s == NULL)
        return;
    free(s->name);
    free(s->formula);
    free(s->source);
    free(s->vib_wn);
    free(s->vib_deg);
    free(s->el_e);
    free(s->el_g);
    free(s);
}

static molq_status set_text(char **slot, const char *text)
{
    char *d;
    if (text == NULL)
        return MOLQ_EARG;
    d = molq_strdup(text);
    if (d == NULL)
        return MOLQ_ENOMEM;
    free(*slot);
    *slot = d;
    return MOLQ_OK;
}

molq_status molq_spec_set_formula(molq_spec *s, const char *formula)
{
    return s == NULL ? MOLQ_EARG : set_text(&s->formula, formula);
}

molq_status molq_spec_set_source(molq_spec *s, const char *source)
{
    return s == NULL ? MOLQ_EARG : set_text(&s->source, source);
}

molq_status molq_spec_set_molar_mass(molq_spec *s, double kg_per_mol)
{
    if (s == NULL)
        return MOLQ_EARG;
    s->molar_mass = kg_per_mol;
    s->has_molar_mass = 1;
    return MOLQ_OK;
}

molq_status molq_spec_set_structure(molq_spec *s, molq_structure structure)
{
    if (s == NULL)
        return MOLQ_EARG;
    s->structure = (int)structure;
    return MOLQ_OK;
}

molq_status molq_spec_set_symmetry_number(molq_spec *s, int sigma)
{
    if (s == NULL)
        return MOLQ_EARG;
    s->sigma = sigma;
    return MOLQ_OK;
}

molq_status molq_spec_set_rotational_constants(molq_spec *s, const double *cm1,
                                               size_t n)
{
    if (s == NULL || (cm1 == NULL && n > 0) || n > 3)
        return MOLQ_EARG;
    if (n > 0)
        memcpy(s->rot, cm1, n * sizeof *cm1);
    s->nrot = n;
    return MOLQ_OK;
}

molq_status molq_spec_set_rotor(molq_spec *s, molq_rotor rotor)
{
    if (s == NULL)
        return MOLQ_EARG;
    s->rotor = (int)rotor;
    return MOLQ_OK;
}

molq_status molq_spec_set_formation_enthalpy(molq_spec *s, double j_per_mol)
{
    if (s == NULL)
        return MOLQ_EARG;
    s->formation_enthalpy = j_per_mol;
    s->has_formation_enthalpy = 1;
    return MOLQ_OK;
}

/* Append (value, degeneracy) to a pair of growing arrays. */
static molq_status append_pair(double **v, int **g, size_t *n, size_t *cap,
                               size_t limit, double value, int degeneracy)
{
    if (*n >= limit)
        return MOLQ_ELIMIT;
    if (*n == *cap) {
        size_t nc = *cap ? 2 * *cap : 8;
        double *nv = realloc(*v, nc * sizeof **v);
        int *ng;
        if (nv == NULL)
            return MOLQ_ENOMEM;
        *v = nv;
        ng = realloc(*g, nc * sizeof **g);
        if (ng == NULL)
            return MOLQ_ENOMEM;
        *g = ng;
        *cap = nc;
    }
    (*v)[*n] = value;
    (*g)[*n] = degeneracy;
    (*n)++;
    return MOLQ_OK;
}

molq_status molq_spec_add_vibration(molq_spec *s, double wavenumber_cm1,
                                    int degeneracy)
{
    if (s == NULL)
        return MOLQ_EARG;
    return append_pair(&s->vib_wn, &s->vib_deg, &s->nvib, &s->cap_vib,
                       MOLQ_MAX_VIBRATIONS, wavenumber_cm1, degeneracy);
}

molq_status molq_spec_add_electronic_level(molq_spec *s, double energy_cm1,
                                           int degeneracy)
{
    if (s == NULL)
        return MOLQ_EARG;
    return append_pair(&s->el_e, &s->el_g, &s->nel, &s->cap_el,
                       MOLQ_MAX_LEVELS, energy_cm1, degeneracy);
}
