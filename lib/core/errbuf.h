/* core/errbuf.h -- writing messages into caller-owned error buffers. */
#ifndef MOLQ_CORE_ERRBUF_H
#define MOLQ_CORE_ERRBUF_H

#include <stddef.h>

/* printf-style into err[0..errlen); truncates; no-op when err is NULL or
 * errlen is 0.  Internal only (the public API has no variadic function). */
void molq_errf(char *err, size_t errlen, const char *fmt, ...)
#if defined(__GNUC__)
    __attribute__((format(printf, 3, 4)))
#endif
    ;

/* Duplicate a string with malloc; NULL on allocation failure. */
char *molq_strdup(const char *s);

#endif
