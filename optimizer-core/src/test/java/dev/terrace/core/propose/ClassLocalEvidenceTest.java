package dev.terrace.core.propose;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.CampaignReader;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.propose.Proposals.Proposal;
import dev.terrace.core.propose.Proposals.ProposalSet;
import dev.terrace.core.runlog.RunLog;
import dev.terrace.core.runlog.RunLogReader;
import dev.terrace.core.space.DesignPoint;
import dev.terrace.core.space.DesignSpace;
import dev.terrace.spi.Conditions;
import dev.terrace.spi.GrowthModel;
import dev.terrace.spi.ModelParameter;
import dev.terrace.spi.ParameterValues;
import dev.terrace.spi.Prediction;
import dev.terrace.spi.Role;
import dev.terrace.spi.Surface;
import dev.terrace.spi.Validity;
import org.junit.jupiter.api.Test;

import java.io.StringReader;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Set;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * A class outcome learns from each labelled run, also from a class seen once. Invented scenario: a
 * test model says dots are likeliest in the middle of the temperature range (95 % at 400 degC);
 * eight runs at 200-275 and 525-600 degC gave dots, and one run at 400 degC, the recipe the model
 * likes best, gave clusters. A logistic trend in temperature cannot single out the middle, so
 * without local evidence the clusters run would be outvoted there.
 */
class ClassLocalEvidenceTest {

    /** P(dots) = 0.5 + 0.45 * tilt at 400 degC, falling linearly to 0.5 at 200 and 600 degC. */
    static final class MidDotsModel implements GrowthModel {
        @Override
        public String id() {
            return "mid-dots-test";
        }

        @Override
        public String description() {
            return "dots likeliest mid-range, for class tests";
        }

        @Override
        public Set<Role> requiredInputs() {
            return Set.of(Role.SUBSTRATE_TEMPERATURE);
        }

        @Override
        public Set<Role> predictedOutcomes() {
            return Set.of(Role.MORPHOLOGY);
        }

        @Override
        public List<String> classes(Role role) {
            return List.of("dots", "clusters");
        }

        @Override
        public List<ModelParameter> parameters() {
            return List.of(ModelParameter.continuous("tilt", "", 1, 0.5, 1, false, "test", "slope of P(dots)"));
        }

        @Override
        public Prediction predict(Conditions c, Surface s, ParameterValues p) {
            double u = (c.value(Role.SUBSTRATE_TEMPERATURE).orElse(Double.NaN) - 473.15) / 400;
            double dots = Math.min(0.99, Math.max(0.01, 0.5 + 0.45 * p.get("tilt") * (1 - 2 * Math.abs(u - 0.5))));
            return new Prediction(Map.of(), Map.of(Role.MORPHOLOGY, Map.of("dots", dots, "clusters", 1 - dots)),
                    Validity.ok(), List.of());
        }
    }

    static final String CAMPAIGN = String.join("\n",
            "campaign: class-local-test",
            "material: {substrate: GaAs}",
            "parameters:",
            "  temp: {unit: degC, min: 200, max: 600, role: substrate_temperature}",
            "outcomes:",
            "  shape: {classes: [dots, clusters], role: morphology}",
            "targets:",
            "  shape: {is: dots}",
            "models: [mid-dots-test]",
            "");

    static LoadedCampaign campaign() throws Exception {
        StringBuilder csv = new StringBuilder("run_id,temp,shape,status\n");
        for (int t : new int[] {200, 225, 250, 275, 525, 550, 575, 600}) {
            csv.append("D").append(t).append(',').append(t).append(",dots,ok\n");
        }
        csv.append("MID,400,clusters,ok\n");
        Campaign c = CampaignReader.parse(Path.of("/virtual/campaign.yaml"), new StringReader(CAMPAIGN), null).campaign();
        RunLog log = RunLogReader.read(c, c.runs(), new StringReader(csv.toString()));
        return new LoadedCampaign(c, log, List.of());
    }

    static PluginRegistry registry() {
        return PluginRegistry.builder().autoDiscovery(false).add(new MidDotsModel()).build();
    }

    @Test
    void aClassSeenOnceIsTheMostLikelyAtItsRunAndTheTopProposalAvoidsIt() throws Exception {
        CampaignSurrogate sur = CampaignSurrogate.build(campaign(), registry(), true, 5);
        DesignPoint mid = sur.runPoints().get(sur.runPoints().size() - 1);
        assertEquals("MID", sur.runs().get(sur.runs().size() - 1).runId());
        double[] p = sur.evaluate(List.of(mid)).classProbs().get("shape")[0];
        assertTrue(p[1] > p[0], "P(clusters) " + p[1] + " vs P(dots) " + p[0] + " at the clusters run");
        // every dots run keeps dots as its most likely class
        for (int i = 0; i < 8; i++) {
            double[] q = sur.evaluate(List.of(sur.runPoints().get(i))).classProbs().get("shape")[0];
            assertTrue(q[0] > q[1], "dots run " + i);
        }
        ProposalSet set = Proposer.propose(sur, ProposeSettings.defaults().withBatch(1).withSeed(5).withExplore(0)
                .withSearch(ProposerPropertyTest.SMALL));
        Proposal top = set.proposals().get(0);
        double t = (Double) top.recipe().get("temp");
        DesignPoint tp = sur.space().encode(Map.of("temp", t), Map.of());
        assertTrue(DesignSpace.distance(tp, mid) >= Proposer.MIN_BATCH_SEPARATION,
                "top proposal at " + t + " degC sits on the clusters run");
        assertTrue(top.classes().get("shape").get("dots") > 0.5, "top proposal P(dots)");
    }
}
