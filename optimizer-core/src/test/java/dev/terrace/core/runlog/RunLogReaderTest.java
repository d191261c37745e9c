package dev.terrace.core.runlog;

import dev.terrace.core.Diagnostic;
import dev.terrace.core.InputException;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.units.Units;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

import java.io.IOException;
import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.attribute.FileTime;
import java.util.List;
import java.util.Optional;

import static dev.terrace.core.runlog.RunLogFixtures.FULL_HEADER;
import static dev.terrace.core.runlog.RunLogFixtures.RUNS;
import static dev.terrace.core.runlog.RunLogFixtures.campaign;
import static dev.terrace.core.runlog.RunLogFixtures.read;
import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

/**
 * Tests of {@link RunLogReader}. Quoting cases follow RFC 4180 section 2 (a field holding a comma,
 * a quote or a line break is enclosed in double quotes; a quote inside is written twice). Dates
 * follow ISO 8601 extended format. All run data here is invented for the tests.
 */
class RunLogReaderTest {

    /** Errors only, in the order the exception gives them. */
    private static List<Diagnostic> errors(String text) {
        InputException e = assertThrows(InputException.class, () -> read(text));
        return e.diagnostics().stream().filter(Diagnostic::isError).toList();
    }

    /** The single error a text produces. */
    private static Diagnostic onlyError(String text) {
        List<Diagnostic> errors = errors(text);
        assertEquals(1, errors.size(), () -> "expected one error, got " + errors);
        return errors.get(0);
    }

    private static void assertAt(Diagnostic d, int line, int column) {
        assertEquals(line, d.line(), () -> "line of " + d);
        assertEquals(column, d.column(), () -> "column of " + d);
    }

    private static void assertMentions(Diagnostic d, String... parts) {
        for (String p : parts) {
            assertTrue(d.message().contains(p), () -> "'" + p + "' missing from: " + d.message());
        }
    }

    // ---- a good log ---------------------------------------------------------------------------

    @Test
    void goodLogWithCommentsQuotingEmptyCellsAndFailedRunsIsRead() throws Exception {
        String text = String.join("\n",
                "# Invented run log for the test campaign; not real lab data.",
                "",
                "# Comments and blank lines may come before the header.",
                FULL_HEADER,
                "D-001,150,0.1,1.5,1e-5,As4,10,2.3e9,45,dot,0.8,ok,2024-03-04,,\"first run, \"\"baseline\"\" recipe\"",
                "# a comment between runs",
                "   ",
                "D-002, 200 ,0.05,2,2.5E-6,As2,,,,,,failed,2024-03-05T09:15,P-3,In cell shutter stuck",
                "D-003,180,.2,1.0,1e-6,,5,8e8,,ring,,,,,\"two-line",
                "note\"",
                "D-004,120,0.02,0.5,1E-04,As4,0,,30.5,,,OK,,,");
        RunLog log = read(text);

        assertEquals(4, log.runs().size());
        assertTrue(log.warnings().isEmpty(), () -> "no warnings expected: " + log.warnings());
        Run d1 = log.run("D-001").orElseThrow();
        assertEquals(5, d1.line());
        assertEquals(150.0, d1.number("t_sub").getAsDouble());
        assertEquals(1e-5, d1.number("as_bep").getAsDouble());
        assertEquals(2.3e9, d1.number("density").getAsDouble());
        assertEquals("As4", d1.category("as_species").orElseThrow());
        assertEquals("dot", d1.category("shape").orElseThrow());
        assertEquals("2024-03-04", d1.date());
        assertEquals(null, d1.proposal());
        assertEquals("first run, \"baseline\" recipe", d1.notes(), "RFC 4180: doubled quote inside quotes");

        Run d2 = log.run("D-002").orElseThrow();
        assertEquals(Run.Status.FAILED, d2.status());
        assertEquals(200.0, d2.number("t_sub").getAsDouble(), "spaces around a number are dropped");
        assertEquals(2.5e-6, d2.number("as_bep").getAsDouble());
        assertFalse(d2.number("density").isPresent(), "a failed run may have no outcomes");
        assertFalse(d2.number("anneal_t").isPresent(), "empty cell means not measured");
        assertFalse(d2.category("shape").isPresent());
        assertEquals("P-3", d2.proposal());
        assertEquals("In cell shutter stuck", d2.notes());

        Run d3 = log.run("D-003").orElseThrow();
        assertEquals(9, d3.line());
        assertEquals(0.2, d3.number("in_rate").getAsDouble());
        assertFalse(d3.category("as_species").isPresent());
        assertEquals("ring", d3.category("shape").orElseThrow());
        assertEquals("two-line\nnote", d3.notes(), "RFC 4180: line break inside quotes");
        assertTrue(d3.ok(), "empty status means ok");

        Run d4 = log.run("D-004").orElseThrow();
        assertEquals(11, d4.line(), "physical line, counted past the two-line note");
        assertTrue(d4.ok(), "status is read without regard to case");
        assertEquals(1e-4, d4.number("as_bep").getAsDouble());
        assertEquals(30.5, d4.number("diameter").getAsDouble());
        assertEquals(List.of("D-002"), log.failedRuns().stream().map(Run::runId).toList());
    }

    @Test
    void headerWithASubsetOfColumnsInAnyOrderIsAccepted() throws Exception {
        RunLog log = read("shape,notes,t_sub,run_id\nhole,,250,A\r\nring,x,260,B\r\n");
        assertEquals(2, log.runs().size());
        assertEquals(260.0, log.run("B").orElseThrow().number("t_sub").getAsDouble());
        assertEquals(3, log.run("B").orElseThrow().line(), "CRLF line ends count as one");
    }

    @Test
    void headerOnlyLogHasNoRuns() throws Exception {
        RunLog log = read("# nothing grown yet\n" + FULL_HEADER + "\n");
        assertTrue(log.runs().isEmpty());
        assertTrue(log.warnings().isEmpty());
    }

    @Test
    void emptyLogFromTheWriterReadsBackWithNoRunsAndNoFindings() throws Exception {
        String text = RunLogWriter.emptyLog(campaign());
        assertTrue(text.lines().filter(l -> !l.startsWith("#")).toList().equals(List.of(FULL_HEADER)),
                () -> "one header line expected in:\n" + text);
        RunLog log = read(text);
        assertTrue(log.runs().isEmpty());
        assertTrue(log.warnings().isEmpty());
    }

    // ---- all errors at once -------------------------------------------------------------------

    @Test
    void fiveFaultsOnDifferentLinesGiveExactlyFiveErrorsWithLineAndColumn() {
        String text = String.join("\n",
                "# Invented five-fault log.",
                "run_id,t_sub,in_rate,as_species,density,shape,status",
                "R1,150,0.1,As4,1e9,dot,ok",
                "R2,150,\"0,05\",As4,1e9,dot,ok",   // line 4: decimal comma, cell starts at column 8
                "R3,-300,0.1,As4,1e9,dot,ok",       // line 5: below absolute zero, column 4
                "R1,150,0.1,As4,1e9,dot,ok",        // line 6: duplicate of line 3, column 1
                "R4,150,0.1,As3,1e9,dot,ok",        // line 7: unknown category, column 12
                "",
                "R5,150,0.1,As4,1e9,dot,done");     // line 9: bad status, column 24
        List<Diagnostic> errors = errors(text);

        assertEquals(5, errors.size(), () -> "errors: " + errors);
        assertAt(errors.get(0), 4, 8);
        assertEquals("runs.csv:4:8: error: column 'in_rate' expects a number in ML/s, found '0,05'"
                + " (use a decimal point)", errors.get(0).toString());
        assertAt(errors.get(1), 5, 4);
        assertMentions(errors.get(1), "t_sub", "absolute zero", "-273.15 degC");
        assertAt(errors.get(2), 6, 1);
        assertMentions(errors.get(2), "'R1'", "line 3");
        assertAt(errors.get(3), 7, 12);
        assertMentions(errors.get(3), "'As3'", "'As2'", "'As4'");
        assertAt(errors.get(4), 9, 24);
        assertMentions(errors.get(4), "'done'", "'ok'", "'failed'");
    }

    @Test
    void diagnosticsComeInLineOrderWithWarningsIncluded() {
        String text = "run_id,t_sub,status\nA,350,ok\nB,abc,ok\nC,50,nope\n";
        InputException e = assertThrows(InputException.class, () -> read(text));
        List<Diagnostic> all = e.diagnostics();
        assertEquals(List.of(2, 3, 4, 4), all.stream().map(Diagnostic::line).toList());
        assertEquals(Diagnostic.Severity.WARNING, all.get(0).severity(), "350 degC is above the box");
        assertEquals(Diagnostic.Severity.WARNING, all.get(2).severity(), "50 degC is below the box");
        assertTrue(all.get(3).isError());
    }

    // ---- header errors ------------------------------------------------------------------------

    @Test
    void unknownColumnSuggestsTheNearestCampaignColumn() {
        Diagnostic d = onlyError("run_id,t_sub,in_rat\nA,150,0.1\n");
        assertAt(d, 1, 14);
        assertMentions(d, "unknown column 'in_rat'", "did you mean 'in_rate'?");
    }

    @Test
    void unknownColumnWithoutNearNameListsTheCampaignColumns() {
        Diagnostic d = onlyError("run_id,wafer_lot\nA,L7\n");
        assertAt(d, 1, 8);
        assertMentions(d, "'wafer_lot'", "t_sub", "in_rate", "shape", "notes");
    }

    @Test
    void missingRunIdColumnIsAnError() {
        Diagnostic d = onlyError("t_sub,in_rate\n150,0.1\n");
        assertAt(d, 1, 1);
        assertMentions(d, "no 'run_id' column");
    }

    @Test
    void duplicatedHeaderColumnNamesTheFirstOccurrence() {
        Diagnostic d = onlyError("run_id,t_sub,in_rate,t_sub\nA,150,0.1,160\n");
        assertAt(d, 1, 22);
        assertMentions(d, "'t_sub'", "twice", "column 8");
    }

    @Test
    void emptyHeaderColumnIsAnError() {
        Diagnostic d = onlyError("run_id,t_sub,\nA,150,\n");
        assertAt(d, 1, 14);
        assertMentions(d, "column 3 has no name");
    }

    @Test
    void fileWithNoHeaderIsAnError() {
        Diagnostic d = onlyError("# only a comment\n\n");
        assertAt(d, 1, 1);
        assertMentions(d, "no header row", "run_id,t_sub");
    }

    // ---- run ids, row shape, quoting ----------------------------------------------------------

    @Test
    void emptyRunIdIsAnError() {
        Diagnostic d = onlyError("run_id,t_sub\nA,150\n  ,160\n");
        assertAt(d, 3, 1);
        assertMentions(d, "empty run_id");
    }

    @Test
    void duplicateRunIdNamesTheLineOfTheFirstOccurrence() {
        Diagnostic d = onlyError("run_id,t_sub\n# c\nA,150\nB,160\nA,170\n");
        assertAt(d, 5, 1);
        assertMentions(d, "'A'", "already used on line 3");
    }

    @Test
    void rowWithTooManyCellsPointsAtTheFirstExtraCell() {
        Diagnostic d = onlyError("run_id,t_sub,in_rate\nA,150,0,05\n");
        assertAt(d, 2, 9);
        assertMentions(d, "4 cells", "3 columns", "decimal point");
    }

    @Test
    void rowWithTooFewCellsPointsAtTheEndOfTheRow() {
        Diagnostic d = onlyError("run_id,t_sub,in_rate\nA,150\n");
        assertAt(d, 2, 6);
        assertMentions(d, "2 cells", "3 columns");
    }

    @Test
    void unclosedQuoteIsReportedWhereItOpensAndLaterRowsAreStillChecked() {
        List<Diagnostic> errors = errors("run_id,t_sub,notes\nA,150,\"oops\nB,160,fine\nC,hot,x\n");
        assertEquals(2, errors.size(), () -> "errors: " + errors);
        assertAt(errors.get(0), 2, 7);
        assertMentions(errors.get(0), "never closed");
        assertAt(errors.get(1), 4, 3);
        assertMentions(errors.get(1), "numeric");
    }

    @Test
    void columnsCountCodePointsSoAnEmojiIsOneColumn() {
        // U+1F600 is two UTF-16 chars but one character on screen.
        Diagnostic d = onlyError("run_id,notes,t_sub\n\uD83D\uDE00,x,hot\n");
        assertAt(d, 2, 5);
    }

    @Test
    void oldMacLineEndsAreLineEndsToo() {
        Diagnostic d = onlyError("run_id,t_sub\rA,150\rB,hot\r");
        assertAt(d, 3, 3);
    }

    @Test
    void textAfterAClosingQuoteIsAnError() {
        Diagnostic d = onlyError("run_id,notes\nA,\"bad\"x\n");
        assertAt(d, 2, 8);
        assertMentions(d, "after the closing double quote");
    }

    // ---- numbers ------------------------------------------------------------------------------

    @Test
    void unparsableNumberSaysANumberIsExpectedInTheColumnUnit() {
        Diagnostic d = onlyError("run_id,t_sub\nA,15O\n");
        assertAt(d, 2, 3);
        assertEquals("column 't_sub' expects a number in degC, found '15O'", d.message());
    }

    @ParameterizedTest
    @ValueSource(strings = {"150 degC", "150degC", "150\u00b0C", "150 C"})
    void numberWithAUnitAttachedIsRejectedWithAHint(String cell) {
        Diagnostic d = onlyError("run_id,t_sub\nA," + cell + "\n");
        assertMentions(d, "write the number alone", "the campaign sets the unit, degC");
    }

    @Test
    void unquotedDecimalCommaInAQuotedCellAndThousandsSeparatorAreRejected() {
        assertMentions(onlyError("run_id,density\nA,\"2,5e9\"\n"), "use a decimal point");
        assertMentions(onlyError("run_id,density\nA,\"1.000,5\"\n"), "no thousands separator");
    }

    @ParameterizedTest
    @ValueSource(strings = {"NaN", "nan", "Infinity", "-Infinity", "inf", "-inf", "\u221e"})
    void nanAndInfinityAreRejected(String cell) {
        Diagnostic d = onlyError("run_id,pl_ratio\nA," + cell + "\n");
        assertAt(d, 2, 3);
        assertMentions(d, "NaN and infinity are not measurements");
    }

    @ParameterizedTest
    @ValueSource(strings = {"1e999", "-1e400", "1e309"})
    void numbersTooLargeForADoubleAreRejected(String cell) {
        // The largest double is about 1.80e308 (IEEE 754 binary64), so 1e309 overflows.
        assertMentions(onlyError("run_id,pl_ratio\nA," + cell + "\n"), "too large");
    }

    @Test
    void fourHundredDigitIntegerIsTooLarge() {
        assertMentions(onlyError("run_id,pl_ratio\nA,1" + "0".repeat(400) + "\n"), "too large");
    }

    @Test
    void valueThatOverflowsWhenConvertedToTheCanonicalUnitIsRejected() {
        // 1e305 h is 3.6e308 s, past the largest double (about 1.80e308, IEEE 754 binary64).
        Campaign hours = RunLogFixtures.singleSetting(Units.bySymbol("h").orElseThrow(), 0, 10);
        InputException e = assertThrows(InputException.class,
                () -> RunLogReader.read(hours, RUNS, new StringReader("run_id,x\nA,1e305\n")));
        assertTrue(e.diagnostics().get(0).message().contains("too large"), e::getMessage);
    }

    @Test
    void unicodeMinusSignGetsAHint() {
        assertMentions(onlyError("run_id,pl_ratio\nA,\u22120.5\n"), "plain minus sign");
    }

    @Test
    void categoryTextInANumericColumnSaysTheColumnIsNumeric() {
        Diagnostic d = onlyError("run_id,in_rate\nA,fast\n");
        assertAt(d, 2, 3);
        assertMentions(d, "column 'in_rate' is numeric (ML/s)", "'fast'");
    }

    @ParameterizedTest(name = "{0} = {1} is rejected")
    @CsvSource({
        "in_rate, -0.1, a deposition rate",
        "as_bep, -1e-6, a pressure",
        "in_amount, -0.5, a coverage",
        "anneal_t, -1, a time",
        "density, -3e9, a density",
        "diameter, -2, a length",
    })
    void negativeValuesOfNonNegativeQuantitiesAreRejected(String column, String value, String noun) {
        Diagnostic d = onlyError("run_id," + column + "\nA," + value + "\n");
        assertAt(d, 2, 3);
        assertMentions(d, "'" + column + "' is " + noun + " and cannot be negative");
    }

    @Test
    void negativeFluxIsRejected() {
        Campaign flux = RunLogFixtures.singleSetting(Units.bySymbol("cm^-2 s^-1").orElseThrow(), 1e13, 1e15);
        InputException e = assertThrows(InputException.class,
                () -> RunLogReader.read(flux, RUNS, new StringReader("run_id,x\nA,-1e14\n")));
        assertTrue(e.diagnostics().get(0).message().contains("a flux and cannot be negative"), e::getMessage);
    }

    @Test
    void negativeCoverageGivenInNanometresIsRejected() {
        // in_amount is a coverage written in nm; -0.01 nm converts to -0.035 ML with a/2 = 0.28266 nm.
        Diagnostic d = onlyError("run_id,in_amount\nA,-0.01\n");
        assertEquals("column 'in_amount' is a coverage and cannot be negative, found -0.01 nm", d.message());
    }

    @Test
    void zeroIsAcceptedForNonNegativeQuantities() throws Exception {
        // A closed arsenic valve or no anneal are real recipes (common practice), so 0 is allowed.
        RunLog log = read("run_id,as_bep,anneal_t,diameter\nA,0,0,0\n");
        assertEquals(0.0, log.runs().get(0).number("anneal_t").getAsDouble());
        assertEquals(0.0, log.runs().get(0).number("diameter").getAsDouble());
    }

    @Test
    void zeroOnALogScaleOutcomeIsAnErrorThatSuggestsACensoredValue() {
        // density is declared scale: log; log10(0) does not exist, so "no dots seen" must be written
        // as a bound (below the detection limit), not as 0.
        Diagnostic d = onlyError("run_id,t_sub,density\nA,500,2e9\nB,480,0\n");
        assertAt(d, 3, 7);
        assertMentions(d, "'density' is on a log scale", "<1e8");
    }

    @Test
    void aControlCharacterInACellIsAPositionedErrorAndIsNotEchoedRaw() {
        // ESC [ 2 J clears a VT100/ECMA-48 terminal (ECMA-48, 5th ed. 1991, 8.3.39 ED)
        Diagnostic d = onlyError("run_id,density\nD\u001b[2J02,2e9\n");
        assertAt(d, 2, 1);
        assertMentions(d, "control character U+001B", "D\\u001b[2J02");
        assertFalse(d.message().contains("\u001b"), "no raw escape in the message");
    }

    @Test
    void tabsAndLineBreaksAreAllowedInQuotedNotesOnly() throws Exception {
        RunLog log = read("run_id,notes\nA,\"first line\nsecond\tline\"\n");
        assertEquals("first line\nsecond\tline", log.runs().get(0).notes());
        assertMentions(onlyError("run_id,density\n\"A\tB\",2e9\n"), "control character U+0009");
    }

    @Test
    void aFileThatIsNotARunLogGetsOneMessageWithAShortEscapedExcerpt() {
        String passwdLike = "root:x:0:0:root:/root:/bin/bash\ndaemon:x:1:1:daemon:/usr/sbin:/usr/sbin/nologin,a,b\n";
        List<Diagnostic> errors = errors(passwdLike);
        assertEquals(1, errors.size(), errors::toString);
        Diagnostic d = errors.get(0);
        assertAt(d, 1, 1);
        assertMentions(d, "does not look like a run log", "root:x:0:0:root:/root:/b\u2026");
        assertFalse(d.message().contains("/bin/bash"), "at most a short excerpt of a foreign file");
        assertFalse(d.message().contains("daemon"), "later lines are not read or echoed");
    }

    @Test
    void censoredCellsAreReadAsBoundsNotNumbers() throws Exception {
        RunLog log = read("run_id,density,diameter\nA,<1e8,>60\nB, < 5e7 ,40\nC,<=2e8,\n");
        Run a = log.runs().get(0);
        assertEquals(Optional.of(Censored.below(1e8)), a.censored("density"));
        assertEquals(Optional.of(Censored.above(60)), a.censored("diameter"));
        assertFalse(a.number("density").isPresent(), "a censored cell is not a plain number");
        Run b = log.runs().get(1);
        assertEquals(Optional.of(Censored.below(5e7)), b.censored("density"));
        assertEquals(40.0, b.number("diameter").getAsDouble());
        assertTrue(b.censored("diameter").isEmpty());
        assertEquals(Optional.of(Censored.below(2e8)), log.runs().get(2).censored("density"));
    }

    @ParameterizedTest(name = "{0} is rejected")
    @CsvSource(delimiter = '|', value = {
        "<    | with no bound",
        "<abc | holds the text 'abc'",
        "<0   | must be above zero",
        ">-1  | cannot be negative",
    })
    void badCensoredCellsArePositioned(String cell, String expected) {
        Diagnostic d = onlyError("run_id,density\nA," + cell + "\n");
        assertAt(d, 2, 3);
        assertMentions(d, expected);
    }

    @Test
    void celsiusBelowAbsoluteZeroIsRejected() {
        // Absolute zero is 0 K = -273.15 degC exactly (SI definition of the degree Celsius, BIPM SI Brochure).
        Diagnostic d = onlyError("run_id,t_sub\nA,-273.16\n");
        assertAt(d, 2, 3);
        assertMentions(d, "below absolute zero (-273.15 degC)");
    }

    @Test
    void celsiusAtAbsoluteZeroIsOnlyOutsideTheBox() throws Exception {
        RunLog log = read("run_id,t_sub\nA,-273.15\n");
        assertEquals(1, log.runs().size());
        assertEquals(1, log.warnings().size(), "outside the 100-300 degC box");
    }

    @Test
    void kelvinBelowZeroIsRejected() {
        Campaign kelvin = RunLogFixtures.singleSetting(Units.bySymbol("K").orElseThrow(), 300, 900);
        InputException e = assertThrows(InputException.class,
                () -> RunLogReader.read(kelvin, RUNS, new StringReader("run_id,x\nA,-0.5\n")));
        assertTrue(e.diagnostics().get(0).message().contains("below absolute zero (0 K)"), e::getMessage);
    }

    @Test
    void valueOutsideTheCampaignBoxIsAWarningNotAnError() throws Exception {
        RunLog log = read("run_id,t_sub,in_rate\nA,350,0.1\nB,150,0.005\n");
        assertEquals(2, log.runs().size(), "the runs are kept");
        assertEquals(2, log.warnings().size());
        Diagnostic w = log.warnings().get(0);
        assertEquals(Diagnostic.Severity.WARNING, w.severity());
        assertAt(w, 2, 3);
        assertMentions(w, "'t_sub'", "350", "100 to 300 degC");
        assertAt(log.warnings().get(1), 3, 7);
    }

    @Test
    void negativeDimensionlessValueIsAllowed() throws Exception {
        assertEquals(-0.5, read("run_id,pl_ratio\nA,-0.5\n").runs().get(0).number("pl_ratio").getAsDouble());
    }

    // ---- categories, classes, status, date ----------------------------------------------------

    @Test
    void unknownCategoryListsTheAllowedOnesAndSuggests() {
        Diagnostic d = onlyError("run_id,as_species\nA,as4\n");
        assertAt(d, 2, 3);
        assertMentions(d, "one of 'As2', 'As4'", "found 'as4'", "did you mean 'As4'?");
    }

    @Test
    void unknownClassListsTheAllowedOnes() {
        Diagnostic d = onlyError("run_id,shape\nA,disk\n");
        assertMentions(d, "'shape' expects one of 'dot', 'ring', 'hole'", "'disk'");
    }

    @Test
    void badStatusIsAnError() {
        Diagnostic d = onlyError("run_id,status\nA,fail\n");
        assertAt(d, 2, 3);
        assertMentions(d, "'ok' or 'failed'", "'fail'");
    }

    @ParameterizedTest
    @ValueSource(strings = {"2024-05-17", "2024-05-17T14:30", "2024-05-17T14:30:05", "2024-05-17T14:30:05Z",
        "2024-05-17T14:30+02:00", "2024-05-17 14:30", "20240517"})
    void isoDatesAndDateTimesAreAccepted(String date) throws Exception {
        assertEquals(date, read("run_id,date\nA," + date + "\n").runs().get(0).date());
    }

    @ParameterizedTest
    @ValueSource(strings = {"17/05/2024", "2024-5-17", "2024-02-30", "May 17 2024", "2024-05-17T25:00"})
    void datesThatAreNotIso8601AreRejected(String date) {
        Diagnostic d = onlyError("run_id,date\nA," + date + "\n");
        assertAt(d, 2, 3);
        assertMentions(d, "ISO 8601");
    }

    // ---- files --------------------------------------------------------------------------------

    @Test
    void missingFileIsAnInputExceptionWithAClearMessage(@TempDir Path dir) {
        Path absent = dir.resolve("runs.csv");
        InputException e = assertThrows(InputException.class, () -> RunLogReader.read(campaign(), absent));
        Diagnostic d = e.diagnostics().get(0);
        assertEquals(absent, d.file());
        assertMentions(d, "run log not found");
        assertFalse(Files.exists(absent), "the reader must not create the file");
    }

    @Test
    void readingLeavesTheFileUntouched(@TempDir Path dir) throws Exception {
        FileTime stamp = FileTime.fromMillis(1_000_000_000_000L);
        Path bad = dir.resolve("bad.csv");
        Files.writeString(bad, FULL_HEADER + "\r\nD-1,150,0.1,1.5,1e-5,As4,10,2.3e9,45,dot,,ok,2024-03-04,,\"a, b\"\r\nD-2,abc",
                StandardCharsets.UTF_8);
        Path good = dir.resolve("good.csv");
        Files.writeString(good, FULL_HEADER + "\nD-1,150,,,,,,,,,,,,,\n", StandardCharsets.UTF_8);
        Files.setLastModifiedTime(bad, stamp);
        Files.setLastModifiedTime(good, stamp);
        byte[] badBefore = Files.readAllBytes(bad);
        byte[] goodBefore = Files.readAllBytes(good);

        InputException e = assertThrows(InputException.class, () -> RunLogReader.read(campaign(), bad));
        assertEquals(bad, e.diagnostics().get(0).file());
        assertEquals(1, RunLogReader.read(campaign(), good).runs().size());

        assertArrayEquals(badBefore, Files.readAllBytes(bad), "a log with errors is left as it was");
        assertArrayEquals(goodBefore, Files.readAllBytes(good), "a good log is left as it was");
        assertEquals(stamp, Files.getLastModifiedTime(bad), "not rewritten");
        assertEquals(stamp, Files.getLastModifiedTime(good), "not rewritten");
        try (var listing = Files.list(dir)) {
            assertEquals(2, listing.count(), "no backup or temporary file left beside the logs");
        }
    }

    @Test
    void campaignRunsPathIsTheFileRead(@TempDir Path dir) throws Exception {
        Campaign base = campaign();
        Path file = dir.resolve("log.csv");
        Files.writeString(file, "run_id,t_sub\nA,150\n", StandardCharsets.UTF_8);
        Campaign c = new Campaign(base.id(), base.title(), base.material(), base.surface(), base.parameters(),
                base.outcomes(), base.targets(), base.limits(), base.models(), base.file(), file);
        RunLog log = RunLogReader.read(c);
        assertEquals(file, log.file());
        assertEquals(150.0, log.runs().get(0).number("t_sub").getAsDouble());
    }

    @Test
    void fileThatIsNotUtf8IsPointedAt(@TempDir Path dir) throws IOException {
        Path file = dir.resolve("runs.csv");
        // "25 degrees" written as 0xB0 (the degree sign in ISO 8859-1), which is not valid UTF-8.
        byte[] latin1 = "run_id,notes\nA,25\u00b0C\n".getBytes(StandardCharsets.ISO_8859_1);
        Files.write(file, latin1);
        InputException e = assertThrows(InputException.class, () -> RunLogReader.read(campaign(), file));
        Diagnostic d = e.diagnostics().get(0);
        assertAt(d, 2, 5);
        assertMentions(d, "UTF-8");
    }

    @Test
    void leadingByteOrderMarkIsIgnored() throws Exception {
        RunLog log = read("\uFEFFrun_id,t_sub\nA,150\n");
        assertEquals(1, log.runs().size());
    }
}
