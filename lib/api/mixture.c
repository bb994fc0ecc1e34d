/* Public mixture calls: argument and batch checks, then lib/mixture.
 * Every batch call checks all of its inputs before it writes anything. */
#include <math.h>
#include <stdlib.h>
#include <string.h>

#include "core/constants.h"
#include "core/errbuf.h"
#include "thermo/thermo.h"
#include "mixture/mixture.h"

#define MOLQ_MIX_MAX_SPECIES 100000u
#define MOLQ_MIX_DEFAULT_T_HI 6000.0

static const char *const mix_names[] = {
    "molar_mass", "gas_constant", "cp", "cv", "h", "u", "s", "g",
    "gamma", "sound_speed", "dcp_dT", "dcv_dT",
};
#define NMIXPROPS (sizeof mix_names / sizeof mix_names[0])

size_t molq_mix_property_count(void)
{
    return NMIXPROPS;
}

const char *molq_mix_property_name(molq_mix_property prop)
{
    if ((int)prop < 0 || (size_t)prop >= NMIXPROPS)
        return NULL;
    return mix_names[prop];
}

molq_status molq_mix_property_from_name(const char *name,
                                        molq_mix_property *out)
{
    size_t i;
    if (name == NULL || out == NULL)
        return MOLQ_EARG;
    for (i = 0; i < NMIXPROPS; i++)
        if (strcmp(name, mix_names[i]) == 0) {
            *out = (molq_mix_property)i;
            return MOLQ_OK;
        }
    return MOLQ_ENOTFOUND;
}

static const molq_mix_config default_config = {
    MOLQ_MIX_EXACT, 1e-6, 0, 1e-10, 100u, 0, 0.0, 0.0,
};

molq_status molq_mix_config_new(molq_mix_config **out)
{
    molq_mix_config *c;
    if (out == NULL)
        return MOLQ_EARG;
    if ((c = malloc(sizeof *c)) == NULL)
        return MOLQ_ENOMEM;
    *c = default_config;
    *out = c;
    return MOLQ_OK;
}

void molq_mix_config_free(molq_mix_config *cfg)
{
    free(cfg);
}

molq_status molq_mix_config_set_method(molq_mix_config *cfg,
                                       molq_mix_method method)
{
    if (cfg == NULL || method != MOLQ_MIX_EXACT)
        return MOLQ_EARG;
    cfg->method = method;
    return MOLQ_OK;
}

molq_status molq_mix_config_set_composition(molq_mix_config *cfg, double tol,
                                            int normalise)
{
    if (cfg == NULL)
        return MOLQ_EARG;
    if (!(tol >= 0.0 && tol < 0.1))
        return MOLQ_EVALUE;
    cfg->comp_tol = tol;
    cfg->normalise = normalise != 0;
    return MOLQ_OK;
}

molq_status molq_mix_config_set_inversion(molq_mix_config *cfg, double rtol,
                                          unsigned max_evaluations)
{
    if (cfg == NULL)
        return MOLQ_EARG;
    if (!(rtol >= 1e-15 && rtol <= 1e-3) || max_evaluations < 1u ||
        max_evaluations > 10000u)
        return MOLQ_EVALUE;
    cfg->rtol = rtol;
    cfg->max_eval = max_evaluations;
    return MOLQ_OK;
}

molq_status molq_mix_config_set_temperature_bounds(molq_mix_config *cfg,
                                                   double t_lo, double t_hi)
{
    if (cfg == NULL)
        return MOLQ_EARG;
    if (!(isfinite(t_lo) && isfinite(t_hi) && t_lo > 0.0 && t_hi > t_lo))
        return MOLQ_EVALUE;
    cfg->has_bounds = 1;
    cfg->t_lo = t_lo;
    cfg->t_hi = t_hi;
    return MOLQ_OK;
}

molq_status molq_mixture_create(const molq_species *const *species, size_t n,
                                const molq_mix_config *cfg,
                                molq_mixture **out, char *err, size_t errlen)
{
    molq_mixture *m;
    double lo = 0.0, hi = INFINITY, tmin = 0.0;
    size_t k, j;
    if (out == NULL || species == NULL || n == 0) {
        molq_errf(err, errlen, "mixture: %s",
                  n == 0 ? "no species given" : "NULL argument");
        return MOLQ_EARG;
    }
    if (n > MOLQ_MIX_MAX_SPECIES) {
        molq_errf(err, errlen, "mixture: %zu species, over the limit %u", n,
                  MOLQ_MIX_MAX_SPECIES);
        return MOLQ_ELIMIT;
    }
    if (cfg == NULL)
        cfg = &default_config;
    for (k = 0; k < n; k++) {
        const molq_species *sp = species[k];
        double a, b;
        if (sp == NULL) {
            molq_errf(err, errlen, "mixture: species %zu is NULL", k);
            return MOLQ_EARG;
        }
        for (j = 0; j < k; j++)
            if (strcmp(species[j]->name, sp->name) == 0) {
                molq_errf(err, errlen,
                          "mixture: species %zu and %zu are both '%s'", j, k,
                          sp->name);
                return MOLQ_EDUPLICATE;
            }
        if (sp->t_min > tmin)
            tmin = sp->t_min;
        a = sp->has_range ? sp->range_lo : sp->t_min;
        b = sp->has_range ? sp->range_hi : MOLQ_MIX_DEFAULT_T_HI;
        if (a < sp->t_min)
            a = sp->t_min;
        if (a > lo)
            lo = a;
        if (b < hi)
            hi = b;
    }
    if (cfg->has_bounds) {
        lo = cfg->t_lo;
        hi = cfg->t_hi;
        if (lo < tmin) {
            molq_errf(err, errlen,
                      "mixture: temperature bounds: t_lo %g K lies below "
                      "%g K, the lowest temperature all species evaluate at",
                      lo, tmin);
            return MOLQ_EVALUE;
        }
    } else if (!(hi > lo)) {
        molq_errf(err, errlen,
                  "mixture: the species' validated ranges do not overlap "
                  "(%g K .. %g K); set temperature bounds in the config",
                  lo, hi);
        return MOLQ_EVALUE;
    }
    m = calloc(1, sizeof *m);
    if (m == NULL)
        return MOLQ_ENOMEM;
    m->sp = malloc(n * sizeof *m->sp);
    m->w = malloc(2 * n * sizeof *m->w);
    if (m->sp == NULL || m->w == NULL) {
        free(m->sp);
        free(m->w);
        free(m);
        return MOLQ_ENOMEM;
    }
    m->inv_w = m->w + n;
    for (k = 0; k < n; k++) {
        m->sp[k] = species[k];
        m->w[k] = species[k]->molar_mass;
        m->inv_w[k] = 1.0 / species[k]->molar_mass;
    }
    m->n = n;
    m->t_min = tmin;
    m->t_lo = lo;
    m->t_hi = hi;
    m->cfg = *cfg;
    *out = m;
    return MOLQ_OK;
}

molq_status molq_mixture_from_names(const molq_db *db,
                                    const char *const *names, size_t n,
                                    const molq_mix_config *cfg,
                                    molq_mixture **out, char *err,
                                    size_t errlen)
{
    const molq_species **sp;
    molq_status st;
    size_t k;
    if (db == NULL || names == NULL || out == NULL || n == 0) {
        molq_errf(err, errlen, "mixture: %s",
                  n == 0 ? "no species given" : "NULL argument");
        return MOLQ_EARG;
    }
    if (n > MOLQ_MIX_MAX_SPECIES) {
        molq_errf(err, errlen, "mixture: %zu species, over the limit %u", n,
                  MOLQ_MIX_MAX_SPECIES);
        return MOLQ_ELIMIT;
    }
    if ((sp = malloc(n * sizeof *sp)) == NULL)
        return MOLQ_ENOMEM;
    for (k = 0; k < n; k++) {
        if (names[k] == NULL) {
            molq_errf(err, errlen, "mixture: name %zu is NULL", k);
            free(sp);
            return MOLQ_EARG;
        }
        if (molq_db_find(db, names[k], &sp[k]) != MOLQ_OK &&
            molq_db_find_formula(db, names[k], &sp[k]) != MOLQ_OK) {
            molq_errf(err, errlen,
                      "mixture: species %zu '%s' is not in the database", k,
                      names[k]);
            free(sp);
            return MOLQ_ENOTFOUND;
        }
    }
    st = molq_mixture_create(sp, n, cfg, out, err, errlen);
    free(sp);
    return st;
}

void molq_mixture_free(molq_mixture *mix)
{
    if (mix == NULL)
        return;
    free(mix->sp);
    free(mix->w);
    free(mix);
}

size_t molq_mixture_species_count(const molq_mixture *mix)
{
    return mix == NULL ? 0 : mix->n;
}

const molq_species *molq_mixture_species(const molq_mixture *mix, size_t k)
{
    if (mix == NULL || k >= mix->n)
        return NULL;
    return mix->sp[k];
}

molq_status molq_mixture_index(const molq_mixture *mix, const char *name,
                               size_t *out)
{
    size_t k;
    if (mix == NULL || name == NULL || out == NULL)
        return MOLQ_EARG;
    for (k = 0; k < mix->n; k++)
        if (strcmp(mix->sp[k]->name, name) == 0) {
            *out = k;
            return MOLQ_OK;
        }
    return MOLQ_ENOTFOUND;
}

molq_mix_method molq_mixture_method(const molq_mixture *mix)
{
    return mix == NULL ? MOLQ_MIX_EXACT : mix->cfg.method;
}

molq_status molq_mixture_temperature_bounds(const molq_mixture *mix,
                                            double *t_lo, double *t_hi)
{
    if (mix == NULL || t_lo == NULL || t_hi == NULL)
        return MOLQ_EARG;
    *t_lo = mix->t_lo;
    *t_hi = mix->t_hi;
    return MOLQ_OK;
}

/* ---- batch checks ------------------------------------------------------ */

static molq_status fail_cell(size_t *bad_cell, size_t c, molq_status st)
{
    if (bad_cell != NULL)
        *bad_cell = c;
    return st;
}

/* Check one cell's composition. */
static molq_status check_composition(const molq_mixture *mix, const double *X,
                                     size_t X_species, size_t c, char *err,
                                     size_t errlen)
{
    double sum = 0.0, tol = mix->cfg.comp_tol;
    size_t k;
    for (k = 0; k < mix->n; k++) {
        double v = X[k * X_species];
        if (!isfinite(v)) {
            molq_errf(err, errlen, "cell %zu: fraction of %s is not finite",
                      c, mix->sp[k]->name);
            return MOLQ_EVALUE;
        }
        if (v < -tol) {
            molq_errf(err, errlen,
                      "cell %zu: fraction of %s is %g, below -%g (the "
                      "composition tolerance)",
                      c, mix->sp[k]->name, v, tol);
            return MOLQ_EVALUE;
        }
        if (v > 0.0)
            sum += v;
    }
    if (!(sum > 0.0) || !isfinite(sum)) {
        molq_errf(err, errlen, "cell %zu: fractions sum to %g", c, sum);
        return MOLQ_EVALUE;
    }
    if (!mix->cfg.normalise && fabs(sum - 1.0) > tol) {
        molq_errf(err, errlen,
                  "cell %zu: fractions sum to %.17g, farther than %g from 1 "
                  "(normalisation is off)",
                  c, sum, tol);
        return MOLQ_EVALUE;
    }
    return MOLQ_OK;
}

static molq_status check_state(const molq_mixture *mix, double T, double p,
                               size_t c, char *err, size_t errlen)
{
    if (!isfinite(T) || T <= 0.0 || !isfinite(p) || p <= 0.0) {
        molq_errf(err, errlen, "cell %zu: %s = %g is not finite and > 0", c,
                  (!isfinite(T) || T <= 0.0) ? "T" : "p",
                  (!isfinite(T) || T <= 0.0) ? T : p);
        return MOLQ_EDOMAIN;
    }
    if (T < mix->t_min) {
        size_t k;
        const char *who = "";
        for (k = 0; k < mix->n; k++)
            if (mix->sp[k]->t_min == mix->t_min)
                who = mix->sp[k]->name;
        molq_errf(err, errlen,
                  "cell %zu: T = %g K lies below %g K, the lowest "
                  "temperature of species %s",
                  c, T, mix->t_min, who);
        return MOLQ_ERANGE;
    }
    return MOLQ_OK;
}

static molq_status check_batch(const molq_mixture *mix, size_t ncells,
                               const double *T, size_t T_stride,
                               const double *p, size_t p_stride,
                               const double *X, size_t X_cell,
                               size_t X_species, size_t *bad_cell, char *err,
                               size_t errlen)
{
    size_t c;
    for (c = 0; c < ncells; c++) {
        molq_status st;
        if (T != NULL &&
            (st = check_state(mix, T[c * T_stride],
                              p != NULL ? p[c * p_stride] : MOLQ_P_STANDARD,
                              c, err, errlen)) != MOLQ_OK)
            return fail_cell(bad_cell, c, st);
        if (X != NULL && (X_cell != 0 || c == 0) &&
            (st = check_composition(mix, X + c * X_cell, X_species, c, err,
                                    errlen)) != MOLQ_OK)
            return fail_cell(bad_cell, c, st);
    }
    return MOLQ_OK;
}

static int bad_basis(molq_basis b)
{
    return b != MOLQ_MOLE_FRACTIONS && b != MOLQ_MASS_FRACTIONS;
}

static int bad_per(molq_per p)
{
    return p != MOLQ_PER_MOLE && p != MOLQ_PER_MASS;
}

static molq_status arg_error(char *err, size_t errlen, const char *what)
{
    molq_errf(err, errlen, "%s", what);
    return MOLQ_EARG;
}

/* MOLQ_OK promises finite numbers. */
static molq_status check_finite_cell(const double *out, size_t stride,
                                     size_t n, size_t c, size_t *bad_cell,
                                     char *err, size_t errlen)
{
    size_t j;
    for (j = 0; j < n; j++)
        if (!isfinite(out[j * stride])) {
            molq_errf(err, errlen,
                      "cell %zu: a result overflowed (cells before it were "
                      "written)",
                      c);
            return fail_cell(bad_cell, c, MOLQ_ERANGE);
        }
    return MOLQ_OK;
}

molq_status molq_mixture_eval(const molq_mixture *mix, size_t ncells,
                              const double *T, size_t T_stride,
                              const double *p, size_t p_stride,
                              const double *X, size_t X_cell,
                              size_t X_species, molq_basis basis,
                              const molq_mix_property *props, size_t nprops,
                              molq_per per, double *out, size_t out_cell,
                              size_t out_prop, size_t *bad_cell, char *err,
                              size_t errlen)
{
    molq_status st;
    unsigned need = 0u;
    size_t c, j;
    if (bad_cell != NULL)
        *bad_cell = 0;
    if (mix == NULL || (ncells > 0 && (T == NULL || p == NULL || X == NULL ||
                                       (nprops > 0 && (props == NULL ||
                                                       out == NULL)))))
        return arg_error(err, errlen, "mixture eval: NULL argument");
    if (bad_basis(basis) || bad_per(per))
        return arg_error(err, errlen, "mixture eval: unknown basis or per");
    if (X_species == 0 && mix->n > 1)
        return arg_error(err, errlen, "mixture eval: X_species stride is 0");
    if ((nprops > 1 && out_prop == 0) || (ncells > 1 && out_cell == 0))
        return arg_error(err, errlen, "mixture eval: output stride is 0");
    for (j = 0; j < nprops; j++) {
        if ((int)props[j] < 0 || (size_t)props[j] >= NMIXPROPS) {
            molq_errf(err, errlen, "mixture eval: props[%zu] = %d unknown", j,
                      (int)props[j]);
            return MOLQ_EARG;
        }
        if (props[j] == MOLQ_MIX_S || props[j] == MOLQ_MIX_G)
            need |= MOLQ_MIX_NEED_S;
        if (props[j] == MOLQ_MIX_DCP_DT || props[j] == MOLQ_MIX_DCV_DT)
            need |= MOLQ_MIX_NEED_DCP;
    }
    if ((st = check_batch(mix, ncells, T, T_stride, p, p_stride, X, X_cell,
                          X_species, bad_cell, err, errlen)) != MOLQ_OK)
        return st;
    for (c = 0; c < ncells; c++) {
        molq_mix_sums s;
        double t = T[c * T_stride];
        double *o = out + c * out_cell;
        molq_mix_cell(mix, t, p[c * p_stride], X + c * X_cell, X_species,
                      basis, need, &s);
        for (j = 0; j < nprops; j++)
            o[j * out_prop] = molq_mix_property_value(&s, t, props[j], per);
        if ((st = check_finite_cell(o, out_prop, nprops, c, bad_cell, err,
                                    errlen)) != MOLQ_OK)
            return st;
    }
    if (bad_cell != NULL)
        *bad_cell = ncells;
    return MOLQ_OK;
}

molq_status molq_mixture_eval_species(
    const molq_mixture *mix, size_t ncells, const double *T, size_t T_stride,
    const double *p, size_t p_stride, const molq_property *props,
    size_t nprops, molq_per per, double *out, size_t out_cell,
    size_t out_species, size_t out_prop, size_t *bad_cell, char *err,
    size_t errlen)
{
    molq_status st;
    size_t c, j, k;
    if (bad_cell != NULL)
        *bad_cell = 0;
    if (mix == NULL || (ncells > 0 && (T == NULL || p == NULL ||
                                       (nprops > 0 && (props == NULL ||
                                                       out == NULL)))))
        return arg_error(err, errlen, "mixture species eval: NULL argument");
    if (bad_per(per))
        return arg_error(err, errlen, "mixture species eval: unknown per");
    if ((nprops > 1 && out_prop == 0) || (ncells > 1 && out_cell == 0) ||
        (mix->n > 1 && out_species == 0))
        return arg_error(err, errlen,
                         "mixture species eval: output stride is 0");
    for (j = 0; j < nprops; j++)
        if ((int)props[j] < 0 || (size_t)props[j] >= molq_property_count()) {
            molq_errf(err, errlen,
                      "mixture species eval: props[%zu] = %d unknown", j,
                      (int)props[j]);
            return MOLQ_EARG;
        }
    if ((st = check_batch(mix, ncells, T, T_stride, p, p_stride, NULL, 0, 0,
                          bad_cell, err, errlen)) != MOLQ_OK)
        return st;
    for (c = 0; c < ncells; c++) {
        double t = T[c * T_stride], pc = p[c * p_stride];
        for (k = 0; k < mix->n; k++) {
            double *o = out + c * out_cell + k * out_species;
            /* molq_eval_many's kernel, one property at a time so that
             * strided output needs no scratch. */
            for (j = 0; j < nprops; j++) {
                double v;
                molq_thermo_eval(mix->sp[k], t, pc, &props[j], 1, &v);
                if (per == MOLQ_PER_MASS && props[j] != MOLQ_LNQ &&
                    props[j] != MOLQ_DGRT_DT)
                    v *= mix->inv_w[k];
                o[j * out_prop] = v;
            }
            if ((st = check_finite_cell(o, out_prop, nprops, c, bad_cell, err,
                                        errlen)) != MOLQ_OK)
                return st;
        }
    }
    if (bad_cell != NULL)
        *bad_cell = ncells;
    return MOLQ_OK;
}

molq_status molq_mixture_convert(const molq_mixture *mix, size_t ncells,
                                 molq_basis from, const double *X,
                                 size_t X_cell, size_t X_species, double *out,
                                 size_t out_cell, size_t out_species,
                                 size_t *bad_cell, char *err, size_t errlen)
{
    molq_status st;
    size_t c, k;
    if (bad_cell != NULL)
        *bad_cell = 0;
    if (mix == NULL || (ncells > 0 && (X == NULL || out == NULL)))
        return arg_error(err, errlen, "mixture convert: NULL argument");
    if (bad_basis(from))
        return arg_error(err, errlen, "mixture convert: unknown basis");
    if (mix->n > 1 && (X_species == 0 || out_species == 0))
        return arg_error(err, errlen, "mixture convert: species stride is 0");
    if (ncells > 1 && out_cell == 0)
        return arg_error(err, errlen, "mixture convert: output stride is 0");
    if ((st = check_batch(mix, ncells, NULL, 0, NULL, 0, X, X_cell, X_species,
                          bad_cell, err, errlen)) != MOLQ_OK)
        return st;
    for (c = 0; c < ncells; c++) {
        const double *x = X + c * X_cell;
        double *o = out + c * out_cell;
        double f = molq_mix_mole_factor(mix, x, X_species, from), sum = 0.0;
        for (k = 0; k < mix->n; k++) {
            double xk = molq_mix_x(mix, x, X_species, from, k, f);
            /* mole -> mass: Y_k = x_k W_k / sum; mass -> mole: x_k */
            double v = from == MOLQ_MOLE_FRACTIONS ? xk * mix->w[k] : xk;
            o[k * out_species] = v;
            sum += v;
        }
        if (from == MOLQ_MOLE_FRACTIONS)
            for (k = 0; k < mix->n; k++)
                o[k * out_species] /= sum;
    }
    if (bad_cell != NULL)
        *bad_cell = ncells;
    return MOLQ_OK;
}

molq_status molq_mixture_temperature(
    const molq_mixture *mix, molq_mix_property given, molq_per per,
    size_t ncells, const double *value, size_t value_stride, const double *p,
    size_t p_stride, const double *X, size_t X_cell, size_t X_species,
    molq_basis basis, const double *T_guess, size_t guess_stride,
    double *T_out, size_t T_out_stride, unsigned *iterations,
    size_t *bad_cell, char *err, size_t errlen)
{
    molq_status st;
    size_t c;
    if (bad_cell != NULL)
        *bad_cell = 0;
    if (mix == NULL ||
        (ncells > 0 && (value == NULL || X == NULL || T_out == NULL ||
                        (given == MOLQ_MIX_S && p == NULL))))
        return arg_error(err, errlen, "mixture temperature: NULL argument");
    if (given != MOLQ_MIX_H && given != MOLQ_MIX_U && given != MOLQ_MIX_S)
        return arg_error(err, errlen,
                         "mixture temperature: given must be h, u or s");
    if (bad_basis(basis) || bad_per(per))
        return arg_error(err, errlen,
                         "mixture temperature: unknown basis or per");
    if (X_species == 0 && mix->n > 1)
        return arg_error(err, errlen,
                         "mixture temperature: X_species stride is 0");
    if (ncells > 1 && T_out_stride == 0)
        return arg_error(err, errlen,
                         "mixture temperature: T_out stride is 0");
    for (c = 0; c < ncells; c++) {
        double v = value[c * value_stride];
        if (!isfinite(v)) {
            molq_errf(err, errlen, "cell %zu: the given %s is not finite", c,
                      mix_names[given]);
            return fail_cell(bad_cell, c, MOLQ_EDOMAIN);
        }
        if (given == MOLQ_MIX_S) {
            double pc = p[c * p_stride];
            if (!isfinite(pc) || pc <= 0.0) {
                molq_errf(err, errlen, "cell %zu: p = %g is not finite and "
                          "> 0", c, pc);
                return fail_cell(bad_cell, c, MOLQ_EDOMAIN);
            }
        }
        if (T_guess != NULL && !isfinite(T_guess[c * guess_stride])) {
            molq_errf(err, errlen, "cell %zu: T_guess is not finite", c);
            return fail_cell(bad_cell, c, MOLQ_EDOMAIN);
        }
    }
    if ((st = check_batch(mix, ncells, NULL, 0, NULL, 0, X, X_cell, X_species,
                          bad_cell, err, errlen)) != MOLQ_OK)
        return st;
    for (c = 0; c < ncells; c++) {
        const double *x = X + c * X_cell;
        double target = value[c * value_stride], pc, guess, T, end = 0.0;
        unsigned n = 0;
        int r;
        pc = given == MOLQ_MIX_S ? p[c * p_stride] : MOLQ_P_STANDARD;
        if (per == MOLQ_PER_MASS) {
            /* per kg -> per mol: times the mean molar mass */
            double f = molq_mix_mole_factor(mix, x, X_species, basis), w = 0;
            size_t k;
            for (k = 0; k < mix->n; k++)
                w += molq_mix_x(mix, x, X_species, basis, k, f) * mix->w[k];
            target *= w;
        }
        guess = T_guess != NULL ? T_guess[c * guess_stride]
                                : sqrt(mix->t_lo * mix->t_hi);
        r = molq_mix_solve_t(mix, given, target, pc, x, X_species, basis,
                             guess, &T, &n, &end);
        if (r == 1 || r == 2) {
            molq_errf(err, errlen,
                      "cell %zu: the given %s (%g per mole) lies %s %g, its "
                      "value at %g K, the %s end of the temperature bounds",
                      c, mix_names[given], target,
                      r == 1 ? "below" : "above", end,
                      r == 1 ? mix->t_lo : mix->t_hi, r == 1 ? "low" : "high");
            return fail_cell(bad_cell, c, MOLQ_ERANGE);
        }
        if (r == 3) {
            molq_errf(err, errlen,
                      "cell %zu: no convergence in %u evaluations", c, n);
            return fail_cell(bad_cell, c, MOLQ_ENOCONV);
        }
        T_out[c * T_out_stride] = T;
        if (iterations != NULL)
            iterations[c] = n;
    }
    if (bad_cell != NULL)
        *bad_cell = ncells;
    return MOLQ_OK;
}
