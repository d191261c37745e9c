package dev.terrace.cli;

import picocli.CommandLine.Option;

import java.nio.file.Path;

/**
 * Options every command accepts.
 *
 * @since 0.1
 */
public final class GlobalOptions {

    @Option(names = "--debug", description = "Print stack traces of internal errors.")
    boolean debug;

    @Option(names = "--plugins", paramLabel = "DIR",
            description = "Folder of extra growth-model plugin jars (default: $TERRACE_PLUGINS).")
    Path pluginDir;

    @Option(names = {"-q", "--quiet"}, description = "Print only results and errors.")
    boolean quiet;
}
