/* Species-file keys of the levels model: diatomic states (Dunham term
 * values, spin weights), spin isomers, torsions, anharmonicity.  Key names
 * are documented in json_reader.c and the README. */
#include <stdio.h>
#include <string.h>

#include "core/constants.h"
#include "data/json_common.h"



const char *const molq_json_levels_keys[] = {
    "model", "dissociation_energy", "spin_isomers", "odd_fraction",
    "diatomic_states", "torsions", "anharmonicity", "rotational_weights",
    "rotational_spin", NULL};

static const char *const torsion_keys[] = {
    "rotational_constant", "reduced_moment", "symmetry_number", "barrier",
    "replaces_vibration", NULL};

/* F = h / (8 pi^2 c I) in cm^-1 from I in amu A^2. */
static double rotor_constant(double amu_a2)
{
    double inertia = amu_a2 * MOLQ_M_U * 1e-20; /* kg m^2 */
    return MOLQ_H_PLANCK /
           (8.0 * MOLQ_PI * MOLQ_PI * 100.0 * MOLQ_C_LIGHT * inertia);
}

static molq_status read_torsion(molq_json_ctx *c, molq_spec *s, json_t *e, size_t i)
{
    char name[96], where[48];
    json_t *v, *f, *im, *item;
    molq_status st;
    double x;
    int sigma = 1, rep = -1;
    size_t idx, k;
    snprintf(where, sizeof where, "torsions[%zu].", i);
    if (!json_is_object(e))
        return molq_json_key_error(c, MOLQ_ETYPE, "torsions", "expected an array of "
                         "objects");
    if ((st = molq_json_check_keys(c, e, torsion_keys, where)) != MOLQ_OK)
        return st;
    f = json_object_get(e, "rotational_constant");
    im = json_object_get(e, "reduced_moment");
    snprintf(name, sizeof name, "%srotational_constant", where);
    if (f == NULL && im == NULL)
        return molq_json_key_error(c, MOLQ_EKEY, name, "missing: a torsion (and any "
                         "barrier) needs its rotor, as 'rotational_constant' "
                         "(cm^-1) or 'reduced_moment' (amu A^2)");
    if (f != NULL && im != NULL)
        return molq_json_key_error(c, MOLQ_EKEY, name, "give either "
                         "'rotational_constant' or 'reduced_moment', not both");
    if (f != NULL) {
        if ((st = molq_json_number(c, f, name, &x)) != MOLQ_OK)
            return st;
    } else {
        snprintf(name, sizeof name, "%sreduced_moment", where);
        if ((st = molq_json_number(c, im, name, &x)) != MOLQ_OK)
            return st;
        if (!(x > 0.0))
            return molq_json_key_error(c, MOLQ_EVALUE, name, "must be > 0 amu A^2");
        x = rotor_constant(x);
    }
    snprintf(name, sizeof name, "%ssymmetry_number", where);
    if ((v = json_object_get(e, "symmetry_number")) != NULL &&
        (st = molq_json_int(c, v, name, 1, MOLQ_MAX_SYMMETRY_NUMBER, &sigma)) != MOLQ_OK)
        return st;
    snprintf(name, sizeof name, "%sreplaces_vibration", where);
    if ((v = json_object_get(e, "replaces_vibration")) != NULL &&
        (st = molq_json_int(c, v, name, 0, MOLQ_MAX_VIBRATIONS - 1, &rep)) != MOLQ_OK)
        return st;
    if ((st = molq_spec_add_torsion(s, x, sigma, rep, &idx)) != MOLQ_OK)
        return st == MOLQ_ELIMIT
                   ? molq_json_key_error(c, st, "torsions", "at most 8 torsions")
                   : st;
    if ((v = json_object_get(e, "barrier")) == NULL)
        return MOLQ_OK;
    snprintf(name, sizeof name, "%sbarrier", where);
    if (!json_is_array(v))
        return molq_json_key_error(c, MOLQ_ETYPE, name, "expected an array of "
                         "{\"n\": integer, \"V\": cm^-1}");
    json_array_foreach(v, k, item) {
        static const char *const term_keys[] = {"n", "V", NULL};
        json_t *jn, *jv;
        int n;
        char tw[128];
        snprintf(tw, sizeof tw, "%sbarrier[%zu].", where, k);
        if (!json_is_object(item))
            return molq_json_key_error(c, MOLQ_ETYPE, name, "expected an array of "
                             "objects");
        if ((st = molq_json_check_keys(c, item, term_keys, tw)) != MOLQ_OK)
            return st;
        jn = json_object_get(item, "n");
        jv = json_object_get(item, "V");
        snprintf(name, sizeof name, "%sbarrier[%zu].%s", where, k,
                 jn == NULL ? "n" : "V");
        if (jn == NULL || jv == NULL)
            return molq_json_key_error(c, MOLQ_EKEY, name, "missing");
        if ((st = molq_json_int(c, jn, name, 1, MOLQ_MAX_TORSION_N, &n)) != MOLQ_OK ||
            (st = molq_json_number(c, jv, name, &x)) != MOLQ_OK)
            return st;
        if ((st = molq_spec_add_torsion_term(s, idx, n, x)) != MOLQ_OK)
            return st == MOLQ_ELIMIT
                       ? molq_json_key_error(c, st, name, "at most 8 terms")
                       : st;
    }
    return MOLQ_OK;
}

/* Named spectroscopic constants: key, Dunham indices, sign. */
static const struct {
    const char *key;
    int k, l;
    double sign;
} named[] = {
    {"we", 1, 0, 1.0},      {"wexe", 2, 0, -1.0},    {"weye", 3, 0, 1.0},
    {"weze", 4, 0, 1.0},    {"Be", 0, 1, 1.0},       {"alpha_e", 1, 1, -1.0},
    {"gamma_e", 2, 1, 1.0}, {"De", 0, 2, -1.0},      {"beta_e", 1, 2, -1.0},
    {"He", 0, 3, 1.0},
};
#define NNAMED (sizeof named / sizeof named[0])

static const char *const state_keys[] = {
    "label", "Te", "degeneracy", "rotational_weights", "dunham", "we", "wexe",
    "weye", "weze", "Be", "alpha_e", "gamma_e", "De", "beta_e", "He",
    "spin_orbit", "re", NULL};

static molq_status read_dunham(molq_json_ctx *c, molq_spec *s, size_t idx, json_t *m,
                               const char *field)
{
    size_t k, l;
    json_t *row, *v;
    if (!json_is_array(m) || json_array_size(m) > MOLQ_DUNHAM_K)
        return molq_json_key_error(c, MOLQ_ETYPE, field, "expected an array of at most "
                         "6 rows (powers of v + 1/2) of at most 4 numbers "
                         "(powers of J(J+1))");
    json_array_foreach(m, k, row) {
        if (!json_is_array(row) || json_array_size(row) > MOLQ_DUNHAM_L)
            return molq_json_key_error(c, MOLQ_ETYPE, field, "each row must be an array "
                             "of at most 4 numbers");
        json_array_foreach(row, l, v) {
            double y;
            molq_status st = molq_json_number(c, v, field, &y);
            if (st != MOLQ_OK)
                return st;
            molq_spec_set_dunham(s, idx, (unsigned)k, (unsigned)l, y);
        }
    }
    return MOLQ_OK;
}

static molq_status read_state(molq_json_ctx *c, molq_spec *s, json_t *e, size_t i)
{
    char name[96], where[48];
    json_t *v;
    molq_status st;
    double te, x;
    int g = 1, have_named = 0;
    size_t idx, n;
    snprintf(where, sizeof where, "diatomic_states[%zu].", i);
    if (!json_is_object(e))
        return molq_json_key_error(c, MOLQ_ETYPE, "diatomic_states",
                         "expected an array of objects");
    if ((st = molq_json_check_keys(c, e, state_keys, where)) != MOLQ_OK)
        return st;
    snprintf(name, sizeof name, "%sTe", where);
    if ((v = json_object_get(e, "Te")) == NULL)
        return molq_json_key_error(c, MOLQ_EKEY, name, "missing (0 for the ground "
                         "state)");
    if ((st = molq_json_number(c, v, name, &te)) != MOLQ_OK)
        return st;
    snprintf(name, sizeof name, "%sdegeneracy", where);
    if ((v = json_object_get(e, "degeneracy")) != NULL &&
        (st = molq_json_int(c, v, name, 1, MOLQ_MAX_DEGENERACY, &g)) != MOLQ_OK)
        return st;
    if ((st = molq_spec_add_diatomic_state(s, te, g, &idx)) != MOLQ_OK)
        return st == MOLQ_ELIMIT
                   ? molq_json_key_error(c, st, "diatomic_states", "at most 32 states")
                   : st;
    for (n = 0; n < NNAMED; n++) {
        if ((v = json_object_get(e, named[n].key)) == NULL)
            continue;
        snprintf(name, sizeof name, "%s%s", where, named[n].key);
        if ((st = molq_json_number(c, v, name, &x)) != MOLQ_OK)
            return st;
        molq_spec_set_dunham(s, idx, named[n].k, named[n].l, named[n].sign * x);
        have_named = 1;
    }
    if ((v = json_object_get(e, "dunham")) != NULL) {
        snprintf(name, sizeof name, "%sdunham", where);
        if (have_named)
            return molq_json_key_error(c, MOLQ_EKEY, name, "give either the Dunham "
                             "matrix or the named constants, not both");
        if ((st = read_dunham(c, s, idx, v, name)) != MOLQ_OK)
            return st;
    }
    if ((v = json_object_get(e, "rotational_weights")) != NULL) {
        double w[2];
        snprintf(name, sizeof name, "%srotational_weights", where);
        if (!json_is_array(v) || json_array_size(v) != 2)
            return molq_json_key_error(c, MOLQ_ETYPE, name,
                             "expected [even-J weight, odd-J weight]");
        if ((st = molq_json_number(c, json_array_get(v, 0), name, &w[0])) !=
                MOLQ_OK ||
            (st = molq_json_number(c, json_array_get(v, 1), name, &w[1])) != MOLQ_OK)
            return st;
        molq_spec_set_rotational_weights(s, idx, w[0], w[1]);
    }
    if ((v = json_object_get(e, "spin_orbit")) != NULL) {
        snprintf(name, sizeof name, "%sspin_orbit", where);
        if ((st = molq_json_number(c, v, name, &x)) != MOLQ_OK)
            return st;
        molq_spec_set_spin_orbit(s, idx, x);
    }
    if ((v = json_object_get(e, "re")) != NULL) {
        snprintf(name, sizeof name, "%sre", where);
        if ((st = molq_json_number(c, v, name, &x)) != MOLQ_OK)
            return st;
        s->states[idx].re = x;
        s->states[idx].has_re = 1;
    }
    if ((v = json_object_get(e, "label")) != NULL) {
        const char *text;
        snprintf(name, sizeof name, "%slabel", where);
        if ((st = molq_json_string(c, v, name, &text)) != MOLQ_OK)
            return st;
    }
    return MOLQ_OK;
}

/* Keys of the level-sum model. */
/* One list of the anharmonicity object: arrays of numbers whose first
 * `nidx` entries are mode indices, then between nmin and nmax values. */
static molq_status read_anh_list(molq_json_ctx *c, molq_spec *s, json_t *list,
                                 const char *key, size_t nidx, size_t nmin,
                                 size_t nmax)
{
    char name[64];
    size_t k, m;
    json_t *row, *v;
    snprintf(name, sizeof name, "anharmonicity.%s", key);
    if (!json_is_array(list))
        return molq_json_key_error(c, MOLQ_ETYPE, name, "expected an array of arrays");
    json_array_foreach(list, k, row) {
        size_t idx[2] = {0, 0}, n = json_array_size(row);
        double val[3] = {0, 0, 0};
        molq_status st;
        snprintf(name, sizeof name, "anharmonicity.%s[%zu]", key, k);
        if (!json_is_array(row) || n < nidx + nmin || n > nidx + nmax)
            return molq_json_key_error(c, MOLQ_ETYPE, name, "expected [mode index(es), "
                             "value(s)] (see the README)");
        json_array_foreach(row, m, v) {
            if (m < nidx) {
                int mi;
                if ((st = molq_json_int(c, v, name, 0, MOLQ_MAX_VIBRATIONS - 1,
                                        &mi)) != MOLQ_OK)
                    return st;
                idx[m] = (size_t)mi;
            } else if ((st = molq_json_number(c, v, name, &val[m - nidx])) !=
                       MOLQ_OK) {
                return st;
            }
        }
        if (key[0] == 'x')
            st = molq_spec_add_anharmonicity(s, idx[0], idx[1], val[0]);
        else if (key[0] == 'g')
            st = molq_spec_add_l_constant(s, idx[0], val[0]);
        else
            st = molq_spec_add_rotation_vibration(s, idx[0], val, n - nidx);
        if (st == MOLQ_ELIMIT)
            return molq_json_key_error(c, st, name, "too many entries");
        if (st != MOLQ_OK)
            return st;
    }
    return MOLQ_OK;
}

static molq_status read_anharmonicity(molq_json_ctx *c, molq_spec *s, json_t *obj)
{
    static const char *const keys[] = {"x", "g", "alpha", NULL};
    json_t *v;
    molq_status st;
    if (!json_is_object(obj))
        return molq_json_key_error(c, MOLQ_ETYPE, "anharmonicity",
                         "expected an object with x, g, alpha");
    if ((st = molq_json_check_keys(c, obj, keys, "anharmonicity.")) != MOLQ_OK)
        return st;
    if ((v = json_object_get(obj, "x")) != NULL &&
        (st = read_anh_list(c, s, v, "x", 2, 1, 1)) != MOLQ_OK)
        return st;
    if ((v = json_object_get(obj, "g")) != NULL &&
        (st = read_anh_list(c, s, v, "g", 1, 1, 1)) != MOLQ_OK)
        return st;
    if ((v = json_object_get(obj, "alpha")) != NULL &&
        (st = read_anh_list(c, s, v, "alpha", 1, 1, 3)) != MOLQ_OK)
        return st;
    return MOLQ_OK;
}


/* "rotational_weights": {"ee": w, "eo": w, "oe": w, "oo": w} of a
 * nonlinear molecule's (Ka, Kc) parity classes. */
static molq_status read_top_weights(molq_json_ctx *c, molq_spec *s,
                                    json_t *obj)
{
    static const char *const keys[] = {"ee", "eo", "oe", "oo", NULL};
    double w[4];
    size_t k;
    molq_status st;
    if (!json_is_object(obj))
        return molq_json_key_error(c, MOLQ_ETYPE, "rotational_weights",
                                   "expected {\"ee\": w, \"eo\": w, "
                                   "\"oe\": w, \"oo\": w}");
    if ((st = molq_json_check_keys(c, obj, keys, "rotational_weights.")) !=
        MOLQ_OK)
        return st;
    for (k = 0; k < 4; k++) {
        char name[48];
        json_t *v = json_object_get(obj, keys[k]);
        snprintf(name, sizeof name, "rotational_weights.%s", keys[k]);
        if (v == NULL)
            return molq_json_key_error(c, MOLQ_EKEY, name, "missing");
        if ((st = molq_json_number(c, v, name, &w[k])) != MOLQ_OK)
            return st;
    }
    return molq_spec_set_top_weights(s, w[0], w[1], w[2], w[3]);
}

/* "rotational_spin": {"group": "C3v" | "Td", "nuclear_spin": I}. */
static molq_status read_spin_group(molq_json_ctx *c, molq_spec *s,
                                   json_t *obj)
{
    static const char *const keys[] = {"group", "nuclear_spin", NULL};
    const char *text;
    json_t *v;
    double spin;
    molq_spin_group g;
    molq_status st;
    if (!json_is_object(obj))
        return molq_json_key_error(c, MOLQ_ETYPE, "rotational_spin",
                                   "expected {\"group\": \"C3v\" or "
                                   "\"Td\", \"nuclear_spin\": I}");
    if ((st = molq_json_check_keys(c, obj, keys, "rotational_spin.")) !=
        MOLQ_OK)
        return st;
    if ((v = json_object_get(obj, "group")) == NULL)
        return molq_json_key_error(c, MOLQ_EKEY, "rotational_spin.group",
                                   "missing");
    if ((st = molq_json_string(c, v, "rotational_spin.group", &text)) !=
        MOLQ_OK)
        return st;
    if (strcmp(text, "C3v") == 0)
        g = MOLQ_SPIN_GROUP_C3V;
    else if (strcmp(text, "Td") == 0)
        g = MOLQ_SPIN_GROUP_TD;
    else
        return molq_json_key_error(c, MOLQ_EVALUE, "rotational_spin.group",
                                   "must be \"C3v\" or \"Td\"");
    if ((v = json_object_get(obj, "nuclear_spin")) == NULL)
        return molq_json_key_error(c, MOLQ_EKEY,
                                   "rotational_spin.nuclear_spin",
                                   "missing (1/2 for protons)");
    if ((st = molq_json_number(c, v, "rotational_spin.nuclear_spin",
                               &spin)) != MOLQ_OK)
        return st;
    return molq_spec_set_top_spin_group(s, g, spin);
}

molq_status molq_json_read_levels(molq_json_ctx *c, json_t *e, molq_spec *s)
{
    json_t *v, *item;
    molq_status st;
    const char *text;
    double x;
    size_t i;
    if ((v = json_object_get(e, "model")) != NULL) {
        if ((st = molq_json_string(c, v, "model", &text)) != MOLQ_OK)
            return st;
        if (strcmp(text, "rrho") == 0)
            molq_spec_set_model(s, MOLQ_MODEL_RRHO);
        else if (strcmp(text, "levels") == 0)
            molq_spec_set_model(s, MOLQ_MODEL_LEVELS);
        else
            return molq_json_key_error(c, MOLQ_EVALUE, "model",
                             "must be \"rrho\" or \"levels\"");
    }
    if ((v = json_object_get(e, "dissociation_energy")) != NULL) {
        if ((st = molq_json_number(c, v, "dissociation_energy", &x)) != MOLQ_OK)
            return st;
        molq_spec_set_dissociation_energy(s, x);
    }
    if ((v = json_object_get(e, "spin_isomers")) != NULL) {
        if ((st = molq_json_string(c, v, "spin_isomers", &text)) != MOLQ_OK)
            return st;
        if (strcmp(text, "frozen") == 0) {
            item = json_object_get(e, "odd_fraction");
            if (item == NULL)
                return molq_json_key_error(c, MOLQ_EKEY, "odd_fraction", "missing; a "
                                 "frozen mixture needs its odd-J fraction "
                                 "(0.75 for normal hydrogen)");
            if ((st = molq_json_number(c, item, "odd_fraction", &x)) != MOLQ_OK)
                return st;
            molq_spec_set_spin_isomers_frozen(s, x);
        } else if (strcmp(text, "equilibrium") != 0) {
            return molq_json_key_error(c, MOLQ_EVALUE, "spin_isomers",
                             "must be \"equilibrium\" or \"frozen\"");
        }
    }
    if (json_object_get(e, "odd_fraction") != NULL && !s->spin_frozen)
        return molq_json_key_error(c, MOLQ_EKEY, "odd_fraction", "only meaningful with "
                         "\"spin_isomers\": \"frozen\"");
    if ((v = json_object_get(e, "rotational_weights")) != NULL &&
        (st = read_top_weights(c, s, v)) != MOLQ_OK)
        return st;
    if ((v = json_object_get(e, "rotational_spin")) != NULL &&
        (st = read_spin_group(c, s, v)) != MOLQ_OK)
        return st;
    if ((v = json_object_get(e, "anharmonicity")) != NULL &&
        (st = read_anharmonicity(c, s, v)) != MOLQ_OK)
        return st;
    if ((v = json_object_get(e, "torsions")) != NULL) {
        if (!json_is_array(v))
            return molq_json_key_error(c, MOLQ_ETYPE, "torsions",
                             "expected an array of objects");
        json_array_foreach(v, i, item) {
            if ((st = read_torsion(c, s, item, i)) != MOLQ_OK)
                return st;
        }
    }
    if ((v = json_object_get(e, "diatomic_states")) != NULL) {
        if (!json_is_array(v))
            return molq_json_key_error(c, MOLQ_ETYPE, "diatomic_states",
                             "expected an array of objects");
        json_array_foreach(v, i, item) {
            if ((st = read_state(c, s, item, i)) != MOLQ_OK)
                return st;
        }
    }
    return MOLQ_OK;
}
