/* core/warnlist.h -- a list of non-fatal warnings (one English line each,
 * naming species and field), filled while an object is built and frozen in
 * it afterwards.  No global state: each list belongs to one object. */
#ifndef MOLQ_CORE_WARNLIST_H
#define MOLQ_CORE_WARNLIST_H

#include <stddef.h>

#include "molq/molq.h"

#define MOLQ_MAX_WARNINGS 1000 /* per object; further ones are counted in one */
#define MOLQ_WARNING_BYTES 400 /* longest warning kept (truncated beyond) */

typedef struct molq_warnlist {
    char **msg;
    size_t n, cap;
    size_t dropped; /* warnings past MOLQ_MAX_WARNINGS */
} molq_warnlist;

/* Append a printf-formatted warning; MOLQ_ENOMEM on allocation failure
 * (the list is unchanged then).  Past MOLQ_MAX_WARNINGS the last entry
 * becomes "... and N more warnings". */
molq_status molq_warn(molq_warnlist *w, const char *fmt, ...)
#if defined(__GNUC__)
    __attribute__((format(printf, 2, 3)))
#endif
    ;

/* Append every warning of src to dst; MOLQ_ENOMEM on failure. */
molq_status molq_warn_append(molq_warnlist *dst, const molq_warnlist *src);

/* Borrowed message i, NULL when out of range. */
const char *molq_warn_get(const molq_warnlist *w, size_t i);

void molq_warn_free(molq_warnlist *w);

#endif
