package dev.terrace.cli;

import dev.terrace.core.InputException;
import dev.terrace.core.io.OutputFailedException;
import dev.terrace.core.io.OutputRefusedException;
import picocli.CommandLine;
import picocli.CommandLine.Command;

import java.io.InputStream;
import java.io.PrintWriter;
import java.nio.file.AccessDeniedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.FileSystemException;
import java.nio.file.NoSuchFileException;
import java.nio.file.NotDirectoryException;
import java.util.Properties;

/**
 * The {@code terrace} command.
 *
 * <p>Exit codes: 0 ok, 1 the job ran but failed, 2 bad input or usage.
 *
 * @since 0.1
 */
@Command(name = "terrace", mixinStandardHelpOptions = true, versionProvider = Main.Version.class,
        description = {"Plans MBE growth campaigns: checks run logs, converts gauge readings, fits growth models",
                "to your own runs and proposes the next recipes."},
        subcommands = {InitCommand.class, CheckCommand.class, FluxCommand.class, ModelsCommand.class, FitCommand.class, ProposeCommand.class, RecordCommand.class, RankCommand.class, ValidateCommand.class, MapCommand.class, ReportCommand.class, BenchCommand.class,
                DemoCommand.class, CommandLine.HelpCommand.class},
        footer = {"", "Exit codes: 0 ok, 1 the job ran but failed, 2 bad input or usage."})
public final class Main implements Runnable {

    /** Exit code: the job ran but failed. */
    public static final int EXIT_FAILED = 1;
    /** Exit code: bad input or usage. */
    public static final int EXIT_INPUT = 2;

    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    /** The environment the commands see (SOURCE_DATE_EPOCH, ...); passed in, never read behind the caller. */
    private final java.util.Map<String, String> environment;

    private Main(java.util.Map<String, String> environment) {
        this.environment = java.util.Map.copyOf(environment);
    }

    /**
     * The environment of the command line a command runs in: the one given to {@link #execute},
     * or the process environment when the command runs outside Main.
     *
     * @param command any command's spec
     * @return the environment; never null
     */
    static java.util.Map<String, String> environment(CommandLine.Model.CommandSpec command) {
        Object root = command.root().userObject();
        return root instanceof Main ? ((Main) root).environment : System.getenv();
    }

    /**
     * The clock for dates and times written into files: SOURCE_DATE_EPOCH from the command's
     * environment when set (see {@link dev.terrace.core.io.SourceDate}), else the system clock.
     *
     * @param command any command's spec
     * @return the clock; never null
     * @throws UsageException when SOURCE_DATE_EPOCH is set but malformed
     */
    static java.time.Clock clock(CommandLine.Model.CommandSpec command) {
        try {
            return dev.terrace.core.io.SourceDate.clock(environment(command));
        } catch (IllegalArgumentException e) {
            throw new UsageException(e.getMessage());
        }
    }

    @Override
    public void run() {
        spec.commandLine().usage(spec.commandLine().getOut());
    }

    /**
     * Runs the command line.
     *
     * @param args arguments
     */
    public static void main(String[] args) {
        System.exit(execute(new PrintWriter(System.out, true), new PrintWriter(System.err, true), args));
    }

    /**
     * Runs a command in-process (used by the tests).
     *
     * @param out  standard output
     * @param err  standard error
     * @param args arguments
     * @return the exit code
     */
    public static int execute(PrintWriter out, PrintWriter err, String... args) {
        return execute(out, err, System.getenv(), args);
    }

    /**
     * Runs a command in-process with a given environment (tests set SOURCE_DATE_EPOCH this way).
     *
     * @param out         standard output
     * @param err         standard error
     * @param environment the environment variables the commands see
     * @param args        arguments
     * @return the exit code
     */
    public static int execute(PrintWriter out, PrintWriter err, java.util.Map<String, String> environment,
                              String... args) {
        quietLibraries();
        String algebraProblem = dev.terrace.core.linalg.Algebra.configurationProblem();
        if (algebraProblem != null) {
            err.println("terrace: " + algebraProblem);
            err.flush();
            return EXIT_INPUT;
        }
        CommandLine cl = commandLine(environment);
        cl.setOut(out);
        cl.setErr(err);
        try {
            return cl.execute(args);
        } catch (OutOfMemoryError e) {
            err.println(outOfMemoryMessage());
            if (java.util.Arrays.asList(args).contains("--debug")) {
                e.printStackTrace(err);
            }
            err.flush();
            return EXIT_FAILED;
        }
    }

    /** @return the one-line message for a job that ran out of Java heap */
    static String outOfMemoryMessage() {
        return "terrace: out of memory: the job needs more than the " + (Runtime.getRuntime().maxMemory() >> 20)
                + " MiB of memory Java was given; try fewer runs or a smaller --batch or --grid, or give Java"
                + " more memory (for example TERRACE_JAVA_OPTS=-Xmx4g, or java -Xmx4g -jar ...)";
    }

    /** @return the configured command line; never null */
    public static CommandLine commandLine() {
        return commandLine(System.getenv());
    }

    /**
     * @param environment the environment variables the commands see
     * @return the configured command line; never null
     */
    public static CommandLine commandLine(java.util.Map<String, String> environment) {
        CommandLine cl = new CommandLine(new Main(environment));
        cl.setExecutionExceptionHandler(Main::handle);
        CommandLine.IParameterExceptionHandler refusals = cl.getParameterExceptionHandler();
        cl.setParameterExceptionHandler((ex, args) -> refusals.handleParseException(OptionRanges.reworded(ex), args));
        cl.setExecutionStrategy(parsed -> {
            OptionRanges.check(parsed);
            refuseEmptyPaths(parsed);
            return new CommandLine.RunLast().execute(parsed);
        });
        cl.getCommandSpec().usageMessage().description(firstSentenceJoined(
                cl.getCommandSpec().usageMessage().description()));
        for (CommandLine sub : cl.getSubcommands().values()) {
            CommandLine.Model.UsageMessageSpec um = sub.getCommandSpec().usageMessage();
            um.description(firstSentenceJoined(um.description()));
        }
        return cl;
    }

    /**
     * Refuses an empty or blank path given to any option or parameter ({@code --out ""}), which
     * Java would read as the current folder, naming the option.
     *
     * @param parsed the parse result
     * @throws CommandLine.ParameterException for the first empty path
     */
    static void refuseEmptyPaths(CommandLine.ParseResult parsed) {
        for (CommandLine.ParseResult pr = parsed; pr != null; pr = pr.subcommand()) {
            java.util.List<CommandLine.Model.ArgSpec> args = new java.util.ArrayList<>(pr.matchedOptions());
            args.addAll(pr.matchedPositionals());
            for (CommandLine.Model.ArgSpec a : args) {
                boolean isPath = a.type() == java.nio.file.Path.class || a.auxiliaryTypes().length > 0
                        && a.auxiliaryTypes()[0] == java.nio.file.Path.class;
                if (!isPath || a.originalStringValues().stream().noneMatch(String::isBlank)) {
                    continue;
                }
                String name = a.isOption() ? ((CommandLine.Model.OptionSpec) a).longestName() : a.paramLabel();
                String label = a.paramLabel() == null ? "" : a.paramLabel();
                throw new CommandLine.ParameterException(pr.commandSpec().commandLine(), name
                        + ": the path is empty; expected the name of " + (label.contains("DIR") ? "a folder" : "a file"),
                        a, "");
            }
        }
    }

    /**
     * Joins the source lines of a description's first sentence into one line (picocli lists a
     * command by its first description line, so a sentence split over two lines would show cut);
     * later lines are kept as written.
     */
    static String[] firstSentenceJoined(String[] lines) {
        int end = 0;
        while (end < lines.length - 1 && !lines[end].strip().endsWith(".") && !lines[end].strip().endsWith(":")) {
            end++;
        }
        if (end == 0) {
            return lines;
        }
        java.util.List<String> out = new java.util.ArrayList<>();
        StringBuilder first = new StringBuilder();
        for (int k = 0; k <= end; k++) {
            first.append(k == 0 ? "" : " ").append(lines[k].strip());
        }
        out.add(first.toString());
        out.addAll(java.util.Arrays.asList(lines).subList(end + 1, lines.length));
        return out.toArray(new String[0]);
    }

    private static int handle(Exception e, CommandLine cl, CommandLine.ParseResult parsed) {
        PrintWriter err = cl.getErr();
        boolean debug = parsed != null && parsed.expandedArgs().contains("--debug");
        for (Throwable t = e; t != null; t = t.getCause()) {
            if (t instanceof OutOfMemoryError) {
                // thrown in a worker thread and wrapped on the way back: the same message as on the main thread
                err.println(outOfMemoryMessage());
                if (debug) {
                    e.printStackTrace(err);
                }
                err.flush();
                return EXIT_FAILED;
            }
        }
        if (e instanceof InputException) {
            DiagnosticLines.print(err, ((InputException) e).diagnostics());
            if (debug) {
                e.printStackTrace(err);
            }
            err.flush();
            return EXIT_INPUT;
        }
        if (e instanceof FileAlreadyExistsException) {
            err.println("terrace: " + ((FileAlreadyExistsException) e).getFile()
                    + " exists already; Terrace never overwrites your files unless asked to (--force)");
            err.flush();
            return EXIT_INPUT;
        }
        if (e instanceof JobFailedException || e instanceof OutputFailedException) {
            err.println("terrace: " + e.getMessage());
            err.flush();
            return EXIT_FAILED;
        }
        if (e instanceof UsageException || e instanceof OutputRefusedException) {
            err.println("terrace: " + e.getMessage());
            if (debug) {
                e.printStackTrace(err);
            }
            err.flush();
            return EXIT_INPUT;
        }
        if (e instanceof FileSystemException) {
            // a path the user gave that cannot be used: missing, a folder, not permitted, ...
            err.println("terrace: " + fileProblem((FileSystemException) e));
            if (debug) {
                e.printStackTrace(err);
            }
            err.flush();
            return EXIT_INPUT;
        }
        if (e instanceof java.io.IOException) {
            err.println("terrace: reading or writing a file failed: " + e.getMessage());
        } else {
            err.println("terrace: internal error: " + e + (debug ? "" : " (run again with --debug for details)"));
        }
        if (debug) {
            e.printStackTrace(err);
        }
        err.flush();
        return EXIT_FAILED;
    }

    /** Words a file-system refusal with the path and what was expected. */
    static String fileProblem(FileSystemException e) {
        String file = e.getFile() == null ? "a file" : e.getFile();
        String other = e.getOtherFile() == null ? "" : " (and " + e.getOtherFile() + ")";
        String reason = e.getReason();
        if (e instanceof NoSuchFileException) {
            return file + other + " does not exist; expected an existing file or folder";
        }
        if (e instanceof AccessDeniedException) {
            return "cannot use " + file + other + ": permission denied";
        }
        if (e instanceof NotDirectoryException) {
            return file + " is not a folder; expected a folder";
        }
        if (reason != null && reason.toLowerCase(java.util.Locale.ROOT).contains("is a directory")) {
            return file + other + " is a folder; expected a file";
        }
        return "cannot use " + file + other + ": " + (reason == null ? e.getClass().getSimpleName() : reason);
    }

    private static void quietLibraries() {
        if (System.getProperty("org.slf4j.simpleLogger.defaultLogLevel") == null) {
            System.setProperty("org.slf4j.simpleLogger.defaultLogLevel", "error");
        }
    }

    /** Reads the version stamped in at build time. */
    public static final class Version implements CommandLine.IVersionProvider {
        @Override
        public String[] getVersion() throws Exception {
            Properties p = new Properties();
            try (InputStream in = Main.class.getResourceAsStream("version.properties")) {
                if (in != null) {
                    p.load(in);
                }
            }
            return new String[] {"terrace " + p.getProperty("version", "unknown"),
                    "GPL-3.0-or-later; Java " + System.getProperty("java.version"),
                    "linear algebra: " + dev.terrace.core.linalg.Algebra.description()};
        }
    }
}
