package dev.terrace.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.terrace.demo.DemoCampaign;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import picocli.CommandLine;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Runs {@code terrace validate} in-process. */
class ValidateCommandTest {

    record Outcome(int code, String out, String err) {
    }

    /** The command line with {@code validate} registered (whether or not Main lists it yet). */
    static Outcome run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        CommandLine cl = Main.commandLine();
        if (!cl.getSubcommands().containsKey("validate")) {
            cl.addSubcommand("validate", new ValidateCommand());
        }
        cl.setOut(new PrintWriter(out, true));
        cl.setErr(new PrintWriter(err, true));
        int code = cl.execute(args);
        return new Outcome(code, out.toString(), err.toString());
    }

    /** An invented campaign of one setting, one linear outcome and no growth models (GP only, quick). */
    static Path lineCampaign(Path dir, int runs) throws Exception {
        Files.createDirectories(dir);
        Files.writeString(dir.resolve("campaign.yaml"), String.join("\n",
                "# invented test campaign",
                "campaign: line-test",
                "material: {substrate: GaAs}",
                "parameters:",
                "  temp: {unit: degC, min: 100, max: 700, role: substrate_temperature}",
                "outcomes:",
                "  size: {unit: nm, role: island_diameter}",
                "models: []",
                ""));
        Random r = new Random(3);
        StringBuilder csv = new StringBuilder("run_id,temp,size,status\n");
        for (int i = 0; i < runs; i++) {
            double t = 150 + 500.0 * i / Math.max(runs - 1, 1);
            csv.append(String.format(Locale.ROOT, "L%02d,%.1f,%.3f,ok%n", i, t, 5 + 0.05 * t + 0.5 * r.nextGaussian()));
        }
        Files.writeString(dir.resolve("runs.csv"), csv.toString());
        return dir.resolve("campaign.yaml");
    }

    @Test
    void demoCampaignValidatesWithExitZeroAndJsonWithoutNaN(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        byte[] runsBefore = Files.readAllBytes(campaign.resolveSibling("runs.csv"));
        Outcome o = run("validate", campaign.toString(), "--format", "json");
        assertEquals(0, o.code(), o.err());
        assertFalse(o.out().contains("NaN"), o.out());
        assertFalse(o.out().contains("Infinity"), o.out());
        JsonNode root = new ObjectMapper().readTree(o.out());
        assertEquals("ga-dots-demo", root.get("campaign").asText());
        assertEquals(3, root.get("outcomes").size(), "dot_density, dot_diameter and shape");
        for (JsonNode out : root.get("outcomes")) {
            for (String k : new String[] {"physics", "gp", "physics+gp", "mean"}) {
                JsonNode s = out.get("by_surrogate").get(k);
                assertTrue(s != null && s.isObject(), out.get("outcome") + " " + k);
                // the demo log has 14 runs, one of them failed: 13 are held out
                assertEquals(13, s.get("n").asInt(), out.get("outcome") + " " + k);
            }
            if (out.get("scale").asText().equals("class")) {
                assertEquals(0, out.get("parity").size());
            } else {
                assertEquals(3 * 13, out.get("parity").size(), out.get("outcome").asText());
            }
        }
        for (JsonNode p : root.get("outcomes").get(0).get("parity")) {
            assertFalse(p.get("run_id").asText().equals("D11"), "D11 failed and stays in training");
        }
        assertTrue(root.get("verdict").get(0).asText().contains("held out 13 runs"), root.get("verdict").toString());
        assertArrayEquals(runsBefore, Files.readAllBytes(campaign.resolveSibling("runs.csv")), "the log is not changed");
    }

    @Test
    void tablePrintsOneRowPerOutcomeAndSurrogateAndTheVerdict(@TempDir Path tmp) throws Exception {
        Path campaign = lineCampaign(tmp.resolve("line"), 8);
        Outcome o = run("validate", campaign.toString());
        assertEquals(0, o.code(), o.err());
        assertTrue(o.out().contains("Leave-one-out validation of campaign line-test, seed 7"), o.out());
        assertTrue(o.out().contains("physics     not available (the campaign lists no growth models)"), o.out());
        long rows = o.out().lines().filter(l -> l.matches(".*\\b(gp|physics\\+gp|mean)\\s+8\\s.*")).count();
        assertEquals(3, rows, o.out());
        assertTrue(o.out().contains("Verdict:"), o.out());
        assertTrue(o.out().contains("held out 8 runs"), o.out());
        assertFalse(o.out().contains("NaN"), o.out());
    }

    @Test
    void fewerThanThreeUsableRunsIsAJobFailure(@TempDir Path tmp) throws Exception {
        Path campaign = lineCampaign(tmp.resolve("line"), 2);
        Outcome o = run("validate", campaign.toString());
        assertEquals(1, o.code(), o.out());
        assertTrue(o.err().contains("has 2 ok runs with a measured outcome"), o.err());
        assertTrue(o.err().contains("needs at least 3"), o.err());
        assertFalse(o.err().contains("\tat "), "no stack trace: " + o.err());
    }

    @Test
    void unknownFormatIsAUsageError(@TempDir Path tmp) throws Exception {
        Path campaign = lineCampaign(tmp.resolve("line"), 4);
        Outcome o = run("validate", campaign.toString(), "--format", "xml");
        assertEquals(2, o.code());
        assertTrue(o.err().contains("--format must be table or json"), o.err());
    }
}
