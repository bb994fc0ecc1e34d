#include "testutil.h"

#include <stdio.h>
#include <stdlib.h>
#include <string.h>

static molq_db *builtin;

int tu_run(Suite *s)
{
    SRunner *sr = srunner_create(s);
    int failed;
    srunner_run_all(sr, CK_NORMAL);
    failed = srunner_ntests_failed(sr);
    srunner_free(sr);
    return failed == 0 ? EXIT_SUCCESS : EXIT_FAILURE;
}

const molq_db *tu_builtin(void)
{
    if (builtin == NULL) {
        char err[256];
        ck_assert_msg(molq_db_builtin(&builtin, err, sizeof err) == MOLQ_OK,
                      "builtin: %s", err);
    }
    return builtin;
}

const molq_species *tu_species(const char *name)
{
    const molq_species *sp = NULL;
    ck_assert_int_eq(molq_db_find(tu_builtin(), name, &sp), MOLQ_OK);
    return sp;
}

const molq_species *tu_species_model(const char *name, molq_model model)
{
    static struct {
        const char *name;
        molq_model model;
        molq_species *sp;
    } cache[32];
    static size_t n;
    char err[256];
    size_t i;
    for (i = 0; i < n; i++)
        if (strcmp(cache[i].name, name) == 0 && cache[i].model == model)
            return cache[i].sp;
    ck_assert_uint_lt(n, 32);
    ck_assert_msg(molq_species_with_model(tu_species(name), model,
                                          &cache[n].sp, err,
                                          sizeof err) == MOLQ_OK,
                  "%s: %s", name, err);
    cache[n].name = name;
    cache[n].model = model;
    return cache[n++].sp;
}

double tu_eval(const molq_species *sp, double T, double p, molq_property prop)
{
    double v = NAN;
    molq_status st = molq_eval(sp, T, p, prop, &v);
    ck_assert_msg(st == MOLQ_OK, "%s at T=%g: %s", molq_species_name(sp), T,
                  molq_status_string(st));
    ck_assert_msg(isfinite(v), "%s %s at T=%g is not finite",
                  molq_species_name(sp), molq_property_name(prop), T);
    return v;
}

const molq_species *tu_from_json(const char *json, molq_db **db)
{
    char err[512];
    molq_status st = molq_db_read_string(json, strlen(json), db, err,
                                         sizeof err);
    ck_assert_msg(st == MOLQ_OK, "test species: %s", err);
    return molq_db_species(*db, 0);
}

size_t tu_mode_index(const molq_species *sp, molq_mode_kind kind)
{
    size_t i;
    for (i = 0; i < molq_species_mode_count(sp); i++) {
        molq_mode_kind k;
        ck_assert_int_eq(molq_species_mode_kind(sp, i, &k), MOLQ_OK);
        if (k == kind)
            return i;
    }
    ck_abort_msg("%s has no %s mode", molq_species_name(sp),
                 molq_mode_kind_name(kind));
    return 0;
}

double tu_eval_kind(const molq_species *sp, molq_mode_kind kind, double T,
                    molq_property prop)
{
    double v;
    ck_assert_int_eq(
        molq_eval_mode(sp, tu_mode_index(sp, kind), T, 1e5, prop, &v),
        MOLQ_OK);
    return v;
}

int tu_close(double a, double b, double rel, double floor)
{
    double scale = fmax(fmax(fabs(a), fabs(b)), floor);
    return fabs(a - b) <= rel * scale;
}

void tu_read_janaf(const char *name, tu_table *t)
{
    const char *dir = getenv("MOLQ_TEST_DATA");
    char path[1024], line[512];
    FILE *f;
    snprintf(path, sizeof path, "%s/janaf/%s.tsv", dir ? dir : "data", name);
    f = fopen(path, "r");
    ck_assert_msg(f != NULL, "cannot open %s", path);
    t->n = 0;
    while (fgets(line, sizeof line, f) != NULL) {
        double T, cp, s, gef, dh;
        if (line[0] == '#' || line[0] == 'T')
            continue;
        if (sscanf(line, "%lf %lf %lf %lf %lf", &T, &cp, &s, &gef, &dh) == 5 &&
            t->n < 128) {
            t->T[t->n] = T;
            t->cp[t->n] = cp;
            t->s[t->n] = s;
            t->gef[t->n] = gef;
            t->dh[t->n] = dh * 1e3;
            t->n++;
        }
    }
    fclose(f);
    ck_assert_msg(t->n > 10, "%s: too few rows", path);
}
