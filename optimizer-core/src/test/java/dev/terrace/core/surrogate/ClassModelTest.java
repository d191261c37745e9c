package dev.terrace.core.surrogate;

import dev.terrace.core.space.DesignPoint;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.SplittableRandom;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Tests of {@link ClassModel} on synthetic data drawn from known multinomial logistic models.
 * The scenario (a morphology outcome over two continuous settings and one two-level setting, with
 * an invented "plugin" prior) is made up for these tests. The external yardsticks are the true
 * generating probabilities (log loss of the truth), the expected calibration error of Guo et al.
 * 2017 and the property that zero data leave the prior unchanged.
 */
class ClassModelTest {

    private static final List<String> CLASSES = List.of("dot", "ring", "disk", "hole");

    /** Weights of the truth over the features [1, u0, u1, level0, level1], per class (invented). */
    private static final double[][] TRUE_W = {
        {0.3, 1.2, 0.0, 0.4, -0.4},
        {-0.2, -0.8, 1.0, 0.0, 0.0},
        {0.0, 0.0, -1.2, -0.3, 0.3},
        {-0.5, 0.5, 0.5, 0.0, 0.0},
    };

    /** Data set: points, labels as indices, priors. */
    record Data(List<DesignPoint> x, int[] y, double[][] prior, double[][] truth) {

        List<String> labels() {
            List<String> l = new ArrayList<>();
            for (int v : y) {
                l.add(CLASSES.get(v));
            }
            return l;
        }
    }

    /** The invented plugin prior: softmax(u0, 0.5 u1, -0.5 u0, 0). */
    static double[] plugin(DesignPoint p) {
        double u0 = 2 * p.x(0) - 1;
        double u1 = 2 * p.x(1) - 1;
        return softmax(new double[] {u0, 0.5 * u1, -0.5 * u0, 0.0});
    }

    static double[] softmax(double[] eta) {
        double m = Double.NEGATIVE_INFINITY;
        for (double v : eta) {
            m = Math.max(m, v);
        }
        double s = 0;
        double[] out = new double[eta.length];
        for (int c = 0; c < eta.length; c++) {
            out[c] = Math.exp(eta[c] - m);
            s += out[c];
        }
        for (int c = 0; c < eta.length; c++) {
            out[c] /= s;
        }
        return out;
    }

    /** Truth = plugin offset + scale * TRUE_W . features. */
    static double[] truth(DesignPoint p, double scale) {
        double[] prior = plugin(p);
        double[] f = {1, 2 * p.x(0) - 1, 2 * p.x(1) - 1, p.level(0) == 0 ? 1 : 0, p.level(0) == 1 ? 1 : 0};
        double[] eta = new double[CLASSES.size()];
        for (int c = 0; c < eta.length; c++) {
            double s = Math.log(prior[c]);
            for (int j = 0; j < f.length; j++) {
                s += scale * TRUE_W[c][j] * f[j];
            }
            eta[c] = s;
        }
        return softmax(eta);
    }

    static int draw(double[] p, SplittableRandom rng) {
        double u = rng.nextDouble();
        double acc = 0;
        for (int c = 0; c < p.length; c++) {
            acc += p[c];
            if (u < acc) {
                return c;
            }
        }
        return p.length - 1;
    }

    static Data sample(int n, double scale, long seed) {
        SplittableRandom rng = new SplittableRandom(seed);
        List<DesignPoint> x = new ArrayList<>();
        int[] y = new int[n];
        double[][] prior = new double[n][];
        double[][] truth = new double[n][];
        for (int i = 0; i < n; i++) {
            DesignPoint p = new DesignPoint(new double[] {rng.nextDouble(), rng.nextDouble()}, new int[] {rng.nextInt(2)});
            x.add(p);
            prior[i] = plugin(p);
            truth[i] = truth(p, scale);
            y[i] = draw(truth[i], rng);
        }
        return new Data(x, y, prior, truth);
    }

    @Test
    void zeroRunsReturnThePriorExactly() {
        ClassModel m = ClassModel.fit(List.of(), List.of(), CLASSES, new double[0][], 1L);
        Data fresh = sample(50, 1.0, 2L);
        double[][] p = m.predict(fresh.x(), fresh.prior());
        for (int i = 0; i < p.length; i++) {
            assertArrayEquals(fresh.prior()[i], p[i], 1e-15, "the prior itself, row " + i);
        }
        double[][] u = m.predict(fresh.x(), null);
        for (double[] row : u) {
            assertArrayEquals(new double[] {0.25, 0.25, 0.25, 0.25}, row, 1e-15, "uniform without a plugin");
        }
        assertTrue(m.crossValidatedLogLoss().isEmpty(), "no runs, no cross-validation");
        assertEquals(0, m.runs());
    }

    @Test
    void calibratedOnDataFromAKnownMultinomialLogisticModel() {
        // 400 training runs from the truth; on 20 000 fresh recipes the expected calibration error
        // (10 bins, Guo et al. 2017) is below 0.05 and the log loss beats the prior's and comes
        // within 3 % of the truth's. The ECE of one 400-run fit scatters (about 0.01 to 0.07 over
        // 30 training sets in development), so the bound is on the mean over five training sets.
        Data fresh = sample(20_000, 1.0, 12L);
        double eceSum = 0;
        int sets = 5;
        for (long seed = 0; seed < sets; seed++) {
            Data train = sample(400, 1.0, 1000 + seed);
            ClassModel m = ClassModel.fit(train.x(), train.labels(), CLASSES, train.prior(), 7L);
            double[][] p = m.predict(fresh.x(), fresh.prior());
            eceSum += ClassModelMetrics.expectedCalibrationError(p, fresh.y(), 10);
            double model = ClassModelMetrics.logLoss(p, fresh.y());
            double prior = ClassModelMetrics.logLoss(fresh.prior(), fresh.y());
            double truth = ClassModelMetrics.logLoss(fresh.truth(), fresh.y());
            assertTrue(model < prior, "log loss " + model + " vs prior " + prior + ", set " + seed);
            assertTrue(model < 1.03 * truth, "log loss " + model + " vs truth " + truth + ", set " + seed);
            for (double[] row : p) {
                double s = 0;
                for (double v : row) {
                    assertTrue(v >= 0.9 * ClassModel.PROBABILITY_FLOOR && v <= 1, "a probability above the floor: " + v);
                    s += v;
                }
                assertEquals(1.0, s, 1e-12, "rows sum to 1");
            }
        }
        assertTrue(eceSum / sets < 0.05, "mean ECE " + eceSum / sets);
    }

    @Test
    void aPriorThatIsAlreadyRightIsNotMadeWorse() {
        // data drawn from the plugin prior itself (truth scale 0): the fit must stay within 3 % of
        // the truth's log loss on fresh recipes
        Data train = sample(400, 0.0, 21L);
        Data fresh = sample(20_000, 0.0, 22L);
        ClassModel m = ClassModel.fit(train.x(), train.labels(), CLASSES, train.prior(), 7L);
        double model = ClassModelMetrics.logLoss(m.predict(fresh.x(), fresh.prior()), fresh.y());
        double truth = ClassModelMetrics.logLoss(fresh.truth(), fresh.y());
        assertTrue(model < 1.03 * truth, "log loss " + model + " vs truth " + truth);
    }

    @Test
    void manyRunsOverrideAWrongPrior() {
        // prior: "dot" at 0.85 everywhere; truth: "ring" whenever x0 > 0.5, "disk" otherwise (invented)
        SplittableRandom rng = new SplittableRandom(31);
        List<DesignPoint> x = new ArrayList<>();
        List<String> labels = new ArrayList<>();
        int n = 300;
        double[][] prior = new double[n][];
        for (int i = 0; i < n; i++) {
            DesignPoint p = new DesignPoint(new double[] {rng.nextDouble(), rng.nextDouble()}, new int[0]);
            x.add(p);
            labels.add(p.x(0) > 0.5 ? "ring" : "disk");
            prior[i] = new double[] {0.85, 0.05, 0.05, 0.05};
        }
        ClassModel m = ClassModel.fit(x, labels, CLASSES, prior, 3L);
        List<DesignPoint> probe = List.of(new DesignPoint(new double[] {0.9, 0.5}, new int[0]),
                new DesignPoint(new double[] {0.1, 0.5}, new int[0]));
        double[][] wrong = {{0.85, 0.05, 0.05, 0.05}, {0.85, 0.05, 0.05, 0.05}};
        double[][] p = m.predict(probe, wrong);
        assertTrue(p[0][1] > 0.8, "ring where the data say ring: " + p[0][1]);
        assertTrue(p[1][2] > 0.8, "disk where the data say disk: " + p[1][2]);
        assertTrue(p[0][0] < 0.1 && p[1][0] < 0.1, "the prior's favourite loses");
    }

    @Test
    void aClassNeverObservedKeepsAShrunkShareOfItsPrior() {
        // 40 runs labelled only dot/ring/disk under a uniform prior: "hole" must fall below its prior
        // share 1/4 but stay far above the probability floor (1e-6), because the ridge keeps its
        // weights finite. For scale: the posterior mean of a uniform Dirichlet prior after 40 runs
        // without a hole would be 1/44 = 0.023.
        SplittableRandom rng = new SplittableRandom(41);
        List<DesignPoint> x = new ArrayList<>();
        List<String> labels = new ArrayList<>();
        for (int i = 0; i < 40; i++) {
            DesignPoint p = new DesignPoint(new double[] {rng.nextDouble(), rng.nextDouble()}, new int[] {rng.nextInt(2)});
            double[] t = truth(p, 1.0);
            t[3] = 0;
            x.add(p);
            labels.add(CLASSES.get(draw(softmax(log(t)), rng)));
        }
        ClassModel m = ClassModel.fit(x, labels, CLASSES, null, 5L);
        Data fresh = sample(2000, 1.0, 42L);
        double[][] p = m.predict(fresh.x(), null);
        double mean = 0;
        for (double[] row : p) {
            mean += row[3] / p.length;
            assertTrue(row[3] > 1e-3, "not driven to the floor: " + row[3]);
        }
        assertTrue(mean < 0.25, "shrunk below the prior share: " + mean);
        assertTrue(mean > 0.005, "but kept well above the floor: " + mean);
    }

    @Test
    void fitsAreDeterministicPerSeedAndOrderOfRunsDoesNotMatterMuch() {
        Data train = sample(60, 1.0, 51L);
        Data fresh = sample(100, 1.0, 52L);
        ClassModel a = ClassModel.fit(train.x(), train.labels(), CLASSES, train.prior(), 9L);
        ClassModel b = ClassModel.fit(train.x(), train.labels(), CLASSES, train.prior(), 9L);
        double[][] pa = a.predict(fresh.x(), fresh.prior());
        double[][] pb = b.predict(fresh.x(), fresh.prior());
        for (int i = 0; i < pa.length; i++) {
            assertArrayEquals(pa[i], pb[i], 0.0, "same seed, same model");
        }
        assertEquals(a.ridge(), b.ridge(), 0.0);
        assertTrue(a.crossValidatedLogLoss().isPresent());
        // reversing the runs changes only the folds; at a fixed ridge the fit itself is order-free
        List<DesignPoint> rx = new ArrayList<>(train.x());
        List<String> rl = new ArrayList<>(train.labels());
        double[][] rp = train.prior().clone();
        Collections.reverse(rx);
        Collections.reverse(rl);
        Collections.reverse(java.util.Arrays.asList(rp));
        ClassModelSettings fixed = ClassModelSettings.defaults().withRidgeGrid(List.of(a.ridge()));
        double[][] pf = ClassModel.fit(train.x(), train.labels(), CLASSES, train.prior(), 1L, fixed).predict(fresh.x(), fresh.prior());
        double[][] pr = ClassModel.fit(rx, rl, CLASSES, rp, 2L, fixed).predict(fresh.x(), fresh.prior());
        for (int i = 0; i < pf.length; i++) {
            assertArrayEquals(pf[i], pr[i], 1e-7, "order-free at a fixed ridge");
        }
    }

    @Test
    void squaredTermsCaptureACurvedBoundary() {
        // "ring" in the middle band 0.3 < x0 < 0.7, "dot" outside (invented): linear features cannot
        // represent it, centred squares can
        SplittableRandom rng = new SplittableRandom(61);
        List<DesignPoint> x = new ArrayList<>();
        List<String> labels = new ArrayList<>();
        for (int i = 0; i < 200; i++) {
            DesignPoint p = new DesignPoint(new double[] {rng.nextDouble()}, new int[0]);
            x.add(p);
            labels.add(p.x(0) > 0.3 && p.x(0) < 0.7 ? "ring" : "dot");
        }
        List<String> two = List.of("dot", "ring");
        ClassModel lin = ClassModel.fit(x, labels, two, null, 1L);
        ClassModel sq = ClassModel.fit(x, labels, two, null, 1L, ClassModelSettings.defaults().withSquaredTerms(true));
        List<DesignPoint> centre = List.of(new DesignPoint(new double[] {0.5}, new int[0]));
        assertTrue(sq.predict(centre, null)[0][1] > 0.8, "ring at the centre with squares");
        assertTrue(lin.predict(centre, null)[0][1] < sq.predict(centre, null)[0][1], "the linear model cannot bend");
    }

    @Test
    void badInputsAreRefused() {
        DesignPoint p = new DesignPoint(new double[] {0.5}, new int[0]);
        assertThrows(IllegalArgumentException.class, () -> ClassModel.fit(List.of(p), List.of("cube"), CLASSES, null, 1L));
        assertThrows(IllegalArgumentException.class, () -> ClassModel.fit(List.of(p), List.of(), CLASSES, null, 1L));
        assertThrows(IllegalArgumentException.class, () -> ClassModel.fit(List.of(p), List.of("dot"), List.of("dot", "dot"), null, 1L));
        assertThrows(IllegalArgumentException.class,
                () -> ClassModel.fit(List.of(p), List.of("dot"), CLASSES, new double[][] {{1, 0, Double.NaN, 0}}, 1L));
        ClassModel m = ClassModel.fit(List.of(p), List.of("dot"), CLASSES, null, 1L);
        assertThrows(IllegalArgumentException.class,
                () -> m.predict(List.of(new DesignPoint(new double[] {0.5, 0.5}, new int[0])), null));
        double[][] one = m.predict(List.of(p), null);
        assertTrue(one[0][0] > 0.25 && one[0][0] < 1, "one dot nudges dot up: " + one[0][0]);
    }

    private static double[] log(double[] p) {
        double[] out = new double[p.length];
        for (int c = 0; c < p.length; c++) {
            out[c] = p[c] > 0 ? Math.log(p[c]) : Double.NEGATIVE_INFINITY;
        }
        return out;
    }
}
