package dev.terrace.cli;

import dev.terrace.core.propose.ProposeSettings;
import dev.terrace.core.window.WindowMap;
import picocli.CommandLine;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Model.OptionSpec;

import java.util.ArrayList;
import java.util.Collection;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;

/**
 * The accepted range of every numeric command-line option, checked in one place before a command
 * runs: a value outside its range, or text that is not a number of the right kind, is a usage
 * error (exit 2) whose message gives the option, the range and the value found, for example
 * {@code --grid must be a whole number from 5 to 200 (cells per axis), found 0}.
 *
 * <p>Ranges are keyed by the command's name below {@code terrace} ("map", "flux ratio") and the
 * option's longest name; {@link #ANY_COMMAND} keys an option shared by every command (the seed).
 * A test walks every option of every command and fails when a numeric one has no range here.
 *
 * @since 0.3
 */
final class OptionRanges {

    /** Key for an option with the same range in every command. */
    static final String ANY_COMMAND = "*";

    /**
     * Largest thermocouple error (sd, K) {@code map --temperature-uncertainty} accepts. Chosen: the
     * yield is averaged over about ±2 sd, so 100 K already spans 400 K, wider than the temperature
     * boxes of MBE campaigns (the demo's deposition box is 200 K wide).
     */
    static final double MAX_TEMPERATURE_UNCERTAINTY_K = 100;
    /** Largest {@code propose --batch}: a batch is what one chamber grows before the next fit. */
    static final int MAX_BATCH = 100;
    /** Largest {@code bench --seeds}; at the default problems one seed takes tens of seconds. */
    static final int MAX_BENCH_SEEDS = 1000;
    /** Largest {@code bench --threads}; more threads than this only contend for memory. */
    static final int MAX_THREADS = 256;
    /**
     * Largest run-log size of {@code bench --speed}: at a few runs a working day one chamber logs
     * about a thousand runs a year, so this is a century of growth.
     */
    static final int MAX_BENCH_RUNS = 100_000;
    /**
     * Hottest source temperature {@code flux ratio} accepts, K: above every effusion cell and
     * cracker zone in use (Al cells run near 1400 K, arsenic crackers near 1200 K; from memory).
     */
    static final double MAX_SOURCE_K = 2500;
    /** Coldest source temperature, K: below room temperature no source gives a beam. */
    static final double MIN_SOURCE_K = 250;
    /**
     * Shortest RHEED period {@code flux rheed} accepts, s: 100 ML/s, far above MBE growth rates
     * (usually below 3 ML/s) and faster than a RHEED camera samples.
     */
    static final double MIN_RHEED_PERIOD_S = 0.01;
    /** Longest RHEED period, s: one monolayer an hour; oscillations fade long before. */
    static final double MAX_RHEED_PERIOD_S = 3600;
    /** Most RHEED periods counted in one span: oscillations damp out after some tens. */
    static final int MAX_RHEED_PERIODS = 10_000;
    /** Longest time span of counted RHEED periods, s (one day). */
    static final double MAX_RHEED_SPAN_S = 86_400;

    /**
     * One option's accepted values.
     *
     * @param whole     true for whole numbers
     * @param min       smallest value
     * @param minOpen   true when {@code min} itself is refused ("greater than")
     * @param max       largest value
     * @param meaning   what the number counts or measures, in the message's parentheses; may be empty
     */
    record Range(boolean whole, double min, boolean minOpen, double max, String meaning) {

        /** Checks the bounds. */
        Range {
            if (!(min <= max) || Double.isNaN(min) || meaning == null) {
                throw new IllegalArgumentException("a range needs min <= max and a meaning");
            }
        }

        static Range whole(long min, long max, String meaning) {
            return new Range(true, min, false, max, meaning);
        }

        static Range number(double min, double max, String meaning) {
            return new Range(false, min, false, max, meaning);
        }

        static Range positive(double max, String meaning) {
            return new Range(false, 0, true, max, meaning);
        }

        /** @return true when the value lies in the range (a whole number for whole ranges) */
        boolean contains(double v) {
            if (!Double.isFinite(v) || (whole && v != Math.rint(v))) {
                return false;
            }
            return (minOpen ? v > min : v >= min) && v <= max;
        }

        /** @return the range in words, e.g. "a whole number from 5 to 200 (cells per axis)" */
        String words() {
            String kind = whole ? "a whole number" : "a number";
            String span = Double.isInfinite(max) ? (minOpen ? " greater than " : " of at least ") + fmt(min)
                    : minOpen ? " greater than " + fmt(min) + " and at most " + fmt(max)
                    : " from " + fmt(min) + " to " + fmt(max);
            return kind + span + (meaning.isEmpty() ? "" : " (" + meaning + ")");
        }

        private String fmt(double v) {
            if (whole || (v == Math.rint(v) && Math.abs(v) < 1e15)) {
                return v == (long) v ? Long.toString((long) v) : String.format(Locale.ROOT, "%.0f", v);
            }
            return Format.num(v);
        }
    }

    private static final Map<String, Range> RANGES = new LinkedHashMap<>();

    static {
        put(ANY_COMMAND, "--seed", Range.whole(Long.MIN_VALUE, Long.MAX_VALUE, "any 64-bit seed"));
        put("propose", "--batch", Range.whole(1, MAX_BATCH, "recipes"));
        put("propose", "--explore", Range.number(0, ProposeCommand.MAX_EXPLORE, "standard deviations of optimism"));
        put("propose", "--within-runs", Range.number(0, ProposeSettings.MAX_WITHIN_RUNS,
                "a fraction of each setting's logged span"));
        put("map", "--grid", Range.whole(WindowMap.MIN_GRID, WindowMap.MAX_GRID, "cells per axis"));
        put("map", "--temperature-uncertainty", Range.number(0, MAX_TEMPERATURE_UNCERTAINTY_K, "kelvin, one sd"));
        put("bench", "--seeds", Range.whole(1, MAX_BENCH_SEEDS, "seeds per problem and strategy"));
        put("bench", "--threads", Range.whole(1, MAX_THREADS, "worker threads"));
        put("bench", "--sizes", Range.whole(1, MAX_BENCH_RUNS, "runs in each log"));
        // the upper bound of a pressure depends on --unit: FluxCommand checks it once converted
        put("flux ratio", "--bep-v", Range.positive(Double.POSITIVE_INFINITY, "a pressure in --unit"));
        put("flux ratio", "--bep-iii", Range.positive(Double.POSITIVE_INFINITY, "a pressure in --unit"));
        put("flux ratio", "--t-v", Range.number(MIN_SOURCE_K, MAX_SOURCE_K, "kelvin"));
        put("flux ratio", "--t-iii", Range.number(MIN_SOURCE_K, MAX_SOURCE_K, "kelvin"));
        put("flux rheed", "--period", Range.number(MIN_RHEED_PERIOD_S, MAX_RHEED_PERIOD_S, "seconds"));
        put("flux rheed", "--periods", Range.whole(1, MAX_RHEED_PERIODS, "whole periods"));
        put("flux rheed", "--span", Range.positive(MAX_RHEED_SPAN_S, "seconds"));
    }

    private OptionRanges() {
    }

    private static void put(String command, String option, Range r) {
        RANGES.put(command + " " + option, r);
    }

    /** @return the keys ("command --option") of every range, in declaration order */
    static Collection<String> keys() {
        return RANGES.keySet();
    }

    /**
     * The range of an option of a command.
     *
     * @param command the command spec holding the option
     * @param option  the option
     * @return the range, or empty for an option that takes no number
     */
    static Optional<Range> of(CommandSpec command, OptionSpec option) {
        String name = commandName(command);
        Range r = RANGES.get(name + " " + option.longestName());
        if (r == null) {
            r = RANGES.get(ANY_COMMAND + " " + option.longestName());
        }
        return Optional.ofNullable(r);
    }

    /** @return the command's name below {@code terrace}, e.g. "flux ratio" */
    static String commandName(CommandSpec command) {
        String q = command.qualifiedName(" ");
        int space = q.indexOf(' ');
        return space < 0 ? "" : q.substring(space + 1);
    }

    /**
     * Checks every numeric option the user gave, in every command of the parse.
     *
     * @param parsed the parse result
     * @throws CommandLine.ParameterException naming the option, its range and the value found
     */
    static void check(CommandLine.ParseResult parsed) {
        for (CommandLine.ParseResult pr = parsed; pr != null; pr = pr.subcommand()) {
            for (OptionSpec o : pr.matchedOptions()) {
                Optional<Range> r = of(pr.commandSpec(), o);
                if (r.isEmpty()) {
                    continue;
                }
                for (Object v : values(o.getValue())) {
                    if (v instanceof Number && !r.get().contains(((Number) v).doubleValue())) {
                        throw new CommandLine.ParameterException(pr.commandSpec().commandLine(),
                                refusal(o.longestName(), r.get(), String.valueOf(v)), o, String.valueOf(v));
                    }
                }
            }
        }
    }

    /**
     * Rewords picocli's refusal of text that is not a number of the option's type ("'1e9' is not an
     * int") with the option's range; other refusals are returned unchanged.
     *
     * @param ex the refusal
     * @return the refusal to report; never null
     */
    static CommandLine.ParameterException reworded(CommandLine.ParameterException ex) {
        if (!(ex.getArgSpec() instanceof OptionSpec) || ex.getValue() == null
                || ex.getMessage() == null || !ex.getMessage().startsWith("Invalid value for option")) {
            return ex;
        }
        OptionSpec o = (OptionSpec) ex.getArgSpec();
        CommandSpec owner = o.command();
        Optional<Range> r = owner == null ? Optional.empty() : of(owner, o);
        if (r.isEmpty()) {
            return ex;
        }
        return new CommandLine.ParameterException(ex.getCommandLine(), refusal(o.longestName(), r.get(),
                "'" + ex.getValue() + "'"), ex, o, ex.getValue());
    }

    static String refusal(String option, Range r, String found) {
        return option + " must be " + r.words() + ", found " + found;
    }

    private static List<Object> values(Object value) {
        List<Object> out = new ArrayList<>();
        if (value instanceof Collection) {
            out.addAll((Collection<?>) value);
        } else if (value != null) {
            out.add(value);
        }
        return out;
    }
}
