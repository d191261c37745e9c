package dev.terrace.core.validate;

import java.util.Objects;

/**
 * One held-out prediction of a numeric outcome, in the outcome's campaign unit (for {@code scale:
 * log} outcomes the log10 prediction and interval are mapped back with 10^x, so {@code predicted}
 * is the predictive median).
 *
 * @param surrogate "physics", "gp" or "physics+gp"; never blank
 * @param runId     the held-out run; never blank
 * @param measured  its measured value; finite
 * @param predicted the prediction from the other runs; finite
 * @param lo90      lower end of the central 90 % interval of a new measurement; finite, at most predicted
 * @param hi90      upper end; finite, at least predicted
 * @since 0.1
 */
public record ParityPoint(String surrogate, String runId, double measured, double predicted, double lo90,
                          double hi90) {

    /** Checks the invariants. */
    public ParityPoint {
        Objects.requireNonNull(surrogate, "surrogate");
        Objects.requireNonNull(runId, "runId");
        if (surrogate.isBlank() || runId.isBlank()) {
            throw new IllegalArgumentException("blank surrogate or run id");
        }
        if (!Double.isFinite(measured) || !Double.isFinite(predicted) || !Double.isFinite(lo90)
                || !Double.isFinite(hi90)) {
            throw new IllegalArgumentException("parity point of run " + runId + " is not finite");
        }
        if (!(lo90 <= predicted && predicted <= hi90)) {
            throw new IllegalArgumentException("interval of run " + runId + " does not hold its prediction");
        }
    }

    /** @return true when the measured value lies inside the 90 % interval */
    public boolean inside() {
        return lo90 <= measured && measured <= hi90;
    }
}
