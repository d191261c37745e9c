package dev.terrace.cli;

import java.io.PrintWriter;
import java.util.Collections;
import java.util.HashSet;
import java.util.Map;
import java.util.Set;
import java.util.WeakHashMap;

/**
 * Prints diagnostics (positioned warnings and errors, plugin problems) to a command's error
 * stream, each distinct line once per stream: {@code terrace demo} runs check, validate, map and
 * report on the same stream, and each of them loads the campaign and its plugins again, so without
 * this the same cell's warning would be printed once per step.
 */
final class DiagnosticLines {

    /** Lines already printed, per error stream (by identity; a stream no longer used is forgotten). */
    private static final Map<PrintWriter, Set<String>> PRINTED = Collections.synchronizedMap(new WeakHashMap<>());

    private DiagnosticLines() {
    }

    /**
     * Prints each item's text on its own line unless the same line was printed on this stream before.
     *
     * @param err   the error stream; never null
     * @param items the diagnostics (their {@code toString} is the line); never null
     */
    static void print(PrintWriter err, Iterable<?> items) {
        Set<String> seen = PRINTED.computeIfAbsent(err, k -> Collections.synchronizedSet(new HashSet<>()));
        for (Object d : items) {
            String line = d.toString();
            if (seen.add(line)) {
                err.println(line);
            }
        }
    }
}
