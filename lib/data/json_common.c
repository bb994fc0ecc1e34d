/* Helpers shared by the species-file readers. */
#include <math.h>
#include <stdio.h>
#include <string.h>

#include "core/errbuf.h"
#include "data/json_common.h"

molq_status molq_json_key_error(molq_json_ctx *c, molq_status code, const char *field,
                             const char *what)
{
    molq_errf(c->err, c->errlen, "%s: field '%s': %s", c->who, field, what);
    return code;
}

/* Edit distance (insertions, deletions, substitutions, and swaps of two
 * neighbours), capped: keys are short, so a small fixed table does. */
#define KEY_MAX 48
static size_t distance(const char *a, const char *b)
{
    size_t la = strlen(a), lb = strlen(b), i, j;
    size_t d[KEY_MAX + 1][KEY_MAX + 1];
    if (la > KEY_MAX || lb > KEY_MAX)
        return (size_t)-1;
    for (i = 0; i <= la; i++)
        d[i][0] = i;
    for (j = 0; j <= lb; j++)
        d[0][j] = j;
    for (i = 1; i <= la; i++)
        for (j = 1; j <= lb; j++) {
            size_t best = d[i - 1][j - 1] + (a[i - 1] != b[j - 1]);
            if (d[i - 1][j] + 1 < best)
                best = d[i - 1][j] + 1;
            if (d[i][j - 1] + 1 < best)
                best = d[i][j - 1] + 1;
            if (i > 1 && j > 1 && a[i - 1] == b[j - 2] &&
                a[i - 2] == b[j - 1] && d[i - 2][j - 2] + 1 < best)
                best = d[i - 2][j - 2] + 1;
            d[i][j] = best;
        }
    return d[la][lb];
}

static void nearest_in(const char *key, const char *const *list,
                       const char **best, size_t *bestd)
{
    for (; list != NULL && *list != NULL; list++) {
        size_t dd = distance(key, *list);
        if (dd < *bestd) {
            *bestd = dd;
            *best = *list;
        }
    }
}

molq_status molq_json_unknown_key(molq_json_ctx *c, const char *field,
                                  const char *key, const char *const *a,
                                  const char *const *b)
{
    const char *best = NULL;
    size_t bestd = (size_t)-1, len = strlen(key);
    nearest_in(key, a, &best, &bestd);
    nearest_in(key, b, &best, &bestd);
    /* a suggestion only when it is close: a third of the key, at least 2 */
    if (best != NULL && bestd <= (len / 3 > 2 ? len / 3 : 2)) {
        char what[128];
        snprintf(what, sizeof what, "unknown key; did you mean '%s'?", best);
        return molq_json_key_error(c, MOLQ_EKEY, field, what);
    }
    return molq_json_key_error(c, MOLQ_EKEY, field,
                               "unknown key (the README lists the valid "
                               "keys)");
}

/* Reject keys not in the NULL-terminated list `allowed`. */
molq_status molq_json_check_keys(molq_json_ctx *c, json_t *obj, const char *const *allowed,
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
            char field[160];
            snprintf(field, sizeof field, "%s%s", where, key);
            return molq_json_unknown_key(c, field, key, allowed, NULL);
        }
    }
    return MOLQ_OK;
}

molq_status molq_json_number(molq_json_ctx *c, json_t *v, const char *field,
                              double *out)
{
    if (!json_is_number(v))
        return molq_json_key_error(c, MOLQ_ETYPE, field, "expected a number");
    *out = json_number_value(v);
    return MOLQ_OK;
}

/* An integer field in [lo, hi].  JSON written by many tools (Python's
 * json.dumps of a float, spreadsheets) carries 2.0 where 2 is meant, so an
 * integral real is taken as that integer; 2.5 is refused.  Out-of-range
 * values are refused here, naming the field and the bounds, never clamped. */
molq_status molq_json_int(molq_json_ctx *c, json_t *v, const char *field,
                          long lo, long hi, int *out)
{
    double x;
    char what[128];
    if (json_is_integer(v)) {
        json_int_t i = json_integer_value(v);
        if (i >= lo && i <= hi) {
            *out = (int)i;
            return MOLQ_OK;
        }
        x = (double)i;
    } else if (json_is_real(v)) {
        x = json_real_value(v);
        if (x != floor(x))
            return molq_json_key_error(c, MOLQ_ETYPE, field,
                                       "expected an integer");
        if (x >= (double)lo && x <= (double)hi) {
            *out = (int)x;
            return MOLQ_OK;
        }
    } else {
        return molq_json_key_error(c, MOLQ_ETYPE, field, "expected an integer");
    }
    snprintf(what, sizeof what, "must be an integer from %ld to %ld (got %.17g)",
             lo, hi, x);
    return molq_json_key_error(c, MOLQ_EVALUE, field, what);
}

molq_status molq_json_string(molq_json_ctx *c, json_t *v, const char *field,
                              const char **out)
{
    if (!json_is_string(v))
        return molq_json_key_error(c, MOLQ_ETYPE, field, "expected a string");
    *out = json_string_value(v);
    return MOLQ_OK;
}

