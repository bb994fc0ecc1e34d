/* data/json_common.h -- helpers shared by the species-file readers
 * (json_reader.c: core keys; json_levels.c: keys of the levels model). */
#ifndef MOLQ_DATA_JSON_COMMON_H
#define MOLQ_DATA_JSON_COMMON_H

#include <jansson.h>

#include "data/spec.h"

typedef struct molq_json_ctx {
    char *err;
    size_t errlen;
    char who[300]; /* "species 'N2'" or "species #3" */
} molq_json_ctx;

/* Write "WHO: field 'FIELD': WHAT" and return code. */
molq_status molq_json_key_error(molq_json_ctx *c, molq_status code,
                                const char *field, const char *what);

/* Reject keys of obj not in the NULL-terminated list (prefix `where`). */
molq_status molq_json_check_keys(molq_json_ctx *c, json_t *obj,
                                 const char *const *allowed,
                                 const char *where);

/* MOLQ_EKEY for an unknown key at `field`, suggesting the nearest key of
 * the NULL-terminated lists a and b (b may be NULL) when one is close. */
molq_status molq_json_unknown_key(molq_json_ctx *c, const char *field,
                                  const char *key, const char *const *a,
                                  const char *const *b);

molq_status molq_json_number(molq_json_ctx *c, json_t *v, const char *field,
                             double *out);
/* An integer (or an integral real such as 2.0) in [lo, hi]; anything else
 * is refused naming the field (MOLQ_ETYPE not an integer, MOLQ_EVALUE out of
 * range).  lo and hi must lie within int. */
molq_status molq_json_int(molq_json_ctx *c, json_t *v, const char *field,
                          long lo, long hi, int *out);
molq_status molq_json_string(molq_json_ctx *c, json_t *v, const char *field,
                             const char **out);

/* Keys of the levels model in a species entry (json_levels.c). */
molq_status molq_json_read_levels(molq_json_ctx *c, json_t *e, molq_spec *s);

/* The level-model keys a species entry may carry (NULL-terminated). */
extern const char *const molq_json_levels_keys[];

#endif
