package dev.terrace.cli;

import dev.terrace.core.io.SafeFiles;
import picocli.CommandLine;
import picocli.CommandLine.Option;

import java.io.PrintWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;

/** {@code --format}, {@code --out} and {@code --force} for commands that print results. */
final class OutputOptions {

    @Option(names = "--format", defaultValue = "table", description = "table, csv or json (default: ${DEFAULT-VALUE}).")
    String format;

    @Option(names = "--out", paramLabel = "FILE", description = "Also write the result to FILE (never overwrites without --force).")
    Path out;

    @Option(names = "--force", description = "Allow --out to replace an existing file (atomically).")
    boolean force;

    void check(CommandLine.Model.CommandSpec spec) {
        if (!format.equals("table") && !format.equals("csv") && !format.equals("json")) {
            throw new CommandLine.ParameterException(spec.commandLine(),
                    "--format must be table, csv or json, found '" + format + "'");
        }
        if (out != null && java.nio.file.Files.exists(out) && !force) {
            throw new CommandLine.ParameterException(spec.commandLine(),
                    out + " exists already; use --force to replace it");
        }
    }

    void emit(CommandLine.Model.CommandSpec spec, String text) throws Exception {
        PrintWriter o = spec.commandLine().getOut();
        o.print(text);
        if (!text.endsWith("\n")) {
            o.println();
        }
        o.flush();
        if (out != null) {
            SafeFiles.write(out, text.getBytes(StandardCharsets.UTF_8), force);
            spec.commandLine().getErr().println("wrote " + out);
            spec.commandLine().getErr().flush();
        }
    }
}
