/* Exact rigid asymmetric top, with nuclear-spin statistics.
 *
 * H = A Ja^2 + B Jb^2 + C Jc^2 (A >= B >= C) in the symmetric-top basis
 * |J K> quantised along a (representation I^r): diagonal
 *   ((B + C)/2)(J(J+1) - K^2) + A K^2,
 * and <J K+2|H|J K> = ((B - C)/4) sqrt[(J(J+1) - K(K+1))(J(J+1) - (K+1)(K+2))].
 * The Wang combinations (|J K> +- |J -K>)/sqrt 2 split each J into four
 * tridiagonal blocks, E+ E- O+ O- (K even/odd, sign +/-), diagonalised with
 * GSL (core/eigen.h).  A block's levels have Ka parity = K parity and
 * C2(b) eigenvalue (-1)^(Ka+Kc) = s (-1)^J, s the Wang sign, which fixes
 * their (Ka, Kc) parity class; each level carries (2J+1) times the class's
 * nuclear-spin weight (conventional scale; for water 1/4 for Ka + Kc even,
 * 3/4 for odd).
 *
 * Tops with a threefold axis take their spin statistics from the
 * symmetry of each level under the rotations that exchange the identical
 * nuclei (all even permutations, so the rule holds for fermions and bosons
 * alike): the nuclear-spin functions invariant under the rotational
 * subgroup G, counted by characters, (1/|G|) sum_R chi_rot(R) chi_spin(R),
 * with chi_spin(R) = n^(cycles of R), n = 2I + 1, divided by n^N for the
 * conventional scale.
 *  - Symmetric top, C3v (three nuclei round the figure axis, NH3, CH3F):
 *    E = Bbar J(J+1) + (A_fig - Bbar) K^2, and |J K> picks up
 *    exp(2 pi i K/3) under C3, so each K state weighs
 *    (n^3 + 2n cos(2 pi K/3)) / (3 n^3): 1/2 for K = 0 mod 3, 1/4 otherwise
 *    for protons.
 *  - Spherical top, Td (CH4, SiH4, CF4): E = Bbar J(J+1); the (2J+1)
 *    K states of J carry the rotation characters
 *    chi_J(theta) = sin((2J+1) theta/2) / sin(theta/2) under the group T
 *    (E, 8 C3, 3 C2), so a J level weighs
 *    (2J+1) [n^4 (2J+1) + 8 n^2 chi_J(2pi/3) + 3 n^2 (-1)^J] / (12 n^4)
 *    (protons: J = 0 has 5/16, the A level with the five I = 2 spin states).
 * Both reduce to 1/sigma per state at high T (sigma 3 and 12).
 *
 * Levels are kept up to 40 kT at T2 = 60 theta_A; the exact sum (tabulated)
 * is used up to T1 = 30 theta_A, the corrected high-temperature rotor
 * (rotation.c) above T2, and a C^3 blend in ln T in between
 * (core/cumulants.h), so the mode is valid at every T.  The corrected
 * formula's residual is about 0.003-0.012 (theta_A/T)^2 in ln q (larger for
 * strongly asymmetric tops): 1e-5 or less where it takes over. */
#include <math.h>
#include <stdlib.h>

#include "core/constants.h"
#include "core/eigen.h"
#include "modes/modes.h"

#define HANDOVER_LO 30.0 /* x theta_A */
#define HANDOVER_HI 60.0
#define KEEP 40.0        /* levels up to KEEP kT at T2 (e^-40 = 4e-18) */
#define MAX_J 150        /* larger tops (tiny C against A) use the corrected
                            rotor instead: see molq_asymtop_fits */

typedef struct top_sink {
    double *theta, *w;
    size_t n;
} top_sink;

static void store(top_sink *out, double e_cm1, double weight);

/* Diagonalise one Wang block (kpar: 0 even K, 1 odd K; sign +1/-1) of J
 * and store its levels.  a: scratch for the matrix, ev: eigenvalues. */
static void block(double A, double B, double C, int J, int kpar, int sign,
                  const double *w, double *a, double *ev, top_sink *out)
{
    double jj = (double)J * (J + 1.0), bc = 0.25 * (B - C);
    int kmin = kpar ? 1 : (sign > 0 ? 0 : 2), K;
    size_t n = 0, i, cls;
    int c2b;
    for (K = kmin; K <= J; K += 2)
        n++;
    if (n == 0)
        return;
    for (i = 0; i < n * n; i++)
        a[i] = 0.0;
    for (i = 0; i < n; i++) {
        double k = kmin + 2.0 * i;
        a[i * n + i] = 0.5 * (B + C) * (jj - k * k) + A * k * k;
        if (i + 1 < n) {
            double off = bc * sqrt((jj - k * (k + 1)) * (jj - (k + 1) * (k + 2)));
            if (kmin == 0 && i == 0)
                off *= sqrt(2.0);
            a[i * n + i + 1] = a[(i + 1) * n + i] = off;
        }
    }
    if (kpar)
        a[0] += sign * bc * jj;
    molq_eigen_symm(a, n, a + n * n, ev);
    /* (Ka, Kc) parity class: Ka parity = kpar; (-1)^(Ka+Kc) = sign (-1)^J */
    c2b = sign * ((J & 1) ? -1 : 1);
    cls = 2u * (unsigned)kpar + (unsigned)((kpar + (c2b < 0)) & 1);
    if (w[cls] <= 0.0)
        return;
    for (i = 0; i < n; i++)
        store(out, ev[i], (2.0 * J + 1.0) * w[cls]);
}

static double level_cap(const double *abc)
{
    return KEEP * HANDOVER_HI * abc[0]; /* cm^-1: KEEP kT at T2 */
}

int molq_asymtop_fits(const double *abc)
{
    double jj = level_cap(abc) / abc[2]; /* J(J+1) needed */
    return jj < (double)MAX_J * (MAX_J + 1.0);
}

static void store(top_sink *out, double e_cm1, double weight)
{
    if (out->theta != NULL) {
        out->theta[out->n] = MOLQ_C2_CM_K * e_cm1;
        out->w[out->n] = weight;
    }
    out->n++;
}

/* Symmetric top (two constants equal) with C3 spin statistics. */
static void symmetric_c3(const double *abc, double n, int jmax,
                         top_sink *out)
{
    /* the figure axis is a (prolate, B = C) or c (oblate, A = B) */
    int prolate = abc[1] - abc[2] <= abc[0] - abc[1];
    double bbar = prolate ? 0.5 * (abc[1] + abc[2]) : 0.5 * (abc[0] + abc[1]);
    double fig = prolate ? abc[0] : abc[2];
    double n3 = n * n * n;
    double w0 = (n3 + 2.0 * n) / (3.0 * n3), w1 = (n3 - n) / (3.0 * n3);
    int J, K;
    for (J = 0; J <= jmax; J++)
        for (K = 0; K <= J; K++)
            store(out, bbar * J * (J + 1.0) + (fig - bbar) * K * K,
                  (2.0 * J + 1.0) * (K ? 2.0 : 1.0) * (K % 3 ? w1 : w0));
}

/* Spherical top with tetrahedral spin statistics. */
static void spherical_td(const double *abc, double n, int jmax,
                         top_sink *out)
{
    static const double chi3[3] = {1.0, 0.0, -1.0}; /* chi_J(2 pi/3) */
    double bbar = (abc[0] + abc[1] + abc[2]) / 3.0, n2 = n * n;
    int J;
    for (J = 0; J <= jmax; J++) {
        double d = 2.0 * J + 1.0;
        store(out, bbar * J * (J + 1.0),
              d * (n2 * n2 * d + 8.0 * n2 * chi3[J % 3] +
                   3.0 * n2 * ((J & 1) ? -1.0 : 1.0)) / (12.0 * n2 * n2));
    }
}

/* All levels below emax (cm^-1): J grows until C J(J+1) passes emax
 * (at most MAX_J, checked by molq_asymtop_fits). */
static int levels(const double *abc, const molq_top_spin *spin, double emax,
                  top_sink *out)
{
    int J, jmax = 0;
    double *a, *ev;
    const double *w = spin->w;
    while (jmax < MAX_J && abc[2] * jmax * (jmax + 1.0) <= emax)
        jmax++;
    if (spin->kind == MOLQ_TOP_SPIN_C3) {
        symmetric_c3(abc, spin->n, jmax, out);
        return 0;
    }
    if (spin->kind == MOLQ_TOP_SPIN_TETRA) {
        spherical_td(abc, spin->n, jmax, out);
        return 0;
    }
    a = malloc(((size_t)(jmax / 2 + 2) * (size_t)(jmax / 2 + 4)) *
               sizeof *a);
    ev = malloc((size_t)(jmax / 2 + 2) * sizeof *ev);
    if (a == NULL || ev == NULL) {
        free(a);
        free(ev);
        return -1;
    }
    for (J = 0; J <= jmax; J++) {
        block(abc[0], abc[1], abc[2], J, 0, +1, w, a, ev, out);
        block(abc[0], abc[1], abc[2], J, 0, -1, w, a, ev, out);
        block(abc[0], abc[1], abc[2], J, 1, +1, w, a, ev, out);
        block(abc[0], abc[1], abc[2], J, 1, -1, w, a, ev, out);
    }
    free(a);
    free(ev);
    return 0;
}

static void eval_asymtop(const molq_mode *m, double T, double p,
                         unsigned need, molq_cumulants *out)
{
    const struct molq_asymtop_params *t = &m->u.top;
    double x = (log(T) - t->u1) / t->du;
    molq_cumulants lo, hi;
    (void)p;
    if (x <= 0.0) {
        molq_level_table_cumulants(&t->lt, T, out);
        return;
    }
    if (x >= 1.0) {
        molq_rotation_cumulants(&t->high, T, need | MOLQ_NEED_LNQ, out);
        return;
    }
    molq_level_table_cumulants(&t->lt, T, &lo);
    molq_rotation_cumulants(&t->high, T, need | MOLQ_NEED_LNQ | MOLQ_NEED_K3,
                            &hi);
    molq_cumulants_blend(&lo, &hi, x, t->du, out);
}

int molq_mode_asymtop_init(molq_mode *m, const double *abc, int sigma,
                           const molq_top_spin *spin)
{
    struct molq_asymtop_params *t = &m->u.top;
    double theta_a = MOLQ_C2_CM_K * abc[0], t2 = HANDOVER_HI * theta_a;
    double emax = level_cap(abc), t_min;
    top_sink count = {NULL, NULL, 0}, fill;
    molq_mode high;
    double *block_mem;
    if (levels(abc, spin, emax, &count) != 0)
        return -1;
    block_mem = malloc((2 * count.n + 1) * sizeof *block_mem);
    if (block_mem == NULL)
        return -1;
    fill.theta = block_mem;
    fill.w = block_mem + count.n;
    fill.n = 0;
    if (levels(abc, spin, emax, &fill) != 0) {
        free(block_mem);
        return -1;
    }
    molq_mode_rotation_init(&high, 0, 0, sigma, abc, &t_min);
    t->high = high.u.rot;
    t->u1 = log(HANDOVER_LO * theta_a);
    t->du = log(HANDOVER_HI / HANDOVER_LO);
    t->lt.n = fill.n;
    t->lt.theta = fill.theta;
    t->lt.w = fill.w;
    m->owned = block_mem;
    /* energies stay measured from J = 0, as in the high-T formula */
    if (molq_level_table_finish_at(m, &t->lt, MOLQ_MODE_ROTATION, 1, 0,
                                   1.05 * t2) != 0)
        return -1;
    m->eval = eval_asymtop;
    return 0;
}
