/* Molar mass from a chemical formula.
 *
 * Standard atomic weights: IUPAC CIAAW abridged / conventional values
 * (Prohaska et al., Pure Appl. Chem. 94, 573 (2022)), quoted from memory;
 * for elements given as an interval IUPAC's conventional value is used.
 * M = Ar * M_u with M_u = m_u N_A (CODATA 2018 m_u, exact N_A). */
#include <ctype.h>
#include <stdlib.h>
#include <string.h>

#include "core/constants.h"
#include "core/errbuf.h"
#include "data/spec.h"

static const struct {
    const char *sym;
    double ar;
} weights[] = {
    {"H", 1.008},      {"He", 4.002602},  {"Li", 6.94},
    {"Be", 9.0121831}, {"B", 10.81},      {"C", 12.011},
    {"N", 14.007},     {"O", 15.999},     {"F", 18.998403162},
    {"Ne", 20.1797},   {"Na", 22.98976928}, {"Mg", 24.305},
    {"Al", 26.9815384}, {"Si", 28.085},   {"P", 30.973761998},
    {"S", 32.06},      {"Cl", 35.45},     {"Ar", 39.95},
    {"K", 39.0983},    {"Ca", 40.078},    {"Ti", 47.867},
    {"Cr", 51.9961},   {"Fe", 55.845},    {"Ni", 58.6934},
    {"Cu", 63.546},    {"Zn", 65.38},     {"Br", 79.904},
    {"Kr", 83.798},    {"I", 126.90447},  {"Xe", 131.293},
    {"D", 2.01410177812}, /* deuterium, atomic mass (AME 2020) */
};

#define MAX_DEPTH 8

static double lookup(const char *sym, size_t len)
{
    size_t i;
    for (i = 0; i < sizeof weights / sizeof weights[0]; i++)
        if (strlen(weights[i].sym) == len &&
            strncmp(weights[i].sym, sym, len) == 0)
            return weights[i].ar;
    return 0.0;
}

static long read_count(const char **p)
{
    long n = 0;
    if (!isdigit((unsigned char)**p))
        return 1;
    while (isdigit((unsigned char)**p)) {
        n = n * 10 + (**p - '0');
        if (n > 100000)
            return -1;
        (*p)++;
    }
    return n;
}

molq_status molq_formula_molar_mass(const char *formula, double *out,
                                    char *err, size_t errlen)
{
    double stack[MAX_DEPTH + 1] = {0.0};
    int depth = 0;
    const char *p = formula;
    while (*p != '\0') {
        if (isupper((unsigned char)*p)) {
            const char *s = p++;
            double ar;
            long n;
            while (islower((unsigned char)*p))
                p++;
            ar = lookup(s, (size_t)(p - s));
            if (ar == 0.0) {
                molq_errf(err, errlen, "unknown element '%.*s' in formula "
                          "'%s'", (int)(p - s), s, formula);
                return MOLQ_EVALUE;
            }
            n = read_count(&p);
            if (n <= 0)
                goto bad;
            stack[depth] += ar * (double)n;
        } else if (*p == '(') {
            if (++depth > MAX_DEPTH)
                goto bad;
            stack[depth] = 0.0;
            p++;
        } else if (*p == ')') {
            long n;
            if (depth == 0)
                goto bad;
            p++;
            n = read_count(&p);
            if (n <= 0)
                goto bad;
            stack[depth - 1] += stack[depth] * (double)n;
            depth--;
        } else {
            goto bad;
        }
    }
    if (depth != 0 || stack[0] <= 0.0)
        goto bad;
    *out = stack[0] * MOLQ_M_U * MOLQ_N_AVOGADRO;
    return MOLQ_OK;
bad:
    molq_errf(err, errlen, "cannot read formula '%s' (write element symbols "
              "with counts, e.g. CO2, CH3OH, Ca(OH)2)", formula);
    return MOLQ_EVALUE;
}
