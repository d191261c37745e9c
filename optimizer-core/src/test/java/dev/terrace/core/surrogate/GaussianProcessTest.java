package dev.terrace.core.surrogate;

import dev.terrace.core.space.DesignPoint;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertSame;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class GaussianProcessTest {

    private static DesignPoint p(double... x) {
        return new DesignPoint(x, new int[0]);
    }

    /** A worked example: X = (0, 1, 2), y = (0, 1, 0), Matern-5/2, sigma_f^2 = 1, l = 1, sigma_n^2 = 0.01. */
    private static GaussianProcess threePoint() {
        GpHyperparameters h = new GpHyperparameters(1.0, new double[] {1.0}, new double[0], 0.01);
        return GaussianProcess.withHyperparameters(List.of(p(0), p(1), p(2)), new double[] {0, 1, 0},
                new double[] {0, 0, 0}, h, false);
    }

    @Test
    void threePointPosteriorMatchesTheWorkedExample() {
        // Rasmussen & Williams, Gaussian Processes for Machine Learning (MIT Press 2006), Algorithm 2.1,
        // eqs. 2.25, 2.26, 2.30, evaluated independently with the reference library mpmath 1.3.0 at
        // 40 digits (K + 0.01 I solved with mp.lu_solve, log|K| from mp.cholesky): sigma_f^2 = 1, l = 1,
        // sigma_n^2 = 0.01, zero prior mean, no standardisation.
        GaussianProcess gp = threePoint();
        Predictive pr = gp.predict(List.of(p(0.5), p(1.5), p(3.0)), new double[] {0, 0, 0});
        assertEquals(0.604335217699653, pr.mean(0), 1e-9, "mu(0.5), mpmath");
        assertEquals(0.604335217699653, pr.mean(1), 1e-9, "mu(1.5) = mu(0.5), mpmath");
        assertEquals(-0.21247419785559707, pr.mean(2), 1e-9, "mu(3.0), mpmath");
        assertEquals(0.0969089510652913, pr.sdLatent(0) * pr.sdLatent(0), 1e-9, "var f(0.5), mpmath");
        assertEquals(0.0969089510652913, pr.sdLatent(1) * pr.sdLatent(1), 1e-9, "var f(1.5), mpmath");
        assertEquals(0.7021618084784387, pr.sdLatent(2) * pr.sdLatent(2), 1e-9, "var f(3.0), mpmath");
        assertEquals(-3.3816034530423877, gp.logMarginalLikelihood(), 1e-9, "log p(y|X), mpmath");
        assertEquals(0.1, pr.noiseSd(), 1e-15, "sigma_n = sqrt(0.01)");
        assertEquals(0.0, gp.jitter(), 0.0, "a well-conditioned K needs no jitter");
    }

    @Test
    void sdNewAddsTheNoiseVarianceToTheLatentVariance() {
        // R&W 2006 eq. 2.26: var y* = var f* + sigma_n^2; latent variances from the mpmath computation above.
        Predictive pr = threePoint().predict(List.of(p(0.5), p(3.0)), new double[] {0, 0});
        assertEquals(0.0969089510652913 + 0.01, pr.sdNew(0) * pr.sdNew(0), 1e-9);
        assertEquals(0.7021618084784387 + 0.01, pr.sdNew(1) * pr.sdNew(1), 1e-9);
    }

    @Test
    void standardisationMakesTheFitEquivariantUnderAffineChangesOfY() {
        // Derived: with y' = a*y + b the standardised residuals are identical, so the same seed gives
        // the same hyperparameters, mu' = a*mu + b, sd' = a*sd and log p(y') = log p(y) - n*ln(a).
        // Rounding in a*y + b perturbs the search path slightly, hence relative tolerances of 1e-6.
        SplittableRandom r = new SplittableRandom(5);
        List<DesignPoint> x = new ArrayList<>();
        double[] y = new double[20];
        double[] y2 = new double[20];
        for (int i = 0; i < 20; i++) {
            x.add(p(r.nextDouble(), r.nextDouble()));
            y[i] = Math.sin(4 * x.get(i).x(0)) + x.get(i).x(1) + 0.02 * r.nextGaussian();
            y2[i] = 1000 * y[i] + 50;
        }
        GaussianProcess a = GaussianProcess.fit(x, y, null, GpSettings.defaults(), 9);
        GaussianProcess b = GaussianProcess.fit(x, y2, null, GpSettings.defaults(), 9);
        List<DesignPoint> q = List.of(p(0.1, 0.9), p(0.5, 0.5), p(0.95, 0.05));
        Predictive pa = a.predict(q, null);
        Predictive pb = b.predict(q, null);
        for (int i = 0; i < q.size(); i++) {
            assertEquals(1000 * pa.mean(i) + 50, pb.mean(i), 1e-3);
            assertEquals(1000 * pa.sdLatent(i), pb.sdLatent(i), 1e-3);
        }
        assertEquals(1000 * pa.noiseSd(), pb.noiseSd(), 1e-3);
        assertEquals(a.logMarginalLikelihood() - 20 * Math.log(1000), b.logMarginalLikelihood(), 1e-6 * 20 * Math.log(1000));
        // the likelihood is flat along sigma_f^2 here, so the two searches stop a little apart
        assertEquals(a.hyperparameters().signalVariance(), b.hyperparameters().signalVariance(),
                1e-3 * a.hyperparameters().signalVariance());
    }

    @Test
    void batchedPredictionEqualsOnePointAtATime() {
        // 600 points span three Smile query chunks; each must agree with a one-point query (to
        // rounding: BLAS blocks a 1-column and a 256-column solve differently).
        SplittableRandom r = new SplittableRandom(2);
        List<DesignPoint> x = new ArrayList<>();
        double[] y = new double[15];
        for (int i = 0; i < 15; i++) {
            x.add(new DesignPoint(new double[] {r.nextDouble()}, new int[] {i % 3}));
            y[i] = Math.exp(x.get(i).x(0)) + x.get(i).level(0);
        }
        GaussianProcess gp = GaussianProcess.fit(x, y, null, GpSettings.defaults(), 1);
        List<DesignPoint> q = new ArrayList<>();
        for (int i = 0; i < 600; i++) {
            q.add(new DesignPoint(new double[] {r.nextDouble()}, new int[] {r.nextInt(3)}));
        }
        Predictive all = gp.predict(q, null);
        assertEquals(600, all.size());
        for (int i = 0; i < 600; i += 37) {
            Predictive one = gp.predict(List.of(q.get(i)), null);
            assertEquals(one.mean(0), all.mean(i), 1e-9);
            assertEquals(one.sdLatent(0), all.sdLatent(i), 1e-9);
        }
    }

    @Test
    void conditionEqualsRefittingWithTheSameHyperparametersAndShrinksTheSdThere() {
        // Derived: extending the Cholesky factor by one row must give the same posterior as a new
        // factorisation of the n+1 runs (R&W 2006, Algorithm 2.1).
        GaussianProcess gp = threePoint();
        DesignPoint extra = p(2.6);
        GaussianProcess cond = gp.condition(extra, 0.4, 0.0);
        GaussianProcess ref = GaussianProcess.withHyperparameters(List.of(p(0), p(1), p(2), extra),
                new double[] {0, 1, 0, 0.4}, new double[] {0, 0, 0, 0}, gp.hyperparameters(), false);
        List<DesignPoint> q = List.of(p(0.5), p(2.6), p(3.5), p(-1));
        double[] zeros = new double[4];
        Predictive pc = cond.predict(q, zeros);
        Predictive pr = ref.predict(q, zeros);
        for (int i = 0; i < q.size(); i++) {
            assertEquals(pr.mean(i), pc.mean(i), 1e-12);
            assertEquals(pr.sdLatent(i), pc.sdLatent(i), 1e-12);
        }
        assertEquals(ref.logMarginalLikelihood(), cond.logMarginalLikelihood(), 1e-12);
        assertEquals(4, cond.n());
        assertEquals(3, gp.n(), "the original GP is unchanged");
        assertSame(gp.hyperparameters(), cond.hyperparameters());
        double before = gp.predict(List.of(extra), new double[1]).sdLatent(0);
        double after = cond.predict(List.of(extra), new double[1]).sdLatent(0);
        assertTrue(after < 0.5 * before, "sd at the new run shrinks: " + before + " -> " + after);
    }

    @Test
    void krigingBelieverFantasyLeavesTheMeanUnchanged() {
        // With the lie y* = mu(x*) the residual at x* is zero, so the posterior mean is unchanged
        // everywhere while the variance drops (Ginsbourger, Le Riche & Carraro 2010) [derived].
        SplittableRandom r = new SplittableRandom(8);
        List<DesignPoint> x = new ArrayList<>();
        double[] y = new double[12];
        for (int i = 0; i < 12; i++) {
            x.add(p(r.nextDouble(), r.nextDouble()));
            y[i] = x.get(i).x(0) * x.get(i).x(1) + 0.01 * r.nextGaussian();
        }
        GaussianProcess gp = GaussianProcess.fit(x, y, null, GpSettings.defaults(), 3);
        DesignPoint star = p(0.3, 0.7);
        double lie = gp.predict(List.of(star), null).mean(0);
        GaussianProcess kb = gp.condition(star, lie, Double.NaN);
        List<DesignPoint> q = List.of(p(0.1, 0.1), p(0.3, 0.7), p(0.9, 0.4));
        Predictive a = gp.predict(q, null);
        Predictive b = kb.predict(q, null);
        for (int i = 0; i < q.size(); i++) {
            assertEquals(a.mean(i), b.mean(i), 1e-9);
            assertTrue(b.sdLatent(i) <= a.sdLatent(i) + 1e-12);
        }
        assertTrue(b.sdLatent(1) < a.sdLatent(1));
    }

    @Test
    void sameSeedGivesTheSameFitAndStartsNeverLowerTheLikelihood() {
        SplittableRandom r = new SplittableRandom(4);
        List<DesignPoint> x = new ArrayList<>();
        double[] y = new double[25];
        for (int i = 0; i < 25; i++) {
            x.add(p(r.nextDouble(), r.nextDouble(), r.nextDouble()));
            y[i] = Math.sin(6 * x.get(i).x(0)) * x.get(i).x(2) + 0.05 * r.nextGaussian();
        }
        GaussianProcess a = GaussianProcess.fit(x, y, null, GpSettings.defaults(), 77);
        GaussianProcess b = GaussianProcess.fit(x, y, null, GpSettings.defaults(), 77);
        assertEquals(a.hyperparameters(), b.hyperparameters());
        // the first start is the same default start, so eight starts cannot end lower than one
        GaussianProcess one = GaussianProcess.fit(x, y, null, GpSettings.defaults().withHpoStarts(1), 77);
        assertTrue(a.logMarginalLikelihood() >= one.logMarginalLikelihood() - 1e-9);
    }

    @Test
    void invalidInputIsRejected() {
        List<DesignPoint> x = List.of(p(0.1), p(0.5));
        GpSettings s = GpSettings.defaults();
        assertThrows(IllegalArgumentException.class, () -> GaussianProcess.fit(List.of(), new double[0], null, s, 1));
        assertThrows(IllegalArgumentException.class, () -> GaussianProcess.fit(x, new double[] {1}, null, s, 1));
        assertThrows(IllegalArgumentException.class,
                () -> GaussianProcess.fit(x, new double[] {1, Double.NaN}, null, s, 1));
        assertThrows(IllegalArgumentException.class,
                () -> GaussianProcess.fit(x, new double[] {1, 2}, new double[] {0, Double.NaN}, s, 1),
                "a prior mean missing at some runs only");
        assertThrows(IllegalArgumentException.class,
                () -> GaussianProcess.fit(List.of(p(0.1), p(0.2, 0.3)), new double[] {1, 2}, null, s, 1));
        GaussianProcess withPrior = GaussianProcess.fit(x, new double[] {1, 2}, new double[] {0.9, 2.2}, s, 1);
        assertThrows(IllegalArgumentException.class, () -> withPrior.predict(List.of(p(0.3)), null));
        assertThrows(IllegalArgumentException.class, () -> withPrior.condition(p(0.3), 1.5, Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> withPrior.predict(List.of(p(0.3, 0.3)), new double[] {1}));
        assertThrows(IllegalArgumentException.class, () -> new GpSettings(0, 100, 1e-6, 0.01, 10, 400, 4, 15));
        assertThrows(IllegalArgumentException.class, () -> new GpSettings(8, 100, 0, 0.01, 10, 400, 4, 15));
        assertNotEquals(GpSettings.defaults(), GpSettings.defaults().withHpoStarts(2));
    }
}
