/* Reading species files with jansson.
 *
 * {"schema_version": 1, "description": "...", "species": [ENTRY, ...]}
 * ENTRY keys: name (string, required), formula (string), molar_mass (number,
 * g/mol), structure ("atom" | "linear" | "nonlinear", required),
 * symmetry_number (integer), rotational_constants (array of numbers, cm^-1),
 * rotor ("corrected" | "classical"), vibrations (array of {"wavenumber":
 * cm^-1, "degeneracy": integer, default 1}), electronic_levels (array of
 * {"energy": cm^-1, "degeneracy": integer, default 1}),
 * formation_enthalpy_298 (number, J/mol), source (string),
 * model ("rrho" | "levels"), dissociation_energy (number, cm^-1),
 * spin_isomers ("equilibrium" | "frozen"), odd_fraction (number),
 * diatomic_states (array of STATE).
 * STATE keys: label (string), Te (cm^-1, required), degeneracy (integer,
 * default 1), rotational_weights ([even, odd]), and the term values either
 * as named constants we, wexe, weye, weze, Be, alpha_e, gamma_e, De,
 * beta_e, He (cm^-1) or as "dunham": [[Y00, Y01, ...], [Y10, Y11, ...], ...]
 * (row k = power of v + 1/2, column l = power of J(J+1)).
 * torsions (array of TORSION), TORSION keys: rotational_constant (F,
 * cm^-1) or reduced_moment (amu A^2), symmetry_number (integer, default 1),
 * barrier (array of {"n": integer, "V": cm^-1}), replaces_vibration
 * (index into vibrations).
 * Vibration entries may carry "harmonic" (w_i, cm^-1).  anharmonicity:
 * {"x": [[i, j, x_ij], ...], "g": [[i, g_ii], ...],
 *  "alpha": [[i, alpha_A, alpha_B, alpha_C] | [i, alpha], ...]} with mode
 * indices into vibrations (cm^-1). */
#include <jansson.h>
#include <stdlib.h>
#include <string.h>

#include "core/constants.h"
#include "core/errbuf.h"
#include "data/json_reader.h"

#define SCHEMA_VERSION 1

typedef struct ctx {
    char *err;
    size_t errlen;
    char who[300]; /* "species 'N2'" or "species #3" */
} ctx;

static molq_status key_error(ctx *c, molq_status code, const char *field,
                             const char *what)
{
    molq_errf(c->err, c->errlen, "%s: field '%s': %s", c->who, field, what);
    return code;
}

/* Reject keys not in the NULL-terminated list `allowed`. */
static molq_status check_keys(ctx *c, json_t *obj, const char *const *allowed,
                              const char *where)
{
    const char *key;
    json_t *val;
    json_object_foreach(obj, key, val) {
        const char *const *a;
        int ok = 0;
        (void)val;
        for (a = allowed; *a != NULL; a++)
            if (strcmp(*a, key) == 0)
                ok = 1;
        if (!ok) {
            molq_errf(c->err, c->errlen, "%s: field '%s%s': unknown key",
                      c->who, where, key);
            return MOLQ_EKEY;
        }
    }
    return MOLQ_OK;
}

static molq_status get_number(ctx *c, json_t *v, const char *field,
                              double *out)
{
    if (!json_is_number(v))
        return key_error(c, MOLQ_ETYPE, field, "expected a number");
    *out = json_number_value(v);
    return MOLQ_OK;
}

static molq_status get_int(ctx *c, json_t *v, const char *field, int *out)
{
    json_int_t i;
    if (!json_is_integer(v))
        return key_error(c, MOLQ_ETYPE, field, "expected an integer");
    i = json_integer_value(v);
    /* Clamp: out-of-int values are reported by validation as out of range. */
    *out = i > 1000000000 ? 1000000000 : i < -1000000000 ? -1000000000 : (int)i;
    return MOLQ_OK;
}

static molq_status get_string(ctx *c, json_t *v, const char *field,
                              const char **out)
{
    if (!json_is_string(v))
        return key_error(c, MOLQ_ETYPE, field, "expected a string");
    *out = json_string_value(v);
    return MOLQ_OK;
}

/* An array of {value_key, "degeneracy"} objects appended with `add`. */
static molq_status read_pairs(ctx *c, molq_spec *s, json_t *arr,
                              const char *field, const char *value_key,
                              molq_status (*add)(molq_spec *, double, int),
                              const char *extra_key,
                              molq_status (*extra)(molq_spec *, size_t,
                                                   double))
{
    const char *const allowed[] = {value_key, "degeneracy", extra_key, NULL};
    char name[96];
    size_t i;
    json_t *item;
    molq_status st;
    if (!json_is_array(arr))
        return key_error(c, MOLQ_ETYPE, field, "expected an array of objects");
    json_array_foreach(arr, i, item) {
        double value;
        int deg = 1;
        json_t *v;
        snprintf(name, sizeof name, "%s[%zu].", field, i);
        if (!json_is_object(item))
            return key_error(c, MOLQ_ETYPE, field,
                             "expected an array of objects");
        if ((st = check_keys(c, item, allowed, name)) != MOLQ_OK)
            return st;
        snprintf(name, sizeof name, "%s[%zu].%s", field, i, value_key);
        v = json_object_get(item, value_key);
        if (v == NULL)
            return key_error(c, MOLQ_EKEY, name, "missing");
        if ((st = get_number(c, v, name, &value)) != MOLQ_OK)
            return st;
        v = json_object_get(item, "degeneracy");
        snprintf(name, sizeof name, "%s[%zu].degeneracy", field, i);
        if (v != NULL && (st = get_int(c, v, name, &deg)) != MOLQ_OK)
            return st;
        st = add(s, value, deg);
        if (st == MOLQ_ELIMIT)
            return key_error(c, st, field, "too many entries (see the size "
                             "limits in the README)");
        if (st != MOLQ_OK)
            return st;
        if (extra_key != NULL &&
            (v = json_object_get(item, extra_key)) != NULL) {
            snprintf(name, sizeof name, "%s[%zu].%s", field, i, extra_key);
            if ((st = get_number(c, v, name, &value)) != MOLQ_OK ||
                (st = extra(s, i, value)) != MOLQ_OK)
                return st;
        }
    }
    return MOLQ_OK;
}

/* One list of the anharmonicity object: arrays of numbers whose first
 * `nidx` entries are mode indices, then between nmin and nmax values. */
static molq_status read_anh_list(ctx *c, molq_spec *s, json_t *list,
                                 const char *key, size_t nidx, size_t nmin,
                                 size_t nmax)
{
    char name[64];
    size_t k, m;
    json_t *row, *v;
    snprintf(name, sizeof name, "anharmonicity.%s", key);
    if (!json_is_array(list))
        return key_error(c, MOLQ_ETYPE, name, "expected an array of arrays");
    json_array_foreach(list, k, row) {
        size_t idx[2] = {0, 0}, n = json_array_size(row);
        double val[3] = {0, 0, 0};
        molq_status st;
        snprintf(name, sizeof name, "anharmonicity.%s[%zu]", key, k);
        if (!json_is_array(row) || n < nidx + nmin || n > nidx + nmax)
            return key_error(c, MOLQ_ETYPE, name, "expected [mode index(es), "
                             "value(s)] (see the README)");
        json_array_foreach(row, m, v) {
            if (m < nidx) {
                if (!json_is_integer(v) || json_integer_value(v) < 0 ||
                    json_integer_value(v) > 100000)
                    return key_error(c, MOLQ_ETYPE, name, "mode indices are "
                                     "integers >= 0 into 'vibrations'");
                idx[m] = (size_t)json_integer_value(v);
            } else if ((st = get_number(c, v, name, &val[m - nidx])) !=
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
            return key_error(c, st, name, "too many entries");
        if (st != MOLQ_OK)
            return st;
    }
    return MOLQ_OK;
}

static molq_status read_anharmonicity(ctx *c, molq_spec *s, json_t *obj)
{
    static const char *const keys[] = {"x", "g", "alpha", NULL};
    json_t *v;
    molq_status st;
    if (!json_is_object(obj))
        return key_error(c, MOLQ_ETYPE, "anharmonicity",
                         "expected an object with x, g, alpha");
    if ((st = check_keys(c, obj, keys, "anharmonicity.")) != MOLQ_OK)
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

static const char *const entry_keys[] = {
    "name", "formula", "molar_mass", "structure", "symmetry_number",
    "rotational_constants", "rotor", "vibrations", "electronic_levels",
    "formation_enthalpy_298", "source", "model", "dissociation_energy",
    "spin_isomers", "odd_fraction", "diatomic_states", "torsions",
    "anharmonicity", NULL};

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

static molq_status read_torsion(ctx *c, molq_spec *s, json_t *e, size_t i)
{
    char name[96], where[48];
    json_t *v, *f, *im, *item;
    molq_status st;
    double x;
    int sigma = 1, rep = -1;
    size_t idx, k;
    snprintf(where, sizeof where, "torsions[%zu].", i);
    if (!json_is_object(e))
        return key_error(c, MOLQ_ETYPE, "torsions", "expected an array of "
                         "objects");
    if ((st = check_keys(c, e, torsion_keys, where)) != MOLQ_OK)
        return st;
    f = json_object_get(e, "rotational_constant");
    im = json_object_get(e, "reduced_moment");
    snprintf(name, sizeof name, "%srotational_constant", where);
    if (f == NULL && im == NULL)
        return key_error(c, MOLQ_EKEY, name, "missing: a torsion (and any "
                         "barrier) needs its rotor, as 'rotational_constant' "
                         "(cm^-1) or 'reduced_moment' (amu A^2)");
    if (f != NULL && im != NULL)
        return key_error(c, MOLQ_EKEY, name, "give either "
                         "'rotational_constant' or 'reduced_moment', not both");
    if (f != NULL) {
        if ((st = get_number(c, f, name, &x)) != MOLQ_OK)
            return st;
    } else {
        snprintf(name, sizeof name, "%sreduced_moment", where);
        if ((st = get_number(c, im, name, &x)) != MOLQ_OK)
            return st;
        if (!(x > 0.0))
            return key_error(c, MOLQ_EVALUE, name, "must be > 0 amu A^2");
        x = rotor_constant(x);
    }
    snprintf(name, sizeof name, "%ssymmetry_number", where);
    if ((v = json_object_get(e, "symmetry_number")) != NULL &&
        (st = get_int(c, v, name, &sigma)) != MOLQ_OK)
        return st;
    snprintf(name, sizeof name, "%sreplaces_vibration", where);
    if ((v = json_object_get(e, "replaces_vibration")) != NULL &&
        (st = get_int(c, v, name, &rep)) != MOLQ_OK)
        return st;
    if (v != NULL && rep < 0)
        return key_error(c, MOLQ_EVALUE, name, "must be an index >= 0");
    if ((st = molq_spec_add_torsion(s, x, sigma, rep, &idx)) != MOLQ_OK)
        return st == MOLQ_ELIMIT
                   ? key_error(c, st, "torsions", "at most 8 torsions")
                   : st;
    if ((v = json_object_get(e, "barrier")) == NULL)
        return MOLQ_OK;
    snprintf(name, sizeof name, "%sbarrier", where);
    if (!json_is_array(v))
        return key_error(c, MOLQ_ETYPE, name, "expected an array of "
                         "{\"n\": integer, \"V\": cm^-1}");
    json_array_foreach(v, k, item) {
        static const char *const term_keys[] = {"n", "V", NULL};
        json_t *jn, *jv;
        int n;
        char tw[128];
        snprintf(tw, sizeof tw, "%sbarrier[%zu].", where, k);
        if (!json_is_object(item))
            return key_error(c, MOLQ_ETYPE, name, "expected an array of "
                             "objects");
        if ((st = check_keys(c, item, term_keys, tw)) != MOLQ_OK)
            return st;
        jn = json_object_get(item, "n");
        jv = json_object_get(item, "V");
        snprintf(name, sizeof name, "%sbarrier[%zu].%s", where, k,
                 jn == NULL ? "n" : "V");
        if (jn == NULL || jv == NULL)
            return key_error(c, MOLQ_EKEY, name, "missing");
        if ((st = get_int(c, jn, name, &n)) != MOLQ_OK ||
            (st = get_number(c, jv, name, &x)) != MOLQ_OK)
            return st;
        if ((st = molq_spec_add_torsion_term(s, idx, n, x)) != MOLQ_OK)
            return st == MOLQ_ELIMIT
                       ? key_error(c, st, name, "at most 8 terms")
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
    "weye", "weze", "Be", "alpha_e", "gamma_e", "De", "beta_e", "He", NULL};

static molq_status read_dunham(ctx *c, molq_spec *s, size_t idx, json_t *m,
                               const char *field)
{
    size_t k, l;
    json_t *row, *v;
    if (!json_is_array(m) || json_array_size(m) > MOLQ_DUNHAM_K)
        return key_error(c, MOLQ_ETYPE, field, "expected an array of at most "
                         "6 rows (powers of v + 1/2) of at most 4 numbers "
                         "(powers of J(J+1))");
    json_array_foreach(m, k, row) {
        if (!json_is_array(row) || json_array_size(row) > MOLQ_DUNHAM_L)
            return key_error(c, MOLQ_ETYPE, field, "each row must be an array "
                             "of at most 4 numbers");
        json_array_foreach(row, l, v) {
            double y;
            molq_status st = get_number(c, v, field, &y);
            if (st != MOLQ_OK)
                return st;
            molq_spec_set_dunham(s, idx, (unsigned)k, (unsigned)l, y);
        }
    }
    return MOLQ_OK;
}

static molq_status read_state(ctx *c, molq_spec *s, json_t *e, size_t i)
{
    char name[96], where[48];
    json_t *v;
    molq_status st;
    double te, x;
    int g = 1, have_named = 0;
    size_t idx, n;
    snprintf(where, sizeof where, "diatomic_states[%zu].", i);
    if (!json_is_object(e))
        return key_error(c, MOLQ_ETYPE, "diatomic_states",
                         "expected an array of objects");
    if ((st = check_keys(c, e, state_keys, where)) != MOLQ_OK)
        return st;
    snprintf(name, sizeof name, "%sTe", where);
    if ((v = json_object_get(e, "Te")) == NULL)
        return key_error(c, MOLQ_EKEY, name, "missing (0 for the ground "
                         "state)");
    if ((st = get_number(c, v, name, &te)) != MOLQ_OK)
        return st;
    snprintf(name, sizeof name, "%sdegeneracy", where);
    if ((v = json_object_get(e, "degeneracy")) != NULL &&
        (st = get_int(c, v, name, &g)) != MOLQ_OK)
        return st;
    if ((st = molq_spec_add_diatomic_state(s, te, g, &idx)) != MOLQ_OK)
        return st == MOLQ_ELIMIT
                   ? key_error(c, st, "diatomic_states", "at most 32 states")
                   : st;
    for (n = 0; n < NNAMED; n++) {
        if ((v = json_object_get(e, named[n].key)) == NULL)
            continue;
        snprintf(name, sizeof name, "%s%s", where, named[n].key);
        if ((st = get_number(c, v, name, &x)) != MOLQ_OK)
            return st;
        molq_spec_set_dunham(s, idx, named[n].k, named[n].l, named[n].sign * x);
        have_named = 1;
    }
    if ((v = json_object_get(e, "dunham")) != NULL) {
        snprintf(name, sizeof name, "%sdunham", where);
        if (have_named)
            return key_error(c, MOLQ_EKEY, name, "give either the Dunham "
                             "matrix or the named constants, not both");
        if ((st = read_dunham(c, s, idx, v, name)) != MOLQ_OK)
            return st;
    }
    if ((v = json_object_get(e, "rotational_weights")) != NULL) {
        double w[2];
        snprintf(name, sizeof name, "%srotational_weights", where);
        if (!json_is_array(v) || json_array_size(v) != 2)
            return key_error(c, MOLQ_ETYPE, name,
                             "expected [even-J weight, odd-J weight]");
        if ((st = get_number(c, json_array_get(v, 0), name, &w[0])) !=
                MOLQ_OK ||
            (st = get_number(c, json_array_get(v, 1), name, &w[1])) != MOLQ_OK)
            return st;
        molq_spec_set_rotational_weights(s, idx, w[0], w[1]);
    }
    if ((v = json_object_get(e, "label")) != NULL) {
        const char *text;
        snprintf(name, sizeof name, "%slabel", where);
        if ((st = get_string(c, v, name, &text)) != MOLQ_OK)
            return st;
    }
    return MOLQ_OK;
}

/* Keys of the level-sum model. */
static molq_status read_levels_model(ctx *c, json_t *e, molq_spec *s)
{
    json_t *v, *item;
    molq_status st;
    const char *text;
    double x;
    size_t i;
    if ((v = json_object_get(e, "model")) != NULL) {
        if ((st = get_string(c, v, "model", &text)) != MOLQ_OK)
            return st;
        if (strcmp(text, "rrho") == 0)
            molq_spec_set_model(s, MOLQ_MODEL_RRHO);
        else if (strcmp(text, "levels") == 0)
            molq_spec_set_model(s, MOLQ_MODEL_LEVELS);
        else
            return key_error(c, MOLQ_EVALUE, "model",
                             "must be \"rrho\" or \"levels\"");
    }
    if ((v = json_object_get(e, "dissociation_energy")) != NULL) {
        if ((st = get_number(c, v, "dissociation_energy", &x)) != MOLQ_OK)
            return st;
        molq_spec_set_dissociation_energy(s, x);
    }
    if ((v = json_object_get(e, "spin_isomers")) != NULL) {
        if ((st = get_string(c, v, "spin_isomers", &text)) != MOLQ_OK)
            return st;
        if (strcmp(text, "frozen") == 0) {
            item = json_object_get(e, "odd_fraction");
            if (item == NULL)
                return key_error(c, MOLQ_EKEY, "odd_fraction", "missing; a "
                                 "frozen mixture needs its odd-J fraction "
                                 "(0.75 for normal hydrogen)");
            if ((st = get_number(c, item, "odd_fraction", &x)) != MOLQ_OK)
                return st;
            molq_spec_set_spin_isomers_frozen(s, x);
        } else if (strcmp(text, "equilibrium") != 0) {
            return key_error(c, MOLQ_EVALUE, "spin_isomers",
                             "must be \"equilibrium\" or \"frozen\"");
        }
    }
    if (json_object_get(e, "odd_fraction") != NULL && !s->spin_frozen)
        return key_error(c, MOLQ_EKEY, "odd_fraction", "only meaningful with "
                         "\"spin_isomers\": \"frozen\"");
    if ((v = json_object_get(e, "anharmonicity")) != NULL &&
        (st = read_anharmonicity(c, s, v)) != MOLQ_OK)
        return st;
    if ((v = json_object_get(e, "torsions")) != NULL) {
        if (!json_is_array(v))
            return key_error(c, MOLQ_ETYPE, "torsions",
                             "expected an array of objects");
        json_array_foreach(v, i, item) {
            if ((st = read_torsion(c, s, item, i)) != MOLQ_OK)
                return st;
        }
    }
    if ((v = json_object_get(e, "diatomic_states")) != NULL) {
        if (!json_is_array(v))
            return key_error(c, MOLQ_ETYPE, "diatomic_states",
                             "expected an array of objects");
        json_array_foreach(v, i, item) {
            if ((st = read_state(c, s, item, i)) != MOLQ_OK)
                return st;
        }
    }
    return MOLQ_OK;
}

static molq_status read_entry(ctx *c, json_t *e, molq_spec *s)
{
    json_t *v;
    molq_status st;
    const char *text;
    double x;
    int i;

    if ((st = check_keys(c, e, entry_keys, "")) != MOLQ_OK)
        return st;
    if ((v = json_object_get(e, "formula")) != NULL) {
        if ((st = get_string(c, v, "formula", &text)) != MOLQ_OK ||
            (st = molq_spec_set_formula(s, text)) != MOLQ_OK)
            return st;
    }
    if ((v = json_object_get(e, "source")) != NULL) {
        if ((st = get_string(c, v, "source", &text)) != MOLQ_OK ||
            (st = molq_spec_set_source(s, text)) != MOLQ_OK)
            return st;
    }
    if ((v = json_object_get(e, "molar_mass")) != NULL) {
        if ((st = get_number(c, v, "molar_mass", &x)) != MOLQ_OK)
            return st;
        molq_spec_set_molar_mass(s, x * 1e-3); /* g/mol in the file */
    }
    v = json_object_get(e, "structure");
    if (v == NULL)
        return key_error(c, MOLQ_EKEY, "structure", "missing (atom, linear or "
                         "nonlinear)");
    if ((st = get_string(c, v, "structure", &text)) != MOLQ_OK)
        return st;
    if (strcmp(text, "atom") == 0)
        molq_spec_set_structure(s, MOLQ_ATOM);
    else if (strcmp(text, "linear") == 0)
        molq_spec_set_structure(s, MOLQ_LINEAR);
    else if (strcmp(text, "nonlinear") == 0)
        molq_spec_set_structure(s, MOLQ_NONLINEAR);
    else
        return key_error(c, MOLQ_EVALUE, "structure",
                         "must be \"atom\", \"linear\" or \"nonlinear\"");
    if ((v = json_object_get(e, "rotor")) != NULL) {
        if ((st = get_string(c, v, "rotor", &text)) != MOLQ_OK)
            return st;
        if (strcmp(text, "corrected") == 0)
            molq_spec_set_rotor(s, MOLQ_ROTOR_CORRECTED);
        else if (strcmp(text, "classical") == 0)
            molq_spec_set_rotor(s, MOLQ_ROTOR_CLASSICAL);
        else
            return key_error(c, MOLQ_EVALUE, "rotor",
                             "must be \"corrected\" or \"classical\"");
    }
    if ((v = json_object_get(e, "symmetry_number")) != NULL) {
        if ((st = get_int(c, v, "symmetry_number", &i)) != MOLQ_OK)
            return st;
        molq_spec_set_symmetry_number(s, i);
    }
    if ((v = json_object_get(e, "rotational_constants")) != NULL) {
        double b[3];
        size_t k;
        json_t *item;
        if (!json_is_array(v))
            return key_error(c, MOLQ_ETYPE, "rotational_constants",
                             "expected an array of numbers");
        if (json_array_size(v) > 3)
            return key_error(c, MOLQ_EVALUE, "rotational_constants",
                             "at most 3 values (A, B, C)");
        json_array_foreach(v, k, item) {
            if ((st = get_number(c, item, "rotational_constants", &b[k])) !=
                MOLQ_OK)
                return st;
        }
        molq_spec_set_rotational_constants(s, b, json_array_size(v));
    }
    if ((v = json_object_get(e, "vibrations")) != NULL &&
        (st = read_pairs(c, s, v, "vibrations", "wavenumber",
                         molq_spec_add_vibration, "harmonic",
                         molq_spec_set_harmonic_wavenumber)) != MOLQ_OK)
        return st;
    if ((v = json_object_get(e, "electronic_levels")) != NULL &&
        (st = read_pairs(c, s, v, "electronic_levels", "energy",
                         molq_spec_add_electronic_level, NULL, NULL)) !=
            MOLQ_OK)
        return st;
    if ((v = json_object_get(e, "formation_enthalpy_298")) != NULL) {
        if ((st = get_number(c, v, "formation_enthalpy_298", &x)) != MOLQ_OK)
            return st;
        molq_spec_set_formation_enthalpy(s, x);
    }
    return read_levels_model(c, e, s);
}

void molq_specs_free(molq_spec **specs, size_t n)
{
    size_t i;
    if (specs == NULL)
        return;
    for (i = 0; i < n; i++)
        molq_spec_free(specs[i]);
    free(specs);
}

static const char *const top_keys[] = {"schema_version", "description",
                                       "species", NULL};

static molq_status read_root(ctx *c, json_t *root, molq_spec **specs,
                             size_t *n)
{
    json_t *list, *v, *e;
    size_t i;
    molq_status st;
    if (!json_is_object(root))
        return key_error(c, MOLQ_ETYPE, "(top level)",
                         "expected an object {\"species\": [...]}");
    if ((st = check_keys(c, root, top_keys, "")) != MOLQ_OK)
        return st;
    if ((v = json_object_get(root, "schema_version")) != NULL) {
        int ver;
        if ((st = get_int(c, v, "schema_version", &ver)) != MOLQ_OK)
            return st;
        if (ver != SCHEMA_VERSION)
            return key_error(c, MOLQ_EVALUE, "schema_version",
                             "this library reads schema version 1");
    }
    list = json_object_get(root, "species");
    if (list == NULL)
        return key_error(c, MOLQ_EKEY, "species", "missing");
    if (!json_is_array(list))
        return key_error(c, MOLQ_ETYPE, "species", "expected an array");
    json_array_foreach(list, i, e) {
        json_t *name;
        const char *text;
        snprintf(c->who, sizeof c->who, "species #%zu", i + 1);
        if (!json_is_object(e))
            return key_error(c, MOLQ_ETYPE, "(entry)", "expected an object");
        name = json_object_get(e, "name");
        if (name == NULL)
            return key_error(c, MOLQ_EKEY, "name", "missing");
        if ((st = get_string(c, name, "name", &text)) != MOLQ_OK)
            return st;
        snprintf(c->who, sizeof c->who, "species '%.255s'", text);
        if ((st = molq_spec_new(text, &specs[i])) != MOLQ_OK)
            return st;
        *n = i + 1;
        if ((st = read_entry(c, e, specs[i])) != MOLQ_OK)
            return st;
    }
    return MOLQ_OK;
}

molq_status molq_json_read_specs(const char *text, size_t len,
                                 molq_spec ***specs_out, size_t *n_out,
                                 char *err, size_t errlen)
{
    json_error_t jerr;
    json_t *root, *list;
    molq_spec **specs = NULL;
    size_t n = 0, count = 0;
    molq_status st;
    ctx c;
    c.err = err;
    c.errlen = errlen;
    snprintf(c.who, sizeof c.who, "species file");

    if (len > MOLQ_MAX_FILE_BYTES) {
        molq_errf(err, errlen, "species file: %zu bytes is over the limit of "
                  "%u", len, MOLQ_MAX_FILE_BYTES);
        return MOLQ_ELIMIT;
    }
    root = json_loadb(text, len, JSON_REJECT_DUPLICATES, &jerr);
    if (root == NULL) {
        molq_errf(err, errlen, "species file: line %d, column %d (byte %d): "
                  "%s", jerr.line, jerr.column, jerr.position, jerr.text);
        return MOLQ_ESYNTAX;
    }
    list = json_is_object(root) ? json_object_get(root, "species") : NULL;
    if (json_is_array(list))
        count = json_array_size(list);
    if (count > MOLQ_MAX_SPECIES) {
        json_decref(root);
        molq_errf(err, errlen, "species file: %zu species is over the limit "
                  "of %d", count, MOLQ_MAX_SPECIES);
        return MOLQ_ELIMIT;
    }
    if (count > 0 && (specs = calloc(count, sizeof *specs)) == NULL) {
        json_decref(root);
        return MOLQ_ENOMEM;
    }
    st = read_root(&c, root, specs, &n);
    json_decref(root);
    if (st != MOLQ_OK) {
        molq_specs_free(specs, n);
        return st;
    }
    *specs_out = specs;
    *n_out = n;
    return MOLQ_OK;
}
