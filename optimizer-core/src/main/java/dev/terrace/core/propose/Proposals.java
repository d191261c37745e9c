package dev.terrace.core.propose;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;

/**
 * Value types of proposals and rankings.
 *
 * @since 0.1
 */
public final class Proposals {

    private Proposals() {
    }

    /**
     * The predictive distribution of one numeric outcome for one recipe, in the outcome's unit.
     *
     * <p>Values are those of the prediction censored at the outcome's {@link PhysicalRange}: never
     * outside it.
     *
     * @param mean   central value: the median of the prediction (the mean for linear outcomes, 10^mu
     *               for {@code scale: log} outcomes), clipped to the physical range
     * @param sd     standard deviation of a new measurement before censoring (for log outcomes the
     *               delta-method value median·ln(10)·sd_log10)
     * @param lo90   lower end of the 90 % interval of a new measurement, at or above the range's minimum
     * @param hi90   upper end of the 90 % interval, at or below the range's maximum
     * @param inWindow probability that a new measurement lies in the target window (a window reaching
     *                 a physical bound includes the mass beyond it), or -1 when the outcome has no
     *                 window target
     */
    public record NumericPrediction(double mean, double sd, double lo90, double hi90, double inWindow) {
        /** Checks that every value is finite. */
        public NumericPrediction {
            for (double v : new double[] {mean, sd, lo90, hi90, inWindow}) {
                if (!Double.isFinite(v)) {
                    throw new IllegalArgumentException("prediction values must be finite");
                }
            }
        }

        /** @return true when the outcome has a window target */
        public boolean hasWindow() {
            return inWindow >= 0;
        }
    }

    /**
     * A numeric setting of a recipe outside the range of the ok runs.
     *
     * @param value   the recipe's value, campaign unit
     * @param runsMin smallest value an ok run recorded
     * @param runsMax largest value an ok run recorded
     */
    public record BeyondRuns(double value, double runsMin, double runsMax) {
        /** Checks that the values are finite, the range ordered and the value outside it. */
        public BeyondRuns {
            if (!Double.isFinite(value) || !Double.isFinite(runsMin) || !Double.isFinite(runsMax) || runsMin > runsMax) {
                throw new IllegalArgumentException("beyond-runs values must be finite with min <= max");
            }
            if (value >= runsMin && value <= runsMax) {
                throw new IllegalArgumentException("value " + value + " is inside the runs' range");
            }
        }
    }

    /**
     * One proposed or ranked recipe.
     *
     * @param id            stable identifier ("P-" and 8 hex digits of the recipe) to write in the run
     *                      log's {@code proposal} column
     * @param rank          1 = highest predicted yield
     * @param yield         probability that the next run meets every target
     * @param acquisition   the value the search maximised (optimistic yield or constrained EI)
     * @param recipe        numeric settings (rounded, campaign units) and categorical settings
     * @param numeric       predictions per numeric outcome
     * @param classes       class probabilities per class outcome
     * @param success       probability that the run succeeds at all
     * @param nearestRun    the closest logged run, or null when there is none
     * @param nearestDistance its distance in the scaled space (unit cube, +1 per differing choice)
     * @param reason        one line saying why this recipe is proposed
     * @param flags         warnings about the recipe (outside box or limits, model validity, safety)
     * @param insideBox     true when every setting is inside its box
     * @param keepsLimits   true when every limit holds
     * @param beyondRuns    numeric settings outside the range of the ok runs, by name in campaign
     *                      order; empty when none or when the log has no ok run
     */
    public record Proposal(String id, int rank, double yield, double acquisition, Map<String, Object> recipe,
                           Map<String, NumericPrediction> numeric, Map<String, Map<String, Double>> classes,
                           double success, String nearestRun, double nearestDistance, String reason,
                           List<String> flags, boolean insideBox, boolean keepsLimits,
                           Map<String, BeyondRuns> beyondRuns) {
        /** Copies the contents and checks the probabilities. */
        public Proposal {
            Objects.requireNonNull(id);
            recipe = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(recipe));
            numeric = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(numeric));
            classes = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(classes));
            flags = List.copyOf(flags);
            beyondRuns = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(beyondRuns));
            if (!(yield >= 0 && yield <= 1) || !(success >= 0 && success <= 1)) {
                throw new IllegalArgumentException("probabilities out of range in proposal " + id);
            }
        }

        /** @return a copy with a new rank */
        public Proposal withRank(int r) {
            return new Proposal(id, r, yield, acquisition, recipe, numeric, classes, success, nearestRun,
                    nearestDistance, reason, flags, insideBox, keepsLimits, beyondRuns);
        }
    }

    /**
     * A batch of proposals (or a ranking) with what was used to make it.
     *
     * @param campaignId  the campaign
     * @param runsUsed    ok runs used by the surrogates
     * @param seed        the seed
     * @param mode        "search", "space-filling start" or "ranking"
     * @param explore     the exploration weight used
     * @param proposals   ranked proposals
     * @param notes       what the grower should know (exclusions, fallbacks, model problems)
     * @param gpSubsets   numeric outcomes whose Gaussian process trained on a subset of the runs
     *                    (long logs), by name; empty when every GP used every run
     */
    public record ProposalSet(String campaignId, int runsUsed, long seed, String mode, double explore,
                              List<Proposal> proposals, List<String> notes,
                              Map<String, dev.terrace.core.surrogate.TrainingSubset> gpSubsets) {
        /** Copies the lists. */
        public ProposalSet {
            proposals = List.copyOf(proposals);
            notes = List.copyOf(notes);
            gpSubsets = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(gpSubsets));
        }

        /** A set whose GPs all used every run. */
        public ProposalSet(String campaignId, int runsUsed, long seed, String mode, double explore,
                           List<Proposal> proposals, List<String> notes) {
            this(campaignId, runsUsed, seed, mode, explore, proposals, notes, Map.of());
        }
    }
}
