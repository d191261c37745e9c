package dev.terrace.core.runlog;

import dev.terrace.core.Diagnostic;
import dev.terrace.core.InputException;
import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.io.InputFiles;

import java.io.IOException;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashSet;
import java.util.List;
import java.util.Objects;
import java.util.Set;

/**
 * Reads a file of candidate recipes for ranking: the run-log format and checks of
 * {@link RunLogReader}, with {@value RunLogReader#RUN_ID} optional (candidates are then named C1,
 * C2, ... in file order), and three checks of its own, each an error naming the file, line and
 * column:
 * <ul>
 *   <li>an empty file (or one of only comments and blank lines) is refused at line 1, column 1;</li>
 *   <li>a header without a column for one of the campaign's settings is refused at the end of the
 *       header line, since no candidate in the file could then be ranked;</li>
 *   <li>a header with no candidate row below it is refused at the line after the header.</li>
 * </ul>
 * Outcome and status columns are allowed and ignored by ranking. The file is only read.
 *
 * @since 0.3
 */
public final class CandidatesReader {

    private CandidatesReader() {
    }

    /**
     * Reads and checks a candidates file.
     *
     * @param campaign the campaign whose settings the columns name; never null
     * @param file     the CSV file (UTF-8); never null
     * @return the candidates as runs, at least one; never null
     * @throws InputException when the file is missing, empty, lacks a setting column, holds no
     *                        candidate row, or holds any error of the run-log format; it carries
     *                        every diagnostic in line order
     * @throws IOException    on other read failures
     */
    public static RunLog read(Campaign campaign, Path file) throws IOException, InputException {
        Objects.requireNonNull(campaign, "campaign");
        Objects.requireNonNull(file, "file");
        String text;
        try {
            text = RunLogReader.decodeUtf8(file, InputFiles.read(file, InputFiles.CANDIDATES));
        } catch (NoSuchFileException e) {
            throw new InputException(Diagnostic.error(file, 0, 0, "candidate file not found"));
        }
        return check(campaign, file, text);
    }

    /**
     * Checks candidates given as text; the entry point of {@link #read} once the file is decoded.
     *
     * @param campaign the campaign; never null
     * @param file     the name diagnostics carry; never null
     * @param text     the file's text; never null
     * @return the candidates, at least one; never null
     * @throws InputException as {@link #read}
     */
    static RunLog check(Campaign campaign, Path file, String text) throws InputException {
        CsvTokenizer.Result tokens = CsvTokenizer.tokenize(text);
        if (tokens.rows().isEmpty() && tokens.problems().isEmpty()) {
            throw new InputException(Diagnostic.error(file, 1, 1, (text.isBlank() ? "the candidates file is empty"
                    : "the candidates file holds only comments and blank lines") + "; expected a header row naming"
                    + " the settings, such as: " + expectedHeader(campaign) + ", then one row per candidate"));
        }
        List<Diagnostic> own = new ArrayList<>();
        CsvTokenizer.Row header = tokens.rows().isEmpty() ? null : tokens.rows().get(0);
        if (header != null && !header.broken()) {
            missingSettings(campaign, file, header).ifPresent(own::add);
        }
        RunLog log;
        try {
            log = RunLogReader.parse(campaign, file, text, true);
        } catch (InputException e) {
            throw merged(own, e.diagnostics());
        }
        if (!own.isEmpty()) {
            throw merged(own, log.warnings());
        }
        if (log.runs().isEmpty()) {
            List<Diagnostic> d = new ArrayList<>(log.warnings());
            d.add(Diagnostic.error(file, header == null ? 1 : header.endLine() + 1, 1, "the candidates file holds a header but no"
                    + " candidate; expected one row per candidate recipe below the header, with a value for each"
                    + " of its columns"));
            throw merged(List.of(), d);
        }
        return log;
    }

    /** The error for a header lacking setting columns, at the end of the header line. */
    private static java.util.Optional<Diagnostic> missingSettings(Campaign campaign, Path file, CsvTokenizer.Row header) {
        Set<String> names = new HashSet<>();
        header.cells().forEach(c -> names.add(c.text().strip()));
        Set<String> known = new HashSet<>(RunLogReader.RESERVED_COLUMNS);
        campaign.parameters().forEach(p -> known.add(p.name()));
        campaign.outcomes().forEach(o -> known.add(o.name()));
        if (names.stream().noneMatch(known::contains)) {
            return java.util.Optional.empty(); // a foreign file: the run-log reader words that one
        }
        List<String> missing = campaign.parameters().stream().map(ParameterSpec::name)
                .filter(n -> !names.contains(n)).toList();
        if (missing.isEmpty()) {
            return java.util.Optional.empty();
        }
        String list = String.join("', '", missing);
        return java.util.Optional.of(Diagnostic.error(file, header.endLine(), header.endColumn(), "the header has no"
                + " column for the setting" + (missing.size() == 1 ? " '" : "s '") + list + "'; every candidate needs"
                + " a value for each setting of campaign " + campaign.id() + "; expected a header such as: "
                + expectedHeader(campaign)));
    }

    /** A header naming an optional run_id and every setting, in campaign order. */
    static String expectedHeader(Campaign campaign) {
        StringBuilder sb = new StringBuilder(RunLogReader.RUN_ID);
        campaign.parameters().forEach(p -> sb.append(',').append(RunLogWriter.cell(p.name())));
        return sb.toString();
    }

    private static InputException merged(List<Diagnostic> a, List<Diagnostic> b) {
        List<Diagnostic> all = new ArrayList<>(a);
        all.addAll(b);
        all.sort(Comparator.comparingInt(Diagnostic::line).thenComparingInt(Diagnostic::column));
        return new InputException(all);
    }
}
