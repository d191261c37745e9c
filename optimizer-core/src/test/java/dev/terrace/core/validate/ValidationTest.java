package dev.terrace.core.validate;

import dev.terrace.core.TestGrowthModel;
import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.CampaignReader;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.runlog.RunLog;
import dev.terrace.core.runlog.RunLogReader;
import dev.terrace.spi.Conditions;
import dev.terrace.spi.ModelParameter;
import dev.terrace.spi.ParameterValues;
import dev.terrace.spi.Prediction;
import dev.terrace.spi.Role;
import dev.terrace.spi.Surface;
import dev.terrace.spi.Validity;
import org.apache.commons.math3.distribution.BinomialDistribution;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.linear.RealMatrix;
import org.apache.commons.math3.stat.descriptive.moment.StandardDeviation;
import org.apache.commons.math3.stat.regression.OLSMultipleLinearRegression;
import org.junit.jupiter.api.Test;

import java.io.StringReader;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ValidationTest {

    /** Noise sd of the synthetic line data (nm). */
    static final double NOISE_SD = 0.5;

    /** size = a + b * T (T in K): a straight line, so the physics fit is ordinary least squares. */
    static final class LineModel extends TestGrowthModel {
        LineModel() {
            super("line-test", "straight line for validation tests", Role.SUBSTRATE_TEMPERATURE, Role.ISLAND_DIAMETER);
        }

        @Override
        public List<ModelParameter> parameters() {
            return List.of(
                    ModelParameter.continuous("intercept", "nm", 0, -1000, 1000, false, "test", "a"),
                    ModelParameter.continuous("slope", "nm/K", 0.1, -10, 10, false, "test", "b"));
        }

        @Override
        public Prediction predict(Conditions c, Surface s, ParameterValues p) {
            double t = c.value(Role.SUBSTRATE_TEMPERATURE).orElse(Double.NaN);
            return new Prediction(Map.of(Role.ISLAND_DIAMETER, p.get("intercept") + p.get("slope") * t), Map.of(),
                    Validity.ok(), List.of());
        }
    }

    /** Fixed class probabilities whatever the recipe: a classifier whose log loss is known in advance. */
    static final class FixedShapeModel extends TestGrowthModel {
        static final Map<String, Double> P = Map.of("dot", 0.7, "ring", 0.2, "disk", 0.1);

        FixedShapeModel() {
            super("fixed-shape-test", "constant class probabilities for validation tests", Role.SUBSTRATE_TEMPERATURE, Role.MORPHOLOGY);
        }

        @Override
        public Prediction predict(Conditions c, Surface s, ParameterValues p) {
            return new Prediction(Map.of(), Map.of(Role.MORPHOLOGY, P), Validity.ok(), List.of());
        }
    }

    static String campaign(String models) {
        return String.join("\n",
                "campaign: line",
                "material: {substrate: GaAs}",
                "parameters:",
                "  temp: {unit: degC, min: 100, max: 700, role: substrate_temperature}",
                "outcomes:",
                "  size: {unit: nm, role: island_diameter}",
                "  shape: {classes: [dot, ring, disk], role: morphology}",
                "models: " + models,
                "");
    }

    static LoadedCampaign load(String models, String csv) throws Exception {
        Path file = Path.of("/virtual/campaign.yaml");
        Campaign c = CampaignReader.parse(file, new StringReader(campaign(models)), null).campaign();
        RunLog log = RunLogReader.read(c, c.runs(), new StringReader(csv));
        return new LoadedCampaign(c, log, List.of());
    }

    static PluginRegistry registry() {
        return PluginRegistry.builder().autoDiscovery(false).add(new LineModel()).add(new FixedShapeModel()).build();
    }

    /**
     * Runs on a line size = -15 nm + slope * T(K) plus N(0, 0.5²) noise, temperatures spread over the
     * box. With slope 0.05 the sizes run from 6 to 31 nm, so the predictive-sd floor (1 % of the mean
     * size, about 0.2 nm) stays well below the noise.
     */
    static String lineRuns(int n, double slope, long seed) {
        return lineRuns(n, -15, slope, seed);
    }

    /** Runs on size = intercept + slope * T(K) plus N(0, 0.5²) noise. */
    static String lineRuns(int n, double intercept, double slope, long seed) {
        Random r = new Random(seed);
        StringBuilder csv = new StringBuilder("run_id,temp,size,status\n");
        for (int i = 0; i < n; i++) {
            double tC = 150 + 500.0 * i / (n - 1);
            double size = intercept + slope * (tC + 273.15) + r.nextGaussian() * NOISE_SD;
            csv.append(String.format(Locale.ROOT, "R%03d,%.2f,%.4f,ok%n", i, tC, size));
        }
        return csv.toString();
    }

    @Test
    void physicsLooErrorOfAnExactLineMatchesTheNoiseAndItsIntervalsCoverNinetyPercent() throws Exception {
        int n = 200;
        LoadedCampaign lc = load("[line-test]", lineRuns(n, 0.05, 21));
        ValidationReport rep = Validation.run(lc, registry(), 3, Set.of(Validation.PHYSICS));
        Score s = rep.outcome("size").orElseThrow().score(Validation.PHYSICS).orElseThrow();
        assertEquals(n, s.n());
        // Known answer: a LOO residual of OLS has variance sigma^2/(1 - h_ii), on average about
        // sigma^2 (1 + p/n) with p = 2, so the LOO RMSE estimates 0.5 * sqrt(1.01) = 0.5025. The sd of
        // an RMSE from n Gaussian residuals is about sigma / sqrt(2n) = 0.025 (large-sample result,
        // from memory): 4 sd = 0.1 nm.
        assertEquals(NOISE_SD * Math.sqrt(1 + 2.0 / n), s.rmse(), 4 * NOISE_SD / Math.sqrt(2.0 * n));
        // Coverage of true 90 % intervals over n held-out runs is Binomial(n, 0.9)/n with sd
        // sqrt(0.09/n) = 0.021; 4 sd = 0.085 (the constant-sd interval ignores the leverage, which
        // at p/n = 1 % shifts the coverage by well under 1 %).
        assertEquals(0.9, s.coverage90(), 4 * Math.sqrt(0.09 / n));
        // MSLL of a Gaussian predictor with sd sigma against the training Gaussian with sd s_y is
        // about ln(sigma / s_y) (the squared-z terms average 1/2 in both); the z-terms' average has
        // an sd near 1/sqrt(n) = 0.07, so 0.3 is over 4 sd.
        double sy = new StandardDeviation().evaluate(sizes(lc));
        assertTrue(s.msll() < 0, "a good model beats the trivial Gaussian: MSLL " + s.msll());
        assertEquals(Math.log(NOISE_SD / sy), s.msll(), 0.3);
        Score mean = rep.outcome("size").orElseThrow().score(Validation.MEAN).orElseThrow();
        assertEquals(0.0, mean.msll(), 1e-12, "the trivial predictor is the MSLL reference, by definition");
        assertTrue(rep.verdict().stream().anyMatch(v -> v.startsWith("physics predicts size best")), rep.verdict().toString());
    }

    @Test
    void aLineFittedToPureNoiseScoresAnMsllNearZeroAndTheVerdictSaysItIsNoBetterThanTheMean() throws Exception {
        int n = 60;
        LoadedCampaign lc = load("[line-test]", lineRuns(n, 20, 0.0, 5));
        ValidationReport rep = Validation.run(lc, registry(), 3, Set.of(Validation.PHYSICS));
        OutcomeValidation ov = rep.outcome("size").orElseThrow();
        Score ph = ov.score(Validation.PHYSICS).orElseThrow();
        // With no trend the fitted line is the mean plus a slope of noise: its predictive density is
        // the trivial Gaussian's up to O(p/n) = 3 %, so the MSLL is within a few hundredths of 0.
        assertEquals(0.0, ph.msll(), 0.05);
        Score mean = ov.score(Validation.MEAN).orElseThrow();
        assertTrue(ph.rmse() >= 0.95 * mean.rmse(), ph + " vs " + mean);
        assertTrue(rep.verdict().contains("size is predicted no better than its mean (RMSE " + ValidationVerdict.fmt(ph.rmse())
                + " vs " + ValidationVerdict.fmt(mean.rmse()) + " nm for the training mean)"), rep.verdict().toString());
    }

    @Test
    void physicsLooResidualsEqualThePressResidualsOfOrdinaryLeastSquares() throws Exception {
        int n = 15;
        LoadedCampaign lc = load("[line-test]", lineRuns(n, 0.05, 8));
        ValidationReport rep = Validation.run(lc, registry(), 1, Set.of(Validation.PHYSICS));
        List<ParityPoint> pts = rep.outcome("size").orElseThrow().parity(Validation.PHYSICS);
        assertEquals(n, pts.size());
        // Reference library: Commons Math OLS on the same values (T in K, as the model sees them).
        double[] y = sizes(lc);
        double[][] x = new double[n][1];
        for (int i = 0; i < n; i++) {
            x[i][0] = lc.runLog().runs().get(i).number("temp").getAsDouble() + 273.15;
        }
        OLSMultipleLinearRegression ols = new OLSMultipleLinearRegression();
        ols.newSampleData(y, x);
        double[] e = ols.estimateResiduals();
        RealMatrix h = ols.calculateHat();
        double sse = 0;
        for (double v : e) {
            sse += v * v;
        }
        for (int i = 0; i < n; i++) {
            ParityPoint p = pts.get(i);
            assertEquals("R" + String.format(Locale.ROOT, "%03d", i), p.runId());
            double press = e[i] / (1 - h.getEntry(i, i));
            // PRESS residual e_i / (1 - h_ii) (Allen, Technometrics 16, 125 (1974), from memory);
            // 1e-4 nm is the fitter's convergence on this line (ModelFitterTest reproduces OLS to 1e-6 in slope)
            assertEquals(press, p.measured() - p.predicted(), 1e-4, "run " + p.runId());
            // the constant sd is the residual standard error of the fold: SSE_(i) = SSE - e_i^2/(1 - h_ii)
            // (the deletion identity of regression diagnostics, from memory), with n - 1 - 2 degrees of freedom
            double sdFold = Math.sqrt((sse - e[i] * press) / (n - 1 - 2));
            assertEquals(Validation.Z90 * sdFold, p.hi90() - p.predicted(), 1e-4, "run " + p.runId());
            assertEquals(Validation.Z90 * sdFold, p.predicted() - p.lo90(), 1e-4, "run " + p.runId());
        }
    }

    @Test
    void aClassifierWithKnownProbabilitiesGivesTheExpectedLogLossAndAccuracy() throws Exception {
        StringBuilder csv = new StringBuilder("run_id,temp,shape\n");
        String[] shapes = {"dot", "dot", "ring", "dot", "dot", "disk", "dot", "ring", "dot", "dot"};
        for (int i = 0; i < shapes.length; i++) {
            csv.append("S").append(i).append(',').append(150 + 50 * i).append(',').append(shapes[i]).append('\n');
        }
        ValidationReport rep = Validation.run(load("[fixed-shape-test]", csv.toString()), registry(), 2,
                Set.of(Validation.PHYSICS));
        OutcomeValidation ov = rep.outcome("shape").orElseThrow();
        assertEquals("class", ov.scale());
        assertTrue(ov.parity().isEmpty());
        Score ph = ov.score(Validation.PHYSICS).orElseThrow();
        // hand computation: 7 dots at p 0.7, 2 rings at 0.2, 1 disk at 0.1
        double expected = (7 * -Math.log(0.7) + 2 * -Math.log(0.2) - Math.log(0.1)) / 10;
        assertEquals(expected, ph.logLoss(), 1e-9);
        assertEquals(0.7, ph.accuracy(), 1e-12);
        assertTrue(ph.rmseIfAny().isEmpty() && ph.msllIfAny().isEmpty() && ph.coverage90IfAny().isEmpty());
        // trivial predictor: Laplace's rule of succession on the 9 other runs and 3 classes (hand
        // computation): a held-out dot gets (6+1)/12, a ring (1+1)/12, the disk (0+1)/12
        Score mean = ov.score(Validation.MEAN).orElseThrow();
        double expectedMean = (7 * Math.log(12.0 / 7) + 2 * Math.log(6) + Math.log(12)) / 10;
        assertEquals(expectedMean, mean.logLoss(), 1e-12);
        assertEquals(0.7, mean.accuracy(), 1e-12, "the most common class of the other runs is always dot");
        assertTrue(rep.verdict().stream().anyMatch(v -> v.startsWith("physics predicts shape best: log loss")),
                rep.verdict().toString());
    }

    @Test
    void allThreeSurrogatesAreScoredAndFailedRunsStayInTraining() throws Exception {
        String csv = lineRuns(20, 0.05, 4) + "F1,400,,failed\n";
        LoadedCampaign lc = load("[line-test]", csv);
        ValidationReport rep = Validation.run(lc, registry(), 7);
        OutcomeValidation ov = rep.outcome("size").orElseThrow();
        assertEquals(List.of("physics", "gp", "physics+gp", "mean"), List.copyOf(ov.bySurrogate().keySet()));
        for (String s : Validation.SURROGATES) {
            Score sc = ov.score(s).orElseThrow();
            assertEquals(20, sc.n(), s);
            assertEquals(20, ov.parity(s).size(), s);
            // the line's spread (about 7.5 nm) dwarfs the noise (0.5 nm): every surrogate must beat
            // the trivial Gaussian by a wide margin
            assertTrue(sc.msll() < -1, s + " MSLL " + sc.msll());
            assertTrue(sc.rmse() < 0.5 * ov.score(Validation.MEAN).orElseThrow().rmse(), s + " " + sc);
        }
        assertTrue(ov.parity().stream().noneMatch(p -> p.runId().equals("F1")));
        assertFalse(rep.outcome("shape").isPresent(), "shape was never measured");
        assertTrue(rep.verdict().get(0).contains("held out 20 runs"), rep.verdict().get(0));
        assertTrue(rep.verdict().get(0).contains("1 failed run stayed in training"), rep.verdict().get(0));
        assertTrue(rep.verdict().contains("shape was measured on 0 ok runs (needs 3): not validated"),
                rep.verdict().toString());
        assertTrue(rep.verdict().stream().anyMatch(v -> v.startsWith("the physics prior")), rep.verdict().toString());
        assertTrue(rep.verdict().stream().anyMatch(v -> v.startsWith("90 % intervals of ")), rep.verdict().toString());
    }

    @Test
    void withoutModelsPhysicsIsNotAvailableAndPhysicsPlusGpIsTheGp() throws Exception {
        LoadedCampaign lc = load("[]", lineRuns(8, 0.05, 9));
        ValidationReport rep = Validation.run(lc, registry(), 7);
        OutcomeValidation ov = rep.outcome("size").orElseThrow();
        assertTrue(ov.score(Validation.PHYSICS).isEmpty());
        assertEquals(ov.score(Validation.GP), ov.score(Validation.PHYSICS_GP));
        assertTrue(ov.parity(Validation.PHYSICS).isEmpty());
        assertTrue(rep.verdict().stream().anyMatch(v -> v.contains("lists no growth models")), rep.verdict().toString());
    }

    @Test
    void tooFewRunsGiveAnEmptyReportThatSaysWhy() throws Exception {
        LoadedCampaign lc = load("[line-test]", "run_id,temp,size,status\nA,200,30,ok\nB,300,35,ok\nC,400,,failed\n");
        assertEquals(2, Validation.usableRuns(lc));
        ValidationReport rep = Validation.run(lc, registry(), 1);
        assertTrue(rep.outcomes().isEmpty());
        assertTrue(rep.verdict().get(0).contains("only 2 ok runs"), rep.verdict().toString());
    }

    @Test
    void sameSeedGivesTheSameReport() throws Exception {
        LoadedCampaign lc = load("[line-test]", lineRuns(8, 0.05, 2));
        assertEquals(Validation.run(lc, registry(), 5), Validation.run(lc, registry(), 5));
    }

    @Test
    void intervalHalfWidthAndCoverageReadingFollowTheReferenceDistributions() {
        // reference library: Commons Math normal quantile and binomial distribution function
        assertEquals(new NormalDistribution(null, 0, 1).inverseCumulativeProbability(0.95), Validation.Z90, 1e-12);
        BinomialDistribution bin = new BinomialDistribution(null, 13, 0.9);
        for (int k = 0; k <= 13; k++) {
            assertEquals(bin.cumulativeProbability(k), ValidationVerdict.binomialCdf(k, 13, 0.9), 1e-12, "k=" + k);
        }
        // 12 of 13 is what 90 % intervals should give; 8 of 13 is too narrow (P(X <= 8) = 0.009)
        assertEquals("90 % intervals of gp cover 12 of 13 held-out runs",
                ValidationVerdict.coverage("gp", Score.numeric(13, 0.1, 12 / 13.0, -1)));
        assertTrue(ValidationVerdict.coverage("gp", Score.numeric(13, 0.1, 8 / 13.0, -1)).contains("too narrow"));
    }

    @Test
    void proposalCoverageReadingNamesCountsAndTheOneSidedBinomialTails() {
        // reference library: Commons Math binomial distribution (tails of Binomial(n, 0.9))
        BinomialDistribution b13 = new BinomialDistribution(null, 13, 0.9);
        String low = ValidationVerdict.coverageReading(Score.numeric(13, 0.1, 8 / 13.0, -1));
        assertTrue(low.startsWith("90 % intervals cover 8 of 13 held-out runs (implausibly low for 13 runs"), low);
        assertTrue(low.contains("P(X <= 8) = " + ValidationVerdict.fmt(b13.cumulativeProbability(8))), low);
        String ok = ValidationVerdict.coverageReading(Score.numeric(13, 0.1, 11 / 13.0, -1));
        assertEquals("90 % intervals cover 11 of 13 held-out runs (plausible for 13 runs by a one-sided binomial"
                + " check)", ok);
        // 40 of 40: P(X >= 40) = 0.9^40 = 0.0148 < 0.05, too many inside for honest 90 % intervals
        BinomialDistribution b40 = new BinomialDistribution(null, 40, 0.9);
        String high = ValidationVerdict.coverageReading(Score.numeric(40, 0.1, 1.0, -1));
        assertTrue(high.contains("implausibly high for 40 runs"), high);
        assertTrue(high.contains("P(X >= 40) = " + ValidationVerdict.fmt(1 - b40.cumulativeProbability(39))), high);
    }

    @Test
    void scoresRejectMetricsOfTheWrongKindOrOutOfRange() {
        assertThrows(IllegalArgumentException.class, () -> new Score(3, 0.1, 0.9, -1, 0.5, Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> Score.numeric(3, Double.POSITIVE_INFINITY, 0.9, -1));
        assertThrows(IllegalArgumentException.class, () -> Score.numeric(3, 0.1, 1.2, -1));
        assertThrows(IllegalArgumentException.class, () -> Score.classes(0, 0.5, 0.5));
        assertThrows(IllegalArgumentException.class, () -> new ParityPoint("gp", "A", 1, 2, 2.5, 3));
        assertThrows(IllegalArgumentException.class, () -> new OutcomeValidation("size", "class",
                Map.of("gp", Score.numeric(3, 0.1, 0.9, -1)), List.of()));
    }

    @Test
    void verdictPhrasesReadTheRatioInPlainWords() {
        assertEquals("halves the error on x", ValidationVerdict.reduction(2.08, "the error on x"));
        assertEquals("cuts the error on x by 25 %", ValidationVerdict.reduction(4.0 / 3, "the error on x"));
        assertEquals("cuts the error on x to a third", ValidationVerdict.reduction(3.0, "the error on x"));
        assertEquals("cuts the error on x by a factor of 4.76", ValidationVerdict.reduction(4.76, "the error on x"));
    }

    static double[] sizes(LoadedCampaign lc) {
        return lc.runLog().runs().stream().filter(r -> r.number("size").isPresent())
                .mapToDouble(r -> r.number("size").getAsDouble()).toArray();
    }
}
