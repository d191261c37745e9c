package dev.terrace.core.surrogate;

import dev.terrace.core.space.DesignPoint;
import org.apache.commons.math3.analysis.integration.IterativeLegendreGaussIntegrator;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertTrue;

class GpCensoringTest {

    private static DesignPoint p(double... x) {
        return new DesignPoint(x, new int[0]);
    }

    /** X = (0, 1, 2), y = (0, 1, 0), Matern-5/2, sigma_f^2 = 1, l = 1, sigma_n^2 = 0.01, zero prior mean. */
    private static GaussianProcess threePoint() {
        GpHyperparameters h = new GpHyperparameters(1.0, new double[] {1.0}, new double[0], 0.01);
        return GaussianProcess.withHyperparameters(List.of(p(0), p(1), p(2)), new double[] {0, 1, 0},
                new double[] {0, 0, 0}, h, false);
    }

    /** Mean and variance of N(mu, var) truncated to (lo, hi), by Gauss-Legendre quadrature (Commons Math). */
    private static double[] truncatedMoments(double mu, double var, double lo, double hi) {
        NormalDistribution n = new NormalDistribution(mu, Math.sqrt(var));
        IterativeLegendreGaussIntegrator q = new IterativeLegendreGaussIntegrator(16, 1e-13, 1e-13);
        double z = q.integrate(100000, n::density, lo, hi);
        double m1 = new IterativeLegendreGaussIntegrator(16, 1e-13, 1e-13).integrate(100000, f -> f * n.density(f), lo, hi) / z;
        double m2 = new IterativeLegendreGaussIntegrator(16, 1e-13, 1e-13).integrate(100000, f -> f * f * n.density(f), lo, hi) / z;
        return new double[] {m1, m2 - m1 * m1};
    }

    @Test
    void oneCensoredRunGivesTheExactTruncatedNormalPosteriorAtItsRecipe() {
        // With a single censoring factor 1[f < c] on a Gaussian prior, the exact posterior marginal of f
        // at that run is the prior marginal truncated at c; EP matches its first two moments exactly
        // (Minka 2001). The reference moments come from numerical integration with Commons Math.
        GaussianProcess gp = threePoint();
        Predictive before = gp.predict(List.of(p(3.0)), new double[] {0});
        double mu = before.mean(0);
        double var = before.sdLatent(0) * before.sdLatent(0);
        double c = -1.0;
        double[] ref = truncatedMoments(mu, var, mu - 40 * Math.sqrt(var), c);
        GpCensoring.Result r = GpCensoring.update(gp, List.of(new GpCensoring.Observation(p(3.0), c, false, 0)));
        assertTrue(r.converged());
        assertEquals(1, r.informative());
        Predictive after = r.gp().predict(List.of(p(3.0)), new double[] {0});
        assertEquals(ref[0], after.mean(0), 1e-6, "posterior mean = truncated-normal mean");
        assertEquals(ref[1], after.sdLatent(0) * after.sdLatent(0), 1e-6, "posterior variance = truncated-normal variance");
        assertTrue(after.mean(0) < c);
        assertEquals(4, r.gp().n(), "the site is one more run");
    }

    @Test
    void aboveBoundMirrorsTheBelowBound() {
        GaussianProcess gp = threePoint();
        Predictive before = gp.predict(List.of(p(3.0)), new double[] {0});
        double mu = before.mean(0);
        double sd = before.sdLatent(0);
        double c = 0.5;
        double[] ref = truncatedMoments(mu, sd * sd, c, mu + 40 * sd);
        GpCensoring.Result r = GpCensoring.update(gp, List.of(new GpCensoring.Observation(p(3.0), c, true, 0)));
        Predictive after = r.gp().predict(List.of(p(3.0)), new double[] {0});
        assertEquals(ref[0], after.mean(0), 1e-6);
        assertEquals(ref[1], after.sdLatent(0) * after.sdLatent(0), 1e-6);
    }

    @Test
    void boundFarOnTheSafeSideIsUninformative() {
        GaussianProcess gp = threePoint();
        GpCensoring.Result r = GpCensoring.update(gp, List.of(new GpCensoring.Observation(p(1.0), 1e6, false, 0)));
        assertEquals(0, r.informative());
        assertSame(gp, r.gp());
    }

    @Test
    void contradictoryBoundsStayFinite() {
        // "<-1" and ">1" at one recipe cannot both hold: EP must still return a usable, finite GP
        GaussianProcess gp = threePoint();
        GpCensoring.Result r = GpCensoring.update(gp, List.of(new GpCensoring.Observation(p(3.0), -1, false, 0),
                new GpCensoring.Observation(p(3.0), 1, true, 0)));
        Predictive pr = r.gp().predict(List.of(p(3.0), p(0.5)), new double[] {0, 0});
        assertTrue(Double.isFinite(pr.mean(0)) && Double.isFinite(pr.sdLatent(0)));
        assertTrue(r.sweeps() <= GpCensoring.MAX_SWEEPS);
    }

    @Test
    void closedFormLeaveOneOutMatchesRefittingWithoutEachRun() {
        // Rasmussen & Williams 2006 eqs. 5.10-5.12 against the definition: drop run i, rebuild the GP
        // with the same hyperparameters, predict run i.
        GpHyperparameters h = new GpHyperparameters(1.3, new double[] {0.4}, new double[0], 0.05);
        List<DesignPoint> x = new ArrayList<>();
        double[] y = new double[9];
        for (int i = 0; i < y.length; i++) {
            x.add(p(i / 8.0));
            y[i] = Math.sin(5 * i / 8.0) + (i % 3 == 0 ? 0.2 : -0.1);
        }
        GaussianProcess gp = GaussianProcess.withHyperparameters(x, y, null, h, false);
        GpLeaveOneOut loo = gp.leaveOneOut(y.length);
        double press = 0;
        double mean = 0;
        for (double v : y) {
            mean += v / y.length;
        }
        double ss = 0;
        for (int i = 0; i < y.length; i++) {
            List<DesignPoint> xi = new ArrayList<>(x);
            xi.remove(i);
            double[] yi = new double[y.length - 1];
            for (int j = 0, k = 0; j < y.length; j++) {
                if (j != i) {
                    yi[k++] = y[j];
                }
            }
            double mu = GaussianProcess.withHyperparameters(xi, yi, null, h, false).predict(List.of(x.get(i)), null).mean(0);
            press += (y[i] - mu) * (y[i] - mu);
            ss += (y[i] - mean) * (y[i] - mean);
        }
        assertEquals(Math.sqrt(press / y.length), loo.rmse(), 1e-9);
        assertEquals(1 - press / ss, loo.q2(), 1e-9);
        assertTrue(loo.hasSkill(), "a smooth function is predictable: Q2 = " + loo.q2());
    }

    @Test
    void alternatingOutcomesHaveNoSkill() {
        // +1, -1, +1, ... on an even grid: every run's neighbours say the opposite, so no model that
        // honours the neighbours predicts better than the mean (Q2 <= 0)
        List<DesignPoint> x = new ArrayList<>();
        double[] y = new double[10];
        for (int i = 0; i < y.length; i++) {
            x.add(p(i / 9.0));
            y[i] = i % 2 == 0 ? 1 : -1;
        }
        GaussianProcess gp = GaussianProcess.withHyperparameters(x, y, null,
                new GpHyperparameters(1.0, new double[] {0.2}, new double[0], 0.01), false);
        GpLeaveOneOut loo = gp.leaveOneOut(y.length);
        assertTrue(loo.q2() <= 0, "Q2 = " + loo.q2());
        assertTrue(!loo.hasSkill());
        // sample sd (n - 1) of five +1 and five -1: sqrt(10/9)
        assertEquals(Math.sqrt(10.0 / 9.0), loo.observedSd(), 1e-12);
        assertTrue(loo.noSkillSpread() >= loo.observedSd());
    }
}
