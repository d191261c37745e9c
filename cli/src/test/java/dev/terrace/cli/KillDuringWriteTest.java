package dev.terrace.cli;

import dev.terrace.core.io.SafeFiles;
import dev.terrace.demo.DemoCampaign;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.File;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Starts {@code report --out} and {@code propose --out} in a child JVM and kills it (SIGKILL) at
 * seeded random moments, half of them timed to land while the output is being written. Afterwards
 * the target is either absent or byte-equal to a complete run's output, the only leftovers are the
 * clearly named hidden temporary files, and the next complete run removes them. The campaign is the
 * invented demo, cut to its first six runs to keep the test short.
 */
class KillDuringWriteTest {

    /** Seed of the kill moments. */
    private static final long SEED = 20261203L;
    /** Longest a child may take before the test gives up on it. */
    private static final long CHILD_TIMEOUT_S = 300;

    private static List<String> command(String... args) {
        String cp = System.getProperty("surefire.test.class.path", System.getProperty("java.class.path"));
        List<String> cmd = new ArrayList<>(List.of(Path.of(System.getProperty("java.home"), "bin", "java").toString(),
                "-XX:TieredStopAtLevel=1", "-Djava.awt.headless=true", "-cp", cp, Main.class.getName()));
        cmd.addAll(List.of(args));
        return cmd;
    }

    private static Process start(Path dir, String... args) throws Exception {
        ProcessBuilder pb = new ProcessBuilder(command(args)).directory(dir.toFile());
        pb.redirectOutput(ProcessBuilder.Redirect.DISCARD);
        pb.redirectError(dir.resolve("child-err.txt").toFile());
        pb.environment().put("OPENBLAS_NUM_THREADS", "1");
        return pb.start();
    }

    private static List<Path> partials(Path dir, String target) throws Exception {
        try (Stream<Path> s = Files.list(dir)) {
            return s.filter(p -> p.getFileName().toString().startsWith("." + target + SafeFiles.PARTIAL_MARK)).toList();
        }
    }

    private static List<String> otherNames(Path dir, List<String> known) throws Exception {
        try (Stream<Path> s = Files.list(dir)) {
            return s.map(p -> p.getFileName().toString()).filter(n -> !known.contains(n))
                    .filter(n -> !n.contains(SafeFiles.PARTIAL_MARK)).sorted().toList();
        }
    }

    private static Path smallDemo(Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        Path log = campaign.getParent().resolve("runs.csv");
        List<String> lines = Files.readAllLines(log);
        List<String> kept = new ArrayList<>();
        int data = 0;
        for (String l : lines) {
            boolean row = !l.startsWith("#") && !l.startsWith("run_id");
            if (!row || data++ < 6) {
                kept.add(l);
            }
        }
        Files.write(log, kept);
        return campaign;
    }

    @Test
    void aKilledReportOrProposeLeavesNoPartialOutput(@TempDir Path tmp) throws Exception {
        Path campaign = smallDemo(tmp);
        Path dir = campaign.getParent();
        byte[] logBefore = Files.readAllBytes(dir.resolve("runs.csv"));
        byte[] campaignBefore = Files.readAllBytes(campaign);
        Random rnd = new Random(SEED);
        check(dir, rnd, 3, "out.html", "report", campaign.toString(), "--out", "out.html", "--force", "-q");
        check(dir, rnd, 4, "out.json", "propose", campaign.toString(), "--format", "json", "--out", "out.json",
                "--force", "--no-journal", "-q");
        assertArrayEquals(logBefore, Files.readAllBytes(dir.resolve("runs.csv")));
        assertArrayEquals(campaignBefore, Files.readAllBytes(campaign));
    }

    private static void check(Path dir, Random rnd, int kills, String target, String... args) throws Exception {
        Path out = dir.resolve(target);
        List<String> known = List.of("campaign.yaml", "runs.csv", "child-err.txt", "out.html", "out.json",
                "proposals.json", "report.html", "window-map.png");
        List<String> before = otherNames(dir, known);
        List<byte[]> seen = new ArrayList<>();
        for (int k = 0; k < kills; k++) {
            Files.deleteIfExists(out);
            Process p = start(dir, args);
            if (k % 2 == 0) {
                // a random moment of the run
                p.waitFor(rnd.nextInt(4000), TimeUnit.MILLISECONDS);
            } else {
                // a random moment after the temporary file appeared: inside the write itself
                int delayUs = rnd.nextInt(3000);
                long until = System.nanoTime() + TimeUnit.SECONDS.toNanos(CHILD_TIMEOUT_S);
                while (p.isAlive() && partials(dir, target).isEmpty() && System.nanoTime() < until) {
                    Thread.onSpinWait();
                }
                TimeUnit.MICROSECONDS.sleep(delayUs);
            }
            p.destroyForcibly();
            assertTrue(p.waitFor(CHILD_TIMEOUT_S, TimeUnit.SECONDS));
            if (Files.exists(out)) {
                seen.add(Files.readAllBytes(out));
            }
            assertEquals(before, otherNames(dir, known), "nothing but hidden temporary files is left");
            for (Path partial : partials(dir, target)) {
                String name = partial.getFileName().toString();
                assertTrue(name.startsWith(".") && !name.endsWith(".html") && !name.endsWith(".json"), name);
            }
        }
        Files.deleteIfExists(out);
        Process full = start(dir, args);
        assertTrue(full.waitFor(CHILD_TIMEOUT_S, TimeUnit.SECONDS));
        assertEquals(0, full.exitValue(), Files.readString(dir.resolve("child-err.txt")));
        byte[] complete = Files.readAllBytes(out);
        for (byte[] b : seen) {
            assertArrayEquals(complete, b, "a target left by a killed run is the complete output");
        }
        assertEquals(List.of(), partials(dir, target), "the next complete run removes the leftovers");
    }
}
