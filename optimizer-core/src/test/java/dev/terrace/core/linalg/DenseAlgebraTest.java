package dev.terrace.core.linalg;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.CholeskyDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Both linear-algebra backends against a worked example and against Apache Commons Math 3.6.1. */
class DenseAlgebraTest {

    /** The backends available here: always pure Java, native where it loads. */
    static List<DenseAlgebra> backends() {
        List<DenseAlgebra> b = new ArrayList<>();
        b.add(Algebra.java());
        DenseAlgebra nat = Algebra.nativeIfAvailable();
        if (nat != null) {
            b.add(nat);
        }
        return b;
    }

    @Test
    void workedThreeByThreeFactor() {
        // worked example of the Cholesky decomposition (Wikipedia, "Cholesky decomposition", section
        // Example; from memory, and checked by hand: L Lᵀ reproduces every entry of A):
        // A = [[4, 12, -16], [12, 37, -43], [-16, -43, 98]], L = [[2, 0, 0], [6, 1, 0], [-8, 5, 3]]
        for (DenseAlgebra alg : backends()) {
            double[] a = {4, 12, -16, 12, 37, -43, -16, -43, 98};
            assertTrue(alg.cholesky(3, a), alg.name());
            assertArrayEquals(new double[] {2, 6, -8}, new double[] {a[0], a[1], a[2]}, 1e-12, alg.name());
            assertArrayEquals(new double[] {1, 5}, new double[] {a[4], a[5]}, 1e-12, alg.name());
            assertEquals(3, a[8], 1e-12, alg.name());
        }
    }

    @Test
    void refusesAnIndefiniteMatrix() {
        for (DenseAlgebra alg : backends()) {
            // eigenvalues 3 and -1
            assertFalse(alg.cholesky(2, new double[] {1, 2, 2, 1}), alg.name());
        }
    }

    @Test
    void agreesWithCommonsMathOnRandomCovariances() {
        // reference library: Apache Commons Math 3.6.1 CholeskyDecomposition and its solver
        SplittableRandom rng = new SplittableRandom(11);
        for (int n : new int[] {1, 2, 7, 40, 130}) {
            double[][] g = new double[n][n];
            for (double[] row : g) {
                for (int j = 0; j < n; j++) {
                    row[j] = rng.nextDouble(-1, 1);
                }
            }
            // A = G Gᵀ + n·I is symmetric positive definite
            double[][] a2 = new double[n][n];
            for (int i = 0; i < n; i++) {
                for (int j = 0; j < n; j++) {
                    double s = i == j ? n : 0;
                    for (int k = 0; k < n; k++) {
                        s += g[i][k] * g[j][k];
                    }
                    a2[i][j] = s;
                }
            }
            RealMatrix ref = new Array2DRowRealMatrix(a2);
            CholeskyDecomposition cd = new CholeskyDecomposition(ref);
            RealMatrix lRef = cd.getL();
            RealMatrix invRef = cd.getSolver().getInverse();
            int m = 3;
            double[] b = new double[n * m];
            for (int i = 0; i < b.length; i++) {
                b[i] = rng.nextDouble(-1, 1);
            }
            for (DenseAlgebra alg : backends()) {
                double[] a = new double[n * n];
                for (int j = 0; j < n; j++) {
                    for (int i = 0; i < n; i++) {
                        a[i + j * n] = a2[i][j];
                    }
                }
                assertTrue(alg.cholesky(n, a));
                for (int j = 0; j < n; j++) {
                    for (int i = j; i < n; i++) {
                        assertEquals(lRef.getEntry(i, j), a[i + j * n], 1e-10, alg.name() + " L n=" + n);
                    }
                }
                double[] x = b.clone();
                alg.choleskySolve(n, m, a, x);
                double[] y = b.clone();
                alg.lowerSolve(n, m, a, y);
                for (int r = 0; r < m; r++) {
                    double[] col = new double[n];
                    System.arraycopy(b, r * n, col, 0, n);
                    double[] xr = cd.getSolver().solve(new org.apache.commons.math3.linear.ArrayRealVector(col))
                            .toArray();
                    for (int i = 0; i < n; i++) {
                        assertEquals(xr[i], x[i + r * n], 1e-10, alg.name() + " solve n=" + n);
                    }
                    // L y = b: check the residual directly
                    for (int i = 0; i < n; i++) {
                        double s = 0;
                        for (int k = 0; k <= i; k++) {
                            s += lRef.getEntry(i, k) * y[k + r * n];
                        }
                        assertEquals(col[i], s, 1e-10, alg.name() + " lower solve n=" + n);
                    }
                }
                double[] inv = alg.inverse(n, a);
                for (int j = 0; j < n; j++) {
                    for (int i = 0; i < n; i++) {
                        assertEquals(invRef.getEntry(i, j), inv[i + j * n], 1e-10, alg.name() + " inverse n=" + n);
                    }
                }
            }
        }
    }

    @Test
    void requestsAreParsedAndUnknownOnesNamed() {
        assertEquals("auto", Algebra.parse(null));
        assertEquals("auto", Algebra.parse(" "));
        assertEquals("java", Algebra.parse(" Java "));
        assertEquals("native", Algebra.parse("NATIVE"));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> Algebra.parse("gpu"));
        assertTrue(e.getMessage().contains("gpu") && e.getMessage().contains(Algebra.PROPERTY)
                && e.getMessage().contains("auto, native or java"), e.getMessage());
    }

    @Test
    void anOverrideIsUsedAndRestored() throws Exception {
        DenseAlgebra before = Algebra.current();
        try (AutoCloseable h = Algebra.use(Algebra.java())) {
            assertEquals(Algebra.java(), Algebra.current());
            assertTrue(Algebra.description().startsWith("pure Java"));
        }
        assertEquals(before, Algebra.current());
    }
}
