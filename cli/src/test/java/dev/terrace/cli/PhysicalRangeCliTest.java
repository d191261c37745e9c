package dev.terrace.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;

import static dev.terrace.cli.CliSafetyTest.hashes;
import static dev.terrace.cli.CliSafetyTest.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * A diameter is never negative: on a tiny campaign (invented data) whose runs measured dots of a
 * few nm with a wide scatter, the normal prediction's 90 % interval reaches below 0 nm, and Terrace
 * prints it clipped at 0 in JSON and in the table (the censored view of PhysicalRange). Inputs
 * keep their bytes.
 */
class PhysicalRangeCliTest {

    /** Two-sided 90 % normal quantile, z_0.95 = 1.6449 (Abramowitz & Stegun, Handbook, Table 26.1). */
    private static final double Z90 = 1.6449;

    static Path tinyCampaign(Path dir) throws Exception {
        Files.createDirectories(dir);
        Files.writeString(dir.resolve("campaign.yaml"), String.join("\n",
                "# TEST CAMPAIGN - INVENTED DATA: a made-up series of small dots, not measurements.",
                "campaign: tiny-dots",
                "title: \"TEST (invented data): small dots with a wide scatter\"",
                "material: {substrate: GaAs, deposit: Ga, group_v: As}",
                "parameters:",
                "  t_sub: {unit: degC, min: 200, max: 300}",
                "outcomes:",
                "  dot_diameter: {unit: nm}",
                "targets: {}",
                "runs: runs.csv", ""));
        Files.writeString(dir.resolve("runs.csv"), String.join("\n",
                "# invented runs",
                "run_id,t_sub,dot_diameter",
                "T1,200,0.4",
                "T2,220,5.1",
                "T3,240,0.2",
                "T4,260,6.3",
                "T5,280,0.3",
                "T6,300,4.8", ""));
        return dir.resolve("campaign.yaml");
    }

    @Test
    void anIntervalThatWouldReachBelowZeroIsPrintedClippedAtZero(@TempDir Path tmp) throws Exception {
        Path campaign = tinyCampaign(tmp.resolve("tiny"));
        Path cands = Files.writeString(tmp.resolve("cands.csv"), "run_id,t_sub\nK1,240\n");
        Map<String, String> before = hashes(campaign.getParent());
        CliSafetyTest.Outcome json = run("rank", campaign.toString(), "--candidates", cands.toString(), "--format",
                "json", "-q");
        assertEquals(0, json.code(), json.err());
        JsonNode d = new ObjectMapper().readTree(json.out()).get("proposals").get(0).get("predicted").get("dot_diameter");
        double mean = d.get("mean").asDouble();
        double sd = d.get("sd").asDouble();
        double lo = d.get("interval90").get(0).asDouble();
        double hi = d.get("interval90").get(1).asDouble();
        assertTrue(mean - Z90 * sd < 0, "the normal's own interval reaches below 0 nm here: " + d);
        assertEquals(0.0, lo, 0.0, "clipped at 0 nm: " + d);
        assertTrue(mean >= 0 && hi > mean, d.toString());
        CliSafetyTest.Outcome table = run("rank", campaign.toString(), "--candidates", cands.toString(), "-q");
        assertEquals(0, table.code(), table.err());
        assertTrue(table.out().contains("90 % 0 to "), table.out());
        assertFalse(table.out().matches("(?s).*90 % -.*"), table.out());
        assertEquals(before, hashes(campaign.getParent()));
    }
}
