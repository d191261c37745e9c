package dev.terrace.core.surrogate;

import dev.terrace.core.space.DesignPoint;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Tests of {@link SuccessModel}. The run logs are invented for these tests. External yardsticks:
 * the beta&ndash;binomial posterior mean (s + &alpha;)/(n + &alpha; + &beta;) (Gelman et al.,
 * <i>Bayesian Data Analysis</i>, 3rd ed., ch. 2; from memory) for runs at the centre of the box,
 * the true generating probabilities of a known logistic model, and the expected calibration
 * error of Guo et al. 2017.
 */
class SuccessModelTest {

    /** Weights of the invented truth over [1, u0, u1, level0, level1]. */
    private static final double[] TRUE_W = {1.2, 1.5, -1.0, 0.4, -0.4};

    private static final double ALPHA = SuccessModel.BASE_SUCCESS_RATE * SuccessModel.PRIOR_PSEUDO_RUNS;
    private static final double PSEUDO = SuccessModel.PRIOR_PSEUDO_RUNS;

    static double truth(DesignPoint p) {
        double[] f = {1, 2 * p.x(0) - 1, 2 * p.x(1) - 1, p.level(0) == 0 ? 1 : 0, p.level(0) == 1 ? 1 : 0};
        double eta = 0;
        for (int j = 0; j < f.length; j++) {
            eta += TRUE_W[j] * f[j];
        }
        return 1 / (1 + Math.exp(-eta));
    }

    static List<DesignPoint> uniform(int n, SplittableRandom rng, boolean withLevel) {
        List<DesignPoint> x = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            x.add(new DesignPoint(new double[] {rng.nextDouble(), rng.nextDouble()},
                    withLevel ? new int[] {rng.nextInt(2)} : new int[0]));
        }
        return x;
    }

    private static List<DesignPoint> centre(int n) {
        List<DesignPoint> x = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            x.add(new DesignPoint(new double[] {0.5, 0.5}, new int[0]));
        }
        return x;
    }

    @Test
    void noRunsGiveTheBaseRate() {
        SuccessModel m = SuccessModel.fit(List.of(), new boolean[0], 1L);
        double[] p = m.predict(uniform(20, new SplittableRandom(1), true));
        for (double v : p) {
            assertEquals(SuccessModel.BASE_SUCCESS_RATE, v, 1e-12, "the prior base rate");
        }
        assertTrue(m.crossValidatedLogLoss().isEmpty());
    }

    @Test
    void runsAtTheCentreGiveTheBetaBinomialPosteriorMean() {
        // (s + alpha)/(n + alpha + beta) with alpha = 1.8, beta = 0.2: 10 of 10 -> 11.8/12; 7 of 10 -> 8.8/12
        boolean[] all = new boolean[10];
        java.util.Arrays.fill(all, true);
        double p = SuccessModel.fit(centre(10), all, 1L).predict(centre(1))[0];
        assertEquals((10 + ALPHA) / (10 + PSEUDO), p, 1e-9, "beta-binomial posterior mean, 10 of 10");
        boolean[] seven = {true, false, true, true, false, true, true, false, true, true};
        double q = SuccessModel.fit(centre(10), seven, 1L).predict(centre(1))[0];
        assertEquals((7 + ALPHA) / (10 + PSEUDO), q, 1e-9, "beta-binomial posterior mean, 7 of 10");
    }

    @Test
    void onlySuccessesKeepTheProbabilityHighButBelowOne() {
        SplittableRandom rng = new SplittableRandom(2);
        List<DesignPoint> x = uniform(30, rng, true);
        boolean[] ok = new boolean[30];
        java.util.Arrays.fill(ok, true);
        SuccessModel m = SuccessModel.fit(x, ok, 3L);
        for (double v : m.predict(uniform(500, rng, true))) {
            assertTrue(v > 0.8 && v < 1, "high but below 1: " + v);
        }
        assertEquals(0, m.failures());
    }

    @Test
    void failuresInOneCornerLowerTheProbabilityThere() {
        // invented log: every run with x0 > 0.8 failed, all others succeeded
        SplittableRandom rng = new SplittableRandom(4);
        List<DesignPoint> x = uniform(40, rng, false);
        boolean[] ok = new boolean[40];
        for (int i = 0; i < 40; i++) {
            ok[i] = x.get(i).x(0) <= 0.8;
        }
        SuccessModel m = SuccessModel.fit(x, ok, 5L);
        List<DesignPoint> hot = new ArrayList<>();
        List<DesignPoint> cold = new ArrayList<>();
        for (int i = 0; i < 11; i++) {
            hot.add(new DesignPoint(new double[] {0.9, i / 10.0}, new int[0]));
            cold.add(new DesignPoint(new double[] {0.1, i / 10.0}, new int[0]));
        }
        double[] ph = m.predict(hot);
        double[] pc = m.predict(cold);
        for (int i = 0; i < 11; i++) {
            assertTrue(ph[i] < pc[i] - 0.3, "lower where the failures were: " + ph[i] + " vs " + pc[i]);
            assertTrue(pc[i] > 0.8, "high where every run succeeded: " + pc[i]);
        }
    }

    @Test
    void onlyFailuresGiveALowButNonzeroProbability() {
        SplittableRandom rng = new SplittableRandom(6);
        List<DesignPoint> x = uniform(10, rng, false);
        SuccessModel m = SuccessModel.fit(x, new boolean[10], 7L);
        // beta-binomial posterior mean at the centre would be 1.8/12 = 0.15
        for (double v : m.predict(uniform(200, rng, false))) {
            assertTrue(v < 0.35, "low: " + v);
            assertTrue(v > 0.01, "but not ruled out: " + v);
        }
        assertEquals(10, m.failures());
    }

    @Test
    void oneRunMovesTheBaseRateAsOnePseudoCountWould() {
        DesignPoint p = new DesignPoint(new double[] {0.3, 0.6}, new int[] {1});
        double up = SuccessModel.fit(List.of(p), new boolean[] {true}, 1L).predict(List.of(p))[0];
        double down = SuccessModel.fit(List.of(p), new boolean[] {false}, 1L).predict(List.of(p))[0];
        assertTrue(up > SuccessModel.BASE_SUCCESS_RATE && up < 1, "one success raises the rate: " + up);
        assertTrue(down < SuccessModel.BASE_SUCCESS_RATE && down > 0.3, "one failure lowers it, not to 0: " + down);
    }

    @Test
    void calibratedOnDataFromAKnownLogisticModel() {
        // 400 runs drawn from the invented truth; on 20 000 fresh recipes: mean ECE (10 bins,
        // Guo et al. 2017) over five training sets below 0.05, log loss within 3 % of the truth's
        // and below that of the constant base rate
        SplittableRandom fr = new SplittableRandom(100);
        List<DesignPoint> fresh = uniform(20_000, fr, true);
        boolean[] freshOk = new boolean[fresh.size()];
        double[] freshTruth = new double[fresh.size()];
        double[] base = new double[fresh.size()];
        for (int i = 0; i < fresh.size(); i++) {
            freshTruth[i] = truth(fresh.get(i));
            freshOk[i] = fr.nextDouble() < freshTruth[i];
            base[i] = SuccessModel.BASE_SUCCESS_RATE;
        }
        double truthLoss = ClassModelMetrics.logLoss(freshTruth, freshOk);
        double eceSum = 0;
        int sets = 5;
        for (long seed = 0; seed < sets; seed++) {
            SplittableRandom rng = new SplittableRandom(2000 + seed);
            List<DesignPoint> x = uniform(400, rng, true);
            boolean[] ok = new boolean[400];
            for (int i = 0; i < 400; i++) {
                ok[i] = rng.nextDouble() < truth(x.get(i));
            }
            double[] p = SuccessModel.fit(x, ok, 9L).predict(fresh);
            eceSum += ClassModelMetrics.expectedCalibrationError(p, freshOk, 10);
            double loss = ClassModelMetrics.logLoss(p, freshOk);
            assertTrue(loss < 1.03 * truthLoss, "log loss " + loss + " vs truth " + truthLoss + ", set " + seed);
            assertTrue(loss < ClassModelMetrics.logLoss(base, freshOk), "beats the constant base rate");
        }
        assertTrue(eceSum / sets < 0.05, "mean ECE " + eceSum / sets);
    }

    @Test
    void fitsAreDeterministicPerSeedAndRefuseBadInput() {
        SplittableRandom rng = new SplittableRandom(8);
        List<DesignPoint> x = uniform(50, rng, true);
        boolean[] ok = new boolean[50];
        for (int i = 0; i < 50; i++) {
            ok[i] = rng.nextDouble() < truth(x.get(i));
        }
        List<DesignPoint> probe = uniform(30, rng, true);
        assertArrayEquals(SuccessModel.fit(x, ok, 3L).predict(probe), SuccessModel.fit(x, ok, 3L).predict(probe), 0.0,
                "same seed, same model");
        assertThrows(IllegalArgumentException.class, () -> SuccessModel.fit(x, new boolean[3], 1L));
        for (double v : SuccessModel.fit(x, ok, 3L).predict(probe)) {
            assertTrue(v >= SuccessModel.PROBABILITY_FLOOR && v <= 1 - SuccessModel.PROBABILITY_FLOOR, "clamped: " + v);
        }
    }
}
