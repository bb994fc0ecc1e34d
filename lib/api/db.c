/* fstat and fileno are POSIX */
#define _POSIX_C_SOURCE 200809L

/* Species databases: read JSON (lib/data), validate and build each species,
 * reject duplicate names.  All-or-nothing: on any error nothing survives. */
#include <errno.h>
#include <math.h>
#include <stdio.h>
#include <sys/stat.h>
#include <sys/types.h>
#include <stdlib.h>
#include <string.h>

#include "core/constants.h"
#include "core/errbuf.h"
#include "data/json_reader.h"
#include "species/species.h"
#include "thermo/thermo.h"

extern const char molq_builtin_json[];
extern const size_t molq_builtin_json_len;

/* Work budget of one file: levels kept by all its level-sum models. */
#define MOLQ_MAX_FILE_LEVELS 4000000u

/* Duplicate names in O(n log n): sort (name, index) records and compare
 * neighbours; report the same pair a pairwise scan in file order would
 * (the duplicate with the smallest index, against its first occurrence).
 * The records carry their own keys: no shared state, safe in threads. */
typedef struct name_rec {
    const char *name;
    size_t idx;
} name_rec;

static int cmp_rec(const void *a, const void *b)
{
    const name_rec *x = a, *y = b;
    int c = strcmp(x->name, y->name);
    return c != 0 ? c : (x->idx > y->idx) - (x->idx < y->idx);
}

static molq_status find_duplicate(molq_spec *const *specs, size_t n,
                                  size_t *first, size_t *dup)
{
    name_rec *r;
    size_t k, best = (size_t)-1, best_first = 0;
    if (n < 2)
        return MOLQ_OK;
    r = malloc(n * sizeof *r);
    if (r == NULL)
        return MOLQ_ENOMEM;
    for (k = 0; k < n; k++) {
        r[k].name = specs[k]->name;
        r[k].idx = k;
    }
    qsort(r, n, sizeof *r, cmp_rec);
    for (k = 1; k < n; k++) {
        int group_start = k < 2 || strcmp(r[k - 1].name, r[k - 2].name) != 0;
        if (group_start && strcmp(r[k].name, r[k - 1].name) == 0 &&
            r[k].idx < best) {
            best = r[k].idx;
            best_first = r[k - 1].idx;
        }
    }
    free(r);
    if (best == (size_t)-1)
        return MOLQ_OK;
    *first = best_first;
    *dup = best;
    return MOLQ_EDUPLICATE;
}

struct molq_db_s {
    size_t n;
    molq_species **sp;
    molq_warnlist warnings; /* the file's, then each species' in order */
};

void molq_db_free(molq_db *db)
{
    size_t i;
    if (db == NULL)
        return;
    for (i = 0; i < db->n; i++)
        molq_species_destroy(db->sp[i]);
    free(db->sp);
    molq_warn_free(&db->warnings);
    free(db);
}

/* Dissociation energy against the formation enthalpies (a plausibility
 * warning, never an error).  For a diatomic AB with formation_enthalpy_298
 * and dissociation_energy, when the file also holds the atoms A and B
 * (found by formula) with formation enthalpies, the reaction AB -> A + B
 * gives at 298.15 K
 *   D298 = dfH(A) + dfH(B) - dfH(AB)
 * and at 0 K, with each species' own H(298.15 K) - H(0),
 *   D0 = D298 - [(H298-H0)(A) + (H298-H0)(B) - (H298-H0)(AB)]
 * (common practice: Hess's law and Kirchhoff's relation).  A singly charged
 * ion AB+ (or AB-) has two limits, A+ + B and A + B+, found by the formulas
 * "A+" and "B+"; dissociation_energy bounds the ground state's levels, so
 * it is compared with the lower of the limits the file holds (NO+:
 * N + O+ lies 0.92 eV below N+ + O, the difference of the atoms'
 * ionisation energies).  No electron appears in either reaction, so the
 * ion convention of the formation enthalpies (NIST-JANAF: the electron gas
 * a reference element) cancels.  Tolerance: 1 % of D0 or 1 kJ/mol,
 * whichever is larger.  Measured: the built-in N2, O2, CO, NO, OH, H2
 * agree within 0.16 % (NO, 0.98 kJ/mol; the others within 0.03 %) with N,
 * O and JANAF 1998 C and H atoms; the tolerance is wider than the spread of
 * published formation enthalpies (NO: JANAF 90.29 against about 91.1
 * kJ/mol elsewhere) and narrower than the zero-point energy of these
 * molecules (1.2-10 % of D0), so a well depth De typed for D0, or a wrong
 * unit, is caught. */
#define D0_REL_TOL 0.01
#define D0_ABS_TOL 1000.0 /* J/mol */
#define CM1_TO_J_PER_MOL (100.0 * MOLQ_H_PLANCK * MOLQ_C_LIGHT * MOLQ_N_AVOGADRO)

/* The atom of element `symbol` with the given charge (-1, 0, +1), by
 * formula ("N", "N+", "N-"), with a formation enthalpy; NULL if absent. */
static const molq_species *db_atom(const molq_db *db, const char *symbol,
                                   int charge)
{
    const molq_species *a;
    char f[16];
    if (strlen(symbol) > 4)
        return NULL;
    snprintf(f, sizeof f, "%s%s", symbol,
             charge > 0 ? "+" : charge < 0 ? "-" : "");
    if (molq_db_find_formula(db, f, &a) != MOLQ_OK ||
        a->structure != MOLQ_ATOM || !a->has_formation_enthalpy ||
        a->comp.charge != charge)
        return NULL;
    return a;
}

/* D0 (J/mol) of AB -> A(charge qa) + B(charge qb) from the formation
 * enthalpies; 0 with *a, *b NULL when the file lacks an atom. */
static double d0_limit(const molq_db *db, const molq_species *sp, int qa,
                       int qb, const molq_species **a,
                       const molq_species **b)
{
    const molq_composition *c = &sp->comp;
    *a = db_atom(db, c->el[0].symbol, qa);
    *b = db_atom(db, c->el[c->n - 1].symbol, qb);
    if (*a == NULL || *b == NULL) {
        *a = *b = NULL;
        return 0.0;
    }
    return (*a)->formation_enthalpy + (*b)->formation_enthalpy -
           sp->formation_enthalpy -
           ((*a)->h298_minus_h0 + (*b)->h298_minus_h0 - sp->h298_minus_h0);
}

static molq_status check_d0(molq_db *db, char *err, size_t errlen)
{
    size_t i;
    for (i = 0; i < db->n; i++) {
        molq_species *sp = db->sp[i];
        const molq_composition *c = &sp->comp;
        const molq_species *a = NULL, *b = NULL, *a2, *b2;
        double d0h = 0.0, d2, d0g, tol;
        if (!sp->has_formation_enthalpy || !sp->spec->has_d0 ||
            c->charge < -1 || c->charge > 1 ||
            !((c->n == 1 && c->el[0].count == 2) ||
              (c->n == 2 && c->el[0].count == 1 && c->el[1].count == 1)))
            continue;
        /* neutral: A + B; ion: A(q) + B, then A + B(q), the lower wins */
        d0h = d0_limit(db, sp, c->charge, 0, &a, &b);
        if (c->charge != 0) {
            d2 = d0_limit(db, sp, 0, c->charge, &a2, &b2);
            if (a2 != NULL && (a == NULL || d2 < d0h)) {
                d0h = d2;
                a = a2;
                b = b2;
            }
        }
        if (a == NULL || b == NULL)
            continue;
        d0g = sp->spec->d0 * CM1_TO_J_PER_MOL;
        tol = D0_REL_TOL * d0g > D0_ABS_TOL ? D0_REL_TOL * d0g : D0_ABS_TOL;
        if (fabs(d0h - d0g) > tol) {
            molq_warnlist one = {0};
            molq_status st = molq_warn(
                &one, "species '%s': field 'dissociation_energy': %g cm^-1 = "
                "%.1f kJ/mol differs by %.1f kJ/mol from the %.1f kJ/mol the "
                "formation enthalpies of '%s', '%s' and '%s' give (D0 = "
                "dfH(A) + dfH(B) - dfH(AB) at 298.15 K less the H(298.15 K) - "
                "H(0) difference; expected within %g %% or %g kJ/mol)",
                sp->name, sp->spec->d0, d0g * 1e-3, (d0h - d0g) * 1e-3,
                d0h * 1e-3, a->name, b->name, sp->name, 100.0 * D0_REL_TOL,
                D0_ABS_TOL * 1e-3);
            if (st == MOLQ_OK)
                st = molq_warn_append(&sp->warnings, &one);
            if (st == MOLQ_OK)
                st = molq_warn_append(&db->warnings, &one);
            molq_warn_free(&one);
            if (st != MOLQ_OK) {
                molq_errf(err, errlen, "species file: out of memory");
                return st;
            }
        }
    }
    return MOLQ_OK;
}

molq_status molq_db_read_string(const char *json, size_t len, molq_db **out,
                                char *err, size_t errlen)
{
    molq_spec **specs = NULL;
    size_t n = 0, i, j, levels = 0;
    molq_status st;
    molq_db *db;
    molq_warnlist warn = {0};
    if (json == NULL || out == NULL) {
        molq_errf(err, errlen, "molq_db_read_string: NULL argument");
        return MOLQ_EARG;
    }
    if ((st = molq_json_read_specs(json, len, &specs, &n, &warn, err,
                                   errlen)) != MOLQ_OK) {
        molq_warn_free(&warn);
        return st;
    }
    db = calloc(1, sizeof *db);
    if (db != NULL)
        db->warnings = warn; /* owned by db (freed with it) from here */
    else
        molq_warn_free(&warn);
    if (db == NULL || (n > 0 && (db->sp = calloc(n, sizeof *db->sp)) == NULL)) {
        st = MOLQ_ENOMEM;
        molq_errf(err, errlen, "species file: out of memory");
        goto fail;
    }
    st = find_duplicate(specs, n, &j, &i);
    if (st == MOLQ_EDUPLICATE)
        molq_errf(err, errlen, "species '%s': field 'name': duplicate of "
                  "species #%zu", specs[i]->name, j + 1);
    if (st != MOLQ_OK)
        goto fail;
    for (i = 0; i < n; i++) {
        st = molq_species_create(specs[i], &db->sp[i], err, errlen);
        if (st != MOLQ_OK)
            goto fail;
        db->n = i + 1;
        if (molq_warn_append(&db->warnings, &db->sp[i]->warnings) !=
            MOLQ_OK) {
            st = MOLQ_ENOMEM;
            molq_errf(err, errlen, "species file: out of memory");
            goto fail;
        }
        levels += molq_species_level_count(db->sp[i]);
        if (levels > MOLQ_MAX_FILE_LEVELS) {
            molq_errf(err, errlen, "species '%s': the file's level sums hold "
                      "more than %u levels in all (the work budget of one "
                      "file)", specs[i]->name, MOLQ_MAX_FILE_LEVELS);
            st = MOLQ_ELIMIT;
            goto fail;
        }
    }
    if ((st = check_d0(db, err, errlen)) != MOLQ_OK)
        goto fail;
    molq_specs_free(specs, n);
    *out = db;
    return MOLQ_OK;
fail:
    molq_specs_free(specs, n);
    molq_db_free(db);
    return st;
}

molq_status molq_db_read_file(const char *path, molq_db **out, char *err,
                              size_t errlen)
{
    FILE *f;
    char *buf;
    size_t cap = 65536, len = 0, got;
    molq_status st;
    if (path == NULL || out == NULL) {
        molq_errf(err, errlen, "molq_db_read_file: NULL argument");
        return MOLQ_EARG;
    }
    f = fopen(path, "rb");
    if (f == NULL) {
        molq_errf(err, errlen, "%s: cannot open for reading: %s", path,
                  strerror(errno));
        return MOLQ_EIO;
    }
    {
        struct stat sb;
        if (fstat(fileno(f), &sb) == 0 && S_ISREG(sb.st_mode) &&
            sb.st_size > (off_t)MOLQ_MAX_FILE_BYTES) {
            fclose(f);
            molq_errf(err, errlen, "%s: larger than the limit of %u bytes",
                      path, MOLQ_MAX_FILE_BYTES);
            return MOLQ_ELIMIT;
        }
    }
    buf = malloc(cap);
    while (buf != NULL && (got = fread(buf + len, 1, cap - len, f)) > 0) {
        len += got;
        if (len > MOLQ_MAX_FILE_BYTES)
            break;
        if (len == cap) {
            /* never more than the limit + 1 byte (enough to know) */
            char *nb = realloc(buf, cap * 2 > MOLQ_MAX_FILE_BYTES + 1u
                                        ? MOLQ_MAX_FILE_BYTES + 1u
                                        : cap * 2);
            if (nb == NULL)
                free(buf);
            buf = nb;
            cap = cap * 2 > MOLQ_MAX_FILE_BYTES + 1u ? MOLQ_MAX_FILE_BYTES + 1u
                                                     : cap * 2;
        }
    }
    if (buf == NULL) {
        fclose(f);
        molq_errf(err, errlen, "%s: out of memory", path);
        return MOLQ_ENOMEM;
    }
    if (ferror(f)) {
        fclose(f);
        free(buf);
        molq_errf(err, errlen, "%s: read error", path);
        return MOLQ_EIO;
    }
    fclose(f);
    if (len > MOLQ_MAX_FILE_BYTES) {
        free(buf);
        molq_errf(err, errlen, "%s: larger than the limit of %u bytes", path,
                  MOLQ_MAX_FILE_BYTES);
        return MOLQ_ELIMIT;
    }
    st = molq_db_read_string(buf, len, out, err, errlen);
    free(buf);
    return st;
}

molq_status molq_db_builtin(molq_db **out, char *err, size_t errlen)
{
    return molq_db_read_string(molq_builtin_json, molq_builtin_json_len, out,
                               err, errlen);
}

size_t molq_db_count(const molq_db *db)
{
    return db ? db->n : 0;
}

const molq_species *molq_db_species(const molq_db *db, size_t index)
{
    return (db != NULL && index < db->n) ? db->sp[index] : NULL;
}

/* The first species whose name (by_formula 0) or formula (1) is `key`. */
static molq_status find_by(const molq_db *db, const char *key, int by_formula,
                           const molq_species **out)
{
    size_t i;
    if (db == NULL || key == NULL || out == NULL)
        return MOLQ_EARG;
    for (i = 0; i < db->n; i++)
        if (strcmp(by_formula ? db->sp[i]->formula : db->sp[i]->name, key) ==
            0) {
            *out = db->sp[i];
            return MOLQ_OK;
        }
    return MOLQ_ENOTFOUND;
}

molq_status molq_db_find(const molq_db *db, const char *name,
                         const molq_species **out)
{
    return find_by(db, name, 0, out);
}

size_t molq_db_warning_count(const molq_db *db)
{
    return db ? db->warnings.n : 0;
}

const char *molq_db_warning(const molq_db *db, size_t index)
{
    return db ? molq_warn_get(&db->warnings, index) : NULL;
}

molq_status molq_db_find_formula(const molq_db *db, const char *formula,
                                 const molq_species **out)
{
    /* "" is what molq_species_formula reports for a species without a
     * formula; it is no formula and finds nothing. */
    if (db != NULL && formula != NULL && out != NULL && formula[0] == '\0')
        return MOLQ_ENOTFOUND;
    return find_by(db, formula, 1, out);
}
