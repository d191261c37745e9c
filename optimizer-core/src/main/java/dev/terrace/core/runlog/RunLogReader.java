package dev.terrace.core.runlog;

import dev.terrace.core.Diagnostic;
import dev.terrace.core.DidYouMean;
import dev.terrace.core.InputException;
import dev.terrace.core.io.InputFiles;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.Scale;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.units.Unit;
import dev.terrace.core.units.Units;
import dev.terrace.spi.Quantity;

import java.io.IOException;
import java.io.Reader;
import java.math.BigDecimal;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.time.LocalDate;
import java.time.LocalDateTime;
import java.time.OffsetDateTime;
import java.time.format.DateTimeFormatter;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.function.Consumer;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

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

    /** Longest stretch of a cell quoted back in a message, in code points. */
    static final int SHOWN_LENGTH = 40;

    private static final Pattern NUMBER =
            Pattern.compile("[+-]?(?:\\d+(?:\\.\\d*)?|\\.\\d+)(?:[eE][+-]?\\d+)?");
    private static final Pattern NUMBER_WITH_SUFFIX =
            Pattern.compile("[+-]?(?:\\d+(?:\\.\\d*)?|\\.\\d+)(?:[eE][+-]?\\d+)?(\\s*)([^\\d\\s.,+-].*)");
    private static final Pattern NON_FINITE =
            Pattern.compile("[+-]?(?:nan|inf|infinity|\u221e)", Pattern.CASE_INSENSITIVE);
    private static final Pattern DIGITS_AND_SEPARATORS = Pattern.compile("[+-]?[\\d.,]*\\d[\\d.,]*(?:[eE][+-]?\\d+)?");

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
        return parse(campaign, file, decodeUtf8(file, bytes));
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
        CsvTokenizer.Result tokens = CsvTokenizer.tokenize(text);
        for (CsvTokenizer.Problem p : tokens.problems()) {
            diags.add(Diagnostic.error(file, p.line(), p.column(), p.message()));
        }
        List<Run> runs = new ArrayList<>();
        if (tokens.rows().isEmpty()) {
            diags.add(Diagnostic.error(file, 1, 1, "the run log has no header row; expected a first line"
                    + " such as: " + RunLogWriter.headerLine(campaign)));
        } else {
            CsvTokenizer.Row headerRow = tokens.rows().get(0);
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
                for (CsvTokenizer.Row row : tokens.rows().subList(1, tokens.rows().size())) {
                    index++;
                    Run run = readRow(campaign, file, header, row, firstLine, diags,
                            candidates && header.stream().noneMatch(c -> c.kind() == Kind.RUN_ID) ? "C" + index : null);
                    if (run != null) {
                        runs.add(run);
                    }
                }
            }
        }
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
        int before = errorCount(diags);
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
        if (runId == null || errorCount(diags) > before) {
            return null;
        }
        return new Run(runId, numbers, categories, status, date, proposal, notes, row.line(), censored);
    }

    private static void readChoice(List<Diagnostic> diags, Path file, CsvTokenizer.Cell cell, String name,
                                   String t, List<String> allowed, Map<String, String> into) {
        if (t.isEmpty()) {
            return;
        }
        if (allowed.contains(t)) {
            into.put(name, t);
            return;
        }
        String hint = DidYouMean.suggest(t, allowed).map(h -> "; did you mean '" + h + "'?").orElse("");
        error(diags, file, cell, "column '" + name + "' expects " + oneOf(allowed) + ", found '"
                + shown(t) + "'" + hint);
    }

    /**
     * Reads a numeric outcome cell: a plain number, or a censored value {@code <X} (below X, for
     * example below detection) or {@code >X} (above X). On a {@code scale: log} outcome a plain value
     * of zero or below cannot be used, and the message suggests the censored form instead.
     */
    private static void readOutcomeNumber(List<Diagnostic> diags, Path file, CsvTokenizer.Cell cell,
                                          OutcomeSpec o, String t, Campaign campaign, Map<String, Double> numbers,
                                          Map<String, Censored> censored) {
        if (t.isEmpty()) {
            return;
        }
        char first = t.charAt(0);
        if (first == '<' || first == '>') {
            Censored.Side side = first == '<' ? Censored.Side.BELOW : Censored.Side.ABOVE;
            String rest = t.substring(1).strip();
            if (rest.startsWith("=")) {
                rest = rest.substring(1).strip(); // "<=X" reads as "<X": a bound, not an exact value
            }
            if (rest.isEmpty()) {
                error(diags, file, cell, "column '" + o.name() + "' holds '" + shown(t) + "' with no bound;"
                        + " write " + side.symbol() + "X with X a number, for example " + side.symbol() + "1e8");
                return;
            }
            Double bound = readNumber(diags, file, cell, o.name(), rest, o.unit(), campaign);
            if (bound == null) {
                return;
            }
            if (o.scale() == Scale.LOG && bound <= 0) {
                error(diags, file, cell, "column '" + o.name() + "' is on a log scale, so the bound in '"
                        + shown(t) + "' must be above zero (for example <1e8 for 'below 1e8')");
                return;
            }
            censored.put(o.name(), new Censored(side, bound));
            return;
        }
        Double v = readNumber(diags, file, cell, o.name(), t, o.unit(), campaign);
        if (v == null) {
            return;
        }
        if (o.scale() == Scale.LOG && v <= 0) {
            error(diags, file, cell, "column '" + o.name() + "' is on a log scale and cannot hold " + shown(t)
                    + "; if nothing was detected, write the detection limit as a censored value such as <1e8"
                    + " (meaning below 1e8" + unitSuffix(o.unit()) + ")");
            return;
        }
        numbers.put(o.name(), v);
    }

    /** Parses and checks a numeric cell; returns null when empty or wrong (the error is added). */
    private static Double readNumber(List<Diagnostic> diags, Path file, CsvTokenizer.Cell cell, String name,
                                     String t, Unit unit, Campaign campaign) {
        if (t.isEmpty()) {
            return null;
        }
        String expects = "column '" + name + "' expects a number" + (isDimensionless(unit) ? "" : " in " + unit.symbol());
        if (NUMBER.matcher(t).matches()) {
            double v = Double.parseDouble(t);
            double canonical = unit.toCanonical(v, campaign.surface().monolayerHeightNm());
            if (!Double.isFinite(v) || !Double.isFinite(canonical)) {
                error(diags, file, cell, expects + ", found '" + shown(t) + "', which is too large to use");
                return null;
            }
            Quantity q = unit.quantity();
            if (q == Quantity.TEMPERATURE && canonical < 0) {
                error(diags, file, cell, "column '" + name + "' is a temperature in " + unit.symbol() + "; "
                        + shown(t) + " " + unit.symbol() + " is below absolute zero ("
                        + fmt(unit.fromCanonical(0, campaign.surface().monolayerHeightNm())) + " "
                        + unit.symbol() + ")");
                return null;
            }
            String noun = nonNegativeNoun(q);
            if (noun != null && canonical < 0) {
                error(diags, file, cell, "column '" + name + "' is " + noun + " and cannot be negative, found "
                        + shown(t) + unitSuffix(unit));
                return null;
            }
            return v;
        }
        if (NON_FINITE.matcher(t).matches()) {
            error(diags, file, cell, expects + ", found '" + shown(t) + "'; NaN and infinity are not"
                    + " measurements (leave the cell empty if the value was not measured)");
        } else if (t.indexOf(',') >= 0 && DIGITS_AND_SEPARATORS.matcher(t).matches()) {
            error(diags, file, cell, expects + ", found '" + shown(t) + "' (use a decimal point"
                    + (t.indexOf('.') >= 0 ? " and no thousands separator)" : ")"));
        } else if (NUMBER.matcher(t.replace('\u2212', '-')).matches()) {
            error(diags, file, cell, expects + ", found '" + shown(t) + "' (use the plain minus sign '-')");
        } else if (hasUnitAttached(t)) {
            error(diags, file, cell, expects + ", found '" + shown(t) + "' (write the number alone;"
                    + " the campaign sets the unit" + (isDimensionless(unit) ? ")" : ", " + unit.symbol() + ")"));
        } else if (t.codePoints().noneMatch(Character::isDigit)) {
            error(diags, file, cell, "column '" + name + "' is numeric"
                    + (isDimensionless(unit) ? "" : " (" + unit.symbol() + ")") + " but holds the text '" + shown(t)
                    + "'; write a number, or leave the cell empty if it was not measured");
        } else {
            error(diags, file, cell, expects + ", found '" + shown(t) + "'");
        }
        return null;
    }

    /** True for a number followed by a unit: {@code 150 degC}, {@code 150degC}, {@code 150°C}, not {@code 15O}. */
    private static boolean hasUnitAttached(String t) {
        Matcher m = NUMBER_WITH_SUFFIX.matcher(t);
        if (!m.matches()) {
            return false;
        }
        String suffix = m.group(2).strip();
        return !m.group(1).isEmpty() || suffix.startsWith("\u00b0") || Units.bySymbol(suffix).isPresent();
    }

    private static String nonNegativeNoun(Quantity q) {
        switch (q) {
            case DEPOSITION_RATE:
                return "a deposition rate";
            case PRESSURE:
                return "a pressure";
            case COVERAGE:
                return "a coverage";
            case TIME:
                return "a time";
            case AREAL_DENSITY:
                return "a density";
            case LENGTH:
                return "a length";
            case PARTICLE_FLUX:
                return "a flux";
            default:
                return null;
        }
    }

    private static boolean isDimensionless(Unit unit) {
        return unit.quantity() == Quantity.DIMENSIONLESS;
    }

    /** @return {@code " degC"}, or empty for a dimensionless unit */
    private static String unitSuffix(Unit unit) {
        return isDimensionless(unit) ? "" : " " + unit.symbol();
    }

    /**
     * Accepts ISO 8601 calendar dates (extended {@code 2024-05-17} or basic {@code 20240517}) and
     * date-times with or without an offset; a space may stand for the {@code T}, as RFC 3339 allows.
     */
    private static boolean isIsoDate(String t) {
        String u = t.length() > 10 && t.charAt(10) == ' ' ? t.substring(0, 10) + 'T' + t.substring(11) : t;
        List<Consumer<String>> forms = List.of(
                x -> LocalDate.parse(x, DateTimeFormatter.ISO_LOCAL_DATE),
                x -> LocalDate.parse(x, DateTimeFormatter.BASIC_ISO_DATE),
                x -> LocalDateTime.parse(x, DateTimeFormatter.ISO_LOCAL_DATE_TIME),
                x -> OffsetDateTime.parse(x, DateTimeFormatter.ISO_OFFSET_DATE_TIME));
        for (Consumer<String> form : forms) {
            try {
                form.accept(u);
                return true;
            } catch (DateTimeParseException e) {
                // not this form; try the next
            }
        }
        return false;
    }

    private static String oneOf(List<String> allowed) {
        if (allowed.size() == 1) {
            return "'" + allowed.get(0) + "'";
        }
        StringBuilder sb = new StringBuilder("one of ");
        for (int k = 0; k < allowed.size(); k++) {
            sb.append(k == 0 ? "" : ", ").append('\'').append(allowed.get(k)).append('\'');
        }
        return sb.toString();
    }

    private static void error(List<Diagnostic> diags, Path file, CsvTokenizer.Cell cell, String message) {
        diags.add(Diagnostic.error(file, cell.line(), cell.column(), message));
    }

    private static int errorCount(List<Diagnostic> diags) {
        int n = 0;
        for (Diagnostic d : diags) {
            if (d.isError()) {
                n++;
            }
        }
        return n;
    }

    /** A number as a grower would write it: no trailing zeros, plain notation for everyday sizes. */
    static String fmt(double v) {
        BigDecimal b = new BigDecimal(Double.toString(v)).stripTrailingZeros();
        double a = Math.abs(v);
        return a == 0 || (a >= 1e-4 && a < 1e7) ? b.toPlainString() : b.toString();
    }

    /** A cell's text made safe to quote in a one-line message: control characters escaped, long text cut. */
    /**
     * The first control character of a cell (C0, DEL or C1), or -1. Tab, carriage return and line
     * feed are allowed in notes, where quoted text may span lines.
     */
    static int controlCharacter(String text, boolean notes) {
        for (int k = 0; k < text.length(); k++) {
            char c = text.charAt(k);
            if (Character.isISOControl(c) && !(notes && (c == '\t' || c == '\n' || c == '\r'))) {
                return c;
            }
        }
        return -1;
    }

    /** At most {@value #EXCERPT_LENGTH} characters of a line from a file that may not be ours, escaped. */
    private static String excerpt(String text) {
        String t = text.length() > EXCERPT_LENGTH ? text.substring(0, EXCERPT_LENGTH) + "\u2026" : text;
        return shown(t);
    }

    /** Characters of a foreign first line shown in an error (a project choice: enough to recognise it). */
    private static final int EXCERPT_LENGTH = 24;

    static String shown(String text) {
        StringBuilder sb = new StringBuilder();
        int count = 0;
        for (int k = 0; k < text.length(); ) {
            int cp = text.codePointAt(k);
            k += Character.charCount(cp);
            if (++count > SHOWN_LENGTH) {
                sb.append('\u2026');
                break;
            }
            if (cp == '\n') {
                sb.append("\\n");
            } else if (Character.isISOControl(cp) || cp == '\u2028' || cp == '\u2029') {
                sb.append(String.format(Locale.ROOT, "\\u%04x", cp));
            } else {
                sb.appendCodePoint(cp);
            }
        }
        return sb.toString();
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
