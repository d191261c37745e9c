package dev.terrace.core.propose;

import dev.terrace.core.TestGrowthModel;
import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.CampaignReader;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.runlog.RunLog;
import dev.terrace.core.runlog.RunLogReader;
import dev.terrace.core.space.DesignPoint;
import dev.terrace.spi.Conditions;
import dev.terrace.spi.ModelParameter;
import dev.terrace.spi.ParameterValues;
import dev.terrace.spi.Prediction;
import dev.terrace.spi.Role;
import dev.terrace.spi.Surface;
import dev.terrace.spi.Validity;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.junit.jupiter.api.Test;

import java.io.StringReader;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * A censored run ({@code <X} or {@code >X}) must hold the surrogate on its side of the bound at its
 * own recipe, even where the fitted growth model alone predicts far beyond it. Invented scenario: an
 * island density that a test model takes as one fitted constant (about 1e9 cm^-2), twelve measured
 * runs scattering around it by 10 %, and one run at the hot end where no dots were seen above the
 * detection limit (or, mirrored, more than the counting range).
 *
 * <p>Probabilities are evaluated with Apache Commons Math's {@link NormalDistribution}, independently
 * of Terrace's own normal distribution function.
 */
class CensoredSurrogateTest {

    /** density = 10^level, a constant: the physics prior knows nothing of the hot end. */
    static final class FlatDensityModel extends TestGrowthModel {
        FlatDensityModel() {
            super("flat-density-test", "constant island density for censoring tests", Role.SUBSTRATE_TEMPERATURE, Role.ISLAND_DENSITY);
        }

        @Override
        public List<ModelParameter> parameters() {
            return List.of(ModelParameter.continuous("level", "", 9, 5, 13, false, "test", "log10 density"));
        }

        @Override
        public Prediction predict(Conditions c, Surface s, ParameterValues p) {
            return new Prediction(Map.of(Role.ISLAND_DENSITY, Math.pow(10, p.get("level"))), Map.of(),
                    Validity.ok(), List.of());
        }
    }

    static final String CAMPAIGN = String.join("\n",
            "campaign: censored-test",
            "material: {substrate: GaAs}",
            "parameters:",
            "  temp: {unit: degC, min: 200, max: 600, role: substrate_temperature}",
            "outcomes:",
            "  density: {unit: cm^-2, scale: log, role: island_density}",
            "models: [flat-density-test]",
            "");

    /** Twelve measured runs at 200-530 degC around 1e9 cm^-2 (a fixed +-10 % pattern), then the hot run. */
    static LoadedCampaign campaign(String hotCell) throws Exception {
        StringBuilder csv = new StringBuilder("run_id,temp,density,status\n");
        double[] wiggle = {1.05, 0.92, 1.1, 0.97, 1.02, 0.9, 1.08, 0.95, 1.0, 1.07, 0.93, 1.01};
        for (int i = 0; i < wiggle.length; i++) {
            csv.append(String.format(Locale.ROOT, "R%02d,%.0f,%.3e,ok%n", i, 200 + 30.0 * i, 1e9 * wiggle[i]));
        }
        csv.append("HOT,590,").append(hotCell).append(",ok\n");
        Campaign c = CampaignReader.parse(Path.of("/virtual/campaign.yaml"), new StringReader(CAMPAIGN), null).campaign();
        RunLog log = RunLogReader.read(c, c.runs(), new StringReader(csv.toString()));
        return new LoadedCampaign(c, log, List.of());
    }

    static PluginRegistry registry() {
        return PluginRegistry.builder().autoDiscovery(false).add(new FlatDensityModel()).build();
    }

    /** P(a new measurement at the hot run's recipe is below 10^log10Bound). */
    static double probabilityBelow(CampaignSurrogate sur, double log10Bound) {
        DesignPoint hot = sur.runPoints().get(sur.runPoints().size() - 1);
        assertEquals("HOT", sur.runs().get(sur.runs().size() - 1).runId());
        CampaignSurrogate.Evaluation e = sur.evaluate(List.of(hot));
        double mu = e.mean().get("density")[0];
        double sd = Math.hypot(e.sdLatent().get("density")[0], e.noiseSd().get("density"));
        return new NormalDistribution(mu, sd).cumulativeProbability(log10Bound);
    }

    @Test
    void belowBoundHoldsTheSurrogateBelowItAtTheRunsRecipe() throws Exception {
        // premise: with the cell left empty the physics and the measured runs put the hot end near 1e9,
        // so a value below 1e7 is all but impossible there
        CampaignSurrogate blank = CampaignSurrogate.build(campaign(""), registry(), true, 3);
        assertTrue(probabilityBelow(blank, 7) < 0.01, "premise: physics alone predicts well above 1e7");
        CampaignSurrogate sur = CampaignSurrogate.build(campaign("<1e7"), registry(), true, 3);
        double p = probabilityBelow(sur, 7);
        assertTrue(p >= 0.5, "P(density < 1e7) at the '<1e7' run = " + p);
        assertTrue(sur.notes().stream().anyMatch(n -> n.contains("1 censored value")), sur.notes().toString());
        // far from the hot run the measured runs still rule: the prediction at 200 degC stays near 1e9
        double cold = sur.evaluate(List.of(sur.runPoints().get(0))).mean().get("density")[0];
        assertEquals(9, cold, 0.15, "log10 density at the coldest run");
    }

    @Test
    void aboveBoundHoldsTheSurrogateAboveItAtTheRunsRecipe() throws Exception {
        CampaignSurrogate blank = CampaignSurrogate.build(campaign(""), registry(), true, 3);
        assertTrue(1 - probabilityBelow(blank, 11) < 0.01, "premise: physics alone predicts well below 1e11");
        CampaignSurrogate sur = CampaignSurrogate.build(campaign(">1e11"), registry(), true, 3);
        double p = 1 - probabilityBelow(sur, 11);
        assertTrue(p >= 0.5, "P(density > 1e11) at the '>1e11' run = " + p);
    }

    @Test
    void boundTheRunsAlreadyMakeCertainChangesNothing() throws Exception {
        // '<1e12' at a recipe predicted near 1e9 says nothing new: the prediction there must not move
        CampaignSurrogate blank = CampaignSurrogate.build(campaign(""), registry(), true, 3);
        CampaignSurrogate sur = CampaignSurrogate.build(campaign("<1e12"), registry(), true, 3);
        DesignPoint hot = sur.runPoints().get(sur.runPoints().size() - 1);
        double a = blank.evaluate(List.of(hot)).mean().get("density")[0];
        double b = sur.evaluate(List.of(hot)).mean().get("density")[0];
        assertEquals(a, b, 1e-3);
    }
}
