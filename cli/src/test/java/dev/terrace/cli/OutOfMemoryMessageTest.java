package dev.terrace.cli;

import dev.terrace.demo.DemoCampaign;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * A job that runs out of Java heap ends with one plain message and exit code 1, never a stack
 * trace or an "internal error", also when the heap runs out in a worker thread (the surrogates are
 * fitted on two threads). The child JVM gets an 8 MiB heap, which the demo's propose exceeds.
 * The demo campaign is invented data.
 */
class OutOfMemoryMessageTest {

    @Test
    void proposeWithATinyHeapSaysOutOfMemory(@TempDir Path tmp) throws Exception {
        Path campaign = DemoCampaign.copyTo(tmp.resolve("demo"));
        String cp = System.getProperty("surefire.test.class.path", System.getProperty("java.class.path"));
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        List<String> cmd = new ArrayList<>(List.of(java, "-Xmx8m", "-cp", cp, "dev.terrace.cli.Main", "propose",
                campaign.toString(), "--no-journal", "--quiet"));
        Process p = new ProcessBuilder(cmd).redirectOutput(ProcessBuilder.Redirect.DISCARD)
                .redirectError(tmp.resolve("err.txt").toFile()).start();
        int code = p.waitFor();
        String err = Files.readString(tmp.resolve("err.txt"), StandardCharsets.UTF_8);
        assertEquals(1, code, err);
        assertTrue(err.contains("terrace: out of memory: the job needs more than the"), err);
        assertFalse(err.contains("internal error") || err.contains("\tat "), "no stack trace: " + err);
    }
}
