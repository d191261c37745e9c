package dev.terrace.cli;

import dev.terrace.core.LoadedCampaign;
import dev.terrace.core.io.SafeFiles;
import picocli.CommandLine;
import picocli.CommandLine.Option;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;

/** {@code --format}, {@code --out} and {@code --force} for commands that print results. */
final class OutputOptions {

    /** The format used when neither --format nor a known --out extension says otherwise. */
    static final String DEFAULT_FORMAT = "table";

    @Option(names = "--format", description = "table, csv or json. Without it, --out FILE picks the format from the "
            + "extension (.csv, .json, or .txt for a table); otherwise the format is table.")
    String format;

    @Option(names = "--out", paramLabel = "FILE", description = "Also write the result to FILE (never overwrites without --force).")
    Path out;

    @Option(names = "--force", description = "Allow --out to replace an existing file (atomically); the campaign's"
            + " own files are never replaced.")
    boolean force;

    /** The checked --out target, set by {@link #guard}. */
    private SafeFiles.Target target;

    /** Checks --format; --out is checked by {@link #guard} once the campaign is read. */
    void check(CommandLine.Model.CommandSpec spec) {
        if (format != null && !format.equals("table") && !format.equals("csv") && !format.equals("json")) {
            throw new CommandLine.ParameterException(spec.commandLine(),
                    "--format must be table, csv or json, found '" + format + "'");
        }
    }

    /**
     * The format to print and write: an explicit --format wins; else the --out extension picks it
     * (.csv, .json, .txt for a table, any case); else {@value #DEFAULT_FORMAT}. An --out file with
     * another extension gets the default format and a note on standard error saying so.
     *
     * @param err where the note about an unknown extension goes
     * @return table, csv or json
     */
    String resolve(PrintWriter err) {
        if (format != null) {
            return format;
        }
        if (out == null || out.getFileName() == null) {
            return DEFAULT_FORMAT;
        }
        String name = out.getFileName().toString().toLowerCase(java.util.Locale.ROOT);
        if (name.endsWith(".csv")) {
            return "csv";
        }
        if (name.endsWith(".json")) {
            return "json";
        }
        if (name.endsWith(".txt")) {
            return "table";
        }
        err.println("note: --out " + out + " does not end in .csv, .json or .txt, so it gets a " + DEFAULT_FORMAT
                + "; give --format csv or --format json to choose another format");
        err.flush();
        return DEFAULT_FORMAT;
    }

    /**
     * Checks --out against the campaign's inputs before any long work, so a refused output is
     * reported at once.
     *
     * @param lc    the campaign read
     * @param extra more inputs (a candidates file)
     */
    void guard(LoadedCampaign lc, List<SafeFiles.Input> extra) throws Exception {
        if (out == null) {
            return;
        }
        target = SafeFiles.target(out).replacing(force).protecting(lc.inputs()).protecting(extra);
        target.check();
    }

    void emit(CommandLine.Model.CommandSpec spec, String text) throws Exception {
        PrintWriter o = spec.commandLine().getOut();
        o.print(text);
        if (!text.endsWith("\n")) {
            o.println();
        }
        o.flush();
        if (out != null) {
            if (target == null) {
                throw new IllegalStateException("--out was not checked against the campaign's inputs");
            }
            target.write(text);
            spec.commandLine().getErr().println("wrote " + out);
            spec.commandLine().getErr().flush();
        }
    }
}
