package dev.terrace.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.io.RandomAccessFile;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Each failure of the data-safety review: the exit code, a message naming the path or option and
 * what was expected, and the SHA-256 of every input file unchanged. The demo campaign is invented data.
 */
class CliSafetyTest extends CliFixtures {

    static void assertRefused(Outcome o, String... fragments) {
        assertEquals(2, o.code(), o.err());
        for (String f : fragments) {
            assertTrue(o.err().contains(f), "expected '" + f + "' in: " + o.err());
        }
        assertFalse(o.err().contains("\tat "), "no stack trace without --debug: " + o.err());
        assertFalse(o.err().startsWith("wrote") || o.err().contains("\nwrote "), o.err());
    }

    @Test
    void theRunLogAndCampaignFileAreNeverReplacedByAnyName(@TempDir Path tmp) throws Exception {
        Path campaign = demo(tmp);
        Path dir = campaign.getParent();
        Path log = dir.resolve("runs.csv");
        Files.createSymbolicLink(dir.resolve("alias.csv"), Path.of("runs.csv"));
        Files.createLink(dir.resolve("hard.csv"), log);
        Files.createDirectories(dir.resolve("sub"));
        Files.createSymbolicLink(dir.resolve("log.png"), Path.of("runs.csv"));
        Map<String, String> before = hashes(dir);
        for (String out : List.of(log.toString(), dir.resolve("alias.csv").toString(), dir.resolve("sub/../runs.csv").toString(),
                dir.resolve("hard.csv").toString())) {
            assertRefused(run("propose", campaign.toString(), "--out", out, "--force", "-q"), out, log.toString(),
                    "never writes over its inputs");
        }
        assertRefused(run("report", campaign.toString(), "--out", campaign.toString(), "--force", "-q"),
                campaign.toString(), "campaign file");
        assertRefused(run("map", campaign.toString(), "--x", "t_drop", "--y", "ga_amount", "--out",
                dir.resolve("log.png").toString(), "--force", "-q"), "log.png", log.toString());
        assertEquals(before, hashes(dir));
        assertTrue(Files.isSymbolicLink(dir.resolve("alias.csv")), "the grower's link is kept");
    }

    @Test
    void theCandidatesFileIsNeverReplaced(@TempDir Path tmp) throws Exception {
        Path campaign = demo(tmp);
        Path dir = campaign.getParent();
        Path cands = dir.resolve("cands.csv");
        Files.writeString(cands, "run_id,t_drop,ga_amount,ga_rate,as_flux,t_cryst,as_source\nK1,250,3,0.1,1e-6,300,As4\n");
        Map<String, String> before = hashes(dir);
        assertRefused(run("rank", campaign.toString(), "--candidates", cands.toString(), "--out", cands.toString(),
                "--force", "-q"), cands.toString(), "candidates file");
        assertEquals(before, hashes(dir));
    }

    @Test
    void outputsThatAreNotRegularFilesAreRefusedAndNothingIsWritten(@TempDir Path tmp) throws Exception {
        Path campaign = demo(tmp);
        Path dir = campaign.getParent();
        Path folder = Files.createDirectories(dir.resolve("plots"));
        Path note = Files.writeString(dir.resolve("note.txt"), "keep me");
        Path fifo = dir.resolve("pipe.csv");
        boolean fifoMade = new ProcessBuilder("mkfifo", fifo.toString()).start().waitFor() == 0;
        Map<String, String> before = hashes(dir);
        assertRefused(run("propose", campaign.toString(), "--out", folder.toString(), "--force", "-q"),
                folder.toString(), "a folder");
        assertRefused(run("propose", campaign.toString(), "--out", note.resolve("p.csv").toString(), "-q"),
                note.toString(), "not a folder");
        assertRefused(run("propose", campaign.toString(), "--out", dir.resolve("missing/p.csv").toString(), "-q"),
                "missing", "does not exist");
        if (fifoMade) {
            assertRefused(run("propose", campaign.toString(), "--out", fifo.toString(), "--force", "-q"),
                    fifo.toString(), "not a regular file");
            assertFalse(Files.isRegularFile(fifo), "the FIFO is not replaced by a file");
        }
        assertEquals(before, hashes(dir));
    }

    @Test
    void inputsThatAreNotRegularTextFilesOfSaneSizeAreRefusedAtOnce(@TempDir Path tmp) throws Exception {
        Path campaign = demo(tmp);
        Path dir = campaign.getParent();
        String yaml = Files.readString(campaign);
        // the campaign file is a folder
        assertRefused(run("check", dir.toString()), dir.toString(), "is a folder");
        // the run log is a folder, a FIFO, a file above the size limit
        Path logDir = Files.createDirectories(dir.resolve("logdir"));
        Path c1 = Files.writeString(dir.resolve("c1.yaml"), yaml.replace("runs: runs.csv", "runs: logdir"));
        assertRefused(run("check", c1.toString()), logDir.toString(), "is a folder");
        Path fifo = dir.resolve("log.fifo");
        if (new ProcessBuilder("mkfifo", fifo.toString()).start().waitFor() == 0) {
            Path c2 = Files.writeString(dir.resolve("c2.yaml"), yaml.replace("runs: runs.csv", "runs: log.fifo"));
            assertRefused(run("check", c2.toString()), fifo.toString(), "not a regular file");
        }
        Path big = dir.resolve("big.csv");
        try (RandomAccessFile r = new RandomAccessFile(big.toFile(), "rw")) {
            r.setLength(50L * 1024 * 1024 + 1); // sparse
        }
        Path c3 = Files.writeString(dir.resolve("c3.yaml"), yaml.replace("runs: runs.csv", "runs: big.csv"));
        assertRefused(run("check", c3.toString()), big.toString(), "larger than 50 MiB");
        // a single huge YAML value is refused by the line limit before the YAML scanner sees it
        Path huge = Files.writeString(dir.resolve("huge.yaml"), yaml.replaceFirst("title: ", "title: " + "x".repeat(2 << 20)));
        assertRefused(run("check", huge.toString()), huge.toString(), "at most 64 KiB");
        Map<String, String> before = hashes(dir);
        assertEquals(before, hashes(dir));
    }

    @Test
    void optionsOutOfRangeAreUsageErrorsNamingTheRange(@TempDir Path tmp) throws Exception {
        Path campaign = demo(tmp);
        Map<String, String> before = hashes(campaign.getParent());
        assertRefused(run("propose", campaign.toString(), "--explore", "1e9"), "--explore", "0 to 10");
        assertRefused(run("propose", campaign.toString(), "--batch", "0"), "--batch", "1 to 100");
        assertRefused(run("propose", campaign.toString(), "--batch", "101"), "--batch", "1 to 100");
        assertRefused(run("map", campaign.toString(), "--x", "t_drop", "--y", "ga_amount", "--grid", "100000"),
                "--grid", "5 to 200");
        assertRefused(run("propose", campaign.toString(), "--plugins", tmp.resolve("no-such-folder").toString()),
                "--plugins", "no-such-folder", "does not exist");
        assertEquals(before, hashes(campaign.getParent()));
    }

    @Test
    void rankingWithNoCompleteCandidateIsAUsageErrorNamingTheMissingSettings(@TempDir Path tmp) throws Exception {
        Path campaign = demo(tmp);
        Path cands = Files.writeString(campaign.getParent().resolve("cands.csv"), "run_id,t_drop,ga_amount,ga_rate,as_flux,t_cryst,as_source\nK1,250,3,,,,\n");
        Map<String, String> before = hashes(campaign.getParent());
        assertRefused(run("rank", campaign.toString(), "--candidates", cands.toString(), "-q"),
                cands.toString(), "K1 has no ga_rate, as_flux, t_cryst, as_source");
        assertEquals(before, hashes(campaign.getParent()));
    }

    @Test
    void fileSystemRefusalsNameThePath() throws IOException {
        assertEquals("/x/y is a folder; expected a file",
                Main.fileProblem(new java.nio.file.FileSystemException("/x/y", null, "Is a directory")));
        assertEquals("/x/y does not exist; expected an existing file or folder",
                Main.fileProblem(new java.nio.file.NoSuchFileException("/x/y")));
    }
}
