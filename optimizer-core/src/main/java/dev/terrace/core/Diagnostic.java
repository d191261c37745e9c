package dev.terrace.core;

import java.nio.file.Path;
import java.util.Objects;

/**
 * One problem found in a user's file, with where it is and what was expected.
 *
 * @param file     the file; never null
 * @param line     1-based line, 0 when the problem concerns the whole file
 * @param column   1-based column, 0 when unknown
 * @param severity error or warning; never null
 * @param message  what is wrong and what was expected; never blank
 * @since 0.1
 */
public record Diagnostic(Path file, int line, int column, Severity severity, String message) {

    /** How serious a diagnostic is. */
    public enum Severity {
        /** The file cannot be used until this is fixed. */
        ERROR,
        /** The file can be used; the grower should know. */
        WARNING
    }

    /** Checks the invariants. */
    public Diagnostic {
        Objects.requireNonNull(file, "file");
        Objects.requireNonNull(severity, "severity");
        Objects.requireNonNull(message, "message");
        if (line < 0 || column < 0) {
            throw new IllegalArgumentException("negative position");
        }
    }

    /** @return an error diagnostic; never null */
    public static Diagnostic error(Path file, int line, int column, String message) {
        return new Diagnostic(file, line, column, Severity.ERROR, message);
    }

    /** @return a warning diagnostic; never null */
    public static Diagnostic warning(Path file, int line, int column, String message) {
        return new Diagnostic(file, line, column, Severity.WARNING, message);
    }

    /** @return true for errors */
    public boolean isError() {
        return severity == Severity.ERROR;
    }

    /** @return {@code file:line:column: error: message}, the usual compiler layout */
    @Override
    public String toString() {
        StringBuilder sb = new StringBuilder(file.toString());
        if (line > 0) {
            sb.append(':').append(line);
            if (column > 0) {
                sb.append(':').append(column);
            }
        }
        sb.append(": ").append(severity == Severity.ERROR ? "error" : "warning").append(": ").append(message);
        return sb.toString();
    }
}
