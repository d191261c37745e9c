package dev.terrace.core.campaign;

/**
 * Where something was written in a file (1-based), kept so later checks can point at it.
 *
 * @param line   line, 0 when unknown
 * @param column column, 0 when unknown
 * @since 0.1
 */
public record SourcePosition(int line, int column) {
    /** Unknown position. */
    public static final SourcePosition UNKNOWN = new SourcePosition(0, 0);
}
