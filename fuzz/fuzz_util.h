/* fuzz_util.h -- small helpers shared by the fuzz targets: a byte reader
 * that turns fuzz input into integers, doubles and strings, and the check
 * macro that aborts with a message when an invariant breaks. */
#ifndef MOLQ_FUZZ_UTIL_H
#define MOLQ_FUZZ_UTIL_H

#include <float.h>
#include <math.h>
#include <stddef.h>
#include <stdint.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

/* Abort (libFuzzer records the input as a crash) when `cond` is false. */
#define CHECK(cond, ...)                                                     \
    do {                                                                     \
        if (!(cond)) {                                                       \
            fprintf(stderr, "\nINVARIANT BROKEN at %s:%d: %s\n  ", __FILE__, \
                    __LINE__, #cond);                                        \
            fprintf(stderr, __VA_ARGS__);                                    \
            fputc('\n', stderr);                                             \
            abort();                                                         \
        }                                                                    \
    } while (0)

/* Is the invariant named `tag` muted?  MOLQ_FUZZ_MUTE=tag1,tag2 in the
 * environment silences checks of known, reported bugs while the fuzzer
 * looks for others (see README.md); unset, every check is active. */
static inline int fz_muted(const char *tag)
{
    const char *e = getenv("MOLQ_FUZZ_MUTE");
    size_t n = strlen(tag);
    while (e != NULL && *e != '\0') {
        if (strncmp(e, tag, n) == 0 && (e[n] == ',' || e[n] == '\0'))
            return 1;
        e = strchr(e, ',');
        if (e != NULL)
            e++;
    }
    return 0;
}

/* CHECK that can be muted by its tag. */
#define CHECK_TAG(tag, cond, ...)                                            \
    do {                                                                     \
        if (!(cond) && !fz_muted(tag))                                       \
            CHECK(cond, "[" tag "] " __VA_ARGS__);                           \
    } while (0)

typedef struct fz {
    const uint8_t *p;
    size_t n;
} fz;

static inline size_t fz_left(const fz *f)
{
    return f->n;
}

static inline uint8_t fz_u8(fz *f)
{
    uint8_t v;
    if (f->n == 0)
        return 0;
    v = *f->p++;
    f->n--;
    return v;
}

static inline uint32_t fz_u32(fz *f)
{
    uint32_t v = 0;
    int i;
    for (i = 0; i < 4; i++)
        v = (v << 8) | fz_u8(f);
    return v;
}

static inline double fz_raw_double(fz *f)
{
    uint64_t bits = 0;
    double d;
    int i;
    for (i = 0; i < 8; i++)
        bits = (bits << 8) | fz_u8(f);
    memcpy(&d, &bits, sizeof d);
    return d;
}

/* A double that is often "interesting": one selector byte picks either a
 * value from a table of edge cases and ordinary magnitudes, a small decimal
 * built from the next two bytes, or 8 raw bytes (any bit pattern). */
static inline double fz_double(fz *f)
{
    static const double table[] = {
        0.0, -0.0, 1.0, -1.0, 0.5, 2.0, 10.0, 100.0, 298.15, 1000.0, 1e5,
        1e-3, 1e-6, 1e-12, 1e-30, 1e-100, 1e-300, 1e30, 1e100, 1e300,
        DBL_MAX, -DBL_MAX, DBL_MIN, DBL_MIN / 4.0, 4.9406564584124654e-324,
        HUGE_VAL, -HUGE_VAL, NAN, -NAN, 1.989581, 59.322, 2329.915, 0.028,
        27.877, 14.512, 9.285, 0.39022, 667.0, 1e-9, 6000.0, 20000.0, 3.0,
        -241826.0, 1e9, 1e15, 1e200, -1e-300, 0.05, 20.0};
    uint8_t sel = fz_u8(f);
    if (sel < 128)
        return table[sel % (sizeof table / sizeof table[0])];
    if (sel < 224) {
        /* (m / 16) * 10^(e - 8): ordinary numbers over many decades */
        uint8_t m = fz_u8(f), e = fz_u8(f);
        double v = (double)m / 16.0 * pow(10.0, (double)(e % 24) - 8.0);
        return (sel & 1) ? -v : v;
    }
    return fz_raw_double(f);
}

/* Copy up to `max` bytes (length from one byte, scaled) into a fresh
 * NUL-terminated string; embedded NULs shorten it, as C would. */
static inline char *fz_string(fz *f, size_t max)
{
    size_t len = fz_u8(f);
    char *s;
    if (len > 250)
        len = 250 + (size_t)fz_u8(f) * 4; /* reach past 255-byte limits */
    if (len > max)
        len = max;
    if (len > f->n)
        len = f->n;
    s = malloc(len + 1);
    if (s == NULL)
        abort();
    memcpy(s, f->p, len);
    s[len] = '\0';
    f->p += len;
    f->n -= len;
    return s;
}

/* An error buffer must be NUL-terminated within errlen and, after a
 * failure, say something. */
static inline int fz_err_ok(const char *err, size_t errlen, int want_text)
{
    size_t i;
    if (errlen == 0)
        return 1;
    for (i = 0; i < errlen; i++)
        if (err[i] == '\0')
            return want_text ? (i > 0 || errlen == 1) : 1;
    return 0;
}

#endif
