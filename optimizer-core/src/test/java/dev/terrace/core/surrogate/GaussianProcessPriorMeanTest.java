package dev.terrace.core.surrogate;

import dev.terrace.core.space.DesignPoint;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class GaussianProcessPriorMeanTest {

    /** An invented smooth response over two settings (no physical meaning). */
    private static double truth(DesignPoint p) {
        return Math.sin(2 * Math.PI * p.x(0)) * p.x(1) + p.x(1) * p.x(1);
    }

    private static double[] truthAt(List<DesignPoint> x, double shift) {
        double[] m = new double[x.size()];
        for (int i = 0; i < m.length; i++) {
            m[i] = truth(x.get(i)) + shift;
        }
        return m;
    }

    private static List<DesignPoint> randomPoints(int n, SplittableRandom r) {
        List<DesignPoint> x = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            x.add(new DesignPoint(new double[] {r.nextDouble(), r.nextDouble()}, new int[0]));
        }
        return x;
    }

    private static double maxError(GaussianProcess gp, List<DesignPoint> q, double[] prior) {
        Predictive p = gp.predict(q, prior);
        double e = 0;
        for (int i = 0; i < q.size(); i++) {
            e = Math.max(e, Math.abs(p.mean(i) - truth(q.get(i))));
        }
        return e;
    }

    @Test
    void aPriorMeanEqualToTheTruthGivesGoodPredictionsFromFewRuns() {
        // A physics model as the GP prior mean (Rasmussen & Williams 2006, section 2.7, explicit
        // basis/mean functions): with m = f and measurement noise 0.01, the predictions stay within 5 noise sd
        // of f at new points, while a constant-mean GP on the same 5 runs cannot.
        SplittableRandom r = new SplittableRandom(21);
        List<DesignPoint> x = randomPoints(5, r);
        double[] y = truthAt(x, 0);
        for (int i = 0; i < y.length; i++) {
            y[i] += 0.01 * r.nextGaussian();
        }
        List<DesignPoint> q = randomPoints(50, r);
        GaussianProcess withPrior = GaussianProcess.fit(x, y, truthAt(x, 0), GpSettings.defaults(), 1);
        GaussianProcess without = GaussianProcess.fit(x, y, null, GpSettings.defaults(), 1);
        assertTrue(withPrior.usesPriorMean());
        double e1 = maxError(withPrior, q, truthAt(q, 0));
        double e0 = maxError(without, q, null);
        assertTrue(e1 < 0.05, "error with the prior mean: " + e1);
        assertTrue(e0 > 4 * e1, "error without it: " + e0 + " vs " + e1);
    }

    @Test
    void theGpLearnsAConstantOffsetOfThePriorMean() {
        // m = f + 0.7: the residuals are about -0.7 everywhere, which the constant offset absorbs.
        SplittableRandom r = new SplittableRandom(22);
        List<DesignPoint> x = randomPoints(6, r);
        double[] y = truthAt(x, 0);
        for (int i = 0; i < y.length; i++) {
            y[i] += 0.01 * r.nextGaussian();
        }
        List<DesignPoint> q = randomPoints(50, r);
        GaussianProcess gp = GaussianProcess.fit(x, y, truthAt(x, 0.7), GpSettings.defaults(), 2);
        assertEquals(-0.7, gp.residualMean(), 0.02);
        assertTrue(maxError(gp, q, truthAt(q, 0.7)) < 0.05);
    }

    @Test
    void anAllNaNPriorMeanMeansAConstantMean() {
        SplittableRandom r = new SplittableRandom(23);
        List<DesignPoint> x = randomPoints(8, r);
        double[] y = truthAt(x, 0);
        double[] nan = new double[8];
        java.util.Arrays.fill(nan, Double.NaN);
        GaussianProcess a = GaussianProcess.fit(x, y, nan, GpSettings.defaults(), 4);
        GaussianProcess b = GaussianProcess.fit(x, y, null, GpSettings.defaults(), 4);
        assertFalse(a.usesPriorMean());
        assertEquals(b.hyperparameters(), a.hyperparameters());
        double mean = 0;
        for (double v : y) {
            mean += v / y.length;
        }
        assertEquals(mean, a.residualMean(), 1e-12, "the constant mean is the outcomes' mean");
        // a constant-mean GP ignores any prior mean passed to predict
        List<DesignPoint> q = randomPoints(3, r);
        assertEquals(b.predict(q, null).mean(1), a.predict(q, new double[] {5, 5, 5}).mean(1), 0.0);
    }

    @Test
    void farFromTheRunsThePredictionReturnsToThePriorMeanPlusOffset() {
        // Matern correlation decays with distance (R&W 2006, eq. 4.17), so far away mu -> m + offset.
        List<DesignPoint> x = List.of(new DesignPoint(new double[] {0.0}, new int[0]),
                new DesignPoint(new double[] {0.05}, new int[0]), new DesignPoint(new double[] {0.1}, new int[0]));
        double[] y = {1.0, 1.3, 0.8};
        double[] m = {0.5, 0.5, 0.5};
        GpHyperparameters h = new GpHyperparameters(1, new double[] {0.05}, new double[0], 0.01);
        GaussianProcess gp = GaussianProcess.withHyperparameters(x, y, m, h, true);
        Predictive p = gp.predict(List.of(new DesignPoint(new double[] {1.0}, new int[0])), new double[] {2.0});
        assertEquals(2.0 + gp.residualMean(), p.mean(0), 1e-9);
        assertEquals(gp.residualScale() * 1.0, p.sdLatent(0), 1e-6, "prior sd far away is scale * sigma_f");
    }
}
