/* Thermodynamic identities and analytic derivatives, for every built-in
 * species and one classical-rotor species: G = H - TS, A = U - TS,
 * U = H - RT, Cp - Cv = R, Cp = dH/dT, S = -dG/dT, ds/dT = Cp/T,
 * d(G/RT)/dT = -H/(RT^2), dCp/dT by finite differences, and
 * S(T2) - S(T1) = integral of Cp/T dT by adaptive quadrature (GSL QAG).
 * These are exact relations of thermodynamics (common practice). */
#include <gsl/gsl_errno.h>
#include <gsl/gsl_integration.h>
#include <stdlib.h>

#include "testutil.h"

static const double temps[] = {60.0,  150.0,  298.15, 500.0,
                               1000.0, 2345.6, 4000.0, 6000.0};
#define NT (sizeof temps / sizeof temps[0])
static const double p_test = 3.0e5;

/* Central difference with step h; the analytic value must match to `rel`
 * (chosen from the O(h^2) truncation of the difference, not loosened). */
static double central(const molq_species *sp, molq_property prop, double T,
                      double h)
{
    return (tu_eval(sp, T + h, p_test, prop) -
            tu_eval(sp, T - h, p_test, prop)) /
           (2 * h);
}

/* Richardson extrapolation of two central differences (steps h and h/2):
 * truncation O(h^4) instead of O(h^2) (common practice). */
static double central_x(const molq_species *sp, molq_property prop, double T,
                        double h)
{
    return (4.0 * central(sp, prop, T, 0.5 * h) - central(sp, prop, T, h)) /
           3.0;
}

static void check_species(const molq_species *sp)
{
    size_t i;
    for (i = 0; i < NT; i++) {
        double T = temps[i], h = 1e-4 * T;
        double H, S, G, U, A, Cp, Cv;
        if (T < molq_species_t_min(sp))
            continue;
        H = tu_eval(sp, T, p_test, MOLQ_H);
        S = tu_eval(sp, T, p_test, MOLQ_S);
        G = tu_eval(sp, T, p_test, MOLQ_G);
        U = tu_eval(sp, T, p_test, MOLQ_U);
        A = tu_eval(sp, T, p_test, MOLQ_A);
        Cp = tu_eval(sp, T, p_test, MOLQ_CP);
        Cv = tu_eval(sp, T, p_test, MOLQ_CV);
        ck_assert_close(G, H - T * S, 1e-12, fabs(T * S));
        ck_assert_close(A, U - T * S, 1e-12, fabs(T * S));
        ck_assert_close(U, H - T_R * T, 1e-12, T_R * T);
        ck_assert_close(Cp - Cv, T_R, 1e-12, 0.0);
        ck_assert_close(tu_eval(sp, T, p_test, MOLQ_DH_DT), Cp, 1e-14, 0.0);
        ck_assert_close(tu_eval(sp, T, p_test, MOLQ_DS_DT), Cp / T, 1e-14, 0.0);
        ck_assert_close(tu_eval(sp, T, p_test, MOLQ_GEF),
                        S - tu_eval(sp, T, p_test, MOLQ_H_MINUS_H298) / T,
                        1e-12, S);
        /* derivatives against finite differences */
        ck_assert_close(central(sp, MOLQ_H, T, h), Cp, 1e-7, Cp);
        ck_assert_close(-central(sp, MOLQ_G, T, h), S, 1e-7, S);
        ck_assert_close(central(sp, MOLQ_S, T, h), Cp / T, 1e-7, 0.0);
        /* dCp/dT can pass near zero (an electronic level's heat-capacity
         * bump, NO2 at 6000 K: 1.1e-5 J/(mol K^2)) while the third
         * derivative is not small, so the O(h^2) truncation of a plain
         * central difference (1.3e-11 there) can exceed 1e-6 of the floor:
         * compare with the Richardson-extrapolated difference (O(h^4)). */
        ck_assert_close(central_x(sp, MOLQ_CP, T, h),
                        tu_eval(sp, T, p_test, MOLQ_DCP_DT), 1e-6,
                        1e-3 * Cp / T);
        ck_assert_close(central_x(sp, MOLQ_CV, T, h),
                        tu_eval(sp, T, p_test, MOLQ_DCV_DT), 1e-6,
                        1e-3 * Cp / T);
        {
            double grt_fd = (tu_eval(sp, T + h, p_test, MOLQ_G) /
                                 (T_R * (T + h)) -
                             tu_eval(sp, T - h, p_test, MOLQ_G) /
                                 (T_R * (T - h))) /
                            (2 * h);
            double grt = tu_eval(sp, T, p_test, MOLQ_DGRT_DT);
            /* scale: (H - H0)/(RT^2) ~ 1/T; h itself may be 0 */
            ck_assert_close(grt, -H / (T_R * T * T), 1e-12, 1.0 / T);
            ck_assert_close(grt_fd, grt, 1e-6, fabs(S / (T_R * T)));
        }
    }
}

START_TEST(identities_builtin)
{
    const molq_db *db = tu_builtin();
    size_t i;
    for (i = 0; i < molq_db_count(db); i++)
        check_species(molq_db_species(db, i));
}
END_TEST

START_TEST(identities_classical_rotor)
{
    /* Invented test species with the classical rotor and electronic levels. */
    static const char *js =
        "{\"species\": [{\"name\": \"X\", \"molar_mass\": 50,"
        " \"structure\": \"nonlinear\", \"symmetry_number\": 3,"
        " \"rotational_constants\": [2, 1.5, 0.25], \"rotor\": \"classical\","
        " \"vibrations\": [{\"wavenumber\": 300, \"degeneracy\": 2},"
        " {\"wavenumber\": 1100}],"
        " \"electronic_levels\": [{\"energy\": 0, \"degeneracy\": 2},"
        " {\"energy\": 900, \"degeneracy\": 4}],"
        " \"formation_enthalpy_298\": -12345}]}";
    molq_db *db;
    check_species(tu_from_json(js, &db));
    molq_db_free(db);
}
END_TEST

START_TEST(identities_frozen_spin_isomers)
{
    /* Normal hydrogen: a frozen 3:1 mixture of the two nuclear-spin
     * modifications (invented variant of the starter constants). */
    static const char *js =
        "{\"species\": [{\"name\": \"nH2\", \"molar_mass\": 2.01588,"
        " \"structure\": \"linear\", \"symmetry_number\": 2,"
        " \"dissociation_energy\": 36118.07, \"spin_isomers\": \"frozen\","
        " \"odd_fraction\": 0.75, \"diatomic_states\": [{\"Te\": 0,"
        " \"we\": 4401.21, \"wexe\": 121.33, \"Be\": 60.853,"
        " \"alpha_e\": 3.062, \"De\": 0.0471,"
        " \"rotational_weights\": [0.25, 0.75]}]}]}";
    molq_db *db;
    check_species(tu_from_json(js, &db));
    molq_db_free(db);
}
END_TEST

static double cp_over_T(double T, void *sp)
{
    return tu_eval(sp, T, p_test, MOLQ_CP) / T;
}

static double cp_of_T(double T, void *sp)
{
    return tu_eval(sp, T, p_test, MOLQ_CP);
}

static double integrate(double (*fn)(double, void *), const molq_species *sp,
                        double a, double b, gsl_integration_workspace *w)
{
    double res, abserr;
    gsl_function f;
    f.function = fn;
    f.params = (void *)sp;
    ck_assert_int_eq(gsl_integration_qag(&f, a, b, 0, 1e-11, 1000,
                                         GSL_INTEG_GAUSS41, w, &res, &abserr),
                     GSL_SUCCESS);
    return res;
}

START_TEST(entropy_is_integral_of_cp_over_T)
{
    const molq_db *db = tu_builtin();
    gsl_integration_workspace *w = gsl_integration_workspace_alloc(1000);
    size_t i;
    gsl_error_handler_t *old = gsl_set_error_handler_off();
    for (i = 0; i < molq_db_count(db); i++) {
        const molq_species *sp = molq_db_species(db, i);
        double T1 = 300.0, T2 = 4500.0;
        ck_assert_close(tu_eval(sp, T2, p_test, MOLQ_S) -
                            tu_eval(sp, T1, p_test, MOLQ_S),
                        integrate(cp_over_T, sp, T1, T2, w), 1e-10, 0.0);
        /* and H(T2) - H(T1) = integral of Cp dT */
        ck_assert_close(tu_eval(sp, T2, p_test, MOLQ_H) -
                            tu_eval(sp, T1, p_test, MOLQ_H),
                        integrate(cp_of_T, sp, T1, T2, w), 1e-10, 0.0);
    }
    gsl_set_error_handler(old);
    gsl_integration_workspace_free(w);
}
END_TEST

/* Pressure enters only the entropy family: s(p) = s(p0) - R ln(p/p0). */
START_TEST(pressure_dependence)
{
    const molq_species *sp = tu_species("CO2");
    double T = 800.0;
    ck_assert_close(tu_eval(sp, T, 1e6, MOLQ_S),
                    tu_eval(sp, T, 1e5, MOLQ_S) - T_R * log(10.0), 1e-13, 0.0);
    ck_assert_close(tu_eval(sp, T, 1e6, MOLQ_H), tu_eval(sp, T, 1e5, MOLQ_H),
                    1e-15, 1.0);
    ck_assert_close(tu_eval(sp, T, 1e6, MOLQ_CP),
                    tu_eval(sp, T, 1e5, MOLQ_CP), 1e-15, 0.0);
}
END_TEST

/* The enthalpy scale: h(298.15) = formation enthalpy, h_minus_h298 = 0
 * there, gef(298.15) = s(298.15). */
START_TEST(enthalpy_scale)
{
    const molq_species *co = tu_species("CO");
    const molq_species *n2 = tu_species("N2");
    ck_assert(molq_species_has_formation_enthalpy(co));
    ck_assert_close(tu_eval(co, 298.15, 1e5, MOLQ_H), -110527.0, 1e-12, 0.0);
    ck_assert_close(tu_eval(n2, 298.15, 1e5, MOLQ_H_MINUS_H298), 0.0, 0.0,
                    1e-9);
    ck_assert_close(tu_eval(co, 298.15, 1e5, MOLQ_GEF),
                    tu_eval(co, 298.15, 1e5, MOLQ_S), 1e-14, 0.0);
    ck_assert_close(tu_eval(co, 1000.0, 1e5, MOLQ_H),
                    -110527.0 + tu_eval(co, 1000.0, 1e5, MOLQ_H_MINUS_H298),
                    1e-12, 0.0);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("identities");
    TCase *tc = tcase_create("identities");
    tcase_set_timeout(tc, 120);
    tcase_add_test(tc, identities_builtin);
    tcase_add_test(tc, identities_classical_rotor);
    tcase_add_test(tc, identities_frozen_spin_isomers);
    tcase_add_test(tc, entropy_is_integral_of_cp_over_T);
    tcase_add_test(tc, pressure_dependence);
    tcase_add_test(tc, enthalpy_scale);
    suite_add_tcase(s, tc);
    return tu_run(s);
}
