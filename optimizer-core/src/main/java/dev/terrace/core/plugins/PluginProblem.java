package dev.terrace.core.plugins;

import java.util.Objects;

/**
 * A problem found while discovering growth-model plugins.
 *
 * @param fatal   true when the problem makes plugin ids ambiguous (blank or duplicate id); such
 *                plugins are not usable. False for a plugin that failed and was skipped.
 * @param source  where the plugin came from (a jar path or "classpath"); never null
 * @param message what went wrong; never blank
 * @since 0.1
 */
public record PluginProblem(boolean fatal, String source, String message) {
    /** Checks the invariants. */
    public PluginProblem {
        Objects.requireNonNull(source);
        Objects.requireNonNull(message);
    }

    @Override
    public String toString() {
        return (fatal ? "error: " : "warning: ") + message;
    }
}
