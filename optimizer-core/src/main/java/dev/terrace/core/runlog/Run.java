package dev.terrace.core.runlog;

import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * One growth run from the run log. Values are in the campaign's units; an absent key means the
 * cell was empty (not measured).
 *
 * @param runId      the run's identifier; never blank
 * @param numbers    numeric settings and outcomes by column name; copied, never null
 * @param categories categorical settings and class outcomes by column name; copied, never null
 * @param status     whether the run succeeded; never null
 * @param date       the ISO 8601 date as written, or null
 * @param proposal   id of the proposal the run followed, or null
 * @param notes      free text, or null
 * @param line       the line of the run in the run log (1-based)
 * @param censored   numeric outcomes written as {@code <X} or {@code >X}, by column name; a column is
 *                   never both here and in {@code numbers}; copied, never null
 * @since 0.1
 */
public record Run(String runId, Map<String, Double> numbers, Map<String, String> categories, Status status,
                  String date, String proposal, String notes, int line, Map<String, Censored> censored) {

    /** Outcome of a run as a whole. */
    public enum Status {
        /** The run produced a sample that was measured. */
        OK,
        /** The run failed (no usable sample); its recipe is still data. */
        FAILED
    }

    /** Copies and checks the contents. */
    public Run {
        Objects.requireNonNull(runId, "runId");
        Objects.requireNonNull(status, "status");
        if (runId.isBlank()) {
            throw new IllegalArgumentException("blank run_id");
        }
        numbers.values().forEach(v -> {
            if (!Double.isFinite(v)) {
                throw new IllegalArgumentException("run " + runId + " has a non-finite value");
            }
        });
        numbers = Map.copyOf(numbers);
        categories = Map.copyOf(categories);
        censored = Map.copyOf(censored);
        for (String column : censored.keySet()) {
            if (numbers.containsKey(column)) {
                throw new IllegalArgumentException("run " + runId + " has column " + column
                        + " both as a number and as a censored value");
            }
        }
    }

    /** A run without censored cells. */
    public Run(String runId, Map<String, Double> numbers, Map<String, String> categories, Status status,
               String date, String proposal, String notes, int line) {
        this(runId, numbers, categories, status, date, proposal, notes, line, Map.of());
    }

    /**
     * @param column a numeric outcome column
     * @return its censored value ({@code <X} or {@code >X}), or empty when the cell holds a plain number
     *         or nothing
     */
    public Optional<Censored> censored(String column) {
        return Optional.ofNullable(censored.get(column));
    }


    /**
     * @param column a numeric column
     * @return its value, or empty when not measured or censored (see {@link #censored(String)})
     */
    public OptionalDouble number(String column) {
        Double v = numbers.get(column);
        return v == null ? OptionalDouble.empty() : OptionalDouble.of(v);
    }

    /**
     * @param column a categorical column
     * @return its value, or empty when not recorded
     */
    public Optional<String> category(String column) {
        return Optional.ofNullable(categories.get(column));
    }

    /** @return true for a run with status ok */
    public boolean ok() {
        return status == Status.OK;
    }
}
