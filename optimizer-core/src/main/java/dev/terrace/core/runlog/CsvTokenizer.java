package dev.terrace.core.runlog;

import java.util.ArrayList;
import java.util.List;

/**
 * Splits run-log text into rows and cells (RFC 4180 quoting), keeping the 1-based physical line
 * and column of every cell so that diagnostics can point at it.
 *
 * <p>Why not Jackson's {@code CsvParser}: it reports the right column for well-formed cells, but
 * for a quote that is never closed it reports the end of the input rather than the opening quote,
 * and after a quoting error it cannot carry on reliably, so one bad quote would hide every later
 * problem in the file. This tokenizer reports where the quote opened and resumes on the next line.
 *
 * <p>Rules, beyond RFC 4180:
 * <ul>
 *   <li>a line whose first character is {@code #} is a comment (outside quoted cells);</li>
 *   <li>lines holding only spaces and tabs are skipped;</li>
 *   <li>line ends may be LF, CRLF or CR; a newline inside quotes is kept as LF;</li>
 *   <li>spaces and tabs around a cell are dropped, also around a quoted cell;</li>
 *   <li>a quote inside an unquoted cell ({@code 5" wafer}) is kept as a literal character;</li>
 *   <li>columns count Unicode code points, as editors do; a leading byte-order mark is ignored.</li>
 * </ul>
 */
final class CsvTokenizer {

    /**
     * One cell.
     *
     * @param text   the cell text: unquoted and unescaped, surrounding spaces and tabs removed
     * @param quoted true when the cell was written in double quotes
     * @param line   1-based line of the cell's first character (its opening quote when quoted)
     * @param column 1-based column of that character
     */
    record Cell(String text, boolean quoted, int line, int column) {
    }

    /**
     * One row (record): a physical line, or several when a quoted cell holds line breaks.
     *
     * @param line      1-based line where the row starts
     * @param cells     the cells, at least one
     * @param endLine   line of the row's last character
     * @param endColumn column just after the row's last character
     * @param broken    true when a quoting problem made the cells unreliable
     */
    record Row(int line, List<Cell> cells, int endLine, int endColumn, boolean broken) {
        Row {
            cells = List.copyOf(cells);
        }
    }

    /**
     * A quoting problem.
     *
     * @param line    1-based line
     * @param column  1-based column
     * @param message what is wrong and what was expected
     */
    record Problem(int line, int column, String message) {
    }

    /**
     * The tokenizer's output.
     *
     * @param rows     the rows in file order
     * @param problems the quoting problems in file order
     */
    record Result(List<Row> rows, List<Problem> problems) {
        Result {
            rows = List.copyOf(rows);
            problems = List.copyOf(problems);
        }
    }

    private final String s;
    private int i;
    private int line = 1;
    private int col = 1;
    private final List<Row> rows = new ArrayList<>();
    private final List<Problem> problems = new ArrayList<>();

    private CsvTokenizer(String text) {
        this.s = text;
        this.i = !text.isEmpty() && text.charAt(0) == '\uFEFF' ? 1 : 0;
    }

    /**
     * Splits a whole run log.
     *
     * @param text the file contents
     * @return rows and quoting problems; never null
     */
    static Result tokenize(String text) {
        CsvTokenizer t = new CsvTokenizer(text);
        for (Row r = t.next(); r != null; r = t.next()) {
            t.rows.add(r);
        }
        return new Result(t.rows, t.problems);
    }

    /**
     * A tokenizer that hands out one row at a time ({@link #next()}), so that a long log is never
     * held as cells all at once.
     *
     * @param text the file contents
     * @return the tokenizer; never null
     */
    static CsvTokenizer over(String text) {
        return new CsvTokenizer(text);
    }

    /**
     * @return the next row, skipping comment and blank lines, or null at the end of the text
     */
    Row next() {
        while (!atEnd()) {
            if (peek() == '#' || restOfLineIsBlank()) {
                skipRestOfLine();
            } else {
                return readRow();
            }
        }
        return null;
    }

    /** @return the quoting problems met so far, in file order; never null */
    List<Problem> problems() {
        return List.copyOf(problems);
    }

    private Row readRow() {
        int rowLine = line;
        List<Cell> cells = new ArrayList<>();
        boolean broken = false;
        while (true) {
            int cellLine = line;
            int cellCol = col;
            skipBlanks();
            if (!atEnd() && peek() == '"') {
                int qIndex = i;
                int qLine = line;
                int qCol = col;
                step();
                StringBuilder sb = new StringBuilder();
                boolean closed = false;
                while (!atEnd()) {
                    char c = peek();
                    if (c == '"') {
                        if (i + 1 < s.length() && s.charAt(i + 1) == '"') {
                            sb.append('"');
                            step();
                            step();
                        } else {
                            step();
                            closed = true;
                            break;
                        }
                    } else if (atEol()) {
                        sb.append('\n');
                        consumeEol();
                    } else {
                        int from = i;
                        step();
                        sb.append(s, from, i);
                    }
                }
                if (!closed) {
                    problems.add(new Problem(qLine, qCol, "this double quote is never closed; a quoted cell"
                            + " must end with a double quote (write a quote inside it as two quotes \"\")"));
                    // Resume on the line after the opening quote; the rest of that line is lost.
                    i = qIndex;
                    line = qLine;
                    col = qCol;
                    int endCol = skipRestOfLine();
                    return new Row(rowLine, withPlaceholder(cells, qLine, qCol), qLine, endCol, true);
                }
                skipBlanks();
                if (!atEnd() && !atEol() && peek() != ',') {
                    problems.add(new Problem(line, col, "unexpected text after the closing double quote;"
                            + " expected a comma or the end of the line (put the whole value inside the quotes)"));
                    broken = true;
                    while (!atEnd() && !atEol() && peek() != ',') {
                        step();
                    }
                }
                cells.add(new Cell(sb.toString(), true, qLine, qCol));
            } else {
                int contentLine = line;
                int contentCol = col;
                int from = i;
                int lastNonBlank = i;
                while (!atEnd() && !atEol() && peek() != ',') {
                    char c = peek();
                    step();
                    if (c != ' ' && c != '\t') {
                        lastNonBlank = i;
                    }
                }
                String text = s.substring(from, lastNonBlank);
                if (text.isEmpty()) {
                    cells.add(new Cell("", false, cellLine, cellCol));
                } else {
                    cells.add(new Cell(text, false, contentLine, contentCol));
                }
            }
            if (atEnd()) {
                break;
            }
            if (peek() == ',') {
                step();
                continue;
            }
            break;
        }
        int endLine = line;
        int endCol = col;
        if (!atEnd()) {
            consumeEol();
        }
        return new Row(rowLine, cells, endLine, endCol, broken);
    }

    private static List<Cell> withPlaceholder(List<Cell> cells, int line, int column) {
        List<Cell> out = new ArrayList<>(cells);
        out.add(new Cell("", true, line, column));
        return out;
    }

    private boolean atEnd() {
        return i >= s.length();
    }

    private char peek() {
        return s.charAt(i);
    }

    private boolean atEol() {
        char c = s.charAt(i);
        return c == '\n' || c == '\r';
    }

    /** Moves over one code point that is not a line end. */
    private void step() {
        char c = s.charAt(i++);
        if (Character.isHighSurrogate(c) && i < s.length() && Character.isLowSurrogate(s.charAt(i))) {
            i++;
        }
        col++;
    }

    private void consumeEol() {
        char c = s.charAt(i++);
        if (c == '\r' && i < s.length() && s.charAt(i) == '\n') {
            i++;
        }
        line++;
        col = 1;
    }

    private void skipBlanks() {
        while (!atEnd() && (peek() == ' ' || peek() == '\t')) {
            step();
        }
    }

    private boolean restOfLineIsBlank() {
        int k = i;
        while (k < s.length() && (s.charAt(k) == ' ' || s.charAt(k) == '\t')) {
            k++;
        }
        return k >= s.length() || s.charAt(k) == '\n' || s.charAt(k) == '\r';
    }

    /** Skips to the start of the next line; returns the column where the line ended. */
    private int skipRestOfLine() {
        while (!atEnd() && !atEol()) {
            step();
        }
        int endCol = col;
        if (!atEnd()) {
            consumeEol();
        }
        return endCol;
    }
}
