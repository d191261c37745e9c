package dev.terrace.core.journal;

import dev.terrace.core.propose.Proposals.NumericPrediction;
import dev.terrace.core.propose.Proposals.Proposal;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Objects;

/**
 * One proposed recipe as the journal keeps it: what was proposed and what was predicted for it.
 *
 * @param id        the proposal id ({@code P-} and 8 hex digits) the grower writes in the run log's
 *                  {@code proposal} column; never blank
 * @param rank      its rank in the batch, 1 = highest predicted yield; positive
 * @param yield     predicted probability that a run meets every target, 0 to 1
 * @param recipe    settings by name in campaign order: {@link Double} for numeric settings (campaign
 *                  units), {@link String} for choices; copied, never null
 * @param predicted predictions per numeric outcome, campaign units; copied, never null
 * @param classes   class probabilities per class outcome; copied, never null
 * @since 0.2
 */
public record JournalProposal(String id, int rank, double yield, Map<String, Object> recipe,
                              Map<String, Predicted> predicted, Map<String, Map<String, Double>> classes) {

    /**
     * A numeric outcome's prediction: central value, sd of a new measurement and its 90 % interval.
     *
     * @param mean the central value (for log outcomes the median); finite
     * @param sd   standard deviation of a new measurement; finite, not negative
     * @param lo90 lower end of the 90 % interval; finite
     * @param hi90 upper end of the 90 % interval; finite, not below {@code lo90}
     */
    public record Predicted(double mean, double sd, double lo90, double hi90) {
        /** Checks the invariants. */
        public Predicted {
            if (!Double.isFinite(mean) || !Double.isFinite(sd) || !Double.isFinite(lo90) || !Double.isFinite(hi90)) {
                throw new IllegalArgumentException("predictions must be finite");
            }
            if (sd < 0 || lo90 > hi90) {
                throw new IllegalArgumentException("need sd >= 0 and lo90 <= hi90");
            }
        }

        /**
         * @param value a measured value
         * @return true when it lies in the 90 % interval
         */
        public boolean covers(double value) {
            return value >= lo90 && value <= hi90;
        }
    }

    /** Checks the invariants and copies the maps. */
    public JournalProposal {
        Objects.requireNonNull(id, "id");
        if (id.isBlank()) {
            throw new IllegalArgumentException("blank proposal id");
        }
        if (rank < 1) {
            throw new IllegalArgumentException("rank must be positive, got " + rank);
        }
        if (!(yield >= 0 && yield <= 1)) {
            throw new IllegalArgumentException("yield must be 0 to 1, got " + yield);
        }
        Map<String, Object> r = new LinkedHashMap<>();
        recipe.forEach((k, v) -> {
            if (!(v instanceof Double || v instanceof String)) {
                throw new IllegalArgumentException("setting " + k + " must be a number or a choice, got " + v);
            }
            if (v instanceof Double d && !Double.isFinite(d)) {
                throw new IllegalArgumentException("setting " + k + " must be finite, got " + v);
            }
            r.put(k, v);
        });
        recipe = Collections.unmodifiableMap(r);
        predicted = Collections.unmodifiableMap(new LinkedHashMap<>(predicted));
        Map<String, Map<String, Double>> cl = new LinkedHashMap<>();
        classes.forEach((k, v) -> cl.put(k, Collections.unmodifiableMap(new LinkedHashMap<>(v))));
        classes = Collections.unmodifiableMap(cl);
    }

    /**
     * The journal's view of a proposal: its recipe, yield and predictions; the reason, flags and
     * nearest run are left out (they are in the printed output and follow from the rest).
     *
     * @param p a proposal; never null
     * @return the journal record; never null
     */
    public static JournalProposal of(Proposal p) {
        Objects.requireNonNull(p, "p");
        Map<String, Predicted> pred = new LinkedHashMap<>();
        for (Map.Entry<String, NumericPrediction> e : p.numeric().entrySet()) {
            NumericPrediction n = e.getValue();
            pred.put(e.getKey(), new Predicted(n.mean(), n.sd(), n.lo90(), n.hi90()));
        }
        Map<String, Object> recipe = new LinkedHashMap<>();
        p.recipe().forEach((k, v) -> recipe.put(k, v instanceof Number ? (Object) ((Number) v).doubleValue()
                : String.valueOf(v)));
        return new JournalProposal(p.id(), p.rank(), p.yield(), recipe, pred, p.classes());
    }
}
