/* Hindered internal rotation (torsion), one-dimensional.
 *
 * H = F p^2 + V(phi),  V(phi) = sum_n (V_n / 2)(1 - cos n phi),  p = -i d/dphi
 * with F = h / (8 pi^2 c I_red) the internal-rotation constant.  In the
 * free-rotor basis e^{i m phi}, |m| <= M, the kinetic term is F m^2 on the
 * diagonal and each cosine term couples m with m +- n by -V_n/4; the matrix
 * is diagonalised once with GSL's symmetric eigensolver, block by block:
 * the potential only couples m with m +- n, so the basis splits by m modulo
 * g = gcd(n).  The lowest 2 M_keep + 1 levels are kept, with F M_keep^2 at
 * least four barrier heights and the basis reaching 3 sqrt(V/F) + 20 beyond
 * M_keep (converged); above them the free-rotor asymptote F m^2 + <V>
 * completes the ladder, so the partition function is right at any
 * temperature.  q = (1/sigma_int) sum e^{-E/kT},
 * energies from the lowest level.  Limits: V -> 0 gives the free rotor
 * (1/sigma) sum_m e^{-F m^2 hc/kT}; a high n-fold barrier gives n nearly
 * degenerate copies of a harmonic oscillator of wavenumber n sqrt(F V_n),
 * i.e. one oscillator after division by sigma_int = n.
 * Evaluated through modes/level_table.c like the other level sums. */
#include <math.h>
#include <stdlib.h>

#include "core/constants.h"
#include "core/eigen.h"
#include "modes/modes.h"

#define TAIL_T_HI 50000.0      /* tail levels up to 60 kT at this T */

static int cmp_double(const void *a, const void *b)
{
    double x = *(const double *)a, y = *(const double *)b;
    return (x > y) - (x < y);
}

static long gcd(long a, long b)
{
    while (b != 0) {
        long t = a % b;
        a = b;
        b = t;
    }
    return a;
}

/* Diagonalise in the basis |m| <= M, one block per residue of m modulo g;
 * writes the 2M+1 eigenvalues (cm^-1, ascending) to ev. */
static int diagonalise(double F, const molq_torsion_term *terms, size_t nt,
                       long M, long g, double *ev)
{
    size_t nb = (size_t)((2 * M + 1) / g + 1), k, got = 0;
    double *a = malloc((nb * nb + 2 * nb) * sizeof *a);
    double v0 = 0.0;
    long r;
    if (a == NULL)
        return -1;
    for (k = 0; k < nt; k++)
        v0 += 0.5 * terms[k].v;
    for (r = 0; r < g; r++) {
        /* block members: m = -M + r, -M + r + g, ... <= M */
        size_t n = (size_t)((2 * M - r) / g + 1), i;
        for (i = 0; i < n * n; i++)
            a[i] = 0.0;
        for (i = 0; i < n; i++) {
            long m = -M + r + (long)i * g;
            a[i * n + i] = F * (double)(m * m) + v0;
            for (k = 0; k < nt; k++) {
                size_t j = i + (size_t)(terms[k].n / g);
                if (j < n) {
                    a[i * n + j] -= 0.25 * terms[k].v;
                    a[j * n + i] -= 0.25 * terms[k].v;
                }
            }
        }
        molq_eigen_symm(a, n, a + n * n, ev + got);
        got += n;
    }
    free(a);
    qsort(ev, got, sizeof *ev, cmp_double);
    return 0;
}

int molq_mode_torsion_init(molq_mode *m, double F,
                           const molq_torsion_term *terms, size_t nt,
                           int sigma)
{
    molq_level_table *t = &m->u.lt;
    double vsum = 0.0, v0 = 0.0, e0, *block, root;
    long keep, M, mtail, mmax, j, g = 0;
    size_t i, nlev, nbasis;
    for (i = 0; i < nt; i++) {
        vsum += fabs(terms[i].v);
        v0 += 0.5 * terms[i].v;
        g = gcd(terms[i].n, g);
    }
    root = sqrt(vsum / F);
    keep = (long)ceil(2.0 * root) + 10;
    M = keep + (long)ceil(3.0 * root) + 20;
    if (g == 0)
        g = 1; /* free rotor: the matrix is diagonal, blocks of one */
    nbasis = (size_t)(2 * M + 1);
    mmax = (long)ceil(sqrt(60.0 * TAIL_T_HI / (MOLQ_C2_CM_K * F))) + 1;
    if (mmax < keep)
        mmax = keep;
    nlev = (size_t)(2 * keep + 1) + 2 * (size_t)(mmax - keep);
    block = malloc((nbasis + 2 * nlev) * sizeof *block);
    if (block == NULL || diagonalise(F, terms, nt, M, g, block) != 0) {
        free(block);
        return -1;
    }
    /* converged levels: the lowest 2 keep + 1 of the basis */
    t->theta = block + nbasis;
    t->w = t->theta + nlev;
    e0 = block[0];
    for (i = 0; i < (size_t)(2 * keep + 1); i++)
        t->theta[i] = MOLQ_C2_CM_K * (block[i] - e0);
    /* free-rotor tail, +-m for keep < |m| <= mmax */
    for (j = keep + 1, mtail = 0; j <= mmax; j++) {
        double e = MOLQ_C2_CM_K * (F * (double)(j * j) + v0 - e0);
        t->theta[i++] = e;
        t->theta[i++] = e;
        mtail += 2;
    }
    (void)mtail;
    t->n = i;
    for (i = 0; i < t->n; i++)
        t->w[i] = 1.0 / (double)sigma;
    m->owned = block;
    return molq_level_table_finish(m, MOLQ_MODE_TORSION, 0);
}
