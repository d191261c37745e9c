package dev.terrace.core.linalg;

/**
 * {@link DenseAlgebra} in plain Java, for machines where no native BLAS loads (macOS, Windows,
 * ARM Linux with the shipped jar). The algorithms are the textbook ones (Golub &amp; Van Loan,
 * <i>Matrix Computations</i>, 4th ed. 2013: the column ("gaxpy") Cholesky, Alg. 4.2.1, and
 * column-oriented forward and back substitution, Alg. 3.1.3 and 3.1.4), arranged so that every
 * inner loop runs down a contiguous column of the column-major arrays.
 *
 * @since 0.1
 */
public final class JavaAlgebra implements DenseAlgebra {

    static final JavaAlgebra INSTANCE = new JavaAlgebra();

    private JavaAlgebra() {
    }

    @Override
    public String name() {
        return "pure Java";
    }

    @Override
    public boolean cholesky(int n, double[] a) {
        for (int j = 0; j < n; j++) {
            int cj = j * n;
            // a(j:n, j) -= sum over k < j of L(j, k) · L(j:n, k)
            for (int k = 0; k < j; k++) {
                int ck = k * n;
                double ljk = a[j + ck];
                if (ljk != 0) {
                    for (int i = j; i < n; i++) {
                        a[i + cj] -= ljk * a[i + ck];
                    }
                }
            }
            double d = a[j + cj];
            if (!(d > 0) || !Double.isFinite(d)) {
                return false;
            }
            d = Math.sqrt(d);
            a[j + cj] = d;
            double inv = 1 / d;
            for (int i = j + 1; i < n; i++) {
                a[i + cj] *= inv;
            }
        }
        return true;
    }

    @Override
    public void choleskySolve(int n, int nrhs, double[] l, double[] b) {
        lowerSolve(n, nrhs, l, b);
        for (int r = 0; r < nrhs; r++) {
            int off = r * n;
            // Lᵀ x = y, from the bottom: x_j = (y_j − L(j+1:n, j) · x(j+1:n)) / L_jj
            for (int j = n - 1; j >= 0; j--) {
                int cj = j * n;
                double s = b[off + j];
                for (int i = j + 1; i < n; i++) {
                    s -= l[i + cj] * b[off + i];
                }
                b[off + j] = s / l[j + cj];
            }
        }
    }

    @Override
    public void lowerSolve(int n, int nrhs, double[] l, double[] b) {
        for (int r = 0; r < nrhs; r++) {
            int off = r * n;
            for (int j = 0; j < n; j++) {
                int cj = j * n;
                double x = b[off + j] / l[j + cj];
                b[off + j] = x;
                if (x != 0) {
                    for (int i = j + 1; i < n; i++) {
                        b[off + i] -= x * l[i + cj];
                    }
                }
            }
        }
    }

    /**
     * (L Lᵀ)⁻¹ = L⁻ᵀ L⁻¹ in about 2n³/3 operations: L⁻¹ by column-oriented forward substitution
     * on the lower triangle only, then the lower triangle of L⁻ᵀ L⁻¹, mirrored.
     */
    @Override
    public double[] inverse(int n, double[] l) {
        // w = L⁻¹, lower triangular, column-major
        double[] w = new double[n * n];
        for (int c = 0; c < n; c++) {
            int off = c * n;
            w[off + c] = 1;
            for (int j = c; j < n; j++) {
                int cj = j * n;
                double x = w[off + j] / l[j + cj];
                w[off + j] = x;
                if (x != 0) {
                    for (int i = j + 1; i < n; i++) {
                        w[off + i] -= x * l[i + cj];
                    }
                }
            }
        }
        // inv(i, j) = Σ_{k ≥ max(i, j)} W(k, i) W(k, j): dot products of columns i and j of W
        double[] inv = new double[n * n];
        for (int j = 0; j < n; j++) {
            int cj = j * n;
            for (int i = j; i < n; i++) {
                int ci = i * n;
                double s = 0;
                for (int k = i; k < n; k++) {
                    s += w[k + ci] * w[k + cj];
                }
                inv[i + cj] = s;
                inv[j + ci] = s;
            }
        }
        return inv;
    }
}
