package dev.terrace.core.surrogate;

import dev.terrace.core.space.DesignPoint;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Degenerate and badly scaled data: every output must stay finite (house rule: no NaN or infinity). */
class GaussianProcessRobustnessTest {

    private static DesignPoint p(double... x) {
        return new DesignPoint(x, new int[0]);
    }

    private static List<DesignPoint> grid(int n) {
        List<DesignPoint> q = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            q.add(p(i / (n - 1.0), (i * 7 % n) / (n - 1.0)));
        }
        return q;
    }

    private static void assertFinite(GaussianProcess gp, Predictive pr) {
        assertTrue(Double.isFinite(gp.logMarginalLikelihood()));
        assertTrue(pr.noiseSd() > 0 && Double.isFinite(pr.noiseSd()));
        for (int i = 0; i < pr.size(); i++) {
            assertTrue(Double.isFinite(pr.mean(i)), "mean " + i);
            assertTrue(pr.sdLatent(i) > 0 && Double.isFinite(pr.sdLatent(i)), "sd " + i);
            assertTrue(Double.isFinite(pr.sdNew(i)));
        }
    }

    @Test
    void duplicateRecipesWithDifferentOutcomesAreExplainedAsNoise() {
        List<DesignPoint> x = new ArrayList<>(List.of(p(0.3, 0.3), p(0.3, 0.3), p(0.8, 0.1), p(0.1, 0.9), p(0.6, 0.6)));
        double[] y = {1.0, 1.2, 0.4, 0.7, 0.9};
        GaussianProcess gp = GaussianProcess.fit(x, y, null, GpSettings.defaults(), 1);
        Predictive pr = gp.predict(List.of(p(0.3, 0.3), p(0.5, 0.5)), null);
        assertFinite(gp, pr);
        assertTrue(pr.mean(0) > 1.0 - 0.05 && pr.mean(0) < 1.2 + 0.05, "between the two repeats: " + pr.mean(0));
        assertTrue(gp.noiseSd() > 0.02, "the repeats differ by 0.2, so noise is not at the floor: " + gp.noiseSd());
    }

    @Test
    void identicalOutcomesGiveANearConstantModelWithSmallNonzeroSd() {
        List<DesignPoint> x = grid(10);
        double[] y = new double[10];
        java.util.Arrays.fill(y, 3.0);
        GaussianProcess gp = GaussianProcess.fit(x, y, null, GpSettings.defaults(), 1);
        Predictive pr = gp.predict(grid(7), null);
        assertFinite(gp, pr);
        for (int i = 0; i < pr.size(); i++) {
            assertEquals(3.0, pr.mean(i), 1e-9);
            assertTrue(pr.sdNew(i) <= 3.0 * GaussianProcess.FLAT_SCALE_FRACTION * 1.5, "small sd: " + pr.sdNew(i));
        }
        assertEquals(GpHyperparameters.defaults(2, 0, GpSettings.DEFAULT_NOISE_FLOOR), gp.hyperparameters());
    }

    @Test
    void oneRunUsesDefaultHyperparametersAndPredictsItsOutcome() {
        GaussianProcess gp = GaussianProcess.fit(List.of(p(0.4, 0.6)), new double[] {5.0}, null, GpSettings.defaults(), 1);
        assertEquals(GpHyperparameters.defaults(2, 0, GpSettings.DEFAULT_NOISE_FLOOR), gp.hyperparameters());
        assertEquals(0, gp.evaluations(), "no search with one run");
        Predictive pr = gp.predict(List.of(p(0.4, 0.6), p(1.0, 0.0)), null);
        assertFinite(gp, pr);
        assertEquals(5.0, pr.mean(0), 1e-12);
        assertEquals(5.0, pr.mean(1), 1e-12);
        assertTrue(pr.sdLatent(1) > 3 * pr.sdLatent(0), "uncertainty grows away from the run");
        assertEquals(GaussianProcess.SINGLE_RUN_SCALE_FRACTION * 5.0, gp.residualScale(), 1e-15);
    }

    @Test
    void oneRunWithAPriorMeanShiftsThePriorByTheResidual() {
        GaussianProcess gp = GaussianProcess.fit(List.of(p(0.4)), new double[] {5.0}, new double[] {4.5},
                GpSettings.defaults(), 1);
        Predictive pr = gp.predict(List.of(p(0.9)), new double[] {7.0});
        assertFinite(gp, pr);
        assertEquals(7.5, pr.mean(0), 1e-12, "prior 7.0 plus the observed residual 0.5");
    }

    @Test
    void twoRunsFitWithoutTrouble() {
        GaussianProcess gp = GaussianProcess.fit(List.of(p(0.2, 0.2), p(0.8, 0.7)), new double[] {1.0, 2.0}, null,
                GpSettings.defaults(), 1);
        Predictive pr = gp.predict(List.of(p(0.2, 0.2), p(0.8, 0.7), p(0.5, 0.5)), null);
        assertFinite(gp, pr);
        assertEquals(1.0, pr.mean(0), 0.1);
        assertEquals(2.0, pr.mean(1), 0.1);
    }

    @Test
    void outcomesSpanningSixDecadesOnALinearScaleStayFinite() {
        // y = 10^(6 + 6 x1) from 1e6 to 1e12 on a linear scale (the caller should use log10, but
        // the GP must still return finite values).
        List<DesignPoint> x = grid(20);
        double[] y = new double[20];
        for (int i = 0; i < 20; i++) {
            y[i] = Math.pow(10, 6 + 6 * x.get(i).x(0));
        }
        GaussianProcess gp = GaussianProcess.fit(x, y, null, GpSettings.defaults(), 1);
        Predictive pr = gp.predict(x, null);
        assertFinite(gp, pr);
        for (int i = 0; i < 20; i++) {
            assertEquals(y[i], pr.mean(i), 0.02 * 1e12, "run " + i);
        }
    }

    @Test
    void hugeOutcomesNearTheDoubleRangeStayFinite() {
        List<DesignPoint> x = grid(8);
        double[] y = new double[8];
        for (int i = 0; i < 8; i++) {
            y[i] = 1e300 * (1 + x.get(i).x(0));
        }
        GaussianProcess gp = GaussianProcess.fit(x, y, null, GpSettings.defaults(), 1);
        assertFinite(gp, gp.predict(grid(5), null));
    }

    @Test
    void aNearSingularKernelMatrixIsRescuedByJitter() {
        // 30 runs within 1e-9 of each other, long length scale and no noise: K is singular to
        // rounding, so the Cholesky needs jitter (1e-10 sigma_f^2, growing x10; common practice).
        SplittableRandom r = new SplittableRandom(3);
        List<DesignPoint> x = new ArrayList<>();
        double[] y = new double[30];
        for (int i = 0; i < 30; i++) {
            x.add(p(0.5 + 1e-9 * r.nextDouble(), 0.5 + 1e-9 * r.nextDouble()));
            y[i] = 1 + 0.01 * r.nextGaussian();
        }
        GpHyperparameters h = new GpHyperparameters(1, new double[] {2.0, 2.0}, new double[0], 0.0);
        GaussianProcess gp = GaussianProcess.withHyperparameters(x, y, null, h, false);
        assertTrue(gp.jitter() > 0, "jitter was needed");
        assertTrue(gp.jitter() <= GpCholesky.JITTER_LIMIT);
        Predictive pr = gp.predict(List.of(p(0.5, 0.5), p(0.0, 1.0)), null);
        assertTrue(Double.isFinite(gp.logMarginalLikelihood()));
        for (int i = 0; i < 2; i++) {
            assertTrue(Double.isFinite(pr.mean(i)) && Double.isFinite(pr.sdLatent(i)));
        }
        // the same clustered runs through the full search
        GaussianProcess fitted = GaussianProcess.fit(x, y, null, GpSettings.defaults(), 2);
        assertFinite(fitted, fitted.predict(List.of(p(0.5, 0.5), p(0.0, 1.0)), null));
        // conditioning on a copy of an existing run stays finite too
        GaussianProcess cond = fitted.condition(x.get(0), y[0], Double.NaN);
        assertFinite(cond, cond.predict(List.of(p(0.5, 0.5)), null));
    }
}
