package dev.terrace.core.campaign;

/**
 * How a numeric setting or outcome is spaced: evenly, or in decades.
 *
 * @since 0.1
 */
public enum Scale {
    /** Even spacing; search and surrogate work on the value itself. */
    LINEAR,
    /** Spans decades; search and surrogate work on log10 of the value. */
    LOG
}
