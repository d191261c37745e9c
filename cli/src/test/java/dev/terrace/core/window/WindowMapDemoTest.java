package dev.terrace.core.window;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.plugins.PluginRegistry;
import dev.terrace.core.propose.CampaignSurrogate;
import dev.terrace.core.space.DesignPoint;
import dev.terrace.demo.DemoCampaign;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Window maps of the demo campaign (invented data) with its growth models as the physics prior. */
class WindowMapDemoTest {

    static CampaignSurrogate sur;
    /** Held at the best proposal's recipe, where the demo has a window. */
    static Map<String, Object> AT;

    @BeforeAll
    static void fit(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        PluginRegistry reg = PluginRegistry.builder().build();
        sur = CampaignSurrogate.build(LoadedCampaign.open(campaign, reg), reg, true, 7);
        AT = WindowMap.bestRecipe(sur, 7);
    }

    @Test
    void largerThermocoupleErrorNeverWidensTheDemoWindow() {
        // property tested (not a theorem, see WindowMap): on the demo the window share at yield 0.5 and the
        // best cell's yield do not grow as the thermocouple error grows
        double lastShare = 2;
        double lastBest = 2;
        double first = -1;
        for (double sigma : new double[] {0, 3, 10, 25}) {
            WindowMapResult m = WindowMap.compute(sur, "t_drop", "t_cryst", AT, 31, sigma, 7);
            if (first < 0) {
                first = m.windowFraction();
            }
            assertTrue(m.windowFraction() <= lastShare, "sigma " + sigma + ": " + m.windowFraction() + " > " + lastShare);
            assertTrue(m.bestCell().yield() <= lastBest + 1e-12, "sigma " + sigma + ": best yield rose");
            lastShare = m.windowFraction();
            lastBest = m.bestCell().yield();
        }
        assertTrue(first > 0, "the demo has a window at the held recipe");
        assertTrue(lastShare < first, "a 25 K error shrinks it");
    }

    @Test
    void zeroErrorGivesThePlainDemoMapExactly() {
        WindowMapResult a = WindowMap.compute(sur, "t_drop", "t_cryst", AT, 11, 0, 7);
        for (int j = 0; j < a.ny(); j++) {
            for (int i = 0; i < a.nx(); i++) {
                assertEquals(a.plainYieldAt(i, j), a.yieldAt(i, j), 0.0);
            }
        }
        assertEquals(List.of("t_drop", "t_cryst"), WindowMap.compute(sur, "t_drop", "t_cryst", AT, 5, 2, 7)
                .temperatureSettings(), "one thermocouple shifts both temperature settings");
    }

    @Test
    void demoClassRegionsAgreeWithTheMorphologyProbabilities() {
        WindowMapResult m = WindowMap.compute(sur, "t_drop", "t_cryst", AT, 15, 0, 7);
        assertEquals("shape", m.classOutcome());
        List<DesignPoint> pts = new ArrayList<>();
        Map<String, Double> nums = new LinkedHashMap<>();
        Map<String, String> cats = new LinkedHashMap<>();
        for (ParameterSpec p : sur.campaign().parameters()) {
            if (p.isCategorical()) {
                cats.put(p.name(), (String) m.at().get(p.name()));
            } else {
                nums.put(p.name(), (Double) m.at().get(p.name()));
            }
        }
        for (int j = 0; j < m.ny(); j++) {
            for (int i = 0; i < m.nx(); i++) {
                nums.put("t_drop", m.xAt(i));
                nums.put("t_cryst", m.yAt(j));
                pts.add(sur.space().encode(nums, cats));
            }
        }
        double[][] probs = sur.evaluate(pts).classProbs().get("shape");
        List<String> classes = sur.campaign().outcome("shape").orElseThrow().classes();
        for (int j = 0; j < m.ny(); j++) {
            for (int i = 0; i < m.nx(); i++) {
                double[] p = probs[j * m.nx() + i];
                int best = 0;
                for (int k = 1; k < p.length; k++) {
                    if (p[k] > p[best]) {
                        best = k;
                    }
                }
                assertEquals(classes.get(best), m.likelyClassAt(i, j), "cell " + i + "," + j);
            }
        }
    }
}
