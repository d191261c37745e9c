package dev.terrace.demo;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Objects;

/**
 * What one run in the {@link VirtualChamber} gave: invented outcomes, not measurements.
 *
 * @param ok      true when the run produced a sample that was "measured"
 * @param numbers numeric outcomes by column name, in the campaign's units; finite; empty for a failed run
 * @param classes class outcomes by column name; empty for a failed run
 * @param notes   free text; a failed run always says why; never null, possibly empty
 * @since 0.1
 */
public record RunResult(boolean ok, Map<String, Double> numbers, Map<String, String> classes, String notes) {

    /** Copies and checks the contents. */
    public RunResult {
        Objects.requireNonNull(notes, "notes");
        numbers = Collections.unmodifiableMap(new LinkedHashMap<>(numbers));
        classes = Collections.unmodifiableMap(new LinkedHashMap<>(classes));
        for (Map.Entry<String, Double> e : numbers.entrySet()) {
            if (e.getValue() == null || !Double.isFinite(e.getValue())) {
                throw new IllegalArgumentException("outcome " + e.getKey() + " is not finite");
            }
        }
        if (!ok && (!numbers.isEmpty() || !classes.isEmpty())) {
            throw new IllegalArgumentException("a failed run has no outcomes");
        }
        if (!ok && notes.isBlank()) {
            throw new IllegalArgumentException("a failed run needs a reason in its notes");
        }
    }

    /**
     * A failed run.
     *
     * @param reason why it failed; never blank
     * @return the result; never null
     */
    public static RunResult failed(String reason) {
        return new RunResult(false, Map.of(), Map.of(), reason);
    }
}
