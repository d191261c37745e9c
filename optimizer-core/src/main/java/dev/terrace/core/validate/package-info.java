/**
 * Leave-one-out validation of a campaign's surrogates: each ok run with a measured outcome is
 * held out in turn, the surrogates are refitted to the rest, and the held-out measurement is
 * scored against the prediction.
 *
 * <p>{@link dev.terrace.core.validate.Validation#run} returns a
 * {@link dev.terrace.core.validate.ValidationReport}: per outcome a
 * {@link dev.terrace.core.validate.Score} for each surrogate ("physics", "gp", "physics+gp" and the
 * trivial "mean" predictor), the held-out predictions as
 * {@link dev.terrace.core.validate.ParityPoint}s, and a plain-words verdict.
 *
 * @since 0.1
 */
package dev.terrace.core.validate;
