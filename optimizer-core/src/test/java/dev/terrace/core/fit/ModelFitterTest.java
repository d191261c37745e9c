package dev.terrace.core.fit;

import dev.terrace.core.TestGrowthModel;
import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.CampaignReader;
import dev.terrace.core.fit.FitResults.Estimate;
import dev.terrace.core.fit.FitResults.ModelFit;
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
import org.apache.commons.math3.stat.regression.SimpleRegression;
import org.junit.jupiter.api.Test;

import java.io.StringReader;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ModelFitterTest {

    /** size = a + b * T (T in K): a straight line, so the fit must reproduce ordinary least squares. */
    static final class LineModel extends TestGrowthModel {
        LineModel() {
            super("line-test", "straight line for fitter tests", Role.SUBSTRATE_TEMPERATURE, Role.ISLAND_DIAMETER);
        }

        @Override
        public List<ModelParameter> parameters() {
            return List.of(
                    ModelParameter.continuous("intercept", "nm", 0, -1000, 1000, false, "test", "a"),
                    ModelParameter.continuous("slope", "nm/K", 0.1, -10, 10, false, "test", "b"),
                    ModelParameter.continuous("unused", "", 1, 0, 2, false, "test", "has no effect"));
        }

        @Override
        public Prediction predict(Conditions c, Surface s, ParameterValues p) {
            double t = c.value(Role.SUBSTRATE_TEMPERATURE).orElse(Double.NaN);
            if (t > 900) {
                return Prediction.notApplicable("too hot for the line");
            }
            return new Prediction(Map.of(Role.ISLAND_DIAMETER, p.get("intercept") + p.get("slope") * t), Map.of(),
                    Validity.ok(), List.of());
        }
    }

    static final String CAMPAIGN = String.join("\n",
            "campaign: line",
            "material: {substrate: GaAs}",
            "parameters:",
            "  temp: {unit: degC, min: 100, max: 700, role: substrate_temperature}",
            "outcomes:",
            "  size: {unit: nm, role: island_diameter}",
            "models: [line-test]",
            "");

    static LoadedCampaign load(String csv) throws Exception {
        Path file = Path.of("/virtual/campaign.yaml");
        Campaign c = CampaignReader.parse(file, new StringReader(CAMPAIGN), null).campaign();
        RunLog log = RunLogReader.read(c, c.runs(), new StringReader(csv));
        return new LoadedCampaign(c, log, List.of());
    }

    static PluginRegistry registry() {
        return PluginRegistry.builder().autoDiscovery(false).add(new LineModel()).build();
    }

    @Test
    void straightLineFitReproducesOrdinaryLeastSquaresAndItsInterval() throws Exception {
        Random r = new Random(11);
        StringBuilder csv = new StringBuilder("run_id,temp,size\n");
        SimpleRegression ols = new SimpleRegression();
        for (int i = 0; i < 12; i++) {
            double tC = 150 + 40 * i;
            double size = 5 + 0.05 * (tC + 273.15) + r.nextGaussian() * 1.5;
            size = Math.round(size * 1000) / 1000.0;
            csv.append(String.format(Locale.ROOT, "R%02d,%.1f,%.3f%n", i, tC, size));
            ols.addData(tC + 273.15, size);
        }
        csv.append("HOT,750,80\n"); // outside the model's validity: excluded and listed
        ModelFit f = ModelFitter.fit(load(csv.toString()), registry(), 1).models().get(0);
        assertEquals(12, f.runsUsed());
        assertEquals("HOT", f.excluded().get(0).runId());
        assertEquals("too hot for the line", f.excluded().get(0).reason());
        Estimate b = f.estimate("slope");
        Estimate a = f.estimate("intercept");
        // reference library: Apache Commons Math SimpleRegression (OLS) estimates and 95 % intervals
        assertEquals(ols.getSlope(), b.value(), 1e-6);
        assertEquals(ols.getIntercept(), a.value(), 1e-3);
        double half = ols.getSlopeConfidenceInterval(0.05);
        assertEquals(ols.getSlope() - half, b.lo(), 1e-5);
        assertEquals(ols.getSlope() + half, b.hi(), 1e-5);
        assertTrue(f.estimate("unused").held());
        assertTrue(f.estimate("unused").reason().contains("do not depend"), f.estimate("unused").reason());
        assertEquals(12, f.residuals().size());
        double rmse = Math.sqrt(ols.getSumSquaredErrors() / 12);
        assertEquals(rmse, f.outcomes().get(0).rmse(), 1e-6);
        assertTrue(f.verdict().stream().anyMatch(v -> v.startsWith("slope 0.0") && v.endsWith("from 12 runs")),
                f.verdict().toString());
    }

    @Test
    void tooFewRunsHoldEveryParameterAndSaySo() throws Exception {
        ModelFit f = ModelFitter.fit(load("run_id,temp,size\nA,200,30\nB,300,35\n"), registry(), 1).models().get(0);
        assertFalse(f.fittedAnything());
        assertTrue(f.message().contains("only 2 usable runs"), f.message());
        assertTrue(f.estimates().stream().allMatch(Estimate::held));
        assertTrue(f.estimates().stream().allMatch(e -> e.reason().contains("too few runs")));
    }

    @Test
    void allRunsFailedGivesAClearMessage() throws Exception {
        var report = ModelFitter.fit(load("run_id,temp,size,status\nA,200,,failed\nB,300,,failed\nC,400,,failed\n"),
                registry(), 1);
        assertFalse(report.fittedAnything());
        assertEquals(3, report.failedRuns());
        assertTrue(report.models().get(0).message().contains("no usable run"), report.models().get(0).message());
    }

    @Test
    void smallSamplesUseTheBootstrapAndStayFinite() throws Exception {
        ModelFit f = ModelFitter.fit(load("run_id,temp,size\nA,200,30\nB,300,35\nC,400,41\nD,500,44\n"
                + "E,600,52\nF,620,53\n"), registry(), 3).models().get(0);
        Estimate b = f.estimate("slope");
        assertFalse(b.held());
        assertTrue(b.reason().contains("bootstrap"), b.reason());
        assertTrue(Double.isFinite(b.lo()) && Double.isFinite(b.hi()) && b.lo() <= b.value() && b.value() <= b.hi());
        // Reference library: Apache Commons Math SimpleRegression on the same six (T, size) pairs. The point
        // estimate is the least-squares slope; the bootstrap interval estimates the same sampling spread as the
        // t interval (Efron & Tibshirani, An Introduction to the Bootstrap, Chapman & Hall 1993, ch. 9), so its
        // half-width must agree with the OLS 95 % half-width within a factor of 2 (tolerance: test design
        // choice for n = 6, where the percentile interval is known to run narrow).
        SimpleRegression ols = new SimpleRegression();
        double[][] pts = {{200, 30}, {300, 35}, {400, 41}, {500, 44}, {600, 52}, {620, 53}};
        for (double[] pt : pts) {
            ols.addData(pt[0] + 273.15, pt[1]);
        }
        assertEquals(ols.getSlope(), b.value(), 1e-6, "least-squares slope");
        double olsHalf = ols.getSlopeConfidenceInterval(0.05);
        double half = (b.hi() - b.lo()) / 2;
        assertTrue(half > olsHalf / 2 && half < olsHalf * 2,
                "bootstrap half-width " + half + " against OLS t half-width " + olsHalf);
    }

    @Test
    void sameSeedGivesTheSameReport() throws Exception {
        String csv = "run_id,temp,size\nA,200,30\nB,300,35\nC,400,41\nD,500,44\n";
        ModelFit f1 = ModelFitter.fit(load(csv), registry(), 5).models().get(0);
        ModelFit f2 = ModelFitter.fit(load(csv), registry(), 5).models().get(0);
        assertEquals(f1.estimates(), f2.estimates());
    }
}
