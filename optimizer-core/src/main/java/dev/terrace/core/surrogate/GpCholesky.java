package dev.terrace.core.surrogate;

import dev.terrace.core.linalg.Algebra;

/**
 * Cholesky factor of a covariance matrix through the process's {@link Algebra} backend (native
 * LAPACK or pure Java), with progressive jitter.
 *
 * <p>A failed factorisation is retried quietly with a
 * larger diagonal: 1e-10·σf² first, ×10 per retry, up to σf² (adding jitter of about 1e-10·σf²
 * when the Cholesky fails is common practice).
 *
 * @param lower    the column-major array holding L in its lower triangle
 * @param n        matrix order
 * @param jitter   the diagonal added beyond the matrix given, 0 when none was needed
 */
record GpCholesky(double[] lower, int n, double jitter) {

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
            if (Algebra.current().cholesky(n, a)) {
                return new GpCholesky(a, n, jitter);
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
        Algebra.current().choleskySolve(n, 1, lower, x);
        return x;
    }

    /**
     * @param b n×m right-hand sides, column-major; replaced by L⁻¹ b
     * @param m number of right-hand sides
     */
    void lowerSolveInPlace(double[] b, int m) {
        Algebra.current().lowerSolve(n, m, lower, b);
    }

    /** @return (K + jitter·I)⁻¹, column-major n×n */
    double[] inverse() {
        return Algebra.current().inverse(n, lower);
    }
}
