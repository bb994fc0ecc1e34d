/* White-box test of the interpolation table (lib/core/lnq_table.c) against
 * partition functions with closed forms: a harmonic oscillator and the
 * exact rigid-rotor sum (computed directly), with the step the level-sum
 * modes use (0.03 in ln T).  The table is what makes the level-sum models
 * fast; its error must stay far below any physical model
 * error.  Bounds (relative): ln q, k1, k2 1e-10; k3 (dcp/dT) 1e-8. */
#include <stdio.h>
#include <stdlib.h>

#include "core/lnq_table.h"
#include "testutil.h"

static void harmonic(const void *ctx, double T, molq_cumulants *out)
{
    double x = *(const double *)ctx / T;
    out->lnq = out->k1 = out->k2 = out->k3 = 0.0;
    molq_cumulants_add_harmonic(x, 1.0, MOLQ_NEED_LNQ | MOLQ_NEED_K3, out);
}

static void rotor(const void *ctx, double T, molq_cumulants *out)
{
    double y = *(const double *)ctx / T, q = 0, m1 = 0, m2 = 0, m3 = 0, mean;
    int J;
    for (J = 0; J < 5000; J++) {
        double u = J * (J + 1.0) * y, w = (2 * J + 1) * exp(-u);
        if (u > 700)
            break;
        q += w;
        m1 += w * u;
        m2 += w * u * u;
        m3 += w * u * u * u;
    }
    mean = m1 / q;
    out->lnq = log(q);
    out->k1 = mean;
    out->k2 = m2 / q - mean * mean;
    out->k3 = m3 / q - 3 * mean * m2 / q + 2 * mean * mean * mean;
}

static void check(molq_exact_fn fn, double theta, double *worst)
{
    molq_lnq_table t;
    double T;
    ck_assert_int_eq(molq_lnq_table_build(&t, 10.0, 50000.0, 0.03, fn, &theta),
                     0);
    for (T = 10.0; T < 49000.0; T *= 1.0123) {
        molq_cumulants a, b;
        double v[4][2];
        int k;
        ck_assert_int_eq(molq_lnq_table_eval(&t, T, &a), 0);
        fn(&theta, T, &b);
        v[0][0] = a.lnq, v[0][1] = b.lnq;
        v[1][0] = a.k1, v[1][1] = b.k1;
        v[2][0] = a.k2, v[2][1] = b.k2;
        v[3][0] = a.k3, v[3][1] = b.k3;
        for (k = 0; k < 4; k++) {
            /* relative to the size of the quantity's natural scale (1) */
            double e = fabs(v[k][0] - v[k][1]) / fmax(fabs(v[k][1]), 1.0);
            if (e > worst[k])
                worst[k] = e;
        }
    }
    {
        molq_cumulants c;
        ck_assert_int_eq(molq_lnq_table_eval(&t, 5.0, &c), -1);
        ck_assert_int_eq(molq_lnq_table_eval(&t, 60000.0, &c), -1);
    }
    molq_lnq_table_free(&t);
}

START_TEST(table_against_closed_forms)
{
    double worst[4] = {0, 0, 0, 0};
    double thetas[] = {3.0, 30.0, 300.0, 3000.0};
    size_t i;
    for (i = 0; i < 4; i++) {
        check(harmonic, thetas[i], worst);
        check(rotor, thetas[i], worst);
    }
    printf("table worst errors: lnq %.2e k1 %.2e k2 %.2e k3 %.2e\n", worst[0],
           worst[1], worst[2], worst[3]);
    ck_assert_double_le(worst[0], 1e-10);
    ck_assert_double_le(worst[1], 1e-10);
    ck_assert_double_le(worst[2], 1e-10);
    ck_assert_double_le(worst[3], 1e-8);
}
END_TEST

int main(void)
{
    Suite *s = suite_create("table");
    TCase *tc = tcase_create("table");
    tcase_set_timeout(tc, 120);
    tcase_add_test(tc, table_against_closed_forms);
    suite_add_tcase(s, tc);
    return tu_run(s);
}
