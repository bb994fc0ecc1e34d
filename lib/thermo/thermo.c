#include "thermo/thermo.h"

#include "core/constants.h"

/* Which optional cumulants a property needs. */
static unsigned need_of(molq_property prop)
{
    switch (prop) {
    case MOLQ_LNQ:
    case MOLQ_S:
    case MOLQ_G:
    case MOLQ_A:
    case MOLQ_GEF:
        return MOLQ_NEED_LNQ;
    case MOLQ_DCP_DT:
    case MOLQ_DCV_DT:
        return MOLQ_NEED_K3;
    default:
        return 0u;
    }
}

static void sum_modes(const molq_species *sp, double T, double p,
                      unsigned need, molq_cumulants *sum)
{
    size_t i;
    sum->lnq = sum->k1 = sum->k2 = sum->k3 = 0.0;
    for (i = 0; i < sp->nmodes; i++) {
        molq_cumulants c = {0.0, 0.0, 0.0, 0.0};
        sp->modes[i].eval(&sp->modes[i], T, p, need, &c);
        sum->lnq += c.lnq;
        sum->k1 += c.k1;
        sum->k2 += c.k2;
        sum->k3 += c.k3;
    }
}

void molq_thermo_prepare(molq_species *sp)
{
    molq_cumulants c;
    sum_modes(sp, MOLQ_T_REF, MOLQ_P_STANDARD, 0u, &c);
    sp->h298_minus_h0 = MOLQ_R * MOLQ_T_REF * (c.k1 + 1.0);
}

void molq_thermo_eval(const molq_species *sp, double T, double p,
                      const molq_property *props, size_t n, double *out)
{
    molq_cumulants c;
    unsigned need = 0u;
    double RT = MOLQ_R * T;
    double h_h0, h, s, cp, dcv;
    size_t i;
    for (i = 0; i < n; i++)
        need |= need_of(props[i]);
    sum_modes(sp, T, p, need, &c);

    h_h0 = RT * (c.k1 + 1.0);
    h = sp->formation_enthalpy + h_h0 - sp->h298_minus_h0;
    s = MOLQ_R * (c.lnq + c.k1 + 1.0);
    cp = MOLQ_R * (c.k2 + 1.0);
    dcv = MOLQ_R * (c.k3 - 2.0 * c.k2) / T;

    for (i = 0; i < n; i++) {
        double v = 0.0;
        switch (props[i]) {
        case MOLQ_LNQ:          v = c.lnq; break;
        case MOLQ_CP:           v = cp; break;
        case MOLQ_CV:           v = cp - MOLQ_R; break;
        case MOLQ_H:            v = h; break;
        case MOLQ_U:            v = h - RT; break;
        case MOLQ_S:            v = s; break;
        case MOLQ_G:            v = h - T * s; break;
        case MOLQ_A:            v = h - RT - T * s; break;
        case MOLQ_H_MINUS_H298: v = h_h0 - sp->h298_minus_h0; break;
        case MOLQ_GEF:          /* s - (H - H298)/T without forming H */
                                v = s - MOLQ_R * (c.k1 + 1.0) +
                                    sp->h298_minus_h0 / T;
                                break;
        case MOLQ_H_MINUS_H0:   v = h_h0; break;
        case MOLQ_DCP_DT:       v = dcv; break;
        case MOLQ_DCV_DT:       v = dcv; break;
        case MOLQ_DS_DT:        v = cp / T; break;
        case MOLQ_DH_DT:        v = cp; break;
        case MOLQ_DGRT_DT:      /* -h/(RT^2) without forming h */
                                v = -((sp->formation_enthalpy -
                                       sp->h298_minus_h0) / RT +
                                      c.k1 + 1.0) / T;
                                break;
        }
        out[i] = v;
    }
}

int molq_thermo_mode(const molq_species *sp, size_t index, double T,
                     double p, molq_property prop, double *out)
{
    const molq_mode *m = &sp->modes[index];
    molq_cumulants c = {0.0, 0.0, 0.0, 0.0};
    /* The +1 of the ideal-gas entropy (from N!) belongs to translation. */
    double one = m->kind == MOLQ_MODE_TRANSLATION ? 1.0 : 0.0;
    m->eval(m, T, p, MOLQ_NEED_LNQ | MOLQ_NEED_K3, &c);
    switch (prop) {
    case MOLQ_LNQ:    *out = c.lnq; return 0;
    case MOLQ_U:      *out = MOLQ_R * T * c.k1; return 0;
    case MOLQ_CV:     *out = MOLQ_R * c.k2; return 0;
    case MOLQ_S:      *out = MOLQ_R * (c.lnq + c.k1 + one); return 0;
    case MOLQ_DCV_DT: *out = MOLQ_R * (c.k3 - 2.0 * c.k2) / T; return 0;
    default:          return -1;
    }
}

double molq_thermo_spin_conversion(const molq_species *sp, size_t index,
                                   double T)
{
    return MOLQ_R * T * molq_rovibronic_conversion(&sp->modes[index], T);
}
