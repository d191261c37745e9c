package dev.terrace.cli;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.terrace.demo.DemoCampaign;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static dev.terrace.cli.CliTest.run;
import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

class ProposeCommandTest {

    static final String HEADER = "run_id,t_drop,ga_amount,ga_rate,as_flux,t_cryst,as_source,dot_density,dot_diameter,shape,status\n";

    @Test
    void proposesOnTheDemoWithTheDocumentedJsonAndSameSeedSameBytes(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        byte[] runsBefore = Files.readAllBytes(campaign.resolveSibling("runs.csv"));
        CliTest.Outcome a = run("propose", campaign.toString(), "--batch", "3", "--format", "json", "--seed", "11");
        assertEquals(0, a.code(), a.err());
        CliTest.Outcome b = run("propose", campaign.toString(), "--batch", "3", "--format", "json", "--seed", "11");
        assertEquals(a.out(), b.out(), "same seed, byte-identical JSON");
        JsonNode root = new ObjectMapper().readTree(a.out());
        assertEquals("ga-dots-demo", root.get("campaign").asText());
        assertEquals(11, root.get("seed").asLong());
        assertTrue(root.get("runs_used").asInt() > 0);
        JsonNode ps = root.get("proposals");
        assertEquals(3, ps.size());
        double last = 2;
        for (int i = 0; i < ps.size(); i++) {
            JsonNode p = ps.get(i);
            assertTrue(p.get("id").asText().startsWith("P-"));
            assertEquals(i + 1, p.get("rank").asInt());
            double y = p.get("yield").asDouble();
            assertTrue(y >= 0 && y <= 1 && y <= last);
            last = y;
            JsonNode r = p.get("recipe");
            double t = r.get("t_drop").asDouble();
            assertEquals(Math.rint(t), t, 0.0, "temperature rounded to 1 degC");
            assertTrue(t >= 150 && t <= 350);
            assertTrue(r.get("t_cryst").asDouble() >= t - 20, "limit t_cryst >= t_drop - 20");
            assertTrue(List.of("As2", "As4").contains(r.get("as_source").asText()));
            JsonNode dens = p.get("predicted").get("dot_density");
            assertTrue(dens.get("mean").asDouble() > 0 && dens.get("sd").asDouble() > 0);
            assertEquals(2, dens.get("interval90").size());
            assertTrue(p.get("predicted").get("shape").get("probabilities").has("dot"));
            assertTrue(p.get("nearest_run").has("run_id"));
            assertFalse(p.get("reason").asText().isBlank());
        }
        assertFalse(a.out().contains("NaN") || a.out().contains("Infinity"));
        assertArrayEquals(runsBefore, Files.readAllBytes(campaign.resolveSibling("runs.csv")), "run log untouched");
    }

    @Test
    void writesOnlyWithOutAndNeverOverwritesWithoutForce(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        Path out = tmp.resolve("next.csv");
        CliTest.Outcome a = run("propose", campaign.toString(), "--batch", "1", "--format", "csv", "--out", out.toString());
        assertEquals(0, a.code(), a.err());
        String written = Files.readString(out);
        assertTrue(written.contains("rank,id,yield,t_drop"), written);
        CliTest.Outcome again = run("propose", campaign.toString(), "--batch", "1", "--out", out.toString());
        assertEquals(2, again.code());
        assertEquals(written, Files.readString(out));
        CliTest.Outcome forced = run("propose", campaign.toString(), "--batch", "1", "--format", "json", "--out",
                out.toString(), "--force");
        assertEquals(0, forced.code(), forced.err());
        assertTrue(Files.readString(out).startsWith("{"));
        assertEquals(2, run("propose", campaign.toString(), "--batch", "0").code());
        assertEquals(2, run("propose", campaign.toString(), "--format", "xml").code());
    }

    @Test
    void fewRunsGiveASpaceFillingStartAndSaySo(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        Path runs = campaign.resolveSibling("runs.csv");
        for (String log : List.of(HEADER,
                HEADER + "A,200,3,0.1,1e-5,200,As4,9e10,19,dot,ok\n",
                HEADER + "A,200,3,0.1,1e-5,200,As4,,,,failed\nB,250,3,0.1,1e-5,250,As4,,,,failed\n")) {
            Files.writeString(runs, log);
            CliTest.Outcome o = run("propose", campaign.toString(), "--batch", "3", "--format", "json");
            assertEquals(0, o.code(), o.err());
            JsonNode root = new ObjectMapper().readTree(o.out());
            assertEquals("space-filling start", root.get("mode").asText());
            assertEquals(3, root.get("proposals").size());
            assertTrue(root.get("notes").toString().contains("Latin-hypercube"), root.get("notes").toString());
            assertFalse(o.out().contains("NaN"));
        }
    }

    @Test
    void ranksTheGrowersCandidatesAndFlagsThoseOutsideTheBoxOrLimits(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        Path cands = tmp.resolve("mine.csv");
        Files.writeString(cands, "run_id,t_drop,ga_amount,ga_rate,as_flux,t_cryst,as_source\n"
                + "inside,250,3,0.1,5e-5,240,As4\n"
                + "toohot,380,3,0.1,5e-5,380,As4\n"
                + "ramp,300,3,0.1,5e-5,200,As4\n");
        CliTest.Outcome o = run("rank", campaign.toString(), "--candidates", cands.toString(), "--format", "json");
        assertEquals(0, o.code(), o.err());
        JsonNode ps = new ObjectMapper().readTree(o.out()).get("proposals");
        assertEquals(3, ps.size(), "flagged, not dropped");
        for (JsonNode p : ps) {
            String id = p.get("id").asText();
            if (id.equals("toohot")) {
                assertFalse(p.get("inside_box").asBoolean());
                assertTrue(p.get("flags").toString().contains("outside"));
            } else if (id.equals("ramp")) {
                assertFalse(p.get("keeps_limits").asBoolean());
                assertTrue(p.get("flags").toString().contains("t_cryst >= t_drop - 20"));
            } else {
                assertTrue(p.get("inside_box").asBoolean() && p.get("keeps_limits").asBoolean());
            }
        }
        Files.writeString(cands, "t_drop,ga_amount\n250,abc\n");
        CliTest.Outcome bad = run("rank", campaign.toString(), "--candidates", cands.toString());
        assertEquals(2, bad.code());
        assertTrue(bad.err().contains("mine.csv:2:"), bad.err());
    }

    @Test
    void listsSettingsBeyondTheRunsInJsonAndTableAndKeepsAMarginOnRequest(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        // the ok runs' ga_amount range, read from the demo log here (invented demo data)
        List<String> lines = Files.readAllLines(campaign.resolveSibling("runs.csv")).stream()
                .filter(l -> !l.startsWith("#") && !l.isBlank()).toList();
        List<String> head = List.of(lines.get(0).split(","));
        int col = head.indexOf("ga_amount");
        int st = head.indexOf("status");
        double lo = Double.POSITIVE_INFINITY;
        double hi = Double.NEGATIVE_INFINITY;
        for (String l : lines.subList(1, lines.size())) {
            String[] f = l.split(",", -1);
            if (st >= 0 && f[st].equals("failed")) {
                continue;
            }
            lo = Math.min(lo, Double.parseDouble(f[col]));
            hi = Math.max(hi, Double.parseDouble(f[col]));
        }
        CliTest.Outcome o = run("propose", campaign.toString(), "--batch", "2", "--format", "json");
        assertEquals(0, o.code(), o.err());
        for (JsonNode p : new ObjectMapper().readTree(o.out()).get("proposals")) {
            assertTrue(p.has("beyond_runs"), "key always present");
            double v = p.get("recipe").get("ga_amount").asDouble();
            JsonNode b = p.get("beyond_runs").get("ga_amount");
            assertEquals(v < lo || v > hi, b != null, "ga_amount " + v + " against runs " + lo + " to " + hi);
            if (b != null) {
                assertEquals(lo, b.get("runs_min").asDouble(), 0.0);
                assertEquals(hi, b.get("runs_max").asDouble(), 0.0);
            }
        }
        CliTest.Outcome table = run("propose", campaign.toString(), "--batch", "2");
        if (o.out().contains("\"runs_min\"")) {
            assertTrue(table.out().contains("* = outside the range of the ok runs"), table.out());
            assertTrue(table.out().contains("is beyond the ok runs"), table.out());
        }
        CliTest.Outcome inside = run("propose", campaign.toString(), "--batch", "2", "--format", "json",
                "--within-runs", "0");
        assertEquals(0, inside.code(), inside.err());
        for (JsonNode p : new ObjectMapper().readTree(inside.out()).get("proposals")) {
            assertEquals(0, p.get("beyond_runs").size(), p.toString());
        }
        for (String bad : List.of("11", "-0.1", "NaN")) {
            CliTest.Outcome e = run("propose", campaign.toString(), "--within-runs", bad);
            assertEquals(2, e.code());
            assertTrue(e.err().contains("0 to 10"), e.err());
        }
    }
}
