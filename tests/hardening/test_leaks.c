/* Hardening: every error path, many times, without leaking.
 *
 * A corpus of bad species files covers every status molq_db_read_string
 * can return (MOLQ_EARG, MOLQ_ESYNTAX, MOLQ_EKEY, MOLQ_ETYPE, MOLQ_EVALUE,
 * MOLQ_EDUPLICATE, MOLQ_ELIMIT; MOLQ_ENOMEM needs an allocation failure,
 * see the note at the end) and every key of the file format; a corpus of
 * bad descriptions built through molq_spec_* covers every validation rule
 * of lib/data/validate.c and the setters' own MOLQ_EARG / MOLQ_ELIMIT.
 * Each case runs 2 x MOLQ_TEST_ROUNDS times (default 50; a tenth for the
 * slow ones) and checks the status, that
 * the output pointer is untouched, and that the message names the field.
 * Entry-level JSON cases run twice: alone, and between good species, so
 * that the failure happens with earlier species already built.
 *
 * Leaks are caught three ways: under valgrind (the 'valgrind' suite runs
 * this program with --leak-check=full --errors-for-leak-kinds=all), under
 * AddressSanitizer's LeakSanitizer (the sanitiser build), and in a plain
 * glibc build by comparing the heap in use (mallinfo2, with the thread
 * cache off) over the rounds: a case that leaks even one block per call
 * grows the heap by at least MOLQ_TEST_ROUNDS blocks.
 *
 * The ELIMIT cases for files over 64 MiB and over 100000 species are in
 * test_limits.c (they are slow under valgrind). */
#define _GNU_SOURCE /* mallinfo2 */

#include <float.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <unistd.h>

#if defined(__GLIBC__)
#include <malloc.h>
#endif

#include "testutil.h"

/* ------------------------------------------------------------------------ */
/* Heap accounting                                                          */
/* ------------------------------------------------------------------------ */

#if defined(__SANITIZE_ADDRESS__) || defined(__SANITIZE_THREAD__)
#define HEAP_COUNTER 0
#elif defined(__has_feature)
#if __has_feature(address_sanitizer) || __has_feature(thread_sanitizer) ||    \
    __has_feature(memory_sanitizer)
#define HEAP_COUNTER 0
#endif
#endif
#ifndef HEAP_COUNTER
#if defined(__GLIBC__) && defined(__GLIBC_PREREQ)
#if __GLIBC_PREREQ(2, 33)
#define HEAP_COUNTER 1
#endif
#endif
#endif
#ifndef HEAP_COUNTER
#define HEAP_COUNTER 0
#endif

/* Bytes in use from malloc, or -1 where that cannot be measured (other
 * libc, a sanitiser, valgrind). */
static long long heap_in_use(void)
{
#if HEAP_COUNTER
    /* glibc's per-thread cache keeps freed chunks counted as in use, which
     * makes the count drift by up to a few hundred kB; it is exact with the
     * cache off (meson sets GLIBC_TUNABLES=glibc.malloc.tcache_count=0). */
    const char *vg = getenv("MOLQ_TEST_UNDER_VALGRIND");
    const char *tun = getenv("GLIBC_TUNABLES");
    if ((vg != NULL && *vg != '\0') || tun == NULL ||
        strstr(tun, "glibc.malloc.tcache_count=0") == NULL)
        return -1;
    return (long long)mallinfo2().uordblks;
#else
    return -1;
#endif
}

static size_t rounds(void)
{
    const char *s = getenv("MOLQ_TEST_ROUNDS");
    long v = s ? strtol(s, NULL, 10) : 0;
    return v > 0 ? (size_t)v : 50;
}

/* Run body(ctx) twice to warm up, then `rounds` times, then `rounds` times
 * again; fail if the heap grew during the second batch by 16 bytes or more
 * per call.  A leak of one block per call (a malloc chunk is at least 32
 * bytes) grows it by at least 32 bytes per call; one-time allocations (the
 * C library's stdio buffers, Check's bookkeeping, jansson's hash seed)
 * happen in the warm-up or the first batch and do not count. */
static size_t heavy_divisor = 1; /* fewer rounds for slow cases */

static void no_growth(const char *what, void (*body)(const void *),
                      const void *ctx)
{
    size_t i, n = rounds() / heavy_divisor + 1;
    long long mid, after;
    body(ctx);
    body(ctx);
    for (i = 0; i < n; i++)
        body(ctx);
    mid = heap_in_use();
    for (i = 0; i < n; i++)
        body(ctx);
    after = heap_in_use();
    if (mid >= 0)
        ck_assert_msg(after - mid < 16 * (long long)n, "%s: heap grew by "
                      "%lld bytes over %zu calls", what, after - mid, n);
}

/* ------------------------------------------------------------------------ */
/* Bad species files                                                        */
/* ------------------------------------------------------------------------ */

/* Good entries to put around an entry-level case. */
#define GOOD1                                                                  \
    "{\"name\": \"good-1\", \"molar_mass\": 4, \"structure\": \"atom\"}"
#define GOOD2                                                                  \
    "{\"name\": \"good-2\", \"formula\": \"CO\", \"structure\": \"linear\","  \
    " \"rotational_constants\": [1.9], \"vibrations\": [{\"wavenumber\":"     \
    " 2100}], \"electronic_levels\": [{\"energy\": 0}, {\"energy\": 5e4,"     \
    " \"degeneracy\": 2}]}"
#define GOOD3                                                                  \
    "{\"name\": \"good-3\", \"molar_mass\": 28, \"structure\": \"linear\","   \
    " \"dissociation_energy\": 6000, \"diatomic_states\": [{\"Te\": 0, \"we\":" \
    " 2000, \"wexe\": 14, \"Be\": 2, \"alpha_e\": 0.02}]}"

/* A whole-file case (FILE) or one species entry (ENTRY, wrapped as
 * {"species": [ENTRY]} and as {"species": [GOOD1, GOOD2, ENTRY, GOOD3]}). */
typedef struct {
    int whole;
    molq_status status;
    const char *mention; /* the message must contain this */
    const char *text;
} json_case;

#define FILE_(st, m, t) {1, st, m, t}
#define ENTRY(st, m, t) {0, st, m, t}
#define LIN "\"name\": \"X\", \"molar_mass\": 4, \"structure\": \"linear\", "
#define LIN1 LIN "\"rotational_constants\": [1], "
#define DIA                                                                    \
    "\"name\": \"X\", \"molar_mass\": 28, \"structure\": \"linear\", "         \
    "\"dissociation_energy\": 6000, "
#define ST0 "\"Te\": 0, \"we\": 2000, \"wexe\": 14, \"Be\": 2"

static const json_case json_cases[] = {
    /* MOLQ_ESYNTAX: malformed JSON */
    FILE_(MOLQ_ESYNTAX, "line 1", ""),
    FILE_(MOLQ_ESYNTAX, "line 1", "   "),
    FILE_(MOLQ_ESYNTAX, "line 1", "{"),
    FILE_(MOLQ_ESYNTAX, "line 1", "{\"species\": [ {\"name\": \"A\",, } ]}"),
    FILE_(MOLQ_ESYNTAX, "line 1", "{\"species\": []} trailing"),
    FILE_(MOLQ_ESYNTAX, "line 1", "{\"species\": [1e999]}"),
    FILE_(MOLQ_ESYNTAX, "line 1", "{\"species\": [], \"species\": []}"),
    FILE_(MOLQ_ESYNTAX, "line 1", "{\"species\": [\"\xff\xfe\"]}"),
    FILE_(MOLQ_ESYNTAX, "line 1", "{\"species\": [\"a\\u0000b\"]}"),
    FILE_(MOLQ_ESYNTAX, "line 3", "{\n\"species\": [\n{\"name\": 'A'}]}"),
    FILE_(MOLQ_ESYNTAX, "line 1", "{\"species\": [{\"name\": \"A\"}"),
    /* MOLQ_ETYPE at file level */
    FILE_(MOLQ_ETYPE, "top level", "[1, 2]"),
    FILE_(MOLQ_ESYNTAX, "line 1", "\"species\""), /* jansson: object or array */
    FILE_(MOLQ_ETYPE, "species", "{\"species\": {}}"),
    FILE_(MOLQ_ETYPE, "entry", "{\"species\": [" GOOD1 ", 42]}"),
    FILE_(MOLQ_ETYPE, "schema_version", "{\"schema_version\": \"1\", "
                                        "\"species\": []}"),
    FILE_(MOLQ_ETYPE, "schema_version", "{\"schema_version\": 1.5, "
                                        "\"species\": []}"),
    /* MOLQ_EKEY / MOLQ_EVALUE at file level */
    FILE_(MOLQ_EKEY, "molecules", "{\"molecules\": []}"),
    FILE_(MOLQ_EKEY, "species", "{\"schema_version\": 1}"),
    FILE_(MOLQ_EVALUE, "schema_version", "{\"schema_version\": 2, "
                                         "\"species\": []}"),
    FILE_(MOLQ_EDUPLICATE, "duplicate",
          "{\"species\": [" GOOD1 ", " GOOD2 ", " GOOD3 ", " GOOD1 "]}"),
    FILE_(MOLQ_EDUPLICATE, "duplicate",
          "{\"species\": [" GOOD2 ", " GOOD2 "]}"),

    /* entries: missing or unknown keys */
    ENTRY(MOLQ_EKEY, "'name'", "{\"molar_mass\": 4, \"structure\": \"atom\"}"),
    ENTRY(MOLQ_EKEY, "'structure'", "{\"name\": \"X\", \"molar_mass\": 4}"),
    ENTRY(MOLQ_EKEY, "'molar_mass'", "{\"name\": \"X\", \"structure\": "
                                     "\"atom\"}"),
    ENTRY(MOLQ_EKEY, "'colour'", "{\"name\": \"X\", \"molar_mass\": 4, "
                                 "\"structure\": \"atom\", \"colour\": 1}"),
    ENTRY(MOLQ_EKEY, "vibrations[0].", "{" LIN1 "\"vibrations\": "
                                       "[{\"wavenumber\": 1, \"x\": 2}]}"),
    ENTRY(MOLQ_EKEY, "vibrations[0].wavenumber",
          "{" LIN1 "\"vibrations\": [{\"degeneracy\": 2}]}"),
    ENTRY(MOLQ_EKEY, "electronic_levels[0].energy",
          "{" LIN1 "\"electronic_levels\": [{}]}"),
    /* entries: wrong JSON types */
    ENTRY(MOLQ_ETYPE, "'name'", "{\"name\": 7, \"molar_mass\": 4, "
                                "\"structure\": \"atom\"}"),
    ENTRY(MOLQ_ETYPE, "'formula'", "{\"name\": \"X\", \"formula\": 7, "
                                   "\"structure\": \"atom\"}"),
    ENTRY(MOLQ_ETYPE, "'source'", "{\"name\": \"X\", \"molar_mass\": 4, "
                                  "\"source\": [], \"structure\": \"atom\"}"),
    ENTRY(MOLQ_ETYPE, "'molar_mass'", "{\"name\": \"X\", \"molar_mass\": "
                                      "\"4\", \"structure\": \"atom\"}"),
    ENTRY(MOLQ_ETYPE, "'structure'", "{\"name\": \"X\", \"molar_mass\": 4, "
                                     "\"structure\": 0}"),
    ENTRY(MOLQ_ETYPE, "'rotor'", "{" LIN1 "\"rotor\": true}"),
    ENTRY(MOLQ_ETYPE, "'symmetry_number'", "{" LIN1 "\"symmetry_number\": "
                                           "1.5}"),
    ENTRY(MOLQ_ETYPE, "'rotational_constants'",
          "{" LIN "\"rotational_constants\": 1}"),
    ENTRY(MOLQ_ETYPE, "'rotational_constants'",
          "{" LIN "\"rotational_constants\": [\"1\"]}"),
    ENTRY(MOLQ_ETYPE, "'vibrations'", "{" LIN1 "\"vibrations\": {}}"),
    ENTRY(MOLQ_ETYPE, "'vibrations'", "{" LIN1 "\"vibrations\": [100]}"),
    ENTRY(MOLQ_ETYPE, "vibrations[0].wavenumber",
          "{" LIN1 "\"vibrations\": [{\"wavenumber\": null}]}"),
    ENTRY(MOLQ_ETYPE, "vibrations[0].degeneracy",
          "{" LIN1 "\"vibrations\": [{\"wavenumber\": 1, \"degeneracy\": "
          "2.5}]}"),
    ENTRY(MOLQ_ETYPE, "'electronic_levels'",
          "{" LIN1 "\"electronic_levels\": \"ground\"}"),
    ENTRY(MOLQ_ETYPE, "'formation_enthalpy_298'",
          "{" LIN1 "\"formation_enthalpy_298\": \"0\"}"),
    /* entries: values out of range (validate.c, reached from a file) */
    ENTRY(MOLQ_EVALUE, "'name'", "{\"name\": \"\", \"molar_mass\": 4, "
                                 "\"structure\": \"atom\"}"),
    ENTRY(MOLQ_EVALUE, "'molar_mass'", "{\"name\": \"X\", \"molar_mass\": 0, "
                                       "\"structure\": \"atom\"}"),
    ENTRY(MOLQ_EVALUE, "'molar_mass'", "{\"name\": \"X\", \"molar_mass\": "
                                       "-4, \"structure\": \"atom\"}"),
    ENTRY(MOLQ_EVALUE, "'formula'", "{\"name\": \"X\", \"formula\": \"Xq\", "
                                    "\"structure\": \"atom\"}"),
    ENTRY(MOLQ_EVALUE, "'formula'", "{\"name\": \"X\", \"formula\": "
                                    "\"((((((((((H))))))))))\", "
                                    "\"structure\": \"atom\"}"),
    ENTRY(MOLQ_EVALUE, "'formula'", "{\"name\": \"X\", \"formula\": "
                                    "\"H999999\", \"structure\": \"atom\"}"),
    ENTRY(MOLQ_EVALUE, "'formula'", "{\"name\": \"X\", \"formula\": \"H0\", "
                                    "\"structure\": \"atom\"}"),
    ENTRY(MOLQ_EVALUE, "'formula'", "{\"name\": \"X\", \"formula\": "
                                    "\"(H2\", \"structure\": \"atom\"}"),
    ENTRY(MOLQ_EVALUE, "'formula'", "{\"name\": \"X\", \"formula\": \"\", "
                                    "\"structure\": \"atom\"}"),
    ENTRY(MOLQ_EVALUE, "'structure'", "{\"name\": \"X\", \"molar_mass\": 4, "
                                      "\"structure\": \"bent\"}"),
    ENTRY(MOLQ_EVALUE, "'rotor'", "{" LIN1 "\"rotor\": \"wobbly\"}"),
    ENTRY(MOLQ_EVALUE, "'symmetry_number'", "{" LIN1 "\"symmetry_number\": "
                                            "0}"),
    ENTRY(MOLQ_EVALUE, "'symmetry_number'", "{" LIN1 "\"symmetry_number\": "
                                            "-99999999999}"),
    ENTRY(MOLQ_EVALUE, "'symmetry_number'", "{\"name\": \"X\", "
                                            "\"molar_mass\": 4, \"structure\":"
                                            " \"atom\", \"symmetry_number\": "
                                            "2}"),
    ENTRY(MOLQ_EVALUE, "'rotational_constants'",
          "{" LIN "\"rotational_constants\": [1, 2]}"),
    ENTRY(MOLQ_EVALUE, "'rotational_constants'",
          "{" LIN "\"rotational_constants\": [1, 2, 3, 4]}"),
    ENTRY(MOLQ_EVALUE, "'rotational_constants'",
          "{\"name\": \"X\", \"molar_mass\": 4, \"structure\": \"linear\"}"),
    ENTRY(MOLQ_EVALUE, "rotational_constants[0]",
          "{" LIN "\"rotational_constants\": [0]}"),
    ENTRY(MOLQ_EVALUE, "rotational_constants[0]",
          "{" LIN "\"rotational_constants\": [-1]}"),
    ENTRY(MOLQ_EVALUE, "A >= B >= C",
          "{\"name\": \"X\", \"molar_mass\": 4, \"structure\": \"nonlinear\","
          " \"rotational_constants\": [1, 2, 3]}"),
    ENTRY(MOLQ_EVALUE, "'vibrations'",
          "{\"name\": \"X\", \"molar_mass\": 4, \"structure\": \"atom\", "
          "\"vibrations\": [{\"wavenumber\": 100}]}"),
    ENTRY(MOLQ_EVALUE, "vibrations[1].wavenumber",
          "{" LIN1 "\"vibrations\": [{\"wavenumber\": 1}, {\"wavenumber\": "
          "0}]}"),
    ENTRY(MOLQ_EVALUE, "vibrations[0].wavenumber",
          "{" LIN1 "\"vibrations\": [{\"wavenumber\": -300}]}"),
    ENTRY(MOLQ_EVALUE, "vibrations[0].degeneracy",
          "{" LIN1 "\"vibrations\": [{\"wavenumber\": 1, \"degeneracy\": "
          "0}]}"),
    ENTRY(MOLQ_EVALUE, "electronic_levels[0].energy",
          "{" LIN1 "\"electronic_levels\": [{\"energy\": -1}]}"),
    ENTRY(MOLQ_EVALUE, "electronic_levels[0].degeneracy",
          "{" LIN1 "\"electronic_levels\": [{\"energy\": 0, \"degeneracy\": "
          "-2}]}"),
    ENTRY(MOLQ_EVALUE, "'electronic_levels'",
          "{" LIN1 "\"electronic_levels\": [{\"energy\": 10}]}"),
    /* level-sum model keys */
    ENTRY(MOLQ_ETYPE, "'model'", "{" DIA "\"model\": 1, \"diatomic_states\": "
                                 "[{" ST0 "}]}"),
    ENTRY(MOLQ_EVALUE, "'model'", "{" DIA "\"model\": \"exact\", "
                                  "\"diatomic_states\": [{" ST0 "}]}"),
    ENTRY(MOLQ_EKEY, "'diatomic_states'", "{" LIN1 "\"model\": "
                                          "\"levels\"}"),
    ENTRY(MOLQ_ETYPE, "'dissociation_energy'",
          "{" LIN1 "\"dissociation_energy\": \"7e4\"}"),
    ENTRY(MOLQ_EKEY, "'dissociation_energy'",
          "{\"name\": \"X\", \"molar_mass\": 28, \"structure\": \"linear\", "
          "\"diatomic_states\": [{" ST0 "}]}"),
    ENTRY(MOLQ_EVALUE, "'dissociation_energy'",
          "{\"name\": \"X\", \"molar_mass\": 28, \"structure\": \"linear\", "
          "\"dissociation_energy\": 0, \"diatomic_states\": [{" ST0 "}]}"),
    ENTRY(MOLQ_ETYPE, "'spin_isomers'", "{" DIA "\"spin_isomers\": 1, "
                                        "\"diatomic_states\": [{" ST0 "}]}"),
    ENTRY(MOLQ_EVALUE, "'spin_isomers'", "{" DIA "\"spin_isomers\": "
                                         "\"mixed\", \"diatomic_states\": [{"
                                         ST0 "}]}"),
    ENTRY(MOLQ_EKEY, "'odd_fraction'", "{" DIA "\"spin_isomers\": "
                                       "\"frozen\", \"diatomic_states\": [{"
                                       ST0 "}]}"),
    ENTRY(MOLQ_EKEY, "'odd_fraction'", "{" DIA "\"odd_fraction\": 0.75, "
                                       "\"diatomic_states\": [{" ST0 "}]}"),
    ENTRY(MOLQ_ETYPE, "'odd_fraction'", "{" DIA "\"spin_isomers\": "
                                        "\"frozen\", \"odd_fraction\": "
                                        "\"3/4\", \"diatomic_states\": [{"
                                        ST0 "}]}"),
    ENTRY(MOLQ_EVALUE, "'odd_fraction'", "{" DIA "\"spin_isomers\": "
                                         "\"frozen\", \"odd_fraction\": 1, "
                                         "\"diatomic_states\": [{" ST0
                                         "}]}"),
    ENTRY(MOLQ_ETYPE, "'diatomic_states'", "{" DIA "\"diatomic_states\": "
                                           "{}}"),
    ENTRY(MOLQ_ETYPE, "'diatomic_states'", "{" DIA "\"diatomic_states\": "
                                           "[0]}"),
    ENTRY(MOLQ_EKEY, "diatomic_states[0].", "{" DIA "\"diatomic_states\": [{"
                                            ST0 ", \"omega\": 1}]}"),
    ENTRY(MOLQ_EKEY, "diatomic_states[0].Te", "{" DIA "\"diatomic_states\": "
                                              "[{\"we\": 2000, \"Be\": 2}]}"),
    ENTRY(MOLQ_ETYPE, "diatomic_states[0].Te", "{" DIA "\"diatomic_states\": "
                                               "[{\"Te\": \"0\"}]}"),
    ENTRY(MOLQ_ETYPE, "diatomic_states[0].degeneracy",
          "{" DIA "\"diatomic_states\": [{" ST0 ", \"degeneracy\": 0.5}]}"),
    ENTRY(MOLQ_ETYPE, "diatomic_states[0].we",
          "{" DIA "\"diatomic_states\": [{\"Te\": 0, \"we\": [1], \"Be\": "
          "2}]}"),
    ENTRY(MOLQ_ETYPE, "diatomic_states[0].label",
          "{" DIA "\"diatomic_states\": [{" ST0 ", \"label\": 5}]}"),
    ENTRY(MOLQ_ETYPE, "diatomic_states[0].rotational_weights",
          "{" DIA "\"diatomic_states\": [{" ST0 ", \"rotational_weights\": "
          "[1]}]}"),
    ENTRY(MOLQ_ETYPE, "diatomic_states[0].rotational_weights",
          "{" DIA "\"diatomic_states\": [{" ST0 ", \"rotational_weights\": "
          "[1, \"x\"]}]}"),
    ENTRY(MOLQ_ETYPE, "diatomic_states[0].dunham",
          "{" DIA "\"diatomic_states\": [{\"Te\": 0, \"dunham\": [[0, 2], "
          "[2000, 0, 0, 0, 0]]}]}"),
    ENTRY(MOLQ_ETYPE, "diatomic_states[0].dunham",
          "{" DIA "\"diatomic_states\": [{\"Te\": 0, \"dunham\": [[0, 2], "
          "[2000], [0], [0], [0], [0], [0]]}]}"),
    ENTRY(MOLQ_ETYPE, "diatomic_states[0].dunham",
          "{" DIA "\"diatomic_states\": [{\"Te\": 0, \"dunham\": [[0, \"2\"]"
          "]}]}"),
    ENTRY(MOLQ_ETYPE, "diatomic_states[0].dunham",
          "{" DIA "\"diatomic_states\": [{\"Te\": 0, \"dunham\": 3}]}"),
    ENTRY(MOLQ_EKEY, "diatomic_states[0].dunham",
          "{" DIA "\"diatomic_states\": [{\"Te\": 0, \"we\": 2000, "
          "\"dunham\": [[0, 2]]}]}"),
    ENTRY(MOLQ_EVALUE, "diatomic_states[0].Te",
          "{" DIA "\"diatomic_states\": [{\"Te\": 100, \"we\": 2000, \"Be\": "
          "2}]}"),
    ENTRY(MOLQ_EVALUE, "diatomic_states[1].Te",
          "{" DIA "\"diatomic_states\": [{" ST0 "}, {\"Te\": -5, \"we\": 900,"
          " \"Be\": 1}]}"),
    ENTRY(MOLQ_EVALUE, "diatomic_states[0].degeneracy",
          "{" DIA "\"diatomic_states\": [{" ST0 ", \"degeneracy\": 0}]}"),
    ENTRY(MOLQ_EVALUE, "diatomic_states[0].we",
          "{" DIA "\"diatomic_states\": [{\"Te\": 0, \"Be\": 2}]}"),
    ENTRY(MOLQ_EVALUE, "diatomic_states[0].Be",
          "{" DIA "\"diatomic_states\": [{\"Te\": 0, \"we\": 2000, \"Be\": "
          "-2}]}"),
    ENTRY(MOLQ_EVALUE, "diatomic_states[0].rotational_weights",
          "{" DIA "\"diatomic_states\": [{" ST0 ", \"rotational_weights\": "
          "[0, 0]}]}"),
    ENTRY(MOLQ_EVALUE, "diatomic_states[0].rotational_weights",
          "{" DIA "\"diatomic_states\": [{" ST0 ", \"rotational_weights\": "
          "[-1, 2]}]}"),
    ENTRY(MOLQ_EVALUE, "diatomic_states[1]",
          "{" DIA "\"diatomic_states\": [{" ST0 "}, {\"Te\": 9e4, \"we\": "
          "900, \"Be\": 1}]}"),
    ENTRY(MOLQ_EVALUE, "'diatomic_states'",
          "{\"name\": \"X\", \"molar_mass\": 28, \"structure\": "
          "\"nonlinear\", \"rotational_constants\": [3, 2, 1], "
          "\"dissociation_energy\": 7e4, \"diatomic_states\": [{" ST0 "}]}"),
    /* size limits inside one entry */
    ENTRY(MOLQ_ELIMIT, "'diatomic_states'",
          "{\"name\": \"X\", \"molar_mass\": 28, \"structure\": \"linear\", "
          "\"dissociation_energy\": 7e4, \"diatomic_states\": [{\"Te\": 0, "
          "\"we\": 2000, \"Be\": 1e-6}]}"),
};
#define NJSON (sizeof json_cases / sizeof json_cases[0])

typedef struct {
    const char *text;
    size_t len;
    molq_status status;
    const char *mention;
    int index;
} json_run;

static void json_body(const void *arg)
{
    const json_run *r = arg;
    molq_db *db = (molq_db *)&db; /* a sentinel that must survive */
    molq_db *const sentinel = db;
    char err[1024] = "";
    molq_status st = molq_db_read_string(r->text, r->len, &db, err,
                                         sizeof err);
    ck_assert_msg(st == r->status, "json case %d: %s (%s), want %s: %.300s",
                  r->index, molq_status_string(st), err,
                  molq_status_string(r->status), r->text);
    ck_assert_msg(db == sentinel, "json case %d: output written on failure",
                  r->index);
    ck_assert_msg(strstr(err, r->mention) != NULL,
                  "json case %d: message '%s' does not mention '%s'",
                  r->index, err, r->mention);
    /* no message buffer, and a tiny one: same status, still no leak */
    ck_assert_int_eq(molq_db_read_string(r->text, r->len, &db, NULL, 0),
                     r->status);
    {
        char small[5];
        ck_assert_int_eq(molq_db_read_string(r->text, r->len, &db, small,
                                             sizeof small),
                         r->status);
        ck_assert(memchr(small, '\0', sizeof small) != NULL);
    }
    ck_assert(db == sentinel);
}

START_TEST(bad_files)
{
    const json_case *c = &json_cases[_i];
    char *buf;
    json_run r;
    /* walking 400000 levels takes milliseconds: a tenth of the rounds */
    heavy_divisor = c->status == MOLQ_ELIMIT ? 10 : 1;
    r.status = c->status;
    r.mention = c->mention;
    r.index = _i;
    if (c->whole) {
        r.text = c->text;
        r.len = strlen(c->text);
        no_growth("bad file", json_body, &r);
        return;
    }
    buf = malloc(strlen(c->text) + 1024);
    ck_assert_ptr_nonnull(buf);
    sprintf(buf, "{\"species\": [%s]}", c->text);
    r.text = buf;
    r.len = strlen(buf);
    no_growth("bad entry alone", json_body, &r);
    /* between good species: the failure comes with earlier species built
     * (validation runs after parsing, so it meets good-1 and good-2
     * already made into species) */
    sprintf(buf, "{\"schema_version\": 1, \"description\": \"d\", "
                 "\"species\": [" GOOD1 ", " GOOD2 ", %s, " GOOD3 "]}",
            c->text);
    r.text = buf;
    r.len = strlen(buf);
    no_growth("bad entry after good ones", json_body, &r);
    free(buf);
}
END_TEST

/* Cases built at run time: deep nesting, an embedded NUL byte, too many
 * vibrations, levels and states, a file that is not there, a directory. */
static char *repeat_entries(const char *head, const char *item, size_t n,
                            const char *tail)
{
    size_t hl = strlen(head), il = strlen(item), tl = strlen(tail), i;
    char *b = malloc(hl + n * (il + 1) + tl + 1), *p;
    ck_assert_ptr_nonnull(b);
    memcpy(b, head, hl);
    p = b + hl;
    for (i = 0; i < n; i++) {
        if (i > 0)
            *p++ = ',';
        memcpy(p, item, il);
        p += il;
    }
    memcpy(p, tail, tl + 1);
    return b;
}

START_TEST(generated_bad_files)
{
    json_run r;
    char *deep, *b;
    size_t i, depth = 100000;
    heavy_divisor = 5;
    /* 100000 nested arrays: jansson stops at its depth limit (2048), so
     * neither the parser nor the reader recurses that deep */
    deep = malloc(2 * depth + 64);
    ck_assert_ptr_nonnull(deep);
    strcpy(deep, "{\"species\": ");
    b = deep + strlen(deep);
    for (i = 0; i < depth; i++)
        *b++ = '[';
    for (i = 0; i < depth; i++)
        *b++ = ']';
    strcpy(b, "}");
    r.text = deep;
    r.len = strlen(deep);
    r.status = MOLQ_ESYNTAX;
    r.mention = "depth";
    r.index = -1;
    no_growth("deep nesting", json_body, &r);
    free(deep);

    /* an embedded NUL byte: len covers it, the reader must not stop there
     * and accept the prefix */
    {
        static const char nul[] = "{\"species\": []}\0{\"x\": 1}";
        r.text = nul;
        r.len = sizeof nul - 1;
        r.status = MOLQ_ESYNTAX;
        r.mention = "line 1";
        r.index = -2;
        no_growth("embedded NUL", json_body, &r);
    }

    /* 1001 vibrations, 10001 electronic levels, 33 diatomic states */
    b = repeat_entries("{\"species\": [" GOOD1 ", {\"name\": \"V\", "
                       "\"molar_mass\": 4, \"structure\": \"linear\", "
                       "\"rotational_constants\": [1], \"vibrations\": [",
                       "{\"wavenumber\": 100}", 1001, "]}]}");
    r.text = b;
    r.len = strlen(b);
    r.status = MOLQ_ELIMIT;
    r.mention = "'vibrations'";
    r.index = -3;
    no_growth("1001 vibrations", json_body, &r);
    free(b);
    b = repeat_entries("{\"species\": [" GOOD1 ", {\"name\": \"E\", "
                       "\"molar_mass\": 4, \"structure\": \"atom\", "
                       "\"electronic_levels\": [{\"energy\": 0},",
                       "{\"energy\": 100}", 10000, "]}]}");
    r.text = b;
    r.len = strlen(b);
    r.status = MOLQ_ELIMIT;
    r.mention = "'electronic_levels'";
    r.index = -4;
    no_growth("10001 levels", json_body, &r);
    free(b);
    b = repeat_entries("{\"species\": [" GOOD1 ", {" DIA
                       "\"diatomic_states\": [",
                       "{" ST0 "}", 33, "]}]}");
    r.text = b;
    r.len = strlen(b);
    r.status = MOLQ_ELIMIT;
    r.mention = "'diatomic_states'";
    r.index = -5;
    no_growth("33 states", json_body, &r);
    free(b);
}
END_TEST

typedef struct {
    const char *path;
    molq_status status;
    const char *mention;
} file_run;

static void file_body(const void *arg)
{
    const file_run *r = arg;
    molq_db *db = (molq_db *)&db;
    molq_db *const sentinel = db;
    char err[1024] = "";
    molq_status st = molq_db_read_file(r->path, &db, err, sizeof err);
    ck_assert_msg(st == r->status, "%s: %s (%s), want %s", r->path,
                  molq_status_string(st), err,
                  molq_status_string(r->status));
    ck_assert(db == sentinel);
    ck_assert_msg(strstr(err, r->mention) != NULL,
                  "message '%s' does not mention '%s'", err, r->mention);
}

START_TEST(bad_file_paths)
{
    char path[] = "/tmp/molq-leaks-XXXXXX";
    static const char broken[] = "{\"species\": [" GOOD1 ", {\"name\": ";
    file_run r;
    int fd;
    r.path = "/nonexistent/dir/species.json";
    r.status = MOLQ_EIO;
    r.mention = "/nonexistent/dir/species.json";
    no_growth("missing file", file_body, &r);
    r.path = "/tmp"; /* a directory opens, then reading fails */
    r.status = MOLQ_EIO;
    r.mention = "/tmp";
    no_growth("directory", file_body, &r);
    fd = mkstemp(path);
    ck_assert_int_ge(fd, 0);
    ck_assert_int_eq(write(fd, broken, sizeof broken - 1),
                     (long)(sizeof broken - 1));
    close(fd);
    r.path = path;
    r.status = MOLQ_ESYNTAX;
    r.mention = "line 1";
    no_growth("truncated file", file_body, &r);
    unlink(path);
    {
        molq_db *db = (molq_db *)&db;
        char err[64];
        ck_assert_int_eq(molq_db_read_file(NULL, &db, err, sizeof err),
                         MOLQ_EARG);
        ck_assert_int_eq(molq_db_read_file("x", NULL, err, sizeof err),
                         MOLQ_EARG);
        ck_assert_int_eq(molq_db_read_string(NULL, 3, &db, err, sizeof err),
                         MOLQ_EARG);
        ck_assert_int_eq(molq_db_read_string("{}", 2, NULL, err, sizeof err),
                         MOLQ_EARG);
        ck_assert_int_eq(molq_db_builtin(NULL, err, sizeof err), MOLQ_EARG);
        ck_assert(db == (molq_db *)&db);
    }
}
END_TEST

/* ------------------------------------------------------------------------ */
/* Bad descriptions through the spec API                                    */
/* ------------------------------------------------------------------------ */

/* Each builder starts from a valid description of its kind and breaks one
 * thing.  The description is freed by the caller. */
typedef void (*spec_breaker)(molq_spec *s);

static molq_spec *base_linear(const char *name)
{
    molq_spec *s = NULL;
    double B = 1.9;
    ck_assert_int_eq(molq_spec_new(name, &s), MOLQ_OK);
    molq_spec_set_molar_mass(s, 0.028);
    molq_spec_set_structure(s, MOLQ_LINEAR);
    molq_spec_set_rotational_constants(s, &B, 1);
    molq_spec_add_vibration(s, 2100.0, 1);
    molq_spec_set_formula(s, "CO");
    molq_spec_set_source(s, "a source text to be freed");
    molq_spec_set_formation_enthalpy(s, -1e5);
    return s;
}

static molq_spec *base_diatomic(const char *name)
{
    molq_spec *s = base_linear(name);
    size_t i;
    ck_assert_int_eq(molq_spec_add_diatomic_state(s, 0.0, 1, &i), MOLQ_OK);
    molq_spec_set_dunham(s, i, 1, 0, 2000.0);
    molq_spec_set_dunham(s, i, 2, 0, -14.0);
    molq_spec_set_dunham(s, i, 0, 1, 2.0);
    molq_spec_set_dunham(s, i, 1, 1, -0.02);
    molq_spec_set_dissociation_energy(s, 7e4);
    return s;
}

typedef struct {
    const char *what; /* also the field the message must name */
    molq_status status;
    int diatomic; /* start from base_diatomic */
    void (*brk)(molq_spec *s);
} spec_case;

static void b_name_empty(molq_spec *s) { (void)s; }
static void b_mass_nan(molq_spec *s) { molq_spec_set_molar_mass(s, NAN); }
static void b_mass_inf(molq_spec *s) { molq_spec_set_molar_mass(s, INFINITY); }
static void b_mass_zero(molq_spec *s) { molq_spec_set_molar_mass(s, 0.0); }
static void b_mass_neg(molq_spec *s) { molq_spec_set_molar_mass(s, -1.0); }
static void b_structure(molq_spec *s)
{
    molq_spec_set_structure(s, (molq_structure)7);
}
static void b_structure_neg(molq_spec *s)
{
    molq_spec_set_structure(s, (molq_structure)-1);
}
static void b_rotor(molq_spec *s) { molq_spec_set_rotor(s, (molq_rotor)5); }
static void b_sigma(molq_spec *s) { molq_spec_set_symmetry_number(s, 0); }
static void b_atom_sigma(molq_spec *s)
{
    molq_spec_set_structure(s, MOLQ_ATOM);
    molq_spec_set_rotational_constants(s, NULL, 0);
    molq_spec_set_symmetry_number(s, 3);
}
static void b_nrot(molq_spec *s)
{
    double B[3] = {3, 2, 1};
    molq_spec_set_rotational_constants(s, B, 3);
}
static void b_rot_nan(molq_spec *s)
{
    double B = NAN;
    molq_spec_set_rotational_constants(s, &B, 1);
}
static void b_rot_zero(molq_spec *s)
{
    double B = 0.0;
    molq_spec_set_rotational_constants(s, &B, 1);
}
static void b_rot_order(molq_spec *s)
{
    double B[3] = {1, 3, 2};
    molq_spec_set_structure(s, MOLQ_NONLINEAR);
    molq_spec_set_rotational_constants(s, B, 3);
}
static void b_atom_vib(molq_spec *s)
{
    molq_spec_set_structure(s, MOLQ_ATOM);
    molq_spec_set_rotational_constants(s, NULL, 0);
}
static void b_vib_zero(molq_spec *s) { molq_spec_add_vibration(s, 0.0, 1); }
static void b_vib_nan(molq_spec *s) { molq_spec_add_vibration(s, NAN, 1); }
static void b_vib_deg(molq_spec *s) { molq_spec_add_vibration(s, 500.0, 0); }
static void b_el_neg(molq_spec *s)
{
    molq_spec_add_electronic_level(s, 0.0, 1);
    molq_spec_add_electronic_level(s, -3.0, 1);
}
static void b_el_inf(molq_spec *s)
{
    molq_spec_add_electronic_level(s, 0.0, 1);
    molq_spec_add_electronic_level(s, INFINITY, 1);
}
static void b_el_deg(molq_spec *s)
{
    molq_spec_add_electronic_level(s, 0.0, -1);
}
static void b_el_ground(molq_spec *s)
{
    molq_spec_add_electronic_level(s, 10.0, 1);
}
static void b_dfh(molq_spec *s)
{
    molq_spec_set_formation_enthalpy(s, NAN);
}
/* markers only: make_case_spec builds these cases itself */
static void b_formula_unknown(molq_spec *s) { (void)s; }
static void b_model_code(molq_spec *s) { molq_spec_set_model(s, (molq_model)9); }
static void b_levels_no_states(molq_spec *s)
{
    molq_spec_set_model(s, MOLQ_MODEL_LEVELS);
}
/* diatomic states */
static void d_not_linear(molq_spec *s)
{
    double B[3] = {3, 2, 1};
    molq_spec_set_structure(s, MOLQ_NONLINEAR);
    molq_spec_set_rotational_constants(s, B, 3);
}
static void d_d0_nan(molq_spec *s)
{
    molq_spec_set_dissociation_energy(s, NAN);
}
static void d_d0_neg(molq_spec *s)
{
    molq_spec_set_dissociation_energy(s, -1.0);
}
static void d_frozen_0(molq_spec *s)
{
    molq_spec_set_spin_isomers_frozen(s, 0.0);
}
static void d_frozen_nan(molq_spec *s)
{
    molq_spec_set_spin_isomers_frozen(s, NAN);
}
static void d_te_nan(molq_spec *s)
{
    size_t i;
    molq_spec_add_diatomic_state(s, NAN, 1, &i);
}
static void d_te_neg(molq_spec *s)
{
    size_t i;
    molq_spec_add_diatomic_state(s, -1.0, 1, &i);
}
static void d_deg(molq_spec *s)
{
    size_t i;
    molq_spec_add_diatomic_state(s, 5000.0, 0, &i);
    molq_spec_set_dunham(s, i, 1, 0, 1000.0);
    molq_spec_set_dunham(s, i, 0, 1, 1.0);
}
static void d_dunham_nan(molq_spec *s) { molq_spec_set_dunham(s, 0, 3, 2, NAN); }
static void d_we(molq_spec *s) { molq_spec_set_dunham(s, 0, 1, 0, 0.0); }
static void d_be(molq_spec *s) { molq_spec_set_dunham(s, 0, 0, 1, -1.0); }
static void d_weights_zero(molq_spec *s)
{
    molq_spec_set_rotational_weights(s, 0, 0.0, 0.0);
}
static void d_weights_nan(molq_spec *s)
{
    molq_spec_set_rotational_weights(s, 0, NAN, 1.0);
}
static void d_second_be(molq_spec *s)
{
    size_t i;
    molq_spec_add_diatomic_state(s, 1000.0, 1, &i);
    molq_spec_set_dunham(s, i, 1, 0, 1000.0); /* Be left at 0 */
}
static void d_first_te(molq_spec *s) { (void)s; }
static void d_too_many_levels(molq_spec *s)
{
    molq_spec_set_dunham(s, 0, 0, 1, 1e-6);
    molq_spec_set_dunham(s, 0, 1, 1, 0.0);
}
static void d_empty_state(molq_spec *s)
{
    size_t i;
    molq_spec_add_diatomic_state(s, 8e4, 1, &i);
    molq_spec_set_dunham(s, i, 1, 0, 1000.0);
    molq_spec_set_dunham(s, i, 0, 1, 1.0);
}

static const spec_case spec_cases[] = {
    {"name", MOLQ_EVALUE, 0, b_name_empty}, /* built with an empty name */
    {"molar_mass", MOLQ_EVALUE, 0, b_mass_nan},
    {"molar_mass", MOLQ_EVALUE, 0, b_mass_inf},
    {"molar_mass", MOLQ_EVALUE, 0, b_mass_zero},
    {"molar_mass", MOLQ_EVALUE, 0, b_mass_neg},
    {"formula", MOLQ_EVALUE, 0, b_formula_unknown},
    {"molar_mass", MOLQ_EKEY, 0, NULL}, /* neither mass nor formula */
    {"structure", MOLQ_EVALUE, 0, b_structure},
    {"structure", MOLQ_EVALUE, 0, b_structure_neg},
    {"rotor", MOLQ_EVALUE, 0, b_rotor},
    {"symmetry_number", MOLQ_EVALUE, 0, b_sigma},
    {"symmetry_number", MOLQ_EVALUE, 0, b_atom_sigma},
    {"rotational_constants", MOLQ_EVALUE, 0, b_nrot},
    {"rotational_constants[0]", MOLQ_EVALUE, 0, b_rot_nan},
    {"rotational_constants[0]", MOLQ_EVALUE, 0, b_rot_zero},
    {"A >= B >= C", MOLQ_EVALUE, 0, b_rot_order},
    {"vibrations", MOLQ_EVALUE, 0, b_atom_vib},
    {"vibrations[1].wavenumber", MOLQ_EVALUE, 0, b_vib_zero},
    {"vibrations[1].wavenumber", MOLQ_EVALUE, 0, b_vib_nan},
    {"vibrations[1].degeneracy", MOLQ_EVALUE, 0, b_vib_deg},
    {"electronic_levels[1].energy", MOLQ_EVALUE, 0, b_el_neg},
    {"electronic_levels[1].energy", MOLQ_EVALUE, 0, b_el_inf},
    {"electronic_levels[0].degeneracy", MOLQ_EVALUE, 0, b_el_deg},
    {"electronic_levels", MOLQ_EVALUE, 0, b_el_ground},
    {"formation_enthalpy_298", MOLQ_EVALUE, 0, b_dfh},
    {"model", MOLQ_EVALUE, 0, b_model_code},
    {"diatomic_states", MOLQ_EKEY, 0, b_levels_no_states},
    {"diatomic_states", MOLQ_EVALUE, 1, d_not_linear},
    {"dissociation_energy", MOLQ_EKEY, 1, NULL}, /* d0 never set */
    {"dissociation_energy", MOLQ_EVALUE, 1, d_d0_nan},
    {"dissociation_energy", MOLQ_EVALUE, 1, d_d0_neg},
    {"odd_fraction", MOLQ_EVALUE, 1, d_frozen_0},
    {"odd_fraction", MOLQ_EVALUE, 1, d_frozen_nan},
    {"diatomic_states[1].Te", MOLQ_EVALUE, 1, d_te_nan},
    {"diatomic_states[1].Te", MOLQ_EVALUE, 1, d_te_neg},
    {"diatomic_states[1].degeneracy", MOLQ_EVALUE, 1, d_deg},
    {"diatomic_states[0].Y32", MOLQ_EVALUE, 1, d_dunham_nan},
    {"diatomic_states[0].we", MOLQ_EVALUE, 1, d_we},
    {"diatomic_states[0].Be", MOLQ_EVALUE, 1, d_be},
    {"diatomic_states[0].rotational_weights", MOLQ_EVALUE, 1,
     d_weights_zero},
    {"diatomic_states[0].rotational_weights", MOLQ_EVALUE, 1,
     d_weights_nan},
    {"diatomic_states[1].Be", MOLQ_EVALUE, 1, d_second_be},
    {"diatomic_states[0].Te", MOLQ_EVALUE, 1, d_first_te},
    {"diatomic_states", MOLQ_ELIMIT, 1, d_too_many_levels},
    {"diatomic_states[1]", MOLQ_EVALUE, 1, d_empty_state},
    /* (the base diatomic has D0 = 7e4 cm^-1, a few thousand levels) */
};
#define NSPEC (sizeof spec_cases / sizeof spec_cases[0])

static molq_spec *make_case_spec(const spec_case *c)
{
    molq_spec *s = NULL;
    size_t i;
    if (c->brk == b_name_empty) {
        ck_assert_int_eq(molq_spec_new("", &s), MOLQ_OK);
        molq_spec_set_molar_mass(s, 0.004);
        return s;
    }
    if (c->brk == b_formula_unknown) {
        ck_assert_int_eq(molq_spec_new("X", &s), MOLQ_OK);
        molq_spec_set_formula(s, "C2");
        molq_spec_set_formula(s, "Qq2"); /* replaces the first formula */
        return s;
    }
    if (c->brk == NULL && !c->diatomic) {
        ck_assert_int_eq(molq_spec_new("X", &s), MOLQ_OK);
        molq_spec_set_source(s, "first");
        molq_spec_set_source(s, "second");
        return s;
    }
    if (c->brk == NULL) { /* diatomic without a dissociation energy */
        double B = 2.0;
        ck_assert_int_eq(molq_spec_new("X", &s), MOLQ_OK);
        molq_spec_set_molar_mass(s, 0.028);
        molq_spec_set_structure(s, MOLQ_LINEAR);
        molq_spec_set_rotational_constants(s, &B, 1);
        molq_spec_add_diatomic_state(s, 0.0, 1, &i);
        molq_spec_set_dunham(s, i, 1, 0, 2000.0);
        molq_spec_set_dunham(s, i, 0, 1, 2.0);
        return s;
    }
    if (c->brk == d_first_te) {
        double B = 2.0;
        ck_assert_int_eq(molq_spec_new("X", &s), MOLQ_OK);
        molq_spec_set_molar_mass(s, 0.028);
        molq_spec_set_structure(s, MOLQ_LINEAR);
        molq_spec_set_rotational_constants(s, &B, 1);
        molq_spec_set_dissociation_energy(s, 7e4);
        molq_spec_add_diatomic_state(s, 300.0, 1, &i);
        molq_spec_set_dunham(s, i, 1, 0, 2000.0);
        molq_spec_set_dunham(s, i, 0, 1, 2.0);
        return s;
    }
    s = c->diatomic ? base_diatomic("X") : base_linear("X");
    c->brk(s);
    return s;
}

static int spec_case_index;

static void spec_body(const void *arg)
{
    const spec_case *c = arg;
    molq_spec *s = make_case_spec(c);
    molq_species *sp = (molq_species *)&sp;
    molq_species *const sentinel = sp;
    char err[1024] = "";
    molq_status st = molq_species_create(s, &sp, err, sizeof err);
    ck_assert_msg(st == c->status, "spec case %d (%s): %s (%s), want %s",
                  spec_case_index, c->what, molq_status_string(st), err,
                  molq_status_string(c->status));
    ck_assert(sp == sentinel);
    ck_assert_msg(strstr(err, c->what) != NULL,
                  "spec case %d: message '%s' does not mention '%s'",
                  spec_case_index, err, c->what);
    ck_assert_int_eq(molq_species_create(s, &sp, NULL, 0), c->status);
    molq_spec_free(s);
}

START_TEST(bad_specs)
{
    spec_case_index = _i;
    heavy_divisor = spec_cases[_i].status == MOLQ_ELIMIT ? 10 : 1;
    no_growth(spec_cases[_i].what, spec_body, &spec_cases[_i]);
}
END_TEST

/* A 256-byte name, setters' own argument checks and limits. */
static void setter_body(const void *arg)
{
    molq_spec *s = NULL;
    molq_species *sp = NULL;
    char name[300], err[512];
    double B[4] = {3, 2, 1, 0.5};
    size_t i, idx = 77;
    (void)arg;

    memset(name, 'n', 256);
    name[256] = '\0';
    ck_assert_int_eq(molq_spec_new(name, &s), MOLQ_OK);
    molq_spec_set_molar_mass(s, 0.004);
    ck_assert_int_eq(molq_species_create(s, &sp, err, sizeof err),
                     MOLQ_EVALUE);
    ck_assert_ptr_nonnull(strstr(err, "'name'"));
    ck_assert_ptr_null(sp);
    molq_spec_free(s);

    /* NULL arguments */
    ck_assert_int_eq(molq_spec_new(NULL, &s), MOLQ_EARG);
    ck_assert_int_eq(molq_spec_new("x", NULL), MOLQ_EARG);
    ck_assert_int_eq(molq_spec_set_formula(NULL, "H2"), MOLQ_EARG);
    ck_assert_int_eq(molq_spec_set_source(NULL, "s"), MOLQ_EARG);
    ck_assert_int_eq(molq_spec_set_molar_mass(NULL, 1.0), MOLQ_EARG);
    ck_assert_int_eq(molq_spec_set_structure(NULL, MOLQ_ATOM), MOLQ_EARG);
    ck_assert_int_eq(molq_spec_set_symmetry_number(NULL, 1), MOLQ_EARG);
    ck_assert_int_eq(molq_spec_set_rotational_constants(NULL, B, 1),
                     MOLQ_EARG);
    ck_assert_int_eq(molq_spec_set_rotor(NULL, MOLQ_ROTOR_CLASSICAL),
                     MOLQ_EARG);
    ck_assert_int_eq(molq_spec_add_vibration(NULL, 1.0, 1), MOLQ_EARG);
    ck_assert_int_eq(molq_spec_add_electronic_level(NULL, 0.0, 1), MOLQ_EARG);
    ck_assert_int_eq(molq_spec_set_formation_enthalpy(NULL, 0.0), MOLQ_EARG);
    ck_assert_int_eq(molq_spec_set_model(NULL, MOLQ_MODEL_RRHO), MOLQ_EARG);
    ck_assert_int_eq(molq_spec_add_diatomic_state(NULL, 0.0, 1, &idx),
                     MOLQ_EARG);
    ck_assert_int_eq(molq_spec_set_dunham(NULL, 0, 1, 0, 1.0), MOLQ_EARG);
    ck_assert_int_eq(molq_spec_set_rotational_weights(NULL, 0, 1, 1),
                     MOLQ_EARG);
    ck_assert_int_eq(molq_spec_set_dissociation_energy(NULL, 1.0), MOLQ_EARG);
    ck_assert_int_eq(molq_spec_set_spin_isomers_frozen(NULL, 0.5), MOLQ_EARG);
    ck_assert_int_eq(molq_species_create(NULL, &sp, err, sizeof err),
                     MOLQ_EARG);
    ck_assert_ptr_null(sp);

    s = base_diatomic("Y");
    ck_assert_int_eq(molq_species_create(s, NULL, err, sizeof err),
                     MOLQ_EARG);
    ck_assert_int_eq(molq_spec_set_formula(s, NULL), MOLQ_EARG);
    ck_assert_int_eq(molq_spec_set_source(s, NULL), MOLQ_EARG);
    ck_assert_int_eq(molq_spec_set_rotational_constants(s, B, 4), MOLQ_EARG);
    ck_assert_int_eq(molq_spec_set_rotational_constants(s, NULL, 1),
                     MOLQ_EARG);
    ck_assert_int_eq(molq_spec_set_dunham(s, 1, 1, 0, 1.0), MOLQ_EARG);
    ck_assert_int_eq(molq_spec_set_dunham(s, 0, 6, 0, 1.0), MOLQ_EARG);
    ck_assert_int_eq(molq_spec_set_dunham(s, 0, 0, 4, 1.0), MOLQ_EARG);
    ck_assert_int_eq(molq_spec_set_rotational_weights(s, 5, 1.0, 1.0),
                     MOLQ_EARG);
    /* state limit: 32 states, the 33rd is refused, nothing leaks */
    for (i = 1; i < 32; i++)
        ck_assert_int_eq(molq_spec_add_diatomic_state(s, 1e3 * i, 1, NULL),
                         MOLQ_OK);
    ck_assert_int_eq(molq_spec_add_diatomic_state(s, 5e4, 1, &idx),
                     MOLQ_ELIMIT);
    ck_assert_uint_eq(idx, 77);
    molq_spec_free(s);

    /* vibration and level limits through the setters */
    ck_assert_int_eq(molq_spec_new("Z", &s), MOLQ_OK);
    for (i = 0; i < 1000; i++)
        ck_assert_int_eq(molq_spec_add_vibration(s, 100.0 + i, 1), MOLQ_OK);
    ck_assert_int_eq(molq_spec_add_vibration(s, 5.0, 1), MOLQ_ELIMIT);
    for (i = 0; i < 10000; i++)
        ck_assert_int_eq(molq_spec_add_electronic_level(s, (double)i, 1),
                         MOLQ_OK);
    ck_assert_int_eq(molq_spec_add_electronic_level(s, 1.0, 1), MOLQ_ELIMIT);
    molq_spec_free(s);
}

START_TEST(setters)
{
    no_growth("setters", setter_body, NULL);
}
END_TEST

/* molq_species_with_model failures, and good species made and freed. */
static void model_body(const void *arg)
{
    molq_db *db = NULL;
    molq_species *sp = NULL, *alt = NULL;
    char err[512];
    size_t i;
    (void)arg;
    ck_assert_int_eq(molq_db_builtin(&db, err, sizeof err), MOLQ_OK);
    for (i = 0; i < molq_db_count(db); i++) {
        const molq_species *b = molq_db_species(db, i);
        molq_status st;
        alt = NULL;
        st = molq_species_with_model(b, MOLQ_MODEL_LEVELS, &alt, err,
                                     sizeof err);
        ck_assert(st == MOLQ_OK || st == MOLQ_EVALUE || st == MOLQ_EKEY);
        molq_species_free(alt);
        alt = NULL;
        st = molq_species_with_model(b, (molq_model)7, &alt, err, sizeof err);
        ck_assert_int_eq(st, MOLQ_EARG);
        ck_assert_ptr_null(alt);
    }
    ck_assert_int_eq(molq_species_with_model(NULL, MOLQ_MODEL_RRHO, &alt, err,
                                             sizeof err),
                     MOLQ_EARG);
    {
        molq_spec *s = base_diatomic("W");
        ck_assert_int_eq(molq_species_create(s, &sp, err, sizeof err),
                         MOLQ_OK);
        molq_spec_free(s);
        ck_assert_int_eq(molq_species_with_model(sp, MOLQ_MODEL_RRHO, &alt,
                                                 err, sizeof err),
                         MOLQ_OK);
        ck_assert_int_eq(molq_species_with_model(sp, MOLQ_MODEL_LEVELS, NULL,
                                                 err, sizeof err),
                         MOLQ_EARG);
        molq_species_free(alt);
        molq_species_free(sp);
    }
    molq_db_free(db);
}

START_TEST(model_variants)
{
    heavy_divisor = 10; /* builds every starter species twice per call */
    no_growth("model variants", model_body, NULL);
}
END_TEST

/* Allocation failure (MOLQ_ENOMEM) cannot be provoked from outside the
 * library without interposing malloc, and jansson allocates through its
 * own hooks; see the hardening report for the allocator hook proposed for
 * that.  What can be checked here is that the counters above work: a
 * deliberate leak must be seen. */
static void *volatile keep[4096];
static size_t nkeep;

static void leaky_body(const void *arg)
{
    (void)arg;
    if (nkeep < sizeof keep / sizeof keep[0])
        keep[nkeep++] = malloc(64);
}

START_TEST(counter_sees_a_leak)
{
    size_t i, n = rounds() < 2000 ? rounds() : 2000;
    long long before, after;
    if (heap_in_use() < 0)
        return; /* valgrind / sanitiser build: they do the counting */
    leaky_body(NULL);
    before = heap_in_use();
    for (i = 0; i < n; i++)
        leaky_body(NULL);
    after = heap_in_use();
    ck_assert_msg(after - before >= 64 * (long long)n,
                  "heap counter missed a leak: %lld -> %lld", before, after);
    for (i = 0; i < nkeep; i++)
        free(keep[i]);
    nkeep = 0;
}
END_TEST

int main(void)
{
    Suite *s = suite_create("hardening-leaks");
    TCase *tc = tcase_create("leaks");
    tcase_set_timeout(tc, 900);
    tcase_add_loop_test(tc, bad_files, 0, NJSON);
    tcase_add_test(tc, generated_bad_files);
    tcase_add_test(tc, bad_file_paths);
    tcase_add_loop_test(tc, bad_specs, 0, NSPEC);
    tcase_add_test(tc, setters);
    tcase_add_test(tc, model_variants);
    tcase_add_test(tc, counter_sees_a_leak);
    suite_add_tcase(s, tc);
    return tu_run(s);
}
