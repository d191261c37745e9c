package dev.terrace.core.validate;

import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * The leave-one-out validation of a campaign.
 *
 * @param campaignId the campaign; never null
 * @param outcomes   one entry per validated outcome, in campaign order; copied, never null, empty when
 *                   there were too few runs
 * @param verdict    plain-words findings, most general first; copied, never null
 * @since 0.1
 */
public record ValidationReport(String campaignId, List<OutcomeValidation> outcomes, List<String> verdict) {

    /** Copies the lists. */
    public ValidationReport {
        Objects.requireNonNull(campaignId, "campaignId");
        outcomes = List.copyOf(outcomes);
        verdict = List.copyOf(verdict);
    }

    /**
     * @param name an outcome column
     * @return its validation, if it was validated
     */
    public Optional<OutcomeValidation> outcome(String name) {
        return outcomes.stream().filter(o -> o.outcome().equals(name)).findFirst();
    }
}
