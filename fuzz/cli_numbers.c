/* cli_numbers.c -- fuzz target for the molq tool's numeric option parsing
 * (tools/args.c, API in tools/args.h).
 *
 * Input: one selector byte, then the option text (copied into a
 * NUL-terminated buffer; an embedded NUL ends it, as in argv).
 *   'n'  cli_parse_number
 *   'p'  cli_parse_positive("--p", ...)      the pressure parser
 *   'c'  cli_parse_choice("--model", ...)    one name (rrho, levels)
 *   'l'  cli_parse_choice_list("--compare", ...)  "rrho,levels"
 *   else cli_parse_temperatures("--T", ...)  T list or START:STOP:STEP
 * (the corpus files start with 'T', 'p' or 'n' so they read as text).
 *
 * Invariants, from args.h:
 *  - accepted numbers are finite and consist of plain decimal characters
 *    only; the value is what strtod gives for the same text;
 *  - accepted pressures are finite and > 0;
 *  - accepted temperature lists have 1 .. CLI_MAX_POINTS values, all finite
 *    and > 0; a comma list has one value per entry, equal to strtod of the
 *    entry; a range starts at START, strictly ascends, does not pass STOP,
 *    and leaves no whole STEP unused before STOP;
 *  - an accepted choice is exactly one of the names; an accepted choice
 *    list has 1..n distinct valid indices whose names, joined by commas,
 *    give back the text;
 *  - on failure the message is a non-empty NUL-terminated string that
 *    starts with "option <name>: ", and the outputs are untouched;
 *  - no leaks, no out-of-bounds access, no undefined behaviour (sanitizers).
 */
#include <errno.h>

#include "args.h"
#include "fuzz_util.h"

static int plain_decimal(const char *s)
{
    if (*s == '\0')
        return 0;
    for (; *s != '\0'; s++)
        if (strchr("0123456789+-.eE", *s) == NULL)
            return 0;
    return 1;
}

static void check_failure_msg(const char *msg, size_t msglen, const char *opt)
{
    char prefix[32];
    CHECK(fz_err_ok(msg, msglen, 1), "message not a NUL-terminated non-empty "
          "string");
    snprintf(prefix, sizeof prefix, "option %s: ", opt);
    CHECK(strncmp(msg, prefix, strlen(prefix)) == 0,
          "message does not start with '%s': %s", prefix, msg);
}

static void fuzz_number(const char *text)
{
    const double poison = -3.5e99;
    double v = poison;
    char why[200];
    memset(why, 'x', sizeof why);
    if (cli_parse_number(text, &v, why, sizeof why) == 0) {
        char *end;
        double ref;
        CHECK(isfinite(v), "accepted non-finite %.17g from '%s'", v, text);
        CHECK(plain_decimal(text), "accepted non-decimal text '%s'", text);
        errno = 0;
        ref = strtod(text, &end);
        CHECK(*end == '\0' && memcmp(&ref, &v, sizeof v) == 0,
              "'%s' gave %.17g, strtod %.17g", text, v, ref);
    } else {
        CHECK(v == poison, "out written on failure");
        CHECK(fz_err_ok(why, sizeof why, 1), "why not a string");
    }
}

static void fuzz_positive(const char *text)
{
    const double poison = -3.5e99;
    double v = poison, v2 = poison;
    char msg[512], why[200];
    memset(msg, 'x', sizeof msg);
    if (cli_parse_positive("--p", text, &v, msg, sizeof msg) == 0) {
        CHECK(isfinite(v) && v > 0.0, "accepted pressure %.17g from '%s'", v,
              text);
        CHECK(cli_parse_number(text, &v2, why, sizeof why) == 0 &&
                  memcmp(&v, &v2, sizeof v) == 0,
              "pressure '%s' accepted but not as a number", text);
    } else {
        CHECK(v == poison, "out written on failure");
        check_failure_msg(msg, sizeof msg, "--p");
    }
}

/* The three parts of "START:STOP:STEP" as strtod reads them (the parser
 * accepted the text, so each part is a plain number). */
static void range_parts(const char *text, double part[3])
{
    const char *p = text;
    int i;
    for (i = 0; i < 3; i++) {
        char *end;
        part[i] = strtod(p, &end);
        CHECK(i == 2 ? *end == '\0' : *end == ':',
              "accepted range '%s' does not split into three numbers", text);
        p = end + 1;
    }
}

static void fuzz_temperatures(const char *text)
{
    double *const poison_ptr = (double *)&poison_ptr;
    double *T = poison_ptr;
    size_t n = 12345, i;
    char msg[512];
    memset(msg, 'x', sizeof msg);
    if (cli_parse_temperatures("--T", text, &T, &n, msg, sizeof msg) != 0) {
        CHECK(T == poison_ptr && n == 12345, "outputs written on failure");
        check_failure_msg(msg, sizeof msg, "--T");
        return;
    }
    CHECK(T != NULL && T != poison_ptr, "no array on success");
    CHECK(n >= 1 && n <= CLI_MAX_POINTS, "%zu points from '%.80s'", n, text);
    for (i = 0; i < n; i++)
        CHECK(isfinite(T[i]) && T[i] > 0.0, "T[%zu] = %.17g from '%.80s'", i,
              T[i], text);
    if (strchr(text, ':') != NULL) {
        double r[3], ulp;
        range_parts(text, r);
        CHECK_TAG("range_start", T[0] == r[0], "range '%s' starts at %.17g",
                  text, T[0]);
        for (i = 1; i < n; i++)
            CHECK_TAG("range_ascends", T[i] > T[i - 1],
                  "range '%s' does not ascend: T[%zu] = "
                  "%.17g, T[%zu] = %.17g (%zu points)", text, i - 1,
                  T[i - 1], i, T[i], n);
        CHECK_TAG("range_stop", T[n - 1] <= r[1], "range '%s' passes STOP: last %.17g", text,
              T[n - 1]);
        ulp = nextafter(r[1], HUGE_VAL) - r[1];
        CHECK_TAG("range_stop", r[1] - T[n - 1] < r[2] + 4.0 * ulp,
              "range '%s' stops early at %.17g (%zu points)", text, T[n - 1],
              n);
    } else {
        const char *p = text;
        size_t commas = 0;
        for (; *p != '\0'; p++)
            commas += (*p == ',');
        CHECK(n == commas + 1, "list '%.80s' has %zu entries, got %zu", text,
              commas + 1, n);
        p = text;
        for (i = 0; i < n; i++) {
            char *end;
            double ref = strtod(p, &end);
            CHECK(memcmp(&ref, &T[i], sizeof ref) == 0,
                  "entry %zu of '%.80s': %.17g, strtod %.17g", i, text, T[i],
                  ref);
            p = end + 1;
        }
    }
    free(T);
}

static const char *const models[] = {"rrho", "levels"};
#define NMODELS (sizeof models / sizeof models[0])

static void fuzz_choice(const char *text)
{
    size_t idx = 777;
    char msg[512];
    memset(msg, 'x', sizeof msg);
    if (cli_parse_choice("--model", "model", text, models, NMODELS, &idx, msg,
                         sizeof msg) == 0) {
        CHECK(idx < NMODELS && strcmp(models[idx], text) == 0,
              "'%s' accepted as choice %zu", text, idx);
    } else {
        CHECK(idx == 777, "index written on failure");
        check_failure_msg(msg, sizeof msg, "--model");
    }
}

static void fuzz_choice_list(const char *text)
{
    size_t out[NMODELS], count = 777, i, k;
    char msg[512], joined[64];
    memset(msg, 'x', sizeof msg);
    if (cli_parse_choice_list("--compare", "model", text, models, NMODELS,
                              out, &count, msg, sizeof msg) != 0) {
        CHECK(count == 777, "count written on failure");
        check_failure_msg(msg, sizeof msg, "--compare");
        return;
    }
    CHECK(count >= 1 && count <= NMODELS, "%zu choices from '%.80s'", count,
          text);
    joined[0] = '\0';
    for (i = 0; i < count; i++) {
        CHECK(out[i] < NMODELS, "index %zu out of range", out[i]);
        for (k = 0; k < i; k++)
            CHECK(out[k] != out[i], "'%s' accepted twice", models[out[i]]);
        if (i > 0)
            strcat(joined, ",");
        strcat(joined, models[out[i]]);
    }
    CHECK(strcmp(joined, text) == 0, "'%.80s' accepted as '%s'", text,
          joined);
}

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
    char *text;
    uint8_t sel;
    if (size == 0)
        return 0;
    sel = data[0];
    text = malloc(size);
    if (text == NULL)
        return 0;
    memcpy(text, data + 1, size - 1);
    text[size - 1] = '\0';
    if (sel == 'n')
        fuzz_number(text);
    else if (sel == 'p')
        fuzz_positive(text);
    else if (sel == 'c')
        fuzz_choice(text);
    else if (sel == 'l')
        fuzz_choice_list(text);
    else
        fuzz_temperatures(text);
    free(text);
    return 0;
}
