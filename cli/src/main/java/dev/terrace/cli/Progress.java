package dev.terrace.cli;

import me.tongfei.progressbar.ConsoleProgressBarConsumer;
import me.tongfei.progressbar.ProgressBar;
import me.tongfei.progressbar.ProgressBarBuilder;
import me.tongfei.progressbar.ProgressBarConsumer;
import me.tongfei.progressbar.ProgressBarStyle;

import java.io.IOException;
import java.io.PrintStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Objects;

/**
 * A progress bar on standard error for work that takes longer than about a second, drawn only
 * when standard error is a terminal and {@code --quiet} is not given; otherwise every call does
 * nothing, so piped output and logs stay clean. Drawing uses the progressbar library
 * (me.tongfei:progressbar, MIT licence).
 *
 * <p><b>Wiring it into a command.</b> Open one bar per long phase, with the number of steps you
 * know in advance, and step it as the work goes; close it with try-with-resources:
 *
 * <pre>
 * try (Progress p = Progress.start("fitting models", lc.campaign().models().size(), global)) {
 *     for (String model : lc.campaign().models()) {
 *         ... fit one model ...
 *         p.step();
 *     }
 * }
 * </pre>
 *
 * <p>When the loop lives in optimizer-core (the genetic search, a map grid, the bench), give the
 * core method a plain {@link Runnable} parameter called once per step and pass {@link #ticker()}
 * to it, so the core stays free of terminal code (for example a search that ticks once per
 * generation, started with {@code maxGenerations} steps). When the number of steps
 * is unknown, pass {@code 0}: the bar then shows elapsed time only. Use {@link #message(String)}
 * to name the current sub-phase on a single bar that spans several phases; for phases of very
 * different lengths use {@link #startPhases}, which drops the time-left estimate, as
 * {@code terrace report} does. Never write results to the bar: it is decoration and may be absent.
 *
 * <p><b>Terminal detection.</b> {@link System#console()} must be non-null (on Java 17 that means
 * standard input and output are a terminal), and, where {@code /proc/self/fd/2} exists (Linux), it
 * must point at a terminal device, so {@code 2>log.txt} silences the bar too. {@code TERM=dumb}
 * also silences it.
 *
 * @since 0.1
 */
public final class Progress implements AutoCloseable {

    /** Fewest milliseconds between two redraws of a bar (common practice: about 10 per second). */
    public static final int REDRAW_INTERVAL_MS = 100;
    /** Width of the bar in characters when it is drawn to a stream that is not a terminal (tests). */
    static final int FIXED_WIDTH = 80;

    private static final Progress NONE = new Progress(null, null);

    private final ProgressBar bar;
    private final Sink sink;

    private Progress(ProgressBar bar, Sink sink) {
        this.bar = bar;
        this.sink = sink;
    }

    private static Progress drawing(String task, long steps, boolean eta, ConsoleProgressBarConsumer out) {
        Sink s = new Sink(out);
        ProgressBarBuilder b = builder(task, steps).setConsumer(s);
        return new Progress((eta ? b : b.hideEta()).build(), s);
    }

    /**
     * Passes the drawing on and remembers whether the line was ended: the library skips ending it
     * when a bar is closed before its first redraw.
     */
    private static final class Sink implements ProgressBarConsumer {
        private final ConsoleProgressBarConsumer out;
        private volatile boolean closed;

        Sink(ConsoleProgressBarConsumer out) {
            this.out = out;
        }

        @Override
        public int getMaxRenderedLength() {
            return out.getMaxRenderedLength();
        }

        @Override
        public void accept(String rendered) {
            out.accept(rendered);
        }

        @Override
        public void close() {
            if (!closed) {
                closed = true;
                out.close();
            }
        }
    }

    /**
     * Starts a bar on standard error when it is wanted and can be seen.
     *
     * @param task  what is being done, in a few words (for example "fitting models")
     * @param steps how many steps the task has, or 0 when unknown
     * @param g     the command's global options ({@code --quiet} silences the bar); may be null
     * @return the bar, or a silent one; never null
     */
    public static Progress start(String task, long steps, GlobalOptions g) {
        return start(task, steps, g == null || !g.quiet);
    }

    /**
     * Starts a bar on standard error when {@code wanted} is true and standard error is a terminal.
     *
     * @param task   what is being done, in a few words
     * @param steps  how many steps the task has, or 0 when unknown
     * @param wanted false to stay silent whatever the terminal
     * @return the bar, or a silent one; never null
     */
    public static Progress start(String task, long steps, boolean wanted) {
        Objects.requireNonNull(task, "task");
        if (!wanted || !stderrIsTerminal()) {
            return NONE;
        }
        return drawing(task, steps, true, new ConsoleProgressBarConsumer(System.err));
    }

    /**
     * Starts a bar over phases of very different lengths (load, fit, validate, ...): one step per
     * phase and no time-left estimate, which would mislead there; name each phase with
     * {@link #message(String)}.
     *
     * @param task   what is being done
     * @param phases how many phases
     * @param g      the global options; may be null
     * @return the bar, or a silent one; never null
     */
    public static Progress startPhases(String task, int phases, GlobalOptions g) {
        Objects.requireNonNull(task, "task");
        if ((g != null && g.quiet) || !stderrIsTerminal()) {
            return NONE;
        }
        return drawing(task, phases, false, new ConsoleProgressBarConsumer(System.err));
    }

    /**
     * Draws a bar to the given stream whatever it is connected to, at a fixed width (for tests).
     *
     * @param sink  where to draw
     * @param task  the task name
     * @param steps steps, or 0 when unknown
     * @return the bar; never null
     */
    static Progress drawingTo(PrintStream sink, String task, long steps) {
        Objects.requireNonNull(sink, "sink");
        Objects.requireNonNull(task, "task");
        return drawing(task, steps, true, new ConsoleProgressBarConsumer(sink, FIXED_WIDTH));
    }

    /** @return a bar that never draws anything; never null */
    public static Progress none() {
        return NONE;
    }

    private static ProgressBarBuilder builder(String task, long steps) {
        if (steps < 0) {
            throw new IllegalArgumentException("steps must be >= 0, found " + steps);
        }
        ProgressBarBuilder b = new ProgressBarBuilder().setTaskName(task).setStyle(ProgressBarStyle.ASCII)
                .setUpdateIntervalMillis(REDRAW_INTERVAL_MS).continuousUpdate();
        return steps > 0 ? b.setInitialMax(steps) : b;
    }

    /**
     * @return true when standard error is a terminal (see the class comment for how this is decided)
     */
    public static boolean stderrIsTerminal() {
        if (System.console() == null) {
            return false;
        }
        String term = System.getenv("TERM");
        if ("dumb".equals(term)) {
            return false;
        }
        Path fd2 = Path.of("/proc/self/fd/2");
        if (!Files.exists(fd2, java.nio.file.LinkOption.NOFOLLOW_LINKS)) {
            return true; // no /proc: System.console() is all we can check
        }
        try {
            String target = Files.readSymbolicLink(fd2).toString();
            return target.startsWith("/dev/pts/") || target.startsWith("/dev/tty") || target.equals("/dev/console");
        } catch (IOException | UnsupportedOperationException | SecurityException e) {
            return true;
        }
    }

    /** @return true when this bar draws something */
    public boolean visible() {
        return bar != null;
    }

    /**
     * Advances the bar by one step.
     *
     * @return this bar
     */
    public Progress step() {
        if (bar != null) {
            bar.step();
        }
        return this;
    }

    /**
     * Moves the bar to a step count.
     *
     * @param done steps done so far
     * @return this bar
     */
    public Progress stepTo(long done) {
        if (bar != null) {
            bar.stepTo(done);
        }
        return this;
    }

    /**
     * Shows a short message after the bar, for example the name of the current phase.
     *
     * @param text the message; null clears it
     * @return this bar
     */
    public Progress message(String text) {
        if (bar != null) {
            bar.setExtraMessage(text == null ? "" : text);
        }
        return this;
    }

    /** @return a callback that advances this bar by one step, for loops in optimizer-core; never null */
    public Runnable ticker() {
        return this::step;
    }

    /** Finishes the bar (draws its last state and ends its line); does nothing for a silent bar. */
    @Override
    public void close() {
        if (bar != null) {
            bar.close();
            sink.close();
        }
    }
}
