package dev.terrace.core.surrogate;

import dev.terrace.core.space.DesignPoint;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertTrue;

class GaussianProcessCategoricalTest {

    /**
     * 30 runs over one continuous setting and a two-level setting (invented data): level 0 follows
     * sin(2 pi x); level 1 follows the same function or an unrelated one, plus N(0, 0.02^2) noise.
     */
    private static GaussianProcess fit(boolean sameFunction, long seed) {
        SplittableRandom r = new SplittableRandom(seed);
        List<DesignPoint> x = new ArrayList<>();
        double[] y = new double[30];
        for (int i = 0; i < 30; i++) {
            double v = r.nextDouble();
            int level = i % 2;
            x.add(new DesignPoint(new double[] {v}, new int[] {level}));
            double f = level == 0 || sameFunction ? Math.sin(2 * Math.PI * v) : 1.5 * Math.cos(5 * v + 1) - 0.5;
            y[i] = f + 0.02 * r.nextGaussian();
        }
        return GaussianProcess.fit(x, y, null, GpSettings.defaults(), seed);
    }

    @Test
    void levelsFollowingTheSameFunctionGiveRhoNearOne() {
        // The level correlation of Qian, Wu & Wu 2008 is 1 for interchangeable levels; maximum
        // likelihood should drive it to its upper bound (0.999) [derived].
        for (long seed = 1; seed <= 3; seed++) {
            double rho = fit(true, seed).hyperparameters().rho(0);
            assertTrue(rho > 0.9, "seed " + seed + ": rho = " + rho);
        }
    }

    @Test
    void unrelatedFunctionsGiveAMuchLowerRho() {
        for (long seed = 1; seed <= 3; seed++) {
            double same = fit(true, seed).hyperparameters().rho(0);
            double unrelated = fit(false, seed).hyperparameters().rho(0);
            assertTrue(unrelated < 0.2, "seed " + seed + ": rho = " + unrelated);
            assertTrue(unrelated < same - 0.5);
        }
    }

    @Test
    void aSparselySampledLevelBorrowsStrengthFromACorrelatedOne() {
        // Level 1 has only 3 runs; with rho near 1 its predictions follow the level-0 curve.
        SplittableRandom r = new SplittableRandom(9);
        List<DesignPoint> x = new ArrayList<>();
        List<Double> ys = new ArrayList<>();
        for (int i = 0; i < 25; i++) {
            double v = r.nextDouble();
            x.add(new DesignPoint(new double[] {v}, new int[] {0}));
            ys.add(Math.sin(2 * Math.PI * v) + 0.02 * r.nextGaussian());
        }
        for (double v : new double[] {0.1, 0.5, 0.9}) {
            x.add(new DesignPoint(new double[] {v}, new int[] {1}));
            ys.add(Math.sin(2 * Math.PI * v) + 0.02 * r.nextGaussian());
        }
        double[] y = ys.stream().mapToDouble(Double::doubleValue).toArray();
        GaussianProcess gp = GaussianProcess.fit(x, y, null, GpSettings.defaults(), 5);
        List<DesignPoint> q = new ArrayList<>();
        for (double v : new double[] {0.25, 0.35, 0.7, 0.75}) {
            q.add(new DesignPoint(new double[] {v}, new int[] {1}));
        }
        Predictive p = gp.predict(q, null);
        for (int i = 0; i < q.size(); i++) {
            double truth = Math.sin(2 * Math.PI * q.get(i).x(0));
            assertTrue(Math.abs(p.mean(i) - truth) < 0.1, "x = " + q.get(i).x(0) + ": " + p.mean(i) + " vs " + truth);
        }
    }
}
