/* args.c -- strict parsing of numeric command-line values (see args.h). */
#include "args.h"

#include <errno.h>
#include <math.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

/* Longest piece of user text quoted back in a message. */
#define QUOTE_MAX 60

int cli_parse_number(const char *text, double *out, char *why, size_t whylen)
{
    char *end;
    double v;
    size_t i;

    if (text[0] == '\0') {
        snprintf(why, whylen, "empty value");
        return -1;
    }
    errno = 0;
    v = strtod(text, &end);
    if (end == text || *end != '\0') {
        snprintf(why, whylen, "'%.*s' is not a number", QUOTE_MAX, text);
        return -1;
    }
    if (errno == ERANGE && isinf(v)) {
        snprintf(why, whylen, "'%.*s' is too large (overflows a double)",
                 QUOTE_MAX, text);
        return -1;
    }
    if (!isfinite(v)) {
        snprintf(why, whylen, "'%.*s' is not a finite number", QUOTE_MAX,
                 text);
        return -1;
    }
    if (errno == ERANGE) {
        snprintf(why, whylen, "'%.*s' is too small (underflows a double)",
                 QUOTE_MAX, text);
        return -1;
    }
    /* strtod also takes leading blanks and hexadecimal; we want plain
     * decimal notation only. */
    for (i = 0; text[i] != '\0'; i++)
        if (strchr("0123456789+-.eE", text[i]) == NULL) {
            snprintf(why, whylen, "'%.*s' is not a plain decimal number",
                     QUOTE_MAX, text);
            return -1;
        }
    *out = v;
    return 0;
}

int cli_parse_positive(const char *opt, const char *text, double *out,
                       char *msg, size_t msglen)
{
    char why[200];
    double v;
    if (cli_parse_number(text, &v, why, sizeof why) != 0) {
        snprintf(msg, msglen, "option %s: %s", opt, why);
        return -1;
    }
    if (!(v > 0.0)) {
        snprintf(msg, msglen, "option %s: '%.*s' must be greater than 0", opt,
                 QUOTE_MAX, text);
        return -1;
    }
    *out = v;
    return 0;
}

/* "START:STOP:STEP" */
static int parse_range(const char *opt, const char *text, double **out,
                       size_t *n, char *msg, size_t msglen)
{
    static const char *const part_name[3] = {"START", "STOP", "STEP"};
    double v[3], span, k;
    char part[3][128], why[200];
    const char *p = text;
    size_t i, count;
    double *T;

    for (i = 0; i < 3; i++) {
        const char *colon = strchr(p, ':');
        size_t len = colon ? (size_t)(colon - p) : strlen(p);
        if ((i < 2 && colon == NULL) || (i == 2 && colon != NULL)) {
            snprintf(msg, msglen, "option %s: '%.*s' is not a range of the "
                     "form START:STOP:STEP", opt, QUOTE_MAX, text);
            return -1;
        }
        if (len >= sizeof part[i]) {
            snprintf(msg, msglen, "option %s: %s in '%.*s' is too long", opt,
                     part_name[i], QUOTE_MAX, text);
            return -1;
        }
        memcpy(part[i], p, len);
        part[i][len] = '\0';
        if (cli_parse_number(part[i], &v[i], why, sizeof why) != 0) {
            snprintf(msg, msglen, "option %s: %s of range '%.*s': %s", opt,
                     part_name[i], QUOTE_MAX, text, why);
            return -1;
        }
        p = colon ? colon + 1 : p + len;
    }
    if (!(v[0] > 0.0)) {
        snprintf(msg, msglen, "option %s: START of range '%.*s' must be a "
                 "temperature greater than 0 K (got '%s')", opt, QUOTE_MAX,
                 text, part[0]);
        return -1;
    }
    if (!(v[2] > 0.0)) {
        snprintf(msg, msglen, "option %s: STEP of range '%.*s' must be "
                 "greater than 0 (got '%s')", opt, QUOTE_MAX, text, part[2]);
        return -1;
    }
    if (v[0] > v[1]) {
        snprintf(msg, msglen, "option %s: range '%.*s': START %s is above "
                 "STOP %s", opt, QUOTE_MAX, text, part[0], part[1]);
        return -1;
    }
    span = (v[1] - v[0]) / v[2]; /* number of steps, maybe fractional */
    if (!(span < (double)CLI_MAX_POINTS)) {
        snprintf(msg, msglen, "option %s: range '%.*s' gives more than %d "
                 "points", opt, QUOTE_MAX, text, CLI_MAX_POINTS);
        return -1;
    }
    k = floor(span);
    if (span - k > 1.0 - 1e-9) /* the next step lands on STOP within 1e-9 */
        k += 1.0;
    count = (size_t)k + 1;
    if (count > CLI_MAX_POINTS) {
        snprintf(msg, msglen, "option %s: range '%.*s' gives more than %d "
                 "points", opt, QUOTE_MAX, text, CLI_MAX_POINTS);
        return -1;
    }
    T = malloc(count * sizeof *T);
    if (T == NULL) {
        snprintf(msg, msglen, "option %s: out of memory", opt);
        return -1;
    }
    for (i = 0; i < count; i++) {
        T[i] = v[0] + (double)i * v[2];
        if (i > 0 && !(T[i] > T[i - 1])) {
            /* STEP below the spacing of doubles near START. */
            snprintf(msg, msglen, "option %s: STEP of range '%.*s' is too "
                     "small to advance from START in double precision", opt,
                     QUOTE_MAX, text);
            free(T);
            return -1;
        }
    }
    /* Print STOP as given, not with round-off, when the last step lands on
     * it (never when no step was taken: a STEP far larger than the range
     * must leave START alone). */
    if (count > 1 && fabs(T[count - 1] - v[1]) <= 1e-9 * v[2])
        T[count - 1] = v[1];
    *out = T;
    *n = count;
    return 0;
}

/* "T1,T2,..." */
static int parse_list(const char *opt, const char *text, double **out,
                      size_t *n, char *msg, size_t msglen)
{
    size_t count = 1, i = 0;
    const char *p;
    double *T;
    char item[128], why[200];

    for (p = text; *p != '\0'; p++)
        if (*p == ',')
            count++;
    if (count > CLI_MAX_POINTS) {
        snprintf(msg, msglen, "option %s: more than %d temperatures", opt,
                 CLI_MAX_POINTS);
        return -1;
    }
    T = malloc(count * sizeof *T);
    if (T == NULL) {
        snprintf(msg, msglen, "option %s: out of memory", opt);
        return -1;
    }
    p = text;
    for (i = 0; i < count; i++) {
        const char *comma = strchr(p, ',');
        size_t len = comma ? (size_t)(comma - p) : strlen(p);
        if (len == 0) {
            snprintf(msg, msglen, "option %s: empty entry in list '%.*s'", opt,
                     QUOTE_MAX, text);
            goto fail;
        }
        if (len >= sizeof item) {
            snprintf(msg, msglen, "option %s: entry %zu of '%.*s...' is too "
                     "long", opt, i + 1, QUOTE_MAX, text);
            goto fail;
        }
        memcpy(item, p, len);
        item[len] = '\0';
        if (cli_parse_number(item, &T[i], why, sizeof why) != 0) {
            snprintf(msg, msglen, "option %s: %s", opt, why);
            goto fail;
        }
        if (!(T[i] > 0.0)) {
            snprintf(msg, msglen, "option %s: temperature '%s' must be "
                     "greater than 0 K", opt, item);
            goto fail;
        }
        p = comma ? comma + 1 : p + len;
    }
    *out = T;
    *n = count;
    return 0;
fail:
    free(T);
    return -1;
}

int cli_parse_temperatures(const char *opt, const char *text, double **out,
                           size_t *n, char *msg, size_t msglen)
{
    if (text[0] == '\0') {
        snprintf(msg, msglen, "option %s: empty value", opt);
        return -1;
    }
    if (strchr(text, ':') != NULL)
        return parse_range(opt, text, out, n, msg, msglen);
    return parse_list(opt, text, out, n, msg, msglen);
}

/* "a, b or c" into buf. */
static void list_names(const char *const *names, size_t n, char *buf,
                       size_t len)
{
    size_t i, used = 0;
    buf[0] = '\0';
    for (i = 0; i < n && used < len; i++) {
        int w = snprintf(buf + used, len - used, "%s%s",
                         i == 0 ? "" : i + 1 == n ? " or " : ", ", names[i]);
        if (w < 0)
            break;
        used += (size_t)w;
    }
}

static int find_name(const char *text, size_t len, const char *const *names,
                     size_t n, size_t *index)
{
    size_t i;
    for (i = 0; i < n; i++)
        if (strlen(names[i]) == len && strncmp(names[i], text, len) == 0) {
            *index = i;
            return 0;
        }
    return -1;
}

int cli_parse_choice(const char *opt, const char *noun, const char *text,
                     const char *const *names, size_t n, size_t *index,
                     char *msg, size_t msglen)
{
    char all[256];
    if (find_name(text, strlen(text), names, n, index) == 0)
        return 0;
    list_names(names, n, all, sizeof all);
    if (text[0] == '\0')
        snprintf(msg, msglen, "option %s: empty value (use %s)", opt, all);
    else
        snprintf(msg, msglen, "option %s: unknown %s '%.*s' (use %s)", opt,
                 noun, QUOTE_MAX, text, all);
    return -1;
}

int cli_parse_choice_list(const char *opt, const char *noun,
                          const char *text, const char *const *names,
                          size_t n, size_t *out, size_t *count, char *msg,
                          size_t msglen)
{
    char all[256];
    const char *p = text;
    size_t k = 0, i, idx;

    list_names(names, n, all, sizeof all);
    if (text[0] == '\0') {
        snprintf(msg, msglen, "option %s: empty value (give %ss separated by "
                 "commas, from %s)", opt, noun, all);
        return -1;
    }
    for (;;) {
        const char *comma = strchr(p, ',');
        size_t len = comma ? (size_t)(comma - p) : strlen(p);
        if (len == 0) {
            snprintf(msg, msglen, "option %s: empty entry in list '%.*s'",
                     opt, QUOTE_MAX, text);
            return -1;
        }
        if (find_name(p, len, names, n, &idx) != 0) {
            snprintf(msg, msglen, "option %s: unknown %s '%.*s' (use %s)", opt,
                     noun, (int)(len < QUOTE_MAX ? len : QUOTE_MAX), p, all);
            return -1;
        }
        for (i = 0; i < k; i++)
            if (out[i] == idx) {
                snprintf(msg, msglen, "option %s: %s '%s' given twice in "
                         "'%.*s'", opt, noun, names[idx], QUOTE_MAX, text);
                return -1;
            }
        out[k++] = idx; /* k <= n: the names are distinct */
        if (comma == NULL)
            break;
        p = comma + 1;
    }
    *count = k;
    return 0;
}
