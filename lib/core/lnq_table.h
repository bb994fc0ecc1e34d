/* core/lnq_table.h -- fast, thermodynamically consistent evaluation of an
 * expensive partition function.
 *
 * A mode whose exact ln q needs a long level sum samples it once, at build
 * time, on a uniform grid in u = ln T: at each node f = ln q and its first
 * three u-derivatives, which are exact functions of the cumulants:
 *   f_u = k1,  f_uu = k2 - k1,  f_uuu = k3 - 3 k2 + k1.
 * Evaluation is a septic Hermite interpolant through f .. f_uuu (C^3, exact
 * at the nodes, error O(h^8)); k1, k2, k3 come from the interpolant's own
 * derivatives, so U, Cv, S and dCv/dT stay exactly consistent with ln q.
 * With h = 0.03 the interpolation error (tests/test_table.c, against
 * closed forms over 10 K to 50000 K) is about 2e-15 in ln q, 5e-13 in k1,
 * 5e-11 in k2 and 5e-9 in k3, far below any model error.  Outside the table
 * the mode uses its exact sum. */
#ifndef MOLQ_CORE_LNQ_TABLE_H
#define MOLQ_CORE_LNQ_TABLE_H

#include <stddef.h>

#include "core/cumulants.h"

typedef struct molq_lnq_table {
    double u0, h, inv_h;
    size_t n;      /* nodes */
    double *node;  /* 4 per node: f, h f_u, h^2 f_uu, h^3 f_uuu */
} molq_lnq_table;

typedef void (*molq_exact_fn)(const void *ctx, double T, molq_cumulants *out);

/* Sample exact(ctx, T) on [T_lo, T_hi] with spacing h in ln T.  Returns 0
 * (an empty range gives an empty table, whose evaluation always reports
 * -1), or -1 on allocation failure (the table is then empty). */
int molq_lnq_table_build(molq_lnq_table *t, double T_lo, double T_hi,
                         double h, molq_exact_fn exact, const void *ctx);

/* Interpolate at T.  Returns 0, or -1 when T is outside the table. */
int molq_lnq_table_eval(const molq_lnq_table *t, double T,
                        molq_cumulants *out);

void molq_lnq_table_free(molq_lnq_table *t);

#endif
