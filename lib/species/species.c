#include "species/species.h"

#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "core/constants.h"
#include "core/errbuf.h"

static char *dup_or_empty(const char *s)
{
    return molq_strdup(s != NULL ? s : "");
}


/* RRHO inputs: explicit ones from the spec, or derived from the diatomic
 * states (B0 and G(1) - G(0) of the ground state; each state's v = 0 level
 * as an electronic level whose degeneracy folds in its spin weights; a 2Pi
 * state gives two, the lowest v = 0 level of each of its ladders, with
 * half its degeneracy each), measured from the ground state's lowest. */
typedef struct rrho_inputs {
    double rot[3];
    size_t nrot;
    size_t nvib, nel;
} rrho_inputs;

/* Is vibration i replaced by a torsion (in the levels model)? */
static int replaced(const molq_spec *spec, size_t i, int levels)
{
    return levels && molq_spec_replaced(spec, i);
}

/* Each input comes from the spec when given there, else from the diatomic
 * states when there are any: the same rule for sizing (here) and filling
 * (fill_rrho_arrays), so the two cannot disagree. */
static int derive_rot(const molq_spec *s) { return s->nrot == 0 && s->nstates > 0; }
static int derive_vib(const molq_spec *s) { return s->nvib == 0 && s->nstates > 0; }
static int derive_el(const molq_spec *s) { return s->nel == 0 && s->nstates > 0; }

static void rrho_inputs_of(const molq_spec *spec, int levels,
                           rrho_inputs *r)
{
    size_t i;
    r->nrot = spec->nrot;
    for (i = 0; i < spec->nrot; i++)
        r->rot[i] = spec->rot[i];
    if (derive_rot(spec)) {
        r->rot[0] = molq_dunham_column(spec->states[0].y, 1, 0.5);
        r->nrot = 1;
    }
    r->nvib = 0;
    for (i = 0; i < spec->nvib; i++)
        r->nvib += !replaced(spec, i, levels);
    if (derive_vib(spec))
        r->nvib = 1;
    r->nel = spec->nel > 0 ? spec->nel : derive_el(spec) ? spec->nstates : 1;
    if (spec->nel == 0 && derive_el(spec))
        for (i = 0; i < spec->nstates; i++)
            r->nel += spec->states[i].has_spin_orbit != 0;
}

static void fill_rrho_arrays(const molq_spec *spec, int levels, double *vt,
                             double *vg, double *et, double *eg)
{
    size_t i, k = 0;
    const molq_spec_state *x = spec->states;
    if (spec->nvib > 0) {
        for (i = 0; i < spec->nvib; i++) {
            if (replaced(spec, i, levels))
                continue;
            vt[k] = MOLQ_C2_CM_K * spec->vib_wn[i];
            vg[k++] = (double)spec->vib_deg[i];
        }
    } else if (derive_vib(spec)) {
        vt[0] = MOLQ_C2_CM_K * (molq_dunham_column(x->y, 0, 1.5) -
                                molq_dunham_column(x->y, 0, 0.5));
        vg[0] = 1.0;
    }
    if (spec->nel > 0) {
        for (i = 0; i < spec->nel; i++) {
            et[i] = MOLQ_C2_CM_K * spec->el_e[i];
            eg[i] = (double)spec->el_g[i];
        }
    } else if (derive_el(spec)) {
        molq_rovib_state st[MOLQ_MAX_STATES];
        double lo[2], zero;
        size_t e = 0;
        molq_spec_rovib_states(spec, st);
        molq_rovib_ladder_minima(&st[0], lo);
        zero = lo[0] < lo[1] ? lo[0] : lo[1];
        for (i = 0; i < spec->nstates; i++) {
            double g = st[i].g * spec->sigma * 0.5 *
                       (st[i].w_even + st[i].w_odd);
            molq_rovib_ladder_minima(&st[i], lo);
            et[e] = MOLQ_C2_CM_K * (lo[0] - zero);
            eg[e++] = st[i].pi ? 0.5 * g : g;
            if (st[i].pi) { /* the other ladder: the other Omega */
                et[e] = MOLQ_C2_CM_K * (lo[1] - zero);
                eg[e++] = 0.5 * g;
            }
        }
    } else {
        et[0] = 0.0;
        eg[0] = 1.0;
    }
}

/* Rigid rotor, harmonic vibrations and electronic levels; with `levels`
 * (the polyatomic levels model) the hindered rotors replace the vibrations
 * they name and anharmonic data turn the vibrations into a level sum. */
static molq_status build_rrho(molq_species *sp, const molq_spec *spec,
                              int levels, char *err, size_t errlen)
{
    rrho_inputs r;
    double *vt, *vg, *et, *eg;
    size_t k;
    rrho_inputs_of(spec, levels, &r);
    if (spec->structure != MOLQ_ATOM && r.nrot == 0) {
        molq_errf(err, errlen, "species '%s': field 'rotational_constants': "
                  "missing, needed by the rrho model", spec->name);
        return MOLQ_EVALUE;
    }
    sp->arrays = malloc(sizeof(double) * (2 * r.nvib + 2 * r.nel));
    if (sp->arrays == NULL)
        return MOLQ_ENOMEM;
    vt = sp->arrays;
    vg = vt + r.nvib;
    et = vg + r.nvib;
    eg = et + r.nel;
    fill_rrho_arrays(spec, levels, vt, vg, et, eg);
    if (levels && spec->structure == MOLQ_NONLINEAR &&
        spec->rotor == MOLQ_ROTOR_CORRECTED && molq_asymtop_fits(r.rot)) {
        /* the exact top, with spin weights: valid at every T */
        molq_top_spin spin;
        double d = 1.0 / spec->sigma;
        int k;
        spin.kind = spec->spin_group == MOLQ_SPIN_GROUP_C3V ? MOLQ_TOP_SPIN_C3
                    : spec->spin_group == MOLQ_SPIN_GROUP_TD
                        ? MOLQ_TOP_SPIN_TETRA
                        : MOLQ_TOP_SPIN_PARITY;
        spin.n = 2.0 * spec->nuclear_spin + 1.0;
        for (k = 0; k < 4; k++)
            spin.w[k] = spec->has_top_w ? spec->top_w[k] : d;
        if (molq_mode_asymtop_init(&sp->modes[sp->nmodes], r.rot, spec->sigma,
                                   &spin) != 0)
            return MOLQ_ENOMEM;
        sp->nmodes++;
    } else if (spec->structure != MOLQ_ATOM) {
        molq_mode_rotation_init(&sp->modes[sp->nmodes++],
                                spec->structure == MOLQ_LINEAR,
                                spec->rotor == MOLQ_ROTOR_CLASSICAL,
                                spec->sigma, r.rot, &sp->t_min);
    }
    if (levels && spec->nvterms > 0) {
        molq_anharm_input in;
        if (molq_spec_anharm_input(spec, &in) != MOLQ_OK) {
            molq_errf(err, errlen, "species '%s': field 'anharmonicity': "
                      "too many vibrations", spec->name);
            return MOLQ_ELIMIT; /* refused by validation first */
        }
        if (molq_mode_anharmonic_init(&sp->modes[sp->nmodes], &in) != 0)
            return MOLQ_ENOMEM;
        sp->nmodes++;
    } else if (r.nvib > 0) {
        molq_mode_vibration_init(&sp->modes[sp->nmodes++], r.nvib, vt, vg);
    }
    molq_mode_electronic_init(&sp->modes[sp->nmodes++], r.nel, et, eg);
    for (k = 0; levels && k < spec->ntorsions; k++) {
        const molq_spec_torsion *t = &spec->torsions[k];
        if (molq_mode_torsion_init(&sp->modes[sp->nmodes], t->f, t->terms,
                                   t->nterms, t->sigma) != 0)
            return MOLQ_ENOMEM;
        sp->nmodes++;
    }
    return MOLQ_OK;
}

static molq_status build_levels(molq_species *sp, const molq_spec *spec,
                                char *err, size_t errlen)
{
    molq_rovib_state st[MOLQ_MAX_STATES];
    if (spec->nstates == 0 && (spec->ntorsions > 0 || spec->nvterms > 0 ||
                               spec->structure == MOLQ_NONLINEAR))
        return build_rrho(sp, spec, 1, err, errlen);
    if (spec->nstates == 0) {
        molq_errf(err, errlen, "species '%s': field 'diatomic_states': "
                  "missing, needed by the levels model (or 'anharmonicity' or "
                  "'torsions' for a polyatomic)", spec->name);
        return MOLQ_EVALUE;
    }
    molq_spec_rovib_states(spec, st);
    if (molq_mode_rovibronic_init(&sp->modes[sp->nmodes], st, spec->nstates,
                                  spec->d0, spec->spin_frozen,
                                  spec->odd_fraction) != 0)
        return MOLQ_ENOMEM;
    sp->nmodes++;
    return MOLQ_OK;
}

/* Degeneracy of the lowest electronic level (for the Boltzmann-gas limit):
 * the levels at the lowest energy of a level list, the ground diatomic
 * state (half of it for a 2Pi state, whose two Omega ladders split), or 1. */
static double ground_degeneracy(const molq_spec *spec)
{
    size_t i;
    double lo, g = 0.0;
    if (spec->nel > 0) {
        lo = spec->el_e[0];
        for (i = 1; i < spec->nel; i++)
            if (spec->el_e[i] < lo)
                lo = spec->el_e[i];
        for (i = 0; i < spec->nel; i++)
            if (spec->el_e[i] == lo)
                g += spec->el_g[i];
        return g;
    }
    if (spec->nstates > 0)
        return spec->states[0].has_spin_orbit ? 0.5 * spec->states[0].g
                                              : spec->states[0].g;
    return 1.0;
}

molq_status molq_species_build(const molq_spec *spec, double molar_mass,
                               molq_model model, molq_species **out,
                               char *err, size_t errlen)
{
    molq_species *sp = calloc(1, sizeof *sp);
    molq_status st;
    if (sp == NULL)
        return MOLQ_ENOMEM;
    sp->name = molq_strdup(spec->name);
    sp->formula = dup_or_empty(spec->formula);
    sp->source = dup_or_empty(spec->source);
    sp->spec = molq_spec_clone(spec);
    if (!sp->name || !sp->formula || !sp->source || !sp->spec) {
        molq_species_destroy(sp);
        return MOLQ_ENOMEM;
    }
    sp->molar_mass = molar_mass;
    /* report a g/mol mass exactly as given (39.948, not 39.94800000000001) */
    sp->molar_mass_g = (spec->has_molar_mass && spec->mass_in_g &&
                        spec->molar_mass == molar_mass)
                           ? spec->molar_mass_g
                           : molar_mass * 1e3;
    if (spec->formula == NULL ||
        molq_formula_parse(spec->formula, &sp->comp, NULL, 0) != MOLQ_OK)
        memset(&sp->comp, 0, sizeof sp->comp);
    sp->has_range = spec->has_range;
    sp->range_lo = spec->range_lo;
    sp->range_hi = spec->range_hi;
    sp->structure = (molq_structure)spec->structure;
    sp->rotor = spec->structure == MOLQ_ATOM ? MOLQ_ROTOR_CORRECTED
                                             : (molq_rotor)spec->rotor;
    sp->model = model;
    sp->has_formation_enthalpy = spec->has_formation_enthalpy;
    sp->formation_enthalpy =
        spec->has_formation_enthalpy ? spec->formation_enthalpy : 0.0;

    molq_mode_translation_init(&sp->modes[sp->nmodes++], molar_mass);
    st = model == MOLQ_MODEL_LEVELS ? build_levels(sp, spec, err, errlen)
                                    : build_rrho(sp, spec, 0, err, errlen);
    /* below the Boltzmann limit at the standard pressure the results
     * would be those of no real gas (see molq_species_t_min); the internal
     * modes alone keep the models' own limit (molq_eval_mode) */
    sp->t_min_internal = sp->t_min;
    sp->t_min = fmax(sp->t_min,
                     molq_translation_boltzmann_t(
                         molar_mass, ground_degeneracy(spec), MOLQ_P_STANDARD));
    if (st != MOLQ_OK) {
        if (st == MOLQ_ENOMEM)
            molq_errf(err, errlen, "species '%s': out of memory", spec->name);
        molq_species_destroy(sp);
        return st;
    }
    *out = sp;
    return MOLQ_OK;
}

void molq_species_destroy(molq_species *sp)
{
    size_t i;
    if (sp == NULL)
        return;
    for (i = 0; i < sp->nmodes; i++) {
        free(sp->modes[i].owned);
        free(sp->modes[i].owned2);
    }
    molq_spec_free(sp->spec);
    molq_warn_free(&sp->warnings);
    free(sp->name);
    free(sp->formula);
    free(sp->source);
    free(sp->arrays);
    free(sp);
}

size_t molq_species_level_count(const molq_species *sp)
{
    size_t i, n = 0;
    for (i = 0; i < sp->nmodes; i++)
        n += sp->modes[i].raw_levels;
    return n;
}
