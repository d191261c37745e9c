package dev.terrace.core.runlog;

import com.fasterxml.jackson.databind.MappingIterator;
import com.fasterxml.jackson.dataformat.csv.CsvMapper;
import com.fasterxml.jackson.dataformat.csv.CsvParser;
import com.fasterxml.jackson.dataformat.csv.CsvSchema;
import dev.terrace.core.Diagnostic;
import dev.terrace.core.InputException;
import dev.terrace.core.campaign.Campaign;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import java.util.stream.Stream;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Appending a run to a run log: every existing byte kept, the file's conventions followed, nothing
 * written on error. The campaign and rows are invented (see {@link RunLogFixtures}).
 */
class RunLogAppenderTest {

    static final String LOG = "# invented test log\n" + RunLogFixtures.FULL_HEADER + "\n"
            + "A07,200,0.1,1.5,1e-6,As4,10,2e10,30,dot,0.5,ok,2026-01-05,,first\n"
            + "# a comment between runs\n"
            + "A08,210,0.1,1.5,1e-6,As4,10,1e10,35,ring,0.4,ok,2026-01-06,,\"second, with comma\"\n";

    static Campaign campaignAt(Path runs) {
        Campaign b = RunLogFixtures.campaign();
        return new Campaign(b.id(), b.title(), b.material(), b.surface(), b.parameters(), b.outcomes(), b.targets(),
                b.limits(), b.models(), runs.resolveSibling("campaign.yaml"), runs);
    }

    static String sha256(byte[] b) throws Exception {
        return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(b));
    }

    static Map<String, String> cells(String... kv) {
        Map<String, String> m = new LinkedHashMap<>();
        for (int i = 0; i < kv.length; i += 2) {
            m.put(kv[i], kv[i + 1]);
        }
        return m;
    }

    @Test
    void keepsEveryExistingByteAndFollowsTheHeaderOrder(@TempDir Path tmp) throws Exception {
        Path runs = tmp.resolve("runs.csv");
        Files.writeString(runs, LOG);
        byte[] before = Files.readAllBytes(runs);
        RunLogAppender.Appended a = RunLogAppender.append(campaignAt(runs),
                cells("notes", "as grown", "t_sub", "205", "density", "1.5e10", "shape", "dot"));
        byte[] after = Files.readAllBytes(runs);
        assertEquals(sha256(before), sha256(Arrays.copyOf(after, before.length)), "sha256 of the old prefix");
        String tail = new String(after, before.length, after.length - before.length, StandardCharsets.UTF_8);
        assertEquals("A09,205,,,,,,1.5e10,,dot,,,,,as grown\n", tail);
        assertEquals("A09", a.runId());
        assertEquals(6, a.line());
        RunLog log = RunLogReader.read(campaignAt(runs));
        assertEquals(3, log.runs().size());
        assertEquals(1.5e10, log.run("A09").orElseThrow().number("density").getAsDouble());
    }

    @Test
    void keepsCrlfLineEndsAndEndsAnUnterminatedLastLineFirst(@TempDir Path tmp) throws Exception {
        Path runs = tmp.resolve("runs.csv");
        String crlf = LOG.replace("\n", "\r\n");
        String unterminated = crlf.substring(0, crlf.length() - 2);
        Files.writeString(runs, unterminated);
        byte[] before = Files.readAllBytes(runs);
        RunLogAppender.append(campaignAt(runs), cells("run_id", "X1", "t_sub", "150"));
        byte[] after = Files.readAllBytes(runs);
        assertArrayEquals(before, Arrays.copyOf(after, before.length));
        String tail = new String(after, before.length, after.length - before.length, StandardCharsets.UTF_8);
        assertEquals("\r\nX1,150,,,,,,,,,,,,,\r\n", tail);
        String all = Files.readString(runs);
        assertEquals(all.split("\n", -1).length - 1, all.split("\r\n", -1).length - 1, "every line ends in CRLF");
        assertTrue(all.contains("# a comment between runs\r\n"), "comment kept");
    }

    @Test
    void quotesCellsThatNeedItPerRfc4180(@TempDir Path tmp) throws Exception {
        Path runs = tmp.resolve("runs.csv");
        Files.writeString(runs, LOG);
        String note = "As cell refilled, \"new\" charge";
        RunLogAppender.append(campaignAt(runs), cells("t_sub", "150", "notes", note, "date", "2026-02-01"));
        // read back with a reference CSV parser (Jackson dataformat-csv, RFC 4180 quoting)
        CsvMapper m = CsvMapper.builder().enable(CsvParser.Feature.SKIP_EMPTY_LINES).build();
        CsvSchema schema = CsvSchema.emptySchema().withHeader().withComments();
        List<Map<String, String>> rows = new ArrayList<>();
        try (MappingIterator<Map<String, String>> it = m.readerFor(Map.class).with(schema).readValues(runs.toFile())) {
            it.forEachRemaining(rows::add);
        }
        assertEquals(3, rows.size());
        assertEquals(note, rows.get(2).get("notes"));
        assertEquals("2026-02-01", rows.get(2).get("date"));
        assertEquals("A09", rows.get(2).get("run_id"));
    }

    @Test
    void aBadValueIsRefusedWithItsArgumentAndTheFileStaysByteIdentical(@TempDir Path tmp) throws Exception {
        Path runs = tmp.resolve("runs.csv");
        Files.writeString(runs, LOG);
        byte[] before = Files.readAllBytes(runs);
        InputException e = assertThrows(InputException.class,
                () -> RunLogAppender.append(campaignAt(runs), cells("t_sub", "2O0", "density", "1e10")));
        Diagnostic d = e.diagnostics().get(0);
        assertTrue(d.isError());
        assertEquals(6, d.line(), d.toString());
        assertTrue(d.message().contains("t_sub=2O0"), d.message());
        assertArrayEquals(before, Files.readAllBytes(runs));
        assertThrows(InputException.class, () -> RunLogAppender.append(campaignAt(runs), cells("t_sub", "999")
                .entrySet().stream().collect(java.util.stream.Collectors.toMap(x -> "tsub", x -> x.getValue()))));
        assertThrows(InputException.class, () -> RunLogAppender.append(campaignAt(runs), cells("run_id", "A07")),
                "a run id already taken");
        assertThrows(InputException.class, () -> RunLogAppender.append(campaignAt(runs), cells("notes", "two\nlines")));
        assertArrayEquals(before, Files.readAllBytes(runs));
        try (Stream<Path> s = Files.list(tmp)) {
            assertEquals(List.of(runs), s.toList(), "no temporary file left");
        }
    }

    @Test
    void aValueOutsideTheBoxIsAWarningLikeInCheck(@TempDir Path tmp) throws Exception {
        Path runs = tmp.resolve("runs.csv");
        Files.writeString(runs, LOG);
        RunLogAppender.Appended a = RunLogAppender.append(campaignAt(runs), cells("t_sub", "350"));
        assertEquals(1, a.warnings().size(), a.warnings().toString());
        assertEquals(6, a.warnings().get(0).line());
    }

    @Test
    void planWritesNothing(@TempDir Path tmp) throws Exception {
        Path runs = tmp.resolve("runs.csv");
        Files.writeString(runs, LOG);
        byte[] before = Files.readAllBytes(runs);
        RunLogAppender.Appended a = RunLogAppender.plan(campaignAt(runs), cells("t_sub", "150"),
                Map.of("date", "2026-03-01", "no_such_column", "x"));
        assertEquals("A09,150,,,,,,,,,,,2026-03-01,,", a.row());
        assertArrayEquals(before, Files.readAllBytes(runs));
    }

    @Test
    void nextFreeIdFollowsTheLastIdAndItsPadding() {
        assertEquals("D15", RunLogAppender.nextFreeId(List.of("D01", "D14", "D02")));
        assertEquals("run-010", RunLogAppender.nextFreeId(List.of("x", "run-009")));
        assertEquals("B3", RunLogAppender.nextFreeId(List.of("A9", "B1", "B2")));
        assertEquals("R1", RunLogAppender.nextFreeId(List.of()));
        assertEquals("R1", RunLogAppender.nextFreeId(List.of("first", "second")));
        assertEquals("R2", RunLogAppender.nextFreeId(List.of("R1x", "R1")));
    }

    @Test
    void twoThreadsRecordingAtOnceBothLand(@TempDir Path tmp) throws Exception {
        Path runs = tmp.resolve("runs.csv");
        Files.writeString(runs, LOG);
        ExecutorService pool = Executors.newFixedThreadPool(2);
        try {
            List<Future<?>> fs = new ArrayList<>();
            for (int t = 0; t < 2; t++) {
                int thread = t;
                fs.add(pool.submit(() -> {
                    for (int k = 0; k < 10; k++) {
                        RunLogAppender.append(campaignAt(runs), cells("notes", "thread " + thread + " run " + k));
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
        RunLog log = RunLogReader.read(campaignAt(runs));
        assertEquals(22, log.runs().size());
        assertEquals(22, log.runs().stream().map(Run::runId).distinct().count());
        assertTrue(Files.readString(runs).startsWith(LOG));
    }

    @Test
    void twoProcessesRecordingAtOnceBothLand(@TempDir Path tmp) throws Exception {
        Path runs = tmp.resolve("runs.csv");
        Files.writeString(runs, LOG);
        String cp = System.getProperty("surefire.test.class.path", System.getProperty("java.class.path"));
        String javaBin = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        List<Process> ps = new ArrayList<>();
        for (String tag : List.of("p", "q")) {
            ps.add(new ProcessBuilder(javaBin, "-XX:TieredStopAtLevel=1", "-cp", cp, RunLogAppendChild.class.getName(),
                    runs.toString(), tag, "25").redirectErrorStream(true)
                    .redirectOutput(tmp.resolve(tag + ".out").toFile()).start());
        }
        for (Process p : ps) {
            assertTrue(p.waitFor(120, java.util.concurrent.TimeUnit.SECONDS), "child finished");
            assertEquals(0, p.exitValue(), Files.readString(tmp.resolve("p.out")) + Files.readString(tmp.resolve("q.out")));
        }
        RunLog log = RunLogReader.read(campaignAt(runs));
        assertEquals(52, log.runs().size(), "no record lost");
        assertEquals(52, log.runs().stream().map(Run::runId).distinct().count());
        assertTrue(Files.readString(runs).startsWith(LOG));
    }

    /**
     * The log read under the lock has the limits of every reader (InputFiles: 1 MiB a line,
     * 50 MiB, regular files only; Terrace's own limits), and a refused log is left byte-identical.
     */
    @Test
    void theLockedReadHasTheLimitsOfEveryReader(@TempDir Path tmp) throws Exception {
        Path runs = tmp.resolve("runs.csv");
        Files.writeString(runs, LOG + "# " + "x".repeat(1024 * 1024) + "\n");
        byte[] before = Files.readAllBytes(runs);
        InputException e = assertThrows(InputException.class,
                () -> RunLogAppender.append(campaignAt(runs), cells("t_sub", "205")));
        assertTrue(e.getMessage().contains("may be at most 1 MiB"), e.getMessage());
        assertEquals(sha256(before), sha256(Files.readAllBytes(runs)));

        Path big = tmp.resolve("big.csv");
        Files.writeString(big, LOG);
        try (java.io.RandomAccessFile f = new java.io.RandomAccessFile(big.toFile(), "rw")) {
            f.setLength(50L * 1024 * 1024 + 1); // sparse
        }
        e = assertThrows(InputException.class, () -> RunLogAppender.append(campaignAt(big), cells("t_sub", "205")));
        assertTrue(e.getMessage().contains("larger than 50 MiB"), e.getMessage());
        assertEquals(50L * 1024 * 1024 + 1, Files.size(big));

        Path folder = Files.createDirectories(tmp.resolve("logdir"));
        e = assertThrows(InputException.class, () -> RunLogAppender.append(campaignAt(folder), cells("t_sub", "205")));
        assertTrue(e.getMessage().contains("is a folder"), e.getMessage());
    }
}
