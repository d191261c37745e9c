package dev.terrace.spi;

import java.util.Objects;

/**
 * Whether a model's prediction applies to a recipe, and why not when it does not.
 *
 * @param valid  true when the model's assumptions hold for the recipe
 * @param reason why the prediction does not apply; empty when valid, never null
 * @since 0.1
 */
public record Validity(boolean valid, String reason) {

    private static final Validity VALID = new Validity(true, "");

    /** Checks the invariants. */
    public Validity {
        Objects.requireNonNull(reason, "reason");
        if (!valid && reason.isBlank()) {
            throw new IllegalArgumentException("an invalid prediction must say why");
        }
    }

    /** @return the valid marker; never null */
    public static Validity ok() {
        return VALID;
    }

    /**
     * @param reason why the model does not apply, in words a grower understands
     * @return an invalid marker; never null
     */
    public static Validity outside(String reason) {
        return new Validity(false, reason);
    }
}
