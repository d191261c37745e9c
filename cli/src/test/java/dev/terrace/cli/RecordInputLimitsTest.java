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

import static dev.terrace.cli.CliFixtures.run;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * {@code terrace record} reads the run log with the same limits as every other command (50 MiB,
 * 1 MiB a line, regular files only; the limits of {@code InputFiles}, Terrace's own choice) and
 * leaves a refused log byte-identical (SHA-256). The demo campaign is invented data; the
 * oversized log is a sparse file so the test stays fast (test design choice).
 */
class RecordInputLimitsTest {

    @AfterEach
    void clearLimit() {
        System.clearProperty(LoadedCampaign.MAX_MODEL_RUNS_PROPERTY);
    }

    private static void assertRefused(CliFixtures.Outcome o, String... fragments) {
        assertEquals(2, o.code(), o.err());
        for (String f : fragments) {
            assertTrue(o.err().contains(f), "expected '" + f + "' in: " + o.err());
        }
        assertFalse(o.err().contains("internal error") || o.err().contains("\tat "), "no stack trace: " + o.err());
        assertFalse(o.out().contains("Recorded run"), o.out());
    }

    @Test
    void aLogAboveTheSizeLimitIsRefusedAndLeftByteIdentical(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        Path log = campaign.resolveSibling("runs.csv");
        try (RandomAccessFile f = new RandomAccessFile(log.toFile(), "rw")) {
            f.setLength(50L * 1024 * 1024 + 1); // the demo log, then zeros: one byte above the limit
        }
        String before = CliFixtures.sha256(log);
        assertRefused(run("record", campaign.toString(), "t_drop=250", "status=failed"), log.toString(),
                "larger than 50 MiB");
        assertRefused(run("record", campaign.toString(), "--dry-run", "t_drop=250", "status=failed"), log.toString(),
                "larger than 50 MiB");
        assertEquals(before, CliFixtures.sha256(log));
    }

    @Test
    void aLogWithALineAboveTheLineLimitIsRefusedAndLeftByteIdentical(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        Path log = campaign.resolveSibling("runs.csv");
        Files.writeString(log, Files.readString(log) + "# " + "x".repeat(1024 * 1024) + "\n");
        String before = CliFixtures.sha256(log);
        assertRefused(run("record", campaign.toString(), "t_drop=250", "status=failed"), log.toString(),
                "may be at most 1 MiB");
        assertEquals(before, CliFixtures.sha256(log));
    }

    @Test
    void aLogThatIsAFolderOrAFifoIsRefusedWithoutBeingOpened(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        Path dir = campaign.getParent();
        String yaml = Files.readString(campaign, StandardCharsets.UTF_8);
        Path folder = Files.createDirectories(dir.resolve("logdir"));
        Path c1 = Files.writeString(dir.resolve("c1.yaml"), yaml.replace("runs: runs.csv", "runs: logdir"));
        assertRefused(run("record", c1.toString(), "t_drop=250", "status=failed"), folder.toString(), "is a folder");
        try (var s = Files.list(folder)) {
            assertEquals(0, s.count(), "nothing is written into the folder");
        }
        Path fifo = dir.resolve("log.fifo");
        if (new ProcessBuilder("mkfifo", fifo.toString()).start().waitFor() == 0) {
            Path c2 = Files.writeString(dir.resolve("c2.yaml"), yaml.replace("runs: runs.csv", "runs: log.fifo"));
            assertRefused(run("record", c2.toString(), "t_drop=250", "status=failed"), fifo.toString(),
                    "not a regular file");
            assertFalse(Files.isRegularFile(fifo), "the FIFO is not replaced by a file");
        }
    }

    @Test
    void recordingDoesNotFitModelsSoTheModelRunLimitDoesNotApply(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        System.setProperty(LoadedCampaign.MAX_MODEL_RUNS_PROPERTY, "3");
        CliFixtures.Outcome o = run("record", campaign.toString(), "--dry-run", "t_drop=250", "status=failed");
        assertEquals(0, o.code(), o.err());
        assertTrue(o.out().startsWith("Would record run "), o.out());
    }
}
