package dev.terrace.cli;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.demo.DemoCampaign;
import org.junit.jupiter.api.AfterEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.RandomAccessFile;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static dev.terrace.cli.CliTest.run;
import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Run logs too large to use are refused with a message naming the limit and exit code 2, never an
 * internal error, and the log is left as it was. A million runs of the demo campaign take about
 * 140 MB of CSV, above the 50 MiB read limit; the test stands in for such a log with a sparse file
 * of 51 MiB, which the size check refuses before reading a byte, so it stays fast (test design
 * choice). The run-count limit of the model commands is lowered through
 * {@link LoadedCampaign#MAX_MODEL_RUNS_PROPERTY} so the bundled demo log (invented data) exceeds it.
 */
class LargeRunLogTest {

    @AfterEach
    void clearLimit() {
        System.clearProperty(LoadedCampaign.MAX_MODEL_RUNS_PROPERTY);
    }

    @Test
    void aLogAboveTheReadLimitIsRefusedCleanlyByEveryCommand(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        Path runs = campaign.resolveSibling("runs.csv");
        String header = Files.readAllLines(runs).stream().filter(l -> l.startsWith("run_id")).findFirst().orElseThrow();
        Files.writeString(runs, header + "\n");
        try (RandomAccessFile f = new RandomAccessFile(runs.toFile(), "rw")) {
            f.setLength(51L * 1024 * 1024);
        }
        long size = Files.size(runs);
        for (List<String> cmd : List.of(List.of("check"), List.of("propose", "--batch", "2"), List.of("fit"),
                List.of("validate"))) {
            String[] args = new String[cmd.size() + 1];
            args[0] = cmd.get(0);
            args[1] = campaign.toString();
            for (int i = 1; i < cmd.size(); i++) {
                args[i + 1] = cmd.get(i);
            }
            CliTest.Outcome o = run(args);
            assertEquals(2, o.code(), cmd + ": " + o.err());
            assertTrue(o.err().contains("the run log is larger than 50 MiB, the most Terrace reads"), cmd + ": " + o.err());
            assertTrue(o.err().contains(runs.toString()), "names the file: " + o.err());
            assertFalse(o.err().contains("internal error") || o.err().contains("Exception") || o.err().contains("\tat "),
                    cmd + ": no stack trace: " + o.err());
        }
        assertEquals(size, Files.size(runs), "the log is untouched");
        assertArrayEquals((header + "\n").getBytes(StandardCharsets.UTF_8),
                java.util.Arrays.copyOf(Files.readAllBytes(runs), header.length() + 1));
    }

    @Test
    void aLogAboveTheRunLimitIsRefusedByTheModelCommandsAndStillChecked(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        System.setProperty(LoadedCampaign.MAX_MODEL_RUNS_PROPERTY, "10");
        for (String cmd : List.of("propose", "fit", "validate", "rank")) {
            CliTest.Outcome o = cmd.equals("rank")
                    ? run(cmd, campaign.toString(), "--candidates", campaign.resolveSibling("runs.csv").toString())
                    : run(cmd, campaign.toString());
            assertEquals(2, o.code(), cmd + ": " + o.err());
            assertTrue(o.err().contains("Terrace fits models and proposes from at most 10 runs"), cmd + ": " + o.err());
            assertFalse(o.err().contains("internal error") || o.err().contains("\tat "), cmd + ": " + o.err());
        }
        CliTest.Outcome check = run("check", campaign.toString());
        assertEquals(0, check.code(), check.err());
        assertTrue(check.out().contains("Runs: "), check.out());
    }
}
