package dev.terrace.core.linalg;

/**
 * The dense linear algebra the Gaussian-process surrogates need: a Cholesky factorisation and
 * solves with its factor. All matrices are square, column-major {@code double[]} of order n with
 * leading dimension n; only the lower triangle of a symmetric matrix is read or written.
 *
 * <p>Two implementations exist: {@link NativeAlgebra} (LAPACK through Smile's OpenBLAS binding,
 * fast where the native library loads) and {@link JavaAlgebra} (plain Java, runs everywhere).
 * {@link Algebra#current()} picks one. Both compute the same quantities; results agree to
 * rounding.
 *
 * <p>Implementations are stateless and safe to share between threads.
 *
 * @since 0.1
 */
public interface DenseAlgebra {

    /** @return short name shown to the user, for example {@code "native (OpenBLAS)"} */
    String name();

    /**
     * Factorises A = L Lᵀ in place (LAPACK {@code dpotrf}, lower).
     *
     * @param n order
     * @param a the matrix; on success its lower triangle holds L (the strict upper triangle is left
     *          as it was)
     * @return true on success, false when A is not (numerically) positive definite; a is then
     *         partly overwritten
     */
    boolean cholesky(int n, double[] a);

    /**
     * Solves (L Lᵀ) X = B in place (LAPACK {@code dpotrs}, lower).
     *
     * @param n    order
     * @param nrhs number of right-hand sides (columns of B)
     * @param l    the factor from {@link #cholesky}; not modified
     * @param b    B, n×nrhs column-major; replaced by X
     */
    void choleskySolve(int n, int nrhs, double[] l, double[] b);

    /**
     * Solves L X = B in place (forward substitution; LAPACK {@code dtrtrs}, lower, no transpose).
     *
     * @param n    order
     * @param nrhs number of right-hand sides
     * @param l    the factor from {@link #cholesky}; not modified
     * @param b    B, n×nrhs column-major; replaced by X
     */
    void lowerSolve(int n, int nrhs, double[] l, double[] b);

    /**
     * The inverse (L Lᵀ)⁻¹ as a full symmetric n×n column-major matrix.
     *
     * @param n order
     * @param l the factor from {@link #cholesky}; not modified
     * @return a new array holding the inverse
     */
    default double[] inverse(int n, double[] l) {
        double[] x = new double[n * n];
        for (int i = 0; i < n; i++) {
            x[i + i * n] = 1;
        }
        if (n > 0) {
            choleskySolve(n, n, l, x);
        }
        return x;
    }
}
