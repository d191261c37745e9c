package dev.terrace.models;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.CampaignReader;
import dev.terrace.core.fit.FitResults.Estimate;
import dev.terrace.core.fit.FitResults.ModelFit;
import dev.terrace.core.fit.ModelFitter;
import dev.terrace.core.model.RecipeConverter;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.runlog.RunLog;
import dev.terrace.core.runlog.RunLogReader;
import dev.terrace.spi.Conditions;
import dev.terrace.spi.ParameterValues;
import dev.terrace.spi.Prediction;
import dev.terrace.spi.Role;
import org.junit.jupiter.api.Test;

import java.io.StringReader;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * InAs/GaAs SK series generated from a known critical thickness with realistic scatter (invented data) are
 * fitted back; the 95 % interval of the critical thickness must cover the truth in at least 85 % of 40 seeds.
 * Runs below the onset are written either as censored density cells ({@code <1e8}, below an AFM detection
 * limit) or as the class {@code wetting-layer} with no density.
 */
class CriticalThicknessRecoveryTest {

    /** An invented campaign; its boxes (470-530 degC, 0.02-0.2 ML/s, 1.2-2.6 ML) are a test design choice. */
    static final String CAMPAIGN = String.join("\n",
            "campaign: sk-recovery",
            "material: {substrate: GaAs, deposit: In, group_v: As}",
            "parameters:",
            "  t: {unit: degC, min: 470, max: 530, role: substrate_temperature}",
            "  rate: {unit: ML/s, min: 0.02, max: 0.2, scale: log, role: deposition_rate}",
            "  inas: {unit: ML, min: 1.2, max: 2.6, role: coverage}",
            "outcomes:",
            "  density: {unit: cm^-2, scale: log, role: island_density}",
            "  rheed: {classes: [wetting-layer, dots], role: growth_mode}",
            "models: [critical-thickness]",
            "");

    /** Invented truth (test design), inside the 1.45-1.7 ML of the published InAs/GaAs values. */
    static final double TRUE_CRITICAL = 1.68;
    /** Invented truth (test design). */
    static final double TRUE_BARRIER = 1.0;
    /** Detection limit of the invented AFM scans, 1e8 cm^-2 (test design; typical of AFM, common practice). */
    static final double DETECTION = 1e8;

    /** How runs below detection are written. */
    enum Below { CENSORED, CLASS_ONLY }

    static LoadedCampaign synthetic(long seed, int runs, Below below) throws Exception {
        Campaign c = CampaignReader.parse(Path.of("/virtual/c.yaml"), new StringReader(CAMPAIGN), null).campaign();
        CriticalThicknessModel m = new CriticalThicknessModel();
        ParameterValues truth = ParameterValues.defaults(m.parameters())
                .with(CriticalThicknessModel.CRITICAL_THICKNESS, TRUE_CRITICAL)
                .with(NucleationLaw.DIFFUSION_BARRIER, TRUE_BARRIER);
        Random r = new Random(seed);
        StringBuilder csv = new StringBuilder("run_id,t,rate,inas,density,rheed\n");
        for (int i = 0; i < runs; i++) {
            double t = 470 + 60 * r.nextDouble();
            double rate = 0.02 * Math.pow(10, r.nextDouble());
            // coverages spread evenly over the box with jitter, so every series brackets the onset (test design)
            double inas = 1.2 + 1.4 * (i + r.nextDouble()) / runs;
            Conditions cond = RecipeConverter.conditions(c, Map.of("t", t, "rate", rate, "inas", inas), Map.of());
            Prediction p = m.predict(cond, c.surface(), truth);
            // scatter 0.15 in ln(density): test design, the size of the virtual chamber's invented scatter
            double n = p.value(Role.ISLAND_DENSITY).orElseThrow() * Math.exp(0.15 * r.nextGaussian());
            double pDots = p.classProbabilities(Role.GROWTH_MODE).get(CriticalThicknessModel.DOTS);
            String cls = r.nextDouble() < pDots ? "dots" : "wetting-layer";
            String density;
            if (n >= DETECTION) {
                density = String.format(Locale.ROOT, "%.4e", n);
            } else {
                density = below == Below.CENSORED ? "<1e8" : "";
            }
            csv.append(String.format(Locale.ROOT, "S%02d,%.2f,%.5f,%.4f,%s,%s%n", i, t, rate, inas, density, cls));
        }
        RunLog log = RunLogReader.read(c, c.runs(), new StringReader(csv.toString()));
        return new LoadedCampaign(c, log, List.of());
    }

    static PluginRegistry registry() {
        return PluginRegistry.builder().autoDiscovery(false).add(new CriticalThicknessModel()).build();
    }

    static boolean covers(Estimate e, double truth) {
        return !e.held() && e.lo() <= truth && truth <= e.hi();
    }

    @Test
    void criticalThicknessIntervalCoversTheTruthInAtLeast85PercentOf40Seeds() throws Exception {
        int reps = 40; // 40 series of 16 runs, seeds 3000 + s, fitter seed s: test design choice
        int covered = 0;
        double widthSum = 0;
        for (int s = 0; s < reps; s++) {
            ModelFit f = ModelFitter.fit(synthetic(3000 + s, 16, Below.CENSORED), registry(), s).models().get(0);
            Estimate e = f.estimate(CriticalThicknessModel.CRITICAL_THICKNESS);
            if (covers(e, TRUE_CRITICAL)) {
                covered++;
            }
            widthSum += e.held() ? 0 : e.hi() - e.lo();
        }
        // nominal 95 %; below 85 % of 40 is implausible for honest intervals (binomial, derived here:
        // P(X <= 33 | n = 40, p = 0.95) = 0.004); 0.85: the brief's threshold
        assertTrue(covered >= 0.85 * reps, "critical thickness covered in " + covered + " of " + reps);
        // and not vacuous: the mean interval is narrower than 0.2 ML, enough to tell Patella et al.'s two
        // thresholds, 1.45 and 1.59 ML (arXiv cond-mat/0510353), from the common 1.7 ML (0.2: test design choice)
        assertTrue(widthSum / reps < 0.2, "mean interval width " + widthSum / reps);
    }

    @Test
    void classOnlyRunsBelowTheOnsetAlsoDetermineTheCriticalThickness() throws Exception {
        // seed 11 and fitter seed 3: test design choice
        LoadedCampaign lc = synthetic(11, 16, Below.CLASS_ONLY);
        ModelFit f = ModelFitter.fit(lc, registry(), 3).models().get(0);
        Estimate e = f.estimate(CriticalThicknessModel.CRITICAL_THICKNESS);
        assertFalse(e.held(), e.toString());
        assertTrue(covers(e, TRUE_CRITICAL), e.toString());
        assertTrue(f.excluded().isEmpty(), "runs with only a class were left out: " + f.excluded());
    }

    @Test
    void censoredCellsBelowTheOnsetEnterTheFit() throws Exception {
        LoadedCampaign lc = synthetic(12, 16, Below.CENSORED);
        long censored = lc.runLog().runs().stream().filter(r -> r.censored("density").isPresent()).count();
        assertTrue(censored >= 2, "the series has censored cells (" + censored + ")");
        ModelFit f = ModelFitter.fit(lc, registry(), 4).models().get(0);
        assertTrue(f.excluded().isEmpty(), "runs left out: " + f.excluded());
        assertTrue(covers(f.estimate(CriticalThicknessModel.CRITICAL_THICKNESS), TRUE_CRITICAL),
                f.estimate(CriticalThicknessModel.CRITICAL_THICKNESS).toString());
    }
}
