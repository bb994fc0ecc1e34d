/* The public molq_spec_* functions: a mutable species description.  Setters
 * store; molq_spec_validate judges. */
#include <stdio.h>
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
    free(s->states);
    free(s->torsions);
    free(s->vterms);
    free(s->atoms);
    free(s);
}

static int copy_array(void **dst, const void *src, size_t bytes)
{
    if (bytes == 0 || src == NULL) {
        *dst = NULL;
        return 1;
    }
    *dst = malloc(bytes);
    if (*dst != NULL)
        memcpy(*dst, src, bytes);
    return *dst != NULL;
}

molq_spec *molq_spec_clone(const molq_spec *s)
{
    molq_spec *c = malloc(sizeof *c);
    int ok;
    if (c == NULL)
        return NULL;
    *c = *s;
    c->name = c->formula = c->source = NULL;
    c->vib_wn = NULL;
    c->vib_deg = NULL;
    c->el_e = NULL;
    c->el_g = NULL;
    c->states = NULL;
    c->torsions = NULL;
    c->vterms = NULL;
    c->atoms = NULL;
    c->cap_vib = c->nvib;
    c->cap_el = c->nel;
    ok = (c->name = molq_strdup(s->name)) != NULL &&
         (s->formula == NULL || (c->formula = molq_strdup(s->formula))) &&
         (s->source == NULL || (c->source = molq_strdup(s->source))) &&
         copy_array((void **)&c->vib_wn, s->vib_wn, s->nvib * sizeof(double)) &&
         copy_array((void **)&c->vib_deg, s->vib_deg, s->nvib * sizeof(int)) &&
         copy_array((void **)&c->el_e, s->el_e, s->nel * sizeof(double)) &&
         copy_array((void **)&c->el_g, s->el_g, s->nel * sizeof(int)) &&
         copy_array((void **)&c->states, s->states,
                    s->nstates * sizeof(molq_spec_state)) &&
         copy_array((void **)&c->torsions, s->torsions,
                    s->ntorsions * sizeof(molq_spec_torsion)) &&
         copy_array((void **)&c->vterms, s->vterms,
                    s->nvterms * sizeof(molq_spec_vibterm)) &&
         copy_array((void **)&c->atoms, s->atoms,
                    s->natoms * sizeof(molq_spec_atom));
    if (!ok) {
        molq_spec_free(c);
        return NULL;
    }
    return c;
}

void molq_spec_rovib_states(const molq_spec *s, molq_rovib_state *out)
{
    size_t i;
    for (i = 0; i < s->nstates; i++) {
        const molq_spec_state *d = &s->states[i];
        out[i].te = d->te;
        out[i].g = d->g;
        out[i].w_even = d->has_weights ? d->w_even : 1.0 / s->sigma;
        out[i].w_odd = d->has_weights ? d->w_odd : 1.0 / s->sigma;
        memcpy(out[i].y, d->y, sizeof d->y);
        out[i].pi = d->has_spin_orbit;
        out[i].a = d->has_spin_orbit ? d->spin_orbit : 0.0;
    }
}

molq_model molq_spec_default_model(const molq_spec *s)
{
    if (s->has_model)
        return (molq_model)s->model;
    return (s->nstates > 0 || s->ntorsions > 0 || s->nvterms > 0 ||
            s->has_top_w || s->has_spin_group)
               ? MOLQ_MODEL_LEVELS
               : MOLQ_MODEL_RRHO;
}

molq_status molq_spec_set_model(molq_spec *s, molq_model model)
{
    if (s == NULL)
        return MOLQ_EARG;
    s->model = (int)model;
    s->has_model = 1;
    return MOLQ_OK;
}

molq_status molq_spec_add_diatomic_state(molq_spec *s, double te_cm1,
                                         int degeneracy, size_t *index)
{
    molq_spec_state *ns;
    if (s == NULL)
        return MOLQ_EARG;
    if (s->nstates >= MOLQ_MAX_STATES)
        return MOLQ_ELIMIT;
    ns = realloc(s->states, (s->nstates + 1) * sizeof *ns);
    if (ns == NULL)
        return MOLQ_ENOMEM;
    s->states = ns;
    memset(&ns[s->nstates], 0, sizeof *ns);
    ns[s->nstates].te = te_cm1;
    ns[s->nstates].g = degeneracy;
    if (index != NULL)
        *index = s->nstates;
    s->nstates++;
    return MOLQ_OK;
}

molq_status molq_spec_set_dunham(molq_spec *s, size_t state, unsigned k,
                                 unsigned l, double y_cm1)
{
    if (s == NULL || state >= s->nstates || k >= MOLQ_DUNHAM_K ||
        l >= MOLQ_DUNHAM_L)
        return MOLQ_EARG;
    s->states[state].y[k][l] = y_cm1;
    return MOLQ_OK;
}

molq_status molq_spec_set_rotational_weights(molq_spec *s, size_t state,
                                             double even, double odd)
{
    if (s == NULL || state >= s->nstates)
        return MOLQ_EARG;
    s->states[state].w_even = even;
    s->states[state].w_odd = odd;
    s->states[state].has_weights = 1;
    return MOLQ_OK;
}

molq_status molq_spec_set_dissociation_energy(molq_spec *s, double d0_cm1)
{
    if (s == NULL)
        return MOLQ_EARG;
    s->d0 = d0_cm1;
    s->has_d0 = 1;
    return MOLQ_OK;
}

molq_status molq_spec_set_spin_isomers_frozen(molq_spec *s,
                                              double odd_fraction)
{
    if (s == NULL)
        return MOLQ_EARG;
    s->spin_frozen = 1;
    s->odd_fraction = odd_fraction;
    return MOLQ_OK;
}

molq_status molq_spec_set_spin_orbit(molq_spec *s, size_t state,
                                     double a_cm1)
{
    if (s == NULL || state >= s->nstates)
        return MOLQ_EARG;
    s->states[state].spin_orbit = a_cm1;
    s->states[state].has_spin_orbit = 1;
    return MOLQ_OK;
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
    s->mass_in_g = 0;
    return MOLQ_OK;
}

molq_status molq_spec_set_molar_mass_g_per_mol(molq_spec *s, double g_per_mol)
{
    if (s == NULL)
        return MOLQ_EARG;
    s->molar_mass = g_per_mol * 1e-3;
    s->molar_mass_g = g_per_mol;
    s->has_molar_mass = 1;
    s->mass_in_g = 1;
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

molq_status molq_spec_set_validated_range(molq_spec *s, double t_lo,
                                          double t_hi)
{
    if (s == NULL)
        return MOLQ_EARG;
    s->range_lo = t_lo;
    s->range_hi = t_hi;
    s->has_range = 1;
    return MOLQ_OK;
}

molq_status molq_spec_add_geometry_atom(molq_spec *s, const char *element,
                                        double x, double y, double z)
{
    molq_spec_atom *na;
    if (s == NULL || element == NULL)
        return MOLQ_EARG;
    if (s->natoms >= MOLQ_MAX_GEOMETRY_ATOMS)
        return MOLQ_ELIMIT;
    na = realloc(s->atoms, (s->natoms + 1) * sizeof *na);
    if (na == NULL)
        return MOLQ_ENOMEM;
    s->atoms = na;
    na += s->natoms;
    /* kept as given, cut to 7 bytes: no element symbol is that long, so
     * validation refuses a longer text by name */
    snprintf(na->element, sizeof na->element, "%s", element);
    na->xyz[0] = x;
    na->xyz[1] = y;
    na->xyz[2] = z;
    s->natoms++;
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

molq_status molq_spec_add_torsion(molq_spec *s, double f_cm1, int sigma,
                                  int replaces_vibration, size_t *index)
{
    molq_spec_torsion *nt;
    if (s == NULL)
        return MOLQ_EARG;
    if (s->ntorsions >= MOLQ_MAX_TORSIONS)
        return MOLQ_ELIMIT;
    nt = realloc(s->torsions, (s->ntorsions + 1) * sizeof *nt);
    if (nt == NULL)
        return MOLQ_ENOMEM;
    s->torsions = nt;
    memset(&nt[s->ntorsions], 0, sizeof *nt);
    nt[s->ntorsions].f = f_cm1;
    nt[s->ntorsions].sigma = sigma;
    nt[s->ntorsions].replaces = replaces_vibration;
    if (index != NULL)
        *index = s->ntorsions;
    s->ntorsions++;
    return MOLQ_OK;
}

molq_status molq_spec_add_torsion_term(molq_spec *s, size_t torsion, int n,
                                       double v_cm1)
{
    molq_spec_torsion *t;
    if (s == NULL || torsion >= s->ntorsions)
        return MOLQ_EARG;
    t = &s->torsions[torsion];
    if (t->nterms >= MOLQ_MAX_TORSION_TERMS)
        return MOLQ_ELIMIT;
    t->terms[t->nterms].n = n;
    t->terms[t->nterms].v = v_cm1;
    t->nterms++;
    return MOLQ_OK;
}

static molq_status add_vterm(molq_spec *s, int kind, size_t i, size_t j,
                             const double *v, size_t n)
{
    molq_spec_vibterm *nv;
    size_t k;
    if (s == NULL || n > 3 || (n > 0 && v == NULL))
        return MOLQ_EARG;
    if (s->nvterms >= 4 * MOLQ_MAX_ANHARM_MODES * MOLQ_MAX_ANHARM_MODES)
        return MOLQ_ELIMIT;
    nv = realloc(s->vterms, (s->nvterms + 1) * sizeof *nv);
    if (nv == NULL)
        return MOLQ_ENOMEM;
    s->vterms = nv;
    nv += s->nvterms++;
    nv->kind = kind;
    nv->i = i;
    nv->j = j;
    nv->n = n;
    for (k = 0; k < 3; k++)
        nv->v[k] = k < n ? v[k] : 0.0;
    return MOLQ_OK;
}

molq_status molq_spec_set_harmonic_wavenumber(molq_spec *s, size_t vib,
                                              double w_cm1)
{
    return add_vterm(s, MOLQ_VT_HARMONIC, vib, vib, &w_cm1, 1);
}

molq_status molq_spec_add_anharmonicity(molq_spec *s, size_t i, size_t j,
                                        double x_cm1)
{
    return add_vterm(s, MOLQ_VT_X, i < j ? i : j, i < j ? j : i, &x_cm1, 1);
}

molq_status molq_spec_add_l_constant(molq_spec *s, size_t i, double g_cm1)
{
    return add_vterm(s, MOLQ_VT_G, i, i, &g_cm1, 1);
}

molq_status molq_spec_add_rotation_vibration(molq_spec *s, size_t i,
                                             const double *alpha_cm1, size_t n)
{
    if (n == 0)
        return MOLQ_EARG;
    return add_vterm(s, MOLQ_VT_ALPHA, i, i, alpha_cm1, n);
}

int molq_spec_replaced(const molq_spec *s, size_t i)
{
    size_t k;
    for (k = 0; k < s->ntorsions; k++)
        if (s->torsions[k].replaces == (int)i)
            return 1;
    return 0;
}

molq_status molq_spec_anharm_input(const molq_spec *s, molq_anharm_input *out)
{
    /* one entry per vibration: at most MOLQ_MAX_ANHARM_MODES kept ones and
     * one replaced by each torsion */
    size_t map[MOLQ_MAX_ANHARM_MODES + MOLQ_MAX_TORSIONS], i, j, k, n = 0;
    int have_w[MOLQ_MAX_ANHARM_MODES] = {0};
    memset(out, 0, sizeof *out);
    if (s->nvib > sizeof map / sizeof map[0])
        return MOLQ_ELIMIT;
    for (i = 0; i < s->nvib; i++) {
        map[i] = molq_spec_replaced(s, i) ? (size_t)-1 : n;
        if (map[i] == (size_t)-1)
            continue;
        if (n >= MOLQ_MAX_ANHARM_MODES)
            return MOLQ_ELIMIT;
        out->d[n] = s->vib_deg[i];
        out->w[n] = s->vib_wn[i]; /* fundamental until replaced */
        n++;
    }
    out->n = n;
    out->nrot = 0;
    out->d0 = s->d0;
    for (k = 0; k < s->nvterms; k++) {
        const molq_spec_vibterm *t = &s->vterms[k];
        size_t a, b;
        if (t->i >= s->nvib || t->j >= s->nvib)
            return MOLQ_EVALUE; /* validation names the field */
        a = map[t->i];
        b = map[t->j];
        if (a == (size_t)-1 || b == (size_t)-1)
            continue;
        switch (t->kind) {
        case MOLQ_VT_HARMONIC:
            out->w[a] = t->v[0];
            have_w[a] = 1;
            break;
        case MOLQ_VT_X:
            out->x[a][b] = t->v[0];
            break;
        case MOLQ_VT_G:
            out->g[a] = t->v[0];
            break;
        case MOLQ_VT_ALPHA:
            for (j = 0; j < t->n; j++)
                out->alpha[a][j] = t->v[j];
            out->nrot = t->n;
            break;
        }
    }
    for (k = 0; k < out->nrot; k++)
        out->b0[k] = s->rot[k];
    /* harmonic wavenumbers not given: from the fundamentals,
     * nu_i = w_i + (1 + d_i) x_ii + 1/2 sum_{j != i} d_j x_ij (+ g_ii) */
    for (i = 0; i < n; i++) {
        double shift;
        if (have_w[i])
            continue;
        shift = (1.0 + out->d[i]) * out->x[i][i];
        for (j = 0; j < n; j++)
            if (j != i)
                shift += 0.5 * out->d[j] * (j < i ? out->x[j][i] : out->x[i][j]);
        if (out->d[i] == 2)
            shift += out->g[i];
        out->w[i] -= shift;
    }
    return MOLQ_OK;
}

molq_status molq_spec_set_top_weights(molq_spec *s, double ee, double eo,
                                      double oe, double oo)
{
    if (s == NULL)
        return MOLQ_EARG;
    s->top_w[0] = ee;
    s->top_w[1] = eo;
    s->top_w[2] = oe;
    s->top_w[3] = oo;
    s->has_top_w = 1;
    return MOLQ_OK;
}

molq_status molq_spec_set_top_spin_group(molq_spec *s, molq_spin_group group,
                                         double nuclear_spin)
{
    if (s == NULL)
        return MOLQ_EARG;
    s->spin_group = (int)group;
    s->has_spin_group = 1;
    s->nuclear_spin = nuclear_spin;
    return MOLQ_OK;
}
