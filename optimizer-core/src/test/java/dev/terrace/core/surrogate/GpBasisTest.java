package dev.terrace.core.surrogate;

import dev.terrace.core.space.DesignPoint;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.CholeskyDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Uncertain prior-mean coefficients (the fitted physics' parameter covariance) in the GP's
 * predictive variance. Reference: a Gaussian prior N(0, B) on the coefficients of explicit basis
 * functions h is the same as a GP whose covariance is k(x, x') + h(x)&#7488;B h(x') (Rasmussen and
 * Williams 2006, sec. 2.7, eq. 2.39 and the text after it), so the variance {@link GaussianProcess}
 * computes through its Cholesky factor and the matrix-inversion form must equal the plain GP
 * variance under that covariance, computed here independently with Commons Math 3.6.1 (a
 * reference library) from the Matérn 5/2 formula (R&amp;W eq. 4.17).
 */
class GpBasisTest {

    static double matern52(GpHyperparameters h, DesignPoint a, DesignPoint b) {
        double r2 = 0;
        for (int d = 0; d < a.dimensions(); d++) {
            double u = (a.x(d) - b.x(d)) / h.lengthScale(d);
            r2 += u * u;
        }
        double r = Math.sqrt(r2);
        return h.signalVariance() * (1 + Math.sqrt(5) * r + 5 * r2 / 3) * Math.exp(-Math.sqrt(5) * r);
    }

    @Test
    void basisVarianceEqualsThePlainGpUnderTheAugmentedCovariance() {
        SplittableRandom rnd = new SplittableRandom(7);
        int n = 9;
        int d = 2;
        List<DesignPoint> x = new ArrayList<>();
        double[] y = new double[n];
        double[][] hTrain = new double[n][d];
        for (int i = 0; i < n; i++) {
            double u = rnd.nextDouble();
            double v = rnd.nextDouble();
            x.add(new DesignPoint(new double[] {u, v}, new int[0]));
            y[i] = Math.sin(3 * u) + v;
            hTrain[i] = new double[] {1 + u, Math.exp(-v)};
        }
        GpHyperparameters h = new GpHyperparameters(0.8, new double[] {0.4, 0.7}, new double[0], 0.05);
        GaussianProcess gp = GaussianProcess.withHyperparameters(x, y, null, h, false);
        double[][] b = {{0.3, 0.1}, {0.1, 0.2}};
        List<DesignPoint> q = List.of(new DesignPoint(new double[] {0.2, 0.9}, new int[0]),
                new DesignPoint(new double[] {0.95, 0.05}, new int[0]),
                new DesignPoint(new double[] {x.get(3).x(0), x.get(3).x(1)}, new int[0]));
        double[][] hQuery = new double[q.size()][];
        for (int j = 0; j < q.size(); j++) {
            hQuery[j] = new double[] {1 + q.get(j).x(0), Math.exp(-q.get(j).x(1))};
        }
        Predictive ours = gp.predict(q, null, new GaussianProcess.Basis(hTrain, hQuery, b));

        // reference: covariance k + h'Bh plus noise on the runs
        RealMatrix bm = new Array2DRowRealMatrix(b);
        double[][] kk = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j < n; j++) {
                kk[i][j] = matern52(h, x.get(i), x.get(j))
                        + new Array2DRowRealMatrix(new double[][] {hTrain[i]}).multiply(bm)
                        .multiply(new Array2DRowRealMatrix(hTrain[j])).getEntry(0, 0)
                        + (i == j ? h.noiseVariance() : 0);
            }
        }
        CholeskyDecomposition chol = new CholeskyDecomposition(new Array2DRowRealMatrix(kk), 1e-12, 1e-14);
        for (int j = 0; j < q.size(); j++) {
            double[] c = new double[n];
            for (int i = 0; i < n; i++) {
                c[i] = matern52(h, x.get(i), q.get(j)) + new Array2DRowRealMatrix(new double[][] {hTrain[i]})
                        .multiply(bm).multiply(new Array2DRowRealMatrix(hQuery[j])).getEntry(0, 0);
            }
            double prior = matern52(h, q.get(j), q.get(j)) + new Array2DRowRealMatrix(new double[][] {hQuery[j]})
                    .multiply(bm).multiply(new Array2DRowRealMatrix(hQuery[j])).getEntry(0, 0);
            double[] s = chol.getSolver().solve(new org.apache.commons.math3.linear.ArrayRealVector(c)).toArray();
            double reduce = 0;
            for (int i = 0; i < n; i++) {
                reduce += c[i] * s[i];
            }
            double reference = prior - reduce;
            double got = ours.sdLatent()[j] * ours.sdLatent()[j];
            assertEquals(reference, got, 1e-9, "latent variance at query " + j);
        }
        Predictive plain = gp.predict(q, null);
        for (int j = 0; j < q.size(); j++) {
            assertTrue(ours.sdLatent()[j] > plain.sdLatent()[j], "uncertain coefficients widen at query " + j);
            assertEquals(plain.mean()[j], ours.mean()[j], 0, "the mean stays at the fitted physics");
        }
    }

    @Test
    void runsThatSayNothingAboutTheCoefficientsLeaveTheirWholePriorVariance() {
        // hTrain = 0: the runs carry no information about the coefficients, so the added variance
        // is h*'Bh* exactly (r = h*, (B^-1 + 0)^-1 = B)
        List<DesignPoint> x = List.of(new DesignPoint(new double[] {0.1}, new int[0]),
                new DesignPoint(new double[] {0.6}, new int[0]));
        GpHyperparameters h = new GpHyperparameters(1.0, new double[] {0.3}, new double[0], 0.1);
        GaussianProcess gp = GaussianProcess.withHyperparameters(x, new double[] {0.2, -0.4}, null, h, false);
        List<DesignPoint> q = List.of(new DesignPoint(new double[] {0.35}, new int[0]));
        double plain = Math.pow(gp.predict(q, null).sdLatent()[0], 2);
        double[][] b = {{0.5}};
        double with = Math.pow(gp.predict(q, null, new GaussianProcess.Basis(new double[2][1],
                new double[][] {{2.0}}, b)).sdLatent()[0], 2);
        assertEquals(plain + 2.0 * 0.5 * 2.0, with, 1e-12);
    }
}
