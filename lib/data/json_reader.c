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
 * validated_range ([T_low, T_high], K),
 * model ("rrho" | "levels"), dissociation_energy (number, cm^-1),
 * spin_isomers ("equilibrium" | "frozen"), odd_fraction (number),
 * diatomic_states (array of STATE).
 * STATE keys: label (string), Te (cm^-1, required), degeneracy (integer,
 * default 1), rotational_weights ([even, odd]), spin_orbit (A, cm^-1: makes
 * the state a 2Pi state with half-integer J, Hill-Van Vleck term values;
 * degeneracy then 4 = spin x Lambda doubling), and the term values either
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
 * indices into vibrations (cm^-1).  Nonlinear molecules: rotational_weights
 * ({"ee", "eo", "oe", "oo"}: (Ka, Kc) class weights) or rotational_spin
 * ({"group": "C3v" | "Td", "nuclear_spin": I}).
 * geometry (array of at most 64 {"element": symbol, "xyz": [x, y, z]},
 * Angstrom): the equilibrium structure, checked against the rotational
 * constants (a warning) and against the formula (an error). */
#include <jansson.h>
#include <stdlib.h>
#include <string.h>

#include "core/errbuf.h"
#include "data/json_reader.h"

#define SCHEMA_VERSION 1

#include "data/json_common.h"

/* An array of {value_key, "degeneracy"} objects appended with `add`. */
static molq_status read_pairs(molq_json_ctx *c, molq_spec *s, json_t *arr,
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
        return molq_json_key_error(c, MOLQ_ETYPE, field, "expected an array of objects");
    json_array_foreach(arr, i, item) {
        double value;
        int deg = 1;
        json_t *v;
        snprintf(name, sizeof name, "%s[%zu].", field, i);
        if (!json_is_object(item))
            return molq_json_key_error(c, MOLQ_ETYPE, field,
                             "expected an array of objects");
        if ((st = molq_json_check_keys(c, item, allowed, name)) != MOLQ_OK)
            return st;
        snprintf(name, sizeof name, "%s[%zu].%s", field, i, value_key);
        v = json_object_get(item, value_key);
        if (v == NULL)
            return molq_json_key_error(c, MOLQ_EKEY, name, "missing");
        if ((st = molq_json_number(c, v, name, &value)) != MOLQ_OK)
            return st;
        v = json_object_get(item, "degeneracy");
        snprintf(name, sizeof name, "%s[%zu].degeneracy", field, i);
        if (v != NULL && (st = molq_json_int(c, v, name, 1, MOLQ_MAX_DEGENERACY, &deg)) != MOLQ_OK)
            return st;
        st = add(s, value, deg);
        if (st == MOLQ_ELIMIT)
            return molq_json_key_error(c, st, field, "too many entries (see the size "
                             "limits in the README)");
        if (st != MOLQ_OK)
            return st;
        if (extra_key != NULL &&
            (v = json_object_get(item, extra_key)) != NULL) {
            snprintf(name, sizeof name, "%s[%zu].%s", field, i, extra_key);
            if ((st = molq_json_number(c, v, name, &value)) != MOLQ_OK ||
                (st = extra(s, i, value)) != MOLQ_OK)
                return st;
        }
    }
    return MOLQ_OK;
}

/* "geometry": [{"element": "O", "xyz": [x, y, z]}, ...] in Angstrom. */
static molq_status read_geometry(molq_json_ctx *c, molq_spec *s, json_t *arr)
{
    static const char *const allowed[] = {"element", "xyz", NULL};
    char name[64], what[96];
    size_t i, k;
    json_t *item;
    molq_status st;
    if (!json_is_array(arr))
        return molq_json_key_error(c, MOLQ_ETYPE, "geometry",
                                   "expected an array of {\"element\", "
                                   "\"xyz\"} objects");
    if (json_array_size(arr) > MOLQ_MAX_GEOMETRY_ATOMS) {
        snprintf(what, sizeof what, "at most %d atoms (got %zu)",
                 MOLQ_MAX_GEOMETRY_ATOMS, json_array_size(arr));
        return molq_json_key_error(c, MOLQ_ELIMIT, "geometry", what);
    }
    json_array_foreach(arr, i, item) {
        const char *el;
        double x[3];
        json_t *v;
        snprintf(name, sizeof name, "geometry[%zu]", i);
        if (!json_is_object(item))
            return molq_json_key_error(c, MOLQ_ETYPE, name,
                                       "expected an object {\"element\", "
                                       "\"xyz\"}");
        snprintf(name, sizeof name, "geometry[%zu].", i);
        if ((st = molq_json_check_keys(c, item, allowed, name)) != MOLQ_OK)
            return st;
        snprintf(name, sizeof name, "geometry[%zu].element", i);
        if ((v = json_object_get(item, "element")) == NULL)
            return molq_json_key_error(c, MOLQ_EKEY, name, "missing");
        if ((st = molq_json_string(c, v, name, &el)) != MOLQ_OK)
            return st;
        snprintf(name, sizeof name, "geometry[%zu].xyz", i);
        if ((v = json_object_get(item, "xyz")) == NULL)
            return molq_json_key_error(c, MOLQ_EKEY, name,
                                       "missing ([x, y, z] in Angstrom)");
        if (!json_is_array(v) || json_array_size(v) != 3)
            return molq_json_key_error(c, MOLQ_ETYPE, name,
                                       "expected [x, y, z] in Angstrom");
        for (k = 0; k < 3; k++)
            if ((st = molq_json_number(c, json_array_get(v, k), name,
                                       &x[k])) != MOLQ_OK)
                return st;
        if ((st = molq_spec_add_geometry_atom(s, el, x[0], x[1], x[2])) !=
            MOLQ_OK)
            return st;
    }
    return MOLQ_OK;
}

static const char *const entry_keys[] = {
    "name", "formula", "molar_mass", "structure", "symmetry_number",
    "rotational_constants", "rotor", "vibrations", "electronic_levels",
    "formation_enthalpy_298", "source", "validated_range", "geometry",
    NULL};

static molq_status read_entry(molq_json_ctx *c, json_t *e, molq_spec *s)
{
    json_t *v;
    molq_status st;
    const char *text;
    double x;
    int i;

    {
        /* the core keys here, the levels-model keys in json_levels.c */
        const char *key;
        json_t *val;
        json_object_foreach(e, key, val) {
            const char *const *a;
            int ok = 0;
            (void)val;
            for (a = entry_keys; *a != NULL && !ok; a++)
                ok = strcmp(*a, key) == 0;
            for (a = molq_json_levels_keys; *a != NULL && !ok; a++)
                ok = strcmp(*a, key) == 0;
            if (!ok)
                return molq_json_unknown_key(c, key, key, entry_keys,
                                             molq_json_levels_keys);
        }
    }
    if ((v = json_object_get(e, "formula")) != NULL) {
        if ((st = molq_json_string(c, v, "formula", &text)) != MOLQ_OK ||
            (st = molq_spec_set_formula(s, text)) != MOLQ_OK)
            return st;
    }
    if ((v = json_object_get(e, "source")) != NULL) {
        if ((st = molq_json_string(c, v, "source", &text)) != MOLQ_OK ||
            (st = molq_spec_set_source(s, text)) != MOLQ_OK)
            return st;
    }
    if ((v = json_object_get(e, "molar_mass")) != NULL) {
        if ((st = molq_json_number(c, v, "molar_mass", &x)) != MOLQ_OK)
            return st;
        molq_spec_set_molar_mass_g_per_mol(s, x); /* g/mol in the file */
    }
    v = json_object_get(e, "structure");
    if (v == NULL)
        return molq_json_key_error(c, MOLQ_EKEY, "structure", "missing (atom, linear or "
                         "nonlinear)");
    if ((st = molq_json_string(c, v, "structure", &text)) != MOLQ_OK)
        return st;
    if (strcmp(text, "atom") == 0)
        molq_spec_set_structure(s, MOLQ_ATOM);
    else if (strcmp(text, "linear") == 0)
        molq_spec_set_structure(s, MOLQ_LINEAR);
    else if (strcmp(text, "nonlinear") == 0)
        molq_spec_set_structure(s, MOLQ_NONLINEAR);
    else
        return molq_json_key_error(c, MOLQ_EVALUE, "structure",
                         "must be \"atom\", \"linear\" or \"nonlinear\"");
    if ((v = json_object_get(e, "rotor")) != NULL) {
        if ((st = molq_json_string(c, v, "rotor", &text)) != MOLQ_OK)
            return st;
        if (strcmp(text, "corrected") == 0)
            molq_spec_set_rotor(s, MOLQ_ROTOR_CORRECTED);
        else if (strcmp(text, "classical") == 0)
            molq_spec_set_rotor(s, MOLQ_ROTOR_CLASSICAL);
        else
            return molq_json_key_error(c, MOLQ_EVALUE, "rotor",
                             "must be \"corrected\" or \"classical\"");
    }
    if ((v = json_object_get(e, "symmetry_number")) != NULL) {
        if ((st = molq_json_int(c, v, "symmetry_number", 1,
                                MOLQ_MAX_SYMMETRY_NUMBER, &i)) != MOLQ_OK)
            return st;
        molq_spec_set_symmetry_number(s, i);
    }
    if ((v = json_object_get(e, "rotational_constants")) != NULL) {
        double b[3];
        size_t k;
        json_t *item;
        if (!json_is_array(v))
            return molq_json_key_error(c, MOLQ_ETYPE, "rotational_constants",
                             "expected an array of numbers");
        if (json_array_size(v) > 3)
            return molq_json_key_error(c, MOLQ_EVALUE, "rotational_constants",
                             "at most 3 values (A, B, C)");
        json_array_foreach(v, k, item) {
            if ((st = molq_json_number(c, item, "rotational_constants", &b[k])) !=
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
        if ((st = molq_json_number(c, v, "formation_enthalpy_298", &x)) != MOLQ_OK)
            return st;
        molq_spec_set_formation_enthalpy(s, x);
    }
    if ((v = json_object_get(e, "validated_range")) != NULL) {
        double r[2];
        if (!json_is_array(v) || json_array_size(v) != 2)
            return molq_json_key_error(c, MOLQ_ETYPE, "validated_range",
                                       "expected [T_low, T_high] in K");
        if ((st = molq_json_number(c, json_array_get(v, 0), "validated_range",
                                   &r[0])) != MOLQ_OK ||
            (st = molq_json_number(c, json_array_get(v, 1), "validated_range",
                                   &r[1])) != MOLQ_OK)
            return st;
        molq_spec_set_validated_range(s, r[0], r[1]);
    }
    if ((v = json_object_get(e, "geometry")) != NULL &&
        (st = read_geometry(c, s, v)) != MOLQ_OK)
        return st;
    return molq_json_read_levels(c, e, s);
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

static molq_status read_root(molq_json_ctx *c, json_t *root, molq_spec **specs,
                             size_t *n, molq_warnlist *warn)
{
    json_t *list, *v, *e;
    size_t i;
    molq_status st;
    if (!json_is_object(root))
        return molq_json_key_error(c, MOLQ_ETYPE, "(top level)",
                         "expected an object {\"species\": [...]}");
    if ((st = molq_json_check_keys(c, root, top_keys, "")) != MOLQ_OK)
        return st;
    if ((v = json_object_get(root, "schema_version")) != NULL) {
        int ver;
        if ((st = molq_json_int(c, v, "schema_version", 1, 1000000, &ver)) != MOLQ_OK)
            return st;
        if (ver != SCHEMA_VERSION)
            return molq_json_key_error(c, MOLQ_EVALUE, "schema_version",
                             "this library reads schema version 1");
    } else if (warn != NULL &&
               molq_warn(warn, "species file: field 'schema_version': missing; "
                         "read as version 1 (add \"schema_version\": 1 so a "
                         "later molq can tell the format)") != MOLQ_OK) {
        return MOLQ_ENOMEM;
    }
    list = json_object_get(root, "species");
    if (list == NULL)
        return molq_json_key_error(c, MOLQ_EKEY, "species", "missing");
    if (!json_is_array(list))
        return molq_json_key_error(c, MOLQ_ETYPE, "species", "expected an array");
    json_array_foreach(list, i, e) {
        json_t *name;
        const char *text;
        snprintf(c->who, sizeof c->who, "species #%zu", i + 1);
        if (!json_is_object(e))
            return molq_json_key_error(c, MOLQ_ETYPE, "(entry)", "expected an object");
        name = json_object_get(e, "name");
        if (name == NULL)
            return molq_json_key_error(c, MOLQ_EKEY, "name", "missing");
        if ((st = molq_json_string(c, name, "name", &text)) != MOLQ_OK)
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
                                 molq_warnlist *warn, char *err, size_t errlen)
{
    json_error_t jerr;
    json_t *root, *list;
    molq_spec **specs = NULL;
    size_t n = 0, count = 0;
    molq_status st;
    molq_json_ctx c;
    c.err = err;
    c.errlen = errlen;
    snprintf(c.who, sizeof c.who, "species file");

    if (len > MOLQ_MAX_FILE_BYTES) {
        molq_errf(err, errlen, "species file: %zu bytes is over the limit of "
                  "%u", len, MOLQ_MAX_FILE_BYTES);
        return MOLQ_ELIMIT;
    }
    /* a UTF-8 byte-order mark (written by some editors) is not JSON but
     * carries no meaning in UTF-8: skip it */
    if (len >= 3 && memcmp(text, "\xEF\xBB\xBF", 3) == 0) {
        text += 3;
        len -= 3;
    }
    root = json_loadb(text, len, JSON_REJECT_DUPLICATES, &jerr);
    /* jansson reports most allocation failures with their own code, and a
     * failure before it starts lexing with no text at all (a syntax error
     * always has one) */
    if (root == NULL && (json_error_code(&jerr) == json_error_out_of_memory ||
                         (jerr.line == -1 && jerr.text[0] == '\0'))) {
        molq_errf(err, errlen, "species file: out of memory");
        return MOLQ_ENOMEM;
    }
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
    st = read_root(&c, root, specs, &n, warn);
    json_decref(root);
    if (st != MOLQ_OK) {
        molq_specs_free(specs, n);
        return st;
    }
    *specs_out = specs;
    *n_out = n;
    return MOLQ_OK;
}
