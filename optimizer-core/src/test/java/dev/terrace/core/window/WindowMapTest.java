package dev.terrace.core.window;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.propose.CampaignSurrogate;
import dev.terrace.core.propose.Proposer;
import dev.terrace.core.space.DesignPoint;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class WindowMapTest {

    static CampaignSurrogate sur;

    @BeforeAll
    static void fit() throws Exception {
        sur = WindowFixtures.surrogate();
    }

    /** The map's cells recomputed independently: the cell centres and the surrogate's evaluation. */
    static List<DesignPoint> cellPoints(WindowMapResult m, String x, String y) {
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
                nums.put(x, m.xAt(i));
                nums.put(y, m.yAt(j));
                pts.add(sur.space().encode(nums, cats));
            }
        }
        return pts;
    }

    @Test
    void mapHasGridSquaredCellsWithYieldsInUnitIntervalAndLogSpacedCentres() {
        WindowMapResult m = WindowMap.compute(sur, "t_sub", "rate", WindowFixtures.middle(), 9, 0, 1);
        assertEquals(9, m.nx());
        assertEquals(9, m.ny());
        assertEquals(81, m.yield().length * m.yield()[0].length);
        for (int j = 0; j < 9; j++) {
            for (int i = 0; i < 9; i++) {
                assertTrue(m.yieldAt(i, j) >= 0 && m.yieldAt(i, j) <= 1, "yield " + m.yieldAt(i, j));
            }
        }
        // linear axis: centres 400 + 200 (i + 0.5)/9 degC
        assertEquals(400 + 200 * 0.5 / 9, m.xAt(0), 1e-9);
        // log axis (rate 0.05..1 ML/s): constant ratio (1/0.05)^(1/9) between neighbouring centres
        double ratio = Math.pow(20, 1.0 / 9);
        for (int j = 1; j < 9; j++) {
            assertEquals(ratio, m.yAt(j) / m.yAt(j - 1), 1e-12);
        }
        double[] e = m.yEdges();
        assertEquals(0.05, e[0], 0.0);
        assertEquals(1.0, e[9], 0.0);
        assertEquals(Math.sqrt(e[3] * e[4]), m.yAt(3), 1e-12, "a log cell's centre is the geometric midpoint");
    }

    @Test
    void yieldsAreTheProposersYieldsCellByCellAndLimitBreakingCellsAreZero() {
        WindowMapResult m = WindowMap.compute(sur, "t_sub", "t_anneal", WindowFixtures.middle(), 8, 0, 1);
        double[] direct = Proposer.yields(sur, sur.evaluate(cellPoints(m, "t_sub", "t_anneal")));
        Campaign c = sur.campaign();
        int infeasible = 0;
        for (int j = 0; j < m.ny(); j++) {
            for (int i = 0; i < m.nx(); i++) {
                boolean holds = m.yAt(j) >= m.xAt(i) - 50; // the campaign's limit t_anneal >= t_sub - 50
                assertEquals(holds, m.feasibleAt(i, j), "cell " + i + "," + j);
                if (holds) {
                    assertEquals(direct[j * m.nx() + i], m.yieldAt(i, j), 0.0);
                } else {
                    infeasible++;
                    assertEquals(0.0, m.yieldAt(i, j), 0.0);
                }
            }
        }
        assertTrue(infeasible > 0, "the limit cuts a corner of the t_sub-t_anneal map");
        assertTrue(c.limits().size() == 1);
    }

    @Test
    void classRegionsAgreeWithTheClassProbabilitiesCellByCell() {
        WindowMapResult m = WindowMap.compute(sur, "t_sub", "t_anneal", WindowFixtures.middle(), 10, 0, 1);
        assertEquals("mode", m.classOutcome());
        double[][] probs = sur.evaluate(cellPoints(m, "t_sub", "t_anneal")).classProbs().get("mode");
        for (int j = 0; j < m.ny(); j++) {
            for (int i = 0; i < m.nx(); i++) {
                double[] p = probs[j * m.nx() + i];
                String expected = p[0] >= p[1] ? "flat" : "rough";
                assertEquals(expected, m.likelyClassAt(i, j), "cell " + i + "," + j);
                // the map carries the same probabilities, which the class boundaries are contoured from
                assertEquals(p[0], m.classProbability()[0][j][i], 1e-12, "cell " + i + "," + j);
                assertEquals(p[1], m.classProbability()[1][j][i], 1e-12, "cell " + i + "," + j);
            }
        }
        // the invented truth is flat for anneals of about 470-610 degC and rough outside: both regions appear
        assertTrue(m.classShares().containsKey("flat") && m.classShares().containsKey("rough"), m.classShares().toString());
        int cells = m.classRegions().stream().mapToInt(WindowMapResult.ClassRegion::cells).sum();
        assertEquals(100, cells, "regions partition the map");
    }

    @Test
    void zeroUncertaintyGivesThePlainMapExactly() {
        WindowMapResult plain = WindowMap.compute(sur, "t_sub", "amount", WindowFixtures.middle(), 9, 0, 1);
        double[] direct = Proposer.yields(sur, sur.evaluate(cellPoints(plain, "t_sub", "amount")));
        for (int j = 0; j < 9; j++) {
            for (int i = 0; i < 9; i++) {
                assertEquals(plain.plainYieldAt(i, j), plain.yieldAt(i, j), 0.0);
                if (plain.feasibleAt(i, j)) {
                    assertEquals(direct[j * 9 + i], plain.yieldAt(i, j), 0.0);
                }
            }
        }
        assertEquals(plain.plainWindowFraction(), plain.windowFraction(), 0.0);
        assertFalse(plain.robust());
        // the set-point map inside a robust run is the same plain map
        WindowMapResult robust = WindowMap.compute(sur, "t_sub", "amount", WindowFixtures.middle(), 9, 8, 1);
        assertTrue(robust.robust());
        assertEquals(List.of("t_sub", "t_anneal"), robust.temperatureSettings());
        for (int j = 0; j < 9; j++) {
            for (int i = 0; i < 9; i++) {
                assertEquals(plain.yieldAt(i, j), robust.plainYieldAt(i, j), 1e-12);
            }
        }
        // a vanishing error converges to the plain map
        WindowMapResult tiny = WindowMap.compute(sur, "t_sub", "amount", WindowFixtures.middle(), 9, 1e-6, 1);
        for (int j = 0; j < 9; j++) {
            for (int i = 0; i < 9; i++) {
                assertEquals(plain.yieldAt(i, j), tiny.yieldAt(i, j), 1e-6);
            }
        }
    }

    @Test
    void largerThermocoupleErrorNeverWidensTheWindowOrRaisesTheBestYield() {
        double lastShare = 2;
        double lastBest = 2;
        for (double sigma : new double[] {0, 5, 10, 20, 40}) {
            WindowMapResult m = WindowMap.compute(sur, "t_sub", "t_anneal", WindowFixtures.middle(), 21, sigma, 1);
            assertTrue(m.windowFraction() <= lastShare, "window share at sigma " + sigma + ": " + m.windowFraction());
            assertTrue(m.bestCell().yield() <= lastBest + 1e-12, "best yield at sigma " + sigma);
            assertTrue(m.windowFraction() <= m.plainWindowFraction());
            lastShare = m.windowFraction();
            lastBest = m.bestCell().yield();
        }
        assertTrue(lastShare < WindowMap.compute(sur, "t_sub", "t_anneal", WindowFixtures.middle(), 21, 0, 1)
                .windowFraction(), "a 40 K error shrinks a window some 100 K wide");
    }

    @Test
    void rejectsUnknownCategoricalOrRepeatedAxesAndBadGrids() {
        Map<String, Object> at = WindowFixtures.middle();
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> WindowMap.compute(sur, "t_sbu", "amount", at, 9, 0, 1));
        assertTrue(e.getMessage().contains("did you mean 't_sub'"), e.getMessage());
        assertTrue(WindowMap.axisProblem(sur.campaign(), "cell").isPresent());
        assertThrows(IllegalArgumentException.class, () -> WindowMap.compute(sur, "cell", "amount", at, 9, 0, 1));
        assertThrows(IllegalArgumentException.class, () -> WindowMap.compute(sur, "amount", "amount", at, 9, 0, 1));
        assertThrows(IllegalArgumentException.class, () -> WindowMap.compute(sur, "t_sub", "amount", at, 4, 0, 1));
        assertThrows(IllegalArgumentException.class, () -> WindowMap.compute(sur, "t_sub", "amount", at, 201, 0, 1));
        assertThrows(IllegalArgumentException.class, () -> WindowMap.compute(sur, "t_sub", "amount", at, 9, -1, 1));
    }

    @Test
    void parsesHeldSettingsAndNamesMistypedOnes() {
        Map<String, Object> m = WindowMap.parseSettings(sur.campaign(), "amount=2.5, cell=b,bep=2e-6");
        assertEquals(2.5, (Double) m.get("amount"), 0.0);
        assertEquals("b", m.get("cell"));
        assertEquals(2e-6, (Double) m.get("bep"), 0.0);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> WindowMap.parseSettings(sur.campaign(), "amuont=2"));
        assertTrue(e.getMessage().contains("did you mean 'amount'"), e.getMessage());
        assertThrows(IllegalArgumentException.class, () -> WindowMap.parseSettings(sur.campaign(), "cell=c"));
        assertThrows(IllegalArgumentException.class, () -> WindowMap.parseSettings(sur.campaign(), "rate=-1"));
        assertThrows(IllegalArgumentException.class, () -> WindowMap.parseSettings(sur.campaign(), "amount"));
    }

    @Test
    void missingHeldSettingsComeFromTheBestProposalAndRunRecipesAreRead() {
        Map<String, Object> at = new LinkedHashMap<>();
        at.put("cell", "b");
        WindowMapResult m = WindowMap.compute(sur, "t_sub", "amount", at, 5, 0, 3);
        Map<String, Object> best = WindowMap.bestRecipe(sur, 3);
        assertEquals("b", m.at().get("cell"));
        assertEquals(best.get("bep"), m.at().get("bep"));
        assertEquals(best.get("rate"), m.at().get("rate"));
        Map<String, Object> run = WindowMap.runRecipe(sur.loaded(), "W03");
        assertEquals(6, run.size());
        assertNotNull(run.get("t_sub"));
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> WindowMap.runRecipe(sur.loaded(), "W3O"));
        assertTrue(e.getMessage().contains("W30"), e.getMessage());
    }
}
