package dev.terrace.core;

import dev.terrace.core.campaign.Campaign;
import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.campaign.Target;
import dev.terrace.core.runlog.Run;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * What {@code terrace check} reports about a campaign: run counts, the range of each column, and
 * which runs met the targets so far.
 *
 * @param campaignId  the campaign id; never null
 * @param runs        number of runs
 * @param ok          runs with status ok
 * @param failed      failed runs
 * @param columns     per-column summaries in campaign order; never null
 * @param targets     per-target counts in campaign order; never null
 * @param runsMeetingAll ids of ok runs that met every target (all targeted outcomes measured); never null
 * @since 0.1
 */
public record CheckSummary(String campaignId, int runs, int ok, int failed, List<ColumnSummary> columns,
                           List<TargetSummary> targets, List<String> runsMeetingAll) {

    /** Copies the lists. */
    public CheckSummary {
        Objects.requireNonNull(campaignId);
        columns = List.copyOf(columns);
        targets = List.copyOf(targets);
        runsMeetingAll = List.copyOf(runsMeetingAll);
    }

    /**
     * Range of one column over the runs that recorded it.
     *
     * @param name   column name
     * @param unit   unit symbol, empty for categorical columns
     * @param count  how many runs recorded a value
     * @param min    smallest value (NaN for categorical or no values)
     * @param max    largest value (NaN for categorical or no values)
     * @param counts counts per category or class, empty for numeric columns
     * @param isOutcome true for outcome columns
     */
    public record ColumnSummary(String name, String unit, int count, double min, double max,
                                Map<String, Integer> counts, boolean isOutcome) {
        /** Copies the map. */
        public ColumnSummary {
            counts = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(counts));
        }
    }

    /**
     * How many ok runs met one target.
     *
     * @param target   the target; never null
     * @param measured ok runs that measured the outcome
     * @param met      of those, how many met the target
     */
    public record TargetSummary(Target target, int measured, int met) {
    }

    /**
     * @param lc a loaded campaign
     * @return its summary; never null
     */
    public static CheckSummary of(LoadedCampaign lc) {
        Campaign c = lc.campaign();
        List<Run> runs = lc.runLog().runs();
        List<ColumnSummary> cols = new ArrayList<>();
        for (ParameterSpec p : c.parameters()) {
            cols.add(column(p.name(), p.isCategorical() ? "" : p.unit().symbol(), p.isCategorical(), runs, false));
        }
        for (OutcomeSpec o : c.outcomes()) {
            cols.add(column(o.name(), o.isClass() ? "" : o.unit().symbol(), o.isClass(), runs, true));
        }
        List<TargetSummary> ts = new ArrayList<>();
        for (Target t : c.targets()) {
            int measured = 0;
            int met = 0;
            for (Run r : lc.runLog().okRuns()) {
                Boolean m = meets(t, r);
                if (m != null) {
                    measured++;
                    if (m) {
                        met++;
                    }
                }
            }
            ts.add(new TargetSummary(t, measured, met));
        }
        List<String> all = new ArrayList<>();
        if (!c.targets().isEmpty()) {
            for (Run r : lc.runLog().okRuns()) {
                boolean every = true;
                for (Target t : c.targets()) {
                    Boolean m = meets(t, r);
                    if (m == null || !m) {
                        every = false;
                        break;
                    }
                }
                if (every) {
                    all.add(r.runId());
                }
            }
        }
        return new CheckSummary(c.id(), runs.size(), lc.runLog().okRuns().size(), lc.runLog().failedRuns().size(),
                cols, ts, all);
    }

    /**
     * @param t a target
     * @param r a run
     * @return whether the run met the target, or null when the outcome was not measured
     */
    public static Boolean meets(Target t, Run r) {
        if (t.isClassTarget()) {
            return r.category(t.outcome()).map(t::accepts).orElse(null);
        }
        var v = r.number(t.outcome());
        return v.isPresent() ? t.accepts(v.getAsDouble()) : null;
    }

    private static ColumnSummary column(String name, String unit, boolean categorical, List<Run> runs,
                                        boolean outcome) {
        int n = 0;
        double lo = Double.NaN;
        double hi = Double.NaN;
        Map<String, Integer> counts = new LinkedHashMap<>();
        for (Run r : runs) {
            if (categorical) {
                var v = r.category(name);
                if (v.isPresent()) {
                    n++;
                    counts.merge(v.get(), 1, Integer::sum);
                }
            } else {
                var v = r.number(name);
                if (v.isPresent()) {
                    n++;
                    double x = v.getAsDouble();
                    lo = Double.isNaN(lo) ? x : Math.min(lo, x);
                    hi = Double.isNaN(hi) ? x : Math.max(hi, x);
                }
            }
        }
        return new ColumnSummary(name, unit, n, lo, hi, counts, outcome);
    }
}
