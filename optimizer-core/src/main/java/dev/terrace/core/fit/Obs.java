package dev.terrace.core.fit;

import dev.terrace.core.campaign.OutcomeSpec;

/** One observation: a run's measured outcome, on the fitted scale. */
record Obs(int run, OutcomeSpec outcome, double y, String cls) {
    boolean isClass() {
        return cls != null;
    }
}
