package dev.terrace.core.runlog;

import dev.terrace.core.Diagnostic;

import java.nio.file.Path;
import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * The runs of a campaign as read from its run log, with the warnings found while reading.
 *
 * @param file     the run-log file; never null
 * @param runs     the runs in file order; never null
 * @param warnings non-fatal findings (for example values outside today's box); never null
 * @since 0.1
 */
public record RunLog(Path file, List<Run> runs, List<Diagnostic> warnings) {

    /** Copies the lists. */
    public RunLog {
        Objects.requireNonNull(file, "file");
        runs = List.copyOf(runs);
        warnings = List.copyOf(warnings);
    }

    /** @return the runs with status ok; never null */
    public List<Run> okRuns() {
        return runs.stream().filter(Run::ok).toList();
    }

    /** @return the failed runs; never null */
    public List<Run> failedRuns() {
        return runs.stream().filter(r -> !r.ok()).toList();
    }

    /**
     * @param runId a run id
     * @return the run, if present
     */
    public Optional<Run> run(String runId) {
        return runs.stream().filter(r -> r.runId().equals(runId)).findFirst();
    }
}
