package dev.terrace.core;

import java.util.List;
import java.util.stream.Collectors;

/**
 * Thrown when a user's file cannot be used; carries every problem found, not just the first.
 *
 * @since 0.1
 */
public class InputException extends Exception {
    private static final long serialVersionUID = 1L;

    private final transient List<Diagnostic> diagnostics;

    /**
     * @param diagnostics the problems found; at least one
     */
    public InputException(List<Diagnostic> diagnostics) {
        super(diagnostics.stream().map(Diagnostic::toString).collect(Collectors.joining("\n")));
        this.diagnostics = List.copyOf(diagnostics);
    }

    /**
     * @param diagnostic the single problem found
     */
    public InputException(Diagnostic diagnostic) {
        this(List.of(diagnostic));
    }

    /** @return every diagnostic, errors and warnings, in file order; never null */
    public List<Diagnostic> diagnostics() {
        return diagnostics;
    }
}
