package dev.terrace.core.validate;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;

/**
 * The leave-one-out scores of one outcome.
 *
 * @param outcome     the outcome column; never blank
 * @param scale       "log10", "linear" or "class": the scale the numeric metrics are on
 * @param bySurrogate scores by surrogate, in the order "physics", "gp", "physics+gp", then the trivial
 *                    predictor under {@link Validation#MEAN}; a surrogate that could not predict the
 *                    outcome (no growth model for it, say) is absent; copied, order kept, never null
 * @param parity      held-out predictions of the three surrogates (numeric outcomes only, empty for
 *                    classes), in campaign units; copied, never null
 * @param proposalVerdict the verdict on the proposal surrogate ({@link Validation#PROPOSAL}) for this
 *                    outcome, in plain words; never null, empty when it was not judged
 * @since 0.1
 */
public record OutcomeValidation(String outcome, String scale, Map<String, Score> bySurrogate,
                                List<ParityPoint> parity, String proposalVerdict) {

    private static final Set<String> SCALES = Set.of("log10", "linear", "class");

    /** Scores without a verdict on the proposal surrogate. */
    public OutcomeValidation(String outcome, String scale, Map<String, Score> bySurrogate, List<ParityPoint> parity) {
        this(outcome, scale, bySurrogate, parity, "");
    }

    /** Copies and checks the contents. */
    public OutcomeValidation {
        Objects.requireNonNull(outcome, "outcome");
        Objects.requireNonNull(proposalVerdict, "proposalVerdict");
        if (outcome.isBlank()) {
            throw new IllegalArgumentException("blank outcome");
        }
        if (!SCALES.contains(scale)) {
            throw new IllegalArgumentException("scale must be log10, linear or class, found " + scale);
        }
        boolean cls = scale.equals("class");
        for (Map.Entry<String, Score> e : bySurrogate.entrySet()) {
            Objects.requireNonNull(e.getKey());
            if (e.getValue().forClasses() != cls) {
                throw new IllegalArgumentException("score of " + e.getKey() + " on " + outcome
                        + " is of the wrong kind for scale " + scale);
            }
        }
        bySurrogate = Collections.unmodifiableMap(new LinkedHashMap<>(bySurrogate));
        parity = List.copyOf(parity);
        if (cls && !parity.isEmpty()) {
            throw new IllegalArgumentException("class outcome " + outcome + " has no parity points");
        }
    }

    /**
     * @param surrogate a surrogate key
     * @return its score, if it predicted this outcome
     */
    public Optional<Score> score(String surrogate) {
        return Optional.ofNullable(bySurrogate.get(surrogate));
    }

    /**
     * @param surrogate a surrogate key
     * @return its held-out predictions in log order; never null, possibly empty
     */
    public List<ParityPoint> parity(String surrogate) {
        return parity.stream().filter(p -> p.surrogate().equals(surrogate)).toList();
    }

    /** @return true for a class outcome */
    public boolean forClasses() {
        return scale.equals("class");
    }
}
