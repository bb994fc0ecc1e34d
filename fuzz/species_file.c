/* species_file.c -- fuzz target for molq_db_read_string (species files).
 *
 * The input bytes are the file text, passed with their length and without a
 * terminating NUL (molq.h: "need not be NUL-terminated"), so AddressSanitizer
 * sees any read past the end.
 *
 * On success: the database is consistent (count, lookup by name finds the
 * same object, index == count gives NULL) and every species satisfies the
 * invariants of check_species.h at a ladder of temperatures from 1e-3 K to
 * 1e6 K plus its own t_min, at 1e5 Pa.
 * On failure: the status is one molq_db_read_string documents, *out is
 * untouched, and the error buffer is NUL-terminated and non-empty -- also
 * when the buffer is only a few bytes long. */
#include "check_species.h"

static const double ladder[] = {1e-3, 1.0, 10.0, 50.0, 298.15, 1000.0,
                                3000.0, 6000.0, 20000.0, 1e6};
#define NLADDER (sizeof ladder / sizeof ladder[0])

static void check_species_at_ladder(const molq_species *sp)
{
    fz_state st[NLADDER + 1];
    double tmin = molq_species_t_min(sp);
    size_t n = 0, i, k;
    int tmin_done = !(tmin > 0.0 && isfinite(tmin));

    fz_check_queries(sp);
    for (i = 0; i < NLADDER; i++) {
        if (!tmin_done && tmin <= ladder[i]) {
            fz_check_state(sp, tmin, 1e5, &st[n++]);
            tmin_done = 1;
        }
        fz_check_state(sp, ladder[i], 1e5, &st[n++]);
    }
    if (!tmin_done)
        fz_check_state(sp, tmin, 1e5, &st[n++]);
    for (i = 0; i < n; i++)
        for (k = i + 1; k < n; k++)
            fz_check_pair(sp, &st[i], &st[k]);
}

int LLVMFuzzerTestOneInput(const uint8_t *data, size_t size)
{
    molq_db *const sentinel = (molq_db *)&sentinel;
    molq_db *db = sentinel;
    char err[512];
    molq_status st;

    memset(err, 'x', sizeof err);
    st = molq_db_read_string((const char *)data, size, &db, err, sizeof err);
    if (st != MOLQ_OK) {
        size_t small;
        char tiny[16];
        CHECK(st == MOLQ_ESYNTAX || st == MOLQ_EKEY || st == MOLQ_ETYPE ||
                  st == MOLQ_EVALUE || st == MOLQ_EDUPLICATE ||
                  st == MOLQ_ELIMIT || st == MOLQ_ENOMEM,
              "molq_db_read_string returned undocumented status %d", (int)st);
        CHECK(db == sentinel, "*out changed on failure");
        CHECK(fz_err_ok(err, sizeof err, 1),
              "error buffer not NUL-terminated or empty (status %d)", (int)st);
        /* The same failure into a tiny buffer: truncated, still a string,
         * same status. */
        small = 1 + size % sizeof tiny;
        memset(tiny, 'x', sizeof tiny);
        CHECK(molq_db_read_string((const char *)data, size, &db, tiny,
                                  small) == st,
              "status changed with a smaller error buffer");
        CHECK(fz_err_ok(tiny, small, 1), "tiny error buffer (%zu) not a "
              "NUL-terminated non-empty string", small);
        CHECK(small == sizeof tiny || tiny[small] == 'x',
              "wrote past errlen %zu", small);
        CHECK(db == sentinel, "*out changed on failure");
        return 0;
    }

    CHECK(db != NULL && db != sentinel, "MOLQ_OK without a database");
    {
        size_t n = molq_db_count(db), i;
        for (i = 0; i < n; i++) {
            const molq_species *sp = molq_db_species(db, i), *found = NULL;
            CHECK(sp != NULL, "molq_db_species(%zu) NULL below count %zu", i,
                  n);
            CHECK(molq_db_find(db, molq_species_name(sp), &found) == MOLQ_OK &&
                      found == sp,
                  "molq_db_find('%s') does not give species #%zu back",
                  molq_species_name(sp), i + 1);
            check_species_at_ladder(sp);
        }
        CHECK(molq_db_species(db, n) == NULL, "index == count not NULL");
    }
    molq_db_free(db);
    return 0;
}
