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

/* ar: standard atomic weight; iso: mass of the most abundant isotope in u
 * (the nuclide named in brackets), from the Atomic Mass Evaluation AME 2020
 * (Wang et al., Chin. Phys. C 45, 030003 (2021)), quoted from memory; 12C
 * is 12 by definition.  Used for moments of inertia from a geometry. */
static const struct {
    const char *sym;
    double ar, iso;
} weights[] = {
    {"H", 1.008, 1.00782503223},        /* 1H */
    {"He", 4.002602, 4.00260325413},    /* 4He */
    {"Li", 6.94, 7.0160034366},         /* 7Li */
    {"Be", 9.0121831, 9.012183065},     /* 9Be */
    {"B", 10.81, 11.00930536},          /* 11B */
    {"C", 12.011, 12.0},                /* 12C */
    {"N", 14.007, 14.00307400443},      /* 14N */
    {"O", 15.999, 15.99491461957},      /* 16O */
    {"F", 18.998403162, 18.99840316273}, /* 19F */
    {"Ne", 20.1797, 19.9924401762},     /* 20Ne */
    {"Na", 22.98976928, 22.989769282},  /* 23Na */
    {"Mg", 24.305, 23.985041697},       /* 24Mg */
    {"Al", 26.9815384, 26.98153841},    /* 27Al */
    {"Si", 28.085, 27.97692653465},     /* 28Si */
    {"P", 30.973761998, 30.97376199842}, /* 31P */
    {"S", 32.06, 31.9720711744},        /* 32S */
    {"Cl", 35.45, 34.968852682},        /* 35Cl */
    {"Ar", 39.95, 39.9623831237},       /* 40Ar */
    {"K", 39.0983, 38.9637064864},      /* 39K */
    {"Ca", 40.078, 39.962590863},       /* 40Ca */
    {"Ti", 47.867, 47.94794198},        /* 48Ti */
    {"Cr", 51.9961, 51.94050623},       /* 52Cr */
    {"Fe", 55.845, 55.93493633},        /* 56Fe */
    {"Ni", 58.6934, 57.93534241},       /* 58Ni */
    {"Cu", 63.546, 62.92959772},        /* 63Cu */
    {"Zn", 65.38, 63.92914201},         /* 64Zn */
    {"Br", 79.904, 78.9183376},         /* 79Br */
    {"Kr", 83.798, 83.9114977282},      /* 84Kr */
    {"I", 126.90447, 126.9044719},      /* 127I */
    {"Xe", 131.293, 131.9041550856},    /* 132Xe */
    /* deuterium, atomic mass (AME 2020) */
    {"D", 2.01410177812, 2.01410177812},
};

#define MAX_DEPTH 8
#define NWEIGHTS (sizeof weights / sizeof weights[0])
#define MAX_ATOMS 1000000L /* atoms of one element in one formula */

static int lookup_index(const char *sym, size_t len)
{
    size_t i;
    for (i = 0; i < NWEIGHTS; i++)
        if (strlen(weights[i].sym) == len &&
            strncmp(weights[i].sym, sym, len) == 0)
            return (int)i;
    return -1;
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

/* Trailing charge: one or more '+' (or '-'), or one sign and a count. */
static int read_charge(const char *p, int *charge)
{
    int sign, n = 0;
    if (*p != '+' && *p != '-')
        return 0;
    sign = *p == '+' ? 1 : -1;
    if (isdigit((unsigned char)p[1])) {
        long c;
        p++;
        c = read_count(&p);
        if (c <= 0 || c > 100 || *p != '\0')
            return 0;
        *charge = sign * (int)c;
        return 1;
    }
    while (*p == (sign > 0 ? '+' : '-')) {
        if (++n > 100)
            return 0;
        p++;
    }
    if (*p != '\0')
        return 0;
    *charge = sign * n;
    return 1;
}

molq_status molq_formula_parse(const char *formula, molq_composition *out,
                               char *err, size_t errlen)
{
    /* counts per element of the weight table, one row per open bracket */
    long stack[MAX_DEPTH + 1][NWEIGHTS];
    int order[NWEIGHTS]; /* elements in order of first appearance */
    size_t norder = 0, i;
    int depth = 0, charge = 0;
    double mass = 0.0;
    const char *p = formula;
    memset(stack[0], 0, sizeof stack[0]);
    if (strcmp(formula, "e-") == 0) { /* the electron */
        memset(out, 0, sizeof *out);
        out->charge = -1;
        out->molar_mass = MOLQ_M_E_MOLAR;
        return MOLQ_OK;
    }
    while (*p != '\0') {
        if (isupper((unsigned char)*p)) {
            const char *s = p++;
            int k;
            long n;
            size_t j;
            while (islower((unsigned char)*p))
                p++;
            k = lookup_index(s, (size_t)(p - s));
            if (k < 0) {
                molq_errf(err, errlen, "unknown element '%.*s' in formula "
                          "'%s'", (int)(p - s), s, formula);
                return MOLQ_EVALUE;
            }
            n = read_count(&p);
            if (n <= 0)
                goto bad;
            stack[depth][k] += n;
            if (stack[depth][k] > MAX_ATOMS)
                goto bad;
            for (j = 0; j < norder && order[j] != k; j++)
                ;
            if (j == norder)
                order[norder++] = k;
        } else if (*p == '(') {
            if (++depth > MAX_DEPTH)
                goto bad;
            memset(stack[depth], 0, sizeof stack[depth]);
            p++;
        } else if (*p == ')') {
            long n;
            if (depth == 0)
                goto bad;
            p++;
            n = read_count(&p);
            if (n <= 0)
                goto bad;
            for (i = 0; i < NWEIGHTS; i++) {
                stack[depth - 1][i] += stack[depth][i] * n;
                if (stack[depth - 1][i] > MAX_ATOMS)
                    goto bad;
            }
            depth--;
        } else if ((*p == '+' || *p == '-') && p != formula) {
            if (!read_charge(p, &charge))
                goto bad;
            break;
        } else {
            goto bad;
        }
    }
    if (depth != 0 || norder == 0)
        goto bad;
    if (norder > MOLQ_MAX_ELEMENTS) {
        molq_errf(err, errlen, "formula '%s' has %zu elements, more than %d",
                  formula, norder, MOLQ_MAX_ELEMENTS);
        return MOLQ_EVALUE;
    }
    memset(out, 0, sizeof *out);
    for (i = 0; i < norder; i++) {
        out->el[i].symbol = weights[order[i]].sym;
        out->el[i].count = stack[0][order[i]];
        mass += weights[order[i]].ar * (double)stack[0][order[i]];
    }
    out->n = norder;
    out->charge = charge;
    /* an ion's mass: its atoms' less (or plus) the electrons' */
    out->molar_mass = mass * MOLQ_M_U * MOLQ_N_AVOGADRO -
                      (double)charge * MOLQ_M_E_MOLAR;
    if (!(out->molar_mass > 0.0))
        goto bad;
    return MOLQ_OK;
bad:
    molq_errf(err, errlen, "cannot read formula '%s' (write element symbols "
              "with counts and an optional trailing charge, e.g. CO2, "
              "Ca(OH)2, N2+, O-, e-)", formula);
    return MOLQ_EVALUE;
}

double molq_isotope_mass(const char *symbol)
{
    int k = symbol != NULL ? lookup_index(symbol, strlen(symbol)) : -1;
    return k < 0 ? 0.0 : weights[k].iso;
}

molq_status molq_formula_molar_mass(const char *formula, double *out,
                                    char *err, size_t errlen)
{
    molq_composition c;
    molq_status st = molq_formula_parse(formula, &c, err, errlen);
    if (st == MOLQ_OK)
        *out = c.molar_mass;
    return st;
}
