package dev.terrace.core.surrogate;

import smile.math.blas.LAPACK;
import smile.math.blas.Layout;
import smile.math.blas.UPLO;
import smile.math.matrix.Matrix;

/**
 * Cholesky factor of a covariance matrix through Smile's LAPACK binding, with progressive jitter.
 *
 * <p>LAPACK {@code potrf} is called directly (rather than {@code Matrix.cholesky}, which logs an
 * error and throws on failure) so that a failed factorisation can be retried quietly with a
 * larger diagonal: 1e-10·σf² first, ×10 per retry, up to σf² (adding jitter of about 1e-10·σf²
 * when the Cholesky fails is common practice).
 *
 * @param cholesky the Smile factor of K + jitter·I, usable by Smile's GP
 * @param lower    the column-major array holding L in its lower triangle (shared with {@code cholesky})
 * @param n        matrix order
 * @param jitter   the diagonal added beyond the matrix given, 0 when none was needed
 */
record GpCholesky(Matrix.Cholesky cholesky, double[] lower, int n, double jitter) {

    /** First jitter, relative to the signal variance. */
    static final double JITTER_START = 1e-10;
    /** Growth of the jitter per retry. */
    static final double JITTER_GROWTH = 10;
    /** Largest jitter, relative to the signal variance. */
    static final double JITTER_LIMIT = 1.0;

    /**
     * Factorises a symmetric matrix held column-major in its lower triangle.
     *
     * @param k              the matrix (only the lower triangle is read); not modified
     * @param n              its order
     * @param signalVariance scale of the jitter
     * @return the factor; never null
     * @throws IllegalStateException when even the largest jitter fails (the matrix is not finite)
     */
    static GpCholesky factor(double[] k, int n, double signalVariance) {
        double jitter = 0;
        while (true) {
            double[] a = k.clone();
            if (jitter > 0) {
                for (int i = 0; i < n; i++) {
                    a[i + i * n] += jitter;
                }
            }
            int info = n == 0 ? 0 : LAPACK.engine.potrf(Layout.COL_MAJOR, UPLO.LOWER, n, a, n);
            if (info == 0) {
                Matrix m = new Matrix(n, n, n, a).uplo(UPLO.LOWER);
                return new GpCholesky(new Matrix.Cholesky(m), a, n, jitter);
            }
            jitter = jitter == 0 ? JITTER_START * signalVariance : jitter * JITTER_GROWTH;
            if (jitter > JITTER_LIMIT * signalVariance * (1 + 1e-9)) {
                throw new IllegalStateException("covariance matrix cannot be factorised (non-finite entries?)");
            }
        }
    }

    /** @return Σ ln L_ii = ½ ln |K + jitter·I| */
    double halfLogDet() {
        double s = 0;
        for (int i = 0; i < n; i++) {
            s += Math.log(lower[i + i * n]);
        }
        return s;
    }

    /**
     * @param b a right-hand side; not modified
     * @return (K + jitter·I)⁻¹ b
     */
    double[] solve(double[] b) {
        double[] x = b.clone();
        if (n > 0) {
            LAPACK.engine.potrs(Layout.COL_MAJOR, UPLO.LOWER, n, 1, lower, n, x, n);
        }
        return x;
    }

    /** @return (K + jitter·I)⁻¹, column-major n×n */
    double[] inverse() {
        double[] x = new double[n * n];
        for (int i = 0; i < n; i++) {
            x[i + i * n] = 1;
        }
        if (n > 0) {
            LAPACK.engine.potrs(Layout.COL_MAJOR, UPLO.LOWER, n, n, lower, n, x, n);
        }
        return x;
    }
}
