/* Non-fatal warning lists (see warnlist.h). */
#include <stdarg.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "core/errbuf.h"
#include "core/warnlist.h"

static molq_status push(molq_warnlist *w, const char *text)
{
    char *copy;
    if (w->n == w->cap) {
        size_t cap = w->cap ? 2 * w->cap : 4;
        char **m = realloc(w->msg, cap * sizeof *m);
        if (m == NULL)
            return MOLQ_ENOMEM;
        w->msg = m;
        w->cap = cap;
    }
    if ((copy = molq_strdup(text)) == NULL)
        return MOLQ_ENOMEM;
    w->msg[w->n++] = copy;
    return MOLQ_OK;
}

static molq_status add_text(molq_warnlist *w, const char *text)
{
    char more[64];
    char *copy;
    if (w->n < MOLQ_MAX_WARNINGS)
        return push(w, text);
    /* keep the list bounded: the last entry counts what was dropped */
    w->dropped++;
    snprintf(more, sizeof more, "... and %zu more warnings", w->dropped + 1);
    if ((copy = molq_strdup(more)) == NULL)
        return MOLQ_ENOMEM;
    free(w->msg[w->n - 1]);
    w->msg[w->n - 1] = copy;
    return MOLQ_OK;
}

molq_status molq_warn(molq_warnlist *w, const char *fmt, ...)
{
    char buf[MOLQ_WARNING_BYTES];
    va_list ap;
    va_start(ap, fmt);
    vsnprintf(buf, sizeof buf, fmt, ap);
    va_end(ap);
    return add_text(w, buf);
}

molq_status molq_warn_append(molq_warnlist *dst, const molq_warnlist *src)
{
    size_t i;
    molq_status st;
    for (i = 0; i < src->n; i++)
        if ((st = add_text(dst, src->msg[i])) != MOLQ_OK)
            return st;
    return MOLQ_OK;
}

const char *molq_warn_get(const molq_warnlist *w, size_t i)
{
    return (w != NULL && i < w->n) ? w->msg[i] : NULL;
}

void molq_warn_free(molq_warnlist *w)
{
    size_t i;
    if (w == NULL)
        return;
    for (i = 0; i < w->n; i++)
        free(w->msg[i]);
    free(w->msg);
    w->msg = NULL;
    w->n = w->cap = w->dropped = 0;
}
