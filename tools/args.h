/* args.h -- strict parsing of numeric command-line values for the molq tool.
 *
 * Every function returns 0 on success and -1 on failure; on failure `msg`
 * receives a one-line explanation that names the option and quotes the bad
 * text, e.g. "option --T: '0' must be greater than 0". */
#ifndef MOLQ_TOOLS_ARGS_H
#define MOLQ_TOOLS_ARGS_H

#include <stddef.h>

/* Most temperature points one --T may give. */
#define CLI_MAX_POINTS 1000000

/* Parse `text` as one finite decimal number with nothing before or after it
 * (no blanks, no hexadecimal, no nan/inf, no overflow or underflow).  On
 * failure `why` receives the reason without the option name. */
int cli_parse_number(const char *text, double *out, char *why, size_t whylen);

/* Parse a number that must be finite and > 0 (used for --p).  `opt` is the
 * option name used in the message. */
int cli_parse_positive(const char *opt, const char *text, double *out,
                       char *msg, size_t msglen);

/* Parse a temperature list: either comma-separated values "300,400,1000"
 * or an inclusive range "START:STOP:STEP" (STOP is included when the last
 * step lands within 1e-9 STEP of it).  Every value must be > 0, STEP > 0,
 * START <= STOP, at most CLI_MAX_POINTS points.  *out is malloc'ed and
 * becomes the caller's. */
int cli_parse_temperatures(const char *opt, const char *text, double **out,
                           size_t *n, char *msg, size_t msglen);

/* Look `text` up in the n names `names` (exact, case-sensitive match) and
 * store its position in *index.  On failure `msg` reads
 * "option OPT: unknown NOUN 'TEXT' (use a, b or c)". */
int cli_parse_choice(const char *opt, const char *noun, const char *text,
                     const char *const *names, size_t n, size_t *index,
                     char *msg, size_t msglen);

/* Parse a comma-separated list of distinct names from `names` (n of them)
 * such as "rrho,levels": positions into out[0..*count-1] in the order
 * given.  `out` must have room for n entries.  Empty entries, unknown and
 * repeated names are errors. */
int cli_parse_choice_list(const char *opt, const char *noun,
                          const char *text, const char *const *names,
                          size_t n, size_t *out, size_t *count, char *msg,
                          size_t msglen);

#endif
