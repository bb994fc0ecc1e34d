/* Helpers shared by the species-file readers. */
#include <string.h>

#include "core/errbuf.h"
#include "data/json_common.h"

molq_status molq_json_key_error(molq_json_ctx *c, molq_status code, const char *field,
                             const char *what)
{
    molq_errf(c->err, c->errlen, "%s: field '%s': %s", c->who, field, what);
    return code;
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
            molq_errf(c->err, c->errlen, "%s: field '%s%s': unknown key",
                      c->who, where, key);
            return MOLQ_EKEY;
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

molq_status molq_json_int(molq_json_ctx *c, json_t *v, const char *field, int *out)
{
    json_int_t i;
    if (!json_is_integer(v))
        return molq_json_key_error(c, MOLQ_ETYPE, field, "expected an integer");
    i = json_integer_value(v);
    /* Clamp: out-of-int values are reported by validation as out of range. */
    *out = i > 1000000000 ? 1000000000 : i < -1000000000 ? -1000000000 : (int)i;
    return MOLQ_OK;
}

molq_status molq_json_string(molq_json_ctx *c, json_t *v, const char *field,
                              const char **out)
{
    if (!json_is_string(v))
        return molq_json_key_error(c, MOLQ_ETYPE, field, "expected a string");
    *out = json_string_value(v);
    return MOLQ_OK;
}

