package dev.terrace.core.propose;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.CampaignReader;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.runlog.RunLog;
import dev.terrace.core.runlog.RunLogReader;
import dev.terrace.core.space.DesignPoint;
import dev.terrace.core.surrogate.GpLeaveOneOut;
import org.apache.commons.math3.stat.descriptive.moment.StandardDeviation;
import org.junit.jupiter.api.Test;

import java.io.StringReader;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.function.IntToDoubleFunction;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * An outcome whose surrogate predicts no better than the mean under leave-one-out gets a predictive
 * spread no narrower than the measured values' own scatter; one it does predict keeps its model's
 * spread. Invented scenario without growth models: a size outcome over one temperature setting that
 * either alternates run to run (no skill possible) or follows a smooth line (skill). The reference
 * sample sd is computed with Apache Commons Math.
 */
class NoSkillWideningTest {

    static final String CAMPAIGN = String.join("\n",
            "campaign: skill-test",
            "material: {substrate: GaAs}",
            "parameters:",
            "  temp: {unit: degC, min: 200, max: 600}",
            "outcomes:",
            "  size: {unit: nm}",
            "targets:",
            "  size: {min: 20, max: 30}",
            "");

    static LoadedCampaign campaign(IntToDoubleFunction size) throws Exception {
        StringBuilder csv = new StringBuilder("run_id,temp,size,status\n");
        for (int i = 0; i < 12; i++) {
            csv.append(String.format(Locale.ROOT, "R%02d,%.0f,%.3f,ok%n", i, 200 + 400.0 * i / 11, size.applyAsDouble(i)));
        }
        Campaign c = CampaignReader.parse(Path.of("/virtual/campaign.yaml"), new StringReader(CAMPAIGN), null).campaign();
        RunLog log = RunLogReader.read(c, c.runs(), new StringReader(csv.toString()));
        return new LoadedCampaign(c, log, List.of());
    }

    static double[] sdNew(CampaignSurrogate sur, List<DesignPoint> pts) {
        CampaignSurrogate.Evaluation e = sur.evaluate(pts);
        double[] out = new double[pts.size()];
        for (int i = 0; i < out.length; i++) {
            out[i] = Math.hypot(e.sdLatent().get("size")[i], e.noiseSd().get("size"));
        }
        return out;
    }

    static List<DesignPoint> grid(CampaignSurrogate sur) {
        List<DesignPoint> pts = new ArrayList<>(sur.runPoints());
        for (int k = 0; k <= 20; k++) {
            pts.add(new DesignPoint(new double[] {k / 20.0}, new int[0]));
        }
        return pts;
    }

    @Test
    void noSkillOutcomeWidensToTheObservedSpread() throws Exception {
        double[] sizes = new double[12];
        for (int i = 0; i < 12; i++) {
            sizes[i] = i % 2 == 0 ? 18 : 32;
        }
        CampaignSurrogate sur = CampaignSurrogate.build(campaign(i -> sizes[i]), PluginRegistry.builder()
                .autoDiscovery(false).build(), false, 7);
        GpLeaveOneOut loo = sur.leaveOneOut("size").orElseThrow();
        assertFalse(loo.hasSkill(), "alternating sizes: Q2 = " + loo.q2());
        double observed = new StandardDeviation(true).evaluate(sizes); // sample sd, Commons Math
        assertEquals(observed, loo.observedSd(), 1e-9);
        for (double sd : sdNew(sur, grid(sur))) {
            assertTrue(sd >= observed - 1e-9, "predictive sd " + sd + " below the observed spread " + observed);
        }
        assertTrue(sur.notes().stream().anyMatch(n -> n.startsWith("size: no skill")), sur.notes().toString());
    }

    @Test
    void outcomeWithSkillKeepsItsModelSpread() throws Exception {
        double[] sizes = new double[12];
        for (int i = 0; i < 12; i++) {
            sizes[i] = 15 + 2 * i + (i % 3 == 0 ? 0.3 : -0.2);
        }
        CampaignSurrogate sur = CampaignSurrogate.build(campaign(i -> sizes[i]), PluginRegistry.builder()
                .autoDiscovery(false).build(), false, 7);
        GpLeaveOneOut loo = sur.leaveOneOut("size").orElseThrow();
        assertTrue(loo.hasSkill(), "a line is predictable: Q2 = " + loo.q2());
        double observed = new StandardDeviation(true).evaluate(sizes);
        double[] sd = sdNew(sur, sur.runPoints());
        for (double s : sd) {
            assertTrue(s < 0.5 * observed, "at the runs the model is much sharper than the spread: " + s);
        }
        assertTrue(sur.notes().stream().noneMatch(n -> n.contains("no skill")), sur.notes().toString());
    }
}
