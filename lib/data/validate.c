/* Validation of a species description.  Every message has the form
 *   species 'NAME': field 'KEY': what is wrong (got VALUE)
 * using the key names of the species file, so a user can find the line. */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "core/constants.h"
#include "core/errbuf.h"
#include "data/spec.h"

#define FAIL(code, ...)                                                        \
    do {                                                                       \
        molq_errf(err, errlen, __VA_ARGS__);                                   \
        return (code);                                                         \
    } while (0)

/* Largest spin-orbit constant accepted, cm^-1 (above those of diatomics
 * of the heaviest elements, a few 1e3 to 1e4 cm^-1). */
#define MAX_SPIN_ORBIT 1e5

static const size_t rot_count[3] = {0, 1, 3};
static const char *const structure_name[3] = {"atom", "linear", "nonlinear"};

/* Level sums need the dissociation energy that bounds their ladders. */
static molq_status check_d0(const molq_spec *s, char *err, size_t errlen)
{
    if (!s->has_d0 || !isfinite(s->d0) || s->d0 <= 0.0)
        FAIL(s->has_d0 ? MOLQ_EVALUE : MOLQ_EKEY, "species '%s': field "
             "'dissociation_energy': %s (cm^-1 from the ground level, > 0; "
             "it bounds every level sum)", s->name,
             s->has_d0 ? "must be a finite number > 0" : "missing");
    return MOLQ_OK;
}

/* Names of the Dunham entries in the usual notation, for messages. */
static const char *dunham_name(int k, int l)
{
    static const char *const names[MOLQ_DUNHAM_K][MOLQ_DUNHAM_L] = {
        {"Y00", "Be", "De", "He"},          {"we", "alpha_e", "beta_e", "Y13"},
        {"wexe", "gamma_e", "Y22", "Y23"},  {"weye", "Y31", "Y32", "Y33"},
        {"weze", "Y41", "Y42", "Y43"},      {"Y50", "Y51", "Y52", "Y53"}};
    return names[k][l];
}

static molq_status validate_states(const molq_spec *s, char *err,
                                   size_t errlen)
{
    const char *nm = s->name;
    molq_rovib_state st[MOLQ_MAX_STATES];
    size_t i, empty, count;
    int k, l, ground = 0;
    molq_status rc;
    if (s->structure != MOLQ_LINEAR)
        FAIL(MOLQ_EVALUE, "species '%s': field 'diatomic_states': level sums "
             "are for diatomics; the structure must be linear", nm);
    if ((rc = check_d0(s, err, errlen)) != MOLQ_OK)
        return rc;
    if (s->spin_frozen && !(s->odd_fraction > 0.0 && s->odd_fraction < 1.0))
        FAIL(MOLQ_EVALUE, "species '%s': field 'odd_fraction': must lie "
             "strictly between 0 and 1 (got %g)", nm, s->odd_fraction);
    for (i = 0; i < s->nstates; i++) {
        const molq_spec_state *d = &s->states[i];
        if (!isfinite(d->te) || d->te < 0.0)
            FAIL(MOLQ_EVALUE, "species '%s': field 'diatomic_states[%zu].Te': "
                 "must be a finite number >= 0 cm^-1 (got %g)", nm, i, d->te);
        if (d->te == 0.0)
            ground = 1;
        if (d->g < 1 || d->g > MOLQ_MAX_DEGENERACY)
            FAIL(MOLQ_EVALUE, "species '%s': field 'diatomic_states[%zu]."
                 "degeneracy': must be an integer from 1 to %d (got %d)", nm, i,
                 MOLQ_MAX_DEGENERACY, d->g);
        for (k = 0; k < MOLQ_DUNHAM_K; k++)
            for (l = 0; l < MOLQ_DUNHAM_L; l++)
                if (!isfinite(d->y[k][l]))
                    FAIL(MOLQ_EVALUE, "species '%s': field 'diatomic_states"
                         "[%zu].%s': must be finite", nm, i, dunham_name(k, l));
        if (!(d->y[1][0] > 0.0))
            FAIL(MOLQ_EVALUE, "species '%s': field 'diatomic_states[%zu].we': "
                 "must be > 0 cm^-1 (got %g)", nm, i, d->y[1][0]);
        if (!(d->y[0][1] > 0.0))
            FAIL(MOLQ_EVALUE, "species '%s': field 'diatomic_states[%zu].Be': "
                 "must be > 0 cm^-1 (got %g)", nm, i, d->y[0][1]);
        if (d->has_weights &&
            (!isfinite(d->w_even) || !isfinite(d->w_odd) || d->w_even < 0.0 ||
             d->w_odd < 0.0 || d->w_even + d->w_odd <= 0.0))
            FAIL(MOLQ_EVALUE, "species '%s': field 'diatomic_states[%zu]."
                 "rotational_weights': must be two finite numbers >= 0, not "
                 "both 0 (got %g, %g)", nm, i, d->w_even, d->w_odd);
        if (d->has_re && !(isfinite(d->re) && d->re > 0.0 && d->re <= 100.0))
            FAIL(MOLQ_EVALUE, "species '%s': field 'diatomic_states[%zu].re': "
                 "must be a finite number > 0 and at most 100 Angstrom (got "
                 "%g)", nm, i, d->re);
        if (d->has_spin_orbit) {
            if (!isfinite(d->spin_orbit) || fabs(d->spin_orbit) > MAX_SPIN_ORBIT)
                FAIL(MOLQ_EVALUE, "species '%s': field 'diatomic_states[%zu]."
                     "spin_orbit': must be a finite number of at most %g "
                     "cm^-1 in size (got %g)", nm, i, MAX_SPIN_ORBIT,
                     d->spin_orbit);
            if (d->g % 2 != 0)
                FAIL(MOLQ_EVALUE, "species '%s': field 'diatomic_states[%zu]."
                     "degeneracy': a 2Pi state (with 'spin_orbit') counts its "
                     "two spin components, so its degeneracy must be even (4 "
                     "for spin x Lambda doubling; got %d)", nm, i, d->g);
            if (d->has_weights && d->w_even != d->w_odd)
                FAIL(MOLQ_EVALUE, "species '%s': field 'diatomic_states[%zu]."
                     "spin_orbit': a 2Pi state has half-integer J, for which "
                     "even/odd 'rotational_weights' are not defined; give "
                     "equal weights or none (got %g, %g)", nm, i, d->w_even,
                     d->w_odd);
        }
    }
    molq_spec_rovib_states(s, st);
    if (molq_rovib_has_isomers(st))
        for (i = 0; i < s->nstates; i++)
            if (s->states[i].has_spin_orbit)
                FAIL(MOLQ_EVALUE, "species '%s': field 'diatomic_states[%zu]."
                     "spin_orbit': 2Pi states are supported only without "
                     "nuclear-spin modifications, and the ground state's "
                     "'rotational_weights' make two", nm, i);
    if (!ground || s->states[0].te != 0.0)
        FAIL(MOLQ_EVALUE, "species '%s': field 'diatomic_states[0].Te': the "
             "first state is the ground state, Te = 0", nm);
    if (s->spin_frozen && !molq_rovib_has_isomers(st))
        FAIL(MOLQ_EVALUE, "species '%s': field 'spin_isomers': \"frozen\" "
             "needs two nuclear-spin modifications, i.e. ground-state "
             "rotational_weights that are both > 0 and differ (as for H2 or "
             "N2); this species has only one", nm);
    count = molq_rovib_count(st, s->nstates, s->d0, MOLQ_MAX_ROVIB_LEVELS,
                             &empty);
    if (count == (size_t)-1)
        FAIL(MOLQ_ELIMIT, "species '%s': field 'diatomic_states': more than %d "
             "bound levels below 'dissociation_energy' (%g cm^-1); check the "
             "constants: a ladder that does not turn over, or a dissociation "
             "energy far too high", nm, MOLQ_MAX_ROVIB_LEVELS, s->d0);
    if (empty < s->nstates)
        FAIL(MOLQ_EVALUE, "species '%s': field 'diatomic_states[%zu]': no "
             "level of this state lies below 'dissociation_energy' (%g "
             "cm^-1)", nm, empty, s->d0);
    return MOLQ_OK;
}

static molq_status validate_anharmonic(const molq_spec *s, char *err,
                                       size_t errlen)
{
    static const char *const what[] = {"vibrations[%zu].harmonic",
                                       "anharmonicity.x", "anharmonicity.g",
                                       "anharmonicity.alpha"};
    const char *nm = s->name;
    molq_anharm_input in;
    size_t k, i, count, kept = 0;
    molq_status rc;
    if (s->structure == MOLQ_ATOM)
        FAIL(MOLQ_EVALUE, "species '%s': field 'anharmonicity': an atom has "
             "no vibrations", nm);
    if ((rc = check_d0(s, err, errlen)) != MOLQ_OK)
        return rc;
    for (i = 0; i < s->nvib; i++) {
        if (molq_spec_replaced(s, i))
            continue;
        kept++;
        if (s->vib_deg[i] > 3)
            FAIL(MOLQ_EVALUE, "species '%s': field 'vibrations[%zu]."
                 "degeneracy': the anharmonic model handles degeneracy 1, 2 "
                 "or 3 (got %d)", nm, i, s->vib_deg[i]);
    }
    if (kept > MOLQ_MAX_ANHARM_MODES)
        FAIL(MOLQ_ELIMIT, "species '%s': field 'anharmonicity': at most %d "
             "vibrations in the anharmonic model (got %zu)", nm,
             MOLQ_MAX_ANHARM_MODES, kept);
    for (k = 0; k < s->nvterms; k++) {
        const molq_spec_vibterm *t = &s->vterms[k];
        char field[64];
        size_t j;
        snprintf(field, sizeof field, what[t->kind], t->i);
        if (t->i >= s->nvib || t->j >= s->nvib)
            FAIL(MOLQ_EVALUE, "species '%s': field '%s': mode index %zu is "
                 "not one of the %zu vibrations", nm, field,
                 t->i >= s->nvib ? t->i : t->j, s->nvib);
        if (molq_spec_replaced(s, t->i) || molq_spec_replaced(s, t->j))
            FAIL(MOLQ_EVALUE, "species '%s': field '%s': refers to a "
                 "vibration replaced by a torsion", nm, field);
        for (j = 0; j < t->n; j++)
            if (!isfinite(t->v[j]))
                FAIL(MOLQ_EVALUE, "species '%s': field '%s': must be finite",
                     nm, field);
        if (t->kind == MOLQ_VT_HARMONIC && !(t->v[0] > 0.0))
            FAIL(MOLQ_EVALUE, "species '%s': field '%s': must be > 0 cm^-1 "
                 "(got %g)", nm, field, t->v[0]);
        if (t->kind == MOLQ_VT_G && s->vib_deg[t->i] != 2)
            FAIL(MOLQ_EVALUE, "species '%s': field '%s': an l constant needs "
                 "a doubly degenerate mode (vibration %zu has degeneracy %d)",
                 nm, field, t->i, s->vib_deg[t->i]);
        if (t->kind == MOLQ_VT_ALPHA && t->n != s->nrot)
            FAIL(MOLQ_EVALUE, "species '%s': field '%s': needs %zu values, one "
                 "per rotational constant (got %zu)", nm, field, s->nrot,
                 t->n);
    }
    if (molq_spec_anharm_input(s, &in) != MOLQ_OK)
        FAIL(MOLQ_ELIMIT, "species '%s': field 'anharmonicity': at most %d "
             "vibrations in the anharmonic model and %d more replaced by "
             "torsions (got %zu)", nm, MOLQ_MAX_ANHARM_MODES,
             MOLQ_MAX_TORSIONS, s->nvib);
    for (i = 0; i < in.n; i++)
        if (!(in.w[i] > 0.0))
            FAIL(MOLQ_EVALUE, "species '%s': field 'anharmonicity': the "
                 "harmonic wavenumber of mode %zu comes out as %g cm^-1; check "
                 "the fundamental and the x constants", nm, i, in.w[i]);
    count = molq_anharm_count(&in, MOLQ_MAX_ROVIB_LEVELS);
    if (count == (size_t)-1)
        FAIL(MOLQ_ELIMIT, "species '%s': field 'anharmonicity': more than %d "
             "vibrational levels below 'dissociation_energy'; a molecule this "
             "large is better served by the rrho model", nm,
             MOLQ_MAX_ROVIB_LEVELS);
    return MOLQ_OK;
}

static molq_status validate_torsions(const molq_spec *s, char *err,
                                     size_t errlen)
{
    const char *nm = s->name;
    size_t i, j, k;
    if (s->structure != MOLQ_NONLINEAR)
        FAIL(MOLQ_EVALUE, "species '%s': field 'torsions': an internal rotor "
             "needs a nonlinear molecule", nm);
    for (i = 0; i < s->ntorsions; i++) {
        const molq_spec_torsion *t = &s->torsions[i];
        if (!isfinite(t->f) || t->f <= 0.0)
            FAIL(MOLQ_EVALUE, "species '%s': field 'torsions[%zu]."
                 "rotational_constant': must be a finite number > 0 cm^-1 "
                 "(got %g)", nm, i, t->f);
        if (t->f < 1e-3)
            FAIL(MOLQ_EVALUE, "species '%s': field 'torsions[%zu]."
                 "rotational_constant': %g cm^-1 is below the supported 1e-3 "
                 "cm^-1 (a rotor that heavy is classical: use a harmonic "
                 "vibration or a free-rotor limit)", nm, i, t->f);
        if (t->sigma < 1 || t->sigma > MOLQ_MAX_SYMMETRY_NUMBER)
            FAIL(MOLQ_EVALUE, "species '%s': field 'torsions[%zu]."
                 "symmetry_number': must be an integer from 1 to %d (got %d)",
                 nm, i, MOLQ_MAX_SYMMETRY_NUMBER, t->sigma);
        {
            double vsum = 0.0;
            for (k = 0; k < t->nterms; k++)
                vsum += fabs(t->terms[k].v);
            if (vsum / t->f > 4000.0)
                FAIL(MOLQ_EVALUE, "species '%s': field 'torsions[%zu]."
                     "barrier': barrier / rotational constant = %g exceeds "
                     "4000, beyond the supported free-rotor basis; such a "
                     "torsion is a harmonic vibration", nm, i, vsum / t->f);
        }
        for (k = 0; k < t->nterms; k++) {
            if (t->terms[k].n < 1 || t->terms[k].n > MOLQ_MAX_TORSION_N)
                FAIL(MOLQ_EVALUE, "species '%s': field 'torsions[%zu]."
                     "barrier[%zu].n': must be an integer from 1 to 12 (got "
                     "%d)", nm, i, k, t->terms[k].n);
            if (!isfinite(t->terms[k].v) || fabs(t->terms[k].v) > 1e6)
                FAIL(MOLQ_EVALUE, "species '%s': field 'torsions[%zu]."
                     "barrier[%zu].V': must be a finite number of at most "
                     "1e6 cm^-1 in size (got %g)", nm, i, k, t->terms[k].v);
        }
        if (t->replaces < -1 || t->replaces >= (int)s->nvib)
            FAIL(MOLQ_EVALUE, "species '%s': field 'torsions[%zu]."
                 "replaces_vibration': must index one of the %zu vibrations "
                 "(got %d)", nm, i, s->nvib, t->replaces);
        for (j = 0; j < i; j++)
            if (t->replaces >= 0 && s->torsions[j].replaces == t->replaces)
                FAIL(MOLQ_EVALUE, "species '%s': field 'torsions[%zu]."
                     "replaces_vibration': vibration %d is already replaced "
                     "by torsions[%zu]", nm, i, t->replaces, j);
    }
    return MOLQ_OK;
}

/* A geometry's atoms: known elements, finite positions, no two atoms on
 * top of each other, and exactly the formula's composition. */
#define GEOM_MAX_COORD 1000.0 /* Angstrom from the origin */
#define GEOM_MIN_DIST 0.1     /* Angstrom: below any bond (H2 0.74) */
static molq_status validate_geometry(const molq_spec *s, char *err,
                                     size_t errlen)
{
    const char *nm = s->name;
    molq_composition comp;
    char sub[300];
    size_t i, j, k;
    if (s->structure == MOLQ_ATOM)
        FAIL(MOLQ_EVALUE, "species '%s': field 'geometry': an atom has no "
             "geometry (it checks a molecule's rotational constants)", nm);
    if (s->formula == NULL)
        FAIL(MOLQ_EKEY, "species '%s': field 'geometry': needs 'formula' "
             "(the atoms must match its composition)", nm);
    if (molq_formula_parse(s->formula, &comp, sub, sizeof sub) != MOLQ_OK)
        FAIL(MOLQ_EVALUE, "species '%s': field 'geometry': the formula gives "
             "no composition to match: %s", nm, sub);
    for (i = 0; i < s->natoms; i++) {
        const molq_spec_atom *a = &s->atoms[i];
        int in = 0;
        if (!(molq_isotope_mass(a->element) > 0.0))
            FAIL(MOLQ_EVALUE, "species '%s': field 'geometry[%zu].element': "
                 "unknown element '%s'", nm, i, a->element);
        for (k = 0; k < comp.n && !in; k++)
            in = strcmp(comp.el[k].symbol, a->element) == 0;
        if (!in)
            FAIL(MOLQ_EVALUE, "species '%s': field 'geometry[%zu].element': "
                 "'%s' is not in formula '%s'", nm, i, a->element,
                 s->formula);
        for (k = 0; k < 3; k++)
            if (!isfinite(a->xyz[k]) || fabs(a->xyz[k]) > GEOM_MAX_COORD)
                FAIL(MOLQ_EVALUE, "species '%s': field 'geometry[%zu].xyz': "
                     "must be three finite numbers of at most %g Angstrom in "
                     "size (got %g, %g, %g)", nm, i, GEOM_MAX_COORD,
                     a->xyz[0], a->xyz[1], a->xyz[2]);
        for (j = 0; j < i; j++) {
            const double *p = s->atoms[j].xyz;
            double dx = a->xyz[0] - p[0], dy = a->xyz[1] - p[1],
                   dz = a->xyz[2] - p[2];
            double d = sqrt(dx * dx + dy * dy + dz * dz);
            if (d < GEOM_MIN_DIST)
                FAIL(MOLQ_EVALUE, "species '%s': field 'geometry[%zu].xyz': "
                     "%.3g Angstrom from geometry[%zu]; atoms must be at "
                     "least %g Angstrom apart", nm, i, d, j, GEOM_MIN_DIST);
        }
    }
    for (k = 0; k < comp.n; k++) {
        long n = 0;
        for (i = 0; i < s->natoms; i++)
            n += strcmp(comp.el[k].symbol, s->atoms[i].element) == 0;
        if (n != comp.el[k].count)
            FAIL(MOLQ_EVALUE, "species '%s': field 'geometry': %ld '%s' "
                 "atom%s, but formula '%s' has %ld", nm, n, comp.el[k].symbol,
                 n == 1 ? "" : "s", s->formula, comp.el[k].count);
    }
    return MOLQ_OK;
}

/* Plausibility of a molar mass that passed the hard bounds: a warning,
 * not an error, since a user may model an isotopologue or a pseudo-species
 * on purpose.  MOLQ_ENOMEM only. */
static molq_status check_mass(const molq_spec *s, double m, molq_warnlist *warn)
{
    const char *nm = s->name;
    double mf;
    const char *unit = s->mass_in_g ? "g/mol" : "kg/mol";
    double given = s->mass_in_g ? m * 1e3 : m;
    if (warn == NULL)
        return MOLQ_OK;
    if (s->formula != NULL &&
        molq_formula_molar_mass(s->formula, &mf, NULL, 0) == MOLQ_OK) {
        /* 1 %: far beyond isotope effects on standard atomic weights but
         * well below a missing or extra atom (H is 1 % of 100 g/mol) */
        if (fabs(m - mf) > 0.01 * mf)
            return molq_warn(warn, "species '%s': field 'molar_mass': %g %s "
                             "differs by %.3g %% from the %g %s of its "
                             "formula '%s'", nm, given, unit,
                             100.0 * fabs(m - mf) / mf,
                             s->mass_in_g ? mf * 1e3 : mf, unit, s->formula);
        return MOLQ_OK;
    }
    /* no molecule or atom is lighter than the hydrogen atom's 1.008 g/mol
     * (a bare proton 1.007 g/mol, the electron 5.486e-4 g/mol); anything
     * else below 1 g/mol is most likely kg/mol passed as g/mol */
    if (m < 1.0e-3 && fabs(m - MOLQ_M_E_MOLAR) > 0.01 * MOLQ_M_E_MOLAR)
        return molq_warn(warn, "species '%s': field 'molar_mass': %g %s is "
                         "lighter than any atom or molecule (hydrogen: 1.008 "
                         "g/mol) and is not the electron's; check the unit",
                         nm, given, unit);
    return MOLQ_OK;
}

molq_status molq_spec_validate(const molq_spec *s, double *molar_mass,
                               molq_warnlist *warn, char *err, size_t errlen)
{
    const char *nm = s->name;
    size_t i, len = strlen(nm);
    int have_ground = 0;
    molq_status rc;

    if (len == 0 || len > MOLQ_MAX_NAME)
        FAIL(MOLQ_EVALUE, "species '%.40s': field 'name': must be 1 to %d bytes "
             "long (got %zu)", nm, MOLQ_MAX_NAME, len);

    if (s->has_molar_mass) {
        const char *unit = s->mass_in_g ? "g/mol" : "kg/mol";
        double given = s->mass_in_g ? s->molar_mass * 1e3 : s->molar_mass;
        if (!isfinite(s->molar_mass) || s->molar_mass <= 0.0)
            FAIL(MOLQ_EVALUE, "species '%s': field 'molar_mass': must be a "
                 "finite number > 0 (got %g %s)", nm, given, unit);
        if (s->molar_mass > MOLQ_MAX_MOLAR_MASS && !s->mass_in_g)
            FAIL(MOLQ_EVALUE, "species '%s': field 'molar_mass': %g is above "
                 "1 kg/mol, heavier than any ideal-gas molecule: the unit is "
                 "kg/mol; did you mean g/mol? use "
                 "molq_spec_set_molar_mass_g_per_mol", nm, given);
        if (s->molar_mass > MOLQ_MAX_MOLAR_MASS)
            FAIL(MOLQ_EVALUE, "species '%s': field 'molar_mass': must be at "
                 "most 1000 g/mol (1 kg/mol; no ideal-gas molecule is that "
                 "heavy; got %g g/mol)", nm, given);
        if (s->molar_mass < MOLQ_M_E_MOLAR)
            FAIL(MOLQ_EVALUE, "species '%s': field 'molar_mass': must be at "
                 "least the electron's, 5.48579909065e-7 kg/mol (got %g %s)",
                 nm, given, unit);
        *molar_mass = s->molar_mass;
        if (check_mass(s, s->molar_mass, warn) != MOLQ_OK) {
            molq_errf(err, errlen, "species '%s': out of memory", nm);
            return MOLQ_ENOMEM;
        }
    } else if (s->formula != NULL) {
        char sub[300];
        if (molq_formula_molar_mass(s->formula, molar_mass, sub, sizeof sub)
            != MOLQ_OK)
            FAIL(MOLQ_EVALUE, "species '%s': field 'formula': %s", nm, sub);
    } else {
        FAIL(MOLQ_EKEY, "species '%s': field 'molar_mass': missing, and no "
             "'formula' to compute it from", nm);
    }

    if (s->has_molar_mass && s->formula != NULL && warn != NULL) {
        molq_composition comp;
        char sub[300];
        if (molq_formula_parse(s->formula, &comp, sub, sizeof sub) !=
                MOLQ_OK &&
            molq_warn(warn, "species '%s': field 'formula': %s; the species "
                      "has no element composition or charge", nm, sub) !=
                MOLQ_OK) {
            molq_errf(err, errlen, "species '%s': out of memory", nm);
            return MOLQ_ENOMEM;
        }
    }
    if (s->has_range &&
        !(isfinite(s->range_lo) && isfinite(s->range_hi) &&
          s->range_lo > 0.0 && s->range_lo < s->range_hi &&
          s->range_hi <= 1e6))
        FAIL(MOLQ_EVALUE, "species '%s': field 'validated_range': must be "
             "[T_low, T_high] in K with 0 < T_low < T_high <= 1e6 (got [%g, "
             "%g])", nm, s->range_lo, s->range_hi);

    if (s->structure < MOLQ_ATOM || s->structure > MOLQ_NONLINEAR)
        FAIL(MOLQ_EVALUE, "species '%s': field 'structure': must be atom, "
             "linear or nonlinear (got code %d)", nm, s->structure);
    if (s->rotor != MOLQ_ROTOR_CORRECTED && s->rotor != MOLQ_ROTOR_CLASSICAL)
        FAIL(MOLQ_EVALUE, "species '%s': field 'rotor': must be corrected or "
             "classical (got code %d)", nm, s->rotor);
    if (s->sigma < 1 || s->sigma > MOLQ_MAX_SYMMETRY_NUMBER)
        FAIL(MOLQ_EVALUE, "species '%s': field 'symmetry_number': must be an "
             "integer from 1 to %d (got %d)", nm, MOLQ_MAX_SYMMETRY_NUMBER,
             s->sigma);
    if (s->structure == MOLQ_ATOM && s->sigma != 1)
        FAIL(MOLQ_EVALUE, "species '%s': field 'symmetry_number': an atom has "
             "no rotation, so it must be 1 (got %d)", nm, s->sigma);

    if (s->nstates > 0 && (rc = validate_states(s, err, errlen)) != MOLQ_OK)
        return rc;
    if (s->model != MOLQ_MODEL_RRHO && s->model != MOLQ_MODEL_LEVELS)
        FAIL(MOLQ_EVALUE, "species '%s': field 'model': must be rrho or levels "
             "(got code %d)", nm, s->model);
    if (s->ntorsions > 0 && (rc = validate_torsions(s, err, errlen)) != MOLQ_OK)
        return rc;
    if (s->nvterms > 0 && (rc = validate_anharmonic(s, err, errlen)) != MOLQ_OK)
        return rc;
    if (molq_spec_default_model(s) == MOLQ_MODEL_LEVELS && s->nstates == 0 &&
        s->ntorsions == 0 && s->nvterms == 0 &&
        s->structure != MOLQ_NONLINEAR)
        FAIL(MOLQ_EKEY, "species '%s': field 'diatomic_states': missing; the "
             "levels model needs level data: 'diatomic_states' for a "
             "diatomic, 'anharmonicity' or 'torsions' for a polyatomic", nm);

    /* Rotational constants may be left out when a diatomic's states give
     * them (the RRHO variant derives B0 from the ground state). */
    if (!(s->nrot == 0 && s->nstates > 0) &&
        s->nrot != rot_count[s->structure])
        FAIL(MOLQ_EVALUE, "species '%s': field 'rotational_constants': a %s "
             "species needs %zu (got %zu)", nm, structure_name[s->structure],
             rot_count[s->structure], s->nrot);
    for (i = 0; i < s->nrot; i++)
        if (!isfinite(s->rot[i]) || s->rot[i] <= 0.0)
            FAIL(MOLQ_EVALUE, "species '%s': field 'rotational_constants[%zu]'"
                 ": must be a finite number > 0 cm^-1 (got %g)", nm, i,
                 s->rot[i]);
    if (s->has_top_w) {
        if (s->structure != MOLQ_NONLINEAR)
            FAIL(MOLQ_EVALUE, "species '%s': field 'rotational_weights': class "
                 "weights (ee, eo, oe, oo) are for nonlinear molecules", nm);
        for (i = 0; i < 4; i++)
            if (!isfinite(s->top_w[i]) || s->top_w[i] < 0.0)
                FAIL(MOLQ_EVALUE, "species '%s': field 'rotational_weights': "
                     "must be finite numbers >= 0 (got %g)", nm, s->top_w[i]);
        {
            /* each class holds a quarter of the levels at high T, where the
             * exact top must meet the corrected rotor's 1/sigma */
            double mean = 0.25 * (s->top_w[0] + s->top_w[1] + s->top_w[2] +
                                  s->top_w[3]);
            if (fabs(mean * s->sigma - 1.0) > 1e-6)
                FAIL(MOLQ_EVALUE, "species '%s': field 'rotational_weights': "
                     "the four class weights must average to "
                     "1/symmetry_number = %g on the conventional scale (got "
                     "mean %g)", nm, 1.0 / s->sigma, mean);
        }
    }
    if (s->nrot == 3 && !(s->rot[0] >= s->rot[1] && s->rot[1] >= s->rot[2]))
        FAIL(MOLQ_EVALUE, "species '%s': field 'rotational_constants': must be "
             "ordered A >= B >= C (got %g, %g, %g)", nm, s->rot[0], s->rot[1],
             s->rot[2]);
    if (s->has_spin_group) {
        int c3 = s->spin_group == MOLQ_SPIN_GROUP_C3V;
        if (!c3 && s->spin_group != MOLQ_SPIN_GROUP_TD)
            FAIL(MOLQ_EVALUE, "species '%s': field 'rotational_spin.group': "
                 "unknown group %d", nm, s->spin_group);
        if (s->structure != MOLQ_NONLINEAR)
            FAIL(MOLQ_EVALUE, "species '%s': field 'rotational_spin': spin "
                 "groups are for nonlinear molecules", nm);
        if (s->has_top_w)
            FAIL(MOLQ_EVALUE, "species '%s': field 'rotational_spin': give "
                 "either a spin group or 'rotational_weights', not both", nm);
        if (!isfinite(s->nuclear_spin) || s->nuclear_spin < 0.0 ||
            s->nuclear_spin > 10.0 ||
            2.0 * s->nuclear_spin != floor(2.0 * s->nuclear_spin))
            FAIL(MOLQ_EVALUE, "species '%s': field 'rotational_spin."
                 "nuclear_spin': must be 0, 1/2, 1, ... up to 10 (got %g)",
                 nm, s->nuclear_spin);
        if (s->sigma != (c3 ? 3 : 12))
            FAIL(MOLQ_EVALUE, "species '%s': field 'symmetry_number': the %s "
                 "spin group needs %d (got %d)", nm, c3 ? "C3v" : "Td",
                 c3 ? 3 : 12, s->sigma);
        if (s->nrot == 3) {
            const double tol = 1e-6;
            int ab = s->rot[0] - s->rot[1] <= tol * s->rot[0];
            int bc = s->rot[1] - s->rot[2] <= tol * s->rot[1];
            if (c3 ? !(ab || bc) : !(ab && bc))
                FAIL(MOLQ_EVALUE, "species '%s': field 'rotational_constants'"
                     ": the %s spin group needs a %s top (got %g, %g, %g)",
                     nm, c3 ? "C3v" : "Td",
                     c3 ? "symmetric (two constants equal)"
                        : "spherical (three constants equal)",
                     s->rot[0], s->rot[1], s->rot[2]);
        }
    }

    if (s->structure == MOLQ_ATOM && s->nvib > 0)
        FAIL(MOLQ_EVALUE, "species '%s': field 'vibrations': an atom has no "
             "vibrational modes (got %zu)", nm, s->nvib);
    for (i = 0; i < s->nvib; i++) {
        if (!isfinite(s->vib_wn[i]) || s->vib_wn[i] <= 0.0)
            FAIL(MOLQ_EVALUE, "species '%s': field 'vibrations[%zu].wavenumber'"
                 ": must be a finite number > 0 cm^-1; a zero or imaginary "
                 "(negative) mode is not a vibration (got %g)", nm, i,
                 s->vib_wn[i]);
        if (s->vib_deg[i] < 1 || s->vib_deg[i] > MOLQ_MAX_DEGENERACY)
            FAIL(MOLQ_EVALUE, "species '%s': field 'vibrations[%zu].degeneracy'"
                 ": must be an integer from 1 to %d (got %d)", nm, i,
                 MOLQ_MAX_DEGENERACY, s->vib_deg[i]);
    }

    for (i = 0; i < s->nel; i++) {
        if (!isfinite(s->el_e[i]) || s->el_e[i] < 0.0)
            FAIL(MOLQ_EVALUE, "species '%s': field 'electronic_levels[%zu]."
                 "energy': must be a finite number >= 0 cm^-1 above the ground "
                 "level (got %g)", nm, i, s->el_e[i]);
        if (s->el_g[i] < 1 || s->el_g[i] > MOLQ_MAX_DEGENERACY)
            FAIL(MOLQ_EVALUE, "species '%s': field 'electronic_levels[%zu]."
                 "degeneracy': must be an integer from 1 to %d (got %d)", nm, i,
                 MOLQ_MAX_DEGENERACY, s->el_g[i]);
        if (s->el_e[i] == 0.0)
            have_ground = 1;
    }
    if (s->nel > 0 && !have_ground)
        FAIL(MOLQ_EVALUE, "species '%s': field 'electronic_levels': one level "
             "must be the ground level, at energy 0", nm);

    if (s->has_formation_enthalpy && !isfinite(s->formation_enthalpy))
        FAIL(MOLQ_EVALUE, "species '%s': field 'formation_enthalpy_298': must "
             "be a finite number (J/mol)", nm);
    if (s->natoms > 0 && (rc = validate_geometry(s, err, errlen)) != MOLQ_OK)
        return rc;
    if (molq_spec_plausible(s, warn) != MOLQ_OK) {
        molq_errf(err, errlen, "species '%s': out of memory", nm);
        return MOLQ_ENOMEM;
    }
    return MOLQ_OK;
}
