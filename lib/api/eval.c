/* Public evaluation calls: argument checks, then lib/thermo. */
#include <math.h>

#include "species/species.h"
#include "thermo/thermo.h"

static int bad_prop(molq_property p)
{
    return (int)p < 0 || (size_t)p >= molq_property_count();
}

/* t_min: the gas's limit for whole-species results, the models' own
 * (sp->t_min_internal) for one internal mode or the spin conversion. */
static molq_status check_state_at(double t_min, double T, double p)
{
    if (!isfinite(T) || T <= 0.0 || !isfinite(p) || p <= 0.0)
        return MOLQ_EDOMAIN;
    if (T < t_min)
        return MOLQ_ERANGE;
    return MOLQ_OK;
}

static molq_status check_state(const molq_species *sp, double T, double p)
{
    return check_state_at(sp->t_min, T, p);
}

/* MOLQ_OK promises finite numbers: a result that overflows a double (only
 * at absurd temperatures such as 1e-300 K) is reported as out of range. */
static molq_status check_finite(const double *v, size_t n)
{
    size_t i;
    for (i = 0; i < n; i++)
        if (!isfinite(v[i]))
            return MOLQ_ERANGE;
    return MOLQ_OK;
}

molq_status molq_eval_many(const molq_species *sp, double T, double p,
                           const molq_property *props, size_t nprops,
                           double *out)
{
    molq_status st;
    size_t i;
    if (sp == NULL || (nprops > 0 && (props == NULL || out == NULL)))
        return MOLQ_EARG;
    for (i = 0; i < nprops; i++)
        if (bad_prop(props[i]))
            return MOLQ_EARG;
    if ((st = check_state(sp, T, p)) != MOLQ_OK)
        return st;
    molq_thermo_eval(sp, T, p, props, nprops, out);
    return check_finite(out, nprops);
}

molq_status molq_eval(const molq_species *sp, double T, double p,
                      molq_property prop, double *out)
{
    double v;
    molq_status st;
    if (out == NULL)
        return MOLQ_EARG;
    st = molq_eval_many(sp, T, p, &prop, 1, &v);
    if (st == MOLQ_OK)
        *out = v;
    return st;
}

molq_status molq_eval_batch(const molq_species *sp, molq_property prop,
                            double p, const double *T, size_t T_stride,
                            double *out, size_t out_stride, size_t n)
{
    size_t i;
    if (sp == NULL || bad_prop(prop) || T_stride == 0 || out_stride == 0 ||
        (n > 0 && (T == NULL || out == NULL)))
        return MOLQ_EARG;
    for (i = 0; i < n; i++) {
        double t = T[i * T_stride];
        molq_status st = check_state(sp, t, p);
        if (st != MOLQ_OK)
            return st;
        molq_thermo_eval(sp, t, p, &prop, 1, &out[i * out_stride]);
        if ((st = check_finite(&out[i * out_stride], 1)) != MOLQ_OK)
            return st;
    }
    return MOLQ_OK;
}

molq_status molq_eval_per_mass(const molq_species *sp, double T, double p,
                               molq_property prop, double *out)
{
    double v;
    molq_status st;
    if (out == NULL)
        return MOLQ_EARG;
    if ((st = molq_eval(sp, T, p, prop, &v)) != MOLQ_OK)
        return st;
    if (prop != MOLQ_LNQ && prop != MOLQ_DGRT_DT) {
        v /= sp->molar_mass;
        if ((st = check_finite(&v, 1)) != MOLQ_OK)
            return st; /* an absurdly small molar mass */
    }
    *out = v;
    return MOLQ_OK;
}

molq_status molq_eval_mode(const molq_species *sp, size_t index, double T,
                           double p, molq_property prop, double *out)
{
    molq_status st;
    double v;
    if (sp == NULL || out == NULL || index >= sp->nmodes || bad_prop(prop))
        return MOLQ_EARG;
    st = check_state_at(sp->modes[index].kind == MOLQ_MODE_TRANSLATION
                            ? sp->t_min
                            : sp->t_min_internal,
                        T, p);
    if (st != MOLQ_OK)
        return st;
    if (molq_thermo_mode(sp, index, T, p, prop, &v) != 0)
        return MOLQ_EARG;
    if ((st = check_finite(&v, 1)) != MOLQ_OK)
        return st;
    *out = v;
    return MOLQ_OK;
}

molq_status molq_eval_spin_conversion(const molq_species *sp, double T,
                                      double *out)
{
    molq_status st;
    size_t i;
    if (sp == NULL || out == NULL || sp->model != MOLQ_MODEL_LEVELS)
        return MOLQ_EARG;
    if ((st = check_state_at(sp->t_min_internal, T, MOLQ_P_STANDARD)) !=
        MOLQ_OK)
        return st;
    for (i = 0; i < sp->nmodes; i++)
        if (sp->modes[i].kind == MOLQ_MODE_ROVIBRONIC) {
            double v = molq_thermo_spin_conversion(sp, i, T);
            return check_finite(&v, 1) == MOLQ_OK ? (*out = v, MOLQ_OK)
                                                  : MOLQ_ERANGE;
        }
    *out = 0.0; /* no spin isomers modelled */
    return MOLQ_OK;
}
