package dev.terrace.core.fit;

import dev.terrace.core.campaign.OutcomeSpec;
import dev.terrace.core.runlog.Censored;

/**
 * One observation: a run's measured outcome on the fitted scale (log10 for {@code scale: log}).
 *
 * @param run     index of the run among the fit's used runs
 * @param outcome the outcome column
 * @param y       the value, or the censoring bound, on the fitted scale; NaN for a class
 * @param cls     the observed class of a class outcome, else null
 * @param side    for a censored value, which side of {@code y} the true value lies on; else null
 */
record Obs(int run, OutcomeSpec outcome, double y, String cls, Censored.Side side) {

    static Obs exact(int run, OutcomeSpec outcome, double y, String cls) {
        return new Obs(run, outcome, y, cls, null);
    }

    static Obs censored(int run, OutcomeSpec outcome, double bound, Censored.Side side) {
        return new Obs(run, outcome, bound, null, side);
    }

    boolean isClass() {
        return cls != null;
    }

    boolean isCensored() {
        return side != null;
    }

    Obs withRun(int index) {
        return new Obs(index, outcome, y, cls, side);
    }

    Obs withValue(double value) {
        return new Obs(run, outcome, value, cls, side);
    }
}
