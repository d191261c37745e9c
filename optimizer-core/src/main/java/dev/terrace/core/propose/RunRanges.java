package dev.terrace.core.propose;

import dev.terrace.core.campaign.ParameterSpec;
import dev.terrace.core.propose.Proposals.BeyondRuns;
import dev.terrace.core.runlog.Run;
import dev.terrace.core.space.DesignSpace;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;

/**
 * What the lab has already tried: per numeric setting the smallest and largest value over the ok
 * runs that recorded it, and per categorical setting the choices those runs used. A proposal whose
 * setting lies outside this range extrapolates from the data, which the grower should know.
 *
 * <p>Failed runs do not count: they show where a recipe was set, not where the surrogates learned
 * an outcome.
 *
 * @param okRuns   number of ok runs in the log
 * @param low      smallest logged value per numeric setting (only settings some ok run recorded)
 * @param high     largest logged value per numeric setting (same keys as {@code low})
 * @param choices  choices used by ok runs per categorical setting
 * @since 0.1
 */
public record RunRanges(int okRuns, Map<String, Double> low, Map<String, Double> high,
                        Map<String, Set<String>> choices) {

    /** Copies the maps and checks that the two ends belong together. */
    public RunRanges {
        if (okRuns < 0) {
            throw new IllegalArgumentException("okRuns must not be negative");
        }
        low = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(low));
        high = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(high));
        Map<String, Set<String>> c = new LinkedHashMap<>();
        choices.forEach((k, v) -> c.put(k, java.util.Collections.unmodifiableSet(new LinkedHashSet<>(v))));
        choices = java.util.Collections.unmodifiableMap(c);
        if (!low.keySet().equals(high.keySet())) {
            throw new IllegalArgumentException("low and high must name the same settings");
        }
        for (String k : low.keySet()) {
            if (!(low.get(k) <= high.get(k))) {
                throw new IllegalArgumentException(k + ": logged low above logged high");
            }
        }
    }

    /**
     * @param space the design space
     * @param runs  the whole run log
     * @return the ranges of the ok runs; never null
     */
    public static RunRanges of(DesignSpace space, List<Run> runs) {
        Objects.requireNonNull(space, "space");
        int ok = 0;
        Map<String, Double> lo = new LinkedHashMap<>();
        Map<String, Double> hi = new LinkedHashMap<>();
        Map<String, Set<String>> ch = new LinkedHashMap<>();
        for (Run r : runs) {
            if (!r.ok()) {
                continue;
            }
            ok++;
            for (ParameterSpec p : space.continuous()) {
                Double v = r.numbers().get(p.name());
                if (v == null) {
                    continue;
                }
                lo.merge(p.name(), v, Math::min);
                hi.merge(p.name(), v, Math::max);
            }
            for (ParameterSpec p : space.categorical()) {
                String v = r.categories().get(p.name());
                if (v != null) {
                    ch.computeIfAbsent(p.name(), k -> new LinkedHashSet<>()).add(v);
                }
            }
        }
        return new RunRanges(ok, lo, hi, ch);
    }

    /** @return true when the log holds no ok run, so nothing can be compared */
    public boolean empty() {
        return okRuns == 0;
    }

    /**
     * The numeric settings of a recipe outside the logged ranges: value below the smallest or above
     * the largest value any ok run recorded. A setting no ok run recorded is not listed (there is no
     * range to compare with; {@link #notes} says so once).
     *
     * @param space   the design space (for the order of the settings)
     * @param numbers the recipe's numeric settings, campaign units
     * @return the settings beyond the runs, in campaign order; empty when none or when there are no
     *     ok runs; never null
     */
    public Map<String, BeyondRuns> beyond(DesignSpace space, Map<String, Double> numbers) {
        Map<String, BeyondRuns> out = new LinkedHashMap<>();
        for (ParameterSpec p : space.continuous()) {
            Double v = numbers.get(p.name());
            Double a = low.get(p.name());
            Double b = high.get(p.name());
            if (v == null || a == null || b == null) {
                continue;
            }
            if (v < a || v > b) {
                out.put(p.name(), new BeyondRuns(v, a, b));
            }
        }
        return out;
    }

    /**
     * @param space      the design space
     * @param categories the recipe's categorical settings
     * @return one line per categorical setting whose choice no ok run used; never null
     */
    public List<String> untriedChoices(DesignSpace space, Map<String, String> categories) {
        List<String> out = new ArrayList<>();
        if (empty()) {
            return out;
        }
        for (ParameterSpec p : space.categorical()) {
            String v = categories.get(p.name());
            Set<String> seen = choices.getOrDefault(p.name(), Set.of());
            if (v != null && !seen.contains(v)) {
                out.add(p.name() + " " + v + " was never used in an ok run" + (seen.isEmpty() ? ""
                        : " (they used " + String.join(", ", seen) + ")"));
            }
        }
        return out;
    }

    /**
     * @param space the design space
     * @return what the grower should know about the comparison (no ok runs, settings never
     *     recorded); never null
     */
    public List<String> notes(DesignSpace space) {
        List<String> out = new ArrayList<>();
        if (empty()) {
            out.add("no ok run in the log yet: no setting can be compared with the range of the runs");
            return out;
        }
        for (ParameterSpec p : space.continuous()) {
            if (!low.containsKey(p.name())) {
                out.add("no ok run recorded " + p.name() + ": its proposed values are not compared with the runs");
            }
        }
        return out;
    }
}
