package dev.terrace.core.linalg;

import smile.math.blas.Diag;
import smile.math.blas.LAPACK;
import smile.math.blas.Layout;
import smile.math.blas.Transpose;
import smile.math.blas.UPLO;

/**
 * {@link DenseAlgebra} through Smile's LAPACK binding (OpenBLAS, loaded by javacpp). Only usable
 * where the native library for this operating system and processor is on the class path; see
 * {@link Algebra} for the check.
 *
 * @since 0.1
 */
public final class NativeAlgebra implements DenseAlgebra {

    static final NativeAlgebra INSTANCE = new NativeAlgebra();

    private NativeAlgebra() {
    }

    @Override
    public String name() {
        return "native (OpenBLAS via Smile)";
    }

    @Override
    public boolean cholesky(int n, double[] a) {
        return n == 0 || LAPACK.engine.potrf(Layout.COL_MAJOR, UPLO.LOWER, n, a, n) == 0;
    }

    @Override
    public void choleskySolve(int n, int nrhs, double[] l, double[] b) {
        if (n > 0 && nrhs > 0) {
            LAPACK.engine.potrs(Layout.COL_MAJOR, UPLO.LOWER, n, nrhs, l, n, b, n);
        }
    }

    @Override
    public void lowerSolve(int n, int nrhs, double[] l, double[] b) {
        if (n > 0 && nrhs > 0) {
            LAPACK.engine.trtrs(Layout.COL_MAJOR, UPLO.LOWER, Transpose.NO_TRANSPOSE, Diag.NON_UNIT, n, nrhs, l, n,
                    b, n);
        }
    }
}
