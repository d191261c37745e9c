package dev.terrace.core.window;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.CampaignReader;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.design.LatinHypercube;
import dev.terrace.core.propose.CampaignSurrogate;
import dev.terrace.core.propose.Proposer;
import dev.terrace.core.space.DesignPoint;
import dev.terrace.core.window.ParetoFront.FrontPoint;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

import java.io.StringReader;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ParetoFrontTest {

    static CampaignSurrogate sur;

    @BeforeAll
    static void fit() throws Exception {
        sur = WindowFixtures.surrogate();
    }

    @Test
    void hypervolumeMatchesTheCheckValues() {
        // Hypervolume ("S metric", Zitzler & Thiele, IEEE Trans. Evol. Comput. 3, 257 (1999)), two
        // objectives, minimisation: HV = sum_i (f1[i+1] - f1[i]) (r2 - f2[i]) over the front sorted by
        // f1, f1[n+1] = r1. {(1,3),(2,2),(3,1)}, r = (4,4): (2-1)(4-3) + (3-2)(4-2) + (4-3)(4-1)
        // = 1 + 2 + 3 = 6.
        List<double[]> a = new ArrayList<>(List.of(new double[] {1, 3}, new double[] {2, 2}, new double[] {3, 1}));
        assertEquals(6.0, ParetoFront.hypervolume(a, 4, 4), 1e-12);
        // adding the dominated point (2.5, 2.5) still gives 6: (2,2) dominates it, so the front is unchanged
        a.add(new double[] {2.5, 2.5});
        assertEquals(6.0, ParetoFront.hypervolume(a, 4, 4), 1e-12);
        // {(0.2,0.8),(0.5,0.4),(0.9,0.1)}, r = (1,1): 0.3*0.2 + 0.4*0.6 + 0.1*0.9 = 0.06 + 0.24 + 0.09 = 0.39
        List<double[]> b = List.of(new double[] {0.2, 0.8}, new double[] {0.5, 0.4}, new double[] {0.9, 0.1});
        assertEquals(0.39, ParetoFront.hypervolume(b, 1, 1), 1e-12);
        assertEquals(0.0, ParetoFront.hypervolume(List.of(new double[] {5, 5}), 4, 4), 0.0, "outside the reference");
    }

    @Test
    void crowdingDistanceMatchesTheCheckValue() {
        // Crowding distance of NSGA-II (Deb, Pratap, Agarwal, Meyarivan, IEEE Trans. Evol. Comput. 6, 182
        // (2002)): boundary points infinite; interior i adds (f_m[i+1] - f_m[i-1]) / (f_m max - f_m min)
        // per objective. (0,1),(0.25,0.75),(0.5,0.5),(1,0): point 2: (0.5-0)/1 + (1-0.5)/1 = 1.0;
        // point 3: (1-0.25)/1 + (0.75-0)/1 = 1.5.
        double[] d = ParetoFront.crowdingDistance(List.of(new double[] {0, 1}, new double[] {0.25, 0.75},
                new double[] {0.5, 0.5}, new double[] {1, 0}));
        assertEquals(Double.POSITIVE_INFINITY, d[0]);
        assertEquals(1.0, d[1], 1e-12);
        assertEquals(1.5, d[2], 1e-12);
        assertEquals(Double.POSITIVE_INFINITY, d[3]);
    }

    @Test
    void costsFollowFromCoverageRateAndBep() {
        Campaign c = sur.campaign();
        Map<String, Double> nums = Map.of("t_sub", 500.0, "t_anneal", 540.0, "amount", 3.0, "rate", 0.1, "bep", 1.0e-6);
        // arithmetic: 3 ML at 0.1 ML/s take 30 s; at 1e-6 Torr that is 3e-5 Torr s
        assertEquals(30.0, ParetoFront.cost(c, ParetoFront.GROWTH_TIME, nums), 1e-12);
        assertEquals(3.0e-5, ParetoFront.cost(c, ParetoFront.GROUP_V, nums), 1e-18);
    }

    @Test
    void frontHasNoDominatedPointAndBeatsARandomSampleOfTheSameSize() {
        ParetoFront f = ParetoFront.compute(sur, ParetoFront.GROWTH_TIME, 40, 25, 5); // budget: test design choice
        List<FrontPoint> pts = f.points();
        assertTrue(pts.size() >= 3, "front of " + pts.size());
        for (FrontPoint a : pts) {
            for (FrontPoint b : pts) {
                assertFalse(a.dominates(b), a + " dominates " + b);
            }
        }
        for (int i = 1; i < pts.size(); i++) {
            assertTrue(pts.get(i).cost() >= pts.get(i - 1).cost());
            assertTrue(pts.get(i).yield() > pts.get(i - 1).yield(), "along a front yield rises with cost");
        }
        // each recipe: inside the box and limits, cost and yield recomputed independently
        Campaign c = sur.campaign();
        List<DesignPoint> enc = new ArrayList<>();
        for (FrontPoint p : pts) {
            Map<String, Double> nums = new LinkedHashMap<>();
            Map<String, String> cats = new LinkedHashMap<>();
            for (ParameterSpec ps : c.parameters()) {
                if (ps.isCategorical()) {
                    cats.put(ps.name(), (String) p.recipe().get(ps.name()));
                } else {
                    double v = (Double) p.recipe().get(ps.name());
                    assertTrue(v >= ps.min() - 1e-9 * Math.abs(ps.min()) && v <= ps.max() * (1 + 1e-12), ps.name() + "=" + v);
                    nums.put(ps.name(), v);
                }
            }
            assertTrue(c.limitsHold(nums));
            assertEquals(nums.get("amount") / nums.get("rate"), p.cost(), 1e-9 * p.cost());
            enc.add(sur.space().encode(nums, cats));
        }
        double[] y = Proposer.yields(sur, sur.evaluate(enc));
        for (int i = 0; i < y.length; i++) {
            assertEquals(y[i], pts.get(i).yield(), 1e-9);
        }
        // a front found by search covers at least the hypervolume of a space-filling sample of equal size
        double ref = 1 / 0.05 * 5 * 1.01; // the box's largest deposition time, 5 ML at 0.05 ML/s, plus 1 %
        List<DesignPoint> sample = new ArrayList<>();
        for (DesignPoint p : LatinHypercube.maximinPoints(pts.size() * 4, 5, new int[] {2}, 99, 500)) {
            if (sur.space().feasible(p)) {
                sample.add(p);
            }
        }
        double[] ys = Proposer.yields(sur, sur.evaluate(sample));
        List<double[]> objs = new ArrayList<>();
        for (int i = 0; i < sample.size(); i++) {
            objs.add(new double[] {ParetoFront.cost(c, ParetoFront.GROWTH_TIME, sur.space().numbers(sample.get(i))), -ys[i]});
        }
        double hvSample = ParetoFront.hypervolume(objs, ref, 0);
        assertTrue(f.hypervolume(ref) >= hvSample, "front " + f.hypervolume(ref) + " vs sample " + hvSample);
        assertTrue(f.evaluations() > 0 && f.evaluations() <= 40 * 26);
    }

    @Test
    void sameSeedGivesTheSameFront() {
        ParetoFront a = ParetoFront.compute(sur, ParetoFront.GROUP_V, 16, 6, 8);
        ParetoFront b = ParetoFront.compute(sur, ParetoFront.GROUP_V, 16, 6, 8);
        assertEquals(a.points().size(), b.points().size());
        for (int i = 0; i < a.points().size(); i++) {
            assertArrayEquals(new double[] {a.points().get(i).yield(), a.points().get(i).cost()},
                    new double[] {b.points().get(i).yield(), b.points().get(i).cost()}, 0.0);
        }
        assertEquals("Torr s", a.costUnit());
    }

    @Test
    void costThatTheCampaignCannotComputeIsRejected() throws Exception {
        String yaml = String.join("\n", "campaign: no-rate", "material: {substrate: GaAs}", "parameters:",
                "  t_sub: {unit: degC, min: 400, max: 600, role: substrate_temperature}",
                "  amount: {unit: ML, min: 1, max: 5, role: coverage}", "outcomes:", "  size: {unit: nm}",
                "targets:", "  size: {min: 20, max: 30}", "models: []", "");
        Campaign c = CampaignReader.parse(Path.of("/virtual/no-rate.yaml"), new StringReader(yaml), null).campaign();
        assertTrue(ParetoFront.costProblem(c, ParetoFront.GROWTH_TIME).orElseThrow().contains("deposition_rate"));
        assertTrue(ParetoFront.costProblem(c, "cost").isPresent());
        assertTrue(ParetoFront.costProblem(sur.campaign(), ParetoFront.GROUP_V).isEmpty());
        assertThrows(IllegalArgumentException.class, () -> ParetoFront.compute(sur, "money", 16, 2, 1));
        assertThrows(IllegalArgumentException.class, () -> ParetoFront.compute(sur, ParetoFront.GROWTH_TIME, 4, 2, 1));
    }

    @Test
    void spreadKeepsBothEndsOfTheFront() {
        ParetoFront f = ParetoFront.compute(sur, ParetoFront.GROWTH_TIME, 24, 10, 2);
        List<FrontPoint> s = f.spread(4);
        assertTrue(s.size() <= 4);
        assertEquals(f.points().get(0), s.get(0));
        assertEquals(f.points().get(f.points().size() - 1), s.get(s.size() - 1));
    }
}
