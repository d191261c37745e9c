package dev.terrace.core.runlog;

import dev.terrace.core.Diagnostic;
import dev.terrace.core.InputException;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.campaign.Scale;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.Tuple;

import java.io.IOException;
import java.io.StringReader;
import java.time.LocalDate;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Random;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Property tests of {@link RunLogReader}: malformed text never escapes as anything but an
 * {@link InputException} whose diagnostics all point into the file, and a valid row written with
 * RFC 4180 quoting reads back as the same run.
 */
class RunLogPropertyTest {

    private static final Campaign CAMPAIGN = RunLogFixtures.campaign();

    /** Cell texts chosen to hit the reader's edge cases. */
    private static final List<String> NASTY_CELLS = List.of("", " ", "R1", "R1", "150", "-300", "0.1", "0,05",
            "\"0,05\"", "NaN", "-Infinity", "inf", "1e999999", "-1e-400", "1" + "0".repeat(330), "\u22121",
            "\"", "\"\"", "\"\"\"", "\"a\"b", "a\"b", "\"x\ny\"", "\"unclosed", "#", "# c", "As4", "as4", "dot",
            "ok", "failed", "FAILED", "maybe", "2024-02-30", "2024-05-17", "\u00e9t\u00e9", "\uD83D\uDE00",
            "\uD83D", "\u0000", "\t", "\u2028", "\uFEFF", "run_id", "t_sub");

    private static final List<String> ALL_COLUMNS = List.of(RunLogFixtures.FULL_HEADER.split(","));

    @Provide
    Arbitrary<String> cells() {
        return Arbitraries.frequencyOf(
                Tuple.of(5, Arbitraries.of(NASTY_CELLS)),
                Tuple.of(2, Arbitraries.strings().all().ofMaxLength(12)),
                Tuple.of(1, Arbitraries.strings().withChars("\",\r\n#; .e-+0123456789").ofMaxLength(10)),
                Tuple.of(1, Arbitraries.doubles().map(d -> Double.toString(d))));
    }

    @Provide
    Arbitrary<String> lineEnds() {
        return Arbitraries.of("\n", "\r\n", "\r", "\n\n", "\n# comment\n", "\n   \n");
    }

    @Provide
    Arbitrary<String> messyLogs() {
        Arbitrary<String> goodHeader = Arbitraries.shuffle(ALL_COLUMNS)
                .flatMap(cols -> Arbitraries.integers().between(1, cols.size()).map(n -> String.join(",", cols.subList(0, n))));
        Arbitrary<String> messyHeader = cells().list().ofMinSize(0).ofMaxSize(8).map(l -> String.join(",", l));
        Arbitrary<String> header = Arbitraries.frequencyOf(Tuple.of(3, goodHeader), Tuple.of(1, messyHeader));
        Arbitrary<String> row = cells().list().ofMinSize(0).ofMaxSize(16).map(l -> String.join(",", l));
        Arbitrary<List<String>> rows = row.list().ofMinSize(0).ofMaxSize(8);
        Arbitrary<List<String>> ends = lineEnds().list().ofSize(9);
        return Combinators.combine(header, rows, ends, Arbitraries.of("", "# lead\n", "\uFEFF"))
                .as((h, rs, es, lead) -> {
                    StringBuilder sb = new StringBuilder(lead).append(h);
                    for (int k = 0; k < rs.size(); k++) {
                        sb.append(es.get(k)).append(rs.get(k));
                    }
                    return sb.toString();
                });
    }

    @Property(tries = 300)
    void malformedTextOnlyEverRaisesInputExceptionWithPositionsInTheFile(@ForAll("messyLogs") String text)
            throws IOException {
        int lines = text.split("\r\n|\r|\n", -1).length;
        try {
            RunLog log = RunLogReader.read(CAMPAIGN, RunLogFixtures.RUNS, new StringReader(text));
            for (Run run : log.runs()) {
                run.numbers().values().forEach(v -> assertTrue(Double.isFinite(v), "finite values only"));
                assertTrue(run.line() >= 1 && run.line() <= lines);
            }
            log.warnings().forEach(w -> checkPosition(w, lines));
        } catch (InputException e) {
            assertFalse(e.diagnostics().isEmpty(), "an InputException carries at least one diagnostic");
            assertTrue(e.diagnostics().stream().anyMatch(Diagnostic::isError));
            e.diagnostics().forEach(d -> checkPosition(d, lines));
            for (int k = 1; k < e.diagnostics().size(); k++) {
                assertTrue(e.diagnostics().get(k - 1).line() <= e.diagnostics().get(k).line(), "line order");
            }
        }
    }

    private static void checkPosition(Diagnostic d, int lines) {
        assertEquals(RunLogFixtures.RUNS, d.file());
        assertTrue(d.line() >= 1 && d.line() <= lines, () -> "line out of the file: " + d);
        assertTrue(d.column() >= 1, () -> "column missing: " + d);
        assertFalse(d.message().isBlank());
        assertFalse(d.message().contains("\n"), () -> "message spans lines: " + d);
    }

    // ---- round trip ---------------------------------------------------------------------------

    /**
     * Free text for ids and proposals: any characters except control characters, which the reader
     * refuses outside notes (they could rewrite a terminal when printed).
     */
    @Provide
    Arbitrary<String> texts() {
        return Arbitraries.frequencyOf(
                Tuple.of(3, Arbitraries.strings().all().ofMinLength(1).ofMaxLength(20)),
                Tuple.of(2, Arbitraries.strings().withChars("ab,\"# \u00e9\u4e2d").ofMinLength(1).ofMaxLength(12)))
                .map(RunLogPropertyTest::withoutControls)
                .filter(s -> !s.isBlank());
    }

    /** Free text for notes: as {@link #texts()}, and tabs and line breaks, but no CR (a quoted cell turns it into LF). */
    @Provide
    Arbitrary<String> noteTexts() {
        return Arbitraries.frequencyOf(
                Tuple.of(3, texts()),
                Tuple.of(2, Arbitraries.strings().withChars("ab,\"# \n\t\u00e9\u4e2d").ofMinLength(1).ofMaxLength(12)))
                .filter(s -> !s.isBlank());
    }

    private static String withoutControls(String s) {
        StringBuilder sb = new StringBuilder(s.length());
        s.chars().forEach(c -> sb.append(Character.isISOControl(c) ? ' ' : (char) c));
        return sb.toString();
    }

    @Property(tries = 300)
    void validRowReadsBackAsTheSameRun(@ForAll("texts") String rawId, @ForAll("noteTexts") String notes,
                                       @ForAll("texts") String rawProposal, @ForAll Random random) throws Exception {
        String runId = rawId.strip();
        String proposal = rawProposal.strip();
        Map<String, Double> numbers = new LinkedHashMap<>();
        Map<String, String> categories = new LinkedHashMap<>();
        Map<String, String> cells = new LinkedHashMap<>();
        for (ParameterSpec p : CAMPAIGN.parameters()) {
            if (random.nextInt(4) == 0) {
                cells.put(p.name(), "");
            } else if (p.isCategorical()) {
                String c = p.choices().get(random.nextInt(p.choices().size()));
                categories.put(p.name(), c);
                cells.put(p.name(), c);
            } else {
                double v = p.fromUnit(random.nextDouble());
                v = Math.min(p.max(), Math.max(p.min(), v)); // log-scale round-off stays inside the box
                numbers.put(p.name(), v);
                cells.put(p.name(), Double.toString(v));
            }
        }
        for (OutcomeSpec o : CAMPAIGN.outcomes()) {
            if (random.nextInt(3) == 0) {
                cells.put(o.name(), "");
            } else if (o.isClass()) {
                String c = o.classes().get(random.nextInt(o.classes().size()));
                categories.put(o.name(), c);
                cells.put(o.name(), c);
            } else {
                double v = o.scale() == Scale.LOG ? Math.pow(10, 6 + 6 * random.nextDouble())
                        : 1000 * random.nextDouble();
                numbers.put(o.name(), v);
                cells.put(o.name(), Double.toString(v));
            }
        }
        Run.Status status = random.nextBoolean() ? Run.Status.OK : Run.Status.FAILED;
        String date = LocalDate.ofEpochDay(random.nextInt(40_000)).toString();
        cells.put(RunLogReader.RUN_ID, runId);
        cells.put(RunLogReader.STATUS, status == Run.Status.OK ? "ok" : "failed");
        cells.put(RunLogReader.DATE, date);
        cells.put(RunLogReader.PROPOSAL, proposal);
        cells.put(RunLogReader.NOTES, notes);

        List<String> order = new ArrayList<>(cells.keySet());
        Collections.shuffle(order, random);
        List<String> headerCells = new ArrayList<>();
        List<String> rowCells = new ArrayList<>();
        for (String name : order) {
            headerCells.add(RunLogWriter.cell(name));
            rowCells.add(RunLogWriter.cell(cells.get(name)));
        }
        String header = String.join(",", headerCells);
        String row = String.join(",", rowCells);
        String text = "# invented round-trip log\n" + header + "\n" + row + "\n";

        RunLog log = RunLogReader.read(CAMPAIGN, RunLogFixtures.RUNS, new StringReader(text));
        Run expected = new Run(runId, numbers, categories, status, date, proposal, notes, 3);
        assertEquals(List.of(expected), log.runs(), () -> "text was:\n" + text);
        assertTrue(log.warnings().isEmpty(), () -> "warnings: " + log.warnings());
    }
}
