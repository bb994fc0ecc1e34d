/* core/eigen.h -- eigenvalues of a small dense symmetric matrix through
 * GSL, on memory molq owns: GSL allocates nothing and never reaches its
 * error handler (the host's handler is left alone). */
#ifndef MOLQ_CORE_EIGEN_H
#define MOLQ_CORE_EIGEN_H

#include <stddef.h>

/* a: n x n row-major symmetric matrix (destroyed); scratch: 2n doubles;
 * ev: n eigenvalues, unordered. */
void molq_eigen_symm(double *a, size_t n, double *scratch, double *ev);

#endif
