package dev.terrace.cli;

import dev.terrace.demo.DemoCampaign;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.TreeMap;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Same seed, same bytes: every command that writes files runs twice with the same seed and
 * SOURCE_DATE_EPOCH (the reproducible-builds.org variable) into two folders, and every file the two
 * runs write is compared byte for byte (SHA-256). The demo campaign is invented data.
 */
class ReproducibleBytesTest {

    /** 2026-01-01T00:00:00Z, as {@code date -u -d 2026-01-01 +%s} prints it. */
    static final String EPOCH = "1767225600";

    /** Commands that write files, each run below. */
    static final Set<String> WRITERS = Set.of("init", "demo", "propose", "record", "rank", "map", "fit", "validate",
            "report");
    /** Commands that only print (bench --speed writes only temporary files it deletes). */
    static final Set<String> PRINTERS = Set.of("check", "flux", "models", "bench", "help");

    static String run(Map<String, String> env, String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.execute(new PrintWriter(out, true), new PrintWriter(err, true), env, args);
        assertEquals(0, code, String.join(" ", args) + ": " + err);
        return out.toString();
    }

    /** Runs every file-writing command into {@code root}; returns the standard output of each. */
    static List<String> writeEverything(Path root) throws Exception {
        Map<String, String> env = Map.of("SOURCE_DATE_EPOCH", EPOCH);
        Path campaign = DemoCampaign.copyTo(root.resolve("demo"));
        Path out = Files.createDirectories(root.resolve("out"));
        String c = campaign.toString();
        Path cands = Files.writeString(root.resolve("cands.csv"),
                "run_id,t_drop,ga_amount,ga_rate,as_flux,t_cryst,as_source\nK1,250,3,0.1,1e-6,300,As4\n"
                        + "K2,200,2,0.05,1e-5,220,As2\n");
        List<String> printed = new ArrayList<>();
        printed.add(run(env, "init", out.resolve("new").toString()));
        printed.add(run(env, "demo", "--dir", out.resolve("demo-copy").toString(), "-q").replace(root.toString(), "ROOT"));
        for (String f : List.of("csv", "json", "table")) {
            printed.add(run(env, "propose", c, "--batch", "2", "--seed", "5", "--format", f, "--out",
                    out.resolve("proposals-" + f + ".txt").toString(), "-q"));
        }
        // the journal (written beside the campaign) and the run log after record are compared too
        printed.add(run(env, "record", c, "t_drop=250", "ga_amount=3", "ga_rate=0.1", "as_flux=3.2e-6", "t_cryst=250",
                "as_source=As2", "dot_density=1.2e10", "dot_diameter=30", "shape=dot", "-q"));
        printed.add(run(env, "rank", c, "--candidates", cands.toString(), "--seed", "5", "--format", "csv", "--out",
                out.resolve("ranked.csv").toString(), "-q"));
        for (String f : List.of("svg", "png")) {
            printed.add(run(env, "map", c, "--x", "t_drop", "--y", "t_cryst", "--grid", "9", "--seed", "5", "--out",
                    out.resolve("map." + f).toString(), "-q"));
        }
        printed.add(run(env, "map", c, "--pareto", "growth-time", "--seed", "5", "--out",
                out.resolve("pareto.svg").toString(), "-q"));
        printed.add(run(env, "fit", c, "--seed", "5", "--plot", out.resolve("fit.svg").toString(), "-q"));
        printed.add(run(env, "validate", c, "--seed", "5", "--plots", out.resolve("parity").toString(), "-q"));
        printed.add(run(env, "report", c, "--seed", "5", "--out", out.resolve("report.html").toString(), "-q"));
        return printed;
    }

    /** SHA-256 of every regular file below {@code dir}, by relative path. */
    static Map<String, String> tree(Path dir) throws Exception {
        Map<String, String> m = new TreeMap<>();
        try (Stream<Path> s = Files.walk(dir)) {
            for (Path p : s.filter(Files::isRegularFile).toList()) {
                m.put(dir.relativize(p).toString(), CliSafetyTest.sha256(p));
            }
        }
        return m;
    }

    @Test
    void theListOfFileWritingCommandsCoversEverySubcommandOfMain() {
        Set<String> all = new HashSet<>(Main.commandLine().getSubcommands().keySet());
        Set<String> listed = new HashSet<>(WRITERS);
        listed.addAll(PRINTERS);
        assertEquals(all, listed, "a new command: add it to WRITERS (and run it in writeEverything) or PRINTERS");
    }

    @Test
    void everyFileWritingCommandWritesTheSameBytesTwiceWithTheSameSeed(@TempDir Path tmp) throws Exception {
        List<String> printedA = writeEverything(tmp.resolve("a"));
        List<String> printedB = writeEverything(tmp.resolve("b"));
        Map<String, String> a = tree(tmp.resolve("a"));
        Map<String, String> b = tree(tmp.resolve("b"));
        for (String expected : List.of("out/new/campaign.yaml", "out/new/runs.csv", "out/demo-copy/campaign.yaml",
                "out/proposals-csv.txt", "out/proposals-json.txt", "out/proposals-table.txt", "out/ranked.csv",
                "out/map.svg", "out/map.png", "out/pareto.svg", "out/fit.svg", "out/report.html", "demo/journal.jsonl",
                "demo/runs.csv")) {
            assertTrue(a.containsKey(expected), expected + " written: " + a.keySet());
        }
        assertTrue(a.keySet().stream().anyMatch(k -> k.startsWith("out/parity/")), "validate wrote its plots: " + a.keySet());
        Map<String, String> differ = new LinkedHashMap<>();
        a.forEach((k, v) -> {
            if (!v.equals(b.get(k))) {
                differ.put(k, v + " / " + b.get(k));
            }
        });
        assertEquals(a.keySet(), b.keySet());
        assertTrue(differ.isEmpty(), "files whose bytes differ between the two runs: " + differ);
        String report = Files.readString(tmp.resolve("a/out/report.html"));
        assertTrue(report.contains("2026-01-01"), "the report carries SOURCE_DATE_EPOCH's date");
        String journal = Files.readString(tmp.resolve("a/demo/journal.jsonl"));
        assertTrue(journal.contains("2026-01-01T00:00:00Z"), "the journal's time stamps follow SOURCE_DATE_EPOCH: " + journal);
        List<String> log = Files.readAllLines(tmp.resolve("a/demo/runs.csv"));
        assertTrue(log.get(log.size() - 1).contains(",2026-01-01,"), "record's default date follows SOURCE_DATE_EPOCH: "
                + log.get(log.size() - 1));
        assertEquals(printedA.size(), printedB.size());
        for (int i = 0; i < printedA.size(); i++) {
            assertEquals(printedA.get(i).replace(tmp.resolve("a").toString(), "ROOT"),
                    printedB.get(i).replace(tmp.resolve("b").toString(), "ROOT"), "standard output of command " + i);
        }
    }

    @Test
    void aMalformedSourceDateEpochIsAUsageError(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        Map<String, String> before = CliSafetyTest.hashes(campaign.getParent());
        StringWriter err = new StringWriter();
        int code = Main.execute(new PrintWriter(new StringWriter(), true), new PrintWriter(err, true),
                Map.of("SOURCE_DATE_EPOCH", "2026-01-01"), "report", campaign.toString(), "--out",
                tmp.resolve("r.html").toString(), "-q");
        assertEquals(2, code, err.toString());
        assertTrue(err.toString().contains("SOURCE_DATE_EPOCH must be a whole number of seconds since"
                + " 1970-01-01T00:00:00Z, as 'date +%s' prints it, found '2026-01-01'"), err.toString());
        assertFalse(Files.exists(tmp.resolve("r.html")));
        assertEquals(before, CliSafetyTest.hashes(campaign.getParent()));
    }
}
