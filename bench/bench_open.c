/* bench_open: what opening the built-in species set costs (a CLI call or a
 * simulator start-up pays it once), in total and per species, with the
 * share of the species that build level tables.  Prints; asserts nothing
 * about time.  Exit 0, or 2 when the set cannot be opened. */
#define _POSIX_C_SOURCE 199309L
#include <stdio.h>
#include <stdlib.h>
#include <string.h>
#include <time.h>

#include <molq/molq.h>

static double now(void)
{
    struct timespec ts;
    clock_gettime(CLOCK_MONOTONIC, &ts);
    return ts.tv_sec + 1e-9 * ts.tv_nsec;
}

int main(int argc, char **argv)
{
    int rounds = (argc > 1 && strcmp(argv[1], "--quick") == 0) ? 2 : 10;
    double best = 1e30, total = 0.0;
    size_t n = 0, levels = 0, i;
    int r;
    char err[512];
    for (r = 0; r < rounds; r++) {
        molq_db *db;
        double t0 = now(), dt;
        if (molq_db_builtin(&db, err, sizeof err) != MOLQ_OK) {
            fprintf(stderr, "bench_open: %s\n", err);
            return 2;
        }
        dt = now() - t0;
        n = molq_db_count(db);
        levels = 0;
        for (i = 0; i < n; i++)
            levels += molq_species_model(molq_db_species(db, i)) ==
                      MOLQ_MODEL_LEVELS;
        molq_db_free(db);
        best = dt < best ? dt : best;
        total += dt;
    }
    printf("molq_db_builtin: %zu species (%zu with level sums), best of %d: "
           "%.1f ms (%.2f ms per species), mean %.1f ms\n",
           n, levels, rounds, 1e3 * best, 1e3 * best / (double)n,
           1e3 * total / rounds);
    return 0;
}
