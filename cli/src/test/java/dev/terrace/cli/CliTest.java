package dev.terrace.cli;

import dev.terrace.demo.DemoCampaign;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/** Runs the command line in-process and checks output and exit codes. */
class CliTest extends CliFixtures {

    @Test
    void printsVersionAndHelp() {
        Outcome v = run("--version");
        assertEquals(0, v.code());
        assertTrue(v.out().startsWith("terrace "), v.out());
        Outcome h = run("--help");
        assertEquals(0, h.code());
        for (String cmd : List.of("init", "check", "models", "demo")) {
            assertTrue(h.out().contains(cmd), cmd);
        }
        for (String cmd : List.of("init", "check", "models", "demo")) {
            assertEquals(0, run(cmd, "--help").code(), cmd);
        }
    }

    @Test
    void unknownOptionIsAUsageError() {
        Outcome o = run("check", "--frobnicate", "x.yaml");
        assertEquals(2, o.code());
        assertTrue(o.err().contains("--frobnicate"), o.err());
    }

    @Test
    void initWritesACampaignThatChecksCleanAndRefusesToOverwrite(@TempDir Path tmp) throws Exception {
        Path dir = tmp.resolve("series");
        Outcome o = run("init", dir.toString());
        assertEquals(0, o.code(), o.err());
        Path campaign = dir.resolve("campaign.yaml");
        assertTrue(Files.exists(campaign));
        assertTrue(Files.readString(dir.resolve("runs.csv")).contains("run_id,substrate_temp"));
        Outcome c = run("check", campaign.toString());
        assertEquals(0, c.code(), c.err());
        assertTrue(c.out().contains("Runs: 0 (0 ok, 0 failed)"), c.out());
        byte[] before = Files.readAllBytes(campaign);
        Outcome again = run("init", dir.toString());
        assertEquals(2, again.code());
        assertTrue(again.err().contains("never overwrites"), again.err());
        assertArrayEquals(before, Files.readAllBytes(campaign));
    }

    @Test
    void checkSummarisesTheDemoCampaign(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        Outcome o = run("check", campaign.toString());
        assertEquals(0, o.code(), o.err());
        assertTrue(o.out().contains("Campaign ga-dots-demo"), o.out());
        assertTrue(o.out().contains("failed)"), o.out());
        assertTrue(o.out().contains("Targets met so far"), o.out());
        assertTrue(o.out().contains("safety officer"), o.out());
    }

    @Test
    void checkListsFiveFaultsWithLineAndColumnAndChangesNothing(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        Path runs = campaign.resolveSibling("runs.csv");
        String header = "run_id,t_drop,ga_amount,ga_rate,as_flux,t_cryst,as_source,dot_density,dot_diameter,shape,status\n";
        String log = header
                + "A1,200,3.0,0.10,1.0e-5,200,As4,9.1e10,19,dot,ok\n"
                + "A2,250,3.0,fast,1.0e-5,250,As4,3.4e10,27,dot,ok\n"       // 3: not a number (col 12)
                + "A1,300,3.0,0.10,1.0e-5,300,As4,1.2e10,37,ring,ok\n"       // 4: duplicate run_id (col 1)
                + "A4,300,3.0,0.10,-5.0e-5,280,As4,1.4e10,34,dot,ok\n"       // 5: negative pressure (col 17)
                + "A5,275,2.0,0.05,2.0e-5,275,As3,1.6e10,29,dot,ok\n"        // 6: unknown category (col 28)
                + "A6,325,4.0,0.20,1.0e-6,350,As4,5.5e9,58,blob,ok\n";       // 7: unknown class (col 41)
        Files.writeString(runs, log);
        byte[] runsBefore = Files.readAllBytes(runs);
        byte[] campaignBefore = Files.readAllBytes(campaign);
        Outcome o = run("check", campaign.toString());
        assertEquals(2, o.code());
        List<String> errors = Arrays.stream(o.err().split("\n")).filter(l -> l.contains(": error: ")).toList();
        assertEquals(5, errors.size(), o.err());
        String[] expectedPositions = {"runs.csv:3:12:", "runs.csv:4:1:", "runs.csv:5:17:", "runs.csv:6:28:",
                "runs.csv:7:41:"};
        for (int i = 0; i < 5; i++) {
            assertTrue(errors.get(i).contains(expectedPositions[i]), errors.get(i));
        }
        assertFalse(o.err().contains("Exception"), "no stack trace: " + o.err());
        assertFalse(o.err().contains("\tat "), "no stack trace: " + o.err());
        assertArrayEquals(runsBefore, Files.readAllBytes(runs));
        assertArrayEquals(campaignBefore, Files.readAllBytes(campaign));
    }

    @Test
    void checkOnAMissingFileIsAnInputError(@TempDir Path tmp) {
        Outcome o = run("check", tmp.resolve("none.yaml").toString());
        assertEquals(2, o.code());
        assertTrue(o.err().contains("not found"), o.err());
    }

    @Test
    void modelsListsTheBundledPluginsWithSources() {
        Outcome o = run("models");
        assertEquals(0, o.code(), o.err());
        for (String id : List.of("island-nucleation", "step-flow", "droplet-crystallization")) {
            assertTrue(o.out().contains(id), id);
        }
        assertTrue(o.out().contains("source:"), o.out());
        Outcome j = run("models", "--format", "json");
        assertEquals(0, j.code());
        assertTrue(j.out().trim().startsWith("["), j.out());
        assertEquals(2, run("models", "--format", "xml").code());
    }

    @Test
    void demoCopiesIntoANewFolderAndNeverIntoAnExistingOne(@TempDir Path tmp) throws Exception {
        Path dir = tmp.resolve("d");
        Outcome o = run("demo", "--dir", dir.toString());
        assertEquals(0, o.code(), o.err());
        assertTrue(o.out().contains("invented data"), o.out());
        assertTrue(Files.exists(dir.resolve("campaign.yaml")));
        byte[] before = Files.readAllBytes(dir.resolve("runs.csv"));
        Outcome again = run("demo", "--dir", dir.toString());
        assertEquals(2, again.code());
        assertArrayEquals(before, Files.readAllBytes(dir.resolve("runs.csv")));
    }

    @Test
    void fitPrintsATableAndTheDocumentedJson(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        Outcome t = run("fit", campaign.toString());
        assertEquals(0, t.code(), t.err());
        assertTrue(t.out().contains("== island-nucleation"), t.out());
        assertTrue(t.out().contains("95 % interval"), t.out());
        Outcome j = run("fit", campaign.toString(), "--format", "json");
        assertEquals(0, j.code(), j.err());
        var root = new com.fasterxml.jackson.databind.ObjectMapper().readTree(j.out());
        assertEquals("ga-dots-demo", root.get("campaign").asText());
        var m = root.get("models").get(0);
        for (String key : List.of("id", "runs_used", "runs_excluded", "parameters", "selected", "candidates", "fit")) {
            assertTrue(m.has(key), key);
        }
        var barrier = m.get("parameters").get("diffusion_barrier");
        assertTrue(barrier.has("value") && barrier.has("unit") && barrier.has("ci95") && barrier.has("held"));
        assertTrue(m.get("fit").has("rmse") && m.get("fit").has("rmse_scale"));
        assertFalse(j.out().contains("NaN") || j.out().contains("Infinity"), "no NaN in JSON");
        assertEquals(j.out(), run("fit", campaign.toString(), "--format", "json").out(), "same seed, same output");
    }

    @Test
    void fitWithNothingToFitExitsOneWithAClearMessage(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        Path runs = campaign.resolveSibling("runs.csv");
        String header = "run_id,t_drop,ga_amount,ga_rate,as_flux,t_cryst,as_source,dot_density,dot_diameter,shape,status\n";
        // every run failed
        Files.writeString(runs, header + "A,200,3,0.1,1e-5,200,As4,,,,failed\nB,250,3,0.1,1e-5,250,As4,,,,failed\n"
                + "C,300,3,0.1,1e-5,300,As4,,,,failed\n");
        Outcome o = run("fit", campaign.toString());
        assertEquals(1, o.code(), o.out() + o.err());
        assertTrue(o.err().contains("every run in the log failed"), o.err());
        assertFalse(o.err().contains("\tat "), o.err());
        // one run
        Files.writeString(runs, header + "A,200,3,0.1,1e-5,200,As4,9e10,19,dot,ok\n");
        o = run("fit", campaign.toString());
        assertEquals(1, o.code());
        assertTrue(o.err().contains("only 1 usable run"), o.err());
        // outcomes missing
        Files.writeString(runs, "run_id,t_drop,ga_amount,ga_rate,as_flux,t_cryst,as_source\n"
                + "A,200,3,0.1,1e-5,200,As4\nB,250,3,0.1,1e-5,250,As4\nC,300,3,0.1,1e-5,300,As4\n");
        o = run("fit", campaign.toString(), "--format", "json");
        assertEquals(1, o.code());
        assertTrue(o.err().contains("no usable run"), o.err());
        assertFalse(o.out().contains("NaN"), o.out());
    }

    @Test
    void fitDrawsTheArrheniusPlot(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        Path png = tmp.resolve("arrhenius.png");
        Outcome o = run("fit", campaign.toString(), "--plot", png.toString(), "--quiet");
        assertEquals(0, o.code(), o.err());
        assertTrue(o.err().contains("effective activation energy"), o.err());
        java.awt.image.BufferedImage img = javax.imageio.ImageIO.read(png.toFile());
        assertEquals(800, img.getWidth());
        assertEquals(2, run("fit", campaign.toString(), "--plot", png.toString()).code(), "never overwrites");
        assertEquals(2, run("fit", campaign.toString(), "--plot", tmp.resolve("a.gif").toString()).code());
    }

    @Test
    void validateWritesParityPlots(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        Path dir = tmp.resolve("plots");
        Outcome o = run("validate", campaign.toString(), "--plots", dir.toString(), "--quiet");
        assertEquals(0, o.code(), o.err());
        for (String name : List.of("parity-dot_density.png", "parity-dot_diameter.png")) {
            java.awt.image.BufferedImage img = javax.imageio.ImageIO.read(dir.resolve(name).toFile());
            assertEquals(800, img.getWidth(), name);
        }
    }
}
