/* data/json_reader.h -- species files (JSON, schema version 1) to specs.
 * Only this file and json_reader.c know the key names of the format. */
#ifndef MOLQ_DATA_JSON_READER_H
#define MOLQ_DATA_JSON_READER_H

#include "data/spec.h"

/* Parse `len` bytes of JSON into *n specs (*specs is a malloc'd array of
 * specs the caller frees with molq_specs_free).  Checks syntax, keys and
 * types; values are judged later by molq_spec_validate.  On failure nothing
 * is left allocated.  Warnings about the file (a missing schema_version)
 * are appended to `warn` (may be NULL). */
molq_status molq_json_read_specs(const char *text, size_t len,
                                 molq_spec ***specs, size_t *n,
                                 molq_warnlist *warn, char *err,
                                 size_t errlen);

void molq_specs_free(molq_spec **specs, size_t n);

#endif
