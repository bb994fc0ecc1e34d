/* Species databases: read JSON (lib/data), validate and build each species,
 * reject duplicate names.  All-or-nothing: on any error nothing survives. */
#include <errno.h>
#include <stdio.h>
#include <stdlib.h>
#include <string.h>

#include "core/errbuf.h"
#include "data/json_reader.h"
#include "species/species.h"
#include "thermo/thermo.h"

extern const char molq_builtin_json[];
extern const size_t molq_builtin_json_len;

struct molq_db_s {
    size_t n;
    molq_species **sp;
};

void molq_db_free(molq_db *db)
{
    size_t i;
    if (db == NULL)
        return;
    for (i = 0; i < db->n; i++)
        molq_species_destroy(db->sp[i]);
    free(db->sp);
    free(db);
}

molq_status molq_db_read_string(const char *json, size_t len, molq_db **out,
                                char *err, size_t errlen)
{
    molq_spec **specs = NULL;
    size_t n = 0, i, j;
    molq_status st;
    molq_db *db;
    if (json == NULL || out == NULL) {
        molq_errf(err, errlen, "molq_db_read_string: NULL argument");
        return MOLQ_EARG;
    }
    if ((st = molq_json_read_specs(json, len, &specs, &n, err, errlen)) !=
        MOLQ_OK)
        return st;
    db = calloc(1, sizeof *db);
    if (db == NULL || (n > 0 && (db->sp = calloc(n, sizeof *db->sp)) == NULL)) {
        st = MOLQ_ENOMEM;
        molq_errf(err, errlen, "species file: out of memory");
        goto fail;
    }
    for (i = 0; i < n; i++) {
        for (j = 0; j < i; j++)
            if (strcmp(specs[i]->name, specs[j]->name) == 0) {
                molq_errf(err, errlen, "species '%s': field 'name': duplicate "
                          "of species #%zu", specs[i]->name, j + 1);
                st = MOLQ_EDUPLICATE;
                goto fail;
            }
        st = molq_species_create(specs[i], &db->sp[i], err, errlen);
        if (st != MOLQ_OK)
            goto fail;
        db->n = i + 1;
    }
    molq_specs_free(specs, n);
    *out = db;
    return MOLQ_OK;
fail:
    molq_specs_free(specs, n);
    molq_db_free(db);
    return st;
}

molq_status molq_db_read_file(const char *path, molq_db **out, char *err,
                              size_t errlen)
{
    FILE *f;
    char *buf;
    size_t cap = 65536, len = 0, got;
    molq_status st;
    if (path == NULL || out == NULL) {
        molq_errf(err, errlen, "molq_db_read_file: NULL argument");
        return MOLQ_EARG;
    }
    f = fopen(path, "rb");
    if (f == NULL) {
        molq_errf(err, errlen, "%s: cannot open for reading: %s", path,
                  strerror(errno));
        return MOLQ_EIO;
    }
    buf = malloc(cap);
    while (buf != NULL && (got = fread(buf + len, 1, cap - len, f)) > 0) {
        len += got;
        if (len > MOLQ_MAX_FILE_BYTES)
            break;
        if (len == cap) {
            char *nb = realloc(buf, cap * 2);
            if (nb == NULL)
                free(buf);
            buf = nb;
            cap *= 2;
        }
    }
    if (buf == NULL) {
        fclose(f);
        molq_errf(err, errlen, "%s: out of memory", path);
        return MOLQ_ENOMEM;
    }
    if (ferror(f)) {
        fclose(f);
        free(buf);
        molq_errf(err, errlen, "%s: read error", path);
        return MOLQ_EIO;
    }
    fclose(f);
    if (len > MOLQ_MAX_FILE_BYTES) {
        free(buf);
        molq_errf(err, errlen, "%s: larger than the limit of %u bytes", path,
                  MOLQ_MAX_FILE_BYTES);
        return MOLQ_ELIMIT;
    }
    st = molq_db_read_string(buf, len, out, err, errlen);
    free(buf);
    return st;
}

molq_status molq_db_builtin(molq_db **out, char *err, size_t errlen)
{
    return molq_db_read_string(molq_builtin_json, molq_builtin_json_len, out,
                               err, errlen);
}

size_t molq_db_count(const molq_db *db)
{
    return db ? db->n : 0;
}

const molq_species *molq_db_species(const molq_db *db, size_t index)
{
    return (db != NULL && index < db->n) ? db->sp[index] : NULL;
}

molq_status molq_db_find(const molq_db *db, const char *name,
                         const molq_species **out)
{
    size_t i;
    if (db == NULL || name == NULL || out == NULL)
        return MOLQ_EARG;
    for (i = 0; i < db->n; i++)
        if (strcmp(db->sp[i]->name, name) == 0) {
            *out = db->sp[i];
            return MOLQ_OK;
        }
    return MOLQ_ENOTFOUND;
}
