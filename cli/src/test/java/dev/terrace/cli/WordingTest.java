package dev.terrace.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.terrace.demo.DemoCampaign;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Path;
import java.util.Iterator;
import java.util.Map;

import static dev.terrace.cli.CliTest.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Wording of the output on the bundled demo campaign (invented data): the map's held values are
 * the top proposal's rounded values, the nearest-run distance is explained where it first appears,
 * a window shrink that rounds to 0 % is never "0 % less", and other commands point to the cautions.
 */
class WordingTest {

    @Test
    void mapHoldsTheTopProposalsRoundedValuesAndTheTableExplainsTheNearestRun(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        CliTest.Outcome p = run("propose", campaign.toString(), "--format", "json", "--no-journal", "--quiet");
        assertEquals(0, p.code(), p.err());
        JsonNode top = new ObjectMapper().readTree(p.out()).get("proposals").get(0);
        CliTest.Outcome m = run("map", campaign.toString(), "--x", "t_drop", "--y", "as_flux", "--grid", "9", "--quiet");
        assertEquals(0, m.code(), m.err());
        String held = m.out().lines().filter(l -> l.strip().startsWith("held:")).findFirst().orElseThrow();
        assertTrue(held.contains("the top proposal " + top.get("id").asText()), held);
        for (Iterator<Map.Entry<String, JsonNode>> it = top.get("recipe").fields(); it.hasNext(); ) {
            Map.Entry<String, JsonNode> e = it.next();
            if (e.getKey().equals("t_drop") || e.getKey().equals("as_flux")) {
                continue;
            }
            String v = e.getValue().isNumber() ? Format.setting(e.getValue().asDouble()) : e.getValue().asText();
            assertTrue(held.contains(e.getKey() + " " + v), e.getKey() + " " + v + " in " + held);
        }
        assertTrue(m.out().contains("safety officer"), "one line pointing to the cautions: " + m.out());
        CliTest.Outcome t = run("propose", campaign.toString(), "--batch", "1", "--no-journal");
        assertEquals(0, t.code(), t.err());
        assertTrue(t.out().contains("\" = the logged run closest to the recipe, and how far: each numeric setting's"
                + " box scaled to 0 to 1"), t.out());
        assertTrue(t.err().contains("Safety: ") && t.err().contains("'terrace check'"), t.err());
    }

    @Test
    void aShrinkThatRoundsToZeroIsNotZeroPercentLess() {
        // worked by hand (no published source needed): 0.004 rounds to 0 % at whole percent, so it is
        // "the same to the nearest 1 %"; 0.12 is 12 % less; a negative shrink of 0.03 is 3 % more
        assertEquals("the same to the nearest 1 %", MapCommand.less(0.004));
        assertEquals("12 % less", MapCommand.less(0.12));
        assertEquals("3 % more", MapCommand.less(-0.03));
    }
}
