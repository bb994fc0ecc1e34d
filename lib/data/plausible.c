/* data/plausible.c -- plausibility checks of a diatomic's spectroscopic
 * constants against the textbook relations between them (common practice;
 * the relations are in any text on diatomic spectra, e.g. Herzberg,
 * Spectra of Diatomic Molecules, 1950).  Findings are warnings, never
 * errors: a user may enter an unusual but real molecule.  The bands were
 * measured on the built-in diatomics (H2, N2, O2, CO, OH; see README
 * "Plausibility checks" and tests/test_plausible.c).
 *
 *  1. Kratzer: De = 4 Be^3 / we^2, exact for the Dunham expansion of any
 *     potential to this order.  Built-in set: ratios 0.9999-1.012 (H2
 *     largest).  Band 0.8-1.25: an order-of-magnitude slip or a wrong
 *     power of ten is caught, real molecules never are.
 *  2. Pekeris: alpha_e = 6 sqrt(wexe Be^3)/we - 6 Be^2/we, exact only for
 *     a Morse potential.  Built-in set: 0.997-1.13 except H2, 1.47 (its
 *     potential is far from Morse).  Band 0.6-1.7.
 *  3. Birge-Sponer turnover of the vibrational ladder, we^2/(4 wexe), the
 *     Morse well depth, against D0 + G(0) of the ground state (Te 0).
 *     Built-in set: 0.98-1.24; Cl2, F2, CN, SO about 1.3-1.45 (constants
 *     from memory).  Band 0.7-1.8: Birge-Sponer extrapolation is known to
 *     overestimate by up to about 50 %.
 *
 *  4. Be = h / (8 pi^2 c mu re^2) when a state gives "re" (Angstrom), mu
 *     the reduced mass of the formula's two atoms from standard atomic
 *     weights: an isotope mixture, not the main isotopologue, so about
 *     0.1 % off for the molecules of the set (e.g. 14N/15N, 16O/18O at
 *     natural abundance; for Cl2 about 0.5 %), and re itself differs from
 *     the value implied by Be by the Born-Oppenheimer breakdown (< 0.1 %
 *     except for hydrides).  Band 2 %.
 *
 *  5. Rotational constants against a "geometry" (polyatomics, or any
 *     molecule): the principal moments of inertia about the centre of
 *     mass, with the masses of the most abundant isotopes (AME 2020, from
 *     memory; data/formula.c), give B = h / (8 pi^2 c I) for each axis;
 *     A >= B >= C are compared with the species' sorted constants (linear:
 *     B only).  A geometry is an equilibrium (re) structure while the
 *     constants are usually ground-state ones (B0): they differ by the
 *     vibrational averaging, B0 - Be = -sum alpha_i d_i / 2, typically
 *     0.3-1.5 % (built-in set: CO2, N2O, HCN, COS, CS2, SO2, O3, NO2,
 *     HNO and C2H6 within 1.1 %; the hydrides HO2 1.5 %, CH4 1.3 %), and
 *     the smallest constant C of a light hydride carries the inertial
 *     defect on top (H2S 2.0 %, NH3 2.4 %, H2O 2.4 %, NH2 2.5 %).  Band
 *     4 %: above all of these with room for hydrides not in the set, and
 *     a bond typed 10 % long (a 20 % error in the constants), a wrong
 *     atom or a wrong isotope of hydrogen (D for H: 10-50 %) is caught.
 *     A linear structure with a geometry that is not collinear, or the
 *     reverse, is warned instead; for a linear molecule the symmetry
 *     number must be 2 when the geometry is centrosymmetric, else 1.
 *     (The symmetry number of a nonlinear molecule is not checked.)
 *
 * The Dunham coefficients carry the signs of the expansion: Y10 = we,
 * Y20 = -wexe, Y01 = Be, Y11 = -alpha_e, Y02 = -De. */
#include <math.h>
#include <string.h>

#include "core/constants.h"
#include "core/eigen.h"
#include "data/spec.h"

#define KRATZER_LO 0.8
#define KRATZER_HI 1.25
#define PEKERIS_LO 0.6
#define PEKERIS_HI 1.7
#define TURNOVER_LO 0.7
#define TURNOVER_HI 1.8
#define BE_RE_TOL 0.02
#define GEOM_TOL 0.04
/* smallest / largest principal moment below which atoms count as
 * collinear: a bent triatomic with a 179 deg angle has about 1e-4, the
 * rounding of coordinates typed to 1e-4 Angstrom far less */
#define GEOM_COLLINEAR 1e-5
/* Angstrom: how far an atom's inversion image may miss its partner */
#define GEOM_CENTRO_TOL 1e-3

/* Reduced mass (kg/mol) of a formula of exactly two atoms; 0 otherwise. */
static double reduced_mass(const char *formula)
{
    molq_composition c;
    double ma, mb;
    const char *a, *b;
    if (formula == NULL || molq_formula_parse(formula, &c, NULL, 0) != MOLQ_OK)
        return 0.0;
    if (c.n == 1 && c.el[0].count == 2)
        a = b = c.el[0].symbol;
    else if (c.n == 2 && c.el[0].count == 1 && c.el[1].count == 1) {
        a = c.el[0].symbol;
        b = c.el[1].symbol;
    } else
        return 0.0;
    if (molq_formula_molar_mass(a, &ma, NULL, 0) != MOLQ_OK ||
        molq_formula_molar_mass(b, &mb, NULL, 0) != MOLQ_OK)
        return 0.0;
    return ma * mb / (ma + mb);
}

/* h / (8 pi^2 c) in cm^-1 amu Angstrom^2: B = GEOM_BI / I. */
#define GEOM_BI (MOLQ_H_PLANCK / (8.0 * MOLQ_PI * MOLQ_PI * MOLQ_C_LIGHT * \
                                  MOLQ_M_U * 1e-20) / 100.0)

/* Principal moments (amu Angstrom^2, ascending) of a validated geometry
 * about its centre of mass, written to mom; the centre to com. */
static void principal_moments(const molq_spec *s, double mom[3],
                              double com[3])
{
    double t[9] = {0.0}, scratch[6], mt = 0.0;
    size_t i, j, k;
    com[0] = com[1] = com[2] = 0.0;
    for (i = 0; i < s->natoms; i++) {
        double m = molq_isotope_mass(s->atoms[i].element);
        mt += m;
        for (k = 0; k < 3; k++)
            com[k] += m * s->atoms[i].xyz[k];
    }
    for (k = 0; k < 3; k++)
        com[k] /= mt;
    for (i = 0; i < s->natoms; i++) {
        double m = molq_isotope_mass(s->atoms[i].element), r[3], r2;
        for (k = 0; k < 3; k++)
            r[k] = s->atoms[i].xyz[k] - com[k];
        r2 = r[0] * r[0] + r[1] * r[1] + r[2] * r[2];
        for (j = 0; j < 3; j++)
            for (k = 0; k < 3; k++)
                t[3 * j + k] += m * ((j == k ? r2 : 0.0) - r[j] * r[k]);
    }
    molq_eigen_symm(t, 3, scratch, mom);
    for (i = 0; i < 2; i++) /* three values: sort ascending */
        for (j = i + 1; j < 3; j++)
            if (mom[j] < mom[i]) {
                double x = mom[i];
                mom[i] = mom[j];
                mom[j] = x;
            }
    for (i = 0; i < 3; i++) /* rounding can leave -1e-16 on a linear axis */
        if (mom[i] < 0.0)
            mom[i] = 0.0;
}

/* Is every atom's image through the centre of mass an atom of the same
 * element? */
static int centrosymmetric(const molq_spec *s, const double com[3])
{
    size_t i, j, k;
    for (i = 0; i < s->natoms; i++) {
        int found = 0;
        for (j = 0; j < s->natoms && !found; j++) {
            double d2 = 0.0;
            if (strcmp(s->atoms[i].element, s->atoms[j].element) != 0)
                continue;
            for (k = 0; k < 3; k++) {
                double d = 2.0 * com[k] - s->atoms[i].xyz[k] -
                           s->atoms[j].xyz[k];
                d2 += d * d;
            }
            found = d2 <= GEOM_CENTRO_TOL * GEOM_CENTRO_TOL;
        }
        if (!found)
            return 0;
    }
    return 1;
}

static molq_status check_geometry(const molq_spec *s, molq_warnlist *warn)
{
    static const char *const axis[3] = {"A", "B", "C"};
    const char *nm = s->name;
    double mom[3], com[3], geo[3];
    size_t k, n;
    int collinear;
    molq_status rc;
    principal_moments(s, mom, com);
    collinear = mom[0] <= GEOM_COLLINEAR * mom[2];
    if (!(mom[2] > 0.0))
        return MOLQ_OK; /* cannot happen for two atoms 0.1 A apart */
    if (s->structure == MOLQ_LINEAR && !collinear)
        return molq_warn(warn, "species '%s': field 'geometry': the atoms are "
                         "not collinear (principal moments %.4g, %.4g, %.4g "
                         "amu Angstrom^2) but 'structure' is linear", nm,
                         mom[0], mom[1], mom[2]);
    if (s->structure == MOLQ_NONLINEAR && collinear)
        return molq_warn(warn, "species '%s': field 'geometry': the atoms are "
                         "collinear (principal moments %.4g, %.4g, %.4g amu "
                         "Angstrom^2) but 'structure' is nonlinear", nm,
                         mom[0], mom[1], mom[2]);
    if (s->structure == MOLQ_LINEAR) {
        int centro = centrosymmetric(s, com);
        geo[0] = GEOM_BI / (0.5 * (mom[1] + mom[2]));
        n = 1;
        if (s->sigma != (centro ? 2 : 1) &&
            (rc = molq_warn(warn, "species '%s': field 'symmetry_number': %d, "
                            "but the geometry is %scentrosymmetric, so the "
                            "linear molecule's symmetry number is %d", nm,
                            s->sigma, centro ? "" : "not ",
                            centro ? 2 : 1)) != MOLQ_OK)
            return rc;
    } else {
        for (k = 0; k < 3; k++)
            geo[k] = GEOM_BI / mom[k];
        n = 3;
    }
    if (s->nrot != n)
        return MOLQ_OK; /* a diatomic's constants from its states */
    for (k = 0; k < n; k++) {
        double d = (s->rot[k] - geo[k]) / geo[k];
        if (fabs(d) > GEOM_TOL &&
            (rc = molq_warn(warn, "species '%s': field "
                            "'rotational_constants[%zu]': %s = %.6g cm^-1 "
                            "differs by %+.2g %% from %.6g cm^-1 computed from "
                            "'geometry' (principal moment %.6g amu "
                            "Angstrom^2, main-isotope masses; expected within "
                            "%g %%, allowing for vibrational averaging)", nm,
                            k, n == 1 ? "B" : axis[k], s->rot[k], 100.0 * d,
                            geo[k], n == 1 ? 0.5 * (mom[1] + mom[2]) : mom[k],
                            100.0 * GEOM_TOL)) != MOLQ_OK)
            return rc;
    }
    return MOLQ_OK;
}

static int outside(double r, double lo, double hi)
{
    return !(r >= lo && r <= hi);
}

molq_status molq_spec_plausible(const molq_spec *s, molq_warnlist *warn)
{
    const char *nm = s->name;
    size_t i;
    molq_status rc;
    if (warn == NULL)
        return MOLQ_OK;
    if (s->natoms > 0 && (rc = check_geometry(s, warn)) != MOLQ_OK)
        return rc;
    for (i = 0; i < s->nstates; i++) {
        const molq_spec_state *st = &s->states[i];
        double we = st->y[1][0], wexe = -st->y[2][0];
        double be = st->y[0][1], alpha = -st->y[1][1], de = -st->y[0][2];
        if (we > 0.0 && be > 0.0 && de != 0.0) {
            double k = 4.0 * be * be * be / (we * we);
            double r = de / k;
            if (outside(r, KRATZER_LO, KRATZER_HI) &&
                (rc = molq_warn(warn, "species '%s': field "
                                "'diatomic_states[%zu].De': %.3g cm^-1 is "
                                "%.2g x the Kratzer estimate 4 Be^3/we^2 = "
                                "%.3g cm^-1 (expected within %g-%g)", nm, i,
                                de, r, k, KRATZER_LO, KRATZER_HI)) != MOLQ_OK)
                return rc;
        }
        if (we > 0.0 && be > 0.0 && wexe > 0.0 && alpha != 0.0) {
            double p = 6.0 * sqrt(wexe * be * be * be) / we -
                       6.0 * be * be / we;
            double r = alpha / p;
            if (p > 0.0 && outside(r, PEKERIS_LO, PEKERIS_HI) &&
                (rc = molq_warn(warn, "species '%s': field "
                                "'diatomic_states[%zu].alpha_e': %.4g cm^-1 "
                                "is %.2g x the Pekeris estimate 6 sqrt(wexe "
                                "Be^3)/we - 6 Be^2/we = %.4g cm^-1 (expected "
                                "within %g-%g)", nm, i, alpha, r, p,
                                PEKERIS_LO, PEKERIS_HI)) != MOLQ_OK)
                return rc;
        }
        if (st->has_re && be > 0.0 && reduced_mass(s->formula) > 0.0) {
            double mu = reduced_mass(s->formula) / MOLQ_N_AVOGADRO; /* kg */
            double re_m = st->re * 1e-10;
            /* h / (8 pi^2 c mu re^2) in m^-1, then cm^-1 */
            double bre = MOLQ_H_PLANCK /
                         (8.0 * MOLQ_PI * MOLQ_PI * MOLQ_C_LIGHT * mu * re_m *
                          re_m) / 100.0;
            if (fabs(be - bre) > BE_RE_TOL * bre &&
                (rc = molq_warn(warn, "species '%s': field "
                                "'diatomic_states[%zu].Be': %.6g cm^-1 differs "
                                "by %.2g %% from h/(8 pi^2 c mu re^2) = %.6g "
                                "cm^-1 with re %g Angstrom and the reduced "
                                "mass of formula '%s' (expected within %g %%)",
                                nm, i, be, 100.0 * fabs(be - bre) / bre, bre,
                                st->re, s->formula, 100.0 * BE_RE_TOL)) !=
                    MOLQ_OK)
                return rc;
        }
        if (st->te == 0.0 && s->has_d0 && s->d0 > 0.0 && we > 0.0 &&
            wexe > 0.0) {
            double turn = we * we / (4.0 * wexe);
            /* G(0) above the minimum, from the vibrational Dunham row */
            double g0 = 0.5 * we - 0.25 * wexe + 0.125 * st->y[3][0] +
                        0.0625 * st->y[4][0];
            double dwell = s->d0 + g0;
            double r = turn / dwell;
            if (outside(r, TURNOVER_LO, TURNOVER_HI) &&
                (rc = molq_warn(warn, "species '%s': field "
                                "'diatomic_states[%zu].wexe': the vibrational "
                                "ladder turns over at we^2/(4 wexe) = %.4g "
                                "cm^-1, %.2g x the well depth "
                                "dissociation_energy + G(0) = %.4g cm^-1 "
                                "(expected within %g-%g)", nm, i, turn, r,
                                dwell, TURNOVER_LO, TURNOVER_HI)) != MOLQ_OK)
                return rc;
        }
    }
    return MOLQ_OK;
}
