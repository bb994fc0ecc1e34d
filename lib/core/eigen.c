#include "core/eigen.h"

#include <gsl/gsl_eigen.h>
#include <gsl/gsl_matrix.h>
#include <gsl/gsl_vector.h>

void molq_eigen_symm(double *a, size_t n, double *scratch, double *ev)
{
    gsl_eigen_symm_workspace ws;
    gsl_matrix_view A;
    gsl_vector_view E;
    if (n == 0)
        return;
    ws.size = n;
    ws.d = scratch;
    ws.sd = scratch + n;
    A = gsl_matrix_view_array(a, n, n);
    E = gsl_vector_view_array(ev, n);
    gsl_eigen_symm(&A.matrix, &E.vector, &ws);
}
