package dev.terrace.core.runlog;

import dev.terrace.core.Diagnostic;
import dev.terrace.core.DidYouMean;
import dev.terrace.core.InputException;
import dev.terrace.core.io.InputFiles;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.ParameterSpec;

import java.io.IOException;
import java.io.Reader;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

import static dev.terrace.core.runlog.RunLogCells.controlCharacter;
import static dev.terrace.core.runlog.RunLogCells.error;
import static dev.terrace.core.runlog.RunLogCells.errorCount;
import static dev.terrace.core.runlog.RunLogCells.excerpt;
import static dev.terrace.core.runlog.RunLogCells.fmt;
import static dev.terrace.core.runlog.RunLogCells.isIsoDate;
import static dev.terrace.core.runlog.RunLogCells.readChoice;
import static dev.terrace.core.runlog.RunLogCells.readNumber;
import static dev.terrace.core.runlog.RunLogCells.readOutcomeNumber;
import static dev.terrace.core.runlog.RunLogCells.shown;
import static dev.terrace.core.runlog.RunLogCells.unitSuffix;

/**
 * Reads a campaign's run log: a CSV file with one row per growth run.
 *
 * <p>The header row names the columns: {@value #RUN_ID}, any of the campaign's settings and
 * outcomes in any order, and the optional {@value #STATUS} ({@code ok} or {@code failed}, empty
 * means ok, case does not matter), {@value #DATE} (ISO 8601), {@value #PROPOSAL} (the proposal a
 * run followed) and {@value #NOTES}. These five names are reserved: a campaign column of the same
 * name is not matched. Lines starting with {@code #} are comments, blank lines are skipped, and cells
 * follow RFC 4180 quoting. An empty cell means not measured; a failed run keeps its recipe and may
 * have no outcomes.
 *
 * <p>The reader checks every cell and collects every problem before it gives up, so the grower
 * can fix a whole file in one pass. Each diagnostic names the file, the 1-based line and the
 * 1-based column of the cell. Values outside today's campaign box are warnings only, since old
 * runs may predate the box. The reader never writes to the run log.
 *
 * <p>Two limits on "every problem": a row with the wrong number of cells or a quoting problem
 * gets only that one error, because its cells may have shifted; and when the header row itself
 * has a quoting problem the data rows are not checked until it is fixed.
 *
 * @since 0.1
 */
public final class RunLogReader {

    /** Column holding each run's identifier; required. */
    public static final String RUN_ID = "run_id";
    /** Optional column: {@code ok} or {@code failed}; an empty cell means ok. */
    public static final String STATUS = "status";
    /** Optional column: the run's ISO 8601 date or date-time. */
    public static final String DATE = "date";
    /** Optional column: id of the proposal the run followed. */
    public static final String PROPOSAL = "proposal";
    /** Optional column: free text. */
    public static final String NOTES = "notes";
    /**
     * The column names the run log reserves for itself, in their usual order; a campaign should
     * not name a setting or outcome after one of them.
     */
    public static final List<String> RESERVED_COLUMNS = List.of(RUN_ID, STATUS, DATE, PROPOSAL, NOTES);

    private RunLogReader() {
    }

    /**
     * Reads the campaign's run log from {@link Campaign#runs()}.
     *
     * @param campaign the campaign the log belongs to; never null
     * @return the runs and warnings; never null
     * @throws InputException when the file is missing or not readable as text, or holds any error;
     *                        it carries every diagnostic, errors and warnings, in line order
     * @throws IOException    when reading fails for another reason
     */
    public static RunLog read(Campaign campaign) throws IOException, InputException {
        Objects.requireNonNull(campaign, "campaign");
        return read(campaign, campaign.runs());
    }

    /**
     * Reads a run log from a file (UTF-8 text).
     *
     * @param campaign the campaign the log belongs to; never null
     * @param file     the run-log file; never null
     * @return the runs and warnings; never null
     * @throws InputException when the file is missing or not readable as text, or holds any error;
     *                        it carries every diagnostic, errors and warnings, in line order
     * @throws IOException    when reading fails for another reason
     */
    public static RunLog read(Campaign campaign, Path file) throws IOException, InputException {
        Objects.requireNonNull(campaign, "campaign");
        Objects.requireNonNull(file, "file");
        byte[] bytes;
        try {
            bytes = InputFiles.read(file, InputFiles.RUN_LOG);
        } catch (NoSuchFileException e) {
            throw new InputException(Diagnostic.error(file, 0, 0, "run log not found; the campaign "
                    + campaign.file() + " expects its runs in this CSV file (create it with a header row"
                    + " starting with " + RUN_ID + ")"));
        } catch (AccessDeniedException e) {
            throw new InputException(Diagnostic.error(file, 0, 0,
                    "the run log cannot be read: permission denied"));
        }
        String text = decodeUtf8(file, bytes);
        bytes = null; // a long log: let the bytes go before the rows are built
        return parse(campaign, file, text);
    }

    /**
     * Reads a run log from a reader; useful for tests and for text that is not in a file. The
     * reader is read to its end and not closed.
     *
     * @param campaign the campaign the log belongs to; never null
     * @param file     the name diagnostics and the result carry; never null
     * @param in       the run-log text; never null
     * @return the runs and warnings; never null
     * @throws InputException when the text holds any error; it carries every diagnostic, errors
     *                        and warnings, in line order
     * @throws IOException    when the reader fails
     */
    public static RunLog read(Campaign campaign, Path file, Reader in) throws IOException, InputException {
        Objects.requireNonNull(campaign, "campaign");
        Objects.requireNonNull(file, "file");
        Objects.requireNonNull(in, "in");
        StringBuilder sb = new StringBuilder();
        char[] buf = new char[8192];
        int n;
        while ((n = in.read(buf)) >= 0) {
            sb.append(buf, 0, n);
        }
        return parse(campaign, file, sb.toString());
    }

    /**
     * Reads a file of candidate recipes (for ranking): the same format and checks as a run log, but
     * the {@value #RUN_ID} column is optional; without it candidates are named C1, C2, ... in file
     * order. Outcome and status columns are allowed and ignored by ranking. Same as
     * {@link CandidatesReader#read}, which adds the checks for an empty file, a missing setting
     * column and a file without candidates.
     *
     * @param campaign the campaign whose settings the columns name
     * @param file     the CSV file
     * @return the candidates as runs; never null
     * @throws InputException when the file is missing or holds any error
     * @throws IOException    on other read failures
     */
    public static RunLog readCandidates(Campaign campaign, Path file) throws IOException, InputException {
        return CandidatesReader.read(campaign, file);
    }

    // ------------------------------------------------------------------------------------------

    private enum Kind { RUN_ID, PARAMETER, OUTCOME, STATUS, DATE, PROPOSAL, NOTES, SKIPPED }

    private record Column(String name, Kind kind, ParameterSpec parameter, OutcomeSpec outcome) {
    }

    private static RunLog parse(Campaign campaign, Path file, String text) throws InputException {
        return parse(campaign, file, text, false);
    }

    static RunLog parse(Campaign campaign, Path file, String text, boolean candidates) throws InputException {
        List<Diagnostic> diags = new ArrayList<>();
        // rows are tokenized and checked one at a time (streaming): a long log is never held as cells
        CsvTokenizer tokens = CsvTokenizer.over(text);
        CsvTokenizer.Row headerRow = tokens.next();
        List<Run> runs = new ArrayList<>();
        if (headerRow == null) {
            diags.add(Diagnostic.error(file, 1, 1, "the run log has no header row; expected a first line"
                    + " such as: " + RunLogWriter.headerLine(campaign)));
        } else {
            List<Diagnostic> headerDiags = new ArrayList<>();
            List<Column> header = readHeader(campaign, file, headerRow, headerDiags, candidates);
            boolean foreign = header.stream().allMatch(c -> c.kind() == Kind.SKIPPED);
            if (foreign) {
                // nothing in the first line is a column of this campaign: one message, a short escaped
                // excerpt, and no row errors (the file may be anything, and is not echoed)
                String first = headerRow.cells().stream().map(CsvTokenizer.Cell::text)
                        .reduce((a, b) -> a + "," + b).orElse("");
                diags.add(Diagnostic.error(file, headerRow.line(), 1, "this file does not look like "
                        + (candidates ? "a candidates table" : "a run log") + " of this campaign: its first line ('"
                        + excerpt(first) + "') names none of the campaign's columns; expected a header such as: "
                        + RunLogWriter.headerLine(campaign)));
            } else {
                diags.addAll(headerDiags);
            }
            if (!headerRow.broken() && !foreign) {
                Map<String, Integer> firstLine = new HashMap<>();
                int index = 0;
                for (CsvTokenizer.Row row = tokens.next(); row != null; row = tokens.next()) {
                    index++;
                    Run run = readRow(campaign, file, header, row, firstLine, diags,
                            candidates && header.stream().noneMatch(c -> c.kind() == Kind.RUN_ID) ? "C" + index : null);
                    if (run != null) {
                        runs.add(run);
                    }
                }
            }
            while (tokens.next() != null) {
                // rows not checked (broken or foreign header): still collect their quoting problems
            }
        }
        // quoting problems first, as the diagnostics of a cell at the same place follow them
        List<Diagnostic> quoting = new ArrayList<>();
        for (CsvTokenizer.Problem p : tokens.problems()) {
            quoting.add(Diagnostic.error(file, p.line(), p.column(), p.message()));
        }
        quoting.addAll(diags);
        diags = quoting;
        diags.sort(Comparator.comparingInt(Diagnostic::line).thenComparingInt(Diagnostic::column));
        if (diags.stream().anyMatch(Diagnostic::isError)) {
            throw new InputException(diags);
        }
        return new RunLog(file, runs, diags);
    }

    private static List<Column> readHeader(Campaign campaign, Path file, CsvTokenizer.Row row, List<Diagnostic> diags,
                                           boolean candidates) {
        List<Column> cols = readHeader(campaign, file, row, diags);
        if (candidates) {
            diags.removeIf(d -> d.line() == row.line() && d.message().startsWith("the header has no '" + RUN_ID + "'"));
        }
        return cols;
    }

    private static List<Column> readHeader(Campaign campaign, Path file, CsvTokenizer.Row row,
                                           List<Diagnostic> diags) {
        Map<String, ParameterSpec> params = campaign.parametersByName();
        Map<String, OutcomeSpec> outcomes = new LinkedHashMap<>();
        campaign.outcomes().forEach(o -> outcomes.put(o.name(), o));
        List<String> known = new ArrayList<>();
        known.add(RUN_ID);
        known.addAll(params.keySet());
        known.addAll(outcomes.keySet());
        known.addAll(RESERVED_COLUMNS.subList(1, RESERVED_COLUMNS.size()));

        List<Column> columns = new ArrayList<>();
        Map<String, Integer> seenAt = new HashMap<>();
        int index = 0;
        for (CsvTokenizer.Cell cell : row.cells()) {
            index++;
            String name = cell.text().strip();
            Kind kind;
            if (name.isEmpty()) {
                diags.add(Diagnostic.error(file, cell.line(), cell.column(), "header column " + index
                        + " has no name; expected one of the campaign's columns: " + String.join(", ", known)));
                kind = Kind.SKIPPED;
            } else if (seenAt.containsKey(name)) {
                diags.add(Diagnostic.error(file, cell.line(), cell.column(), "column '" + shown(name)
                        + "' appears twice in the header (first at column " + seenAt.get(name)
                        + "); each column may appear once"));
                kind = Kind.SKIPPED;
            } else {
                seenAt.put(name, cell.column());
                kind = reservedKind(name);
                if (kind == null) {
                    if (params.containsKey(name)) {
                        kind = Kind.PARAMETER;
                    } else if (outcomes.containsKey(name)) {
                        kind = Kind.OUTCOME;
                    } else {
                        Optional<String> hint = DidYouMean.suggest(name, known);
                        diags.add(Diagnostic.error(file, cell.line(), cell.column(), "unknown column '"
                                + shown(name) + "'" + hint.map(h -> "; did you mean '" + h + "'?").orElse(
                                "; expected one of the campaign's columns: " + String.join(", ", known))));
                        kind = Kind.SKIPPED;
                    }
                }
            }
            columns.add(new Column(name, kind, params.get(name), outcomes.get(name)));
        }
        if (columns.stream().noneMatch(c -> c.kind() == Kind.RUN_ID)) {
            CsvTokenizer.Cell first = row.cells().get(0);
            diags.add(Diagnostic.error(file, first.line(), first.column(), "the header has no '" + RUN_ID
                    + "' column; expected a header such as: " + RunLogWriter.headerLine(campaign)));
        }
        return columns;
    }

    private static Kind reservedKind(String name) {
        switch (name) {
            case RUN_ID:
                return Kind.RUN_ID;
            case STATUS:
                return Kind.STATUS;
            case DATE:
                return Kind.DATE;
            case PROPOSAL:
                return Kind.PROPOSAL;
            case NOTES:
                return Kind.NOTES;
            default:
                return null;
        }
    }

    /** Checks one data row; returns the run, or null when the row has an error. */
    private static Run readRow(Campaign campaign, Path file, List<Column> header, CsvTokenizer.Row row,
                               Map<String, Integer> firstLine, List<Diagnostic> diags) {
        return readRow(campaign, file, header, row, firstLine, diags, null);
    }

    private static Run readRow(Campaign campaign, Path file, List<Column> header, CsvTokenizer.Row row,
                               Map<String, Integer> firstLine, List<Diagnostic> diags, String autoId) {
        if (row.broken()) {
            return null; // the tokenizer has reported the problem; the cells may have shifted
        }
        List<CsvTokenizer.Cell> cells = row.cells();
        if (cells.size() > header.size()) {
            CsvTokenizer.Cell extra = cells.get(header.size());
            diags.add(Diagnostic.error(file, extra.line(), extra.column(), "this row has " + cells.size()
                    + " cells but the header has " + header.size() + " columns; a value holding a comma"
                    + " needs double quotes, and numbers take a decimal point, not a comma"));
            return null;
        }
        if (cells.size() < header.size()) {
            diags.add(Diagnostic.error(file, row.endLine(), row.endColumn(), "this row has " + cells.size()
                    + " cells but the header has " + header.size() + " columns; leave a cell empty"
                    + " (two commas in a row) when a value was not measured"));
            return null;
        }
        int mark = diags.size(); // only this row's diagnostics are counted: a pass per row over all would be quadratic
        String runId = autoId;
        Map<String, Double> numbers = new LinkedHashMap<>();
        Map<String, String> categories = new LinkedHashMap<>();
        Map<String, Censored> censored = new LinkedHashMap<>();
        Run.Status status = Run.Status.OK;
        String date = null;
        String proposal = null;
        String notes = null;
        for (int k = 0; k < header.size(); k++) {
            Column column = header.get(k);
            CsvTokenizer.Cell cell = cells.get(k);
            int control = controlCharacter(cell.text(), column.kind() == Kind.NOTES);
            if (control >= 0) {
                error(diags, file, cell, "column '" + shown(column.name()) + "' holds the control character "
                        + String.format(Locale.ROOT, "U+%04X", control) + " ('" + shown(cell.text())
                        + "'); remove it: control characters can rewrite a terminal when printed");
                continue;
            }
            String t = cell.text().strip();
            switch (column.kind()) {
                case RUN_ID:
                    if (t.isEmpty()) {
                        error(diags, file, cell, "empty " + RUN_ID + "; every run needs an identifier");
                    } else if (firstLine.containsKey(t)) {
                        error(diags, file, cell, RUN_ID + " '" + shown(t) + "' is already used on line "
                                + firstLine.get(t) + "; each run needs its own identifier");
                    } else {
                        firstLine.put(t, row.line());
                        runId = t;
                    }
                    break;
                case PARAMETER:
                    ParameterSpec p = column.parameter();
                    if (p.isCategorical()) {
                        readChoice(diags, file, cell, column.name(), t, p.choices(), categories);
                    } else {
                        Double v = readNumber(diags, file, cell, column.name(), t, p.unit(), campaign);
                        if (v != null) {
                            numbers.put(column.name(), v);
                            if (v < p.min() || v > p.max()) {
                                diags.add(Diagnostic.warning(file, cell.line(), cell.column(), "column '"
                                        + column.name() + "' value " + shown(t) + " lies outside the campaign box "
                                        + fmt(p.min()) + " to " + fmt(p.max()) + unitSuffix(p.unit())
                                        + "; the run is kept, as it may predate today's box"));
                            }
                        }
                    }
                    break;
                case OUTCOME:
                    OutcomeSpec o = column.outcome();
                    if (o.isClass()) {
                        readChoice(diags, file, cell, column.name(), t, o.classes(), categories);
                    } else {
                        readOutcomeNumber(diags, file, cell, o, t, campaign, numbers, censored);
                    }
                    break;
                case STATUS:
                    if (t.isEmpty() || t.equalsIgnoreCase("ok")) {
                        status = Run.Status.OK;
                    } else if (t.equalsIgnoreCase("failed")) {
                        status = Run.Status.FAILED;
                    } else {
                        error(diags, file, cell, "column '" + STATUS + "' expects 'ok' or 'failed' (empty means ok),"
                                + " found '" + shown(t) + "'");
                    }
                    break;
                case DATE:
                    if (!t.isEmpty()) {
                        if (isIsoDate(t)) {
                            date = t;
                        } else {
                            error(diags, file, cell, "column '" + DATE + "' expects an ISO 8601 date such as"
                                    + " 2024-05-17 or a date-time such as 2024-05-17T14:30, found '" + shown(t) + "'");
                        }
                    }
                    break;
                case PROPOSAL:
                    proposal = t.isEmpty() ? null : t;
                    break;
                case NOTES:
                    notes = t.isEmpty() ? null : cell.text();
                    break;
                default:
                    break; // unknown or duplicated column, reported with the header
            }
        }
        if (runId == null || errorCount(diags.subList(mark, diags.size())) > 0) {
            return null;
        }
        return new Run(runId, numbers, categories, status, date, proposal, notes, row.line(), censored);
    }


    /** Decodes UTF-8 strictly, pointing at the first byte that is not UTF-8. */
    static String decodeUtf8(Path file, byte[] bytes) throws InputException {
        CharsetDecoder decoder = StandardCharsets.UTF_8.newDecoder()
                .onMalformedInput(CodingErrorAction.REPORT)
                .onUnmappableCharacter(CodingErrorAction.REPORT);
        ByteBuffer in = ByteBuffer.wrap(bytes);
        CharBuffer out = CharBuffer.allocate(bytes.length + 1);
        CoderResult r = decoder.decode(in, out, true);
        if (r.isError()) {
            out.flip();
            String good = out.toString();
            int line = 1;
            int lineStart = 0;
            for (int k = 0; k < good.length(); k++) {
                char c = good.charAt(k);
                if (c == '\n' || (c == '\r' && (k + 1 >= good.length() || good.charAt(k + 1) != '\n'))) {
                    line++;
                    lineStart = k + 1;
                }
            }
            int column = good.codePointCount(lineStart, good.length()) + 1;
            throw new InputException(Diagnostic.error(file, line, column, "this is not UTF-8 text; save the"
                    + " run log as UTF-8 CSV (spreadsheets call it 'CSV UTF-8')"));
        }
        decoder.flush(out);
        out.flip();
        return out.toString();
    }
}
