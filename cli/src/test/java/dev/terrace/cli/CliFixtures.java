package dev.terrace.cli;

import dev.terrace.demo.DemoCampaign;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * What the command-line tests share: running {@code terrace} in-process, a copy of the demo
 * campaign (invented data) in a test's folder, editing a copied file, and SHA-256 hashes that show
 * the inputs were left byte-identical. The members are static; a test class extends this one so
 * that the established names ({@code CliTest.run}, {@code CliSafetyTest.hashes}) stay valid.
 */
abstract class CliFixtures {

    /** A finished command: its exit code and what it printed on each stream. */
    record Outcome(int code, String out, String err) {
    }

    /** Runs the command line through {@link Main#execute}, its error handling and exit codes included. */
    static Outcome run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.execute(new PrintWriter(out, true), new PrintWriter(err, true), args);
        return new Outcome(code, out.toString(), err.toString());
    }

    /** @return the demo campaign file, copied into {@code tmp/demo} */
    static Path demo(Path tmp) throws Exception {
        return DemoCampaign.copyTo(tmp.resolve("demo"));
    }

    /** Replaces text in a copied file, failing when the copy does not hold it. */
    static void edit(Path file, String from, String to) throws Exception {
        String s = Files.readString(file, StandardCharsets.UTF_8);
        assertTrue(s.contains(from), "fixture holds " + from);
        Files.writeString(file, s.replace(from, to), StandardCharsets.UTF_8);
    }

    static String sha256(byte[] bytes) throws Exception {
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
    }

    static String sha256(Path f) throws Exception {
        return sha256(Files.readAllBytes(f));
    }

    /** Hashes of every regular file in the folder (links followed), by name. */
    static Map<String, String> hashes(Path dir) throws Exception {
        Map<String, String> m = new LinkedHashMap<>();
        try (Stream<Path> s = Files.list(dir).sorted()) {
            for (Path p : s.toList()) {
                if (Files.isRegularFile(p)) {
                    m.put(p.getFileName().toString(), sha256(p));
                }
            }
        }
        return m;
    }
}
