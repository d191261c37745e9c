package dev.terrace.spi;

import java.util.Objects;

/**
 * Whether a model's prediction applies to a recipe, and why not when it does not.
 *
 * <p>An invalid prediction says whether the reason depends on the parameter values. A recipe that
 * lacks an input, deposits a metal below its melting point or supplies no flux is
 * {@linkplain #notApplicable(String) not applicable} whatever the parameters: the fitter leaves such
 * a run out before it fits. A recipe that is {@linkplain #outside(String) outside} the model's
 * assumptions only at the current parameter values (too few adatom hops per monolayer at this
 * diffusion barrier, for example) stays in the fit, because the run may show that the values are
 * wrong; the fitter decides at the fitted values.
 *
 * @param valid               true when the model's assumptions hold for the recipe
 * @param reason              why the prediction does not apply; empty when valid, never null
 * @param dependsOnParameters true when an invalid prediction could become valid at other parameter
 *                            values; false when valid
 * @since 0.1
 */
public record Validity(boolean valid, String reason, boolean dependsOnParameters) {

    private static final Validity VALID = new Validity(true, "", false);

    /** Checks the invariants. */
    public Validity {
        Objects.requireNonNull(reason, "reason");
        if (!valid && reason.isBlank()) {
            throw new IllegalArgumentException("an invalid prediction must say why");
        }
        if (valid && dependsOnParameters) {
            throw new IllegalArgumentException("a valid prediction has no parameter-dependent reason");
        }
    }

    /**
     * A validity whose invalid reason is taken to depend on the parameters (the cautious reading).
     *
     * @param valid  true when the model's assumptions hold
     * @param reason why not; empty when valid
     * @since 0.1
     */
    public Validity(boolean valid, String reason) {
        this(valid, reason, !valid);
    }

    /** @return the valid marker; never null */
    public static Validity ok() {
        return VALID;
    }

    /**
     * @param reason why the model's assumptions fail at the current parameter values, in words a
     *               grower understands
     * @return an invalid marker that depends on the parameters; never null
     */
    public static Validity outside(String reason) {
        return new Validity(false, reason, true);
    }

    /**
     * @param reason why the model cannot apply to this recipe whatever its parameter values (a missing
     *               input, a solid deposit, no flux), in words a grower understands
     * @return an invalid marker that does not depend on the parameters; never null
     * @since 0.2
     */
    public static Validity notApplicable(String reason) {
        return new Validity(false, reason, false);
    }
}
