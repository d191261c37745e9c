package dev.terrace.core.runlog;

import dev.terrace.core.Diagnostic;
import dev.terrace.core.DidYouMean;
import dev.terrace.core.InputException;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.io.InputFiles;
import dev.terrace.core.io.OutputFailedException;
import dev.terrace.core.io.OutputRefusedException;
import dev.terrace.core.io.SafeFiles;

import java.io.IOException;
import java.io.StringReader;
import java.nio.ByteBuffer;
import java.nio.channels.Channels;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AccessDeniedException;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.nio.file.attribute.BasicFileAttributes;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Adds one run to the end of a run log, the only way Terrace changes a run log.
 *
 * <p><b>Every existing byte stays.</b> The new file is the old file's bytes, unchanged, then (when
 * the old file does not end with a line break) one line break, then the new row and its line
 * break. The row follows the header's column order, the file's line ending (that of its first line:
 * LF, CRLF or CR) and RFC 4180 quoting where a cell needs it; comment lines, blank lines and a
 * byte-order mark stay where they are.
 *
 * <p><b>Checked first.</b> The whole new text is read by {@link RunLogReader}, the same rules as
 * {@code terrace check}; if it has any error nothing is written.
 *
 * <p><b>Atomic.</b> The new content goes to a hidden temporary file in the run log's folder, is
 * flushed to the disk, read back and compared byte for byte, then moved over the run log in one
 * atomic step, so a crash leaves the old log or the new one, never a torn row. A plain append would
 * write less, but a crash in the middle of it would leave half a row in the grower's file. The run
 * log's permissions are kept; a symbolic link is written through (the link stays). A hard link to
 * the old file keeps the old content, since the run log becomes a new file.
 *
 * <p><b>Concurrent records</b> are serialised by an exclusive lock on the run log (and a lock within
 * this process); after taking the lock the log is checked to be still the same file, else the lock
 * is taken again on the new one, so two records at once both land. The log is read through the
 * locked channel, since closing another descriptor of it would drop a POSIX lock.
 *
 * @since 0.2
 */
public final class RunLogAppender {

    /**
     * How long the lock is taken again and again while other processes keep replacing the log
     * (each record replaces it, so a burst of records by another process can win the race for
     * every new file): 60 s, far longer than a burst of records takes, short enough to end a
     * runaway loop. Own choice; it was a count of 20 attempts, which a burst of 25 records by one
     * other process could exhaust on a loaded machine.
     */
    static final long LOCK_PATIENCE_NANOS = 60_000_000_000L;

    private static final ConcurrentHashMap<Path, Object> LOCAL_LOCKS = new ConcurrentHashMap<>();
    private static final Pattern NUMBERED = Pattern.compile("(.*?)(\\d+)");

    private RunLogAppender() {
    }

    /**
     * What was (or would be) appended.
     *
     * @param file     the run log; never null
     * @param runId    the new run's id; never blank
     * @param line     the new row's line in the file
     * @param row      the row as written, without its line end; never null
     * @param run      the new run as the reader reads it; never null
     * @param warnings the reader's warnings about the new row (for example a value outside the box); never null
     */
    public record Appended(Path file, String runId, int line, String row, Run run, List<Diagnostic> warnings) {
        /** Copies the list. */
        public Appended {
            Objects.requireNonNull(file, "file");
            Objects.requireNonNull(runId, "runId");
            Objects.requireNonNull(row, "row");
            Objects.requireNonNull(run, "run");
            warnings = List.copyOf(warnings);
        }
    }

    /**
     * Checks a new row against the run log without writing anything.
     *
     * @param campaign the campaign; never null
     * @param cells    cell text by column name (unquoted); a missing {@value RunLogReader#RUN_ID} gets the
     *                 next free id; never null
     * @return what would be appended; never null
     * @throws InputException when the row or the file has an error
     * @throws IOException    when the log cannot be read
     */
    public static Appended plan(Campaign campaign, Map<String, String> cells) throws IOException, InputException {
        return plan(campaign, cells, Map.of());
    }

    /**
     * Checks a new row against the run log without writing anything.
     *
     * @param campaign the campaign; never null
     * @param cells    cell text by column name (unquoted); each must be a column of the log
     * @param ifColumn cell text used only when the log has the column and {@code cells} does not set it
     *                 (for example today's date); never null
     * @return what would be appended; never null
     * @throws InputException when the row or the file has an error
     * @throws IOException    when the log cannot be read
     */
    public static Appended plan(Campaign campaign, Map<String, String> cells, Map<String, String> ifColumn)
            throws IOException, InputException {
        Objects.requireNonNull(campaign, "campaign");
        Path file = campaign.runs();
        byte[] old = readLog(file);
        return build(campaign, file, old, cells, ifColumn).appended();
    }

    /**
     * Appends a new row (see the class notes).
     *
     * @param campaign the campaign; never null
     * @param cells    cell text by column name (unquoted); a missing {@value RunLogReader#RUN_ID} gets the
     *                 next free id; never null
     * @return what was appended; never null
     * @throws InputException         when the row or the file has an error (nothing was written)
     * @throws OutputRefusedException when the run log's folder is not writable (nothing was written)
     * @throws OutputFailedException  when writing failed part-way (the run log is unchanged)
     * @throws IOException            on other failures of the file system
     */
    public static Appended append(Campaign campaign, Map<String, String> cells) throws IOException, InputException {
        return append(campaign, cells, Map.of());
    }

    /**
     * Appends a new row (see the class notes).
     *
     * @param campaign the campaign; never null
     * @param cells    cell text by column name (unquoted); each must be a column of the log
     * @param ifColumn cell text used only when the log has the column and {@code cells} does not set it
     *                 (for example today's date); never null
     * @return what was appended; never null
     * @throws InputException         when the row or the file has an error (nothing was written)
     * @throws OutputRefusedException when the run log's folder is not writable (nothing was written)
     * @throws OutputFailedException  when writing failed part-way (the run log is unchanged)
     * @throws IOException            on other failures of the file system
     */
    public static Appended append(Campaign campaign, Map<String, String> cells, Map<String, String> ifColumn)
            throws IOException, InputException {
        Objects.requireNonNull(campaign, "campaign");
        Objects.requireNonNull(cells, "cells");
        Objects.requireNonNull(ifColumn, "ifColumn");
        Path file = campaign.runs();
        Path real;
        try {
            real = file.toRealPath();
        } catch (NoSuchFileException e) {
            throw new InputException(Diagnostic.error(file, 0, 0, "run log not found; create it first"
                    + " (terrace init writes one with the header row)"));
        }
        InputFiles.requireRegular(file, InputFiles.RUN_LOG); // a folder, FIFO or device is never opened
        synchronized (LOCAL_LOCKS.computeIfAbsent(real, k -> new Object())) {
            for (long start = System.nanoTime(); System.nanoTime() - start < LOCK_PATIENCE_NANOS; ) {
                Object before = key(real);
                try (FileChannel ch = openForLock(file, real); FileLock lock = ch.lock()) {
                    if (before != null && !before.equals(key(real))) {
                        continue; // replaced by another record while we waited: lock the new file
                    }
                    byte[] old = readLocked(file, ch);
                    Built b = build(campaign, file, old, cells, ifColumn);
                    replace(file, real, b.bytes());
                    return b.appended();
                }
            }
        }
        throw new OutputFailedException(file, "could not append to the run log " + file + ": for a minute it"
                + " kept being replaced by other processes while waiting for its lock; nothing was written", null);
    }

    // ------------------------------------------------------------------------------------------

    private record Built(byte[] bytes, Appended appended) {
    }

    private static Built build(Campaign campaign, Path file, byte[] old, Map<String, String> given,
                               Map<String, String> ifColumn) throws IOException, InputException {
        String text;
        try {
            text = StandardCharsets.UTF_8.newDecoder().decode(ByteBuffer.wrap(old)).toString();
        } catch (CharacterCodingException e) {
            // the reader words this with line and column
            RunLogReader.read(campaign, file, new StringReader(new String(old, StandardCharsets.UTF_8)));
            throw new InputException(Diagnostic.error(file, 0, 0, "the run log is not UTF-8 text"));
        }
        CsvTokenizer.Result tokens = CsvTokenizer.tokenize(text);
        if (tokens.rows().isEmpty()) {
            throw new InputException(Diagnostic.error(file, 1, 1, "the run log has no header row; expected a"
                    + " first line such as: " + RunLogWriter.headerLine(campaign)));
        }
        CsvTokenizer.Row header = tokens.rows().get(0);
        List<String> columns = header.cells().stream().map(c -> c.text().strip()).toList();
        List<Diagnostic> problems = new ArrayList<>();
        for (Map.Entry<String, String> e : given.entrySet()) {
            String name = e.getKey();
            if (!columns.contains(name)) {
                String hint = DidYouMean.suggest(name, columns).map(h -> "; did you mean '" + h + "'?").orElse("");
                boolean campaignColumn = campaign.parameter(name).isPresent() || campaign.outcome(name).isPresent()
                        || RunLogReader.RESERVED_COLUMNS.contains(name);
                problems.add(Diagnostic.error(file, header.line(), 0, "the run log has no column '" + name + "'"
                        + hint + (campaignColumn ? "; Terrace never changes existing lines, so add it yourself:"
                        + " append ," + name + " to the header row and a comma to every run's row (a spreadsheet"
                        + " does both when you insert a column)" : "") + "; its columns are: "
                        + String.join(", ", columns)));
            }
            String v = e.getValue();
            if (v.chars().anyMatch(ch -> ch < 0x20 && ch != '\t') || v.indexOf('\u2028') >= 0) {
                problems.add(Diagnostic.error(file, header.line(), 0, "the value given for '" + name
                        + "' holds a line break or control character; expected one line of text"));
            }
        }
        if (!problems.isEmpty()) {
            throw new InputException(problems);
        }
        Map<String, String> cells = new LinkedHashMap<>(given);
        ifColumn.forEach((k, v) -> {
            if (columns.contains(k) && !cells.containsKey(k)) {
                cells.put(k, v);
            }
        });
        String runId = cells.get(RunLogReader.RUN_ID);
        if (runId == null || runId.isBlank()) {
            if (!columns.contains(RunLogReader.RUN_ID)) {
                RunLogReader.read(campaign, file, new StringReader(text)); // words the missing column
            }
            runId = nextFreeId(ids(tokens, columns.indexOf(RunLogReader.RUN_ID)));
            cells.put(RunLogReader.RUN_ID, runId);
        }
        String eol = lineEnd(text);
        StringBuilder row = new StringBuilder();
        int[] starts = new int[columns.size()];
        for (int k = 0; k < columns.size(); k++) {
            row.append(k == 0 ? "" : ",");
            starts[k] = row.codePointCount(0, row.length()) + 1;
            row.append(RunLogWriter.cell(cells.getOrDefault(columns.get(k), "")));
        }
        String sep = text.isEmpty() || endsWithBreak(text) ? "" : eol;
        String prefix = text + sep;
        int line = lines(prefix) + 1;
        String newText = prefix + row + eol;
        RunLog log;
        try {
            log = RunLogReader.read(campaign, file, new StringReader(newText));
        } catch (InputException e) {
            List<Diagnostic> named = new ArrayList<>();
            for (Diagnostic d : e.diagnostics()) {
                if (d.line() < line && d.severity() != Diagnostic.Severity.ERROR) {
                    continue; // an existing row's warning is check's to report, not a cause of this refusal
                }
                named.add(d.line() < line ? d : new Diagnostic(d.file(), d.line(), d.column(), d.severity(),
                        "the new row" + argument(columns, starts, cells, d.column()) + ": " + d.message()));
            }
            throw new InputException(named);
        }
        Run run = log.runs().stream().filter(r -> r.line() == line).findFirst()
                .orElseThrow(() -> new IllegalStateException("the new row was not read back"));
        List<Diagnostic> warnings = log.warnings().stream().filter(d -> d.line() >= line).toList();
        byte[] tail = (sep + row + eol).getBytes(StandardCharsets.UTF_8);
        byte[] bytes = Arrays.copyOf(old, old.length + tail.length);
        System.arraycopy(tail, 0, bytes, old.length, tail.length);
        return new Built(bytes, new Appended(file, runId, line, row.toString(), run, warnings));
    }

    /** Names the cell a diagnostic's column points at, as the NAME=VALUE it came from. */
    private static String argument(List<String> columns, int[] starts, Map<String, String> cells, int column) {
        int k = -1;
        for (int i = 0; i < starts.length; i++) {
            if (starts[i] <= column) {
                k = i;
            }
        }
        if (k < 0 || column == 0) {
            return "";
        }
        String name = columns.get(k);
        return " (" + name + "=" + cells.getOrDefault(name, "") + ")";
    }

    /**
     * The next free run id: the last run's prefix with the largest number of that prefix plus one,
     * keeping the last id's zero padding (D07, D08 → D09); {@code R1} when no id ends in digits.
     *
     * @param ids the ids in file order; never null
     * @return an id not in {@code ids}; never null
     */
    static String nextFreeId(List<String> ids) {
        Set<String> taken = new HashSet<>(ids);
        String prefix = "R";
        int width = 1;
        long max = 0;
        for (int k = ids.size() - 1; k >= 0; k--) {
            Matcher m = NUMBERED.matcher(ids.get(k));
            if (m.matches() && m.group(2).length() <= 18) {
                prefix = m.group(1);
                width = m.group(2).length();
                break;
            }
        }
        for (String id : ids) {
            Matcher m = NUMBERED.matcher(id);
            if (m.matches() && m.group(1).equals(prefix) && m.group(2).length() <= 18) {
                max = Math.max(max, Long.parseLong(m.group(2)));
            }
        }
        long n = max + 1;
        while (true) {
            String id = prefix + String.format(java.util.Locale.ROOT, "%0" + width + "d", n);
            if (!taken.contains(id)) {
                return id;
            }
            n++;
        }
    }

    private static List<String> ids(CsvTokenizer.Result tokens, int column) {
        List<String> ids = new ArrayList<>();
        for (CsvTokenizer.Row r : tokens.rows().subList(1, tokens.rows().size())) {
            if (column >= 0 && column < r.cells().size()) {
                ids.add(r.cells().get(column).text().strip());
            }
        }
        return ids;
    }

    /** The file's line ending: that of its first line, LF when it has none. */
    static String lineEnd(String text) {
        for (int k = 0; k < text.length(); k++) {
            char c = text.charAt(k);
            if (c == '\n') {
                return "\n";
            }
            if (c == '\r') {
                return k + 1 < text.length() && text.charAt(k + 1) == '\n' ? "\r\n" : "\r";
            }
        }
        return "\n";
    }

    private static boolean endsWithBreak(String text) {
        char c = text.charAt(text.length() - 1);
        return c == '\n' || c == '\r';
    }

    /** Line breaks in the text as the reader counts them (CRLF, LF or a lone CR). */
    private static int lines(String text) {
        int n = 0;
        for (int k = 0; k < text.length(); k++) {
            char c = text.charAt(k);
            if (c == '\n' || (c == '\r' && (k + 1 >= text.length() || text.charAt(k + 1) != '\n'))) {
                n++;
            }
        }
        return n;
    }

    private static byte[] readLog(Path file) throws IOException, InputException {
        try {
            return InputFiles.read(file, InputFiles.RUN_LOG);
        } catch (NoSuchFileException e) {
            throw new InputException(Diagnostic.error(file, 0, 0, "run log not found; create it first"
                    + " (terrace init writes one with the header row)"));
        }
    }

    /**
     * Reads the log through the locked channel itself, with the limits of every reader: on POSIX
     * systems closing any other descriptor of the file would release this process's lock.
     */
    private static byte[] readLocked(Path file, FileChannel ch) throws IOException, InputException {
        return InputFiles.read(file, InputFiles.RUN_LOG, ch);
    }

    private static Object key(Path real) throws IOException {
        return Files.readAttributes(real, BasicFileAttributes.class).fileKey();
    }

    private static FileChannel openForLock(Path file, Path real) throws IOException {
        try {
            return FileChannel.open(real, StandardOpenOption.READ, StandardOpenOption.WRITE);
        } catch (AccessDeniedException e) {
            throw new OutputRefusedException(file, "cannot record into the run log " + file
                    + ": permission denied; expected a run log you may write to");
        }
    }

    /** Writes the new content beside the log, checks it, and moves it over the log atomically. */
    private static void replace(Path file, Path real, byte[] bytes) throws IOException {
        Path dir = real.getParent();
        Path tmp;
        try {
            tmp = Files.createTempFile(dir, "." + real.getFileName() + SafeFiles.PARTIAL_MARK
                    + ProcessHandle.current().pid() + "-", "");
        } catch (AccessDeniedException e) {
            throw new OutputRefusedException(file, "cannot record into the run log " + file + ": its folder "
                    + dir + " is not writable (the new log is written beside it, then moved into place)");
        }
        try {
            try (FileChannel ch = FileChannel.open(tmp, StandardOpenOption.WRITE)) {
                var out = Channels.newOutputStream(ch);
                out.write(bytes);
                out.flush();
                ch.force(true);
            }
            if (!Arrays.equals(bytes, Files.readAllBytes(tmp))) {
                throw new IOException("the new run log read back differs from what was written");
            }
            try {
                Files.setPosixFilePermissions(tmp, Files.getPosixFilePermissions(real));
            } catch (UnsupportedOperationException e) {
                // not a POSIX file system: the temporary file's permissions stay
            }
            try {
                Files.move(tmp, real, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
            } catch (AtomicMoveNotSupportedException e) {
                throw new IOException("this file system cannot replace a file atomically", e);
            }
            try (FileChannel d = FileChannel.open(dir, StandardOpenOption.READ)) {
                d.force(true);
            } catch (IOException | RuntimeException e) {
                // not every platform can open a folder; the file itself was forced already
            }
        } catch (IOException e) {
            if (e instanceof OutputRefusedException) {
                throw e;
            }
            throw new OutputFailedException(file, "could not record into the run log " + file + ": "
                    + e.getMessage() + "; nothing was written and the run log is unchanged", e);
        } finally {
            Files.deleteIfExists(tmp);
        }
    }
}
