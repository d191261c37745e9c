package dev.terrace.core.surrogate;

import dev.terrace.core.space.DesignPoint;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.CholeskyDecomposition;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertEquals;

/**
 * One-step-ahead errors from the Cholesky factor against the textbook conditional Gaussian
 * (Rasmussen and Williams 2006, eqs. 2.23-2.24: the prediction of run j from runs 1..j-1 has mean
 * k'(K + &sigma;&sup2;I)<sup>-1</sup>y and variance k(x<sub>j</sub>, x<sub>j</sub>) &minus;
 * k'(K + &sigma;&sup2;I)<sup>-1</sup>k), solved here run by run with Commons Math 3.6.1 (a
 * reference library), and the latent factor against worked examples by hand.
 */
class GpForwardTest {

    @Test
    void errorsAndLatentVariancesEqualTheConditionalGaussianOfEachRunGivenTheEarlierOnes() {
        SplittableRandom rnd = new SplittableRandom(11);
        int n = 10;
        List<DesignPoint> x = new ArrayList<>();
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            double u = rnd.nextDouble();
            double v = rnd.nextDouble();
            x.add(new DesignPoint(new double[] {u, v}, new int[0]));
            y[i] = Math.cos(4 * u) - v + 0.1 * rnd.nextDouble();
        }
        GpHyperparameters h = new GpHyperparameters(0.9, new double[] {0.35, 0.6}, new double[0], 0.04);
        GaussianProcess gp = GaussianProcess.withHyperparameters(x, y, null, h, false);
        GpForward f = gp.forward(n);
        double[] e2 = f.squaredErrors();
        double[] lat = f.latentVariances();
        assertEquals(n - GpForward.FIRST_SCORED, f.scored());
        for (int j = GpForward.FIRST_SCORED; j < n; j++) {
            double[][] k = new double[j][j];
            double[] c = new double[j];
            double[] yb = new double[j];
            for (int a = 0; a < j; a++) {
                for (int b = 0; b < j; b++) {
                    k[a][b] = GpBasisTest.matern52(h, x.get(a), x.get(b)) + (a == b ? h.noiseVariance() : 0);
                }
                c[a] = GpBasisTest.matern52(h, x.get(a), x.get(j));
                yb[a] = y[a];
            }
            CholeskyDecomposition chol = new CholeskyDecomposition(new Array2DRowRealMatrix(k), 1e-12, 1e-14);
            double[] s = chol.getSolver().solve(new ArrayRealVector(c)).toArray();
            double mean = 0;
            double reduce = 0;
            for (int a = 0; a < j; a++) {
                mean += s[a] * yb[a];
                reduce += s[a] * c[a];
            }
            double latent = GpBasisTest.matern52(h, x.get(j), x.get(j)) - reduce;
            int m = j - GpForward.FIRST_SCORED;
            assertEquals((y[j] - mean) * (y[j] - mean), e2[m], 1e-9, "squared error of run " + j);
            assertEquals(latent, lat[m], 1e-9, "latent variance of run " + j);
        }
    }

    @Test
    void latentFactorMakesTheMeanSquaredStandardizedErrorOne() {
        // by hand: five errors of 2 with latent variance 1 and noise variance 1:
        // 4 / (lambda^2 * 1 + k^2 * 1) = 1, so lambda = sqrt(3) with k = 1 and sqrt(4 - 1.44) = 1.6 with k = 1.2
        double[] e = {2, -2, 2, -2, 2};
        double[] a = {1, 1, 1, 1, 1};
        GpForward f = GpForward.of(e, a, 1);
        assertEquals(Math.sqrt(3), f.latentFactor(1), 1e-5);
        assertEquals(1.6, f.latentFactor(1.2), 1e-5);
        assertEquals(2.0, f.meanSquare(1, 1), 1e-12, "4 / (1 + 1)");
    }

    @Test
    void latentFactorOnlyWidensAndNeedsFiveScoredRuns() {
        // errors smaller than predicted: no narrowing, the factor stays at k
        GpForward small = GpForward.of(new double[] {0.1, 0.1, 0.1, 0.1, 0.1}, new double[] {1, 1, 1, 1, 1}, 1);
        assertEquals(1.0, small.latentFactor(1), 0);
        // four large errors: too few to judge
        GpForward few = GpForward.of(new double[] {5, 5, 5, 5}, new double[] {1, 1, 1, 1}, 1);
        assertEquals(1.3, few.latentFactor(1.3), 0);
        // errors the noise alone cannot explain and no latent variance to widen: capped
        GpForward capped = GpForward.of(new double[] {5, 5, 5, 5, 5}, new double[] {0, 0, 0, 0, 0}, 1);
        assertEquals(GpForward.MAX_FACTOR, capped.latentFactor(1), 0);
    }
}
