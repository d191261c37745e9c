package dev.terrace.core.journal;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import dev.terrace.core.Diagnostic;
import dev.terrace.core.io.OutputRefusedException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.concurrent.TimeUnit;

import static dev.terrace.core.journal.JournalFixtures.CAMPAIGN;
import static dev.terrace.core.journal.JournalFixtures.batch;
import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * The proposal journal. Its file is JSON Lines (jsonlines.org: UTF-8, one complete JSON value per
 * line, each line ended by \n); every line is checked with a reference JSON parser (Jackson).
 */
class JournalTest {

    static final Instant T1 = Instant.parse("2026-03-01T10:00:00Z");
    static final Instant T2 = Instant.parse("2026-03-08T10:00:00Z");

    /** Every line parses alone as a JSON object, and the file ends with \n (JSON Lines). */
    static void assertJsonLines(Path file) throws Exception {
        byte[] b = Files.readAllBytes(file);
        assertEquals('\n', b[b.length - 1], "the last line is ended");
        ObjectMapper om = new ObjectMapper();
        String[] lines = new String(b, StandardCharsets.UTF_8).split("\n");
        for (int i = 0; i < lines.length; i++) {
            JsonNode n = om.readTree(lines[i]);
            assertTrue(n.isObject(), "line " + (i + 1) + " of " + lines.length + ": '" + lines[i] + "'");
        }
    }

    @Test
    void appendsOneLinePerBatchAndReadsItBack(@TempDir Path tmp) throws Exception {
        Path file = tmp.resolve("journal.jsonl");
        Journal.append(file, batch("a", 2, T1));
        byte[] first = Files.readAllBytes(file);
        Journal.append(file, batch("b", 3, T2));
        byte[] both = Files.readAllBytes(file);
        assertArrayEquals(first, Arrays.copyOf(both, first.length), "earlier lines are never rewritten");
        assertJsonLines(file);
        Journal j = Journal.read(file, CAMPAIGN);
        assertEquals(List.of(), j.warnings());
        assertEquals(2, j.entries().size());
        assertEquals(batch("b", 3, T2).atLine(2), j.entries().get(1));
        assertEquals(1, j.entries().get(0).line());
        JournalProposal p = j.entries().get(1).proposals().get(0);
        assertEquals(3.2e-6, (Double) p.recipe().get("as_bep"), 0.0);
        assertEquals("As4", p.recipe().get("as_species"));
        assertEquals(List.of("t_sub", "as_bep", "as_species"), List.copyOf(p.recipe().keySet()), "campaign order");
    }

    @Test
    void aMissingJournalIsEmpty(@TempDir Path tmp) throws Exception {
        Journal j = Journal.read(tmp.resolve("journal.jsonl"), CAMPAIGN);
        assertTrue(j.entries().isEmpty() && j.warnings().isEmpty());
        assertTrue(j.latest().isEmpty());
    }

    @Test
    void aTornLastLineIsIgnoredWithAWarningAndTheNextAppendStartsANewLine(@TempDir Path tmp) throws Exception {
        Path file = tmp.resolve("journal.jsonl");
        Journal.append(file, batch("a", 2, T1));
        String whole = Files.readString(file);
        // a crash in the middle of the second write: half a line, no line end
        Files.writeString(file, whole + whole.substring(0, whole.length() / 2));
        Journal torn = Journal.read(file, CAMPAIGN);
        assertEquals(1, torn.entries().size());
        assertEquals(1, torn.warnings().size());
        Diagnostic w = torn.warnings().get(0);
        assertEquals(2, w.line());
        assertTrue(w.message().contains("incomplete") && w.message().contains("ignored"), w.message());
        Journal.append(file, batch("b", 1, T2));
        Journal after = Journal.read(file, CAMPAIGN);
        assertEquals(2, after.entries().size(), "the new batch is whole, not glued to the torn line");
        assertEquals("P-b-1", after.entries().get(1).proposals().get(0).id());
        assertEquals(3, after.entries().get(1).line());
        assertEquals(1, after.warnings().size());
        assertEquals(2, after.warnings().get(0).line());
    }

    @Test
    void linesOfAnotherCampaignOrLayoutAreSkippedWithAWarning(@TempDir Path tmp) throws Exception {
        Path file = tmp.resolve("journal.jsonl");
        Journal.append(file, batch("a", 1, T1));
        String line = Files.readString(file);
        Files.writeString(file, line + line.replace("\"journal-test\"", "\"other\"")
                + line.replace("\"terrace_journal\":1", "\"terrace_journal\":9") + "[1,2]\n");
        Journal j = Journal.read(file, CAMPAIGN);
        assertEquals(1, j.entries().size());
        assertEquals(List.of(2, 3, 4), j.warnings().stream().map(Diagnostic::line).toList());
        assertTrue(j.warnings().get(0).message().contains("'other'"));
        assertTrue(j.warnings().get(1).message().contains("version 9"));
    }

    @Test
    void findsTheLatestBatchMadeOnOrBeforeTheRunDate(@TempDir Path tmp) throws Exception {
        Path file = tmp.resolve("journal.jsonl");
        Journal.append(file, batch("a", 2, T1));
        Journal.append(file, batch("a", 2, T2)); // the same ids proposed again a week later
        Journal j = Journal.read(file, CAMPAIGN);
        assertEquals(T1, j.find("P-a-1", LocalDate.of(2026, 3, 5)).orElseThrow().entry().time());
        assertEquals(T2, j.find("P-a-1", LocalDate.of(2026, 3, 8)).orElseThrow().entry().time());
        assertEquals(T2, j.find("P-a-1", null).orElseThrow().entry().time());
        assertEquals(T2, j.find("P-a-1", LocalDate.of(2026, 2, 1)).orElseThrow().entry().time(),
                "a run dated before every batch still finds the latest");
        assertTrue(j.find("P-zz", null).isEmpty());
    }

    @Test
    void twoThreadsAppendingAtOnceEachWriteWholeLines(@TempDir Path tmp) throws Exception {
        Path file = tmp.resolve("journal.jsonl");
        ExecutorService pool = Executors.newFixedThreadPool(2);
        try {
            List<Future<?>> fs = new ArrayList<>();
            for (String tag : List.of("x", "y")) {
                fs.add(pool.submit(() -> {
                    for (int k = 0; k < 40; k++) {
                        Journal.append(file, batch(tag + k, 5, T1));
                    }
                    return null;
                }));
            }
            for (Future<?> f : fs) {
                f.get();
            }
        } finally {
            pool.shutdownNow();
        }
        assertJsonLines(file);
        Journal j = Journal.read(file, CAMPAIGN);
        assertEquals(List.of(), j.warnings());
        assertEquals(80, j.entries().size());
    }

    @Test
    void twoProcessesAppendingAtOnceEachWriteWholeLines(@TempDir Path tmp) throws Exception {
        Path file = tmp.resolve("journal.jsonl");
        String cp = System.getProperty("surefire.test.class.path", System.getProperty("java.class.path"));
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        List<Process> ps = new ArrayList<>();
        for (String tag : List.of("p", "q")) {
            ps.add(new ProcessBuilder(java, "-XX:TieredStopAtLevel=1", "-cp", cp, JournalAppendChild.class.getName(),
                    file.toString(), tag, "60").redirectErrorStream(true)
                    .redirectOutput(tmp.resolve(tag + ".out").toFile()).start());
        }
        for (Process p : ps) {
            assertTrue(p.waitFor(120, TimeUnit.SECONDS), "child finished");
            assertEquals(0, p.exitValue(), Files.readString(tmp.resolve("p.out")) + Files.readString(tmp.resolve("q.out")));
        }
        assertJsonLines(file);
        Journal j = Journal.read(file, CAMPAIGN);
        assertEquals(List.of(), j.warnings());
        assertEquals(120, j.entries().size());
        Set<String> ids = new HashSet<>();
        j.entries().forEach(e -> ids.add(e.proposals().get(0).id()));
        assertEquals(120, ids.size(), "every batch of both processes is there once");
    }

    @Test
    void aFolderIsNoJournal(@TempDir Path tmp) throws Exception {
        Path dir = Files.createDirectory(tmp.resolve("journal.jsonl"));
        assertThrows(OutputRefusedException.class, () -> Journal.append(dir, batch("a", 1, T1)));
        assertThrows(OutputRefusedException.class, () -> Journal.append(tmp.resolve("missing/journal.jsonl"),
                batch("a", 1, T1)));
        assertThrows(dev.terrace.core.InputException.class, () -> Journal.read(dir, CAMPAIGN));
    }

    @Test
    void valuesCheckTheirInvariants() {
        assertThrows(IllegalArgumentException.class, () -> new JournalProposal("P-1", 1, 1.5, java.util.Map.of(),
                java.util.Map.of(), java.util.Map.of()));
        assertThrows(IllegalArgumentException.class, () -> new JournalProposal("P-1", 0, 0.5, java.util.Map.of(),
                java.util.Map.of(), java.util.Map.of()));
        assertThrows(IllegalArgumentException.class, () -> new JournalProposal.Predicted(1, 1, 2, 1));
        assertThrows(IllegalArgumentException.class, () -> new JournalEntry(T1, CAMPAIGN, "abc",
                JournalFixtures.SHA_B, 1, 1, 1, "search", List.of(), 0));
    }
}
