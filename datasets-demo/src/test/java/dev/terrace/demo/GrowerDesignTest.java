package dev.terrace.demo;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.ParameterSpec;
import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

class GrowerDesignTest {

    /** A campaign whose middle recipe breaks its limit (invented). */
    private static final String MIDDLE_BREAKS = String.join("\n",
            "campaign: limit-test",
            "material: {substrate: GaAs, deposit: Ga, group_v: As}",
            "parameters:",
            "  t_sub: {unit: degC, min: 100, max: 700, role: substrate_temperature}",
            "  t_cr:  {unit: degC, min: 100, max: 700, role: crystallization_temperature}",
            "  rate:  {unit: ML/s, min: 0.01, max: 1, scale: log, role: deposition_rate}",
            "outcomes:",
            "  density: {unit: cm^-2, role: island_density}",
            "limits:",
            "  - t_cr >= t_sub + 250",
            "");

    private static List<Campaign> campaigns() throws Exception {
        return List.of(RegenerateDemo.demoCampaign(), TestCampaigns.parse(TestCampaigns.DROPLETS),
                TestCampaigns.parse(TestCampaigns.FILM), TestCampaigns.parse(MIDDLE_BREAKS));
    }

    private static void assertInsideAndFeasible(Campaign c, List<Recipe> plan) {
        for (Recipe r : plan) {
            for (ParameterSpec p : c.parameters()) {
                if (p.isCategorical()) {
                    assertTrue(p.choices().contains(r.categories().get(p.name())), r.toString());
                } else {
                    double v = r.numbers().get(p.name());
                    assertTrue(v >= p.min() && v <= p.max(), p.name() + " = " + v + " outside the box");
                }
            }
            assertTrue(c.limitsHold(r.numbers()), "limits broken by " + r);
        }
    }

    @Test
    void aDefaultPlanHasFourteenRunsInsideTheBoxesKeepingTheLimits() throws Exception {
        for (Campaign c : campaigns()) {
            List<Recipe> plan = GrowerDesign.plan(c, 3);
            assertEquals(GrowerDesign.DEFAULT_RUNS, plan.size(), c.id());
            assertInsideAndFeasible(c, plan);
        }
    }

    @Test
    void itStartsInTheMiddleOfTheBoxAndEndsByRepeatingTheStart() throws Exception {
        Campaign demo = RegenerateDemo.demoCampaign();
        List<Recipe> plan = GrowerDesign.plan(demo, 5);
        Recipe start = plan.get(0);
        for (ParameterSpec p : demo.parameters()) {
            if (!p.isCategorical() && !p.name().equals("t_cryst")) {
                assertEquals(0.5, p.toUnit(start.numbers().get(p.name())), 0.02, p.name());
            }
        }
        assertEquals(start.numbers().get("t_drop"), start.numbers().get("t_cryst"),
                "crystallise where the droplets were deposited");
        Recipe last = plan.get(plan.size() - 1);
        assertEquals(start.numbers(), last.numbers());
        assertEquals(start.categories(), last.categories());
    }

    @Test
    void everyRunChangesOneFactorFromTheStartRecipe() throws Exception {
        Campaign demo = RegenerateDemo.demoCampaign();
        List<Recipe> plan = GrowerDesign.plan(demo, 9);
        Map<String, Double> start = plan.get(0).numbers();
        boolean sawSwitch = false;
        for (Recipe r : plan) {
            List<String> changed = new ArrayList<>();
            for (String name : start.keySet()) {
                if (!start.get(name).equals(r.numbers().get(name))) {
                    changed.add(name);
                }
            }
            boolean switched = !r.categories().equals(plan.get(0).categories());
            sawSwitch |= switched;
            if (changed.size() == 2) {
                // the substrate-temperature sweep keeps crystallising at the deposition temperature
                assertEquals(List.of("t_drop", "t_cryst"), changed, r.toString());
                assertEquals(r.numbers().get("t_drop"), r.numbers().get("t_cryst"));
            } else {
                assertTrue(changed.size() + (switched ? 1 : 0) <= 1, r.toString());
            }
        }
        assertTrue(sawSwitch, "the plan tries the other group-V species");
    }

    @Test
    void valuesAreRoundedTheWayGrowersWriteThem() throws Exception {
        Campaign demo = RegenerateDemo.demoCampaign();
        for (Recipe r : GrowerDesign.plan(demo, 11)) {
            assertEquals(0, r.numbers().get("t_drop") % 5, 1e-9, "temperatures on a 5 degC step");
            assertEquals(0, r.numbers().get("t_cryst") % 5, 1e-9, "temperatures on a 5 degC step");
            String flux = DemoLogWriter.setting(r.numbers().get("as_flux"));
            assertTrue(flux.matches("\\d(\\.\\d)?e-\\d"), "two significant digits: " + flux);
        }
    }

    @Test
    void theSameSeedGivesTheSamePlanAndAnotherSeedOtherLevels() throws Exception {
        Campaign c = TestCampaigns.parse(TestCampaigns.DROPLETS);
        assertEquals(GrowerDesign.plan(c, 1), GrowerDesign.plan(c, 1));
        assertNotEquals(GrowerDesign.plan(c, 1), GrowerDesign.plan(c, 2));
    }

    @Test
    void aCampaignWhoseMiddleBreaksALimitStillGetsAFeasiblePlan() throws Exception {
        Campaign c = TestCampaigns.parse(MIDDLE_BREAKS);
        assertTrue(!c.limitsHold(Map.of("t_sub", 400.0, "t_cr", 400.0, "rate", 0.1)), "the middle breaks the limit");
        List<Recipe> plan = GrowerDesign.plan(c, 7, 4);
        assertEquals(7, plan.size());
        assertInsideAndFeasible(c, plan);
    }

    @Test
    void shortPlansAndBadRunCounts() throws Exception {
        Campaign demo = RegenerateDemo.demoCampaign();
        assertEquals(1, GrowerDesign.plan(demo, 1, 1).size());
        assertEquals(3, GrowerDesign.plan(demo, 3, 1).size());
        assertEquals(40, GrowerDesign.plan(demo, 40, 1).size());
        assertThrows(IllegalArgumentException.class, () -> GrowerDesign.plan(demo, 0, 1));
    }
}
